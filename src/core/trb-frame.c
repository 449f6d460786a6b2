/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-frame.h"

#include "trb-error.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#define TOL TRB_FRAME_TOLERANCE

/* Shorter than twice the tolerance, a member's two ends could bear on the same thing. */
#define MIN_LENGTH (2.0 * TOL)

/* Breakpoints closer than this (1 nm) are one: well below any drawing precision, well above
 * the rounding of coordinates of a building-sized plan. */
#define SAME_X 1e-9

typedef struct
{
  TrbFramePoint s;
  double        length;
  double        ux;
  double        uy;
} Axis;

/* A polygon in one member's coordinate: x along the member, v to its left. */
typedef struct
{
  double  *x;
  double  *v;
  guint    n;
  double   x_min, x_max, v_min, v_max;
  double   q;           /* pressure for load polygons; unused for openings */
  int      load_case;   /* -1 for openings */
} LocalPolygon;

typedef struct
{
  double lo;
  double hi;
} Interval;

struct _TrbFrame
{
  guint                 n_members;
  guint                 n_columns;
  guint                 n_walls;
  TrbFrameMemberResult *members;
  char                **member_ids;
  char                **column_ids;
  char                **wall_ids;
  GHashTable           *member_index;   /* id -> index + 1 */
  guint                *order;
  guint                 n_order;
  guint                *unassigned_points;
  guint                 n_unassigned_points;
  TrbFrameUnassigned   *unassigned_lines;
  guint                 n_unassigned_lines;
};

struct _TrbFrameTakedown
{
  const TrbFrame *frame;
  /* [member * TRB_N_CASES + case] of TrbLoad, NULL until something lands there: most
   * members of a floor (the joists) never get a load handed down, and 10,000 members times
   * the cases of empty arrays were 1.6 MB */
  GArray        **member_loads;
  double         *column_loads;   /* [column * TRB_N_CASES + case] */
  GArray        **wall_loads;     /* [wall * TRB_N_CASES + case] of TrbLoad */
};

/* ---- geometry ------------------------------------------------------------------------------ */

static void
axis_init (Axis                *axis,
           const TrbFramePoint *s,
           const TrbFramePoint *e)
{
  double dx = e->x - s->x;
  double dy = e->y - s->y;

  axis->s = *s;
  axis->length = hypot (dx, dy);
  axis->ux = axis->length > 0 ? dx / axis->length : 1.0;
  axis->uy = axis->length > 0 ? dy / axis->length : 0.0;
}

static void
axis_to_local (const Axis          *axis,
               const TrbFramePoint *p,
               double              *x,
               double              *v)
{
  double dx = p->x - axis->s.x;
  double dy = p->y - axis->s.y;

  *x = dx * axis->ux + dy * axis->uy;
  *v = -dx * axis->uy + dy * axis->ux;
}

static TrbFramePoint
axis_point (const Axis *axis,
            double      x)
{
  TrbFramePoint p = { axis->s.x + x * axis->ux, axis->s.y + x * axis->uy };

  return p;
}

/* The sine of the angle between two axes, unsigned. */
static double
axis_sin (const Axis *a,
          const Axis *b)
{
  return fabs (a->ux * b->uy - a->uy * b->ux);
}

static gboolean
axes_parallel (const Axis *a,
               const Axis *b)
{
  return axis_sin (a, b) <= sin (TRB_FRAME_PARALLEL_ANGLE);
}

/* Distance from p to the segment a-b; *t (optional) the clamped parameter of the nearest
 * point, 0 at a and 1 at b. */
static double
segment_distance (const TrbFramePoint *p,
                  const TrbFramePoint *a,
                  const TrbFramePoint *b,
                  double              *t_out)
{
  double dx = b->x - a->x;
  double dy = b->y - a->y;
  double len2 = dx * dx + dy * dy;
  double t = 0.0;

  if (len2 > 0)
    t = CLAMP (((p->x - a->x) * dx + (p->y - a->y) * dy) / len2, 0.0, 1.0);
  if (t_out != NULL)
    *t_out = t;
  return hypot (p->x - (a->x + t * dx), p->y - (a->y + t * dy));
}

static double
axis_distance (const Axis          *axis,
               const TrbFramePoint *p)
{
  TrbFramePoint e = axis_point (axis, axis->length);

  return segment_distance (p, &axis->s, &e, NULL);
}

/* The position of p's foot on the axis, clamped to the member. */
static double
axis_position (const Axis          *axis,
               const TrbFramePoint *p)
{
  double x, v;

  axis_to_local (axis, p, &x, &v);
  /* + 0.0 turns -0 (a point on the start of a member running towards -x or -y) into 0 */
  return CLAMP (x, 0.0, axis->length) + 0.0;
}

static gboolean
point_finite (const TrbFramePoint *p)
{
  return isfinite (p->x) && isfinite (p->y);
}

static int
compare_double (const void *a,
                const void *b)
{
  double x = *(const double *) a;
  double y = *(const double *) b;

  return (x > y) - (x < y);
}

/* qsort() for the few values a member has: glibc's qsort is a stable merge sort, and so is
 * this, so both give the same order (of -0 and 0 too); a call of qsort costs more than
 * sorting a handful. */
static void
sort_doubles (double *v,
              guint   n)
{
  if (n > 32)
    {
      qsort (v, n, sizeof (double), compare_double);
      return;
    }
  for (guint i = 1; i < n; i++)
    {
      double t = v[i];
      guint j = i;

      while (j > 0 && v[j - 1] > t)
        {
          v[j] = v[j - 1];
          j--;
        }
      v[j] = t;
    }
}

/* Sorts and drops values within SAME_X of the one before. */
static void
sort_unique (GArray *values)
{
  guint j = 0;

  if (values->len == 0)
    return;
  sort_doubles ((double *) values->data, values->len);
  for (guint i = 1; i < values->len; i++)
    if (g_array_index (values, double, i) - g_array_index (values, double, j) > SAME_X)
      g_array_index (values, double, ++j) = g_array_index (values, double, i);
  g_array_set_size (values, j + 1);
}

static char *
format_length (double metres)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  return g_strdup (g_ascii_formatd (buf, sizeof buf, "%.3f", metres));
}

/* ---- a uniform grid over boxes, so that "what lies near here" does not scan the plan ---- */

typedef struct
{
  double x0, y0, x1, y1;
} Box;

typedef struct
{
  double  ox, oy, cell;
  guint   nx, ny;
  guint  *start;   /* per cell, into items; nx * ny + 1 */
  guint  *items;
  guint  *stamp;   /* per item: the last query that saw it */
  guint   n_items;
  guint   query;
} Grid;

static Box
segment_box (const TrbFramePoint *a,
             const TrbFramePoint *b,
             double               margin)
{
  Box box = { MIN (a->x, b->x) - margin, MIN (a->y, b->y) - margin,
              MAX (a->x, b->x) + margin, MAX (a->y, b->y) + margin };

  return box;
}

static void
grid_cells (const Grid *grid,
            const Box  *box,
            guint      *cx0,
            guint      *cy0,
            guint      *cx1,
            guint      *cy1)
{
  double fx0 = floor ((box->x0 - grid->ox) / grid->cell);
  double fy0 = floor ((box->y0 - grid->oy) / grid->cell);
  double fx1 = floor ((box->x1 - grid->ox) / grid->cell);
  double fy1 = floor ((box->y1 - grid->oy) / grid->cell);

  *cx0 = (guint) CLAMP (fx0, 0.0, grid->nx - 1.0);
  *cy0 = (guint) CLAMP (fy0, 0.0, grid->ny - 1.0);
  *cx1 = (guint) CLAMP (fx1, 0.0, grid->nx - 1.0);
  *cy1 = (guint) CLAMP (fy1, 0.0, grid->ny - 1.0);
}

/* Cells of about the size that puts one item in each, never so many that they outnumber the
 * items by much. */
static void
grid_init (Grid      *grid,
           const Box *boxes,
           guint      n)
{
  double x0 = INFINITY, y0 = INFINITY, x1 = -INFINITY, y1 = -INFINITY;
  double w, h;
  guint n_cells;

  memset (grid, 0, sizeof *grid);
  grid->n_items = n;
  grid->stamp = g_new0 (guint, MAX (n, 1));
  for (guint i = 0; i < n; i++)
    {
      x0 = MIN (x0, boxes[i].x0);
      y0 = MIN (y0, boxes[i].y0);
      x1 = MAX (x1, boxes[i].x1);
      y1 = MAX (y1, boxes[i].y1);
    }
  if (n == 0)
    x0 = y0 = x1 = y1 = 0.0;
  w = x1 - x0;
  h = y1 - y0;
  grid->ox = x0;
  grid->oy = y0;
  grid->cell = sqrt (MAX (w * h, 1e-6) / MAX (n, 1));
  grid->cell = MAX (grid->cell, MAX (w, h) / 4096.0);
  grid->cell = MAX (grid->cell, 2.0 * TOL);
  grid->nx = (guint) floor (w / grid->cell) + 1;
  grid->ny = (guint) floor (h / grid->cell) + 1;
  n_cells = grid->nx * grid->ny;

  grid->start = g_new0 (guint, n_cells + 1);
  for (guint i = 0; i < n; i++)
    {
      guint cx0, cy0, cx1, cy1;

      grid_cells (grid, &boxes[i], &cx0, &cy0, &cx1, &cy1);
      for (guint cy = cy0; cy <= cy1; cy++)
        for (guint cx = cx0; cx <= cx1; cx++)
          grid->start[cy * grid->nx + cx + 1]++;
    }
  for (guint c = 0; c < n_cells; c++)
    grid->start[c + 1] += grid->start[c];
  grid->items = g_new (guint, MAX (grid->start[n_cells], 1));
  {
    g_autofree guint *fill = g_memdup2 (grid->start, n_cells * sizeof (guint));

    for (guint i = 0; i < n; i++)
      {
        guint cx0, cy0, cx1, cy1;

        grid_cells (grid, &boxes[i], &cx0, &cy0, &cx1, &cy1);
        for (guint cy = cy0; cy <= cy1; cy++)
          for (guint cx = cx0; cx <= cx1; cx++)
            grid->items[fill[cy * grid->nx + cx]++] = i;
      }
  }
}

