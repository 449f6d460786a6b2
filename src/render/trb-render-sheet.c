/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-sheet.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "trb-cautions.h"
#include "trb-catalog.h"
#include "trb-combos.h"
#include "trb-error.h"
#include "trb-live-reduction.h"
#include "trb-render-diagram.h"
#include "trb-units.h"

/* Points per inch (the PostScript point, by definition) and per metre. */
#define PT_PER_IN 72.0
#define PT_PER_M  (PT_PER_IN / TRB_IN)

/* The page margin (half an inch: inside every office printer's unprintable edge, common
 * practice), the title block's height and the gap inside the border. */
#define MARGIN       36.0
#define TITLE_HEIGHT 66.0
#define INSET        8.0

/* ---- paper -------------------------------------------------------------------------------- */

static const struct
{
  const char *name;
  double      width;   /* points, portrait */
  double      height;
} papers[TRB_N_PAPERS] = {
  /* ANSI sizes in inches, ISO 216 sizes in millimetres, as points */
  [TRB_PAPER_LETTER]  = { "Letter", 8.5 * PT_PER_IN, 11 * PT_PER_IN },
  [TRB_PAPER_LEGAL]   = { "Legal", 8.5 * PT_PER_IN, 14 * PT_PER_IN },
  [TRB_PAPER_TABLOID] = { "Tabloid", 11 * PT_PER_IN, 17 * PT_PER_IN },
  [TRB_PAPER_A4]      = { "A4", 210 / 25.4 * PT_PER_IN, 297 / 25.4 * PT_PER_IN },
  [TRB_PAPER_A3]      = { "A3", 297 / 25.4 * PT_PER_IN, 420 / 25.4 * PT_PER_IN },
};

const char *
trb_paper_name (TrbPaper paper)
{
  g_return_val_if_fail (paper < TRB_N_PAPERS, NULL);

  return papers[paper].name;
}

gboolean
trb_paper_from_name (const char *name,
                     TrbPaper   *paper)
{
  g_return_val_if_fail (name != NULL, FALSE);

  for (guint i = 0; i < TRB_N_PAPERS; i++)
    if (g_ascii_strcasecmp (name, papers[i].name) == 0)
      {
        if (paper != NULL)
          *paper = i;
        return TRUE;
      }
  /* the trade's other name for tabloid */
  if (g_ascii_strcasecmp (name, "Ledger") == 0 || g_ascii_strcasecmp (name, "ANSI B") == 0)
    {
      if (paper != NULL)
        *paper = TRB_PAPER_TABLOID;
      return TRUE;
    }
  return FALSE;
}

void
trb_paper_get_size (TrbPaper  paper,
                    gboolean  landscape,
                    double   *width,
                    double   *height)
{
  g_return_if_fail (paper < TRB_N_PAPERS);

  if (width != NULL)
    *width = landscape ? papers[paper].height : papers[paper].width;
  if (height != NULL)
    *height = landscape ? papers[paper].width : papers[paper].height;
}

/* ---- scales ------------------------------------------------------------------------------- */

/* A fraction of an inch with a denominator of at most 64, or FALSE. */
static gboolean
inch_fraction (double  inches,
               char   *buf,
               gsize   size)
{
  for (int den = 1; den <= 64; den *= 2)
    {
      double num = inches * den;

      if (fabs (num - round (num)) < 1e-9 && num >= 1)
        {
          int n = (int) round (num);
          int whole = n / den, rest = n % den;

          if (rest == 0)
            g_snprintf (buf, size, "%d\"", whole);
          else if (whole == 0)
            g_snprintf (buf, size, "%d/%d\"", rest, den);
          else
            g_snprintf (buf, size, "%d %d/%d\"", whole, rest, den);
          return TRUE;
        }
    }
  return FALSE;
}

static void
scale_label_us (TrbDrawingScale *scale)
{
  char frac[32];
  double in_per_ft = scale->ratio * 12;
  double ft_per_in = 1 / in_per_ft;

  /* architectural: so much of an inch to the foot; engineering: an inch to so many feet */
  if (in_per_ft <= 3 && inch_fraction (in_per_ft, frac, sizeof frac))
    g_snprintf (scale->label, sizeof scale->label, "%s = 1'-0\"", frac);
  else if (fabs (ft_per_in - round (ft_per_in)) < 1e-9)
    g_snprintf (scale->label, sizeof scale->label, "1\" = %.0f'-0\"", ft_per_in);
  else
    g_snprintf (scale->label, sizeof scale->label, "1:%.6g", 1 / scale->ratio);
}

gboolean
trb_drawing_scale_parse (const char       *text,
                         TrbDrawingScale  *scale,
                         GError          **error)
{
  g_autofree char *t = NULL;
  const char *colon, *eq;

  g_return_val_if_fail (text != NULL && scale != NULL, FALSE);

  t = g_strstrip (g_strdup (text));
  colon = strchr (t, ':');
  eq = strchr (t, '=');
  memset (scale, 0, sizeof *scale);

  if (colon != NULL && eq == NULL)
    {
      char *end1, *end2;
      double a = g_ascii_strtod (t, &end1);
      double b;

      while (*end1 == ' ')
        end1++;
      b = g_ascii_strtod (colon + 1, &end2);
      while (*end2 == ' ')
        end2++;
      if (end1 == colon && *end2 == '\0' && a > 0 && b > 0 && isfinite (a) && isfinite (b))
        {
          scale->ratio = a / b;
          if (a == 1)
            g_snprintf (scale->label, sizeof scale->label, "1:%.6g", b);
          else
            g_snprintf (scale->label, sizeof scale->label, "%.6g:%.6g", a, b);
          return TRUE;
        }
    }
  else if (eq != NULL && colon == NULL)
    {
      g_autofree char *left = g_strndup (t, eq - t);
      double a, b;

      if (trb_units_parse (left, TRB_DIM_LENGTH, &a, NULL) &&
          trb_units_parse (eq + 1, TRB_DIM_LENGTH, &b, NULL) && a > 0 && b > 0)
        {
          scale->ratio = a / b;
          scale_label_us (scale);
          return TRUE;
        }
    }

  /* Translators: keep the two examples of a scale as they are */
  g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
               _("\"%s\" is not a drawing scale: write it \"1:100\" or \"1/8\\\"=1'-0\\\"\""),
               text);
  return FALSE;
}

