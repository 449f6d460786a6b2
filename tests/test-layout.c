/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-error.h"
#include "trb-frame.h"
#include "trb-layout.h"
#include "trb-model.h"
#include "trb-units.h"

/* The rule under test (docs/file-format.md, "Joist runs"; trb-layout.h): joists at offset,
 * offset + s, offset + 2 s, ... from the starting end of the stretch both supports cover, up
 * to more than TRB_FRAME_TOLERANCE (25 mm) short of its far end; the offset defaults to one
 * spacing. 16 in on centre is the common joist spacing (common practice). */

static TrbMember *
add_member (TrbProject *p,
            TrbFloor   *f,
            const char *id,
            double      x1,
            double      y1,
            double      x2,
            double      y2)
{
  TrbMember *m = trb_member_new (id);
  TrbFramePoint s = { x1, y1 }, e = { x2, y2 };

  trb_member_set_role (m, TRB_FRAME_ROLE_GIRDER);
  trb_member_set_plan (m, s, e);
  trb_floor_add_member (p, f, m);
  return m;
}

/* Distance from p to the infinite line through m. */
static double
line_distance (const TrbMember     *m,
               const TrbFramePoint *p)
{
  double dx = m->end.x - m->start.x, dy = m->end.y - m->start.y;

  return fabs ((p->x - m->start.x) * dy - (p->y - m->start.y) * dx) / hypot (dx, dy);
}

typedef struct
{
  TrbProject *project;
  TrbFloor   *floor;
  TrbMember  *a;
  TrbMember  *b;
} Bay;

/* Two girders 20 ft long, 14 ft apart: G1 along y = 0, G2 along y = 14 ft. */
static void
bay_setup (Bay           *bay,
           gconstpointer  data)
{
  bay->project = trb_project_new ();
  bay->floor = trb_floor_new ("Level 2");
  trb_project_add_floor (bay->project, bay->floor);
  bay->a = add_member (bay->project, bay->floor, "G1", 0, 0, 20 * TRB_FT, 0);
  bay->b = add_member (bay->project, bay->floor, "G2", 0, 14 * TRB_FT, 20 * TRB_FT,
                       14 * TRB_FT);
}

static void
bay_teardown (Bay           *bay,
              gconstpointer  data)
{
  trb_project_free (bay->project);
}

/* 16 in spacing over 240 in with the default offset of 16 in: joists at 16, 32, ..., 224 in,
 * that is 224 / 16 = 14 joists; the 15th would sit at 240 in, on the end of the bay, which the
 * 25 mm rule leaves out (240 in - 25 mm = 239.02 in < 240 in). */
