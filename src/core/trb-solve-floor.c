/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Floors and the project: the cache of identical members, the floor solve down the load
 * path, the project solve and TrbSolveCache. */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-solve.h"
#include "trb-solve-private.h"

/* ---- identical members: the cache ------------------------------------------------------- */

/* The cache key: the exact bytes of everything a member's result depends on besides the
 * project's settings (the same for the whole solve). Identical joists of a run give the same
 * bytes; anything else that differs, even by a rounding, gives a miss, never a wrong hit. */
/* The bytes of a key as they are gathered: a few hundred small pieces, each copied in place. */
typedef struct
{
  guint8 *data;
  gsize   len;
  gsize   room;
} Key;

static inline void
key_bytes (Key          *key,
           gconstpointer data,
           gsize         size)
{
  if (size == 0)
    return;   /* an empty array's data may be NULL, which memcpy may not be given */
  if (G_UNLIKELY (key->len + size > key->room))
    {
      key->room = MAX (2 * key->room, key->len + size + 512);
      key->data = g_realloc (key->data, key->room);
    }
  memcpy (key->data + key->len, data, size);
  key->len += size;
}

/* A hash of the key's bytes, eight at a time (g_bytes_hash() takes them one by one): keys
 * run to kilobytes, and are equal only when every byte is. */
static guint
key_hash (gconstpointer bytes)
{
  gsize n;
  const guint8 *p = g_bytes_get_data ((GBytes *) bytes, &n);
  guint64 h = 0x9e3779b97f4a7c15u ^ n;

  for (; n >= 8; p += 8, n -= 8)
    {
      guint64 w;

      memcpy (&w, p, 8);
      h = (h ^ w) * 0xff51afd7ed558ccdu;
      h ^= h >> 32;
    }
  for (; n > 0; p++, n--)
    h = (h ^ *p) * 0x100000001b3u;
  h ^= h >> 29;
  return (guint) (h ^ (h >> 32));
}

static void
key_double (Key        *key,
            double      v)
{
  key_bytes (key, &v, sizeof v);
}

static void
key_int (Key        *key,
         gint64      v)
{
  key_bytes (key, &v, sizeof v);
}

static void
key_string (Key        *key,
            const char *s)
{
  if (s == NULL)
    {
      key_int (key, -1);
      return;
    }
  key_int (key, strlen (s));
  key_bytes (key, s, strlen (s));
}

static void
key_loads (Key           *key,
           const TrbLoad *loads,
           guint          n)
{
  key_int (key, n);
  for (guint i = 0; i < n; i++)
    {
      key_int (key, loads[i].kind);
      key_double (key, loads[i].a);
      key_double (key, loads[i].b);
      key_double (key, loads[i].w1);
      key_double (key, loads[i].w2);
    }
}

/* The key gathered into key (emptied first, its room kept); extra: bytes the caller adds (the
 * floor's live load streams), or NULL. */
static void
member_key_gather (Key               *key,
                   const TrbMember   *m,
                   const MemberInput *in,
                   guint              shortlist_max,
                   const Key         *extra)
{
  key->len = 0;
  key_double (key, in->length);
  key_int (key, in->n_supports);
  for (guint i = 0; i < in->n_supports; i++)
    {
      key_double (key, in->supports[i].x);
      key_int (key, in->supports[i].type);
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    key_loads (key, in->loads[c], in->n_loads[c]);
  key_double (key, in->repetitive_spacing);
  key_int (key, shortlist_max);

  key_int (key, m->material);
  key_string (key, m->section);
  key_double (key, m->E);
  key_double (key, m->I);
  key_double (key, m->S);
  key_double (key, m->A);
  key_double (key, m->d);
  key_double (key, m->tw);
  key_double (key, m->weight);
  key_int (key, m->has_method);
  key_int (key, m->method);
  key_double (key, m->fb_allow);
  key_double (key, m->fv_allow);
  key_string (key, m->steel_grade);
  key_double (key, m->deflection_live);
  key_double (key, m->deflection_total);
  key_int (key, m->bracing);
  key_int (key, m->braces->len);
  for (guint i = 0; i < m->braces->len; i++)
    key_double (key, g_array_index (m->braces, TrbMemberBrace, i).x);
  key_double (key, m->max_depth);
  key_double (key, m->min_depth);
  key_int (key, m->allowed != NULL ? (gint64) g_strv_length (m->allowed) : -1);
  for (guint i = 0; m->allowed != NULL && m->allowed[i] != NULL; i++)
    key_string (key, m->allowed[i]);
  key_int (key, m->max_plies);
  key_string (key, m->species);
  key_string (key, m->grade);
  key_int (key, m->wet_service);
  key_int (key, m->incised);
  key_int (key, m->repetitive);
  key_double (key, m->bearing_length);
  if (extra != NULL)
    key_bytes (key, extra->data, extra->len);
}

static GBytes *
member_key (const TrbMember   *m,
            const MemberInput *in,
            guint              shortlist_max,
            const Key         *extra)
{
  Key k = { NULL, 0, 0 };

  member_key_gather (&k, m, in, shortlist_max, extra);
  return g_bytes_new_take (k.data, k.len);
}

/* A solved member and what it hands down, per support of its beam (sorted by x) and case:
 * reactions[0] everything but the live load that is never reduced, reactions[1] that live
 * load (case L only). Unreduced. */
typedef struct
{
  TrbMemberResult *result;       /* the entry's own; each member gets a share of it */
  double          *reactions[2];
  guint            n_supports;
  guint64          used;         /* the last solve of a TrbSolveCache that read it */
} CacheEntry;

static void
cache_entry_free (gpointer data)
{
  CacheEntry *e = data;

  g_clear_pointer (&e->result, trb_member_result_free);
  g_free (e->reactions[0]);
  g_free (e->reactions[1]);
  g_free (e);
}

static void reactions_of (const TrbBeam *beam,
                          const TrbLoad *loads,
                          guint          n_loads,
                          TrbLoadCase    c,
                          double        *out);

/* What a solved member hands down: with reduction, the live load that may be reduced and the
 * live load that may not, each unreduced and on its own, so that the members below and the
 * columns can reduce theirs (ASCE 7-16 §4.7: each member reduces its own, the unreduced load
 * goes down). The supports and the loads do not change the reactions with E I (rigid
 * supports, E I constant along the member), so any section's beam gives them. */
static CacheEntry *
cache_entry_new (TrbMemberResult *r,
                 gboolean         reduction,
                 const GArray    *live_a,
                 const GArray    *live_b)
{
  CacheEntry *e = g_new0 (CacheEntry, 1);
  guint n_beam;

  e->result = r;
  if (!r->analysed)
    return e;
  trb_beam_get_supports (r->beam, &n_beam);
  e->n_supports = n_beam;
  e->reactions[0] = g_new0 (double, n_beam * TRB_N_CASES + 1);
  e->reactions[1] = g_new0 (double, n_beam * TRB_N_CASES + 1);
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      const TrbReaction *re;
      guint n;

      if ((c == TRB_CASE_L && reduction) || r->cases[c] == NULL)
        continue;
      /* D with the self-weight: the case result holds it */
      re = trb_beam_result_get_reactions (r->cases[c], &n);
      for (guint i = 0; i < n && i < n_beam; i++)
        e->reactions[0][i * TRB_N_CASES + c] = re[i].force;
    }
  if (reduction)
    {
      reactions_of (r->beam, (const TrbLoad *) live_a->data, live_a->len, TRB_CASE_L,
                    e->reactions[0]);
      reactions_of (r->beam, (const TrbLoad *) live_b->data, live_b->len, TRB_CASE_L,
                    e->reactions[1]);
    }
  return e;
}

/* What a document keeps from one solve to the next (trb_solve_project_cached()): the cache
 * of members by their complete input, and each floor's frame by its plan, read again only
 * under the same context (the settings, the project's own sections and the options), which is
 * not part of the members' keys. An entry not read by the last two solves goes, so that an
 * edit and its undo both find theirs. */
struct _TrbSolveCache
{
  GBytes     *context;
  GHashTable *members;      /* GBytes -> CacheEntry */
  GHashTable *frames;       /* GBytes (a plan) -> FrameEntry */
  Memo       *memo;
  guint64     generation;   /* solves made */
  guint       n_solved;     /* of the last solve: members analysed and designed */
  guint       n_reused;     /* members whose result came from an earlier solve */
  guint       n_frames_new; /* frames made */
};

typedef struct
{
  TrbFrame *frame;
  guint64   used;
} FrameEntry;

typedef struct
{
  const TrbProject      *project;
  const TrbSolveOptions *options;
  GHashTable            *cache;    /* GBytes -> CacheEntry; NULL without the cache */
  Memo                  *memo;
  TrbSolveCache         *keep;     /* NULL when solving from scratch */
} Solver;