gboolean
trb_drawing_scale_fit (TrbUnitSystem    units,
                       double           width,
                       double           height,
                       double           paper_width,
                       double           paper_height,
                       TrbDrawingScale *scale)
{
  /* The trade's usual plan scales, largest first: architectural (inches to the foot) and
   * engineering (feet to the inch) for US drawings; ISO 5455's series for metric ones. */
  static const double us[] = {
    1.0 / 12, 3.0 / 4 / 12, 1.0 / 2 / 12, 3.0 / 8 / 12, 1.0 / 4 / 12, 3.0 / 16 / 12,
    1.0 / 8 / 12, 1.0 / 120, 3.0 / 32 / 12, 1.0 / 16 / 12, 1.0 / 240, 1.0 / 32 / 12,
    1.0 / 480, 1.0 / 600, 1.0 / 1200, 1.0 / 2400,
  };
  static const double si[] = {
    1.0 / 20, 1.0 / 25, 1.0 / 50, 1.0 / 100, 1.0 / 200, 1.0 / 250, 1.0 / 500, 1.0 / 1000,
    1.0 / 2000, 1.0 / 5000,
  };
  const double *list = units == TRB_UNIT_SYSTEM_US ? us : si;
  guint n = units == TRB_UNIT_SYSTEM_US ? G_N_ELEMENTS (us) : G_N_ELEMENTS (si);

  g_return_val_if_fail (scale != NULL, FALSE);

  for (guint i = 0; i < n; i++)
    {
      double ppm = list[i] * PT_PER_M;

      if (width * ppm <= paper_width && height * ppm <= paper_height)
        {
          scale->ratio = list[i];
          if (units == TRB_UNIT_SYSTEM_US)
            scale_label_us (scale);
          else
            g_snprintf (scale->label, sizeof scale->label, "1:%.0f", 1 / list[i]);
          return TRUE;
        }
    }
  scale->ratio = list[n - 1];
  if (units == TRB_UNIT_SYSTEM_US)
    scale_label_us (scale);
  else
    g_snprintf (scale->label, sizeof scale->label, "1:%.0f", 1 / list[n - 1]);
  return FALSE;
}

double
trb_drawing_scale_points_per_metre (const TrbDrawingScale *scale)
{
  g_return_val_if_fail (scale != NULL, 0);

  return scale->ratio * PT_PER_M;
}

/* ---- the frame ---------------------------------------------------------------------------- */

void
trb_sheet_get_content (double  width,
                       double  height,
                       double *x,
                       double *y,
                       double *content_width,
                       double *content_height)
{
  if (x != NULL)
    *x = MARGIN + INSET;
  if (y != NULL)
    *y = MARGIN + INSET;
  if (content_width != NULL)
    *content_width = width - 2 * (MARGIN + INSET);
  if (content_height != NULL)
    *content_height = height - 2 * MARGIN - TITLE_HEIGHT - 2 * INSET;
}

static void
label_value (cairo_t              *cr,
             const TrbRenderStyle *style,
             const char           *label,
             const char           *value,
             double                x,
             double                y,
             double                size,
             gboolean              bold)
{
  double h;

  cairo_set_source_rgb (cr, 0.35, 0.35, 0.35);
  trb_render_text (cr, style, label, 5.2, FALSE, x, y, 0, 0, &h);
  cairo_set_source_rgb (cr, 0, 0, 0);
  trb_render_text (cr, style, value != NULL && value[0] != '\0' ? value : " ", size, bold, x,
                   y + h, 0, 0, NULL);
}

void
trb_sheet_draw_frame (cairo_t              *cr,
                      const TrbRenderStyle *style,
                      const TrbTitleBlock  *block,
                      double                width,
                      double                height)
{
  double x0 = MARGIN, y0 = MARGIN, w = width - 2 * MARGIN, h = height - 2 * MARGIN;
  double ty = y0 + h - TITLE_HEIGHT;
  double c1 = x0 + w * 0.40, c2 = x0 + w * 0.70, c3 = x0 + w * 0.87;
  g_autofree char *page = NULL;

  g_return_if_fail (cr != NULL && style != NULL && block != NULL);

  cairo_save (cr);
  cairo_set_source_rgb (cr, 1, 1, 1);
  cairo_paint (cr);

  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, 1.2);
  cairo_rectangle (cr, x0, y0, w, h);
  cairo_stroke (cr);
  cairo_set_line_width (cr, 0.8);
  cairo_move_to (cr, x0, ty);
  cairo_line_to (cr, x0 + w, ty);
  cairo_stroke (cr);
  cairo_set_line_width (cr, 0.5);
  for (int k = 0; k < 3; k++)
    {
      double cx = k == 0 ? c1 : k == 1 ? c2 : c3;

      cairo_move_to (cr, cx, ty);
      cairo_line_to (cr, cx, y0 + h);
    }
  /* the right-hand cells split in two rows */
  cairo_move_to (cr, c2, ty + TITLE_HEIGHT / 2);
  cairo_line_to (cr, x0 + w, ty + TITLE_HEIGHT / 2);
  cairo_stroke (cr);

  /* the caution, on every sheet */
  cairo_set_source_rgb (cr, 0, 0, 0);
  /* Translators: the labels of the title block are capitals, as drawings write them */
  trb_render_text (cr, style, _("CAUTION"), 6.0, TRUE, x0 + 4, ty + 3, 0, 0, NULL);
  {
    /* each caution translated by its text (the template has them from trb-cli.c) */
    g_autofree char *cautions = g_strjoin (" ", _(TRB_CAUTION_LICENSED),
                                           _(TRB_CAUTION_NOT_CHECKED), _(TRB_CAUTION_COLUMNS),
                                           _(TRB_CAUTION_INPUTS), NULL);

    trb_render_text_wrapped (cr, style, cautions, 4.9, FALSE, x0 + 4, ty + 10.5, c1 - x0 - 8);
  }

  label_value (cr, style, _("PROJECT"), block->project, c1 + 4, ty + 3, 8.5, TRUE);
  label_value (cr, style, _("FLOOR"), block->floor != NULL ? block->floor : "-", c1 + 4,
               ty + 22, 7, FALSE);
  label_value (cr, style, _("SHEET"), block->title, c1 + 4, ty + 41, 8.5, TRUE);

  label_value (cr, style, _("ENGINEER"), block->engineer, c2 + 4, ty + 3, 7, FALSE);
  label_value (cr, style, _("DATE"), block->date, c3 + 4, ty + 3, 7, FALSE);
  label_value (cr, style, _("REVISION"), block->revision != NULL ? block->revision : "-",
               c2 + 4, ty + TITLE_HEIGHT / 2 + 3, 7, FALSE);
  /* Translators: page "3 of 12" */
  page = g_strdup_printf (_("%u of %u"), block->page, block->n_pages);
  label_value (cr, style, _("PAGE"), page, c3 + 4, ty + TITLE_HEIGHT / 2 + 3, 8.5, TRUE);
  cairo_set_source_rgb (cr, 0.35, 0.35, 0.35);
  trb_render_text (cr, style, "Trabeate " PACKAGE_VERSION, 4.8, FALSE, x0 + w - 3,
                   y0 + h - 2, 1, 1, NULL);
  cairo_restore (cr);
}