static void
grid_clear (Grid *grid)
{
  g_clear_pointer (&grid->start, g_free);
  g_clear_pointer (&grid->items, g_free);
  g_clear_pointer (&grid->stamp, g_free);
}

static int
compare_guint (const void *a,
               const void *b)
{
  guint x = *(const guint *) a;
  guint y = *(const guint *) b;

  return (x > y) - (x < y);
}

/* The items whose boxes may meet the box, each once; in ascending order if asked (for what
 * must happen in plan order), else in an order fixed by the plan alone. */
static void
grid_query (Grid      *grid,
            const Box *box,
            gboolean   sorted,
            GArray    *out)
{
  guint cx0, cy0, cx1, cy1, n = 0;
  guint *items;

  g_array_set_size (out, 0);
  if (grid->n_items == 0)
    return;
  if (++grid->query == 0)
    {
      memset (grid->stamp, 0, grid->n_items * sizeof (guint));
      grid->query = 1;
    }
  /* each item at most once: room for all of them, written in place */
  g_array_set_size (out, grid->n_items);
  items = (guint *) out->data;
  grid_cells (grid, box, &cx0, &cy0, &cx1, &cy1);
  for (guint cy = cy0; cy <= cy1; cy++)
    for (guint cx = cx0; cx <= cx1; cx++)
      {
        guint c = cy * grid->nx + cx;

        for (guint k = grid->start[c]; k < grid->start[c + 1]; k++)
          {
            guint i = grid->items[k];

            if (grid->stamp[i] != grid->query)
              {
                grid->stamp[i] = grid->query;
                items[n++] = i;
              }
          }
      }
  g_array_set_size (out, n);
  if (sorted && n > 32)
    qsort (items, n, sizeof (guint), compare_guint);
  else if (sorted)
    for (guint i = 1; i < n; i++)
      {
        guint t = items[i];
        guint j = i;

        while (j > 0 && items[j - 1] > t)
          {
            items[j] = items[j - 1];
            j--;
          }
        items[j] = t;
      }
}

/* Whether the box takes in every cell of the grid. */
static gboolean
grid_covered (const Grid *grid,
              const Box  *box)
{
  return box->x0 <= grid->ox && box->y0 <= grid->oy &&
         box->x1 >= grid->ox + grid->nx * grid->cell &&
         box->y1 >= grid->oy + grid->ny * grid->cell;
}

/* What the passes over the plan share. */
typedef struct
{
  const TrbFramePlan *plan;
  const Axis         *axes;
  Grid                members;
  Grid                columns;
  Grid                wall_segments;
  guint              *segment_wall;    /* per wall segment: its wall */
  guint              *segment_index;   /* per wall segment: its index in the wall */
  GArray             *found;           /* scratch for queries */
} Context;

static void
context_init (Context            *ctx,
              const TrbFramePlan *plan,
              const Axis         *axes)
{
  g_autofree Box *boxes = NULL;
  guint n_segments = 0, k = 0;

  ctx->plan = plan;
  ctx->axes = axes;
  ctx->found = g_array_new (FALSE, FALSE, sizeof (guint));

  boxes = g_new (Box, MAX (plan->n_members, 1));
  for (guint m = 0; m < plan->n_members; m++)
    boxes[m] = segment_box (&plan->members[m].start, &plan->members[m].end, 0.0);
  grid_init (&ctx->members, boxes, plan->n_members);
  g_free (boxes);

  boxes = g_new (Box, MAX (plan->n_columns, 1));
  for (guint c = 0; c < plan->n_columns; c++)
    {
      TrbFramePoint p = { plan->columns[c].x, plan->columns[c].y };

      boxes[c] = segment_box (&p, &p, 0.0);
    }
  grid_init (&ctx->columns, boxes, plan->n_columns);
  g_free (boxes);

  for (guint w = 0; w < plan->n_walls; w++)
    n_segments += plan->walls[w].n_points - 1;
  boxes = g_new (Box, MAX (n_segments, 1));
  ctx->segment_wall = g_new (guint, MAX (n_segments, 1));
  ctx->segment_index = g_new (guint, MAX (n_segments, 1));
  for (guint w = 0; w < plan->n_walls; w++)
    for (guint i = 0; i + 1 < plan->walls[w].n_points; i++, k++)
      {
        boxes[k] = segment_box (&plan->walls[w].points[i], &plan->walls[w].points[i + 1], 0.0);
        ctx->segment_wall[k] = w;
        ctx->segment_index[k] = i;
      }
  grid_init (&ctx->wall_segments, boxes, n_segments);
}

static void
context_clear (Context *ctx)
{
  grid_clear (&ctx->members);
  grid_clear (&ctx->columns);
  grid_clear (&ctx->wall_segments);
  g_clear_pointer (&ctx->segment_wall, g_free);
  g_clear_pointer (&ctx->segment_index, g_free);
  g_clear_pointer (&ctx->found, g_array_unref);
}

/* ---- validation ---------------------------------------------------------------------------- */

static gboolean
check_id (const char  *id,
          const char  *what,
          guint        index,
          GHashTable  *seen,
          GError     **error)
{
  if (id == NULL || *id == '\0')
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "%s %u has no id", what, index + 1);
      return FALSE;
    }
  if (g_hash_table_contains (seen, id))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "%s id “%s” is used twice", what, id);
      return FALSE;
    }
  g_hash_table_add (seen, (gpointer) id);
  return TRUE;
}

static gboolean
check_points (const TrbFramePoint *points,
              guint                n_points,
              guint                min_points,
              const char          *what,
              GError             **error)
{
  if (n_points < min_points || points == NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "%s needs at least %u points, has %u", what, min_points, n_points);
      return FALSE;
    }
  for (guint i = 0; i < n_points; i++)
    if (!point_finite (&points[i]))
      {
        g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                     "%s: point %u is not a finite coordinate", what, i + 1);
        return FALSE;
      }
  return TRUE;
}

static gboolean
check_case (TrbLoadCase  load_case,
            double       value,
            const char  *what,
            GError     **error)
{
  if ((int) load_case < 0 || load_case >= TRB_N_CASES)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "%s has no valid load case", what);
      return FALSE;
    }
  if (!isfinite (value))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "%s has a value that is not finite",
                   what);
      return FALSE;
    }
  return TRUE;
}

static gboolean
validate_plan (const TrbFramePlan  *plan,
               GError             **error)
{
  g_autoptr(GHashTable) columns = g_hash_table_new (g_str_hash, g_str_equal);
  g_autoptr(GHashTable) walls = g_hash_table_new (g_str_hash, g_str_equal);
  g_autoptr(GHashTable) members = g_hash_table_new (g_str_hash, g_str_equal);

  for (guint i = 0; i < plan->n_columns; i++)
    {
      const TrbFrameColumn *c = &plan->columns[i];
      TrbFramePoint p = { c->x, c->y };

      if (!check_id (c->id, "column", i, columns, error))
        return FALSE;
      if (!point_finite (&p))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "column %s: position is not a finite coordinate", c->id);
          return FALSE;
        }
    }

  for (guint i = 0; i < plan->n_walls; i++)
    {
      const TrbFrameWall *w = &plan->walls[i];
      g_autofree char *what = NULL;

      if (!check_id (w->id, "wall", i, walls, error))
        return FALSE;
      what = g_strdup_printf ("wall %s", w->id);
      if (!check_points (w->points, w->n_points, 2, what, error))
        return FALSE;
    }

  for (guint i = 0; i < plan->n_members; i++)
    {
      const TrbFrameMember *m = &plan->members[i];
      Axis axis;

      if (!check_id (m->id, "member", i, members, error))
        return FALSE;
      if (!point_finite (&m->start) || !point_finite (&m->end))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "member %s: an end is not a finite coordinate", m->id);
          return FALSE;
        }
      axis_init (&axis, &m->start, &m->end);
      if (!(axis.length >= MIN_LENGTH))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "member %s is shorter than 50 mm", m->id);
          return FALSE;
        }
      if (m->n_bearing_points > 0 && m->bearing_points == NULL)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "member %s: bearing points are missing", m->id);
          return FALSE;
        }
      for (guint k = 0; k < m->n_bearing_points; k++)
        {
          const TrbFramePoint *p = &m->bearing_points[k];

          if (!point_finite (p) || axis_distance (&axis, p) > TOL)
            {
              g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                           "member %s: bearing point %u is not on the member", m->id, k + 1);
              return FALSE;
            }
        }
    }

  for (guint i = 0; i < plan->n_area_loads; i++)
    {
      const TrbFrameAreaLoad *a = &plan->area_loads[i];
      g_autofree char *what = g_strdup_printf ("area load %u", i + 1);

      if (!check_case (a->load_case, a->pressure, what, error) ||
          !check_points (a->points, a->n_points, 3, what, error))
        return FALSE;
    }

  for (guint i = 0; i < plan->n_openings; i++)
    {
      const TrbFrameOpening *o = &plan->openings[i];
      g_autofree char *what = g_strdup_printf ("opening %u", i + 1);

      if (!check_points (o->points, o->n_points, 3, what, error))
        return FALSE;
    }

  for (guint i = 0; i < plan->n_line_loads; i++)
    {
      const TrbFrameLineLoad *l = &plan->line_loads[i];
      g_autofree char *what = g_strdup_printf ("line load %u", i + 1);

      if (!check_case (l->load_case, l->w, what, error) ||
          !check_points (l->points, l->n_points, 2, what, error))
        return FALSE;
    }

  for (guint i = 0; i < plan->n_point_loads; i++)
    {
      const TrbFramePointLoad *p = &plan->point_loads[i];
      TrbFramePoint at = { p->x, p->y };
      g_autofree char *what = g_strdup_printf ("point load %u", i + 1);

      if (!check_case (p->load_case, p->P, what, error))
        return FALSE;
      if (!point_finite (&at))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "%s: position is not a finite coordinate", what);
          return FALSE;
        }
    }

  return TRUE;
}

