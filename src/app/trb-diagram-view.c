/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>

#include "trb-combos.h"
#include "trb-diagram-view.h"
#include "trb-render-diagram.h"
#include "trb-units.h"

struct _TrbDiagramView
{
  AdwBin            parent_instance;

  TrbDocument      *document;
  TrbMember        *member;
  GArray           *sources;       /* TrbDiagramSource, in the dropdown's order */
  TrbDiagramSource  source;
  gboolean          setting;

  GtkStack         *stack;
  GtkDropDown      *source_dropdown;
  GtkDrawingArea   *area;
  GtkLabel         *readout_label;
};

G_DEFINE_FINAL_TYPE (TrbDiagramView, trb_diagram_view, ADW_TYPE_BIN)

GtkWidget *
trb_diagram_view_new (void)
{
  return g_object_new (TRB_TYPE_DIAGRAM_VIEW, NULL);
}

static const TrbMemberResult *
current_result (TrbDiagramView *self)
{
  if (self->document == NULL || self->member == NULL)
    return NULL;
  return trb_document_lookup_result (self->document, self->member);
}

static void
draw (GtkDrawingArea *area,
      cairo_t        *cr,
      int             width,
      int             height,
      gpointer        user_data)
{
  TrbDiagramView *self = user_data;
  const TrbMemberResult *r = current_result (self);
  TrbRenderStyle style;

  if (r == NULL)
    return;
  trb_render_style_init (&style);
  style.dark = adw_style_manager_get_dark (adw_style_manager_get_default ());
  style.font_size = 11;
  trb_diagram_draw_stack (cr, r, &self->source, &style, 0, 0, width, height);
}

static void
update_readout (TrbDiagramView *self,
                double          device_x)
{
  const TrbMemberResult *r = current_result (self);
  const TrbBeamResult *br = NULL;
  TrbUnitSystem units;
  g_autofree char *x_text = NULL;
  double x;

  if (r == NULL || !r->analysed || device_x < 0)
    {
      gtk_label_set_text (self->readout_label,
                          r != NULL && r->analysed
                          ? _("Point at a diagram to read its values") : "");
      return;
    }
  units = trb_document_get_project (self->document)->settings.units;
  x = trb_diagram_position_at (r, 0, gtk_widget_get_width (GTK_WIDGET (self->area)), device_x);
  x_text = trb_units_format (x, TRB_DIM_LENGTH, units);

  if (self->source.kind == TRB_DIAGRAM_SOURCE_COMBINATION
      && self->source.index < r->strength.entries->len)
    br = g_array_index (r->strength.entries, TrbComboResult, self->source.index).result;
  else if (self->source.kind == TRB_DIAGRAM_SOURCE_CASE && self->source.index < TRB_N_CASES)
    br = r->cases[self->source.index];

  if (br == NULL)
    {
      g_autofree char *text = g_strdup_printf (_("x = %s · pick a combination or a case to "
                                                 "read values"), x_text);

      gtk_label_set_text (self->readout_label, text);
      return;
    }
  {
    TrbBeamValues v;
    g_autofree char *V = NULL;
    g_autofree char *M = NULL;
    g_autofree char *d = NULL;
    g_autofree char *text = NULL;

    trb_beam_result_eval (br, x, TRB_SIDE_RIGHT, &v);
    V = trb_units_format (v.V, TRB_DIM_FORCE, units);
    M = trb_units_format (v.M, TRB_DIM_MOMENT, units);
    d = trb_units_format_small_length (v.defl, units);
    text = g_strdup_printf (_("x = %s · V = %s · M = %s · deflection %s"), x_text, V, M, d);
    gtk_label_set_text (self->readout_label, text);
  }
}

static void
on_motion (TrbDiagramView           *self,
           double                    x,
           double                    y,
           GtkEventControllerMotion *controller)
{
  update_readout (self, x);
}

static void
on_leave (TrbDiagramView *self)
{
  update_readout (self, -1);
}

static gboolean
same_source (const TrbDiagramSource *a,
             const TrbDiagramSource *b)
{
  return a->kind == b->kind && (a->kind == TRB_DIAGRAM_SOURCE_ENVELOPE || a->index == b->index);
}

static void
fill_sources (TrbDiagramView        *self,
              const TrbMemberResult *r)
{
  g_autoptr(GtkStringList) names = gtk_string_list_new (NULL);
  TrbDiagramSource s = { TRB_DIAGRAM_SOURCE_ENVELOPE, 0 };
  guint keep = 0;

  g_array_set_size (self->sources, 0);
  g_array_append_val (self->sources, s);
  {
    g_autofree char *name = trb_diagram_source_describe (r, &s);

    gtk_string_list_append (names, name);
  }
  if (r->analysed)
    {
      for (guint i = 0; i < r->strength.entries->len; i++)
        {
          s.kind = TRB_DIAGRAM_SOURCE_COMBINATION;
          s.index = i;
          g_array_append_val (self->sources, s);
          gtk_string_list_append (names,
                                  g_array_index (r->strength.entries, TrbComboResult, i).name);
        }
      for (guint c = 0; c < TRB_N_CASES; c++)
        if (r->cases[c] != NULL)
          {
            g_autofree char *name = NULL;

            s.kind = TRB_DIAGRAM_SOURCE_CASE;
            s.index = c;
            g_array_append_val (self->sources, s);
            name = trb_diagram_source_describe (r, &s);
            gtk_string_list_append (names, name);
          }
    }
  for (guint i = 0; i < self->sources->len; i++)
    if (same_source (&g_array_index (self->sources, TrbDiagramSource, i), &self->source))
      keep = i;
  self->source = g_array_index (self->sources, TrbDiagramSource, keep);

  self->setting = TRUE;
  gtk_drop_down_set_model (self->source_dropdown, G_LIST_MODEL (names));
  gtk_drop_down_set_selected (self->source_dropdown, keep);
  self->setting = FALSE;
}

