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
  s->entries = g_array_new (FALSE, TRUE, sizeof (TrbComboResult));
  g_array_set_clear_func (s->entries, combo_result_clear);
  s->envelope.empty = TRUE;
  trb_extremes_init (&s->envelope.ext);
  s->envelope.reactions = g_array_new (FALSE, TRUE, sizeof (TrbReactionRange));
}

static void
combo_set_clear (TrbComboSetResult *s)
{
  g_clear_pointer (&s->entries, g_array_unref);
  g_clear_pointer (&s->envelope.reactions, g_array_unref);
}

void
trb_member_result_free (TrbMemberResult *result)
{
  if (result == NULL)
    return;
  g_free (result->message);
  g_clear_pointer (&result->notes, g_ptr_array_unref);
  g_clear_pointer (&result->beam, trb_beam_free);
  for (guint c = 0; c < TRB_N_CASES; c++)
    g_clear_pointer (&result->cases[c], trb_beam_result_free);
  g_clear_pointer (&result->regions, g_array_unref);
  g_clear_pointer (&result->patterns, g_array_unref);
  combo_set_clear (&result->strength);
  combo_set_clear (&result->live);
  combo_set_clear (&result->total);
  g_clear_pointer (&result->checks, g_array_unref);
  g_clear_pointer (&result->shortlist, g_array_unref);
  g_free (result);
}

static TrbMemberResult *
member_result_new (const TrbProject *project,
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

static void G_GNUC_PRINTF (3, 4)
set_status (TrbMemberResult *r,
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

static void
envelope_add (TrbEnvelope          *env,
              const TrbComboResult *c)
{
  guint took = trb_extremes_merge (&env->ext, &c->ext);

  if (took & TRB_EXTREME_V_MAX)
    g_strlcpy (env->V_max_by, c->name, sizeof env->V_max_by);
  if (took & TRB_EXTREME_V_MIN)
    g_strlcpy (env->V_min_by, c->name, sizeof env->V_min_by);
  if (took & TRB_EXTREME_M_MAX)
    g_strlcpy (env->M_max_by, c->name, sizeof env->M_max_by);
  if (took & TRB_EXTREME_M_MIN)
    g_strlcpy (env->M_min_by, c->name, sizeof env->M_min_by);
  if (took & TRB_EXTREME_DEFL_DOWN)
    g_strlcpy (env->defl_down_by, c->name, sizeof env->defl_down_by);
  if (took & TRB_EXTREME_DEFL_UP)
    g_strlcpy (env->defl_up_by, c->name, sizeof env->defl_up_by);
  reaction_ranges_merge (env->reactions, c->result, env->empty);
  env->empty = FALSE;
}

/* The per-region results of the patterned cases (L and Lr): region_results[case][region]. */
typedef struct
{
  TrbBeamResult **by_region[TRB_N_CASES];
  TrbBeamResult  *zero;  /* a member without any load: the result of no load */
} RegionResults;

static void
region_results_clear (RegionResults *rr,
                      guint          n_regions)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      if (rr->by_region[c] == NULL)
        continue;
      for (guint i = 0; i < n_regions; i++)
        g_clear_pointer (&rr->by_region[c][i], trb_beam_result_free);
      g_clear_pointer (&rr->by_region[c], g_free);
    }
  g_clear_pointer (&rr->zero, trb_beam_result_free);
}

static gboolean
is_patterned_case (TrbLoadCase c)
{
  return c == TRB_CASE_L || c == TRB_CASE_LR;
}

/* Evaluates every combination of set, under every pattern where it carries a patterned case,
 * and takes the envelope. */
