/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-design-wood.h"

#include "trb-beam.h"
#include "trb-units.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

/* Temperature factor: members in service at 100 F or less (NDS 2018 Table 2.3.3). */
#define WOOD_CT 1.0

/* Flat-use factor: members bend on edge. */
#define WOOD_CFU 1.0

/* Positions closer than this are the same point (supports, braces). */
#define X_TOL 1e-9

typedef enum
{
  WOOD_DIMENSION,  /* sawn, 2 to 4 in nominal thickness per ply */
  WOOD_TIMBER,     /* sawn, 5 in nominal and thicker: Beams and Stringers, Posts and Timbers */
  WOOD_GLULAM,
} WoodClass;

static gboolean
contains_nocase (const char *haystack,
                 const char *needle)
{
  g_autofree char *h = g_ascii_strdown (haystack, -1);
  g_autofree char *n = g_ascii_strdown (needle, -1);

  return strstr (h, n) != NULL;
}

static gboolean
is_southern_pine (const TrbWoodGrade *grade)
{
  return grade != NULL && contains_nocase (grade->species, "southern pine");
}

static double
ply_thickness (const TrbSection *section)
{
  return section->b / MAX (section->plies, 1);
}

static WoodClass
wood_class (const TrbSection   *section,
            const TrbWoodGrade *grade)
{
  if (section->kind == TRB_SHAPE_GLULAM ||
      (grade != NULL && g_strcmp0 (grade->size_class, "glulam") == 0))
    return WOOD_GLULAM;
  if (g_strcmp0 (section->size_class, "dimension") == 0)
    return WOOD_DIMENSION;
  if (g_strcmp0 (section->size_class, "beams_and_stringers") == 0 ||
      g_strcmp0 (section->size_class, "posts_and_timbers") == 0)
    return WOOD_TIMBER;
  /* Sections without a size class (custom): dimension lumber is 3.5 in or less dressed,
   * timbers 4.5 in or more (NDS Supplement 2018 Tables 1A/1B, from memory). */
  return ply_thickness (section) <= 4.0 * TRB_IN ? WOOD_DIMENSION : WOOD_TIMBER;
}

/* The nominal width (depth on edge) in inches that Table 4A is read by. */
static double
nominal_width_in (const TrbSection *section)
{
  double d_in;

  if (isfinite (section->nominal_d_in) && section->nominal_d_in > 0)
    return section->nominal_d_in;

  /* Dressed sizes: nominal less 1/2 in up to 6 in, less 3/4 in above (NDS Supplement 2018
   * Table 1B, from memory). */
  d_in = section->d / TRB_IN;
  return round (d_in <= 6.0 ? d_in + 0.5 : d_in + 0.75);
}

/* The column of Table 4A's size-factor rows for a nominal width. */
static int
width_band (double width_in)
{
  static const double upper[] = { 4, 5, 6, 8, 10, 12 };

  for (guint i = 0; i < G_N_ELEMENTS (upper); i++)
    if (width_in <= upper[i] + 0.01)
      return i;
  return G_N_ELEMENTS (upper);
}

/**
 * trb_design_wood_options_init:
 * @options: the options to fill
 *
 * Dry service, not incised, not a repetitive member, 3.5 in bearing (a 2x4 wall plate or a
 * 4 in nominal post), shear taken at d from the supports.
 */
void
trb_design_wood_options_init (TrbWoodOptions *options)
{
  g_return_if_fail (options != NULL);

  memset (options, 0, sizeof *options);
  options->wet_service = FALSE;
  options->incised = FALSE;
  options->repetitive_spacing = 0;
  options->bearing_length = 3.5 * TRB_IN;
  options->shear_at_d = TRUE;
}

/**
 * trb_design_wood_cd:
 * @factors: the combination's case factors, TRB_N_CASES of them
 *
 * The load duration factor of a combination (NDS 2018 Table 2.3.2): that of the shortest
 * load present, a case being present when its factor is not zero. Dead load (permanent) 0.9,
 * floor live (ten years) 1.0, snow (two months) 1.15, roof live (seven days) 1.25.
 *
 * Returns: C_D; 0.9 when no case is present.
 */
double
trb_design_wood_cd (const double *factors)
{
  static const double cd[TRB_N_CASES] = {
    [TRB_CASE_D] = 0.9,
    [TRB_CASE_L] = 1.0,
    [TRB_CASE_LR] = 1.25,
    [TRB_CASE_S] = 1.15,
  };
  double result = 0.9;

  g_return_val_if_fail (factors != NULL, 0.9);

  for (int i = 0; i < TRB_N_CASES; i++)
    if (factors[i] != 0)
      result = MAX (result, cd[i]);
  return result;
}

/**
 * trb_design_wood_cf:
 * @section: a sawn or glulam section
 * @grade: its grade (for the Southern Pine rule)
 * @property: TRB_WOOD_FB, TRB_WOOD_FT or TRB_WOOD_FC; 1 for the others
 *
 * The size factor. Dimension lumber: NDS Supplement 2018 Table 4A by nominal width and
 * thickness; Southern Pine (Table 4B, values already width-specific): 1.1 on Fb for 4 in
 * thick and 8 in or wider, times 0.9 on Fb, Ft and Fc over 12 in wide. Timbers (Table 4D):
 * (12/d)^(1/9) on Fb where d > 12 in. Glulam: 1 (the volume factor takes its place).
 *
 * Returns: C_F
 */
