/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-diagram.h"

#include <glib/gi18n-lib.h>
#include <math.h>
#include <string.h>

#include "trb-combos.h"
#include "trb-units.h"

/* The plot's side margins, as fractions of the diagram's width: room for the support marks and
 * the end labels. Fractions, not font sizes, so that trb_diagram_position_at() needs no
 * style. */
#define MARGIN_LEFT  0.07
#define MARGIN_RIGHT 0.07

/* Evenly spaced samples between break points: enough for a smooth parabola or cubic at print
 * resolution; the jumps themselves are drawn exactly at the breaks. */
#define N_SAMPLES 240

char *
trb_diagram_source_describe (const TrbMemberResult  *result,
                             const TrbDiagramSource *source)
{
  g_return_val_if_fail (result != NULL && source != NULL, NULL);

  switch (source->kind)
    {
    case TRB_DIAGRAM_SOURCE_COMBINATION:
      if (result->analysed && source->index < result->strength.entries->len)
        return g_strdup (g_array_index (result->strength.entries, TrbComboResult,
                                        source->index).name);
      return g_strdup (_("No such combination"));
    case TRB_DIAGRAM_SOURCE_CASE:
      /* Translators: "Load case L, unfactored"; keep the case's symbol */
      return g_strdup_printf (_("Load case %s, unfactored"),
                              source->index < TRB_N_CASES ? trb_load_case_name (source->index)
                                                          : "?");
    case TRB_DIAGRAM_SOURCE_ENVELOPE:
    default:
      /* Translators: "Envelope of the ASD combinations, ASCE 7-16 §2.4.1" */
      /* the set's title from core, translated by the catalog (trb-cli.c lists them) */
      return g_strdup_printf (_("Envelope of the %s"),
                              _(trb_combo_set_title (result->strength.set)));
    }
}

double
trb_diagram_position_at (const TrbMemberResult *result,
                         double                 x,
                         double                 width,
                         double                 device_x)
{
  double L, x0, w;

  g_return_val_if_fail (result != NULL && result->member != NULL, 0);

  L = result->member->length;
  x0 = x + MARGIN_LEFT * width;
  w = width * (1 - MARGIN_LEFT - MARGIN_RIGHT);
  if (!(w > 0) || !(L > 0))
    return 0;
  return CLAMP ((device_x - x0) / w * L, 0.0, L);
}

/* ---- the curves --------------------------------------------------------------------------- */

typedef struct
{
  double x;       /* m */
  double hi;      /* the value, or the envelope's upper bound */
  double lo;      /* the envelope's lower bound (= hi for one result) */
} Sample;

static double
pick (const TrbBeamValues *v,
      TrbDiagramKind       kind)
{
  switch (kind)
    {
    case TRB_DIAGRAM_SHEAR:
      return v->V;
    case TRB_DIAGRAM_MOMENT:
      return v->M;
    case TRB_DIAGRAM_DEFLECTION:
    default:
      return v->defl;
    }
}

static int
cmp_double (gconstpointer a,
            gconstpointer b)
{
  double x = *(const double *) a, y = *(const double *) b;

  return (x > y) - (x < y);
}

/* The results a diagram is drawn from: one, or every entry of a set for an envelope. */
static GPtrArray *
source_results (const TrbMemberResult  *r,
                TrbDiagramKind          kind,
                const TrbDiagramSource *source)
{
  GPtrArray *out = g_ptr_array_new ();

  switch (source->kind)
    {
    case TRB_DIAGRAM_SOURCE_COMBINATION:
      if (source->index < r->strength.entries->len)
        g_ptr_array_add (out, g_array_index (r->strength.entries, TrbComboResult,
                                             source->index).result);
      break;
    case TRB_DIAGRAM_SOURCE_CASE:
      if (source->index < TRB_N_CASES && r->cases[source->index] != NULL)
        g_ptr_array_add (out, r->cases[source->index]);
      break;
    case TRB_DIAGRAM_SOURCE_ENVELOPE:
    default:
      {
        /* deflection is a service-load matter: the total-load set */
        const TrbComboSetResult *set = kind == TRB_DIAGRAM_DEFLECTION ? &r->total : &r->strength;

        for (guint i = 0; set->entries != NULL && i < set->entries->len; i++)
          g_ptr_array_add (out, g_array_index (set->entries, TrbComboResult, i).result);
      }
      break;
    }
  return out;
}

/* Samples along the member: an even grid, and both sides of every break so that jumps are
 * vertical and exact. */
