/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-design-steel.h"

#include "trb-beam.h"
#include "trb-units.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* ASTM minimum yield and tensile stresses; E and G as AISC 360-16 Section B4 / the Manual use
 * them for all structural steel. */
static const TrbSteelGrade steel_grades[] = {
  { "A992", 50 * TRB_KSI, 65 * TRB_KSI, 29000 * TRB_KSI, 11200 * TRB_KSI,
    "ASTM A992; AISC Manual Table 2-4 (from memory)" },
  { "A36", 36 * TRB_KSI, 58 * TRB_KSI, 29000 * TRB_KSI, 11200 * TRB_KSI,
    "ASTM A36; AISC Manual Table 2-4 (from memory)" },
  { "A572 Gr 50", 50 * TRB_KSI, 65 * TRB_KSI, 29000 * TRB_KSI, 11200 * TRB_KSI,
    "ASTM A572 Grade 50; AISC Manual Table 2-4 (from memory)" },
};

const TrbSteelGrade *
trb_design_steel_get_grades (guint *n_grades)
{
  if (n_grades != NULL)
    *n_grades = G_N_ELEMENTS (steel_grades);
  return steel_grades;
}

/* "A572 Gr 50", "a572-50" and "A572 GR.50" all name the same grade: compare the letters and
 * digits, with the word "GR" left out. */
static char *
normalize_grade_name (const char *name)
{
  GString *out = g_string_new (NULL);

  for (const char *p = name; *p != '\0'; p++)
    {
      if (g_ascii_isalnum (*p))
        g_string_append_c (out, g_ascii_toupper (*p));
    }
  for (char *gr; (gr = strstr (out->str, "GR")) != NULL;)
    g_string_erase (out, gr - out->str, 2);

  return g_string_free (out, FALSE);
}

/**
 * trb_design_steel_lookup_grade:
 * @name: a grade name such as "A992", "A36" or "A572 Gr 50"
 *
 * Returns: (nullable): the grade, or %NULL when it is not one this module knows
 */
const TrbSteelGrade *
trb_design_steel_lookup_grade (const char *name)
{
  g_autofree char *want = NULL;

  g_return_val_if_fail (name != NULL, NULL);

  /* a grade's own name, as the settings mostly give it: the same grade as normalized (no two
   * names of the table are the same once normalized), without the copies */
  for (guint i = 0; i < G_N_ELEMENTS (steel_grades); i++)
    if (strcmp (name, steel_grades[i].name) == 0)
      return &steel_grades[i];

  want = normalize_grade_name (name);
  for (guint i = 0; i < G_N_ELEMENTS (steel_grades); i++)
    {
      g_autofree char *have = normalize_grade_name (steel_grades[i].name);

      if (g_strcmp0 (want, have) == 0)
        return &steel_grades[i];
    }

  return NULL;
}

/* The properties of a doubly symmetric I shape that F2, F3 and G2 use, with what the
 * catalog does not carry derived from what it does. */
typedef struct
{
  double d, tw, Zx, Sx, ry, J, ho, rts, lambda_f, h_tw;
} IProps;

static gboolean
positive (double v)
{
  return isfinite (v) && v > 0;
}

static gboolean
get_i_props (const TrbSection *s,
             IProps           *p)
{
  if (s->kind != TRB_SHAPE_W && s->kind != TRB_SHAPE_S && s->kind != TRB_SHAPE_CUSTOM)
    return FALSE;

  p->d = s->d;
  p->tw = s->tw;
  p->Zx = s->Zx;
  p->Sx = s->Sx;
  p->ry = s->ry;
  p->J = s->J;

  p->ho = s->ho;
  if (!positive (p->ho) && positive (s->d) && positive (s->tf))
    p->ho = s->d - s->tf;

  /* rts^2 = sqrt(Iy Cw) / Sx (F2-7) */
  p->rts = s->rts;
  if (!positive (p->rts) && positive (s->Iy) && positive (s->Cw) && positive (s->Sx))
    p->rts = sqrt (sqrt (s->Iy * s->Cw) / s->Sx);

  p->lambda_f = s->bf_2tf;
  if (!positive (p->lambda_f) && positive (s->bf) && positive (s->tf))
    p->lambda_f = s->bf / (2 * s->tf);

  /* h is the clear distance between flanges less the fillets: d - 2 kdes for rolled shapes */
  p->h_tw = s->h_tw;
  if (!positive (p->h_tw) && positive (s->d) && positive (s->kdes) && positive (s->tw))
    p->h_tw = (s->d - 2 * s->kdes) / s->tw;

  /* A custom section is taken as an I shape only when it has flanges and a warping constant:
   * a rectangle or a tube with the same moduli would otherwise be checked by the wrong
   * chapter. */
  if (s->kind == TRB_SHAPE_CUSTOM
      && !(positive (s->bf) && positive (s->tf) && positive (s->Cw)))
    return FALSE;

  return positive (p->d) && positive (p->tw) && positive (p->Zx) && positive (p->Sx)
         && positive (p->ry) && positive (p->J) && positive (p->ho) && positive (p->rts)
         && positive (p->lambda_f) && positive (p->h_tw);
}

