/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <cairo.h>
#include <glib.h>

#include "trb-render-style.h"
#include "trb-solve.h"

G_BEGIN_DECLS

/* A member's diagrams, drawn from the exact results: the loading sketch (supports, spans and
 * loads by case), shear, moment and deflection, jumps drawn at the break points, extreme
 * values and their positions labelled, reactions at each support. The editor's side panel and
 * the member sheet draw the same pictures through these functions. */

typedef enum
{
  TRB_DIAGRAM_LOADING,
  TRB_DIAGRAM_SHEAR,
  TRB_DIAGRAM_MOMENT,
  TRB_DIAGRAM_DEFLECTION,
} TrbDiagramKind;

typedef enum
{
  /* Shear and moment: the envelope of the strength combinations (every pattern); deflection:
   * the envelope of the total-load set. Reactions: their range over the strength set. */
  TRB_DIAGRAM_SOURCE_ENVELOPE,
  /* One entry of result->strength.entries (a combination under one pattern). */
  TRB_DIAGRAM_SOURCE_COMBINATION,
  /* One load case alone, unfactored (result->cases[index]). */
  TRB_DIAGRAM_SOURCE_CASE,
} TrbDiagramSourceKind;

typedef struct
{
  TrbDiagramSourceKind kind;
  guint                index;   /* the entry or the TrbLoadCase; unused for the envelope */
} TrbDiagramSource;

/* A title for the source: "Envelope of ASD combinations", "ASD 2: D + L", "Case D". */
char     *trb_diagram_source_describe   (const TrbMemberResult  *result,
                                         const TrbDiagramSource *source);

/* Draws one diagram into the device rectangle (x, y, width, height), its title, axis, curve,
 * extremes and (for the loading sketch) supports, spans and reactions. Draws a note in place
 * of the curve when the member was not analysed. */
void      trb_diagram_draw              (cairo_t                *cr,
                                         const TrbMemberResult  *result,
                                         TrbDiagramKind          kind,
                                         const TrbDiagramSource *source,
                                         const TrbRenderStyle   *style,
                                         double                  x,
                                         double                  y,
                                         double                  width,
                                         double                  height);

/* The loading sketch, shear, moment and deflection stacked in the rectangle, sharing the
 * member's x axis. */
void      trb_diagram_draw_stack        (cairo_t                *cr,
                                         const TrbMemberResult  *result,
                                         const TrbDiagramSource *source,
                                         const TrbRenderStyle   *style,
                                         double                  x,
                                         double                  y,
                                         double                  width,
                                         double                  height);

/* The member position (m) under a device x within a diagram drawn at (x, width), clamped to
 * the member; for the editor's readout under the pointer. */
double    trb_diagram_position_at       (const TrbMemberResult  *result,
                                         double                  x,
                                         double                  width,
                                         double                  device_x);

G_END_DECLS
