/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-member-item.h"
#include "trb-member-list.h"
#include "trb-units.h"

struct _TrbMemberList
{
  AdwBin              parent_instance;

  TrbDocument        *document;
  GListStore         *store;
  GPtrArray          *rows;         /* the store's items, in its order, for quick scans */
  GtkFilterListModel *filtered;
  GtkSortListModel   *sorted;
  GtkSingleSelection *selection;
  GtkCustomFilter    *failing_filter;
  gboolean            show_failing;
  gboolean            updating;     /* selection changes made here, not by the user */
  TrbMember          *member;       /* the member shown on the panels */
  char               *summary;

  GtkColumnView      *view;
  GtkColumnViewColumn *floor_column; /* in the view when the project has several floors */
  GtkLabel           *summary_label;
  GtkLabel           *title_label;
};

G_DEFINE_FINAL_TYPE (TrbMemberList, trb_member_list, ADW_TYPE_BIN)

enum {
  PROP_0,
  PROP_SHOW_FAILING,
  N_PROPS
};

enum {
  MEMBER_ACTIVATED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

GtkWidget *
trb_member_list_new (void)
{
  return g_object_new (TRB_TYPE_MEMBER_LIST, NULL);
}

/* ---- summary --------------------------------------------------------------------------------- */

static const TrbSection *
lookup_section (const TrbProject *project,
                const char       *designation)
{
  const TrbSection *s = NULL;

  if (designation == NULL || designation[0] == '\0')
    return NULL;
  if (project->sections != NULL)
    s = trb_catalog_lookup (project->sections, designation);
  if (s == NULL)
    s = trb_catalog_lookup (trb_catalog_get_default (), designation);
  return s;
}

static void
update_summary (TrbMemberList *self)
{
  TrbProject *project;
  g_autoptr(GHashTable) sections = g_hash_table_new (g_str_hash, g_str_equal);
  guint n = 0, failing = 0;
  double steel = 0, timber = 0;   /* N and m^3 */
  g_autofree char *steel_text = NULL;
  g_autofree char *timber_text = NULL;
  GString *s;

  g_clear_pointer (&self->summary, g_free);
  if (self->document == NULL)
    {
      gtk_label_set_text (self->summary_label, "");
      return;
    }
  project = trb_document_get_project (self->document);
  for (guint i = 0; i < project->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (project->members, i);
      const TrbMemberResult *r = trb_document_lookup_result (self->document, m);
      const TrbSection *section;

      n++;
      if (r == NULL)
        continue;
      if (r->status != TRB_STATUS_PASS)
        failing++;
      /* a few sections for thousands of members: look each up once */
      if (!g_hash_table_lookup_extended (sections, r->section, NULL, (gpointer *) &section))
        {
          section = lookup_section (project, r->section);
          g_hash_table_insert (sections, (gpointer) r->section, (gpointer) section);
        }
      if (m->material == TRB_MATERIAL_STEEL && section != NULL)
        steel += section->weight * m->length;
      else if (m->material == TRB_MATERIAL_WOOD && section != NULL)
        timber += section->b * section->d * m->length;
    }

  if (project->settings.units == TRB_UNIT_SYSTEM_SI)
    {
      /* steel by mass, as it is bought, under standard gravity (NIST SP 811) */
      steel_text = g_strdup_printf (_("steel %.0f kg"), steel / TRB_STANDARD_GRAVITY);
      timber_text = g_strdup_printf (_("timber %.2f m³"), timber);
    }
  else
    {
      steel_text = g_strdup_printf (_("steel %.0f lb"), steel / TRB_LBF);
      timber_text = g_strdup_printf (_("timber %.1f ft³"), timber / (TRB_FT * TRB_FT * TRB_FT));
    }

  s = g_string_new (NULL);
  g_string_append_printf (s, ngettext ("%u member", "%u members", n), n);
  g_string_append (s, " · ");
  if (failing == 0)
    g_string_append (s, _("none failing"));
  else
    g_string_append_printf (s, ngettext ("%u needs attention", "%u need attention", failing),
                            failing);
  g_string_append_printf (s, " · %s · %s", steel_text, timber_text);
  {
    /* line and point loads that lie on no member: nothing carries them */
    const TrbFloorResult *fr = trb_document_get_floor_result (self->document);
    guint lost = fr != NULL && fr->unassigned != NULL ? fr->unassigned->len : 0;

    if (lost > 0)
      {
        g_string_append (s, " · ");
        g_string_append_printf (s, ngettext ("%u load on no member", "%u loads on no member",
                                             lost), lost);
      }
  }
  self->summary = g_string_free (s, FALSE);
  gtk_label_set_text (self->summary_label, self->summary);
}

/**
 * trb_member_list_get_shows_floors:
 * @self: the list
 *
 * Returns: whether the list has its Floor column: the project has several floors.
 */
gboolean
trb_member_list_get_shows_floors (TrbMemberList *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_LIST (self), FALSE);
  return gtk_column_view_column_get_column_view (self->floor_column) == self->view;
}

