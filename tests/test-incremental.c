/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The incremental solve (trb_solve_project_cached(), what the editor's document runs after
 * every edit) against a solve from scratch, bit for bit: random edits through trb-edit on a
 * generated floor and on the examples, each solved both ways; every field of every result, as
 * bytes, must be equal. The check values are the results of the plain solve
 * (trb_solve_project_full()), whose own checks against outside sources live in test-floor,
 * test-solve and the reference tests. */

#include "config.h"

#include <math.h>
#include <string.h>

#include "bench/floor-gen.h"
#include "trb-edit.h"
#include "trb-model.h"
#include "trb-project-io.h"
#include "trb-solve.h"

/* ---- a digest of every field of the results ----------------------------------------------- */

static void
dig (GByteArray   *d,
     gconstpointer data,
     gsize         size)
{
  g_byte_array_append (d, data, size);
}

static void
dig_double (GByteArray *d,
            double      v)
{
  dig (d, &v, sizeof v);
}

static void
dig_int (GByteArray *d,
         gint64      v)
{
  dig (d, &v, sizeof v);
}

static void
dig_string (GByteArray *d,
            const char *s)
{
  if (s != NULL)
    dig (d, s, strlen (s) + 1);
  else
    dig (d, "\xff", 1);
}

static void
dig_load (GByteArray    *d,
          const TrbLoad *l)
{
  dig_int (d, l->kind);
  dig_double (d, l->a);
  dig_double (d, l->b);
  dig_double (d, l->w1);
  dig_double (d, l->w2);
}

static void
dig_extremes (GByteArray            *d,
              const TrbBeamExtremes *e)
{
  dig (d, e, sizeof *e);
}

static void
dig_beam_result (GByteArray          *d,
                 const TrbBeamResult *r)
{
  const TrbReaction *re;
  TrbBeamValues v[11];
  double x[11];
  guint n;

  if (r == NULL)
    {
      dig_string (d, NULL);
      return;
    }
  re = trb_beam_result_get_reactions (r, &n);
  for (guint i = 0; i < n; i++)
    {
      dig_double (d, re[i].x);
      dig_double (d, re[i].force);
      dig_double (d, re[i].moment);
    }
  trb_beam_result_sample (r, 11, x, v);
  dig (d, x, sizeof x);
  dig (d, v, sizeof v);
}

static void
dig_reduction (GByteArray            *d,
               const TrbReductionUse *u)
{
  dig_int (d, u->applies);
  dig_double (d, u->area);
  dig_double (d, u->k_ll);
  dig_int (d, u->floors);
  dig_double (d, u->factor);
  dig_int (d, u->rule);
  dig_double (d, u->reducible);
  dig_double (d, u->other);
}

static void
dig_set (GByteArray              *d,
         const TrbComboSetResult *s)
{
  dig_int (d, s->set);
  dig_int (d, s->entries->len);
  for (guint i = 0; i < s->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (s->entries, TrbComboResult, i);

      dig_string (d, c->combo.name);
      dig_string (d, c->combo.equation);
      dig (d, c->combo.factors, sizeof c->combo.factors);
      dig_string (d, c->pattern);
      dig_string (d, c->name);
      dig_extremes (d, &c->ext);
      dig_beam_result (d, c->result);
    }
  dig_int (d, s->envelope.empty);
  dig_extremes (d, &s->envelope.ext);
  dig_string (d, s->envelope.V_max_by);
  dig_string (d, s->envelope.V_min_by);
  dig_string (d, s->envelope.M_max_by);
  dig_string (d, s->envelope.M_min_by);
  dig_string (d, s->envelope.defl_down_by);
  dig_string (d, s->envelope.defl_up_by);
  for (guint i = 0; i < s->envelope.reactions->len; i++)
    {
      const TrbReactionRange *rr = &g_array_index (s->envelope.reactions, TrbReactionRange, i);

      dig_double (d, rr->x);
      dig_double (d, rr->force_max);
      dig_double (d, rr->force_min);
      dig_double (d, rr->moment_max);
      dig_double (d, rr->moment_min);
    }
}

