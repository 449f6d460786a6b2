/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "trb-print.h"
#include "trb-edit.h"
#include "trb-error.h"
#include "trb-render-report.h"
#include "trb-solve.h"

/* What one print or export works on. The document's results follow the live project and are
 * replaced by the next solve, while a print operation draws its pages later, from the main
 * loop, after its dialog; so the job keeps a copy of the project and its own results. */
typedef struct
{
  TrbProject       *project;
  TrbProjectResult *results;
  TrbReportOptions  options;
  char             *title;
  TrbReport        *report;
} PrintJob;

static void
print_job_free (PrintJob *job)
{
  g_clear_pointer (&job->report, trb_report_free);
  g_clear_pointer (&job->results, trb_project_result_free);
  g_clear_pointer (&job->project, trb_edit_project_copy_free);
  g_free (job->title);
  g_free (job);
}

G_DEFINE_AUTOPTR_CLEANUP_FUNC (PrintJob, print_job_free)

static PrintJob *
print_job_new (TrbDocument  *document,
               GError      **error)
{
  g_autoptr(PrintJob) job = g_new0 (PrintJob, 1);
  TrbSolveOptions solve_options;

  job->project = trb_edit_project_copy (trb_document_get_project (document));
  /* the same pipeline as `trabeate-cli report`, so the pages are the same: the member
   * sheets show the shortlist */
  trb_solve_options_init (&solve_options);
  solve_options.shortlist_max = TRB_SHORTLIST_DEFAULT;
  job->results = trb_solve_project_full (job->project, &solve_options);
  trb_report_options_init (&job->options, job->project);
  /* a project never saved has no name of its own; the window's title stands in */
  if (job->project->name == NULL)
    {
      job->title = trb_document_dup_title (document);
      job->options.title = job->title;
    }
  job->report = trb_report_new (job->project, job->results, &job->options, error);
  if (job->report == NULL)
    return NULL;
  return g_steal_pointer (&job);
}

/* ---- print ----------------------------------------------------------------------------------- */

/* GTK's names for the report's papers (PWG 5101.1 self-describing names), so that the print
 * dialog shows the paper by the name the printer knows. */
static const char * const paper_names[TRB_N_PAPERS] = {
  [TRB_PAPER_LETTER] = GTK_PAPER_NAME_LETTER,
  [TRB_PAPER_LEGAL] = GTK_PAPER_NAME_LEGAL,
  [TRB_PAPER_TABLOID] = "na_ledger",
  [TRB_PAPER_A4] = GTK_PAPER_NAME_A4,
  [TRB_PAPER_A3] = GTK_PAPER_NAME_A3,
};

static GtkPageSetup *
page_setup_for (const TrbReportOptions *options)
{
  GtkPageSetup *setup = gtk_page_setup_new ();
  g_autoptr(GtkPaperSize) size = gtk_paper_size_new (paper_names[options->paper]);
  double w, h;

  trb_paper_get_size (options->paper, FALSE, &w, &h);
  /* should GTK not know the name, the size itself */
  if (fabs (gtk_paper_size_get_width (size, GTK_UNIT_POINTS) - w) > 1.0
      || fabs (gtk_paper_size_get_height (size, GTK_UNIT_POINTS) - h) > 1.0)
    {
      gtk_paper_size_free (size);
      size = gtk_paper_size_new_custom (trb_paper_name (options->paper),
                                        trb_paper_name (options->paper), w, h,
                                        GTK_UNIT_POINTS);
    }
  gtk_page_setup_set_paper_size_and_default_margins (setup, size);
  gtk_page_setup_set_orientation (setup, options->landscape ? GTK_PAGE_ORIENTATION_LANDSCAPE
                                                            : GTK_PAGE_ORIENTATION_PORTRAIT);
  return setup;
}

/* Which of the report's papers the dialog's choice is, within a point; FALSE for another. */
static gboolean
paper_for_setup (GtkPageSetup *setup,
                 TrbPaper     *paper,
                 gboolean     *landscape)
{
  double w = gtk_page_setup_get_paper_width (setup, GTK_UNIT_POINTS);
  double h = gtk_page_setup_get_paper_height (setup, GTK_UNIT_POINTS);

  for (int p = 0; p < TRB_N_PAPERS; p++)
    {
      double pw, ph;

      trb_paper_get_size (p, FALSE, &pw, &ph);
      if (fabs (MIN (w, h) - pw) <= 1.0 && fabs (MAX (w, h) - ph) <= 1.0)
        {
          *paper = p;
          *landscape = w > h;
          return TRUE;
        }
    }
  return FALSE;
}

