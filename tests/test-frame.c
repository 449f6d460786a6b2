/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-error.h"
#include "trb-frame.h"

#include <math.h>
#include <string.h>

/* Exact by definition (1959); kept here so the test stands on the module alone. */
#define IN  0.0254
#define FT  0.3048
#define LBF 4.4482216152605
#define KIP (1000.0 * LBF)
#define PSF (LBF / (FT * FT))
#define PLF (LBF / FT)

#define P(x, y) { (x), (y) }

static TrbFrame *
frame_new (const TrbFramePlan *plan)
{
  g_autoptr(GError) error = NULL;
  TrbFrame *frame = trb_frame_new (plan, &error);

  g_assert_no_error (error);
  g_assert_nonnull (frame);
  return frame;
}

static const TrbFrameMemberResult *
member (const TrbFrame *frame,
        const char     *id)
{
  guint index = G_MAXUINT;

  g_assert_true (trb_frame_lookup_member (frame, id, &index));
  return trb_frame_get_member (frame, index);
}

static void
assert_support (const TrbFrameMemberResult *r,
                guint                       i,
                double                      x,
                TrbBearingKind              kind,
                const char                 *id,
                double                      position)
{
  g_assert_cmpuint (i, <, r->n_supports);
  g_assert_cmpfloat_with_epsilon (r->supports[i].x, x, 1e-9);
  g_assert_cmpint (r->supports[i].type, ==, TRB_SUPPORT_PIN);
  g_assert_cmpint (r->bearings[i].kind, ==, kind);
  g_assert_cmpstr (r->bearings[i].id, ==, id);
  g_assert_cmpfloat_with_epsilon (r->bearings[i].position, position, 1e-9);
}

static void
assert_load (const TrbLoad *l,
             TrbLoadKind    kind,
             double         a,
             double         b,
             double         w1,
             double         w2)
{
  g_assert_cmpint (l->kind, ==, kind);
  g_assert_cmpfloat_with_epsilon (l->a, a, 1e-9);
  g_assert_cmpfloat_with_epsilon (l->b, b, 1e-9);
  g_assert_cmpfloat_with_epsilon (l->w1, w1, 1e-9 * MAX (fabs (w1), 1.0));
  if (kind == TRB_LOAD_LINEAR || kind == TRB_LOAD_UNIFORM)
    g_assert_cmpfloat_with_epsilon (l->w2, w2, 1e-9 * MAX (fabs (w2), 1.0));
}

static gboolean
contains (const char *haystack,
          const char *needle)
{
  return haystack != NULL && strstr (haystack, needle) != NULL;
}

/* ---- bearing -------------------------------------------------------------------------------- */

/* Every check value in this part is geometry of the plan itself: where the ends and columns
 * were drawn (common practice: a member bears where its end lies on a support). */

