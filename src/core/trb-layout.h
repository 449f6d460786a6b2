/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-frame.h"
#include "trb-model.h"

G_BEGIN_DECLS

/* Joist runs: a row of parallel joists at a spacing, laid out in one gesture between two
 * parallel supporting members (girders or beams). Each joist is an ordinary member of the
 * floor, perpendicular to the first support, from a point on the first support's line to a
 * point on the second's, sharing the run's group id. */

/* More joists than this in one run is an error: a slip of the spacing ("1 in" for "16 in"),
 * not a floor. */
#define TRB_LAYOUT_MAX_JOISTS 10000

typedef enum
{
  TRB_LAYOUT_FROM_START,   /* the first joist near the start of support A */
  TRB_LAYOUT_FROM_END,     /* ... near its end */
} TrbLayoutStart;

typedef struct
{
  double           spacing;   /* m, centre to centre; > 0 */
  TrbLayoutStart   start;     /* from which end (in support A's direction) the run starts */
  double           offset;    /* m from that end of the common extent to the first joist,
                               * >= 0; NAN for one spacing */
  const TrbMember *template;  /* nullable: material, section and design attributes to copy */
  const char      *group;     /* nullable: the run's group id; NULL for the next free "R<n>" */
  const char      *prefix;    /* nullable: mark prefix; NULL for "J" */
} TrbJoistRunSpec;

/* One joist of a preview: from its end on support A to its end on support B. */
typedef struct
{
  TrbFramePoint start;
  TrbFramePoint end;
} TrbLayoutLine;

void        trb_joist_run_spec_init (TrbJoistRunSpec        *spec,
                                     double                  spacing);

GArray     *trb_layout_preview      (const TrbMember        *support_a,
                                     const TrbMember        *support_b,
                                     const TrbJoistRunSpec  *spec,
                                     GError                **error);

GPtrArray  *trb_layout_joist_run    (TrbProject             *project,
                                     TrbFloor               *floor,
                                     const TrbMember        *support_a,
                                     const TrbMember        *support_b,
                                     const TrbJoistRunSpec  *spec,
                                     GError                **error);

char       *trb_layout_next_group   (const TrbProject       *project);

G_END_DECLS