/* The dialog may have changed the paper: where it is one of the report's, the report is laid
 * out again on it, so that a plan chosen for A3 is drawn at A3's scale rather than shrunk. */
static void
on_begin_print (GtkPrintOperation *op,
                GtkPrintContext   *context,
                PrintJob          *job)
{
  TrbPaper paper;
  gboolean landscape;

  if (paper_for_setup (gtk_print_context_get_page_setup (context), &paper, &landscape)
      && (paper != job->options.paper || landscape != job->options.landscape))
    {
      TrbReportOptions options = job->options;
      TrbReport *report;

      options.paper = paper;
      options.landscape = landscape;
      report = trb_report_new (job->project, job->results, &options, NULL);
      if (report != NULL)
        {
          trb_report_free (job->report);
          job->report = report;
          job->options = options;
        }
    }
  gtk_print_operation_set_n_pages (op, trb_report_get_n_pages (job->report));
}

static void
on_draw_page (GtkPrintOperation *op,
              GtkPrintContext   *context,
              int                page,
              PrintJob          *job)
{
  cairo_t *cr = gtk_print_context_get_cairo_context (context);
  double cw = gtk_print_context_get_width (context);
  double ch = gtk_print_context_get_height (context);
  double pw, ph, s;

  if (page < 0 || (guint) page >= trb_report_get_n_pages (job->report))
    return;
  trb_report_get_page_size (job->report, &pw, &ph);
  /* the page, in points, onto the printable area, whole and centred: the printer's margins
   * take a little off the sheet's border */
  s = MIN (cw / pw, ch / ph);
  cairo_save (cr);
  cairo_translate (cr, (cw - pw * s) / 2, (ch - ph * s) / 2);
  cairo_scale (cr, s, s);
  trb_report_draw_page (job->report, page, cr);
  cairo_restore (cr);
}

/**
 * trb_print_operation_new:
 * @document: the project to print
 * @error: where to say why the report could not be laid out
 *
 * A print operation for the report of @document as it is now: every sheet, page by page,
 * on the report's paper (Letter for a US project, A4 for an SI one) as its default page
 * setup. Run it with GTK_PRINT_OPERATION_ACTION_PRINT_DIALOG to print or preview, or with
 * GTK_PRINT_OPERATION_ACTION_EXPORT and an export file name for a PDF.
 *
 * Returns: (transfer full): the operation, or %NULL
 */
GtkPrintOperation *
trb_print_operation_new (TrbDocument  *document,
                         GError      **error)
{
  g_autoptr(GtkPrintOperation) op = NULL;
  g_autoptr(GtkPageSetup) setup = NULL;
  g_autofree char *name = NULL;
  PrintJob *job;

  g_return_val_if_fail (TRB_IS_DOCUMENT (document), NULL);

  job = print_job_new (document, error);
  if (job == NULL)
    return NULL;
  op = gtk_print_operation_new ();
  g_object_set_data_full (G_OBJECT (op), "trb-print-job", job,
                          (GDestroyNotify) print_job_free);
  name = trb_document_dup_title (document);
  gtk_print_operation_set_job_name (op, name);
  gtk_print_operation_set_n_pages (op, trb_report_get_n_pages (job->report));
  gtk_print_operation_set_unit (op, GTK_UNIT_POINTS);
  setup = page_setup_for (&job->options);
  gtk_print_operation_set_default_page_setup (op, setup);
  gtk_print_operation_set_embed_page_setup (op, TRUE);
  g_signal_connect (op, "begin-print", G_CALLBACK (on_begin_print), job);
  g_signal_connect (op, "draw-page", G_CALLBACK (on_draw_page), job);
  return g_steal_pointer (&op);
}

/* The printer, copies and so on chosen last, offered again for the next print while the
 * editor runs. */
static GtkPrintSettings *last_settings;

