/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#pragma once

#include <gtk/gtk.h>

G_BEGIN_DECLS

typedef enum
{
  TRB_RENDERER_GTK_DEFAULT, /* GTK chooses (hardware GL, or no GL at all) */
  TRB_RENDERER_USER,        /* GSK_RENDERER or GDK_DEBUG names it: left alone */
  TRB_RENDERER_CAIRO,       /* GL is a software rasterizer: the cairo renderer instead */
} TrbRendererChoice;

gboolean          trb_renderer_name_is_software (const char *gl_renderer);
char             *trb_renderer_gl_name          (GdkDisplay *display);
TrbRendererChoice trb_renderer_choose           (GdkDisplay *display);

G_END_DECLS