/* A member solved here (not read from the cache of an earlier solve). */
static void
solver_count (Solver     *sv,
              CacheEntry *entry,
              gboolean    solved)
{
  if (sv->keep == NULL)
    return;
  if (solved)
    sv->keep->n_solved++;
  else if (entry->used != sv->keep->generation)
    sv->keep->n_reused++;
  entry->used = sv->keep->generation;
}

/* ---- floors ------------------------------------------------------------------------------ */

static double
loads_total (const TrbLoad *loads,
             guint          n)
{
  double sum = 0;

  for (guint i = 0; i < n; i++)
    switch (loads[i].kind)
      {
      case TRB_LOAD_POINT:
        sum += loads[i].w1;
        break;
      case TRB_LOAD_UNIFORM:
        sum += loads[i].w1 * (loads[i].b - loads[i].a);
        break;
      case TRB_LOAD_LINEAR:
        sum += 0.5 * (loads[i].w1 + loads[i].w2) * (loads[i].b - loads[i].a);
        break;
      case TRB_LOAD_MOMENT:
      default:
        break;
      }
  return sum;
}

/* Live load reduction leaves alone: partitions (ASCE 7-16 §4.3.2, the engineer's choice kept
 * conservative), live loads above 100 psf (§4.7.3), passenger vehicle garages (§4.7.4) and
 * assembly uses (§4.7.5). The 20 % those may take on members supporting two or more floors
 * is not taken. */
static gboolean
area_load_reducible (const TrbAreaLoad *al)
{
  g_autofree char *occupancy = NULL;

  if (al->kind == TRB_AREA_LOAD_PARTITION)
    return FALSE;
  if (al->pressure > 100.0 * TRB_PSF * (1 + 1e-9))
    return FALSE;
  if (al->occupancy != NULL)
    {
      occupancy = g_ascii_strdown (al->occupancy, -1);
      if (strstr (occupancy, "garage") != NULL || strstr (occupancy, "parking") != NULL ||
          strstr (occupancy, "assembly") != NULL)
        return FALSE;
    }
  return TRUE;
}

/* The plan of one floor for the frame. With live load reduction, the floor's loads make two
 * streams: stream 0 every load but the live load that is never reduced, stream 1 that live
 * load alone. A plan takes the streams in its mask; stream 1's loads go in case slot b_slot
 * (a slot the floor does not use, so that one frame carries both, or L in a frame of their
 * own). The maps give, for each of the plan's line and point loads, the floor's index. */
typedef struct
{
  TrbFramePlan       plan;
  GArray            *columns;      /* TrbFrameColumn */
  GArray            *walls;        /* TrbFrameWall */
  GArray            *members;      /* TrbFrameMember */
  GArray            *area_loads;   /* TrbFrameAreaLoad */
  GArray            *openings;     /* TrbFrameOpening */
  GArray            *line_loads;   /* TrbFrameLineLoad */
  GArray            *point_loads;  /* TrbFramePointLoad */
  GArray            *line_map;     /* guint */
  GArray            *point_map;    /* guint */
  guint              n_loads;      /* loads of any kind in this stream */
} FloorPlan;

/* Once the frame is made, only the maps are read again (floor_unassigned()): the rest goes
 * before the members are solved (1 MB on 10,000 members, at the solve's peak). The frame
 * keeps nothing of the plan. */
static void
floor_plan_trim (FloorPlan *fp)
{
  g_clear_pointer (&fp->columns, g_array_unref);
  g_clear_pointer (&fp->walls, g_array_unref);
  g_clear_pointer (&fp->members, g_array_unref);
  g_clear_pointer (&fp->area_loads, g_array_unref);
  g_clear_pointer (&fp->openings, g_array_unref);
  g_clear_pointer (&fp->line_loads, g_array_unref);
  g_clear_pointer (&fp->point_loads, g_array_unref);
  memset (&fp->plan, 0, sizeof fp->plan);
}

static void
floor_plan_clear (FloorPlan *fp)
{
  floor_plan_trim (fp);
  g_clear_pointer (&fp->line_map, g_array_unref);
  g_clear_pointer (&fp->point_map, g_array_unref);
}

static guint
load_stream (gboolean    reduction,
             TrbLoadCase lcase,
             gboolean    reducible)
{
  return reduction && lcase == TRB_CASE_L && !reducible ? 1 : 0;
}

static void
floor_plan_init (FloorPlan      *fp,
                 const TrbFloor *floor,
                 gboolean        reduction,
                 guint           mask,
                 TrbLoadCase     b_slot)
{
  memset (fp, 0, sizeof *fp);
  fp->columns = g_array_new (FALSE, TRUE, sizeof (TrbFrameColumn));
  fp->walls = g_array_new (FALSE, TRUE, sizeof (TrbFrameWall));
  fp->members = g_array_new (FALSE, TRUE, sizeof (TrbFrameMember));
  fp->area_loads = g_array_new (FALSE, TRUE, sizeof (TrbFrameAreaLoad));
  fp->openings = g_array_new (FALSE, TRUE, sizeof (TrbFrameOpening));
  fp->line_loads = g_array_new (FALSE, TRUE, sizeof (TrbFrameLineLoad));
  fp->point_loads = g_array_new (FALSE, TRUE, sizeof (TrbFramePointLoad));
  fp->line_map = g_array_new (FALSE, FALSE, sizeof (guint));
  fp->point_map = g_array_new (FALSE, FALSE, sizeof (guint));

  for (guint i = 0; i < floor->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (floor->columns, i);
      TrbFrameColumn fc = { c->id, c->at.x, c->at.y };

      g_array_append_val (fp->columns, fc);
    }
  for (guint i = 0; i < floor->walls->len; i++)
    {
      const TrbWall *w = g_ptr_array_index (floor->walls, i);
      TrbFrameWall fw = { w->id, (const TrbFramePoint *) w->points->data, w->points->len };

      g_array_append_val (fp->walls, fw);
    }
  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      TrbFrameMember fm = { m->id, m->start, m->end, m->role, m->carries_deck,
                            (const TrbFramePoint *) m->bearing_points->data,
                            m->bearing_points->len };

      g_array_append_val (fp->members, fm);
    }
  for (guint i = 0; i < floor->area_loads->len; i++)
    {
      const TrbAreaLoad *al = g_ptr_array_index (floor->area_loads, i);
      guint s = load_stream (reduction, al->lcase, area_load_reducible (al));
      TrbFrameAreaLoad fa = { s == 1 ? b_slot : al->lcase, al->pressure,
                              (const TrbFramePoint *) al->points->data, al->points->len };

      if (!(mask & (1u << s)))
        continue;
      g_array_append_val (fp->area_loads, fa);
      fp->n_loads++;
    }
  for (guint i = 0; i < floor->openings->len; i++)
    {
      const TrbOpening *o = g_ptr_array_index (floor->openings, i);
      TrbFrameOpening fo = { (const TrbFramePoint *) o->points->data, o->points->len };

      g_array_append_val (fp->openings, fo);
    }
  /* Concentrated and line live loads are not reduced (ASCE 7-16 §4.7.1 reduces uniformly
   * distributed live load). */
  for (guint i = 0; i < floor->line_loads->len; i++)
    {
      const TrbLineLoad *ll = g_ptr_array_index (floor->line_loads, i);
      guint s = load_stream (reduction, ll->lcase, FALSE);
      TrbFrameLineLoad fl = { s == 1 ? b_slot : ll->lcase, ll->w,
                              (const TrbFramePoint *) ll->points->data, ll->points->len };

      if (!(mask & (1u << s)))
        continue;
      g_array_append_val (fp->line_loads, fl);
      g_array_append_val (fp->line_map, i);
      fp->n_loads++;
    }
  for (guint i = 0; i < floor->point_loads->len; i++)
    {
      const TrbPointLoad *pl = g_ptr_array_index (floor->point_loads, i);
      guint s = load_stream (reduction, pl->lcase, FALSE);
      TrbFramePointLoad fq = { s == 1 ? b_slot : pl->lcase, pl->P, pl->at.x, pl->at.y };

      if (!(mask & (1u << s)))
        continue;
      g_array_append_val (fp->point_loads, fq);
      g_array_append_val (fp->point_map, i);
      fp->n_loads++;
    }

  fp->plan.columns = (const TrbFrameColumn *) fp->columns->data;
  fp->plan.n_columns = fp->columns->len;
  fp->plan.walls = (const TrbFrameWall *) fp->walls->data;
  fp->plan.n_walls = fp->walls->len;
  fp->plan.members = (const TrbFrameMember *) fp->members->data;
  fp->plan.n_members = fp->members->len;
  fp->plan.area_loads = (const TrbFrameAreaLoad *) fp->area_loads->data;
  fp->plan.n_area_loads = fp->area_loads->len;
  fp->plan.openings = (const TrbFrameOpening *) fp->openings->data;
  fp->plan.n_openings = fp->openings->len;
  fp->plan.line_loads = (const TrbFrameLineLoad *) fp->line_loads->data;
  fp->plan.n_line_loads = fp->line_loads->len;
  fp->plan.point_loads = (const TrbFramePointLoad *) fp->point_loads->data;
  fp->plan.n_point_loads = fp->point_loads->len;
}

