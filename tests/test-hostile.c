/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Hostile and broken project files: entity bombs, external entities and DTDs, huge and
 * endless files, deep nesting, bad bytes, truncation, absurd quantities, crowds of members,
 * loads and attributes. Each must give a TRB_ERROR with its line, or load and solve to
 * results whose every number is finite; never a crash, a hang, unbounded memory, or a look
 * at any file but the project's own. The limits are those of trb-project-io.h, and
 * docs/reliability.md states them. */

#include "config.h"

#include <errno.h>
#include <fcntl.h>
#include <glib.h>
#include <glib/gstdio.h>
#include <math.h>
#include <string.h>
#include <sys/resource.h>
#include <sys/stat.h>
#include <sys/types.h>
#include <unistd.h>

#include "trb-error.h"
#include "trb-project-io.h"
#include "trb-solve.h"
#include "trb-units.h"

/* A string that must never leave the file it is written in. */
#define SECRET "hostile-secret-5f0c2a91"

/* The sanitizers keep freed memory in quarantine and shadow every byte: peak memory under
 * them says nothing about the loader's own. */
#if defined(__SANITIZE_ADDRESS__)
#define UNDER_ASAN 1
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#define UNDER_ASAN 1
#endif
#endif
#ifndef UNDER_ASAN
#define UNDER_ASAN 0
#endif

/* ------------------------------------------------------------ finiteness of results */

/* The project text being solved, for the message when a number is not finite. */
static const char *current_text;

static void
check_finite (double      v,
              const char *member,
              const char *what)
{
  if (!isfinite (v))
    g_test_message ("member %s: %s = %g is not finite, in:\n%s", member, what, v,
                    current_text != NULL ? current_text : "(not recorded)");
  g_assert_true (isfinite (v));
}

static void
check_extremes (const TrbBeamExtremes *e,
                const char            *member,
                const char            *what)
{
  const double v[] = {
    e->V_max, e->V_max_x, e->V_min, e->V_min_x, e->M_max, e->M_max_x, e->M_min, e->M_min_x,
    e->defl_down, e->defl_down_x, e->defl_up, e->defl_up_x,
  };

  for (guint i = 0; i < G_N_ELEMENTS (v); i++)
    check_finite (v[i], member, what);
}

static void
check_beam_result (const TrbBeamResult *res,
                   const char          *member,
                   const char          *what)
{
  const TrbReaction *reactions;
  const double *breaks;
  guint n;
  double x[17];
  TrbBeamValues values[17];

  check_finite (trb_beam_result_get_length (res), member, what);
  reactions = trb_beam_result_get_reactions (res, &n);
  for (guint i = 0; i < n; i++)
    {
      check_finite (reactions[i].x, member, what);
      check_finite (reactions[i].force, member, what);
      check_finite (reactions[i].moment, member, what);
    }
  breaks = trb_beam_result_get_breaks (res, &n);
  for (guint i = 0; i < n; i++)
    check_finite (breaks[i], member, what);
  trb_beam_result_sample (res, G_N_ELEMENTS (x), x, values);
  for (guint i = 0; i < G_N_ELEMENTS (x); i++)
    {
      check_finite (x[i], member, what);
      check_finite (values[i].V, member, what);
      check_finite (values[i].M, member, what);
      check_finite (values[i].theta, member, what);
      check_finite (values[i].defl, member, what);
    }
}

static void
check_combo_set (const TrbComboSetResult *set,
                 const char              *member)
{
  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);

      check_beam_result (c->result, member, c->name);
      check_extremes (&c->ext, member, c->name);
    }
  if (set->envelope.empty)
    return;
  check_extremes (&set->envelope.ext, member, "envelope");
  for (guint i = 0; i < set->envelope.reactions->len; i++)
    {
      const TrbReactionRange *rr = &g_array_index (set->envelope.reactions, TrbReactionRange, i);

      check_finite (rr->x, member, "envelope reaction x");
      check_finite (rr->force_max, member, "envelope reaction");
      check_finite (rr->force_min, member, "envelope reaction");
      check_finite (rr->moment_max, member, "envelope reaction moment");
      check_finite (rr->moment_min, member, "envelope reaction moment");
    }
}

/* Every number of a member's results is finite, unless its status says the analysis could
 * not be made (error, unstable): then the message says why. A ratio of NaN means "not
 * checked" (trb-solve.h), and only that; a ratio of inf, a zero capacity. */
static void
check_member_result (const TrbMemberResult *r)
{
  const char *id = r->member->id;
  gboolean zero_capacity = FALSE;

  trb_member_result_complete (r);
  g_assert_true (r->status <= TRB_STATUS_ERROR);
  if (r->status != TRB_STATUS_PASS)
    {
      g_assert_nonnull (r->message);
      g_assert_true (g_utf8_validate (r->message, -1, NULL));
    }
  if (r->status == TRB_STATUS_ERROR || r->status == TRB_STATUS_UNSTABLE)
    return;

  if (r->analysed)
    {
      check_finite (r->E, id, "E");
      check_finite (r->I, id, "I");
      check_finite (r->self_weight, id, "self-weight");
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          if (r->cases[c] == NULL)
            continue;
          check_beam_result (r->cases[c], id, "case");
          check_extremes (&r->case_ext[c], id, "case extremes");
        }
      check_combo_set (&r->strength, id);
      check_combo_set (&r->live, id);
      check_combo_set (&r->total, id);
      for (guint i = 0; r->bearings != NULL && i < r->bearings->len; i++)
        {
          const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, i);

          check_finite (b->x, id, "bearing position");
          for (guint c = 0; c < TRB_N_CASES; c++)
            check_finite (b->force[c], id, "bearing force");
        }
    }

  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, i);

      if (isnan (ck->ratio))
        continue;
      check_finite (ck->demand, id, ck->name);
      check_finite (ck->capacity, id, ck->name);
      /* a zero capacity under a demand is a failure of ratio inf (trb_check_set()) */
      if (ck->capacity == 0 && ck->demand != 0)
        {
          g_assert_cmpfloat (ck->ratio, ==, INFINITY);
          zero_capacity = TRUE;
        }
      else
        check_finite (ck->ratio, id, ck->name);
    }
  if (!isnan (r->ratio) && !(zero_capacity && r->ratio == INFINITY))
    check_finite (r->ratio, id, "ratio");
  for (guint i = 0; i < r->shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, i);

      check_finite (e->weight, id, e->section);
      check_finite (e->ratio, id, e->section);
    }
}

/* A floor's totals, column and wall loads and unassigned loads, unless it could not be framed
 * (then its error says why). */
static void
check_floor_result (const TrbFloorResult *fr)
{
  const char *name = fr->floor->name != NULL ? fr->floor->name : "(floor)";

  if (fr->error != NULL)
    {
      g_assert_true (g_utf8_validate (fr->error, -1, NULL));
      return;
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      check_finite (fr->applied[c], name, "applied");
      check_finite (fr->reactions[c], name, "reactions");
      check_finite (fr->supports[c], name, "supports");
      check_finite (fr->not_carried[c], name, "not carried");
    }
  for (guint i = 0; i < fr->columns->len; i++)
    {
      const TrbColumnResult *col = &g_array_index (fr->columns, TrbColumnResult, i);

      for (guint c = 0; c < TRB_N_CASES; c++)
        check_finite (col->force[c], name, "column load");
      check_finite (col->live_reduced, name, "column live load reduced");
    }
  for (guint i = 0; i < fr->walls->len; i++)
    {
      const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);

      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          check_finite (w->force[c], name, "wall load");
          for (guint k = 0; k < w->loads[c]->len; k++)
            {
              const TrbLoad *l = &g_array_index (w->loads[c], TrbLoad, k);

              check_finite (l->a, name, "wall load position");
              check_finite (l->w1, name, "wall load");
            }
        }
    }
  for (guint i = 0; i < fr->unassigned->len; i++)
    {
      const TrbUnassignedLoad *u = &g_array_index (fr->unassigned, TrbUnassignedLoad, i);

      check_finite (u->length, name, "unassigned length");
      check_finite (u->force, name, "unassigned load");
    }
}

static void
solve_and_check (const TrbProject *project)
{
  TrbSolveOptions options;
  g_autoptr(TrbProjectResult) pr = NULL;

  /* the default solve makes no shortlist: ask for one so its numbers are checked too */
  trb_solve_options_init (&options);
  options.shortlist_max = TRB_SHORTLIST_DEFAULT;
  pr = trb_solve_project_full (project, &options);

  g_assert_cmpuint (pr->members->len, ==, project->members->len);
  for (guint i = 0; i < pr->members->len; i++)
    check_member_result (g_ptr_array_index (pr->members, i));
  g_assert_cmpuint (pr->floors->len, ==, project->floors->len);
  for (guint i = 0; i < pr->floors->len; i++)
    check_floor_result (g_ptr_array_index (pr->floors, i));
}

/* ------------------------------------------------------------ loading with checks */

static guint
count_lines (const char *data,
             gsize       length)
{
  guint n = 1;

  for (gsize i = 0; i < length; i++)
    if (data[i] == '\n')
      n++;
  return n;
}

