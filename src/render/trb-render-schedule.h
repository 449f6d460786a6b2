/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-model.h"
#include "trb-render-flow.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* The schedule: one row a member (mark, floor, material, section, length, status, ratio,
 * governing check) and one row a column (its loads per case, unfactored), as flows that
 * paginate with their headers repeated. */

/* results: the member results to list, in order (TrbMemberResult *). */
void      trb_schedule_members_flow    (TrbFlow                *flow,
                                        const TrbProject       *project,
                                        GPtrArray              *results);
/* Returns FALSE (and adds nothing) when the project has no columns. */
gboolean  trb_schedule_columns_flow    (TrbFlow                *flow,
                                        const TrbProject       *project,
                                        const TrbProjectResult *results);

/* The loads on column index of floor per case (N, downward +), from the floor solve. FALSE
 * when the results carry none. */
gboolean  trb_schedule_column_loads    (const TrbProjectResult *results,
                                        const TrbFloor         *floor,
                                        guint                   column,
                                        double                  force[TRB_N_CASES]);

G_END_DECLS