static GArray *
sample_curve (GPtrArray      *results,
              TrbDiagramKind  kind,
              double          L)
{
  g_autoptr(GArray) xs = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GHashTable) breaks = g_hash_table_new (g_int64_hash, g_int64_equal);
  g_autoptr(GArray) keys = g_array_new (FALSE, FALSE, sizeof (gint64));
  GArray *out = g_array_new (FALSE, FALSE, sizeof (Sample));

  for (guint i = 0; i <= N_SAMPLES; i++)
    {
      double x = L * i / N_SAMPLES;

      g_array_append_val (xs, x);
    }
  for (guint k = 0; k < results->len; k++)
    {
      guint nb;
      const double *b = trb_beam_result_get_breaks (g_ptr_array_index (results, k), &nb);

      for (guint i = 0; i < nb; i++)
        g_array_append_val (xs, b[i]);
    }
  g_array_sort (xs, cmp_double);

  /* the breaks, keyed by their bits, to know where to take both sides */
  for (guint k = 0; k < results->len; k++)
    {
      guint nb;
      const double *b = trb_beam_result_get_breaks (g_ptr_array_index (results, k), &nb);

      for (guint i = 0; i < nb; i++)
        {
          gint64 key;

          memcpy (&key, &b[i], sizeof key);
          g_array_append_val (keys, key);
        }
    }
  for (guint i = 0; i < keys->len; i++)
    g_hash_table_add (breaks, &g_array_index (keys, gint64, i));

  for (guint i = 0; i < xs->len; i++)
    {
      double x = g_array_index (xs, double, i);
      gint64 key;
      gboolean is_break;

      if (i > 0 && x == g_array_index (xs, double, i - 1))
        continue;
      memcpy (&key, &x, sizeof key);
      is_break = g_hash_table_contains (breaks, &key);

      for (int side = is_break ? 0 : 1; side < 2; side++)
        {
          Sample s = { x, -INFINITY, INFINITY };

          for (guint k = 0; k < results->len; k++)
            {
              TrbBeamValues v;
              double y;

              trb_beam_result_eval (g_ptr_array_index (results, k), x,
                                    side == 0 ? TRB_SIDE_LEFT : TRB_SIDE_RIGHT, &v);
              y = pick (&v, kind);
              s.hi = MAX (s.hi, y);
              s.lo = MIN (s.lo, y);
            }
          g_array_append_val (out, s);
        }
    }
  return out;
}

/* ---- layout ------------------------------------------------------------------------------- */

typedef struct
{
  cairo_t              *cr;
  const TrbRenderStyle *style;
  const TrbMemberResult *r;
  double                L;
  double                x0;       /* device x of member x = 0 */
  double                w;        /* device width of the member */
  double                fs;
  TrbRgba               ink;
  TrbRgba               paper;
} Frame;

static double
dev_x (const Frame *f,
       double       x)
{
  return f->x0 + (f->L > 0 ? x / f->L : 0) * f->w;
}

static void
frame_init (Frame                 *f,
            cairo_t               *cr,
            const TrbMemberResult *r,
            const TrbRenderStyle  *style,
            double                 x,
            double                 width)
{
  f->cr = cr;
  f->style = style;
  f->r = r;
  f->L = r->member->length;
  f->x0 = x + MARGIN_LEFT * width;
  f->w = width * (1 - MARGIN_LEFT - MARGIN_RIGHT);
  f->fs = style->font_size;
  trb_render_ink_color (style, &f->ink);
  trb_render_paper_color (style, &f->paper);
}

static void
darken (TrbRgba *c,
        double   k)
{
  c->r *= k;
  c->g *= k;
  c->b *= k;
}

/* ---- the loading sketch ------------------------------------------------------------------- */

static void
draw_support (Frame          *f,
              TrbSupportType  type,
              double          x,
              double          y,
              gboolean        at_left,
              gboolean        at_right)
{
  cairo_t *cr = f->cr;
  double s = f->fs * 0.9;

  trb_render_set_color (cr, &f->ink);
  cairo_set_line_width (cr, 0.7);
  if (type == TRB_SUPPORT_FIXED)
    {
      /* a wall: a bar across the member's end with hatching behind it */
      double dir = at_right ? 1 : -1;

      if (!at_left && !at_right)
        dir = -1;
      cairo_move_to (cr, x, y - 1.4 * s);
      cairo_line_to (cr, x, y + 1.4 * s);
      cairo_set_line_width (cr, 1.4);
      cairo_stroke (cr);
      cairo_set_line_width (cr, 0.6);
      for (double t = -1.4 * s; t < 1.4 * s; t += 0.45 * s)
        {
          cairo_move_to (cr, x, y + t + 0.45 * s);
          cairo_line_to (cr, x + dir * 0.45 * s, y + t);
        }
      cairo_stroke (cr);
      return;
    }
  /* a pin: a triangle on a ground line; a roller: a triangle on a circle */
  cairo_move_to (cr, x, y);
  cairo_line_to (cr, x + 0.6 * s, y + s);
  cairo_line_to (cr, x - 0.6 * s, y + s);
  cairo_close_path (cr);
  trb_render_set_color (cr, &f->paper);
  cairo_fill_preserve (cr);
  trb_render_set_color (cr, &f->ink);
  cairo_stroke (cr);
  if (type == TRB_SUPPORT_ROLLER)
    {
      cairo_new_sub_path (cr);
      cairo_arc (cr, x, y + s + 0.22 * s, 0.22 * s, 0, 2 * G_PI);
      cairo_stroke (cr);
      cairo_move_to (cr, x - 0.8 * s, y + s + 0.44 * s);
      cairo_line_to (cr, x + 0.8 * s, y + s + 0.44 * s);
    }
  else
    {
      cairo_move_to (cr, x - 0.8 * s, y + s);
      cairo_line_to (cr, x + 0.8 * s, y + s);
    }
  cairo_stroke (cr);
}

