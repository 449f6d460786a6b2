/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <locale.h>

#include "trb-application.h"

int
main (int   argc,
      char *argv[])
{
  g_autoptr(TrbApplication) app = NULL;

  setlocale (LC_ALL, "");
  bindtextdomain (GETTEXT_PACKAGE, LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);

#ifdef TRB_BUILD_SCHEMA_DIR
  /* Run from the build directory before installing: use the schema compiled there. */
  {
    GSettingsSchemaSource *source = g_settings_schema_source_get_default ();
    g_autoptr(GSettingsSchema) schema = NULL;

    if (source != NULL)
      schema = g_settings_schema_source_lookup (source, APP_ID, TRUE);
    if (schema == NULL)
      g_setenv ("GSETTINGS_SCHEMA_DIR", TRB_BUILD_SCHEMA_DIR, FALSE);
  }
#endif

  app = trb_application_new (APP_ID, G_APPLICATION_HANDLES_OPEN);
  return g_application_run (G_APPLICATION (app), argc, argv);
}
