/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "trb-application.h"
#include "trb-diagram-view.h"
#include "trb-document.h"
#include "trb-member-item.h"
#include "trb-member-list.h"
#include "trb-member-panel.h"
#include "trb-plan-a11y.h"
#include "trb-plan-canvas.h"
#include "trb-project-io.h"
#include "trb-quantity-row.h"
#include "trb-shortlist-panel.h"
#include "trb-window.h"

/* The editor on the demo floor, driven as the engineer would: through the window's actions
 * and its widgets' own entry points, checking what they show. Runs under a virtual X server
 * (build-aux/test) with GSK_RENDERER=cairo and the memory settings backend. */

static TrbApplication *app;

typedef struct
{
  TrbWindow   *window;
  TrbDocument *document;
} Fixture;

static char *
demo_path (void)
{
  /* tests/screenshot.sh opens a copy in a home folder of its own, for the window's subtitle */
  if (g_getenv ("TRB_SCREENSHOT_FILE") != NULL)
    return g_strdup (g_getenv ("TRB_SCREENSHOT_FILE"));
  return g_test_build_filename (G_TEST_DIST, "..", "data", "examples", "demo-floor.trabeate",
                                NULL);
}

/* Runs the main loop until the window is on the screen and its frame clock has drawn. */
static void
wait_for_frames (GtkWidget *widget,
                 guint      n)
{
  /* generous: on a loaded machine the virtual X server maps a window late */
  gint64 until = g_get_monotonic_time () + 30 * G_USEC_PER_SEC;

  while (!gtk_widget_get_mapped (widget) && g_get_monotonic_time () < until)
    g_main_context_iteration (NULL, TRUE);
  for (guint i = 0; i < n; i++)
    {
      gint64 frame_until = g_get_monotonic_time () + 50000;

      while (g_get_monotonic_time () < frame_until)
        g_main_context_iteration (NULL, FALSE);
    }
}

/* The solve runs in a worker: wait for its results, as the engineer waits for the plan's
 * colours to settle. */
static void
wait_solved (TrbDocument *document)
{
  gint64 until = g_get_monotonic_time () + 60 * G_USEC_PER_SEC;

  while (trb_document_get_solving (document) && g_get_monotonic_time () < until)
    g_main_context_iteration (NULL, TRUE);
  g_assert_false (trb_document_get_solving (document));
  g_assert_true (trb_document_get_results_current (document));
}

static void
fixture_set_up (Fixture       *f,
                gconstpointer  data)
{
  g_autofree char *path = demo_path ();
  g_autoptr(GFile) file = g_file_new_for_path (path);

  f->window = trb_window_new (app);
  trb_application_open_file (app, file, GTK_WINDOW (f->window));
  f->document = trb_window_get_document (f->window);
  g_assert_nonnull (f->document);
  g_assert_true (g_file_equal (trb_document_get_file (f->document), file));
  gtk_window_set_default_size (GTK_WINDOW (f->window), 1400, 900);
  gtk_window_present (GTK_WINDOW (f->window));
  wait_solved (f->document);
  wait_for_frames (GTK_WIDGET (f->window), 3);
}

