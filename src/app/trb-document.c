/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#ifdef __GLIBC__
#include <malloc.h>
#endif

#include "trb-document.h"
#include "trb-error.h"
#include "trb-project-io.h"

/* Solving. The solve is pure, so it runs in a worker thread on a copy of the project
 * (trb_edit_project_copy(): 3 to 15 ms for ten thousand members, measured) while the editor
 * goes on: a generated floor of ten thousand members with its sections given took 0.3 s to
 * solve on its own and about 1 s beside the editor, and sizing takes longer, where a frame
 * is 16 ms. An edit itself costs the main thread some 10 to 30 ms on that floor (the plan's
 * scene, the rows and panels it touches, these pointers), then the copy. The results point at the copy's members;
 * once in, each is pointed at the project's member of the same mark (or left on the copy's,
 * which lives as long as the results, when the project has none), so that the plan, the list
 * and the panels look them up by the members they show. After every edit the pointers are
 * set again, since an edit may free a member the results pointed at; the results stand until
 * the next solve replaces them. The solves go through one TrbSolveCache: each re-solves only
 * the members whose input the edits since the last changed, and reuses the frame of a plan
 * that did not change (one girder's section on a floor of 2,000 members: one member solved
 * and no frame, a few milliseconds in all). */
struct _TrbDocument
{
  GObject           parent_instance;

  GFile            *file;
  TrbProject       *project;
  TrbEditHistory   *history;
  gboolean          touched;        /* edited or saved since it was made */
  gboolean          in_group;       /* pushes apply now and re-solve at the group's end */
  gboolean          recovered;      /* from a recovery copy: differs from its file until saved */

  guint64           generation;     /* counts the changes to the project */
  gboolean          solving;        /* a worker is solving, or is about to start */
  guint             floor_index;    /* the floor shown */
  GArray           *step_floors;    /* guint: the floor shown at each undo step, oldest first,
                                     * then the redo steps: undo and redo bring it back */
  gboolean          pending;        /* the project changed while it was */
  guint             start_id;       /* idle that copies the project and starts the worker */

  TrbProjectResult *results;
  TrbProject       *results_copy;   /* what results was solved on */
  guint64           results_generation;
  GPtrArray        *copy_members;   /* the copy's member of each result, by index */
  GHashTable       *result_index;   /* const TrbMember * -> const TrbMemberResult * */
  double            solve_time;     /* ms, of the last solve, in the worker */
  /* What the solves so far leave for the next: an edit re-solves only the members whose
   * input it changed (and their frame only when the plan changed). Read and filled by one
   * worker at a time, and freed when none runs. */
  TrbSolveCache    *cache;
};

typedef struct
{
  TrbProject       *copy;
  TrbSolveCache    *cache;          /* the document's */
  TrbProjectResult *results;
  guint64           generation;
  double            ms;
  gboolean          first;          /* the document's first solve */
} SolveJob;

G_DEFINE_FINAL_TYPE (TrbDocument, trb_document, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_FILE,
  PROP_TITLE,
  PROP_MODIFIED,
  PROP_CAN_UNDO,
  PROP_CAN_REDO,
  PROP_SOLVING,
  PROP_FLOOR_INDEX,
  N_PROPS
};

enum {
  CHANGED,
  SOLVED,
  N_SIGNALS
};

static GParamSpec *properties[N_PROPS];
static guint signals[N_SIGNALS];

static void
solve_job_free (gpointer data)
{
  SolveJob *job = data;

  g_clear_pointer (&job->results, trb_project_result_free);
  g_clear_pointer (&job->copy, trb_edit_project_copy_free);
  g_free (job);
}

static void
clear_results (TrbDocument *self)
{
  g_hash_table_remove_all (self->result_index);
  g_ptr_array_set_size (self->copy_members, 0);
  g_clear_pointer (&self->results, trb_project_result_free);
  g_clear_pointer (&self->results_copy, trb_edit_project_copy_free);
}

