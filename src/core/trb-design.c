/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-design.h"

#include <math.h>
#include <string.h>

/**
 * trb_check_ratio:
 * @demand: a check's demand
 * @capacity: its capacity
 *
 * Returns: the ratio trb_check_set() gives: |demand| / capacity; a zero capacity with a
 *   demand is a failure (inf), not a division by zero
 */
double
trb_check_ratio (double demand,
                 double capacity)
{
  if (capacity > 0)
    return fabs (demand) / capacity;
  return demand == 0 ? 0 : INFINITY;
}

void
trb_check_set (TrbCheck     *check,
               const char   *name,
               const char   *clause,
               TrbDimension  dimension,
               double        demand,
               double        capacity,
               const char   *combination,
               double        x)
{
  g_return_if_fail (check != NULL);

  memset (check, 0, sizeof *check);
  g_strlcpy (check->name, name, sizeof check->name);
  g_strlcpy (check->clause, clause, sizeof check->clause);
  check->dimension = dimension;
  check->demand = demand;
  check->capacity = capacity;
  check->ratio = trb_check_ratio (demand, capacity);
  g_strlcpy (check->combination, combination != NULL ? combination : "", sizeof check->combination);
  check->x = x;
}

void
trb_check_append_not_checked (GArray     *checks,
                              const char *clause,
                              const char *detail)
{
  TrbCheck check;

  g_return_if_fail (checks != NULL);

  trb_check_set (&check, "Not checked", clause != NULL ? clause : "", TRB_DIM_MOMENT,
                 NAN, NAN, "", 0);
  /* NAN compares false with every limit; whoever reads this entry must see "not checked",
   * never a number that could pass. */
  check.ratio = NAN;
  g_strlcpy (check.detail, detail != NULL ? detail : "", sizeof check.detail);
  g_array_append_val (checks, check);
}

typedef struct
{
  const char *name;
  const char *text;    /* as printed */
  double      factor;  /* SI per unit */
} DetailUnit;

static const DetailUnit detail_units[] = {
  { "ft", "ft", TRB_FT },
  { "in", "in", TRB_IN },
  { "in2", "in²", TRB_IN * TRB_IN },
  { "in3", "in³", TRB_IN * TRB_IN * TRB_IN },
  { "in4", "in⁴", TRB_IN * TRB_IN * TRB_IN * TRB_IN },
  { "lb", "lb", TRB_LBF },
  { "kip", "kips", TRB_KIP },
  { "kip-ft", "kip-ft", TRB_KIP_FT },
  { "ksi", "ksi", TRB_KSI },
  { "psi", "psi", TRB_PSI },
  { "m", "m", 1.0 },
  { "mm", "mm", 1e-3 },
  { "mm2", "mm²", 1e-6 },
  { "mm3", "mm³", 1e-9 },
  { "mm4", "mm⁴", 1e-12 },
  { "kN", "kN", 1e3 },
  { "kN-m", "kN·m", 1e3 },
  { "MPa", "MPa", 1e6 },
};

/* Whether the number printed in @buf ("-12.30", "0.00100") is at least 10^@k in magnitude,
 * read from its digits: what parsing it and comparing with pow (10, k) gives (the two differ
 * by far more than a rounding), without the parse. */
static gboolean
reaches_power (const char *buf,
               int         k)
{
  const char *p = buf;
  const char *dot;
  int n_int = 0;

  if (*p == '-')
    p++;
  while (*p == '0')
    p++;
  dot = p;
  while (g_ascii_isdigit (*dot))
    dot++;
  n_int = (int) (dot - p);
  if (k >= 0)
    return n_int > k;
  if (n_int > 0)
    return TRUE;
  /* 10^k with k < 0: some digit among the first -k decimals is not zero */
  if (*dot != '.')
    return FALSE;
  for (int i = 1; i <= -k && g_ascii_isdigit (dot[i]); i++)
    if (dot[i] != '0')
      return TRUE;
  return FALSE;
}

/* g_snprintf (buf, size, "%.*f", decimals, v), in integers where they hold it
 * exactly: v = m 2^e with m < 2^53, so v 10^d = m 5^d 2^(e + d), rounded to an integer as
 * printf rounds the exact value (to nearest, a tie to even); printf itself where the
 * integers would not hold it. The details of every check print many numbers this way. */
