/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-report.h"

#include <cairo-pdf.h>
#include <cairo-svg.h>
#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "trb-cautions.h"
#include "trb-combos.h"
#include "trb-error.h"
#include "trb-render-changes.h"
#include "trb-render-flow.h"
#include "trb-render-plan.h"
#include "trb-render-schedule.h"
#include "trb-units.h"

/* Room kept around a plan on its sheet for the grid bubbles and labels beyond its lines. */
#define PLAN_PAD 30.0
/* The plan sheet's legend strip (trb_sheet_draw_plan). */
#define PLAN_LEGEND 46.0

/* Failing members listed by name on the summary; the rest are in the schedule. */
#define SUMMARY_MAX_LISTED 20

typedef enum
{
  PAGE_FLOW,
  PAGE_PLAN,
  PAGE_NO_FLOOR,
} PageKind;

typedef struct
{
  PageKind        kind;
  TrbFlow        *flow;        /* not owned */
  guint           flow_page;
  guint           floor;       /* PAGE_PLAN: index into the project's floors */
  char           *title;
  const char     *floor_name;  /* for the title block; may be NULL */
} Page;

typedef struct
{
  TrbPlanScene    *scene;
  TrbDrawingScale  scale;
  char            *note;       /* why the scale is not the one asked for; or NULL */
} FloorSheet;

struct _TrbReport
{
  const TrbProject       *project;
  const TrbProjectResult *results;
  TrbReportOptions        options;
  char                   *title;
  char                   *date;
  char                   *previous_name;
  char                   *engineer;
  char                   *revision;
  double                  width;
  double                  height;
  TrbRenderStyle          style;
  GPtrArray              *flows;      /* TrbFlow, owned */
  GArray                 *pages;      /* Page */
  GArray                 *floors;     /* FloorSheet, one per project floor */
  GPtrArray              *changes;    /* TrbChange; NULL without a previous version */
  GHashTable             *clouded;    /* TrbMember * */
  GStrv                   clouded_marks;
};

static void
page_clear (Page *p)
{
  g_free (p->title);
}

static void
floor_sheet_clear (FloorSheet *f)
{
  g_clear_pointer (&f->scene, trb_plan_scene_free);
  g_free (f->note);
}

void
trb_report_options_init (TrbReportOptions *options,
                         const TrbProject *project)
{
  g_return_if_fail (options != NULL);

  memset (options, 0, sizeof *options);
  options->paper = project != NULL && project->settings.units == TRB_UNIT_SYSTEM_SI
                   ? TRB_PAPER_A4 : TRB_PAPER_LETTER;
  options->sheets = TRB_REPORT_ALL;
}

gboolean
trb_report_sheets_parse (const char       *text,
                         TrbReportSheets  *sheets,
                         GError          **error)
{
  g_auto(GStrv) parts = NULL;
  TrbReportSheets out = 0;

  g_return_val_if_fail (text != NULL && sheets != NULL, FALSE);

  parts = g_strsplit (text, ",", -1);
  for (guint i = 0; parts[i] != NULL; i++)
    {
      const char *p = g_strstrip (parts[i]);

      if (g_ascii_strcasecmp (p, "summary") == 0)
        out |= TRB_REPORT_SUMMARY;
      else if (g_ascii_strcasecmp (p, "plan") == 0 || g_ascii_strcasecmp (p, "plans") == 0)
        out |= TRB_REPORT_PLAN;
      else if (g_ascii_strcasecmp (p, "members") == 0 || g_ascii_strcasecmp (p, "member") == 0)
        out |= TRB_REPORT_MEMBERS;
      else if (g_ascii_strcasecmp (p, "schedule") == 0)
        out |= TRB_REPORT_SCHEDULE;
      else if (g_ascii_strcasecmp (p, "changes") == 0)
        out |= TRB_REPORT_CHANGES;
      else if (g_ascii_strcasecmp (p, "all") == 0)
        out |= TRB_REPORT_ALL;
      else
        {
          /* Translators: keep the sheet names: they are what --sheets takes */
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       _("unknown sheet \"%s\": choose from summary, plan, members, schedule, "
                         "changes, all"), p);
          return FALSE;
        }
    }
  if (out == 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, _("no sheet named in \"%s\""), text);
      return FALSE;
    }
  *sheets = out;
  return TRUE;
}

