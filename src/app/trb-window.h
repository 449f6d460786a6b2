/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-application.h"
#include "trb-document.h"

G_BEGIN_DECLS

#define TRB_TYPE_WINDOW (trb_window_get_type ())

G_DECLARE_FINAL_TYPE (TrbWindow, trb_window, TRB, WINDOW, AdwApplicationWindow)

TrbWindow     *trb_window_new               (TrbApplication  *application);
TrbDocument   *trb_window_get_document      (TrbWindow       *self);
void           trb_window_set_document      (TrbWindow       *self,
                                             TrbDocument     *document);
void           trb_window_set_units         (TrbWindow       *self,
                                             TrbUnitSystem    units);
void           trb_window_show_page         (TrbWindow       *self,
                                             const char      *page);
void           trb_window_show_error        (TrbWindow       *self,
                                             const char      *message);
void           trb_window_show_toast        (TrbWindow       *self,
                                             const char      *message);

/* The window's parts, for the GUI tests. */
GtkWidget     *trb_window_get_canvas        (TrbWindow       *self);
GtkWidget     *trb_window_get_member_list   (TrbWindow       *self);
GtkWidget     *trb_window_get_floor_dropdown (TrbWindow      *self);
GtkWidget     *trb_window_get_member_panel  (TrbWindow       *self);
GtkWidget     *trb_window_get_diagram_view  (TrbWindow       *self);
GtkWidget     *trb_window_get_shortlist     (TrbWindow       *self);
const char    *trb_window_get_error         (TrbWindow       *self);

G_END_DECLS
