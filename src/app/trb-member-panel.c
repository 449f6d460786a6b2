/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "trb-catalog.h"
#include "trb-edit.h"
#include "trb-member-item.h"
#include "trb-member-panel.h"
#include "trb-quantity-row.h"
#include "trb-render-style.h"
#include "trb-units.h"

struct _TrbMemberPanel
{
  AdwBin              parent_instance;

  TrbDocument        *document;
  TrbMember          *member;
  gboolean            setting;        /* rows are being filled from the model */
  GPtrArray          *dynamic_rows;   /* (group, row) pairs added per member */

  GtkStack           *stack;
  GtkLabel           *mark_label;
  GtkLabel           *status_label;
  GtkLabel           *ratio_label;
  GtkLabel           *summary_label;
  GtkLabel           *message_label;
  AdwEntryRow        *mark_row;
  AdwComboRow        *role_row;
  AdwComboRow        *material_row;
  AdwEntryRow        *section_row;
  AdwEntryRow        *steel_grade_row;
  AdwEntryRow        *species_row;
  AdwEntryRow        *grade_row;
  TrbQuantityRow     *length_row;
  AdwActionRow       *span_row;
  AdwComboRow        *method_row;
  AdwComboRow        *bracing_row;
  TrbQuantityRow     *live_row;
  TrbQuantityRow     *total_row;
  TrbQuantityRow     *max_depth_row;
  AdwPreferencesGroup *checks_group;
  AdwPreferencesGroup *bearing_group;
  AdwPreferencesGroup *loads_group;
  AdwExpanderRow     *add_load_row;
  AdwComboRow        *load_case_row;
  AdwComboRow        *load_kind_row;
  TrbQuantityRow     *load_w_row;
  TrbQuantityRow     *load_p_row;
  TrbQuantityRow     *load_from_row;
  TrbQuantityRow     *load_to_row;
  GtkPopover         *completion_popover;
  GtkListBox         *completion_list;
};

G_DEFINE_FINAL_TYPE (TrbMemberPanel, trb_member_panel, ADW_TYPE_BIN)

static const char * const case_names[] = { "D", "L", "Lr", "S" };

GtkWidget *
trb_member_panel_new (void)
{
  return g_object_new (TRB_TYPE_MEMBER_PANEL, NULL);
}

static TrbProject *
project_of (TrbMemberPanel *self)
{
  return trb_document_get_project (self->document);
}

static TrbUnitSystem
units_of (TrbMemberPanel *self)
{
  return project_of (self)->settings.units;
}

/* ---- errors in place ------------------------------------------------------------------------ */

/* An entry row says what was wrong in place of its title until its text changes. */
static void
row_error (AdwEntryRow *row,
           const char  *message)
{
  const char *title = g_object_get_data (G_OBJECT (row), "trb-title");

  if (TRB_IS_QUANTITY_ROW (row))
    {
      trb_quantity_row_show_error (TRB_QUANTITY_ROW (row), message);
      return;
    }
  if (title == NULL)
    {
      g_object_set_data_full (G_OBJECT (row), "trb-title",
                              g_strdup (adw_preferences_row_get_title (ADW_PREFERENCES_ROW (row))),
                              g_free);
      title = g_object_get_data (G_OBJECT (row), "trb-title");
    }
  if (message != NULL)
    {
      gtk_widget_add_css_class (GTK_WIDGET (row), "error");
      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), message);
    }
  else
    {
      gtk_widget_remove_css_class (GTK_WIDGET (row), "error");
      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), title);
    }
}

static void
entry_set_text (TrbMemberPanel *self,
                AdwEntryRow    *row,
                const char     *text)
{
  self->setting = TRUE;
  gtk_editable_set_text (GTK_EDITABLE (row), text != NULL ? text : "");
  self->setting = FALSE;
  if (!TRB_IS_QUANTITY_ROW (row))
    row_error (row, NULL);
}

/* Pushes a command; a refusal is shown on the row the text came from. */
static gboolean
push (TrbMemberPanel *self,
      TrbEditCommand *command,
      GError         *error,
      AdwEntryRow    *row)
{
  if (command == NULL)
    {
      if (row != NULL && error != NULL)
        row_error (row, error->message);
      return FALSE;
    }
  if (row != NULL)
    row_error (row, NULL);
  return trb_document_push (self->document, command);
}

