/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The beam benchmark.
 *
 * 1. 1,000 generated beams (fixed seed; 2-4 spans, overhangs and fixed ends now and then, 5-10
 *    loads of every kind in the cases D, L and Lr) go through trb_solve_member(), as the CLI
 *    runs a member: every load case, every combination and live-load pattern, the envelopes,
 *    the design step (deflection checks of a custom section), and then 200 sample points of
 *    each load case for the diagrams. Repeated until at least a second has passed; prints
 *    "BENCH beam_solve_rate <beams/s> beams/s". The beam engine alone on the same beams (the
 *    three load cases, their extremes and samples) is "BENCH beam_engine_rate", to show how
 *    the time divides; ccx against it is "BENCH beam_ccx_engine_ratio".
 * 2. The first 50 of those beams go to CalculiX, modelled as tests/reference/ccx_beams.py does
 *    (that script writes and reads the models: one ccx run per load case of each beam). The
 *    time ccx itself takes per beam, over ours per beam, is "BENCH beam_ccx_ratio <x> x".
 * 3. Our load-case results on those 50 beams are checked against ccx's to the tolerances of the
 *    reference check: reactions and extreme moments within 0.5 %, deflections within 1 %, each
 *    relative to the largest magnitude of that quantity in the load case.
 *
 * Usage: bench-beams SOURCE-ROOT [--no-ccx]   (--no-ccx: part 1 only, e.g. under a profiler) */

#include "config.h"

#include <gio/gio.h>
#include <glib/gstdio.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "bench-pipeline.h"

#define N_BEAMS    1000
#define N_CCX      50
#define SEED       20260314u

#define TOL_FORCE  0.005
#define TOL_MOMENT 0.005
#define TOL_DEFL   0.01

static const char *const case_names[TRB_BENCH_N_CASES] = { "D", "L", "Lr" };

/* Positions on a 100 mm grid, in grid steps; key points (ends, supports, load points, load
 * ends) either equal or at least 200 mm apart, as the CalculiX mesh wants room around each. */
typedef struct
{
  int keys[64];
  int n_keys;
} KeySet;

static gboolean
key_free (const KeySet *ks,
          int           p)
{
  for (int i = 0; i < ks->n_keys; i++)
    {
      if (p != ks->keys[i] && abs (p - ks->keys[i]) < 2)
        return FALSE;
    }
  return TRUE;
}

static void
key_add (KeySet *ks,
         int     p)
{
  if (ks->n_keys < (int) G_N_ELEMENTS (ks->keys))
    ks->keys[ks->n_keys++] = p;
}

static int
key_pick (KeySet *ks,
          GRand  *rand,
          int     lo,
          int     hi)
{
  for (int tries = 0; tries < 200; tries++)
    {
      int p = g_rand_int_range (rand, lo, hi + 1);

      if (key_free (ks, p))
        return p;
    }
  return -1;
}

