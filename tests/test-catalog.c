/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-error.h"
#include "trb-units.h"

#define IN2 (TRB_IN * TRB_IN)
#define IN3 (TRB_IN * TRB_IN * TRB_IN)
#define IN4 (IN2 * IN2)

/* Values stored in SI are the tabulated inch values times exact factors, so they agree to
 * rounding of the last bit. */
static void
assert_si (double value,
           double tabulated,
           double factor)
{
  g_assert_cmpfloat_with_epsilon (value / (tabulated * factor), 1.0, 1e-12);
}

static const TrbSection *
lookup (const char *designation)
{
  const TrbSection *s = trb_catalog_lookup (trb_catalog_get_default (), designation);

  g_assert_nonnull (s);
  return s;
}

static void
test_counts (void)
{
  const TrbCatalog *catalog = trb_catalog_get_default ();
  static const struct { TrbFamily family; guint count; } expected[] = {
    /* row counts of the AISC Shapes Database v16.0 files (shapes reference README) */
    { TRB_FAMILY_W, 289 },
    { TRB_FAMILY_S, 28 },
    { TRB_FAMILY_C, 32 },
    { TRB_FAMILY_HSS_RECT, 525 },
    /* lumber.csv's 31 sizes, plus 2- and 3-ply of 2x6, 2x8, 2x10, 2x12, 2x14: 31 + 10 */
    { TRB_FAMILY_SAWN, 41 },
    /* 4 widths x depths 6 to 36 in by 1.5 in (21 depths): 84 */
    { TRB_FAMILY_GLULAM, 84 },
  };
  guint n_grades;

  for (guint i = 0; i < G_N_ELEMENTS (expected); i++)
    {
      guint n = 0;

      trb_catalog_get_family (catalog, expected[i].family, &n);
      g_assert_cmpuint (n, ==, expected[i].count);
    }

  /* wood-design-values.csv has 31 rows */
  trb_catalog_get_grades (catalog, &n_grades);
  g_assert_cmpuint (n_grades, ==, 31);

  /* loaded once */
  g_assert_true (trb_catalog_get_default () == catalog);
}

/* W18X35: ENGINEERING.md §8 item 5 (checked against steel-w-shapes.csv, AISC Shapes
 * Database v16.0): d 17.7, tw 0.300, Ix 510, Zx 66.5, Sx 57.6, ry 1.22, rts 1.51, ho 17.3,
 * J 0.506. W18X50 and W24X55: the shapes reference README's spot-check table (AISC Shapes
 * Database v16.0). */
static void
test_spot_values (void)
{
  static const struct
  {
    const char *name;
    double W, A, d, bf, tw, tf, Ix, Zx, Sx, ry, J, Cw, rts, ho;
  } shapes[] = {
    { "W18X35", 35, 10.3, 17.7, 6.00, 0.300, 0.425, 510, 66.5, 57.6, 1.22, 0.506, 1140,
      1.51, 17.3 },
    { "W18X50", 50, 14.7, 18.0, 7.50, 0.355, 0.570, 800, 101, 88.9, 1.65, 1.24, 3040,
      1.98, 17.4 },
    { "W24X55", 55, 16.2, 23.6, 7.01, 0.395, 0.505, 1350, 134, 114, 1.34, 1.18, 3870,
      1.72, 23.1 },
  };

  for (guint i = 0; i < G_N_ELEMENTS (shapes); i++)
    {
      const TrbSection *s = lookup (shapes[i].name);

      g_assert_cmpstr (s->designation, ==, shapes[i].name);
      g_assert_cmpint (s->kind, ==, TRB_SHAPE_W);
      assert_si (s->weight, shapes[i].W, TRB_PLF);
      assert_si (s->A, shapes[i].A, IN2);
      assert_si (s->d, shapes[i].d, TRB_IN);
      assert_si (s->bf, shapes[i].bf, TRB_IN);
      assert_si (s->tw, shapes[i].tw, TRB_IN);
      assert_si (s->tf, shapes[i].tf, TRB_IN);
      assert_si (s->Ix, shapes[i].Ix, IN4);
      assert_si (s->Zx, shapes[i].Zx, IN3);
      assert_si (s->Sx, shapes[i].Sx, IN3);
      assert_si (s->ry, shapes[i].ry, TRB_IN);
      assert_si (s->J, shapes[i].J, IN4);
      assert_si (s->Cw, shapes[i].Cw, IN3 * IN3);
      assert_si (s->rts, shapes[i].rts, TRB_IN);
      assert_si (s->ho, shapes[i].ho, TRB_IN);
    }

  /* the exact factors themselves: 1 in = 0.0254 m, 1 lbf = 4.4482216152605 N (NIST SP 811
   * Appendix B); W18X35's Ix = 510 in^4 = 510 x 0.0254^4 m^4 = 2.12281e-4 m^4 */
  g_assert_cmpfloat_with_epsilon (lookup ("W18X35")->Ix, 510 * pow (0.0254, 4), 1e-18);
  g_assert_cmpfloat_with_epsilon (lookup ("W18X35")->weight, 35 * 4.4482216152605 / 0.3048,
                                  1e-9);
}

