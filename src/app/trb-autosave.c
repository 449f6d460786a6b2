/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <errno.h>
#include <glib/gi18n.h>
#include <glib/gstdio.h>
#include <signal.h>
#include <string.h>
#include <unistd.h>

#include "trb-autosave.h"
#include "trb-document.h"
#include "trb-project-io.h"

/* A second without edits before a copy is written: a burst of edits (a drag, typing in a
 * field) costs one write, and a crash loses at most the last second's work. */
#define QUIET_MS 1000
/* And every minute while changes are unsaved, should edits never pause. */
#define PERIOD_S 60

#define SIDECAR_GROUP "Recovery"

struct _TrbAutosave
{
  GObject      parent_instance;

  TrbWindow   *window;          /* not owned: the autosave lives as the window's data */
  TrbDocument *document;
  char        *path;            /* the recovery copy */
  char        *sidecar;         /* what the copy is for */
  gboolean     dirty;           /* edited since the last copy */
  gboolean     warned;          /* a failed write was shown once */
  guint        quiet_id;
  guint        period_id;
};

G_DEFINE_FINAL_TYPE (TrbAutosave, trb_autosave, G_TYPE_OBJECT)

/**
 * trb_autosave_dup_folder:
 *
 * Returns: (transfer full): where recovery copies are kept: trabeate/recovery/ in the user's
 *   state folder (XDG_STATE_HOME).
 */
char *
trb_autosave_dup_folder (void)
{
  return g_build_filename (g_get_user_state_dir (), "trabeate", "recovery", NULL);
}

static void
remove_files (TrbAutosave *self)
{
  /* the sidecar first: a copy without one is never offered, a sidecar without its copy is */
  g_unlink (self->sidecar);
  g_unlink (self->path);
}

/**
 * trb_autosave_discard:
 * @self: an autosave
 *
 * Removes the window's recovery copy, if any: the project was saved or closed as the user
 * chose.
 */
void
trb_autosave_discard (TrbAutosave *self)
{
  g_return_if_fail (TRB_IS_AUTOSAVE (self));

  g_clear_handle_id (&self->quiet_id, g_source_remove);
  self->dirty = FALSE;
  remove_files (self);
}

/**
 * trb_autosave_write_now:
 * @self: an autosave
 * @error: return location for a #GError
 *
 * Writes the recovery copy of the window's project (atomically, as a save is) and its
 * sidecar. A project without unsaved changes has no copy: any old one is removed.
 *
 * Returns: %TRUE on success.
 */
gboolean
trb_autosave_write_now (TrbAutosave  *self,
                        GError      **error)
{
  g_autoptr(GKeyFile) keys = NULL;
  g_autoptr(GDateTime) now = NULL;
  g_autofree char *folder = NULL;
  g_autofree char *data = NULL;
  g_autofree char *saved = NULL;
  GFile *file;
  gsize length;

  g_return_val_if_fail (TRB_IS_AUTOSAVE (self), FALSE);

  g_clear_handle_id (&self->quiet_id, g_source_remove);
  self->dirty = FALSE;
  if (self->document == NULL || !trb_document_get_modified (self->document))
    {
      remove_files (self);
      return TRUE;
    }

  folder = trb_autosave_dup_folder ();
  if (g_mkdir_with_parents (folder, 0700) != 0)
    {
      int saved_errno = errno;

      g_set_error (error, G_FILE_ERROR, g_file_error_from_errno (saved_errno),
                   _("%s: the folder for recovery copies cannot be made: %s"), folder,
                   g_strerror (saved_errno));
      return FALSE;
    }
  if (!trb_project_save_file (trb_document_get_project (self->document), self->path, error))
    return FALSE;

  keys = g_key_file_new ();
  file = trb_document_get_file (self->document);
  if (file != NULL)
    {
      g_autofree char *original = g_file_get_path (file);

      if (original != NULL)
        g_key_file_set_string (keys, SIDECAR_GROUP, "original", original);
    }
  g_key_file_set_int64 (keys, SIDECAR_GROUP, "pid", getpid ());
  now = g_date_time_new_now_utc ();
  saved = g_date_time_format_iso8601 (now);
  g_key_file_set_string (keys, SIDECAR_GROUP, "saved", saved);
  data = g_key_file_to_data (keys, &length, NULL);
  return g_file_set_contents (self->sidecar, data, length, error);
}

