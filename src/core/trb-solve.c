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