static void
wall_result_clear (gpointer data)
{
  TrbWallResult *w = data;

  for (guint c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&w->loads[c], g_array_unref);
}

static void
floor_result_free (gpointer data)
{
  TrbFloorResult *fr = data;

  g_free (fr->error);
  g_clear_pointer (&fr->columns, g_array_unref);
  g_clear_pointer (&fr->walls, g_array_unref);
  g_clear_pointer (&fr->unassigned, g_array_unref);
  g_free (fr);
}

static TrbFloorResult *
floor_result_new (const TrbFloor *floor)
{
  TrbFloorResult *fr = g_new0 (TrbFloorResult, 1);

  fr->floor = floor;
  fr->columns = g_array_new (FALSE, TRUE, sizeof (TrbColumnResult));
  fr->walls = g_array_new (FALSE, TRUE, sizeof (TrbWallResult));
  g_array_set_clear_func (fr->walls, wall_result_clear);
  fr->unassigned = g_array_new (FALSE, TRUE, sizeof (TrbUnassignedLoad));
  return fr;
}

/* A floor member's supports: the frame's (pins where it rests on something) and its own
 * <support>s; an own support within a billionth of the length of a frame support makes it the
 * stronger type there. which[i] is the index of the frame support, or -1 for an own one. */
static void
merge_supports (const TrbMember            *m,
                const TrbFrameMemberResult *fm,
                GArray                     *supports,
                GArray                     *which)
{
  double tol = 1e-9 * MAX (fm->length, 1.0);

  g_array_set_size (supports, 0);
  g_array_set_size (which, 0);
  for (guint s = 0; s < fm->n_supports; s++)
    {
      int w = s;

      g_array_append_val (supports, fm->supports[s]);
      g_array_append_val (which, w);
    }
  for (guint i = 0; i < m->supports->len; i++)
    {
      const TrbSupport *own = &g_array_index (m->supports, TrbMemberSupport, i).support;
      guint k;

      for (k = 0; k < supports->len; k++)
        {
          TrbSupport *have = &g_array_index (supports, TrbSupport, k);

          if (fabs (have->x - own->x) <= tol)
            {
              if (own->type == TRB_SUPPORT_FIXED)
                have->type = TRB_SUPPORT_FIXED;
              break;
            }
        }
      if (k == supports->len)
        {
          int w = -1;

          g_array_append_val (supports, *own);
          g_array_append_val (which, w);
        }
    }
  /* sorted by x (insertion sort: a handful of supports) */
  for (guint i = 1; i < supports->len; i++)
    for (guint k = i; k > 0; k--)
      {
        TrbSupport *a = &g_array_index (supports, TrbSupport, k - 1);
        TrbSupport *b = &g_array_index (supports, TrbSupport, k);
        int *wa = &g_array_index (which, int, k - 1);
        int *wb = &g_array_index (which, int, k);
        TrbSupport ts;
        int tw;

        if (a->x <= b->x)
          break;
        ts = *a, *a = *b, *b = ts;
        tw = *wa, *wa = *wb, *wb = tw;
      }
}

static gboolean
supports_stable (const GArray *supports)
{
  if (supports->len >= 2)
    return TRUE;
  return supports->len == 1 &&
         g_array_index (supports, TrbSupport, 0).type == TRB_SUPPORT_FIXED;
}

/* The largest centre-to-centre spacing to the neighbouring deck members, from the strip:
 * twice the half-width on either side (NDS 2018 4.3.9 asks for 24 in or less). NAN where the
 * strip has no neighbour on either side. */
static double
strip_spacing (const TrbFrameMemberResult *fm)
{
  double spacing = NAN;

  for (guint i = 0; i < fm->n_strips; i++)
    {
      const TrbFrameStrip *st = &fm->strips[i];

      if (isfinite (st->left))
        spacing = isnan (spacing) ? 2 * st->left : MAX (spacing, 2 * st->left);
      if (isfinite (st->right))
        spacing = isnan (spacing) ? 2 * st->right : MAX (spacing, 2 * st->right);
    }
  return spacing;
}

/* Reactions of one load set on a solved beam, per support and case slot c. */
static void
reactions_of (const TrbBeam *beam,
              const TrbLoad *loads,
              guint          n_loads,
              TrbLoadCase    c,
              double        *out)
{
  g_autoptr(TrbBeamResult) res = NULL;
  const TrbReaction *re;
  guint n;

  if (n_loads == 0)
    return;
  res = trb_beam_solve (beam, loads, n_loads, NULL);
  if (res == NULL)
    return;
  re = trb_beam_result_get_reactions (res, &n);
  for (guint i = 0; i < n; i++)
    out[i * TRB_N_CASES + c] = re[i].force;
}

typedef struct
{
  const TrbFloor        *floor;
  gboolean               reduction;
  double                 Lo;                 /* the largest reducible live pressure, Pa */
  const TrbFrame        *frame[2];            /* frame[1]: stream 1 alone, when needed */
  TrbFrameTakedown      *takedown[2];
  int                    b_frame;             /* which frame carries stream 1; -1: none */
  TrbLoadCase            b_slot;              /* and in which case slot */
  gboolean              *ok;                 /* per member: can be analysed */
  char                 **reason;             /* per member: why not */
  double                *area_in;            /* per member: A_T handed down from above, m^2 */
  const char           **incomplete;         /* per member: a member above that passed nothing */
  double                *column_area;        /* per column: A_T, m^2 */
  gboolean              *column_cantilever;
  /* what solve_floor_member() gathers for each member, emptied and filled again: a few
   * small arrays a member allocated and freed were a third of an incremental solve */
  GArray                *supports;           /* TrbSupport */
  GArray                *which;              /* int */
  GArray                *live_a;             /* TrbLoad */
  GArray                *live_b;
  GArray                *loads[TRB_N_CASES];
  Key                    extra;
  Key                    key;
} FloorSolve;

/* What frame f (and its takedown) carries in case slot c: which case of which stream. */
static gboolean
slot_of (const FloorSolve *fs,
         guint             f,
         guint             c,
         TrbLoadCase      *lcase,
         guint            *stream)
{
  if (fs->frame[f] == NULL)
    return FALSE;
  if (f == 1 || (fs->b_frame == 0 && c == fs->b_slot))
    {
      if (f == 1 && c != TRB_CASE_L)
        return FALSE;
      *lcase = TRB_CASE_L;
      *stream = 1;
      return TRUE;
    }
  *lcase = c;
  *stream = 0;
  return TRUE;
}

static const char *
frame_status_word (const FloorSolve *fs,
                   guint             index)
{
  const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], index);

  return fm->status == TRB_FRAME_IN_CYCLE ? "in a bearing cycle" : "unsupported";
}

/* Which members can be analysed: stable on their supports (the frame's and their own), and
 * resting only on members that can be. Supporters come last in the bearing order, so the
 * order is walked backwards. */
static void
floor_statuses (FloorSolve *fs)
{
  const TrbFloor *floor = fs->floor;
  guint n_order;
  const guint *order = trb_frame_get_order (fs->frame[0], &n_order);
  g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  g_autoptr(GArray) which = g_array_new (FALSE, FALSE, sizeof (int));

  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], i);

      fs->ok[i] = FALSE;
      if (fm->status == TRB_FRAME_IN_CYCLE)
        fs->reason[i] = g_strdup (fm->reason);
    }

  for (guint k = n_order; k-- > 0;)
    {
      guint idx = order[k];
      const TrbMember *m = g_ptr_array_index (floor->members, idx);
      const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], idx);

      merge_supports (m, fm, supports, which);
      if (!supports_stable (supports))
        {
          fs->reason[idx] = g_strdup (fm->reason != NULL ? fm->reason
                                      : supports->len == 0 ? "no support: nothing lies under it"
                                      : "one support only: it is a mechanism");
          continue;
        }
      fs->ok[idx] = TRUE;
      for (guint s = 0; s < fm->n_supports; s++)
        {
          const TrbBearing *b = &fm->bearings[s];

          if (b->kind == TRB_BEARING_MEMBER && !fs->ok[b->index])
            {
              fs->ok[idx] = FALSE;
              fs->reason[idx] = g_strdup_printf ("bears on member %s, which is %s", b->id,
                                                 trb_frame_get_member (fs->frame[0], b->index)
                                                   ->status != TRB_FRAME_SUPPORTED
                                                 ? frame_status_word (fs, b->index)
                                                 : "unsupported");
              break;
            }
        }
    }
}

/* The loads of one member that stay where they are: its own, the frame's and those handed
 * down to it, per case, added to not_carried; and the members it rests on are told. */
