/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Saving under faults (docs/reliability.md, "Saving under faults"): trb_project_save_file()
 * with its system calls failing one by one (save-child run with fault-inject.so), and savers
 * killed at random moments. What must hold, whatever happens:
 *
 * - the save says FALSE, with a TRB_ERROR naming the file, whenever the new bytes did not all
 *   reach the file; and then the file holds exactly its old bytes (or is still absent);
 * - when it says TRUE, the file holds exactly the new bytes;
 * - no temporary file is left behind, but where the process dies mid-save or the disk refuses
 *   to remove it; such a file is never the target and holds the start of the new bytes;
 * - the model in memory is untouched: saved again, it gives the bytes of a save with no fault.
 *
 * The rename that makes this possible is atomic: "a link named new shall remain visible ...
 * and refer either to the file referred to by new or old before the operation began"
 * (POSIX.1-2017, rename()). */

#include "config.h"

#include <errno.h>
#include <glib/gstdio.h>
#include <poll.h>
#include <signal.h>
#include <string.h>
#include <sys/inotify.h>
#include <sys/prctl.h>
#include <sys/vfs.h>
#include <sys/wait.h>
#include <unistd.h>

#include "trb-error.h"
#include "trb-model.h"
#include "trb-project-io.h"

#include "bench/floor-gen.h"

/* The errnos a failing disk gives to write(), fsync(), close(), open(O_CREAT) and rename():
 * I/O error, no space left, quota exceeded (Linux man-pages write(2), fsync(2), close(2),
 * open(2), rename(2); from memory). */
static const char * const errnos[] = { "EIO", "ENOSPC", "EDQUOT" };

/* What one fault-inject run asks for (fault-inject.c). */
typedef struct
{
  const char *errname;
  int         call;          /* the call to fail, from 1; 0: none */
  gboolean    sticky;        /* and every call after it */
  gsize       short_writes;  /* bytes per write() at most; 0: as asked */
  gboolean    existing;      /* the target holds the old version before the save */
} Fault;

typedef struct
{
  char    *name;
  gboolean injected;
  gboolean failed;
  char    *err;
  char    *path;
  char    *path2;
} Call;

static void
call_free (Call *c)
{
  g_free (c->name);
  g_free (c->err);
  g_free (c->path);
  g_free (c->path2);
  g_free (c);
}

/* What save-child printed. */
typedef struct
{
  gboolean   saved;
  char      *error_domain;
  int        error_code;
  char      *error_message;
  GPtrArray *calls;
  gboolean   unchanged;
  gboolean   again;
} Report;

static void
report_free (Report *r)
{
  g_free (r->error_domain);
  g_free (r->error_message);
  g_ptr_array_unref (r->calls);
  g_free (r);
}

G_DEFINE_AUTOPTR_CLEANUP_FUNC (Report, report_free)

/* The two versions of one project the fault cases save: the old one is on disk, the new one
 * is loaded and saved over it. */
static char *old_bytes;
static gsize n_old;
static char *new_bytes;
static gsize n_new;
static char *source;

static guint n_cases;

static void
load_versions (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  g_autofree char *old_path = NULL;

  if (source != NULL)
    return;
  source = g_test_build_filename (G_TEST_DIST, "data", "render-floor-v2.trabeate", NULL);
  old_path = g_test_build_filename (G_TEST_DIST, "data", "render-floor-v1.trabeate", NULL);
  g_assert_true (g_file_get_contents (old_path, &old_bytes, &n_old, &error));
  g_assert_no_error (error);
  p = trb_project_load_file (source, &error);
  g_assert_no_error (error);
  new_bytes = trb_project_save_data (p, &n_new, &error);
  g_assert_no_error (error);
  g_assert_false (n_old == n_new && memcmp (old_bytes, new_bytes, n_new) == 0);
}

static char *
read_file (const char *path,
           gsize      *n)
{
  char *text = NULL;

  if (!g_file_get_contents (path, &text, n, NULL))
    return NULL;
  return text;
}

static gboolean
same_bytes (const char *a,
            gsize       na,
            const char *b,
            gsize       nb)
{
  return a != NULL && b != NULL && na == nb && memcmp (a, b, na) == 0;
}

