/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <gio/gio.h>
#include <glib/gstdio.h>
#include <float.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "trb-combos.h"
#include "trb-error.h"
#include "trb-project-io.h"
#include "trb-units.h"

/* ---- saving -------------------------------------------------------------------------------- */

/* The units a quantity may be written in, by dimension, tried in this order; the shortest text
 * that reads back to exactly the same double wins (on a tie, the earlier unit). SI base units
 * come last in either system: with a factor of one, the shortest decimal form of any double
 * reads back exactly in them, so every quantity has a text. */
static const char * const file_units_us[TRB_N_DIMS][3] = {
  [TRB_DIM_LENGTH] = { "ft", "in", NULL },
  [TRB_DIM_FORCE] = { "kip", "lb", NULL },
  [TRB_DIM_LINE_LOAD] = { "kip/ft", "plf", NULL },
  [TRB_DIM_AREA_LOAD] = { "psf", "ksf", NULL },
  [TRB_DIM_MOMENT] = { "kip*ft", "lb*ft", NULL },
  [TRB_DIM_STRESS] = { "ksi", "psi", NULL },
  [TRB_DIM_AREA] = { "in2", NULL },
  [TRB_DIM_SECTION_MODULUS] = { "in3", NULL },
  [TRB_DIM_INERTIA] = { "in4", NULL },
  [TRB_DIM_WARPING] = { "in6", NULL },
  [TRB_DIM_WEIGHT_PER_LENGTH] = { "lb/ft", NULL },
  [TRB_DIM_DENSITY] = { "pcf", NULL },
};

static const char * const file_units_si[TRB_N_DIMS][3] = {
  [TRB_DIM_LENGTH] = { "m", "mm", NULL },
  [TRB_DIM_FORCE] = { "kN", NULL },
  [TRB_DIM_LINE_LOAD] = { "kN/m", NULL },
  [TRB_DIM_AREA_LOAD] = { "kPa", NULL },
  [TRB_DIM_MOMENT] = { "kN*m", NULL },
  [TRB_DIM_STRESS] = { "MPa", "GPa", NULL },
  [TRB_DIM_AREA] = { "mm2", NULL },
  [TRB_DIM_SECTION_MODULUS] = { "mm3", NULL },
  [TRB_DIM_INERTIA] = { "mm4", NULL },
  [TRB_DIM_WARPING] = { "mm6", NULL },
  [TRB_DIM_WEIGHT_PER_LENGTH] = { "kg/m", NULL },
  [TRB_DIM_DENSITY] = { "kN/m3", NULL },
};

static const char * const file_units_base[TRB_N_DIMS] = {
  [TRB_DIM_LENGTH] = "m",
  [TRB_DIM_FORCE] = "N",
  [TRB_DIM_LINE_LOAD] = "N/m",
  [TRB_DIM_AREA_LOAD] = "Pa",
  [TRB_DIM_MOMENT] = "N*m",
  [TRB_DIM_STRESS] = "Pa",
  [TRB_DIM_AREA] = "m2",
  [TRB_DIM_SECTION_MODULUS] = "m3",
  [TRB_DIM_INERTIA] = "m4",
  [TRB_DIM_WARPING] = "m6",
  [TRB_DIM_WEIGHT_PER_LENGTH] = "N/m",
  [TRB_DIM_DENSITY] = "N/m3",
};

/* A number with `digits` significant digits (trailing zeros dropped), as the parser reads
 * numbers: a point for the decimal separator; plain decimals from 1e-4 to below 1e7 ("0.35",
 * "300"), else an exponent without "+" or leading zeros ("1.5e-7", "1e8"). */
static void
format_number (char   *buf,
               gsize   size,
               double  n,
               int     digits)
{
  char fmt[16];
  char *e, *m;
  int exponent;

  if (n == 0 || (fabs (n) >= 1e-4 && fabs (n) < 1e7))
    {
      g_snprintf (fmt, sizeof fmt, "%%.%dg", digits);
      g_ascii_formatd (buf, size, fmt, n);
      e = strchr (buf, 'e');
      if (e == NULL)
        return;
      /* %g chose an exponent (for fewer digits than the integer part has): write the same
       * decimal without it; rounding the double nearest to it to no decimals gives it back */
      g_ascii_formatd (buf, size, "%.0f", g_ascii_strtod (buf, NULL));
      return;
    }
  g_snprintf (fmt, sizeof fmt, "%%.%de", digits - 1);
  g_ascii_formatd (buf, size, fmt, n);
  e = strchr (buf, 'e');
  g_assert (e != NULL);
  exponent = atoi (e + 1);
  /* the mantissa without trailing zeros, then the exponent as the parser reads it */
  m = e;
  while (m > buf && m[-1] == '0')
    m--;
  if (m > buf && m[-1] == '.')
    m--;
  g_snprintf (m, size - (gsize) (m - buf), "e%d", exponent);
}

/* The shortest text of a plain number that reads back (g_ascii_strtod) to exactly n. With
 * 15 significant digits, %g gives back any decimal of 15 digits or fewer that a double was
 * read from, trailing zeros dropped (DBL_DIG is 15); only other doubles need 16 or 17. */
static void
format_shortest (char   *buf,
                 gsize   size,
                 double  n)
{
  for (int digits = 15; digits <= 17; digits++)
    {
      format_number (buf, size, n, digits);
      if (g_ascii_strtod (buf, NULL) == n)
        return;
    }
}