/* ---- filling the panel ----------------------------------------------------------------------- */

static void
clear_dynamic_rows (TrbMemberPanel *self)
{
  for (guint i = 0; i + 1 < self->dynamic_rows->len; i += 2)
    adw_preferences_group_remove (g_ptr_array_index (self->dynamic_rows, i),
                                  g_ptr_array_index (self->dynamic_rows, i + 1));
  g_ptr_array_set_size (self->dynamic_rows, 0);
}

static void
add_dynamic_row (TrbMemberPanel      *self,
                 AdwPreferencesGroup *group,
                 GtkWidget           *row)
{
  adw_preferences_group_add (group, row);
  g_ptr_array_add (self->dynamic_rows, group);
  g_ptr_array_add (self->dynamic_rows, row);
}

static const char *
status_class_of (const TrbMemberResult *r)
{
  switch (trb_render_status_of (r))
    {
    case TRB_RENDER_STATUS_OK:
      return "ok";
    case TRB_RENDER_STATUS_NEAR:
      return "near";
    case TRB_RENDER_STATUS_FAIL:
      return "fail";
    case TRB_RENDER_STATUS_NONE:
    default:
      return "none";
    }
}

static void
set_status_class (GtkWidget  *widget,
                  const char *klass)
{
  static const char * const classes[] = { "ok", "near", "fail", "none" };

  for (guint i = 0; i < G_N_ELEMENTS (classes); i++)
    gtk_widget_remove_css_class (widget, classes[i]);
  gtk_widget_add_css_class (widget, klass);
}

static void
fill_checks (TrbMemberPanel        *self,
             const TrbMemberResult *r)
{
  if (r == NULL || r->checks == NULL || r->checks->len == 0)
    {
      GtkWidget *row = adw_action_row_new ();

      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), _("Nothing checked yet"));
      if (r != NULL && r->message != NULL)
        adw_action_row_set_subtitle (ADW_ACTION_ROW (row), r->message);
      add_dynamic_row (self, self->checks_group, row);
      return;
    }
  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *c = &g_array_index (r->checks, TrbCheck, i);
      GtkWidget *row = adw_action_row_new ();
      GtkWidget *ratio;
      g_autofree char *subtitle = NULL;
      g_autofree char *ratio_text = NULL;
      g_autofree char *escaped = NULL;

      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), c->name);
      subtitle = g_strjoin (" · ", c->clause, c->detail[0] ? c->detail : NULL, NULL);
      if (c->combination[0] != '\0')
        {
          char *with = g_strdup_printf ("%s · %s", subtitle, c->combination);

          g_free (subtitle);
          subtitle = with;
        }
      escaped = g_markup_escape_text (subtitle, -1);
      adw_action_row_set_subtitle (ADW_ACTION_ROW (row), escaped);
      adw_action_row_set_subtitle_lines (ADW_ACTION_ROW (row), 3);

      ratio_text = isnan (c->ratio) ? g_strdup (_("not checked")) : g_strdup_printf ("%.2f",
                                                                                      c->ratio);
      ratio = gtk_label_new (ratio_text);
      gtk_widget_add_css_class (ratio, "numeric");
      gtk_widget_add_css_class (ratio, "trb-ratio");
      set_status_class (ratio, isnan (c->ratio) ? "none"
                               : c->ratio > 1.0 ? "fail"
                               : c->ratio >= 0.9 ? "near" : "ok");
      adw_action_row_add_suffix (ADW_ACTION_ROW (row), ratio);
      add_dynamic_row (self, self->checks_group, row);
    }
}

static char *
case_forces_text (TrbMemberPanel *self,
                  const double   *force)
{
  GString *s = g_string_new (NULL);

  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      g_autofree char *f = NULL;

      if (force[c] == 0)
        continue;
      f = trb_units_format (force[c], TRB_DIM_FORCE, units_of (self));
      if (s->len > 0)
        g_string_append (s, " · ");
      g_string_append_printf (s, "%s %s", case_names[c], f);
    }
  if (s->len == 0)
    g_string_append (s, _("no load"));
  return g_string_free (s, FALSE);
}