const char *
trb_member_list_get_summary (TrbMemberList *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_LIST (self), NULL);
  return self->summary;
}

/* ---- rows ------------------------------------------------------------------------------------ */

static guint
find_position (TrbMemberList *self,
               TrbMember     *member)
{
  GListModel *model = G_LIST_MODEL (self->sorted);
  guint n = g_list_model_get_n_items (model);

  for (guint i = 0; i < n; i++)
    {
      g_autoptr(TrbMemberItem) item = g_list_model_get_item (model, i);

      if (trb_member_item_get_member (item) == member)
        return i;
    }
  return GTK_INVALID_LIST_POSITION;
}

static void
scroll_to (TrbMemberList *self,
           guint          position)
{
  /* GTK 4.8 has no gtk_column_view_scroll_to(); its list view child has the action */
  for (GtkWidget *child = gtk_widget_get_first_child (GTK_WIDGET (self->view)); child != NULL;
       child = gtk_widget_get_next_sibling (child))
    if (GTK_IS_LIST_VIEW (child))
      gtk_widget_activate_action (child, "list.scroll-to-item", "u", position);
}

static void
select_member (TrbMemberList *self,
               TrbMember     *member,
               gboolean       scroll)
{
  guint position = member != NULL ? find_position (self, member) : GTK_INVALID_LIST_POSITION;

  self->updating = TRUE;
  gtk_single_selection_set_selected (self->selection, position);
  self->updating = FALSE;
  if (scroll && position != GTK_INVALID_LIST_POSITION)
    scroll_to (self, position);
}

static TrbMember *
store_member (TrbMemberList *self,
              guint          position)
{
  return trb_member_item_get_member (g_ptr_array_index (self->rows, position));
}

/* Brings the rows up to date with the project (and, when solved, with new results). Rows of
 * members still there are kept and updated in place; only the stretch where the members
 * differ (an edit adds or removes a few, or a run of joists) is spliced: replacing ten
 * thousand rows took a third of a second. After an edit the results are those of before,
 * so only rows whose member the edit changed are updated. */
static void
rebuild (TrbMemberList *self,
         gboolean       solved)
{
  g_autoptr(GPtrArray) added = g_ptr_array_new_with_free_func (g_object_unref);
  GPtrArray *members = NULL;
  guint n_old = self->rows->len, n_new = 0, head = 0, tail = 0;
  gboolean changed = FALSE;

  if (self->document != NULL)
    {
      members = trb_document_get_project (self->document)->members;
      n_new = members->len;
    }
  while (head < n_old && head < n_new
         && store_member (self, head) == g_ptr_array_index (members, head))
    head++;
  while (tail < n_old - head && tail < n_new - head
         && store_member (self, n_old - 1 - tail) == g_ptr_array_index (members,
                                                                         n_new - 1 - tail))
    tail++;

  for (guint i = head; i < n_new - tail; i++)
    {
      TrbMember *m = g_ptr_array_index (members, i);

      g_ptr_array_add (added, trb_member_item_new (m, trb_document_lookup_result (self->document,
                                                                                  m)));
    }
  if (n_old - head - tail > 0 || added->len > 0)
    {
      self->updating = TRUE;
      g_list_store_splice (self->store, head, n_old - head - tail, added->pdata, added->len);
      self->updating = FALSE;
      g_ptr_array_remove_range (self->rows, head, n_old - head - tail);
      for (guint i = 0; i < added->len; i++)
        g_ptr_array_insert (self->rows, head + i, g_object_ref (g_ptr_array_index (added, i)));
      changed = TRUE;
    }

  /* the kept rows: what the edit and the solve changed in them */
  for (guint i = 0; i < head + tail && self->document != NULL; i++)
    {
      guint at = i < head ? i : n_new - (head + tail) + i;
      TrbMemberItem *item = g_ptr_array_index (self->rows, at);

      if (!solved && !trb_member_item_is_stale (item))
        continue;
      changed |= trb_member_item_update (item,
                                         trb_document_lookup_result (self->document,
                                                                     trb_member_item_get_member (
                                                                       item)));
    }

  /* a status or ratio that changed may move a row in or out of the filter, or in the sort */
  if (changed)
    {
      self->updating = TRUE;
      if (self->show_failing)
        gtk_filter_changed (GTK_FILTER (self->failing_filter), GTK_FILTER_CHANGE_DIFFERENT);
      gtk_sorter_changed (gtk_column_view_get_sorter (self->view), GTK_SORTER_CHANGE_DIFFERENT);
      self->updating = FALSE;
    }
  select_member (self, self->member, FALSE);
  if (solved || n_old != n_new)
    update_summary (self);
}