static void
dig_member (GByteArray            *d,
            const TrbMemberResult *r)
{
  dig_string (d, r->member->id);
  dig_int (d, r->status);
  dig_string (d, r->message);
  dig_int (d, r->notes->len);
  for (guint k = 0; k < r->notes->len; k++)
    dig_string (d, g_ptr_array_index (r->notes, k));
  dig_int (d, r->method);
  dig_int (d, r->units);
  dig_int (d, r->analysed);
  dig_string (d, r->section);
  dig_double (d, r->ratio);
  dig_string (d, r->governing);
  dig_int (d, r->checks->len);
  for (guint k = 0; k < r->checks->len; k++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, k);

      dig_string (d, ck->name);
      dig_string (d, ck->clause);
      dig_int (d, ck->dimension);
      dig_double (d, ck->demand);
      dig_double (d, ck->capacity);
      dig_double (d, ck->ratio);
      dig_string (d, ck->combination);
      dig_double (d, ck->x);
      dig_string (d, ck->detail);
    }
  dig_int (d, r->shortlist->len);
  for (guint k = 0; k < r->shortlist->len; k++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, k);

      dig_string (d, e->section);
      dig_double (d, e->weight);
      dig_double (d, e->ratio);
      dig_string (d, e->governing);
    }
  dig_int (d, r->bearings != NULL ? (gint64) r->bearings->len : -1);
  for (guint k = 0; r->bearings != NULL && k < r->bearings->len; k++)
    {
      const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, k);

      dig_double (d, b->x);
      dig_int (d, b->own);
      if (!b->own)
        {
          dig_int (d, b->kind);
          dig_string (d, b->id);
          dig_double (d, b->position);
        }
      dig (d, b->force, sizeof b->force);
    }
  dig_reduction (d, &r->reduction);
  dig_string (d, r->plan_note);
  if (!r->analysed)
    return;
  dig_double (d, r->E);
  dig_double (d, r->I);
  dig_double (d, r->self_weight);
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      dig_int (d, r->has_case[c]);
      dig_beam_result (d, r->cases[c]);
      dig_extremes (d, &r->case_ext[c]);
    }
  dig (d, r->regions->data, r->regions->len * sizeof (TrbRegion));
  for (guint k = 0; k < r->patterns->len; k++)
    {
      const TrbPattern *p = &g_array_index (r->patterns, TrbPattern, k);

      dig_string (d, p->name);
      dig_int (d, (gint64) p->mask);
    }
  for (guint k = 0; k < r->supports->len; k++)
    {
      const TrbSupport *s = &g_array_index (r->supports, TrbSupport, k);

      dig_double (d, s->x);
      dig_int (d, s->type);
    }
  for (guint k = 0; k < r->loads->len; k++)
    {
      const TrbMemberLoad *ml = &g_array_index (r->loads, TrbMemberLoad, k);

      dig_int (d, ml->lcase);
      dig_load (d, &ml->load);
    }
  dig_set (d, &r->strength);
  dig_set (d, &r->live);
  dig_set (d, &r->total);
}

static GBytes *
digest (const TrbProjectResult *pr)
{
  GByteArray *d = g_byte_array_new ();

  dig_int (d, pr->members->len);
  for (guint i = 0; i < pr->members->len; i++)
    dig_member (d, g_ptr_array_index (pr->members, i));
  dig_int (d, pr->floors->len);
  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      dig_string (d, fr->error);
      dig (d, fr->applied, sizeof fr->applied);
      dig (d, fr->reactions, sizeof fr->reactions);
      dig (d, fr->supports, sizeof fr->supports);
      dig (d, fr->not_carried, sizeof fr->not_carried);
      for (guint i = 0; i < fr->columns->len; i++)
        {
          const TrbColumnResult *c = &g_array_index (fr->columns, TrbColumnResult, i);

          dig_string (d, c->column->id);
          dig (d, c->force, sizeof c->force);
          dig_reduction (d, &c->reduction);
          dig_double (d, c->live_reduced);
          dig_int (d, c->cantilever);
        }
      for (guint i = 0; i < fr->walls->len; i++)
        {
          const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);

          dig_string (d, w->wall->id);
          dig (d, w->force, sizeof w->force);
          for (guint c = 0; c < TRB_N_CASES; c++)
            {
              dig_int (d, w->loads[c]->len);
              for (guint k = 0; k < w->loads[c]->len; k++)
                dig_load (d, &g_array_index (w->loads[c], TrbLoad, k));
            }
        }
      for (guint i = 0; i < fr->unassigned->len; i++)
        {
          const TrbUnassignedLoad *u = &g_array_index (fr->unassigned, TrbUnassignedLoad, i);

          dig_int (d, u->point != NULL);
          dig_double (d, u->length);
          dig_double (d, u->force);
        }
    }
  return g_byte_array_free_to_bytes (d);
}