/* The names in dir, sorted. */
static GPtrArray *
list_dir (const char *dir)
{
  g_autoptr(GDir) d = g_dir_open (dir, 0, NULL);
  GPtrArray *names = g_ptr_array_new_with_free_func (g_free);
  const char *name;

  g_assert_nonnull (d);
  while ((name = g_dir_read_name (d)) != NULL)
    g_ptr_array_add (names, g_strdup (name));
  g_ptr_array_sort (names, (GCompareFunc) g_strcmp0);
  return names;
}

static void
remove_dir (const char *dir)
{
  g_autoptr(GPtrArray) names = list_dir (dir);

  for (guint i = 0; i < names->len; i++)
    {
      g_autofree char *path = g_build_filename (dir, g_ptr_array_index (names, i), NULL);

      g_assert_cmpint (g_remove (path), ==, 0);
    }
  g_assert_cmpint (g_rmdir (dir), ==, 0);
}

/* GLib's temporary file: the target's name, a dot and six characters (g_file_set_contents_full
 * with G_FILE_SET_CONTENTS_CONSISTENT, GLib 2.74; from memory). */
static gboolean
is_temp_of (const char *path,
            const char *target)
{
  gsize n = strlen (target);

  return g_str_has_prefix (path, target) && path[n] == '.' && strlen (path) == n + 7;
}

/* A temporary file left behind holds the start of the bytes it was given, then zeros: GLib
 * reserves the whole length with fallocate() before it writes (GLib 2.74 write_to_file(); from
 * memory). Returns how many bytes were written. */
static gsize
written_part (const char *temp,
              gsize       n_temp,
              const char *expected,
              gsize       n_expected)
{
  gsize n = 0;

  g_assert_cmpuint (n_temp, <=, n_expected);
  while (n < n_temp && temp[n] == expected[n])
    n++;
  for (gsize i = n; i < n_temp; i++)
    g_assert_cmpint (temp[i], ==, 0);
  return n;
}

static Report *
parse_report (const char *out)
{
  g_auto(GStrv) lines = g_strsplit (out, "\n", -1);
  Report *r = g_new0 (Report, 1);

  r->calls = g_ptr_array_new_with_free_func ((GDestroyNotify) call_free);
  for (guint i = 0; lines[i] != NULL; i++)
    {
      g_auto(GStrv) f = g_strsplit (lines[i], "\t", -1);
      guint n = g_strv_length (f);

      if (n == 0)
        continue;
      if (strcmp (f[0], "saved") == 0 && n == 2)
        r->saved = strcmp (f[1], "1") == 0;
      else if (strcmp (f[0], "error") == 0 && n == 4)
        {
          r->error_domain = g_strdup (f[1]);
          r->error_code = atoi (f[2]);
          r->error_message = g_strdup (f[3]);
        }
      else if (strcmp (f[0], "call") == 0 && (n == 7 || n == 8))
        {
          Call *c = g_new0 (Call, 1);

          g_assert_cmpint (atoi (f[1]), ==, r->calls->len + 1);
          c->name = g_strdup (f[2]);
          c->injected = strcmp (f[3], "1") == 0;
          c->failed = strcmp (f[4], "1") == 0;
          c->err = g_strdup (f[5]);
          c->path = g_strdup (f[6]);
          c->path2 = n == 8 ? g_strdup (f[7]) : NULL;
          g_ptr_array_add (r->calls, c);
        }
      else if (strcmp (f[0], "unchanged") == 0 && n == 2)
        r->unchanged = strcmp (f[1], "1") == 0;
      else if (strcmp (f[0], "again") == 0 && n == 2)
        r->again = strcmp (f[1], "1") == 0;
      else if (strcmp (f[0], "again-error") == 0)
        g_test_message ("second save: %s", lines[i]);
      else
        g_error ("save-child printed an unknown line: %s", lines[i]);
    }
  return r;
}

