/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

G_BEGIN_DECLS

#define TRB_TYPE_PREFERENCES_WINDOW (trb_preferences_window_get_type ())

G_DECLARE_FINAL_TYPE (TrbPreferencesWindow, trb_preferences_window, TRB, PREFERENCES_WINDOW,
                      AdwPreferencesWindow)

GtkWidget *trb_preferences_window_new (GSettings *settings);

G_END_DECLS
