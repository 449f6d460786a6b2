/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-error.h"

G_DEFINE_QUARK (trb-error-quark, trb_error)
