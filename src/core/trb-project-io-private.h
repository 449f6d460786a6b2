/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

/* Internal to the project file's reading and writing, not installed and not for callers:
 * what its three parts share. trb-project-io.c reads and checks a file (the parser, the
 * loader's checks and messages with file and line, the RELAX NG validation);
 * trb-project-schema.c proves a parsed document valid in one walk, without libxml2's
 * validation; trb-project-write.c saves (the memo of texts and the exact number formatting).
 * The public API is trb-project-io.h. */

#include <glib.h>
#include <libxml/tree.h>
#include <string.h>

G_BEGIN_DECLS

/* TRUE when @doc certainly matches the schema; FALSE when that is not proved (then libxml2's
 * validation judges it). */
gboolean trb_project_io_priv_schema_proved (xmlDoc *doc);

/* A small helper the loader and the schema walk both call for every attribute: inline in
 * each, as it was in one file. */

/* g_strv_contains(), the first byte compared before the rest */
static inline gboolean
trb_project_io_priv_names_contain (const char * const *names,
                                   const char         *name)
{
  for (; *names != NULL; names++)
    if ((*names)[0] == name[0] && strcmp (*names, name) == 0)
      return TRUE;
  return FALSE;
}

G_END_DECLS
