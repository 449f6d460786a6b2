/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-error.h"
#include "trb-live-reduction.h"

#include <math.h>

/* Exact by definition (1959); the module under test keeps its own copy. */
#define FT  0.3048
#define FT2 (FT * FT)
#define PSF (4.4482216152605 / FT2)

/* A value printed to 0.01 psf in the check list is matched to half that. */
#define PRINTED 0.005

static void
reduce (double            Lo_psf,
        double            area_ft2,
        TrbLiveMember     member,
        guint             floors,
        TrbLiveOccupancy  occupancy,
        TrbLiveReduction *out)
{
  g_autoptr(GError) error = NULL;
  gboolean ok = trb_live_reduction_floor (Lo_psf * PSF, area_ft2 * FT2, member, floors,
                                          occupancy, out, &error);

  g_assert_no_error (error);
  g_assert_true (ok);
}

static void
test_k_ll (void)
{
  /* ASCE 7-16 Table 4.7-1 (from memory), as listed in ENGINEERING.md §1.4 */
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_INTERIOR_COLUMN), ==, 4.0);
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_EXTERIOR_COLUMN), ==, 4.0);
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_EDGE_COLUMN_CANTILEVER), ==, 3.0);
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER), ==, 2.0);
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_EDGE_BEAM), ==, 2.0);
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_INTERIOR_BEAM), ==, 2.0);
  g_assert_cmpfloat (trb_live_k_ll (TRB_LIVE_MEMBER_OTHER), ==, 1.0);
}

/* ENGINEERING.md §8 item 3: office, Lo = 50 psf (ASCE 7-16 Table 4.3-1, from memory), each
 * value by Eq. 4.7-1 (from memory). */
static void
test_office (void)
{
  TrbLiveReduction r;

  /* beam, A_T = 160 ft^2: K_LL A_T = 2 x 160 = 320 < 400, not reduced: 50.0 psf */
  reduce (50, 160, TRB_LIVE_MEMBER_INTERIOR_BEAM, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 50.0, PRINTED);
  g_assert_cmpfloat_with_epsilon (r.factor, 1.0, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_SMALL_AREA);

  /* girder, A_T = 480: 50 (0.25 + 15/sqrt(960)) = 50 x 0.73412 = 36.71 psf */
  reduce (50, 480, TRB_LIVE_MEMBER_INTERIOR_BEAM, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 36.71, PRINTED);
  g_assert_cmpfloat_with_epsilon (r.k_ll, 2.0, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_EQUATION);

  /* interior column, A_T = 480, one floor: 50 (0.25 + 15/sqrt(1920)) = 29.62 psf */
  reduce (50, 480, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 29.62, PRINTED);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_EQUATION);

  /* the same column carrying three floors, A_T = 1440: 50 (0.25 + 15/sqrt(5760)) = 22.38 psf,
   * above the 0.40 Lo = 20 psf limit */
  reduce (50, 1440, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 3, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 22.38, PRINTED);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_EQUATION);

  /* interior column of a 30 x 30 ft bay, one floor: K_LL A_T = 3600, 0.25 + 15/60 = 0.50,
   * at the 0.50 Lo limit: 25.00 psf */
  reduce (50, 30.0 * 30.0, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 1, TRB_LIVE_OCCUPANCY_ORDINARY,
          &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 25.00, PRINTED);
  g_assert_cmpfloat_with_epsilon (r.factor, 0.50, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ONE_FLOOR_LIMIT);
}