/* The units of the table with their factors, as the parser applies them, found once. */
static double
unit_factor (const char   *unit,
             TrbDimension  dim)
{
  static double factors[2][TRB_N_DIMS][3];
  static gsize done = 0;

  if (g_once_init_enter (&done))
    {
      for (int system = 0; system < 2; system++)
        for (int d = 0; d < TRB_N_DIMS; d++)
          {
            const char * const *units = system == 1 ? file_units_si[d] : file_units_us[d];

            for (guint u = 0; u < 3 && units[u] != NULL; u++)
              {
                g_autofree char *text = g_strconcat ("1 ", units[u], NULL);

                factors[system][d][u] = NAN;
                if (!trb_units_parse (text, d, &factors[system][d][u], NULL))
                  g_critical ("the units module does not read \"%s\"", text);
              }
          }
      g_once_init_leave (&done, 1);
    }
  for (int system = 0; system < 2; system++)
    {
      const char * const *units = system == 1 ? file_units_si[dim] : file_units_us[dim];

      for (guint u = 0; u < 3 && units[u] != NULL; u++)
        if (units[u] == unit)
          return factors[system][dim][u];
    }
  g_assert_not_reached ();
}

static gboolean
reads_back (const char   *text,
            TrbDimension  dim,
            double        value)
{
  double v;

  return trb_units_parse (text, dim, &v, NULL) && v == value;
}

/* How long the numbers of a text are (every word that starts like a number; units never
 * do): what candidates are judged by, so "26 ft" beats "300 in" and "7.9248 m", and "400 mm"
 * and "0.4 m" tie. */
static int
count_digits (const char *text)
{
  int n = 0;
  gboolean in_number = FALSE;

  for (const char *p = text; *p != '\0'; p++)
    {
      if (*p == ' ')
        in_number = FALSE;
      else if (p == text || p[-1] == ' ')
        in_number = g_ascii_isdigit (*p) || *p == '-' || *p == '.';
      if (in_number)
        n++;
    }
  return n;
}

/* The text "<n> <unit>" that reads back to exactly value, with as few digits as it takes
 * (15, 16 or 17, trailing zeros dropped), or NULL. The parser reads it as the number times
 * the unit's factor; the winner is read back once more by the parser itself. */
static char *
unit_candidate (double        value,
                const char   *unit,
                double        factor)
{
  double n = value / factor;
  char num[64];

  if (!isfinite (n))
    return NULL;
  for (int digits = 15; digits <= 17; digits++)
    {
      format_number (num, sizeof num, n, digits);
      if (g_ascii_strtod (num, NULL) * factor == value)
        return g_strdup_printf ("%s %s", num, unit);
    }
  return NULL;
}

/* "F ft I in", which the parser reads as F ft + I in: not always the double of any one
 * unit's number ("12 ft 6 in" is not "12.5 ft"). */
static char *
feet_inches_candidate (double value,
                       double feet)
{
  double inches = (fabs (value) - feet * TRB_FT) / TRB_IN;
  char num[64];

  if (feet < 1 || !(inches >= 0 && inches < 12))
    return NULL;
  for (int digits = 15; digits <= 17; digits++)
    {
      g_autofree char *text = NULL;

      format_number (num, sizeof num, inches, digits);
      text = g_strdup_printf ("%s%.0f ft %s in", value < 0 ? "-" : "", feet, num);
      if (reads_back (text, TRB_DIM_LENGTH, value))
        return g_steal_pointer (&text);
    }
  return NULL;
}

static void
consider (char **best,
          char  *candidate)
{
  if (candidate == NULL)
    return;
  if (*best == NULL || count_digits (candidate) < count_digits (*best))
    {
      g_free (*best);
      *best = candidate;
    }
  else
    g_free (candidate);
}

/* The text a quantity is saved as: of the texts that read back to exactly `value`, in the
 * project's units (and, for US lengths, feet and inches) or in SI base units, the one with the
 * shortest numbers; on a tie the earlier (the project's units in the order of the
 * table, then SI). A function of the value alone, so that saving what was loaded from a saved
 * file gives the same bytes. */
static char *
format_quantity_plain (double         value,
                       TrbDimension   dim,
                       TrbUnitSystem  system)
{
  const char * const *units = system == TRB_UNIT_SYSTEM_SI ? file_units_si[dim]
                                                           : file_units_us[dim];
  char *best = NULL;
  char num[64];

  g_assert (dim < TRB_N_DIMS && isfinite (value));

  value += 0.0;   /* -0 is saved as 0 */
  for (guint u = 0; units[u] != NULL; u++)
    consider (&best, unit_candidate (value, units[u], unit_factor (units[u], dim)));
  if (dim == TRB_DIM_LENGTH && system == TRB_UNIT_SYSTEM_US && fabs (value) >= TRB_FT)
    {
      double feet = floor (fabs (value) / TRB_FT);

      consider (&best, feet_inches_candidate (value, feet));
      consider (&best, feet_inches_candidate (value, feet - 1));
    }
  if (best != NULL && !reads_back (best, dim, value))
    g_clear_pointer (&best, g_free);
  format_shortest (num, sizeof num, value);
  consider (&best, g_strdup_printf ("%s %s", num, file_units_base[dim]));
  return best;
}

/* ---- the same texts without printf ---- */

/* 10^0 to 10^22: the powers of ten a double holds exactly */
static const double exact_pow10[] = {
  1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16,
  1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
};

/* The text format_number (n, 15) writes into buf (at least 40 bytes), and in *read_back the
 * double g_ascii_strtod() reads from it, without printf or strtod; FALSE where this cannot be
 * sure, and the caller takes their way.
 *
 * printf rounds the exact value of n to 15 significant digits: the integer nearest to
 * |n| 10^(14-x), x the decimal exponent. That product of two exact doubles is rounded once,
 * and fma() gives its rounding error exactly, so the exact fraction is known; the sum with the
 * double's fraction is rounded too, so a sum of exactly a half goes the long way. (From
 * 10^15 up it is |n| / 10^(x-14), whose error is at most 1/16 below 10^15: fractions within
 * that of a half go the long way.) So do products within one of a power of ten,
 * where x could be one off, and exponents beyond the exact powers. The text is read back as its digits M times 10^q, |q| <= 22: M and 10^q
 * are exact, so the one rounding of the product or quotient is the correctly rounded value,
 * which is what strtod gives. */