static void
generate_beam (GRand        *rand,
               TrbBenchBeam *bb)
{
  const double grid = 0.1;
  KeySet ks = { { 0 }, 0 };
  int n_spans = g_rand_int_range (rand, 2, 5);
  int left = g_rand_double (rand) < 0.3 ? g_rand_int_range (rand, 8, 26) : 0;
  int right = g_rand_double (rand) < 0.3 ? g_rand_int_range (rand, 8, 26) : 0;
  int x = left;
  int n_loads;
  static const double E_choices[] = { 200.0e9, 12.0e9, 11.0e9 };

  memset (bb, 0, sizeof *bb);

  bb->supports[0].x = x * grid;
  bb->supports[0].type = (left == 0 && g_rand_double (rand) < 0.2) ? TRB_SUPPORT_FIXED
                                                                   : TRB_SUPPORT_PIN;
  key_add (&ks, x);
  for (int s = 0; s < n_spans; s++)
    {
      x += g_rand_int_range (rand, 30, 91);
      bb->supports[s + 1].x = x * grid;
      bb->supports[s + 1].type = TRB_SUPPORT_ROLLER;
      key_add (&ks, x);
    }
  bb->n_supports = n_spans + 1;
  if (right == 0 && g_rand_double (rand) < 0.2)
    bb->supports[n_spans].type = TRB_SUPPORT_FIXED;
  x += right;
  key_add (&ks, 0);
  key_add (&ks, x);
  bb->length = x * grid;
  bb->E = E_choices[g_rand_int_range (rand, 0, 3)];
  bb->I = g_rand_int_range (rand, 10, 501) * 1.0e-6;  /* 1e7 to 5e8 mm4 */

  n_loads = g_rand_int_range (rand, 5, 11);
  for (int j = 0; j < n_loads; j++)
    {
      /* the first three loads give each case at least one */
      int c = j < TRB_BENCH_N_CASES ? j : g_rand_int_range (rand, 0, TRB_BENCH_N_CASES);
      TrbLoad *ld = &bb->loads[c][bb->n_loads[c]];
      int kind = g_rand_int_range (rand, 0, 5);
      int a, b;

      switch (kind)
        {
        case 0:  /* point */
        case 4:  /* moment */
          a = key_pick (&ks, rand, 0, x);
          if (a < 0)
            continue;
          key_add (&ks, a);
          ld->kind = kind == 0 ? TRB_LOAD_POINT : TRB_LOAD_MOMENT;
          ld->a = ld->b = a * grid;
          if (kind == 0)
            ld->w1 = g_rand_int_range (rand, 2, 81) * 1.0e3;
          else
            ld->w1 = g_rand_int_range (rand, 3, 81) * 1.0e3
                     * (g_rand_double (rand) < 0.6 ? 1.0 : -1.0);
          ld->w2 = ld->w1;
          break;

        case 1:  /* uniform over the whole member */
          ld->kind = TRB_LOAD_UNIFORM;
          ld->a = 0.0;
          ld->b = bb->length;
          ld->w1 = ld->w2 = g_rand_int_range (rand, 1, 31) * 1.0e3;
          break;

        default:  /* partial uniform, linear */
          a = key_pick (&ks, rand, 0, x - 2);
          if (a < 0)
            continue;
          key_add (&ks, a);
          b = key_pick (&ks, rand, a + 2, x);
          if (b < 0)
            continue;
          key_add (&ks, b);
          ld->kind = kind == 2 ? TRB_LOAD_UNIFORM : TRB_LOAD_LINEAR;
          ld->a = a * grid;
          ld->b = b * grid;
          ld->w1 = g_rand_int_range (rand, 1, 31) * 1.0e3;
          ld->w2 = kind == 2 ? ld->w1 : g_rand_int_range (rand, 0, 31) * 1.0e3;
          break;
        }
      bb->n_loads[c]++;
    }
}

/* --- CalculiX ------------------------------------------------------------------------------ */

typedef struct
{
  double wall;           /* ccx's own run time for the beam, all its load cases */
  double cpu;            /* and the processor time it used */
  int    n_elems;
  double M_max[TRB_BENCH_N_CASES], M_min[TRB_BENCH_N_CASES];
  double defl_down[TRB_BENCH_N_CASES], defl_up[TRB_BENCH_N_CASES];
  double R_x[TRB_BENCH_N_CASES][TRB_BENCH_MAX_SUPPORTS];
  double R_force[TRB_BENCH_N_CASES][TRB_BENCH_MAX_SUPPORTS];
  double R_moment[TRB_BENCH_N_CASES][TRB_BENCH_MAX_SUPPORTS];
  guint  n_reactions[TRB_BENCH_N_CASES];
  gboolean seen[TRB_BENCH_N_CASES];
} CcxBeam;

