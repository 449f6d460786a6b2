/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-edit.h"
#include "trb-error.h"
#include "trb-project-io.h"
#include "trb-units.h"

/* Every field of the model as text, numbers in C99 hexadecimal so that two dumps are equal
 * only when every double is equal bit for bit; array order included. */
static void
dump_points (GString      *s,
             const GArray *points)
{
  for (guint i = 0; i < points->len; i++)
    {
      const TrbFramePoint *p = &g_array_index (points, TrbFramePoint, i);

      g_string_append_printf (s, " (%a %a)", p->x, p->y);
    }
  g_string_append_c (s, '\n');
}

static void
dump_member (GString         *s,
             const TrbMember *m)
{
  g_string_append_printf (s, "member %s line %d L %a mat %d sec %s\n", m->id, m->line, m->length,
                          m->material, m->section);
  g_string_append_printf (s, " custom %a %a %a %a %a %a w %a\n", m->E, m->I, m->S, m->A, m->d,
                          m->tw, m->weight);
  g_string_append_printf (s, " method %d %d fb %a fv %a grade %s dl %a dt %a bracing %d\n",
                          m->has_method, m->method, m->fb_allow, m->fv_allow,
                          m->steel_grade ? m->steel_grade : "-", m->deflection_live,
                          m->deflection_total, m->bracing);
  g_string_append_printf (s, " depth %a %a plies %d wood %s %s %d %d %d %a\n", m->max_depth,
                          m->min_depth, m->max_plies, m->species ? m->species : "-",
                          m->grade ? m->grade : "-", m->wet_service, m->incised, m->repetitive,
                          m->bearing_length);
  if (m->allowed != NULL)
    for (guint i = 0; m->allowed[i] != NULL; i++)
      g_string_append_printf (s, " allowed %s\n", m->allowed[i]);
  g_string_append_printf (s, " floor %s plan (%a %a) (%a %a) role %d deck %d group %s\n",
                          m->floor ? m->floor->name : "-", m->start.x, m->start.y, m->end.x,
                          m->end.y, m->role, m->carries_deck, m->group ? m->group : "-");
  for (guint i = 0; i < m->supports->len; i++)
    {
      const TrbMemberSupport *su = &g_array_index (m->supports, TrbMemberSupport, i);

      g_string_append_printf (s, " support %a %d %d\n", su->support.x, su->support.type,
                              su->line);
    }
  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *l = &g_array_index (m->loads, TrbMemberLoad, i);

      g_string_append_printf (s, " load %d %d %a %a %a %a %d\n", l->lcase, l->load.kind,
                              l->load.a, l->load.b, l->load.w1, l->load.w2, l->line);
    }
  for (guint i = 0; i < m->braces->len; i++)
    {
      const TrbMemberBrace *b = &g_array_index (m->braces, TrbMemberBrace, i);

      g_string_append_printf (s, " brace %a %d\n", b->x, b->line);
    }
  g_string_append (s, " bears-on");
  dump_points (s, m->bearing_points);
}

static char *
dump_project (const TrbProject *p)
{
  GString *s = g_string_new (NULL);
  const TrbSettings *st = &p->settings;

  g_string_append_printf (s, "format %d name %s\n", p->format, p->name ? p->name : "-");
  g_string_append_printf (s, "settings %d %a %a %s %d %d %a %a %d %d %d %d\n", st->method,
                          st->fb_allow, st->fv_allow, st->steel_grade, st->self_weight,
                          st->live_patterns, st->deflection_live, st->deflection_total,
                          st->units, st->live_load_reduction, st->floors_above, st->line);
  for (guint i = 0; i < p->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (p->members, i);

      dump_member (s, m);
      /* the id index must find every member under its mark */
      g_assert_true (trb_project_find_member (p, m->id) == m);
    }
  for (guint f = 0; f < p->floors->len; f++)
    {
      const TrbFloor *fl = g_ptr_array_index (p->floors, f);

      g_string_append_printf (s, "floor %s %d\n", fl->name, fl->line);
      for (guint i = 0; i < fl->grids->len; i++)
        {
          const TrbGridLine *g = g_ptr_array_index (fl->grids, i);

          g_string_append_printf (s, "grid %s (%a %a) (%a %a) %d\n", g->name, g->start.x,
                                  g->start.y, g->end.x, g->end.y, g->line);
        }
      for (guint i = 0; i < fl->columns->len; i++)
        {
          const TrbColumn *c = g_ptr_array_index (fl->columns, i);

          g_string_append_printf (s, "column %s (%a %a) %s %d\n", c->id, c->at.x, c->at.y,
                                  c->section ? c->section : "-", c->line);
        }
      for (guint i = 0; i < fl->walls->len; i++)
        {
          const TrbWall *w = g_ptr_array_index (fl->walls, i);

          g_string_append_printf (s, "wall %s %s %d", w->id, w->material ? w->material : "-",
                                  w->line);
          dump_points (s, w->points);
        }
      for (guint i = 0; i < fl->members->len; i++)
        g_string_append_printf (s, "floor member %s\n",
                                ((const TrbMember *) g_ptr_array_index (fl->members, i))->id);
      for (guint i = 0; i < fl->area_loads->len; i++)
        {
          const TrbAreaLoad *a = g_ptr_array_index (fl->area_loads, i);

          g_string_append_printf (s, "area %d %d %a %s %s %d", a->lcase, a->kind, a->pressure,
                                  a->label ? a->label : "-", a->occupancy ? a->occupancy : "-",
                                  a->line);
          dump_points (s, a->points);
        }
      for (guint i = 0; i < fl->openings->len; i++)
        {
          const TrbOpening *o = g_ptr_array_index (fl->openings, i);

          g_string_append_printf (s, "opening %d", o->line);
          dump_points (s, o->points);
        }
      for (guint i = 0; i < fl->line_loads->len; i++)
        {
          const TrbLineLoad *l = g_ptr_array_index (fl->line_loads, i);

          g_string_append_printf (s, "line %d %a %s %d", l->lcase, l->w,
                                  l->label ? l->label : "-", l->line);
          dump_points (s, l->points);
        }
      for (guint i = 0; i < fl->point_loads->len; i++)
        {
          const TrbPointLoad *pl = g_ptr_array_index (fl->point_loads, i);

          g_string_append_printf (s, "point %d %a (%a %a) %s %d\n", pl->lcase, pl->P, pl->at.x,
                                  pl->at.y, pl->label ? pl->label : "-", pl->line);
        }
    }
  return g_string_free (s, FALSE);
}