static void
floor_strand (FloorSolve     *fs,
              TrbFloorResult *fr,
              guint           idx)
{
  const TrbMember *m = g_ptr_array_index (fs->floor->members, idx);
  const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], idx);

  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

      fr->not_carried[ml->lcase] += loads_total (&ml->load, 1);
    }
  for (guint f = 0; f < 2; f++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      {
        const TrbFrameMemberResult *fm2;
        const TrbLoad *handed;
        TrbLoadCase lc;
        guint s, n;

        if (!slot_of (fs, f, c, &lc, &s))
          continue;
        fm2 = trb_frame_get_member (fs->frame[f], idx);
        fr->not_carried[lc] += loads_total (fm2->loads[c], fm2->n_loads[c]);
        handed = trb_frame_takedown_get_member_loads (fs->takedown[f], idx, c, &n);
        fr->not_carried[lc] += loads_total (handed, n);
      }
  for (guint s = 0; s < fm->n_supports; s++)
    if (fm->bearings[s].kind == TRB_BEARING_MEMBER && fs->incomplete[fm->bearings[s].index] == NULL)
      fs->incomplete[fm->bearings[s].index] = m->id;
}

/* Every load of a member counted as applied: its own and the frame's (not those handed down,
 * which were counted where they started). */
static void
floor_count_applied (FloorSolve     *fs,
                     TrbFloorResult *fr,
                     guint           idx)
{
  const TrbMember *m = g_ptr_array_index (fs->floor->members, idx);

  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

      fr->applied[ml->lcase] += loads_total (&ml->load, 1);
    }
  for (guint f = 0; f < 2; f++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      {
        const TrbFrameMemberResult *fm2;
        TrbLoadCase lc;
        guint s;

        if (!slot_of (fs, f, c, &lc, &s))
          continue;
        fm2 = trb_frame_get_member (fs->frame[f], idx);
        fr->applied[lc] += loads_total (fm2->loads[c], fm2->n_loads[c]);
      }
}

static GArray *
bearings_new (const TrbMember            *m,
              const TrbFrameMemberResult *fm,
              const GArray               *supports,
              const GArray               *which)
{
  GArray *bearings = g_array_sized_new (FALSE, TRUE, sizeof (TrbMemberBearing), supports->len);

  for (guint i = 0; i < supports->len; i++)
    {
      int w = g_array_index (which, int, i);
      TrbMemberBearing b = { 0 };

      b.x = g_array_index (supports, TrbSupport, i).x;
      b.own = w < 0;
      if (w >= 0)
        {
          const TrbBearing *fb = &fm->bearings[w];

          b.kind = fb->kind;
          /* the model's string, which outlives the frame */
          b.id = fb->kind == TRB_BEARING_COLUMN
                 ? ((const TrbColumn *) g_ptr_array_index (m->floor->columns, fb->index))->id
                 : fb->kind == TRB_BEARING_WALL
                 ? ((const TrbWall *) g_ptr_array_index (m->floor->walls, fb->index))->id
                 : ((const TrbMember *) g_ptr_array_index (m->floor->members, fb->index))->id;
          b.position = fb->position;
        }
      g_array_append_val (bearings, b);
    }
  return bearings;
}

static TrbMemberResult *
not_analysed_result (const TrbProject *project,
                     const TrbMember  *m,
                     TrbStatus         status,
                     const char       *reason)
{
  TrbMemberResult *r = trb_solve_priv_member_result_new (project, m);

  g_strlcpy (r->section, m->section, sizeof r->section);
  trb_solve_priv_set_status (r, status, "%s", reason);
  if (m->floor != NULL)
    r->reduction.factor = 1;
  return r;
}

static void
append_loads (GArray        *to,
              const TrbLoad *loads,
              guint          n,
              double         factor)
{
  for (guint i = 0; i < n; i++)
    {
      TrbLoad l = loads[i];

      /* a case a member hands down without load (no snow on it) is no load here */
      if (l.w1 == 0 && (l.kind != TRB_LOAD_LINEAR || l.w2 == 0))
        continue;
      if (factor != 1)
        {
          l.w1 *= factor;
          l.w2 *= factor;
        }
      g_array_append_val (to, l);
    }
}

/* The live load reduction of a member with A_T area (m^2): K_LL 2 for beams and girders
 * (interior beams, edge beams without cantilever slabs), 1 for cantilevered members (ASCE
 * 7-16 Table 4.7-1); a member of a floor supports that floor only. */
static void
member_reduction (const FloorSolve *fs,
                  double            area,
                  gboolean          cantilever,
                  TrbReductionUse  *use)
{
  TrbLiveReduction red;

  use->area = area;
  use->floors = 1;
  use->factor = 1;
  use->k_ll = trb_live_k_ll (cantilever ? TRB_LIVE_MEMBER_OTHER : TRB_LIVE_MEMBER_INTERIOR_BEAM);
  use->rule = TRB_LIVE_RULE_SMALL_AREA;
  if (!fs->reduction || !(fs->Lo > 0) || !(area > 0))
    return;
  if (trb_live_reduction_floor (fs->Lo, area,
                                cantilever ? TRB_LIVE_MEMBER_OTHER
                                           : TRB_LIVE_MEMBER_INTERIOR_BEAM,
                                1, TRB_LIVE_OCCUPANCY_ORDINARY, &red, NULL))
    {
      use->applies = TRUE;
      use->factor = red.factor;
      use->rule = red.rule;
      use->k_ll = red.k_ll;
    }
}