/* Runs save-child with the fault asked for, in a new folder (*dir_out, to be removed). */
static Report *
run_save (const Fault  *f,
          char        **dir_out)
{
  g_autofree char *child = g_test_build_filename (G_TEST_BUILT, "save-child", NULL);
  g_autofree char *lib = g_test_build_filename (G_TEST_BUILT, "fault-inject.so", NULL);
  g_autofree char *dir = g_dir_make_tmp ("trb-fault-XXXXXX", NULL);
  g_autofree char *target = NULL;
  g_autofree char *again = NULL;
  g_autofree char *call = g_strdup_printf ("%d", f->call);
  g_autofree char *shortw = g_strdup_printf ("%" G_GSIZE_FORMAT, f->short_writes);
  g_autofree char *preload = NULL;
  g_autofree char *asan = NULL;
  g_autofree char *out = NULL;
  g_autofree char *err = NULL;
  g_auto(GStrv) env = g_get_environ ();
  g_autoptr(GError) error = NULL;
  const char *argv[5];
  int status;

  g_assert_nonnull (dir);
  target = g_build_filename (dir, "plan.trabeate", NULL);
  again = g_build_filename (dir, "again.trabeate", NULL);
  if (f->existing)
    {
      g_assert_true (g_file_set_contents (target, old_bytes, n_old, &error));
      g_assert_no_error (error);
    }

  preload = g_environ_getenv (env, "LD_PRELOAD") != NULL ?
            g_strconcat (lib, ":", g_environ_getenv (env, "LD_PRELOAD"), NULL) :
            g_strdup (lib);
  /* Under AddressSanitizer (build-aux/test) the preloaded library comes before its runtime,
   * which it refuses unless told; fault-inject.c passes every call on to it. */
  asan = g_environ_getenv (env, "ASAN_OPTIONS") != NULL ?
         g_strconcat (g_environ_getenv (env, "ASAN_OPTIONS"), ":verify_asan_link_order=0",
                      NULL) :
         g_strdup ("verify_asan_link_order=0");
  env = g_environ_setenv (env, "LD_PRELOAD", preload, TRUE);
  env = g_environ_setenv (env, "ASAN_OPTIONS", asan, TRUE);
  env = g_environ_setenv (env, "TRB_FAULT_CALL", call, TRUE);
  env = g_environ_setenv (env, "TRB_FAULT_ERRNO", f->errname != NULL ? f->errname : "EIO",
                          TRUE);
  env = g_environ_setenv (env, "TRB_FAULT_STICKY", f->sticky ? "1" : "0", TRUE);
  env = g_environ_setenv (env, "TRB_FAULT_SHORT", shortw, TRUE);

  argv[0] = child;
  argv[1] = source;
  argv[2] = target;
  argv[3] = again;
  argv[4] = NULL;
  g_spawn_sync (NULL, (char **) argv, env, G_SPAWN_DEFAULT, NULL, NULL, &out, &err, &status,
                &error);
  g_assert_no_error (error);
  if (!g_spawn_check_wait_status (status, &error))
    g_error ("save-child: %s\n%s", error->message, err);
  n_cases++;

  *dir_out = g_steal_pointer (&dir);
  return parse_report (out);
}

typedef enum
{
  ON_TEMP,
  ON_TARGET,     /* the target itself, which an atomic save never writes */
  ON_DIR,
  RENAME_OVER,   /* the temporary file renamed over the target */
  ON_OTHER,
} Place;

static Place
place_of (const Call *c,
          const char *dir,
          const char *target)
{
  if (strcmp (c->name, "rename") == 0)
    return is_temp_of (c->path, target) && g_strcmp0 (c->path2, target) == 0 ?
           RENAME_OVER : ON_OTHER;
  if (is_temp_of (c->path, target))
    return ON_TEMP;
  if (strcmp (c->path, target) == 0)
    return ON_TARGET;
  if (strcmp (c->path, dir) == 0)
    return ON_DIR;
  return ON_OTHER;
}

/* A call whose failure means the new bytes may not all be in the file, or not in its place:
 * the temporary file's creation, writes, flush and close, and the rename (or the same on the
 * target, which the checks of the old bytes then catch). fallocate() only reserves room (a
 * hint whose failure the writes that follow would show), and the folder is flushed after the
 * rename (see docs/reliability.md on what its failure means). */
static gboolean
is_critical (const Call *c,
             Place       place)
{
  if (place == RENAME_OVER)
    return TRUE;
  return (place == ON_TEMP || place == ON_TARGET) &&
         (strcmp (c->name, "open") == 0 || strcmp (c->name, "write") == 0 ||
          strcmp (c->name, "fsync") == 0 || strcmp (c->name, "fdatasync") == 0 ||
          strcmp (c->name, "close") == 0);
}

