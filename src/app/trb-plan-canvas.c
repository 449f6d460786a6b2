/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <adwaita.h>
#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "trb-app-enums.h"
#include "trb-edit.h"
#include "trb-layout.h"
#include "trb-member-item.h"
#include "trb-plan-canvas.h"
#include "trb-render-plan.h"
#include "trb-units.h"

/* Pointer distances in device pixels. */
#define HIT_TOLERANCE   6.0   /* how near a click must be to pick something */
#define SNAP_RADIUS    12.0   /* how near a column or member end pulls a point onto it */
#define HANDLE_RADIUS   7.0   /* how near a selected member's end its handle is */
#define DRAG_THRESHOLD  4.0   /* how far the pointer moves before a press becomes a drag */
#define FIT_MARGIN     32.0

#define MIN_SCALE   0.5       /* device pixels per metre: a 4 km floor across the screen */
#define MAX_SCALE   2000.0    /* 2 px per mm */

typedef enum
{
  DRAG_NONE,
  DRAG_PAN,
  DRAG_RUBBER_BAND,
  DRAG_MEMBER_END,
  DRAG_MEMBER,
  DRAG_COLUMN,
} DragMode;

struct _TrbPlanCanvas
{
  GtkWidget       parent_instance;

  TrbDocument    *document;
  TrbPlanScene   *scene;
  TrbPlanView     view;
  gboolean        needs_fit;
  gboolean        auto_fit;       /* keep the floor fitted as the widget resizes, until the
                                   * engineer pans or zooms */

  TrbTool         tool;
  double          grid_spacing;
  gboolean        snap_to_grid;
  gboolean        snap_to_members;
  guint           load_case;
  double          area_pressure;
  double          line_load;
  double          point_load;
  double          joist_spacing;

  GHashTable     *selection;      /* model pointers: members, columns, walls, loads */
  TrbMember      *focus_member;   /* the member the panels show: the last one picked */
  GListModel     *member_order;   /* TrbMemberItem: the members list's rows, for the keys */
  TrbPlanHit      hover;

  /* the pointer, in device and plan units, and where it snaps */
  gboolean        pointer_in;
  double          pointer_x;
  double          pointer_y;
  TrbSnap         snap;

  /* a tool's points so far (members, walls, polygons) */
  GArray         *points;         /* TrbFramePoint */
  TrbMember      *support_a;      /* joist run: the first support picked */
  TrbMember      *support_b;
  TrbFramePoint   support_a_pick;
  GArray         *preview;        /* TrbLayoutLine: the joist run to confirm */

  /* press and drag */
  DragMode        drag;
  gboolean        dragging;
  double          press_x;
  double          press_y;
  GdkModifierType press_state;
  double          drag_x;
  double          drag_y;
  TrbMember      *drag_member;
  gboolean        drag_end_is_start;
  TrbColumn      *drag_column;
  TrbFramePoint   drag_anchor;    /* the plan point grabbed */
  TrbFramePoint   drag_start;     /* the grabbed object's start (or column's centre) */
  TrbFramePoint   drag_end;
  gboolean        space_held;
  gboolean        swallow_release;  /* a double click finished the tool: its release is not
                                     * another click */
  double          zoom_last;

  char           *hint;
  char           *position;

  /* The plan as last drawn, kept while nothing it shows has changed, so that pointer motion
   * (hover, snapping, a rubber band) redraws only the overlay: the plan of ten thousand
   * members takes some 30 ms to draw. */
  GskRenderNode  *plan_node;
  TrbPlanView     plan_node_view;
  int             plan_node_width;
  int             plan_node_height;
  gboolean        plan_node_dark;
};

G_DEFINE_FINAL_TYPE (TrbPlanCanvas, trb_plan_canvas, GTK_TYPE_WIDGET)

enum {
  PROP_0,
  PROP_DOCUMENT,
  PROP_TOOL,
  PROP_GRID_SPACING,
  PROP_SNAP_TO_GRID,
  PROP_SNAP_TO_MEMBERS,
  PROP_LOAD_CASE,
  PROP_AREA_PRESSURE,
  PROP_LINE_LOAD,
  PROP_POINT_LOAD,
  PROP_JOIST_SPACING,
  PROP_HINT,
  PROP_POSITION,
  N_PROPS
};

enum {
  SELECTION_CHANGED,
  EDIT_REFUSED,
  MEMBER_OPENED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static TrbFloor *
current_floor (TrbPlanCanvas *self)
{
  return self->document != NULL ? trb_document_get_floor (self->document) : NULL;
}

static TrbProject *
current_project (TrbPlanCanvas *self)
{
  return self->document != NULL ? trb_document_get_project (self->document) : NULL;
}

static TrbUnitSystem
units (TrbPlanCanvas *self)
{
  TrbProject *p = current_project (self);

  return p != NULL ? p->settings.units : TRB_UNIT_SYSTEM_US;
}

/* ---- hint and position ------------------------------------------------------------------- */

static void
set_hint (TrbPlanCanvas *self,
          const char    *hint)
{
  if (g_strcmp0 (self->hint, hint) == 0)
    return;
  g_free (self->hint);
  self->hint = g_strdup (hint);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_HINT]);
}

static void
update_hint (TrbPlanCanvas *self)
{
  guint n = self->points->len;

  switch (self->tool)
    {
    case TRB_TOOL_SELECT:
      set_hint (self, _("Click a member to see it; drag to select an area; drag an end to "
                        "move it"));
      break;
    case TRB_TOOL_GIRDER:
    case TRB_TOOL_BEAM:
      set_hint (self, n == 0 ? _("Click where the member starts")
                             : _("Click where it ends · Esc to stop"));
      break;
    case TRB_TOOL_JOIST_RUN:
      if (self->support_a == NULL)
        set_hint (self, _("Click the first supporting member, near the end the run starts "
                          "from"));
      else if (self->support_b == NULL)
        set_hint (self, _("Click the second supporting member, parallel to the first"));
      else
        set_hint (self, _("Click or press Enter to lay out the joists · Esc to cancel"));
      break;
    case TRB_TOOL_COLUMN:
      set_hint (self, _("Click to place a column"));
      break;
    case TRB_TOOL_WALL:
      set_hint (self, n < 2 ? _("Click the wall's points; double-click or Enter to finish")
                            : _("Double-click or press Enter to finish the wall"));
      break;
    case TRB_TOOL_AREA_LOAD:
      set_hint (self, n < 3 ? _("Click the corners of the loaded area")
                            : _("Double-click or press Enter to close the area"));
      break;
    case TRB_TOOL_LINE_LOAD:
      set_hint (self, n < 2 ? _("Click the points of the line load")
                            : _("Double-click or press Enter to finish the line load"));
      break;
    case TRB_TOOL_POINT_LOAD:
      set_hint (self, _("Click to place a point load"));
      break;
    case TRB_TOOL_DELETE:
      set_hint (self, _("Click a member, column, wall or load to delete it"));
      break;
    default:
      set_hint (self, NULL);
      break;
    }
}

static void
update_position (TrbPlanCanvas *self)
{
  g_autofree char *text = NULL;

  if (self->pointer_in)
    {
      g_autofree char *x = trb_units_format (self->snap.point.x, TRB_DIM_LENGTH, units (self));
      g_autofree char *y = trb_units_format (self->snap.point.y, TRB_DIM_LENGTH, units (self));

      text = g_strdup_printf ("x %s   y %s", x, y);
    }
  if (g_strcmp0 (text, self->position) == 0)
    return;
  g_free (self->position);
  self->position = g_steal_pointer (&text);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_POSITION]);
}

/* ---- scene and selection ------------------------------------------------------------------ */