double
trb_design_wood_cf (const TrbSection   *section,
                    const TrbWoodGrade *grade,
                    TrbWoodProperty     property)
{
  static const double fb_2_3[] = { 1.5, 1.4, 1.3, 1.2, 1.1, 1.0, 0.9 };
  static const double fb_4[] = { 1.5, 1.4, 1.3, 1.3, 1.2, 1.1, 1.0 };
  static const double ft[] = { 1.5, 1.4, 1.3, 1.2, 1.1, 1.0, 0.9 };
  static const double fc[] = { 1.15, 1.1, 1.1, 1.05, 1.0, 1.0, 0.9 };
  double width;
  gboolean four_thick;

  g_return_val_if_fail (section != NULL, 1.0);

  switch (wood_class (section, grade))
    {
    case WOOD_GLULAM:
      return 1.0;

    case WOOD_TIMBER:
      if (property == TRB_WOOD_FB && section->d > 12.0 * TRB_IN)
        return pow (12.0 * TRB_IN / section->d, 1.0 / 9.0);
      return 1.0;

    case WOOD_DIMENSION:
    default:
      break;
    }

  if (property != TRB_WOOD_FB && property != TRB_WOOD_FT && property != TRB_WOOD_FC)
    return 1.0;

  width = nominal_width_in (section);
  /* 4 in nominal is 3.5 in dressed; 2 and 3 in are 1.5 and 2.5 in. */
  four_thick = ply_thickness (section) > 3.0 * TRB_IN;

  if (is_southern_pine (grade))
    {
      double cf = 1.0;

      if (property == TRB_WOOD_FB && four_thick && width >= 8.0 - 0.01)
        cf *= 1.1;
      if (width > 12.0 + 0.01)
        cf *= 0.9;
      return cf;
    }

  switch (property)
    {
    case TRB_WOOD_FB:
      return four_thick ? fb_4[width_band (width)] : fb_2_3[width_band (width)];
    case TRB_WOOD_FT:
      return ft[width_band (width)];
    case TRB_WOOD_FC:
      return fc[width_band (width)];
    case TRB_WOOD_FV:
    case TRB_WOOD_FC_PERP:
    case TRB_WOOD_E:
    case TRB_WOOD_EMIN:
    default:
      return 1.0;
    }
}

/**
 * trb_design_wood_cm:
 * @section: a sawn or glulam section
 * @grade: its grade
 * @property: the design value
 * @wet_service: whether the member is wet in service
 *
 * The wet service factor. Dimension lumber (NDS Supplement 2018 Tables 4A/4B footnotes):
 * Fb 0.85 (1.0 where Fb C_F <= 1150 psi), Ft 1.0, Fv 0.97, Fc_perp 0.67, Fc 0.8 (1.0 where
 * Fc C_F <= 750 psi), E and Emin 0.9. Timbers (Table 4D): Fc_perp 0.67, Fc 0.91, others 1.0.
 * Glulam (Table 5A): Fb 0.8, Ft 0.8, Fv 0.875, Fc_perp 0.53, Fc 0.73, E and Emin 0.833.
 *
 * Returns: C_M; 1 in dry service
 */
double
trb_design_wood_cm (const TrbSection   *section,
                    const TrbWoodGrade *grade,
                    TrbWoodProperty     property,
                    gboolean            wet_service)
{
  g_return_val_if_fail (section != NULL, 1.0);

  if (!wet_service)
    return 1.0;

  switch (wood_class (section, grade))
    {
    case WOOD_GLULAM:
      switch (property)
        {
        case TRB_WOOD_FB: return 0.8;
        case TRB_WOOD_FT: return 0.8;
        case TRB_WOOD_FV: return 0.875;
        case TRB_WOOD_FC_PERP: return 0.53;
        case TRB_WOOD_FC: return 0.73;
        case TRB_WOOD_E:
        case TRB_WOOD_EMIN:
        default: return 0.833;
        }

    case WOOD_TIMBER:
      switch (property)
        {
        case TRB_WOOD_FC_PERP: return 0.67;
        case TRB_WOOD_FC: return 0.91;
        case TRB_WOOD_FB:
        case TRB_WOOD_FT:
        case TRB_WOOD_FV:
        case TRB_WOOD_E:
        case TRB_WOOD_EMIN:
        default: return 1.0;
        }

    case WOOD_DIMENSION:
    default:
      switch (property)
        {
        case TRB_WOOD_FB:
          /* The small allowance (1e-9) keeps a value that is exactly 1150 psi in psi from
           * falling the wrong side through unit conversion. */
          g_return_val_if_fail (grade != NULL, 0.85);
          return grade->Fb * trb_design_wood_cf (section, grade, TRB_WOOD_FB)
                 <= 1150.0 * TRB_PSI * (1 + 1e-9) ? 1.0 : 0.85;
        case TRB_WOOD_FT: return 1.0;
        case TRB_WOOD_FV: return 0.97;
        case TRB_WOOD_FC_PERP: return 0.67;
        case TRB_WOOD_FC:
          g_return_val_if_fail (grade != NULL, 0.8);
          return grade->Fc * trb_design_wood_cf (section, grade, TRB_WOOD_FC)
                 <= 750.0 * TRB_PSI * (1 + 1e-9) ? 1.0 : 0.8;
        case TRB_WOOD_E:
        case TRB_WOOD_EMIN:
        default: return 0.9;
        }
    }
}

/**
 * trb_design_wood_ci:
 * @section: a sawn or glulam section
 * @property: the design value
 * @incised: whether the lumber is incised for preservative treatment
 *
 * The incising factor of sawn lumber (NDS 2018 Table 4.3.8): 0.80 on Fb, Ft, Fv and Fc,
 * 0.95 on E and Emin, 1.00 on Fc_perp. Glulam has none (1).
 *
 * Returns: C_i
 */
