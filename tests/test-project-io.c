/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gstdio.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "trb-error.h"
#include "trb-model.h"
#include "trb-project-io.h"
#include "trb-units.h"

/* Quantities read from text: the units module's exact factors (NIST SP 811, via trb-units.h)
 * times the number, to within rounding. */
static void
assert_si (double actual,
           double expected)
{
  g_assert_cmpfloat_with_epsilon (actual, expected, 1e-12 * MAX (1.0, fabs (expected)));
}

static const TrbMemberLoad *
load_at (const TrbMember *m,
         guint            i)
{
  g_assert_cmpuint (i, <, m->loads->len);
  return &g_array_index (m->loads, TrbMemberLoad, i);
}

/* The form of format 1 that must load now and forever (docs/file-format.md). Every number is
 * its text times the exact factor: 26 ft = 26 x 0.3048 m, 0.35 kip/ft = 0.35 x 1000 lbf/ft,
 * 6 kip = 6 x 4448.2216152605 N, 4 kip*ft = 4 x 4448.2216152605 x 0.3048 N*m. */
static void
test_forever (void)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data", "forever.trabeate", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_file (path, &error);
  const TrbMember *b;
  const TrbMemberSupport *s;
  const TrbMemberLoad *l;

  g_assert_no_error (error);
  g_assert_nonnull (p);
  g_assert_cmpint (p->format, ==, 1);
  g_assert_cmpuint (p->members->len, ==, 1);

  b = g_ptr_array_index (p->members, 0);
  g_assert_cmpstr (b->id, ==, "B1");
  g_assert_cmpint (b->line, ==, 4);
  assert_si (b->length, 26 * TRB_FT);
  g_assert_cmpint (b->material, ==, TRB_MATERIAL_STEEL);
  g_assert_cmpstr (b->section, ==, "W16X31");
  g_assert_true (isnan (b->E) && isnan (b->I));

  g_assert_cmpuint (b->supports->len, ==, 2);
  s = &g_array_index (b->supports, TrbMemberSupport, 0);
  g_assert_cmpfloat (s->support.x, ==, 0);
  g_assert_cmpint (s->support.type, ==, TRB_SUPPORT_PIN);
  g_assert_cmpint (s->line, ==, 5);
  s = &g_array_index (b->supports, TrbMemberSupport, 1);
  assert_si (s->support.x, 20 * TRB_FT);
  g_assert_cmpint (s->support.type, ==, TRB_SUPPORT_ROLLER);

  g_assert_cmpuint (b->loads->len, ==, 4);
  l = load_at (b, 0);
  g_assert_cmpint (l->lcase, ==, TRB_CASE_D);
  g_assert_cmpint (l->load.kind, ==, TRB_LOAD_UNIFORM);
  g_assert_cmpfloat (l->load.a, ==, 0);
  assert_si (l->load.b, 26 * TRB_FT);
  assert_si (l->load.w1, 0.35 * TRB_KLF);
  assert_si (l->load.w2, 0.35 * TRB_KLF);
  g_assert_cmpint (l->line, ==, 7);

  l = load_at (b, 1);
  g_assert_cmpint (l->lcase, ==, TRB_CASE_L);
  g_assert_cmpint (l->load.kind, ==, TRB_LOAD_POINT);
  assert_si (l->load.a, 9 * TRB_FT);
  assert_si (l->load.w1, 6 * TRB_KIP);

  l = load_at (b, 2);
  g_assert_cmpint (l->lcase, ==, TRB_CASE_L);
  g_assert_cmpint (l->load.kind, ==, TRB_LOAD_LINEAR);
  assert_si (l->load.a, 20 * TRB_FT);
  assert_si (l->load.b, 26 * TRB_FT);
  assert_si (l->load.w1, 0.2 * TRB_KLF);
  assert_si (l->load.w2, 0.5 * TRB_KLF);

  l = load_at (b, 3);
  g_assert_cmpint (l->lcase, ==, TRB_CASE_D);
  g_assert_cmpint (l->load.kind, ==, TRB_LOAD_MOMENT);
  /* at the very end: clamped to the length exactly */
  g_assert_cmpfloat (l->load.a, ==, b->length);
  assert_si (l->load.w1, 4 * TRB_KIP_FT);

  /* no <settings>: the documented defaults */
  g_assert_cmpint (p->settings.line, ==, 0);
  g_assert_cmpint (p->settings.method, ==, TRB_METHOD_ASD);
  g_assert_cmpstr (p->settings.steel_grade, ==, "A992");
  g_assert_true (p->settings.self_weight);
  g_assert_true (p->settings.live_patterns);
  g_assert_cmpfloat (p->settings.deflection_live, ==, 360);
  g_assert_cmpfloat (p->settings.deflection_total, ==, 240);
  g_assert_cmpint (p->settings.units, ==, TRB_UNIT_SYSTEM_US);
  g_assert_true (isnan (p->settings.fb_allow));

  /* beam attributes not given follow the project */
  g_assert_false (b->has_method);
  g_assert_cmpint (trb_member_get_method (b, &p->settings), ==, TRB_METHOD_ASD);
  g_assert_cmpfloat (trb_member_get_deflection_live (b, &p->settings), ==, 360);
  g_assert_cmpint (b->bracing, ==, TRB_BRACING_CONTINUOUS);
}

