/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Plan redraw speed: the generated floor of about 10,000 members (floor-gen.h), solved, drawn
 * at 1920 x 1080 through the render layer the editor's canvas uses, the whole floor fitted and
 * zoomed in on a few bays (labels drawn). Prints the best of 20 draws of each; the editor's
 * budget is one frame, 16 ms. */

#include "config.h"

#include <math.h>
#include <string.h>

#include "floor-gen.h"
#include "trb-project-io.h"
#include "trb-render-plan.h"
#include "trb-solve.h"

static double
best_draw_ms (cairo_t            *cr,
              const TrbPlanScene *scene,
              const TrbPlanView  *view,
              TrbPlanDrawOptions *options)
{
  double best = INFINITY;

  for (int k = 0; k < 20; k++)
    {
      gint64 t0 = g_get_monotonic_time ();

      cairo_set_source_rgb (cr, 1, 1, 1);
      cairo_paint (cr);
      trb_plan_draw (cr, scene, view, options);
      cairo_surface_flush (cairo_get_target (cr));
      best = MIN (best, (g_get_monotonic_time () - t0) / 1000.0);
    }
  return best;
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
  double whole, zoomed;

  if (project == NULL)
    g_error ("%s", error->message);
  result = trb_solve_project (project);
  scene = trb_plan_scene_new (project, g_ptr_array_index (project->floors, 0), result);

  trb_plan_draw_options_init (&options, 1920, 1080);
  trb_plan_scene_get_bounds (scene, &bounds);
  trb_plan_view_fit (&view, &bounds, 0, 0, 1920, 1080, 20);
  whole = best_draw_ms (cr, scene, &view, &options);
  trb_plan_view_zoom_about (&view, 20, 960, 540);
  zoomed = best_draw_ms (cr, scene, &view, &options);

  g_print ("plan redraw of %u members at 1920 x 1080: %.2f ms whole floor, %.2f ms zoomed in "
           "(best of 20)\n", n_members, whole, zoomed);
  g_print ("BENCH plan_redraw_whole %.2f ms\n", whole);
  g_print ("BENCH plan_redraw_zoomed %.2f ms\n", zoomed);

  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  return 0;
}