/* Today, or the time SOURCE_DATE_EPOCH gives, so that a build can reproduce its output. */
static char *
today (void)
{
  const char *epoch = g_getenv ("SOURCE_DATE_EPOCH");
  g_autoptr(GDateTime) now = NULL;

  if (epoch != NULL && epoch[0] != '\0')
    now = g_date_time_new_from_unix_utc (g_ascii_strtoll (epoch, NULL, 10));
  if (now == NULL)
    now = g_date_time_new_now_local ();
  return g_date_time_format (now, "%Y-%m-%d");
}

static void
add_page (TrbReport  *report,
          PageKind    kind,
          TrbFlow    *flow,
          guint       flow_page,
          guint       floor,
          const char *title,
          const char *floor_name)
{
  Page p = { kind, flow, flow_page, floor, g_strdup (title), floor_name };

  g_array_append_val (report->pages, p);
}

static void
add_flow_pages (TrbReport  *report,
                TrbFlow    *flow,
                cairo_t    *measure,
                const char *title,
                const char *floor_name)
{
  double cw, ch;
  guint n;

  trb_sheet_get_content (report->width, report->height, NULL, NULL, &cw, &ch);
  n = trb_flow_paginate (flow, measure, &report->style, cw, ch);
  for (guint i = 0; i < n; i++)
    add_page (report, PAGE_FLOW, flow, i, 0, title, floor_name);
}

static TrbFlow *
new_flow (TrbReport *report)
{
  TrbFlow *flow = trb_flow_new ();

  g_ptr_array_add (report->flows, flow);
  return flow;
}

static void
layout_floor (TrbReport  *report,
              guint       index,
              FloorSheet *fs)
{
  const TrbFloor *floor = g_ptr_array_index (report->project->floors, index);
  TrbPlanBounds b;
  double cw, ch, aw, ah, bw = 0, bh = 0;
  TrbUnitSystem u = report->project->settings.units;

  fs->scene = trb_plan_scene_new (report->project, floor, report->results);
  trb_plan_scene_get_bounds (fs->scene, &b);
  trb_sheet_get_content (report->width, report->height, NULL, NULL, &cw, &ch);
  aw = cw - 2 * PLAN_PAD;
  ah = ch - PLAN_LEGEND - 2 * PLAN_PAD;
  if (!trb_plan_bounds_is_empty (&b))
    {
      bw = b.max_x - b.min_x;
      bh = b.max_y - b.min_y;
    }

  if (report->options.has_scale)
    {
      double ppm = trb_drawing_scale_points_per_metre (&report->options.scale);

      fs->scale = report->options.scale;
      if (bw * ppm <= aw && bh * ppm <= ah)
        return;
      trb_drawing_scale_fit (u, bw, bh, aw, ah, &fs->scale);
      /* Translators: "The plan does not fit at 1:50 on Letter landscape: drawn at 1:100." */
      fs->note = g_strdup_printf (report->options.landscape
                                  ? _("The plan does not fit at %s on %s landscape: drawn at %s.")
                                  : _("The plan does not fit at %s on %s portrait: drawn at %s."),
                                  report->options.scale.label,
                                  trb_paper_name (report->options.paper),
                                  fs->scale.label);
      return;
    }
  if (!trb_drawing_scale_fit (u, bw, bh, aw, ah, &fs->scale))
    fs->note = g_strdup_printf (_("The plan is larger than the page at %s, the smallest usual "
                                  "scale: its edges are cut off."), fs->scale.label);
}

static const char *
method_long (TrbMethod method)
{
  switch (method)
    {
    /* Translators: keep ASD, LRFD, the standards and their clauses */
    case TRB_METHOD_ASD:
      return _("ASD: AISC 360-16 and NDS 2018 allowable strength, ASCE 7-16 §2.4.1 "
               "combinations");
    case TRB_METHOD_LRFD:
      return _("LRFD: AISC 360-16 load and resistance factor design, ASCE 7-16 §2.3.1 "
               "combinations");
    case TRB_METHOD_ALLOWABLE:
    default:
      /* Translators: keep the formula fb = M/S and Fb */
      return _("Allowable stress: fb = M/S against Fb, service loads");
    }
}

static void
summary_kv (TrbFlow    *flow,
            const char *key,
            const char *value)
{
  const char *cells[] = { key, value };

  trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
}

static char *
limit (double n)
{
  return n > 0 ? g_strdup_printf ("L/%.0f", n) : g_strdup (_("none"));
}

/* The summary's index: a line per kind of sheet, with its pages. */
typedef struct
{
  char  *what;
  guint  first;   /* 1-based, before the summary's own pages are counted */
  guint  last;
} IndexEntry;