/* ---- the plan sheet ----------------------------------------------------------------------- */

static void
swatch_line (cairo_t       *cr,
             const TrbRgba *color,
             double         x,
             double         y,
             double         len,
             int            kind)
{
  trb_render_set_color (cr, color);
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, x + len, y);
  if (kind == 1)
    {
      /* double stroke */
      cairo_set_line_width (cr, 3.6);
      cairo_stroke_preserve (cr);
      cairo_set_source_rgb (cr, 1, 1, 1);
      cairo_set_line_width (cr, 1.2);
      cairo_stroke (cr);
      return;
    }
  if (kind == 2)
    {
      double dash[] = { 4.8, 3.0 };

      cairo_set_dash (cr, dash, 2, 0);
    }
  cairo_set_line_width (cr, 1.2);
  cairo_stroke (cr);
  cairo_set_dash (cr, NULL, 0, 0);
}

static double
legend_entry (cairo_t              *cr,
              const TrbRenderStyle *style,
              const TrbRgba        *color,
              int                   kind,
              const char           *text,
              double                x,
              double                y)
{
  double w;

  if (kind == 3)
    {
      /* a load case's shade */
      TrbRgba c = *color;

      c.a = 0.25;
      trb_render_set_color (cr, &c);
      cairo_rectangle (cr, x, y - 3.5, 14, 7);
      cairo_fill (cr);
    }
  else
    swatch_line (cr, color, x, y, 14, kind);
  cairo_set_source_rgb (cr, 0, 0, 0);
  w = trb_render_text (cr, style, text, 6.2, FALSE, x + 17, y, 0, 0.5, NULL);
  return x + 17 + w + 10;
}

static int
cmp_marks (gconstpointer a,
           gconstpointer b)
{
  const TrbMember *ma = *(const TrbMember *const *) a;
  const TrbMember *mb = *(const TrbMember *const *) b;

  return g_utf8_collate (ma->id, mb->id);
}

void
trb_sheet_draw_plan (cairo_t               *cr,
                     const TrbRenderStyle  *style,
                     const TrbPlanScene    *scene,
                     const TrbDrawingScale *scale,
                     const char            *scale_note,
                     GHashTable            *clouded,
                     const char            *clouds_since,
                     double                 x,
                     double                 y,
                     double                 width,
                     double                 height)
{
  TrbPlanDrawOptions options;
  TrbPlanView view;
  TrbPlanBounds b;
  double legend_h = 46, ly, lx;
  TrbRgba c;
  g_autofree char *heading = NULL;
  const TrbFloor *floor;

  g_return_if_fail (cr != NULL && style != NULL && scene != NULL && scale != NULL);

  floor = trb_plan_scene_get_floor (scene);
  cairo_save (cr);

  /* the plan, centred in what the legend leaves */
  memset (&options, 0, sizeof options);
  options.style = *style;
  options.layers = TRB_PLAN_LAYER_ALL;
  options.clouded = clouded;
  options.x = x;
  options.y = y;
  options.width = width;
  options.height = height - legend_h;
  options.layers &= ~TRB_PLAN_LAYER_SCALE_BAR;

  trb_plan_scene_get_bounds (scene, &b);
  view.scale = trb_drawing_scale_points_per_metre (scale);
  if (trb_plan_bounds_is_empty (&b))
    {
      view.origin_x = x + width / 2;
      view.origin_y = y + (height - legend_h) / 2;
    }
  else
    {
      view.origin_x = x + width / 2 - view.scale * (b.min_x + b.max_x) / 2;
      view.origin_y = y + (height - legend_h) / 2 + view.scale * (b.min_y + b.max_y) / 2;
    }
  trb_plan_draw (cr, scene, &view, &options);

  /* the legend strip: title and scale on the left, the key on the right */
  ly = y + height - legend_h;
  cairo_set_source_rgb (cr, 0, 0, 0);
  cairo_set_line_width (cr, 0.5);
  cairo_move_to (cr, x, ly);
  cairo_line_to (cr, x + width, ly);
  cairo_stroke (cr);

  heading = g_strdup_printf (_("FRAMING PLAN: %s"), floor->name != NULL ? floor->name : "");
  trb_render_text (cr, style, heading, 9.5, TRUE, x, ly + 4, 0, 0, NULL);
  {
    /* Translators: "Scale 1/8" = 1'-0"" */
    g_autofree char *s = g_strdup_printf (_("Scale %s"), scale->label);
    double sw = trb_render_text (cr, style, s, 7, FALSE, x, ly + 17, 0, 0, NULL);

    trb_plan_draw_scale_bar (cr, &view, style, trb_plan_scene_get_units (scene), x + sw + 14,
                             ly + 26);
  }
  if (scale_note != NULL)
    {
      cairo_set_source_rgb (cr, 0.6, 0.1, 0.1);
      trb_render_text (cr, style, scale_note, 6, FALSE, x, ly + 28, 0, 0, NULL);
      cairo_set_source_rgb (cr, 0, 0, 0);
    }

  lx = x + width * 0.42;
  trb_render_status_color (style, TRB_RENDER_STATUS_OK, &c);
  /* Translators: the plan's legend: what the colour of a member means (utilization ratio) */
  lx = legend_entry (cr, style, &c, 0, _("ratio below 0.90"), lx, ly + 7);
  trb_render_status_color (style, TRB_RENDER_STATUS_NEAR, &c);
  lx = legend_entry (cr, style, &c, 0, _("0.90 to 1.00"), lx, ly + 7);
  trb_render_status_color (style, TRB_RENDER_STATUS_FAIL, &c);
  lx = legend_entry (cr, style, &c, 1, _("above 1.00: FAILS (double line, flag)"), lx, ly + 7);
  lx = x + width * 0.42;
  trb_render_status_color (style, TRB_RENDER_STATUS_NONE, &c);
  lx = legend_entry (cr, style, &c, 2, _("unsupported, unstable or not designed"), lx, ly + 17);
  for (int k = 0; k < TRB_N_CASES; k++)
    {
      trb_render_case_color (style, k, &c);
      lx = legend_entry (cr, style, &c, 3, trb_load_case_name (k), lx, ly + 17);
    }
  cairo_set_source_rgb (cr, 0, 0, 0);
  trb_render_text_wrapped (cr, style,
                           _("Mark and section above each member, utilization ratio below; "
                             "column loads per case, unfactored."),
                           6.2, FALSE, x + width * 0.42, ly + 22.5, width * 0.58);

  /* what the clouds ring, by mark */
  if (clouded != NULL && g_hash_table_size (clouded) > 0)
    {
      g_autoptr(GPtrArray) marks = g_ptr_array_new ();
      g_autoptr(GString) s = g_string_new (NULL);
      GHashTableIter it;
      gpointer key;

      g_hash_table_iter_init (&it, clouded);
      while (g_hash_table_iter_next (&it, &key, NULL))
        if (((const TrbMember *) key)->floor == floor)
          g_ptr_array_add (marks, key);
      g_ptr_array_sort (marks, cmp_marks);
      g_string_append_printf (s, _("Revision clouds, changed since %s:"),
                              clouds_since != NULL ? clouds_since : _("the previous version"));
      for (guint i = 0; i < marks->len; i++)
        g_string_append_printf (s, "%s %s", i > 0 ? "," : "",
                                ((const TrbMember *) g_ptr_array_index (marks, i))->id);
      if (marks->len == 0)
        g_string_append_printf (s, " %s", _("none on this floor"));
      trb_render_text_wrapped (cr, style, s->str, 6.2, TRUE, x, ly + 37, width);
    }
  cairo_restore (cr);
}

