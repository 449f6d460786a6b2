/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-combos.h"

static const char * const case_names[TRB_N_CASES] = { "D", "L", "Lr", "S" };

/**
 * trb_load_case_name:
 * @lcase: a load case
 *
 * Returns: the case's short name as written in files and output: "D", "L", "Lr", "S".
 */
const char *
trb_load_case_name (TrbLoadCase lcase)
{
  g_return_val_if_fail (lcase < TRB_N_CASES, NULL);

  return case_names[lcase];
}

/**
 * trb_load_case_from_name:
 * @name: "D", "L", "Lr" or "S" (exact: case matters, "LR" is not "Lr")
 * @lcase: (out): the case
 *
 * Returns: %TRUE if @name is a case.
 */
gboolean
trb_load_case_from_name (const char  *name,
                         TrbLoadCase *lcase)
{
  g_return_val_if_fail (name != NULL, FALSE);

  for (guint i = 0; i < TRB_N_CASES; i++)
    {
      if (strcmp (name, case_names[i]) == 0)
        {
          if (lcase != NULL)
            *lcase = i;
          return TRUE;
        }
    }
  return FALSE;
}

/**
 * trb_combo_set_title:
 * @set: a set of combinations
 *
 * Returns: a short title naming the set and its source, for headings.
 */
const char *
trb_combo_set_title (TrbComboSet set)
{
  switch (set)
    {
    case TRB_COMBO_SET_LRFD:
      return "LRFD combinations, ASCE 7-16 §2.3.1";
    case TRB_COMBO_SET_ASD:
      return "ASD combinations, ASCE 7-16 §2.4.1";
    case TRB_COMBO_SET_SERVICE:
      return "Service loads for allowable stress (unfactored)";
    case TRB_COMBO_SET_LIVE:
      return "Live-load deflection, IBC 2021 Table 1604.3";
    case TRB_COMBO_SET_TOTAL:
      return "Total-load deflection, IBC 2021 Table 1604.3";
    default:
      g_return_val_if_reached (NULL);
    }
}

/* One combination as the standard writes it: fixed factors on D and L, and a factor on the
 * "(Lr or S)" term, which is expanded into one combination per present case. The terms are
 * named in the standard's order; var_before_l puts the (Lr or S) term ahead of L, as in
 * LRFD 3. */
typedef struct
{
  int         number;
  const char *equation;
  double      d;
  double      l;
  double      var;
  gboolean    var_before_l;
} ComboTemplate;

static const ComboTemplate lrfd_templates[] = {
  { 1, "ASCE 7-16 Eq. 2.3-1", 1.4, 0.0, 0.0, FALSE },
  { 2, "ASCE 7-16 Eq. 2.3-2", 1.2, 1.6, 0.5, FALSE },
  /* + 0.5W omitted: no wind in this program */
  { 3, "ASCE 7-16 Eq. 2.3-3", 1.2, 1.0, 1.6, TRUE },
  /* 1.0W omitted, as above */
  { 4, "ASCE 7-16 Eq. 2.3-4", 1.2, 1.0, 0.5, FALSE },
};

static const ComboTemplate asd_templates[] = {
  { 1, "ASCE 7-16 Eq. 2.4-1", 1.0, 0.0, 0.0, FALSE },
  { 2, "ASCE 7-16 Eq. 2.4-2", 1.0, 1.0, 0.0, FALSE },
  { 3, "ASCE 7-16 Eq. 2.4-3", 1.0, 0.0, 1.0, FALSE },
  { 4, "ASCE 7-16 Eq. 2.4-4", 1.0, 0.75, 0.75, FALSE },
};

/* The classic allowable-stress method works on unfactored service loads; these are the ASD
 * combinations without the 0.75 companion form. */
static const ComboTemplate service_templates[] = {
  { 1, "ASCE 7-16 Eq. 2.4-2", 1.0, 1.0, 0.0, FALSE },
  { 2, "ASCE 7-16 Eq. 2.4-3", 1.0, 0.0, 1.0, FALSE },
};

/* Total-load deflection: the service combinations that carry dead load with the live loads. */
static const ComboTemplate total_templates[] = {
  { 1, "IBC 2021 Table 1604.3", 1.0, 1.0, 0.0, FALSE },
  { 2, "IBC 2021 Table 1604.3", 1.0, 0.0, 1.0, FALSE },
  { 3, "IBC 2021 Table 1604.3", 1.0, 0.75, 0.75, FALSE },
};