static gboolean
quick_number15 (double  n,
                char   *buf,
                double *read_back)
{
  double a = fabs (n), t, f, back;
  char digits[16];
  guint64 m;
  int x, p, q, sig;
  char *out = buf;

#if !defined(FLT_EVAL_METHOD) || FLT_EVAL_METHOD != 0
  /* doubles computed with more precision than their own (x87): the roundings above are not
   * the ones this reasons about */
  return FALSE;
#endif
  if (n == 0 && !signbit (n))
    {
      strcpy (buf, "0");
      *read_back = 0;
      return TRUE;
    }
  if (!isfinite (n) || a < DBL_MIN)
    return FALSE;
  x = (int) floor (log10 (a));
  p = 14 - x;
  if (p < -22 || p > 22)
    return FALSE;
  t = p >= 0 ? a * exact_pow10[p] : a / exact_pow10[-p];
  if (!(t >= 1e14 + 1 && t < 1e15 - 1))
    return FALSE;
  f = t - floor (t);
  if (p >= 0)
    {
      /* the product's rounding error, exactly: the fraction of the exact product is f + r */
      f += fma (a, exact_pow10[p], -t);
      if (f == 0.5)
        return FALSE;
    }
  else if (fabs (f - 0.5) < 0.07)
    return FALSE;
  m = (guint64) floor (t) + (f > 0.5 ? 1 : 0);

  for (int i = 14; i >= 0; i--, m /= 10)
    digits[i] = (char) ('0' + m % 10);
  for (sig = 15; sig > 1 && digits[sig - 1] == '0'; sig--)
    ;
  m = 0;
  for (int i = 0; i < sig; i++)
    m = 10 * m + (guint64) (digits[i] - '0');
  q = x - (sig - 1);
  if (q < -22 || q > 22)
    return FALSE;
  back = q >= 0 ? (double) m * exact_pow10[q] : (double) m / exact_pow10[-q];

  if (n < 0)
    *out++ = '-';
  if (a >= 1e-4 && a < 1e7)
    {
      /* %g's plain form: x is from -4 to 6 here */
      if (x < 0)
        {
          *out++ = '0';
          *out++ = '.';
          for (int i = 0; i < -x - 1; i++)
            *out++ = '0';
          memcpy (out, digits, (gsize) sig);
          out += sig;
        }
      else
        {
          memcpy (out, digits, (gsize) x + 1);
          out += x + 1;
          if (sig > x + 1)
            {
              *out++ = '.';
              memcpy (out, digits + x + 1, (gsize) (sig - x - 1));
              out += sig - x - 1;
            }
        }
      *out = '\0';
    }
  else
    {
      *out++ = digits[0];
      if (sig > 1)
        {
          *out++ = '.';
          memcpy (out, digits + 1, (gsize) sig - 1);
          out += sig - 1;
        }
      g_snprintf (out, 16, "e%d", x);
    }
  *read_back = n < 0 ? -back : back;
  return TRUE;
}

/* A candidate of the quick way: none (the long way gives NULL), a text, or one the long way
 * would find only with 16 or 17 digits, whose numbers then take at least 17 characters (a
 * 16-digit number below 10^7 has a point; in the exponent form the "e" and its digits). */
typedef enum
{
  QUICK_NONE,
  QUICK_TEXT,
  QUICK_LONG,
} QuickKind;

#define QUICK_LONG_COUNT 17

typedef struct
{
  QuickKind kind;
  char      text[96];
} Quick;

static gboolean
quick_unit (double      value,
            const char *unit,
            double      factor,
            Quick      *c)
{
  double n = value / factor;
  double back;
  char num[48];

  c->kind = QUICK_NONE;
  if (!isfinite (n))
    return TRUE;
  if (!quick_number15 (n, num, &back))
    return FALSE;
  if (back * factor == value)
    {
      c->kind = QUICK_TEXT;
      g_snprintf (c->text, sizeof c->text, "%s %s", num, unit);
    }
  else
    c->kind = QUICK_LONG;
  return TRUE;
}

static gboolean
quick_feet_inches (double  value,
                   double  feet,
                   Quick  *c)
{
  double inches = (fabs (value) - feet * TRB_FT) / TRB_IN;
  double back;
  char num[48];

  c->kind = QUICK_NONE;
  if (feet < 1 || !(inches >= 0 && inches < 12))
    return TRUE;
  if (feet >= 1e15 || !quick_number15 (inches, num, &back))
    return FALSE;
  /* "%.0f" of a whole number below 2^53 is its digits */
  g_snprintf (c->text, sizeof c->text, "%s%" G_GUINT64_FORMAT " ft %s in",
              value < 0 ? "-" : "", (guint64) feet, num);
  c->kind = reads_back (c->text, TRB_DIM_LENGTH, value) ? QUICK_TEXT : QUICK_LONG;
  return TRUE;
}

/* format_quantity_plain()'s text, found with digits of our own and the parser only where
 * that must judge (feet and inches, and the winner); NULL where the quick way cannot be sure
 * which candidate wins. */
static char *
format_quantity_quick (double         value,
                       TrbDimension   dim,
                       TrbUnitSystem  system)
{
  const char * const *units = system == TRB_UNIT_SYSTEM_SI ? file_units_si[dim]
                                                           : file_units_us[dim];
  Quick c[5], si;
  guint n = 0;
  int best = -1, best_count = G_MAXINT;
  gboolean any_long = FALSE;
  double back;
  char num[48];

  value += 0.0;
  for (guint u = 0; units[u] != NULL; u++)
    if (!quick_unit (value, units[u], unit_factor (units[u], dim), &c[n++]))
      return NULL;
  if (dim == TRB_DIM_LENGTH && system == TRB_UNIT_SYSTEM_US && fabs (value) >= TRB_FT)
    {
      double feet = floor (fabs (value) / TRB_FT);

      if (!quick_feet_inches (value, feet, &c[n++]) ||
          !quick_feet_inches (value, feet - 1, &c[n++]))
        return NULL;
    }
  /* the first of the fewest digits, as consider() keeps it */
  for (guint i = 0; i < n; i++)
    {
      int count;

      any_long |= c[i].kind == QUICK_LONG;
      if (c[i].kind != QUICK_TEXT)
        continue;
      count = count_digits (c[i].text);
      if (count < best_count)
        {
          best = (int) i;
          best_count = count;
        }
    }
  if (any_long && best_count >= QUICK_LONG_COUNT)
    return NULL;
  if (best >= 0 && !reads_back (c[best].text, dim, value))
    {
      best = -1;
      best_count = G_MAXINT;
    }

  /* SI base units: format_shortest() stops at 15 digits when they read back */
  if (!quick_number15 (value, num, &back))
    return NULL;
  if (back == value)
    {
      g_snprintf (si.text, sizeof si.text, "%s %s", num, file_units_base[dim]);
      if (count_digits (si.text) < best_count)
        return g_strdup (si.text);
    }
  else if (best < 0 || best_count >= QUICK_LONG_COUNT)
    return NULL;
  return g_strdup (c[best].text);
}

