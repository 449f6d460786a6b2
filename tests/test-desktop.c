/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <adwaita.h>
#include <locale.h>
#include <math.h>
#include <string.h>

#include "trb-application.h"
#include "trb-help.h"
#include "trb-member-item.h"
#include "trb-member-list.h"
#include "trb-plan-a11y.h"
#include "trb-plan-canvas.h"
#include "trb-window.h"

/* The editor among the desktop's habits: help on F1, and (under LANGUAGE=es, the test
 * "desktop-spanish") the window in the user's language. Runs under a virtual X server, like
 * test-app. */

static TrbApplication *app;

static char *
demo_path (void)
{
  return g_test_build_filename (G_TEST_DIST, "..", "data", "examples", "demo-floor.trabeate",
                                NULL);
}

static TrbWindow *
open_demo (void)
{
  g_autofree char *path = demo_path ();
  g_autoptr(GFile) file = g_file_new_for_path (path);
  TrbWindow *window = trb_window_new (app);
  gint64 until = g_get_monotonic_time () + 60 * G_USEC_PER_SEC;
  TrbDocument *document;

  trb_application_open_file (app, file, GTK_WINDOW (window));
  gtk_window_set_default_size (GTK_WINDOW (window), 1400, 900);
  gtk_window_present (GTK_WINDOW (window));
  document = trb_window_get_document (window);
  g_assert_nonnull (document);
  while ((trb_document_get_solving (document) || !gtk_widget_get_mapped (GTK_WIDGET (window)))
         && g_get_monotonic_time () < until)
    g_main_context_iteration (NULL, TRUE);
  g_assert_false (trb_document_get_solving (document));
  while (g_main_context_iteration (NULL, FALSE))
    ;
  return window;
}

