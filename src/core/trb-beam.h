/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-types.h"

G_BEGIN_DECLS

/* The beam engine: a straight Euler-Bernoulli member of length L with constant E and I,
 * solved by the direct stiffness method with exact fixed-end actions, results recovered as
 * exact piecewise polynomials.
 *
 * Sign conventions (also in docs/beam-engine.md and the JSON output):
 * - x runs from the left end (0) to the right end (L), in metres;
 * - loads are positive downward; an applied moment is positive clockwise (M(x) jumps up by m
 *   passing it from left to right);
 * - reaction forces are positive upward; a fixed support's reaction moment is the couple it
 *   puts on the beam, positive counter-clockwise;
 * - V(x) is the sum of the upward forces left of x; M is positive sagging;
 * - theta is the slope of the upward displacement (counter-clockwise rotation positive);
 * - deflection is positive downward.
 *
 * The model: Euler-Bernoulli bending, small deflections, no shear deformation and no axial
 * action (so a roller holds the member exactly as a pin does, and two rollers make a stable
 * member). Supports are rigid; there is no settlement. Positions within 1e-10 L outside the
 * member (supports and loads) are taken to be at its end. */

typedef enum
{
  TRB_SUPPORT_PIN,     /* translation held */
  TRB_SUPPORT_ROLLER,  /* translation held (no axial action in this model: same as a pin) */
  TRB_SUPPORT_FIXED,   /* translation and rotation held */
} TrbSupportType;

typedef struct
{
  double         x;
  TrbSupportType type;
} TrbSupport;

typedef enum
{
  TRB_LOAD_POINT,    /* a = position, w1 = P (N, down +) */
  TRB_LOAD_UNIFORM,  /* [a, b], w1 = w (N/m, down +) */
  TRB_LOAD_LINEAR,   /* [a, b], w1 at a, w2 at b (N/m, down +) */
  TRB_LOAD_MOMENT,   /* a = position, w1 = m (N*m, clockwise +) */
  /* b is read for UNIFORM and LINEAR only; w2 for LINEAR only. */
} TrbLoadKind;

typedef struct
{
  TrbLoadKind kind;
  double      a;
  double      b;
  double      w1;
  double      w2;
} TrbLoad;

typedef struct
{
  double x;
  double force;   /* N, upward + */
  double moment;  /* N*m, counter-clockwise +; 0 unless the support is fixed */
} TrbReaction;

typedef enum
{
  TRB_SIDE_LEFT,   /* limit from the left of x */
  TRB_SIDE_RIGHT,  /* limit from the right of x */
} TrbSide;

typedef struct
{
  double V;      /* N */
  double M;      /* N*m, sagging + */
  double theta;  /* rad, counter-clockwise + */
  double defl;   /* m, downward + */
} TrbBeamValues;

/* Extremes over an interval, located exactly (roots of the piecewise polynomials). Deflection
 * extremes are magnitudes: defl_down >= 0 is the largest downward deflection and defl_up >= 0
 * the largest upward one (0 with x at the interval start when there is none). */
typedef struct
{
  double V_max, V_max_x;
  double V_min, V_min_x;
  double M_max, M_max_x;
  double M_min, M_min_x;
  double defl_down, defl_down_x;
  double defl_up, defl_up_x;
} TrbBeamExtremes;

/* A beam: geometry, stiffness and supports, factorised once so that any number of load sets
 * can be solved against it. Fails with TRB_ERROR_INVALID for a non-positive or non-finite
 * length, E or I, or a support off the member, and with TRB_ERROR_UNSTABLE when the supports
 * make a mechanism (no support, a lone pin or roller, ...). Supports need not be sorted;
 * two supports at the same x are merged (the stronger type wins). */
TrbBeam          *trb_beam_new               (double              length,
                                              double              E,
                                              double              I,
                                              const TrbSupport   *supports,
                                              guint               n_supports,
                                              GError            **error);
void              trb_beam_free              (TrbBeam            *beam);
double            trb_beam_get_length        (const TrbBeam      *beam);
/* The distinct supports, sorted by x. */
const TrbSupport *trb_beam_get_supports      (const TrbBeam      *beam,
                                              guint              *n_supports);

/* Solves one load set. Loads must lie on the member (0 <= a <= b <= L); otherwise
 * TRB_ERROR_INVALID naming the load's index. An empty load set gives a zero result. */
TrbBeamResult    *trb_beam_solve             (const TrbBeam      *beam,
                                              const TrbLoad      *loads,
                                              guint               n_loads,
                                              GError            **error);

/* factors[i] * results[i], summed: exact superposition of results of the same beam
 * (n_results >= 1; results with a zero factor add nothing, not even break points). */
TrbBeamResult    *trb_beam_result_combine    (TrbBeamResult     **results,
                                              const double       *factors,
                                              guint               n_results);
TrbBeamResult    *trb_beam_result_copy       (const TrbBeamResult *result);
void              trb_beam_result_free       (TrbBeamResult      *result);

double            trb_beam_result_get_length (const TrbBeamResult *result);

/* One reaction per support, sorted by x. */
const TrbReaction *trb_beam_result_get_reactions (const TrbBeamResult *result,
                                                  guint               *n_reactions);

/* The values at x (clamped to [0, L]): the limit from the given side. V and M are zero beyond
 * the ends (x = 0 from the left, x = L from the right), so a diagram drawn from break to break
 * closes on its ends; theta and the deflection are continuous everywhere. */
void              trb_beam_result_eval       (const TrbBeamResult *result,
                                              double               x,
                                              TrbSide              side,
                                              TrbBeamValues       *out);

/* One field of trb_beam_result_eval(). */
typedef enum
{
  TRB_BEAM_V,
  TRB_BEAM_M,
  TRB_BEAM_THETA,
  TRB_BEAM_DEFL,
} TrbBeamQuantity;

/* That field of trb_beam_result_eval() at x from the left and from the right (either may be
 * NULL), bit for bit, without the other fields. */
void              trb_beam_result_value      (const TrbBeamResult *result,
                                              double               x,
                                              TrbBeamQuantity      what,
                                              double              *left,
                                              double              *right);

/* Extremes over [a, b] (a <= b, clamped to the member), counting the left and right values at
 * every jump inside the interval, and at its ends the values inside it (the right value at a,
 * the left one at b; both where a == b, except beyond the member's ends). Interior extremes
 * are the exact roots of the derivative: of w for V, of V (a quadratic) for M, of theta (a
 * quartic) for the deflection. */
void              trb_beam_result_extremes   (const TrbBeamResult *result,
                                              double               a,
                                              double               b,
                                              TrbBeamExtremes     *out);

/* n >= 2 evenly spaced points from 0 to L inclusive, for drawing: at a jump the right value,
 * at L the left one. Draw jumps from trb_beam_result_get_breaks. */
void              trb_beam_result_sample     (const TrbBeamResult *result,
                                              guint                n,
                                              double              *x,
                                              TrbBeamValues       *values);

/* The x positions where V, M or their derivatives may jump (supports, point loads, moments,
 * ends of distributed loads), sorted, including 0 and L; for drawing jumps exactly. */
const double     *trb_beam_result_get_breaks (const TrbBeamResult *result,
                                              guint               *n_breaks);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbBeam, trb_beam_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbBeamResult, trb_beam_result_free)

G_END_DECLS
