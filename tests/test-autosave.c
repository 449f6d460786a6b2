/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gstdio.h>
#include <gtk/gtk.h>
#include <signal.h>
#include <string.h>

#include "trb-application.h"
#include "trb-autosave.h"
#include "trb-document.h"
#include "trb-project-io.h"
#include "trb-window.h"

/* Recovery after a crash, as it happens: this program runs itself as the editor (--child),
 * edits the demo floor through the document and the window's actions, waits for the recovery
 * copy, and is killed with SIGKILL, so that nothing of a clean exit runs. The test then starts
 * the editor again on the same state folder, answers the recovery question with "restore",
 * and compares the restored project, saved, with the bytes the killed editor would have saved.
 * Runs under a virtual X server, like test-app. */

static char *state_dir;          /* XDG_STATE_HOME of the child and of the test */
static char *self_path;          /* this program, run again as the editor that crashes */

static void
remove_tree (const char *path)
{
  if (g_file_test (path, G_FILE_TEST_IS_DIR) && !g_file_test (path, G_FILE_TEST_IS_SYMLINK))
    {
      g_autoptr(GDir) dir = g_dir_open (path, 0, NULL);
      const char *name;

      while (dir != NULL && (name = g_dir_read_name (dir)) != NULL)
        {
          g_autofree char *child = g_build_filename (path, name, NULL);

          remove_tree (child);
        }
      g_rmdir (path);
    }
  else
    g_unlink (path);
}

static char *
demo_path (void)
{
  return g_test_build_filename (G_TEST_DIST, "..", "data", "examples", "demo-floor.trabeate",
                                NULL);
}

static void
iterate_for (guint ms)
{
  gint64 until = g_get_monotonic_time () + ms * 1000;

  while (g_get_monotonic_time () < until)
    g_main_context_iteration (NULL, FALSE);
}

static gboolean
wait_solved (TrbDocument *document)
{
  gint64 until = g_get_monotonic_time () + 60 * G_USEC_PER_SEC;

  while (trb_document_get_solving (document) && g_get_monotonic_time () < until)
    g_main_context_iteration (NULL, TRUE);
  return !trb_document_get_solving (document);
}

static char *
save_bytes (TrbDocument *document,
            gsize       *length)
{
  g_autoptr(GError) error = NULL;
  char *data = trb_project_save_data (trb_document_get_project (document), length, &error);

  g_assert_no_error (error);
  return data;
}

/* Waits, running the main loop, until @path holds exactly @data. */
static gboolean
wait_for_contents (const char *path,
                   const char *data,
                   gsize       length,
                   guint       seconds)
{
  gint64 until = g_get_monotonic_time () + seconds * G_USEC_PER_SEC;

  while (g_get_monotonic_time () < until)
    {
      g_autofree char *got = NULL;
      gsize got_length;

      if (g_file_get_contents (path, &got, &got_length, NULL)
          && got_length == length && memcmp (got, data, length) == 0)
        return TRUE;
      iterate_for (50);
    }
  return FALSE;
}

static guint
count_files (const char *folder)
{
  g_autoptr(GDir) dir = g_dir_open (folder, 0, NULL);
  guint n = 0;

  if (dir == NULL)
    return 0;
  while (g_dir_read_name (dir) != NULL)
    n++;
  return n;
}

/* ---- the editor that crashes ---------------------------------------------------------------- */

