/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-style.h"

#include <math.h>
#include <string.h>

/* The GNOME palette (GNOME Human Interface Guidelines, "Palette"): the named colours every
 * GNOME application shares, as 0xRRGGBB. */
#define GNOME_BLUE_2    0x62a0ea
#define GNOME_BLUE_4    0x1c71d8
#define GNOME_GREEN_4   0x2ec27e
#define GNOME_YELLOW_3  0xf6d32d
#define GNOME_YELLOW_5  0xe5a50a
#define GNOME_ORANGE_2  0xffa348
#define GNOME_RED_1     0xf66151
#define GNOME_RED_3     0xe01b24
#define GNOME_PURPLE_2  0xc061cb
#define GNOME_BROWN_2   0xb5835a
#define GNOME_LIGHT_1   0xffffff
#define GNOME_LIGHT_3   0xdeddda
#define GNOME_LIGHT_5   0x9a9996
#define GNOME_DARK_1    0x77767b
#define GNOME_DARK_3    0x3d3846
#define GNOME_DARK_4    0x241f31

/* The status ramp's thresholds: a ratio of 0.9 or more is near its limit (amber), above 1.0
 * fails (red). */
#define RATIO_NEAR 0.9
#define RATIO_FAIL 1.0

static void
rgb (TrbRgba *out,
     guint32  hex,
     double   alpha)
{
  out->r = ((hex >> 16) & 0xff) / 255.0;
  out->g = ((hex >> 8) & 0xff) / 255.0;
  out->b = (hex & 0xff) / 255.0;
  out->a = alpha;
}

/**
 * trb_render_style_init:
 * @style: the style to fill
 *
 * The screen's style: light, 12-pixel text, 2-pixel member lines.
 */
void
trb_render_style_init (TrbRenderStyle *style)
{
  g_return_if_fail (style != NULL);

  style->dark = FALSE;
  style->print = FALSE;
  /* DejaVu Sans has the same metrics everywhere it is installed, so a page measures the same
   * on every machine */
  style->font_family = "DejaVu Sans";
  style->font_size = 12.0;
  style->line_width = 2.0;
}

/**
 * trb_render_style_init_print:
 * @style: the style to fill
 *
 * The printed page's style, in points: 7-point text, 1.2-point member lines.
 */
void
trb_render_style_init_print (TrbRenderStyle *style)
{
  g_return_if_fail (style != NULL);

  trb_render_style_init (style);
  style->print = TRUE;
  style->font_size = 7.0;
  style->line_width = 1.2;
}

TrbRenderStatus
trb_render_status_from (TrbStatus status,
                        double    ratio)
{
  switch (status)
    {
    case TRB_STATUS_PASS:
      if (!isnan (ratio) && ratio > RATIO_FAIL)
        return TRB_RENDER_STATUS_FAIL;
      if (!isnan (ratio) && ratio >= RATIO_NEAR)
        return TRB_RENDER_STATUS_NEAR;
      return TRB_RENDER_STATUS_OK;
    case TRB_STATUS_FAIL:
    case TRB_STATUS_ERROR:
      return TRB_RENDER_STATUS_FAIL;
    case TRB_STATUS_UNSTABLE:
    case TRB_STATUS_UNSUPPORTED:
    case TRB_STATUS_NOT_DESIGNED:
    default:
      return TRB_RENDER_STATUS_NONE;
    }
}

/**
 * trb_render_status_of:
 * @result: (nullable): a member's result, or %NULL when it has none yet
 *
 * Returns: how the member reads on the plan
 */
TrbRenderStatus
trb_render_status_of (const TrbMemberResult *result)
{
  if (result == NULL)
    return TRB_RENDER_STATUS_NONE;
  return trb_render_status_from (result->status, result->ratio);
}

void
trb_render_status_color (const TrbRenderStyle *style,
                         TrbRenderStatus       status,
                         TrbRgba              *out)
{
  g_return_if_fail (style != NULL && out != NULL);

  /* lighter shades on a dark page, so that each keeps its contrast */
  switch (status)
    {
    case TRB_RENDER_STATUS_OK:
      rgb (out, style->dark ? GNOME_BLUE_2 : GNOME_BLUE_4, 1.0);
      break;
    case TRB_RENDER_STATUS_NEAR:
      rgb (out, style->dark ? GNOME_YELLOW_3 : GNOME_YELLOW_5, 1.0);
      break;
    case TRB_RENDER_STATUS_FAIL:
      rgb (out, style->dark ? GNOME_RED_1 : GNOME_RED_3, 1.0);
      break;
    case TRB_RENDER_STATUS_NONE:
    default:
      rgb (out, style->dark ? GNOME_LIGHT_5 : GNOME_DARK_1, 1.0);
      break;
    }
}

