/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>

#include "trb-error.h"
#include "trb-layout.h"

/**
 * trb_joist_run_spec_init:
 * @spec: a spec to fill
 * @spacing: m, centre to centre
 *
 * The defaults: from the start of support A, the first joist one spacing in, no template
 * (steel, section "auto"), a new group, marks "J1", "J2", ...
 */
void
trb_joist_run_spec_init (TrbJoistRunSpec *spec,
                         double           spacing)
{
  g_return_if_fail (spec != NULL);

  spec->spacing = spacing;
  spec->start = TRB_LAYOUT_FROM_START;
  spec->offset = NAN;
  spec->template = NULL;
  spec->group = NULL;
  spec->prefix = NULL;
}

/* The joist lines, or FALSE with the error set. */
static gboolean
compute_lines (const TrbMember       *a,
               const TrbMember       *b,
               const TrbJoistRunSpec *spec,
               GArray                *lines,
               GError               **error)
{
  double ax = a->end.x - a->start.x;
  double ay = a->end.y - a->start.y;
  double bx = b->end.x - b->start.x;
  double by = b->end.y - b->start.y;
  double la = hypot (ax, ay);
  double lb = hypot (bx, by);
  double ux, uy, nx, ny, angle, dist, t0, t1, lo, hi, extent, offset, usable;
  double count;

  if (!(spec->spacing > 0) || !isfinite (spec->spacing))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "the joist spacing must be greater than zero");
      return FALSE;
    }
  offset = isnan (spec->offset) ? spec->spacing : spec->offset;
  if (!(offset >= 0) || !isfinite (offset))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "the offset of the first joist must be zero or more");
      return FALSE;
    }
  if (!(la > 0) || !(lb > 0) || !isfinite (la) || !isfinite (lb))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "a supporting member has no length");
      return FALSE;
    }

  ux = ax / la;
  uy = ay / la;
  /* the angle between the two lines, whichever way each is drawn */
  angle = asin (MIN (1.0, fabs (ux * by - uy * bx) / lb));
  if (angle > TRB_FRAME_PARALLEL_ANGLE)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "members %s and %s are not parallel (%.1f degrees apart; a joist run needs "
                   "them within %.0f)", a->id, b->id, angle * 180 / G_PI,
                   TRB_FRAME_PARALLEL_ANGLE * 180 / G_PI);
      return FALSE;
    }

  /* the normal from A towards B, and how far B's start lies from A's line */
  nx = -uy;
  ny = ux;
  dist = (b->start.x - a->start.x) * nx + (b->start.y - a->start.y) * ny;
  if (dist < 0)
    {
      nx = -nx;
      ny = -ny;
      dist = -dist;
    }
  if (dist <= TRB_FRAME_TOLERANCE)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "members %s and %s lie on one line: no joist can span between them",
                   a->id, b->id);
      return FALSE;
    }

  /* the stretch of A's line that B also covers, measured along A from its start */
  t0 = (b->start.x - a->start.x) * ux + (b->start.y - a->start.y) * uy;
  t1 = (b->end.x - a->start.x) * ux + (b->end.y - a->start.y) * uy;
  lo = MAX (0.0, MIN (t0, t1));
  hi = MIN (la, MAX (t0, t1));
  extent = hi - lo;
  if (!(extent > TRB_FRAME_TOLERANCE))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "members %s and %s do not overlap: no joist can span between them",
                   a->id, b->id);
      return FALSE;
    }

  /* Joists at offset, offset + s, ... from the starting end, and more than the framing
   * tolerance short of the far end: with the default offset of one spacing, none lands on
   * the members that close the bay at either end. */
  usable = extent - TRB_FRAME_TOLERANCE - offset;
  if (usable < 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "no joist fits: the supports share %.3f m, and the first joist would be "
                   "%.3f m in", extent, offset);
      return FALSE;
    }
  /* a billionth of slack so that a run of exact multiples keeps its last joist */
  count = floor (usable / spec->spacing * (1 + 1e-9)) + 1;
  if (count > TRB_LAYOUT_MAX_JOISTS)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "%.0f joists at this spacing; a run holds at most %d", count,
                   TRB_LAYOUT_MAX_JOISTS);
      return FALSE;
    }

  for (guint k = 0; k < (guint) count; k++)
    {
      double d = offset + k * spec->spacing;
      double t = spec->start == TRB_LAYOUT_FROM_START ? lo + d : hi - d;
      TrbLayoutLine line;
      double den, s;

      line.start.x = a->start.x + t * ux;
      line.start.y = a->start.y + t * uy;
      /* where the perpendicular from A meets B's line: start + s n = b.start + r (bx, by) */
      den = nx * by - ny * bx;
      if (fabs (den) < 1e-300)
        s = dist;
      else
        s = ((b->start.x - line.start.x) * by - (b->start.y - line.start.y) * bx) / den;
      line.end.x = line.start.x + s * nx;
      line.end.y = line.start.y + s * ny;
      g_array_append_val (lines, line);
    }
  return TRUE;
}

