/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-beam.h"
#include "trb-design-wood.h"
#include "trb-design.h"
#include "trb-units.h"

/* Sections and grades are filled by hand here so that these tests stand on their own.
 * Dressed sizes: NDS Supplement 2018 Table 1B (from memory); A = bd, S = bd^2/6, I = bd^3/12
 * (2x10: A 13.875 in2, S 21.39 in3, I 98.93 in4; 6x12: A 63.25, S 121.23, I 697.07).
 * Design values: NDS Supplement 2018 Tables 4A, 4B, 4D
 * and 5A (from memory), as in data/sections/wood-design-values.csv. */

static void
fill_rect (TrbSection   *s,
           const char   *designation,
           TrbShapeKind  kind,
           double        b_in,
           double        d_in,
           int           plies,
           double        nominal_b,
           double        nominal_d,
           const char   *size_class)
{
  double b = b_in * TRB_IN, d = d_in * TRB_IN;

  memset (s, 0, sizeof *s);
  g_strlcpy (s->designation, designation, sizeof s->designation);
  s->kind = kind;
  s->b = b;
  s->d = d;
  s->A = b * d;
  s->Sx = b * d * d / 6;
  s->Ix = b * d * d * d / 12;
  s->plies = plies;
  s->nominal_b_in = nominal_b;
  s->nominal_d_in = nominal_d;
  g_strlcpy (s->size_class, size_class, sizeof s->size_class);
  s->E = NAN;
}

static void
fill_grade (TrbWoodGrade *g,
            const char   *species,
            const char   *grade,
            const char   *size_class,
            double        Fb,
            double        Fv,
            double        Fc_perp,
            double        Fc,
            double        E,
            double        Emin,
            double        Fb_neg)
{
  memset (g, 0, sizeof *g);
  g_strlcpy (g->species, species, sizeof g->species);
  g_strlcpy (g->grade, grade, sizeof g->grade);
  g_strlcpy (g->size_class, size_class, sizeof g->size_class);
  g->Fb = Fb * TRB_PSI;
  g->Fv = Fv * TRB_PSI;
  g->Fc_perp = Fc_perp * TRB_PSI;
  g->Fc = Fc * TRB_PSI;
  g->E = E * TRB_PSI;
  g->Emin = Emin * TRB_PSI;
  g->Fb_neg = isnan (Fb_neg) ? NAN : Fb_neg * TRB_PSI;
  g->Ft = NAN;
}

/* Douglas Fir-Larch No.2, 2-4 in thick (Supplement Table 4A, from memory): Fb 900, Fv 180,
 * Fc_perp 625, Fc 1350, E 1,600,000, Emin 580,000 psi. */
static void
grade_dfl_no2 (TrbWoodGrade *g)
{
  fill_grade (g, "Douglas Fir-Larch", "No.2", "dimension", 900, 180, 625, 1350, 1.6e6, 580000,
              NAN);
}

/* Douglas Fir-Larch Select Structural, 2-4 in thick (Table 4A, from memory): Fb 1500,
 * Fc 1700 psi. */
static void
grade_dfl_ss (TrbWoodGrade *g)
{
  fill_grade (g, "Douglas Fir-Larch", "Select Structural", "dimension", 1500, 180, 625, 1700,
              1.9e6, 690000, NAN);
}

/* Douglas Fir-Larch No.1 Beams and Stringers (Table 4D, from memory): Fb 1350, Fv 170,
 * Fc_perp 625, Fc 925, E 1,600,000, Emin 580,000 psi. */
static void
grade_dfl_no1_bs (TrbWoodGrade *g)
{
  fill_grade (g, "Douglas Fir-Larch", "No.1", "beams_and_stringers", 1350, 170, 625, 925,
              1.6e6, 580000, NAN);
}

/* 24F-V4 DF/DF (Table 5A Expanded, from memory): Fbx+ 2400, Fbx- 1850, Fvx 265,
 * Fc_perp,x 650 psi, Ex 1,800,000, Ex,min 950,000 psi. */
static void
grade_24f_v4 (TrbWoodGrade *g)
{
  fill_grade (g, "Douglas Fir (glulam)", "24F-V4 DF/DF", "glulam", 2400, 265, 650, 1650,
              1.8e6, 950000, 1850);
}

static void
section_2x (TrbSection *s,
            double      nominal_d,
            double      d_in)
{
  char name[16];

  g_snprintf (name, sizeof name, "2x%.0f", nominal_d);
  fill_rect (s, name, TRB_SHAPE_SAWN, 1.5, d_in, 1, 2, nominal_d, "dimension");
}

static void
section_glulam_5_125x18 (TrbSection *s)
{
  fill_rect (s, "5-1/8x18", TRB_SHAPE_GLULAM, 5.125, 18, 1, NAN, NAN, "glulam");
}

/* ------------------------------------------------------------------------------------------
 * Factor functions
 * ------------------------------------------------------------------------------------------ */

static void
test_cd (void)
{
  const double d[TRB_N_CASES] = { [TRB_CASE_D] = 1 };
  const double dl[TRB_N_CASES] = { [TRB_CASE_D] = 1, [TRB_CASE_L] = 1 };
  const double ds[TRB_N_CASES] = { [TRB_CASE_D] = 1, [TRB_CASE_S] = 1 };
  const double dlr[TRB_N_CASES] = { [TRB_CASE_D] = 1, [TRB_CASE_LR] = 1 };
  const double dls[TRB_N_CASES] = { [TRB_CASE_D] = 1, [TRB_CASE_L] = 0.75, [TRB_CASE_S] = 0.75 };
  const double dllr[TRB_N_CASES] = { [TRB_CASE_D] = 1, [TRB_CASE_L] = 0.75,
                                     [TRB_CASE_LR] = 0.75 };

  /* NDS 2018 Table 2.3.2: permanent 0.9, ten years (occupancy live) 1.0, two months (snow)
   * 1.15, seven days (roof live) 1.25; a combination takes its shortest load's factor. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cd (d), 0.9, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cd (dl), 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cd (ds), 1.15, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cd (dlr), 1.25, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cd (dls), 1.15, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cd (dllr), 1.25, 1e-12);
}

static void
test_load_duration (void)
{
  /* Worked here from NDS 2018 Table 2.3.2: roof D 15, Lr 20, S 30 psf compared
   * as load / C_D: D 15/0.9 = 16.7; D + Lr 35/1.25 = 28.0; D + S 45/1.15 = 39.1, which
   * governs. */
  const double q[TRB_N_CASES] = { [TRB_CASE_D] = 15, [TRB_CASE_LR] = 20, [TRB_CASE_S] = 30 };
  const double combos[3][TRB_N_CASES] = {
    { [TRB_CASE_D] = 1 },
    { [TRB_CASE_D] = 1, [TRB_CASE_LR] = 1 },
    { [TRB_CASE_D] = 1, [TRB_CASE_S] = 1 },
  };
  const double expected[3] = { 16.7, 28.0, 39.1 };
  double worst = 0;
  guint governing = 0;

  for (guint i = 0; i < 3; i++)
    {
      double load = 0, ratio;

      for (int c = 0; c < TRB_N_CASES; c++)
        load += combos[i][c] * q[c];
      ratio = load / trb_design_wood_cd (combos[i]);
      g_assert_cmpfloat_with_epsilon (ratio, expected[i], 0.05);
      if (ratio > worst)
        {
          worst = ratio;
          governing = i;
        }
    }
  g_assert_cmpuint (governing, ==, 2);
}