static void
arrow_down (cairo_t *cr,
            double   x,
            double   y_top,
            double   y_tip,
            double   head)
{
  double dir = y_tip > y_top ? 1 : -1;

  cairo_move_to (cr, x, y_top);
  cairo_line_to (cr, x, y_tip - dir * head);
  cairo_stroke (cr);
  cairo_move_to (cr, x, y_tip);
  cairo_line_to (cr, x - 0.4 * head, y_tip - dir * head);
  cairo_line_to (cr, x + 0.4 * head, y_tip - dir * head);
  cairo_close_path (cr);
  cairo_fill (cr);
}

/* The loads of one case on the member, without the self-weight (drawn apart). */
static GArray *
case_loads (const TrbMemberResult *r,
            TrbLoadCase            lcase)
{
  /* what was analysed when there is a record of it (a floor member's strip, plan loads and
   * the reactions handed down to it), else the member's own loads */
  const GArray *loads = r->loads != NULL ? r->loads : r->member->loads;
  GArray *out = g_array_new (FALSE, TRUE, sizeof (TrbLoad));

  double L = r->member->length;

  for (guint i = 0; loads != NULL && i < loads->len; i++)
    {
      const TrbMemberLoad *ml = &g_array_index (loads, TrbMemberLoad, i);
      const TrbLoad *ld = &ml->load;
      gboolean merged = FALSE;

      if (ml->lcase != lcase)
        continue;
      /* a load of nothing (a case a member above does not carry) draws nothing */
      if (ld->w1 == 0 && (ld->kind != TRB_LOAD_LINEAR || ld->w2 == 0))
        continue;
      /* point loads at one place (two joists from either side) read as their sum */
      if (ld->kind == TRB_LOAD_POINT)
        for (guint k = 0; k < out->len; k++)
          {
            TrbLoad *q = &g_array_index (out, TrbLoad, k);

            if (q->kind == TRB_LOAD_POINT && fabs (q->a - ld->a) <= 1e-9 * MAX (L, 1))
              {
                q->w1 += ld->w1;
                merged = TRUE;
                break;
              }
          }
      if (!merged)
        g_array_append_val (out, *ld);
    }
  return out;
}

static void
dimension_line (Frame      *f,
                double      xa,
                double      xb,
                double      y,
                const char *text)
{
  cairo_t *cr = f->cr;
  double a = dev_x (f, xa), b = dev_x (f, xb);
  double t = 0.35 * f->fs;

  trb_render_set_color (cr, &f->ink);
  cairo_set_line_width (cr, 0.5);
  cairo_move_to (cr, a, y);
  cairo_line_to (cr, b, y);
  /* the trade's slashes at the ends of a dimension */
  cairo_move_to (cr, a - t, y + t);
  cairo_line_to (cr, a + t, y - t);
  cairo_move_to (cr, b - t, y + t);
  cairo_line_to (cr, b + t, y - t);
  cairo_move_to (cr, a, y - t * 1.5);
  cairo_line_to (cr, a, y + t * 1.5);
  cairo_move_to (cr, b, y - t * 1.5);
  cairo_line_to (cr, b, y + t * 1.5);
  cairo_stroke (cr);
  trb_render_text (cr, f->style, text, f->fs * 0.9, FALSE, (a + b) / 2, y - 1, 0.5, 1.0, NULL);
}