/* The text a quantity is saved as (format_quantity_plain()), the quick way where it can be */
static char *
format_quantity (double         value,
                 TrbDimension   dim,
                 TrbUnitSystem  system)
{
  char *text = format_quantity_quick (value, dim, system);

  return text != NULL ? text : format_quantity_plain (value, dim, system);
}

/**
 * trb_project_format_quantity:
 * @value: a finite quantity, SI
 * @dim: its dimension
 * @system: the project's units
 * @plain: %TRUE for the reference way (printf and the parser for every candidate)
 *
 * The text trb_project_save_data() writes for @value ("20 ft"). For tests, which hold the
 * quick way to the plain one.
 *
 * Returns: (transfer full): the text
 */
char *
trb_project_format_quantity (double         value,
                             TrbDimension   dim,
                             TrbUnitSystem  system,
                             gboolean       plain)
{
  g_return_val_if_fail (dim < TRB_N_DIMS && isfinite (value), NULL);

  return plain ? format_quantity_plain (value, dim, system)
               : format_quantity (value, dim, system);
}

/* The texts of the quantities written so far, by value and dimension: a floor repeats a few
 * hundred coordinates and loads tens of thousands of times, and format_quantity() tries
 * several units with printf and the parser for each. A pure function of the key, so a memo
 * gives the same bytes. Open addressing, at most half full; it stops taking entries at
 * MEMO_MAX (a few MB) so that a file of distinct values costs no more memory than that. */
#define MEMO_MAX (1u << 16)

typedef struct
{
  guint64  bits;   /* of the value, -0 as 0 */
  guint    dim;    /* TrbDimension + 1; 0 for an empty slot */
  guint    len;
  char    *text;
} MemoSlot;

typedef struct
{
  MemoSlot *slots;
  guint     mask;  /* capacity - 1, a power of two less one */
  guint     used;
} Memo;

static void
memo_clear (Memo *memo)
{
  for (guint i = 0; memo->slots != NULL && i <= memo->mask; i++)
    g_free (memo->slots[i].text);
  g_clear_pointer (&memo->slots, g_free);
  memo->mask = memo->used = 0;
}

static guint
memo_index (const Memo *memo,
            guint64     bits,
            guint       dim)
{
  guint64 h = (bits ^ ((guint64) dim << 59)) * G_GUINT64_CONSTANT (0x9e3779b97f4a7c15);
  guint i = (guint) (h >> 32) & memo->mask;

  while (memo->slots[i].dim != 0 && (memo->slots[i].bits != bits || memo->slots[i].dim != dim))
    i = (i + 1) & memo->mask;
  return i;
}

/* The slot of (bits, dim): its text, or an empty slot to fill; NULL when the memo is full. */
static MemoSlot *
memo_lookup (Memo    *memo,
             guint64  bits,
             guint    dim)
{
  if (memo->slots == NULL)
    {
      memo->mask = 1023;
      memo->slots = g_new0 (MemoSlot, memo->mask + 1);
    }
  else if (2 * (memo->used + 1) > memo->mask + 1)
    {
      MemoSlot *old = memo->slots;
      guint old_mask = memo->mask;

      if (memo->used >= MEMO_MAX)
        {
          MemoSlot *slot = &memo->slots[memo_index (memo, bits, dim)];

          return slot->dim != 0 ? slot : NULL;
        }
      memo->mask = 2 * memo->mask + 1;
      memo->slots = g_new0 (MemoSlot, memo->mask + 1);
      for (guint i = 0; i <= old_mask; i++)
        if (old[i].dim != 0)
          memo->slots[memo_index (memo, old[i].bits, old[i].dim)] = old[i];
      g_free (old);
    }
  return &memo->slots[memo_index (memo, bits, dim)];
}

typedef struct
{
  GString       *out;
  TrbUnitSystem  units;
  GError       **error;
  gboolean       failed;
  /* the element being written, for messages, put together only for one: "settings",
   * kind "name" or, with an index, kind index of floor "name" */
  const char    *what_kind;
  const char    *what_name;
  guint          what_index;
  Memo           memo;
} Saver;

static void
set_what (Saver      *sv,
          const char *kind,
          const char *name,
          guint       index)
{
  sv->what_kind = kind;
  sv->what_name = name;
  sv->what_index = index;
}

