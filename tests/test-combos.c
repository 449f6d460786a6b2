/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-combos.h"
#include "trb-model.h"
#include "trb-solve.h"
#include "trb-units.h"

/* Relative tolerance for values the engine computes exactly up to rounding. */
#define REL 1e-9

static void
assert_close (double actual,
              double expected)
{
  g_assert_cmpfloat_with_epsilon (actual, expected, REL * MAX (1.0, fabs (expected)));
}

static void
assert_one_of (const char *actual,
               const char *a,
               const char *b)
{
  if (g_strcmp0 (actual, a) != 0)
    g_assert_cmpstr (actual, ==, b);
}

typedef struct
{
  const char *name;
  const char *equation;
  double      f[TRB_N_CASES];  /* D, L, Lr, S */
} Expected;

static void
assert_combos (GArray         *combos,
               const Expected *expected,
               guint           n_expected)
{
  g_assert_cmpuint (combos->len, ==, n_expected);
  for (guint i = 0; i < n_expected; i++)
    {
      const TrbCombo *c = &g_array_index (combos, TrbCombo, i);

      g_assert_cmpstr (c->name, ==, expected[i].name);
      g_assert_cmpstr (c->equation, ==, expected[i].equation);
      for (guint k = 0; k < TRB_N_CASES; k++)
        g_assert_cmpfloat (c->factors[k], ==, expected[i].f[k]);
    }
}

static void
test_case_names (void)
{
  TrbLoadCase c = TRB_CASE_D;

  g_assert_cmpstr (trb_load_case_name (TRB_CASE_D), ==, "D");
  g_assert_cmpstr (trb_load_case_name (TRB_CASE_L), ==, "L");
  g_assert_cmpstr (trb_load_case_name (TRB_CASE_LR), ==, "Lr");
  g_assert_cmpstr (trb_load_case_name (TRB_CASE_S), ==, "S");
  g_assert_true (trb_load_case_from_name ("Lr", &c));
  g_assert_cmpint (c, ==, TRB_CASE_LR);
  g_assert_true (trb_load_case_from_name ("S", &c));
  g_assert_cmpint (c, ==, TRB_CASE_S);
  /* case matters: "LR" and "l" are typos, not cases */
  g_assert_false (trb_load_case_from_name ("LR", &c));
  g_assert_false (trb_load_case_from_name ("l", &c));
  g_assert_false (trb_load_case_from_name ("W", &c));
}

/* ASCE 7-16 §2.3.1 basic combinations 1-4 (from memory; ENGINEERING.md §1.1), without W, E
 * and R. Combination 4, 1.2D + L + 0.5(Lr or S), is below combination 2 factor by factor once
 * its 1.0W is gone, so it is dropped. */
static void
test_lrfd_all_cases (void)
{
  const gboolean present[TRB_N_CASES] = { TRUE, TRUE, TRUE, TRUE };
  const Expected expected[] = {
    { "LRFD 1: 1.4D", "ASCE 7-16 Eq. 2.3-1", { 1.4, 0, 0, 0 } },
    { "LRFD 2: 1.2D + 1.6L + 0.5Lr", "ASCE 7-16 Eq. 2.3-2", { 1.2, 1.6, 0.5, 0 } },
    { "LRFD 2: 1.2D + 1.6L + 0.5S", "ASCE 7-16 Eq. 2.3-2", { 1.2, 1.6, 0, 0.5 } },
    { "LRFD 3: 1.2D + 1.6Lr + L", "ASCE 7-16 Eq. 2.3-3", { 1.2, 1.0, 1.6, 0 } },
    { "LRFD 3: 1.2D + 1.6S + L", "ASCE 7-16 Eq. 2.3-3", { 1.2, 1.0, 0, 1.6 } },
  };
  g_autoptr(GArray) combos = trb_combos_build (TRB_COMBO_SET_LRFD, present);

  assert_combos (combos, expected, G_N_ELEMENTS (expected));
}

/* The same, for a floor member with dead and live load only: 1.4D and 1.2D + 1.6L, the two
 * every floor design starts from (ASCE 7-16 §2.3.1 combinations 1 and 2, from memory). */
static void
test_lrfd_dead_live (void)
{
  const gboolean present[TRB_N_CASES] = { TRUE, TRUE, FALSE, FALSE };
  const Expected expected[] = {
    { "LRFD 1: 1.4D", "ASCE 7-16 Eq. 2.3-1", { 1.4, 0, 0, 0 } },
    { "LRFD 2: 1.2D + 1.6L", "ASCE 7-16 Eq. 2.3-2", { 1.2, 1.6, 0, 0 } },
  };
  g_autoptr(GArray) combos = trb_combos_build (TRB_COMBO_SET_LRFD, present);

  assert_combos (combos, expected, G_N_ELEMENTS (expected));
}

/* A roof member with D, Lr and S: combination 3 governs as 1.2D + 1.6(Lr or S); 2 keeps
 * 1.2D + 0.5(Lr or S), which is below 3, so it goes (ASCE 7-16 §2.3.1, from memory). */