static const char *
load_kind_name (TrbLoadKind kind)
{
  switch (kind)
    {
    case TRB_LOAD_POINT:   return "point";
    case TRB_LOAD_UNIFORM: return "uniform";
    case TRB_LOAD_LINEAR:  return "linear";
    case TRB_LOAD_MOMENT:  return "moment";
    default:               g_assert_not_reached ();
    }
}

static const char *
support_type_name (TrbSupportType type)
{
  switch (type)
    {
    case TRB_SUPPORT_PIN:    return "pin";
    case TRB_SUPPORT_ROLLER: return "roller";
    case TRB_SUPPORT_FIXED:  return "fixed";
    default:                 g_assert_not_reached ();
    }
}

static int
case_index (const char *name)
{
  for (int c = 0; c < TRB_BENCH_N_CASES; c++)
    {
      if (strcmp (name, case_names[c]) == 0)
        return c;
    }
  return -1;
}

/* The beams in the line format of ccx_beams.py --solve-list. */
static char *
beams_to_text (const TrbBenchBeam *beams,
               guint               n)
{
  GString *s = g_string_new (NULL);
  char buf[6][G_ASCII_DTOSTR_BUF_SIZE];

  for (guint i = 0; i < n; i++)
    {
      const TrbBenchBeam *bb = &beams[i];

      g_string_append_printf (s, "beam B%u %s %s %s\n", i + 1,
                              g_ascii_dtostr (buf[0], sizeof buf[0], bb->length),
                              g_ascii_dtostr (buf[1], sizeof buf[1], bb->E),
                              g_ascii_dtostr (buf[2], sizeof buf[2], bb->I));
      for (guint k = 0; k < bb->n_supports; k++)
        g_string_append_printf (s, "support %s %s\n",
                                g_ascii_dtostr (buf[0], sizeof buf[0], bb->supports[k].x),
                                support_type_name (bb->supports[k].type));
      for (int c = 0; c < TRB_BENCH_N_CASES; c++)
        {
          for (guint j = 0; j < bb->n_loads[c]; j++)
            {
              const TrbLoad *ld = &bb->loads[c][j];

              g_string_append_printf (s, "load %s %s %s %s %s %s\n", case_names[c],
                                      load_kind_name (ld->kind),
                                      g_ascii_dtostr (buf[0], sizeof buf[0], ld->a),
                                      g_ascii_dtostr (buf[1], sizeof buf[1], ld->b),
                                      g_ascii_dtostr (buf[2], sizeof buf[2], ld->w1),
                                      g_ascii_dtostr (buf[3], sizeof buf[3], ld->w2));
            }
        }
    }
  return g_string_free (s, FALSE);
}

static gboolean
parse_ccx_results (const char  *text,
                   CcxBeam     *out,
                   guint        n,
                   GError     **error)
{
  g_auto(GStrv) lines = g_strsplit (text, "\n", -1);

  for (guint i = 0; lines[i] != NULL; i++)
    {
      g_auto(GStrv) f = g_strsplit_set (g_strstrip (lines[i]), " ", -1);
      guint nf = g_strv_length (f);
      guint b;
      int c;

      if (nf == 0 || f[0][0] == '\0')
        continue;
      if (nf < 2 || f[1][0] != 'B' || (b = (guint) atoi (f[1] + 1)) < 1 || b > n)
        goto bad;
      b--;
      if (strcmp (f[0], "beam") == 0 && nf == 5)
        {
          out[b].wall = g_ascii_strtod (f[2], NULL);
          out[b].cpu = g_ascii_strtod (f[3], NULL);
          out[b].n_elems = atoi (f[4]);
          continue;
        }
      if (nf < 3 || (c = case_index (f[2])) < 0)
        goto bad;
      if (strcmp (f[0], "case") == 0 && nf == 7)
        {
          out[b].M_max[c] = g_ascii_strtod (f[3], NULL);
          out[b].M_min[c] = g_ascii_strtod (f[4], NULL);
          out[b].defl_down[c] = g_ascii_strtod (f[5], NULL);
          out[b].defl_up[c] = g_ascii_strtod (f[6], NULL);
          out[b].seen[c] = TRUE;
        }
      else if (strcmp (f[0], "reaction") == 0 && nf == 6
               && out[b].n_reactions[c] < TRB_BENCH_MAX_SUPPORTS)
        {
          guint k = out[b].n_reactions[c]++;

          out[b].R_x[c][k] = g_ascii_strtod (f[3], NULL);
          out[b].R_force[c][k] = g_ascii_strtod (f[4], NULL);
          out[b].R_moment[c][k] = g_ascii_strtod (f[5], NULL);
        }
      else
        goto bad;
      continue;

    bad:
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_INVALID_DATA,
                   "ccx results, line %u: “%s”", i + 1, lines[i]);
      return FALSE;
    }
  return TRUE;
}