static void
build_summary (TrbReport *report,
               TrbFlow   *flow,
               GArray    *index,
               guint      offset)
{
  const char *kv_titles[] = { _("Design basis"), "" };
  static const double kv_widths[] = { 0.25, 0.75 };
  const char *ix_titles[] = { _("Sheets"), _("Pages") };
  static const double ix_widths[] = { 0.75, 0.25 };
  const TrbProject *p = report->project;
  const TrbSettings *s = &p->settings;
  GPtrArray *results = report->results->members;
  guint counts[TRB_STATUS_ERROR + 1] = { 0 };
  guint listed = 0, not_passing = 0;

  trb_flow_heading (flow, _("Calculation summary"));
  {
    /* Translators: "2 floors" and "48 members" of "Project %s: %s, %s. ..." */
    g_autofree char *floors = g_strdup_printf (ngettext ("%u floor", "%u floors",
                                                         p->floors->len), p->floors->len);
    g_autofree char *members = g_strdup_printf (ngettext ("%u member", "%u members",
                                                          p->members->len), p->members->len);
    /* Translators: "Project demo-floor.trabeate: 1 floor, 48 members. ..." */
    g_autofree char *t = g_strdup_printf (_("Project %s: %s, %s. Every value in this report is "
                                            "formatted as trabeate-cli check prints it."),
                                          report->title, floors, members);

    trb_flow_paragraph (flow, t, 1);
  }

  trb_flow_table_begin (flow, 2, kv_titles, kv_widths, "ll", -1);
  {
    g_autofree char *defl = NULL;
    g_autofree char *ll = limit (s->deflection_live);
    g_autofree char *tl = limit (s->deflection_total);

    /* Translators: "live L/360, total L/240 (IBC 2021 Table 1604.3), ..." */
    defl = g_strdup_printf (_("live %s, total %s (IBC 2021 Table 1604.3), unless a member "
                              "sets its own"), ll, tl);
    summary_kv (flow, _("Method"), method_long (s->method));
    summary_kv (flow, _("Deflection limits"), defl);
    /* Translators: D is the dead load case; keep it */
    summary_kv (flow, _("Self-weight"), s->self_weight ? _("included in D") : _("not included"));
    summary_kv (flow, _("Live-load patterns"), s->live_patterns ? _("on") : _("off"));
    summary_kv (flow, _("Live load reduction"),
                s->live_load_reduction ? _("on (ASCE 7-16 §4.7)") : _("off"));
    summary_kv (flow, _("Steel grade"), s->steel_grade != NULL ? s->steel_grade : "-");
    summary_kv (flow, _("Units"), s->units == TRB_UNIT_SYSTEM_US ? _("US customary") : "SI");
  }
  trb_flow_table_end (flow);

  for (guint i = 0; i < results->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results, i);

      counts[r->status]++;
      not_passing += r->status != TRB_STATUS_PASS;
    }
  trb_flow_heading (flow, _("Results"));
  {
    /* Translators: the count of members, then how many have each status */
    g_autofree char *t =
      g_strdup_printf (ngettext ("%u member: %u pass, %u fail, %u unstable, %u unsupported, "
                                 "%u not designed, %u error",
                                 "%u members: %u pass, %u fail, %u unstable, %u unsupported, "
                                 "%u not designed, %u error", results->len),
                       results->len, counts[TRB_STATUS_PASS],
                       counts[TRB_STATUS_FAIL], counts[TRB_STATUS_UNSTABLE],
                       counts[TRB_STATUS_UNSUPPORTED], counts[TRB_STATUS_NOT_DESIGNED],
                       counts[TRB_STATUS_ERROR]);

    trb_flow_paragraph (flow, t, 1.1);
  }
  if (not_passing > 0)
    {
      const char *titles[] = { _("Mark"), _("Section"), _("Status"), _("Ratio"),
                               _("Governing") };
      static const double widths[] = { 0.12, 0.2, 0.16, 0.1, 0.42 };

      trb_flow_paragraph (flow, _("Members that do not pass:"), 1);
      trb_flow_table_begin (flow, 5, titles, widths, "lllrl", 2);
      for (guint i = 0; i < results->len && listed < SUMMARY_MAX_LISTED; i++)
        {
          const TrbMemberResult *r = g_ptr_array_index (results, i);
          g_autofree char *ratio = NULL;

          if (r->status == TRB_STATUS_PASS)
            continue;
          ratio = trb_sheet_format_ratio (r->ratio);
          {
            const char *cells[] = { r->member->id,
                                    r->section[0] != '\0' ? r->section : r->member->section,
                                    trb_sheet_status_text (r->status), ratio,
                                    r->message != NULL ? r->message
                                    : (r->governing[0] != '\0' ? r->governing : "-") };

            trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, trb_render_status_of (r));
          }
          listed++;
        }
      trb_flow_table_end (flow);
      if (not_passing > listed)
        {
          g_autofree char *t = g_strdup_printf (_("and %u more: see the schedule."),
                                                not_passing - listed);

          trb_flow_paragraph (flow, t, 1);
        }
    }

  /* the takedown's books, floor by floor: what was applied reached the supports, or stayed
   * on members that could not carry it */
  for (guint f = 0; report->results->floors != NULL && f < report->results->floors->len; f++)
    {
      const char *titles[] = { _("Case"), _("Applied"), _("To columns, walls and supports"),
                               _("Not carried") };
      static const double widths[] = { 0.16, 0.28, 0.28, 0.28 };
      const TrbFloorResult *fr = g_ptr_array_index (report->results->floors, f);
      g_autofree char *h = g_strdup_printf (_("Floor %s: load takedown, unfactored"),
                                            fr->floor->name != NULL ? fr->floor->name : "");

      trb_flow_heading (flow, h);
      if (fr->error != NULL)
        {
          g_autofree char *t = g_strdup_printf (_("The plan could not be framed: %s"),
                                                fr->error);

          trb_flow_paragraph (flow, t, 1);
          continue;
        }
      trb_flow_table_begin (flow, 4, titles, widths, "lrrr", -1);
      for (int c = 0; c < TRB_N_CASES; c++)
        {
          g_autofree char *a = trb_units_format (fr->applied[c], TRB_DIM_FORCE, s->units);
          g_autofree char *r = trb_units_format (fr->reactions[c], TRB_DIM_FORCE, s->units);
          g_autofree char *n = trb_units_format (fr->not_carried[c], TRB_DIM_FORCE, s->units);
          const char *cells[] = { trb_load_case_name (c), a, r, n };

          if (fr->applied[c] == 0 && fr->reactions[c] == 0)
            continue;
          trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
        }
      trb_flow_table_end (flow);
      for (guint i = 0; fr->unassigned != NULL && i < fr->unassigned->len; i++)
        {
          const TrbUnassignedLoad *ul = &g_array_index (fr->unassigned, TrbUnassignedLoad, i);
          g_autofree char *v = trb_units_format (ul->force, TRB_DIM_FORCE, s->units);
          const char *label = ul->point != NULL ? ul->point->label
                              : ul->line != NULL ? ul->line->label : NULL;
          /* Translators: "Not carried: a point load (guard rail) of 1.00 kip lies on no
           * member."; the part in brackets is the load's label, or nothing */
          g_autofree char *t =
            g_strdup_printf (ul->point != NULL
                             ? _("Not carried: a point load%s%s%s of %s lies on no member.")
                             : _("Not carried: a line load%s%s%s of %s lies on no member."),
                             label != NULL ? " (" : "", label != NULL ? label : "",
                             label != NULL ? ")" : "", v);

          trb_flow_paragraph (flow, t, 1);
        }
    }

  if (index->len > 0)
    trb_flow_table_begin (flow, 2, ix_titles, ix_widths, "lr", -1);
  for (guint i = 0; i < index->len; i++)
    {
      const IndexEntry *e = &g_array_index (index, IndexEntry, i);
      g_autofree char *pages = e->first == e->last
                               ? g_strdup_printf ("%u", e->first + offset)
                               /* Translators: pages "3 to 7" */
                               : g_strdup_printf (_("%u to %u"), e->first + offset,
                                                  e->last + offset);

      summary_kv (flow, e->what, pages);
    }
  if (index->len > 0)
    trb_flow_table_end (flow);

  /* the cautions translated by their text: the template has it from trb-cli.c */
  trb_flow_heading (flow, _("Caution"));
  trb_flow_paragraph (flow, _(TRB_CAUTION_LICENSED), 1.05);
  trb_flow_paragraph (flow, _(TRB_CAUTION_NOT_CHECKED), 1.05);
  trb_flow_paragraph (flow, _(TRB_CAUTION_COLUMNS), 1.05);
  trb_flow_paragraph (flow, _(TRB_CAUTION_INPUTS), 1.05);
}

