/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-section.h"
#include "trb-units.h"

#define IN2 (TRB_IN * TRB_IN)
#define IN3 (TRB_IN * TRB_IN * TRB_IN)
#define IN4 (IN2 * IN2)

/* Relative closeness, as the tolerances below are stated. */
static void
assert_rel (double      value,
            double      expected,
            double      tolerance)
{
  g_assert_cmpfloat_with_epsilon (value / expected, 1.0, tolerance);
}

/* ------------------------------------------------------------------------------------------ */
/* Every W shape of the AISC Shapes Database v16.0, recomputed from d, bf, tw, tf and
 * r = kdes - tf and compared with the database's own properties (the catalog holds them as
 * tabulated). The database prints dimensions to three figures (W14X68: d 14.0 for 14.04),
 * so a property computed from printed dimensions cannot match a property computed from the
 * unrounded ones to better than about 1 %; the tolerances say what the formulas achieve on
 * the printed dimensions, and the mean error shows they carry no bias of their own. */

typedef struct
{
  const char *name;
  gsize       offset;
  double      tolerance;  /* largest relative error allowed on any shape */
} Property;

#define FIELD(f) G_STRUCT_OFFSET (TrbSection, f)
#define VALUE(s, off) (*(const double *) ((const char *) (s) + (off)))

static const Property w_properties[] = {
  { "A", FIELD (A), 0.010 },     /* worst 0.73 %, W18X192 */
  { "Ix", FIELD (Ix), 0.010 },   /* worst 0.97 %, W18X130 */
  { "Sx", FIELD (Sx), 0.010 },   /* worst 0.81 %, W44X262 */
  { "Zx", FIELD (Zx), 0.015 },   /* worst 1.03 %, W14X68 (d printed 14.0) */
  { "Iy", FIELD (Iy), 0.015 },   /* worst 1.44 %, W36X135 */
  { "Sy", FIELD (Sy), 0.015 },   /* worst 1.19 %, W44X262 */
  { "Zy", FIELD (Zy), 0.015 },   /* worst 1.05 %, W33X152 */
  { "rx", FIELD (rx), 0.010 },   /* worst 0.56 % */
  { "ry", FIELD (ry), 0.010 },   /* worst 0.69 %, W30X132 */
  { "J", FIELD (J), 0.020 },     /* worst 1.15 %, W40X331: El Darwish and Johnston */
  { "Cw", FIELD (Cw), 0.025 },   /* worst 2.1 %, W16X89: Iy ho^2 / 4 */
  { "rts", FIELD (rts), 0.010 }, /* worst 0.67 % */
  { "ho", FIELD (ho), 0.006 },   /* worst 0.49 %: d - tf from printed d and tf */
};

static void
test_w_shapes_against_database (void)
{
  const TrbCatalog *catalog = trb_catalog_get_default ();
  const TrbSection *shapes;
  guint n;
  double worst[G_N_ELEMENTS (w_properties)] = { 0 };
  double sum[G_N_ELEMENTS (w_properties)] = { 0 };
  const char *worst_shape[G_N_ELEMENTS (w_properties)] = { NULL };

  shapes = trb_catalog_get_family (catalog, TRB_FAMILY_W, &n);
  /* AISC Shapes Database v16.0: 289 W shapes (tests/test-catalog.c checks the count) */
  g_assert_cmpuint (n, ==, 289);

  for (guint i = 0; i < n; i++)
    {
      const TrbSection *tab = &shapes[i];
      TrbSection calc;

      trb_section_compute_i (tab->d, tab->bf, tab->tw, tab->tf, tab->kdes - tab->tf, &calc);
      for (guint p = 0; p < G_N_ELEMENTS (w_properties); p++)
        {
          double e = VALUE (&calc, w_properties[p].offset) / VALUE (tab, w_properties[p].offset)
                     - 1.0;

          sum[p] += e;
          if (fabs (e) >= fabs (worst[p]))
            {
              worst[p] = e;
              worst_shape[p] = tab->designation;
            }
        }
    }

  for (guint p = 0; p < G_N_ELEMENTS (w_properties); p++)
    {
      double mean = sum[p] / n;

      g_test_message ("%-3s worst %+.2f %% (%s), mean %+.3f %%, tolerance %.1f %%",
                      w_properties[p].name, 100 * worst[p], worst_shape[p], 100 * mean,
                      100 * w_properties[p].tolerance);
      g_assert_cmpfloat (fabs (worst[p]), <=, w_properties[p].tolerance);
      /* rounding of the printed dimensions scatters both ways; a formula error would not */
      g_assert_cmpfloat (fabs (mean), <=, 0.002);
    }
}

