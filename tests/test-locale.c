/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The project file under a locale whose decimal mark is a comma: what is saved there reads
 * back to the same results, and is byte for byte what the C locale saves. tests/test-i18n.py
 * runs this program with LC_ALL set to such a locale (es_ES.UTF-8 or de_DE.UTF-8, generated
 * into the build when the system has neither); run alone under another locale, its first case
 * fails, as it should. */

#include "config.h"

#include <glib.h>
#include <locale.h>
#include <math.h>
#include <string.h>

#include "trb-model.h"
#include "trb-project-io.h"
#include "trb-solve.h"
#include "trb-units.h"

/* The examples every build installs; each is saved and reloaded. */
static const char *const examples[] = {
  "demo-beams.trabeate",
  "demo-floor.trabeate",
  "overhang-beam.trabeate",
};

static char *
example_path (const char *name)
{
  return g_test_build_filename (G_TEST_DIST, "..", "data", "examples", name, NULL);
}

/* The locale the environment names is in force, and writes 2.5 as "2,5" (the point of the
 * whole test). */
static void
test_decimal_comma (void)
{
  struct lconv *lc = localeconv ();
  g_autofree char *text = g_strdup_printf ("%.1f", 2.5);

  g_assert_cmpstr (lc->decimal_point, ==, ",");
  g_assert_cmpstr (text, ==, "2,5");
}

/* Every quantity of two results, compared exactly: the same file must give the same numbers,
 * not merely close ones. */
static void
assert_same_results (const TrbProjectResult *a,
                     const TrbProjectResult *b)
{
  g_assert_cmpuint (a->members->len, ==, b->members->len);
  for (guint i = 0; i < a->members->len; i++)
    {
      const TrbMemberResult *ra = g_ptr_array_index (a->members, i);
      const TrbMemberResult *rb = g_ptr_array_index (b->members, i);

      g_assert_cmpstr (ra->member->id, ==, rb->member->id);
      g_assert_cmpint (ra->status, ==, rb->status);
      g_assert_cmpstr (ra->section, ==, rb->section);
      g_assert_cmpstr (ra->governing, ==, rb->governing);
      g_assert_true ((isnan (ra->ratio) && isnan (rb->ratio)) || ra->ratio == rb->ratio);
      g_assert_cmpfloat (ra->member->length, ==, rb->member->length);
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          const TrbReaction *re_a, *re_b;
          guint na, nb;

          g_assert_true ((ra->cases[c] == NULL) == (rb->cases[c] == NULL));
          if (ra->cases[c] == NULL)
            continue;
          re_a = trb_beam_result_get_reactions (ra->cases[c], &na);
          re_b = trb_beam_result_get_reactions (rb->cases[c], &nb);
          g_assert_cmpuint (na, ==, nb);
          for (guint k = 0; k < na; k++)
            {
              g_assert_cmpfloat (re_a[k].x, ==, re_b[k].x);
              g_assert_cmpfloat (re_a[k].force, ==, re_b[k].force);
              g_assert_cmpfloat (re_a[k].moment, ==, re_b[k].moment);
            }
        }
    }
}

/* Loaded, saved and reloaded under the comma locale: the results of the reloaded file are those
 * of the example, and the saved text is the C locale's. */
static void
test_save_reload (gconstpointer data)
{
  const char *name = data;
  g_autofree char *path = example_path (name);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(TrbProject) reloaded = NULL;
  g_autoptr(TrbProject) project_c = NULL;
  g_autoptr(TrbProjectResult) results = NULL;
  g_autoptr(TrbProjectResult) results_again = NULL;
  g_autofree char *saved = NULL;
  g_autofree char *saved_c = NULL;
  g_autofree char *locale = g_strdup (setlocale (LC_NUMERIC, NULL));
  gsize length = 0, length_c = 0;

  g_assert_cmpstr (localeconv ()->decimal_point, ==, ",");

  project = trb_project_load_file (path, &error);
  g_assert_no_error (error);
  saved = trb_project_save_data (project, &length, &error);
  g_assert_no_error (error);
  reloaded = trb_project_load_data (saved, length, name, &error);
  g_assert_no_error (error);

  results = trb_solve_project (project);
  results_again = trb_solve_project (reloaded);
  assert_same_results (results, results_again);

  /* the same file saved under the C locale */
  setlocale (LC_NUMERIC, "C");
  project_c = trb_project_load_file (path, &error);
  g_assert_no_error (error);
  saved_c = trb_project_save_data (project_c, &length_c, &error);
  g_assert_no_error (error);
  setlocale (LC_NUMERIC, locale);

  g_assert_cmpuint (length, ==, length_c);
  g_assert_cmpstr (saved, ==, saved_c);
}

/* Quantities typed with a point read the same under the comma locale, and show with a point:
 * what the screen and the reports show can be typed back. */
static void
test_units (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  double v = 0;

  g_assert_cmpstr (localeconv ()->decimal_point, ==, ",");

  g_assert_true (trb_units_parse ("2.5 ft", TRB_DIM_LENGTH, &v, &error));
  g_assert_no_error (error);
  /* 2.5 ft = 2.5 x 0.3048 m = 0.762 m (the international foot is 0.3048 m exactly, NIST SP 811
   * (2008) Appendix B) */
  g_assert_cmpfloat_with_epsilon (v, 0.762, 1e-12);

  g_assert_true (trb_units_parse ("2.4 kPa", TRB_DIM_AREA_LOAD, &v, &error));
  g_assert_no_error (error);
  /* 2.4 kPa = 2400 Pa (SI prefix kilo = 10^3, NIST SP 811 (2008) Table 5) */
  g_assert_cmpfloat_with_epsilon (v, 2400, 1e-9);

  /* 2400 Pa shown in kilopascals with its decimals: the only mark in it is a point */
  text = trb_units_format (2400, TRB_DIM_AREA_LOAD, TRB_UNIT_SYSTEM_SI);
  g_assert_nonnull (strchr (text, '.'));
  g_assert_null (strchr (text, ','));
}

int
main (int    argc,
      char **argv)
{
  setlocale (LC_ALL, "");
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/locale/decimal-comma", test_decimal_comma);
  for (guint i = 0; i < G_N_ELEMENTS (examples); i++)
    {
      g_autofree char *path = g_strdup_printf ("/trb/locale/save-reload/%s", examples[i]);

      g_test_add_data_func (path, examples[i], test_save_reload);
    }
  g_test_add_func ("/trb/locale/units", test_units);
  return g_test_run ();
}