static void
fill_bearings (TrbMemberPanel        *self,
               const TrbMemberResult *r)
{
  gboolean any = FALSE;

  if (r != NULL && r->bearings != NULL)
    for (guint i = 0; i < r->bearings->len; i++)
      {
        const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, i);
        GtkWidget *row = adw_action_row_new ();
        g_autofree char *at = trb_units_format (b->x, TRB_DIM_LENGTH, units_of (self));
        g_autofree char *title = NULL;
        g_autofree char *forces = case_forces_text (self, b->force);

        if (b->own)
          title = g_strdup_printf (_("Its own support, at %s"), at);
        else if (b->kind == TRB_BEARING_COLUMN)
          title = g_strdup_printf (_("Column %s, at %s"), b->id, at);
        else if (b->kind == TRB_BEARING_WALL)
          title = g_strdup_printf (_("Wall %s, at %s"), b->id, at);
        else
          title = g_strdup_printf (_("Member %s, at %s"), b->id, at);
        adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), title);
        adw_action_row_set_subtitle (ADW_ACTION_ROW (row), forces);
        add_dynamic_row (self, self->bearing_group, row);
        any = TRUE;
      }
  gtk_widget_set_visible (GTK_WIDGET (self->bearing_group), any);
}

static void
on_remove_load (GtkButton      *button,
                TrbMemberPanel *self)
{
  guint index = GPOINTER_TO_UINT (g_object_get_data (G_OBJECT (button), "trb-index"));
  g_autoptr(GError) error = NULL;
  TrbEditCommand *c;

  if (self->member == NULL)
    return;
  c = trb_edit_remove_member_element (project_of (self), self->member, TRB_MEMBER_ARRAY_LOADS,
                                      index, &error);
  push (self, c, error, NULL);
}

static void
fill_loads (TrbMemberPanel *self)
{
  TrbMember *m = self->member;

  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *l = &g_array_index (m->loads, TrbMemberLoad, i);
      GtkWidget *row = adw_action_row_new ();
      GtkWidget *remove = gtk_button_new_from_icon_name ("user-trash-symbolic");
      g_autofree char *title = NULL;
      g_autofree char *subtitle = NULL;
      g_autofree char *a = trb_units_format (l->load.a, TRB_DIM_LENGTH, units_of (self));
      g_autofree char *b = trb_units_format (l->load.b, TRB_DIM_LENGTH, units_of (self));

      switch (l->load.kind)
        {
        case TRB_LOAD_POINT:
          {
            g_autofree char *p = trb_units_format (l->load.w1, TRB_DIM_FORCE, units_of (self));

            title = g_strdup_printf (_("%s point load %s"), case_names[l->lcase], p);
            subtitle = g_strdup_printf (_("at %s"), a);
          }
          break;
        case TRB_LOAD_UNIFORM:
          {
            g_autofree char *w = trb_units_format (l->load.w1, TRB_DIM_LINE_LOAD,
                                                   units_of (self));

            title = g_strdup_printf (_("%s uniform load %s"), case_names[l->lcase], w);
            subtitle = g_strdup_printf (_("from %s to %s"), a, b);
          }
          break;
        case TRB_LOAD_LINEAR:
          {
            g_autofree char *w1 = trb_units_format (l->load.w1, TRB_DIM_LINE_LOAD,
                                                    units_of (self));
            g_autofree char *w2 = trb_units_format (l->load.w2, TRB_DIM_LINE_LOAD,
                                                    units_of (self));

            title = g_strdup_printf (_("%s varying load %s to %s"), case_names[l->lcase], w1,
                                     w2);
            subtitle = g_strdup_printf (_("from %s to %s"), a, b);
          }
          break;
        case TRB_LOAD_MOMENT:
        default:
          {
            g_autofree char *mo = trb_units_format (l->load.w1, TRB_DIM_MOMENT,
                                                    units_of (self));

            title = g_strdup_printf (_("%s moment %s"), case_names[l->lcase], mo);
            subtitle = g_strdup_printf (_("at %s"), a);
          }
          break;
        }
      adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), title);
      adw_action_row_set_subtitle (ADW_ACTION_ROW (row), subtitle);
      gtk_widget_set_valign (remove, GTK_ALIGN_CENTER);
      gtk_widget_add_css_class (remove, "flat");
      gtk_widget_set_tooltip_text (remove, _("Remove the Load"));
      g_object_set_data (G_OBJECT (remove), "trb-index", GUINT_TO_POINTER (i));
      g_signal_connect (remove, "clicked", G_CALLBACK (on_remove_load), self);
      adw_action_row_add_suffix (ADW_ACTION_ROW (row), remove);
      add_dynamic_row (self, self->loads_group, row);
    }
  adw_preferences_group_set_description (self->loads_group,
                                         m->floor != NULL
                                         ? _("Besides these, it carries the area, line and point "
                                             "loads drawn on the plan, its self-weight and what "
                                             "bears on it")
                                         : _("Its self-weight is added to the dead load"));
}

