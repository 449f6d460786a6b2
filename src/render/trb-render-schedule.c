/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-schedule.h"

#include <math.h>

#include "trb-combos.h"
#include "trb-render-sheet.h"
#include "trb-units.h"

void
trb_schedule_members_flow (TrbFlow          *flow,
                           const TrbProject *project,
                           GPtrArray        *results)
{
  static const char *titles[] = { "Mark", "Floor", "Material", "Section", "Length", "Status",
                                  "Ratio", "Governing check" };
  static const double widths[] = { 0.08, 0.13, 0.08, 0.15, 0.11, 0.13, 0.08, 0.24 };
  guint counts[TRB_STATUS_ERROR + 1] = { 0 };

  g_return_if_fail (flow != NULL && project != NULL && results != NULL);

  trb_flow_heading (flow, "Member schedule");
  for (guint i = 0; i < results->len; i++)
    counts[((TrbMemberResult *) g_ptr_array_index (results, i))->status]++;
  {
    /* the count line of the CLI's table */
    g_autofree char *t =
      g_strdup_printf ("%u member%s: %u pass, %u fail, %u unstable, %u unsupported, "
                       "%u not designed, %u error",
                       results->len, results->len == 1 ? "" : "s", counts[TRB_STATUS_PASS],
                       counts[TRB_STATUS_FAIL], counts[TRB_STATUS_UNSTABLE],
                       counts[TRB_STATUS_UNSUPPORTED], counts[TRB_STATUS_NOT_DESIGNED],
                       counts[TRB_STATUS_ERROR]);

    trb_flow_paragraph (flow, t, 1);
  }
  trb_flow_table_begin (flow, 8, titles, widths, "lllllrrl", 5);
  for (guint i = 0; i < results->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results, i);
      const TrbMember *m = r->member;
      g_autofree char *len = trb_units_format (m->length, TRB_DIM_LENGTH, r->units);
      g_autofree char *ratio = trb_sheet_format_ratio (r->ratio);
      const char *cells[] = {
        m->id,
        m->floor != NULL && m->floor->name != NULL ? m->floor->name : "-",
        trb_material_name (m->material),
        /* as the CLI's summary: what was checked, else what the file names */
        r->section[0] != '\0' ? r->section : m->section,
        len,
        trb_sheet_status_text (r->status),
        ratio,
        r->governing[0] != '\0' ? r->governing : "-",
      };

      trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, trb_render_status_of (r));
    }
  trb_flow_table_end (flow);
}

gboolean
trb_schedule_column_loads (const TrbProjectResult *results,
                           const TrbFloor         *floor,
                           guint                   column,
                           double                  force[TRB_N_CASES])
{
  g_return_val_if_fail (floor != NULL && force != NULL, FALSE);

  /* the floor solve's column results are not there yet */
  (void) results;
  (void) column;
  return FALSE;
}

gboolean
trb_schedule_columns_flow (TrbFlow                *flow,
                           const TrbProject       *project,
                           const TrbProjectResult *results)
{
  static const char *titles[] = { "Column", "Floor", "Section", "D", "L", "Lr", "S",
                                  "Sum of cases" };
  static const double widths[] = { 0.1, 0.16, 0.18, 0.11, 0.11, 0.11, 0.11, 0.12 };
  TrbUnitSystem u;
  gboolean any = FALSE;

  g_return_val_if_fail (flow != NULL && project != NULL, FALSE);

  for (guint f = 0; f < project->floors->len; f++)
    any |= ((TrbFloor *) g_ptr_array_index (project->floors, f))->columns->len > 0;
  if (!any)
    return FALSE;

  u = project->settings.units;
  trb_flow_heading (flow, "Column loads");
  {
    g_autofree char *t =
      g_strdup_printf ("Loads delivered to each column by the members resting on it, per load "
                       "case, unfactored, live load unreduced; in %s. The columns themselves "
                       "are not designed.", trb_units_display_unit (TRB_DIM_FORCE, u));

    trb_flow_paragraph (flow, t, 1);
  }
  trb_flow_table_begin (flow, 8, titles, widths, "lllrrrrr", -1);
  for (guint f = 0; f < project->floors->len; f++)
    {
      const TrbFloor *floor = g_ptr_array_index (project->floors, f);

      for (guint i = 0; i < floor->columns->len; i++)
        {
          const TrbColumn *c = g_ptr_array_index (floor->columns, i);
          double force[TRB_N_CASES] = { 0 };
          gboolean have = results != NULL &&
                          trb_schedule_column_loads (results, floor, i, force);
          char *v[TRB_N_CASES + 1] = { NULL };
          double sum = 0;

          for (int k = 0; k < TRB_N_CASES; k++)
            {
              v[k] = have ? trb_units_format (force[k], TRB_DIM_FORCE, u) : g_strdup ("-");
              sum += force[k];
            }
          v[TRB_N_CASES] = have ? trb_units_format (sum, TRB_DIM_FORCE, u) : g_strdup ("-");
          {
            const char *cells[] = { c->id, floor->name != NULL ? floor->name : "-",
                                    c->section != NULL ? c->section : "-",
                                    v[0], v[1], v[2], v[3], v[4] };

            trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
          }
          for (int k = 0; k <= TRB_N_CASES; k++)
            g_free (v[k]);
        }
    }
  trb_flow_table_end (flow);
  return TRUE;
}