/* What the plan shows has changed: draw it again. */
static void
invalidate_plan (TrbPlanCanvas *self)
{
  g_clear_pointer (&self->plan_node, gsk_render_node_unref);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

/* After every edit and every solve: the scene is cheap to make, its text is not, so the
 * text the old scene laid out goes over to the new one. */
static void
rebuild_scene (TrbPlanCanvas *self)
{
  TrbFloor *floor = current_floor (self);
  TrbPlanScene *scene = NULL;

  invalidate_plan (self);
  if (floor != NULL)
    {
      scene = trb_plan_scene_new (trb_document_get_project (self->document), floor,
                                  trb_document_get_results (self->document));
      if (self->scene != NULL)
        trb_plan_scene_take_texts (scene, self->scene);
    }
  g_clear_pointer (&self->scene, trb_plan_scene_free);
  self->scene = scene;
}

static void
emit_selection_changed (TrbPlanCanvas *self)
{
  /* the render layer draws the selection */
  invalidate_plan (self);
  g_signal_emit (self, signals[SELECTION_CHANGED], 0);
}

static void
add_all (GHashTable *set,
         GPtrArray  *items)
{
  for (guint i = 0; i < items->len; i++)
    g_hash_table_add (set, g_ptr_array_index (items, i));
}

/* After an undo, a selected object may be out of the floor: forget it. */
static gboolean
prune_selection (TrbPlanCanvas *self)
{
  TrbFloor *floor = current_floor (self);
  g_autoptr(GHashTable) present = NULL;
  GHashTableIter it;
  gpointer key;
  gboolean changed = FALSE;

  if (floor == NULL)
    {
      changed = g_hash_table_size (self->selection) > 0 || self->focus_member != NULL;
      g_hash_table_remove_all (self->selection);
      self->focus_member = NULL;
      return changed;
    }

  present = g_hash_table_new (NULL, NULL);
  add_all (present, floor->members);
  add_all (present, floor->columns);
  add_all (present, floor->walls);
  add_all (present, floor->area_loads);
  add_all (present, floor->line_loads);
  add_all (present, floor->point_loads);

  g_hash_table_iter_init (&it, self->selection);
  while (g_hash_table_iter_next (&it, &key, NULL))
    if (!g_hash_table_contains (present, key))
      {
        g_hash_table_iter_remove (&it);
        changed = TRUE;
      }
  if (self->focus_member != NULL && !g_hash_table_contains (present, self->focus_member))
    {
      self->focus_member = NULL;
      changed = TRUE;
    }
  if (self->support_a != NULL && !g_hash_table_contains (present, self->support_a))
    trb_plan_canvas_cancel (self);
  else if (self->support_b != NULL && !g_hash_table_contains (present, self->support_b))
    trb_plan_canvas_cancel (self);
  self->hover.kind = TRB_PLAN_HIT_NONE;
  return changed;
}

static void
on_document_solved (TrbPlanCanvas *self,
                    TrbDocument   *document)
{
  gboolean changed = prune_selection (self);

  rebuild_scene (self);
  if (changed)
    emit_selection_changed (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

static void
on_document_changed (TrbPlanCanvas *self,
                     TrbDocument   *document)
{
  /* drawn at once as it is now, with the results that stand until the solve is done */
  on_document_solved (self, document);
}

/* Another floor shown: what was picked or being drawn on the last one goes, and the new
 * floor is fitted to the window. */
static void
on_document_floor (TrbPlanCanvas *self,
                   GParamSpec    *pspec,
                   TrbDocument   *document)
{
  trb_plan_canvas_cancel (self);
  self->hover.kind = TRB_PLAN_HIT_NONE;
  on_document_solved (self, document);
  self->needs_fit = TRUE;
  self->auto_fit = TRUE;
  trb_plan_canvas_zoom_to_fit (self);
}

static void
select_only (TrbPlanCanvas *self,
             gpointer       object,
             TrbMember     *member)
{
  g_hash_table_remove_all (self->selection);
  if (object != NULL)
    g_hash_table_add (self->selection, object);
  self->focus_member = member;
}

/* ---- view ------------------------------------------------------------------------------------ */

static double
view_scale_clamp (double scale)
{
  return CLAMP (scale, MIN_SCALE, MAX_SCALE);
}

static void
zoom_about (TrbPlanCanvas *self,
            double         factor,
            double         x,
            double         y)
{
  double target = view_scale_clamp (self->view.scale * factor);

  self->auto_fit = FALSE;
  if (target == self->view.scale)
    return;
  trb_plan_view_zoom_about (&self->view, target / self->view.scale, x, y);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

void
trb_plan_canvas_zoom (TrbPlanCanvas *self,
                      double         factor)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  zoom_about (self, factor, gtk_widget_get_width (GTK_WIDGET (self)) / 2.0,
              gtk_widget_get_height (GTK_WIDGET (self)) / 2.0);
}

void
trb_plan_canvas_zoom_to_fit (TrbPlanCanvas *self)
{
  int w, h;
  TrbPlanBounds bounds;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  w = gtk_widget_get_width (GTK_WIDGET (self));
  h = gtk_widget_get_height (GTK_WIDGET (self));
  if (w <= 2 * FIT_MARGIN || h <= 2 * FIT_MARGIN || self->scene == NULL)
    {
      self->needs_fit = TRUE;
      return;
    }
  trb_plan_scene_get_bounds (self->scene, &bounds);
  if (trb_plan_bounds_is_empty (&bounds))
    {
      /* an empty floor: 20 m square about the origin, a room to start drawing in */
      trb_plan_bounds_init (&bounds);
      trb_plan_bounds_add (&bounds, -2, -2);
      trb_plan_bounds_add (&bounds, 18, 12);
    }
  trb_plan_view_fit (&self->view, &bounds, 0, 0, w, h, FIT_MARGIN);
  self->auto_fit = TRUE;
  self->view.scale = view_scale_clamp (self->view.scale);
  self->needs_fit = FALSE;
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

double
trb_plan_canvas_get_scale (TrbPlanCanvas *self)
{
  g_return_val_if_fail (TRB_IS_PLAN_CANVAS (self), 0);
  return self->view.scale;
}

/* ---- snapping ------------------------------------------------------------------------------- */

static void
snap_point (TrbPlanCanvas   *self,
            double           device_x,
            double           device_y,
            const TrbMember *skip,
            TrbSnap         *snap)
{
  TrbFloor *floor = current_floor (self);
  TrbFramePoint p;
  TrbSnapOptions o;

  trb_plan_view_to_plan (&self->view, device_x, device_y, &p.x, &p.y);
  o.grid = self->snap_to_grid ? self->grid_spacing : 0;
  o.objects = self->snap_to_members;
  o.radius = SNAP_RADIUS / self->view.scale;
  o.skip = skip;
  if (floor == NULL || !trb_edit_snap (floor, &p, &o, snap))
    {
      snap->kind = TRB_SNAP_NONE;
      snap->point = p;
      snap->object = NULL;
    }
}

static gboolean
tool_snaps (TrbTool tool)
{
  return tool != TRB_TOOL_SELECT && tool != TRB_TOOL_DELETE && tool != TRB_TOOL_JOIST_RUN;
}

/* ---- edits ---------------------------------------------------------------------------------- */

static void
refused (TrbPlanCanvas *self,
         GError        *error)
{
  if (error != NULL)
    g_signal_emit (self, signals[EDIT_REFUSED], 0, error->message);
}

static gboolean
push (TrbPlanCanvas  *self,
      TrbEditCommand *command,
      GError         *error)
{
  if (command == NULL)
    {
      refused (self, error);
      return FALSE;
    }
  return trb_document_push (self->document, command);
}

static char *
next_item_mark (TrbProject *project,
                const char *prefix,
                gboolean    column)
{
  for (guint n = 1;; n++)
    {
      g_autofree char *mark = g_strdup_printf ("%s%u", prefix, n);

      if (column ? trb_project_find_column (project, mark, NULL) == NULL
                 : trb_project_find_wall (project, mark, NULL) == NULL)
        return g_steal_pointer (&mark);
    }
}

static void
add_member (TrbPlanCanvas       *self,
            const TrbFramePoint *a,
            const TrbFramePoint *b)
{
  TrbProject *project = current_project (self);
  gboolean girder = self->tool == TRB_TOOL_GIRDER;
  guint counter = 0;
  g_autofree char *mark = trb_project_next_mark (project, girder ? "G" : "B", &counter);
  g_autoptr(GError) error = NULL;
  TrbMember *m = trb_member_new (mark);
  TrbMember *added;

  m->material = TRB_MATERIAL_STEEL;
  trb_member_set_role (m, girder ? TRB_FRAME_ROLE_GIRDER : TRB_FRAME_ROLE_BEAM);
  m->start = *a;
  m->end = *b;
  if (push (self, trb_edit_add_member (project, current_floor (self), m, &error), error))
    {
      added = trb_project_find_member (project, mark);
      select_only (self, added, added);
      emit_selection_changed (self);
    }
}

/* The joists copy a joist the engineer picked, else the floor's last joist, else sawn lumber
 * sized from the catalog. */
static TrbMember *
joist_template (TrbPlanCanvas *self)
{
  TrbFloor *floor = current_floor (self);

  if (self->focus_member != NULL && self->focus_member->role == TRB_FRAME_ROLE_JOIST)
    return self->focus_member;
  for (guint i = floor->members->len; i-- > 0;)
    {
      TrbMember *m = g_ptr_array_index (floor->members, i);

      if (m->role == TRB_FRAME_ROLE_JOIST)
        return m;
    }
  return NULL;
}

/* The run as the tool has it: its spacing, and starting from the end of the first support
 * nearer where that support was picked. */
static void
joist_spec (TrbPlanCanvas   *self,
            TrbJoistRunSpec *spec)
{
  const TrbMember *a = self->support_a;
  double len2 = a->length * a->length;
  double t = 0;

  trb_joist_run_spec_init (spec, self->joist_spacing);
  if (len2 > 0)
    t = ((self->support_a_pick.x - a->start.x) * (a->end.x - a->start.x)
         + (self->support_a_pick.y - a->start.y) * (a->end.y - a->start.y)) / len2;
  spec->start = t <= 0.5 ? TRB_LAYOUT_FROM_START : TRB_LAYOUT_FROM_END;
}

static void
update_joist_preview (TrbPlanCanvas *self)
{
  g_autoptr(GError) error = NULL;
  TrbJoistRunSpec spec;

  g_clear_pointer (&self->preview, g_array_unref);
  if (self->support_a == NULL || self->support_b == NULL)
    return;

  joist_spec (self, &spec);
  self->preview = trb_layout_preview (self->support_a, self->support_b, &spec, &error);
  if (self->preview == NULL)
    {
      refused (self, error);
      self->support_b = NULL;
    }
}

static void
lay_out_joists (TrbPlanCanvas *self)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbMember) fallback = NULL;
  TrbProject *project = current_project (self);
  TrbJoistRunSpec spec;
  TrbMember *template;

  joist_spec (self, &spec);
  template = joist_template (self);
  if (template == NULL)
    {
      /* Douglas Fir-Larch No. 2 is the everyday framing lumber of US practice (common
       * practice); the engineer changes it on the member panel */
      fallback = trb_member_new ("template");
      fallback->material = TRB_MATERIAL_WOOD;
      fallback->species = g_strdup ("Douglas Fir-Larch");
      fallback->grade = g_strdup ("No.2");
      fallback->repetitive = TRUE;
      fallback->max_plies = 1;
      template = fallback;
    }
  spec.template = template;

  push (self, trb_edit_add_joist_run (project, current_floor (self), self->support_a,
                                      self->support_b, &spec, &error), error);
  self->support_a = self->support_b = NULL;
  g_clear_pointer (&self->preview, g_array_unref);
}

static GArray *
points_copy (GArray *points)
{
  GArray *copy = g_array_sized_new (FALSE, TRUE, sizeof (TrbFramePoint), points->len);

  g_array_append_vals (copy, points->data, points->len);
  return copy;
}

static void
finish_points (TrbPlanCanvas *self)
{
  TrbProject *project = current_project (self);
  TrbFloor *floor = current_floor (self);
  g_autoptr(GError) error = NULL;
  guint n = self->points->len;

  switch (self->tool)
    {
    case TRB_TOOL_WALL:
      if (n >= 2)
        {
          g_autofree char *mark = next_item_mark (project, "W", FALSE);
          TrbWall *w = trb_wall_new (mark, NULL);

          g_array_unref (w->points);
          w->points = points_copy (self->points);
          push (self, trb_edit_add_floor_item (project, floor, TRB_FLOOR_ITEM_WALL, w, &error),
                error);
        }
      break;
    case TRB_TOOL_AREA_LOAD:
      if (n >= 3)
        {
          TrbAreaLoad *a = trb_area_load_new (self->load_case, TRB_AREA_LOAD_ORDINARY,
                                              self->area_pressure, NULL, NULL);

          g_array_unref (a->points);
          a->points = points_copy (self->points);
          push (self, trb_edit_add_floor_item (project, floor, TRB_FLOOR_ITEM_AREA_LOAD, a,
                                               &error), error);
        }
      break;
    case TRB_TOOL_LINE_LOAD:
      if (n >= 2)
        {
          TrbLineLoad *l = trb_line_load_new (self->load_case, self->line_load, NULL);

          g_array_unref (l->points);
          l->points = points_copy (self->points);
          push (self, trb_edit_add_floor_item (project, floor, TRB_FLOOR_ITEM_LINE_LOAD, l,
                                               &error), error);
        }
      break;
    default:
      break;
    }
  g_array_set_size (self->points, 0);
}

static void
remove_hit (TrbPlanCanvas    *self,
            const TrbPlanHit *hit)
{
  TrbProject *project = current_project (self);
  TrbFloor *floor = current_floor (self);
  g_autoptr(GError) error = NULL;
  TrbEditCommand *c = NULL;

  switch (hit->kind)
    {
    case TRB_PLAN_HIT_MEMBER:
      c = trb_edit_remove_member (project, (TrbMember *) hit->object, &error);
      break;
    case TRB_PLAN_HIT_COLUMN:
      c = trb_edit_remove_floor_item (project, floor, TRB_FLOOR_ITEM_COLUMN,
                                      (gpointer) hit->object, &error);
      break;
    case TRB_PLAN_HIT_WALL:
      c = trb_edit_remove_floor_item (project, floor, TRB_FLOOR_ITEM_WALL,
                                      (gpointer) hit->object, &error);
      break;
    case TRB_PLAN_HIT_POINT_LOAD:
      c = trb_edit_remove_floor_item (project, floor, TRB_FLOOR_ITEM_POINT_LOAD,
                                      (gpointer) hit->object, &error);
      break;
    case TRB_PLAN_HIT_LINE_LOAD:
      c = trb_edit_remove_floor_item (project, floor, TRB_FLOOR_ITEM_LINE_LOAD,
                                      (gpointer) hit->object, &error);
      break;
    case TRB_PLAN_HIT_AREA_LOAD:
      c = trb_edit_remove_floor_item (project, floor, TRB_FLOOR_ITEM_AREA_LOAD,
                                      (gpointer) hit->object, &error);
      break;
    case TRB_PLAN_HIT_NONE:
    default:
      return;
    }
  push (self, c, error);
}

/**
 * trb_plan_canvas_delete_selection:
 * @self: a canvas
 *
 * Removes everything selected as one undoable step.
 */
void
trb_plan_canvas_delete_selection (TrbPlanCanvas *self)
{
  TrbProject *project;
  TrbFloor *floor;
  g_autoptr(GPtrArray) commands = NULL;
  g_autoptr(GError) error = NULL;
  TrbEditCommand *c;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  project = current_project (self);
  floor = current_floor (self);
  if (floor == NULL || g_hash_table_size (self->selection) == 0)
    return;

  /* In floor order, kind by kind, so the step reads the same however it was selected. */
  commands = g_ptr_array_new ();
  for (guint i = 0; i < floor->members->len; i++)
    if (g_hash_table_contains (self->selection, g_ptr_array_index (floor->members, i)))
      g_ptr_array_add (commands, g_ptr_array_index (floor->members, i));

  if (commands->len == 1 && g_hash_table_size (self->selection) == 1)
    {
      c = trb_edit_remove_member (project, g_ptr_array_index (commands, 0), &error);
      push (self, c, error);
      return;
    }

  /* Each removal is made against the state the ones before it left, so they go in one group
   * of the document, which re-solves once at its end. */
  {
    GPtrArray *kinds[] = { floor->columns, floor->walls, floor->area_loads, floor->line_loads,
                           floor->point_loads };
    TrbFloorItemKind item_kinds[] = { TRB_FLOOR_ITEM_COLUMN, TRB_FLOOR_ITEM_WALL,
                                      TRB_FLOOR_ITEM_AREA_LOAD, TRB_FLOOR_ITEM_LINE_LOAD,
                                      TRB_FLOOR_ITEM_POINT_LOAD };
    g_autoptr(GPtrArray) items = g_ptr_array_new ();
    g_autoptr(GArray) item_kind = g_array_new (FALSE, FALSE, sizeof (TrbFloorItemKind));
    g_autofree char *label = g_strdup_printf (ngettext ("Delete %u object",
                                                        "Delete %u objects",
                                                        g_hash_table_size (self->selection)),
                                              g_hash_table_size (self->selection));

    for (guint k = 0; k < G_N_ELEMENTS (kinds); k++)
      for (guint i = 0; i < kinds[k]->len; i++)
        if (g_hash_table_contains (self->selection, g_ptr_array_index (kinds[k], i)))
          {
            g_ptr_array_add (items, g_ptr_array_index (kinds[k], i));
            g_array_append_val (item_kind, item_kinds[k]);
          }

    trb_document_begin_group (self->document, label);
    for (guint i = 0; i < commands->len; i++)
      {
        c = trb_edit_remove_member (project, g_ptr_array_index (commands, i), &error);
        if (c == NULL)
          break;
        trb_document_push (self->document, c);
      }
    for (guint i = 0; error == NULL && i < items->len; i++)
      {
        c = trb_edit_remove_floor_item (project, floor, g_array_index (item_kind,
                                                                       TrbFloorItemKind, i),
                                        g_ptr_array_index (items, i), &error);
        if (c == NULL)
          break;
        trb_document_push (self->document, c);
      }
    if (error != NULL)
      {
        trb_document_cancel_group (self->document);
        refused (self, error);
      }
    else
      trb_document_end_group (self->document);
  }
}

/* ---- clicks ---------------------------------------------------------------------------------- */

static gboolean
hit_at (TrbPlanCanvas *self,
        double         x,
        double         y,
        TrbPlanHit    *hit)
{
  if (self->scene == NULL)
    {
      hit->kind = TRB_PLAN_HIT_NONE;
      return FALSE;
    }
  return trb_plan_hit_test (self->scene, &self->view, x, y, HIT_TOLERANCE, hit);
}

static void
select_click (TrbPlanCanvas   *self,
              double           x,
              double           y,
              GdkModifierType  state)
{
  TrbPlanHit hit;
  gboolean add = (state & (GDK_SHIFT_MASK | GDK_CONTROL_MASK)) != 0;

  if (!hit_at (self, x, y, &hit))
    {
      if (!add)
        select_only (self, NULL, NULL);
      emit_selection_changed (self);
      return;
    }
  if (add)
    {
      if (!g_hash_table_remove (self->selection, hit.object))
        g_hash_table_add (self->selection, (gpointer) hit.object);
      if (hit.kind == TRB_PLAN_HIT_MEMBER)
        self->focus_member = g_hash_table_contains (self->selection, hit.object)
                             ? (TrbMember *) hit.object : NULL;
    }
  else
    select_only (self, (gpointer) hit.object,
                 hit.kind == TRB_PLAN_HIT_MEMBER ? (TrbMember *) hit.object : NULL);
  emit_selection_changed (self);
}

/* A click of the current tool at a device point. */
static void
tool_click (TrbPlanCanvas   *self,
            double           x,
            double           y,
            GdkModifierType  state)
{
  TrbProject *project = current_project (self);
  TrbFloor *floor = current_floor (self);
  g_autoptr(GError) error = NULL;
  TrbSnap snap;
  TrbPlanHit hit;

  if (floor == NULL)
    return;

  snap_point (self, x, y, NULL, &snap);
  switch (self->tool)
    {
    case TRB_TOOL_SELECT:
      select_click (self, x, y, state);
      break;

    case TRB_TOOL_GIRDER:
    case TRB_TOOL_BEAM:
      if (self->points->len == 0)
        g_array_append_val (self->points, snap.point);
      else
        {
          TrbFramePoint a = g_array_index (self->points, TrbFramePoint, 0);

          g_array_set_size (self->points, 0);
          add_member (self, &a, &snap.point);
        }
      break;

    case TRB_TOOL_JOIST_RUN:
      if (self->support_a != NULL && self->support_b != NULL)
        {
          lay_out_joists (self);
          break;
        }
      if (!hit_at (self, x, y, &hit) || hit.kind != TRB_PLAN_HIT_MEMBER)
        break;
      if (self->support_a == NULL)
        {
          self->support_a = (TrbMember *) hit.object;
          trb_plan_view_to_plan (&self->view, x, y, &self->support_a_pick.x,
                                 &self->support_a_pick.y);
        }
      else if (hit.object != self->support_a)
        {
          self->support_b = (TrbMember *) hit.object;
          update_joist_preview (self);
        }
      break;

    case TRB_TOOL_COLUMN:
      {
        g_autofree char *mark = next_item_mark (project, "C", TRUE);

        push (self, trb_edit_add_floor_item (project, floor, TRB_FLOOR_ITEM_COLUMN,
                                             trb_column_new (mark, snap.point, NULL), &error),
              error);
      }
      break;

    case TRB_TOOL_WALL:
    case TRB_TOOL_AREA_LOAD:
    case TRB_TOOL_LINE_LOAD:
      g_array_append_val (self->points, snap.point);
      break;

    case TRB_TOOL_POINT_LOAD:
      push (self, trb_edit_add_floor_item (project, floor, TRB_FLOOR_ITEM_POINT_LOAD,
                                           trb_point_load_new (self->load_case, self->point_load,
                                                               snap.point, NULL),
                                           &error), error);
      break;

    case TRB_TOOL_DELETE:
      if (hit_at (self, x, y, &hit))
        remove_hit (self, &hit);
      break;

    default:
      break;
    }
  update_hint (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

void
trb_plan_canvas_click_plan (TrbPlanCanvas   *self,
                            double           x,
                            double           y,
                            GdkModifierType  state)
{
  double dx, dy;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  trb_plan_view_to_device (&self->view, x, y, &dx, &dy);
  tool_click (self, dx, dy, state);
}

/**
 * trb_plan_canvas_finish:
 * @self: a canvas
 *
 * Enter: closes the wall, area or line load being drawn, or lays out the joist run shown.
 */
void
trb_plan_canvas_finish (TrbPlanCanvas *self)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  if (self->tool == TRB_TOOL_JOIST_RUN && self->preview != NULL)
    lay_out_joists (self);
  else
    finish_points (self);
  update_hint (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

/**
 * trb_plan_canvas_cancel:
 * @self: a canvas
 *
 * Escape: drops what the tool has drawn so far; with nothing drawn, goes back to selecting.
 */
void
trb_plan_canvas_cancel (TrbPlanCanvas *self)
{
  gboolean busy;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  busy = self->points->len > 0 || self->support_a != NULL || self->drag != DRAG_NONE;
  g_array_set_size (self->points, 0);
  self->support_a = self->support_b = NULL;
  g_clear_pointer (&self->preview, g_array_unref);
  self->drag = DRAG_NONE;
  self->dragging = FALSE;
  if (!busy && self->tool != TRB_TOOL_SELECT)
    trb_plan_canvas_set_tool (self, TRB_TOOL_SELECT);
  else if (!busy && g_hash_table_size (self->selection) > 0)
    {
      select_only (self, NULL, NULL);
      emit_selection_changed (self);
    }
  update_hint (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

/* ---- pointer --------------------------------------------------------------------------------- */

static void
on_motion (TrbPlanCanvas            *self,
           double                    x,
           double                    y,
           GtkEventControllerMotion *controller)
{
  self->pointer_in = TRUE;
  self->pointer_x = x;
  self->pointer_y = y;
  if (tool_snaps (self->tool))
    snap_point (self, x, y, NULL, &self->snap);
  else
    {
      trb_plan_view_to_plan (&self->view, x, y, &self->snap.point.x, &self->snap.point.y);
      self->snap.kind = TRB_SNAP_NONE;
      self->snap.object = NULL;
    }
  if (self->drag == DRAG_NONE)
    hit_at (self, x, y, &self->hover);
  update_position (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

static void
on_leave (TrbPlanCanvas            *self,
          GtkEventControllerMotion *controller)
{
  self->pointer_in = FALSE;
  self->hover.kind = TRB_PLAN_HIT_NONE;
  update_position (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

/* Is (x, y) on the handle of a selected member's end? */
static gboolean
pick_handle (TrbPlanCanvas  *self,
             double          x,
             double          y,
             TrbMember     **member,
             gboolean       *is_start)
{
  TrbFloor *floor = current_floor (self);

  if (floor == NULL)
    return FALSE;
  for (guint i = 0; i < floor->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (floor->members, i);
      double sx, sy, ex, ey;

      if (!g_hash_table_contains (self->selection, m))
        continue;
      trb_plan_view_to_device (&self->view, m->start.x, m->start.y, &sx, &sy);
      trb_plan_view_to_device (&self->view, m->end.x, m->end.y, &ex, &ey);
      if (hypot (x - sx, y - sy) <= HANDLE_RADIUS)
        {
          *member = m;
          *is_start = TRUE;
          return TRUE;
        }
      if (hypot (x - ex, y - ey) <= HANDLE_RADIUS)
        {
          *member = m;
          *is_start = FALSE;
          return TRUE;
        }
    }
  return FALSE;
}

/* A press, a drag and a release, from the pointer's gesture or from
 * trb_plan_canvas_drag_plan(); device coordinates. */
static void
drag_press (TrbPlanCanvas   *self,
            double           x,
            double           y,
            guint            button,
            GdkModifierType  state)
{
  TrbPlanHit hit;

  gtk_widget_grab_focus (GTK_WIDGET (self));
  self->press_x = self->drag_x = x;
  self->press_y = self->drag_y = y;
  self->press_state = state;
  self->dragging = FALSE;
  self->drag = DRAG_NONE;

  if (button == GDK_BUTTON_MIDDLE || (button == GDK_BUTTON_PRIMARY && self->space_held))
    {
      self->drag = DRAG_PAN;
      return;
    }
  if (button != GDK_BUTTON_PRIMARY || self->tool != TRB_TOOL_SELECT)
    return;

  trb_plan_view_to_plan (&self->view, x, y, &self->drag_anchor.x, &self->drag_anchor.y);
  if (pick_handle (self, x, y, &self->drag_member, &self->drag_end_is_start))
    {
      self->drag = DRAG_MEMBER_END;
      self->drag_start = self->drag_member->start;
      self->drag_end = self->drag_member->end;
    }
  else if (hit_at (self, x, y, &hit) && g_hash_table_contains (self->selection, hit.object)
           && hit.kind == TRB_PLAN_HIT_MEMBER)
    {
      self->drag = DRAG_MEMBER;
      self->drag_member = (TrbMember *) hit.object;
      self->drag_start = self->drag_member->start;
      self->drag_end = self->drag_member->end;
    }
  else if (hit.kind == TRB_PLAN_HIT_COLUMN && g_hash_table_contains (self->selection,
                                                                      hit.object))
    {
      self->drag = DRAG_COLUMN;
      self->drag_column = (TrbColumn *) hit.object;
      self->drag_start = self->drag_column->at;
    }
  else
    self->drag = DRAG_RUBBER_BAND;
}

/* Where the dragged object would go, from the pointer at (x, y). */
static void
drag_target (TrbPlanCanvas *self,
             double         x,
             double         y,
             TrbFramePoint *start,
             TrbFramePoint *end)
{
  TrbSnap snap;

  switch (self->drag)
    {
    case DRAG_MEMBER_END:
      snap_point (self, x, y, self->drag_member, &snap);
      *start = self->drag_end_is_start ? snap.point : self->drag_start;
      *end = self->drag_end_is_start ? self->drag_end : snap.point;
      self->snap = snap;
      break;
    case DRAG_MEMBER:
    case DRAG_COLUMN:
      {
        /* the grabbed point snaps; the object moves with it */
        double dx, dy;

        snap_point (self, x, y, self->drag == DRAG_MEMBER ? self->drag_member : NULL, &snap);
        dx = snap.point.x - self->drag_anchor.x;
        dy = snap.point.y - self->drag_anchor.y;
        start->x = self->drag_start.x + dx;
        start->y = self->drag_start.y + dy;
        end->x = self->drag_end.x + dx;
        end->y = self->drag_end.y + dy;
        self->snap = snap;
      }
      break;
    default:
      *start = self->drag_start;
      *end = self->drag_end;
      break;
    }
}

static void
drag_motion (TrbPlanCanvas *self,
             double         x,
             double         y)
{
  if (!self->dragging && hypot (x - self->press_x, y - self->press_y) < DRAG_THRESHOLD)
    return;
  self->dragging = TRUE;

  if (self->drag == DRAG_PAN)
    {
      trb_plan_view_pan (&self->view, x - self->drag_x, y - self->drag_y);
      self->auto_fit = FALSE;
    }
  self->drag_x = x;
  self->drag_y = y;
  if (self->drag != DRAG_PAN && self->drag != DRAG_RUBBER_BAND && self->drag != DRAG_NONE)
    {
      TrbFramePoint s, e;

      drag_target (self, x, y, &s, &e);
    }
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

static void
finish_drag (TrbPlanCanvas *self)
{
  TrbProject *project = current_project (self);
  TrbFloor *floor = current_floor (self);
  g_autoptr(GError) error = NULL;
  TrbFramePoint s, e;

  switch (self->drag)
    {
    case DRAG_RUBBER_BAND:
      if (self->scene != NULL)
        {
          /* right to left picks what the band touches, left to right what it encloses (the
           * drafting convention) */
          gboolean touching = self->drag_x < self->press_x;
          g_autoptr(GArray) hits = trb_plan_select_rect (self->scene, &self->view,
                                                         self->press_x, self->press_y,
                                                         self->drag_x, self->drag_y, touching);

          if (!(self->press_state & (GDK_SHIFT_MASK | GDK_CONTROL_MASK)))
            select_only (self, NULL, NULL);
          for (guint i = 0; i < hits->len; i++)
            {
              const TrbPlanHit *h = &g_array_index (hits, TrbPlanHit, i);

              g_hash_table_add (self->selection, (gpointer) h->object);
              if (h->kind == TRB_PLAN_HIT_MEMBER && self->focus_member == NULL)
                self->focus_member = (TrbMember *) h->object;
            }
          emit_selection_changed (self);
        }
      break;

    case DRAG_MEMBER_END:
    case DRAG_MEMBER:
      drag_target (self, self->drag_x, self->drag_y, &s, &e);
      if (s.x != self->drag_member->start.x || s.y != self->drag_member->start.y
          || e.x != self->drag_member->end.x || e.y != self->drag_member->end.y)
        push (self, trb_edit_move_member (project, self->drag_member, &s, &e, &error), error);
      break;

    case DRAG_COLUMN:
      drag_target (self, self->drag_x, self->drag_y, &s, &e);
      if (s.x != self->drag_column->at.x || s.y != self->drag_column->at.y)
        {
          TrbColumn *moved = trb_edit_floor_item_copy (TRB_FLOOR_ITEM_COLUMN,
                                                       self->drag_column);

          moved->at = s;
          if (push (self, trb_edit_replace_floor_item (project, floor, TRB_FLOOR_ITEM_COLUMN,
                                                       self->drag_column, moved, &error),
                    error))
            select_only (self, moved, NULL);
        }
      break;

    default:
      break;
    }
}

static void
drag_release (TrbPlanCanvas *self,
              guint          button)
{
  if (self->dragging)
    finish_drag (self);
  else if (self->swallow_release)
    self->swallow_release = FALSE;
  else if (button == GDK_BUTTON_PRIMARY && self->drag != DRAG_PAN)
    tool_click (self, self->press_x, self->press_y, self->press_state);
  self->drag = DRAG_NONE;
  self->dragging = FALSE;
  self->drag_member = NULL;
  self->drag_column = NULL;
  gtk_widget_queue_draw (GTK_WIDGET (self));
}

static void
on_drag_begin (TrbPlanCanvas  *self,
               double          x,
               double          y,
               GtkGestureDrag *gesture)
{
  drag_press (self, x, y, gtk_gesture_single_get_current_button (GTK_GESTURE_SINGLE (gesture)),
              gtk_event_controller_get_current_event_state (GTK_EVENT_CONTROLLER (gesture)));
}

static void
on_drag_update (TrbPlanCanvas  *self,
                double          dx,
                double          dy,
                GtkGestureDrag *gesture)
{
  drag_motion (self, self->press_x + dx, self->press_y + dy);
}

static void
on_drag_end (TrbPlanCanvas  *self,
             double          dx,
             double          dy,
             GtkGestureDrag *gesture)
{
  drag_release (self, gtk_gesture_single_get_current_button (GTK_GESTURE_SINGLE (gesture)));
}

/**
 * trb_plan_canvas_drag_plan:
 * @self: a canvas
 * @x0: where the primary button goes down, plan m
 * @y0: where the primary button goes down, plan m
 * @x1: where it comes up
 * @y1: where it comes up
 * @state: the modifiers held (Shift adds to the selection)
 *
 * A drag with the primary button, as the pointer would make it, in ten steps: a rubber
 * band, a member's end or the member moved, a column moved; for tests.
 */
void
trb_plan_canvas_drag_plan (TrbPlanCanvas   *self,
                           double           x0,
                           double           y0,
                           double           x1,
                           double           y1,
                           GdkModifierType  state)
{
  double a, b, c, d;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  trb_plan_view_to_device (&self->view, x0, y0, &a, &b);
  trb_plan_view_to_device (&self->view, x1, y1, &c, &d);
  drag_press (self, a, b, GDK_BUTTON_PRIMARY, state);
  for (int i = 1; i <= 10; i++)
    drag_motion (self, a + (c - a) * i / 10.0, b + (d - b) * i / 10.0);
  drag_release (self, GDK_BUTTON_PRIMARY);
}

static void
on_double_click (TrbPlanCanvas   *self,
                 int              n_press,
                 double           x,
                 double           y,
                 GtkGestureClick *gesture)
{
  if (n_press != 2)
    return;
  if (self->tool == TRB_TOOL_WALL || self->tool == TRB_TOOL_AREA_LOAD
      || self->tool == TRB_TOOL_LINE_LOAD)
    {
      /* the double click's first click added its point already */
      trb_plan_canvas_finish (self);
      self->swallow_release = TRUE;
    }
}

static gboolean
on_scroll (TrbPlanCanvas            *self,
           double                    dx,
           double                    dy,
           GtkEventControllerScroll *controller)
{
  GdkModifierType state = gtk_event_controller_get_current_event_state (
    GTK_EVENT_CONTROLLER (controller));
  GdkScrollUnit unit = gtk_event_controller_scroll_get_unit (controller);
  double step = unit == GDK_SCROLL_UNIT_WHEEL ? 40.0 : 1.0;

  if (state & GDK_CONTROL_MASK)
    {
      double x = self->pointer_in ? self->pointer_x : gtk_widget_get_width (GTK_WIDGET (self)) / 2;
      double y = self->pointer_in ? self->pointer_y : gtk_widget_get_height (GTK_WIDGET (self)) / 2;

      zoom_about (self, pow (1.15, unit == GDK_SCROLL_UNIT_WHEEL ? -dy : -dy / 20.0), x, y);
    }
  else
    {
      if (state & GDK_SHIFT_MASK && dx == 0)
        {
          dx = dy;
          dy = 0;
        }
      trb_plan_view_pan (&self->view, -dx * step, -dy * step);
      self->auto_fit = FALSE;
      gtk_widget_queue_draw (GTK_WIDGET (self));
    }
  return TRUE;
}

static void
on_zoom_begin (TrbPlanCanvas    *self,
               GdkEventSequence *sequence,
               GtkGesture       *gesture)
{
  self->zoom_last = 1.0;
}

static void
on_zoom_scale_changed (TrbPlanCanvas  *self,
                       double          scale,
                       GtkGestureZoom *gesture)
{
  double x, y;

  if (!gtk_gesture_get_bounding_box_center (GTK_GESTURE (gesture), &x, &y))
    return;
  if (self->zoom_last > 0 && scale > 0)
    zoom_about (self, scale / self->zoom_last, x, y);
  self->zoom_last = scale;
}

static gboolean
on_key_pressed (TrbPlanCanvas         *self,
                guint                  keyval,
                guint                  keycode,
                GdkModifierType        state,
                GtkEventControllerKey *controller)
{
  int step;

  if (keyval == GDK_KEY_space)
    {
      self->space_held = TRUE;
      return TRUE;
    }
  step = trb_plan_canvas_key_step (keyval, state);
  if (step != 0)
    {
      trb_plan_canvas_step_selection (self, step);
      /* taken even at the end of the list: an arrow key that sometimes stepped the selection
       * and sometimes moved the focus out of the plan would lose the engineer's place */
      return TRUE;
    }
  return FALSE;
}

/* The member under a device point in words, or the selected one's for a tooltip asked for
 * from the keyboard. */
static char *
describe_member (TrbPlanCanvas *self,
                 TrbMember     *member)
{
  g_autoptr(TrbMemberItem) item = NULL;

  if (member == NULL || self->document == NULL)
    return NULL;
  item = trb_member_item_new (member, trb_document_lookup_result (self->document, member));
  return trb_member_item_describe (item);
}

static TrbMember *
member_at (TrbPlanCanvas *self,
           double         x,
           double         y)
{
  TrbPlanHit hit;

  if (hit_at (self, x, y, &hit) && hit.kind == TRB_PLAN_HIT_MEMBER)
    return (TrbMember *) hit.object;
  return NULL;
}

static gboolean
on_query_tooltip (TrbPlanCanvas *self,
                  int            x,
                  int            y,
                  gboolean       keyboard_mode,
                  GtkTooltip    *tooltip)
{
  g_autofree char *text = NULL;

  text = describe_member (self, keyboard_mode ? self->focus_member : member_at (self, x, y));
  if (text == NULL)
    return FALSE;
  gtk_tooltip_set_text (tooltip, text);
  return TRUE;
}

static void
on_key_released (TrbPlanCanvas         *self,
                 guint                  keyval,
                 guint                  keycode,
                 GdkModifierType        state,
                 GtkEventControllerKey *controller)
{
  if (keyval == GDK_KEY_space)
    self->space_held = FALSE;
}

/* ---- drawing --------------------------------------------------------------------------------- */

static void
set_rgba (cairo_t       *cr,
          const TrbRgba *c,
          double         alpha)
{
  cairo_set_source_rgba (cr, c->r, c->g, c->b, c->a * alpha);
}

static void
plan_to_device (TrbPlanCanvas       *self,
                const TrbFramePoint *p,
                double              *x,
                double              *y)
{
  trb_plan_view_to_device (&self->view, p->x, p->y, x, y);
}

/* The drawing grid as faint dots, where they are far enough apart to help. */
static void
draw_grid_dots (TrbPlanCanvas        *self,
                cairo_t              *cr,
                const TrbRenderStyle *style,
                double                width,
                double                height)
{
  double step = self->grid_spacing;
  TrbPlanBounds vis;
  TrbRgba ink;
  double n_x, n_y;

  if (!self->snap_to_grid || step <= 0)
    return;
  while (step * self->view.scale < 12)
    step *= 5;
  trb_plan_view_visible (&self->view, 0, 0, width, height, &vis);
  n_x = floor (vis.max_x / step) - ceil (vis.min_x / step) + 1;
  n_y = floor (vis.max_y / step) - ceil (vis.min_y / step) + 1;
  if (n_x * n_y > 40000)
    return;

  trb_render_ink_color (style, &ink);
  set_rgba (cr, &ink, 0.18);
  for (double gx = ceil (vis.min_x / step) * step; gx <= vis.max_x; gx += step)
    for (double gy = ceil (vis.min_y / step) * step; gy <= vis.max_y; gy += step)
      {
        double x, y;

        trb_plan_view_to_device (&self->view, gx, gy, &x, &y);
        cairo_rectangle (cr, round (x) - 0.5, round (y) - 0.5, 1.5, 1.5);
      }
  cairo_fill (cr);
}

static void
draw_length_label (TrbPlanCanvas        *self,
                   cairo_t              *cr,
                   const TrbRenderStyle *style,
                   const TrbFramePoint  *a,
                   const TrbFramePoint  *b)
{
  g_autofree char *text = trb_units_format (hypot (b->x - a->x, b->y - a->y), TRB_DIM_LENGTH,
                                            units (self));
  double ax, ay, bx, by, w, h;
  TrbRgba ink, paper;

  plan_to_device (self, a, &ax, &ay);
  plan_to_device (self, b, &bx, &by);
  trb_render_ink_color (style, &ink);
  trb_render_paper_color (style, &paper);
  w = trb_render_text_width (cr, style, text, style->font_size, TRUE);
  h = style->font_size * 1.3;
  set_rgba (cr, &paper, 0.9);
  cairo_rectangle (cr, (ax + bx) / 2 - w / 2 - 4, (ay + by) / 2 - h - 8, w + 8, h + 4);
  cairo_fill (cr);
  trb_render_set_color (cr, &ink);
  trb_render_text (cr, style, text, style->font_size, TRUE, (ax + bx) / 2, (ay + by) / 2 - 6,
                   0.5, 1.0, NULL);
}

static void
draw_snap_marker (TrbPlanCanvas        *self,
                  cairo_t              *cr,
                  const TrbRenderStyle *style)
{
  double x, y, r = 5;
  TrbRgba sel;

  if (!self->pointer_in || self->snap.kind == TRB_SNAP_NONE)
    return;
  plan_to_device (self, &self->snap.point, &x, &y);
  trb_render_selection_color (style, &sel);
  cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1.0);
  cairo_set_line_width (cr, 1.5);
  switch (self->snap.kind)
    {
    case TRB_SNAP_END:
    case TRB_SNAP_COLUMN:
      cairo_rectangle (cr, x - r, y - r, 2 * r, 2 * r);
      break;
    case TRB_SNAP_GRID_CROSSING:
      cairo_arc (cr, x, y, r, 0, 2 * G_PI);
      break;
    case TRB_SNAP_ON_MEMBER:
    case TRB_SNAP_ON_WALL:
      cairo_move_to (cr, x, y - r);
      cairo_line_to (cr, x + r, y + r);
      cairo_line_to (cr, x - r, y + r);
      cairo_close_path (cr);
      break;
    case TRB_SNAP_GRID:
    default:
      cairo_move_to (cr, x - r, y);
      cairo_line_to (cr, x + r, y);
      cairo_move_to (cr, x, y - r);
      cairo_line_to (cr, x, y + r);
      break;
    }
  cairo_stroke (cr);
}

static void
stroke_member_line (TrbPlanCanvas       *self,
                    cairo_t             *cr,
                    const TrbFramePoint *a,
                    const TrbFramePoint *b)
{
  double ax, ay, bx, by;

  plan_to_device (self, a, &ax, &ay);
  plan_to_device (self, b, &bx, &by);
  cairo_move_to (cr, ax, ay);
  cairo_line_to (cr, bx, by);
  cairo_stroke (cr);
}

static void
draw_tool_overlay (TrbPlanCanvas        *self,
                   cairo_t              *cr,
                   const TrbRenderStyle *style,
                   double                width,
                   double                height)
{
  TrbRgba sel, ink;
  static const double dash[] = { 6.0, 4.0 };

  trb_render_selection_color (style, &sel);
  trb_render_ink_color (style, &ink);
  cairo_set_line_cap (cr, CAIRO_LINE_CAP_ROUND);

  /* the hovered object: a soft halo */
  if (self->hover.kind == TRB_PLAN_HIT_MEMBER && self->drag == DRAG_NONE)
    {
      const TrbMember *m = self->hover.object;

      set_rgba (cr, &sel, 0.6);
      cairo_set_line_width (cr, style->line_width + 8);
      stroke_member_line (self, cr, &m->start, &m->end);
    }
  else if (self->hover.kind == TRB_PLAN_HIT_COLUMN && self->drag == DRAG_NONE)
    {
      const TrbColumn *c = self->hover.object;
      double x, y;

      plan_to_device (self, &c->at, &x, &y);
      set_rgba (cr, &sel, 0.6);
      cairo_arc (cr, x, y, 10, 0, 2 * G_PI);
      cairo_fill (cr);
    }

  /* handles on the ends of selected members */
  if (self->tool == TRB_TOOL_SELECT && current_floor (self) != NULL
      && g_hash_table_size (self->selection) <= 200)
    {
      GHashTableIter it;
      gpointer key;
      TrbFloor *floor = current_floor (self);

      g_hash_table_iter_init (&it, self->selection);
      while (g_hash_table_iter_next (&it, &key, NULL))
        {
          const TrbMember *m = key;
          double x, y;

          if (!g_ptr_array_find (floor->members, m, NULL))
            continue;
          for (int e = 0; e < 2; e++)
            {
              plan_to_device (self, e == 0 ? &m->start : &m->end, &x, &y);
              cairo_set_source_rgb (cr, 1, 1, 1);
              cairo_arc (cr, x, y, 4.5, 0, 2 * G_PI);
              cairo_fill_preserve (cr);
              cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1);
              cairo_set_line_width (cr, 2);
              cairo_stroke (cr);
            }
        }
    }

  /* a member end or member being dragged */
  if (self->dragging && (self->drag == DRAG_MEMBER_END || self->drag == DRAG_MEMBER))
    {
      TrbFramePoint s, e;

      drag_target (self, self->drag_x, self->drag_y, &s, &e);
      cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1);
      cairo_set_line_width (cr, style->line_width + 1);
      cairo_set_dash (cr, dash, 2, 0);
      stroke_member_line (self, cr, &s, &e);
      cairo_set_dash (cr, NULL, 0, 0);
      draw_length_label (self, cr, style, &s, &e);
    }
  else if (self->dragging && self->drag == DRAG_COLUMN)
    {
      TrbFramePoint s, e;
      double x, y;

      drag_target (self, self->drag_x, self->drag_y, &s, &e);
      plan_to_device (self, &s, &x, &y);
      cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1);
      cairo_rectangle (cr, x - 6, y - 6, 12, 12);
      cairo_fill (cr);
    }

  /* the rubber band */
  if (self->dragging && self->drag == DRAG_RUBBER_BAND)
    {
      double x0 = MIN (self->press_x, self->drag_x), y0 = MIN (self->press_y, self->drag_y);
      double w = fabs (self->drag_x - self->press_x), h = fabs (self->drag_y - self->press_y);

      set_rgba (cr, &sel, 0.25);
      cairo_rectangle (cr, x0, y0, w, h);
      cairo_fill_preserve (cr);
      cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1);
      cairo_set_line_width (cr, 1);
      if (self->drag_x < self->press_x)
        cairo_set_dash (cr, dash, 2, 0);
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
    }

  /* the points a tool has so far, and the segment to the pointer */
  if (self->points->len > 0)
    {
      TrbFramePoint last = g_array_index (self->points, TrbFramePoint, self->points->len - 1);
      double x, y;

      cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1);
      cairo_set_line_width (cr, self->tool == TRB_TOOL_WALL ? 6 : style->line_width + 1);
      for (guint i = 0; i < self->points->len; i++)
        {
          plan_to_device (self, &g_array_index (self->points, TrbFramePoint, i), &x, &y);
          if (i == 0)
            cairo_move_to (cr, x, y);
          else
            cairo_line_to (cr, x, y);
        }
      if (self->pointer_in)
        {
          plan_to_device (self, &self->snap.point, &x, &y);
          cairo_line_to (cr, x, y);
        }
      if (self->tool == TRB_TOOL_AREA_LOAD)
        {
          cairo_close_path (cr);
          cairo_save (cr);
          set_rgba (cr, &sel, 0.3);
          cairo_fill_preserve (cr);
          cairo_restore (cr);
        }
      cairo_set_dash (cr, dash, 2, 0);
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
      if (self->pointer_in)
        draw_length_label (self, cr, style, &last, &self->snap.point);
    }

  /* joist run: the supports picked and the joists it would lay out */
  if (self->tool == TRB_TOOL_JOIST_RUN)
    {
      const TrbMember *picked[] = { self->support_a, self->support_b };

      for (guint k = 0; k < 2; k++)
        if (picked[k] != NULL)
          {
            set_rgba (cr, &sel, 0.8);
            cairo_set_line_width (cr, style->line_width + 6);
            stroke_member_line (self, cr, &picked[k]->start, &picked[k]->end);
          }
      if (self->preview != NULL)
        {
          cairo_set_source_rgba (cr, sel.r, sel.g, sel.b, 1);
          cairo_set_line_width (cr, 1.5);
          cairo_set_dash (cr, dash, 2, 0);
          for (guint i = 0; i < self->preview->len; i++)
            {
              const TrbLayoutLine *l = &g_array_index (self->preview, TrbLayoutLine, i);

              stroke_member_line (self, cr, &l->start, &l->end);
            }
          cairo_set_dash (cr, NULL, 0, 0);
          if (self->preview->len > 0)
            {
              g_autofree char *count = g_strdup_printf (ngettext ("%u joist", "%u joists",
                                                                  self->preview->len),
                                                        self->preview->len);
              const TrbLayoutLine *l = &g_array_index (self->preview, TrbLayoutLine, 0);
              double x, y;

              plan_to_device (self, &l->start, &x, &y);
              trb_render_set_color (cr, &ink);
              trb_render_text (cr, style, count, style->font_size, TRUE, x, y - 8, 0.0, 1.0,
                               NULL);
            }
        }
    }

  if (tool_snaps (self->tool) || self->drag == DRAG_MEMBER_END || self->drag == DRAG_MEMBER
      || self->drag == DRAG_COLUMN)
    draw_snap_marker (self, cr, style);
}

static void
trb_plan_canvas_snapshot (GtkWidget   *widget,
                          GtkSnapshot *snapshot)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (widget);
  int width = gtk_widget_get_width (widget);
  int height = gtk_widget_get_height (widget);
  TrbPlanDrawOptions options;
  TrbRgba paper;
  cairo_t *cr;

  if (width <= 0 || height <= 0)
    return;
  if (self->needs_fit)
    trb_plan_canvas_zoom_to_fit (self);

  trb_plan_draw_options_init (&options, width, height);
  options.style.dark = adw_style_manager_get_dark (adw_style_manager_get_default ());
  options.selection = self->selection;

  if (self->plan_node != NULL
      && (width != self->plan_node_width || height != self->plan_node_height
          || options.style.dark != self->plan_node_dark
          || memcmp (&self->view, &self->plan_node_view, sizeof self->view) != 0))
    g_clear_pointer (&self->plan_node, gsk_render_node_unref);
  if (self->plan_node == NULL)
    {
      GtkSnapshot *plan = gtk_snapshot_new ();

      cr = gtk_snapshot_append_cairo (plan, &GRAPHENE_RECT_INIT (0, 0, width, height));
      trb_render_paper_color (&options.style, &paper);
      trb_render_set_color (cr, &paper);
      cairo_paint (cr);
      draw_grid_dots (self, cr, &options.style, width, height);
      if (self->scene != NULL)
        trb_plan_draw (cr, self->scene, &self->view, &options);
      else if (self->document != NULL)
        {
          TrbRgba ink;

          /* a project of standalone beams: they are in the list, not on a plan */
          trb_render_ink_color (&options.style, &ink);
          trb_render_set_color (cr, &ink);
          trb_render_text (cr, &options.style, _("This project has no floor plan"),
                           options.style.font_size * 1.5, TRUE, width / 2.0, height / 2.0 - 4,
                           0.5, 1.0, NULL);
          trb_render_text (cr, &options.style,
                           _("Its beams are in the list below; pick one to see and change it"),
                           options.style.font_size, FALSE, width / 2.0, height / 2.0 + 4, 0.5,
                           0.0, NULL);
        }
      cairo_destroy (cr);
      self->plan_node = gtk_snapshot_free_to_node (plan);
      self->plan_node_view = self->view;
      self->plan_node_width = width;
      self->plan_node_height = height;
      self->plan_node_dark = options.style.dark;
    }
  if (self->plan_node != NULL)
    gtk_snapshot_append_node (snapshot, self->plan_node);

  cr = gtk_snapshot_append_cairo (snapshot, &GRAPHENE_RECT_INIT (0, 0, width, height));
  draw_tool_overlay (self, cr, &options.style, width, height);
  cairo_destroy (cr);
}

static void
trb_plan_canvas_size_allocate (GtkWidget *widget,
                               int        width,
                               int        height,
                               int        baseline)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (widget);

  if (self->needs_fit || self->auto_fit)
    trb_plan_canvas_zoom_to_fit (self);
}

static void
trb_plan_canvas_measure (GtkWidget      *widget,
                         GtkOrientation  orientation,
                         int             for_size,
                         int            *minimum,
                         int            *natural,
                         int            *minimum_baseline,
                         int            *natural_baseline)
{
  *minimum = 200;
  *natural = orientation == GTK_ORIENTATION_HORIZONTAL ? 900 : 600;
}

/* ---- public ---------------------------------------------------------------------------------- */

GtkWidget *
trb_plan_canvas_new (void)
{
  return g_object_new (TRB_TYPE_PLAN_CANVAS, NULL);
}

TrbDocument *
trb_plan_canvas_get_document (TrbPlanCanvas *self)
{
  g_return_val_if_fail (TRB_IS_PLAN_CANVAS (self), NULL);
  return self->document;
}

void
trb_plan_canvas_set_document (TrbPlanCanvas *self,
                              TrbDocument   *document)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));
  g_return_if_fail (document == NULL || TRB_IS_DOCUMENT (document));

  if (self->document == document)
    return;
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_clear_pointer (&self->scene, trb_plan_scene_free);
  g_hash_table_remove_all (self->selection);
  self->focus_member = NULL;
  self->hover.kind = TRB_PLAN_HIT_NONE;
  trb_plan_canvas_cancel (self);
  g_set_object (&self->document, document);
  if (document != NULL)
    {
      g_signal_connect_object (document, "changed", G_CALLBACK (on_document_changed), self,
                               G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "solved", G_CALLBACK (on_document_solved), self,
                               G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "notify::floor-index", G_CALLBACK (on_document_floor),
                               self, G_CONNECT_SWAPPED);
      rebuild_scene (self);
    }
  self->needs_fit = TRUE;
  self->auto_fit = TRUE;
  trb_plan_canvas_zoom_to_fit (self);
  emit_selection_changed (self);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_DOCUMENT]);
}

