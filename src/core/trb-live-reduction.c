/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-live-reduction.h"

#include "trb-error.h"

#include <math.h>

/* Exact by definition (international foot and pound, 1959); kept here so that the module
 * stands alone. */
#define FT  0.3048
#define FT2 (FT * FT)
#define PSF (4.4482216152605 / FT2)

/* Comparisons with the code's thresholds (400 ft^2, 100 psf, 12 psf) allow for the rounding
 * of a value converted from SI and back: 900 ft^2 entered as 83.612736 m^2 is still 900. */
#define SLACK 1e-9

/**
 * trb_live_k_ll:
 * @member: the kind of member
 *
 * The live load element factor of ASCE 7-16 Table 4.7-1 (from memory).
 *
 * Returns: K_LL
 */
double
trb_live_k_ll (TrbLiveMember member)
{
  switch (member)
    {
    case TRB_LIVE_MEMBER_INTERIOR_COLUMN:
    case TRB_LIVE_MEMBER_EXTERIOR_COLUMN:
      return 4.0;
    case TRB_LIVE_MEMBER_EDGE_COLUMN_CANTILEVER:
      return 3.0;
    case TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER:
    case TRB_LIVE_MEMBER_EDGE_BEAM:
    case TRB_LIVE_MEMBER_INTERIOR_BEAM:
      return 2.0;
    case TRB_LIVE_MEMBER_OTHER:
    default:
      return 1.0;
    }
}

const char *
trb_live_rule_describe (TrbLiveRule rule)
{
  switch (rule)
    {
    case TRB_LIVE_RULE_SMALL_AREA:
      return "not reduced: K_LL A_T below 400 ft² (ASCE 7-16 §4.7.2)";
    case TRB_LIVE_RULE_EQUATION:
      return "L = Lo (0.25 + 15/√(K_LL A_T)) (ASCE 7-16 Eq. 4.7-1)";
    case TRB_LIVE_RULE_ONE_FLOOR_LIMIT:
      return "0.50 Lo, the least for a member supporting one floor (ASCE 7-16 §4.7.2)";
    case TRB_LIVE_RULE_FLOORS_LIMIT:
      return "0.40 Lo, the least for a member supporting two or more floors (ASCE 7-16 §4.7.2)";
    case TRB_LIVE_RULE_HEAVY:
      return "not reduced: Lo above 100 psf (ASCE 7-16 §4.7.3)";
    case TRB_LIVE_RULE_HEAVY_FLOORS:
      return "Lo above 100 psf, two or more floors: reduced by 20 % at most (ASCE 7-16 §4.7.3)";
    case TRB_LIVE_RULE_GARAGE:
      return "not reduced: passenger vehicle garage (ASCE 7-16 §4.7.4)";
    case TRB_LIVE_RULE_GARAGE_FLOORS:
      return "garage, two or more floors: reduced by 20 % at most (ASCE 7-16 §4.7.4)";
    case TRB_LIVE_RULE_ASSEMBLY:
      return "not reduced: assembly use with Lo of 100 psf or less (ASCE 7-16 §4.7.5)";
    case TRB_LIVE_RULE_ROOF_SMALL:
      return "not reduced: R1 R2 = 1 (ASCE 7-16 Eq. 4.8-1)";
    case TRB_LIVE_RULE_ROOF_EQUATION:
      return "Lr = Lo R1 R2 (ASCE 7-16 Eq. 4.8-1)";
    case TRB_LIVE_RULE_ROOF_MINIMUM:
      return "12 psf, the least roof live load (ASCE 7-16 §4.8.2)";
    default:
      return "unknown rule";
    }
}

/* §4.7.2: Eq. 4.7-1 where K_LL A_T >= 400 ft^2, and its lower limits. */
static double
basic_factor (double       k_ll,
              double       area_ft2,
              guint        floors,
              TrbLiveRule *rule)
{
  double ka = k_ll * area_ft2;
  double limit = floors >= 2 ? 0.40 : 0.50;
  double f;

  if (ka < 400.0 * (1.0 - SLACK))
    {
      *rule = TRB_LIVE_RULE_SMALL_AREA;
      return 1.0;
    }
  /* 0.25 + 15/20 = 1.00 at 400 ft^2; the MIN only absorbs the rounding there */
  f = MIN (0.25 + 15.0 / sqrt (ka), 1.0);
  if (f <= limit * (1.0 + SLACK))
    {
      *rule = floors >= 2 ? TRB_LIVE_RULE_FLOORS_LIMIT : TRB_LIVE_RULE_ONE_FLOOR_LIMIT;
      return limit;
    }
  *rule = TRB_LIVE_RULE_EQUATION;
  return f;
}

/**
 * trb_live_reduction_floor:
 * @Lo: the unreduced floor live load, Pa
 * @area: the member's tributary area A_T, m^2
 * @member: the kind of member (Table 4.7-1)
 * @floors: how many floors the member supports, 1 or more
 * @occupancy: ordinary, passenger vehicle garage or assembly
 * @out: (out): the reduced load, its factor and the rule that set it
 * @error: return location for a #GError
 *
 * ASCE 7-16 §4.7 (from memory): Eq. 4.7-1 where K_LL A_T >= 400 ft^2, not below 0.50 Lo (one
 * floor) or 0.40 Lo (two or more); no reduction for Lo above 100 psf (§4.7.3), in passenger
 * vehicle garages (§4.7.4) or in assembly uses with Lo of 100 psf or less (§4.7.5); under
 * §4.7.3 and §4.7.4 a member supporting two or more floors may take up to 20 %, but no more
 * than §4.7.2 gives.
 *
 * Returns: %FALSE with %TRB_ERROR_INVALID for a negative or non-finite load or area, or no
 *   floors
 */
