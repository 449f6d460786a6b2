/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>

#include "trb-edit.h"
#include "trb-shortlist-panel.h"
#include "trb-units.h"

struct _TrbShortlistPanel
{
  AdwBin               parent_instance;

  TrbDocument         *document;
  TrbMember           *member;
  GPtrArray           *choices;     /* char *: the designation of each row, "auto" for sizing */
  gboolean             stale;       /* the rows wait for the panel to be shown */

  GtkStack            *stack;
  AdwStatusPage       *empty_page;
  AdwPreferencesGroup *group;
  GtkListBox          *list;
};

G_DEFINE_FINAL_TYPE (TrbShortlistPanel, trb_shortlist_panel, ADW_TYPE_BIN)

GtkWidget *
trb_shortlist_panel_new (void)
{
  return g_object_new (TRB_TYPE_SHORTLIST_PANEL, NULL);
}

static GtkWidget *
make_row (const char *title,
          const char *subtitle,
          gboolean    current)
{
  GtkWidget *row = adw_action_row_new ();
  GtkWidget *mark = gtk_image_new_from_icon_name ("object-select-symbolic");

  adw_preferences_row_set_title (ADW_PREFERENCES_ROW (row), title);
  adw_action_row_set_subtitle (ADW_ACTION_ROW (row), subtitle);
  gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), !current);
  gtk_widget_set_opacity (mark, current ? 1.0 : 0.0);
  gtk_widget_set_tooltip_text (mark, current ? _("The member's section") : NULL);
  adw_action_row_add_suffix (ADW_ACTION_ROW (row), mark);
  return row;
}

static void update (TrbShortlistPanel *self);

/* The list is sized again for each member shown (a few milliseconds): not while the panel is
 * out of sight, behind another page of the side panel or with the panel closed, where every
 * selection and every solve would redo it for nobody. */
static void
request_update (TrbShortlistPanel *self)
{
  self->stale = TRUE;
  if (gtk_widget_get_mapped (GTK_WIDGET (self)))
    update (self);
}

static void
ensure_current (TrbShortlistPanel *self)
{
  if (self->stale)
    update (self);
}

static void
trb_shortlist_panel_map (GtkWidget *widget)
{
  GTK_WIDGET_CLASS (trb_shortlist_panel_parent_class)->map (widget);
  ensure_current (TRB_SHORTLIST_PANEL (widget));
}

static void
update (TrbShortlistPanel *self)
{
  const TrbMemberResult *r = NULL;
  g_autoptr(GArray) shortlist = NULL;
  TrbUnitSystem units;
  GtkWidget *child;

  self->stale = FALSE;
  while ((child = gtk_widget_get_first_child (GTK_WIDGET (self->list))) != NULL)
    gtk_list_box_remove (self->list, child);
  g_ptr_array_set_size (self->choices, 0);

  if (self->document != NULL && self->member != NULL)
    r = trb_document_lookup_result (self->document, self->member);
  if (r == NULL)
    {
      adw_status_page_set_title (self->empty_page, _("No Member Selected"));
      adw_status_page_set_description (self->empty_page,
                                       _("The sections that pass for a member are listed "
                                         "here, lightest first"));
      gtk_stack_set_visible_child_name (self->stack, "empty");
      return;
    }
  /* the solve makes no shortlist: it is sized again here for the member shown, from what
   * the solve analysed it with (a few milliseconds) */
  shortlist = trb_solve_member_shortlist (trb_document_get_project (self->document), r,
                                          TRB_SHORTLIST_DEFAULT);
  if (shortlist->len == 0 && trb_member_is_auto (self->member))
    {
      adw_status_page_set_title (self->empty_page, _("No Section Passes"));
      adw_status_page_set_description (self->empty_page,
                                       trb_member_is_custom (self->member)
                                       ? _("A custom section is checked as given")
                                       : _("No section of the catalog passes every check: "
                                           "shorten the span, add a support or lighten the "
                                           "load"));
      gtk_stack_set_visible_child_name (self->stack, "empty");
      return;
    }

  units = trb_document_get_project (self->document)->settings.units;
  {
    g_autofree char *title = g_strdup_printf (_("Passing Sections for %s"), self->member->id);

    adw_preferences_group_set_title (self->group, title);
  }

  /* sizing by the program is a choice too, for a member given a section */
  if (!trb_member_is_auto (self->member))
    {
      gtk_list_box_append (self->list,
                           make_row (_("Let the program choose"),
                                     _("The lightest section that passes, kept up to date"),
                                     FALSE));
      g_ptr_array_add (self->choices, g_strdup ("auto"));
    }
  for (guint i = 0; i < shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (shortlist, TrbShortlistEntry, i);
      g_autofree char *weight = trb_units_format (e->weight, TRB_DIM_WEIGHT_PER_LENGTH, units);
      g_autofree char *subtitle = g_strdup_printf (_("%s · ratio %.2f · %s governs"), weight,
                                                   e->ratio, e->governing);
      gboolean current = g_ascii_strcasecmp (e->section, self->member->section) == 0;
      /* a sized member: its row is the program's choice, which picking fixes for good */
      gboolean chosen = trb_member_is_auto (self->member)
                        && g_ascii_strcasecmp (e->section, r->section) == 0;
      GtkWidget *row = make_row (e->section, subtitle, current || chosen);

      if (chosen)
        {
          gtk_list_box_row_set_activatable (GTK_LIST_BOX_ROW (row), TRUE);
          gtk_widget_set_tooltip_text (row, _("The program's choice; pick it to keep it"));
        }
      gtk_list_box_append (self->list, row);
      g_ptr_array_add (self->choices, g_strdup (e->section));
    }
  gtk_stack_set_visible_child_name (self->stack, "list");
}