TrbTool
trb_plan_canvas_get_tool (TrbPlanCanvas *self)
{
  g_return_val_if_fail (TRB_IS_PLAN_CANVAS (self), TRB_TOOL_SELECT);
  return self->tool;
}

void
trb_plan_canvas_set_tool (TrbPlanCanvas *self,
                          TrbTool        tool)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  if (self->tool == tool)
    return;
  g_array_set_size (self->points, 0);
  self->support_a = self->support_b = NULL;
  g_clear_pointer (&self->preview, g_array_unref);
  self->tool = tool;
  update_hint (self);
  gtk_widget_queue_draw (GTK_WIDGET (self));
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_TOOL]);
}

/**
 * trb_plan_canvas_get_selected_member:
 * @self: a canvas
 *
 * Returns: (transfer none) (nullable): the member the panels show: the last one picked.
 */
TrbMember *
trb_plan_canvas_get_selected_member (TrbPlanCanvas *self)
{
  g_return_val_if_fail (TRB_IS_PLAN_CANVAS (self), NULL);
  return self->focus_member;
}

guint
trb_plan_canvas_get_n_selected (TrbPlanCanvas *self)
{
  g_return_val_if_fail (TRB_IS_PLAN_CANVAS (self), 0);
  return g_hash_table_size (self->selection);
}