/* Other families keep what the database tabulates where TrbSection has room for it:
 * C10X15.3 (reference README: A 4.48, d 10.0, bf 2.60, tw 0.240, Ix 67.3, Sx 13.5) and
 * HSS8X4X1/4 (steel-hss-rect.csv, AISC Shapes Database v16.0: A 5.24, t_des 0.233, H 8.00,
 * B 4.00, Ix 42.5, J 35.3, b/t 14.2, h/t 31.3). */
static void
test_other_steel (void)
{
  const TrbSection *c = lookup ("c10x15.3");
  const TrbSection *hss = lookup ("hss8x4x1/4");

  g_assert_cmpint (c->kind, ==, TRB_SHAPE_C);
  assert_si (c->A, 4.48, IN2);
  assert_si (c->d, 10.0, TRB_IN);
  assert_si (c->bf, 2.60, TRB_IN);
  assert_si (c->tw, 0.240, TRB_IN);
  assert_si (c->Ix, 67.3, IN4);
  assert_si (c->Sx, 13.5, IN3);

  g_assert_cmpint (hss->kind, ==, TRB_SHAPE_HSS_RECT);
  g_assert_cmpstr (hss->designation, ==, "HSS8X4X1/4");
  assert_si (hss->A, 5.24, IN2);
  assert_si (hss->tw, 0.233, TRB_IN);
  assert_si (hss->tf, 0.233, TRB_IN);
  assert_si (hss->d, 8.00, TRB_IN);
  assert_si (hss->bf, 4.00, TRB_IN);
  assert_si (hss->Ix, 42.5, IN4);
  assert_si (hss->J, 35.3, IN4);
  g_assert_cmpfloat_with_epsilon (hss->bf_2tf, 14.2, 1e-12);
  g_assert_cmpfloat_with_epsilon (hss->h_tw, 31.3, 1e-12);
  g_assert_true (isnan (hss->Cw));

  g_assert_cmpint (lookup ("S24X121")->kind, ==, TRB_SHAPE_S);
}