/**
 * trb_layout_preview:
 * @support_a: the member the joists start on
 * @support_b: the member they end on, parallel to @support_a (within 2 degrees)
 * @spec: spacing, start, offset
 * @error: return location for a #TRB_ERROR
 *
 * The joist lines trb_layout_joist_run() would lay out, for the editor to draw while the
 * engineer chooses; nothing is created.
 *
 * Returns: (transfer full) (element-type TrbLayoutLine): the lines in laying order, or %NULL
 *   with @error set (TRB_ERROR_INVALID: supports not parallel, on one line or not overlapping;
 *   spacing not above zero; negative offset; no joist fits; more than
 *   %TRB_LAYOUT_MAX_JOISTS).
 */
GArray *
trb_layout_preview (const TrbMember        *support_a,
                    const TrbMember        *support_b,
                    const TrbJoistRunSpec  *spec,
                    GError                **error)
{
  g_autoptr(GArray) lines = g_array_new (FALSE, FALSE, sizeof (TrbLayoutLine));

  g_return_val_if_fail (support_a != NULL && support_b != NULL && spec != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!compute_lines (support_a, support_b, spec, lines, error))
    return NULL;
  return g_steal_pointer (&lines);
}

/**
 * trb_layout_next_group:
 * @project: a project
 *
 * Returns: (transfer full): the first group id "R1", "R2", ... no member of @project has.
 */
char *
trb_layout_next_group (const TrbProject *project)
{
  g_autoptr(GHashTable) used = g_hash_table_new (g_str_hash, g_str_equal);

  g_return_val_if_fail (project != NULL, NULL);

  for (guint i = 0; i < project->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (project->members, i);

      if (m->group != NULL)
        g_hash_table_add (used, m->group);
    }
  for (guint n = 1;; n++)
    {
      char *group = g_strdup_printf ("R%u", n);

      if (!g_hash_table_contains (used, group))
        return group;
      g_free (group);
    }
}

/**
 * trb_layout_joist_run:
 * @project: the project that holds @floor
 * @floor: the floor of both supports
 * @support_a: the member the joists start on
 * @support_b: the member they end on, parallel to @support_a (within 2 degrees)
 * @spec: spacing, start, offset, template, group and mark prefix
 * @error: return location for a #TRB_ERROR
 *
 * Lays out a run of joists (see trb_layout_preview() for where they go): each a new member of
 * @floor with role joist, carrying the deck, the template's material, section and design
 * attributes (no supports, loads or braces: those belong to a place on a member), the run's
 * group id, and the next free mark of the prefix (J1, J2, ... skipping marks the project
 * holds). Nothing is created when an error is returned.
 *
 * Returns: (transfer container) (element-type TrbMember): the new joists in laying order,
 *   owned by the project; or %NULL with @error set.
 */
GPtrArray *
trb_layout_joist_run (TrbProject             *project,
                      TrbFloor               *floor,
                      const TrbMember        *support_a,
                      const TrbMember        *support_b,
                      const TrbJoistRunSpec  *spec,
                      GError                **error)
{
  g_autoptr(GArray) lines = NULL;
  g_autofree char *group = NULL;
  GPtrArray *joists;
  guint counter = 0;

  g_return_val_if_fail (project != NULL && floor != NULL && spec != NULL, NULL);
  g_return_val_if_fail (support_a != NULL && support_b != NULL, NULL);
  g_return_val_if_fail (support_a->floor == floor && support_b->floor == floor, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  lines = trb_layout_preview (support_a, support_b, spec, error);
  if (lines == NULL)
    return NULL;

  group = spec->group != NULL ? g_strdup (spec->group) : trb_layout_next_group (project);
  joists = g_ptr_array_sized_new (lines->len);
  for (guint i = 0; i < lines->len; i++)
    {
      const TrbLayoutLine *line = &g_array_index (lines, TrbLayoutLine, i);
      g_autofree char *mark = trb_project_next_mark (project,
                                                     spec->prefix != NULL ? spec->prefix : "J",
                                                     &counter);
      TrbMember *m = trb_member_new (mark);

      if (spec->template != NULL)
        trb_member_copy_design (m, spec->template);
      trb_member_set_role (m, TRB_FRAME_ROLE_JOIST);
      m->group = g_strdup (group);
      trb_member_set_plan (m, line->start, line->end);
      trb_floor_add_member (project, floor, m);
      g_ptr_array_add (joists, m);
    }
  return joists;
}