static void
solve_floor_member (Solver         *sv,
                    FloorSolve     *fs,
                    TrbFloorResult *fr,
                    guint           idx,
                    GHashTable     *results)
{
  const TrbProject *project = sv->project;
  const TrbMember *m = g_ptr_array_index (fs->floor->members, idx);
  const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], idx);
  GArray *supports = fs->supports;
  GArray *which = fs->which;
  GArray *live_a = fs->live_a;
  GArray *live_b = fs->live_b;
  GArray **loads = fs->loads;
  Key *extra = &fs->extra;
  g_autoptr(GBytes) key = NULL;
  MemberInput in = { 0 };
  TrbReductionUse use = { 0 };
  TrbMemberResult *r;
  CacheEntry *entry = NULL;
  double *reactions[2];
  /* not g_autofree on an array of two: that frees the first element only */
  g_autofree double *handed_0 = NULL;
  g_autofree double *handed_1 = NULL;
  double *handed[2];
  guint n_beam;
  gboolean cantilever;
  double reducible = 0, other = 0;
  double length = fm->length;

  floor_count_applied (fs, fr, idx);
  merge_supports (m, fm, supports, which);

  g_array_set_size (live_a, 0);
  g_array_set_size (live_b, 0);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_set_size (loads[c], 0);
  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

      /* the member's own live loads are not reduced: they may be anything */
      g_array_append_val (ml->lcase == TRB_CASE_L && fs->reduction ? live_b : loads[ml->lcase],
                          ml->load);
    }
  for (guint f = 0; f < 2; f++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      {
        const TrbFrameMemberResult *fm2;
        const TrbLoad *down;
        TrbLoadCase lc;
        guint st, n;
        GArray *to;

        if (!slot_of (fs, f, c, &lc, &st))
          continue;
        fm2 = trb_frame_get_member (fs->frame[f], idx);
        to = st == 1 ? live_b : lc == TRB_CASE_L && fs->reduction ? live_a : loads[lc];
        append_loads (to, fm2->loads[c], fm2->n_loads[c], 1);
        down = trb_frame_takedown_get_member_loads (fs->takedown[f], idx, c, &n);
        append_loads (to, down, n, 1);
      }
  if (fs->reduction)
    {
      reducible = loads_total ((const TrbLoad *) live_a->data, live_a->len);
      other = loads_total ((const TrbLoad *) live_b->data, live_b->len);
    }

  cantilever = supports->len > 0 &&
               (g_array_index (supports, TrbSupport, 0).x > TRB_FRAME_TOLERANCE ||
                g_array_index (supports, TrbSupport, supports->len - 1).x <
                  length - TRB_FRAME_TOLERANCE);
  member_reduction (fs, fm->loaded_area[TRB_CASE_L] + fs->area_in[idx], cantilever, &use);
  use.reducible = reducible;
  use.other = other;
  if (fs->reduction)
    {
      if (!(reducible > 0))
        use.applies = FALSE, use.factor = 1;
      append_loads (loads[TRB_CASE_L], (const TrbLoad *) live_a->data, live_a->len, use.factor);
      append_loads (loads[TRB_CASE_L], (const TrbLoad *) live_b->data, live_b->len, 1);
    }

  in.length = length;
  in.supports = (const TrbSupport *) supports->data;
  in.n_supports = supports->len;
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      in.loads[c] = (const TrbLoad *) loads[c]->data;
      in.n_loads[c] = loads[c]->len;
    }
  in.repetitive_spacing = strip_spacing (fm);
  in.memo = sv->memo;
  in.member = m;

  /* the streams decide what is handed down, so they are part of what makes members equal */
  extra->len = 0;
  key_int (extra, fs->reduction);
  key_loads (extra, (const TrbLoad *) live_a->data, live_a->len);
  key_loads (extra, (const TrbLoad *) live_b->data, live_b->len);
  member_key_gather (&fs->key, m, &in, sv->options->shortlist_max, extra);

  /* looked up without a copy of the key's bytes; copied only to be kept */
  key = g_bytes_new_static (fs->key.data, fs->key.len);
  if (sv->cache != NULL)
    entry = g_hash_table_lookup (sv->cache, key);
  if (entry == NULL)
    {
      entry = cache_entry_new (trb_solve_priv_solve_input (project, m, &in,
                                                           sv->options->shortlist_max,
                                                           sv->options->bounds),
                               fs->reduction, live_a, live_b);
      if (sv->cache != NULL)
        g_hash_table_insert (sv->cache, g_bytes_new (fs->key.data, fs->key.len), entry);
      solver_count (sv, entry, TRUE);
    }
  else
    solver_count (sv, entry, FALSE);
  /* With the cache, the entry keeps its own result and every member gets a share of it, so
   * that what one member's place in the floor changes (its bearings, an incomplete load)
   * never reaches the others. */
  if (sv->cache != NULL)
    r = trb_solve_priv_member_result_share (entry->result, m);
  else
    r = g_steal_pointer (&entry->result);

  r->bearings = bearings_new (m, fm, supports, which);
  r->plan_note = g_strdup (fm->note);
  r->reduction = use;
  g_hash_table_insert (results, (gpointer) m, r);

  if (!r->analysed)
    {
      if (sv->cache == NULL)
        cache_entry_free (entry);
      floor_strand (fs, fr, idx);
      return;
    }

  fr->applied[TRB_CASE_D] += r->self_weight * length;

  /* per support of the beam: map to the merged supports by position */
  {
    const TrbSupport *bs = trb_beam_get_supports (r->beam, &n_beam);
    double total_a = 0;

    reactions[0] = entry->reactions[0];
    reactions[1] = entry->reactions[1];
    /* what each frame's takedown gets, slot by slot (the frames share their geometry, so
     * their supports are the same) */
    handed[0] = handed_0 = g_new0 (double, (fm->n_supports + 1) * TRB_N_CASES);
    handed[1] = handed_1 = g_new0 (double, (fm->n_supports + 1) * TRB_N_CASES);

    for (guint i = 0; i < n_beam; i++)
      total_a += MAX (reactions[0][i * TRB_N_CASES + TRB_CASE_L], 0);

    for (guint j = 0; j < supports->len; j++)
      {
        double x = g_array_index (supports, TrbSupport, j).x;
        int w = g_array_index (which, int, j);
        TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, j);
        guint i = 0;

        for (guint k = 1; k < n_beam; k++)
          if (fabs (bs[k].x - x) < fabs (bs[i].x - x))
            i = k;
        for (guint c = 0; c < TRB_N_CASES; c++)
          b->force[c] = reactions[0][i * TRB_N_CASES + c] + reactions[1][i * TRB_N_CASES + c];
        if (w < 0)
          {
            for (guint c = 0; c < TRB_N_CASES; c++)
              fr->supports[c] += b->force[c];
            continue;
          }
        for (guint f = 0; f < 2; f++)
          for (guint c = 0; c < TRB_N_CASES; c++)
            {
              TrbLoadCase lc;
              guint st;

              if (slot_of (fs, f, c, &lc, &st))
                handed[f][w * TRB_N_CASES + c] = reactions[st][i * TRB_N_CASES + lc];
            }

        /* A_T goes down with the reducible live load it came with */
        if (use.area > 0 && total_a > 0)
          {
            double share = use.area * MAX (reactions[0][i * TRB_N_CASES + TRB_CASE_L], 0) /
                           total_a;

            if (b->kind == TRB_BEARING_MEMBER)
              fs->area_in[fm->bearings[w].index] += share;
            else if (b->kind == TRB_BEARING_COLUMN)
              fs->column_area[fm->bearings[w].index] += share;
          }
        /* the member runs on past the column: a cantilever over it (Table 4.7-1) */
        if (b->kind == TRB_BEARING_COLUMN &&
            ((j == 0 && x > TRB_FRAME_TOLERANCE) ||
             (j + 1 == supports->len && x < length - TRB_FRAME_TOLERANCE)))
          fs->column_cantilever[fm->bearings[w].index] = TRUE;
      }
  }

  for (guint f = 0; f < 2; f++)
    if (fs->takedown[f] != NULL)
      trb_frame_takedown_add (fs->takedown[f], idx, handed[f], fm->n_supports, NULL);

  if (fs->incomplete[idx] != NULL)
    trb_solve_priv_set_status (r, TRB_STATUS_NOT_DESIGNED, "loads incomplete: %s, which rests "
                               "on it, could not be analysed", fs->incomplete[idx]);

  if (sv->cache == NULL)
    cache_entry_free (entry);
}

static int
compare_load_position (gconstpointer a,
                       gconstpointer b)
{
  const TrbLoad *la = a;
  const TrbLoad *lb = b;

  return la->a < lb->a ? -1 : la->a > lb->a ? 1 : 0;
}

static void
floor_columns_walls (FloorSolve     *fs,
                     TrbFloorResult *fr,
                     guint           floors_above)
{
  const TrbFloor *floor = fs->floor;

  for (guint i = 0; i < floor->columns->len; i++)
    {
      TrbColumnResult col = { 0 };
      double other = 0;

      col.column = g_ptr_array_index (floor->columns, i);
      col.floor = floor;
      col.cantilever = fs->column_cantilever[i];
      for (guint f = 0; f < 2; f++)
        for (guint c = 0; c < TRB_N_CASES; c++)
          {
            TrbLoadCase lc;
            guint st;
            double load;

            if (!slot_of (fs, f, c, &lc, &st))
              continue;
            load = trb_frame_takedown_get_column_load (fs->takedown[f], i, c);
            col.force[lc] += load;
            if (lc == TRB_CASE_L && st == 0)
              col.reduction.reducible += load;
            else if (lc == TRB_CASE_L)
              other += load;
          }
      col.reduction.factor = 1;
      col.reduction.floors = 1 + floors_above;
      col.reduction.area = fs->column_area[i];
      /* Table 4.7-1: 4 for interior columns and exterior ones without cantilever slabs; a
       * column a member runs on past is taken as a corner column with cantilever slabs (2),
       * the least of those rows, since which edge it is on is not known here */
      col.reduction.k_ll = trb_live_k_ll (col.cantilever
                                          ? TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER
                                          : TRB_LIVE_MEMBER_INTERIOR_COLUMN);
      col.live_reduced = col.force[TRB_CASE_L];
      if (fs->reduction)
        {
          TrbLiveReduction red;

          col.reduction.other = other;
          if (col.reduction.reducible > 0 && fs->Lo > 0 && col.reduction.area > 0 &&
              trb_live_reduction_floor (fs->Lo, col.reduction.area,
                                        col.cantilever
                                          ? TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER
                                          : TRB_LIVE_MEMBER_INTERIOR_COLUMN,
                                        col.reduction.floors, TRB_LIVE_OCCUPANCY_ORDINARY,
                                        &red, NULL))
            {
              col.reduction.applies = TRUE;
              col.reduction.factor = red.factor;
              col.reduction.rule = red.rule;
              col.live_reduced = red.factor * col.reduction.reducible + other;
            }
        }
      for (guint c = 0; c < TRB_N_CASES; c++)
        fr->reactions[c] += col.force[c];
      g_array_append_val (fr->columns, col);
    }

  for (guint i = 0; i < floor->walls->len; i++)
    {
      TrbWallResult wr = { 0 };

      wr.wall = g_ptr_array_index (floor->walls, i);
      wr.floor = floor;
      for (guint c = 0; c < TRB_N_CASES; c++)
        wr.loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
      for (guint f = 0; f < 2; f++)
        for (guint c = 0; c < TRB_N_CASES; c++)
          {
            const TrbLoad *l;
            TrbLoadCase lc;
            guint st, n;

            if (!slot_of (fs, f, c, &lc, &st))
              continue;
            l = trb_frame_takedown_get_wall_loads (fs->takedown[f], i, c, &n);
            for (guint k = 0; k < n; k++)
              if (l[k].w1 != 0)
                g_array_append_val (wr.loads[lc], l[k]);
          }
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          GArray *a = wr.loads[c];
          guint out = 0;

          /* sorted by position, those at one place added into one */
          g_array_sort (a, compare_load_position);
          for (guint k = 0; k < a->len; k++)
            {
              TrbLoad *l = &g_array_index (a, TrbLoad, k);

              if (out > 0 && g_array_index (a, TrbLoad, out - 1).a == l->a)
                g_array_index (a, TrbLoad, out - 1).w1 += l->w1;
              else
                g_array_index (a, TrbLoad, out++) = *l;
            }
          g_array_set_size (a, out);
          wr.force[c] = loads_total ((const TrbLoad *) wr.loads[c]->data, wr.loads[c]->len);
          fr->reactions[c] += wr.force[c];
        }
      g_array_append_val (fr->walls, wr);
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    fr->reactions[c] += fr->supports[c];
}

