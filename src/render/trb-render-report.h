/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "trb-model.h"
#include "trb-render-sheet.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* The printed report: a summary sheet, a framing plan sheet per floor, a member sheet per
 * member, the schedule, and the changes since a previous version; paginated, every page
 * with its title block and the cautions. Written as PDF (every page in one file), SVG or PNG
 * (one file a page), or drawn page by page into any cairo context (the editor's printing). */

typedef enum
{
  TRB_REPORT_SUMMARY  = 1 << 0,
  TRB_REPORT_PLAN     = 1 << 1,
  TRB_REPORT_MEMBERS  = 1 << 2,
  TRB_REPORT_SCHEDULE = 1 << 3,
  TRB_REPORT_CHANGES  = 1 << 4,   /* only with a previous version */
  TRB_REPORT_ALL      = 0x1f,
} TrbReportSheets;

typedef struct
{
  TrbPaper                paper;
  gboolean                landscape;
  gboolean                has_scale;       /* else the plan is drawn at the largest usual
                                            * scale that fits */
  TrbDrawingScale         scale;
  TrbReportSheets         sheets;
  const char *const      *members;         /* marks of the members to give sheets; NULL: all */
  const TrbProject       *previous;        /* the version to compare with; may be NULL */
  const TrbProjectResult *previous_results;
  const char             *previous_name;   /* how to call it on the sheets */
  const char             *title;           /* the project's name; NULL: the file's */
  const char             *engineer;        /* may be NULL: a blank to fill in */
  const char             *date;            /* NULL: today */
  const char             *revision;        /* may be NULL */
} TrbReportOptions;

/* Letter for US projects, A4 for SI ones; portrait; fit; every sheet. */
void         trb_report_options_init    (TrbReportOptions       *options,
                                         const TrbProject       *project);
/* "plan,members,schedule" (also "summary", "changes", "all"). */
gboolean     trb_report_sheets_parse    (const char             *text,
                                         TrbReportSheets        *sheets,
                                         GError                **error);

typedef struct _TrbReport TrbReport;

/* Lays the report out. Fails with TRB_ERROR_NOT_FOUND for a mark that names no member. */
TrbReport   *trb_report_new             (const TrbProject       *project,
                                         const TrbProjectResult *results,
                                         const TrbReportOptions *options,
                                         GError                **error);
void         trb_report_free            (TrbReport              *report);

guint        trb_report_get_n_pages     (const TrbReport        *report);
/* The page size in points. */
void         trb_report_get_page_size   (const TrbReport        *report,
                                         double                 *width,
                                         double                 *height);
/* What the page holds: "Summary", "Framing plan: Mezzanine", "Member B3", "Schedule". */
const char  *trb_report_get_page_title  (const TrbReport        *report,
                                         guint                   page);
/* The marks ringed with revision clouds, sorted; NULL-terminated, owned by the report. */
const char *const *trb_report_get_clouded (const TrbReport      *report);

/* Draws page (0-based) into cr, in points from its top left. */
void         trb_report_draw_page       (TrbReport              *report,
                                         guint                   page,
                                         cairo_t                *cr);

/* By the file name's extension: .pdf, .svg or .png. SVG and PNG write one file a page,
 * "name-2.svg" and so on after the first. PNG at dpi. */
gboolean     trb_report_write           (TrbReport              *report,
                                         const char             *filename,
                                         double                  dpi,
                                         GError                **error);

/* The plan of one floor alone, fitted to width x height (pixels for PNG, points for SVG and
 * PDF), in the screen's style on white: for `trabeate-cli plan`. */
gboolean     trb_render_plan_file       (const TrbProject       *project,
                                         const TrbProjectResult *results,
                                         const TrbFloor         *floor,
                                         const char             *filename,
                                         double                  width,
                                         double                  height,
                                         GError                **error);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbReport, trb_report_free)

G_END_DECLS
