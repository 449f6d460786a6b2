/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

/* Internal to the solve, not installed and not for callers: what its three parts share.
 * trb-solve.c analyses and checks one member and keeps its results; trb-sizing.c chooses its
 * section (bounds, the lean evaluation of candidates, the guess, the shortlist on demand);
 * trb-solve-floor.c solves floors and the project (the cache of identical members, the
 * takedown, TrbSolveCache). The public API is trb-solve.h. */

#include <glib.h>
#include <math.h>
#include <string.h>

#include "trb-design-steel.h"
#include "trb-design-wood.h"
#include "trb-section.h"
#include "trb-solve.h"
#include "trb-units.h"

G_BEGIN_DECLS

/* What a catalog or "auto" member was sized on (its length, supports, loads as analysed and
 * timber spacing), kept so that its shortlist can be made when someone shows it; shared by
 * identical members. */
struct _TrbMemberSizing
{
  double  length;
  GArray *supports;                /* TrbSupport */
  GArray *loads[TRB_N_CASES];      /* TrbLoad */
  double  repetitive_spacing;
};

/* What a solve looks up again and again and that depends on nothing but its key: the wood
 * design values of a species and grade in each size. Lookups only: a memo never changes a
 * result. */
typedef struct
{
  GHashTable          *grades;   /* "species\x1fgrade" -> GHashTable (section -> grade, or
                                  * GRADE_NONE) */
  char                *steel_name;   /* the last steel grade looked up, by its name */
  const TrbSteelGrade *steel;
  char                *wood_species; /* and the last species and grade, with its sizes */
  char                *wood_grade;
  GHashTable          *wood_sizes;
} Memo;

/* What one member's analysis reads besides its section: its length, supports and loads in its
 * own coordinate, and the wood repetitive-member spacing. A standalone beam's come from its
 * file; a floor member's from the frame and the takedown. The design attributes are the
 * member's. */
typedef struct
{
  double            length;
  const TrbSupport *supports;
  guint             n_supports;
  const TrbLoad    *loads[TRB_N_CASES];
  guint             n_loads[TRB_N_CASES];
  double            repetitive_spacing;  /* m; NAN: from the member's "repetitive" flag */
  Memo             *memo;                /* lookups to reuse; may be NULL */
  const TrbMember  *member;              /* whose braces and design attributes they are */
  struct _MemberPlan *plan;              /* sizing: what its analyses share; may be NULL */
} MemberInput;

/* What sizing's analyses of one member share whatever the section, kept from the first: its
 * regions and live-load patterns, and its load cases and per-region results other than dead
 * load with a self-weight, solved again with each section's E I by
 * trb_beam_result_restiffen(), which gives what solving them gives. */
typedef struct _MemberPlan
{
  gboolean        ready;
  gboolean        self_weight;             /* of the first: D is its own for each section */
  TrbBeamResult  *cases[TRB_N_CASES];
  GArray         *regions;
  GArray         *patterns;
  TrbBeamResult **by_region[TRB_N_CASES];
  guint           n_regions;
  /* from the guess, solved on a beam of unit E I, for the first analysis to restiffen
   * instead of solving (NULL when none): the regions, the live-load patterns and L on each
   * region, and a uniform unit load (the reference's) */
  GArray            *seed_regions;
  GArray            *seed_patterns;
  TrbBeamResult    **seed_live;
  guint              n_seed_live;
  TrbBeamResult     *seed_unit;
  /* the deflection checks' spans and the flexure segments (SpanExtremes) */
  gboolean           have_cuts;
  TrbDeflectionSpan *spans;
  guint              n_spans;
  double            *seg;
  guint              n_seg;
} MemberPlan;

/* The extremes of the deflection sets' entries over each span the deflection checks judge,
 * found with the entries' own extremes (evaluate_set()), for trb_solve_priv_design_checks(). */
typedef struct
{
  TrbDeflectionSpan *spans;
  guint              n_spans;
  GArray            *live;    /* TrbBeamExtremes: n_spans for each entry of r->live */
  GArray            *total;   /* the same for r->total */
  /* and the strength entries' extremes over the flexure segments of the member's method */
  double            *seg;     /* n_seg + 1 points */
  guint              n_seg;
  GArray            *strength;
} SpanExtremes;

/* Sizing's lean analysis of a section: only the entries of each set that keep marks (by
 * their place among all; NULL: every one), without envelopes; whether the entries left out
 * and the cases are finite is proved from the size of what they are made of, and unproved
 * says when it cannot be. */
typedef struct
{
  const gboolean *keep[3];   /* strength, live, total */
  gboolean        unproved;
} Lean;

/* Small helpers the analysis and sizing both call, sizing for each candidate: inline in each,
 * as they were in one file. */