/**
 * trb_plan_canvas_select_member:
 * @self: a canvas
 * @member: (nullable): a member of the floor shown, or %NULL to select nothing
 * @reveal: whether to pan the plan so that the member is in view
 */
void
trb_plan_canvas_select_member (TrbPlanCanvas *self,
                               TrbMember     *member,
                               gboolean       reveal)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  if (member == self->focus_member && g_hash_table_size (self->selection) == (member != NULL))
    return;
  select_only (self, member, member);
  if (reveal && member != NULL && member->floor == current_floor (self))
    {
      int w = gtk_widget_get_width (GTK_WIDGET (self));
      int h = gtk_widget_get_height (GTK_WIDGET (self));
      TrbPlanBounds vis;
      double mx = (member->start.x + member->end.x) / 2;
      double my = (member->start.y + member->end.y) / 2;

      trb_plan_view_visible (&self->view, 0, 0, w, h, &vis);
      if (mx < vis.min_x || mx > vis.max_x || my < vis.min_y || my > vis.max_y)
        {
          double x, y;

          trb_plan_view_to_device (&self->view, mx, my, &x, &y);
          trb_plan_view_pan (&self->view, w / 2.0 - x, h / 2.0 - y);
          self->auto_fit = FALSE;
        }
    }
  emit_selection_changed (self);
}