static void
evaluate_set (TrbMemberResult     *r,
              const RegionResults *rr,
              TrbComboSetResult   *out)
{
  g_autoptr(GArray) combos = trb_combos_build (out->set, r->has_case);
  gboolean patterns_on = r->patterns->len > 0;
  double length = trb_beam_get_length (r->beam);

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
          g_autoptr(GPtrArray) parts = g_ptr_array_new ();
          g_autoptr(GArray) factors = g_array_new (FALSE, FALSE, sizeof (double));
          TrbComboResult cr = { { { 0 } } };
          const TrbPattern *pat = patterned ? &g_array_index (r->patterns, TrbPattern, p) : NULL;

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
                      g_ptr_array_add (parts, rr->by_region[c][reg]);
                      g_array_append_val (factors, f);
                    }
                }
              else
                {
                  g_ptr_array_add (parts, r->cases[c]);
                  g_array_append_val (factors, f);
                }
            }

          cr.combo = *combo;
          if (pat != NULL)
            {
              g_strlcpy (cr.pattern, pat->name, sizeof cr.pattern);
              g_snprintf (cr.name, sizeof cr.name, "%s (%s)", combo->name, pat->name);
            }
          else
            g_strlcpy (cr.name, combo->name, sizeof cr.name);

          if (parts->len == 0)
            {
              /* A combination of absent cases (1.4D on a member without dead load) still
               * reads as a combination, with zero effects. */
              double zero = 0;

              g_ptr_array_add (parts, rr->zero);
              g_array_append_val (factors, zero);
            }
          cr.result = trb_beam_result_combine ((TrbBeamResult **) parts->pdata,
                                               (const double *) factors->data, parts->len);
          trb_beam_result_extremes (cr.result, 0, length, &cr.ext);
          g_array_append_val (out->entries, cr);
          envelope_add (&out->envelope, &g_array_index (out->entries, TrbComboResult,
                                                        out->entries->len - 1));
        }
    }
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

/* The analysis with a given stiffness and self-weight (N/m, added to D); with E or I NAN only
 * the stability is checked. Returns FALSE, with the status set when something is wrong, when
 * there is nothing more to do. The design step, once it sizes catalog sections, runs this
 * for each section it tries, with that section's E, I and weight, on a fresh result. */