static void
index_add (GArray     *index,
           const char *what,
           guint       first,
           guint       last)
{
  IndexEntry e = { g_strdup (what), first, last };

  if (last >= first)
    g_array_append_val (index, e);
}

static void
index_entry_clear (IndexEntry *e)
{
  g_free (e->what);
}

static int
cmp_str (gconstpointer a,
         gconstpointer b)
{
  return g_utf8_collate (*(const char *const *) a, *(const char *const *) b);
}

TrbReport *
trb_report_new (const TrbProject       *project,
                const TrbProjectResult *results,
                const TrbReportOptions *options,
                GError                **error)
{
  g_autoptr(TrbReport) report = NULL;
  g_autoptr(GPtrArray) chosen = g_ptr_array_new ();
  g_autoptr(GArray) index = g_array_new (FALSE, TRUE, sizeof (IndexEntry));
  g_autoptr(GArray) body = NULL;
  cairo_surface_t *ms;
  cairo_t *measure;
  TrbFlow *summary;
  guint n_summary;

  g_return_val_if_fail (project != NULL && results != NULL && options != NULL, NULL);

  report = g_new0 (TrbReport, 1);
  report->project = project;
  report->results = results;
  report->options = *options;
  if (options->title != NULL)
    report->title = g_strdup (options->title);
  else
    report->title = project->name != NULL ? g_path_get_basename (project->name)
                                          : g_strdup (_("Untitled"));
  report->date = options->date != NULL ? g_strdup (options->date) : today ();
  if (options->previous_name != NULL)
    report->previous_name = g_path_get_basename (options->previous_name);
  else if (options->previous != NULL && options->previous->name != NULL)
    report->previous_name = g_path_get_basename (options->previous->name);
  else
    report->previous_name = g_strdup (_("the previous version"));
  /* the borrowed strings the layout keeps reading */
  report->options.members = NULL;
  report->options.title = report->title;
  report->options.date = report->date;
  report->options.previous_name = report->previous_name;
  report->flows = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_flow_free);
  report->pages = g_array_new (FALSE, TRUE, sizeof (Page));
  g_array_set_clear_func (report->pages, (GDestroyNotify) page_clear);
  report->floors = g_array_new (FALSE, TRUE, sizeof (FloorSheet));
  g_array_set_clear_func (report->floors, (GDestroyNotify) floor_sheet_clear);
  g_array_set_clear_func (index, (GDestroyNotify) index_entry_clear);
  trb_paper_get_size (options->paper, options->landscape, &report->width, &report->height);
  trb_render_style_init_print (&report->style);
  report->engineer = g_strdup (options->engineer);
  report->revision = g_strdup (options->revision);
  report->options.engineer = report->engineer;
  report->options.revision = report->revision;

  /* which members get sheets */
  if (options->members != NULL)
    {
      for (guint i = 0; options->members[i] != NULL; i++)
        {
          const TrbMember *m = trb_project_find_member (project, options->members[i]);
          const TrbMemberResult *r = NULL;

          for (guint k = 0; m != NULL && k < results->members->len; k++)
            if (((TrbMemberResult *) g_ptr_array_index (results->members, k))->member == m)
              r = g_ptr_array_index (results->members, k);
          if (r == NULL)
            {
              g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND,
                           _("%s: no member with id \"%s\""),
                           project->name != NULL ? project->name : _("project"),
                           options->members[i]);
              return NULL;
            }
          g_ptr_array_add (chosen, (gpointer) r);
        }
    }
  else
    for (guint k = 0; k < results->members->len; k++)
      g_ptr_array_add (chosen, g_ptr_array_index (results->members, k));

  if (options->previous != NULL)
    {
      g_autoptr(GPtrArray) marks = g_ptr_array_new ();
      GHashTableIter it;
      gpointer key;

      report->changes = trb_changes_compute (options->previous, options->previous_results,
                                             project, results);
      report->clouded = trb_changes_clouded (report->changes);
      g_hash_table_iter_init (&it, report->clouded);
      while (g_hash_table_iter_next (&it, &key, NULL))
        g_ptr_array_add (marks, ((TrbMember *) key)->id);
      g_ptr_array_sort (marks, cmp_str);
      report->clouded_marks = g_new0 (char *, marks->len + 1);
      for (guint i = 0; i < marks->len; i++)
        report->clouded_marks[i] = g_strdup (g_ptr_array_index (marks, i));
    }

  ms = cairo_image_surface_create (CAIRO_FORMAT_ARGB32, 1, 1);
  measure = cairo_create (ms);

  /* the body first, so that the summary can give its pages */
  if (options->sheets & TRB_REPORT_PLAN)
    {
      guint first = report->pages->len + 1;

      for (guint f = 0; f < project->floors->len; f++)
        {
          FloorSheet fs = { NULL, { 0 }, NULL };
          const TrbFloor *floor = g_ptr_array_index (project->floors, f);
          g_autofree char *t = g_strdup_printf (_("Framing plan: %s"),
                                                floor->name != NULL ? floor->name : "");

          layout_floor (report, f, &fs);
          g_array_append_val (report->floors, fs);
          add_page (report, PAGE_PLAN, NULL, 0, f, t, floor->name);
        }
      if (project->floors->len == 0)
        add_page (report, PAGE_NO_FLOOR, NULL, 0, 0, _("Framing plan"), NULL);
      index_add (index, project->floors->len > 0 ? _("Framing plans")
                                                 : _("Framing plan (no floor)"),
                 first, report->pages->len);
    }
  if ((options->sheets & TRB_REPORT_CHANGES) && report->changes != NULL)
    {
      guint first = report->pages->len + 1;
      TrbFlow *flow = new_flow (report);

      trb_changes_flow (flow, report->changes, report->previous_name);
      add_flow_pages (report, flow, measure, _("Changes"), NULL);
      index_add (index, _("Changes since the previous version"), first, report->pages->len);
    }
  if (options->sheets & TRB_REPORT_MEMBERS)
    {
      guint first = report->pages->len + 1;

      for (guint i = 0; i < chosen->len; i++)
        {
          const TrbMemberResult *r = g_ptr_array_index (chosen, i);
          TrbFlow *flow = new_flow (report);
          g_autofree char *t = g_strdup_printf (_("Member %s"), r->member->id);

          trb_sheet_member_flow (flow, project, r);
          add_flow_pages (report, flow, measure, t,
                          r->member->floor != NULL ? r->member->floor->name : NULL);
        }
      index_add (index, _("Member sheets: loading, diagrams, checks, reactions, shortlist"),
                 first, report->pages->len);
    }
  if (options->sheets & TRB_REPORT_SCHEDULE)
    {
      guint first = report->pages->len + 1;
      TrbFlow *flow = new_flow (report);

      trb_schedule_members_flow (flow, project, results->members);
      trb_schedule_columns_flow (flow, project, results);
      add_flow_pages (report, flow, measure, _("Schedule"), NULL);
      index_add (index, _("Member schedule and column loads"), first, report->pages->len);
    }

  /* the summary before everything: its length shifts every page number in its index, so lay
   * it out until the count it assumes is the count it takes */
  if (options->sheets & TRB_REPORT_SUMMARY)
    {
      body = report->pages;
      report->pages = g_array_new (FALSE, TRUE, sizeof (Page));
      g_array_set_clear_func (report->pages, (GDestroyNotify) page_clear);
      n_summary = 1;
      for (int attempt = 0; attempt < 4; attempt++)
        {
          double cw, ch;
          guint n;

          summary = trb_flow_new ();
          build_summary (report, summary, index, n_summary);
          trb_sheet_get_content (report->width, report->height, NULL, NULL, &cw, &ch);
          n = trb_flow_paginate (summary, measure, &report->style, cw, ch);
          if (n == n_summary || attempt == 3)
            {
              g_ptr_array_add (report->flows, summary);
              for (guint i = 0; i < n; i++)
                add_page (report, PAGE_FLOW, summary, i, 0, _("Summary"), NULL);
              break;
            }
          trb_flow_free (summary);
          n_summary = n;
        }
      for (guint i = 0; i < body->len; i++)
        {
          Page *p = &g_array_index (body, Page, i);
          Page copy = *p;

          copy.title = g_strdup (p->title);
          g_array_append_val (report->pages, copy);
        }
    }

  cairo_destroy (measure);
  cairo_surface_destroy (ms);
  return g_steal_pointer (&report);
}