static void
fixture_tear_down (Fixture       *f,
                   gconstpointer  data)
{
  gtk_window_destroy (GTK_WINDOW (f->window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
}

static TrbMemberItem *
find_row (GListModel *rows,
          TrbMember  *member,
          guint      *position)
{
  for (guint i = 0; i < g_list_model_get_n_items (rows); i++)
    {
      g_autoptr(TrbMemberItem) item = g_list_model_get_item (rows, i);

      if (trb_member_item_get_member (item) == member)
        {
          if (position != NULL)
            *position = i;
          return item;
        }
    }
  return NULL;
}

static void
test_open_demo (Fixture       *f,
                gconstpointer  data)
{
  TrbProject *project = trb_document_get_project (f->document);
  TrbMemberList *list = TRB_MEMBER_LIST (trb_window_get_member_list (f->window));
  GListModel *rows = trb_member_list_get_model (list);
  g_autofree char *expected_count = NULL;

  /* the demo floor: one floor (no list of floors, no Floor column), and a row for every
   * member of the file */
  g_assert_cmpuint (project->floors->len, ==, 1);
  g_assert_false (gtk_widget_get_visible (trb_window_get_floor_dropdown (f->window)));
  g_assert_false (trb_member_list_get_shows_floors (list));
  g_assert_cmpuint (project->members->len, >, 0);
  g_assert_cmpuint (g_list_model_get_n_items (rows), ==, project->members->len);
  for (guint i = 0; i < project->members->len; i++)
    g_assert_nonnull (find_row (rows, g_ptr_array_index (project->members, i), NULL));

  /* every member was solved, and the summary counts them */
  g_assert_nonnull (trb_document_get_results (f->document));
  for (guint i = 0; i < project->members->len; i++)
    g_assert_nonnull (trb_document_lookup_result (f->document,
                                                  g_ptr_array_index (project->members, i)));
  expected_count = g_strdup_printf ("%u members", project->members->len);
  g_assert_true (g_str_has_prefix (trb_member_list_get_summary (list), expected_count));

  /* the title names the file, not modified */
  g_assert_false (trb_document_get_modified (f->document));
  g_assert_nonnull (strstr (gtk_window_get_title (GTK_WINDOW (f->window)),
                            "demo-floor.trabeate"));
  g_assert_null (strstr (gtk_window_get_title (GTK_WINDOW (f->window)), "•"));
}

static void
test_select_member (Fixture       *f,
                    gconstpointer  data)
{
  TrbMemberList *list = TRB_MEMBER_LIST (trb_window_get_member_list (f->window));
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (f->window));
  TrbMemberPanel *panel = TRB_MEMBER_PANEL (trb_window_get_member_panel (f->window));
  TrbDiagramView *diagrams = TRB_DIAGRAM_VIEW (trb_window_get_diagram_view (f->window));
  GListModel *rows = trb_member_list_get_model (list);
  g_autoptr(TrbMemberItem) item = NULL;
  TrbMember *member;
  const TrbMemberResult *r;

  g_assert_null (trb_member_panel_get_title (panel));

  /* a row picked in the list selects the member on the plan and fills the panels */
  trb_member_list_activate_row (list, 0);
  item = g_list_model_get_item (rows, 0);
  member = trb_member_item_get_member (item);
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == member);
  g_assert_cmpstr (trb_member_panel_get_title (panel), ==, member->id);
  r = trb_document_lookup_result (f->document, member);
  g_assert_nonnull (r);
  if (r->analysed)
    {
      /* the envelope, each combination entry and each load case present */
      guint n = 1 + r->strength.entries->len;

      for (guint c = 0; c < TRB_N_CASES; c++)
        n += r->cases[c] != NULL;
      g_assert_cmpuint (trb_diagram_view_get_n_sources (diagrams), ==, n);
    }

  /* picked on the plan: the list follows */
  {
    TrbFloor *floor = trb_document_get_floor (f->document);
    TrbMember *other = g_ptr_array_index (floor->members, floor->members->len - 1);
    double x = (other->start.x + other->end.x) / 2, y = (other->start.y + other->end.y) / 2;

    trb_plan_canvas_set_tool (canvas, TRB_TOOL_SELECT);
    trb_plan_canvas_click_plan (canvas, x, y, 0);
    g_assert_true (trb_plan_canvas_get_selected_member (canvas) == other);
    g_assert_cmpstr (trb_member_panel_get_title (panel), ==, other->id);
  }
}

static void
test_shortlist_assign (Fixture       *f,
                       gconstpointer  data)
{
  TrbProject *project = trb_document_get_project (f->document);
  TrbMemberList *list = TRB_MEMBER_LIST (trb_window_get_member_list (f->window));
  TrbShortlistPanel *shortlist = TRB_SHORTLIST_PANEL (trb_window_get_shortlist (f->window));
  g_autofree char *before = NULL;
  g_autofree char *chosen = NULL;
  TrbMember *member = NULL;
  const TrbMemberResult *r;
  guint position = 0;

  /* Make a member fail the way an engineer would: pick the lightest W shape for a girder
   * (W8X10 of the AISC Shapes Database v16.0, 10 lb/ft), far too light for its span. */
  for (guint i = 0; i < project->members->len && member == NULL; i++)
    {
      TrbMember *m = g_ptr_array_index (project->members, i);

      if (m->role == TRB_FRAME_ROLE_GIRDER && m->material == TRB_MATERIAL_STEEL)
        member = m;
    }
  g_assert_nonnull (member);
  trb_plan_canvas_select_member (TRB_PLAN_CANVAS (trb_window_get_canvas (f->window)), member,
                                 TRUE);
  g_assert_true (trb_shortlist_panel_get_n_rows (shortlist) > 0);

  before = g_strdup (member->section);
  g_assert_true (trb_document_push (f->document,
                                    trb_edit_assign_section (project, member, "W8X10", NULL)));
  wait_solved (f->document);
  r = trb_document_lookup_result (f->document, member);
  g_assert_cmpint (r->status, ==, TRB_STATUS_FAIL);
  g_assert_nonnull (find_row (trb_member_list_get_model (list), member, &position));
  {
    g_autoptr(TrbMemberItem) row = g_list_model_get_item (trb_member_list_get_model (list),
                                                          position);

    g_assert_cmpstr (trb_member_item_get_status (row), ==, "Fails");
  }

  /* "Failing Only" keeps the rows that need the engineer, the girder among them */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.show-failing", NULL));
  {
    GListModel *rows = trb_member_list_get_model (list);
    guint n_failing = 0;

    for (guint i = 0; i < project->members->len; i++)
      n_failing += trb_document_lookup_result (f->document,
                                               g_ptr_array_index (project->members, i))->status
                   != TRB_STATUS_PASS;
    g_assert_cmpuint (g_list_model_get_n_items (rows), ==, n_failing);
    g_assert_nonnull (find_row (rows, member, NULL));
    for (guint i = 0; i < g_list_model_get_n_items (rows); i++)
      {
        g_autoptr(TrbMemberItem) row = g_list_model_get_item (rows, i);

        g_assert_true (trb_member_item_get_failing (row));
      }
  }
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.show-failing", NULL));
  g_assert_cmpuint (g_list_model_get_n_items (trb_member_list_get_model (list)), ==,
                    project->members->len);

  /* the shortlist offers sizing first (the member has a section of its own), then the
   * passing sections lightest first; choosing the lightest assigns it and the member passes */
  g_assert_cmpstr (trb_shortlist_panel_get_row_section (shortlist, 0), ==, "auto");
  g_assert_true (trb_shortlist_panel_get_n_rows (shortlist) >= 2);
  chosen = g_strdup (trb_shortlist_panel_get_row_section (shortlist, 1));
  g_assert_true (trb_shortlist_panel_choose (shortlist, 1));
  g_assert_cmpstr (member->section, ==, chosen);
  wait_solved (f->document);
  r = trb_document_lookup_result (f->document, member);
  g_assert_cmpint (r->status, ==, TRB_STATUS_PASS);
  g_assert_true (r->ratio <= 1.0);
  {
    g_autoptr(TrbMemberItem) row = NULL;

    g_assert_nonnull (find_row (trb_member_list_get_model (list), member, &position));
    row = g_list_model_get_item (trb_member_list_get_model (list), position);
    g_assert_cmpstr (trb_member_item_get_status (row), ==, "Passes");
  }
  g_assert_true (trb_document_get_modified (f->document));
  g_assert_nonnull (strstr (gtk_window_get_title (GTK_WINDOW (f->window)), "•"));

  /* Undo, through the window's action, gives back the failing section */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_cmpstr (member->section, ==, "W8X10");
  wait_solved (f->document);
  r = trb_document_lookup_result (f->document, member);
  g_assert_cmpint (r->status, ==, TRB_STATUS_FAIL);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_cmpstr (member->section, ==, before);
  g_assert_false (trb_document_get_modified (f->document));
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.redo", NULL));
  g_assert_cmpstr (member->section, ==, "W8X10");
}