/* ---- supports ------------------------------------------------------------------------------ */

typedef struct
{
  double         x;         /* along the member, clamped to it */
  TrbBearingKind kind;      /* also the priority: column, then wall, then member */
  double         dist;      /* from the member's axis point to what it rests on */
  guint          index;
  guint          segment;   /* walls: which segment */
} Candidate;

static int
compare_candidates (const void *pa,
                    const void *pb)
{
  const Candidate *a = pa;
  const Candidate *b = pb;

  if (a->x != b->x)
    return a->x < b->x ? -1 : 1;
  if (a->kind != b->kind)
    return a->kind < b->kind ? -1 : 1;
  if (a->dist != b->dist)
    return a->dist < b->dist ? -1 : 1;
  if (a->index != b->index)
    return a->index < b->index ? -1 : 1;
  return (a->segment > b->segment) - (a->segment < b->segment);
}

/* A is a better thing to rest on than B. */
static gboolean
candidate_better (const Candidate *a,
                  const Candidate *b)
{
  if (a->kind != b->kind)
    return a->kind < b->kind;
  if (a->dist != b->dist)
    return a->dist < b->dist;
  if (a->index != b->index)
    return a->index < b->index;
  return a->segment < b->segment;
}

static void
add_candidate (GArray         *candidates,
               double          x,
               double          length,
               TrbBearingKind  kind,
               double          dist,
               guint           index,
               guint           segment)
{
  Candidate c = { CLAMP (x, 0.0, length) + 0.0, kind, dist, index, segment };

  g_array_append_val (candidates, c);
}

static double
wall_position (const TrbFrameWall  *wall,
               guint                segment,
               const TrbFramePoint *p)
{
  double along = 0.0;
  double t;

  for (guint k = 0; k < segment; k++)
    along += hypot (wall->points[k + 1].x - wall->points[k].x,
                    wall->points[k + 1].y - wall->points[k].y);
  segment_distance (p, &wall->points[segment], &wall->points[segment + 1], &t);
  return along + t * hypot (wall->points[segment + 1].x - wall->points[segment].x,
                            wall->points[segment + 1].y - wall->points[segment].y);
}

static void
collect_candidates (Context *ctx,
                    guint    m,
                    GArray  *candidates)
{
  const TrbFramePlan *plan = ctx->plan;
  const Axis *axes = ctx->axes;
  const TrbFrameMember *member = &plan->members[m];
  const Axis *axis = &axes[m];
  double L = axis->length;
  TrbFramePoint ends[2] = { member->start, member->end };
  Box near = segment_box (&member->start, &member->end, TOL);

  /* columns under the member anywhere along it, ends included */
  grid_query (&ctx->columns, &near, TRUE, ctx->found);
  for (guint f = 0; f < ctx->found->len; f++)
    {
      guint c = g_array_index (ctx->found, guint, f);
      TrbFramePoint p = { plan->columns[c].x, plan->columns[c].y };
      double d = axis_distance (axis, &p);

      if (d <= TOL)
        {
          double x, v;

          axis_to_local (axis, &p, &x, &v);
          add_candidate (candidates, x, L, TRB_BEARING_COLUMN, d, c, 0);
        }
    }

  /* walls: an end on a wall, or the member passing over one */
  grid_query (&ctx->wall_segments, &near, TRUE, ctx->found);
  for (guint f = 0; f < ctx->found->len; f++)
    {
      guint ws = g_array_index (ctx->found, guint, f);
      guint w = ctx->segment_wall[ws];
      guint k = ctx->segment_index[ws];
      const TrbFramePoint *p = &plan->walls[w].points[k];
      const TrbFramePoint *q = &plan->walls[w].points[k + 1];
      double seg = hypot (q->x - p->x, q->y - p->y);
      double xp, vp, xq, vq;

      if (seg <= 0)
        continue;

      for (guint e = 0; e < 2; e++)
        {
          double d = segment_distance (&ends[e], p, q, NULL);

          if (d <= TOL)
            add_candidate (candidates, e == 0 ? 0.0 : L, L, TRB_BEARING_WALL, d, w, k);
        }

      /* a wall running along the member carries it only where an end lies on it */
      axis_to_local (axis, p, &xp, &vp);
      axis_to_local (axis, q, &xq, &vq);
      if (fabs (vp - vq) > seg * sin (TRB_FRAME_PARALLEL_ANGLE))
        {
          double t = vp / (vp - vq);
          double x = xp + t * (xq - xp);

          if (t >= -TOL / seg && t <= 1.0 + TOL / seg && x >= -TOL && x <= L + TOL)
            add_candidate (candidates, x, L, TRB_BEARING_WALL, 0.0, w, k);
        }
    }

  /* other members: only where an end, or a listed bearing point, lies on their line */
  for (guint k = 0; k < 2 + member->n_bearing_points; k++)
    {
      const TrbFramePoint *p = k < 2 ? &ends[k] : &member->bearing_points[k - 2];
      double x = k == 0 ? 0.0 : k == 1 ? L : axis_position (axis, p);
      Box box = segment_box (p, p, TOL);

      grid_query (&ctx->members, &box, TRUE, ctx->found);
      for (guint f = 0; f < ctx->found->len; f++)
        {
          guint n = g_array_index (ctx->found, guint, f);
          double d;

          if (n == m || axes_parallel (axis, &axes[n]))
            continue;
          d = axis_distance (&axes[n], p);
          if (d <= TOL)
            add_candidate (candidates, x, L, TRB_BEARING_MEMBER, d, n, 0);
        }
    }
}

/* Candidates within the tolerance of each other make one support; the best of them is what
 * the member rests on there. A support within the tolerance of an end is at the end. */
static void
find_supports (Context              *ctx,
               guint                 m,
               TrbFrame             *frame,
               TrbFrameMemberResult *out)
{
  const TrbFramePlan *plan = ctx->plan;
  const Axis *axes = ctx->axes;
  const Axis *axis = &axes[m];
  double L = axis->length;
  g_autoptr(GArray) candidates = g_array_new (FALSE, FALSE, sizeof (Candidate));
  g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  g_autoptr(GArray) bearings = g_array_new (FALSE, FALSE, sizeof (TrbBearing));
  const TrbFrameMember *member = &plan->members[m];
  guint i = 0;

  collect_candidates (ctx, m, candidates);
  /* an empty GArray's data may be NULL, which qsort must not be given */
  if (candidates->len > 1)
    qsort (candidates->data, candidates->len, sizeof (Candidate), compare_candidates);

  while (i < candidates->len)
    {
      const Candidate *first = &g_array_index (candidates, Candidate, i);
      const Candidate *best = first;
      double x_max = first->x;
      guint j = i + 1;
      TrbSupport support;
      TrbBearing bearing;

      while (j < candidates->len && g_array_index (candidates, Candidate, j).x - first->x <= TOL)
        {
          const Candidate *c = &g_array_index (candidates, Candidate, j);

          if (candidate_better (c, best))
            best = c;
          x_max = c->x;
          j++;
        }

      support.type = TRB_SUPPORT_PIN;
      if (first->x <= TOL)
        support.x = 0.0;
      else if (x_max >= L - TOL)
        support.x = L;
      else
        support.x = best->x;

      bearing.kind = best->kind;
      bearing.index = best->index;
      bearing.point = axis_point (axis, support.x);
      switch (best->kind)
        {
        case TRB_BEARING_COLUMN:
          bearing.id = frame->column_ids[best->index];
          bearing.position = 0.0;
          break;
        case TRB_BEARING_WALL:
          bearing.id = frame->wall_ids[best->index];
          bearing.position = wall_position (&plan->walls[best->index], best->segment,
                                            &bearing.point);
          break;
        case TRB_BEARING_MEMBER:
        default:
          bearing.id = frame->member_ids[best->index];
          bearing.position = axis_position (&axes[best->index], &bearing.point);
          break;
        }

      /* two clusters snapped to the same end are one support */
      if (supports->len > 0 &&
          g_array_index (supports, TrbSupport, supports->len - 1).x == support.x)
        {
          TrbBearing *last = &g_array_index (bearings, TrbBearing, bearings->len - 1);

          if (bearing.kind < last->kind)
            *last = bearing;
        }
      else
        {
          g_array_append_val (supports, support);
          g_array_append_val (bearings, bearing);
        }
      i = j;
    }

  /* a listed bearing point with nothing under it is worth a word, not a failure */
  for (guint k = 0; k < member->n_bearing_points; k++)
    {
      double x = axis_position (axis, &member->bearing_points[k]);
      gboolean found = FALSE;

      for (guint s = 0; s < supports->len && !found; s++)
        found = fabs (g_array_index (supports, TrbSupport, s).x - x) <= TOL;
      if (!found && out->note == NULL)
        {
          g_autofree char *at = format_length (x);

          out->note = g_strdup_printf ("bearing point %u (x = %s m) rests on no member",
                                       k + 1, at);
        }
    }

  /* the supports and their bearings in one block of their exact size (two arrays grown by
   * doubling were 0.6 MB more on 10,000 members, in a frame the editor keeps) */
  out->n_supports = supports->len;
  if (supports->len > 0)
    {
      gsize ss = supports->len * sizeof (TrbSupport);
      guint8 *block = g_malloc (ss + bearings->len * sizeof (TrbBearing));

      G_STATIC_ASSERT (sizeof (TrbSupport) % G_ALIGNOF (TrbBearing) == 0);
      memcpy (block, supports->data, ss);
      memcpy (block + ss, bearings->data, bearings->len * sizeof (TrbBearing));
      out->supports = (const TrbSupport *) block;
      out->bearings = (const TrbBearing *) (block + ss);
    }
}

