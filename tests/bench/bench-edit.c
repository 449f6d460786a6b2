/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Edit -> re-solve -> redraw, the editor's own path without its window: the generated floor of
 * about 2,000 members (floor-gen.h) open in a TrbDocument (src/app/trb-document.c, which needs
 * no GTK), one girder's section changed through an undoable command pushed to the document, as
 * the member panel does. The canvas then draws the edit at once with the results that stand
 * (a scene and a draw); the document copies the project and re-solves it on its worker thread,
 * re-solving only what the edit changed (TrbSolveCache); when ::solved comes, the canvas makes
 * its scene again, handing the old scene's text over, and draws the plan at 1920 x 1080. A
 * round is all of that, from the push to the end of the second draw; every other round undoes
 * the one before, so each round is a real change. Prints the best and the median of 20 rounds,
 * and the parts of the median round's kind: the worker's solve, the main thread's work. The
 * editor's budget is 50 ms.
 *
 * `bench-edit --members N` does the same on a floor of about N members (the BENCH lines then
 * carry N in their names).
 * `bench-edit --write-floor N FILE` writes a generated floor of about N members, for measuring
 * the application's memory on it (build-aux/bench does this under a virtual X server). */

#include "config.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include <glib/gstdio.h>

#include "floor-gen.h"
#include "trb-document.h"
#include "trb-edit.h"
#include "trb-project-io.h"
#include "trb-render-plan.h"
#include "trb-solve.h"

typedef struct
{
  TrbDocument  *document;
  TrbPlanScene *scene;
  cairo_t      *cr;
  double        main_ms;   /* the main thread's share of the last round */
} Bench;

