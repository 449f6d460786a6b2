/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-render-flow.h"

#include <math.h>
#include <string.h>

typedef enum
{
  ITEM_HEADING,
  ITEM_PARAGRAPH,
  ITEM_SPACE,
  ITEM_BLOCK,
  ITEM_BREAK,
  ITEM_TABLE_HEADER,
  ITEM_TABLE_ROW,
  ITEM_TABLE_NOTE,
} ItemKind;

typedef struct
{
  guint    n_columns;
  char   **titles;
  double  *widths;        /* fractions summing to 1 */
  char    *align;
  int      status_column;
  gboolean headless;      /* every title empty: no header row */
} Table;

typedef struct
{
  ItemKind         kind;
  char            *text;       /* heading, paragraph, note */
  char           **cells;      /* row */
  double           scale;      /* paragraph */
  double           height;     /* space, block (negative: a fraction of the page) */
  gboolean         fill;       /* block: the rest of the page, at least height */
  TrbFlowDrawFunc  draw;
  gpointer         data;
  GDestroyNotify   destroy;
  Table           *table;      /* header, row, note */
  TrbFlowRowFlags  flags;
  TrbRenderStatus  status;
  gboolean         has_status;
  guint            row_index;  /* within its table, for the stripes */
  double           measured;   /* the height laid out */
} Item;

typedef struct
{
  guint    item;
  double   y;
  gboolean repeat;   /* a table header repeated at the top of a page */
} Placement;

struct _TrbFlow
{
  GPtrArray *items;    /* Item */
  GPtrArray *tables;   /* Table */
  Table     *open;     /* the table rows are added to */
  GPtrArray *pages;    /* GArray of Placement, one a page */
  double     width;
  double     height;
};

/* Padding of table cells and rows, in multiples of the font size. */
#define CELL_PAD_X 0.45
#define CELL_PAD_Y 0.22

static void
item_free (Item *item)
{
  g_free (item->text);
  g_strfreev (item->cells);
  if (item->destroy != NULL)
    item->destroy (item->data);
  g_free (item);
}

static void
table_free (Table *t)
{
  g_strfreev (t->titles);
  g_free (t->widths);
  g_free (t->align);
  g_free (t);
}

TrbFlow *
trb_flow_new (void)
{
  TrbFlow *flow = g_new0 (TrbFlow, 1);

  flow->items = g_ptr_array_new_with_free_func ((GDestroyNotify) item_free);
  flow->tables = g_ptr_array_new_with_free_func ((GDestroyNotify) table_free);
  flow->pages = g_ptr_array_new_with_free_func ((GDestroyNotify) g_array_unref);
  return flow;
}

void
trb_flow_free (TrbFlow *flow)
{
  if (flow == NULL)
    return;
  g_ptr_array_unref (flow->items);
  g_ptr_array_unref (flow->tables);
  g_ptr_array_unref (flow->pages);
  g_free (flow);
}

static Item *
add (TrbFlow  *flow,
     ItemKind  kind)
{
  Item *item = g_new0 (Item, 1);

  item->kind = kind;
  item->scale = 1;
  g_ptr_array_add (flow->items, item);
  return item;
}

void
trb_flow_heading (TrbFlow    *flow,
                  const char *text)
{
  g_return_if_fail (flow != NULL);

  add (flow, ITEM_HEADING)->text = g_strdup (text);
}

void
trb_flow_paragraph (TrbFlow    *flow,
                    const char *text,
                    double      scale)
{
  Item *item;

  g_return_if_fail (flow != NULL);

  item = add (flow, ITEM_PARAGRAPH);
  item->text = g_strdup (text);
  item->scale = scale > 0 ? scale : 1;
}

void
trb_flow_space (TrbFlow *flow,
                double   height)
{
  g_return_if_fail (flow != NULL);

  add (flow, ITEM_SPACE)->height = height;
}

void
trb_flow_block (TrbFlow         *flow,
                double           height,
                TrbFlowDrawFunc  draw,
                gpointer         data,
                GDestroyNotify   destroy)
{
  Item *item;

  g_return_if_fail (flow != NULL && draw != NULL);

  item = add (flow, ITEM_BLOCK);
  item->height = height;
  item->draw = draw;
  item->data = data;
  item->destroy = destroy;
}