static void
draw_loading (Frame  *f,
              double  y,
              double  height)
{
  cairo_t *cr = f->cr;
  const TrbMemberResult *r = f->r;
  const TrbMember *m = r->member;
  TrbUnitSystem u = r->units;
  int n_cases = 0;
  gboolean present[TRB_N_CASES] = { FALSE };
  GArray *loads[TRB_N_CASES] = { NULL };
  double wmax = 0, band, beam_y, top;
  const TrbSupport *sup = NULL;
  guint n_sup = 0;
  g_autoptr(GArray) sups = NULL;
  double fs = f->fs;
  int row;

  for (int c = 0; c < TRB_N_CASES; c++)
    {
      loads[c] = case_loads (r, c);
      present[c] = loads[c]->len > 0 || (c == TRB_CASE_D && r->self_weight > 0);
      if (present[c])
        n_cases++;
      for (guint i = 0; i < loads[c]->len; i++)
        {
          const TrbLoad *ld = &g_array_index (loads[c], TrbLoad, i);

          if (ld->kind == TRB_LOAD_UNIFORM)
            wmax = MAX (wmax, fabs (ld->w1));
          else if (ld->kind == TRB_LOAD_LINEAR)
            wmax = MAX (wmax, MAX (fabs (ld->w1), fabs (ld->w2)));
        }
      if (c == TRB_CASE_D)
        wmax = MAX (wmax, r->self_weight);
    }

  /* the reactions take the lower part: a line per case under each support */
  {
    int n_react = 0;

    for (int c = 0; c < TRB_N_CASES; c++)
      if (r->analysed && r->cases[c] != NULL)
        n_react++;
    beam_y = y + height - (n_react + 4.6) * fs * 1.15;
  }
  top = y + 1.4 * fs;
  band = n_cases > 0 ? (beam_y - top - 0.4 * fs) / n_cases : 0;

  /* the member */
  trb_render_set_color (cr, &f->ink);
  cairo_set_line_width (cr, 2.0);
  cairo_move_to (cr, dev_x (f, 0), beam_y);
  cairo_line_to (cr, dev_x (f, f->L), beam_y);
  cairo_stroke (cr);

  /* supports: the beam's when analysed (merged, sorted), else the file's */
  if (r->beam != NULL)
    sup = trb_beam_get_supports (r->beam, &n_sup);
  else if (r->supports != NULL)
    {
      sup = (const TrbSupport *) r->supports->data;
      n_sup = r->supports->len;
    }
  else
    {
      sups = g_array_new (FALSE, TRUE, sizeof (TrbSupport));
      for (guint i = 0; m->supports != NULL && i < m->supports->len; i++)
        g_array_append_val (sups, g_array_index (m->supports, TrbMemberSupport, i).support);
      sup = (const TrbSupport *) sups->data;
      n_sup = sups->len;
    }
  for (guint i = 0; i < n_sup; i++)
    draw_support (f, sup[i].type, dev_x (f, sup[i].x), beam_y, sup[i].x <= 1e-9,
                  sup[i].x >= f->L - 1e-9);

  /* spans and overhangs dimensioned under the supports */
  {
    double dy = beam_y + 2.3 * fs;
    double prev = 0;

    for (guint i = 0; i <= n_sup; i++)
      {
        double next = i < n_sup ? sup[i].x : f->L;

        if (next - prev > 1e-9)
          {
            g_autofree char *t = trb_units_format (next - prev, TRB_DIM_LENGTH, u);

            dimension_line (f, prev, next, dy, t);
          }
        prev = next;
      }
  }

  /* reactions per case under each support */
  if (r->analysed)
    {
      double ry = beam_y + 2.8 * fs;

      trb_render_set_color (cr, &f->ink);
      trb_render_text (cr, f->style, _("Reactions by case, up +"), fs * 0.85, TRUE,
                       dev_x (f, 0) - 0.5 * fs, ry, 0.0, 0.0, NULL);
      row = 0;
      for (int c = 0; c < TRB_N_CASES; c++)
        {
          const TrbReaction *re;
          guint nr;

          if (r->cases[c] == NULL)
            continue;
          row++;
          re = trb_beam_result_get_reactions (r->cases[c], &nr);
          trb_render_text (cr, f->style, trb_load_case_name (c), fs * 0.85, TRUE,
                           dev_x (f, 0) - 0.5 * fs, ry + row * fs * 1.15, 1.0, 0.0, NULL);
          for (guint i = 0; i < nr; i++)
            {
              g_autofree char *v = trb_units_format (re[i].force, TRB_DIM_FORCE, u);
              g_autofree char *t = NULL;
              double ax = (re[i].x <= 1e-9) ? 0.0 : (re[i].x >= f->L - 1e-9 ? 1.0 : 0.5);

              if (sup != NULL && i < n_sup && sup[i].type == TRB_SUPPORT_FIXED)
                {
                  g_autofree char *mo = trb_units_format (re[i].moment, TRB_DIM_MOMENT, u);

                  t = g_strdup_printf ("%s, M %s", v, mo);
                }
              else
                t = g_strdup (v);
              trb_render_text (cr, f->style, t, fs * 0.85, FALSE, dev_x (f, re[i].x),
                               ry + row * fs * 1.15, ax, 0.0, NULL);
            }
        }
    }

  /* loads, a band per case from the top */
  row = 0;
  for (int c = 0; c < TRB_N_CASES; c++)
    {
      double b0, b1, hmax;
      TrbRgba col;

      if (!present[c])
        continue;
      b0 = top + row * band;
      b1 = b0 + band;
      hmax = band * 0.55;
      row++;
      trb_render_case_color (f->style, c, &col);
      darken (&col, 0.8);
      trb_render_set_color (cr, &col);
      trb_render_text (cr, f->style, trb_load_case_name (c), fs, TRUE, dev_x (f, 0) - 0.6 * fs,
                       b1 - 0.2 * band, 1.0, 0.5, NULL);

      /* self-weight is part of D: drawn with the case's own loads */
      if (c == TRB_CASE_D && r->self_weight > 0)
        {
          TrbLoad sw = { TRB_LOAD_UNIFORM, 0, f->L, r->self_weight, r->self_weight };

          g_array_prepend_val (loads[c], sw);
        }

      /* Distributed loads stacked where they overlap, each at least a little high so that
       * a small one still shows: offset[i] is where load i starts above the member. */
      {
        guint nl = loads[c]->len;
        g_autofree double *h_of = g_new0 (double, MAX (nl, 1) * 2);
        g_autofree double *offset = g_new0 (double, MAX (nl, 1));
        double top_stack = 0, squeeze = 1;

        for (guint i = 0; i < nl; i++)
          {
            const TrbLoad *ld = &g_array_index (loads[c], TrbLoad, i);
            double w2;

            if (ld->kind != TRB_LOAD_UNIFORM && ld->kind != TRB_LOAD_LINEAR)
              continue;
            w2 = ld->kind == TRB_LOAD_LINEAR ? ld->w2 : ld->w1;
            h_of[2 * i] = MAX (wmax > 0 ? fabs (ld->w1) / wmax * hmax : 0, 0);
            h_of[2 * i + 1] = MAX (wmax > 0 ? fabs (w2) / wmax * hmax : 0, 0);
            if (MAX (h_of[2 * i], h_of[2 * i + 1]) < 0.5 * fs)
              {
                double k = 0.5 * fs / MAX (MAX (h_of[2 * i], h_of[2 * i + 1]), 1e-9);

                h_of[2 * i] = MIN (h_of[2 * i] * k, 0.5 * fs);
                h_of[2 * i + 1] = MIN (h_of[2 * i + 1] * k, 0.5 * fs);
              }
            for (guint j = 0; j < i; j++)
              {
                const TrbLoad *lj = &g_array_index (loads[c], TrbLoad, j);

                if ((lj->kind == TRB_LOAD_UNIFORM || lj->kind == TRB_LOAD_LINEAR) &&
                    lj->a < ld->b - 1e-9 && ld->a < lj->b - 1e-9)
                  offset[i] = MAX (offset[i], offset[j] + MAX (h_of[2 * j], h_of[2 * j + 1]) +
                                              1.1 * fs);
              }
            top_stack = MAX (top_stack, offset[i] + MAX (h_of[2 * i], h_of[2 * i + 1]));
          }
        /* a stack taller than the band is squeezed to fit */
        if (top_stack > band * 0.75)
          squeeze = band * 0.75 / top_stack;

      guint n_points = 0;
      double p_min = INFINITY, p_max = -INFINITY;

      for (guint i = 0; i < loads[c]->len; i++)
        if (g_array_index (loads[c], TrbLoad, i).kind == TRB_LOAD_POINT)
          {
            double p = g_array_index (loads[c], TrbLoad, i).w1;

            n_points++;
            p_min = MIN (p_min, p);
            p_max = MAX (p_max, p);
          }
      if (n_points > 8)
        {
          /* too many to label one by one (joists on a girder): their number and range */
          g_autofree char *a = trb_units_format (p_min, TRB_DIM_FORCE, u);
          g_autofree char *b = trb_units_format (p_max, TRB_DIM_FORCE, u);
          g_autofree char *t = g_strcmp0 (a, b) == 0
                               ? g_strdup_printf (ngettext ("%u point load of %s",
                                                            "%u point loads of %s", n_points),
                                                  n_points, a)
                               : g_strdup_printf (ngettext ("%u point load, %s to %s",
                                                            "%u point loads, %s to %s",
                                                            n_points),
                                                  n_points, a, b);

          trb_render_set_color (cr, &col);
          trb_render_text (cr, f->style, t, fs * 0.85, TRUE, dev_x (f, f->L), b0, 1.0, 1.0,
                           NULL);
        }

      for (guint i = 0; i < loads[c]->len; i++)
        {
          const TrbLoad *ld = &g_array_index (loads[c], TrbLoad, i);
          gboolean is_sw = c == TRB_CASE_D && r->self_weight > 0 && i == 0;
          double base = b1 - 0.1 * band - offset[i] * squeeze;

          trb_render_set_color (cr, &col);
          cairo_set_line_width (cr, 0.6);
          if (ld->kind == TRB_LOAD_UNIFORM || ld->kind == TRB_LOAD_LINEAR)
            {
              double w1 = ld->w1, w2 = ld->kind == TRB_LOAD_LINEAR ? ld->w2 : ld->w1;
              double h1 = h_of[2 * i] * squeeze;
              double h2 = h_of[2 * i + 1] * squeeze;
              double xa = dev_x (f, ld->a), xb = dev_x (f, ld->b);
              int n = MAX (2, (int) ((xb - xa) / (1.6 * fs)) + 1);
              g_autofree char *t1 = trb_units_format (w1, TRB_DIM_LINE_LOAD, u);
              g_autofree char *t2 = trb_units_format (w2, TRB_DIM_LINE_LOAD, u);
              g_autofree char *t = NULL;

              /* the load's outline, shaded, with arrows onto the member's line */
              cairo_move_to (cr, xa, base);
              cairo_line_to (cr, xa, base - h1);
              cairo_line_to (cr, xb, base - h2);
              cairo_line_to (cr, xb, base);
              cairo_close_path (cr);
              col.a = 0.15;
              trb_render_set_color (cr, &col);
              cairo_fill_preserve (cr);
              col.a = 1;
              trb_render_set_color (cr, &col);
              cairo_stroke (cr);
              for (int k = 0; k < n && xb - xa > 1e-6; k++)
                {
                  double t = (double) k / (n - 1);
                  double h = h1 + (h2 - h1) * t;

                  if (h > 0.25 * fs)
                    arrow_down (cr, xa + (xb - xa) * t, base - h, base, MIN (0.45 * fs, h * 0.5));
                }
              if (ld->kind == TRB_LOAD_LINEAR && fabs (w1 - w2) > 1e-9)
                /* Translators: a load varying along the member, "0.20 kip/ft to 0.60 kip/ft" */
                t = g_strdup_printf (_("%s to %s"), t1, t2);
              else if (is_sw)
                /* Translators: the member's own weight, "26.0 lb/ft self-weight" */
                t = g_strdup_printf (_("%s self-weight"), t1);
              else
                t = g_strdup (t1);
              /* a piece too short for its label (a strip cut by an opening) goes without */
              if (trb_render_text_width (cr, f->style, t, fs * 0.85, FALSE) < xb - xa + 2 * fs)
                trb_render_text (cr, f->style, t, fs * 0.85, FALSE, (xa + xb) / 2,
                                 base - MAX (h1, h2) - 1, 0.5, 1.0, NULL);
            }
          else if (ld->kind == TRB_LOAD_POINT)
            {
              double xp = dev_x (f, ld->a);
              g_autofree char *t = trb_units_format (ld->w1, TRB_DIM_FORCE, u);

              double bottom = b1 - 0.1 * band;

              cairo_set_line_width (cr, 1.0);
              if (ld->w1 >= 0)
                arrow_down (cr, xp, b0 + 0.15 * band, bottom, 0.6 * fs);
              else
                arrow_down (cr, xp, bottom, b0 + 0.15 * band, 0.6 * fs);
              /* a row of joists bearing on a girder: too many labels to read, so the
               * reader finds each in the table of loads instead */
              if (n_points <= 8)
                trb_render_text (cr, f->style, t, fs * 0.85, TRUE,
                                 xp > dev_x (f, f->L * 0.8) ? xp - 0.3 * fs : xp + 0.3 * fs,
                                 b0 + 0.15 * band, xp > dev_x (f, f->L * 0.8) ? 1.0 : 0.0, 0.0,
                                 NULL);
            }
          else
            {
              double xp = dev_x (f, ld->a), rr = 0.3 * band;
              g_autofree char *t = trb_units_format (ld->w1, TRB_DIM_MOMENT, u);

              /* a curved arrow, clockwise for a positive (clockwise) moment */
              cairo_new_sub_path (cr);
              cairo_arc (cr, xp, base - rr, rr, G_PI * 0.75, G_PI * 2.25);
              cairo_stroke (cr);
              trb_render_text (cr, f->style, t, fs * 0.85, TRUE, xp + rr + 1, base - 2 * rr,
                               0.0, 0.5, NULL);
            }
        }
      }
    }
  for (int c = 0; c < TRB_N_CASES; c++)
    g_array_unref (loads[c]);
}

