/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <string.h>

#include "trb-app-enums.h"
#include "trb-autosave.h"
#include "trb-plan-a11y.h"
#include "trb-print.h"
#include "trb-units.h"
#include "trb-window-private.h"

G_DEFINE_FINAL_TYPE (TrbWindow, trb_window, ADW_TYPE_APPLICATION_WINDOW)

enum {
  PROP_0,
  PROP_DOCUMENT,
  PROP_SHOW_FAILING,
  PROP_SHOW_PANEL,
  PROP_TOOL,
  PROP_UNITS,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

/* Case names in the order of TrbLoadCase, for the tool options. */
static const char * const case_labels[] = {
  N_("Dead (D)"), N_("Live (L)"), N_("Roof live (Lr)"), N_("Snow (S)"), NULL
};

TrbWindow *
trb_window_new (TrbApplication *application)
{
  return g_object_new (TRB_TYPE_WINDOW, "application", application, NULL);
}

TrbDocument *
trb_window_get_document (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return self->document;
}

static void
update_title (TrbWindow *self)
{
  g_autofree char *name = NULL;
  g_autofree char *title = NULL;
  g_autofree char *subtitle = NULL;
  GFile *file;
  gboolean modified;

  if (self->document == NULL)
    return;
  name = trb_document_dup_title (self->document);
  modified = trb_document_get_modified (self->document);
  /* the bullet is how GNOME applications mark unsaved changes in a title */
  title = modified ? g_strdup_printf ("• %s", name) : g_strdup (name);
  file = trb_document_get_file (self->document);
  if (file != NULL)
    {
      g_autoptr(GFile) parent = g_file_get_parent (file);
      g_autofree char *path = parent != NULL ? g_file_get_path (parent) : NULL;
      const char *home = g_get_home_dir ();

      if (path != NULL && home != NULL && g_str_has_prefix (path, home))
        subtitle = g_strconcat ("~", path + strlen (home), NULL);
      else
        subtitle = g_steal_pointer (&path);
    }
  else
    subtitle = g_strdup (_("Not saved"));

  adw_window_title_set_title (self->window_title, title);
  adw_window_title_set_subtitle (self->window_title, subtitle != NULL ? subtitle : "");
  {
    g_autofree char *window_title = g_strdup_printf ("%s — %s", title, _("Trabeate"));

    gtk_window_set_title (GTK_WINDOW (self), window_title);
  }
}

/* ---- panels follow the selection ------------------------------------------------------------ */

static void
on_selection_changed (TrbWindow     *self,
                      TrbPlanCanvas *canvas)
{
  TrbMember *member = trb_plan_canvas_get_selected_member (canvas);

  trb_member_panel_set_member (self->member_panel, member);
  trb_diagram_view_set_member (self->diagram_view, member);
  trb_shortlist_panel_set_member (self->shortlist, member);
  trb_member_list_set_member (self->member_list, member);
}

static void
on_member_activated (TrbWindow     *self,
                     TrbMember     *member,
                     TrbMemberList *list)
{
  /* the list holds every floor's members: one on another floor brings its floor up */
  int floor = member != NULL ? trb_document_find_floor (self->document, member->floor) : -1;

  if (floor >= 0)
    trb_document_set_floor_index (self->document, (guint) floor);
  trb_plan_canvas_select_member (self->canvas, member, TRUE);
}

/* ---- the floor shown ------------------------------------------------------------------------- */

static void
on_floor_selected (TrbWindow *self)
{
  guint selected = gtk_drop_down_get_selected (self->floor_dropdown);

  if (self->document != NULL && selected != GTK_INVALID_LIST_POSITION
      && selected < trb_document_get_project (self->document)->floors->len)
    trb_document_set_floor_index (self->document, selected);
}

/* The floors' names in the header bar's list, shown when there are several. */
static void
update_floors (TrbWindow *self)
{
  GPtrArray *floors = trb_document_get_project (self->document)->floors;
  g_autoptr(GPtrArray) names = g_ptr_array_new_with_free_func (g_free);

  for (guint i = 0; i < floors->len; i++)
    {
      const TrbFloor *floor = g_ptr_array_index (floors, i);

      g_ptr_array_add (names, g_strdup (floor->name != NULL && floor->name[0] != '\0'
                                          ? floor->name : _("(unnamed floor)")));
    }
  g_ptr_array_add (names, NULL);
  g_clear_object (&self->floor_names);
  self->floor_names = gtk_string_list_new ((const char *const *) names->pdata);
  /* a new model selects its first item: not a choice of the user's */
  g_signal_handlers_block_by_func (self->floor_dropdown, on_floor_selected, self);
  gtk_drop_down_set_model (self->floor_dropdown, G_LIST_MODEL (self->floor_names));
  gtk_drop_down_set_selected (self->floor_dropdown, trb_document_get_floor_index (self->document));
  g_signal_handlers_unblock_by_func (self->floor_dropdown, on_floor_selected, self);
  gtk_widget_set_visible (GTK_WIDGET (self->floor_dropdown), floors->len > 1);
}

static void
on_document_floor (TrbWindow *self)
{
  gtk_drop_down_set_selected (self->floor_dropdown, trb_document_get_floor_index (self->document));
  trb_window_update_actions (self);
}

/**
 * trb_window_show_floor:
 * @self: a window
 * @step: 1 for the next floor, -1 for the one before
 *
 * Shows a neighbouring floor of the project, when there is one.
 */
void
trb_window_show_floor (TrbWindow *self,
                       int        step)
{
  guint n, at;

  g_return_if_fail (TRB_IS_WINDOW (self));

  if (self->document == NULL)
    return;
  n = trb_document_get_project (self->document)->floors->len;
  at = trb_document_get_floor_index (self->document);
  if ((step < 0 && at == 0) || (step > 0 && at + 1 >= n))
    return;
  trb_document_set_floor_index (self->document, step < 0 ? at - 1 : at + 1);
}

/* Enter on the plan: the panels show the selection already; the member page comes forward,
 * with the keyboard in it, so that the member can be changed without the pointer. */
static void
on_member_opened (TrbWindow     *self,
                  TrbMember     *member,
                  TrbPlanCanvas *canvas)
{
  if (!self->show_panel)
    g_object_set (self, "show-panel", TRUE, NULL);
  trb_window_show_page (self, "member");
  gtk_widget_child_focus (GTK_WIDGET (self->member_panel), GTK_DIR_TAB_FORWARD);
}

static void
on_edit_refused (TrbWindow  *self,
                 const char *message)
{
  trb_window_show_toast (self, message);
}

static void
on_document_notify (TrbWindow *self)
{
  gboolean solving = trb_document_get_solving (self->document);

  update_title (self);
  trb_window_update_actions (self);
  gtk_widget_set_visible (GTK_WIDGET (self->solving_spinner), solving);
  gtk_spinner_set_spinning (self->solving_spinner, solving);
}

static void
on_document_solved (TrbWindow *self)
{
  /* an undo may have changed the project's units */
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_UNITS]);
}