void
trb_sheet_draw_message (cairo_t              *cr,
                        const TrbRenderStyle *style,
                        const char           *heading,
                        const char           *text,
                        double                x,
                        double                y,
                        double                width,
                        double                height)
{
  double h;

  g_return_if_fail (cr != NULL && style != NULL);

  cairo_save (cr);
  cairo_set_source_rgb (cr, 0, 0, 0);
  trb_render_text (cr, style, heading, 11, TRUE, x, y, 0, 0, &h);
  trb_render_text_wrapped (cr, style, text, 8, FALSE, x, y + h + 6, width * 0.8);
  cairo_restore (cr);
}

/* ---- the member sheet --------------------------------------------------------------------- */

const char *
trb_sheet_status_text (TrbStatus status)
{
  /* the words of the CLI's table, and the same translations */
  switch (status)
    {
    case TRB_STATUS_PASS:
      return _("passes");
    case TRB_STATUS_FAIL:
      return _("FAILS");
    case TRB_STATUS_UNSTABLE:
      return _("UNSTABLE");
    case TRB_STATUS_UNSUPPORTED:
      return _("UNSUPPORTED");
    case TRB_STATUS_NOT_DESIGNED:
      return _("not designed");
    case TRB_STATUS_ERROR:
    default:
      return _("ERROR");
    }
}

char *
trb_sheet_format_ratio (double ratio)
{
  /* as the CLI's table: three decimals */
  return isnan (ratio) ? g_strdup ("-") : g_strdup_printf ("%.3f", ratio);
}

static char *
fmt (double        v,
     TrbDimension  dim,
     TrbUnitSystem u)
{
  if (!isfinite (v))
    return g_strdup ("-");
  return trb_units_format (v, dim, u);
}

/* Check values as the CLI's table writes them: lengths (deflections) in inches or mm. */
static char *
fmt_check (double        v,
           TrbDimension  dim,
           TrbUnitSystem u)
{
  if (!isfinite (v))
    return g_strdup ("-");
  if (dim == TRB_DIM_LENGTH)
    return trb_units_format_small_length (v, u);
  return trb_units_format (v, dim, u);
}

static char *
fmt_small (double        v,
           TrbUnitSystem u)
{
  if (!isfinite (v))
    return g_strdup ("-");
  return trb_units_format_small_length (v, u);
}

static const char *
method_text (TrbMethod method)
{
  switch (method)
    {
    case TRB_METHOD_ASD:
      return "ASD";
    case TRB_METHOD_LRFD:
      return "LRFD";
    case TRB_METHOD_ALLOWABLE:
    default:
      return _("allowable stress");
    }
}

/* A name from core (a check's, a set of combinations'), in the reader's language when the
 * catalog has it; the template has the names from trb-cli.c. Never "", whose translation is
 * the catalog's header. */
static const char *
core_text (const char *s)
{
  return s != NULL && s[0] != '\0' ? _(s) : s;
}

/* The file's word for a support (pin, roller, fixed), translated by the catalog; the template
 * has them from trb-cli.c. */
static const char *
support_text (TrbSupportType type)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "support", trb_support_type_name (type));
}

static const TrbSupport *
result_supports (const TrbMemberResult *r,
                 guint                 *n)
{
  if (r->beam != NULL)
    return trb_beam_get_supports (r->beam, n);
  *n = 0;
  return NULL;
}