static void
close_window (TrbWindow *window)
{
  gtk_window_destroy (GTK_WINDOW (window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
}

/* ---- help ------------------------------------------------------------------------------------ */

static gboolean
menu_has_action (GMenuModel *menu,
                 const char *action)
{
  for (int i = 0; i < g_menu_model_get_n_items (menu); i++)
    {
      g_autofree char *name = NULL;
      GMenuLinkIter *links;
      GMenuModel *link;
      const char *link_name;

      if (g_menu_model_get_item_attribute (menu, i, G_MENU_ATTRIBUTE_ACTION, "s", &name)
          && g_str_equal (name, action))
        return TRUE;
      links = g_menu_model_iterate_item_links (menu, i);
      while (g_menu_link_iter_get_next (links, &link_name, &link))
        {
          gboolean found = menu_has_action (link, action);

          g_object_unref (link);
          if (found)
            {
              g_object_unref (links);
              return TRUE;
            }
        }
      g_object_unref (links);
    }
  return FALSE;
}

static GtkMenuButton *
find_primary_menu (GtkWidget *widget)
{
  if (GTK_IS_MENU_BUTTON (widget) && gtk_menu_button_get_primary (GTK_MENU_BUTTON (widget)))
    return GTK_MENU_BUTTON (widget);
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    {
      GtkMenuButton *found = find_primary_menu (child);

      if (found != NULL)
        return found;
    }
  return NULL;
}

static void
test_help (void)
{
  g_auto(GStrv) accels = NULL;
  TrbWindow *window = open_demo ();
  GtkMenuButton *button;
  g_autofree char *guide = NULL;
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  GMenuModel *menu;

  /* the action, on F1 (the desktop's key for help: GNOME Human Interface Guidelines,
   * keyboard shortcuts, common practice) */
  g_assert_true (g_action_map_lookup_action (G_ACTION_MAP (app), "help") != NULL);
  accels = gtk_application_get_accels_for_action (GTK_APPLICATION (app), "app.help");
  g_assert_cmpuint (g_strv_length (accels), >=, 1);
  g_assert_cmpstr (accels[0], ==, "F1");

  /* in the primary menu */
  button = find_primary_menu (GTK_WIDGET (window));
  g_assert_nonnull (button);
  menu = gtk_menu_button_get_menu_model (button);
  g_assert_nonnull (menu);
  g_assert_true (menu_has_action (menu, "app.help"));
  close_window (window);

  /* and the guide it opens is there: the user guide, links and all */
  guide = trb_help_dup_guide ();
  g_assert_nonnull (guide);
  g_assert_true (g_str_has_suffix (guide, "user-guide.md"));
  g_file_get_contents (guide, &text, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (g_str_has_prefix (text, "# "));
}

/* Without a guide the action says where it looked instead of failing silently. */
static void
test_help_missing (void)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *saved = g_strdup (g_getenv ("TRABEATE_DOCDIR"));

  g_setenv ("TRABEATE_DOCDIR", "/nonexistent-trabeate-docs", TRUE);
  g_assert_null (trb_help_dup_guide ());
  g_assert_false (trb_help_show (NULL, &error));
  g_assert_nonnull (error);
  g_assert_nonnull (strstr (error->message, "/nonexistent-trabeate-docs"));
  if (saved != NULL)
    g_setenv ("TRABEATE_DOCDIR", saved, TRUE);
  else
    g_unsetenv ("TRABEATE_DOCDIR");
}

/* ---- accessibility --------------------------------------------------------------------------- */

/* The plan says in words what its colours show: the floor, how many members, how many fail, and
 * the selection with its status. */
static void
test_plan_description (void)
{
  TrbWindow *window = open_demo ();
  TrbDocument *document = trb_window_get_document (window);
  TrbProject *project = trb_document_get_project (document);
  GtkWidget *canvas = trb_window_get_canvas (window);
  TrbFloor *floor = trb_document_get_floor (document);
  g_autofree char *label = NULL;
  g_autofree char *expected = NULL;
  g_autofree char *selected = NULL;
  g_autofree char *mismatch = NULL;
  g_autofree char *start = NULL;
  TrbMember *member;
  guint failing = 0;

  g_assert_nonnull (floor);
  for (guint i = 0; i < project->members->len; i++)
    {
      const TrbMemberResult *r =
        trb_document_lookup_result (document, g_ptr_array_index (project->members, i));

      g_assert_nonnull (r);
      failing += r->status != TRB_STATUS_PASS;
    }
  /* counted here from the results, the way the members list's Failing Only counts them */
  expected = g_strdup_printf ("Plan of %s: %u members, %u failing", floor->name,
                              project->members->len, failing);
  label = g_strdup_printf ("Plan of %s", floor->name);
  mismatch = gtk_test_accessible_check_property (GTK_ACCESSIBLE (canvas),
                                                 GTK_ACCESSIBLE_PROPERTY_LABEL, label);
  g_assert_null (mismatch);
  mismatch = gtk_test_accessible_check_property (GTK_ACCESSIBLE (canvas),
                                                 GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                                 expected);
  g_assert_null (mismatch);

  member = g_ptr_array_index (project->members, 0);
  trb_plan_canvas_select_member (TRB_PLAN_CANVAS (canvas), member, FALSE);
  selected = g_strdup_printf ("%s, selected %s, %s", expected, member->id,
                              trb_status_label (trb_document_lookup_result (document,
                                                                            member)->status));
  mismatch = gtk_test_accessible_check_property (GTK_ACCESSIBLE (canvas),
                                                 GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
                                                 selected);
  g_assert_null (mismatch);
  start = trb_plan_a11y_describe (document, member);
  g_assert_cmpstr (start, ==, selected);

  /* the canvas takes the keyboard focus, and the tool buttons say their keys */
  g_assert_true (gtk_widget_get_focusable (canvas));
  close_window (window);
}

/* Which way each key steps the selection: the arrow keys, plain (Shift too, it adds nothing);
 * with Ctrl, Alt or Super they are the window's, and Tab still leaves the plan (GNOME Human
 * Interface Guidelines, keyboard navigation: Tab moves between controls, the arrow keys
 * within one; common practice). */
static void
test_key_step (void)
{
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Down, 0), ==, 1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Right, 0), ==, 1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_KP_Down, 0), ==, 1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Up, 0), ==, -1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Left, 0), ==, -1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_KP_Left, 0), ==, -1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Down, GDK_SHIFT_MASK), ==, 1);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Down, GDK_CONTROL_MASK), ==, 0);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Up, GDK_ALT_MASK), ==, 0);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_Tab, 0), ==, 0);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_ISO_Left_Tab, GDK_SHIFT_MASK), ==, 0);
  g_assert_cmpint (trb_plan_canvas_key_step (GDK_KEY_a, 0), ==, 0);
}

