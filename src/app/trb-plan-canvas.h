/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <gtk/gtk.h>

#include "trb-document.h"

G_BEGIN_DECLS

/* What a click on the plan does. */
typedef enum
{
  TRB_TOOL_SELECT,
  TRB_TOOL_GIRDER,
  TRB_TOOL_BEAM,
  TRB_TOOL_JOIST_RUN,
  TRB_TOOL_COLUMN,
  TRB_TOOL_WALL,
  TRB_TOOL_AREA_LOAD,
  TRB_TOOL_LINE_LOAD,
  TRB_TOOL_POINT_LOAD,
  TRB_TOOL_DELETE,
} TrbTool;

#define TRB_TYPE_PLAN_CANVAS (trb_plan_canvas_get_type ())

G_DECLARE_FINAL_TYPE (TrbPlanCanvas, trb_plan_canvas, TRB, PLAN_CANVAS, GtkWidget)

/* The framing plan on the screen: drawn by the render layer (trb_plan_draw) through
 * gtk_snapshot_append_cairo; pan, zoom, selection and the drawing tools. Snapping
 * (trb_edit_snap) and hit testing (trb_plan_hit_test) are pure functions of core and render;
 * this widget only turns events into their calls and edits into commands. */

GtkWidget       *trb_plan_canvas_new                 (void);
TrbDocument     *trb_plan_canvas_get_document        (TrbPlanCanvas   *self);
void             trb_plan_canvas_set_document        (TrbPlanCanvas   *self,
                                                      TrbDocument     *document);
TrbTool          trb_plan_canvas_get_tool            (TrbPlanCanvas   *self);
void             trb_plan_canvas_set_tool            (TrbPlanCanvas   *self,
                                                      TrbTool          tool);

TrbMember       *trb_plan_canvas_get_selected_member (TrbPlanCanvas   *self);
guint            trb_plan_canvas_get_n_selected      (TrbPlanCanvas   *self);
void             trb_plan_canvas_select_member       (TrbPlanCanvas   *self,
                                                      TrbMember       *member,
                                                      gboolean         reveal);
void             trb_plan_canvas_select_all          (TrbPlanCanvas   *self);
void             trb_plan_canvas_delete_selection    (TrbPlanCanvas   *self);

void             trb_plan_canvas_zoom                (TrbPlanCanvas   *self,
                                                      double           factor);
void             trb_plan_canvas_zoom_to_fit         (TrbPlanCanvas   *self);
double           trb_plan_canvas_get_scale           (TrbPlanCanvas   *self);

/* What a click or a drag of the current tool at plan points (m) does, as the pointer would do
 * it: for tests and for the keyboard. */
void             trb_plan_canvas_click_plan          (TrbPlanCanvas   *self,
                                                      double           x,
                                                      double           y,
                                                      GdkModifierType  state);
void             trb_plan_canvas_drag_plan           (TrbPlanCanvas   *self,
                                                      double           x0,
                                                      double           y0,
                                                      double           x1,
                                                      double           y1,
                                                      GdkModifierType  state);
void             trb_plan_canvas_finish              (TrbPlanCanvas   *self);
void             trb_plan_canvas_cancel              (TrbPlanCanvas   *self);

/* The keyboard's way through the members: the arrow keys step the selection in the members
 * list's order (#TrbMemberItem rows as shown, set by the window), Enter opens the selected
 * member in the member panel (::member-opened). The two pure helpers decide; the canvas only
 * applies them. */
void             trb_plan_canvas_set_member_order    (TrbPlanCanvas   *self,
                                                      GListModel      *order);
void             trb_plan_canvas_step_selection      (TrbPlanCanvas   *self,
                                                      int              step);
void             trb_plan_canvas_open_selected       (TrbPlanCanvas   *self);
int              trb_plan_canvas_key_step            (guint            keyval,
                                                      GdkModifierType  state);
TrbMember       *trb_plan_canvas_step_member         (GListModel      *order,
                                                      TrbFloor        *floor,
                                                      TrbMember       *current,
                                                      int              step);

/* The tooltip of the plan at a plan point (m): the member there in words, or NULL. */
char            *trb_plan_canvas_describe_at         (TrbPlanCanvas   *self,
                                                      double           x,
                                                      double           y);

G_END_DECLS