static void
test_bearing_columns (void)
{
  TrbFrameColumn columns[] = { { "C1", 0, 0 }, { "C2", 6, 0 } };
  TrbFrameMember members[] = { { "B1", P (0, 0), P (6, 0), TRB_FRAME_ROLE_BEAM, FALSE } };
  TrbFramePlan plan = { .columns = columns, .n_columns = 2, .members = members, .n_members = 1 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *r = member (frame, "B1");

  g_assert_cmpfloat_with_epsilon (r->length, 6.0, 1e-12);
  g_assert_cmpuint (r->n_supports, ==, 2);
  assert_support (r, 0, 0.0, TRB_BEARING_COLUMN, "C1", 0.0);
  assert_support (r, 1, 6.0, TRB_BEARING_COLUMN, "C2", 0.0);
  g_assert_cmpint (r->status, ==, TRB_FRAME_SUPPORTED);
  g_assert_null (r->reason);
}

static void
test_bearing_walls (void)
{
  TrbFramePoint w1[] = { P (0, -3), P (0, 3) };
  TrbFramePoint w2[] = { P (8, -3), P (6, -3), P (6, 3) };  /* an L: bearing on its 2nd leg */
  TrbFrameWall walls[] = { { "W1", w1, 2 }, { "W2", w2, 3 } };
  TrbFrameMember members[] = { { "B1", P (0, 1), P (6, 1), TRB_FRAME_ROLE_BEAM, FALSE } };
  TrbFramePlan plan = { .walls = walls, .n_walls = 2, .members = members, .n_members = 1 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *r = member (frame, "B1");

  /* W1 from (0, -3) up to y = 1: 4 m along it; W2: 2 m of its first leg, then 4 m up */
  g_assert_cmpuint (r->n_supports, ==, 2);
  assert_support (r, 0, 0.0, TRB_BEARING_WALL, "W1", 4.0);
  assert_support (r, 1, 6.0, TRB_BEARING_WALL, "W2", 6.0);
  g_assert_cmpint (r->status, ==, TRB_FRAME_SUPPORTED);
}

static void
test_bearing_tolerance (void)
{
  TrbFrameColumn columns[] = {
    { "C1", 0, 0 }, { "C2", 0, 6 }, { "C3", 5, 2 }, { "C4", 5, 4 },
  };
  TrbFrameMember members[] = {
    { "G1", P (0, 0), P (0, 6), TRB_FRAME_ROLE_GIRDER, FALSE },
    /* 20 mm short of the girder's line: within the 25 mm tolerance, bears on it */
    { "J1", P (0.020, 2), P (5, 2), TRB_FRAME_ROLE_JOIST, FALSE },
    /* 30 mm short: outside it, so this end rests on nothing */
    { "J2", P (0.030, 4), P (5, 4), TRB_FRAME_ROLE_JOIST, FALSE },
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 4, .members = members, .n_members = 3 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *j1 = member (frame, "J1");
  const TrbFrameMemberResult *j2 = member (frame, "J2");

  g_assert_cmpuint (j1->n_supports, ==, 2);
  /* 2 m up the girder from its start at (0, 0) */
  assert_support (j1, 0, 0.0, TRB_BEARING_MEMBER, "G1", 2.0);
  assert_support (j1, 1, 4.980, TRB_BEARING_COLUMN, "C3", 0.0);
  g_assert_cmpint (j1->status, ==, TRB_FRAME_SUPPORTED);

  g_assert_cmpuint (j2->n_supports, ==, 1);
  assert_support (j2, 0, 4.970, TRB_BEARING_COLUMN, "C4", 0.0);
  g_assert_cmpint (j2->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (j2->reason, "one support"));
}

static void
test_bearing_continuous (void)
{
  TrbFrameColumn columns[] = { { "C1", 0, 0 }, { "C2", 4, 0 }, { "C3", 10, 0 } };
  TrbFramePoint w1[] = { P (7, -1), P (7, 1) };
  TrbFrameWall walls[] = { { "W1", w1, 2 } };
  TrbFrameMember members[] = {
    { "B1", P (0, 0), P (10, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    /* the same line without the wall: two spans over the middle column */
    { "B2", P (0, 0.01), P (10, 0.01), TRB_FRAME_ROLE_BEAM, FALSE },
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 3, .members = members, .n_members = 1,
                        .walls = walls, .n_walls = 1 };
  g_autoptr(TrbFrame) with_wall = frame_new (&plan);
  g_autoptr(TrbFrame) two_spans = NULL;
  const TrbFrameMemberResult *r = member (with_wall, "B1");

  /* passes over C2 and W1 (1 m up W1 from its start at (7, -1)) */
  g_assert_cmpuint (r->n_supports, ==, 4);
  assert_support (r, 0, 0.0, TRB_BEARING_COLUMN, "C1", 0.0);
  assert_support (r, 1, 4.0, TRB_BEARING_COLUMN, "C2", 0.0);
  assert_support (r, 2, 7.0, TRB_BEARING_WALL, "W1", 1.0);
  assert_support (r, 3, 10.0, TRB_BEARING_COLUMN, "C3", 0.0);

  plan.members = &members[1];
  plan.n_walls = 0;
  two_spans = frame_new (&plan);
  r = member (two_spans, "B2");
  g_assert_cmpuint (r->n_supports, ==, 3);
  assert_support (r, 1, 4.0, TRB_BEARING_COLUMN, "C2", 0.0);
  g_assert_cmpint (r->status, ==, TRB_FRAME_SUPPORTED);
}

static void
test_bearing_cantilever (void)
{
  TrbFrameColumn columns[] = { { "C1", 0, 0 }, { "C2", 6, 0 } };
  TrbFrameMember members[] = { { "B1", P (0, 0), P (8, 0), TRB_FRAME_ROLE_BEAM, FALSE } };
  TrbFramePlan plan = { .columns = columns, .n_columns = 2, .members = members, .n_members = 1 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *r = member (frame, "B1");

  /* 6 m back span, 2 m cantilever past C2 */
  g_assert_cmpfloat_with_epsilon (r->length, 8.0, 1e-12);
  g_assert_cmpuint (r->n_supports, ==, 2);
  assert_support (r, 0, 0.0, TRB_BEARING_COLUMN, "C1", 0.0);
  assert_support (r, 1, 6.0, TRB_BEARING_COLUMN, "C2", 0.0);
  g_assert_cmpint (r->status, ==, TRB_FRAME_SUPPORTED);
}

static void
test_bearing_listed_point (void)
{
  TrbFrameColumn columns[] = {
    { "C1", 0, 0 }, { "C2", 10, 0 }, { "C3", 5, -3 }, { "C4", 5, 3 },
  };
  TrbFramePoint over_girder[] = { P (5, 0) };
  TrbFramePoint over_nothing[] = { P (8, 0) };
  TrbFrameMember members[] = {
    { "G1", P (5, -3), P (5, 3), TRB_FRAME_ROLE_GIRDER, FALSE },
    /* crosses G1 at mid-span: passes over it unless told it rests there */
    { "B1", P (0, 0), P (10, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    { "B2", P (0, 0), P (10, 0), TRB_FRAME_ROLE_BEAM, FALSE, over_girder, 1 },
    { "B3", P (0, 0), P (10, 0), TRB_FRAME_ROLE_BEAM, FALSE, over_nothing, 1 },
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 4, .members = members, .n_members = 4 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *b1 = member (frame, "B1");
  const TrbFrameMemberResult *b2 = member (frame, "B2");
  const TrbFrameMemberResult *b3 = member (frame, "B3");

  g_assert_cmpuint (b1->n_supports, ==, 2);

  /* B2 rests on G1 at 3 m from G1's start at (5, -3) */
  g_assert_cmpuint (b2->n_supports, ==, 3);
  assert_support (b2, 1, 5.0, TRB_BEARING_MEMBER, "G1", 3.0);
  g_assert_null (b2->note);

  g_assert_cmpuint (b3->n_supports, ==, 2);
  g_assert_true (contains (b3->note, "rests on no member"));
}

static void
test_unsupported (void)
{
  TrbFrameColumn columns[] = { { "C1", 0, 0 }, { "C2", 2, -3 }, { "C3", -1, -1.5 } };
  TrbFrameMember members[] = {
    /* nothing under it */
    { "N1", P (10, 10), P (14, 10), TRB_FRAME_ROLE_BEAM, FALSE },
    /* one column: a mechanism */
    { "A", P (0, 0), P (4, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    /* on C2 and on A, which is unsupported */
    { "B", P (2, -3), P (2, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    /* on C3 and on B: unsupported in turn */
    { "C", P (-1, -1.5), P (2, -1.5), TRB_FRAME_ROLE_JOIST, FALSE },
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 3, .members = members, .n_members = 4 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *n1 = member (frame, "N1");
  const TrbFrameMemberResult *a = member (frame, "A");
  const TrbFrameMemberResult *b = member (frame, "B");
  const TrbFrameMemberResult *c = member (frame, "C");

  g_assert_cmpuint (n1->n_supports, ==, 0);
  g_assert_cmpint (n1->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (n1->reason, "no support"));

  g_assert_cmpuint (a->n_supports, ==, 1);
  g_assert_cmpint (a->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (a->reason, "mechanism"));

  g_assert_cmpuint (b->n_supports, ==, 2);
  assert_support (b, 1, 3.0, TRB_BEARING_MEMBER, "A", 2.0);
  g_assert_cmpint (b->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (b->reason, "member A"));

  g_assert_cmpuint (c->n_supports, ==, 2);
  assert_support (c, 1, 3.0, TRB_BEARING_MEMBER, "B", 1.5);
  g_assert_cmpint (c->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (c->reason, "member B"));
}

static gboolean
in_order (const TrbFrame *frame,
          guint           index)
{
  guint n;
  const guint *order = trb_frame_get_order (frame, &n);

  for (guint k = 0; k < n; k++)
    if (order[k] == index)
      return TRUE;
  return FALSE;
}

static void
test_cycle (void)
{
  TrbFrameColumn columns[] = {
    { "C1", 0, 0 }, { "C2", 4, 4 }, { "C3", 2, -3 },
    { "C4", 10, 0 }, { "C5", 14, -1 }, { "C6", 15, 6 },
  };
  TrbFrameMember members[] = {
    /* a corner with nothing under it: each end lies on the other's line */
    { "A", P (0, 0), P (4, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    { "B", P (4, 0), P (4, 4), TRB_FRAME_ROLE_BEAM, FALSE },
    /* resting on A */
    { "D", P (2, -3), P (2, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    /* three round a pinwheel: E on F on G on E */
    { "E", P (10, 0), P (14, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    { "F", P (14, -1), P (14, 4), TRB_FRAME_ROLE_BEAM, FALSE },
    { "G", P (15, 6), P (12, 0), TRB_FRAME_ROLE_BEAM, FALSE },
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 6, .members = members, .n_members = 6 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const char *in_cycle[] = { "A", "B", "E", "F", "G" };
  guint n_order;

  for (guint k = 0; k < G_N_ELEMENTS (in_cycle); k++)
    {
      const TrbFrameMemberResult *r = member (frame, in_cycle[k]);
      guint index;

      g_assert_cmpint (r->status, ==, TRB_FRAME_IN_CYCLE);
      g_assert_true (trb_frame_lookup_member (frame, in_cycle[k], &index));
      g_assert_false (in_order (frame, index));
    }
  g_assert_true (contains (member (frame, "A")->reason, "A, B"));
  g_assert_true (contains (member (frame, "F")->reason, "E, F, G"));

  g_assert_cmpint (member (frame, "D")->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (member (frame, "D")->reason, "cycle"));
  g_assert_true (in_order (frame, 2));
  trb_frame_get_order (frame, &n_order);
  g_assert_cmpuint (n_order, ==, 1);
}

/* ---- tributary strips ---------------------------------------------------------------------- */

/* A joist bay (common practice, ENGINEERING.md §3): two girders 12 ft long at x = 0 and
 * x = 14 ft on corner columns; ten 2x joists at 16 in on centre from y = 0 to y = 144 in,
 * each 14 ft; D = 10 psf and L = 40 psf over the bay; a 4 ft x 2 ft opening from x = 48 in to
 * 96 in, y = 36 in to 60 in. */
static void
test_strips_bay (void)
{
  TrbFrameColumn columns[] = {
    { "C1", 0, 0 }, { "C2", 0, 144 * IN }, { "C3", 168 * IN, 0 }, { "C4", 168 * IN, 144 * IN },
  };
  TrbFrameMember members[12] = {
    { "G1", P (0, 0), P (0, 144 * IN), TRB_FRAME_ROLE_GIRDER, FALSE },
    { "G2", P (168 * IN, 0), P (168 * IN, 144 * IN), TRB_FRAME_ROLE_GIRDER, FALSE },
  };
  const char *ids[] = { "J0", "J1", "J2", "J3", "J4", "J5", "J6", "J7", "J8", "J9" };
  TrbFramePoint bay[] = { P (0, 0), P (168 * IN, 0), P (168 * IN, 144 * IN), P (0, 144 * IN) };
  TrbFramePoint hole[] = { P (48 * IN, 36 * IN), P (96 * IN, 36 * IN), P (96 * IN, 60 * IN),
                           P (48 * IN, 60 * IN) };
  TrbFrameAreaLoad area[] = {
    { TRB_CASE_D, 10 * PSF, bay, 4 },
    { TRB_CASE_L, 40 * PSF, bay, 4 },
  };
  TrbFrameOpening openings[] = { { hole, 4 } };
  TrbFramePlan plan = { .columns = columns, .n_columns = 4, .members = members, .n_members = 12,
                        .area_loads = area, .n_area_loads = 2, .openings = openings,
                        .n_openings = 1 };
  g_autoptr(TrbFrame) frame = NULL;
  const TrbFrameMemberResult *r;
  double area_L = 0.0;

  for (guint k = 0; k < 10; k++)
    {
      TrbFrameMember j = { ids[k], P (0, 16 * k * IN), P (168 * IN, 16 * k * IN),
                           TRB_FRAME_ROLE_JOIST, TRUE };

      members[2 + k] = j;
    }
  frame = frame_new (&plan);

  /* J0, the edge joist: strip 8 in on its inner side, out to the bay's edge (here its own
   * line) on the other; w_D = 10 psf x 8/12 ft = 6.667 plf, w_L = 40 x 8/12 = 26.67 plf. Its
   * ends lie on the corner columns, which carry it rather than the girders' lines. */
  r = member (frame, "J0");
  g_assert_cmpuint (r->n_strips, ==, 1);
  g_assert_cmpfloat_with_epsilon (r->strips[0].left, 8 * IN, 1e-12);
  g_assert_true (isinf (r->strips[0].right));
  g_assert_cmpuint (r->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 168 * IN, 10.0 * 8 / 12 * PLF,
               10.0 * 8 / 12 * PLF);
  assert_load (&r->loads[TRB_CASE_L][0], TRB_LOAD_UNIFORM, 0, 168 * IN, 40.0 * 8 / 12 * PLF,
               40.0 * 8 / 12 * PLF);
  assert_support (r, 0, 0.0, TRB_BEARING_COLUMN, "C1", 0.0);
  assert_support (r, 1, 168 * IN, TRB_BEARING_COLUMN, "C3", 0.0);

  /* J1, interior: 16 in strip, w_D = 10 x 16/12 = 13.33 plf, w_L = 40 x 16/12 = 53.33 plf;
   * it bears on both girders 16 in from their starts */
  r = member (frame, "J1");
  g_assert_cmpfloat_with_epsilon (r->strips[0].left, 8 * IN, 1e-12);
  g_assert_cmpfloat_with_epsilon (r->strips[0].right, 8 * IN, 1e-12);
  g_assert_cmpuint (r->n_loads[TRB_CASE_L], ==, 1);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 168 * IN, 10.0 * 16 / 12 * PLF,
               10.0 * 16 / 12 * PLF);
  assert_load (&r->loads[TRB_CASE_L][0], TRB_LOAD_UNIFORM, 0, 168 * IN, 40.0 * 16 / 12 * PLF,
               40.0 * 16 / 12 * PLF);
  assert_support (r, 0, 0.0, TRB_BEARING_MEMBER, "G1", 16 * IN);
  assert_support (r, 1, 168 * IN, TRB_BEARING_MEMBER, "G2", 16 * IN);
  /* 14 ft x 16/12 ft = 18.67 ft^2 */
  g_assert_cmpfloat_with_epsilon (r->loaded_area[TRB_CASE_L], 14.0 * 16 / 12 * FT * FT, 1e-9);

  /* J2 (y = 32 in): strip 24-40 in, the opening takes 36-40 in over x = 48-96 in, leaving
   * 12 in there: w_L = 40 x 12/12 = 40 plf */
  r = member (frame, "J2");
  g_assert_cmpuint (r->n_loads[TRB_CASE_L], ==, 3);
  assert_load (&r->loads[TRB_CASE_L][0], TRB_LOAD_UNIFORM, 0, 48 * IN, 40.0 * 16 / 12 * PLF,
               40.0 * 16 / 12 * PLF);
  assert_load (&r->loads[TRB_CASE_L][1], TRB_LOAD_UNIFORM, 48 * IN, 96 * IN, 40.0 * PLF,
               40.0 * PLF);
  assert_load (&r->loads[TRB_CASE_L][2], TRB_LOAD_UNIFORM, 96 * IN, 168 * IN,
               40.0 * 16 / 12 * PLF, 40.0 * 16 / 12 * PLF);

  /* J3 (y = 48 in): strip 40-56 in lies wholly in the opening over x = 48-96 in */
  r = member (frame, "J3");
  g_assert_cmpuint (r->n_loads[TRB_CASE_D], ==, 2);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 48 * IN, 10.0 * 16 / 12 * PLF,
               10.0 * 16 / 12 * PLF);
  assert_load (&r->loads[TRB_CASE_D][1], TRB_LOAD_UNIFORM, 96 * IN, 168 * IN,
               10.0 * 16 / 12 * PLF, 10.0 * 16 / 12 * PLF);

  /* J4 (y = 64 in): strip 56-72 in, the opening takes 56-60 in: 12 in left, 40 plf */
  r = member (frame, "J4");
  g_assert_cmpuint (r->n_loads[TRB_CASE_L], ==, 3);
  assert_load (&r->loads[TRB_CASE_L][1], TRB_LOAD_UNIFORM, 48 * IN, 96 * IN, 40.0 * PLF,
               40.0 * PLF);

  /* the girders carry no deck */
  r = member (frame, "G1");
  g_assert_cmpuint (r->n_strips, ==, 0);
  g_assert_cmpuint (r->n_loads[TRB_CASE_L], ==, 0);

  /* every square foot once: 14 x 12 = 168 ft^2 less the 4 x 2 = 8 ft^2 opening: 160 ft^2 */
  for (guint k = 0; k < 10; k++)
    area_L += member (frame, ids[k])->loaded_area[TRB_CASE_L];
  g_assert_cmpfloat_with_epsilon (area_L / (FT * FT), 160.0, 1e-9);
}

/* Three joists 4 m long at y = 0, 0.5 and 1.0 m under a 1 kPa dead load on the polygon
 * (0, 0), (4, 0), (4, 0.25), (0, 1.25): its top edge, y = 1.25 - 0.25 x, is oblique to the
 * joists. Hand-worked (common practice, widths of polygon ∩ strip): */
static void
test_strips_oblique (void)
{
  TrbFramePoint poly[] = { P (0, 0), P (4, 0), P (4, 0.25), P (0, 1.25) };
  TrbFrameAreaLoad area[] = { { TRB_CASE_D, 1000.0, poly, 4 } };
  TrbFrameMember members[] = {
    { "J0", P (0, 0), P (4, 0), TRB_FRAME_ROLE_JOIST, TRUE },
    { "J1", P (0, 0.5), P (4, 0.5), TRB_FRAME_ROLE_JOIST, TRUE },
    { "J2", P (0, 1.0), P (4, 1.0), TRB_FRAME_ROLE_JOIST, TRUE },
  };
  TrbFramePlan plan = { .members = members, .n_members = 3, .area_loads = area,
                        .n_area_loads = 1 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *r;

  /* J0: strip y = 0 to 0.25, under the edge everywhere (its lowest point is 0.25): 250 N/m */
  r = member (frame, "J0");
  g_assert_cmpuint (r->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 4, 250, 250);
  g_assert_cmpfloat_with_epsilon (r->loaded_area[TRB_CASE_D], 1.0, 1e-12);

  /* J1: strip 0.25 to 0.75; the edge is above 0.75 for x <= 2 (1.25 - 0.5), so 500 N/m there,
   * then the width falls linearly to 0 at x = 4 (edge at 0.25): area 1.0 + 0.5 = 1.5 m^2 */
  r = member (frame, "J1");
  g_assert_cmpuint (r->n_loads[TRB_CASE_D], ==, 2);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 2, 500, 500);
  assert_load (&r->loads[TRB_CASE_D][1], TRB_LOAD_LINEAR, 2, 4, 500, 0);
  g_assert_cmpfloat_with_epsilon (r->loaded_area[TRB_CASE_D], 1.5, 1e-12);

  /* J2: no neighbour above, so out to the edge: width 1.25 - 0.25 x - 0.75, 0.5 m at x = 0 to
   * 0 at x = 2: 500 -> 0 N/m, area 0.5 m^2 */
  r = member (frame, "J2");
  g_assert_cmpuint (r->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_LINEAR, 0, 2, 500, 0);
  g_assert_cmpfloat_with_epsilon (r->loaded_area[TRB_CASE_D], 0.5, 1e-12);
  g_assert_true (isinf (r->strips[0].left));

  /* the three strips share out the polygon's whole area, 4 x (1.25 + 0.25) / 2 = 3.0 m^2,
   * above as 1.0 + 1.5 + 0.5 */
}

/* Joists of unequal length: J1 (4 m) has J3 (2 m, over x = 0-2 only) above it at 0.25 m, and
 * J4 at 0.5 m above it over the whole length (common practice: half the distance to the next
 * member on each side, wherever that member is). */
static void
test_strips_staggered (void)
{
  TrbFramePoint poly[] = { P (0, -1), P (4, -1), P (4, 2), P (0, 2) };
  TrbFrameAreaLoad area[] = { { TRB_CASE_L, 2000.0, poly, 4 } };
  TrbFrameMember members[] = {
    { "J0", P (0, 0), P (4, 0), TRB_FRAME_ROLE_JOIST, TRUE },
    { "J1", P (0, 0.5), P (4, 0.5), TRB_FRAME_ROLE_JOIST, TRUE },
    { "J3", P (2, 0.75), P (0, 0.75), TRB_FRAME_ROLE_JOIST, TRUE },
    { "J4", P (0, 1.0), P (4, 1.0), TRB_FRAME_ROLE_JOIST, TRUE },
    /* in line with J1 over x = 3-4 (drawn over it): bounds nothing */
    { "J5", P (3, 0.5), P (5, 0.5), TRB_FRAME_ROLE_JOIST, TRUE },
  };
  TrbFramePlan plan = { .members = members, .n_members = 5, .area_loads = area,
                        .n_area_loads = 1 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *r = member (frame, "J1");

  /* x 0-2: J3 0.25 above and J0 0.5 below, 0.125 + 0.25 = 0.375 m, 2000 x 0.375 = 750 N/m;
   * x 2-4: J4 0.5 above, 0.25 + 0.25 = 0.5 m, 1000 N/m */
  g_assert_cmpuint (r->n_strips, ==, 2);
  g_assert_cmpfloat_with_epsilon (r->strips[0].b, 2.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (r->strips[0].left, 0.125, 1e-12);
  g_assert_cmpfloat_with_epsilon (r->strips[0].right, 0.25, 1e-12);
  g_assert_cmpfloat_with_epsilon (r->strips[1].left, 0.25, 1e-12);
  g_assert_cmpuint (r->n_loads[TRB_CASE_L], ==, 2);
  assert_load (&r->loads[TRB_CASE_L][0], TRB_LOAD_UNIFORM, 0, 2, 750, 750);
  assert_load (&r->loads[TRB_CASE_L][1], TRB_LOAD_UNIFORM, 2, 4, 1000, 1000);

  /* J3 runs from x = 2 back to 0, so its left is the plan's -y side, where J1 is 0.25 m
   * away; on its right J4 is 0.25 m away too */
  r = member (frame, "J3");
  g_assert_cmpuint (r->n_strips, ==, 1);
  g_assert_cmpfloat_with_epsilon (r->strips[0].left, 0.125, 1e-12);
  g_assert_cmpfloat_with_epsilon (r->strips[0].right, 0.125, 1e-12);
  assert_load (&r->loads[TRB_CASE_L][0], TRB_LOAD_UNIFORM, 0, 2, 500, 500);
}

/* ---- the takedown of ENGINEERING.md §8 item 2 ---------------------------------------------- */

/* Columns on a 20 ft (x) by 24 ft (y) grid, 3 x 3; girders along y between them; beams along
 * x at 8 ft, spanning 20 ft between girders (or columns on the column lines), carrying the
 * deck; D = L = 50 psf over the 40 x 48 ft floor. */
typedef struct
{
  TrbFrameColumn   columns[9];
  TrbFrameMember   members[20];
  char             ids[29][8];
  TrbFramePoint    floor[4];
  TrbFrameAreaLoad area[2];
  TrbFramePlan     plan;
} Grid;

static void
grid_init (Grid *g)
{
  guint n = 0, c = 0;

  memset (g, 0, sizeof *g);
  for (guint i = 0; i < 3; i++)
    for (guint j = 0; j < 3; j++, c++)
      {
        g_snprintf (g->ids[c], sizeof g->ids[c], "C%u%u", i, j);
        g->columns[c] = (TrbFrameColumn) { g->ids[c], 20 * i * FT, 24 * j * FT };
      }
  for (guint i = 0; i < 3; i++)
    for (guint j = 0; j < 2; j++, n++)
      {
        g_snprintf (g->ids[9 + n], sizeof g->ids[9 + n], "G%u%u", i, j);
        g->members[n] = (TrbFrameMember) { g->ids[9 + n], P (20 * i * FT, 24 * j * FT),
                                           P (20 * i * FT, 24 * (j + 1) * FT),
                                           TRB_FRAME_ROLE_GIRDER, FALSE };
      }
  for (guint i = 0; i < 2; i++)
    for (guint k = 0; k <= 6; k++, n++)
      {
        g_snprintf (g->ids[9 + n], sizeof g->ids[9 + n], "B%u%u", i, k);
        g->members[n] = (TrbFrameMember) { g->ids[9 + n], P (20 * i * FT, 8 * k * FT),
                                           P (20 * (i + 1) * FT, 8 * k * FT),
                                           TRB_FRAME_ROLE_BEAM, TRUE };
      }
  g->floor[0] = (TrbFramePoint) P (0, 0);
  g->floor[1] = (TrbFramePoint) P (40 * FT, 0);
  g->floor[2] = (TrbFramePoint) P (40 * FT, 48 * FT);
  g->floor[3] = (TrbFramePoint) P (0, 48 * FT);
  g->area[0] = (TrbFrameAreaLoad) { TRB_CASE_D, 50 * PSF, g->floor, 4 };
  g->area[1] = (TrbFrameAreaLoad) { TRB_CASE_L, 50 * PSF, g->floor, 4 };
  g->plan = (TrbFramePlan) { .columns = g->columns, .n_columns = 9, .members = g->members,
                             .n_members = 20, .area_loads = g->area, .n_area_loads = 2 };
}

/* Reactions of a simply supported member by statics (sum of moments about each support), for
 * the loads it carries in this test: uniform over the whole span, and points. */
static void
simple_reactions (const TrbFrameMemberResult *r,
                  const TrbFrameTakedown     *td,
                  guint                       index,
                  double                      reactions[2][TRB_N_CASES])
{
  double L;

  g_assert_cmpuint (r->n_supports, ==, 2);
  L = r->supports[1].x - r->supports[0].x;
  for (int c = 0; c < TRB_N_CASES; c++)
    {
      guint n_points;
      const TrbLoad *points = trb_frame_takedown_get_member_loads (td, index, c, &n_points);

      reactions[0][c] = reactions[1][c] = 0.0;
      for (guint k = 0; k < r->n_loads[c]; k++)
        {
          const TrbLoad *l = &r->loads[c][k];

          g_assert_cmpint (l->kind, ==, TRB_LOAD_UNIFORM);
          reactions[0][c] += l->w1 * (l->b - l->a) * (r->supports[1].x - 0.5 * (l->a + l->b)) / L;
          reactions[1][c] += l->w1 * (l->b - l->a) * (0.5 * (l->a + l->b) - r->supports[0].x) / L;
        }
      for (guint k = 0; k < n_points; k++)
        {
          reactions[0][c] += points[k].w1 * (r->supports[1].x - points[k].a) / L;
          reactions[1][c] += points[k].w1 * (points[k].a - r->supports[0].x) / L;
        }
    }
}

static void
test_takedown (void)
{
  Grid g;
  g_autoptr(TrbFrame) frame = NULL;
  g_autoptr(TrbFrameTakedown) td = NULL;
  const TrbFrameMemberResult *r;
  const guint *order;
  guint n_order, n_loads, index;
  const TrbLoad *loads;
  double total = 0.0;

  grid_init (&g);
  frame = frame_new (&g.plan);
  td = trb_frame_takedown_new (frame);

  /* an interior beam: 8 ft strip, w = 50 psf x 8 ft = 400 plf in each case, A_T = 20 x 8 =
   * 160 ft^2 (ENGINEERING.md §8 items 2 and 3) */
  r = member (frame, "B01");
  g_assert_cmpuint (r->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&r->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 20 * FT, 400 * PLF, 400 * PLF);
  assert_load (&r->loads[TRB_CASE_L][0], TRB_LOAD_UNIFORM, 0, 20 * FT, 400 * PLF, 400 * PLF);
  g_assert_cmpfloat_with_epsilon (r->loaded_area[TRB_CASE_L] / (FT * FT), 160.0, 1e-9);
  assert_support (r, 0, 0.0, TRB_BEARING_MEMBER, "G00", 8 * FT);
  assert_support (r, 1, 20 * FT, TRB_BEARING_MEMBER, "G10", 8 * FT);
  /* a beam on the column line bears on the columns, not on the girders' ends */
  r = member (frame, "B03");
  assert_support (r, 0, 0.0, TRB_BEARING_COLUMN, "C01", 0.0);
  assert_support (r, 1, 20 * FT, TRB_BEARING_COLUMN, "C11", 0.0);

  /* down the bearing order, every member's reactions by statics handed to what it rests on */
  order = trb_frame_get_order (frame, &n_order);
  g_assert_cmpuint (n_order, ==, 20);
  for (guint k = 0; k < n_order; k++)
    {
      double reactions[2][TRB_N_CASES];
      g_autoptr(GError) error = NULL;

      r = trb_frame_get_member (frame, order[k]);
      g_assert_cmpint (r->status, ==, TRB_FRAME_SUPPORTED);
      simple_reactions (r, td, order[k], reactions);
      if (strcmp (r->id, "B01") == 0)
        {
          /* R = wL/2 = 0.400 x 20 / 2 = 4.0 k D + 4.0 k L (ENGINEERING.md §8 item 2) */
          g_assert_cmpfloat_with_epsilon (reactions[0][TRB_CASE_D] / KIP, 4.0, 1e-9);
          g_assert_cmpfloat_with_epsilon (reactions[1][TRB_CASE_L] / KIP, 4.0, 1e-9);
        }
      g_assert_true (trb_frame_takedown_add (td, order[k], &reactions[0][0], 2, &error));
      g_assert_no_error (error);
    }

  /* the interior girder: a beam from each side at 8 and 16 ft, 2 x 4.0 = 8.0 k D and 8.0 k L,
   * 16 k in all at its third points (ENGINEERING.md §8 item 2) */
  g_assert_true (trb_frame_lookup_member (frame, "G10", &index));
  loads = trb_frame_takedown_get_member_loads (td, index, TRB_CASE_D, &n_loads);
  g_assert_cmpuint (n_loads, ==, 2);
  assert_load (&loads[0], TRB_LOAD_POINT, 8 * FT, 8 * FT, 8.0 * KIP, 0);
  assert_load (&loads[1], TRB_LOAD_POINT, 16 * FT, 16 * FT, 8.0 * KIP, 0);
  loads = trb_frame_takedown_get_member_loads (td, index, TRB_CASE_L, &n_loads);
  g_assert_cmpfloat_with_epsilon ((loads[0].w1 + loads[1].w1) / KIP, 16.0, 1e-9);

  /* the interior column: 2 x 16 + 2 x 8 = 48 k = 480 ft^2 x 0.100 ksf (ENGINEERING.md §8
   * item 2) */
  g_assert_cmpfloat_with_epsilon ((trb_frame_takedown_get_column_load (td, 4, TRB_CASE_D) +
                                   trb_frame_takedown_get_column_load (td, 4, TRB_CASE_L)) / KIP,
                                  48.0, 1e-9);
  g_assert_cmpstr (g.columns[4].id, ==, "C11");

  /* and all the columns together carry the floor: 40 x 48 ft x 0.100 ksf = 192 k
   * (ENGINEERING.md §3, "sum of column loads = area x q") */
  for (guint c = 0; c < 9; c++)
    total += trb_frame_takedown_get_column_load (td, c, TRB_CASE_D) +
             trb_frame_takedown_get_column_load (td, c, TRB_CASE_L);
  g_assert_cmpfloat_with_epsilon (total / KIP, 192.0, 1e-9);
}

/* The order puts every member after all those bearing on it. */
static void
test_order (void)
{
  Grid g;
  g_autoptr(TrbFrame) frame = NULL;
  const guint *order;
  guint n_order;
  guint place[20];

  grid_init (&g);
  frame = frame_new (&g.plan);
  order = trb_frame_get_order (frame, &n_order);
  g_assert_cmpuint (n_order, ==, 20);
  for (guint k = 0; k < n_order; k++)
    place[order[k]] = k;
  for (guint m = 0; m < 20; m++)
    {
      const TrbFrameMemberResult *r = trb_frame_get_member (frame, m);

      for (guint s = 0; s < r->n_supports; s++)
        if (r->bearings[s].kind == TRB_BEARING_MEMBER)
          g_assert_cmpuint (place[m], <, place[r->bearings[s].index]);
    }
}

/* Chains: J2 on B2 on G1 (all supported); J1 on B1 on B3, where B3 has one column only. */
static void
test_order_chain (void)
{
  TrbFrameColumn columns[] = {
    { "C1", 0, 0 }, { "C2", 10, 0 }, { "C3", 0, 6 }, { "C4", 0, 3 }, { "C5", 8, 6 },
    { "C6", 10, 4 },
  };
  TrbFrameMember members[] = {
    { "J1", P (5, 3), P (0, 3), TRB_FRAME_ROLE_JOIST, FALSE },   /* on B1 and C4 */
    { "G1", P (0, 0), P (10, 0), TRB_FRAME_ROLE_GIRDER, FALSE }, /* on C1 and C2 */
    { "B1", P (5, 0), P (5, 6), TRB_FRAME_ROLE_BEAM, FALSE },    /* on G1 and B3 */
    { "B3", P (0, 6), P (6, 6), TRB_FRAME_ROLE_BEAM, FALSE },    /* on C3 alone */
    { "B2", P (8, 0), P (8, 6), TRB_FRAME_ROLE_BEAM, FALSE },    /* on G1 and C5 */
    { "J2", P (8, 4), P (10, 4), TRB_FRAME_ROLE_JOIST, FALSE },  /* on B2 and C6 */
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 6, .members = members, .n_members = 6 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const guint *order;
  guint n_order, place[6];

  g_assert_cmpint (member (frame, "G1")->status, ==, TRB_FRAME_SUPPORTED);
  g_assert_cmpint (member (frame, "B2")->status, ==, TRB_FRAME_SUPPORTED);
  g_assert_cmpint (member (frame, "J2")->status, ==, TRB_FRAME_SUPPORTED);
  assert_support (member (frame, "B2"), 1, 6.0, TRB_BEARING_COLUMN, "C5", 0.0);
  g_assert_cmpint (member (frame, "B3")->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_cmpint (member (frame, "B1")->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (member (frame, "B1")->reason, "member B3"));
  g_assert_cmpint (member (frame, "J1")->status, ==, TRB_FRAME_UNSUPPORTED);
  g_assert_true (contains (member (frame, "J1")->reason, "member B1"));

  order = trb_frame_get_order (frame, &n_order);
  g_assert_cmpuint (n_order, ==, 6);
  for (guint k = 0; k < n_order; k++)
    place[order[k]] = k;
  g_assert_cmpuint (place[0], <, place[2]);  /* J1 before B1 */
  g_assert_cmpuint (place[2], <, place[1]);  /* B1 before G1 */
  g_assert_cmpuint (place[2], <, place[3]);  /* B1 before B3 */
  g_assert_cmpuint (place[5], <, place[4]);  /* J2 before B2 */
  g_assert_cmpuint (place[4], <, place[1]);  /* B2 before G1 */
}

/* ---- plan line and point loads ------------------------------------------------------------- */

static void
test_plan_loads (void)
{
  TrbFrameColumn columns[] = { { "C1", 0, 0 }, { "C2", 3, 0 }, { "C3", 6, 0 } };
  TrbFrameMember members[] = {
    { "B1", P (0, 0), P (3, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    { "B2", P (6, 0), P (3, 0), TRB_FRAME_ROLE_BEAM, FALSE },
  };
  TrbFramePoint along[] = { P (-1, 0), P (4, 0.01) };       /* 1 m before B1, on to B2 */
  TrbFramePoint across[] = { P (1, -2), P (1, 2) };         /* crosses B1: on no member line */
  TrbFrameLineLoad lines[] = {
    { TRB_CASE_D, 1000.0, along, 2 },
    { TRB_CASE_L, 500.0, across, 2 },
  };
  TrbFramePointLoad points[] = {
    { TRB_CASE_L, 5000.0, 2.0, 0.01 },    /* 10 mm off B1's line: on it */
    { TRB_CASE_S, 3000.0, 5.0, 0.0 },     /* on B2, 1 m from its start at x = 6 */
    { TRB_CASE_D, 7000.0, 2.0, 1.0 },     /* on nothing */
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 3, .members = members, .n_members = 2,
                        .line_loads = lines, .n_line_loads = 2, .point_loads = points,
                        .n_point_loads = 3 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *b1 = member (frame, "B1");
  const TrbFrameMemberResult *b2 = member (frame, "B2");
  const TrbFrameUnassigned *lost_lines;
  const guint *lost_points;
  guint n;
  double stretch = hypot (5.0, 0.01) / 5.0;  /* the load's length per metre of member */

  /* the line load lies on B1 over its whole 3 m and on B2 over 1 m next to x = 3 (B2's own
   * x = 2 to 3) */
  g_assert_cmpuint (b1->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&b1->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 3, 1000.0 * stretch,
               1000.0 * stretch);
  g_assert_cmpuint (b2->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&b2->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 2, 3, 1000.0 * stretch,
               1000.0 * stretch);

  g_assert_cmpuint (b1->n_loads[TRB_CASE_L], ==, 1);
  assert_load (&b1->loads[TRB_CASE_L][0], TRB_LOAD_POINT, 2, 2, 5000.0, 0);
  g_assert_cmpuint (b2->n_loads[TRB_CASE_S], ==, 1);
  assert_load (&b2->loads[TRB_CASE_S][0], TRB_LOAD_POINT, 1, 1, 3000.0, 0);

  /* reported, not lost: the first line load's metre before B1 (1.0 m, to within the slant of
   * its 10 mm rise), the whole 4 m of the second, and the third point load */
  lost_lines = trb_frame_get_unassigned_lines (frame, &n);
  g_assert_cmpuint (n, ==, 2);
  g_assert_cmpuint (lost_lines[0].index, ==, 0);
  g_assert_cmpfloat_with_epsilon (lost_lines[0].length, 1.0, 1e-4);
  g_assert_cmpuint (lost_lines[1].index, ==, 1);
  g_assert_cmpfloat_with_epsilon (lost_lines[1].length, 4.0, 1e-12);
  lost_points = trb_frame_get_unassigned_points (frame, &n);
  g_assert_cmpuint (n, ==, 1);
  g_assert_cmpuint (lost_points[0], ==, 2);
}

/* Members drawn over one another under a line load: the first in plan order takes the part it
 * lies under, the next the rest, so the load is counted once. */
static void
test_plan_loads_overlap (void)
{
  TrbFrameMember members[] = {
    { "B1", P (2, 0), P (4, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    { "B2", P (0, 0), P (6, 0), TRB_FRAME_ROLE_BEAM, FALSE },
  };
  TrbFramePoint along[] = { P (0, 0), P (6, 0) };
  TrbFrameLineLoad lines[] = { { TRB_CASE_D, 1000.0, along, 2 } };
  TrbFramePlan plan = { .members = members, .n_members = 2, .line_loads = lines,
                        .n_line_loads = 1 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  const TrbFrameMemberResult *b1 = member (frame, "B1");
  const TrbFrameMemberResult *b2 = member (frame, "B2");
  guint n;

  g_assert_cmpuint (b1->n_loads[TRB_CASE_D], ==, 1);
  assert_load (&b1->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 2, 1000, 1000);
  g_assert_cmpuint (b2->n_loads[TRB_CASE_D], ==, 2);
  assert_load (&b2->loads[TRB_CASE_D][0], TRB_LOAD_UNIFORM, 0, 2, 1000, 1000);
  assert_load (&b2->loads[TRB_CASE_D][1], TRB_LOAD_UNIFORM, 4, 6, 1000, 1000);
  trb_frame_get_unassigned_lines (frame, &n);
  g_assert_cmpuint (n, ==, 0);
}

/* ---- hand-off, errors, determinism --------------------------------------------------------- */

static void
test_hand_down (void)
{
  TrbFrameColumn columns[] = { { "C1", 0, 0 }, { "C2", 0, 6 }, { "C3", 5, 2 } };
  TrbFramePoint w1[] = { P (5, -1), P (5, 5) };
  TrbFrameWall walls[] = { { "W1", w1, 2 } };
  TrbFrameMember members[] = {
    { "G1", P (0, 0), P (0, 6), TRB_FRAME_ROLE_GIRDER, FALSE },
    { "J1", P (0, 2), P (5, 2), TRB_FRAME_ROLE_JOIST, FALSE },
    { "J2", P (0, 4), P (5, 4), TRB_FRAME_ROLE_JOIST, FALSE },
  };
  TrbFramePlan plan = { .columns = columns, .n_columns = 3, .walls = walls, .n_walls = 1,
                        .members = members, .n_members = 3 };
  g_autoptr(TrbFrame) frame = frame_new (&plan);
  g_autoptr(TrbFrameTakedown) td = trb_frame_takedown_new (frame);
  double reactions[2][TRB_N_CASES] = { { 100, 200, 0, 0 }, { 300, 400, 0, 0 } };
  TrbFrameHandoff out[2];
  g_autoptr(GError) error = NULL;
  const TrbLoad *loads;
  guint n;

  /* The reactions are inputs; what is checked is that each one reaches what the member rests
   * on, as the same force downward (statics: action and reaction), at the right place.
   * J1 rests on G1 at 2 m and on C3 (the column wins over the wall it stands in). */
  g_assert_true (trb_frame_hand_down (frame, 1, &reactions[0][0], 2, out, &error));
  g_assert_no_error (error);
  g_assert_cmpint (out[0].kind, ==, TRB_BEARING_MEMBER);
  g_assert_cmpuint (out[0].index, ==, 0);
  g_assert_cmpfloat_with_epsilon (out[0].position, 2.0, 1e-12);
  g_assert_cmpfloat_with_epsilon (out[0].force[TRB_CASE_L], 200.0, 1e-12);
  g_assert_cmpint (out[1].kind, ==, TRB_BEARING_COLUMN);
  g_assert_cmpuint (out[1].index, ==, 2);

  /* J2 rests on G1 at 4 m and on W1, 5 m along it from (5, -1); G1 collects both joists */
  g_assert_true (trb_frame_takedown_add (td, 1, &reactions[0][0], 2, &error));
  g_assert_true (trb_frame_takedown_add (td, 2, &reactions[0][0], 2, &error));
  g_assert_no_error (error);
  loads = trb_frame_takedown_get_member_loads (td, 0, TRB_CASE_D, &n);
  g_assert_cmpuint (n, ==, 2);
  assert_load (&loads[0], TRB_LOAD_POINT, 2, 2, 100, 0);
  assert_load (&loads[1], TRB_LOAD_POINT, 4, 4, 100, 0);
  g_assert_cmpfloat_with_epsilon (trb_frame_takedown_get_column_load (td, 2, TRB_CASE_L), 400,
                                  1e-12);
  loads = trb_frame_takedown_get_wall_loads (td, 0, TRB_CASE_D, &n);
  g_assert_cmpuint (n, ==, 1);
  assert_load (&loads[0], TRB_LOAD_POINT, 5, 5, 300, 0);

  /* nothing handed down onto a joist: no loads, whatever the case */
  loads = trb_frame_takedown_get_member_loads (td, 1, TRB_CASE_S, &n);
  g_assert_cmpuint (n, ==, 0);
  /* G1's loads released once read (as a floor's solve does); what comes after starts anew */
  trb_frame_takedown_release_member (td, 0);
  loads = trb_frame_takedown_get_member_loads (td, 0, TRB_CASE_D, &n);
  g_assert_cmpuint (n, ==, 0);
  g_assert_true (trb_frame_takedown_add (td, 1, &reactions[0][0], 2, &error));
  loads = trb_frame_takedown_get_member_loads (td, 0, TRB_CASE_D, &n);
  g_assert_cmpuint (n, ==, 1);
  assert_load (&loads[0], TRB_LOAD_POINT, 2, 2, 100, 0);

  /* as many reactions as supports, no fewer */
  g_assert_false (trb_frame_hand_down (frame, 1, &reactions[0][0], 1, out, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
}

static void
assert_invalid (const TrbFramePlan *plan)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbFrame) frame = trb_frame_new (plan, &error);

  g_assert_null (frame);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
}

static void
test_invalid (void)
{
  TrbFrameMember zero[] = { { "B1", P (1, 1), P (1, 1), TRB_FRAME_ROLE_BEAM, FALSE } };
  TrbFrameMember twice[] = {
    { "B1", P (0, 0), P (1, 0), TRB_FRAME_ROLE_BEAM, FALSE },
    { "B1", P (0, 1), P (1, 1), TRB_FRAME_ROLE_BEAM, FALSE },
  };
  TrbFramePoint off[] = { P (0.5, 0.5) };
  TrbFrameMember listed_off[] = { { "B1", P (0, 0), P (1, 0), TRB_FRAME_ROLE_BEAM, FALSE, off,
                                    1 } };
  TrbFrameMember nan_end[] = { { "B1", P (0, 0), P (NAN, 0), TRB_FRAME_ROLE_BEAM, FALSE } };
  TrbFramePoint two[] = { P (0, 0), P (1, 0) };
  TrbFrameAreaLoad flat[] = { { TRB_CASE_D, 100.0, two, 2 } };
  TrbFramePlan plan = { .members = zero, .n_members = 1 };

  assert_invalid (&plan);
  plan.members = twice, plan.n_members = 2;
  assert_invalid (&plan);
  plan.members = listed_off, plan.n_members = 1;
  assert_invalid (&plan);
  plan.members = nan_end;
  assert_invalid (&plan);
  plan.n_members = 0;
  plan.area_loads = flat, plan.n_area_loads = 1;
  assert_invalid (&plan);
}

static void
dump_frame (const TrbFrame *frame,
            GString        *out)
{
  const guint *order;
  guint n;

  for (guint m = 0; m < trb_frame_get_n_members (frame); m++)
    {
      const TrbFrameMemberResult *r = trb_frame_get_member (frame, m);

      g_string_append_printf (out, "%s %a %d %s\n", r->id, r->length, r->status,
                              r->reason != NULL ? r->reason : "-");
      for (guint s = 0; s < r->n_supports; s++)
        g_string_append_printf (out, " s %a %d %u %a\n", r->supports[s].x, r->bearings[s].kind,
                                r->bearings[s].index, r->bearings[s].position);
      for (guint s = 0; s < r->n_strips; s++)
        g_string_append_printf (out, " t %a %a %a %a\n", r->strips[s].a, r->strips[s].b,
                                r->strips[s].left, r->strips[s].right);
      for (int c = 0; c < TRB_N_CASES; c++)
        for (guint k = 0; k < r->n_loads[c]; k++)
          g_string_append_printf (out, " l %d %d %a %a %a %a\n", c, r->loads[c][k].kind,
                                  r->loads[c][k].a, r->loads[c][k].b, r->loads[c][k].w1,
                                  r->loads[c][k].w2);
    }
  order = trb_frame_get_order (frame, &n);
  for (guint k = 0; k < n; k++)
    g_string_append_printf (out, "o %u\n", order[k]);
}

/* Same plan, same result, to the bit (DESIGN.md: the solve is pure and re-runnable). */
static void
test_deterministic (void)
{
  Grid g;
  g_autoptr(TrbFrame) first = NULL;
  g_autoptr(TrbFrame) second = NULL;
  g_autoptr(GString) a = g_string_new (NULL);
  g_autoptr(GString) b = g_string_new (NULL);

  grid_init (&g);
  first = frame_new (&g.plan);
  second = frame_new (&g.plan);
  dump_frame (first, a);
  dump_frame (second, b);
  g_assert_cmpuint (a->len, >, 1000);
  g_assert_cmpstr (a->str, ==, b->str);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/frame/bearing/columns", test_bearing_columns);
  g_test_add_func ("/trb/frame/bearing/walls", test_bearing_walls);
  g_test_add_func ("/trb/frame/bearing/tolerance", test_bearing_tolerance);
  g_test_add_func ("/trb/frame/bearing/continuous", test_bearing_continuous);
  g_test_add_func ("/trb/frame/bearing/cantilever", test_bearing_cantilever);
  g_test_add_func ("/trb/frame/bearing/listed-point", test_bearing_listed_point);
  g_test_add_func ("/trb/frame/bearing/unsupported", test_unsupported);
  g_test_add_func ("/trb/frame/bearing/cycle", test_cycle);
  g_test_add_func ("/trb/frame/strips/bay", test_strips_bay);
  g_test_add_func ("/trb/frame/strips/oblique", test_strips_oblique);
  g_test_add_func ("/trb/frame/strips/staggered", test_strips_staggered);
  g_test_add_func ("/trb/frame/takedown", test_takedown);
  g_test_add_func ("/trb/frame/order/grid", test_order);
  g_test_add_func ("/trb/frame/order/chain", test_order_chain);
  g_test_add_func ("/trb/frame/plan-loads", test_plan_loads);
  g_test_add_func ("/trb/frame/plan-loads-overlap", test_plan_loads_overlap);
  g_test_add_func ("/trb/frame/hand-down", test_hand_down);
  g_test_add_func ("/trb/frame/invalid", test_invalid);
  g_test_add_func ("/trb/frame/deterministic", test_deterministic);

  return g_test_run ();
}
