/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>

#include "trb-error.h"
#include "trb-help.h"

/* where meson installs the help (data/meson.build); a build without it knows no folder */
#ifndef TRB_DOCDIR
#define TRB_DOCDIR NULL
#endif

/**
 * trb_help_dup_folder:
 *
 * Returns: (transfer full) (nullable): the folder of the help pages: $TRABEATE_DOCDIR when
 *   set (the docs/ folder of the source tree, for a build that is not installed), else the
 *   installed one.
 */
char *
trb_help_dup_folder (void)
{
  const char *dir = g_getenv ("TRABEATE_DOCDIR");

  if (dir != NULL && dir[0] != '\0')
    return g_strdup (dir);
  return g_strdup (TRB_DOCDIR);
}

/**
 * trb_help_dup_guide:
 *
 * Returns: (transfer full) (nullable): the user guide's file (user-guide.md), or %NULL when
 *   it is not there.
 */
char *
trb_help_dup_guide (void)
{
  g_autofree char *folder = trb_help_dup_folder ();
  g_autofree char *path = NULL;

  if (folder == NULL)
    return NULL;
  path = g_build_filename (folder, "user-guide.md", NULL);
  if (!g_file_test (path, G_FILE_TEST_IS_REGULAR))
    return NULL;
  return g_steal_pointer (&path);
}

/**
 * trb_help_show:
 * @parent: (nullable): the window the help is asked from
 * @error: return location for a #GError
 *
 * Opens the user guide in the desktop's handler for Markdown (a text editor or viewer); its
 * links to the other pages are relative and hold in the installed folder.
 *
 * Returns: %FALSE, with where the guide was looked for, when it is not installed.
 */
gboolean
trb_help_show (GtkWindow  *parent,
               GError    **error)
{
  g_autofree char *guide = trb_help_dup_guide ();
  g_autofree char *folder = NULL;
  g_autofree char *uri = NULL;

  if (guide == NULL)
    {
      folder = trb_help_dup_folder ();
      g_set_error (error, TRB_ERROR, TRB_ERROR_IO,
                   _("The user guide is not installed (looked for user-guide.md in %s)"),
                   folder != NULL ? folder : "share/doc/trabeate");
      return FALSE;
    }
  uri = g_filename_to_uri (guide, NULL, error);
  if (uri == NULL)
    return FALSE;
  gtk_show_uri (parent, uri, GDK_CURRENT_TIME);
  return TRUE;
}