static void
test_draw_beam (Fixture       *f,
                gconstpointer  data)
{
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (f->window));
  TrbProject *project = trb_document_get_project (f->document);
  TrbMemberList *list = TRB_MEMBER_LIST (trb_window_get_member_list (f->window));
  guint n = project->members->len;
  TrbMember *added;

  /* the beam tool from its key, as the plan has it */
  gtk_widget_grab_focus (GTK_WIDGET (canvas));
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (canvas), "canvas.tool", "s", "beam"));
  g_assert_cmpint (trb_plan_canvas_get_tool (canvas), ==, TRB_TOOL_BEAM);

  /* two clicks, 3 m apart in clear floor south of the wall (the demo's wall runs along
   * y = 0): a new member B1 with its row in the list */
  trb_plan_canvas_click_plan (canvas, 1.0, -3.0, 0);
  g_assert_cmpuint (project->members->len, ==, n);
  trb_plan_canvas_click_plan (canvas, 4.0, -3.0, 0);
  g_assert_cmpuint (project->members->len, ==, n + 1);
  added = g_ptr_array_index (project->members, n);
  g_assert_cmpint (added->role, ==, TRB_FRAME_ROLE_BEAM);
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == added);
  g_assert_cmpuint (g_list_model_get_n_items (trb_member_list_get_model (list)), ==, n + 1);
  wait_solved (f->document);
  /* on nothing but the grid: unsupported, and the list says so */
  g_assert_cmpint (trb_document_lookup_result (f->document, added)->status, ==,
                   TRB_STATUS_UNSUPPORTED);

  /* Escape leaves the tool */
  trb_plan_canvas_cancel (canvas);
  g_assert_cmpint (trb_plan_canvas_get_tool (canvas), ==, TRB_TOOL_SELECT);

  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_cmpuint (project->members->len, ==, n);
  g_assert_cmpuint (g_list_model_get_n_items (trb_member_list_get_model (list)), ==, n);
  g_assert_null (trb_plan_canvas_get_selected_member (canvas));
}

static GtkWidget *
panel_row (Fixture    *f,
           const char *name)
{
  GtkWidget *panel = trb_window_get_member_panel (f->window);

  return GTK_WIDGET (gtk_widget_get_template_child (panel, G_OBJECT_TYPE (panel), name));
}

/* The member panel's entries: bad text is shown wrong in place and never reaches the model;
 * good text in any unit does, as one undoable step. */