double
trb_design_wood_ci (const TrbSection *section,
                    TrbWoodProperty   property,
                    gboolean          incised)
{
  g_return_val_if_fail (section != NULL, 1.0);

  if (!incised || wood_class (section, NULL) == WOOD_GLULAM)
    return 1.0;

  switch (property)
    {
    case TRB_WOOD_FB:
    case TRB_WOOD_FT:
    case TRB_WOOD_FV:
    case TRB_WOOD_FC:
      return 0.80;
    case TRB_WOOD_E:
    case TRB_WOOD_EMIN:
      return 0.95;
    case TRB_WOOD_FC_PERP:
    default:
      return 1.0;
    }
}

/**
 * trb_design_wood_cr:
 * @section: a sawn or glulam section
 * @options: the member's options (its repetitive spacing)
 *
 * The repetitive member factor on Fb (NDS 2018 4.3.9): 1.15 for dimension lumber (2 to 4 in
 * thick) that is one of three or more like members at 24 in or less joined by sheathing or
 * decking, or that is built up of three or more plies fastened together; 1 otherwise, and
 * never for timbers or glulam.
 *
 * Returns: C_r
 */
double
trb_design_wood_cr (const TrbSection     *section,
                    const TrbWoodOptions *options)
{
  gboolean in_run;

  g_return_val_if_fail (section != NULL, 1.0);

  if (wood_class (section, NULL) != WOOD_DIMENSION)
    return 1.0;

  in_run = options != NULL && options->repetitive_spacing > 0 &&
           options->repetitive_spacing <= 24.0 * TRB_IN * (1 + 1e-9);
  return in_run || section->plies >= 3 ? 1.15 : 1.0;
}

/**
 * trb_design_wood_effective_length:
 * @lu: the laterally unsupported length, m
 * @d: the depth of the member, m
 *
 * The effective length for beam stability from NDS 2018 Table 3.3.3, by its general row for
 * a single span or cantilever under any load (the row for loads the table does not list):
 * 2.06 lu where lu/d < 7, 1.63 lu + 3 d where 7 <= lu/d <= 14.3, 1.84 lu beyond. It is the
 * uniform-load row, raised to 1.84 lu for long members, so it is conservative for every load
 * the member may carry.
 *
 * Returns: l_e, m
 */
double
trb_design_wood_effective_length (double lu,
                                  double d)
{
  double ratio;

  g_return_val_if_fail (d > 0, 0);

  if (lu <= 0)
    return 0;
  ratio = lu / d;
  if (ratio < 7.0)
    return 2.06 * lu;
  if (ratio <= 14.3)
    return 1.63 * lu + 3.0 * d;
  return 1.84 * lu;
}

/**
 * trb_design_wood_cl:
 * @Fb_star: Fb times every factor but C_L, C_fu (and C_V for glulam), Pa
 * @Emin_adj: Emin', Pa
 * @le: the effective length, m (0: braced throughout)
 * @b: the breadth, m
 * @d: the depth, m
 * @RB: (out) (optional): the slenderness ratio R_B = sqrt (le d / b^2) (Eq. 3.3-5)
 * @FbE: (out) (optional): the critical buckling value 1.20 Emin' / R_B^2, Pa
 *
 * The beam stability factor (NDS 2018 3.3.3, Eq. 3.3-6). 1 where d <= b (3.3.3.1) or le is 0.
 * The caller checks R_B <= 50 (3.3.3.7).
 *
 * Returns: C_L
 */
double
trb_design_wood_cl (double  Fb_star,
                    double  Emin_adj,
                    double  le,
                    double  b,
                    double  d,
                    double *RB,
                    double *FbE)
{
  double rb, fbe, alpha, p;

  g_return_val_if_fail (b > 0 && d > 0 && Fb_star > 0, 1.0);

  if (RB != NULL)
    *RB = 0;
  if (FbE != NULL)
    *FbE = INFINITY;
  if (le <= 0 || d <= b)
    return 1.0;

  rb = sqrt (le * d / (b * b));
  fbe = 1.20 * Emin_adj / (rb * rb);
  if (RB != NULL)
    *RB = rb;
  if (FbE != NULL)
    *FbE = fbe;

  alpha = fbe / Fb_star;
  p = (1.0 + alpha) / 1.9;
  return p - sqrt (p * p - alpha / 0.95);
}

/**
 * trb_design_wood_cv:
 * @section: a glulam section
 * @grade: its grade (Southern Pine takes the exponent 1/20)
 * @length: the length between points of zero moment, m
 *
 * The volume factor of glulam (NDS 2018 Eq. 5.3-1):
 * [(21/L)(12/d)(5.125/b)]^(1/x) <= 1, L in ft, d and b in in (b at most 10.75 in),
 * x = 20 for Southern Pine and 10 otherwise. 1 for sawn lumber.
 *
 * Returns: C_V
 */
double
trb_design_wood_cv (const TrbSection   *section,
                    const TrbWoodGrade *grade,
                    double              length)
{
  double L_ft, d_in, b_in, x;

  g_return_val_if_fail (section != NULL, 1.0);

  if (wood_class (section, grade) != WOOD_GLULAM || length <= 0)
    return 1.0;

  L_ft = length / TRB_FT;
  d_in = section->d / TRB_IN;
  b_in = MIN (section->b / TRB_IN, 10.75);
  x = is_southern_pine (grade) ? 20.0 : 10.0;
  return MIN (1.0, pow ((21.0 / L_ft) * (12.0 / d_in) * (5.125 / b_in), 1.0 / x));
}

/**
 * trb_design_wood_cb:
 * @bearing_length: the bearing length along the member, m
 * @near_end: whether the bearing area is less than 3 in from the end of the member
 *
 * The bearing area factor (NDS 2018 3.10.4): (l_b + 0.375 in) / l_b for bearings shorter than
 * 6 in and at least 3 in from the end of the member; 1 otherwise.
 *
 * Returns: C_b
 */