static void
append_term (GString    *s,
             double      factor,
             const char *case_name)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  if (factor == 0)
    return;
  if (s->len > 0)
    g_string_append (s, " + ");
  if (factor != 1.0)
    g_string_append (s, g_ascii_formatd (buf, sizeof buf, "%g", factor));
  g_string_append (s, case_name);
}

static void
combo_from_template (const ComboTemplate *t,
                     const char          *prefix,
                     int                  var_case,
                     const gboolean      *present,
                     TrbCombo            *out)
{
  g_autoptr(GString) terms = g_string_new (NULL);
  double f[TRB_N_CASES] = { 0 };

  memset (out, 0, sizeof *out);
  f[TRB_CASE_D] = t->d;
  f[TRB_CASE_L] = t->l;
  if (var_case >= 0)
    f[var_case] = t->var;

  /* Absent cases contribute nothing; leaving them out of the factors and the name makes
   * duplicates visible and keeps the names honest. */
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (!present[c])
      f[c] = 0;

  append_term (terms, f[TRB_CASE_D], "D");
  if (t->var_before_l && var_case >= 0)
    append_term (terms, f[var_case], case_names[var_case]);
  append_term (terms, f[TRB_CASE_L], "L");
  if (!t->var_before_l && var_case >= 0)
    append_term (terms, f[var_case], case_names[var_case]);
  if (terms->len == 0)
    g_string_append (terms, "no load");

  if (t->number > 0)
    g_snprintf (out->name, sizeof out->name, "%s %d: %s", prefix, t->number, terms->str);
  else
    g_snprintf (out->name, sizeof out->name, "%s: %s", prefix, terms->str);
  g_strlcpy (out->equation, t->equation, sizeof out->equation);
  memcpy (out->factors, f, sizeof f);
}

/* a is never worse than b for gravity loads when each of its factors is at most b's: every
 * case acts the same way (down), so b's effect is at least a's everywhere. */
static gboolean
combo_dominated_by (const TrbCombo *a,
                    const TrbCombo *b)
{
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (a->factors[c] > b->factors[c])
      return FALSE;
  return TRUE;
}

static gboolean
combo_equal (const TrbCombo *a,
             const TrbCombo *b)
{
  return memcmp (a->factors, b->factors, sizeof a->factors) == 0;
}

static GArray *
expand_templates (const ComboTemplate *templates,
                  guint                n_templates,
                  const char          *prefix,
                  const gboolean      *present)
{
  GArray *all = g_array_new (FALSE, TRUE, sizeof (TrbCombo));
  const int var_cases[] = { TRB_CASE_LR, TRB_CASE_S };

  for (guint i = 0; i < n_templates; i++)
    {
      const ComboTemplate *t = &templates[i];
      gboolean any = FALSE;
      TrbCombo c;

      if (t->var != 0)
        {
          for (guint v = 0; v < G_N_ELEMENTS (var_cases); v++)
            {
              if (!present[var_cases[v]])
                continue;
              combo_from_template (t, prefix, var_cases[v], present, &c);
              g_array_append_val (all, c);
              any = TRUE;
            }
        }
      if (!any)
        {
          combo_from_template (t, prefix, -1, present, &c);
          g_array_append_val (all, c);
        }
    }
  return all;
}

static gboolean
combo_is_zero (const TrbCombo *c)
{
  for (guint k = 0; k < TRB_N_CASES; k++)
    if (c->factors[k] != 0)
      return FALSE;
  return TRUE;
}

/* Drops the combinations that add nothing: those equal to an earlier one, or dominated by
 * another, factor by factor. The first (1.4D, D) stays although the others cover it: it is
 * the combination in which no live load acts, which a live-load pattern cannot reproduce.
 * Only when the member has no dead load at all, and so the first is nothing, does it go. */
static GArray *
prune (GArray *all)
{
  guint n = all->len;
  g_autofree gboolean *dropped = g_new0 (gboolean, n);
  GArray *kept = g_array_new (FALSE, TRUE, sizeof (TrbCombo));

  for (guint i = 1; i < n; i++)
    {
      const TrbCombo *a = &g_array_index (all, TrbCombo, i);

      for (guint j = 0; j < n && !dropped[i]; j++)
        {
          const TrbCombo *b = &g_array_index (all, TrbCombo, j);

          if (j == i || dropped[j])
            continue;
          if (combo_equal (a, b))
            dropped[i] = j < i;
          else if (combo_dominated_by (a, b))
            dropped[i] = TRUE;
        }
    }
  for (guint i = 1; i < n && n > 0; i++)
    if (!dropped[i] && combo_is_zero (&g_array_index (all, TrbCombo, 0)))
      dropped[0] = TRUE;
  for (guint i = 0; i < n; i++)
    if (!dropped[i])
      g_array_append_val (kept, g_array_index (all, TrbCombo, i));
  g_array_unref (all);
  return kept;
}

