/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <stdlib.h>

#include "trb-error.h"
#include "trb-quantity-row.h"

struct _TrbQuantityRow
{
  AdwEntryRow   parent_instance;

  char         *title;        /* the title while the row shows an error in its place */
  TrbDimension  dimension;
  gboolean      span_ratio;   /* "L/360" rather than a quantity */
  gboolean      optional;     /* empty text means "not given" (NAN) */
  gboolean      setting;      /* the text is being set from the model */
  char         *error;
};

G_DEFINE_FINAL_TYPE (TrbQuantityRow, trb_quantity_row, ADW_TYPE_ENTRY_ROW)

enum {
  PROP_0,
  PROP_DIMENSION,
  PROP_OPTIONAL,
  PROP_SPAN_RATIO,
  N_PROPS
};

enum {
  VALUE_APPLIED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static gboolean
parse_span_ratio (const char  *text,
                  double      *value,
                  GError     **error)
{
  g_autofree char *t = g_strstrip (g_ascii_strdown (text, -1));
  const char *n = t;
  char *end = NULL;
  double v;

  if (g_str_equal (t, "none"))
    {
      *value = 0;
      return TRUE;
    }
  if (g_str_has_prefix (t, "l/"))
    n = t + 2;
  v = g_ascii_strtod (n, &end);
  if (end == n || *end != '\0' || !isfinite (v) || v <= 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   _("“%s” is not a limit: write it as L/360, 360 or none"), text);
      return FALSE;
    }
  *value = v;
  return TRUE;
}

/**
 * trb_quantity_row_parse:
 * @self: a row
 * @value: (out): the value, SI; NAN for an empty optional row
 * @error: return location for a #GError
 *
 * Returns: whether the row's text is good.
 */
gboolean
trb_quantity_row_parse (TrbQuantityRow  *self,
                        double          *value,
                        GError         **error)
{
  g_autofree char *text = NULL;

  g_return_val_if_fail (TRB_IS_QUANTITY_ROW (self), FALSE);

  text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self))));
  if (text[0] == '\0' && self->optional)
    {
      *value = NAN;
      return TRUE;
    }
  if (self->span_ratio)
    return parse_span_ratio (text, value, error);
  return trb_units_parse (text, self->dimension, value, error);
}

const char *
trb_quantity_row_get_error (TrbQuantityRow *self)
{
  g_return_val_if_fail (TRB_IS_QUANTITY_ROW (self), NULL);
  return self->error;
}

/**
 * trb_quantity_row_show_error:
 * @self: a row
 * @message: (nullable): what is wrong, shown in place of the title; %NULL to clear it
 */
void
trb_quantity_row_show_error (TrbQuantityRow *self,
                             const char     *message)
{
  if (message != NULL)
    {
      if (self->error == NULL)
        {
          g_free (self->title);
          self->title = g_strdup (adw_preferences_row_get_title (ADW_PREFERENCES_ROW (self)));
        }
      gtk_widget_add_css_class (GTK_WIDGET (self), "error");
      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (self), message);
    }
  else if (self->error != NULL)
    {
      gtk_widget_remove_css_class (GTK_WIDGET (self), "error");
      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (self), self->title);
    }
  g_free (self->error);
  self->error = g_strdup (message);
}

static void
on_changed (TrbQuantityRow *self)
{
  g_autoptr(GError) error = NULL;
  double value;

  if (self->setting)
    return;
  /* say at once what is wrong; the model only hears of good text, on apply */
  trb_quantity_row_parse (self, &value, &error);
  trb_quantity_row_show_error (self, error != NULL ? error->message : NULL);
}

static void
on_apply (TrbQuantityRow *self)
{
  g_autoptr(GError) error = NULL;
  double value;

  if (!trb_quantity_row_parse (self, &value, &error))
    {
      trb_quantity_row_show_error (self, error->message);
      return;
    }
  trb_quantity_row_show_error (self, NULL);
  g_signal_emit (self, signals[VALUE_APPLIED], 0, value);
}