/* The plain sum of b t^3 / 3 misses the junctions, which is why the fillet formula is used:
 * W40X149's tabulated J is 9.36 in^4 (AISC Shapes Database v16.0). */
static void
test_w_torsion_junction (void)
{
  const TrbSection *tab = trb_catalog_lookup (trb_catalog_get_default (), "W40X149");
  TrbSection calc;
  double plain;

  g_assert_nonnull (tab);
  assert_rel (tab->J, 9.36 * IN4, 1e-12);  /* AISC Shapes Database v16.0, W40X149 J */
  trb_section_compute_i (tab->d, tab->bf, tab->tw, tab->tf, tab->kdes - tab->tf, &calc);
  /* sum of b t^3 / 3 over the flanges and the web between flange centres */
  plain = (2 * tab->bf * pow (tab->tf, 3) + (tab->d - tab->tf) * pow (tab->tw, 3)) / 3;
  g_test_message ("W40X149 J: fillet formula %.3f, plain sum %.3f, database 9.36 in^4",
                  calc.J / IN4, plain / IN4);
  assert_rel (calc.J, tab->J, 0.02);
  g_assert_cmpfloat (fabs (plain / tab->J - 1), >, 0.10);
}

/* An I without fillets, by hand: d 10, bf 5, tw 0.5, tf 1 (any length unit).
 *   A  = 2 (5)(1) + (8)(0.5)                           = 14
 *   Ix = [5 (10^3) - (5 - 0.5)(8^3)] / 12 = (5000 - 2304) / 12 = 224.6667
 *   Sx = Ix / 5                                        = 44.9333
 *   Zx = 5 (1)(10 - 1) + 0.5 (8^2) / 4 = 45 + 8         = 53
 *   Iy = 2 (1)(5^3) / 12 + 8 (0.5^3) / 12 = 20.8333 + 0.0833 = 20.9167
 *   Zy = 1 (5^2) / 2 + 8 (0.5^2) / 4 = 12.5 + 0.5       = 13
 *   ho = 10 - 1 = 9;  Cw = Iy ho^2 / 4 = 20.9167 (81) / 4 = 423.5625
 *   rts^2 = sqrt (Iy Cw) / Sx = sqrt (20.9167 x 423.5625) / 44.9333 = 94.125 / 44.9333
 *         = 2.09477 (AISC 360-16 Eq. F2-7)                                                */