static gboolean
analyse (const TrbProject *project,
         const TrbMember  *m,
         double            E,
         double            I,
         double            self_weight,
         TrbMemberResult  *r)
{
  g_autoptr(GError) error = NULL;
  g_autofree TrbSupport *supports = NULL;
  const TrbSupport *beam_supports;
  guint n_beam_supports;
  RegionResults rr = { { NULL } };
  gboolean use_patterns;
  gboolean known = !isnan (E) && !isnan (I);

  supports = g_new0 (TrbSupport, MAX (m->supports->len, 1));
  for (guint i = 0; i < m->supports->len; i++)
    supports[i] = g_array_index (m->supports, TrbMemberSupport, i).support;

  if (m->supports->len == 0)
    {
      set_status (r, TRB_STATUS_UNSUPPORTED, "the beam has no supports");
      return FALSE;
    }

  /* Stability does not depend on E and I, so a member whose section is not known yet is
   * still told that it is a mechanism. */
  r->beam = trb_beam_new (m->length, known ? E : 1.0, known ? I : 1.0,
                          supports, m->supports->len, &error);
  if (r->beam == NULL)
    {
      if (g_error_matches (error, TRB_ERROR, TRB_ERROR_UNSTABLE))
        set_status (r, TRB_STATUS_UNSTABLE, "%s", error->message);
      else
        set_status (r, TRB_STATUS_ERROR, "%s", error->message);
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
      g_autoptr(GArray) loads = g_array_new (FALSE, TRUE, sizeof (TrbLoad));

      for (guint i = 0; i < m->loads->len; i++)
        {
          const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

          if (ml->lcase == c)
            g_array_append_val (loads, ml->load);
        }
      if (c == TRB_CASE_D && r->self_weight > 0)
        {
          TrbLoad sw = { TRB_LOAD_UNIFORM, 0, m->length, r->self_weight, r->self_weight };

          g_array_append_val (loads, sw);
        }
      if (loads->len == 0)
        continue;

      r->has_case[c] = TRUE;
      r->cases[c] = trb_beam_solve (r->beam, (const TrbLoad *) loads->data, loads->len, &error);
      if (r->cases[c] == NULL)
        {
          set_status (r, TRB_STATUS_ERROR, "case %s: %s", trb_load_case_name (c),
                      error->message);
          return FALSE;
        }
      trb_beam_result_extremes (r->cases[c], 0, m->length, &r->case_ext[c]);
    }

  rr.zero = trb_beam_solve (r->beam, NULL, 0, &error);
  if (rr.zero == NULL)
    {
      set_status (r, TRB_STATUS_ERROR, "%s", error->message);
      return FALSE;
    }

  beam_supports = trb_beam_get_supports (r->beam, &n_beam_supports);
  g_array_unref (r->regions);
  r->regions = trb_regions_build (beam_supports, n_beam_supports, m->length);

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
      r->patterns = trb_patterns_build (regions, n_regions, live_label (r));

      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          g_autoptr(GArray) loads = NULL;
          GArray **split;

          if (!is_patterned_case (c) || !r->has_case[c])
            continue;
          loads = g_array_new (FALSE, TRUE, sizeof (TrbLoad));
          for (guint i = 0; i < m->loads->len; i++)
            {
              const TrbMemberLoad *ml = &g_array_index (m->loads, TrbMemberLoad, i);

              if (ml->lcase == c)
                g_array_append_val (loads, ml->load);
            }
          split = trb_loads_split ((const TrbLoad *) loads->data, loads->len, regions,
                                   n_regions);
          rr.by_region[c] = g_new0 (TrbBeamResult *, n_regions);
          for (guint reg = 0; reg < n_regions && r->status != TRB_STATUS_ERROR; reg++)
            {
              rr.by_region[c][reg] = trb_beam_solve (r->beam, (const TrbLoad *) split[reg]->data,
                                                     split[reg]->len, &error);
              if (rr.by_region[c][reg] == NULL)
                set_status (r, TRB_STATUS_ERROR, "case %s, region %u: %s",
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

  evaluate_set (r, &rr, &r->strength);
  evaluate_set (r, &rr, &r->live);
  evaluate_set (r, &rr, &r->total);
  region_results_clear (&rr, r->regions->len);

  r->analysed = TRUE;
  return TRUE;
}

/* The worst deflection check over every result of a deflection set, named after the
 * combination and pattern that gave it. */
static void
check_deflection_set (TrbDesignInput          *input,
                      const TrbComboSetResult *set,
                      gboolean                 live,
                      double                   limit,
                      GArray                  *checks)
{
  g_autoptr(GArray) tmp = g_array_new (FALSE, TRUE, sizeof (TrbCheck));
  TrbCheck worst;
  gboolean have = FALSE;

  if (!(limit > 0))
    return;
  input->live_limit = live ? limit : 0;
  input->total_limit = live ? 0 : limit;
  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);

      input->live = live ? c->result : NULL;
      input->total = live ? NULL : c->result;
      g_array_set_size (tmp, 0);
      trb_design_check_deflection (input, tmp);
      for (guint k = 0; k < tmp->len; k++)
        {
          TrbCheck *ck = &g_array_index (tmp, TrbCheck, k);

          if (!have || ck->ratio > worst.ratio)
            {
              worst = *ck;
              g_strlcpy (worst.combination, c->name, sizeof worst.combination);
              have = TRUE;
            }
        }
    }
  input->live = input->total = NULL;
  input->live_limit = input->total_limit = 0;
  if (have)
    g_array_append_val (checks, worst);
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
    set_status (r, TRB_STATUS_FAIL, "%s: ratio %.2f", r->governing, r->ratio);
  else if (!strength_checked || any_unchecked)
    set_status (r, TRB_STATUS_NOT_DESIGNED, "some checks could not be made "
                                            "(see \"Not checked\")");
  else
    {
      r->status = TRB_STATUS_PASS;
      g_clear_pointer (&r->message, g_free);
    }
}