static void
test_lrfd_roof (void)
{
  const gboolean present[TRB_N_CASES] = { TRUE, FALSE, TRUE, TRUE };
  const Expected expected[] = {
    { "LRFD 1: 1.4D", "ASCE 7-16 Eq. 2.3-1", { 1.4, 0, 0, 0 } },
    { "LRFD 3: 1.2D + 1.6Lr", "ASCE 7-16 Eq. 2.3-3", { 1.2, 0, 1.6, 0 } },
    { "LRFD 3: 1.2D + 1.6S", "ASCE 7-16 Eq. 2.3-3", { 1.2, 0, 0, 1.6 } },
  };
  g_autoptr(GArray) combos = trb_combos_build (TRB_COMBO_SET_LRFD, present);

  assert_combos (combos, expected, G_N_ELEMENTS (expected));
}

/* ASCE 7-16 §2.4.1 combinations 1-4 (from memory; ENGINEERING.md §1.1). */
static void
test_asd_all_cases (void)
{
  const gboolean present[TRB_N_CASES] = { TRUE, TRUE, TRUE, TRUE };
  const Expected expected[] = {
    { "ASD 1: D", "ASCE 7-16 Eq. 2.4-1", { 1, 0, 0, 0 } },
    { "ASD 2: D + L", "ASCE 7-16 Eq. 2.4-2", { 1, 1, 0, 0 } },
    { "ASD 3: D + Lr", "ASCE 7-16 Eq. 2.4-3", { 1, 0, 1, 0 } },
    { "ASD 3: D + S", "ASCE 7-16 Eq. 2.4-3", { 1, 0, 0, 1 } },
    { "ASD 4: D + 0.75L + 0.75Lr", "ASCE 7-16 Eq. 2.4-4", { 1, 0.75, 0.75, 0 } },
    { "ASD 4: D + 0.75L + 0.75S", "ASCE 7-16 Eq. 2.4-4", { 1, 0.75, 0, 0.75 } },
  };
  g_autoptr(GArray) combos = trb_combos_build (TRB_COMBO_SET_ASD, present);

  assert_combos (combos, expected, G_N_ELEMENTS (expected));
}

/* D + L only: D + 0.75L is below D + L, and D + (Lr or S) is D again (ASCE 7-16 §2.4.1,
 * from memory). The first combination stays even though D + L covers it: it is the one with
 * no live load, which no live-load pattern reproduces. */
static void
test_asd_dead_live (void)
{
  const gboolean present[TRB_N_CASES] = { TRUE, TRUE, FALSE, FALSE };
  const Expected expected[] = {
    { "ASD 1: D", "ASCE 7-16 Eq. 2.4-1", { 1, 0, 0, 0 } },
    { "ASD 2: D + L", "ASCE 7-16 Eq. 2.4-2", { 1, 1, 0, 0 } },
  };
  const gboolean dead_only[TRB_N_CASES] = { TRUE, FALSE, FALSE, FALSE };
  const Expected expected_dead[] = {
    { "ASD 1: D", "ASCE 7-16 Eq. 2.4-1", { 1, 0, 0, 0 } },
  };
  g_autoptr(GArray) combos = trb_combos_build (TRB_COMBO_SET_ASD, present);
  g_autoptr(GArray) dead = trb_combos_build (TRB_COMBO_SET_ASD, dead_only);

  assert_combos (combos, expected, G_N_ELEMENTS (expected));
  assert_combos (dead, expected_dead, G_N_ELEMENTS (expected_dead));
}

/* The service set of the classic allowable-stress method, unfactored (common practice), and
 * the deflection sets of IBC 2021 Table 1604.3: L (or Lr, S) alone and D + L. */
static void
test_service_and_deflection_sets (void)
{
  const gboolean present[TRB_N_CASES] = { TRUE, TRUE, FALSE, TRUE };
  const gboolean no_live[TRB_N_CASES] = { TRUE, FALSE, FALSE, FALSE };
  const Expected service[] = {
    { "Service 1: D + L", "ASCE 7-16 Eq. 2.4-2", { 1, 1, 0, 0 } },
    { "Service 2: D + S", "ASCE 7-16 Eq. 2.4-3", { 1, 0, 0, 1 } },
  };
  const Expected live[] = {
    { "Live: L", "IBC 2021 Table 1604.3", { 0, 1, 0, 0 } },
    { "Live: S", "IBC 2021 Table 1604.3", { 0, 0, 0, 1 } },
  };
  const Expected total[] = {
    { "Total: D + L", "IBC 2021 Table 1604.3", { 1, 1, 0, 0 } },
    { "Total: D + S", "IBC 2021 Table 1604.3", { 1, 0, 0, 1 } },
    { "Total: D + 0.75L + 0.75S", "IBC 2021 Table 1604.3", { 1, 0.75, 0, 0.75 } },
  };
  g_autoptr(GArray) s = trb_combos_build (TRB_COMBO_SET_SERVICE, present);
  g_autoptr(GArray) l = trb_combos_build (TRB_COMBO_SET_LIVE, present);
  g_autoptr(GArray) t = trb_combos_build (TRB_COMBO_SET_TOTAL, present);
  g_autoptr(GArray) l0 = trb_combos_build (TRB_COMBO_SET_LIVE, no_live);

  assert_combos (s, service, G_N_ELEMENTS (service));
  assert_combos (l, live, G_N_ELEMENTS (live));
  assert_combos (t, total, G_N_ELEMENTS (total));
  /* no live load, no live-load deflection to check */
  g_assert_cmpuint (l0->len, ==, 0);
}