/* Every check of the file comment on one run; returns how many temporary files were left. */
static guint
check_run (const Fault  *f,
           const Report *r,
           const char   *dir)
{
  g_autofree char *target = g_build_filename (dir, "plan.trabeate", NULL);
  g_autofree char *again = g_build_filename (dir, "again.trabeate", NULL);
  g_autofree char *on_disk = NULL;
  g_autofree char *again_bytes = NULL;
  g_autoptr(GPtrArray) names = list_dir (dir);
  gsize n_disk = 0, n_again = 0;
  gboolean must_fail = FALSE;
  const char *errno_text = NULL;
  guint left = 0;

  for (guint i = 0; i < r->calls->len; i++)
    {
      const Call *c = g_ptr_array_index (r->calls, i);
      Place place = place_of (c, dir, target);

      /* a save touches its folder, its temporary file and its target, nothing else */
      if (place == ON_OTHER)
        g_error ("call %u: %s on \"%s\"", i + 1, c->name, c->path);
      if (c->injected)
        g_assert_cmpstr (c->err, ==, f->errname);
      else
        g_assert_false (c->failed);
      if (c->injected && is_critical (c, place))
        must_fail = TRUE;
    }
  if (f->call > 0 && (guint) f->call <= r->calls->len)
    g_assert_true (((Call *) g_ptr_array_index (r->calls, f->call - 1))->injected);

  on_disk = read_file (target, &n_disk);
  if (must_fail)
    {
      g_autofree char *prefix = g_strdup_printf ("%s: cannot save: ", target);

      g_assert_false (r->saved);
      g_assert_cmpstr (r->error_domain, ==, g_quark_to_string (TRB_ERROR));
      g_assert_cmpint (r->error_code, ==, TRB_ERROR_IO);
      g_assert_true (g_str_has_prefix (r->error_message, prefix));
      /* the cause reaches the message */
      errno_text = strcmp (f->errname, "EIO") == 0 ? g_strerror (EIO) :
                   strcmp (f->errname, "ENOSPC") == 0 ? g_strerror (ENOSPC) :
                   g_strerror (EDQUOT);
      g_assert_nonnull (strstr (r->error_message, errno_text));
      if (f->existing)
        g_assert_true (same_bytes (on_disk, n_disk, old_bytes, n_old));
      else
        g_assert_null (on_disk);
    }
  else
    {
      g_assert_true (r->saved);
      g_assert_null (r->error_message);
      g_assert_true (same_bytes (on_disk, n_disk, new_bytes, n_new));
    }

  /* the model untouched: saved again without faults, the bytes of a save with no fault */
  g_assert_true (r->unchanged);
  g_assert_true (r->again);
  again_bytes = read_file (again, &n_again);
  g_assert_true (same_bytes (again_bytes, n_again, new_bytes, n_new));

  for (guint i = 0; i < names->len; i++)
    {
      const char *name = g_ptr_array_index (names, i);
      g_autofree char *path = g_build_filename (dir, name, NULL);
      g_autofree char *bytes = NULL;
      gboolean unlink_failed = FALSE;
      gsize n = 0;

      if (strcmp (name, "plan.trabeate") == 0 || strcmp (name, "again.trabeate") == 0)
        continue;
      /* a temporary file stays only when the disk refused to remove it, and holds the start
       * of the new bytes */
      g_assert_true (is_temp_of (path, target));
      for (guint k = 0; k < r->calls->len; k++)
        {
          const Call *c = g_ptr_array_index (r->calls, k);

          if (strcmp (c->name, "unlink") == 0 && strcmp (c->path, path) == 0 && c->injected)
            unlink_failed = TRUE;
        }
      g_assert_true (unlink_failed);
      bytes = read_file (path, &n);
      g_assert_nonnull (bytes);
      written_part (bytes, n, new_bytes, n_new);
      left++;
    }
  return left;
}

/* The calls of one save with no fault: the whole mode's list of N. */
static guint
reference_calls (const Fault *mode)
{
  Fault f = *mode;
  g_autofree char *dir = NULL;
  g_autoptr(Report) r = NULL;
  guint n;

  f.call = 0;
  f.sticky = FALSE;
  r = run_save (&f, &dir);
  g_assert_cmpuint (check_run (&f, r, dir), ==, 0);
  g_assert_true (r->saved);
  n = r->calls->len;
  remove_dir (dir);
  return n;
}