/* The member's steel grade, NULL when it is unknown (the memo keeps the last one looked up,
 * whose name sizing asks for again and again) */
static inline const TrbSteelGrade *
trb_solve_priv_steel_grade_of (const TrbMember   *m,
                               const MemberInput *in,
                               const TrbSettings *s)
{
  const char *name = trb_member_get_steel_grade (m, s);
  Memo *memo = in->memo;

  if (memo == NULL)
    return trb_design_steel_lookup_grade (name);
  if (memo->steel_name == NULL || strcmp (memo->steel_name, name) != 0)
    {
      g_free (memo->steel_name);
      memo->steel_name = g_strdup (name);
      memo->steel = trb_design_steel_lookup_grade (name);
    }
  return memo->steel;
}

static inline void
trb_solve_priv_wood_options_for (const TrbMember   *m,
                                 const MemberInput *in,
                                 TrbWoodOptions    *options)
{
  trb_design_wood_options_init (options);
  options->wet_service = m->wet_service;
  options->incised = m->incised;
  /* A standalone member marked repetitive is one of three or more like members at 24 in or
   * less tied by sheathing (NDS 2018 4.3.9); a floor's joist runs give their real spacing. */
  if (m->repetitive)
    options->repetitive_spacing = isnan (in->repetitive_spacing) ? 24 * TRB_IN
                                                                 : in->repetitive_spacing;
  if (!isnan (m->bearing_length))
    options->bearing_length = m->bearing_length;
}

static inline void
trb_solve_priv_span_extremes_clear (SpanExtremes *sx)
{
  g_clear_pointer (&sx->spans, g_free);
  g_clear_pointer (&sx->live, g_array_unref);
  g_clear_pointer (&sx->total, g_array_unref);
  g_clear_pointer (&sx->seg, g_free);
  g_clear_pointer (&sx->strength, g_array_unref);
}

/* trb-solve.c */
gboolean trb_solve_priv_analyse (const TrbProject  *project,
                                 const MemberInput *in,
                                 double             E,
                                 double             I,
                                 double             self_weight,
                                 TrbMemberResult   *r,
                                 SpanExtremes      *sx,
                                 Lean              *lean);
const GArray *trb_solve_priv_combos_for (TrbComboSet     set,
                                         const gboolean *has_case);
void trb_solve_priv_design_checks (const TrbProject   *project,
                                   const TrbMember    *m,
                                   const MemberInput  *in,
                                   const TrbSection   *section,
                                   const TrbWoodGrade *wood_grade,
                                   const SpanExtremes *sx,
                                   gboolean            no_detail,
                                   TrbMemberResult    *r);
void trb_solve_priv_member_plan_clear (MemberPlan *plan);
TrbMemberResult *trb_solve_priv_member_result_new (const TrbProject *project,
                                                   const TrbMember  *member);
TrbMemberResult *trb_solve_priv_member_result_share (TrbMemberResult *r,
                                                     const TrbMember *member);
void trb_solve_priv_memo_free (Memo *memo);
Memo *trb_solve_priv_memo_new (void);
TrbMemberResult *trb_solve_priv_solve_input (const TrbProject  *project,
                                             const TrbMember   *member,
                                             const MemberInput *in,
                                             guint              shortlist_max,
                                             gboolean           use_bounds);
TrbMemberResult *trb_solve_priv_solve_standalone (const TrbProject *project,
                                                  const TrbMember  *member,
                                                  guint             shortlist_max,
                                                  gboolean          use_bounds);
void trb_solve_priv_standalone_input (const TrbMember *member,
                                      MemberInput     *in,
                                      GArray          *supports,
                                      GArray         **loads);
const TrbWoodGrade *trb_solve_priv_wood_grade_for (const TrbMember   *m,
                                                   const MemberInput *in,
                                                   const TrbSection  *section,
                                                   char             **why);
void trb_solve_priv_set_status (TrbMemberResult *r,
                                TrbStatus        status,
                                const char      *format,
                                ...) G_GNUC_PRINTF (3, 4);

/* trb-sizing.c */
const TrbSection *trb_solve_priv_lookup_section (const TrbProject *project,
                                                 const char       *designation);
TrbMemberResult *trb_solve_priv_size_member (const TrbProject  *project,
                                             const TrbMember   *m,
                                             const MemberInput *in,
                                             const TrbSection  *chosen,
                                             guint              shortlist_max,
                                             gboolean           use_bounds,
                                             gboolean           reject,
                                             GArray            *list_only);

/* trb-solve-floor.c */
TrbProjectResult *trb_solve_priv_solve_project (const TrbProject      *project,
                                                const TrbSolveOptions *options,
                                                const TrbFloor        *only_floor,
                                                TrbSolveCache         *keep);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (Memo, trb_solve_priv_memo_free)

G_END_DECLS
