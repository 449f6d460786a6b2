/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Auto-sizing speed: generated steel members of three spans with eight loads, sized over the
 * whole W catalog with every check of AISC 360-16 ASD (combinations, live-load patterns,
 * envelopes, flexure with Lb and Cb per segment, shear, deflection). Prints members per
 * second on one core: the default solve (the lightest passing section chosen, with its full
 * result), and that with the shortlist of 10 passing sections the CLI shows, made on demand
 * (trb_solve_member_shortlist()). The members are a made-up spread of spans and loads, not a
 * design. `bench-sizing SRCDIR --once N` runs one untimed pass with a shortlist of N, for a
 * profiler; `--xml` prints the members as a project file. */

#include "config.h"

#include <string.h>
#include <time.h>

#include "trb-project-io.h"
#include "trb-solve.h"

#define N_MEMBERS 200

static char *
generate (GRand *rand)
{
  GString *xml = g_string_new ("<trabeate-project format=\"1\"><settings method=\"asd\"/>");

  for (int i = 0; i < N_MEMBERS; i++)
    {
      double spans[3];
      double length = 0;
      double x = 0;

      for (int s = 0; s < 3; s++)
        length += spans[s] = g_rand_double_range (rand, 12, 30);
      g_string_append_printf (xml, "<beam id=\"M%d\" length=\"%.3f ft\" material=\"steel\" "
                              "section=\"auto\">", i, length);
      g_string_append (xml, "<support at=\"0 ft\" type=\"pin\"/>");
      for (int s = 0; s < 3; s++)
        {
          x += spans[s];
          g_string_append_printf (xml, "<support at=\"%.3f ft\" type=\"roller\"/>",
                                  s == 2 ? length : x);
        }
      g_string_append_printf (xml, "<load case=\"D\" type=\"uniform\" from=\"0 ft\" "
                              "to=\"%.3f ft\" w=\"%.3f kip/ft\"/>", length,
                              g_rand_double_range (rand, 0.2, 0.8));
      g_string_append_printf (xml, "<load case=\"L\" type=\"uniform\" from=\"0 ft\" "
                              "to=\"%.3f ft\" w=\"%.3f kip/ft\"/>", length,
                              g_rand_double_range (rand, 0.3, 1.2));
      for (int k = 0; k < 6; k++)
        g_string_append_printf (xml, "<load case=\"%s\" type=\"point\" at=\"%.3f ft\" "
                                "p=\"%.3f kip\"/>", k % 2 ? "L" : "D",
                                g_rand_double_range (rand, 0, length),
                                g_rand_double_range (rand, 1, 8));
      g_string_append (xml, "</beam>");
    }
  g_string_append (xml, "</trabeate-project>");
  return g_string_free (xml, FALSE);
}

/* Processor time of this thread, s: on a shared machine, what the work itself takes. */
static double
cpu_seconds (void)
{
  struct timespec t;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &t);
  return t.tv_sec + t.tv_nsec / 1e9;
}

/* Members per second of wall-clock time; *cpu_rate the same over processor time. */
static double
rate (const TrbProject *project,
      guint             shortlist_max,
      guint            *n_pass,
      double           *cpu_rate)
{
  gint64 start = g_get_monotonic_time ();
  double c0 = cpu_seconds ();
  gint64 elapsed;
  guint done = 0;

  *n_pass = 0;
  do
    {
      for (guint i = 0; i < project->members->len; i++)
        {
          TrbMemberResult *r = trb_solve_member (project,
                                                 g_ptr_array_index (project->members, i));

          *n_pass += r->status == TRB_STATUS_PASS;
          if (shortlist_max > 0)
            g_array_unref (trb_solve_member_shortlist (project, r, shortlist_max));
          trb_member_result_free (r);
          done++;
        }
      elapsed = g_get_monotonic_time () - start;
    }
  while (elapsed < G_USEC_PER_SEC);
  *cpu_rate = done / (cpu_seconds () - c0);
  *n_pass /= done / project->members->len;
  return done / (elapsed / (double) G_USEC_PER_SEC);
}

int
main (int argc, char **argv)
{
  g_autoptr(GRand) rand = g_rand_new_with_seed (20261201);
  g_autofree char *xml = generate (rand);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = trb_project_load_data (xml, strlen (xml), "bench", &error);
  guint n_pass;
  double r10, r1, c10, c1;

  if (project == NULL)
    g_error ("%s", error->message);

  /* --xml: the members as a project file, to compare the CLI's output of two builds */
  if (argc > 2 && strcmp (argv[2], "--xml") == 0)
    {
      g_print ("%s\n", xml);
      return 0;
    }

  /* --once N: one untimed pass over the members with a shortlist of N, for a profiler */
  if (argc > 3 && strcmp (argv[2], "--once") == 0)
    {
      guint max = (guint) g_ascii_strtoull (argv[3], NULL, 10);

      for (guint i = 0; i < project->members->len; i++)
        {
          TrbMemberResult *r = trb_solve_member (project, g_ptr_array_index (project->members, i));

          if (max > 0)
            g_array_unref (trb_solve_member_shortlist (project, r, max));
          trb_member_result_free (r);
        }
      return 0;
    }

  r10 = rate (project, TRB_SHORTLIST_DEFAULT, &n_pass, &c10);
  g_print ("auto-sizing, 3 spans, 8 loads, W catalog, shortlist of %d: %.0f members/s "
           "(%u of %d pass)\n", TRB_SHORTLIST_DEFAULT, r10, n_pass, N_MEMBERS);
  g_print ("BENCH sizing_rate_shortlist10 %.0f members/s\n", r10);
  g_print ("over processor time: %.0f members/s\n", c10);
  g_print ("BENCH sizing_rate_shortlist10_cpu %.0f members/s\n", c10);
  r1 = rate (project, 0, &n_pass, &c1);
  g_print ("auto-sizing, lightest passing section only: %.0f members/s (processor time: "
           "%.0f)\n", r1, c1);
  g_print ("BENCH sizing_rate_lightest %.0f members/s\n", r1);
  g_print ("BENCH sizing_rate_lightest_cpu %.0f members/s\n", c1);
  return 0;
}