static void
print_fixed (char   *buf,
             gsize   size,
             double  v,
             int     decimals)
{
#ifdef __SIZEOF_INT128__
  unsigned __int128 p, q;
  char digits[48];
  guint nd = 0;
  gsize k = 0;
  int e, s;

  if (decimals < 0 || decimals > 20 || !isfinite (v) || size == 0)
    goto printf;
  p = (guint64) ldexp (frexp (fabs (v), &e), 53);   /* |v| = p 2^(e - 53), exactly */
  for (int i = 0; i < decimals; i++)
    p *= 5;                                          /* below 2^53 5^20 < 2^100 */
  s = 53 - e - decimals;                             /* |v| 10^d = p 2^-s */
  if (s > 0)
    {
      unsigned __int128 half, rem;

      if (s > 120)
        goto printf;
      half = (unsigned __int128) 1 << (s - 1);
      rem = p & ((half << 1) - 1);
      q = p >> s;
      if (rem > half || (rem == half && (q & 1) != 0))
        q++;
    }
  else
    {
      if (-s > 26)
        goto printf;
      q = p << -s;
    }
  /* the digits: in 64 bits where they fit (a division by 10 there is a multiplication, in
   * 128 bits a call) */
  while (q >> 64 != 0 && nd < 40)
    {
      digits[nd++] = (char) ('0' + (int) (q % 10));
      q /= 10;
    }
  if (q >> 64 != 0)
    goto printf;
  {
    guint64 q64 = (guint64) q;

    do
      {
        digits[nd++] = (char) ('0' + (int) (q64 % 10));
        q64 /= 10;
      }
    while (q64 > 0 && nd < 40);
    if (q64 > 0)
      goto printf;
  }
  while (nd < (guint) decimals + 1)
    digits[nd++] = '0';

  /* as snprintf: what fits of the text, always terminated */
#define PUT(ch) G_STMT_START { if (k + 1 < size) buf[k] = (ch); k++; } G_STMT_END
  if (signbit (v))
    PUT ('-');
  while (nd > 0)
    {
      if (nd == (guint) decimals && decimals > 0)
        PUT ('.');
      nd--;
      PUT (digits[nd]);
    }
#undef PUT
  buf[MIN (k, size - 1)] = '\0';
  return;

printf:
#endif
  g_snprintf (buf, size, "%.*f", decimals, v);
}

/**
 * trb_design_print_fixed:
 * @buf: (out caller-allocates): where the text goes
 * @size: its room
 * @value: the value
 * @decimals: the decimals, 0 to 20
 *
 * What g_snprintf (buf, size, "%.*f", decimals, value) prints, the same bytes, mostly
 * without printf.
 *
 * Returns: buf
 */
const char *
trb_design_print_fixed (char   *buf,
                        gsize   size,
                        double  value,
                        int     decimals)
{
  g_return_val_if_fail (buf != NULL && size > 0, buf);

  print_fixed (buf, size, value, decimals);
  return buf;
}

/* Three significant figures, as the trade's tables print them: 5.83, 16.9, 379, 1060. */
static void
format_3sf (char   *buf,
            gsize   size,
            double  v)
{
  int decimals;

  if (!isfinite (v))
    {
      g_strlcpy (buf, isnan (v) ? "-" : "inf", size);
      return;
    }
  if (v == 0)
    {
      g_strlcpy (buf, "0", size);
      return;
    }
  decimals = 2 - (int) floor (log10 (fabs (v)));
  if (decimals <= 0)
    {
      double step = pow (10, -decimals);

      print_fixed (buf, size, round (v / step) * step, 0);
      return;
    }
  print_fixed (buf, size, v, decimals);
  /* rounding may carry into another digit (9.996 -> "10.00"): print again with one less */
  if (reaches_power (buf, 3 - decimals))
    print_fixed (buf, size, v, decimals - 1);
}

const char *
trb_design_format (char       *buf,
                   gsize       size,
                   double      value,
                   const char *unit)
{
  char num[48];

  g_return_val_if_fail (buf != NULL && size > 0, buf);
  g_return_val_if_fail (unit != NULL, buf);

  for (guint i = 0; i < G_N_ELEMENTS (detail_units); i++)
    {
      if (g_strcmp0 (detail_units[i].name, unit) != 0)
        continue;
      format_3sf (num, sizeof num, value / detail_units[i].factor);
      /* what "%s %s" prints, truncation and all, without the printf */
      g_strlcpy (buf, num, size);
      g_strlcat (buf, " ", size);
      g_strlcat (buf, detail_units[i].text, size);
      return buf;
    }

  g_critical ("%s: unknown unit “%s”", G_STRFUNC, unit);
  format_3sf (num, sizeof num, value);
  g_strlcpy (buf, num, size);
  return buf;
}