static void
trb_document_dispose (GObject *object)
{
  TrbDocument *self = TRB_DOCUMENT (object);

  /* no worker is running: each holds a reference until it is done */
  g_clear_handle_id (&self->start_id, g_source_remove);
  if (self->result_index != NULL)
    clear_results (self);
  g_clear_pointer (&self->result_index, g_hash_table_unref);
  g_clear_pointer (&self->copy_members, g_ptr_array_unref);
  g_clear_pointer (&self->step_floors, g_array_unref);
  /* the history holds members taken out of the project: free it while the project lives */
  g_clear_pointer (&self->history, trb_edit_history_free);
  g_clear_pointer (&self->cache, trb_solve_cache_free);
  g_clear_pointer (&self->project, trb_project_free);
  g_clear_object (&self->file);

  G_OBJECT_CLASS (trb_document_parent_class)->dispose (object);
}

static void
trb_document_get_property (GObject    *object,
                           guint       prop_id,
                           GValue     *value,
                           GParamSpec *pspec)
{
  TrbDocument *self = TRB_DOCUMENT (object);

  switch (prop_id)
    {
    case PROP_FILE:
      g_value_set_object (value, self->file);
      break;
    case PROP_TITLE:
      g_value_take_string (value, trb_document_dup_title (self));
      break;
    case PROP_MODIFIED:
      g_value_set_boolean (value, trb_document_get_modified (self));
      break;
    case PROP_CAN_UNDO:
      g_value_set_boolean (value, trb_document_get_can_undo (self));
      break;
    case PROP_CAN_REDO:
      g_value_set_boolean (value, trb_document_get_can_redo (self));
      break;
    case PROP_SOLVING:
      g_value_set_boolean (value, self->solving);
      break;
    case PROP_FLOOR_INDEX:
      g_value_set_uint (value, trb_document_get_floor_index (self));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_document_class_init (TrbDocumentClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->dispose = trb_document_dispose;
  object_class->get_property = trb_document_get_property;

  properties[PROP_FILE] =
    g_param_spec_object ("file", NULL, NULL, G_TYPE_FILE,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_TITLE] =
    g_param_spec_string ("title", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_MODIFIED] =
    g_param_spec_boolean ("modified", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_CAN_UNDO] =
    g_param_spec_boolean ("can-undo", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_CAN_REDO] =
    g_param_spec_boolean ("can-redo", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_SOLVING] =
    g_param_spec_boolean ("solving", NULL, NULL, FALSE,
                          G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  /* which of the project's floors the editor shows: trb_document_set_floor_index() */
  properties[PROP_FLOOR_INDEX] =
    g_param_spec_uint ("floor-index", NULL, NULL, 0, G_MAXUINT, 0,
                       G_PARAM_READABLE | G_PARAM_EXPLICIT_NOTIFY | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /**
   * TrbDocument::changed:
   *
   * The model changed: an edit, an undo or a redo. The results stand, pointed at the members
   * as they are now, until ::solved says new ones are in.
   */
  signals[CHANGED] =
    g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 0);
  /**
   * TrbDocument::solved:
   *
   * New results are in.
   */
  signals[SOLVED] =
    g_signal_new ("solved", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL,
                  NULL, G_TYPE_NONE, 0);
}

static void
trb_document_init (TrbDocument *self)
{
  self->step_floors = g_array_new (FALSE, FALSE, sizeof (guint));
  self->result_index = g_hash_table_new (NULL, NULL);
  self->copy_members = g_ptr_array_new ();
  self->cache = trb_solve_cache_new ();
}

/* Points every result at the project's member, floor, column and wall it is about, where the
 * project has it, else at the copy's (see the comment on TrbDocument). */
static void
point_results (TrbDocument *self)
{
  TrbProjectResult *r = self->results;
  TrbProject *copy = self->results_copy;

  if (r == NULL)
    return;
  g_hash_table_remove_all (self->result_index);
  r->project = self->project;
  for (guint i = 0; i < r->members->len; i++)
    {
      TrbMemberResult *mr = g_ptr_array_index (r->members, i);
      const TrbMember *original = g_ptr_array_index (self->copy_members, i);
      TrbMember *live = trb_project_find_member (self->project, original->id);

      mr->member = live != NULL ? live : original;
      if (live != NULL)
        g_hash_table_insert (self->result_index, live, mr);
    }

  for (guint f = 0; r->floors != NULL && f < r->floors->len && f < copy->floors->len; f++)
    {
      TrbFloorResult *fr = g_ptr_array_index (r->floors, f);
      TrbFloor *was = g_ptr_array_index (copy->floors, f);
      TrbFloor *now = f < self->project->floors->len ? g_ptr_array_index (self->project->floors,
                                                                           f) : NULL;
      gboolean same_columns = now != NULL && now->columns->len == was->columns->len;
      gboolean same_walls = now != NULL && now->walls->len == was->walls->len;

      fr->floor = now != NULL ? now : was;
      for (guint i = 0; fr->columns != NULL && i < fr->columns->len; i++)
        {
          TrbColumnResult *cr = &g_array_index (fr->columns, TrbColumnResult, i);

          cr->floor = same_columns ? now : was;
          cr->column = g_ptr_array_index (same_columns ? now->columns : was->columns, i);
        }
      for (guint i = 0; fr->walls != NULL && i < fr->walls->len; i++)
        {
          TrbWallResult *wr = &g_array_index (fr->walls, TrbWallResult, i);

          wr->floor = same_walls ? now : was;
          wr->wall = g_ptr_array_index (same_walls ? now->walls : was->walls, i);
        }
    }
}

/* Memory freed but kept by malloc handed back to the system: the loader's parse tree, freed
 * once the project is made, leaves its pages in the main thread's arena, which the worker's
 * solve (another arena) does not reuse; the first solve's frame leaves its scratch in the
 * worker's. 1 to 6 MB of the editor's peak on 10,000 members (docs/performance.md, Editing).
 * Not after every solve: an edit's solve frees little, and the walk takes its time. */
static void
release_load_memory (void)
{
#ifdef __GLIBC__
  malloc_trim (0);
#endif
}

static void request_solve (TrbDocument *self);

static void
solve_thread (GTask        *task,
              gpointer      source,
              gpointer      task_data,
              GCancellable *cancellable)
{
  SolveJob *job = task_data;
  gint64 t0 = g_get_monotonic_time ();

  job->results = trb_solve_project_cached (job->copy, NULL, job->cache);
  job->ms = (g_get_monotonic_time () - t0) / 1000.0;
  if (job->first)
    release_load_memory ();
  g_task_return_boolean (task, TRUE);
}

static void
install (TrbDocument *self,
         SolveJob    *job)
{
  /* the old results go; everything that showed them hears ::solved at once */
  clear_results (self);
  self->results = g_steal_pointer (&job->results);
  self->results_copy = g_steal_pointer (&job->copy);
  self->results_generation = job->generation;
  self->solve_time = job->ms;
  for (guint i = 0; i < self->results->members->len; i++)
    g_ptr_array_add (self->copy_members,
                     (gpointer) ((TrbMemberResult *) g_ptr_array_index (self->results->members,
                                                                        i))->member);
  point_results (self);
  g_debug ("solved %u members in %.1f ms", self->project->members->len, self->solve_time);
}

static void
solve_done (GObject      *source,
            GAsyncResult *result,
            gpointer      user_data)
{
  g_autoptr(TrbDocument) self = user_data;
  SolveJob *job = g_task_get_task_data (G_TASK (result));

  self->solving = FALSE;
  /* results of a project that has changed since are not shown: the new one is solved */
  if (job->generation == self->generation)
    {
      install (self, job);
      g_signal_emit (self, signals[SOLVED], 0);
    }
  if (self->pending || job->generation != self->generation)
    {
      self->pending = FALSE;
      request_solve (self);
    }
  if (!self->solving)
    g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SOLVING]);
}

/* Copies the project and hands the copy to a worker. From an idle, so that edits in a burst
 * share one copy; of the default priority, not below the redraws: the spinner that says a
 * solve is on its way animates every frame, and where a frame takes longer than the frame
 * clock's interval (software rendering, as under a virtual X server) an idle of lower
 * priority never ran, so the project was never solved. */
static gboolean
start_solve (gpointer user_data)
{
  TrbDocument *self = user_data;
  g_autoptr(GTask) task = NULL;
  SolveJob *job;

  self->start_id = 0;
  job = g_new0 (SolveJob, 1);
  job->copy = trb_edit_project_copy (self->project);
  job->cache = self->cache;
  job->generation = self->generation;
  job->first = self->results == NULL;
  task = g_task_new (NULL, NULL, solve_done, g_object_ref (self));
  g_task_set_task_data (task, job, solve_job_free);
  g_task_run_in_thread (task, solve_thread);
  return G_SOURCE_REMOVE;
}

static void
request_solve (TrbDocument *self)
{
  if (self->solving)
    {
      /* the start still to come copies the project as it will be then */
      if (self->start_id == 0)
        self->pending = TRUE;
      return;
    }
  self->solving = TRUE;
  self->start_id = g_idle_add_full (G_PRIORITY_DEFAULT, start_solve, self, NULL);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_SOLVING]);
}

