/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-error.h"
#include "trb-units.h"

/* Exact definitions (NIST SP 811 (2008) Appendix B.8 and its footnotes, from memory):
 * 1 in = 0.0254 m, 1 ft = 0.3048 m, 1 lb (mass) = 0.45359237 kg, standard gravity
 * g = 9.80665 m/s^2, so 1 lbf = 0.45359237 kg * 9.80665 m/s^2 = 4.4482216152605 N. */
#define IN   0.0254
#define FT   0.3048
#define LBM  0.45359237
#define G0   9.80665
#define LBF  (LBM * G0)

/* Relative tolerances: exact factors differ only by rounding of a few double operations;
 * NIST SP 811 prints inexact factors to 7 significant figures. */
#define EXACT 1e-13
#define NIST7 1e-6

static double
parse_ok (const char   *text,
          TrbDimension  dim)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *shown = g_strescape (text, NULL);
  double v = NAN;
  gboolean ok;

  /* escaped: the TAP log must stay valid UTF-8 */
  g_test_message ("parsing \"%s\" as %s", shown, trb_dimension_name (dim));
  ok = trb_units_parse (text, dim, &v, &error);
  g_assert_no_error (error);
  g_assert_true (ok);

  return v;
}

static void
check_parse (const char   *text,
             TrbDimension  dim,
             double        expected,
             double        rel)
{
  double v = parse_ok (text, dim);

  g_assert_cmpfloat_with_epsilon (v, expected, fabs (expected) * rel + 1e-300);
}

/* Parses text expecting failure; returns the message for further checks. */
static char *
parse_fails (const char   *text,
             TrbDimension  dim)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *shown = g_strescape (text, NULL);
  double v = 12345.0;
  gboolean ok;

  g_test_message ("parsing \"%s\" as %s, expecting an error", shown, trb_dimension_name (dim));
  ok = trb_units_parse (text, dim, &v, &error);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_UNIT);
  g_assert_false (ok);
  /* the value is left alone on failure */
  g_assert_cmpfloat (v, ==, 12345.0);
  g_assert_true (g_utf8_validate (error->message, -1, NULL));
  g_test_message ("  -> %s", error->message);

  return g_strdup (error->message);
}

static void
assert_contains (const char *haystack,
                 const char *needle)
{
  if (strstr (haystack, needle) == NULL)
    g_error ("\"%s\" does not contain \"%s\"", haystack, needle);
}

static void
test_dimension_name (void)
{
  /* the names docs/units.md lists, as messages use them */
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_LENGTH), ==, "length");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_FORCE), ==, "force");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_LINE_LOAD), ==, "line load");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_AREA_LOAD), ==, "area load");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_MOMENT), ==, "moment");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_STRESS), ==, "stress");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_AREA), ==, "area");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_SECTION_MODULUS), ==, "section modulus");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_INERTIA), ==, "moment of inertia");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_WARPING), ==, "warping constant");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_WEIGHT_PER_LENGTH), ==, "weight per length");
  g_assert_cmpstr (trb_dimension_name (TRB_DIM_DENSITY), ==, "weight density");
}

static void
test_constants (void)
{
  /* NIST SP 811 (2008) App. B.8, exact (from memory): in = 2.54 E-02 m, ft = 3.048 E-01 m */
  g_assert_cmpfloat_with_epsilon (TRB_IN, 0.0254, 0.0254 * EXACT);
  g_assert_cmpfloat_with_epsilon (TRB_FT, 0.3048, 0.3048 * EXACT);
  g_assert_cmpfloat_with_epsilon (TRB_FT, 12.0 * TRB_IN, 0.3048 * EXACT);
  /* lbf = lb * g0 = 0.45359237 * 9.80665 = 4.4482216152605 N (exact product, see top) */
  g_assert_cmpfloat_with_epsilon (TRB_LBF, LBF, LBF * EXACT);
  /* NIST SP 811 (2008) App. B.8 (from memory): psi = 6.894 757 E+03 Pa,
   * psf = 4.788 026 E+01 Pa, lbf/ft = 1.459 390 E+01 N/m, lbf*ft = 1.355 818 E+00 N*m */
  g_assert_cmpfloat_with_epsilon (TRB_PSI, 6.894757e3, 6.894757e3 * NIST7);
  g_assert_cmpfloat_with_epsilon (TRB_KSI, 6.894757e6, 6.894757e6 * NIST7);
  g_assert_cmpfloat_with_epsilon (TRB_PSF, 4.788026e1, 4.788026e1 * NIST7);
  g_assert_cmpfloat_with_epsilon (TRB_PLF, 1.459390e1, 1.459390e1 * NIST7);
  g_assert_cmpfloat_with_epsilon (TRB_KLF, 1.459390e4, 1.459390e4 * NIST7);
  g_assert_cmpfloat_with_epsilon (TRB_KIP_FT, 1.355818e3, 1.355818e3 * NIST7);
  /* NIST SP 811 (2008) App. B.8 (from memory): standard acceleration of gravity, exact */
  g_assert_cmpfloat_with_epsilon (TRB_STANDARD_GRAVITY, 9.80665, 9.80665 * EXACT);
}

static void
test_factors_length (void)
{
  /* NIST SP 811 (2008) App. B.8 (from memory): inch 2.54 E-02 m and foot 3.048 E-01 m,
   * both exact; mm, cm, m by the SI prefixes */
  check_parse ("1 in", TRB_DIM_LENGTH, IN, EXACT);
  check_parse ("1 inch", TRB_DIM_LENGTH, IN, EXACT);
  check_parse ("2 inches", TRB_DIM_LENGTH, 2 * IN, EXACT);
  check_parse ("1\"", TRB_DIM_LENGTH, IN, EXACT);
  check_parse ("1''", TRB_DIM_LENGTH, IN, EXACT);
  check_parse ("1 ft", TRB_DIM_LENGTH, FT, EXACT);
  check_parse ("1 foot", TRB_DIM_LENGTH, FT, EXACT);
  check_parse ("2 feet", TRB_DIM_LENGTH, 2 * FT, EXACT);
  check_parse ("1'", TRB_DIM_LENGTH, FT, EXACT);
  check_parse ("1 mm", TRB_DIM_LENGTH, 1e-3, EXACT);
  check_parse ("1 cm", TRB_DIM_LENGTH, 1e-2, EXACT);
  check_parse ("1 m", TRB_DIM_LENGTH, 1.0, EXACT);
  /* prime marks U+2032, U+2033 and typographic quotes U+2019, U+201D */
  check_parse ("1\xe2\x80\xb2", TRB_DIM_LENGTH, FT, EXACT);
  check_parse ("1\xe2\x80\xb3", TRB_DIM_LENGTH, IN, EXACT);
  check_parse ("1\xe2\x80\x99", TRB_DIM_LENGTH, FT, EXACT);
  check_parse ("1\xe2\x80\x9d", TRB_DIM_LENGTH, IN, EXACT);
}