static void
put_escaped (GString    *out,
             const char *text,
             gboolean    attribute)
{
  g_autofree char *valid = NULL;
  const char *q;

  /* most texts are printable ASCII with nothing to escape: as they are */
  for (q = text; *q >= 0x20 && *q < 0x7f && *q != '&' && *q != '<' && *q != '>' && *q != '"';
       q++)
    ;
  if (*q == '\0')
    {
      g_string_append_len (out, text, q - text);
      return;
    }
  valid = g_utf8_make_valid (text, -1);

  for (const char *p = valid; *p != '\0'; p++)
    {
      switch (*p)
        {
        case '&':
          g_string_append (out, "&amp;");
          break;
        case '<':
          g_string_append (out, "&lt;");
          break;
        case '>':
          g_string_append (out, "&gt;");
          break;
        case '"':
          g_string_append (out, attribute ? "&quot;" : "\"");
          break;
        case '\r':
          /* a bare CR would become a LF (or a space in an attribute) on reading */
          g_string_append (out, "&#13;");
          break;
        case '\t':
        case '\n':
          if (attribute)
            g_string_append_printf (out, "&#%d;", *p);
          else
            g_string_append_c (out, *p);
          break;
        default:
          /* XML 1.0 has no other control characters, not even as references */
          if ((guchar) *p < 0x20)
            g_string_append (out, "\xef\xbf\xbd");
          else
            g_string_append_c (out, *p);
        }
    }
}

static void
put_attr (Saver      *sv,
          const char *name,
          const char *value)
{
  g_string_append_c (sv->out, ' ');
  g_string_append (sv->out, name);
  g_string_append_len (sv->out, "=\"", 2);
  put_escaped (sv->out, value, TRUE);
  g_string_append_c (sv->out, '"');
}

static void
put_quantity (Saver        *sv,
              const char   *name,
              double        value,
              TrbDimension  dim)
{
  g_autofree char *text = NULL;
  MemoSlot *slot;
  guint64 bits;

  if (!isfinite (value))
    {
      if (!sv->failed)
        {
          g_autofree char *what = NULL;

          if (sv->what_name == NULL)
            what = g_strdup (sv->what_kind);
          else if (sv->what_index > 0)
            what = g_strdup_printf ("%s %u of floor \"%s\"", sv->what_kind, sv->what_index,
                                    sv->what_name);
          else
            what = g_strdup_printf ("%s \"%s\"", sv->what_kind, sv->what_name);
          g_set_error (sv->error, TRB_ERROR, TRB_ERROR_INVALID,
                       "%s: \"%s\" is not a finite number", what, name);
        }
      sv->failed = TRUE;
      return;
    }
  value += 0.0;   /* -0 is saved as 0 */
  memcpy (&bits, &value, sizeof bits);
  slot = memo_lookup (&sv->memo, bits, dim + 1);
  if (slot == NULL)
    {
      text = format_quantity (value, dim, sv->units);
      put_attr (sv, name, text);
      return;
    }
  if (slot->dim == 0)
    {
      /* the texts are numbers and units: nothing to escape */
      slot->text = format_quantity (value, dim, sv->units);
      slot->len = (guint) strlen (slot->text);
      slot->bits = bits;
      slot->dim = dim + 1;
      sv->memo.used++;
    }
  g_string_append_c (sv->out, ' ');
  g_string_append (sv->out, name);
  g_string_append_len (sv->out, "=\"", 2);
  g_string_append_len (sv->out, slot->text, slot->len);
  g_string_append_c (sv->out, '"');
}

static void
put_optional_quantity (Saver        *sv,
                       const char   *name,
                       double        value,
                       TrbDimension  dim)
{
  if (!isnan (value))
    put_quantity (sv, name, value, dim);
}

static void
put_deflection (Saver      *sv,
                const char *name,
                double      n)
{
  char num[64];
  g_autofree char *text = NULL;

  if (isnan (n))
    return;
  if (n == 0)
    {
      put_attr (sv, name, "none");
      return;
    }
  format_shortest (num, sizeof num, n);
  text = g_strconcat ("L/", num, NULL);
  put_attr (sv, name, text);
}

static void
put_indent (Saver *sv,
            int    depth)
{
  for (int i = 0; i < depth; i++)
    g_string_append (sv->out, "  ");
}

static void
put_settings (Saver             *sv,
              const TrbSettings *s)
{
  static const char * const units[] = { "us", "si" };
  char above[16];

  set_what (sv, "settings", NULL, 0);
  put_indent (sv, 1);
  g_string_append (sv->out, "<settings");
  put_attr (sv, "method", trb_method_name (s->method));
  put_optional_quantity (sv, "fb-allow", s->fb_allow, TRB_DIM_STRESS);
  put_optional_quantity (sv, "fv-allow", s->fv_allow, TRB_DIM_STRESS);
  if (s->steel_grade != NULL)
    put_attr (sv, "steel-grade", s->steel_grade);
  put_attr (sv, "self-weight", s->self_weight ? "include" : "exclude");
  put_attr (sv, "live-patterns", s->live_patterns ? "on" : "off");
  put_deflection (sv, "deflection-live", s->deflection_live);
  put_deflection (sv, "deflection-total", s->deflection_total);
  put_attr (sv, "units", units[s->units == TRB_UNIT_SYSTEM_SI ? 1 : 0]);
  put_attr (sv, "live-load-reduction", s->live_load_reduction ? "on" : "off");
  g_snprintf (above, sizeof above, "%d", s->floors_above);
  put_attr (sv, "floors-above", above);
  g_string_append (sv->out, "/>\n");
}

static void
put_sections (Saver            *sv,
              const TrbProject *project)
{
  for (guint i = 0; i < project->sections_sources->len; i++)
    {
      const TrbSectionsSource *src = g_ptr_array_index (project->sections_sources, i);

      put_indent (sv, 1);
      if (src->file != NULL)
        {
          g_string_append (sv->out, "<sections");
          put_attr (sv, "file", src->file);
          g_string_append (sv->out, "/>\n");
        }
      else
        {
          /* the table as it was, from the line after the tag (the loader trims it) */
          g_string_append (sv->out, "<sections>\n");
          put_escaped (sv->out, src->csv, FALSE);
          g_string_append (sv->out, "\n");
          put_indent (sv, 1);
          g_string_append (sv->out, "</sections>\n");
        }
    }
}

/* Material, section and the design attributes, as the loader reads them: only those that
 * belong with the member's material and section. */