/* The line a message gives after "name:", or 0 when it gives none. */
static int
message_line (const char *message,
              const char *name)
{
  const char *p;
  gint64 line;
  char *end = NULL;

  g_assert_true (g_str_has_prefix (message, name));
  p = message + strlen (name);
  if (*p != ':' || !g_ascii_isdigit (p[1]))
    return 0;
  line = g_ascii_strtoll (p + 1, &end, 10);
  g_assert_true (*end == ':');
  return (int) line;
}

/* A failure is a TRB_ERROR whose message is valid UTF-8, names the file and, but for an I/O
 * error, gives a line of the file. */
static void
check_failure (const GError *error,
               const char   *name,
               const char   *data,
               gsize         length)
{
  int line;

  g_assert_nonnull (error);
  g_assert_true (error->domain == TRB_ERROR);
  g_assert_true (g_utf8_validate (error->message, -1, NULL));
  g_assert_false (strstr (error->message, SECRET) != NULL);
  line = message_line (error->message, name);
  if (error->code != TRB_ERROR_IO)
    {
      if (line < 1)
        g_test_message ("no line in: %s", error->message);
      g_assert_cmpint (line, >=, 1);
      if (data != NULL)
        g_assert_cmpint (line, <=, (int) count_lines (data, length));
    }
}

/* Loads from memory: either a TRB_ERROR of the form above (returned in error), or a project
 * that solves to finite results. */
static TrbProject *
load_checked (const char  *data,
              gsize        length,
              GError     **error)
{
  TrbProject *p = trb_project_load_data (data, length, "hostile", error);

  current_text = length < 4096 ? data : NULL;

  if (p == NULL)
    {
      check_failure (*error, "hostile", data, length);
      return NULL;
    }
  g_assert_no_error (*error);
  solve_and_check (p);
  return p;
}

static void
assert_loads (const char *data)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (data, strlen (data), &error);

  g_assert_no_error (error);
  g_assert_nonnull (p);
}

static void
assert_refused (const char *data,
                gsize       length,
                TrbError    code,
                int         line,
                const char *fragment)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (data, length, &error);

  if (p != NULL)
    g_test_message ("loaded, but expected: %s", fragment);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, (int) code);
  if (line > 0)
    g_assert_cmpint (message_line (error->message, "hostile"), ==, line);
  if (strstr (error->message, fragment) == NULL)
    g_test_message ("\"%s\" does not say \"%s\"", error->message, fragment);
  g_assert_nonnull (strstr (error->message, fragment));
}

static char *
data_path (const char *name)
{
  return g_test_build_filename (G_TEST_DIST, "data", "hostile", name, NULL);
}

static char *
read_data (const char *name,
           gsize      *length)
{
  g_autofree char *path = data_path (name);
  g_autoptr(GError) error = NULL;
  char *text = NULL;

  g_file_get_contents (path, &text, length, &error);
  g_assert_no_error (error);
  return text;
}

/* ------------------------------------------------------------ files that must not be read */

/* A folder of its own for each case, removed afterwards. */
static char *
make_temp_dir (void)
{
  g_autoptr(GError) error = NULL;
  char *dir = g_dir_make_tmp ("trb-hostile-XXXXXX", &error);

  g_assert_no_error (error);
  return dir;
}

static void
remove_temp_dir (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  while (d != NULL && (name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      g_assert_cmpint (g_unlink (path), ==, 0);
    }
  g_assert_cmpint (g_rmdir (dir), ==, 0);
}

static void
write_file (const char *dir,
            const char *name,
            const char *data,
            gssize      length)
{
  g_autofree char *path = g_build_filename (dir, name, NULL);
  g_autoptr(GError) error = NULL;

  g_file_set_contents (path, data, length, &error);
  g_assert_no_error (error);
}

typedef struct
{
  char     *path;
  GError   *error;
  gboolean  loaded;
  gint      done;   /* atomic */
} LoadJob;

static gpointer
load_job_run (gpointer data)
{
  LoadJob *job = data;
  g_autoptr(TrbProject) p = trb_project_load_file (job->path, &job->error);

  job->loaded = p != NULL;
  if (p != NULL)
    solve_and_check (p);
  g_atomic_int_set (&job->done, 1);
  return NULL;
}

/* Loads dir/project from a thread while every name in bait is a named pipe in dir. Opening a
 * pipe for reading blocks until someone writes: a loader that tried to read one would still be
 * waiting after some seconds. Then this side opens the pipe for writing without blocking, which
 * succeeds only when a reader is waiting; it hands over the secret to let the loader go, and the
 * case fails. Otherwise the loader must have finished, and its message must not hold the
 * secret (nor, for a pipe it never read, could it). */
static void
load_beside_pipes (const char         *dir,
                   const char         *project,
                   const char * const *bait,
                   gboolean            expect_loaded)
{
  LoadJob job = { g_build_filename (dir, project, NULL), NULL, FALSE, 0 };
  GThread *thread;
  gint64 deadline;
  gboolean opened = FALSE;

  for (guint i = 0; bait[i] != NULL; i++)
    {
      g_autofree char *fifo = g_build_filename (dir, bait[i], NULL);

      g_assert_cmpint (mkfifo (fifo, 0600), ==, 0);
    }

  thread = g_thread_new ("load", load_job_run, &job);
  /* generous, for a loaded machine and the sanitizers: a clean load takes milliseconds */
  deadline = g_get_monotonic_time () + 10 * G_TIME_SPAN_SECOND;
  while (!g_atomic_int_get (&job.done) && g_get_monotonic_time () < deadline)
    g_usleep (10 * 1000);

  for (guint i = 0; bait[i] != NULL; i++)
    {
      g_autofree char *fifo = g_build_filename (dir, bait[i], NULL);
      int fd = open (fifo, O_WRONLY | O_NONBLOCK);

      if (fd >= 0)
        {
          g_test_message ("the loader opened %s", bait[i]);
          opened = TRUE;
          g_assert_cmpint (write (fd, SECRET, strlen (SECRET)), ==, (int) strlen (SECRET));
          close (fd);
        }
      else
        g_assert_cmpint (errno, ==, ENXIO);
    }
  g_thread_join (thread);

  g_assert_false (opened);
  g_assert_true (job.loaded == expect_loaded);
  if (!job.loaded)
    check_failure (job.error, job.path, NULL, 0);
  g_clear_error (&job.error);
  g_free (job.path);
}

/* The command line, as a user would run it: trabeate-cli check FILE, and with --json. Its
 * output and messages must not hold the secret; exit 2 is bad input, 0 and 1 are results
 * (docs/cli.md). */
static void
cli_never_shows_secret (const char *path,
                        int         expect_exit)
{
  g_autofree char *cli = g_test_build_filename (G_TEST_BUILT, "..", "src", "cli",
                                                "trabeate-cli", NULL);
  const char *flags[] = { NULL, "--json" };

  if (!g_file_test (cli, G_FILE_TEST_IS_EXECUTABLE))
    {
      g_test_message ("no trabeate-cli at %s: the command is not tried", cli);
      return;
    }
  for (guint i = 0; i < G_N_ELEMENTS (flags); i++)
    {
      const char *argv[] = { cli, "check", path, flags[i], NULL };
      g_autofree char *out = NULL;
      g_autofree char *err = NULL;
      g_autoptr(GError) error = NULL;
      int status = 0;

      g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL, &out, &err,
                    &status, &error);
      g_assert_no_error (error);
      g_assert_null (strstr (out, SECRET));
      g_assert_null (strstr (err, SECRET));
      g_assert_true (WIFEXITED (status));
      if (expect_exit == 2)
        g_assert_cmpint (WEXITSTATUS (status), ==, 2);
      else
        g_assert_cmpint (WEXITSTATUS (status), <=, 1);
    }
}

/* Each committed file names something beside it: "secret.txt" and friends. First with a plain
 * file holding the secret (the messages of the loader and the command must not show it), then
 * with named pipes (the loader must not even open them). */
typedef struct
{
  const char *file;        /* in tests/data/hostile */
  const char *bait[4];     /* the names it points at, created beside it */
  gboolean    loads;       /* TRUE when the file is a clean project that ignores them */
  TrbError    code;        /* else the error */
  int         line;
} BaitCase;

static const BaitCase bait_cases[] = {
  { "entity-external.trabeate", { "secret.txt", NULL }, FALSE, TRB_ERROR_PARSE, 2 },
  { "entity-parameter.trabeate", { "secret.txt", NULL }, FALSE, TRB_ERROR_PARSE, 2 },
  { "dtd-external.trabeate", { "secret.dtd", NULL }, FALSE, TRB_ERROR_PARSE, 2 },
  { "dtd-public.trabeate", { "secret.dtd", NULL }, FALSE, TRB_ERROR_PARSE, 2 },
  { "xinclude.trabeate", { "secret.txt", NULL }, FALSE, TRB_ERROR_INVALID, 4 },
  { "stylesheet.trabeate", { "secret.xsl", NULL }, TRUE, 0, 0 },
  { "schema-location.trabeate", { "secret.xsd", NULL }, FALSE, TRB_ERROR_INVALID, 3 },
  { "sections-dot-slash.trabeate", { "secret.csv", NULL }, FALSE, TRB_ERROR_INVALID, 4 },
  { "sections-parent.trabeate", { "secret.csv", NULL }, FALSE, TRB_ERROR_INVALID, 4 },
  { "sections-absolute.trabeate", { "secret.csv", NULL }, FALSE, TRB_ERROR_INVALID, 4 },
};

