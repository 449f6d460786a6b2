/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <stdarg.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-design-allowable.h"
#include "trb-design-steel.h"
#include "trb-design-wood.h"
#include "trb-error.h"
#include "trb-section.h"
#include "trb-solve.h"
#include "trb-solve-private.h"
#include "trb-units.h"

/* Weight densities for the self-weight of custom sections given by area: structural steel
 * 490 lb/ft^3 (common practice), and lumber at 35 lb/ft^3, the density the lumber catalog's
 * self-weight column assumes. */
#define STEEL_DENSITY (490.0 * TRB_LBF / (TRB_FT * TRB_FT * TRB_FT))
#define WOOD_DENSITY  (35.0 * TRB_LBF / (TRB_FT * TRB_FT * TRB_FT))

static const char * const status_names[] = {
  "pass", "fail", "unstable", "unsupported", "not-designed", "error",
};

/**
 * trb_status_name:
 * @status: a member status
 *
 * Returns: the status as the CLI and the JSON write it: "pass", "fail", "unstable",
 *   "unsupported", "not-designed", "error".
 */
const char *
trb_status_name (TrbStatus status)
{
  g_return_val_if_fail (status < G_N_ELEMENTS (status_names), NULL);
  return status_names[status];
}

static void
combo_result_clear (gpointer data)
{
  TrbComboResult *c = data;

  g_clear_pointer (&c->result, trb_beam_result_free);
}

static void
combo_set_init (TrbComboSetResult *s,
                TrbComboSet        set)
{
  s->set = set;
  /* not cleared: evaluate_set() writes every field of each entry (half a kilobyte each) */
  s->entries = g_array_new (FALSE, FALSE, sizeof (TrbComboResult));
  g_array_set_clear_func (s->entries, combo_result_clear);
  s->envelope.empty = TRUE;
  trb_extremes_init (&s->envelope.ext);
  s->envelope.V_max_by = s->envelope.V_min_by = "";
  s->envelope.M_max_by = s->envelope.M_min_by = "";
  s->envelope.defl_down_by = s->envelope.defl_up_by = "";
  s->envelope.reactions = g_array_new (FALSE, TRUE, sizeof (TrbReactionRange));
}

/* Shares a set's arrays with another result (a member identical to this one). */
static void
combo_set_share (TrbComboSetResult       *dst,
                 const TrbComboSetResult *src)
{
  *dst = *src;
  if (src->entries != NULL)
    dst->entries = g_array_ref (src->entries);
  if (src->envelope.reactions != NULL)
    dst->envelope.reactions = g_array_ref (src->envelope.reactions);
}

static void
combo_set_clear (TrbComboSetResult *s)
{
  g_clear_pointer (&s->entries, g_array_unref);
  g_clear_pointer (&s->envelope.reactions, g_array_unref);
}

/* The beam and the case results of a result shared by identical members: they are not
 * reference counted themselves, so this box owns them for all the results that read them.
 * Atomic: a solve cache (TrbSolveCache) shares them from a worker thread with results that
 * the editor frees on its own. */
struct _TrbMemberKeep
{
  TrbBeam       *beam;
  TrbBeamResult *cases[TRB_N_CASES];
};

static void
keep_clear (gpointer data)
{
  struct _TrbMemberKeep *keep = data;

  g_clear_pointer (&keep->beam, trb_beam_free);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&keep->cases[c], trb_beam_result_free);
}

/* A full analysis whose parts are proved finite leaves the strength entries' deflection
 * extremes, which no check and no bound reads, to trb_member_result_complete(): the flexure
 * segments the entries were cut into, to find them as evaluate_set() would have. Shared by
 * identical members, whose entries are shared too (each completes its own envelope). */
struct _TrbMemberPending
{
  double  *ab;
  guint    n_ab;
  gboolean entries_done;
};

static void
pending_clear (gpointer data)
{
  struct _TrbMemberPending *p = data;

  g_clear_pointer (&p->ab, g_free);
}

static void
sizing_clear (gpointer data)
{
  struct _TrbMemberSizing *sz = data;

  g_clear_pointer (&sz->supports, g_array_unref);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&sz->loads[c], g_array_unref);
}

void
trb_member_result_free (TrbMemberResult *result)
{
  if (result == NULL)
    return;
  g_free (result->message);
  g_clear_pointer (&result->notes, g_ptr_array_unref);
  if (result->keep != NULL)
    g_atomic_rc_box_release_full (result->keep, keep_clear);
  else
    {
      g_clear_pointer (&result->beam, trb_beam_free);
      for (guint c = 0; c < TRB_N_CASES; c++)
        g_clear_pointer (&result->cases[c], trb_beam_result_free);
    }
  g_clear_pointer (&result->regions, g_array_unref);
  g_clear_pointer (&result->patterns, g_array_unref);
  combo_set_clear (&result->strength);
  combo_set_clear (&result->live);
  combo_set_clear (&result->total);
  g_clear_pointer (&result->checks, g_array_unref);
  g_clear_pointer (&result->shortlist, g_array_unref);
  g_clear_pointer (&result->supports, g_array_unref);
  g_clear_pointer (&result->loads, g_array_unref);
  g_clear_pointer (&result->bearings, g_array_unref);
  g_free (result->plan_note);
  if (result->sizing != NULL)
    g_rc_box_release_full (result->sizing, sizing_clear);
  if (result->pending != NULL)
    g_rc_box_release_full (result->pending, pending_clear);
  g_free (result);
}

/**
 * trb_member_result_complete:
 * @result: a member's result
 *
 * Finds what the solve left to be found on first need: the deflection extremes of the
 * strength combinations' entries and of their envelope, which no check reads. Whoever reads
 * those (or prints every field of the entries) calls this first; the values are those the
 * solve would have found, bit for bit. Safe from any thread, and cheap once done.
 */
void
trb_member_result_complete (const TrbMemberResult *result)
{
  static GMutex lock;
  TrbMemberResult *r = (TrbMemberResult *) result;
  struct _TrbMemberPending *p;

  g_return_if_fail (result != NULL);
  if (g_atomic_pointer_get (&r->pending) == NULL)
    return;
  g_mutex_lock (&lock);
  p = r->pending;
  if (p != NULL)
    {
      GArray *entries = r->strength.entries;
      TrbEnvelope *env = &r->strength.envelope;

      if (!p->entries_done)
        {
          g_autofree TrbBeamExtremes *per = g_new (TrbBeamExtremes, MAX (p->n_ab, 1));

          /* the call evaluate_set() makes, for the fields the lean one left out */
          for (guint i = 0; i < entries->len; i++)
            {
              TrbComboResult *c = &g_array_index (entries, TrbComboResult, i);
              TrbBeamExtremes e;

              trb_beam_result_extremes_intervals (c->result, p->ab, p->n_ab, &e, per, NULL);
              c->ext.defl_down = e.defl_down;
              c->ext.defl_down_x = e.defl_down_x;
              c->ext.defl_up = e.defl_up;
              c->ext.defl_up_x = e.defl_up_x;
            }
          p->entries_done = TRUE;
        }
      /* the envelope's deflection as envelope_add() takes it (trb_extremes_merge(): each
       * field on its own, the first to reach it governs) */
      env->ext.defl_down = env->ext.defl_up = -INFINITY;
      env->ext.defl_down_x = env->ext.defl_up_x = 0;
      env->defl_down_by = env->defl_up_by = "";
      for (guint i = 0; i < entries->len; i++)
        {
          const TrbComboResult *c = &g_array_index (entries, TrbComboResult, i);

          if (c->ext.defl_down > env->ext.defl_down)
            {
              env->ext.defl_down = c->ext.defl_down;
              env->ext.defl_down_x = c->ext.defl_down_x;
              env->defl_down_by = c->name;
            }
          if (c->ext.defl_up > env->ext.defl_up)
            {
              env->ext.defl_up = c->ext.defl_up;
              env->ext.defl_up_x = c->ext.defl_up_x;
              env->defl_up_by = c->name;
            }
        }
      g_atomic_pointer_set (&r->pending, NULL);
      g_rc_box_release_full (p, pending_clear);
    }
  g_mutex_unlock (&lock);
}

/* A result for @member that reads the same analysis and design as @r (an identical member):
 * the arrays are shared by reference, the beam and case results through the keep box. The
 * member's own fields (member, bearings) are its own. */
TrbMemberResult *
trb_solve_priv_member_result_share (TrbMemberResult *r,
                                    const TrbMember *member)
{
  TrbMemberResult *c = g_new (TrbMemberResult, 1);

  if (r->keep == NULL && (r->beam != NULL || r->cases[TRB_CASE_D] != NULL ||
                          r->cases[TRB_CASE_L] != NULL || r->cases[TRB_CASE_LR] != NULL ||
                          r->cases[TRB_CASE_S] != NULL))
    {
      r->keep = g_atomic_rc_box_new0 (struct _TrbMemberKeep);
      r->keep->beam = r->beam;
      memcpy (r->keep->cases, r->cases, sizeof r->cases);
    }

  *c = *r;
  c->member = member;
  c->message = g_strdup (r->message);
  c->notes = g_ptr_array_ref (r->notes);
  if (r->keep != NULL)
    c->keep = g_atomic_rc_box_acquire (r->keep);
  c->regions = g_array_ref (r->regions);
  c->patterns = g_array_ref (r->patterns);
  combo_set_share (&c->strength, &r->strength);
  combo_set_share (&c->live, &r->live);
  combo_set_share (&c->total, &r->total);
  c->checks = g_array_ref (r->checks);
  c->shortlist = g_array_ref (r->shortlist);
  c->supports = r->supports != NULL ? g_array_ref (r->supports) : NULL;
  c->loads = r->loads != NULL ? g_array_ref (r->loads) : NULL;
  c->bearings = NULL;
  c->plan_note = NULL;
  if (r->sizing != NULL)
    c->sizing = g_rc_box_acquire (r->sizing);
  if (r->pending != NULL)
    c->pending = g_rc_box_acquire (r->pending);
  return c;
}

TrbMemberResult *
trb_solve_priv_member_result_new (const TrbProject *project,
                                  const TrbMember  *member)
{
  TrbMemberResult *r = g_new0 (TrbMemberResult, 1);

  r->member = member;
  r->status = TRB_STATUS_NOT_DESIGNED;
  r->notes = g_ptr_array_new_with_free_func (g_free);
  r->method = trb_member_get_method (member, &project->settings);
  r->units = project->settings.units;
  r->E = r->I = NAN;
  r->regions = g_array_new (FALSE, TRUE, sizeof (TrbRegion));
  r->patterns = g_array_new (FALSE, TRUE, sizeof (TrbPattern));
  combo_set_init (&r->strength, r->method == TRB_METHOD_LRFD ? TRB_COMBO_SET_LRFD
                                : r->method == TRB_METHOD_ASD ? TRB_COMBO_SET_ASD
                                : TRB_COMBO_SET_SERVICE);
  combo_set_init (&r->live, TRB_COMBO_SET_LIVE);
  combo_set_init (&r->total, TRB_COMBO_SET_TOTAL);
  r->checks = g_array_new (FALSE, TRUE, sizeof (TrbCheck));
  r->ratio = NAN;
  r->shortlist = g_array_new (FALSE, TRUE, sizeof (TrbShortlistEntry));
  return r;
}

static gboolean
extremes_finite (const TrbBeamExtremes *e)
{
  return isfinite (e->V_max) && isfinite (e->V_min) && isfinite (e->M_max) &&
         isfinite (e->M_min) && isfinite (e->defl_down) && isfinite (e->defl_up) &&
         isfinite (e->V_max_x) && isfinite (e->V_min_x) && isfinite (e->M_max_x) &&
         isfinite (e->M_min_x) && isfinite (e->defl_down_x) && isfinite (e->defl_up_x);
}

/* The reactions, and the values on both sides of every break: with the extremes, every
 * number a reader of the result may ask for. */
static gboolean
beam_result_finite (const TrbBeamResult *res)
{
  gboolean finite;

  trb_beam_result_extremes_intervals (res, NULL, 0, NULL, NULL, &finite);
  return finite;
}

/* entries_finite: the entries' results, judged as beam_result_finite() does while their
 * extremes were found (evaluate_set()) */
static gboolean
combo_set_finite (const TrbComboSetResult *set,
                  gboolean                 entries_finite)
{
  if (!entries_finite)
    return FALSE;
  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);

      if (!extremes_finite (&c->ext))
        return FALSE;
    }
  for (guint i = 0; i < set->envelope.reactions->len; i++)
    {
      const TrbReactionRange *rr = &g_array_index (set->envelope.reactions,
                                                   TrbReactionRange, i);

      if (!isfinite (rr->force_max) || !isfinite (rr->force_min) ||
          !isfinite (rr->moment_max) || !isfinite (rr->moment_min))
        return FALSE;
    }
  return set->envelope.empty || extremes_finite (&set->envelope.ext);
}

/* sets_finite: the entries of strength, live and total, as combo_set_finite() takes them */
static gboolean
analysis_finite (const TrbMemberResult *r,
                 const gboolean        *sets_finite)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (r->cases[c] != NULL &&
        (!beam_result_finite (r->cases[c]) || !extremes_finite (&r->case_ext[c])))
      return FALSE;
  return combo_set_finite (&r->strength, sets_finite[0]) &&
         combo_set_finite (&r->live, sets_finite[1]) &&
         combo_set_finite (&r->total, sets_finite[2]);
}

void G_GNUC_PRINTF (3, 4)
trb_solve_priv_set_status (TrbMemberResult *r,
                           TrbStatus        status,
                           const char      *format,
                           ...)
{
  va_list args;

  r->status = status;
  g_clear_pointer (&r->message, g_free);
  if (format != NULL)
    {
      va_start (args, format);
      r->message = g_strdup_vprintf (format, args);
      va_end (args);
    }
}

static void
reaction_ranges_merge (GArray              *ranges,
                       const TrbBeamResult *result,
                       gboolean             first)
{
  const TrbReaction *re;
  guint n;

  re = trb_beam_result_get_reactions (result, &n);
  if (first)
    {
      g_array_set_size (ranges, n);
      for (guint i = 0; i < n; i++)
        {
          TrbReactionRange *rr = &g_array_index (ranges, TrbReactionRange, i);

          rr->x = re[i].x;
          rr->force_max = rr->force_min = re[i].force;
          rr->moment_max = rr->moment_min = re[i].moment;
        }
      return;
    }
  g_return_if_fail (n == ranges->len);
  for (guint i = 0; i < n; i++)
    {
      TrbReactionRange *rr = &g_array_index (ranges, TrbReactionRange, i);

      rr->force_max = MAX (rr->force_max, re[i].force);
      rr->force_min = MIN (rr->force_min, re[i].force);
      rr->moment_max = MAX (rr->moment_max, re[i].moment);
      rr->moment_min = MIN (rr->moment_min, re[i].moment);
    }
}

/* c must stay where it is: the envelope points at its name. */
static void
envelope_add (TrbEnvelope          *env,
              const TrbComboResult *c)
{
  guint took = trb_extremes_merge (&env->ext, &c->ext);

  if (took & TRB_EXTREME_V_MAX)
    env->V_max_by = c->name;
  if (took & TRB_EXTREME_V_MIN)
    env->V_min_by = c->name;
  if (took & TRB_EXTREME_M_MAX)
    env->M_max_by = c->name;
  if (took & TRB_EXTREME_M_MIN)
    env->M_min_by = c->name;
  if (took & TRB_EXTREME_DEFL_DOWN)
    env->defl_down_by = c->name;
  if (took & TRB_EXTREME_DEFL_UP)
    env->defl_up_by = c->name;
  reaction_ranges_merge (env->reactions, c->result, env->empty);
  env->empty = FALSE;
}

/* The per-region results of the patterned cases (L and Lr): region_results[case][region]. */
typedef struct
{
  TrbBeamResult **by_region[TRB_N_CASES];
  TrbBeamResult  *zero;  /* a member without any load: the result of no load */

  /* every result above and the case results, prepared to be combined many times, and the
   * index of each among them */
  TrbBeamCombiner *combiner;
  guint            case_part[TRB_N_CASES];
  guint           *region_part[TRB_N_CASES];
  guint            zero_part;
} RegionResults;

static void
region_results_clear (RegionResults *rr,
                      guint          n_regions)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      g_clear_pointer (&rr->region_part[c], g_free);
      if (rr->by_region[c] == NULL)
        continue;
      for (guint i = 0; i < n_regions; i++)
        g_clear_pointer (&rr->by_region[c][i], trb_beam_result_free);
      g_clear_pointer (&rr->by_region[c], g_free);
    }
  g_clear_pointer (&rr->combiner, trb_beam_combiner_free);
  g_clear_pointer (&rr->zero, trb_beam_result_free);
}

/* The parts every entry of the sets is made of: the case results, the per-region results
 * and the result of no load, in one combiner. */
static void
region_results_prepare (RegionResults         *rr,
                        const TrbMemberResult *r)
{
  g_autoptr(GPtrArray) parts = g_ptr_array_new ();

  for (guint c = 0; c < TRB_N_CASES; c++)
    if (r->cases[c] != NULL)
      {
        rr->case_part[c] = parts->len;
        g_ptr_array_add (parts, r->cases[c]);
      }
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (rr->by_region[c] != NULL)
      {
        rr->region_part[c] = g_new (guint, r->regions->len);
        for (guint reg = 0; reg < r->regions->len; reg++)
          {
            rr->region_part[c][reg] = parts->len;
            g_ptr_array_add (parts, rr->by_region[c][reg]);
          }
      }
  rr->zero_part = parts->len;
  if (rr->zero != NULL)
    g_ptr_array_add (parts, rr->zero);
  rr->combiner = trb_beam_combiner_new ((TrbBeamResult **) parts->pdata, parts->len);
}

/* Whether some entry of the member's sets is a combination of absent cases, which reads as
 * the result of no load: a combination without a present case of nonzero factor, or a
 * pattern that loads no region (none is built so, but it is not assumed) */
static gboolean
zero_needed (const TrbMemberResult *r,
             const RegionResults   *rr)
{
  const TrbComboSet sets[] = { r->strength.set, r->live.set, r->total.set };

  for (guint p = 0; p < r->patterns->len; p++)
    {
      guint64 mask = g_array_index (r->patterns, TrbPattern, p).mask;
      gboolean any = FALSE;

      for (guint reg = 0; reg < r->regions->len && reg < 64; reg++)
        any = any || ((mask >> reg) & 1);
      if (!any)
        return TRUE;
    }
  for (guint k = 0; k < G_N_ELEMENTS (sets); k++)
    {
      const GArray *combos = trb_solve_priv_combos_for (sets[k], r->has_case);

      for (guint i = 0; i < combos->len; i++)
        {
          const TrbCombo *combo = &g_array_index (combos, TrbCombo, i);
          gboolean present = FALSE;

          for (guint c = 0; c < TRB_N_CASES; c++)
            present = present || (combo->factors[c] != 0 && r->cases[c] != NULL);
          if (!present)
            return TRUE;
        }
    }
  return FALSE;
}

/* Whether every entry the parts can make is certainly finite everywhere, as the lean analysis
 * of sizing must know of the entries it leaves out: an entry is a sum of parts, each at most
 * once, times factors of at most 1.6 (LRFD 2, 3) or 1.4, so its values are at most 1.6 times
 * the sum of the parts' bounds (trb_beam_result_bound()); far below the largest double, with
 * room for rounding and the extremes' searches inside the segments. */
static gboolean
parts_bounded (const RegionResults   *rr,
               const TrbMemberResult *r)
{
  double sum = rr->zero != NULL ? trb_beam_result_bound (rr->zero) : 0;   /* 0 for no load */

  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      if (r->cases[c] != NULL)
        sum += trb_beam_result_bound (r->cases[c]);
      for (guint reg = 0; rr->by_region[c] != NULL && reg < r->regions->len; reg++)
        sum += trb_beam_result_bound (rr->by_region[c][reg]);
    }
  return sum < 1e280;
}

static gboolean
is_patterned_case (TrbLoadCase c)
{
  return c == TRB_CASE_L || c == TRB_CASE_LR;
}

/* a size without design values, remembered as such */
static const char grade_none;
#define GRADE_NONE ((gpointer) &grade_none)

Memo *
trb_solve_priv_memo_new (void)
{
  Memo *memo = g_new0 (Memo, 1);

  memo->grades = g_hash_table_new_full (g_str_hash, g_str_equal, g_free,
                                        (GDestroyNotify) g_hash_table_unref);
  return memo;
}

void
trb_solve_priv_memo_free (Memo *memo)
{
  if (memo == NULL)
    return;
  g_hash_table_unref (memo->grades);
  g_free (memo->steel_name);
  g_free (memo->wood_species);
  g_free (memo->wood_grade);
  g_free (memo);
}

/* The combinations of a set for the cases present depend on nothing else: built once for the
 * process, for every thread, and never changed. */
#define COMBO_SETS 5

static GArray *combo_cache[COMBO_SETS][1 << TRB_N_CASES];

const GArray *
trb_solve_priv_combos_for (TrbComboSet     set,
                           const gboolean *has_case)
{
  guint key = 0;
  GArray *a;

  g_assert ((guint) set < COMBO_SETS);
  for (guint c = 0; c < TRB_N_CASES; c++)
    key |= has_case[c] ? 1u << c : 0;
  a = g_atomic_pointer_get (&combo_cache[set][key]);
  if (a == NULL)
    {
      GArray *built = trb_combos_build (set, has_case);

      if (g_atomic_pointer_compare_and_exchange (&combo_cache[set][key], NULL, built))
        a = built;
      else
        {
          g_array_unref (built);
          a = g_atomic_pointer_get (&combo_cache[set][key]);
        }
    }
  return a;
}

/* g_snprintf (dst, size, "%s (%s)", a, b), without the formatting machinery */
static void
name_with_pattern (char       *dst,
                   gsize       size,
                   const char *a,
                   const char *b)
{
  const char *pieces[] = { a, " (", b, ")" };
  gsize n = 0;

  /* each piece as far as it fits, a block at a time */
  for (guint i = 0; i < G_N_ELEMENTS (pieces); i++)
    {
      gsize len = MIN (strlen (pieces[i]), size - 1 - n);

      memcpy (dst + n, pieces[i], len);
      n += len;
    }
  dst[n] = '\0';
}

/* A strength entry and a total deflection entry of the same case factors under the same
 * pattern (ASD's D + L and its twin in the total set) are the same sum of the same parts, the
 * same bits: within one analysis whose strength entries are searched over the deflection
 * spans (no brace cuts the member between its supports), the strength set finds such an
 * entry's extremes with the deflection, and the total set takes its result and extremes
 * instead of combining and searching again. */
typedef struct
{
  double                 factors[TRB_N_CASES];
  guint                  pattern;
  const TrbBeamResult   *result;
  TrbBeamExtremes        whole;  /* with the deflection */
  const TrbBeamExtremes *per;    /* over each interval, in the strength set's extremes */
} Twin;

typedef struct
{
  const GArray *total;   /* the total set's combinations */
  Twin         *twins;
  guint         n_twins;
} Twins;

static gboolean
has_twin (const GArray   *combos,
          const TrbCombo *combo)
{
  for (guint i = 0; i < combos->len; i++)
    if (memcmp (g_array_index (combos, TrbCombo, i).factors, combo->factors,
                sizeof combo->factors) == 0)
      return TRUE;
  return FALSE;
}

static const Twin *
find_twin (const Twins    *twins,
           const TrbCombo *combo,
           guint           pattern)
{
  for (guint i = 0; i < twins->n_twins; i++)
    if (twins->twins[i].pattern == pattern &&
        memcmp (twins->twins[i].factors, combo->factors, sizeof combo->factors) == 0)
      return &twins->twins[i];
  return NULL;
}

/* Evaluates every combination of set, under every pattern where it carries a patterned case,
 * and takes the envelope. With ab (n_ab intervals: the spans of the deflection checks), the
 * extremes over each interval go to span_ext, n_ab for each entry. With keep (sizing's lean
 * analysis), only the entries it marks, by their place among all; envelope FALSE: none;
 * moments_only: the extremes of V and M only (the deflection fields are zero, not to be read
 * until trb_member_result_complete() finds them).
 * Returns whether every entry's result is finite, as beam_result_finite() says (TRUE with
 * moments_only or without need_finite: the caller has proved it, parts_bounded()). */