static void
test_lookup (void)
{
  const TrbCatalog *catalog = trb_catalog_get_default ();
  const TrbSection *s;

  /* case, spaces and the multiplication sign do not matter */
  g_assert_true (lookup ("w18x35") == lookup ("W18X35"));
  g_assert_true (lookup (" W18 x 35 ") == lookup ("W18X35"));
  g_assert_true (lookup ("W18\xc3\x97" "35") == lookup ("W18X35"));
  g_assert_null (trb_catalog_lookup (catalog, "W18X36"));
  g_assert_null (trb_catalog_lookup (catalog, ""));

  /* 2-2x12: two 1.5 x 11.25 in plies (ENGINEERING.md §5 dressed sizes): b = 3 in,
   * A = 33.75 in^2, weight = 33.75 / 144 ft^2 x 35 pcf = 8.203 plf */
  s = lookup ("2-2x12");
  g_assert_cmpstr (s->designation, ==, "2-2x12");
  g_assert_cmpint (s->kind, ==, TRB_SHAPE_SAWN);
  g_assert_cmpint (s->plies, ==, 2);
  g_assert_cmpfloat_with_epsilon (s->b / TRB_IN, 3.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s->d / TRB_IN, 11.25, 1e-12);
  g_assert_cmpfloat_with_epsilon (s->A / IN2, 33.75, 1e-10);
  g_assert_cmpfloat_with_epsilon (s->weight / TRB_PLF, 33.75 / 144 * 35, 1e-10);
  g_assert_cmpfloat_with_epsilon (s->nominal_b_in, 2, 1e-12);
  g_assert_cmpfloat_with_epsilon (s->nominal_d_in, 12, 1e-12);
  g_assert_cmpstr (s->size_class, ==, "dimension");
  /* the size factor of one 2x12 ply, lumber.csv (NDS Supplement 2018 Table 4A, from
   * memory): 1.0 */
  g_assert_cmpfloat_with_epsilon (s->CF_Fb, 1.0, 1e-12);

  /* 3-2X10: b = 4.5 in, d = 9.25 in */
  s = lookup ("3-2X10");
  g_assert_cmpint (s->plies, ==, 3);
  g_assert_cmpfloat_with_epsilon (s->b / TRB_IN, 4.5, 1e-12);
  /* 2x10's CF on Fb, lumber.csv (NDS Supplement 2018 Table 4A, from memory): 1.1 */
  g_assert_cmpfloat_with_epsilon (s->CF_Fb, 1.1, 1e-12);

  /* built-up members only of 2x6 to 2x14 */
  g_assert_null (trb_catalog_lookup (catalog, "2-2x4"));
  g_assert_null (trb_catalog_lookup (catalog, "2-3x10"));
  g_assert_nonnull (trb_catalog_lookup (catalog, "3-2x14"));

  /* 2x10 single: weight 3.37 plf in lumber.csv's self_wt column (35 pcf, to 0.01 plf) */
  s = lookup ("2X10");
  g_assert_cmpint (s->plies, ==, 1);
  g_assert_cmpfloat_with_epsilon (s->weight / TRB_PLF, 3.37, 0.005);

  /* 6x12 is a beam and stringer (lumber.csv; width 12 > thickness 6 + 2) */
  g_assert_cmpstr (lookup ("6x12")->size_class, ==, "beams_and_stringers");
  g_assert_true (isnan (lookup ("6x12")->CF_Fb));

  /* 5-1/8x18 glulam: A = 5.125 x 18 = 92.25 in^2, Sx = 5.125 (18^2) / 6 = 276.75 in^3,
   * weight 92.25 / 144 x 35 = 22.42 plf (35 pcf, common practice) */
  s = lookup ("5-1/8x18");
  g_assert_cmpstr (s->designation, ==, "5-1/8x18");
  g_assert_cmpint (s->kind, ==, TRB_SHAPE_GLULAM);
  g_assert_cmpstr (s->size_class, ==, "glulam");
  g_assert_cmpfloat_with_epsilon (s->A / IN2, 92.25, 1e-10);
  g_assert_cmpfloat_with_epsilon (s->Sx / IN3, 276.75, 1e-10);
  g_assert_cmpfloat_with_epsilon (s->weight / TRB_PLF, 92.25 / 144 * 35, 1e-10);

  /* the ends of the glulam series: 3-1/8 x 6 (4 laminations) and 8-3/4 x 36 (24) */
  g_assert_nonnull (trb_catalog_lookup (catalog, "3-1/8x6"));
  g_assert_nonnull (trb_catalog_lookup (catalog, "8-3/4x36"));
  g_assert_nonnull (trb_catalog_lookup (catalog, "6-3/4x10-1/2"));
  g_assert_null (trb_catalog_lookup (catalog, "5-1/8x37-1/2"));
  g_assert_null (trb_catalog_lookup (catalog, "5-1/8x4-1/2"));
}