static void
test_member_panel (Fixture       *f,
                   gconstpointer  data)
{
  TrbProject *project = trb_document_get_project (f->document);
  TrbMember *g1 = trb_project_find_member (project, "G1");
  TrbQuantityRow *live = TRB_QUANTITY_ROW (panel_row (f, "live_row"));
  TrbQuantityRow *depth = TRB_QUANTITY_ROW (panel_row (f, "max_depth_row"));
  GtkWidget *mark = panel_row (f, "mark_row");
  double depth_before;

  trb_plan_canvas_select_member (TRB_PLAN_CANVAS (trb_window_get_canvas (f->window)), g1,
                                 FALSE);
  g_assert_true (isnan (g1->deflection_live));
  depth_before = g1->max_depth;

  /* text that is no limit: an error in place, the model untouched, nothing to undo */
  gtk_editable_set_text (GTK_EDITABLE (live), "L/abc");
  g_assert_nonnull (trb_quantity_row_get_error (live));
  g_assert_true (gtk_widget_has_css_class (GTK_WIDGET (live), "error"));
  g_signal_emit_by_name (live, "apply");
  g_assert_true (isnan (g1->deflection_live));
  g_assert_false (trb_document_get_can_undo (f->document));

  /* L/480 applies */
  gtk_editable_set_text (GTK_EDITABLE (live), "L/480");
  g_assert_null (trb_quantity_row_get_error (live));
  g_signal_emit_by_name (live, "apply");
  g_assert_cmpfloat (g1->deflection_live, ==, 480);

  /* a depth in millimetres for a member drawn in feet: 406.4 mm is 16 in exactly (NIST SP
   * 811, Appendix B: 1 in = 25.4 mm); a force where a length belongs is refused */
  gtk_editable_set_text (GTK_EDITABLE (depth), "5 kip");
  g_assert_nonnull (trb_quantity_row_get_error (depth));
  g_signal_emit_by_name (depth, "apply");
  g_assert_cmpfloat (g1->max_depth, ==, depth_before);
  gtk_editable_set_text (GTK_EDITABLE (depth), "406.4 mm");
  g_signal_emit_by_name (depth, "apply");
  g_assert_cmpfloat_with_epsilon (g1->max_depth, 0.4064, 1e-12);

  /* a mark another member has is refused, in place */
  gtk_editable_set_text (GTK_EDITABLE (mark), "G2");
  g_signal_emit_by_name (mark, "apply");
  g_assert_cmpstr (g1->id, ==, "G1");
  g_assert_true (gtk_widget_has_css_class (mark, "error"));

  /* two steps, two undos */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_cmpfloat (g1->max_depth, ==, depth_before);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_true (isnan (g1->deflection_live));
  g_assert_false (trb_document_get_can_undo (f->document));
  wait_solved (f->document);
}

/* Dragging on the plan: a member's end by its handle, onto the drawing grid; a box around the
 * whole floor, then Delete, then Undo. The demo's plan (data/examples/demo-floor.trabeate),
 * 1 ft = 0.3048 m exactly (NIST SP 811, Appendix B): G1 runs from (0, 16 ft) to (20 ft, 16 ft);
 * nothing lies within 3 ft of (23 ft, 19 ft), a point of the 1 ft grid. */
static void
test_drag (Fixture       *f,
           gconstpointer  data)
{
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (f->window));
  TrbProject *project = trb_document_get_project (f->document);
  TrbFloor *floor = trb_document_get_floor (f->document);
  TrbMember *g1 = trb_project_find_member (project, "G1");
  guint n_members = project->members->len;
  guint n_columns = floor->columns->len;

  g_assert_nonnull (g1);
  g_assert_cmpfloat_with_epsilon (g1->end.x, 20 * 0.3048, 1e-12);

  /* the end handle of the selected girder, dragged to about (23 ft, 19 ft) */
  trb_plan_canvas_select_member (canvas, g1, FALSE);
  trb_plan_canvas_drag_plan (canvas, g1->end.x, g1->end.y, 23 * 0.3048 + 0.05,
                             19 * 0.3048 - 0.04, 0);
  g_assert_cmpfloat_with_epsilon (g1->end.x, 23 * 0.3048, 1e-9);
  g_assert_cmpfloat_with_epsilon (g1->end.y, 19 * 0.3048, 1e-9);
  g_assert_cmpfloat (g1->start.x, ==, 0);
  g_assert_cmpstr (trb_document_get_undo_label (f->document), ==, "Move G1");
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_cmpfloat_with_epsilon (g1->end.x, 20 * 0.3048, 1e-12);
  g_assert_cmpfloat_with_epsilon (g1->end.y, 16 * 0.3048, 1e-12);

  /* a box from below the wall's left end to beyond the balcony, dragged left to right:
   * everything it encloses, every member, column and wall */
  trb_plan_canvas_select_member (canvas, NULL, FALSE);
  trb_plan_canvas_drag_plan (canvas, -3.0, -3.0, 20.0, 8.0, 0);
  g_assert_cmpuint (trb_plan_canvas_get_n_selected (canvas), ==,
                    floor->members->len + floor->columns->len + floor->walls->len);

  /* Delete takes them all as one step; Undo puts them all back */
  trb_plan_canvas_delete_selection (canvas);
  g_assert_cmpuint (project->members->len, ==, 0);
  g_assert_cmpuint (floor->columns->len, ==, 0);
  g_assert_cmpuint (trb_plan_canvas_get_n_selected (canvas), ==, 0);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
  g_assert_cmpuint (project->members->len, ==, n_members);
  g_assert_cmpuint (floor->columns->len, ==, n_columns);
  g_assert_false (trb_document_get_modified (f->document));
  wait_solved (f->document);
}

/* A bay drawn from nothing, as docs/user-guide.md tells it: four columns 20 ft by 16 ft apart,
 * two girders on them, a run of joists between the girders, an office live load over the
 * bay. 1 ft = 0.3048 m exactly (NIST SP 811, Appendix B). */