static int
compare_unassigned (gconstpointer a,
                    gconstpointer b)
{
  const TrbUnassignedLoad *ua = a;
  const TrbUnassignedLoad *ub = b;
  int la = ua->line != NULL ? 0 : 1;
  int lb = ub->line != NULL ? 0 : 1;
  int ka = ua->line != NULL ? ua->line->line : ua->point->line;
  int kb = ub->line != NULL ? ub->line->line : ub->point->line;

  if (la != lb)
    return la - lb;
  return (ka > kb) - (ka < kb);
}

static void
floor_unassigned (const TrbFloor  *floor,
                  const TrbFrame  *frame,
                  const FloorPlan *fp,
                  GArray          *out)
{
  const guint *points;
  const TrbFrameUnassigned *lines;
  guint n;

  lines = trb_frame_get_unassigned_lines (frame, &n);
  for (guint i = 0; i < n; i++)
    {
      TrbUnassignedLoad u = { 0 };

      u.line = g_ptr_array_index (floor->line_loads,
                                  g_array_index (fp->line_map, guint, lines[i].index));
      u.length = lines[i].length;
      u.force = u.line->w * u.length;
      g_array_append_val (out, u);
    }
  points = trb_frame_get_unassigned_points (frame, &n);
  for (guint i = 0; i < n; i++)
    {
      TrbUnassignedLoad u = { 0 };

      u.point = g_ptr_array_index (floor->point_loads,
                                   g_array_index (fp->point_map, guint, points[i]));
      u.force = u.point->P;
      g_array_append_val (out, u);
    }
}

/* The exact bytes of a frame's plan, ids and all (the frame keeps them in its reasons): a
 * plan of the same bytes gives the same frame. */