static void
fill_method_model (TrbMemberPanel *self)
{
  g_autoptr(GtkStringList) list = gtk_string_list_new (NULL);
  g_autofree char *project = NULL;
  static const char * const names[] = { N_("ASD"), N_("LRFD"), N_("Allowable stress") };

  project = g_strdup_printf (_("As the project (%s)"),
                             _(names[project_of (self)->settings.method]));
  gtk_string_list_append (list, project);
  for (guint i = 0; i < G_N_ELEMENTS (names); i++)
    gtk_string_list_append (list, _(names[i]));
  adw_combo_row_set_model (self->method_row, G_LIST_MODEL (list));
}

static void
update (TrbMemberPanel *self)
{
  const TrbMemberResult *r;
  TrbMember *m = self->member;
  g_autofree char *length = NULL;
  g_autofree char *summary = NULL;
  gboolean on_floor;
  GString *message;

  clear_dynamic_rows (self);
  if (self->document == NULL || m == NULL)
    {
      gtk_stack_set_visible_child_name (self->stack, "empty");
      gtk_popover_popdown (self->completion_popover);
      return;
    }
  gtk_stack_set_visible_child_name (self->stack, "member");
  r = trb_document_lookup_result (self->document, m);
  on_floor = m->floor != NULL;
  self->setting = TRUE;

  /* the heading: mark, status, ratio, what governs */
  gtk_label_set_text (self->mark_label, m->id);
  gtk_label_set_text (self->status_label, r != NULL ? trb_status_label (r->status)
                                                    : _("Not solved"));
  set_status_class (GTK_WIDGET (self->status_label), r != NULL ? status_class_of (r) : "none");
  if (r != NULL && !isnan (r->ratio))
    {
      g_autofree char *ratio = g_strdup_printf ("%.2f", r->ratio);

      gtk_label_set_text (self->ratio_label, ratio);
    }
  else
    gtk_label_set_text (self->ratio_label, "");
  set_status_class (GTK_WIDGET (self->ratio_label), r != NULL ? status_class_of (r) : "none");

  length = trb_units_format (m->length, TRB_DIM_LENGTH, units_of (self));
  if (r != NULL && r->section[0] != '\0')
    summary = g_strdup_printf ("%s · %s%s · %s%s%s",
                               on_floor ? trb_role_label (m->role) : _("Beam"), r->section,
                               trb_member_is_auto (m) ? _(" (sized)") : "", length,
                               r->governing[0] ? _(" · governed by ") : "",
                               r->governing[0] ? r->governing : "");
  else
    summary = g_strdup_printf ("%s · %s · %s", on_floor ? trb_role_label (m->role) : _("Beam"),
                               m->section, length);
  gtk_label_set_text (self->summary_label, summary);

  message = g_string_new (NULL);
  if (r != NULL && r->message != NULL)
    g_string_append (message, r->message);
  if (r != NULL && r->notes != NULL)
    for (guint i = 0; i < r->notes->len; i++)
      {
        if (message->len > 0)
          g_string_append_c (message, '\n');
        g_string_append (message, g_ptr_array_index (r->notes, i));
      }
  gtk_label_set_text (self->message_label, message->str);
  gtk_widget_set_visible (GTK_WIDGET (self->message_label), message->len > 0);
  g_string_free (message, TRUE);

  /* the member's own attributes */
  entry_set_text (self, self->mark_row, m->id);
  adw_combo_row_set_selected (self->role_row, m->role);
  gtk_widget_set_visible (GTK_WIDGET (self->role_row), on_floor);
  adw_combo_row_set_selected (self->material_row, m->material);
  entry_set_text (self, self->section_row, m->section);
  entry_set_text (self, self->steel_grade_row,
                  trb_member_get_steel_grade (m, &project_of (self)->settings));
  gtk_widget_set_visible (GTK_WIDGET (self->steel_grade_row), m->material == TRB_MATERIAL_STEEL);
  entry_set_text (self, self->species_row, m->species);
  entry_set_text (self, self->grade_row, m->grade);
  gtk_widget_set_visible (GTK_WIDGET (self->species_row), m->material == TRB_MATERIAL_WOOD);
  gtk_widget_set_visible (GTK_WIDGET (self->grade_row), m->material == TRB_MATERIAL_WOOD);
  trb_quantity_row_set_value (self->length_row, m->length, units_of (self));
  gtk_widget_set_visible (GTK_WIDGET (self->length_row), !on_floor);
  gtk_widget_set_visible (GTK_WIDGET (self->span_row), on_floor);
  if (on_floor)
    {
      g_autofree char *x1 = trb_units_format (m->start.x, TRB_DIM_LENGTH, units_of (self));
      g_autofree char *y1 = trb_units_format (m->start.y, TRB_DIM_LENGTH, units_of (self));
      g_autofree char *x2 = trb_units_format (m->end.x, TRB_DIM_LENGTH, units_of (self));
      g_autofree char *y2 = trb_units_format (m->end.y, TRB_DIM_LENGTH, units_of (self));
      g_autofree char *from_to = g_strdup_printf (_("%s, from (%s, %s) to (%s, %s)"), length,
                                                  x1, y1, x2, y2);

      adw_action_row_set_subtitle (self->span_row, from_to);
    }

  fill_method_model (self);
  adw_combo_row_set_selected (self->method_row, m->has_method ? m->method + 1 : 0);
  adw_combo_row_set_selected (self->bracing_row, m->bracing);
  trb_quantity_row_set_value (self->live_row, m->deflection_live, units_of (self));
  trb_quantity_row_set_value (self->total_row, m->deflection_total, units_of (self));
  trb_quantity_row_set_value (self->max_depth_row, m->max_depth, units_of (self));

  fill_checks (self, r);
  fill_bearings (self, r);
  fill_loads (self);
  self->setting = FALSE;
}

