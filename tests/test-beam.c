/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The beam engine against closed-form handbook cases. "Table 3-23" below is AISC Steel
 * Construction Manual, 15th ed., Table 3-23 "Shears, Moments and Deflections"; its case
 * numbers and formulas are (from memory), so each case is also named by its title. Where a
 * value is derived by hand, the derivation is beside it. The sympy check
 * (tests/reference/sympy_beams.py) covers random beams exactly. */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-beam.h"
#include "trb-error.h"
#include "trb-units.h"

/* W18x35 in A992 steel as in ENGINEERING.md section 8 item 1: E = 29,000 ksi, I = 510 in^4 */
#define E_STEEL (29000.0 * TRB_KSI)
#define I_W18 (510.0 * TRB_IN * TRB_IN * TRB_IN * TRB_IN)
#define EI (E_STEEL * I_W18)

/* A relative tolerance for values the engine should reproduce to rounding. */
#define TIGHT 1e-11

static void
assert_rel (double got,
            double want,
            double rel)
{
  g_assert_cmpfloat_with_epsilon (got, want, rel * fabs (want) + 1e-300);
}

/* an absolute check: exact where eps is 0 (values the engine sets by construction) */
static void
assert_abs (double got,
            double want,
            double eps)
{
  if (eps == 0)
    g_assert_cmpfloat (got, ==, want);
  else
    g_assert_cmpfloat_with_epsilon (got, want, eps);
}

static TrbBeam *
make_beam (double            L,
           const TrbSupport *supports,
           guint             n)
{
  g_autoptr(GError) error = NULL;
  TrbBeam *beam = trb_beam_new (L, E_STEEL, I_W18, supports, n, &error);

  g_assert_no_error (error);
  g_assert_nonnull (beam);
  return beam;
}

static TrbBeamResult *
solve (const TrbBeam *beam,
       const TrbLoad *loads,
       guint          n)
{
  g_autoptr(GError) error = NULL;
  TrbBeamResult *r = trb_beam_solve (beam, loads, n, &error);

  g_assert_no_error (error);
  g_assert_nonnull (r);
  return r;
}

static TrbBeamValues
at (const TrbBeamResult *r,
    double               x,
    TrbSide              side)
{
  TrbBeamValues v;

  trb_beam_result_eval (r, x, side, &v);
  return v;
}

static const TrbReaction *
reactions (const TrbBeamResult *r,
           guint                expect)
{
  guint n = 0;
  const TrbReaction *rr = trb_beam_result_get_reactions (r, &n);

  g_assert_cmpuint (n, ==, expect);
  return rr;
}

/* ---- simple spans ---- */

static void
test_simple_uniform (void)
{
  /* ENGINEERING.md section 8 item 1: w = 1.0 k/ft, L = 20 ft, E = 29,000 ksi, I = 510 in^4 */
  const double L = 20 * TRB_FT, w = 1.0 * TRB_KLF;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, L, w, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamValues mid = at (r, L / 2, TRB_SIDE_LEFT);
  TrbBeamExtremes e;

  /* Table 3-23 case 1, "Simple beam—uniformly distributed load": R = V = wL/2 */
  assert_rel (rr[0].force, w * L / 2, TIGHT);
  assert_rel (rr[1].force, w * L / 2, TIGHT);
  assert_abs (rr[0].moment, 0, 0);
  /* ENGINEERING.md 8.1: V = 10.0 k */
  assert_abs (rr[0].force / TRB_KIP, 10.0, 0.05);
  /* case 1: M max = wL^2/8 at the centre; ENGINEERING.md 8.1: 50.0 k-ft */
  assert_rel (mid.M, w * L * L / 8, TIGHT);
  assert_abs (mid.M / TRB_KIP_FT, 50.0, 0.05);
  /* case 1: deflection at the centre 5wL^4/(384EI); ENGINEERING.md 8.1: 0.243 in */
  assert_rel (mid.defl, 5 * w * pow (L, 4) / (384 * EI), TIGHT);
  assert_abs (mid.defl / TRB_IN, 0.243, 0.0005);
  /* case 1: deflection at x is wx(L^3 - 2Lx^2 + x^3)/(24EI) (down +); its slope at x = 0 is
   * wL^3/(24EI) downward, so theta (counter-clockwise +) = -wL^3/(24EI) */
  assert_rel (at (r, 0, TRB_SIDE_RIGHT).theta, -w * pow (L, 3) / (24 * EI), TIGHT);
  assert_rel (at (r, L / 4, TRB_SIDE_RIGHT).defl,
              w * (L / 4) * (pow (L, 3) - 2 * L * pow (L / 4, 2) + pow (L / 4, 3)) / (24 * EI),
              TIGHT);
  /* case 1: V at x is w(L/2 - x) */
  assert_rel (at (r, L / 4, TRB_SIDE_LEFT).V, w * L / 4, TIGHT);

  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, w * L * L / 8, TIGHT);
  assert_rel (e.M_max_x, L / 2, 1e-12);
  /* no hogging on a simple span: the least M is at the pinned ends, zero to rounding */
  assert_abs (e.M_min, 0, 1e-9 * w * L * L);
  assert_rel (e.V_max, w * L / 2, TIGHT);
  assert_abs (e.V_max_x, 0, 0);
  assert_rel (e.V_min, -w * L / 2, TIGHT);
  assert_abs (e.V_min_x, L, 0);
  assert_rel (e.defl_down, 5 * w * pow (L, 4) / (384 * EI), TIGHT);
  assert_rel (e.defl_down_x, L / 2, 1e-9);
  assert_abs (e.defl_up, 0, 0);
}

static void
test_simple_point_center (void)
{
  /* ENGINEERING.md section 8 item 1: P = 10 k at midspan of the same beam */
  const double L = 20 * TRB_FT, P = 10 * TRB_KIP;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_POINT, L / 2, 0, P, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  TrbBeamValues left = at (r, L / 2, TRB_SIDE_LEFT), right = at (r, L / 2, TRB_SIDE_RIGHT);
  TrbBeamExtremes e;

  /* Table 3-23 case 7, "Simple beam—concentrated load at center": M = PL/4 (ENGINEERING.md
   * 8.1: 50.0 k-ft), deflection PL^3/(48EI) (ENGINEERING.md 8.1: 0.195 in) */
  assert_rel (left.M, P * L / 4, TIGHT);
  assert_abs (left.M / TRB_KIP_FT, 50.0, 0.05);
  assert_rel (left.defl, P * pow (L, 3) / (48 * EI), TIGHT);
  assert_abs (left.defl / TRB_IN, 0.195, 0.0005);
  /* case 7: V = P/2 left of the load and -P/2 right of it; M and deflection continuous */
  assert_rel (left.V, P / 2, TIGHT);
  assert_rel (right.V, -P / 2, TIGHT);
  assert_rel (right.M, left.M, TIGHT);
  assert_rel (right.defl, left.defl, TIGHT);
  /* beyond the ends nothing passes (trb-beam.h): V(0-) = 0, V(L+) = 0 */
  assert_abs (at (r, 0, TRB_SIDE_LEFT).V, 0, 0);
  assert_rel (at (r, 0, TRB_SIDE_RIGHT).V, P / 2, TIGHT);
  assert_rel (at (r, L, TRB_SIDE_LEFT).V, -P / 2, TIGHT);
  assert_abs (at (r, L, TRB_SIDE_RIGHT).V, 0, 0);

  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, P * L / 4, TIGHT);
  assert_abs (e.M_max_x, L / 2, 0);
  assert_rel (e.defl_down, P * pow (L, 3) / (48 * EI), TIGHT);
  assert_rel (e.defl_down_x, L / 2, 1e-9);
  /* the extremes of V include both sides of the jump at the load */
  trb_beam_result_extremes (r, L / 2, L / 2, &e);
  assert_rel (e.V_max, P / 2, TIGHT);
  assert_rel (e.V_min, -P / 2, TIGHT);
}