/* A member 16 m long on supports at 2, 8 and 14 m: a left overhang, two spans, a right
 * overhang (positions chosen for the test; the cut is plain geometry). */
static GArray *
four_regions (void)
{
  const TrbSupport s[] = {
    { 14, TRB_SUPPORT_ROLLER }, { 2, TRB_SUPPORT_PIN }, { 8, TRB_SUPPORT_ROLLER },
  };

  return trb_regions_build (s, G_N_ELEMENTS (s), 16);
}

static void
test_regions (void)
{
  g_autoptr(GArray) r = four_regions ();
  const TrbRegion *reg = (const TrbRegion *) r->data;
  const TrbSupport ends[] = { { 0, TRB_SUPPORT_PIN }, { 5, TRB_SUPPORT_ROLLER } };
  g_autoptr(GArray) simple = trb_regions_build (ends, 2, 5);

  g_assert_cmpuint (r->len, ==, 4);
  g_assert_cmpint (reg[0].kind, ==, TRB_REGION_LEFT_OVERHANG);
  g_assert_cmpfloat (reg[0].a, ==, 0);
  g_assert_cmpfloat (reg[0].b, ==, 2);
  g_assert_cmpint (reg[1].kind, ==, TRB_REGION_SPAN);
  g_assert_cmpint (reg[1].span, ==, 1);
  g_assert_cmpfloat (reg[1].b, ==, 8);
  g_assert_cmpint (reg[2].span, ==, 2);
  g_assert_cmpint (reg[3].kind, ==, TRB_REGION_RIGHT_OVERHANG);
  g_assert_cmpfloat (reg[3].a, ==, 14);
  g_assert_cmpfloat (reg[3].b, ==, 16);

  /* a point on a support belongs to the region on its right; the right end to the last */
  g_assert_cmpuint (trb_region_find (reg, 4, 1.0), ==, 0);
  g_assert_cmpuint (trb_region_find (reg, 4, 2.0), ==, 1);
  g_assert_cmpuint (trb_region_find (reg, 4, 14.0), ==, 3);
  g_assert_cmpuint (trb_region_find (reg, 4, 16.0), ==, 3);

  g_assert_cmpuint (simple->len, ==, 1);
  g_assert_cmpint (g_array_index (simple, TrbRegion, 0).kind, ==, TRB_REGION_SPAN);
}

/* A uniform load across two supports is cut at them; a linear one keeps its intensity at
 * the cut (w(x) = w1 + (w2 - w1)(x - a)/(b - a): from 1 to 5 N/m over [0, 8], w(2) = 2 N/m);
 * point loads go whole to their region. The pieces add up to the load (statics). */
static void
test_split (void)
{
  g_autoptr(GArray) r = four_regions ();
  const TrbLoad loads[] = {
    { TRB_LOAD_UNIFORM, 1, 15, 3, 3 },
    { TRB_LOAD_LINEAR, 0, 8, 1, 5 },
    { TRB_LOAD_POINT, 8, 8, 7, 0 },
  };
  GArray **split = trb_loads_split (loads, G_N_ELEMENTS (loads),
                                    (const TrbRegion *) r->data, r->len);
  double total = 0;
  const TrbLoad *p;

  g_assert_cmpuint (split[0]->len, ==, 2);   /* uniform [1, 2], linear [0, 2] */
  g_assert_cmpuint (split[1]->len, ==, 2);   /* uniform [2, 8], linear [2, 8] */
  g_assert_cmpuint (split[2]->len, ==, 2);   /* uniform [8, 14], point at 8 */
  g_assert_cmpuint (split[3]->len, ==, 1);   /* uniform [14, 15] */

  p = &g_array_index (split[0], TrbLoad, 0);
  g_assert_cmpfloat (p->a, ==, 1);
  g_assert_cmpfloat (p->b, ==, 2);
  p = &g_array_index (split[0], TrbLoad, 1);
  g_assert_cmpint (p->kind, ==, TRB_LOAD_LINEAR);
  assert_close (p->w1, 1);
  assert_close (p->w2, 2);
  p = &g_array_index (split[1], TrbLoad, 1);
  assert_close (p->w1, 2);
  assert_close (p->w2, 5);
  p = &g_array_index (split[2], TrbLoad, 1);
  g_assert_cmpint (p->kind, ==, TRB_LOAD_POINT);
  g_assert_cmpfloat (p->w1, ==, 7);

  /* 3 N/m over 14 m + (1 + 5)/2 N/m over 8 m + 7 N = 42 + 24 + 7 = 73 N */
  for (guint reg = 0; reg < r->len; reg++)
    for (guint i = 0; i < split[reg]->len; i++)
      {
        p = &g_array_index (split[reg], TrbLoad, i);
        if (p->kind == TRB_LOAD_POINT)
          total += p->w1;
        else
          total += 0.5 * (p->w1 + p->w2) * (p->b - p->a);
      }
  assert_close (total, 73);
  trb_loads_split_free (split, r->len);
}

