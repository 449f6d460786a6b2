/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <libxml/parser.h>
#include <stdlib.h>
#include <string.h>

#include "trb-application.h"
#include "trb-document.h"
#include "trb-error.h"
#include "trb-print.h"
#include "trb-window.h"

/* Printing and export in the editor (trb-print.c) on the demo floor: the report written from
 * the window must be the report `trabeate-cli report` writes from the same file, page for
 * page. The PDFs are read back with pdfinfo (poppler-utils); the print operation runs with
 * GTK_PRINT_OPERATION_ACTION_EXPORT, so no dialog is needed. Runs under a virtual X server. */

static TrbApplication *app;

typedef struct
{
  TrbWindow   *window;
  TrbDocument *document;
  char        *dir;
} Fixture;

static char *
demo_path (void)
{
  return g_test_build_filename (G_TEST_DIST, "..", "data", "examples", "demo-floor.trabeate",
                                NULL);
}

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
  g_autoptr(GError) error = NULL;

  f->dir = g_dir_make_tmp ("trb-print-XXXXXX", &error);
  g_assert_no_error (error);
  f->window = trb_window_new (app);
  trb_application_open_file (app, file, GTK_WINDOW (f->window));
  f->document = trb_window_get_document (f->window);
  g_assert_nonnull (f->document);
  gtk_window_present (GTK_WINDOW (f->window));
  wait_solved (f->document);
}

static void
fixture_tear_down (Fixture       *f,
                   gconstpointer  data)
{
  g_autoptr(GDir) dir = g_dir_open (f->dir, 0, NULL);
  const char *name;

  gtk_window_destroy (GTK_WINDOW (f->window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
  while (dir != NULL && (name = g_dir_read_name (dir)) != NULL)
    {
      g_autofree char *path = g_build_filename (f->dir, name, NULL);

      g_unlink (path);
    }
  g_rmdir (f->dir);
  g_free (f->dir);
}

/* pdfinfo's "Pages:" and "Page size:" lines. */
static guint
pdf_pages (const char  *path,
           char       **page_size)
{
  const char *argv[] = { "pdfinfo", path, NULL };
  g_autofree char *out = NULL;
  g_autofree char *err = NULL;
  g_autoptr(GError) error = NULL;
  g_auto(GStrv) lines = NULL;
  int status = -1;
  guint pages = 0;

  g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_SEARCH_PATH, NULL, NULL, &out, &err,
                &status, &error);
  g_assert_no_error (error);
  g_spawn_check_wait_status (status, &error);
  g_assert_no_error (error);
  lines = g_strsplit (out, "\n", -1);
  for (guint i = 0; lines[i] != NULL; i++)
    {
      if (g_str_has_prefix (lines[i], "Pages:"))
        pages = (guint) g_ascii_strtoull (g_strstrip (lines[i] + strlen ("Pages:")), NULL, 10);
      else if (g_str_has_prefix (lines[i], "Page size:") && page_size != NULL)
        *page_size = g_strdup (g_strstrip (lines[i] + strlen ("Page size:")));
    }
  return pages;
}

/* The reference: `trabeate-cli report` on the demo's file, read back the same way; once, as
 * a hundred pages take seconds. */
static guint
cli_pages (Fixture *f)
{
  static guint known;
  g_autofree char *demo = demo_path ();
  g_autofree char *out = g_build_filename (f->dir, "cli.pdf", NULL);
  const char *argv[] = { TRB_CLI, "report", demo, "-o", out, NULL };
  g_autoptr(GError) error = NULL;
  int status = -1;
  guint pages;

  if (known > 0)
    return known;
  g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_STDOUT_TO_DEV_NULL, NULL, NULL, NULL,
                NULL, &status, &error);
  g_assert_no_error (error);
  g_spawn_check_wait_status (status, &error);
  g_assert_no_error (error);
  pages = pdf_pages (out, NULL);
  /* a report holds at least the summary, one plan sheet and the schedule (docs/printing.md,
   * "The sheets") */
  g_assert_cmpuint (pages, >=, 3);
  known = pages;
  return pages;
}