static void
test_simple_point_any (void)
{
  /* Table 3-23 case 8, "Simple beam—concentrated load at any point", a = 14 ft, b = 6 ft */
  const double L = 20 * TRB_FT, a = 14 * TRB_FT, b = 6 * TRB_FT, P = 10 * TRB_KIP;
  TrbSupport sup[] = { { L, TRB_SUPPORT_ROLLER }, { 0, TRB_SUPPORT_PIN } };  /* unsorted */
  TrbLoad ld[] = { { TRB_LOAD_POINT, a, 0, P, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamExtremes e;
  double x_max;

  /* case 8: R1 = Pb/L, R2 = Pa/L */
  assert_abs (rr[0].x, 0, 0);
  assert_rel (rr[0].force, P * b / L, TIGHT);
  assert_rel (rr[1].force, P * a / L, TIGHT);
  /* case 8: M max = Pab/L at the load; deflection there Pa^2b^2/(3EIL) */
  assert_rel (at (r, a, TRB_SIDE_LEFT).M, P * a * b / L, TIGHT);
  assert_rel (at (r, a, TRB_SIDE_LEFT).defl, P * a * a * b * b / (3 * EI * L), TIGHT);

  /* case 8: for a > b the largest deflection is Pab(a + 2b) sqrt(3a(a + 2b))/(27EIL) at
   * x = sqrt(a(a + 2b)/3) from the left end */
  x_max = sqrt (a * (a + 2 * b) / 3);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.defl_down, P * a * b * (a + 2 * b) * sqrt (3 * a * (a + 2 * b)) / (27 * EI * L),
              TIGHT);
  assert_rel (e.defl_down_x, x_max, 1e-12);
  assert_rel (e.M_max, P * a * b / L, TIGHT);
  assert_abs (e.M_max_x, a, 0);
}

static void
test_simple_partial_uniform (void)
{
  const double L = 20 * TRB_FT, w = 2.0 * TRB_KLF;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);

  {
    /* Table 3-23 case 4, "Simple beam—uniform load partially distributed": load from a to
     * a + b, c to the right end; a = 4 ft, b = 10 ft, c = 6 ft.
     * R1 = wb(2c + b)/(2L) = 2(10)(22)/40 = 11 k, R2 = wb(2a + b)/(2L) = 2(10)(18)/40 = 9 k,
     * M max = R1(a + R1/(2w)) = 11(4 + 2.75) = 74.25 k-ft at x = a + R1/w = 9.5 ft */
    const double a = 4 * TRB_FT, b = 10 * TRB_FT;
    TrbLoad ld[] = { { TRB_LOAD_UNIFORM, a, a + b, w, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 2);
    TrbBeamExtremes e;

    assert_rel (rr[0].force, 11 * TRB_KIP, TIGHT);
    assert_rel (rr[1].force, 9 * TRB_KIP, TIGHT);
    trb_beam_result_extremes (r, 0, L, &e);
    assert_rel (e.M_max, 74.25 * TRB_KIP_FT, TIGHT);
    assert_rel (e.M_max_x, 9.5 * TRB_FT, 1e-12);
  }
  {
    /* Table 3-23 case 5, "Simple beam—uniform load partially distributed at one end": load
     * from 0 to a = 8 ft, w = 2 k/ft. R1 = wa(2L - a)/(2L) = 2(8)(32)/40 = 12.8 k,
     * R2 = wa^2/(2L) = 2(64)/40 = 3.2 k, M max = R1^2/(2w) = 40.96 k-ft at x = R1/w = 6.4 ft;
     * deflection for x < a: wx(a^2(2L - a)^2 - 2ax^2(2L - a) + Lx^3)/(24EIL) */
    const double a = 8 * TRB_FT, x = 5 * TRB_FT;
    TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, a, w, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 2);
    TrbBeamExtremes e;

    assert_rel (rr[0].force, 12.8 * TRB_KIP, TIGHT);
    assert_rel (rr[1].force, 3.2 * TRB_KIP, TIGHT);
    trb_beam_result_extremes (r, 0, L, &e);
    assert_rel (e.M_max, 40.96 * TRB_KIP_FT, TIGHT);
    assert_rel (e.M_max_x, 6.4 * TRB_FT, 1e-12);
    assert_rel (at (r, x, TRB_SIDE_LEFT).defl,
                w * x * (a * a * pow (2 * L - a, 2) - 2 * a * x * x * (2 * L - a) +
                         L * pow (x, 3)) / (24 * EI * L), TIGHT);
  }
}

static void
test_simple_triangular (void)
{
  /* Table 3-23 case 2, "Simple beam—load increasing uniformly to one end": total load W,
   * R1 = W/3, R2 = 2W/3, M max = 2WL/(9 sqrt 3) at x = L/sqrt 3; deflection at x is
   * Wx(3x^4 - 10L^2x^2 + 7L^4)/(180EIL^2), largest at x = L sqrt(1 - sqrt(8/15)), where
   * the table gives 0.01304 WL^3/EI */
  const double L = 24 * TRB_FT, wmax = 1.5 * TRB_KLF, W = wmax * L / 2;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_LINEAR, 0, L, 0, wmax } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  double xd = L * sqrt (1 - sqrt (8.0 / 15.0));
  TrbBeamExtremes e;

  assert_rel (rr[0].force, W / 3, TIGHT);
  assert_rel (rr[1].force, 2 * W / 3, TIGHT);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, 2 * W * L / (9 * sqrt (3)), TIGHT);
  assert_rel (e.M_max_x, L / sqrt (3), 1e-12);
  assert_rel (e.defl_down, W * xd * (3 * pow (xd, 4) - 10 * L * L * xd * xd + 7 * pow (L, 4)) /
              (180 * EI * L * L), TIGHT);
  assert_rel (e.defl_down_x, xd, 1e-9);
  /* the table's rounded coefficient */
  assert_abs (e.defl_down * EI / (W * pow (L, 3)), 0.01304, 0.000005);
  /* the maximum shear is R2 at the heavy end (case 2: V2 = 2W/3) */
  assert_rel (e.V_min, -2 * W / 3, TIGHT);
  assert_abs (e.V_min_x, L, 0);
}

/* ---- cantilevers, propped and fixed ---- */