static GBytes *
plan_key (const TrbFramePlan *plan)
{
  Key k = { NULL, 0, 0 };
  Key *key = &k;

  key_int (key, plan->n_columns);
  for (guint i = 0; i < plan->n_columns; i++)
    {
      key_string (key, plan->columns[i].id);
      key_double (key, plan->columns[i].x);
      key_double (key, plan->columns[i].y);
    }
  key_int (key, plan->n_walls);
  for (guint i = 0; i < plan->n_walls; i++)
    {
      key_string (key, plan->walls[i].id);
      key_int (key, plan->walls[i].n_points);
      key_bytes (key, plan->walls[i].points, plan->walls[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_members);
  for (guint i = 0; i < plan->n_members; i++)
    {
      const TrbFrameMember *fm = &plan->members[i];

      key_string (key, fm->id);
      key_double (key, fm->start.x);
      key_double (key, fm->start.y);
      key_double (key, fm->end.x);
      key_double (key, fm->end.y);
      key_int (key, fm->role);
      key_int (key, fm->carries_deck);
      key_int (key, fm->n_bearing_points);
      key_bytes (key, fm->bearing_points, fm->n_bearing_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_area_loads);
  for (guint i = 0; i < plan->n_area_loads; i++)
    {
      key_int (key, plan->area_loads[i].load_case);
      key_double (key, plan->area_loads[i].pressure);
      key_int (key, plan->area_loads[i].n_points);
      key_bytes (key, plan->area_loads[i].points,
                 plan->area_loads[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_openings);
  for (guint i = 0; i < plan->n_openings; i++)
    {
      key_int (key, plan->openings[i].n_points);
      key_bytes (key, plan->openings[i].points,
                 plan->openings[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_line_loads);
  for (guint i = 0; i < plan->n_line_loads; i++)
    {
      key_int (key, plan->line_loads[i].load_case);
      key_double (key, plan->line_loads[i].w);
      key_int (key, plan->line_loads[i].n_points);
      key_bytes (key, plan->line_loads[i].points,
                 plan->line_loads[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_point_loads);
  for (guint i = 0; i < plan->n_point_loads; i++)
    {
      key_int (key, plan->point_loads[i].load_case);
      key_double (key, plan->point_loads[i].P);
      key_double (key, plan->point_loads[i].x);
      key_double (key, plan->point_loads[i].y);
    }
  return g_bytes_new_take (k.data, k.len);
}

static void
frame_entry_free (gpointer data)
{
  FrameEntry *fe = data;

  trb_frame_free (fe->frame);
  g_free (fe);
}

/* The frame of a plan: made here (*owned, the caller's to free) or, with a TrbSolveCache,
 * the one an earlier solve made of the same plan (the frame is read only once made; each
 * solve hands its loads down in a takedown of its own). */
static const TrbFrame *
floor_frame (Solver             *sv,
             const TrbFramePlan *plan,
             TrbFrame          **owned,
             GError            **error)
{
  g_autoptr(GBytes) key = NULL;
  FrameEntry *fe;

  *owned = NULL;
  if (sv->keep == NULL)
    return *owned = trb_frame_new (plan, error);
  key = plan_key (plan);
  fe = g_hash_table_lookup (sv->keep->frames, key);
  if (fe == NULL)
    {
      TrbFrame *frame = trb_frame_new (plan, error);

      if (frame == NULL)
        return NULL;
      fe = g_new0 (FrameEntry, 1);
      fe->frame = frame;
      g_hash_table_insert (sv->keep->frames, g_steal_pointer (&key), fe);
      sv->keep->n_frames_new++;
    }
  fe->used = sv->keep->generation;
  return fe->frame;
}

/* The load takedown of one floor: frame, then every member from the top of the load path
 * down, then what reached the columns and walls. Results go into results (member -> result). */
static gboolean
floor_result_finite (const TrbFloorResult *fr)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (!isfinite (fr->applied[c]) || !isfinite (fr->reactions[c]) ||
        !isfinite (fr->supports[c]) || !isfinite (fr->not_carried[c]))
      return FALSE;
  for (guint i = 0; i < fr->columns->len; i++)
    {
      const TrbColumnResult *col = &g_array_index (fr->columns, TrbColumnResult, i);

      if (!isfinite (col->live_reduced))
        return FALSE;
      for (guint c = 0; c < TRB_N_CASES; c++)
        if (!isfinite (col->force[c]))
          return FALSE;
    }
  for (guint i = 0; i < fr->walls->len; i++)
    {
      const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);

      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          if (!isfinite (w->force[c]))
            return FALSE;
          for (guint k = 0; k < w->loads[c]->len; k++)
            if (!isfinite (g_array_index (w->loads[c], TrbLoad, k).w1))
              return FALSE;
        }
    }
  for (guint i = 0; i < fr->unassigned->len; i++)
    if (!isfinite (g_array_index (fr->unassigned, TrbUnassignedLoad, i).force))
      return FALSE;
  return TRUE;
}

static TrbFloorResult *
solve_floor (Solver         *sv,
             const TrbFloor *floor,
             GHashTable     *results)
{
  const TrbSettings *settings = &sv->project->settings;
  TrbFloorResult *fr = floor_result_new (floor);
  FloorSolve fs = { 0 };
  FloorPlan fp[2];
  TrbFrame *owned[2] = { NULL, NULL };   /* the frames not kept by a TrbSolveCache */
  g_autoptr(GError) error = NULL;
  guint n = floor->members->len;
  guint n_order;
  const guint *order;

  fs.floor = floor;
  fs.reduction = settings->live_load_reduction;
  for (guint i = 0; fs.reduction && i < floor->area_loads->len; i++)
    {
      const TrbAreaLoad *al = g_ptr_array_index (floor->area_loads, i);

      if (al->lcase == TRB_CASE_L && area_load_reducible (al))
        fs.Lo = MAX (fs.Lo, al->pressure);
    }

  /* The live load that is never reduced travels apart from the rest; in a case slot of the
   * same frame that no load of the floor uses, when there is one (a floor without roof live
   * load or snow), else in a frame of its own: the frame's work is most of the floor's. */
  fs.b_frame = -1;
  fs.b_slot = TRB_CASE_L;
  floor_plan_init (&fp[1], floor, fs.reduction, 2, TRB_CASE_L);
  if (fp[1].n_loads > 0)
    {
      gboolean used[TRB_N_CASES] = { FALSE };

      for (guint i = 0; i < floor->area_loads->len; i++)
        used[((const TrbAreaLoad *) g_ptr_array_index (floor->area_loads, i))->lcase] = TRUE;
      for (guint i = 0; i < floor->line_loads->len; i++)
        used[((const TrbLineLoad *) g_ptr_array_index (floor->line_loads, i))->lcase] = TRUE;
      for (guint i = 0; i < floor->point_loads->len; i++)
        used[((const TrbPointLoad *) g_ptr_array_index (floor->point_loads, i))->lcase] = TRUE;
      fs.b_frame = 1;
      for (guint c = TRB_N_CASES; c-- > 0;)
        if (c != TRB_CASE_D && c != TRB_CASE_L && !used[c])
          {
            fs.b_frame = 0;
            fs.b_slot = c;
          }
    }
  if (fs.b_frame == 0)
    {
      floor_plan_clear (&fp[1]);
      floor_plan_init (&fp[0], floor, fs.reduction, 3, fs.b_slot);
      memset (&fp[1], 0, sizeof fp[1]);
    }
  else
    floor_plan_init (&fp[0], floor, fs.reduction, 1, TRB_CASE_L);
  fs.frame[0] = floor_frame (sv, &fp[0].plan, &owned[0], &error);
  if (fs.frame[0] != NULL && fs.b_frame == 1)
    fs.frame[1] = floor_frame (sv, &fp[1].plan, &owned[1], &error);
  if (fs.frame[0] == NULL || (fs.b_frame == 1 && fs.frame[1] == NULL))
    {
      fr->error = g_strdup (error->message);
      for (guint i = 0; i < n; i++)
        {
          const TrbMember *m = g_ptr_array_index (floor->members, i);
          g_autofree char *why = g_strdup_printf ("floor \"%s\" could not be framed: %s",
                                                  floor->name != NULL ? floor->name : "",
                                                  error->message);

          g_hash_table_insert (results, (gpointer) m,
                               not_analysed_result (sv->project, m, TRB_STATUS_ERROR, why));
        }
      g_clear_pointer (&owned[0], trb_frame_free);
      floor_plan_clear (&fp[0]);
      floor_plan_clear (&fp[1]);
      return fr;
    }

  for (guint s = 0; s < 2; s++)
    {
      floor_plan_trim (&fp[s]);
      if (fs.frame[s] != NULL)
        fs.takedown[s] = trb_frame_takedown_new (fs.frame[s]);
    }
  fs.ok = g_new0 (gboolean, n + 1);
  fs.reason = g_new0 (char *, n + 1);
  fs.area_in = g_new0 (double, n + 1);
  fs.incomplete = g_new0 (const char *, n + 1);
  fs.column_area = g_new0 (double, floor->columns->len + 1);
  fs.column_cantilever = g_new0 (gboolean, floor->columns->len + 1);
  fs.supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  fs.which = g_array_new (FALSE, FALSE, sizeof (int));
  fs.live_a = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  fs.live_b = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  for (guint c = 0; c < TRB_N_CASES; c++)
    fs.loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));

  floor_statuses (&fs);

  /* members in a cycle have no place in the order; what lies on them stays there */
  for (guint i = 0; i < n; i++)
    {
      const TrbFrameMemberResult *fm = trb_frame_get_member (fs.frame[0], i);

      if (fm->status == TRB_FRAME_IN_CYCLE)
        {
          const TrbMember *m = g_ptr_array_index (floor->members, i);
          g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
          g_autoptr(GArray) which = g_array_new (FALSE, FALSE, sizeof (int));
          TrbMemberResult *r = not_analysed_result (sv->project, m, TRB_STATUS_ERROR,
                                                    fs.reason[i]);

          merge_supports (m, fm, supports, which);
          r->bearings = bearings_new (m, fm, supports, which);
          r->plan_note = g_strdup (fm->note);
          g_hash_table_insert (results, (gpointer) m, r);
          floor_count_applied (&fs, fr, i);
          floor_strand (&fs, fr, i);
        }
    }

  order = trb_frame_get_order (fs.frame[0], &n_order);
  for (guint k = 0; k < n_order; k++)
    {
      guint idx = order[k];

      if (!fs.ok[idx])
        {
          const TrbMember *m = g_ptr_array_index (floor->members, idx);
          const TrbFrameMemberResult *fm = trb_frame_get_member (fs.frame[0], idx);
          g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
          g_autoptr(GArray) which = g_array_new (FALSE, FALSE, sizeof (int));
          TrbMemberResult *r = not_analysed_result (sv->project, m, TRB_STATUS_UNSUPPORTED,
                                                    fs.reason[idx]);

          merge_supports (m, fm, supports, which);
          r->bearings = bearings_new (m, fm, supports, which);
          r->plan_note = g_strdup (fm->note);
          g_hash_table_insert (results, (gpointer) m, r);
          floor_count_applied (&fs, fr, idx);
          floor_strand (&fs, fr, idx);
        }
      else
        solve_floor_member (sv, &fs, fr, idx, results);
      /* what was handed down to it is read once, above: freed before the floor's results
       * pile up (2 MB of the CLI's peak on 10,000 members) */
      for (guint s = 0; s < 2; s++)
        if (fs.takedown[s] != NULL)
          trb_frame_takedown_release_member (fs.takedown[s], idx);
    }

  floor_columns_walls (&fs, fr, MAX (settings->floors_above, 0));
  for (guint s = 0; s < 2; s++)
    if (fs.frame[s] != NULL)
      floor_unassigned (floor, fs.frame[s], &fp[s], fr->unassigned);
  /* in plan order, whichever frame found them */
  g_array_sort (fr->unassigned, compare_unassigned);

  for (guint i = 0; i < n; i++)
    g_free (fs.reason[i]);
  g_free (fs.reason);
  g_free (fs.ok);
  g_free (fs.area_in);
  g_free (fs.incomplete);
  g_free (fs.column_area);
  g_free (fs.column_cantilever);
  g_array_unref (fs.supports);
  g_array_unref (fs.which);
  g_array_unref (fs.live_a);
  g_array_unref (fs.live_b);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_unref (fs.loads[c]);
  g_free (fs.extra.data);
  g_free (fs.key.data);
  for (guint s = 0; s < 2; s++)
    {
      g_clear_pointer (&fs.takedown[s], trb_frame_takedown_free);
      g_clear_pointer (&owned[s], trb_frame_free);
      floor_plan_clear (&fp[s]);
    }

  /* Each coordinate and load may be finite and the floor's sums still overflow (1e300 psf
   * over a plan 1e300 in across): the floor is then in error, never totals of inf or NaN. */
  if (fr->error == NULL && !floor_result_finite (fr))
    fr->error = g_strdup ("the floor's loads overflow: the plan or the loads are out of any "
                          "real range");
  return fr;
}

/* ---- the project ------------------------------------------------------------------------- */

static TrbMemberResult *
solve_standalone_cached (Solver          *sv,
                         const TrbMember *member)
{
  g_autoptr(GArray) supports = NULL;
  g_autoptr(GBytes) key = NULL;
  GArray *loads[TRB_N_CASES];
  MemberInput in;
  CacheEntry *entry;
  TrbMemberResult *r;

  if (sv->cache == NULL)
    return trb_solve_priv_solve_standalone (sv->project, member, sv->options->shortlist_max,
                                            sv->options->bounds);

  supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  for (guint c = 0; c < TRB_N_CASES; c++)
    loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  trb_solve_priv_standalone_input (member, &in, supports, loads);
  in.memo = sv->memo;
  key = member_key (member, &in, sv->options->shortlist_max, NULL);
  entry = g_hash_table_lookup (sv->cache, key);
  if (entry == NULL)
    {
      entry = g_new0 (CacheEntry, 1);
      entry->result = trb_solve_priv_solve_input (sv->project, member, &in,
                                                  sv->options->shortlist_max,
                                                  sv->options->bounds);
      g_hash_table_insert (sv->cache, g_bytes_ref (key), entry);
      solver_count (sv, entry, TRUE);
    }
  else
    solver_count (sv, entry, FALSE);
  r = trb_solve_priv_member_result_share (entry->result, member);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_unref (loads[c]);
  return r;
}

/**
 * trb_solve_options_init:
 * @options: (out caller-allocates): options to fill
 *
 * The defaults: no shortlist (it is made only where it is shown), the cache and the bounds
 * on.
 */
void
trb_solve_options_init (TrbSolveOptions *options)
{
  g_return_if_fail (options != NULL);

  options->shortlist_max = 0;
  options->cache = TRUE;
  options->bounds = TRUE;
}

/* What a solve depends on besides the members' and plans' own keys: the settings, the
 * project's own sections (a catalog never changed once loaded, shared by the editor's copies
 * of a project: its address says which) and the options. */
static GBytes *
context_key (const TrbProject      *project,
             const TrbSolveOptions *options)
{
  const TrbSettings *st = &project->settings;
  Key k = { NULL, 0, 0 };
  Key *key = &k;

  key_int (key, st->method);
  key_double (key, st->fb_allow);
  key_double (key, st->fv_allow);
  key_string (key, st->steel_grade);
  key_int (key, st->self_weight);
  key_int (key, st->live_patterns);
  key_double (key, st->deflection_live);
  key_double (key, st->deflection_total);
  key_int (key, st->units);
  key_int (key, st->live_load_reduction);
  key_int (key, st->floors_above);
  key_int (key, (gint64) (guintptr) project->sections);
  key_int (key, options->shortlist_max);
  key_int (key, options->bounds);
  return g_bytes_new_take (k.data, k.len);
}

/* Entries neither this solve nor the one before read go. */
static gboolean
cache_entry_stale (gpointer key,
                   gpointer value,
                   gpointer user_data)
{
  return ((CacheEntry *) value)->used + 1 < *(guint64 *) user_data;
}

static gboolean
frame_entry_stale (gpointer key,
                   gpointer value,
                   gpointer user_data)
{
  return ((FrameEntry *) value)->used + 1 < *(guint64 *) user_data;
}

/* Solves the whole project, or only one floor's members (only_floor); with keep, reading and
 * filling that cache of earlier solves. */
TrbProjectResult *
trb_solve_priv_solve_project (const TrbProject      *project,
                              const TrbSolveOptions *options,
                              const TrbFloor        *only_floor,
                              TrbSolveCache         *keep)
{
  TrbProjectResult *pr;
  g_autoptr(GHashTable) results = g_hash_table_new (NULL, NULL);
  Solver sv = { project, options, NULL, NULL, NULL };

  if (keep != NULL && options->cache)
    {
      g_autoptr(GBytes) context = context_key (project, options);

      if (keep->context == NULL || !g_bytes_equal (keep->context, context))
        {
          g_hash_table_remove_all (keep->members);
          g_hash_table_remove_all (keep->frames);
          g_clear_pointer (&keep->context, g_bytes_unref);
          keep->context = g_steal_pointer (&context);
        }
      keep->generation++;
      keep->n_solved = keep->n_reused = keep->n_frames_new = 0;
      sv.keep = keep;
      sv.cache = keep->members;
      sv.memo = keep->memo;
    }
  else if (options->cache)
    sv.cache = g_hash_table_new_full (key_hash, g_bytes_equal,
                                      (GDestroyNotify) g_bytes_unref, cache_entry_free);
  if (sv.memo == NULL)
    sv.memo = trb_solve_priv_memo_new ();

  pr = g_new0 (TrbProjectResult, 1);
  pr->project = project;
  pr->members = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_member_result_free);
  pr->floors = g_ptr_array_new_with_free_func (floor_result_free);

  for (guint f = 0; project->floors != NULL && f < project->floors->len; f++)
    {
      const TrbFloor *floor = g_ptr_array_index (project->floors, f);

      if (only_floor != NULL && floor != only_floor)
        continue;
      g_ptr_array_add (pr->floors, solve_floor (&sv, floor, results));
    }

  for (guint i = 0; i < project->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (project->members, i);
      TrbMemberResult *r;

      if (m->floor != NULL)
        {
          r = g_hash_table_lookup (results, m);
          if (r == NULL)
            continue;   /* not of the floor asked for */
        }
      else if (only_floor != NULL)
        continue;
      else
        r = solve_standalone_cached (&sv, m);
      g_ptr_array_add (pr->members, r);
    }

  if (sv.keep != NULL)
    {
      g_hash_table_foreach_remove (keep->members, cache_entry_stale, &keep->generation);
      g_hash_table_foreach_remove (keep->frames, frame_entry_stale, &keep->generation);
    }
  else
    {
      g_clear_pointer (&sv.cache, g_hash_table_unref);
      trb_solve_priv_memo_free (sv.memo);
    }
  return pr;
}

/**
 * trb_solve_cache_new:
 *
 * A cache for trb_solve_project_cached(), kept from one solve of a project to the next.
 *
 * Returns: (transfer full): an empty cache
 */
TrbSolveCache *
trb_solve_cache_new (void)
{
  TrbSolveCache *cache = g_new0 (TrbSolveCache, 1);

  cache->members = g_hash_table_new_full (key_hash, g_bytes_equal,
                                          (GDestroyNotify) g_bytes_unref, cache_entry_free);
  cache->frames = g_hash_table_new_full (key_hash, g_bytes_equal,
                                         (GDestroyNotify) g_bytes_unref, frame_entry_free);
  cache->memo = trb_solve_priv_memo_new ();
  return cache;
}

void
trb_solve_cache_free (TrbSolveCache *cache)
{
  if (cache == NULL)
    return;
  g_clear_pointer (&cache->context, g_bytes_unref);
  g_hash_table_unref (cache->members);
  g_hash_table_unref (cache->frames);
  trb_solve_priv_memo_free (cache->memo);
  g_free (cache);
}

/**
 * trb_solve_cache_get_counts:
 * @cache: a cache
 * @solved: (out) (optional): members analysed and designed by the last solve (each distinct
 *   input once)
 * @reused: (out) (optional): distinct results the last solve took from earlier ones
 * @frames: (out) (optional): floor frames the last solve made (not taken from earlier ones)
 *
 * What the last trb_solve_project_cached() with @cache did, to show that an edit re-solves
 * only what it changed.
 */
void
trb_solve_cache_get_counts (const TrbSolveCache *cache,
                            guint               *solved,
                            guint               *reused,
                            guint               *frames)
{
  g_return_if_fail (cache != NULL);

  if (solved != NULL)
    *solved = cache->n_solved;
  if (reused != NULL)
    *reused = cache->n_reused;
  if (frames != NULL)
    *frames = cache->n_frames_new;
}

/**
 * trb_solve_project_cached:
 * @project: a project
 * @options: (nullable): how to solve; %NULL for the defaults
 * @cache: what earlier solves of this project (or of copies of it, as the editor makes them)
 *   left; used by one solve at a time
 *
 * trb_solve_project_full(), re-solving only what changed since the solves that filled @cache:
 * a member's result is taken from an earlier solve where its complete input is the same to
 * the bit (its length, supports and every load, its own and those handed down from the
 * members on it and the floor's, its live load reduction streams, its design attributes),
 * and each floor's frame where its plan is; the members below a changed one get other loads
 * handed down, so they are solved again too. The results are those of
 * trb_solve_project_full(), bit for bit. With @options->cache off, @cache is not used.
 *
 * Returns: (transfer full): every member's results in the project's order, and each floor's.
 */
TrbProjectResult *
trb_solve_project_cached (const TrbProject      *project,
                          const TrbSolveOptions *options,
                          TrbSolveCache         *cache)
{
  TrbSolveOptions defaults;

  g_return_val_if_fail (project != NULL && cache != NULL, NULL);

  if (options == NULL)
    {
      trb_solve_options_init (&defaults);
      options = &defaults;
    }
  return trb_solve_priv_solve_project (project, options, NULL, cache);
}

/**
 * trb_solve_project_full:
 * @project: a project
 * @options: (nullable): how to solve; %NULL for the defaults (trb_solve_options_init())
 *
 * Solves every member: standalone beams as they are given, each floor through its load
 * takedown (docs/takedown.md): the frame, the members from the top of the load path down, each
 * handing its reactions to what it rests on, then the column and wall loads and the totals.
 * Pure: the same project and options give bit-identical results, and the options' shortcuts
 * never change a result.
 *
 * Returns: (transfer full): every member's results in the project's order, and each floor's.
 */
TrbProjectResult *
trb_solve_project_full (const TrbProject      *project,
                        const TrbSolveOptions *options)
{
  TrbSolveOptions defaults;

  g_return_val_if_fail (project != NULL, NULL);

  if (options == NULL)
    {
      trb_solve_options_init (&defaults);
      options = &defaults;
    }
  return trb_solve_priv_solve_project (project, options, NULL, NULL);
}

/**
 * trb_solve_project:
 * @project: a project
 *
 * trb_solve_project_full() with the default options.
 *
 * Returns: (transfer full): every member's results, in the project's order, and each floor's.
 */
TrbProjectResult *
trb_solve_project (const TrbProject *project)
{
  return trb_solve_project_full (project, NULL);
}

/**
 * trb_project_result_find_member:
 * @result: a project's results
 * @member: one of its members
 *
 * Returns: (transfer none) (nullable): the member's results
 */
const TrbMemberResult *
trb_project_result_find_member (const TrbProjectResult *result,
                                const TrbMember        *member)
{
  g_return_val_if_fail (result != NULL && member != NULL, NULL);

  for (guint i = 0; i < result->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (result->members, i);

      if (r->member == member)
        return r;
    }
  return NULL;
}

void
trb_project_result_free (TrbProjectResult *result)
{
  if (result == NULL)
    return;
  g_clear_pointer (&result->members, g_ptr_array_unref);
  g_clear_pointer (&result->floors, g_ptr_array_unref);
  g_free (result);
}
