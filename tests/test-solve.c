/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-error.h"
#include "trb-project-io.h"
#include "trb-solve.h"
#include "trb-units.h"

#include "bench/floor-gen.h"

static TrbProject *
load (const char *xml)
{
  g_autoptr(GError) error = NULL;
  TrbProject *project = trb_project_load_data (xml, strlen (xml), "test.trabeate", &error);

  g_assert_no_error (error);
  g_assert_nonnull (project);
  return project;
}

/* Solves a copy of the project's first beam with its section attribute replaced. */
static TrbMemberResult *
solve_as (const char *xml_template,
          const char *section)
{
  g_autofree char *xml = g_strdup_printf (xml_template, section);
  g_autoptr(TrbProject) project = load (xml);
  TrbMemberResult *r = trb_solve_member (project, g_ptr_array_index (project->members, 0));
  /* the result points into the project: keep only what the callers read */
  TrbMemberResult *copy = g_new0 (TrbMemberResult, 1);

  copy->status = r->status;
  copy->ratio = r->ratio;
  g_strlcpy (copy->section, r->section, sizeof copy->section);
  trb_member_result_free (r);
  return copy;
}

/* A steel floor beam of our own (a demo scenario, not a check value): 28 ft simple span,
 * braced at mid-span, D 0.6 and L 1.0 kip/ft, ASD. */
static const char *steel_beam =
  "<trabeate-project format=\"1\"><settings method=\"asd\"/>"
  "<beam id=\"B1\" length=\"28 ft\" material=\"steel\" section=\"%s\" bracing=\"supports\">"
  "<support at=\"0 ft\" type=\"pin\"/><support at=\"28 ft\" type=\"roller\"/>"
  "<brace at=\"14 ft\"/>"
  "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"28 ft\" w=\"0.6 kip/ft\"/>"
  "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"28 ft\" w=\"1.0 kip/ft\"/>"
  "</beam></trabeate-project>";

/* Auto-sizing against brute force: every W shape of the catalog checked one by one; the
 * lightest that passes (ties by depth) must be the one chosen, the shortlist must be sorted
 * by weight, and each entry must pass when checked on its own with the same ratio. */
static void
test_auto_brute_force (void)
{
  g_autofree char *xml = g_strdup_printf (steel_beam, "auto");
  g_autoptr(TrbProject) project = load (xml);
  g_autoptr(TrbMemberResult) r = NULL;
  const TrbSection *w;
  const TrbSection *lightest = NULL;
  guint n, n_pass = 0;

  r = trb_solve_member_full (project, g_ptr_array_index (project->members, 0), G_MAXUINT);
  g_assert_cmpint (r->status, ==, TRB_STATUS_PASS);

  w = trb_catalog_get_family (trb_catalog_get_default (), TRB_FAMILY_W, &n);
  g_assert_cmpuint (n, ==, 289);
  for (guint i = 0; i < n; i++)
    {
      g_autoptr(TrbMemberResult) one = solve_as (steel_beam, w[i].designation);

      g_assert_cmpint (one->status == TRB_STATUS_PASS || one->status == TRB_STATUS_FAIL, ==,
                       TRUE);
      if (one->status != TRB_STATUS_PASS)
        continue;
      n_pass++;
      if (lightest == NULL || w[i].weight < lightest->weight ||
          (w[i].weight == lightest->weight && w[i].d < lightest->d))
        lightest = &w[i];
    }
  g_assert_nonnull (lightest);
  g_assert_cmpstr (r->section, ==, lightest->designation);
  g_assert_cmpuint (r->shortlist->len, ==, n_pass);

  for (guint i = 0; i < r->shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, i);
      g_autoptr(TrbMemberResult) one = solve_as (steel_beam, e->section);

      if (i > 0)
        g_assert_cmpfloat (e->weight, >=,
                           g_array_index (r->shortlist, TrbShortlistEntry, i - 1).weight);
      g_assert_cmpint (one->status, ==, TRB_STATUS_PASS);
      g_assert_cmpfloat (e->ratio, <=, 1.0);
      g_assert_cmpfloat_with_epsilon (e->ratio, one->ratio, 1e-12);
    }
  g_assert_cmpstr (g_array_index (r->shortlist, TrbShortlistEntry, 0).section, ==, r->section);
}

/* AISC Design Examples v15.0 (companion to the 15th ed. Manual), Example F.1-1A (from memory):
 * a 35 ft simple span, continuously braced, wD = 0.45 and wL = 0.75 kip/ft, LRFD, live
 * deflection limited to L/360; the example selects W18X50 among the W18 shapes. Here the
 * W18 group is chosen with the depth limits (every W18 is 17.7 to 18.7 in deep) and the
 * sizing must choose W18X50: W18X46 (Ix 712 in^4) deflects
 * 5 (0.75/12) 420^4 / (384 x 29000 x 712) = 1.23 in > 420/360 = 1.17 in, and W18X40 and
 * W18X35 less stiff still; W18X50 (Ix 800) gives 1.09 in. */