/* ---- handlers ------------------------------------------------------------------------------- */

static void
on_mark_apply (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  TrbEditCommand *c;

  if (self->member == NULL)
    return;
  text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->mark_row))));
  if (g_strcmp0 (text, self->member->id) == 0)
    return;
  c = trb_edit_set_member_text (project_of (self), self->member, TRB_MEMBER_FIELD_ID, text,
                                &error);
  push (self, c, error, self->mark_row);
}

static void
on_role_selected (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  TrbFrameRole role;
  TrbProject *p;

  if (self->setting || self->member == NULL)
    return;
  role = adw_combo_row_get_selected (self->role_row);
  if (role == self->member->role)
    return;
  p = project_of (self);
  /* the deck follows the role, as trb_member_set_role() has it: girders do not carry it */
  trb_document_begin_group (self->document, _("Change role"));
  trb_document_push (self->document,
                     trb_edit_set_member_choice (p, self->member, TRB_MEMBER_FIELD_ROLE, role,
                                                 &error));
  if (error == NULL)
    trb_document_push (self->document,
                       trb_edit_set_member_choice (p, self->member,
                                                   TRB_MEMBER_FIELD_CARRIES_DECK,
                                                   role != TRB_FRAME_ROLE_GIRDER, &error));
  if (error != NULL)
    trb_document_cancel_group (self->document);
  else
    trb_document_end_group (self->document);
}

