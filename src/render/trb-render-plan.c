/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-plan.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "trb-combos.h"
#include "trb-units.h"

/* ---- the view ----------------------------------------------------------------------------- */

/* A scale nobody draws a floor at, but one that shows something: 50 pixels a metre. */
#define DEFAULT_SCALE 50.0

void
trb_plan_view_init (TrbPlanView *view)
{
  g_return_if_fail (view != NULL);

  view->scale = DEFAULT_SCALE;
  view->origin_x = 0;
  view->origin_y = 0;
}

void
trb_plan_view_to_device (const TrbPlanView *view,
                         double             plan_x,
                         double             plan_y,
                         double            *device_x,
                         double            *device_y)
{
  g_return_if_fail (view != NULL);

  /* y is up in plan and down on the device */
  if (device_x != NULL)
    *device_x = view->origin_x + view->scale * plan_x;
  if (device_y != NULL)
    *device_y = view->origin_y - view->scale * plan_y;
}

void
trb_plan_view_to_plan (const TrbPlanView *view,
                       double             device_x,
                       double             device_y,
                       double            *plan_x,
                       double            *plan_y)
{
  g_return_if_fail (view != NULL && view->scale > 0);

  if (plan_x != NULL)
    *plan_x = (device_x - view->origin_x) / view->scale;
  if (plan_y != NULL)
    *plan_y = (view->origin_y - device_y) / view->scale;
}

void
trb_plan_view_pan (TrbPlanView *view,
                   double       device_dx,
                   double       device_dy)
{
  g_return_if_fail (view != NULL);

  view->origin_x += device_dx;
  view->origin_y += device_dy;
}

void
trb_plan_view_zoom_about (TrbPlanView *view,
                          double       factor,
                          double       device_x,
                          double       device_y)
{
  g_return_if_fail (view != NULL);
  g_return_if_fail (factor > 0 && isfinite (factor));

  /* the plan point under (device_x, device_y) stays there: d = o + s p before and after */
  view->scale *= factor;
  view->origin_x = device_x - factor * (device_x - view->origin_x);
  view->origin_y = device_y - factor * (device_y - view->origin_y);
}

void
trb_plan_view_fit (TrbPlanView         *view,
                   const TrbPlanBounds *bounds,
                   double               x,
                   double               y,
                   double               width,
                   double               height,
                   double               margin)
{
  double bw, bh, aw, ah, cx, cy;

  g_return_if_fail (view != NULL && bounds != NULL);

  if (trb_plan_bounds_is_empty (bounds))
    {
      trb_plan_view_init (view);
      view->origin_x = x + width / 2;
      view->origin_y = y + height / 2;
      return;
    }

  /* a point or a line still gets a scale: treat it as at least a metre across */
  bw = MAX (bounds->max_x - bounds->min_x, 1.0);
  bh = MAX (bounds->max_y - bounds->min_y, 1.0);
  aw = MAX (width - 2 * margin, 1.0);
  ah = MAX (height - 2 * margin, 1.0);
  view->scale = MIN (aw / bw, ah / bh);

  cx = (bounds->min_x + bounds->max_x) / 2;
  cy = (bounds->min_y + bounds->max_y) / 2;
  view->origin_x = x + width / 2 - view->scale * cx;
  view->origin_y = y + height / 2 + view->scale * cy;
}

void
trb_plan_view_visible (const TrbPlanView *view,
                       double             x,
                       double             y,
                       double             width,
                       double             height,
                       TrbPlanBounds     *bounds)
{
  double x0, y0, x1, y1;

  g_return_if_fail (view != NULL && bounds != NULL);

  trb_plan_view_to_plan (view, x, y, &x0, &y1);
  trb_plan_view_to_plan (view, x + width, y + height, &x1, &y0);
  bounds->min_x = MIN (x0, x1);
  bounds->max_x = MAX (x0, x1);
  bounds->min_y = MIN (y0, y1);
  bounds->max_y = MAX (y0, y1);
}

void
trb_plan_bounds_init (TrbPlanBounds *bounds)
{
  g_return_if_fail (bounds != NULL);

  bounds->min_x = bounds->min_y = INFINITY;
  bounds->max_x = bounds->max_y = -INFINITY;
}

void
trb_plan_bounds_add (TrbPlanBounds *bounds,
                     double         x,
                     double         y)
{
  g_return_if_fail (bounds != NULL);

  if (!isfinite (x) || !isfinite (y))
    return;
  bounds->min_x = MIN (bounds->min_x, x);
  bounds->min_y = MIN (bounds->min_y, y);
  bounds->max_x = MAX (bounds->max_x, x);
  bounds->max_y = MAX (bounds->max_y, y);
}

gboolean
trb_plan_bounds_is_empty (const TrbPlanBounds *bounds)
{
  g_return_val_if_fail (bounds != NULL, TRUE);

  return !(bounds->min_x <= bounds->max_x && bounds->min_y <= bounds->max_y);
}

/* ---- the scene ---------------------------------------------------------------------------- */

struct _TrbPlanScene
{
  const TrbProject       *project;
  const TrbFloor         *floor;
  const TrbProjectResult *results;
  GHashTable             *member_results;   /* TrbMember * -> TrbMemberResult * */
  TrbPlanBounds           bounds;
  double                 *column_loads;     /* n_columns * TRB_N_CASES, N; NULL when none */
  TrbUnitSystem           units;
  /* Text laid out by earlier draws: a draw changes nothing else of the scene, and the canvas
   * and the printed page each draw their own scene from one thread. */
  TrbRenderTextCache     *texts;
  /* Each member's status in one byte, in the floor's order when the scene was made (members
   * then, to tell whether the floor still holds the same one at an index): a draw reads them
   * in a row instead of a hash lookup and a result a member. */
  const TrbMember       **status_members;
  guint8                 *status;
  guint                   n_status;
};

static void
bounds_add_points (TrbPlanBounds *bounds,
                   const GArray  *points)
{
  if (points == NULL)
    return;
  for (guint i = 0; i < points->len; i++)
    {
      const TrbFramePoint *p = &g_array_index (points, TrbFramePoint, i);

      trb_plan_bounds_add (bounds, p->x, p->y);
    }
}

/**
 * trb_plan_scene_new:
 * @project: the project that holds @floor
 * @floor: the floor to draw
 * @results: (nullable): the project's results, or %NULL before the first solve
 *
 * Returns: (transfer full): the scene; it borrows its arguments
 */
TrbPlanScene *
trb_plan_scene_new (const TrbProject       *project,
                    const TrbFloor         *floor,
                    const TrbProjectResult *results)
{
  TrbPlanScene *scene;

  g_return_val_if_fail (project != NULL && floor != NULL, NULL);

  scene = g_new0 (TrbPlanScene, 1);
  scene->project = project;
  scene->floor = floor;
  scene->results = results;
  scene->units = project->settings.units;
  scene->member_results = g_hash_table_new (g_direct_hash, g_direct_equal);
  scene->texts = trb_render_text_cache_new ();
  if (results != NULL)
    for (guint i = 0; i < results->members->len; i++)
      {
        const TrbMemberResult *r = g_ptr_array_index (results->members, i);

        if (r->member != NULL && r->member->floor == floor)
          g_hash_table_insert (scene->member_results, (gpointer) r->member, (gpointer) r);
      }

  scene->n_status = floor->members->len;
  scene->status_members = g_new0 (const TrbMember *, MAX (scene->n_status, 1));
  scene->status = g_new0 (guint8, MAX (scene->n_status, 1));
  for (guint i = 0; i < scene->n_status; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);

      scene->status_members[i] = m;
      scene->status[i] = trb_render_status_of (g_hash_table_lookup (scene->member_results, m));
    }

  /* the floor solve's column loads, in the floor's column order */
  for (guint f = 0; results != NULL && results->floors != NULL && f < results->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (results->floors, f);

      if (fr->floor != floor || fr->columns == NULL || fr->columns->len != floor->columns->len)
        continue;
      scene->column_loads = g_new0 (double, MAX (fr->columns->len, 1) * TRB_N_CASES);
      for (guint i = 0; i < fr->columns->len; i++)
        memcpy (scene->column_loads + i * TRB_N_CASES,
                g_array_index (fr->columns, TrbColumnResult, i).force,
                sizeof (double) * TRB_N_CASES);
    }

  trb_plan_bounds_init (&scene->bounds);
  for (guint i = 0; i < floor->grids->len; i++)
    {
      const TrbGridLine *g = g_ptr_array_index (floor->grids, i);

      trb_plan_bounds_add (&scene->bounds, g->start.x, g->start.y);
      trb_plan_bounds_add (&scene->bounds, g->end.x, g->end.y);
    }
  for (guint i = 0; i < floor->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (floor->columns, i);

      trb_plan_bounds_add (&scene->bounds, c->at.x, c->at.y);
    }
  for (guint i = 0; i < floor->walls->len; i++)
    bounds_add_points (&scene->bounds, ((TrbWall *) g_ptr_array_index (floor->walls, i))->points);
  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);

      trb_plan_bounds_add (&scene->bounds, m->start.x, m->start.y);
      trb_plan_bounds_add (&scene->bounds, m->end.x, m->end.y);
    }
  for (guint i = 0; i < floor->area_loads->len; i++)
    bounds_add_points (&scene->bounds,
                       ((TrbAreaLoad *) g_ptr_array_index (floor->area_loads, i))->points);
  for (guint i = 0; i < floor->line_loads->len; i++)
    bounds_add_points (&scene->bounds,
                       ((TrbLineLoad *) g_ptr_array_index (floor->line_loads, i))->points);
  for (guint i = 0; i < floor->point_loads->len; i++)
    {
      const TrbPointLoad *p = g_ptr_array_index (floor->point_loads, i);

      trb_plan_bounds_add (&scene->bounds, p->at.x, p->at.y);
    }

  return scene;
}

void
trb_plan_scene_free (TrbPlanScene *scene)
{
  if (scene == NULL)
    return;
  g_clear_pointer (&scene->member_results, g_hash_table_unref);
  g_free (scene->column_loads);
  trb_render_text_cache_free (scene->texts);
  g_free (scene->status_members);
  g_free (scene->status);
  g_free (scene);
}

/**
 * trb_plan_scene_take_texts:
 * @scene: a new scene
 * @from: the scene it replaces
 *
 * Hands the text laid out by @from's draws over to @scene, whose first draw then lays out
 * only what is new (the text is keyed by its font, size and words, whatever the results).
 */
void
trb_plan_scene_take_texts (TrbPlanScene *scene,
                           TrbPlanScene *from)
{
  g_return_if_fail (scene != NULL && from != NULL);

  if (scene == from)
    return;
  trb_render_text_cache_free (scene->texts);
  scene->texts = from->texts;
  from->texts = trb_render_text_cache_new ();
}

const TrbFloor *
trb_plan_scene_get_floor (const TrbPlanScene *scene)
{
  g_return_val_if_fail (scene != NULL, NULL);

  return scene->floor;
}

TrbUnitSystem
trb_plan_scene_get_units (const TrbPlanScene *scene)
{
  g_return_val_if_fail (scene != NULL, TRB_UNIT_SYSTEM_US);

  return scene->units;
}

void
trb_plan_scene_get_bounds (const TrbPlanScene *scene,
                           TrbPlanBounds      *bounds)
{
  g_return_if_fail (scene != NULL && bounds != NULL);

  *bounds = scene->bounds;
}

const TrbMemberResult *
trb_plan_scene_lookup_result (const TrbPlanScene *scene,
                              const TrbMember    *member)
{
  g_return_val_if_fail (scene != NULL, NULL);

  return g_hash_table_lookup (scene->member_results, member);
}

