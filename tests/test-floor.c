/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The floor solve: load takedown through a floor (frame, bearing order, hand-down), column and
 * wall loads, totals, live load reduction, statuses, and that the solve is pure and that its
 * shortcuts (identical members solved once, sizing bounds) change nothing. Floors are built in
 * C here; the demo files are read too. */

#include "config.h"

#include <math.h>
#include <string.h>

#include "bench/floor-gen.h"
#include "trb-error.h"
#include "trb-model.h"
#include "trb-project-io.h"
#include "trb-solve.h"
#include "trb-units.h"

#define FT   TRB_FT
#define IN   TRB_IN
#define KIP  TRB_KIP
#define LBF  TRB_LBF
#define PSF  TRB_PSF

/* ---- building floors ------------------------------------------------------------------- */

static TrbProject *
project_new (void)
{
  TrbProject *p = trb_project_new ();

  p->name = g_strdup ("test");
  return p;
}

static TrbFloor *
add_floor (TrbProject *p,
           const char *name)
{
  TrbFloor *f = trb_floor_new (name);

  trb_project_add_floor (p, f);
  return f;
}

/* A member with a custom section: analysed, checked for deflection only (not designed under
 * ASD), which is all the takedown needs; E and I of a W18X35 and a 2x10 (ENGINEERING.md §8
 * items 5 and 10) keep the numbers of the trade. */
static TrbMember *
add_member (TrbProject   *p,
            TrbFloor     *f,
            const char   *id,
            TrbFrameRole  role,
            double        x1,
            double        y1,
            double        x2,
            double        y2)
{
  TrbMember *m = trb_member_new (id);
  TrbFramePoint a = { x1, y1 };
  TrbFramePoint b = { x2, y2 };

  trb_member_set_role (m, role);
  trb_member_set_plan (m, a, b);
  g_free (m->section);
  m->section = g_strdup ("custom");
  m->material = TRB_MATERIAL_STEEL;
  m->E = 29000 * TRB_KSI;
  m->I = 510 * IN * IN * IN * IN;
  m->weight = 0;
  trb_floor_add_member (p, f, m);
  return m;
}

static void
add_column (TrbFloor   *f,
            const char *id,
            double      x,
            double      y)
{
  TrbFramePoint at = { x, y };

  g_ptr_array_add (f->columns, trb_column_new (id, at, NULL));
}

static TrbWall *
add_wall (TrbFloor   *f,
          const char *id,
          double      x1,
          double      y1,
          double      x2,
          double      y2)
{
  TrbWall *w = trb_wall_new (id, "masonry");

  trb_points_append (w->points, x1, y1);
  trb_points_append (w->points, x2, y2);
  g_ptr_array_add (f->walls, w);
  return w;
}

static TrbAreaLoad *
add_area (TrbFloor        *f,
          TrbLoadCase      lcase,
          TrbAreaLoadKind  kind,
          double           pressure,
          const char      *occupancy,
          double           x1,
          double           y1,
          double           x2,
          double           y2)
{
  TrbAreaLoad *a = trb_area_load_new (lcase, kind, pressure, NULL, occupancy);

  trb_points_append (a->points, x1, y1);
  trb_points_append (a->points, x2, y1);
  trb_points_append (a->points, x2, y2);
  trb_points_append (a->points, x1, y2);
  g_ptr_array_add (f->area_loads, a);
  return a;
}

/* A framed grid: nx by ny bays of bx by by, columns at every grid point, girders along y on
 * every column line, spanning one bay each, and beams along x at spacing s between the
 * girders (those on the column lines rest on the columns). Marks: C<i>_<j>, G<i>_<j>
 * (girder on line i, bay j), B<i>_<k> (beam in bay column i, row k). */
static TrbFloor *
grid_floor (TrbProject *p,
            guint       nx,
            guint       ny,
            double      bx,
            double      by,
            double      s)
{
  TrbFloor *f = add_floor (p, "grid");
  guint rows = (guint) floor (ny * by / s + 0.5);

  for (guint i = 0; i <= nx; i++)
    for (guint j = 0; j <= ny; j++)
      {
        g_autofree char *id = g_strdup_printf ("C%u_%u", i, j);

        add_column (f, id, i * bx, j * by);
      }
  for (guint i = 0; i <= nx; i++)
    for (guint j = 0; j < ny; j++)
      {
        g_autofree char *id = g_strdup_printf ("G%u_%u", i, j);

        add_member (p, f, id, TRB_FRAME_ROLE_GIRDER, i * bx, j * by, i * bx, (j + 1) * by);
      }
  for (guint i = 0; i < nx; i++)
    for (guint k = 0; k <= rows; k++)
      {
        g_autofree char *id = g_strdup_printf ("B%u_%u", i, k);

        add_member (p, f, id, TRB_FRAME_ROLE_BEAM, i * bx, k * s, (i + 1) * bx, k * s);
      }
  return f;
}

/* ---- reading results ------------------------------------------------------------------- */

static const TrbMemberResult *
result_of (const TrbProjectResult *pr,
           const char             *id)
{
  const TrbMember *m = trb_project_find_member (pr->project, id);

  g_assert_nonnull (m);
  return trb_project_result_find_member (pr, m);
}

static const TrbColumnResult *
column_of (const TrbFloorResult *fr,
           const char           *id)
{
  for (guint i = 0; i < fr->columns->len; i++)
    {
      const TrbColumnResult *c = &g_array_index (fr->columns, TrbColumnResult, i);

      if (strcmp (c->column->id, id) == 0)
        return c;
    }
  g_assert_not_reached ();
  return NULL;
}

static double
reaction (const TrbMemberResult *r,
          TrbLoadCase            c,
          guint                  support)
{
  const TrbReaction *re;
  guint n;

  g_assert_nonnull (r->cases[c]);
  re = trb_beam_result_get_reactions (r->cases[c], &n);
  g_assert_cmpuint (support, <, n);
  return re[support].force;
}

/* Every load of a case in what the member was analysed with that came from the floor (line
 * 0), of a kind. */
static guint
count_loads (const TrbMemberResult *r,
             TrbLoadCase            c,
             TrbLoadKind            kind)
{
  guint n = 0;

  for (guint i = 0; i < r->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (r->loads, TrbMemberLoad, i);

      n += ml->lcase == c && ml->load.kind == kind;
    }
  return n;
}

static const TrbLoad *
nth_load (const TrbMemberResult *r,
          TrbLoadCase            c,
          TrbLoadKind            kind,
          guint                  k)
{
  for (guint i = 0; i < r->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (r->loads, TrbMemberLoad, i);

      if (ml->lcase == c && ml->load.kind == kind && k-- == 0)
        return &ml->load;
    }
  g_assert_not_reached ();
  return NULL;
}

static void
assert_balance (const TrbFloorResult *fr,
                double                rel)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      double scale = MAX (fabs (fr->applied[c]), 1.0);

      g_assert_cmpfloat_with_epsilon (fr->applied[c], fr->reactions[c] + fr->not_carried[c],
                                      rel * scale);
    }
}