/* ---- the edits ------------------------------------------------------------------------------ */

static TrbMember *
random_member (GRand      *rand,
               TrbProject *p,
               int         role)
{
  for (guint tries = 0; tries < 100 && p->members->len > 0; tries++)
    {
      TrbMember *m = g_ptr_array_index (p->members, g_rand_int_range (rand, 0, p->members->len));

      if (role < 0 || (m->floor != NULL && (int) m->role == role))
        return m;
    }
  return NULL;
}

/* One random edit, or NULL when the one drawn does not apply here (or is refused). */
static TrbEditCommand *
random_edit (GRand      *rand,
             TrbProject *p,
             const char **what)
{
  static const char * const steel[] = { "auto", "W24X55", "W21X44", "W12X14", "W8X10" };
  static const char * const wood[] = { "auto", "2x12", "2x10", "2x6" };
  TrbFloor *floor = p->floors->len > 0 ? g_ptr_array_index (p->floors, 0) : NULL;
  g_autoptr(GError) error = NULL;
  TrbMember *m;

  switch (g_rand_int_range (rand, 0, 9))
    {
    case 0:
      *what = "girder section";
      m = random_member (rand, p, TRB_FRAME_ROLE_GIRDER);
      if (m == NULL || m->material != TRB_MATERIAL_STEEL)
        return NULL;
      return trb_edit_assign_section (p, m, steel[g_rand_int_range (rand, 0, 5)], &error);
    case 1:
      *what = "joist section";
      m = random_member (rand, p, TRB_FRAME_ROLE_JOIST);
      if (m == NULL || m->material != TRB_MATERIAL_WOOD)
        return NULL;
      return trb_edit_assign_section (p, m, wood[g_rand_int_range (rand, 0, 4)], &error);
    case 2:
      *what = "live deflection limit";
      m = random_member (rand, p, -1);
      if (m == NULL)
        return NULL;
      return trb_edit_set_member_number (p, m, TRB_MEMBER_FIELD_DEFLECTION_LIVE,
                                         g_rand_boolean (rand) ? 480 : NAN, &error);
    case 3:
      {
        TrbFramePoint a, b;
        double dx, dy, len, shift = g_rand_double_range (rand, -0.05, 0.05);

        *what = "joist moved";
        m = random_member (rand, p, TRB_FRAME_ROLE_JOIST);
        if (m == NULL)
          return NULL;
        dx = m->end.x - m->start.x, dy = m->end.y - m->start.y;
        len = hypot (dx, dy);
        a = m->start, b = m->end;
        a.x -= shift * dy / len, a.y += shift * dx / len;
        b.x -= shift * dy / len, b.y += shift * dx / len;
        return trb_edit_move_member (p, m, &a, &b, &error);
      }
    case 4:
      *what = "member removed";
      m = random_member (rand, p, g_rand_boolean (rand) ? TRB_FRAME_ROLE_JOIST : -1);
      if (m == NULL)
        return NULL;
      return trb_edit_remove_member (p, m, &error);
    case 5:
      {
        TrbAreaLoad *al, *changed;

        *what = "area load";
        if (floor == NULL || floor->area_loads->len == 0)
          return NULL;
        al = g_ptr_array_index (floor->area_loads,
                                g_rand_int_range (rand, 0, floor->area_loads->len));
        changed = trb_edit_floor_item_copy (TRB_FLOOR_ITEM_AREA_LOAD, al);
        changed->pressure *= g_rand_double_range (rand, 0.5, 1.5);
        return trb_edit_replace_floor_item (p, floor, TRB_FLOOR_ITEM_AREA_LOAD, al, changed,
                                            &error);
      }
    case 6:
      {
        TrbFramePoint at;

        *what = "point load";
        m = random_member (rand, p, -1);
        if (floor == NULL || m == NULL || m->floor != floor)
          return NULL;
        at.x = 0.5 * (m->start.x + m->end.x);
        at.y = 0.5 * (m->start.y + m->end.y);
        return trb_edit_add_floor_item (p, floor, TRB_FLOOR_ITEM_POINT_LOAD,
                                        trb_point_load_new (TRB_CASE_L, 4448.2216152605, at,
                                                            NULL), &error);
      }
    case 7:
      {
        TrbSettings s = p->settings;

        *what = "settings";
        if (g_rand_boolean (rand))
          s.live_load_reduction = !s.live_load_reduction;
        else
          s.method = s.method == TRB_METHOD_ASD ? TRB_METHOD_LRFD : TRB_METHOD_ASD;
        return trb_edit_set_settings (p, &s, &error);
      }
    default:
      *what = "bracing";
      m = random_member (rand, p, -1);
      if (m == NULL)
        return NULL;
      return trb_edit_set_member_choice (p, m, TRB_MEMBER_FIELD_BRACING,
                                         g_rand_int_range (rand, 0, 3), &error);
    }
}

