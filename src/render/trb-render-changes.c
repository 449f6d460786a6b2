/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-changes.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "trb-combos.h"
#include "trb-render-sheet.h"
#include "trb-units.h"

/* Two loads are the same when they differ by no more than this, relative to the larger: the
 * file's text holds about six significant figures, so less is rounding, not a change. */
#define LOAD_RTOL 1e-6
/* and below this many newtons (about a thousandth of a pound) a difference is noise */
#define LOAD_ATOL 1e-3

void
trb_change_free (TrbChange *change)
{
  if (change == NULL)
    return;
  g_free (change->id);
  g_free (change->before);
  g_free (change->after);
  g_free (change);
}

static gboolean
same_value (double a,
            double b)
{
  if (isnan (a) || isnan (b))
    return isnan (a) && isnan (b);
  return fabs (a - b) <= MAX (LOAD_ATOL, LOAD_RTOL * MAX (fabs (a), fabs (b)));
}

static const char *
section_of (const TrbMember       *m,
            const TrbMemberResult *r)
{
  if (r != NULL && r->section[0] != '\0')
    return r->section;
  return m->section != NULL ? m->section : "";
}

/* The load a member carries in each case: the sum of its reactions (equilibrium), which
 * takes in its own loads, self-weight, and, on a floor, what the plan and the members above
 * put on it; 0 where the case was not solved. */
static void
case_totals (const TrbMemberResult *r,
             double                 totals[TRB_N_CASES])
{
  for (int c = 0; c < TRB_N_CASES; c++)
    {
      const TrbReaction *re;
      guint n;

      totals[c] = 0;
      if (r == NULL || !r->analysed || r->cases[c] == NULL)
        continue;
      re = trb_beam_result_get_reactions (r->cases[c], &n);
      for (guint i = 0; i < n; i++)
        totals[c] += re[i].force;
    }
}

static gboolean
same_own_loads (const TrbMember *a,
                const TrbMember *b)
{
  guint na = a->loads != NULL ? a->loads->len : 0;
  guint nb = b->loads != NULL ? b->loads->len : 0;

  if (na != nb)
    return FALSE;
  for (guint i = 0; i < na; i++)
    {
      const TrbMemberLoad *p = &g_array_index (a->loads, TrbMemberLoad, i);
      const TrbMemberLoad *q = &g_array_index (b->loads, TrbMemberLoad, i);

      if (p->lcase != q->lcase || p->load.kind != q->load.kind ||
          !same_value (p->load.a, q->load.a) || !same_value (p->load.w1, q->load.w1))
        return FALSE;
      if ((p->load.kind == TRB_LOAD_UNIFORM || p->load.kind == TRB_LOAD_LINEAR) &&
          !same_value (p->load.b, q->load.b))
        return FALSE;
      if (p->load.kind == TRB_LOAD_LINEAR && !same_value (p->load.w2, q->load.w2))
        return FALSE;
    }
  return TRUE;
}

static char *
totals_text (const double   totals[TRB_N_CASES],
             TrbUnitSystem  u)
{
  GString *s = g_string_new (NULL);

  for (int c = 0; c < TRB_N_CASES; c++)
    {
      g_autofree char *v = NULL;

      if (totals[c] == 0)
        continue;
      v = trb_units_format (totals[c], TRB_DIM_FORCE, u);
      g_string_append_printf (s, "%s%s %s", s->len > 0 ? ", " : "", trb_load_case_name (c), v);
    }
  if (s->len == 0)
    g_string_append (s, _("no load"));
  return g_string_free (s, FALSE);
}