/* ---- a digest of every number and word of the results, to compare solves bit for bit ---- */

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
dig_string (GByteArray *d,
            const char *s)
{
  if (s != NULL)
    dig (d, s, strlen (s) + 1);
  else
    dig (d, "\xff", 1);
}

/* field by field: structs may hold padding */
static void
dig_load (GByteArray    *d,
          const TrbLoad *l)
{
  dig (d, &l->kind, sizeof l->kind);
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
  TrbBeamValues v[7];
  double x[7];
  guint n;

  if (r == NULL)
    {
      dig_string (d, NULL);
      return;
    }
  re = trb_beam_result_get_reactions (r, &n);
  dig (d, re, n * sizeof *re);
  trb_beam_result_sample (r, 7, x, v);
  dig (d, v, sizeof v);
}

static void
dig_set (GByteArray              *d,
         const TrbComboSetResult *s)
{
  for (guint i = 0; i < s->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (s->entries, TrbComboResult, i);

      dig_string (d, c->name);
      dig (d, c->combo.factors, sizeof c->combo.factors);
      dig_extremes (d, &c->ext);
      dig_beam_result (d, c->result);
    }
  dig_extremes (d, &s->envelope.ext);
  dig_string (d, s->envelope.V_max_by);
  dig_string (d, s->envelope.M_max_by);
  dig_string (d, s->envelope.M_min_by);
  dig_string (d, s->envelope.defl_down_by);
  dig (d, s->envelope.reactions->data,
       s->envelope.reactions->len * sizeof (TrbReactionRange));
}

static GBytes *
digest (const TrbProjectResult *pr)
{
  GByteArray *d = g_byte_array_new ();

  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      dig_string (d, r->member->id);
      dig (d, &r->status, sizeof r->status);
      dig_string (d, r->message);
      for (guint k = 0; k < r->notes->len; k++)
        dig_string (d, g_ptr_array_index (r->notes, k));
      dig_string (d, r->section);
      dig_double (d, r->ratio);
      dig_string (d, r->governing);
      dig (d, &r->analysed, sizeof r->analysed);
      for (guint k = 0; k < r->checks->len; k++)
        {
          const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, k);

          dig_string (d, ck->name);
          dig_string (d, ck->clause);
          dig_double (d, ck->demand);
          dig_double (d, ck->capacity);
          dig_double (d, ck->ratio);
          dig_string (d, ck->combination);
          dig_double (d, ck->x);
          dig_string (d, ck->detail);
        }
      for (guint k = 0; k < r->shortlist->len; k++)
        {
          const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, k);

          dig_string (d, e->section);
          dig_double (d, e->ratio);
          dig_string (d, e->governing);
        }
      if (r->bearings != NULL)
        for (guint k = 0; k < r->bearings->len; k++)
          {
            const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, k);

            dig_double (d, b->x);
            dig_string (d, b->id);
            dig (d, b->force, sizeof b->force);
          }
      dig_double (d, r->reduction.area);
      dig_double (d, r->reduction.factor);
      if (!r->analysed)
        continue;
      dig_double (d, r->E);
      dig_double (d, r->I);
      dig_double (d, r->self_weight);
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          dig_beam_result (d, r->cases[c]);
          dig_extremes (d, &r->case_ext[c]);
        }
      for (guint k = 0; k < r->loads->len; k++)
        {
          const TrbMemberLoad *ml = &g_array_index (r->loads, TrbMemberLoad, k);

          dig (d, &ml->lcase, sizeof ml->lcase);
          dig_load (d, &ml->load);
        }
      trb_member_result_complete (r);
      dig_set (d, &r->strength);
      dig_set (d, &r->live);
      dig_set (d, &r->total);
    }
  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      dig (d, fr->applied, sizeof fr->applied);
      dig (d, fr->reactions, sizeof fr->reactions);
      dig (d, fr->not_carried, sizeof fr->not_carried);
      for (guint i = 0; i < fr->columns->len; i++)
        {
          const TrbColumnResult *c = &g_array_index (fr->columns, TrbColumnResult, i);

          dig (d, c->force, sizeof c->force);
          dig_double (d, c->live_reduced);
          dig_double (d, c->reduction.area);
        }
      for (guint i = 0; i < fr->walls->len; i++)
        {
          const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);

          for (guint c = 0; c < TRB_N_CASES; c++)
            for (guint k = 0; k < w->loads[c]->len; k++)
              dig_load (d, &g_array_index (w->loads[c], TrbLoad, k));
        }
      for (guint i = 0; i < fr->unassigned->len; i++)
        dig_double (d, g_array_index (fr->unassigned, TrbUnassignedLoad, i).force);
    }
  return g_byte_array_free_to_bytes (d);
}

static GBytes *
solve_digest (const TrbProject *p,
              gboolean          cache,
              gboolean          bounds)
{
  TrbSolveOptions options;
  g_autoptr(TrbProjectResult) pr = NULL;

  trb_solve_options_init (&options);
  options.cache = cache;
  options.bounds = bounds;
  /* the default solve makes no shortlist: ask for one so the digest covers it */
  options.shortlist_max = TRB_SHORTLIST_DEFAULT;
  pr = trb_solve_project_full (p, &options);
  return digest (pr);
}

/* Solving twice, and with and without the shortcuts, gives the same bytes. */
static void
assert_pure (const TrbProject *p)
{
  g_autoptr(GBytes) a = solve_digest (p, TRUE, TRUE);
  g_autoptr(GBytes) b = solve_digest (p, TRUE, TRUE);
  g_autoptr(GBytes) c = solve_digest (p, FALSE, FALSE);
  g_autoptr(GBytes) e = solve_digest (p, TRUE, FALSE);

  g_assert_true (g_bytes_equal (a, b));
  g_assert_true (g_bytes_equal (a, c));
  g_assert_true (g_bytes_equal (a, e));
}

/* ---- tests ----------------------------------------------------------------------------- */

/* A joist bay worked by hand (common practice; ENGINEERING.md §3 and §8 item 6): joists 14 ft
 * between two bearing walls at 16 in on centre, nine spaces (ten joists, 12 ft), D 10 psf and
 * L 40 psf over the bay, ending at the edge joists' lines.
 *   interior joist: tributary width 16 in, w = 50 psf x 16/12 ft = 66.67 plf
 *     (D 13.33, L 53.33 plf); R = w L / 2 = 66.67 x 14 / 2 = 466.7 lb (D 93.33, L 373.3);
 *     M = w L^2 / 8 = 66.67 x 14^2 / 8 = 1633 lb-ft = 19,600 lb-in (§8 item 6)
 *   edge joist: half a spacing, 8 in: R = 233.3 lb
 *   each wall: half the bay, 14 x 12 x 50 / 2 = 4200 lb (D 840, L 3360). */