/* The project solved from scratch and incrementally (on a copy, as the editor does, so that
 * nothing leans on the members' addresses), compared byte for byte. */
static void
assert_same (TrbProject    *p,
             TrbSolveCache *cache,
             guint         *solved)
{
  TrbProject *copy = trb_edit_project_copy (p);
  g_autoptr(TrbProjectResult) full = trb_solve_project (p);
  TrbProjectResult *inc = trb_solve_project_cached (copy, NULL, cache);
  g_autoptr(GBytes) a = digest (full);
  g_autoptr(GBytes) b = digest (inc);

  g_assert_true (g_bytes_equal (a, b));
  trb_solve_cache_get_counts (cache, solved, NULL, NULL);
  trb_project_result_free (inc);
  trb_edit_project_copy_free (copy);
}

static void
run_edits (TrbProject *p,
           guint       n_edits,
           guint32     seed)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (seed);
  g_autoptr(TrbEditHistory) history = trb_edit_history_new (p);
  g_autoptr(TrbSolveCache) cache = trb_solve_cache_new ();
  guint solved, first;

  assert_same (p, cache, &first);
  for (guint k = 0; k < n_edits; k++)
    {
      const char *what = "undo";
      guint r = g_rand_int_range (rand, 0, 10);

      if (r == 0 && trb_edit_history_can_undo (history))
        trb_edit_history_undo (history);
      else if (r == 1 && trb_edit_history_can_redo (history))
        {
          what = "redo";
          trb_edit_history_redo (history);
        }
      else
        {
          TrbEditCommand *c = random_edit (rand, p, &what);

          if (c == NULL)
            continue;
          trb_edit_history_push (history, c);
        }
      assert_same (p, cache, &solved);
      g_test_message ("%s: %u members solved again", what, solved);
    }
}

/* ---- tests ---------------------------------------------------------------------------------- */

/* One girder's section: only it (and nothing it hands down to, on columns) is solved again,
 * and the frame is not made again. */