double
trb_design_wood_cb (double   bearing_length,
                    gboolean near_end)
{
  g_return_val_if_fail (bearing_length > 0, 1.0);

  if (near_end || bearing_length >= 6.0 * TRB_IN)
    return 1.0;
  return (bearing_length + 0.375 * TRB_IN) / bearing_length;
}

/**
 * trb_design_wood_required_bearing:
 * @reaction: the support reaction, N
 * @b: the breadth of the member, m
 * @Fc_perp_adj: Fc_perp' without C_b, Pa
 * @near_end: whether the bearing is less than 3 in from the end of the member
 *
 * The shortest bearing length for which R / (b l_b) <= Fc_perp' C_b (NDS 2018 3.10.2, 3.10.4).
 *
 * Returns: l_b,req, m (0 when any length would do)
 */
double
trb_design_wood_required_bearing (double   reaction,
                                  double   b,
                                  double   Fc_perp_adj,
                                  gboolean near_end)
{
  double plain, with_cb;

  g_return_val_if_fail (b > 0 && Fc_perp_adj > 0, INFINITY);

  plain = MAX (reaction, 0) / (b * Fc_perp_adj);
  if (near_end)
    return plain;
  /* With C_b, R / b = Fc_perp' (l_b + 0.375 in), valid while l_b < 6 in. */
  with_cb = plain - 0.375 * TRB_IN;
  if (with_cb >= 6.0 * TRB_IN)
    return plain;
  return MAX (with_cb, 0);
}

/**
 * trb_design_wood_adjusted_e:
 * @section: a sawn or glulam section
 * @grade: its grade
 * @options: (nullable): the service conditions; NULL for the defaults
 * @property: TRB_WOOD_E or TRB_WOOD_EMIN
 *
 * E' = E C_M C_t C_i and Emin' = Emin C_M C_t C_i C_T with C_T = 1 (NDS 2018 Table 4.3.1;
 * C_T is for truss compression chords only). The analysis of a wood member uses E'.
 *
 * Returns: the adjusted modulus, Pa
 */
double
trb_design_wood_adjusted_e (const TrbSection     *section,
                            const TrbWoodGrade   *grade,
                            const TrbWoodOptions *options,
                            TrbWoodProperty       property)
{
  TrbWoodOptions defaults;
  double value;

  g_return_val_if_fail (section != NULL && grade != NULL, NAN);
  g_return_val_if_fail (property == TRB_WOOD_E || property == TRB_WOOD_EMIN, NAN);

  if (options == NULL)
    {
      trb_design_wood_options_init (&defaults);
      options = &defaults;
    }

  value = property == TRB_WOOD_E ? grade->E : grade->Emin;
  return value *
         trb_design_wood_cm (section, grade, property, options->wet_service) *
         WOOD_CT *
         trb_design_wood_ci (section, property, options->incised);
}

/* ------------------------------------------------------------------------------------------
 * The member check
 * ------------------------------------------------------------------------------------------ */

typedef struct
{
  const TrbDesignInput *input;
  const TrbWoodGrade   *grade;
  const TrbWoodOptions *options;
  WoodClass             cls;
  double                A, S, b, d;
  double                Emin_adj;
  double                CF, Cr;
  double                CM_b, CM_v, CM_cp;
  double                Ci_b, Ci_v, Ci_cp;
  /* units of the detail texts */
  const char           *stress_unit, *length_unit, *force_unit, *span_unit;
} WoodContext;

static void
wood_context_init (WoodContext          *ctx,
                   const TrbDesignInput *input,
                   const TrbWoodGrade   *grade,
                   const TrbWoodOptions *options)
{
  const TrbSection *section = input->section;
  gboolean si = input->units == TRB_UNIT_SYSTEM_SI;

  memset (ctx, 0, sizeof *ctx);
  ctx->input = input;
  ctx->grade = grade;
  ctx->options = options;
  ctx->cls = wood_class (section, grade);
  ctx->stress_unit = si ? "MPa" : "psi";
  ctx->length_unit = si ? "mm" : "in";
  ctx->force_unit = si ? "kN" : "lb";
  ctx->span_unit = si ? "m" : "ft";
  ctx->b = section->b;
  ctx->d = section->d;
  ctx->A = isfinite (section->A) && section->A > 0 ? section->A : ctx->b * ctx->d;
  ctx->S = isfinite (section->Sx) && section->Sx > 0 ? section->Sx : ctx->b * ctx->d * ctx->d / 6;
  ctx->Emin_adj = trb_design_wood_adjusted_e (section, grade, options, TRB_WOOD_EMIN);
  ctx->CF = trb_design_wood_cf (section, grade, TRB_WOOD_FB);
  ctx->Cr = trb_design_wood_cr (section, options);
  ctx->CM_b = trb_design_wood_cm (section, grade, TRB_WOOD_FB, options->wet_service);
  ctx->CM_v = trb_design_wood_cm (section, grade, TRB_WOOD_FV, options->wet_service);
  ctx->CM_cp = trb_design_wood_cm (section, grade, TRB_WOOD_FC_PERP, options->wet_service);
  ctx->Ci_b = trb_design_wood_ci (section, TRB_WOOD_FB, options->incised);
  ctx->Ci_v = trb_design_wood_ci (section, TRB_WOOD_FV, options->incised);
  ctx->Ci_cp = trb_design_wood_ci (section, TRB_WOOD_FC_PERP, options->incised);
}

/* Fb*, C_L and its R_B for one combination (load duration factor CD) on one segment and one
 * sign of moment: what Fb' is before the volume factor of glulam. */
