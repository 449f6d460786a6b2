/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-beam.h"
#include "trb-catalog.h"
#include "trb-design-allowable.h"
#include "trb-design.h"
#include "trb-units.h"

#define IN2 (TRB_IN * TRB_IN)
#define IN3 (TRB_IN * TRB_IN * TRB_IN)
#define IN4 (IN2 * IN2)
#define E_STEEL (29000 * TRB_KSI)

static void
section_clear (TrbSection *s)
{
  memset (s, 0, sizeof *s);
  s->kind = TRB_SHAPE_CUSTOM;
  s->weight = s->A = s->d = s->bf = s->tw = s->tf = s->kdes = NAN;
  s->Ix = s->Zx = s->Sx = s->rx = s->Iy = s->Zy = s->Sy = s->ry = NAN;
  s->J = s->Cw = s->rts = s->ho = s->bf_2tf = s->h_tw = NAN;
  s->b = s->nominal_b_in = s->nominal_d_in = s->E = NAN;
  s->plies = 1;
}

/* A W shape with the properties the classic method uses; AISC Shapes Database v16.0. */
static void
w_shape (TrbSection *s,
         const char *name,
         double      W,
         double      d,
         double      bf,
         double      tw,
         double      tf,
         double      Ix,
         double      Sx)
{
  section_clear (s);
  g_strlcpy (s->designation, name, sizeof s->designation);
  s->kind = TRB_SHAPE_W;
  s->weight = W * TRB_PLF;
  s->d = d * TRB_IN;
  s->bf = bf * TRB_IN;
  s->tw = tw * TRB_IN;
  s->tf = tf * TRB_IN;
  s->Ix = Ix * IN4;
  s->Sx = Sx * IN3;
}

static const TrbCheck *
find_check (GArray     *checks,
            const char *name)
{
  for (guint i = 0; i < checks->len; i++)
    if (g_strcmp0 (g_array_index (checks, TrbCheck, i).name, name) == 0)
      return &g_array_index (checks, TrbCheck, i);
  return NULL;
}

static void
test_shear_stress (void)
{
  TrbSection s;
  const char *formula = NULL;

  /* W14X34 (Shapes Database v16.0: d 14.0, tw 0.285), V = 16 kips:
   * fv = V/(d tw) = 16/(14.0*0.285) = 16/3.99 = 4.010 ksi (AISC ASD 9th ed. F4, from memory) */
  w_shape (&s, "W14X34", 34, 14.0, 6.75, 0.285, 0.455, 340, 48.6);
  g_assert_cmpfloat_with_epsilon (trb_design_allowable_shear_stress (&s, 16 * TRB_KIP, &formula)
                                  / TRB_KSI, 4.010, 0.0005);
  g_assert_cmpstr (formula, ==, "V/(d tw)");

  /* 2x10 joist, ENGINEERING.md §8 item 6: V = 466.7 lb, A = 13.875 in^2:
   * fv = 1.5 V/A = 1.5*466.7/13.875 = 50.45 psi (NDS 2018 Eq. 3.4-2; §8 prints 50.5) */
  section_clear (&s);
  s.kind = TRB_SHAPE_SAWN;
  s.b = 1.5 * TRB_IN;
  s.d = 9.25 * TRB_IN;
  s.A = 13.875 * IN2;
  s.Sx = 21.39 * IN3;
  g_assert_cmpfloat_with_epsilon (trb_design_allowable_shear_stress (&s, 466.7 * TRB_LBF,
                                                                     &formula) / TRB_PSI,
                                  50.45, 0.005);
  g_assert_cmpstr (formula, ==, "1.5 V/A");

  /* HSS8X4X1/4 (Shapes Database v16.0: H 8.00, t_des 0.233), V = 10 kips, both webs with
   * h = H - 3t (AISC 360-16 G4, from memory): 2*(8.00 - 0.699)*0.233 = 3.4023 in^2;
   * fv = 10/3.4023 = 2.939 ksi */
  section_clear (&s);
  s.kind = TRB_SHAPE_HSS_RECT;
  s.d = 8.00 * TRB_IN;
  s.bf = 4.00 * TRB_IN;
  s.tw = s.tf = 0.233 * TRB_IN;
  g_assert_cmpfloat_with_epsilon (trb_design_allowable_shear_stress (&s, 10 * TRB_KIP, &formula)
                                  / TRB_KSI, 2.939, 0.0005);
  g_assert_cmpstr (formula, ==, "V/(2 h t)");

  /* a custom section with neither a web nor an area: no stress, no formula */
  section_clear (&s);
  s.Sx = 10 * IN3;
  g_assert_true (isnan (trb_design_allowable_shear_stress (&s, 1000, &formula)));
  g_assert_null (formula);
}