static void
test_limits (void)
{
  TrbLiveReduction r;

  /* ASCE 7-16 §4.7.2 (from memory): not below 0.40 Lo for two or more floors. Interior column,
   * three floors, A_T = 10,000 ft^2: 0.25 + 15/sqrt(40,000) = 0.325 < 0.40, so 0.40 x 50 =
   * 20 psf */
  reduce (50, 10000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 3, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.factor, 0.40, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_FLOORS_LIMIT);

  /* two floors are "two or more" (§4.7.2): 0.40 as well */
  reduce (50, 10000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 2, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.factor, 0.40, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_FLOORS_LIMIT);

  /* the same with one floor stops at 0.50 (§4.7.2) */
  reduce (50, 10000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.factor, 0.50, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ONE_FLOOR_LIMIT);

  /* the threshold itself, K_LL A_T = 400 ft^2 (§4.7.2 "400 or more"): K_LL = 1, A_T = 400:
   * 0.25 + 15/20 = 1.00, reduced by nothing but by the equation */
  reduce (50, 400, TRB_LIVE_MEMBER_OTHER, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.factor, 1.0, 1e-12);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_EQUATION);

  /* just below it: A_T = 399 ft^2, K_LL = 1, not reduced (§4.7.2) */
  reduce (50, 399, TRB_LIVE_MEMBER_OTHER, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_SMALL_AREA);

  /* a member of the "all other" row (K_LL = 1), A_T = 900 ft^2:
   * 0.25 + 15/sqrt(900) = 0.75 (Eq. 4.7-1, Table 4.7-1) */
  reduce (50, 900, TRB_LIVE_MEMBER_OTHER, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.factor, 0.75, 1e-12);
}

static void
test_heavy (void)
{
  TrbLiveReduction r;

  /* ASCE 7-16 §4.7.3 (from memory): Lo above 100 psf is not reduced. Light storage,
   * Lo = 125 psf (Table 4.3-1, from memory), interior column, A_T = 1000 ft^2, one floor */
  reduce (125, 1000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 125.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_HEAVY);

  /* two floors: 20 % at most, and not below §4.7.2's 0.25 + 15/sqrt(4000) = 0.487, so
   * 0.80 x 125 = 100 psf */
  reduce (125, 1000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 2, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 100.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_HEAVY_FLOORS);

  /* two floors, small area: §4.7.2 gives 0.25 + 15/sqrt(4 x 110) = 0.9651 > 0.80, which
   * governs: 125 x 0.9651 = 120.64 psf */
  reduce (125, 110, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 2, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 120.64, PRINTED);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_EQUATION);

  /* exactly 100 psf is not "above 100" (§4.7.3): office lobby, Lo = 100 psf (Table 4.3-1,
   * from memory), interior column A_T = 480: 100 (0.25 + 15/sqrt(1920)) = 59.23 psf */
  reduce (100, 480, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 1, TRB_LIVE_OCCUPANCY_ORDINARY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 59.23, PRINTED);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_EQUATION);
}

static void
test_garage_assembly (void)
{
  TrbLiveReduction r;

  /* ASCE 7-16 §4.7.4 (from memory): passenger vehicle garages, Lo = 40 psf (Table 4.3-1,
   * from memory), not reduced for one floor ... */
  reduce (40, 1000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 1, TRB_LIVE_OCCUPANCY_GARAGE, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 40.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_GARAGE);

  /* ... and by 20 % at most for two or more: 0.80 x 40 = 32 psf */
  reduce (40, 1000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 2, TRB_LIVE_OCCUPANCY_GARAGE, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 32.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_GARAGE_FLOORS);

  /* §4.7.5 (from memory): assembly uses with Lo of 100 psf or less are not reduced, however
   * many floors: lobbies, 100 psf (Table 4.3-1, from memory) */
  reduce (100, 1000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 3, TRB_LIVE_OCCUPANCY_ASSEMBLY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 100.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ASSEMBLY);

  /* a stage, 150 psf (Table 4.3-1, from memory), falls under §4.7.3 instead: two floors take
   * 20 %: 0.80 x 150 = 120 psf */
  reduce (150, 1000, TRB_LIVE_MEMBER_INTERIOR_COLUMN, 2, TRB_LIVE_OCCUPANCY_ASSEMBLY, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 120.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_HEAVY_FLOORS);
}

static void
roof (double            area_ft2,
      double            slope,
      TrbLiveReduction *out)
{
  g_autoptr(GError) error = NULL;
  gboolean ok = trb_live_reduction_roof (20.0 * PSF, area_ft2 * FT2, slope, out, &error);

  g_assert_no_error (error);
  g_assert_true (ok);
}