/**
 * trb_window_set_units:
 * @self: a window
 * @units: the unit system the project is shown and saved in
 *
 * An undoable change of the project's settings.
 */
void
trb_window_set_units (TrbWindow     *self,
                      TrbUnitSystem  units)
{
  g_autoptr(GError) error = NULL;
  TrbProject *project;
  TrbSettings settings;

  g_return_if_fail (TRB_IS_WINDOW (self));

  if (self->document == NULL)
    return;
  project = trb_document_get_project (self->document);
  if (project->settings.units == units)
    return;
  settings = project->settings;
  settings.units = units;
  if (!trb_document_push (self->document, trb_edit_set_settings (project, &settings, &error)))
    trb_window_show_toast (self, error->message);
}

/**
 * trb_window_set_document:
 * @self: a window
 * @document: the project to show
 */
void
trb_window_set_document (TrbWindow   *self,
                         TrbDocument *document)
{
  g_return_if_fail (TRB_IS_WINDOW (self));
  g_return_if_fail (TRB_IS_DOCUMENT (document));

  if (self->document == document)
    return;
  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_set_object (&self->document, document);
  g_signal_connect_object (document, "notify", G_CALLBACK (on_document_notify), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "solved", G_CALLBACK (on_document_solved), self,
                           G_CONNECT_SWAPPED);
  g_signal_connect_object (document, "notify::floor-index", G_CALLBACK (on_document_floor), self,
                           G_CONNECT_SWAPPED);
  update_floors (self);

  trb_member_list_set_document (self->member_list, document);
  trb_member_panel_set_document (self->member_panel, document);
  trb_diagram_view_set_document (self->diagram_view, document);
  trb_shortlist_panel_set_document (self->shortlist, document);
  trb_plan_canvas_set_document (self->canvas, document);

  /* A project of standalone beams has no plan: the members list is its main view, and its
   * first beam is shown. */
  if (trb_document_get_floor (document) == NULL
      && trb_document_get_project (document)->members->len > 0)
    trb_plan_canvas_select_member (self->canvas,
                                   g_ptr_array_index (trb_document_get_project (document)->members,
                                                      0),
                                   FALSE);

  on_document_notify (self);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_DOCUMENT]);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_UNITS]);
}