static void
test_sort_order (void)
{
  const TrbCatalog *catalog = trb_catalog_get_default ();

  for (TrbFamily f = 0; f < TRB_N_FAMILIES; f++)
    {
      guint n;
      const TrbSection *s = trb_catalog_get_family (catalog, f, &n);

      for (guint i = 1; i < n; i++)
        {
          g_assert_cmpfloat (s[i - 1].weight, <=, s[i].weight);
          if (s[i - 1].weight == s[i].weight)
            g_assert_cmpfloat (s[i - 1].d, <=, s[i].d);
        }
    }

  {
    guint n;
    const TrbSection *w = trb_catalog_get_family (catalog, TRB_FAMILY_W, &n);
    int i8 = -1, i12 = -1, i18 = -1;

    /* the lightest W shape in the database is W6X8.5 (8.50 lb/ft, steel-w-shapes.csv) */
    g_assert_cmpstr (w[0].designation, ==, "W6X8.5");
    /* 35 lb/ft comes in W8X35 (d 8.12), W12X35 (12.5) and W18X35 (17.7): by depth */
    for (guint i = 0; i < n; i++)
      {
        if (g_str_equal (w[i].designation, "W8X35"))
          i8 = i;
        else if (g_str_equal (w[i].designation, "W12X35"))
          i12 = i;
        else if (g_str_equal (w[i].designation, "W18X35"))
          i18 = i;
      }
    g_assert_cmpint (i8 + 1, ==, i12);
    g_assert_cmpint (i12 + 1, ==, i18);

    /* the lightest glulam is 3-1/8 x 6 */
    g_assert_cmpstr (trb_catalog_get_family (catalog, TRB_FAMILY_GLULAM, &n)[0].designation,
                     ==, "3-1/8x6");
  }
}

static void
test_grades (void)
{
  const TrbCatalog *catalog = trb_catalog_get_default ();
  const TrbWoodGrade *g;

  /* DF-L No.2 2x10: Fb 900, Fv 180, E 1,600,000, Emin 580,000 psi (NDS Supplement 2018
   * Table 4A (from memory)) */
  g = trb_catalog_lookup_grade (catalog, "Douglas Fir-Larch", "No.2", lookup ("2x10"));
  g_assert_nonnull (g);
  assert_si (g->Fb, 900, TRB_PSI);
  assert_si (g->Fv, 180, TRB_PSI);
  assert_si (g->E, 1.6e6, TRB_PSI);
  assert_si (g->Emin, 580000, TRB_PSI);
  g_assert_cmpstr (g->size_class, ==, "dimension");
  g_assert_cmpfloat (g->width_max_in, >=, 1e9);
  g_assert_cmpstr (g->source, ==, "NDS Supplement 2018 Table 4A (from memory)");
  g_assert_cmpstr (g->confidence, ==, "high");
  g_assert_true (isnan (g->Fb_neg));

  /* the trade's short names find the same row; a built-up member takes its plies' row */
  g_assert_true (trb_catalog_lookup_grade (catalog, "DF-L", "#2", lookup ("2x10")) == g);
  g_assert_true (trb_catalog_lookup_grade (catalog, "douglas fir-larch", "No. 2",
                                           lookup ("3-2x10")) == g);

  /* 6x12 DF-L No.1 is a beam and stringer: Fb 1350, Emin 580,000 psi (NDS Supplement 2018
   * Table 4D (from memory); ENGINEERING.md §8 item 8) */
  g = trb_catalog_lookup_grade (catalog, "Douglas Fir-Larch", "No.1", lookup ("6x12"));
  g_assert_nonnull (g);
  g_assert_cmpstr (g->size_class, ==, "beams_and_stringers");
  assert_si (g->Fb, 1350, TRB_PSI);
  assert_si (g->Emin, 580000, TRB_PSI);

  /* 8x8 is a post and timber: DF-L No.1 Fb 1200 psi (Table 4D (from memory)) */
  g = trb_catalog_lookup_grade (catalog, "Douglas Fir-Larch", "No.1", lookup ("8x8"));
  g_assert_nonnull (g);
  assert_si (g->Fb, 1200, TRB_PSI);

  /* Southern Pine rows are width-specific (NDS Supplement 2018 Table 4B (from memory)):
   * No.2 2x8 Fb 925; 2x12 Fb 750; 2x14 is over 12 in and takes the 12 in row */
  g = trb_catalog_lookup_grade (catalog, "Southern Pine", "No.2", lookup ("2x8"));
  g_assert_nonnull (g);
  assert_si (g->Fb, 925, TRB_PSI);
  g = trb_catalog_lookup_grade (catalog, "Southern Pine", "No.2", lookup ("2x12"));
  g_assert_nonnull (g);
  assert_si (g->Fb, 750, TRB_PSI);
  g_assert_true (trb_catalog_lookup_grade (catalog, "SP", "No.2", lookup ("2x14")) == g);
  /* 2x4 takes the 2-4 in row: No.2 Fb 1100 */
  g = trb_catalog_lookup_grade (catalog, "Southern Pine", "No.2", lookup ("2x4"));
  assert_si (g->Fb, 1100, TRB_PSI);
  /* no timber rows for Southern Pine in the file */
  g_assert_null (trb_catalog_lookup_grade (catalog, "Southern Pine", "No.2", lookup ("6x12")));

  /* 24F-V4 glulam: Fbx+ 2400, Fbx- 1850, Fv 265, E 1.8e6, Emin 0.95e6 psi (NDS Supplement
   * 2018 Table 5A Expanded (from memory); ENGINEERING.md §6) */
  g = trb_catalog_lookup_grade (catalog, "Douglas Fir (glulam)", "24F-V4 DF/DF",
                                lookup ("5-1/8x18"));
  g_assert_nonnull (g);
  g_assert_cmpstr (g->size_class, ==, "glulam");
  assert_si (g->Fb, 2400, TRB_PSI);
  assert_si (g->Fb_neg, 1850, TRB_PSI);
  assert_si (g->Fv, 265, TRB_PSI);
  assert_si (g->E, 1.8e6, TRB_PSI);
  assert_si (g->Emin, 950000, TRB_PSI);

  /* glulam values are not sawn values, nor steel any wood's */
  g_assert_null (trb_catalog_lookup_grade (catalog, "Douglas Fir (glulam)", "24F-V4 DF/DF",
                                           lookup ("2x10")));
  g_assert_null (trb_catalog_lookup_grade (catalog, "Douglas Fir-Larch", "No.2",
                                           lookup ("W18X35")));
  g_assert_null (trb_catalog_lookup_grade (catalog, "Larch", "No.2", lookup ("2x10")));
}