static void
wood_options_for (const TrbMember *m,
                  TrbWoodOptions  *options)
{
  trb_design_wood_options_init (options);
  options->wet_service = m->wet_service;
  options->incised = m->incised;
  /* A standalone member marked repetitive is one of three or more like members at 24 in or
   * less tied by sheathing (NDS 2018 4.3.9); a floor's joist runs give their real spacing. */
  if (m->repetitive)
    options->repetitive_spacing = 24 * TRB_IN;
  if (!isnan (m->bearing_length))
    options->bearing_length = m->bearing_length;
}

/* Every check of the member's method on one analysed section. */
static void
design_checks (const TrbProject   *project,
               const TrbMember    *m,
               const TrbSection   *section,
               const TrbWoodGrade *wood_grade,
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
      g_array_append_val (demand, d);
    }
  brace_x = g_array_new (FALSE, TRUE, sizeof (double));
  for (guint i = 0; i < m->braces->len; i++)
    g_array_append_val (brace_x, g_array_index (m->braces, TrbMemberBrace, i).x);

  input.section = section;
  input.length = m->length;
  input.supports = trb_beam_get_supports (r->beam, &input.n_supports);
  input.bracing = m->bracing;
  input.brace_x = (const double *) brace_x->data;
  input.n_braces = brace_x->len;
  input.combos = (const TrbDemandCombo *) demand->data;
  input.n_combos = demand->len;
  input.units = s->units;

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

      wood_options_for (m, &options);
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
      const TrbSteelGrade *grade =
        trb_design_steel_lookup_grade (trb_member_get_steel_grade (m, s));

      strength_checked = trb_design_steel_check (&input, grade,
                                                 r->method == TRB_METHOD_LRFD
                                                   ? TRB_DESIGN_BASIS_LRFD : TRB_DESIGN_BASIS_ASD,
                                                 r->checks);
    }

  check_deflection_set (&input, &r->live, TRUE, trb_member_get_deflection_live (m, s),
                        r->checks);
  check_deflection_set (&input, &r->total, FALSE, trb_member_get_deflection_total (m, s),
                        r->checks);
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
static const TrbWoodGrade *
wood_grade_for (const TrbMember  *m,
                const TrbSection *section,
                char            **why)
{
  const TrbWoodGrade *grade;

  if (m->species == NULL || m->grade == NULL)
    {
      *why = g_strdup ("a wood member needs species and grade");
      return NULL;
    }
  grade = trb_catalog_lookup_grade (trb_catalog_get_default (), m->species, m->grade, section);
  if (grade == NULL)
    *why = g_strdup_printf ("no design values for %s %s in size %s", m->species, m->grade,
                            section->designation);
  return grade;
}

/* Analyses and checks the member with one catalog section: its E (steel grade, or the wood
 * grade's E adjusted for service), its I and its self-weight. */