gboolean
trb_live_reduction_floor (double             Lo,
                          double             area,
                          TrbLiveMember      member,
                          guint              floors,
                          TrbLiveOccupancy   occupancy,
                          TrbLiveReduction  *out,
                          GError           **error)
{
  TrbLiveRule rule;
  double f;

  g_return_val_if_fail (out != NULL, FALSE);

  if (!isfinite (Lo) || Lo < 0 || !isfinite (area) || area < 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "live load reduction needs a live load and an area of zero or more");
      return FALSE;
    }
  if (floors < 1)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "live load reduction needs the number of floors supported (1 or more)");
      return FALSE;
    }

  out->k_ll = trb_live_k_ll (member);
  out->R1 = 1.0;
  out->R2 = 1.0;

  f = basic_factor (out->k_ll, area / FT2, floors, &rule);

  if (occupancy == TRB_LIVE_OCCUPANCY_ASSEMBLY && Lo <= 100.0 * PSF * (1.0 + SLACK))
    {
      f = 1.0;
      rule = TRB_LIVE_RULE_ASSEMBLY;
    }
  else if (occupancy == TRB_LIVE_OCCUPANCY_GARAGE || Lo > 100.0 * PSF * (1.0 + SLACK))
    {
      gboolean garage = occupancy == TRB_LIVE_OCCUPANCY_GARAGE;

      if (floors < 2)
        {
          f = 1.0;
          rule = garage ? TRB_LIVE_RULE_GARAGE : TRB_LIVE_RULE_HEAVY;
        }
      else if (f < 0.80)
        {
          /* 20 % at most, and never below what §4.7.2 gives: that one is the larger here */
          f = 0.80;
          rule = garage ? TRB_LIVE_RULE_GARAGE_FLOORS : TRB_LIVE_RULE_HEAVY_FLOORS;
        }
    }

  out->factor = f;
  out->L = f * Lo;
  out->rule = rule;
  return TRUE;
}

/**
 * trb_live_reduction_roof:
 * @Lo: the unreduced roof live load, Pa (20 psf for ordinary roofs)
 * @area: the member's tributary area A_T, m^2
 * @slope: the roof's rise over run (F = 12 slope inches per foot; for an arch or dome pass
 *   32/12 times its rise-to-span ratio)
 * @out: (out): the reduced load, R1, R2 and the rule that set it
 * @error: return location for a #GError
 *
 * ASCE 7-16 Eq. 4.8-1 (from memory) for ordinary flat, pitched and curved roofs:
 * Lr = Lo R1 R2 with 12 <= Lr <= 20 psf; R1 = 1 for A_T <= 200 ft^2, 1.2 - 0.001 A_T up to
 * 600 ft^2, 0.6 beyond; R2 = 1 for F <= 4, 1.2 - 0.05 F up to 12, 0.6 beyond.
 *
 * Returns: %FALSE with %TRB_ERROR_INVALID for a negative or non-finite input, or Lo above
 *   20 psf (a special-purpose roof is reduced as a floor, §4.8.3)
 */
gboolean
trb_live_reduction_roof (double             Lo,
                         double             area,
                         double             slope,
                         TrbLiveReduction  *out,
                         GError           **error)
{
  double a = area / FT2;
  double F = 12.0 * fabs (slope);
  double R1, R2, L, minimum;

  g_return_val_if_fail (out != NULL, FALSE);

  if (!isfinite (Lo) || Lo < 0 || !isfinite (area) || area < 0 || !isfinite (slope))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "roof live load reduction needs a load, an area and a slope that are finite "
                   "and not negative");
      return FALSE;
    }
  if (Lo > 20.0 * PSF * (1.0 + SLACK))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "Eq. 4.8-1 is for ordinary roofs (Lo of 20 psf or less); a special-purpose "
                   "roof is reduced as a floor (ASCE 7-16 §4.8.3)");
      return FALSE;
    }

  if (a <= 200.0)
    R1 = 1.0;
  else if (a < 600.0)
    R1 = 1.2 - 0.001 * a;
  else
    R1 = 0.6;

  if (F <= 4.0)
    R2 = 1.0;
  else if (F < 12.0)
    R2 = 1.2 - 0.05 * F;
  else
    R2 = 0.6;

  L = Lo * R1 * R2;
  minimum = MIN (Lo, 12.0 * PSF);

  out->k_ll = 0.0;
  out->R1 = R1;
  out->R2 = R2;
  if (R1 * R2 >= 1.0)
    {
      out->rule = TRB_LIVE_RULE_ROOF_SMALL;
      L = Lo;
    }
  else if (L < minimum * (1.0 - SLACK))
    {
      out->rule = TRB_LIVE_RULE_ROOF_MINIMUM;
      L = minimum;
    }
  else
    out->rule = TRB_LIVE_RULE_ROOF_EQUATION;

  out->L = L;
  out->factor = Lo > 0 ? L / Lo : 1.0;
  return TRUE;
}