gboolean
trb_plan_scene_get_column_load (const TrbPlanScene *scene,
                                guint               column,
                                double              load[TRB_N_CASES])
{
  g_return_val_if_fail (scene != NULL, FALSE);

  if (scene->column_loads == NULL || column >= scene->floor->columns->len)
    return FALSE;
  memcpy (load, scene->column_loads + column * TRB_N_CASES, sizeof (double) * TRB_N_CASES);
  return TRUE;
}

/* ---- geometry ----------------------------------------------------------------------------- */

static double
segment_distance (double px,
                  double py,
                  double ax,
                  double ay,
                  double bx,
                  double by)
{
  double dx = bx - ax, dy = by - ay;
  double l2 = dx * dx + dy * dy;
  double t = 0;

  if (l2 > 0)
    t = CLAMP (((px - ax) * dx + (py - ay) * dy) / l2, 0.0, 1.0);
  return hypot (px - (ax + t * dx), py - (ay + t * dy));
}

static double
polyline_distance (const TrbPlanView *view,
                   const GArray      *points,
                   double             dx,
                   double             dy)
{
  double best = INFINITY;

  for (guint i = 0; points != NULL && i + 1 < points->len; i++)
    {
      const TrbFramePoint *a = &g_array_index (points, TrbFramePoint, i);
      const TrbFramePoint *b = &g_array_index (points, TrbFramePoint, i + 1);
      double ax, ay, bx, by;

      trb_plan_view_to_device (view, a->x, a->y, &ax, &ay);
      trb_plan_view_to_device (view, b->x, b->y, &bx, &by);
      best = MIN (best, segment_distance (dx, dy, ax, ay, bx, by));
    }
  if (points != NULL && points->len == 1)
    {
      const TrbFramePoint *a = &g_array_index (points, TrbFramePoint, 0);
      double ax, ay;

      trb_plan_view_to_device (view, a->x, a->y, &ax, &ay);
      best = hypot (dx - ax, dy - ay);
    }
  return best;
}

/* Even-odd rule, in plan coordinates. */
static gboolean
polygon_contains (const GArray *points,
                  double        x,
                  double        y)
{
  gboolean inside = FALSE;

  if (points == NULL || points->len < 3)
    return FALSE;
  for (guint i = 0, j = points->len - 1; i < points->len; j = i++)
    {
      const TrbFramePoint *a = &g_array_index (points, TrbFramePoint, i);
      const TrbFramePoint *b = &g_array_index (points, TrbFramePoint, j);

      if ((a->y > y) != (b->y > y) &&
          x < (b->x - a->x) * (y - a->y) / (b->y - a->y) + a->x)
        inside = !inside;
    }
  return inside;
}

/* Does the segment cross the rectangle? Liang-Barsky clipping. */
static gboolean
segment_touches_rect (double               ax,
                      double               ay,
                      double               bx,
                      double               by,
                      const TrbPlanBounds *r)
{
  double t0 = 0, t1 = 1;
  double dx = bx - ax, dy = by - ay;
  double p[4] = { -dx, dx, -dy, dy };
  double q[4] = { ax - r->min_x, r->max_x - ax, ay - r->min_y, r->max_y - ay };

  for (int i = 0; i < 4; i++)
    {
      if (p[i] == 0)
        {
          if (q[i] < 0)
            return FALSE;
          continue;
        }
      {
        double t = q[i] / p[i];

        if (p[i] < 0)
          t0 = MAX (t0, t);
        else
          t1 = MIN (t1, t);
        if (t0 > t1)
          return FALSE;
      }
    }
  return TRUE;
}

static gboolean
point_in_rect (double               x,
               double               y,
               const TrbPlanBounds *r)
{
  return x >= r->min_x && x <= r->max_x && y >= r->min_y && y <= r->max_y;
}

/* The half-size of a column's square, in device units: its true size when the plan is large
 * enough to show it, else a mark still big enough to see and to pick. */
static double
column_half (const TrbPlanView *view)
{
  /* 300 mm: a typical column's width (common practice) */
  return MAX (0.15 * view->scale, 3.5);
}

static double
wall_half (const TrbPlanView *view)
{
  /* 200 mm: a typical bearing wall's thickness (common practice) */
  return MAX (0.10 * view->scale, 2.5);
}

/* ---- picking ------------------------------------------------------------------------------ */

static void
hit_consider (TrbPlanHit     *best,
              int            *best_rank,
              int             rank,
              TrbPlanHitKind  kind,
              guint           index,
              gconstpointer   object,
              double          distance,
              double          tolerance)
{
  if (!(distance <= tolerance))
    return;
  if (rank < *best_rank || (rank == *best_rank && distance < best->distance))
    {
      *best_rank = rank;
      best->kind = kind;
      best->index = index;
      best->object = object;
      best->distance = distance;
    }
}

gboolean
trb_plan_hit_test (const TrbPlanScene *scene,
                   const TrbPlanView  *view,
                   double              device_x,
                   double              device_y,
                   double              tolerance,
                   TrbPlanHit         *hit)
{
  const TrbFloor *floor;
  TrbPlanHit best = { TRB_PLAN_HIT_NONE, 0, NULL, INFINITY };
  int rank = G_MAXINT;
  double px, py;

  g_return_val_if_fail (scene != NULL && view != NULL && hit != NULL, FALSE);

  floor = scene->floor;
  trb_plan_view_to_plan (view, device_x, device_y, &px, &py);

  /* rank 0: what sits at a point (columns, point loads) wins over the lines through it */
  for (guint i = 0; i < floor->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (floor->columns, i);
      double cx, cy, h = column_half (view), d;

      trb_plan_view_to_device (view, c->at.x, c->at.y, &cx, &cy);
      /* distance to the square, 0 inside it */
      d = hypot (MAX (fabs (device_x - cx) - h, 0), MAX (fabs (device_y - cy) - h, 0));
      hit_consider (&best, &rank, 0, TRB_PLAN_HIT_COLUMN, i, c, d, tolerance);
    }
  for (guint i = 0; i < floor->point_loads->len; i++)
    {
      const TrbPointLoad *p = g_ptr_array_index (floor->point_loads, i);
      double cx, cy;

      trb_plan_view_to_device (view, p->at.x, p->at.y, &cx, &cy);
      hit_consider (&best, &rank, 0, TRB_PLAN_HIT_POINT_LOAD, i, p,
                    hypot (device_x - cx, device_y - cy), tolerance);
    }
  if (rank == 0)
    goto done;

  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      double ax, ay, bx, by;

      trb_plan_view_to_device (view, m->start.x, m->start.y, &ax, &ay);
      trb_plan_view_to_device (view, m->end.x, m->end.y, &bx, &by);
      /* a cheap box test first: most members are far away */
      if (device_x < MIN (ax, bx) - tolerance || device_x > MAX (ax, bx) + tolerance ||
          device_y < MIN (ay, by) - tolerance || device_y > MAX (ay, by) + tolerance)
        continue;
      hit_consider (&best, &rank, 1, TRB_PLAN_HIT_MEMBER, i, m,
                    segment_distance (device_x, device_y, ax, ay, bx, by), tolerance);
    }
  if (rank == 1)
    goto done;

  for (guint i = 0; i < floor->walls->len; i++)
    {
      const TrbWall *w = g_ptr_array_index (floor->walls, i);
      double d = polyline_distance (view, w->points, device_x, device_y) - wall_half (view);

      hit_consider (&best, &rank, 2, TRB_PLAN_HIT_WALL, i, w, MAX (d, 0), tolerance);
    }
  for (guint i = 0; i < floor->line_loads->len; i++)
    {
      const TrbLineLoad *l = g_ptr_array_index (floor->line_loads, i);

      hit_consider (&best, &rank, 2, TRB_PLAN_HIT_LINE_LOAD, i, l,
                    polyline_distance (view, l->points, device_x, device_y), tolerance);
    }
  if (rank == 2)
    goto done;

  for (guint i = 0; i < floor->area_loads->len; i++)
    {
      const TrbAreaLoad *a = g_ptr_array_index (floor->area_loads, i);

      /* the last drawn is on top */
      if (polygon_contains (a->points, px, py))
        {
          rank = G_MAXINT;
          hit_consider (&best, &rank, 3, TRB_PLAN_HIT_AREA_LOAD, i, a, 0, tolerance);
        }
    }

done:
  *hit = best;
  return best.kind != TRB_PLAN_HIT_NONE;
}

static gboolean
points_select (const GArray        *points,
               const TrbPlanBounds *r,
               gboolean             touching)
{
  if (points == NULL || points->len == 0)
    return FALSE;
  for (guint i = 0; i < points->len; i++)
    {
      const TrbFramePoint *a = &g_array_index (points, TrbFramePoint, i);
      gboolean in = point_in_rect (a->x, a->y, r);

      if (touching && in)
        return TRUE;
      if (!touching && !in)
        return FALSE;
      if (touching && i + 1 < points->len)
        {
          const TrbFramePoint *b = &g_array_index (points, TrbFramePoint, i + 1);

          if (segment_touches_rect (a->x, a->y, b->x, b->y, r))
            return TRUE;
        }
    }
  return !touching;
}

GArray *
trb_plan_select_rect (const TrbPlanScene *scene,
                      const TrbPlanView  *view,
                      double              device_x0,
                      double              device_y0,
                      double              device_x1,
                      double              device_y1,
                      gboolean            touching)
{
  const TrbFloor *floor;
  TrbPlanBounds r;
  GArray *out;
  double ax, ay, bx, by;

  g_return_val_if_fail (scene != NULL && view != NULL, NULL);

  floor = scene->floor;
  out = g_array_new (FALSE, TRUE, sizeof (TrbPlanHit));
  trb_plan_view_to_plan (view, device_x0, device_y0, &ax, &ay);
  trb_plan_view_to_plan (view, device_x1, device_y1, &bx, &by);
  r.min_x = MIN (ax, bx);
  r.max_x = MAX (ax, bx);
  r.min_y = MIN (ay, by);
  r.max_y = MAX (ay, by);

  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      gboolean in;

      if (touching)
        in = segment_touches_rect (m->start.x, m->start.y, m->end.x, m->end.y, &r);
      else
        in = point_in_rect (m->start.x, m->start.y, &r) && point_in_rect (m->end.x, m->end.y, &r);
      if (in)
        {
          TrbPlanHit h = { TRB_PLAN_HIT_MEMBER, i, m, 0 };

          g_array_append_val (out, h);
        }
    }
  for (guint i = 0; i < floor->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (floor->columns, i);

      if (point_in_rect (c->at.x, c->at.y, &r))
        {
          TrbPlanHit h = { TRB_PLAN_HIT_COLUMN, i, c, 0 };

          g_array_append_val (out, h);
        }
    }
  for (guint i = 0; i < floor->walls->len; i++)
    {
      const TrbWall *w = g_ptr_array_index (floor->walls, i);

      if (points_select (w->points, &r, touching))
        {
          TrbPlanHit h = { TRB_PLAN_HIT_WALL, i, w, 0 };

          g_array_append_val (out, h);
        }
    }
  return out;
}

/* ---- drawing ------------------------------------------------------------------------------ */

void
trb_plan_draw_options_init (TrbPlanDrawOptions *options,
                            double              width,
                            double              height)
{
  g_return_if_fail (options != NULL);

  memset (options, 0, sizeof *options);
  trb_render_style_init (&options->style);
  options->layers = TRB_PLAN_LAYER_ALL & ~TRB_PLAN_LAYER_COLUMN_LOADS;
  options->width = width;
  options->height = height;
}