static void
on_document_changed (TrbMemberList *self)
{
  TrbProject *project = trb_document_get_project (self->document);

  if (self->member != NULL && !g_ptr_array_find (project->members, self->member, NULL))
    self->member = NULL;
  rebuild (self, FALSE);
}

static void
on_document_solved (TrbMemberList *self)
{
  TrbProject *project = trb_document_get_project (self->document);

  if (self->member != NULL && !g_ptr_array_find (project->members, self->member, NULL))
    self->member = NULL;
  rebuild (self, TRUE);
}

/* The Floor column is in the view only when there are floors to tell apart: GTK 4.8's column
 * view leaves a hidden column's fixed width empty at the rows' end. */
static void
show_floor_column (TrbMemberList *self,
                   gboolean       show)
{
  GListModel *columns = gtk_column_view_get_columns (self->view);
  gboolean shown = FALSE;

  for (guint i = 0; i < g_list_model_get_n_items (columns); i++)
    {
      g_autoptr(GtkColumnViewColumn) column = g_list_model_get_item (columns, i);

      shown |= column == self->floor_column;
    }
  if (show && !shown)
    gtk_column_view_insert_column (self->view, 2, self->floor_column);
  else if (!show && shown)
    gtk_column_view_remove_column (self->view, self->floor_column);
}

void
trb_member_list_set_document (TrbMemberList *self,
                              TrbDocument   *document)
{
  g_return_if_fail (TRB_IS_MEMBER_LIST (self));

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  g_set_object (&self->document, document);
  self->member = NULL;
  if (document != NULL)
    {
      /* rows at once for what the edit added or took away, statuses again when solved */
      g_signal_connect_object (document, "changed", G_CALLBACK (on_document_changed), self,
                               G_CONNECT_SWAPPED);
      g_signal_connect_object (document, "solved", G_CALLBACK (on_document_solved), self,
                               G_CONNECT_SWAPPED);
    }
  show_floor_column (self, document != NULL
                           && trb_document_get_project (document)->floors->len > 1);
  rebuild (self, TRUE);
}

/**
 * trb_member_list_set_member:
 * @self: the list
 * @member: (nullable): the member the panels show
 *
 * Selects its row and scrolls to it, without emitting ::member-activated.
 */
void
trb_member_list_set_member (TrbMemberList *self,
                            TrbMember     *member)
{
  g_return_if_fail (TRB_IS_MEMBER_LIST (self));

  self->member = member;
  select_member (self, member, TRUE);
}

/**
 * trb_member_list_get_model:
 * @self: the list
 *
 * Returns: (transfer none): the rows as shown (#TrbMemberItem), filtered and sorted.
 */
GListModel *
trb_member_list_get_model (TrbMemberList *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_LIST (self), NULL);
  return G_LIST_MODEL (self->sorted);
}

/**
 * trb_member_list_activate_row:
 * @self: the list
 * @position: a row as shown
 *
 * Selects the row as a click would.
 */