static void
put_design (Saver           *sv,
            const TrbMember *m)
{
  put_attr (sv, "material", trb_material_name (m->material));
  put_attr (sv, "section", m->section != NULL ? m->section : "auto");
  if (trb_member_is_custom (m))
    {
      put_quantity (sv, "E", m->E, TRB_DIM_STRESS);
      put_quantity (sv, "I", m->I, TRB_DIM_INERTIA);
      put_optional_quantity (sv, "S", m->S, TRB_DIM_SECTION_MODULUS);
      put_optional_quantity (sv, "A", m->A, TRB_DIM_AREA);
      put_optional_quantity (sv, "d", m->d, TRB_DIM_LENGTH);
      put_optional_quantity (sv, "tw", m->tw, TRB_DIM_LENGTH);
      put_optional_quantity (sv, "weight", m->weight, TRB_DIM_WEIGHT_PER_LENGTH);
    }
  if (m->has_method)
    put_attr (sv, "method", trb_method_name (m->method));
  put_optional_quantity (sv, "fb-allow", m->fb_allow, TRB_DIM_STRESS);
  put_optional_quantity (sv, "fv-allow", m->fv_allow, TRB_DIM_STRESS);
  if (m->material == TRB_MATERIAL_STEEL && m->steel_grade != NULL)
    put_attr (sv, "steel-grade", m->steel_grade);
  put_deflection (sv, "deflection-live", m->deflection_live);
  put_deflection (sv, "deflection-total", m->deflection_total);
  /* written only where it differs from what the loader assumes: continuous, or points when
   * the member has braces */
  if (m->braces->len > 0 && m->bracing == TRB_BRACING_CONTINUOUS)
    put_attr (sv, "bracing", "continuous");
  else if (m->braces->len == 0 && m->bracing == TRB_BRACING_POINTS)
    put_attr (sv, "bracing", "supports");
  put_optional_quantity (sv, "max-depth", m->max_depth, TRB_DIM_LENGTH);
  put_optional_quantity (sv, "min-depth", m->min_depth, TRB_DIM_LENGTH);
  if (m->allowed != NULL && m->allowed[0] != NULL)
    {
      g_autofree char *list = g_strjoinv (" ", m->allowed);

      put_attr (sv, "allowed", list);
    }
  if (m->max_plies > 0)
    {
      char plies[16];

      g_snprintf (plies, sizeof plies, "%d", m->max_plies);
      put_attr (sv, "max-plies", plies);
    }
  if (m->material == TRB_MATERIAL_WOOD)
    {
      if (m->species != NULL)
        put_attr (sv, "species", m->species);
      if (m->grade != NULL)
        put_attr (sv, "grade", m->grade);
      if (m->wet_service)
        put_attr (sv, "wet-service", "yes");
      if (m->incised)
        put_attr (sv, "incised", "yes");
      if (m->repetitive)
        put_attr (sv, "repetitive", "yes");
      put_optional_quantity (sv, "bearing-length", m->bearing_length, TRB_DIM_LENGTH);
    }
}

static void
put_member_children (Saver           *sv,
                     const TrbMember *m,
                     int              depth)
{
  for (guint i = 0; i < m->supports->len; i++)
    {
      const TrbMemberSupport *s = &g_array_index (m->supports, TrbMemberSupport, i);

      put_indent (sv, depth);
      g_string_append (sv->out, "<support");
      put_quantity (sv, "at", s->support.x, TRB_DIM_LENGTH);
      put_attr (sv, "type", trb_support_type_name (s->support.type));
      g_string_append (sv->out, "/>\n");
    }
  for (guint i = 0; i < m->braces->len; i++)
    {
      put_indent (sv, depth);
      g_string_append (sv->out, "<brace");
      put_quantity (sv, "at", g_array_index (m->braces, TrbMemberBrace, i).x, TRB_DIM_LENGTH);
      g_string_append (sv->out, "/>\n");
    }
  for (guint i = 0; i < m->loads->len; i++)
    {
      const TrbMemberLoad *l = &g_array_index (m->loads, TrbMemberLoad, i);

      put_indent (sv, depth);
      g_string_append (sv->out, "<load");
      put_attr (sv, "case", trb_load_case_name (l->lcase));
      put_attr (sv, "type", trb_load_kind_name (l->load.kind));
      switch (l->load.kind)
        {
        case TRB_LOAD_POINT:
          put_quantity (sv, "at", l->load.a, TRB_DIM_LENGTH);
          put_quantity (sv, "p", l->load.w1, TRB_DIM_FORCE);
          break;
        case TRB_LOAD_MOMENT:
          put_quantity (sv, "at", l->load.a, TRB_DIM_LENGTH);
          put_quantity (sv, "m", l->load.w1, TRB_DIM_MOMENT);
          break;
        case TRB_LOAD_UNIFORM:
          put_quantity (sv, "from", l->load.a, TRB_DIM_LENGTH);
          put_quantity (sv, "to", l->load.b, TRB_DIM_LENGTH);
          put_quantity (sv, "w", l->load.w1, TRB_DIM_LINE_LOAD);
          break;
        case TRB_LOAD_LINEAR:
          put_quantity (sv, "from", l->load.a, TRB_DIM_LENGTH);
          put_quantity (sv, "to", l->load.b, TRB_DIM_LENGTH);
          put_quantity (sv, "w1", l->load.w1, TRB_DIM_LINE_LOAD);
          put_quantity (sv, "w2", l->load.w2, TRB_DIM_LINE_LOAD);
          break;
        default:
          g_assert_not_reached ();
        }
      g_string_append (sv->out, "/>\n");
    }
  for (guint i = 0; i < m->bearing_points->len; i++)
    {
      const TrbFramePoint *p = &g_array_index (m->bearing_points, TrbFramePoint, i);

      put_indent (sv, depth);
      g_string_append (sv->out, "<bears-on");
      put_quantity (sv, "x", p->x, TRB_DIM_LENGTH);
      put_quantity (sv, "y", p->y, TRB_DIM_LENGTH);
      g_string_append (sv->out, "/>\n");
    }
}