static void
test_draw_bay (void)
{
  const double W = 20 * 0.3048, D = 16 * 0.3048;
  g_autoptr(TrbDocument) document = trb_document_new (NULL);
  TrbWindow *window = trb_window_new (app);
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (window));
  TrbProject *project = trb_document_get_project (document);
  TrbFloor *floor = trb_document_get_floor (document);
  TrbMember *g1, *g2;
  guint n_joists;

  trb_window_set_document (window, document);
  gtk_window_set_default_size (GTK_WINDOW (window), 1400, 900);
  gtk_window_present (GTK_WINDOW (window));
  wait_solved (document);
  wait_for_frames (GTK_WIDGET (window), 2);
  g_assert_true (trb_document_is_untouched (document));

  /* columns at the corners */
  trb_plan_canvas_set_tool (canvas, TRB_TOOL_COLUMN);
  trb_plan_canvas_click_plan (canvas, 0, 0, 0);
  trb_plan_canvas_click_plan (canvas, W, 0, 0);
  trb_plan_canvas_click_plan (canvas, 0, D, 0);
  trb_plan_canvas_click_plan (canvas, W, D, 0);
  g_assert_cmpuint (floor->columns->len, ==, 4);
  g_assert_nonnull (trb_project_find_column (project, "C4", NULL));

  /* girders from column to column: clicks a little off the columns snap onto them */
  trb_plan_canvas_set_tool (canvas, TRB_TOOL_GIRDER);
  trb_plan_canvas_click_plan (canvas, 0.02, -0.03, 0);
  trb_plan_canvas_click_plan (canvas, W - 0.02, 0.01, 0);
  trb_plan_canvas_click_plan (canvas, 0, D, 0);
  trb_plan_canvas_click_plan (canvas, W, D, 0);
  g1 = trb_project_find_member (project, "G1");
  g2 = trb_project_find_member (project, "G2");
  g_assert_nonnull (g1);
  g_assert_nonnull (g2);
  g_assert_cmpfloat (g1->start.x, ==, 0);
  g_assert_cmpfloat (g1->start.y, ==, 0);
  g_assert_cmpfloat (g1->end.x, ==, W);
  g_assert_cmpfloat_with_epsilon (g1->length, W, 1e-12);

  /* a joist run between the girders, in one step */
  trb_plan_canvas_set_tool (canvas, TRB_TOOL_JOIST_RUN);
  trb_plan_canvas_click_plan (canvas, 0.5, 0, 0);
  trb_plan_canvas_click_plan (canvas, W / 2, D, 0);
  g_assert_cmpuint (project->members->len, ==, 2);
  trb_plan_canvas_finish (canvas);
  n_joists = project->members->len - 2;
  g_assert_cmpuint (n_joists, >, 10);
  g_assert_cmpint (((TrbMember *) g_ptr_array_index (project->members, 2))->role, ==,
                   TRB_FRAME_ROLE_JOIST);
  {
    g_autofree char *label = g_strdup_printf ("Lay out joists J1 to J%u", n_joists);

    g_assert_cmpstr (trb_document_get_undo_label (document), ==, label);
  }

  /* the office live load over the bay, 50 psf (ASCE 7-16 Table 4.3-1), the tool's default */
  trb_plan_canvas_set_tool (canvas, TRB_TOOL_AREA_LOAD);
  trb_plan_canvas_click_plan (canvas, 0, 0, 0);
  trb_plan_canvas_click_plan (canvas, W, 0, 0);
  trb_plan_canvas_click_plan (canvas, W, D, 0);
  trb_plan_canvas_click_plan (canvas, 0, D, 0);
  trb_plan_canvas_finish (canvas);
  g_assert_cmpuint (floor->area_loads->len, ==, 1);
  g_assert_cmpint (((TrbAreaLoad *) g_ptr_array_index (floor->area_loads, 0))->lcase, ==,
                   TRB_CASE_L);
  g_assert_cmpfloat_with_epsilon (((TrbAreaLoad *) g_ptr_array_index (floor->area_loads,
                                                                       0))->pressure,
                                  50 * 4.4482216152605 / (0.3048 * 0.3048), 1e-9);

  /* every member rests on something, is sized, and passes */
  wait_solved (document);
  for (guint i = 0; i < project->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (project->members, i);
      const TrbMemberResult *r = trb_document_lookup_result (document, m);

      g_assert_nonnull (r);
      g_assert_cmpint (r->status, ==, TRB_STATUS_PASS);
    }
  g_assert_true (trb_document_get_modified (document));
  gtk_window_destroy (GTK_WINDOW (window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
}

/* Edits come faster than the solve: the plan and the list follow each at once, on the
 * results that stand (some of whose members the edits have freed), and the last solve
 * brings them up to date. */
static void
test_edits_while_solving (Fixture       *f,
                          gconstpointer  data)
{
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (f->window));
  TrbMemberList *list = TRB_MEMBER_LIST (trb_window_get_member_list (f->window));
  TrbProject *project = trb_document_get_project (f->document);
  guint n = project->members->len;

  trb_plan_canvas_set_tool (canvas, TRB_TOOL_BEAM);
  for (guint i = 0; i < 12; i++)
    {
      double y = -2.0 - 0.5 * i;

      /* a beam drawn, undone, and another drawn: the undone one is freed by the history
       * while the results may still name it */
      trb_plan_canvas_click_plan (canvas, 1.0, y, 0);
      trb_plan_canvas_click_plan (canvas, 5.0, y, 0);
      g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.undo", NULL));
      trb_plan_canvas_click_plan (canvas, 2.0, y, 0);
      trb_plan_canvas_click_plan (canvas, 6.0, y, 0);
      wait_for_frames (GTK_WIDGET (f->window), 1);
    }
  g_assert_cmpuint (project->members->len, ==, n + 12);
  g_assert_cmpuint (g_list_model_get_n_items (trb_member_list_get_model (list)), ==, n + 12);
  wait_solved (f->document);
  for (guint i = 0; i < project->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (project->members, i);
      const TrbMemberResult *r = trb_document_lookup_result (f->document, m);

      g_assert_nonnull (r);
      g_assert_true (r->member == m);
    }
}

