/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-beam.h"
#include "trb-combos.h"
#include "trb-error.h"

#include <float.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

/* How the engine works (docs/beam-engine.md says it at length):
 *
 * Nodes sit at the supports. Every translation there is held, so the unknowns of the
 * stiffness system are the rotations of the supports that are not fixed: a tridiagonal,
 * diagonally dominant, symmetric positive definite matrix (4EI/l on the diagonal, 2EI/l
 * beside it), factorised once as LDL^T in trb_beam_new. The free ends are nodes too, but an
 * overhang is statically determinate, so its element is condensed out exactly: its load
 * reaches the outermost support as a known shear and moment. That removes the only source of
 * ill-conditioning (a short overhang would put 12EI/l^3 on the diagonal) at no cost in
 * exactness.
 *
 * Each span gets its exact fixed-end moments and simple-beam reactions from closed-form
 * integrals of its loads; after the rotations are solved, V and M at the start of every span
 * follow from the slope-deflection equations, and V, M, theta and v are carried across the
 * segments between break points as exact polynomials in a local coordinate t:
 *   w(t) = w + dw t, V(t) = V - w t - dw t^2/2, M(t) = M + V t - w t^2/2 - dw t^3/6,
 *   EI theta(t) = EI theta + M t + ..., EI v(t) = EI v + EI theta t + M t^2/2 + ...
 * Internally v is the upward displacement; the public deflection is -v. */

/* Positions this close outside the member (relative to its length) are taken as its end:
 * plan geometry computed in floating point puts a support "at the end" within a few ulps. */
#define END_TOLERANCE 1e-10

/* A pivot this small against its diagonal means a mechanism. For a stable member the matrix
 * is diagonally dominant, so every pivot is at least half its diagonal. */
#define PIVOT_TOLERANCE 1e-9

/* Scratch kept on the stack for the usual member; larger load sets use the heap once. */
#define STACK_DOUBLES 1024

typedef struct
{
  double x;      /* start of the segment, m */
  double w;      /* load intensity at the start, N/m, downward + */
  double dw;     /* its slope, N/m^2 */
  double V;      /* shear just right of x, N */
  double M;      /* moment just right of x, N*m */
  double theta;  /* rad, counter-clockwise + */
  double v;      /* upward displacement, m */
} TrbSegment;

struct _TrbBeam
{
  double      length;
  double      E;
  double      I;
  double      EI;
  guint       n_supports;
  TrbSupport *supports;  /* distinct, sorted */
  double     *pivot;     /* LDL^T: D; 1 for a fixed support (its row is removed) */
  double     *mult;      /* LDL^T: L between support i and i + 1 */
};

struct _TrbBeamResult
{
  gsize        size;      /* of the one allocation that holds everything below */
  double       length;
  double       EI;
  double       inv_EI;    /* multiplications are much cheaper than divisions when drawing */
  guint        n_breaks;  /* >= 2; the segments number n_breaks - 1 */
  guint        n_reactions;
  guint        n_phi;     /* a solved result: the supports' E I theta (no E I in them), one
                           * a support, to solve it again with another E I; else 0 */
  TrbSegment  *segments;
  double      *breaks;
  TrbReaction *reactions;
  double      *phi;
};

/* ---- the beam ---- */

static int
support_strength (TrbSupportType type)
{
  switch (type)
    {
    case TRB_SUPPORT_FIXED:
      return 2;
    case TRB_SUPPORT_PIN:
      return 1;
    case TRB_SUPPORT_ROLLER:
    default:
      return 0;
    }
}

static int
compare_supports (const void *pa,
                  const void *pb)
{
  const TrbSupport *a = pa;
  const TrbSupport *b = pb;

  return (a->x > b->x) - (a->x < b->x);
}

static gboolean
is_finite_positive (double v)
{
  return isfinite (v) && v > 0;
}

/**
 * trb_beam_new:
 * @length: the member's length, m
 * @E: modulus of elasticity, Pa
 * @I: moment of inertia, m^4
 * @supports: (array length=n_supports): the supports, in any order
 * @n_supports: their number
 * @error: return location for a #GError
 *
 * Sets up a member and factorises its stiffness once. A support within 1e-10 L outside the
 * member is taken to be at its end.
 *
 * Returns: (transfer full): the beam, or %NULL with @error set (%TRB_ERROR_INVALID,
 *   %TRB_ERROR_UNSTABLE)
 */
TrbBeam *
trb_beam_new (double              length,
              double              E,
              double              I,
              const TrbSupport   *supports,
              guint               n_supports,
              GError            **error)
{
  g_autofree TrbSupport *sorted = NULL;
  TrbBeam *beam;
  guint n = 0;
  double tol;
  char *mem;

  g_return_val_if_fail (supports != NULL || n_supports == 0, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!is_finite_positive (length))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "The member length must be a positive number (got %g m)", length);
      return NULL;
    }
  if (!is_finite_positive (E))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "The modulus of elasticity must be a positive number (got %g Pa)", E);
      return NULL;
    }
  if (!is_finite_positive (I))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "The moment of inertia must be a positive number (got %g m^4)", I);
      return NULL;
    }
  if (!is_finite_positive (E * I))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "The bending stiffness E*I is out of range (E = %g Pa, I = %g m^4)", E, I);
      return NULL;
    }

  tol = END_TOLERANCE * length;
  sorted = g_new (TrbSupport, MAX (n_supports, 1));
  for (guint i = 0; i < n_supports; i++)
    {
      double x = supports[i].x;

      if (!isfinite (x) || x < -tol || x > length + tol)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "Support %u at x = %g m is off the member (0 to %g m)", i + 1, x, length);
          return NULL;
        }
      if (supports[i].type != TRB_SUPPORT_PIN && supports[i].type != TRB_SUPPORT_ROLLER &&
          supports[i].type != TRB_SUPPORT_FIXED)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "Support %u has an unknown type (%d)", i + 1, (int) supports[i].type);
          return NULL;
        }
      sorted[i].x = CLAMP (x, 0.0, length);
      sorted[i].type = supports[i].type;
    }
  qsort (sorted, n_supports, sizeof (TrbSupport), compare_supports);

  /* merge supports at the same x; the stronger one wins. "The same" within the tolerance of
   * the ends: "6 ft" and "72 in" differ in the last bit, and two supports that close made a
   * stiffness matrix singular to rounding, with reactions of 1e16 kip. */
  for (guint i = 0; i < n_supports; i++)
    {
      if (n > 0 && sorted[i].x - sorted[n - 1].x <= tol)
        {
          if (support_strength (sorted[i].type) > support_strength (sorted[n - 1].type))
            sorted[n - 1].type = sorted[i].type;
        }
      else
        sorted[n++] = sorted[i];
    }

  /* The member is a rigid body with two degrees of freedom in this model (translation and
   * rotation in the plane; there is no axial action, so rollers hold as well as pins). Two
   * distinct supports, or one fixed support, hold it. Saying which case failed is kinder
   * than pointing at a zero pivot. */
  if (n == 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE,
                   "The member has no support: it needs two supports, or one fixed support");
      return NULL;
    }
  if (n == 1 && sorted[0].type != TRB_SUPPORT_FIXED)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE,
                   "A single %s at x = %g m cannot hold the member against rotation: "
                   "add a second support or make this one fixed",
                   sorted[0].type == TRB_SUPPORT_PIN ? "pin" : "roller", sorted[0].x);
      return NULL;
    }

  /* one allocation: the struct, the supports, the factors */
  mem = g_malloc0 (sizeof (TrbBeam) + n * sizeof (TrbSupport) + 2 * n * sizeof (double));
  beam = (TrbBeam *) mem;
  beam->supports = (TrbSupport *) (mem + sizeof (TrbBeam));
  beam->pivot = (double *) (mem + sizeof (TrbBeam) + n * sizeof (TrbSupport));
  beam->mult = beam->pivot + n;
  beam->length = length;
  beam->E = E;
  beam->I = I;
  beam->EI = E * I;
  beam->n_supports = n;
  memcpy (beam->supports, sorted, n * sizeof (TrbSupport));

  /* K / EI over the support rotations: diagonal 4/l of each adjacent span, off-diagonal 2/l.
   * A fixed support's rotation is held: its row and column are removed, which in place means
   * a unit pivot, no coupling, and a zero right-hand side at solve time. */
  for (guint i = 0; i < n; i++)
    {
      gboolean held = beam->supports[i].type == TRB_SUPPORT_FIXED;
      double diag = 0, coupling = 0;

      if (i > 0)
        diag += 4.0 / (beam->supports[i].x - beam->supports[i - 1].x);
      if (i + 1 < n)
        diag += 4.0 / (beam->supports[i + 1].x - beam->supports[i].x);

      if (held)
        {
          beam->pivot[i] = 1.0;
          if (i > 0)
            beam->mult[i - 1] = 0;
          continue;
        }

      if (i > 0 && beam->supports[i - 1].type != TRB_SUPPORT_FIXED)
        {
          coupling = 2.0 / (beam->supports[i].x - beam->supports[i - 1].x);
          beam->mult[i - 1] = coupling / beam->pivot[i - 1];
        }
      else if (i > 0)
        beam->mult[i - 1] = 0;

      beam->pivot[i] = diag - (i > 0 ? beam->mult[i - 1] * coupling : 0);
      if (!(beam->pivot[i] > PIVOT_TOLERANCE * diag) || !isfinite (beam->pivot[i]))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_UNSTABLE,
                       "The supports make a mechanism: nothing holds the member against "
                       "rotation at x = %g m", beam->supports[i].x);
          g_free (mem);
          return NULL;
        }
    }

  return beam;
}

void
trb_beam_free (TrbBeam *beam)
{
  g_free (beam);
}

double
trb_beam_get_length (const TrbBeam *beam)
{
  g_return_val_if_fail (beam != NULL, 0);

  return beam->length;
}

const TrbSupport *
trb_beam_get_supports (const TrbBeam *beam,
                       guint         *n_supports)
{
  g_return_val_if_fail (beam != NULL, NULL);

  if (n_supports != NULL)
    *n_supports = beam->n_supports;
  return beam->supports;
}

/* ---- exact integrals of a linearly varying load ---- */