void
trb_render_ink_color (const TrbRenderStyle *style,
                      TrbRgba              *out)
{
  g_return_if_fail (style != NULL && out != NULL);

  if (style->print)
    rgb (out, 0x000000, 1.0);
  else
    rgb (out, style->dark ? GNOME_LIGHT_3 : GNOME_DARK_4, 1.0);
}

void
trb_render_paper_color (const TrbRenderStyle *style,
                        TrbRgba              *out)
{
  g_return_if_fail (style != NULL && out != NULL);

  rgb (out, style->dark && !style->print ? GNOME_DARK_3 : GNOME_LIGHT_1, 1.0);
}

void
trb_render_selection_color (const TrbRenderStyle *style,
                            TrbRgba              *out)
{
  g_return_if_fail (style != NULL && out != NULL);

  rgb (out, GNOME_BLUE_2, 0.45);
}

/**
 * trb_render_case_color:
 * @style: the style
 * @lcase: a load case
 * @out: the colour, opaque; area loads are shaded with it at a low alpha
 *
 * One hue per load case, kept away from the status ramp's blue, amber and red so that a load
 * is never read as a status: dead brown, live green, roof live purple, snow orange.
 */
void
trb_render_case_color (const TrbRenderStyle *style,
                       TrbLoadCase           lcase,
                       TrbRgba              *out)
{
  g_return_if_fail (style != NULL && out != NULL);

  switch (lcase)
    {
    case TRB_CASE_D:
      rgb (out, GNOME_BROWN_2, 1.0);
      break;
    case TRB_CASE_L:
      rgb (out, GNOME_GREEN_4, 1.0);
      break;
    case TRB_CASE_LR:
      rgb (out, GNOME_PURPLE_2, 1.0);
      break;
    case TRB_CASE_S:
    default:
      rgb (out, GNOME_ORANGE_2, 1.0);
      break;
    }
}

void
trb_render_set_color (cairo_t       *cr,
                      const TrbRgba *color)
{
  cairo_set_source_rgba (cr, color->r, color->g, color->b, color->a);
}

/* ---- text --------------------------------------------------------------------------------- */

