/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* Plan geometry of one floor: which member bears on what, each member's supports and loads in
 * its own coordinate, the bearing order, and the hand-off of reactions down the load path.
 * Plan coordinates are metres in any fixed x-y frame; a member's own coordinate x runs from its
 * start (0) to its end (its length). The rules are in docs/framing.md. */

/* How close a point must be to a column, a wall or a member's line to bear on it: 25 mm,
 * about 1 in, the drawing tolerance of the trade (common practice). */
#define TRB_FRAME_TOLERANCE 0.025

/* Two members whose axes differ by no more than this angle are parallel: they never bear on
 * each other, and they bound each other's tributary strips. Radians (2 degrees). */
#define TRB_FRAME_PARALLEL_ANGLE (2.0 * G_PI / 180.0)

typedef struct
{
  double x;
  double y;
} TrbFramePoint;

typedef enum
{
  TRB_FRAME_ROLE_GIRDER,
  TRB_FRAME_ROLE_BEAM,
  TRB_FRAME_ROLE_JOIST,
} TrbFrameRole;

/* ---- input: the plan, borrowed for the duration of trb_frame_new() ---------------------- */

typedef struct
{
  const char          *id;
  double               x;
  double               y;
} TrbFrameColumn;

/* A bearing wall: a polyline of two or more points; members bear anywhere along it. */
typedef struct
{
  const char          *id;
  const TrbFramePoint *points;
  guint                n_points;
} TrbFrameWall;

typedef struct
{
  const char          *id;
  TrbFramePoint        start;
  TrbFramePoint        end;
  TrbFrameRole         role;
  gboolean             carries_deck;      /* the deck or sheathing rests on it: takes area load */
  const TrbFramePoint *bearing_points;    /* where it also rests on a member below, besides its
                                           * ends (each within the tolerance of its own line) */
  guint                n_bearing_points;
} TrbFrameMember;

/* A pressure (Pa, downward +) over a polygon of three or more points, either winding. */
typedef struct
{
  TrbLoadCase          load_case;
  double               pressure;
  const TrbFramePoint *points;
  guint                n_points;
} TrbFrameAreaLoad;

/* A hole in the floor: no area load inside it. */
typedef struct
{
  const TrbFramePoint *points;
  guint                n_points;
} TrbFrameOpening;

/* A load along a polyline (N/m, downward +), e.g. a partition standing on a member. */
typedef struct
{
  TrbLoadCase          load_case;
  double               w;
  const TrbFramePoint *points;
  guint                n_points;
} TrbFrameLineLoad;

typedef struct
{
  TrbLoadCase          load_case;
  double               P;                 /* N, downward + */
  double               x;
  double               y;
} TrbFramePointLoad;

typedef struct
{
  const TrbFrameColumn    *columns;
  guint                    n_columns;
  const TrbFrameWall      *walls;
  guint                    n_walls;
  const TrbFrameMember    *members;
  guint                    n_members;
  const TrbFrameAreaLoad  *area_loads;
  guint                    n_area_loads;
  const TrbFrameOpening   *openings;
  guint                    n_openings;
  const TrbFrameLineLoad  *line_loads;
  guint                    n_line_loads;
  const TrbFramePointLoad *point_loads;
  guint                    n_point_loads;
} TrbFramePlan;

/* ---- output -------------------------------------------------------------------------------- */

typedef enum
{
  TRB_BEARING_COLUMN,
  TRB_BEARING_WALL,
  TRB_BEARING_MEMBER,
} TrbBearingKind;

/* What one support of a member rests on. */
typedef struct
{
  TrbBearingKind kind;
  guint          index;     /* into the plan's columns, walls or members */
  const char    *id;        /* the frame's copy of that id */
  double         position;  /* m along the supporting member (from its start) or wall (from its
                             * first point); 0 on a column */
  TrbFramePoint  point;     /* where, in plan (on the axis of the member that bears) */
} TrbBearing;

typedef enum
{
  TRB_FRAME_SUPPORTED,
  TRB_FRAME_UNSUPPORTED,  /* no support, a single support, or resting on an unsupported member */
  TRB_FRAME_IN_CYCLE,     /* part of a bearing cycle (A on B on A) */
} TrbFrameStatus;