/**
 * trb_window_show_page:
 * @self: a window
 * @page: "member", "diagrams" or "sections": the side panel's page to show
 */
void
trb_window_show_page (TrbWindow  *self,
                      const char *page)
{
  g_return_if_fail (TRB_IS_WINDOW (self));

  adw_view_stack_set_visible_child_name (self->side_stack, page);
}

/* ---- messages -------------------------------------------------------------------------------- */

/**
 * trb_window_show_error:
 * @self: a window
 * @message: what went wrong, with the file and line where the loader gives them
 *
 * Shows @message in a banner above the plan until dismissed; the window keeps its project.
 */
void
trb_window_show_error (TrbWindow  *self,
                       const char *message)
{
  g_return_if_fail (TRB_IS_WINDOW (self));

  g_free (self->error);
  self->error = g_strdup (message);
  gtk_label_set_text (self->banner_label, message);
  gtk_revealer_set_reveal_child (self->banner, TRUE);
}

const char *
trb_window_get_error (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return gtk_revealer_get_reveal_child (self->banner) ? self->error : NULL;
}

static void
on_banner_dismiss (TrbWindow *self)
{
  gtk_revealer_set_reveal_child (self->banner, FALSE);
}

void
trb_window_show_toast (TrbWindow  *self,
                       const char *message)
{
  AdwToast *toast;

  g_return_if_fail (TRB_IS_WINDOW (self));

  toast = adw_toast_new (message);
  adw_toast_set_timeout (toast, 4);
  adw_toast_overlay_add_toast (self->toast_overlay, toast);
}

/* ---- tool options ---------------------------------------------------------------------------- */