static void
test_pattern_names (void)
{
  g_autoptr(GArray) r = NULL;
  g_autoptr(GArray) p = NULL;
  const TrbSupport s[] = {
    { 1, TRB_SUPPORT_PIN }, { 5, TRB_SUPPORT_ROLLER }, { 9, TRB_SUPPORT_ROLLER },
    { 13, TRB_SUPPORT_ROLLER },
  };
  /* all; each region alone; adjacent span pairs; odd spans; (even spans = span 2, already
   * there); each overhang with its span */
  const char * const expected[] = {
    "L on all spans and overhangs",
    "L on left overhang", "L on span 1", "L on span 2", "L on span 3", "L on right overhang",
    "L on spans 1+2", "L on spans 2+3",
    "L on spans 1+3",
    "L on left overhang + span 1", "L on span 3 + right overhang",
  };

  r = trb_regions_build (s, G_N_ELEMENTS (s), 14);
  g_assert_cmpuint (r->len, ==, 5);
  p = trb_patterns_build ((const TrbRegion *) r->data, r->len, "L");
  g_assert_cmpuint (p->len, ==, G_N_ELEMENTS (expected));
  for (guint i = 0; i < p->len; i++)
    g_assert_cmpstr (g_array_index (p, TrbPattern, i).name, ==, expected[i]);
  g_assert_cmphex (g_array_index (p, TrbPattern, 0).mask, ==, 0x1f);
  g_assert_cmphex (g_array_index (p, TrbPattern, 8).mask, ==, 0x0a);
}

/* A continuous member of n equal spans of `span` each, live load w on all of it, E and I of
 * a W18X35 (29,000 ksi, 510 in^4: ENGINEERING.md §8 item 1), to be solved with or without
 * patterns. */
static TrbProject *
continuous_project (guint    n_spans,
                    double   span,
                    double   w,
                    gboolean patterns)
{
  TrbProject *project = trb_project_new ();
  TrbMember *m = trb_member_new ("C1");
  TrbMemberLoad load = { TRB_CASE_L, { TRB_LOAD_UNIFORM, 0, n_spans * span, w, w }, 0 };

  project->settings.live_patterns = patterns;
  m->length = n_spans * span;
  g_free (m->section);
  m->section = g_strdup ("custom");
  m->E = 29000 * TRB_KSI;
  m->I = 510 * pow (TRB_IN, 4);
  for (guint i = 0; i <= n_spans; i++)
    {
      TrbMemberSupport s = { { i * span, i == 0 ? TRB_SUPPORT_PIN : TRB_SUPPORT_ROLLER }, 0 };

      g_array_append_val (m->supports, s);
    }
  g_array_append_val (m->loads, load);
  trb_project_add_member (project, m);
  return project;
}

/* Two equal spans, uniform live load w (AISC Manual Table 3-23, cases 29 and 30, from
 * memory; checked here by statics). Both spans loaded: end reaction 3/8 wL, so the largest
 * positive moment is (3/8)^2 wL^2 / 2 = 9/128 wL^2 = 0.0703 wL^2 and the support moment
 * -1/8 wL^2. One span loaded: end reaction 7/16 wL, positive moment (7/16)^2 / 2 wL^2 =
 * 49/512 wL^2 = 0.0957 wL^2. The pattern envelope takes 0.0957 and -0.125. */
static void
test_two_span_patterns (void)
{
  const double L = 20 * TRB_FT;
  const double w = 1 * TRB_KLF;
  g_autoptr(TrbProject) with = continuous_project (2, L, w, TRUE);
  g_autoptr(TrbProject) without = continuous_project (2, L, w, FALSE);
  g_autoptr(TrbMemberResult) rp = trb_solve_member (with, g_ptr_array_index (with->members, 0));
  g_autoptr(TrbMemberResult) ra = trb_solve_member (without,
                                                    g_ptr_array_index (without->members, 0));

  g_assert_true (rp->analysed);
  g_assert_true (ra->analysed);

  assert_close (rp->strength.envelope.ext.M_max, 49.0 / 512.0 * w * L * L);
  assert_close (rp->strength.envelope.ext.M_min, -1.0 / 8.0 * w * L * L);
  /* the two spans mirror each other: either may give the extreme, by rounding */
  assert_one_of (rp->strength.envelope.M_max_by, "ASD 2: L (L on span 1)",
                 "ASD 2: L (L on span 2)");
  g_assert_cmpstr (rp->strength.envelope.M_min_by, ==, "ASD 2: L (L on all spans)");

  assert_close (ra->strength.envelope.ext.M_max, 9.0 / 128.0 * w * L * L);
  assert_close (ra->strength.envelope.ext.M_min, -1.0 / 8.0 * w * L * L);
  g_assert_cmpuint (ra->patterns->len, ==, 0);
  /* the middle reaction with both spans loaded is 10/8 wL (ENGINEERING.md §3, "interior
   * support of two equal spans = 1.25wL") */
  assert_close (g_array_index (rp->strength.envelope.reactions, TrbReactionRange, 1).force_max,
                1.25 * w * L);
}