/* ---- bearing order ------------------------------------------------------------------------- */

/* Strongly connected components of the graph "m bears on n" (Tarjan, without recursion so a
 * long chain cannot exhaust the stack). Components come out in reverse topological order:
 * a member's component after those of everything it bears on. */
typedef struct
{
  guint node;
  guint edge;
} Frame;

static void
bearing_components (const TrbFrame *frame,
                    guint          *comp_of,      /* per node: component number */
                    GArray         *comp_nodes,   /* nodes in component order */
                    GArray         *comp_start)   /* start of each component, plus the end */
{
  guint n = frame->n_members;
  g_autofree guint *index = g_new (guint, n);
  g_autofree guint *low = g_new (guint, n);
  g_autofree gboolean *on_stack = g_new0 (gboolean, n);
  g_autoptr(GArray) stack = g_array_new (FALSE, FALSE, sizeof (guint));
  g_autoptr(GArray) calls = g_array_new (FALSE, FALSE, sizeof (Frame));
  guint counter = 0;
  guint n_comps = 0;

  for (guint i = 0; i < n; i++)
    index[i] = G_MAXUINT;

  for (guint root = 0; root < n; root++)
    {
      Frame f = { root, 0 };

      if (index[root] != G_MAXUINT)
        continue;

      index[root] = low[root] = counter++;
      g_array_append_val (stack, root);
      on_stack[root] = TRUE;
      g_array_append_val (calls, f);

      while (calls->len > 0)
        {
          Frame *top = &g_array_index (calls, Frame, calls->len - 1);
          guint v = top->node;
          const TrbFrameMemberResult *mv = &frame->members[v];

          /* the next member this one bears on */
          while (top->edge < mv->n_supports && mv->bearings[top->edge].kind != TRB_BEARING_MEMBER)
            top->edge++;

          if (top->edge < mv->n_supports)
            {
              guint w = mv->bearings[top->edge].index;

              top->edge++;
              if (index[w] == G_MAXUINT)
                {
                  Frame g = { w, 0 };

                  index[w] = low[w] = counter++;
                  g_array_append_val (stack, w);
                  on_stack[w] = TRUE;
                  g_array_append_val (calls, g);
                }
              else if (on_stack[w])
                low[v] = MIN (low[v], index[w]);
              continue;
            }

          g_array_set_size (calls, calls->len - 1);
          if (low[v] == index[v])
            {
              guint start = comp_nodes->len;
              guint w;

              do
                {
                  w = g_array_index (stack, guint, stack->len - 1);
                  g_array_set_size (stack, stack->len - 1);
                  on_stack[w] = FALSE;
                  comp_of[w] = n_comps;
                  g_array_append_val (comp_nodes, w);
                }
              while (w != v);
              g_array_append_val (comp_start, start);
              n_comps++;
            }
          if (calls->len > 0)
            {
              guint u = g_array_index (calls, Frame, calls->len - 1).node;

              low[u] = MIN (low[u], low[v]);
            }
        }
    }

  g_array_append_val (comp_start, comp_nodes->len);
}

static void
order_members (TrbFrame *frame)
{
  guint n = frame->n_members;
  g_autofree guint *comp_of = g_new0 (guint, n);
  g_autoptr(GArray) comp_nodes = g_array_new (FALSE, FALSE, sizeof (guint));
  g_autoptr(GArray) comp_start = g_array_new (FALSE, FALSE, sizeof (guint));
  g_autoptr(GArray) order = g_array_new (FALSE, FALSE, sizeof (guint));
  guint n_comps;

  bearing_components (frame, comp_of, comp_nodes, comp_start);
  n_comps = comp_start->len - 1;

  /* statuses, supporters first: what a member rests on is settled before the member */
  for (guint c = 0; c < n_comps; c++)
    {
      guint start = g_array_index (comp_start, guint, c);
      guint end = g_array_index (comp_start, guint, c + 1);
      guint *nodes = &g_array_index (comp_nodes, guint, start);

      if (end - start > 1)
        {
          g_autofree guint *sorted = g_memdup2 (nodes, (end - start) * sizeof (guint));
          g_autoptr(GString) names = g_string_new (NULL);

          qsort (sorted, end - start, sizeof (guint), compare_guint);
          for (guint k = 0; k < end - start; k++)
            g_string_append_printf (names, "%s%s", k > 0 ? ", " : "",
                                    frame->member_ids[sorted[k]]);
          for (guint k = start; k < end; k++)
            {
              TrbFrameMemberResult *r = &frame->members[g_array_index (comp_nodes, guint, k)];

              r->status = TRB_FRAME_IN_CYCLE;
              r->reason = g_strdup_printf ("in a bearing cycle: %s each rest on another of them",
                                           names->str);
            }
          continue;
        }

      {
        TrbFrameMemberResult *r = &frame->members[nodes[0]];

        r->status = TRB_FRAME_UNSUPPORTED;
        if (r->n_supports == 0)
          r->reason = g_strdup ("no support: nothing lies under it");
        else if (r->n_supports == 1)
          r->reason = g_strdup ("one support only: it is a mechanism");
        else
          {
            r->status = TRB_FRAME_SUPPORTED;
            for (guint s = 0; s < r->n_supports; s++)
              {
                const TrbBearing *b = &r->bearings[s];

                if (b->kind == TRB_BEARING_MEMBER &&
                    frame->members[b->index].status != TRB_FRAME_SUPPORTED)
                  {
                    r->status = TRB_FRAME_UNSUPPORTED;
                    r->reason = g_strdup_printf ("bears on member %s, which is %s", b->id,
                                                 frame->members[b->index].status ==
                                                 TRB_FRAME_IN_CYCLE ?
                                                 "in a bearing cycle" : "unsupported");
                    break;
                  }
              }
          }
      }
    }

  /* every member after all those bearing on it; members of a cycle have no place */
  for (guint c = n_comps; c-- > 0;)
    {
      guint start = g_array_index (comp_start, guint, c);
      guint end = g_array_index (comp_start, guint, c + 1);

      if (end - start == 1)
        g_array_append_val (order, g_array_index (comp_nodes, guint, start));
    }

  frame->n_order = order->len;
  frame->order = (guint *) g_array_free (g_steal_pointer (&order), FALSE);
}

/* ---- tributary strips ---------------------------------------------------------------------- */

typedef struct
{
  double x0, v0, x1, v1;   /* the neighbour's ends in this member's coordinate, x0 <= x1 */
  double a, b;             /* the overlap with this member */
} Neighbour;

static double
neighbour_offset (const Neighbour *nb,
                  double           x)
{
  if (nb->x1 - nb->x0 <= 0)
    return nb->v0;
  return nb->v0 + (x - nb->x0) * (nb->v1 - nb->v0) / (nb->x1 - nb->x0);
}

static void
strips_from (const Context *ctx,
             guint          m,
             const GArray  *found,
             GArray        *strips)
{
  const TrbFramePlan *plan = ctx->plan;
  const Axis *axes = ctx->axes;
  const Axis *axis = &axes[m];
  double L = axis->length;
  g_autoptr(GArray) breaks = g_array_sized_new (FALSE, FALSE, sizeof (double),
                                                2 * found->len + 2);
  g_autofree Neighbour *neighbour = g_new (Neighbour, found->len + 1);
  double *brk = (double *) breaks->data;
  guint n_nb = 0, n_brk = 0;

  g_array_set_size (strips, 0);
  for (guint f = 0; f < found->len; f++)
    {
      guint n = g_array_index (found, guint, f);
      Neighbour nb;
      double mid;

      if (n == m || !plan->members[n].carries_deck || !axes_parallel (axis, &axes[n]))
        continue;
      axis_to_local (axis, &plan->members[n].start, &nb.x0, &nb.v0);
      axis_to_local (axis, &plan->members[n].end, &nb.x1, &nb.v1);
      if (nb.x0 > nb.x1)
        {
          double t;

          t = nb.x0, nb.x0 = nb.x1, nb.x1 = t;
          t = nb.v0, nb.v0 = nb.v1, nb.v1 = t;
        }
      nb.a = MAX (nb.x0, 0.0);
      nb.b = MIN (nb.x1, L);
      if (nb.b - nb.a <= TOL)
        continue;
      /* a member in line with this one bounds nothing */
      mid = neighbour_offset (&nb, 0.5 * (nb.a + nb.b));
      if (fabs (mid) <= TOL)
        continue;
      neighbour[n_nb++] = nb;
      /* most neighbours span the same stretch: a value already there adds nothing once
       * sorted (sort_unique() keeps the first of equal values) */
      for (guint e = 0; e < 2; e++)
        {
          double x = e == 0 ? nb.a : nb.b;
          guint k = 0;

          while (k < n_brk && brk[k] != x)
            k++;
          if (k == n_brk)
            brk[n_brk++] = x;
        }
    }

  brk[n_brk++] = 0.0;
  brk[n_brk++] = L;
  g_array_set_size (breaks, n_brk);
  sort_unique (breaks);

  for (guint i = 0; i + 1 < breaks->len; i++)
    {
      double a = g_array_index (breaks, double, i);
      double b = g_array_index (breaks, double, i + 1);
      double mid = 0.5 * (a + b);
      TrbFrameStrip strip = { a, b, INFINITY, INFINITY };

      if (a < 0.0 || b > L)
        continue;
      for (guint k = 0; k < n_nb; k++)
        {
          const Neighbour *nb = &neighbour[k];
          double v;

          if (mid < nb->a || mid > nb->b)
            continue;
          v = neighbour_offset (nb, mid);
          if (v > 0)
            strip.left = MIN (strip.left, 0.5 * v);
          else
            strip.right = MIN (strip.right, -0.5 * v);
        }

      if (strips->len > 0)
        {
          TrbFrameStrip *last = &g_array_index (strips, TrbFrameStrip, strips->len - 1);

          if (last->left == strip.left && last->right == strip.right)
            {
              last->b = b;
              continue;
            }
        }
      g_array_append_val (strips, strip);
    }
}