static void
test_cf (void)
{
  TrbWoodGrade no2, sp;
  TrbSection s;

  grade_dfl_no2 (&no2);
  fill_grade (&sp, "Southern Pine", "No.2", "dimension", 800, 175, 565, 1300, 1.4e6, 510000,
              NAN);

  /* NDS Supplement 2018 Table 4A, size factors on Fb, 2 and 3 in thick (from memory):
   * 4 in wide 1.5, 6 in 1.3, 8 in 1.2, 10 in 1.1, 12 in 1.0, 14 in and wider 0.9. */
  section_2x (&s, 4, 3.5);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.5, 1e-12);
  section_2x (&s, 6, 5.5);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.3, 1e-12);
  section_2x (&s, 8, 7.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.2, 1e-12);
  section_2x (&s, 10, 9.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.1, 1e-12);
  /* Table 4A on Ft and Fc for 10 in wide: 1.1 and 1.0 (from memory). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FT), 1.1, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FC), 1.0, 1e-12);
  /* No size factor on Fv (NDS 2018 Table 4.3.1). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FV), 1.0, 1e-12);
  section_2x (&s, 12, 11.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.0, 1e-12);
  section_2x (&s, 14, 13.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 0.9, 1e-12);

  /* The same table's 4 in thick row on Fb (from memory): 8 in 1.3, 10 in 1.2, 12 in 1.1. */
  fill_rect (&s, "4x8", TRB_SHAPE_SAWN, 3.5, 7.25, 1, 4, 8, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.3, 1e-12);
  fill_rect (&s, "4x10", TRB_SHAPE_SAWN, 3.5, 9.25, 1, 4, 10, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.2, 1e-12);
  fill_rect (&s, "4x12", TRB_SHAPE_SAWN, 3.5, 11.25, 1, 4, 12, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.1, 1e-12);

  /* A built-up 3-2x10 takes the 2 in row (its plies are 1.5 in), and a section without
   * nominal sizes is read by its dressed depth: 9.25 in is a 10 in nominal (Table 1B). */
  fill_rect (&s, "3-2x10", TRB_SHAPE_SAWN, 4.5, 9.25, 3, NAN, NAN, "");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.1, 1e-12);

  /* NDS Supplement 2018 Table 4B (from memory): Southern Pine values are width-specific,
   * C_F = 1; 4 in thick and 8 in or wider: 1.1 on Fb; wider than 12 in: 0.9. */
  section_2x (&s, 10, 9.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &sp, TRB_WOOD_FB), 1.0, 1e-12);
  fill_rect (&s, "4x10", TRB_SHAPE_SAWN, 3.5, 9.25, 1, 4, 10, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &sp, TRB_WOOD_FB), 1.1, 1e-12);
  section_2x (&s, 14, 13.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &sp, TRB_WOOD_FB), 0.9, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &sp, TRB_WOOD_FC), 0.9, 1e-12);

  /* Timbers, NDS Supplement 2018 Table 4D (from memory): (12/d)^(1/9) where d > 12 in;
   * 6x14: (12/13.5)^(1/9) = 0.98700 (lumber.csv lists 0.987); 6x12 (d 11.5 in): 1.0. */
  fill_rect (&s, "6x14", TRB_SHAPE_SAWN, 5.5, 13.5, 1, 6, 14, "beams_and_stringers");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 0.98700, 1e-5);
  fill_rect (&s, "6x12", TRB_SHAPE_SAWN, 5.5, 11.5, 1, 6, 12, "beams_and_stringers");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.0, 1e-12);

  /* Glulam has no size factor; the volume factor takes its place (NDS 2018 5.3.6). */
  section_glulam_5_125x18 (&s);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cf (&s, &no2, TRB_WOOD_FB), 1.0, 1e-12);
}