/* Runs ccx through the reference script on beams[0 .. n-1]; FALSE with a message when ccx or
 * python is missing or a model fails. */
static gboolean
run_ccx (const char          *srcroot,
         const TrbBenchBeam  *beams,
         guint                n,
         CcxBeam             *out,
         double              *wall_seconds,
         GError             **error)
{
  g_autofree char *script = g_build_filename (srcroot, "tests", "reference", "ccx_beams.py",
                                              NULL);
  g_autofree char *python = NULL;
  g_autofree char *ccx = g_find_program_in_path ("ccx");
  g_autofree char *dir = NULL;
  g_autofree char *in_path = NULL;
  g_autofree char *out_path = NULL;
  g_autofree char *text = NULL;
  g_autofree char *result = NULL;
  g_autofree char *child_out = NULL;
  g_autofree char *child_err = NULL;
  int status = 0;
  gint64 t0;

  if (ccx == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_NOT_FOUND, "ccx (CalculiX) is not on PATH");
      return FALSE;
    }
  /* Debian's python3; the script needs nothing beyond the standard library */
  python = g_file_test ("/usr/bin/python3", G_FILE_TEST_IS_EXECUTABLE)
           ? g_strdup ("/usr/bin/python3") : g_find_program_in_path ("python3");
  if (python == NULL)
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_NOT_FOUND, "python3 is not on PATH");
      return FALSE;
    }
  dir = g_dir_make_tmp ("trb-bench-XXXXXX", error);
  if (dir == NULL)
    return FALSE;
  in_path = g_build_filename (dir, "beams.txt", NULL);
  out_path = g_build_filename (dir, "ccx.txt", NULL);
  text = beams_to_text (beams, n);
  if (!g_file_set_contents (in_path, text, -1, error))
    return FALSE;

  {
    const char *argv[] = { python, script, "--solve-list", in_path, out_path, NULL };

    t0 = g_get_monotonic_time ();
    if (!g_spawn_sync (NULL, (char **) argv, NULL, G_SPAWN_DEFAULT, NULL, NULL,
                       &child_out, &child_err, &status, error))
      return FALSE;
    *wall_seconds = (g_get_monotonic_time () - t0) / 1e6;
  }
  if (!g_spawn_check_wait_status (status, NULL))
    {
      g_set_error (error, G_IO_ERROR, G_IO_ERROR_FAILED, "ccx_beams.py --solve-list: %s%s",
                   child_out, child_err);
      return FALSE;
    }
  if (!g_file_get_contents (out_path, &result, NULL, error))
    return FALSE;
  g_unlink (in_path);
  g_unlink (out_path);
  g_rmdir (dir);
  return parse_ccx_results (result, out, n, error);
}

/* --- Comparison ---------------------------------------------------------------------------- */

typedef struct
{
  double force, moment, defl;        /* worst relative differences */
  char   force_at[64], moment_at[64], defl_at[64];
  guint  failures;
} Worst;