static gboolean
evaluate_set (TrbMemberResult     *r,
              const RegionResults *rr,
              TrbComboSetResult   *out,
              const double        *ab,
              guint                n_ab,
              GArray              *span_ext,
              const gboolean      *keep,
              gboolean             envelope,
              gboolean             moments_only,
              gboolean             need_finite,
              Twins               *twins)
{
  const GArray *combos = trb_solve_priv_combos_for (out->set, r->has_case);
  gboolean patterns_on = r->patterns->len > 0;
  gboolean finite = TRUE;
  guint index[TRB_N_CASES * TRB_PATTERN_MAX_REGIONS + 1];
  double factors[TRB_N_CASES * TRB_PATTERN_MAX_REGIONS + 1];
  guint n_entries = 0, first = out->entries->len, e = first, all = 0;

  /* every entry in place at once: the arrays grow once */
  for (guint i = 0; i < combos->len; i++)
    {
      const TrbCombo *combo = &g_array_index (combos, TrbCombo, i);
      gboolean patterned = FALSE;
      guint n;

      for (guint c = 0; c < TRB_N_CASES; c++)
        if (combo->factors[c] != 0 && is_patterned_case (c) && rr->by_region[c] != NULL)
          patterned = patterns_on;
      n = patterned ? r->patterns->len : 1;
      for (guint p = 0; p < n; p++, all++)
        n_entries += keep == NULL || keep[all];
    }
  all = 0;
  g_array_set_size (out->entries, e + n_entries);
  if (span_ext != NULL)
    g_array_set_size (span_ext, n_entries * n_ab);
  if (twins != NULL && moments_only && twins->twins == NULL)
    twins->twins = g_new (Twin, n_entries + 1);

  for (guint i = 0; i < combos->len; i++)
    {
      const TrbCombo *combo = &g_array_index (combos, TrbCombo, i);
      gboolean patterned = FALSE;
      guint n_patterns;

      for (guint c = 0; c < TRB_N_CASES; c++)
        if (combo->factors[c] != 0 && is_patterned_case (c) && rr->by_region[c] != NULL)
          patterned = patterns_on;

      n_patterns = patterned ? r->patterns->len : 1;
      for (guint p = 0; p < n_patterns; p++)
        {
          const TrbPattern *pat = patterned ? &g_array_index (r->patterns, TrbPattern, p) : NULL;
          TrbComboResult *cr;
          TrbBeamExtremes *span_out;
          guint n = 0;
          gboolean ok;

          if (keep != NULL && !keep[all++])
            continue;
          cr = &g_array_index (out->entries, TrbComboResult, e++);

          for (guint c = 0; c < TRB_N_CASES; c++)
            {
              double f = combo->factors[c];

              if (f == 0 || r->cases[c] == NULL)
                continue;
              if (pat != NULL && is_patterned_case (c) && rr->by_region[c] != NULL)
                {
                  for (guint reg = 0; reg < r->regions->len; reg++)
                    {
                      if (!((pat->mask >> reg) & 1))
                        continue;
                      index[n] = rr->region_part[c][reg];
                      factors[n++] = f;
                    }
                }
              else
                {
                  index[n] = rr->case_part[c];
                  factors[n++] = f;
                }
            }

          cr->combo = *combo;
          if (pat != NULL)
            {
              g_strlcpy (cr->pattern, pat->name, sizeof cr->pattern);
              name_with_pattern (cr->name, sizeof cr->name, combo->name, pat->name);
            }
          else
            {
              cr->pattern[0] = '\0';
              g_strlcpy (cr->name, combo->name, sizeof cr->name);
            }

          if (n == 0)
            {
              /* A combination of absent cases (1.4D on a member without dead load) still
               * reads as a combination, with zero effects. */
              g_assert (rr->zero != NULL);   /* zero_needed() */
              index[n] = rr->zero_part;
              factors[n++] = 0;
            }
          /* NULL when there is nothing per interval: no offset on an empty array's data */
          span_out = span_ext != NULL && n_ab > 0
                     ? &g_array_index (span_ext, TrbBeamExtremes, (e - 1 - first) * n_ab)
                     : NULL;
          if (twins != NULL && !moments_only)
            {
              const Twin *twin = find_twin (twins, combo, p);

              if (twin != NULL)
                {
                  /* the strength set's twin: the same sum, searched over the same intervals */
                  cr->result = trb_beam_result_copy (twin->result);
                  cr->ext = twin->whole;
                  if (span_out != NULL)
                    memcpy (span_out, twin->per, n_ab * sizeof (TrbBeamExtremes));
                  continue;
                }
            }
          cr->result = trb_beam_combiner_combine (rr->combiner, index, factors, n);
          if (twins != NULL && moments_only && has_twin (twins->total, combo))
            {
              /* V and M as trb_beam_result_moments_intervals() finds them (the same sweep),
               * and the deflection for the twin */
              Twin *twin = &twins->twins[twins->n_twins++];

              trb_beam_result_extremes_intervals (cr->result, ab, n_ab, &cr->ext, span_out,
                                                  NULL);
              memcpy (twin->factors, combo->factors, sizeof twin->factors);
              twin->pattern = p;
              twin->result = cr->result;
              twin->whole = cr->ext;
              twin->per = span_out;
              cr->ext.defl_down = cr->ext.defl_up = 0;
              cr->ext.defl_down_x = cr->ext.defl_up_x = 0;
              continue;
            }
          if (moments_only)
            {
              /* the lean analysis of sizing: V and M are all the strength checks read, and
               * the parts are proved finite */
              trb_beam_result_moments_intervals (cr->result, ab, n_ab, &cr->ext, span_out);
              /* a finite stand-in until trb_member_result_complete() finds them */
              cr->ext.defl_down = cr->ext.defl_up = 0;
              cr->ext.defl_down_x = cr->ext.defl_up_x = 0;
              ok = TRUE;
            }
          else if (span_ext != NULL)
            trb_beam_result_extremes_intervals (cr->result, ab, n_ab, &cr->ext, span_out,
                                                need_finite ? &ok : NULL);
          else
            trb_beam_result_extremes_intervals (cr->result, NULL, 0, &cr->ext, NULL,
                                                need_finite ? &ok : NULL);
          if (!need_finite)
            ok = TRUE;
          finite = finite && ok;
        }
    }

  /* once every entry is in place, since the envelope points at their names */
  for (guint i = 0; envelope && i < out->entries->len; i++)
    envelope_add (&out->envelope, &g_array_index (out->entries, TrbComboResult, i));
  return finite;
}

static double
custom_self_weight (const TrbMember *m,
                    GPtrArray       *notes)
{
  if (!isnan (m->weight))
    return m->weight;
  if (!isnan (m->A))
    {
      if (m->material == TRB_MATERIAL_STEEL)
        return m->A * STEEL_DENSITY;
      if (m->material == TRB_MATERIAL_WOOD)
        return m->A * WOOD_DENSITY;
    }
  g_ptr_array_add (notes, g_strdup ("self-weight not included: give the custom section a "
                                    "\"weight\" (or an \"A\" with material steel or wood)"));
  return 0;
}

static const char *
live_label (const TrbMemberResult *r)
{
  if (r->has_case[TRB_CASE_L] && r->has_case[TRB_CASE_LR])
    return "L+Lr";
  return r->has_case[TRB_CASE_L] ? "L" : "Lr";
}

void
trb_solve_priv_member_plan_clear (MemberPlan *plan)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      g_clear_pointer (&plan->cases[c], trb_beam_result_free);
      for (guint reg = 0; plan->by_region[c] != NULL && reg < plan->n_regions; reg++)
        trb_beam_result_free (plan->by_region[c][reg]);
      g_clear_pointer (&plan->by_region[c], g_free);
    }
  g_clear_pointer (&plan->regions, g_array_unref);
  g_clear_pointer (&plan->patterns, g_array_unref);
  g_clear_pointer (&plan->seed_regions, g_array_unref);
  g_clear_pointer (&plan->seed_patterns, g_array_unref);
  for (guint reg = 0; plan->seed_live != NULL && reg < plan->n_seed_live; reg++)
    trb_beam_result_free (plan->seed_live[reg]);
  g_clear_pointer (&plan->seed_live, g_free);
  plan->n_seed_live = 0;
  g_clear_pointer (&plan->seed_unit, trb_beam_result_free);
  g_clear_pointer (&plan->spans, g_free);
  g_clear_pointer (&plan->seg, g_free);
  plan->have_cuts = FALSE;
  plan->ready = FALSE;
}

/* The result of case c (or of a region: by_region) solved again on beam from the plan, or
 * NULL when the plan has none for it. */
static TrbBeamResult *
plan_result (const MemberPlan *plan,
             const TrbBeam    *beam,
             const TrbBeamResult *kept)
{
  if (plan == NULL || !plan->ready || kept == NULL)
    return NULL;
  return trb_beam_result_restiffen (kept, beam);
}

/* Each region's result kept (solved on another beam of the member's supports and loads)
 * solved again on beam: all of them, or NULL when one cannot be. */
static TrbBeamResult **
restiffen_regions (TrbBeamResult *const *kept,
                   guint                 n,
                   const TrbBeam        *beam)
{
  TrbBeamResult **out = g_new0 (TrbBeamResult *, n);

  for (guint reg = 0; reg < n; reg++)
    {
      out[reg] = kept[reg] != NULL ? trb_beam_result_restiffen (kept[reg], beam) : NULL;
      if (out[reg] == NULL)
        {
          for (guint k = 0; k < reg; k++)
            trb_beam_result_free (out[k]);
          g_free (out);
          return NULL;
        }
    }
  return out;
}

/* The analysis with a given stiffness and self-weight (N/m, added to D); with E or I NAN only
 * the stability is checked. Returns FALSE, with the status set when something is wrong, when
 * there is nothing more to do. The design step runs this for each section it tries, with that
 * section's E, I and weight, on a fresh result. Reads only its arguments; sx (may be NULL)
 * gets the deflection sets' extremes over the spans. */
gboolean
trb_solve_priv_analyse (const TrbProject  *project,
                        const MemberInput *in,
                        double             E,
                        double             I,
                        double             self_weight,
                        TrbMemberResult   *r,
                        SpanExtremes      *sx,
                        Lean              *lean)
{
  g_autoptr(GError) error = NULL;
  const TrbSupport *beam_supports;
  guint n_beam_supports;
  RegionResults rr = { { NULL } };
  gboolean use_patterns;
  gboolean known = !isnan (E) && !isnan (I);
  gboolean sets_finite[3];
  gboolean bounded;
  gboolean defer = FALSE;

  if (in->n_supports == 0)
    {
      trb_solve_priv_set_status (r, TRB_STATUS_UNSUPPORTED, "the beam has no supports");
      return FALSE;
    }

  /* Stability does not depend on E and I, so a member whose section is not known yet is
   * still told that it is a mechanism. */
  r->beam = trb_beam_new (in->length, known ? E : 1.0, known ? I : 1.0,
                          in->supports, in->n_supports, &error);
  if (r->beam == NULL)
    {
      if (g_error_matches (error, TRB_ERROR, TRB_ERROR_UNSTABLE))
        trb_solve_priv_set_status (r, TRB_STATUS_UNSTABLE, "%s", error->message);
      else
        trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s", error->message);
      return FALSE;
    }

  if (!known)
    {
      /* The design step supplies E and I for catalog sections and sizes "auto" members;
       * without it there is nothing to analyse with. */
      g_clear_pointer (&r->beam, trb_beam_free);
      return FALSE;
    }
  r->E = E;
  r->I = I;
  r->self_weight = self_weight;

  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      gboolean own = c == TRB_CASE_D && r->self_weight > 0;
      const TrbLoad *loads = in->loads[c];
      guint n_loads = in->n_loads[c] + (own ? 1 : 0);
      g_autofree TrbLoad *with_own = NULL;

      /* the case's loads, and the self-weight with D: a copy only where it is added */
      if (own)
        {
          TrbLoad sw = { TRB_LOAD_UNIFORM, 0, in->length, r->self_weight, r->self_weight };

          with_own = g_new (TrbLoad, n_loads);
          if (in->n_loads[c] > 0)
            memcpy (with_own, in->loads[c], in->n_loads[c] * sizeof (TrbLoad));
          with_own[n_loads - 1] = sw;
          loads = with_own;
        }
      if (n_loads == 0)
        continue;

      r->has_case[c] = TRUE;
      if (!own && in->plan != NULL && in->plan->ready &&
          (r->self_weight > 0) == in->plan->self_weight)
        r->cases[c] = plan_result (in->plan, r->beam, in->plan->cases[c]);
      if (r->cases[c] == NULL)
        r->cases[c] = trb_beam_solve (r->beam, loads, n_loads, &error);
      if (r->cases[c] == NULL)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "case %s: %s", trb_load_case_name (c),
                                     error->message);
          return FALSE;
        }
      /* the lean analysis of sizing proves them finite and reads no extreme of them */
      if (lean == NULL)
        trb_beam_result_extremes (r->cases[c], 0, in->length, &r->case_ext[c]);
    }

  beam_supports = trb_beam_get_supports (r->beam, &n_beam_supports);
  g_array_unref (r->regions);
  if (in->plan != NULL && in->plan->ready)
    r->regions = g_array_ref (in->plan->regions);
  else if (in->plan != NULL && in->plan->seed_regions != NULL)
    r->regions = g_array_ref (in->plan->seed_regions);   /* built from the same supports */
  else
    r->regions = trb_regions_build (beam_supports, n_beam_supports, in->length);

  use_patterns = project->settings.live_patterns && r->regions->len > 1 &&
                 (r->has_case[TRB_CASE_L] || r->has_case[TRB_CASE_LR]);
  if (use_patterns && r->regions->len > TRB_PATTERN_MAX_REGIONS)
    {
      g_ptr_array_add (r->notes, g_strdup_printf ("live-load patterns not formed: more than "
                                                  "%d spans and overhangs",
                                                  TRB_PATTERN_MAX_REGIONS));
      use_patterns = FALSE;
    }
  if (!project->settings.live_patterns)
    g_ptr_array_add (r->notes, g_strdup ("live-load patterns off by the project settings"));

  if (use_patterns)
    {
      const TrbRegion *regions = (const TrbRegion *) r->regions->data;
      guint n_regions = r->regions->len;

      g_array_unref (r->patterns);
      if (in->plan != NULL && in->plan->ready)
        r->patterns = g_array_ref (in->plan->patterns);
      else if (in->plan != NULL && in->plan->seed_patterns != NULL &&
               strcmp (live_label (r), "L") == 0)
        r->patterns = g_array_ref (in->plan->seed_patterns);   /* the same regions, "L" */
      else
        r->patterns = trb_patterns_build (regions, n_regions, live_label (r));

      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          GArray **split;

          if (!is_patterned_case (c) || !r->has_case[c])
            continue;
          /* the plan's, or the guess's solved for the same loads on the same regions */
          if (in->plan != NULL && in->plan->ready && in->plan->by_region[c] != NULL)
            {
              rr.by_region[c] = restiffen_regions (in->plan->by_region[c], n_regions, r->beam);
              if (rr.by_region[c] != NULL)
                continue;
            }
          else if (c == TRB_CASE_L && in->plan != NULL && !in->plan->ready &&
                   in->plan->seed_live != NULL && in->plan->n_seed_live == n_regions)
            {
              rr.by_region[c] = restiffen_regions (in->plan->seed_live, n_regions, r->beam);
              if (rr.by_region[c] != NULL)
                continue;
            }
          split = trb_loads_split (in->loads[c], in->n_loads[c], regions, n_regions);
          rr.by_region[c] = g_new0 (TrbBeamResult *, n_regions);
          for (guint reg = 0; reg < n_regions && r->status != TRB_STATUS_ERROR; reg++)
            {
              rr.by_region[c][reg] = trb_beam_solve (r->beam, (const TrbLoad *) split[reg]->data,
                                                     split[reg]->len, &error);
              if (rr.by_region[c][reg] == NULL)
                trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "case %s, region %u: %s",
                                           trb_load_case_name (c), reg + 1, error->message);
            }
          trb_loads_split_free (split, n_regions);
          if (r->status == TRB_STATUS_ERROR)
            {
              region_results_clear (&rr, n_regions);
              return FALSE;
            }
        }
    }

  if (in->plan != NULL && !in->plan->ready)
    {
      MemberPlan *plan = in->plan;

      /* the first analysis of sizing: what the others share */
      plan->self_weight = r->self_weight > 0;
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          if (r->cases[c] != NULL && !(c == TRB_CASE_D && r->self_weight > 0))
            plan->cases[c] = trb_beam_result_copy (r->cases[c]);
          if (rr.by_region[c] != NULL)
            {
              plan->by_region[c] = g_new0 (TrbBeamResult *, r->regions->len);
              for (guint reg = 0; reg < r->regions->len; reg++)
                plan->by_region[c][reg] = trb_beam_result_copy (rr.by_region[c][reg]);
            }
        }
      plan->regions = g_array_ref (r->regions);
      plan->patterns = g_array_ref (r->patterns);
      plan->n_regions = r->regions->len;
      plan->ready = TRUE;
    }

  /* the result of no load, for a combination of absent cases only (1.4D on a member
   * without dead load) */
  if (zero_needed (r, &rr))
    {
      rr.zero = trb_beam_solve (r->beam, NULL, 0, &error);
      if (rr.zero == NULL)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s", error->message);
          region_results_clear (&rr, r->regions->len);
          return FALSE;
        }
    }
  region_results_prepare (&rr, r);
  /* bounded parts make every entry finite: nothing is left to check break by break */
  bounded = parts_bounded (&rr, r);
  if (lean != NULL && !bounded)
    {
      lean->unproved = TRUE;
      region_results_clear (&rr, r->regions->len);
      return FALSE;
    }
  if (sx != NULL)
    {
      const TrbMember *m = in->member;
      TrbDesignInput di = { 0 };
      g_autofree double *ab = NULL;
      g_autofree double *seg_ab = NULL;
      g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
      Twins twins = { NULL };
      Twins *use_twins = NULL;
      guint n_pts;

      di.length = in->length;
      di.supports = trb_beam_get_supports (r->beam, &di.n_supports);
      if (in->plan != NULL && in->plan->have_cuts)
        {
          sx->spans = g_new0 (TrbDeflectionSpan, in->plan->n_spans + 1);
          memcpy (sx->spans, in->plan->spans, in->plan->n_spans * sizeof (TrbDeflectionSpan));
          sx->n_spans = in->plan->n_spans;
        }
      else
        {
          sx->spans = g_new0 (TrbDeflectionSpan, di.n_supports + 1);
          sx->n_spans = trb_design_deflection_spans (&di, sx->spans, di.n_supports + 1);
        }
      ab = g_new (double, 2 * sx->n_spans + 1);
      for (guint i = 0; i < sx->n_spans; i++)
        {
          ab[2 * i] = sx->spans[i].a;
          ab[2 * i + 1] = sx->spans[i].b;
        }

      /* the flexure segments the member's method will cut it into (a custom section is
       * checked by no method that cuts it) */
      for (guint i = 0; m != NULL && i < m->braces->len; i++)
        g_array_append_val (brace_x, g_array_index (m->braces, TrbMemberBrace, i).x);
      di.bracing = m != NULL ? m->bracing : TRB_BRACING_CONTINUOUS;
      di.brace_x = (const double *) brace_x->data;
      di.n_braces = brace_x->len;
      sx->seg = g_new (double, 2 + di.n_supports + di.n_braces);
      if (in->plan != NULL && in->plan->have_cuts)
        {
          n_pts = in->plan->n_seg;
          memcpy (sx->seg, in->plan->seg, n_pts * sizeof (double));
        }
      else
        n_pts = m != NULL && m->material == TRB_MATERIAL_WOOD
                ? trb_design_wood_segment_points (&di, sx->seg)
                : trb_design_steel_segment_points (&di, sx->seg);
      if (in->plan != NULL && !in->plan->have_cuts)
        {
          /* exactly the entries written: the arrays may be full (two overhangs) */
          in->plan->spans = g_new0 (TrbDeflectionSpan, sx->n_spans + 1);
          memcpy (in->plan->spans, sx->spans, sx->n_spans * sizeof (TrbDeflectionSpan));
          in->plan->n_spans = sx->n_spans;
          in->plan->seg = g_new0 (double, n_pts + 1);
          memcpy (in->plan->seg, sx->seg, n_pts * sizeof (double));
          in->plan->n_seg = n_pts;
          in->plan->have_cuts = TRUE;
        }
      sx->n_seg = n_pts > 0 ? n_pts - 1 : 0;
      seg_ab = g_new (double, 2 * sx->n_seg + 1);
      for (guint k = 0; k < sx->n_seg; k++)
        {
          seg_ab[2 * k] = sx->seg[k];
          seg_ab[2 * k + 1] = sx->seg[k + 1];
          if (!(sx->seg[k] < sx->seg[k + 1]))
            sx->n_seg = 0;   /* not intervals the sweep takes: the checks find their own */
        }
      if (m == NULL || trb_member_is_custom (m))
        sx->n_seg = 0;

      sx->live = g_array_new (FALSE, FALSE, sizeof (TrbBeamExtremes));
      sx->total = g_array_new (FALSE, FALSE, sizeof (TrbBeamExtremes));
      sx->strength = g_array_new (FALSE, FALSE, sizeof (TrbBeamExtremes));
      /* the full analysis of parts proved finite leaves the strength entries' deflection
       * extremes to trb_member_result_complete(): no check reads them */
      defer = lean == NULL && bounded;
      /* the strength entries searched over the deflection spans: their total twins are
       * found with them */
      if (bounded && sx->n_seg > 0 && sx->n_seg == sx->n_spans &&
          memcmp (seg_ab, ab, 2 * sx->n_seg * sizeof (double)) == 0)
        {
          twins.total = trb_solve_priv_combos_for (TRB_COMBO_SET_TOTAL, r->has_case);
          use_twins = &twins;
        }
      sets_finite[0] = evaluate_set (r, &rr, &r->strength, seg_ab, sx->n_seg, sx->strength,
                                     lean != NULL ? lean->keep[0] : NULL, lean == NULL,
                                     lean != NULL || defer, !bounded, use_twins);
      if (defer && r->strength.entries->len > 0)
        {
          if (r->pending != NULL)
            g_rc_box_release_full (r->pending, pending_clear);
          r->pending = g_rc_box_new0 (struct _TrbMemberPending);
          r->pending->n_ab = sx->n_seg;
          r->pending->ab = sx->n_seg > 0 ? g_memdup2 (seg_ab, 2 * sx->n_seg * sizeof (double))
                                         : NULL;
        }
      sets_finite[1] = evaluate_set (r, &rr, &r->live, ab, sx->n_spans, sx->live,
                                     lean != NULL ? lean->keep[1] : NULL, lean == NULL, FALSE,
                                     !bounded, NULL);
      sets_finite[2] = evaluate_set (r, &rr, &r->total, ab, sx->n_spans, sx->total,
                                     lean != NULL ? lean->keep[2] : NULL, lean == NULL, FALSE,
                                     !bounded, use_twins);
      g_free (twins.twins);
    }
  else
    {
      sets_finite[0] = evaluate_set (r, &rr, &r->strength, NULL, 0, NULL, NULL, TRUE, FALSE,
                                     !bounded, NULL);
      sets_finite[1] = evaluate_set (r, &rr, &r->live, NULL, 0, NULL, NULL, TRUE, FALSE,
                                     !bounded, NULL);
      sets_finite[2] = evaluate_set (r, &rr, &r->total, NULL, 0, NULL, NULL, TRUE, FALSE,
                                     !bounded, NULL);
    }
  region_results_clear (&rr, r->regions->len);

  /* Each length, load and stiffness may be finite and still overflow with the others (a span
   * of 1e308 ft, an I of 1e-308 in4): such a member is in error, never a result of inf. The
   * lean analysis has proved the cases finite. */
  if (!(lean != NULL || bounded ? combo_set_finite (&r->strength, sets_finite[0]) &&
                                   combo_set_finite (&r->live, sets_finite[1]) &&
                                   combo_set_finite (&r->total, sets_finite[2])
                                 : analysis_finite (r, sets_finite)))
    {
      trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "the analysis overflows: the lengths, loads "
                                 "or section properties are out of any real range");
      return FALSE;
    }

  r->analysed = TRUE;
  return TRUE;
}

/* The worst deflection check over every result of a deflection set, named after the
 * combination and pattern that gave it: trb_design_check_deflection() on each entry, the
 * worst kept (the first of equals), from the extremes over the spans evaluate_set() found
 * (span_ext: n_spans for each entry); only the worst is written out. */
static void
check_deflection_set (TrbDesignInput          *input,
                      const TrbComboSetResult *set,
                      gboolean                 live,
                      double                   limit,
                      const SpanExtremes      *sx,
                      const GArray            *span_ext,
                      GArray                  *checks)
{
  const TrbDeflectionSpan *worst_span = NULL;
  double worst_ratio = 0, worst_defl = 0, worst_x = 0;
  guint worst_entry = 0;
  gboolean have = FALSE;
  TrbCheck check;

  if (!(limit > 0) || sx->n_spans == 0)
    return;
  g_assert (span_ext->len == set->entries->len * sx->n_spans);
  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbBeamExtremes *ext = &g_array_index (span_ext, TrbBeamExtremes, i * sx->n_spans);
      const TrbDeflectionSpan *best_span = NULL;
      double best_ratio = 0, best_defl = 0, best_x = 0;

      for (guint j = 0; j < sx->n_spans; j++)
        {
          double x, defl = trb_design_deflection_demand (&ext[j], &x);
          double ratio = trb_check_ratio (defl, sx->spans[j].judged / limit);

          if (best_span == NULL || ratio > best_ratio)
            {
              best_span = &sx->spans[j];
              best_ratio = ratio;
              best_defl = defl;
              best_x = x;
            }
        }
      if (!have || best_ratio > worst_ratio)
        {
          worst_span = best_span;
          worst_ratio = best_ratio;
          worst_defl = best_defl;
          worst_x = best_x;
          worst_entry = i;
          have = TRUE;
        }
    }
  if (!have)
    return;
  trb_design_deflection_check (input, worst_span, limit, live, worst_defl, worst_x,
                               live ? "Live" : "Total", &check);
  g_strlcpy (check.combination,
             g_array_index (set->entries, TrbComboResult, worst_entry).name,
             sizeof check.combination);
  g_array_append_val (checks, check);
}

/* The status from the checks made: fail when any ratio is above 1, not designed when a check
 * could not be made, pass only when every check of the method was made and none fails. */
static void
finish_status (TrbMemberResult *r,
               gboolean         strength_checked)
{
  gboolean any_fail = FALSE;
  gboolean any_unchecked = FALSE;
  double worst = -INFINITY;

  r->governing[0] = '\0';
  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, i);

      if (isnan (ck->ratio))
        {
          any_unchecked = TRUE;
          continue;
        }
      /* A finite analysis can still overflow in a check (a deflection near the largest double
       * over a span ratio): out of range, not a failure with a ratio of inf. A zero capacity
       * under a finite demand stays a failure (trb_check_set()). */
      if (!isfinite (ck->demand) || !isfinite (ck->capacity) ||
          (!isfinite (ck->ratio) && ck->capacity != 0))
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "the %s check overflows: the lengths, "
                                     "loads or section properties are out of any real range",
                                     ck->name);
          r->ratio = NAN;
          return;
        }
      if (ck->ratio > 1)
        any_fail = TRUE;
      if (ck->ratio > worst)
        {
          worst = ck->ratio;
          g_strlcpy (r->governing, ck->name, sizeof r->governing);
        }
    }
  r->ratio = isfinite (worst) || worst == INFINITY ? worst : NAN;

  if (any_fail)
    trb_solve_priv_set_status (r, TRB_STATUS_FAIL, "%s: ratio %.2f", r->governing, r->ratio);
  else if (!strength_checked || any_unchecked)
    trb_solve_priv_set_status (r, TRB_STATUS_NOT_DESIGNED, "some checks could not be made "
                                                           "(see \"Not checked\")");
  else
    {
      r->status = TRB_STATUS_PASS;
      g_clear_pointer (&r->message, g_free);
    }
}