static void
test_cm (void)
{
  TrbWoodGrade no2, ss, bs, glulam;
  TrbSection s, timber, gl;

  grade_dfl_no2 (&no2);
  grade_dfl_ss (&ss);
  grade_dfl_no1_bs (&bs);
  grade_24f_v4 (&glulam);
  section_2x (&s, 10, 9.25);
  fill_rect (&timber, "6x12", TRB_SHAPE_SAWN, 5.5, 11.5, 1, 6, 12, "beams_and_stringers");
  section_glulam_5_125x18 (&gl);

  /* Dry service: C_M = 1 (NDS 2018 4.1.4). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FB, FALSE), 1.0,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FC_PERP, FALSE), 1.0,
                                  1e-12);

  /* NDS Supplement 2018 Table 4A wet service factors (from memory): Fb 0.85 unless
   * Fb C_F <= 1150 psi. No.2 2x10: 900 x 1.1 = 990 <= 1150, so 1.0; Select Structural:
   * 1500 x 1.1 = 1650, so 0.85. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FB, TRUE), 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &ss, TRB_WOOD_FB, TRUE), 0.85, 1e-12);
  /* Same footnote: Fv 0.97, Fc_perp 0.67, E and Emin 0.9, Ft 1.0; Fc 0.8 unless
   * Fc C_F <= 750 psi (No.2 2x10: 1350 x 1.0 > 750). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FV, TRUE), 0.97, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FC_PERP, TRUE), 0.67,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_E, TRUE), 0.9, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_EMIN, TRUE), 0.9,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FT, TRUE), 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&s, &no2, TRB_WOOD_FC, TRUE), 0.8, 1e-12);

  /* Timbers, Supplement Table 4D (from memory): Fb 1.00, Fc_perp 0.67, Fc 0.91. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&timber, &bs, TRB_WOOD_FB, TRUE), 1.0,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&timber, &bs, TRB_WOOD_FC_PERP, TRUE),
                                  0.67, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&timber, &bs, TRB_WOOD_FC, TRUE), 0.91,
                                  1e-12);

  /* Glulam, Supplement Table 5A (from memory): Fb 0.8, Fv 0.875, Fc_perp 0.53, E 0.833. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&gl, &glulam, TRB_WOOD_FB, TRUE), 0.8,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&gl, &glulam, TRB_WOOD_FV, TRUE), 0.875,
                                  1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&gl, &glulam, TRB_WOOD_FC_PERP, TRUE),
                                  0.53, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cm (&gl, &glulam, TRB_WOOD_E, TRUE), 0.833,
                                  1e-12);
}

static void
test_ci (void)
{
  TrbSection s, gl;

  section_2x (&s, 10, 9.25);
  section_glulam_5_125x18 (&gl);

  /* NDS 2018 Table 4.3.8 (from memory): incised lumber 0.80 on Fb, Ft, Fc, Fv; 0.95 on E and
   * Emin; 1.00 on Fc_perp. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&s, TRB_WOOD_FB, TRUE), 0.80, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&s, TRB_WOOD_FV, TRUE), 0.80, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&s, TRB_WOOD_E, TRUE), 0.95, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&s, TRB_WOOD_EMIN, TRUE), 0.95, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&s, TRB_WOOD_FC_PERP, TRUE), 1.0, 1e-12);
  /* Not incised: 1 (same table). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&s, TRB_WOOD_FB, FALSE), 1.0, 1e-12);
  /* Glulam's adjustment table (NDS 2018 Table 5.3.1) has no incising factor. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_ci (&gl, TRB_WOOD_FB, TRUE), 1.0, 1e-12);
}

static void
test_cr (void)
{
  TrbWoodOptions run, single, wide;
  TrbSection s;

  trb_design_wood_options_init (&run);
  run.repetitive_spacing = 16 * TRB_IN;
  trb_design_wood_options_init (&single);
  trb_design_wood_options_init (&wide);
  wide.repetitive_spacing = 32 * TRB_IN;

  /* NDS 2018 4.3.9: 1.15 on Fb for dimension lumber 2-4 in thick, in contact or at 24 in or
   * less, three or more joined by a load-distributing floor or roof. */
  section_2x (&s, 10, 9.25);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &run), 1.15, 1e-12);
  /* Not in a run, or spaced wider than 24 in: 1.0 (same clause). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &single), 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &wide), 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, NULL), 1.0, 1e-12);
  /* Exactly 24 in still qualifies ("not more than 24 in", same clause). */
  wide.repetitive_spacing = 24 * TRB_IN;
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &wide), 1.15, 1e-12);
  /* 4 in thick members qualify too (2-4 in thick, same clause). */
  fill_rect (&s, "4x10", TRB_SHAPE_SAWN, 3.5, 9.25, 1, 4, 10, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &run), 1.15, 1e-12);

  /* A beam built up of three or more plies fastened together is a repetitive member in
   * common practice; two plies are not. */
  fill_rect (&s, "3-2x12", TRB_SHAPE_SAWN, 4.5, 11.25, 3, 2, 12, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &single), 1.15, 1e-12);
  fill_rect (&s, "2-2x12", TRB_SHAPE_SAWN, 3.0, 11.25, 2, 2, 12, "dimension");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &single), 1.0, 1e-12);

  /* Never timbers (5 in and thicker) or glulam (4.3.9 is for dimension lumber; Table 5.3.1
   * has no C_r). */
  fill_rect (&s, "6x12", TRB_SHAPE_SAWN, 5.5, 11.5, 1, 6, 12, "beams_and_stringers");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &run), 1.0, 1e-12);
  section_glulam_5_125x18 (&s);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cr (&s, &run), 1.0, 1e-12);
}

static void
test_effective_length (void)
{
  double d = 11.5 * TRB_IN;

  /* NDS 2018 Table 3.3.3, general row (from memory): 2.06 lu for lu/d < 7;
   * 1.63 lu + 3d for 7 <= lu/d <= 14.3; 1.84 lu beyond. */
  /* lu = 5 ft = 60 in, lu/d = 5.2: 2.06 x 60 = 123.6 in. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_effective_length (60 * TRB_IN, d) / TRB_IN,
                                  123.6, 1e-9);
  /* lu = 10 ft = 120 in, lu/d = 10.4: 1.63 x 120 + 3 x 11.5 = 230.1 in. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_effective_length (120 * TRB_IN, d) / TRB_IN,
                                  230.1, 1e-9);
  /* Worked here: lu = 16 ft, 6x12 (lu/d = 16.7): le = 1.84 x 192 = 353.3 in. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_effective_length (192 * TRB_IN, d) / TRB_IN,
                                  353.3, 0.05);
}

static void
test_cl (void)
{
  TrbWoodGrade bs;
  TrbSection s;
  double le, RB, FbE, CL;

  /* Worked here from NDS 2018 Eq. 3.3-5 and 3.3-6: 6x12 DF-L No.1 Beams and
   * Stringers (Fb 1350, Emin 580,000 psi), lu = 16 ft, uniform load: le = 353.3 in,
   * RB = 11.59, FbE = 5,182 psi, C_L = 0.983. Fb* = Fb C_D C_F = 1350 x 1.0 x 1.0. */
  grade_dfl_no1_bs (&bs);
  fill_rect (&s, "6x12", TRB_SHAPE_SAWN, 5.5, 11.5, 1, 6, 12, "beams_and_stringers");
  le = trb_design_wood_effective_length (16 * TRB_FT, s.d);
  CL = trb_design_wood_cl (bs.Fb * trb_design_wood_cf (&s, &bs, TRB_WOOD_FB),
                           trb_design_wood_adjusted_e (&s, &bs, NULL, TRB_WOOD_EMIN),
                           le, s.b, s.d, &RB, &FbE);
  g_assert_cmpfloat_with_epsilon (RB, 11.59, 0.005);
  g_assert_cmpfloat_with_epsilon (FbE / TRB_PSI, 5182, 0.5);
  g_assert_cmpfloat_with_epsilon (CL, 0.983, 0.0005);

  /* NDS 2018 3.3.3.1: d <= b needs no lateral support, C_L = 1. */
  CL = trb_design_wood_cl (bs.Fb, bs.Emin, le, 7.5 * TRB_IN, 7.5 * TRB_IN, &RB, NULL);
  g_assert_cmpfloat_with_epsilon (CL, 1.0, 1e-12);
  /* Braced throughout (le = 0): C_L = 1 (NDS 2018 3.3.3.3). */
  CL = trb_design_wood_cl (bs.Fb, bs.Emin, 0, s.b, s.d, NULL, NULL);
  g_assert_cmpfloat_with_epsilon (CL, 1.0, 1e-12);
}

