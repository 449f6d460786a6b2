/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-combos.h"
#include "trb-design.h"
#include "trb-frame.h"
#include "trb-live-reduction.h"
#include "trb-model.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* The per-member pipeline: build the beam, solve each load case (and each live-load region),
 * form the combinations of the member's method and the deflection sets, with live-load
 * patterns, take envelopes, then design. Floors go through the load takedown first: the frame
 * (trb-frame) says what each member rests on and what it carries, the members are solved from
 * the top of the load path down, and each one's reactions become loads on what is below it,
 * down to the columns and walls (docs/takedown.md). Pure: the same project gives
 * bit-identical results. The results are plain structs that the CLI, the report and the editor
 * read. */

typedef enum
{
  TRB_STATUS_PASS,          /* every check made, none above 1 */
  TRB_STATUS_FAIL,          /* some check above 1 */
  TRB_STATUS_UNSTABLE,      /* the supports make a mechanism */
  TRB_STATUS_UNSUPPORTED,   /* no support at all */
  TRB_STATUS_NOT_DESIGNED,  /* analysed (or not: no E and I yet) but not all checks made */
  TRB_STATUS_ERROR,         /* the analysis failed for another reason: see message */
} TrbStatus;

/* The range of one support's reaction over a set of combinations. */
typedef struct
{
  double x;
  double force_max;   /* N, upward + */
  double force_min;
  double moment_max;  /* N*m, counter-clockwise + */
  double moment_min;
} TrbReactionRange;

/* One combination evaluated under one live-load pattern. */
typedef struct
{
  TrbCombo        combo;         /* its name, equation and case factors */
  char            pattern[96];   /* "" when the combination is not patterned */
  char            name[160];     /* combo.name, then " (pattern)" when patterned */
  TrbBeamResult  *result;        /* owned */
  TrbBeamExtremes ext;           /* over the whole member */
} TrbComboResult;

/* The extremes over a set of combinations and patterns, and which one gave each: the name of
 * that entry of the set ("" when none), pointing into the set's entries, so that a floor of
 * ten thousand results stays small. */
typedef struct
{
  gboolean        empty;         /* no combination in the set */
  TrbBeamExtremes ext;
  const char     *V_max_by;
  const char     *V_min_by;
  const char     *M_max_by;
  const char     *M_min_by;
  const char     *defl_down_by;
  const char     *defl_up_by;
  GArray         *reactions;     /* TrbReactionRange, one per support, sorted by x */
} TrbEnvelope;

typedef struct
{
  TrbComboSet  set;
  GArray      *entries;          /* TrbComboResult, combinations in order, patterns within */
  TrbEnvelope  envelope;
} TrbComboSetResult;

/* A passing section of the shortlist. */
typedef struct
{
  char   section[32];
  double weight;         /* N/m */
  double ratio;          /* the governing check's ratio */
  char   governing[40];  /* the governing check's name */
} TrbShortlistEntry;

/* How many passing sections the shortlist shows (the CLI, the member sheets, the editor). */
#define TRB_SHORTLIST_DEFAULT 10

/* What one support of a floor member rests on, and the reaction it hands down there. */
typedef struct
{
  double          x;                    /* m along the member */
  gboolean        own;                  /* a <support> the member gives itself: nothing in the
                                         * plan takes its reaction (kind, id and position are
                                         * unset) */
  TrbBearingKind  kind;                 /* a column, a wall or a member below */
  const char     *id;                   /* its mark (the model's string); NULL when own */
  double          position;             /* m along the member or wall below; 0 on a column */
  double          force[TRB_N_CASES];   /* N, downward on what is below; live load unreduced
                                         * (ASCE 7-16 §4.7: each member reduces its own) */
} TrbMemberBearing;

