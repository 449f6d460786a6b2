/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-catalog.h"
#include "trb-design.h"
#include "trb-section.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* Timber design by NDS 2018, allowable stress design (ASD), for sawn lumber (dimension lumber
 * and timbers, single or built up of plies) and structural glued laminated timber bent about
 * its strong axis, on edge. Every value here is SI (Pa, m, N); the clauses are quoted in
 * docs/design-methods.md, "Timber (NDS 2018)". */

/* The reference design values an adjustment factor applies to (NDS 2018 Table 4.3.1). */
typedef enum
{
  TRB_WOOD_FB,       /* bending */
  TRB_WOOD_FT,       /* tension parallel to grain */
  TRB_WOOD_FV,       /* shear parallel to grain */
  TRB_WOOD_FC_PERP,  /* compression perpendicular to grain (bearing) */
  TRB_WOOD_FC,       /* compression parallel to grain */
  TRB_WOOD_E,        /* modulus of elasticity */
  TRB_WOOD_EMIN,     /* modulus of elasticity for stability */
} TrbWoodProperty;

/* The service conditions of one member. The temperature factor C_t is 1.0 throughout (members
 * in service at 100 F or less, NDS 2018 Table 2.3.3) and is not varied; members bend on edge
 * (C_fu = 1); flat use is not offered. */
typedef struct
{
  gboolean wet_service;         /* moisture content in service above 19 % (sawn) or 16 %
                                 * (glulam): the wet service factors C_M apply */
  gboolean incised;             /* sawn lumber incised for preservative treatment: C_i */
  double   repetitive_spacing;  /* m: centre-to-centre spacing when the member is one of three or
                                 * more like members joined by sheathing or decking; 0 when it
                                 * is not in such a run (C_r, NDS 2018 4.3.9) */
  double   bearing_length;      /* m, at every support, along the member; default 3.5 in */
  gboolean shear_at_d;          /* the member bears on its supports and is loaded on its top
                                 * face, so shear may be taken at d from the supports (NDS 2018
                                 * 3.4.3.1); FALSE for members hung in hangers */
} TrbWoodOptions;

void     trb_design_wood_options_init      (TrbWoodOptions       *options);

double   trb_design_wood_cd                (const double         *factors);
double   trb_design_wood_cm                (const TrbSection     *section,
                                            const TrbWoodGrade   *grade,
                                            TrbWoodProperty       property,
                                            gboolean              wet_service);
double   trb_design_wood_cf                (const TrbSection     *section,
                                            const TrbWoodGrade   *grade,
                                            TrbWoodProperty       property);
double   trb_design_wood_ci                (const TrbSection     *section,
                                            TrbWoodProperty       property,
                                            gboolean              incised);
double   trb_design_wood_cr                (const TrbSection     *section,
                                            const TrbWoodOptions *options);
double   trb_design_wood_effective_length  (double                lu,
                                            double                d);
double   trb_design_wood_cl                (double                Fb_star,
                                            double                Emin_adj,
                                            double                le,
                                            double                b,
                                            double                d,
                                            double               *RB,
                                            double               *FbE);
double   trb_design_wood_cv                (const TrbSection     *section,
                                            const TrbWoodGrade   *grade,
                                            double                length);
double   trb_design_wood_cb                (double                bearing_length,
                                            gboolean              near_end);
double   trb_design_wood_required_bearing  (double                reaction,
                                            double                b,
                                            double                Fc_perp_adj,
                                            gboolean              near_end);
double   trb_design_wood_adjusted_e        (const TrbSection     *section,
                                            const TrbWoodGrade   *grade,
                                            const TrbWoodOptions *options,
                                            TrbWoodProperty       property);

void     trb_design_wood_check             (const TrbDesignInput *input,
                                            const TrbWoodGrade   *grade,
                                            const TrbWoodOptions *options,
                                            GArray               *checks);

G_END_DECLS