static void
test_lc (void)
{
  TrbSection s;

  /* W18X50 at Fy = 36 ksi, AISC ASD 9th ed. F1.1 (from memory), by hand:
   *   76 bf/sqrt(Fy) = 76*7.50/6 = 95.0 in;
   *   Af = 7.50*0.570 = 4.275 in^2, d/Af = 18.0/4.275 = 4.2105,
   *   20000/(4.2105*36) = 131.9 in; Lc = 95.0 in = 7.92 ft */
  w_shape (&s, "W18X50", 50, 18.0, 7.50, 0.355, 0.570, 800, 88.9);
  g_assert_cmpfloat_with_epsilon (trb_design_allowable_lc (&s, 36 * TRB_KSI) / TRB_IN, 95.0,
                                  1e-6);
}

/* The lightest W with enough S, from a short list sorted by weight (Shapes Database v16.0
 * weights and Sx, every W of 26 to 36 lb/ft with Sx over 33 in^3). */
static void
test_lightest_list (void)
{
  const struct { const char *name; double W, Sx; } rows[] = {
    { "W12X26", 26, 33.4 }, { "W14X26", 26, 35.3 }, { "W16X26", 26, 38.4 },
    { "W12X30", 30, 38.6 }, { "W14X30", 30, 42.0 }, { "W16X31", 31, 47.2 },
    { "W10X33", 33, 35.0 }, { "W14X34", 34, 48.6 }, { "W12X35", 35, 45.6 },
    { "W18X35", 35, 57.6 }, { "W16X36", 36, 56.5 },
  };
  TrbSection list[G_N_ELEMENTS (rows)];

  for (guint i = 0; i < G_N_ELEMENTS (rows); i++)
    {
      section_clear (&list[i]);
      g_strlcpy (list[i].designation, rows[i].name, sizeof list[i].designation);
      list[i].kind = TRB_SHAPE_W;
      list[i].weight = rows[i].W * TRB_PLF;
      list[i].Sx = rows[i].Sx * IN3;
    }

  /* S_req = 48.0 in^3 (worked in test_hand_method): W16X31 has 47.2, too little; W14X34 has
   * 48.6 at 34 lb/ft */
  g_assert_cmpstr (list[trb_design_allowable_lightest (list, G_N_ELEMENTS (rows),
                                                       48.0 * IN3)].designation, ==, "W14X34");
  /* 57.0 in^3: W18X35 (57.6) */
  g_assert_cmpstr (list[trb_design_allowable_lightest (list, G_N_ELEMENTS (rows),
                                                       57.0 * IN3)].designation, ==, "W18X35");
  g_assert_cmpint (trb_design_allowable_lightest (list, G_N_ELEMENTS (rows), 100 * IN3), ==, -1);
}

/* The same selection from the bundled catalog: every W shape, sorted by weight. */
static void
test_lightest_catalog (void)
{
  const TrbCatalog *cat = trb_catalog_get_default ();
  const TrbSection *w;
  guint n = 0;
  int i;

  g_assert_nonnull (cat);
  w = trb_catalog_get_family (cat, TRB_FAMILY_W, &n);
  g_assert_cmpuint (n, >, 200);

  /* S_req = 48.0 in^3 (test_hand_method): W14X34 (Sx 48.6, 34 lb/ft) is the lightest W with
   * enough S; AISC Manual Table 3-2 sorts it so (from memory) */
  i = trb_design_allowable_lightest (w, n, 48.0 * IN3);
  g_assert_cmpint (i, >=, 0);
  g_assert_cmpstr (w[i].designation, ==, "W14X34");
}