static void
test_joist_bay (void)
{
  g_autoptr(TrbProject) p = project_new ();
  g_autoptr(TrbProjectResult) pr = NULL;
  TrbFloor *f = add_floor (p, "bay");
  const TrbFloorResult *fr;
  const TrbMemberResult *r;
  const TrbWallResult *w;
  double s = 16 * IN;

  p->settings.self_weight = FALSE;
  add_wall (f, "W1", 0, -1 * FT, 0, 13 * FT);
  add_wall (f, "W2", 14 * FT, -1 * FT, 14 * FT, 13 * FT);
  for (guint k = 0; k < 10; k++)
    {
      g_autofree char *id = g_strdup_printf ("J%u", k + 1);

      add_member (p, f, id, TRB_FRAME_ROLE_JOIST, 0, k * s, 14 * FT, k * s);
    }
  add_area (f, TRB_CASE_D, TRB_AREA_LOAD_ORDINARY, 10 * PSF, NULL, 0, 0, 14 * FT, 9 * s);
  add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 40 * PSF, "office", 0, 0, 14 * FT, 9 * s);

  pr = trb_solve_project (p);
  fr = g_ptr_array_index (pr->floors, 0);

  r = result_of (pr, "J5");
  g_assert_true (r->analysed);
  /* one uniform piece per case over the whole joist: w = q s */
  g_assert_cmpuint (count_loads (r, TRB_CASE_L, TRB_LOAD_UNIFORM), ==, 1);
  g_assert_cmpfloat_with_epsilon (nth_load (r, TRB_CASE_L, TRB_LOAD_UNIFORM, 0)->w1,
                                  40 * PSF * s, 1e-9);
  g_assert_cmpfloat_with_epsilon (nth_load (r, TRB_CASE_D, TRB_LOAD_UNIFORM, 0)->w1,
                                  10 * PSF * s, 1e-9);
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_D, 0), 93.333333333 * LBF, 1e-6);
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_L, 1), 373.333333333 * LBF, 1e-6);
  g_assert_cmpfloat_with_epsilon (r->case_ext[TRB_CASE_D].M_max + r->case_ext[TRB_CASE_L].M_max,
                                  19600 * LBF * IN, 1e-6);
  g_assert_cmpstr (g_array_index (r->bearings, TrbMemberBearing, 0).id, ==, "W1");
  g_assert_cmpstr (g_array_index (r->bearings, TrbMemberBearing, 1).id, ==, "W2");

  r = result_of (pr, "J1");
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_L, 0), 373.333333333 / 2 * LBF, 1e-6);
  r = result_of (pr, "J10");
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_D, 1), 93.333333333 / 2 * LBF, 1e-6);

  w = &g_array_index (fr->walls, TrbWallResult, 0);
  g_assert_cmpuint (w->loads[TRB_CASE_L]->len, ==, 10);
  g_assert_cmpfloat_with_epsilon (w->force[TRB_CASE_D], 840 * LBF, 1e-6);
  g_assert_cmpfloat_with_epsilon (w->force[TRB_CASE_L], 3360 * LBF, 1e-6);
  w = &g_array_index (fr->walls, TrbWallResult, 1);
  g_assert_cmpfloat_with_epsilon (w->force[TRB_CASE_L], 3360 * LBF, 1e-6);
  /* the load along the wall: each joist at its place, 16 in apart */
  g_assert_cmpfloat_with_epsilon (g_array_index (w->loads[TRB_CASE_L], TrbLoad, 1).a -
                                  g_array_index (w->loads[TRB_CASE_L], TrbLoad, 0).a, s, 1e-12);

  /* 14 x 12 ft x 50 psf in all, and all of it on the walls */
  g_assert_cmpfloat_with_epsilon (fr->applied[TRB_CASE_D] + fr->applied[TRB_CASE_L],
                                  14 * 12 * 50 * LBF, 1e-6);
  assert_balance (fr, 1e-12);
  g_assert_cmpuint (fr->unassigned->len, ==, 0);
}

/* The takedown of ENGINEERING.md §8 item 2 (statics): girders 24 ft, beams 20 ft at 8 ft,
 * D = L = 50 psf, self-weight excluded; two by two bays, 40 x 48 ft.
 *   beam: strip 8 ft, w = 400 plf per case, R = 4.0 k D + 4.0 k L
 *   interior girder: P = 2 x 8 = 16 k (D + L) at its third points, 8 k D + 8 k L;
 *     M = P L / 3 = 16 x 24 / 3 = 128 k-ft (64 k-ft per case)
 *   interior column: 2 x 16 (girders) + 2 x 8 (beams on the column line) = 48 k
 *     = 480 ft^2 x 0.100 ksf, 24 k per case
 *   all nine columns: 40 x 48 ft x 0.100 ksf = 192 k, 96 k per case. */
static void
test_takedown (void)
{
  g_autoptr(TrbProject) p = project_new ();
  g_autoptr(TrbProjectResult) pr = NULL;
  TrbFloor *f = grid_floor (p, 2, 2, 20 * FT, 24 * FT, 8 * FT);
  const TrbFloorResult *fr;
  const TrbMemberResult *r;
  const TrbColumnResult *c;
  double sum_d = 0, sum_l = 0;

  p->settings.self_weight = FALSE;
  add_area (f, TRB_CASE_D, TRB_AREA_LOAD_ORDINARY, 50 * PSF, NULL, 0, 0, 40 * FT, 48 * FT);
  add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 50 * PSF, "office", 0, 0, 40 * FT, 48 * FT);
  pr = trb_solve_project (p);
  fr = g_ptr_array_index (pr->floors, 0);
  g_assert_null (fr->error);

  /* a beam in the middle of a bay, on the girders G0_0 and G1_0 */
  r = result_of (pr, "B0_1");
  g_assert_cmpint (r->status, !=, TRB_STATUS_UNSUPPORTED);
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_D, 0), 4 * KIP, 1e-6);
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_L, 1), 4 * KIP, 1e-6);
  g_assert_cmpint (g_array_index (r->bearings, TrbMemberBearing, 1).kind, ==,
                   TRB_BEARING_MEMBER);
  g_assert_cmpstr (g_array_index (r->bearings, TrbMemberBearing, 1).id, ==, "G1_0");
  g_assert_cmpfloat_with_epsilon (g_array_index (r->bearings, TrbMemberBearing, 1)
                                    .force[TRB_CASE_L], 4 * KIP, 1e-6);

  /* the interior girder: a point load per case at each third point, both sides added */
  r = result_of (pr, "G1_0");
  g_assert_cmpuint (count_loads (r, TRB_CASE_D, TRB_LOAD_POINT), ==, 2);
  g_assert_cmpfloat_with_epsilon (nth_load (r, TRB_CASE_D, TRB_LOAD_POINT, 0)->a, 8 * FT, 1e-9);
  g_assert_cmpfloat_with_epsilon (nth_load (r, TRB_CASE_D, TRB_LOAD_POINT, 0)->w1, 8 * KIP,
                                  1e-6);
  g_assert_cmpfloat_with_epsilon (nth_load (r, TRB_CASE_L, TRB_LOAD_POINT, 1)->a, 16 * FT,
                                  1e-9);
  g_assert_cmpfloat_with_epsilon (nth_load (r, TRB_CASE_L, TRB_LOAD_POINT, 1)->w1, 8 * KIP,
                                  1e-6);
  g_assert_cmpfloat_with_epsilon (r->case_ext[TRB_CASE_D].M_max, 64 * KIP * FT, 1e-5);
  g_assert_cmpfloat_with_epsilon (r->case_ext[TRB_CASE_D].M_max + r->case_ext[TRB_CASE_L].M_max,
                                  128 * KIP * FT, 1e-5);
  /* no area load of its own: girders do not carry the deck */
  g_assert_cmpuint (count_loads (r, TRB_CASE_D, TRB_LOAD_UNIFORM), ==, 0);

  c = column_of (fr, "C1_1");
  g_assert_cmpfloat_with_epsilon (c->force[TRB_CASE_D], 24 * KIP, 1e-6);
  g_assert_cmpfloat_with_epsilon (c->force[TRB_CASE_L], 24 * KIP, 1e-6);
  g_assert_false (c->reduction.applies);
  g_assert_cmpfloat_with_epsilon (c->live_reduced, 24 * KIP, 1e-6);

  for (guint i = 0; i < fr->columns->len; i++)
    {
      c = &g_array_index (fr->columns, TrbColumnResult, i);
      sum_d += c->force[TRB_CASE_D];
      sum_l += c->force[TRB_CASE_L];
    }
  g_assert_cmpfloat_with_epsilon (sum_d, 96 * KIP, 1e-6);
  g_assert_cmpfloat_with_epsilon (sum_l, 96 * KIP, 1e-6);
  g_assert_cmpfloat_with_epsilon (fr->applied[TRB_CASE_L], 96 * KIP, 1e-6);
  assert_balance (fr, 1e-12);
  assert_pure (p);
}