void
trb_flow_block_fill (TrbFlow         *flow,
                     double           min_height,
                     TrbFlowDrawFunc  draw,
                     gpointer         data,
                     GDestroyNotify   destroy)
{
  Item *item;

  g_return_if_fail (flow != NULL && draw != NULL);

  item = add (flow, ITEM_BLOCK);
  item->height = MAX (min_height, 0);
  item->fill = TRUE;
  item->draw = draw;
  item->data = data;
  item->destroy = destroy;
}

void
trb_flow_page_break (TrbFlow *flow)
{
  g_return_if_fail (flow != NULL);

  add (flow, ITEM_BREAK);
}

void
trb_flow_table_begin (TrbFlow           *flow,
                      guint              n_columns,
                      const char *const *titles,
                      const double      *widths,
                      const char        *align,
                      int                status_column)
{
  Table *t;
  double sum = 0;

  g_return_if_fail (flow != NULL && n_columns > 0 && titles != NULL && widths != NULL);
  g_return_if_fail (align != NULL && strlen (align) == n_columns);

  t = g_new0 (Table, 1);
  t->n_columns = n_columns;
  t->titles = g_new0 (char *, n_columns + 1);
  t->widths = g_new0 (double, n_columns);
  for (guint i = 0; i < n_columns; i++)
    {
      t->titles[i] = g_strdup (titles[i]);
      sum += widths[i];
    }
  for (guint i = 0; i < n_columns; i++)
    t->widths[i] = widths[i] / sum;
  t->align = g_strdup (align);
  t->status_column = status_column;
  t->headless = TRUE;
  for (guint i = 0; i < n_columns; i++)
    if (titles[i] != NULL && titles[i][0] != '\0')
      t->headless = FALSE;
  g_ptr_array_add (flow->tables, t);
  flow->open = t;
  add (flow, ITEM_TABLE_HEADER)->table = t;
}

static guint
next_row_index (TrbFlow *flow)
{
  guint n = 0;

  for (guint i = flow->items->len; i > 0; i--)
    {
      Item *it = g_ptr_array_index (flow->items, i - 1);

      if (it->table != flow->open)
        break;
      if (it->kind == ITEM_TABLE_ROW)
        return it->row_index + 1;
      if (it->kind == ITEM_TABLE_HEADER)
        return 0;
    }
  return n;
}

void
trb_flow_table_row (TrbFlow           *flow,
                    const char *const *cells,
                    TrbFlowRowFlags    flags,
                    TrbRenderStatus    status)
{
  Item *item;
  guint index;

  g_return_if_fail (flow != NULL && flow->open != NULL && cells != NULL);

  index = next_row_index (flow);
  item = add (flow, ITEM_TABLE_ROW);
  item->table = flow->open;
  item->cells = g_new0 (char *, flow->open->n_columns + 1);
  for (guint i = 0; i < flow->open->n_columns; i++)
    item->cells[i] = g_strdup (cells[i] != NULL ? cells[i] : "");
  item->flags = flags;
  item->status = status;
  item->has_status = flow->open->status_column >= 0;
  item->row_index = index;
}

void
trb_flow_table_note (TrbFlow    *flow,
                     const char *text)
{
  Item *item;
  guint index;

  g_return_if_fail (flow != NULL && flow->open != NULL);

  /* a note belongs to the row above: it shares that row's stripe */
  index = next_row_index (flow);
  item = add (flow, ITEM_TABLE_NOTE);
  item->table = flow->open;
  item->text = g_strdup (text);
  item->row_index = index > 0 ? index - 1 : 0;
}

void
trb_flow_table_end (TrbFlow *flow)
{
  g_return_if_fail (flow != NULL);

  flow->open = NULL;
  trb_flow_space (flow, -1);
}

/* ---- measuring ---------------------------------------------------------------------------- */