/* The step through a list in a given order, passing over another floor's members and going
 * round at the ends. The list is [m3 (A), m1 (B), m2 (A), m4 (A)]; each expected member is read
 * off that order. */
static void
test_step_member (void)
{
  TrbFloor *a = trb_floor_new ("A");
  TrbFloor *b = trb_floor_new ("B");
  TrbMember *m1 = trb_member_new ("M1");
  TrbMember *m2 = trb_member_new ("M2");
  TrbMember *m3 = trb_member_new ("M3");
  TrbMember *m4 = trb_member_new ("M4");
  TrbMember *order[] = { m3, m1, m2, m4 };
  g_autoptr(GListStore) store = g_list_store_new (TRB_TYPE_MEMBER_ITEM);
  g_autoptr(GListStore) empty = g_list_store_new (TRB_TYPE_MEMBER_ITEM);

  m1->floor = b;
  m2->floor = m3->floor = m4->floor = a;
  for (guint i = 0; i < G_N_ELEMENTS (order); i++)
    {
      g_autoptr(TrbMemberItem) item = trb_member_item_new (order[i], NULL);

      g_list_store_append (store, item);
    }

  /* from nothing: the first of floor A going on, the last going back */
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, NULL, 1) == m3);
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, NULL, -1) == m4);
  /* on, over M1 of floor B */
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, m3, 1) == m2);
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, m2, 1) == m4);
  /* round the ends, both ways */
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, m4, 1) == m3);
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, m3, -1) == m4);
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, m2, -1) == m3);
  /* two at once: M2 -> M4 -> (round) M3 */
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), a, m2, 2) == m3);
  /* a floor of one member steps onto itself; a floor with none, and an empty list, give none */
  g_assert_true (trb_plan_canvas_step_member (G_LIST_MODEL (store), b, m1, 1) == m1);
  g_assert_null (trb_plan_canvas_step_member (G_LIST_MODEL (store), NULL, m1, 1));
  g_assert_null (trb_plan_canvas_step_member (G_LIST_MODEL (empty), a, NULL, 1));

  g_list_store_remove_all (store);
  for (guint i = 0; i < G_N_ELEMENTS (order); i++)
    trb_member_free (order[i]);
  trb_floor_free (a);
  trb_floor_free (b);
}

static GtkEventControllerKey *
find_key_controller (GtkWidget *widget)
{
  g_autoptr(GListModel) controllers = gtk_widget_observe_controllers (widget);

  for (guint i = 0; i < g_list_model_get_n_items (controllers); i++)
    {
      g_autoptr(GObject) c = g_list_model_get_item (controllers, i);

      if (GTK_IS_EVENT_CONTROLLER_KEY (c))
        return GTK_EVENT_CONTROLLER_KEY (c);
    }
  return NULL;
}

static gboolean
press_key (GtkEventControllerKey *keys,
           guint                  keyval,
           GdkModifierType        state)
{
  gboolean handled = FALSE;

  g_signal_emit_by_name (keys, "key-pressed", keyval, 0, state, &handled);
  return handled;
}

static GListModel *
window_rows (TrbWindow *window)
{
  return trb_member_list_get_model (TRB_MEMBER_LIST (trb_window_get_member_list (window)));
}

static TrbMember *
row_member (GListModel *rows,
            guint       position)
{
  g_autoptr(TrbMemberItem) item = g_list_model_get_item (rows, position);

  return trb_member_item_get_member (item);
}

static GtkColumnView *
find_column_view (GtkWidget *widget)
{
  if (GTK_IS_COLUMN_VIEW (widget))
    return GTK_COLUMN_VIEW (widget);
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    {
      GtkColumnView *found = find_column_view (child);

      if (found != NULL)
        return found;
    }
  return NULL;
}