typedef struct
{
  cairo_t                  *cr;
  const TrbPlanScene       *scene;
  const TrbPlanView        *view;
  const TrbPlanDrawOptions *options;
  const TrbRenderStyle     *style;
  TrbRenderTextCache       *texts;     /* the scene's */
  TrbPlanBounds             visible;   /* plan metres, padded for labels */
  TrbPlanBounds             device;    /* the drawing rectangle, device units */
  TrbRgba                   ink;
  TrbRgba                   paper;
  double                    fs;        /* font size */
  double                    lw;        /* member line width */
  /* per member of the floor, for this draw: visible (member_visible), its status and role */
  guint8                   *vis;
  guint8                   *status;
  guint8                   *role;
  double                   *line;      /* 4 a member: its ends on the device, when visible */
  guint                     n_visible;
  /* The visible members' lines by cells of NEAR_CELL device units over near_box, the device
   * box only they can reach: near_first[c] to near_first[c + 1] in near_index. Made when
   * first needed. */
  guint                    *near_first;
  guint                    *near_index;
  int                       near_nx;
  int                       near_ny;
  TrbPlanBounds             near_box;
  gboolean                  swatches_ok;   /* set_line_color() may use swatches */
  guint                     n_swatches;
  TrbRgba                   swatch_colors[8];
  cairo_pattern_t          *swatches[8];
} DrawContext;

/* Sets an opaque colour for the lines of that width, or the fills (width INFINITY), that
 * follow; not for text. On an image, and on a recording surface (the canvas's, played back
 * onto one), cairo 1.16 blends the partly covered pixels of an opaque solid colour one at a
 * time in plain C, but those of any other source a row at a time through pixman's vector code:
 * a one-pixel repeating image of the same colour draws the same pixels (a few partly covered
 * ones differ by one level in 255, pixman's rounding), and lines under 3 units wide, nearly
 * every pixel of which is an edge, two to three times faster. From 3 units, and for fills,
 * whole rows of full cover take cairo's quicker plain fill, and the colour stays a colour, as
 * it always does elsewhere (PDF, SVG). */
static void
set_line_color (DrawContext   *dc,
                const TrbRgba *c,
                double         width)
{
  cairo_surface_t *px;
  guint32 *data;
  guint i;

  if (!dc->swatches_ok || c->a != 1.0 || width >= 3)
    {
      trb_render_set_color (dc->cr, c);
      return;
    }
  for (i = 0; i < dc->n_swatches; i++)
    if (memcmp (&dc->swatch_colors[i], c, sizeof *c) == 0)
      {
        cairo_set_source (dc->cr, dc->swatches[i]);
        return;
      }
  if (dc->n_swatches == G_N_ELEMENTS (dc->swatches))
    {
      trb_render_set_color (dc->cr, c);
      return;
    }

  /* the channels as cairo hands a solid colour to pixman: 16 bits, rounded, then the top 8 */
  px = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 1, 1);
  cairo_surface_flush (px);
  data = (guint32 *) cairo_image_surface_get_data (px);
  data[0] = 0xff000000u | ((guint32) (c->r * 65535.0 + 0.5) >> 8) << 16 |
            ((guint32) (c->g * 65535.0 + 0.5) >> 8) << 8 | (guint32) (c->b * 65535.0 + 0.5) >> 8;
  cairo_surface_mark_dirty (px);
  dc->swatches[i] = cairo_pattern_create_for_surface (px);
  cairo_pattern_set_extend (dc->swatches[i], CAIRO_EXTEND_REPEAT);
  cairo_surface_destroy (px);
  dc->swatch_colors[i] = *c;
  dc->n_swatches++;
  cairo_set_source (dc->cr, dc->swatches[i]);
}

/* Text through the scene's cache of laid-out text. */
static double
draw_text (DrawContext *dc,
           const char  *text,
           double       size,
           gboolean     bold,
           double       x,
           double       y,
           double       ax,
           double       ay,
           double      *height)
{
  return trb_render_text_cached (dc->texts, dc->cr, dc->style, text, size, bold, x, y, ax, ay,
                                 height);
}

static double
text_width (DrawContext *dc,
            const char  *text,
            double       size,
            gboolean     bold)
{
  return trb_render_text_width_cached (dc->texts, dc->cr, dc->style, text, size, bold);
}

static gboolean
is_selected (const DrawContext *dc,
             gconstpointer      object)
{
  return dc->options->selection != NULL &&
         g_hash_table_contains (dc->options->selection, object);
}

static void
path_points (const DrawContext *dc,
             const GArray      *points,
             gboolean           close)
{
  for (guint i = 0; points != NULL && i < points->len; i++)
    {
      const TrbFramePoint *p = &g_array_index (points, TrbFramePoint, i);
      double x, y;

      trb_plan_view_to_device (dc->view, p->x, p->y, &x, &y);
      if (i == 0)
        cairo_move_to (dc->cr, x, y);
      else
        cairo_line_to (dc->cr, x, y);
    }
  if (close)
    cairo_close_path (dc->cr);
}

static gboolean
points_visible (const DrawContext *dc,
                const GArray      *points)
{
  TrbPlanBounds b;

  trb_plan_bounds_init (&b);
  bounds_add_points (&b, points);
  return !trb_plan_bounds_is_empty (&b) &&
         b.max_x >= dc->visible.min_x && b.min_x <= dc->visible.max_x &&
         b.max_y >= dc->visible.min_y && b.min_y <= dc->visible.max_y;
}

static void
centroid (const GArray *points,
          double       *x,
          double       *y)
{
  double a = 0, cx = 0, cy = 0;

  *x = *y = 0;
  if (points == NULL || points->len == 0)
    return;
  for (guint i = 0, j = points->len - 1; i < points->len; j = i++)
    {
      const TrbFramePoint *p = &g_array_index (points, TrbFramePoint, j);
      const TrbFramePoint *q = &g_array_index (points, TrbFramePoint, i);
      double c = p->x * q->y - q->x * p->y;

      a += c;
      cx += (p->x + q->x) * c;
      cy += (p->y + q->y) * c;
    }
  if (fabs (a) < 1e-12)
    {
      for (guint i = 0; i < points->len; i++)
        {
          *x += g_array_index (points, TrbFramePoint, i).x / points->len;
          *y += g_array_index (points, TrbFramePoint, i).y / points->len;
        }
      return;
    }
  *x = cx / (3 * a);
  *y = cy / (3 * a);
}

static gboolean
member_visible (const DrawContext *dc,
                const TrbMember   *m)
{
  return MAX (m->start.x, m->end.x) >= dc->visible.min_x &&
         MIN (m->start.x, m->end.x) <= dc->visible.max_x &&
         MAX (m->start.y, m->end.y) >= dc->visible.min_y &&
         MIN (m->start.y, m->end.y) <= dc->visible.max_y;
}

static gboolean
line_touches_box (const double         line[4],
                  const TrbPlanBounds *box)
{
  double ax = line[0], ay = line[1], bx = line[2], by = line[3];

  if (MAX (ax, bx) < box->min_x || MIN (ax, bx) > box->max_x ||
      MAX (ay, by) < box->min_y || MIN (ay, by) > box->max_y)
    return FALSE;
  return segment_touches_rect (ax, ay, bx, by, box);
}

#define NEAR_CELL 64.0

/* The cells of the near grid a device box covers, clamped to the grid. */
static void
near_cells (const DrawContext *dc,
            double             min_x,
            double             min_y,
            double             max_x,
            double             max_y,
            int                cells[4])
{
  cells[0] = CLAMP ((int) floor ((min_x - dc->near_box.min_x) / NEAR_CELL), 0, dc->near_nx - 1);
  cells[1] = CLAMP ((int) floor ((min_y - dc->near_box.min_y) / NEAR_CELL), 0, dc->near_ny - 1);
  cells[2] = CLAMP ((int) floor ((max_x - dc->near_box.min_x) / NEAR_CELL), 0, dc->near_nx - 1);
  cells[3] = CLAMP ((int) floor ((max_y - dc->near_box.min_y) / NEAR_CELL), 0, dc->near_ny - 1);
}

static void
near_grid_build (DrawContext *dc)
{
  guint n = dc->scene->floor->members->len;
  /* the padding of dc->visible on the device, less a unit for rounding */
  double pad = MAX (6 * dc->fs - 1, 0);
  guint n_cells, total = 0;
  g_autofree guint *fill = NULL;

  dc->near_box = (TrbPlanBounds) { dc->device.min_x - pad, dc->device.min_y - pad,
                                   dc->device.max_x + pad, dc->device.max_y + pad };
  dc->near_nx = MAX (1, (int) ceil ((dc->near_box.max_x - dc->near_box.min_x) / NEAR_CELL));
  dc->near_ny = MAX (1, (int) ceil ((dc->near_box.max_y - dc->near_box.min_y) / NEAR_CELL));
  n_cells = dc->near_nx * dc->near_ny;
  dc->near_first = g_new0 (guint, n_cells + 1);

  /* counted, then placed: each line in every cell its box covers */
  for (int pass = 0; pass < 2; pass++)
    {
      for (guint i = 0; i < n; i++)
        {
          const double *l = dc->line + 4 * i;
          int c[4];

          if (!dc->vis[i])
            continue;
          near_cells (dc, MIN (l[0], l[2]), MIN (l[1], l[3]), MAX (l[0], l[2]),
                      MAX (l[1], l[3]), c);
          for (int cy = c[1]; cy <= c[3]; cy++)
            for (int cx = c[0]; cx <= c[2]; cx++)
              {
                guint cell = cy * dc->near_nx + cx;

                if (pass == 0)
                  dc->near_first[cell + 1]++;
                else
                  dc->near_index[fill[cell]++] = i;
              }
        }
      if (pass == 0)
        {
          for (guint c = 0; c < n_cells; c++)
            dc->near_first[c + 1] += dc->near_first[c];
          total = dc->near_first[n_cells];
          dc->near_index = g_new (guint, MAX (total, 1));
          fill = g_memdup2 (dc->near_first, sizeof (guint) * n_cells);
        }
    }
}

/* Does a device rectangle meet the middle of a member's line (device coordinates, line[4]),
 * where its mark, section and ratio are drawn (a stretch of about seven text heights)? */
static gboolean
label_zone_touches_box (DrawContext         *dc,
                        const double         line[4],
                        const TrbPlanBounds *box)
{
  double half = 3.5 * dc->fs;
  double len = hypot (line[2] - line[0], line[3] - line[1]);
  double mx = (line[0] + line[2]) / 2, my = (line[1] + line[3]) / 2, zone[4];

  if (len <= 2 * half)
    return line_touches_box (line, box);
  zone[0] = mx - (line[2] - line[0]) / len * half;
  zone[1] = my - (line[3] - line[1]) / len * half;
  zone[2] = mx + (line[2] - line[0]) / len * half;
  zone[3] = my + (line[3] - line[1]) / len * half;
  return line_touches_box (zone, box);
}

/* Does a device rectangle cross a member's line (labels_only: the middle of it, where the
 * member's labels are)? A box inside the drawing rectangle padded for labels can only meet
 * the members drawn: those in the cells of the near grid it covers. */