/* Live load reduction through the floor solve, ASCE 7-16 §4.7 (from memory; ENGINEERING.md
 * §1.4 and §8 item 3), office Lo = 50 psf on the §8 item 2 floor:
 *   beam: A_T = 8 x 20 = 160 ft^2, K_LL 2, K_LL A_T = 320 < 400: not reduced (§8 item 3)
 *   interior girder: the area of the beams it carries, each in the share of its load that
 *     comes to it: 4 beams x 160 / 2 = 320 ft^2 (the formula A_T = Lg (L1 + L2) / 2 = 480 of
 *     §8 item 3 also counts the strips of the beams on the column lines, which rest on the
 *     columns here); K_LL 2: 0.25 + 15 / sqrt(640) = 0.84293, L = 42.15 psf
 *   interior column: 2 x 320 / 2 + 2 x 160 / 2 = 480 ft^2, K_LL 4:
 *     0.25 + 15 / sqrt(1920) = 0.59233, L = 29.62 psf (§8 item 3)
 *   its live load: 24 k unreduced (test_takedown), 24 x 0.59233 = 14.216 k reduced. */
static void
test_reduction_example (void)
{
  g_autoptr(TrbProject) p = project_new ();
  g_autoptr(TrbProjectResult) pr = NULL;
  TrbFloor *f = grid_floor (p, 2, 2, 20 * FT, 24 * FT, 8 * FT);
  const TrbFloorResult *fr;
  const TrbMemberResult *r;
  const TrbColumnResult *c;
  double girder = 0.25 + 15 / sqrt (2 * 320.0);
  double column = 0.25 + 15 / sqrt (4 * 480.0);
  double area_sum = 0;

  p->settings.self_weight = FALSE;
  p->settings.live_load_reduction = TRUE;
  add_area (f, TRB_CASE_D, TRB_AREA_LOAD_ORDINARY, 50 * PSF, NULL, 0, 0, 40 * FT, 48 * FT);
  add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 50 * PSF, "office", 0, 0, 40 * FT, 48 * FT);
  pr = trb_solve_project (p);
  fr = g_ptr_array_index (pr->floors, 0);

  r = result_of (pr, "B0_1");
  g_assert_true (r->reduction.applies);
  g_assert_cmpfloat_with_epsilon (r->reduction.area, 160 * FT * FT, 1e-9);
  g_assert_cmpfloat (r->reduction.k_ll, ==, 2);
  g_assert_cmpfloat (r->reduction.factor, ==, 1);
  g_assert_cmpint (r->reduction.rule, ==, TRB_LIVE_RULE_SMALL_AREA);
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_L, 0), 4 * KIP, 1e-6);

  r = result_of (pr, "G1_0");
  g_assert_cmpfloat_with_epsilon (r->reduction.area, 320 * FT * FT, 1e-9);
  g_assert_cmpfloat_with_epsilon (r->reduction.factor, girder, 1e-12);
  g_assert_cmpfloat_with_epsilon (girder * 50, 42.15, 0.005);
  /* the girder is designed for its reduced live load ... */
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_L, 0), 8 * KIP * girder, 1e-6);
  /* ... and hands the unreduced load down: half its two 8 k live loads */
  g_assert_cmpfloat_with_epsilon (g_array_index (r->bearings, TrbMemberBearing, 0)
                                    .force[TRB_CASE_L], 8 * KIP, 1e-6);

  c = column_of (fr, "C1_1");
  g_assert_true (c->reduction.applies);
  g_assert_cmpfloat_with_epsilon (c->reduction.area, 480 * FT * FT, 1e-9);
  g_assert_cmpfloat (c->reduction.k_ll, ==, 4);
  g_assert_cmpfloat_with_epsilon (c->reduction.factor, column, 1e-12);
  g_assert_cmpfloat_with_epsilon (column * 50, 29.62, 0.005);
  g_assert_cmpfloat_with_epsilon (c->force[TRB_CASE_L], 24 * KIP, 1e-6);
  g_assert_cmpfloat_with_epsilon (c->live_reduced, 24 * KIP * column, 1e-6);

  /* every square foot of live load reaches exactly one column's A_T: 40 x 48 ft */
  for (guint i = 0; i < fr->columns->len; i++)
    area_sum += g_array_index (fr->columns, TrbColumnResult, i).reduction.area;
  g_assert_cmpfloat_with_epsilon (area_sum, 40 * 48 * FT * FT, 1e-9);
  /* the totals carry unreduced loads */
  g_assert_cmpfloat_with_epsilon (fr->applied[TRB_CASE_L], 96 * KIP, 1e-6);
  assert_balance (fr, 1e-12);
  assert_pure (p);
}

/* The limits of §4.7.2 and the exclusion of §4.7.3 (ASCE 7-16, from memory; ENGINEERING.md
 * §1.4), on one bay of 60 x 60 ft with beams at 10 ft, the corner column carrying a quarter:
 *   A_T = 30 x 30 = 900 ft^2 (§8 item 3's 30 x 30 ft bay column), K_LL 4:
 *     0.25 + 15 / sqrt(3600) = 0.50: 25.00 psf, the one-floor limit (§8 item 3)
 *   with two floors above (three floors), still 0.50 (above the 0.40 limit)
 * and two by two bays of 60 x 60 ft, interior column A_T = 3600 ft^2:
 *   0.25 + 15 / sqrt(14400) = 0.375: 0.50 for one floor, 0.40 for three (§4.7.2)
 * and Lo = 125 psf (storage, above 100 psf): not reduced at all (§4.7.3); a partition load
 * (15 psf, §4.3.2) is never reduced. */