static void
test_roof (void)
{
  TrbLiveReduction r;

  /* ASCE 7-16 Eq. 4.8-1 (from memory), Lo = 20 psf (Table 4.3-1, from memory); R1 and R2 as
   * in ENGINEERING.md §1.4 */

  /* A_T = 150 ft^2, flat: R1 = R2 = 1, 20 psf */
  roof (150, 0.0, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 20.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ROOF_SMALL);

  /* A_T = 400 ft^2, flat: R1 = 1.2 - 0.001 x 400 = 0.8; 20 x 0.8 = 16.0 psf */
  roof (400, 0.0, &r);
  g_assert_cmpfloat_with_epsilon (r.R1, 0.8, 1e-12);
  g_assert_cmpfloat_with_epsilon (r.R2, 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 16.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ROOF_EQUATION);

  /* A_T = 300 ft^2, 6:12 pitch (F = 6): R1 = 1.2 - 0.3 = 0.9, R2 = 1.2 - 0.05 x 6 = 0.9;
   * 20 x 0.81 = 16.2 psf */
  roof (300, 6.0 / 12.0, &r);
  g_assert_cmpfloat_with_epsilon (r.R2, 0.9, 1e-12);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 16.2, 1e-9);

  /* A_T = 1000 ft^2, 12:12 pitch: R1 = R2 = 0.6; 20 x 0.36 = 7.2 < 12, so 12 psf, the least
   * (§4.8.2) */
  roof (1000, 1.0, &r);
  g_assert_cmpfloat_with_epsilon (r.R1, 0.6, 1e-12);
  g_assert_cmpfloat_with_epsilon (r.R2, 0.6, 1e-12);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 12.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ROOF_MINIMUM);

  /* A_T = 600 ft^2, flat: R1 = 0.6 (R1 = 1.2 - 0.6 meets it): 12.0 psf by the equation */
  roof (600, 0.0, &r);
  g_assert_cmpfloat_with_epsilon (r.L / PSF, 12.0, 1e-9);
  g_assert_cmpint (r.rule, ==, TRB_LIVE_RULE_ROOF_EQUATION);
}

static void
test_invalid (void)
{
  TrbLiveReduction r;
  g_autoptr(GError) e1 = NULL;
  g_autoptr(GError) e2 = NULL;
  g_autoptr(GError) e3 = NULL;
  g_autoptr(GError) e4 = NULL;

  g_assert_false (trb_live_reduction_floor (50 * PSF, -1.0, TRB_LIVE_MEMBER_INTERIOR_BEAM, 1,
                                            TRB_LIVE_OCCUPANCY_ORDINARY, &r, &e1));
  g_assert_error (e1, TRB_ERROR, TRB_ERROR_INVALID);

  g_assert_false (trb_live_reduction_floor (50 * PSF, 10.0, TRB_LIVE_MEMBER_INTERIOR_BEAM, 0,
                                            TRB_LIVE_OCCUPANCY_ORDINARY, &r, &e2));
  g_assert_error (e2, TRB_ERROR, TRB_ERROR_INVALID);

  g_assert_false (trb_live_reduction_floor (NAN, 10.0, TRB_LIVE_MEMBER_INTERIOR_BEAM, 1,
                                            TRB_LIVE_OCCUPANCY_ORDINARY, &r, &e3));
  g_assert_error (e3, TRB_ERROR, TRB_ERROR_INVALID);

  /* Eq. 4.8-1 is for ordinary roofs; a roof garden (100 psf) is reduced as a floor (§4.8.3) */
  g_assert_false (trb_live_reduction_roof (100 * PSF, 10.0, 0.0, &r, &e4));
  g_assert_error (e4, TRB_ERROR, TRB_ERROR_INVALID);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/live-reduction/k-ll", test_k_ll);
  g_test_add_func ("/trb/live-reduction/office", test_office);
  g_test_add_func ("/trb/live-reduction/limits", test_limits);
  g_test_add_func ("/trb/live-reduction/heavy", test_heavy);
  g_test_add_func ("/trb/live-reduction/garage-assembly", test_garage_assembly);
  g_test_add_func ("/trb/live-reduction/roof", test_roof);
  g_test_add_func ("/trb/live-reduction/invalid", test_invalid);

  return g_test_run ();
}
