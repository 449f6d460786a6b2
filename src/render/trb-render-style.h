/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <cairo.h>
#include <glib.h>
#include <pango/pangocairo.h>

#include "trb-solve.h"

G_BEGIN_DECLS

/* The palette and fonts shared by the screen and the printed page. Colours are the GNOME
 * palette (the HIG's named colours); the status ramp is blue below 0.9, amber 0.9 to 1.0, red
 * above 1.0 and grey (drawn dashed) where a member is unsupported, unstable or not designed. */

typedef struct
{
  double r;
  double g;
  double b;
  double a;
} TrbRgba;

/* How a member's result reads at a glance. */
typedef enum
{
  TRB_RENDER_STATUS_OK,          /* passes, ratio below 0.9 */
  TRB_RENDER_STATUS_NEAR,        /* passes, ratio 0.9 to 1.0 */
  TRB_RENDER_STATUS_FAIL,        /* some check above 1.0 (or the analysis failed) */
  TRB_RENDER_STATUS_NONE,        /* unsupported, unstable, not designed, or no result yet */
} TrbRenderStatus;

typedef struct
{
  gboolean    dark;          /* dark style (screen only): light ink on a dark page */
  gboolean    print;         /* the printed page: thinner lines, no selection, black text */
  const char *font_family;   /* "Cantarell", "DejaVu Sans"; NULL for the default */
  double      font_size;     /* device units (points on paper, pixels on screen) */
  double      line_width;    /* device units, of a member's line */
} TrbRenderStyle;

void            trb_render_style_init          (TrbRenderStyle          *style);
void            trb_render_style_init_print    (TrbRenderStyle          *style);

TrbRenderStatus trb_render_status_of           (const TrbMemberResult   *result);
TrbRenderStatus trb_render_status_from         (TrbStatus                status,
                                                double                   ratio);
void            trb_render_status_color        (const TrbRenderStyle    *style,
                                                TrbRenderStatus          status,
                                                TrbRgba                 *out);

/* Ink (text and outlines), page background, selection and the per-case load tint. */
void            trb_render_ink_color           (const TrbRenderStyle    *style,
                                                TrbRgba                 *out);
void            trb_render_paper_color         (const TrbRenderStyle    *style,
                                                TrbRgba                 *out);
void            trb_render_selection_color     (const TrbRenderStyle    *style,
                                                TrbRgba                 *out);
void            trb_render_case_color          (const TrbRenderStyle    *style,
                                                TrbLoadCase              lcase,
                                                TrbRgba                 *out);

void            trb_render_set_color           (cairo_t                 *cr,
                                                const TrbRgba           *color);

/* Text. size is in device units; the layout has hinted metrics off, so a page measures the
 * same on every surface (PDF, SVG, PNG and the screen). */
PangoLayout    *trb_render_layout_new          (cairo_t                 *cr,
                                                const TrbRenderStyle    *style,
                                                double                   size,
                                                gboolean                 bold,
                                                const char              *text);
/* Draws text with the point (ax, ay) of its box at (x, y): (0, 0) its top left, (0.5, 0.5)
 * its centre, (1, 1) its bottom right. Returns its width; height is set when not NULL. */
double          trb_render_text                (cairo_t                 *cr,
                                                const TrbRenderStyle    *style,
                                                const char              *text,
                                                double                   size,
                                                gboolean                 bold,
                                                double                   x,
                                                double                   y,
                                                double                   ax,
                                                double                   ay,
                                                double                  *height);
double          trb_render_text_width          (cairo_t                 *cr,
                                                const TrbRenderStyle    *style,
                                                const char              *text,
                                                double                   size,
                                                gboolean                 bold);
/* Draws text wrapped to width; returns its height. */
double          trb_render_text_wrapped        (cairo_t                 *cr,
                                                const TrbRenderStyle    *style,
                                                const char              *text,
                                                double                   size,
                                                gboolean                 bold,
                                                double                   x,
                                                double                   y,
                                                double                   width);

/* Laid-out text kept from one draw to the next: a plan redrawn at every step of a pan or zoom
 * shows the same few hundred strings each time, and laying each out anew (a Pango context,
 * the fonts, itemizing and shaping) was most of the cost of its labels. Entries are keyed by
 * family, size, weight and text; the cache empties itself when the surface type or the
 * scale of the transformation it is drawn under changes (what the layout depends on), and
 * when it grows past a few thousand strings. Not shared between threads. */
typedef struct _TrbRenderTextCache TrbRenderTextCache;

TrbRenderTextCache *trb_render_text_cache_new     (void);
void                trb_render_text_cache_free    (TrbRenderTextCache      *cache);
guint               trb_render_text_cache_size    (const TrbRenderTextCache *cache);

/* trb_render_text() and trb_render_text_width() through a cache; the same pixels. */
double          trb_render_text_cached         (TrbRenderTextCache      *cache,
                                                cairo_t                 *cr,
                                                const TrbRenderStyle    *style,
                                                const char              *text,
                                                double                   size,
                                                gboolean                 bold,
                                                double                   x,
                                                double                   y,
                                                double                   ax,
                                                double                   ay,
                                                double                  *height);
double          trb_render_text_width_cached   (TrbRenderTextCache      *cache,
                                                cairo_t                 *cr,
                                                const TrbRenderStyle    *style,
                                                const char              *text,
                                                double                   size,
                                                gboolean                 bold);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbRenderTextCache, trb_render_text_cache_free)

G_END_DECLS