/**
 * trb_design_steel_covers:
 * @section: a section
 *
 * Whether the section is a doubly symmetric I shape with every property F2, F3 and G2 need:
 * W and S shapes, and custom I sections. Channels, tubes and anything else are not designed
 * by this module.
 *
 * Returns: %TRUE when trb_design_steel_check() can check it
 */
gboolean
trb_design_steel_covers (const TrbSection *section)
{
  IProps p;

  g_return_val_if_fail (section != NULL, FALSE);

  return get_i_props (section, &p);
}

/**
 * trb_design_steel_rts:
 * @section: a section
 *
 * The effective radius of gyration rts: the tabulated value, or sqrt(sqrt(Iy Cw) / Sx)
 * (AISC 360-16 Eq. F2-7) when there is none.
 *
 * Returns: rts in m, or NAN
 */
double
trb_design_steel_rts (const TrbSection *section)
{
  IProps p;

  g_return_val_if_fail (section != NULL, NAN);

  if (!get_i_props (section, &p))
    return NAN;
  return p.rts;
}

static double
lp_of (const IProps        *p,
       const TrbSteelGrade *g)
{
  /* F2-5 */
  return 1.76 * p->ry * sqrt (g->E / g->Fy);
}

static double
lr_of (const IProps        *p,
       const TrbSteelGrade *g)
{
  /* F2-6, with c = 1 for doubly symmetric I shapes (F2-8a) */
  double jc = p->J / (p->Sx * p->ho);
  double r = 0.7 * g->Fy / g->E;

  return 1.95 * p->rts * (g->E / (0.7 * g->Fy)) * sqrt (jc + sqrt (jc * jc + 6.76 * r * r));
}

/**
 * trb_design_steel_lp:
 * @section: a W, S or custom I section
 * @grade: its steel
 *
 * Returns: Lp = 1.76 ry sqrt(E / Fy) (AISC 360-16 Eq. F2-5) in m, NAN for other sections
 */
double
trb_design_steel_lp (const TrbSection    *section,
                     const TrbSteelGrade *grade)
{
  IProps p;

  g_return_val_if_fail (section != NULL && grade != NULL, NAN);

  if (!get_i_props (section, &p))
    return NAN;
  return lp_of (&p, grade);
}

/**
 * trb_design_steel_lr:
 * @section: a W, S or custom I section
 * @grade: its steel
 *
 * Returns: Lr (AISC 360-16 Eq. F2-6, c = 1) in m, NAN for other sections
 */
double
trb_design_steel_lr (const TrbSection    *section,
                     const TrbSteelGrade *grade)
{
  IProps p;

  g_return_val_if_fail (section != NULL && grade != NULL, NAN);

  if (!get_i_props (section, &p))
    return NAN;
  return lr_of (&p, grade);
}

/**
 * trb_design_steel_mp:
 * @section: a section with Zx
 * @grade: its steel
 *
 * Returns: Mp = Fy Zx (AISC 360-16 Eq. F2-1) in N*m
 */
double
trb_design_steel_mp (const TrbSection    *section,
                     const TrbSteelGrade *grade)
{
  g_return_val_if_fail (section != NULL && grade != NULL, NAN);

  return grade->Fy * section->Zx;
}

/**
 * trb_design_steel_cb:
 * @m_max: the largest moment in the unbraced segment
 * @m_a: the moment at its quarter point
 * @m_b: the moment at its centre
 * @m_c: the moment at its three-quarter point
 *
 * The lateral-torsional buckling modification factor of AISC 360-16 Eq. F1-1,
 * Cb = 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB + 3 MC), on absolute values. A segment without
 * moment gets 1.
 *
 * Returns: Cb
 */