static void
test_reduction_limits (void)
{
  for (guint floors_above = 0; floors_above <= 2; floors_above += 2)
    {
      g_autoptr(TrbProject) p = project_new ();
      g_autoptr(TrbProjectResult) pr = NULL;
      TrbFloor *f = grid_floor (p, 1, 1, 60 * FT, 60 * FT, 10 * FT);
      const TrbColumnResult *c;

      p->settings.self_weight = FALSE;
      p->settings.live_load_reduction = TRUE;
      p->settings.floors_above = floors_above;
      add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 50 * PSF, "office", 0, 0, 60 * FT,
                60 * FT);
      pr = trb_solve_project (p);
      c = column_of (g_ptr_array_index (pr->floors, 0), "C0_0");
      g_assert_cmpfloat_with_epsilon (c->reduction.area, 900 * FT * FT, 1e-9);
      g_assert_cmpuint (c->reduction.floors, ==, 1 + floors_above);
      g_assert_cmpfloat_with_epsilon (c->reduction.factor, 0.50, 1e-12);
    }

  for (guint floors_above = 0; floors_above <= 2; floors_above += 2)
    {
      g_autoptr(TrbProject) p = project_new ();
      g_autoptr(TrbProjectResult) pr = NULL;
      TrbFloor *f = grid_floor (p, 2, 2, 60 * FT, 60 * FT, 10 * FT);
      const TrbColumnResult *c;

      p->settings.self_weight = FALSE;
      p->settings.live_load_reduction = TRUE;
      p->settings.floors_above = floors_above;
      add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 50 * PSF, "office", 0, 0, 120 * FT,
                120 * FT);
      pr = trb_solve_project (p);
      c = column_of (g_ptr_array_index (pr->floors, 0), "C1_1");
      g_assert_cmpfloat_with_epsilon (c->reduction.area, 3600 * FT * FT, 1e-9);
      g_assert_cmpfloat_with_epsilon (c->reduction.factor, floors_above == 0 ? 0.50 : 0.40,
                                      1e-12);
      g_assert_cmpint (c->reduction.rule, ==, floors_above == 0 ? TRB_LIVE_RULE_ONE_FLOOR_LIMIT
                                                                : TRB_LIVE_RULE_FLOORS_LIMIT);
      g_assert_cmpfloat_with_epsilon (c->live_reduced, c->force[TRB_CASE_L] * c->reduction.factor,
                                      1e-6);
    }

  {
    g_autoptr(TrbProject) p = project_new ();
    g_autoptr(TrbProjectResult) pr = NULL;
    TrbFloor *f = grid_floor (p, 2, 2, 60 * FT, 60 * FT, 10 * FT);
    const TrbColumnResult *c;
    const TrbMemberResult *r;

    p->settings.self_weight = FALSE;
    p->settings.live_load_reduction = TRUE;
    add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 125 * PSF, "storage", 0, 0, 120 * FT,
              120 * FT);
    pr = trb_solve_project (p);
    c = column_of (g_ptr_array_index (pr->floors, 0), "C1_1");
    g_assert_false (c->reduction.applies);
    g_assert_cmpfloat (c->live_reduced, ==, c->force[TRB_CASE_L]);
    /* 60 x 60 ft at 125 psf: 450 k on the interior column */
    g_assert_cmpfloat_with_epsilon (c->force[TRB_CASE_L], 450 * KIP, 1e-5);
    r = result_of (pr, "G1_0");
    g_assert_false (r->reduction.applies);
    g_assert_cmpfloat (r->reduction.factor, ==, 1);
    /* the interior girder takes the beams' strips from 5 to 55 ft, half of each 60 ft beam:
     * 50 x 60 ft x 125 psf = 375 k, none of it reducible */
    g_assert_cmpfloat_with_epsilon (r->reduction.other, 375 * KIP, 1e-5);
    assert_balance (g_ptr_array_index (pr->floors, 0), 1e-12);
  }

  {
    g_autoptr(TrbProject) p = project_new ();
    g_autoptr(TrbProjectResult) pr = NULL;
    TrbFloor *f = grid_floor (p, 2, 2, 60 * FT, 60 * FT, 10 * FT);
    const TrbColumnResult *c;

    p->settings.self_weight = FALSE;
    p->settings.live_load_reduction = TRUE;
    add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 50 * PSF, "office", 0, 0, 120 * FT,
              120 * FT);
    add_area (f, TRB_CASE_L, TRB_AREA_LOAD_PARTITION, 15 * PSF, "office", 0, 0, 120 * FT,
              120 * FT);
    pr = trb_solve_project (p);
    c = column_of (g_ptr_array_index (pr->floors, 0), "C1_1");
    /* 3600 ft^2 x 50 psf = 180 k reduced to 0.50 (one floor); 3600 x 15 psf = 54 k not */
    g_assert_cmpfloat_with_epsilon (c->reduction.reducible, 180 * KIP, 1e-5);
    g_assert_cmpfloat_with_epsilon (c->reduction.other, 54 * KIP, 1e-5);
    g_assert_cmpfloat_with_epsilon (c->force[TRB_CASE_L], 234 * KIP, 1e-5);
    g_assert_cmpfloat_with_epsilon (c->live_reduced, 90 * KIP + 54 * KIP, 1e-5);
    assert_balance (g_ptr_array_index (pr->floors, 0), 1e-12);
    assert_pure (p);
  }
}

/* Statuses: a joist with one end on nothing is unsupported; one resting on it is too, with the
 * reason; two members meeting at a corner with nothing under it rest on each other (a cycle):
 * an error on both; what was on them is reported as not carried, and the girder that the
 * unsupported joist leans on is told its loads are incomplete. A point load on no member and
 * the part of a line load on no member are reported with their force. */
