/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* beam-dump: reads one beam from stdin, solves it with the beam engine and prints what it
 * finds, every number with %.17g, for the symbolic check (tests/reference/sympy_beams.py).
 *
 * Input, one command a line, SI units, '#' starts a comment:
 *   beam L E I                  the member (once, first)
 *   support x pin|roller|fixed  any number
 *   case                        starts a new load set (the first one starts by itself)
 *   point a P                   P down +
 *   uniform a b w               w down +
 *   linear a b w1 w2            w1 at a, w2 at b, down +
 *   moment a m                  clockwise +
 *   factors f1 f2 ...           optional: print the combination sum f_i * case_i instead of
 *                               the single case (one factor per load set)
 *   eval x                      values at x, from the left and from the right
 *   extremes a b                extremes over [a, b]
 *
 * Output, one result a line, in this order:
 *   reaction x force moment
 *   value x left|right V M theta defl
 *   extremes a b V_max x V_min x M_max x M_min x defl_down x defl_up x
 * or, when the engine refuses the beam or a load set, one line
 *   error invalid|unstable|other message
 * with exit status 3. Malformed input exits with status 2. */

#include "config.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <glib.h>

#include "trb-beam.h"
#include "trb-error.h"

typedef struct
{
  double a;
  double b;
} Interval;

static double
parse_number (const char *text,
              guint       line)
{
  char *end = NULL;
  double v = g_ascii_strtod (text, &end);

  if (end == text || *end != '\0')
    {
      fprintf (stderr, "beam-dump: line %u: not a number: %s\n", line, text);
      exit (2);
    }
  return v;
}

static void
need_args (char **tok,
           guint  n,
           guint  line)
{
  if (g_strv_length (tok) != n + 1)
    {
      fprintf (stderr, "beam-dump: line %u: %s takes %u values\n", line, tok[0], n);
      exit (2);
    }
}

static int
report_error (const GError *error)
{
  const char *code = "other";

  if (g_error_matches (error, TRB_ERROR, TRB_ERROR_INVALID))
    code = "invalid";
  else if (g_error_matches (error, TRB_ERROR, TRB_ERROR_UNSTABLE))
    code = "unstable";
  printf ("error %s %s\n", code, error->message);
  return 3;
}