static void
test_bait (gconstpointer data)
{
  const BaitCase *bc = data;
  g_autofree char *dir = make_temp_dir ();
  g_autofree char *path = g_build_filename (dir, "project.trabeate", NULL);
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  gsize length;

  text = read_data (bc->file, &length);
  g_assert_null (strstr (text, SECRET));
  write_file (dir, "project.trabeate", text, length);

  /* a plain file holding the secret */
  for (guint i = 0; bc->bait[i] != NULL; i++)
    write_file (dir, bc->bait[i], SECRET "\n", -1);
  p = trb_project_load_file (path, &error);
  if (bc->loads)
    {
      g_assert_no_error (error);
      g_assert_nonnull (p);
      solve_and_check (p);
    }
  else
    {
      g_assert_null (p);
      g_assert_error (error, TRB_ERROR, (int) bc->code);
      check_failure (error, path, text, length);
      g_assert_cmpint (message_line (error->message, path), ==, bc->line);
    }
  cli_never_shows_secret (path, bc->loads ? 0 : 2);
  for (guint i = 0; bc->bait[i] != NULL; i++)
    {
      g_autofree char *bait = g_build_filename (dir, bc->bait[i], NULL);

      g_assert_cmpint (g_unlink (bait), ==, 0);
    }

  /* named pipes in their place */
  load_beside_pipes (dir, "project.trabeate", bc->bait, bc->loads);
  remove_temp_dir (dir);
}

/* A <sections file="..."> names a file in the project's own folder, and that file is read: but
 * only a plain file. A link could lead anywhere; a pipe or a device would block or never end. */
static void
test_sections_not_plain (void)
{
  g_autofree char *dir = make_temp_dir ();
  g_autofree char *outside = make_temp_dir ();
  g_autofree char *secret = g_build_filename (outside, "secret.csv", NULL);
  g_autofree char *link = g_build_filename (dir, "linked.csv", NULL);
  g_autofree char *path = g_build_filename (dir, "project.trabeate", NULL);
  const char * const pipes[] = { "piped.csv", NULL };
  static const char project_link[] =
    "<trabeate-project format=\"1\">\n"
    "  <sections file=\"linked.csv\"/>\n"
    "</trabeate-project>\n";
  static const char project_pipe[] =
    "<trabeate-project format=\"1\">\n"
    "  <sections file=\"piped.csv\"/>\n"
    "</trabeate-project>\n";
  static const char project_device[] =
    "<trabeate-project format=\"1\">\n"
    "  <sections file=\"zero.csv\"/>\n"
    "</trabeate-project>\n";
  g_autofree char *zero = g_build_filename (dir, "zero.csv", NULL);

  /* a link out of the folder, to a file whose first line would be quoted in a message */
  write_file (outside, "secret.csv", SECRET "\n" SECRET "\n", -1);
  g_assert_cmpint (symlink (secret, link), ==, 0);
  write_file (dir, "project.trabeate", project_link, -1);
  {
    g_autoptr(GError) error = NULL;
    g_autoptr(TrbProject) p = trb_project_load_file (path, &error);

    g_assert_null (p);
    g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
    check_failure (error, path, project_link, sizeof project_link - 1);
    g_assert_cmpint (message_line (error->message, path), ==, 2);
    g_assert_nonnull (strstr (error->message, "not a plain file"));
  }
  cli_never_shows_secret (path, 2);
  g_assert_cmpint (g_unlink (link), ==, 0);

  /* a link to a device that never ends */
  g_assert_cmpint (symlink ("/dev/zero", zero), ==, 0);
  write_file (dir, "project.trabeate", project_device, -1);
  {
    g_autoptr(GError) error = NULL;
    g_autoptr(TrbProject) p = trb_project_load_file (path, &error);

    g_assert_null (p);
    g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
    check_failure (error, path, project_device, sizeof project_device - 1);
  }
  g_assert_cmpint (g_unlink (zero), ==, 0);

  /* a pipe: never opened */
  write_file (dir, "project.trabeate", project_pipe, -1);
  load_beside_pipes (dir, "project.trabeate", pipes, FALSE);

  remove_temp_dir (dir);
  remove_temp_dir (outside);
}

/* ------------------------------------------------------------ entity bombs */

/* The classic ten levels of ten: a billion "lol"s if expanded. Refused at the DOCTYPE, before
 * a single entity is declared. */
static void
test_billion_laughs (void)
{
  gsize length;
  g_autofree char *text = read_data ("billion-laughs.trabeate", &length);

  assert_refused (text, length, TRB_ERROR_PARSE, 2, "DOCTYPE");
}

/* One entity of 64 KiB used 10,000 times: 640 MB without nesting, if expanded. Generated,
 * as it is too big to commit usefully. */
static void
test_quadratic_blowup (void)
{
  g_autoptr(GString) s = g_string_new ("<?xml version=\"1.0\"?>\n"
                                       "<!DOCTYPE trabeate-project [<!ENTITY a \"");
  g_autofree char *text = NULL;

  for (guint i = 0; i < 65536; i++)
    g_string_append_c (s, 'a');
  g_string_append (s, "\">]>\n<trabeate-project format=\"1\">\n  <beam id=\"");
  for (guint i = 0; i < 10000; i++)
    g_string_append (s, "&a;");
  g_string_append (s, "\" length=\"1 m\" material=\"steel\"/>\n</trabeate-project>\n");
  assert_refused (s->str, s->len, TRB_ERROR_PARSE, 2, "DOCTYPE");
}

/* An entity reference with no DOCTYPE at all: undefined, hence malformed. */
static void
test_undeclared_entity (void)
{
  static const char text[] =
    "<trabeate-project format=\"1\">\n"
    "  <beam id=\"&lol9;\" length=\"1 m\" material=\"steel\"/>\n"
    "</trabeate-project>\n";

  assert_refused (text, sizeof text - 1, TRB_ERROR_PARSE, 2, "malformed XML");
}

/* ------------------------------------------------------------ size */

/* 200 MB on disk (a sparse file, so the test writes almost nothing): refused by the size limit,
 * from the first 64 MiB read. */
static void
test_file_200mb (void)
{
  g_autofree char *dir = make_temp_dir ();
  g_autofree char *path = g_build_filename (dir, "big.trabeate", NULL);
  static const char head[] = "<trabeate-project format=\"1\">\n";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  int fd;

  fd = open (path, O_WRONLY | O_CREAT | O_TRUNC, 0600);
  g_assert_cmpint (fd, >=, 0);
  g_assert_cmpint (write (fd, head, sizeof head - 1), ==, (int) sizeof head - 1);
  g_assert_cmpint (ftruncate (fd, (off_t) 200 * 1000 * 1000), ==, 0);
  close (fd);

  p = trb_project_load_file (path, &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "larger than 64 MiB"));
  check_failure (error, path, NULL, 0);
  remove_temp_dir (dir);
}

/* A file that never ends. */
static void
test_endless_device (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  if (!g_file_test ("/dev/zero", G_FILE_TEST_EXISTS))
    {
      g_test_skip ("no /dev/zero");
      return;
    }
  p = trb_project_load_file ("/dev/zero", &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_IO);
  g_assert_nonnull (strstr (error->message, "larger than 64 MiB"));
}

/* One attribute value of 11 MB: libxml2's own limit on a text (10,000,000 bytes, as long as
 * XML_PARSE_HUGE is off) refuses it. */
static void
test_huge_attribute (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n<beam id=\"");

  for (guint i = 0; i < 11 * 1000 * 1000 / 10; i++)
    g_string_append (s, "0123456789");
  g_string_append (s, "\" length=\"1 m\" material=\"steel\"/>\n</trabeate-project>\n");
  assert_refused (s->str, s->len, TRB_ERROR_PARSE, 2, "malformed XML");
}

/* ------------------------------------------------------------ structure */

/* 100,000 elements deep, each on its own line: libxml2 stops at depth 256 (its limit without
 * XML_PARSE_HUGE), on the line of the 257th. */
