/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* A generated beam for the benchmark: SI, loads per case D, L, Lr. */
#define TRB_BENCH_N_CASES       3
#define TRB_BENCH_MAX_SUPPORTS  8
#define TRB_BENCH_MAX_LOADS     12
#define TRB_BENCH_SAMPLES       200

typedef struct
{
  double     length;
  double     E;
  double     I;
  TrbSupport supports[TRB_BENCH_MAX_SUPPORTS];
  guint      n_supports;
  TrbLoad    loads[TRB_BENCH_N_CASES][TRB_BENCH_MAX_LOADS];
  guint      n_loads[TRB_BENCH_N_CASES];
} TrbBenchBeam;

typedef struct _TrbBenchPipeline TrbBenchPipeline;

/* The beams become members of one project (custom section with the given E and I, the
 * project's default settings: ASD, self-weight on, live-load patterns on), as the loader
 * would make them; that is not timed. */
TrbBenchPipeline *trb_bench_pipeline_new      (const TrbBenchBeam *beams,
                                               guint               n_beams);
void              trb_bench_pipeline_free     (TrbBenchPipeline   *pipeline);
const char       *trb_bench_pipeline_describe (TrbBenchPipeline   *pipeline);

/* The timed work for beam i: trb_solve_member() as the CLI calls it, then the diagram samples
 * of every load case. Adds a value of the results to *checksum so none of it is skipped. */
gboolean          trb_bench_pipeline_run      (TrbBenchPipeline   *pipeline,
                                               guint               i,
                                               double             *checksum,
                                               GError            **error);

/* The result of beam i, as trb_bench_pipeline_run() makes it (untimed use: the comparison). */
TrbMemberResult  *trb_bench_pipeline_solve    (TrbBenchPipeline   *pipeline,
                                               guint               i);

/* The load case of the benchmark's case index c (0, 1, 2: D, L, Lr). */
TrbLoadCase       trb_bench_case              (guint               c);

/* The combination-and-pattern results trb_bench_pipeline_run() has made so far (strength,
 * live and total deflection sets together), and the beams it has run. */
guint64           trb_bench_pipeline_n_results (TrbBenchPipeline  *pipeline);
guint64           trb_bench_pipeline_n_runs    (TrbBenchPipeline  *pipeline);

/* The beam engine alone, for comparison: the beam, its three load cases, their extremes and
 * their 200 samples; no combinations, patterns, envelopes or design. */
gboolean          trb_bench_engine_run        (TrbBenchPipeline   *pipeline,
                                               const TrbBenchBeam *beam,
                                               double             *checksum,
                                               GError            **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbBenchPipeline, trb_bench_pipeline_free)

G_END_DECLS