void
trb_report_free (TrbReport *report)
{
  if (report == NULL)
    return;
  g_clear_pointer (&report->pages, g_array_unref);
  g_clear_pointer (&report->floors, g_array_unref);
  g_clear_pointer (&report->flows, g_ptr_array_unref);
  g_clear_pointer (&report->changes, g_ptr_array_unref);
  g_clear_pointer (&report->clouded, g_hash_table_unref);
  g_strfreev (report->clouded_marks);
  g_free (report->title);
  g_free (report->date);
  g_free (report->previous_name);
  g_free (report->engineer);
  g_free (report->revision);
  g_free (report);
}

guint
trb_report_get_n_pages (const TrbReport *report)
{
  g_return_val_if_fail (report != NULL, 0);

  return report->pages->len;
}

void
trb_report_get_page_size (const TrbReport *report,
                          double          *width,
                          double          *height)
{
  g_return_if_fail (report != NULL);

  if (width != NULL)
    *width = report->width;
  if (height != NULL)
    *height = report->height;
}

const char *
trb_report_get_page_title (const TrbReport *report,
                           guint            page)
{
  g_return_val_if_fail (report != NULL && page < report->pages->len, NULL);

  return g_array_index (report->pages, Page, page).title;
}

const char *const *
trb_report_get_clouded (const TrbReport *report)
{
  static const char *none[] = { NULL };

  g_return_val_if_fail (report != NULL, NULL);

  return report->clouded_marks != NULL ? (const char *const *) report->clouded_marks : none;
}