/* The integral over [0, 1] of the product of four linear functions, each given by its values
 * at 0 and 1 (Bernstein form). Expanding the product in the basis (1-s)^(4-k) s^k keeps every
 * term of one sign when the factors are, so nothing cancels; the basis integrals are
 * k! (4-k)! / 5!. */
static inline double
bernstein4 (double p0, double p1,
            double q0, double q1,
            double r0, double r1,
            double s0, double s1)
{
  double e0, e1, e2, e3, e4;

  /* p * q */
  e0 = p0 * q0;
  e1 = p0 * q1 + p1 * q0;
  e2 = p1 * q1;
  /* * r */
  e3 = e2 * r1;
  e2 = e2 * r0 + e1 * r1;
  e1 = e1 * r0 + e0 * r1;
  e0 = e0 * r0;
  /* * s */
  e4 = e3 * s1;
  e3 = e3 * s0 + e2 * s1;
  e2 = e2 * s0 + e1 * s1;
  e1 = e1 * s0 + e0 * s1;
  e0 = e0 * s0;

  return (e0 + e4) / 5.0 + (e1 + e3) / 20.0 + e2 / 30.0;
}

/* the same for two linear functions: (2 p0 q0 + p0 q1 + p1 q0 + 2 p1 q1) / 6 */
static inline double
bernstein2 (double p0, double p1,
            double q0, double q1)
{
  return (2.0 * (p0 * q0 + p1 * q1) + p0 * q1 + p1 * q0) / 6.0;
}

/* ---- solving ---- */

static gsize
result_size (guint n_breaks,
             guint n_reactions,
             guint n_phi)
{
  return sizeof (TrbBeamResult) + (n_breaks - 1) * sizeof (TrbSegment) +
         n_breaks * sizeof (double) + n_reactions * sizeof (TrbReaction) +
         n_phi * sizeof (double);
}

static void
result_set_pointers (TrbBeamResult *r)
{
  char *mem = (char *) r;

  r->segments = (TrbSegment *) (mem + sizeof (TrbBeamResult));
  r->breaks = (double *) (mem + sizeof (TrbBeamResult) + (r->n_breaks - 1) * sizeof (TrbSegment));
  r->reactions = (TrbReaction *) (r->breaks + r->n_breaks);
  r->phi = (double *) (r->reactions + r->n_reactions);
}

static TrbBeamResult *
result_alloc (double length,
              double EI,
              guint  n_breaks,
              guint  n_reactions,
              guint  n_phi)
{
  gsize size = result_size (n_breaks, n_reactions, n_phi);
  /* not zeroed: every field is written by the caller */
  TrbBeamResult *r = g_malloc (size);

  r->size = size;
  r->length = length;
  r->EI = EI;
  r->inv_EI = 1.0 / EI;
  r->n_breaks = n_breaks;
  r->n_reactions = n_reactions;
  r->n_phi = n_phi;
  result_set_pointers (r);
  return r;
}

static int
compare_doubles (const void *pa,
                 const void *pb)
{
  double a = *(const double *) pa;
  double b = *(const double *) pb;

  return (a > b) - (a < b);
}

static void
sort_doubles (double *v,
              guint   n)
{
  if (n > 24)
    {
      qsort (v, n, sizeof (double), compare_doubles);
      return;
    }
  /* insertion sort: the usual member has a couple of dozen positions */
  for (guint i = 1; i < n; i++)
    {
      double t = v[i];
      guint j = i;

      while (j > 0 && v[j - 1] > t)
        {
          v[j] = v[j - 1];
          j--;
        }
      v[j] = t;
    }
}

/* the index of x in the sorted, distinct breaks (x is one of them) */
static inline guint
find_break (const double *breaks,
            guint         n,
            double        x)
{
  guint lo = 0, hi = n - 1;

  while (lo < hi)
    {
      guint mid = (lo + hi) / 2;

      if (breaks[mid] < x)
        lo = mid + 1;
      else
        hi = mid;
    }
  g_assert (breaks[lo] == x);
  return lo;
}

/* the segment holding x: the last k with breaks[k] <= x (right side) or breaks[k] < x (left
 * side), kept within 0 .. n_breaks - 2 */
static inline guint
find_segment (const TrbBeamResult *r,
              double               x,
              TrbSide              side)
{
  guint lo = 0, hi = r->n_breaks - 2;

  while (lo < hi)
    {
      guint mid = (lo + hi + 1) / 2;
      gboolean after = side == TRB_SIDE_LEFT ? r->breaks[mid] < x : r->breaks[mid] <= x;

      if (after)
        lo = mid;
      else
        hi = mid - 1;
    }
  return lo;
}

static inline double
clamp_position (double x,
                double length)
{
  return CLAMP (x, 0.0, length);
}

static gboolean
check_loads (const TrbBeam  *beam,
             const TrbLoad  *loads,
             guint           n_loads,
             GError        **error)
{
  double L = beam->length;
  double tol = END_TOLERANCE * L;

  for (guint i = 0; i < n_loads; i++)
    {
      const TrbLoad *ld = &loads[i];
      gboolean spread = ld->kind == TRB_LOAD_UNIFORM || ld->kind == TRB_LOAD_LINEAR;

      if (ld->kind != TRB_LOAD_POINT && ld->kind != TRB_LOAD_UNIFORM &&
          ld->kind != TRB_LOAD_LINEAR && ld->kind != TRB_LOAD_MOMENT)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "Load %u has an unknown kind (%d)", i + 1, (int) ld->kind);
          return FALSE;
        }
      if (!isfinite (ld->a) || (spread && !isfinite (ld->b)) || !isfinite (ld->w1) ||
          (ld->kind == TRB_LOAD_LINEAR && !isfinite (ld->w2)))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "Load %u has a value that is not a finite number", i + 1);
          return FALSE;
        }
      if (ld->a < -tol || ld->a > L + tol || (spread && (ld->b < -tol || ld->b > L + tol)))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "Load %u is off the member (it must lie between 0 and %g m)", i + 1, L);
          return FALSE;
        }
      if (spread && ld->a > ld->b + tol)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "Load %u starts after it ends (a = %g m > b = %g m)", i + 1, ld->a, ld->b);
          return FALSE;
        }
    }
  return TRUE;
}

/* The factorials of the polynomials, as multipliers: a division costs several times a
 * multiplication, and these run for every drawn point. */
#define C2 0.5
#define C6 (1.0 / 6.0)
#define C24 (1.0 / 24.0)
#define C120 (1.0 / 120.0)

/* carries the state at the start of a segment to the local coordinate h */
static inline void
segment_advance (const TrbSegment *s,
                 double            h,
                 double            inv_EI,
                 double           *V,
                 double           *M,
                 double           *theta,
                 double           *v)
{
  double w = s->w, dw = s->dw;

  *V = s->V - h * (w + h * dw * C2);
  *M = s->M + h * (s->V - h * (w * C2 + h * dw * C6));
  *theta = s->theta + h * (s->M + h * (s->V * C2 - h * (w * C6 + h * dw * C24))) * inv_EI;
  *v = s->v + h * s->theta +
       h * h * (s->M * C2 + h * (s->V * C6 - h * (w * C24 + h * dw * C120))) * inv_EI;
}

/* theta and v of segment_advance() alone: the same operations */
static inline void
segment_advance_rotation (const TrbSegment *s,
                          double            h,
                          double            inv_EI,
                          double           *theta,
                          double           *v)
{
  double w = s->w, dw = s->dw;

  *theta = s->theta + h * (s->M + h * (s->V * C2 - h * (w * C6 + h * dw * C24))) * inv_EI;
  *v = s->v + h * s->theta +
       h * h * (s->M * C2 + h * (s->V * C6 - h * (w * C24 + h * dw * C120))) * inv_EI;
}

/* theta and v of every segment of a solved result whose V, M, w and dw are in place, from the
 * supports' rotations times E I (res->phi) and E I: the left overhang integrated with a
 * provisional theta = v = 0 at x = 0, then shifted so that v(s0) = 0 and theta(s0) matches
 * the support; each span and the right overhang from their support. sidx: each support's
 * break. */
static void
sweep_rotations (TrbBeamResult    *res,
                 const TrbSupport *sup,
                 guint             ns,
                 const guint      *sidx,
                 double            EI)
{
  TrbSegment *seg = res->segments;
  const double *brk = res->breaks;
  const double *phi = res->phi;
  guint nseg = res->n_breaks - 1;
  guint k0 = sidx[0];
  double theta = 0, v = 0;

  for (guint k = 0; k < k0; k++)
    {
      seg[k].theta = theta;
      seg[k].v = v;
      segment_advance_rotation (&seg[k], brk[k + 1] - brk[k], res->inv_EI, &theta, &v);
    }
  if (k0 > 0)
    {
      double t0 = phi[0] / EI - theta;
      double v_end = v;

      for (guint k = 0; k < k0; k++)
        {
          seg[k].v = seg[k].v - v_end - t0 * (sup[0].x - brk[k]);
          seg[k].theta += t0;
        }
    }

  for (guint i = 0; i < ns; i++)
    {
      guint kend = i + 1 < ns ? sidx[i + 1] : nseg;

      for (guint k = sidx[i]; k < kend; k++)
        {
          if (k == sidx[i])
            {
              theta = phi[i] / EI;
              v = 0;
            }
          seg[k].theta = theta;
          seg[k].v = v;
          segment_advance_rotation (&seg[k], brk[k + 1] - brk[k], res->inv_EI, &theta, &v);
        }
    }
}

/**
 * trb_beam_result_restiffen:
 * @solved: a result of trb_beam_solve()
 * @beam: a beam of the same length and supports as the one solved, E and I aside
 *
 * The result trb_beam_solve() gives for the same loads on @beam, bit for bit: the shears,
 * moments and reactions do not depend on E I, so only the rotations and deflections are
 * swept again.
 *
 * Returns: (transfer full): the result, or %NULL when @solved is not one trb_beam_solve()
 *   made on such a beam
 */