static double
thread_ms (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

/* What the canvas does on ::changed and ::solved: a new scene (the old one's text handed
 * over) and a draw of the whole floor fitted to the window. */
static void
redraw (Bench *b)
{
  TrbDocument *doc = b->document;
  TrbPlanScene *scene = trb_plan_scene_new (trb_document_get_project (doc),
                                            trb_document_get_floor (doc),
                                            trb_document_get_results (doc));
  TrbPlanDrawOptions options;
  TrbPlanBounds bounds;
  TrbPlanView view;

  if (b->scene != NULL)
    trb_plan_scene_take_texts (scene, b->scene);
  g_clear_pointer (&b->scene, trb_plan_scene_free);
  b->scene = scene;
  trb_plan_draw_options_init (&options, 1920, 1080);
  trb_plan_scene_get_bounds (scene, &bounds);
  trb_plan_view_fit (&view, &bounds, 0, 0, 1920, 1080, 20);
  cairo_set_source_rgb (b->cr, 1, 1, 1);
  cairo_paint (b->cr);
  trb_plan_draw (b->cr, scene, &view, &options);
  cairo_surface_flush (cairo_get_target (b->cr));
}

static void
on_changed (TrbDocument *doc,
            Bench       *b)
{
  double t0 = thread_ms ();

  redraw (b);
  b->main_ms += thread_ms () - t0;
}

static void
on_solved (TrbDocument *doc,
           Bench       *b)
{
  double t0 = thread_ms ();

  redraw (b);
  b->main_ms += thread_ms () - t0;
}

static void
wait_solved (TrbDocument *doc)
{
  while (trb_document_get_solving (doc) || !trb_document_get_results_current (doc))
    g_main_context_iteration (NULL, TRUE);
}

static int
compare_double (gconstpointer a,
                gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return x < y ? -1 : x > y;
}

#define ROUNDS 20

int
main (int argc, char **argv)
{
  guint n_members;
  g_autofree char *xml = NULL;
  g_autofree char *path = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GFile) file = NULL;
  Bench b = { NULL };
  TrbProject *project;
  TrbFloor *floor;
  TrbMember *girder = NULL;
  cairo_surface_t *surface;
  double times[ROUNDS], solve[ROUNDS], main_ms[ROUNDS];
  guint target = 2000;
  g_autofree char *suffix = NULL;
  int fd;

  if (argc == 4 && strcmp (argv[1], "--write-floor") == 0)
    {
      xml = floor_gen_xml ((guint) atoi (argv[2]), &n_members);
      if (!g_file_set_contents (argv[3], xml, -1, &error))
        g_error ("%s", error->message);
      g_print ("wrote %s: %u members\n", argv[3], n_members);
      return 0;
    }

  for (int i = 1; i + 1 < argc; i++)
    if (strcmp (argv[i], "--members") == 0)
      target = (guint) atoi (argv[i + 1]);
  xml = floor_gen_xml (target, &n_members);
  fd = g_file_open_tmp ("bench-edit-XXXXXX.trabeate", &path, &error);
  if (fd < 0 || !g_file_set_contents (path, xml, -1, &error))
    g_error ("%s", error->message);
  close (fd);
  file = g_file_new_for_path (path);
  b.document = trb_document_new_for_file (file, &error);
  if (b.document == NULL)
    g_error ("%s", error->message);
  g_unlink (path);
  project = trb_document_get_project (b.document);
  floor = trb_document_get_floor (b.document);
  for (guint i = 0; i < floor->members->len && girder == NULL; i++)
    {
      TrbMember *m = g_ptr_array_index (floor->members, i);

      if (m->role == TRB_FRAME_ROLE_GIRDER)
        girder = m;
    }
  g_assert (girder != NULL);

  surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 1920, 1080);
  b.cr = cairo_create (surface);
  wait_solved (b.document);
  redraw (&b);   /* the window's first draw: the text laid out, the caches warm */
  g_signal_connect (b.document, "changed", G_CALLBACK (on_changed), &b);
  g_signal_connect (b.document, "solved", G_CALLBACK (on_solved), &b);

  for (guint k = 0; k < ROUNDS; k++)
    {
      gint64 t0 = g_get_monotonic_time ();

      b.main_ms = 0;
      if (k % 2 == 0)
        {
          TrbEditCommand *command = trb_edit_assign_section (project, girder,
                                                             k % 4 == 0 ? "W24X55" : "W21X44",
                                                             &error);

          if (command == NULL)
            g_error ("%s", error->message);
          trb_document_push (b.document, command);
        }
      else
        trb_document_undo (b.document);
      wait_solved (b.document);
      times[k] = (g_get_monotonic_time () - t0) / 1000.0;
      solve[k] = trb_document_get_solve_time (b.document);
      main_ms[k] = b.main_ms;
    }
  qsort (times, ROUNDS, sizeof times[0], compare_double);
  qsort (solve, ROUNDS, sizeof solve[0], compare_double);
  qsort (main_ms, ROUNDS, sizeof main_ms[0], compare_double);

  g_print ("edit, re-solve and redraw of %u members at 1920 x 1080: best %.1f ms, median "
           "%.1f ms (%d rounds); the worker's solve median %.1f ms, the main thread's scenes "
           "and draws median %.1f ms of processor time\n", n_members, times[0],
           times[ROUNDS / 2], ROUNDS, solve[ROUNDS / 2], main_ms[ROUNDS / 2]);
  suffix = target == 2000 ? g_strdup ("") : g_strdup_printf ("_%u", target);
  g_print ("BENCH edit_resolve_redraw_best%s %.1f ms\n", suffix, times[0]);
  g_print ("BENCH edit_resolve_redraw_median%s %.1f ms\n", suffix, times[ROUNDS / 2]);
  g_print ("BENCH edit_resolve_median%s %.1f ms\n", suffix, solve[ROUNDS / 2]);
  g_print ("BENCH edit_redraw_main_cpu_median%s %.1f ms\n", suffix, main_ms[ROUNDS / 2]);

  g_clear_pointer (&b.scene, trb_plan_scene_free);
  cairo_destroy (b.cr);
  cairo_surface_destroy (surface);
  g_object_unref (b.document);
  return 0;
}