/* The strip looks for neighbours within a distance R of the member, widening R until each
 * side of each piece has one within R (a nearer one cannot have been missed), or R/2 reaches
 * past every area load on that side (a neighbour farther off changes no load: the strip runs
 * out to the loads' edge), or R takes in the whole plan. */
static void
find_strips (Context              *ctx,
             guint                 m,
             TrbFrameMemberResult *out)
{
  const TrbFramePlan *plan = ctx->plan;
  const TrbFrameMember *member = &plan->members[m];
  g_autoptr(GArray) strips = g_array_new (FALSE, FALSE, sizeof (TrbFrameStrip));
  double R = MAX (4.0 * ctx->members.cell, 1.0);
  double reach_left = 0.0, reach_right = 0.0;

  for (guint i = 0; i < plan->n_area_loads; i++)
    for (guint k = 0; k < plan->area_loads[i].n_points; k++)
      {
        double x, v;

        axis_to_local (&ctx->axes[m], &plan->area_loads[i].points[k], &x, &v);
        reach_left = MAX (reach_left, v);
        reach_right = MAX (reach_right, -v);
      }

  for (;;)
    {
      Box box = segment_box (&member->start, &member->end, R);
      gboolean whole = grid_covered (&ctx->members, &box);
      gboolean bounded = TRUE;

      grid_query (&ctx->members, &box, FALSE, ctx->found);
      strips_from (ctx, m, ctx->found, strips);
      for (guint k = 0; k < strips->len && bounded; k++)
        {
          const TrbFrameStrip *s = &g_array_index (strips, TrbFrameStrip, k);

          bounded = (s->left <= 0.5 * R || reach_left <= 0.5 * R) &&
                    (s->right <= 0.5 * R || reach_right <= 0.5 * R);
        }
      if (bounded || whole)
        break;
      R *= 4.0;
    }

  /* past the loads' reach a side is open, whatever lies beyond: the same strip for the same
   * loads however far the search went */
  {
    guint j = 0;

    for (guint k = 0; k < strips->len; k++)
      {
        TrbFrameStrip *s = &g_array_index (strips, TrbFrameStrip, k);
        TrbFrameStrip *last = &g_array_index (strips, TrbFrameStrip, j);

        if (s->left >= reach_left)
          s->left = INFINITY;
        if (s->right >= reach_right)
          s->right = INFINITY;
        if (k > 0 && last->left == s->left && last->right == s->right)
          last->b = s->b;
        else if (k > 0)
          g_array_index (strips, TrbFrameStrip, ++j) = *s;
      }
    if (strips->len > 0)
      g_array_set_size (strips, j + 1);
  }

  out->n_strips = strips->len;
  out->strips = (const TrbFrameStrip *) g_array_free (g_steal_pointer (&strips), FALSE);
}

/* ---- area loads over a strip --------------------------------------------------------------- */

/* x and v take 2 n doubles of room the caller keeps */
static void
local_polygon_init (LocalPolygon        *poly,
                    const Axis          *axis,
                    const TrbFramePoint *points,
                    guint                n,
                    double               q,
                    int                  load_case,
                    double              *room)
{
  poly->x = room;
  poly->v = room + n;
  poly->n = n;
  poly->q = q;
  poly->load_case = load_case;
  poly->x_min = poly->v_min = INFINITY;
  poly->x_max = poly->v_max = -INFINITY;
  for (guint i = 0; i < n; i++)
    {
      axis_to_local (axis, &points[i], &poly->x[i], &poly->v[i]);
      poly->x_min = MIN (poly->x_min, poly->x[i]);
      poly->x_max = MAX (poly->x_max, poly->x[i]);
      poly->v_min = MIN (poly->v_min, poly->v[i]);
      poly->v_max = MAX (poly->v_max, poly->v[i]);
    }
}

static gboolean
local_polygon_meets (const LocalPolygon *poly,
                     double              a,
                     double              b,
                     double              lo,
                     double              hi)
{
  return poly->x_max > a && poly->x_min < b && poly->v_max > lo && poly->v_min < hi;
}

/* The stretches of the line x = const inside the polygon (even-odd rule), sorted. x is never
 * a vertex's x: the callers sample strictly between breakpoints. */
static void
polygon_chords (const LocalPolygon *poly,
                double              x,
                GArray             *crossings)
{
  g_array_set_size (crossings, 0);
  for (guint i = 0; i < poly->n; i++)
    {
      guint j = (i + 1) % poly->n;
      double xi = poly->x[i], xj = poly->x[j];

      if ((xi <= x) != (xj <= x))
        {
          double v = poly->v[i] + (x - xi) * (poly->v[j] - poly->v[i]) / (xj - xi);

          g_array_append_val (crossings, v);
        }
    }
  sort_doubles ((double *) crossings->data, crossings->len);
}

/* The union of the openings' chords at x, clipped to [lo, hi], as disjoint sorted intervals. */
static void
holes_at (const LocalPolygon *openings,
          guint               n_openings,
          const gboolean     *relevant,
          double              x,
          double              lo,
          double              hi,
          GArray             *crossings,
          GArray             *holes)
{
  guint j = 0;

  g_array_set_size (holes, 0);
  for (guint o = 0; o < n_openings; o++)
    {
      if (!relevant[o])
        continue;
      polygon_chords (&openings[o], x, crossings);
      for (guint k = 0; k + 1 < crossings->len; k += 2)
        {
          Interval iv = { MAX (g_array_index (crossings, double, k), lo),
                          MIN (g_array_index (crossings, double, k + 1), hi) };

          if (iv.hi > iv.lo)
            g_array_append_val (holes, iv);
        }
    }
  if (holes->len == 0)
    return;

  /* sort by start and merge overlaps; few intervals, insertion sort keeps it plain */
  for (guint i = 1; i < holes->len; i++)
    {
      Interval t = g_array_index (holes, Interval, i);
      guint k = i;

      while (k > 0 && g_array_index (holes, Interval, k - 1).lo > t.lo)
        {
          g_array_index (holes, Interval, k) = g_array_index (holes, Interval, k - 1);
          k--;
        }
      g_array_index (holes, Interval, k) = t;
    }
  for (guint i = 1; i < holes->len; i++)
    {
      Interval *last = &g_array_index (holes, Interval, j);
      Interval *iv = &g_array_index (holes, Interval, i);

      if (iv->lo <= last->hi)
        last->hi = MAX (last->hi, iv->hi);
      else
        g_array_index (holes, Interval, ++j) = *iv;
    }
  g_array_set_size (holes, j + 1);
}

/* Width of (polygon ∩ band [lo, hi]) minus the holes, at x. */
static double
polygon_width (const LocalPolygon *poly,
               double              x,
               double              lo,
               double              hi,
               const GArray       *holes,
               GArray             *crossings)
{
  double width = 0.0;

  polygon_chords (poly, x, crossings);
  for (guint k = 0; k + 1 < crossings->len; k += 2)
    {
      double c0 = MAX (g_array_index (crossings, double, k), lo);
      double c1 = MIN (g_array_index (crossings, double, k + 1), hi);

      if (c1 <= c0)
        continue;
      width += c1 - c0;
      for (guint h = 0; h < holes->len; h++)
        {
          const Interval *iv = &g_array_index (holes, Interval, h);
          double o0 = MAX (c0, iv->lo);
          double o1 = MIN (c1, iv->hi);

          if (o1 > o0)
            width -= o1 - o0;
        }
    }
  return width;
}

/* Where the polygon's edges cross the lines v = lo and v = hi, and one another: between two
 * consecutive such x, and the vertices, every chord end moves linearly with x, so the loaded
 * width is linear there. */
static void
edge_breaks (const LocalPolygon **polys,
             guint                n_polys,
             double               lo,
             double               hi,
             double               a,
             double               b,
             GArray              *breaks)
{
  for (guint p = 0; p < n_polys; p++)
    {
      const LocalPolygon *P = polys[p];

      for (guint i = 0; i < P->n; i++)
        {
          guint j = (i + 1) % P->n;
          double xi = P->x[i], vi = P->v[i], xj = P->x[j], vj = P->v[j];
          double lines[2] = { lo, hi };

          if (xi > a && xi < b)
            g_array_append_val (breaks, xi);

          for (guint k = 0; k < 2; k++)
            {
              double c = lines[k];

              if (isfinite (c) && (vi < c) != (vj < c) && vi != vj)
                {
                  double x = xi + (c - vi) * (xj - xi) / (vj - vi);

                  if (x > a && x < b)
                    g_array_append_val (breaks, x);
                }
            }

          for (guint p2 = p; p2 < n_polys; p2++)
            {
              const LocalPolygon *Q = polys[p2];

              for (guint i2 = (p2 == p ? i + 1 : 0); i2 < Q->n; i2++)
                {
                  guint j2 = (i2 + 1) % Q->n;
                  double ex = xj - xi, ev = vj - vi;
                  double fx = Q->x[j2] - Q->x[i2], fv = Q->v[j2] - Q->v[i2];
                  double den = ex * fv - ev * fx;
                  double s, t;

                  if (den == 0.0)
                    continue;
                  s = ((Q->x[i2] - xi) * fv - (Q->v[i2] - vi) * fx) / den;
                  t = ((Q->x[i2] - xi) * ev - (Q->v[i2] - vi) * ex) / den;
                  if (s > 0.0 && s < 1.0 && t > 0.0 && t < 1.0)
                    {
                      double x = xi + s * ex;

                      if (x > a && x < b)
                        g_array_append_val (breaks, x);
                    }
                }
            }
        }
    }
}