static void
test_cv (void)
{
  TrbWoodGrade df, sp, bs;
  TrbSection gl, sawn;

  grade_24f_v4 (&df);
  grade_dfl_no1_bs (&bs);
  fill_grade (&sp, "Southern Pine (glulam)", "24F-V3 SP/SP", "glulam", 2400, 300, 740, 1650,
              1.8e6, 950000, 1950);
  section_glulam_5_125x18 (&gl);

  /* Worked here from NDS 2018 Eq. 5.3-1: 5-1/8 x 18, L = 24 ft:
   * [(21/24)(12/18)(5.125/5.125)]^(1/10) = 0.58333^0.1 = 0.9475. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cv (&gl, &df, 24 * TRB_FT), 0.9475, 5e-5);
  /* Same equation with x = 20 for Southern Pine: 0.58333^0.05 = 0.97341. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cv (&gl, &sp, 24 * TRB_FT), 0.97341, 5e-5);
  /* L = 10 ft: (2.1 x 0.6667)^0.1 = 1.034, capped at 1.0 (same equation). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cv (&gl, &df, 10 * TRB_FT), 1.0, 1e-12);
  /* Sawn lumber has no volume factor (NDS 2018 Table 4.3.1). */
  fill_rect (&sawn, "6x12", TRB_SHAPE_SAWN, 5.5, 11.5, 1, 6, 12, "beams_and_stringers");
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cv (&sawn, &bs, 24 * TRB_FT), 1.0, 1e-12);
}

static void
test_bearing_factors (void)
{
  /* NDS 2018 3.10.4: C_b = (l_b + 0.375)/l_b for l_b < 6 in, 3 in or more from the end:
   * 3.5 in: 3.875/3.5 = 1.1071; at the end of the member, or 6 in and longer: 1.0. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cb (3.5 * TRB_IN, FALSE), 1.1071, 5e-5);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cb (3.5 * TRB_IN, TRUE), 1.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_cb (6 * TRB_IN, FALSE), 1.0, 1e-12);

  /* The joist example below (NDS 2018 3.10.2): l_b,req = 466.7 / (1.5 x 625) = 0.50 in at
   * the end. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_required_bearing (466.7 * TRB_LBF,
                                                                     1.5 * TRB_IN,
                                                                     625 * TRB_PSI, TRUE)
                                  / TRB_IN, 0.50, 0.005);
  /* Interior, R = 5000 lb on 1.5 in, Fc_perp 625 psi (NDS 2018 3.10.2 with 3.10.4, by hand):
   * 5000 / 1.5 = 625 (l_b + 0.375) gives l_b = 5.333 - 0.375 = 4.958 in (< 6 in). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_required_bearing (5000 * TRB_LBF,
                                                                     1.5 * TRB_IN,
                                                                     625 * TRB_PSI, FALSE)
                                  / TRB_IN, 4.958, 0.0005);
}

static void
test_adjusted_e (void)
{
  TrbWoodGrade no2;
  TrbWoodOptions wet;
  TrbSection s;

  grade_dfl_no2 (&no2);
  section_2x (&s, 10, 9.25);
  trb_design_wood_options_init (&wet);
  wet.wet_service = TRUE;
  wet.incised = TRUE;

  /* NDS 2018 Table 4.3.1: E' = E C_M C_t C_i. Dry: 1,600,000 psi (Table 4A, from memory). */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_adjusted_e (&s, &no2, NULL, TRB_WOOD_E)
                                  / TRB_PSI, 1.6e6, 1e-3);
  /* Wet (0.9, Table 4A) and incised (0.95, Table 4.3.8): 1.6e6 x 0.9 x 0.95 = 1,368,000;
   * Emin' = 580,000 x 0.9 x 0.95 = 495,900 psi. */
  g_assert_cmpfloat_with_epsilon (trb_design_wood_adjusted_e (&s, &no2, &wet, TRB_WOOD_E)
                                  / TRB_PSI, 1.368e6, 1e-3);
  g_assert_cmpfloat_with_epsilon (trb_design_wood_adjusted_e (&s, &no2, &wet, TRB_WOOD_EMIN)
                                  / TRB_PSI, 495900, 1e-3);
}

/* ------------------------------------------------------------------------------------------
 * Member checks (with the beam engine)
 * ------------------------------------------------------------------------------------------ */

typedef struct
{
  const char *name;
  double      factors[TRB_N_CASES];
} ComboDef;

typedef struct
{
  TrbLoadCase case_;
  TrbLoad     load;
} CaseLoad;

#define MAX_COMBOS 6

typedef struct
{
  TrbSupport      supports[4];
  TrbBeamResult  *cases[TRB_N_CASES];
  TrbBeamResult  *results[MAX_COMBOS];
  TrbDemandCombo  combos[MAX_COMBOS];
  TrbBeamResult  *total;
  TrbDesignInput  input;
  GArray         *checks;
} Member;

