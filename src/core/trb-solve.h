/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-combos.h"
#include "trb-design.h"
#include "trb-model.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* The per-member pipeline: build the beam, solve each load case (and each live-load region),
 * form the combinations of the member's method and the deflection sets, with live-load
 * patterns, take envelopes, then design. Pure: the same project gives bit-identical results.
 * The results are plain structs that the CLI, the report and the editor read. */

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

/* The extremes over a set of combinations and patterns, and which one gave each. */
typedef struct
{
  gboolean        empty;         /* no combination in the set */
  TrbBeamExtremes ext;
  char            V_max_by[160];
  char            V_min_by[160];
  char            M_max_by[160];
  char            M_min_by[160];
  char            defl_down_by[160];
  char            defl_up_by[160];
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

/* How many passing sections trb_solve_member() lists. */
#define TRB_SHORTLIST_DEFAULT 10

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
                                  * by depth; for catalog and "auto" members */
} TrbMemberResult;

typedef struct
{
  const TrbProject *project;     /* not owned */
  GPtrArray        *members;     /* TrbMemberResult, in the project's order */
} TrbProjectResult;

const char       *trb_status_name           (TrbStatus               status);

TrbMemberResult  *trb_solve_member          (const TrbProject       *project,
                                             const TrbMember        *member);
TrbMemberResult  *trb_solve_member_full     (const TrbProject       *project,
                                             const TrbMember        *member,
                                             guint                   shortlist_max);
void              trb_member_result_free    (TrbMemberResult        *result);

TrbProjectResult *trb_solve_project         (const TrbProject       *project);
void              trb_project_result_free   (TrbProjectResult       *result);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbMemberResult, trb_member_result_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbProjectResult, trb_project_result_free)

G_END_DECLS