static gboolean
member_has_children (const TrbMember *m)
{
  return m->supports->len > 0 || m->braces->len > 0 || m->loads->len > 0 ||
         m->bearing_points->len > 0;
}

static void
close_element (Saver      *sv,
               gboolean    children,
               int         depth,
               const char *name)
{
  if (children)
    {
      put_indent (sv, depth);
      g_string_append_printf (sv->out, "</%s>\n", name);
    }
}

static void
put_beam (Saver           *sv,
          const TrbMember *m)
{
  gboolean children = member_has_children (m);

  set_what (sv, "beam", m->id, 0);
  put_indent (sv, 1);
  g_string_append (sv->out, "<beam");
  put_attr (sv, "id", m->id);
  put_quantity (sv, "length", m->length, TRB_DIM_LENGTH);
  put_design (sv, m);
  g_string_append (sv->out, children ? ">\n" : "/>\n");
  put_member_children (sv, m, 2);
  close_element (sv, children, 1, "beam");
}

static void
put_member (Saver           *sv,
            const TrbMember *m)
{
  gboolean children = member_has_children (m);

  set_what (sv, "member", m->id, 0);
  put_indent (sv, 2);
  g_string_append (sv->out, "<member");
  put_attr (sv, "id", m->id);
  put_attr (sv, "role", trb_role_name (m->role));
  put_quantity (sv, "x1", m->start.x, TRB_DIM_LENGTH);
  put_quantity (sv, "y1", m->start.y, TRB_DIM_LENGTH);
  put_quantity (sv, "x2", m->end.x, TRB_DIM_LENGTH);
  put_quantity (sv, "y2", m->end.y, TRB_DIM_LENGTH);
  put_design (sv, m);
  if (m->group != NULL)
    put_attr (sv, "group", m->group);
  if (m->carries_deck != (m->role != TRB_FRAME_ROLE_GIRDER))
    put_attr (sv, "deck", m->carries_deck ? "yes" : "no");
  g_string_append (sv->out, children ? ">\n" : "/>\n");
  put_member_children (sv, m, 3);
  close_element (sv, children, 2, "member");
}

static void
put_points (Saver        *sv,
            const GArray *points,
            int           depth)
{
  for (guint i = 0; i < points->len; i++)
    {
      const TrbFramePoint *p = &g_array_index (points, TrbFramePoint, i);

      put_indent (sv, depth);
      g_string_append (sv->out, "<point");
      put_quantity (sv, "x", p->x, TRB_DIM_LENGTH);
      put_quantity (sv, "y", p->y, TRB_DIM_LENGTH);
      g_string_append (sv->out, "/>\n");
    }
}

static void
put_floor (Saver          *sv,
           const TrbFloor *f)
{
  gboolean children = f->grids->len + f->columns->len + f->walls->len + f->members->len +
                      f->area_loads->len + f->openings->len + f->line_loads->len +
                      f->point_loads->len > 0;

  set_what (sv, "floor", f->name, 0);
  put_indent (sv, 1);
  g_string_append (sv->out, "<floor");
  put_attr (sv, "name", f->name);
  g_string_append (sv->out, children ? ">\n" : "/>\n");

  for (guint i = 0; i < f->grids->len; i++)
    {
      const TrbGridLine *g = g_ptr_array_index (f->grids, i);

      set_what (sv, "grid line", g->name, 0);
      put_indent (sv, 2);
      g_string_append (sv->out, "<grid");
      put_attr (sv, "name", g->name);
      put_quantity (sv, "x1", g->start.x, TRB_DIM_LENGTH);
      put_quantity (sv, "y1", g->start.y, TRB_DIM_LENGTH);
      put_quantity (sv, "x2", g->end.x, TRB_DIM_LENGTH);
      put_quantity (sv, "y2", g->end.y, TRB_DIM_LENGTH);
      g_string_append (sv->out, "/>\n");
    }
  for (guint i = 0; i < f->columns->len; i++)
    {
      const TrbColumn *c = g_ptr_array_index (f->columns, i);

      set_what (sv, "column", c->id, 0);
      put_indent (sv, 2);
      g_string_append (sv->out, "<column");
      put_attr (sv, "id", c->id);
      put_quantity (sv, "x", c->at.x, TRB_DIM_LENGTH);
      put_quantity (sv, "y", c->at.y, TRB_DIM_LENGTH);
      if (c->section != NULL)
        put_attr (sv, "section", c->section);
      g_string_append (sv->out, "/>\n");
    }
  for (guint i = 0; i < f->walls->len; i++)
    {
      const TrbWall *w = g_ptr_array_index (f->walls, i);

      set_what (sv, "wall", w->id, 0);
      put_indent (sv, 2);
      g_string_append (sv->out, "<wall");
      put_attr (sv, "id", w->id);
      if (w->material != NULL)
        put_attr (sv, "material", w->material);
      g_string_append (sv->out, ">\n");
      put_points (sv, w->points, 3);
      close_element (sv, TRUE, 2, "wall");
    }
  for (guint i = 0; i < f->members->len; i++)
    put_member (sv, g_ptr_array_index (f->members, i));
  for (guint i = 0; i < f->area_loads->len; i++)
    {
      const TrbAreaLoad *a = g_ptr_array_index (f->area_loads, i);

      set_what (sv, "area load", f->name, i + 1);
      put_indent (sv, 2);
      g_string_append (sv->out, "<area-load");
      put_attr (sv, "case", trb_load_case_name (a->lcase));
      if (a->kind != TRB_AREA_LOAD_ORDINARY)
        put_attr (sv, "kind", trb_area_load_kind_name (a->kind));
      put_quantity (sv, "pressure", a->pressure, TRB_DIM_AREA_LOAD);
      if (a->label != NULL)
        put_attr (sv, "label", a->label);
      if (a->occupancy != NULL)
        put_attr (sv, "occupancy", a->occupancy);
      g_string_append (sv->out, ">\n");
      put_points (sv, a->points, 3);
      close_element (sv, TRUE, 2, "area-load");
    }
  for (guint i = 0; i < f->openings->len; i++)
    {
      const TrbOpening *o = g_ptr_array_index (f->openings, i);

      set_what (sv, "opening", f->name, i + 1);
      put_indent (sv, 2);
      g_string_append (sv->out, "<opening>\n");
      put_points (sv, o->points, 3);
      close_element (sv, TRUE, 2, "opening");
    }
  for (guint i = 0; i < f->line_loads->len; i++)
    {
      const TrbLineLoad *l = g_ptr_array_index (f->line_loads, i);

      set_what (sv, "line load", f->name, i + 1);
      put_indent (sv, 2);
      g_string_append (sv->out, "<line-load");
      put_attr (sv, "case", trb_load_case_name (l->lcase));
      put_quantity (sv, "w", l->w, TRB_DIM_LINE_LOAD);
      if (l->label != NULL)
        put_attr (sv, "label", l->label);
      g_string_append (sv->out, ">\n");
      put_points (sv, l->points, 3);
      close_element (sv, TRUE, 2, "line-load");
    }
  for (guint i = 0; i < f->point_loads->len; i++)
    {
      const TrbPointLoad *p = g_ptr_array_index (f->point_loads, i);

      set_what (sv, "point load", f->name, i + 1);
      put_indent (sv, 2);
      g_string_append (sv->out, "<point-load");
      put_attr (sv, "case", trb_load_case_name (p->lcase));
      put_quantity (sv, "p", p->P, TRB_DIM_FORCE);
      put_quantity (sv, "x", p->at.x, TRB_DIM_LENGTH);
      put_quantity (sv, "y", p->at.y, TRB_DIM_LENGTH);
      if (p->label != NULL)
        put_attr (sv, "label", p->label);
      g_string_append (sv->out, "/>\n");
    }
  close_element (sv, children, 1, "floor");
}