TrbBeamResult *
trb_beam_result_restiffen (const TrbBeamResult *solved,
                           const TrbBeam       *beam)
{
  TrbBeamResult *res;
  guint sidx_stack[64];
  g_autofree guint *sidx_heap = NULL;
  guint *sidx;
  guint ns;

  g_return_val_if_fail (solved != NULL && beam != NULL, NULL);

  ns = beam->n_supports;
  if (solved->n_phi != ns || solved->n_reactions != ns || solved->length != beam->length)
    return NULL;
  for (guint i = 0; i < ns; i++)
    if (solved->reactions[i].x != beam->supports[i].x)
      return NULL;
  sidx = ns <= G_N_ELEMENTS (sidx_stack) ? sidx_stack : (sidx_heap = g_new (guint, ns));
  res = g_memdup2 (solved, solved->size);
  result_set_pointers (res);
  res->EI = beam->EI;
  res->inv_EI = 1.0 / beam->EI;
  for (guint i = 0; i < ns; i++)
    sidx[i] = find_break (res->breaks, res->n_breaks, beam->supports[i].x);
  sweep_rotations (res, beam->supports, ns, sidx, beam->EI);
  return res;
}

/**
 * trb_beam_solve:
 * @beam: a beam
 * @loads: (array length=n_loads): the loads of one load set
 * @n_loads: their number
 * @error: return location for a #GError
 *
 * Solves one load set exactly (to rounding) for the Euler-Bernoulli model. Positions within
 * 1e-10 L outside the member are taken to be at its end.
 *
 * Returns: (transfer full): the result, or %NULL with %TRB_ERROR_INVALID naming the load
 */
TrbBeamResult *
trb_beam_solve (const TrbBeam  *beam,
                const TrbLoad  *loads,
                guint           n_loads,
                GError        **error)
{
  const double L = beam != NULL ? beam->length : 0;
  const double EI = beam != NULL ? beam->EI : 0;
  const TrbSupport *sup;
  guint ns, nb_max, nb, nseg;
  gsize n_scratch;
  double stack[STACK_DOUBLES];
  g_autofree double *heap = NULL;
  double *scratch, *brk, *P, *m, *Ml, *Mr, *Vl, *Vr, *phi, *rhs, *RA, *RB, *FA, *FB;
  guint *sidx;
  double WL = 0, MoL = 0, WR = 0, MoR = 0;
  TrbBeamResult *res;
  TrbSegment *seg;

  g_return_val_if_fail (beam != NULL, NULL);
  g_return_val_if_fail (loads != NULL || n_loads == 0, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_loads (beam, loads, n_loads, error))
    return NULL;

  sup = beam->supports;
  ns = beam->n_supports;
  nb_max = 2 + ns + 2 * n_loads;

  /* scratch: positions and the jumps at each (3 nb_max), per-support quantities (10 ns) and
   * the supports' break indices (ns guints, in the room of ns doubles) */
  n_scratch = 3 * (gsize) nb_max + 11 * (gsize) ns;
  if (n_scratch <= STACK_DOUBLES)
    scratch = stack;
  else
    scratch = heap = g_new (double, n_scratch);
  brk = scratch;
  P = brk + nb_max;
  m = P + nb_max;
  Ml = m + nb_max;
  Mr = Ml + ns;
  Vl = Mr + ns;
  Vr = Vl + ns;
  phi = Vr + ns;
  rhs = phi + ns;
  RA = rhs + ns;
  RB = RA + ns;
  FA = RB + ns;
  FB = FA + ns;
  sidx = (guint *) (FB + ns);

  /* the break points: the ends, the supports, every load's ends */
  nb = 0;
  brk[nb++] = 0;
  brk[nb++] = L;
  for (guint i = 0; i < ns; i++)
    brk[nb++] = sup[i].x;
  for (guint i = 0; i < n_loads; i++)
    {
      brk[nb++] = clamp_position (loads[i].a, L);
      if (loads[i].kind == TRB_LOAD_UNIFORM || loads[i].kind == TRB_LOAD_LINEAR)
        brk[nb++] = clamp_position (loads[i].b, L);
    }
  sort_doubles (brk, nb);
  {
    guint k = 1;

    for (guint i = 1; i < nb; i++)
      if (brk[i] != brk[k - 1])
        brk[k++] = brk[i];
    nb = k;
  }
  nseg = nb - 1;

  res = result_alloc (L, EI, nb, ns, ns);
  memcpy (res->breaks, brk, nb * sizeof (double));
  brk = res->breaks;
  seg = res->segments;
  for (guint k = 0; k < nseg; k++)
    {
      seg[k].x = brk[k];
      seg[k].w = 0;
      seg[k].dw = 0;
    }
  memset (P, 0, nb * sizeof (double));
  memset (m, 0, nb * sizeof (double));

  /* loads onto the breaks (point forces, moments) and the segments (intensity, slope) */
  for (guint i = 0; i < n_loads; i++)
    {
      const TrbLoad *ld = &loads[i];
      double a = clamp_position (ld->a, L);

      switch (ld->kind)
        {
        case TRB_LOAD_POINT:
          P[find_break (brk, nb, a)] += ld->w1;
          break;

        case TRB_LOAD_MOMENT:
          m[find_break (brk, nb, a)] += ld->w1;
          break;

        case TRB_LOAD_UNIFORM:
        case TRB_LOAD_LINEAR:
          {
            double b = clamp_position (ld->b, L);
            double w2 = ld->kind == TRB_LOAD_LINEAR ? ld->w2 : ld->w1;
            double slope;

            if (!(b > a))
              break;  /* no length, no load */
            slope = (w2 - ld->w1) / (b - a);
            for (guint k = find_break (brk, nb, a); k < nseg && brk[k] < b; k++)
              {
                /* interpolated from the nearer end so that each end value is exact */
                double wk = ld->w1;

                if (slope != 0 && brk[k] != a)
                  wk = (brk[k] - a <= b - brk[k]) ?
                       ld->w1 + (w2 - ld->w1) * ((brk[k] - a) / (b - a)) :
                       w2 - (w2 - ld->w1) * ((b - brk[k]) / (b - a));
                seg[k].w += wk;
                seg[k].dw += slope;
              }
          }
          break;

        default:
          g_assert_not_reached ();
        }
    }

  for (guint i = 0; i < ns; i++)
    sidx[i] = find_break (brk, nb, sup[i].x);

  /* The left overhang [0, s0): its load reaches s0 as a shear WL and a moment MoL = M(s0-). */
  for (guint k = 0; k < sidx[0]; k++)
    {
      double s0 = sup[0].x;
      double h = brk[k + 1] - brk[k];
      double q0 = seg[k].w, q1 = seg[k].w + seg[k].dw * h;

      WL += P[k];
      MoL += m[k] - P[k] * (s0 - brk[k]);
      if (q0 != 0 || q1 != 0)
        {
          WL += h * (q0 + q1) / 2.0;
          MoL -= h * bernstein2 (q0, q1, s0 - brk[k], s0 - brk[k + 1]);
        }
    }

  /* The right overhang (s_last, L]: WR = V(s_last+), MoR = M(s_last+). */
  for (guint k = sidx[ns - 1] + 1; k < nb; k++)
    {
      double sn = sup[ns - 1].x;

      WR += P[k];
      MoR -= m[k] + P[k] * (brk[k] - sn);
    }
  for (guint k = sidx[ns - 1]; k < nseg; k++)
    {
      double sn = sup[ns - 1].x;
      double h = brk[k + 1] - brk[k];
      double q0 = seg[k].w, q1 = seg[k].w + seg[k].dw * h;

      if (q0 != 0 || q1 != 0)
        {
          WR += h * (q0 + q1) / 2.0;
          MoR -= h * bernstein2 (q0, q1, brk[k] - sn, brk[k + 1] - sn);
        }
    }

  /* Each span: simple-beam reactions RA, RB (times l) and the fixed-end moments, sagging +,
   * M_A = -FA / l^2 and M_B = -FB / l^2, from the closed forms
   *   point P at a (u = l - a):  FA = P a u^2,  FB = P a^2 u;
   *   clockwise moment m at a:   FA = -m u (2a - u),  FB = -m a (a - 2u);
   *   intensity q over the span: FA = int q a u^2,  FB = int q a^2 u  (exact, see bernstein4). */
  for (guint j = 0; j + 1 < ns; j++)
    {
      double xa = sup[j].x, xb = sup[j + 1].x;
      double ra = 0, rb = 0, fa = 0, fb = 0;

      for (guint k = sidx[j] + 1; k < sidx[j + 1]; k++)
        {
          double a = brk[k] - xa, u = xb - brk[k];

          ra += P[k] * u - m[k];
          rb += P[k] * a + m[k];
          fa += P[k] * a * u * u - m[k] * u * (2.0 * a - u);
          fb += P[k] * a * a * u - m[k] * a * (a - 2.0 * u);
        }
      for (guint k = sidx[j]; k < sidx[j + 1]; k++)
        {
          double h = brk[k + 1] - brk[k];
          double q0 = seg[k].w, q1 = seg[k].w + seg[k].dw * h;
          double a0, a1, u0, u1;

          if (q0 == 0 && q1 == 0)
            continue;
          a0 = brk[k] - xa;
          a1 = brk[k + 1] - xa;
          u0 = xb - brk[k];
          u1 = xb - brk[k + 1];
          ra += h * bernstein2 (q0, q1, u0, u1);
          rb += h * bernstein2 (q0, q1, a0, a1);
          fa += h * bernstein4 (q0, q1, a0, a1, u0, u1, u0, u1);
          fb += h * bernstein4 (q0, q1, a0, a1, a0, a1, u0, u1);
        }
      RA[j] = ra;
      RB[j] = rb;
      FA[j] = fa;
      FB[j] = fb;
    }

  /* The rotations: K phi = rhs with phi = EI theta. At support i, equilibrium of moments is
   * M(s_i-) - M(s_i+) + m_i = 0 (plus the support's couple if fixed), which in terms of the
   * rotations reads 2/l' phi_(i-1) + (4/l' + 4/l) phi_i + 2/l phi_(i+1) = M_A - M_B' - m_i,
   * M_B' the fixed-end moment at the right of the span on the left (or the left overhang's
   * moment), M_A that at the left of the span on the right (or the right overhang's). */
  for (guint i = 0; i < ns; i++)
    {
      double left, right;

      if (sup[i].type == TRB_SUPPORT_FIXED)
        {
          rhs[i] = 0;
          continue;
        }
      left = i > 0 ? -FB[i - 1] / ((sup[i].x - sup[i - 1].x) * (sup[i].x - sup[i - 1].x)) : MoL;
      right = i + 1 < ns ? -FA[i] / ((sup[i + 1].x - sup[i].x) * (sup[i + 1].x - sup[i].x)) : MoR;
      rhs[i] = right - left - m[sidx[i]];
    }
  for (guint i = 1; i < ns; i++)
    rhs[i] -= beam->mult[i - 1] * rhs[i - 1];
  for (guint i = 0; i < ns; i++)
    phi[i] = rhs[i] / beam->pivot[i];
  for (guint i = ns - 1; i-- > 0;)
    phi[i] -= beam->mult[i] * phi[i + 1];
  for (guint i = 0; i < ns; i++)
    if (sup[i].type == TRB_SUPPORT_FIXED)
      phi[i] = 0;

  /* span end moments and shears from the slope-deflection equations */
  for (guint j = 0; j + 1 < ns; j++)
    {
      double l = sup[j + 1].x - sup[j].x;
      double d;

      Ml[j] = -FA[j] / (l * l) - 2.0 * (2.0 * phi[j] + phi[j + 1]) / l;
      Mr[j] = -FB[j] / (l * l) + 2.0 * (phi[j] + 2.0 * phi[j + 1]) / l;
      /* At an outermost support that is not fixed the moment is known by statics alone;
       * use that exact value rather than the solved one, equal to rounding. */
      if (j == 0 && sup[0].type != TRB_SUPPORT_FIXED)
        Ml[j] = MoL + m[sidx[0]];
      if (j + 2 == ns && sup[ns - 1].type != TRB_SUPPORT_FIXED)
        Mr[j] = MoR - m[sidx[ns - 1]];
      d = (Mr[j] - Ml[j]) / l;
      Vl[j] = RA[j] / l + d;
      Vr[j] = -RB[j] / l + d;
    }

  /* reactions: the jump in V plus a point load right on the support; the couple of a fixed
   * support from its moment equilibrium */
  for (guint i = 0; i < ns; i++)
    {
      double Vminus = i > 0 ? Vr[i - 1] : -WL;
      double Vplus = i + 1 < ns ? Vl[i] : WR;
      TrbReaction *r = &res->reactions[i];

      r->x = sup[i].x;
      r->force = Vplus - Vminus + P[sidx[i]];
      r->moment = 0;
      if (sup[i].type == TRB_SUPPORT_FIXED)
        {
          double Mminus = i > 0 ? Mr[i - 1] : MoL;
          double Mplus = i + 1 < ns ? Ml[i] : MoR;

          r->moment = Mminus - Mplus + m[sidx[i]];
        }
    }

  /* the segments, swept left to right: the left overhang, each span, the right overhang (the
   * rotations and deflections alone are swept the same way by sweep_rotations(), for
   * trb_beam_result_restiffen()) */
  {
    double V = 0, M = 0, theta = 0, v = 0;
    guint k0 = sidx[0];

    /* left overhang: integrate with a provisional theta = v = 0 at x = 0, then shift so that
     * v(s0) = 0 and theta(s0) matches the support */
    for (guint k = 0; k < k0; k++)
      {
        V -= P[k];
        M += m[k];
        seg[k].V = V;
        seg[k].M = M;
        seg[k].theta = theta;
        seg[k].v = v;
        segment_advance (&seg[k], brk[k + 1] - brk[k], res->inv_EI, &V, &M, &theta, &v);
      }
    if (k0 > 0)
      {
        double t0 = phi[0] / EI - theta;
        double v_end = v;

        for (guint k = 0; k < k0; k++)
          {
            seg[k].v = seg[k].v - v_end - t0 * (sup[0].x - brk[k]);
            seg[k].theta += t0;
          }
      }

    for (guint i = 0; i < ns; i++)
      {
        guint kend = i + 1 < ns ? sidx[i + 1] : nseg;

        for (guint k = sidx[i]; k < kend; k++)
          {
            if (k == sidx[i])
              {
                V = i + 1 < ns ? Vl[i] : WR;
                M = i + 1 < ns ? Ml[i] : MoR;
                theta = phi[i] / EI;
                v = 0;
              }
            else
              {
                V -= P[k];
                M += m[k];
              }
            seg[k].V = V;
            seg[k].M = M;
            seg[k].theta = theta;
            seg[k].v = v;
            segment_advance (&seg[k], brk[k + 1] - brk[k], res->inv_EI, &V, &M, &theta, &v);
          }
      }
  }
  memcpy (res->phi, phi, ns * sizeof (double));

  return res;
}