static void
test_design_example_f11a (void)
{
  g_autoptr(TrbProject) project = load (
    "<trabeate-project format=\"1\"><settings method=\"lrfd\" self-weight=\"exclude\"/>"
    "<beam id=\"F11A\" length=\"35 ft\" material=\"steel\" section=\"auto\""
    " min-depth=\"17.5 in\" max-depth=\"18.8 in\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"35 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"35 ft\" w=\"0.45 kip/ft\"/>"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"35 ft\" w=\"0.75 kip/ft\"/>"
    "</beam></trabeate-project>");
  g_autoptr(TrbMemberResult) r =
    trb_solve_member (project, g_ptr_array_index (project->members, 0));
  const TrbCheck *flexure = NULL;

  g_assert_cmpint (r->status, ==, TRB_STATUS_PASS);
  g_assert_cmpstr (r->section, ==, "W18X50");
  for (guint i = 0; i < r->checks->len; i++)
    if (strcmp (g_array_index (r->checks, TrbCheck, i).name, "Flexure") == 0)
      flexure = &g_array_index (r->checks, TrbCheck, i);
  g_assert_nonnull (flexure);
  /* Mu = (1.2 x 0.45 + 1.6 x 0.75) 35^2 / 8 = 266 kip-ft; phi Mn = phi Mp = 379 kip-ft
   * (Example F.1-1A and Manual Table 3-2, from memory). */
  g_assert_cmpfloat_with_epsilon (flexure->demand / TRB_KIP_FT, 266.4375, 1e-6);
  g_assert_cmpfloat_with_epsilon (flexure->capacity / TRB_KIP_FT, 378.75, 0.01);
}

/* The project's own sections join the catalog. A welded girder of our own, 24 x 6 in with
 * 0.3 in flanges and a 0.27 in web (h/tw = 23.4/0.27 = 86.7, a compact web), weighs
 * 34 lb/ft and has Ix = 2 (6 x 0.3) 11.85^2 + 0.27 x 23.4^3 / 12 = 794 in^4 (properties
 * computed from its dimensions, docs/catalog.md). On a 40 ft span with L = 0.5 kip/ft the
 * live deflection limit L/360 needs I >= 5 (0.5/12) 480^4 / (384 x 29000 x 480/360) = 745 in^4
 * (AISC Manual Table 3-23 case 1, from memory): no W shape of 34 lb/ft or less has that
 * (W16X31 375, W14X34 340 in^4; W18X35 is 35 lb/ft), so the welded girder is the lightest. */
static void
test_project_sections (void)
{
  g_autoptr(TrbProject) project = load (
    "<trabeate-project format=\"1\"><settings method=\"asd\"/>"
    "<sections>\n"
    "designation,W_lb_ft,d_in,bf_in,tw_in,tf_in\n"
    "WG24X34,34,24,6,0.27,0.3\n"
    "</sections>"
    "<beam id=\"B1\" length=\"40 ft\" material=\"steel\" section=\"auto\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"40 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"40 ft\" w=\"0.2 kip/ft\"/>"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"40 ft\" w=\"0.5 kip/ft\"/>"
    "</beam>"
    "<beam id=\"B2\" length=\"20 ft\" material=\"steel\" section=\"WG24X34\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"20 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"20 ft\" w=\"0.2 kip/ft\"/>"
    "</beam></trabeate-project>");
  TrbSolveOptions options;
  g_autoptr(TrbProjectResult) pr = NULL;
  const TrbMemberResult *b1, *b2;

  trb_solve_options_init (&options);
  options.shortlist_max = TRB_SHORTLIST_DEFAULT;
  pr = trb_solve_project_full (project, &options);
  b1 = g_ptr_array_index (pr->members, 0);
  b2 = g_ptr_array_index (pr->members, 1);

  g_assert_nonnull (project->sections);
  g_assert_cmpint (b1->status, ==, TRB_STATUS_PASS);
  g_assert_cmpstr (b1->section, ==, "WG24X34");
  g_assert_cmpstr (g_array_index (b1->shortlist, TrbShortlistEntry, 0).section, ==, "WG24X34");
  g_assert_cmpstr (b2->section, ==, "WG24X34");
  g_assert_cmpint (b2->status, ==, TRB_STATUS_PASS);
  g_assert_cmpfloat_with_epsilon (b2->self_weight, 34 * TRB_PLF, 1e-9);
}

/* A sections file must sit in the project's own folder: no path may lead elsewhere. */
static void
test_sections_file_outside (void)
{
  static const char *xml =
    "<trabeate-project format=\"1\">\n<sections file=\"../secret.csv\"/>\n</trabeate-project>";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = trb_project_load_data (xml, strlen (xml), "p.trabeate",
                                                         &error);

  g_assert_null (project);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "p.trabeate:2:"));
  g_assert_nonnull (strstr (error->message, "project's own folder"));
}