/**
 * trb_shortlist_panel_choose:
 * @self: the panel
 * @index: a row
 *
 * Assigns the row's section to the member, as picking the row does: one undoable step.
 *
 * Returns: %TRUE when the section was assigned.
 */
gboolean
trb_shortlist_panel_choose (TrbShortlistPanel *self,
                            guint              index)
{
  g_autoptr(GError) error = NULL;
  TrbEditCommand *c;

  g_return_val_if_fail (TRB_IS_SHORTLIST_PANEL (self), FALSE);

  ensure_current (self);
  if (self->member == NULL || index >= self->choices->len)
    return FALSE;
  c = trb_edit_assign_section (trb_document_get_project (self->document), self->member,
                               g_ptr_array_index (self->choices, index), &error);
  if (c == NULL)
    {
      g_warning ("%s", error->message);
      return FALSE;
    }
  return trb_document_push (self->document, c);
}

guint
trb_shortlist_panel_get_n_rows (TrbShortlistPanel *self)
{
  g_return_val_if_fail (TRB_IS_SHORTLIST_PANEL (self), 0);
  ensure_current (self);
  return self->choices->len;
}

const char *
trb_shortlist_panel_get_row_section (TrbShortlistPanel *self,
                                     guint              index)
{
  g_return_val_if_fail (TRB_IS_SHORTLIST_PANEL (self), NULL);
  ensure_current (self);
  g_return_val_if_fail (index < self->choices->len, NULL);
  return g_ptr_array_index (self->choices, index);
}

static void
on_row_activated (TrbShortlistPanel *self,
                  GtkListBoxRow     *row)
{
  trb_shortlist_panel_choose (self, gtk_list_box_row_get_index (row));
}

/* An edit: the results stand until the solve (this panel holds none of them between
 * updates); only a member the edit took out of the project is let go at once. */
static void
on_document_changed (TrbShortlistPanel *self)
{
  if (self->member != NULL
      && !g_ptr_array_find (trb_document_get_project (self->document)->members, self->member,
                            NULL))
    {
      self->member = NULL;
      request_update (self);
    }
}

static void
on_document_solved (TrbShortlistPanel *self)
{
  if (self->member != NULL
      && !g_ptr_array_find (trb_document_get_project (self->document)->members, self->member,
                            NULL))
    self->member = NULL;
  request_update (self);
}

void
trb_shortlist_panel_set_document (TrbShortlistPanel *self,
                                  TrbDocument       *document)
{
  g_return_if_fail (TRB_IS_SHORTLIST_PANEL (self));

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
  request_update (self);
}

void
trb_shortlist_panel_set_member (TrbShortlistPanel *self,
                                TrbMember         *member)
{
  g_return_if_fail (TRB_IS_SHORTLIST_PANEL (self));

  self->member = member;
  request_update (self);
}

static void
trb_shortlist_panel_dispose (GObject *object)
{
  TrbShortlistPanel *self = TRB_SHORTLIST_PANEL (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  gtk_widget_dispose_template (GTK_WIDGET (self), TRB_TYPE_SHORTLIST_PANEL);
  g_clear_object (&self->document);
  g_clear_pointer (&self->choices, g_ptr_array_unref);

  G_OBJECT_CLASS (trb_shortlist_panel_parent_class)->dispose (object);
}

static void
trb_shortlist_panel_class_init (TrbShortlistPanelClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = trb_shortlist_panel_dispose;
  widget_class->map = trb_shortlist_panel_map;

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/trabeate/Trabeate/ui/"
                                               "trb-shortlist-panel.ui");
  gtk_widget_class_bind_template_child (widget_class, TrbShortlistPanel, empty_page);
  gtk_widget_class_bind_template_child (widget_class, TrbShortlistPanel, group);
  gtk_widget_class_bind_template_child (widget_class, TrbShortlistPanel, list);
  gtk_widget_class_bind_template_callback (widget_class, on_row_activated);
}

static void
trb_shortlist_panel_init (TrbShortlistPanel *self)
{
  gtk_widget_init_template (GTK_WIDGET (self));
  /* the bin's own child, not bound: gtk_widget_dispose_template() would unparent it behind
   * AdwBin's back */
  self->stack = GTK_STACK (adw_bin_get_child (ADW_BIN (self)));
  self->choices = g_ptr_array_new_with_free_func (g_free);
}