/* The classic method by hand, A36, simple span L = 20 ft, service loads (self-weight
 * allowance included): uniform w = 1.0 kip/ft and P = 10 kips at a = 8 ft from the left.
 *   Reactions: RL = wL/2 + P(L - a)/L = 10 + 10*12/20 = 16 kips; RR = 10 + 10*8/20 = 14 kips.
 *   Shear: V = 16 - x up to the load (8 kips at 8-), then 8 - 10 = -2 kips: V changes sign at
 *   the load, so M_max = RL*8 - w*8^2/2 = 128 - 32 = 96 kip-ft at x = 8 ft.
 *   Fb = 0.66 Fy = 0.66*36 = 23.76, taken as 24 ksi (AISC ASD 9th ed. F1-1, from memory).
 *   S_req = M/Fb = 96*12/24 = 48.0 in^3 -> W14X34, Sx = 48.6 in^3 (test_lightest_*);
 *   fb = 1152/48.6 = 23.70 ksi.
 *   Fv = 0.40 Fy = 14.4 ksi (AISC ASD 9th ed. F4-1, from memory);
 *   fv = V/(d tw) = 16/(14.0*0.285) = 4.010 ksi. */
static void
test_hand_method (void)
{
  const double L = 20 * TRB_FT;
  const TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  const TrbLoad loads[] = {
    { TRB_LOAD_UNIFORM, 0, L, 1.0 * TRB_KLF, 1.0 * TRB_KLF },
    { TRB_LOAD_POINT, 8 * TRB_FT, 0, 10 * TRB_KIP, 0 },
  };
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) beam = NULL;
  g_autoptr(TrbBeamResult) result = NULL;
  g_autoptr(GArray) checks = g_array_new (FALSE, FALSE, sizeof (TrbCheck));
  const TrbReaction *r;
  guint n_r = 0;
  TrbSection s;
  TrbDemandCombo combo = { 0, };
  TrbDesignInput in = { 0, };
  const TrbCheck *c;

  w_shape (&s, "W14X34", 34, 14.0, 6.75, 0.285, 0.455, 340, 48.6);
  beam = trb_beam_new (L, E_STEEL, s.Ix, sup, 2, &error);
  g_assert_no_error (error);
  result = trb_beam_solve (beam, loads, 2, &error);
  g_assert_no_error (error);

  r = trb_beam_result_get_reactions (result, &n_r);
  g_assert_cmpuint (n_r, ==, 2);
  g_assert_cmpfloat_with_epsilon (r[0].force / TRB_KIP, 16.0, 1e-9);
  g_assert_cmpfloat_with_epsilon (r[1].force / TRB_KIP, 14.0, 1e-9);

  g_strlcpy (combo.name, "ASD 2: D + L", sizeof combo.name);
  combo.result = result;
  in.section = &s;
  in.length = L;
  in.supports = sup;
  in.n_supports = 2;
  in.combos = &combo;
  in.n_combos = 1;

  g_assert_true (trb_design_allowable_check (&in, 24 * TRB_KSI, 14.4 * TRB_KSI, checks));

  c = find_check (checks, "Section modulus");
  g_assert_nonnull (c);
  g_assert_cmpint (c->dimension, ==, TRB_DIM_SECTION_MODULUS);
  g_assert_cmpfloat_with_epsilon (c->demand / IN3, 48.0, 1e-6);
  g_assert_cmpfloat_with_epsilon (c->capacity / IN3, 48.6, 1e-9);
  g_assert_cmpfloat_with_epsilon (c->ratio, 48.0 / 48.6, 1e-6);
  g_assert_cmpfloat_with_epsilon (c->x / TRB_FT, 8.0, 1e-6);
  g_assert_cmpstr (c->combination, ==, "ASD 2: D + L");
  g_assert_cmpstr (c->detail, ==, "M = 96.0 kip-ft, fb = M/S = 23.7 ksi, Fb = 24.0 ksi");

  c = find_check (checks, "Web shear");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_KSI, 4.010, 0.0005);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_KSI, 14.4, 1e-9);
  g_assert_cmpfloat_with_epsilon (c->x, 0, 1e-9);
  g_assert_cmpstr (c->detail, ==, "V = 16.0 kips, fv = V/(d tw) = 4.01 ksi, Fv = 14.4 ksi");

  /* no limits given: no deflection check, and none claimed */
  g_assert_null (find_check (checks, "Live deflection"));
  g_assert_null (find_check (checks, "Total deflection"));

  /* W16X31 (Sx 47.2) is one size too light: ratio 48.0/47.2 = 1.017 > 1 */
  g_array_set_size (checks, 0);
  s.Sx = 47.2 * IN3;
  g_assert_true (trb_design_allowable_check (&in, 24 * TRB_KSI, 14.4 * TRB_KSI, checks));
  c = find_check (checks, "Section modulus");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->ratio, 48.0 / 47.2, 1e-6);
}