/* Every check of the member's method on one analysed section. */
void
trb_solve_priv_design_checks (const TrbProject   *project,
                              const TrbMember    *m,
                              const MemberInput  *in,
                              const TrbSection   *section,
                              const TrbWoodGrade *wood_grade,
                              const SpanExtremes *sx,
                              gboolean            no_detail,
                              TrbMemberResult    *r)
{
  g_autoptr(GArray) demand = NULL;
  g_autoptr(GArray) brace_x = NULL;
  const TrbSettings *s = &project->settings;
  TrbDesignInput input = { 0 };
  gboolean strength_checked = FALSE;

  g_strlcpy (r->section, section->designation, sizeof r->section);
  g_array_set_size (r->checks, 0);
  if (!r->analysed)
    return;

  demand = g_array_new (FALSE, TRUE, sizeof (TrbDemandCombo));
  for (guint i = 0; i < r->strength.entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (r->strength.entries, TrbComboResult, i);
      TrbDemandCombo d = { { 0 } };

      g_strlcpy (d.name, c->name, sizeof d.name);
      memcpy (d.factors, c->combo.factors, sizeof d.factors);
      d.result = c->result;
      d.ext = &c->ext;
      if (sx->strength != NULL && sx->n_seg > 0)
        {
          d.seg_ext = &g_array_index (sx->strength, TrbBeamExtremes, i * sx->n_seg);
          d.n_seg_ext = sx->n_seg;
        }
      g_array_append_val (demand, d);
    }
  brace_x = g_array_new (FALSE, TRUE, sizeof (double));
  for (guint i = 0; i < m->braces->len; i++)
    g_array_append_val (brace_x, g_array_index (m->braces, TrbMemberBrace, i).x);

  input.section = section;
  input.length = in->length;
  input.supports = trb_beam_get_supports (r->beam, &input.n_supports);
  input.bracing = m->bracing;
  input.brace_x = (const double *) brace_x->data;
  input.n_braces = brace_x->len;
  input.combos = (const TrbDemandCombo *) demand->data;
  input.n_combos = demand->len;
  input.units = s->units;
  input.no_detail = no_detail;

  /* live and total stay NULL in the method checks, so they add no deflection check: those
   * come below, worst over every combination and pattern. */
  if (r->method == TRB_METHOD_ALLOWABLE)
    {
      strength_checked = trb_design_allowable_check (&input, trb_member_get_fb_allow (m, s),
                                                     trb_member_get_fv_allow (m, s),
                                                     r->checks);
    }
  else if (section->kind == TRB_SHAPE_CUSTOM)
    trb_check_append_not_checked (r->checks,
                                  r->method == TRB_METHOD_LRFD ? "LRFD strength" : "ASD strength",
                                  "Strength of a custom section: use method=\"allowable\" "
                                  "with fb-allow and fv-allow");
  else if (m->material == TRB_MATERIAL_WOOD)
    {
      TrbWoodOptions options;

      trb_solve_priv_wood_options_for (m, in, &options);
      if (r->method == TRB_METHOD_LRFD)
        trb_check_append_not_checked (r->checks, "LRFD strength",
                                      "Timber is designed by NDS 2018 ASD only: use "
                                      "method=\"asd\"");
      else if (wood_grade != NULL)
        {
          trb_design_wood_check (&input, wood_grade, &options, r->checks);
          strength_checked = TRUE;
        }
    }
  else
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);

      strength_checked = trb_design_steel_check (&input, grade,
                                                 r->method == TRB_METHOD_LRFD
                                                   ? TRB_DESIGN_BASIS_LRFD : TRB_DESIGN_BASIS_ASD,
                                                 r->checks);
    }

  check_deflection_set (&input, &r->live, TRUE, trb_member_get_deflection_live (m, s), sx,
                        sx->live, r->checks);
  check_deflection_set (&input, &r->total, FALSE, trb_member_get_deflection_total (m, s), sx,
                        sx->total, r->checks);
  finish_status (r, strength_checked);
}

/* The custom section the engineer gave in the file. */
static void
custom_section (const TrbMember *m,
                double           self_weight,
                TrbSection      *section)
{
  trb_section_init_unknown (section);
  g_strlcpy (section->designation, "custom", sizeof section->designation);
  section->kind = TRB_SHAPE_CUSTOM;
  section->E = m->E;
  section->Ix = m->I;
  section->Sx = m->S;
  section->A = m->A;
  section->d = m->d;
  section->tw = m->tw;
  section->weight = self_weight;
}

/* The wood grade for a section, or NULL with the reason in *why. */
const TrbWoodGrade *
trb_solve_priv_wood_grade_for (const TrbMember   *m,
                               const MemberInput *in,
                               const TrbSection  *section,
                               char             **why)
{
  const TrbWoodGrade *grade;
  GHashTable *sizes = NULL;

  if (m->species == NULL || m->grade == NULL)
    {
      *why = g_strdup ("a wood member needs species and grade");
      return NULL;
    }
  if (in->memo != NULL)
    {
      Memo *memo = in->memo;
      gpointer found;

      /* sizing asks for one species and grade again and again */
      if (memo->wood_species != NULL && strcmp (memo->wood_species, m->species) == 0 &&
          strcmp (memo->wood_grade, m->grade) == 0)
        sizes = memo->wood_sizes;
      else
        {
          g_autofree char *key = g_strconcat (m->species, "\x1f", m->grade, NULL);

          sizes = g_hash_table_lookup (memo->grades, key);
          if (sizes == NULL)
            {
              sizes = g_hash_table_new (NULL, NULL);
              g_hash_table_insert (memo->grades, g_steal_pointer (&key), sizes);
            }
          g_free (memo->wood_species);
          g_free (memo->wood_grade);
          memo->wood_species = g_strdup (m->species);
          memo->wood_grade = g_strdup (m->grade);
          memo->wood_sizes = sizes;
        }
      found = g_hash_table_lookup (sizes, section);
      if (found != NULL)
        {
          grade = found == GRADE_NONE ? NULL : found;
          if (grade == NULL)
            *why = g_strdup_printf ("no design values for %s %s in size %s", m->species,
                                    m->grade, section->designation);
          return grade;
        }
    }
  grade = trb_catalog_lookup_grade (trb_catalog_get_default (), m->species, m->grade, section);
  if (sizes != NULL)
    g_hash_table_insert (sizes, (gpointer) section,
                         grade != NULL ? (gpointer) grade : GRADE_NONE);
  if (grade == NULL)
    *why = g_strdup_printf ("no design values for %s %s in size %s", m->species, m->grade,
                            section->designation);
  return grade;
}

/* Analyses and checks the member with one catalog section: its E (steel grade, or the wood
 * grade's E adjusted for service), its I and its self-weight. keep_sx (may be NULL) gets the
 * analysis's extremes over the spans and segments, for a reference. */
static TrbMemberResult *
solve_with_section_sx (const TrbProject  *project,
                       const TrbMember   *m,
                       const MemberInput *in,
                       const TrbSection  *section,
                       SpanExtremes      *keep_sx)
{
  const TrbSettings *s = &project->settings;
  TrbMemberResult *r = trb_solve_priv_member_result_new (project, m);
  const TrbWoodGrade *wood_grade = NULL;
  double self_weight = s->self_weight ? section->weight : 0;
  double E;
  SpanExtremes sx = { NULL };

  if (!s->self_weight)
    g_ptr_array_add (r->notes, g_strdup ("self-weight excluded by the project settings"));
  g_strlcpy (r->section, section->designation, sizeof r->section);

  if (m->material == TRB_MATERIAL_WOOD)
    {
      g_autofree char *why = NULL;
      TrbWoodOptions options;

      if (section->kind != TRB_SHAPE_SAWN && section->kind != TRB_SHAPE_GLULAM)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s is not a timber section",
                                     section->designation);
          return r;
        }
      wood_grade = trb_solve_priv_wood_grade_for (m, in, section, &why);
      if (wood_grade == NULL)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s", why);
          return r;
        }
      trb_solve_priv_wood_options_for (m, in, &options);
      E = trb_design_wood_adjusted_e (section, wood_grade, &options, TRB_WOOD_E);
    }
  else
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);

      if (section->kind == TRB_SHAPE_SAWN || section->kind == TRB_SHAPE_GLULAM)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s is a timber section: give "
                                     "material=\"wood\" with a species and grade",
                                     section->designation);
          return r;
        }
      if (grade == NULL)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "unknown steel grade \"%s\"",
                                     trb_member_get_steel_grade (m, s));
          return r;
        }
      E = grade->E;
    }

  if (trb_solve_priv_analyse (project, in, E, section->Ix, self_weight, r, &sx, NULL))
    trb_solve_priv_design_checks (project, m, in, section, wood_grade, &sx, FALSE, r);
  if (keep_sx != NULL)
    *keep_sx = sx;
  else
    trb_solve_priv_span_extremes_clear (&sx);
  return r;
}

static TrbMemberResult *
solve_with_section (const TrbProject  *project,
                    const TrbMember   *m,
                    const MemberInput *in,
                    const TrbSection  *section)
{
  return solve_with_section_sx (project, m, in, section, NULL);
}

/* The catalog family a member is sized from. */
static gboolean
sizing_family (const TrbMember *m,
               TrbFamily       *family)
{
  if (m->material == TRB_MATERIAL_WOOD)
    {
      /* The glulam layups are graded like "24F-V4"; sawn grades are not. */
      *family = m->grade != NULL && g_ascii_isdigit (m->grade[0]) ? TRB_FAMILY_GLULAM
                                                                  : TRB_FAMILY_SAWN;
      return TRUE;
    }
  if (m->material == TRB_MATERIAL_STEEL)
    {
      *family = TRB_FAMILY_W;
      return TRUE;
    }
  return FALSE;
}

static gboolean
candidate_allowed (const TrbMember  *m,
                   const TrbSection *section)
{
  if (!isnan (m->max_depth) && section->d > m->max_depth * (1 + 1e-9))
    return FALSE;
  if (!isnan (m->min_depth) && section->d < m->min_depth * (1 - 1e-9))
    return FALSE;
  if (m->max_plies > 0 && section->plies > m->max_plies)
    return FALSE;
  return TRUE;
}

/* A designation is looked up in the project's own sections first, then in the catalog. */
const TrbSection *
trb_solve_priv_lookup_section (const TrbProject *project,
                               const char       *designation)
{
  const TrbSection *section = NULL;

  if (project->sections != NULL)
    section = trb_catalog_lookup (project->sections, designation);
  if (section == NULL)
    section = trb_catalog_lookup (trb_catalog_get_default (), designation);
  return section;
}

static int
compare_by_weight (gconstpointer a,
                   gconstpointer b)
{
  const TrbSection *sa = a;
  const TrbSection *sb = b;

  if (sa->weight != sb->weight)
    return sa->weight < sb->weight ? -1 : 1;
  if (sa->d != sb->d)
    return sa->d < sb->d ? -1 : 1;
  return strcmp (sa->designation, sb->designation);
}

static int
compare_by_weight_ptr (gconstpointer a,
                       gconstpointer b)
{
  return compare_by_weight (*(const TrbSection * const *) a, *(const TrbSection * const *) b);
}

/* The candidates for sizing, lightest first: the allowed list when the member gives one,
 * else its family of the catalog; depth and ply limits applied. Taken one at a time
 * (candidates_next()): sizing mostly stops a fifth of the way through the catalog's family,
 * which is already lightest first and is then read in place, not copied. */
typedef struct
{
  const TrbMember  *m;
  const TrbSection *family;   /* the catalog's family in place, or NULL: list */
  guint             n_family;
  GPtrArray        *list;
  guint             next;
} Candidates;

static void
sizing_candidates (const TrbProject *project,
                   const TrbMember  *m,
                   Candidates       *cands)
{
  const TrbCatalog *catalogs[] = { trb_catalog_get_default (), project->sections };
  TrbFamily family;

  memset (cands, 0, sizeof *cands);
  cands->m = m;
  if (m->allowed != NULL)
    {
      cands->list = g_ptr_array_new ();
      for (guint i = 0; m->allowed[i] != NULL; i++)
        {
          const TrbSection *section = trb_solve_priv_lookup_section (project, m->allowed[i]);

          if (section != NULL && candidate_allowed (m, section))
            g_ptr_array_add (cands->list, (gpointer) section);
        }
      g_ptr_array_sort (cands->list, compare_by_weight_ptr);
      return;
    }
  if (!sizing_family (m, &family))
    {
      cands->list = g_ptr_array_new ();
      return;
    }
  if (project->sections == NULL)
    {
      cands->family = trb_catalog_get_family (catalogs[0], family, &cands->n_family);
      return;
    }
  /* The project's own sections of the family take part beside the catalog's. */
  cands->list = g_ptr_array_new ();
  for (guint c = 0; c < G_N_ELEMENTS (catalogs) && catalogs[c] != NULL; c++)
    {
      guint n;
      const TrbSection *sections = trb_catalog_get_family (catalogs[c], family, &n);

      for (guint i = 0; i < n; i++)
        if (candidate_allowed (m, &sections[i]))
          g_ptr_array_add (cands->list, (gpointer) &sections[i]);
    }
  g_ptr_array_sort (cands->list, compare_by_weight_ptr);
}

/* The next candidate, or NULL when there is none left. */
static const TrbSection *
candidates_next (Candidates *cands)
{
  if (cands->list != NULL)
    return cands->next < cands->list->len ? g_ptr_array_index (cands->list, cands->next++)
                                          : NULL;
  while (cands->next < cands->n_family)
    {
      const TrbSection *section = &cands->family[cands->next++];

      if (candidate_allowed (cands->m, section))
        return section;
    }
  return NULL;
}

static void
candidates_clear (Candidates *cands)
{
  g_clear_pointer (&cands->list, g_ptr_array_unref);
}

/* ---- sizing: bounds and the lean evaluation of candidates ---------------------------------
 *
 * Sizing checks sections lightest first. After one candidate is analysed in full (the
 * reference), the others are judged from it. The reactions, shears and moments do not depend
 * on E I (rigid supports, E I constant along the member), and the self-weight w enters case
 * D as a uniform load, so each combination's V and M move with w by f_D w times those of a
 * uniform unit load over the member; the deflections do the same after E I scales them:
 * live load deflection is the reference's times E I_ref / E I exactly. From these, each
 * combination's share in each check is bounded for each candidate (widened by a millionth
 * of the values and a billionth of the largest, far beyond the rounding of one analysis or
 * the other). A candidate whose bounds show a check above 1 certainly fails and is not
 * analysed (rejected). Any other is analysed with only the combinations whose bounds can reach
 * the largest share of some check (every combination of a timber strength check, whose shear
 * and bearing are not bounded), without text: each check then takes the same combination,
 * value and place as in the full analysis, so its status, ratio and governing check are
 * those of the full analysis, bit for bit. Whatever is out of the ordinary (an error, a check
 * not made, values too large to bound) goes to the full analysis. The shortcuts never change
 * a result: test-solve and test-floor compare them with sizing without them. */
#define BOUND_MARGIN 1e-6

typedef struct
{
  gboolean           ready;
  TrbMethod          method;
  gboolean           steel;        /* W shapes (flexure by segment, shear) */
  gboolean           wood;         /* sawn lumber or glulam (flexure by segment) */
  double             EI;           /* of the reference */
  double             self_weight;  /* N/m, of the reference */
  /* where the checks cut the member */
  guint              n_seg;        /* flexure segments (steel or timber points) */
  double            *seg;          /* n_seg + 1 points */
  guint              n_spans;      /* the deflection checks' spans */
  TrbDeflectionSpan *spans;
  /* a uniform load of 1 N/m over the member (each combination moves by f_D (w - w_ref)
   * times it): its least and largest V and M over the member and M on each segment, its
   * largest deflection on each span times E I, its M at the segments' quarter points */
  double             V_u_min, V_u_max, M_u_min, M_u_max;
  double            *M_u_seg;      /* least and largest on each segment: 2 n_seg */
  double            *D_u;          /* n_spans */
  double            *Mq_u;         /* 3 n_seg */
  gboolean          *free_end;     /* steel: Cb = 1 on each segment */
  /* the reference's strength entries: each extreme with the unit load's value where it is
   * (V on both sides, the unit load's V jumping at the supports) */
  guint              n_str;
  guint             *str_order;    /* the strength entries, largest moment first: the order
                                    * the flexure bounds are tried in, so that a failing
                                    * candidate fails on the first */
  double            *factors;      /* TRB_N_CASES each */
  double            *V;            /* V_max, V_u on its left and right, its side; the same of
                                    * V_min: 8 each */
  double            *M;            /* M_max, M_u there, M_min, M_u there: 4 each */
  double            *M_seg;        /* the same on each segment: 4 n_seg each */
  double            *Mq;           /* M at the quarter points, left and right: 6 n_seg each */
  /* its deflection entries: on each span the demand, and the signed deflection and the unit
   * load's deflection times E I where it is */
  guint              n_live, n_total;
  double            *d_live;       /* n_spans each */
  double            *d_total;      /* demand, signed deflection, unit there: 3 n_spans each */
  double            *fD_total;
  /* the largest of each, for margins that do not vanish at zero */
  double             M_scale, V_scale, D_scale;
  /* the largest lower bound of the live deflection checks for a candidate of E I_ref / E I
   * = 1 (each is that ratio times its own): most candidates that fail, fail there, and are
   * rejected from this one number; 0 when not checked */
  double             live_unit;
  double            *scratch;      /* room for the shares of a candidate */
  TrbBeam           *beam;         /* the member's beam (its supports; E = I = 1) */
  GPtrArray         *mem;          /* what the arrays above point into */
  double            *block;        /* ref_alloc()'s room left in the last of them */
  gsize              block_left;
} Reference;

static void
reference_clear (Reference *ref)
{
  g_clear_pointer (&ref->mem, g_ptr_array_unref);
  g_clear_pointer (&ref->spans, g_free);
  g_clear_pointer (&ref->beam, trb_beam_free);
  ref->block = NULL;
  ref->block_left = 0;
  ref->ready = FALSE;
}

/* n + 1 doubles, all 0, from blocks the reference keeps (a few allocations a member, not
 * one an array) */
#define REF_BLOCK 1024

static double *
ref_alloc (Reference *ref,
           gsize      n)
{
  double *p;

  if (n + 1 > ref->block_left)
    {
      gsize size = MAX (n + 1, REF_BLOCK);

      ref->block = g_new0 (double, size);
      ref->block_left = size;
      g_ptr_array_add (ref->mem, ref->block);
    }
  p = ref->block;
  ref->block += n + 1;
  ref->block_left -= n + 1;
  return p;
}

/* The design input the checks are given for the member, without section or combinations:
 * what the flexure segments and the deflection spans are cut from. */
static void
member_design_input (const TrbMember   *m,
                     const MemberInput *in,
                     const TrbBeam     *beam,
                     GArray            *brace_x,
                     TrbDesignInput    *input)
{
  memset (input, 0, sizeof *input);
  for (guint i = 0; i < m->braces->len; i++)
    g_array_append_val (brace_x, g_array_index (m->braces, TrbMemberBrace, i).x);
  input->length = in->length;
  input->supports = trb_beam_get_supports (beam, &input->n_supports);
  input->bracing = m->bracing;
  input->brace_x = (const double *) brace_x->data;
  input->n_braces = brace_x->len;
}

static double
abs_max (double a,
         double b)
{
  return MAX (fabs (a), fabs (b));
}

static double
value_at (const TrbBeamResult *r,
          double               x,
          TrbSide              side,
          int                  what)  /* 0 V, 1 M, 2 defl */
{
  TrbBeamQuantity q = what == 0 ? TRB_BEAM_V : what == 1 ? TRB_BEAM_M : TRB_BEAM_DEFL;
  double v;

  trb_beam_result_value (r, x, q, side == TRB_SIDE_LEFT ? &v : NULL,
                         side == TRB_SIDE_LEFT ? NULL : &v);
  return v;
}

/* value_at() on the left and on the right of x */
static void
values_both_sides (const TrbBeamResult *r,
                   double               x,
                   int                  what,
                   double              *left,
                   double              *right)
{
  trb_beam_result_value (r, x, what == 0 ? TRB_BEAM_V : what == 1 ? TRB_BEAM_M : TRB_BEAM_DEFL,
                         left, right);
}

/* M at the quarter points of each segment, where the steel check takes it for Cb: the left
 * and right values, 6 a segment */
static void
quarter_moments (const TrbBeamResult *result,
                 const double        *seg,
                 guint                n_seg,
                 double              *out)
{
  for (guint k = 0; k < n_seg; k++)
    {
      double a = seg[k], Lb = seg[k + 1] - seg[k];
      const double x[3] = { a + 0.25 * Lb, a + 0.50 * Lb, a + 0.75 * Lb };

      for (guint j = 0; j < 3; j++)
        values_both_sides (result, x[j], 1, &out[6 * k + 2 * j], &out[6 * k + 2 * j + 1]);
    }
}

/* The demand of a deflection check over each span of each entry of a set; with unit, also
 * the signed deflection there times E I and the unit load's: 3 a span. */
static void
span_demands (const TrbComboSetResult *set,
              const double            *ab,
              guint                    n_spans,
              const GArray            *known,
              const TrbBeamResult     *unit,
              double                   EI,
              double                  *d)
{
  g_autofree TrbBeamExtremes *own = g_new (TrbBeamExtremes, n_spans + 1);
  guint stride = unit != NULL ? 3 : 1;

  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);
      const TrbBeamExtremes *ext = own;

      if (known != NULL)
        ext = &g_array_index (known, TrbBeamExtremes, i * n_spans);
      else
        trb_beam_result_extremes_intervals (c->result, ab, n_spans, NULL, own, NULL);
      for (guint j = 0; j < n_spans; j++)
        {
          double *o = d + (i * n_spans + j) * stride;
          double x, demand = trb_design_deflection_demand (&ext[j], &x);

          o[0] = demand;
          if (unit != NULL)
            {
              o[1] = value_at (c->result, x, TRB_SIDE_RIGHT, 2) * EI;
              o[2] = value_at (unit, x, TRB_SIDE_RIGHT, 2) * EI;
            }
        }
    }
}

/* Takes the reference from a candidate analysed (status pass or fail), with every entry of
 * its sets; sx (may be NULL) has their extremes over the segments and spans already. */
static gboolean
reference_init (Reference             *ref,
                const TrbProject      *project,
                const TrbMember       *m,
                const MemberInput     *in,
                const TrbMemberResult *r,
                const SpanExtremes    *sx)
{
  g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(TrbBeamResult) unit = NULL;
  g_autofree double *seg_ab = NULL;
  g_autofree double *span_ab = NULL;
  g_autofree TrbBeamExtremes *ext = NULL;
  TrbLoad load = { TRB_LOAD_UNIFORM, 0, in->length, 1.0, 1.0 };
  TrbDesignInput input;
  TrbBeamExtremes whole;
  guint n_pts;

  if (!r->analysed || r->beam == NULL)
    return FALSE;
  memset (ref, 0, sizeof *ref);
  ref->mem = g_ptr_array_new_with_free_func (g_free);
  ref->method = r->method;
  ref->steel = m->material == TRB_MATERIAL_STEEL && r->method != TRB_METHOD_ALLOWABLE;
  ref->wood = m->material == TRB_MATERIAL_WOOD && r->method == TRB_METHOD_ASD;
  ref->EI = r->E * r->I;
  ref->self_weight = r->self_weight;
  ref->beam = trb_beam_new (in->length, 1.0, 1.0, in->supports, in->n_supports, NULL);
  if (ref->beam == NULL)
    return FALSE;

  member_design_input (m, in, ref->beam, brace_x, &input);
  ref->seg = ref_alloc (ref, 2 + input.n_supports + input.n_braces);
  n_pts = ref->wood ? trb_design_wood_segment_points (&input, ref->seg)
                    : trb_design_steel_segment_points (&input, ref->seg);
  ref->n_seg = n_pts > 0 ? n_pts - 1 : 0;
  ref->spans = g_new0 (TrbDeflectionSpan, input.n_supports + 1);
  ref->n_spans = trb_design_deflection_spans (&input, ref->spans, input.n_supports + 1);
  seg_ab = g_new (double, 2 * ref->n_seg + 1);
  for (guint k = 0; k < ref->n_seg; k++)
    {
      seg_ab[2 * k] = ref->seg[k];
      seg_ab[2 * k + 1] = ref->seg[k + 1];
      if (!(seg_ab[2 * k] < seg_ab[2 * k + 1]))
        return FALSE;
    }
  span_ab = g_new (double, 2 * ref->n_spans + 1);
  for (guint j = 0; j < ref->n_spans; j++)
    {
      span_ab[2 * j] = ref->spans[j].a;
      span_ab[2 * j + 1] = ref->spans[j].b;
    }
  ext = g_new (TrbBeamExtremes, MAX (ref->n_seg, ref->n_spans) + 1);
  if (sx != NULL &&
      !(sx->n_seg == ref->n_seg && sx->n_spans == ref->n_spans && sx->strength != NULL &&
        sx->strength->len == r->strength.entries->len * ref->n_seg &&
        sx->live->len == r->live.entries->len * ref->n_spans &&
        sx->total->len == r->total.entries->len * ref->n_spans &&
        memcmp (sx->seg, ref->seg, (ref->n_seg + 1) * sizeof (double)) == 0))
    sx = NULL;

  /* the guess's, where it solved one */
  if (in->plan != NULL && in->plan->seed_unit != NULL)
    unit = trb_beam_result_restiffen (in->plan->seed_unit, r->beam);
  if (unit == NULL)
    unit = trb_beam_solve (r->beam, &load, 1, NULL);
  if (unit == NULL)
    return FALSE;
  trb_beam_result_extremes_intervals (unit, seg_ab, ref->n_seg, &whole, ext, NULL);
  ref->V_u_min = whole.V_min;
  ref->V_u_max = whole.V_max;
  ref->M_u_min = whole.M_min;
  ref->M_u_max = whole.M_max;
  ref->M_u_seg = ref_alloc (ref, 2 * ref->n_seg);
  for (guint k = 0; k < ref->n_seg; k++)
    {
      ref->M_u_seg[2 * k] = ext[k].M_min;
      ref->M_u_seg[2 * k + 1] = ext[k].M_max;
    }
  ref->Mq_u = ref_alloc (ref, 6 * ref->n_seg);
  quarter_moments (unit, ref->seg, ref->n_seg, ref->Mq_u);
  ref->free_end = g_new0 (gboolean, ref->n_seg + 1);
  g_ptr_array_add (ref->mem, ref->free_end);
  for (guint k = 0; k < ref->n_seg; k++)
    ref->free_end[k] = trb_design_steel_free_end (&input, ref->seg[k], ref->seg[k + 1]);
  ref->D_u = ref_alloc (ref, ref->n_spans);
  /* over the spans: found above already where they are the segments (the same search of
   * the same intervals) */
  if (!(ref->n_spans == ref->n_seg && ref->n_seg > 0 &&
        memcmp (span_ab, seg_ab, 2 * ref->n_seg * sizeof (double)) == 0))
    trb_beam_result_extremes_intervals (unit, span_ab, ref->n_spans, NULL, ext, NULL);
  for (guint j = 0; j < ref->n_spans; j++)
    {
      double x;

      ref->D_u[j] = trb_design_deflection_demand (&ext[j], &x) * ref->EI;
    }

  ref->n_str = r->strength.entries->len;
  ref->factors = ref_alloc (ref, ref->n_str * TRB_N_CASES);
  ref->V = ref_alloc (ref, ref->n_str * 8);
  ref->M = ref_alloc (ref, ref->n_str * 4);
  ref->M_seg = ref_alloc (ref, ref->n_str * 4 * ref->n_seg);
  ref->Mq = ref_alloc (ref, ref->n_str * 6 * ref->n_seg);
  for (guint i = 0; i < ref->n_str; i++)
    {
      const TrbComboResult *c = &g_array_index (r->strength.entries, TrbComboResult, i);
      double *V = ref->V + 8 * i, *M = ref->M + 4 * i;

      memcpy (ref->factors + i * TRB_N_CASES, c->combo.factors, sizeof c->combo.factors);
      for (guint e = 0; e < 2; e++)
        {
          double v = e == 0 ? c->ext.V_max : c->ext.V_min;
          double x = e == 0 ? c->ext.V_max_x : c->ext.V_min_x;
          double vl, vr;

          values_both_sides (c->result, x, 0, &vl, &vr);
          /* the unit load's V on either side of the extreme (it jumps at a support), and
           * on which side the extreme is: left 1, right 2, both 3, not told 0 */
          V[4 * e] = v;
          values_both_sides (unit, x, 0, &V[4 * e + 1], &V[4 * e + 2]);
          V[4 * e + 3] = (vl == v ? 1 : 0) + (vr == v ? 2 : 0);
        }
      M[0] = c->ext.M_max;
      M[1] = value_at (unit, c->ext.M_max_x, TRB_SIDE_RIGHT, 1);
      M[2] = c->ext.M_min;
      M[3] = value_at (unit, c->ext.M_min_x, TRB_SIDE_RIGHT, 1);
      ref->V_scale = MAX (ref->V_scale, abs_max (V[0], V[4]));
      ref->M_scale = MAX (ref->M_scale, abs_max (M[0], M[2]));
      if (sx == NULL)
        trb_beam_result_extremes_intervals (c->result, seg_ab, ref->n_seg, NULL, ext, NULL);
      for (guint k = 0; k < ref->n_seg; k++)
        {
          const TrbBeamExtremes *e = sx != NULL ? &g_array_index (sx->strength, TrbBeamExtremes,
                                                                  i * ref->n_seg + k)
                                                : &ext[k];
          double *Ms = ref->M_seg + (i * ref->n_seg + k) * 4;

          Ms[0] = e->M_max;
          Ms[1] = value_at (unit, e->M_max_x, TRB_SIDE_RIGHT, 1);
          Ms[2] = e->M_min;
          Ms[3] = value_at (unit, e->M_min_x, TRB_SIDE_RIGHT, 1);
        }
      if (ref->steel)
        quarter_moments (c->result, ref->seg, ref->n_seg, ref->Mq + i * 6 * ref->n_seg);
    }

  /* largest |M| first, ties in their own order (a stable insertion sort of a few entries) */
  ref->str_order = g_new (guint, ref->n_str + 1);
  g_ptr_array_add (ref->mem, ref->str_order);
  for (guint i = 0; i < ref->n_str; i++)
    {
      double mi = abs_max (ref->M[4 * i], ref->M[4 * i + 2]);
      guint j = i;

      for (; j > 0 && abs_max (ref->M[4 * ref->str_order[j - 1]],
                               ref->M[4 * ref->str_order[j - 1] + 2]) < mi; j--)
        ref->str_order[j] = ref->str_order[j - 1];
      ref->str_order[j] = i;
    }

  ref->n_live = r->live.entries->len;
  ref->n_total = r->total.entries->len;
  ref->scratch = ref_alloc (ref, 4 * ref->n_str + 2 * ref->n_live + 2 * ref->n_total);
  ref->d_live = ref_alloc (ref, ref->n_live * ref->n_spans);
  ref->d_total = ref_alloc (ref, 3 * ref->n_total * ref->n_spans);
  ref->fD_total = ref_alloc (ref, ref->n_total);
  span_demands (&r->live, span_ab, ref->n_spans, sx != NULL ? sx->live : NULL, NULL, 0,
                ref->d_live);
  span_demands (&r->total, span_ab, ref->n_spans, sx != NULL ? sx->total : NULL, unit, ref->EI,
                ref->d_total);
  for (guint i = 0; i < ref->n_live * ref->n_spans; i++)
    ref->D_scale = MAX (ref->D_scale, ref->d_live[i]);
  for (guint i = 0; i < ref->n_total; i++)
    {
      ref->fD_total[i] = g_array_index (r->total.entries, TrbComboResult,
                                        i).combo.factors[TRB_CASE_D];
      for (guint j = 0; j < ref->n_spans; j++)
        ref->D_scale = MAX (ref->D_scale, ref->d_total[3 * (i * ref->n_spans + j)]);
    }

  ref->ready = isfinite (ref->EI) && ref->EI > 0 &&
               isfinite (ref->V_u_min + ref->V_u_max + ref->M_u_min + ref->M_u_max) &&
               isfinite (ref->M_scale + ref->V_scale + ref->D_scale);
  for (guint j = 0; ref->ready && j < ref->n_spans; j++)
    ref->ready = isfinite (ref->D_u[j]);

  /* candidate_shares()'s live lower bounds with k_EI taken out: (d k - margin (d k, 0,
   * D_scale k)) / cap = k (d (1 - BOUND_MARGIN) - 1e-9 D_scale) / cap */
  ref->live_unit = 0;
  {
    double live_limit = trb_member_get_deflection_live (m, &project->settings);

    for (guint i = 0; live_limit > 0 && i < ref->n_live; i++)
      for (guint j = 0; j < ref->n_spans; j++)
        {
          double cap = ref->spans[j].judged / live_limit;
          double lo = (ref->d_live[i * ref->n_spans + j] * (1 - BOUND_MARGIN) -
                       1e-9 * ref->D_scale) / cap;

          if (lo > ref->live_unit)
            ref->live_unit = lo;
        }
    if (!isfinite (ref->live_unit))
      ref->live_unit = 0;
  }
  return ref->ready;
}