static void
update_tool_options (TrbWindow *self)
{
  TrbTool tool = trb_plan_canvas_get_tool (self->canvas);
  gboolean load = tool == TRB_TOOL_AREA_LOAD || tool == TRB_TOOL_LINE_LOAD
                  || tool == TRB_TOOL_POINT_LOAD;
  const char *text = NULL;

  gtk_widget_set_visible (self->case_box, load);
  gtk_widget_set_visible (self->value_box, load);
  gtk_widget_set_visible (self->spacing_box, tool == TRB_TOOL_JOIST_RUN);
  gtk_widget_set_visible (GTK_WIDGET (self->tool_note),
                          tool == TRB_TOOL_GIRDER || tool == TRB_TOOL_BEAM
                          || tool == TRB_TOOL_JOIST_RUN);
  if (tool == TRB_TOOL_GIRDER || tool == TRB_TOOL_BEAM)
    gtk_label_set_text (self->tool_note,
                        _("New members are steel, sized by the program; change them on the "
                          "Member panel"));
  else if (tool == TRB_TOOL_JOIST_RUN)
    gtk_label_set_text (self->tool_note,
                        _("Joists copy the selected joist, or the floor's last one"));

  switch (tool)
    {
    case TRB_TOOL_AREA_LOAD:
      gtk_label_set_text_with_mnemonic (self->value_label, _("_Pressure"));
      text = self->area_text;
      break;
    case TRB_TOOL_LINE_LOAD:
      gtk_label_set_text_with_mnemonic (self->value_label, _("Load per _length"));
      text = self->line_text;
      break;
    case TRB_TOOL_POINT_LOAD:
      gtk_label_set_text_with_mnemonic (self->value_label, _("_Load"));
      text = self->point_text;
      break;
    default:
      break;
    }
  if (text != NULL)
    gtk_editable_set_text (GTK_EDITABLE (self->value_entry), text);
  gtk_revealer_set_reveal_child (self->tool_options,
                                 load || tool == TRB_TOOL_JOIST_RUN || tool == TRB_TOOL_GIRDER
                                 || tool == TRB_TOOL_BEAM);
}

static void
on_tool_changed (TrbWindow *self)
{
  if (self->canvas == NULL)
    return;
  update_tool_options (self);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_TOOL]);
}

/* Reads a quantity entry: on good text sets *value and clears the error style; on bad text
 * marks the entry and says why in its tooltip, leaving *value alone. */
static gboolean
read_quantity (GtkEntry     *entry,
               TrbDimension  dim,
               double       *value)
{
  g_autoptr(GError) error = NULL;
  const char *text = gtk_editable_get_text (GTK_EDITABLE (entry));

  if (!trb_units_parse (text, dim, value, &error))
    {
      gtk_widget_add_css_class (GTK_WIDGET (entry), "error");
      gtk_widget_set_tooltip_text (GTK_WIDGET (entry), error->message);
      return FALSE;
    }
  gtk_widget_remove_css_class (GTK_WIDGET (entry), "error");
  gtk_widget_set_tooltip_text (GTK_WIDGET (entry), NULL);
  return TRUE;
}

static void
on_value_changed (TrbWindow *self)
{
  TrbTool tool = trb_plan_canvas_get_tool (self->canvas);
  const char *text = gtk_editable_get_text (GTK_EDITABLE (self->value_entry));
  double value;

  switch (tool)
    {
    case TRB_TOOL_AREA_LOAD:
      g_free (self->area_text);
      self->area_text = g_strdup (text);
      if (read_quantity (self->value_entry, TRB_DIM_AREA_LOAD, &value))
        g_object_set (self->canvas, "area-pressure", value, NULL);
      break;
    case TRB_TOOL_LINE_LOAD:
      g_free (self->line_text);
      self->line_text = g_strdup (text);
      if (read_quantity (self->value_entry, TRB_DIM_LINE_LOAD, &value))
        g_object_set (self->canvas, "line-load", value, NULL);
      break;
    case TRB_TOOL_POINT_LOAD:
      g_free (self->point_text);
      self->point_text = g_strdup (text);
      if (read_quantity (self->value_entry, TRB_DIM_FORCE, &value))
        g_object_set (self->canvas, "point-load", value, NULL);
      break;
    default:
      break;
    }
}

static void
on_spacing_changed (TrbWindow *self)
{
  double value;

  if (read_quantity (self->spacing_entry, TRB_DIM_LENGTH, &value))
    {
      if (value >= 0.01)
        g_object_set (self->canvas, "joist-spacing", value, NULL);
      else
        {
          gtk_widget_add_css_class (GTK_WIDGET (self->spacing_entry), "error");
          gtk_widget_set_tooltip_text (GTK_WIDGET (self->spacing_entry),
                                       _("The spacing must be 10 mm or more"));
        }
    }
}

