/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Which GSK renderer the windows use. GTK 4.8 renders with GL whenever GL works, even when the
 * GL is Mesa's software rasterizer (a virtual machine, a remote desktop, a virtual X server):
 * there the plan, which is drawn with cairo anyway, gains nothing from GL, and the software GL
 * renderer costs some 80 MB more (docs/performance.md, "Editing"). GTK 4.14 and later make the
 * same choice themselves (no GPU renderer on llvmpipe); this does it on 4.8. An explicit
 * GSK_RENDERER, or GL turned off in GDK_DEBUG, is the user's choice and is left alone. */

#include "config.h"

#include "trb-renderer.h"

#include <epoxy/gl.h>
#include <string.h>

gboolean
trb_renderer_name_is_software (const char *gl_renderer)
{
  static const char *const software[] = { "llvmpipe", "softpipe", "Software Rasterizer" };

  if (gl_renderer == NULL)
    return FALSE;
  for (gsize i = 0; i < G_N_ELEMENTS (software); i++)
    if (strstr (gl_renderer, software[i]) != NULL)
      return TRUE;
  return FALSE;
}

/* The GL_RENDERER string of a context of the display, or NULL when there is no GL. */
char *
trb_renderer_gl_name (GdkDisplay *display)
{
  g_autoptr(GdkGLContext) context = NULL;
  const char *name;
  char *copy;

  if (!gdk_display_prepare_gl (display, NULL))
    return NULL;
  context = gdk_display_create_gl_context (display, NULL);
  if (context == NULL || !gdk_gl_context_realize (context, NULL))
    return NULL;
  gdk_gl_context_make_current (context);
  name = (const char *) glGetString (GL_RENDERER);
  copy = g_strdup (name);
  gdk_gl_context_clear_current ();
  return copy;
}

/* Call once the display is open and before any window is shown: GTK picks a window's renderer
 * when the window is realized. */
TrbRendererChoice
trb_renderer_choose (GdkDisplay *display)
{
  const char *debug = g_getenv ("GDK_DEBUG");
  g_autofree char *name = NULL;

  g_return_val_if_fail (GDK_IS_DISPLAY (display), TRB_RENDERER_GTK_DEFAULT);

  if (g_getenv ("GSK_RENDERER") != NULL || (debug != NULL && strstr (debug, "gl-") != NULL))
    return TRB_RENDERER_USER;

  name = trb_renderer_gl_name (display);
  if (!trb_renderer_name_is_software (name))
    return TRB_RENDERER_GTK_DEFAULT;

  /* The display's own choice, which GTK reads before GSK_RENDERER (GTK's inspector sets it the
   * same way); unlike the environment it is safe with other threads running. */
  g_object_set_data_full (G_OBJECT (display), "gsk-renderer", g_strdup ("cairo"), g_free);
  g_debug ("GL renderer \"%s\" is software: using the cairo renderer", name);
  return TRB_RENDERER_CAIRO;
}