/* When nothing passes, the member fails and names the closest section. */
static void
test_nothing_passes (void)
{
  g_autoptr(TrbProject) project = load (
    "<trabeate-project format=\"1\">"
    "<beam id=\"B1\" length=\"20 ft\" material=\"steel\" section=\"auto\""
    " allowed=\"W8X10 W10X12 W12X14\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"20 ft\" type=\"roller\"/>"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"20 ft\" w=\"3 kip/ft\"/>"
    "</beam></trabeate-project>");
  g_autoptr(TrbMemberResult) r =
    trb_solve_member (project, g_ptr_array_index (project->members, 0));

  g_assert_cmpint (r->status, ==, TRB_STATUS_FAIL);
  g_assert_cmpuint (r->shortlist->len, ==, 0);
  /* the stiffest and strongest of the three is the closest */
  g_assert_cmpstr (r->section, ==, "W12X14");
  g_assert_nonnull (strstr (r->message, "closest is W12X14"));
  g_assert_cmpfloat (r->ratio, >, 1.0);
}

/* A mechanism is the same whatever the section: reported once as unstable. */
static void
test_auto_unstable (void)
{
  g_autoptr(TrbProject) project = load (
    "<trabeate-project format=\"1\">"
    "<beam id=\"B1\" length=\"20 ft\" material=\"steel\" section=\"auto\">"
    "<support at=\"5 ft\" type=\"pin\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"20 ft\" w=\"0.2 kip/ft\"/>"
    "</beam></trabeate-project>");
  g_autoptr(TrbMemberResult) r =
    trb_solve_member (project, g_ptr_array_index (project->members, 0));

  g_assert_cmpint (r->status, ==, TRB_STATUS_UNSTABLE);
  g_assert_true (isnan (r->ratio));
  g_assert_cmpuint (r->shortlist->len, ==, 0);
}

/* The chosen section's own weight is the self-weight in D (the sizing carries each
 * candidate's weight, so nothing is left to iterate); W shapes weigh their name in lb/ft
 * (AISC Shapes Database v16.0). */
static void
test_self_weight_of_chosen (void)
{
  g_autofree char *xml = g_strdup_printf (steel_beam, "auto");
  g_autoptr(TrbProject) project = load (xml);
  g_autoptr(TrbMemberResult) r =
    trb_solve_member (project, g_ptr_array_index (project->members, 0));
  const TrbSection *s = trb_catalog_lookup (trb_catalog_get_default (), r->section);

  g_assert_nonnull (s);
  g_assert_cmpfloat_with_epsilon (r->self_weight, s->weight, 1e-12);
  g_assert_cmpfloat (r->self_weight, >, 0);
}

/* ---- sizing's shortcuts against sizing without them -------------------------------------
 *
 * Sizing judges most candidates from bounds and analyses the others with only the
 * combinations that can govern (trb-sizing.c, "sizing: bounds and the lean evaluation of
 * candidates"). Without the shortcuts every candidate is analysed in full. The check values
 * are sizing's own results without the shortcuts: with them every number must be the same,
 * bit for bit, every shortlist (of every passing section) too. The members are drawn at
 * random from a fixed seed (spans, overhangs, fixed ends, loads of every kind and case,
 * bracing, methods, steel and timber, depth limits, named sections): made-up members, not
 * designs. */

static void
digest_check (GByteArray     *d,
              const TrbCheck *ck)
{
  g_byte_array_append (d, (const guint8 *) ck->name, strlen (ck->name) + 1);
  g_byte_array_append (d, (const guint8 *) ck->clause, strlen (ck->clause) + 1);
  g_byte_array_append (d, (const guint8 *) &ck->demand, sizeof ck->demand);
  g_byte_array_append (d, (const guint8 *) &ck->capacity, sizeof ck->capacity);
  g_byte_array_append (d, (const guint8 *) &ck->ratio, sizeof ck->ratio);
  g_byte_array_append (d, (const guint8 *) ck->combination, strlen (ck->combination) + 1);
  g_byte_array_append (d, (const guint8 *) &ck->x, sizeof ck->x);
  g_byte_array_append (d, (const guint8 *) ck->detail, strlen (ck->detail) + 1);
}