/* Every setting and beam attribute, each away from its default; values are their text times
 * the exact factors (1 ksi = 6,894,757.29... Pa from 1000 lbf / in^2; 1 kg/m = 9.80665 N/m
 * under standard gravity: NIST SP 811 Appendix B). */
static void
test_attributes (void)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data", "attributes.trabeate",
                                                 NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_file (path, &error);
  const TrbSettings *st;
  const TrbMember *s1, *j1, *c1;

  g_assert_no_error (error);
  st = &p->settings;
  g_assert_cmpint (st->line, ==, 4);
  g_assert_cmpint (st->method, ==, TRB_METHOD_LRFD);
  assert_si (st->fb_allow, 22 * TRB_KSI);
  assert_si (st->fv_allow, 13 * TRB_KSI);
  g_assert_cmpstr (st->steel_grade, ==, "A572 Gr 50");
  g_assert_false (st->self_weight);
  g_assert_false (st->live_patterns);
  g_assert_cmpfloat (st->deflection_live, ==, 480);
  g_assert_cmpfloat (st->deflection_total, ==, 0);
  g_assert_cmpint (st->units, ==, TRB_UNIT_SYSTEM_SI);

  g_assert_cmpuint (p->members->len, ==, 3);
  s1 = trb_project_find_member (p, "S1");
  j1 = trb_project_find_member (p, "J1");
  c1 = trb_project_find_member (p, "C1");
  g_assert_nonnull (s1);
  g_assert_nonnull (j1);
  g_assert_nonnull (c1);
  g_assert_null (trb_project_find_member (p, "s1"));

  /* a start tag over several lines is placed at its first line */
  g_assert_cmpint (s1->line, ==, 7);
  g_assert_true (trb_member_is_auto (s1));
  g_assert_cmpint (trb_member_get_method (s1, st), ==, TRB_METHOD_ALLOWABLE);
  assert_si (trb_member_get_fb_allow (s1, st), 150e6);
  assert_si (trb_member_get_fv_allow (s1, st), 100e6);
  g_assert_cmpstr (trb_member_get_steel_grade (s1, st), ==, "A36");
  g_assert_cmpfloat (trb_member_get_deflection_live (s1, st), ==, 0);
  g_assert_cmpfloat (trb_member_get_deflection_total (s1, st), ==, 300);
  g_assert_cmpint (s1->bracing, ==, TRB_BRACING_POINTS);
  assert_si (s1->max_depth, 0.4);
  assert_si (s1->min_depth, 0.2);
  g_assert_cmpuint (g_strv_length (s1->allowed), ==, 3);
  g_assert_cmpstr (s1->allowed[1], ==, "W14X30");
  g_assert_cmpint (g_array_index (s1->supports, TrbMemberSupport, 1).support.type, ==,
                   TRB_SUPPORT_FIXED);
  /* braces come sorted by position */
  g_assert_cmpuint (s1->braces->len, ==, 2);
  assert_si (g_array_index (s1->braces, TrbMemberBrace, 0).x, 2.4);
  assert_si (g_array_index (s1->braces, TrbMemberBrace, 1).x, 4.8);
  g_assert_cmpint (load_at (s1, 0)->lcase, ==, TRB_CASE_LR);
  assert_si (load_at (s1, 0)->load.w1, 1500);
  g_assert_cmpint (load_at (s1, 1)->lcase, ==, TRB_CASE_S);
  g_assert_cmpfloat (load_at (s1, 1)->load.w1, ==, 0);
  assert_si (load_at (s1, 1)->load.w2, 2000);

  g_assert_cmpint (j1->material, ==, TRB_MATERIAL_WOOD);
  g_assert_cmpstr (j1->section, ==, "2x10");
  g_assert_cmpstr (j1->species, ==, "Douglas Fir-Larch");
  g_assert_cmpstr (j1->grade, ==, "No.2");
  g_assert_true (j1->wet_service);
  g_assert_true (j1->incised);
  g_assert_true (j1->repetitive);
  assert_si (j1->bearing_length, 3.5 * TRB_IN);
  g_assert_cmpint (j1->max_plies, ==, 3);
  /* 168 in and 14 ft differ in the last bit; the support is put at the end exactly */
  g_assert_cmpfloat (g_array_index (j1->supports, TrbMemberSupport, 1).support.x, ==,
                     j1->length);
  assert_si (load_at (j1, 0)->load.w1, 13.33 * TRB_PLF);
  g_assert_cmpint (trb_member_get_method (j1, st), ==, TRB_METHOD_LRFD);
  g_assert_cmpfloat (trb_member_get_deflection_live (j1, st), ==, 480);

  g_assert_true (trb_member_is_custom (c1));
  g_assert_cmpint (c1->material, ==, TRB_MATERIAL_CUSTOM);
  assert_si (c1->E, 200e9);
  assert_si (c1->I, 100e6 * 1e-12);
  assert_si (c1->S, 500e3 * 1e-9);
  assert_si (c1->A, 5000 * 1e-6);
  assert_si (c1->d, 0.3);
  assert_si (c1->tw, 0.006);
  assert_si (c1->weight, 40 * TRB_STANDARD_GRAVITY);
}