static void
note (double      e,
      double      tol,
      double     *worst,
      char       *where,
      gsize       where_size,
      guint      *failures,
      guint       beam,
      const char *cname,
      const char *what)
{
  if (e > *worst)
    {
      *worst = e;
      g_snprintf (where, where_size, "B%u %s %s", beam + 1, cname, what);
    }
  if (e > tol)
    {
      (*failures)++;
      printf ("  disagree: B%u %s %s off by %.4f %%\n", beam + 1, cname, what, 100 * e);
    }
}

/* Our load-case results, as trb_solve_member() gave them in the timed runs, against ccx's. */
static void
compare (TrbBenchPipeline   *pipeline,
         const TrbBenchBeam *bb,
         guint               index,
         const CcxBeam      *ref,
         Worst              *w)
{
  g_autoptr(TrbMemberResult) mr = trb_bench_pipeline_solve (pipeline, index);

  if (!mr->analysed || mr->self_weight != 0.0)
    {
      /* a custom section given by E and I alone has no self-weight to add to case D */
      printf ("  B%u: %s, self-weight %g N/m\n", index + 1,
              mr->analysed ? "analysed" : "not analysed", mr->self_weight);
      w->failures++;
      return;
    }
  for (int c = 0; c < TRB_BENCH_N_CASES; c++)
    {
      const TrbBeamResult *r = mr->cases[trb_bench_case (c)];
      const TrbBeamExtremes *e = &mr->case_ext[trb_bench_case (c)];
      const TrbReaction *rs;
      guint n_rs;
      double f_scale = 1e-9, m_scale = 1e-9, d_scale = 1e-15;

      if (bb->n_loads[c] == 0)
        continue;
      if (!ref->seen[c] || r == NULL)
        {
          printf ("  B%u %s: no result from %s\n", index + 1, case_names[c],
                  r == NULL ? "trb_solve_member" : "ccx");
          w->failures++;
          continue;
        }
      rs = trb_beam_result_get_reactions (r, &n_rs);

      for (guint k = 0; k < ref->n_reactions[c]; k++)
        {
          f_scale = MAX (f_scale, fabs (ref->R_force[c][k]));
          m_scale = MAX (m_scale, fabs (ref->R_moment[c][k]));
        }
      m_scale = MAX (m_scale, MAX (fabs (ref->M_max[c]), fabs (ref->M_min[c])));
      d_scale = MAX (d_scale, MAX (ref->defl_down[c], ref->defl_up[c]));

      if (n_rs != ref->n_reactions[c])
        {
          printf ("  B%u %s: %u reactions, ccx %u\n", index + 1, case_names[c], n_rs,
                  ref->n_reactions[c]);
          w->failures++;
          continue;
        }
      for (guint k = 0; k < n_rs; k++)
        {
          char what[48];

          g_snprintf (what, sizeof what, "R at %.2f m", rs[k].x);
          note (fabs (rs[k].force - ref->R_force[c][k]) / f_scale, TOL_FORCE, &w->force,
                w->force_at, sizeof w->force_at, &w->failures, index, case_names[c], what);
          g_snprintf (what, sizeof what, "R moment at %.2f m", rs[k].x);
          note (fabs (rs[k].moment - ref->R_moment[c][k]) / m_scale, TOL_MOMENT, &w->moment,
                w->moment_at, sizeof w->moment_at, &w->failures, index, case_names[c], what);
        }
      note (fabs (e->M_max - ref->M_max[c]) / m_scale, TOL_MOMENT, &w->moment, w->moment_at,
            sizeof w->moment_at, &w->failures, index, case_names[c], "M_max");
      note (fabs (e->M_min - ref->M_min[c]) / m_scale, TOL_MOMENT, &w->moment, w->moment_at,
            sizeof w->moment_at, &w->failures, index, case_names[c], "M_min");
      note (fabs (e->defl_down - ref->defl_down[c]) / d_scale, TOL_DEFL, &w->defl, w->defl_at,
            sizeof w->defl_at, &w->failures, index, case_names[c], "defl_down");
      note (fabs (e->defl_up - ref->defl_up[c]) / d_scale, TOL_DEFL, &w->defl, w->defl_at,
            sizeof w->defl_at, &w->failures, index, case_names[c], "defl_up");
    }
}