static void
test_export_pdf (Fixture       *f,
                 gconstpointer  data)
{
  g_autofree char *path = g_build_filename (f->dir, "demo.pdf", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autoptr(GError) error = NULL;
  g_autofree char *size = NULL;

  g_assert_true (trb_print_export (f->window, file, &error));
  g_assert_no_error (error);
  g_assert_null (trb_window_get_error (f->window));
  /* the same pages as the CLI's report of the same file (docs/printing.md, "For the editor") */
  g_assert_cmpuint (pdf_pages (path, &size), ==, cli_pages (f));
  /* US Letter, 8.5 x 11 in = 612 x 792 pt, for a US project (docs/printing.md, --paper) */
  g_assert_true (g_str_has_prefix (size, "612 x 792 pts"));
}

static void
test_export_svg (Fixture       *f,
                 gconstpointer  data)
{
  g_autofree char *path = g_build_filename (f->dir, "Demo.SVG", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  g_autofree char *last = NULL;
  g_autofree char *beyond = NULL;
  gsize length;
  xmlDoc *doc;
  guint n = cli_pages (f);

  g_assert_true (trb_print_export (f->window, file, &error));
  g_assert_no_error (error);

  /* SVG is one file a page: "Demo.SVG", "Demo-2.SVG", ... (docs/printing.md, -o) */
  g_file_get_contents (path, &text, &length, &error);
  g_assert_no_error (error);
  doc = xmlReadMemory (text, (int) length, path, NULL, XML_PARSE_NONET | XML_PARSE_HUGE);
  g_assert_nonnull (doc);
  g_assert_cmpstr ((const char *) xmlDocGetRootElement (doc)->name, ==, "svg");
  xmlFreeDoc (doc);
  last = g_strdup_printf ("%s/Demo-%u.SVG", f->dir, n);
  beyond = g_strdup_printf ("%s/Demo-%u.SVG", f->dir, n + 1);
  g_assert_true (g_file_test (last, G_FILE_TEST_IS_REGULAR));
  g_assert_false (g_file_test (beyond, G_FILE_TEST_EXISTS));
}

static void
test_export_bad_name (Fixture       *f,
                      gconstpointer  data)
{
  g_autofree char *path = g_build_filename (f->dir, "demo.txt", NULL);
  g_autoptr(GFile) file = g_file_new_for_path (path);
  g_autoptr(GError) error = NULL;

  g_assert_false (trb_print_export (f->window, file, &error));
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  /* the banner names the file */
  g_assert_nonnull (trb_window_get_error (f->window));
  g_assert_nonnull (strstr (trb_window_get_error (f->window), "demo.txt"));
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));
}

static void
test_print_operation (Fixture       *f,
                      gconstpointer  data)
{
  g_autofree char *path = g_build_filename (f->dir, "printed.pdf", NULL);
  g_autoptr(GtkPrintOperation) op = NULL;
  g_autoptr(GError) error = NULL;
  g_autofree char *size = NULL;
  GtkPageSetup *setup;
  GtkPrintOperationResult result;

  op = trb_print_operation_new (f->document, &error);
  g_assert_no_error (error);
  setup = gtk_print_operation_get_default_page_setup (op);
  /* Letter for a US project (docs/printing.md, --paper) */
  g_assert_cmpstr (gtk_paper_size_get_name (gtk_page_setup_get_paper_size (setup)), ==,
                   GTK_PAPER_NAME_LETTER);
  gtk_print_operation_set_export_filename (op, path);
  result = gtk_print_operation_run (op, GTK_PRINT_OPERATION_ACTION_EXPORT,
                                    GTK_WINDOW (f->window), &error);
  g_assert_no_error (error);
  g_assert_cmpint (result, ==, GTK_PRINT_OPERATION_RESULT_APPLY);
  g_assert_cmpuint (pdf_pages (path, &size), ==, cli_pages (f));
  /* printed on Letter, 612 x 792 pt */
  g_assert_true (g_str_has_prefix (size, "612 x 792 pts"));
}