static void
on_material_selected (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  TrbMaterial material;
  TrbProject *p;
  TrbMember *m = self->member;

  if (self->setting || m == NULL)
    return;
  material = adw_combo_row_get_selected (self->material_row);
  if (material == m->material || material == TRB_MATERIAL_CUSTOM)
    {
      if (material == TRB_MATERIAL_CUSTOM && m->material != material)
        {
          /* a custom section needs E and I, which the file gives: say so, change nothing */
          self->setting = TRUE;
          adw_combo_row_set_selected (self->material_row, m->material);
          self->setting = FALSE;
          adw_preferences_row_set_title (ADW_PREFERENCES_ROW (self->material_row),
                                         _("Material (custom sections are given in the "
                                           "project file)"));
        }
      return;
    }
  p = project_of (self);
  /* A steel shape is no timber and a timber size no steel: let the program size the new
   * material; timber needs a species and grade to be designed at all. */
  trb_document_begin_group (self->document, _("Change material"));
  trb_document_push (self->document,
                     trb_edit_set_member_choice (p, m, TRB_MEMBER_FIELD_MATERIAL, material,
                                                 &error));
  if (error == NULL && !trb_member_is_auto (m))
    trb_document_push (self->document,
                       trb_edit_assign_section (p, m, "auto", &error));
  if (error == NULL && material == TRB_MATERIAL_WOOD && m->species == NULL)
    {
      /* Douglas Fir-Larch No. 2, everyday framing lumber (common practice) */
      trb_document_push (self->document,
                         trb_edit_set_member_text (p, m, TRB_MEMBER_FIELD_SPECIES,
                                                   "Douglas Fir-Larch", &error));
      if (error == NULL)
        trb_document_push (self->document,
                           trb_edit_set_member_text (p, m, TRB_MEMBER_FIELD_GRADE, "No.2",
                                                     &error));
    }
  if (error != NULL)
    trb_document_cancel_group (self->document);
  else
    trb_document_end_group (self->document);
}

static void
on_section_apply (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  TrbEditCommand *c;

  gtk_popover_popdown (self->completion_popover);
  if (self->member == NULL)
    return;
  text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (self->section_row))));
  if (g_strcmp0 (text, self->member->section) == 0)
    return;
  c = trb_edit_assign_section (project_of (self), self->member, text, &error);
  push (self, c, error, self->section_row);
}

static void
on_section_changed (TrbMemberPanel *self)
{
  g_autoptr(GPtrArray) found = NULL;
  const char *text;
  GtkWidget *child;

  if (self->setting || self->member == NULL)
    return;
  row_error (self->section_row, NULL);
  text = gtk_editable_get_text (GTK_EDITABLE (self->section_row));
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->completion_list))) != NULL)
    gtk_list_box_remove (self->completion_list, child);
  if (text[0] == '\0')
    {
      gtk_popover_popdown (self->completion_popover);
      return;
    }

  found = trb_catalog_complete (trb_catalog_get_default (), text, 12);
  if (project_of (self)->sections != NULL)
    {
      g_autoptr(GPtrArray) own = trb_catalog_complete (project_of (self)->sections, text, 6);

      for (guint i = 0; i < own->len; i++)
        g_ptr_array_insert (found, i, g_strdup (g_ptr_array_index (own, i)));
    }
  for (guint i = 0; i < found->len; i++)
    {
      const char *designation = g_ptr_array_index (found, i);
      GtkWidget *label = gtk_label_new (designation);

      gtk_label_set_xalign (GTK_LABEL (label), 0);
      gtk_list_box_append (self->completion_list, label);
    }
  if (found->len > 0 && !(found->len == 1
                          && g_ascii_strcasecmp (g_ptr_array_index (found, 0), text) == 0))
    gtk_popover_popup (self->completion_popover);
  else
    gtk_popover_popdown (self->completion_popover);
}

static void
on_completion_activated (TrbMemberPanel *self,
                         GtkListBoxRow  *row)
{
  GtkWidget *label = gtk_list_box_row_get_child (row);

  self->setting = TRUE;
  gtk_editable_set_text (GTK_EDITABLE (self->section_row), gtk_label_get_text (GTK_LABEL (label)));
  self->setting = FALSE;
  on_section_apply (self);
}

static void
on_text_apply (TrbMemberPanel *self,
               AdwEntryRow    *row)
{
  g_autoptr(GError) error = NULL;
  g_autofree char *text = NULL;
  TrbMemberField field;
  TrbEditCommand *c;

  if (self->member == NULL)
    return;
  if (row == self->steel_grade_row)
    field = TRB_MEMBER_FIELD_STEEL_GRADE;
  else if (row == self->species_row)
    field = TRB_MEMBER_FIELD_SPECIES;
  else
    field = TRB_MEMBER_FIELD_GRADE;
  text = g_strstrip (g_strdup (gtk_editable_get_text (GTK_EDITABLE (row))));
  c = trb_edit_set_member_text (project_of (self), self->member, field,
                                text[0] != '\0' ? text : NULL, &error);
  push (self, c, error, row);
}

