/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <gtk/gtk.h>

#include "trb-document.h"
#include "trb-window.h"

G_BEGIN_DECLS

/* Printing and export of the report: the same pages as `trabeate-cli report`, drawn by
 * trb_report_draw_page into GTK's print context (print, with its preview) or written by
 * trb_report_write (PDF, SVG). Both work on a copy of the project solved afresh, so an edit
 * made while the print dialog is open leaves the pages being printed alone. */

GtkPrintOperation *trb_print_operation_new   (TrbDocument  *document,
                                              GError      **error);
void               trb_print_run             (TrbWindow    *window);
gboolean           trb_print_export          (TrbWindow    *window,
                                              GFile        *file,
                                              GError      **error);
void               trb_print_export_dialog   (TrbWindow    *window);
void               trb_print_add_accels      (GtkApplication *app);

G_END_DECLS