static gboolean
box_meets_members (DrawContext         *dc,
                   const TrbPlanBounds *box,
                   gboolean             labels_only)
{
  const TrbFloor *floor = dc->scene->floor;

  if (dc->near_first == NULL)
    near_grid_build (dc);

  if (box->min_x >= dc->near_box.min_x && box->max_x <= dc->near_box.max_x &&
      box->min_y >= dc->near_box.min_y && box->max_y <= dc->near_box.max_y)
    {
      int c[4];

      near_cells (dc, box->min_x, box->min_y, box->max_x, box->max_y, c);
      for (int cy = c[1]; cy <= c[3]; cy++)
        for (int cx = c[0]; cx <= c[2]; cx++)
          {
            guint cell = cy * dc->near_nx + cx;

            for (guint k = dc->near_first[cell]; k < dc->near_first[cell + 1]; k++)
              {
                const double *line = dc->line + 4 * dc->near_index[k];

                if (labels_only ? label_zone_touches_box (dc, line, box)
                                : line_touches_box (line, box))
                  return TRUE;
              }
          }
      return FALSE;
    }

  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      double line[4];

      trb_plan_view_to_device (dc->view, m->start.x, m->start.y, &line[0], &line[1]);
      trb_plan_view_to_device (dc->view, m->end.x, m->end.y, &line[2], &line[3]);
      if (labels_only ? label_zone_touches_box (dc, line, box) : line_touches_box (line, box))
        return TRUE;
    }
  return FALSE;
}

static gboolean
box_hits_member (DrawContext         *dc,
                 const TrbPlanBounds *box)
{
  return box_meets_members (dc, box, FALSE);
}

static gboolean
box_hits_member_label (DrawContext         *dc,
                       const TrbPlanBounds *box)
{
  return box_meets_members (dc, box, TRUE);
}

static gboolean
boxes_overlap (const TrbPlanBounds *a,
               const TrbPlanBounds *b)
{
  return a->min_x < b->max_x && b->min_x < a->max_x && a->min_y < b->max_y &&
         b->min_y < a->max_y;
}

/* Moves a label centred at (x, y) to the nearest of a few places nearby, inside its polygon,
 * clear of the members' lines and of the labels along them (a band of two text heights each
 * side), and of the labels placed before it (taken, device boxes, to which it adds its own);
 * where there is no such place, it stays. */
static void
label_clear_of_members (DrawContext  *dc,
                        const GArray *polygon,
                        const char   *text,
                        double        size,
                        GArray       *taken,
                        double       *x,
                        double       *y)
{
  double w = text_width (dc, text, size, FALSE);
  double h = size * 1.3;
  double band = 1.6 * dc->fs;
  TrbPlanBounds mine = { *x - w / 2, *y - h / 2, *x + w / 2, *y + h / 2 };
  gboolean have_fallback = FALSE, fallback_clear_of_labels = FALSE;
  double fx = *x, fy = *y;

  for (int k = 0; k < 25; k++)
    {
      /* 0, +1, -1, +2, -2, ... steps of a line height, then sideways */
      int step = (k + 1) / 2 * (k % 2 == 1 ? 1 : -1);
      double cx = *x + (k >= 13 ? (k % 2 == 1 ? 1 : -1) * w * 0.6 : 0);
      double cy = *y + (k >= 13 ? (step % 7) : step) * h;
      TrbPlanBounds box = { cx - w / 2, cy - h / 2, cx + w / 2, cy + h / 2 };
      TrbPlanBounds wide = { box.min_x - band, box.min_y - band, box.max_x + band,
                             box.max_y + band };
      gboolean clear = TRUE;
      double px, py;

      trb_plan_view_to_plan (dc->view, cx, cy, &px, &py);
      if (k > 0 && !polygon_contains (polygon, px, py))
        continue;
      for (guint i = 0; clear && i < taken->len; i++)
        clear = !boxes_overlap (&box, &g_array_index (taken, TrbPlanBounds, i));
      if (clear && !fallback_clear_of_labels)
        {
          /* in a tight run of joists no place is clear of them: then the nearest place clear
           * of the other load labels and of the members' own labels (at their middles), or
           * failing that of the load labels alone, on its own background */
          gboolean off_labels = !box_hits_member_label (dc, &wide);

          if (!have_fallback || off_labels)
            {
              have_fallback = TRUE;
              fallback_clear_of_labels = off_labels;
              fx = cx;
              fy = cy;
            }
        }
      if (clear && !box_hits_member (dc, &wide))
        {
          *x = cx;
          *y = cy;
          mine = box;
          g_array_append_val (taken, mine);
          return;
        }
    }
  *x = fx;
  *y = fy;
  mine = (TrbPlanBounds) { fx - w / 2, fy - h / 2, fx + w / 2, fy + h / 2 };
  g_array_append_val (taken, mine);
}

/* The side of a line load its load line, arrows and label are drawn on: 1 for the right of
 * the direction its points run on the device (the left in plan, whose y runs up), -1 for the
 * other. The side away from the middle of the floor, so that a load along an edge (a rail, a
 * wall on the edge joist) is drawn outside the framing, clear of the members and their
 * labels; the same side along the whole line. */
static double
line_load_side (DrawContext       *dc,
                const TrbLineLoad *l)
{
  const TrbPlanBounds *b = &dc->scene->bounds;
  double cx, cy, sum = 0;

  trb_plan_view_to_device (dc->view, (b->min_x + b->max_x) / 2, (b->min_y + b->max_y) / 2,
                           &cx, &cy);
  for (guint k = 0; k + 1 < l->points->len; k++)
    {
      const TrbFramePoint *a = &g_array_index (l->points, TrbFramePoint, k);
      const TrbFramePoint *p = &g_array_index (l->points, TrbFramePoint, k + 1);
      double ax, ay, bx, by;

      trb_plan_view_to_device (dc->view, a->x, a->y, &ax, &ay);
      trb_plan_view_to_device (dc->view, p->x, p->y, &bx, &by);
      /* the offset (by - ay, ax - bx), a segment's length long, against the way out */
      sum += (by - ay) * ((ax + bx) / 2 - cx) + (ax - bx) * ((ay + by) / 2 - cy);
    }
  return sum < 0 ? -1.0 : 1.0;
}

/* A line load's label: its text, where it sits (device, the middle of the text's edge nearest
 * the load line) and its angle, on the given side of the line (line_load_side()): a quarter
 * along the first segment (clear of the middles, where the labels of the member under it and
 * of its neighbours are; nearer the middle where the line is short), beyond the load line.
 * FALSE when no segment has a length. */
static gboolean
line_load_label (DrawContext       *dc,
                 const TrbLineLoad *l,
                 char             **text,
                 double            *lx,
                 double            *ly,
                 double            *angle,
                 double             side)
{
  double alen = 1.6 * dc->fs;
  g_autofree char *w = trb_units_format (l->w, TRB_DIM_LINE_LOAD, dc->scene->units);

  *text = NULL;
  for (guint k = 0; k + 1 < l->points->len; k++)
    {
      const TrbFramePoint *a = &g_array_index (l->points, TrbFramePoint, k);
      const TrbFramePoint *b = &g_array_index (l->points, TrbFramePoint, k + 1);
      double ax, ay, bx, by, len, ux, uy, at;

      trb_plan_view_to_device (dc->view, a->x, a->y, &ax, &ay);
      trb_plan_view_to_device (dc->view, b->x, b->y, &bx, &by);
      len = hypot (bx - ax, by - ay);
      if (len < 1e-9)
        continue;
      ux = (bx - ax) / len;
      uy = (by - ay) / len;
      *text = g_strdup_printf ("%s %s%s%s", trb_load_case_name (l->lcase), w,
                               l->label != NULL ? " " : "", l->label != NULL ? l->label : "");
      at = MIN (0.5 * len, MAX (0.25 * len, 0.5 * text_width (dc, *text, dc->fs * 0.9, FALSE)
                                            + dc->fs));
      *lx = ax + ux * at + side * uy * alen;
      *ly = ay + uy * at - side * ux * alen;
      *angle = atan2 (uy, ux);
      return TRUE;
    }
  return FALSE;
}

/* The device box around a line load's label, for the area loads' labels to keep clear of. */
static void
line_load_label_box (DrawContext       *dc,
                     const TrbLineLoad *l,
                     GArray            *taken)
{
  g_autofree char *text = NULL;
  double side = line_load_side (dc, l);
  double lx, ly, angle, w, h, c, s;
  TrbPlanBounds box;

  if (!line_load_label (dc, l, &text, &lx, &ly, &angle, side))
    return;
  w = text_width (dc, text, dc->fs * 0.9, FALSE);
  h = dc->fs * 0.9 * 1.3;
  /* the text runs along the line, w long, and h away from it on the far side (flipped to
   * read upright or not, it lies on the same side): bound the rotated rectangle around its
   * centre */
  c = fabs (cos (angle));
  s = fabs (sin (angle));
  lx += side * sin (angle) * h / 2;
  ly -= side * cos (angle) * h / 2;
  box.min_x = lx - (c * w + s * h) / 2;
  box.max_x = lx + (c * w + s * h) / 2;
  box.min_y = ly - (s * w + c * h) / 2;
  box.max_y = ly + (s * w + c * h) / 2;
  g_array_append_val (taken, box);
}

static gboolean
same_points (const GArray *a,
             const GArray *b)
{
  if (a == NULL || b == NULL)
    return a == b;
  return a->len == b->len &&
         memcmp (a->data, b->data, a->len * sizeof (TrbFramePoint)) == 0;
}

static void
draw_area_loads (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;

  for (guint i = 0, next; i < floor->area_loads->len; i = next)
    {
      const TrbAreaLoad *a = g_ptr_array_index (floor->area_loads, i);
      TrbRgba c;
      guint n = 1;

      next = i + 1;
      if (!points_visible (dc, a->points))
        continue;
      trb_render_case_color (dc->style, a->lcase, &c);

      /* Loads of one colour over the same outline one after the other (an office's live load
       * and its partition allowance) get one fill of their opacities together, 1 - 0.9^n:
       * painting over with one colour gives the same whatever the order, so their shades and
       * outlines come out as before (within a level in 255 on the outline's partly covered
       * pixels), with a pass over the shaded pixels fewer each. Their outlines stay one stroke
       * each: at 0.6 opacity, two strokes' edge pixels differ visibly from one of both. */
      for (; next < floor->area_loads->len; next++, n++)
        {
          const TrbAreaLoad *b = g_ptr_array_index (floor->area_loads, next);
          TrbRgba cb;

          trb_render_case_color (dc->style, b->lcase, &cb);
          if (memcmp (&cb, &c, sizeof c) != 0 || !same_points (a->points, b->points))
            break;
        }
      path_points (dc, a->points, TRUE);
      c.a = 1 - pow (1 - 0.10, n);
      trb_render_set_color (cr, &c);
      cairo_fill (cr);

      for (guint k = i; k < next; k++)
        {
          const TrbAreaLoad *b = g_ptr_array_index (floor->area_loads, k);

          path_points (dc, b->points, TRUE);
          c.a = is_selected (dc, b) ? 1.0 : 0.6;
          trb_render_set_color (cr, &c);
          cairo_set_line_width (cr, is_selected (dc, b) ? 2 * dc->lw : 0.5 * dc->lw);
          {
            double dash[] = { 4 * dc->lw, 2 * dc->lw };

            cairo_set_dash (cr, dash, 2, 0);
          }
          cairo_stroke (cr);
          cairo_set_dash (cr, NULL, 0, 0);
        }
    }

  /* the labels after every shade, so that no shade covers a label; stacked per load case at
   * the centroid, which loads that share a polygon also share */
  if (!(dc->options->layers & TRB_PLAN_LAYER_LABELS) && !dc->style->print)
    return;
  {
    g_autoptr(GHashTable) placed = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
    g_autoptr(GArray) taken = g_array_new (FALSE, FALSE, sizeof (TrbPlanBounds));

    for (guint i = 0; i < floor->line_loads->len; i++)
      {
        const TrbLineLoad *l = g_ptr_array_index (floor->line_loads, i);

        if (points_visible (dc, l->points))
          line_load_label_box (dc, l, taken);
      }
    for (guint i = 0; i < floor->area_loads->len; i++)
      {
        const TrbAreaLoad *a = g_ptr_array_index (floor->area_loads, i);
        g_autofree char *p = trb_units_format (a->pressure, TRB_DIM_AREA_LOAD, dc->scene->units);
        g_autofree char *text = NULL;
        g_autofree char *key = NULL;
        double x, y, dx, dy;
        int n;
        TrbRgba c;

        if (!points_visible (dc, a->points))
          continue;
        centroid (a->points, &x, &y);
        trb_plan_view_to_device (dc->view, x, y, &dx, &dy);
        key = g_strdup_printf ("%.0f,%.0f", dx, dy);
        n = GPOINTER_TO_INT (g_hash_table_lookup (placed, key));
        g_hash_table_insert (placed, g_steal_pointer (&key), GINT_TO_POINTER (n + 1));
        /* Translators: said after an area load that is a partition allowance,
         * "L 15 psf partitions" */
        text = g_strdup_printf ("%s %s%s%s%s%s", trb_load_case_name (a->lcase), p,
                                a->kind == TRB_AREA_LOAD_PARTITION &&
                                (a->label == NULL || strstr (a->label, "partition") == NULL)
                                ? " " : "",
                                a->kind == TRB_AREA_LOAD_PARTITION &&
                                (a->label == NULL || strstr (a->label, "partition") == NULL)
                                ? _("partitions") : "",
                                a->label != NULL ? " " : "", a->label != NULL ? a->label : "");
        dy += n * dc->fs * 1.3;
        label_clear_of_members (dc, a->points, text, dc->fs * 0.95, taken, &dx, &dy);
        trb_render_case_color (dc->style, a->lcase, &c);
        /* the case hue is too light for text on white: darken it */
        c.r *= 0.6;
        c.g *= 0.6;
        c.b *= 0.6;
        {
          /* a paper-coloured ground, so that the label reads over the lines under it */
          double tw = text_width (dc, text, dc->fs * 0.95, FALSE);
          TrbRgba ground = dc->paper;

          ground.a = 0.85;
          trb_render_set_color (dc->cr, &ground);
          cairo_rectangle (dc->cr, dx - tw / 2 - 1.5, dy - dc->fs * 0.65, tw + 3, dc->fs * 1.3);
          cairo_fill (dc->cr);
        }
        trb_render_set_color (dc->cr, &c);
        draw_text (dc, text, dc->fs * 0.95, FALSE, dx, dy, 0.5, 0.5, NULL);
      }
  }
}

