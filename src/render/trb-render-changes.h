/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-model.h"
#include "trb-render-flow.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* Changes since a previous version of the project: the members whose section, status or
 * loads changed, and those added or removed, matched by mark. The plan rings the changed
 * members with revision clouds and the report lists them. */

typedef enum
{
  TRB_CHANGE_ADDED    = 1 << 0,
  TRB_CHANGE_REMOVED  = 1 << 1,
  TRB_CHANGE_SECTION  = 1 << 2,   /* the section checked (or chosen) differs */
  TRB_CHANGE_STATUS   = 1 << 3,   /* passes, fails, unsupported, ... differs */
  TRB_CHANGE_LOADS    = 1 << 4,   /* its own loads, or the load it carries in some case */
} TrbChangeFlags;

typedef struct
{
  char            *id;
  const TrbMember *member;      /* in the new project; NULL when removed */
  const TrbMember *previous;    /* in the old project; NULL when added */
  TrbChangeFlags   flags;
  char            *before;      /* what changed, as it was and as it is now */
  char            *after;
} TrbChange;

void        trb_change_free         (TrbChange              *change);

/* The changes, in the new project's member order, removed members last (old order). */
GPtrArray  *trb_changes_compute     (const TrbProject       *old_project,
                                     const TrbProjectResult *old_results,
                                     const TrbProject       *project,
                                     const TrbProjectResult *results);
/* The set of new members to ring (every change but a removal). */
GHashTable *trb_changes_clouded     (GPtrArray              *changes);
/* "section, loads" */
char       *trb_change_describe     (TrbChangeFlags          flags);

/* Appends the list of changes to a flow. */
void        trb_changes_flow        (TrbFlow                *flow,
                                     GPtrArray              *changes,
                                     const char             *since);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbChange, trb_change_free)

G_END_DECLS