static int
run_child (const char *project_path,
           const char *expected_path)
{
  g_autoptr(TrbApplication) app = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GFile) file = g_file_new_for_path (project_path);
  g_autofree char *data = NULL;
  TrbDocument *document;
  TrbProject *project;
  TrbWindow *window;
  TrbMember *member;
  gsize length;

  app = trb_application_new ("org.trabeate.Trabeate.Test", G_APPLICATION_NON_UNIQUE);
  if (!g_application_register (G_APPLICATION (app), NULL, &error))
    g_error ("%s", error->message);
  window = trb_window_new (app);
  trb_application_open_file (app, file, GTK_WINDOW (window));
  gtk_window_present (GTK_WINDOW (window));
  document = trb_window_get_document (window);
  if (document == NULL || !wait_solved (document))
    g_error ("the demo floor did not open and solve");
  project = trb_document_get_project (document);

  /* a renamed member, a removed one brought back by Undo, another removed for good */
  member = g_ptr_array_index (project->members, 0);
  if (!trb_document_push (document, trb_edit_set_member_text (project, member,
                                                              TRB_MEMBER_FIELD_ID, "G99",
                                                              &error)))
    g_error ("rename: %s", error->message);
  member = g_ptr_array_index (project->members, project->members->len - 1);
  if (!trb_document_push (document, trb_edit_remove_member (project, member, &error)))
    g_error ("remove: %s", error->message);
  gtk_widget_activate_action (GTK_WIDGET (window), "win.undo", NULL);
  member = g_ptr_array_index (project->members, project->members->len - 2);
  if (!trb_document_push (document, trb_edit_remove_member (project, member, &error)))
    g_error ("remove: %s", error->message);
  wait_solved (document);

  data = save_bytes (document, &length);
  if (!wait_for_contents (trb_autosave_get_path (trb_autosave_get_for_window (window)), data,
                          length, 20))
    g_error ("no recovery copy of the edits");
  if (!g_file_set_contents (expected_path, data, length, &error))
    g_error ("%s", error->message);
  g_print ("ready\n");
  fflush (stdout);
  for (;;)
    g_main_context_iteration (NULL, TRUE);
  return 0;
}

/* ---- the tests -------------------------------------------------------------------------------- */