/* Every call of a save, failed in turn with each errno. Returns the temporary files left. */
static guint
fail_each_call (const Fault *mode,
                guint       *n_runs)
{
  guint n = reference_calls (mode);
  guint left = 0;
  guint runs = 0;

  g_assert_cmpuint (n, >=, 5);
  for (guint e = 0; e < G_N_ELEMENTS (errnos); e++)
    for (guint k = 1; k <= n; k++)
      {
        Fault f = *mode;
        g_autofree char *dir = NULL;
        g_autoptr(Report) r = NULL;

        f.errname = errnos[e];
        f.call = k;
        r = run_save (&f, &dir);
        left += check_run (&f, r, dir);
        remove_dir (dir);
        runs++;
      }
  *n_runs += runs;
  g_test_message ("%s fault%s%s%s: %u calls a save, %u runs, %u temporary files left",
                  mode->sticky ? "lasting" : "one", mode->short_writes > 0 ? ", short writes" : "",
                  mode->existing ? "" : ", no file before", "", n, runs, left);
  return left;
}

/* The calls of a save with no fault, in order (GLib 2.74, g_file_set_contents_full with
 * G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE, as trb-project-write.c asks):
 * create a temporary file beside the target, write it whole, flush it, close it, rename it over
 * the target, then flush the folder. */
static void
test_trace (void)
{
  Fault f = { "EIO", 0, FALSE, 1000, TRUE };
  g_autofree char *dir = NULL;
  g_autofree char *target = NULL;
  g_autoptr(Report) r = NULL;
  struct statfs fs;
  int last_write = -1, fsync_temp = -1, close_temp = -1, rename_at = -1;
  guint n_writes = 0;

  load_versions ();
  r = run_save (&f, &dir);
  target = g_build_filename (dir, "plan.trabeate", NULL);
  g_assert_cmpuint (check_run (&f, r, dir), ==, 0);
  for (guint i = 0; i < r->calls->len; i++)
    {
      const Call *c = g_ptr_array_index (r->calls, i);
      Place place = place_of (c, dir, target);

      if (i == 0)
        {
          g_assert_cmpstr (c->name, ==, "open");
          g_assert_cmpint (place, ==, ON_TEMP);
        }
      if (strcmp (c->name, "write") == 0)
        {
          g_assert_cmpint (place, ==, ON_TEMP);
          last_write = i;
          n_writes++;
        }
      if (strcmp (c->name, "fsync") == 0 && place == ON_TEMP)
        fsync_temp = i;
      if (strcmp (c->name, "close") == 0 && place == ON_TEMP)
        close_temp = i;
      if (place == RENAME_OVER)
        {
          g_assert_cmpint (rename_at, ==, -1);
          rename_at = i;
        }
      /* after the rename, only the folder */
      if (rename_at >= 0 && (int) i > rename_at)
        g_assert_cmpint (place, ==, ON_DIR);
    }
  /* 1000 bytes a write: the file's bytes over 1000, rounded up */
  g_assert_cmpuint (n_writes, ==, (n_new + 999) / 1000);
  g_assert_cmpint (close_temp, >, last_write);
  g_assert_cmpint (rename_at, >, close_temp);
  /* On btrfs GLib leaves the flush out: a rename there is ordered after the data it renames
   * (GLib 2.74 fd_should_be_fsynced(); from memory). Everywhere else the data is on the disk
   * before the name points at it. */
  g_assert_cmpint (statfs (dir, &fs), ==, 0);
  if (fs.f_type != 0x9123683E) /* BTRFS_SUPER_MAGIC, linux/magic.h */
    {
      g_assert_cmpint (fsync_temp, >, last_write);
      g_assert_cmpint (fsync_temp, <, close_temp);
    }
  remove_dir (dir);
}

/* One call fails, the rest work: a passing fault. */
static void
test_one_fault (void)
{
  Fault f = { NULL, 0, FALSE, 0, TRUE };
  guint runs = 0;

  load_versions ();
  g_assert_cmpuint (fail_each_call (&f, &runs), ==, 0);
}

/* From one call on, every call fails, the clean-up included: a disk that stays full or dead. */
static void
test_lasting_fault (void)
{
  Fault f = { NULL, 0, TRUE, 0, TRUE };
  guint runs = 0;
  guint left;

  load_versions ();
  left = fail_each_call (&f, &runs);
  /* the clean-up's unlink() fails whenever the temporary file was made: so some runs leave
   * one, checked to hold the start of the new bytes beside the whole old target */
  g_assert_cmpuint (left, >, 0);
}