/* ---- results ---- */

/**
 * trb_beam_result_combine:
 * @results: (array length=n_results): results of the same beam
 * @factors: (array length=n_results): their factors
 * @n_results: their number, at least one
 *
 * Superposes results exactly: the break points are merged and the polynomials of each
 * segment added with their factors. Results with a zero factor are left out.
 *
 * Returns: (transfer full): the combined result
 */
TrbBeamResult *
trb_beam_result_combine (TrbBeamResult **results,
                         const double   *factors,
                         guint           n_results)
{
  guint cur_stack[16];
  double brk_stack[512];
  g_autofree guint *cur_heap = NULL;
  g_autofree double *brk_heap = NULL;
  guint *cur;
  double *brk;
  guint total = 0, nb = 0;
  const TrbBeamResult *first;
  TrbBeamResult *res;

  g_return_val_if_fail (results != NULL && factors != NULL && n_results > 0, NULL);

  first = results[0];
  for (guint r = 0; r < n_results; r++)
    {
      g_return_val_if_fail (results[r] != NULL, NULL);
      g_return_val_if_fail (results[r]->length == first->length, NULL);
      g_return_val_if_fail (results[r]->n_reactions == first->n_reactions, NULL);
      total += results[r]->n_breaks;
    }

  cur = n_results <= G_N_ELEMENTS (cur_stack) ? cur_stack : (cur_heap = g_new (guint, n_results));
  brk = total <= G_N_ELEMENTS (brk_stack) ? brk_stack : (brk_heap = g_new (double, total));

  /* the merged breaks: a k-way merge over the results that count */
  for (guint r = 0; r < n_results; r++)
    cur[r] = 0;
  for (;;)
    {
      double x = INFINITY;

      for (guint r = 0; r < n_results; r++)
        if (factors[r] != 0 && cur[r] < results[r]->n_breaks && results[r]->breaks[cur[r]] < x)
          x = results[r]->breaks[cur[r]];
      if (x == INFINITY)
        break;
      brk[nb++] = x;
      for (guint r = 0; r < n_results; r++)
        if (factors[r] != 0 && cur[r] < results[r]->n_breaks && results[r]->breaks[cur[r]] == x)
          cur[r]++;
    }
  if (nb < 2)
    {
      /* every factor is zero: a zero result on the breaks of the first */
      nb = first->n_breaks;
      memcpy (brk, first->breaks, nb * sizeof (double));
    }

  res = result_alloc (first->length, first->EI, nb, first->n_reactions, 0);
  memcpy (res->breaks, brk, nb * sizeof (double));

  /* each merged segment: every result's state at its start (a Taylor shift of that result's
   * own polynomials, which is exact), scaled and added */
  for (guint r = 0; r < n_results; r++)
    cur[r] = 0;
  for (guint k = 0; k + 1 < nb; k++)
    {
      TrbSegment *s = &res->segments[k];
      double x = brk[k];

      memset (s, 0, sizeof *s);
      s->x = x;
      for (guint r = 0; r < n_results; r++)
        {
          const TrbBeamResult *src = results[r];
          const TrbSegment *ss;
          double f = factors[r], t, V, M, theta, v;

          if (f == 0)
            continue;
          while (cur[r] + 2 < src->n_breaks && src->breaks[cur[r] + 1] <= x)
            cur[r]++;
          ss = &src->segments[cur[r]];
          t = x - src->breaks[cur[r]];
          if (t == 0)
            {
              V = ss->V;
              M = ss->M;
              theta = ss->theta;
              v = ss->v;
            }
          else
            segment_advance (ss, t, src->inv_EI, &V, &M, &theta, &v);
          s->w += f * (ss->w + ss->dw * t);
          s->dw += f * ss->dw;
          s->V += f * V;
          s->M += f * M;
          s->theta += f * theta;
          s->v += f * v;
        }
    }

  for (guint i = 0; i < first->n_reactions; i++)
    {
      TrbReaction *rr = &res->reactions[i];

      rr->x = first->reactions[i].x;
      rr->force = 0;
      rr->moment = 0;
      for (guint r = 0; r < n_results; r++)
        {
          if (factors[r] == 0)
            continue;
          rr->force += factors[r] * results[r]->reactions[i].force;
          rr->moment += factors[r] * results[r]->reactions[i].moment;
        }
    }

  return res;
}

/**
 * trb_beam_result_bound:
 * @result: a result
 *
 * A bound on the size of every value of the result at every point of the member (V, M,
 * theta, the deflection, the reactions) and of the coefficients of its polynomials: on each
 * segment the sum of the absolute values of the terms of each polynomial at the segment's
 * length (or 1 m, if longer). Sums of results are bounded by the sums of their bounds.
 *
 * Returns: the bound; inf when something is not finite
 */
double
trb_beam_result_bound (const TrbBeamResult *result)
{
  double bound = 0, inv_EI;

  g_return_val_if_fail (result != NULL, INFINITY);

  inv_EI = fabs (result->inv_EI);
  for (guint i = 0; i < result->n_reactions; i++)
    bound = MAX (bound, MAX (fabs (result->reactions[i].force),
                             fabs (result->reactions[i].moment)));
  for (guint k = 0; k + 1 < result->n_breaks; k++)
    {
      const TrbSegment *s = &result->segments[k];
      double h = MAX (result->breaks[k + 1] - result->breaks[k], 1.0);
      double w = fabs (s->w), dw = fabs (s->dw), V = fabs (s->V), M = fabs (s->M);
      double loads_V = w * h + dw * h * h;
      double b_V = V + loads_V;
      double b_M = M + h * b_V;
      double b_theta = fabs (s->theta) + h * b_M * inv_EI;
      double b_v = fabs (s->v) + h * b_theta;

      bound = MAX (bound, MAX (MAX (b_V, b_M), MAX (b_theta, b_v)));
    }
  return isfinite (bound) ? bound : INFINITY;
}