PangoLayout *
trb_render_layout_new (cairo_t              *cr,
                       const TrbRenderStyle *style,
                       double                size,
                       gboolean              bold,
                       const char           *text)
{
  PangoLayout *layout;
  PangoFontDescription *desc;
  cairo_font_options_t *options;

  g_return_val_if_fail (cr != NULL && style != NULL, NULL);

  layout = pango_cairo_create_layout (cr);

  /* Hinted metrics round glyph advances to whole device units, which differ between a PDF and
   * a PNG of the same page; unhinted, a line is the same width everywhere. */
  options = cairo_font_options_create ();
  cairo_font_options_set_hint_metrics (options, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (options, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (pango_layout_get_context (layout), options);
  cairo_font_options_destroy (options);
  pango_layout_context_changed (layout);

  desc = pango_font_description_new ();
  pango_font_description_set_family (desc, style->font_family != NULL ? style->font_family
                                                                      : "Sans");
  pango_font_description_set_absolute_size (desc, size * PANGO_SCALE);
  pango_font_description_set_weight (desc, bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (layout, desc);
  pango_font_description_free (desc);

  if (text != NULL)
    pango_layout_set_text (layout, text, -1);

  return layout;
}

double
trb_render_text (cairo_t              *cr,
                 const TrbRenderStyle *style,
                 const char           *text,
                 double                size,
                 gboolean              bold,
                 double                x,
                 double                y,
                 double                ax,
                 double                ay,
                 double               *height)
{
  g_autoptr(PangoLayout) layout = NULL;
  PangoRectangle logical;
  double w, h;

  g_return_val_if_fail (cr != NULL && style != NULL, 0);

  if (text == NULL || text[0] == '\0')
    {
      if (height != NULL)
        *height = 0;
      return 0;
    }
  layout = trb_render_layout_new (cr, style, size, bold, text);
  pango_layout_get_extents (layout, NULL, &logical);
  w = (double) logical.width / PANGO_SCALE;
  h = (double) logical.height / PANGO_SCALE;
  cairo_move_to (cr, x - ax * w - (double) logical.x / PANGO_SCALE,
                 y - ay * h - (double) logical.y / PANGO_SCALE);
  pango_cairo_show_layout (cr, layout);
  cairo_new_path (cr);
  if (height != NULL)
    *height = h;
  return w;
}

double
trb_render_text_width (cairo_t              *cr,
                       const TrbRenderStyle *style,
                       const char           *text,
                       double                size,
                       gboolean              bold)
{
  g_autoptr(PangoLayout) layout = NULL;
  PangoRectangle logical;

  g_return_val_if_fail (cr != NULL && style != NULL, 0);

  if (text == NULL || text[0] == '\0')
    return 0;
  layout = trb_render_layout_new (cr, style, size, bold, text);
  pango_layout_get_extents (layout, NULL, &logical);
  return (double) logical.width / PANGO_SCALE;
}

double
trb_render_text_wrapped (cairo_t              *cr,
                         const TrbRenderStyle *style,
                         const char           *text,
                         double                size,
                         gboolean              bold,
                         double                x,
                         double                y,
                         double                width)
{
  g_autoptr(PangoLayout) layout = NULL;
  PangoRectangle logical;

  g_return_val_if_fail (cr != NULL && style != NULL, 0);

  if (text == NULL || text[0] == '\0')
    return 0;
  layout = trb_render_layout_new (cr, style, size, bold, text);
  pango_layout_set_width (layout, (int) (width * PANGO_SCALE));
  pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
  pango_layout_get_extents (layout, NULL, &logical);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
  cairo_new_path (cr);
  return (double) logical.height / PANGO_SCALE;
}

/* ---- text laid out once ------------------------------------------------------------------- */

/* Past this many strings the cache starts again: the two lines of the labels of the most
 * members a screen labels (3,000) and more, at about 1.3 kB a layout some 10 MB at most. */
#define TEXT_CACHE_MAX 8192

typedef struct
{
  PangoLayout *layout;
  double       width;    /* the logical box, device units */
  double       height;
  double       x;        /* its offset from the layout's origin */
  double       y;
} CachedText;

typedef struct
{
  char    *family;
  double   size;
  gboolean bold;
  char    *text;
} TextKey;

struct _TrbRenderTextCache
{
  GHashTable          *texts;       /* TextKey -> CachedText */
  PangoContext        *context;     /* NULL until the first use */
  cairo_surface_type_t surface_type;
  double               scale_x;     /* the font scale factors of the transformation */
  double               scale_y;
};

static guint
text_key_hash (gconstpointer p)
{
  const TextKey *k = p;
  guint64 bits;

  memcpy (&bits, &k->size, sizeof bits);
  return g_str_hash (k->text) ^ g_str_hash (k->family) * 31 ^ (guint) (bits ^ bits >> 32) * 7 ^
         (guint) k->bold;
}

static gboolean
text_key_equal (gconstpointer a,
                gconstpointer b)
{
  const TextKey *x = a, *y = b;

  return x->size == y->size && x->bold == y->bold && strcmp (x->text, y->text) == 0 &&
         strcmp (x->family, y->family) == 0;
}

static void
text_key_free (TextKey *k)
{
  g_free (k->family);
  g_free (k->text);
  g_free (k);
}

static void
cached_text_free (CachedText *t)
{
  g_clear_object (&t->layout);
  g_free (t);
}

/**
 * trb_render_text_cache_new:
 *
 * Returns: (transfer full): an empty cache of laid-out text
 */
TrbRenderTextCache *
trb_render_text_cache_new (void)
{
  TrbRenderTextCache *cache = g_new0 (TrbRenderTextCache, 1);

  cache->texts = g_hash_table_new_full (text_key_hash, text_key_equal,
                                        (GDestroyNotify) text_key_free,
                                        (GDestroyNotify) cached_text_free);
  return cache;
}

void
trb_render_text_cache_free (TrbRenderTextCache *cache)
{
  if (cache == NULL)
    return;
  g_clear_pointer (&cache->texts, g_hash_table_unref);
  g_clear_object (&cache->context);
  g_free (cache);
}

guint
trb_render_text_cache_size (const TrbRenderTextCache *cache)
{
  g_return_val_if_fail (cache != NULL, 0);

  return g_hash_table_size (cache->texts);
}

/* The context the cache's layouts share: made as trb_render_layout_new() makes one for a
 * layout of its own, from cr (its surface's font options, the scale of its transformation),
 * emptying the cache when either has changed since. Only the scale counts of the
 * transformation: with hinting off, a layout's advances do not depend on rotation, and
 * translation never reaches Pango. */
static void
text_cache_prepare (TrbRenderTextCache *cache,
                    cairo_t            *cr)
{
  cairo_surface_type_t type = cairo_surface_get_type (cairo_get_target (cr));
  cairo_matrix_t m;
  PangoMatrix pm = PANGO_MATRIX_INIT;
  double sx, sy;
  cairo_font_options_t *options;

  cairo_get_matrix (cr, &m);
  pm.xx = m.xx;
  pm.yx = m.yx;
  pm.xy = m.xy;
  pm.yy = m.yy;
  pango_matrix_get_font_scale_factors (&pm, &sx, &sy);
  if (cache->context != NULL && cache->surface_type == type && cache->scale_x == sx &&
      cache->scale_y == sy)
    return;

  g_hash_table_remove_all (cache->texts);
  g_clear_object (&cache->context);
  cache->surface_type = type;
  cache->scale_x = sx;
  cache->scale_y = sy;
  cache->context = pango_cairo_create_context (cr);
  /* the scale alone, so that the first text's rotation is not every text's */
  pm = (PangoMatrix) PANGO_MATRIX_INIT;
  pango_matrix_scale (&pm, sx, sy);
  pango_context_set_matrix (cache->context, &pm);
  options = cairo_font_options_create ();
  cairo_font_options_set_hint_metrics (options, CAIRO_HINT_METRICS_OFF);
  cairo_font_options_set_hint_style (options, CAIRO_HINT_STYLE_NONE);
  pango_cairo_context_set_font_options (cache->context, options);
  cairo_font_options_destroy (options);
}

static const CachedText *
text_cache_lookup (TrbRenderTextCache   *cache,
                   cairo_t              *cr,
                   const TrbRenderStyle *style,
                   const char           *text,
                   double                size,
                   gboolean              bold)
{
  const char *family = style->font_family != NULL ? style->font_family : "Sans";
  TextKey key = { (char *) family, size, bold != FALSE, (char *) text };
  TextKey *stored;
  CachedText *t;
  PangoFontDescription *desc;
  PangoRectangle logical;

  text_cache_prepare (cache, cr);
  t = g_hash_table_lookup (cache->texts, &key);
  if (t != NULL)
    return t;

  if (g_hash_table_size (cache->texts) >= TEXT_CACHE_MAX)
    g_hash_table_remove_all (cache->texts);
  t = g_new0 (CachedText, 1);
  t->layout = pango_layout_new (cache->context);
  desc = pango_font_description_new ();
  pango_font_description_set_family (desc, family);
  pango_font_description_set_absolute_size (desc, size * PANGO_SCALE);
  pango_font_description_set_weight (desc, bold ? PANGO_WEIGHT_BOLD : PANGO_WEIGHT_NORMAL);
  pango_layout_set_font_description (t->layout, desc);
  pango_font_description_free (desc);
  pango_layout_set_text (t->layout, text, -1);
  pango_layout_get_extents (t->layout, NULL, &logical);
  t->width = (double) logical.width / PANGO_SCALE;
  t->height = (double) logical.height / PANGO_SCALE;
  t->x = (double) logical.x / PANGO_SCALE;
  t->y = (double) logical.y / PANGO_SCALE;
  stored = g_new (TextKey, 1);
  stored->family = g_strdup (family);
  stored->size = size;
  stored->bold = bold != FALSE;
  stored->text = g_strdup (text);
  g_hash_table_insert (cache->texts, stored, t);
  return t;
}

double
trb_render_text_cached (TrbRenderTextCache   *cache,
                        cairo_t              *cr,
                        const TrbRenderStyle *style,
                        const char           *text,
                        double                size,
                        gboolean              bold,
                        double                x,
                        double                y,
                        double                ax,
                        double                ay,
                        double               *height)
{
  const CachedText *t;

  g_return_val_if_fail (cache != NULL && cr != NULL && style != NULL, 0);

  if (text == NULL || text[0] == '\0')
    {
      if (height != NULL)
        *height = 0;
      return 0;
    }
  t = text_cache_lookup (cache, cr, style, text, size, bold);
  cairo_move_to (cr, x - ax * t->width - t->x, y - ay * t->height - t->y);
  pango_cairo_show_layout (cr, t->layout);
  cairo_new_path (cr);
  if (height != NULL)
    *height = t->height;
  return t->width;
}

double
trb_render_text_width_cached (TrbRenderTextCache   *cache,
                              cairo_t              *cr,
                              const TrbRenderStyle *style,
                              const char           *text,
                              double                size,
                              gboolean              bold)
{
  g_return_val_if_fail (cache != NULL && cr != NULL && style != NULL, 0);

  if (text == NULL || text[0] == '\0')
    return 0;
  return text_cache_lookup (cache, cr, style, text, size, bold)->width;
}
