/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <adwaita.h>
#include <locale.h>
#include <string.h>

#include "trb-application.h"
#include "trb-help.h"
#include "trb-member-item.h"
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
  if (spanish)
    g_test_add_func ("/trb/desktop/spanish", test_spanish);
  else
    g_test_add_func ("/trb/desktop/english", test_english);
  status = g_test_run ();
  g_object_unref (app);
  return status;
}