static TrbDocument *
document_new_for_project (TrbProject *project,
                          GFile      *file)
{
  TrbDocument *self = g_object_new (TRB_TYPE_DOCUMENT, NULL);

  self->project = project;
  self->file = file != NULL ? g_object_ref (file) : NULL;
  self->history = trb_edit_history_new (project);
  request_solve (self);
  return self;
}

/**
 * trb_document_new:
 * @defaults: (nullable): the settings of a new project (copied), or %NULL for the project
 *   defaults
 *
 * Returns: (transfer full): an untitled project with one empty floor to draw on.
 */
TrbDocument *
trb_document_new (const TrbSettings *defaults)
{
  TrbProject *project = trb_project_new ();

  if (defaults != NULL)
    {
      trb_settings_clear (&project->settings);
      project->settings = *defaults;
      project->settings.steel_grade = g_strdup (defaults->steel_grade);
    }
  trb_project_add_floor (project, trb_floor_new (_("Floor 1")));
  return document_new_for_project (project, NULL);
}

/**
 * trb_document_new_for_file:
 * @file: a project file
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the project loaded and solved, or %NULL with the
 *   loader's error (which names the file and line).
 */
TrbDocument *
trb_document_new_for_file (GFile   *file,
                           GError **error)
{
  g_autofree char *path = NULL;
  TrbProject *project;

  g_return_val_if_fail (G_IS_FILE (file), NULL);

  path = g_file_get_path (file);
  if (path == NULL)
    {
      g_autofree char *uri = g_file_get_uri (file);

      g_set_error (error, TRB_ERROR, TRB_ERROR_IO, _("%s: only local files can be opened"),
                   uri);
      return NULL;
    }
  project = trb_project_load_file (path, error);
  release_load_memory ();
  if (project == NULL)
    return NULL;
  return document_new_for_project (project, file);
}