static void
test_i_by_hand (void)
{
  TrbSection s;

  trb_section_compute_i (10, 5, 0.5, 1, 0, &s);
  g_assert_cmpint (s.kind, ==, TRB_SHAPE_W);
  g_assert_cmpfloat_with_epsilon (s.A, 14.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s.Ix, 2696.0 / 12.0, 1e-10);
  g_assert_cmpfloat_with_epsilon (s.Sx, 2696.0 / 60.0, 1e-10);
  g_assert_cmpfloat_with_epsilon (s.Zx, 53.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s.Iy, 251.0 / 12.0, 1e-10);
  g_assert_cmpfloat_with_epsilon (s.Zy, 13.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s.ho, 9.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s.Cw, 251.0 / 12.0 * 81.0 / 4.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (s.rts * s.rts, 94.125 / (2696.0 / 60.0), 1e-9);
  g_assert_cmpfloat_with_epsilon (s.bf_2tf, 2.5, 1e-12);   /* 5 / (2 x 1) */
  g_assert_cmpfloat_with_epsilon (s.h_tw, 16.0, 1e-12);    /* (10 - 2 x 1) / 0.5 */
}

/* The fillet terms against a midpoint-rule integration over the cross-section (a grid of
 * 4000 x 4000 cells over the bounding box, each cell in or out by its centre): d 10, bf 5,
 * tw 0.5, tf 1, r 0.8. The grid's error is of the order of the cell, 1/400 of the fillet
 * radius, on the fillet terms only; 0.05 % on the totals covers it. */
static void
test_i_fillets_by_integration (void)
{
  const double d = 10, bf = 5, tw = 0.5, tf = 1, r = 0.8;
  const int n = 4000;
  const double hx = bf / n, hy = d / n;
  double A = 0, Ix = 0, Iy = 0, Zx = 0, Zy = 0;
  TrbSection s;

  for (int j = 0; j < n; j++)
    {
      double y = -d / 2 + (j + 0.5) * hy;
      double ay = fabs (y);

      for (int i = 0; i < n; i++)
        {
          double x = -bf / 2 + (i + 0.5) * hx;
          double ax = fabs (x);
          gboolean inside;

          if (ay >= d / 2 - tf)
            inside = TRUE;                      /* flange */
          else if (ax <= tw / 2)
            inside = TRUE;                      /* web */
          else if (ax <= tw / 2 + r && ay >= d / 2 - tf - r)
            {
              /* fillet: inside the corner square, outside the circle centred r from both
               * faces */
              double cx = tw / 2 + r, cy = d / 2 - tf - r;

              inside = (ax - cx) * (ax - cx) + (ay - cy) * (ay - cy) >= r * r;
            }
          else
            inside = FALSE;

          if (inside)
            {
              double da = hx * hy;

              A += da;
              Ix += y * y * da;
              Iy += x * x * da;
              Zx += ay * da;
              Zy += ax * da;
            }
        }
    }

  trb_section_compute_i (d, bf, tw, tf, r, &s);
  assert_rel (s.A, A, 5e-4);
  assert_rel (s.Ix, Ix, 5e-4);
  assert_rel (s.Iy, Iy, 5e-4);
  assert_rel (s.Zx, Zx, 5e-4);
  assert_rel (s.Zy, Zy, 5e-4);
  /* and the fillets add what their area says: 4 (1 - pi/4) r^2 = 0.54936 (exact geometry) */
  g_assert_cmpfloat_with_epsilon (s.A - 14.0, 4 * (1 - G_PI / 4) * r * r, 1e-12);
}

/* ------------------------------------------------------------------------------------------ */
/* Rectangles */

/* Torsion of a solid rectangle, long side a, short side b: J = k a b^3 with k = 0.141,
 * 0.196, 0.229, 0.263, 0.291, 0.312 for a/b = 1, 1.5, 2, 3, 5, 10 (Timoshenko and Goodier,
 * Theory of Elasticity, torsion of rectangular bars (from memory)); three figures. */
static void
test_rect_torsion (void)
{
  static const struct { double ratio, k; } table[] = {
    { 1.0, 0.141 }, { 1.5, 0.196 }, { 2.0, 0.229 }, { 3.0, 0.263 }, { 5.0, 0.291 },
    { 10.0, 0.312 },
  };

  for (guint i = 0; i < G_N_ELEMENTS (table); i++)
    {
      double b = 0.05, a = table[i].ratio * b;

      assert_rel (trb_section_rect_torsion_j (a, b), table[i].k * a * pow (b, 3), 0.004);
      /* the sides may come in either order */
      g_assert_cmpfloat_with_epsilon (trb_section_rect_torsion_j (b, a),
                                      trb_section_rect_torsion_j (a, b), 1e-20);
    }
}

/* Finds a column by name in a CSV header. */
static int
column_index (char      **header,
              const char *name)
{
  for (int i = 0; header[i] != NULL; i++)
    if (g_str_equal (g_strstrip (header[i]), name))
      return i;
  g_assert_not_reached ();
}

/* lumber.csv's A, S and I (dressed sizes per NDS Supplement 2018 Table 1B (from memory),
 * tabulated to 4 decimals) recomputed from b and d. */
static void
test_rect_lumber_table (void)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "..", "data", "sections",
                                                 "lumber.csv", NULL);
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  g_auto(GStrv) lines = NULL;
  g_auto(GStrv) header = NULL;
  int ib, id, iA, iSx, iIx, iSy, iIy;
  guint rows = 0;

  g_file_get_contents (path, &text, NULL, &error);
  g_assert_no_error (error);
  lines = g_strsplit (text, "\n", -1);
  header = g_strsplit (lines[0], ",", -1);
  ib = column_index (header, "b_in");
  id = column_index (header, "d_in");
  iA = column_index (header, "A_in2");
  iSx = column_index (header, "Sx_in3");
  iIx = column_index (header, "Ix_in4");
  iSy = column_index (header, "Sy_in3");
  iIy = column_index (header, "Iy_in4");

  for (guint l = 1; lines[l] != NULL; l++)
    {
      g_auto(GStrv) f = NULL;
      TrbSection s;

      if (*g_strstrip (lines[l]) == '\0')
        continue;
      f = g_strsplit (lines[l], ",", -1);
      trb_section_compute_rect (g_ascii_strtod (f[ib], NULL) * TRB_IN,
                                g_ascii_strtod (f[id], NULL) * TRB_IN, 1, &s);
      /* half a unit in the fourth decimal, the table's rounding */
      g_assert_cmpfloat_with_epsilon (s.A / IN2, g_ascii_strtod (f[iA], NULL), 5.1e-5);
      g_assert_cmpfloat_with_epsilon (s.Sx / IN3, g_ascii_strtod (f[iSx], NULL), 5.1e-5);
      g_assert_cmpfloat_with_epsilon (s.Ix / IN4, g_ascii_strtod (f[iIx], NULL), 5.1e-5);
      g_assert_cmpfloat_with_epsilon (s.Sy / IN3, g_ascii_strtod (f[iSy], NULL), 5.1e-5);
      g_assert_cmpfloat_with_epsilon (s.Iy / IN4, g_ascii_strtod (f[iIy], NULL), 5.1e-5);
      rows++;
    }
  /* lumber.csv lists 31 sizes */
  g_assert_cmpuint (rows, ==, 31);
}

