/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <gio/gio.h>

#include "trb-edit.h"
#include "trb-model.h"
#include "trb-solve.h"

G_BEGIN_DECLS

#define TRB_TYPE_DOCUMENT (trb_document_get_type ())

G_DECLARE_FINAL_TYPE (TrbDocument, trb_document, TRB, DOCUMENT, GObject)

/* One open project: the model, its edit history and its results, and the file it came from.
 * Every edit goes through trb_document_push(), which applies the command and emits ::changed;
 * the project is solved again in a worker thread, and ::solved says when its results are in. */

TrbDocument            *trb_document_new                 (const TrbSettings     *defaults);
TrbDocument            *trb_document_new_for_file        (GFile                 *file,
                                                          GError               **error);
TrbDocument            *trb_document_new_for_recovery    (GFile                 *recovery,
                                                          GFile                 *original,
                                                          GError               **error);
gboolean                trb_document_save                (TrbDocument           *self,
                                                          GFile                 *file,
                                                          GError               **error);

GFile                  *trb_document_get_file            (TrbDocument           *self);
char                   *trb_document_dup_title           (TrbDocument           *self);
gboolean                trb_document_get_modified        (TrbDocument           *self);
gboolean                trb_document_is_untouched        (TrbDocument           *self);

TrbProject             *trb_document_get_project         (TrbDocument           *self);
TrbFloor               *trb_document_get_floor           (TrbDocument           *self);
guint                   trb_document_get_floor_index     (TrbDocument           *self);
void                    trb_document_set_floor_index     (TrbDocument           *self,
                                                          guint                  index);
int                     trb_document_find_floor          (TrbDocument           *self,
                                                          const TrbFloor        *floor);
const TrbProjectResult *trb_document_get_results         (TrbDocument           *self);
const TrbMemberResult  *trb_document_lookup_result       (TrbDocument           *self,
                                                          const TrbMember       *member);
const TrbFloorResult   *trb_document_get_floor_result    (TrbDocument           *self);
double                  trb_document_get_solve_time      (TrbDocument           *self);
gboolean                trb_document_get_solving         (TrbDocument           *self);
gboolean                trb_document_get_results_current (TrbDocument           *self);

gboolean                trb_document_push                (TrbDocument           *self,
                                                          TrbEditCommand        *command);
void                    trb_document_begin_group         (TrbDocument           *self,
                                                          const char            *label);
void                    trb_document_end_group           (TrbDocument           *self);
void                    trb_document_cancel_group        (TrbDocument           *self);
gboolean                trb_document_undo                (TrbDocument           *self);
gboolean                trb_document_redo                (TrbDocument           *self);
gboolean                trb_document_get_can_undo        (TrbDocument           *self);
gboolean                trb_document_get_can_redo        (TrbDocument           *self);
const char             *trb_document_get_undo_label      (TrbDocument           *self);
const char             *trb_document_get_redo_label      (TrbDocument           *self);

G_END_DECLS