void
trb_report_draw_page (TrbReport *report,
                      guint      page,
                      cairo_t   *cr)
{
  const Page *p;
  TrbTitleBlock tb;
  double cx, cy, cw, ch;

  g_return_if_fail (report != NULL && cr != NULL);
  g_return_if_fail (page < report->pages->len);

  p = &g_array_index (report->pages, Page, page);
  tb.project = report->title;
  tb.floor = p->floor_name;
  tb.title = p->title;
  tb.engineer = report->options.engineer;
  tb.date = report->date;
  tb.revision = report->options.revision;
  tb.page = page + 1;
  tb.n_pages = report->pages->len;

  cairo_save (cr);
  trb_sheet_draw_frame (cr, &report->style, &tb, report->width, report->height);
  trb_sheet_get_content (report->width, report->height, &cx, &cy, &cw, &ch);
  switch (p->kind)
    {
    case PAGE_FLOW:
      trb_flow_draw_page (p->flow, p->flow_page, cr, &report->style, cx, cy);
      break;
    case PAGE_PLAN:
      {
        const FloorSheet *fs = &g_array_index (report->floors, FloorSheet, p->floor);

        trb_sheet_draw_plan (cr, &report->style, fs->scene, &fs->scale, fs->note,
                             report->clouded, report->previous_name, cx, cy, cw, ch);
      }
      break;
    case PAGE_NO_FLOOR:
    default:
      trb_sheet_draw_message (cr, &report->style, _("Framing plan"),
                              _("This project has no floor: there is no framing plan to draw. "
                                "Its members are standalone beams; each has its member sheet, "
                                "and the schedule lists them all."),
                              cx, cy, cw, ch);
      break;
    }
  cairo_restore (cr);
}