/* ---- V, M and the deflection -------------------------------------------------------------- */

/* way: 1 for a deflection down, -1 for one up (each its own sentence to translate), 0 for a
 * shear or a moment. */
static void
extreme_label (Frame        *f,
               double        xm,
               double        value,
               double        py,
               double        y_top,
               double        y_bottom,
               TrbDimension  dim,
               int           way,
               gboolean      above)
{
  cairo_t *cr = f->cr;
  TrbUnitSystem u = f->r->units;
  g_autofree char *v = way != 0 ? trb_units_format_small_length (value, u)
                                 : trb_units_format (value, dim, u);
  g_autofree char *xs = trb_units_format (xm, TRB_DIM_LENGTH, u);
  /* Translators: an extreme on a diagram and where it is: "32.27 kip*ft at 8'-7"", and for
   * a deflection "0.31 in down at 8'-10"" */
  g_autofree char *t = g_strdup_printf (way > 0 ? _("%s down at %s")
                                        : way < 0 ? _("%s up at %s") : _("%s at %s"), v, xs);
  double px = dev_x (f, xm);
  double tw = trb_render_text_width (cr, f->style, t, f->fs * 0.85, TRUE);
  double ax = 0.5, ty;

  /* near an end the label reads inward, clear of the diagram's closing line */
  if (f->L > 0 && xm < 0.12 * f->L)
    ax = -0.6 * f->fs / MAX (tw, 1);
  else if (f->L > 0 && xm > 0.88 * f->L)
    ax = 1 + 0.6 * f->fs / MAX (tw, 1);

  trb_render_set_color (cr, &f->ink);
  cairo_new_sub_path (cr);
  cairo_arc (cr, px, py, 1.3, 0, 2 * G_PI);
  cairo_fill (cr);

  /* keep a centred label inside the diagram's width */
  if (ax == 0.5 && px - tw / 2 < f->x0 - 0.5 * f->fs)
    ax = (px - (f->x0 - 0.5 * f->fs)) / tw;
  if (ax == 0.5 && px + tw / 2 > f->x0 + f->w + 0.5 * f->fs)
    ax = 1 - ((f->x0 + f->w + 0.5 * f->fs) - px) / tw;
  ax = CLAMP (ax, -1.0, 2.0);
  /* beside the peak on the side away from the axis; where the diagram leaves no room there
   * (the peak at the edge of its band), on the inner side, over the shading */
  if (above && py - 1.5 - f->fs * 1.1 < y_top - 1.5 * f->fs)
    above = FALSE;
  else if (!above && py + 1.5 + f->fs * 1.1 > y_bottom + 1.9 * f->fs)
    above = TRUE;
  ty = above ? py - 1.5 : py + 1.5;
  trb_render_text (cr, f->style, t, f->fs * 0.85, TRUE, px, ty, ax, above ? 1.0 : 0.0, NULL);
}