static char *
supports_text (const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  GString *s = g_string_new (NULL);
  const TrbSupport *sup;
  guint n;

  sup = result_supports (r, &n);
  if (sup != NULL)
    for (guint i = 0; i < n; i++)
      {
        g_autofree char *x = fmt (sup[i].x, TRB_DIM_LENGTH, r->units);

        g_string_append (s, i > 0 ? "; " : "");
        /* Translators: "pin at 0'-0"": a support and where it is */
        g_string_append_printf (s, _("%s at %s"), support_text (sup[i].type), x);
      }
  else
    for (guint i = 0; m->supports != NULL && i < m->supports->len; i++)
      {
        const TrbMemberSupport *ms = &g_array_index (m->supports, TrbMemberSupport, i);
        g_autofree char *x = fmt (ms->support.x, TRB_DIM_LENGTH, r->units);

        g_string_append (s, i > 0 ? "; " : "");
        g_string_append_printf (s, _("%s at %s"), support_text (ms->support.type), x);
      }
  if (s->len == 0)
    g_string_append (s, _("none"));
  return g_string_free (s, FALSE);
}

/* What a floor member's supports rest on: "C1 at 0'-0"; G2 at 10'-0"". */
static char *
bearings_text (const TrbMemberResult *r)
{
  GString *s = g_string_new (NULL);

  for (guint i = 0; r->bearings != NULL && i < r->bearings->len; i++)
    {
      const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, i);
      g_autofree char *x = fmt (b->x, TRB_DIM_LENGTH, r->units);

      g_string_append (s, i > 0 ? "; " : "");
      g_string_append_printf (s, _("%s at %s"),
                              b->own ? _("own support") : b->id != NULL ? b->id : "?", x);
    }
  if (s->len == 0)
    g_string_append (s, _("nothing"));
  return g_string_free (s, FALSE);
}

static char *
bracing_text (const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  g_autoptr(GString) at = g_string_new (NULL);

  if (m->bracing == TRB_BRACING_CONTINUOUS && (m->braces == NULL || m->braces->len == 0))
    return g_strdup (_("continuous (deck or sheathing)"));
  for (guint i = 0; m->braces != NULL && i < m->braces->len; i++)
    {
      g_autofree char *x = fmt (g_array_index (m->braces, TrbMemberBrace, i).x, TRB_DIM_LENGTH,
                                r->units);

      g_string_append_printf (at, "%s%s", i == 0 ? "" : ", ", x);
    }
  /* Translators: where a member is braced against lateral-torsional buckling; %s is a list
   * of places along it */
  if (m->bracing == TRB_BRACING_CONTINUOUS)
    return g_strdup_printf (_("continuous; also at %s"), at->str);
  if (at->len > 0)
    return g_strdup_printf (_("at the supports and %s"), at->str);
  return g_strdup (_("at the supports"));
}

static char *
limit_text (double n)
{
  if (isnan (n) || n <= 0)
    return g_strdup (_("none"));
  return g_strdup_printf ("L/%.0f", n);
}

static const TrbSection *
lookup_section (const TrbProject *project,
                const char       *designation)
{
  const TrbSection *s = NULL;

  if (designation == NULL || designation[0] == '\0')
    return NULL;
  if (project->sections != NULL)
    s = trb_catalog_lookup (project->sections, designation);
  if (s == NULL)
    s = trb_catalog_lookup (trb_catalog_get_default (), designation);
  return s;
}

static void
kv_row (TrbFlow        *flow,
        const char     *k1,
        const char     *v1,
        const char     *k2,
        const char     *v2)
{
  const char *cells[] = { k1, v1, k2, v2 };

  trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
}

typedef struct
{
  const TrbMemberResult *result;
  TrbDiagramKind         kind;     /* the stack when kind is LOADING and stack is set */
  gboolean               stack;
} DiagramBlock;

static void
draw_diagram_block (cairo_t              *cr,
                    const TrbRenderStyle *style,
                    double                x,
                    double                y,
                    double                width,
                    double                height,
                    gpointer              data)
{
  DiagramBlock *b = data;
  TrbDiagramSource source = { TRB_DIAGRAM_SOURCE_ENVELOPE, 0 };

  if (b->stack)
    trb_diagram_draw_stack (cr, b->result, &source, style, x, y, width, height);
  else
    trb_diagram_draw (cr, b->result, b->kind, &source, style, x, y, width, height);
}

static void
extreme_row (TrbFlow       *flow,
             const char    *what,
             const char    *value,
             double         x,
             const char    *by,
             TrbUnitSystem  u)
{
  g_autofree char *xs = fmt (x, TRB_DIM_LENGTH, u);
  const char *cells[] = { what, value, xs, by != NULL && by[0] != '\0' ? by : "-" };

  trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
}

static void
member_extremes (TrbFlow               *flow,
                 const TrbMemberResult *r)
{
  const char *titles[] = { _("Quantity"), _("Value"), C_("position", "At"),
                           _("Governing combination") };
  static const double widths[] = { 0.22, 0.16, 0.14, 0.48 };
  TrbUnitSystem u = r->units;
  const TrbEnvelope *env = &r->strength.envelope;

  trb_member_result_complete (r);
  trb_flow_heading (flow, _("Extremes"));
  trb_flow_table_begin (flow, 4, titles, widths, "lrrl", -1);
  if (!env->empty)
    {
      g_autofree char *vmax = fmt (env->ext.V_max, TRB_DIM_FORCE, u);
      g_autofree char *vmin = fmt (env->ext.V_min, TRB_DIM_FORCE, u);
      g_autofree char *mmax = fmt (env->ext.M_max, TRB_DIM_MOMENT, u);
      g_autofree char *mmin = fmt (env->ext.M_min, TRB_DIM_MOMENT, u);

      extreme_row (flow, _("Shear max"), vmax, env->ext.V_max_x, env->V_max_by, u);
      extreme_row (flow, _("Shear min"), vmin, env->ext.V_min_x, env->V_min_by, u);
      extreme_row (flow, _("Moment max (+)"), mmax, env->ext.M_max_x, env->M_max_by, u);
      extreme_row (flow, _("Moment min (-)"), mmin, env->ext.M_min_x, env->M_min_by, u);
    }
  for (int k = 0; k < 2; k++)
    {
      const TrbEnvelope *d = k == 0 ? &r->live.envelope : &r->total.envelope;
      g_autofree char *dd = NULL;
      g_autofree char *du = NULL;

      if (d->empty)
        continue;
      dd = fmt_small (d->ext.defl_down, u);
      extreme_row (flow, k == 0 ? _("Live deflection down") : _("Total deflection down"), dd,
                   d->ext.defl_down_x, d->ext.defl_down > 1e-9 ? d->defl_down_by : "", u);
      /* below a nanometre is rounding, not a movement worth a line (as the CLI) */
      if (d->ext.defl_up > 1e-9)
        {
          du = fmt_small (d->ext.defl_up, u);
          extreme_row (flow, k == 0 ? _("Live deflection up") : _("Total deflection up"), du,
                       d->ext.defl_up_x, d->defl_up_by, u);
        }
    }
  trb_flow_table_end (flow);
}