static void
test_count_and_positions (Bay           *bay,
                          gconstpointer  data)
{
  TrbJoistRunSpec spec;
  g_autoptr(GPtrArray) joists = NULL;
  g_autoptr(GError) error = NULL;

  trb_joist_run_spec_init (&spec, 16 * TRB_IN);
  joists = trb_layout_joist_run (bay->project, bay->floor, bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (joists->len, ==, 14);
  g_assert_cmpuint (bay->floor->members->len, ==, 2 + 14);
  g_assert_cmpuint (bay->project->members->len, ==, 2 + 14);

  for (guint k = 0; k < joists->len; k++)
    {
      const TrbMember *j = g_ptr_array_index (joists, k);
      g_autofree char *mark = g_strdup_printf ("J%u", k + 1);

      g_assert_cmpstr (j->id, ==, mark);
      g_assert_true (trb_project_find_member (bay->project, mark) == j);
      g_assert_cmpstr (j->group, ==, "R1");
      g_assert_cmpint (j->role, ==, TRB_FRAME_ROLE_JOIST);
      g_assert_true (j->carries_deck);
      g_assert_true (j->floor == bay->floor);
      /* k-th joist at 16 (k + 1) in, from G1 (y = 0) to G2 (y = 14 ft) */
      g_assert_cmpfloat_with_epsilon (j->start.x, 16 * (k + 1) * TRB_IN, 1e-12);
      g_assert_cmpfloat_with_epsilon (j->end.x, 16 * (k + 1) * TRB_IN, 1e-12);
      g_assert_cmpfloat_with_epsilon (line_distance (bay->a, &j->start), 0, 1e-9);
      g_assert_cmpfloat_with_epsilon (line_distance (bay->b, &j->end), 0, 1e-9);
      g_assert_cmpfloat_with_epsilon (j->length, 14 * TRB_FT, 1e-9);
      /* no template: the defaults of a new member */
      g_assert_cmpstr (j->section, ==, "auto");
      g_assert_cmpuint (j->supports->len, ==, 0);
    }
}

/* From the far end, first joist 8 in in: at 240 - 8 = 232 in, then every 16 in down to
 * 232 - 14 x 16 = 8 in: 15 joists (the next, at -8 in, is off the bay). */
static void
test_from_end (Bay           *bay,
               gconstpointer  data)
{
  TrbJoistRunSpec spec;
  g_autoptr(GPtrArray) joists = NULL;
  g_autoptr(GError) error = NULL;

  trb_joist_run_spec_init (&spec, 16 * TRB_IN);
  spec.start = TRB_LAYOUT_FROM_END;
  spec.offset = 8 * TRB_IN;
  spec.prefix = "FJ";
  spec.group = "Bay A";
  joists = trb_layout_joist_run (bay->project, bay->floor, bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (joists->len, ==, 15);
  for (guint k = 0; k < joists->len; k++)
    {
      const TrbMember *j = g_ptr_array_index (joists, k);
      g_autofree char *mark = g_strdup_printf ("FJ%u", k + 1);

      g_assert_cmpstr (j->id, ==, mark);
      g_assert_cmpstr (j->group, ==, "Bay A");
      g_assert_cmpfloat_with_epsilon (j->start.x, (232.0 - 16 * k) * TRB_IN, 1e-12);
    }
}

/* An offset of 0 puts the first joist at the very start of the bay: 0, 24, ..., 216 in at
 * 24 in spacing (240 in would be the far end): 10 joists. */
static void
test_zero_offset (Bay           *bay,
                  gconstpointer  data)
{
  TrbJoistRunSpec spec;
  g_autoptr(GArray) lines = NULL;
  g_autoptr(GError) error = NULL;

  trb_joist_run_spec_init (&spec, 24 * TRB_IN);
  spec.offset = 0;
  lines = trb_layout_preview (bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (lines->len, ==, 10);
  g_assert_cmpfloat (g_array_index (lines, TrbLayoutLine, 0).start.x, ==, 0);
  g_assert_cmpfloat_with_epsilon (g_array_index (lines, TrbLayoutLine, 9).start.x,
                                  216 * TRB_IN, 1e-12);
  /* the preview creates nothing */
  g_assert_cmpuint (bay->project->members->len, ==, 2);
}

/* Marks skip those the project holds, beams and members alike; a second run takes the next
 * group. */
static void
test_marks_and_groups (Bay           *bay,
                       gconstpointer  data)
{
  TrbJoistRunSpec spec;
  g_autoptr(GPtrArray) first = NULL;
  g_autoptr(GPtrArray) second = NULL;
  g_autoptr(GError) error = NULL;
  const char *expected[] = { "J1", "J3", "J4", "J6", "J7" };

  trb_project_add_member (bay->project, trb_member_new ("J2"));
  add_member (bay->project, bay->floor, "J5", 100, 100, 101, 100);

  /* 48 in spacing, offset 48: 48, 96, 144, 192 in (240 is the end): 4 joists */
  trb_joist_run_spec_init (&spec, 48 * TRB_IN);
  first = trb_layout_joist_run (bay->project, bay->floor, bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (first->len, ==, 4);
  for (guint k = 0; k < first->len; k++)
    g_assert_cmpstr (((TrbMember *) g_ptr_array_index (first, k))->id, ==, expected[k]);

  spec.offset = 24 * TRB_IN;
  second = trb_layout_joist_run (bay->project, bay->floor, bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  /* 24, 72, 120, 168, 216 in: 5 joists, marks from J7 on, group R2 */
  g_assert_cmpuint (second->len, ==, 5);
  g_assert_cmpstr (((TrbMember *) g_ptr_array_index (second, 0))->id, ==, "J7");
  g_assert_cmpstr (((TrbMember *) g_ptr_array_index (second, 0))->group, ==, "R2");
  g_assert_cmpstr (((TrbMember *) g_ptr_array_index (second, 4))->id, ==, "J11");
}

/* The template gives material, section and design attributes; not supports or loads. */
static void
test_template (Bay           *bay,
               gconstpointer  data)
{
  g_autoptr(TrbMember) t = trb_member_new ("template");
  TrbMemberSupport s = { { TRB_SUPPORT_PIN, 0 }, 0 };
  TrbJoistRunSpec spec;
  g_autoptr(GPtrArray) joists = NULL;
  g_autoptr(GError) error = NULL;
  const TrbMember *j;

  t->material = TRB_MATERIAL_WOOD;
  g_free (t->section);
  t->section = g_strdup ("2x10");
  t->species = g_strdup ("Douglas Fir-Larch");
  t->grade = g_strdup ("No.2");
  t->repetitive = TRUE;
  t->deflection_live = 480;
  g_array_append_val (t->supports, s);

  trb_joist_run_spec_init (&spec, 16 * TRB_IN);
  spec.template = t;
  joists = trb_layout_joist_run (bay->project, bay->floor, bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  j = g_ptr_array_index (joists, 3);
  g_assert_cmpint (j->material, ==, TRB_MATERIAL_WOOD);
  g_assert_cmpstr (j->section, ==, "2x10");
  g_assert_cmpstr (j->species, ==, "Douglas Fir-Larch");
  g_assert_cmpstr (j->grade, ==, "No.2");
  g_assert_true (j->repetitive);
  g_assert_cmpfloat (j->deflection_live, ==, 480);
  g_assert_cmpuint (j->supports->len, ==, 0);
  g_assert_cmpint (j->role, ==, TRB_FRAME_ROLE_JOIST);
}

/* Supports drawn askew in plan, opposite ways, covering only part of each other, and 1 degree
 * off parallel (within the 2 degrees allowed): every joist is perpendicular to A, starts on
 * A's line and ends on B's, and lies over the stretch both cover. */
static void
test_skewed (void)
{
  g_autoptr(TrbProject) p = trb_project_new ();
  TrbFloor *f = trb_floor_new ("Roof");
  double th = 0.5, d = 1.0 * G_PI / 180;
  double ux = cos (th), uy = sin (th), nx = -sin (th), ny = cos (th);
  TrbMember *a, *b;
  TrbJoistRunSpec spec;
  g_autoptr(GPtrArray) joists = NULL;
  g_autoptr(GError) error = NULL;

  trb_project_add_floor (p, f);
  /* A: 12 m from (3, -2) along u. B: about 5 m from A, drawn backwards, from 2 m past A's
   * start to 14 m past it, turned 1 degree. */
  a = add_member (p, f, "A", 3, -2, 3 + 12 * ux, -2 + 12 * uy);
  b = add_member (p, f, "B",
                  3 + 14 * ux + 5 * nx, -2 + 14 * uy + 5 * ny,
                  3 + 14 * ux + 5 * nx - 12 * cos (th + d),
                  -2 + 14 * uy + 5 * ny - 12 * sin (th + d));
  trb_joist_run_spec_init (&spec, 0.4);
  joists = trb_layout_joist_run (p, f, a, b, &spec, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (joists->len, >, 20);
  for (guint k = 0; k < joists->len; k++)
    {
      const TrbMember *j = g_ptr_array_index (joists, k);
      double jx = j->end.x - j->start.x, jy = j->end.y - j->start.y;
      double t = (j->start.x - 3) * ux + (j->start.y + 2) * uy;

      g_assert_cmpfloat_with_epsilon (line_distance (a, &j->start), 0, 1e-9);
      g_assert_cmpfloat_with_epsilon (line_distance (b, &j->end), 0, 1e-9);
      g_assert_cmpfloat_with_epsilon ((jx * ux + jy * uy) / j->length, 0, 1e-12);
      /* from A towards B */
      g_assert_cmpfloat (jx * nx + jy * ny, >, 0);
      /* B covers from 14 - 12 cos(1 deg) = 2.0018 m of A; A ends at 12 m; the first joist is
       * one spacing (0.4 m) in */
      g_assert_cmpfloat_with_epsilon (t, 14 - 12 * cos (d) + 0.4 * (k + 1), 1e-9);
      g_assert_cmpfloat (t, <, 12);
    }
}

static void
assert_refused (Bay                   *bay,
                const TrbMember       *a,
                const TrbMember       *b,
                const TrbJoistRunSpec *spec,
                const char            *text)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GPtrArray) joists = NULL;
  guint before = bay->project->members->len;

  joists = trb_layout_joist_run (bay->project, bay->floor, a, b, spec, &error);
  g_assert_null (joists);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  if (strstr (error->message, text) == NULL)
    g_error ("expected \"%s\" in \"%s\"", text, error->message);
  /* nothing was created */
  g_assert_cmpuint (bay->project->members->len, ==, before);
  g_assert_cmpuint (bay->floor->members->len, ==, before);
}

static void
test_errors (Bay           *bay,
             gconstpointer  data)
{
  TrbJoistRunSpec spec;
  TrbMember *skew, *beyond, *inline_, *close;

  /* 5 degrees off G1: beyond the 2 degrees of TRB_FRAME_PARALLEL_ANGLE */
  skew = add_member (bay->project, bay->floor, "S", 0, 5, 6 * cos (5 * G_PI / 180),
                     5 + 6 * sin (5 * G_PI / 180));
  /* parallel, but entirely past the end of G1 */
  beyond = add_member (bay->project, bay->floor, "X", 30 * TRB_FT, 10, 40 * TRB_FT, 10);
  /* on G1's own line */
  inline_ = add_member (bay->project, bay->floor, "Y", 2, 0, 5, 0);
  /* 10 mm from G1's line: within the 25 mm tolerance, so on the same line */
  close = add_member (bay->project, bay->floor, "Z", 2, 0.01, 5, 0.01);

  trb_joist_run_spec_init (&spec, 16 * TRB_IN);
  assert_refused (bay, bay->a, skew, &spec, "not parallel (5.0 degrees apart");
  assert_refused (bay, bay->a, beyond, &spec, "do not overlap");
  assert_refused (bay, bay->a, inline_, &spec, "lie on one line");
  assert_refused (bay, bay->a, close, &spec, "lie on one line");

  spec.spacing = 0;
  assert_refused (bay, bay->a, bay->b, &spec, "spacing must be greater than zero");
  spec.spacing = -16 * TRB_IN;
  assert_refused (bay, bay->a, bay->b, &spec, "spacing must be greater than zero");
  spec.spacing = NAN;
  assert_refused (bay, bay->a, bay->b, &spec, "spacing must be greater than zero");

  /* 0.5 mm over a 20 ft (6.096 m) bay, first one 0.5 mm in:
   * (6.096 - 0.025 - 0.0005) / 0.0005 + 1 = 12141 + 1 = 12142 joists, beyond
   * TRB_LAYOUT_MAX_JOISTS = 10000 */
  spec.spacing = 0.0005;
  assert_refused (bay, bay->a, bay->b, &spec,
                  "12142 joists at this spacing; a run holds at most 10000");
  spec.spacing = 16 * TRB_IN;
  spec.offset = -1;
  assert_refused (bay, bay->a, bay->b, &spec, "offset of the first joist must be zero or more");
  /* first joist 30 ft in on a 20 ft bay */
  spec.offset = 30 * TRB_FT;
  assert_refused (bay, bay->a, bay->b, &spec, "no joist fits");
}

/* At the limit itself: 1 mm spacing on the 20 ft bay gives 6071 joists, all created. */
static void
test_many (Bay           *bay,
           gconstpointer  data)
{
  TrbJoistRunSpec spec;
  g_autoptr(GPtrArray) joists = NULL;
  g_autoptr(GError) error = NULL;

  trb_joist_run_spec_init (&spec, 0.001);
  joists = trb_layout_joist_run (bay->project, bay->floor, bay->a, bay->b, &spec, &error);
  g_assert_no_error (error);
  /* (6.096 - 0.025 - 0.001) / 0.001 = 6070 steps after the first: 6071 */
  g_assert_cmpuint (joists->len, ==, 6071);
  g_assert_cmpstr (((TrbMember *) g_ptr_array_index (joists, 6070))->id, ==, "J6071");
}

/* The preview gives the very lines the run creates. */
static void
test_preview_matches (Bay           *bay,
                      gconstpointer  data)
{
  TrbJoistRunSpec spec;
  g_autoptr(GArray) lines = NULL;
  g_autoptr(GPtrArray) joists = NULL;
  g_autoptr(GError) error = NULL;

  trb_joist_run_spec_init (&spec, 19.2 * TRB_IN);
  spec.start = TRB_LAYOUT_FROM_END;
  lines = trb_layout_preview (bay->b, bay->a, &spec, &error);
  g_assert_no_error (error);
  joists = trb_layout_joist_run (bay->project, bay->floor, bay->b, bay->a, &spec, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (lines->len, ==, joists->len);
  for (guint k = 0; k < lines->len; k++)
    {
      const TrbLayoutLine *l = &g_array_index (lines, TrbLayoutLine, k);
      const TrbMember *j = g_ptr_array_index (joists, k);

      g_assert_cmpmem (&l->start, sizeof l->start, &j->start, sizeof j->start);
      g_assert_cmpmem (&l->end, sizeof l->end, &j->end, sizeof j->end);
      /* from G2 (y = 14 ft) down to G1 (y = 0) */
      g_assert_cmpfloat_with_epsilon (j->start.y, 14 * TRB_FT, 1e-12);
      g_assert_cmpfloat_with_epsilon (j->end.y, 0, 1e-12);
    }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add ("/trb/layout/count-and-positions", Bay, NULL, bay_setup,
              test_count_and_positions, bay_teardown);
  g_test_add ("/trb/layout/from-end", Bay, NULL, bay_setup, test_from_end, bay_teardown);
  g_test_add ("/trb/layout/zero-offset", Bay, NULL, bay_setup, test_zero_offset, bay_teardown);
  g_test_add ("/trb/layout/marks-and-groups", Bay, NULL, bay_setup, test_marks_and_groups,
              bay_teardown);
  g_test_add ("/trb/layout/template", Bay, NULL, bay_setup, test_template, bay_teardown);
  g_test_add_func ("/trb/layout/skewed", test_skewed);
  g_test_add ("/trb/layout/errors", Bay, NULL, bay_setup, test_errors, bay_teardown);
  g_test_add ("/trb/layout/many", Bay, NULL, bay_setup, test_many, bay_teardown);
  g_test_add ("/trb/layout/preview-matches", Bay, NULL, bay_setup, test_preview_matches,
              bay_teardown);

  return g_test_run ();
}
