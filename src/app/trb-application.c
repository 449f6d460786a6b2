/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>

#include "trb-application.h"
#include "trb-autosave.h"
#include "trb-cautions.h"
#include "trb-help.h"
#include "trb-preferences-window.h"
#include "trb-renderer.h"
#include "trb-window.h"

struct _TrbApplication
{
  AdwApplication  parent_instance;

  GSettings      *settings;
  gboolean        recovery_offered;
};

G_DEFINE_FINAL_TYPE (TrbApplication, trb_application, ADW_TYPE_APPLICATION)

TrbApplication *
trb_application_new (const char        *application_id,
                     GApplicationFlags  flags)
{
  return g_object_new (TRB_TYPE_APPLICATION,
                       "application-id", application_id,
                       "flags", flags,
                       "resource-base-path", "/org/trabeate/Trabeate",
                       NULL);
}

/**
 * trb_application_get_settings:
 * @self: the application
 *
 * Returns: (transfer none): the application's settings (org.trabeate.Trabeate).
 */
GSettings *
trb_application_get_settings (TrbApplication *self)
{
  g_return_val_if_fail (TRB_IS_APPLICATION (self), NULL);
  return self->settings;
}

/**
 * trb_application_new_settings:
 * @self: the application
 * @settings: (out caller-allocates): the settings of a new project, from the preferences
 *
 * Free with trb_settings_clear().
 */
void
trb_application_new_settings (TrbApplication *self,
                              TrbSettings    *settings)
{
  g_return_if_fail (TRB_IS_APPLICATION (self));

  trb_settings_init_defaults (settings);
  settings->units = g_settings_get_enum (self->settings, "unit-system");
  settings->method = g_settings_get_enum (self->settings, "design-method");
  settings->deflection_live = g_settings_get_int (self->settings, "deflection-live");
  settings->deflection_total = g_settings_get_int (self->settings, "deflection-total");
}

static TrbWindow *
find_window_for_file (TrbApplication *self,
                      GFile          *file)
{
  for (GList *l = gtk_application_get_windows (GTK_APPLICATION (self)); l; l = l->next)
    {
      TrbDocument *doc;
      GFile *shown;

      if (!TRB_IS_WINDOW (l->data))
        continue;
      doc = trb_window_get_document (l->data);
      shown = doc != NULL ? trb_document_get_file (doc) : NULL;
      if (shown != NULL && g_file_equal (shown, file))
        return l->data;
    }
  return NULL;
}

static TrbWindow *
new_window (TrbApplication *self)
{
  TrbSettings defaults;
  g_autoptr(TrbDocument) document = NULL;
  TrbWindow *window;

  trb_application_new_settings (self, &defaults);
  document = trb_document_new (&defaults);
  trb_settings_clear (&defaults);
  window = trb_window_new (self);
  trb_window_set_document (window, document);
  return window;
}

/**
 * trb_application_open_file:
 * @self: the application
 * @file: a project file
 * @from: (nullable): the window the request came from
 *
 * One window per project: a project already open is brought forward; otherwise it opens in
 * @from when that window holds an untouched new project, else in a new window. When the file
 * cannot be read, the loader's message (with its line) is shown in @from, which keeps what it
 * had.
 */
void
trb_application_open_file (TrbApplication *self,
                           GFile          *file,
                           GtkWindow      *from)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbDocument) document = NULL;
  TrbWindow *window;

  g_return_if_fail (TRB_IS_APPLICATION (self));
  g_return_if_fail (G_IS_FILE (file));

  window = find_window_for_file (self, file);
  if (window != NULL)
    {
      gtk_window_present (GTK_WINDOW (window));
      return;
    }

  document = trb_document_new_for_file (file, &error);
  window = TRB_IS_WINDOW (from) ? TRB_WINDOW (from) : NULL;
  if (document == NULL)
    {
      if (window == NULL)
        window = new_window (self);
      trb_window_show_error (window, error->message);
      gtk_window_present (GTK_WINDOW (window));
      return;
    }

  {
    g_autofree char *uri = g_file_get_uri (file);

    gtk_recent_manager_add_item (gtk_recent_manager_get_default (), uri);
  }
  if (window == NULL
      || (trb_window_get_document (window) != NULL
          && !trb_document_is_untouched (trb_window_get_document (window))))
    window = trb_window_new (self);
  trb_window_set_document (window, document);
  gtk_window_present (GTK_WINDOW (window));
}