static void
test_cantilever (void)
{
  const double L = 10 * TRB_FT, w = 0.8 * TRB_KLF, P = 5 * TRB_KIP;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_FIXED } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 1);

  {
    /* Table 3-23 case 19, "Cantilever beam—uniformly distributed load": R = wL, M max = wL^2/2
     * at the fixed end, deflection wL^4/(8EI) at the free end; its slope there is wL^3/(6EI)
     * (the derivative of the case's w(x^4 - 4L^3x + 3L^4)/(24EI) measured from the free end) */
    TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, L, w, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 1);
    TrbBeamValues tip = at (r, L, TRB_SIDE_LEFT);
    TrbBeamExtremes e;

    assert_rel (rr[0].force, w * L, TIGHT);
    /* the wall's couple on the beam is counter-clockwise (trb-beam.h sign conventions) */
    assert_rel (rr[0].moment, w * L * L / 2, TIGHT);
    assert_rel (at (r, 0, TRB_SIDE_RIGHT).M, -w * L * L / 2, TIGHT);
    assert_abs (at (r, 0, TRB_SIDE_LEFT).M, 0, 0);
    assert_rel (tip.defl, w * pow (L, 4) / (8 * EI), TIGHT);
    assert_rel (tip.theta, -w * pow (L, 3) / (6 * EI), TIGHT);
    assert_abs (at (r, 0, TRB_SIDE_RIGHT).defl, 0, 0);
    assert_abs (at (r, 0, TRB_SIDE_RIGHT).theta, 0, 0);
    trb_beam_result_extremes (r, 0, L, &e);
    assert_rel (e.M_min, -w * L * L / 2, TIGHT);
    assert_abs (e.M_min_x, 0, 0);
    assert_rel (e.defl_down, w * pow (L, 4) / (8 * EI), TIGHT);
    assert_abs (e.defl_down_x, L, 0);
  }
  {
    /* Table 3-23 case 22, "Cantilever beam—concentrated load at free end": M max = PL,
     * deflection PL^3/(3EI) at the free end; slope there PL^2/(2EI) (derivative of the
     * case's P(2L^3 - 3L^2x + x^3)/(6EI)) */
    TrbLoad ld[] = { { TRB_LOAD_POINT, L, 0, P, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 1);
    TrbBeamValues tip = at (r, L, TRB_SIDE_LEFT);

    assert_rel (rr[0].force, P, TIGHT);
    assert_rel (rr[0].moment, P * L, TIGHT);
    assert_rel (tip.defl, P * pow (L, 3) / (3 * EI), TIGHT);
    assert_rel (tip.theta, -P * L * L / (2 * EI), TIGHT);
    /* a point load exactly at the free end: V = P just left of it, 0 beyond */
    assert_rel (tip.V, P, TIGHT);
    assert_abs (at (r, L, TRB_SIDE_RIGHT).V, 0, 0);
  }
  {
    /* the same cantilever mirrored, fixed at the right end with the load at the free end
     * x = 0: statics gives M(L-) = -PL, and the wall's couple on the beam is then clockwise,
     * -PL; V jumps from 0 to -P at x = 0 */
    TrbSupport sup2[] = { { L, TRB_SUPPORT_FIXED } };
    g_autoptr(TrbBeam) beam2 = make_beam (L, sup2, 1);
    TrbLoad ld[] = { { TRB_LOAD_POINT, 0, 0, P, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam2, ld, 1);
    const TrbReaction *rr = reactions (r, 1);

    assert_rel (rr[0].force, P, TIGHT);
    assert_rel (rr[0].moment, -P * L, TIGHT);
    assert_rel (at (r, L, TRB_SIDE_LEFT).M, -P * L, TIGHT);
    assert_abs (at (r, 0, TRB_SIDE_LEFT).V, 0, 0);
    assert_rel (at (r, 0, TRB_SIDE_RIGHT).V, -P, TIGHT);
    /* case 22 again: PL^3/(3EI) at the free end */
    assert_rel (at (r, 0, TRB_SIDE_RIGHT).defl, P * pow (L, 3) / (3 * EI), TIGHT);
  }
}

static void
test_propped_uniform (void)
{
  /* Table 3-23 case 12, "Beam fixed at one end, supported at other—uniformly distributed
   * load", measured from the supported end: R1 = 3wL/8 there, R2 = 5wL/8 at the fixed end,
   * M at the fixed end -wL^2/8, M max +9wL^2/128 at 3L/8; deflection at x is
   * wx(L^3 - 3Lx^2 + 2x^3)/(48EI), largest where L^3 - 9Lx^2 + 8x^3 = 0, that is at
   * x = L(1 + sqrt 33)/16 = 0.4215L (the table: wL^4/(185EI) at 0.4215L).
   * Here the fixed end is at x = 0, so x above is measured from L. */
  const double L = 22 * TRB_FT, w = 1.2 * TRB_KLF;
  const double xd = L * (1 + sqrt (33)) / 16;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_FIXED }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, L, w, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamExtremes e;

  assert_rel (rr[0].force, 5 * w * L / 8, TIGHT);
  assert_rel (rr[1].force, 3 * w * L / 8, TIGHT);
  assert_rel (rr[0].moment, w * L * L / 8, TIGHT);
  assert_abs (rr[1].moment, 0, 0);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_min, -w * L * L / 8, TIGHT);
  assert_abs (e.M_min_x, 0, 0);
  assert_rel (e.M_max, 9 * w * L * L / 128, TIGHT);
  assert_rel (e.M_max_x, L - 3 * L / 8, 1e-12);
  assert_rel (e.defl_down, w * xd * (pow (L, 3) - 3 * L * xd * xd + 2 * pow (xd, 3)) / (48 * EI),
              TIGHT);
  assert_rel (e.defl_down_x, L - xd, 1e-9);
  /* the table's rounded coefficient: 1/185 */
  assert_rel (e.defl_down * EI / (w * pow (L, 4)), 1.0 / 185, 0.003);
}

static void
test_fixed_fixed (void)
{
  const double L = 18 * TRB_FT, w = 1.5 * TRB_KLF, P = 12 * TRB_KIP;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_FIXED }, { L, TRB_SUPPORT_FIXED } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);

  {
    /* Table 3-23 case 15, "Beam fixed at both ends—uniformly distributed load": R = wL/2,
     * M = -wL^2/12 at the ends, +wL^2/24 at the centre, deflection wL^4/(384EI) there */
    TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, L, w, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 2);
    TrbBeamValues mid = at (r, L / 2, TRB_SIDE_LEFT);

    assert_rel (rr[0].force, w * L / 2, TIGHT);
    assert_rel (rr[1].force, w * L / 2, TIGHT);
    assert_rel (rr[0].moment, w * L * L / 12, TIGHT);
    assert_rel (rr[1].moment, -w * L * L / 12, TIGHT);
    assert_rel (at (r, 0, TRB_SIDE_RIGHT).M, -w * L * L / 12, TIGHT);
    assert_rel (at (r, L, TRB_SIDE_LEFT).M, -w * L * L / 12, TIGHT);
    assert_rel (mid.M, w * L * L / 24, TIGHT);
    assert_rel (mid.defl, w * pow (L, 4) / (384 * EI), TIGHT);
    assert_abs (mid.theta, 0, 1e-12 * w * pow (L, 3) / EI);
  }
  {
    /* Table 3-23 case 16, "Beam fixed at both ends—concentrated load at center": M = PL/8 at
     * the centre and -PL/8 at the ends, deflection PL^3/(192EI) at the centre */
    TrbLoad ld[] = { { TRB_LOAD_POINT, L / 2, 0, P, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 2);
    TrbBeamExtremes e;

    assert_rel (rr[0].moment, P * L / 8, TIGHT);
    assert_rel (rr[1].moment, -P * L / 8, TIGHT);
    trb_beam_result_extremes (r, 0, L, &e);
    assert_rel (e.M_max, P * L / 8, TIGHT);
    assert_abs (e.M_max_x, L / 2, 0);
    assert_rel (e.M_min, -P * L / 8, TIGHT);
    assert_rel (e.defl_down, P * pow (L, 3) / (192 * EI), TIGHT);
    assert_rel (e.defl_down_x, L / 2, 1e-9);
  }
}

/* ---- overhangs ---- */

static void
test_overhang_tip_load (void)
{
  /* Table 3-23 case 26, "Beam overhanging one support—concentrated load at end of overhang":
   * span L, overhang a, P at the tip. R1 = -Pa/L (downward), R2 = P(L + a)/L, M max = -Pa at
   * R2, deflection at the tip Pa^2(L + a)/(3EI), largest upward deflection between the
   * supports PaL^2/(9 sqrt(3) EI) = 0.06415 PaL^2/EI at x = L/sqrt 3 */
  const double L = 20 * TRB_FT, a = 6 * TRB_FT, P = 4 * TRB_KIP;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_POINT, L + a, 0, P, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L + a, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamExtremes e;

  assert_rel (rr[0].force, -P * a / L, TIGHT);
  assert_rel (rr[1].force, P * (L + a) / L, TIGHT);
  assert_rel (at (r, L, TRB_SIDE_LEFT).M, -P * a, TIGHT);
  assert_rel (at (r, L + a, TRB_SIDE_LEFT).defl, P * a * a * (L + a) / (3 * EI), TIGHT);
  /* a support holds the member: no deflection there */
  assert_abs (at (r, L, TRB_SIDE_RIGHT).defl, 0, 1e-15);

  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.defl_up, P * a * L * L / (9 * sqrt (3) * EI), TIGHT);
  assert_rel (e.defl_up_x, L / sqrt (3), 1e-9);
  assert_abs (e.defl_down, 0, 1e-15);
  trb_beam_result_extremes (r, 0, L + a, &e);
  assert_rel (e.M_min, -P * a, TIGHT);
  assert_abs (e.M_min_x, L, 0);
  assert_rel (e.defl_down, P * a * a * (L + a) / (3 * EI), TIGHT);
  assert_abs (e.defl_down_x, L + a, 0);
}