double
trb_design_steel_cb (double m_max,
                     double m_a,
                     double m_b,
                     double m_c)
{
  double mx = fabs (m_max);
  double den;

  /* Mmax is the segment's largest moment by definition; a caller's rounding must not make a
   * quarter-point value exceed it. */
  mx = MAX (mx, MAX (fabs (m_a), MAX (fabs (m_b), fabs (m_c))));
  den = 2.5 * mx + 3 * fabs (m_a) + 4 * fabs (m_b) + 3 * fabs (m_c);
  if (!(mx > 0) || !(den > 0))
    return 1.0;

  return 12.5 * mx / den;
}

/**
 * trb_design_steel_flexure:
 * @section: a W, S or custom I section
 * @grade: its steel
 * @Lb: the unbraced length of the compression flange, m (0: braced throughout)
 * @Cb: the moment gradient factor (F1-1; 1 is conservative)
 * @out: (out): the nominal strength and what governs it
 *
 * The nominal flexural strength about the major axis: lateral-torsional buckling by F2.2
 * (F2-1 to F2-4), and flange local buckling by F3 (F3-1, F3-2) when the flanges are not
 * compact (bf/2tf > 0.38 sqrt(E/Fy)); the lesser governs. Webs must be compact
 * (h/tw <= 3.76 sqrt(E/Fy), Table B4.1b case 15): F4 and F5 are not implemented.
 *
 * Returns: %FALSE (and @out zeroed) when the section is not one F2 or F3 covers
 */
gboolean
trb_design_steel_flexure (const TrbSection    *section,
                          const TrbSteelGrade *grade,
                          double               Lb,
                          double               Cb,
                          TrbSteelFlexure     *out)
{
  TrbSteelFlexurePrep prep;

  g_return_val_if_fail (section != NULL, FALSE);
  g_return_val_if_fail (grade != NULL, FALSE);
  g_return_val_if_fail (out != NULL, FALSE);

  trb_design_steel_flexure_prepare (section, grade, &prep);
  return trb_design_steel_flexure_at (&prep, Lb, Cb, out);
}

/**
 * trb_design_steel_flexure_prepare:
 * @section: an I shape
 * @grade: its steel
 * @prep: (out): what trb_design_steel_flexure() computes of them whatever Lb and Cb
 *
 * For trb_design_steel_flexure_at(), which gives what trb_design_steel_flexure() gives, bit
 * for bit (the same operations): the member check and sizing ask for many Lb and Cb of one
 * section.
 *
 * Returns: whether F2 or F3 covers the section
 */
gboolean
trb_design_steel_flexure_prepare (const TrbSection      *section,
                                  const TrbSteelGrade   *grade,
                                  TrbSteelFlexurePrep   *prep)
{
  IProps p;
  double E, Fy, lam_pf, lam_rf;

  g_return_val_if_fail (section != NULL, FALSE);
  g_return_val_if_fail (grade != NULL, FALSE);
  g_return_val_if_fail (prep != NULL, FALSE);

  memset (prep, 0, sizeof *prep);
  if (!get_i_props (section, &p))
    return FALSE;

  E = grade->E;
  Fy = grade->Fy;
  if (p.h_tw > 3.76 * sqrt (E / Fy))
    return FALSE;

  prep->ok = TRUE;
  prep->E = E;
  prep->Sx = p.Sx;
  prep->rts = p.rts;
  prep->jc = p.J / (p.Sx * p.ho);
  prep->lambda_f = p.lambda_f;
  prep->Mp = Fy * p.Zx;
  prep->My70 = 0.7 * Fy * p.Sx;
  prep->Lp = lp_of (&p, grade);
  prep->Lr = lr_of (&p, grade);

  /* Flange local buckling, F3.2: rolled shapes with noncompact or slender flanges. It does
   * not depend on Lb or Cb. */
  lam_pf = 0.38 * sqrt (E / Fy);
  lam_rf = 1.0 * sqrt (E / Fy);
  if (p.lambda_f > lam_pf)
    {
      prep->flb = TRUE;
      if (p.lambda_f <= lam_rf)
        {
          prep->Mflb = prep->Mp - (prep->Mp - prep->My70) * (p.lambda_f - lam_pf) /
                                  (lam_rf - lam_pf);
          prep->eq_flb = "F3-1";
        }
      else
        {
          double kc = CLAMP (4 / sqrt (p.h_tw), 0.35, 0.76);

          prep->Mflb = 0.9 * E * kc * p.Sx / (p.lambda_f * p.lambda_f);
          prep->eq_flb = "F3-2";
        }
    }
  return TRUE;
}

