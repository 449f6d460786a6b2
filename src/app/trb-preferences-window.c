/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "trb-preferences-window.h"
#include "trb-quantity-row.h"

struct _TrbPreferencesWindow
{
  AdwPreferencesWindow  parent_instance;

  GSettings            *settings;

  AdwComboRow          *units_row;
  AdwComboRow          *method_row;
  GtkSpinButton        *live_spin;
  GtkSpinButton        *total_spin;
  TrbQuantityRow       *grid_row;
  GtkSwitch            *snap_grid_switch;
  GtkSwitch            *snap_members_switch;
  AdwComboRow          *style_row;
};

G_DEFINE_FINAL_TYPE (TrbPreferencesWindow, trb_preferences_window, ADW_TYPE_PREFERENCES_WINDOW)

static const char * const unit_nicks[] = { "us", "si", NULL };
static const char * const method_nicks[] = { "asd", "lrfd", "allowable", NULL };
static const char * const style_nicks[] = { "default", "light", "dark", NULL };

/* An enum key and a combo row's position, both ways; user_data is the nicks in row order. */
static gboolean
nick_to_position (GValue   *value,
                  GVariant *variant,
                  gpointer  user_data)
{
  const char * const *nicks = user_data;
  const char *nick = g_variant_get_string (variant, NULL);

  for (guint i = 0; nicks[i] != NULL; i++)
    if (g_str_equal (nicks[i], nick))
      {
        g_value_set_uint (value, i);
        return TRUE;
      }
  return FALSE;
}

static GVariant *
position_to_nick (const GValue       *value,
                  const GVariantType *type,
                  gpointer            user_data)
{
  const char * const *nicks = user_data;
  guint i = g_value_get_uint (value);

  if (i >= g_strv_length ((char **) nicks))
    return NULL;
  return g_variant_new_string (nicks[i]);
}

static gboolean
int_to_double (GValue   *value,
               GVariant *variant,
               gpointer  user_data)
{
  g_value_set_double (value, g_variant_get_int32 (variant));
  return TRUE;
}

static GVariant *
double_to_int (const GValue       *value,
               const GVariantType *type,
               gpointer            user_data)
{
  return g_variant_new_int32 ((gint32) lround (g_value_get_double (value)));
}

static void
bind_combo (GSettings          *settings,
            const char         *key,
            AdwComboRow        *row,
            const char * const *nicks)
{
  g_settings_bind_with_mapping (settings, key, row, "selected", G_SETTINGS_BIND_DEFAULT,
                                nick_to_position, position_to_nick, (gpointer) nicks, NULL);
}

static void
show_grid (TrbPreferencesWindow *self)
{
  trb_quantity_row_set_value (self->grid_row, g_settings_get_double (self->settings,
                                                                     "grid-spacing"),
                              g_settings_get_enum (self->settings, "unit-system"));
}

static void
on_grid_applied (TrbPreferencesWindow *self,
                 double                value)
{
  /* the schema's range: 10 mm to 100 m */
  if (value >= 0.01 && value <= 100)
    g_settings_set_double (self->settings, "grid-spacing", value);
  show_grid (self);
}

GtkWidget *
trb_preferences_window_new (GSettings *settings)
{
  TrbPreferencesWindow *self;

  g_return_val_if_fail (G_IS_SETTINGS (settings), NULL);

  self = g_object_new (TRB_TYPE_PREFERENCES_WINDOW, NULL);
  self->settings = g_object_ref (settings);
  bind_combo (settings, "unit-system", self->units_row, unit_nicks);
  bind_combo (settings, "design-method", self->method_row, method_nicks);
  bind_combo (settings, "style", self->style_row, style_nicks);
  g_settings_bind_with_mapping (settings, "deflection-live", self->live_spin, "value",
                                G_SETTINGS_BIND_DEFAULT, int_to_double, double_to_int, NULL,
                                NULL);
  g_settings_bind_with_mapping (settings, "deflection-total", self->total_spin, "value",
                                G_SETTINGS_BIND_DEFAULT, int_to_double, double_to_int, NULL,
                                NULL);
  g_settings_bind (settings, "snap-to-grid", self->snap_grid_switch, "active",
                   G_SETTINGS_BIND_DEFAULT);
  g_settings_bind (settings, "snap-to-members", self->snap_members_switch, "active",
                   G_SETTINGS_BIND_DEFAULT);
  show_grid (self);
  g_signal_connect_object (settings, "changed::unit-system", G_CALLBACK (show_grid), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_swapped (self->grid_row, "value-applied", G_CALLBACK (on_grid_applied),
                            self);
  return GTK_WIDGET (self);
}

static void
trb_preferences_window_dispose (GObject *object)
{
  TrbPreferencesWindow *self = TRB_PREFERENCES_WINDOW (object);

  gtk_widget_dispose_template (GTK_WIDGET (self), TRB_TYPE_PREFERENCES_WINDOW);
  g_clear_object (&self->settings);

  G_OBJECT_CLASS (trb_preferences_window_parent_class)->dispose (object);
}

static void
trb_preferences_window_class_init (TrbPreferencesWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = trb_preferences_window_dispose;

  g_type_ensure (TRB_TYPE_QUANTITY_ROW);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/trabeate/Trabeate/ui/"
                                               "trb-preferences-window.ui");
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, units_row);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, method_row);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, live_spin);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, total_spin);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, grid_row);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, snap_grid_switch);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow,
                                        snap_members_switch);
  gtk_widget_class_bind_template_child (widget_class, TrbPreferencesWindow, style_row);
}

static void
trb_preferences_window_init (TrbPreferencesWindow *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
}