static void
test_one_girder (void)
{
  guint n = 0;
  g_autofree char *xml = floor_gen_xml (1000, &n);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (xml, strlen (xml), "generated.trabeate",
                                                   &error);
  g_autoptr(TrbEditHistory) history = NULL;
  g_autoptr(TrbSolveCache) cache = trb_solve_cache_new ();
  TrbMember *girder = NULL;
  guint solved, reused, frames, first;

  g_assert_no_error (error);
  history = trb_edit_history_new (p);
  for (guint i = 0; i < p->members->len && girder == NULL; i++)
    if (((TrbMember *) g_ptr_array_index (p->members, i))->role == TRB_FRAME_ROLE_GIRDER)
      girder = g_ptr_array_index (p->members, i);
  g_assert_nonnull (girder);

  assert_same (p, cache, &first);
  trb_solve_cache_get_counts (cache, NULL, NULL, &frames);
  g_assert_cmpuint (frames, >=, 1);
  g_assert_cmpuint (first, >, 100);

  /* nothing changed: nothing solved */
  assert_same (p, cache, &solved);
  trb_solve_cache_get_counts (cache, NULL, &reused, &frames);
  g_assert_cmpuint (solved, ==, 0);
  g_assert_cmpuint (reused, ==, first);
  g_assert_cmpuint (frames, ==, 0);

  trb_edit_history_push (history, trb_edit_assign_section (p, girder, "W24X55", &error));
  g_assert_no_error (error);
  assert_same (p, cache, &solved);
  trb_solve_cache_get_counts (cache, NULL, NULL, &frames);
  g_assert_cmpuint (solved, >=, 1);
  g_assert_cmpuint (solved, <=, 2);
  g_assert_cmpuint (frames, ==, 0);

  /* the undo finds the state before in the cache */
  trb_edit_history_undo (history);
  assert_same (p, cache, &solved);
  g_assert_cmpuint (solved, ==, 0);
}

/* Other options empty the cache: a cache filled with the sizing bounds and a shortlist of 10
 * gives, without the bounds and with a shortlist of 1, what a solve from scratch with those
 * options gives. */
static void
test_options (void)
{
  guint n = 0;
  g_autofree char *xml = floor_gen_xml (300, &n);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (xml, strlen (xml), "generated.trabeate",
                                                   &error);
  g_autoptr(TrbSolveCache) cache = trb_solve_cache_new ();
  g_autoptr(TrbProjectResult) first = NULL;
  g_autoptr(TrbProjectResult) full = NULL;
  g_autoptr(TrbProjectResult) inc = NULL;
  g_autoptr(GBytes) a = NULL;
  g_autoptr(GBytes) b = NULL;
  TrbSolveOptions options;
  guint solved, reused;

  g_assert_no_error (error);
  first = trb_solve_project_cached (p, NULL, cache);
  trb_solve_options_init (&options);
  options.bounds = FALSE;
  options.shortlist_max = 1;
  full = trb_solve_project_full (p, &options);
  inc = trb_solve_project_cached (p, &options, cache);
  a = digest (full);
  b = digest (inc);
  g_assert_true (g_bytes_equal (a, b));
  trb_solve_cache_get_counts (cache, &solved, &reused, NULL);
  g_assert_cmpuint (solved, >, 0);
  g_assert_cmpuint (reused, ==, 0);
}

static void
test_generated (void)
{
  guint n = 0;
  g_autofree char *xml = floor_gen_xml (300, &n);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (xml, strlen (xml), "generated.trabeate",
                                                   &error);

  g_assert_no_error (error);
  run_edits (p, g_test_slow () ? 200 : 40, 20261202);
}

static void
test_examples (void)
{
  const char *files[] = { "demo-floor.trabeate", "overhang-beam.trabeate",
                          "demo-beams.trabeate" };

  for (guint i = 0; i < G_N_ELEMENTS (files); i++)
    {
      g_autofree char *path = g_test_build_filename (G_TEST_DIST, "..", "data", "examples",
                                                     files[i], NULL);
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbProject) p = NULL;

      p = trb_project_load_file (path, &error);
      g_assert_no_error (error);
      run_edits (p, g_test_slow () ? 100 : 30, 7 + i);
    }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/trb/incremental/one-girder", test_one_girder);
  g_test_add_func ("/trb/incremental/options", test_options);
  g_test_add_func ("/trb/incremental/generated", test_generated);
  g_test_add_func ("/trb/incremental/examples", test_examples);
  return g_test_run ();
}
