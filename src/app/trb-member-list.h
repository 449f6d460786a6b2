/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-document.h"

G_BEGIN_DECLS

#define TRB_TYPE_MEMBER_LIST (trb_member_list_get_type ())

G_DECLARE_FINAL_TYPE (TrbMemberList, trb_member_list, TRB, MEMBER_LIST, AdwBin)

/* The members of the project in a sortable table, with a summary line. Picking a row emits
 * ::member-activated; the window selects and reveals that member on the plan. */

GtkWidget   *trb_member_list_new          (void);
void         trb_member_list_set_document (TrbMemberList *self,
                                           TrbDocument   *document);
void         trb_member_list_set_member   (TrbMemberList *self,
                                           TrbMember     *member);
GListModel  *trb_member_list_get_model    (TrbMemberList *self);
gboolean     trb_member_list_get_shows_floors (TrbMemberList *self);
const char  *trb_member_list_get_summary  (TrbMemberList *self);
void         trb_member_list_activate_row (TrbMemberList *self,
                                           guint          position);

G_END_DECLS