/* Three equal spans, uniform live load w, by the three-moment equation (support moments
 * M_B, M_C with 4 M_B + M_C = -(wL^2/4)(k1 + k2) and M_B + 4 M_C = -(wL^2/4)(k2 + k3),
 * k = 1 for a loaded span; cf. the classical coefficients 0.101, 0.075, -0.117, from memory):
 * - spans 1 and 3 loaded: M_B = M_C = -wL^2/20, end reaction 0.45 wL, end-span moment
 *   0.45^2 / 2 wL^2 = 0.10125 wL^2, the largest positive moment;
 * - spans 1 and 2 loaded: M_C = -wL^2/30, M_B = -7/60 wL^2, the largest negative moment;
 * - all loaded: M_B = -wL^2/10, end reaction 0.4 wL, end-span moment 0.08 wL^2. */
static void
test_three_span_patterns (void)
{
  const double L = 20 * TRB_FT;
  const double w = 1 * TRB_KLF;
  g_autoptr(TrbProject) with = continuous_project (3, L, w, TRUE);
  g_autoptr(TrbProject) without = continuous_project (3, L, w, FALSE);
  g_autoptr(TrbMemberResult) rp = trb_solve_member (with, g_ptr_array_index (with->members, 0));
  g_autoptr(TrbMemberResult) ra = trb_solve_member (without,
                                                    g_ptr_array_index (without->members, 0));
  const TrbEnvelope *e = &rp->strength.envelope;

  g_assert_true (rp->analysed);
  assert_close (e->ext.M_max, 0.10125 * w * L * L);
  g_assert_cmpstr (e->M_max_by, ==, "ASD 2: L (L on spans 1+3)");
  assert_close (e->ext.M_min, -7.0 / 60.0 * w * L * L);
  assert_one_of (e->M_min_by, "ASD 2: L (L on spans 1+2)", "ASD 2: L (L on spans 2+3)");

  assert_close (ra->strength.envelope.ext.M_max, 0.08 * w * L * L);
  assert_close (ra->strength.envelope.ext.M_min, -0.1 * w * L * L);

  /* ASD 2 under each of the 1 + 3 + 2 + 1 patterns (all; each span; adjacent pairs; odd
   * spans, the even one being span 2 again); ASD 1, D, goes: there is no dead load */
  g_assert_cmpuint (rp->patterns->len, ==, 7);
  g_assert_cmpuint (rp->strength.entries->len, ==, 7);
  /* the live-load deflection set is patterned too */
  g_assert_cmpuint (rp->live.entries->len, ==, 7);
}

/* LRFD factors reach the results: a 20 ft simple span with 1 kip/ft dead and 1 kip/ft live
 * has M = wL^2/8 = 50 kip*ft per case (ENGINEERING.md §8 item 1), so 1.2D + 1.6L gives
 * 2.8 x 50 = 140 kip*ft and 1.4D gives 70 kip*ft; V = 2.8 x 10 = 28 kip. */
static void
test_lrfd_factors_applied (void)
{
  g_autoptr(TrbProject) p = continuous_project (1, 20 * TRB_FT, 1 * TRB_KLF, TRUE);
  TrbMember *m = g_ptr_array_index (p->members, 0);
  TrbMemberLoad dead = { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, m->length, TRB_KLF, TRB_KLF }, 0 };
  g_autoptr(TrbMemberResult) r = NULL;
  const TrbComboResult *c1, *c2;

  g_array_append_val (m->loads, dead);
  p->settings.method = TRB_METHOD_LRFD;
  r = trb_solve_member (p, m);

  g_assert_cmpuint (r->strength.entries->len, ==, 2);
  c1 = &g_array_index (r->strength.entries, TrbComboResult, 0);
  c2 = &g_array_index (r->strength.entries, TrbComboResult, 1);
  g_assert_cmpstr (c1->name, ==, "LRFD 1: 1.4D");
  g_assert_cmpstr (c2->name, ==, "LRFD 2: 1.2D + 1.6L");
  /* one span: a single region, so no patterns */
  g_assert_cmpstr (c2->pattern, ==, "");
  assert_close (c1->ext.M_max, 70 * TRB_KIP_FT);
  assert_close (c2->ext.M_max, 140 * TRB_KIP_FT);
  assert_close (r->strength.envelope.ext.V_max, 28 * TRB_KIP);
  g_assert_cmpstr (r->strength.envelope.M_max_by, ==, "LRFD 2: 1.2D + 1.6L");
}

