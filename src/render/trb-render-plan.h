/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "trb-model.h"
#include "trb-render-style.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* The framing plan, drawn the same way on the screen and on paper.
 *
 * The view maps plan metres (x right, y up) to device units (x right, y down: pixels on the
 * screen, points on paper). Everything about it is a pure function, so pan, zoom, fit, hit
 * testing and rubber-band selection are testable without a display. */

typedef struct
{
  double scale;      /* device units per metre, > 0 */
  double origin_x;   /* device position of the plan's (0, 0) */
  double origin_y;
} TrbPlanView;

/* A plan rectangle in metres; empty when min > max. */
typedef struct
{
  double min_x;
  double min_y;
  double max_x;
  double max_y;
} TrbPlanBounds;

void      trb_plan_view_init            (TrbPlanView        *view);
void      trb_plan_view_to_device       (const TrbPlanView  *view,
                                         double              plan_x,
                                         double              plan_y,
                                         double             *device_x,
                                         double             *device_y);
void      trb_plan_view_to_plan         (const TrbPlanView  *view,
                                         double              device_x,
                                         double              device_y,
                                         double             *plan_x,
                                         double             *plan_y);
/* Moves the plan by a device offset (a drag). */
void      trb_plan_view_pan             (TrbPlanView        *view,
                                         double              device_dx,
                                         double              device_dy);
/* Multiplies the scale by factor keeping the plan point under (device_x, device_y) fixed. */
void      trb_plan_view_zoom_about      (TrbPlanView        *view,
                                         double              factor,
                                         double              device_x,
                                         double              device_y);
/* Scales and centres bounds into the device rectangle, less margin on every side. */
void      trb_plan_view_fit             (TrbPlanView        *view,
                                         const TrbPlanBounds *bounds,
                                         double              x,
                                         double              y,
                                         double              width,
                                         double              height,
                                         double              margin);
/* The plan rectangle the device rectangle shows. */
void      trb_plan_view_visible         (const TrbPlanView  *view,
                                         double              x,
                                         double              y,
                                         double              width,
                                         double              height,
                                         TrbPlanBounds      *bounds);

void      trb_plan_bounds_init          (TrbPlanBounds      *bounds);
void      trb_plan_bounds_add           (TrbPlanBounds      *bounds,
                                         double              x,
                                         double              y);
gboolean  trb_plan_bounds_is_empty      (const TrbPlanBounds *bounds);

/* A floor and its results, indexed for drawing and picking (a grid over the plan, a member ->
 * result map, column loads). Build one after each solve; it borrows the floor, the project
 * and the results, which must outlive it. results may be NULL (nothing solved yet: members
 * are drawn as not designed). It also keeps the text its draws lay out, for the next draw:
 * draw a scene from one thread at a time. */
typedef struct _TrbPlanScene TrbPlanScene;

TrbPlanScene          *trb_plan_scene_new            (const TrbProject        *project,
                                                      const TrbFloor          *floor,
                                                      const TrbProjectResult  *results);
void                   trb_plan_scene_free           (TrbPlanScene            *scene);
void                   trb_plan_scene_take_texts     (TrbPlanScene            *scene,
                                                      TrbPlanScene            *from);
const TrbFloor        *trb_plan_scene_get_floor      (const TrbPlanScene      *scene);
TrbUnitSystem          trb_plan_scene_get_units      (const TrbPlanScene      *scene);
/* Everything drawn: grid lines, columns, walls, members and loads. */
void                   trb_plan_scene_get_bounds     (const TrbPlanScene      *scene,
                                                      TrbPlanBounds           *bounds);
/* The member's result, or NULL. */
const TrbMemberResult *trb_plan_scene_lookup_result  (const TrbPlanScene      *scene,
                                                      const TrbMember         *member);
/* The load on a column per case (N, downward +), from the floor solve; FALSE when there is
 * none to show. */
gboolean               trb_plan_scene_get_column_load (const TrbPlanScene     *scene,
                                                       guint                   column,
                                                       double                  load[TRB_N_CASES]);

/* ---- picking ---------------------------------------------------------------------------- */