/* As a click on the Ratio column's header sorts it. */
static void
sort_by_ratio (GtkWidget *list)
{
  GtkColumnView *view = find_column_view (list);
  GListModel *columns;

  g_assert_nonnull (view);
  columns = gtk_column_view_get_columns (view);
  for (guint i = 0; i < g_list_model_get_n_items (columns); i++)
    {
      g_autoptr(GtkColumnViewColumn) column = g_list_model_get_item (columns, i);

      if (g_str_equal (gtk_column_view_column_get_title (column), "Ratio"))
        {
          gtk_column_view_sort_by_column (view, column, GTK_SORT_DESCENDING);
          return;
        }
    }
  g_assert_not_reached ();
}

static void
count_opened (guint *n)
{
  (*n)++;
}

/* The plan from the keyboard: the arrow keys, sent to the canvas's key controller, walk the
 * selection through the members list's rows in their order, and the panels follow; Enter opens
 * the selection on the member page with the keyboard in it; Escape leaves a tool. */
static void
test_plan_keys (void)
{
  TrbWindow *window = open_demo ();
  TrbDocument *document = trb_window_get_document (window);
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (window));
  GtkWidget *panel = trb_window_get_member_panel (window);
  GListModel *rows = window_rows (window);
  GtkEventControllerKey *keys = find_key_controller (GTK_WIDGET (canvas));
  TrbFloor *floor = trb_document_get_floor (document);
  AdwViewStack *stack;
  GtkWidget *focus;
  guint n, opened = 0;

  g_assert_nonnull (keys);
  n = g_list_model_get_n_items (rows);
  /* the demo is one floor, so every row is a step */
  g_assert_cmpuint (n, >=, 3);
  for (guint i = 0; i < n; i++)
    g_assert_true (row_member (rows, i)->floor == floor);
  g_assert_null (trb_plan_canvas_get_selected_member (canvas));

  g_assert_true (press_key (keys, GDK_KEY_Down, 0));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, 0));
  g_assert_cmpuint (trb_plan_canvas_get_n_selected (canvas), ==, 1);
  g_assert_true (press_key (keys, GDK_KEY_Right, 0));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, 1));
  g_assert_true (press_key (keys, GDK_KEY_Up, 0));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, 0));
  /* back from the first row: the last */
  g_assert_true (press_key (keys, GDK_KEY_Left, 0));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, n - 1));
  /* with Ctrl the key is not the plan's and nothing moves */
  g_assert_false (press_key (keys, GDK_KEY_Down, GDK_CONTROL_MASK));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, n - 1));

  /* the list's order as the engineer sorts it, not the floor's: by ratio, worst first (the
   * Ratio column's first click), the steps follow the new rows */
  sort_by_ratio (trb_window_get_member_list (window));
  g_assert_true (row_member (rows, 0) != g_ptr_array_index (floor->members, 0)
                 || row_member (rows, 1) != g_ptr_array_index (floor->members, 1));
  trb_plan_canvas_select_member (canvas, NULL, FALSE);
  g_assert_true (press_key (keys, GDK_KEY_Down, 0));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, 0));
  g_assert_true (press_key (keys, GDK_KEY_Down, 0));
  g_assert_true (trb_plan_canvas_get_selected_member (canvas) == row_member (rows, 1));

  /* Enter opens it: the hidden side panel comes back on the member page, focus inside it */
  g_signal_connect_swapped (canvas, "member-opened", G_CALLBACK (count_opened), &opened);
  g_object_set (window, "show-panel", FALSE, NULL);
  trb_window_show_page (window, "sections");
  stack = ADW_VIEW_STACK (gtk_widget_get_ancestor (panel, ADW_TYPE_VIEW_STACK));
  g_assert_nonnull (stack);
  g_assert_cmpstr (adw_view_stack_get_visible_child_name (stack), ==, "sections");
  gtk_widget_grab_focus (GTK_WIDGET (canvas));
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (canvas), "canvas.finish", NULL));
  g_assert_cmpuint (opened, ==, 1);
  g_assert_true (gtk_widget_get_visible (gtk_widget_get_parent (GTK_WIDGET (stack))));
  g_assert_cmpstr (adw_view_stack_get_visible_child_name (stack), ==, "member");
  focus = gtk_root_get_focus (GTK_ROOT (window));
  g_assert_nonnull (focus);
  g_assert_true (gtk_widget_is_ancestor (focus, panel));

  /* Enter while drawing finishes the drawing instead of opening anything */
  trb_plan_canvas_set_tool (canvas, TRB_TOOL_GIRDER);
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (canvas), "canvas.finish", NULL));
  g_assert_cmpuint (opened, ==, 1);
  /* Escape with nothing drawn leaves the tool */
  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (canvas), "canvas.cancel", NULL));
  g_assert_cmpint (trb_plan_canvas_get_tool (canvas), ==, TRB_TOOL_SELECT);
  close_window (window);
}