static void
member_checks (TrbFlow               *flow,
               const TrbMemberResult *r)
{
  const char *titles[] = { _("Check"), _("Clause"), _("Demand"), _("Capacity"), _("Ratio"),
                           C_("position", "At"), _("Governing combination") };
  static const double widths[] = { 0.14, 0.23, 0.11, 0.12, 0.07, 0.08, 0.25 };
  TrbUnitSystem u = r->units;

  trb_flow_heading (flow, _("Checks"));
  if (r->checks->len == 0)
    {
      trb_flow_paragraph (flow, _("No check was made: the member was not designed."), 1);
      return;
    }
  trb_flow_table_begin (flow, 7, titles, widths, "llrrrrl", 4);
  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, i);

      if (isnan (ck->ratio))
        {
          /* a check's name from core, translated by the catalog (trb-cli.c lists them) */
          const char *cells[] = { core_text (ck->name), ck->clause, "-", "-", "-", "-",
                                  _("not checked") };

          trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_NONE);
        }
      else
        {
          g_autofree char *d = fmt_check (ck->demand, ck->dimension, u);
          g_autofree char *c = fmt_check (ck->capacity, ck->dimension, u);
          g_autofree char *ratio = trb_sheet_format_ratio (ck->ratio);
          g_autofree char *x = fmt (ck->x, TRB_DIM_LENGTH, u);
          const char *cells[] = { core_text (ck->name), ck->clause, d, c, ratio, x,
                                  ck->combination };

          trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN,
                              trb_render_status_from (ck->ratio > 1 ? TRB_STATUS_FAIL
                                                                    : TRB_STATUS_PASS,
                                                      ck->ratio));
        }
      if (ck->detail[0] != '\0')
        trb_flow_table_note (flow, ck->detail);
    }
  trb_flow_table_end (flow);
}

static void
member_reactions (TrbFlow               *flow,
                  const TrbMemberResult *r)
{
  TrbUnitSystem u = r->units;
  const TrbSupport *sup;
  guint n;
  g_autoptr(GPtrArray) titles = g_ptr_array_new_with_free_func (g_free);
  g_autofree double *widths = NULL;
  g_autofree char *align = NULL;
  gboolean fixed = FALSE;

  sup = result_supports (r, &n);
  if (sup == NULL || n == 0)
    return;
  for (guint i = 0; i < n; i++)
    fixed |= sup[i].type == TRB_SUPPORT_FIXED;

  trb_flow_heading (flow, fixed ? _("Reactions, up + (moments counter-clockwise +)")
                                : _("Reactions, up +"));
  g_ptr_array_add (titles, g_strdup (_("Case")));
  widths = g_new0 (double, n + 1);
  align = g_strnfill (n + 1, 'r');
  align[0] = 'l';
  widths[0] = 0.22;
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *x = fmt (sup[i].x, TRB_DIM_LENGTH, u);

      g_ptr_array_add (titles, g_strdup_printf (_("%s at %s"), support_text (sup[i].type), x));
      widths[i + 1] = 0.78 / MAX (n, 3);
    }
  /* with few supports the columns stay narrow; the last takes the rest */
  if (n < 3)
    widths[n] += 0.78 - 0.78 / 3 * n;
  g_ptr_array_add (titles, NULL);
  trb_flow_table_begin (flow, n + 1, (const char *const *) titles->pdata, widths, align, -1);

  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      const TrbReaction *re;
      guint nr;
      g_autoptr(GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
      g_autoptr(GPtrArray) moments = g_ptr_array_new_with_free_func (g_free);

      if (r->cases[c] == NULL)
        continue;
      re = trb_beam_result_get_reactions (r->cases[c], &nr);
      /* Translators: "D (unfactored)": a load case; keep its symbol */
      g_ptr_array_add (cells, g_strdup_printf (_("%s (unfactored)"), trb_load_case_name (c)));
      g_ptr_array_add (moments, g_strdup ("  M"));
      for (guint i = 0; i < n; i++)
        {
          g_ptr_array_add (cells, i < nr ? fmt (re[i].force, TRB_DIM_FORCE, u) : g_strdup (""));
          g_ptr_array_add (moments, i < nr && sup[i].type == TRB_SUPPORT_FIXED
                                    ? fmt (re[i].moment, TRB_DIM_MOMENT, u) : g_strdup (""));
        }
      g_ptr_array_add (cells, NULL);
      g_ptr_array_add (moments, NULL);
      trb_flow_table_row (flow, (const char *const *) cells->pdata, TRB_FLOW_ROW_PLAIN,
                          TRB_RENDER_STATUS_OK);
      if (fixed)
        trb_flow_table_row (flow, (const char *const *) moments->pdata, TRB_FLOW_ROW_MUTED,
                            TRB_RENDER_STATUS_OK);
    }

  /* the range over the strength combinations: what the support must carry */
  if (!r->strength.envelope.empty && r->strength.envelope.reactions != NULL)
    for (int k = 0; k < 2; k++)
      {
        g_autoptr(GPtrArray) cells = g_ptr_array_new_with_free_func (g_free);
        const GArray *rr = r->strength.envelope.reactions;

        /* Translators: the largest and smallest reaction over the strength combinations,
         * "max, ASD" */
        g_ptr_array_add (cells, g_strdup_printf (k == 0 ? _("max, %s") : _("min, %s"),
                                                 method_text (r->method)));
        for (guint i = 0; i < n; i++)
          {
            const TrbReactionRange *q = i < rr->len ? &g_array_index (rr, TrbReactionRange, i)
                                                    : NULL;

            g_ptr_array_add (cells, q != NULL ? fmt (k == 0 ? q->force_max : q->force_min,
                                                     TRB_DIM_FORCE, u)
                                              : g_strdup (""));
          }
        g_ptr_array_add (cells, NULL);
        trb_flow_table_row (flow, (const char *const *) cells->pdata, TRB_FLOW_ROW_BOLD,
                            TRB_RENDER_STATUS_OK);
      }
  trb_flow_table_end (flow);
}