/* Writes cut short, 1000 bytes at a time, as a filling disk gives: a fault lands between the
 * parts of the file, with some of it already written. */
static void
test_short_writes (void)
{
  Fault one = { NULL, 0, FALSE, 1000, TRUE };
  Fault lasting = { NULL, 0, TRUE, 1000, TRUE };
  guint runs = 0;

  load_versions ();
  g_assert_cmpuint (fail_each_call (&one, &runs), ==, 0);
  fail_each_call (&lasting, &runs);
}

/* Saving where no file was: a failed save leaves no file at all. */
static void
test_new_file (void)
{
  Fault one = { NULL, 0, FALSE, 0, FALSE };
  Fault lasting = { NULL, 0, TRUE, 0, FALSE };
  guint runs = 0;

  load_versions ();
  g_assert_cmpuint (fail_each_call (&one, &runs), ==, 0);
  fail_each_call (&lasting, &runs);
}

/* Killed mid-save --------------------------------------------------------------------------- */

/* A generated floor of about 3,000 members (tests/bench/floor-gen.h): some 0.6 MB in US units,
 * 0.7 MB in SI, the size of a large floor, whose save takes a fraction of a second. */
#define KILL_MEMBERS      3000
#define KILL_MAX          300
#define KILL_SECONDS      20

typedef struct
{
  int   fd;
  char  buf[8192] __attribute__((aligned (8)));
  gsize len;
  gsize pos;
} Watch;

/* The next event on the folder within timeout_ms: its mask and name; FALSE when none came. */
static gboolean
next_event (Watch       *w,
            int          timeout_ms,
            guint32     *mask,
            const char **name)
{
  const struct inotify_event *ev;

  if (w->pos >= w->len)
    {
      struct pollfd p = { w->fd, POLLIN, 0 };
      ssize_t n;

      if (poll (&p, 1, timeout_ms) <= 0)
        return FALSE;
      n = read (w->fd, w->buf, sizeof w->buf);
      if (n <= 0)
        return FALSE;
      w->len = n;
      w->pos = 0;
    }
  ev = (const struct inotify_event *) (w->buf + w->pos);
  w->pos += sizeof *ev + ev->len;
  *mask = ev->mask;
  *name = ev->len > 0 ? ev->name : "";
  return TRUE;
}

static void
drain_events (Watch *w)
{
  guint32 mask;
  const char *name;

  while (next_event (w, 0, &mask, &name))
    ;
}

/* Waits for the saver to start writing (its temporary file appears; or, were it to write the
 * target in place, the target changes) or, with done, to finish a save (the temporary file is
 * renamed over the target; or the target, written in place, is closed). Returns the time, in
 * microseconds. */
static gint64
wait_for (Watch    *w,
          gboolean  done)
{
  for (;;)
    {
      guint32 mask;
      const char *name;
      gboolean target;

      /* a save takes well under a second even on a busy machine */
      if (!next_event (w, 20000, &mask, &name))
        g_error ("the saver %s no save in 20 s", done ? "finished" : "began");
      target = strcmp (name, "plan.trabeate") == 0;
      if (done && target && (mask & (IN_MOVED_TO | IN_CLOSE_WRITE)) != 0)
        break;
      if (!done && target && (mask & IN_MODIFY) != 0)
        break;
      if (!done && (mask & IN_CREATE) != 0 && g_str_has_prefix (name, "plan.trabeate."))
        break;
    }
  return g_get_monotonic_time ();
}

/* A process that saves the project over target again and again, switching its units between
 * saves so that each save replaces one version with the other. */
static pid_t
start_saver (TrbProject *p,
             const char *target,
             gboolean    si_first)
{
  pid_t parent = getpid ();
  pid_t pid = fork ();

  g_assert_cmpint (pid, >=, 0);
  if (pid == 0)
    {
      /* dies with the test, should an assertion end it first */
      if (prctl (PR_SET_PDEATHSIG, SIGKILL) != 0 || getppid () != parent)
        _exit (1);
      for (gboolean si = si_first;; si = !si)
        {
          p->settings.units = si ? TRB_UNIT_SYSTEM_SI : TRB_UNIT_SYSTEM_US;
          if (!trb_project_save_file (p, target, NULL))
            _exit (1);
        }
    }
  return pid;
}