static void
test_deep_nesting (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  int line;

  for (guint i = 0; i < 100000; i++)
    g_string_append (s, "<beam>\n");
  for (guint i = 0; i < 100000; i++)
    g_string_append (s, "</beam>\n");
  g_string_append (s, "</trabeate-project>\n");

  p = load_checked (s->str, s->len, &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
  line = message_line (error->message, "hostile");
  g_assert_cmpint (line, >=, 256);
  g_assert_cmpint (line, <=, 258);
}

/* Nesting within libxml2's limit reaches the loader, which knows its elements. */
static void
test_nesting_within_limit (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n");

  g_string_append (s, "<beam id=\"B1\" length=\"1 m\" material=\"steel\">\n");
  for (guint i = 0; i < 200; i++)
    g_string_append (s, "<support>\n");
  for (guint i = 0; i < 200; i++)
    g_string_append (s, "</support>\n");
  g_string_append (s, "</beam>\n</trabeate-project>\n");
  assert_refused (s->str, s->len, TRB_ERROR_INVALID, 4, "unknown element <support>");
}

/* A tag of 100,000 attributes: libxml2 would compare each with all before it (hours). Refused
 * before parsing, at the tag's line. */
static void
test_many_attributes (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n<beam\n");
  gint64 start = g_get_monotonic_time ();

  for (guint i = 0; i < 100000; i++)
    g_string_append_printf (s, " a%u=\"\"", i);
  g_string_append (s, "/>\n</trabeate-project>\n");
  assert_refused (s->str, s->len, TRB_ERROR_PARSE, 2, "more than 256 attributes");
  /* not a measurement: the scan is linear and this is a sanity bound only */
  g_assert_cmpint (g_get_monotonic_time () - start, <, 30 * G_TIME_SPAN_SECOND);
}

/* The scan counts "=" only outside quotes, comments and processing instructions: a value full
 * of "=" and ">" is one attribute. */
static void
test_attribute_scan_quotes (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n<!-- ");
  g_autofree char *text = NULL;

  for (guint i = 0; i < 1000; i++)
    g_string_append (s, "a=\"\" ");
  g_string_append (s, "-->\n<?pi ");
  for (guint i = 0; i < 1000; i++)
    g_string_append (s, "a='' ");
  g_string_append (s, "?>\n<beam id=\"");
  for (guint i = 0; i < 1000; i++)
    g_string_append (s, "=&gt;'");
  g_string_append (s, "\" length='1 m' material='steel'/>\n</trabeate-project>\n");
  text = g_string_free (g_steal_pointer (&s), FALSE);
  assert_loads (text);
}

/* More elements and attributes than TRB_PROJECT_MAX_NODES: the parser is stopped there, so
 * the tree never grows past it. */
static void
test_many_elements (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n"
                                       "<beam id=\"B1\" length=\"10 ft\" material=\"steel\">\n");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  /* two nodes each: the element and its attribute */
  for (guint i = 0; i < TRB_PROJECT_MAX_NODES / 2 + 1; i++)
    g_string_append (s, "<brace at=\"1 ft\"/>\n");
  g_string_append (s, "</beam>\n</trabeate-project>\n");
  p = load_checked (s->str, s->len, &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
  g_assert_nonnull (strstr (error->message, "more than 2000000 elements and attributes"));
}

static gint64
peak_rss_bytes (void)
{
  struct rusage ru;

  g_assert_cmpint (getrusage (RUSAGE_SELF, &ru), ==, 0);
  return (gint64) ru.ru_maxrss * 1024;   /* kilobytes on Linux */
}

/* Peak memory of this process, the file's text included: the cases that build big files run
 * in a subprocess of their own so that this is theirs alone. The bound is stated in
 * docs/reliability.md; the sanitizers' own memory makes it meaningless under them. */
static void
check_peak_memory (gint64 bound)
{
  gint64 peak = peak_rss_bytes ();

  g_test_message ("peak memory %" G_GINT64_FORMAT " MiB (bound %" G_GINT64_FORMAT " MiB)",
                  peak >> 20, bound >> 20);
  if (!UNDER_ASAN)
    g_assert_cmpint (peak, <, bound);
}

/* A million members, generated in memory (47 MB of text, within the size limit): refused at
 * TRB_PROJECT_MAX_NODES elements and attributes, long before the millionth, in bounded
 * memory. */
static void
test_million_members_child (void)
{
  g_autoptr(GString) s = g_string_sized_new (48 * 1000 * 1000);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  g_string_append (s, "<trabeate-project format=\"1\">\n");
  for (guint i = 0; i < 1000000; i++)
    g_string_append_printf (s, "<beam id=\"B%07u\" length=\"1 m\" material=\"steel\"/>\n", i);
  g_string_append (s, "</trabeate-project>\n");
  g_assert_cmpuint (s->len, <, TRB_PROJECT_MAX_FILE_SIZE);

  p = load_checked (s->str, s->len, &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
  g_assert_nonnull (strstr (error->message, "more than 2000000 elements and attributes"));
  /* the root and its attribute are 2 nodes, each member 4 (element, id, length, material):
   * 2 + 4 x 500,000 is the first count past 2,000,000, at the 500,000th member, line 500,001 */
  g_assert_cmpint (message_line (error->message, "hostile"), ==, 500001);
  check_peak_memory ((gint64) 1024 << 20);
}

static void
test_million_members (void)
{
  g_test_trap_subprocess ("/trb/hostile/crowds/million-members/subprocess", 0,
                          G_TEST_SUBPROCESS_INHERIT_STDERR);
  g_test_trap_assert_passed ();
}

/* One more member than TRB_PROJECT_MAX_MEMBERS, each small enough to stay within the node
 * limit: refused at the first one too many. */
static void
test_member_limit_child (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  for (guint i = 0; i <= TRB_PROJECT_MAX_MEMBERS; i++)
    g_string_append_printf (s, "<beam id=\"B%u\" length=\"1 m\" material=\"steel\"/>\n", i);
  g_string_append (s, "</trabeate-project>\n");

  p = load_checked (s->str, s->len, &error);
  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_INVALID);
  g_assert_nonnull (strstr (error->message, "more than 100000 members"));
  g_assert_cmpint (message_line (error->message, "hostile"), ==, TRB_PROJECT_MAX_MEMBERS + 2);
  check_peak_memory ((gint64) 512 << 20);
}

static void
test_member_limit (void)
{
  g_test_trap_subprocess ("/trb/hostile/crowds/member-limit/subprocess", 0,
                          G_TEST_SUBPROCESS_INHERIT_STDERR);
  g_test_trap_assert_passed ();
}

/* Exactly TRB_PROJECT_MAX_MEMBERS members with supports and a load: loads, solves, finite. */
static void
test_members_at_limit_child (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  for (guint i = 0; i < TRB_PROJECT_MAX_MEMBERS; i++)
    g_string_append_printf (s, "<beam id=\"B%u\" length=\"10 ft\" material=\"custom\" "
                               "section=\"custom\" E=\"29000 ksi\" I=\"100 in4\">"
                               "<support at=\"0 ft\" type=\"pin\"/>"
                               "<support at=\"10 ft\" type=\"roller\"/>"
                               "<load case=\"D\" type=\"point\" at=\"5 ft\" p=\"1 kip\"/>"
                               "</beam>\n", i);
  g_string_append (s, "</trabeate-project>\n");

  p = load_checked (s->str, s->len, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (p->members->len, ==, TRB_PROJECT_MAX_MEMBERS);
  check_peak_memory ((gint64) 2048 << 20);
}

static void
test_members_at_limit (void)
{
  g_test_trap_subprocess ("/trb/hostile/crowds/members-at-limit/subprocess", 0,
                          G_TEST_SUBPROCESS_INHERIT_STDERR);
  g_test_trap_assert_passed ();
}

/* Duplicate ids: the first pair found is reported at the second, naming the first's line,
 * however far apart and however many members lie between. */
static void
test_duplicate_ids (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n");

  for (guint i = 0; i < 20000; i++)
    g_string_append_printf (s, "<beam id=\"B%u\" length=\"1 m\" material=\"steel\"/>\n", i);
  g_string_append (s, "<beam id=\"B0\" length=\"1 m\" material=\"steel\"/>\n");
  g_string_append (s, "</trabeate-project>\n");
  assert_refused (s->str, s->len, TRB_ERROR_INVALID, 20002,
                  "duplicate beam id \"B0\" (first at line 2)");
}

/* Ids that look alike but are not the same text are different ids. */
static void
test_lookalike_ids (void)
{
  assert_loads ("<trabeate-project format=\"1\">\n"
                "<beam id=\"B1\" length=\"1 m\" material=\"steel\"/>\n"
                "<beam id=\"b1\" length=\"1 m\" material=\"steel\"/>\n"
                "<beam id=\"B1 \" length=\"1 m\" material=\"steel\"/>\n"
                "<beam id=\"\xef\xbc\xa2\x31\" length=\"1 m\" material=\"steel\"/>\n"
                "</trabeate-project>\n");
}

/* ------------------------------------------------------------ bytes */

typedef struct
{
  const char *name;
  const char *data;
  gsize       length;   /* 0: strlen */
  gboolean    loads;
} BytesCase;

#define PROJECT_WITH(id) \
  "<trabeate-project format=\"1\">\n<beam id=\"" id "\" length=\"1 m\" material=\"steel\"/>\n" \
  "</trabeate-project>\n"

static const char utf16le[] =
  "\xff\xfe<\0t\0r\0a\0b\0e\0a\0t\0e\0-\0p\0r\0o\0j\0e\0c\0t\0 \0f\0o\0r\0m\0a\0t\0=\0\"\0"
  "1\0\"\0/\0>\0\n\0";

static const char nul_inside[] =
  "<trabeate-project format=\"1\">\n<beam id=\"B\0\" length=\"1 m\" material=\"steel\"/>\n"
  "</trabeate-project>\n";

static const BytesCase bytes_cases[] = {
  { "invalid-utf8-attribute", PROJECT_WITH ("B\xff"), 0, FALSE },
  { "invalid-utf8-comment",
    "<trabeate-project format=\"1\">\n<!-- \xfe\xff -->\n</trabeate-project>\n", 0, FALSE },
  { "invalid-utf8-name", "<trabeate-project format=\"1\">\n<be\xc3m/>\n</trabeate-project>\n",
    0, FALSE },
  /* libxml2 quotes these bytes as they are in its message (found by fuzz-project) */
  { "invalid-bytes-quoted", "<\xff\xfftrabeate-project format=\"1\">\n</trabeate-project>\n", 0,
    FALSE },
  { "overlong-slash", PROJECT_WITH ("B\xc0\xaf"), 0, FALSE },
  { "surrogate", PROJECT_WITH ("B\xed\xa0\x80"), 0, FALSE },
  { "beyond-unicode", PROJECT_WITH ("B\xf4\x90\x80\x80"), 0, FALSE },
  { "truncated-sequence", PROJECT_WITH ("B\xe6\xa2"), 0, FALSE },
  { "control-character", PROJECT_WITH ("B\x01"), 0, FALSE },
  { "nul-inside", nul_inside, sizeof nul_inside - 1, FALSE },
  { "only-bom", "\xef\xbb\xbf", 0, FALSE },
  { "bom-then-project", "\xef\xbb\xbf" PROJECT_WITH ("B1"), 0, TRUE },
  { "latin1-declared", "<?xml version=\"1.0\" encoding=\"ISO-8859-1\"?>\n"
    PROJECT_WITH ("Poutre \xe9\x74\xe9"), 0, TRUE },
  { "encoding-unknown", "<?xml version=\"1.0\" encoding=\"x-no-such-encoding\"?>\n"
    PROJECT_WITH ("B1"), 0, FALSE },
  { "encoding-lies", "<?xml version=\"1.0\" encoding=\"UTF-16\"?>\n" PROJECT_WITH ("B1"), 0,
    FALSE },
  { "utf16-bom", utf16le, sizeof utf16le - 1, TRUE },
  { "chinese-id", PROJECT_WITH ("\xe6\xa2\x81\x31"), 0, TRUE },
  { "xml-1.1", "<?xml version=\"1.1\"?>\n" PROJECT_WITH ("B1"), 0, TRUE },
  { "binary", "\x7f" "ELF\x02\x01\x01\0\0\0\0\0\0\0\0\0", 16, FALSE },
  { "gzip", "\x1f\x8b\x08\0\0\0\0\0\0\x03", 10, FALSE },
};

/* Bytes that are not what they claim: each is malformed XML at its line, or a project that
 * loads whose every text is valid UTF-8. */
static void
test_bytes (gconstpointer data)
{
  const BytesCase *bc = data;
  gsize length = bc->length > 0 ? bc->length : strlen (bc->data);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (bc->data, length, &error);

  if (bc->loads)
    {
      g_assert_no_error (error);
      g_assert_nonnull (p);
      for (guint i = 0; i < p->members->len; i++)
        {
          const TrbMember *m = g_ptr_array_index (p->members, i);

          g_assert_true (g_utf8_validate (m->id, -1, NULL));
        }
    }
  else
    {
      g_assert_null (p);
      g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
    }
}

/* Latin-1 bytes, declared as such, arrive as UTF-8: "été" is e9 74 e9 in ISO 8859-1 and
 * c3 a9 74 c3 a9 in UTF-8 (Unicode U+00E9, common practice). */
static void
test_latin1_converted (void)
{
  static const char text[] = "<?xml version=\"1.0\" encoding=\"ISO-8859-1\"?>\n"
                             PROJECT_WITH ("\xe9t\xe9");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_data (text, sizeof text - 1, "latin1", &error);

  g_assert_no_error (error);
  g_assert_cmpstr (((TrbMember *) g_ptr_array_index (p->members, 0))->id, ==,
                   "\xc3\xa9t\xc3\xa9");
}

/* Bytes that a declared encoding cannot convert: an error at its line, and not a word on
 * stderr (libxml2's converters print there unless told not to). */
static void
test_silent_child (void)
{
  static const char text[] = "<?xml version=\"1.0\" encoding=\"EUC-JP\"?>\n"
                             "<trabeate-project format=\"1\">\n"
                             "<beam id=\"\xe4\x30\x30 \"/>\n</trabeate-project>\n";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (text, sizeof text - 1, &error);

  g_assert_null (p);
  g_assert_error (error, TRB_ERROR, TRB_ERROR_PARSE);
}

static void
test_silent (void)
{
  g_test_trap_subprocess ("/trb/hostile/bytes/silent/subprocess", 0, G_TEST_SUBPROCESS_DEFAULT);
  g_test_trap_assert_passed ();
  g_test_trap_assert_stderr ("");
}

/* ------------------------------------------------------------ truncation */

/* Every prefix of every example at 200 cut points: an error with its line, or (a prefix that
 * happens to be whole, or the whole file) a clean project that solves. */
static void
truncate_file (const char *path)
{
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  gsize length;
  guint loaded = 0;

  g_file_get_contents (path, &text, &length, &error);
  g_assert_no_error (error);
  for (guint i = 0; i <= 200; i++)
    {
      gsize cut = length * i / 200;
      g_autofree char *prefix = g_memdup2 (text, MAX (cut, 1));
      g_autoptr(GError) local = NULL;
      g_autoptr(TrbProject) p = load_checked (prefix, cut, &local);

      if (p != NULL)
        loaded++;
      /* a prefix that ends before the root element does, cannot load */
      if (cut < length && strstr (text + cut, "</trabeate-project>") != NULL)
        g_assert_null (p);
    }
  g_test_message ("%s: %u of 201 prefixes loaded", path, loaded);
}

static void
truncate_dir (const char *dir,
              guint      *n)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  const char *name;

  if (d == NULL)
    return;
  while ((name = g_dir_read_name (d)) != NULL)
    {
      g_autofree char *path = g_build_filename (dir, name, NULL);

      if (!g_str_has_suffix (name, ".trabeate"))
        continue;
      truncate_file (path);
      (*n)++;
    }
}

static void
test_truncated (void)
{
  g_autofree char *examples = g_test_build_filename (G_TEST_DIST, "..", "data", "examples",
                                                     NULL);
  g_autofree char *tests = g_test_build_filename (G_TEST_DIST, "data", NULL);
  guint n = 0;

  truncate_dir (examples, &n);
  truncate_dir (tests, &n);
  g_assert_cmpuint (n, >=, 2);
}

/* ------------------------------------------------------------ quantities */

/* One beam whose attributes come from the case; every other attribute is an ordinary value. */
typedef struct
{
  const char *length;
  const char *E;
  const char *I;
  const char *w;
  const char *p;
} Quantities;

static char *
beam_text (const Quantities *q)
{
  return g_strdup_printf ("<trabeate-project format=\"1\">\n"
                          "  <beam id=\"B1\" length=\"%s\" material=\"custom\" "
                          "section=\"custom\" E=\"%s\" I=\"%s\">\n"
                          "    <support at=\"0 ft\" type=\"pin\"/>\n"
                          "    <support at=\"%s\" type=\"roller\"/>\n"
                          "    <load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"%s\" "
                          "w=\"%s\"/>\n"
                          "    <load case=\"L\" type=\"point\" at=\"0 ft\" p=\"%s\"/>\n"
                          "    <load case=\"L\" type=\"point\" at=\"%s\" p=\"%s\"/>\n"
                          "  </beam>\n"
                          "</trabeate-project>\n",
                          q->length, q->E, q->I, q->length, q->length, q->w, q->p,
                          q->length, q->p);
}

/* Numbers at and past the ends of the double: 1.7976931348623157e308 is DBL_MAX and
 * 4.9e-324 the least subnormal (IEEE 754-2008, binary64). */
static const char * const extreme_numbers[] = {
  "NaN", "nan", "-nan", "NAN", "Inf", "-inf", "infinity", "INFINITY",
  "1e308", "-1e308", "1e-308", "-1e-308", "1e309", "1e-400", "4.9e-324",
  "1.7976931348623157e308", "1e99999", "-0", "0", "0x1p3", "1e", "--1", "1..2", "1/0", "0/0",
  "1e308 1/2", "99999999999999999999999999999999999999999999999999999999999999999999999999",
};

static void
try_quantities (const Quantities *q)
{
  g_autofree char *text = beam_text (q);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (text, strlen (text), &error);

  /* whatever loads has solved to finite numbers in load_checked() */
  if (p == NULL)
    g_assert_true (error->code == TRB_ERROR_UNIT || error->code == TRB_ERROR_INVALID);
}

/* Each extreme number in each place, with each place's units: an error at its line, or a
 * result whose every number is finite (or whose status is error or unstable). 1e308 ft is a
 * finite length, and whatever it does downstream must not come out as inf. */
static void
test_extreme_quantities (void)
{
  static const char * const length_units[] = { "ft", "in", "m", "mm" };
  static const char * const force_units[] = { "kip", "lbf", "N", "kN" };

  for (guint i = 0; i < G_N_ELEMENTS (extreme_numbers); i++)
    {
      const char *n = extreme_numbers[i];

      for (guint u = 0; u < G_N_ELEMENTS (length_units); u++)
        {
          g_autofree char *length = g_strdup_printf ("%s %s", n, length_units[u]);
          g_autofree char *force = g_strdup_printf ("%s %s", n, force_units[u]);
          g_autofree char *line = g_strdup_printf ("%s %s/ft", n, force_units[u]);
          g_autofree char *E = g_strdup_printf ("%s %s", n, u % 2 ? "Pa" : "ksi");
          g_autofree char *I = g_strdup_printf ("%s %s", n, u % 2 ? "m4" : "in4");
          Quantities base = { "10 ft", "29000 ksi", "100 in4", "1 kip/ft", "1 kip" };
          Quantities q;

          q = base, q.length = length, try_quantities (&q);
          q = base, q.E = E, try_quantities (&q);
          q = base, q.I = I, try_quantities (&q);
          q = base, q.w = line, try_quantities (&q);
          q = base, q.p = force, try_quantities (&q);
        }
    }
}

/* Pairs of extremes, which pass the loader one by one and only meet in the analysis: the
 * longest beam with the smallest stiffness, the heaviest load on the slightest section. */
static void
test_extreme_combinations (void)
{
  static const Quantities cases[] = {
    { "1e308 ft", "29000 ksi", "100 in4", "1 kip/ft", "1 kip" },
    { "1e308 ft", "1e-308 Pa", "1e-308 m4", "1e300 N/m", "1e300 N" },
    { "1e100 ft", "29000 ksi", "100 in4", "1 kip/ft", "1 kip" },
    { "1e-300 ft", "29000 ksi", "100 in4", "1 kip/ft", "1 kip" },
    { "10 ft", "1e308 Pa", "1e-308 m4", "1 kip/ft", "1 kip" },
    { "10 ft", "1e-308 Pa", "1e-308 m4", "1 kip/ft", "1 kip" },
    { "10 ft", "29000 ksi", "1e-308 in4", "1 kip/ft", "1 kip" },
    { "10 ft", "29000 ksi", "100 in4", "1e300 kip/ft", "1e300 kip" },
    { "10 ft", "29000 ksi", "100 in4", "-1e300 kip/ft", "1e300 kip" },
    { "10 ft", "29000 ksi", "100 in4", "1e-308 plf", "1e-308 lbf" },
    { "10 ft", "1e-300 Pa", "100 in4", "1 kip/ft", "1 kip" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    try_quantities (&cases[i]);
}

/* Zero and negative lengths: refused, at the beam's line. */
static void
test_zero_negative_lengths (void)
{
  static const char * const bad[] = { "0 ft", "-0 ft", "-1 ft", "-1e308 m", "0 in", "-0.0 mm" };

  for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      Quantities q = { bad[i], "29000 ksi", "100 in4", "1 kip/ft", "1 kip" };
      g_autofree char *text = beam_text (&q);

      assert_refused (text, strlen (text), TRB_ERROR_INVALID, 2, "must be greater than zero");
    }
}

/* Units the file format does not know, or of the wrong dimension: TRB_ERROR_UNIT at the line. */
static void
test_unknown_units (void)
{
  static const char * const bad[] = {
    "10 furlong", "10", "ft", "10 ft ft", "10 kip", "10 \xe2\x80\xb4",
    "10 ft;", "10 m/s", "", " ", "10 ft 3", "ten ft", "10e ft", "1 0 ft",
  };

  for (guint i = 0; i < G_N_ELEMENTS (bad); i++)
    {
      Quantities q = { bad[i], "29000 ksi", "100 in4", "1 kip/ft", "1 kip" };
      g_autofree char *text = beam_text (&q);
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbProject) p = load_checked (text, strlen (text), &error);

      if (p != NULL)
        g_test_message ("\"%s\" loaded as a length", bad[i]);
      g_assert_null (p);
      g_assert_true (error->code == TRB_ERROR_UNIT || error->code == TRB_ERROR_INVALID);
      g_assert_cmpint (message_line (error->message, "hostile"), ==, 2);
    }
}

/* ------------------------------------------------------------ loads and supports */

/* 20,000 point loads, and as many uniform pieces, on one beam: loads and solves. */
static void
test_many_loads (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n"
                                       "<beam id=\"P\" length=\"100 ft\" material=\"steel\" "
                                       "section=\"W24X55\">\n"
                                       "<support at=\"0 ft\" type=\"pin\"/>\n"
                                       "<support at=\"100 ft\" type=\"roller\"/>\n");
  g_autofree char *text = NULL;

  for (guint i = 0; i <= 20000; i++)
    g_string_append_printf (s, "<load case=\"%s\" type=\"point\" at=\"%.4f ft\" p=\"1 lbf\"/>\n",
                            i % 2 ? "D" : "L", 100.0 * i / 20000);
  g_string_append (s, "</beam>\n<beam id=\"U\" length=\"100 ft\" material=\"custom\" "
                      "section=\"custom\" E=\"29000 ksi\" I=\"1000 in4\">\n"
                      "<support at=\"0 ft\" type=\"pin\"/>\n"
                      "<support at=\"50 ft\" type=\"roller\"/>\n"
                      "<support at=\"100 ft\" type=\"roller\"/>\n");
  for (guint i = 0; i < 20000; i++)
    g_string_append_printf (s, "<load case=\"%s\" type=\"uniform\" from=\"%.4f ft\" "
                               "to=\"%.4f ft\" w=\"1 plf\"/>\n",
                            i % 2 ? "D" : "L", 100.0 * i / 20000, 100.0 * (i + 1) / 20000);
  g_string_append (s, "</beam>\n</trabeate-project>\n");
  text = g_string_free (g_steal_pointer (&s), FALSE);
  assert_loads (text);
}