static void
test_save_round_trip (Fixture       *f,
                      gconstpointer  data)
{
  TrbProject *project = trb_document_get_project (f->document);
  g_autofree char *dir = g_dir_make_tmp ("trabeate-test-app-XXXXXX", NULL);
  g_autofree char *path = g_build_filename (dir, "saved.trabeate", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) loaded = NULL;
  g_autofree char *ours = NULL;
  g_autofree char *theirs = NULL;
  TrbMember *member = g_ptr_array_index (project->members, 0);

  /* an edit, then Save through the window's action, to a file the document has */
  g_assert_true (trb_document_save (f->document, file, &error));
  g_assert_no_error (error);
  g_assert_true (trb_document_push (f->document,
                                    trb_edit_set_member_number (project, member,
                                                                TRB_MEMBER_FIELD_DEFLECTION_LIVE,
                                                                480, NULL)));
  g_assert_true (trb_document_get_modified (f->document));
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.save", NULL));
  g_assert_false (trb_document_get_modified (f->document));

  /* the file reads back to the same project, byte for byte when written again */
  loaded = trb_project_load_file (path, &error);
  g_assert_no_error (error);
  g_assert_cmpfloat (trb_project_find_member (loaded, member->id)->deflection_live, ==, 480);
  ours = trb_project_save_data (project, NULL, &error);
  g_assert_no_error (error);
  theirs = trb_project_save_data (loaded, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (ours, ==, theirs);

  g_remove (path);
  g_rmdir (dir);
}

/* A project of several floors: the header bar lists them, the plan shows one at a time, the
 * keys and the list move between them, and tools draw on the floor shown. */
static void
test_floors (void)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data",
                                                 "floor-two-levels.trabeate", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbDocument) document = trb_document_new_for_file (file, &error);
  TrbWindow *window = trb_window_new (app);
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (window));
  TrbMemberList *list = TRB_MEMBER_LIST (trb_window_get_member_list (window));
  GtkDropDown *floors;
  TrbProject *project;
  TrbFloor *level1, *roof, *empty;
  TrbMember *r3;
  guint position = G_MAXUINT;

  g_assert_no_error (error);
  project = trb_document_get_project (document);
  g_assert_cmpuint (project->floors->len, ==, 3);
  level1 = g_ptr_array_index (project->floors, 0);
  roof = g_ptr_array_index (project->floors, 1);
  empty = g_ptr_array_index (project->floors, 2);
  trb_window_set_document (window, document);
  gtk_window_set_default_size (GTK_WINDOW (window), 1400, 900);
  gtk_window_present (GTK_WINDOW (window));
  wait_solved (document);
  wait_for_frames (GTK_WIDGET (window), 2);

  /* the header bar's list: the three floors by name, the first shown */
  floors = GTK_DROP_DOWN (trb_window_get_floor_dropdown (window));
  g_assert_true (gtk_widget_get_visible (GTK_WIDGET (floors)));
  g_assert_cmpuint (g_list_model_get_n_items (gtk_drop_down_get_model (floors)), ==, 3);
  g_assert_cmpstr (gtk_string_list_get_string (GTK_STRING_LIST (gtk_drop_down_get_model (floors)),
                                               1), ==, "Roof");
  g_assert_cmpuint (gtk_drop_down_get_selected (floors), ==, 0);
  g_assert_true (trb_document_get_floor (document) == level1);
  gtk_widget_activate_action (GTK_WIDGET (window), "win.previous-floor", NULL);
  g_assert_cmpuint (trb_document_get_floor_index (document), ==, 0);

  /* the list holds every floor's members; a roof member picked there brings the roof up */
  g_assert_cmpuint (g_list_model_get_n_items (trb_member_list_get_model (list)), ==,
                    project->members->len);
  g_assert_cmpuint (level1->members->len + roof->members->len, ==, project->members->len);
  r3 = trb_project_find_member (project, "R3");
  g_assert_nonnull (r3);
  g_assert_true (trb_member_list_get_shows_floors (list));
  {
    TrbMemberItem *row = find_row (trb_member_list_get_model (list), r3, &position);

    g_assert_nonnull (row);
    g_assert_cmpstr (trb_member_item_get_floor (row), ==, "Roof");
  }
  trb_member_list_activate_row (list, position);
  g_assert_true (trb_document_get_floor (document) == roof);
  g_assert_cmpuint (gtk_drop_down_get_selected (floors), ==, 1);
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == r3);
  {
    /* the plan's description counts the roof's members, not the project's */
    g_autofree char *said = trb_plan_a11y_describe (document, NULL);

    g_assert_true (g_str_has_prefix (said, "Plan of Roof: 3 members, "));
  }

  /* the next floor (Ctrl Page Down): the empty one; the roof's selection goes with it */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (window), "win.next-floor", NULL));
  g_assert_true (trb_document_get_floor (document) == empty);
  g_assert_null (trb_plan_canvas_get_selected_member (canvas));
  g_assert_cmpuint (gtk_drop_down_get_selected (floors), ==, 2);
  gtk_widget_activate_action (GTK_WIDGET (window), "win.next-floor", NULL);
  g_assert_cmpuint (trb_document_get_floor_index (document), ==, 2);

  /* a girder drawn now goes on the empty floor, and nowhere else */
  trb_plan_canvas_set_tool (canvas, TRB_TOOL_GIRDER);
  trb_plan_canvas_click_plan (canvas, 0, 0, 0);
  trb_plan_canvas_click_plan (canvas, 6, 0, 0);
  g_assert_cmpuint (empty->members->len, ==, 1);
  g_assert_true (((TrbMember *) g_ptr_array_index (empty->members, 0))->floor == empty);
  g_assert_cmpuint (roof->members->len, ==, 3);

  /* the header bar's list shows a floor too; showing a floor is not an edit, and undo and
   * redo bring up the floor their step was made on */
  gtk_drop_down_set_selected (floors, 0);
  g_assert_true (trb_document_get_floor (document) == level1);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (window), "win.undo", NULL));
  g_assert_cmpuint (empty->members->len, ==, 0);
  g_assert_false (trb_document_get_modified (document));
  g_assert_true (trb_document_get_floor (document) == empty);
  g_assert_cmpuint (gtk_drop_down_get_selected (floors), ==, 2);
  trb_document_set_floor_index (document, 1);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (window), "win.redo", NULL));
  g_assert_cmpuint (empty->members->len, ==, 1);
  g_assert_true (trb_document_get_floor (document) == empty);

  gtk_window_destroy (GTK_WINDOW (window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
}

static void
test_bad_file (Fixture       *f,
               gconstpointer  data)
{
  g_autofree char *path = g_test_build_filename (G_TEST_DIST, "data", "invalid",
                                                 "unit-missing.trabeate", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (path);
  TrbProject *before = trb_document_get_project (f->document);
  const char *error;

  /* the window keeps its project and shows the loader's message, with the file and line */
  trb_application_open_file (app, file, GTK_WINDOW (f->window));
  g_assert_true (trb_window_get_document (f->window) == f->document);
  g_assert_true (trb_document_get_project (f->document) == before);
  error = trb_window_get_error (f->window);
  g_assert_nonnull (error);
  g_assert_nonnull (strstr (error, "unit-missing.trabeate:"));
  g_assert_nonnull (strstr (error, "unit"));
}

/* The shortcuts window, the preferences and the about window open from their actions, built
 * from their templates without a warning (warnings are fatal here), and the about window
 * carries the cautions. */
static void
test_dialogs (Fixture       *f,
              gconstpointer  data)
{
  GListModel *toplevels = gtk_window_get_toplevels ();
  g_autoptr(GPtrArray) shown = g_ptr_array_new_with_free_func (g_object_unref);
  gboolean help = FALSE, prefs = FALSE, about = FALSE;

  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.show-help-overlay",
                                             NULL));
  g_action_group_activate_action (G_ACTION_GROUP (app), "preferences", NULL);
  g_action_group_activate_action (G_ACTION_GROUP (app), "about", NULL);
  wait_for_frames (GTK_WIDGET (f->window), 3);

  for (guint i = 0; i < g_list_model_get_n_items (toplevels); i++)
    {
      GtkWindow *w = g_list_model_get_item (toplevels, i);

      if (!gtk_widget_get_visible (GTK_WIDGET (w)) || w == GTK_WINDOW (f->window))
        {
          g_object_unref (w);
          continue;
        }
      help |= GTK_IS_SHORTCUTS_WINDOW (w);
      prefs |= ADW_IS_PREFERENCES_WINDOW (w);
      if (ADW_IS_ABOUT_WINDOW (w))
        {
          const char *comments = adw_about_window_get_comments (ADW_ABOUT_WINDOW (w));

          /* the words of trb-cautions.h */
          g_assert_nonnull (strstr (comments, "licensed engineer"));
          g_assert_nonnull (strstr (comments, "local building codes govern"));
          g_assert_nonnull (strstr (comments, "Not checked:"));
          about = TRUE;
        }
      g_ptr_array_add (shown, w);
    }
  g_assert_true (help);
  g_assert_true (prefs);
  g_assert_true (about);
  for (guint i = 0; i < shown->len; i++)
    gtk_window_close (g_ptr_array_index (shown, i));
}