/* Live load reduction (ASCE 7-16 §4.7) as one floor member or column used it. */
typedef struct
{
  gboolean    applies;       /* reduction is on and it carries reducible live load */
  double      area;          /* A_T, m^2: the area of reducible live load it carries */
  double      k_ll;          /* Table 4.7-1 */
  guint       floors;        /* how many floors it supports */
  double      factor;        /* L/Lo on the reducible live load; 1 when not reduced */
  TrbLiveRule rule;          /* which rule set the factor (when applies) */
  double      reducible;     /* N: its reducible live load, unreduced */
  double      other;         /* N: live load never reduced (partitions, loads over 100 psf,
                              * garages, assembly uses, line and point loads) */
} TrbReductionUse;
typedef struct
{
  const TrbMember  *member;      /* not owned: the project outlives its results */
  TrbStatus         status;
  char             *message;     /* why the status is not pass; NULL when it is */
  GPtrArray        *notes;       /* char *: things the reader should know (self-weight left
                                  * out, patterns off, ...) */
  TrbMethod         method;
  TrbUnitSystem     units;

  /* analysis: only when analysed is TRUE */
  gboolean          analysed;
  double            E;           /* Pa */
  double            I;           /* m^4 */
  double            self_weight; /* N/m added to case D; 0 when none */
  TrbBeam          *beam;
  gboolean          has_case[TRB_N_CASES];
  TrbBeamResult    *cases[TRB_N_CASES];     /* NULL for an absent case */
  TrbBeamExtremes   case_ext[TRB_N_CASES];
  GArray           *regions;     /* TrbRegion */
  GArray           *patterns;    /* TrbPattern; empty when patterns are off or not needed */
  TrbComboSetResult strength;    /* the method's combinations: LRFD, ASD or service */
  TrbComboSetResult live;        /* live-load deflection set */
  TrbComboSetResult total;       /* total-load deflection set */

  /* design: what was checked. The design step owns these fields. */
  char              section[32]; /* the designation checked; "" when none */
  GArray           *checks;      /* TrbCheck */
  double            ratio;       /* the largest check ratio; NAN when nothing was checked */
  char              governing[40];  /* the name of the check with that ratio */
  GArray           *shortlist;   /* TrbShortlistEntry: passing sections, lightest first, ties
                                  * by depth; for catalog and "auto" members, only when the
                                  * solve was asked for one (TrbSolveOptions.shortlist_max);
                                  * else empty: trb_solve_member_shortlist() makes it */

  /* What was analysed: the supports (TrbSupport, sorted by x) and every load, case by case
   * (TrbMemberLoad with line 0 for those that are not the member's own: the floor's strip,
   * line and point loads and the reactions handed down, live load as reduced). NULL when the
   * member was not analysed. Identical members of a floor share these and the results above:
   * read them, never change them. */
  GArray           *supports;
  GArray           *loads;

  /* Floor members (member->floor != NULL); NULL or zero for standalone beams. */
  GArray           *bearings;    /* TrbMemberBearing, one per support, sorted by x; set even
                                  * when the member could not be analysed (forces then 0) */
  TrbReductionUse   reduction;
  char             *plan_note;   /* what the frame remarks on its placing (a listed bearing
                                  * point that rests on nothing); NULL */

  struct _TrbMemberKeep *keep;   /* private: owns beam and cases when they are shared */
  struct _TrbMemberSizing *sizing; /* private: what a catalog or "auto" member was sized on,
                                    * for trb_solve_member_shortlist() */
  struct _TrbMemberPending *pending; /* private: what trb_member_result_complete() finds */
} TrbMemberResult;

/* The load on one column of a floor, from everything that rests on it. */
typedef struct
{
  const TrbColumn  *column;              /* not owned */
  const TrbFloor   *floor;
  double            force[TRB_N_CASES];  /* N, downward, live load unreduced */
  TrbReductionUse   reduction;
  double            live_reduced;        /* N: force[L] after reduction (the factor on the
                                          * reducible part); force[L] when not reduced */
  gboolean          cantilever;          /* a member resting on it runs on past it */
} TrbColumnResult;

/* The load along one wall: point loads at the distance along it from its first point. */
typedef struct
{
  const TrbWall    *wall;                /* not owned */
  const TrbFloor   *floor;
  double            force[TRB_N_CASES];  /* N, the total per case, downward */
  GArray           *loads[TRB_N_CASES];  /* TrbLoad (TRB_LOAD_POINT), sorted by position */
} TrbWallResult;