/* Processor time of this thread, s: on a shared machine, what the work itself takes. */
static double
cpu_seconds (void)
{
  struct timespec t;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &t);
  return t.tv_sec + t.tv_nsec / 1e9;
}

/* --- main ---------------------------------------------------------------------------------- */

int
main (int    argc,
      char **argv)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (SEED);
  g_autofree TrbBenchBeam *beams = g_new0 (TrbBenchBeam, N_BEAMS);
  g_autofree CcxBeam *ccx = g_new0 (CcxBeam, N_CCX);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbBenchPipeline) pipeline = NULL;
  guint64 n_solved = 0;
  double checksum = 0.0;
  double elapsed, rate, ours_per_beam, engine_per_beam = 0.0, script_wall = 0.0, ccx_wall = 0.0, ccx_cpu = 0.0;
  double c0, cpu;
  gint64 t0;
  guint n_loads = 0, n_spans = 0;
  Worst worst = { 0 };

  if (argc < 2 || argc > 3 || (argc == 3 && strcmp (argv[2], "--no-ccx") != 0))
    {
      fprintf (stderr, "usage: %s SOURCE-ROOT [--no-ccx]\n", argv[0]);
      return 2;
    }

  for (guint i = 0; i < N_BEAMS; i++)
    {
      generate_beam (rand, &beams[i]);
      n_spans += beams[i].n_supports - 1;
      for (int c = 0; c < TRB_BENCH_N_CASES; c++)
        n_loads += beams[i].n_loads[c];
    }
  printf ("%u beams (seed %u): %.2f spans and %.2f loads a beam on average, cases D, L, Lr\n",
          N_BEAMS, SEED, (double) n_spans / N_BEAMS, (double) n_loads / N_BEAMS);

  pipeline = trb_bench_pipeline_new (beams, N_BEAMS);
  printf ("per beam: %s\n", trb_bench_pipeline_describe (pipeline));

  /* one untimed pass to warm caches and catch errors */
  for (guint i = 0; i < N_BEAMS; i++)
    {
      if (!trb_bench_pipeline_run (pipeline, i, &checksum, &error))
        {
          fprintf (stderr, "beam B%u: %s\n", i + 1, error->message);
          return 1;
        }
    }

  t0 = g_get_monotonic_time ();
  c0 = cpu_seconds ();
  do
    {
      for (guint i = 0; i < N_BEAMS; i++)
        trb_bench_pipeline_run (pipeline, i, &checksum, NULL);
      n_solved += N_BEAMS;
      elapsed = (g_get_monotonic_time () - t0) / 1e6;
    }
  while (elapsed < 1.0);
  cpu = cpu_seconds () - c0;

  rate = n_solved / elapsed;
  ours_per_beam = elapsed / n_solved;
  printf ("solved %" G_GUINT64_FORMAT " beams in %.3f s on one thread: %.0f beams/s, "
          "%.2f us a beam, %.1f combination and pattern results a beam (checksum %.6g)\n",
          n_solved, elapsed, rate, 1e6 * ours_per_beam,
          (double) trb_bench_pipeline_n_results (pipeline) / trb_bench_pipeline_n_runs (pipeline),
          checksum);
  printf ("BENCH beam_solve_rate %.0f beams/s\n", rate);
  printf ("the same over the thread's processor time: %.0f beams/s, %.2f us a beam\n",
          n_solved / cpu, 1e6 * cpu / n_solved);
  printf ("BENCH beam_solve_rate_cpu %.0f beams/s\n", n_solved / cpu);

  /* the engine alone, to show how the time divides */
  {
    guint64 n_engine = 0;
    double engine_elapsed, engine_cpu;

    t0 = g_get_monotonic_time ();
    c0 = cpu_seconds ();
    do
      {
        for (guint i = 0; i < N_BEAMS; i++)
          trb_bench_engine_run (pipeline, &beams[i], &checksum, NULL);
        n_engine += N_BEAMS;
        engine_elapsed = (g_get_monotonic_time () - t0) / 1e6;
      }
    while (engine_elapsed < 1.0);
    engine_cpu = cpu_seconds () - c0;
    printf ("the beam engine alone (the beam, 3 load cases, their extremes and samples): "
            "%.0f beams/s, %.2f us a beam (checksum %.6g)\n", n_engine / engine_elapsed,
            1e6 * engine_elapsed / n_engine, checksum);
    printf ("BENCH beam_engine_rate %.0f beams/s\n", n_engine / engine_elapsed);
    printf ("BENCH beam_engine_rate_cpu %.0f beams/s\n", n_engine / engine_cpu);
    engine_per_beam = engine_elapsed / n_engine;
  }

  if (argc == 3)
    return 0;
  if (!run_ccx (argv[1], beams, N_CCX, ccx, &script_wall, &error))
    {
      printf ("CalculiX comparison skipped: %s\n", error->message);
      return 0;
    }
  {
    int n_elems = 0;

    for (guint i = 0; i < N_CCX; i++)
      {
        ccx_wall += ccx[i].wall;
        ccx_cpu += ccx[i].cpu;
        n_elems += ccx[i].n_elems;
      }
    printf ("ccx on the first %u beams (B32, about %d elements a beam, one run per load case, "
            "one thread): %.3f s of processor time, %.3f s elapsed in ccx, %.3f s with "
            "writing and reading the models\n", N_CCX, n_elems / N_CCX, ccx_cpu, ccx_wall,
            script_wall);
  }
  /* ours is one busy thread, so its elapsed time is its processor time; ccx's processor time
   * is the smaller of its two figures, which keeps the ratio on the safe side */
  printf ("time a beam: ours %.3g ms (with combinations, patterns, envelopes, design and "
          "samples), ccx %.3g ms of processor time (load cases only)\n",
          1e3 * ours_per_beam, 1e3 * ccx_cpu / N_CCX);
  printf ("BENCH beam_ccx_ratio %.0f x\n", (ccx_cpu / N_CCX) / ours_per_beam);
  /* like for like: ccx solves the load cases only, as the engine alone does */
  printf ("ccx against the beam engine alone (load cases, extremes, samples): %.0f x\n",
          (ccx_cpu / N_CCX) / engine_per_beam);
  printf ("BENCH beam_ccx_engine_ratio %.0f x\n", (ccx_cpu / N_CCX) / engine_per_beam);

  for (guint i = 0; i < N_CCX; i++)
    {
      guint before = worst.failures;

      compare (pipeline, &beams[i], i, &ccx[i], &worst);
      if (worst.failures > before)
        {
          /* the beam as ccx_beams.py --solve-list reads it, to look into it again */
          g_autofree char *text = beams_to_text (&beams[i], 1);

          printf ("%s", text);
        }
    }
  printf ("worst differences against ccx: reactions %.4f %% (%s), moments %.4f %% (%s), "
          "deflections %.4f %% (%s); limits %.1f %%, %.1f %%, %.1f %%\n",
          100 * worst.force, worst.force_at, 100 * worst.moment, worst.moment_at,
          100 * worst.defl, worst.defl_at, 100 * TOL_FORCE, 100 * TOL_MOMENT, 100 * TOL_DEFL);
  if (worst.failures > 0)
    {
      printf ("%u values disagree with ccx beyond the limits\n", worst.failures);
      return 1;
    }
  printf ("all %u beams agree with ccx\n", N_CCX);
  return 0;
}