/* ---- the screenshot -------------------------------------------------------------------------- */

static GdkTexture *
render_window (GtkWidget *window)
{
  GdkPaintable *paintable = gtk_widget_paintable_new (window);
  gint64 until = g_get_monotonic_time () + 30 * G_USEC_PER_SEC;
  GskRenderNode *node = NULL;
  GdkTexture *texture;
  int w, h;

  /* a window not yet drawn (mapped late on a loaded machine) gives no node: let the main
   * loop run and try again, for a while */
  for (;;)
    {
      GtkSnapshot *snapshot = gtk_snapshot_new ();

      w = gtk_widget_get_width (window);
      h = gtk_widget_get_height (window);
      if (gtk_widget_get_mapped (window) && w > 0 && h > 0)
        gdk_paintable_snapshot (paintable, snapshot, w, h);
      node = gtk_snapshot_free_to_node (snapshot);
      if (node != NULL || g_get_monotonic_time () > until)
        break;
      wait_for_frames (window, 1);
    }
  g_assert_nonnull (node);
  texture = gsk_renderer_render_texture (gtk_native_get_renderer (GTK_NATIVE (window)), node,
                                         &GRAPHENE_RECT_INIT (0, 0, w, h));
  gsk_render_node_unref (node);
  g_object_unref (paintable);
  return texture;
}