static void
on_case_changed (TrbWindow *self)
{
  g_object_set (self->canvas, "load-case", gtk_drop_down_get_selected (self->case_dropdown),
                NULL);
}

/* ---- status line ----------------------------------------------------------------------------- */

static void
on_canvas_hint (TrbWindow *self)
{
  g_autofree char *hint = NULL;
  g_autofree char *position = NULL;

  if (self->canvas == NULL)
    return;
  g_object_get (self->canvas, "hint", &hint, "position", &position, NULL);
  gtk_label_set_text (self->hint_label, hint != NULL ? hint : "");
  gtk_label_set_text (self->position_label, position != NULL ? position : "");
}

/* ---- drag and drop --------------------------------------------------------------------------- */

static gboolean
on_drop (TrbWindow     *self,
         const GValue  *value,
         double         x,
         double         y,
         GtkDropTarget *target)
{
  GSList *files;
  TrbApplication *app = TRB_APPLICATION (gtk_window_get_application (GTK_WINDOW (self)));

  if (!G_VALUE_HOLDS (value, GDK_TYPE_FILE_LIST))
    return FALSE;
  files = g_value_get_boxed (value);
  for (GSList *l = files; l != NULL; l = l->next)
    trb_application_open_file (app, l->data, GTK_WINDOW (self));
  return files != NULL;
}

/* ---- recent projects ------------------------------------------------------------------------- */

static gint
compare_recent (gconstpointer a,
                gconstpointer b)
{
  GDateTime *ta = gtk_recent_info_get_modified ((GtkRecentInfo *) a);
  GDateTime *tb = gtk_recent_info_get_modified ((GtkRecentInfo *) b);

  return g_date_time_compare (tb, ta);
}

static void
update_recent (TrbWindow *self)
{
  GList *items = gtk_recent_manager_get_items (gtk_recent_manager_get_default ());
  guint n = 0;

  g_menu_remove_all (self->recent_menu);
  items = g_list_sort (items, compare_recent);
  for (GList *l = items; l != NULL && n < 8; l = l->next)
    {
      GtkRecentInfo *info = l->data;
      const char *uri = gtk_recent_info_get_uri (info);
      g_autoptr(GMenuItem) item = NULL;

      if (!g_str_has_suffix (uri, ".trabeate") || !gtk_recent_info_exists (info))
        continue;
      item = g_menu_item_new (gtk_recent_info_get_display_name (info), NULL);
      g_menu_item_set_action_and_target (item, "app.open-recent", "s", uri);
      g_menu_append_item (self->recent_menu, item);
      n++;
    }
  if (n == 0)
    {
      g_autoptr(GMenuItem) item = g_menu_item_new (_("No Recent Projects"), "win.none");

      g_menu_append_item (self->recent_menu, item);
    }
  g_list_free_full (items, (GDestroyNotify) gtk_recent_info_unref);
}

/* ---- closing --------------------------------------------------------------------------------- */

static void
on_close_response (AdwMessageDialog *dialog,
                   const char       *response,
                   TrbWindow        *self)
{
  if (g_str_equal (response, "discard"))
    {
      self->closing = TRUE;
      gtk_window_close (GTK_WINDOW (self));
    }
  else if (g_str_equal (response, "save"))
    trb_window_save (self, FALSE, TRUE);
}