/* The project as the file format writes it (canonical and byte-stable). */
static char *
save_bytes (const TrbProject *p)
{
  g_autoptr(GError) error = NULL;
  gsize length = 0;
  char *data = trb_project_save_data (p, &length, &error);

  g_assert_no_error (error);
  g_assert_nonnull (data);
  g_assert_cmpuint (strlen (data), ==, length);
  return data;
}

static TrbProject *
load_mezzanine (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data",
                                                 "floor-mezzanine.trabeate", NULL);
  TrbProject *p = trb_project_load_file (path, &error);

  g_assert_no_error (error);
  g_assert_nonnull (p);
  return p;
}

static TrbFloor *
first_floor (TrbProject *p)
{
  g_assert_cmpuint (p->floors->len, >=, 1);
  return g_ptr_array_index (p->floors, 0);
}

static TrbMember *
plan_member (const char *id,
             double      x1,
             double      y1,
             double      x2,
             double      y2)
{
  TrbMember *m = trb_member_new (id);

  m->start.x = x1;
  m->start.y = y1;
  m->end.x = x2;
  m->end.y = y2;
  trb_member_set_role (m, TRB_FRAME_ROLE_BEAM);
  return m;
}

/* Pushes a command that must be allowed. */
static void
push_ok (TrbEditHistory *h,
         TrbEditCommand *c,
         GError         *error)
{
  g_assert_no_error (error);
  g_assert_nonnull (c);
  trb_edit_history_push (h, c);
}

static void
test_add_remove_member (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
  g_autoptr(GError) error = NULL;
  g_autofree char *before = dump_project (p);
  g_autofree char *after = NULL;
  TrbFloor *floor = first_floor (p);
  guint n_members = p->members->len, n_floor = floor->members->len;
  TrbMember *m;
  TrbEditCommand *c;

  /* 3 m by 4 m: a 5 m member (the 3-4-5 right triangle) */
  c = trb_edit_add_member (p, floor, plan_member ("B9", 1, 2, 4, 6), &error);
  push_ok (h, c, error);
  m = trb_project_find_member (p, "B9");
  g_assert_nonnull (m);
  g_assert_true (m->floor == floor);
  g_assert_cmpfloat_with_epsilon (m->length, 5.0, 1e-12);
  g_assert_cmpuint (p->members->len, ==, n_members + 1);
  g_assert_cmpuint (floor->members->len, ==, n_floor + 1);
  g_assert_cmpstr (trb_edit_history_get_undo_label (h), ==, "Add B9");
  after = dump_project (p);

  g_assert_true (trb_edit_history_undo (h));
  g_assert_null (trb_project_find_member (p, "B9"));
  g_assert_cmpuint (floor->members->len, ==, n_floor);
  {
    g_autofree char *undone = dump_project (p);

    g_assert_cmpstr (undone, ==, before);
  }
  g_assert_true (trb_edit_history_redo (h));
  g_assert_true (trb_project_find_member (p, "B9") == m);
  {
    g_autofree char *redone = dump_project (p);

    g_assert_cmpstr (redone, ==, after);
  }

  /* Removing the first member of the file and putting it back keeps its place. */
  m = g_ptr_array_index (p->members, 0);
  c = trb_edit_remove_member (p, m, &error);
  push_ok (h, c, error);
  g_assert_null (trb_project_find_member (p, "B1"));
  g_assert_true (trb_edit_history_undo (h));
  g_assert_true (g_ptr_array_index (p->members, 0) == m);
  g_assert_true (trb_project_find_member (p, "B1") == m);
}