/* Reading a file leaves it as it was: same bytes, same modification time. */
static void
test_no_write (void)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data", "forever.trabeate", NULL);
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  gsize n_before, n_after;
  GStatBuf st_before, st_after;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  g_assert_true (g_file_get_contents (path, &before, &n_before, NULL));
  g_assert_cmpint (g_stat (path, &st_before), ==, 0);
  p = trb_project_load_file (path, &error);
  g_assert_no_error (error);
  g_assert_true (g_file_get_contents (path, &after, &n_after, NULL));
  g_assert_cmpint (g_stat (path, &st_after), ==, 0);
  g_assert_cmpmem (before, n_before, after, n_after);
  g_assert_cmpint (st_before.st_mtime, ==, st_after.st_mtime);
}

static void
test_missing_file (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_file ("no-such-dir/none.trabeate", &error);

  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "none.trabeate"));
}

/* The documented size limit holds before any parsing: one byte more than 64 MiB is refused. */
static void
test_size_limit (void)
{
  gsize n = TRB_PROJECT_MAX_FILE_SIZE + 1;
  g_autofree char *big = g_malloc (n);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  g_assert_cmpint (TRB_PROJECT_MAX_FILE_SIZE, ==, 64 * 1024 * 1024);
  memset (big, ' ', n);
  p = trb_project_load_data (big, n, "big.trabeate", &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "big.trabeate: the file is larger than 64 MiB"));
}

/* The expectation is the file's first line: <!-- expect: CODE line N: TEXT --> */
typedef struct
{
  TrbError code;
  int      line;
  char    *text;
} Expectation;

