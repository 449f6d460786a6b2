/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-catalog.h"
#include "trb-section.h"
#include "trb-types.h"
#include "trb-units.h"

G_BEGIN_DECLS

/* One check of one section, as every design method reports it. Demand and capacity are SI
 * (dimension tells which); ratio = demand / capacity; a ratio above 1 fails. */
typedef struct
{
  char         name[40];         /* "Flexure", "Shear", "Live deflection", ... */
  char         clause[48];       /* "AISC 360-16 Eq. F2-2", "NDS 2018 3.3", "IBC Table 1604.3" */
  TrbDimension dimension;        /* of demand and capacity */
  double       demand;
  double       capacity;
  double       ratio;
  char         combination[64];  /* the governing combination's name */
  double       x;                /* where it governs, m from the left end */
  char         detail[96];       /* the inputs that explain it: "Lb = 8.00 ft, Cb = 1.00" */
} TrbCheck;

/* One load combination as the design methods see it: its name, its case factors (for the NDS
 * load-duration factor) and the member's response to it, self-weight of the section included. */
typedef struct
{
  char           name[64];               /* "ASD 2: D + L", "LRFD 2: 1.2D + 1.6L (L on span 1)" */
  double         factors[TRB_N_CASES];   /* the case factors it applies */
  TrbBeamResult *result;                 /* not owned */
  const TrbBeamExtremes *ext;            /* its extremes over the whole member when known
                                          * (trb_beam_result_extremes() from 0 to the
                                          * length), not owned; NULL: the checks find them */
  const TrbBeamExtremes *seg_ext;        /* and over each flexure segment of the method
                                          * (trb_design_steel_segment_points(),
                                          * trb_design_wood_segment_points()), n_seg_ext of
                                          * them; NULL: the checks find them */
  guint                  n_seg_ext;
} TrbDemandCombo;

/* The two ways a method may set capacities against loads: allowable strength (ASD, service
 * combinations, Rn / Omega) and load and resistance factors (LRFD, factored combinations,
 * phi Rn). */
typedef enum
{
  TRB_DESIGN_BASIS_ASD,
  TRB_DESIGN_BASIS_LRFD,
} TrbDesignBasis;

typedef enum
{
  TRB_BRACING_CONTINUOUS,  /* deck or sheathing holds the compression flange or edge throughout */
  TRB_BRACING_POINTS,      /* braced at the supports and at brace_x only */
} TrbBracing;

/* Everything a design method needs to check one section on one member. */
typedef struct
{
  const TrbSection *section;
  double            length;
  const TrbSupport *supports;        /* sorted by x */
  guint             n_supports;
  TrbBracing        bracing;
  const double     *brace_x;         /* discrete brace points besides the supports, sorted */
  guint             n_braces;

  /* the strength combinations of the method (ASD, LRFD, or the service set for the
   * allowable-stress method) */
  const TrbDemandCombo *combos;
  guint                 n_combos;

  /* deflection, with this section's E and I: the live-load response (worst pattern) and the
   * total-load response; NULL where there is no such load */
  const TrbBeamResult *live;
  const TrbBeamResult *total;
  double               live_limit;   /* span ratio denominator: 360 for L/360; 0 for none */
  double               total_limit;

  /* the unit system of the detail texts ("Lb = 12.0 ft"); US when zero-initialised */
  TrbUnitSystem        units;

  /* TRUE: the checks' detail texts are left empty (sizing asks only for the ratios of the
   * sections it does not keep); every number is the same */
  gboolean             no_detail;
} TrbDesignInput;

/* The deflection checks every method shares: the live and total limits as span ratios on each
 * span between supports, cantilevers judged on twice their length (IBC 2021 Table 1604.3,
 * footnote i). Appends to checks (GArray of TrbCheck). */
void        trb_design_check_deflection (const TrbDesignInput *input,
                                         GArray               *checks);

/* The pieces of trb_design_check_deflection(), for a caller that has the extremes over each
 * span already (of many results) and writes the text of the governing one only. */
typedef struct
{
  double   a, b;        /* its extent on the member */
  double   judged;      /* the length the limit applies to: the span, or twice an overhang */
  gboolean overhang;
  char     label[32];   /* "span 2", "left overhang", "cantilever" */
} TrbDeflectionSpan;

guint       trb_design_deflection_spans  (const TrbDesignInput    *input,
                                          TrbDeflectionSpan       *spans,
                                          guint                    max_spans);
double      trb_design_deflection_demand (const TrbBeamExtremes   *ext,
                                          double                  *x);
void        trb_design_deflection_check  (const TrbDesignInput    *input,
                                          const TrbDeflectionSpan *span,
                                          double                   limit,
                                          gboolean                 live,
                                          double                   defl,
                                          double                   x,
                                          const char              *combination,
                                          TrbCheck                *check);

double      trb_check_ratio             (double                demand,
                                         double                capacity);

/* Where the methods cut the member for flexure (defined in trb-design-steel.c and
 * trb-design-wood.c): the ends of the unbraced segments, sorted, without repeats. points needs
 * room for 2 + n_supports + n_braces. Returns how many. */
guint       trb_design_steel_segment_points (const TrbDesignInput *input,
                                             double               *points);
guint       trb_design_wood_segment_points  (const TrbDesignInput *input,
                                             double               *points);
gboolean    trb_design_steel_free_end       (const TrbDesignInput *input,
                                             double                a,
                                             double                b);

/* (trb-design-wood.c) options is a TrbWoodOptions of trb-design-wood.h, which includes this
 * header and so cannot be named here */
void        trb_design_wood_fb_range        (const TrbDesignInput *input,
                                             const TrbWoodGrade   *grade,
                                             const void           *options,
                                             double                CD,
                                             double                seg_length,
                                             gboolean              negative,
                                             double               *lo,
                                             double               *hi);

void        trb_check_set               (TrbCheck             *check,
                                         const char           *name,
                                         const char           *clause,
                                         TrbDimension          dimension,
                                         double                demand,
                                         double                capacity,
                                         const char           *combination,
                                         double                x);

/* Appends the entry a method gives for what it cannot check: named "Not checked", ratio NAN,
 * never a pass. */
void        trb_check_append_not_checked (GArray              *checks,
                                          const char          *clause,
                                          const char          *detail);

/* Formats an SI value in one of the units the detail texts use, to three significant figures:
 * "ft", "in", "in2", "in3", "in4", "kip", "kip-ft", "ksi", "psi", "lb", "m", "mm", "mm2",
 * "mm3", "mm4", "kN", "kN-m", "MPa". Returns buf. */
const char *trb_design_format           (char                 *buf,
                                         gsize                 size,
                                         double                value,
                                         const char           *unit);
/* What g_snprintf (buf, size, "%.*f", decimals, value) prints. Returns buf. */
const char *trb_design_print_fixed      (char                 *buf,
                                         gsize                 size,
                                         double                value,
                                         int                   decimals);

G_END_DECLS