/**
 * trb_document_new_for_recovery:
 * @recovery: a recovery copy written by the autosave (trb-autosave.c)
 * @original: (nullable): the project file the copy was made for, or %NULL for a project never
 *   saved
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the project of @recovery, which takes @original as its
 *   file and counts as modified until it is saved; %NULL with the loader's error.
 */
TrbDocument *
trb_document_new_for_recovery (GFile   *recovery,
                               GFile   *original,
                               GError **error)
{
  g_autofree char *path = NULL;
  TrbDocument *self;
  TrbProject *project;

  g_return_val_if_fail (G_IS_FILE (recovery), NULL);
  g_return_val_if_fail (original == NULL || G_IS_FILE (original), NULL);

  path = g_file_get_path (recovery);
  g_return_val_if_fail (path != NULL, NULL);
  project = trb_project_load_file (path, error);
  release_load_memory ();
  if (project == NULL)
    return NULL;
  self = document_new_for_project (project, original);
  self->recovered = TRUE;
  self->touched = TRUE;
  return self;
}

/**
 * trb_document_save:
 * @self: a document
 * @file: (nullable): where to save; %NULL for the document's own file
 * @error: return location for a #GError
 *
 * Saves atomically; on success the document takes @file as its own and is no longer modified.
 */
gboolean
trb_document_save (TrbDocument  *self,
                   GFile        *file,
                   GError      **error)
{
  g_autofree char *path = NULL;

  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);

  if (file == NULL)
    file = self->file;
  g_return_val_if_fail (G_IS_FILE (file), FALSE);

  path = g_file_get_path (file);
  if (path == NULL)
    {
      g_autofree char *uri = g_file_get_uri (file);

      g_set_error (error, TRB_ERROR, TRB_ERROR_IO, _("%s: only local files can be saved"), uri);
      return FALSE;
    }
  if (!trb_project_save_file (self->project, path, error))
    return FALSE;

  if (file != self->file)
    {
      g_set_object (&self->file, file);
      g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_FILE]);
    }
  trb_edit_history_mark_saved (self->history);
  self->recovered = FALSE;
  self->touched = TRUE;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_TITLE]);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_MODIFIED]);
  return TRUE;
}