static void
test_print_si_paper (Fixture       *f,
                     gconstpointer  data)
{
  g_autoptr(GtkPrintOperation) op = NULL;
  g_autoptr(GError) error = NULL;
  GtkPaperSize *paper;

  trb_window_set_units (f->window, TRB_UNIT_SYSTEM_SI);
  wait_solved (f->document);
  op = trb_print_operation_new (f->document, &error);
  g_assert_no_error (error);
  paper = gtk_page_setup_get_paper_size (gtk_print_operation_get_default_page_setup (op));
  /* A4 for an SI project (docs/printing.md, --paper); 210 x 297 mm, ISO 216 */
  g_assert_cmpstr (gtk_paper_size_get_name (paper), ==, GTK_PAPER_NAME_A4);
  g_assert_cmpfloat_with_epsilon (gtk_paper_size_get_width (paper, GTK_UNIT_MM), 210.0, 0.5);
  g_assert_cmpfloat_with_epsilon (gtk_paper_size_get_height (paper, GTK_UNIT_MM), 297.0, 0.5);
}

/* Print… opens GTK's print dialog (with Preview) over the window; Cancel closes it and prints
 * nothing, with no message. */
static void
test_print_dialog (Fixture       *f,
                   gconstpointer  data)
{
  GtkWidget *dialog = NULL;
  gint64 until;

  g_assert_true (gtk_widget_activate_action (GTK_WIDGET (f->window), "win.print", NULL));
  until = g_get_monotonic_time () + 10 * G_USEC_PER_SEC;
  while (dialog == NULL && g_get_monotonic_time () < until)
    {
      GListModel *toplevels = gtk_window_get_toplevels ();

      g_main_context_iteration (NULL, FALSE);
      for (guint i = 0; i < g_list_model_get_n_items (toplevels); i++)
        {
          g_autoptr(GtkWidget) w = g_list_model_get_item (toplevels, i);

          /* by name: its header is in the separate gtk4-unix-print package */
          if (g_str_equal (G_OBJECT_TYPE_NAME (w), "GtkPrintUnixDialog"))
            dialog = w;
        }
    }
  g_assert_nonnull (dialog);
  g_assert_true (gtk_window_get_transient_for (GTK_WINDOW (dialog)) == GTK_WINDOW (f->window));
  gtk_dialog_response (GTK_DIALOG (dialog), GTK_RESPONSE_CANCEL);
  while (g_main_context_iteration (NULL, FALSE))
    ;
  g_assert_null (trb_window_get_error (f->window));
}

static void
test_keys (Fixture       *f,
           gconstpointer  data)
{
  g_auto(GStrv) print = gtk_application_get_accels_for_action (GTK_APPLICATION (app),
                                                              "win.print");
  g_auto(GStrv) export = gtk_application_get_accels_for_action (GTK_APPLICATION (app),
                                                               "win.export-report");

  /* Ctrl+P prints, as in every GNOME application (GNOME HIG, keyboard shortcuts) */
  g_assert_true (g_strv_contains ((const char *const *) print, "<Control>p"));
  /* Shift+Ctrl+E exports, the key the issue "Printed output" asks for (docs/user-guide.md) */
  g_assert_true (g_strv_contains ((const char *const *) export, "<Shift><Control>e"));
}

int
main (int   argc,
      char *argv[])
{
  g_autoptr(GError) error = NULL;
  int status;

  gtk_test_init (&argc, &argv, NULL);

  app = trb_application_new ("org.trabeate.Trabeate.TestPrint", G_APPLICATION_NON_UNIQUE);
  g_application_register (G_APPLICATION (app), NULL, &error);
  g_assert_no_error (error);

  g_test_add ("/trb/print/export-pdf", Fixture, NULL, fixture_set_up, test_export_pdf,
              fixture_tear_down);
  g_test_add ("/trb/print/export-svg", Fixture, NULL, fixture_set_up, test_export_svg,
              fixture_tear_down);
  g_test_add ("/trb/print/export-bad-name", Fixture, NULL, fixture_set_up,
              test_export_bad_name, fixture_tear_down);
  g_test_add ("/trb/print/operation", Fixture, NULL, fixture_set_up, test_print_operation,
              fixture_tear_down);
  g_test_add ("/trb/print/si-paper", Fixture, NULL, fixture_set_up, test_print_si_paper,
              fixture_tear_down);
  g_test_add ("/trb/print/dialog", Fixture, NULL, fixture_set_up, test_print_dialog,
              fixture_tear_down);
  g_test_add ("/trb/print/keys", Fixture, NULL, fixture_set_up, test_keys, fixture_tear_down);

  status = g_test_run ();
  g_object_unref (app);
  return status;
}