/* An overhang: live load on the back span alone lifts the tip, live load on the overhang
 * alone gives the largest hogging. Back span a = 20 ft, overhang c = 5 ft, w = 1 kip/ft:
 * support moment -w c^2 / 2 = -12.5 kip*ft (statics). With the back span alone loaded the
 * tip rises by w a^3 c / (24 EI) (AISC Manual Table 3-23 case 24, from memory), which the
 * envelope's upward deflection must reach. */
static void
test_overhang_patterns (void)
{
  const double a = 20 * TRB_FT, c = 5 * TRB_FT, w = TRB_KLF;
  g_autoptr(TrbProject) p = continuous_project (1, a, w, TRUE);
  TrbMember *m = g_ptr_array_index (p->members, 0);
  TrbMemberLoad *l = &g_array_index (m->loads, TrbMemberLoad, 0);
  g_autoptr(TrbMemberResult) r = NULL;
  double EI;

  m->length = a + c;
  l->load.b = a + c;
  r = trb_solve_member (p, m);
  EI = m->E * m->I;

  g_assert_cmpuint (r->patterns->len, ==, 3);
  g_assert_cmpstr (g_array_index (r->patterns, TrbPattern, 2).name, ==, "L on right overhang");
  assert_close (r->strength.envelope.ext.M_min, -w * c * c / 2);
  assert_close (r->live.envelope.ext.defl_up, w * a * a * a * c / (24 * EI));
  g_assert_cmpstr (r->live.envelope.defl_up_by, ==, "Live: L (L on span 1)");
}

/* ---- the engine's helpers for many combinations (trb_beam_combiner_*, intervals) ----------
 *
 * Each must give bit for bit what the plain calls of trb-beam.h give, which are the check
 * values here: the same numbers computed the plain way (their own sources are the beam tests
 * and the reference checks). Beams and loads are drawn at random from a fixed seed, with
 * overhangs, fixed ends and every kind of load, so that breaks fall everywhere. */

/* every double the same bits: NaN or -0 would not compare equal with == */
static void
assert_same_doubles (const double *a,
                     const double *b,
                     guint         n)
{
  g_assert_cmpmem (a, n * sizeof (double), b, n * sizeof (double));
}

static void
assert_same_results (const TrbBeamResult *a,
                     const TrbBeamResult *b)
{
  const double *ba, *bb;
  const TrbReaction *ra, *rb;
  guint na, nb;

  ba = trb_beam_result_get_breaks (a, &na);
  bb = trb_beam_result_get_breaks (b, &nb);
  g_assert_cmpuint (na, ==, nb);
  assert_same_doubles (ba, bb, na);
  ra = trb_beam_result_get_reactions (a, &na);
  rb = trb_beam_result_get_reactions (b, &nb);
  g_assert_cmpuint (na, ==, nb);
  g_assert_cmpmem (ra, na * sizeof *ra, rb, nb * sizeof *rb);
  ba = trb_beam_result_get_breaks (a, &na);
  for (guint i = 0; i < na; i++)
    for (int side = TRB_SIDE_LEFT; side <= TRB_SIDE_RIGHT; side++)
      {
        TrbBeamValues va, vb;
        double x = i + 1 < na ? ba[i] + (ba[i + 1] - ba[i]) / 3 : ba[i];

        trb_beam_result_eval (a, ba[i], side, &va);
        trb_beam_result_eval (b, ba[i], side, &vb);
        g_assert_cmpmem (&va, sizeof va, &vb, sizeof vb);
        trb_beam_result_eval (a, x, side, &va);
        trb_beam_result_eval (b, x, side, &vb);
        g_assert_cmpmem (&va, sizeof va, &vb, sizeof vb);
      }
}

static TrbBeam *
random_beam (GRand  *rand,
             double *length)
{
  TrbSupport sup[6];
  guint n = g_rand_int_range (rand, 2, 6);
  double left = g_rand_boolean (rand) ? g_rand_double_range (rand, 0.5, 2) : 0;
  double x = left;

  for (guint i = 0; i < n; i++)
    {
      sup[i].x = x;
      sup[i].type = g_rand_int_range (rand, 0, 8) == 0 ? TRB_SUPPORT_FIXED : TRB_SUPPORT_PIN;
      x += g_rand_double_range (rand, 2, 9);
    }
  *length = sup[n - 1].x + (g_rand_boolean (rand) ? g_rand_double_range (rand, 0.5, 2) : 0);
  return trb_beam_new (*length, 200e9, g_rand_double_range (rand, 1e-5, 1e-3), sup, n, NULL);
}

static TrbBeamResult *
random_result (GRand   *rand,
               TrbBeam *beam,
               double   length)
{
  TrbLoad loads[6];
  guint n = g_rand_int_range (rand, 0, 6);

  for (guint i = 0; i < n; i++)
    {
      double a = g_rand_double_range (rand, 0, length);
      double b = g_rand_double_range (rand, a, length);

      loads[i].kind = g_rand_int_range (rand, 0, 4);
      loads[i].a = a;
      loads[i].b = b;
      loads[i].w1 = g_rand_double_range (rand, -5e3, 2e4);
      loads[i].w2 = g_rand_double_range (rand, -5e3, 2e4);
    }
  return trb_beam_solve (beam, loads, n, NULL);
}