void
trb_plan_canvas_select_all (TrbPlanCanvas *self)
{
  TrbFloor *floor;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  floor = current_floor (self);
  if (floor == NULL)
    return;
  add_all (self->selection, floor->members);
  if (self->focus_member == NULL && floor->members->len > 0)
    self->focus_member = g_ptr_array_index (floor->members, 0);
  emit_selection_changed (self);
}

/* ---- keyboard -------------------------------------------------------------------------------- */

/**
 * trb_plan_canvas_key_step:
 * @keyval: a key
 * @state: the modifiers held
 *
 * Returns: +1 for a key that steps the selection to the next member (Down, Right), -1 for
 *   one that steps it back (Up, Left), 0 for any other key or with Ctrl, Alt or Super held,
 *   which are the window's.
 */
int
trb_plan_canvas_key_step (guint           keyval,
                          GdkModifierType state)
{
  if ((state & (GDK_CONTROL_MASK | GDK_ALT_MASK | GDK_SUPER_MASK | GDK_META_MASK)) != 0)
    return 0;
  switch (keyval)
    {
    case GDK_KEY_Down:
    case GDK_KEY_KP_Down:
    case GDK_KEY_Right:
    case GDK_KEY_KP_Right:
      return 1;
    case GDK_KEY_Up:
    case GDK_KEY_KP_Up:
    case GDK_KEY_Left:
    case GDK_KEY_KP_Left:
      return -1;
    default:
      return 0;
    }
}

