/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-document.h"

G_BEGIN_DECLS

#define TRB_TYPE_DIAGRAM_VIEW (trb_diagram_view_get_type ())

G_DECLARE_FINAL_TYPE (TrbDiagramView, trb_diagram_view, TRB, DIAGRAM_VIEW, AdwBin)

/* The selected member's loading, shear, moment and deflection, drawn by the render layer
 * (trb_diagram_draw_stack) for the envelope, a combination or a load case. */

GtkWidget   *trb_diagram_view_new           (void);
void         trb_diagram_view_set_document  (TrbDiagramView *self,
                                             TrbDocument    *document);
void         trb_diagram_view_set_member    (TrbDiagramView *self,
                                             TrbMember      *member);
guint        trb_diagram_view_get_n_sources (TrbDiagramView *self);

G_END_DECLS
