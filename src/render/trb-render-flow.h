/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "trb-render-style.h"

G_BEGIN_DECLS

/* A flow: headings, paragraphs, drawn blocks and tables, laid out down the page and broken
 * onto as many pages as it needs, a table's header repeated at the top of each page it
 * continues on. The member sheets, the schedule and the list of changes are flows. */

typedef struct _TrbFlow TrbFlow;

/* Draws a block into its rectangle. */
typedef void (*TrbFlowDrawFunc) (cairo_t              *cr,
                                 const TrbRenderStyle *style,
                                 double                x,
                                 double                y,
                                 double                width,
                                 double                height,
                                 gpointer              data);

typedef enum
{
  TRB_FLOW_ROW_PLAIN  = 0,
  TRB_FLOW_ROW_BOLD   = 1 << 0,
  TRB_FLOW_ROW_MUTED  = 1 << 1,   /* smaller, grey: a detail under the row above */
} TrbFlowRowFlags;

TrbFlow  *trb_flow_new             (void);
void      trb_flow_free            (TrbFlow              *flow);

/* A heading stays on the page of what follows it. */
void      trb_flow_heading         (TrbFlow              *flow,
                                    const char           *text);
void      trb_flow_paragraph       (TrbFlow              *flow,
                                    const char           *text,
                                    double                scale);
void      trb_flow_space           (TrbFlow              *flow,
                                    double                height);
/* A block of a fixed height (device units), or, with a negative height, that fraction of
 * the page's height. */
void      trb_flow_block           (TrbFlow              *flow,
                                    double                height,
                                    TrbFlowDrawFunc       draw,
                                    gpointer              data,
                                    GDestroyNotify        destroy);
/* A block that takes the rest of the page, at least min_height (device units); on a new
 * page when less is left. */
void      trb_flow_block_fill      (TrbFlow              *flow,
                                    double                min_height,
                                    TrbFlowDrawFunc       draw,
                                    gpointer              data,
                                    GDestroyNotify        destroy);
void      trb_flow_page_break      (TrbFlow              *flow);

/* A table: widths are fractions of the page's width (they are scaled to sum to 1); align is
 * one letter a column, 'l', 'r' or 'c'. status_column is the column coloured by a row's
 * status, or -1. With every title empty the table has no header row. */
void      trb_flow_table_begin     (TrbFlow              *flow,
                                    guint                 n_columns,
                                    const char *const    *titles,
                                    const double         *widths,
                                    const char           *align,
                                    int                   status_column);
void      trb_flow_table_row       (TrbFlow              *flow,
                                    const char *const    *cells,
                                    TrbFlowRowFlags       flags,
                                    TrbRenderStatus       status);
/* A row of one cell across the table (a check's detail, a note). */
void      trb_flow_table_note      (TrbFlow              *flow,
                                    const char           *text);
void      trb_flow_table_end       (TrbFlow              *flow);

/* Lays the flow out on pages of the given content size, measuring text with cr (any
 * surface). Returns the number of pages (at least 1). */
guint     trb_flow_paginate        (TrbFlow              *flow,
                                    cairo_t              *cr,
                                    const TrbRenderStyle *style,
                                    double                width,
                                    double                height);
guint     trb_flow_get_n_pages     (const TrbFlow        *flow);
/* Draws one page of a paginated flow with its top left at (x, y). */
void      trb_flow_draw_page       (TrbFlow              *flow,
                                    guint                 page,
                                    cairo_t              *cr,
                                    const TrbRenderStyle *style,
                                    double                x,
                                    double                y);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbFlow, trb_flow_free)

G_END_DECLS