static void
draw_curve (Frame                  *f,
            TrbDiagramKind          kind,
            const TrbDiagramSource *source,
            double                  y,
            double                  height)
{
  cairo_t *cr = f->cr;
  const TrbMemberResult *r = f->r;
  g_autoptr(GPtrArray) results = source_results (r, kind, source);
  g_autoptr(GArray) s = NULL;
  double vmax = 0, vmin = 0, top, bottom, base, k;
  gboolean deflection = kind == TRB_DIAGRAM_DEFLECTION;
  gboolean envelope = results->len > 1;
  TrbBeamExtremes ext;
  TrbRgba fill, line;
  double sign = deflection ? -1 : 1;   /* deflection, down +, is drawn downward */
  const TrbSupport *sup;
  guint n_sup;

  if (results->len == 0)
    {
      trb_render_set_color (cr, &f->ink);
      trb_render_text (cr, f->style, _("No result for this choice"), f->fs, FALSE,
                       f->x0 + f->w / 2, y + height / 2, 0.5, 0.5, NULL);
      return;
    }

  s = sample_curve (results, kind, f->L);
  for (guint i = 0; i < s->len; i++)
    {
      const Sample *p = &g_array_index (s, Sample, i);

      vmax = MAX (vmax, sign * p->hi);
      vmax = MAX (vmax, sign * p->lo);
      vmin = MIN (vmin, sign * p->hi);
      vmin = MIN (vmin, sign * p->lo);
    }

  /* room above the highest peak and below the lowest for their labels, under the title */
  top = y + 2.8 * f->fs;
  bottom = y + height - 2.0 * f->fs;
  if (vmax - vmin < 1e-30)
    {
      vmax = 1;
      vmin = -1;
    }
  k = (bottom - top) / (vmax - vmin);
  base = top + vmax * k;

  /* the curve(s): the envelope's upper and lower bounds, or the one result, filled to the
   * axis */
  trb_render_status_color (f->style, TRB_RENDER_STATUS_OK, &line);
  fill = line;
  fill.a = 0.14;
  for (int bound = 0; bound < (envelope ? 2 : 1); bound++)
    {
      cairo_move_to (cr, dev_x (f, 0), base);
      for (guint i = 0; i < s->len; i++)
        {
          const Sample *p = &g_array_index (s, Sample, i);
          double v = bound == 0 ? p->hi : p->lo;

          cairo_line_to (cr, dev_x (f, p->x), base - sign * v * k);
        }
      cairo_line_to (cr, dev_x (f, f->L), base);
      cairo_close_path (cr);
      trb_render_set_color (cr, &fill);
      cairo_fill (cr);

      cairo_new_path (cr);
      for (guint i = 0; i < s->len; i++)
        {
          const Sample *p = &g_array_index (s, Sample, i);
          double v = bound == 0 ? p->hi : p->lo;

          if (i == 0)
            cairo_move_to (cr, dev_x (f, p->x), base - sign * v * k);
          else
            cairo_line_to (cr, dev_x (f, p->x), base - sign * v * k);
        }
      trb_render_set_color (cr, &line);
      cairo_set_line_width (cr, 1.0);
      if (envelope && bound == 1)
        {
          double dash[] = { 3, 1.5 };

          cairo_set_dash (cr, dash, 2, 0);
        }
      cairo_stroke (cr);
      cairo_set_dash (cr, NULL, 0, 0);
    }

  /* the axis and the supports on it */
  trb_render_set_color (cr, &f->ink);
  cairo_set_line_width (cr, 0.8);
  cairo_move_to (cr, dev_x (f, 0), base);
  cairo_line_to (cr, dev_x (f, f->L), base);
  cairo_stroke (cr);
  if (r->beam != NULL)
    {
      sup = trb_beam_get_supports (r->beam, &n_sup);
      for (guint i = 0; i < n_sup; i++)
        {
          double px = dev_x (f, sup[i].x), t = 0.45 * f->fs;

          cairo_move_to (cr, px, base);
          cairo_line_to (cr, px + t * 0.7, base + t);
          cairo_line_to (cr, px - t * 0.7, base + t);
          cairo_close_path (cr);
          cairo_fill (cr);
        }
    }

  /* the exact extremes, from the engine's roots rather than the samples */
  trb_member_result_complete (r);
  if (source->kind == TRB_DIAGRAM_SOURCE_ENVELOPE)
    ext = deflection ? r->total.envelope.ext : r->strength.envelope.ext;
  else if (source->kind == TRB_DIAGRAM_SOURCE_COMBINATION)
    ext = g_array_index (r->strength.entries, TrbComboResult, source->index).ext;
  else
    ext = r->case_ext[source->index];

  if (kind == TRB_DIAGRAM_SHEAR)
    {
      if (ext.V_max > 1e-9)
        extreme_label (f, ext.V_max_x, ext.V_max, base - ext.V_max * k, top, bottom,
                       TRB_DIM_FORCE, 0, TRUE);
      if (ext.V_min < -1e-9)
        extreme_label (f, ext.V_min_x, ext.V_min, base - ext.V_min * k, top, bottom,
                       TRB_DIM_FORCE, 0, FALSE);
    }
  else if (kind == TRB_DIAGRAM_MOMENT)
    {
      if (ext.M_max > 1e-9)
        extreme_label (f, ext.M_max_x, ext.M_max, base - ext.M_max * k, top, bottom,
                       TRB_DIM_MOMENT, 0, TRUE);
      if (ext.M_min < -1e-9)
        extreme_label (f, ext.M_min_x, ext.M_min, base - ext.M_min * k, top, bottom,
                       TRB_DIM_MOMENT, 0, FALSE);
    }
  else
    {
      if (ext.defl_down > 1e-12)
        extreme_label (f, ext.defl_down_x, ext.defl_down, base + ext.defl_down * k, top,
                       bottom, TRB_DIM_LENGTH, 1, FALSE);
      if (ext.defl_up > 1e-12)
        extreme_label (f, ext.defl_up_x, ext.defl_up, base - ext.defl_up * k, top, bottom,
                       TRB_DIM_LENGTH, -1, TRUE);
    }
}