static void
on_print_done (GtkPrintOperation       *op,
               GtkPrintOperationResult  result,
               TrbWindow               *window)
{
  if (result == GTK_PRINT_OPERATION_RESULT_APPLY)
    g_set_object (&last_settings, gtk_print_operation_get_print_settings (op));
  else if (result == GTK_PRINT_OPERATION_RESULT_ERROR)
    {
      g_autoptr(GError) error = NULL;
      g_autofree char *message = NULL;

      /* the banner rather than a toast: a print that failed is not to be missed */
      gtk_print_operation_get_error (op, &error);
      message = g_strdup_printf (_("Could not print: %s"),
                                 error != NULL ? error->message
                                               : gtk_print_operation_get_status_string (op));
      trb_window_show_error (window, message);
    }
}

/**
 * trb_print_run:
 * @window: the window whose project is printed
 *
 * Opens the print dialog (with its preview) for the report of the window's project.
 */
void
trb_print_run (TrbWindow *window)
{
  g_autoptr(GtkPrintOperation) op = NULL;
  g_autoptr(GError) error = NULL;
  TrbDocument *document;

  g_return_if_fail (TRB_IS_WINDOW (window));

  document = trb_window_get_document (window);
  if (document == NULL)
    return;
  op = trb_print_operation_new (document, &error);
  if (op == NULL)
    {
      g_autofree char *message = g_strdup_printf (_("Could not print: %s"), error->message);

      trb_window_show_error (window, message);
      return;
    }
  if (last_settings != NULL)
    gtk_print_operation_set_print_settings (op, last_settings);
  gtk_print_operation_set_allow_async (op, TRUE);
  g_signal_connect_object (op, "done", G_CALLBACK (on_print_done), window, 0);
  if (gtk_print_operation_run (op, GTK_PRINT_OPERATION_ACTION_PRINT_DIALOG, GTK_WINDOW (window),
                               &error) == GTK_PRINT_OPERATION_RESULT_ERROR)
    {
      g_autofree char *message = g_strdup_printf (_("Could not print: %s"), error->message);

      trb_window_show_error (window, message);
    }
}

/* ---- export ---------------------------------------------------------------------------------- */

/**
 * trb_print_export:
 * @window: the window whose project is written
 * @file: a local file whose name ends in .pdf or .svg
 * @error: where to say what failed
 *
 * Writes the report of the window's project to @file: PDF with every page, or SVG with one
 * file a page ("name.svg", "name-2.svg", ...). Says so in a toast, or why not in the window's
 * banner, with the file's name.
 *
 * Returns: %TRUE when written
 */
gboolean
trb_print_export (TrbWindow  *window,
                  GFile      *file,
                  GError    **error)
{
  g_autoptr(GError) local_error = NULL;
  g_autoptr(PrintJob) job = NULL;
  g_autofree char *path = NULL;
  g_autofree char *base = NULL;
  g_autofree char *lower = NULL;
  TrbDocument *document;

  g_return_val_if_fail (TRB_IS_WINDOW (window), FALSE);
  g_return_val_if_fail (G_IS_FILE (file), FALSE);

  document = trb_window_get_document (window);
  g_return_val_if_fail (document != NULL, FALSE);

  path = g_file_get_path (file);
  base = g_file_get_basename (file);
  lower = g_ascii_strdown (base != NULL ? base : "", -1);
  if (path == NULL)
    g_set_error (&local_error, TRB_ERROR, TRB_ERROR_IO,
                 _("%s: the report can only be written to a folder on this computer"), base);
  else if (!g_str_has_suffix (lower, ".pdf") && !g_str_has_suffix (lower, ".svg"))
    g_set_error (&local_error, TRB_ERROR, TRB_ERROR_INVALID,
                 _("%s: write a name ending in .pdf or .svg"), base);
  else
    {
      job = print_job_new (document, &local_error);
      if (job != NULL)
        trb_report_write (job->report, path, 0, &local_error);
    }

  if (local_error != NULL)
    {
      g_autofree char *message = g_strdup_printf (_("Could not write the report: %s"),
                                                  local_error->message);

      trb_window_show_error (window, message);
      g_propagate_error (error, g_steal_pointer (&local_error));
      return FALSE;
    }
  {
    guint n = trb_report_get_n_pages (job->report);
    g_autofree char *message = NULL;

    if (g_str_has_suffix (lower, ".svg") && n > 1)
      /* Translators: SVG holds one page a file: "plan.svg", "plan-2.svg", ... */
      message = g_strdup_printf (ngettext ("Report written to “%s” and %u more file",
                                           "Report written to “%s” and %u more files", n - 1),
                                 base, n - 1);
    else
      message = g_strdup_printf (ngettext ("Report written to “%s”: %u page",
                                           "Report written to “%s”: %u pages", n), base, n);
    trb_window_show_toast (window, message);
  }
  return TRUE;
}