/**
 * trb_design_steel_flexure_at:
 * @prep: from trb_design_steel_flexure_prepare()
 * @Lb: the unbraced length of the compression flange, m (0: braced throughout)
 * @Cb: the moment gradient factor (F1-1; 1 is conservative)
 * @out: (out): the nominal strength and what governs it
 *
 * trb_design_steel_flexure() of the prepared section and grade.
 *
 * Returns: %FALSE (and @out zeroed) when the section is not one F2 or F3 covers
 */
gboolean
trb_design_steel_flexure_at (const TrbSteelFlexurePrep *prep,
                             double                     Lb,
                             double                     Cb,
                             TrbSteelFlexure           *out)
{
  double Mp, Mn, My70;
  const char *eq;

  g_return_val_if_fail (prep != NULL, FALSE);
  g_return_val_if_fail (out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  if (!prep->ok)
    return FALSE;

  Lb = MAX (Lb, 0);
  if (!(Cb > 0))
    Cb = 1.0;

  Mp = prep->Mp;
  My70 = prep->My70;
  out->Mp = Mp;
  out->Lp = prep->Lp;
  out->Lr = prep->Lr;
  out->Lb = Lb;
  out->Cb = Cb;
  out->lambda_f = prep->lambda_f;

  /* Lateral-torsional buckling, F2.2; where Cb lifts the buckling strength past Mp,
   * yielding (F2-1) is what governs. */
  if (Lb <= out->Lp)
    {
      Mn = Mp;
      eq = "F2-1";
    }
  else if (Lb <= out->Lr)
    {
      Mn = Cb * (Mp - (Mp - My70) * (Lb - out->Lp) / (out->Lr - out->Lp));
      eq = "F2-2";
    }
  else
    {
      double jc = prep->jc;
      double s = Lb / prep->rts;
      double Fcr = Cb * G_PI * G_PI * prep->E / (s * s) * sqrt (1 + 0.078 * jc * s * s);

      Mn = Fcr * prep->Sx;
      eq = "F2-3";
    }
  if (Mn >= Mp)
    {
      Mn = Mp;
      eq = "F2-1";
    }

  if (prep->flb && prep->Mflb < Mn)
    {
      Mn = prep->Mflb;
      eq = prep->eq_flb;
    }

  out->Mn = Mn;
  out->equation = eq;
  return TRUE;
}

/**
 * trb_design_steel_shear:
 * @section: a W, S or custom I section
 * @grade: its steel
 * @out: (out): the nominal shear strength and its factors
 *
 * Vn = 0.6 Fy Aw Cv1 (AISC 360-16 Eq. G2-1), Aw = d tw. Webs of rolled I shapes with
 * h/tw <= 2.24 sqrt(E/Fy) take Cv1 = 1, phi 1.00, Omega 1.50 (G2.1(a)); all others phi 0.90,
 * Omega 1.67 and Cv1 by G2-3 or G2-4 with kv = 5.34 (unstiffened webs, G2.1(b)(2)).
 *
 * Returns: %FALSE (and @out zeroed) when the section is not one G2 covers here
 */
gboolean
trb_design_steel_shear (const TrbSection    *section,
                        const TrbSteelGrade *grade,
                        TrbSteelShear       *out)
{
  IProps p;
  double E, Fy;
  gboolean rolled;

  g_return_val_if_fail (section != NULL, FALSE);
  g_return_val_if_fail (grade != NULL, FALSE);
  g_return_val_if_fail (out != NULL, FALSE);

  memset (out, 0, sizeof *out);
  if (!get_i_props (section, &p))
    return FALSE;

  E = grade->E;
  Fy = grade->Fy;
  rolled = section->kind == TRB_SHAPE_W || section->kind == TRB_SHAPE_S;
  out->Aw = p.d * p.tw;
  out->h_tw = p.h_tw;

  if (rolled && p.h_tw <= 2.24 * sqrt (E / Fy))
    {
      out->Cv1 = 1.0;
      out->phi = 1.00;
      out->omega = 1.50;
      out->provision = "G2.1(a)";
    }
  else
    {
      const double kv = 5.34;
      double lim = 1.10 * sqrt (kv * E / Fy);

      out->phi = 0.90;
      out->omega = 1.67;
      if (p.h_tw <= lim)
        {
          out->Cv1 = 1.0;
          out->provision = "G2.1(b), Eq. G2-3";
        }
      else
        {
          out->Cv1 = lim / p.h_tw;
          out->provision = "G2.1(b), Eq. G2-4";
        }
    }

  out->Vn = 0.6 * Fy * out->Aw * out->Cv1;
  return TRUE;
}

/* ---- the member check ---- */

static double
abs_moment_at (const TrbBeamResult *result,
               double               x)
{
  double left, right;

  /* An applied moment makes M jump; take the side that gives the smaller, safer Cb. */
  trb_beam_result_value (result, x, TRB_BEAM_M, &left, &right);
  return MAX (fabs (left), fabs (right));
}

static int
compare_double (gconstpointer a,
                gconstpointer b)
{
  double da = *(const double *) a;
  double db = *(const double *) b;

  return (da > db) - (da < db);
}

static gboolean
is_braced_at (const TrbDesignInput *input,
              double                x,
              double                tol)
{
  for (guint i = 0; i < input->n_supports; i++)
    if (fabs (input->supports[i].x - x) <= tol)
      return TRUE;
  for (guint i = 0; i < input->n_braces; i++)
    if (fabs (input->brace_x[i] - x) <= tol)
      return TRUE;
  return FALSE;
}

/**
 * trb_design_steel_free_end:
 * @input: the member
 * @a: a segment's start (trb_design_steel_segment_points())
 * @b: its end
 *
 * Returns: whether an end of the segment is neither supported nor braced, so that the flexure
 *   check takes Cb = 1 on it
 */
gboolean
trb_design_steel_free_end (const TrbDesignInput *input,
                           double                a,
                           double                b)
{
  const double tol = 1e-9 * MAX (input->length, 1.0);

  return !is_braced_at (input, a, tol) || !is_braced_at (input, b, tol);
}

/**
 * trb_design_steel_segment_points:
 * @input: the member
 * @points: (out caller-allocates): room for 2 + n_supports + n_braces positions
 *
 * The ends of the unbraced segments: both member ends, every support and every brace point,
 * sorted, without repeats (within 1e-9 of the length).
 *
 * Returns: how many
 */
guint
trb_design_steel_segment_points (const TrbDesignInput *input,
                                 double               *points)
{
  const double tol = 1e-9 * MAX (input->length, 1.0);
  g_autofree double *pts = g_new (double, 2 + input->n_supports + input->n_braces);
  guint n = 0, out = 0;

  pts[n++] = 0;
  pts[n++] = input->length;
  for (guint i = 0; i < input->n_supports; i++)
    pts[n++] = input->supports[i].x;
  for (guint i = 0; i < input->n_braces; i++)
    pts[n++] = CLAMP (input->brace_x[i], 0, input->length);
  qsort (pts, n, sizeof (double), compare_double);

  for (guint i = 0; i < n; i++)
    if (out == 0 || pts[i] - points[out - 1] > tol)
      points[out++] = pts[i];
  return out;
}

static GArray *
segment_points (const TrbDesignInput *input)
{
  GArray *out = g_array_sized_new (FALSE, FALSE, sizeof (double),
                                   2 + input->n_supports + input->n_braces);

  g_array_set_size (out, 2 + input->n_supports + input->n_braces);
  g_array_set_size (out, trb_design_steel_segment_points (input, (double *) out->data));
  return out;
}

/* One candidate for the governing flexure check. */
typedef struct
{
  gboolean        have;
  double          ratio;
  double          demand;
  double          capacity;
  double          x;
  gboolean        braced;   /* the compression flange braced throughout (Lb = 0) */
  TrbSteelFlexure flex;
  const char     *combination;
} FlexureCandidate;

static void
consider_flexure (FlexureCandidate      *best,
                  double                 demand,
                  double                 x,
                  const TrbSteelFlexure *flex,
                  gboolean               braced,
                  TrbDesignBasis         basis,
                  const char            *combination)
{
  double capacity = basis == TRB_DESIGN_BASIS_LRFD
                    ? TRB_STEEL_PHI_B * flex->Mn
                    : flex->Mn / TRB_STEEL_OMEGA_B;
  double ratio = capacity > 0 ? demand / capacity : (demand > 0 ? INFINITY : 0);

  if (best->have && !(ratio > best->ratio))
    return;

  best->have = TRUE;
  best->ratio = ratio;
  best->demand = demand;
  best->capacity = capacity;
  best->x = x;
  best->braced = braced;
  best->flex = *flex;
  best->combination = combination;
}

/* Cb (F1-1) of the segment from a, Lb long, whose largest moment is m_abs */
static double
segment_cb (const TrbBeamResult *result,
            double               a,
            double               Lb,
            double               m_abs)
{
  return trb_design_steel_cb (m_abs,
                              abs_moment_at (result, a + 0.25 * Lb),
                              abs_moment_at (result, a + 0.50 * Lb),
                              abs_moment_at (result, a + 0.75 * Lb));
}

/* Whether a demand over a segment of length Lb certainly cannot become the governing flexure
 * check: its ratio at Cb = 1 is below the best one's by more than rounding. Cb is at least 1
 * (trb_design_steel_cb(), to a few ulps) and Mn grows with Cb, so no Cb gives a larger ratio;
 * consider_flexure() keeps the best on a tie, so the check is the same without the quarter
 * point moments of such a segment (six evaluations of the beam). */
static gboolean
cannot_govern (const FlexureCandidate    *best,
               double                     demand,
               const TrbSteelFlexurePrep *prep,
               double                     Lb,
               TrbDesignBasis             basis)
{
  TrbSteelFlexure flex;
  double capacity;

  if (!best->have || !(best->ratio > 0) || !isfinite (best->ratio))
    return FALSE;
  trb_design_steel_flexure_at (prep, Lb, 1.0, &flex);
  capacity = basis == TRB_DESIGN_BASIS_LRFD ? TRB_STEEL_PHI_B * flex.Mn
                                            : flex.Mn / TRB_STEEL_OMEGA_B;
  if (!(capacity > 0) || !isfinite (capacity))
    return FALSE;
  return demand / capacity * (1 + 1e-9) < best->ratio;
}

static void
check_flexure (const TrbDesignInput *input,
               const TrbSteelGrade  *grade,
               TrbDesignBasis        basis,
               GArray               *checks)
{
  const TrbSection *section = input->section;
  const double tol = 1e-9 * MAX (input->length, 1.0);
  gboolean si = input->units == TRB_UNIT_SYSTEM_SI;
  const char *len_unit = si ? "m" : "ft";
  g_autoptr(GArray) pts = NULL;
  FlexureCandidate best = { 0, };
  TrbSteelFlexure braced_flex;
  TrbSteelFlexurePrep prep;
  TrbCheck check;
  char clause[48];
  char lb[24], lp[24], lr[24], mn[24];

  /* the section's own values once, for every segment and combination */
  trb_design_steel_flexure_prepare (section, grade, &prep);
  if (!trb_design_steel_flexure_at (&prep, 0, 1, &braced_flex))
    {
      trb_check_append_not_checked (checks, "AISC 360-16 F4, F5",
                                    "Flexure: web not compact for flexure (F4, F5 not "
                                    "implemented)");
      return;
    }

  pts = segment_points (input);
  for (guint i = 0; i + 1 < pts->len; i++)
    {
      double a = g_array_index (pts, double, i);
      double b = g_array_index (pts, double, i + 1);
      double Lb = b - a;
      /* An end that is neither supported nor braced is the free end of a cantilever: Cb = 1
       * there (Specification Commentary to F1), since F1-1 assumes both ends are braced. */
      gboolean free_end = !is_braced_at (input, a, tol) || !is_braced_at (input, b, tol);

      for (guint c = 0; c < input->n_combos; c++)
        {
          const TrbDemandCombo *combo = &input->combos[c];
          TrbBeamExtremes ext;
          double m_pos, m_neg, m_abs, x_abs, Cb;
          TrbSteelFlexure flex;

          if (combo->result == NULL)
            continue;

          if (combo->seg_ext != NULL && combo->n_seg_ext + 1 == pts->len)
            ext = combo->seg_ext[i];
          else
            trb_beam_result_extremes (combo->result, a, b, &ext);
          m_pos = MAX (ext.M_max, 0);
          m_neg = MAX (-ext.M_min, 0);
          m_abs = MAX (m_pos, m_neg);
          /* round-off at a pinned end is not hogging */
          if (m_neg <= 1e-9 * m_abs)
            m_neg = 0;
          x_abs = m_pos >= m_neg ? ext.M_max_x : ext.M_min_x;

          if (input->bracing == TRB_BRACING_POINTS)
            {
              if (cannot_govern (&best, m_abs, &prep, Lb, basis))
                continue;
              Cb = free_end ? 1.0 : segment_cb (combo->result, a, Lb, m_abs);
              trb_design_steel_flexure_at (&prep, Lb, Cb, &flex);
              consider_flexure (&best, m_abs, x_abs, &flex, FALSE, basis, combo->name);
            }
          else
            {
              /* Deck or sheathing on the top flange braces it throughout: sagging moment
               * (top flange in compression) meets Lb = 0. Hogging moment puts the bottom
               * flange in compression, and that is held only at supports and brace points:
               * it meets the full segment length, with Cb of the segment's own diagram. */
              consider_flexure (&best, m_pos, ext.M_max_x, &braced_flex, TRUE, basis,
                                combo->name);
              if (m_neg > 0 && !cannot_govern (&best, m_neg, &prep, Lb, basis))
                {
                  Cb = free_end ? 1.0 : segment_cb (combo->result, a, Lb, m_abs);
                  trb_design_steel_flexure_at (&prep, Lb, Cb, &flex);
                  consider_flexure (&best, m_neg, ext.M_min_x, &flex, FALSE, basis,
                                    combo->name);
                }
            }
        }
    }

  if (!best.have)
    {
      trb_check_append_not_checked (checks, "AISC 360-16 Ch. F",
                                    "Flexure: no load combination to check");
      return;
    }

  /* the texts joined without a printf: the same bytes, truncated alike */
  g_strlcpy (clause, "AISC 360-16 Eq. ", sizeof clause);
  g_strlcat (clause, best.flex.equation, sizeof clause);
  trb_check_set (&check, "Flexure", clause, TRB_DIM_MOMENT, best.demand, best.capacity,
                 best.combination, best.x);
  if (input->no_detail)
    {
      g_array_append_val (checks, check);
      return;
    }

  trb_design_format (lp, sizeof lp, best.flex.Lp, len_unit);
  trb_design_format (lr, sizeof lr, best.flex.Lr, len_unit);
  trb_design_format (mn, sizeof mn, best.flex.Mn, si ? "kN-m" : "kip-ft");
  if (best.braced)
    g_strlcpy (check.detail, "Lb = 0 (braced), Lp = ", sizeof check.detail);
  else
    {
      char cb[48];

      /* "Lb = %s, Cb = %.2f, Lp = %s ..." */
      g_strlcpy (check.detail, "Lb = ", sizeof check.detail);
      g_strlcat (check.detail, trb_design_format (lb, sizeof lb, best.flex.Lb, len_unit),
                 sizeof check.detail);
      g_strlcat (check.detail, ", Cb = ", sizeof check.detail);
      g_strlcat (check.detail, trb_design_print_fixed (cb, sizeof cb, best.flex.Cb, 2),
                 sizeof check.detail);
      g_strlcat (check.detail, ", Lp = ", sizeof check.detail);
    }
  g_strlcat (check.detail, lp, sizeof check.detail);
  g_strlcat (check.detail, ", Lr = ", sizeof check.detail);
  g_strlcat (check.detail, lr, sizeof check.detail);
  g_strlcat (check.detail, ", Mn = ", sizeof check.detail);
  g_strlcat (check.detail, mn, sizeof check.detail);
  if (g_str_has_prefix (best.flex.equation, "F3"))
    {
      char flange[24], lf[48];

      /* ", bf/2tf = %.2f" */
      g_strlcpy (flange, ", bf/2tf = ", sizeof flange);
      g_strlcat (flange, trb_design_print_fixed (lf, sizeof lf, best.flex.lambda_f, 2),
                 sizeof flange);
      g_strlcat (check.detail, flange, sizeof check.detail);
    }

  g_array_append_val (checks, check);
}

static void
check_shear (const TrbDesignInput *input,
             const TrbSteelGrade  *grade,
             TrbDesignBasis        basis,
             GArray               *checks)
{
  gboolean si = input->units == TRB_UNIT_SYSTEM_SI;
  TrbSteelShear shear;
  TrbCheck check;
  double capacity;
  double best_v = -1, best_x = 0;
  const char *best_combo = NULL;
  char clause[48];
  char vn[24], aw[24];

  if (!trb_design_steel_shear (input->section, grade, &shear))
    {
      trb_check_append_not_checked (checks, "AISC 360-16 G2", "Shear: not an I shape");
      return;
    }
  capacity = basis == TRB_DESIGN_BASIS_LRFD ? shear.phi * shear.Vn : shear.Vn / shear.omega;

  for (guint c = 0; c < input->n_combos; c++)
    {
      const TrbDemandCombo *combo = &input->combos[c];
      TrbBeamExtremes ext;
      double v, x;

      if (combo->result == NULL)
        continue;
      if (combo->ext != NULL)
        ext = *combo->ext;
      else
        trb_beam_result_extremes (combo->result, 0, input->length, &ext);
      if (fabs (ext.V_max) >= fabs (ext.V_min))
        {
          v = fabs (ext.V_max);
          x = ext.V_max_x;
        }
      else
        {
          v = fabs (ext.V_min);
          x = ext.V_min_x;
        }
      if (v > best_v)
        {
          best_v = v;
          best_x = x;
          best_combo = combo->name;
        }
    }

  if (best_combo == NULL)
    {
      trb_check_append_not_checked (checks, "AISC 360-16 G2",
                                    "Shear: no load combination to check");
      return;
    }

  g_strlcpy (clause, "AISC 360-16 Eq. G2-1, ", sizeof clause);
  g_strlcat (clause, shear.provision, sizeof clause);
  trb_check_set (&check, "Shear", clause, TRB_DIM_FORCE, best_v, capacity, best_combo,
                 best_x);
  if (!input->no_detail)
    {
      char num[48];

      /* "Vn = %s, Aw = d tw = %s, h/tw = %.1f, Cv1 = %.2f", joined without a printf */
      g_strlcpy (check.detail, "Vn = ", sizeof check.detail);
      g_strlcat (check.detail, trb_design_format (vn, sizeof vn, shear.Vn, si ? "kN" : "kip"),
                 sizeof check.detail);
      g_strlcat (check.detail, ", Aw = d tw = ", sizeof check.detail);
      g_strlcat (check.detail, trb_design_format (aw, sizeof aw, shear.Aw, si ? "mm2" : "in2"),
                 sizeof check.detail);
      g_strlcat (check.detail, ", h/tw = ", sizeof check.detail);
      g_strlcat (check.detail, trb_design_print_fixed (num, sizeof num, shear.h_tw, 1),
                 sizeof check.detail);
      g_strlcat (check.detail, ", Cv1 = ", sizeof check.detail);
      g_strlcat (check.detail, trb_design_print_fixed (num, sizeof num, shear.Cv1, 2),
                 sizeof check.detail);
    }
  g_array_append_val (checks, check);
}

/**
 * trb_design_steel_check:
 * @input: the member, its section and its responses
 * @grade: the steel
 * @basis: ASD (the combinations are service-level, capacities Rn / Omega) or LRFD (factored
 *   combinations, capacities phi Rn)
 * @checks: (element-type TrbCheck): where the checks are appended
 *
 * Checks a W, S or custom I section to AISC 360-16: "Flexure" (F2, F3) over every unbraced
 * segment and combination, "Shear" (G2.1) over every combination, each reported once where
 * its ratio is highest; then the deflection checks (trb_design_check_deflection()).
 *
 * Unbraced segments run between supports and brace points. With %TRB_BRACING_CONTINUOUS the
 * top flange is held throughout, so sagging moment meets Lb = 0; hogging moment (over
 * interior supports, on overhangs) puts the bottom flange in compression, braced only at
 * supports and brace points. Cb is F1-1 on each segment's own diagram, 1.0 on a segment
 * that ends at an unbraced free end.
 *
 * Other sections (channels, tubes, timber) get a "Not checked" entry: never a pass.
 *
 * Returns: %TRUE when every strength check was made, %FALSE when the section (or part of
 * it) is not designed by this method
 */
gboolean
trb_design_steel_check (const TrbDesignInput *input,
                        const TrbSteelGrade  *grade,
                        TrbDesignBasis        basis,
                        GArray               *checks)
{
  guint n_before;
  gboolean designed = TRUE;

  g_return_val_if_fail (input != NULL, FALSE);
  g_return_val_if_fail (input->section != NULL, FALSE);
  g_return_val_if_fail (input->n_combos == 0 || input->combos != NULL, FALSE);
  g_return_val_if_fail (input->n_supports == 0 || input->supports != NULL, FALSE);
  g_return_val_if_fail (input->n_braces == 0 || input->brace_x != NULL, FALSE);
  g_return_val_if_fail (grade != NULL, FALSE);
  g_return_val_if_fail (checks != NULL, FALSE);
  g_return_val_if_fail (g_array_get_element_size (checks) == sizeof (TrbCheck), FALSE);

  n_before = checks->len;
  if (!trb_design_steel_covers (input->section))
    {
      char detail[96];

      g_snprintf (detail, sizeof detail,
                  "%s: only W, S and I shapes are designed to AISC 360 here",
                  input->section->designation[0] != '\0'
                  ? input->section->designation : "this section");
      trb_check_append_not_checked (checks, "AISC 360-16 Ch. F, G", detail);
      designed = FALSE;
    }
  else
    {
      check_flexure (input, grade, basis, checks);
      check_shear (input, grade, basis, checks);
      for (guint i = n_before; i < checks->len; i++)
        if (isnan (g_array_index (checks, TrbCheck, i).ratio))
          designed = FALSE;
    }

  trb_design_check_deflection (input, checks);
  return designed;
}