static void
member_solve (Member             *m,
              const TrbSection   *section,
              double              length,
              double              E,
              const double       *support_x,
              guint               n_supports,
              const CaseLoad     *loads,
              guint               n_loads,
              const ComboDef     *combos,
              guint               n_combos)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) beam = NULL;
  const double ones[TRB_N_CASES] = { 1, 1, 1, 1 };

  g_assert_cmpuint (n_supports, <=, G_N_ELEMENTS (m->supports));
  g_assert_cmpuint (n_combos, <=, MAX_COMBOS);
  memset (m, 0, sizeof *m);

  for (guint i = 0; i < n_supports; i++)
    {
      m->supports[i].x = support_x[i];
      m->supports[i].type = i == 0 ? TRB_SUPPORT_PIN : TRB_SUPPORT_ROLLER;
    }
  beam = trb_beam_new (length, E, section->Ix, m->supports, n_supports, &error);
  g_assert_no_error (error);

  for (int c = 0; c < TRB_N_CASES; c++)
    {
      g_autofree TrbLoad *mine = g_new0 (TrbLoad, n_loads + 1);
      guint n = 0;

      for (guint i = 0; i < n_loads; i++)
        if (loads[i].case_ == (TrbLoadCase) c)
          mine[n++] = loads[i].load;
      m->cases[c] = trb_beam_solve (beam, mine, n, &error);
      g_assert_no_error (error);
    }

  for (guint i = 0; i < n_combos; i++)
    {
      m->results[i] = trb_beam_result_combine (m->cases, combos[i].factors, TRB_N_CASES);
      g_strlcpy (m->combos[i].name, combos[i].name, sizeof m->combos[i].name);
      memcpy (m->combos[i].factors, combos[i].factors, sizeof m->combos[i].factors);
      m->combos[i].result = m->results[i];
    }
  m->total = trb_beam_result_combine (m->cases, ones, TRB_N_CASES);

  m->input.section = section;
  m->input.length = length;
  m->input.supports = m->supports;
  m->input.n_supports = n_supports;
  m->input.bracing = TRB_BRACING_CONTINUOUS;
  m->input.combos = m->combos;
  m->input.n_combos = n_combos;
  /* floor limits, IBC 2021 Table 1604.3: L/360 live, L/240 total */
  m->input.live = m->cases[TRB_CASE_L];
  m->input.total = m->total;
  m->input.live_limit = 360;
  m->input.total_limit = 240;
  m->input.units = TRB_UNIT_SYSTEM_US;
  m->checks = g_array_new (FALSE, FALSE, sizeof (TrbCheck));
}

static void
member_clear (Member *m)
{
  /* shown with --verbose, to read what a user would see */
  for (guint i = 0; m->checks != NULL && i < m->checks->len; i++)
    {
      const TrbCheck *c = &g_array_index (m->checks, TrbCheck, i);

      g_test_message ("%s [%s] %s: ratio %.3f at %.2f ft; %s", c->name, c->clause,
                      c->combination, c->ratio, c->x / TRB_FT, c->detail);
    }
  for (int c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&m->cases[c], trb_beam_result_free);
  for (guint i = 0; i < MAX_COMBOS; i++)
    g_clear_pointer (&m->results[i], trb_beam_result_free);
  g_clear_pointer (&m->total, trb_beam_result_free);
  g_clear_pointer (&m->checks, g_array_unref);
}

static const TrbCheck *
find_check (GArray     *checks,
            const char *name)
{
  for (guint i = 0; i < checks->len; i++)
    {
      const TrbCheck *c = &g_array_index (checks, TrbCheck, i);

      if (g_strcmp0 (c->name, name) == 0)
        return c;
    }
  g_test_message ("no check named %s", name);
  g_test_fail ();
  return NULL;
}

static const ComboDef floor_combos[] = {
  /* ASCE 7-16 2.4.1, ASD combinations 1 and 2 (from memory) */
  { "ASD 1: D", { [TRB_CASE_D] = 1 } },
  { "ASD 2: D + L", { [TRB_CASE_D] = 1, [TRB_CASE_L] = 1 } },
};

/* The joist example, worked here from NDS 2018 and its Supplement Table 4A (from
 * memory): DF-L No.2 joists, 14 ft simple span, 16 in o.c., D 10 + L 40 psf, dry, sheathed,
 * ASD D + L. w = 50 psf x 16/12 ft = 66.67 plf (D 13.33, L 53.33), M = wL^2/8 = 1633 lb-ft
 * = 19,600 lb-in, V = R = wL/2 = 466.7 lb. Factors: C_D 1.0 (L present, Table 2.3.2),
 * C_M 1.0 (dry), C_t 1.0, C_L 1.0 (compression edge sheathed), C_fu 1.0, C_i 1.0,
 * C_r 1.15 (4.3.9: 16 in o.c., sheathed). */
static void
joist_solve (Member           *m,
             const TrbSection *s,
             double            spacing_in)
{
  const double L = 14 * TRB_FT;
  const double xs[] = { 0, L };
  const double trib = spacing_in / 12.0;
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, L, 10 * trib * TRB_PLF, 10 * trib * TRB_PLF } },
    { TRB_CASE_L, { TRB_LOAD_UNIFORM, 0, L, 40 * trib * TRB_PLF, 40 * trib * TRB_PLF } },
  };

  member_solve (m, s, L, 1.6e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), floor_combos,
                G_N_ELEMENTS (floor_combos));
}

static void
test_joist_2x8 (void)
{
  TrbWoodGrade no2;
  TrbWoodOptions options;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no2 (&no2);
  section_2x (&s, 8, 7.25);
  trb_design_wood_options_init (&options);
  options.repetitive_spacing = 16 * TRB_IN;
  joist_solve (&m, &s, 16);
  trb_design_wood_check (&m.input, &no2, &options, m.checks);

  /* Joist example: 2x8 (C_F 1.2) fails, Fb' = 900 x 1.2 x 1.15 = 1,242 psi
   * < fb = 19,600 / 13.14 = 1,492 psi. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 1242.0, 0.05);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 1491.6, 0.1);
  g_assert_cmpfloat (c->ratio, >, 1.0);
  g_assert_cmpstr (c->combination, ==, "ASD 2: D + L");
  g_assert_cmpstr (c->clause, ==, "NDS 2018 3.3.1");

  /* Joist example: live deflection 5 w L^4 / (384 E I) = 0.605 in > L/360 = 168/360 = 0.467 in. */
  c = find_check (m.checks, "Live deflection");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.605, 0.0005);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_IN, 0.467, 0.0005);
  g_assert_cmpfloat (c->ratio, >, 1.0);

  member_clear (&m);
}