static double
flexure_fb_star (const WoodContext *ctx,
                 double             CD,
                 double             seg_length,
                 gboolean           negative,
                 double            *Fb_ref_out,
                 double            *CL_out,
                 double            *RB_out)
{
  const TrbWoodGrade *grade = ctx->grade;
  gboolean glulam = ctx->cls == WOOD_GLULAM;
  double Fb_ref, Fb_star, CL = 1.0, RB = 0;
  gboolean braced;

  Fb_ref = grade->Fb;
  /* Glulam: a negative moment stresses the compression-zone laminations in tension (Fbx-). */
  if (negative && glulam && isfinite (grade->Fb_neg) && grade->Fb_neg > 0)
    Fb_ref = grade->Fb_neg;

  Fb_star = Fb_ref * CD * ctx->CM_b * WOOD_CT * ctx->CF * ctx->Ci_b * ctx->Cr;

  /* Sheathing holds the top edge, in compression under positive moment; the bottom edge, in
   * compression under negative moment, is held only at the supports and brace points. */
  braced = !negative && ctx->input->bracing == TRB_BRACING_CONTINUOUS;
  if (!braced)
    {
      double le = trb_design_wood_effective_length (seg_length, ctx->d);

      CL = trb_design_wood_cl (Fb_star, ctx->Emin_adj, le, ctx->b, ctx->d, &RB, NULL);
    }
  *Fb_ref_out = Fb_ref;
  *CL_out = CL;
  *RB_out = RB;
  return Fb_star;
}

static double
moment_at (const TrbBeamResult *result,
           double               x)
{
  TrbBeamValues v;

  trb_beam_result_eval (result, x, TRB_SIDE_RIGHT, &v);
  return v.M;
}

/* x_in has the moment's sign, x_out has not: the zero between them. */
static double
bisect_zero_moment (const TrbBeamResult *result,
                    double               x_in,
                    double               x_out,
                    double               sign)
{
  for (int i = 0; i < 60; i++)
    {
      double mid = 0.5 * (x_in + x_out);

      if (moment_at (result, mid) * sign > 0)
        x_in = mid;
      else
        x_out = mid;
    }
  return 0.5 * (x_in + x_out);
}

/* The length of the region around x0 in which the moment keeps the sign of M0: the length
 * between points of zero moment, or to a member end where the moment is not zero (a fixed
 * end), for the volume factor. */
static double
zero_moment_length (const TrbBeamResult *result,
                    double               L,
                    double               x0,
                    double               M0)
{
  double sign = M0 > 0 ? 1.0 : -1.0;
  double step = L / 512.0;
  double left = 0, right = L;
  double x;

  x = x0;
  while (x > 0)
    {
      double xn = MAX (x - step, 0);

      if (moment_at (result, xn) * sign <= 0)
        {
          left = bisect_zero_moment (result, x, xn, sign);
          break;
        }
      x = xn;
    }

  x = x0;
  while (x < L)
    {
      double xn = MIN (x + step, L);

      if (moment_at (result, xn) * sign <= 0)
        {
          right = bisect_zero_moment (result, x, xn, sign);
          break;
        }
      x = xn;
    }

  return right - left;
}

/* A check of one combination on one segment, span or support, with what its detail text
 * needs: the text is written only for the check that governs (write_*()), after every
 * candidate is compared by its ratio. */
typedef struct
{
  double      demand, capacity, ratio, x;
  const char *combination;
  const char *clause;
  /* flexure */
  gboolean    not_permitted;  /* R_B above 50 */
  double      RB, lu, Fb_ref, CD, CV, CL;
  gboolean    negative;
  /* shear */
  double      V;
  gboolean    at_d;
  /* bearing */
  double      Cb, required;
} Candidate;

static void
keep_worse (Candidate       *governing,
            gboolean        *have,
            const Candidate *candidate)
{
  if (!*have || candidate->ratio > governing->ratio)
    {
      *governing = *candidate;
      *have = TRUE;
    }
}

static void
candidate_set (Candidate  *c,
               const char *clause,
               double      demand,
               double      capacity,
               const char *combination,
               double      x)
{
  c->clause = clause;
  c->demand = demand;
  c->capacity = capacity;
  c->ratio = trb_check_ratio (demand, capacity);
  c->combination = combination;
  c->x = x;
}