static void
test_combiner (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261202);

  for (guint trial = 0; trial < 200; trial++)
    {
      double length;
      g_autoptr(TrbBeam) beam = random_beam (rand, &length);
      TrbBeamResult *parts[8];
      guint n_parts = g_rand_int_range (rand, 1, 9);
      g_autoptr(TrbBeamCombiner) combiner = NULL;

      g_assert_nonnull (beam);
      for (guint i = 0; i < n_parts; i++)
        parts[i] = random_result (rand, beam, length);
      combiner = trb_beam_combiner_new (parts, n_parts);
      for (guint k = 0; k < 10; k++)
        {
          guint index[6];
          TrbBeamResult *chosen[6];
          double factors[6];
          guint n = g_rand_int_range (rand, 1, 7);
          g_autoptr(TrbBeamResult) plain = NULL;
          g_autoptr(TrbBeamResult) fast = NULL;

          for (guint i = 0; i < n; i++)
            {
              index[i] = g_rand_int_range (rand, 0, n_parts);
              chosen[i] = parts[index[i]];
              /* zero factors too: they add nothing, not even breaks */
              factors[i] = g_rand_int_range (rand, 0, 4) == 0 ? 0
                                                              : g_rand_double_range (rand, -2, 2);
            }
          plain = trb_beam_result_combine (chosen, factors, n);
          fast = trb_beam_combiner_combine (combiner, index, factors, n);
          assert_same_results (fast, plain);
        }
      for (guint i = 0; i < n_parts; i++)
        trb_beam_result_free (parts[i]);
    }
}

static void
test_extremes_intervals (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261203);

  for (guint trial = 0; trial < 300; trial++)
    {
      double length;
      g_autoptr(TrbBeam) beam = random_beam (rand, &length);
      g_autoptr(TrbBeamResult) r = NULL;
      const double *breaks;
      double cuts[12], ab[12];
      TrbBeamExtremes whole, plain, per[6];
      guint n_breaks, n_cuts = 0, n_iv = 0;
      gboolean finite;

      g_assert_nonnull (beam);
      r = random_result (rand, beam, length);
      breaks = trb_beam_result_get_breaks (r, &n_breaks);
      /* cuts at breaks (the spans of the deflection checks) and between them (braces) */
      for (guint i = 0; i < 10; i++)
        cuts[n_cuts++] = g_rand_boolean (rand) ? breaks[g_rand_int_range (rand, 0, n_breaks)]
                                               : g_rand_double_range (rand, 0, length);
      for (guint i = 1; i < n_cuts; i++)
        for (guint j = i; j > 0 && cuts[j - 1] > cuts[j]; j--)
          {
            double t = cuts[j];

            cuts[j] = cuts[j - 1];
            cuts[j - 1] = t;
          }
      /* intervals between some consecutive cuts, leaving gaps now and then */
      for (guint i = 0; i + 1 < n_cuts && n_iv < G_N_ELEMENTS (per); i++)
        if (cuts[i] < cuts[i + 1] && g_rand_int_range (rand, 0, 4) != 0)
          {
            ab[2 * n_iv] = cuts[i];
            ab[2 * n_iv + 1] = cuts[i + 1];
            n_iv++;
          }

      trb_beam_result_extremes_intervals (r, ab, n_iv, &whole, per, &finite);
      trb_beam_result_extremes (r, 0, length, &plain);
      g_assert_cmpmem (&whole, sizeof whole, &plain, sizeof plain);
      for (guint i = 0; i < n_iv; i++)
        {
          trb_beam_result_extremes (r, ab[2 * i], ab[2 * i + 1], &plain);
          g_assert_cmpmem (&per[i], sizeof per[i], &plain, sizeof plain);
        }
      g_assert_true (finite);
    }
}

/* trb_beam_result_restiffen() gives what solving the same loads on a beam of another E I
 * gives, bit for bit. */
static void
test_restiffen (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261206);

  for (guint trial = 0; trial < 200; trial++)
    {
      TrbSupport sup[6];
      TrbLoad loads[6];
      guint n = g_rand_int_range (rand, 2, 6), n_loads = g_rand_int_range (rand, 0, 6);
      double x = g_rand_boolean (rand) ? g_rand_double_range (rand, 0.5, 2) : 0, length;
      g_autoptr(TrbBeam) a = NULL;
      g_autoptr(TrbBeam) b = NULL;
      g_autoptr(TrbBeamResult) ra = NULL;
      g_autoptr(TrbBeamResult) rb = NULL;
      g_autoptr(TrbBeamResult) again = NULL;

      for (guint i = 0; i < n; i++)
        {
          sup[i].x = x;
          sup[i].type = g_rand_int_range (rand, 0, 6) == 0 ? TRB_SUPPORT_FIXED : TRB_SUPPORT_PIN;
          x += g_rand_double_range (rand, 2, 9);
        }
      length = sup[n - 1].x + (g_rand_boolean (rand) ? g_rand_double_range (rand, 0.5, 2) : 0);
      for (guint i = 0; i < n_loads; i++)
        {
          double p = g_rand_double_range (rand, 0, length);

          loads[i].kind = g_rand_int_range (rand, 0, 4);
          loads[i].a = p;
          loads[i].b = g_rand_double_range (rand, p, length);
          loads[i].w1 = g_rand_double_range (rand, -5e3, 2e4);
          loads[i].w2 = g_rand_double_range (rand, -5e3, 2e4);
        }
      a = trb_beam_new (length, 200e9, g_rand_double_range (rand, 1e-5, 1e-3), sup, n, NULL);
      b = trb_beam_new (length, g_rand_double_range (rand, 8e9, 2e11),
                        g_rand_double_range (rand, 1e-5, 1e-3), sup, n, NULL);
      g_assert_nonnull (a);
      g_assert_nonnull (b);
      ra = trb_beam_solve (a, loads, n_loads, NULL);
      rb = trb_beam_solve (b, loads, n_loads, NULL);
      again = trb_beam_result_restiffen (ra, b);
      g_assert_nonnull (again);
      assert_same_results (again, rb);
    }
}