static void
test_statuses (void)
{
  g_autoptr(TrbProject) p = project_new ();
  g_autoptr(TrbProjectResult) pr = NULL;
  TrbFloor *f = add_floor (p, "statuses");
  const TrbFloorResult *fr;
  const TrbMemberResult *r;
  TrbPointLoad *pl;
  TrbLineLoad *ll;
  TrbFramePoint at = { 30 * FT, 30 * FT };

  p->settings.self_weight = FALSE;
  add_column (f, "C1", 0, 0);
  add_column (f, "C2", 0, 20 * FT);
  add_member (p, f, "G1", TRB_FRAME_ROLE_GIRDER, 0, 0, 0, 20 * FT);
  /* J1 rests on G1 at its start and on nothing at its end */
  add_member (p, f, "J1", TRB_FRAME_ROLE_JOIST, 0, 10 * FT, 12 * FT, 10 * FT);
  /* J2 rests on J1 and on G1 */
  add_member (p, f, "J2", TRB_FRAME_ROLE_JOIST, 6 * FT, 10 * FT, 0, 14 * FT)->carries_deck =
    FALSE;
  /* K1 and K2 meet at a corner: each end lies on the other's line */
  add_member (p, f, "K1", TRB_FRAME_ROLE_BEAM, 40 * FT, 40 * FT, 50 * FT, 40 * FT);
  add_member (p, f, "K2", TRB_FRAME_ROLE_BEAM, 50 * FT, 40 * FT, 50 * FT, 50 * FT);
  add_column (f, "C3", 40 * FT, 40 * FT);
  add_column (f, "C4", 50 * FT, 50 * FT);
  add_area (f, TRB_CASE_D, TRB_AREA_LOAD_ORDINARY, 20 * PSF, NULL, 0, 8 * FT, 12 * FT, 12 * FT);

  pl = trb_point_load_new (TRB_CASE_L, 3 * KIP, at, "hoist");
  g_ptr_array_add (f->point_loads, pl);
  ll = trb_line_load_new (TRB_CASE_D, 200 * TRB_PLF, "rail");
  trb_points_append (ll->points, 40 * FT, 40 * FT);
  trb_points_append (ll->points, 56 * FT, 40 * FT);
  g_ptr_array_add (f->line_loads, ll);

  pr = trb_solve_project (p);
  fr = g_ptr_array_index (pr->floors, 0);

  r = result_of (pr, "J1");
  g_assert_cmpint (r->status, ==, TRB_STATUS_UNSUPPORTED);
  g_assert_nonnull (strstr (r->message, "one support"));
  g_assert_false (r->analysed);
  r = result_of (pr, "J2");
  g_assert_cmpint (r->status, ==, TRB_STATUS_UNSUPPORTED);
  g_assert_cmpstr (r->message, ==, "bears on member J1, which is unsupported");
  r = result_of (pr, "K1");
  g_assert_cmpint (r->status, ==, TRB_STATUS_ERROR);
  g_assert_nonnull (strstr (r->message, "bearing cycle"));
  r = result_of (pr, "K2");
  g_assert_cmpint (r->status, ==, TRB_STATUS_ERROR);
  r = result_of (pr, "G1");
  g_assert_true (r->analysed);
  g_assert_cmpint (r->status, ==, TRB_STATUS_NOT_DESIGNED);
  g_assert_nonnull (strstr (r->message, "loads incomplete"));

  /* J1's strip: 12 ft long, 4 ft wide (to the load's edges, no neighbour) at 20 psf */
  g_assert_cmpfloat_with_epsilon (fr->not_carried[TRB_CASE_D], 12 * 4 * 20 * LBF +
                                  10 * 200 * LBF, 1e-6);
  /* 6 ft of the rail (50 to 56 ft) lies on no member, the hoist on none at all */
  g_assert_cmpuint (fr->unassigned->len, ==, 2);
  g_assert_true (g_array_index (fr->unassigned, TrbUnassignedLoad, 0).line == ll);
  g_assert_cmpfloat_with_epsilon (g_array_index (fr->unassigned, TrbUnassignedLoad, 0).length,
                                  6 * FT, 1e-9);
  g_assert_cmpfloat_with_epsilon (g_array_index (fr->unassigned, TrbUnassignedLoad, 0).force,
                                  6 * 200 * LBF, 1e-6);
  g_assert_true (g_array_index (fr->unassigned, TrbUnassignedLoad, 1).point == pl);
  g_assert_cmpfloat_with_epsilon (g_array_index (fr->unassigned, TrbUnassignedLoad, 1).force,
                                  3 * KIP, 1e-6);
  g_assert_cmpfloat (fr->applied[TRB_CASE_L], ==, 0);
  assert_balance (fr, 1e-12);
  assert_pure (p);
}

/* A member's own fixed support makes a cantilever stable where the plan gives one bearing:
 * a beam from a column running out 6 ft with nothing under its tip, fixed at the column.
 * Statics: the uniform load q over 6 ft gives R = 6 q and a moment 18 q at the column. */
static void
test_own_support (void)
{
  g_autoptr(TrbProject) p = project_new ();
  g_autoptr(TrbProjectResult) pr = NULL;
  TrbFloor *f = add_floor (p, "own");
  TrbMember *m;
  TrbMemberSupport s = { { 0, TRB_SUPPORT_FIXED }, 0 };
  TrbMemberLoad load = { TRB_CASE_D, { TRB_LOAD_UNIFORM, 0, 6 * FT, 100 * TRB_PLF, 0 }, 0 };
  const TrbMemberResult *r;
  const TrbFloorResult *fr;

  p->settings.self_weight = FALSE;
  add_column (f, "C1", 0, 0);
  m = add_member (p, f, "M1", TRB_FRAME_ROLE_BEAM, 0, 0, 6 * FT, 0);
  g_array_append_val (m->supports, s);
  g_array_append_val (m->loads, load);
  pr = trb_solve_project (p);
  fr = g_ptr_array_index (pr->floors, 0);
  r = result_of (pr, "M1");
  g_assert_true (r->analysed);
  g_assert_cmpuint (r->bearings->len, ==, 1);
  g_assert_false (g_array_index (r->bearings, TrbMemberBearing, 0).own);
  g_assert_cmpfloat_with_epsilon (column_of (fr, "C1")->force[TRB_CASE_D], 600 * LBF, 1e-6);
  g_assert_cmpfloat_with_epsilon (reaction (r, TRB_CASE_D, 0), 600 * LBF, 1e-6);
  assert_balance (fr, 1e-12);
}

/* Random floors (irregular column lines and joist spacings, continuous girders over several
 * columns, cantilevered girders and joists, partial and oblique load polygons, openings,
 * a wall, line and point loads, the members' own loads): every case's applied load equals the
 * sum of the column, wall and own-support reactions and what stayed on members that could not
 * be analysed, to 1e-9 relative (statics). */
/* roof: a roof live load too, so that with reduction every case slot is used and the live
 * load that is never reduced needs a frame of its own */