static TrbMember *
order_member (GListModel *order,
              guint       position)
{
  g_autoptr(TrbMemberItem) item = g_list_model_get_item (order, position);

  /* the project keeps its members; the row only points at one */
  return trb_member_item_get_member (item);
}

/**
 * trb_plan_canvas_step_member:
 * @order: the members as the list shows them (#TrbMemberItem), filtered and sorted
 * @floor: (nullable): the floor on the plan; members of other floors are passed over
 * @current: (nullable): the selected member
 * @step: how many members on (negative: back)
 *
 * The member @step places from @current in @order, going round from the last to the first;
 * from no member (or one the list does not show), the first going on and the last going
 * back.
 *
 * Returns: (transfer none) (nullable): the member, or %NULL when @order has none of @floor
 */
TrbMember *
trb_plan_canvas_step_member (GListModel *order,
                             TrbFloor   *floor,
                             TrbMember  *current,
                             int         step)
{
  guint n, at = G_MAXUINT;
  int dir;

  g_return_val_if_fail (G_IS_LIST_MODEL (order), NULL);

  n = g_list_model_get_n_items (order);
  if (n == 0)
    return NULL;
  for (guint i = 0; i < n && current != NULL; i++)
    if (order_member (order, i) == current)
      {
        at = i;
        break;
      }
  if (step == 0)
    return at != G_MAXUINT ? current : NULL;

  dir = step > 0 ? 1 : -1;
  /* from nowhere, start just outside the list so that one step lands on an end */
  if (at == G_MAXUINT)
    at = dir > 0 ? n - 1 : 0;
  for (guint remaining = ABS (step); remaining > 0; remaining--)
    {
      guint tried = 0;

      do
        {
          at = (at + n + dir) % n;
          tried++;
        }
      while (order_member (order, at)->floor != floor && tried < n);
      if (order_member (order, at)->floor != floor)
        return NULL;
    }
  return order_member (order, at);
}