static void
prop_row (TrbFlow    *flow,
          GPtrArray  *pending)
{
  /* four name-value pairs a row */
  while (pending->len > 0)
    {
      const char *cells[8] = { "", "", "", "", "", "", "", "" };

      for (guint i = 0; i < 8 && i < pending->len; i++)
        cells[i] = g_ptr_array_index (pending, i);
      trb_flow_table_row (flow, cells, TRB_FLOW_ROW_PLAIN, TRB_RENDER_STATUS_OK);
      g_ptr_array_remove_range (pending, 0, MIN (8, pending->len));
    }
}

static void
add_prop (GPtrArray  *pending,
          const char *name,
          char       *value)
{
  g_ptr_array_add (pending, g_strdup (name));
  g_ptr_array_add (pending, value);
}

static void
member_section_properties (TrbFlow               *flow,
                           const TrbProject      *project,
                           const TrbMemberResult *r)
{
  const char *titles[] = { _("Property"), _("Value"), _("Property"), _("Value"), _("Property"),
                           _("Value"), _("Property"), _("Value") };
  static const double widths[] = { 0.12, 0.13, 0.12, 0.13, 0.12, 0.13, 0.12, 0.13 };
  const TrbMember *m = r->member;
  TrbUnitSystem u = r->units;
  const char *designation = r->section[0] != '\0' ? r->section : m->section;
  const TrbSection *s = trb_member_is_custom (m) ? NULL : lookup_section (project, designation);
  g_autoptr(GPtrArray) pending = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *heading = g_strdup_printf (_("Section properties: %s"), designation);

  trb_flow_heading (flow, heading);
  trb_flow_table_begin (flow, 8, titles, widths, "lrlrlrlr", -1);
  if (s != NULL)
    {
      gboolean rect = s->kind == TRB_SHAPE_SAWN || s->kind == TRB_SHAPE_GLULAM;

      add_prop (pending, "d", fmt_small (s->d, u));
      if (rect)
        {
          add_prop (pending, "b", fmt_small (s->b, u));
          add_prop (pending, _("plies"), g_strdup_printf ("%d", MAX (s->plies, 1)));
        }
      else
        {
          add_prop (pending, "bf", fmt_small (s->bf, u));
          add_prop (pending, "tw", fmt_small (s->tw, u));
          add_prop (pending, "tf", fmt_small (s->tf, u));
        }
      add_prop (pending, "A", fmt (s->A, TRB_DIM_AREA, u));
      add_prop (pending, "Ix", fmt (s->Ix, TRB_DIM_INERTIA, u));
      add_prop (pending, "Sx", fmt (s->Sx, TRB_DIM_SECTION_MODULUS, u));
      if (!rect)
        {
          add_prop (pending, "Zx", fmt (s->Zx, TRB_DIM_SECTION_MODULUS, u));
          add_prop (pending, "Iy", fmt (s->Iy, TRB_DIM_INERTIA, u));
          add_prop (pending, "ry", fmt_small (s->ry, u));
          add_prop (pending, "J", fmt (s->J, TRB_DIM_INERTIA, u));
        }
      add_prop (pending, _("weight"), fmt (s->weight, TRB_DIM_WEIGHT_PER_LENGTH, u));
    }
  else
    {
      add_prop (pending, "d", fmt_small (m->d, u));
      add_prop (pending, "tw", fmt_small (m->tw, u));
      add_prop (pending, "A", fmt (m->A, TRB_DIM_AREA, u));
      add_prop (pending, "I", fmt (m->I, TRB_DIM_INERTIA, u));
      add_prop (pending, "S", fmt (m->S, TRB_DIM_SECTION_MODULUS, u));
      add_prop (pending, _("weight"), fmt (m->weight, TRB_DIM_WEIGHT_PER_LENGTH, u));
    }
  if (r->analysed)
    {
      /* Translators: the modulus of elasticity E and moment of inertia I the analysis used */
      add_prop (pending, _("E used"), fmt (r->E, TRB_DIM_STRESS, u));
      add_prop (pending, _("I used"), fmt (r->I, TRB_DIM_INERTIA, u));
    }
  prop_row (flow, pending);
  trb_flow_table_end (flow);
}

static void
member_shortlist (TrbFlow               *flow,
                  const TrbMemberResult *r)
{
  const char *titles[] = { _("Section"), _("Weight"), _("Ratio"), _("Governing check") };
  static const double widths[] = { 0.25, 0.2, 0.15, 0.4 };

  if (r->shortlist == NULL || r->shortlist->len == 0)
    return;
  trb_flow_heading (flow, _("Passing sections, lightest first"));
  trb_flow_table_begin (flow, 4, titles, widths, "lrrl", 2);
  for (guint i = 0; i < r->shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, i);
      g_autofree char *w = fmt (e->weight, TRB_DIM_WEIGHT_PER_LENGTH, r->units);
      g_autofree char *ratio = trb_sheet_format_ratio (e->ratio);
      const char *cells[] = { e->section, w, ratio, core_text (e->governing) };

      trb_flow_table_row (flow, cells,
                          g_strcmp0 (e->section, r->section) == 0 ? TRB_FLOW_ROW_BOLD
                                                                   : TRB_FLOW_ROW_PLAIN,
                          trb_render_status_from (TRB_STATUS_PASS, e->ratio));
    }
  trb_flow_table_end (flow);
}