/* g_snprintf (label, size, "span %u", n), without the formatting machinery: sizing cuts the
 * spans of a member several times */
static void
span_label (char  *label,
            gsize  size,
            guint  n)
{
  char digits[16];
  guint nd = 0;
  gsize k = 0;

  do
    {
      digits[nd++] = (char) ('0' + n % 10);
      n /= 10;
    }
  while (n > 0);
  for (const char *p = "span "; *p != '\0' && k + 1 < size; p++)
    label[k++] = *p;
  while (nd > 0 && k + 1 < size)
    label[k++] = digits[--nd];
  label[k] = '\0';
}

/**
 * trb_design_deflection_spans:
 * @input: the member (its length and supports)
 * @spans: (out caller-allocates) (array length=max_spans): where the spans go
 * @max_spans: their room; n_supports + 1 is always enough
 *
 * The spans and overhangs the deflection limits judge, left to right: a left overhang (a
 * "cantilever" on a single support), each span between supports more than a billionth of
 * the length apart, a right overhang.
 *
 * Returns: how many
 */
guint
trb_design_deflection_spans (const TrbDesignInput *input,
                             TrbDeflectionSpan    *spans,
                             guint                 max_spans)
{
  const double tol = 1e-9 * MAX (input->length, 1.0);
  guint n = 0;
  guint n_sup = input->n_supports;

  if (n_sup == 0)
    return 0;

  if (input->supports[0].x > tol && n < max_spans)
    {
      TrbDeflectionSpan *s = &spans[n++];

      s->a = 0;
      s->b = input->supports[0].x;
      s->judged = 2 * (s->b - s->a);
      s->overhang = TRUE;
      g_strlcpy (s->label, n_sup == 1 ? "cantilever" : "left overhang", sizeof s->label);
    }

  for (guint i = 0; i + 1 < n_sup && n < max_spans; i++)
    {
      TrbDeflectionSpan *s;

      if (input->supports[i + 1].x - input->supports[i].x <= tol)
        continue;
      s = &spans[n++];
      s->a = input->supports[i].x;
      s->b = input->supports[i + 1].x;
      s->judged = s->b - s->a;
      s->overhang = FALSE;
      span_label (s->label, sizeof s->label, i + 1);
    }

  if (input->length - input->supports[n_sup - 1].x > tol && n < max_spans)
    {
      TrbDeflectionSpan *s = &spans[n++];

      s->a = input->supports[n_sup - 1].x;
      s->b = input->length;
      s->judged = 2 * (s->b - s->a);
      s->overhang = TRUE;
      g_strlcpy (s->label, n_sup == 1 ? "cantilever" : "right overhang", sizeof s->label);
    }

  return n;
}

/**
 * trb_design_deflection_demand:
 * @ext: the extremes of a result over a span
 * @x: (out): where the demand is
 *
 * Supports do not move, so within a span the deflection is measured from the chord; over
 * an overhang it is the absolute movement, largest at the tip in practice (the whole
 * overhang is searched so an upward-and-back shape is not missed).
 *
 * Returns: the larger of the downward and upward deflection, the downward one on a tie
 */
double
trb_design_deflection_demand (const TrbBeamExtremes *ext,
                              double                *x)
{
  if (ext->defl_down >= ext->defl_up)
    {
      *x = ext->defl_down_x;
      return ext->defl_down;
    }
  *x = ext->defl_up_x;
  return ext->defl_up;
}

/* Appends what "%.0f" prints of v: a whole number below 1e15 digit by digit (exactly what
 * printf gives it), anything else by printf. */
static void
append_whole (char   *buf,
              gsize   size,
              double  v)
{
  char num[352];

  if (v >= 0 && v < 1e15 && v == floor (v) && !signbit (v))
    {
      guint64 n = (guint64) v;
      char *p = num + sizeof num - 1;

      *p = '\0';
      do
        {
          *--p = (char) ('0' + n % 10);
          n /= 10;
        }
      while (n > 0);
      g_strlcat (buf, p, size);
      return;
    }
  g_snprintf (num, sizeof num, "%.0f", v);
  g_strlcat (buf, num, size);
}

