/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-document.h"

G_BEGIN_DECLS

#define TRB_TYPE_MEMBER_PANEL (trb_member_panel_get_type ())

G_DECLARE_FINAL_TYPE (TrbMemberPanel, trb_member_panel, TRB, MEMBER_PANEL, AdwBin)

/* The selected member: its status, attributes (each change an undoable command), checks,
 * what it bears on and the loads given on it. */

GtkWidget   *trb_member_panel_new          (void);
void         trb_member_panel_set_document (TrbMemberPanel *self,
                                            TrbDocument    *document);
void         trb_member_panel_set_member   (TrbMemberPanel *self,
                                            TrbMember      *member);
const char  *trb_member_panel_get_title    (TrbMemberPanel *self);

G_END_DECLS
