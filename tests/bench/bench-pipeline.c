/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "bench-pipeline.h"

#include "trb-error.h"
#include "trb-model.h"

struct _TrbBenchPipeline
{
  TrbProject    *project;
  guint64        n_results;
  guint64        n_runs;
  double         x[TRB_BENCH_SAMPLES];
  TrbBeamValues  values[TRB_BENCH_SAMPLES];
};

static const TrbLoadCase bench_cases[TRB_BENCH_N_CASES] = { TRB_CASE_D, TRB_CASE_L, TRB_CASE_LR };

TrbBenchPipeline *
trb_bench_pipeline_new (const TrbBenchBeam *beams,
                        guint               n_beams)
{
  TrbBenchPipeline *p = g_new0 (TrbBenchPipeline, 1);

  p->project = trb_project_new ();
  for (guint i = 0; i < n_beams; i++)
    {
      const TrbBenchBeam *bb = &beams[i];
      g_autofree char *id = g_strdup_printf ("B%u", i + 1);
      TrbMember *m = trb_member_new (id);

      m->length = bb->length;
      m->material = TRB_MATERIAL_CUSTOM;
      g_free (m->section);
      m->section = g_strdup ("custom");
      m->E = bb->E;
      m->I = bb->I;
      for (guint k = 0; k < bb->n_supports; k++)
        {
          TrbMemberSupport s = { bb->supports[k], 0 };

          g_array_append_val (m->supports, s);
        }
      for (guint c = 0; c < TRB_BENCH_N_CASES; c++)
        {
          for (guint j = 0; j < bb->n_loads[c]; j++)
            {
              TrbMemberLoad l = { bench_cases[c], bb->loads[c][j], 0 };

              g_array_append_val (m->loads, l);
            }
        }
      trb_project_add_member (p->project, m);
    }
  return p;
}

void
trb_bench_pipeline_free (TrbBenchPipeline *pipeline)
{
  if (pipeline == NULL)
    return;
  g_clear_pointer (&pipeline->project, trb_project_free);
  g_free (pipeline);
}

const char *
trb_bench_pipeline_describe (TrbBenchPipeline *pipeline)
{
  return "trb_solve_member() (load cases, live-load regions and patterns, the ASD combinations "
         "and the live and total deflection sets, envelopes, the design step of a custom "
         "section), then 200 sample points of each load case";
}

TrbLoadCase
trb_bench_case (guint c)
{
  g_assert (c < TRB_BENCH_N_CASES);
  return bench_cases[c];
}

TrbMemberResult *
trb_bench_pipeline_solve (TrbBenchPipeline *pipeline,
                          guint             i)
{
  return trb_solve_member (pipeline->project, g_ptr_array_index (pipeline->project->members, i));
}

gboolean
trb_bench_pipeline_run (TrbBenchPipeline  *pipeline,
                        guint              i,
                        double            *checksum,
                        GError           **error)
{
  const TrbMember *m = g_ptr_array_index (pipeline->project->members, i);
  g_autoptr(TrbMemberResult) r = trb_solve_member (pipeline->project, m);

  if (!r->analysed)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "%s: not analysed (%s): %s", m->id,
                   trb_status_name (r->status), r->message != NULL ? r->message : "");
      return FALSE;
    }
  *checksum += r->strength.envelope.ext.M_max + r->total.envelope.ext.defl_down;
  pipeline->n_results += r->strength.entries->len + r->live.entries->len + r->total.entries->len;
  pipeline->n_runs++;
  for (guint c = 0; c < TRB_BENCH_N_CASES; c++)
    {
      const TrbBeamResult *cr = r->cases[bench_cases[c]];

      if (cr == NULL)
        continue;
      trb_beam_result_sample (cr, TRB_BENCH_SAMPLES, pipeline->x, pipeline->values);
      *checksum += pipeline->values[TRB_BENCH_SAMPLES / 2].M;
    }
  return TRUE;
}

guint64
trb_bench_pipeline_n_results (TrbBenchPipeline *pipeline)
{
  return pipeline->n_results;
}

guint64
trb_bench_pipeline_n_runs (TrbBenchPipeline *pipeline)
{
  return pipeline->n_runs;
}

gboolean
trb_bench_engine_run (TrbBenchPipeline    *pipeline,
                      const TrbBenchBeam  *bb,
                      double              *checksum,
                      GError             **error)
{
  g_autoptr(TrbBeam) beam = trb_beam_new (bb->length, bb->E, bb->I, bb->supports,
                                          bb->n_supports, error);

  if (beam == NULL)
    return FALSE;
  for (guint c = 0; c < TRB_BENCH_N_CASES; c++)
    {
      g_autoptr(TrbBeamResult) r = trb_beam_solve (beam, bb->loads[c], bb->n_loads[c], error);
      TrbBeamExtremes e;

      if (r == NULL)
        return FALSE;
      trb_beam_result_extremes (r, 0.0, bb->length, &e);
      trb_beam_result_sample (r, TRB_BENCH_SAMPLES, pipeline->x, pipeline->values);
      *checksum += e.M_max + pipeline->values[TRB_BENCH_SAMPLES / 2].M;
    }
  return TRUE;
}