static void
draw_openings (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;

  for (guint i = 0; i < floor->openings->len; i++)
    {
      const TrbOpening *o = g_ptr_array_index (floor->openings, i);
      TrbPlanBounds b;
      double x0, y0, x1, y1;

      if (!points_visible (dc, o->points))
        continue;
      path_points (dc, o->points, TRUE);
      set_line_color (dc, &dc->paper, INFINITY);
      cairo_fill_preserve (cr);
      set_line_color (dc, &dc->ink, 0.5 * dc->lw);
      cairo_set_line_width (cr, 0.5 * dc->lw);
      cairo_stroke (cr);

      /* the trade's mark for a hole: its bounding box crossed */
      trb_plan_bounds_init (&b);
      bounds_add_points (&b, o->points);
      trb_plan_view_to_device (dc->view, b.min_x, b.min_y, &x0, &y0);
      trb_plan_view_to_device (dc->view, b.max_x, b.max_y, &x1, &y1);
      cairo_save (cr);
      path_points (dc, o->points, TRUE);
      cairo_clip (cr);
      cairo_move_to (cr, x0, y0);
      cairo_line_to (cr, x1, y1);
      cairo_move_to (cr, x0, y1);
      cairo_line_to (cr, x1, y0);
      cairo_set_line_width (cr, 0.35 * dc->lw);
      cairo_stroke (cr);
      cairo_restore (cr);
    }
}

static void
draw_grids (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;
  double r = dc->fs * 1.0;
  TrbRgba grey = { 0.45, 0.45, 0.45, 1.0 };

  if (dc->style->dark && !dc->style->print)
    grey = (TrbRgba) { 0.6, 0.6, 0.6, 1.0 };

  for (guint i = 0; i < floor->grids->len; i++)
    {
      const TrbGridLine *g = g_ptr_array_index (floor->grids, i);
      double ax, ay, bx, by, ux, uy, len;
      /* the trade's centre line: long dash, short dash */
      double dash[] = { 6 * dc->fs / 7.0 * 2, 1.5 * dc->fs / 7.0 * 2, 1.5 * dc->fs / 7.0 * 2,
                        1.5 * dc->fs / 7.0 * 2 };

      trb_plan_view_to_device (dc->view, g->start.x, g->start.y, &ax, &ay);
      trb_plan_view_to_device (dc->view, g->end.x, g->end.y, &bx, &by);
      len = hypot (bx - ax, by - ay);
      if (len < 1e-9)
        continue;
      ux = (bx - ax) / len;
      uy = (by - ay) / len;

      set_line_color (dc, &grey, 0.35 * dc->lw);
      cairo_set_line_width (cr, 0.35 * dc->lw);
      cairo_set_dash (cr, dash, 4, 0);
      cairo_move_to (cr, ax, ay);
      cairo_line_to (cr, bx, by);
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);

      /* the name in a circle beyond each end */
      for (int e = 0; e < 2; e++)
        {
          double cx = e == 0 ? ax - ux * r : bx + ux * r;
          double cy = e == 0 ? ay - uy * r : by + uy * r;

          cairo_new_sub_path (cr);
          cairo_arc (cr, cx, cy, r, 0, 2 * G_PI);
          set_line_color (dc, &dc->paper, INFINITY);
          cairo_fill_preserve (cr);
          set_line_color (dc, &dc->ink, 0.5 * dc->lw);
          cairo_set_line_width (cr, 0.5 * dc->lw);
          cairo_stroke (cr);
          trb_render_set_color (cr, &dc->ink);
          draw_text (dc, g->name, dc->fs * 1.05, TRUE, cx, cy, 0.5, 0.5, NULL);
        }
    }
}

/* Where the line x + y = c (device units) crosses the convex quadrilateral quad: the range
 * [lo, hi] of x. FALSE when it misses. */
static gboolean
diagonal_in_quad (const double  quad[4][2],
                  double        c,
                  double       *lo,
                  double       *hi)
{
  double area = 0;

  *lo = -INFINITY;
  *hi = INFINITY;
  for (int k = 0; k < 4; k++)
    area += quad[k][0] * quad[(k + 1) % 4][1] - quad[(k + 1) % 4][0] * quad[k][1];
  for (int k = 0; k < 4; k++)
    {
      const double *p = quad[k], *r = quad[(k + 1) % 4];
      double ex = r[0] - p[0], ey = r[1] - p[1];
      /* the cross product of the edge with (x, c - x) - p, on the inside's side: A + B x */
      double sign = area >= 0 ? 1 : -1;
      double A = sign * (ex * (c - p[1]) + ey * p[0]);
      double B = -sign * (ex + ey);

      if (B == 0)
        {
          if (A < 0)
            return FALSE;
        }
      else if (B > 0)
        *lo = MAX (*lo, -A / B);
      else
        *hi = MIN (*hi, -A / B);
    }
  return *lo <= *hi;
}

static void
draw_walls (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;
  double h = wall_half (dc->view);

  for (guint i = 0; i < floor->walls->len; i++)
    {
      const TrbWall *w = g_ptr_array_index (floor->walls, i);

      if (!points_visible (dc, w->points))
        continue;

      if (is_selected (dc, w))
        {
          TrbRgba sel;

          trb_render_selection_color (dc->style, &sel);
          trb_render_set_color (cr, &sel);
          cairo_set_line_width (cr, 2 * h + 4 * dc->lw);
          cairo_set_line_join (cr, CAIRO_LINE_JOIN_ROUND);
          path_points (dc, w->points, FALSE);
          cairo_stroke (cr);
        }

      for (guint k = 0; k + 1 < w->points->len; k++)
        {
          const TrbFramePoint *a = &g_array_index (w->points, TrbFramePoint, k);
          const TrbFramePoint *b = &g_array_index (w->points, TrbFramePoint, k + 1);
          double ax, ay, bx, by, nx, ny, len, step;
          double x0, x1, y0, y1;

          trb_plan_view_to_device (dc->view, a->x, a->y, &ax, &ay);
          trb_plan_view_to_device (dc->view, b->x, b->y, &bx, &by);
          len = hypot (bx - ax, by - ay);
          if (len < 1e-9)
            continue;
          nx = -(by - ay) / len * h;
          ny = (bx - ax) / len * h;

          /* the band, outlined, with the trade's 45-degree hatch inside */
          cairo_save (cr);
          cairo_move_to (cr, ax + nx, ay + ny);
          cairo_line_to (cr, bx + nx, by + ny);
          cairo_line_to (cr, bx - nx, by - ny);
          cairo_line_to (cr, ax - nx, ay - ny);
          cairo_close_path (cr);
          set_line_color (dc, &dc->paper, INFINITY);
          cairo_fill_preserve (cr);
          cairo_clip_preserve (cr);
          set_line_color (dc, &dc->ink, 0.6 * dc->lw);
          cairo_set_line_width (cr, 0.6 * dc->lw);
          cairo_stroke (cr);

          /* The hatch lines are x + y = c for c from the band's box corner (x0 + y0) in
           * steps; each is drawn only where it crosses the band and the drawing rectangle, a
           * little past them for the clip to cut: drawn across the whole box, a long wall's
           * hatch was hundreds of lines a thousand pixels long, most of the plan's redraw. */
          x0 = MIN (ax, bx) - h;
          x1 = MAX (ax, bx) + h;
          y0 = MIN (ay, by) - h;
          y1 = MAX (ay, by) + h;
          step = MAX (h * 0.9, 2.0);
          {
            double quad[4][2] = { { ax + nx, ay + ny }, { bx + nx, by + ny },
                                  { bx - nx, by - ny }, { ax - nx, ay - ny } };
            double hw = 0.15 * dc->lw, ext = 2 * hw + 1;
            double c_lo = MAX (x0 + y0, dc->device.min_x + dc->device.min_y - ext);
            double c_hi = MIN (x1 + y1, dc->device.max_x + dc->device.max_y + ext);
            double k0 = MAX (0, ceil ((c_lo - (x0 + y0)) / step));

            for (double k = k0; x0 + y0 + k * step < c_hi; k++)
              {
                double c = x0 + y0 + k * step, lo, hi;

                if (!diagonal_in_quad (quad, c, &lo, &hi))
                  continue;
                lo = MAX (lo, MAX (dc->device.min_x, c - dc->device.max_y) - ext) - ext;
                hi = MIN (hi, MIN (dc->device.max_x, c - dc->device.min_y) + ext) + ext;
                if (lo >= hi)
                  continue;
                cairo_move_to (cr, lo, c - lo);
                cairo_line_to (cr, hi, c - hi);
              }
            cairo_set_line_width (cr, hw * 2);
          }
          cairo_stroke (cr);
          cairo_restore (cr);
        }

      if (w->points->len >= 2 && dc->options->layers & TRB_PLAN_LAYER_LABELS &&
          w->id != NULL)
        {
          const TrbFramePoint *a = &g_array_index (w->points, TrbFramePoint, 0);
          const TrbFramePoint *b = &g_array_index (w->points, TrbFramePoint, 1);
          double ax, ay, bx, by, ang;

          trb_plan_view_to_device (dc->view, a->x, a->y, &ax, &ay);
          trb_plan_view_to_device (dc->view, b->x, b->y, &bx, &by);
          ang = atan2 (by - ay, bx - ax);
          if (ang > G_PI / 2 + 1e-9 || ang <= -G_PI / 2 + 1e-9)
            ang += G_PI;
          cairo_save (cr);
          cairo_translate (cr, (ax + bx) / 2, (ay + by) / 2);
          cairo_rotate (cr, ang);
          trb_render_set_color (cr, &dc->ink);
          {
            g_autofree char *t = g_strdup_printf ("%s%s%s", w->id,
                                                  w->material != NULL ? " " : "",
                                                  w->material != NULL ? w->material : "");

            draw_text (dc, t, dc->fs * 0.9, FALSE, 0, h + 1.5 * dc->lw, 0.5, 0, NULL);
          }
          cairo_restore (cr);
        }
    }
}

