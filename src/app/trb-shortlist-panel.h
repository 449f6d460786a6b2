/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-document.h"

G_BEGIN_DECLS

#define TRB_TYPE_SHORTLIST_PANEL (trb_shortlist_panel_get_type ())

G_DECLARE_FINAL_TYPE (TrbShortlistPanel, trb_shortlist_panel, TRB, SHORTLIST_PANEL, AdwBin)

/* The sections that pass for the selected member, lightest first; picking one assigns it. */

GtkWidget   *trb_shortlist_panel_new             (void);
void         trb_shortlist_panel_set_document    (TrbShortlistPanel *self,
                                                  TrbDocument       *document);
void         trb_shortlist_panel_set_member      (TrbShortlistPanel *self,
                                                  TrbMember         *member);
gboolean     trb_shortlist_panel_choose          (TrbShortlistPanel *self,
                                                  guint              index);
guint        trb_shortlist_panel_get_n_rows      (TrbShortlistPanel *self);
const char  *trb_shortlist_panel_get_row_section (TrbShortlistPanel *self,
                                                  guint              index);

G_END_DECLS