typedef struct
{
  double a, b, wa, wb;
} Piece;

/* A member's loads of one case as the frame gathers them. Not a GArray: the editor solves
 * on a worker thread, and GLib 2.74 takes a GArray's header from that thread's slice
 * magazines, which keep freed memory for headers only (1.5 MB held after the frame of
 * 10,000 members was made); a plain block goes back to malloc. */
typedef struct
{
  TrbLoad *data;
  guint    len;
  guint    room;
} LoadList;

static void
load_list_append (LoadList      *list,
                  const TrbLoad *load)
{
  if (list->len == list->room)
    {
      list->room = MAX (4, 2 * list->room);
      list->data = g_renew (TrbLoad, list->data, list->room);
    }
  list->data[list->len++] = *load;
}

static void
area_loads (const TrbFramePlan   *plan,
            const Axis           *axis,
            TrbFrameMemberResult *out,
            LoadList             *loads)   /* [TRB_N_CASES] */
{
  guint n_loads = plan->n_area_loads;
  guint n_open = plan->n_openings;
  g_autofree LocalPolygon *polys = g_new0 (LocalPolygon, n_loads);
  g_autofree LocalPolygon *openings = g_new0 (LocalPolygon, n_open);
  g_autofree gboolean *open_relevant = g_new0 (gboolean, n_open + 1);
  g_autofree const LocalPolygon **relevant = g_new0 (const LocalPolygon *, n_loads + n_open + 1);
  g_autoptr(GArray) breaks = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) crossings = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) holes = g_array_new (FALSE, FALSE, sizeof (Interval));
  g_autoptr(GArray) pieces = g_array_new (FALSE, FALSE, sizeof (Piece));
  g_autofree double *room = NULL;
  gsize n_room = 0;

  for (guint i = 0; i < n_loads; i++)
    n_room += 2 * (gsize) plan->area_loads[i].n_points;
  for (guint i = 0; i < n_open; i++)
    n_room += 2 * (gsize) plan->openings[i].n_points;
  room = g_new (double, n_room + 1);
  n_room = 0;
  for (guint i = 0; i < n_loads; i++)
    {
      local_polygon_init (&polys[i], axis, plan->area_loads[i].points,
                          plan->area_loads[i].n_points, plan->area_loads[i].pressure,
                          plan->area_loads[i].load_case, room + n_room);
      n_room += 2 * (gsize) plan->area_loads[i].n_points;
    }
  for (guint i = 0; i < n_open; i++)
    {
      local_polygon_init (&openings[i], axis, plan->openings[i].points,
                          plan->openings[i].n_points, 0.0, -1, room + n_room);
      n_room += 2 * (gsize) plan->openings[i].n_points;
    }

  for (int c = 0; c < TRB_N_CASES; c++)
    {
      double scale = 0.0;

      g_array_set_size (pieces, 0);
      for (guint s = 0; s < out->n_strips; s++)
        {
          const TrbFrameStrip *strip = &out->strips[s];
          double lo = -strip->right, hi = strip->left;
          guint n_rel = 0, n_rel_loads;

          for (guint i = 0; i < n_loads; i++)
            if (polys[i].load_case == c && local_polygon_meets (&polys[i], strip->a, strip->b,
                                                                lo, hi))
              relevant[n_rel++] = &polys[i];
          n_rel_loads = n_rel;
          if (n_rel_loads == 0)
            continue;
          for (guint o = 0; o < n_open; o++)
            {
              open_relevant[o] = local_polygon_meets (&openings[o], strip->a, strip->b, lo, hi);
              if (open_relevant[o])
                relevant[n_rel++] = &openings[o];
            }

          g_array_set_size (breaks, 0);
          g_array_append_val (breaks, strip->a);
          g_array_append_val (breaks, strip->b);
          edge_breaks (relevant, n_rel, lo, hi, strip->a, strip->b, breaks);
          sort_unique (breaks);

          for (guint k = 0; k + 1 < breaks->len; k++)
            {
              double a = g_array_index (breaks, double, k);
              double b = g_array_index (breaks, double, k + 1);
              double xs[2] = { a + 0.25 * (b - a), a + 0.75 * (b - a) };
              double f[2] = { 0.0, 0.0 }, g[2] = { 0.0, 0.0 };
              Piece piece;

              for (guint t = 0; t < 2; t++)
                {
                  holes_at (openings, n_open, open_relevant, xs[t], lo, hi, crossings, holes);
                  for (guint i = 0; i < n_rel_loads; i++)
                    {
                      double w = polygon_width (relevant[i], xs[t], lo, hi, holes, crossings);

                      f[t] += relevant[i]->q * w;
                      g[t] += w;
                    }
                }

              /* linear on (a, b): the values at the quarter points give the ends exactly */
              out->loaded_area[c] += 0.5 * (g[0] + g[1]) * (b - a);
              piece.a = a;
              piece.b = b;
              piece.wa = 1.5 * f[0] - 0.5 * f[1];
              piece.wb = 1.5 * f[1] - 0.5 * f[0];
              scale = MAX (scale, MAX (fabs (piece.wa), fabs (piece.wb)));
              g_array_append_val (pieces, piece);
            }
        }

      /* join pieces that continue one another; drop the empty ones */
      {
        double eps = 1e-9 * scale;
        LoadList *dest = &loads[c];
        gboolean open = FALSE;

        for (guint k = 0; k < pieces->len; k++)
          {
            Piece *p = &g_array_index (pieces, Piece, k);
            TrbLoad *last = open ? &dest->data[dest->len - 1] : NULL;
            TrbLoad load;

            /* rounding leaves crumbs such as -0 or 1e-13 where the width ends at zero */
            if (fabs (p->wa) <= eps)
              p->wa = 0.0;
            if (fabs (p->wb) <= eps)
              p->wb = 0.0;
            if (p->wa == 0.0 && p->wb == 0.0)
              {
                open = FALSE;
                continue;
              }
            if (fabs (p->wa - p->wb) <= eps)
              p->wa = p->wb = 0.5 * (p->wa + p->wb);

            if (last != NULL && last->b == p->a && fabs (last->w2 - p->wa) <= eps)
              {
                double s_last = (last->w2 - last->w1) / (last->b - last->a);
                double s_this = (p->wb - p->wa) / (p->b - p->a);

                if (fabs (s_last - s_this) * (p->b - last->a) <= eps)
                  {
                    last->b = p->b;
                    last->w2 = p->wb;
                    if (last->kind == TRB_LOAD_UNIFORM && p->wa == p->wb)
                      last->w2 = last->w1;
                    else
                      last->kind = TRB_LOAD_LINEAR;
                    continue;
                  }
              }

            load.kind = p->wa == p->wb ? TRB_LOAD_UNIFORM : TRB_LOAD_LINEAR;
            load.a = p->a;
            load.b = p->b;
            load.w1 = p->wa;
            load.w2 = p->wb;
            load_list_append (dest, &load);
            open = TRUE;
          }
      }
    }
}

/* ---- line and point loads ------------------------------------------------------------------ */

static void
interval_subtract (GArray   *covered,
                   double    s0,
                   double    s1,
                   GArray   *free_parts)
{
  g_array_set_size (free_parts, 0);
  {
    Interval iv = { s0, s1 };

    g_array_append_val (free_parts, iv);
  }
  for (guint c = 0; c < covered->len; c++)
    {
      const Interval *cv = &g_array_index (covered, Interval, c);
      guint n = free_parts->len;

      for (guint k = 0; k < n; k++)
        {
          Interval *fp = &g_array_index (free_parts, Interval, k);
          Interval right = { cv->hi, fp->hi };

          if (cv->hi <= fp->lo || cv->lo >= fp->hi)
            continue;
          if (cv->lo > fp->lo)
            {
              fp->hi = cv->lo;
              if (right.hi > right.lo)
                g_array_append_val (free_parts, right);
            }
          else
            fp->lo = MIN (cv->hi, fp->hi);
        }
    }
}