typedef enum
{
  TRB_PLAN_HIT_NONE,
  TRB_PLAN_HIT_MEMBER,      /* index into floor->members */
  TRB_PLAN_HIT_COLUMN,      /* index into floor->columns */
  TRB_PLAN_HIT_WALL,        /* index into floor->walls */
  TRB_PLAN_HIT_POINT_LOAD,  /* index into floor->point_loads */
  TRB_PLAN_HIT_LINE_LOAD,   /* index into floor->line_loads */
  TRB_PLAN_HIT_AREA_LOAD,   /* index into floor->area_loads (inside its polygon) */
} TrbPlanHitKind;

typedef struct
{
  TrbPlanHitKind kind;
  guint          index;
  gconstpointer  object;    /* the TrbMember, TrbColumn, ... itself */
  double         distance;  /* device units from the point to the object */
} TrbPlanHit;

/* The object under a device point within tolerance device units. Columns and point loads
 * win over members, members over walls and line loads, those over area loads; within a kind
 * the nearest. Returns FALSE (hit->kind NONE) when there is nothing. */
gboolean  trb_plan_hit_test             (const TrbPlanScene *scene,
                                         const TrbPlanView  *view,
                                         double              device_x,
                                         double              device_y,
                                         double              tolerance,
                                         TrbPlanHit         *hit);

/* Rubber-band selection between two device corners (any order): the members, columns and
 * walls wholly inside the rectangle, or, with touching, every one that crosses it. Returns a
 * GArray of TrbPlanHit (distance 0), members first, each kind in floor order. */
GArray   *trb_plan_select_rect          (const TrbPlanScene *scene,
                                         const TrbPlanView  *view,
                                         double              device_x0,
                                         double              device_y0,
                                         double              device_x1,
                                         double              device_y1,
                                         gboolean            touching);

/* ---- drawing ---------------------------------------------------------------------------- */

typedef enum
{
  TRB_PLAN_LAYER_GRID          = 1 << 0,  /* grid lines and their names in circles */
  TRB_PLAN_LAYER_AREA_LOADS    = 1 << 1,  /* shaded per case, pressure labelled */
  TRB_PLAN_LAYER_LINE_LOADS    = 1 << 2,  /* line and point loads as arrows */
  TRB_PLAN_LAYER_LABELS        = 1 << 3,  /* member mark, section, ratio along each member */
  TRB_PLAN_LAYER_COLUMN_LOADS  = 1 << 4,  /* per-case loads beside each column */
  TRB_PLAN_LAYER_SCALE_BAR     = 1 << 5,
  TRB_PLAN_LAYER_ALL           = 0x3f,
} TrbPlanLayers;

typedef struct
{
  TrbRenderStyle  style;
  TrbPlanLayers   layers;
  GHashTable     *selection;   /* set of model pointers (TrbMember *, TrbColumn *, TrbWall *,
                                * loads) drawn highlighted; may be NULL */
  GHashTable     *clouded;     /* set of TrbMember * ringed with a revision cloud; may be NULL */
  /* The device rectangle drawn into (the widget or the plan's frame on the sheet): what lies
   * outside is culled, and the scale bar sits at its lower left. */
  double          x;
  double          y;
  double          width;
  double          height;
} TrbPlanDrawOptions;

/* Screen defaults: every layer but the column loads, screen style, no selection. */
void      trb_plan_draw_options_init    (TrbPlanDrawOptions *options,
                                         double              width,
                                         double              height);

/* Draws the plan. Labels are left out where the view is too small to read them, and what lies
 * outside options' rectangle is not drawn, so 10,000 members redraw within a frame. */
void      trb_plan_draw                 (cairo_t                  *cr,
                                         const TrbPlanScene       *scene,
                                         const TrbPlanView        *view,
                                         const TrbPlanDrawOptions *options);

/* A scale bar with its length in the project's units, lower-left corner at (x, y). */
void      trb_plan_draw_scale_bar       (cairo_t                  *cr,
                                         const TrbPlanView        *view,
                                         const TrbRenderStyle     *style,
                                         TrbUnitSystem             units,
                                         double                    x,
                                         double                    y);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbPlanScene, trb_plan_scene_free)

G_END_DECLS