static void
test_joist_2x10 (void)
{
  TrbWoodGrade no2;
  TrbWoodOptions options;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no2 (&no2);
  section_2x (&s, 10, 9.25);
  trb_design_wood_options_init (&options);
  options.repetitive_spacing = 16 * TRB_IN;
  joist_solve (&m, &s, 16);
  trb_design_wood_check (&m.input, &no2, &options, m.checks);

  /* Joist example: 2x10 (C_F 1.1): Fb' = 900 x 1.0 x 1.0 x 1.0 x 1.0 x 1.1 x 1.0 x 1.0 x 1.15
   * = 1,138.5 psi >= fb = 19,600 / 21.39 = 916 psi. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 1138.5, 0.05);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 916.3, 0.1);
  g_assert_cmpfloat (c->ratio, <=, 1.0);
  g_assert_cmpstr (c->combination, ==, "ASD 2: D + L");
  /* at midspan, 7 ft */
  g_assert_cmpfloat_with_epsilon (c->x / TRB_FT, 7.0, 1e-6);

  /* Joist example: fv = 1.5 x 466.7 / 13.875 = 50.5 psi at the support, 44.9 psi at d
   * (V = 466.7 - 66.67 x 9.25/12 = 415.3 lb; NDS 2018 3.4.3.1(a)), <= Fv' = 180 psi
   * (Fv C_D C_M C_t C_i = 180 x 1 x 1 x 1 x 1). */
  c = find_check (m.checks, "Shear");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 44.9, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 180.0, 1e-6);
  g_assert_cmpstr (c->clause, ==, "NDS 2018 Eq. 3.4-2");

  /* Joist example: bearing l_b,req = 466.7 / (1.5 x 625) = 0.50 in; on the default 3.5 in the
   * stress is 466.7 / (1.5 x 3.5) = 88.9 psi against Fc_perp' = 625 psi (C_b = 1 at an end,
   * NDS 2018 3.10.4), so ratio x l_b is the required length. */
  c = find_check (m.checks, "Bearing");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 88.9, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 625.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (c->ratio * 3.5, 0.50, 0.005);
  g_assert_nonnull (strstr (c->detail, "l_b,req 0.498 in"));

  /* Joist example: 5 w L^4 / (384 E I), live 0.291 in (L/577), total 0.364 in (L/461);
   * limits 0.467 and 0.700 in. */
  c = find_check (m.checks, "Live deflection");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.291, 0.0005);
  g_assert_cmpfloat (c->ratio, <=, 1.0);
  c = find_check (m.checks, "Total deflection");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.364, 0.0005);
  g_assert_cmpfloat (c->ratio, <=, 1.0);

  member_clear (&m);
}

static void
test_repetitive_member (void)
{
  TrbWoodGrade no2;
  TrbWoodOptions options;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  /* The joist example's 2x10 used alone (no C_r, NDS 2018 4.3.9): Fb' = 900 x 1.1 = 990 psi. */
  grade_dfl_no2 (&no2);
  section_2x (&s, 10, 9.25);
  trb_design_wood_options_init (&options);
  joist_solve (&m, &s, 16);
  trb_design_wood_check (&m.input, &no2, &options, m.checks);
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 990.0, 0.05);
  member_clear (&m);

  /* At 32 in o.c. in a run, beyond 24 in: still no C_r. The loads double with the
   * tributary width (w = 133.3 plf): fb = 2 x 916.3 = 1832.6 psi. */
  options.repetitive_spacing = 32 * TRB_IN;
  joist_solve (&m, &s, 32);
  trb_design_wood_check (&m.input, &no2, &options, m.checks);
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 990.0, 0.05);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 1832.6, 0.2);
  member_clear (&m);
}

static void
test_wet_incised (void)
{
  TrbWoodGrade no2;
  TrbWoodOptions options;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no2 (&no2);
  section_2x (&s, 10, 9.25);
  trb_design_wood_options_init (&options);
  options.repetitive_spacing = 16 * TRB_IN;
  options.wet_service = TRUE;
  options.incised = TRUE;
  joist_solve (&m, &s, 16);
  trb_design_wood_check (&m.input, &no2, &options, m.checks);

  /* The joist example's 2x10, wet and incised, worked here from NDS 2018 Table 4.3.1:
   * Fb' = 900 x C_D 1.0 x C_M 1.0 (Fb C_F = 990 <= 1150, Table 4A) x C_F 1.1 x C_i 0.80
   * (Table 4.3.8) x C_r 1.15 = 910.8 psi; fb = 916.3 psi, so it now fails. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 910.8, 0.05);
  g_assert_cmpfloat (c->ratio, >, 1.0);
  /* Fv' = 180 x C_M 0.97 x C_i 0.80 = 139.68 psi. */
  c = find_check (m.checks, "Shear");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 139.68, 0.005);
  /* Fc_perp' = 625 x C_M 0.67 x C_i 1.0 x C_b 1.0 = 418.75 psi. */
  c = find_check (m.checks, "Bearing");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 418.75, 0.005);

  member_clear (&m);
}