void
trb_application_show_about (TrbApplication *self)
{
  static const char *developers[] = { "The Trabeate developers", NULL };
  g_autofree char *comments = NULL;
  GtkWindow *parent;
  GtkWidget *about;

  g_return_if_fail (TRB_IS_APPLICATION (self));

  parent = gtk_application_get_active_window (GTK_APPLICATION (self));
  comments = g_strjoin ("\n\n",
                        _("Lays out floor framing (steel girders, steel or timber beams and "
                          "joists over columns and walls), carries the loads down, and sizes "
                          "and checks every member."),
                        TRB_CAUTION_LICENSED,
                        TRB_CAUTION_NOT_CHECKED,
                        TRB_CAUTION_COLUMNS,
                        TRB_CAUTION_INPUTS,
                        NULL);
  about = g_object_new (ADW_TYPE_ABOUT_WINDOW,
                        "transient-for", parent,
                        "modal", TRUE,
                        "application-name", _("Trabeate"),
                        "application-icon", APP_ID,
                        "version", PACKAGE_VERSION,
                        "developer-name", _("The Trabeate developers"),
                        "developers", developers,
                        "copyright", "© 2026 The Trabeate developers",
                        "license-type", GTK_LICENSE_GPL_3_0,
                        "comments", comments,
                        NULL);
  gtk_window_present (GTK_WINDOW (about));
}

void
trb_application_show_preferences (TrbApplication *self)
{
  GtkWindow *parent;
  GtkWidget *prefs;

  g_return_if_fail (TRB_IS_APPLICATION (self));

  parent = gtk_application_get_active_window (GTK_APPLICATION (self));
  prefs = trb_preferences_window_new (self->settings);
  gtk_window_set_transient_for (GTK_WINDOW (prefs), parent);
  gtk_window_present (GTK_WINDOW (prefs));
}

/* ---- actions --------------------------------------------------------------------------------- */

static void
new_window_action (GSimpleAction *action,
                   GVariant      *param,
                   gpointer       user_data)
{
  gtk_window_present (GTK_WINDOW (new_window (user_data)));
}

static void
open_recent_action (GSimpleAction *action,
                    GVariant      *param,
                    gpointer       user_data)
{
  TrbApplication *self = user_data;
  g_autoptr(GFile) file = g_file_new_for_uri (g_variant_get_string (param, NULL));

  trb_application_open_file (self, file,
                             gtk_application_get_active_window (GTK_APPLICATION (self)));
}

static void
preferences_action (GSimpleAction *action,
                    GVariant      *param,
                    gpointer       user_data)
{
  trb_application_show_preferences (user_data);
}

static void
about_action (GSimpleAction *action,
              GVariant      *param,
              gpointer       user_data)
{
  trb_application_show_about (user_data);
}

static void
help_action (GSimpleAction *action,
             GVariant      *param,
             gpointer       user_data)
{
  TrbApplication *self = user_data;
  GtkWindow *parent = gtk_application_get_active_window (GTK_APPLICATION (self));
  g_autoptr(GError) error = NULL;

  if (!trb_help_show (parent, &error) && TRB_IS_WINDOW (parent))
    trb_window_show_error (TRB_WINDOW (parent), error->message);
}

static void
quit_action (GSimpleAction *action,
             GVariant      *param,
             gpointer       user_data)
{
  TrbApplication *self = user_data;
  g_autoptr(GList) windows = g_list_copy (gtk_application_get_windows (GTK_APPLICATION (self)));

  /* each window asks before it drops unsaved changes */
  for (GList *l = windows; l; l = l->next)
    gtk_window_close (l->data);
}

static const GActionEntry app_actions[] = {
  { "new-window", new_window_action },
  { "open-recent", open_recent_action, "s" },
  { "preferences", preferences_action },
  { "about", about_action },
  { "help", help_action },
  { "quit", quit_action },
};

/* ---- application ----------------------------------------------------------------------------- */