/**
 * trb_quantity_row_set_value:
 * @self: a row
 * @value: SI; NAN for "not given"; for a span ratio, n (0: none)
 * @units: the display system
 */
void
trb_quantity_row_set_value (TrbQuantityRow *self,
                            double          value,
                            TrbUnitSystem   units)
{
  g_autofree char *text = NULL;

  g_return_if_fail (TRB_IS_QUANTITY_ROW (self));

  if (isnan (value))
    text = g_strdup ("");
  else if (self->span_ratio)
    text = value == 0 ? g_strdup ("none") : g_strdup_printf ("L/%g", value);
  else
    text = trb_units_format (value, self->dimension, units);

  self->setting = TRUE;
  gtk_editable_set_text (GTK_EDITABLE (self), text);
  self->setting = FALSE;
  trb_quantity_row_show_error (self, NULL);
}

static void
trb_quantity_row_finalize (GObject *object)
{
  TrbQuantityRow *self = TRB_QUANTITY_ROW (object);

  g_free (self->title);
  g_free (self->error);

  G_OBJECT_CLASS (trb_quantity_row_parent_class)->finalize (object);
}

static void
trb_quantity_row_get_property (GObject    *object,
                               guint       prop_id,
                               GValue     *value,
                               GParamSpec *pspec)
{
  TrbQuantityRow *self = TRB_QUANTITY_ROW (object);

  switch (prop_id)
    {
    case PROP_DIMENSION:
      g_value_set_int (value, self->dimension);
      break;
    case PROP_OPTIONAL:
      g_value_set_boolean (value, self->optional);
      break;
    case PROP_SPAN_RATIO:
      g_value_set_boolean (value, self->span_ratio);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_quantity_row_set_property (GObject      *object,
                               guint         prop_id,
                               const GValue *value,
                               GParamSpec   *pspec)
{
  TrbQuantityRow *self = TRB_QUANTITY_ROW (object);

  switch (prop_id)
    {
    case PROP_DIMENSION:
      self->dimension = g_value_get_int (value);
      break;
    case PROP_OPTIONAL:
      self->optional = g_value_get_boolean (value);
      break;
    case PROP_SPAN_RATIO:
      self->span_ratio = g_value_get_boolean (value);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_quantity_row_class_init (TrbQuantityRowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = trb_quantity_row_finalize;
  object_class->get_property = trb_quantity_row_get_property;
  object_class->set_property = trb_quantity_row_set_property;

  /* a TrbDimension */
  properties[PROP_DIMENSION] =
    g_param_spec_int ("dimension", NULL, NULL, 0, TRB_N_DIMS - 1, TRB_DIM_LENGTH,
                      G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  properties[PROP_OPTIONAL] =
    g_param_spec_boolean ("optional", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  properties[PROP_SPAN_RATIO] =
    g_param_spec_boolean ("span-ratio", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_CONSTRUCT_ONLY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /**
   * TrbQuantityRow::value-applied:
   * @value: the value the engineer applied, SI (NAN: cleared)
   */
  signals[VALUE_APPLIED] =
    g_signal_new ("value-applied", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                  NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_DOUBLE);
}

static void
trb_quantity_row_init (TrbQuantityRow *self)
{
  adw_entry_row_set_show_apply_button (ADW_ENTRY_ROW (self), TRUE);
  g_signal_connect (self, "changed", G_CALLBACK (on_changed), NULL);
  g_signal_connect (self, "apply", G_CALLBACK (on_apply), NULL);
}

GtkWidget *
trb_quantity_row_new (const char   *title,
                      TrbDimension  dimension,
                      gboolean      optional)
{
  return g_object_new (TRB_TYPE_QUANTITY_ROW,
                       "title", title,
                       "dimension", dimension,
                       "optional", optional,
                       NULL);
}

GtkWidget *
trb_quantity_row_new_span_ratio (const char *title)
{
  return g_object_new (TRB_TYPE_QUANTITY_ROW,
                       "title", title,
                       "optional", TRUE,
                       "span-ratio", TRUE,
                       NULL);
}