/* ---- many combinations of the same results ---- */

/* The state of one part at one break of the union: what trb_beam_result_combine() takes
 * from it there, before the factor. */
typedef struct
{
  double w;      /* ss->w + ss->dw t */
  double dw;
  double V, M, theta, v;
} PartState;

struct _TrbBeamCombiner
{
  guint                 n_parts;
  TrbBeamResult       **parts;    /* not owned */
  guint                 n_u;      /* the union of every part's breaks, sorted */
  double               *u;
  guint                 words;    /* of each part's bit set over the union */
  guint64              *mask;     /* n_parts * words: which breaks of the union are its own */
  PartState            *state;    /* n_parts * n_u */
};

/**
 * trb_beam_combiner_new:
 * @parts: (array length=n_parts): results of one beam, not copied: they must outlive the
 *   combiner
 * @n_parts: their number, at least one
 *
 * Prepares many combinations of the same results: every part's state at every break of any
 * part is found once, where trb_beam_result_combine() would find it again for each
 * combination.
 *
 * Returns: (transfer full): the combiner; free with trb_beam_combiner_free()
 */
TrbBeamCombiner *
trb_beam_combiner_new (TrbBeamResult **parts,
                       guint           n_parts)
{
  TrbBeamCombiner *c;
  guint total = 0, n = 0;

  g_return_val_if_fail (parts != NULL && n_parts > 0, NULL);

  c = g_new0 (TrbBeamCombiner, 1);
  c->n_parts = n_parts;
  c->parts = g_memdup2 (parts, n_parts * sizeof *parts);
  for (guint r = 0; r < n_parts; r++)
    total += parts[r]->n_breaks;
  c->u = g_new (double, total);
  {
    g_autofree double *tmp = g_new (double, total);

    /* the union of sorted lists, merged one into the next without repeats */
    for (guint r = 0; r < n_parts; r++)
      {
        const double *b = parts[r]->breaks;
        guint nb = parts[r]->n_breaks, i = 0, j = 0, m = 0;

        while (i < n || j < nb)
          {
            double x;

            if (j == nb || (i < n && c->u[i] < b[j]))
              x = c->u[i++];
            else if (i == n || b[j] < c->u[i])
              x = b[j++];
            else
              {
                x = b[j++];
                i++;
              }
            tmp[m++] = x;
          }
        memcpy (c->u, tmp, m * sizeof (double));
        n = m;
      }
  }
  c->n_u = n;
  c->words = (n + 63) / 64;
  c->mask = g_new0 (guint64, (gsize) n_parts * c->words);
  c->state = g_new (PartState, (gsize) n_parts * n);

  for (guint r = 0; r < n_parts; r++)
    {
      const TrbBeamResult *src = parts[r];
      guint64 *mask = c->mask + (gsize) r * c->words;
      PartState *st = c->state + (gsize) r * n;
      guint cur = 0, own = 0;

      for (guint j = 0; j < n; j++)
        {
          double x = c->u[j];
          const TrbSegment *ss;
          double t;

          if (own < src->n_breaks && src->breaks[own] == x)
            {
              mask[j / 64] |= G_GUINT64_CONSTANT (1) << (j % 64);
              own++;
            }
          /* as trb_beam_result_combine() moves its cursor */
          while (cur + 2 < src->n_breaks && src->breaks[cur + 1] <= x)
            cur++;
          ss = &src->segments[cur];
          t = x - src->breaks[cur];
          if (t == 0)
            {
              st[j].V = ss->V;
              st[j].M = ss->M;
              st[j].theta = ss->theta;
              st[j].v = ss->v;
            }
          else
            segment_advance (ss, t, src->inv_EI, &st[j].V, &st[j].M, &st[j].theta, &st[j].v);
          st[j].w = ss->w + ss->dw * t;
          st[j].dw = ss->dw;
        }
    }
  return c;
}

void
trb_beam_combiner_free (TrbBeamCombiner *combiner)
{
  if (combiner == NULL)
    return;
  g_free (combiner->parts);
  g_free (combiner->u);
  g_free (combiner->mask);
  g_free (combiner->state);
  g_free (combiner);
}

/**
 * trb_beam_combiner_combine:
 * @combiner: a combiner
 * @index: (array length=n): which of its parts
 * @factors: (array length=n): their factors
 * @n: their number, at least one
 *
 * Bit for bit trb_beam_result_combine() of the parts named by @index with @factors.
 *
 * Returns: (transfer full): the combined result
 */
TrbBeamResult *
trb_beam_combiner_combine (const TrbBeamCombiner *combiner,
                           const guint           *index,
                           const double          *factors,
                           guint                  n)
{
  guint64 set_stack[8];
  g_autofree guint64 *set_heap = NULL;
  guint64 *set;
  guint sel_stack[1024];
  g_autofree guint *sel_heap = NULL;
  guint *sel;
  const TrbBeamResult *first;
  TrbBeamResult *res;
  guint nb = 0, words;

  g_return_val_if_fail (combiner != NULL && index != NULL && factors != NULL && n > 0, NULL);

  words = combiner->words;
  set = words <= G_N_ELEMENTS (set_stack) ? set_stack : (set_heap = g_new (guint64, words));
  sel = combiner->n_u <= G_N_ELEMENTS (sel_stack) ? sel_stack
                                                  : (sel_heap = g_new (guint, combiner->n_u));
  memset (set, 0, words * sizeof (guint64));
  first = combiner->parts[index[0]];
  for (guint r = 0; r < n; r++)
    {
      const guint64 *mask = combiner->mask + (gsize) index[r] * words;

      g_return_val_if_fail (index[r] < combiner->n_parts, NULL);
      if (factors[r] == 0)
        continue;
      for (guint w = 0; w < words; w++)
        set[w] |= mask[w];
    }
  for (guint w = 0; w < words; w++)
    for (guint64 bits = set[w]; bits != 0; bits &= bits - 1)
      sel[nb++] = w * 64 + (guint) __builtin_ctzll (bits);

  if (nb < 2)
    {
      /* every factor is zero: a zero result on the breaks of the first */
      res = result_alloc (first->length, first->EI, first->n_breaks, first->n_reactions, 0);
      memcpy (res->breaks, first->breaks, first->n_breaks * sizeof (double));
      for (guint k = 0; k + 1 < first->n_breaks; k++)
        {
          memset (&res->segments[k], 0, sizeof (TrbSegment));
          res->segments[k].x = first->breaks[k];
        }
    }
  else
    {
      res = result_alloc (first->length, first->EI, nb, first->n_reactions, 0);
      for (guint k = 0; k < nb; k++)
        res->breaks[k] = combiner->u[sel[k]];
      for (guint k = 0; k + 1 < nb; k++)
        {
          TrbSegment *s = &res->segments[k];
          guint j = sel[k];

          memset (s, 0, sizeof *s);
          s->x = res->breaks[k];
          for (guint r = 0; r < n; r++)
            {
              const PartState *st;
              double f = factors[r];

              if (f == 0)
                continue;
              st = &combiner->state[(gsize) index[r] * combiner->n_u + j];
              s->w += f * st->w;
              s->dw += f * st->dw;
              s->V += f * st->V;
              s->M += f * st->M;
              s->theta += f * st->theta;
              s->v += f * st->v;
            }
        }
    }

  for (guint i = 0; i < first->n_reactions; i++)
    {
      TrbReaction *rr = &res->reactions[i];

      rr->x = first->reactions[i].x;
      rr->force = 0;
      rr->moment = 0;
      for (guint r = 0; r < n; r++)
        {
          const TrbBeamResult *src = combiner->parts[index[r]];

          if (factors[r] == 0)
            continue;
          rr->force += factors[r] * src->reactions[i].force;
          rr->moment += factors[r] * src->reactions[i].moment;
        }
    }
  return res;
}

TrbBeamResult *
trb_beam_result_copy (const TrbBeamResult *result)
{
  TrbBeamResult *copy;

  g_return_val_if_fail (result != NULL, NULL);

  copy = g_memdup2 (result, result->size);
  result_set_pointers (copy);
  return copy;
}

void
trb_beam_result_free (TrbBeamResult *result)
{
  g_free (result);
}

const TrbReaction *
trb_beam_result_get_reactions (const TrbBeamResult *result,
                               guint               *n_reactions)
{
  g_return_val_if_fail (result != NULL, NULL);

  if (n_reactions != NULL)
    *n_reactions = result->n_reactions;
  return result->reactions;
}

double
trb_beam_result_get_length (const TrbBeamResult *result)
{
  g_return_val_if_fail (result != NULL, 0);

  return result->length;
}

const double *
trb_beam_result_get_breaks (const TrbBeamResult *result,
                            guint               *n_breaks)
{
  g_return_val_if_fail (result != NULL, NULL);

  if (n_breaks != NULL)
    *n_breaks = result->n_breaks;
  return result->breaks;
}

/* A segment's four polynomials in the power basis of t, computed once per segment so that
 * each point costs 14 multiply-adds (Horner). defl is the downward deflection. */
typedef struct
{
  double V[3];
  double M[4];
  double theta[5];
  double defl[6];
} SegCoeffs;

static inline void
segment_coeffs (const TrbSegment *s,
                double            inv_EI,
                SegCoeffs        *c)
{
  c->V[0] = s->V;
  c->V[1] = -s->w;
  c->V[2] = -s->dw * C2;
  c->M[0] = s->M;
  c->M[1] = s->V;
  c->M[2] = -s->w * C2;
  c->M[3] = -s->dw * C6;
  c->theta[0] = s->theta;
  c->theta[1] = s->M * inv_EI;
  c->theta[2] = s->V * C2 * inv_EI;
  c->theta[3] = -s->w * C6 * inv_EI;
  c->theta[4] = -s->dw * C24 * inv_EI;
  c->defl[0] = -s->v;
  c->defl[1] = -s->theta;
  c->defl[2] = -s->M * C2 * inv_EI;
  c->defl[3] = -s->V * C6 * inv_EI;
  c->defl[4] = s->w * C24 * inv_EI;
  c->defl[5] = s->dw * C120 * inv_EI;
}