/* A revision cloud: scallops around the member's rectangle, padded. */
static void
draw_cloud (DrawContext     *dc,
            const TrbMember *m)
{
  cairo_t *cr = dc->cr;
  double ax, ay, bx, by, ux, uy, nx, ny, len, pad = 2.2 * dc->fs;
  double corners[4][2];
  double cx, cy, bump = 0.9 * dc->fs;

  trb_plan_view_to_device (dc->view, m->start.x, m->start.y, &ax, &ay);
  trb_plan_view_to_device (dc->view, m->end.x, m->end.y, &bx, &by);
  len = hypot (bx - ax, by - ay);
  if (len < 1e-9)
    {
      ux = 1;
      uy = 0;
    }
  else
    {
      ux = (bx - ax) / len;
      uy = (by - ay) / len;
    }
  nx = -uy;
  ny = ux;
  pad = MAX (pad, 3 * dc->lw);
  corners[0][0] = ax - ux * pad + nx * pad;
  corners[0][1] = ay - uy * pad + ny * pad;
  corners[1][0] = bx + ux * pad + nx * pad;
  corners[1][1] = by + uy * pad + ny * pad;
  corners[2][0] = bx + ux * pad - nx * pad;
  corners[2][1] = by + uy * pad - ny * pad;
  corners[3][0] = ax - ux * pad - nx * pad;
  corners[3][1] = ay - uy * pad - ny * pad;
  cx = (ax + bx) / 2;
  cy = (ay + by) / 2;

  cairo_new_path (cr);
  for (int s = 0; s < 4; s++)
    {
      const double *p = corners[s];
      const double *q = corners[(s + 1) % 4];
      double sl = hypot (q[0] - p[0], q[1] - p[1]);
      int n = MAX (1, (int) ceil (sl / (2 * bump)));

      for (int k = 0; k < n; k++)
        {
          double x0 = p[0] + (q[0] - p[0]) * k / n, y0 = p[1] + (q[1] - p[1]) * k / n;
          double x1 = p[0] + (q[0] - p[0]) * (k + 1) / n;
          double y1 = p[1] + (q[1] - p[1]) * (k + 1) / n;
          double mx = (x0 + x1) / 2, my = (y0 + y1) / 2;
          double r = hypot (x1 - x0, y1 - y0) / 2;
          double t0 = atan2 (y0 - my, x0 - mx);
          double tm = t0 + G_PI / 2;
          /* the scallop bulges away from the member: pick the arc direction that does */
          gboolean outward = hypot (mx + r * cos (tm) - cx, my + r * sin (tm) - cy) >
                             hypot (mx - cx, my - cy);

          if (outward)
            cairo_arc (cr, mx, my, r, t0, t0 + G_PI);
          else
            cairo_arc_negative (cr, mx, my, r, t0, t0 - G_PI);
        }
    }
  cairo_close_path (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  if (!dc->style->print && dc->style->dark)
    trb_render_set_color (cr, &dc->ink);
  cairo_set_line_width (cr, 0.8 * dc->lw);
  cairo_stroke (cr);
}

static const char *
member_section (const TrbMember       *m,
                const TrbMemberResult *r)
{
  if (r != NULL && r->section[0] != '\0')
    return r->section;
  return m->section != NULL ? m->section : "";
}

/* Lines thicker for what carries more: girders, beams, joists. */
static double
role_width (TrbFrameRole role)
{
  switch (role)
    {
    case TRB_FRAME_ROLE_GIRDER:
      return 1.6;
    case TRB_FRAME_ROLE_JOIST:
      return 0.6;
    case TRB_FRAME_ROLE_BEAM:
    default:
      return 1.0;
    }
}

static void
member_path (DrawContext     *dc,
             const TrbMember *m)
{
  double ax, ay, bx, by;

  trb_plan_view_to_device (dc->view, m->start.x, m->start.y, &ax, &ay);
  trb_plan_view_to_device (dc->view, m->end.x, m->end.y, &bx, &by);
  cairo_move_to (dc->cr, ax, ay);
  cairo_line_to (dc->cr, bx, by);
}

/* The status text the CLI's table uses, so the plan and the table read alike. */
static const char *
status_word (const TrbMemberResult *r)
{
  if (r == NULL)
    return _("not solved");
  switch (r->status)
    {
    case TRB_STATUS_PASS:
      return _("passes");
    case TRB_STATUS_FAIL:
      return _("FAILS");
    case TRB_STATUS_UNSTABLE:
      return _("UNSTABLE");
    case TRB_STATUS_UNSUPPORTED:
      return _("UNSUPPORTED");
    case TRB_STATUS_NOT_DESIGNED:
      return _("not designed");
    case TRB_STATUS_ERROR:
    default:
      return _("ERROR");
    }
}

static void
draw_flag (DrawContext *dc,
           double       x,
           double       y,
           const TrbRgba *color)
{
  cairo_t *cr = dc->cr;
  double s = dc->fs * 0.75;

  /* a warning triangle with "!": the failure mark that survives black-and-white */
  cairo_move_to (cr, x, y - s);
  cairo_line_to (cr, x + s * 0.95, y + s * 0.65);
  cairo_line_to (cr, x - s * 0.95, y + s * 0.65);
  cairo_close_path (cr);
  trb_render_set_color (cr, &dc->paper);
  cairo_fill_preserve (cr);
  trb_render_set_color (cr, color);
  cairo_set_line_width (cr, 0.6 * dc->lw);
  cairo_stroke (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  if (dc->style->dark && !dc->style->print)
    trb_render_set_color (cr, &dc->ink);
  draw_text (dc, "!", s * 1.1, TRUE, x, y + s * 0.05, 0.5, 0.5, NULL);
}

/* One label: a member's, or a joist run's. */
typedef struct
{
  guint           member;      /* the member it sits on (the run's middle one) */
  char           *top;         /* mark and section */
  char           *bottom;      /* ratio and status */
  TrbRenderStatus status;
  int             priority;    /* lower first: failures, then runs, girders, beams, joists */
} Label;

static void
label_clear (Label *l)
{
  g_free (l->top);
  g_free (l->bottom);
}

static int
cmp_label (gconstpointer a,
           gconstpointer b)
{
  const Label *x = a, *y = b;

  if (x->priority != y->priority)
    return x->priority - y->priority;
  return (x->member > y->member) - (x->member < y->member);
}

static char *
ratio_text (const TrbMemberResult *r)
{
  if (r != NULL && !isnan (r->ratio))
    return g_strdup_printf ("%.3f%s%s", r->ratio, r->status != TRB_STATUS_PASS ? " " : "",
                            r->status != TRB_STATUS_PASS ? status_word (r) : "");
  return g_strdup (status_word (r));
}

typedef struct
{
  guint  member;
  double along;   /* the midpoint's distance along the run's normal, device units */
} RunEntry;

static int
cmp_run_entry (gconstpointer a,
               gconstpointer b)
{
  const RunEntry *x = a, *y = b;

  return (x->along > y->along) - (x->along < y->along);
}

/* Joists of one run, of one section, that pass: drawn too close together for a label each
 * (the trade labels such a run once), they get one label on their middle member, with the
 * first and last marks, the count and the largest ratio. Returns the labels, and marks the
 * members so labelled in skip. */
static void
run_labels (DrawContext *dc,
            const guint8 *vis,
            guint8       *skip,
            GArray       *labels)
{
  const TrbFloor *floor = dc->scene->floor;
  g_autoptr(GHashTable) runs = g_hash_table_new_full (g_str_hash, g_str_equal, g_free,
                                                      (GDestroyNotify) g_array_unref);
  GHashTableIter it;
  gpointer key, value;

  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      const TrbMemberResult *r;
      GArray *run;
      char *k;

      if (!vis[i] || m->group == NULL)
        continue;
      r = trb_plan_scene_lookup_result (dc->scene, m);
      /* a member that does not pass keeps its own label */
      if (r == NULL || r->status != TRB_STATUS_PASS)
        continue;
      k = g_strdup_printf ("%s\n%s\n%d", m->group, member_section (m, r), m->role);
      run = g_hash_table_lookup (runs, k);
      if (run == NULL)
        {
          run = g_array_new (FALSE, FALSE, sizeof (RunEntry));
          g_hash_table_insert (runs, k, run);
        }
      else
        g_free (k);
      {
        RunEntry e = { i, 0 };

        g_array_append_val (run, e);
      }
    }

  g_hash_table_iter_init (&it, runs);
  while (g_hash_table_iter_next (&it, &key, &value))
    {
      GArray *run = value;
      const TrbMember *first;
      double ax, ay, bx, by, len, nx, ny, gap = INFINITY, worst = -INFINITY;
      const TrbMemberResult *worst_r = NULL;
      const TrbMember *lo, *hi, *mid;
      Label l = { 0 };

      if (run->len < 3)
        continue;
      first = g_ptr_array_index (floor->members, g_array_index (run, RunEntry, 0).member);
      trb_plan_view_to_device (dc->view, first->start.x, first->start.y, &ax, &ay);
      trb_plan_view_to_device (dc->view, first->end.x, first->end.y, &bx, &by);
      len = hypot (bx - ax, by - ay);
      if (len < 1e-9)
        continue;
      nx = -(by - ay) / len;
      ny = (bx - ax) / len;
      for (guint k = 0; k < run->len; k++)
        {
          RunEntry *e = &g_array_index (run, RunEntry, k);
          const TrbMember *m = g_ptr_array_index (floor->members, e->member);
          double mx, my;

          trb_plan_view_to_device (dc->view, (m->start.x + m->end.x) / 2,
                                   (m->start.y + m->end.y) / 2, &mx, &my);
          e->along = mx * nx + my * ny;
        }
      g_array_sort (run, cmp_run_entry);
      for (guint k = 1; k < run->len; k++)
        gap = MIN (gap, g_array_index (run, RunEntry, k).along -
                        g_array_index (run, RunEntry, k - 1).along);
      /* room for a label above and below each line: leave them one each */
      if (gap >= 3.2 * dc->fs)
        continue;

      for (guint k = 0; k < run->len; k++)
        {
          guint i = g_array_index (run, RunEntry, k).member;
          const TrbMember *m = g_ptr_array_index (floor->members, i);
          const TrbMemberResult *r = trb_plan_scene_lookup_result (dc->scene, m);

          skip[i] = 1;
          if (r != NULL && !isnan (r->ratio) && r->ratio > worst)
            {
              worst = r->ratio;
              worst_r = r;
            }
        }
      lo = g_ptr_array_index (floor->members, g_array_index (run, RunEntry, 0).member);
      hi = g_ptr_array_index (floor->members,
                              g_array_index (run, RunEntry, run->len - 1).member);
      l.member = g_array_index (run, RunEntry, run->len / 2).member;
      mid = g_ptr_array_index (floor->members, l.member);
      /* Translators: a joist run's label on the plan: its first and last marks, how many
       * and the section, "J1 to J42 (42) 2x12" */
      l.top = g_strdup_printf (_("%s to %s (%u) %s"), lo->id, hi->id, run->len,
                               member_section (mid, trb_plan_scene_lookup_result (dc->scene,
                                                                                  mid)));
      /* Translators: the largest utilization ratio of a joist run, "max 0.986" */
      l.bottom = worst_r != NULL ? g_strdup_printf (_("max %.3f"), worst) : g_strdup ("");
      l.status = trb_render_status_of (worst_r);
      l.priority = 1;
      g_array_append_val (labels, l);
    }
}

/* The corners of a label's two lines, rotated onto the member, as a device box. */
static void
label_box (double         cx,
           double         cy,
           double         ang,
           double         half_w,
           double         above,
           double         below,
           TrbPlanBounds *box)
{
  double c = cos (ang), s = sin (ang);
  double pts[4][2] = { { -half_w, -above }, { half_w, -above }, { half_w, below },
                       { -half_w, below } };

  trb_plan_bounds_init (box);
  for (int k = 0; k < 4; k++)
    trb_plan_bounds_add (box, cx + c * pts[k][0] - s * pts[k][1],
                         cy + s * pts[k][0] + c * pts[k][1]);
}

static void
draw_member_labels (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;
  guint n = floor->members->len;
  const guint8 *vis = dc->vis;
  g_autofree guint8 *skip = NULL;
  g_autoptr(GArray) labels = NULL;
  g_autoptr(GArray) placed = NULL;

  /* labels, when there is room: mark and section above the line, ratio and status below */
  if (!(dc->options->layers & TRB_PLAN_LAYER_LABELS))
    return;
  /* beyond this many on the screen at once, labels are an unreadable grey: leave them out */
  if (!dc->style->print && dc->n_visible > 3000)
    return;
  skip = g_new0 (guint8, MAX (n, 1));
  labels = g_array_new (FALSE, TRUE, sizeof (Label));
  placed = g_array_new (FALSE, FALSE, sizeof (TrbPlanBounds));

  g_array_set_clear_func (labels, (GDestroyNotify) label_clear);
  run_labels (dc, vis, skip, labels);
  for (guint i = 0; i < n; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      const TrbMemberResult *r;
      Label l = { 0 };

      if (!vis[i] || skip[i])
        continue;
      r = trb_plan_scene_lookup_result (dc->scene, m);
      l.member = i;
      l.status = trb_render_status_of (r);
      l.top = g_strdup_printf ("%s %s", m->id, member_section (m, r));
      l.bottom = ratio_text (r);
      l.priority = l.status == TRB_RENDER_STATUS_FAIL ? 0
                   : m->role == TRB_FRAME_ROLE_GIRDER ? 2
                   : m->role == TRB_FRAME_ROLE_BEAM ? 3 : 4;
      g_array_append_val (labels, l);
    }
  g_array_sort (labels, cmp_label);

  for (guint k = 0; k < labels->len; k++)
    {
      const Label *l = &g_array_index (labels, Label, k);
      const TrbMember *m = g_ptr_array_index (floor->members, l->member);
      double ax, ay, bx, by, len, ang, off, tw, bw, fs = dc->fs;
      TrbPlanBounds box;
      gboolean clear = TRUE;
      TrbRgba c;

      trb_plan_view_to_device (dc->view, m->start.x, m->start.y, &ax, &ay);
      trb_plan_view_to_device (dc->view, m->end.x, m->end.y, &bx, &by);
      len = hypot (bx - ax, by - ay);
      /* a label needs a few characters' room at least */
      if (len < 4 * fs)
        continue;
      tw = text_width (dc, l->top, fs, TRUE);
      if (tw > len * 0.95)
        {
          /* a smaller size still fits on a short member; below that, leave it out */
          fs = fs * len * 0.95 / tw;
          if (fs < dc->fs * 0.7)
            continue;
          tw = len * 0.95;
        }
      bw = text_width (dc, l->bottom, fs, TRUE) +
           (l->status == TRB_RENDER_STATUS_FAIL ? 2.5 * fs : 0);

      ang = atan2 (by - ay, bx - ax);
      if (ang > G_PI / 2 + 1e-9 || ang <= -G_PI / 2 + 1e-9)
        ang += G_PI;
      off = dc->lw * role_width (m->role) * (l->status == TRB_RENDER_STATUS_FAIL ? 1.5 : 0.5) +
            1.2;

      /* a label that would cover one placed before it is left out; a failure's never is */
      label_box ((ax + bx) / 2, (ay + by) / 2, ang, MAX (tw, bw) / 2, off + fs * 1.2,
                 off + fs * 1.2, &box);
      for (guint j = 0; clear && j < placed->len; j++)
        clear = !boxes_overlap (&box, &g_array_index (placed, TrbPlanBounds, j));
      if (!clear && l->priority > 0)
        continue;
      g_array_append_val (placed, box);

      cairo_save (cr);
      cairo_translate (cr, (ax + bx) / 2, (ay + by) / 2);
      cairo_rotate (cr, ang);
      trb_render_set_color (cr, &dc->ink);
      draw_text (dc, l->top, fs, TRUE, 0, -off, 0.5, 1.0, NULL);
      trb_render_status_color (dc->style, l->status, &c);
      /* amber text on white is faint: print the ratio in ink, the line carries colour */
      if (dc->style->print && l->status == TRB_RENDER_STATUS_NEAR)
        c = dc->ink;
      trb_render_set_color (cr, &c);
      {
        double w = draw_text (dc, l->bottom, fs, l->status == TRB_RENDER_STATUS_FAIL, 0, off,
                              0.5, 0.0, NULL);

        if (l->status == TRB_RENDER_STATUS_FAIL)
          draw_flag (dc, -w / 2 - fs * 1.0, off + fs * 0.6, &c);
      }
      cairo_restore (cr);
    }
}

/* Which members this draw shows, with their status and role, in three byte arrays: every
 * layer asks, and ten thousand members' own memory read once instead of a dozen times. */
static void
classify_members (DrawContext *dc)
{
  const TrbPlanScene *scene = dc->scene;
  const TrbFloor *floor = scene->floor;
  guint n = floor->members->len;

  dc->vis = g_new0 (guint8, MAX (n, 1));
  dc->status = g_new0 (guint8, MAX (n, 1));
  dc->role = g_new0 (guint8, MAX (n, 1));
  dc->line = g_new (double, 4 * MAX (n, 1));
  dc->n_visible = 0;
  for (guint i = 0; i < n; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);

      if (!member_visible (dc, m))
        continue;
      dc->vis[i] = 1;
      dc->n_visible++;
      dc->role[i] = m->role;
      trb_plan_view_to_device (dc->view, m->start.x, m->start.y, &dc->line[4 * i],
                               &dc->line[4 * i + 1]);
      trb_plan_view_to_device (dc->view, m->end.x, m->end.y, &dc->line[4 * i + 2],
                               &dc->line[4 * i + 3]);
      /* the scene's byte while the floor holds the member it was made for at i */
      if (i < scene->n_status && scene->status_members[i] == m)
        dc->status[i] = scene->status[i];
      else
        dc->status[i] = trb_render_status_of (trb_plan_scene_lookup_result (scene, m));
    }
}