static void
test_factors_force (void)
{
  /* lbf exact as derived at the top; NIST SP 811 (2008) App. B.8 (from memory):
   * kip (1000 lbf) = 4.448 222 E+03 N */
  check_parse ("1 lb", TRB_DIM_FORCE, LBF, EXACT);
  check_parse ("1 lbs", TRB_DIM_FORCE, LBF, EXACT);
  check_parse ("1 lbf", TRB_DIM_FORCE, LBF, EXACT);
  check_parse ("1 kip", TRB_DIM_FORCE, 1000 * LBF, EXACT);
  check_parse ("2 kips", TRB_DIM_FORCE, 2000 * LBF, EXACT);
  check_parse ("1 kip", TRB_DIM_FORCE, 4.448222e3, NIST7);
  check_parse ("1 N", TRB_DIM_FORCE, 1.0, EXACT);
  check_parse ("1 kN", TRB_DIM_FORCE, 1e3, EXACT);
}

static void
test_factors_line_load (void)
{
  /* NIST SP 811 (2008) App. B.8 (from memory): pound-force per foot = 1.459 390 E+01 N/m;
   * exactly LBF / FT */
  check_parse ("1 plf", TRB_DIM_LINE_LOAD, 1.459390e1, NIST7);
  check_parse ("1 plf", TRB_DIM_LINE_LOAD, LBF / FT, EXACT);
  check_parse ("1 lb/ft", TRB_DIM_LINE_LOAD, LBF / FT, EXACT);
  check_parse ("1 lbf/ft", TRB_DIM_LINE_LOAD, LBF / FT, EXACT);
  check_parse ("1 klf", TRB_DIM_LINE_LOAD, 1000 * LBF / FT, EXACT);
  check_parse ("1 kip/ft", TRB_DIM_LINE_LOAD, 1.459390e4, NIST7);
  check_parse ("1 N/m", TRB_DIM_LINE_LOAD, 1.0, EXACT);
  check_parse ("1 kN/m", TRB_DIM_LINE_LOAD, 1e3, EXACT);
}

static void
test_factors_area_load (void)
{
  /* NIST SP 811 (2008) App. B.8 (from memory): pound-force per square foot
   * = 4.788 026 E+01 Pa; exactly LBF / FT^2 */
  check_parse ("1 psf", TRB_DIM_AREA_LOAD, 4.788026e1, NIST7);
  check_parse ("1 psf", TRB_DIM_AREA_LOAD, LBF / (FT * FT), EXACT);
  check_parse ("1 lb/ft2", TRB_DIM_AREA_LOAD, LBF / (FT * FT), EXACT);
  check_parse ("1 lb/ft^2", TRB_DIM_AREA_LOAD, LBF / (FT * FT), EXACT);
  check_parse ("1 ksf", TRB_DIM_AREA_LOAD, 4.788026e4, NIST7);
  check_parse ("1 Pa", TRB_DIM_AREA_LOAD, 1.0, EXACT);
  check_parse ("1 kPa", TRB_DIM_AREA_LOAD, 1e3, EXACT);
  check_parse ("1 kN/m2", TRB_DIM_AREA_LOAD, 1e3, EXACT);
  check_parse ("1 kN/m^2", TRB_DIM_AREA_LOAD, 1e3, EXACT);
  check_parse ("1 kN/m\xc2\xb2", TRB_DIM_AREA_LOAD, 1e3, EXACT);
}

static void
test_factors_moment (void)
{
  const char *kip_ft[] = { "1 kip*ft", "1 kip-ft", "1 kip.ft", "1 kip\xc2\xb7" "ft",
                           "1 ft*kip", "1 ft-kip", "1 Kip-Ft", "1 KIP*FT", "1kip*ft" };

  /* NIST SP 811 (2008) App. B.8 (from memory): pound-force foot = 1.355 818 E+00 N*m,
   * pound-force inch = 1.129 848 E-01 N*m; exactly LBF * FT and LBF * IN */
  check_parse ("1 lb*ft", TRB_DIM_MOMENT, 1.355818, NIST7);
  check_parse ("1 lb-ft", TRB_DIM_MOMENT, LBF * FT, EXACT);
  check_parse ("1 ft-lb", TRB_DIM_MOMENT, LBF * FT, EXACT);
  check_parse ("1 lbf*ft", TRB_DIM_MOMENT, LBF * FT, EXACT);
  check_parse ("1 lb*in", TRB_DIM_MOMENT, 1.129848e-1, NIST7);
  check_parse ("1 in-lb", TRB_DIM_MOMENT, LBF * IN, EXACT);
  check_parse ("1 kip*in", TRB_DIM_MOMENT, 1000 * LBF * IN, EXACT);
  check_parse ("1 in-kip", TRB_DIM_MOMENT, 1000 * LBF * IN, EXACT);
  for (guint i = 0; i < G_N_ELEMENTS (kip_ft); i++)
    check_parse (kip_ft[i], TRB_DIM_MOMENT, 1000 * LBF * FT, EXACT);
  check_parse ("1 N*m", TRB_DIM_MOMENT, 1.0, EXACT);
  check_parse ("1 N-m", TRB_DIM_MOMENT, 1.0, EXACT);
  check_parse ("1 kN*m", TRB_DIM_MOMENT, 1e3, EXACT);
  check_parse ("1 kN.m", TRB_DIM_MOMENT, 1e3, EXACT);
  check_parse ("1 kN-m", TRB_DIM_MOMENT, 1e3, EXACT);
  check_parse ("1 kN\xc2\xb7m", TRB_DIM_MOMENT, 1e3, EXACT);
  /* a leading sign applies to the whole quantity */
  check_parse ("-3 kip*ft", TRB_DIM_MOMENT, -3000 * LBF * FT, EXACT);
}