/**
 * trb_combos_build:
 * @set: which combinations
 * @present: (array fixed-size=4): which load cases the member carries
 *
 * The combinations of @set for a member carrying the cases in @present. "(Lr or S)" becomes
 * one combination per present case; terms of absent cases are left out of the factors and
 * the names; combinations that then add nothing are dropped, but the first is kept unless it
 * is empty and another remains (the live-deflection set is empty without live load).
 *
 * Returns: (transfer full): a #GArray of #TrbCombo.
 */
GArray *
trb_combos_build (TrbComboSet     set,
                  const gboolean *present)
{
  g_return_val_if_fail (present != NULL, NULL);

  switch (set)
    {
    case TRB_COMBO_SET_LRFD:
      return prune (expand_templates (lrfd_templates, G_N_ELEMENTS (lrfd_templates),
                                      "LRFD", present));
    case TRB_COMBO_SET_ASD:
      return prune (expand_templates (asd_templates, G_N_ELEMENTS (asd_templates),
                                      "ASD", present));
    case TRB_COMBO_SET_SERVICE:
      return prune (expand_templates (service_templates, G_N_ELEMENTS (service_templates),
                                      "Service", present));
    case TRB_COMBO_SET_TOTAL:
      {
        GArray *a = prune (expand_templates (total_templates, G_N_ELEMENTS (total_templates),
                                             "Total", present));
        /* The total set is named by its terms alone; its numbers mean nothing to a reader. */
        for (guint i = 0; i < a->len; i++)
          {
            TrbCombo *c = &g_array_index (a, TrbCombo, i);
            const char *colon = strchr (c->name, ':');
            g_autofree char *rest = g_strdup (colon != NULL ? colon + 2 : c->name);

            g_snprintf (c->name, sizeof c->name, "Total: %s", rest);
          }
        return a;
      }
    case TRB_COMBO_SET_LIVE:
      {
        GArray *a = g_array_new (FALSE, TRUE, sizeof (TrbCombo));
        const TrbLoadCase live[] = { TRB_CASE_L, TRB_CASE_LR, TRB_CASE_S };

        for (guint i = 0; i < G_N_ELEMENTS (live); i++)
          {
            TrbCombo c = { { 0 } };

            if (!present[live[i]])
              continue;
            g_snprintf (c.name, sizeof c.name, "Live: %s", case_names[live[i]]);
            g_strlcpy (c.equation, "IBC 2021 Table 1604.3", sizeof c.equation);
            c.factors[live[i]] = 1.0;
            g_array_append_val (a, c);
          }
        return a;
      }
    default:
      g_return_val_if_reached (NULL);
    }
}

static int
compare_support_x (gconstpointer a,
                   gconstpointer b)
{
  const TrbSupport *sa = a;
  const TrbSupport *sb = b;

  return (sa->x > sb->x) - (sa->x < sb->x);
}

/**
 * trb_regions_build:
 * @supports: (array length=n_supports): the supports, in any order
 * @n_supports: how many
 * @length: the member's length, m
 *
 * Cuts the member at its supports: a left overhang when the first support is not at the left
 * end, the spans between supports, a right overhang when the last support is not at the right
 * end. Supports closer than a billionth of the length count as one.
 *
 * Returns: (transfer full): a #GArray of #TrbRegion, left to right; empty without supports.
 */
GArray *
trb_regions_build (const TrbSupport *supports,
                   guint             n_supports,
                   double            length)
{
  GArray *regions = g_array_new (FALSE, TRUE, sizeof (TrbRegion));
  g_autofree TrbSupport *s = NULL;
  double tol = 1e-9 * length;
  guint n = 0;

  g_return_val_if_fail (supports != NULL || n_supports == 0, regions);

  if (n_supports == 0)
    return regions;

  s = g_new (TrbSupport, n_supports);
  memcpy (s, supports, n_supports * sizeof *s);
  qsort (s, n_supports, sizeof *s, compare_support_x);
  for (guint i = 0; i < n_supports; i++)
    if (n == 0 || s[i].x - s[n - 1].x > tol)
      s[n++] = s[i];

  if (s[0].x > tol)
    {
      TrbRegion r = { TRB_REGION_LEFT_OVERHANG, 0, 0.0, s[0].x };
      g_array_append_val (regions, r);
    }
  for (guint i = 0; i + 1 < n; i++)
    {
      TrbRegion r = { TRB_REGION_SPAN, i + 1, s[i].x, s[i + 1].x };
      g_array_append_val (regions, r);
    }
  if (length - s[n - 1].x > tol)
    {
      TrbRegion r = { TRB_REGION_RIGHT_OVERHANG, 0, s[n - 1].x, length };
      g_array_append_val (regions, r);
    }
  return regions;
}