static void
on_number_applied (TrbMemberPanel *self,
                   double          value,
                   TrbQuantityRow *row)
{
  g_autoptr(GError) error = NULL;
  TrbMemberField field;
  TrbEditCommand *c;

  if (self->member == NULL)
    return;
  if (row == self->length_row)
    field = TRB_MEMBER_FIELD_LENGTH;
  else if (row == self->live_row)
    field = TRB_MEMBER_FIELD_DEFLECTION_LIVE;
  else if (row == self->total_row)
    field = TRB_MEMBER_FIELD_DEFLECTION_TOTAL;
  else
    field = TRB_MEMBER_FIELD_MAX_DEPTH;
  c = trb_edit_set_member_number (project_of (self), self->member, field, value, &error);
  push (self, c, error, ADW_ENTRY_ROW (row));
}

static void
on_method_selected (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  int method;

  if (self->setting || self->member == NULL)
    return;
  method = (int) adw_combo_row_get_selected (self->method_row) - 1;
  if (method == (self->member->has_method ? (int) self->member->method : -1))
    return;
  push (self, trb_edit_set_member_choice (project_of (self), self->member,
                                          TRB_MEMBER_FIELD_METHOD, method, &error),
        error, NULL);
}

static void
on_bracing_selected (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  TrbBracing bracing;

  if (self->setting || self->member == NULL)
    return;
  bracing = adw_combo_row_get_selected (self->bracing_row);
  if (bracing == self->member->bracing)
    return;
  push (self, trb_edit_set_member_choice (project_of (self), self->member,
                                          TRB_MEMBER_FIELD_BRACING, bracing, &error),
        error, NULL);
}

static void
on_load_kind_selected (TrbMemberPanel *self)
{
  gboolean point = adw_combo_row_get_selected (self->load_kind_row) == 1;

  gtk_widget_set_visible (GTK_WIDGET (self->load_w_row), !point);
  gtk_widget_set_visible (GTK_WIDGET (self->load_p_row), point);
  gtk_widget_set_visible (GTK_WIDGET (self->load_to_row), !point);
  adw_preferences_row_set_title (ADW_PREFERENCES_ROW (self->load_from_row),
                                 point ? _("At (along the member)")
                                       : _("From (along the member)"));
}

static void
on_add_load (TrbMemberPanel *self)
{
  g_autoptr(GError) error = NULL;
  gboolean point = adw_combo_row_get_selected (self->load_kind_row) == 1;
  TrbMemberLoad load = { 0 };
  TrbQuantityRow *value_row = point ? self->load_p_row : self->load_w_row;
  TrbEditCommand *c;

  if (self->member == NULL)
    return;
  load.lcase = adw_combo_row_get_selected (self->load_case_row);
  load.load.kind = point ? TRB_LOAD_POINT : TRB_LOAD_UNIFORM;
  if (!trb_quantity_row_parse (value_row, &load.load.w1, &error))
    {
      row_error (ADW_ENTRY_ROW (value_row), error->message);
      return;
    }
  if (!trb_quantity_row_parse (self->load_from_row, &load.load.a, &error))
    {
      row_error (ADW_ENTRY_ROW (self->load_from_row), error->message);
      return;
    }
  if (!point && !trb_quantity_row_parse (self->load_to_row, &load.load.b, &error))
    {
      row_error (ADW_ENTRY_ROW (self->load_to_row), error->message);
      return;
    }
  c = trb_edit_insert_member_element (project_of (self), self->member, TRB_MEMBER_ARRAY_LOADS,
                                      -1, &load, &error);
  if (push (self, c, error, NULL))
    adw_expander_row_set_expanded (self->add_load_row, FALSE);
  else if (error != NULL)
    row_error (ADW_ENTRY_ROW (self->load_from_row), error->message);
}

/* ---- public ---------------------------------------------------------------------------------- */