GFile *
trb_document_get_file (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);
  return self->file;
}

/**
 * trb_document_dup_title:
 * @self: a document
 *
 * Returns: (transfer full): the file's name, or "Untitled Project".
 */
char *
trb_document_dup_title (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);

  if (self->file != NULL)
    return g_file_get_basename (self->file);
  return g_strdup (_("Untitled Project"));
}

gboolean
trb_document_get_modified (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);
  return self->recovered || trb_edit_history_is_modified (self->history);
}

/**
 * trb_document_is_untouched:
 * @self: a document
 *
 * Returns: %TRUE for a new project nobody has drawn in or saved: opening a file may replace
 *   it in its window.
 */
gboolean
trb_document_is_untouched (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);
  return self->file == NULL && !self->touched
         && trb_edit_history_get_n_undo (self->history) == 0
         && trb_edit_history_get_n_redo (self->history) == 0;
}

TrbProject *
trb_document_get_project (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);
  return self->project;
}

/**
 * trb_document_get_floor:
 * @self: a document
 *
 * Returns: (transfer none) (nullable): the floor the editor shows, or %NULL for a project of
 *   standalone beams only.
 */
TrbFloor *
trb_document_get_floor (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);

  if (self->project->floors->len == 0)
    return NULL;
  return g_ptr_array_index (self->project->floors, trb_document_get_floor_index (self));
}

/**
 * trb_document_get_floor_index:
 * @self: a document
 *
 * Returns: the index in the project's floors of the floor the editor shows (0 when there are
 *   none).
 */
guint
trb_document_get_floor_index (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), 0);

  /* no edit adds or removes a floor; clamped all the same */
  return MIN (self->floor_index, MAX (self->project->floors->len, 1) - 1);
}

/**
 * trb_document_set_floor_index:
 * @self: a document
 * @index: a floor's index in the project's floors
 *
 * Shows another floor. Not an edit: the project, its results and the history are untouched;
 * the views follow ::notify::floor-index. An index past the last floor is refused.
 */
void
trb_document_set_floor_index (TrbDocument *self,
                              guint        index)
{
  g_return_if_fail (TRB_IS_DOCUMENT (self));
  g_return_if_fail (index < MAX (self->project->floors->len, 1));

  if (index == trb_document_get_floor_index (self))
    return;
  self->floor_index = index;
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_FLOOR_INDEX]);
}

/**
 * trb_document_find_floor:
 * @self: a document
 * @floor: (nullable): a floor of the document's project
 *
 * Returns: @floor's index in the project's floors, or -1 when it is none of them.
 */
int
trb_document_find_floor (TrbDocument    *self,
                         const TrbFloor *floor)
{
  guint index;

  g_return_val_if_fail (TRB_IS_DOCUMENT (self), -1);

  if (floor == NULL || !g_ptr_array_find (self->project->floors, floor, &index))
    return -1;
  return (int) index;
}

const TrbProjectResult *
trb_document_get_results (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);
  return self->results;
}

const TrbMemberResult *
trb_document_lookup_result (TrbDocument     *self,
                            const TrbMember *member)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);
  return g_hash_table_lookup (self->result_index, member);
}

const TrbFloorResult *
trb_document_get_floor_result (TrbDocument *self)
{
  TrbFloor *floor;

  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);

  floor = trb_document_get_floor (self);
  if (floor == NULL || self->results == NULL || self->results->floors == NULL)
    return NULL;
  for (guint i = 0; i < self->results->floors->len; i++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (self->results->floors, i);

      if (fr->floor == floor)
        return fr;
    }
  return NULL;
}

/**
 * trb_document_get_solving:
 * @self: a document
 *
 * Returns: %TRUE while the results are being brought up to date with the project.
 */
gboolean
trb_document_get_solving (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);
  return self->solving;
}

/**
 * trb_document_get_results_current:
 * @self: a document
 *
 * Returns: %TRUE when the results are those of the project as it is now.
 */
gboolean
trb_document_get_results_current (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);
  return self->results != NULL && self->results_generation == self->generation;
}

/**
 * trb_document_get_solve_time:
 * @self: a document
 *
 * Returns: how long the last solve took, in milliseconds.
 */