static void
update (TrbDiagramView *self)
{
  const TrbMemberResult *r = current_result (self);

  if (r == NULL)
    {
      gtk_stack_set_visible_child_name (self->stack, "empty");
      return;
    }
  gtk_stack_set_visible_child_name (self->stack, "diagrams");
  fill_sources (self, r);
  update_readout (self, -1);
  gtk_widget_queue_draw (GTK_WIDGET (self->area));
}

static void
on_source_selected (TrbDiagramView *self)
{
  guint i = gtk_drop_down_get_selected (self->source_dropdown);

  if (self->setting || i >= self->sources->len)
    return;
  self->source = g_array_index (self->sources, TrbDiagramSource, i);
  gtk_widget_queue_draw (GTK_WIDGET (self->area));
}

/* An edit: the results stand until the solve (this panel holds none of them between
 * updates); only a member the edit took out of the project is let go at once. */
static void
on_document_changed (TrbDiagramView *self)
{
  if (self->member != NULL
      && !g_ptr_array_find (trb_document_get_project (self->document)->members, self->member,
                            NULL))
    {
      self->member = NULL;
      update (self);
    }
}

static void
on_document_solved (TrbDiagramView *self)
{
  if (self->member != NULL
      && !g_ptr_array_find (trb_document_get_project (self->document)->members, self->member,
                            NULL))
    self->member = NULL;
  update (self);
}

void
trb_diagram_view_set_document (TrbDiagramView *self,
                               TrbDocument    *document)
{
  g_return_if_fail (TRB_IS_DIAGRAM_VIEW (self));

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_set_object (&self->document, document);
  self->member = NULL;
  if (document != NULL)
    {
      g_signal_connect_object (document, "changed", G_CALLBACK (on_document_changed), self,
                               G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "solved", G_CALLBACK (on_document_solved), self,
                               G_CONNECT_SWAPPED);
    }
  update (self);
}

void
trb_diagram_view_set_member (TrbDiagramView *self,
                             TrbMember      *member)
{
  g_return_if_fail (TRB_IS_DIAGRAM_VIEW (self));

  if (member != self->member)
    self->source.kind = TRB_DIAGRAM_SOURCE_ENVELOPE;
  self->member = member;
  update (self);
}

/**
 * trb_diagram_view_get_n_sources:
 * @self: the view
 *
 * Returns: how many pictures the view offers: the envelope, every combination and pattern,
 *   every load case; 0 when it shows no member.
 */
guint
trb_diagram_view_get_n_sources (TrbDiagramView *self)
{
  g_return_val_if_fail (TRB_IS_DIAGRAM_VIEW (self), 0);
  return current_result (self) != NULL ? self->sources->len : 0;
}

static void
trb_diagram_view_dispose (GObject *object)
{
  TrbDiagramView *self = TRB_DIAGRAM_VIEW (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  gtk_widget_dispose_template (GTK_WIDGET (self), TRB_TYPE_DIAGRAM_VIEW);
  g_clear_object (&self->document);
  g_clear_pointer (&self->sources, g_array_unref);

  G_OBJECT_CLASS (trb_diagram_view_parent_class)->dispose (object);
}

static void
trb_diagram_view_class_init (TrbDiagramViewClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = trb_diagram_view_dispose;

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/trabeate/Trabeate/ui/trb-diagram-view.ui");
  gtk_widget_class_bind_template_child (widget_class, TrbDiagramView, source_dropdown);
  gtk_widget_class_bind_template_child (widget_class, TrbDiagramView, area);
  gtk_widget_class_bind_template_child (widget_class, TrbDiagramView, readout_label);
  gtk_widget_class_bind_template_callback (widget_class, on_source_selected);
}

static void
trb_diagram_view_init (TrbDiagramView *self)
{
  GtkEventController *motion;

  gtk_widget_init_template (GTK_WIDGET (self));
  /* the bin's own child, not bound: gtk_widget_dispose_template() would unparent it behind
   * AdwBin's back */
  self->stack = GTK_STACK (adw_bin_get_child (ADW_BIN (self)));
  self->sources = g_array_new (FALSE, TRUE, sizeof (TrbDiagramSource));
  gtk_drawing_area_set_draw_func (self->area, draw, self, NULL);

  motion = gtk_event_controller_motion_new ();
  g_signal_connect_swapped (motion, "motion", G_CALLBACK (on_motion), self);
  g_signal_connect_swapped (motion, "leave", G_CALLBACK (on_leave), self);
  gtk_widget_add_controller (GTK_WIDGET (self->area), motion);

  g_signal_connect_object (adw_style_manager_get_default (), "notify::dark",
                           G_CALLBACK (gtk_widget_queue_draw), self->area, G_CONNECT_SWAPPED);
}