void
trb_member_list_activate_row (TrbMemberList *self,
                              guint          position)
{
  g_return_if_fail (TRB_IS_MEMBER_LIST (self));

  gtk_single_selection_set_selected (self->selection, position);
}

static void
on_selected (TrbMemberList *self)
{
  TrbMemberItem *item;

  if (self->updating)
    return;
  item = gtk_single_selection_get_selected_item (self->selection);
  if (item == NULL)
    return;
  self->member = trb_member_item_get_member (item);
  g_signal_emit (self, signals[MEMBER_ACTIVATED], 0, self->member);
}

/* ---- columns --------------------------------------------------------------------------------- */

typedef enum
{
  COLUMN_MARK,
  COLUMN_ROLE,
  COLUMN_SECTION,
  COLUMN_STATUS,
  COLUMN_RATIO,
  COLUMN_GOVERNING,
  COLUMN_FLOOR,
} Column;

static void
setup_label (GtkSignalListItemFactory *factory,
             GtkListItem              *list_item,
             gpointer                  user_data)
{
  Column column = GPOINTER_TO_INT (user_data);
  GtkWidget *label = gtk_label_new (NULL);

  gtk_label_set_xalign (GTK_LABEL (label), column == COLUMN_RATIO ? 1.0 : 0.0);
  gtk_label_set_ellipsize (GTK_LABEL (label), PANGO_ELLIPSIZE_END);
  if (column == COLUMN_RATIO)
    gtk_widget_add_css_class (label, "numeric");
  if (column == COLUMN_MARK)
    gtk_widget_add_css_class (label, "heading");

  if (column == COLUMN_STATUS)
    {
      GtkWidget *box = gtk_box_new (GTK_ORIENTATION_HORIZONTAL, 6);
      GtkWidget *dot = gtk_drawing_area_new ();

      gtk_widget_set_size_request (dot, 10, 10);
      gtk_widget_set_valign (dot, GTK_ALIGN_CENTER);
      gtk_widget_add_css_class (dot, "trb-status-dot");
      gtk_box_append (GTK_BOX (box), dot);
      gtk_box_append (GTK_BOX (box), label);
      gtk_list_item_set_child (list_item, box);
    }
  else
    gtk_list_item_set_child (list_item, label);
}

static void
show_cell (GtkListItem *list_item)
{
  Column column = GPOINTER_TO_INT (g_object_get_data (G_OBJECT (list_item), "trb-column"));
  TrbMemberItem *item = gtk_list_item_get_item (list_item);
  GtkWidget *child = gtk_list_item_get_child (list_item);
  GtkWidget *label = column == COLUMN_STATUS ? gtk_widget_get_last_child (child) : child;
  g_autofree char *text = NULL;

  switch (column)
    {
    case COLUMN_MARK:
      text = g_strdup (trb_member_item_get_mark (item));
      break;
    case COLUMN_ROLE:
      text = g_strdup (trb_member_item_get_role (item));
      break;
    case COLUMN_SECTION:
      text = g_strdup (trb_member_item_get_section (item));
      break;
    case COLUMN_STATUS:
      {
        GtkWidget *dot = gtk_widget_get_first_child (child);
        static const char * const classes[] = { "ok", "near", "fail", "none" };

        for (guint i = 0; i < G_N_ELEMENTS (classes); i++)
          gtk_widget_remove_css_class (dot, classes[i]);
        gtk_widget_add_css_class (dot, trb_member_item_get_status_class (item));
        text = g_strdup (trb_member_item_get_status (item));
      }
      break;
    case COLUMN_RATIO:
      {
        double r = trb_member_item_get_ratio (item);

        text = isnan (r) ? g_strdup ("—") : g_strdup_printf ("%.2f", r);
      }
      break;
    case COLUMN_GOVERNING:
      text = g_strdup (trb_member_item_get_governing (item));
      break;
    case COLUMN_FLOOR:
      text = g_strdup (trb_member_item_get_floor (item));
      break;
    default:
      break;
    }
  gtk_label_set_text (GTK_LABEL (label), text);
}

/* A cell shows its row and follows it while it is on the screen. */
static void
bind_label (GtkSignalListItemFactory *factory,
            GtkListItem              *list_item,
            gpointer                  user_data)
{
  g_object_set_data (G_OBJECT (list_item), "trb-column", user_data);
  show_cell (list_item);
  g_signal_connect_swapped (gtk_list_item_get_item (list_item), "changed",
                            G_CALLBACK (show_cell), list_item);
}