static void
test_crash_restore (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(GSubprocess) child = NULL;
  g_autoptr(GDataInputStream) out = NULL;
  g_autoptr(TrbApplication) app = NULL;
  g_autoptr(TrbDocument) blank = NULL;
  g_autoptr(GFile) project_file = NULL;
  g_autoptr(GFile) saved_file = NULL;
  g_autofree char *demo = demo_path ();
  g_autofree char *work = g_build_filename (state_dir, "work", NULL);
  g_autofree char *project_path = g_build_filename (work, "demo-floor.trabeate", NULL);
  g_autofree char *expected_path = g_build_filename (state_dir, "expected.trabeate", NULL);
  g_autofree char *saved_path = g_build_filename (state_dir, "restored.trabeate", NULL);
  g_autofree char *folder = trb_autosave_dup_folder ();
  g_autofree char *demo_data = NULL;
  g_autofree char *line = NULL;
  g_autofree char *expected = NULL;
  g_autofree char *restored = NULL;
  g_autofree char *saved = NULL;
  gsize demo_length, expected_length, restored_length, saved_length;
  TrbDocument *document;
  TrbWindow *window;
  GtkWindow *dialog;

  g_assert_cmpint (g_mkdir_with_parents (work, 0700), ==, 0);
  g_file_get_contents (demo, &demo_data, &demo_length, &error);
  g_assert_no_error (error);
  g_file_set_contents (project_path, demo_data, demo_length, &error);
  g_assert_no_error (error);

  child = g_subprocess_new (G_SUBPROCESS_FLAGS_STDOUT_PIPE, &error,
                            self_path, "--child", project_path, expected_path, NULL);
  g_assert_no_error (error);
  out = g_data_input_stream_new (g_subprocess_get_stdout_pipe (child));
  line = g_data_input_stream_read_line_utf8 (out, NULL, NULL, &error);
  g_assert_no_error (error);
  g_assert_cmpstr (line, ==, "ready");
  /* the crash: no close, no dispose, no atexit */
  g_subprocess_send_signal (child, SIGKILL);
  g_subprocess_wait (child, NULL, &error);
  g_assert_no_error (error);
  g_assert_true (g_subprocess_get_if_signaled (child));
  g_assert_cmpint (g_subprocess_get_term_sig (child), ==, SIGKILL);

  /* the copy and its sidecar survived it */
  g_assert_cmpuint (count_files (folder), ==, 2);
  g_assert_cmpuint (trb_autosave_count_orphans (), ==, 1);

  /* the next start: a window with a new project, and the question over it */
  app = trb_application_new ("org.trabeate.Trabeate.Test", G_APPLICATION_NON_UNIQUE);
  g_application_register (G_APPLICATION (app), NULL, &error);
  g_assert_no_error (error);
  window = trb_window_new (app);
  blank = trb_document_new (NULL);
  trb_window_set_document (window, blank);
  gtk_window_present (GTK_WINDOW (window));
  dialog = trb_autosave_offer (app, GTK_WINDOW (window));
  g_assert_true (ADW_IS_MESSAGE_DIALOG (dialog));
  g_assert_true (adw_message_dialog_has_response (ADW_MESSAGE_DIALOG (dialog), "restore"));
  g_assert_true (adw_message_dialog_has_response (ADW_MESSAGE_DIALOG (dialog), "discard"));
  adw_message_dialog_response (ADW_MESSAGE_DIALOG (dialog), "restore");

  /* restored into the untouched window, as the project it was: its file, unsaved */
  document = trb_window_get_document (window);
  g_assert_true (document != blank);
  project_file = g_file_new_for_path (project_path);
  g_assert_nonnull (trb_document_get_file (document));
  g_assert_true (g_file_equal (trb_document_get_file (document), project_file));
  g_assert_true (trb_document_get_modified (document));
  g_assert_true (wait_solved (document));

  /* the same model: saved, the same bytes as the editor that was killed */
  g_file_get_contents (expected_path, &expected, &expected_length, &error);
  g_assert_no_error (error);
  restored = save_bytes (document, &restored_length);
  g_assert_cmpmem (restored, restored_length, expected, expected_length);
  saved_file = g_file_new_for_path (saved_path);
  trb_document_save (document, saved_file, &error);
  g_assert_no_error (error);
  g_file_get_contents (saved_path, &saved, &saved_length, &error);
  g_assert_no_error (error);
  g_assert_cmpmem (saved, saved_length, expected, expected_length);

  /* the old copy is gone; saved, the restored project needs none of its own either */
  g_assert_cmpuint (trb_autosave_count_orphans (), ==, 0);
  g_assert_false (trb_document_get_modified (document));
  g_assert_cmpuint (count_files (folder), ==, 0);

  gtk_window_destroy (GTK_WINDOW (window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
}

/* In one process: a copy a quiet second after an edit, gone once saved, back after the next
 * edit, gone when the window closes; nothing offered for a live process's copy. */
static void
test_lifecycle (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbApplication) app = NULL;
  g_autoptr(GKeyFile) keys = g_key_file_new ();
  g_autoptr(GFile) file = NULL;
  g_autofree char *demo = demo_path ();
  g_autofree char *work = g_build_filename (state_dir, "work2", NULL);
  g_autofree char *project_path = g_build_filename (work, "demo-floor.trabeate", NULL);
  g_autofree char *folder = trb_autosave_dup_folder ();
  g_autofree char *demo_data = NULL;
  g_autofree char *data = NULL;
  g_autofree char *sidecar = NULL;
  g_autofree char *original = NULL;
  gsize demo_length, length;
  TrbAutosave *autosave;
  TrbDocument *document;
  TrbProject *project;
  TrbWindow *window;
  const char *path;

  g_assert_cmpint (g_mkdir_with_parents (work, 0700), ==, 0);
  g_file_get_contents (demo, &demo_data, &demo_length, &error);
  g_assert_no_error (error);
  g_file_set_contents (project_path, demo_data, demo_length, &error);
  g_assert_no_error (error);
  file = g_file_new_for_path (project_path);

  app = trb_application_new ("org.trabeate.Trabeate.Test", G_APPLICATION_NON_UNIQUE);
  g_application_register (G_APPLICATION (app), NULL, &error);
  g_assert_no_error (error);
  window = trb_window_new (app);
  trb_application_open_file (app, file, GTK_WINDOW (window));
  gtk_window_present (GTK_WINDOW (window));
  document = trb_window_get_document (window);
  g_assert_true (wait_solved (document));
  autosave = trb_autosave_get_for_window (window);
  g_assert_nonnull (autosave);
  path = trb_autosave_get_path (autosave);
  g_assert_true (g_str_has_prefix (path, folder));
  g_assert_false (g_file_test (path, G_FILE_TEST_EXISTS));

  project = trb_document_get_project (document);
  g_assert_true (trb_document_push (document,
                                    trb_edit_set_member_text (project,
                                                              g_ptr_array_index (project->members,
                                                                                 0),
                                                              TRB_MEMBER_FIELD_ID, "G98",
                                                              &error)));
  g_assert_no_error (error);
  data = save_bytes (document, &length);
  g_assert_true (wait_for_contents (path, data, length, 10));
  /* the sidecar names the project's own file; a live process's copy is not offered */
  sidecar = g_strdup_printf ("%.*s.recovery", (int) (strlen (path) - strlen (".trabeate")),
                             path);
  g_key_file_load_from_file (keys, sidecar, G_KEY_FILE_NONE, &error);
  g_assert_no_error (error);
  original = g_key_file_get_string (keys, "Recovery", "original", &error);
  g_assert_no_error (error);
  g_assert_cmpstr (original, ==, project_path);
  g_assert_cmpuint (trb_autosave_count_orphans (), ==, 0);
  g_assert_null (trb_autosave_offer (app, GTK_WINDOW (window)));

  /* saved: no copy */
  gtk_widget_activate_action (GTK_WIDGET (window), "win.save", NULL);
  g_assert_false (trb_document_get_modified (document));
  g_assert_cmpuint (count_files (folder), ==, 0);

  /* edited again, then undone back to the file: the copy comes and goes */
  g_clear_pointer (&data, g_free);
  g_assert_true (trb_document_push (document,
                                    trb_edit_set_member_text (project,
                                                              g_ptr_array_index (project->members,
                                                                                 0),
                                                              TRB_MEMBER_FIELD_ID, "G97",
                                                              &error)));
  data = save_bytes (document, &length);
  g_assert_true (wait_for_contents (path, data, length, 10));
  gtk_widget_activate_action (GTK_WIDGET (window), "win.undo", NULL);
  g_assert_false (trb_document_get_modified (document));
  g_assert_cmpuint (count_files (folder), ==, 0);

  /* edited and closed as the user chose (Close on a saved project) */
  gtk_widget_activate_action (GTK_WIDGET (window), "win.redo", NULL);
  g_clear_pointer (&data, g_free);
  data = save_bytes (document, &length);
  g_assert_true (wait_for_contents (path, data, length, 10));
  gtk_widget_activate_action (GTK_WIDGET (window), "win.save", NULL);
  gtk_window_close (GTK_WINDOW (window));
  while (g_main_context_iteration (NULL, FALSE))
    ;
  g_assert_cmpuint (count_files (folder), ==, 0);
}

int
main (int   argc,
      char *argv[])
{
  int status;

  /* before anything asks GLib for the state folder, which it reads once */
  if (argc == 4 && g_str_equal (argv[1], "--child"))
    {
      gtk_init ();
      return run_child (argv[2], argv[3]);
    }
  state_dir = g_dir_make_tmp ("trabeate-autosave-XXXXXX", NULL);
  g_assert_nonnull (state_dir);
  g_setenv ("XDG_STATE_HOME", state_dir, TRUE);
  self_path = g_canonicalize_filename (argv[0], NULL);

  gtk_test_init (&argc, &argv, NULL);
  g_test_add_func ("/trb/autosave/crash-restore", test_crash_restore);
  g_test_add_func ("/trb/autosave/lifecycle", test_lifecycle);
  status = g_test_run ();

  remove_tree (state_dir);
  g_free (state_dir);
  g_free (self_path);
  return status;
}