typedef struct
{
  const char *dir;
  const char *target;
  const char *us;       /* the two versions */
  gsize       n_us;
  const char *si;
  gsize       n_si;
  gboolean    on_disk_si;
  guint       kills;
  guint       as_us;
  guint       as_si;
  guint       mid_write;
  guint       temp_empty;
  guint       temp_partial;
  guint       temp_whole;
} Kills;

static void
kill_saver (Kills *k,
            pid_t  pid)
{
  g_autofree char *bytes = NULL;
  g_autoptr(GPtrArray) names = NULL;
  gsize n = 0;
  int status = 0;

  g_assert_cmpint (kill (pid, SIGKILL), ==, 0);
  g_assert_cmpint (waitpid (pid, &status, 0), ==, pid);
  /* killed: it never stops by itself, but on a failed save */
  g_assert_true (WIFSIGNALED (status));
  g_assert_cmpint (WTERMSIG (status), ==, SIGKILL);
  k->kills++;

  /* the target is one version or the other, whole */
  bytes = read_file (k->target, &n);
  if (same_bytes (bytes, n, k->us, k->n_us))
    {
      k->on_disk_si = FALSE;
      k->as_us++;
    }
  else if (same_bytes (bytes, n, k->si, k->n_si))
    {
      k->on_disk_si = TRUE;
      k->as_si++;
    }
  else
    g_error ("after kill %u the target is neither version (%" G_GSIZE_FORMAT " bytes)",
             k->kills, n);

  /* A temporary file left means the kill came between its creation and the rename. It holds
   * the start of the version being written (the one not on disk), and is never the target. */
  names = list_dir (k->dir);
  g_assert_cmpuint (names->len, <=, 2);
  for (guint i = 0; i < names->len; i++)
    {
      const char *name = g_ptr_array_index (names, i);
      g_autofree char *path = g_build_filename (k->dir, name, NULL);
      g_autofree char *temp = NULL;
      const char *writing = k->on_disk_si ? k->us : k->si;
      gsize n_writing = k->on_disk_si ? k->n_us : k->n_si;
      gsize nt = 0, written;

      if (strcmp (name, "plan.trabeate") == 0)
        continue;
      g_assert_true (is_temp_of (path, k->target));
      temp = read_file (path, &nt);
      g_assert_nonnull (temp);
      written = written_part (temp, nt, writing, n_writing);
      k->mid_write++;
      if (written == 0)
        k->temp_empty++;
      else if (written < n_writing)
        k->temp_partial++;
      else
        k->temp_whole++;
      g_assert_cmpint (g_remove (path), ==, 0);
    }
}

/* A saver is killed with SIGKILL again and again, at a random moment of its saves or at a
 * random moment while it writes its temporary file; after each kill the target is byte for
 * byte one version or the other, and each version loads. */