static double
text_height (cairo_t              *cr,
             const TrbRenderStyle *style,
             const char           *text,
             double                size,
             gboolean              bold,
             double                width)
{
  g_autoptr(PangoLayout) layout = NULL;
  PangoRectangle logical;

  if (text == NULL || text[0] == '\0')
    text = " ";
  layout = trb_render_layout_new (cr, style, size, bold, text);
  pango_layout_set_width (layout, (int) (MAX (width, 1) * PANGO_SCALE));
  pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
  pango_layout_get_extents (layout, NULL, &logical);
  return (double) logical.height / PANGO_SCALE;
}

static double
row_size (const TrbRenderStyle *style,
          TrbFlowRowFlags       flags)
{
  return style->font_size * ((flags & TRB_FLOW_ROW_MUTED) ? 0.88 : 1.0);
}

static double
measure (TrbFlow              *flow,
         Item                 *item,
         cairo_t              *cr,
         const TrbRenderStyle *style)
{
  double fs = style->font_size;
  double W = flow->width;

  switch (item->kind)
    {
    case ITEM_HEADING:
      return text_height (cr, style, item->text, fs * 1.45, TRUE, W) + 0.5 * fs;
    case ITEM_PARAGRAPH:
      return text_height (cr, style, item->text, fs * item->scale, FALSE, W) + 0.35 * fs;
    case ITEM_SPACE:
      return item->height >= 0 ? item->height : fs * -item->height;
    case ITEM_BLOCK:
      return item->height >= 0 ? item->height : flow->height * -item->height;
    case ITEM_BREAK:
      return 0;
    case ITEM_TABLE_NOTE:
      return text_height (cr, style, item->text, fs * 0.88, FALSE,
                          W - 2 * CELL_PAD_X * fs) + CELL_PAD_Y * fs;
    case ITEM_TABLE_HEADER:
    case ITEM_TABLE_ROW:
    default:
      {
        Table *t = item->table;

        if (item->kind == ITEM_TABLE_HEADER && t->headless)
          return 0;
        double h = 0;
        gboolean header = item->kind == ITEM_TABLE_HEADER;

        for (guint c = 0; c < t->n_columns; c++)
          {
            const char *text = header ? t->titles[c] : item->cells[c];
            double cw = t->widths[c] * W - 2 * CELL_PAD_X * fs;

            h = MAX (h, text_height (cr, style, text, header ? fs * 0.95 : row_size (style,
                                                                                    item->flags),
                                     header || (item->flags & TRB_FLOW_ROW_BOLD), cw));
          }
        return h + 2 * CELL_PAD_Y * fs;
      }
    }
}

