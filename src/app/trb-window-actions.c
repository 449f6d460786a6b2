/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>

#include "trb-print.h"
#include "trb-window-private.h"

static GtkFileFilter *
project_filter (void)
{
  GtkFileFilter *filter = gtk_file_filter_new ();

  gtk_file_filter_set_name (filter, _("Trabeate projects"));
  gtk_file_filter_add_pattern (filter, "*.trabeate");
  gtk_file_filter_add_mime_type (filter, "application/x-trabeate-project");
  return filter;
}

/* ---- open ------------------------------------------------------------------------------------ */

static void
on_open_response (GtkNativeDialog *dialog,
                  int              response,
                  TrbWindow       *self)
{
  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      GtkApplication *app = gtk_window_get_application (GTK_WINDOW (self));

      if (file != NULL && TRB_IS_APPLICATION (app))
        trb_application_open_file (TRB_APPLICATION (app), file, GTK_WINDOW (self));
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
}

static void
open_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  TrbWindow *self = TRB_WINDOW (widget);
  GtkFileChooserNative *dialog;
  g_autoptr(GtkFileFilter) filter = project_filter ();

  dialog = gtk_file_chooser_native_new (_("Open a Project"), GTK_WINDOW (self),
                                        GTK_FILE_CHOOSER_ACTION_OPEN, _("_Open"), _("_Cancel"));
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (dialog), filter);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  g_signal_connect (dialog, "response", G_CALLBACK (on_open_response), self);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

/* ---- save ------------------------------------------------------------------------------------ */

static gboolean
save_to (TrbWindow *self,
         GFile     *file)
{
  g_autoptr(GError) error = NULL;

  if (!trb_document_save (self->document, file, &error))
    {
      trb_window_show_error (self, error->message);
      return FALSE;
    }
  {
    g_autofree char *uri = g_file_get_uri (trb_document_get_file (self->document));
    g_autofree char *name = trb_document_dup_title (self->document);
    g_autofree char *message = g_strdup_printf (_("Saved “%s”"), name);

    gtk_recent_manager_add_item (gtk_recent_manager_get_default (), uri);
    trb_window_show_toast (self, message);
  }
  return TRUE;
}

typedef struct
{
  TrbWindow *window;
  gboolean   close_after;
} SaveAs;

static void
on_save_response (GtkNativeDialog *dialog,
                  int              response,
                  SaveAs          *data)
{
  TrbWindow *self = data->window;

  if (response == GTK_RESPONSE_ACCEPT)
    {
      g_autoptr(GFile) file = gtk_file_chooser_get_file (GTK_FILE_CHOOSER (dialog));
      g_autofree char *base = file != NULL ? g_file_get_basename (file) : NULL;

      /* the file manager and the open dialog know projects by their extension */
      if (base != NULL && !g_str_has_suffix (base, ".trabeate"))
        {
          g_autoptr(GFile) parent = g_file_get_parent (file);
          g_autofree char *named = g_strconcat (base, ".trabeate", NULL);

          GFile *named_file = g_file_get_child (parent, named);

          g_object_unref (file);
          file = named_file;
        }
      if (file != NULL && save_to (self, file) && data->close_after)
        {
          self->closing = TRUE;
          gtk_window_close (GTK_WINDOW (self));
        }
    }
  gtk_native_dialog_destroy (dialog);
  g_object_unref (dialog);
  g_object_unref (data->window);
  g_free (data);
}

/**
 * trb_window_save:
 * @self: a window
 * @save_as: ask where, even when the project has a file
 * @close_after: close the window once saved
 */
void
trb_window_save (TrbWindow *self,
                 gboolean   save_as,
                 gboolean   close_after)
{
  GtkFileChooserNative *dialog;
  g_autoptr(GtkFileFilter) filter = NULL;
  g_autofree char *name = NULL;
  SaveAs *data;

  g_return_if_fail (TRB_IS_WINDOW (self));

  if (self->document == NULL)
    return;
  if (!save_as && trb_document_get_file (self->document) != NULL)
    {
      if (save_to (self, NULL) && close_after)
        {
          self->closing = TRUE;
          gtk_window_close (GTK_WINDOW (self));
        }
      return;
    }

  dialog = gtk_file_chooser_native_new (_("Save the Project"), GTK_WINDOW (self),
                                        GTK_FILE_CHOOSER_ACTION_SAVE, _("_Save"), _("_Cancel"));
  filter = project_filter ();
  gtk_file_chooser_add_filter (GTK_FILE_CHOOSER (dialog), filter);
  name = trb_document_get_file (self->document) != NULL
         ? trb_document_dup_title (self->document) : g_strdup (_("Untitled.trabeate"));
  gtk_file_chooser_set_current_name (GTK_FILE_CHOOSER (dialog), name);
  gtk_native_dialog_set_modal (GTK_NATIVE_DIALOG (dialog), TRUE);
  data = g_new0 (SaveAs, 1);
  data->window = g_object_ref (self);
  data->close_after = close_after;
  g_signal_connect (dialog, "response", G_CALLBACK (on_save_response), data);
  gtk_native_dialog_show (GTK_NATIVE_DIALOG (dialog));
}

