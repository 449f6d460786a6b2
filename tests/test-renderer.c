/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <gtk/gtk.h>

#include "trb-renderer.h"

/* The renderer the editor's windows get (trb-renderer.c): a software GL (Mesa's llvmpipe, as
 * under the virtual X server the suite runs in) gives the cairo renderer, a graphics card's GL
 * is left to GTK, and a GSK_RENDERER the user set wins. Runs without GSK_RENDERER, unlike the
 * other GUI tests. */

static void
test_names (void)
{
  /* GL_RENDERER strings of Mesa's drivers. The llvmpipe one is read off Debian 12's Mesa 22.3
   * on the suite's virtual X server; the hardware ones are of Mesa's radeonsi and iris drivers
   * (from memory). A hardware driver built with LLVM says so, hence "llvmpipe", not "LLVM". */
  g_assert_true (trb_renderer_name_is_software ("llvmpipe (LLVM 15.0.6, 256 bits)"));
  g_assert_true (trb_renderer_name_is_software ("softpipe"));
  g_assert_true (trb_renderer_name_is_software ("Software Rasterizer"));
  g_assert_false (trb_renderer_name_is_software (
    "AMD Radeon RX 580 Series (polaris10, LLVM 15.0.6, DRM 3.49, 6.1.0-13-amd64)"));
  g_assert_false (trb_renderer_name_is_software ("Mesa Intel(R) UHD Graphics 620 (KBL GT2)"));
  g_assert_false (trb_renderer_name_is_software (NULL));
}

static void
test_user_choice_wins (void)
{
  GdkDisplay *display = gdk_display_get_default ();

  g_setenv ("GSK_RENDERER", "gl", TRUE);
  g_assert_cmpint (trb_renderer_choose (display), ==, TRB_RENDERER_USER);
  g_unsetenv ("GSK_RENDERER");
  g_setenv ("GDK_DEBUG", "gl-disable", TRUE);
  g_assert_cmpint (trb_renderer_choose (display), ==, TRB_RENDERER_USER);
  g_unsetenv ("GDK_DEBUG");
  g_assert_null (g_object_get_data (G_OBJECT (display), "gsk-renderer"));
}

/* The choice reaches the window: a window realized after it renders with cairo on a software
 * GL. GTK reads GSK_RENDERER once, at the first window, so this test makes the first. */
static void
test_window_renderer (void)
{
  GdkDisplay *display = gdk_display_get_default ();
  g_autofree char *name = trb_renderer_gl_name (display);
  TrbRendererChoice choice = trb_renderer_choose (display);
  GtkWidget *window;
  GskRenderer *renderer;

  g_test_message ("GL renderer: %s", name != NULL ? name : "(no GL)");
  if (name == NULL)
    {
      g_assert_cmpint (choice, ==, TRB_RENDERER_GTK_DEFAULT);
      g_test_skip ("no GL on this display: GTK itself falls back to cairo");
      return;
    }

  window = gtk_window_new ();
  gtk_widget_realize (window);
  renderer = gtk_native_get_renderer (GTK_NATIVE (window));
  g_assert_nonnull (renderer);
  g_test_message ("window renderer: %s", G_OBJECT_TYPE_NAME (renderer));
  if (trb_renderer_name_is_software (name))
    {
      g_assert_cmpint (choice, ==, TRB_RENDERER_CAIRO);
      g_assert_cmpstr (G_OBJECT_TYPE_NAME (renderer), ==, "GskCairoRenderer");
    }
  else
    {
      g_assert_cmpint (choice, ==, TRB_RENDERER_GTK_DEFAULT);
      g_assert_cmpstr (G_OBJECT_TYPE_NAME (renderer), !=, "GskCairoRenderer");
    }
  gtk_window_destroy (GTK_WINDOW (window));
}

int
main (int   argc,
      char *argv[])
{
  /* before GTK starts any thread: the suite's environment names the cairo renderer */
  g_unsetenv ("GSK_RENDERER");
  g_unsetenv ("GDK_DEBUG");
  gtk_test_init (&argc, &argv, NULL);

  g_test_add_func ("/trb/app/renderer/names", test_names);
  g_test_add_func ("/trb/app/renderer/user-choice-wins", test_user_choice_wins);
  g_test_add_func ("/trb/app/renderer/window", test_window_renderer);
  return g_test_run ();
}
