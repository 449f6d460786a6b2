/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <float.h>
#include <glib/gstdio.h>
#include <math.h>
#include <signal.h>
#include <stdlib.h>
#include <string.h>
#include <sys/resource.h>
#include <unistd.h>

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

static const TrbFramePoint *
point_at (const GArray *points,
          guint         i)
{
  g_assert_cmpuint (i, <, points->len);
  return &g_array_index (points, TrbFramePoint, i);
}

static void
assert_point (const TrbFramePoint *p,
              double               x,
              double               y)
{
  assert_si (p->x, x);
  assert_si (p->y, y);
}

/* The floor sample: every element of a floor, each value its text times the exact factors
 * (NIST SP 811 Appendix B, via trb-units.h): 1 ft = 0.3048 m, 1 in = 0.0254 m,
 * 1 psf = 4.4482216152605 N / 0.3048^2 m^2, 1 kip = 4448.2216152605 N, 1 kPa = 1000 Pa. */
static void
test_floor (void)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data", "floor-mezzanine.trabeate",
                                                 NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_file (path, &error);
  const TrbFloor *f;
  const TrbGridLine *g;
  const TrbColumn *c;
  const TrbWall *w;
  const TrbMember *g1, *j1, *j2, *b1;
  const TrbAreaLoad *a;
  const TrbOpening *o;
  const TrbLineLoad *ll;
  const TrbPointLoad *pl;

  g_assert_no_error (error);
  g_assert_true (p->settings.live_load_reduction);
  g_assert_cmpint (p->settings.floors_above, ==, 2);

  g_assert_cmpuint (p->floors->len, ==, 1);
  f = g_ptr_array_index (p->floors, 0);
  g_assert_true (trb_project_find_floor (p, "Mezzanine") == f);
  g_assert_cmpstr (f->name, ==, "Mezzanine");
  g_assert_cmpint (f->line, ==, 11);

  g_assert_cmpuint (f->grids->len, ==, 2);
  g = g_ptr_array_index (f->grids, 0);
  g_assert_cmpstr (g->name, ==, "A");
  assert_point (&g->start, 0, -5 * TRB_FT);
  assert_point (&g->end, 0, 35 * TRB_FT);
  g_assert_cmpint (g->line, ==, 12);
  g_assert_true (trb_floor_find_grid (f, "1") == g_ptr_array_index (f->grids, 1));

  g_assert_cmpuint (f->columns->len, ==, 2);
  c = trb_project_find_column (p, "C1", NULL);
  g_assert_true (c == g_ptr_array_index (f->columns, 0));
  assert_point (&c->at, 0, 0);
  g_assert_cmpstr (c->section, ==, "HSS6X6X1/4");
  c = trb_floor_find_column (f, "C2");
  assert_point (&c->at, 0, 30 * TRB_FT);
  g_assert_null (c->section);
  g_assert_cmpint (c->line, ==, 15);

  g_assert_cmpuint (f->walls->len, ==, 1);
  w = trb_project_find_wall (p, "W1", NULL);
  g_assert_cmpstr (w->material, ==, "masonry");
  g_assert_cmpuint (w->points->len, ==, 2);
  assert_point (point_at (w->points, 0), 25 * TRB_FT, -1 * TRB_FT);
  assert_point (point_at (w->points, 1), 25 * TRB_FT, 31 * TRB_FT);
  g_assert_cmpint (w->line, ==, 16);

  /* every member in the project's array, in file order; the floor's are its own */
  g_assert_cmpuint (p->members->len, ==, 4);
  g_assert_cmpuint (f->members->len, ==, 3);
  b1 = g_ptr_array_index (p->members, 0);
  g_assert_cmpstr (b1->id, ==, "B1");
  g_assert_null (b1->floor);
  g1 = trb_project_find_member (p, "G1");
  j1 = trb_project_find_member (p, "J1");
  j2 = trb_project_find_member (p, "J2");
  g_assert_true (g_ptr_array_index (f->members, 0) == g1);
  g_assert_true (g_ptr_array_index (f->members, 2) == j2);

  g_assert_true (g1->floor == f);
  g_assert_cmpint (g1->role, ==, TRB_FRAME_ROLE_GIRDER);
  g_assert_false (g1->carries_deck);        /* a girder's default */
  assert_point (&g1->start, 0, 0);
  assert_point (&g1->end, 0, 30 * TRB_FT);
  assert_si (g1->length, 30 * TRB_FT);
  g_assert_cmpint (g1->line, ==, 20);
  g_assert_true (trb_member_is_auto (g1));
  assert_si (g1->max_depth, 18 * TRB_IN);
  g_assert_cmpstr (g1->steel_grade, ==, "A572 Gr 50");
  g_assert_null (g1->group);
  g_assert_cmpuint (g1->bearing_points->len, ==, 1);
  assert_point (point_at (g1->bearing_points, 0), 0, 15 * TRB_FT);

  g_assert_cmpint (j1->role, ==, TRB_FRAME_ROLE_JOIST);
  g_assert_true (j1->carries_deck);         /* a joist's default */
  g_assert_cmpstr (j1->group, ==, "R1");
  /* the length comes from the plan; the 300 in given agrees with it */
  assert_si (j1->length, 25 * TRB_FT);
  g_assert_cmpint (j1->material, ==, TRB_MATERIAL_WOOD);
  g_assert_true (j1->repetitive);
  g_assert_cmpuint (j1->loads->len, ==, 1);
  assert_si (load_at (j1, 0)->load.a, 12 * TRB_FT + 6 * TRB_IN);
  assert_si (load_at (j1, 0)->load.w1, 500 * TRB_LBF);
  g_assert_cmpint (load_at (j1, 0)->line, ==, 27);
  /* a brace on a member with no bracing attribute: braced at points */
  g_assert_cmpint (j1->bracing, ==, TRB_BRACING_POINTS);
  assert_si (g_array_index (j1->braces, TrbMemberBrace, 0).x, 12.5 * TRB_FT);

  g_assert_false (j2->carries_deck);        /* deck="no" */
  assert_point (&j2->end, 7.62, 20 * TRB_FT);
  assert_si (j2->length, 7.62);
  g_assert_cmpuint (j2->supports->len, ==, 1);

  g_assert_cmpuint (f->area_loads->len, ==, 2);
  a = g_ptr_array_index (f->area_loads, 0);
  g_assert_cmpint (a->lcase, ==, TRB_CASE_D);
  g_assert_cmpint (a->kind, ==, TRB_AREA_LOAD_ORDINARY);
  assert_si (a->pressure, 15 * TRB_PSF);
  g_assert_cmpstr (a->label, ==, "deck and finishes");
  g_assert_null (a->occupancy);
  g_assert_cmpuint (a->points->len, ==, 4);
  assert_point (point_at (a->points, 2), 25 * TRB_FT, 30 * TRB_FT);
  g_assert_cmpint (a->line, ==, 34);
  a = g_ptr_array_index (f->area_loads, 1);
  g_assert_cmpint (a->lcase, ==, TRB_CASE_L);
  g_assert_cmpint (a->kind, ==, TRB_AREA_LOAD_PARTITION);
  assert_si (a->pressure, 720);
  g_assert_null (a->label);
  g_assert_cmpstr (a->occupancy, ==, "office");
  g_assert_cmpuint (a->points->len, ==, 3);

  g_assert_cmpuint (f->openings->len, ==, 1);
  o = g_ptr_array_index (f->openings, 0);
  g_assert_cmpuint (o->points->len, ==, 3);
  assert_point (point_at (o->points, 2), 6 * TRB_FT, 6 * TRB_FT);
  g_assert_cmpint (o->line, ==, 45);

  g_assert_cmpuint (f->line_loads->len, ==, 1);
  ll = g_ptr_array_index (f->line_loads, 0);
  g_assert_cmpint (ll->lcase, ==, TRB_CASE_D);
  assert_si (ll->w, 0.4 * TRB_KLF);
  g_assert_cmpstr (ll->label, ==, "guard rail");
  assert_point (point_at (ll->points, 1), 25 * TRB_FT, 30 * TRB_FT);

  g_assert_cmpuint (f->point_loads->len, ==, 1);
  pl = g_ptr_array_index (f->point_loads, 0);
  g_assert_cmpint (pl->lcase, ==, TRB_CASE_L);
  assert_si (pl->P, 2 * TRB_KIP);
  assert_point (&pl->at, 12 * TRB_FT + 6 * TRB_IN, 10 * TRB_FT);
  g_assert_cmpstr (pl->label, ==, "hoist");
  g_assert_cmpint (pl->line, ==, 54);
}