static gboolean
style_get_mapping (GValue   *value,
                   GVariant *variant,
                   gpointer  user_data)
{
  const char *style = g_variant_get_string (variant, NULL);

  if (g_str_equal (style, "light"))
    g_value_set_enum (value, ADW_COLOR_SCHEME_FORCE_LIGHT);
  else if (g_str_equal (style, "dark"))
    g_value_set_enum (value, ADW_COLOR_SCHEME_FORCE_DARK);
  else
    g_value_set_enum (value, ADW_COLOR_SCHEME_DEFAULT);
  return TRUE;
}

static void
trb_application_startup (GApplication *app)
{
  TrbApplication *self = TRB_APPLICATION (app);
  static const struct
  {
    const char *action;
    const char *accels[3];
  } accels[] = {
    { "app.new-window", { "<Control>n", NULL } },
    { "app.preferences", { "<Control>comma", NULL } },
    { "app.quit", { "<Control>q", NULL } },
    { "app.help", { "F1", NULL } },
    { "win.open", { "<Control>o", NULL } },
    { "win.save", { "<Control>s", NULL } },
    { "win.save-as", { "<Control><Shift>s", NULL } },
    { "win.undo", { "<Control>z", NULL } },
    { "win.redo", { "<Control><Shift>z", "<Control>y", NULL } },
    { "win.close", { "<Control>w", NULL } },
    { "win.zoom-in", { "<Control>plus", "<Control>equal", NULL } },
    { "win.zoom-out", { "<Control>minus", NULL } },
    { "win.zoom-fit", { "<Control>0", NULL } },
    { "win.next-floor", { "<Control>Page_Down", NULL } },
    { "win.previous-floor", { "<Control>Page_Up", NULL } },
    { "win.show-failing", { "<Control><Shift>f", NULL } },
    { "win.show-panel", { "F9", NULL } },
    { "win.show-help-overlay", { "<Control>question", NULL } },
  };

  G_APPLICATION_CLASS (trb_application_parent_class)->startup (app);

  /* before any window is realized: software GL gets the cairo renderer (trb-renderer.c) */
  trb_renderer_choose (gdk_display_get_default ());

  self->settings = g_settings_new (APP_ID);
  g_settings_bind_with_mapping (self->settings, "style", adw_style_manager_get_default (),
                                "color-scheme", G_SETTINGS_BIND_GET, style_get_mapping, NULL,
                                NULL, NULL);

  g_action_map_add_action_entries (G_ACTION_MAP (self), app_actions,
                                   G_N_ELEMENTS (app_actions), self);
  for (guint i = 0; i < G_N_ELEMENTS (accels); i++)
    gtk_application_set_accels_for_action (GTK_APPLICATION (self), accels[i].action,
                                           accels[i].accels);
}

/* Once, at the start: copies made later belong to this process's own windows. */
static void
offer_recovery (TrbApplication *self)
{
  GtkWindow *window = gtk_application_get_active_window (GTK_APPLICATION (self));

  if (self->recovery_offered || window == NULL)
    return;
  self->recovery_offered = TRUE;
  trb_autosave_offer (self, window);
}

static void
trb_application_activate (GApplication *app)
{
  GtkWindow *window = gtk_application_get_active_window (GTK_APPLICATION (app));

  if (window == NULL)
    window = GTK_WINDOW (new_window (TRB_APPLICATION (app)));
  gtk_window_present (window);
  offer_recovery (TRB_APPLICATION (app));
}

static void
trb_application_open (GApplication  *app,
                      GFile        **files,
                      int            n_files,
                      const char    *hint)
{
  for (int i = 0; i < n_files; i++)
    trb_application_open_file (TRB_APPLICATION (app), files[i],
                               gtk_application_get_active_window (GTK_APPLICATION (app)));
  offer_recovery (TRB_APPLICATION (app));
}

static void
trb_application_dispose (GObject *object)
{
  TrbApplication *self = TRB_APPLICATION (object);

  g_clear_object (&self->settings);

  G_OBJECT_CLASS (trb_application_parent_class)->dispose (object);
}

static void
trb_application_class_init (TrbApplicationClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GApplicationClass *app_class = G_APPLICATION_CLASS (klass);

  object_class->dispose = trb_application_dispose;
  app_class->startup = trb_application_startup;
  app_class->activate = trb_application_activate;
  app_class->open = trb_application_open;
}

static void
trb_application_init (TrbApplication *self)
{
}