static inline double
coeffs_V (const SegCoeffs *c,
          double           t)
{
  return c->V[0] + t * (c->V[1] + t * c->V[2]);
}

static inline double
coeffs_M (const SegCoeffs *c,
          double           t)
{
  return c->M[0] + t * (c->M[1] + t * (c->M[2] + t * c->M[3]));
}

static inline double
coeffs_theta (const SegCoeffs *c,
              double           t)
{
  return c->theta[0] + t * (c->theta[1] + t * (c->theta[2] + t * (c->theta[3] +
                                                                  t * c->theta[4])));
}

static inline double
coeffs_defl (const SegCoeffs *c,
             double           t)
{
  return c->defl[0] + t * (c->defl[1] + t * (c->defl[2] + t * (c->defl[3] +
                                                              t * (c->defl[4] + t * c->defl[5]))));
}

static inline void
coeffs_eval (const SegCoeffs *c,
             double           t,
             TrbBeamValues   *out)
{
  out->V = coeffs_V (c, t);
  out->M = coeffs_M (c, t);
  out->theta = coeffs_theta (c, t);
  out->defl = coeffs_defl (c, t);
}

static inline double
coeffs_value (const SegCoeffs *c,
              double           t,
              TrbBeamQuantity  what)
{
  switch (what)
    {
    case TRB_BEAM_V:
      return coeffs_V (c, t);
    case TRB_BEAM_M:
      return coeffs_M (c, t);
    case TRB_BEAM_THETA:
      return coeffs_theta (c, t);
    case TRB_BEAM_DEFL:
    default:
      return coeffs_defl (c, t);
    }
}

/**
 * trb_beam_result_value:
 * @result: a result
 * @x: the position (clamped to [0, L] as trb_beam_result_eval() does)
 * @what: the field
 * @left: (out) (optional): the field of trb_beam_result_eval() at @x from the left
 * @right: (out) (optional): and from the right
 *
 * The same operations as trb_beam_result_eval() on the one field asked for (the compiler
 * drops the coefficients it does not read), so the same bits; where both sides fall in one
 * segment it is evaluated once. The sizing bounds and the Cb of every segment read one field
 * at many points.
 */
void
trb_beam_result_value (const TrbBeamResult *result,
                       double               x,
                       TrbBeamQuantity      what,
                       double              *left,
                       double              *right)
{
  SegCoeffs c;
  guint kl = 0, kr = 0;

  g_return_if_fail (result != NULL);

  if (!(x > 0))
    x = 0;
  if (x > result->length)
    x = result->length;

  if (right != NULL)
    {
      kr = find_segment (result, x, TRB_SIDE_RIGHT);
      segment_coeffs (&result->segments[kr], result->inv_EI, &c);
      *right = coeffs_value (&c, x - result->breaks[kr], what);
    }
  if (left != NULL)
    {
      /* the left side's segment is the right side's, or the one before where x is its break
       * (the breaks are distinct; at 0 both are the first) */
      if (right != NULL)
        kl = kr > 0 && result->breaks[kr] == x ? kr - 1 : kr;
      else
        kl = find_segment (result, x, TRB_SIDE_LEFT);
      if (right != NULL && kl == kr)
        *left = *right;
      else
        {
          segment_coeffs (&result->segments[kl], result->inv_EI, &c);
          *left = coeffs_value (&c, x - result->breaks[kl], what);
        }
    }

  /* beyond the ends no force passes, as trb_beam_result_eval() says */
  if (what == TRB_BEAM_V || what == TRB_BEAM_M)
    {
      if (left != NULL && x == 0)
        *left = 0;
      if (right != NULL && x == result->length)
        *right = 0;
    }
}

void
trb_beam_result_eval (const TrbBeamResult *result,
                      double               x,
                      TrbSide              side,
                      TrbBeamValues       *out)
{
  SegCoeffs c;
  guint k;

  g_return_if_fail (result != NULL);
  g_return_if_fail (out != NULL);

  if (!(x > 0))
    x = 0;
  if (x > result->length)
    x = result->length;

  k = find_segment (result, x, side);
  segment_coeffs (&result->segments[k], result->inv_EI, &c);
  coeffs_eval (&c, x - result->breaks[k], out);

  /* beyond the ends no force passes: V and M are zero there, theta and v continue */
  if ((x == 0 && side == TRB_SIDE_LEFT) || (x == result->length && side == TRB_SIDE_RIGHT))
    {
      out->V = 0;
      out->M = 0;
    }
}

void
trb_beam_result_sample (const TrbBeamResult *result,
                        guint                n,
                        double              *x,
                        TrbBeamValues       *values)
{
  SegCoeffs c;
  guint k = 0;
  double L;

  g_return_if_fail (result != NULL);
  g_return_if_fail (n >= 2);
  g_return_if_fail (x != NULL && values != NULL);

  L = result->length;
  segment_coeffs (&result->segments[0], result->inv_EI, &c);
  for (guint i = 0; i < n; i++)
    {
      /* L i / (n - 1) in this order is exact whenever the point is representable */
      double xi = i + 1 == n ? L : (L * (double) i) / (double) (n - 1);

      /* the right value at a jump; at L the left one, the only one on the member (the last
       * segment ends at L, so it is never passed) */
      if (k + 2 < result->n_breaks && result->breaks[k + 1] <= xi)
        {
          do
            k++;
          while (k + 2 < result->n_breaks && result->breaks[k + 1] <= xi);
          segment_coeffs (&result->segments[k], result->inv_EI, &c);
        }
      x[i] = xi;
      coeffs_eval (&c, xi - result->breaks[k], &values[i]);
    }
}

/* ---- extremes ---- */

typedef struct
{
  TrbBeamExtremes e;
  double          down;  /* the largest downward deflection seen, may be negative */
  double          down_x;
  double          up;    /* the largest upward deflection seen, may be negative */
  double          up_x;
} ExtremeAcc;

static inline void
acc_V (ExtremeAcc *acc,
       double      V,
       double      x)
{
  if (V > acc->e.V_max)
    {
      acc->e.V_max = V;
      acc->e.V_max_x = x;
    }
  if (V < acc->e.V_min)
    {
      acc->e.V_min = V;
      acc->e.V_min_x = x;
    }
}

static inline void
acc_M (ExtremeAcc *acc,
       double      M,
       double      x)
{
  if (M > acc->e.M_max)
    {
      acc->e.M_max = M;
      acc->e.M_max_x = x;
    }
  if (M < acc->e.M_min)
    {
      acc->e.M_min = M;
      acc->e.M_min_x = x;
    }
}

static inline void
acc_defl (ExtremeAcc *acc,
          double      defl,
          double      x)
{
  if (defl > acc->down)
    {
      acc->down = defl;
      acc->down_x = x;
    }
  if (-defl > acc->up)
    {
      acc->up = -defl;
      acc->up_x = x;
    }
}

static inline void
acc_values (ExtremeAcc          *acc,
            const TrbBeamValues *val,
            double               x)
{
  acc_V (acc, val->V, x);
  acc_M (acc, val->M, x);
  acc_defl (acc, val->defl, x);
}

/* the roots of c0 + c1 t + c2 t^2 strictly inside (lo, hi), sorted; returns their number */
static guint
quadratic_roots (double c0,
                 double c1,
                 double c2,
                 double lo,
                 double hi,
                 double roots[2])
{
  double r[2];
  guint n = 0, k = 0;

  if (c2 == 0)
    {
      if (c1 != 0)
        r[n++] = -c0 / c1;
    }
  else
    {
      double disc = c1 * c1 - 4.0 * c2 * c0;

      if (disc >= 0)
        {
          /* the form without cancellation */
          double q = -0.5 * (c1 + copysign (sqrt (disc), c1));

          r[n++] = q / c2;
          if (q != 0)
            r[n++] = c0 / q;
        }
    }
  if (n == 2 && r[0] > r[1])
    {
      double t = r[0];
      r[0] = r[1];
      r[1] = t;
    }
  for (guint i = 0; i < n; i++)
    if (r[i] > lo && r[i] < hi && (k == 0 || r[i] > roots[k - 1]))
      roots[k++] = r[i];
  return k;
}

/* A function of the local coordinate and its derivative, for root finding. */
typedef double (*SegFunc) (const SegCoeffs *c,
                           double           t);

/* the derivative of theta, M / EI, from theta's own coefficients */
static inline double
coeffs_M_over_EI (const SegCoeffs *c,
                  double           t)
{
  return c->theta[1] + t * (2.0 * c->theta[2] + t * (3.0 * c->theta[3] + t * 4.0 * c->theta[4]));
}

/* The root of a monotone f on [lo, hi] with f(lo), f(hi) of strictly opposite signs:
 * Newton steps from the secant point, kept inside the shrinking bracket; a bisection instead
 * whenever a step would leave the bracket or is not at least halving the previous one, so
 * convergence is guaranteed and quadratic near the root. Stops when a step is below the
 * resolution of x (scale is the size of the global coordinate). */
static double
bracketed_root (SegFunc          f,
                SegFunc          df,
                const SegCoeffs *c,
                double           lo,
                double           hi,
                double           flo,
                double           fhi,
                double           scale)
{
  double tol = 2.0 * DBL_EPSILON * scale;
  double dx_old = hi - lo, dx = dx_old;
  double t, ft, dft;

  /* orient so that f(lo) < 0 < f(hi) */
  if (flo > 0)
    {
      double tmp = lo;
      lo = hi;
      hi = tmp;
      tmp = flo;
      flo = fhi;
      fhi = tmp;
    }
  t = lo - flo * (hi - lo) / (fhi - flo);
  if (!(t > MIN (lo, hi) && t < MAX (lo, hi)))
    t = 0.5 * (lo + hi);
  ft = f (c, t);
  dft = df (c, t);

  for (int it = 0; it < 200; it++)
    {
      if (ft == 0)
        return t;
      if (ft < 0)
        lo = t;
      else
        hi = t;

      if ((((t - hi) * dft - ft) * ((t - lo) * dft - ft) > 0) ||
          fabs (2.0 * ft) > fabs (dx_old * dft))
        {
          dx_old = dx;
          dx = 0.5 * (hi - lo);
          t = lo + dx;
        }
      else
        {
          dx_old = dx;
          dx = ft / dft;
          t -= dx;
        }
      if (fabs (dx) <= tol)
        return t;
      ft = f (c, t);
      dft = df (c, t);
    }
  return t;
}

