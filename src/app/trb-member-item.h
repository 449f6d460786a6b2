/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib-object.h>

#include "trb-model.h"
#include "trb-solve.h"

G_BEGIN_DECLS

#define TRB_TYPE_MEMBER_ITEM (trb_member_item_get_type ())

G_DECLARE_FINAL_TYPE (TrbMemberItem, trb_member_item, TRB, MEMBER_ITEM, GObject)

/* One row of the members list: what a member is and how its check came out, as text. A row
 * is kept for as long as its member is in the project and brought up to date in place
 * (::changed), so that an edit to a floor of ten thousand members touches the rows on the
 * screen, not ten thousand. */

TrbMemberItem *trb_member_item_new              (TrbMember             *member,
                                                 const TrbMemberResult *result);
gboolean       trb_member_item_update           (TrbMemberItem         *self,
                                                 const TrbMemberResult *result);
gboolean       trb_member_item_is_stale         (TrbMemberItem         *self);
TrbMember     *trb_member_item_get_member       (TrbMemberItem         *self);
const char    *trb_member_item_get_mark         (TrbMemberItem         *self);
const char    *trb_member_item_get_role         (TrbMemberItem         *self);
const char    *trb_member_item_get_section      (TrbMemberItem         *self);
const char    *trb_member_item_get_status       (TrbMemberItem         *self);
const char    *trb_member_item_get_status_class (TrbMemberItem         *self);
double         trb_member_item_get_ratio        (TrbMemberItem         *self);
const char    *trb_member_item_get_governing    (TrbMemberItem         *self);
const char    *trb_member_item_get_floor        (TrbMemberItem         *self);
gboolean       trb_member_item_get_failing      (TrbMemberItem         *self);
char          *trb_member_item_describe         (TrbMemberItem         *self);

const char    *trb_role_label                   (TrbFrameRole           role);
const char    *trb_status_label                 (TrbStatus              status);

G_END_DECLS
