/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "trb-model.h"
#include "trb-render-flow.h"
#include "trb-render-plan.h"
#include "trb-render-style.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* Sheets: the paper, the drawing scale, the frame and title block every page carries, the
 * framing plan sheet and the member sheet. All in points (1/72 in). */

typedef enum
{
  TRB_PAPER_LETTER,    /* 8.5 x 11 in */
  TRB_PAPER_LEGAL,     /* 8.5 x 14 in */
  TRB_PAPER_TABLOID,   /* 11 x 17 in */
  TRB_PAPER_A4,        /* 210 x 297 mm */
  TRB_PAPER_A3,        /* 297 x 420 mm */
  TRB_N_PAPERS,
} TrbPaper;

const char *trb_paper_name              (TrbPaper              paper);
gboolean    trb_paper_from_name         (const char           *name,
                                         TrbPaper             *paper);
void        trb_paper_get_size          (TrbPaper              paper,
                                         gboolean              landscape,
                                         double               *width,
                                         double               *height);

/* A drawing scale: paper length over true length, and how the trade writes it. */
typedef struct
{
  double ratio;        /* 1/96 for 1/8" = 1'-0", 1/100 for 1:100 */
  char   label[48];    /* "1/8\" = 1'-0\"", "1:100" */
} TrbDrawingScale;

/* "1:100", "1/8\"=1'-0\"", "1/4in = 1ft", "1\" = 20'": TRB_ERROR_INVALID for anything else. */
gboolean    trb_drawing_scale_parse     (const char           *text,
                                         TrbDrawingScale      *scale,
                                         GError              **error);
/* The largest of the trade's usual scales of the unit system (architectural and engineering
 * scales for US, the metric series for SI) at which width x height metres fits in
 * paper_width x paper_height points. FALSE (and the smallest scale) when none fits. */
gboolean    trb_drawing_scale_fit       (TrbUnitSystem         units,
                                         double                width,
                                         double                height,
                                         double                paper_width,
                                         double                paper_height,
                                         TrbDrawingScale      *scale);
/* Points per plan metre. */
double      trb_drawing_scale_points_per_metre (const TrbDrawingScale *scale);

/* What the title block says. */
typedef struct
{
  const char *project;
  const char *floor;         /* may be NULL */
  const char *title;         /* the sheet's title: "Framing plan", "Member B3" */
  const char *engineer;      /* may be NULL: a line to sign on */
  const char *date;
  const char *revision;      /* may be NULL */
  guint       page;          /* 1-based */
  guint       n_pages;
} TrbTitleBlock;

/* The rectangle inside the margins and above the title block. */
void        trb_sheet_get_content       (double                width,
                                         double                height,
                                         double               *x,
                                         double               *y,
                                         double               *content_width,
                                         double               *content_height);
/* Paper, border, title block with the cautions. */
void        trb_sheet_draw_frame        (cairo_t              *cr,
                                         const TrbRenderStyle *style,
                                         const TrbTitleBlock  *block,
                                         double                width,
                                         double                height);

/* The framing plan in the content rectangle: the plan at the scale, centred; the legend, the
 * stated scale and a scale bar below it; a note when the scale is not the one asked for; the
 * members ringed with clouds (a set of TrbMember *, may be NULL) listed by mark. */
void        trb_sheet_draw_plan         (cairo_t              *cr,
                                         const TrbRenderStyle *style,
                                         const TrbPlanScene   *scene,
                                         const TrbDrawingScale *scale,
                                         const char           *scale_note,
                                         GHashTable           *clouded,
                                         const char           *clouds_since,
                                         double                x,
                                         double                y,
                                         double                width,
                                         double                height);

/* A sheet that says there is nothing to draw (a project without floors). */
void        trb_sheet_draw_message      (cairo_t              *cr,
                                         const TrbRenderStyle *style,
                                         const char           *heading,
                                         const char           *text,
                                         double                x,
                                         double                y,
                                         double                width,
                                         double                height);

/* Appends a member's sheet to a flow: summary, loading sketch and diagrams, the checks,
 * reactions per case, section properties and the shortlist. */
void        trb_sheet_member_flow       (TrbFlow              *flow,
                                         const TrbProject     *project,
                                         const TrbMemberResult *result);

/* The status word of the CLI's table: "passes", "FAILS", "UNSTABLE", ... */
const char *trb_sheet_status_text       (TrbStatus             status);
/* A ratio as the CLI prints it ("0.873"), or "-" when nothing was checked. */
char       *trb_sheet_format_ratio      (double                ratio);

G_END_DECLS