/* ---- files -------------------------------------------------------------------------------- */

static gboolean
check_surface (cairo_surface_t  *surface,
               const char       *filename,
               GError          **error)
{
  cairo_status_t st = cairo_surface_status (surface);

  if (st != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_IO, _("%s: cannot write: %s"), filename,
                   cairo_status_to_string (st));
      return FALSE;
    }
  return TRUE;
}

/* "out.svg" for the first page, "out-2.svg" after. */
static char *
page_filename (const char *filename,
               guint       page)
{
  const char *dot = strrchr (filename, '.');
  const char *slash = strrchr (filename, G_DIR_SEPARATOR);

  if (page == 0)
    return g_strdup (filename);
  if (dot == NULL || (slash != NULL && dot < slash))
    return g_strdup_printf ("%s-%u", filename, page + 1);
  return g_strdup_printf ("%.*s-%u%s", (int) (dot - filename), filename, page + 1, dot);
}

static gboolean
has_suffix (const char *filename,
            const char *suffix)
{
  g_autofree char *lower = g_ascii_strdown (filename, -1);

  return g_str_has_suffix (lower, suffix);
}

gboolean
trb_report_write (TrbReport   *report,
                  const char  *filename,
                  double       dpi,
                  GError     **error)
{
  g_return_val_if_fail (report != NULL && filename != NULL, FALSE);

  if (has_suffix (filename, ".pdf"))
    {
      cairo_surface_t *surface = cairo_pdf_surface_create (filename, report->width,
                                                           report->height);
      cairo_t *cr = cairo_create (surface);
      gboolean ok;

      cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_TITLE, report->title);
      cairo_pdf_surface_set_metadata (surface, CAIRO_PDF_METADATA_CREATOR,
                                      "Trabeate " PACKAGE_VERSION);
      for (guint i = 0; i < report->pages->len; i++)
        {
          trb_report_draw_page (report, i, cr);
          cairo_show_page (cr);
        }
      cairo_destroy (cr);
      cairo_surface_finish (surface);
      ok = check_surface (surface, filename, error);
      cairo_surface_destroy (surface);
      return ok;
    }
  if (has_suffix (filename, ".svg") || has_suffix (filename, ".png"))
    {
      gboolean svg = has_suffix (filename, ".svg");
      double k = dpi > 0 ? dpi / 72.0 : 150.0 / 72.0;

      for (guint i = 0; i < report->pages->len; i++)
        {
          g_autofree char *name = page_filename (filename, i);
          cairo_surface_t *surface;
          cairo_t *cr;
          gboolean ok;

          if (svg)
            surface = cairo_svg_surface_create (name, report->width, report->height);
          else
            surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24,
                                                  (int) ceil (report->width * k),
                                                  (int) ceil (report->height * k));
          cr = cairo_create (surface);
          if (!svg)
            cairo_scale (cr, k, k);
          trb_report_draw_page (report, i, cr);
          cairo_destroy (cr);
          if (!svg && cairo_surface_write_to_png (surface, name) != CAIRO_STATUS_SUCCESS)
            {
              g_set_error (error, TRB_ERROR, TRB_ERROR_IO, _("%s: cannot write the PNG"),
                           name);
              cairo_surface_destroy (surface);
              return FALSE;
            }
          cairo_surface_finish (surface);
          ok = check_surface (surface, name, error);
          cairo_surface_destroy (surface);
          if (!ok)
            return FALSE;
        }
      return TRUE;
    }
  g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
               _("%s: write a name ending in .pdf, .svg or .png"), filename);
  return FALSE;
}