/* The margin of a bound: a millionth of the values and a billionth of the largest */
static inline double
margin (double a,
        double b,
        double scale)
{
  return BOUND_MARGIN * (fabs (a) + fabs (b)) + 1e-9 * scale;
}

/* The candidate's largest value of a combination where the reference has its largest, v, and
 * the unit load has u there (u_lo, u_hi: the unit load's least and largest where the
 * candidate's largest may be), moving by c times the unit load: [lo, hi]. */
static inline G_ALWAYS_INLINE void
bound_max (double  v,
           double  u,
           double  u_lo,
           double  u_hi,
           double  c,
           double  scale,
           double *lo,
           double *hi)
{
  *lo = v + c * u;
  *hi = v + (c >= 0 ? c * u_hi : c * u_lo);
  *lo -= margin (*lo, c * u, scale);
  *hi += margin (*hi, c * u_hi + c * u_lo, scale);
}

/* The unit load's value to take at a reference's extreme of V (u: left, right, side), so
 * that the candidate's largest (max) or least is certainly beyond the reference's plus c
 * times it: on the extreme's own side, the one that moves it least when not told. */
static inline double
unit_at_extreme (const double *u,
                 double        c,
                 gboolean      max)
{
  int side = (int) u[2];
  gboolean left_less = c * u[0] < c * u[1];

  if (side == 1)
    return u[0];
  if (side == 2)
    return u[1];
  /* on both sides: the candidate's extreme is beyond both; not told: beyond the lesser */
  if ((side == 3) == max)
    return left_less ? u[1] : u[0];
  return left_less ? u[0] : u[1];
}

/* and its least */
static inline G_ALWAYS_INLINE void
bound_min (double  v,
           double  u,
           double  u_lo,
           double  u_hi,
           double  c,
           double  scale,
           double *lo,
           double *hi)
{
  *hi = v + c * u;
  *lo = v + (c >= 0 ? c * u_lo : c * u_hi);
  *hi += margin (*hi, c * u, scale);
  *lo -= margin (*lo, c * u_hi + c * u_lo, scale);
}

/* Bounds on the share of each entry in each check, for one candidate. */
typedef struct
{
  double  max_lo;          /* the largest lower bound of any check: above 1, it fails */
  double  max_hi;          /* the largest upper bound: below 1, it passes */
  /* per strength entry, two checks: steel flexure and shear; allowable stress section
   * modulus and web shear; timber flexure (and all entries kept) */
  double *str_lo[2], *str_hi[2];
  gboolean keep_all_strength;
  double *live_lo, *live_hi;
  double *total_lo, *total_hi;
  gboolean live_checked, total_checked;
} Shares;

/* The shares' arrays, in room the reference keeps for them (sizing judges one candidate at a
 * time), all 0 */
static void
shares_init (Shares          *sh,
             const Reference *ref)
{
  guint n = 4 * ref->n_str + 2 * ref->n_live + 2 * ref->n_total;

  memset (sh, 0, sizeof *sh);
  memset (ref->scratch, 0, n * sizeof (double));
  sh->str_lo[0] = ref->scratch;
  sh->str_hi[0] = sh->str_lo[0] + ref->n_str;
  sh->str_lo[1] = sh->str_hi[0] + ref->n_str;
  sh->str_hi[1] = sh->str_lo[1] + ref->n_str;
  sh->live_lo = sh->str_hi[1] + ref->n_str;
  sh->live_hi = sh->live_lo + ref->n_live;
  sh->total_lo = sh->live_hi + ref->n_live;
  sh->total_hi = sh->total_lo + ref->n_total;
}

static inline G_ALWAYS_INLINE void
share_max (double *lo,
           double *hi,
           double  l,
           double  h)
{
  *lo = MAX (*lo, l);
  *hi = MAX (*hi, h);
}

/* The candidate's E (as the full analysis takes it) and its timber grade, or FALSE when its
 * analysis would end in an error. */
static gboolean
section_stiffness (const TrbProject    *project,
                   const TrbMember     *m,
                   const MemberInput   *in,
                   const TrbSection    *section,
                   double              *E,
                   const TrbWoodGrade **wood_grade)
{
  const TrbSettings *s = &project->settings;

  *wood_grade = NULL;
  if (m->material == TRB_MATERIAL_WOOD)
    {
      g_autofree char *why = NULL;
      TrbWoodOptions options;

      if (section->kind != TRB_SHAPE_SAWN && section->kind != TRB_SHAPE_GLULAM)
        return FALSE;
      *wood_grade = trb_solve_priv_wood_grade_for (m, in, section, &why);
      if (*wood_grade == NULL)
        return FALSE;
      trb_solve_priv_wood_options_for (m, in, &options);
      *E = trb_design_wood_adjusted_e (section, *wood_grade, &options, TRB_WOOD_E);
    }
  else
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);

      if (section->kind == TRB_SHAPE_SAWN || section->kind == TRB_SHAPE_GLULAM || grade == NULL)
        return FALSE;
      *E = grade->E;
    }
  return TRUE;
}

/* The shares of a candidate; FALSE when they cannot be bounded (then it is analysed in
 * full). */