/* Many spans: 2,000 supports on one member (more than the 64 regions live-load patterns are
 * formed for, which the results must say). */
static void
test_many_supports (void)
{
  g_autoptr(GString) s = g_string_new ("<trabeate-project format=\"1\">\n"
                                       "<beam id=\"S\" length=\"2000 ft\" material=\"custom\" "
                                       "section=\"custom\" E=\"29000 ksi\" I=\"100 in4\">\n");
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  g_autoptr(TrbMemberResult) r = NULL;
  gboolean said = FALSE;

  for (guint i = 0; i <= 2000; i++)
    g_string_append_printf (s, "<support at=\"%u ft\" type=\"%s\"/>\n", i,
                            i == 0 ? "pin" : "roller");
  g_string_append (s, "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"2000 ft\" "
                      "w=\"1 kip/ft\"/>\n<load case=\"L\" type=\"uniform\" from=\"0 ft\" "
                      "to=\"2000 ft\" w=\"1 kip/ft\"/>\n</beam>\n</trabeate-project>\n");
  text = g_string_free (g_steal_pointer (&s), FALSE);
  p = load_checked (text, strlen (text), &error);
  g_assert_no_error (error);
  r = trb_solve_member (p, g_ptr_array_index (p->members, 0));
  for (guint i = 0; i < r->notes->len; i++)
    said = said || strstr (g_ptr_array_index (r->notes, i), "patterns not formed") != NULL;
  g_assert_true (said);
}