static void
test_overhang_uniform_and_point_at_support (void)
{
  /* Table 3-23 case 24, "Beam overhanging one support—uniformly distributed load", span L,
   * overhang a: R1 = w(L^2 - a^2)/(2L), R2 = w(L + a)^2/(2L); V just left of R2 is
   * -w(L^2 + a^2)/(2L), just right of it wa; M at R2 = -wa^2/2; M max = w(L + a)^2(L - a)^2/(8L^2)
   * at x = L/2 (1 - a^2/L^2). A point load P exactly on R2 goes straight into R2 and
   * changes nothing else (statics). */
  const double L = 24 * TRB_FT, a = 6 * TRB_FT, w = 1.0 * TRB_KLF, P = 7 * TRB_KIP;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = {
    { TRB_LOAD_UNIFORM, 0, L + a, w, 0 },
    { TRB_LOAD_POINT, L, 0, P, 0 },
  };
  g_autoptr(TrbBeam) beam = make_beam (L + a, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 2);
  g_autoptr(TrbBeamResult) r1 = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamExtremes e;

  assert_rel (rr[0].force, w * (L * L - a * a) / (2 * L), TIGHT);
  assert_rel (rr[1].force, w * (L + a) * (L + a) / (2 * L) + P, TIGHT);
  assert_rel (at (r, L, TRB_SIDE_LEFT).V, -w * (L * L + a * a) / (2 * L), TIGHT);
  assert_rel (at (r, L, TRB_SIDE_RIGHT).V, w * a, TIGHT);
  assert_rel (at (r, L, TRB_SIDE_LEFT).M, -w * a * a / 2, TIGHT);
  trb_beam_result_extremes (r, 0, L + a, &e);
  assert_rel (e.M_max, w * pow (L + a, 2) * pow (L - a, 2) / (8 * L * L), TIGHT);
  assert_rel (e.M_max_x, L / 2 * (1 - a * a / (L * L)), 1e-12);
  assert_rel (e.M_min, -w * a * a / 2, TIGHT);
  assert_abs (e.M_min_x, L, 0);
  /* the point load on the support changes no moment or deflection anywhere */
  for (int i = 0; i <= 10; i++)
    {
      double x = (L + a) * i / 10;

      assert_rel (at (r, x, TRB_SIDE_LEFT).M, at (r1, x, TRB_SIDE_LEFT).M, TIGHT);
      assert_rel (at (r, x, TRB_SIDE_RIGHT).defl, at (r1, x, TRB_SIDE_RIGHT).defl, TIGHT);
    }
}

static void
test_point_at_support (void)
{
  const double L = 15 * TRB_FT, P = 9 * TRB_KIP;
  TrbSupport sup[] = {
    { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER }, { 2 * L, TRB_SUPPORT_ROLLER },
  };
  g_autoptr(TrbBeam) beam = make_beam (2 * L, sup, 3);

  {
    /* P exactly on the middle support of two spans: all of it is that reaction (statics),
     * the member does not bend, and V is zero on both sides of the support */
    TrbLoad ld[] = { { TRB_LOAD_POINT, L, 0, P, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 3);

    assert_abs (rr[0].force, 0, 0);
    assert_rel (rr[1].force, P, TIGHT);
    assert_abs (rr[2].force, 0, 0);
    assert_abs (at (r, L, TRB_SIDE_LEFT).V, 0, 0);
    assert_abs (at (r, L, TRB_SIDE_RIGHT).V, 0, 0);
    assert_abs (at (r, L / 2, TRB_SIDE_LEFT).defl, 0, 0);
  }
  {
    /* P exactly on the end support x = 0: again all of it there */
    TrbLoad ld[] = { { TRB_LOAD_POINT, 0, 0, P, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
    const TrbReaction *rr = reactions (r, 3);

    assert_rel (rr[0].force, P, TIGHT);
    assert_abs (rr[1].force, 0, 0);
    assert_abs (at (r, 0, TRB_SIDE_RIGHT).V, 0, 0);
    assert_abs (at (r, L, TRB_SIDE_RIGHT).M, 0, 0);
  }
  {
    /* two equal spans, P at the centre of one (Table 3-23 case 30, "Continuous beam—two
     * equal spans—concentrated load at center of one span": R1 = 13P/32, R2 = 11P/16,
     * R3 = -3P/32, M at R2 = -3PL/32), plus a second P exactly on R2: R2 takes it whole,
     * V jumps at R2 by R2 - P */
    TrbLoad ld[] = { { TRB_LOAD_POINT, L / 2, 0, P, 0 }, { TRB_LOAD_POINT, L, 0, P, 0 } };
    g_autoptr(TrbBeamResult) r = solve (beam, ld, 2);
    const TrbReaction *rr = reactions (r, 3);
    TrbBeamValues left = at (r, L, TRB_SIDE_LEFT), right = at (r, L, TRB_SIDE_RIGHT);

    assert_rel (rr[0].force, 13 * P / 32, TIGHT);
    assert_rel (rr[1].force, 11 * P / 16 + P, TIGHT);
    assert_rel (rr[2].force, -3 * P / 32, TIGHT);
    assert_rel (left.M, -3 * P * L / 32, TIGHT);
    assert_rel (right.V - left.V, rr[1].force - P, TIGHT);
    assert_rel (right.V, 3 * P / 32, TIGHT);
  }
}

static void
test_moment_at_overhang_end (void)
{
  /* A clockwise moment m at the tip of an overhang a beyond a span L. Statics: R1 = -m/L,
   * R2 = m/L, M = -m over the overhang (M jumps up by m to 0 at the tip). The span bends
   * under the end moment -m: its end rotation is mL/(3EI) (the simple beam with an end
   * moment, common practice), and the overhang adds the cantilever's ma^2/(2EI), so the tip
   * deflects down by ma(2L + 3a)/(6EI). */
  const double L = 16 * TRB_FT, a = 4 * TRB_FT, m = 20 * TRB_KIP_FT;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_MOMENT, L + a, 0, m, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L + a, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);

  assert_rel (rr[0].force, -m / L, TIGHT);
  assert_rel (rr[1].force, m / L, TIGHT);
  assert_rel (at (r, L + a / 2, TRB_SIDE_LEFT).M, -m, TIGHT);
  assert_rel (at (r, L + a, TRB_SIDE_LEFT).M, -m, TIGHT);
  assert_abs (at (r, L + a, TRB_SIDE_RIGHT).M, 0, 0);
  assert_abs (at (r, L + a / 2, TRB_SIDE_LEFT).V, 0, 0);
  assert_rel (at (r, L + a, TRB_SIDE_LEFT).defl, m * a * (2 * L + 3 * a) / (6 * EI), TIGHT);
}

static void
test_moment_jump (void)
{
  /* A clockwise moment m at midspan of a simple span. Statics: R1 = -m/L, R2 = m/L, V = -m/L
   * throughout, M = -m/2 just left of the load and +m/2 just right (a jump of m, trb-beam.h);
   * by antisymmetry the centre does not deflect. */
  const double L = 12 * TRB_FT, m = 30 * TRB_KIP_FT;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = { { TRB_LOAD_MOMENT, L / 2, 0, m, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamExtremes e;

  assert_rel (rr[0].force, -m / L, TIGHT);
  assert_rel (rr[1].force, m / L, TIGHT);
  assert_rel (at (r, L / 2, TRB_SIDE_LEFT).M, -m / 2, TIGHT);
  assert_rel (at (r, L / 2, TRB_SIDE_RIGHT).M, m / 2, TIGHT);
  assert_rel (at (r, L / 3, TRB_SIDE_RIGHT).V, -m / L, TIGHT);
  assert_abs (at (r, L / 2, TRB_SIDE_RIGHT).defl, 0, 1e-12 * m * L * L / EI);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, m / 2, TIGHT);
  assert_abs (e.M_max_x, L / 2, 0);
  assert_rel (e.M_min, -m / 2, TIGHT);
  assert_abs (e.M_min_x, L / 2, 0);
  /* the deflection is antisymmetric: as far down on one side as up on the other */
  assert_rel (e.defl_down, e.defl_up, 1e-9);
  assert_rel (e.defl_down_x + e.defl_up_x, L, 1e-9);
}

/* ---- continuous beams ---- */

static void
test_two_spans_uniform (void)
{
  /* Two equal continuous spans under a uniform load on both, as in Table 3-23's continuous
   * beam cases (from memory; the number is not recalled with confidence): R = 3wL/8 at the
   * ends and 10wL/8 at the middle, M = -wL^2/8 over the middle support, +9wL^2/128 at 3L/8
   * from each end. By symmetry each span is case 12's propped cantilever, so the largest
   * deflection is at x = L(1 + sqrt 33)/16 from each end (see test_propped_uniform). */
  const double L = 16 * TRB_FT, w = 0.9 * TRB_KLF;
  const double xd = L * (1 + sqrt (33)) / 16;
  TrbSupport sup[] = {
    { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER }, { 2 * L, TRB_SUPPORT_ROLLER },
  };
  TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, 2 * L, w, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (2 * L, sup, 3);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 3);
  TrbBeamExtremes e;

  assert_rel (rr[0].force, 3 * w * L / 8, TIGHT);
  assert_rel (rr[1].force, 10 * w * L / 8, TIGHT);
  assert_rel (rr[2].force, 3 * w * L / 8, TIGHT);
  assert_rel (at (r, L, TRB_SIDE_LEFT).M, -w * L * L / 8, TIGHT);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, 9 * w * L * L / 128, TIGHT);
  assert_rel (e.M_max_x, 3 * L / 8, 1e-12);
  assert_rel (e.M_min, -w * L * L / 8, TIGHT);
  assert_abs (e.M_min_x, L, 0);
  assert_rel (e.defl_down_x, xd, 1e-9);
  assert_rel (e.defl_down, w * xd * (pow (L, 3) - 3 * L * xd * xd + 2 * pow (xd, 3)) / (48 * EI),
              TIGHT);
  /* ENGINEERING.md section 3: interior support of two equal spans = 1.25wL */
  assert_rel (rr[1].force, 1.25 * w * L, TIGHT);
}

static void
test_three_spans_uniform (void)
{
  /* Three equal continuous spans, uniform load on all: Table 3-23 case 36 (from memory):
   * R = 0.4wL, 1.1wL; M = -0.1wL^2 over the inner supports, +0.08wL^2 at 0.4L in the end
   * spans, +0.025wL^2 at the centre; deflection 0.0069wL^4/EI at 0.446L from each end.
   * By hand (three-moment equation, M0 = M3 = 0, M1 = M2 = M by symmetry):
   * 2M(2L) + ML = -wL^3/4 - wL^3/4, so M = -wL^2/10; then R0 = wL/2 + M/L = 0.4wL, the
   * end-span moment 0.4wLx - wx^2/2 peaks at x = 0.4L with 0.08wL^2, and the centre span's
   * is wL^2/8 - wL^2/10 = wL^2/40. In the end span EI v = wL^4(s^3/15 - s^4/24 - s/40) with
   * s = x/L (v up; integrating 0.4wLx - wx^2/2 twice with v = 0 at both supports). */
  const double L = 14 * TRB_FT, w = 1.1 * TRB_KLF;
  TrbSupport sup[] = {
    { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER }, { 2 * L, TRB_SUPPORT_ROLLER },
    { 3 * L, TRB_SUPPORT_ROLLER },
  };
  TrbLoad ld[] = { { TRB_LOAD_UNIFORM, 0, 3 * L, w, 0 } };
  g_autoptr(TrbBeam) beam = make_beam (3 * L, sup, 4);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 1);
  const TrbReaction *rr = reactions (r, 4);
  TrbBeamExtremes e;
  double s;

  assert_rel (rr[0].force, 0.4 * w * L, TIGHT);
  assert_rel (rr[1].force, 1.1 * w * L, TIGHT);
  assert_rel (rr[2].force, 1.1 * w * L, TIGHT);
  assert_rel (rr[3].force, 0.4 * w * L, TIGHT);
  assert_rel (at (r, L, TRB_SIDE_LEFT).M, -0.1 * w * L * L, TIGHT);
  assert_rel (at (r, 2 * L, TRB_SIDE_RIGHT).M, -0.1 * w * L * L, TIGHT);
  assert_rel (at (r, 1.5 * L, TRB_SIDE_RIGHT).M, 0.025 * w * L * L, TIGHT);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, 0.08 * w * L * L, TIGHT);
  assert_rel (e.M_max_x, 0.4 * L, 1e-12);
  /* the table's rounded values */
  assert_abs (e.defl_down * EI / (w * pow (L, 4)), 0.0069, 0.00005);
  assert_abs (e.defl_down_x / L, 0.446, 0.0005);
  /* the derived curve: its value at the reported point, and a zero slope there */
  s = e.defl_down_x / L;
  assert_rel (e.defl_down, -w * pow (L, 4) * (pow (s, 3) / 15 - pow (s, 4) / 24 - s / 40) / EI,
              TIGHT);
  assert_abs (s * s / 5 - pow (s, 3) / 6 - 1.0 / 40, 0, 1e-14);
}