/* The plan's tooltip: the member under the pointer in the members list's words, so that its
 * status is read, not only seen in colour; nothing off the members. */
static void
test_plan_tooltip (void)
{
  TrbWindow *window = open_demo ();
  TrbPlanCanvas *canvas = TRB_PLAN_CANVAS (trb_window_get_canvas (window));
  GListModel *rows = window_rows (window);
  g_autoptr(TrbMemberItem) item = g_list_model_get_item (rows, 0);
  TrbMember *member = trb_member_item_get_member (item);
  double ratio = trb_member_item_get_ratio (item);
  g_autofree char *text = NULL;
  g_autofree char *expected = NULL;

  g_assert_true (gtk_widget_get_has_tooltip (GTK_WIDGET (canvas)));
  /* the demo is solved: every member has a ratio */
  g_assert_false (isnan (ratio));
  expected = g_strdup_printf ("%s, %s, %s, ratio %.2f", trb_member_item_get_mark (item),
                              trb_member_item_get_section (item),
                              trb_member_item_get_status (item), ratio);
  text = trb_plan_canvas_describe_at (canvas, (member->start.x + member->end.x) / 2,
                                      (member->start.y + member->end.y) / 2);
  g_assert_cmpstr (text, ==, expected);
  g_assert_true (g_str_has_prefix (text, member->id));
  /* a kilometre off the floor: nothing to say */
  g_assert_null (trb_plan_canvas_describe_at (canvas, member->start.x - 1000.0,
                                              member->start.y - 1000.0));
  close_window (window);
}

static GtkWidget *
find_tool_button (GtkWidget  *widget,
                  const char *tool)
{
  if (GTK_IS_ACTIONABLE (widget))
    {
      GVariant *target = gtk_actionable_get_action_target_value (GTK_ACTIONABLE (widget));

      if (target != NULL && g_variant_is_of_type (target, G_VARIANT_TYPE_STRING)
          && g_str_equal (g_variant_get_string (target, NULL), tool))
        return widget;
    }
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    {
      GtkWidget *found = find_tool_button (child, tool);

      if (found != NULL)
        return found;
    }
  return NULL;
}

static GtkLabel *
find_label_widget (GtkWidget  *widget,
                   const char *text)
{
  if (GTK_IS_LABEL (widget) && g_strcmp0 (gtk_label_get_label (GTK_LABEL (widget)), text) == 0)
    return GTK_LABEL (widget);
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    {
      GtkLabel *found = find_label_widget (child, text);

      if (found != NULL)
        return found;
    }
  return NULL;
}

static void
assert_named (GtkWidget          *widget,
              GtkAccessibleRole   role,
              const char         *label)
{
  g_autofree char *mismatch = NULL;

  g_assert_true (gtk_test_accessible_has_role (GTK_ACCESSIBLE (widget), role));
  mismatch = gtk_test_accessible_check_property (GTK_ACCESSIBLE (widget),
                                                 GTK_ACCESSIBLE_PROPERTY_LABEL, label);
  g_assert_null (mismatch);
  g_assert_true (gtk_test_accessible_has_property (GTK_ACCESSIBLE (widget),
                                                   GTK_ACCESSIBLE_PROPERTY_LABEL));
}

/* The side panels and the members list are named groups with a description, the icon-only
 * tool buttons say their names and keys; the side pages and the tool options have mnemonics. */