static gboolean
candidate_shares (const Reference    *ref,
                  const TrbProject   *project,
                  const TrbMember    *m,
                  const MemberInput  *in,
                  const TrbSection   *section,
                  double              E,
                  const TrbWoodGrade *wood_grade,
                  gboolean            reject,
                  Shares             *sh)
{
  const TrbSettings *s = &project->settings;
  double self_weight = s->self_weight ? section->weight : 0;
  double EI = E * section->Ix;
  double k_EI, dw, M_u, V_u;
  double live_limit = trb_member_get_deflection_live (m, s);
  double total_limit = trb_member_get_deflection_total (m, s);
  gboolean bounded = FALSE;   /* strength bounded */

  /* the shares' arrays are cleared only once the candidate is bounded (most fail in live
   * deflection by one number first) */
  memset (sh, 0, sizeof *sh);
  if (!ref->ready || (self_weight > 0) != (ref->self_weight > 0) || !(EI > 0) ||
      !isfinite (EI))
    return FALSE;
  k_EI = ref->EI / EI;
  dw = self_weight - ref->self_weight;
  M_u = abs_max (ref->M_u_min, ref->M_u_max);
  V_u = abs_max (ref->V_u_min, ref->V_u_max);
  /* far from the largest double: every value of the candidate's analysis is finite, and so
   * is every ratio of its checks */
  if (!(k_EI < 1e12 && k_EI > 1e-12 && fabs (dw) < 1e12 &&
        (ref->M_scale + 2 * fabs (dw) * M_u) * (1 + k_EI) < 1e100 &&
        (ref->V_scale + 2 * fabs (dw) * V_u) < 1e100 && ref->D_scale * (1 + k_EI) < 1e100))
    return FALSE;

  /* deflection: live load deflection scales with E I_ref / E I; the total moves with w too.
   * A candidate certainly failing in live deflection by the reference's one number (the
   * bounds below, to their rounding: a millionth is far beyond it) need not be bounded
   * further. */
  if (reject && ref->live_unit * k_EI * (1 - 1e-12) > 1 + BOUND_MARGIN)
    {
      sh->max_lo = ref->live_unit * k_EI;
      return TRUE;
    }
  shares_init (sh, ref);

  if (ref->method == TRB_METHOD_ALLOWABLE)
    {
      double Fb = trb_member_get_fb_allow (m, s);
      double Fv = trb_member_get_fv_allow (m, s);
      const char *formula;

      if (!(isfinite (Fb) && Fb > 0 && isfinite (section->Sx) && section->Sx > 0 &&
            isfinite (Fv) && Fv > 0) ||
          isnan (trb_design_allowable_shear_stress (section, 1.0, &formula)))
        goto unbounded;
      for (guint i = 0; i < ref->n_str; i++)
        {
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          const double *M = ref->M + 4 * i, *V = ref->V + 8 * i;
          double max_lo, max_hi, min_lo, min_hi;

          /* the largest |M| and |V| over the member, against Fb Sx and Fv */
          bound_max (M[0], M[1], ref->M_u_min, ref->M_u_max, c, ref->M_scale, &max_lo, &max_hi);
          bound_min (M[2], M[3], ref->M_u_min, ref->M_u_max, c, ref->M_scale, &min_lo, &min_hi);
          sh->str_lo[0][i] = MAX (MAX (max_lo, -min_hi), 0) / Fb / section->Sx;
          sh->str_hi[0][i] = MAX (abs_max (max_lo, max_hi), abs_max (min_lo, min_hi)) / Fb /
                             section->Sx;
          bound_max (V[0], unit_at_extreme (V + 1, c, TRUE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &max_lo, &max_hi);
          bound_min (V[4], unit_at_extreme (V + 5, c, FALSE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &min_lo, &min_hi);
          sh->str_lo[1][i] = trb_design_allowable_shear_stress (section,
                                                                MAX (MAX (max_lo, -min_hi), 0),
                                                                NULL) / Fv;
          sh->str_hi[1][i] = trb_design_allowable_shear_stress (section,
                                                                MAX (abs_max (max_lo, max_hi),
                                                                     abs_max (min_lo, min_hi)),
                                                                NULL) / Fv;
        }
    }
  else if (ref->steel && section->kind == TRB_SHAPE_W)
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);
      gboolean lrfd = ref->method == TRB_METHOD_LRFD;
      TrbSteelFlexure flex;
      TrbSteelFlexurePrep prep;
      TrbSteelShear shear;
      double cap_b, cap_v;

      if (grade == NULL || !trb_design_steel_flexure_prepare (section, grade, &prep) ||
          !trb_design_steel_flexure_at (&prep, 0, 1, &flex) ||
          !trb_design_steel_shear (section, grade, &shear))
        goto unbounded;
      cap_b = lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B;
      cap_v = lrfd ? shear.phi * shear.Vn : shear.Vn / shear.omega;
      if (!(cap_b > 0 && cap_v > 0))
        goto unbounded;
      for (guint i = 0; i < ref->n_str; i++)
        {
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          const double *V = ref->V + 8 * i;
          double max_lo, max_hi, min_lo, min_hi;

          /* shear (G2): the largest |V| over the member */
          bound_max (V[0], unit_at_extreme (V + 1, c, TRUE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &max_lo, &max_hi);
          bound_min (V[4], unit_at_extreme (V + 5, c, FALSE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &min_lo, &min_hi);
          sh->str_lo[1][i] = MAX (MAX (max_lo, -min_hi), 0) / cap_v;
          sh->str_hi[1][i] = MAX (abs_max (max_lo, max_hi), abs_max (min_lo, min_hi)) / cap_v;
          sh->max_lo = MAX (sh->max_lo, sh->str_lo[1][i]);
        }
      if (reject && sh->max_lo > 1 + BOUND_MARGIN)
        return TRUE;
      for (guint o = 0; o < ref->n_str; o++)
        {
          guint i = ref->str_order[o];
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          double max_lo, max_hi, min_lo, min_hi;

          /* flexure: on each segment the sagging and hogging moments (AISC 360-16 F2 with
           * Lb = 0 for sagging under continuous bracing, the segment's Lb and Cb otherwise) */
          for (guint k = 0; k < ref->n_seg; k++)
            {
              const double *Ms = ref->M_seg + (i * ref->n_seg + k) * 4;
              const double *u = ref->M_u_seg + 2 * k;
              double pos_lo, pos_hi, neg_lo, neg_hi, abs_lo, abs_hi, cap_lo, cap_hi;
              double Cb_lo = 1, Cb_hi = 1;

              bound_max (Ms[0], Ms[1], u[0], u[1], c, ref->M_scale, &max_lo, &max_hi);
              bound_min (Ms[2], Ms[3], u[0], u[1], c, ref->M_scale, &min_lo, &min_hi);
              pos_lo = MAX (max_lo, 0);
              pos_hi = MAX (max_hi, 0);
              neg_lo = MAX (-min_hi, 0);
              neg_hi = MAX (-min_lo, 0);
              abs_lo = MAX (pos_lo, neg_lo);
              abs_hi = MAX (pos_hi, neg_hi);
              /* the check takes a hogging moment of a billionth of the largest as round-off */
              if (!(neg_lo > 1e-9 * abs_hi))
                neg_lo = 0;
              /* Cb (F1-1) grows with the largest moment and falls with those at the quarter
               * points; it is at least 1, and the capacity grows with it */
              if (!ref->free_end[k])
                {
                  const double *q = ref->Mq + (i * ref->n_seg + k) * 6;
                  const double *qu = ref->Mq_u + 6 * k;
                  double q_lo[3], q_hi[3], x_hi = abs_hi;

                  for (guint j = 0; j < 3; j++)
                    {
                      double l = q[2 * j] + c * qu[2 * j], r = q[2 * j + 1] + c * qu[2 * j + 1];
                      double tol = margin (abs_max (l, r), c * qu[2 * j], ref->M_scale);

                      q_hi[j] = abs_max (l, r) + tol;
                      q_lo[j] = MAX (abs_max (l, r) - tol, 0);
                      x_hi = MAX (x_hi, q_hi[j]);
                    }
                  if (abs_lo > 0)
                    Cb_lo = MAX (1.0, 12.5 * abs_lo / (2.5 * abs_lo + 3 * q_hi[0] + 4 * q_hi[1] +
                                                       3 * q_hi[2]) * (1 - BOUND_MARGIN));
                  if (x_hi > 0)
                    Cb_hi = MAX (1.0, 12.5 * x_hi / (2.5 * x_hi + 3 * q_lo[0] + 4 * q_lo[1] +
                                                     3 * q_lo[2]) * (1 + BOUND_MARGIN));
                  if (!(Cb_lo >= 1 && Cb_hi >= Cb_lo && isfinite (Cb_hi)))
                    goto unbounded;
                }
              trb_design_steel_flexure_at (&prep, ref->seg[k + 1] - ref->seg[k], Cb_lo, &flex);
              cap_lo = lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B;
              trb_design_steel_flexure_at (&prep, ref->seg[k + 1] - ref->seg[k], Cb_hi, &flex);
              cap_hi = lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B;
              if (!(cap_lo > 0 && cap_hi >= cap_lo))
                goto unbounded;
              if (m->bracing == TRB_BRACING_POINTS)
                share_max (&sh->str_lo[0][i], &sh->str_hi[0][i], abs_lo / cap_hi,
                           abs_hi / cap_lo);
              else
                share_max (&sh->str_lo[0][i], &sh->str_hi[0][i],
                           MAX (pos_lo / cap_b, neg_lo / cap_hi),
                           MAX (pos_hi / cap_b, neg_hi / cap_lo));
            }
          sh->max_lo = MAX (sh->max_lo, sh->str_lo[0][i]);
          if (reject && sh->max_lo > 1 + BOUND_MARGIN)
            return TRUE;
        }
    }
  else if (ref->wood && wood_grade != NULL)
    {
      TrbDesignInput input;
      g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
      TrbWoodOptions options;
      double S = isfinite (section->Sx) && section->Sx > 0 ? section->Sx
                                                           : section->b * section->d *
                                                             section->d / 6;

      if (!(section->b > 0 && section->d > 0))
        goto unbounded;
      member_design_input (m, in, ref->beam, brace_x, &input);
      input.section = section;
      trb_solve_priv_wood_options_for (m, in, &options);
      sh->keep_all_strength = TRUE;
      for (guint i = 0; i < ref->n_str; i++)
        {
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          double CD = trb_design_wood_cd (ref->factors + i * TRB_N_CASES);

          /* flexure (NDS 2018 3.3.1): each sign of moment on each segment, against Fb' */
          for (guint k = 0; k < ref->n_seg; k++)
            {
              const double *Ms = ref->M_seg + (i * ref->n_seg + k) * 4;
              const double *u = ref->M_u_seg + 2 * k;
              double max_lo, max_hi, min_lo, min_hi;

              bound_max (Ms[0], Ms[1], u[0], u[1], c, ref->M_scale, &max_lo, &max_hi);
              bound_min (Ms[2], Ms[3], u[0], u[1], c, ref->M_scale, &min_lo, &min_hi);
              for (int sign = 0; sign < 2; sign++)
                {
                  double lo = sign == 0 ? max_lo : -min_hi;
                  double hi = sign == 0 ? max_hi : -min_lo;
                  double fb_lo, fb_hi;

                  if (!(hi > 0))
                    continue;   /* no moment of this sign there */
                  trb_design_wood_fb_range (&input, wood_grade, &options, CD,
                                            ref->seg[k + 1] - ref->seg[k], sign == 1, &fb_lo,
                                            &fb_hi);
                  if (!(fb_hi > 0))
                    share_max (&sh->str_lo[0][i], &sh->str_hi[0][i], lo > 0 ? INFINITY : 0,
                               INFINITY);
                  else
                    share_max (&sh->str_lo[0][i], &sh->str_hi[0][i], MAX (lo, 0) / S / fb_hi,
                               hi / S / fb_lo);
                }
            }
        }
    }
  else
    goto unbounded;
  bounded = TRUE;

unbounded:
  /* deflection after strength: of the candidates past the live load's one number most fail
   * in strength. The verdict is the same in either order: a candidate is rejected when some
   * check's lower bound is above 1 (even where strength cannot be bounded), left to its
   * analysis when strength cannot be bounded and nothing rejects it, and bounded in full
   * otherwise */
  sh->live_checked = live_limit > 0 && ref->n_spans > 0;
  sh->total_checked = total_limit > 0 && ref->n_spans > 0;
  for (guint i = 0; sh->live_checked && i < ref->n_live; i++)
    for (guint j = 0; j < ref->n_spans; j++)
      {
        double cap = ref->spans[j].judged / live_limit;
        double d = ref->d_live[i * ref->n_spans + j] * k_EI;
        double tol = margin (d, 0, ref->D_scale * k_EI);

        share_max (&sh->live_lo[i], &sh->live_hi[i], MAX (d - tol, 0) / cap, (d + tol) / cap);
      }
  for (guint i = 0; sh->total_checked && i < ref->n_total; i++)
    for (guint j = 0; j < ref->n_spans; j++)
      {
        const double *d = ref->d_total + 3 * (i * ref->n_spans + j);
        double c = ref->fD_total[i] * dw;
        double cap = ref->spans[j].judged / total_limit;
        double at = fabs (d[1] + c * d[2]);
        double hi = d[0] * ref->EI + fabs (c) * ref->D_u[j];
        double tol = margin (hi, at, ref->D_scale * ref->EI);

        share_max (&sh->total_lo[i], &sh->total_hi[i], MAX (at - tol, 0) / EI / cap,
                   (hi + tol) / EI / cap);
      }

  for (guint i = 0; i < ref->n_live; i++)
    sh->max_lo = MAX (sh->max_lo, sh->live_lo[i]);
  for (guint i = 0; i < ref->n_total; i++)
    sh->max_lo = MAX (sh->max_lo, sh->total_lo[i]);
  if (reject && sh->max_lo > 1 + BOUND_MARGIN)
    return TRUE;
  if (!bounded)
    return FALSE;

  for (guint i = 0; i < ref->n_str; i++)
    sh->max_lo = MAX (sh->max_lo, MAX (sh->str_lo[0][i], sh->str_lo[1][i]));
  sh->max_hi = sh->keep_all_strength ? INFINITY : 0;
  for (guint i = 0; i < ref->n_str; i++)
    sh->max_hi = MAX (sh->max_hi, MAX (sh->str_hi[0][i], sh->str_hi[1][i]));
  for (guint i = 0; sh->live_checked && i < ref->n_live; i++)
    sh->max_hi = MAX (sh->max_hi, sh->live_hi[i]);
  for (guint i = 0; sh->total_checked && i < ref->n_total; i++)
    sh->max_hi = MAX (sh->max_hi, sh->total_hi[i]);

  /* a bound that is not a number bounds nothing */
  for (guint i = 0; i < ref->n_str; i++)
    if (isnan (sh->str_lo[0][i] + sh->str_hi[0][i] + sh->str_lo[1][i] + sh->str_hi[1][i]))
      return FALSE;
  for (guint i = 0; i < ref->n_live; i++)
    if (isnan (sh->live_lo[i] + sh->live_hi[i]))
      return FALSE;
  for (guint i = 0; i < ref->n_total; i++)
    if (isnan (sh->total_lo[i] + sh->total_hi[i]))
      return FALSE;
  return !isnan (sh->max_lo);
}

/* The entries whose upper bound reaches the largest lower bound: among them is every entry
 * that can give the check its value. */
static void
keep_reaching (const double *lo,
               const double *hi,
               guint         n,
               gboolean     *keep)
{
  double L = 0;

  for (guint i = 0; i < n; i++)
    L = MAX (L, lo[i]);
  for (guint i = 0; i < n; i++)
    if (hi[i] >= L)
      keep[i] = TRUE;
}

/* ---- sizing: a guess at the section chosen -------------------------------------------------
 *
 * Every bound comes from one analysis with every combination (the reference), and the chosen
 * section needs its full analysis: two analyses a member, unless the reference is the chosen
 * section's full analysis. So sizing first guesses the section it will choose, from the load
 * cases alone (a beam of unit E I, the moments, shears and deflections at the quarter points
 * of each segment and at the point loads, Cb from the quarter points), analyses that one in
 * full and makes it the reference.
 * The guess decides nothing: every candidate is still judged lightest first, the guess by its
 * own full result, the others from the bounds; a wrong guess costs one analysis more. Only for
 * W shapes of the bundled catalog under ASD or LRFD with dead and floor live load alone. */
#define GUESS_DIV 4   /* points a segment is divided by: 4 gives the quarter points */

/* A demand at one point for no self-weight, and how it grows with the self-weight w: d0 +
 * w du (the largest of a set at w = 0, taken where it is). */
typedef struct
{
  double d0, du;
} GuessDemand;

static void
guess_take (GuessDemand *g,
            double       d0,
            double       du)
{
  if (d0 > g->d0)
    {
      g->d0 = d0;
      g->du = du;
    }
}

static const TrbSection *
guess_section (const TrbProject  *project,
               const TrbMember   *m,
               const MemberInput *in,
               const Candidates  *cands)
{
  const TrbSettings *s = &project->settings;
  TrbMethod method = trb_member_get_method (m, s);
  gboolean lrfd = method == TRB_METHOD_LRFD;
  const TrbSteelGrade *grade;
  double live_limit = trb_member_get_deflection_live (m, s);
  double total_limit = trb_member_get_deflection_total (m, s);
  g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) regions = NULL;
  g_autoptr(GArray) patterns = NULL;
  TrbBeam *beam = NULL;
  TrbBeamResult *parts[2 + TRB_PATTERN_MAX_REGIONS] = { NULL };
  TrbDesignInput input;
  TrbDeflectionSpan *spans = NULL;
  double *seg = NULL, *x = NULL;
  int *span_of = NULL;
  gboolean *free_end = NULL;
  TrbBeamValues *vals = NULL;   /* part i at point k: vals[i * n_pts + k] */
  TrbBeamValues vals_stack[192], *vals_heap = NULL;
  double *lp = NULL;            /* live load of pattern p at point k: M, V, v */
  double lp_stack[768], *lp_heap = NULL;
  double *f_span = NULL;
  GuessDemand *hog = NULL, *total = NULL, sag = { 0, 0 }, shear = { 0, 0 };
  double *hog_cb = NULL;          /* hogging demand and Cb of each strength entry on each
                                   * segment: hog[e * n_seg + k] */
  guint n_seg = 0, n_spans, n_pts, n_grid, n_regions, n_parts, n_str = 0, e_str = 0;
  gboolean has_case[TRB_N_CASES] = { FALSE };
  const TrbSection *guess = NULL;
  TrbLoad unit = { TRB_LOAD_UNIFORM, 0, in->length, 1.0, 1.0 };
  const GArray *combos[3];
  double live_unit = 0;
  gboolean patterns_built = FALSE;
  gboolean points_braced = m->bracing == TRB_BRACING_POINTS;

  if (m->material != TRB_MATERIAL_STEEL || cands->family == NULL ||
      (method != TRB_METHOD_ASD && method != TRB_METHOD_LRFD) ||
      in->n_loads[TRB_CASE_LR] > 0 || in->n_loads[TRB_CASE_S] > 0 ||
      in->n_loads[TRB_CASE_L] == 0 || in->n_supports == 0)
    return NULL;
  grade = trb_solve_priv_steel_grade_of (m, in, s);
  if (grade == NULL)
    return NULL;
  beam = trb_beam_new (in->length, 1.0, 1.0, in->supports, in->n_supports, NULL);
  if (beam == NULL)
    return NULL;

  /* the parts: dead load (without self-weight), a unit uniform load, live load by region */
  has_case[TRB_CASE_D] = in->n_loads[TRB_CASE_D] > 0 || s->self_weight;
  has_case[TRB_CASE_L] = TRUE;
  {
    guint n_bs;
    const TrbSupport *bs = trb_beam_get_supports (beam, &n_bs);

    regions = trb_regions_build (bs, n_bs, in->length);
  }
  n_regions = regions->len;
  if (s->live_patterns && n_regions > 1 && n_regions <= TRB_PATTERN_MAX_REGIONS)
    {
      GArray **split = trb_loads_split (in->loads[TRB_CASE_L], in->n_loads[TRB_CASE_L],
                                        (const TrbRegion *) regions->data, n_regions);

      patterns = trb_patterns_build ((const TrbRegion *) regions->data, n_regions, "L");
      patterns_built = TRUE;
      for (guint reg = 0; reg < n_regions; reg++)
        parts[2 + reg] = trb_beam_solve (beam, (const TrbLoad *) split[reg]->data,
                                         split[reg]->len, NULL);
      trb_loads_split_free (split, n_regions);
    }
  else
    {
      TrbPattern all = { "", 1 };

      n_regions = 1;
      patterns = g_array_new (FALSE, FALSE, sizeof (TrbPattern));
      g_array_append_val (patterns, all);
      parts[2] = trb_beam_solve (beam, in->loads[TRB_CASE_L], in->n_loads[TRB_CASE_L], NULL);
    }
  parts[0] = trb_beam_solve (beam, in->loads[TRB_CASE_D], in->n_loads[TRB_CASE_D], NULL);
  parts[1] = trb_beam_solve (beam, &unit, 1, NULL);
  n_parts = 2 + n_regions;
  for (guint i = 0; i < n_parts; i++)
    if (parts[i] == NULL)
      goto out;

  /* the quarter points of each flexure segment, the ends on their own side */
  member_design_input (m, in, beam, brace_x, &input);
  seg = g_new (double, 2 + input.n_supports + input.n_braces);
  n_seg = trb_design_steel_segment_points (&input, seg);
  if (n_seg < 2)
    goto out;
  n_seg--;
  spans = g_new0 (TrbDeflectionSpan, input.n_supports + 1);
  n_spans = trb_design_deflection_spans (&input, spans, input.n_supports + 1);
  /* the grid, then the point loads, where the moment peaks between grid points */
  n_grid = n_seg * (GUESS_DIV + 1);
  n_pts = n_grid;
  x = g_new (double, n_grid + in->n_loads[TRB_CASE_D] + in->n_loads[TRB_CASE_L]);
  for (guint k = 0; k < n_seg; k++)
    for (guint j = 0; j <= GUESS_DIV; j++)
      x[k * (GUESS_DIV + 1) + j] = seg[k] + (seg[k + 1] - seg[k]) * j / GUESS_DIV;
  for (guint c = TRB_CASE_D; c <= TRB_CASE_L; c++)
    for (guint i = 0; i < in->n_loads[c]; i++)
      if (in->loads[c][i].kind == TRB_LOAD_POINT && in->loads[c][i].a > 0 &&
          in->loads[c][i].a < in->length)
        x[n_pts++] = in->loads[c][i].a;
  /* the span each point is in, for the deflection checks; -1: none */
  span_of = g_new (int, n_pts);
  for (guint at = 0; at < n_pts; at++)
    {
      span_of[at] = -1;
      for (guint sp = 0; sp < n_spans && span_of[at] < 0; sp++)
        if (x[at] >= spans[sp].a && x[at] <= spans[sp].b)
          span_of[at] = sp;
    }
  if (n_parts * n_pts <= G_N_ELEMENTS (vals_stack))
    vals = vals_stack;
  else
    vals = vals_heap = g_new (TrbBeamValues, n_parts * n_pts);
  for (guint at = 0; at < n_pts; at++)
    for (guint i = 0; i < n_parts; i++)
      trb_beam_result_eval (parts[i], x[at],
                            at < n_grid && at % (GUESS_DIV + 1) == GUESS_DIV ? TRB_SIDE_LEFT
                                                                             : TRB_SIDE_RIGHT,
                            &vals[i * n_pts + at]);
  /* on the stack where it fits (a 3-span member: 441 values) */
  if (3 * patterns->len * n_pts <= G_N_ELEMENTS (lp_stack))
    {
      lp = lp_stack;
      memset (lp, 0, 3 * patterns->len * n_pts * sizeof (double));
    }
  else
    lp = lp_heap = g_new0 (double, 3 * patterns->len * n_pts);
  for (guint p = 0; p < patterns->len; p++)
    {
      guint64 mask = g_array_index (patterns, TrbPattern, p).mask;

      for (guint reg = 0; reg < n_regions; reg++)
        if ((mask >> reg) & 1)
          for (guint k = 0; k < n_pts; k++)
            {
              const TrbBeamValues *v = &vals[(2 + reg) * n_pts + k];
              double *o = lp + 3 * (p * n_pts + k);

              o[0] += v->M;
              o[1] += v->V;
              o[2] += v->defl;
            }
    }

  /* the largest demands at w = 0 of every combination and pattern, where they are */
  combos[0] = trb_solve_priv_combos_for (lrfd ? TRB_COMBO_SET_LRFD : TRB_COMBO_SET_ASD, has_case);
  combos[1] = trb_solve_priv_combos_for (TRB_COMBO_SET_LIVE, has_case);
  combos[2] = trb_solve_priv_combos_for (TRB_COMBO_SET_TOTAL, has_case);
  for (guint i = 0; i < combos[0]->len; i++)
    n_str += g_array_index (combos[0], TrbCombo, i).factors[TRB_CASE_L] != 0 ? patterns->len : 1;
  free_end = g_new (gboolean, n_seg);
  for (guint k = 0; k < n_seg; k++)
    free_end[k] = trb_design_steel_free_end (&input, seg[k], seg[k + 1]);
  /* each span's limits over its judged length: live, total */
  f_span = g_new (double, 2 * n_spans + 1);
  for (guint sp = 0; sp < n_spans; sp++)
    {
      f_span[2 * sp] = live_limit / spans[sp].judged;
      f_span[2 * sp + 1] = total_limit / spans[sp].judged;
    }
  hog = g_new0 (GuessDemand, n_str * n_seg);
  hog_cb = g_new (double, n_str * n_seg);
  total = g_new0 (GuessDemand, n_spans);
  for (guint set = 0; set < 3; set++)
    for (guint i = 0; i < combos[set]->len; i++)
      {
        const TrbCombo *combo = &g_array_index (combos[set], TrbCombo, i);
        double fD = combo->factors[TRB_CASE_D], fL = combo->factors[TRB_CASE_L];

        for (guint p = 0; p < (fL != 0 ? patterns->len : 1); p++, e_str += set == 0)
          {
            const double *lpp = lp + 3 * p * n_pts;

            if (set != 0)
              {
                /* the deflections: at every point in a span, in order */
                for (guint at = 0; at < n_pts; at++)
                  {
                    int sp = span_of[at];
                    double v, f;

                    if (sp < 0)
                      continue;
                    v = fD * vals[at].defl + fL * lpp[3 * at + 2];
                    f = f_span[2 * sp + set - 1];
                    if (set == 1)
                      live_unit = MAX (live_unit, fabs (v) * f);
                    else
                      guess_take (&total[sp], fabs (v) * f,
                                  copysign (fD * vals[n_pts + at].defl, v) * f);
                  }
                continue;
              }

            /* the segments' grids, then the point loads as a last "segment" */
            for (guint k = 0; k <= n_seg; k++)
              {
                guint first = k < n_seg ? k * (GUESS_DIV + 1) : n_grid;
                guint end = k < n_seg ? first + GUESS_DIV + 1 : n_pts;
                double neg = 0, du_neg = 0, m_abs = 0, q[3] = { 0, 0, 0 };

                for (guint at = first; at < end; at++)
                  {
                    guint j = at - first;
                    const double *l = lpp + 3 * at;
                    const TrbBeamValues *d = &vals[at], *u = &vals[n_pts + at];
                    double M = fD * d->M + fL * l[0];
                    double V = fD * d->V + fL * l[1];
                    /* braced at points: |M| meets Lb and Cb; else hogging does */
                    double h = points_braced ? fabs (M) : -M;

                    guess_take (&sag, points_braced ? 0 : M, fD * u->M);
                    guess_take (&shear, fabs (V), copysign (fD * u->V, V));
                    if (h > neg)
                      {
                        neg = h;
                        du_neg = points_braced ? copysign (fD * u->M, M) : -fD * u->M;
                      }
                    m_abs = MAX (m_abs, fabs (M));
                    if (k < n_seg && j > 0 && j < GUESS_DIV && j % (GUESS_DIV / 4) == 0)
                      q[j / (GUESS_DIV / 4) - 1] = M;
                  }
                if (k < n_seg)
                  {
                    hog[e_str * n_seg + k].d0 = neg;
                    hog[e_str * n_seg + k].du = du_neg;
                    hog_cb[e_str * n_seg + k] = free_end[k] ? 1.0
                                                : trb_design_steel_cb (m_abs, q[0], q[1], q[2]);
                  }
              }
          }
      }
  if (!(live_limit > 0))
    live_unit = 0;

  /* the lightest candidate those demands pass */
  for (guint c = 0; c < cands->n_family && guess == NULL; c++)
    {
      const TrbSection *section = &cands->family[c];
      double w = s->self_weight ? section->weight : 0;
      double EI = grade->E * section->Ix;
      double worst;
      TrbSteelFlexure flex;
      TrbSteelFlexurePrep prep;
      TrbSteelShear sh;

      if (!candidate_allowed (m, section) || section->kind != TRB_SHAPE_W ||
          !(EI > 0) || live_unit / EI > 1)
        continue;
      worst = 0;
      for (guint sp = 0; total_limit > 0 && sp < n_spans; sp++)
        worst = MAX (worst, fabs (total[sp].d0 + w * total[sp].du) / EI);
      if (worst > 1 || !trb_design_steel_flexure_prepare (section, grade, &prep) ||
          !trb_design_steel_flexure_at (&prep, 0, 1, &flex) ||
          !trb_design_steel_shear (section, grade, &sh))
        continue;
      worst = MAX (worst, (sag.d0 + w * sag.du) /
                          (lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B));
      worst = MAX (worst, fabs (shear.d0 + w * shear.du) /
                          (lrfd ? sh.phi * sh.Vn : sh.Vn / sh.omega));
      /* Mn grows as Cb times Mn at Cb = 1, up to the braced Mn (F2, F3) */
      {
        double Mn0 = flex.Mn;

        for (guint k = 0; k < n_seg && worst <= 1; k++)
          {
            if (!trb_design_steel_flexure_at (&prep, seg[k + 1] - seg[k], 1, &flex))
              {
                worst = INFINITY;
                break;
              }
            for (guint e = 0; e < n_str; e++)
              {
                const GuessDemand *h = &hog[e * n_seg + k];
                double Mn = MIN (hog_cb[e * n_seg + k] * flex.Mn, Mn0);

                if (h->d0 > 0)
                  worst = MAX (worst, (h->d0 + w * h->du) /
                                      (lrfd ? TRB_STEEL_PHI_B * Mn : Mn / TRB_STEEL_OMEGA_B));
              }
          }
      }
      if (worst <= 1)
        guess = section;
    }

out:
  /* what the first analysis would solve again, to restiffen: the regions, the patterns and
   * live load on each region (where patterns are formed: built as trb_solve_priv_analyse()
   * builds them), the unit load */
  if (in->plan != NULL && !in->plan->ready && in->plan->seed_regions == NULL &&
      regions != NULL && parts[1] != NULL)
    {
      MemberPlan *plan = in->plan;
      gboolean live = patterns_built;

      for (guint reg = 0; live && reg < n_regions; reg++)
        live = parts[2 + reg] != NULL;
      plan->seed_regions = g_array_ref (regions);
      plan->seed_unit = g_steal_pointer (&parts[1]);
      if (live)
        {
          plan->seed_patterns = g_array_ref (patterns);
          plan->seed_live = g_new (TrbBeamResult *, n_regions);
          for (guint reg = 0; reg < n_regions; reg++)
            plan->seed_live[reg] = g_steal_pointer (&parts[2 + reg]);
          plan->n_seed_live = n_regions;
        }
    }
  for (guint i = 0; i < G_N_ELEMENTS (parts); i++)
    g_clear_pointer (&parts[i], trb_beam_result_free);
  trb_beam_free (beam);
  g_free (spans);
  g_free (seg);
  g_free (x);
  g_free (span_of);
  g_free (free_end);
  g_free (vals_heap);
  g_free (lp_heap);
  g_free (hog);
  g_free (hog_cb);
  g_free (f_span);
  g_free (total);
  return guess;
}

typedef enum
{
  VERDICT_UNDECIDED,  /* analyse it in full (or certainly passing, as the first to pass) */
  VERDICT_REJECTED,   /* certainly fails: not analysed */
  VERDICT_DECIDED,    /* status (pass or fail), ratio and governing as the full analysis */
} VerdictKind;

typedef struct
{
  TrbStatus status;
  double    ratio;
  char      governing[40];
} Verdict;

static VerdictKind
judge_candidate (const Reference   *ref,
                 const TrbProject  *project,
                 const TrbMember   *m,
                 const MemberInput *in,
                 const TrbSection  *section,
                 gboolean           reject,
                 gboolean           full_if_passing,
                 Verdict           *v)
{
  const TrbWoodGrade *wood_grade;
  double E;
  Shares sh;
  Lean lean = { { NULL } };
  g_autofree gboolean *keep = NULL;
  SpanExtremes sx = { NULL };
  TrbMemberResult *r;
  VerdictKind kind = VERDICT_UNDECIDED;

  if (!section_stiffness (project, m, in, section, &E, &wood_grade))
    return VERDICT_UNDECIDED;
  if (!candidate_shares (ref, project, m, in, section, E, wood_grade, reject, &sh))
    {
      return VERDICT_UNDECIDED;
    }
  if (reject && sh.max_lo > 1 + BOUND_MARGIN)
    return VERDICT_REJECTED;
  /* certainly passing, and to be analysed in full anyway */
  if (full_if_passing && sh.max_hi < 1 - BOUND_MARGIN)
    return VERDICT_UNDECIDED;

  keep = g_new0 (gboolean, ref->n_str + ref->n_live + ref->n_total + 1);
  if (sh.keep_all_strength)
    for (guint i = 0; i < ref->n_str; i++)
      keep[i] = TRUE;
  else
    for (guint k = 0; k < 2; k++)
      keep_reaching (sh.str_lo[k], sh.str_hi[k], ref->n_str, keep);
  if (sh.live_checked)
    keep_reaching (sh.live_lo, sh.live_hi, ref->n_live, keep + ref->n_str);
  if (sh.total_checked)
    keep_reaching (sh.total_lo, sh.total_hi, ref->n_total, keep + ref->n_str + ref->n_live);
  lean.keep[0] = keep;
  lean.keep[1] = keep + ref->n_str;
  lean.keep[2] = keep + ref->n_str + ref->n_live;

  r = trb_solve_priv_member_result_new (project, m);
  if (trb_solve_priv_analyse (project, in, E, section->Ix,
                              project->settings.self_weight ? section->weight : 0, r, &sx, &lean))
    {
      trb_solve_priv_design_checks (project, m, in, section, wood_grade, &sx, TRUE, r);
      if (r->status == TRB_STATUS_PASS || r->status == TRB_STATUS_FAIL)
        {
          v->status = r->status;
          v->ratio = r->ratio;
          g_strlcpy (v->governing, r->governing, sizeof v->governing);
          kind = VERDICT_DECIDED;
        }
    }
  trb_solve_priv_span_extremes_clear (&sx);
  trb_member_result_free (r);
  return kind;
}

/* The first candidate judged: analysed with every combination (without envelopes or text),
 * its verdict, and the reference for the others. With reject, a section of the bundled
 * catalog whose own bounds say it certainly fails is rejected without its checks (the
 * lightest section mostly fails by far): its checks would say fail, since a live deflection
 * or strength ratio above 1 makes the status fail and the bundled sections' values are far
 * from any overflow that would make it an error; and should nothing pass, sizing runs again
 * without rejecting, which checks it. */
static VerdictKind
reference_candidate (Reference         *ref,
                     const TrbProject  *project,
                     const TrbMember   *m,
                     const MemberInput *in,
                     const TrbSection  *section,
                     gboolean           reject,
                     gboolean           bundled,
                     Verdict           *v)
{
  const TrbWoodGrade *wood_grade;
  double E;
  Lean lean = { { NULL } };
  SpanExtremes sx = { NULL };
  TrbMemberResult *r;
  VerdictKind kind = VERDICT_UNDECIDED;

  if (!section_stiffness (project, m, in, section, &E, &wood_grade))
    return VERDICT_UNDECIDED;
  r = trb_solve_priv_member_result_new (project, m);
  if (trb_solve_priv_analyse (project, in, E, section->Ix,
                              project->settings.self_weight ? section->weight : 0, r, &sx, &lean))
    {
      if (reject && bundled)
        {
          Shares sh;

          if (!reference_init (ref, project, m, in, r, &sx))
            reference_clear (ref);
          else if (candidate_shares (ref, project, m, in, section, E, wood_grade, TRUE, &sh) &&
                   sh.max_lo > 1 + BOUND_MARGIN)
            {
              trb_solve_priv_span_extremes_clear (&sx);
              trb_member_result_free (r);
              return VERDICT_REJECTED;
            }
        }
      trb_solve_priv_design_checks (project, m, in, section, wood_grade, &sx, TRUE, r);
      /* the reference made above, or made now, is kept only beside a verdict */
      if ((r->status == TRB_STATUS_PASS || r->status == TRB_STATUS_FAIL) &&
          (ref->ready || reference_init (ref, project, m, in, r, &sx)))
        {
          v->status = r->status;
          v->ratio = r->ratio;
          g_strlcpy (v->governing, r->governing, sizeof v->governing);
          kind = VERDICT_DECIDED;
        }
      else
        reference_clear (ref);
    }
  trb_solve_priv_span_extremes_clear (&sx);
  trb_member_result_free (r);
  return kind;
}

/* Sizing: every candidate lightest first is analysed with its own self-weight and checked;
 * the passing ones make the shortlist (up to shortlist_max), the lightest is chosen unless
 * the engineer named one. Because each candidate carries its own self-weight, the chosen
 * section is the one its own weight was computed with: nothing is left to iterate. With
 * use_bounds, candidates other than the first analysed are judged from it (see above) and,
 * with reject, those certainly failing are not analysed; should no candidate pass, sizing
 * runs again without rejecting, since the closest one is then reported. Only the section
 * chosen (and the closest, when none passes) is analysed in full for the result.
 * With list_only, only the shortlist is made, into list_only, and NULL returned: the same
 * candidates judged the same way, without the chosen section's full result. */
TrbMemberResult *
trb_solve_priv_size_member (const TrbProject  *project,
                            const TrbMember   *m,
                            const MemberInput *in,
                            const TrbSection  *chosen,
                            guint              shortlist_max,
                            gboolean           use_bounds,
                            gboolean           reject,
                            GArray            *list_only)
{
  Candidates candidates;
  const TrbSection *section;
  MemberInput in_plan = *in;
  MemberPlan plan = { FALSE };
  TrbMemberResult *best = NULL;
  TrbMemberResult *closest = NULL;          /* analysed in full */
  const TrbSection *closest_section = NULL; /* or only judged */
  double closest_ratio = 0;
  g_autoptr(GArray) shortlist = g_array_new (FALSE, TRUE, sizeof (TrbShortlistEntry));
  Reference ref = { FALSE };
  guint rejected = 0;
  gboolean found = FALSE;                   /* the lightest passing section (best) */
  const TrbSection *guess = NULL;           /* analysed in full first: the reference */
  TrbMemberResult *guess_result = NULL;

  /* the analyses of every section share what does not depend on it */
  in_plan.plan = &plan;
  in = &in_plan;
  sizing_candidates (project, m, &candidates);
  /* the guess, analysed in full first, is the reference */
  if (use_bounds && reject && chosen == NULL && list_only == NULL)
    {
      guess = guess_section (project, m, in, &candidates);
      if (guess != NULL)
        {
          SpanExtremes sx = { NULL };

          guess_result = solve_with_section_sx (project, m, in, guess, &sx);
          if (!((guess_result->status == TRB_STATUS_PASS ||
                 guess_result->status == TRB_STATUS_FAIL) &&
                reference_init (&ref, project, m, in, guess_result, &sx)))
            {
              reference_clear (&ref);
              g_clear_pointer (&guess_result, trb_member_result_free);
            }
          trb_solve_priv_span_extremes_clear (&sx);
        }
    }
  /* past the shortlist's length only for the lightest passing section, when it is chosen */
  while ((shortlist->len < shortlist_max || (list_only == NULL && chosen == NULL && !found)) &&
         (section = candidates_next (&candidates)) != NULL)
    {
      TrbMemberResult *c;
      TrbShortlistEntry e = { { 0 } };
      Verdict v;

      if (section == guess && guess_result != NULL)
        {
          /* judged by its full result */
          c = g_steal_pointer (&guess_result);
          if (c->status == TRB_STATUS_PASS)
            {
              g_strlcpy (e.section, section->designation, sizeof e.section);
              e.weight = section->weight;
              e.ratio = c->ratio;
              g_strlcpy (e.governing, c->governing, sizeof e.governing);
              g_array_append_val (shortlist, e);
              if (!found)
                {
                  found = TRUE;
                  best = c;
                  continue;
                }
            }
          else if (closest_section == NULL || c->ratio < closest_ratio)
            {
              g_clear_pointer (&closest, trb_member_result_free);
              closest = c;
              closest_section = section;
              closest_ratio = c->ratio;
              continue;
            }
          trb_member_result_free (c);
          continue;
        }
      if (use_bounds)
        switch (ref.ready ? judge_candidate (&ref, project, m, in, section, reject,
                                             !found && chosen == NULL && list_only == NULL,
                                             &v)
                          : reference_candidate (&ref, project, m, in, section, reject,
                                                 candidates.family != NULL, &v))
          {
          case VERDICT_REJECTED:
            rejected++;
            continue;
          case VERDICT_DECIDED:
            if (v.status == TRB_STATUS_PASS)
              {
                g_strlcpy (e.section, section->designation, sizeof e.section);
                e.weight = section->weight;
                e.ratio = v.ratio;
                g_strlcpy (e.governing, v.governing, sizeof e.governing);
                g_array_append_val (shortlist, e);
                if (!found && chosen == NULL)
                  {
                    found = TRUE;
                    if (list_only == NULL)
                      {
                        best = solve_with_section (project, m, in, section);
                        g_warn_if_fail (best->status == TRB_STATUS_PASS &&
                                        best->ratio == v.ratio);
                      }
                  }
              }
            else if (chosen == NULL && (closest_section == NULL || v.ratio < closest_ratio))
              {
                g_clear_pointer (&closest, trb_member_result_free);
                closest_section = section;
                closest_ratio = v.ratio;
              }
            continue;
          case VERDICT_UNDECIDED:
          default:
            break;
          }

      c = solve_with_section (project, m, in, section);

      if (c->status == TRB_STATUS_PASS)
        {
          g_strlcpy (e.section, section->designation, sizeof e.section);
          e.weight = section->weight;
          e.ratio = c->ratio;
          g_strlcpy (e.governing, c->governing, sizeof e.governing);
          g_array_append_val (shortlist, e);
          if (!found && chosen == NULL)
            {
              found = TRUE;
              if (list_only == NULL)
                {
                  best = c;
                  continue;
                }
            }
        }
      else if (chosen == NULL && c->status == TRB_STATUS_FAIL &&
               (closest_section == NULL || c->ratio < closest_ratio))
        {
          g_clear_pointer (&closest, trb_member_result_free);
          closest_section = section;
          closest_ratio = c->ratio;
          if (list_only == NULL)
            {
              closest = c;
              continue;
            }
        }
      else if (c->status != TRB_STATUS_FAIL && c->status != TRB_STATUS_PASS && chosen == NULL &&
               !found && closest_section == NULL)
        {
          /* unstable, unsupported or an error: the same for every section */
          if (list_only == NULL)
            best = c;
          else
            trb_member_result_free (c);
          break;
        }
      trb_member_result_free (c);
    }

  candidates_clear (&candidates);
  g_clear_pointer (&guess_result, trb_member_result_free);
  if (list_only != NULL)
    {
      /* nothing passes, or the shortlist is made: the rest is the result's */
      g_clear_pointer (&closest, trb_member_result_free);
      reference_clear (&ref);
      trb_solve_priv_member_plan_clear (&plan);
      g_array_append_vals (list_only, shortlist->data, MIN (shortlist->len, shortlist_max));
      return NULL;
    }

  if (chosen == NULL && best == NULL && rejected > 0)
    {
      /* nothing passes: the closest section may be one the bounds rejected */
      g_clear_pointer (&closest, trb_member_result_free);
      reference_clear (&ref);
      trb_solve_priv_member_plan_clear (&plan);
      in_plan.plan = NULL;
      return trb_solve_priv_size_member (project, m, in, chosen, shortlist_max, use_bounds, FALSE,
                                         NULL);
    }

  if (chosen != NULL)
    best = solve_with_section (project, m, in, chosen);
  else if (best == NULL && closest_section != NULL)
    {
      best = closest != NULL ? g_steal_pointer (&closest)
                             : solve_with_section (project, m, in, closest_section);
      trb_solve_priv_set_status (best, TRB_STATUS_FAIL, "no section of the catalog passes; the "
                                 "closest is %s (%s ratio %.2f)", best->section, best->governing,
                                 best->ratio);
    }
  else if (best == NULL)
    {
      best = trb_solve_priv_member_result_new (project, m);
      g_strlcpy (best->section, m->section, sizeof best->section);
      trb_solve_priv_set_status (best, TRB_STATUS_NOT_DESIGNED, "no catalog section fits the "
                                 "member's limits (family, depth, plies, allowed list)");
    }
  g_clear_pointer (&closest, trb_member_result_free);
  reference_clear (&ref);
  trb_solve_priv_member_plan_clear (&plan);
  g_array_append_vals (best->shortlist, shortlist->data, MIN (shortlist->len, shortlist_max));
  return best;
}

/* Keeps what was analysed with the result, for the reader (diagrams, the loading sketch). */
static void
record_input (TrbMemberResult   *r,
              const MemberInput *in)
{
  if (!r->analysed)
    return;
  r->supports = g_array_sized_new (FALSE, FALSE, sizeof (TrbSupport), in->n_supports);
  g_array_append_vals (r->supports, in->supports, in->n_supports);
  {
    guint n = 0;

    /* room for all at once: the array does not grow load by load */
    for (guint c = 0; c < TRB_N_CASES; c++)
      n += in->n_loads[c];
    r->loads = g_array_sized_new (FALSE, TRUE, sizeof (TrbMemberLoad), n);
  }
  for (guint c = 0; c < TRB_N_CASES; c++)
    for (guint i = 0; i < in->n_loads[c]; i++)
      {
        TrbMemberLoad ml = { c, in->loads[c][i], 0 };

        g_array_append_val (r->loads, ml);
      }
}

/* Keeps what the member was sized on, for trb_solve_member_shortlist(). */
static void
record_sizing (TrbMemberResult   *r,
               const MemberInput *in)
{
  struct _TrbMemberSizing *sz = g_rc_box_new0 (struct _TrbMemberSizing);

  sz->length = in->length;
  sz->supports = g_array_sized_new (FALSE, FALSE, sizeof (TrbSupport), in->n_supports);
  g_array_append_vals (sz->supports, in->supports, in->n_supports);
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      sz->loads[c] = g_array_sized_new (FALSE, FALSE, sizeof (TrbLoad), in->n_loads[c]);
      g_array_append_vals (sz->loads[c], in->loads[c], in->n_loads[c]);
    }
  sz->repetitive_spacing = in->repetitive_spacing;
  r->sizing = sz;
}