/* ---- what the engine refuses ---- */

static void
test_unstable (void)
{
  const double L = 10.0;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) ok = NULL;
  TrbBeam *beam;

  beam = trb_beam_new (L, 200e9, 1e-4, NULL, 0, &error);
  g_assert_null (beam);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE);
  g_assert_nonnull (strstr (error->message, "no support"));
  g_clear_error (&error);

  {
    TrbSupport sup[] = { { 3.0, TRB_SUPPORT_PIN } };

    beam = trb_beam_new (L, 200e9, 1e-4, sup, 1, &error);
    g_assert_null (beam);
    g_assert_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE);
    g_assert_nonnull (strstr (error->message, "rotation"));
    g_clear_error (&error);
  }
  {
    TrbSupport sup[] = { { L, TRB_SUPPORT_ROLLER } };

    beam = trb_beam_new (L, 200e9, 1e-4, sup, 1, &error);
    g_assert_null (beam);
    g_assert_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE);
    g_clear_error (&error);
  }
  {
    /* a pin and a roller at the same point are one support */
    TrbSupport sup[] = { { 4.0, TRB_SUPPORT_ROLLER }, { 4.0, TRB_SUPPORT_PIN } };

    beam = trb_beam_new (L, 200e9, 1e-4, sup, 2, &error);
    g_assert_null (beam);
    g_assert_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE);
    g_clear_error (&error);
  }
  {
    /* two rollers hold the member: there is no axial action in this model */
    TrbSupport sup[] = { { 0, TRB_SUPPORT_ROLLER }, { L, TRB_SUPPORT_ROLLER } };

    ok = trb_beam_new (L, 200e9, 1e-4, sup, 2, &error);
    g_assert_no_error (error);
    g_assert_nonnull (ok);
    g_clear_pointer (&ok, trb_beam_free);
  }
  {
    /* a fixed support alone holds it, and wins over a pin at the same point */
    TrbSupport sup[] = { { 5.0, TRB_SUPPORT_PIN }, { 5.0, TRB_SUPPORT_FIXED } };
    const TrbSupport *got;
    guint n = 0;

    ok = trb_beam_new (L, 200e9, 1e-4, sup, 2, &error);
    g_assert_no_error (error);
    got = trb_beam_get_supports (ok, &n);
    g_assert_cmpuint (n, ==, 1);
    g_assert_cmpint (got[0].type, ==, TRB_SUPPORT_FIXED);
    assert_abs (trb_beam_get_length (ok), L, 0);
  }
}

static void
test_invalid (void)
{
  const double L = 10.0;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  TrbSupport off[] = { { 0, TRB_SUPPORT_PIN }, { L + 0.5, TRB_SUPPORT_ROLLER } };
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) beam = NULL;
  struct { double L, E, I; } bad[] = {
    { 0, 200e9, 1e-4 }, { -1, 200e9, 1e-4 }, { NAN, 200e9, 1e-4 }, { INFINITY, 200e9, 1e-4 },
    { L, 0, 1e-4 }, { L, 200e9, -1e-4 }, { L, 200e9, NAN },
  };
  TrbLoad bad_loads[][2] = {
    { { TRB_LOAD_POINT, 1, 0, 1000, 0 }, { TRB_LOAD_POINT, L + 1, 0, 1000, 0 } },
    { { TRB_LOAD_POINT, 1, 0, 1000, 0 }, { TRB_LOAD_MOMENT, -0.5, 0, 1000, 0 } },
    { { TRB_LOAD_POINT, 1, 0, 1000, 0 }, { TRB_LOAD_UNIFORM, 6, 4, 1000, 0 } },
    { { TRB_LOAD_POINT, 1, 0, 1000, 0 }, { TRB_LOAD_LINEAR, 2, 4, 1000, NAN } },
    { { TRB_LOAD_POINT, 1, 0, 1000, 0 }, { TRB_LOAD_UNIFORM, 2, L + 2, 1000, 0 } },
    { { TRB_LOAD_POINT, 1, 0, 1000, 0 }, { (TrbLoadKind) 42, 2, 3, 1000, 0 } },
  };

  for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      TrbBeam *b = trb_beam_new (bad[i].L, bad[i].E, bad[i].I, sup, 2, &error);

      g_assert_null (b);
      g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
      g_clear_error (&error);
    }
  g_assert_null (trb_beam_new (L, 200e9, 1e-4, off, 2, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);

  beam = trb_beam_new (L, 200e9, 1e-4, sup, 2, &error);
  g_assert_no_error (error);
  for (guint i = 0; i < G_N_ELEMENTS (bad_loads); i++)
    {
      g_assert_null (trb_beam_solve (beam, bad_loads[i], 2, &error));
      g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
      /* the message names the load */
      g_assert_nonnull (strstr (error->message, "Load 2"));
      g_clear_error (&error);
    }

  {
    /* a support a hair beyond the end is at the end (trb-beam.h: 1e-10 L) */
    TrbSupport near[] = { { -1e-12, TRB_SUPPORT_PIN }, { L * (1 + 1e-12), TRB_SUPPORT_ROLLER } };
    g_autoptr(TrbBeam) b = trb_beam_new (L, 200e9, 1e-4, near, 2, &error);
    const TrbSupport *got;

    g_assert_no_error (error);
    got = trb_beam_get_supports (b, NULL);
    assert_abs (got[0].x, 0, 0);
    assert_abs (got[1].x, L, 0);
  }
}