static void
test_refused (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autofree char *before = dump_project (p);
  g_autofree char *after = NULL;
  TrbFloor *floor = first_floor (p);
  TrbMember *j1 = trb_project_find_member (p, "J1");
  TrbMember *b1 = trb_project_find_member (p, "B1");
  TrbFramePoint a = { 0, 0 }, b = { 0.03, 0.03 };
  GError *error = NULL;

  g_assert_nonnull (j1);
  g_assert_nonnull (b1);

  /* a mark already taken */
  g_assert_null (trb_edit_add_member (p, floor, plan_member ("J1", 0, 0, 5, 0), &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_null (trb_edit_set_member_text (p, j1, TRB_MEMBER_FIELD_ID, "G1", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_null (trb_edit_set_member_text (p, j1, TRB_MEMBER_FIELD_ID, "", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);

  /* 30 mm by 30 mm is 42 mm long, under the framing's 50 mm least member (docs/framing.md) */
  g_assert_null (trb_edit_move_member (p, j1, &a, &b, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  b.x = NAN;
  g_assert_null (trb_edit_move_member (p, j1, &a, &b, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);

  /* a designation in no catalog */
  g_assert_null (trb_edit_assign_section (p, j1, "W99X1", &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND);
  g_clear_error (&error);

  /* numbers out of range; a floor member's length follows its ends */
  g_assert_null (trb_edit_set_member_number (p, b1, TRB_MEMBER_FIELD_LENGTH, -1, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_null (trb_edit_set_member_number (p, b1, TRB_MEMBER_FIELD_LENGTH, NAN, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_null (trb_edit_set_member_number (p, j1, TRB_MEMBER_FIELD_LENGTH, 3, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_null (trb_edit_set_member_number (p, j1, TRB_MEMBER_FIELD_DEFLECTION_LIVE, -360,
                                             &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  g_assert_null (trb_edit_set_member_choice (p, j1, TRB_MEMBER_FIELD_ROLE, 7, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);

  /* a load past the end of B1 (12 ft = 3.6576 m, common practice: 1 ft = 0.3048 m) */
  {
    TrbMemberLoad l = { TRB_CASE_D, { TRB_LOAD_POINT, 4.0, 0, 1000, 0 }, 0 };

    g_assert_null (trb_edit_insert_member_element (p, b1, TRB_MEMBER_ARRAY_LOADS, -1, &l,
                                                   &error));
    g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
    g_clear_error (&error);
  }

  /* a second column C1, a wall of one point */
  g_assert_null (trb_edit_add_floor_item (p, floor, TRB_FLOOR_ITEM_COLUMN,
                                          trb_column_new ("C1", a, NULL), &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_clear_error (&error);
  {
    TrbWall *w = trb_wall_new ("W9", NULL);

    trb_points_append (w->points, 0, 0);
    g_assert_null (trb_edit_add_floor_item (p, floor, TRB_FLOOR_ITEM_WALL, w, &error));
    g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
    g_clear_error (&error);
  }

  /* nothing refused has touched the model */
  after = dump_project (p);
  g_assert_cmpstr (after, ==, before);
}

static void
test_fields (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
  g_autoptr(GError) error = NULL;
  g_autofree char *before = dump_project (p);
  TrbMember *j1 = trb_project_find_member (p, "J1");
  TrbMember *g1 = trb_project_find_member (p, "G1");

  g_assert_nonnull (j1);
  g_assert_nonnull (g1);

  push_ok (h, trb_edit_assign_section (p, j1, "2x10", &error), error);
  g_assert_cmpstr (j1->section, ==, "2x10");
  g_assert_cmpstr (trb_edit_history_get_undo_label (h), ==, "Assign 2x10 to J1");

  push_ok (h, trb_edit_set_member_text (p, j1, TRB_MEMBER_FIELD_ID, "J7", &error), error);
  g_assert_null (trb_project_find_member (p, "J1"));
  g_assert_true (trb_project_find_member (p, "J7") == j1);

  push_ok (h, trb_edit_set_member_text (p, g1, TRB_MEMBER_FIELD_STEEL_GRADE, NULL, &error),
           error);
  g_assert_null (g1->steel_grade);

  push_ok (h, trb_edit_set_member_choice (p, g1, TRB_MEMBER_FIELD_METHOD, TRB_METHOD_LRFD,
                                          &error), error);
  g_assert_true (g1->has_method);
  g_assert_cmpint (g1->method, ==, TRB_METHOD_LRFD);
  push_ok (h, trb_edit_set_member_choice (p, g1, TRB_MEMBER_FIELD_METHOD, -1, &error), error);
  g_assert_false (g1->has_method);
  g_assert_cmpint (trb_member_get_method (g1, &p->settings), ==, TRB_METHOD_ASD);

  push_ok (h, trb_edit_set_member_choice (p, j1, TRB_MEMBER_FIELD_WET_SERVICE, TRUE, &error),
           error);
  g_assert_true (j1->wet_service);

  /* L/480, a stiffer limit than the project's L/360 (IBC 2021 Table 1604.3 gives L/360) */
  push_ok (h, trb_edit_set_member_number (p, g1, TRB_MEMBER_FIELD_DEFLECTION_LIVE, 480,
                                          &error), error);
  g_assert_cmpfloat (trb_member_get_deflection_live (g1, &p->settings), ==, 480);
  push_ok (h, trb_edit_set_member_number (p, g1, TRB_MEMBER_FIELD_DEFLECTION_LIVE, NAN,
                                          &error), error);
  g_assert_cmpfloat (trb_member_get_deflection_live (g1, &p->settings), ==, 360);

  g_assert_cmpuint (trb_edit_history_get_n_undo (h), ==, 8);
  while (trb_edit_history_undo (h))
    ;
  g_assert_true (trb_project_find_member (p, "J1") == j1);
  g_assert_null (trb_project_find_member (p, "J7"));
  {
    g_autofree char *undone = dump_project (p);

    g_assert_cmpstr (undone, ==, before);
  }
}

static void
test_elements (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
  g_autoptr(GError) error = NULL;
  g_autofree char *before = dump_project (p);
  TrbMember *b1 = trb_project_find_member (p, "B1");
  TrbMemberBrace late = { 3.0, 0 }, early = { 1.0, 0 };
  TrbMemberLoad l = { TRB_CASE_L, { TRB_LOAD_UNIFORM, 0.5, 2.5, 2000, 0 }, 0 };

  g_assert_nonnull (b1);
  g_assert_cmpuint (b1->loads->len, ==, 1);

  push_ok (h, trb_edit_insert_member_element (p, b1, TRB_MEMBER_ARRAY_LOADS, -1, &l, &error),
           error);
  g_assert_cmpuint (b1->loads->len, ==, 2);
  g_assert_cmpint (g_array_index (b1->loads, TrbMemberLoad, 1).lcase, ==, TRB_CASE_L);

  /* braces stay sorted by x whatever the order they come in */
  push_ok (h, trb_edit_insert_member_element (p, b1, TRB_MEMBER_ARRAY_BRACES, -1, &late,
                                              &error), error);
  push_ok (h, trb_edit_insert_member_element (p, b1, TRB_MEMBER_ARRAY_BRACES, -1, &early,
                                              &error), error);
  g_assert_cmpuint (b1->braces->len, ==, 2);
  g_assert_cmpfloat (g_array_index (b1->braces, TrbMemberBrace, 0).x, ==, 1.0);
  g_assert_cmpfloat (g_array_index (b1->braces, TrbMemberBrace, 1).x, ==, 3.0);

  push_ok (h, trb_edit_remove_member_element (p, b1, TRB_MEMBER_ARRAY_SUPPORTS, 0, &error),
           error);
  g_assert_cmpuint (b1->supports->len, ==, 1);

  while (trb_edit_history_undo (h))
    ;
  {
    g_autofree char *undone = dump_project (p);

    g_assert_cmpstr (undone, ==, before);
  }
}

static void
test_floor_items (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
  g_autoptr(GError) error = NULL;
  g_autofree char *before = dump_project (p);
  TrbFloor *floor = first_floor (p);
  TrbColumn *c1 = trb_project_find_column (p, "C1", NULL);
  TrbColumn *moved;
  TrbFramePoint at = { 1.0, 2.0 };

  g_assert_nonnull (c1);

  push_ok (h, trb_edit_add_floor_item (p, floor, TRB_FLOOR_ITEM_COLUMN,
                                       trb_column_new ("C3", at, "HSS4X4X1/4"), &error), error);
  g_assert_nonnull (trb_project_find_column (p, "C3", NULL));
  g_assert_cmpstr (trb_edit_history_get_undo_label (h), ==, "Add column C3");

  moved = trb_edit_floor_item_copy (TRB_FLOOR_ITEM_COLUMN, c1);
  moved->at.x += 0.5;
  push_ok (h, trb_edit_replace_floor_item (p, floor, TRB_FLOOR_ITEM_COLUMN, c1, moved, &error),
           error);
  g_assert_true (g_ptr_array_index (floor->columns, 0) == moved);
  g_assert_cmpfloat (moved->at.x, ==, 0.5);

  /* the wall W1, the only one */
  push_ok (h, trb_edit_remove_floor_item (p, floor, TRB_FLOOR_ITEM_WALL,
                                          g_ptr_array_index (floor->walls, 0), &error), error);
  g_assert_cmpuint (floor->walls->len, ==, 0);

  {
    TrbPointLoad *pl = trb_point_load_new (TRB_CASE_D, 4448.2216152605, at, NULL);

    push_ok (h, trb_edit_add_floor_item (p, floor, TRB_FLOOR_ITEM_POINT_LOAD, pl, &error),
             error);
  }

  while (trb_edit_history_undo (h))
    ;
  g_assert_true (g_ptr_array_index (floor->columns, 0) == c1);
  {
    g_autofree char *undone = dump_project (p);

    g_assert_cmpstr (undone, ==, before);
  }
}

static void
test_group (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
  g_autoptr(GError) error = NULL;
  g_autofree char *before = dump_project (p);
  TrbFloor *floor = first_floor (p);
  guint counter = 0;

  /* A run of four joists 16 in (0.4064 m, common practice) apart, as one step. */
  trb_edit_history_begin_group (h, "Lay out a joist run");
  for (guint i = 0; i < 4; i++)
    {
      g_autofree char *mark = trb_project_next_mark (p, "J", &counter);
      double y = 1.0 + i * 0.4064;
      TrbMember *m = plan_member (mark, 0, y, 7.62, y);

      trb_member_set_role (m, TRB_FRAME_ROLE_JOIST);
      push_ok (h, trb_edit_add_member (p, floor, m, &error), error);
    }
  g_assert_false (trb_edit_history_can_undo (h));
  trb_edit_history_end_group (h);

  /* J1 and J2 are in the file: the run is J3 to J6 */
  g_assert_nonnull (trb_project_find_member (p, "J6"));
  g_assert_cmpuint (trb_edit_history_get_n_undo (h), ==, 1);
  g_assert_cmpstr (trb_edit_history_get_undo_label (h), ==, "Lay out a joist run");
  g_assert_true (trb_edit_history_undo (h));
  g_assert_null (trb_project_find_member (p, "J3"));
  {
    g_autofree char *undone = dump_project (p);

    g_assert_cmpstr (undone, ==, before);
  }
  g_assert_true (trb_edit_history_redo (h));
  g_assert_nonnull (trb_project_find_member (p, "J6"));

  /* the layout's joist run as one command: as many joists as its preview, from J7 on (J3 to J6
   * are the run above), one undo step */
  {
    TrbMember *a = trb_project_find_member (p, "J1");
    TrbMember *b = trb_project_find_member (p, "J2");
    g_autofree char *now = dump_project (p);
    g_autoptr(GArray) lines = NULL;
    TrbJoistRunSpec spec;
    guint n = p->members->len;
    TrbEditCommand *c;

    trb_joist_run_spec_init (&spec, 0.4064);
    lines = trb_layout_preview (a, b, &spec, &error);
    g_assert_no_error (error);
    g_assert_cmpuint (lines->len, >, 1);
    c = trb_edit_add_joist_run (p, floor, a, b, &spec, &error);
    push_ok (h, c, error);
    g_assert_cmpuint (p->members->len, ==, n + lines->len);
    for (guint i = 0; i < lines->len; i++)
      {
        TrbMember *m = g_ptr_array_index (p->members, n + i);
        const TrbLayoutLine *line = &g_array_index (lines, TrbLayoutLine, i);
        g_autofree char *mark = g_strdup_printf ("J%u", 7 + i);

        /* laid out in the preview's order, with consecutive marks */
        g_assert_cmpstr (m->id, ==, mark);
        g_assert_cmpint (m->role, ==, TRB_FRAME_ROLE_JOIST);
        g_assert_cmpfloat (m->start.x, ==, line->start.x);
        g_assert_cmpfloat (m->end.y, ==, line->end.y);
        g_assert_true (g_ptr_array_index (floor->members, floor->members->len - lines->len + i)
                       == m);
      }
    g_assert_true (trb_edit_history_undo (h));
    {
      g_autofree char *undone = dump_project (p);

      g_assert_cmpstr (undone, ==, now);
    }
    g_assert_true (trb_edit_history_redo (h));
    g_assert_true (trb_edit_history_undo (h));
  }

  /* a cancelled group leaves nothing behind */
  {
    g_autofree char *now = dump_project (p);
    g_autofree char *after_cancel = NULL;

    trb_edit_history_begin_group (h, "Half a run");
    push_ok (h, trb_edit_add_member (p, floor, plan_member ("J20", 0, 9, 7.62, 9), &error),
             error);
    trb_edit_history_cancel_group (h);
    after_cancel = dump_project (p);
    g_assert_cmpstr (after_cancel, ==, now);
    g_assert_cmpuint (trb_edit_history_get_n_undo (h), ==, 1);
  }
}

static void
test_modified (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
  g_autoptr(GError) error = NULL;
  TrbMember *j1 = trb_project_find_member (p, "J1");

  g_assert_false (trb_edit_history_is_modified (h));
  push_ok (h, trb_edit_assign_section (p, j1, "2x10", &error), error);
  g_assert_true (trb_edit_history_is_modified (h));
  trb_edit_history_mark_saved (h);
  g_assert_false (trb_edit_history_is_modified (h));
  g_assert_true (trb_edit_history_undo (h));
  g_assert_true (trb_edit_history_is_modified (h));
  g_assert_true (trb_edit_history_redo (h));
  g_assert_false (trb_edit_history_is_modified (h));

  /* after an undo, a new edit makes the saved state unreachable */
  g_assert_true (trb_edit_history_undo (h));
  push_ok (h, trb_edit_assign_section (p, j1, "2x8", &error), error);
  g_assert_false (trb_edit_history_can_redo (h));
  g_assert_true (trb_edit_history_is_modified (h));
  g_assert_true (trb_edit_history_undo (h));
  g_assert_true (trb_edit_history_is_modified (h));
}

/* The mezzanine's plan (tests/data/floor-mezzanine.trabeate), 1 ft = 0.3048 m exactly (NIST
 * SP 811, Appendix B): columns C1 (0, 0) and C2 (0, 9.144); girder G1 from (0, 0) to
 * (0, 9.144); joists J1 at y = 3.048 and J2 at y = 6.096 from x = 0 to 7.62; wall W1 along
 * x = 7.62; grid lines A (x = 0) and 1 (y = 0). */
static void
test_snap (void)
{
  g_autoptr(TrbProject) p = load_mezzanine ();
  TrbFloor *floor = first_floor (p);
  TrbSnapOptions o = { 0.3048, TRUE, 0.3, NULL };
  TrbFramePoint at;
  TrbSnap snap;

  /* near C1, G1's start and the crossing of A and 1, all at (0, 0): the column wins ties */
  at = (TrbFramePoint) { 0.05, 0.02 };
  g_assert_true (trb_edit_snap (floor, &at, &o, &snap));
  g_assert_cmpint (snap.kind, ==, TRB_SNAP_COLUMN);
  g_assert_true (snap.object == trb_project_find_column (p, "C1", NULL));
  g_assert_cmpfloat (snap.point.x, ==, 0);
  g_assert_cmpfloat (snap.point.y, ==, 0);

  /* 52 mm above J1's line, no end nearby: onto the line, straight down */
  at = (TrbFramePoint) { 3.0, 3.1 };
  g_assert_true (trb_edit_snap (floor, &at, &o, &snap));
  g_assert_cmpint (snap.kind, ==, TRB_SNAP_ON_MEMBER);
  g_assert_true (snap.object == trb_project_find_member (p, "J1"));
  g_assert_cmpfloat_with_epsilon (snap.point.x, 3.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (snap.point.y, 3.048, 1e-12);

  /* 0.12 m short of the wall W1 */
  at = (TrbFramePoint) { 7.5, 5.0 };
  g_assert_true (trb_edit_snap (floor, &at, &o, &snap));
  g_assert_cmpint (snap.kind, ==, TRB_SNAP_ON_WALL);
  g_assert_cmpfloat_with_epsilon (snap.point.x, 7.62, 1e-12);
  g_assert_cmpfloat_with_epsilon (snap.point.y, 5.0, 1e-12);

  /* nothing within 0.3 m: the 1 ft grid, 4.4 m -> 14 ft = 4.2672 m, 1.3 m -> 4 ft = 1.2192 m */
  at = (TrbFramePoint) { 4.4, 1.3 };
  g_assert_true (trb_edit_snap (floor, &at, &o, &snap));
  g_assert_cmpint (snap.kind, ==, TRB_SNAP_GRID);
  g_assert_cmpfloat_with_epsilon (snap.point.x, 14 * 0.3048, 1e-12);
  g_assert_cmpfloat_with_epsilon (snap.point.y, 4 * 0.3048, 1e-12);

  /* dragging J1's start: J1 itself is skipped, and the start lands on G1's line */
  o.skip = trb_project_find_member (p, "J1");
  at = (TrbFramePoint) { 0.02, 3.2 };
  g_assert_true (trb_edit_snap (floor, &at, &o, &snap));
  g_assert_cmpint (snap.kind, ==, TRB_SNAP_ON_MEMBER);
  g_assert_true (snap.object == trb_project_find_member (p, "G1"));
  g_assert_cmpfloat_with_epsilon (snap.point.x, 0, 1e-12);
  g_assert_cmpfloat_with_epsilon (snap.point.y, 3.2, 1e-12);

  /* no grid, no objects: the point stays */
  o = (TrbSnapOptions) { 0, FALSE, 0.3, NULL };
  at = (TrbFramePoint) { 0.01, 0.01 };
  g_assert_false (trb_edit_snap (floor, &at, &o, &snap));
  g_assert_cmpint (snap.kind, ==, TRB_SNAP_NONE);
  g_assert_cmpfloat (snap.point.x, ==, 0.01);
}

/* ---- random sequences ------------------------------------------------------------------------ */

static const char * const sections[] = {
  "auto", "W8X10", "W12X26", "W16X31", "2x10", "2x12", "2-2x12",
};

static double
rand_coord (GRand *r)
{
  return g_rand_double_range (r, -2.0, 12.0);
}

static TrbMember *
pick_member (TrbProject *p,
             GRand      *r,
             gboolean    on_floor)
{
  g_autoptr(GPtrArray) some = g_ptr_array_new ();

  for (guint i = 0; i < p->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (p->members, i);

      if (!on_floor || m->floor != NULL)
        g_ptr_array_add (some, m);
    }
  if (some->len == 0)
    return NULL;
  return g_ptr_array_index (some, g_rand_int_range (r, 0, some->len));
}

/* One random command against the project as it is; NULL when the one drawn was refused (and
 * then the model must not have changed). */
static TrbEditCommand *
random_command (TrbProject *p,
                GRand      *r,
                guint      *counter)
{
  g_autoptr(GError) error = NULL;
  TrbFloor *floor = first_floor (p);
  TrbMember *m = pick_member (p, r, FALSE);
  TrbEditCommand *c = NULL;

  switch (g_rand_int_range (r, 0, 14))
    {
    case 0:
      {
        g_autofree char *mark = trb_project_next_mark (p, "B", counter);

        c = trb_edit_add_member (p, floor, plan_member (mark, rand_coord (r), rand_coord (r),
                                                        rand_coord (r), rand_coord (r)),
                                 &error);
      }
      break;
    case 1:
      if (m != NULL)
        c = trb_edit_remove_member (p, m, &error);
      break;
    case 2:
      m = pick_member (p, r, TRUE);
      if (m != NULL)
        {
          TrbFramePoint a = { rand_coord (r), rand_coord (r) }, b = m->end;

          c = trb_edit_move_member (p, m, &a, &b, &error);
        }
      break;
    case 3:
      if (m != NULL)
        c = trb_edit_assign_section (p, m, sections[g_rand_int_range (r, 0,
                                                                      G_N_ELEMENTS (sections))],
                                     &error);
      break;
    case 4:
      if (m != NULL)
        {
          g_autofree char *mark = trb_project_next_mark (p, "R", counter);

          c = trb_edit_set_member_text (p, m, TRB_MEMBER_FIELD_ID, mark, &error);
        }
      break;
    case 5:
      if (m != NULL)
        c = trb_edit_set_member_text (p, m, g_rand_int_range (r, TRB_MEMBER_FIELD_STEEL_GRADE,
                                                              TRB_MEMBER_FIELD_GROUP + 1),
                                      g_rand_boolean (r) ? NULL : "No.1", &error);
      break;
    case 6:
      if (m != NULL)
        c = trb_edit_set_member_choice (p, m, g_rand_int_range (r, TRB_MEMBER_FIELD_MATERIAL,
                                                                TRB_MEMBER_FIELD_REPETITIVE + 1),
                                        g_rand_int_range (r, -1, 3), &error);
      break;
    case 7:
      if (m != NULL)
        c = trb_edit_set_member_number (p, m,
                                        g_rand_int_range (r, TRB_MEMBER_FIELD_LENGTH,
                                                          TRB_MEMBER_FIELD_WEIGHT + 1),
                                        g_rand_boolean (r) ? NAN
                                                           : g_rand_double_range (r, -1, 500),
                                        &error);
      break;
    case 8:
      if (m != NULL)
        {
          TrbMemberLoad l = { g_rand_int_range (r, 0, TRB_N_CASES),
                              { TRB_LOAD_POINT, g_rand_double_range (r, -0.5, m->length + 0.5),
                                0, g_rand_double_range (r, 0, 10000), 0 }, 0 };
          TrbMemberBrace b = { g_rand_double_range (r, 0, m->length), 0 };

          if (g_rand_boolean (r))
            c = trb_edit_insert_member_element (p, m, TRB_MEMBER_ARRAY_LOADS,
                                                g_rand_int_range (r, -1, m->loads->len + 1), &l,
                                                &error);
          else
            c = trb_edit_insert_member_element (p, m, TRB_MEMBER_ARRAY_BRACES, -1, &b, &error);
        }
      break;
    case 9:
      if (m != NULL)
        c = trb_edit_remove_member_element (p, m, g_rand_int_range (r, 0, 4),
                                            g_rand_int_range (r, 0, 3), &error);
      break;
    case 10:
      {
        g_autofree char *mark = g_strdup_printf ("C%d", g_rand_int_range (r, 1, 9));
        TrbFramePoint at = { rand_coord (r), rand_coord (r) };

        c = trb_edit_add_floor_item (p, floor, TRB_FLOOR_ITEM_COLUMN,
                                     trb_column_new (mark, at, NULL), &error);
      }
      break;
    case 11:
      {
        TrbFloorItemKind kind = g_rand_int_range (r, 0, TRB_FLOOR_ITEM_POINT_LOAD + 1);
        GPtrArray *items = trb_edit_floor_items (floor, kind);

        if (items->len > 0)
          c = trb_edit_remove_floor_item (p, floor, kind,
                                          g_ptr_array_index (items,
                                                             g_rand_int_range (r, 0,
                                                                               items->len)),
                                          &error);
      }
      break;
    case 12:
      {
        TrbFloorItemKind kind = g_rand_int_range (r, 0, TRB_FLOOR_ITEM_POINT_LOAD + 1);
        GPtrArray *items = trb_edit_floor_items (floor, kind);

        if (items->len > 0)
          {
            gpointer old = g_ptr_array_index (items, g_rand_int_range (r, 0, items->len));
            gpointer copy = trb_edit_floor_item_copy (kind, old);

            if (kind == TRB_FLOOR_ITEM_POINT_LOAD)
              ((TrbPointLoad *) copy)->P *= 2;
            else if (kind == TRB_FLOOR_ITEM_COLUMN)
              ((TrbColumn *) copy)->at.y += 0.25;
            c = trb_edit_replace_floor_item (p, floor, kind, old, copy, &error);
          }
      }
      break;
    default:
      {
        TrbSettings s = p->settings;

        s.deflection_live = g_rand_boolean (r) ? 480 : -1;
        s.units = g_rand_int_range (r, 0, 2);
        c = trb_edit_set_settings (p, &s, &error);
      }
      break;
    }
  if (c == NULL && error != NULL)
    g_assert_true (error->domain == TRB_ERROR);
  return c;
}

/* The copy a solve runs on is the project, bit for bit and in the same order, and owns
 * everything but the catalog it borrows: editing the original leaves it alone. */
static void
test_project_copy (void)
{
  static const char * const files[][3] = {
    { "tests", "data", "floor-mezzanine.trabeate" },
    { "data", "examples", "demo-floor.trabeate" },
    { "data", "examples", "demo-beams.trabeate" },
  };

  for (guint k = 0; k < G_N_ELEMENTS (files); k++)
    {
      g_autoptr(GError) error = NULL;
      g_autofree char *path = g_test_build_filename (G_TEST_DIST, "..", files[k][0],
                                                     files[k][1], files[k][2], NULL);
      g_autoptr(TrbProject) p = trb_project_load_file (path, &error);
      g_autoptr(TrbEditHistory) h = NULL;
      g_autoptr(GRand) r = g_rand_new_with_seed (k);
      g_autofree char *dump = NULL;
      g_autofree char *bytes = NULL;
      TrbProject *copy;
      guint counter = 0;

      g_assert_no_error (error);
      copy = trb_edit_project_copy (p);
      dump = dump_project (p);
      bytes = save_bytes (p);
      {
        g_autofree char *copy_dump = dump_project (copy);
        g_autofree char *copy_bytes = save_bytes (copy);

        g_assert_cmpstr (copy_dump, ==, dump);
        g_assert_cmpstr (copy_bytes, ==, bytes);
      }
      for (guint f = 0; f < copy->floors->len; f++)
        for (guint i = 0; i < ((TrbFloor *) g_ptr_array_index (copy->floors, f))->members->len;
             i++)
          g_assert_true (((TrbMember *) g_ptr_array_index (((TrbFloor *)
                                                            g_ptr_array_index (copy->floors,
                                                                               f))->members,
                                                           i))->floor
                         == g_ptr_array_index (copy->floors, f));

      /* edit the original: the copy stays as it was */
      if (p->floors->len > 0)
        {
          h = trb_edit_history_new (p);
          for (guint step = 0; step < 40; step++)
            {
              TrbEditCommand *c = random_command (p, r, &counter);

              if (c != NULL)
                trb_edit_history_push (h, c);
            }
          {
            g_autofree char *copy_dump = dump_project (copy);

            g_assert_cmpstr (copy_dump, ==, dump);
          }
        }
      trb_edit_project_copy_free (copy);
    }
}

static void
test_random_sequences (void)
{
  g_autoptr(GRand) r = g_rand_new_with_seed (20260101);

  for (guint run = 0; run < 60; run++)
    {
      g_autoptr(TrbProject) p = load_mezzanine ();
      g_autoptr(TrbEditHistory) h = trb_edit_history_new (p);
      g_autofree char *original = dump_project (p);
      g_autofree char *original_bytes = save_bytes (p);
      g_autofree char *edited = NULL;
      g_autofree char *edited_bytes = NULL;
      guint counter = 0;

      for (guint step = 0; step < 80; step++)
        {
          guint what = g_rand_int_range (r, 0, 10);

          if (what == 0)
            trb_edit_history_undo (h);
          else if (what == 1)
            trb_edit_history_redo (h);
          else if (what == 2)
            {
              /* a group of up to three commands */
              trb_edit_history_begin_group (h, "Several");
              for (guint k = 0; k < 3; k++)
                {
                  TrbEditCommand *c = random_command (p, r, &counter);

                  if (c != NULL)
                    trb_edit_history_push (h, c);
                }
              trb_edit_history_end_group (h);
            }
          else
            {
              g_autofree char *now = dump_project (p);
              TrbEditCommand *c = random_command (p, r, &counter);

              if (c != NULL)
                trb_edit_history_push (h, c);
              else
                {
                  g_autofree char *unchanged = dump_project (p);

                  g_assert_cmpstr (unchanged, ==, now);
                }
            }
        }

      while (trb_edit_history_redo (h))
        ;
      edited = dump_project (p);
      edited_bytes = save_bytes (p);
      while (trb_edit_history_undo (h))
        ;
      {
        g_autofree char *undone = dump_project (p);
        g_autofree char *undone_bytes = save_bytes (p);

        g_assert_cmpstr (undone, ==, original);
        g_assert_cmpstr (undone_bytes, ==, original_bytes);
      }
      while (trb_edit_history_redo (h))
        ;
      {
        g_autofree char *redone = dump_project (p);
        g_autofree char *redone_bytes = save_bytes (p);

        g_assert_cmpstr (redone, ==, edited);
        g_assert_cmpstr (redone_bytes, ==, edited_bytes);
      }
      /* every tenth run, free the history with commands on both stacks */
      if (run % 10 == 0)
        for (guint k = 0; k < trb_edit_history_get_n_undo (h) / 2; k++)
          trb_edit_history_undo (h);
    }
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/edit/add-remove-member", test_add_remove_member);
  g_test_add_func ("/trb/edit/refused", test_refused);
  g_test_add_func ("/trb/edit/fields", test_fields);
  g_test_add_func ("/trb/edit/elements", test_elements);
  g_test_add_func ("/trb/edit/floor-items", test_floor_items);
  g_test_add_func ("/trb/edit/group", test_group);
  g_test_add_func ("/trb/edit/modified", test_modified);
  g_test_add_func ("/trb/edit/snap", test_snap);
  g_test_add_func ("/trb/edit/project-copy", test_project_copy);
  g_test_add_func ("/trb/edit/random-sequences", test_random_sequences);

  return g_test_run ();
}