void
trb_sheet_member_flow (TrbFlow               *flow,
                       const TrbProject      *project,
                       const TrbMemberResult *r)
{
  static const char *kv_titles[] = { "", "", "", "" };
  static const double kv_widths[] = { 0.13, 0.37, 0.13, 0.37 };
  const TrbMember *m;
  TrbUnitSystem u;
  g_autofree char *heading = NULL;
  g_autofree char *section = NULL;
  g_autofree char *length = NULL;
  g_autofree char *supports = NULL;
  g_autofree char *bracing = NULL;
  g_autofree char *material = NULL;
  g_autofree char *ratio = NULL;
  g_autofree char *limits = NULL;
  g_autofree char *sw = NULL;
  g_autofree char *method = NULL;

  g_return_if_fail (flow != NULL && project != NULL && r != NULL && r->member != NULL);

  m = r->member;
  u = r->units;

  heading = g_strdup_printf (_("Member %s"), m->id);
  trb_flow_heading (flow, heading);

  if (trb_member_is_auto (m) && r->section[0] != '\0')
    section = g_strdup_printf (_("%s (sized from \"auto\")"), r->section);
  else
    section = g_strdup (m->section != NULL ? m->section : "-");
  length = fmt (m->length, TRB_DIM_LENGTH, u);
  supports = supports_text (r);
  bracing = bracing_text (r);
  if (m->material == TRB_MATERIAL_WOOD && m->species != NULL)
    {
      GString *s = g_string_new (NULL);

      /* Translators: "wood, SPF No. 2": the species and grade stay as the file names them */
      g_string_append_printf (s, _("wood, %s %s"), m->species,
                              m->grade != NULL ? m->grade : "");
      /* Translators: the wood is used where it gets wet (NDS 2018 wet service factor C_M) */
      if (m->wet_service)
        g_string_append_printf (s, ", %s", _("wet service"));
      /* Translators: a repetitive member (NDS 2018 4.3.9, factor C_r) */
      if (m->repetitive)
        g_string_append_printf (s, ", %s", _("repetitive"));
      material = g_string_free (s, FALSE);
    }
  else
    material = g_strdup (g_dpgettext2 (GETTEXT_PACKAGE, "material",
                                       trb_material_name (m->material)));
  ratio = trb_sheet_format_ratio (r->ratio);
  {
    g_autofree char *ll = limit_text (trb_member_get_deflection_live (m, &project->settings));
    g_autofree char *tl = limit_text (trb_member_get_deflection_total (m, &project->settings));

    /* Translators: deflection limits, "live L/360, total L/240" */
    limits = g_strdup_printf (_("live %s, total %s"), ll, tl);
  }
  if (r->analysed && r->self_weight > 0)
    {
      /* trb_units_format() gives a new string */
      g_autofree char *w = trb_units_format (r->self_weight, TRB_DIM_WEIGHT_PER_LENGTH, u);

      /* Translators: the self-weight is in the dead load case D; keep D */
      sw = g_strdup_printf (_("%s, in case D"), w);
    }
  else
    sw = g_strdup (_("not included"));
  method = g_strdup_printf ("%s: %s", method_text (r->method),
                            core_text (trb_combo_set_title (r->strength.set)));

  trb_flow_table_begin (flow, 4, kv_titles, kv_widths, "llll", -1);
  kv_row (flow, _("Material"), material, _("Section"), section);
  kv_row (flow, _("Length"), length, _("Supports"), supports);
  kv_row (flow, _("Method"), method, _("Bracing"), bracing);
  kv_row (flow, _("Deflection limits"), limits, _("Self-weight"), sw);
  if (m->floor != NULL)
    {
      g_autofree char *where = g_strdup_printf ("%s, %s", m->floor->name != NULL
                                                           ? m->floor->name : "-",
                                                g_dpgettext2 (GETTEXT_PACKAGE, "role",
                                                              trb_role_name (m->role)));

      g_autofree char *rests = bearings_text (r);

      kv_row (flow, _("Floor"), where, _("Rests on"), rests);
    }
  {
    g_autofree char *st = g_strdup_printf ("%s%s%s", trb_sheet_status_text (r->status),
                                           r->message != NULL ? ": " : "",
                                           r->message != NULL ? r->message : "");
    g_autofree char *gov = g_strdup_printf ("%s%s%s", ratio, r->governing[0] != '\0' ? ", " : "",
                                            r->governing[0] != '\0' ? _(r->governing) : "");
    const char *cells[] = { _("Status"), st, _("Ratio"), gov };

    trb_flow_table_row (flow, cells, TRB_FLOW_ROW_BOLD, trb_render_status_of (r));
  }
  trb_flow_table_end (flow);
  if (r->reduction.applies)
    {
      /* tributary areas read in square feet or metres, not the section tables' in^2 */
      g_autofree char *area = u == TRB_UNIT_SYSTEM_US
                              ? g_strdup_printf ("%.0f ft^2", r->reduction.area /
                                                              (TRB_FT * TRB_FT))
                              : g_strdup_printf ("%.1f m^2", r->reduction.area);
      /* Translators: keep A_T, K_LL and L/Lo, the symbols of ASCE 7-16 §4.7 */
      g_autofree char *t =
        g_strdup_printf (_("Live load reduction (ASCE 7-16 §4.7): A_T = %s, K_LL = %g, "
                           "L/Lo = %.3f on the reducible live load (%s)."), area,
                         r->reduction.k_ll, r->reduction.factor,
                         trb_live_rule_describe (r->reduction.rule));

      trb_flow_paragraph (flow, t, 0.95);
    }
  for (guint i = 0; r->notes != NULL && i < r->notes->len; i++)
    {
      g_autofree char *t = g_strdup_printf (_("Note: %s"),
                                            (const char *) g_ptr_array_index (r->notes, i));

      trb_flow_paragraph (flow, t, 0.95);
    }

  /* the first page: the loading and the diagrams, large enough to read the labels */
  trb_flow_space (flow, -0.5);
  {
    DiagramBlock *b = g_new0 (DiagramBlock, 1);

    b->result = r;
    b->stack = TRUE;
    /* the rest of the page: a short summary leaves the diagrams more room */
    trb_flow_block_fill (flow, 360, draw_diagram_block, b, g_free);
  }

  /* the second: the numbers */
  trb_flow_page_break (flow);
  {
    g_autofree char *h2 = g_strdup_printf (_("Member %s, continued: checks, extremes, "
                                             "reactions"), m->id);

    trb_flow_heading (flow, h2);
  }
  member_checks (flow, r);
  if (r->analysed)
    {
      member_extremes (flow, r);
      member_reactions (flow, r);
    }
  member_section_properties (flow, project, r);
  member_shortlist (flow, r);
}