/* New settings, absent: the documented defaults (live load reduction off: the engineer's
 * call; no floors above). */
static void
test_settings_defaults (void)
{
  const char *text = "<trabeate-project format=\"1\"><settings/></trabeate-project>";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (text, strlen (text), "s", &error);

  g_assert_no_error (error);
  g_assert_false (p->settings.live_load_reduction);
  g_assert_cmpint (p->settings.floors_above, ==, 0);
  g_assert_cmpuint (p->floors->len, ==, 0);
}

/* ---- equality of two models, every field but the file lines ---- */

static void
assert_same_double (double a,
                    double b)
{
  /* bit for bit, NaN equal to NaN (an unset attribute) */
  if (isnan (a) && isnan (b))
    return;
  g_assert_cmpfloat (a, ==, b);
}

static void
assert_same_points (const GArray *a,
                    const GArray *b)
{
  g_assert_cmpuint (a->len, ==, b->len);
  for (guint i = 0; i < a->len; i++)
    {
      assert_same_double (point_at (a, i)->x, point_at (b, i)->x);
      assert_same_double (point_at (a, i)->y, point_at (b, i)->y);
    }
}

static void
assert_same_member (const TrbMember *a,
                    const TrbMember *b)
{
  g_assert_cmpstr (a->id, ==, b->id);
  assert_same_double (a->length, b->length);
  g_assert_cmpint (a->material, ==, b->material);
  g_assert_cmpstr (a->section, ==, b->section);
  assert_same_double (a->E, b->E);
  assert_same_double (a->I, b->I);
  assert_same_double (a->S, b->S);
  assert_same_double (a->A, b->A);
  assert_same_double (a->d, b->d);
  assert_same_double (a->tw, b->tw);
  assert_same_double (a->weight, b->weight);
  g_assert_cmpuint (a->supports->len, ==, b->supports->len);
  for (guint i = 0; i < a->supports->len; i++)
    {
      const TrbMemberSupport *sa = &g_array_index (a->supports, TrbMemberSupport, i);
      const TrbMemberSupport *sb = &g_array_index (b->supports, TrbMemberSupport, i);

      g_assert_cmpint (sa->support.type, ==, sb->support.type);
      assert_same_double (sa->support.x, sb->support.x);
    }
  g_assert_cmpuint (a->loads->len, ==, b->loads->len);
  for (guint i = 0; i < a->loads->len; i++)
    {
      const TrbMemberLoad *la = load_at (a, i);
      const TrbMemberLoad *lb = load_at (b, i);

      g_assert_cmpint (la->lcase, ==, lb->lcase);
      g_assert_cmpint (la->load.kind, ==, lb->load.kind);
      assert_same_double (la->load.a, lb->load.a);
      assert_same_double (la->load.b, lb->load.b);
      assert_same_double (la->load.w1, lb->load.w1);
      assert_same_double (la->load.w2, lb->load.w2);
    }
  g_assert_cmpint (a->has_method, ==, b->has_method);
  if (a->has_method)
    g_assert_cmpint (a->method, ==, b->method);
  assert_same_double (a->fb_allow, b->fb_allow);
  assert_same_double (a->fv_allow, b->fv_allow);
  g_assert_cmpstr (a->steel_grade, ==, b->steel_grade);
  assert_same_double (a->deflection_live, b->deflection_live);
  assert_same_double (a->deflection_total, b->deflection_total);
  g_assert_cmpint (a->bracing, ==, b->bracing);
  g_assert_cmpuint (a->braces->len, ==, b->braces->len);
  for (guint i = 0; i < a->braces->len; i++)
    assert_same_double (g_array_index (a->braces, TrbMemberBrace, i).x,
                        g_array_index (b->braces, TrbMemberBrace, i).x);
  assert_same_double (a->max_depth, b->max_depth);
  assert_same_double (a->min_depth, b->min_depth);
  g_assert_cmpint (a->allowed == NULL, ==, b->allowed == NULL);
  if (a->allowed != NULL)
    g_assert_true (g_strv_equal ((const char * const *) a->allowed,
                                 (const char * const *) b->allowed));
  g_assert_cmpint (a->max_plies, ==, b->max_plies);
  g_assert_cmpstr (a->species, ==, b->species);
  g_assert_cmpstr (a->grade, ==, b->grade);
  g_assert_cmpint (a->wet_service, ==, b->wet_service);
  g_assert_cmpint (a->incised, ==, b->incised);
  g_assert_cmpint (a->repetitive, ==, b->repetitive);
  assert_same_double (a->bearing_length, b->bearing_length);

  g_assert_cmpint (a->floor == NULL, ==, b->floor == NULL);
  if (a->floor != NULL)
    g_assert_cmpstr (a->floor->name, ==, b->floor->name);
  assert_same_double (a->start.x, b->start.x);
  assert_same_double (a->start.y, b->start.y);
  assert_same_double (a->end.x, b->end.x);
  assert_same_double (a->end.y, b->end.y);
  g_assert_cmpint (a->role, ==, b->role);
  g_assert_cmpint (a->carries_deck, ==, b->carries_deck);
  g_assert_cmpstr (a->group, ==, b->group);
  assert_same_points (a->bearing_points, b->bearing_points);
}

