/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-types.h"
#include "trb-units.h"

G_BEGIN_DECLS

/* One check of one section, as every design method reports it. Demand and capacity are SI
 * (dimension tells which); ratio = demand / capacity; a ratio above 1 fails. */
typedef struct
{
  char         name[40];         /* "Flexure", "Shear", "Live deflection", ... */
  char         clause[48];       /* "AISC 360-16 Eq. F2-2", "NDS 2018 3.3", "IBC Table 1604.3" */
  TrbDimension dimension;        /* of demand and capacity */
  double       demand;
  double       capacity;
  double       ratio;
  char         combination[64];  /* the governing combination's name */
  double       x;                /* where it governs, m from the left end */
  char         detail[96];       /* the inputs that explain it: "Lb = 8.00 ft, Cb = 1.00" */
} TrbCheck;

void trb_check_set (TrbCheck     *check,
                    const char   *name,
                    const char   *clause,
                    TrbDimension  dimension,
                    double        demand,
                    double        capacity,
                    const char   *combination,
                    double        x);

G_END_DECLS