/**
 * trb_design_deflection_check:
 * @input: the member (for the unit system of the text)
 * @span: the span judged
 * @limit: the limit as a span ratio denominator (360 for L/360), above 0
 * @live: the live-load limit ("Live deflection") or the total-load one
 * @defl: the deflection demand over the span (trb_design_deflection_demand())
 * @x: where
 * @combination: the combination named in the check
 * @check: (out): the check, with its detail text
 *
 * The check trb_design_check_deflection() makes on one span.
 */
void
trb_design_deflection_check (const TrbDesignInput    *input,
                             const TrbDeflectionSpan *span,
                             double                   limit,
                             gboolean                 live,
                             double                   defl,
                             double                   x,
                             const char              *combination,
                             TrbCheck                *check)
{
  const char *span_unit = input->units == TRB_UNIT_SYSTEM_SI ? "m" : "ft";
  char len_text[32];
  char actual[32];

  trb_check_set (check, live ? "Live deflection" : "Total deflection",
                 span->overhang ? "IBC 2021 Table 1604.3, note i" : "IBC 2021 Table 1604.3",
                 TRB_DIM_LENGTH, defl, span->judged / limit, combination, x);
  if (input->no_detail)
    return;
  if (check->demand > 0)
    {
      g_strlcpy (actual, "L/", sizeof actual);
      append_whole (actual, sizeof actual, floor (span->judged / check->demand));
    }
  else
    g_strlcpy (actual, "no deflection", sizeof actual);
  trb_design_format (len_text, sizeof len_text, span->b - span->a, span_unit);
  /* "%s, limit L/%.0f; %s, L = %s" (2 × before the length of an overhang), joined without
   * a printf: the same bytes, truncated alike */
  g_strlcpy (check->detail, actual, sizeof check->detail);
  g_strlcat (check->detail, ", limit L/", sizeof check->detail);
  append_whole (check->detail, sizeof check->detail, limit);
  g_strlcat (check->detail, "; ", sizeof check->detail);
  g_strlcat (check->detail, span->label, sizeof check->detail);
  g_strlcat (check->detail, span->overhang ? ", L = 2 × " : ", L = ", sizeof check->detail);
  g_strlcat (check->detail, len_text, sizeof check->detail);
}

static void
check_deflection_one (const TrbDesignInput *input,
                      const TrbBeamResult  *result,
                      double                limit,
                      gboolean              live,
                      GArray               *checks)
{
  g_autofree TrbDeflectionSpan *sp = NULL;
  guint n;
  gboolean have = FALSE;
  double best_ratio = 0, best_defl = 0, best_x = 0;
  const TrbDeflectionSpan *best_span = NULL;
  TrbCheck check;

  /* No result, or limit 0 (none): nothing is checked and nothing is claimed. */
  if (result == NULL || !(limit > 0))
    return;

  sp = g_new0 (TrbDeflectionSpan, input->n_supports + 1);
  n = trb_design_deflection_spans (input, sp, input->n_supports + 1);

  for (guint i = 0; i < n; i++)
    {
      const TrbDeflectionSpan *s = &sp[i];
      TrbBeamExtremes ext;
      double defl, x, ratio;

      trb_beam_result_extremes (result, s->a, s->b, &ext);
      defl = trb_design_deflection_demand (&ext, &x);
      ratio = trb_check_ratio (defl, s->judged / limit);
      if (!have || ratio > best_ratio)
        {
          best_ratio = ratio;
          best_defl = defl;
          best_x = x;
          best_span = s;
          have = TRUE;
        }
    }

  if (!have)
    return;
  trb_design_deflection_check (input, best_span, limit, live, best_defl, best_x,
                               live ? "Live" : "Total", &check);
  g_array_append_val (checks, check);
}

void
trb_design_check_deflection (const TrbDesignInput *input,
                             GArray               *checks)
{
  g_return_if_fail (input != NULL);
  g_return_if_fail (checks != NULL);
  g_return_if_fail (input->n_supports == 0 || input->supports != NULL);

  check_deflection_one (input, input->live, input->live_limit, TRUE, checks);
  check_deflection_one (input, input->total, input->total_limit, FALSE, checks);
}
