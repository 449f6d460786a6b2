/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Edit -> re-solve -> redraw, the editor's loop without its window: on the generated floor of
 * about 2,000 members (floor-gen.h), one girder's section is changed through the edit module
 * (an undoable command, as the editor makes it), the whole floor is solved again, and the plan
 * is drawn at 1920 x 1080 through the render layer the canvas uses. Each round also undoes the
 * change (solved and drawn again), so every round is a real change. Prints the best and the
 * median round; the editor's budget is 50 ms.
 *
 * `bench-edit --write-floor N FILE` writes a generated floor of about N members, for measuring
 * the application's memory on it (build-aux/bench does this under a virtual X server). */

#include "config.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "floor-gen.h"
#include "trb-edit.h"
#include "trb-project-io.h"
#include "trb-render-plan.h"
#include "trb-solve.h"

static double
round_ms (TrbProject *project,
          TrbFloor   *floor,
          cairo_t    *cr)
{
  gint64 t0 = g_get_monotonic_time ();
  g_autoptr(TrbProjectResult) result = trb_solve_project (project);
  g_autoptr(TrbPlanScene) scene = trb_plan_scene_new (project, floor, result);
  TrbPlanDrawOptions options;
  TrbPlanBounds bounds;
  TrbPlanView view;

  trb_plan_draw_options_init (&options, 1920, 1080);
  trb_plan_scene_get_bounds (scene, &bounds);
  trb_plan_view_fit (&view, &bounds, 0, 0, 1920, 1080, 20);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  trb_plan_draw (cr, scene, &view, &options);
  cairo_surface_flush (cairo_get_target (cr));
  return (g_get_monotonic_time () - t0) / 1000.0;
}

static int
compare_double (gconstpointer a,
                gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return x < y ? -1 : x > y;
}

int
main (int argc, char **argv)
{
  guint n_members;
  g_autofree char *xml = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  TrbEditHistory *history;
  TrbFloor *floor;
  TrbMember *girder = NULL;
  cairo_surface_t *surface;
  cairo_t *cr;
  double times[20];

  if (argc == 4 && strcmp (argv[1], "--write-floor") == 0)
    {
      xml = floor_gen_xml ((guint) atoi (argv[2]), &n_members);
      if (!g_file_set_contents (argv[3], xml, -1, &error))
        g_error ("%s", error->message);
      g_print ("wrote %s: %u members\n", argv[3], n_members);
      return 0;
    }

  xml = floor_gen_xml (2000, &n_members);
  project = trb_project_load_data (xml, strlen (xml), "bench", &error);
  if (project == NULL)
    g_error ("%s", error->message);
  floor = g_ptr_array_index (project->floors, 0);
  for (guint i = 0; i < floor->members->len && girder == NULL; i++)
    {
      TrbMember *m = g_ptr_array_index (floor->members, i);

      if (m->role == TRB_FRAME_ROLE_GIRDER)
        girder = m;
    }
  g_assert (girder != NULL);

  history = trb_edit_history_new (project);
  surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, 1920, 1080);
  cr = cairo_create (surface);
  round_ms (project, floor, cr);   /* warm the caches the editor would have warm */

  for (guint k = 0; k < G_N_ELEMENTS (times); k++)
    {
      gint64 t0 = g_get_monotonic_time ();

      if (k % 2 == 0)
        {
          TrbEditCommand *command = trb_edit_assign_section (project, girder,
                                                             k % 4 == 0 ? "W24X55" : "W21X44",
                                                             &error);

          if (command == NULL)
            g_error ("%s", error->message);
          trb_edit_history_push (history, command);
        }
      else
        trb_edit_history_undo (history);
      round_ms (project, floor, cr);
      times[k] = (g_get_monotonic_time () - t0) / 1000.0;
    }
  qsort (times, G_N_ELEMENTS (times), sizeof times[0], compare_double);

  g_print ("edit, re-solve and redraw of %u members at 1920 x 1080: best %.1f ms, median "
           "%.1f ms (20 rounds)\n", n_members, times[0], times[G_N_ELEMENTS (times) / 2]);
  g_print ("BENCH edit_resolve_redraw_best %.1f ms\n", times[0]);
  g_print ("BENCH edit_resolve_redraw_median %.1f ms\n", times[G_N_ELEMENTS (times) / 2]);

  cairo_destroy (cr);
  cairo_surface_destroy (surface);
  trb_edit_history_free (history);
  return 0;
}