static void
write_or_warn (TrbAutosave *self)
{
  g_autoptr(GError) error = NULL;

  if (trb_autosave_write_now (self, &error))
    return;
  g_warning ("%s", error->message);
  /* once per window: a full disk would otherwise say it every second */
  if (!self->warned && self->window != NULL)
    {
      g_autofree char *message = g_strdup_printf (_("No recovery copy: %s"), error->message);

      self->warned = TRUE;
      trb_window_show_toast (self->window, message);
    }
}

static gboolean
on_quiet (gpointer user_data)
{
  TrbAutosave *self = user_data;

  self->quiet_id = 0;
  write_or_warn (self);
  return G_SOURCE_REMOVE;
}

static gboolean
on_period (gpointer user_data)
{
  TrbAutosave *self = user_data;

  if (self->dirty)
    write_or_warn (self);
  return G_SOURCE_CONTINUE;
}

static void
on_document_changed (TrbAutosave *self)
{
  self->dirty = TRUE;
  g_clear_handle_id (&self->quiet_id, g_source_remove);
  self->quiet_id = g_timeout_add (QUIET_MS, on_quiet, self);
}

static void
on_document_modified (TrbAutosave *self)
{
  /* saved, or undone back to what the file holds: nothing to recover */
  if (!trb_document_get_modified (self->document))
    trb_autosave_discard (self);
}

static void
set_document (TrbAutosave *self,
              TrbDocument *document)
{
  if (self->document == document)
    return;
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_set_object (&self->document, document);
  trb_autosave_discard (self);
  if (document == NULL)
    return;
  g_signal_connect_object (document, "changed", G_CALLBACK (on_document_changed), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::modified", G_CALLBACK (on_document_modified),
                           self, G_CONNECT_SWAPPED);
  /* a restored project differs from its file before any edit */
  if (trb_document_get_modified (document))
    on_document_changed (self);
}

static void
on_window_document (TrbAutosave *self)
{
  set_document (self, trb_window_get_document (self->window));
}

/* Runs after the window's own handler, and only when that let the window close: the user
 * saved, or chose to drop the changes. */
static gboolean
on_close_request (TrbAutosave *self)
{
  trb_autosave_discard (self);
  return FALSE;
}

static void
trb_autosave_dispose (GObject *object)
{
  TrbAutosave *self = TRB_AUTOSAVE (object);

  g_clear_handle_id (&self->quiet_id, g_source_remove);
  g_clear_handle_id (&self->period_id, g_source_remove);
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_clear_object (&self->document);

  G_OBJECT_CLASS (trb_autosave_parent_class)->dispose (object);
}

static void
trb_autosave_finalize (GObject *object)
{
  TrbAutosave *self = TRB_AUTOSAVE (object);

  /* the window went away without a crash: its copy is not wanted */
  remove_files (self);
  g_free (self->path);
  g_free (self->sidecar);

  G_OBJECT_CLASS (trb_autosave_parent_class)->finalize (object);
}

static void
trb_autosave_class_init (TrbAutosaveClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->dispose = trb_autosave_dispose;
  object_class->finalize = trb_autosave_finalize;
}

static void
trb_autosave_init (TrbAutosave *self)
{
  g_autofree char *folder = trb_autosave_dup_folder ();
  g_autofree char *id = g_uuid_string_random ();
  g_autofree char *name = g_strconcat (id, ".trabeate", NULL);
  g_autofree char *side = g_strconcat (id, ".recovery", NULL);

  self->path = g_build_filename (folder, name, NULL);
  self->sidecar = g_build_filename (folder, side, NULL);
  self->period_id = g_timeout_add_seconds (PERIOD_S, on_period, self);
}

/**
 * trb_autosave_attach:
 * @window: a window
 *
 * Gives @window its recovery copy, which follows the window's project from now on.
 *
 * Returns: (transfer none): the window's autosave.
 */
