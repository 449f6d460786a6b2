/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

/* The user guide, opened with F1 and from the primary menu: the Markdown pages installed
 * under share/doc/trabeate, or those of the source tree named by TRABEATE_DOCDIR. */

char     *trb_help_dup_folder  (void);
char     *trb_help_dup_guide   (void);
gboolean  trb_help_show        (GtkWindow  *parent,
                                GError    **error);

G_END_DECLS