static GBytes *
sizing_digest (const TrbProject *project,
               gboolean          shortcuts)
{
  TrbSolveOptions options;
  g_autoptr(TrbProjectResult) pr = NULL;
  GByteArray *d = g_byte_array_new ();

  trb_solve_options_init (&options);
  options.shortlist_max = G_MAXUINT;
  options.cache = options.bounds = shortcuts;
  pr = trb_solve_project_full (project, &options);
  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);
      const TrbComboSetResult *sets[] = { &r->strength, &r->live, &r->total };

      trb_member_result_complete (r);

      g_byte_array_append (d, (const guint8 *) &r->status, sizeof r->status);
      g_byte_array_append (d, (const guint8 *) r->section, strlen (r->section) + 1);
      g_byte_array_append (d, (const guint8 *) &r->ratio, sizeof r->ratio);
      g_byte_array_append (d, (const guint8 *) r->governing, strlen (r->governing) + 1);
      if (r->message != NULL)
        g_byte_array_append (d, (const guint8 *) r->message, strlen (r->message) + 1);
      for (guint k = 0; k < r->checks->len; k++)
        digest_check (d, &g_array_index (r->checks, TrbCheck, k));
      for (guint k = 0; k < r->shortlist->len; k++)
        {
          const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, k);

          g_byte_array_append (d, (const guint8 *) e->section, strlen (e->section) + 1);
          g_byte_array_append (d, (const guint8 *) &e->weight, sizeof e->weight);
          g_byte_array_append (d, (const guint8 *) &e->ratio, sizeof e->ratio);
          g_byte_array_append (d, (const guint8 *) e->governing, strlen (e->governing) + 1);
        }
      for (guint s = 0; s < G_N_ELEMENTS (sets); s++)
        for (guint k = 0; sets[s]->entries != NULL && k < sets[s]->entries->len; k++)
          {
            const TrbComboResult *c = &g_array_index (sets[s]->entries, TrbComboResult, k);

            g_byte_array_append (d, (const guint8 *) &c->ext, sizeof c->ext);
          }
    }
  return g_byte_array_free_to_bytes (d);
}

static void
append_random_member (GString *xml,
                      GRand   *rand,
                      guint    i)
{
  static const char *const cases[] = { "D", "L", "Lr", "S" };
  int material = g_rand_int_range (rand, 0, 4);   /* steel, steel, sawn, glulam */
  int n_spans = g_rand_int_range (rand, 1, 4);
  double left = g_rand_int_range (rand, 0, 3) == 0 ? g_rand_double_range (rand, 2, 6) : 0;
  double right = g_rand_int_range (rand, 0, 3) == 0 ? g_rand_double_range (rand, 2, 6) : 0;
  double x = left, length;
  double spans[4];
  int n_loads = g_rand_int_range (rand, 2, 8);
  double scale = material >= 2 ? 0.1 : 1.0;

  for (int s = 0; s < n_spans; s++)
    spans[s] = g_rand_double_range (rand, material == 2 ? 6 : 10, material == 2 ? 16 : 30);
  length = left + right;
  for (int s = 0; s < n_spans; s++)
    length += spans[s];

  g_string_append_printf (xml, "<beam id=\"M%u\" length=\"%.4f ft\" section=\"%s\"", i, length,
                          g_rand_int_range (rand, 0, 8) == 0 && material < 2 ? "W14X30"
                          : "auto");
  if (material < 2)
    g_string_append_printf (xml, " material=\"steel\" method=\"%s\"",
                            g_rand_boolean (rand) ? "asd" : "lrfd");
  else if (material == 2)
    g_string_append (xml, " material=\"wood\" species=\"Douglas Fir-Larch\" grade=\"No.2\" "
                     "max-plies=\"2\"");
  else
    g_string_append (xml, " material=\"wood\" species=\"Douglas Fir (glulam)\" "
                     "grade=\"24F-V4 DF/DF\"");
  if (g_rand_int_range (rand, 0, 3) == 0)
    g_string_append (xml, " bracing=\"supports\"");
  if (material < 2 && g_rand_int_range (rand, 0, 4) == 0)
    g_string_append (xml, " min-depth=\"12 in\" max-depth=\"18.5 in\"");
  g_string_append (xml, ">");
  g_string_append_printf (xml, "<support at=\"%.4f ft\" type=\"%s\"/>", x,
                          left == 0 && g_rand_int_range (rand, 0, 5) == 0 ? "fixed" : "pin");
  for (int s = 0; s < n_spans; s++)
    {
      x += spans[s];
      g_string_append_printf (xml, "<support at=\"%.4f ft\" type=\"roller\"/>", x);
    }
  if (g_rand_int_range (rand, 0, 3) == 0)
    g_string_append_printf (xml, "<brace at=\"%.4f ft\"/>", g_rand_double_range (rand, 0, length));
  for (int k = 0; k < n_loads; k++)
    {
      const char *c = cases[k < 2 ? k : g_rand_int_range (rand, 0, 4)];
      double a = g_rand_double_range (rand, 0, length);
      double b = g_rand_double_range (rand, a, length);

      switch (g_rand_int_range (rand, 0, 5))
        {
        case 0:
          g_string_append_printf (xml, "<load case=\"%s\" type=\"point\" at=\"%.4f ft\" "
                                  "p=\"%.3f kip\"/>", c, a,
                                  scale * g_rand_double_range (rand, 1, 10));
          break;
        case 1:
          g_string_append_printf (xml, "<load case=\"%s\" type=\"moment\" at=\"%.4f ft\" "
                                  "m=\"%.3f kip*ft\"/>", c, a,
                                  scale * g_rand_double_range (rand, -10, 10));
          break;
        case 2:
          g_string_append_printf (xml, "<load case=\"%s\" type=\"linear\" from=\"%.4f ft\" "
                                  "to=\"%.4f ft\" w1=\"%.3f kip/ft\" w2=\"%.3f kip/ft\"/>", c,
                                  a, b, scale * g_rand_double_range (rand, 0, 1),
                                  scale * g_rand_double_range (rand, 0, 1));
          break;
        default:
          g_string_append_printf (xml, "<load case=\"%s\" type=\"uniform\" from=\"%.4f ft\" "
                                  "to=\"%.4f ft\" w=\"%.3f kip/ft\"/>", c,
                                  k < 2 ? 0.0 : a, k < 2 ? length : b,
                                  scale * g_rand_double_range (rand, 0.1, 1.2));
          break;
        }
    }
  g_string_append (xml, "</beam>");
}