static void
draw_members (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;
  guint n = floor->members->len;
  const guint8 *vis = dc->vis, *status = dc->status, *roles = dc->role;
  TrbRgba sel;

  cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);

  /* selection under everything */
  trb_render_selection_color (dc->style, &sel);
  if (dc->options->selection != NULL && g_hash_table_size (dc->options->selection) > 0)
    for (guint i = 0; i < n; i++)
      {
        const TrbMember *m = g_ptr_array_index (floor->members, i);

        if (!vis[i] || !is_selected (dc, m))
          continue;
        member_path (dc, m);
        trb_render_set_color (cr, &sel);
        cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);
        cairo_set_line_width (cr, dc->lw * role_width (m->role) * 3 + 6);
        cairo_stroke (cr);
        cairo_set_line_cap (cr, CAIRO_LINE_CAP_BUTT);
      }

  /* One path per status and role, stroked once: ten thousand strokes of one segment each
   * cost far more than a few strokes of many. */
  for (int st = TRB_RENDER_STATUS_OK; st <= TRB_RENDER_STATUS_NONE; st++)
    for (int role = TRB_FRAME_ROLE_GIRDER; role <= TRB_FRAME_ROLE_JOIST; role++)
      {
        TrbRgba c;
        double w = dc->lw * role_width (role);
        gboolean any = FALSE;

        /* from the bytes and lines classify_members() keeps: no member's own memory again */
        for (guint i = 0; i < n; i++)
          {
            if (!vis[i] || roles[i] != role || status[i] != st)
              continue;
            cairo_move_to (cr, dc->line[4 * i], dc->line[4 * i + 1]);
            cairo_line_to (cr, dc->line[4 * i + 2], dc->line[4 * i + 3]);
            any = TRUE;
          }
        if (!any)
          continue;
        trb_render_status_color (dc->style, st, &c);
        if (st == TRB_RENDER_STATUS_FAIL)
          {
            /* the double stroke: a wide line with a paper-coloured core */
            set_line_color (dc, &c, MAX (3 * w, 3.0));
            cairo_set_line_width (cr, MAX (3 * w, 3.0));
            cairo_stroke_preserve (cr);
            set_line_color (dc, &dc->paper, MAX (w, 1.0));
            cairo_set_line_width (cr, MAX (w, 1.0));
            cairo_stroke (cr);
          }
        else if (st == TRB_RENDER_STATUS_NONE)
          {
            double dash[] = { MAX (4 * w, 3.0), MAX (2.5 * w, 2.0) };

            set_line_color (dc, &c, w);
            cairo_set_dash (cr, dash, 2, 0);
            cairo_set_line_width (cr, w);
            cairo_stroke (cr);
            cairo_set_dash (cr, NULL, 0, 0);
          }
        else
          {
            set_line_color (dc, &c, w);
            cairo_set_line_width (cr, w);
            cairo_stroke (cr);
          }
      }

}

static void
draw_columns (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;
  double h = column_half (dc->view);
  gboolean loads = (dc->options->layers & TRB_PLAN_LAYER_COLUMN_LOADS) != 0;

  for (guint i = 0; i < floor->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (floor->columns, i);
      double x, y;
      double load[TRB_N_CASES];

      if (!point_in_rect (c->at.x, c->at.y, &dc->visible))
        continue;
      trb_plan_view_to_device (dc->view, c->at.x, c->at.y, &x, &y);
      if (is_selected (dc, c))
        {
          TrbRgba sel;

          trb_render_selection_color (dc->style, &sel);
          trb_render_set_color (cr, &sel);
          cairo_rectangle (cr, x - h - 4, y - h - 4, 2 * h + 8, 2 * h + 8);
          cairo_fill (cr);
        }
      set_line_color (dc, &dc->ink, INFINITY);
      cairo_rectangle (cr, x - h, y - h, 2 * h, 2 * h);
      cairo_fill (cr);
      /* text in a plain colour: glyphs are drawn best from one */
      trb_render_set_color (cr, &dc->ink);

      if (dc->options->layers & TRB_PLAN_LAYER_LABELS)
        draw_text (dc, c->id, dc->fs * 0.95, TRUE, x - h - 1.5, y - h - 1.0, 1.0, 1.0, NULL);

      if (loads && trb_plan_scene_get_column_load (dc->scene, i, load))
        {
          double ty = y + h + 1.0;

          for (int k = 0; k < TRB_N_CASES; k++)
            {
              g_autofree char *v = NULL;
              g_autofree char *t = NULL;
              double th;

              if (load[k] == 0)
                continue;
              v = trb_units_format (load[k], TRB_DIM_FORCE, dc->scene->units);
              t = g_strdup_printf ("%s %s", trb_load_case_name (k), v);
              draw_text (dc, t, dc->fs * 0.85, FALSE, x + h + 1.5, ty, 0.0, 0.0, &th);
              ty += th;
            }
        }
    }
}