/**
 * trb_plan_canvas_set_member_order:
 * @self: a canvas
 * @order: (nullable): the members as the list shows them (#TrbMemberItem)
 *
 * The order the arrow keys step the selection in.
 */
void
trb_plan_canvas_set_member_order (TrbPlanCanvas *self,
                                  GListModel    *order)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));
  g_return_if_fail (order == NULL || G_IS_LIST_MODEL (order));

  g_set_object (&self->member_order, order);
}

/**
 * trb_plan_canvas_step_selection:
 * @self: a canvas
 * @step: +1 for the next member, -1 for the one before
 *
 * The arrow keys: selects the member @step places on in the members list's order and pans
 * the plan to it when it is out of view.
 */
void
trb_plan_canvas_step_selection (TrbPlanCanvas *self,
                                int            step)
{
  TrbMember *member;

  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  if (self->member_order == NULL || self->document == NULL || step == 0)
    return;
  member = trb_plan_canvas_step_member (self->member_order, current_floor (self),
                                        self->focus_member, step);
  if (member != NULL)
    trb_plan_canvas_select_member (self, member, TRUE);
}

/**
 * trb_plan_canvas_open_selected:
 * @self: a canvas
 *
 * Enter with the Select tool: asks (::member-opened) for the selected member to be shown in
 * the member panel, where the keyboard can change it.
 */
void
trb_plan_canvas_open_selected (TrbPlanCanvas *self)
{
  g_return_if_fail (TRB_IS_PLAN_CANVAS (self));

  if (self->focus_member != NULL)
    g_signal_emit (self, signals[MEMBER_OPENED], 0, self->focus_member);
}

/**
 * trb_plan_canvas_describe_at:
 * @self: a canvas
 * @x: plan x (m)
 * @y: plan y (m)
 *
 * What the plan's tooltip says with the pointer at (@x, @y).
 *
 * Returns: (transfer full) (nullable): "G1, W12X14, Passes, ratio 0.87" for the member
 *   there, %NULL with none
 */
char *
trb_plan_canvas_describe_at (TrbPlanCanvas *self,
                             double         x,
                             double         y)
{
  double dx, dy;

  g_return_val_if_fail (TRB_IS_PLAN_CANVAS (self), NULL);

  trb_plan_view_to_device (&self->view, x, y, &dx, &dy);
  return describe_member (self, member_at (self, dx, dy));
}

/* ---- actions --------------------------------------------------------------------------------- */

static void
action_zoom (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (widget);

  if (g_str_equal (name, "canvas.zoom-in"))
    trb_plan_canvas_zoom (self, 1.25);
  else if (g_str_equal (name, "canvas.zoom-out"))
    trb_plan_canvas_zoom (self, 0.8);
  else
    trb_plan_canvas_zoom_to_fit (self);
}

static void
action_edit (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (widget);

  if (g_str_equal (name, "canvas.delete"))
    trb_plan_canvas_delete_selection (self);
  else if (g_str_equal (name, "canvas.cancel"))
    trb_plan_canvas_cancel (self);
  else if (g_str_equal (name, "canvas.finish"))
    {
      /* Enter: with nothing being drawn, the selected member is opened */
      if (self->tool == TRB_TOOL_SELECT)
        trb_plan_canvas_open_selected (self);
      else
        trb_plan_canvas_finish (self);
    }
  else if (g_str_equal (name, "canvas.select-all"))
    trb_plan_canvas_select_all (self);
}

/* ---- object ---------------------------------------------------------------------------------- */

static void
trb_plan_canvas_dispose (GObject *object)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_clear_pointer (&self->scene, trb_plan_scene_free);
  g_clear_pointer (&self->plan_node, gsk_render_node_unref);
  g_clear_object (&self->document);
  g_clear_object (&self->member_order);
  g_clear_pointer (&self->preview, g_array_unref);

  G_OBJECT_CLASS (trb_plan_canvas_parent_class)->dispose (object);
}

static void
trb_plan_canvas_finalize (GObject *object)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (object);

  g_hash_table_unref (self->selection);
  g_array_unref (self->points);
  g_free (self->hint);
  g_free (self->position);

  G_OBJECT_CLASS (trb_plan_canvas_parent_class)->finalize (object);
}