/* The values of one piece [xs, xe] of segment k, as the extremes read them: at its start the
 * stored state (or the polynomials where the piece starts inside the segment), at its end V
 * and M from the polynomials and theta and the deflection from the next segment's stored
 * state (they are continuous; v is exactly 0 at a support), or the polynomials where the
 * piece ends inside the segment or at the member's end. */
typedef struct
{
  double xs, xe, t0, t1;
  double V0, M0, th0, d0;
  double V1, M1, th1, d1;
} Piece;

/* The piece of segment k inside [a, b]; FALSE when it has no length. */
static inline gboolean
piece_values (const TrbBeamResult *result,
              guint                k,
              double               a,
              double               b,
              Piece               *p)
{
  const TrbSegment *s = &result->segments[k];
  guint last = result->n_breaks - 2;
  double x0 = result->breaks[k], x1 = result->breaks[k + 1];

  p->xs = MAX (a, x0);
  p->xe = MIN (b, x1);
  p->t0 = p->xs - x0;
  p->t1 = p->xe - x0;
  if (!(p->t1 > p->t0))
    return FALSE;

  if (p->t0 == 0)
    {
      p->V0 = s->V;
      p->M0 = s->M;
      p->th0 = s->theta;
      p->d0 = -s->v;
    }
  else
    {
      SegCoeffs c;

      segment_coeffs (s, result->inv_EI, &c);
      p->V0 = coeffs_V (&c, p->t0);
      p->M0 = coeffs_M (&c, p->t0);
      p->th0 = coeffs_theta (&c, p->t0);
      p->d0 = coeffs_defl (&c, p->t0);
    }
  p->V1 = s->V - p->t1 * (s->w + p->t1 * s->dw * C2);
  p->M1 = s->M + p->t1 * (s->V - p->t1 * (s->w * C2 + p->t1 * s->dw * C6));
  if (p->xe == x1 && k < last)
    {
      p->th1 = s[1].theta;
      p->d1 = -s[1].v;
    }
  else
    {
      SegCoeffs c;

      segment_coeffs (s, result->inv_EI, &c);
      p->th1 = coeffs_theta (&c, p->t1);
      p->d1 = coeffs_defl (&c, p->t1);
    }
  return TRUE;
}

/* The values at a piece's ends, in the order the extremes have always taken them (ties keep
 * the first). */
static inline void
piece_feed (ExtremeAcc  *acc,
            const Piece *p)
{
  acc_V (acc, p->V0, p->xs);
  acc_M (acc, p->M0, p->xs);
  acc_defl (acc, p->d0, p->xs);
  acc_V (acc, p->V1, p->xe);
  acc_M (acc, p->M1, p->xe);
  acc_defl (acc, p->d1, p->xe);
}

/* One piece [t0, t1] of a segment, t0 < t1, whose end values the caller has counted (V0, M0,
 * th0 at t0; V1, M1, th1 at t1). Looks for the extremes inside it. What it finds depends on
 * the piece alone, so it goes to acc and, when acc2 is not NULL, to acc2 as well (a piece
 * that two intervals share). */
static inline G_ALWAYS_INLINE void
piece_extremes (const TrbSegment *s,
                double            x0,
                const Piece      *p,
                double            inv_EI,
                ExtremeAcc       *acc,
                ExtremeAcc       *acc2,
                gboolean          deflection)
{
  double t0 = p->t0, t1 = p->t1;
  double V0 = p->V0, V1 = p->V1, M0 = p->M0, M1 = p->M1, th0 = p->th0, th1 = p->th1;
  double vroots[2], cuts[4], mcut[4], mroots[3], mcuts[5];
  double scale = fabs (x0) + t1;
  double max_M = 0;
  gboolean m_changes = FALSE;
  guint nv, nc, nm = 0, nmc;
  SegCoeffs c;

  /* V: its extreme where the intensity w + dw t changes sign */
  if (s->dw != 0)
    {
      double t = -s->w / s->dw;

      if (t > t0 && t < t1)
        {
          double V = s->V - t * (s->w + t * s->dw * C2);

          acc_V (acc, V, x0 + t);
          if (acc2 != NULL)
            acc_V (acc2, V, x0 + t);
        }
    }

  /* M: extremes at the roots of V, in closed form; with no slope of the load V is linear
   * and has a root only where it changes sign */
  if (s->dw == 0)
    {
      nv = 0;
      if (((V0 < 0 && V1 > 0) || (V0 > 0 && V1 < 0)) && s->w != 0)
        {
          double t = s->V / s->w;

          if (t > t0 && t < t1)
            vroots[nv++] = t;
        }
    }
  else
    nv = quadratic_roots (s->V, -s->w, -s->dw * C2, t0, t1, vroots);
  /* M at the cuts (the ends and the roots of V): between them M is monotone, so these give
   * its exact range over the piece and every sign change */
  nc = 0;
  cuts[nc] = t0;
  mcut[nc++] = M0;
  for (guint i = 0; i < nv; i++)
    {
      double t = vroots[i];

      cuts[nc] = t;
      mcut[nc] = s->M + t * (s->V - t * (s->w * C2 + t * s->dw * C6));
      acc_M (acc, mcut[nc], x0 + t);
      if (acc2 != NULL)
        acc_M (acc2, mcut[nc], x0 + t);
      nc++;
    }
  cuts[nc] = t1;
  mcut[nc++] = M1;
  for (guint i = 0; i < nc; i++)
    {
      max_M = MAX (max_M, fabs (mcut[i]));
      if (i > 0 && ((mcut[i - 1] < 0 && mcut[i] > 0) || (mcut[i - 1] > 0 && mcut[i] < 0)))
        m_changes = TRUE;
    }

  if (!deflection)
    return;

  /* deflection: extremes at the roots of theta, a quartic. Between consecutive roots of M,
   * theta is monotone and has at most one root, so the roots of M (one at most between
   * consecutive cuts above) split the piece into brackets; each root is polished to machine
   * precision.
   * Most pieces are nowhere near a root of theta, and the search is skipped where theta
   * keeps its sign at both ends and either is monotone (M keeps its sign) or cannot travel
   * back to zero (|theta(t) - theta(t0)| <= (t1 - t0) max |M| / EI). */
  if ((th0 > 0 && th1 > 0) || (th0 < 0 && th1 < 0))
    {
      if (!m_changes || MIN (fabs (th0), fabs (th1)) > (t1 - t0) * max_M * inv_EI * (1 + 1e-9))
        return;
    }

  segment_coeffs (s, inv_EI, &c);
  for (guint i = 0; i + 1 < nc; i++)
    {
      double ma = mcut[i], mb = mcut[i + 1];

      if ((ma < 0 && mb > 0) || (ma > 0 && mb < 0))
        mroots[nm++] = bracketed_root (coeffs_M, coeffs_V, &c, cuts[i], cuts[i + 1], ma, mb,
                                       scale);
    }
  nmc = 0;
  mcuts[nmc++] = t0;
  for (guint i = 0; i < nm; i++)
    mcuts[nmc++] = mroots[i];
  mcuts[nmc++] = t1;
  for (guint i = 0; i + 1 < nmc; i++)
    {
      double ta = mcuts[i], tb = mcuts[i + 1];
      double fa = i == 0 ? th0 : coeffs_theta (&c, ta);
      double fb = i + 2 == nmc ? th1 : coeffs_theta (&c, tb);

      if ((fa < 0 && fb > 0) || (fa > 0 && fb < 0))
        {
          double t = bracketed_root (coeffs_theta, coeffs_M_over_EI, &c, ta, tb, fa, fb, scale);
          double d = coeffs_defl (&c, t);

          acc_defl (acc, d, x0 + t);
          if (acc2 != NULL)
            acc_defl (acc2, d, x0 + t);
        }
    }
}

/* Starts the search over [a, b] with the value just inside a. */
static void
acc_seed (const TrbBeamResult *result,
          double               a,
          ExtremeAcc          *acc)
{
  TrbBeamValues val;
  double L = result->length;

  trb_beam_result_eval (result, a, a < L ? TRB_SIDE_RIGHT : TRB_SIDE_LEFT, &val);
  acc->e.V_max = acc->e.V_min = val.V;
  acc->e.V_max_x = acc->e.V_min_x = a;
  acc->e.M_max = acc->e.M_min = val.M;
  acc->e.M_max_x = acc->e.M_min_x = a;
  acc->down = val.defl;
  acc->up = -val.defl;
  acc->down_x = acc->up_x = a;
}

/* Deflection extremes are magnitudes; none is 0 at the start of the interval. */
static void
acc_finish (const ExtremeAcc *acc,
            double            a,
            TrbBeamExtremes  *out)
{
  *out = acc->e;
  if (acc->down > 0)
    {
      out->defl_down = acc->down;
      out->defl_down_x = acc->down_x;
    }
  else
    {
      out->defl_down = 0;
      out->defl_down_x = a;
    }
  if (acc->up > 0)
    {
      out->defl_up = acc->up;
      out->defl_up_x = acc->up_x;
    }
  else
    {
      out->defl_up = 0;
      out->defl_up_x = a;
    }
}