static void
test_complete (void)
{
  const TrbCatalog *catalog = trb_catalog_get_default ();
  g_autoptr(GPtrArray) w18x3 = trb_catalog_complete (catalog, "w18x3", 0);
  g_autoptr(GPtrArray) w = trb_catalog_complete (catalog, "W", 5);
  g_autoptr(GPtrArray) none = trb_catalog_complete (catalog, "Q", 0);
  g_autoptr(GPtrArray) glulam = trb_catalog_complete (catalog, "5-1/8X1", 0);

  /* W18X35 and W18X311 start with W18X3 (steel-w-shapes.csv), lightest first */
  g_assert_cmpuint (w18x3->len, ==, 2);
  g_assert_cmpstr (g_ptr_array_index (w18x3, 0), ==, "W18X35");
  g_assert_cmpstr (g_ptr_array_index (w18x3, 1), ==, "W18X311");

  g_assert_cmpuint (w->len, ==, 5);
  g_assert_cmpstr (g_ptr_array_index (w, 0), ==, "W6X8.5");
  g_assert_cmpuint (none->len, ==, 0);

  /* 5-1/8 x 10-1/2, 12, 13-1/2, 15, 16-1/2, 18, 19-1/2 (depths in 1.5 in steps) */
  g_assert_cmpuint (glulam->len, ==, 7);
  g_assert_cmpstr (g_ptr_array_index (glulam, 0), ==, "5-1/8x10-1/2");
}

