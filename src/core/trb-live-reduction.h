/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Reduction of uniform live loads, ASCE 7-16 §4.7 (floors) and §4.8.2 (ordinary roofs), from
 * memory. The equations are in US units (A_T in ft^2, loads in psf); the functions take and
 * give SI and convert exactly (1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N). The rules are in
 * docs/framing.md. */

/* The rows of Table 4.7-1, which set the live load element factor K_LL. */
typedef enum
{
  TRB_LIVE_MEMBER_INTERIOR_COLUMN,              /* 4 */
  TRB_LIVE_MEMBER_EXTERIOR_COLUMN,              /* 4: without cantilever slabs */
  TRB_LIVE_MEMBER_EDGE_COLUMN_CANTILEVER,       /* 3: edge column with cantilever slabs */
  TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER,     /* 2: corner column with cantilever slabs */
  TRB_LIVE_MEMBER_EDGE_BEAM,                    /* 2: without cantilever slabs */
  TRB_LIVE_MEMBER_INTERIOR_BEAM,                /* 2 */
  TRB_LIVE_MEMBER_OTHER,                        /* 1: edge beams with cantilever slabs,
                                                 * cantilever beams, one-way and two-way slabs,
                                                 * members without continuous shear transfer
                                                 * normal to their span, all others */
} TrbLiveMember;

typedef enum
{
  TRB_LIVE_OCCUPANCY_ORDINARY,
  TRB_LIVE_OCCUPANCY_GARAGE,     /* passenger vehicle garages, §4.7.4 */
  TRB_LIVE_OCCUPANCY_ASSEMBLY,   /* assembly uses, §4.7.5 */
} TrbLiveOccupancy;

/* Which rule set the reduced load. */
typedef enum
{
  TRB_LIVE_RULE_SMALL_AREA,        /* K_LL A_T < 400 ft^2: not reduced (§4.7.2) */
  TRB_LIVE_RULE_EQUATION,          /* Eq. 4.7-1 */
  TRB_LIVE_RULE_ONE_FLOOR_LIMIT,   /* not below 0.50 Lo, one floor (§4.7.2) */
  TRB_LIVE_RULE_FLOORS_LIMIT,      /* not below 0.40 Lo, two or more floors (§4.7.2) */
  TRB_LIVE_RULE_HEAVY,             /* Lo > 100 psf: not reduced (§4.7.3) */
  TRB_LIVE_RULE_HEAVY_FLOORS,      /* Lo > 100 psf, two or more floors: 20 % at most (§4.7.3) */
  TRB_LIVE_RULE_GARAGE,            /* passenger vehicle garage: not reduced (§4.7.4) */
  TRB_LIVE_RULE_GARAGE_FLOORS,     /* garage, two or more floors: 20 % at most (§4.7.4) */
  TRB_LIVE_RULE_ASSEMBLY,          /* assembly, Lo <= 100 psf: not reduced (§4.7.5) */
  TRB_LIVE_RULE_ROOF_SMALL,        /* R1 R2 = 1: not reduced (Eq. 4.8-1) */
  TRB_LIVE_RULE_ROOF_EQUATION,     /* Lr = Lo R1 R2 (Eq. 4.8-1) */
  TRB_LIVE_RULE_ROOF_MINIMUM,      /* not below 12 psf (§4.8.2) */
} TrbLiveRule;

typedef struct
{
  double      factor;  /* L / Lo */
  double      L;       /* the reduced load, Pa */
  TrbLiveRule rule;
  double      k_ll;    /* Table 4.7-1; 0 for roofs */
  double      R1;      /* Eq. 4.8-2; 1 for floors */
  double      R2;      /* Eq. 4.8-3; 1 for floors */
} TrbLiveReduction;

double       trb_live_k_ll               (TrbLiveMember        member);
const char  *trb_live_rule_describe      (TrbLiveRule          rule);

gboolean     trb_live_reduction_floor    (double               Lo,
                                          double               area,
                                          TrbLiveMember        member,
                                          guint                floors,
                                          TrbLiveOccupancy     occupancy,
                                          TrbLiveReduction    *out,
                                          GError             **error);
gboolean     trb_live_reduction_roof     (double               Lo,
                                          double               area,
                                          double               slope,
                                          TrbLiveReduction    *out,
                                          GError             **error);

G_END_DECLS