/* One piece of a deck member's tributary strip: over [a, b] of the member it takes the area
 * load from `left` metres on its left (counter-clockwise from its start-to-end direction) to
 * `right` metres on its right: half the distance to the next parallel deck member on that side.
 * INFINITY: no such member within the area loads' reach on that side, so the strip runs out to
 * the loads' edge. */
typedef struct
{
  double a;
  double b;
  double left;
  double right;
} TrbFrameStrip;

typedef struct
{
  const char          *id;
  double               length;
  TrbFrameStatus       status;
  const char          *reason;        /* why it is unsupported or in a cycle; NULL otherwise */
  const char          *note;          /* a listed bearing point that rests on nothing; or NULL */
  const TrbSupport    *supports;      /* sorted by x, all TRB_SUPPORT_PIN */
  const TrbBearing    *bearings;      /* bearings[i] is what supports[i] rests on */
  guint                n_supports;
  const TrbFrameStrip *strips;        /* deck members only; sorted by a */
  guint                n_strips;
  /* Per load case: area loads over the strip (uniform and linear pieces, sorted by a), then
   * the plan's line loads and point loads that lie on the member, in plan order. */
  const TrbLoad       *loads[TRB_N_CASES];
  guint                n_loads[TRB_N_CASES];
  double               loaded_area[TRB_N_CASES];  /* m^2 of area load over the strip */
} TrbFrameMemberResult;

/* The part of a line load that lies on no member. */
typedef struct
{
  guint  index;   /* into the plan's line loads */
  double length;  /* m */
} TrbFrameUnassigned;

/* A support reaction handed down: the load on what the member bears on. */
typedef struct
{
  TrbBearingKind kind;
  guint          index;                /* into the plan's columns, walls or members */
  double         position;             /* as TrbBearing.position */
  double         force[TRB_N_CASES];   /* N, downward + on what is below */
} TrbFrameHandoff;

typedef struct _TrbFrame         TrbFrame;

/* The loads handed down so far, member by member in the bearing order: point loads on the
 * members below, totals on columns, point loads along walls. It reads its frame, which must
 * outlive it. */
typedef struct _TrbFrameTakedown TrbFrameTakedown;

TrbFrame                   *trb_frame_new                    (const TrbFramePlan  *plan,
                                                              GError             **error);
void                        trb_frame_free                   (TrbFrame           *frame);

guint                       trb_frame_get_n_members          (const TrbFrame     *frame);
const TrbFrameMemberResult *trb_frame_get_member             (const TrbFrame     *frame,
                                                              guint               index);
gboolean                    trb_frame_lookup_member          (const TrbFrame     *frame,
                                                              const char         *id,
                                                              guint              *index);
const guint                *trb_frame_get_order              (const TrbFrame     *frame,
                                                              guint              *n_members);
const guint                *trb_frame_get_unassigned_points  (const TrbFrame     *frame,
                                                              guint              *n_loads);
const TrbFrameUnassigned   *trb_frame_get_unassigned_lines   (const TrbFrame     *frame,
                                                              guint              *n_loads);

gboolean                    trb_frame_hand_down              (const TrbFrame     *frame,
                                                              guint               member,
                                                              const double       *reactions,
                                                              guint               n_reactions,
                                                              TrbFrameHandoff    *out,
                                                              GError            **error);

TrbFrameTakedown           *trb_frame_takedown_new           (const TrbFrame     *frame);
void                        trb_frame_takedown_free          (TrbFrameTakedown   *takedown);
gboolean                    trb_frame_takedown_add           (TrbFrameTakedown   *takedown,
                                                              guint               member,
                                                              const double       *reactions,
                                                              guint               n_reactions,
                                                              GError            **error);
const TrbLoad              *trb_frame_takedown_get_member_loads (const TrbFrameTakedown *takedown,
                                                                 guint                   member,
                                                                 TrbLoadCase             load_case,
                                                                 guint                  *n_loads);
void                        trb_frame_takedown_release_member   (TrbFrameTakedown       *takedown,
                                                                 guint                   member);
double                      trb_frame_takedown_get_column_load  (const TrbFrameTakedown *takedown,
                                                                 guint                   column,
                                                                 TrbLoadCase             load_case);
const TrbLoad              *trb_frame_takedown_get_wall_loads   (const TrbFrameTakedown *takedown,
                                                                 guint                   wall,
                                                                 TrbLoadCase             load_case,
                                                                 guint                  *n_loads);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbFrame, trb_frame_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbFrameTakedown, trb_frame_takedown_free)

G_END_DECLS