static void
save_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  trb_window_save (TRB_WINDOW (widget), g_str_equal (name, "win.save-as"), FALSE);
}

/* ---- print and export ------------------------------------------------------------------------ */

static void
print_action (GtkWidget  *widget,
              const char *name,
              GVariant   *param)
{
  if (g_str_equal (name, "win.print"))
    trb_print_run (TRB_WINDOW (widget));
  else
    trb_print_export_dialog (TRB_WINDOW (widget));
}

/* ---- edit ------------------------------------------------------------------------------------ */

static void
undo_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  TrbWindow *self = TRB_WINDOW (widget);
  g_autofree char *label = NULL;

  if (self->document == NULL)
    return;
  if (g_str_equal (name, "win.undo"))
    {
      label = g_strdup (trb_document_get_undo_label (self->document));
      if (trb_document_undo (self->document) && label != NULL)
        {
          g_autofree char *message = g_strdup_printf (_("Undone: %s"), label);

          trb_window_show_toast (self, message);
        }
    }
  else
    trb_document_redo (self->document);
}

static void
close_action (GtkWidget  *widget,
              const char *name,
              GVariant   *param)
{
  gtk_window_close (GTK_WINDOW (widget));
}

static void
zoom_action (GtkWidget  *widget,
             const char *name,
             GVariant   *param)
{
  TrbWindow *self = TRB_WINDOW (widget);

  if (g_str_equal (name, "win.zoom-in"))
    trb_plan_canvas_zoom (self->canvas, 1.25);
  else if (g_str_equal (name, "win.zoom-out"))
    trb_plan_canvas_zoom (self->canvas, 0.8);
  else
    trb_plan_canvas_zoom_to_fit (self->canvas);
}

static void
floor_action (GtkWidget  *widget,
              const char *name,
              GVariant   *param)
{
  trb_window_show_floor (TRB_WINDOW (widget), g_str_equal (name, "win.next-floor") ? 1 : -1);
}

/**
 * trb_window_update_actions:
 * @self: a window
 *
 * Undo and redo are available when the history has something to undo or redo; their
 * tooltips say what. The next and previous floor when there is one.
 */
void
trb_window_update_actions (TrbWindow *self)
{
  gboolean can_undo = FALSE, can_redo = FALSE;

  if (self->document != NULL)
    {
      can_undo = trb_document_get_can_undo (self->document);
      can_redo = trb_document_get_can_redo (self->document);
    }
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.undo", can_undo);
  gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.redo", can_redo);

  {
    guint n = self->document != NULL ? trb_document_get_project (self->document)->floors->len : 0;
    guint at = self->document != NULL ? trb_document_get_floor_index (self->document) : 0;

    gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.next-floor", at + 1 < n);
    gtk_widget_action_set_enabled (GTK_WIDGET (self), "win.previous-floor", at > 0);
  }
}

void
trb_window_class_add_actions (GtkWidgetClass *widget_class)
{
  gtk_widget_class_install_action (widget_class, "win.open", NULL, open_action);
  gtk_widget_class_install_action (widget_class, "win.save", NULL, save_action);
  gtk_widget_class_install_action (widget_class, "win.save-as", NULL, save_action);
  gtk_widget_class_install_action (widget_class, "win.print", NULL, print_action);
  gtk_widget_class_install_action (widget_class, "win.export-report", NULL, print_action);
  gtk_widget_class_install_action (widget_class, "win.undo", NULL, undo_action);
  gtk_widget_class_install_action (widget_class, "win.redo", NULL, undo_action);
  gtk_widget_class_install_action (widget_class, "win.close", NULL, close_action);
  gtk_widget_class_install_action (widget_class, "win.zoom-in", NULL, zoom_action);
  gtk_widget_class_install_action (widget_class, "win.zoom-out", NULL, zoom_action);
  gtk_widget_class_install_action (widget_class, "win.zoom-fit", NULL, zoom_action);
  gtk_widget_class_install_action (widget_class, "win.next-floor", NULL, floor_action);
  gtk_widget_class_install_action (widget_class, "win.previous-floor", NULL, floor_action);
  gtk_widget_class_install_property_action (widget_class, "win.tool", "tool");
  gtk_widget_class_install_property_action (widget_class, "win.show-failing", "show-failing");
  gtk_widget_class_install_property_action (widget_class, "win.show-panel", "show-panel");
  gtk_widget_class_install_property_action (widget_class, "win.units", "units");
}
