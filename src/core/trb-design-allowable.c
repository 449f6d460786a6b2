/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-design-allowable.h"

#include "trb-beam.h"
#include "trb-units.h"

#include <math.h>

static gboolean
positive (double v)
{
  return isfinite (v) && v > 0;
}

/**
 * trb_design_allowable_shear_stress:
 * @section: a section
 * @V: the shear force, N
 * @formula: (out) (optional): the formula used, as text
 *
 * The average shear stress the classic method compares with Fv: on the web d tw of shapes
 * that have one (AISC ASD 9th ed. F4, from memory), on both webs of a rectangular tube with
 * h = d - 3t as AISC 360-16 G4 takes it where the corner radius is not known, and the peak
 * 1.5 V / A of a solid rectangle (NDS 2018 Eq. 3.4-2).
 *
 * Returns: the stress in Pa, or NAN when the section has neither a web nor an area
 */
double
trb_design_allowable_shear_stress (const TrbSection  *section,
                                   double             V,
                                   const char       **formula)
{
  const char *f = NULL;
  double fv = NAN;

  g_return_val_if_fail (section != NULL, NAN);

  V = fabs (V);
  switch (section->kind)
    {
    case TRB_SHAPE_W:
    case TRB_SHAPE_S:
    case TRB_SHAPE_C:
    case TRB_SHAPE_CUSTOM:
      if (positive (section->d) && positive (section->tw))
        {
          fv = V / (section->d * section->tw);
          f = "V/(d tw)";
        }
      else if (section->kind == TRB_SHAPE_CUSTOM && positive (section->A))
        {
          /* a custom section given by its area alone is taken as a solid rectangle */
          fv = 1.5 * V / section->A;
          f = "1.5 V/A";
        }
      break;

    case TRB_SHAPE_HSS_RECT:
      if (positive (section->d) && positive (section->tw) && section->d > 3 * section->tw)
        {
          fv = V / (2 * (section->d - 3 * section->tw) * section->tw);
          f = "V/(2 h t)";
        }
      break;

    case TRB_SHAPE_SAWN:
    case TRB_SHAPE_GLULAM:
      if (positive (section->A))
        {
          fv = 1.5 * V / section->A;
          f = "1.5 V/A";
        }
      break;

    default:
      break;
    }

  if (formula != NULL)
    *formula = f;
  return fv;
}

/**
 * trb_design_allowable_lightest:
 * @sections: (array length=n_sections): sections sorted by weight, lightest first
 * @n_sections: how many
 * @S_required: the section modulus needed, m^3
 *
 * Returns: the index of the lightest section with Sx >= @S_required, or -1
 */
int
trb_design_allowable_lightest (const TrbSection *sections,
                               guint             n_sections,
                               double            S_required)
{
  g_return_val_if_fail (n_sections == 0 || sections != NULL, -1);

  for (guint i = 0; i < n_sections; i++)
    if (positive (sections[i].Sx) && sections[i].Sx >= S_required)
      return (int) i;

  return -1;
}

/**
 * trb_design_allowable_lc:
 * @section: an I shape with d, bf and tf
 * @Fy: the yield stress, Pa
 *
 * Returns: Lc (AISC ASD 9th ed. F1.1, from memory) in m, or NAN without the dimensions
 */
double
trb_design_allowable_lc (const TrbSection *section,
                         double            Fy)
{
  double fy_ksi, bf_in, d_in, af_in2, lc_in;

  g_return_val_if_fail (section != NULL, NAN);

  if (!positive (section->d) || !positive (section->bf) || !positive (section->tf)
      || !positive (Fy))
    return NAN;

  /* The 1989 formula is dimensional (ksi and inches); convert at the edge. */
  fy_ksi = Fy / TRB_KSI;
  bf_in = section->bf / TRB_IN;
  d_in = section->d / TRB_IN;
  af_in2 = bf_in * section->tf / TRB_IN;
  lc_in = MIN (76 * bf_in / sqrt (fy_ksi), 20000 / ((d_in / af_in2) * fy_ksi));

  return lc_in * TRB_IN;
}

static const char *
stress_unit (const TrbDesignInput *input,
             double                allowable)
{
  if (input->units == TRB_UNIT_SYSTEM_SI)
    return "MPa";
  switch (input->section->kind)
    {
    case TRB_SHAPE_SAWN:
    case TRB_SHAPE_GLULAM:
      return "psi";
    case TRB_SHAPE_W:
    case TRB_SHAPE_S:
    case TRB_SHAPE_C:
    case TRB_SHAPE_HSS_RECT:
      return "ksi";
    default:
      /* a custom section: the unit its allowable stress reads best in */
      return allowable >= 10 * TRB_KSI ? "ksi" : "psi";
    }
}

/* The largest |M| and |V| over the member and over every combination, with where and in which
 * combination they occur. */
typedef struct
{
  double      value;
  double      x;
  const char *combination;
} Peak;