/* How many distinct colours, counted on a coarse grid: a blank window has one or two. */
static guint
count_colours (GdkTexture *texture)
{
  int w = gdk_texture_get_width (texture), h = gdk_texture_get_height (texture);
  g_autofree guint32 *pixels = g_new (guint32, (gsize) w * h);
  g_autoptr(GHashTable) seen = g_hash_table_new (NULL, NULL);

  gdk_texture_download (texture, (guchar *) pixels, (gsize) w * 4);
  for (int y = 0; y < h; y += 3)
    for (int x = 0; x < w; x += 3)
      g_hash_table_add (seen, GUINT_TO_POINTER (pixels[(gsize) y * w + x]));
  return g_hash_table_size (seen);
}

static void
test_screenshot (Fixture       *f,
                 gconstpointer  data)
{
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (f->window));
  const char *out = g_getenv ("TRB_SCREENSHOT");
  const char *page = g_getenv ("TRB_SCREENSHOT_PAGE");
  g_autofree char *path = NULL;
  g_autoptr(GdkTexture) texture = NULL;
  TrbFloor *floor = trb_document_get_floor (f->document);
  TrbMember *shown = NULL;

  /* a girder picked, as an engineer looking at the floor would have it */
  for (guint i = 0; i < floor->members->len && shown == NULL; i++)
    {
      TrbMember *m = g_ptr_array_index (floor->members, i);

      if (m->role == TRB_FRAME_ROLE_GIRDER)
        shown = m;
    }
  trb_plan_canvas_select_member (canvas, shown, TRUE);
  trb_plan_canvas_zoom_to_fit (canvas);
  if (page != NULL)
    trb_window_show_page (f->window, page);
  wait_for_frames (GTK_WIDGET (f->window), 5);

  texture = render_window (GTK_WIDGET (f->window));
  path = out != NULL ? g_strdup (out) : g_test_build_filename (G_TEST_BUILT, "editor.png", NULL);
  g_assert_true (gdk_texture_save_to_png (texture, path));

  /* the window's size, about what fixture_set_up gave it (its frame takes a few pixels) */
  g_assert_cmpint (gdk_texture_get_width (texture), ==,
                   gtk_widget_get_width (GTK_WIDGET (f->window)));
  g_assert_cmpint (gdk_texture_get_height (texture), ==,
                   gtk_widget_get_height (GTK_WIDGET (f->window)));
  g_assert_cmpint (abs (gdk_texture_get_width (texture) - 1400), <=, 20);
  g_assert_cmpint (abs (gdk_texture_get_height (texture) - 900), <=, 20);
  g_assert_cmpuint (count_colours (texture), >, 50);
  g_test_message ("screenshot: %s", path);
}

int
main (int   argc,
      char *argv[])
{
  g_autoptr(GError) error = NULL;
  int status;

  gtk_test_init (&argc, &argv, NULL);

  app = trb_application_new ("org.trabeate.Trabeate.Test", G_APPLICATION_NON_UNIQUE);
  g_application_register (G_APPLICATION (app), NULL, &error);
  g_assert_no_error (error);
  if (g_getenv ("TRB_SCREENSHOT_DARK") != NULL)
    adw_style_manager_set_color_scheme (adw_style_manager_get_default (),
                                        ADW_COLOR_SCHEME_FORCE_DARK);

  g_test_add ("/trb/app/open-demo", Fixture, NULL, fixture_set_up, test_open_demo,
              fixture_tear_down);
  g_test_add ("/trb/app/select-member", Fixture, NULL, fixture_set_up, test_select_member,
              fixture_tear_down);
  g_test_add ("/trb/app/shortlist-assign", Fixture, NULL, fixture_set_up,
              test_shortlist_assign, fixture_tear_down);
  g_test_add ("/trb/app/draw-beam", Fixture, NULL, fixture_set_up, test_draw_beam,
              fixture_tear_down);
  g_test_add_func ("/trb/app/draw-bay", test_draw_bay);
  g_test_add ("/trb/app/drag", Fixture, NULL, fixture_set_up, test_drag, fixture_tear_down);
  g_test_add ("/trb/app/member-panel", Fixture, NULL, fixture_set_up, test_member_panel,
              fixture_tear_down);
  g_test_add ("/trb/app/edits-while-solving", Fixture, NULL, fixture_set_up,
              test_edits_while_solving, fixture_tear_down);
  g_test_add ("/trb/app/save-round-trip", Fixture, NULL, fixture_set_up, test_save_round_trip,
              fixture_tear_down);
  g_test_add_func ("/trb/app/floors", test_floors);
  g_test_add ("/trb/app/bad-file", Fixture, NULL, fixture_set_up, test_bad_file,
              fixture_tear_down);
  g_test_add ("/trb/app/dialogs", Fixture, NULL, fixture_set_up, test_dialogs,
              fixture_tear_down);
  g_test_add ("/trb/app/screenshot", Fixture, NULL, fixture_set_up, test_screenshot,
              fixture_tear_down);

  status = g_test_run ();
  g_object_unref (app);
  return status;
}