static void
test_roof_load_duration (void)
{
  static const ComboDef roof_combos[] = {
    /* ASCE 7-16 2.4.1, ASD combinations 1 and 3 (from memory) */
    { "ASD 1: D", { [TRB_CASE_D] = 1 } },
    { "ASD 3: D + Lr", { [TRB_CASE_D] = 1, [TRB_CASE_LR] = 1 } },
    { "ASD 3: D + S", { [TRB_CASE_D] = 1, [TRB_CASE_S] = 1 } },
  };
  const double L = 12 * TRB_FT;
  const double xs[] = { 0, L };
  /* The roof of the load-duration case above, D 15, Lr 20, S 30 psf, on 2x10 DF-L No.2 at
   * 24 in: 30, 40, 60 plf. */
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, L, 30 * TRB_PLF, 30 * TRB_PLF } },
    { TRB_CASE_LR, { TRB_LOAD_UNIFORM, 0, L, 40 * TRB_PLF, 40 * TRB_PLF } },
    { TRB_CASE_S, { TRB_LOAD_UNIFORM, 0, L, 60 * TRB_PLF, 60 * TRB_PLF } },
  };
  TrbWoodGrade no2;
  TrbWoodOptions options;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no2 (&no2);
  section_2x (&s, 10, 9.25);
  trb_design_wood_options_init (&options);
  options.repetitive_spacing = 24 * TRB_IN;
  member_solve (&m, &s, L, 1.6e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), roof_combos,
                G_N_ELEMENTS (roof_combos));
  trb_design_wood_check (&m.input, &no2, &options, m.checks);

  /* As in the load-duration case, D + S governs (load / C_D 39.1 psf against 28.0 for
   * D + Lr). Worked here:
   * M = 90 x 12^2 / 8 = 1620 lb-ft = 19,440 lb-in, fb = 19,440 / 21.39 = 908.8 psi;
   * Fb' = 900 x C_D 1.15 x C_F 1.1 x C_r 1.15 = 1309.3 psi. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpstr (c->combination, ==, "ASD 3: D + S");
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 908.8, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 1309.3, 0.05);
  c = find_check (m.checks, "Shear");
  g_assert_nonnull (c);
  g_assert_cmpstr (c->combination, ==, "ASD 3: D + S");

  member_clear (&m);
}

static void
test_beam_6x12_unbraced (void)
{
  const double L = 16 * TRB_FT;
  const double xs[] = { 0, L };
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, L, 100 * TRB_PLF, 100 * TRB_PLF } },
    { TRB_CASE_L, { TRB_LOAD_UNIFORM, 0, L, 300 * TRB_PLF, 300 * TRB_PLF } },
  };
  TrbWoodGrade bs;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no1_bs (&bs);
  fill_rect (&s, "6x12", TRB_SHAPE_SAWN, 5.5, 11.5, 1, 6, 12, "beams_and_stringers");
  member_solve (&m, &s, L, 1.6e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), floor_combos,
                G_N_ELEMENTS (floor_combos));
  m.input.bracing = TRB_BRACING_POINTS;
  trb_design_wood_check (&m.input, &bs, NULL, m.checks);

  /* The 6x12 of the C_L case, braced at its ends only, D 100 + L 300 plf, worked here:
   * M = 400 x 16^2 / 8 = 12,800 lb-ft = 153,600 lb-in, fb = 153,600 / 121.23 = 1267.0 psi;
   * Fb' = 1350 x C_D 1.0 x C_F 1.0 x C_L 0.98308 = 1327.2 psi (C_r does not apply to
   * timbers, NDS 2018 4.3.9). */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 1267.0, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 1327.2, 0.05);
  g_assert_cmpstr (c->combination, ==, "ASD 2: D + L");

  member_clear (&m);
}

static void
test_glulam_girder (void)
{
  const double L = 24 * TRB_FT;
  const double xs[] = { 0, L };
  const double braces[] = { 8 * TRB_FT, 16 * TRB_FT };
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, L, 200 * TRB_PLF, 200 * TRB_PLF } },
    { TRB_CASE_L, { TRB_LOAD_UNIFORM, 0, L, 400 * TRB_PLF, 400 * TRB_PLF } },
  };
  TrbWoodGrade gv4;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_24f_v4 (&gv4);
  section_glulam_5_125x18 (&s);
  member_solve (&m, &s, L, 1.8e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), floor_combos,
                G_N_ELEMENTS (floor_combos));
  m.input.bracing = TRB_BRACING_POINTS;
  m.input.brace_x = braces;
  m.input.n_braces = G_N_ELEMENTS (braces);
  trb_design_wood_check (&m.input, &gv4, NULL, m.checks);

  /* A glulam girder worked here from NDS 2018 ch. 3 and 5 with Supplement Table 5A (from
   * memory): 5-1/8 x 18 24F-V4 DF/DF, 24 ft simple span, braced at its third points,
   * D 200 + L 400 plf, dry. A = 92.25 in2, S = 276.75 in3, I = 2490.75 in4 (b d, b d^2/6,
   * b d^3/12).
   * Flexure, D + L: M = 600 x 24^2 / 8 = 43,200 lb-ft = 518,400 lb-in at midspan,
   * fb = 518,400 / 276.75 = 1873.2 psi. The middle segment: lu = 96 in, lu/d = 5.33 < 7, so
   * le = 2.06 x 96 = 197.76 in (Table 3.3.3); RB = sqrt (197.76 x 18 / 5.125^2) = 11.64;
   * FbE = 1.20 x 950,000 / 135.53 = 8412 psi; Fb* = 2400 x C_D 1.0 x C_M 1.0 x C_t 1.0;
   * C_L = 0.9809 (Eq. 3.3-6). C_V over the 24 ft between zero moments = 0.9475
   * (Eq. 5.3-1). The lesser (5.3.6) is C_V: Fb' = 2400 x 0.9475 = 2274.1 psi. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 1873.2, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 2274.1, 0.1);
  g_assert_cmpstr (c->combination, ==, "ASD 2: D + L");
  g_assert_nonnull (strstr (c->detail, "C_V 0.948"));
  g_assert_nonnull (strstr (c->detail, "C_L 0.981"));

  /* Shear at d = 18 in = 1.5 ft (3.4.3.1): V = 7200 - 600 x 1.5 = 6300 lb,
   * fv = 1.5 x 6300 / 92.25 = 102.4 psi <= Fv' = 265 x 1.0 = 265 psi. */
  c = find_check (m.checks, "Shear");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 102.4, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 265.0, 1e-6);

  /* Bearing on 3.5 in at the ends (C_b = 1, 3.10.4): R = 7200 lb,
   * fc_perp = 7200 / (5.125 x 3.5) = 401.4 psi <= 650 psi; l_b,req = 7200 / (5.125 x 650)
   * = 2.16 in. */
  c = find_check (m.checks, "Bearing");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 401.4, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 650.0, 1e-6);
  g_assert_nonnull (strstr (c->detail, "l_b,req 2.16 in"));

  /* Deflection with E' = 1,800,000 psi: live 5 (400/12) 288^4 / (384 E I) = 0.666 in
   * (<= 0.800 in, L/360); total 600 plf: 0.999 in (<= 1.200 in, L/240). */
  c = find_check (m.checks, "Live deflection");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.666, 0.0005);
  c = find_check (m.checks, "Total deflection");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.999, 0.0005);

  member_clear (&m);
}