int
main (int    argc,
      char **argv)
{
  g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  g_autoptr(GPtrArray) cases = g_ptr_array_new_with_free_func ((GDestroyNotify) g_array_unref);
  g_autoptr(GArray) factors = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) evals = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) ranges = g_array_new (FALSE, FALSE, sizeof (Interval));
  g_autoptr(GPtrArray) results =
    g_ptr_array_new_with_free_func ((GDestroyNotify) trb_beam_result_free);
  g_autoptr(TrbBeam) beam = NULL;
  g_autoptr(TrbBeamResult) result = NULL;
  g_autoptr(GError) error = NULL;
  double L = 0, E = 0, I = 0;
  gboolean have_beam = FALSE;
  const TrbReaction *reactions;
  guint n_reactions;
  char buf[4096];
  guint line = 0;

  g_ptr_array_add (cases, g_array_new (FALSE, FALSE, sizeof (TrbLoad)));

  while (fgets (buf, sizeof buf, stdin) != NULL)
    {
      g_auto(GStrv) tok = NULL;
      char *hash = strchr (buf, '#');
      GArray *loads = g_ptr_array_index (cases, cases->len - 1);
      TrbLoad ld = { 0 };

      line++;
      if (hash != NULL)
        *hash = '\0';
      g_strstrip (buf);
      if (buf[0] == '\0')
        continue;
      tok = g_regex_split_simple ("\\s+", buf, 0, 0);

      if (g_str_equal (tok[0], "beam"))
        {
          need_args (tok, 3, line);
          L = parse_number (tok[1], line);
          E = parse_number (tok[2], line);
          I = parse_number (tok[3], line);
          have_beam = TRUE;
        }
      else if (g_str_equal (tok[0], "support"))
        {
          TrbSupport s;

          need_args (tok, 2, line);
          s.x = parse_number (tok[1], line);
          if (g_str_equal (tok[2], "pin"))
            s.type = TRB_SUPPORT_PIN;
          else if (g_str_equal (tok[2], "roller"))
            s.type = TRB_SUPPORT_ROLLER;
          else if (g_str_equal (tok[2], "fixed"))
            s.type = TRB_SUPPORT_FIXED;
          else
            {
              fprintf (stderr, "beam-dump: line %u: unknown support %s\n", line, tok[2]);
              return 2;
            }
          g_array_append_val (supports, s);
        }
      else if (g_str_equal (tok[0], "case"))
        {
          need_args (tok, 0, line);
          if (loads->len > 0 || cases->len > 1)
            g_ptr_array_add (cases, g_array_new (FALSE, FALSE, sizeof (TrbLoad)));
        }
      else if (g_str_equal (tok[0], "point") || g_str_equal (tok[0], "moment"))
        {
          need_args (tok, 2, line);
          ld.kind = g_str_equal (tok[0], "point") ? TRB_LOAD_POINT : TRB_LOAD_MOMENT;
          ld.a = parse_number (tok[1], line);
          ld.w1 = parse_number (tok[2], line);
          g_array_append_val (loads, ld);
        }
      else if (g_str_equal (tok[0], "uniform"))
        {
          need_args (tok, 3, line);
          ld.kind = TRB_LOAD_UNIFORM;
          ld.a = parse_number (tok[1], line);
          ld.b = parse_number (tok[2], line);
          ld.w1 = parse_number (tok[3], line);
          g_array_append_val (loads, ld);
        }
      else if (g_str_equal (tok[0], "linear"))
        {
          need_args (tok, 4, line);
          ld.kind = TRB_LOAD_LINEAR;
          ld.a = parse_number (tok[1], line);
          ld.b = parse_number (tok[2], line);
          ld.w1 = parse_number (tok[3], line);
          ld.w2 = parse_number (tok[4], line);
          g_array_append_val (loads, ld);
        }
      else if (g_str_equal (tok[0], "factors"))
        {
          for (guint i = 1; tok[i] != NULL; i++)
            {
              double f = parse_number (tok[i], line);
              g_array_append_val (factors, f);
            }
        }
      else if (g_str_equal (tok[0], "eval"))
        {
          double x;

          need_args (tok, 1, line);
          x = parse_number (tok[1], line);
          g_array_append_val (evals, x);
        }
      else if (g_str_equal (tok[0], "extremes"))
        {
          Interval iv;

          need_args (tok, 2, line);
          iv.a = parse_number (tok[1], line);
          iv.b = parse_number (tok[2], line);
          g_array_append_val (ranges, iv);
        }
      else
        {
          fprintf (stderr, "beam-dump: line %u: unknown command %s\n", line, tok[0]);
          return 2;
        }
    }

  if (!have_beam)
    {
      fprintf (stderr, "beam-dump: no beam line\n");
      return 2;
    }
  if (factors->len > 0 && factors->len != cases->len)
    {
      fprintf (stderr, "beam-dump: %u factors for %u load sets\n", factors->len, cases->len);
      return 2;
    }

  beam = trb_beam_new (L, E, I, (const TrbSupport *) supports->data, supports->len, &error);
  if (beam == NULL)
    return report_error (error);

  for (guint c = 0; c < cases->len; c++)
    {
      GArray *loads = g_ptr_array_index (cases, c);
      TrbBeamResult *r = trb_beam_solve (beam, (const TrbLoad *) loads->data, loads->len, &error);

      if (r == NULL)
        return report_error (error);
      g_ptr_array_add (results, r);
    }
  if (factors->len > 0)
    result = trb_beam_result_combine ((TrbBeamResult **) results->pdata,
                                      (const double *) factors->data, factors->len);
  else
    result = trb_beam_result_copy (g_ptr_array_index (results, 0));

  reactions = trb_beam_result_get_reactions (result, &n_reactions);
  for (guint i = 0; i < n_reactions; i++)
    printf ("reaction %.17g %.17g %.17g\n", reactions[i].x, reactions[i].force,
            reactions[i].moment);

  for (guint i = 0; i < evals->len; i++)
    {
      double x = g_array_index (evals, double, i);
      TrbBeamValues v;

      trb_beam_result_eval (result, x, TRB_SIDE_LEFT, &v);
      printf ("value %.17g left %.17g %.17g %.17g %.17g\n", x, v.V, v.M, v.theta, v.defl);
      trb_beam_result_eval (result, x, TRB_SIDE_RIGHT, &v);
      printf ("value %.17g right %.17g %.17g %.17g %.17g\n", x, v.V, v.M, v.theta, v.defl);
    }

  for (guint i = 0; i < ranges->len; i++)
    {
      Interval iv = g_array_index (ranges, Interval, i);
      TrbBeamExtremes e;

      trb_beam_result_extremes (result, iv.a, iv.b, &e);
      printf ("extremes %.17g %.17g %.17g %.17g %.17g %.17g %.17g %.17g %.17g %.17g "
              "%.17g %.17g %.17g %.17g\n", iv.a, iv.b,
              e.V_max, e.V_max_x, e.V_min, e.V_min_x, e.M_max, e.M_max_x, e.M_min, e.M_min_x,
              e.defl_down, e.defl_down_x, e.defl_up, e.defl_up_x);
    }

  return 0;
}