static const char *
kind_title (TrbDiagramKind kind)
{
  switch (kind)
    {
    /* Translators: the titles of the diagrams; keep the symbols V and M */
    case TRB_DIAGRAM_LOADING:
      return _("Loading");
    case TRB_DIAGRAM_SHEAR:
      return _("Shear V");
    case TRB_DIAGRAM_MOMENT:
      return _("Moment M, sagging +");
    case TRB_DIAGRAM_DEFLECTION:
    default:
      return _("Deflection, down +");
    }
}

void
trb_diagram_draw (cairo_t                *cr,
                  const TrbMemberResult  *result,
                  TrbDiagramKind          kind,
                  const TrbDiagramSource *source,
                  const TrbRenderStyle   *style,
                  double                  x,
                  double                  y,
                  double                  width,
                  double                  height)
{
  Frame f;
  g_autofree char *title = NULL;

  g_return_if_fail (cr != NULL && result != NULL && result->member != NULL);
  g_return_if_fail (source != NULL && style != NULL);

  frame_init (&f, cr, result, style, x, width);
  cairo_save (cr);

  if (kind == TRB_DIAGRAM_LOADING)
    title = g_strdup_printf (_("Loading and supports of %s (unfactored, by case)"),
                             result->member->id);
  else if (kind == TRB_DIAGRAM_DEFLECTION && source->kind == TRB_DIAGRAM_SOURCE_ENVELOPE)
    title = g_strdup_printf (_("%s: envelope of the total-load deflection (service)"),
                             kind_title (kind));
  else
    {
      g_autofree char *src = trb_diagram_source_describe (result, source);

      title = g_strdup_printf ("%s: %s", kind_title (kind), src);
    }
  trb_render_set_color (cr, &f.ink);
  trb_render_text (cr, style, title, f.fs * 0.95, TRUE, x, y, 0.0, 0.0, NULL);

  if (kind == TRB_DIAGRAM_LOADING)
    draw_loading (&f, y, height);
  else if (!result->analysed)
    {
      g_autofree char *t = result->message != NULL
                           /* Translators: why a member was not analysed, from the solver */
                           ? g_strdup_printf (_("Not analysed: %s"), result->message)
                           : g_strdup (_("Not analysed"));

      trb_render_text_wrapped (cr, style, t, f.fs, FALSE, f.x0, y + height / 2 - f.fs, f.w);
    }
  else
    draw_curve (&f, kind, source, y, height);
  cairo_restore (cr);
}

void
trb_diagram_draw_stack (cairo_t                *cr,
                        const TrbMemberResult  *result,
                        const TrbDiagramSource *source,
                        const TrbRenderStyle   *style,
                        double                  x,
                        double                  y,
                        double                  width,
                        double                  height)
{
  /* the loading sketch takes more room: it has its loads, dimensions and reactions */
  static const double share[] = { 0.34, 0.22, 0.22, 0.22 };
  double yy = y;

  g_return_if_fail (cr != NULL && result != NULL && source != NULL && style != NULL);

  if (!result->analysed)
    {
      /* no curves to draw: the sketch, and why */
      trb_diagram_draw (cr, result, TRB_DIAGRAM_LOADING, source, style, x, y, width,
                        height * 0.45);
      trb_diagram_draw (cr, result, TRB_DIAGRAM_SHEAR, source, style, x, y + height * 0.45,
                        width, height * 0.2);
      return;
    }

  for (int k = TRB_DIAGRAM_LOADING; k <= TRB_DIAGRAM_DEFLECTION; k++)
    {
      double h = height * share[k];

      trb_diagram_draw (cr, result, k, source, style, x, yy, width, h);
      yy += h;
    }
}