static gboolean
read_expectation (const char  *contents,
                  Expectation *e)
{
  static const struct { const char *name; TrbError code; } codes[] = {
    { "parse", TRB_ERROR_PARSE },
    { "unit", TRB_ERROR_UNIT },
    { "invalid", TRB_ERROR_INVALID },
    { "newer-format", TRB_ERROR_NEWER_FORMAT },
    { "io", TRB_ERROR_IO },
  };
  g_autoptr(GRegex) re = g_regex_new ("^<!-- expect: ([a-z-]+) line ([0-9]+): (.*) -->\n", 0, 0,
                                      NULL);
  g_autoptr(GMatchInfo) mi = NULL;
  g_autofree char *code = NULL;
  g_autofree char *line = NULL;

  if (!g_regex_match (re, contents, 0, &mi))
    return FALSE;
  code = g_match_info_fetch (mi, 1);
  line = g_match_info_fetch (mi, 2);
  e->text = g_match_info_fetch (mi, 3);
  e->line = atoi (line);
  for (guint i = 0; i < G_N_ELEMENTS (codes); i++)
    if (strcmp (code, codes[i].name) == 0)
      {
        e->code = codes[i].code;
        return TRUE;
      }
  return FALSE;
}

static void
test_invalid_file (gconstpointer data)
{
  const char *path = data;
  g_autofree char *contents = NULL;
  g_autofree char *base = g_path_get_basename (path);
  g_autofree char *where = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  Expectation e = { 0 };

  g_assert_true (g_file_get_contents (path, &contents, NULL, NULL));
  if (!read_expectation (contents, &e))
    g_error ("%s: the first line must read <!-- expect: CODE line N: TEXT -->", base);

  p = trb_project_load_file (path, &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, (int) e.code);

  /* "<path as given>:<line>: <what>", the path ending in the file's name */
  where = g_strdup_printf ("%s:%d: ", base, e.line);
  if (strstr (error->message, where) == NULL || strstr (error->message, e.text) == NULL)
    g_error ("%s: expected \"%s...%s\", got \"%s\"", base, where, e.text, error->message);
  g_assert_true (g_str_has_prefix (error->message, path));
  g_free (e.text);
}

/* Loading the same bytes under another name changes only the name in the message. */
static void
test_display_name (void)
{
  const char *text = "<trabeate-project format=\"1\">\n<beam/>\n</trabeate-project>\n";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (text, strlen (text), "mine.trabeate", &error);

  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_cmpstr (error->message, ==,
                   "mine.trabeate:2: <beam> is missing the required attribute \"id\"");
}

static int
compare_names (gconstpointer a,
               gconstpointer b)
{
  return strcmp (*(const char * const *) a, *(const char * const *) b);
}

int
main (int    argc,
      char **argv)
{
  g_autofree char *dir = NULL;
  g_autoptr(GDir) d = NULL;
  g_autoptr(GPtrArray) names = g_ptr_array_new_with_free_func (g_free);
  const char *name;

  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/project-io/forever", test_forever);
  g_test_add_func ("/trb/project-io/attributes", test_attributes);
  g_test_add_func ("/trb/project-io/no-write", test_no_write);
  g_test_add_func ("/trb/project-io/missing-file", test_missing_file);
  g_test_add_func ("/trb/project-io/size-limit", test_size_limit);
  g_test_add_func ("/trb/project-io/display-name", test_display_name);

  /* one case per file in data/invalid, each of which must fail as its first line says */
  dir = g_test_build_filename (G_TEST_DIST, "data", "invalid", NULL);
  d = g_dir_open (dir, 0, NULL);
  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    if (g_str_has_suffix (name, ".trabeate"))
      g_ptr_array_add (names, g_strdup (name));
  g_ptr_array_sort (names, compare_names);
  g_assert_cmpuint (names->len, >=, 40);
  for (guint i = 0; i < names->len; i++)
    {
      const char *n = g_ptr_array_index (names, i);
      g_autofree char *stem = g_strndup (n, strlen (n) - strlen (".trabeate"));
      g_autofree char *test = g_strdup_printf ("/trb/project-io/invalid/%s", stem);

      g_test_add_data_func_full (test, g_build_filename (dir, n, NULL), test_invalid_file,
                                 g_free);
    }

  return g_test_run ();
}