static gboolean
trb_window_close_request (GtkWindow *window)
{
  TrbWindow *self = TRB_WINDOW (window);
  g_autofree char *name = NULL;
  AdwMessageDialog *dialog;

  if (self->closing || self->document == NULL || !trb_document_get_modified (self->document))
    {
      int w, h;

      gtk_window_get_default_size (window, &w, &h);
      if (self->settings != NULL)
        {
          g_settings_set_int (self->settings, "window-width", w);
          g_settings_set_int (self->settings, "window-height", h);
          g_settings_set_boolean (self->settings, "window-maximized",
                                  gtk_window_is_maximized (window));
        }
      return GTK_WINDOW_CLASS (trb_window_parent_class)->close_request (window);
    }

  name = trb_document_dup_title (self->document);
  dialog = ADW_MESSAGE_DIALOG (adw_message_dialog_new (window, _("Save Changes?"), NULL));
  adw_message_dialog_format_body (dialog,
                                  _("“%s” has changes that are not saved. Closing without "
                                    "saving loses them."), name);
  adw_message_dialog_add_responses (dialog,
                                    "cancel", _("_Cancel"),
                                    "discard", _("_Discard"),
                                    "save", _("_Save"),
                                    NULL);
  adw_message_dialog_set_response_appearance (dialog, "discard",
                                              ADW_RESPONSE_DESTRUCTIVE);
  adw_message_dialog_set_response_appearance (dialog, "save", ADW_RESPONSE_SUGGESTED);
  adw_message_dialog_set_default_response (dialog, "save");
  adw_message_dialog_set_close_response (dialog, "cancel");
  g_signal_connect (dialog, "response", G_CALLBACK (on_close_response), self);
  gtk_window_present (GTK_WINDOW (dialog));
  return TRUE;
}

/* The application is set after constructed(), by g_object_new's ordinary properties. */
static void
on_application_notify (TrbWindow *self)
{
  GtkApplication *app = gtk_window_get_application (GTK_WINDOW (self));

  if (app != NULL)
    trb_print_add_accels (app);

  /* The window's size and the canvas's grid and snapping follow the preferences: bound once,
   * when the window first gets its application. */
  if (TRB_IS_APPLICATION (app) && self->settings == NULL)
    {
      self->settings = g_object_ref (trb_application_get_settings (TRB_APPLICATION (app)));
      gtk_window_set_default_size (GTK_WINDOW (self),
                                   g_settings_get_int (self->settings, "window-width"),
                                   g_settings_get_int (self->settings, "window-height"));
      if (g_settings_get_boolean (self->settings, "window-maximized"))
        gtk_window_maximize (GTK_WINDOW (self));
      g_settings_bind (self->settings, "grid-spacing", self->canvas, "grid-spacing",
                       G_SETTINGS_BIND_GET);
      g_settings_bind (self->settings, "snap-to-grid", self->canvas, "snap-to-grid",
                       G_SETTINGS_BIND_GET);
      g_settings_bind (self->settings, "snap-to-members", self->canvas, "snap-to-members",
                       G_SETTINGS_BIND_GET);
    }
}

/* ---- object ---------------------------------------------------------------------------------- */

static void
trb_window_constructed (GObject *object)
{
  TrbWindow *self = TRB_WINDOW (object);

  G_OBJECT_CLASS (trb_window_parent_class)->constructed (object);

  /* The application, and with it the preferences, comes later: on_application_notify(). */
  trb_autosave_attach (self);
  trb_plan_a11y_attach (self);
  update_recent (self);
}