static void
test_auto_shortcuts (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261205);
  g_autoptr(GString) xml = g_string_new ("<trabeate-project format=\"1\">");
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(GBytes) with = NULL;
  g_autoptr(GBytes) without = NULL;

  for (guint i = 0; i < 60; i++)
    append_random_member (xml, rand, i);
  g_string_append (xml, "</trabeate-project>");
  project = load (xml->str);
  with = sizing_digest (project, TRUE);
  without = sizing_digest (project, FALSE);
  g_assert_cmpmem (g_bytes_get_data (with, NULL), g_bytes_get_size (with),
                   g_bytes_get_data (without, NULL), g_bytes_get_size (without));
}

/* Steel members of dead and floor live load alone, where sizing first guesses the section it
 * will choose and analyses that one first (trb-sizing.c, "a guess at the section chosen"): the
 * same results, bit for bit, as sizing without any shortcut, whether the guess is right, too
 * light or too heavy; bracing at the supports and continuous, braces, overhangs, LRFD and ASD.
 * Made-up members, not designs. */
static void
test_auto_guess (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261203);
  g_autoptr(GString) xml = g_string_new ("<trabeate-project format=\"1\">");
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(GBytes) with = NULL;
  g_autoptr(GBytes) without = NULL;

  for (guint i = 0; i < 40; i++)
    {
      int n_spans = g_rand_int_range (rand, 1, 4);
      double left = g_rand_int_range (rand, 0, 4) == 0 ? g_rand_double_range (rand, 2, 6) : 0;
      double x = left, length = left;
      double spans[3];

      for (int k = 0; k < n_spans; k++)
        length += spans[k] = g_rand_double_range (rand, 10, 30);
      g_string_append_printf (xml, "<beam id=\"G%u\" length=\"%.4f ft\" material=\"steel\" "
                              "section=\"auto\" method=\"%s\"%s>", i, length,
                              g_rand_boolean (rand) ? "asd" : "lrfd",
                              g_rand_int_range (rand, 0, 3) == 0 ? " bracing=\"supports\"" : "");
      g_string_append_printf (xml, "<support at=\"%.4f ft\" type=\"pin\"/>", x);
      for (int k = 0; k < n_spans; k++)
        {
          x += spans[k];
          g_string_append_printf (xml, "<support at=\"%.4f ft\" type=\"roller\"/>", x);
        }
      if (g_rand_int_range (rand, 0, 3) == 0)
        g_string_append_printf (xml, "<brace at=\"%.4f ft\"/>",
                                g_rand_double_range (rand, 0, length));
      g_string_append_printf (xml, "<load case=\"D\" type=\"uniform\" from=\"0 ft\" "
                              "to=\"%.4f ft\" w=\"%.3f kip/ft\"/>", length,
                              g_rand_double_range (rand, 0.2, 0.8));
      g_string_append_printf (xml, "<load case=\"L\" type=\"uniform\" from=\"0 ft\" "
                              "to=\"%.4f ft\" w=\"%.3f kip/ft\"/>", length,
                              g_rand_double_range (rand, 0.3, 1.2));
      for (int k = 0; k < 4; k++)
        g_string_append_printf (xml, "<load case=\"%s\" type=\"point\" at=\"%.4f ft\" "
                                "p=\"%.3f kip\"/>", k % 2 ? "L" : "D",
                                g_rand_double_range (rand, 0, length),
                                g_rand_double_range (rand, 1, 8));
      g_string_append (xml, "</beam>");
    }
  g_string_append (xml, "</trabeate-project>");
  project = load (xml->str);
  with = sizing_digest (project, TRUE);
  without = sizing_digest (project, FALSE);
  g_assert_cmpmem (g_bytes_get_data (with, NULL), g_bytes_get_size (with),
                   g_bytes_get_data (without, NULL), g_bytes_get_size (without));
}