static void
unbind_label (GtkSignalListItemFactory *factory,
              GtkListItem              *list_item,
              gpointer                  user_data)
{
  g_signal_handlers_disconnect_by_func (gtk_list_item_get_item (list_item), show_cell,
                                        list_item);
}

/* Marks sort as people read them: B2 before B10. */
static int
compare_marks (gconstpointer a,
               gconstpointer b,
               gpointer      user_data)
{
  g_autofree char *ka = g_utf8_collate_key_for_filename (trb_member_item_get_mark ((gpointer) a),
                                                         -1);
  g_autofree char *kb = g_utf8_collate_key_for_filename (trb_member_item_get_mark ((gpointer) b),
                                                         -1);

  return strcmp (ka, kb);
}

static GtkColumnViewColumn *
add_column (TrbMemberList *self,
            const char    *title,
            Column         column,
            GtkSorter     *sorter,
            gboolean       expand,
            int            fixed_width)
{
  GtkListItemFactory *factory = gtk_signal_list_item_factory_new ();
  GtkColumnViewColumn *col;

  g_signal_connect (factory, "setup", G_CALLBACK (setup_label), GINT_TO_POINTER (column));
  g_signal_connect (factory, "bind", G_CALLBACK (bind_label), GINT_TO_POINTER (column));
  g_signal_connect (factory, "unbind", G_CALLBACK (unbind_label), GINT_TO_POINTER (column));
  col = gtk_column_view_column_new (title, factory);
  gtk_column_view_column_set_sorter (col, sorter);
  gtk_column_view_column_set_expand (col, expand);
  gtk_column_view_column_set_resizable (col, TRUE);
  if (fixed_width > 0)
    gtk_column_view_column_set_fixed_width (col, fixed_width);
  gtk_column_view_append_column (self->view, col);
  g_object_unref (col);
  g_clear_object (&sorter);
  return col;
}

static GtkSorter *
string_sorter (const char *property)
{
  return GTK_SORTER (gtk_string_sorter_new (gtk_property_expression_new (TRB_TYPE_MEMBER_ITEM,
                                                                         NULL, property)));
}

static gboolean
failing_filter (gpointer item,
                gpointer user_data)
{
  TrbMemberList *self = user_data;

  return !self->show_failing || trb_member_item_get_failing (item);
}

/* ---- object ---------------------------------------------------------------------------------- */

static void
trb_member_list_dispose (GObject *object)
{
  TrbMemberList *self = TRB_MEMBER_LIST (object);

  if (self->document != NULL)
    g_signal_handlers_disconnect_by_data (self->document, self);
  /* the column view lets go of a sorted model as it goes, and the selection may still say its
   * row changed after ours is cleared */
  if (self->selection != NULL)
    g_signal_handlers_disconnect_by_data (self->selection, self);
  gtk_widget_dispose_template (GTK_WIDGET (self), TRB_TYPE_MEMBER_LIST);
  g_clear_object (&self->floor_column);
  g_clear_object (&self->document);
  g_clear_object (&self->selection);
  g_clear_pointer (&self->rows, g_ptr_array_unref);

  G_OBJECT_CLASS (trb_member_list_parent_class)->dispose (object);
}

static void
trb_member_list_finalize (GObject *object)
{
  TrbMemberList *self = TRB_MEMBER_LIST (object);

  g_free (self->summary);

  G_OBJECT_CLASS (trb_member_list_parent_class)->finalize (object);
}