static void
test_factors_stress (void)
{
  /* NIST SP 811 (2008) App. B.8 (from memory): psi = 6.894 757 E+03 Pa,
   * ksi = 6.894 757 E+06 Pa; exactly LBF / IN^2 */
  check_parse ("1 psi", TRB_DIM_STRESS, 6.894757e3, NIST7);
  check_parse ("1 psi", TRB_DIM_STRESS, LBF / (IN * IN), EXACT);
  check_parse ("1 lb/in2", TRB_DIM_STRESS, LBF / (IN * IN), EXACT);
  check_parse ("1 ksi", TRB_DIM_STRESS, 6.894757e6, NIST7);
  check_parse ("1 kip/in^2", TRB_DIM_STRESS, 1000 * LBF / (IN * IN), EXACT);
  check_parse ("1 Pa", TRB_DIM_STRESS, 1.0, EXACT);
  check_parse ("1 kPa", TRB_DIM_STRESS, 1e3, EXACT);
  check_parse ("1 MPa", TRB_DIM_STRESS, 1e6, EXACT);
  check_parse ("1 GPa", TRB_DIM_STRESS, 1e9, EXACT);
  check_parse ("1 N/mm2", TRB_DIM_STRESS, 1e6, EXACT);
  check_parse ("1 N/mm^2", TRB_DIM_STRESS, 1e6, EXACT);
  /* an exponent in the number, with and without a space before the unit */
  check_parse ("1.2e3 psi", TRB_DIM_STRESS, 1200 * LBF / (IN * IN), EXACT);
  check_parse ("1.2E3psi", TRB_DIM_STRESS, 1200 * LBF / (IN * IN), EXACT);
}

static void
test_factors_section (void)
{
  /* NIST SP 811 (2008) App. B.8 (from memory): square inch 6.4516 E-04 m^2 (exact),
   * cubic inch 1.638 706 4 E-05 m^3 (exact), inch^4 (moment of section) 4.162 314 E-07 m^4.
   * in^6 by hand: 0.0254^6 = (6.4516e-4)^3 = 2.685 358 665 4 E-10 m^6. */
  check_parse ("1 in2", TRB_DIM_AREA, 6.4516e-4, EXACT);
  check_parse ("1 in^2", TRB_DIM_AREA, 6.4516e-4, EXACT);
  check_parse ("1 IN2", TRB_DIM_AREA, 6.4516e-4, EXACT);
  check_parse ("1 in3", TRB_DIM_SECTION_MODULUS, 1.6387064e-5, EXACT);
  check_parse ("1 in^3", TRB_DIM_SECTION_MODULUS, 1.6387064e-5, EXACT);
  check_parse ("1 in4", TRB_DIM_INERTIA, 4.162314e-7, NIST7);
  check_parse ("1 in^4", TRB_DIM_INERTIA, IN * IN * IN * IN, EXACT);
  check_parse ("1 in\xe2\x81\xb4", TRB_DIM_INERTIA, IN * IN * IN * IN, EXACT);
  check_parse ("1 in6", TRB_DIM_WARPING, 2.6853586654e-10, 1e-10);
  check_parse ("1 in^6", TRB_DIM_WARPING, IN * IN * IN * IN * IN * IN, EXACT);

  /* SI prefixes: mm = 1e-3 m, cm = 1e-2 m, raised to the power */
  check_parse ("1 mm2", TRB_DIM_AREA, 1e-6, EXACT);
  check_parse ("1 mm^2", TRB_DIM_AREA, 1e-6, EXACT);
  check_parse ("1 cm2", TRB_DIM_AREA, 1e-4, EXACT);
  check_parse ("1 m2", TRB_DIM_AREA, 1.0, EXACT);
  check_parse ("1 mm3", TRB_DIM_SECTION_MODULUS, 1e-9, EXACT);
  check_parse ("1 cm3", TRB_DIM_SECTION_MODULUS, 1e-6, EXACT);
  check_parse ("1 m^3", TRB_DIM_SECTION_MODULUS, 1.0, EXACT);
  check_parse ("1 mm4", TRB_DIM_INERTIA, 1e-12, EXACT);
  check_parse ("1 cm^4", TRB_DIM_INERTIA, 1e-8, EXACT);
  check_parse ("1 m4", TRB_DIM_INERTIA, 1.0, EXACT);
  check_parse ("1 mm6", TRB_DIM_WARPING, 1e-18, EXACT);
  check_parse ("1 cm6", TRB_DIM_WARPING, 1e-12, EXACT);
  check_parse ("1 m^6", TRB_DIM_WARPING, 1.0, EXACT);

  /* a power of ten before the unit, as the SI display writes it: 333 x 10^6 x 1e-12 m^4 */
  check_parse ("333 \xc3\x97" "10^6 mm^4", TRB_DIM_INERTIA, 333e-6, EXACT);
  check_parse ("333x10^6 mm4", TRB_DIM_INERTIA, 333e-6, EXACT);
  check_parse ("1460 * 10^3 mm^3", TRB_DIM_SECTION_MODULUS, 1460e-6, EXACT);
  check_parse ("800 \xc3\x97" "10^-3 mm^2", TRB_DIM_AREA, 800e-9, EXACT);
}

static void
test_factors_weight (void)
{
  /* NIST SP 811 (2008) App. B.8 (from memory): pound per foot = 1.488 164 kg/m and pound
   * per cubic foot = 1.601 846 E+01 kg/m^3; as weights under g0 = 9.80665 m/s^2:
   * 1.488164 * 9.80665 = 14.59390 N/m and 16.01846 * 9.80665 = 157.0874 N/m^3 */
  check_parse ("1 lb/ft", TRB_DIM_WEIGHT_PER_LENGTH, 1.488164 * G0, NIST7);
  check_parse ("1 plf", TRB_DIM_WEIGHT_PER_LENGTH, LBF / FT, EXACT);
  check_parse ("1 kg/m", TRB_DIM_WEIGHT_PER_LENGTH, G0, EXACT);
  check_parse ("1 N/m", TRB_DIM_WEIGHT_PER_LENGTH, 1.0, EXACT);
  check_parse ("1 kN/m", TRB_DIM_WEIGHT_PER_LENGTH, 1e3, EXACT);

  check_parse ("1 pcf", TRB_DIM_DENSITY, 1.601846e1 * G0, NIST7);
  check_parse ("1 lb/ft3", TRB_DIM_DENSITY, LBF / (FT * FT * FT), EXACT);
  check_parse ("1 lb/ft^3", TRB_DIM_DENSITY, LBF / (FT * FT * FT), EXACT);
  check_parse ("1 kN/m3", TRB_DIM_DENSITY, 1e3, EXACT);
  check_parse ("1 N/m^3", TRB_DIM_DENSITY, 1.0, EXACT);
  check_parse ("1 kg/m3", TRB_DIM_DENSITY, G0, EXACT);
}