guint
trb_flow_paginate (TrbFlow              *flow,
                   cairo_t              *cr,
                   const TrbRenderStyle *style,
                   double                width,
                   double                height)
{
  GArray *page;
  double y = 0;
  Item *header = NULL;   /* the header of the table being laid out */

  g_return_val_if_fail (flow != NULL && cr != NULL && style != NULL, 0);

  flow->width = width;
  flow->height = height;
  g_ptr_array_set_size (flow->pages, 0);
  for (guint i = 0; i < flow->items->len; i++)
    {
      Item *it = g_ptr_array_index (flow->items, i);

      it->measured = measure (flow, it, cr, style);
    }

  page = g_array_new (FALSE, FALSE, sizeof (Placement));
  g_ptr_array_add (flow->pages, page);
  for (guint i = 0; i < flow->items->len; i++)
    {
      Item *it = g_ptr_array_index (flow->items, i);
      double need = it->measured;

      if (it->kind == ITEM_BREAK)
        {
          if (page->len > 0)
            {
              page = g_array_new (FALSE, FALSE, sizeof (Placement));
              g_ptr_array_add (flow->pages, page);
              y = 0;
            }
          continue;
        }
      if (it->kind == ITEM_TABLE_HEADER)
        header = it;
      else if (it->kind != ITEM_TABLE_ROW && it->kind != ITEM_TABLE_NOTE)
        header = NULL;

      /* keep a heading with what follows it, a header with its first row, a row with its
       * note */
      if (it->kind == ITEM_HEADING || it->kind == ITEM_TABLE_HEADER ||
          it->kind == ITEM_TABLE_ROW)
        for (guint k = i + 1; k < flow->items->len; k++)
          {
            Item *n = g_ptr_array_index (flow->items, k);

            if (n->kind == ITEM_BREAK)
              break;
            if (it->kind == ITEM_TABLE_ROW && n->kind != ITEM_TABLE_NOTE)
              break;
            need += n->measured;
            if (n->kind == ITEM_TABLE_ROW || n->kind == ITEM_PARAGRAPH ||
                n->kind == ITEM_BLOCK)
              break;
          }

      if (it->kind == ITEM_BLOCK && it->fill)
        {
          if (height - y < it->height && page->len > 0)
            {
              page = g_array_new (FALSE, FALSE, sizeof (Placement));
              g_ptr_array_add (flow->pages, page);
              y = 0;
            }
          it->measured = MAX (height - y, 0);
          need = it->measured;
        }

      if (y + need > height + 1e-6 && page->len > 0 && it->kind != ITEM_SPACE)
        {
          page = g_array_new (FALSE, FALSE, sizeof (Placement));
          g_ptr_array_add (flow->pages, page);
          y = 0;
          if (header != NULL && (it->kind == ITEM_TABLE_ROW || it->kind == ITEM_TABLE_NOTE))
            {
              Placement p = { 0, 0, TRUE };

              for (guint k = 0; k < flow->items->len; k++)
                if (g_ptr_array_index (flow->items, k) == header)
                  p.item = k;
              g_array_append_val (page, p);
              y += header->measured;
            }
        }
      /* space at the top of a page is wasted */
      if (it->kind == ITEM_SPACE && page->len == 0)
        continue;
      {
        Placement p = { i, y, FALSE };

        g_array_append_val (page, p);
        y += it->measured;
      }
    }
  /* a trailing empty page (a break at the very end) is no page */
  if (flow->pages->len > 1 && ((GArray *) g_ptr_array_index (flow->pages,
                                                             flow->pages->len - 1))->len == 0)
    g_ptr_array_set_size (flow->pages, flow->pages->len - 1);
  return flow->pages->len;
}

guint
trb_flow_get_n_pages (const TrbFlow *flow)
{
  g_return_val_if_fail (flow != NULL, 0);

  return flow->pages->len;
}

/* ---- drawing ------------------------------------------------------------------------------ */

static void
draw_cell (cairo_t              *cr,
           const TrbRenderStyle *style,
           const char           *text,
           double                size,
           gboolean              bold,
           char                  align,
           double                x,
           double                y,
           double                width)
{
  g_autoptr(PangoLayout) layout = NULL;

  if (text == NULL || text[0] == '\0')
    return;
  layout = trb_render_layout_new (cr, style, size, bold, text);
  pango_layout_set_width (layout, (int) (MAX (width, 1) * PANGO_SCALE));
  pango_layout_set_wrap (layout, PANGO_WRAP_WORD_CHAR);
  pango_layout_set_alignment (layout, align == 'r' ? PANGO_ALIGN_RIGHT
                                      : align == 'c' ? PANGO_ALIGN_CENTER : PANGO_ALIGN_LEFT);
  cairo_move_to (cr, x, y);
  pango_cairo_show_layout (cr, layout);
  cairo_new_path (cr);
}