/* ---- the shortlist on demand -------------------------------------------------------------
 *
 * The default solve makes no shortlist; trb_solve_member_shortlist() makes one member's from
 * that solve's result. The check values are the shortlists a solve asked for them made (the
 * path every solve took before), for lists of 1, 10 and every passing section: the entries
 * on demand must be the same, bit for bit, and the default solve's results the same but for
 * the shortlist. The members: the random ones above (standalone: catalog and "auto", steel
 * and timber), the examples (a floor among them) and a generated floor (tests/bench/
 * floor-gen.h: timber joists at their real spacing, steel girders under what comes down). */

static void
digest_shortlist (GByteArray   *d,
                  const GArray *list)
{
  guint n = list->len;

  g_byte_array_append (d, (const guint8 *) &n, sizeof n);
  for (guint k = 0; k < list->len; k++)
    {
      const TrbShortlistEntry *e = &g_array_index (list, TrbShortlistEntry, k);

      g_byte_array_append (d, (const guint8 *) e->section, strlen (e->section) + 1);
      g_byte_array_append (d, (const guint8 *) &e->weight, sizeof e->weight);
      g_byte_array_append (d, (const guint8 *) &e->ratio, sizeof e->ratio);
      g_byte_array_append (d, (const guint8 *) e->governing, strlen (e->governing) + 1);
    }
}

/* every result's own numbers and texts, but its shortlist */
static void
digest_result (GByteArray            *d,
               const TrbMemberResult *r)
{
  const TrbComboSetResult *sets[] = { &r->strength, &r->live, &r->total };

  trb_member_result_complete (r);

  g_byte_array_append (d, (const guint8 *) &r->status, sizeof r->status);
  g_byte_array_append (d, (const guint8 *) r->section, strlen (r->section) + 1);
  g_byte_array_append (d, (const guint8 *) &r->ratio, sizeof r->ratio);
  g_byte_array_append (d, (const guint8 *) r->governing, strlen (r->governing) + 1);
  g_byte_array_append (d, (const guint8 *) &r->self_weight, sizeof r->self_weight);
  if (r->message != NULL)
    g_byte_array_append (d, (const guint8 *) r->message, strlen (r->message) + 1);
  for (guint k = 0; k < r->checks->len; k++)
    digest_check (d, &g_array_index (r->checks, TrbCheck, k));
  for (guint s = 0; s < G_N_ELEMENTS (sets); s++)
    for (guint k = 0; sets[s]->entries != NULL && k < sets[s]->entries->len; k++)
      {
        const TrbComboResult *c = &g_array_index (sets[s]->entries, TrbComboResult, k);

        g_byte_array_append (d, (const guint8 *) c->name, strlen (c->name) + 1);
        g_byte_array_append (d, (const guint8 *) &c->ext, sizeof c->ext);
      }
}

static void
assert_same_bytes (GByteArray *a,
                   GByteArray *b)
{
  g_assert_cmpmem (a->data, a->len, b->data, b->len);
}

static guint
check_shortlist_on_demand (const TrbProject *project)
{
  static const guint maxes[] = { 1, TRB_SHORTLIST_DEFAULT, G_MAXUINT };
  TrbSolveOptions options;
  g_autoptr(TrbProjectResult) plain = NULL;
  guint listed = 0;

  trb_solve_options_init (&options);
  g_assert_cmpuint (options.shortlist_max, ==, 0);
  plain = trb_solve_project_full (project, &options);
  for (guint i = 0; i < plain->members->len; i++)
    g_assert_cmpuint (((TrbMemberResult *) g_ptr_array_index (plain->members, i))->shortlist->len,
                      ==, 0);

  for (guint k = 0; k < G_N_ELEMENTS (maxes); k++)
    {
      g_autoptr(TrbProjectResult) listing = NULL;
      g_autoptr(GByteArray) old_lists = g_byte_array_new ();
      g_autoptr(GByteArray) new_lists = g_byte_array_new ();
      g_autoptr(GByteArray) old_results = g_byte_array_new ();
      g_autoptr(GByteArray) new_results = g_byte_array_new ();

      options.shortlist_max = maxes[k];
      listing = trb_solve_project_full (project, &options);
      g_assert_cmpuint (listing->members->len, ==, plain->members->len);
      for (guint i = 0; i < plain->members->len; i++)
        {
          const TrbMemberResult *a = g_ptr_array_index (listing->members, i);
          const TrbMemberResult *b = g_ptr_array_index (plain->members, i);
          g_autoptr(GArray) list = trb_solve_member_shortlist (project, b, maxes[k]);

          g_assert_true (a->member == b->member);
          digest_shortlist (old_lists, a->shortlist);
          digest_shortlist (new_lists, list);
          digest_result (old_results, a);
          digest_result (new_results, b);
          listed += list->len;
        }
      assert_same_bytes (old_lists, new_lists);
      assert_same_bytes (old_results, new_results);
    }
  return listed;
}

static void
test_shortlist_on_demand_random (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261202);
  g_autoptr(GString) xml = g_string_new ("<trabeate-project format=\"1\">");
  g_autoptr(TrbProject) project = NULL;

  for (guint i = 0; i < 40; i++)
    append_random_member (xml, rand, i);
  g_string_append (xml, "</trabeate-project>");
  project = load (xml->str);
  g_assert_cmpuint (check_shortlist_on_demand (project), >, 0);
}