static void
find_peaks (const TrbDesignInput *input,
            Peak                 *moment,
            Peak                 *shear)
{
  moment->value = shear->value = -1;
  moment->combination = shear->combination = NULL;

  for (guint c = 0; c < input->n_combos; c++)
    {
      const TrbDemandCombo *combo = &input->combos[c];
      TrbBeamExtremes ext;
      double m, mx, v, vx;

      if (combo->result == NULL)
        continue;
      if (combo->ext != NULL)
        ext = *combo->ext;
      else
        trb_beam_result_extremes (combo->result, 0, input->length, &ext);

      m = fabs (ext.M_max) >= fabs (ext.M_min) ? fabs (ext.M_max) : fabs (ext.M_min);
      mx = fabs (ext.M_max) >= fabs (ext.M_min) ? ext.M_max_x : ext.M_min_x;
      v = fabs (ext.V_max) >= fabs (ext.V_min) ? fabs (ext.V_max) : fabs (ext.V_min);
      vx = fabs (ext.V_max) >= fabs (ext.V_min) ? ext.V_max_x : ext.V_min_x;

      if (m > moment->value)
        {
          moment->value = m;
          moment->x = mx;
          moment->combination = combo->name;
        }
      if (v > shear->value)
        {
          shear->value = v;
          shear->x = vx;
          shear->combination = combo->name;
        }
    }
}

/**
 * trb_design_allowable_check:
 * @input: the member, its section and its service responses
 * @Fb: the allowable bending stress, Pa (the engineer's; 0 when not given)
 * @Fv: the allowable shear stress, Pa (likewise)
 * @checks: (element-type TrbCheck): where the checks are appended
 *
 * "Section modulus": S_req = M / Fb against Sx, the governing moment being the largest |M|
 * of every service combination; the detail gives fb = M / Sx beside Fb, so the same check
 * reads either way. "Web shear": fv (trb_design_allowable_shear_stress()) against Fv. Then the
 * deflection checks (trb_design_check_deflection()).
 *
 * Returns: %TRUE when both stress checks were made
 */
gboolean
trb_design_allowable_check (const TrbDesignInput *input,
                            double                Fb,
                            double                Fv,
                            GArray               *checks)
{
  const TrbSection *section;
  gboolean si;
  gboolean designed = TRUE;
  Peak moment, shear;

  g_return_val_if_fail (input != NULL, FALSE);
  g_return_val_if_fail (input->section != NULL, FALSE);
  g_return_val_if_fail (input->n_combos == 0 || input->combos != NULL, FALSE);
  g_return_val_if_fail (checks != NULL, FALSE);
  g_return_val_if_fail (g_array_get_element_size (checks) == sizeof (TrbCheck), FALSE);

  section = input->section;
  si = input->units == TRB_UNIT_SYSTEM_SI;
  find_peaks (input, &moment, &shear);

  if (moment.combination == NULL)
    {
      trb_check_append_not_checked (checks, "Allowable stress",
                                    "No service combination to check");
      trb_design_check_deflection (input, checks);
      return FALSE;
    }

  /* Bending */
  if (!positive (Fb))
    {
      trb_check_append_not_checked (checks, "Allowable stress, fb = M/S ≤ Fb",
                                    "Section modulus: no allowable bending stress Fb given");
      designed = FALSE;
    }
  else if (!positive (section->Sx))
    {
      trb_check_append_not_checked (checks, "Allowable stress, fb = M/S ≤ Fb",
                                    "Section modulus: the section has no Sx");
      designed = FALSE;
    }
  else
    {
      const char *su = stress_unit (input, Fb);
      TrbCheck check;
      char m[24], fb[24], fb_allow[24];

      trb_check_set (&check, "Section modulus", "Allowable stress, fb = M/S ≤ Fb",
                     TRB_DIM_SECTION_MODULUS, moment.value / Fb, section->Sx,
                     moment.combination, moment.x);
      if (!input->no_detail)
        g_snprintf (check.detail, sizeof check.detail, "M = %s, fb = M/S = %s, Fb = %s",
                    trb_design_format (m, sizeof m, moment.value, si ? "kN-m" : "kip-ft"),
                    trb_design_format (fb, sizeof fb, moment.value / section->Sx, su),
                    trb_design_format (fb_allow, sizeof fb_allow, Fb, su));
      g_array_append_val (checks, check);
    }

  /* Shear */
  if (!positive (Fv))
    {
      trb_check_append_not_checked (checks, "Allowable stress, fv ≤ Fv",
                                    "Web shear: no allowable shear stress Fv given");
      designed = FALSE;
    }
  else
    {
      const char *formula = NULL;
      double fv = trb_design_allowable_shear_stress (section, shear.value, &formula);

      if (isnan (fv))
        {
          trb_check_append_not_checked (checks, "Allowable stress, fv ≤ Fv",
                                        "Web shear: the section has neither d and tw nor A");
          designed = FALSE;
        }
      else
        {
          const char *su = stress_unit (input, Fv);
          TrbCheck check;
          char v[24], fv_text[24], fv_allow[24];

          trb_check_set (&check, "Web shear", "Allowable stress, fv ≤ Fv", TRB_DIM_STRESS,
                         fv, Fv, shear.combination, shear.x);
          if (!input->no_detail)
            g_snprintf (check.detail, sizeof check.detail, "V = %s, fv = %s = %s, Fv = %s",
                        trb_design_format (v, sizeof v, shear.value, si ? "kN" : "kip"),
                        formula,
                        trb_design_format (fv_text, sizeof fv_text, fv, su),
                        trb_design_format (fv_allow, sizeof fv_allow, Fv, su));
          g_array_append_val (checks, check);
        }
    }

  trb_design_check_deflection (input, checks);
  return designed;
}