static void
trb_window_dispose (GObject *object)
{
  TrbWindow *self = TRB_WINDOW (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  gtk_widget_dispose_template (GTK_WIDGET (self), TRB_TYPE_WINDOW);
  g_clear_object (&self->document);
  g_clear_object (&self->floor_names);
  g_clear_object (&self->settings);

  G_OBJECT_CLASS (trb_window_parent_class)->dispose (object);
}

static void
trb_window_finalize (GObject *object)
{
  TrbWindow *self = TRB_WINDOW (object);

  g_free (self->error);
  g_free (self->area_text);
  g_free (self->line_text);
  g_free (self->point_text);

  G_OBJECT_CLASS (trb_window_parent_class)->finalize (object);
}

static void
trb_window_get_property (GObject    *object,
                         guint       prop_id,
                         GValue     *value,
                         GParamSpec *pspec)
{
  TrbWindow *self = TRB_WINDOW (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      g_value_set_object (value, self->document);
      break;
    case PROP_SHOW_FAILING:
      g_value_set_boolean (value, self->show_failing);
      break;
    case PROP_SHOW_PANEL:
      g_value_set_boolean (value, self->show_panel);
      break;
    case PROP_TOOL:
      /* asked by the tool buttons' action while the template is still being built */
      g_value_set_enum (value, self->canvas != NULL ? trb_plan_canvas_get_tool (self->canvas)
                                                    : TRB_TOOL_SELECT);
      break;
    case PROP_UNITS:
      g_value_set_string (value,
                          self->document != NULL
                          && trb_document_get_project (self->document)->settings.units
                             == TRB_UNIT_SYSTEM_SI ? "si" : "us");
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_window_set_property (GObject      *object,
                         guint         prop_id,
                         const GValue *value,
                         GParamSpec   *pspec)
{
  TrbWindow *self = TRB_WINDOW (object);

  switch (prop_id)
    {
    case PROP_DOCUMENT:
      trb_window_set_document (self, g_value_get_object (value));
      break;
    case PROP_SHOW_FAILING:
      self->show_failing = g_value_get_boolean (value);
      g_object_set (self->member_list, "show-failing", self->show_failing, NULL);
      g_object_notify_by_pspec (object, pspec);
      break;
    case PROP_SHOW_PANEL:
      self->show_panel = g_value_get_boolean (value);
      gtk_widget_set_visible (self->side_panel, self->show_panel);
      g_object_notify_by_pspec (object, pspec);
      break;
    case PROP_TOOL:
      trb_plan_canvas_set_tool (self->canvas, g_value_get_enum (value));
      break;
    case PROP_UNITS:
      trb_window_set_units (self, g_strcmp0 (g_value_get_string (value), "si") == 0
                                  ? TRB_UNIT_SYSTEM_SI : TRB_UNIT_SYSTEM_US);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_window_class_init (TrbWindowClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);
  GtkWindowClass *window_class = GTK_WINDOW_CLASS (klass);

  object_class->constructed = trb_window_constructed;
  object_class->dispose = trb_window_dispose;
  object_class->finalize = trb_window_finalize;
  object_class->get_property = trb_window_get_property;
  object_class->set_property = trb_window_set_property;
  window_class->close_request = trb_window_close_request;

  properties[PROP_DOCUMENT] =
    g_param_spec_object ("document", NULL, NULL, TRB_TYPE_DOCUMENT,
                         G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_SHOW_FAILING] =
    g_param_spec_boolean ("show-failing", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_SHOW_PANEL] =
    g_param_spec_boolean ("show-panel", NULL, NULL, TRUE,
                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_TOOL] =
    g_param_spec_enum ("tool", NULL, NULL, TRB_TYPE_TOOL, TRB_TOOL_SELECT,
                       G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  properties[PROP_UNITS] =
    g_param_spec_string ("units", NULL, NULL, "us",
                         G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  g_type_ensure (TRB_TYPE_PLAN_CANVAS);
  g_type_ensure (TRB_TYPE_MEMBER_LIST);
  g_type_ensure (TRB_TYPE_MEMBER_PANEL);
  g_type_ensure (TRB_TYPE_DIAGRAM_VIEW);
  g_type_ensure (TRB_TYPE_SHORTLIST_PANEL);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/trabeate/Trabeate/ui/trb-window.ui");
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, toast_overlay);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, window_title);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, open_button);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, solving_spinner);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, floor_dropdown);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, banner);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, banner_label);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, main_paned);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, side_panel);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, side_stack);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, canvas);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, member_list);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, member_panel);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, diagram_view);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, shortlist);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, tool_options);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, case_box);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, case_dropdown);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, value_box);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, value_label);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, value_entry);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, spacing_box);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, spacing_entry);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, tool_note);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, hint_label);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, position_label);
  gtk_widget_class_bind_template_child (widget_class, TrbWindow, recent_menu);
  gtk_widget_class_bind_template_callback (widget_class, on_selection_changed);
  gtk_widget_class_bind_template_callback (widget_class, on_member_activated);
  gtk_widget_class_bind_template_callback (widget_class, on_member_opened);
  gtk_widget_class_bind_template_callback (widget_class, on_edit_refused);
  gtk_widget_class_bind_template_callback (widget_class, on_tool_changed);
  gtk_widget_class_bind_template_callback (widget_class, on_value_changed);
  gtk_widget_class_bind_template_callback (widget_class, on_spacing_changed);
  gtk_widget_class_bind_template_callback (widget_class, on_case_changed);
  gtk_widget_class_bind_template_callback (widget_class, on_canvas_hint);
  gtk_widget_class_bind_template_callback (widget_class, on_banner_dismiss);

  trb_window_class_add_actions (widget_class);
}