static void
describe (TrbChange             *ch,
          const TrbMember       *old_m,
          const TrbMemberResult *old_r,
          const TrbMember       *m,
          const TrbMemberResult *r,
          const double          *old_totals,
          const double          *totals,
          TrbUnitSystem          u)
{
  GString *before = g_string_new (NULL);
  GString *after = g_string_new (NULL);

  if (ch->flags & TRB_CHANGE_SECTION)
    {
      g_string_append (before, section_of (old_m, old_r));
      g_string_append (after, section_of (m, r));
    }
  if (ch->flags & TRB_CHANGE_STATUS)
    {
      g_string_append_printf (before, "%s%s", before->len > 0 ? "; " : "",
                              old_r != NULL ? trb_sheet_status_text (old_r->status) : "-");
      g_string_append_printf (after, "%s%s", after->len > 0 ? "; " : "",
                              r != NULL ? trb_sheet_status_text (r->status) : "-");
    }
  if (ch->flags & TRB_CHANGE_LOADS)
    {
      g_autofree char *tb = totals_text (old_totals, u);
      g_autofree char *ta = totals_text (totals, u);

      /* Translators: what a member carries, "carries D 1.20 kip, L 3.40 kip" */
      g_string_append_printf (before, "%s", before->len > 0 ? "; " : "");
      g_string_append_printf (before, _("carries %s"), tb);
      g_string_append_printf (after, "%s", after->len > 0 ? "; " : "");
      g_string_append_printf (after, _("carries %s"), ta);
    }
  ch->before = g_string_free (before, FALSE);
  ch->after = g_string_free (after, FALSE);
}

static GHashTable *
results_by_member (const TrbProjectResult *results)
{
  GHashTable *h = g_hash_table_new (g_direct_hash, g_direct_equal);

  for (guint i = 0; results != NULL && i < results->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results->members, i);

      g_hash_table_insert (h, (gpointer) r->member, (gpointer) r);
    }
  return h;
}

/**
 * trb_changes_compute:
 * @old_project: the previous version
 * @old_results: (nullable): its results
 * @project: the current version
 * @results: (nullable): its results
 *
 * Matches members by mark. A member changed when its section (the one checked, or chosen
 * from "auto") or its status differs, when its own loads differ, or when the load it carries
 * in some case (the sum of its reactions) differs beyond rounding.
 *
 * Returns: (transfer full) (element-type TrbChange): the changes
 */
GPtrArray *
trb_changes_compute (const TrbProject       *old_project,
                     const TrbProjectResult *old_results,
                     const TrbProject       *project,
                     const TrbProjectResult *results)
{
  GPtrArray *out;
  g_autoptr(GHashTable) old_by = NULL;
  g_autoptr(GHashTable) new_by = NULL;
  TrbUnitSystem u;

  g_return_val_if_fail (old_project != NULL && project != NULL, NULL);

  out = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_change_free);
  old_by = results_by_member (old_results);
  new_by = results_by_member (results);
  u = project->settings.units;

  for (guint i = 0; i < project->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (project->members, i);
      const TrbMember *old_m = trb_project_find_member (old_project, m->id);
      const TrbMemberResult *r = g_hash_table_lookup (new_by, m);
      const TrbMemberResult *old_r = old_m != NULL ? g_hash_table_lookup (old_by, old_m) : NULL;
      double totals[TRB_N_CASES], old_totals[TRB_N_CASES];
      TrbChangeFlags flags = 0;
      TrbChange *ch;

      if (old_m == NULL)
        {
          ch = g_new0 (TrbChange, 1);
          ch->id = g_strdup (m->id);
          ch->member = m;
          ch->flags = TRB_CHANGE_ADDED;
          ch->before = g_strdup ("-");
          ch->after = g_strdup_printf ("%s, %s", section_of (m, r),
                                       r != NULL ? trb_sheet_status_text (r->status) : "-");
          g_ptr_array_add (out, ch);
          continue;
        }

      if (g_ascii_strcasecmp (section_of (m, r), section_of (old_m, old_r)) != 0)
        flags |= TRB_CHANGE_SECTION;
      if ((r != NULL) != (old_r != NULL) || (r != NULL && r->status != old_r->status))
        flags |= TRB_CHANGE_STATUS;
      case_totals (r, totals);
      case_totals (old_r, old_totals);
      if (!same_own_loads (m, old_m))
        flags |= TRB_CHANGE_LOADS;
      for (int c = 0; c < TRB_N_CASES; c++)
        if (!same_value (totals[c], old_totals[c]))
          flags |= TRB_CHANGE_LOADS;
      if (flags == 0)
        continue;

      ch = g_new0 (TrbChange, 1);
      ch->id = g_strdup (m->id);
      ch->member = m;
      ch->previous = old_m;
      ch->flags = flags;
      describe (ch, old_m, old_r, m, r, old_totals, totals, u);
      g_ptr_array_add (out, ch);
    }

  for (guint i = 0; i < old_project->members->len; i++)
    {
      const TrbMember *old_m = g_ptr_array_index (old_project->members, i);
      const TrbMemberResult *old_r = g_hash_table_lookup (old_by, old_m);
      TrbChange *ch;

      if (trb_project_find_member (project, old_m->id) != NULL)
        continue;
      ch = g_new0 (TrbChange, 1);
      ch->id = g_strdup (old_m->id);
      ch->previous = old_m;
      ch->flags = TRB_CHANGE_REMOVED;
      ch->before = g_strdup_printf ("%s, %s", section_of (old_m, old_r),
                                    old_r != NULL ? trb_sheet_status_text (old_r->status) : "-");
      ch->after = g_strdup ("-");
      g_ptr_array_add (out, ch);
    }
  return out;
}

