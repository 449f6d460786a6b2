/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* libFuzzer harness: any bytes as a project file. The loader must give a project or a
 * TRB_ERROR whose message is valid UTF-8; a project must solve, and every number of its
 * results must be finite unless the member's status says the analysis failed. Anything else
 * aborts, and so does any fault the sanitizers see. Built by tests/fuzz/meson.build with clang
 * only; run by build-aux/fuzz. */

#include "config.h"

#include <glib.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>

#include "trb-error.h"
#include "trb-project-io.h"
#include "trb-solve.h"

int LLVMFuzzerTestOneInput (const uint8_t *data,
                            size_t         size);

static void
require (gboolean    ok,
         const char *what)
{
  if (!ok)
    {
      g_printerr ("fuzz-project: %s\n", what);
      abort ();
    }
}

static void
require_finite (double      v,
                const char *what)
{
  if (!isfinite (v))
    {
      g_printerr ("fuzz-project: %s = %g is not finite\n", what, v);
      abort ();
    }
}

static void
check_extremes (const TrbBeamExtremes *e)
{
  require_finite (e->V_max, "V max");
  require_finite (e->V_min, "V min");
  require_finite (e->M_max, "M max");
  require_finite (e->M_min, "M min");
  require_finite (e->defl_down, "deflection down");
  require_finite (e->defl_up, "deflection up");
}

static void
check_beam_result (const TrbBeamResult *res)
{
  const TrbReaction *reactions;
  guint n;

  reactions = trb_beam_result_get_reactions (res, &n);
  for (guint i = 0; i < n; i++)
    {
      require_finite (reactions[i].force, "reaction");
      require_finite (reactions[i].moment, "reaction moment");
    }
}

static void
check_set (const TrbComboSetResult *set)
{
  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);

      check_beam_result (c->result);
      check_extremes (&c->ext);
    }
  if (!set->envelope.empty)
    check_extremes (&set->envelope.ext);
}

static void
check_member (const TrbMemberResult *r)
{
  require (r->status <= TRB_STATUS_ERROR, "status out of range");
  require (r->status == TRB_STATUS_PASS || r->message != NULL, "a status without a message");
  require (r->message == NULL || g_utf8_validate (r->message, -1, NULL),
           "a status message that is not UTF-8");
  if (r->status == TRB_STATUS_ERROR || r->status == TRB_STATUS_UNSTABLE)
    return;
  if (r->analysed)
    {
      for (guint c = 0; c < TRB_N_CASES; c++)
        if (r->cases[c] != NULL)
          {
            check_beam_result (r->cases[c]);
            check_extremes (&r->case_ext[c]);
          }
      check_set (&r->strength);
      check_set (&r->live);
      check_set (&r->total);
      for (guint i = 0; r->bearings != NULL && i < r->bearings->len; i++)
        for (guint c = 0; c < TRB_N_CASES; c++)
          require_finite (g_array_index (r->bearings, TrbMemberBearing, i).force[c],
                          "bearing force");
    }
  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, i);

      if (isnan (ck->ratio))
        continue;
      require_finite (ck->demand, "check demand");
      require_finite (ck->capacity, "check capacity");
      /* a zero capacity under a demand is a failure of ratio inf (trb_check_set()) */
      if (ck->capacity != 0)
        require_finite (ck->ratio, "check ratio");
    }
}

/* A floor's sums and the loads on its columns and walls, unless it is in error. */
static void
check_floor (const TrbFloorResult *fr)
{
  if (fr->error != NULL)
    {
      require (g_utf8_validate (fr->error, -1, NULL), "a floor error that is not UTF-8");
      return;
    }
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      require_finite (fr->applied[c], "floor applied");
      require_finite (fr->reactions[c], "floor reactions");
      require_finite (fr->supports[c], "floor supports");
      require_finite (fr->not_carried[c], "floor not carried");
    }
  for (guint i = 0; i < fr->columns->len; i++)
    {
      const TrbColumnResult *col = &g_array_index (fr->columns, TrbColumnResult, i);

      require_finite (col->live_reduced, "column live load reduced");
      for (guint c = 0; c < TRB_N_CASES; c++)
        require_finite (col->force[c], "column load");
    }
  for (guint i = 0; i < fr->walls->len; i++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      require_finite (g_array_index (fr->walls, TrbWallResult, i).force[c], "wall load");
  for (guint i = 0; i < fr->unassigned->len; i++)
    require_finite (g_array_index (fr->unassigned, TrbUnassignedLoad, i).force,
                    "unassigned load");
}

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(TrbProjectResult) result = NULL;

  project = trb_project_load_data ((const char *) data, size, "fuzz", &error);
  if (project == NULL)
    {
      require (error != NULL && error->domain == TRB_ERROR, "a failure without a TRB_ERROR");
      require (g_utf8_validate (error->message, -1, NULL), "an error that is not UTF-8");
      require (g_str_has_prefix (error->message, "fuzz"), "an error that does not name the file");
      return 0;
    }
  require (error == NULL, "a project and an error");

  result = trb_solve_project (project);
  require (result->members->len == project->members->len, "a result per member");
  for (guint i = 0; i < result->members->len; i++)
    check_member (g_ptr_array_index (result->members, i));
  require (result->floors->len == project->floors->len, "a result per floor");
  for (guint i = 0; i < result->floors->len; i++)
    check_floor (g_ptr_array_index (result->floors, i));
  return 0;
}