static TrbProject *
random_floor (GRand   *rand,
              gboolean reduction,
              gboolean roof)
{
  TrbProject *p = project_new ();
  TrbFloor *f = add_floor (p, "random");
  guint nx = g_rand_int_range (rand, 2, 4);
  guint ny = g_rand_int_range (rand, 2, 4);
  double xs[5], ys[5];
  double cant = g_rand_boolean (rand) ? g_rand_double_range (rand, 2, 6) * FT : 0;
  double over = g_rand_boolean (rand) ? g_rand_double_range (rand, 1, 3) * FT : 0;
  gboolean wall = g_rand_boolean (rand);
  guint n_j = 0;

  p->settings.live_load_reduction = reduction;
  p->settings.self_weight = g_rand_boolean (rand);
  xs[0] = ys[0] = 0;
  for (guint i = 1; i <= nx; i++)
    xs[i] = xs[i - 1] + g_rand_double_range (rand, 14, 26) * FT;
  for (guint j = 1; j <= ny; j++)
    ys[j] = ys[j - 1] + g_rand_double_range (rand, 16, 30) * FT;

  /* columns on every line but the first, where a wall may stand instead */
  for (guint i = 0; i <= nx; i++)
    for (guint j = 0; j <= ny; j++)
      {
        g_autofree char *id = g_strdup_printf ("C%u_%u", i, j);

        if (i == 0 && wall)
          continue;
        add_column (f, id, xs[i], ys[j]);
      }
  if (wall)
    add_wall (f, "W1", 0, -1 * FT, 0, ys[ny] + 1 * FT);

  /* girders along y on lines 1..nx: continuous over the whole line, or one per bay; the
   * last may run on past the last column */
  for (guint i = 1; i <= nx; i++)
    {
      gboolean continuous = g_rand_boolean (rand);
      double y_end = ys[ny] + (i == nx ? cant : 0);

      if (continuous)
        {
          g_autofree char *id = g_strdup_printf ("G%u", i);

          add_member (p, f, id, TRB_FRAME_ROLE_GIRDER, xs[i], 0, xs[i], y_end);
        }
      else
        for (guint j = 0; j < ny; j++)
          {
            g_autofree char *id = g_strdup_printf ("G%u_%u", i, j);

            add_member (p, f, id, TRB_FRAME_ROLE_GIRDER, xs[i], ys[j], xs[i],
                        j + 1 == ny ? y_end : ys[j + 1]);
          }
    }
  if (!wall)
    add_member (p, f, "G0", TRB_FRAME_ROLE_GIRDER, 0, 0, 0, ys[ny]);

  /* joists along x in each bay column at irregular spacing, the last bay's running on past
   * the last girder line */
  for (guint i = 0; i < nx; i++)
    {
      double y = g_rand_double_range (rand, 0.5, 2) * FT;

      while (y < ys[ny] - 0.5 * FT)
        {
          g_autofree char *id = g_strdup_printf ("J%u", ++n_j);
          TrbMember *m;

          /* keep clear of the column lines, where a joist would rest on the column */
          gboolean near_line = FALSE;

          for (guint j = 0; j <= ny; j++)
            near_line |= fabs (y - ys[j]) < 0.2 * FT;
          if (!near_line)
            {
              m = add_member (p, f, id, TRB_FRAME_ROLE_JOIST, xs[i], y,
                              xs[i + 1] + (i + 1 == nx ? over : 0), y);
              /* a member rests where it passes over another only at a listed point */
              if (i + 1 == nx && over > 0)
                {
                  TrbFramePoint bp = { xs[nx], y };

                  trb_member_add_bearing_point (m, bp);
                }
              if (g_rand_int_range (rand, 0, 8) == 0)
                {
                  TrbMemberLoad load = { TRB_CASE_D,
                                         { TRB_LOAD_POINT, 0.5 * m->length, 0,
                                           g_rand_double_range (rand, 100, 900) * LBF, 0 }, 0 };

                  g_array_append_val (m->loads, load);
                }
            }
          y += g_rand_double_range (rand, 1, 3) * FT;
        }
    }

  /* loads: a dead load over a polygon with an oblique edge, live load over part of it,
   * snow here and there, a partition, an opening, a line load along a girder line and point
   * loads (one off every member) */
  {
    TrbAreaLoad *a = trb_area_load_new (TRB_CASE_D, TRB_AREA_LOAD_ORDINARY,
                                        g_rand_double_range (rand, 10, 80) * PSF, NULL, NULL);
    TrbOpening *o = trb_opening_new ();
    TrbLineLoad *ll = trb_line_load_new (TRB_CASE_D, g_rand_double_range (rand, 50, 400) *
                                         TRB_PLF, "partition line");
    double X = xs[nx] + over, Y = ys[ny];

    trb_points_append (a->points, -2 * FT, -2 * FT);
    trb_points_append (a->points, X + 2 * FT, -2 * FT);
    trb_points_append (a->points, X + 2 * FT, 0.7 * Y);
    trb_points_append (a->points, 0.6 * X, Y + 2 * FT);
    trb_points_append (a->points, -2 * FT, Y + 2 * FT);
    g_ptr_array_add (f->area_loads, a);
    add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, g_rand_double_range (rand, 40, 125) * PSF,
              "office", 0.2 * X, -1 * FT, X + 1 * FT, 0.8 * Y);
    add_area (f, TRB_CASE_L, TRB_AREA_LOAD_PARTITION, 15 * PSF, "office", -1 * FT, 0.3 * Y,
              0.9 * X, Y + 1 * FT);
    add_area (f, TRB_CASE_S, TRB_AREA_LOAD_ORDINARY, g_rand_double_range (rand, 10, 40) * PSF,
              NULL, 0.5 * X, 0.5 * Y, X, Y);
    if (roof)
      add_area (f, TRB_CASE_LR, TRB_AREA_LOAD_ORDINARY, 20 * PSF, NULL, 0, 0, 0.5 * X, 0.5 * Y);
    trb_points_append (o->points, 0.3 * X, 0.3 * Y);
    trb_points_append (o->points, 0.45 * X, 0.3 * Y);
    trb_points_append (o->points, 0.45 * X, 0.42 * Y);
    trb_points_append (o->points, 0.3 * X, 0.42 * Y);
    g_ptr_array_add (f->openings, o);
    trb_points_append (ll->points, xs[1], 0.1 * Y);
    trb_points_append (ll->points, xs[1], 0.6 * Y);
    g_ptr_array_add (f->line_loads, ll);
    for (guint k = 0; k < 4; k++)
      {
        TrbFramePoint at = { xs[g_rand_int_range (rand, 1, nx + 1)],
                             g_rand_double_range (rand, 0.05, 0.95) * Y };

        g_ptr_array_add (f->point_loads,
                         trb_point_load_new (k % 2 ? TRB_CASE_L : TRB_CASE_D,
                                             g_rand_double_range (rand, 1, 6) * KIP, at, NULL));
      }
    {
      TrbFramePoint off = { X + 40 * FT, Y + 40 * FT };

      g_ptr_array_add (f->point_loads, trb_point_load_new (TRB_CASE_L, 2 * KIP, off, NULL));
    }
  }
  /* self-weights, so that they go down the load path too */
  for (guint i = 0; i < p->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (p->members, i);

      m->weight = g_rand_double_range (rand, 5, 60) * TRB_PLF;
    }
  return p;
}

