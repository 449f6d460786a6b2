/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The floor solve on generated floors (tests/bench/floor-gen.h) of about 1,000 and 10,000
 * members: the full solve (frame, takedown, analysis and design with auto-sizing, live load
 * reduction), with and without its shortcuts; loading and saving the 10,000-member file; and
 * the peak memory of `trabeate-cli check` on it, measured on the child process.
 *
 * Usage: bench-floor SOURCE-ROOT [io]
 * SOURCE-ROOT is unused (the CLI is found beside this program in the build); with "io", only
 * the load, save and memory figures, not the solves. */

#include "config.h"

#include <glib/gstdio.h>
#include <stdio.h>
#include <string.h>
#include <sys/resource.h>
#include <sys/types.h>
#include <sys/wait.h>
#include <time.h>
#include <unistd.h>

#include "floor-gen.h"
#include "trb-project-io.h"
#include "trb-solve.h"
#include "trb-units.h"

/* The least of several runs: the figure of the machine when nothing else disturbs it. */
#define RUNS 5

/* Processor time of this thread, ms: on a shared machine, what the work itself takes. */
static double
cpu_ms (void)
{
  struct timespec t;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &t);
  return t.tv_sec * 1e3 + t.tv_nsec / 1e6;
}

static TrbProject *
load_text (const char *xml)
{
  g_autoptr(GError) error = NULL;
  TrbProject *p = trb_project_load_data (xml, strlen (xml), "generated.trabeate", &error);

  g_assert_no_error (error);
  return p;
}

/* Returns the least wall-clock time, ms; *cpu the least processor time. */
static double
time_solve (const TrbProject *p,
            gboolean          shortcuts,
            guint             runs,
            guint            *n_pass,
            double           *cpu)
{
  double best = G_MAXDOUBLE;
  TrbSolveOptions options;

  *cpu = G_MAXDOUBLE;
  trb_solve_options_init (&options);
  options.cache = options.bounds = shortcuts;
  for (guint r = 0; r < runs; r++)
    {
      gint64 t0 = g_get_monotonic_time ();
      double c0 = cpu_ms ();
      g_autoptr(TrbProjectResult) pr = trb_solve_project_full (p, &options);
      double ms = (g_get_monotonic_time () - t0) / 1000.0;

      *cpu = MIN (*cpu, cpu_ms () - c0);
      best = MIN (best, ms);
      if (n_pass != NULL)
        {
          *n_pass = 0;
          for (guint i = 0; i < pr->members->len; i++)
            *n_pass += ((TrbMemberResult *) g_ptr_array_index (pr->members, i))->status ==
                       TRB_STATUS_PASS;
        }
    }
  return best;
}

static void
bench_solve (guint target)
{
  guint n = 0, n_pass = 0;
  g_autofree char *xml = floor_gen_xml (target, &n);
  g_autoptr(TrbProject) p = load_text (xml);
  double cpu;
  double ms = time_solve (p, TRUE, RUNS, &n_pass, &cpu);

  printf ("floor of %u members (%u pass): full solve %.1f ms (processor %.1f ms), %.2f us per "
          "member\n", n, n_pass, ms, cpu, 1000 * ms / n);
  printf ("BENCH floor_solve_%u %.1f ms\n", target, ms);
  printf ("BENCH floor_solve_cpu_%u %.1f ms\n", target, cpu);
  printf ("BENCH floor_solve_per_member_%u %.2f us\n", target, 1000 * ms / n);
}

/* Without the cache of identical members and the sizing bounds: what they save. */
static void
bench_no_shortcuts (guint target)
{
  guint n = 0;
  g_autofree char *xml = floor_gen_xml (target, &n);
  g_autoptr(TrbProject) p = load_text (xml);
  double cpu;
  double ms = time_solve (p, FALSE, 1, NULL, &cpu);

  printf ("floor of %u members, every member solved in full: %.0f ms\n", n, ms);
  printf ("BENCH floor_solve_no_shortcuts_%u %.0f ms\n", target, ms);
}

/* Load, save (formatting and the atomic write with its fsync) and the formatting alone, so
 * that the write's share shows; wall-clock and processor time, the least of RUNS each. */
static void
bench_load_save (const char *path,
                 const char *dir)
{
  double load = G_MAXDOUBLE, save = G_MAXDOUBLE, format = G_MAXDOUBLE;
  double load_cpu = G_MAXDOUBLE, save_cpu = G_MAXDOUBLE, format_cpu = G_MAXDOUBLE;
  g_autofree char *out = g_build_filename (dir, "saved.trabeate", NULL);

  for (guint r = 0; r < RUNS; r++)
    {
      g_autoptr(GError) error = NULL;
      g_autofree char *data = NULL;
      gint64 t0 = g_get_monotonic_time ();
      double c0 = cpu_ms ();
      g_autoptr(TrbProject) p = trb_project_load_file (path, &error);
      gint64 t1 = g_get_monotonic_time ();
      double c1 = cpu_ms ();
      gint64 t2;
      double c2;

      g_assert_no_error (error);
      trb_project_save_file (p, out, &error);
      g_assert_no_error (error);
      t2 = g_get_monotonic_time ();
      c2 = cpu_ms ();
      data = trb_project_save_data (p, NULL, &error);
      g_assert_no_error (error);
      load = MIN (load, (t1 - t0) / 1000.0);
      load_cpu = MIN (load_cpu, c1 - c0);
      save = MIN (save, (t2 - t1) / 1000.0);
      save_cpu = MIN (save_cpu, c2 - c1);
      format = MIN (format, (g_get_monotonic_time () - t2) / 1000.0);
      format_cpu = MIN (format_cpu, cpu_ms () - c2);
    }
  printf ("10,000-member file: load %.1f ms (processor %.1f ms), save %.1f ms (processor "
          "%.1f ms), of which the text alone %.1f ms (processor %.1f ms)\n", load, load_cpu,
          save, save_cpu, format, format_cpu);
  printf ("BENCH floor_load_10000 %.1f ms\n", load);
  printf ("BENCH floor_load_cpu_10000 %.1f ms\n", load_cpu);
  printf ("BENCH floor_save_10000 %.1f ms\n", save);
  printf ("BENCH floor_save_cpu_10000 %.1f ms\n", save_cpu);
  printf ("BENCH floor_save_text_10000 %.1f ms\n", format);
  printf ("BENCH floor_save_text_cpu_10000 %.1f ms\n", format_cpu);
  g_unlink (out);
}

