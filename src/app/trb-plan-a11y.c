/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>

#include "trb-member-item.h"
#include "trb-plan-a11y.h"
#include "trb-plan-canvas.h"

/**
 * trb_plan_a11y_describe:
 * @document: the project shown
 * @selected: (nullable): the selected member
 *
 * Returns: (transfer full): "Plan of Mezzanine: 49 members, 0 failing, selected G1, Passes".
 */
char *
trb_plan_a11y_describe (TrbDocument *document,
                        TrbMember   *selected)
{
  TrbProject *project;
  TrbFloor *floor;
  GPtrArray *members;
  GString *text = g_string_new (NULL);
  guint failing = 0;
  guint n;

  g_return_val_if_fail (TRB_IS_DOCUMENT (document), NULL);

  project = trb_document_get_project (document);
  floor = trb_document_get_floor (document);
  /* the plan's own: the floor shown, or every standalone beam where there is no floor */
  members = floor != NULL ? floor->members : project->members;
  n = members->len;
  for (guint i = 0; i < n; i++)
    {
      const TrbMemberResult *result =
        trb_document_lookup_result (document, g_ptr_array_index (members, i));

      if (result != NULL && result->status != TRB_STATUS_PASS)
        failing++;
    }
  if (floor != NULL)
    g_string_append_printf (text, _("Plan of %s: "), floor->name);
  g_string_append_printf (text, ngettext ("%u member", "%u members", n), n);
  g_string_append (text, ", ");
  /* "failing" counts every member that does not pass, as Failing Only shows them */
  g_string_append_printf (text, _("%u failing"), failing);
  if (selected != NULL)
    {
      const TrbMemberResult *result = trb_document_lookup_result (document, selected);

      g_string_append (text, ", ");
      g_string_append_printf (text, _("selected %s"), selected->id);
      if (result != NULL)
        g_string_append_printf (text, ", %s", trb_status_label (result->status));
    }
  return g_string_free (text, FALSE);
}

static void
update (TrbWindow *window)
{
  GtkWidget *canvas = trb_window_get_canvas (window);
  TrbDocument *document = trb_window_get_document (window);
  g_autofree char *label = NULL;
  g_autofree char *description = NULL;
  TrbFloor *floor;

  if (document == NULL || canvas == NULL)
    return;
  floor = trb_document_get_floor (document);
  label = floor != NULL ? g_strdup_printf (_("Plan of %s"), floor->name)
                        : g_strdup (_("Plan"));
  description = trb_plan_a11y_describe (document,
                                        trb_plan_canvas_get_selected_member (TRB_PLAN_CANVAS (canvas)));
  gtk_accessible_update_property (GTK_ACCESSIBLE (canvas),
                                  GTK_ACCESSIBLE_PROPERTY_LABEL, label,
                                  GTK_ACCESSIBLE_PROPERTY_DESCRIPTION, description,
                                  -1);
}

static void
on_document (TrbWindow *window)
{
  TrbDocument *document = trb_window_get_document (window);

  if (document != NULL)
    {
      g_signal_connect_object (document, "solved", G_CALLBACK (update), window,
                               G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "notify::floor-index", G_CALLBACK (update), window,
                               G_CONNECT_SWAPPED);
    }
  update (window);
}

/**
 * trb_plan_a11y_attach:
 * @window: a window
 *
 * Keeps the plan's accessible label and description current: after each solve, each change
 * of selection and of the floor shown.
 */
void
trb_plan_a11y_attach (TrbWindow *window)
{
  g_return_if_fail (TRB_IS_WINDOW (window));

  g_signal_connect_object (trb_window_get_canvas (window), "selection-changed",
                           G_CALLBACK (update), window, G_CONNECT_SWAPPED);
  g_signal_connect_object (window, "notify::document", G_CALLBACK (on_document), window,
                           G_CONNECT_SWAPPED);
  on_document (window);
}