static void
trb_plan_canvas_get_property (GObject    *object,
                              guint       prop_id,
                              GValue     *value,
                              GParamSpec *pspec)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      g_value_set_object (value, self->document);
      break;
    case PROP_TOOL:
      g_value_set_enum (value, self->tool);
      break;
    case PROP_GRID_SPACING:
      g_value_set_double (value, self->grid_spacing);
      break;
    case PROP_SNAP_TO_GRID:
      g_value_set_boolean (value, self->snap_to_grid);
      break;
    case PROP_SNAP_TO_MEMBERS:
      g_value_set_boolean (value, self->snap_to_members);
      break;
    case PROP_LOAD_CASE:
      g_value_set_uint (value, self->load_case);
      break;
    case PROP_AREA_PRESSURE:
      g_value_set_double (value, self->area_pressure);
      break;
    case PROP_LINE_LOAD:
      g_value_set_double (value, self->line_load);
      break;
    case PROP_POINT_LOAD:
      g_value_set_double (value, self->point_load);
      break;
    case PROP_JOIST_SPACING:
      g_value_set_double (value, self->joist_spacing);
      break;
    case PROP_HINT:
      g_value_set_string (value, self->hint);
      break;
    case PROP_POSITION:
      g_value_set_string (value, self->position);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_plan_canvas_set_property (GObject      *object,
                              guint         prop_id,
                              const GValue *value,
                              GParamSpec   *pspec)
{
  TrbPlanCanvas *self = TRB_PLAN_CANVAS (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      trb_plan_canvas_set_document (self, g_value_get_object (value));
      break;
    case PROP_TOOL:
      trb_plan_canvas_set_tool (self, g_value_get_enum (value));
      break;
    case PROP_GRID_SPACING:
      self->grid_spacing = g_value_get_double (value);
      invalidate_plan (self);
      break;
    case PROP_SNAP_TO_GRID:
      self->snap_to_grid = g_value_get_boolean (value);
      invalidate_plan (self);
      break;
    case PROP_SNAP_TO_MEMBERS:
      self->snap_to_members = g_value_get_boolean (value);
      break;
    case PROP_LOAD_CASE:
      self->load_case = g_value_get_uint (value);
      break;
    case PROP_AREA_PRESSURE:
      self->area_pressure = g_value_get_double (value);
      break;
    case PROP_LINE_LOAD:
      self->line_load = g_value_get_double (value);
      break;
    case PROP_POINT_LOAD:
      self->point_load = g_value_get_double (value);
      break;
    case PROP_JOIST_SPACING:
      self->joist_spacing = g_value_get_double (value);
      if (self->support_b != NULL)
        {
          update_joist_preview (self);
          gtk_widget_queue_draw (GTK_WIDGET (self));
        }
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
add_tool_key (GtkWidgetClass *widget_class,
              guint           keyval,
              const char     *tool)
{
  gtk_widget_class_add_binding_action (widget_class, keyval, 0, "canvas.tool", "s", tool);
}

static void
trb_plan_canvas_class_init (TrbPlanCanvasClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = trb_plan_canvas_dispose;
  object_class->finalize = trb_plan_canvas_finalize;
  object_class->get_property = trb_plan_canvas_get_property;
  object_class->set_property = trb_plan_canvas_set_property;

  widget_class->snapshot = trb_plan_canvas_snapshot;
  widget_class->size_allocate = trb_plan_canvas_size_allocate;
  widget_class->measure = trb_plan_canvas_measure;

  properties[PROP_DOCUMENT] =
    g_param_spec_object ("document", NULL, NULL, TRB_TYPE_DOCUMENT,
                         G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_TOOL] =
    g_param_spec_enum ("tool", NULL, NULL, TRB_TYPE_TOOL, TRB_TOOL_SELECT,
                       G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  /* one foot, the everyday drawing grid of US framing plans (common practice) */
  properties[PROP_GRID_SPACING] =
    g_param_spec_double ("grid-spacing", NULL, NULL, 0, 100, 0.3048,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_SNAP_TO_GRID] =
    g_param_spec_boolean ("snap-to-grid", NULL, NULL, TRUE,
                          G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_SNAP_TO_MEMBERS] =
    g_param_spec_boolean ("snap-to-members", NULL, NULL, TRUE,
                          G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_LOAD_CASE] =
    g_param_spec_uint ("load-case", NULL, NULL, 0, TRB_N_CASES - 1, TRB_CASE_D,
                       G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_AREA_PRESSURE] =
    g_param_spec_double ("area-pressure", NULL, NULL, -G_MAXDOUBLE, G_MAXDOUBLE, 0,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_LINE_LOAD] =
    g_param_spec_double ("line-load", NULL, NULL, -G_MAXDOUBLE, G_MAXDOUBLE, 0,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_POINT_LOAD] =
    g_param_spec_double ("point-load", NULL, NULL, -G_MAXDOUBLE, G_MAXDOUBLE, 0,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  /* 16 in on centre, the everyday joist spacing (common practice) */
  properties[PROP_JOIST_SPACING] =
    g_param_spec_double ("joist-spacing", NULL, NULL, 0.01, 100, 0.4064,
                         G_PARAM_READWRITE | G_PARAM_STATIC_STRINGS);
  properties[PROP_HINT] =
    g_param_spec_string ("hint", NULL, NULL, NULL, G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_POSITION] =
    g_param_spec_string ("position", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  signals[SELECTION_CHANGED] =
    g_signal_new ("selection-changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                  NULL, NULL, NULL, G_TYPE_NONE, 0);
  /* an edit a tool tried and the model refused, with the reason */
  signals[EDIT_REFUSED] =
    g_signal_new ("edit-refused", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                  NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_STRING);
  /**
   * TrbPlanCanvas::member-opened:
   * @member: (type gpointer): the #TrbMember selected
   *
   * Enter on a selected member: the window shows it in the member panel.
   */
  signals[MEMBER_OPENED] =
    g_signal_new ("member-opened", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                  NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_POINTER);

  gtk_widget_class_install_property_action (widget_class, "canvas.tool", "tool");
  gtk_widget_class_install_action (widget_class, "canvas.zoom-in", NULL, action_zoom);
  gtk_widget_class_install_action (widget_class, "canvas.zoom-out", NULL, action_zoom);
  gtk_widget_class_install_action (widget_class, "canvas.zoom-fit", NULL, action_zoom);
  gtk_widget_class_install_action (widget_class, "canvas.delete", NULL, action_edit);
  gtk_widget_class_install_action (widget_class, "canvas.cancel", NULL, action_edit);
  gtk_widget_class_install_action (widget_class, "canvas.finish", NULL, action_edit);
  gtk_widget_class_install_action (widget_class, "canvas.select-all", NULL, action_edit);

  /* Single keys only while the plan has the focus, so they never reach an entry. */
  add_tool_key (widget_class, GDK_KEY_v, "select");
  add_tool_key (widget_class, GDK_KEY_g, "girder");
  add_tool_key (widget_class, GDK_KEY_b, "beam");
  add_tool_key (widget_class, GDK_KEY_j, "joist-run");
  add_tool_key (widget_class, GDK_KEY_c, "column");
  add_tool_key (widget_class, GDK_KEY_w, "wall");
  add_tool_key (widget_class, GDK_KEY_a, "area-load");
  add_tool_key (widget_class, GDK_KEY_l, "line-load");
  add_tool_key (widget_class, GDK_KEY_p, "point-load");
  add_tool_key (widget_class, GDK_KEY_x, "delete");
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Escape, 0, "canvas.cancel", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Return, 0, "canvas.finish", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Enter, 0, "canvas.finish",
                                       NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Delete, 0, "canvas.delete", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_BackSpace, 0, "canvas.delete",
                                       NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_a, GDK_CONTROL_MASK,
                                       "canvas.select-all", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_plus, 0, "canvas.zoom-in", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_equal, 0, "canvas.zoom-in", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Add, 0, "canvas.zoom-in", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_minus, 0, "canvas.zoom-out", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_KP_Subtract, 0, "canvas.zoom-out",
                                       NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_f, 0, "canvas.zoom-fit", NULL);
  gtk_widget_class_add_binding_action (widget_class, GDK_KEY_Home, 0, "canvas.zoom-fit", NULL);

  gtk_widget_class_set_css_name (widget_class, "plancanvas");
  gtk_widget_class_set_accessible_role (widget_class, GTK_ACCESSIBLE_ROLE_IMG);
}

static void
trb_plan_canvas_init (TrbPlanCanvas *self)
{
  GtkEventController *controller;
  GtkGesture *gesture;

  self->selection = g_hash_table_new (NULL, NULL);
  self->points = g_array_new (FALSE, TRUE, sizeof (TrbFramePoint));
  self->grid_spacing = 0.3048;
  self->snap_to_grid = TRUE;
  self->snap_to_members = TRUE;
  self->joist_spacing = 0.4064;
  trb_plan_view_init (&self->view);
  self->needs_fit = TRUE;

  gtk_widget_set_focusable (GTK_WIDGET (self), TRUE);
  /* the member under the pointer in words, as the members list has it */
  gtk_widget_set_has_tooltip (GTK_WIDGET (self), TRUE);
  g_signal_connect (self, "query-tooltip", G_CALLBACK (on_query_tooltip), NULL);
  gtk_widget_set_hexpand (GTK_WIDGET (self), TRUE);
  gtk_widget_set_vexpand (GTK_WIDGET (self), TRUE);

  controller = gtk_event_controller_motion_new ();
  g_signal_connect_swapped (controller, "motion", G_CALLBACK (on_motion), self);
  g_signal_connect_swapped (controller, "leave", G_CALLBACK (on_leave), self);
  gtk_widget_add_controller (GTK_WIDGET (self), controller);

  gesture = gtk_gesture_drag_new ();
  gtk_gesture_single_set_button (GTK_GESTURE_SINGLE (gesture), 0);
  g_signal_connect_swapped (gesture, "drag-begin", G_CALLBACK (on_drag_begin), self);
  g_signal_connect_swapped (gesture, "drag-update", G_CALLBACK (on_drag_update), self);
  g_signal_connect_swapped (gesture, "drag-end", G_CALLBACK (on_drag_end), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (gesture));

  gesture = gtk_gesture_click_new ();
  gtk_gesture_single_set_button (GTK_GESTURE_SINGLE (gesture), GDK_BUTTON_PRIMARY);
  g_signal_connect_swapped (gesture, "pressed", G_CALLBACK (on_double_click), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (gesture));

  controller = gtk_event_controller_scroll_new (GTK_EVENT_CONTROLLER_SCROLL_BOTH_AXES);
  g_signal_connect_swapped (controller, "scroll", G_CALLBACK (on_scroll), self);
  gtk_widget_add_controller (GTK_WIDGET (self), controller);

  gesture = gtk_gesture_zoom_new ();
  g_signal_connect_swapped (gesture, "begin", G_CALLBACK (on_zoom_begin), self);
  g_signal_connect_swapped (gesture, "scale-changed", G_CALLBACK (on_zoom_scale_changed), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (gesture));

  controller = gtk_event_controller_key_new ();
  g_signal_connect_swapped (controller, "key-pressed", G_CALLBACK (on_key_pressed), self);
  g_signal_connect_swapped (controller, "key-released", G_CALLBACK (on_key_released), self);
  gtk_widget_add_controller (GTK_WIDGET (self), controller);

  g_signal_connect_object (adw_style_manager_get_default (), "notify::dark",
                           G_CALLBACK (gtk_widget_queue_draw), self, G_CONNECT_SWAPPED);

  update_hint (self);
}
