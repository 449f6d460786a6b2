/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-design.h"

void
trb_check_set (TrbCheck     *check,
               const char   *name,
               const char   *clause,
               TrbDimension  dimension,
               double        demand,
               double        capacity,
               const char   *combination,
               double        x)
{
  g_return_if_fail (check != NULL);

  memset (check, 0, sizeof *check);
  g_strlcpy (check->name, name, sizeof check->name);
  g_strlcpy (check->clause, clause, sizeof check->clause);
  check->dimension = dimension;
  check->demand = demand;
  check->capacity = capacity;
  /* A zero capacity with a demand is a failure, not a division by zero. */
  if (capacity > 0)
    check->ratio = fabs (demand) / capacity;
  else
    check->ratio = demand == 0 ? 0 : INFINITY;
  g_strlcpy (check->combination, combination != NULL ? combination : "", sizeof check->combination);
  check->x = x;
}