double
trb_document_get_solve_time (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), 0);
  return self->solve_time;
}

/* A step was pushed (or a group closed): the redo steps are gone, and the last undo step was
 * made on the floor shown. */
static void
record_step_floor (TrbDocument *self)
{
  guint n = trb_edit_history_get_n_undo (self->history);

  g_array_set_size (self->step_floors, n);
  if (n > 0)
    g_array_index (self->step_floors, guint, n - 1) = self->floor_index;
}

/* Before undoing or redoing step @index: show the floor it was made on. */
static void
show_step_floor (TrbDocument *self,
                 guint        index)
{
  if (index < self->step_floors->len
      && g_array_index (self->step_floors, guint, index) < self->project->floors->len)
    trb_document_set_floor_index (self, g_array_index (self->step_floors, guint, index));
}

static void
changed (TrbDocument *self)
{
  self->touched = TRUE;
  self->generation++;
  point_results (self);
  g_signal_emit (self, signals[CHANGED], 0);
  request_solve (self);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_MODIFIED]);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CAN_UNDO]);
  g_object_notify_by_pspec (G_OBJECT (self), properties[PROP_CAN_REDO]);
}

/**
 * trb_document_push:
 * @self: a document
 * @command: (transfer full) (nullable): a command made against the document's project
 *
 * Applies and records @command, then re-solves. %NULL (a refused command) does nothing, so
 * that callers can pass a constructor's result straight in.
 *
 * Returns: %TRUE when a command was applied.
 */
gboolean
trb_document_push (TrbDocument    *self,
                   TrbEditCommand *command)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);

  if (command == NULL)
    return FALSE;
  trb_edit_history_push (self->history, command);
  if (!self->in_group)
    {
      record_step_floor (self);
      changed (self);
    }
  return TRUE;
}

/**
 * trb_document_begin_group:
 * @self: a document
 * @label: what the group does as one step
 *
 * The commands pushed until trb_document_end_group() are one undo step; each is applied as
 * it comes (so the next can be made against it), and the project is re-solved once, at the
 * end.
 */
void
trb_document_begin_group (TrbDocument *self,
                          const char  *label)
{
  g_return_if_fail (TRB_IS_DOCUMENT (self));
  g_return_if_fail (!self->in_group);

  self->in_group = TRUE;
  trb_edit_history_begin_group (self->history, label);
}

void
trb_document_end_group (TrbDocument *self)
{
  g_return_if_fail (TRB_IS_DOCUMENT (self));
  g_return_if_fail (self->in_group);

  self->in_group = FALSE;
  trb_edit_history_end_group (self->history);
  record_step_floor (self);
  changed (self);
}

/**
 * trb_document_cancel_group:
 * @self: a document
 *
 * Reverts what the open group did: the project is as it was at trb_document_begin_group().
 */
void
trb_document_cancel_group (TrbDocument *self)
{
  g_return_if_fail (TRB_IS_DOCUMENT (self));
  g_return_if_fail (self->in_group);

  self->in_group = FALSE;
  trb_edit_history_cancel_group (self->history);
  /* the model is back as it was, but the old results went with the pushes' scene: re-solve */
  changed (self);
}

gboolean
trb_document_undo (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);

  if (!trb_edit_history_can_undo (self->history))
    return FALSE;
  show_step_floor (self, trb_edit_history_get_n_undo (self->history) - 1);
  if (!trb_edit_history_undo (self->history))
    return FALSE;
  changed (self);
  return TRUE;
}

gboolean
trb_document_redo (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);

  if (!trb_edit_history_can_redo (self->history))
    return FALSE;
  show_step_floor (self, trb_edit_history_get_n_undo (self->history));
  if (!trb_edit_history_redo (self->history))
    return FALSE;
  changed (self);
  return TRUE;
}

gboolean
trb_document_get_can_undo (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);
  return trb_edit_history_can_undo (self->history);
}

gboolean
trb_document_get_can_redo (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), FALSE);
  return trb_edit_history_can_redo (self->history);
}

const char *
trb_document_get_undo_label (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);
  return trb_edit_history_get_undo_label (self->history);
}

const char *
trb_document_get_redo_label (TrbDocument *self)
{
  g_return_val_if_fail (TRB_IS_DOCUMENT (self), NULL);
  return trb_edit_history_get_redo_label (self->history);
}