/* Supports on top of one another, in the same or different units, or a hair apart: a stable
 * member solves to finite numbers, an unstable one says so. */
static void
test_coincident_supports (void)
{
  static const char * const cases[][2] = {
    /* supports, expected status */
    { "<support at=\"0 ft\" type=\"pin\"/><support at=\"0 ft\" type=\"pin\"/>"
      "<support at=\"10 ft\" type=\"roller\"/>", "ok" },
    { "<support at=\"0 ft\" type=\"pin\"/><support at=\"0 in\" type=\"fixed\"/>"
      "<support at=\"120 in\" type=\"roller\"/><support at=\"10 ft\" type=\"pin\"/>", "ok" },
    { "<support at=\"6 ft\" type=\"pin\"/><support at=\"72 in\" type=\"roller\"/>", "unstable" },
    { "<support at=\"0 ft\" type=\"pin\"/><support at=\"0 ft\" type=\"roller\"/>", "unstable" },
    { "<support at=\"10 ft\" type=\"fixed\"/><support at=\"10 ft\" type=\"fixed\"/>", "ok" },
    { "<support at=\"5 ft\" type=\"pin\"/><support at=\"5.000000000001 ft\" type=\"roller\"/>",
      "any" },
    { "<support at=\"5 ft\" type=\"pin\"/><support at=\"5.00000001 ft\" type=\"roller\"/>",
      "any" },
    { "<support at=\"5 ft\" type=\"pin\"/><support at=\"5.0001 ft\" type=\"roller\"/>", "any" },
    { "<support at=\"0 ft\" type=\"fixed\"/><support at=\"1e-300 ft\" type=\"fixed\"/>"
      "<support at=\"10 ft\" type=\"roller\"/>", "ok" },
  };

  for (guint i = 0; i < G_N_ELEMENTS (cases); i++)
    {
      g_autofree char *text = g_strdup_printf (
        "<trabeate-project format=\"1\">\n"
        "<beam id=\"C\" length=\"10 ft\" material=\"custom\" section=\"custom\" "
        "E=\"29000 ksi\" I=\"100 in4\">\n%s\n"
        "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"10 ft\" w=\"1 kip/ft\"/>\n"
        "<load case=\"L\" type=\"point\" at=\"6 ft\" p=\"2 kip\"/>\n"
        "<load case=\"L\" type=\"moment\" at=\"5 ft\" m=\"1 kip*ft\"/>\n"
        "</beam>\n</trabeate-project>\n", cases[i][0]);
      g_autoptr(GError) error = NULL;
      g_autoptr(TrbProject) p = load_checked (text, strlen (text), &error);
      g_autoptr(TrbMemberResult) r = NULL;

      g_assert_no_error (error);
      r = trb_solve_member (p, g_ptr_array_index (p->members, 0));
      if (strcmp (cases[i][1], "unstable") == 0)
        g_assert_cmpint (r->status, ==, TRB_STATUS_UNSTABLE);
      else if (strcmp (cases[i][1], "ok") == 0)
        g_assert_true (r->analysed);
    }
}