static void
test_names_and_mnemonics (void)
{
  TrbWindow *window = open_demo ();
  GtkWidget *panel = trb_window_get_member_panel (window);
  GtkWidget *girder = find_tool_button (GTK_WIDGET (window), "girder");
  GtkWidget *wall = find_tool_button (GTK_WIDGET (window), "wall");
  AdwViewStack *stack = ADW_VIEW_STACK (gtk_widget_get_ancestor (panel, ADW_TYPE_VIEW_STACK));
  const char *pages[][2] = {
    { "member", "_Member" }, { "diagrams", "D_iagrams" }, { "sections", "S_ections" },
  };
  g_autofree char *mismatch = NULL;
  GtkLabel *label;

  /* ui/trb-window.ui */
  assert_named (panel, GTK_ACCESSIBLE_ROLE_GROUP, "Member");
  assert_named (trb_window_get_diagram_view (window), GTK_ACCESSIBLE_ROLE_GROUP, "Diagrams");
  assert_named (trb_window_get_shortlist (window), GTK_ACCESSIBLE_ROLE_GROUP, "Sections");
  assert_named (trb_window_get_member_list (window), GTK_ACCESSIBLE_ROLE_GROUP, "Members");
  mismatch = gtk_test_accessible_check_property (
    GTK_ACCESSIBLE (panel), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION,
    "The selected member: its properties, design settings, checks and loads");
  g_assert_null (mismatch);
  g_assert_true (gtk_test_accessible_has_property (
    GTK_ACCESSIBLE (trb_window_get_shortlist (window)), GTK_ACCESSIBLE_PROPERTY_DESCRIPTION));

  g_assert_nonnull (girder);
  g_assert_nonnull (wall);
  assert_named (girder, GTK_ACCESSIBLE_ROLE_BUTTON, "Girder");
  assert_named (wall, GTK_ACCESSIBLE_ROLE_BUTTON, "Bearing Wall");
  /* the keys the canvas binds in trb_plan_canvas_class_init */
  mismatch = gtk_test_accessible_check_property (GTK_ACCESSIBLE (girder),
                                                 GTK_ACCESSIBLE_PROPERTY_KEY_SHORTCUTS, "G");
  g_assert_null (mismatch);
  mismatch = gtk_test_accessible_check_property (GTK_ACCESSIBLE (wall),
                                                 GTK_ACCESSIBLE_PROPERTY_KEY_SHORTCUTS, "W");
  g_assert_null (mismatch);
  assert_named (gtk_widget_get_parent (girder), GTK_ACCESSIBLE_ROLE_TOOLBAR, "Tools");

  /* mnemonics: the side pages (Alt+M, Alt+I, Alt+E) */
  for (guint i = 0; i < G_N_ELEMENTS (pages); i++)
    {
      AdwViewStackPage *page = adw_view_stack_get_page (
        stack, adw_view_stack_get_child_by_name (stack, pages[i][0]));

      g_assert_cmpstr (adw_view_stack_page_get_title (page), ==, pages[i][1]);
      g_assert_true (adw_view_stack_page_get_use_underline (page));
    }
  /* ... and the tool options, each label leading to its field */
  label = find_label_widget (GTK_WIDGET (window), "Load _case");
  g_assert_nonnull (label);
  g_assert_true (gtk_label_get_use_underline (label));
  g_assert_true (GTK_IS_DROP_DOWN (gtk_label_get_mnemonic_widget (label)));
  label = find_label_widget (GTK_WIDGET (window), "S_pacing");
  g_assert_nonnull (label);
  g_assert_true (GTK_IS_ENTRY (gtk_label_get_mnemonic_widget (label)));
  trb_plan_canvas_set_tool (TRB_PLAN_CANVAS (trb_window_get_canvas (window)),
                            TRB_TOOL_AREA_LOAD);
  label = find_label_widget (GTK_WIDGET (window), "_Pressure");
  g_assert_nonnull (label);
  g_assert_true (gtk_label_get_use_underline (label));
  g_assert_true (GTK_IS_ENTRY (gtk_label_get_mnemonic_widget (label)));
  label = find_label_widget (GTK_WIDGET (window), "S_how");
  g_assert_nonnull (label);
  g_assert_true (GTK_IS_DROP_DOWN (gtk_label_get_mnemonic_widget (label)));
  close_window (window);
}

