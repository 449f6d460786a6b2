/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Plan redraw speed: the generated floor of about 10,000 members (floor-gen.h), solved, drawn
 * at 1920 x 1080 through the render layer the editor's canvas uses, the whole floor fitted and
 * zoomed in on a few bays (labels drawn). Prints the best of 20 draws of each, wall-clock and
 * the drawing thread's processor time (on a shared machine the wall clock also counts the
 * time other programs had the processor); the editor's budget is one frame, 16 ms. The whole
 * floor is also drawn the canvas's way (plan_redraw_whole_canvas): into a cairo recording
 * surface, as gtk_snapshot_append_cairo() gives one, then played back onto the image.
 *
 * bench-plan SOURCE_ROOT [--png DIRECTORY] [--rounds N] [--view whole|zoomed|canvas]: --png
 * also writes what it drew, so that a change to the drawing can be compared picture by picture:
 * whole.png and zoomed.png (the two views timed), demo.png (data/examples/demo-floor.trabeate
 * fitted at 1920 x 1080) and demo-print.png (the same in the print style); --rounds draws each
 * view N times instead of 20 and --view only the one view, for a profiler (valgrind
 * --tool=callgrind --toggle-collect=trb_plan_draw). */

#include "config.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include "floor-gen.h"
#include "trb-project-io.h"
#include "trb-render-plan.h"
#include "trb-solve.h"

static double
thread_ms (void)
{
  struct timespec ts;

  clock_gettime (CLOCK_THREAD_CPUTIME_ID, &ts);
  return ts.tv_sec * 1e3 + ts.tv_nsec / 1e6;
}

static void
draw_once (cairo_t            *cr,
           const TrbPlanScene *scene,
           const TrbPlanView  *view,
           TrbPlanDrawOptions *options)
{
  TrbRgba paper;

  trb_render_paper_color (&options->style, &paper);
  trb_render_set_color (cr, &paper);
  cairo_paint (cr);
  trb_plan_draw (cr, scene, view, options);
  cairo_surface_flush (cairo_get_target (cr));
}

static int rounds = 20;

/* Into a recording surface, then that onto cr's target. */
static void
draw_recorded (cairo_t            *cr,
               const TrbPlanScene *scene,
               const TrbPlanView  *view,
               TrbPlanDrawOptions *options)
{
  cairo_rectangle_t extents = { 0, 0, options->width, options->height };
  cairo_surface_t *recording = cairo_recording_surface_create (CAIRO_CONTENT_COLOR_ALPHA,
                                                               &extents);
  cairo_t *rc = cairo_create (recording);

  draw_once (rc, scene, view, options);
  cairo_destroy (rc);
  cairo_set_source_surface (cr, recording, 0, 0);
  cairo_paint (cr);
  cairo_surface_flush (cairo_get_target (cr));
  cairo_surface_destroy (recording);
}

static double
best_draw_ms (cairo_t            *cr,
              const TrbPlanScene *scene,
              const TrbPlanView  *view,
              TrbPlanDrawOptions *options,
              gboolean            recorded,
              double             *best_cpu)
{
  double best = INFINITY;

  *best_cpu = INFINITY;
  for (int k = 0; k < rounds; k++)
    {
      gint64 t0 = g_get_monotonic_time ();
      double c0 = thread_ms ();

      if (recorded)
        draw_recorded (cr, scene, view, options);
      else
        draw_once (cr, scene, view, options);
      best = MIN (best, (g_get_monotonic_time () - t0) / 1000.0);
      *best_cpu = MIN (*best_cpu, thread_ms () - c0);
    }
  return best;
}

static void
write_png (cairo_surface_t *surface,
           const char      *dir,
           const char      *name)
{
  g_autofree char *path = g_build_filename (dir, name, NULL);

  if (cairo_surface_write_to_png (surface, path) != CAIRO_STATUS_SUCCESS)
    g_error ("cannot write %s", path);
  g_print ("wrote %s\n", path);
}