static void
trb_member_list_get_property (GObject    *object,
                              guint       prop_id,
                              GValue     *value,
                              GParamSpec *pspec)
{
  TrbMemberList *self = TRB_MEMBER_LIST (object);

  switch (prop_id)
    {
    case PROP_SHOW_FAILING:
      g_value_set_boolean (value, self->show_failing);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_member_list_set_property (GObject      *object,
                              guint         prop_id,
                              const GValue *value,
                              GParamSpec   *pspec)
{
  TrbMemberList *self = TRB_MEMBER_LIST (object);

  switch (prop_id)
    {
    case PROP_SHOW_FAILING:
      if (self->show_failing != g_value_get_boolean (value))
        {
          self->show_failing = g_value_get_boolean (value);
          self->updating = TRUE;
          gtk_filter_changed (GTK_FILTER (self->failing_filter),
                              self->show_failing ? GTK_FILTER_CHANGE_MORE_STRICT
                                                 : GTK_FILTER_CHANGE_LESS_STRICT);
          self->updating = FALSE;
          select_member (self, self->member, FALSE);
          g_object_notify_by_pspec (object, pspec);
        }
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_member_list_class_init (TrbMemberListClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);
  GtkWidgetClass *widget_class = GTK_WIDGET_CLASS (klass);

  object_class->dispose = trb_member_list_dispose;
  object_class->finalize = trb_member_list_finalize;
  object_class->get_property = trb_member_list_get_property;
  object_class->set_property = trb_member_list_set_property;

  properties[PROP_SHOW_FAILING] =
    g_param_spec_boolean ("show-failing", NULL, NULL, FALSE,
                          G_PARAM_READWRITE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /**
   * TrbMemberList::member-activated:
   * @member: (type gpointer): the #TrbMember of the row picked
   */
  signals[MEMBER_ACTIVATED] =
    g_signal_new ("member-activated", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0,
                  NULL, NULL, NULL, G_TYPE_NONE, 1, G_TYPE_POINTER);

  gtk_widget_class_set_template_from_resource (widget_class,
                                               "/org/trabeate/Trabeate/ui/trb-member-list.ui");
  gtk_widget_class_bind_template_child (widget_class, TrbMemberList, view);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberList, summary_label);
  gtk_widget_class_bind_template_child (widget_class, TrbMemberList, title_label);
}

static void
trb_member_list_init (TrbMemberList *self)
{
  GtkSorter *ratio_sorter;

  gtk_widget_init_template (GTK_WIDGET (self));

  self->store = g_list_store_new (TRB_TYPE_MEMBER_ITEM);
  self->rows = g_ptr_array_new_with_free_func (g_object_unref);
  self->failing_filter = gtk_custom_filter_new (failing_filter, self, NULL);
  self->filtered = gtk_filter_list_model_new (G_LIST_MODEL (self->store),
                                              GTK_FILTER (self->failing_filter));
  self->sorted = gtk_sort_list_model_new (G_LIST_MODEL (self->filtered),
                                          g_object_ref (gtk_column_view_get_sorter (self->view)));
  self->selection = gtk_single_selection_new (G_LIST_MODEL (self->sorted));
  gtk_single_selection_set_autoselect (self->selection, FALSE);
  gtk_single_selection_set_can_unselect (self->selection, TRUE);
  g_signal_connect_swapped (self->selection, "notify::selected", G_CALLBACK (on_selected),
                            self);
  gtk_column_view_set_model (self->view, GTK_SELECTION_MODEL (self->selection));

  ratio_sorter = GTK_SORTER (gtk_numeric_sorter_new (
    gtk_property_expression_new (TRB_TYPE_MEMBER_ITEM, NULL, "ratio")));
  gtk_numeric_sorter_set_sort_order (GTK_NUMERIC_SORTER (ratio_sorter), GTK_SORT_DESCENDING);

  add_column (self, _("Mark"), COLUMN_MARK,
              GTK_SORTER (gtk_custom_sorter_new (compare_marks, NULL, NULL)), FALSE, 80);
  add_column (self, _("Role"), COLUMN_ROLE, string_sorter ("role"), FALSE, 80);
  /* shown when the project has several floors: the list holds every floor's members */
  self->floor_column = g_object_ref (add_column (self, _("Floor"), COLUMN_FLOOR,
                                                 string_sorter ("floor"), FALSE, 100));
  show_floor_column (self, FALSE);
  add_column (self, _("Section"), COLUMN_SECTION, string_sorter ("section"), FALSE, 150);
  add_column (self, _("Status"), COLUMN_STATUS, string_sorter ("status"), FALSE, 130);
  add_column (self, _("Ratio"), COLUMN_RATIO, ratio_sorter, FALSE, 70);
  add_column (self, _("Governing Check"), COLUMN_GOVERNING, string_sorter ("governing"), TRUE,
              -1);
}