/* A load exactly at every support: points, moments, the ends of uniform and linear loads,
 * and the tip of each overhang. The member is in equilibrium: the reactions of case D add up
 * to the loads of case D (statics, sum of vertical forces). */
static void
test_loads_at_supports (void)
{
  static const char text[] =
    "<trabeate-project format=\"1\">\n"
    "<beam id=\"A\" length=\"40 ft\" material=\"custom\" section=\"custom\" "
    "E=\"29000 ksi\" I=\"300 in4\">\n"
    "<support at=\"5 ft\" type=\"pin\"/>\n"
    "<support at=\"15 ft\" type=\"roller\"/>\n"
    "<support at=\"25 ft\" type=\"fixed\"/>\n"
    "<support at=\"35 ft\" type=\"roller\"/>\n"
    "<load case=\"D\" type=\"point\" at=\"0 ft\" p=\"1 kip\"/>\n"
    "<load case=\"D\" type=\"point\" at=\"5 ft\" p=\"2 kip\"/>\n"
    "<load case=\"D\" type=\"point\" at=\"15 ft\" p=\"3 kip\"/>\n"
    "<load case=\"D\" type=\"point\" at=\"25 ft\" p=\"4 kip\"/>\n"
    "<load case=\"D\" type=\"point\" at=\"35 ft\" p=\"5 kip\"/>\n"
    "<load case=\"D\" type=\"point\" at=\"40 ft\" p=\"6 kip\"/>\n"
    "<load case=\"D\" type=\"uniform\" from=\"5 ft\" to=\"15 ft\" w=\"1 kip/ft\"/>\n"
    "<load case=\"D\" type=\"linear\" from=\"15 ft\" to=\"25 ft\" w1=\"0 kip/ft\" "
    "w2=\"2 kip/ft\"/>\n"
    "<load case=\"D\" type=\"moment\" at=\"5 ft\" m=\"3 kip*ft\"/>\n"
    "<load case=\"D\" type=\"moment\" at=\"25 ft\" m=\"-3 kip*ft\"/>\n"
    "<load case=\"L\" type=\"point\" at=\"15 ft\" p=\"7 kip\"/>\n"
    "<load case=\"L\" type=\"moment\" at=\"35 ft\" m=\"2 kip*ft\"/>\n"
    "<load case=\"L\" type=\"moment\" at=\"40 ft\" m=\"2 kip*ft\"/>\n"
    "<load case=\"L\" type=\"uniform\" from=\"0 ft\" to=\"5 ft\" w=\"1 kip/ft\"/>\n"
    "<load case=\"L\" type=\"uniform\" from=\"35 ft\" to=\"40 ft\" w=\"1 kip/ft\"/>\n"
    "</beam>\n</trabeate-project>\n";
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (text, sizeof text - 1, &error);
  g_autoptr(TrbMemberResult) r = NULL;
  const TrbReaction *reactions;
  guint n;
  double sum = 0;
  /* case D: points 1+2+3+4+5+6 = 21 kip, uniform 1 kip/ft x 10 ft = 10 kip, triangle
   * 2 kip/ft x 10 ft / 2 = 10 kip: 41 kip in all (self-weight off: custom, no weight) */
  double applied = 41 * TRB_KIP;

  g_assert_no_error (error);
  r = trb_solve_member (p, g_ptr_array_index (p->members, 0));
  g_assert_true (r->analysed);
  reactions = trb_beam_result_get_reactions (r->cases[TRB_CASE_D], &n);
  g_assert_cmpuint (n, ==, 4);
  for (guint i = 0; i < n; i++)
    sum += reactions[i].force;
  g_assert_cmpfloat_with_epsilon (sum, applied, 1e-9 * applied);
}

/* ------------------------------------------------------------ floors */

static char *
floor_text (const char *body)
{
  return g_strdup_printf ("<trabeate-project format=\"1\">\n<floor name=\"F\">\n%s"
                          "</floor>\n</trabeate-project>\n", body);
}

/* Two columns, a girder between them, and a joist run resting on it and on a wall. */
static void
append_bay (GString    *s,
            const char *scale)
{
  g_string_append_printf (s,
    "<column id=\"C1\" x=\"0 %s\" y=\"0 %s\"/>\n"
    "<column id=\"C2\" x=\"0 %s\" y=\"30 %s\"/>\n"
    "<wall id=\"W1\"><point x=\"20 %s\" y=\"-1 %s\"/><point x=\"20 %s\" y=\"31 %s\"/></wall>\n"
    "<member id=\"G1\" role=\"girder\" x1=\"0 %s\" y1=\"0 %s\" x2=\"0 %s\" y2=\"30 %s\" "
    "material=\"custom\" section=\"custom\" E=\"29000 ksi\" I=\"500 in4\"/>\n",
    scale, scale, scale, scale, scale, scale, scale, scale, scale, scale, scale, scale);
  for (guint j = 1; j < 30; j += 2)
    g_string_append_printf (s,
      "<member id=\"J%u\" role=\"joist\" x1=\"0 %s\" y1=\"%u %s\" x2=\"20 %s\" y2=\"%u %s\" "
      "material=\"custom\" section=\"custom\" E=\"1600 ksi\" I=\"178 in4\"/>\n",
      j, scale, j, scale, scale, j, scale);
}

/* The same bay at every scale from a thousandth of an inch to 1e300 m, with its loads: the
 * framing tolerances and the sums over the floor must hold or fail cleanly at any of them. */
static void
test_floor_scales (void)
{
  static const char * const scales[] = { "in", "ft", "mm", "m" };
  static const char * const factors[] = { "1e-3", "1", "1e6", "1e100", "1e300" };
  guint loaded = 0;

  for (guint i = 0; i < G_N_ELEMENTS (scales); i++)
    for (guint f = 0; f < G_N_ELEMENTS (factors); f++)
      {
        g_autofree char *unit = g_strdup_printf ("%s", scales[i]);
        g_autoptr(GString) body = g_string_new (NULL);
        g_autofree char *text = NULL;
        g_autofree char *scaled = NULL;
        g_autoptr(GError) error = NULL;
        g_autoptr(TrbProject) p = NULL;

        append_bay (body, unit);
        g_string_append_printf (body,
          "<area-load case=\"D\" pressure=\"%s psf\"><point x=\"0 %s\" y=\"0 %s\"/>"
          "<point x=\"20 %s\" y=\"0 %s\"/><point x=\"20 %s\" y=\"30 %s\"/>"
          "<point x=\"0 %s\" y=\"30 %s\"/></area-load>\n"
          "<point-load case=\"L\" p=\"%s kip\" x=\"10 %s\" y=\"11 %s\"/>\n",
          factors[f], unit, unit, unit, unit, unit, unit, unit, unit, factors[f], unit, unit);
        /* the coordinates themselves scaled: "0 ft" stays, "20 ft" becomes "20e300 ft" */
        scaled = g_strdup (body->str);
        if (f > 0)
          {
            g_autofree char *from = g_strdup_printf (" %s\"", unit);
            g_autofree char *to = g_strdup_printf ("%s %s\"", factors[f] + 1, unit);
            g_auto(GStrv) parts = g_strsplit (scaled, from, -1);

            g_free (scaled);
            scaled = g_strjoinv (to, parts);
          }
        text = floor_text (scaled);
        p = load_checked (text, strlen (text), &error);
        if (p == NULL)
          {
            g_test_message ("%s %s: %s", factors[f], unit, error->message);
            g_assert_true (error->code == TRB_ERROR_UNIT || error->code == TRB_ERROR_INVALID);
          }
        else
          loaded++;
      }
  /* every coordinate here is a finite double (31e300 m at most): all load, and solve to
   * finite numbers or to members and floors in error */
  g_assert_cmpuint (loaded, ==, G_N_ELEMENTS (scales) * G_N_ELEMENTS (factors));
}

/* 500 girders drawn on top of one another, and 500 columns on one spot: whatever the framing
 * makes of them, it ends, and its numbers are finite. */