/* ENGINEERING.md §8 item 10 (cf. NDS Supplement 2018 Table 1B (from memory)):
 * 2x10: A 13.875, S 21.39, I 98.93; 6x12: A 63.25, S 121.23, I 697.07, printed to 2
 * decimals. */
static void
test_rect_worked_values (void)
{
  TrbSection s;

  trb_section_compute_rect (1.5 * TRB_IN, 9.25 * TRB_IN, 1, &s);
  g_assert_cmpfloat_with_epsilon (s.A / IN2, 13.875, 5e-4);
  g_assert_cmpfloat_with_epsilon (s.Sx / IN3, 21.39, 5e-3);
  g_assert_cmpfloat_with_epsilon (s.Ix / IN4, 98.93, 5e-3);

  trb_section_compute_rect (5.5 * TRB_IN, 11.5 * TRB_IN, 1, &s);
  g_assert_cmpfloat_with_epsilon (s.A / IN2, 63.25, 5e-4);
  g_assert_cmpfloat_with_epsilon (s.Sx / IN3, 121.23, 5e-3);
  g_assert_cmpfloat_with_epsilon (s.Ix / IN4, 697.07, 5e-3);
}

/* Plies bend together: 2-2x12 is the 3 x 11.25 in rectangle (A = bd, S = bd^2/6,
 * I = bd^3/12, NDS Supplement 2018 Table 1B's formulas (from memory)):
 *   A  = 3 (11.25)            = 33.75
 *   Sx = 3 (11.25^2) / 6      = 63.28125
 *   Ix = 3 (11.25^3) / 12     = 355.957
 *   Iy = 11.25 (3^3) / 12     = 25.3125                                                    */
static void
test_rect_plies (void)
{
  TrbSection s;

  trb_section_compute_rect (1.5 * TRB_IN, 11.25 * TRB_IN, 2, &s);
  g_assert_cmpint (s.plies, ==, 2);
  g_assert_cmpfloat_with_epsilon (s.b / TRB_IN, 3.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s.A / IN2, 33.75, 1e-10);
  g_assert_cmpfloat_with_epsilon (s.Sx / IN3, 63.28125, 1e-10);
  g_assert_cmpfloat_with_epsilon (s.Ix / IN4, 3 * pow (11.25, 3) / 12, 1e-9);
  g_assert_cmpfloat_with_epsilon (s.Iy / IN4, 25.3125, 1e-10);
  g_assert_cmpfloat_with_epsilon (s.Zx / IN3, 3 * 11.25 * 11.25 / 4, 1e-10);  /* bd^2/4 */
  g_assert_true (isnan (s.Cw));
}

static void
test_init_unknown (void)
{
  TrbSection s;

  memset (&s, 0x55, sizeof s);
  trb_section_init_unknown (&s);
  g_assert_cmpint (s.kind, ==, TRB_SHAPE_CUSTOM);
  g_assert_cmpstr (s.designation, ==, "");
  g_assert_true (isnan (s.A));
  g_assert_true (isnan (s.Ix));
  g_assert_true (isnan (s.E));
  g_assert_true (isnan (s.CF_Fb));
  g_assert_cmpint (s.plies, ==, 1);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/section/w-shapes/database", test_w_shapes_against_database);
  g_test_add_func ("/trb/section/w-shapes/torsion-junction", test_w_torsion_junction);
  g_test_add_func ("/trb/section/i/by-hand", test_i_by_hand);
  g_test_add_func ("/trb/section/i/fillets-by-integration", test_i_fillets_by_integration);
  g_test_add_func ("/trb/section/rect/torsion", test_rect_torsion);
  g_test_add_func ("/trb/section/rect/lumber-table", test_rect_lumber_table);
  g_test_add_func ("/trb/section/rect/worked-values", test_rect_worked_values);
  g_test_add_func ("/trb/section/rect/plies", test_rect_plies);
  g_test_add_func ("/trb/section/init-unknown", test_init_unknown);

  return g_test_run ();
}
