/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

#define TRB_ERROR (trb_error_quark ())

typedef enum
{
  TRB_ERROR_PARSE,        /* malformed text or XML */
  TRB_ERROR_UNIT,         /* missing, unknown or wrong-dimension unit; NaN, Inf, junk */
  TRB_ERROR_INVALID,      /* well-formed but meaningless input (negative length, load off the member) */
  TRB_ERROR_UNSTABLE,     /* the member is a mechanism */
  TRB_ERROR_NEWER_FORMAT, /* made by a newer version */
  TRB_ERROR_IO,           /* reading or writing a file */
  TRB_ERROR_NOT_FOUND,    /* unknown section, species, member id */
} TrbError;

GQuark trb_error_quark (void);

G_END_DECLS