static void
arrow_head (cairo_t *cr,
            double   tipx,
            double   tipy,
            double   ux,
            double   uy,
            double   size)
{
  /* u points along the arrow, towards the tip */
  double nx = -uy, ny = ux;

  cairo_move_to (cr, tipx, tipy);
  cairo_line_to (cr, tipx - ux * size + nx * size * 0.4, tipy - uy * size + ny * size * 0.4);
  cairo_line_to (cr, tipx - ux * size - nx * size * 0.4, tipy - uy * size - ny * size * 0.4);
  cairo_close_path (cr);
  cairo_fill (cr);
}

static void
draw_line_loads (DrawContext *dc)
{
  cairo_t *cr = dc->cr;
  const TrbFloor *floor = dc->scene->floor;
  double alen = 1.6 * dc->fs;

  for (guint i = 0; i < floor->line_loads->len; i++)
    {
      const TrbLineLoad *l = g_ptr_array_index (floor->line_loads, i);
      TrbRgba c;
      double lx = 0, ly = 0, lang = 0, side;
      g_autofree char *t = NULL;

      if (!points_visible (dc, l->points))
        continue;
      side = line_load_side (dc, l);
      trb_render_case_color (dc->style, l->lcase, &c);
      c.r *= 0.75;
      c.g *= 0.75;
      c.b *= 0.75;
      trb_render_set_color (cr, &c);
      cairo_set_line_width (cr, is_selected (dc, l) ? 2 * dc->lw : 0.7 * dc->lw);

      for (guint k = 0; k + 1 < l->points->len; k++)
        {
          const TrbFramePoint *a = &g_array_index (l->points, TrbFramePoint, k);
          const TrbFramePoint *b = &g_array_index (l->points, TrbFramePoint, k + 1);
          double ax, ay, bx, by, len, ux, uy, nx, ny;
          int n;

          trb_plan_view_to_device (dc->view, a->x, a->y, &ax, &ay);
          trb_plan_view_to_device (dc->view, b->x, b->y, &bx, &by);
          len = hypot (bx - ax, by - ay);
          if (len < 1e-9)
            continue;
          ux = (bx - ax) / len;
          uy = (by - ay) / len;
          nx = -side * uy;
          ny = side * ux;
          /* a load line offset to one side, with arrows onto the line it loads */
          cairo_move_to (cr, ax - nx * alen, ay - ny * alen);
          cairo_line_to (cr, bx - nx * alen, by - ny * alen);
          cairo_stroke (cr);
          n = MAX (2, (int) (len / (2.5 * dc->fs)) + 1);
          for (int s = 0; s < n; s++)
            {
              double t = (double) s / (n - 1);
              double px = ax + (bx - ax) * t, py = ay + (by - ay) * t;

              cairo_move_to (cr, px - nx * alen, py - ny * alen);
              cairo_line_to (cr, px - nx * 0.35 * alen, py - ny * 0.35 * alen);
              cairo_stroke (cr);
              arrow_head (cr, px, py, nx, ny, 0.65 * alen);
            }
        }
      if (line_load_label (dc, l, &t, &lx, &ly, &lang, side))
        {
          gboolean flip = lang > G_PI / 2 + 1e-9 || lang <= -G_PI / 2 + 1e-9;
          /* the text reaches away from the line: below its baseline once turned upright, on
           * the other side, or flipped */
          gboolean below = flip != (side < 0);

          cairo_save (cr);
          cairo_translate (cr, lx, ly);
          cairo_rotate (cr, flip ? lang + G_PI : lang);
          /* on the far side of the load line from the member */
          draw_text (dc, t, dc->fs * 0.9, FALSE, 0, below ? 1.0 : -1.0, 0.5, below ? 0.0 : 1.0,
                     NULL);
          cairo_restore (cr);
        }
    }

  for (guint i = 0; i < floor->point_loads->len; i++)
    {
      const TrbPointLoad *p = g_ptr_array_index (floor->point_loads, i);
      TrbRgba c;
      double x, y, u = G_SQRT2 / 2;
      g_autofree char *v = NULL;
      g_autofree char *t = NULL;

      if (!point_in_rect (p->at.x, p->at.y, &dc->visible))
        continue;
      trb_plan_view_to_device (dc->view, p->at.x, p->at.y, &x, &y);
      trb_render_case_color (dc->style, p->lcase, &c);
      c.r *= 0.75;
      c.g *= 0.75;
      c.b *= 0.75;
      trb_render_set_color (cr, &c);
      /* a diagonal arrow from the upper left onto the point, and a ring around it */
      cairo_set_line_width (cr, is_selected (dc, p) ? 2 * dc->lw : 0.8 * dc->lw);
      cairo_move_to (cr, x - 2.4 * alen * u, y - 2.4 * alen * u);
      cairo_line_to (cr, x - 0.5 * alen * u, y - 0.5 * alen * u);
      cairo_stroke (cr);
      arrow_head (cr, x, y, u, u, 0.7 * alen);
      cairo_new_sub_path (cr);
      cairo_arc (cr, x, y, 0.25 * alen, 0, 2 * G_PI);
      cairo_stroke (cr);
      v = trb_units_format (p->P, TRB_DIM_FORCE, dc->scene->units);
      t = g_strdup_printf ("%s %s%s%s", trb_load_case_name (p->lcase), v,
                           p->label != NULL ? " " : "", p->label != NULL ? p->label : "");
      draw_text (dc, t, dc->fs * 0.9, FALSE, x - 2.4 * alen * u, y - 2.4 * alen * u - 1, 0.5,
                 1.0, NULL);
    }
}

/* A round length for a scale bar about target device units long. */
static double
nice_length (const TrbPlanView *view,
             TrbUnitSystem      units,
             double             target)
{
  static const double steps[] = { 1, 2, 5 };
  double unit = units == TRB_UNIT_SYSTEM_US ? TRB_FT : 1.0;
  double want = target / view->scale / unit;
  double p = pow (10, floor (log10 (want)));
  double best = p;

  for (int e = 0; e < 2; e++, p *= 10)
    for (guint k = 0; k < G_N_ELEMENTS (steps); k++)
      if (steps[k] * p <= want)
        best = steps[k] * p;
  return best * unit;
}

void
trb_plan_draw_scale_bar (cairo_t              *cr,
                         const TrbPlanView    *view,
                         const TrbRenderStyle *style,
                         TrbUnitSystem         units,
                         double                x,
                         double                y)
{
  double len, dl, h, fs;
  TrbRgba ink, paper;
  g_autofree char *label = NULL;

  g_return_if_fail (cr != NULL && view != NULL && style != NULL);

  fs = style->font_size;
  len = nice_length (view, units, 12 * fs);
  dl = len * view->scale;
  h = 0.45 * fs;
  trb_render_ink_color (style, &ink);
  trb_render_paper_color (style, &paper);

  cairo_save (cr);
  /* four alternating blocks, the trade's scale bar */
  for (int k = 0; k < 4; k++)
    {
      cairo_rectangle (cr, x + dl * k / 4, y - h, dl / 4, h);
      trb_render_set_color (cr, (k % 2 == 0) ? &ink : &paper);
      cairo_fill_preserve (cr);
      trb_render_set_color (cr, &ink);
      cairo_set_line_width (cr, 0.5);
      cairo_stroke (cr);
    }
  trb_render_set_color (cr, &ink);
  trb_render_text (cr, style, "0", fs * 0.9, FALSE, x, y - h - 1, 0.5, 1.0, NULL);
  if (units == TRB_UNIT_SYSTEM_US)
    label = trb_units_format_length_ft_in (len, 16);
  else
    label = trb_units_format_with_unit (len, "m", 0);
  trb_render_text (cr, style, label, fs * 0.9, FALSE, x + dl, y - h - 1, 0.5, 1.0, NULL);
  cairo_restore (cr);
}

void
trb_plan_draw (cairo_t                  *cr,
               const TrbPlanScene       *scene,
               const TrbPlanView        *view,
               const TrbPlanDrawOptions *options)
{
  DrawContext dc;
  double pad;

  g_return_if_fail (cr != NULL && scene != NULL && view != NULL && options != NULL);

  dc.cr = cr;
  dc.scene = scene;
  dc.view = view;
  dc.options = options;
  dc.style = &options->style;
  dc.texts = scene->texts;
  dc.fs = options->style.font_size;
  dc.lw = options->style.line_width;
  trb_render_ink_color (dc.style, &dc.ink);
  trb_render_paper_color (dc.style, &dc.paper);

  /* what is drawn reaches a label's length beyond the rectangle */
  trb_plan_view_visible (view, options->x, options->y, options->width, options->height,
                         &dc.visible);
  dc.device = (TrbPlanBounds) { options->x, options->y, options->x + options->width,
                                options->y + options->height };
  pad = 6 * dc.fs / view->scale;
  dc.visible.min_x -= pad;
  dc.visible.min_y -= pad;
  dc.visible.max_x += pad;
  dc.visible.max_y += pad;

  dc.near_first = NULL;
  dc.near_index = NULL;
  dc.n_swatches = 0;
  classify_members (&dc);
  switch (cairo_surface_get_type (cairo_get_target (cr)))
    {
    case CAIRO_SURFACE_TYPE_IMAGE:
    case CAIRO_SURFACE_TYPE_RECORDING:
      dc.swatches_ok = TRUE;
      break;
    default:
      dc.swatches_ok = FALSE;
      break;
    }

  cairo_save (cr);
  cairo_rectangle (cr, options->x, options->y, options->width, options->height);
  cairo_clip (cr);
  cairo_set_line_join (cr, CAIRO_LINE_JOIN_MITER);

  if (options->layers & TRB_PLAN_LAYER_AREA_LOADS)
    draw_area_loads (&dc);
  draw_openings (&dc);
  if (options->layers & TRB_PLAN_LAYER_GRID)
    draw_grids (&dc);
  draw_walls (&dc);
  draw_members (&dc);

  /* the clouds under the labels, so that no scallop crosses out a mark */
  if (options->clouded != NULL)
    {
      GHashTableIter it;
      gpointer key;

      g_hash_table_iter_init (&it, options->clouded);
      while (g_hash_table_iter_next (&it, &key, NULL))
        {
          const TrbMember *m = key;

          if (m->floor == scene->floor && member_visible (&dc, m))
            draw_cloud (&dc, m);
        }
    }

  draw_member_labels (&dc);
  if (options->layers & TRB_PLAN_LAYER_LINE_LOADS)
    draw_line_loads (&dc);
  draw_columns (&dc);

  if (options->layers & TRB_PLAN_LAYER_SCALE_BAR)
    trb_plan_draw_scale_bar (cr, view, dc.style, scene->units, options->x + 2 * dc.fs,
                             options->y + options->height - 1.5 * dc.fs);
  cairo_restore (cr);
  for (guint i = 0; i < dc.n_swatches; i++)
    cairo_pattern_destroy (dc.swatches[i]);
  g_free (dc.near_first);
  g_free (dc.near_index);
  g_free (dc.line);
  g_free (dc.vis);
  g_free (dc.status);
  g_free (dc.role);
}