static TrbMemberResult *
solve_with_section (const TrbProject *project,
                    const TrbMember  *m,
                    const TrbSection *section)
{
  const TrbSettings *s = &project->settings;
  TrbMemberResult *r = member_result_new (project, m);
  const TrbWoodGrade *wood_grade = NULL;
  double self_weight = s->self_weight ? section->weight : 0;
  double E;

  if (!s->self_weight)
    g_ptr_array_add (r->notes, g_strdup ("self-weight excluded by the project settings"));
  g_strlcpy (r->section, section->designation, sizeof r->section);

  if (m->material == TRB_MATERIAL_WOOD)
    {
      g_autofree char *why = NULL;
      TrbWoodOptions options;

      if (section->kind != TRB_SHAPE_SAWN && section->kind != TRB_SHAPE_GLULAM)
        {
          set_status (r, TRB_STATUS_ERROR, "%s is not a timber section", section->designation);
          return r;
        }
      wood_grade = wood_grade_for (m, section, &why);
      if (wood_grade == NULL)
        {
          set_status (r, TRB_STATUS_ERROR, "%s", why);
          return r;
        }
      wood_options_for (m, &options);
      E = trb_design_wood_adjusted_e (section, wood_grade, &options, TRB_WOOD_E);
    }
  else
    {
      const TrbSteelGrade *grade =
        trb_design_steel_lookup_grade (trb_member_get_steel_grade (m, s));

      if (section->kind == TRB_SHAPE_SAWN || section->kind == TRB_SHAPE_GLULAM)
        {
          set_status (r, TRB_STATUS_ERROR, "%s is a timber section: give material=\"wood\" "
                      "with a species and grade", section->designation);
          return r;
        }
      if (grade == NULL)
        {
          set_status (r, TRB_STATUS_ERROR, "unknown steel grade \"%s\"",
                      trb_member_get_steel_grade (m, s));
          return r;
        }
      E = grade->E;
    }

  if (analyse (project, m, E, section->Ix, self_weight, r))
    design_checks (project, m, section, wood_grade, r);
  return r;
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
static const TrbSection *
lookup_section (const TrbProject *project,
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
 * else its family of the catalog; depth and ply limits applied. */
static GPtrArray *
sizing_candidates (const TrbProject *project,
                   const TrbMember  *m)
{
  const TrbCatalog *catalogs[] = { trb_catalog_get_default (), project->sections };
  GPtrArray *out = g_ptr_array_new ();
  TrbFamily family;

  if (m->allowed != NULL)
    {
      for (guint i = 0; m->allowed[i] != NULL; i++)
        {
          const TrbSection *section = lookup_section (project, m->allowed[i]);

          if (section != NULL && candidate_allowed (m, section))
            g_ptr_array_add (out, (gpointer) section);
        }
      g_ptr_array_sort (out, compare_by_weight_ptr);
      return out;
    }
  if (sizing_family (m, &family))
    {
      /* The project's own sections of the family take part beside the catalog's. */
      for (guint c = 0; c < G_N_ELEMENTS (catalogs) && catalogs[c] != NULL; c++)
        {
          guint n;
          const TrbSection *sections = trb_catalog_get_family (catalogs[c], family, &n);

          for (guint i = 0; i < n; i++)
            if (candidate_allowed (m, &sections[i]))
              g_ptr_array_add (out, (gpointer) &sections[i]);
        }
      if (project->sections != NULL)
        g_ptr_array_sort (out, compare_by_weight_ptr);
    }
  return out;
}

/* Sizing: every candidate lightest first is analysed with its own self-weight and checked;
 * the passing ones make the shortlist (up to shortlist_max), the lightest is chosen unless
 * the engineer named one. Because each candidate carries its own self-weight, the chosen
 * section is the one its own weight was computed with: nothing is left to iterate. */
static TrbMemberResult *
size_member (const TrbProject *project,
             const TrbMember  *m,
             const TrbSection *chosen,
             guint             shortlist_max)
{
  g_autoptr(GPtrArray) candidates = sizing_candidates (project, m);
  TrbMemberResult *best = NULL;
  TrbMemberResult *closest = NULL;
  g_autoptr(GArray) shortlist = g_array_new (FALSE, TRUE, sizeof (TrbShortlistEntry));

  for (guint i = 0; i < candidates->len && shortlist->len < shortlist_max; i++)
    {
      const TrbSection *section = g_ptr_array_index (candidates, i);
      TrbMemberResult *c = solve_with_section (project, m, section);

      if (c->status == TRB_STATUS_PASS)
        {
          TrbShortlistEntry e = { { 0 } };

          g_strlcpy (e.section, section->designation, sizeof e.section);
          e.weight = section->weight;
          e.ratio = c->ratio;
          g_strlcpy (e.governing, c->governing, sizeof e.governing);
          g_array_append_val (shortlist, e);
          if (best == NULL && chosen == NULL)
            {
              best = c;
              continue;
            }
        }
      else if (chosen == NULL && c->status == TRB_STATUS_FAIL &&
               (closest == NULL || c->ratio < closest->ratio))
        {
          g_clear_pointer (&closest, trb_member_result_free);
          closest = c;
          continue;
        }
      else if (c->status != TRB_STATUS_FAIL && c->status != TRB_STATUS_PASS && chosen == NULL &&
               best == NULL && closest == NULL)
        {
          /* unstable, unsupported or an error: the same for every section */
          best = c;
          break;
        }
      trb_member_result_free (c);
    }

  if (chosen != NULL)
    best = solve_with_section (project, m, chosen);
  else if (best == NULL && closest != NULL)
    {
      best = g_steal_pointer (&closest);
      set_status (best, TRB_STATUS_FAIL, "no section of the catalog passes; the closest is "
                  "%s (%s ratio %.2f)", best->section, best->governing, best->ratio);
    }
  else if (best == NULL)
    {
      best = member_result_new (project, m);
      g_strlcpy (best->section, m->section, sizeof best->section);
      set_status (best, TRB_STATUS_NOT_DESIGNED, "no catalog section fits the member's limits "
                  "(family, depth, plies, allowed list)");
    }
  g_clear_pointer (&closest, trb_member_result_free);
  g_array_append_vals (best->shortlist, shortlist->data, shortlist->len);
  return best;
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
 * the status that says why, and a message.
 *
 * Returns: (transfer full): the member's results; they point into @member.
 */
TrbMemberResult *
trb_solve_member_full (const TrbProject *project,
                       const TrbMember  *member,
                       guint             shortlist_max)
{
  TrbMemberResult *r;
  TrbSection section;
  double self_weight = 0;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);

  if (!trb_member_is_custom (member))
    {
      const TrbSection *chosen = NULL;

      /* Stability and support do not depend on the section: say so once, not per section. */
      r = member_result_new (project, member);
      g_strlcpy (r->section, member->section, sizeof r->section);
      if (!analyse (project, member, NAN, NAN, 0, r) && r->status != TRB_STATUS_NOT_DESIGNED)
        return r;
      trb_member_result_free (r);

      if (!trb_member_is_auto (member))
        {
          chosen = lookup_section (project, member->section);
          if (chosen == NULL)
            {
              r = member_result_new (project, member);
              g_strlcpy (r->section, member->section, sizeof r->section);
              set_status (r, TRB_STATUS_ERROR, "unknown section \"%s\": not in the catalog",
                          member->section);
              return r;
            }
        }
      return size_member (project, member, chosen, shortlist_max);
    }

  r = member_result_new (project, member);
  if (!project->settings.self_weight)
    g_ptr_array_add (r->notes, g_strdup ("self-weight excluded by the project settings"));
  else
    self_weight = custom_self_weight (member, r->notes);
  custom_section (member, self_weight, &section);
  if (analyse (project, member, member->E, member->I, self_weight, r))
    design_checks (project, member, &section, NULL, r);
  return r;
}

/**
 * trb_solve_member:
 * @project: the project, for its settings
 * @member: one of its members
 *
 * trb_solve_member_full() with a shortlist of at most %TRB_SHORTLIST_DEFAULT sections.
 *
 * Returns: (transfer full): the member's results; they point into @member.
 */
TrbMemberResult *
trb_solve_member (const TrbProject *project,
                  const TrbMember  *member)
{
  return trb_solve_member_full (project, member, TRB_SHORTLIST_DEFAULT);
}

/**
 * trb_solve_project:
 * @project: a project
 *
 * Returns: (transfer full): every member's results, in the project's order.
 */
TrbProjectResult *
trb_solve_project (const TrbProject *project)
{
  TrbProjectResult *pr;

  g_return_val_if_fail (project != NULL, NULL);

  pr = g_new0 (TrbProjectResult, 1);
  pr->project = project;
  pr->members = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_member_result_free);
  for (guint i = 0; i < project->members->len; i++)
    g_ptr_array_add (pr->members,
                     trb_solve_member (project, g_ptr_array_index (project->members, i)));
  return pr;
}

void
trb_project_result_free (TrbProjectResult *result)
{
  if (result == NULL)
    return;
  g_clear_pointer (&result->members, g_ptr_array_unref);
  g_free (result);
}