static GtkFileFilter *
report_filter (const char *name,
               const char *pattern,
               const char *mime_type,
               const char *extension)
{
  GtkFileFilter *filter = gtk_file_filter_new ();

  gtk_file_filter_set_name (filter, name);
  gtk_file_filter_add_pattern (filter, pattern);
  gtk_file_filter_add_mime_type (filter, mime_type);
  g_object_set_data (G_OBJECT (filter), "trb-extension", (gpointer) extension);
  return filter;
}

static void
on_export_response (GtkNativeDialog *dialog,
                    int              response,
                    TrbWindow       *window)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *base = file != NULL ? g_file_get_basename (file) : NULL;
      g_autofree char *lower = base != NULL ? g_ascii_strdown (base, -1) : NULL;

      /* the file's extension picks the format; a name without one takes the filter's */
      if (lower != NULL && !g_str_has_suffix (lower, ".pdf") && !g_str_has_suffix (lower, ".svg"))
        {
          GtkFileFilter *filter = gtk_file_chooser_get_filter (GTK_FILE_CHOOSER (dialog));
          const char *ext = filter != NULL ? g_object_get_data (G_OBJECT (filter),
                                                                "trb-extension") : NULL;
          g_autoptr(GFile) parent = g_file_get_parent (file);
          g_autofree char *named = g_strconcat (base, ext != NULL ? ext : ".pdf", NULL);

          g_set_object (&file, NULL);
          file = g_file_get_child (parent, named);
        }
      if (file != NULL)
        trb_print_export (window, file, NULL);
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (window);
}

/**
 * trb_print_export_dialog:
 * @window: the window whose project is written
 *
 * Asks where to write the report, as PDF or SVG by the file's extension, and writes it.
 */
void
trb_print_export_dialog (TrbWindow *window)
{
  GtkFileChooserNative *dialog;
  g_autoptr(GtkFileFilter) pdf = NULL;
  g_autoptr(GtkFileFilter) svg = NULL;
  g_autofree char *title = NULL;
  g_autofree char *name = NULL;
  TrbDocument *document;

  g_return_if_fail (TRB_IS_WINDOW (window));

  document = trb_window_get_document (window);
  if (document == NULL)
    return;
  dialog = gtk_file_chooser_native_new (_("Export the Report"), GTK_WINDOW (window),
                                        GTK_FILE_CHOOSER_ACTION_SAVE, _("_Export"),
                                        _("_Cancel"));
  pdf = report_filter (_("PDF documents"), "*.pdf", "application/pdf", ".pdf");
  svg = report_filter (_("SVG images (a file a page)"), "*.svg", "image/svg+xml", ".svg");
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (dialog), pdf);
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (dialog), svg);
  gtk_file_chooser_set_filter (GTK_FILE_CHOOSER (dialog), pdf);

  /* "demo-floor.trabeate" gives "demo-floor.pdf", beside it */
  title = trb_document_dup_title (document);
  if (g_str_has_suffix (title, ".trabeate"))
    title[strlen (title) - strlen (".trabeate")] = '\0';
  name = g_strconcat (title, ".pdf", NULL);
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (dialog), name);
  if (trb_document_get_file (document) != NULL)
    {
      g_autoptr(GFile) folder = g_file_get_parent (trb_document_get_file (document));

      if (folder != NULL)
        gtk_file_chooser_set_current_folder (GTK_FILE_CHOOSER (dialog), folder, NULL);
    }
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  g_signal_connect (dialog, "response", G_CALLBACK (on_export_response), g_object_ref (window));
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

/**
 * trb_print_add_accels:
 * @app: the application
 *
 * Ctrl+P prints and Shift+Ctrl+E exports; set on the application, so that the primary menu
 * and the shortcuts window show the keys beside the items.
 */
void
trb_print_add_accels (GtkApplication *app)
{
  static const char * const print[] = { "<Control>p", NULL };
  static const char * const export[] = { "<Control><Shift>e", NULL };

  g_return_if_fail (GTK_IS_APPLICATION (app));

  gtk_application_set_accels_for_action (app, "win.print", print);
  gtk_application_set_accels_for_action (app, "win.export-report", export);
}