static void
test_killed (void)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = NULL;
  g_autofree char *xml = NULL;
  g_autofree char *us = NULL;
  g_autofree char *si = NULL;
  g_autofree char *dir = g_dir_make_tmp ("trb-killed-XXXXXX", NULL);
  g_autofree char *target = NULL;
  g_autoptr(TrbProject) back = NULL;
  g_autoptr(TrbProject) other = NULL;
  Watch w = { -1, { 0 }, 0, 0 };
  Kills k = { 0 };
  gint64 window = 0, cycle, start, deadline, t_create, t_rename, t_first;
  guint targeted = 0;
  guint n_members;
  pid_t pid;

  xml = floor_gen_xml (KILL_MEMBERS, &n_members);
  p = trb_project_load_data (xml, strlen (xml), "generated floor", &error);
  g_assert_no_error (error);
  p->settings.units = TRB_UNIT_SYSTEM_US;
  us = trb_project_save_data (p, &k.n_us, &error);
  g_assert_no_error (error);
  p->settings.units = TRB_UNIT_SYSTEM_SI;
  si = trb_project_save_data (p, &k.n_si, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (k.n_us, !=, k.n_si);

  g_assert_nonnull (dir);
  target = g_build_filename (dir, "plan.trabeate", NULL);
  g_assert_true (g_file_set_contents (target, us, k.n_us, &error));
  g_assert_no_error (error);
  k.dir = dir;
  k.target = target;
  k.us = us;
  k.si = si;
  w.fd = inotify_init1 (IN_NONBLOCK | IN_CLOEXEC);
  g_assert_cmpint (w.fd, >=, 0);
  g_assert_cmpint (inotify_add_watch (w.fd, dir, IN_CREATE | IN_MOVED_TO | IN_MODIFY |
                                                         IN_CLOSE_WRITE), >=, 0);

  /* How long a save takes, and how long its temporary file exists: three saves watched */
  pid = start_saver (p, target, !k.on_disk_si);
  t_first = wait_for (&w, TRUE);
  for (int i = 0; i < 2; i++)
    {
      t_create = wait_for (&w, FALSE);
      t_rename = wait_for (&w, TRUE);
      window = MAX (window, t_rename - t_create);
    }
  cycle = (t_rename - t_first) / 2;
  window = MAX (window, 1000);
  kill_saver (&k, pid);
  drain_events (&w);
  g_test_message ("%u members; %" G_GSIZE_FORMAT " and %" G_GSIZE_FORMAT " bytes; a save "
                  "every %.0f ms, its temporary file there for %.1f ms", n_members, k.n_us,
                  k.n_si, cycle / 1e3, window / 1e3);

  start = g_get_monotonic_time ();
  deadline = start + KILL_SECONDS * G_USEC_PER_SEC;
  while (k.kills < KILL_MAX && g_get_monotonic_time () < deadline)
    {
      pid = start_saver (p, target, !k.on_disk_si);
      if (g_test_rand_bit ())
        {
          /* anywhere in its first save or so */
          g_usleep (g_test_rand_int_range (0, (gint32) (cycle * 5 / 4)));
        }
      else
        {
          /* once its temporary file is there: while it is written (the first millisecond or
           * so, for half of these), flushed and renamed, or just after */
          wait_for (&w, FALSE);
          if (g_test_rand_bit ())
            g_usleep (g_test_rand_int_range (0, 1000));
          else
            g_usleep (g_test_rand_int_range (0, (gint32) (window * 3 / 2)));
          targeted++;
        }
      kill_saver (&k, pid);
      drain_events (&w);
    }
  close (w.fd);

  g_test_message ("%u kills in %.1f s (%u aimed at the write): the target whole every time, "
                  "%u times the US version and %u the SI one; %u kills mid-write (a temporary "
                  "file left: %u empty, %u partly written, %u whole but not yet renamed)",
                  k.kills, (g_get_monotonic_time () - start) / 1e6, targeted, k.as_us, k.as_si,
                  k.mid_write, k.temp_empty, k.temp_partial, k.temp_whole);
  /* Some 100 to 300 kills in a plain build, a third of them mid-write; a sanitizer build saves
   * five times slower and gets a few dozen. Enough to mean something anywhere: */
  g_assert_cmpuint (k.kills, >=, 20);
  g_assert_cmpuint (k.mid_write, >=, 5);
  g_assert_cmpuint (k.as_us, >, 0);
  g_assert_cmpuint (k.as_si, >, 0);

  /* what is on disk loads, and so does the other version */
  back = trb_project_load_file (target, &error);
  g_assert_no_error (error);
  g_assert_cmpuint (back->floors->len, ==, 1);
  other = trb_project_load_data (k.on_disk_si ? us : si, k.on_disk_si ? k.n_us : k.n_si,
                                 "the other version", &error);
  g_assert_no_error (error);
  remove_dir (dir);
}

int
main (int    argc,
      char **argv)
{
  int rc;

  g_test_init (&argc, &argv, NULL);
  g_test_add_func ("/trb/save-faults/trace", test_trace);
  g_test_add_func ("/trb/save-faults/one-fault", test_one_fault);
  g_test_add_func ("/trb/save-faults/lasting-fault", test_lasting_fault);
  g_test_add_func ("/trb/save-faults/short-writes", test_short_writes);
  g_test_add_func ("/trb/save-faults/new-file", test_new_file);
  g_test_add_func ("/trb/save-faults/killed", test_killed);
  rc = g_test_run ();
  g_test_message ("%u runs of save-child", n_cases);
  g_free (old_bytes);
  g_free (new_bytes);
  g_free (source);
  return rc;
}
