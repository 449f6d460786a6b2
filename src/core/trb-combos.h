/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* Load combinations of ASCE 7-16 (from memory) restricted to the gravity cases D, L, Lr and S:
 * there is no wind, earthquake or rain load in this program, so every W, E and R term is left
 * out, and the §2.3.1 exception that lets the L factor of LRFD 3 and 4 be 0.5 is not taken
 * (1.0 is the conservative value). */

typedef enum
{
  TRB_COMBO_SET_LRFD,     /* ASCE 7-16 §2.3.1, strength design */
  TRB_COMBO_SET_ASD,      /* ASCE 7-16 §2.4.1, allowable strength design */
  TRB_COMBO_SET_SERVICE,  /* unfactored D + L, D + Lr, D + S: classic allowable stress */
  TRB_COMBO_SET_LIVE,     /* L, Lr, S alone: the live-load deflection */
  TRB_COMBO_SET_TOTAL,    /* D + L ... : the total-load deflection */
} TrbComboSet;

typedef struct
{
  char   name[64];               /* "LRFD 2: 1.2D + 1.6L + 0.5Lr" */
  char   equation[48];           /* "ASCE 7-16 Eq. 2.3-2" */
  double factors[TRB_N_CASES];
} TrbCombo;

const char *trb_load_case_name      (TrbLoadCase          lcase);
gboolean    trb_load_case_from_name (const char          *name,
                                     TrbLoadCase         *lcase);

const char *trb_combo_set_title     (TrbComboSet          set);

GArray     *trb_combos_build        (TrbComboSet          set,
                                     const gboolean      *present);

/* Regions of a member for live-load patterns: the overhangs beyond the end supports and the
 * spans between supports, left to right. */
typedef enum
{
  TRB_REGION_LEFT_OVERHANG,
  TRB_REGION_SPAN,
  TRB_REGION_RIGHT_OVERHANG,
} TrbRegionKind;

typedef struct
{
  TrbRegionKind kind;
  int           span;  /* 1-based span number; 0 for an overhang */
  double        a;
  double        b;
} TrbRegion;

/* A live-load pattern: which regions carry their live load. At most 64 regions. */
#define TRB_PATTERN_MAX_REGIONS 64

typedef struct
{
  char    name[64];  /* "L on span 1", "L on spans 1+3", "L on left overhang" */
  guint64 mask;      /* bit i set: region i loaded */
} TrbPattern;

GArray     *trb_regions_build       (const TrbSupport    *supports,
                                     guint                n_supports,
                                     double               length);

guint       trb_region_find         (const TrbRegion     *regions,
                                     guint                n_regions,
                                     double               x);

GArray    **trb_loads_split         (const TrbLoad       *loads,
                                     guint                n_loads,
                                     const TrbRegion     *regions,
                                     guint                n_regions);
void        trb_loads_split_free    (GArray             **per_region,
                                     guint                n_regions);

GArray     *trb_patterns_build      (const TrbRegion     *regions,
                                     guint                n_regions,
                                     const char          *label);

char       *trb_pattern_describe    (const TrbRegion     *regions,
                                     guint                n_regions,
                                     guint64              mask,
                                     const char          *label);

/* Envelope bookkeeping: widen env by e. Returns a bit set of which extremes e took over
 * (TRB_EXTREME_*), so the caller can record the governing combination. */
typedef enum
{
  TRB_EXTREME_V_MAX     = 1 << 0,
  TRB_EXTREME_V_MIN     = 1 << 1,
  TRB_EXTREME_M_MAX     = 1 << 2,
  TRB_EXTREME_M_MIN     = 1 << 3,
  TRB_EXTREME_DEFL_DOWN = 1 << 4,
  TRB_EXTREME_DEFL_UP   = 1 << 5,
} TrbExtremeFlags;

void        trb_extremes_init       (TrbBeamExtremes     *env);
guint       trb_extremes_merge      (TrbBeamExtremes     *env,
                                     const TrbBeamExtremes *e);

/* What the combinations and their checks ask of the beam engine many times over, done once
 * (defined in trb-beam.c, beside the results' insides). Each gives, bit for bit, what the
 * plain calls of trb-beam.h give: only faster. */
typedef struct _TrbBeamCombiner TrbBeamCombiner;

TrbBeamCombiner *trb_beam_combiner_new      (TrbBeamResult        **parts,
                                             guint                  n_parts);
TrbBeamResult   *trb_beam_combiner_combine  (const TrbBeamCombiner *combiner,
                                             const guint           *index,
                                             const double          *factors,
                                             guint                  n);
void             trb_beam_combiner_free     (TrbBeamCombiner       *combiner);

double           trb_beam_result_bound      (const TrbBeamResult   *result);
TrbBeamResult   *trb_beam_result_restiffen  (const TrbBeamResult   *solved,
                                             const TrbBeam         *beam);

void             trb_beam_result_extremes_intervals (const TrbBeamResult *result,
                                                     const double        *ab,
                                                     guint                n_intervals,
                                                     TrbBeamExtremes     *whole,
                                                     TrbBeamExtremes     *per,
                                                     gboolean            *finite);
void             trb_beam_result_moments_intervals  (const TrbBeamResult *result,
                                                     const double        *ab,
                                                     guint                n_intervals,
                                                     TrbBeamExtremes     *whole,
                                                     TrbBeamExtremes     *per);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbBeamCombiner, trb_beam_combiner_free)

G_END_DECLS