gboolean
trb_render_plan_file (const TrbProject       *project,
                      const TrbProjectResult *results,
                      const TrbFloor         *floor,
                      const char             *filename,
                      double                  width,
                      double                  height,
                      GError                **error)
{
  g_autoptr(TrbPlanScene) scene = NULL;
  TrbPlanDrawOptions options;
  TrbPlanView view;
  TrbPlanBounds b;
  cairo_surface_t *surface;
  cairo_t *cr;
  gboolean ok;
  int kind;   /* 0 png, 1 svg, 2 pdf */

  g_return_val_if_fail (project != NULL && floor != NULL && filename != NULL, FALSE);

  if (has_suffix (filename, ".png"))
    kind = 0;
  else if (has_suffix (filename, ".svg"))
    kind = 1;
  else if (has_suffix (filename, ".pdf"))
    kind = 2;
  else
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   _("%s: write a name ending in .png, .svg or .pdf"), filename);
      return FALSE;
    }
  if (!(width >= 16 && height >= 16 && width <= 32768 && height <= 32768))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   _("the plan's size must be 16 to 32768 on each side, not %g x %g"),
                   width, height);
      return FALSE;
    }

  scene = trb_plan_scene_new (project, floor, results);
  trb_plan_draw_options_init (&options, width, height);
  options.layers = TRB_PLAN_LAYER_ALL;
  trb_plan_scene_get_bounds (scene, &b);
  /* room for the grid bubbles and labels beyond the plan's lines */
  trb_plan_view_fit (&view, &b, 0, 0, width, height, 4 * options.style.font_size);

  if (kind == 0)
    surface = cairo_image_surface_create (CAIRO_FORMAT_RGB24, (int) width, (int) height);
  else if (kind == 1)
    surface = cairo_svg_surface_create (filename, width, height);
  else
    surface = cairo_pdf_surface_create (filename, width, height);
  cr = cairo_create (surface);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);
  trb_plan_draw (cr, scene, &view, &options);
  cairo_destroy (cr);
  if (kind == 0 && cairo_surface_write_to_png (surface, filename) != CAIRO_STATUS_SUCCESS)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_IO, _("%s: cannot write the PNG"), filename);
      cairo_surface_destroy (surface);
      return FALSE;
    }
  cairo_surface_finish (surface);
  ok = check_surface (surface, filename, error);
  cairo_surface_destroy (surface);
  return ok;
}