GHashTable *
trb_changes_clouded (GPtrArray *changes)
{
  GHashTable *set = g_hash_table_new (g_direct_hash, g_direct_equal);

  g_return_val_if_fail (changes != NULL, set);

  for (guint i = 0; i < changes->len; i++)
    {
      const TrbChange *ch = g_ptr_array_index (changes, i);

      if (ch->member != NULL)
        g_hash_table_add (set, (gpointer) ch->member);
    }
  return set;
}

char *
trb_change_describe (TrbChangeFlags flags)
{
  GString *s = g_string_new (NULL);

  /* Translators: what changed in a member since the previous version, "section, loads" */
  if (flags & TRB_CHANGE_ADDED)
    g_string_append (s, C_("changed", "added"));
  if (flags & TRB_CHANGE_REMOVED)
    g_string_append_printf (s, "%s%s", s->len > 0 ? ", " : "", C_("changed", "removed"));
  if (flags & TRB_CHANGE_SECTION)
    g_string_append_printf (s, "%s%s", s->len > 0 ? ", " : "", C_("changed", "section"));
  if (flags & TRB_CHANGE_STATUS)
    g_string_append_printf (s, "%s%s", s->len > 0 ? ", " : "", C_("changed", "status"));
  if (flags & TRB_CHANGE_LOADS)
    g_string_append_printf (s, "%s%s", s->len > 0 ? ", " : "", C_("changed", "loads"));
  return g_string_free (s, FALSE);
}

void
trb_changes_flow (TrbFlow    *flow,
                  GPtrArray  *changes,
                  const char *since)
{
  const char *titles[] = { _("Mark"), _("Floor"), _("What changed"), _("Before"), _("Now") };
  static const double widths[] = { 0.08, 0.12, 0.14, 0.33, 0.33 };
  g_autofree char *heading = NULL;

  g_return_if_fail (flow != NULL && changes != NULL);

  /* Translators: "Changes since demo-floor-rev1.trabeate" */
  heading = g_strdup_printf (_("Changes since %s"),
                             since != NULL ? since : _("the previous version"));
  trb_flow_heading (flow, heading);
  if (changes->len == 0)
    {
      trb_flow_paragraph (flow, _("No member's section, status or loads changed."), 1);
      return;
    }
  trb_flow_paragraph (flow, _("Members whose section, status or loads changed, matched by "
                              "mark; each one still in the project is ringed with a revision "
                              "cloud on its framing plan."), 1);
  trb_flow_table_begin (flow, 5, titles, widths, "lllll", -1);
  for (guint i = 0; i < changes->len; i++)
    {
      const TrbChange *ch = g_ptr_array_index (changes, i);
      const TrbMember *m = ch->member != NULL ? ch->member : ch->previous;
      g_autofree char *what = trb_change_describe (ch->flags);
      const char *cells[] = { ch->id,
                              m->floor != NULL && m->floor->name != NULL ? m->floor->name : "-",
                              what, ch->before, ch->after };

      trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
    }
  trb_flow_table_end (flow);
}