/* The save's text when the plan's values are not a few hundred repeated ones: every member
 * end moved by 0 to 1/4 in (by its index), so that the memo of formatted quantities seldom
 * hits and the formatting itself is measured (about 6,600 distinct texts against 417). */
static void
bench_save_distinct (const char *path)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) p = trb_project_load_file (path, &error);
  double best = G_MAXDOUBLE, best_cpu = G_MAXDOUBLE;
  guint k = 0;

  g_assert_no_error (error);
  for (guint f = 0; f < p->floors->len; f++)
    {
      TrbFloor *floor = g_ptr_array_index (p->floors, f);

      for (guint i = 0; i < floor->members->len; i++, k++)
        {
          TrbMember *m = g_ptr_array_index (floor->members, i);
          double d = (k % 17) * TRB_IN / 64;

          m->start.x += d;
          m->start.y += d;
          m->end.x += d;
          m->end.y += d;
        }
    }
  for (guint r = 0; r < RUNS; r++)
    {
      gint64 t0 = g_get_monotonic_time ();
      double c0 = cpu_ms ();
      g_autofree char *data = trb_project_save_data (p, NULL, &error);

      g_assert_no_error (error);
      best_cpu = MIN (best_cpu, cpu_ms () - c0);
      best = MIN (best, (g_get_monotonic_time () - t0) / 1000.0);
    }
  printf ("10,000-member file, member ends moved: the save's text %.1f ms (processor %.1f ms)\n",
          best, best_cpu);
  printf ("BENCH floor_save_text_distinct_10000 %.1f ms\n", best);
  printf ("BENCH floor_save_text_distinct_cpu_10000 %.1f ms\n", best_cpu);
}

/* Runs the CLI on the file with its output thrown away, and reads the child's peak resident
 * set size from the kernel (getrusage through wait4). */
static void
bench_cli (const char *cli,
           const char *path,
           gboolean    json)
{
  struct rusage ru;
  int status = 0;
  gint64 t0;
  pid_t pid;

  /* what is printed so far must not be printed again by the child */
  fflush (stdout);
  t0 = g_get_monotonic_time ();
  pid = fork ();

  if (pid == 0)
    {
      FILE *devnull = freopen ("/dev/null", "w", stdout);

      (void) devnull;
      execl (cli, cli, "check", path, json ? "--json" : NULL, NULL);
      _exit (127);
    }
  g_assert_cmpint (pid, >, 0);
  g_assert_cmpint (wait4 (pid, &status, 0, &ru), ==, pid);
  g_assert_true (WIFEXITED (status));
  g_assert_cmpint (WEXITSTATUS (status), <=, 1);
  printf ("trabeate-cli check%s on it: %.0f ms, peak memory %.1f MB\n", json ? " --json" : "",
          (g_get_monotonic_time () - t0) / 1000.0, ru.ru_maxrss / 1024.0);
  printf ("BENCH floor_cli_check%s_peak_rss_10000 %.1f MB\n", json ? "_json" : "",
          ru.ru_maxrss / 1024.0);
}

int
main (int    argc,
      char **argv)
{
  g_autofree char *dir = NULL;
  g_autofree char *path = NULL;
  g_autofree char *xml = NULL;
  g_autofree char *here = g_path_get_dirname (argv[0]);
  g_autofree char *cli = g_build_filename (here, "..", "..", "src", "cli", "trabeate-cli",
                                           NULL);
  g_autoptr(GError) error = NULL;
  guint n = 0;
  gboolean io_only = argc > 2 && strcmp (argv[2], "io") == 0;

  if (!io_only)
    {
      bench_solve (1000);
      bench_solve (10000);
      bench_no_shortcuts (1000);
    }

  dir = g_dir_make_tmp ("bench-floor-XXXXXX", &error);
  g_assert_no_error (error);
  path = g_build_filename (dir, "floor-10000.trabeate", NULL);
  xml = floor_gen_xml (10000, &n);
  g_file_set_contents (path, xml, -1, &error);
  g_assert_no_error (error);
  printf ("10,000-member file: %u members, %.1f MB\n", n, strlen (xml) / 1e6);
  bench_load_save (path, dir);
  bench_save_distinct (path);
  if (g_file_test (cli, G_FILE_TEST_IS_EXECUTABLE))
    {
      bench_cli (cli, path, FALSE);
      bench_cli (cli, path, TRUE);
    }
  else
    printf ("trabeate-cli not found at %s: peak memory not measured\n", cli);
  g_unlink (path);
  g_rmdir (dir);
  return 0;
}