static void
test_feet_inch (void)
{
  /* by hand from 1 ft = 12 in, 1 in = 0.0254 m: 12'-6" = 150 in = 3.81 m;
   * 12'-6 1/2" = 150.5 in = 3.8227 m; 9" = 0.2286 m; 12' = 3.6576 m; 6 1/2" = 0.1651 m */
  check_parse ("12'-6\"", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12'-6 1/2\"", TRB_DIM_LENGTH, 3.8227, EXACT);
  check_parse ("9\"", TRB_DIM_LENGTH, 0.2286, EXACT);
  check_parse ("12'", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("6 1/2\"", TRB_DIM_LENGTH, 0.1651, EXACT);
  check_parse ("12 ft 6 in", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12' 6\"", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12'6\"", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12' - 6\"", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12ft6in", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12ft-6in", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12 ft 6 1/2 in", TRB_DIM_LENGTH, 3.8227, EXACT);
  check_parse ("12ft6 1/2in", TRB_DIM_LENGTH, 3.8227, EXACT);
  check_parse ("12'-6-1/2\"", TRB_DIM_LENGTH, 3.8227, EXACT);
  check_parse ("12'-6.5\"", TRB_DIM_LENGTH, 3.8227, EXACT);
  check_parse ("12\xe2\x80\xb2-6\xe2\x80\xb3", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12 FT 6 IN", TRB_DIM_LENGTH, 3.81, EXACT);
  check_parse ("12'-0\"", TRB_DIM_LENGTH, 3.6576, EXACT);
  /* 1/2" = 0.0127 m; 0'-0 1/16" = 0.0254 / 16 = 0.0015875 m; 3-1/2" = 0.0889 m */
  check_parse ("1/2\"", TRB_DIM_LENGTH, 0.0127, EXACT);
  check_parse ("0'-0 1/16\"", TRB_DIM_LENGTH, 0.0015875, EXACT);
  check_parse ("3-1/2 in", TRB_DIM_LENGTH, 0.0889, EXACT);
  /* the sign covers feet and inches together */
  check_parse ("-12'-6\"", TRB_DIM_LENGTH, -3.81, EXACT);
  check_parse ("-0'-9\"", TRB_DIM_LENGTH, -0.2286, EXACT);
}

static void
test_numbers (void)
{
  /* 12 ft = 3.6576 m (by hand, 12 * 0.3048); spacing, signs and number forms */
  check_parse ("12ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("  12 ft  ", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("\t12\tft\n", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("12\xc2\xa0" "ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("+12 ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("12.0 ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("12. ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("1.2e1 ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("120e-1 ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("0.012e+3ft", TRB_DIM_LENGTH, 3.6576, EXACT);
  check_parse ("\xe2\x88\x92" "12 ft", TRB_DIM_LENGTH, -3.6576, EXACT);
  /* .5 in = 0.0127 m */
  check_parse (".5 in", TRB_DIM_LENGTH, 0.0127, EXACT);
  check_parse ("0 m", TRB_DIM_LENGTH, 0.0, EXACT);
  /* parsing is independent of the C locale's decimal separator (g_ascii_strtod) */
  check_parse ("2.5 kN", TRB_DIM_FORCE, 2500.0, EXACT);
  /* a NULL value pointer only validates */
  g_assert_true (trb_units_parse ("12 ft", TRB_DIM_LENGTH, NULL, NULL));
}

static void
test_case (void)
{
  /* US customary spellings in any case; SI prefixes only as written */
  check_parse ("12 kip", TRB_DIM_FORCE, 12000 * LBF, EXACT);
  check_parse ("12 Kip", TRB_DIM_FORCE, 12000 * LBF, EXACT);
  check_parse ("12 KIP", TRB_DIM_FORCE, 12000 * LBF, EXACT);
  check_parse ("40 PSF", TRB_DIM_AREA_LOAD, 40 * LBF / (FT * FT), EXACT);
  check_parse ("0.6 Kip/Ft", TRB_DIM_LINE_LOAD, 600 * LBF / FT, EXACT);
}

static void
test_shared_spellings (void)
{
  /* lb/ft, plf, N/m, kN/m are both a line load and a weight per length; Pa and kPa both an
   * area load and a stress (docs/units.md). 50 lb/ft = 50 * LBF / FT; 2.4 kPa = 2400 Pa. */
  check_parse ("50 lb/ft", TRB_DIM_LINE_LOAD, 50 * LBF / FT, EXACT);
  check_parse ("50 lb/ft", TRB_DIM_WEIGHT_PER_LENGTH, 50 * LBF / FT, EXACT);
  check_parse ("2.4 kPa", TRB_DIM_AREA_LOAD, 2400.0, EXACT);
  check_parse ("2.4 kPa", TRB_DIM_STRESS, 2400.0, EXACT);
}

static void
test_errors_messages (void)
{
  g_autofree char *m1 = NULL, *m2 = NULL, *m3 = NULL;

  /* the exact wording docs/units.md gives for the three commonest mistakes */
  m1 = parse_fails ("12 kip", TRB_DIM_LENGTH);
  g_assert_cmpstr (m1, ==, "expected a length (such as 12 ft, 12'-6\", 3.6 m) but \"12 kip\" "
                           "is a force");
  m2 = parse_fails ("12 ft xyz", TRB_DIM_LENGTH);
  g_assert_cmpstr (m2, ==, "unexpected \"xyz\" after \"12 ft\" at character 7");
  m3 = parse_fails ("12", TRB_DIM_LENGTH);
  g_assert_cmpstr (m3, ==, "missing unit in \"12\": a length needs one (such as 12 ft or 3.6 m)");
}

typedef struct
{
  const char   *text;
  TrbDimension  dim;
  const char   *needle;   /* what the message must contain besides the quoted text */
} ErrorCase;

static void
test_errors (void)
{
  /* each is one of the error kinds docs/units.md lists */
  static const ErrorCase cases[] = {
    { "",                   TRB_DIM_LENGTH,    "empty text: expected a length" },
    { "   ",                TRB_DIM_LENGTH,    "empty text" },
    { "12",                 TRB_DIM_FORCE,     "missing unit in \"12\": a force needs one" },
    { "-3.5",               TRB_DIM_MOMENT,    "missing unit in \"-3.5\"" },
    { "12 kip",             TRB_DIM_LENGTH,    "\"12 kip\" is a force" },
    { "50 psi",             TRB_DIM_AREA_LOAD, "expected an area load (such as 40 psf, 2.4 kPa) "
                                                "but \"50 psi\" is a stress" },
    { "40 psf",             TRB_DIM_STRESS,    "\"40 psf\" is an area load" },
    { "0.6 kip/ft",         TRB_DIM_WEIGHT_PER_LENGTH, "\"0.6 kip/ft\" is a line load" },
    { "74 kg/m",            TRB_DIM_LINE_LOAD, "\"74 kg/m\" is a weight per length" },
    { "800 in4",            TRB_DIM_SECTION_MODULUS, "\"800 in4\" is a moment of inertia" },
    { "12 ft",              TRB_DIM_MOMENT,    "\"12 ft\" is a length" },
    { "12 xyz", TRB_DIM_LENGTH, "unknown unit \"xyz\" in \"12 xyz\": a length takes" },
    { "12 kn", TRB_DIM_FORCE, "unknown unit \"kn\" in \"12 kn\": did you mean \"kN\"?" },
    { "345 mPa",            TRB_DIM_STRESS,    "did you mean \"MPa\"?" },
    { "345 MPA",            TRB_DIM_STRESS,    "did you mean \"MPa\"?" },
    { "12 KN",              TRB_DIM_LENGTH,    "unknown unit \"KN\" in \"12 KN\": a length takes" },
    { "12 ft.",             TRB_DIM_LENGTH,    "unexpected \".\" after \"12 ft\" at character 6" },
    { "12 kip ft",          TRB_DIM_MOMENT,    "\"12 kip\" is a force" },
    { "12 ft 6 in 3",       TRB_DIM_LENGTH,    "unexpected \"3\" after \"12 ft 6 in\"" },
    { "12 ft 6",            TRB_DIM_LENGTH,    "expected inches after the feet in \"12 ft 6\"" },
    { "12'-6",              TRB_DIM_LENGTH,    "expected inches after the feet in \"12'-6\"" },
    { "12'-6 mm",           TRB_DIM_LENGTH,    "expected inches after the feet in \"12'-6 mm\"" },
    { "12'-14\"",           TRB_DIM_LENGTH,    "the inches in \"12'-14\"\" must be less than 12" },
    { "12 m 6 mm", TRB_DIM_LENGTH, "unexpected \"6 mm\" after \"12 m\" at character 6" },
    { "6\" 3'",             TRB_DIM_LENGTH,    "unexpected \"3'\" after \"6\"\"" },
    { "1/0\"",              TRB_DIM_LENGTH,    "a fraction in \"1/0\"\" has a zero denominator" },
    { "12'-6 1/0\"",        TRB_DIM_LENGTH,    "zero denominator" },
    { "1,200 lb",           TRB_DIM_FORCE,     "unexpected \",\" in \"1,200 lb\" at character 2" },
    { "1,5 m",              TRB_DIM_LENGTH,    "unexpected \",\" in \"1,5 m\"" },
    { "nan", TRB_DIM_LENGTH, "\"nan\" is not a finite number: expected a length" },
    { "NaN ft",             TRB_DIM_LENGTH,    "\"NaN ft\" is not a finite number" },
    { "inf kip",            TRB_DIM_FORCE,     "\"inf kip\" is not a finite number" },
    { "-inf kip",           TRB_DIM_FORCE,     "\"-inf kip\" is not a finite number" },
    { "Infinity psf",       TRB_DIM_AREA_LOAD, "\"Infinity psf\" is not a finite number" },
    { "1e400 ft",           TRB_DIM_LENGTH,    "\"1e400 ft\" is out of range" },
    { "-1e400 ft",          TRB_DIM_LENGTH,    "\"-1e400 ft\" is out of range" },
    { "1e308 kip",          TRB_DIM_FORCE,     "\"1e308 kip\" is out of range" },
    { "1e305 ksi",          TRB_DIM_STRESS,    "\"1e305 ksi\" is out of range" },
    { "ft",                 TRB_DIM_LENGTH,    "but \"ft\" does not start with a number" },
    { "-",                  TRB_DIM_LENGTH,    "but \"-\" does not start with a number" },
    { "- 3 ft",             TRB_DIM_LENGTH,    "does not start with a number" },
    { "--3 ft",             TRB_DIM_LENGTH,    "does not start with a number" },
    { ".",                  TRB_DIM_LENGTH,    "does not start with a number" },
    { "e3 ft",              TRB_DIM_LENGTH,    "does not start with a number" },
    { "0x10 ft",            TRB_DIM_LENGTH,    "unknown unit \"x\" in \"0x10 ft\"" },
    { "12 #",               TRB_DIM_LENGTH,    "unknown unit \"#\"" },
    { "12 ft6",             TRB_DIM_LENGTH,    "unknown unit \"ft6\"" },
    { "3 1/2",              TRB_DIM_LENGTH,    "missing unit in \"3 1/2\"" },
    { "12 \xff\xfe",        TRB_DIM_LENGTH,    "unknown unit \"\xef\xbf\xbd\xef\xbf\xbd\"" },
    { "12 ft\x01",          TRB_DIM_LENGTH,    "unexpected \" \" after \"12 ft\"" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *msg = parse_fails (cases[i].text, cases[i].dim);

      assert_contains (msg, cases[i].needle);
    }
}

static void
test_errors_long_text (void)
{
  g_autoptr(GString) s = g_string_new ("12 ft ");
  g_autofree char *msg = NULL;

  for (guint i = 0; i < 1000; i++)
    g_string_append (s, "junk ");

  /* quoted text is cut at 60 characters with an ellipsis (docs/units.md) */
  msg = parse_fails (s->str, TRB_DIM_LENGTH);
  assert_contains (msg, "unexpected \"junk junk");
  assert_contains (msg, "\xe2\x80\xa6\" after \"12 ft\" at character 7");
  g_assert_cmpuint (g_utf8_strlen (msg, -1), <, 120);
}

static void
check_format (double         value,
              TrbDimension   dim,
              TrbUnitSystem  system,
              const char    *expected)
{
  g_autofree char *s = trb_units_format (value, dim, system);

  g_assert_cmpstr (s, ==, expected);
}

static void
test_format_us (void)
{
  /* display rules of docs/units.md; inputs built from the exact factors above */
  check_format (150.5 * IN, TRB_DIM_LENGTH, TRB_UNIT_SYSTEM_US, "12'-6 1/2\"");
  check_format (9 * IN, TRB_DIM_LENGTH, TRB_UNIT_SYSTEM_US, "0'-9\"");
  /* force: kip, 2 decimals */
  check_format (12.3449 * 1000 * LBF, TRB_DIM_FORCE, TRB_UNIT_SYSTEM_US, "12.34 kip");
  check_format (12.3461 * 1000 * LBF, TRB_DIM_FORCE, TRB_UNIT_SYSTEM_US, "12.35 kip");
  check_format (-0.004 * 1000 * LBF, TRB_DIM_FORCE, TRB_UNIT_SYSTEM_US, "0.00 kip");
  /* line load: kip/ft, 3 decimals */
  check_format (0.6 * 1000 * LBF / FT, TRB_DIM_LINE_LOAD, TRB_UNIT_SYSTEM_US, "0.600 kip/ft");
  check_format (0.01234 * 1000 * LBF / FT, TRB_DIM_LINE_LOAD, TRB_UNIT_SYSTEM_US,
                "0.012 kip/ft");
  /* area load: psf, 1 decimal */
  check_format (40 * LBF / (FT * FT), TRB_DIM_AREA_LOAD, TRB_UNIT_SYSTEM_US, "40.0 psf");
  check_format (12.34 * LBF / (FT * FT), TRB_DIM_AREA_LOAD, TRB_UNIT_SYSTEM_US, "12.3 psf");
  /* moment: kip*ft, 2 decimals below 100, 1 from 100 up */
  check_format (123.44 * 1000 * LBF * FT, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_US, "123.4 kip*ft");
  check_format (99.123 * 1000 * LBF * FT, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_US, "99.12 kip*ft");
  check_format (-99.123 * 1000 * LBF * FT, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_US, "-99.12 kip*ft");
  check_format (-250.06 * 1000 * LBF * FT, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_US, "-250.1 kip*ft");
  /* stress: ksi, about 3 significant figures (2 - floor(log10 v) decimals, 0 to 4) */
  check_format (50 * 1000 * LBF / (IN * IN), TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US, "50.0 ksi");
  check_format (29000 * 1000 * LBF / (IN * IN), TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US,
                "29000 ksi");
  check_format (0.875 * 1000 * LBF / (IN * IN), TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US,
                "0.875 ksi");
  check_format (1.35 * 1000 * LBF / (IN * IN), TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US, "1.35 ksi");
  check_format (0.0123 * 1000 * LBF / (IN * IN), TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US,
                "0.0123 ksi");
  check_format (0.0, TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US, "0 ksi");
  /* section properties: in^n, same significant-figure rule */
  check_format (14.7 * IN * IN, TRB_DIM_AREA, TRB_UNIT_SYSTEM_US, "14.7 in^2");
  check_format (0.5 * IN * IN, TRB_DIM_AREA, TRB_UNIT_SYSTEM_US, "0.500 in^2");
  check_format (88.9 * IN * IN * IN, TRB_DIM_SECTION_MODULUS, TRB_UNIT_SYSTEM_US, "88.9 in^3");
  check_format (800 * IN * IN * IN * IN, TRB_DIM_INERTIA, TRB_UNIT_SYSTEM_US, "800 in^4");
  check_format (3000 * IN * IN * IN * IN * IN * IN, TRB_DIM_WARPING, TRB_UNIT_SYSTEM_US,
                "3000 in^6");
  /* weight per length lb/ft and density pcf, 1 decimal */
  check_format (50 * LBF / FT, TRB_DIM_WEIGHT_PER_LENGTH, TRB_UNIT_SYSTEM_US, "50.0 lb/ft");
  check_format (35 * LBF / (FT * FT * FT), TRB_DIM_DENSITY, TRB_UNIT_SYSTEM_US, "35.0 pcf");
}

static void
test_format_si (void)
{
  /* display rules of docs/units.md */
  check_format (3.81, TRB_DIM_LENGTH, TRB_UNIT_SYSTEM_SI, "3810 mm");
  check_format (-0.0004, TRB_DIM_LENGTH, TRB_UNIT_SYSTEM_SI, "0 mm");
  check_format (53378.7, TRB_DIM_FORCE, TRB_UNIT_SYSTEM_SI, "53.38 kN");
  check_format (8760.0, TRB_DIM_LINE_LOAD, TRB_UNIT_SYSTEM_SI, "8.76 kN/m");
  check_format (2400.0, TRB_DIM_AREA_LOAD, TRB_UNIT_SYSTEM_SI, "2.40 kPa");
  check_format (160e3, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_SI, "160.0 kN*m");
  check_format (12344.9, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_SI, "12.34 kN*m");
  check_format (345e6, TRB_DIM_STRESS, TRB_UNIT_SYSTEM_SI, "345 MPa");
  check_format (200e9, TRB_DIM_STRESS, TRB_UNIT_SYSTEM_SI, "200000 MPa");
  check_format (8.62e6, TRB_DIM_STRESS, TRB_UNIT_SYSTEM_SI, "8.62 MPa");
  check_format (9480e-6, TRB_DIM_AREA, TRB_UNIT_SYSTEM_SI, "9480 mm^2");
  check_format (1460e-6, TRB_DIM_SECTION_MODULUS, TRB_UNIT_SYSTEM_SI,
                "1460 \xc3\x97" "10^3 mm^3");
  check_format (333e-6, TRB_DIM_INERTIA, TRB_UNIT_SYSTEM_SI, "333 \xc3\x97" "10^6 mm^4");
  check_format (8.5e-6, TRB_DIM_INERTIA, TRB_UNIT_SYSTEM_SI, "8.50 \xc3\x97" "10^6 mm^4");
  check_format (800e-9, TRB_DIM_WARPING, TRB_UNIT_SYSTEM_SI, "800 \xc3\x97" "10^9 mm^6");
  check_format (74.4 * G0, TRB_DIM_WEIGHT_PER_LENGTH, TRB_UNIT_SYSTEM_SI, "74.4 kg/m");
  check_format (5500.0, TRB_DIM_DENSITY, TRB_UNIT_SYSTEM_SI, "5.50 kN/m^3");
}

static void
check_ft_in (double      meters,
             int         denominator,
             const char *expected)
{
  g_autofree char *s = trb_units_format_length_ft_in (meters, denominator);

  g_assert_cmpstr (s, ==, expected);
}

static void
test_format_ft_in (void)
{
  /* rounding to the nearest 1/16 in, by hand: 6.47 in * 16 = 103.52 -> 104 = 6 8/16 */
  check_ft_in (6.47 * IN, 16, "0'-6 1/2\"");
  /* 6.03 * 16 = 96.48 -> 96 = 6 in exactly */
  check_ft_in (6.03 * IN, 16, "0'-6\"");
  /* 6.125 * 16 = 98 = 6 2/16 = 6 1/8 (reduced) */
  check_ft_in (6.125 * IN, 16, "0'-6 1/8\"");
  /* 11.98 * 16 = 191.68 -> 192 = 12 in: carries into the feet */
  check_ft_in (11.98 * IN, 16, "1'-0\"");
  check_ft_in (IN / 16, 16, "0'-0 1/16\"");
  check_ft_in (150.5 * IN, 16, "12'-6 1/2\"");
  check_ft_in (-150.5 * IN, 16, "-12'-6 1/2\"");
  check_ft_in (144 * IN, 16, "12'-0\"");
  check_ft_in (0.0, 16, "0'-0\"");
  /* -0.0001 m = -0.0039 in: rounds to zero, so no minus sign */
  check_ft_in (-0.0001, 16, "0'-0\"");
  /* other denominators: 6.47 * 8 = 51.76 -> 52 = 6 4/8 = 6 1/2; 6.47 * 1 -> 6 */
  check_ft_in (6.47 * IN, 8, "0'-6 1/2\"");
  check_ft_in (6.47 * IN, 1, "0'-6\"");
  /* 6.3 * 32 = 201.6 -> 202 = 6 10/32 = 6 5/16 */
  check_ft_in (6.3 * IN, 32, "0'-6 5/16\"");
  /* 1000 ft of plan */
  check_ft_in (1000 * FT, 16, "1000'-0\"");
  check_ft_in (NAN, 16, "NaN");
}

static void
test_format_with_unit (void)
{
  g_autofree char *a = trb_units_format_with_unit (12.345678, "kip", 3);
  g_autofree char *b = trb_units_format_with_unit (-0.0001, "psf", 1);
  g_autofree char *c = trb_units_format_with_unit (2.5, NULL, 2);
  g_autofree char *d = trb_units_format_with_unit (NAN, "kip", 2);
  g_autofree char *e = trb_units_format_with_unit (-INFINITY, "kip", 2);
  g_autofree char *f = trb_units_format_with_unit (1234.5, "mm", 0);
  g_autofree char *g = trb_units_format_with_unit (-3.25, "kN*m", 2);
  g_autofree char *h = trb_units_format_with_unit (1e308, "N", 15);

  /* docs/units.md: "%.*f" rounding, decimal point, no "-0", NaN and inf spelt out */
  g_assert_cmpstr (a, ==, "12.346 kip");
  g_assert_cmpstr (b, ==, "0.0 psf");
  g_assert_cmpstr (c, ==, "2.50");
  g_assert_cmpstr (d, ==, "NaN kip");
  g_assert_cmpstr (e, ==, "-inf kip");
  /* 1234.5 is exact in binary; printf rounds the tie to even: 1234 */
  g_assert_cmpstr (f, ==, "1234 mm");
  g_assert_cmpstr (g, ==, "-3.25 kN*m");
  g_assert_true (g_str_has_suffix (h, ".000000000000000 N"));
}

static void
test_format_small_length (void)
{
  g_autofree char *us = trb_units_format_small_length (0.62 * IN, TRB_UNIT_SYSTEM_US);
  g_autofree char *si = trb_units_format_small_length (0.01574, TRB_UNIT_SYSTEM_SI);

  /* docs/units.md: inches with 2 decimals, millimetres with 1 */
  g_assert_cmpstr (us, ==, "0.62 in");
  g_assert_cmpstr (si, ==, "15.7 mm");
}

static void
test_display_unit (void)
{
  static const struct { TrbDimension dim; const char *us, *si; } rows[] = {
    { TRB_DIM_LENGTH,            "ft",     "mm" },
    { TRB_DIM_FORCE,             "kip",    "kN" },
    { TRB_DIM_LINE_LOAD,         "kip/ft", "kN/m" },
    { TRB_DIM_AREA_LOAD,         "psf",    "kPa" },
    { TRB_DIM_MOMENT,            "kip*ft", "kN*m" },
    { TRB_DIM_STRESS,            "ksi",    "MPa" },
    { TRB_DIM_AREA,              "in^2",   "mm^2" },
    { TRB_DIM_SECTION_MODULUS,   "in^3",   "10^3 mm^3" },
    { TRB_DIM_INERTIA,           "in^4",   "10^6 mm^4" },
    { TRB_DIM_WARPING,           "in^6",   "10^9 mm^6" },
    { TRB_DIM_WEIGHT_PER_LENGTH, "lb/ft",  "kg/m" },
    { TRB_DIM_DENSITY,           "pcf",    "kN/m^3" },
  };

  /* the table of display units in docs/units.md */
  for (guint i = 0; i < G_N_ELEMENTS (rows); i++)
    {
      g_assert_cmpstr (trb_units_display_unit (rows[i].dim, TRB_UNIT_SYSTEM_US), ==, rows[i].us);
      g_assert_cmpstr (trb_units_display_unit (rows[i].dim, TRB_UNIT_SYSTEM_SI), ==, rows[i].si);
    }
}

static void
test_to_display (void)
{
  /* by hand from the exact factors: 3.6576 m = 12 ft = 3657.6 mm; 12 kip; 333e-6 m^4 =
   * 333 x 10^6 mm^4; 800 in^4; 74.4 kg/m; 50 ksi */
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (3.6576, TRB_DIM_LENGTH,
                                                        TRB_UNIT_SYSTEM_US), 12.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (3.6576, TRB_DIM_LENGTH,
                                                        TRB_UNIT_SYSTEM_SI), 3657.6, 1e-9);
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (12000 * LBF, TRB_DIM_FORCE,
                                                        TRB_UNIT_SYSTEM_US), 12.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (333e-6, TRB_DIM_INERTIA,
                                                        TRB_UNIT_SYSTEM_SI), 333.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (800 * IN * IN * IN * IN,
                                                        TRB_DIM_INERTIA, TRB_UNIT_SYSTEM_US),
                                  800.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (74.4 * G0, TRB_DIM_WEIGHT_PER_LENGTH,
                                                        TRB_UNIT_SYSTEM_SI), 74.4, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_units_to_display (50e3 * LBF / (IN * IN),
                                                        TRB_DIM_STRESS, TRB_UNIT_SYSTEM_US),
                                  50.0, 1e-12);

  /* decimals of docs/units.md, for tables */
  g_assert_cmpint (trb_units_display_decimals (12.0, TRB_DIM_LENGTH, TRB_UNIT_SYSTEM_US), ==, 2);
  g_assert_cmpint (trb_units_display_decimals (99.9, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_SI), ==, 2);
  g_assert_cmpint (trb_units_display_decimals (100.0, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_SI), ==, 1);
  g_assert_cmpint (trb_units_display_decimals (-250.0, TRB_DIM_MOMENT, TRB_UNIT_SYSTEM_US), ==, 1);
  g_assert_cmpint (trb_units_display_decimals (0.00012, TRB_DIM_AREA, TRB_UNIT_SYSTEM_US), ==, 4);
  g_assert_cmpint (trb_units_display_decimals (123456.0, TRB_DIM_AREA, TRB_UNIT_SYSTEM_SI), ==, 0);
}

/* Half the last shown digit of trb_units_format(): how far parse(format(x)) may be off. */
static double
display_half_step (double        value,
                   TrbDimension  dim,
                   TrbUnitSystem system)
{
  double shown, unit;
  int decimals;

  if (dim == TRB_DIM_LENGTH && system == TRB_UNIT_SYSTEM_US)
    return IN / 32;

  shown = trb_units_to_display (value, dim, system);
  unit = value / shown;
  decimals = trb_units_display_decimals (shown, dim, system);

  return 0.5 * pow (10.0, -decimals) * fabs (unit);
}

static void
test_roundtrip (void)
{
  /* a typical size of each dimension in SI, scaled over five decades below */
  static const double typical[TRB_N_DIMS] = {
    [TRB_DIM_LENGTH] = 3.0,       [TRB_DIM_FORCE] = 50e3,
    [TRB_DIM_LINE_LOAD] = 10e3,   [TRB_DIM_AREA_LOAD] = 2e3,
    [TRB_DIM_MOMENT] = 100e3,     [TRB_DIM_STRESS] = 200e6,
    [TRB_DIM_AREA] = 1e-2,        [TRB_DIM_SECTION_MODULUS] = 1e-3,
    [TRB_DIM_INERTIA] = 3e-4,     [TRB_DIM_WARPING] = 1e-6,
    [TRB_DIM_WEIGHT_PER_LENGTH] = 500.0, [TRB_DIM_DENSITY] = 5e3,
  };
  static const double scale[] = { 0.0137, 0.31, 1.0, 1.77, 23.9, 0.0, -0.42, -3.3 };

  for (int dim = 0; dim < TRB_N_DIMS; dim++)
    for (int system = TRB_UNIT_SYSTEM_US; system <= TRB_UNIT_SYSTEM_SI; system++)
      for (guint i = 0; i < G_N_ELEMENTS (scale); i++)
        {
          double x = typical[dim] * scale[i];
          g_autofree char *text = trb_units_format (x, dim, system);
          double back = parse_ok (text, dim);
          double tol = display_half_step (x, dim, system) * (1 + 1e-9) + 1e-300;

          if (x == 0.0)
            tol = 1e-300;
          g_test_message ("%s: %g -> \"%s\" -> %g (tolerance %g)",
                          trb_dimension_name (dim), x, text, back, tol);
          g_assert_cmpfloat_with_epsilon (back, x, tol);
        }
}

/* Any input: either a finite value, or a TRB_ERROR_UNIT with a valid UTF-8 message.
 * Run under a sanitizer this also shows that nothing reads past the string. */
static void
check_any (const char *text)
{
  for (int dim = 0; dim < TRB_N_DIMS; dim++)
    {
      g_autoptr(GError) error = NULL;
      double v = 0.0;

      if (trb_units_parse (text, dim, &v, &error))
        {
          g_assert_no_error (error);
          g_assert_true (isfinite (v));
        }
      else
        {
          g_assert_error (error, TRB_ERROR, TRB_ERROR_UNIT);
          g_assert_true (g_utf8_validate (error->message, -1, NULL));
          g_assert_cmpuint (strlen (error->message), >, 10);
        }
    }
}

static void
test_robust (void)
{
  static const char *valid[] = {
    "12'-6 1/2\"", "12 ft 6 1/2 in", "-3 kip*ft", "1.2e3 psi", "333 \xc3\x97" "10^6 mm^4",
    "2.4 kN/m\xc2\xb2", "12\xe2\x80\xb2-6\xe2\x80\xb3", "50 lb/ft", "\xe2\x88\x92" "1 kN\xc2\xb7m",
  };
  static const char alphabet[] =
    "0123456789.-+eE/'\" ftinkipNmPa^*x,\xc3\x97\xc2\xb2\xe2\x80\xb2\xff";
  g_autoptr(GRand) rand = g_rand_new_with_seed (20260101);
  char buf[24];

  /* every prefix of valid text, cut even inside a UTF-8 sequence */
  for (guint i = 0; i < G_N_ELEMENTS (valid); i++)
    for (gsize len = 0; len <= strlen (valid[i]); len++)
      {
        g_autofree char *prefix = g_strndup (valid[i], len);

        check_any (prefix);
      }

  /* random strings over the characters the parser cares about, and random bytes */
  for (guint i = 0; i < 20000; i++)
    {
      guint len = g_rand_int_range (rand, 0, sizeof buf);

      for (guint j = 0; j < len; j++)
        buf[j] = (i % 4 == 0) ? (char) g_rand_int_range (rand, 1, 256)
                              : alphabet[g_rand_int_range (rand, 0, sizeof alphabet - 1)];
      buf[len] = '\0';
      check_any (buf);
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/units/dimension-name", test_dimension_name);
  g_test_add_func ("/trb/units/constants", test_constants);
  g_test_add_func ("/trb/units/factors/length", test_factors_length);
  g_test_add_func ("/trb/units/factors/force", test_factors_force);
  g_test_add_func ("/trb/units/factors/line-load", test_factors_line_load);
  g_test_add_func ("/trb/units/factors/area-load", test_factors_area_load);
  g_test_add_func ("/trb/units/factors/moment", test_factors_moment);
  g_test_add_func ("/trb/units/factors/stress", test_factors_stress);
  g_test_add_func ("/trb/units/factors/section", test_factors_section);
  g_test_add_func ("/trb/units/factors/weight", test_factors_weight);
  g_test_add_func ("/trb/units/feet-inch", test_feet_inch);
  g_test_add_func ("/trb/units/numbers", test_numbers);
  g_test_add_func ("/trb/units/case", test_case);
  g_test_add_func ("/trb/units/shared-spellings", test_shared_spellings);
  g_test_add_func ("/trb/units/errors/messages", test_errors_messages);
  g_test_add_func ("/trb/units/errors/kinds", test_errors);
  g_test_add_func ("/trb/units/errors/long-text", test_errors_long_text);
  g_test_add_func ("/trb/units/format/us", test_format_us);
  g_test_add_func ("/trb/units/format/si", test_format_si);
  g_test_add_func ("/trb/units/format/ft-in", test_format_ft_in);
  g_test_add_func ("/trb/units/format/with-unit", test_format_with_unit);
  g_test_add_func ("/trb/units/format/small-length", test_format_small_length);
  g_test_add_func ("/trb/units/display-unit", test_display_unit);
  g_test_add_func ("/trb/units/to-display", test_to_display);
  g_test_add_func ("/trb/units/roundtrip", test_roundtrip);
  g_test_add_func ("/trb/units/robust", test_robust);

  return g_test_run ();
}