/* ---- whole-result properties ---- */

typedef struct
{
  TrbSupport supports[6];
  guint      n_supports;
  TrbLoad    loads[12];
  guint      n_loads;
  double     L;
} RandomBeam;

/* a random member with 1-5 supports (a lone one fixed) and 1-12 loads of every kind, some
 * exactly at the supports and the ends */
static void
random_beam (GRand      *rand,
             RandomBeam *rb)
{
  rb->L = g_rand_double_range (rand, 3, 30);
  rb->n_supports = g_rand_int_range (rand, 1, 6);
  for (guint i = 0; i < rb->n_supports; i++)
    {
      rb->supports[i].x = g_rand_boolean (rand) ? g_rand_double_range (rand, 0, rb->L) :
                          (g_rand_boolean (rand) ? 0 : rb->L);
      rb->supports[i].type = (TrbSupportType) g_rand_int_range (rand, 0, 3);
    }
  if (rb->n_supports == 1)
    rb->supports[0].type = TRB_SUPPORT_FIXED;
  else
    {
      /* keep two distinct supports */
      rb->supports[0].x = g_rand_double_range (rand, 0, rb->L / 3);
      rb->supports[1].x = g_rand_double_range (rand, 2 * rb->L / 3, rb->L);
    }
  rb->n_loads = g_rand_int_range (rand, 1, 13);
  for (guint i = 0; i < rb->n_loads; i++)
    {
      TrbLoad *ld = &rb->loads[i];
      double p = g_rand_double (rand);
      double a = p < 0.2 ? rb->supports[g_rand_int_range (rand, 0, rb->n_supports)].x :
                 p < 0.3 ? (g_rand_boolean (rand) ? 0 : rb->L) :
                 g_rand_double_range (rand, 0, rb->L);
      double b = MAX (a, g_rand_double_range (rand, a, rb->L));

      ld->kind = (TrbLoadKind) g_rand_int_range (rand, 0, 4);
      ld->a = a;
      ld->b = b;
      ld->w1 = g_rand_double_range (rand, -5e3, 40e3);
      ld->w2 = g_rand_double_range (rand, -5e3, 40e3);
    }
}

static void
test_equilibrium (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20260317);

  for (int trial = 0; trial < 300; trial++)
    {
      RandomBeam rb;
      g_autoptr(TrbBeam) beam = NULL;
      g_autoptr(TrbBeamResult) r = NULL;
      const TrbReaction *rr;
      const TrbSupport *sup;
      guint n;
      double force = 0, moment = 0, fscale = 0, mscale = 0, dscale = 0;
      TrbBeamExtremes e;

      random_beam (rand, &rb);
      beam = make_beam (rb.L, rb.supports, rb.n_supports);
      r = solve (beam, rb.loads, rb.n_loads);
      rr = trb_beam_result_get_reactions (r, &n);
      sup = trb_beam_get_supports (beam, NULL);

      /* statics: the reactions balance the loads, in force and in moment about x = 0
       * (counter-clockwise +); a linear load's resultant is (w1 + w2)(b - a)/2 acting at
       * a + (b - a)(w1 + 2 w2)/(3(w1 + w2)) */
      for (guint i = 0; i < n; i++)
        {
          force += rr[i].force;
          moment += rr[i].force * rr[i].x + rr[i].moment;
          fscale += fabs (rr[i].force);
          mscale += fabs (rr[i].force * rr[i].x) + fabs (rr[i].moment);
        }
      for (guint i = 0; i < rb.n_loads; i++)
        {
          const TrbLoad *ld = &rb.loads[i];
          double c = ld->b - ld->a;

          switch (ld->kind)
            {
            case TRB_LOAD_POINT:
              force -= ld->w1;
              moment -= ld->w1 * ld->a;
              fscale += fabs (ld->w1);
              mscale += fabs (ld->w1 * ld->a);
              break;
            case TRB_LOAD_MOMENT:
              moment -= ld->w1;
              mscale += fabs (ld->w1);
              break;
            case TRB_LOAD_UNIFORM:
              force -= ld->w1 * c;
              moment -= ld->w1 * c * (ld->a + c / 2);
              fscale += fabs (ld->w1 * c);
              mscale += fabs (ld->w1 * c * (ld->a + c / 2));
              break;
            case TRB_LOAD_LINEAR:
              /* as a uniform w1 plus a triangle rising to w2 - w1 */
              force -= (ld->w1 + ld->w2) * c / 2;
              moment -= ld->w1 * c * (ld->a + c / 2) +
                        (ld->w2 - ld->w1) * c / 2 * (ld->a + 2 * c / 3);
              fscale += fabs ((ld->w1 + ld->w2) * c / 2) + fabs (ld->w2 - ld->w1) * c;
              mscale += (fabs (ld->w1) + fabs (ld->w2)) * c * rb.L;
              break;
            }
        }
      assert_abs (force, 0, 1e-12 * fscale);
      assert_abs (moment, 0, 1e-12 * mscale);

      /* the free ends carry nothing: V and M just inside them are only what is applied
       * exactly there */
      trb_beam_result_extremes (r, 0, rb.L, &e);
      dscale = MAX (e.defl_down, e.defl_up);
      for (guint i = 0; i < n; i++)
        {
          /* no deflection at any support, no rotation at a fixed one */
          TrbBeamValues l = at (r, sup[i].x, TRB_SIDE_LEFT), rt = at (r, sup[i].x, TRB_SIDE_RIGHT);

          assert_abs (l.defl, 0, 1e-12 * dscale + 1e-300);
          assert_abs (rt.defl, 0, 1e-12 * dscale + 1e-300);
          if (sup[i].type == TRB_SUPPORT_FIXED)
            assert_abs (rt.theta, 0, 1e-12 * dscale / rb.L + 1e-300);
        }
    }
}

static void
assert_same_values (const TrbBeamResult *a,
                    const TrbBeamResult *b,
                    double               x,
                    TrbSide              side,
                    const double         scale[4])
{
  TrbBeamValues va = at (a, x, side), vb = at (b, x, side);

  assert_abs (va.V, vb.V, 1e-12 * scale[0]);
  assert_abs (va.M, vb.M, 1e-12 * scale[1]);
  assert_abs (va.theta, vb.theta, 1e-11 * scale[2]);
  assert_abs (va.defl, vb.defl, 1e-11 * scale[3]);
}