/**
 * trb_region_find:
 * @regions: (array length=n_regions): regions, left to right
 * @n_regions: how many, at least one
 * @x: a position, m
 *
 * A position on a boundary belongs to the region on its right (the right end to the last
 * region), so a point load at a support goes to exactly one region.
 *
 * Returns: the index of the region holding @x.
 */
guint
trb_region_find (const TrbRegion *regions,
                 guint            n_regions,
                 double           x)
{
  g_return_val_if_fail (n_regions > 0, 0);

  for (guint i = 0; i + 1 < n_regions; i++)
    if (x < regions[i].b)
      return i;
  return n_regions - 1;
}

static double
linear_at (const TrbLoad *l,
           double         x)
{
  if (x <= l->a)
    return l->w1;
  if (x >= l->b)
    return l->w2;
  return l->w1 + (l->w2 - l->w1) * (x - l->a) / (l->b - l->a);
}

/**
 * trb_loads_split:
 * @loads: (array length=n_loads): loads on the member
 * @n_loads: how many
 * @regions: (array length=n_regions): the member's regions
 * @n_regions: how many, at least one
 *
 * Splits each load among the regions: point loads and moments go to the region that holds
 * them, distributed loads are cut at the region boundaries (a linear load keeps its
 * intensity at the cut), so that the pieces add up to the original load exactly.
 *
 * Returns: (transfer full): @n_regions #GArrays of #TrbLoad; free with trb_loads_split_free().
 */
GArray **
trb_loads_split (const TrbLoad   *loads,
                 guint            n_loads,
                 const TrbRegion *regions,
                 guint            n_regions)
{
  GArray **out;

  g_return_val_if_fail (n_regions > 0, NULL);

  out = g_new0 (GArray *, n_regions);
  for (guint r = 0; r < n_regions; r++)
    out[r] = g_array_new (FALSE, TRUE, sizeof (TrbLoad));

  for (guint i = 0; i < n_loads; i++)
    {
      const TrbLoad *l = &loads[i];

      if (l->kind == TRB_LOAD_POINT || l->kind == TRB_LOAD_MOMENT || !(l->b > l->a))
        {
          g_array_append_val (out[trb_region_find (regions, n_regions, l->a)], *l);
          continue;
        }

      for (guint r = 0; r < n_regions; r++)
        {
          double a = MAX (l->a, regions[r].a);
          double b = MIN (l->b, regions[r].b);
          TrbLoad piece = *l;

          /* The first and last regions reach the member's ends whatever their a and b say. */
          if (r == 0)
            a = l->a;
          if (r + 1 == n_regions)
            b = l->b;
          if (!(b > a))
            continue;
          piece.a = a;
          piece.b = b;
          if (l->kind == TRB_LOAD_LINEAR)
            {
              piece.w1 = a == l->a ? l->w1 : linear_at (l, a);
              piece.w2 = b == l->b ? l->w2 : linear_at (l, b);
            }
          g_array_append_val (out[r], piece);
        }
    }
  return out;
}

void
trb_loads_split_free (GArray **per_region,
                      guint    n_regions)
{
  if (per_region == NULL)
    return;
  for (guint r = 0; r < n_regions; r++)
    g_clear_pointer (&per_region[r], g_array_unref);
  g_free (per_region);
}

/* A string being built in a buffer that is always big enough (see describe_into()). */
typedef struct
{
  char  *p;
  gsize  len;
} Text;

static void
text_add (Text       *t,
          const char *s)
{
  gsize n = strlen (s);

  memcpy (t->p + t->len, s, n + 1);
  t->len += n;
}

/* as "%d" writes it */
static void
text_add_int (Text *t,
              int   value)
{
  char digits[16];
  guint n = 0;
  guint v = value < 0 ? 0u - (guint) value : (guint) value;

  do
    digits[n++] = '0' + v % 10;
  while ((v /= 10) > 0);
  if (value < 0)
    t->p[t->len++] = '-';
  while (n > 0)
    t->p[t->len++] = digits[--n];
  t->p[t->len] = '\0';
}

