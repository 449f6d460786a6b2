/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-model.h"

G_BEGIN_DECLS

#define TRB_TYPE_APPLICATION (trb_application_get_type ())

G_DECLARE_FINAL_TYPE (TrbApplication, trb_application, TRB, APPLICATION, AdwApplication)

TrbApplication *trb_application_new               (const char        *application_id,
                                                   GApplicationFlags  flags);
GSettings      *trb_application_get_settings      (TrbApplication    *self);
void            trb_application_new_settings      (TrbApplication    *self,
                                                   TrbSettings       *settings);
void            trb_application_open_file         (TrbApplication    *self,
                                                   GFile             *file,
                                                   GtkWindow         *from);
void            trb_application_show_about        (TrbApplication    *self);
void            trb_application_show_preferences  (TrbApplication    *self);

G_END_DECLS