/* Whether trb_solve_priv_analyse() without E and I finds nothing wrong: the member is supported
 * and its beam can be made (it is no mechanism and its supports are valid) */
static gboolean
beam_possible (const MemberInput *in)
{
  TrbBeam *beam;

  if (in->n_supports == 0)
    return FALSE;
  beam = trb_beam_new (in->length, 1.0, 1.0, in->supports, in->n_supports, NULL);
  if (beam == NULL)
    return FALSE;
  trb_beam_free (beam);
  return TRUE;
}

/* Analyses and designs one member on the given supports and loads. */
TrbMemberResult *
trb_solve_priv_solve_input (const TrbProject  *project,
                            const TrbMember   *member,
                            const MemberInput *in,
                            guint              shortlist_max,
                            gboolean           use_bounds)
{
  TrbMemberResult *r;
  TrbSection section;
  double self_weight = 0;
  SpanExtremes sx = { NULL };

  if (!trb_member_is_custom (member))
    {
      const TrbSection *chosen = NULL;

      /* Stability and support do not depend on the section: say so once, not per section
       * (trb_solve_priv_analyse() without E and I; a beam that can be made is all it would find) */
      if (!beam_possible (in))
        {
          r = trb_solve_priv_member_result_new (project, member);
          g_strlcpy (r->section, member->section, sizeof r->section);
          if (!trb_solve_priv_analyse (project, in, NAN, NAN, 0, r, NULL, NULL) &&
              r->status != TRB_STATUS_NOT_DESIGNED)
            return r;
          trb_member_result_free (r);
        }

      if (!trb_member_is_auto (member))
        {
          chosen = trb_solve_priv_lookup_section (project, member->section);
          if (chosen == NULL)
            {
              r = trb_solve_priv_member_result_new (project, member);
              g_strlcpy (r->section, member->section, sizeof r->section);
              trb_solve_priv_set_status (r, TRB_STATUS_ERROR,
                                         "unknown section \"%s\": not in the catalog",
                                         member->section);
              return r;
            }
        }
      r = trb_solve_priv_size_member (project, member, in, chosen, shortlist_max, use_bounds,
                                      use_bounds, NULL);
      record_input (r, in);
      record_sizing (r, in);
      return r;
    }

  r = trb_solve_priv_member_result_new (project, member);
  if (!project->settings.self_weight)
    g_ptr_array_add (r->notes, g_strdup ("self-weight excluded by the project settings"));
  else
    self_weight = custom_self_weight (member, r->notes);
  custom_section (member, self_weight, &section);
  if (trb_solve_priv_analyse (project, in, member->E, member->I, self_weight, r, &sx, NULL))
    trb_solve_priv_design_checks (project, member, in, &section, NULL, &sx, FALSE, r);
  trb_solve_priv_span_extremes_clear (&sx);
  record_input (r, in);
  return r;
}

/* A standalone beam's input: its own supports and loads, from its file. The arrays are
 * owned by the caller. */
void
trb_solve_priv_standalone_input (const TrbMember *member,
                                 MemberInput     *in,
                                 GArray          *supports,
                                 GArray         **loads)
{
  guint n[TRB_N_CASES] = { 0 };

  memset (in, 0, sizeof *in);
  in->member = member;
  in->length = member->length;
  in->repetitive_spacing = NAN;
  /* each array sized once and filled in place, in the member's order */
  g_array_set_size (supports, member->supports->len);
  for (guint i = 0; i < member->supports->len; i++)
    g_array_index (supports, TrbSupport, i) =
      g_array_index (member->supports, TrbMemberSupport, i).support;
  in->supports = (const TrbSupport *) supports->data;
  in->n_supports = supports->len;
  for (guint i = 0; i < member->loads->len; i++)
    n[g_array_index (member->loads, TrbMemberLoad, i).lcase]++;
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      g_array_set_size (loads[c], n[c]);
      n[c] = 0;
    }
  for (guint i = 0; i < member->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (member->loads, TrbMemberLoad, i);

      g_array_index (loads[ml->lcase], TrbLoad, n[ml->lcase]++) = ml->load;
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      in->loads[c] = (const TrbLoad *) loads[c]->data;
      in->n_loads[c] = loads[c]->len;
    }
}

TrbMemberResult *
trb_solve_priv_solve_standalone (const TrbProject *project,
                                 const TrbMember  *member,
                                 guint             shortlist_max,
                                 gboolean          use_bounds)
{
  g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  GArray *loads[TRB_N_CASES];
  MemberInput in;
  TrbMemberResult *r;
  g_autoptr(Memo) memo = trb_solve_priv_memo_new ();

  for (guint c = 0; c < TRB_N_CASES; c++)
    loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  trb_solve_priv_standalone_input (member, &in, supports, loads);
  in.memo = memo;
  r = trb_solve_priv_solve_input (project, member, &in, shortlist_max, use_bounds);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_unref (loads[c]);
  return r;
}

/* ---- identical members: the cache ------------------------------------------------------- */

/* The cache key: the exact bytes of everything a member's result depends on besides the
 * project's settings (the same for the whole solve). Identical joists of a run give the same
 * bytes; anything else that differs, even by a rounding, gives a miss, never a wrong hit. */
/* The bytes of a key as they are gathered: a few hundred small pieces, each copied in place. */
typedef struct
{
  guint8 *data;
  gsize   len;
  gsize   room;
} Key;

static inline void
key_bytes (Key          *key,
           gconstpointer data,
           gsize         size)
{
  if (size == 0)
    return;   /* an empty array's data may be NULL, which memcpy may not be given */
  if (G_UNLIKELY (key->len + size > key->room))
    {
      key->room = MAX (2 * key->room, key->len + size + 512);
      key->data = g_realloc (key->data, key->room);
    }
  memcpy (key->data + key->len, data, size);
  key->len += size;
}

/* A hash of the key's bytes, eight at a time (g_bytes_hash() takes them one by one): keys
 * run to kilobytes, and are equal only when every byte is. */
static guint
key_hash (gconstpointer bytes)
{
  gsize n;
  const guint8 *p = g_bytes_get_data ((GBytes *) bytes, &n);
  guint64 h = 0x9e3779b97f4a7c15u ^ n;

  for (; n >= 8; p += 8, n -= 8)
    {
      guint64 w;

      memcpy (&w, p, 8);
      h = (h ^ w) * 0xff51afd7ed558ccdu;
      h ^= h >> 32;
    }
  for (; n > 0; p++, n--)
    h = (h ^ *p) * 0x100000001b3u;
  h ^= h >> 29;
  return (guint) (h ^ (h >> 32));
}

static void
key_double (Key        *key,
            double      v)
{
  key_bytes (key, &v, sizeof v);
}

static void
key_int (Key        *key,
         gint64      v)
{
  key_bytes (key, &v, sizeof v);
}

static void
key_string (Key        *key,
            const char *s)
{
  if (s == NULL)
    {
      key_int (key, -1);
      return;
    }
  key_int (key, strlen (s));
  key_bytes (key, s, strlen (s));
}

static void
key_loads (Key           *key,
           const TrbLoad *loads,
           guint          n)
{
  key_int (key, n);
  for (guint i = 0; i < n; i++)
    {
      key_int (key, loads[i].kind);
      key_double (key, loads[i].a);
      key_double (key, loads[i].b);
      key_double (key, loads[i].w1);
      key_double (key, loads[i].w2);
    }
}

/* The key gathered into key (emptied first, its room kept); extra: bytes the caller adds (the
 * floor's live load streams), or NULL. */
static void
member_key_gather (Key               *key,
                   const TrbMember   *m,
                   const MemberInput *in,
                   guint              shortlist_max,
                   const Key         *extra)
{
  key->len = 0;
  key_double (key, in->length);
  key_int (key, in->n_supports);
  for (guint i = 0; i < in->n_supports; i++)
    {
      key_double (key, in->supports[i].x);
      key_int (key, in->supports[i].type);
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    key_loads (key, in->loads[c], in->n_loads[c]);
  key_double (key, in->repetitive_spacing);
  key_int (key, shortlist_max);

  key_int (key, m->material);
  key_string (key, m->section);
  key_double (key, m->E);
  key_double (key, m->I);
  key_double (key, m->S);
  key_double (key, m->A);
  key_double (key, m->d);
  key_double (key, m->tw);
  key_double (key, m->weight);
  key_int (key, m->has_method);
  key_int (key, m->method);
  key_double (key, m->fb_allow);
  key_double (key, m->fv_allow);
  key_string (key, m->steel_grade);
  key_double (key, m->deflection_live);
  key_double (key, m->deflection_total);
  key_int (key, m->bracing);
  key_int (key, m->braces->len);
  for (guint i = 0; i < m->braces->len; i++)
    key_double (key, g_array_index (m->braces, TrbMemberBrace, i).x);
  key_double (key, m->max_depth);
  key_double (key, m->min_depth);
  key_int (key, m->allowed != NULL ? (gint64) g_strv_length (m->allowed) : -1);
  for (guint i = 0; m->allowed != NULL && m->allowed[i] != NULL; i++)
    key_string (key, m->allowed[i]);
  key_int (key, m->max_plies);
  key_string (key, m->species);
  key_string (key, m->grade);
  key_int (key, m->wet_service);
  key_int (key, m->incised);
  key_int (key, m->repetitive);
  key_double (key, m->bearing_length);
  if (extra != NULL)
    key_bytes (key, extra->data, extra->len);
}

static GBytes *
member_key (const TrbMember   *m,
            const MemberInput *in,
            guint              shortlist_max,
            const Key         *extra)
{
  Key k = { NULL, 0, 0 };

  member_key_gather (&k, m, in, shortlist_max, extra);
  return g_bytes_new_take (k.data, k.len);
}

/* A solved member and what it hands down, per support of its beam (sorted by x) and case:
 * reactions[0] everything but the live load that is never reduced, reactions[1] that live
 * load (case L only). Unreduced. */
typedef struct
{
  TrbMemberResult *result;       /* the entry's own; each member gets a share of it */
  double          *reactions[2];
  guint            n_supports;
  guint64          used;         /* the last solve of a TrbSolveCache that read it */
} CacheEntry;

static void
cache_entry_free (gpointer data)
{
  CacheEntry *e = data;

  g_clear_pointer (&e->result, trb_member_result_free);
  g_free (e->reactions[0]);
  g_free (e->reactions[1]);
  g_free (e);
}

static void reactions_of (const TrbBeam *beam,
                          const TrbLoad *loads,
                          guint          n_loads,
                          TrbLoadCase    c,
                          double        *out);

/* What a solved member hands down: with reduction, the live load that may be reduced and the
 * live load that may not, each unreduced and on its own, so that the members below and the
 * columns can reduce theirs (ASCE 7-16 §4.7: each member reduces its own, the unreduced load
 * goes down). The supports and the loads do not change the reactions with E I (rigid
 * supports, E I constant along the member), so any section's beam gives them. */
static CacheEntry *
cache_entry_new (TrbMemberResult *r,
                 gboolean         reduction,
                 const GArray    *live_a,
                 const GArray    *live_b)
{
  CacheEntry *e = g_new0 (CacheEntry, 1);
  guint n_beam;

  e->result = r;
  if (!r->analysed)
    return e;
  trb_beam_get_supports (r->beam, &n_beam);
  e->n_supports = n_beam;
  e->reactions[0] = g_new0 (double, n_beam * TRB_N_CASES + 1);
  e->reactions[1] = g_new0 (double, n_beam * TRB_N_CASES + 1);
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      const TrbReaction *re;
      guint n;

      if ((c == TRB_CASE_L && reduction) || r->cases[c] == NULL)
        continue;
      /* D with the self-weight: the case result holds it */
      re = trb_beam_result_get_reactions (r->cases[c], &n);
      for (guint i = 0; i < n && i < n_beam; i++)
        e->reactions[0][i * TRB_N_CASES + c] = re[i].force;
    }
  if (reduction)
    {
      reactions_of (r->beam, (const TrbLoad *) live_a->data, live_a->len, TRB_CASE_L,
                    e->reactions[0]);
      reactions_of (r->beam, (const TrbLoad *) live_b->data, live_b->len, TRB_CASE_L,
                    e->reactions[1]);
    }
  return e;
}

/* What a document keeps from one solve to the next (trb_solve_project_cached()): the cache
 * of members by their complete input, and each floor's frame by its plan, read again only
 * under the same context (the settings, the project's own sections and the options), which is
 * not part of the members' keys. An entry not read by the last two solves goes, so that an
 * edit and its undo both find theirs. */
struct _TrbSolveCache
{
  GBytes     *context;
  GHashTable *members;      /* GBytes -> CacheEntry */
  GHashTable *frames;       /* GBytes (a plan) -> FrameEntry */
  Memo       *memo;
  guint64     generation;   /* solves made */
  guint       n_solved;     /* of the last solve: members analysed and designed */
  guint       n_reused;     /* members whose result came from an earlier solve */
  guint       n_frames_new; /* frames made */
};

typedef struct
{
  TrbFrame *frame;
  guint64   used;
} FrameEntry;

typedef struct
{
  const TrbProject      *project;
  const TrbSolveOptions *options;
  GHashTable            *cache;    /* GBytes -> CacheEntry; NULL without the cache */
  Memo                  *memo;
  TrbSolveCache         *keep;     /* NULL when solving from scratch */
} Solver;

/* A member solved here (not read from the cache of an earlier solve). */
static void
solver_count (Solver     *sv,
              CacheEntry *entry,
              gboolean    solved)
{
  if (sv->keep == NULL)
    return;
  if (solved)
    sv->keep->n_solved++;
  else if (entry->used != sv->keep->generation)
    sv->keep->n_reused++;
  entry->used = sv->keep->generation;
}

/* ---- floors ------------------------------------------------------------------------------ */

static double
loads_total (const TrbLoad *loads,
             guint          n)
{
  double sum = 0;

  for (guint i = 0; i < n; i++)
    switch (loads[i].kind)
      {
      case TRB_LOAD_POINT:
        sum += loads[i].w1;
        break;
      case TRB_LOAD_UNIFORM:
        sum += loads[i].w1 * (loads[i].b - loads[i].a);
        break;
      case TRB_LOAD_LINEAR:
        sum += 0.5 * (loads[i].w1 + loads[i].w2) * (loads[i].b - loads[i].a);
        break;
      case TRB_LOAD_MOMENT:
      default:
        break;
      }
  return sum;
}

/* Live load reduction leaves alone: partitions (ASCE 7-16 §4.3.2, the engineer's choice kept
 * conservative), live loads above 100 psf (§4.7.3), passenger vehicle garages (§4.7.4) and
 * assembly uses (§4.7.5). The 20 % those may take on members supporting two or more floors
 * is not taken. */
static gboolean
area_load_reducible (const TrbAreaLoad *al)
{
  g_autofree char *occupancy = NULL;

  if (al->kind == TRB_AREA_LOAD_PARTITION)
    return FALSE;
  if (al->pressure > 100.0 * TRB_PSF * (1 + 1e-9))
    return FALSE;
  if (al->occupancy != NULL)
    {
      occupancy = g_ascii_strdown (al->occupancy, -1);
      if (strstr (occupancy, "garage") != NULL || strstr (occupancy, "parking") != NULL ||
          strstr (occupancy, "assembly") != NULL)
        return FALSE;
    }
  return TRUE;
}

/* The plan of one floor for the frame. With live load reduction, the floor's loads make two
 * streams: stream 0 every load but the live load that is never reduced, stream 1 that live
 * load alone. A plan takes the streams in its mask; stream 1's loads go in case slot b_slot
 * (a slot the floor does not use, so that one frame carries both, or L in a frame of their
 * own). The maps give, for each of the plan's line and point loads, the floor's index. */
typedef struct
{
  TrbFramePlan       plan;
  GArray            *columns;      /* TrbFrameColumn */
  GArray            *walls;        /* TrbFrameWall */
  GArray            *members;      /* TrbFrameMember */
  GArray            *area_loads;   /* TrbFrameAreaLoad */
  GArray            *openings;     /* TrbFrameOpening */
  GArray            *line_loads;   /* TrbFrameLineLoad */
  GArray            *point_loads;  /* TrbFramePointLoad */
  GArray            *line_map;     /* guint */
  GArray            *point_map;    /* guint */
  guint              n_loads;      /* loads of any kind in this stream */
} FloorPlan;

/* Once the frame is made, only the maps are read again (floor_unassigned()): the rest goes
 * before the members are solved (1 MB on 10,000 members, at the solve's peak). The frame
 * keeps nothing of the plan. */
static void
floor_plan_trim (FloorPlan *fp)
{
  g_clear_pointer (&fp->columns, g_array_unref);
  g_clear_pointer (&fp->walls, g_array_unref);
  g_clear_pointer (&fp->members, g_array_unref);
  g_clear_pointer (&fp->area_loads, g_array_unref);
  g_clear_pointer (&fp->openings, g_array_unref);
  g_clear_pointer (&fp->line_loads, g_array_unref);
  g_clear_pointer (&fp->point_loads, g_array_unref);
  memset (&fp->plan, 0, sizeof fp->plan);
}

static void
floor_plan_clear (FloorPlan *fp)
{
  floor_plan_trim (fp);
  g_clear_pointer (&fp->line_map, g_array_unref);
  g_clear_pointer (&fp->point_map, g_array_unref);
}

static guint
load_stream (gboolean    reduction,
             TrbLoadCase lcase,
             gboolean    reducible)
{
  return reduction && lcase == TRB_CASE_L && !reducible ? 1 : 0;
}

static void
floor_plan_init (FloorPlan      *fp,
                 const TrbFloor *floor,
                 gboolean        reduction,
                 guint           mask,
                 TrbLoadCase     b_slot)
{
  memset (fp, 0, sizeof *fp);
  fp->columns = g_array_new (FALSE, TRUE, sizeof (TrbFrameColumn));
  fp->walls = g_array_new (FALSE, TRUE, sizeof (TrbFrameWall));
  fp->members = g_array_new (FALSE, TRUE, sizeof (TrbFrameMember));
  fp->area_loads = g_array_new (FALSE, TRUE, sizeof (TrbFrameAreaLoad));
  fp->openings = g_array_new (FALSE, TRUE, sizeof (TrbFrameOpening));
  fp->line_loads = g_array_new (FALSE, TRUE, sizeof (TrbFrameLineLoad));
  fp->point_loads = g_array_new (FALSE, TRUE, sizeof (TrbFramePointLoad));
  fp->line_map = g_array_new (FALSE, FALSE, sizeof (guint));
  fp->point_map = g_array_new (FALSE, FALSE, sizeof (guint));

  for (guint i = 0; i < floor->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (floor->columns, i);
      TrbFrameColumn fc = { c->id, c->at.x, c->at.y };

      g_array_append_val (fp->columns, fc);
    }
  for (guint i = 0; i < floor->walls->len; i++)
    {
      const TrbWall *w = g_ptr_array_index (floor->walls, i);
      TrbFrameWall fw = { w->id, (const TrbFramePoint *) w->points->data, w->points->len };

      g_array_append_val (fp->walls, fw);
    }
  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (floor->members, i);
      TrbFrameMember fm = { m->id, m->start, m->end, m->role, m->carries_deck,
                            (const TrbFramePoint *) m->bearing_points->data,
                            m->bearing_points->len };

      g_array_append_val (fp->members, fm);
    }
  for (guint i = 0; i < floor->area_loads->len; i++)
    {
      const TrbAreaLoad *al = g_ptr_array_index (floor->area_loads, i);
      guint s = load_stream (reduction, al->lcase, area_load_reducible (al));
      TrbFrameAreaLoad fa = { s == 1 ? b_slot : al->lcase, al->pressure,
                              (const TrbFramePoint *) al->points->data, al->points->len };

      if (!(mask & (1u << s)))
        continue;
      g_array_append_val (fp->area_loads, fa);
      fp->n_loads++;
    }
  for (guint i = 0; i < floor->openings->len; i++)
    {
      const TrbOpening *o = g_ptr_array_index (floor->openings, i);
      TrbFrameOpening fo = { (const TrbFramePoint *) o->points->data, o->points->len };

      g_array_append_val (fp->openings, fo);
    }
  /* Concentrated and line live loads are not reduced (ASCE 7-16 §4.7.1 reduces uniformly
   * distributed live load). */
  for (guint i = 0; i < floor->line_loads->len; i++)
    {
      const TrbLineLoad *ll = g_ptr_array_index (floor->line_loads, i);
      guint s = load_stream (reduction, ll->lcase, FALSE);
      TrbFrameLineLoad fl = { s == 1 ? b_slot : ll->lcase, ll->w,
                              (const TrbFramePoint *) ll->points->data, ll->points->len };

      if (!(mask & (1u << s)))
        continue;
      g_array_append_val (fp->line_loads, fl);
      g_array_append_val (fp->line_map, i);
      fp->n_loads++;
    }
  for (guint i = 0; i < floor->point_loads->len; i++)
    {
      const TrbPointLoad *pl = g_ptr_array_index (floor->point_loads, i);
      guint s = load_stream (reduction, pl->lcase, FALSE);
      TrbFramePointLoad fq = { s == 1 ? b_slot : pl->lcase, pl->P, pl->at.x, pl->at.y };

      if (!(mask & (1u << s)))
        continue;
      g_array_append_val (fp->point_loads, fq);
      g_array_append_val (fp->point_map, i);
      fp->n_loads++;
    }

  fp->plan.columns = (const TrbFrameColumn *) fp->columns->data;
  fp->plan.n_columns = fp->columns->len;
  fp->plan.walls = (const TrbFrameWall *) fp->walls->data;
  fp->plan.n_walls = fp->walls->len;
  fp->plan.members = (const TrbFrameMember *) fp->members->data;
  fp->plan.n_members = fp->members->len;
  fp->plan.area_loads = (const TrbFrameAreaLoad *) fp->area_loads->data;
  fp->plan.n_area_loads = fp->area_loads->len;
  fp->plan.openings = (const TrbFrameOpening *) fp->openings->data;
  fp->plan.n_openings = fp->openings->len;
  fp->plan.line_loads = (const TrbFrameLineLoad *) fp->line_loads->data;
  fp->plan.n_line_loads = fp->line_loads->len;
  fp->plan.point_loads = (const TrbFramePointLoad *) fp->point_loads->data;
  fp->plan.n_point_loads = fp->point_loads->len;
}

static void
wall_result_clear (gpointer data)
{
  TrbWallResult *w = data;

  for (guint c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&w->loads[c], g_array_unref);
}

static void
floor_result_free (gpointer data)
{
  TrbFloorResult *fr = data;

  g_free (fr->error);
  g_clear_pointer (&fr->columns, g_array_unref);
  g_clear_pointer (&fr->walls, g_array_unref);
  g_clear_pointer (&fr->unassigned, g_array_unref);
  g_free (fr);
}

static TrbFloorResult *
floor_result_new (const TrbFloor *floor)
{
  TrbFloorResult *fr = g_new0 (TrbFloorResult, 1);

  fr->floor = floor;
  fr->columns = g_array_new (FALSE, TRUE, sizeof (TrbColumnResult));
  fr->walls = g_array_new (FALSE, TRUE, sizeof (TrbWallResult));
  g_array_set_clear_func (fr->walls, wall_result_clear);
  fr->unassigned = g_array_new (FALSE, TRUE, sizeof (TrbUnassignedLoad));
  return fr;
}

/* A floor member's supports: the frame's (pins where it rests on something) and its own
 * <support>s; an own support within a billionth of the length of a frame support makes it the
 * stronger type there. which[i] is the index of the frame support, or -1 for an own one. */
static void
merge_supports (const TrbMember            *m,
                const TrbFrameMemberResult *fm,
                GArray                     *supports,
                GArray                     *which)
{
  double tol = 1e-9 * MAX (fm->length, 1.0);

  g_array_set_size (supports, 0);
  g_array_set_size (which, 0);
  for (guint s = 0; s < fm->n_supports; s++)
    {
      int w = s;

      g_array_append_val (supports, fm->supports[s]);
      g_array_append_val (which, w);
    }
  for (guint i = 0; i < m->supports->len; i++)
    {
      const TrbSupport *own = &g_array_index (m->supports, TrbMemberSupport, i).support;
      guint k;

      for (k = 0; k < supports->len; k++)
        {
          TrbSupport *have = &g_array_index (supports, TrbSupport, k);

          if (fabs (have->x - own->x) <= tol)
            {
              if (own->type == TRB_SUPPORT_FIXED)
                have->type = TRB_SUPPORT_FIXED;
              break;
            }
        }
      if (k == supports->len)
        {
          int w = -1;

          g_array_append_val (supports, *own);
          g_array_append_val (which, w);
        }
    }
  /* sorted by x (insertion sort: a handful of supports) */
  for (guint i = 1; i < supports->len; i++)
    for (guint k = i; k > 0; k--)
      {
        TrbSupport *a = &g_array_index (supports, TrbSupport, k - 1);
        TrbSupport *b = &g_array_index (supports, TrbSupport, k);
        int *wa = &g_array_index (which, int, k - 1);
        int *wb = &g_array_index (which, int, k);
        TrbSupport ts;
        int tw;

        if (a->x <= b->x)
          break;
        ts = *a, *a = *b, *b = ts;
        tw = *wa, *wa = *wb, *wb = tw;
      }
}