static void
test_combine (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (4242);

  for (int trial = 0; trial < 100; trial++)
    {
      RandomBeam cases[3];
      TrbLoad all[36];
      guint n_all = 0;
      const double f[3] = { 1.2, 1.6, 0.5 };  /* ASCE 7-16 §2.3.1 LRFD 2 (from memory) */
      g_autoptr(TrbBeam) beam = NULL;
      g_autoptr(TrbBeamResult) r0 = NULL, r1 = NULL, r2 = NULL, combo = NULL, direct = NULL;
      TrbBeamResult *parts[3];
      const TrbReaction *rc, *rd;
      const double *brk;
      guint nb, n;
      TrbBeamExtremes e;
      double scale[4];

      for (int c = 0; c < 3; c++)
        random_beam (rand, &cases[c]);
      /* one geometry, three load sets: take the first one's member for all */
      for (int c = 1; c < 3; c++)
        for (guint i = 0; i < cases[c].n_loads; i++)
          {
            TrbLoad *ld = &cases[c].loads[i];

            ld->b = MIN (ld->b * (cases[0].L / cases[c].L), cases[0].L);
            ld->a = MIN (ld->a * (cases[0].L / cases[c].L), ld->b);
          }
      beam = make_beam (cases[0].L, cases[0].supports, cases[0].n_supports);
      parts[0] = r0 = solve (beam, cases[0].loads, cases[0].n_loads);
      parts[1] = r1 = solve (beam, cases[1].loads, cases[1].n_loads);
      parts[2] = r2 = solve (beam, cases[2].loads, cases[2].n_loads);
      for (int c = 0; c < 3; c++)
        for (guint i = 0; i < cases[c].n_loads; i++)
          {
            all[n_all] = cases[c].loads[i];
            all[n_all].w1 *= f[c];
            all[n_all].w2 *= f[c];
            n_all++;
          }
      /* superposition is exact for a linear model: the combination must equal solving the
       * scaled loads together */
      combo = trb_beam_result_combine (parts, f, 3);
      direct = solve (beam, all, n_all);

      trb_beam_result_extremes (direct, 0, cases[0].L, &e);
      scale[0] = MAX (fabs (e.V_max), fabs (e.V_min));
      scale[1] = MAX (fabs (e.M_max), fabs (e.M_min));
      scale[3] = MAX (e.defl_down, e.defl_up);
      scale[2] = scale[3] / cases[0].L * 10;

      brk = trb_beam_result_get_breaks (direct, &nb);
      for (guint k = 0; k < nb; k++)
        {
          assert_same_values (combo, direct, brk[k], TRB_SIDE_LEFT, scale);
          assert_same_values (combo, direct, brk[k], TRB_SIDE_RIGHT, scale);
          if (k + 1 < nb)
            assert_same_values (combo, direct, (brk[k] + brk[k + 1]) / 2, TRB_SIDE_LEFT, scale);
        }
      rc = trb_beam_result_get_reactions (combo, &n);
      rd = trb_beam_result_get_reactions (direct, NULL);
      for (guint i = 0; i < n; i++)
        {
          assert_abs (rc[i].force, rd[i].force, 1e-12 * scale[0] * 4);
          assert_abs (rc[i].moment, rd[i].moment, 1e-12 * scale[1] * 4);
        }
    }

  {
    /* a zero factor adds nothing, not even its break points */
    const double L = 8.0;
    TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
    TrbLoad l0[] = { { TRB_LOAD_POINT, 3.0, 0, 1000, 0 } };
    TrbLoad l1[] = { { TRB_LOAD_POINT, 5.0, 0, 1000, 0 } };
    g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
    g_autoptr(TrbBeamResult) a = solve (beam, l0, 1);
    g_autoptr(TrbBeamResult) b = solve (beam, l1, 1);
    g_autoptr(TrbBeamResult) c = NULL;
    TrbBeamResult *parts[] = { a, b };
    const double f[] = { 2.0, 0.0 };
    const double *brk;
    guint nb;

    c = trb_beam_result_combine (parts, f, 2);
    brk = trb_beam_result_get_breaks (c, &nb);
    g_assert_cmpuint (nb, ==, 3);
    assert_abs (brk[1], 3.0, 0);
    /* case 8 again: M = Pab/L under the load, doubled */
    assert_rel (at (c, 3.0, TRB_SIDE_LEFT).M, 2 * 1000 * 3.0 * 5.0 / L, TIGHT);
  }
}

static void
test_sample_breaks_copy (void)
{
  const double L = 9.0;
  TrbSupport sup[] = { { 1.5, TRB_SUPPORT_PIN }, { 7.0, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = {
    { TRB_LOAD_POINT, 3.0, 0, 2000, 0 },
    { TRB_LOAD_LINEAR, 0.0, 4.5, 500, 1500 },
    { TRB_LOAD_MOMENT, L, 0, 800, 0 },
  };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, 3);
  g_autoptr(TrbBeamResult) copy = trb_beam_result_copy (r);
  const double expect[] = { 0, 1.5, 3.0, 4.5, 7.0, L };  /* ends, supports, load positions */
  double x[181];
  TrbBeamValues v[181];
  const double *brk;
  guint nb;

  brk = trb_beam_result_get_breaks (r, &nb);
  g_assert_cmpuint (nb, ==, G_N_ELEMENTS (expect));
  for (guint k = 0; k < nb; k++)
    assert_abs (brk[k], expect[k], 0);
  assert_abs (trb_beam_result_get_length (r), L, 0);

  trb_beam_result_sample (r, 181, x, v);
  assert_abs (x[0], 0, 0);
  assert_abs (x[180], L, 0);
  for (guint i = 0; i < 181; i++)
    {
      /* the right value at a jump, the left one at L (trb-beam.h) */
      TrbBeamValues e = at (r, x[i], i == 180 ? TRB_SIDE_LEFT : TRB_SIDE_RIGHT);

      assert_abs (v[i].V, e.V, 0);
      assert_abs (v[i].M, e.M, 0);
      assert_abs (v[i].theta, e.theta, 0);
      assert_abs (v[i].defl, e.defl, 0);
    }
  /* x = 3.0 is sample 60 of 181 over 9 m, exactly: there V takes the right value of the
   * jump at the 2000 N load, 2000 N below the left one (statics) */
  assert_abs (x[60], 3.0, 0);
  assert_rel (v[60].V, at (r, 3.0, TRB_SIDE_LEFT).V - 2000, TIGHT);

  /* a copy answers the same */
  for (guint i = 0; i < 181; i += 10)
    {
      TrbBeamValues a = at (r, x[i], TRB_SIDE_LEFT), b = at (copy, x[i], TRB_SIDE_LEFT);

      assert_abs (a.M, b.M, 0);
      assert_abs (a.defl, b.defl, 0);
    }
  {
    const TrbReaction *ra = reactions (r, 2), *rb = reactions (copy, 2);

    assert_abs (ra[0].force, rb[0].force, 0);
    assert_abs (ra[1].force, rb[1].force, 0);
  }
}

/* trb_beam_result_value() gives each field of trb_beam_result_eval() bit for bit, on both
 * sides: at the ends, outside them, at every break (the jumps) and between them. The check
 * values are the engine's own (a speed-up of the same operations). */
static void
test_value_same (void)
{
  const double L = 11.0;
  TrbSupport sup[] = { { 1.5, TRB_SUPPORT_PIN }, { 6.0, TRB_SUPPORT_ROLLER },
                       { 9.5, TRB_SUPPORT_ROLLER } };
  TrbLoad ld[] = {
    { TRB_LOAD_POINT, 3.0, 0, 2000, 0 },
    { TRB_LOAD_LINEAR, 0.0, 4.5, 500, 1500 },
    { TRB_LOAD_UNIFORM, 2.0, L, 700, 700 },
    { TRB_LOAD_MOMENT, 7.25, 0, 800, 0 },
    { TRB_LOAD_POINT, L, 0, 900, 0 },
  };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 3);
  g_autoptr(TrbBeamResult) r = solve (beam, ld, G_N_ELEMENTS (ld));
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261202);
  g_autoptr(GArray) xs = g_array_new (FALSE, FALSE, sizeof (double));
  const double *brk;
  guint nb;

  brk = trb_beam_result_get_breaks (r, &nb);
  g_array_append_vals (xs, brk, nb);
  for (guint i = 0; i < 400; i++)
    {
      double x = g_rand_double_range (rand, 0, L);

      g_array_append_val (xs, x);
    }
  {
    const double odd[] = { -1.0, L + 1.0, NAN, 1e-300, L * (1 - 1e-16) };

    g_array_append_vals (xs, odd, G_N_ELEMENTS (odd));
  }
  for (guint i = 0; i < xs->len; i++)
    {
      double x = g_array_index (xs, double, i);
      TrbBeamValues left = at (r, x, TRB_SIDE_LEFT), right = at (r, x, TRB_SIDE_RIGHT);

      for (TrbBeamQuantity q = TRB_BEAM_V; q <= TRB_BEAM_DEFL; q++)
        {
          const double *el = q == TRB_BEAM_V ? &left.V : q == TRB_BEAM_M ? &left.M
                             : q == TRB_BEAM_THETA ? &left.theta : &left.defl;
          const double *er = q == TRB_BEAM_V ? &right.V : q == TRB_BEAM_M ? &right.M
                             : q == TRB_BEAM_THETA ? &right.theta : &right.defl;
          double vl = 1, vr = 1, only;

          trb_beam_result_value (r, x, q, &vl, &vr);
          g_assert_cmpmem (&vl, sizeof vl, el, sizeof *el);
          g_assert_cmpmem (&vr, sizeof vr, er, sizeof *er);
          trb_beam_result_value (r, x, q, &only, NULL);
          g_assert_cmpmem (&only, sizeof only, el, sizeof *el);
          trb_beam_result_value (r, x, q, NULL, &only);
          g_assert_cmpmem (&only, sizeof only, er, sizeof *er);
        }
    }
}