/* What cannot be checked is said so, never passed. */
static void
test_not_checked (void)
{
  const double L = 10 * TRB_FT;
  const TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { L, TRB_SUPPORT_ROLLER } };
  const TrbLoad loads[] = { { TRB_LOAD_UNIFORM, 0, L, 1.0 * TRB_KLF, 1.0 * TRB_KLF } };
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) beam = NULL;
  g_autoptr(TrbBeamResult) result = NULL;
  g_autoptr(GArray) checks = g_array_new (FALSE, FALSE, sizeof (TrbCheck));
  TrbSection s;
  TrbDemandCombo combo = { 0, };
  TrbDesignInput in = { 0, };

  /* a custom section with S only */
  section_clear (&s);
  s.Sx = 20 * IN3;
  s.Ix = 100 * IN4;
  beam = trb_beam_new (L, E_STEEL, s.Ix, sup, 2, &error);
  g_assert_no_error (error);
  result = trb_beam_solve (beam, loads, 1, &error);
  g_assert_no_error (error);
  g_strlcpy (combo.name, "D + L", sizeof combo.name);
  combo.result = result;
  in.section = &s;
  in.length = L;
  in.supports = sup;
  in.n_supports = 2;
  in.combos = &combo;
  in.n_combos = 1;

  /* no web and no area: the shear check is not made; bending is */
  g_assert_false (trb_design_allowable_check (&in, 24 * TRB_KSI, 14.4 * TRB_KSI, checks));
  g_assert_nonnull (find_check (checks, "Section modulus"));
  g_assert_null (find_check (checks, "Web shear"));
  g_assert_nonnull (find_check (checks, "Not checked"));
  g_assert_true (isnan (find_check (checks, "Not checked")->ratio));

  /* no Fb given */
  g_array_set_size (checks, 0);
  s.A = 10 * IN2;
  g_assert_false (trb_design_allowable_check (&in, 0, 14.4 * TRB_KSI, checks));
  g_assert_null (find_check (checks, "Section modulus"));
  g_assert_nonnull (find_check (checks, "Web shear"));
  g_assert_nonnull (find_check (checks, "Not checked"));
}

/* Deflection, shared by every method (trb_design_check_deflection). A W18X35 (Ix 510 in^4,
 * Shapes Database v16.0) fixed at one end, 8 ft long, 2 kips of live load at the tip:
 *   delta = P L^3/(3 E I) = 2*96^3/(3*29000*510) = 1769472/44370000 = 0.03988 in
 *   (AISC Manual Table 3-23 case 22, from memory).
 * The cantilever is judged on 2L = 192 in (IBC 2021 Table 1604.3 note i, from memory): the
 * L/360 limit is 192/360 = 0.5333 in; the actual ratio 192/0.03988 = 4814.4 -> "L/4814".
 * A total-load result with a limit of 0 ("none") gives no check. */
static void
test_deflection_cantilever (void)
{
  const double L = 8 * TRB_FT;
  const TrbSupport sup[] = { { 0, TRB_SUPPORT_FIXED } };
  const TrbLoad loads[] = { { TRB_LOAD_POINT, L, 0, 2 * TRB_KIP, 0 } };
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) beam = NULL;
  g_autoptr(TrbBeamResult) result = NULL;
  g_autoptr(GArray) checks = g_array_new (FALSE, FALSE, sizeof (TrbCheck));
  TrbSection s;
  TrbDesignInput in = { 0, };
  const TrbCheck *c;

  w_shape (&s, "W18X35", 35, 17.7, 6.00, 0.300, 0.425, 510, 57.6);
  beam = trb_beam_new (L, E_STEEL, s.Ix, sup, 1, &error);
  g_assert_no_error (error);
  result = trb_beam_solve (beam, loads, 1, &error);
  g_assert_no_error (error);

  in.section = &s;
  in.length = L;
  in.supports = sup;
  in.n_supports = 1;
  in.live = result;
  in.live_limit = 360;
  in.total = result;
  in.total_limit = 0;

  trb_design_check_deflection (&in, checks);
  g_assert_cmpuint (checks->len, ==, 1);
  c = find_check (checks, "Live deflection");
  g_assert_nonnull (c);
  g_assert_cmpint (c->dimension, ==, TRB_DIM_LENGTH);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.03988, 0.00001);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_IN, 192.0 / 360, 1e-9);
  g_assert_cmpfloat_with_epsilon (c->x, L, 1e-9);
  g_assert_cmpstr (c->clause, ==, "IBC 2021 Table 1604.3, note i");
  g_assert_cmpstr (c->detail, ==, "L/4814, limit L/360; cantilever, L = 2 × 8.00 ft");

  /* both limits "none": nothing at all */
  g_array_set_size (checks, 0);
  in.live_limit = 0;
  trb_design_check_deflection (&in, checks);
  g_assert_cmpuint (checks->len, ==, 0);
}

