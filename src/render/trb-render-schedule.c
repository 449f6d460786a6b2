/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-schedule.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "trb-combos.h"
#include "trb-render-sheet.h"
#include "trb-units.h"

void
trb_schedule_members_flow (TrbFlow          *flow,
                           const TrbProject *project,
                           GPtrArray        *results)
{
  const char *titles[] = { _("Mark"), _("Floor"), _("Material"), _("Section"), _("Length"),
                           _("Status"), _("Ratio"), _("Governing check") };
  static const double widths[] = { 0.08, 0.13, 0.08, 0.15, 0.11, 0.13, 0.08, 0.24 };
  guint counts[TRB_STATUS_ERROR + 1] = { 0 };

  g_return_if_fail (flow != NULL && project != NULL && results != NULL);

  trb_flow_heading (flow, _("Member schedule"));
  for (guint i = 0; i < results->len; i++)
    counts[((TrbMemberResult *) g_ptr_array_index (results, i))->status]++;
  {
    /* the count line of the CLI's table */
    g_autofree char *t =
      g_strdup_printf (ngettext ("%u member: %u pass, %u fail, %u unstable, %u unsupported, "
                                 "%u not designed, %u error",
                                 "%u members: %u pass, %u fail, %u unstable, %u unsupported, "
                                 "%u not designed, %u error", results->len),
                       results->len, counts[TRB_STATUS_PASS],
                       counts[TRB_STATUS_FAIL], counts[TRB_STATUS_UNSTABLE],
                       counts[TRB_STATUS_UNSUPPORTED], counts[TRB_STATUS_NOT_DESIGNED],
                       counts[TRB_STATUS_ERROR]);

    trb_flow_paragraph (flow, t, 1);
  }
  trb_flow_table_begin (flow, 8, titles, widths, "llllrlrl", 5);
  for (guint i = 0; i < results->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results, i);
      const TrbMember *m = r->member;
      g_autofree char *len = trb_units_format (m->length, TRB_DIM_LENGTH, r->units);
      g_autofree char *ratio = trb_sheet_format_ratio (r->ratio);
      const char *cells[] = {
        m->id,
        m->floor != NULL && m->floor->name != NULL ? m->floor->name : "-",
        /* the file's word, translated by the catalog (the template has it from trb-cli.c) */
        g_dpgettext2 (GETTEXT_PACKAGE, "material", trb_material_name (m->material)),
        /* as the CLI's summary: what was checked, else what the file names */
        r->section[0] != '\0' ? r->section : m->section,
        len,
        trb_sheet_status_text (r->status),
        ratio,
        /* a check's name from core, translated likewise */
        r->governing[0] != '\0' ? _(r->governing) : "-",
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

  for (guint f = 0; results != NULL && results->floors != NULL && f < results->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (results->floors, f);

      if (fr->floor != floor || fr->columns == NULL || column >= fr->columns->len)
        continue;
      memcpy (force, g_array_index (fr->columns, TrbColumnResult, column).force,
              sizeof (double) * TRB_N_CASES);
      return TRUE;
    }
  return FALSE;
}

static char *
force_or_dash (gboolean      have,
               double        v,
               TrbUnitSystem u)
{
  return have ? trb_units_format (v, TRB_DIM_FORCE, u) : g_strdup ("-");
}

gboolean
trb_schedule_columns_flow (TrbFlow                *flow,
                           const TrbProject       *project,
                           const TrbProjectResult *results)
{
  /* Translators: D, L, Lr and S are the load cases; keep them */
  const char *titles[] = { _("Column"), _("Floor"), _("Section"), "D", "L", "Lr", "S",
                           _("Sum of cases"), _("L reduced") };
  static const double widths[] = { 0.09, 0.13, 0.15, 0.1, 0.1, 0.1, 0.1, 0.12, 0.11 };
  const char *wall_titles[] = { _("Wall"), _("Floor"), _("Material"), "D", "L", "Lr", "S",
                                _("Sum of cases") };
  static const double wall_widths[] = { 0.09, 0.13, 0.15, 0.11, 0.11, 0.11, 0.11, 0.19 };
  TrbUnitSystem u;
  guint n_columns = 0, n_walls = 0;
  gboolean reduce;

  g_return_val_if_fail (flow != NULL && project != NULL, FALSE);

  for (guint f = 0; f < project->floors->len; f++)
    {
      const TrbFloor *floor = g_ptr_array_index (project->floors, f);

      n_columns += floor->columns->len;
      n_walls += floor->walls->len;
    }
  if (n_columns == 0 && n_walls == 0)
    return FALSE;

  u = project->settings.units;
  reduce = project->settings.live_load_reduction;
  if (n_columns > 0)
    {
      const char *t =
        reduce ? _("Loads delivered to each column by the members resting on it, per load "
                   "case, unfactored, live load unreduced; then the live load as reduced for "
                   "the column (ASCE 7-16 §4.7). The columns themselves are not designed.")
               : _("Loads delivered to each column by the members resting on it, per load "
                   "case, unfactored, live load unreduced. The columns themselves are not "
                   "designed.");

      trb_flow_heading (flow, _("Column loads"));
      trb_flow_paragraph (flow, t, 1);
      trb_flow_table_begin (flow, reduce ? 9 : 8, titles, widths,
                            reduce ? "lllrrrrrr" : "lllrrrrr", -1);
      for (guint f = 0; f < project->floors->len; f++)
        {
          const TrbFloor *floor = g_ptr_array_index (project->floors, f);
          const TrbFloorResult *fr = NULL;

          for (guint k = 0; results != NULL && results->floors != NULL &&
                            k < results->floors->len; k++)
            if (((TrbFloorResult *) g_ptr_array_index (results->floors, k))->floor == floor)
              fr = g_ptr_array_index (results->floors, k);

          for (guint i = 0; i < floor->columns->len; i++)
            {
              const TrbColumn *c = g_ptr_array_index (floor->columns, i);
              double force[TRB_N_CASES] = { 0 };
              gboolean have = results != NULL &&
                              trb_schedule_column_loads (results, floor, i, force);
              char *v[TRB_N_CASES + 2] = { NULL };
              double sum = 0;

              for (int k = 0; k < TRB_N_CASES; k++)
                {
                  v[k] = force_or_dash (have, force[k], u);
                  sum += force[k];
                }
              v[TRB_N_CASES] = force_or_dash (have, sum, u);
              v[TRB_N_CASES + 1] =
                force_or_dash (have && fr != NULL && i < fr->columns->len,
                               fr != NULL && i < fr->columns->len
                               ? g_array_index (fr->columns, TrbColumnResult, i).live_reduced
                               : 0, u);
              {
                const char *cells[] = { c->id, floor->name != NULL ? floor->name : "-",
                                        c->section != NULL ? c->section : "-",
                                        v[0], v[1], v[2], v[3], v[4], v[5] };

                trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
              }
              for (int k = 0; k < TRB_N_CASES + 2; k++)
                g_free (v[k]);
            }
        }
      trb_flow_table_end (flow);
    }

  if (n_walls > 0)
    {
      trb_flow_heading (flow, _("Wall loads"));
      trb_flow_paragraph (flow, _("The total each bearing wall receives from the members "
                                  "resting on it, per load case, unfactored. The walls are not "
                                  "designed."),
                          1);
      trb_flow_table_begin (flow, 8, wall_titles, wall_widths, "lllrrrrr", -1);
      for (guint f = 0; f < project->floors->len; f++)
        {
          const TrbFloor *floor = g_ptr_array_index (project->floors, f);
          const TrbFloorResult *fr = NULL;

          for (guint k = 0; results != NULL && results->floors != NULL &&
                            k < results->floors->len; k++)
            if (((TrbFloorResult *) g_ptr_array_index (results->floors, k))->floor == floor)
              fr = g_ptr_array_index (results->floors, k);

          for (guint i = 0; i < floor->walls->len; i++)
            {
              const TrbWall *w = g_ptr_array_index (floor->walls, i);
              gboolean have = fr != NULL && fr->walls != NULL && i < fr->walls->len;
              const TrbWallResult *wr = have ? &g_array_index (fr->walls, TrbWallResult, i)
                                             : NULL;
              char *v[TRB_N_CASES + 1] = { NULL };
              double sum = 0;

              for (int k = 0; k < TRB_N_CASES; k++)
                {
                  v[k] = force_or_dash (have, have ? wr->force[k] : 0, u);
                  sum += have ? wr->force[k] : 0;
                }
              v[TRB_N_CASES] = force_or_dash (have, sum, u);
              {
                const char *cells[] = { w->id, floor->name != NULL ? floor->name : "-",
                                        w->material != NULL ? w->material : "-",
                                        v[0], v[1], v[2], v[3], v[4] };

                trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
              }
              for (int k = 0; k <= TRB_N_CASES; k++)
                g_free (v[k]);
            }
        }
      trb_flow_table_end (flow);
    }
  return TRUE;
}