static int
compare_double (gconstpointer a,
                gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

/* The sorted, distinct positions in xs. */
static GArray *
distinct_positions (GArray *xs)
{
  GArray *out = g_array_new (FALSE, FALSE, sizeof (double));

  g_array_sort (xs, compare_double);
  for (guint i = 0; i < xs->len; i++)
    {
      double x = g_array_index (xs, double, i);

      if (out->len == 0 || x - g_array_index (out, double, out->len - 1) > X_TOL)
        g_array_append_val (out, x);
    }
  return out;
}

/* The spans (between the member ends and the supports) and the segments for stability (the
 * spans cut again at the brace points). */
static void
wood_positions (const TrbDesignInput  *input,
                GArray               **spans,
                GArray               **segments)
{
  g_autoptr(GArray) xs = g_array_new (FALSE, FALSE, sizeof (double));
  double zero = 0;

  g_array_append_val (xs, zero);
  g_array_append_val (xs, input->length);
  for (guint i = 0; i < input->n_supports; i++)
    g_array_append_val (xs, input->supports[i].x);
  *spans = distinct_positions (xs);
  for (guint i = 0; i < input->n_braces; i++)
    if (input->brace_x[i] > 0 && input->brace_x[i] < input->length)
      g_array_append_val (xs, input->brace_x[i]);
  *segments = distinct_positions (xs);
}

/**
 * trb_design_wood_segment_points:
 * @input: the member
 * @points: (out caller-allocates): room for 2 + n_supports + n_braces positions
 *
 * The ends of the segments the timber flexure check takes: the member's ends, its supports
 * and its brace points inside it, sorted, without repeats (within 1e-9 m).
 *
 * Returns: how many
 */
guint
trb_design_wood_segment_points (const TrbDesignInput *input,
                                double               *points)
{
  g_autoptr(GArray) spans = NULL;
  g_autoptr(GArray) segments = NULL;

  wood_positions (input, &spans, &segments);
  memcpy (points, segments->data, segments->len * sizeof (double));
  return segments->len;
}

/* One sign of moment in one segment between bracing points. */
static void
check_flexure_region (const WoodContext    *ctx,
                      const TrbDemandCombo *combo,
                      double                CD,
                      double                seg_a,
                      double                seg_b,
                      double                M,
                      double                x,
                      Candidate            *out)
{
  const TrbWoodGrade *grade = ctx->grade;
  gboolean negative = M < 0;
  gboolean glulam = ctx->cls == WOOD_GLULAM;
  double Fb_ref, Fb_star, CL, CV = 1.0, RB, Fb_adj;

  Fb_star = flexure_fb_star (ctx, CD, seg_b - seg_a, negative, &Fb_ref, &CL, &RB);

  if (glulam)
    {
      double Lz = zero_moment_length (combo->result, ctx->input->length, x, M);

      CV = trb_design_wood_cv (ctx->input->section, grade, Lz);
      /* NDS 2018 5.3.6: the lesser of C_L and C_V, not both. */
      Fb_adj = Fb_star * MIN (CL, CV) * WOOD_CFU;
    }
  else
    {
      Fb_adj = Fb_star * CL * WOOD_CFU;
    }

  out->negative = negative;
  out->Fb_ref = Fb_ref;
  out->CD = CD;
  out->CV = CV;
  out->CL = CL;
  out->RB = RB;
  out->lu = seg_b - seg_a;
  out->not_permitted = RB > 50.0;
  if (out->not_permitted)
    {
      /* NDS 2018 3.3.3.7: a slenderness ratio above 50 is not permitted at all. */
      candidate_set (out, "NDS 2018 3.3.3.7", fabs (M) / ctx->S, 0, combo->name, x);
      return;
    }
  candidate_set (out, "NDS 2018 3.3.1", fabs (M) / ctx->S, Fb_adj, combo->name, x);
}

static void
write_flexure (const WoodContext *ctx,
               const Candidate   *c,
               TrbCheck          *out)
{
  char fb[32], fref[32], lu[32];

  trb_check_set (out, "Flexure", c->clause, TRB_DIM_STRESS, c->demand, c->capacity,
                 c->combination, c->x);
  if (ctx->input->no_detail)
    return;
  if (c->not_permitted)
    {
      g_snprintf (out->detail, sizeof out->detail, "R_B = %.1f > 50 over l_u = %s: not permitted",
                  c->RB, trb_design_format (lu, sizeof lu, c->lu, ctx->span_unit));
      return;
    }
  trb_design_format (fb, sizeof fb, c->capacity, ctx->stress_unit);
  if (ctx->cls == WOOD_GLULAM)
    g_snprintf (out->detail, sizeof out->detail,
                "%s %s; C_D %.2f, C_M %.2f, C_t 1.00, C_V %.3f, C_L %.3f -> Fb' = %s",
                c->negative ? "Fbx-" : "Fbx+",
                trb_design_format (fref, sizeof fref, c->Fb_ref, ctx->stress_unit),
                c->CD, ctx->CM_b, c->CV, c->CL, fb);
  else
    g_snprintf (out->detail, sizeof out->detail,
                "C_D %.2f, C_M %.2f, C_t 1.00, C_F %.3f, C_i %.2f, C_r %.2f, C_L %.3f -> Fb' = %s",
                c->CD, ctx->CM_b, ctx->CF, ctx->Ci_b, ctx->Cr, c->CL, fb);
}

/**
 * trb_design_wood_fb_range:
 * @input: the section and the member (its length and bracing)
 * @grade: the section's species and grade
 * @options: the service conditions
 * @CD: the combination's load duration factor
 * @seg_length: the length of the segment between bracing points, m
 * @negative: for negative moment
 * @lo: (out): the least Fb' the flexure check can take there
 * @hi: (out): the largest
 *
 * The adjusted bending design value of one combination on one segment, as the flexure check
 * of trb_design_wood_check() computes it: for sawn lumber exactly (lo = hi); for glulam the
 * volume factor depends on where the moment changes sign, between its value over the whole
 * member and 1. Both 0 where the slenderness is not permitted (R_B above 50).
 */
void
trb_design_wood_fb_range (const TrbDesignInput *input,
                          const TrbWoodGrade   *grade,
                          const void           *options,
                          double                CD,
                          double                seg_length,
                          gboolean              negative,
                          double               *lo,
                          double               *hi)
{
  WoodContext ctx;
  double Fb_ref, Fb_star, CL, RB;

  wood_context_init (&ctx, input, grade, options);
  Fb_star = flexure_fb_star (&ctx, CD, seg_length, negative, &Fb_ref, &CL, &RB);
  if (RB > 50.0)
    {
      *lo = *hi = 0;
      return;
    }
  if (ctx.cls == WOOD_GLULAM)
    {
      double CV = trb_design_wood_cv (input->section, grade, input->length);

      *lo = Fb_star * MIN (CL, CV) * WOOD_CFU;
      *hi = Fb_star * CL * WOOD_CFU;
    }
  else
    *lo = *hi = Fb_star * CL * WOOD_CFU;
}

static void
check_flexure (const WoodContext    *ctx,
               const TrbDemandCombo *combo,
               double                CD,
               GArray               *segments,
               Candidate            *governing,
               gboolean             *have)
{
  for (guint i = 0; i + 1 < segments->len; i++)
    {
      double a = g_array_index (segments, double, i);
      double b = g_array_index (segments, double, i + 1);
      TrbBeamExtremes ext;
      Candidate check;

      if (combo->seg_ext != NULL && combo->n_seg_ext + 1 == segments->len)
        ext = combo->seg_ext[i];
      else
        trb_beam_result_extremes (combo->result, a, b, &ext);
      if (ext.M_max > 0)
        {
          check_flexure_region (ctx, combo, CD, a, b, ext.M_max, ext.M_max_x, &check);
          keep_worse (governing, have, &check);
        }
      if (ext.M_min < 0)
        {
          check_flexure_region (ctx, combo, CD, a, b, ext.M_min, ext.M_min_x, &check);
          keep_worse (governing, have, &check);
        }
    }
}

/* The reaction of the support at x, or 0 when there is none there. */
static double
reaction_at (const TrbBeamResult *result,
             double               x)
{
  const TrbReaction *reactions;
  guint n;

  reactions = trb_beam_result_get_reactions (result, &n);
  for (guint i = 0; i < n; i++)
    if (fabs (reactions[i].x - x) <= X_TOL)
      return reactions[i].force;
  return 0;
}

static gboolean
is_support (const TrbDesignInput *input,
            double                x)
{
  for (guint i = 0; i < input->n_supports; i++)
    if (fabs (input->supports[i].x - x) <= X_TOL)
      return TRUE;
  return FALSE;
}

/* The sum of the point loads (jumps in V) at the breaks in [lo, hi], each times its weight
 * (x - x_support) / d or (x_support - x) / d (NDS 2018 3.4.3.1 (b)). */
static double
weighted_point_loads (const TrbBeamResult *result,
                      double               support_x,
                      double               lo,
                      gboolean             lo_open,
                      double               hi,
                      gboolean             hi_open,
                      double               d)
{
  const double *breaks;
  guint n;
  double sum = 0;

  breaks = trb_beam_result_get_breaks (result, &n);
  for (guint i = 0; i < n; i++)
    {
      double x = breaks[i];
      TrbBeamValues left, right;

      if (x < lo - X_TOL || x > hi + X_TOL)
        continue;
      if ((lo_open && fabs (x - lo) <= X_TOL) || (hi_open && fabs (x - hi) <= X_TOL))
        continue;
      trb_beam_result_eval (result, x, TRB_SIDE_LEFT, &left);
      trb_beam_result_eval (result, x, TRB_SIDE_RIGHT, &right);
      sum += (left.V - right.V) * fabs (x - support_x) / d;
    }
  return sum;
}

static void
check_shear (const WoodContext    *ctx,
             const TrbDemandCombo *combo,
             double                CD,
             GArray               *spans,
             Candidate            *governing,
             gboolean             *have)
{
  const TrbWoodGrade *grade = ctx->grade;
  double Fv_adj = grade->Fv * CD * ctx->CM_v * WOOD_CT * ctx->Ci_v;
  double d = ctx->d;

  for (guint i = 0; i + 1 < spans->len; i++)
    {
      double a = g_array_index (spans, double, i);
      double b = g_array_index (spans, double, i + 1);
      gboolean left_at_d, right_at_d;
      double aa, bb, V = 0, Vx = a;
      gboolean at_d = FALSE;
      TrbBeamExtremes ext;
      Candidate check;

      /* Loads within d of a support the member bears on may be left out (NDS 2018 3.4.3.1);
       * a support that pulls down (uplift) is not bearing. */
      left_at_d = ctx->options->shear_at_d && is_support (ctx->input, a) &&
                  reaction_at (combo->result, a) > 0;
      right_at_d = ctx->options->shear_at_d && is_support (ctx->input, b) &&
                   reaction_at (combo->result, b) > 0;
      aa = left_at_d ? a + d : a;
      bb = right_at_d ? b - d : b;
      if (aa >= bb)
        {
          /* A span shorter than 2d: no reduction. */
          aa = a;
          bb = b;
          left_at_d = right_at_d = FALSE;
        }

      trb_beam_result_extremes (combo->result, aa, bb, &ext);
      if (fabs (ext.V_max) >= fabs (ext.V_min))
        {
          V = fabs (ext.V_max);
          Vx = ext.V_max_x;
        }
      else
        {
          V = fabs (ext.V_min);
          Vx = ext.V_min_x;
        }

      /* At d from a support, V leaves out every load between the support and d; point loads
       * there come back weighted by their distance from the support over d. */
      if (left_at_d)
        {
          TrbBeamValues v;
          double Vd;

          trb_beam_result_eval (combo->result, aa, TRB_SIDE_RIGHT, &v);
          Vd = fabs (v.V + weighted_point_loads (combo->result, a, a, TRUE, aa, FALSE, d));
          if (Vd >= V)
            {
              V = Vd;
              Vx = aa;
              at_d = TRUE;
            }
        }
      if (right_at_d)
        {
          TrbBeamValues v;
          double Vd;

          trb_beam_result_eval (combo->result, bb, TRB_SIDE_LEFT, &v);
          Vd = fabs (v.V - weighted_point_loads (combo->result, b, bb, FALSE, b, TRUE, d));
          if (Vd >= V)
            {
              V = Vd;
              Vx = bb;
              at_d = TRUE;
            }
        }

      candidate_set (&check, "NDS 2018 Eq. 3.4-2", 1.5 * V / ctx->A, Fv_adj, combo->name, Vx);
      check.V = V;
      check.at_d = at_d;
      check.CD = CD;
      keep_worse (governing, have, &check);
    }
}

static void
write_shear (const WoodContext *ctx,
             const Candidate   *c,
             TrbCheck          *out)
{
  char vtext[32], fv[32];

  trb_check_set (out, "Shear", c->clause, TRB_DIM_STRESS, c->demand, c->capacity,
                 c->combination, c->x);
  if (ctx->input->no_detail)
    return;
  g_snprintf (out->detail, sizeof out->detail,
              "V = %s%s; C_D %.2f, C_M %.2f, C_t 1.00, C_i %.2f -> Fv' = %s",
              trb_design_format (vtext, sizeof vtext, c->V, ctx->force_unit),
              c->at_d ? " at d" : "", c->CD, ctx->CM_v, ctx->Ci_v,
              trb_design_format (fv, sizeof fv, c->capacity, ctx->stress_unit));
}

static void
check_bearing (const WoodContext    *ctx,
               const TrbDemandCombo *combo,
               Candidate            *governing,
               gboolean             *have)
{
  const TrbReaction *reactions;
  double lb = ctx->options->bearing_length;
  double L = ctx->input->length;
  double F0 = ctx->grade->Fc_perp * ctx->CM_cp * WOOD_CT * ctx->Ci_cp;
  guint n;

  reactions = trb_beam_result_get_reactions (combo->result, &n);
  for (guint i = 0; i < n; i++)
    {
      double R = reactions[i].force;
      double x = reactions[i].x;
      gboolean near_end;
      double Cb, required;
      Candidate check;

      if (R <= 0)
        continue;
      /* The bearing area, centred on the support, against 3 in from either end. */
      near_end = x - lb / 2 < 3.0 * TRB_IN - X_TOL || L - x - lb / 2 < 3.0 * TRB_IN - X_TOL;
      Cb = trb_design_wood_cb (lb, near_end);
      required = trb_design_wood_required_bearing (R, ctx->b, F0, near_end);

      candidate_set (&check, "NDS 2018 3.10", R / (ctx->b * lb), F0 * Cb, combo->name, x);
      check.Cb = Cb;
      check.required = required;
      keep_worse (governing, have, &check);
    }
}

static void
write_bearing (const WoodContext *ctx,
               const Candidate   *c,
               TrbCheck          *out)
{
  char lbt[32], fc[32], req[32];

  trb_check_set (out, "Bearing", c->clause, TRB_DIM_STRESS, c->demand, c->capacity,
                 c->combination, c->x);
  if (ctx->input->no_detail)
    return;
  g_snprintf (out->detail, sizeof out->detail,
              "l_b %s, C_M %.2f, C_t 1.00, C_b %.3f -> Fc_perp' = %s; l_b,req %s",
              trb_design_format (lbt, sizeof lbt, ctx->options->bearing_length, ctx->length_unit),
              ctx->CM_cp, c->Cb, trb_design_format (fc, sizeof fc, c->capacity, ctx->stress_unit),
              trb_design_format (req, sizeof req, c->required, ctx->length_unit));
}

/**
 * trb_design_wood_check:
 * @input: the section, supports, bracing and the member's responses, with E' from
 *   trb_design_wood_adjusted_e() in the analysis
 * @grade: the section's species and grade
 * @options: (nullable): the service conditions; NULL for the defaults
 * @checks: (element-type TrbCheck): where the checks are appended
 *
 * Checks a sawn lumber or glulam member by NDS 2018 ASD. Every combination is checked with
 * its own load duration factor, which is the NDS comparison of load / C_D across
 * combinations (dead load alone with 0.9 among them). Appends the governing flexure
 * (fb = M/S <= Fb', 3.3.1; C_L per segment between bracing points; glulam: the lesser of C_L
 * and C_V, and Fbx- under negative moment), shear (fv = 1.5 V/A <= Fv', Eq. 3.4-2, V at d
 * from the supports where 3.4.3.1 allows it) and bearing (R/(b l_b) <= Fc_perp', 3.10, C_b
 * per 3.10.4) checks, then the shared deflection checks.
 */
void
trb_design_wood_check (const TrbDesignInput *input,
                       const TrbWoodGrade   *grade,
                       const TrbWoodOptions *options,
                       GArray               *checks)
{
  const TrbSection *section;
  TrbWoodOptions defaults;
  WoodContext ctx = { 0 };
  g_autoptr(GArray) segments = NULL;
  g_autoptr(GArray) spans = NULL;
  Candidate flexure = { 0 }, shear = { 0 }, bearing = { 0 };
  TrbCheck check;
  gboolean have_flexure = FALSE, have_shear = FALSE, have_bearing = FALSE;

  g_return_if_fail (input != NULL && input->section != NULL);
  g_return_if_fail (grade != NULL);
  g_return_if_fail (checks != NULL);
  g_return_if_fail (input->length > 0);

  if (options == NULL)
    {
      trb_design_wood_options_init (&defaults);
      options = &defaults;
    }
  g_return_if_fail (options->bearing_length > 0);

  section = input->section;
  g_return_if_fail (section->kind == TRB_SHAPE_SAWN || section->kind == TRB_SHAPE_GLULAM ||
                    section->kind == TRB_SHAPE_CUSTOM);
  g_return_if_fail (section->b > 0 && section->d > 0);
  wood_context_init (&ctx, input, grade, options);

  /* Spans: between the member ends and the supports. Segments for stability: the spans cut
   * again at the brace points. */
  wood_positions (input, &spans, &segments);

  for (guint i = 0; i < input->n_combos; i++)
    {
      const TrbDemandCombo *combo = &input->combos[i];
      double CD;

      if (combo->result == NULL)
        continue;
      CD = trb_design_wood_cd (combo->factors);
      check_flexure (&ctx, combo, CD, segments, &flexure, &have_flexure);
      check_shear (&ctx, combo, CD, spans, &shear, &have_shear);
      check_bearing (&ctx, combo, &bearing, &have_bearing);
    }

  if (have_flexure)
    {
      write_flexure (&ctx, &flexure, &check);
      g_array_append_val (checks, check);
    }
  if (have_shear)
    {
      write_shear (&ctx, &shear, &check);
      g_array_append_val (checks, check);
    }
  if (have_bearing)
    {
      write_bearing (&ctx, &bearing, &check);
      g_array_append_val (checks, check);
    }

  trb_design_check_deflection (input, checks);
}