static void
test_shortlist_on_demand_examples (void)
{
  static const char *const names[] = {
    "demo-beams.trabeate", "demo-floor.trabeate", "overhang-beam.trabeate",
  };

  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    {
      g_autofree char *path = g_test_build_filename (G_TEST_DIST, "..", "data", "examples",
                                                     names[i], NULL);
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbProject) project = trb_project_load_file (path, &error);

      g_assert_no_error (error);
      g_assert_cmpuint (check_shortlist_on_demand (project), >, 0);
    }
}

static void
test_shortlist_on_demand_floor (void)
{
  guint n;
  g_autofree char *xml = floor_gen_xml (250, &n);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = trb_project_load_data (xml, strlen (xml),
                                                         "generated.trabeate", &error);

  g_assert_no_error (error);
  g_assert_cmpuint (check_shortlist_on_demand (project), >, 0);
}

/* The strength entries' deflection extremes, found only when read
 * (trb_member_result_complete()): from two threads at once on results shared by identical
 * members they are the same bytes as completed one by one, each is the entry's own extreme
 * over the member (trb_beam_result_extremes(), found another way), and the envelope takes
 * the first entry that reaches it, as trb_extremes_merge() does. That they are what the
 * former eager solve printed is shown by the CLI's output against the former build
 * (docs/performance.md, Sizing). */
static gpointer
complete_all (gpointer data)
{
  const TrbProjectResult *pr = data;

  for (guint i = 0; i < pr->members->len; i++)
    trb_member_result_complete (g_ptr_array_index (pr->members, pr->members->len - 1 - i));
  return NULL;
}

static GBytes *
strength_digest (const TrbProjectResult *pr)
{
  GByteArray *d = g_byte_array_new ();

  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);
      const TrbEnvelope *env = &r->strength.envelope;

      for (guint k = 0; r->strength.entries != NULL && k < r->strength.entries->len; k++)
        {
          const TrbComboResult *c = &g_array_index (r->strength.entries, TrbComboResult, k);

          g_byte_array_append (d, (const guint8 *) &c->ext, sizeof c->ext);
        }
      g_byte_array_append (d, (const guint8 *) &env->ext, sizeof env->ext);
      g_byte_array_append (d, (const guint8 *) env->defl_down_by, strlen (env->defl_down_by));
      g_byte_array_append (d, (const guint8 *) env->defl_up_by, strlen (env->defl_up_by));
    }
  return g_byte_array_free_to_bytes (d);
}

static void
test_complete (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (1202);
  g_autoptr(GString) xml = g_string_new ("<trabeate-project format=\"1\">");
  g_autoptr(TrbProject) beams = NULL;
  g_autofree char *floor_xml = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) floor = NULL;
  TrbProject *projects[2];
  guint n, n_pending = 0;

  for (guint i = 0; i < 40; i++)
    append_random_member (xml, rand, i);
  g_string_append (xml, "</trabeate-project>");
  beams = load (xml->str);
  floor_xml = floor_gen_xml (120, &n);
  floor = trb_project_load_data (floor_xml, strlen (floor_xml), "generated.trabeate", &error);
  g_assert_no_error (error);
  projects[0] = beams;
  projects[1] = floor;

  for (guint p = 0; p < G_N_ELEMENTS (projects); p++)
    {
      g_autoptr(TrbProjectResult) a = trb_solve_project (projects[p]);
      g_autoptr(TrbProjectResult) b = trb_solve_project (projects[p]);
      g_autoptr(GBytes) da = NULL;
      g_autoptr(GBytes) db = NULL;
      GThread *t[2];

      for (guint i = 0; i < a->members->len; i++)
        n_pending += ((const TrbMemberResult *) g_ptr_array_index (a->members, i))->pending != NULL;
      t[0] = g_thread_new ("complete", complete_all, a);
      t[1] = g_thread_new ("complete", complete_all, a);
      g_thread_join (t[0]);
      g_thread_join (t[1]);
      for (guint i = 0; i < b->members->len; i++)
        trb_member_result_complete (g_ptr_array_index (b->members, i));
      da = strength_digest (a);
      db = strength_digest (b);
      g_assert_true (g_bytes_equal (da, db));

      for (guint i = 0; i < a->members->len; i++)
        {
          const TrbMemberResult *r = g_ptr_array_index (a->members, i);
          const TrbEnvelope *env = &r->strength.envelope;
          double down = -INFINITY, up = -INFINITY;
          const char *down_by = "", *up_by = "";

          g_assert_null (r->pending);
          if (!r->analysed)
            continue;
          for (guint k = 0; k < r->strength.entries->len; k++)
            {
              const TrbComboResult *c = &g_array_index (r->strength.entries, TrbComboResult, k);
              TrbBeamExtremes e;
              double scale;

              trb_beam_result_extremes (c->result, 0, r->member->length, &e);
              scale = MAX (fabs (e.defl_down), fabs (e.defl_up));
              g_assert_cmpfloat_with_epsilon (c->ext.defl_down, e.defl_down, 1e-9 * scale + 1e-300);
              g_assert_cmpfloat_with_epsilon (c->ext.defl_up, e.defl_up, 1e-9 * scale + 1e-300);
              if (c->ext.defl_down > down)
                {
                  down = c->ext.defl_down;
                  down_by = c->name;
                }
              if (c->ext.defl_up > up)
                {
                  up = c->ext.defl_up;
                  up_by = c->name;
                }
            }
          g_assert_cmpfloat (env->ext.defl_down, ==, down);
          g_assert_cmpfloat (env->ext.defl_up, ==, up);
          g_assert_cmpstr (env->defl_down_by, ==, down_by);
          g_assert_cmpstr (env->defl_up_by, ==, up_by);
        }
    }
  /* the deferred path was taken */
  g_assert_cmpuint (n_pending, >, 0);
}