/* trb_beam_result_extremes_intervals() says a result is finite exactly when its reactions
 * and the values on both sides of each break are: loads near the largest double overflow
 * some of them (the shear, or only the deflection through a small E I). */
static void
test_finite (void)
{
  static const double scales[] = { 1, 1e290, 1e300, 1e305, 1e307, 1e308 };
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261204);
  guint n_finite = 0, n_not = 0;

  for (guint trial = 0; trial < 120; trial++)
    {
      TrbSupport sup[2] = { { 1, TRB_SUPPORT_PIN }, { 7, TRB_SUPPORT_ROLLER } };
      double EI_scale = g_rand_boolean (rand) ? 1 : 1e-200;
      g_autoptr(TrbBeam) beam = trb_beam_new (9, 200e9, 1e-4 * EI_scale, sup, 2, NULL);
      double scale = scales[trial % G_N_ELEMENTS (scales)];
      TrbLoad loads[2] = {
        { TRB_LOAD_UNIFORM, 0, g_rand_double_range (rand, 2, 9), scale, scale },
        { TRB_LOAD_POINT, g_rand_double_range (rand, 0, 9), 0, scale, 0 },
      };
      g_autoptr(TrbBeamResult) r = trb_beam_solve (beam, loads, 2, NULL);
      const TrbReaction *re;
      const double *breaks;
      gboolean expected = TRUE, finite;
      guint n;

      g_assert_nonnull (r);
      re = trb_beam_result_get_reactions (r, &n);
      for (guint i = 0; i < n; i++)
        if (!isfinite (re[i].force) || !isfinite (re[i].moment))
          expected = FALSE;
      breaks = trb_beam_result_get_breaks (r, &n);
      for (guint i = 0; i < n; i++)
        for (int side = TRB_SIDE_LEFT; side <= TRB_SIDE_RIGHT; side++)
          {
            TrbBeamValues v;

            trb_beam_result_eval (r, breaks[i], side, &v);
            if (!isfinite (v.V) || !isfinite (v.M) || !isfinite (v.theta) || !isfinite (v.defl))
              expected = FALSE;
          }
      trb_beam_result_extremes_intervals (r, NULL, 0, NULL, NULL, &finite);
      g_assert_cmpint (finite, ==, expected);
      if (expected)
        n_finite++;
      else
        n_not++;
    }
  /* both answers were asked for */
  g_assert_cmpuint (n_finite, >, 0);
  g_assert_cmpuint (n_not, >, 0);
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/combos/engine/combiner", test_combiner);
  g_test_add_func ("/trb/combos/engine/intervals", test_extremes_intervals);
  g_test_add_func ("/trb/combos/engine/finite", test_finite);
  g_test_add_func ("/trb/combos/engine/restiffen", test_restiffen);
  g_test_add_func ("/trb/combos/case-names", test_case_names);
  g_test_add_func ("/trb/combos/lrfd/all-cases", test_lrfd_all_cases);
  g_test_add_func ("/trb/combos/lrfd/dead-live", test_lrfd_dead_live);
  g_test_add_func ("/trb/combos/lrfd/roof", test_lrfd_roof);
  g_test_add_func ("/trb/combos/lrfd/factors-applied", test_lrfd_factors_applied);
  g_test_add_func ("/trb/combos/asd/all-cases", test_asd_all_cases);
  g_test_add_func ("/trb/combos/asd/dead-live", test_asd_dead_live);
  g_test_add_func ("/trb/combos/service-and-deflection", test_service_and_deflection_sets);
  g_test_add_func ("/trb/combos/regions", test_regions);
  g_test_add_func ("/trb/combos/split", test_split);
  g_test_add_func ("/trb/combos/patterns/names", test_pattern_names);
  g_test_add_func ("/trb/combos/patterns/two-span", test_two_span_patterns);
  g_test_add_func ("/trb/combos/patterns/three-span", test_three_span_patterns);
  g_test_add_func ("/trb/combos/patterns/overhang", test_overhang_patterns);

  return g_test_run ();
}