/* An overhang: supports at 0 and l = 20 ft, overhang a = 6 ft, P = 2 kips at the tip,
 * W18X35 (Ix 510). AISC Manual Table 3-23 case 24 (from memory):
 *   tip: P a^2 (l + a)/(3 E I) = 2*72^2*312/(3*29000*510) = 3234816/44370000 = 0.07291 in
 *   back span, upward, at l/sqrt(3): P a l^2/(9 sqrt(3) E I) = 2*72*240^2/(15.588*29000*510)
 *     = 0.03598 in.
 * Total-load limit L/240: the overhang on 2a = 144 in allows 0.600 in (ratio 0.1215); the span
 * 240/240 = 1.000 in (ratio 0.036). The overhang governs: 144/0.07291 = 1975.1 -> "L/1975". */
static void
test_deflection_overhang (void)
{
  const double L = 26 * TRB_FT;
  const TrbSupport sup[] = { { 0, TRB_SUPPORT_PIN }, { 20 * TRB_FT, TRB_SUPPORT_ROLLER } };
  const TrbLoad loads[] = { { TRB_LOAD_POINT, L, 0, 2 * TRB_KIP, 0 } };
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBeam) beam = NULL;
  g_autoptr(TrbBeamResult) result = NULL;
  g_autoptr(GArray) checks = g_array_new (FALSE, FALSE, sizeof (TrbCheck));
  TrbSection s;
  TrbDesignInput in = { 0, };
  const TrbCheck *c;

  w_shape (&s, "W18X35", 35, 17.7, 6.00, 0.300, 0.425, 510, 57.6);
  beam = trb_beam_new (L, E_STEEL, s.Ix, sup, 2, &error);
  g_assert_no_error (error);
  result = trb_beam_solve (beam, loads, 1, &error);
  g_assert_no_error (error);

  in.section = &s;
  in.length = L;
  in.supports = sup;
  in.n_supports = 2;
  in.total = result;
  in.total_limit = 240;

  trb_design_check_deflection (&in, checks);
  g_assert_cmpuint (checks->len, ==, 1);
  c = find_check (checks, "Total deflection");
  g_assert_nonnull (c);
  g_assert_cmpfloat_with_epsilon (c->demand / TRB_IN, 0.07291, 0.00001);
  g_assert_cmpfloat_with_epsilon (c->capacity / TRB_IN, 0.600, 1e-9);
  g_assert_cmpfloat_with_epsilon (c->x, L, 1e-9);
  g_assert_cmpstr (c->detail, ==, "L/1975, limit L/240; right overhang, L = 2 × 6.00 ft");

  /* ratio 0.07291/0.600 = 0.1215; judged on its own length it would be twice that */
  g_assert_cmpfloat_with_epsilon (c->ratio, 0.07291 / 0.600, 0.0001);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/design-allowable/shear-stress", test_shear_stress);
  g_test_add_func ("/trb/design-allowable/lc", test_lc);
  g_test_add_func ("/trb/design-allowable/lightest-list", test_lightest_list);
  g_test_add_func ("/trb/design-allowable/lightest-catalog", test_lightest_catalog);
  g_test_add_func ("/trb/design-allowable/hand-method", test_hand_method);
  g_test_add_func ("/trb/design-allowable/not-checked", test_not_checked);
  g_test_add_func ("/trb/design-allowable/deflection-cantilever", test_deflection_cantilever);
  g_test_add_func ("/trb/design-allowable/deflection-overhang", test_deflection_overhang);

  return g_test_run ();
}