static void
line_loads (Context  *ctx,
            LoadList *loads,       /* [member * TRB_N_CASES + case] */
            GArray   *unassigned)
{
  const TrbFramePlan *plan = ctx->plan;
  const Axis *axes = ctx->axes;
  g_autoptr(GArray) covered = g_array_new (FALSE, FALSE, sizeof (Interval));
  g_autoptr(GArray) free_parts = g_array_new (FALSE, FALSE, sizeof (Interval));

  for (guint i = 0; i < plan->n_line_loads; i++)
    {
      const TrbFrameLineLoad *line = &plan->line_loads[i];
      double missing = 0.0;

      for (guint k = 0; k + 1 < line->n_points; k++)
        {
          Axis seg;
          double on = 0.0;

          Box box = segment_box (&line->points[k], &line->points[k + 1], TOL);

          axis_init (&seg, &line->points[k], &line->points[k + 1]);
          if (seg.length <= 0)
            continue;
          g_array_set_size (covered, 0);

          /* in plan order: where two members overlap under the load, the first takes it */
          grid_query (&ctx->members, &box, TRUE, ctx->found);
          for (guint f = 0; f < ctx->found->len; f++)
            {
              guint m = g_array_index (ctx->found, guint, f);
              const Axis *axis = &axes[m];
              double xp, vp, xq, vq, cosine, x0, x1;

              if (!axes_parallel (axis, &seg))
                continue;
              axis_to_local (axis, &line->points[k], &xp, &vp);
              axis_to_local (axis, &line->points[k + 1], &xq, &vq);
              if (fabs (vp) > TOL || fabs (vq) > TOL)
                continue;

              /* s along the load's segment maps to x = xp + s * cosine on the member */
              cosine = (xq - xp) / seg.length;
              x0 = MAX (MIN (xp, xq), 0.0);
              x1 = MIN (MAX (xp, xq), axis->length);
              if (x1 - x0 <= SAME_X)
                continue;

              {
                double s0 = (x0 - xp) / cosine, s1 = (x1 - xp) / cosine;

                interval_subtract (covered, MIN (s0, s1), MAX (s0, s1), free_parts);
                for (guint f = 0; f < free_parts->len; f++)
                  {
                    const Interval *fp = &g_array_index (free_parts, Interval, f);
                    double a = xp + fp->lo * cosine, b = xp + fp->hi * cosine;
                    TrbLoad load;

                    if (fp->hi - fp->lo <= SAME_X)
                      continue;
                    load.kind = TRB_LOAD_UNIFORM;
                    load.a = CLAMP (MIN (a, b), 0.0, axis->length);
                    load.b = CLAMP (MAX (a, b), 0.0, axis->length);
                    /* the same force on a member a hair out of line with the load */
                    load.w1 = load.w2 = line->w / fabs (cosine);
                    load_list_append (&loads[m * TRB_N_CASES + line->load_case], &load);
                    on += fp->hi - fp->lo;
                  }
                {
                  Interval cv = { MIN (s0, s1), MAX (s0, s1) };

                  g_array_append_val (covered, cv);
                }
              }
            }
          missing += MAX (seg.length - on, 0.0);
        }

      if (missing > TOL)
        {
          TrbFrameUnassigned u = { i, missing };

          g_array_append_val (unassigned, u);
        }
    }
}

static void
point_loads (Context  *ctx,
             LoadList *loads,
             GArray   *unassigned)
{
  const TrbFramePlan *plan = ctx->plan;
  const Axis *axes = ctx->axes;

  for (guint i = 0; i < plan->n_point_loads; i++)
    {
      const TrbFramePointLoad *pl = &plan->point_loads[i];
      TrbFramePoint p = { pl->x, pl->y };
      Box box = segment_box (&p, &p, TOL);
      guint best = G_MAXUINT;
      double best_d = INFINITY;

      /* the nearest member; of equally near ones, the first in plan order */
      grid_query (&ctx->members, &box, TRUE, ctx->found);
      for (guint f = 0; f < ctx->found->len; f++)
        {
          guint m = g_array_index (ctx->found, guint, f);
          double d = axis_distance (&axes[m], &p);

          if (d <= TOL && d < best_d)
            {
              best = m;
              best_d = d;
            }
        }

      if (best == G_MAXUINT)
        g_array_append_val (unassigned, i);
      else
        {
          TrbLoad load = { TRB_LOAD_POINT, axis_position (&axes[best], &p), 0.0, pl->P, 0.0 };

          load.b = load.a;
          load_list_append (&loads[best * TRB_N_CASES + pl->load_case], &load);
        }
    }
}

/* ---- the frame ----------------------------------------------------------------------------- */

static char **
copy_ids (const void *items,
          gsize       stride,
          gsize       offset,
          guint       n)
{
  char **ids = g_new0 (char *, n + 1);

  for (guint i = 0; i < n; i++)
    ids[i] = g_strdup (*(const char * const *) ((const char *) items + i * stride + offset));
  return ids;
}

/**
 * trb_frame_new:
 * @plan: the floor plan
 * @error: return location for a #GError
 *
 * Works out, from plan geometry alone, what each member bears on, its supports and loads in
 * its own coordinate, the tributary strips of deck members, the bearing order, and which
 * members are unsupported or in a bearing cycle. Pure: the same plan gives the same result,
 * bit for bit. The rules are in docs/framing.md.
 *
 * Returns: (transfer full): the frame, or %NULL with %TRB_ERROR_INVALID when the plan is
 *   malformed (a missing or repeated id, a coordinate that is not finite, a member shorter
 *   than 50 mm, a polygon of fewer than three points, a listed bearing point off its member)
 */
TrbFrame *
trb_frame_new (const TrbFramePlan  *plan,
               GError             **error)
{
  g_autoptr(TrbFrame) frame = NULL;
  g_autofree Axis *axes = NULL;
  Context ctx;
  LoadList *loads;
  g_autoptr(GArray) unassigned_lines = NULL;
  g_autoptr(GArray) unassigned_points = NULL;
  guint n;

  g_return_val_if_fail (plan != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!validate_plan (plan, error))
    return NULL;

  n = plan->n_members;
  frame = g_new0 (TrbFrame, 1);
  frame->n_members = n;
  frame->n_columns = plan->n_columns;
  frame->n_walls = plan->n_walls;
  frame->members = g_new0 (TrbFrameMemberResult, n);
  frame->member_ids = copy_ids (plan->members, sizeof (TrbFrameMember),
                                G_STRUCT_OFFSET (TrbFrameMember, id), n);
  frame->column_ids = copy_ids (plan->columns, sizeof (TrbFrameColumn),
                                G_STRUCT_OFFSET (TrbFrameColumn, id), plan->n_columns);
  frame->wall_ids = copy_ids (plan->walls, sizeof (TrbFrameWall),
                              G_STRUCT_OFFSET (TrbFrameWall, id), plan->n_walls);
  frame->member_index = g_hash_table_new (g_str_hash, g_str_equal);

  axes = g_new (Axis, MAX (n, 1));
  for (guint m = 0; m < n; m++)
    {
      axis_init (&axes[m], &plan->members[m].start, &plan->members[m].end);
      frame->members[m].id = frame->member_ids[m];
      frame->members[m].length = axes[m].length;
      g_hash_table_insert (frame->member_index, frame->member_ids[m], GUINT_TO_POINTER (m + 1));
    }

  context_init (&ctx, plan, axes);
  for (guint m = 0; m < n; m++)
    find_supports (&ctx, m, frame, &frame->members[m]);
  order_members (frame);

  loads = g_new0 (LoadList, MAX (n, 1) * TRB_N_CASES);

  for (guint m = 0; m < n; m++)
    if (plan->members[m].carries_deck)
      {
        find_strips (&ctx, m, &frame->members[m]);
        area_loads (plan, &axes[m], &frame->members[m], &loads[m * TRB_N_CASES]);
      }

  unassigned_lines = g_array_new (FALSE, FALSE, sizeof (TrbFrameUnassigned));
  unassigned_points = g_array_new (FALSE, FALSE, sizeof (guint));
  line_loads (&ctx, loads, unassigned_lines);
  point_loads (&ctx, loads, unassigned_points);
  context_clear (&ctx);

  /* A member's loads of every case in one block of their exact size, loads[0] at its start:
   * the frame is kept from one solve to the next, and four arrays grown by doubling each were
   * some 0.9 MB more on 10,000 members. */
  for (guint m = 0; m < n; m++)
    {
      LoadList *a = &loads[m * TRB_N_CASES];
      TrbLoad *block;
      guint total = 0;

      for (int c = 0; c < TRB_N_CASES; c++)
        total += a[c].len;
      block = total > 0 ? g_new (TrbLoad, total) : NULL;
      total = 0;
      for (int c = 0; c < TRB_N_CASES; c++)
        {
          guint len = a[c].len;

          if (len > 0)
            memcpy (block + total, a[c].data, len * sizeof (TrbLoad));
          frame->members[m].n_loads[c] = len;
          frame->members[m].loads[c] = block != NULL ? block + total : NULL;
          total += len;
          g_free (a[c].data);
        }
    }
  g_free (loads);

  frame->n_unassigned_lines = unassigned_lines->len;
  frame->unassigned_lines =
    (TrbFrameUnassigned *) g_array_free (g_steal_pointer (&unassigned_lines), FALSE);
  frame->n_unassigned_points = unassigned_points->len;
  frame->unassigned_points = (guint *) g_array_free (g_steal_pointer (&unassigned_points), FALSE);

  return g_steal_pointer (&frame);
}

void
trb_frame_free (TrbFrame *frame)
{
  if (frame == NULL)
    return;

  for (guint m = 0; frame->members != NULL && m < frame->n_members; m++)
    {
      TrbFrameMemberResult *r = &frame->members[m];

      g_free ((char *) r->reason);
      g_free ((char *) r->note);
      g_free ((TrbSupport *) r->supports);   /* the bearings are in its block */
      g_free ((TrbFrameStrip *) r->strips);
      g_free ((TrbLoad *) r->loads[0]);   /* the block of every case */
    }
  g_free (frame->members);
  g_clear_pointer (&frame->member_index, g_hash_table_unref);
  g_strfreev (frame->member_ids);
  g_strfreev (frame->column_ids);
  g_strfreev (frame->wall_ids);
  g_free (frame->order);
  g_free (frame->unassigned_points);
  g_free (frame->unassigned_lines);
  g_free (frame);
}

guint
trb_frame_get_n_members (const TrbFrame *frame)
{
  g_return_val_if_fail (frame != NULL, 0);

  return frame->n_members;
}

const TrbFrameMemberResult *
trb_frame_get_member (const TrbFrame *frame,
                      guint           index)
{
  g_return_val_if_fail (frame != NULL, NULL);
  g_return_val_if_fail (index < frame->n_members, NULL);

  return &frame->members[index];
}

gboolean
trb_frame_lookup_member (const TrbFrame *frame,
                         const char     *id,
                         guint          *index)
{
  guint found;

  g_return_val_if_fail (frame != NULL, FALSE);
  g_return_val_if_fail (id != NULL, FALSE);

  found = GPOINTER_TO_UINT (g_hash_table_lookup (frame->member_index, id));
  if (found == 0)
    return FALSE;
  if (index != NULL)
    *index = found - 1;
  return TRUE;
}