/* The name trb_pattern_describe() gives, into buf: strlen (label) + 16 bytes a region and 64
 * more are always enough (a span number takes at most 11 bytes with its "+"). */
static void
describe_into (char            *buf,
               const TrbRegion *regions,
               guint            n_regions,
               guint64          mask,
               const char      *label)
{
  Text s = { buf, 0 };
  gboolean left = FALSE, right = FALSE, has_overhang = FALSE;
  guint n_spans = 0, n_loaded_spans = 0;
  guint64 all;

  buf[0] = '\0';
  text_add (&s, label);
  all = n_regions == 64 ? G_MAXUINT64 : ((G_GUINT64_CONSTANT (1) << n_regions) - 1);
  for (guint r = 0; r < n_regions; r++)
    {
      gboolean on = (mask >> r) & 1;

      if (regions[r].kind == TRB_REGION_SPAN)
        {
          n_spans++;
          if (on)
            n_loaded_spans++;
        }
      else
        {
          has_overhang = TRUE;
          if (on && regions[r].kind == TRB_REGION_LEFT_OVERHANG)
            left = TRUE;
          if (on && regions[r].kind == TRB_REGION_RIGHT_OVERHANG)
            right = TRUE;
        }
    }

  if ((mask & all) == all)
    {
      if (n_spans == 0)
        text_add (&s, " on the whole member");
      else
        text_add (&s, has_overhang ? " on all spans and overhangs" : " on all spans");
      return;
    }

  text_add (&s, " on ");
  if (left)
    text_add (&s, "left overhang");
  if (n_loaded_spans > 0)
    {
      guint k = 0;

      text_add (&s, left ? " + " : "");
      text_add (&s, n_loaded_spans > 1 ? "spans " : "span ");
      for (guint r = 0; r < n_regions; r++)
        if (regions[r].kind == TRB_REGION_SPAN && ((mask >> r) & 1))
          {
            if (k++ > 0)
              text_add (&s, "+");
            text_add_int (&s, regions[r].span);
          }
    }
  if (right)
    {
      text_add (&s, left || n_loaded_spans > 0 ? " + " : "");
      text_add (&s, "right overhang");
    }
}

static gsize
describe_size (guint       n_regions,
               const char *label)
{
  return strlen (label) + 16 * (gsize) n_regions + 64;
}

/**
 * trb_pattern_describe:
 * @regions: (array length=n_regions): the member's regions
 * @n_regions: how many
 * @mask: the loaded regions
 * @label: the patterned case, "L" or "Lr"
 *
 * Returns: (transfer full): a name such as "L on span 1", "L on spans 1+3",
 *   "L on left overhang + span 1", "L on all spans".
 */
char *
trb_pattern_describe (const TrbRegion *regions,
                      guint            n_regions,
                      guint64          mask,
                      const char      *label)
{
  char *buf;

  g_return_val_if_fail (n_regions <= TRB_PATTERN_MAX_REGIONS, NULL);

  buf = g_malloc (describe_size (n_regions, label));
  describe_into (buf, regions, n_regions, mask, label);
  return buf;
}

static void
add_pattern (GArray          *patterns,
             const TrbRegion *regions,
             guint            n_regions,
             guint64          mask,
             const char      *label)
{
  TrbPattern p = { { 0 } };
  char stack[512];
  g_autofree char *heap = NULL;
  gsize size = describe_size (n_regions, label);
  char *name = size <= sizeof stack ? stack : (heap = g_malloc (size));

  if (mask == 0)
    return;
  for (guint i = 0; i < patterns->len; i++)
    if (g_array_index (patterns, TrbPattern, i).mask == mask)
      return;
  describe_into (name, regions, n_regions, mask, label);
  g_strlcpy (p.name, name, sizeof p.name);
  p.mask = mask;
  g_array_append_val (patterns, p);
}

/**
 * trb_patterns_build:
 * @regions: (array length=n_regions): the member's regions
 * @n_regions: how many, at most %TRB_PATTERN_MAX_REGIONS
 * @label: the patterned case for the names, "L" or "Lr"
 *
 * The live-load patterns, each region set once, in this order: all regions loaded; each
 * region alone; adjacent pairs of spans; alternate spans (odd, even); each overhang with its
 * adjacent span. One region gives the one pattern "all".
 *
 * Returns: (transfer full): a #GArray of #TrbPattern; the first loads every region.
 */