static void
assert_same_floor (const TrbFloor *a,
                   const TrbFloor *b)
{
  g_assert_cmpstr (a->name, ==, b->name);
  g_assert_cmpuint (a->grids->len, ==, b->grids->len);
  for (guint i = 0; i < a->grids->len; i++)
    {
      const TrbGridLine *ga = g_ptr_array_index (a->grids, i);
      const TrbGridLine *gb = g_ptr_array_index (b->grids, i);

      g_assert_cmpstr (ga->name, ==, gb->name);
      assert_same_double (ga->start.x, gb->start.x);
      assert_same_double (ga->start.y, gb->start.y);
      assert_same_double (ga->end.x, gb->end.x);
      assert_same_double (ga->end.y, gb->end.y);
    }
  g_assert_cmpuint (a->columns->len, ==, b->columns->len);
  for (guint i = 0; i < a->columns->len; i++)
    {
      const TrbColumn *ca = g_ptr_array_index (a->columns, i);
      const TrbColumn *cb = g_ptr_array_index (b->columns, i);

      g_assert_cmpstr (ca->id, ==, cb->id);
      g_assert_cmpstr (ca->section, ==, cb->section);
      assert_same_double (ca->at.x, cb->at.x);
      assert_same_double (ca->at.y, cb->at.y);
    }
  g_assert_cmpuint (a->walls->len, ==, b->walls->len);
  for (guint i = 0; i < a->walls->len; i++)
    {
      const TrbWall *wa = g_ptr_array_index (a->walls, i);
      const TrbWall *wb = g_ptr_array_index (b->walls, i);

      g_assert_cmpstr (wa->id, ==, wb->id);
      g_assert_cmpstr (wa->material, ==, wb->material);
      assert_same_points (wa->points, wb->points);
    }
  g_assert_cmpuint (a->members->len, ==, b->members->len);
  for (guint i = 0; i < a->members->len; i++)
    g_assert_cmpstr (((TrbMember *) g_ptr_array_index (a->members, i))->id, ==,
                     ((TrbMember *) g_ptr_array_index (b->members, i))->id);
  g_assert_cmpuint (a->area_loads->len, ==, b->area_loads->len);
  for (guint i = 0; i < a->area_loads->len; i++)
    {
      const TrbAreaLoad *la = g_ptr_array_index (a->area_loads, i);
      const TrbAreaLoad *lb = g_ptr_array_index (b->area_loads, i);

      g_assert_cmpint (la->lcase, ==, lb->lcase);
      g_assert_cmpint (la->kind, ==, lb->kind);
      assert_same_double (la->pressure, lb->pressure);
      g_assert_cmpstr (la->label, ==, lb->label);
      g_assert_cmpstr (la->occupancy, ==, lb->occupancy);
      assert_same_points (la->points, lb->points);
    }
  g_assert_cmpuint (a->openings->len, ==, b->openings->len);
  for (guint i = 0; i < a->openings->len; i++)
    assert_same_points (((TrbOpening *) g_ptr_array_index (a->openings, i))->points,
                        ((TrbOpening *) g_ptr_array_index (b->openings, i))->points);
  g_assert_cmpuint (a->line_loads->len, ==, b->line_loads->len);
  for (guint i = 0; i < a->line_loads->len; i++)
    {
      const TrbLineLoad *la = g_ptr_array_index (a->line_loads, i);
      const TrbLineLoad *lb = g_ptr_array_index (b->line_loads, i);

      g_assert_cmpint (la->lcase, ==, lb->lcase);
      assert_same_double (la->w, lb->w);
      g_assert_cmpstr (la->label, ==, lb->label);
      assert_same_points (la->points, lb->points);
    }
  g_assert_cmpuint (a->point_loads->len, ==, b->point_loads->len);
  for (guint i = 0; i < a->point_loads->len; i++)
    {
      const TrbPointLoad *la = g_ptr_array_index (a->point_loads, i);
      const TrbPointLoad *lb = g_ptr_array_index (b->point_loads, i);

      g_assert_cmpint (la->lcase, ==, lb->lcase);
      assert_same_double (la->P, lb->P);
      g_assert_cmpstr (la->label, ==, lb->label);
      assert_same_double (la->at.x, lb->at.x);
      assert_same_double (la->at.y, lb->at.y);
    }
}

/* Two models equal in every field but file lines and display names. Members are matched by
 * mark: saving writes the standalone beams before the floors. */
static void
assert_same_project (const TrbProject *a,
                     const TrbProject *b)
{
  const TrbSettings *sa = &a->settings, *sb = &b->settings;

  g_assert_cmpint (a->format, ==, b->format);
  g_assert_cmpint (sa->method, ==, sb->method);
  assert_same_double (sa->fb_allow, sb->fb_allow);
  assert_same_double (sa->fv_allow, sb->fv_allow);
  g_assert_cmpstr (sa->steel_grade, ==, sb->steel_grade);
  g_assert_cmpint (sa->self_weight, ==, sb->self_weight);
  g_assert_cmpint (sa->live_patterns, ==, sb->live_patterns);
  assert_same_double (sa->deflection_live, sb->deflection_live);
  assert_same_double (sa->deflection_total, sb->deflection_total);
  g_assert_cmpint (sa->units, ==, sb->units);
  g_assert_cmpint (sa->live_load_reduction, ==, sb->live_load_reduction);
  g_assert_cmpint (sa->floors_above, ==, sb->floors_above);

  g_assert_cmpuint (a->sections_sources->len, ==, b->sections_sources->len);
  for (guint i = 0; i < a->sections_sources->len; i++)
    {
      const TrbSectionsSource *xa = g_ptr_array_index (a->sections_sources, i);
      const TrbSectionsSource *xb = g_ptr_array_index (b->sections_sources, i);

      g_assert_cmpstr (xa->file, ==, xb->file);
      g_assert_cmpstr (xa->csv, ==, xb->csv);
    }
  g_assert_cmpint (a->sections == NULL, ==, b->sections == NULL);

  g_assert_cmpuint (a->members->len, ==, b->members->len);
  for (guint i = 0; i < a->members->len; i++)
    {
      const TrbMember *ma = g_ptr_array_index (a->members, i);
      const TrbMember *mb = trb_project_find_member (b, ma->id);

      g_assert_nonnull (mb);
      assert_same_member (ma, mb);
    }
  g_assert_cmpuint (a->floors->len, ==, b->floors->len);
  for (guint i = 0; i < a->floors->len; i++)
    assert_same_floor (g_ptr_array_index (a->floors, i), g_ptr_array_index (b->floors, i));
}