/**
 * trb_project_save_data:
 * @project: a project
 * @length: (out) (optional): the number of bytes, without the closing NUL
 * @error: return location for a #TRB_ERROR
 *
 * Writes the project in the canonical layout of docs/file-format.md: the XML declaration, two
 * spaces of indent per level, one element per line, attributes in a fixed order, quantities in
 * the project's unit system (the shortest text that reads back to exactly the same number,
 * else in SI base units), then settings, sections, standalone beams and floors. Saving what
 * was loaded from a saved file gives the same bytes. Comments of a loaded file are not kept.
 *
 * Returns: (transfer full): the file's bytes, NUL-terminated; or %NULL with @error set
 *   (TRB_ERROR_INVALID) when the model holds a quantity that is not a finite number.
 */
char *
trb_project_save_data (const TrbProject  *project,
                       gsize             *length,
                       GError           **error)
{
  g_autoptr(GString) out = g_string_sized_new (4096);
  Saver sv = { out, TRB_UNIT_SYSTEM_US, error, FALSE, NULL, NULL, 0, { NULL, 0, 0 } };

  g_return_val_if_fail (project != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  sv.units = project->settings.units;
  g_string_append (out, "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
  g_string_append_printf (out, "<trabeate-project format=\"%d\">\n", TRB_PROJECT_FORMAT);
  put_settings (&sv, &project->settings);
  put_sections (&sv, project);
  for (guint i = 0; i < project->members->len; i++)
    {
      const TrbMember *m = g_ptr_array_index (project->members, i);

      if (m->floor == NULL)
        put_beam (&sv, m);
    }
  for (guint i = 0; i < project->floors->len; i++)
    put_floor (&sv, g_ptr_array_index (project->floors, i));
  g_string_append (out, "</trabeate-project>\n");
  memo_clear (&sv.memo);

  if (sv.failed)
    return NULL;
  if (length != NULL)
    *length = out->len;
  return g_string_free (g_steal_pointer (&out), FALSE);
}

/**
 * trb_project_save_file:
 * @project: a project
 * @filename: where to save it
 * @error: return location for a #TRB_ERROR
 *
 * Saves atomically: the bytes of trb_project_save_data() go to a new file in the same folder,
 * which is flushed to disk and then renamed over @filename. On any failure the file that was
 * there stays whole, and no partial file is left. An existing file keeps its permissions;
 * a symbolic link is followed, so the file it points to is replaced and the link stays.
 *
 * Returns: %TRUE when saved; else %FALSE with @error set to "<file>: cannot save: <why>"
 *   (TRB_ERROR_IO, or TRB_ERROR_INVALID for a model that cannot be written).
 */
gboolean
trb_project_save_file (const TrbProject  *project,
                       const char        *filename,
                       GError           **error)
{
  g_autofree char *display = NULL;
  g_autofree char *data = NULL;
  g_autofree char *target = NULL;
  g_autoptr(GError) local = NULL;
  GStatBuf st;
  int mode = 0666;
  gsize length;

  g_return_val_if_fail (project != NULL && filename != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  display = g_filename_display_name (filename);
  data = trb_project_save_data (project, &length, &local);
  if (data == NULL)
    {
      g_set_error (error, TRB_ERROR, local->code, "%s: cannot save: %s", display,
                   local->message);
      return FALSE;
    }

  target = g_strdup (filename);
  if (g_file_test (filename, G_FILE_TEST_IS_SYMLINK))
    {
      char *real = realpath (filename, NULL);

      if (real != NULL)
        {
          g_free (target);
          target = g_strdup (real);
          free (real);
        }
    }
  if (g_stat (target, &st) == 0)
    mode = st.st_mode & 07777;

  /* A temporary file in the same folder, fsync()ed, then rename()d over the target. */
  if (!g_file_set_contents_full (target, data, (gssize) length,
                                 G_FILE_SET_CONTENTS_CONSISTENT | G_FILE_SET_CONTENTS_DURABLE,
                                 mode, &local))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_IO, "%s: cannot save: %s", display,
                   local->message);
      return FALSE;
    }
  return TRUE;
}