static void
test_many_loads (void)
{
  /* n = 2m + 1 equal loads P at spacing s = L/(n + 1) on a simple span: ENGINEERING.md section 3
   * says the smeared load w = P/s gives the exact M max for odd n. By statics, at the centre
   * M = (nP/2)(L/2) - P sum_(i=1..m) (L/2 - i s) = P s (m + 1)^2 / 2 = (P/s) L^2 / 8.
   * 401 loads also take the engine past its stack scratch space. */
  const guint n = 401, m = 200;
  const double L = 40.2, P = 500.0, s = L / (n + 1);
  TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  g_autofree TrbLoad *ld = g_new0 (TrbLoad, n);
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = NULL;
  const TrbReaction *rr;
  TrbBeamExtremes e;
  guint nb;

  for (guint i = 0; i < n; i++)
    {
      ld[i].kind = TRB_LOAD_POINT;
      ld[i].a = (i + 1) * s;
      ld[i].w1 = P;
    }
  r = solve (beam, ld, n);
  rr = reactions (r, 2);
  assert_rel (rr[0].force, n * P / 2, TIGHT);
  assert_rel (rr[1].force, n * P / 2, TIGHT);
  trb_beam_result_get_breaks (r, &nb);
  g_assert_cmpuint (nb, ==, n + 2);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_rel (e.M_max, P * s * (m + 1) * (m + 1) / 2, 1e-10);
  assert_rel (e.M_max, (P / s) * L * L / 8, 1e-10);
  assert_rel (e.M_max_x, L / 2, 1e-12);
}

static void
test_empty (void)
{
  /* no loads, no response (statics) */
  const double L = 6.0;
  TrbSupport sup[] = { { 0, TRB_SUPPORT_FIXED }, { L, TRB_SUPPORT_PIN } };
  g_autoptr(TrbBeam) beam = make_beam (L, sup, 2);
  g_autoptr(TrbBeamResult) r = solve (beam, NULL, 0);
  const TrbReaction *rr = reactions (r, 2);
  TrbBeamExtremes e;

  assert_abs (rr[0].force, 0, 0);
  assert_abs (rr[0].moment, 0, 0);
  trb_beam_result_extremes (r, 0, L, &e);
  assert_abs (e.M_max, 0, 0);
  assert_abs (e.M_min, 0, 0);
  assert_abs (e.defl_down, 0, 0);
  assert_abs (e.defl_down_x, 0, 0);
  assert_abs (e.defl_up, 0, 0);
}

/* Numerical edge cases: spans of 1 in and 200 ft on one member, and sections a billion times
 * apart in stiffness, solved exactly to the tolerance of the other cases here.
 * Two spans L1, L2 under a uniform w, pinned ends: Clapeyron's three-moment equation gives the
 * support moment M_B = -w (L1^3 + L2^3) / (8 (L1 + L2)), and statics the reactions
 * R_A = w L1 / 2 + M_B / L1, R_C = w L2 / 2 + M_B / L2, R_B = w (L1 + L2) - R_A - R_C
 * (common practice; any structural analysis text). With L1 = 1 in the short span lifts off
 * its end support (R_A < 0). */
static void
test_numerical_edges (void)
{
  const double w = 1.0 * TRB_KLF;
  const double L1 = 1 * TRB_IN, L2 = 200 * TRB_FT, L = L1 + L2;
  const TrbSupport two[] = { { 0, TRB_SUPPORT_PIN }, { L1, TRB_SUPPORT_ROLLER },
                             { L, TRB_SUPPORT_ROLLER } };
  const TrbLoad uniform = { TRB_LOAD_UNIFORM, 0, L, w, w };
  double MB = -w * (L1 * L1 * L1 + L2 * L2 * L2) / (8 * L);
  double RA = w * L1 / 2 + MB / L1, RC = w * L2 / 2 + MB / L2, RB = w * L - RA - RC;
  g_autoptr(TrbBeam) beam = make_beam (L, two, G_N_ELEMENTS (two));
  g_autoptr(TrbBeamResult) r = solve (beam, &uniform, 1);
  const TrbReaction *reactions;
  guint n;
  double scale = fabs (RA) + fabs (RB) + fabs (RC);

  reactions = trb_beam_result_get_reactions (r, &n);
  g_assert_cmpuint (n, ==, 3);
  g_assert_cmpfloat (RA, <, 0);
  g_assert_cmpfloat_with_epsilon (reactions[0].force / scale, RA / scale, 1e-12);
  g_assert_cmpfloat_with_epsilon (reactions[1].force / scale, RB / scale, 1e-12);
  g_assert_cmpfloat_with_epsilon (reactions[2].force / scale, RC / scale, 1e-12);
  g_assert_cmpfloat_with_epsilon (at (r, L1, TRB_SIDE_LEFT).M / fabs (MB), MB / fabs (MB),
                                  1e-12);

  /* A simple span of 20 ft under 1 kip/ft with I from 1e-3 to 1e6 in^4: M = wL^2/8 whatever
   * the stiffness, mid-span deflection 5wL^4/(384EI) (AISC Manual Table 3-23 case 1, from
   * memory) to 1e-12 relative. */
  for (double I_in4 = 1e-3; I_in4 <= 1e6; I_in4 *= 1e3)
    {
      const double span = 20 * TRB_FT;
      const double I = I_in4 * TRB_IN * TRB_IN * TRB_IN * TRB_IN;
      const TrbSupport ends[] = { { 0, TRB_SUPPORT_PIN }, { span, TRB_SUPPORT_ROLLER } };
      const TrbLoad load = { TRB_LOAD_UNIFORM, 0, span, w, w };
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbBeam) b = trb_beam_new (span, E_STEEL, I, ends, 2, &error);
      g_autoptr(TrbBeamResult) rr = NULL;
      double want = 5 * w * pow (span, 4) / (384 * E_STEEL * I);
      TrbBeamValues mid;

      g_assert_no_error (error);
      rr = solve (b, &load, 1);
      mid = at (rr, span / 2, TRB_SIDE_LEFT);
      g_assert_true (isfinite (mid.defl));
      g_assert_cmpfloat_with_epsilon (mid.defl / want, 1.0, 1e-12);
      g_assert_cmpfloat_with_epsilon (mid.M / (w * span * span / 8), 1.0, 1e-12);
    }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/beam/simple/uniform", test_simple_uniform);
  g_test_add_func ("/trb/beam/simple/point-center", test_simple_point_center);
  g_test_add_func ("/trb/beam/simple/point-any", test_simple_point_any);
  g_test_add_func ("/trb/beam/simple/partial-uniform", test_simple_partial_uniform);
  g_test_add_func ("/trb/beam/simple/triangular", test_simple_triangular);
  g_test_add_func ("/trb/beam/cantilever", test_cantilever);
  g_test_add_func ("/trb/beam/propped/uniform", test_propped_uniform);
  g_test_add_func ("/trb/beam/fixed-fixed", test_fixed_fixed);
  g_test_add_func ("/trb/beam/overhang/tip-load", test_overhang_tip_load);
  g_test_add_func ("/trb/beam/overhang/uniform-and-point-at-support",
                   test_overhang_uniform_and_point_at_support);
  g_test_add_func ("/trb/beam/overhang/end-moment", test_moment_at_overhang_end);
  g_test_add_func ("/trb/beam/point-at-support", test_point_at_support);
  g_test_add_func ("/trb/beam/moment-jump", test_moment_jump);
  g_test_add_func ("/trb/beam/continuous/two-spans", test_two_spans_uniform);
  g_test_add_func ("/trb/beam/continuous/three-spans", test_three_spans_uniform);
  g_test_add_func ("/trb/beam/unstable", test_unstable);
  g_test_add_func ("/trb/beam/invalid", test_invalid);
  g_test_add_func ("/trb/beam/equilibrium", test_equilibrium);
  g_test_add_func ("/trb/beam/combine", test_combine);
  g_test_add_func ("/trb/beam/sample-breaks-copy", test_sample_breaks_copy);
  g_test_add_func ("/trb/beam/value-same", test_value_same);
  g_test_add_func ("/trb/beam/many-loads", test_many_loads);
  g_test_add_func ("/trb/beam/empty", test_empty);
  g_test_add_func ("/trb/beam/numerical-edges", test_numerical_edges);

  return g_test_run ();
}