/* ---- language -------------------------------------------------------------------------------- */

static gboolean
find_label (GtkWidget  *widget,
            const char *text)
{
  if (GTK_IS_LABEL (widget) && g_strcmp0 (gtk_label_get_label (GTK_LABEL (widget)), text) == 0)
    return TRUE;
  if (GTK_IS_BUTTON (widget) && g_strcmp0 (gtk_button_get_label (GTK_BUTTON (widget)), text) == 0)
    return TRUE;
  if (ADW_IS_SPLIT_BUTTON (widget)
      && g_strcmp0 (adw_split_button_get_label (ADW_SPLIT_BUTTON (widget)), text) == 0)
    return TRUE;
  for (GtkWidget *child = gtk_widget_get_first_child (widget); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    if (find_label (child, text))
      return TRUE;
  return FALSE;
}

/* English by default: the words the Spanish case looks for are the catalog's, not the
 * source's. */
static void
test_english (void)
{
  TrbWindow *window = open_demo ();

  g_assert_true (find_label (GTK_WIDGET (window), "Members"));      /* ui/trb-member-list.ui */
  g_assert_true (find_label (GTK_WIDGET (window), "_Open"));        /* ui/trb-window.ui */
  g_assert_false (find_label (GTK_WIDGET (window), "Elementos"));
  close_window (window);
}

/* Under LANGUAGE=es with the build's catalogs, as tests/test-i18n.py runs the command. */
static void
test_spanish (void)
{
  TrbWindow *window = open_demo ();

  /* po/es.po: msgid "Members" -> msgstr "Elementos", "_Open" -> "_Abrir" */
  g_assert_true (find_label (GTK_WIDGET (window), "Elementos"));
  g_assert_true (find_label (GTK_WIDGET (window), "_Abrir"));
  g_assert_false (find_label (GTK_WIDGET (window), "Members"));
  close_window (window);
}

int
main (int   argc,
      char *argv[])
{
  g_autoptr(GError) error = NULL;
  const char *localedir;
  gboolean spanish = FALSE;
  int status;

  /* --spanish: the window in Spanish, with the catalogs compiled in the build */
  for (int i = 1; i < argc; i++)
    if (g_str_equal (argv[i], "--spanish"))
      {
        spanish = TRUE;
        memmove (&argv[i], &argv[i + 1], (argc - i) * sizeof (char *));
        argc--;
        break;
      }
  if (spanish)
    {
      g_setenv ("LANGUAGE", "es", TRUE);
      g_setenv ("TRABEATE_LOCALEDIR", TRB_BUILD_LOCALEDIR, TRUE);
    }
  localedir = g_getenv ("TRABEATE_LOCALEDIR");

  /* as main.c does, with the build's catalogs when the test names them */
  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, localedir != NULL && localedir[0] != '\0' ? localedir
                                                                             : LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

  /* GTK's test backend for accessibility: the properties are kept and can be read back, with
   * no screen reader on the bus */
  g_setenv ("GTK_A11Y", "test", TRUE);
  gtk_test_init (&argc, &argv, NULL);
  app = trb_application_new ("org.trabeate.Trabeate.Test", G_APPLICATION_NON_UNIQUE);
  g_application_register (G_APPLICATION (app), NULL, &error);
  g_assert_no_error (error);

  g_test_add_func ("/trb/desktop/help", test_help);
  g_test_add_func ("/trb/desktop/help-missing", test_help_missing);
  g_test_add_func ("/trb/desktop/plan-description", test_plan_description);
  g_test_add_func ("/trb/desktop/key-step", test_key_step);
  g_test_add_func ("/trb/desktop/step-member", test_step_member);
  g_test_add_func ("/trb/desktop/plan-keys", test_plan_keys);
  g_test_add_func ("/trb/desktop/plan-tooltip", test_plan_tooltip);
  g_test_add_func ("/trb/desktop/names-and-mnemonics", test_names_and_mnemonics);
  if (spanish)
    g_test_add_func ("/trb/desktop/spanish", test_spanish);
  else
    g_test_add_func ("/trb/desktop/english", test_english);
  status = g_test_run ();
  g_object_unref (app);
  return status;
}
