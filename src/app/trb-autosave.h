/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-application.h"
#include "trb-window.h"

G_BEGIN_DECLS

/* Recovery copies of unsaved changes. Each window keeps one copy of its project in the user's
 * state folder (trabeate/recovery/), written a quiet second after an edit and every minute
 * while changes are unsaved, with a sidecar that names the project's own file; both go when
 * the project is saved or the window closes. At the next start, the copies a dead process
 * left are offered back. */

#define TRB_TYPE_AUTOSAVE (trb_autosave_get_type ())

G_DECLARE_FINAL_TYPE (TrbAutosave, trb_autosave, TRB, AUTOSAVE, GObject)

TrbAutosave *trb_autosave_attach          (TrbWindow       *window);
TrbAutosave *trb_autosave_get_for_window  (TrbWindow       *window);
gboolean     trb_autosave_write_now       (TrbAutosave     *self,
                                           GError         **error);
void         trb_autosave_discard         (TrbAutosave     *self);
const char  *trb_autosave_get_path        (TrbAutosave     *self);

char        *trb_autosave_dup_folder      (void);
guint        trb_autosave_count_orphans   (void);
GtkWindow   *trb_autosave_offer           (TrbApplication  *application,
                                           GtkWindow       *parent);
guint        trb_autosave_restore_all     (TrbApplication  *application,
                                           GtkWindow       *into);
void         trb_autosave_discard_all     (void);

G_END_DECLS