/* load -> save -> load -> save: the same bytes twice, the same model three times, and the
 * saved text within the schema. */
static void
test_round_trip (gconstpointer data)
{
  const char *path = data;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) first = trb_project_load_file (path, &error);
  g_autoptr(TrbProject) second = NULL;
  g_autoptr(TrbProject) third = NULL;
  g_autofree char *saved1 = NULL;
  g_autofree char *saved2 = NULL;
  gsize n1, n2;

  g_assert_no_error (error);
  saved1 = trb_project_save_data (first, &n1, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (strlen (saved1), ==, n1);
  g_assert_true (trb_project_check_schema (saved1, n1, "saved", &error));
  g_assert_no_error (error);

  second = trb_project_load_data (saved1, n1, "saved", &error);
  g_assert_no_error (error);
  assert_same_project (first, second);
  saved2 = trb_project_save_data (second, &n2, &error);
  g_assert_no_error (error);
  g_assert_cmpmem (saved1, n1, saved2, n2);

  third = trb_project_load_data (saved2, n2, "saved again", &error);
  g_assert_no_error (error);
  assert_same_project (first, third);
}

/* The layout the saver promises: declaration, 2-space indent, one element per line, the
 * fixed attribute order, the project's units; comments are not kept. 312 in stays 312 in: as
 * doubles, 312 x 0.0254 falls one bit short of 26 x 0.3048, and "26 ft" would not read back
 * to it. "350 lb/ft" is written "350 plf": both US line-load units read it back exactly, and
 * "350" is shorter than "0.35". */