static gboolean
supports_stable (const GArray *supports)
{
  if (supports->len >= 2)
    return TRUE;
  return supports->len == 1 &&
         g_array_index (supports, TrbSupport, 0).type == TRB_SUPPORT_FIXED;
}

/* The largest centre-to-centre spacing to the neighbouring deck members, from the strip:
 * twice the half-width on either side (NDS 2018 4.3.9 asks for 24 in or less). NAN where the
 * strip has no neighbour on either side. */
static double
strip_spacing (const TrbFrameMemberResult *fm)
{
  double spacing = NAN;

  for (guint i = 0; i < fm->n_strips; i++)
    {
      const TrbFrameStrip *st = &fm->strips[i];

      if (isfinite (st->left))
        spacing = isnan (spacing) ? 2 * st->left : MAX (spacing, 2 * st->left);
      if (isfinite (st->right))
        spacing = isnan (spacing) ? 2 * st->right : MAX (spacing, 2 * st->right);
    }
  return spacing;
}

/* Reactions of one load set on a solved beam, per support and case slot c. */
static void
reactions_of (const TrbBeam *beam,
              const TrbLoad *loads,
              guint          n_loads,
              TrbLoadCase    c,
              double        *out)
{
  g_autoptr(TrbBeamResult) res = NULL;
  const TrbReaction *re;
  guint n;

  if (n_loads == 0)
    return;
  res = trb_beam_solve (beam, loads, n_loads, NULL);
  if (res == NULL)
    return;
  re = trb_beam_result_get_reactions (res, &n);
  for (guint i = 0; i < n; i++)
    out[i * TRB_N_CASES + c] = re[i].force;
}

typedef struct
{
  const TrbFloor        *floor;
  gboolean               reduction;
  double                 Lo;                 /* the largest reducible live pressure, Pa */
  const TrbFrame        *frame[2];            /* frame[1]: stream 1 alone, when needed */
  TrbFrameTakedown      *takedown[2];
  int                    b_frame;             /* which frame carries stream 1; -1: none */
  TrbLoadCase            b_slot;              /* and in which case slot */
  gboolean              *ok;                 /* per member: can be analysed */
  char                 **reason;             /* per member: why not */
  double                *area_in;            /* per member: A_T handed down from above, m^2 */
  const char           **incomplete;         /* per member: a member above that passed nothing */
  double                *column_area;        /* per column: A_T, m^2 */
  gboolean              *column_cantilever;
  /* what solve_floor_member() gathers for each member, emptied and filled again: a few
   * small arrays a member allocated and freed were a third of an incremental solve */
  GArray                *supports;           /* TrbSupport */
  GArray                *which;              /* int */
  GArray                *live_a;             /* TrbLoad */
  GArray                *live_b;
  GArray                *loads[TRB_N_CASES];
  Key                    extra;
  Key                    key;
} FloorSolve;

/* What frame f (and its takedown) carries in case slot c: which case of which stream. */
static gboolean
slot_of (const FloorSolve *fs,
         guint             f,
         guint             c,
         TrbLoadCase      *lcase,
         guint            *stream)
{
  if (fs->frame[f] == NULL)
    return FALSE;
  if (f == 1 || (fs->b_frame == 0 && c == fs->b_slot))
    {
      if (f == 1 && c != TRB_CASE_L)
        return FALSE;
      *lcase = TRB_CASE_L;
      *stream = 1;
      return TRUE;
    }
  *lcase = c;
  *stream = 0;
  return TRUE;
}

static const char *
frame_status_word (const FloorSolve *fs,
                   guint             index)
{
  const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], index);

  return fm->status == TRB_FRAME_IN_CYCLE ? "in a bearing cycle" : "unsupported";
}

/* Which members can be analysed: stable on their supports (the frame's and their own), and
 * resting only on members that can be. Supporters come last in the bearing order, so the
 * order is walked backwards. */
static void
floor_statuses (FloorSolve *fs)
{
  const TrbFloor *floor = fs->floor;
  guint n_order;
  const guint *order = trb_frame_get_order (fs->frame[0], &n_order);
  g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  g_autoptr(GArray) which = g_array_new (FALSE, FALSE, sizeof (int));

  for (guint i = 0; i < floor->members->len; i++)
    {
      const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], i);

      fs->ok[i] = FALSE;
      if (fm->status == TRB_FRAME_IN_CYCLE)
        fs->reason[i] = g_strdup (fm->reason);
    }

  for (guint k = n_order; k-- > 0;)
    {
      guint idx = order[k];
      const TrbMember *m = g_ptr_array_index (floor->members, idx);
      const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], idx);

      merge_supports (m, fm, supports, which);
      if (!supports_stable (supports))
        {
          fs->reason[idx] = g_strdup (fm->reason != NULL ? fm->reason
                                      : supports->len == 0 ? "no support: nothing lies under it"
                                      : "one support only: it is a mechanism");
          continue;
        }
      fs->ok[idx] = TRUE;
      for (guint s = 0; s < fm->n_supports; s++)
        {
          const TrbBearing *b = &fm->bearings[s];

          if (b->kind == TRB_BEARING_MEMBER && !fs->ok[b->index])
            {
              fs->ok[idx] = FALSE;
              fs->reason[idx] = g_strdup_printf ("bears on member %s, which is %s", b->id,
                                                 trb_frame_get_member (fs->frame[0], b->index)
                                                   ->status != TRB_FRAME_SUPPORTED
                                                 ? frame_status_word (fs, b->index)
                                                 : "unsupported");
              break;
            }
        }
    }
}

/* The loads of one member that stay where they are: its own, the frame's and those handed
 * down to it, per case, added to not_carried; and the members it rests on are told. */
static void
floor_strand (FloorSolve     *fs,
              TrbFloorResult *fr,
              guint           idx)
{
  const TrbMember *m = g_ptr_array_index (fs->floor->members, idx);
  const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], idx);

  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

      fr->not_carried[ml->lcase] += loads_total (&ml->load, 1);
    }
  for (guint f = 0; f < 2; f++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      {
        const TrbFrameMemberResult *fm2;
        const TrbLoad *handed;
        TrbLoadCase lc;
        guint s, n;

        if (!slot_of (fs, f, c, &lc, &s))
          continue;
        fm2 = trb_frame_get_member (fs->frame[f], idx);
        fr->not_carried[lc] += loads_total (fm2->loads[c], fm2->n_loads[c]);
        handed = trb_frame_takedown_get_member_loads (fs->takedown[f], idx, c, &n);
        fr->not_carried[lc] += loads_total (handed, n);
      }
  for (guint s = 0; s < fm->n_supports; s++)
    if (fm->bearings[s].kind == TRB_BEARING_MEMBER && fs->incomplete[fm->bearings[s].index] == NULL)
      fs->incomplete[fm->bearings[s].index] = m->id;
}

/* Every load of a member counted as applied: its own and the frame's (not those handed down,
 * which were counted where they started). */
static void
floor_count_applied (FloorSolve     *fs,
                     TrbFloorResult *fr,
                     guint           idx)
{
  const TrbMember *m = g_ptr_array_index (fs->floor->members, idx);

  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

      fr->applied[ml->lcase] += loads_total (&ml->load, 1);
    }
  for (guint f = 0; f < 2; f++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      {
        const TrbFrameMemberResult *fm2;
        TrbLoadCase lc;
        guint s;

        if (!slot_of (fs, f, c, &lc, &s))
          continue;
        fm2 = trb_frame_get_member (fs->frame[f], idx);
        fr->applied[lc] += loads_total (fm2->loads[c], fm2->n_loads[c]);
      }
}

static GArray *
bearings_new (const TrbMember            *m,
              const TrbFrameMemberResult *fm,
              const GArray               *supports,
              const GArray               *which)
{
  GArray *bearings = g_array_sized_new (FALSE, TRUE, sizeof (TrbMemberBearing), supports->len);

  for (guint i = 0; i < supports->len; i++)
    {
      int w = g_array_index (which, int, i);
      TrbMemberBearing b = { 0 };

      b.x = g_array_index (supports, TrbSupport, i).x;
      b.own = w < 0;
      if (w >= 0)
        {
          const TrbBearing *fb = &fm->bearings[w];

          b.kind = fb->kind;
          /* the model's string, which outlives the frame */
          b.id = fb->kind == TRB_BEARING_COLUMN
                 ? ((const TrbColumn *) g_ptr_array_index (m->floor->columns, fb->index))->id
                 : fb->kind == TRB_BEARING_WALL
                 ? ((const TrbWall *) g_ptr_array_index (m->floor->walls, fb->index))->id
                 : ((const TrbMember *) g_ptr_array_index (m->floor->members, fb->index))->id;
          b.position = fb->position;
        }
      g_array_append_val (bearings, b);
    }
  return bearings;
}

static TrbMemberResult *
not_analysed_result (const TrbProject *project,
                     const TrbMember  *m,
                     TrbStatus         status,
                     const char       *reason)
{
  TrbMemberResult *r = trb_solve_priv_member_result_new (project, m);

  g_strlcpy (r->section, m->section, sizeof r->section);
  trb_solve_priv_set_status (r, status, "%s", reason);
  if (m->floor != NULL)
    r->reduction.factor = 1;
  return r;
}

static void
append_loads (GArray        *to,
              const TrbLoad *loads,
              guint          n,
              double         factor)
{
  for (guint i = 0; i < n; i++)
    {
      TrbLoad l = loads[i];

      /* a case a member hands down without load (no snow on it) is no load here */
      if (l.w1 == 0 && (l.kind != TRB_LOAD_LINEAR || l.w2 == 0))
        continue;
      if (factor != 1)
        {
          l.w1 *= factor;
          l.w2 *= factor;
        }
      g_array_append_val (to, l);
    }
}

/* The live load reduction of a member with A_T area (m^2): K_LL 2 for beams and girders
 * (interior beams, edge beams without cantilever slabs), 1 for cantilevered members (ASCE
 * 7-16 Table 4.7-1); a member of a floor supports that floor only. */
static void
member_reduction (const FloorSolve *fs,
                  double            area,
                  gboolean          cantilever,
                  TrbReductionUse  *use)
{
  TrbLiveReduction red;

  use->area = area;
  use->floors = 1;
  use->factor = 1;
  use->k_ll = trb_live_k_ll (cantilever ? TRB_LIVE_MEMBER_OTHER : TRB_LIVE_MEMBER_INTERIOR_BEAM);
  use->rule = TRB_LIVE_RULE_SMALL_AREA;
  if (!fs->reduction || !(fs->Lo > 0) || !(area > 0))
    return;
  if (trb_live_reduction_floor (fs->Lo, area,
                                cantilever ? TRB_LIVE_MEMBER_OTHER
                                           : TRB_LIVE_MEMBER_INTERIOR_BEAM,
                                1, TRB_LIVE_OCCUPANCY_ORDINARY, &red, NULL))
    {
      use->applies = TRUE;
      use->factor = red.factor;
      use->rule = red.rule;
      use->k_ll = red.k_ll;
    }
}

static void
solve_floor_member (Solver         *sv,
                    FloorSolve     *fs,
                    TrbFloorResult *fr,
                    guint           idx,
                    GHashTable     *results)
{
  const TrbProject *project = sv->project;
  const TrbMember *m = g_ptr_array_index (fs->floor->members, idx);
  const TrbFrameMemberResult *fm = trb_frame_get_member (fs->frame[0], idx);
  GArray *supports = fs->supports;
  GArray *which = fs->which;
  GArray *live_a = fs->live_a;
  GArray *live_b = fs->live_b;
  GArray **loads = fs->loads;
  Key *extra = &fs->extra;
  g_autoptr(GBytes) key = NULL;
  MemberInput in = { 0 };
  TrbReductionUse use = { 0 };
  TrbMemberResult *r;
  CacheEntry *entry = NULL;
  double *reactions[2];
  /* not g_autofree on an array of two: that frees the first element only */
  g_autofree double *handed_0 = NULL;
  g_autofree double *handed_1 = NULL;
  double *handed[2];
  guint n_beam;
  gboolean cantilever;
  double reducible = 0, other = 0;
  double length = fm->length;

  floor_count_applied (fs, fr, idx);
  merge_supports (m, fm, supports, which);

  g_array_set_size (live_a, 0);
  g_array_set_size (live_b, 0);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_set_size (loads[c], 0);
  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

      /* the member's own live loads are not reduced: they may be anything */
      g_array_append_val (ml->lcase == TRB_CASE_L && fs->reduction ? live_b : loads[ml->lcase],
                          ml->load);
    }
  for (guint f = 0; f < 2; f++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      {
        const TrbFrameMemberResult *fm2;
        const TrbLoad *down;
        TrbLoadCase lc;
        guint st, n;
        GArray *to;

        if (!slot_of (fs, f, c, &lc, &st))
          continue;
        fm2 = trb_frame_get_member (fs->frame[f], idx);
        to = st == 1 ? live_b : lc == TRB_CASE_L && fs->reduction ? live_a : loads[lc];
        append_loads (to, fm2->loads[c], fm2->n_loads[c], 1);
        down = trb_frame_takedown_get_member_loads (fs->takedown[f], idx, c, &n);
        append_loads (to, down, n, 1);
      }
  if (fs->reduction)
    {
      reducible = loads_total ((const TrbLoad *) live_a->data, live_a->len);
      other = loads_total ((const TrbLoad *) live_b->data, live_b->len);
    }

  cantilever = supports->len > 0 &&
               (g_array_index (supports, TrbSupport, 0).x > TRB_FRAME_TOLERANCE ||
                g_array_index (supports, TrbSupport, supports->len - 1).x <
                  length - TRB_FRAME_TOLERANCE);
  member_reduction (fs, fm->loaded_area[TRB_CASE_L] + fs->area_in[idx], cantilever, &use);
  use.reducible = reducible;
  use.other = other;
  if (fs->reduction)
    {
      if (!(reducible > 0))
        use.applies = FALSE, use.factor = 1;
      append_loads (loads[TRB_CASE_L], (const TrbLoad *) live_a->data, live_a->len, use.factor);
      append_loads (loads[TRB_CASE_L], (const TrbLoad *) live_b->data, live_b->len, 1);
    }

  in.length = length;
  in.supports = (const TrbSupport *) supports->data;
  in.n_supports = supports->len;
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      in.loads[c] = (const TrbLoad *) loads[c]->data;
      in.n_loads[c] = loads[c]->len;
    }
  in.repetitive_spacing = strip_spacing (fm);
  in.memo = sv->memo;
  in.member = m;

  /* the streams decide what is handed down, so they are part of what makes members equal */
  extra->len = 0;
  key_int (extra, fs->reduction);
  key_loads (extra, (const TrbLoad *) live_a->data, live_a->len);
  key_loads (extra, (const TrbLoad *) live_b->data, live_b->len);
  member_key_gather (&fs->key, m, &in, sv->options->shortlist_max, extra);

  /* looked up without a copy of the key's bytes; copied only to be kept */
  key = g_bytes_new_static (fs->key.data, fs->key.len);
  if (sv->cache != NULL)
    entry = g_hash_table_lookup (sv->cache, key);
  if (entry == NULL)
    {
      entry = cache_entry_new (trb_solve_priv_solve_input (project, m, &in,
                                                           sv->options->shortlist_max,
                                                           sv->options->bounds),
                               fs->reduction, live_a, live_b);
      if (sv->cache != NULL)
        g_hash_table_insert (sv->cache, g_bytes_new (fs->key.data, fs->key.len), entry);
      solver_count (sv, entry, TRUE);
    }
  else
    solver_count (sv, entry, FALSE);
  /* With the cache, the entry keeps its own result and every member gets a share of it, so
   * that what one member's place in the floor changes (its bearings, an incomplete load)
   * never reaches the others. */
  if (sv->cache != NULL)
    r = trb_solve_priv_member_result_share (entry->result, m);
  else
    r = g_steal_pointer (&entry->result);

  r->bearings = bearings_new (m, fm, supports, which);
  r->plan_note = g_strdup (fm->note);
  r->reduction = use;
  g_hash_table_insert (results, (gpointer) m, r);

  if (!r->analysed)
    {
      if (sv->cache == NULL)
        cache_entry_free (entry);
      floor_strand (fs, fr, idx);
      return;
    }

  fr->applied[TRB_CASE_D] += r->self_weight * length;

  /* per support of the beam: map to the merged supports by position */
  {
    const TrbSupport *bs = trb_beam_get_supports (r->beam, &n_beam);
    double total_a = 0;

    reactions[0] = entry->reactions[0];
    reactions[1] = entry->reactions[1];
    /* what each frame's takedown gets, slot by slot (the frames share their geometry, so
     * their supports are the same) */
    handed[0] = handed_0 = g_new0 (double, (fm->n_supports + 1) * TRB_N_CASES);
    handed[1] = handed_1 = g_new0 (double, (fm->n_supports + 1) * TRB_N_CASES);

    for (guint i = 0; i < n_beam; i++)
      total_a += MAX (reactions[0][i * TRB_N_CASES + TRB_CASE_L], 0);

    for (guint j = 0; j < supports->len; j++)
      {
        double x = g_array_index (supports, TrbSupport, j).x;
        int w = g_array_index (which, int, j);
        TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, j);
        guint i = 0;

        for (guint k = 1; k < n_beam; k++)
          if (fabs (bs[k].x - x) < fabs (bs[i].x - x))
            i = k;
        for (guint c = 0; c < TRB_N_CASES; c++)
          b->force[c] = reactions[0][i * TRB_N_CASES + c] + reactions[1][i * TRB_N_CASES + c];
        if (w < 0)
          {
            for (guint c = 0; c < TRB_N_CASES; c++)
              fr->supports[c] += b->force[c];
            continue;
          }
        for (guint f = 0; f < 2; f++)
          for (guint c = 0; c < TRB_N_CASES; c++)
            {
              TrbLoadCase lc;
              guint st;

              if (slot_of (fs, f, c, &lc, &st))
                handed[f][w * TRB_N_CASES + c] = reactions[st][i * TRB_N_CASES + lc];
            }

        /* A_T goes down with the reducible live load it came with */
        if (use.area > 0 && total_a > 0)
          {
            double share = use.area * MAX (reactions[0][i * TRB_N_CASES + TRB_CASE_L], 0) /
                           total_a;

            if (b->kind == TRB_BEARING_MEMBER)
              fs->area_in[fm->bearings[w].index] += share;
            else if (b->kind == TRB_BEARING_COLUMN)
              fs->column_area[fm->bearings[w].index] += share;
          }
        /* the member runs on past the column: a cantilever over it (Table 4.7-1) */
        if (b->kind == TRB_BEARING_COLUMN &&
            ((j == 0 && x > TRB_FRAME_TOLERANCE) ||
             (j + 1 == supports->len && x < length - TRB_FRAME_TOLERANCE)))
          fs->column_cantilever[fm->bearings[w].index] = TRUE;
      }
  }

  for (guint f = 0; f < 2; f++)
    if (fs->takedown[f] != NULL)
      trb_frame_takedown_add (fs->takedown[f], idx, handed[f], fm->n_supports, NULL);

  if (fs->incomplete[idx] != NULL)
    trb_solve_priv_set_status (r, TRB_STATUS_NOT_DESIGNED, "loads incomplete: %s, which rests "
                               "on it, could not be analysed", fs->incomplete[idx]);

  if (sv->cache == NULL)
    cache_entry_free (entry);
}

static int
compare_load_position (gconstpointer a,
                       gconstpointer b)
{
  const TrbLoad *la = a;
  const TrbLoad *lb = b;

  return la->a < lb->a ? -1 : la->a > lb->a ? 1 : 0;
}

static void
floor_columns_walls (FloorSolve     *fs,
                     TrbFloorResult *fr,
                     guint           floors_above)
{
  const TrbFloor *floor = fs->floor;

  for (guint i = 0; i < floor->columns->len; i++)
    {
      TrbColumnResult col = { 0 };
      double other = 0;

      col.column = g_ptr_array_index (floor->columns, i);
      col.floor = floor;
      col.cantilever = fs->column_cantilever[i];
      for (guint f = 0; f < 2; f++)
        for (guint c = 0; c < TRB_N_CASES; c++)
          {
            TrbLoadCase lc;
            guint st;
            double load;

            if (!slot_of (fs, f, c, &lc, &st))
              continue;
            load = trb_frame_takedown_get_column_load (fs->takedown[f], i, c);
            col.force[lc] += load;
            if (lc == TRB_CASE_L && st == 0)
              col.reduction.reducible += load;
            else if (lc == TRB_CASE_L)
              other += load;
          }
      col.reduction.factor = 1;
      col.reduction.floors = 1 + floors_above;
      col.reduction.area = fs->column_area[i];
      /* Table 4.7-1: 4 for interior columns and exterior ones without cantilever slabs; a
       * column a member runs on past is taken as a corner column with cantilever slabs (2),
       * the least of those rows, since which edge it is on is not known here */
      col.reduction.k_ll = trb_live_k_ll (col.cantilever
                                          ? TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER
                                          : TRB_LIVE_MEMBER_INTERIOR_COLUMN);
      col.live_reduced = col.force[TRB_CASE_L];
      if (fs->reduction)
        {
          TrbLiveReduction red;

          col.reduction.other = other;
          if (col.reduction.reducible > 0 && fs->Lo > 0 && col.reduction.area > 0 &&
              trb_live_reduction_floor (fs->Lo, col.reduction.area,
                                        col.cantilever
                                          ? TRB_LIVE_MEMBER_CORNER_COLUMN_CANTILEVER
                                          : TRB_LIVE_MEMBER_INTERIOR_COLUMN,
                                        col.reduction.floors, TRB_LIVE_OCCUPANCY_ORDINARY,
                                        &red, NULL))
            {
              col.reduction.applies = TRUE;
              col.reduction.factor = red.factor;
              col.reduction.rule = red.rule;
              col.live_reduced = red.factor * col.reduction.reducible + other;
            }
        }
      for (guint c = 0; c < TRB_N_CASES; c++)
        fr->reactions[c] += col.force[c];
      g_array_append_val (fr->columns, col);
    }

  for (guint i = 0; i < floor->walls->len; i++)
    {
      TrbWallResult wr = { 0 };

      wr.wall = g_ptr_array_index (floor->walls, i);
      wr.floor = floor;
      for (guint c = 0; c < TRB_N_CASES; c++)
        wr.loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
      for (guint f = 0; f < 2; f++)
        for (guint c = 0; c < TRB_N_CASES; c++)
          {
            const TrbLoad *l;
            TrbLoadCase lc;
            guint st, n;

            if (!slot_of (fs, f, c, &lc, &st))
              continue;
            l = trb_frame_takedown_get_wall_loads (fs->takedown[f], i, c, &n);
            for (guint k = 0; k < n; k++)
              if (l[k].w1 != 0)
                g_array_append_val (wr.loads[lc], l[k]);
          }
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          GArray *a = wr.loads[c];
          guint out = 0;

          /* sorted by position, those at one place added into one */
          g_array_sort (a, compare_load_position);
          for (guint k = 0; k < a->len; k++)
            {
              TrbLoad *l = &g_array_index (a, TrbLoad, k);

              if (out > 0 && g_array_index (a, TrbLoad, out - 1).a == l->a)
                g_array_index (a, TrbLoad, out - 1).w1 += l->w1;
              else
                g_array_index (a, TrbLoad, out++) = *l;
            }
          g_array_set_size (a, out);
          wr.force[c] = loads_total ((const TrbLoad *) wr.loads[c]->data, wr.loads[c]->len);
          fr->reactions[c] += wr.force[c];
        }
      g_array_append_val (fr->walls, wr);
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    fr->reactions[c] += fr->supports[c];
}

static int
compare_unassigned (gconstpointer a,
                    gconstpointer b)
{
  const TrbUnassignedLoad *ua = a;
  const TrbUnassignedLoad *ub = b;
  int la = ua->line != NULL ? 0 : 1;
  int lb = ub->line != NULL ? 0 : 1;
  int ka = ua->line != NULL ? ua->line->line : ua->point->line;
  int kb = ub->line != NULL ? ub->line->line : ub->point->line;

  if (la != lb)
    return la - lb;
  return (ka > kb) - (ka < kb);
}

static void
floor_unassigned (const TrbFloor  *floor,
                  const TrbFrame  *frame,
                  const FloorPlan *fp,
                  GArray          *out)
{
  const guint *points;
  const TrbFrameUnassigned *lines;
  guint n;

  lines = trb_frame_get_unassigned_lines (frame, &n);
  for (guint i = 0; i < n; i++)
    {
      TrbUnassignedLoad u = { 0 };

      u.line = g_ptr_array_index (floor->line_loads,
                                  g_array_index (fp->line_map, guint, lines[i].index));
      u.length = lines[i].length;
      u.force = u.line->w * u.length;
      g_array_append_val (out, u);
    }
  points = trb_frame_get_unassigned_points (frame, &n);
  for (guint i = 0; i < n; i++)
    {
      TrbUnassignedLoad u = { 0 };

      u.point = g_ptr_array_index (floor->point_loads,
                                   g_array_index (fp->point_map, guint, points[i]));
      u.force = u.point->P;
      g_array_append_val (out, u);
    }
}

/* The exact bytes of a frame's plan, ids and all (the frame keeps them in its reasons): a
 * plan of the same bytes gives the same frame. */