TrbAutosave *
trb_autosave_attach (TrbWindow *window)
{
  TrbAutosave *self;

  g_return_val_if_fail (TRB_IS_WINDOW (window), NULL);

  self = trb_autosave_get_for_window (window);
  if (self != NULL)
    return self;
  self = g_object_new (TRB_TYPE_AUTOSAVE, NULL);
  self->window = window;
  g_object_set_data_full (G_OBJECT (window), "trb-autosave", self, g_object_unref);
  g_signal_connect_object (window, "notify::document", G_CALLBACK (on_window_document), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (window, "close-request", G_CALLBACK (on_close_request), self,
                           G_CONNECT_SWAPPED | G_CONNECT_AFTER);
  set_document (self, trb_window_get_document (window));
  return self;
}

/**
 * trb_autosave_get_for_window:
 * @window: a window
 *
 * Returns: (transfer none) (nullable): the window's autosave.
 */
TrbAutosave *
trb_autosave_get_for_window (TrbWindow *window)
{
  g_return_val_if_fail (TRB_IS_WINDOW (window), NULL);
  return g_object_get_data (G_OBJECT (window), "trb-autosave");
}

/**
 * trb_autosave_get_path:
 * @self: an autosave
 *
 * Returns: where the window's recovery copy is written.
 */
const char *
trb_autosave_get_path (TrbAutosave *self)
{
  g_return_val_if_fail (TRB_IS_AUTOSAVE (self), NULL);
  return self->path;
}

/* ---- after a crash --------------------------------------------------------------------------- */

typedef struct
{
  char *copy;
  char *sidecar;
  char *original;               /* NULL for a project never saved */
} Orphan;

static void
orphan_free (gpointer data)
{
  Orphan *orphan = data;

  g_free (orphan->copy);
  g_free (orphan->sidecar);
  g_free (orphan->original);
  g_free (orphan);
}

static gboolean
process_alive (GPid pid)
{
  return pid == getpid () || kill (pid, 0) == 0 || errno == EPERM;
}

/* The copies whose writer is no longer running: its windows did not close as they should. */
static GPtrArray *
find_orphans (void)
{
  g_autofree char *folder = trb_autosave_dup_folder ();
  g_autoptr(GDir) dir = g_dir_open (folder, 0, NULL);
  GPtrArray *orphans = g_ptr_array_new_with_free_func (orphan_free);
  const char *name;

  if (dir == NULL)
    return orphans;
  while ((name = g_dir_read_name (dir)) != NULL)
    {
      g_autoptr(GKeyFile) keys = g_key_file_new ();
      g_autofree char *sidecar = NULL;
      g_autofree char *stem = NULL;
      g_autofree char *copy = NULL;
      Orphan *orphan;
      gint64 pid;

      if (!g_str_has_suffix (name, ".recovery"))
        continue;
      sidecar = g_build_filename (folder, name, NULL);
      stem = g_strndup (name, strlen (name) - strlen (".recovery"));
      copy = g_strconcat (folder, G_DIR_SEPARATOR_S, stem, ".trabeate", NULL);
      if (!g_key_file_load_from_file (keys, sidecar, G_KEY_FILE_NONE, NULL)
          || !g_file_test (copy, G_FILE_TEST_IS_REGULAR))
        continue;
      pid = g_key_file_get_int64 (keys, SIDECAR_GROUP, "pid", NULL);
      if (pid > 0 && process_alive ((GPid) pid))
        continue;
      orphan = g_new0 (Orphan, 1);
      orphan->copy = g_steal_pointer (&copy);
      orphan->sidecar = g_steal_pointer (&sidecar);
      orphan->original = g_key_file_get_string (keys, SIDECAR_GROUP, "original", NULL);
      g_ptr_array_add (orphans, orphan);
    }
  return orphans;
}

/**
 * trb_autosave_count_orphans:
 *
 * Returns: how many recovery copies a process no longer running left behind.
 */
guint
trb_autosave_count_orphans (void)
{
  g_autoptr(GPtrArray) orphans = find_orphans ();

  return orphans->len;
}

/**
 * trb_autosave_discard_all:
 *
 * Removes the recovery copies a process no longer running left behind.
 */
void
trb_autosave_discard_all (void)
{
  g_autoptr(GPtrArray) orphans = find_orphans ();

  for (guint i = 0; i < orphans->len; i++)
    {
      Orphan *orphan = g_ptr_array_index (orphans, i);

      g_unlink (orphan->sidecar);
      g_unlink (orphan->copy);
    }
}

/**
 * trb_autosave_restore_all:
 * @application: the application
 * @into: (nullable): a window whose untouched new project the first restored one may replace
 *
 * Opens every recovery copy a dead process left, each in a window of its own, as the project
 * it was (its file, its unsaved changes); a copy that cannot be read stays on disk and is
 * named in a banner.
 *
 * Returns: how many projects were restored.
 */
guint
trb_autosave_restore_all (TrbApplication *application,
                          GtkWindow      *into)
{
  g_autoptr(GPtrArray) orphans = find_orphans ();
  guint restored = 0;

  g_return_val_if_fail (TRB_IS_APPLICATION (application), 0);

  for (guint i = 0; i < orphans->len; i++)
    {
      Orphan *orphan = g_ptr_array_index (orphans, i);
      g_autoptr(GFile) copy = g_file_new_for_path (orphan->copy);
      g_autoptr(GFile) original = NULL;
      g_autoptr(TrbDocument) document = NULL;
      g_autoptr(GError) error = NULL;
      TrbWindow *window = NULL;
      TrbAutosave *autosave;

      if (orphan->original != NULL)
        original = g_file_new_for_path (orphan->original);
      document = trb_document_new_for_recovery (copy, original, &error);
      if (document == NULL)
        {
          if (TRB_IS_WINDOW (into))
            trb_window_show_error (TRB_WINDOW (into), error->message);
          continue;
        }
      if (TRB_IS_WINDOW (into) && trb_window_get_document (TRB_WINDOW (into)) != NULL
          && trb_document_is_untouched (trb_window_get_document (TRB_WINDOW (into))))
        window = TRB_WINDOW (into);
      else
        window = trb_window_new (application);
      trb_window_set_document (window, document);
      gtk_window_present (GTK_WINDOW (window));

      /* the restored project has its own copy before the old one goes */
      autosave = trb_autosave_attach (window);
      if (!trb_autosave_write_now (autosave, &error))
        {
          trb_window_show_error (window, error->message);
          continue;
        }
      g_unlink (orphan->sidecar);
      g_unlink (orphan->copy);
      restored++;
    }
  return restored;
}

static void
on_offer_response (AdwMessageDialog *dialog,
                   const char       *response,
                   TrbApplication   *application)
{
  GtkWindow *parent = gtk_window_get_transient_for (GTK_WINDOW (dialog));

  if (g_str_equal (response, "restore"))
    trb_autosave_restore_all (application, parent);
  else if (g_str_equal (response, "discard"))
    trb_autosave_discard_all ();
  /* closed otherwise: the copies wait for the next start */
}

/**
 * trb_autosave_offer:
 * @application: the application
 * @parent: the window to ask over
 *
 * When a process no longer running left recovery copies, asks whether to restore or discard
 * them.
 *
 * Returns: (transfer none) (nullable): the question (an #AdwMessageDialog with the responses
 *   "restore" and "discard"), or %NULL when there is nothing to recover.
 */
GtkWindow *
trb_autosave_offer (TrbApplication *application,
                    GtkWindow      *parent)
{
  guint n = trb_autosave_count_orphans ();
  AdwMessageDialog *dialog;

  g_return_val_if_fail (TRB_IS_APPLICATION (application), NULL);

  if (n == 0)
    return NULL;
  dialog = ADW_MESSAGE_DIALOG (adw_message_dialog_new (parent, _("Restore Unsaved Changes?"),
                                                       NULL));
  adw_message_dialog_format_body (dialog,
                                  ngettext ("Trabeate stopped before the changes to %u project "
                                            "were saved. A recovery copy holds them as they "
                                            "were a second after the last edit.",
                                            "Trabeate stopped before the changes to %u projects "
                                            "were saved. Recovery copies hold them as they "
                                            "were a second after the last edit.", n), n);
  adw_message_dialog_add_responses (dialog,
                                    "discard", _("_Discard"),
                                    "restore", _("_Restore"),
                                    NULL);
  adw_message_dialog_set_response_appearance (dialog, "discard", ADW_RESPONSE_DESTRUCTIVE);
  adw_message_dialog_set_response_appearance (dialog, "restore", ADW_RESPONSE_SUGGESTED);
  adw_message_dialog_set_default_response (dialog, "restore");
  g_signal_connect_object (dialog, "response", G_CALLBACK (on_offer_response), application, 0);
  gtk_window_present (GTK_WINDOW (dialog));
  return GTK_WINDOW (dialog);
}