GArray *
trb_patterns_build (const TrbRegion *regions,
                    guint            n_regions,
                    const char      *label)
{
  GArray *patterns = g_array_new (FALSE, TRUE, sizeof (TrbPattern));
  guint64 all, odd = 0, even = 0;
  int first_span = -1, last_span = -1;

  g_return_val_if_fail (n_regions <= TRB_PATTERN_MAX_REGIONS, patterns);

  if (n_regions == 0)
    return patterns;
  all = n_regions == 64 ? G_MAXUINT64 : ((G_GUINT64_CONSTANT (1) << n_regions) - 1);
  add_pattern (patterns, regions, n_regions, all, label);

  for (guint r = 0; r < n_regions; r++)
    add_pattern (patterns, regions, n_regions, G_GUINT64_CONSTANT (1) << r, label);

  for (guint r = 0; r < n_regions; r++)
    {
      if (regions[r].kind != TRB_REGION_SPAN)
        continue;
      if (first_span < 0)
        first_span = r;
      last_span = r;
      if (regions[r].span % 2 == 1)
        odd |= G_GUINT64_CONSTANT (1) << r;
      else
        even |= G_GUINT64_CONSTANT (1) << r;
    }

  for (guint r = 0; r + 1 < n_regions; r++)
    if (regions[r].kind == TRB_REGION_SPAN && regions[r + 1].kind == TRB_REGION_SPAN)
      add_pattern (patterns, regions, n_regions, G_GUINT64_CONSTANT (3) << r, label);

  add_pattern (patterns, regions, n_regions, odd, label);
  add_pattern (patterns, regions, n_regions, even, label);

  if (regions[0].kind == TRB_REGION_LEFT_OVERHANG && first_span >= 0)
    add_pattern (patterns, regions, n_regions,
                 1 | (G_GUINT64_CONSTANT (1) << first_span), label);
  if (regions[n_regions - 1].kind == TRB_REGION_RIGHT_OVERHANG && last_span >= 0)
    add_pattern (patterns, regions, n_regions,
                 (G_GUINT64_CONSTANT (1) << (n_regions - 1)) |
                 (G_GUINT64_CONSTANT (1) << last_span), label);
  return patterns;
}

/**
 * trb_extremes_init:
 * @env: an envelope to empty
 *
 * Sets every maximum to -inf and every minimum to +inf, so the first merge takes over.
 */
void
trb_extremes_init (TrbBeamExtremes *env)
{
  g_return_if_fail (env != NULL);

  memset (env, 0, sizeof *env);
  env->V_max = -INFINITY;
  env->V_min = INFINITY;
  env->M_max = -INFINITY;
  env->M_min = INFINITY;
  env->defl_down = -INFINITY;
  env->defl_up = -INFINITY;
}

/**
 * trb_extremes_merge:
 * @env: the envelope so far
 * @e: one result's extremes
 *
 * Widens @env by @e. Ties keep the earlier value, so the governing combination is the first
 * that reaches the extreme, and the outcome does not depend on anything but the order given.
 *
 * Returns: the #TrbExtremeFlags of the extremes @e took over.
 */
guint
trb_extremes_merge (TrbBeamExtremes       *env,
                    const TrbBeamExtremes *e)
{
  guint took = 0;

  g_return_val_if_fail (env != NULL && e != NULL, 0);

  if (e->V_max > env->V_max)
    {
      env->V_max = e->V_max;
      env->V_max_x = e->V_max_x;
      took |= TRB_EXTREME_V_MAX;
    }
  if (e->V_min < env->V_min)
    {
      env->V_min = e->V_min;
      env->V_min_x = e->V_min_x;
      took |= TRB_EXTREME_V_MIN;
    }
  if (e->M_max > env->M_max)
    {
      env->M_max = e->M_max;
      env->M_max_x = e->M_max_x;
      took |= TRB_EXTREME_M_MAX;
    }
  if (e->M_min < env->M_min)
    {
      env->M_min = e->M_min;
      env->M_min_x = e->M_min_x;
      took |= TRB_EXTREME_M_MIN;
    }
  if (e->defl_down > env->defl_down)
    {
      env->defl_down = e->defl_down;
      env->defl_down_x = e->defl_down_x;
      took |= TRB_EXTREME_DEFL_DOWN;
    }
  if (e->defl_up > env->defl_up)
    {
      env->defl_up = e->defl_up;
      env->defl_up_x = e->defl_up_x;
      took |= TRB_EXTREME_DEFL_UP;
    }
  return took;
}