/* A bad row is an error that names the source and the line. */
static void
test_bad_rows (void)
{
  static const struct { const char *text; TrbFamily family; int code; const char *where; }
  cases[] = {
    /* a number that is not one, on line 3 */
    { "designation,b_in,d_in\n5x12,5,12\n5x13,5,1.2.3\n", TRB_FAMILY_GLULAM,
      TRB_ERROR_PARSE, "bad.csv: line 3:" },
    { "nominal,size_class,b_in,d_in\n2x4,dimension,1.5,3.5\n2x6,dimension,1.5,5.5in\n",
      TRB_FAMILY_SAWN, TRB_ERROR_PARSE, "bad.csv: line 3:" },
    /* a missing field */
    { "nominal,size_class,b_in,d_in\n2x4,dimension,1.5\n", TRB_FAMILY_SAWN,
      TRB_ERROR_PARSE, "bad.csv: line 2:" },
    /* a size class that is not one */
    { "nominal,size_class,b_in,d_in\n\n2x4,lumber,1.5,3.5\n", TRB_FAMILY_SAWN,
      TRB_ERROR_PARSE, "bad.csv: line 3:" },
    /* a negative depth */
    { "nominal,size_class,b_in,d_in\n2x4,dimension,1.5,-3.5\n", TRB_FAMILY_SAWN,
      TRB_ERROR_INVALID, "bad.csv: line 2:" },
    /* a missing column */
    { "nominal,size_class,b_in\n2x4,dimension,1.5\n", TRB_FAMILY_SAWN,
      TRB_ERROR_PARSE, "bad.csv: line 1:" },
    /* the same size twice */
    { "nominal,size_class,b_in,d_in\n2x4,dimension,1.5,3.5\n2X4,dimension,1.5,3.5\n",
      TRB_FAMILY_SAWN, TRB_ERROR_INVALID, "bad.csv: line 3:" },
    /* a quote that is not closed */
    { "designation,b_in,d_in\n\"5x12,5,12\n", TRB_FAMILY_GLULAM, TRB_ERROR_PARSE,
      "bad.csv: line 2:" },
    /* a W row with an empty property */
    { "designation,W_lb_ft,A_in2,d_in,bf_in,tw_in,tf_in,kdes_in,Ix_in4,Zx_in3,Sx_in3,rx_in,"
      "Iy_in4,Zy_in3,Sy_in3,ry_in,J_in4,Cw_in6,rts_in,ho_in,bf_2tf_ratio,h_tw_ratio\n"
      "W18X35,35.0,10.3,17.7,6.00,0.300,0.425,0.827,510,66.5,57.6,7.04,15.3,8.06,5.12,1.22,"
      "0.506,1140,1.51,17.3,7.06,53.5\n"
      "W18X40,40.0,11.8,17.9,6.02,0.315,0.525,0.927,612,78.4,,7.21,19.1,10.0,6.35,1.27,"
      "0.810,1440,1.56,17.4,5.73,50.7\n", TRB_FAMILY_W, TRB_ERROR_PARSE, "bad.csv: line 3:" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbCatalog) catalog = trb_catalog_new_from_csv (cases[i].text, "bad.csv",
                                                                cases[i].family, &error);

      g_assert_null (catalog);
      g_test_message ("%s", error != NULL ? error->message : "(no error)");
      g_assert_error (error, TRB_ERROR, cases[i].code);
      g_assert_true (g_str_has_prefix (error->message, cases[i].where));
    }
}