/* A total deflection entry of the same case factors and pattern as a strength entry (ASD's
 * D + L) takes the strength entry's result and extremes, found once (evaluate_set(), twins):
 * each total entry's extremes are still those a search of its own result over the member gives
 * (trb_beam_result_extremes_intervals(), bit for bit), and a twin's result gives the same
 * values as the strength entry's at 201 points, and the same extremes of V and M. That they
 * are what the solve gave before is shown by the CLI's output against the former build
 * (docs/performance.md, Sizing). */
static void
test_twins (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (1203);
  g_autoptr(GString) xml = g_string_new ("<trabeate-project format=\"1\">"
                                         "<settings method=\"asd\"/>");
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(TrbProjectResult) pr = NULL;
  guint n_twins = 0;

  for (guint i = 0; i < 60; i++)
    append_random_member (xml, rand, i);
  g_string_append (xml, "</trabeate-project>");
  project = load (xml->str);
  pr = trb_solve_project (project);

  for (guint i = 0; i < pr->members->len; i++)
    {
      TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      if (!r->analysed)
        continue;
      trb_member_result_complete (r);
      for (guint k = 0; k < r->total.entries->len; k++)
        {
          const TrbComboResult *t = &g_array_index (r->total.entries, TrbComboResult, k);
          TrbBeamExtremes whole;

          trb_beam_result_extremes_intervals (t->result, NULL, 0, &whole, NULL, NULL);
          g_assert_cmpmem (&whole, sizeof whole, &t->ext, sizeof t->ext);
          for (guint j = 0; j < r->strength.entries->len; j++)
            {
              const TrbComboResult *c = &g_array_index (r->strength.entries, TrbComboResult, j);
              TrbBeamValues vt[201], vc[201];
              double xt[201], xc[201];

              if (memcmp (c->combo.factors, t->combo.factors, sizeof c->combo.factors) != 0 ||
                  strcmp (c->pattern, t->pattern) != 0)
                continue;
              n_twins++;
              trb_beam_result_sample (t->result, 201, xt, vt);
              trb_beam_result_sample (c->result, 201, xc, vc);
              g_assert_cmpmem (xt, sizeof xt, xc, sizeof xc);
              g_assert_cmpmem (vt, sizeof vt, vc, sizeof vc);
              g_assert_cmpmem (&c->ext, 4 * sizeof (double) * 2, &t->ext, 4 * sizeof (double) * 2);
            }
        }
    }
  g_assert_cmpuint (n_twins, >, 0);
}

int
main (int argc, char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/trb/solve/auto/shortcuts", test_auto_shortcuts);
  g_test_add_func ("/trb/solve/auto/brute-force", test_auto_brute_force);
  g_test_add_func ("/trb/solve/auto/guess", test_auto_guess);
  g_test_add_func ("/trb/solve/auto/design-example-f1-1a", test_design_example_f11a);
  g_test_add_func ("/trb/solve/auto/project-sections", test_project_sections);
  g_test_add_func ("/trb/solve/sections-file-outside", test_sections_file_outside);
  g_test_add_func ("/trb/solve/auto/nothing-passes", test_nothing_passes);
  g_test_add_func ("/trb/solve/auto/unstable", test_auto_unstable);
  g_test_add_func ("/trb/solve/auto/self-weight", test_self_weight_of_chosen);
  g_test_add_func ("/trb/solve/shortlist/on-demand/random", test_shortlist_on_demand_random);
  g_test_add_func ("/trb/solve/shortlist/on-demand/examples",
                   test_shortlist_on_demand_examples);
  g_test_add_func ("/trb/solve/shortlist/on-demand/floor", test_shortlist_on_demand_floor);
  g_test_add_func ("/trb/solve/complete", test_complete);
  g_test_add_func ("/trb/solve/twins", test_twins);
  return g_test_run ();
}