/**
 * trb_frame_get_order:
 * @frame: a frame
 * @n_members: (out): the number of members in the order
 *
 * The bearing order: every member comes after all the members that bear on it, so that their
 * reactions are known when it is loaded. Members in a bearing cycle are left out; unsupported
 * members are in it (check their status).
 *
 * Returns: member indices, owned by the frame
 */
const guint *
trb_frame_get_order (const TrbFrame *frame,
                     guint          *n_members)
{
  g_return_val_if_fail (frame != NULL, NULL);
  g_return_val_if_fail (n_members != NULL, NULL);

  *n_members = frame->n_order;
  return frame->order;
}

/* The plan's point loads that lie on no member, by index. */
const guint *
trb_frame_get_unassigned_points (const TrbFrame *frame,
                                 guint          *n_loads)
{
  g_return_val_if_fail (frame != NULL, NULL);
  g_return_val_if_fail (n_loads != NULL, NULL);

  *n_loads = frame->n_unassigned_points;
  return frame->unassigned_points;
}

/* The plan's line loads that lie, in part or whole, on no member. */
const TrbFrameUnassigned *
trb_frame_get_unassigned_lines (const TrbFrame *frame,
                                guint          *n_loads)
{
  g_return_val_if_fail (frame != NULL, NULL);
  g_return_val_if_fail (n_loads != NULL, NULL);

  *n_loads = frame->n_unassigned_lines;
  return frame->unassigned_lines;
}

/**
 * trb_frame_hand_down:
 * @frame: a frame
 * @member: the member's index
 * @reactions: @n_reactions × %TRB_N_CASES values, support by support (in the order of the
 *   member's supports), case by case within each: the support's reaction on the member, N,
 *   upward +
 * @n_reactions: the member's number of supports
 * @out: (out caller-allocates): @n_reactions hand-offs, one per support
 * @error: return location for a #GError
 *
 * Turns a member's reactions into the loads on what it bears on: the same force, downward on
 * the column, the wall (at the distance along it) or the member below (at the bearing position
 * in that member's own coordinate).
 *
 * Returns: %FALSE with %TRB_ERROR_INVALID when the count of reactions is not the member's
 *   count of supports
 */
gboolean
trb_frame_hand_down (const TrbFrame   *frame,
                     guint             member,
                     const double     *reactions,
                     guint             n_reactions,
                     TrbFrameHandoff  *out,
                     GError          **error)
{
  const TrbFrameMemberResult *r;

  g_return_val_if_fail (frame != NULL, FALSE);
  g_return_val_if_fail (member < frame->n_members, FALSE);
  g_return_val_if_fail (reactions != NULL || n_reactions == 0, FALSE);
  g_return_val_if_fail (out != NULL || n_reactions == 0, FALSE);

  r = &frame->members[member];
  if (n_reactions != r->n_supports)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s has %u supports, given %u reactions", r->id, r->n_supports,
                   n_reactions);
      return FALSE;
    }

  for (guint s = 0; s < n_reactions; s++)
    {
      out[s].kind = r->bearings[s].kind;
      out[s].index = r->bearings[s].index;
      out[s].position = r->bearings[s].position;
      for (int c = 0; c < TRB_N_CASES; c++)
        out[s].force[c] = reactions[s * TRB_N_CASES + c];
    }
  return TRUE;
}

/* ---- takedown ------------------------------------------------------------------------------ */

TrbFrameTakedown *
trb_frame_takedown_new (const TrbFrame *frame)
{
  TrbFrameTakedown *td;

  g_return_val_if_fail (frame != NULL, NULL);

  td = g_new0 (TrbFrameTakedown, 1);
  td->frame = frame;
  td->member_loads = g_new0 (GArray *, frame->n_members * TRB_N_CASES + 1);
  td->column_loads = g_new0 (double, frame->n_columns * TRB_N_CASES + 1);
  td->wall_loads = g_new0 (GArray *, frame->n_walls * TRB_N_CASES + 1);
  for (guint k = 0; k < frame->n_walls * TRB_N_CASES; k++)
    td->wall_loads[k] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  return td;
}

void
trb_frame_takedown_free (TrbFrameTakedown *takedown)
{
  if (takedown == NULL)
    return;

  for (guint k = 0; k < takedown->frame->n_members * TRB_N_CASES; k++)
    g_clear_pointer (&takedown->member_loads[k], g_array_unref);
  for (guint k = 0; k < takedown->frame->n_walls * TRB_N_CASES; k++)
    g_array_unref (takedown->wall_loads[k]);
  g_free (takedown->member_loads);
  g_free (takedown->column_loads);
  g_free (takedown->wall_loads);
  g_free (takedown);
}

/* Loads landing at the same point (members from both sides) add into one; the rest are kept
 * sorted by position. */
static void
add_point_load (GArray **slot,
                double   x,
                double   P)
{
  TrbLoad load = { TRB_LOAD_POINT, x, x, P, 0.0 };
  GArray *loads;
  guint k;

  if (*slot == NULL)
    *slot = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  loads = *slot;

  for (k = 0; k < loads->len; k++)
    {
      TrbLoad *l = &g_array_index (loads, TrbLoad, k);

      if (fabs (l->a - x) <= SAME_X)
        {
          l->w1 += P;
          return;
        }
      if (l->a > x)
        break;
    }
  g_array_insert_val (loads, k, load);
}

/**
 * trb_frame_takedown_add:
 * @takedown: a takedown
 * @member: the member's index
 * @reactions: as for trb_frame_hand_down()
 * @n_reactions: the member's number of supports
 * @error: return location for a #GError
 *
 * Hands a member's reactions down (trb_frame_hand_down()) and adds them to what it bears on:
 * point loads on members below, totals on columns, point loads along walls.
 *
 * Returns: %FALSE with %TRB_ERROR_INVALID as trb_frame_hand_down()
 */
gboolean
trb_frame_takedown_add (TrbFrameTakedown  *takedown,
                        guint              member,
                        const double      *reactions,
                        guint              n_reactions,
                        GError           **error)
{
  g_autofree TrbFrameHandoff *handoffs = g_new0 (TrbFrameHandoff, n_reactions + 1);

  g_return_val_if_fail (takedown != NULL, FALSE);

  if (!trb_frame_hand_down (takedown->frame, member, reactions, n_reactions, handoffs, error))
    return FALSE;

  for (guint s = 0; s < n_reactions; s++)
    {
      const TrbFrameHandoff *h = &handoffs[s];

      for (int c = 0; c < TRB_N_CASES; c++)
        switch (h->kind)
          {
          case TRB_BEARING_COLUMN:
            takedown->column_loads[h->index * TRB_N_CASES + c] += h->force[c];
            break;
          case TRB_BEARING_WALL:
            add_point_load (&takedown->wall_loads[h->index * TRB_N_CASES + c], h->position,
                            h->force[c]);
            break;
          case TRB_BEARING_MEMBER:
          default:
            add_point_load (&takedown->member_loads[h->index * TRB_N_CASES + c], h->position,
                            h->force[c]);
            break;
          }
    }
  return TRUE;
}

/* The point loads handed down onto a member so far, in its own coordinate, downward +,
 * sorted by position. */
const TrbLoad *
trb_frame_takedown_get_member_loads (const TrbFrameTakedown *takedown,
                                     guint                   member,
                                     TrbLoadCase             load_case,
                                     guint                  *n_loads)
{
  GArray *a;

  g_return_val_if_fail (takedown != NULL, NULL);
  g_return_val_if_fail (member < takedown->frame->n_members, NULL);
  g_return_val_if_fail ((int) load_case >= 0 && load_case < TRB_N_CASES, NULL);
  g_return_val_if_fail (n_loads != NULL, NULL);

  a = takedown->member_loads[member * TRB_N_CASES + load_case];
  *n_loads = a != NULL ? a->len : 0;
  return a != NULL ? (const TrbLoad *) a->data : NULL;
}

/**
 * trb_frame_takedown_release_member:
 * @takedown: a takedown
 * @member: a member's index in the plan
 *
 * Frees the loads handed down onto @member so far, once they have been read for the last
 * time (a floor's solve reads each member's once, going down the order): what reaches the
 * girders at the bottom is then gone before the results of the whole floor are all made.
 * Loads handed down to it later start again from none.
 */
void
trb_frame_takedown_release_member (TrbFrameTakedown *takedown,
                                   guint             member)
{
  g_return_if_fail (takedown != NULL);
  g_return_if_fail (member < takedown->frame->n_members);

  for (guint c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&takedown->member_loads[member * TRB_N_CASES + c], g_array_unref);
}

/* The total load handed down onto a column so far, N, downward +. */
double
trb_frame_takedown_get_column_load (const TrbFrameTakedown *takedown,
                                    guint                   column,
                                    TrbLoadCase             load_case)
{
  g_return_val_if_fail (takedown != NULL, NAN);
  g_return_val_if_fail (column < takedown->frame->n_columns, NAN);
  g_return_val_if_fail ((int) load_case >= 0 && load_case < TRB_N_CASES, NAN);

  return takedown->column_loads[column * TRB_N_CASES + load_case];
}

/* The point loads handed down onto a wall so far, at their distance along it, downward +. */
const TrbLoad *
trb_frame_takedown_get_wall_loads (const TrbFrameTakedown *takedown,
                                   guint                   wall,
                                   TrbLoadCase             load_case,
                                   guint                  *n_loads)
{
  GArray *a;

  g_return_val_if_fail (takedown != NULL, NULL);
  g_return_val_if_fail (wall < takedown->frame->n_walls, NULL);
  g_return_val_if_fail ((int) load_case >= 0 && load_case < TRB_N_CASES, NULL);
  g_return_val_if_fail (n_loads != NULL, NULL);

  a = takedown->wall_loads[wall * TRB_N_CASES + load_case];
  *n_loads = a->len;
  return (const TrbLoad *) a->data;
}