static void
draw_row (TrbFlow              *flow,
          Item                 *it,
          cairo_t              *cr,
          const TrbRenderStyle *style,
          double                x,
          double                y)
{
  Table *t = it->table;
  double fs = style->font_size;
  double W = flow->width;
  double h = it->measured;
  gboolean header = it->kind == ITEM_TABLE_HEADER;
  TrbRgba ink;
  double cx = x;

  trb_render_ink_color (style, &ink);
  if (header && t->headless)
    return;
  if (!header && t->headless && it->row_index == 0 && it->kind == ITEM_TABLE_ROW)
    {
      trb_render_set_color (cr, &ink);
      cairo_set_line_width (cr, 0.8);
      cairo_move_to (cr, x, y);
      cairo_line_to (cr, x + W, y);
      cairo_stroke (cr);
    }

  if (header)
    {
      cairo_rectangle (cr, x, y, W, h);
      cairo_set_source_rgb (cr, 0.87, 0.87, 0.86);
      cairo_fill (cr);
    }
  else if (it->row_index % 2 == 1)
    {
      /* every other row lightly shaded, so that a long row reads across */
      cairo_rectangle (cr, x, y, W, h);
      cairo_set_source_rgb (cr, 0.955, 0.955, 0.95);
      cairo_fill (cr);
    }

  if (it->kind == ITEM_TABLE_NOTE)
    {
      cairo_set_source_rgb (cr, 0.3, 0.3, 0.3);
      draw_cell (cr, style, it->text, fs * 0.88, FALSE, 'l', x + 2 * CELL_PAD_X * fs, y,
                 W - 3 * CELL_PAD_X * fs);
      return;
    }

  for (guint c = 0; c < t->n_columns; c++)
    {
      double cw = t->widths[c] * W;
      const char *text = header ? t->titles[c] : it->cells[c];
      gboolean bold = header || (it->flags & TRB_FLOW_ROW_BOLD);

      trb_render_set_color (cr, &ink);
      if (!header && it->has_status && (int) c == t->status_column)
        {
          TrbRgba sc;

          trb_render_status_color (style, it->status, &sc);
          /* amber text is faint on paper: darken it, the word says the rest */
          if (it->status == TRB_RENDER_STATUS_NEAR)
            {
              sc.r *= 0.7;
              sc.g *= 0.7;
              sc.b *= 0.7;
            }
          trb_render_set_color (cr, &sc);
          bold = bold || it->status == TRB_RENDER_STATUS_FAIL;
        }
      if (it->flags & TRB_FLOW_ROW_MUTED)
        cairo_set_source_rgb (cr, 0.3, 0.3, 0.3);
      draw_cell (cr, style, text, header ? fs * 0.95 : row_size (style, it->flags), bold,
                 t->align[c], cx + CELL_PAD_X * fs, y + CELL_PAD_Y * fs,
                 cw - 2 * CELL_PAD_X * fs);
      cx += cw;
    }

  /* rules: heavier under the header */
  trb_render_set_color (cr, &ink);
  cairo_set_line_width (cr, header ? 0.8 : 0.25);
  cairo_move_to (cr, x, y + h);
  cairo_line_to (cr, x + W, y + h);
  cairo_stroke (cr);
  if (header)
    {
      cairo_move_to (cr, x, y);
      cairo_line_to (cr, x + W, y);
      cairo_stroke (cr);
    }
}

void
trb_flow_draw_page (TrbFlow              *flow,
                    guint                 page,
                    cairo_t              *cr,
                    const TrbRenderStyle *style,
                    double                x,
                    double                y)
{
  GArray *placements;
  double fs;
  TrbRgba ink;

  g_return_if_fail (flow != NULL && cr != NULL && style != NULL);
  g_return_if_fail (page < flow->pages->len);

  fs = style->font_size;
  trb_render_ink_color (style, &ink);
  placements = g_ptr_array_index (flow->pages, page);
  for (guint i = 0; i < placements->len; i++)
    {
      const Placement *p = &g_array_index (placements, Placement, i);
      Item *it = g_ptr_array_index (flow->items, p->item);
      double yy = y + p->y;

      cairo_save (cr);
      trb_render_set_color (cr, &ink);
      switch (it->kind)
        {
        case ITEM_HEADING:
          draw_cell (cr, style, it->text, fs * 1.45, TRUE, 'l', x, yy + 0.3 * fs, flow->width);
          break;
        case ITEM_PARAGRAPH:
          draw_cell (cr, style, it->text, fs * it->scale, FALSE, 'l', x, yy, flow->width);
          break;
        case ITEM_BLOCK:
          it->draw (cr, style, x, yy, flow->width, it->measured, it->data);
          break;
        case ITEM_TABLE_HEADER:
        case ITEM_TABLE_ROW:
        case ITEM_TABLE_NOTE:
          draw_row (flow, it, cr, style, x, yy);
          break;
        case ITEM_SPACE:
        case ITEM_BREAK:
        default:
          break;
        }
      cairo_restore (cr);
    }
}