static void
test_equilibrium (void)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261201);

  for (guint k = 0; k < 12; k++)
    {
      g_autoptr(TrbProject) p = random_floor (rand, k % 2 == 1, k % 4 >= 2);
      g_autoptr(TrbProjectResult) pr = trb_solve_project (p);
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, 0);
      guint analysed = 0;

      g_assert_null (fr->error);
      for (guint i = 0; i < pr->members->len; i++)
        {
          const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

          analysed += r->analysed;
          if (!r->analysed)
            g_test_message ("%s not analysed: %s", r->member->id, r->message);
        }
      g_assert_cmpuint (analysed, ==, pr->members->len);
      g_assert_cmpfloat (fr->applied[TRB_CASE_D], >, 0);
      g_assert_cmpfloat (fr->applied[TRB_CASE_L], >, 0);
      g_assert_cmpfloat (fr->applied[TRB_CASE_S], >, 0);
      if (k % 4 >= 2)
        g_assert_cmpfloat (fr->applied[TRB_CASE_LR], >, 0);
      for (guint c = 0; c < TRB_N_CASES; c++)
        g_assert_cmpfloat (fr->not_carried[c], ==, 0);
      assert_balance (fr, 1e-9);
      /* the point load placed off every member */
      g_assert_cmpuint (fr->unassigned->len, >=, 1);
      if (k < 6)
        assert_pure (p);
    }
}

/* Sizing with and without the bounds, on members where they reject much (steel by ASD and
 * LRFD, timber, allowable stress, one member nothing passes): the same results. */
static void
test_bounds (void)
{
  static const char *xml =
    "<trabeate-project format=\"1\"><settings method=\"asd\"/>"
    "<beam id=\"S1\" length=\"30 ft\" material=\"steel\" section=\"auto\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"24 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"30 ft\" w=\"0.8 kip/ft\"/>"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"30 ft\" w=\"1.5 kip/ft\"/></beam>"
    "<beam id=\"S2\" length=\"28 ft\" material=\"steel\" section=\"auto\" method=\"lrfd\" "
    "bracing=\"supports\"><brace at=\"14 ft\"/>"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"28 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"point\" at=\"10 ft\" p=\"12 kip\"/>"
    "<load case=\"L\" type=\"point\" at=\"18 ft\" p=\"20 kip\"/></beam>"
    "<beam id=\"T1\" length=\"14 ft\" material=\"wood\" section=\"auto\" "
    "species=\"Douglas Fir-Larch\" grade=\"No.2\" repetitive=\"yes\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"14 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"14 ft\" w=\"13.33 plf\"/>"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"14 ft\" w=\"53.33 plf\"/></beam>"
    "<beam id=\"A1\" length=\"20 ft\" material=\"steel\" section=\"auto\" method=\"allowable\" "
    "fb-allow=\"24 ksi\" fv-allow=\"14.5 ksi\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"20 ft\" type=\"roller\"/>"
    "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"20 ft\" w=\"2 kip/ft\"/></beam>"
    "<beam id=\"N1\" length=\"40 ft\" material=\"steel\" section=\"auto\" "
    "allowed=\"W8X10 W10X12 W12X14\">"
    "<support at=\"0 ft\" type=\"pin\"/><support at=\"40 ft\" type=\"roller\"/>"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"40 ft\" w=\"3 kip/ft\"/></beam>"
    "</trabeate-project>";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (xml, strlen (xml), "bounds.trabeate",
                                                   &error);
  g_autoptr(TrbProjectResult) pr = NULL;

  g_assert_no_error (error);
  assert_pure (p);
  pr = trb_solve_project (p);
  g_assert_cmpint (((TrbMemberResult *) g_ptr_array_index (pr->members, 0))->status, ==,
                   TRB_STATUS_PASS);
  g_assert_cmpint (((TrbMemberResult *) g_ptr_array_index (pr->members, 4))->status, ==,
                   TRB_STATUS_FAIL);
}

/* trb_solve_member() on a floor member solves it with its floor: the same as the project's. */
static void
test_member_alone (void)
{
  g_autoptr(TrbProject) p = project_new ();
  g_autoptr(TrbProjectResult) pr = NULL;
  g_autoptr(TrbMemberResult) r = NULL;
  TrbFloor *f = grid_floor (p, 1, 1, 20 * FT, 24 * FT, 8 * FT);
  const TrbMemberResult *in_project;

  add_area (f, TRB_CASE_L, TRB_AREA_LOAD_ORDINARY, 50 * PSF, "office", 0, 0, 20 * FT, 24 * FT);
  pr = trb_solve_project (p);
  r = trb_solve_member (p, trb_project_find_member (p, "G0_0"));
  in_project = result_of (pr, "G0_0");
  g_assert_cmpint (r->status, ==, in_project->status);
  g_assert_cmpfloat (reaction (r, TRB_CASE_L, 0), ==, reaction (in_project, TRB_CASE_L, 0));
  g_assert_cmpuint (r->bearings->len, ==, 2);
}

/* The generated floor of the benchmark, at about 1,000 members: every member analysed, the
 * loads balance (statics), nothing is left on no member, and the solve is the same with and
 * without its shortcuts. */
static void
test_generated (void)
{
  guint n = 0;
  g_autofree char *xml = floor_gen_xml (1000, &n);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (xml, strlen (xml), "generated.trabeate",
                                                   &error);
  g_autoptr(TrbProjectResult) pr = NULL;
  const TrbFloorResult *fr;

  g_assert_no_error (error);
  g_assert_cmpuint (p->members->len, ==, n);
  g_assert_cmpuint (n, >=, 900);
  g_assert_cmpuint (n, <=, 1100);
  pr = trb_solve_project (p);
  fr = g_ptr_array_index (pr->floors, 0);
  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      if (!r->analysed)
        g_test_message ("%s: %s", r->member->id, r->message);
      g_assert_true (r->analysed);
    }
  g_assert_cmpuint (fr->unassigned->len, ==, 0);
  assert_balance (fr, 1e-9);
  assert_pure (p);
}

/* The example files load and solve the same every time, with and without the shortcuts. */
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
      g_autoptr(TrbProjectResult) pr = NULL;

      if (!g_file_test (path, G_FILE_TEST_EXISTS))
        {
          g_test_message ("%s not there yet", files[i]);
          continue;
        }
      p = trb_project_load_file (path, &error);
      g_assert_no_error (error);
      assert_pure (p);
      pr = trb_solve_project (p);
      for (guint f = 0; f < pr->floors->len; f++)
        {
          const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

          g_assert_null (fr->error);
          assert_balance (fr, 1e-9);
          g_assert_cmpuint (fr->unassigned->len, ==, 0);
        }
    }
}

int
main (int    argc,
      char **argv)
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/floor/joist-bay", test_joist_bay);
  g_test_add_func ("/trb/floor/takedown", test_takedown);
  g_test_add_func ("/trb/floor/reduction/example", test_reduction_example);
  g_test_add_func ("/trb/floor/reduction/limits", test_reduction_limits);
  g_test_add_func ("/trb/floor/statuses", test_statuses);
  g_test_add_func ("/trb/floor/own-support", test_own_support);
  g_test_add_func ("/trb/floor/equilibrium", test_equilibrium);
  g_test_add_func ("/trb/floor/bounds", test_bounds);
  g_test_add_func ("/trb/floor/member-alone", test_member_alone);
  g_test_add_func ("/trb/floor/examples", test_examples);
  g_test_add_func ("/trb/floor/generated", test_generated);

  return g_test_run ();
}