static void
test_glulam_negative_moment (void)
{
  const double L = 40 * TRB_FT;
  const double xs[] = { 0, 20 * TRB_FT, L };
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, L, 150 * TRB_PLF, 150 * TRB_PLF } },
    { TRB_CASE_L, { TRB_LOAD_UNIFORM, 0, L, 350 * TRB_PLF, 350 * TRB_PLF } },
  };
  TrbWoodGrade gv4;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_24f_v4 (&gv4);
  section_glulam_5_125x18 (&s);
  member_solve (&m, &s, L, 1.8e6 * TRB_PSI, xs, 3, loads, G_N_ELEMENTS (loads), floor_combos,
                G_N_ELEMENTS (floor_combos));
  trb_design_wood_check (&m.input, &gv4, NULL, m.checks);

  /* Two equal 20 ft spans, 5-1/8 x 18 24F-V4, deck on top, D 150 + L 350 plf, worked here:
   * M over the middle support = w L^2 / 8 = 500 x 400 / 8 = 25,000 lb-ft = 300,000 lb-in
   * (continuous-beam formula, common practice), fb = 1084.0 psi, bottom edge in compression
   * and held only at the supports: lu = 240 in, lu/d = 13.3, le = 1.63 x 240 + 3 x 18
   * = 445.2 in (Table 3.3.3); RB = 17.47; FbE = 1.20 x 950,000 / 305.1 = 3736.5 psi;
   * Fb* = Fbx- 1850 x C_D 1.0; C_L = 0.95692 (Eq. 3.3-6). The moment changes sign 15 ft
   * from each end (3L/4), so C_V takes 10 ft between zero moments: 1.034, capped at 1.0
   * (Eq. 5.3-1); the lesser is C_L: Fb' = 1850 x 0.95692 = 1770.3 psi. The positive
   * moment, 9/128 w L^2 = 168,750 lb-in (fb 609.8 psi against 2400 x 0.9931 = 2383.5 psi),
   * does not govern. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 1084.0, 0.05);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 1770.3, 0.05);
  g_assert_cmpfloat_with_epsilon (c->x / TRB_FT, 20.0, 1e-6);
  g_assert_nonnull (strstr (c->detail, "Fbx-"));

  member_clear (&m);
}

static void
test_shear_point_load_near_support (void)
{
  const double L = 10 * TRB_FT;
  const double xs[] = { 0, L };
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_POINT, 6 * TRB_IN, 6 * TRB_IN, 1000 * TRB_LBF, 0 } },
  };
  static const ComboDef combos[] = {
    { "ASD 1: D", { [TRB_CASE_D] = 1 } },
  };
  TrbWoodGrade no2;
  TrbWoodOptions options;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no2 (&no2);
  section_2x (&s, 10, 9.25);
  trb_design_wood_options_init (&options);

  /* 2x10, 10 ft span, 1000 lb 6 in from the left support, worked here by NDS 2018 3.4.3.1(b):
   * R_left = 1000 x 114/120 = 950 lb; V at d (9.25 in) = 950 - 1000 = -50 lb; the load within
   * d counts 6/9.25 of itself: V = -50 + 648.6 = 598.6 lb, fv = 1.5 x 598.6 / 13.875
   * = 64.72 psi. Fv' = 180 x C_D 0.9 = 162 psi. */
  member_solve (&m, &s, L, 1.6e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), combos,
                G_N_ELEMENTS (combos));
  trb_design_wood_check (&m.input, &no2, &options, m.checks);
  c = find_check (m.checks, "Shear");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 64.72, 0.005);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_PSI, 162.0, 1e-6);
  member_clear (&m);

  /* Hung in hangers (no reduction): V = 950 lb at the support, fv = 102.70 psi. */
  options.shear_at_d = FALSE;
  member_solve (&m, &s, L, 1.6e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), combos,
                G_N_ELEMENTS (combos));
  trb_design_wood_check (&m.input, &no2, &options, m.checks);
  c = find_check (m.checks, "Shear");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_PSI, 102.70, 0.005);
  member_clear (&m);
}

static void
test_slenderness_limit (void)
{
  const double L = 30 * TRB_FT;
  const double xs[] = { 0, L };
  const CaseLoad loads[] = {
    { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, L, 20 * TRB_PLF, 20 * TRB_PLF } },
  };
  static const ComboDef combos[] = {
    { "ASD 1: D", { [TRB_CASE_D] = 1 } },
  };
  TrbWoodGrade no2;
  TrbSection s;
  Member m;
  const TrbCheck *c;

  grade_dfl_no2 (&no2);
  section_2x (&s, 14, 13.25);
  member_solve (&m, &s, L, 1.6e6 * TRB_PSI, xs, 2, loads, G_N_ELEMENTS (loads), combos,
                G_N_ELEMENTS (combos));
  m.input.bracing = TRB_BRACING_POINTS;
  trb_design_wood_check (&m.input, &no2, NULL, m.checks);

  /* 2x14 unbraced over 30 ft: le = 1.84 x 360 = 662.4 in, RB = sqrt (662.4 x 13.25 / 1.5^2)
   * = 62.5 > 50, which NDS 2018 3.3.3.7 does not permit: the check fails whatever the load. */
  c = find_check (m.checks, "Flexure");
  g_assert_nonnull (c);
  g_assert_cmpstr (c->clause, ==, "NDS 2018 3.3.3.7");
  g_assert_cmpfloat (c->ratio, >, 1.0);

  member_clear (&m);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/design-wood/cd", test_cd);
  g_test_add_func ("/trb/design-wood/load-duration", test_load_duration);
  g_test_add_func ("/trb/design-wood/cf", test_cf);
  g_test_add_func ("/trb/design-wood/cm", test_cm);
  g_test_add_func ("/trb/design-wood/ci", test_ci);
  g_test_add_func ("/trb/design-wood/cr", test_cr);
  g_test_add_func ("/trb/design-wood/effective-length", test_effective_length);
  g_test_add_func ("/trb/design-wood/cl", test_cl);
  g_test_add_func ("/trb/design-wood/cv", test_cv);
  g_test_add_func ("/trb/design-wood/bearing-factors", test_bearing_factors);
  g_test_add_func ("/trb/design-wood/adjusted-e", test_adjusted_e);
  g_test_add_func ("/trb/design-wood/joist-2x8", test_joist_2x8);
  g_test_add_func ("/trb/design-wood/joist-2x10", test_joist_2x10);
  g_test_add_func ("/trb/design-wood/repetitive-member", test_repetitive_member);
  g_test_add_func ("/trb/design-wood/wet-incised", test_wet_incised);
  g_test_add_func ("/trb/design-wood/roof-load-duration", test_roof_load_duration);
  g_test_add_func ("/trb/design-wood/beam-6x12-unbraced", test_beam_6x12_unbraced);
  g_test_add_func ("/trb/design-wood/glulam-girder", test_glulam_girder);
  g_test_add_func ("/trb/design-wood/glulam-negative-moment", test_glulam_negative_moment);
  g_test_add_func ("/trb/design-wood/shear-point-load", test_shear_point_load_near_support);
  g_test_add_func ("/trb/design-wood/slenderness-limit", test_slenderness_limit);

  return g_test_run ();
}