/* A load placed in plan that lies on no member, so nothing carries it. */
typedef struct
{
  const TrbPointLoad *point;   /* one of point and line is set */
  const TrbLineLoad  *line;
  double              length;  /* m of the line load on no member; 0 for a point load */
  double              force;   /* N: P, or w times that length */
} TrbUnassignedLoad;

typedef struct
{
  const TrbFloor   *floor;                      /* not owned */
  char             *error;                      /* the plan could not be framed: why; NULL */
  GArray           *columns;                    /* TrbColumnResult, in the floor's order */
  GArray           *walls;                      /* TrbWallResult, in the floor's order */
  GArray           *unassigned;                 /* TrbUnassignedLoad, in plan order */
  /* Per case, N downward. applied: every load that reached a member (area loads over the
   * strips, line and point loads, the members' own loads, self-weights of the members
   * analysed). reactions: what reached the columns, walls and the members' own supports
   * (supports, the last of these). not_carried: what stayed on members that could not be
   * analysed (unsupported, in a cycle, errors). applied = reactions + not_carried. */
  double            applied[TRB_N_CASES];
  double            reactions[TRB_N_CASES];
  double            supports[TRB_N_CASES];
  double            not_carried[TRB_N_CASES];
} TrbFloorResult;

typedef struct
{
  const TrbProject *project;     /* not owned */
  GPtrArray        *members;     /* TrbMemberResult, in the project's order */
  GPtrArray        *floors;      /* TrbFloorResult, in the project's order */
} TrbProjectResult;

/* How trb_solve_project_full() works; the shortcuts never change a result, bit for bit. */
typedef struct
{
  guint    shortlist_max;  /* passing sections listed per member; default 0: none (those
                            * that show it ask for TRB_SHORTLIST_DEFAULT, or for one
                            * member's with trb_solve_member_shortlist()) */
  gboolean cache;          /* solve identical members once (same length, supports, loads
                            * and design attributes); default TRUE */
  gboolean bounds;         /* in sizing, reject sections by exact bounds (live deflection,
                            * moment) before the full check; default TRUE */
} TrbSolveOptions;

/* What a document keeps between solves to re-solve only what an edit changed. */
typedef struct _TrbSolveCache TrbSolveCache;

const char       *trb_status_name           (TrbStatus               status);

TrbMemberResult  *trb_solve_member          (const TrbProject       *project,
                                             const TrbMember        *member);
TrbMemberResult  *trb_solve_member_full     (const TrbProject       *project,
                                             const TrbMember        *member,
                                             guint                   shortlist_max);
void              trb_member_result_free    (TrbMemberResult        *result);
void              trb_member_result_complete (const TrbMemberResult *result);
GArray           *trb_solve_member_shortlist (const TrbProject      *project,
                                              const TrbMemberResult *result,
                                              guint                  max);

void              trb_solve_options_init    (TrbSolveOptions        *options);
TrbProjectResult *trb_solve_project         (const TrbProject       *project);
TrbProjectResult *trb_solve_project_full    (const TrbProject       *project,
                                             const TrbSolveOptions  *options);
TrbProjectResult *trb_solve_project_cached  (const TrbProject       *project,
                                             const TrbSolveOptions  *options,
                                             TrbSolveCache          *cache);
void              trb_project_result_free   (TrbProjectResult       *result);

TrbSolveCache    *trb_solve_cache_new       (void);
void              trb_solve_cache_free      (TrbSolveCache          *cache);
void              trb_solve_cache_get_counts (const TrbSolveCache   *cache,
                                              guint                 *solved,
                                              guint                 *reused,
                                              guint                 *frames);
const TrbMemberResult *trb_project_result_find_member (const TrbProjectResult *result,
                                                       const TrbMember        *member);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbMemberResult, trb_member_result_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbProjectResult, trb_project_result_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbSolveCache, trb_solve_cache_free)

G_END_DECLS