static void
test_save_layout (void)
{
  const char *text =
    "<!-- a comment -->\n"
    "<trabeate-project format=\"1\">\n"
    "  <beam material=\"steel\" length=\"26 ft\" id=\"B1\"><!-- another -->\n"
    "    <load w=\"350 lb/ft\" to=\"26 ft\" from=\"0 ft\" type=\"uniform\" case=\"D\"/>\n"
    "    <support type=\"pin\" at=\"0 in\"/><support type=\"roller\" at=\"312 in\"/>\n"
    "  </beam>\n"
    "</trabeate-project>\n";
  const char *expected =
    "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
    "<trabeate-project format=\"1\">\n"
    "  <settings method=\"asd\" steel-grade=\"A992\" self-weight=\"include\" "
    "live-patterns=\"on\" deflection-live=\"L/360\" deflection-total=\"L/240\" units=\"us\" "
    "live-load-reduction=\"off\" floors-above=\"0\"/>\n"
    "  <beam id=\"B1\" length=\"26 ft\" material=\"steel\" section=\"auto\">\n"
    "    <support at=\"0 ft\" type=\"pin\"/>\n"
    "    <support at=\"312 in\" type=\"roller\"/>\n"
    "    <load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"26 ft\" w=\"350 plf\"/>\n"
    "  </beam>\n"
    "</trabeate-project>\n";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (text, strlen (text), "t", &error);
  g_autofree char *saved = NULL;

  g_assert_no_error (error);
  saved = trb_project_save_data (p, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (saved, ==, expected);
}

/* Text that XML would otherwise change on reading: quotes, ampersands, angle brackets, tabs
 * and line feeds in a label survive a round trip. */
static void
test_save_escapes (void)
{
  g_autoptr(TrbProject) p = trb_project_new ();
  TrbFloor *f = trb_floor_new ("A & B <\"main\">");
  TrbPointLoad *pl = trb_point_load_new (TRB_CASE_L, 1000, (TrbFramePoint) { 1, 2 },
                                         "line 1\nline 2\ttab & \"quote\" <x>");
  g_autoptr(TrbProject) q = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *saved = NULL;
  gsize n;

  trb_project_add_floor (p, f);
  g_ptr_array_add (f->point_loads, pl);
  saved = trb_project_save_data (p, &n, &error);
  g_assert_no_error (error);
  q = trb_project_load_data (saved, n, "escapes", &error);
  g_assert_no_error (error);
  assert_same_project (p, q);
}

/* A model holding a number that is not finite cannot be saved, and says where. */
static void
test_save_not_finite (void)
{
  g_autoptr(TrbProject) p = trb_project_new ();
  TrbMember *m = trb_member_new ("B7");
  g_autoptr(GError) error = NULL;
  g_autofree char *saved = NULL;

  m->length = INFINITY;
  trb_project_add_member (p, m);
  saved = trb_project_save_data (p, NULL, &error);
  g_assert_null (saved);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_cmpstr (error->message, ==, "beam \"B7\": \"length\" is not a finite number");
}

/* Random values in every dimension, both unit systems, and values on a grid of round numbers
 * in each unit: each saves to a text that reads back to exactly the same double, and saving
 * again gives the same bytes. */
static void
test_save_random_values (void)
{
  static const TrbDimension dims[] = {
    TRB_DIM_LENGTH, TRB_DIM_FORCE, TRB_DIM_LINE_LOAD, TRB_DIM_AREA_LOAD, TRB_DIM_MOMENT,
  };
  static const double round[] = {
    TRB_FT, TRB_IN, TRB_KIP, TRB_LBF, TRB_KLF, TRB_PLF, TRB_PSF, TRB_KIP_FT, 1, 1e-3, 1e3,
  };

  for (int system = 0; system < 2; system++)
    for (int round_trip = 0; round_trip < 400; round_trip++)
      {
        g_autoptr(TrbProject) p = trb_project_new ();
        g_autoptr(TrbProject) q = NULL;
        TrbFloor *f = trb_floor_new ("R");
        TrbMember *m = trb_member_new ("M");
        TrbMemberLoad l = { TRB_CASE_L, { 0 }, 0 };
        g_autoptr(GError) error = NULL;
        g_autofree char *s1 = NULL;
        g_autofree char *s2 = NULL;
        gsize n1, n2;
        double v[6];

        p->settings.units = system == 0 ? TRB_UNIT_SYSTEM_US : TRB_UNIT_SYSTEM_SI;
        for (guint i = 0; i < G_N_ELEMENTS (v); i++)
          {
            /* half random doubles over many magnitudes, half round numbers of a unit */
            if (round_trip % 2 == 0)
              v[i] = g_test_rand_double_range (-1, 1) * pow (10, g_test_rand_int_range (-3, 7));
            else
              v[i] = g_test_rand_int_range (-2000, 2000) / 8.0 *
                     round[g_test_rand_int_range (0, G_N_ELEMENTS (round))];
          }
        trb_project_add_floor (p, f);
        trb_member_set_plan (m, (TrbFramePoint) { v[0], v[1] },
                             (TrbFramePoint) { v[0] + fabs (v[2]) + 1, v[1] });
        l.load.kind = TRB_LOAD_POINT;
        l.load.a = l.load.b = 0.5;
        l.load.w1 = v[3];
        g_array_append_val (m->loads, l);
        trb_floor_add_member (p, f, m);
        g_ptr_array_add (f->area_loads,
                         trb_area_load_new (TRB_CASE_D, TRB_AREA_LOAD_ORDINARY, v[4], NULL,
                                            NULL));
        for (int k = 0; k < 3; k++)
          trb_points_append (((TrbAreaLoad *) g_ptr_array_index (f->area_loads, 0))->points,
                             v[k], v[(k + 5) % 6]);
        g_ptr_array_add (f->line_loads, trb_line_load_new (TRB_CASE_S, v[5], NULL));
        trb_points_append (((TrbLineLoad *) g_ptr_array_index (f->line_loads, 0))->points,
                           v[5], v[4]);
        trb_points_append (((TrbLineLoad *) g_ptr_array_index (f->line_loads, 0))->points,
                           v[3], v[2]);
        g_ptr_array_add (f->point_loads, trb_point_load_new (TRB_CASE_D, v[2] * 1e3,
                                                             (TrbFramePoint) { v[1], v[0] },
                                                             NULL));

        s1 = trb_project_save_data (p, &n1, &error);
        g_assert_no_error (error);
        q = trb_project_load_data (s1, n1, "random", &error);
        g_assert_no_error (error);
        assert_same_project (p, q);
        s2 = trb_project_save_data (q, &n2, &error);
        g_assert_no_error (error);
        g_assert_cmpmem (s1, n1, s2, n2);
      }
  (void) dims;
}

/* One value through the quick way and the plain one (printf and the parser for every
 * candidate, trb_project_format_quantity() with plain): the same text. */
static guint
check_format (double        v,
              TrbDimension  dim,
              TrbUnitSystem system)
{
  g_autofree char *quick = NULL;
  g_autofree char *plain = NULL;

  if (!isfinite (v))
    return 0;
  quick = trb_project_format_quantity (v, dim, system, FALSE);
  plain = trb_project_format_quantity (v, dim, system, TRUE);
  if (g_strcmp0 (quick, plain) != 0)
    g_error ("%.17g (dimension %d, system %d): quick \"%s\", plain \"%s\"", v, dim, system,
             quick, plain);
  return 1;
}

/* The quick formatting of quantities (digits without printf, read back without strtod) gives
 * the same text as the plain way, for every dimension in both systems: values read from
 * texts in every unit of the file (as a loaded file holds them: "241.375 in", "12 ft 7.5 in",
 * "1.5e-7 m4"), their neighbours a few units in the last place away, random doubles from
 * 1e-30 to 1e30, and the edges (zero, -0, the ends of the plain decimal range 1e-4 and 1e7,
 * the largest and smallest doubles, halfway cases). The expected texts are the plain way's,
 * the code the save used before the quick one (common practice: a new path held to the old). */
static void
test_save_quick_format (void)
{
  /* the units the saver writes in either system, and SI base units */
  static const char * const file_units[TRB_N_DIMS][6] = {
    [TRB_DIM_LENGTH] = { "ft", "in", "m", "mm", NULL },
    [TRB_DIM_FORCE] = { "kip", "lb", "kN", "N", NULL },
    [TRB_DIM_LINE_LOAD] = { "kip/ft", "plf", "kN/m", "N/m", NULL },
    [TRB_DIM_AREA_LOAD] = { "psf", "ksf", "kPa", "Pa", NULL },
    [TRB_DIM_MOMENT] = { "kip*ft", "lb*ft", "kN*m", "N*m", NULL },
    [TRB_DIM_STRESS] = { "ksi", "psi", "MPa", "GPa", "Pa", NULL },
    [TRB_DIM_AREA] = { "in2", "mm2", "m2", NULL },
    [TRB_DIM_SECTION_MODULUS] = { "in3", "mm3", "m3", NULL },
    [TRB_DIM_INERTIA] = { "in4", "mm4", "m4", NULL },
    [TRB_DIM_WARPING] = { "in6", "mm6", "m6", NULL },
    [TRB_DIM_WEIGHT_PER_LENGTH] = { "lb/ft", "kg/m", "N/m", NULL },
    [TRB_DIM_DENSITY] = { "pcf", "kN/m3", "N/m3", NULL },
  };
  static const double edges[] = {
    0, -0.0, 1e-4, 1e7, 9999999.5, 0.5, 1.5, 2.5, 0.125, 1e-22, 1e22, 1e23, 1e-23,
    123456789012345, 1234567890123456, 0.1, 0.2, 0.3, 1.0 / 3, 2.0 / 3, 1e-300, 1e300,
    DBL_MIN, DBL_MAX, 4.9e-324, 12 * 0.3048, 0.3048, 0.0254,
  };
  guint checked = 0;

  for (int system = 0; system < 2; system++)
    for (int d = 0; d < TRB_N_DIMS; d++)
      {
        TrbUnitSystem sys = system == 0 ? TRB_UNIT_SYSTEM_US : TRB_UNIT_SYSTEM_SI;
        const char * const *units = file_units[d];

        for (guint i = 0; i < G_N_ELEMENTS (edges); i++)
          for (int sign = -1; sign <= 1; sign += 2)
            for (int ulps = -2; ulps <= 2; ulps++)
              {
                double v = sign * edges[i];

                for (int k = 0; k < abs (ulps); k++)
                  v = nextafter (v, ulps < 0 ? -INFINITY : INFINITY);
                checked += check_format (v, d, sys);
              }
        for (int r = 0; r < 300; r++)
          {
            double v = g_test_rand_double_range (-1, 1) * pow (10, g_test_rand_int_range (-30,
                                                                                        30));

            checked += check_format (v, d, sys);
          }
        for (guint u = 0; units[u] != NULL; u++)
          for (int r = 0; r < 60; r++)
            {
              g_autofree char *text = NULL;
              double v;

              /* whole numbers, a few decimals, eighths, and short forms with an exponent */
              switch (r % 4)
                {
                case 0:
                  text = g_strdup_printf ("%d %s", g_test_rand_int_range (-5000, 5000),
                                          units[u]);
                  break;
                case 1:
                  text = g_strdup_printf ("%d.%d %s", g_test_rand_int_range (-500, 500),
                                          g_test_rand_int_range (0, 100000), units[u]);
                  break;
                case 2:
                  text = g_strdup_printf ("%g %s", g_test_rand_int_range (-4000, 4000) / 8.0,
                                          units[u]);
                  break;
                default:
                  text = g_strdup_printf ("%de%d %s", g_test_rand_int_range (1, 999),
                                          g_test_rand_int_range (-12, 12), units[u]);
                  break;
                }
              g_assert_true (trb_units_parse (text, d, &v, NULL));
              for (int ulps = -3; ulps <= 3; ulps++)
                {
                  double w = v;

                  for (int k = 0; k < abs (ulps); k++)
                    w = nextafter (w, ulps < 0 ? -INFINITY : INFINITY);
                  checked += check_format (w, d, sys);
                }
            }
        if (d == TRB_DIM_LENGTH)
          for (int r = 0; r < 400; r++)
            {
              g_autofree char *text = g_strdup_printf ("%d ft %g in",
                                                       g_test_rand_int_range (1, 2000),
                                                       g_test_rand_int_range (0, 96) / 8.0);
              double v;

              g_assert_true (trb_units_parse (text, d, &v, NULL));
              checked += check_format (v, d, sys) + check_format (-v, d, sys) +
                         check_format (nextafter (v, 0), d, sys) +
                         check_format (nextafter (v, INFINITY), d, sys);
            }
      }
  g_assert_cmpuint (checked, >, 40000);
}

/* The line of member "Z" in a saved project */
static char *
member_z_line (const char *saved)
{
  const char *start = strstr (saved, "<member id=\"Z\"");
  const char *end;

  g_assert_nonnull (start);
  end = strchr (start, '\n');
  g_assert_nonnull (end);
  return g_strndup (start, (gsize) (end - start));
}

static char *
save_floor_with_z (guint           n_before,
                   const double   *pool,
                   guint           n_pool,
                   const double   *z)
{
  g_autoptr(TrbProject) p = trb_project_new ();
  TrbFloor *f = trb_floor_new ("F");
  TrbMember *m;
  g_autoptr(GError) error = NULL;
  char *saved;

  trb_project_add_floor (p, f);
  for (guint i = 0; i < n_before; i++)
    {
      g_autofree char *id = g_strdup_printf ("M%u", i);

      m = trb_member_new (id);
      trb_member_set_plan (m, (TrbFramePoint) { pool[i % n_pool], pool[(i + 1) % n_pool] },
                           (TrbFramePoint) { pool[(i + 2) % n_pool], pool[(i * 7) % n_pool] });
      trb_floor_add_member (p, f, m);
    }
  /* the same doubles as a length and as a force */
  for (guint i = 0; i < MIN (n_pool, 50); i++)
    g_ptr_array_add (f->point_loads, trb_point_load_new (TRB_CASE_D, pool[i],
                                                         (TrbFramePoint) { pool[i], 0 },
                                                         NULL));
  m = trb_member_new ("Z");
  trb_member_set_plan (m, (TrbFramePoint) { z[0], z[1] }, (TrbFramePoint) { z[2], z[3] });
  trb_floor_add_member (p, f, m);
  saved = trb_project_save_data (p, NULL, &error);
  g_assert_no_error (error);
  return saved;
}

/* The save keeps the text of each value once formatted (a memo by value and dimension): a
 * member's line is the same whether its values are new to the save or seen before as
 * coordinates and as forces, and past the memo's size limit (70,000 distinct values). The
 * expected line is that of the member saved alone (common practice: the memo must not show). */
static void
test_save_memo (void)
{
  double pool[64];
  double z[4] = { 3.048, 0.0254 * 250.5, -12.5 * 0.3048, 4.4482216152605 };
  g_autofree char *alone = NULL;
  g_autofree char *alone_line = NULL;
  g_autofree double *many = g_new (double, 70000);

  for (guint i = 0; i < G_N_ELEMENTS (pool); i++)
    pool[i] = i < 4 ? z[i] : g_test_rand_double_range (-100, 100);
  for (guint i = 0; i < 70000; i++)
    many[i] = (i + 1) * 0.001;

  alone = save_floor_with_z (0, pool + 4, 1, z);
  alone_line = member_z_line (alone);
  for (int round = 0; round < 2; round++)
    {
      g_autofree char *saved = round == 0 ? save_floor_with_z (200, pool, 64, z)
                                          : save_floor_with_z (17500, many, 70000, z);
      g_autofree char *line = member_z_line (saved);

      g_assert_cmpstr (line, ==, alone_line);
    }
}

static char *
read_all (const char *path,
          gsize      *n)
{
  char *text = NULL;

  g_assert_true (g_file_get_contents (path, &text, n, NULL));
  return text;
}

static guint
count_files (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  guint n = 0;

  g_assert_nonnull (d);
  while (g_dir_read_name (d) != NULL)
    n++;
  return n;
}

/* Saving writes a new file beside the old and renames it over: a save that fails part way
 * leaves the old file whole and no stray file; a folder that is not there is an error naming
 * the file; a good save keeps the file's permissions. */
static void
test_save_atomic (void)
{
  g_autofree char *src = g_test_build_filename (G_TEST_DIST, "data", "floor-two-levels.trabeate",
                                                NULL);
  g_autofree char *dir = g_dir_make_tmp ("trb-save-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "plan.trabeate", NULL);
  g_autofree char *gone = g_build_filename (dir, "gone", "plan.trabeate", NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_file (src, &error);
  g_autoptr(TrbProject) big = trb_project_new ();
  g_autofree char *expected = NULL;
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  gsize n_expected, n_before, n_after;
  struct rlimit old_limit, limit;
  GStatBuf st;
  gboolean ok;

  g_assert_no_error (error);

  /* a good save: the bytes of trb_project_save_data(), and the permissions kept */
  g_assert_true (trb_project_save_file (p, path, &error));
  g_assert_no_error (error);
  expected = trb_project_save_data (p, &n_expected, &error);
  before = read_all (path, &n_before);
  g_assert_cmpmem (expected, n_expected, before, n_before);
  g_assert_cmpint (g_chmod (path, 0640), ==, 0);
  g_assert_true (trb_project_save_file (p, path, &error));
  g_assert_cmpint (g_stat (path, &st), ==, 0);
  g_assert_cmpint (st.st_mode & 0777, ==, 0640);
  g_assert_cmpuint (count_files (dir), ==, 1);

  /* a folder that is not there */
  ok = trb_project_save_file (p, gone, &error);
  g_assert_false (ok);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
  g_assert_true (g_str_has_prefix (error->message, gone));
  g_assert_nonnull (strstr (error->message, ": cannot save: "));
  g_clear_error (&error);

  /* A write that fails part way over the existing file. The file size limit makes the write
   * fail for any user, root included (who may write into a read-only folder): 100 members
   * take well over the 4 KiB allowed. */
  for (int i = 0; i < 100; i++)
    {
      g_autofree char *id = g_strdup_printf ("B%d", i);
      TrbMember *m = trb_member_new (id);

      m->length = 3 + i;
      trb_project_add_member (big, m);
    }
  g_assert_cmpint (getrlimit (RLIMIT_FSIZE, &old_limit), ==, 0);
  limit = old_limit;
  limit.rlim_cur = 4096;
  signal (SIGXFSZ, SIG_IGN);
  g_assert_cmpint (setrlimit (RLIMIT_FSIZE, &limit), ==, 0);
  ok = trb_project_save_file (big, path, &error);
  g_assert_cmpint (setrlimit (RLIMIT_FSIZE, &old_limit), ==, 0);
  g_assert_false (ok);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
  g_assert_true (g_str_has_prefix (error->message, path));
  after = read_all (path, &n_after);
  g_assert_cmpmem (before, n_before, after, n_after);
  g_assert_cmpuint (count_files (dir), ==, 1);
  g_clear_error (&error);

  /* a read-only folder, for users it binds */
  if (geteuid () != 0)
    {
      g_autofree char *again = NULL;
      gsize n_again;

      g_assert_cmpint (g_chmod (dir, 0555), ==, 0);
      ok = trb_project_save_file (big, path, &error);
      g_assert_cmpint (g_chmod (dir, 0755), ==, 0);
      g_assert_false (ok);
      g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
      again = read_all (path, &n_again);
      g_assert_cmpmem (before, n_before, again, n_again);
    }

  g_assert_cmpint (g_remove (path), ==, 0);
  g_assert_cmpint (g_rmdir (dir), ==, 0);
}

/* Saving through a symbolic link replaces the file it points to and keeps the link. */
static void
test_save_symlink (void)
{
  g_autofree char *dir = g_dir_make_tmp ("trb-link-XXXXXX", NULL);
  g_autofree char *real = g_build_filename (dir, "real.trabeate", NULL);
  g_autofree char *link = g_build_filename (dir, "link.trabeate", NULL);
  g_autoptr(TrbProject) p = trb_project_new ();
  g_autoptr(GError) error = NULL;
  g_autofree char *saved = NULL;
  g_autofree char *expected = NULL;
  gsize n, n_expected;

  g_assert_true (g_file_set_contents (real, "old", -1, NULL));
  g_assert_cmpint (symlink ("real.trabeate", link), ==, 0);
  g_assert_true (trb_project_save_file (p, link, &error));
  g_assert_no_error (error);
  g_assert_true (g_file_test (link, G_FILE_TEST_IS_SYMLINK));
  saved = read_all (real, &n);
  expected = trb_project_save_data (p, &n_expected, &error);
  g_assert_cmpmem (saved, n, expected, n_expected);
  g_remove (link);
  g_remove (real);
  g_rmdir (dir);
}

/* The schema accepts every sample and example (also by itself, without the loader's checks),
 * and refuses what it should with the line. */
static void
test_schema (void)
{
  const char *dirs[] = { "data", "../data/examples" };
  const char *unknown =
    "<trabeate-project format=\"1\">\n"
    "  <floor name=\"F\">\n"
    "    <column id=\"C1\" x=\"0 ft\" y=\"0 ft\"/>\n"
    "    <slab/>\n"
    "  </floor>\n"
    "</trabeate-project>\n";
  const char *few_points =
    "<trabeate-project format=\"1\">\n"
    "  <floor name=\"F\">\n"
    "    <opening>\n"
    "      <point x=\"0 ft\" y=\"0 ft\"/>\n"
    "    </opening>\n"
    "  </floor>\n"
    "</trabeate-project>\n";
  const char *wrong_load =
    "<trabeate-project format=\"1\">\n"
    "  <beam id=\"B\" length=\"1 m\" material=\"steel\">\n"
    "\n"
    "    <load case=\"D\" type=\"point\" at=\"0 m\" w=\"1 kN/m\"/>\n"
    "  </beam>\n"
    "</trabeate-project>\n";
  g_autoptr(GError) error = NULL;
  guint n = 0;

  for (guint k = 0; k < G_N_ELEMENTS (dirs); k++)
    {
      g_autofree char *dir = g_test_build_filename (G_TEST_DIST, dirs[k], NULL);
      g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
      const char *name;

      g_assert_nonnull (d);
      while ((name = g_dir_read_name (d)) != NULL)
        {
          g_autofree char *path = g_build_filename (dir, name, NULL);
          g_autofree char *text = NULL;
          gsize len;

          if (!g_str_has_suffix (name, ".trabeate"))
            continue;
          text = read_all (path, &len);
          if (!trb_project_check_schema (text, len, name, &error))
            g_error ("%s", error->message);
          n++;
        }
    }
  g_assert_cmpuint (n, >=, 9);

  g_assert_false (trb_project_check_schema (unknown, strlen (unknown), "u.trabeate", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message,
                                   "u.trabeate:4: does not match the project schema: "));
  g_assert_nonnull (strstr (error->message, "slab"));
  g_clear_error (&error);

  g_assert_false (trb_project_check_schema (few_points, strlen (few_points), "f", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, "f:3: does not match the project schema: "));
  g_clear_error (&error);

  g_assert_false (trb_project_check_schema (wrong_load, strlen (wrong_load), "w", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_true (g_str_has_prefix (error->message, "w:4: does not match the project schema: "));
  g_clear_error (&error);

  /* the loader's own checks come first and say it better */
  g_assert_null (trb_project_load_data (unknown, strlen (unknown), "u.trabeate", &error));
  g_assert_cmpstr (error->message, ==, "u.trabeate:4: unknown element <slab> inside <floor>");
}

/* The loader proves the common file valid by its own walk of the schema's rules and leaves
 * every value it is unsure of to libxml2: whatever the walk does, the loader must judge these
 * as the schema does, with the schema's own message where the schema refuses. Each document
 * passes the loader's hand checks, so only the schema step can refuse it. The verdicts
 * follow from data/trabeate-project.rng and XML Schema Part 2 (2nd ed., Appendix F, from
 * memory): a pattern's "." takes any character but line feed and carriage return, "\S" any
 * but those two, tab and space; "+1" and "01" are integers; a RELAX NG <value> of no type
 * is a token. */
static void
test_schema_proof (void)
{
  static const struct
  {
    const char *attrs;   /* on <beam> */
    const char *floor;   /* or a <floor> */
    gboolean    valid;
  } cases[] = {
    { "id=\"B1\"", NULL, TRUE },
    { "id=\"B&#9;1\"", NULL, TRUE },          /* a tab is a "." */
    { "id=\"B&#10;1\"", NULL, FALSE },        /* a line feed is not */
    { "id=\"B&#13;1\"", NULL, FALSE },        /* nor a carriage return */
    { "id=\"B1\" steel-grade=\" A992\"", NULL, TRUE },
    { "id=\"B1\" steel-grade=\"A992&#10;\"", NULL, FALSE },
    { "id=\"B1\" deflection-live=\"l/360\"", NULL, TRUE },
    { "id=\"B1\" max-plies=\"01\"", NULL, TRUE },
    { "id=\"B1\" max-plies=\"+1\"", NULL, TRUE },
    { NULL, "<floor name=\"F&#9;1\"/>", TRUE },
    { NULL, "<floor name=\"F\"><column id=\"C1\" x=\"0 ft\" y=\"0 ft\"/>"
            "<column id=\"C2\" x=\"10 ft\" y=\"0 ft\"/>"
            "<member id=\"M\" role=\"beam\" group=\"g&#10;\" x1=\"0 ft\" y1=\"0 ft\" "
            "x2=\"10 ft\" y2=\"0 ft\" material=\"steel\" section=\"W8X10\"/></floor>", FALSE },
    { NULL, "<floor name=\"F\"><column id=\"C1\" x=\"0 ft\" y=\"0 ft\"/>"
            "<column id=\"C2\" x=\"10 ft\" y=\"0 ft\"/>"
            "<member id=\"M\" role=\"beam\" x1=\"0 ft\" y1=\"0 ft\" x2=\"10 ft\" y2=\"0 ft\" "
            "material=\"steel\" section=\"W8X10\"/><point-load case=\"D\" p=\"1 kip\" "
            "x=\"5 ft\" y=\"0 ft\" label=\"a&#10;b\"/></floor>", TRUE },
    { NULL, "<!-- a comment --><?tool data?><floor name=\"F\"/>", TRUE },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *xml = NULL;
      g_autoptr(GError) load_error = NULL;
      g_autoptr(GError) schema_error = NULL;
      g_autoptr(TrbProject) p = NULL;
      gboolean schema_ok;

      if (cases[i].attrs != NULL)
        xml = g_strdup_printf ("<trabeate-project format=\"1\">\n<beam %s length=\"10 ft\" "
                               "material=\"steel\" section=\"W8X10\">\n<support at=\"0 ft\" "
                               "type=\"pin\"/><support at=\"10 ft\" type=\"roller\"/>\n"
                               "</beam>\n</trabeate-project>\n", cases[i].attrs);
      else
        xml = g_strdup_printf ("<trabeate-project format=\"1\">\n%s\n</trabeate-project>\n",
                               cases[i].floor);
      p = trb_project_load_data (xml, strlen (xml), "p.trabeate", &load_error);
      schema_ok = trb_project_check_schema (xml, strlen (xml), "p.trabeate", &schema_error);
      g_assert_cmpint (schema_ok, ==, cases[i].valid);
      if (cases[i].valid)
        {
          g_assert_no_error (load_error);
          g_assert_nonnull (p);
        }
      else
        {
          g_assert_null (p);
          g_assert_error (load_error, TRB_ERROR, TRB_ERROR_INVALID);
          g_assert_cmpstr (load_error->message, ==, schema_error->message);
        }
    }
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
  g_test_add_func ("/trb/project-io/floor", test_floor);
  g_test_add_func ("/trb/project-io/settings-defaults", test_settings_defaults);
  g_test_add_func ("/trb/project-io/save-layout", test_save_layout);
  g_test_add_func ("/trb/project-io/save-escapes", test_save_escapes);
  g_test_add_func ("/trb/project-io/save-not-finite", test_save_not_finite);
  g_test_add_func ("/trb/project-io/save-random-values", test_save_random_values);
  g_test_add_func ("/trb/project-io/save-quick-format", test_save_quick_format);
  g_test_add_func ("/trb/project-io/save-memo", test_save_memo);
  g_test_add_func ("/trb/project-io/save-atomic", test_save_atomic);
  g_test_add_func ("/trb/project-io/save-symlink", test_save_symlink);
  g_test_add_func ("/trb/project-io/schema", test_schema);
  g_test_add_func ("/trb/project-io/schema/proof", test_schema_proof);

  /* load, save, load, save every sample and example */
  {
    const char *dirs[] = { "data", "../data/examples" };

    for (guint k = 0; k < G_N_ELEMENTS (dirs); k++)
      {
        g_autofree char *sdir = g_test_build_filename (G_TEST_DIST, dirs[k], NULL);
        g_autoptr(GDir) sd = g_dir_open (sdir, 0, NULL);
        g_autoptr(GPtrArray) files = g_ptr_array_new_with_free_func (g_free);

        g_assert_nonnull (sd);
        while ((name = g_dir_read_name (sd)) != NULL)
          if (g_str_has_suffix (name, ".trabeate"))
            g_ptr_array_add (files, g_strdup (name));
        g_ptr_array_sort (files, compare_names);
        for (guint i = 0; i < files->len; i++)
          {
            const char *n = g_ptr_array_index (files, i);
            g_autofree char *stem = g_strndup (n, strlen (n) - strlen (".trabeate"));
            g_autofree char *test = g_strdup_printf ("/trb/project-io/round-trip/%s", stem);

            g_test_add_data_func_full (test, g_build_filename (sdir, n, NULL), test_round_trip,
                                       g_free);
          }
      }
  }

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
