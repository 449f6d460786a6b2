/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include "trb-window.h"

G_BEGIN_DECLS

/* The plan in words, for screen readers: its accessible label names the floor, its
 * description counts the members and those failing and names the selection with its status,
 * so that status never rests on colour alone. */

char  *trb_plan_a11y_describe  (TrbDocument  *document,
                                TrbMember    *selected);
void   trb_plan_a11y_attach    (TrbWindow    *window);

G_END_DECLS