static void
test_floor_stacked (void)
{
  g_autoptr(GString) body = g_string_new (NULL);
  g_autofree char *text = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;

  for (guint i = 0; i < 500; i++)
    g_string_append_printf (body, "<column id=\"C%u\" x=\"0 ft\" y=\"0 ft\"/>\n"
                                  "<column id=\"D%u\" x=\"0 ft\" y=\"30 ft\"/>\n", i, i);
  for (guint i = 0; i < 500; i++)
    g_string_append_printf (body, "<member id=\"G%u\" role=\"girder\" x1=\"0 ft\" y1=\"0 ft\" "
                                  "x2=\"0 ft\" y2=\"30 ft\" material=\"custom\" "
                                  "section=\"custom\" E=\"29000 ksi\" I=\"500 in4\"/>\n", i);
  g_string_append (body, "<member id=\"J1\" role=\"joist\" x1=\"0 ft\" y1=\"15 ft\" x2=\"20 ft\" "
                         "y2=\"15 ft\" material=\"custom\" section=\"custom\" E=\"1600 ksi\" "
                         "I=\"178 in4\"><support at=\"20 ft\" type=\"pin\"/>"
                         "<load case=\"D\" type=\"uniform\" from=\"0 ft\" to=\"20 ft\" "
                         "w=\"1 kip/ft\"/></member>\n");
  text = floor_text (body->str);
  p = load_checked (text, strlen (text), &error);
  g_assert_no_error (error);
}

/* Members that bear on each other in a ring, and a member that lies along another: a cycle is
 * an error on its members, never a hang. */
static void
test_floor_cycle (void)
{
  g_autofree char *text = floor_text (
    "<member id=\"A\" role=\"beam\" x1=\"0 ft\" y1=\"0 ft\" x2=\"10 ft\" y2=\"0 ft\" "
    "material=\"custom\" section=\"custom\" E=\"29000 ksi\" I=\"100 in4\"/>\n"
    "<member id=\"B\" role=\"beam\" x1=\"10 ft\" y1=\"0 ft\" x2=\"10 ft\" y2=\"10 ft\" "
    "material=\"custom\" section=\"custom\" E=\"29000 ksi\" I=\"100 in4\"/>\n"
    "<member id=\"C\" role=\"beam\" x1=\"10 ft\" y1=\"10 ft\" x2=\"0 ft\" y2=\"10 ft\" "
    "material=\"custom\" section=\"custom\" E=\"29000 ksi\" I=\"100 in4\"/>\n"
    "<member id=\"D\" role=\"beam\" x1=\"0 ft\" y1=\"10 ft\" x2=\"0 ft\" y2=\"0 ft\" "
    "material=\"custom\" section=\"custom\" E=\"29000 ksi\" I=\"100 in4\"/>\n"
    "<member id=\"E\" role=\"beam\" x1=\"2 ft\" y1=\"0 ft\" x2=\"8 ft\" y2=\"0 ft\" "
    "material=\"custom\" section=\"custom\" E=\"29000 ksi\" I=\"100 in4\"/>\n"
    "<area-load case=\"L\" pressure=\"50 psf\"><point x=\"0 ft\" y=\"0 ft\"/>"
    "<point x=\"10 ft\" y=\"0 ft\"/><point x=\"10 ft\" y=\"10 ft\"/></area-load>\n");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = load_checked (text, strlen (text), &error);

  g_assert_no_error (error);
}

/* Outlines of area loads and openings: the framing's time grows with the square of their
 * points, so a floor's take at most TRB_PROJECT_MAX_OUTLINE_POINTS together. An area load of
 * 20,000 points (a circle) is refused at its line; 600 points of load and 400 of opening
 * load and solve. A line load of 5,000 points has no such cost and loads. */
static void
append_circle (GString    *s,
               const char *element,
               guint       n,
               double      radius)
{
  g_string_append_printf (s, "%s\n", element);
  for (guint i = 0; i < n; i++)
    g_string_append_printf (s, "<point x=\"%.9f ft\" y=\"%.9f ft\"/>\n",
                            10 + radius * cos (2 * G_PI * i / n),
                            15 + radius * sin (2 * G_PI * i / n));
}

static void
test_floor_long_outlines (void)
{
  g_autoptr(GString) body = g_string_new (NULL);
  g_autofree char *text = NULL;
  guint line;

  append_bay (body, "ft");
  line = 3 + count_lines (body->str, body->len) - 1;
  append_circle (body, "<area-load case=\"L\" pressure=\"40 psf\">", 20000, 9);
  g_string_append (body, "</area-load>\n");
  text = floor_text (body->str);
  assert_refused (text, strlen (text), TRB_ERROR_INVALID, line,
                  "have more than 1000 points together");
}

static void
test_floor_outlines_at_limit (void)
{
  g_autoptr(GString) body = g_string_new (NULL);
  g_autofree char *text = NULL;

  append_bay (body, "ft");
  append_circle (body, "<area-load case=\"L\" pressure=\"40 psf\">", 600, 9);
  g_string_append (body, "</area-load>\n");
  append_circle (body, "<opening>", 400, 3);
  g_string_append (body, "</opening>\n<line-load case=\"D\" w=\"0.1 kip/ft\">\n");
  for (guint i = 0; i < 5000; i++)
    g_string_append_printf (body, "<point x=\"%.6f ft\" y=\"%.6f ft\"/>\n",
                            20.0 * i / 4999, 1 + 28.0 * ((i * 7919) % 5000) / 4999);
  g_string_append (body, "</line-load>\n");
  text = floor_text (body->str);
  assert_loads (text);
}

int
main (int   argc,
      char *argv[])
{
  g_test_init (&argc, &argv, NULL);

  for (guint i = 0; i < G_N_ELEMENTS (bait_cases); i++)
    {
      g_autofree char *name = g_strndup (bait_cases[i].file,
                                         strlen (bait_cases[i].file) - strlen (".trabeate"));
      g_autofree char *path = g_strdup_printf ("/trb/hostile/bait/%s", name);

      g_test_add_data_func (path, &bait_cases[i], test_bait);
    }
  g_test_add_func ("/trb/hostile/bait/sections-not-plain", test_sections_not_plain);
  g_test_add_func ("/trb/hostile/entities/billion-laughs", test_billion_laughs);
  g_test_add_func ("/trb/hostile/entities/quadratic-blowup", test_quadratic_blowup);
  g_test_add_func ("/trb/hostile/entities/undeclared", test_undeclared_entity);
  g_test_add_func ("/trb/hostile/size/200-mb", test_file_200mb);
  g_test_add_func ("/trb/hostile/size/endless-device", test_endless_device);
  g_test_add_func ("/trb/hostile/size/huge-attribute", test_huge_attribute);
  g_test_add_func ("/trb/hostile/structure/deep-nesting", test_deep_nesting);
  g_test_add_func ("/trb/hostile/structure/nesting-within-limit", test_nesting_within_limit);
  g_test_add_func ("/trb/hostile/structure/many-attributes", test_many_attributes);
  g_test_add_func ("/trb/hostile/structure/attribute-scan-quotes", test_attribute_scan_quotes);
  g_test_add_func ("/trb/hostile/structure/many-elements", test_many_elements);
  g_test_add_func ("/trb/hostile/crowds/million-members", test_million_members);
  g_test_add_func ("/trb/hostile/crowds/million-members/subprocess", test_million_members_child);
  g_test_add_func ("/trb/hostile/crowds/member-limit", test_member_limit);
  g_test_add_func ("/trb/hostile/crowds/member-limit/subprocess", test_member_limit_child);
  g_test_add_func ("/trb/hostile/crowds/members-at-limit", test_members_at_limit);
  g_test_add_func ("/trb/hostile/crowds/members-at-limit/subprocess",
                   test_members_at_limit_child);
  g_test_add_func ("/trb/hostile/crowds/duplicate-ids", test_duplicate_ids);
  g_test_add_func ("/trb/hostile/crowds/lookalike-ids", test_lookalike_ids);
  for (guint i = 0; i < G_N_ELEMENTS (bytes_cases); i++)
    {
      g_autofree char *path = g_strdup_printf ("/trb/hostile/bytes/%s", bytes_cases[i].name);

      g_test_add_data_func (path, &bytes_cases[i], test_bytes);
    }
  g_test_add_func ("/trb/hostile/bytes/latin1-converted", test_latin1_converted);
  g_test_add_func ("/trb/hostile/bytes/silent", test_silent);
  g_test_add_func ("/trb/hostile/bytes/silent/subprocess", test_silent_child);
  g_test_add_func ("/trb/hostile/truncated", test_truncated);
  g_test_add_func ("/trb/hostile/quantities/extreme", test_extreme_quantities);
  g_test_add_func ("/trb/hostile/quantities/extreme-combinations", test_extreme_combinations);
  g_test_add_func ("/trb/hostile/quantities/zero-negative-lengths", test_zero_negative_lengths);
  g_test_add_func ("/trb/hostile/quantities/unknown-units", test_unknown_units);
  g_test_add_func ("/trb/hostile/loads/many", test_many_loads);
  g_test_add_func ("/trb/hostile/supports/many", test_many_supports);
  g_test_add_func ("/trb/hostile/supports/coincident", test_coincident_supports);
  g_test_add_func ("/trb/hostile/loads/at-supports", test_loads_at_supports);
  g_test_add_func ("/trb/hostile/floors/scales", test_floor_scales);
  g_test_add_func ("/trb/hostile/floors/stacked", test_floor_stacked);
  g_test_add_func ("/trb/hostile/floors/cycle", test_floor_cycle);
  g_test_add_func ("/trb/hostile/floors/long-outlines", test_floor_long_outlines);
  g_test_add_func ("/trb/hostile/floors/outlines-at-limit", test_floor_outlines_at_limit);

  return g_test_run ();
}