/* The demo floor, fitted, on the screen and in print. */
static void
write_demo (cairo_surface_t *surface,
            const char      *top,
            const char      *dir)
{
  g_autofree char *path = g_build_filename (top, "data", "examples", "demo-floor.trabeate",
                                            NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = trb_project_load_file (path, &error);
  g_autoptr(TrbProjectResult) result = NULL;
  g_autoptr(TrbPlanScene) scene = NULL;
  cairo_t *cr = cairo_create (surface);
  TrbPlanDrawOptions options;
  TrbPlanBounds bounds;
  TrbPlanView view;

  if (project == NULL)
    g_error ("%s", error->message);
  result = trb_solve_project (project);
  scene = trb_plan_scene_new (project, g_ptr_array_index (project->floors, 0), result);
  trb_plan_draw_options_init (&options, 1920, 1080);
  trb_plan_scene_get_bounds (scene, &bounds);
  trb_plan_view_fit (&view, &bounds, 0, 0, 1920, 1080, 40);
  draw_once (cr, scene, &view, &options);
  write_png (surface, dir, "demo.png");

  trb_render_style_init_print (&options.style);
  options.layers = TRB_PLAN_LAYER_ALL;
  draw_once (cr, scene, &view, &options);
  write_png (surface, dir, "demo-print.png");
  cairo_destroy (cr);
}

int
main (int argc, char **argv)
{
  guint n_members;
  g_autofree char *xml = floor_gen_xml (10000, &n_members);
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = trb_project_load_data (xml, strlen (xml), "bench", &error);
  g_autoptr(TrbProjectResult) result = NULL;
  g_autoptr(TrbPlanScene) scene = NULL;
  cairo_surface_t *surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 1920, 1080);
  cairo_t *cr = cairo_create (surface);
  TrbPlanDrawOptions options;
  TrbPlanBounds bounds;
  TrbPlanView view;
  double whole, zoomed, whole_cpu, zoomed_cpu, canvas, canvas_cpu;
  const char *png_dir = NULL;
  const char *only = NULL;

  for (int i = 2; i + 1 < argc; i += 2)
    if (strcmp (argv[i], "--png") == 0)
      png_dir = argv[i + 1];
    else if (strcmp (argv[i], "--rounds") == 0)
      rounds = MAX (atoi (argv[i + 1]), 1);
    else if (strcmp (argv[i], "--view") == 0)
      only = argv[i + 1];
    else
      g_error ("unknown option %s", argv[i]);
  if (project == NULL)
    g_error ("%s", error->message);
  result = trb_solve_project (project);
  scene = trb_plan_scene_new (project, g_ptr_array_index (project->floors, 0), result);

  trb_plan_draw_options_init (&options, 1920, 1080);
  trb_plan_scene_get_bounds (scene, &bounds);
  trb_plan_view_fit (&view, &bounds, 0, 0, 1920, 1080, 20);
  whole = whole_cpu = zoomed = zoomed_cpu = canvas = canvas_cpu = NAN;
  if (only == NULL || strcmp (only, "whole") == 0)
    {
      whole = best_draw_ms (cr, scene, &view, &options, FALSE, &whole_cpu);
      if (png_dir != NULL)
        write_png (surface, png_dir, "whole.png");
    }
  if (only == NULL || strcmp (only, "canvas") == 0)
    canvas = best_draw_ms (cr, scene, &view, &options, TRUE, &canvas_cpu);
  trb_plan_view_zoom_about (&view, 20, 960, 540);
  if (only == NULL || strcmp (only, "zoomed") == 0)
    {
      zoomed = best_draw_ms (cr, scene, &view, &options, FALSE, &zoomed_cpu);
      if (png_dir != NULL)
        write_png (surface, png_dir, "zoomed.png");
    }
  if (png_dir != NULL)
    write_demo (surface, argc >= 2 ? argv[1] : ".", png_dir);

  g_print ("plan redraw of %u members at 1920 x 1080: %.2f ms whole floor, %.2f ms zoomed in "
           "(best of %d; processor time %.2f and %.2f ms)\n", n_members, whole, zoomed, rounds,
           whole_cpu, zoomed_cpu);
  if (!isnan (whole))
    g_print ("BENCH plan_redraw_whole %.2f ms\nBENCH plan_redraw_whole_cpu %.2f ms\n", whole,
             whole_cpu);
  if (!isnan (zoomed))
    g_print ("BENCH plan_redraw_zoomed %.2f ms\nBENCH plan_redraw_zoomed_cpu %.2f ms\n", zoomed,
             zoomed_cpu);
  if (!isnan (canvas))
    g_print ("BENCH plan_redraw_whole_canvas %.2f ms\nBENCH plan_redraw_whole_canvas_cpu %.2f "
             "ms\n", canvas, canvas_cpu);

  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  return 0;
}