void
trb_beam_result_extremes (const TrbBeamResult *result,
                          double               a,
                          double               b,
                          TrbBeamExtremes     *out)
{
  ExtremeAcc acc;
  TrbBeamValues val;
  double L;
  guint k;

  g_return_if_fail (result != NULL);
  g_return_if_fail (out != NULL);

  L = result->length;
  a = isnan (a) ? 0 : CLAMP (a, 0.0, L);
  b = isnan (b) ? L : CLAMP (b, 0.0, L);
  if (b < a)
    b = a;

  /* seed with the value just inside a */
  acc_seed (result, a, &acc);

  if (a == b)
    {
      /* a single point: both sides of it, where they are on the member */
      if (a > 0 && a < L)
        {
          trb_beam_result_eval (result, a, TRB_SIDE_LEFT, &val);
          acc_values (&acc, &val, a);
        }
    }
  else
    {
      guint last = result->n_breaks - 2;

      for (k = find_segment (result, a, TRB_SIDE_RIGHT); k <= last && result->breaks[k] < b; k++)
        {
          Piece p;

          if (!piece_values (result, k, a, b, &p))
            continue;
          piece_feed (&acc, &p);
          piece_extremes (&result->segments[k], result->breaks[k], &p, result->inv_EI, &acc,
                          NULL, TRUE);
        }
    }

  acc_finish (&acc, a, out);
}

/* V, M, theta and the deflection at t, all finite */
static inline gboolean
segment_finite_at (const SegCoeffs *c,
                   double           t)
{
  return isfinite (coeffs_V (c, t)) && isfinite (coeffs_M (c, t)) &&
         isfinite (coeffs_theta (c, t)) && isfinite (coeffs_defl (c, t));
}

/* The same at t = 0, where each polynomial is finite exactly when all its coefficients are
 * (0 times inf or NaN is NaN, and NaN stays): x * 0 is 0 for a finite x, NaN for any other. */
static inline gboolean
segment_finite_at_start (const SegCoeffs *c)
{
  double z = 0;

  for (guint i = 0; i < 3; i++)
    z += c->V[i] * 0.0;
  for (guint i = 0; i < 4; i++)
    z += c->M[i] * 0.0;
  for (guint i = 0; i < 5; i++)
    z += c->theta[i] * 0.0;
  for (guint i = 0; i < 6; i++)
    z += c->defl[i] * 0.0;
  return z == 0;
}

/* acc_seed() at a, in segment k (the one trb_beam_result_eval() finds for a, a < L), from
 * its coefficients */
static inline void
acc_seed_in (const TrbBeamResult *result,
             const SegCoeffs     *c,
             guint                k,
             double               a,
             ExtremeAcc          *acc)
{
  TrbBeamValues val;

  coeffs_eval (c, a - result->breaks[k], &val);
  acc->e.V_max = acc->e.V_min = val.V;
  acc->e.V_max_x = acc->e.V_min_x = a;
  acc->e.M_max = acc->e.M_min = val.M;
  acc->e.M_max_x = acc->e.M_min_x = a;
  acc->down = val.defl;
  acc->up = -val.defl;
  acc->down_x = acc->up_x = a;
}

/* The sweep of trb_beam_result_extremes_intervals(); without deflection, V and M only. */
static void
extremes_intervals (const TrbBeamResult *result,
                    const double        *ab,
                    guint                n_intervals,
                    TrbBeamExtremes     *whole,
                    TrbBeamExtremes     *per,
                    gboolean            *finite,
                    gboolean             deflection)
{
  ExtremeAcc acc_stack[16];
  gboolean seeded_stack[16];
  g_autofree ExtremeAcc *acc_heap = NULL;
  g_autofree gboolean *seeded_heap = NULL;
  ExtremeAcc *acc_iv;
  gboolean *seeded;
  ExtremeAcc acc = { { 0 } };
  guint last, first_iv = 0;
  gboolean ok = TRUE;

  g_return_if_fail (result != NULL);
  g_return_if_fail (ab != NULL || n_intervals == 0);

  if (per == NULL)
    n_intervals = 0;
  last = result->n_breaks - 2;
  if (n_intervals <= G_N_ELEMENTS (acc_stack))
    {
      acc_iv = acc_stack;
      seeded = seeded_stack;
    }
  else
    {
      acc_iv = acc_heap = g_new (ExtremeAcc, n_intervals);
      seeded = seeded_heap = g_new (gboolean, n_intervals);
    }
  for (guint i = 0; i < n_intervals; i++)
    {
      g_return_if_fail (ab[2 * i] < ab[2 * i + 1] && ab[2 * i] >= 0 &&
                        ab[2 * i + 1] <= result->length &&
                        (i == 0 || ab[2 * i] >= ab[2 * i - 1]));
      seeded[i] = FALSE;
    }

  if (finite != NULL)
    for (guint i = 0; i < result->n_reactions; i++)
      if (!isfinite (result->reactions[i].force) || !isfinite (result->reactions[i].moment))
        ok = FALSE;

  for (guint k = 0; k <= last; k++)
    {
      const TrbSegment *s = &result->segments[k];
      double x0 = result->breaks[k], x1 = result->breaks[k + 1];
      ExtremeAcc *shared = NULL;
      gboolean need_full = whole != NULL;
      gboolean have_c = FALSE;
      SegCoeffs c = { { 0 } };
      Piece full = { 0 };

      /* the coefficients, where something reads them */
#define NEED_COEFFS() G_STMT_START { \
        if (!have_c) \
          { \
            segment_coeffs (s, result->inv_EI, &c); \
            have_c = TRUE; \
          } \
      } G_STMT_END
      if (finite != NULL && ok)
        {
          NEED_COEFFS ();
          ok = segment_finite_at_start (&c) && segment_finite_at (&c, x1 - x0);
        }
      if (k == 0 && whole != NULL)
        {
          NEED_COEFFS ();
          acc_seed_in (result, &c, 0, 0, &acc);
        }

      /* the intervals that reach into this segment, as trb_beam_result_extremes() walks
       * each: from the segment that holds a, while the segment starts before b */
      while (first_iv < n_intervals && ab[2 * first_iv + 1] <= x0)
        first_iv++;
      for (guint i = first_iv; i < n_intervals; i++)
        {
          double a = ab[2 * i], b = ab[2 * i + 1];

          if (a >= x1 && k != last)
            break;
          if (!(x0 < b))
            continue;
          if (!seeded[i])
            {
              NEED_COEFFS ();
              acc_seed_in (result, &c, k, a, &acc_iv[i]);
              seeded[i] = TRUE;
            }
          if (a <= x0 && b >= x1)
            need_full = TRUE;
        }

      if (need_full)
        {
          /* piece_values (result, k, 0, L): the segment whole */
          full.xs = x0;
          full.xe = x1;
          full.t0 = 0;
          full.t1 = x1 - x0;
          full.V0 = s->V;
          full.M0 = s->M;
          full.th0 = s->theta;
          full.d0 = -s->v;
          full.V1 = s->V - full.t1 * (s->w + full.t1 * s->dw * C2);
          full.M1 = s->M + full.t1 * (s->V - full.t1 * (s->w * C2 + full.t1 * s->dw * C6));
          if (k < last)
            {
              full.th1 = s[1].theta;
              full.d1 = -s[1].v;
            }
          else
            {
              NEED_COEFFS ();
              full.th1 = coeffs_theta (&c, full.t1);
              full.d1 = coeffs_defl (&c, full.t1);
            }
        }
#undef NEED_COEFFS

      for (guint i = first_iv; i < n_intervals; i++)
        {
          double a = ab[2 * i], b = ab[2 * i + 1];
          Piece p;

          if (a >= x1 && k != last)
            break;
          if (!(x0 < b))
            continue;
          if (a <= x0 && b >= x1)
            {
              /* the whole segment: the same piece as the member's, searched once below */
              shared = &acc_iv[i];
              piece_feed (shared, &full);
              continue;
            }
          if (!piece_values (result, k, a, b, &p))
            continue;
          piece_feed (&acc_iv[i], &p);
          piece_extremes (s, x0, &p, result->inv_EI, &acc_iv[i], NULL, deflection);
        }

      if (whole != NULL)
        {
          piece_feed (&acc, &full);
          piece_extremes (s, x0, &full, result->inv_EI, &acc, shared, deflection);
        }
      else if (shared != NULL)
        piece_extremes (s, x0, &full, result->inv_EI, shared, NULL, deflection);
    }

  if (whole != NULL)
    acc_finish (&acc, 0, whole);
  for (guint i = 0; i < n_intervals; i++)
    acc_finish (&acc_iv[i], ab[2 * i], &per[i]);
  if (finite != NULL)
    *finite = ok;
}

/**
 * trb_beam_result_extremes_intervals:
 * @result: a result
 * @ab: (array length=n_intervals): pairs a, b of intervals with 0 <= a < b <= L, sorted and
 *   not overlapping (they may leave gaps)
 * @n_intervals: their number
 * @whole: (out) (optional): the extremes over the whole member
 * @per: (out) (array length=n_intervals) (optional): the extremes over each interval
 * @finite: (out) (optional): whether the reactions and the values on both sides of every
 *   break are finite (each value trb_beam_result_eval() gives at a break)
 *
 * Bit for bit what trb_beam_result_extremes() gives over [0, L] and over each interval, and
 * what evaluating every break on both sides would say of finiteness, in one sweep over the
 * segments: a segment an interval takes whole is searched once for both.
 */
void
trb_beam_result_extremes_intervals (const TrbBeamResult *result,
                                    const double        *ab,
                                    guint                n_intervals,
                                    TrbBeamExtremes     *whole,
                                    TrbBeamExtremes     *per,
                                    gboolean            *finite)
{
  extremes_intervals (result, ab, n_intervals, whole, per, finite, TRUE);
}

/**
 * trb_beam_result_moments_intervals:
 * @result: a result
 * @ab: (array length=n_intervals): intervals as trb_beam_result_extremes_intervals() takes
 * @n_intervals: their number
 * @whole: (out) (optional): the extremes of V and M over the whole member
 * @per: (out) (array length=n_intervals) (optional): the same over each interval
 *
 * trb_beam_result_extremes_intervals() for V and M only, bit for bit: the deflection's
 * extremes inside the segments are not searched for, so the deflection fields are not to be
 * read.
 */
void
trb_beam_result_moments_intervals (const TrbBeamResult *result,
                                   const double        *ab,
                                   guint                n_intervals,
                                   TrbBeamExtremes     *whole,
                                   TrbBeamExtremes     *per)
{
  extremes_intervals (result, ab, n_intervals, whole, per, NULL, FALSE);
}