/* A failed load adds nothing; a good one adds its rows, and a later duplicate is refused. */
static void
test_all_or_nothing (void)
{
  g_autoptr(TrbCatalog) catalog = trb_catalog_new ();
  g_autoptr(GError) error = NULL;
  guint n;

  g_assert_false (trb_catalog_add_csv (catalog,
                                       "designation,b_in,d_in\n5x12,5,12\n5x13,5,zero\n",
                                       "bad.csv", TRB_FAMILY_GLULAM, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
  g_assert_null (trb_catalog_lookup (catalog, "5x12"));
  g_clear_error (&error);

  g_assert_true (trb_catalog_add_csv (catalog, "designation,b_in,d_in\n5x12,5,12\n",
                                      "good.csv", TRB_FAMILY_GLULAM, &error));
  g_assert_no_error (error);
  trb_catalog_get_family (catalog, TRB_FAMILY_GLULAM, &n);
  g_assert_cmpuint (n, ==, 1);
  g_assert_cmpint (trb_catalog_lookup (catalog, "5X12")->kind, ==, TRB_SHAPE_GLULAM);

  g_assert_false (trb_catalog_add_csv (catalog, "designation,b_in,d_in\n5x12,5,12\n",
                                       "again.csv", TRB_FAMILY_GLULAM, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, "again.csv: line 2:"));
}

static void
test_grades_bad_row (void)
{
  g_autoptr(TrbCatalog) catalog = trb_catalog_new ();
  g_autoptr(GError) error = NULL;
  const char *text =
    "species,grade,size_class,width_in,Fb_psi,Ft_psi,Fv_psi,Fc_perp_psi,Fc_psi,E_psi,"
    "Emin_psi,source,confidence\n"
    "Hem-Fir,No.2,2-4 in thick; 2 in and wider,all,850,525,150,405,1300,1300000,470000,"
    "\"a source, quoted\",medium\n"
    "Hem-Fir,No.1,2-4 in thick; 2 in and wider,6-4,975,625,150,405,1350,1500000,550000,"
    "x,medium\n";

  g_assert_false (trb_catalog_add_grades_csv (catalog, text, "values.csv", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
  g_assert_true (g_str_has_prefix (error->message, "values.csv: line 3:"));
}

/* A project's own sections in the W-shape form, properties computed where not given. */
static void
test_project_w_form (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbCatalog) catalog = NULL;
  const TrbSection *s, *tab;
  TrbSection calc;

  /* W18X35's dimensions (steel-w-shapes.csv), its Ix given, the rest computed */
  catalog = trb_catalog_new_from_project_csv (
    "# welded girder and a copy of a rolled shape\n"
    "designation,W_lb_ft,d_in,bf_in,tw_in,tf_in,kdes_in,Ix_in4\n"
    "WG18X35,35.0,17.7,6.00,0.300,0.425,0.827,510\n"
    "WG24,60,24,8,0.375,0.75,,\n",
    "project.csv", &error);
  g_assert_no_error (error);
  g_assert_nonnull (catalog);

  tab = lookup ("W18X35");
  s = trb_catalog_lookup (catalog, "wg18x35");
  g_assert_nonnull (s);
  g_assert_cmpint (s->kind, ==, TRB_SHAPE_W);
  assert_si (s->weight, 35, TRB_PLF);
  assert_si (s->Ix, 510, IN4);
  trb_section_compute_i (tab->d, tab->bf, tab->tw, tab->tf, tab->kdes - tab->tf, &calc);
  g_assert_cmpfloat_with_epsilon (s->Zx / calc.Zx, 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (s->J / calc.J, 1.0, 1e-12);

  /* no kdes: no fillets. A = 2 (8)(0.75) + (24 - 1.5)(0.375) = 12 + 8.4375 = 20.4375 in^2 */
  s = trb_catalog_lookup (catalog, "WG24");
  g_assert_nonnull (s);
  g_assert_cmpfloat_with_epsilon (s->A / IN2, 20.4375, 1e-10);
  g_assert_cmpfloat_with_epsilon (s->kdes / TRB_IN, 0.75, 1e-12);

  /* the bundled catalog does not see them */
  g_assert_null (trb_catalog_lookup (trb_catalog_get_default (), "WG24"));
}

static void
test_project_rect_form (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbCatalog) catalog = NULL;
  const TrbSection *s;
  guint n;

  catalog = trb_catalog_new_from_project_csv (
    "designation,kind,b_in,d_in,plies,weight_plf,nominal_b_in,nominal_d_in,size_class\n"
    "4-2x12,sawn,1.5,11.25,4,,2,12,\n"
    "rough 4x12,sawn,4,12,,,,,\n"
    "6-3/4x22-1/2 SP,glulam,6.75,22.5,,40,,,\n",
    "project.csv", &error);
  g_assert_no_error (error);

  /* four plies: b = 6 in; size class from the nominal 2 in thickness: dimension
   * (ENGINEERING.md §5) */
  s = trb_catalog_lookup (catalog, "4-2X12");
  g_assert_nonnull (s);
  g_assert_cmpint (s->kind, ==, TRB_SHAPE_SAWN);
  g_assert_cmpint (s->plies, ==, 4);
  g_assert_cmpfloat_with_epsilon (s->b / TRB_IN, 6.0, 1e-12);
  g_assert_cmpstr (s->size_class, ==, "dimension");
  /* 35 pcf: 6 x 11.25 / 144 x 35 = 16.406 plf */
  g_assert_cmpfloat_with_epsilon (s->weight / TRB_PLF, 67.5 / 144 * 35, 1e-10);
  /* DF-L No.2 values of the bundled catalog apply by nominal width */
  g_assert_nonnull (trb_catalog_lookup_grade (trb_catalog_get_default (), "DF-L", "No.2", s));

  /* full-size 4 x 12: nominal = actual, dimension lumber (4 in thick) */
  s = trb_catalog_lookup (catalog, "rough4x12");
  g_assert_nonnull (s);
  g_assert_cmpfloat_with_epsilon (s->nominal_d_in, 12, 1e-12);
  g_assert_cmpstr (s->size_class, ==, "dimension");

  s = trb_catalog_lookup (catalog, "6-3/4x22-1/2 sp");
  g_assert_nonnull (s);
  g_assert_cmpint (s->kind, ==, TRB_SHAPE_GLULAM);
  assert_si (s->weight, 40, TRB_PLF);
  trb_catalog_get_family (catalog, TRB_FAMILY_GLULAM, &n);
  g_assert_cmpuint (n, ==, 1);
  trb_catalog_get_family (catalog, TRB_FAMILY_SAWN, &n);
  g_assert_cmpuint (n, ==, 2);
}

static void
test_project_bad (void)
{
  static const struct { const char *text; int code; const char *where; } cases[] = {
    { "designation,kind,b_in,d_in\n8x20,steel,8,20\n", TRB_ERROR_PARSE, "p.csv: line 2:" },
    { "designation,kind,b_in,d_in,plies\n\n2x10,sawn,1.5,9.25,2.5\n", TRB_ERROR_PARSE,
      "p.csv: line 3:" },
    { "designation,kind,b_in,d_in,plies\nG,glulam,5.125,12,2\n", TRB_ERROR_INVALID,
      "p.csv: line 2:" },
    /* flanges thicker than half the depth */
    { "designation,W_lb_ft,d_in,bf_in,tw_in,tf_in\nX,10,4,4,0.5,2.5\n", TRB_ERROR_INVALID,
      "p.csv: line 2:" },
    /* neither form */
    { "designation,b_in,d_in\nX,1,2\n", TRB_ERROR_PARSE, "p.csv: line 1:" },
    { "designation,W_lb_ft,d_in,bf_in,tw_in,tf_in\n"
      "A-NAME-LONGER-THAN-THIRTY-ONE-CHARS,10,12,4,0.25,0.375\n", TRB_ERROR_PARSE,
      "p.csv: line 2:" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbCatalog) catalog = trb_catalog_new_from_project_csv (cases[i].text, "p.csv",
                                                                        &error);

      g_assert_null (catalog);
      g_test_message ("%s", error != NULL ? error->message : "(no error)");
      g_assert_error (error, TRB_ERROR, cases[i].code);
      g_assert_true (g_str_has_prefix (error->message, cases[i].where));
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/catalog/counts", test_counts);
  g_test_add_func ("/trb/catalog/spot-values", test_spot_values);
  g_test_add_func ("/trb/catalog/other-steel", test_other_steel);
  g_test_add_func ("/trb/catalog/lookup", test_lookup);
  g_test_add_func ("/trb/catalog/sort-order", test_sort_order);
  g_test_add_func ("/trb/catalog/grades", test_grades);
  g_test_add_func ("/trb/catalog/complete", test_complete);
  g_test_add_func ("/trb/catalog/bad-rows", test_bad_rows);
  g_test_add_func ("/trb/catalog/all-or-nothing", test_all_or_nothing);
  g_test_add_func ("/trb/catalog/grades-bad-row", test_grades_bad_row);
  g_test_add_func ("/trb/catalog/project/w-form", test_project_w_form);
  g_test_add_func ("/trb/catalog/project/rect-form", test_project_rect_form);
  g_test_add_func ("/trb/catalog/project/bad", test_project_bad);

  return g_test_run ();
}