static GBytes *
plan_key (const TrbFramePlan *plan)
{
  Key k = { NULL, 0, 0 };
  Key *key = &k;

  key_int (key, plan->n_columns);
  for (guint i = 0; i < plan->n_columns; i++)
    {
      key_string (key, plan->columns[i].id);
      key_double (key, plan->columns[i].x);
      key_double (key, plan->columns[i].y);
    }
  key_int (key, plan->n_walls);
  for (guint i = 0; i < plan->n_walls; i++)
    {
      key_string (key, plan->walls[i].id);
      key_int (key, plan->walls[i].n_points);
      key_bytes (key, plan->walls[i].points, plan->walls[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_members);
  for (guint i = 0; i < plan->n_members; i++)
    {
      const TrbFrameMember *fm = &plan->members[i];

      key_string (key, fm->id);
      key_double (key, fm->start.x);
      key_double (key, fm->start.y);
      key_double (key, fm->end.x);
      key_double (key, fm->end.y);
      key_int (key, fm->role);
      key_int (key, fm->carries_deck);
      key_int (key, fm->n_bearing_points);
      key_bytes (key, fm->bearing_points, fm->n_bearing_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_area_loads);
  for (guint i = 0; i < plan->n_area_loads; i++)
    {
      key_int (key, plan->area_loads[i].load_case);
      key_double (key, plan->area_loads[i].pressure);
      key_int (key, plan->area_loads[i].n_points);
      key_bytes (key, plan->area_loads[i].points,
                 plan->area_loads[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_openings);
  for (guint i = 0; i < plan->n_openings; i++)
    {
      key_int (key, plan->openings[i].n_points);
      key_bytes (key, plan->openings[i].points,
                 plan->openings[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_line_loads);
  for (guint i = 0; i < plan->n_line_loads; i++)
    {
      key_int (key, plan->line_loads[i].load_case);
      key_double (key, plan->line_loads[i].w);
      key_int (key, plan->line_loads[i].n_points);
      key_bytes (key, plan->line_loads[i].points,
                 plan->line_loads[i].n_points * sizeof (TrbFramePoint));
    }
  key_int (key, plan->n_point_loads);
  for (guint i = 0; i < plan->n_point_loads; i++)
    {
      key_int (key, plan->point_loads[i].load_case);
      key_double (key, plan->point_loads[i].P);
      key_double (key, plan->point_loads[i].x);
      key_double (key, plan->point_loads[i].y);
    }
  return g_bytes_new_take (k.data, k.len);
}

static void
frame_entry_free (gpointer data)
{
  FrameEntry *fe = data;

  trb_frame_free (fe->frame);
  g_free (fe);
}

/* The frame of a plan: made here (*owned, the caller's to free) or, with a TrbSolveCache,
 * the one an earlier solve made of the same plan (the frame is read only once made; each
 * solve hands its loads down in a takedown of its own). */
static const TrbFrame *
floor_frame (Solver             *sv,
             const TrbFramePlan *plan,
             TrbFrame          **owned,
             GError            **error)
{
  g_autoptr(GBytes) key = NULL;
  FrameEntry *fe;

  *owned = NULL;
  if (sv->keep == NULL)
    return *owned = trb_frame_new (plan, error);
  key = plan_key (plan);
  fe = g_hash_table_lookup (sv->keep->frames, key);
  if (fe == NULL)
    {
      TrbFrame *frame = trb_frame_new (plan, error);

      if (frame == NULL)
        return NULL;
      fe = g_new0 (FrameEntry, 1);
      fe->frame = frame;
      g_hash_table_insert (sv->keep->frames, g_steal_pointer (&key), fe);
      sv->keep->n_frames_new++;
    }
  fe->used = sv->keep->generation;
  return fe->frame;
}

/* The load takedown of one floor: frame, then every member from the top of the load path
 * down, then what reached the columns and walls. Results go into results (member -> result). */
static gboolean
floor_result_finite (const TrbFloorResult *fr)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (!isfinite (fr->applied[c]) || !isfinite (fr->reactions[c]) ||
        !isfinite (fr->supports[c]) || !isfinite (fr->not_carried[c]))
      return FALSE;
  for (guint i = 0; i < fr->columns->len; i++)
    {
      const TrbColumnResult *col = &g_array_index (fr->columns, TrbColumnResult, i);

      if (!isfinite (col->live_reduced))
        return FALSE;
      for (guint c = 0; c < TRB_N_CASES; c++)
        if (!isfinite (col->force[c]))
          return FALSE;
    }
  for (guint i = 0; i < fr->walls->len; i++)
    {
      const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);

      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          if (!isfinite (w->force[c]))
            return FALSE;
          for (guint k = 0; k < w->loads[c]->len; k++)
            if (!isfinite (g_array_index (w->loads[c], TrbLoad, k).w1))
              return FALSE;
        }
    }
  for (guint i = 0; i < fr->unassigned->len; i++)
    if (!isfinite (g_array_index (fr->unassigned, TrbUnassignedLoad, i).force))
      return FALSE;
  return TRUE;
}

static TrbFloorResult *
solve_floor (Solver         *sv,
             const TrbFloor *floor,
             GHashTable     *results)
{
  const TrbSettings *settings = &sv->project->settings;
  TrbFloorResult *fr = floor_result_new (floor);
  FloorSolve fs = { 0 };
  FloorPlan fp[2];
  TrbFrame *owned[2] = { NULL, NULL };   /* the frames not kept by a TrbSolveCache */
  g_autoptr(GError) error = NULL;
  guint n = floor->members->len;
  guint n_order;
  const guint *order;

  fs.floor = floor;
  fs.reduction = settings->live_load_reduction;
  for (guint i = 0; fs.reduction && i < floor->area_loads->len; i++)
    {
      const TrbAreaLoad *al = g_ptr_array_index (floor->area_loads, i);

      if (al->lcase == TRB_CASE_L && area_load_reducible (al))
        fs.Lo = MAX (fs.Lo, al->pressure);
    }

  /* The live load that is never reduced travels apart from the rest; in a case slot of the
   * same frame that no load of the floor uses, when there is one (a floor without roof live
   * load or snow), else in a frame of its own: the frame's work is most of the floor's. */
  fs.b_frame = -1;
  fs.b_slot = TRB_CASE_L;
  floor_plan_init (&fp[1], floor, fs.reduction, 2, TRB_CASE_L);
  if (fp[1].n_loads > 0)
    {
      gboolean used[TRB_N_CASES] = { FALSE };

      for (guint i = 0; i < floor->area_loads->len; i++)
        used[((const TrbAreaLoad *) g_ptr_array_index (floor->area_loads, i))->lcase] = TRUE;
      for (guint i = 0; i < floor->line_loads->len; i++)
        used[((const TrbLineLoad *) g_ptr_array_index (floor->line_loads, i))->lcase] = TRUE;
      for (guint i = 0; i < floor->point_loads->len; i++)
        used[((const TrbPointLoad *) g_ptr_array_index (floor->point_loads, i))->lcase] = TRUE;
      fs.b_frame = 1;
      for (guint c = TRB_N_CASES; c-- > 0;)
        if (c != TRB_CASE_D && c != TRB_CASE_L && !used[c])
          {
            fs.b_frame = 0;
            fs.b_slot = c;
          }
    }
  if (fs.b_frame == 0)
    {
      floor_plan_clear (&fp[1]);
      floor_plan_init (&fp[0], floor, fs.reduction, 3, fs.b_slot);
      memset (&fp[1], 0, sizeof fp[1]);
    }
  else
    floor_plan_init (&fp[0], floor, fs.reduction, 1, TRB_CASE_L);
  fs.frame[0] = floor_frame (sv, &fp[0].plan, &owned[0], &error);
  if (fs.frame[0] != NULL && fs.b_frame == 1)
    fs.frame[1] = floor_frame (sv, &fp[1].plan, &owned[1], &error);
  if (fs.frame[0] == NULL || (fs.b_frame == 1 && fs.frame[1] == NULL))
    {
      fr->error = g_strdup (error->message);
      for (guint i = 0; i < n; i++)
        {
          const TrbMember *m = g_ptr_array_index (floor->members, i);
          g_autofree char *why = g_strdup_printf ("floor \"%s\" could not be framed: %s",
                                                  floor->name != NULL ? floor->name : "",
                                                  error->message);

          g_hash_table_insert (results, (gpointer) m,
                               not_analysed_result (sv->project, m, TRB_STATUS_ERROR, why));
        }
      g_clear_pointer (&owned[0], trb_frame_free);
      floor_plan_clear (&fp[0]);
      floor_plan_clear (&fp[1]);
      return fr;
    }

  for (guint s = 0; s < 2; s++)
    {
      floor_plan_trim (&fp[s]);
      if (fs.frame[s] != NULL)
        fs.takedown[s] = trb_frame_takedown_new (fs.frame[s]);
    }
  fs.ok = g_new0 (gboolean, n + 1);
  fs.reason = g_new0 (char *, n + 1);
  fs.area_in = g_new0 (double, n + 1);
  fs.incomplete = g_new0 (const char *, n + 1);
  fs.column_area = g_new0 (double, floor->columns->len + 1);
  fs.column_cantilever = g_new0 (gboolean, floor->columns->len + 1);
  fs.supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  fs.which = g_array_new (FALSE, FALSE, sizeof (int));
  fs.live_a = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  fs.live_b = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  for (guint c = 0; c < TRB_N_CASES; c++)
    fs.loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));

  floor_statuses (&fs);

  /* members in a cycle have no place in the order; what lies on them stays there */
  for (guint i = 0; i < n; i++)
    {
      const TrbFrameMemberResult *fm = trb_frame_get_member (fs.frame[0], i);

      if (fm->status == TRB_FRAME_IN_CYCLE)
        {
          const TrbMember *m = g_ptr_array_index (floor->members, i);
          g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
          g_autoptr(GArray) which = g_array_new (FALSE, FALSE, sizeof (int));
          TrbMemberResult *r = not_analysed_result (sv->project, m, TRB_STATUS_ERROR,
                                                    fs.reason[i]);

          merge_supports (m, fm, supports, which);
          r->bearings = bearings_new (m, fm, supports, which);
          r->plan_note = g_strdup (fm->note);
          g_hash_table_insert (results, (gpointer) m, r);
          floor_count_applied (&fs, fr, i);
          floor_strand (&fs, fr, i);
        }
    }

  order = trb_frame_get_order (fs.frame[0], &n_order);
  for (guint k = 0; k < n_order; k++)
    {
      guint idx = order[k];

      if (!fs.ok[idx])
        {
          const TrbMember *m = g_ptr_array_index (floor->members, idx);
          const TrbFrameMemberResult *fm = trb_frame_get_member (fs.frame[0], idx);
          g_autoptr(GArray) supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
          g_autoptr(GArray) which = g_array_new (FALSE, FALSE, sizeof (int));
          TrbMemberResult *r = not_analysed_result (sv->project, m, TRB_STATUS_UNSUPPORTED,
                                                    fs.reason[idx]);

          merge_supports (m, fm, supports, which);
          r->bearings = bearings_new (m, fm, supports, which);
          r->plan_note = g_strdup (fm->note);
          g_hash_table_insert (results, (gpointer) m, r);
          floor_count_applied (&fs, fr, idx);
          floor_strand (&fs, fr, idx);
        }
      else
        solve_floor_member (sv, &fs, fr, idx, results);
      /* what was handed down to it is read once, above: freed before the floor's results
       * pile up (2 MB of the CLI's peak on 10,000 members) */
      for (guint s = 0; s < 2; s++)
        if (fs.takedown[s] != NULL)
          trb_frame_takedown_release_member (fs.takedown[s], idx);
    }

  floor_columns_walls (&fs, fr, MAX (settings->floors_above, 0));
  for (guint s = 0; s < 2; s++)
    if (fs.frame[s] != NULL)
      floor_unassigned (floor, fs.frame[s], &fp[s], fr->unassigned);
  /* in plan order, whichever frame found them */
  g_array_sort (fr->unassigned, compare_unassigned);

  for (guint i = 0; i < n; i++)
    g_free (fs.reason[i]);
  g_free (fs.reason);
  g_free (fs.ok);
  g_free (fs.area_in);
  g_free (fs.incomplete);
  g_free (fs.column_area);
  g_free (fs.column_cantilever);
  g_array_unref (fs.supports);
  g_array_unref (fs.which);
  g_array_unref (fs.live_a);
  g_array_unref (fs.live_b);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_unref (fs.loads[c]);
  g_free (fs.extra.data);
  g_free (fs.key.data);
  for (guint s = 0; s < 2; s++)
    {
      g_clear_pointer (&fs.takedown[s], trb_frame_takedown_free);
      g_clear_pointer (&owned[s], trb_frame_free);
      floor_plan_clear (&fp[s]);
    }

  /* Each coordinate and load may be finite and the floor's sums still overflow (1e300 psf
   * over a plan 1e300 in across): the floor is then in error, never totals of inf or NaN. */
  if (fr->error == NULL && !floor_result_finite (fr))
    fr->error = g_strdup ("the floor's loads overflow: the plan or the loads are out of any "
                          "real range");
  return fr;
}

/* ---- the project ------------------------------------------------------------------------- */

static TrbMemberResult *
solve_standalone_cached (Solver          *sv,
                         const TrbMember *member)
{
  g_autoptr(GArray) supports = NULL;
  g_autoptr(GBytes) key = NULL;
  GArray *loads[TRB_N_CASES];
  MemberInput in;
  CacheEntry *entry;
  TrbMemberResult *r;

  if (sv->cache == NULL)
    return trb_solve_priv_solve_standalone (sv->project, member, sv->options->shortlist_max,
                                            sv->options->bounds);

  supports = g_array_new (FALSE, FALSE, sizeof (TrbSupport));
  for (guint c = 0; c < TRB_N_CASES; c++)
    loads[c] = g_array_new (FALSE, FALSE, sizeof (TrbLoad));
  trb_solve_priv_standalone_input (member, &in, supports, loads);
  in.memo = sv->memo;
  key = member_key (member, &in, sv->options->shortlist_max, NULL);
  entry = g_hash_table_lookup (sv->cache, key);
  if (entry == NULL)
    {
      entry = g_new0 (CacheEntry, 1);
      entry->result = trb_solve_priv_solve_input (sv->project, member, &in,
                                                  sv->options->shortlist_max,
                                                  sv->options->bounds);
      g_hash_table_insert (sv->cache, g_bytes_ref (key), entry);
      solver_count (sv, entry, TRUE);
    }
  else
    solver_count (sv, entry, FALSE);
  r = trb_solve_priv_member_result_share (entry->result, member);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_array_unref (loads[c]);
  return r;
}

/**
 * trb_solve_options_init:
 * @options: (out caller-allocates): options to fill
 *
 * The defaults: no shortlist (it is made only where it is shown), the cache and the bounds
 * on.
 */
void
trb_solve_options_init (TrbSolveOptions *options)
{
  g_return_if_fail (options != NULL);

  options->shortlist_max = 0;
  options->cache = TRUE;
  options->bounds = TRUE;
}

/* What a solve depends on besides the members' and plans' own keys: the settings, the
 * project's own sections (a catalog never changed once loaded, shared by the editor's copies
 * of a project: its address says which) and the options. */
static GBytes *
context_key (const TrbProject      *project,
             const TrbSolveOptions *options)
{
  const TrbSettings *st = &project->settings;
  Key k = { NULL, 0, 0 };
  Key *key = &k;

  key_int (key, st->method);
  key_double (key, st->fb_allow);
  key_double (key, st->fv_allow);
  key_string (key, st->steel_grade);
  key_int (key, st->self_weight);
  key_int (key, st->live_patterns);
  key_double (key, st->deflection_live);
  key_double (key, st->deflection_total);
  key_int (key, st->units);
  key_int (key, st->live_load_reduction);
  key_int (key, st->floors_above);
  key_int (key, (gint64) (guintptr) project->sections);
  key_int (key, options->shortlist_max);
  key_int (key, options->bounds);
  return g_bytes_new_take (k.data, k.len);
}

/* Entries neither this solve nor the one before read go. */
static gboolean
cache_entry_stale (gpointer key,
                   gpointer value,
                   gpointer user_data)
{
  return ((CacheEntry *) value)->used + 1 < *(guint64 *) user_data;
}

static gboolean
frame_entry_stale (gpointer key,
                   gpointer value,
                   gpointer user_data)
{
  return ((FrameEntry *) value)->used + 1 < *(guint64 *) user_data;
}

/* Solves the whole project, or only one floor's members (only_floor); with keep, reading and
 * filling that cache of earlier solves. */
TrbProjectResult *
trb_solve_priv_solve_project (const TrbProject      *project,
                              const TrbSolveOptions *options,
                              const TrbFloor        *only_floor,
                              TrbSolveCache         *keep)
{
  TrbProjectResult *pr;
  g_autoptr(GHashTable) results = g_hash_table_new (NULL, NULL);
  Solver sv = { project, options, NULL, NULL, NULL };

  if (keep != NULL && options->cache)
    {
      g_autoptr(GBytes) context = context_key (project, options);

      if (keep->context == NULL || !g_bytes_equal (keep->context, context))
        {
          g_hash_table_remove_all (keep->members);
          g_hash_table_remove_all (keep->frames);
          g_clear_pointer (&keep->context, g_bytes_unref);
          keep->context = g_steal_pointer (&context);
        }
      keep->generation++;
      keep->n_solved = keep->n_reused = keep->n_frames_new = 0;
      sv.keep = keep;
      sv.cache = keep->members;
      sv.memo = keep->memo;
    }
  else if (options->cache)
    sv.cache = g_hash_table_new_full (key_hash, g_bytes_equal,
                                      (GDestroyNotify) g_bytes_unref, cache_entry_free);
  if (sv.memo == NULL)
    sv.memo = trb_solve_priv_memo_new ();

  pr = g_new0 (TrbProjectResult, 1);
  pr->project = project;
  pr->members = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_member_result_free);
  pr->floors = g_ptr_array_new_with_free_func (floor_result_free);

  for (guint f = 0; project->floors != NULL && f < project->floors->len; f++)
    {
      const TrbFloor *floor = g_ptr_array_index (project->floors, f);

      if (only_floor != NULL && floor != only_floor)
        continue;
      g_ptr_array_add (pr->floors, solve_floor (&sv, floor, results));
    }

  for (guint i = 0; i < project->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (project->members, i);
      TrbMemberResult *r;

      if (m->floor != NULL)
        {
          r = g_hash_table_lookup (results, m);
          if (r == NULL)
            continue;   /* not of the floor asked for */
        }
      else if (only_floor != NULL)
        continue;
      else
        r = solve_standalone_cached (&sv, m);
      g_ptr_array_add (pr->members, r);
    }

  if (sv.keep != NULL)
    {
      g_hash_table_foreach_remove (keep->members, cache_entry_stale, &keep->generation);
      g_hash_table_foreach_remove (keep->frames, frame_entry_stale, &keep->generation);
    }
  else
    {
      g_clear_pointer (&sv.cache, g_hash_table_unref);
      trb_solve_priv_memo_free (sv.memo);
    }
  return pr;
}

/**
 * trb_solve_cache_new:
 *
 * A cache for trb_solve_project_cached(), kept from one solve of a project to the next.
 *
 * Returns: (transfer full): an empty cache
 */
TrbSolveCache *
trb_solve_cache_new (void)
{
  TrbSolveCache *cache = g_new0 (TrbSolveCache, 1);

  cache->members = g_hash_table_new_full (key_hash, g_bytes_equal,
                                          (GDestroyNotify) g_bytes_unref, cache_entry_free);
  cache->frames = g_hash_table_new_full (key_hash, g_bytes_equal,
                                         (GDestroyNotify) g_bytes_unref, frame_entry_free);
  cache->memo = trb_solve_priv_memo_new ();
  return cache;
}

void
trb_solve_cache_free (TrbSolveCache *cache)
{
  if (cache == NULL)
    return;
  g_clear_pointer (&cache->context, g_bytes_unref);
  g_hash_table_unref (cache->members);
  g_hash_table_unref (cache->frames);
  trb_solve_priv_memo_free (cache->memo);
  g_free (cache);
}

/**
 * trb_solve_cache_get_counts:
 * @cache: a cache
 * @solved: (out) (optional): members analysed and designed by the last solve (each distinct
 *   input once)
 * @reused: (out) (optional): distinct results the last solve took from earlier ones
 * @frames: (out) (optional): floor frames the last solve made (not taken from earlier ones)
 *
 * What the last trb_solve_project_cached() with @cache did, to show that an edit re-solves
 * only what it changed.
 */
void
trb_solve_cache_get_counts (const TrbSolveCache *cache,
                            guint               *solved,
                            guint               *reused,
                            guint               *frames)
{
  g_return_if_fail (cache != NULL);

  if (solved != NULL)
    *solved = cache->n_solved;
  if (reused != NULL)
    *reused = cache->n_reused;
  if (frames != NULL)
    *frames = cache->n_frames_new;
}

/**
 * trb_solve_project_cached:
 * @project: a project
 * @options: (nullable): how to solve; %NULL for the defaults
 * @cache: what earlier solves of this project (or of copies of it, as the editor makes them)
 *   left; used by one solve at a time
 *
 * trb_solve_project_full(), re-solving only what changed since the solves that filled @cache:
 * a member's result is taken from an earlier solve where its complete input is the same to
 * the bit (its length, supports and every load, its own and those handed down from the
 * members on it and the floor's, its live load reduction streams, its design attributes),
 * and each floor's frame where its plan is; the members below a changed one get other loads
 * handed down, so they are solved again too. The results are those of
 * trb_solve_project_full(), bit for bit. With @options->cache off, @cache is not used.
 *
 * Returns: (transfer full): every member's results in the project's order, and each floor's.
 */
TrbProjectResult *
trb_solve_project_cached (const TrbProject      *project,
                          const TrbSolveOptions *options,
                          TrbSolveCache         *cache)
{
  TrbSolveOptions defaults;

  g_return_val_if_fail (project != NULL && cache != NULL, NULL);

  if (options == NULL)
    {
      trb_solve_options_init (&defaults);
      options = &defaults;
    }
  return trb_solve_priv_solve_project (project, options, NULL, cache);
}

/**
 * trb_solve_project_full:
 * @project: a project
 * @options: (nullable): how to solve; %NULL for the defaults (trb_solve_options_init())
 *
 * Solves every member: standalone beams as they are given, each floor through its load
 * takedown (docs/takedown.md): the frame, the members from the top of the load path down, each
 * handing its reactions to what it rests on, then the column and wall loads and the totals.
 * Pure: the same project and options give bit-identical results, and the options' shortcuts
 * never change a result.
 *
 * Returns: (transfer full): every member's results in the project's order, and each floor's.
 */
TrbProjectResult *
trb_solve_project_full (const TrbProject      *project,
                        const TrbSolveOptions *options)
{
  TrbSolveOptions defaults;

  g_return_val_if_fail (project != NULL, NULL);

  if (options == NULL)
    {
      trb_solve_options_init (&defaults);
      options = &defaults;
    }
  return trb_solve_priv_solve_project (project, options, NULL, NULL);
}

/**
 * trb_solve_project:
 * @project: a project
 *
 * trb_solve_project_full() with the default options.
 *
 * Returns: (transfer full): every member's results, in the project's order, and each floor's.
 */
TrbProjectResult *
trb_solve_project (const TrbProject *project)
{
  return trb_solve_project_full (project, NULL);
}

/**
 * trb_solve_member_full:
 * @project: the project, for its settings
 * @member: one of its members
 * @shortlist_max: how many passing sections to list at most (G_MAXUINT for all)
 *
 * Analyses and designs one member: a custom section is checked as given; a catalog section
 * is checked and gets a shortlist of the passing sections; "auto" is sized: the lightest
 * passing section of its family is chosen. Never fails: a member that cannot be analysed gets
 * the status that says why, and a message. A member of a floor is solved with its floor,
 * since what it carries comes down from the members above it.
 *
 * Returns: (transfer full): the member's results; they point into @member.
 */
TrbMemberResult *
trb_solve_member_full (const TrbProject *project,
                       const TrbMember  *member,
                       guint             shortlist_max)
{
  g_return_val_if_fail (project != NULL && member != NULL, NULL);

  if (member->floor != NULL)
    {
      g_autoptr(TrbProjectResult) pr = NULL;
      TrbSolveOptions options;
      const TrbMemberResult *found;
      TrbMemberResult *r;

      trb_solve_options_init (&options);
      options.shortlist_max = shortlist_max;
      pr = trb_solve_priv_solve_project (project, &options, member->floor, NULL);
      found = trb_project_result_find_member (pr, member);
      g_return_val_if_fail (found != NULL, NULL);
      r = trb_solve_priv_member_result_share ((TrbMemberResult *) found, member);
      r->bearings = found->bearings != NULL ? g_array_ref (found->bearings) : NULL;
      r->plan_note = g_strdup (found->plan_note);
      r->reduction = found->reduction;
      r->status = found->status;
      g_free (r->message);
      r->message = g_strdup (found->message);
      return r;
    }
  return trb_solve_priv_solve_standalone (project, member, shortlist_max, TRUE);
}

/**
 * trb_solve_member:
 * @project: the project, for its settings
 * @member: one of its members
 *
 * trb_solve_member_full() without a shortlist (trb_solve_member_shortlist() makes it).
 *
 * Returns: (transfer full): the member's results; they point into @member.
 */
TrbMemberResult *
trb_solve_member (const TrbProject *project,
                  const TrbMember  *member)
{
  return trb_solve_member_full (project, member, 0);
}

/**
 * trb_solve_member_shortlist:
 * @project: the project solved, for its settings and sections
 * @result: a member's result from it (any solve: with or without a shortlist)
 * @max: how many passing sections to list at most (G_MAXUINT for all)
 *
 * The shortlist of a catalog or "auto" member, for whoever shows it: its passing sections,
 * lightest first, ties by depth, sized again on what the solve analysed it with (its supports
 * and loads, as they came down a floor). Exactly the entries a solve with a shortlist of
 * @max gives, bit for bit, without the chosen section's full result. Empty for a custom
 * section and for a member that was not sized (unsupported, unstable, not framed).
 *
 * Returns: (transfer full) (element-type TrbShortlistEntry): the entries
 */
GArray *
trb_solve_member_shortlist (const TrbProject      *project,
                            const TrbMemberResult *result,
                            guint                  max)
{
  const struct _TrbMemberSizing *sz;
  const TrbMember *m;
  const TrbSection *chosen = NULL;
  MemberInput in = { 0 };
  g_autoptr(Memo) memo = NULL;
  GArray *list;

  g_return_val_if_fail (project != NULL && result != NULL, NULL);

  list = g_array_new (FALSE, TRUE, sizeof (TrbShortlistEntry));
  sz = result->sizing;
  m = result->member;
  if (sz == NULL || m == NULL || max == 0 || trb_member_is_custom (m))
    return list;
  if (!trb_member_is_auto (m))
    {
      chosen = trb_solve_priv_lookup_section (project, m->section);
      if (chosen == NULL)
        return list;
    }
  memo = trb_solve_priv_memo_new ();
  in.length = sz->length;
  in.supports = (const TrbSupport *) sz->supports->data;
  in.n_supports = sz->supports->len;
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      in.loads[c] = (const TrbLoad *) sz->loads[c]->data;
      in.n_loads[c] = sz->loads[c]->len;
    }
  in.repetitive_spacing = sz->repetitive_spacing;
  in.memo = memo;
  in.member = m;
  trb_solve_priv_size_member (project, m, &in, chosen, max, TRUE, TRUE, list);
  return list;
}

/**
 * trb_project_result_find_member:
 * @result: a project's results
 * @member: one of its members
 *
 * Returns: (transfer none) (nullable): the member's results
 */
const TrbMemberResult *
trb_project_result_find_member (const TrbProjectResult *result,
                                const TrbMember        *member)
{
  g_return_val_if_fail (result != NULL && member != NULL, NULL);

  for (guint i = 0; i < result->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (result->members, i);

      if (r->member == member)
        return r;
    }
  return NULL;
}

void
trb_project_result_free (TrbProjectResult *result)
{
  if (result == NULL)
    return;
  g_clear_pointer (&result->members, g_ptr_array_unref);
  g_clear_pointer (&result->floors, g_ptr_array_unref);
  g_free (result);
}
