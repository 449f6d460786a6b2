/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-design.h"
#include "trb-section.h"

G_BEGIN_DECLS

/* Steel design to ANSI/AISC 360-16, ASD and LRFD: flexure about the major axis of doubly
 * symmetric I shapes (W and S; Chapter F, sections F2 and F3), shear of their webs (G2.1),
 * and the shared deflection checks. Everything SI. */

/* A structural steel: ASTM grade, minimum yield and tensile stresses, moduli (Pa). */
typedef struct
{
  const char *name;    /* "A992", "A36", "A572 Gr 50" */
  double      Fy;
  double      Fu;
  double      E;
  double      G;
  const char *source;
} TrbSteelGrade;

/* The nominal flexural strength of one unbraced segment and what governs it. */
typedef struct
{
  double      Mn;        /* N*m, nominal strength */
  double      Mp;        /* N*m, plastic moment Fy Zx (F2-1) */
  double      Lp;        /* m, limiting unbraced length for yielding (F2-5) */
  double      Lr;        /* m, limiting unbraced length for inelastic buckling (F2-6) */
  double      Lb;        /* m, the unbraced length used */
  double      Cb;        /* the moment gradient factor used */
  double      lambda_f;  /* bf / 2tf */
  const char *equation;  /* the governing equation: "F2-1", "F2-2", "F2-3", "F3-1", "F3-2" */
} TrbSteelFlexure;

/* The nominal shear strength of the web (G2.1) and its resistance factors. */
typedef struct
{
  double      Vn;         /* N, 0.6 Fy Aw Cv1 (G2-1) */
  double      Aw;         /* m^2, d tw */
  double      h_tw;
  double      Cv1;
  double      phi;        /* 1.00 under G2.1(a), else 0.90 */
  double      omega;      /* 1.50 under G2.1(a), else 1.67 */
  const char *provision;  /* "G2.1(a)", "G2.1(b), Eq. G2-3" or "G2.1(b), Eq. G2-4" */
} TrbSteelShear;

#define TRB_STEEL_PHI_B   0.90
#define TRB_STEEL_OMEGA_B 1.67

const TrbSteelGrade *trb_design_steel_get_grades   (guint                 *n_grades);
const TrbSteelGrade *trb_design_steel_lookup_grade (const char            *name);

/* The doubly symmetric I shapes this module designs (W, S, and custom I sections with every
 * property it needs). */
gboolean             trb_design_steel_covers       (const TrbSection      *section);

double               trb_design_steel_rts          (const TrbSection      *section);
double               trb_design_steel_lp           (const TrbSection      *section,
                                                    const TrbSteelGrade   *grade);
double               trb_design_steel_lr           (const TrbSection      *section,
                                                    const TrbSteelGrade   *grade);
double               trb_design_steel_mp           (const TrbSection      *section,
                                                    const TrbSteelGrade   *grade);
double               trb_design_steel_cb           (double                 m_max,
                                                    double                 m_a,
                                                    double                 m_b,
                                                    double                 m_c);
gboolean             trb_design_steel_flexure      (const TrbSection      *section,
                                                    const TrbSteelGrade   *grade,
                                                    double                 Lb,
                                                    double                 Cb,
                                                    TrbSteelFlexure       *out);
/* What trb_design_steel_flexure() computes of a section and grade whatever Lb and Cb. */
typedef struct
{
  gboolean    ok;        /* F2 or F3 covers the section */
  double      E, Sx, rts, jc, lambda_f;
  double      Mp, My70, Lp, Lr;
  gboolean    flb;       /* flanges not compact: F3 */
  double      Mflb;
  const char *eq_flb;
} TrbSteelFlexurePrep;

gboolean             trb_design_steel_flexure_prepare (const TrbSection    *section,
                                                       const TrbSteelGrade *grade,
                                                       TrbSteelFlexurePrep *prep);
gboolean             trb_design_steel_flexure_at   (const TrbSteelFlexurePrep *prep,
                                                    double                 Lb,
                                                    double                 Cb,
                                                    TrbSteelFlexure       *out);
gboolean             trb_design_steel_shear        (const TrbSection      *section,
                                                    const TrbSteelGrade   *grade,
                                                    TrbSteelShear         *out);

gboolean             trb_design_steel_check        (const TrbDesignInput  *input,
                                                    const TrbSteelGrade   *grade,
                                                    TrbDesignBasis         basis,
                                                    GArray                *checks);

G_END_DECLS