static void
on_document_solved (TrbMemberPanel *self)
{
  TrbProject *p = project_of (self);

  if (self->member != NULL && !g_ptr_array_find (p->members, self->member, NULL))
    self->member = NULL;
  update (self);
}

void
trb_member_panel_set_document (TrbMemberPanel *self,
                               TrbDocument    *document)
{
  g_return_if_fail (TRB_IS_MEMBER_PANEL (self));

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_set_object (&self->document, document);
  self->member = NULL;
  if (document != NULL)
    {
      /* the member's own rows follow an edit at once, its checks when solved */
      g_signal_connect_object (document, "changed", G_CALLBACK (on_document_solved), self,
                               G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "solved", G_CALLBACK (on_document_solved), self,
                               G_CONNECT_SWAPPED);
    }
  update (self);
}

void
trb_member_panel_set_member (TrbMemberPanel *self,
                             TrbMember      *member)
{
  g_return_if_fail (TRB_IS_MEMBER_PANEL (self));

  if (self->member != member)
    gtk_popover_popdown (self->completion_popover);
  self->member = member;
  update (self);
}

/**
 * trb_member_panel_get_title:
 * @self: the panel
 *
 * Returns: the mark the panel shows in its heading, or %NULL when it shows no member.
 */
const char *
trb_member_panel_get_title (TrbMemberPanel *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_PANEL (self), NULL);

  if (self->member == NULL)
    return NULL;
  return gtk_label_get_text (self->mark_label);
}

/* ---- object ---------------------------------------------------------------------------------- */

static void
trb_member_panel_dispose (GObject *object)
{
  TrbMemberPanel *self = TRB_MEMBER_PANEL (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  if (self->completion_popover != NULL)
    gtk_widget_unparent (GTK_WIDGET (self->completion_popover));
  self->completion_popover = NULL;
  gtk_widget_dispose_template (GTK_WIDGET (self), TRB_TYPE_MEMBER_PANEL);
  g_clear_object (&self->document);
  g_clear_pointer (&self->dynamic_rows, g_ptr_array_unref);

  G_OBJECT_CLASS (trb_member_panel_parent_class)->dispose (object);
}

static void
trb_member_panel_class_init (TrbMemberPanelClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = trb_member_panel_dispose;

  g_type_ensure (TRB_TYPE_QUANTITY_ROW);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/trabeate/Trabeate/ui/trb-member-panel.ui");
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, mark_label);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, status_label);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, ratio_label);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, summary_label);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, message_label);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, mark_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, role_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, material_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, section_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, steel_grade_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, species_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, grade_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, length_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, span_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, method_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, bracing_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, live_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, total_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, max_depth_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, checks_group);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, bearing_group);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, loads_group);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, add_load_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, load_case_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, load_kind_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, load_w_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, load_p_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, load_from_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, load_to_row);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, completion_popover);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberPanel, completion_list);
  gtk_widget_class_bind_template_callback (widget_class, on_mark_apply);
  gtk_widget_class_bind_template_callback (widget_class, on_role_selected);
  gtk_widget_class_bind_template_callback (widget_class, on_material_selected);
  gtk_widget_class_bind_template_callback (widget_class, on_section_apply);
  gtk_widget_class_bind_template_callback (widget_class, on_section_changed);
  gtk_widget_class_bind_template_callback (widget_class, on_completion_activated);
  gtk_widget_class_bind_template_callback (widget_class, on_text_apply);
  gtk_widget_class_bind_template_callback (widget_class, on_number_applied);
  gtk_widget_class_bind_template_callback (widget_class, on_method_selected);
  gtk_widget_class_bind_template_callback (widget_class, on_bracing_selected);
  gtk_widget_class_bind_template_callback (widget_class, on_load_kind_selected);
  gtk_widget_class_bind_template_callback (widget_class, on_add_load);
}

static void
trb_member_panel_init (TrbMemberPanel *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  /* the bin's own child, not bound: gtk_widget_dispose_template() would unparent it behind
   * AdwBin's back */
  self->stack = GTK_STACK (adw_bin_get_child (ADW_BIN (self)));

  self->dynamic_rows = g_ptr_array_new ();
  /* the completion list hangs below the section row */
  gtk_widget_set_parent (GTK_WIDGET (self->completion_popover), GTK_WIDGET (self->section_row));
  on_load_kind_selected (self);
}