static void
trb_window_init (TrbWindow *self)
{
  GtkDropTarget *target;
  g_autoptr(GtkStringList) cases = gtk_string_list_new (NULL);

  gtk_widget_init_template (GTK_WIDGET (self));
  self->show_panel = TRUE;
  /* the arrow keys on the plan step through the members as the list shows them */
  trb_plan_canvas_set_member_order (self->canvas, trb_member_list_get_model (self->member_list));

  for (guint i = 0; case_labels[i] != NULL; i++)
    gtk_string_list_append (cases, _(case_labels[i]));
  gtk_drop_down_set_model (self->case_dropdown, G_LIST_MODEL (cases));

  /* The tool options start with values from ASCE 7-16 Table 4.3-1 (offices, 50 psf) and
   * round figures the engineer overwrites. */
  self->area_text = g_strdup ("50 psf");
  self->line_text = g_strdup ("0.5 kip/ft");
  self->point_text = g_strdup ("2 kip");
  gtk_drop_down_set_selected (self->case_dropdown, TRB_CASE_L);
  g_object_set (self->canvas, "load-case", TRB_CASE_L, NULL);
  {
    double v;

    if (trb_units_parse (self->area_text, TRB_DIM_AREA_LOAD, &v, NULL))
      g_object_set (self->canvas, "area-pressure", v, NULL);
    if (trb_units_parse (self->line_text, TRB_DIM_LINE_LOAD, &v, NULL))
      g_object_set (self->canvas, "line-load", v, NULL);
    if (trb_units_parse (self->point_text, TRB_DIM_FORCE, &v, NULL))
      g_object_set (self->canvas, "point-load", v, NULL);
  }
  gtk_editable_set_text (GTK_EDITABLE (self->spacing_entry), "16 in");
  update_tool_options (self);
  on_canvas_hint (self);

  target = gtk_drop_target_new (GDK_TYPE_FILE_LIST, GDK_ACTION_COPY);
  g_signal_connect_swapped (target, "drop", G_CALLBACK (on_drop), self);
  gtk_widget_add_controller (GTK_WIDGET (self), GTK_EVENT_CONTROLLER (target));

  g_signal_connect_swapped (self->floor_dropdown, "notify::selected",
                            G_CALLBACK (on_floor_selected), self);

  g_signal_connect_object (gtk_recent_manager_get_default (), "changed",
                           G_CALLBACK (update_recent), self, G_CONNECT_SWAPPED);
  g_signal_connect (self, "notify::application", G_CALLBACK (on_application_notify), NULL);
}

GtkWidget *
trb_window_get_canvas (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->canvas);
}

/**
 * trb_window_get_floor_dropdown:
 * @self: a window
 *
 * Returns: (transfer none): the header bar's list of the project's floors.
 */
GtkWidget *
trb_window_get_floor_dropdown (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->floor_dropdown);
}

GtkWidget *
trb_window_get_member_list (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->member_list);
}

GtkWidget *
trb_window_get_member_panel (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->member_panel);
}

GtkWidget *
trb_window_get_diagram_view (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->diagram_view);
}

GtkWidget *
trb_window_get_shortlist (TrbWindow *self)
{
  g_return_val_if_fail (TRB_IS_WINDOW (self), NULL);
  return GTK_WIDGET (self->shortlist);
}
