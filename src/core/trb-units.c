/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-units.h"

#include "trb-error.h"

#include <errno.h>
#include <math.h>
#include <string.h>

/* A hand parser: the project file holds tens of thousands of quantities, and a regex or an
 * allocation per call would dominate loading. Every scan checks for the terminating NUL before
 * looking further, so no input can make it read past the string. */

#define DIM_BIT(d) (1u << (d))
#define LEN        DIM_BIT (TRB_DIM_LENGTH)
#define FORCE      DIM_BIT (TRB_DIM_FORCE)
#define LINE       DIM_BIT (TRB_DIM_LINE_LOAD)
#define AREA_LOAD  DIM_BIT (TRB_DIM_AREA_LOAD)
#define MOMENT     DIM_BIT (TRB_DIM_MOMENT)
#define STRESS     DIM_BIT (TRB_DIM_STRESS)
#define AREA       DIM_BIT (TRB_DIM_AREA)
#define MODULUS    DIM_BIT (TRB_DIM_SECTION_MODULUS)
#define INERTIA    DIM_BIT (TRB_DIM_INERTIA)
#define WARPING    DIM_BIT (TRB_DIM_WARPING)
#define WPL        DIM_BIT (TRB_DIM_WEIGHT_PER_LENGTH)
#define DENSITY    DIM_BIT (TRB_DIM_DENSITY)

#define TRB_MM     1e-3
#define TRB_CM     1e-2
#define TRB_PCF    (TRB_LBF / (TRB_FT * TRB_FT * TRB_FT))

/* Longest spelling in the table is well under this; longer tokens cannot be units. */
#define KEY_MAX 24
/* Quoted input is cut here so a runaway attribute cannot flood a message. */
#define QUOTE_MAX_CHARS 60

typedef enum
{
  ROLE_PLAIN,
  ROLE_FOOT,
  ROLE_INCH,
} UnitRole;

typedef struct
{
  const char *key;       /* products written with '*', powers without '^' */
  guint       dims;      /* every dimension this spelling may stand for */
  double      factor;    /* SI value of one unit */
  gboolean    any_case;  /* US customary spellings: KIP, Kip and kip alike */
  UnitRole    role;
} UnitDef;

/* A spelling is accepted only for the dimensions listed with it: "psi" for a floor load is
 * almost always a slip for "psf" (144 times larger), so pressures are not interchangeable
 * between area load and stress except for the SI Pa and kPa, which both lists name. */
static const UnitDef units[] = {
  /* length */
  { "in",      LEN,   TRB_IN,  TRUE,  ROLE_INCH },
  { "inch",    LEN,   TRB_IN,  TRUE,  ROLE_INCH },
  { "inches",  LEN,   TRB_IN,  TRUE,  ROLE_INCH },
  { "\"",      LEN,   TRB_IN,  FALSE, ROLE_INCH },
  { "ft",      LEN,   TRB_FT,  TRUE,  ROLE_FOOT },
  { "foot",    LEN,   TRB_FT,  TRUE,  ROLE_FOOT },
  { "feet",    LEN,   TRB_FT,  TRUE,  ROLE_FOOT },
  { "'",       LEN,   TRB_FT,  FALSE, ROLE_FOOT },
  { "mm",      LEN,   TRB_MM,  FALSE, ROLE_PLAIN },
  { "cm",      LEN,   TRB_CM,  FALSE, ROLE_PLAIN },
  { "m",       LEN,   1.0,     FALSE, ROLE_PLAIN },

  /* force */
  { "lb",      FORCE, TRB_LBF, TRUE,  ROLE_PLAIN },
  { "lbs",     FORCE, TRB_LBF, TRUE,  ROLE_PLAIN },
  { "lbf",     FORCE, TRB_LBF, TRUE,  ROLE_PLAIN },
  { "kip",     FORCE, TRB_KIP, TRUE,  ROLE_PLAIN },
  { "kips",    FORCE, TRB_KIP, TRUE,  ROLE_PLAIN },
  { "N",       FORCE, 1.0,     FALSE, ROLE_PLAIN },
  { "kN",      FORCE, 1e3,     FALSE, ROLE_PLAIN },

  /* line load and weight per length */
  { "plf",     LINE | WPL, TRB_PLF, TRUE,  ROLE_PLAIN },
  { "lb/ft",   LINE | WPL, TRB_PLF, TRUE,  ROLE_PLAIN },
  { "lbf/ft",  LINE | WPL, TRB_PLF, TRUE,  ROLE_PLAIN },
  { "klf",     LINE,       TRB_KLF, TRUE,  ROLE_PLAIN },
  { "kip/ft",  LINE,       TRB_KLF, TRUE,  ROLE_PLAIN },
  { "N/m",     LINE | WPL, 1.0,     FALSE, ROLE_PLAIN },
  { "kN/m",    LINE | WPL, 1e3,     FALSE, ROLE_PLAIN },
  /* a mass per length, turned into a weight under standard gravity */
  { "kg/m",    WPL,        TRB_STANDARD_GRAVITY, FALSE, ROLE_PLAIN },

  /* area load */
  { "psf",     AREA_LOAD,          TRB_PSF,         TRUE,  ROLE_PLAIN },
  { "lb/ft2",  AREA_LOAD,          TRB_PSF,         TRUE,  ROLE_PLAIN },
  { "lbf/ft2", AREA_LOAD,          TRB_PSF,         TRUE,  ROLE_PLAIN },
  { "ksf",     AREA_LOAD,          1000.0 * TRB_PSF, TRUE, ROLE_PLAIN },
  { "kip/ft2", AREA_LOAD,          1000.0 * TRB_PSF, TRUE, ROLE_PLAIN },
  { "Pa",      AREA_LOAD | STRESS, 1.0,             FALSE, ROLE_PLAIN },
  { "kPa",     AREA_LOAD | STRESS, 1e3,             FALSE, ROLE_PLAIN },
  { "N/m2",    AREA_LOAD | STRESS, 1.0,             FALSE, ROLE_PLAIN },
  { "kN/m2",   AREA_LOAD,          1e3,             FALSE, ROLE_PLAIN },

  /* moment, either order of the factors */
  { "lb*ft",   MOMENT, TRB_LBF * TRB_FT, TRUE,  ROLE_PLAIN },
  { "ft*lb",   MOMENT, TRB_LBF * TRB_FT, TRUE,  ROLE_PLAIN },
  { "lbf*ft",  MOMENT, TRB_LBF * TRB_FT, TRUE,  ROLE_PLAIN },
  { "ft*lbf",  MOMENT, TRB_LBF * TRB_FT, TRUE,  ROLE_PLAIN },
  { "lb*in",   MOMENT, TRB_LBF * TRB_IN, TRUE,  ROLE_PLAIN },
  { "in*lb",   MOMENT, TRB_LBF * TRB_IN, TRUE,  ROLE_PLAIN },
  { "lbf*in",  MOMENT, TRB_LBF * TRB_IN, TRUE,  ROLE_PLAIN },
  { "in*lbf",  MOMENT, TRB_LBF * TRB_IN, TRUE,  ROLE_PLAIN },
  { "kip*ft",  MOMENT, TRB_KIP_FT,       TRUE,  ROLE_PLAIN },
  { "ft*kip",  MOMENT, TRB_KIP_FT,       TRUE,  ROLE_PLAIN },
  { "kip*in",  MOMENT, TRB_KIP * TRB_IN, TRUE,  ROLE_PLAIN },
  { "in*kip",  MOMENT, TRB_KIP * TRB_IN, TRUE,  ROLE_PLAIN },
  { "N*m",     MOMENT, 1.0,              FALSE, ROLE_PLAIN },
  { "m*N",     MOMENT, 1.0,              FALSE, ROLE_PLAIN },
  { "kN*m",    MOMENT, 1e3,              FALSE, ROLE_PLAIN },
  { "m*kN",    MOMENT, 1e3,              FALSE, ROLE_PLAIN },

  /* stress and modulus */
  { "psi",     STRESS, TRB_PSI, TRUE,  ROLE_PLAIN },
  { "lb/in2",  STRESS, TRB_PSI, TRUE,  ROLE_PLAIN },
  { "lbf/in2", STRESS, TRB_PSI, TRUE,  ROLE_PLAIN },
  { "ksi",     STRESS, TRB_KSI, TRUE,  ROLE_PLAIN },
  { "kip/in2", STRESS, TRB_KSI, TRUE,  ROLE_PLAIN },
  { "MPa",     STRESS, 1e6,     FALSE, ROLE_PLAIN },
  { "GPa",     STRESS, 1e9,     FALSE, ROLE_PLAIN },
  { "N/mm2",   STRESS, 1e6,     FALSE, ROLE_PLAIN },

  /* section properties */
  { "in2",     AREA,    TRB_IN * TRB_IN,                                  TRUE,  ROLE_PLAIN },
  { "in3",     MODULUS, TRB_IN * TRB_IN * TRB_IN,                         TRUE,  ROLE_PLAIN },
  { "in4",     INERTIA, TRB_IN * TRB_IN * TRB_IN * TRB_IN,                TRUE,  ROLE_PLAIN },
  { "in6",     WARPING, TRB_IN * TRB_IN * TRB_IN * TRB_IN * TRB_IN * TRB_IN, TRUE, ROLE_PLAIN },
  { "mm2",     AREA,    1e-6,  FALSE, ROLE_PLAIN },
  { "mm3",     MODULUS, 1e-9,  FALSE, ROLE_PLAIN },
  { "mm4",     INERTIA, 1e-12, FALSE, ROLE_PLAIN },
  { "mm6",     WARPING, 1e-18, FALSE, ROLE_PLAIN },
  { "cm2",     AREA,    1e-4,  FALSE, ROLE_PLAIN },
  { "cm3",     MODULUS, 1e-6,  FALSE, ROLE_PLAIN },
  { "cm4",     INERTIA, 1e-8,  FALSE, ROLE_PLAIN },
  { "cm6",     WARPING, 1e-12, FALSE, ROLE_PLAIN },
  { "m2",      AREA,    1.0,   FALSE, ROLE_PLAIN },
  { "m3",      MODULUS, 1.0,   FALSE, ROLE_PLAIN },
  { "m4",      INERTIA, 1.0,   FALSE, ROLE_PLAIN },
  { "m6",      WARPING, 1.0,   FALSE, ROLE_PLAIN },

  /* weight density */
  { "pcf",     DENSITY, TRB_PCF, TRUE,  ROLE_PLAIN },
  { "lb/ft3",  DENSITY, TRB_PCF, TRUE,  ROLE_PLAIN },
  { "lbf/ft3", DENSITY, TRB_PCF, TRUE,  ROLE_PLAIN },
  { "N/m3",    DENSITY, 1.0,     FALSE, ROLE_PLAIN },
  { "kN/m3",   DENSITY, 1e3,     FALSE, ROLE_PLAIN },
  /* a mass density, turned into a weight density under standard gravity */
  { "kg/m3",   DENSITY, TRB_STANDARD_GRAVITY, FALSE, ROLE_PLAIN },
};

typedef enum
{
  DECIMALS_FIXED,   /* `decimals` places */
  DECIMALS_MOMENT,  /* 2 places below 100, 1 from 100 up */
  DECIMALS_SIG3,    /* about 3 significant figures: 2 - floor(log10 |v|), 0 to 4 places */
} DecimalsRule;

typedef struct
{
  const char  *unit;       /* for table headers */
  const char  *inline_unit; /* after a number in running text */
  double       factor;     /* SI value of one display unit */
  DecimalsRule rule;
  int          decimals;
} DisplayDef;

typedef struct
{
  const char *name;
  const char *article;     /* "a" or "an", for "expected a length" */
  const char *examples;    /* "such as ..." */
  const char *short_examples;
  const char *units;       /* what the dimension takes, for unknown units */
  DisplayDef  display[2];  /* indexed by TrbUnitSystem */
} DimensionDef;

static const DimensionDef dimensions[TRB_N_DIMS] = {
  [TRB_DIM_LENGTH] = {
    "length", "a", "12 ft, 12'-6\", 3.6 m", "12 ft or 3.6 m",
    "in, ft, mm, cm, m, or feet and inches such as 12'-6\"",
    { { "ft", "ft", TRB_FT, DECIMALS_FIXED, 2 },
      { "mm", "mm", TRB_MM, DECIMALS_FIXED, 0 } } },
  [TRB_DIM_FORCE] = {
    "force", "a", "12 kip, 53 kN", "12 kip or 53 kN",
    "lb, lbf, kip, N, kN",
    { { "kip", "kip", TRB_KIP, DECIMALS_FIXED, 2 },
      { "kN", "kN", 1e3, DECIMALS_FIXED, 2 } } },
  [TRB_DIM_LINE_LOAD] = {
    "line load", "a", "0.6 kip/ft, 40 plf, 8.8 kN/m", "40 plf or 8.8 kN/m",
    "plf, lb/ft, klf, kip/ft, N/m, kN/m",
    { { "kip/ft", "kip/ft", TRB_KLF, DECIMALS_FIXED, 3 },
      { "kN/m", "kN/m", 1e3, DECIMALS_FIXED, 2 } } },
  [TRB_DIM_AREA_LOAD] = {
    "area load", "an", "40 psf, 2.4 kPa", "40 psf or 2.4 kPa",
    "psf, ksf, lb/ft2, Pa, kPa, kN/m2",
    { { "psf", "psf", TRB_PSF, DECIMALS_FIXED, 1 },
      { "kPa", "kPa", 1e3, DECIMALS_FIXED, 2 } } },
  [TRB_DIM_MOMENT] = {
    "moment", "a", "120 kip*ft, 160 kN*m", "120 kip*ft or 160 kN*m",
    "lb*ft, kip*ft, kip*in, N*m, kN*m (or with - or . for *)",
    { { "kip*ft", "kip*ft", TRB_KIP_FT, DECIMALS_MOMENT, 0 },
      { "kN*m", "kN*m", 1e3, DECIMALS_MOMENT, 0 } } },
  [TRB_DIM_STRESS] = {
    "stress", "a", "50 ksi, 1350 psi, 345 MPa", "50 ksi or 345 MPa",
    "psi, ksi, Pa, kPa, MPa, GPa, N/mm2",
    { { "ksi", "ksi", TRB_KSI, DECIMALS_SIG3, 0 },
      { "MPa", "MPa", 1e6, DECIMALS_SIG3, 0 } } },
  [TRB_DIM_AREA] = {
    "area", "an", "14.7 in2, 9480 mm2", "14.7 in2 or 9480 mm2",
    "in2, mm2, cm2, m2 (also in^2)",
    { { "in^2", "in^2", TRB_IN * TRB_IN, DECIMALS_SIG3, 0 },
      { "mm^2", "mm^2", 1e-6, DECIMALS_SIG3, 0 } } },
  [TRB_DIM_SECTION_MODULUS] = {
    "section modulus", "a", "88.9 in3, 1460 cm3", "88.9 in3 or 1460 cm3",
    "in3, mm3, cm3, m3 (also in^3)",
    { { "in^3", "in^3", TRB_IN * TRB_IN * TRB_IN, DECIMALS_SIG3, 0 },
      { "10^3 mm^3", "\xc3\x97" "10^3 mm^3", 1e-6, DECIMALS_SIG3, 0 } } },
  [TRB_DIM_INERTIA] = {
    "moment of inertia", "a", "800 in4, 333e6 mm4", "800 in4 or 333e6 mm4",
    "in4, mm4, cm4, m4 (also in^4)",
    { { "in^4", "in^4", TRB_IN * TRB_IN * TRB_IN * TRB_IN, DECIMALS_SIG3, 0 },
      { "10^6 mm^4", "\xc3\x97" "10^6 mm^4", 1e-6, DECIMALS_SIG3, 0 } } },
  [TRB_DIM_WARPING] = {
    "warping constant", "a", "3000 in6, 800e9 mm6", "3000 in6 or 800e9 mm6",
    "in6, mm6, cm6, m6 (also in^6)",
    { { "in^6", "in^6", TRB_IN * TRB_IN * TRB_IN * TRB_IN * TRB_IN * TRB_IN, DECIMALS_SIG3, 0 },
      { "10^9 mm^6", "\xc3\x97" "10^9 mm^6", 1e-9, DECIMALS_SIG3, 0 } } },
  [TRB_DIM_WEIGHT_PER_LENGTH] = {
    "weight per length", "a", "50 lb/ft, 74 kg/m", "50 lb/ft or 74 kg/m",
    "lb/ft, plf, kg/m, N/m, kN/m",
    { { "lb/ft", "lb/ft", TRB_PLF, DECIMALS_FIXED, 1 },
      { "kg/m", "kg/m", TRB_STANDARD_GRAVITY, DECIMALS_FIXED, 1 } } },
  [TRB_DIM_DENSITY] = {
    "weight density", "a", "35 pcf, 5.5 kN/m3", "35 pcf or 5.5 kN/m3",
    "pcf, lb/ft3, kN/m3, N/m3, kg/m3",
    { { "pcf", "pcf", TRB_PCF, DECIMALS_FIXED, 1 },
      { "kN/m^3", "kN/m^3", 1e3, DECIMALS_FIXED, 2 } } },
};

/**
 * trb_dimension_name:
 * @dim: a dimension
 *
 * The dimension's plain name as messages and reports use it: "length", "force",
 * "line load", "area load", "moment", "stress", "area", "section modulus",
 * "moment of inertia", "warping constant", "weight per length", "weight density".
 *
 * Returns: (transfer none): a static string
 */
const char *
trb_dimension_name (TrbDimension dim)
{
  g_return_val_if_fail ((guint) dim < TRB_N_DIMS, "unknown");

  return dimensions[dim].name;
}

/* ------------------------------------------------------------------ scanning helpers */

static inline gboolean
is_digit (char c)
{
  return c >= '0' && c <= '9';
}

static inline gboolean
is_alpha (char c)
{
  return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z');
}

/* Length of the multi-byte sequence `seq` if p starts with it, else 0; stops at a NUL. */
static inline gsize
starts_with (const char *p,
             const char *seq)
{
  gsize i;

  for (i = 0; seq[i] != '\0'; i++)
    if (p[i] != seq[i])
      return 0;

  return i;
}

/* Spaces between number and unit, and around the feet-inch hyphen. No-break and thin
 * spaces come in when a value is pasted from a document. */
static gsize
space_len (const char *p)
{
  gsize n;

  if (*p == ' ' || *p == '\t' || *p == '\n' || *p == '\r' || *p == '\f' || *p == '\v')
    return 1;
  if ((n = starts_with (p, "\xc2\xa0")) ||         /* U+00A0 no-break space */
      (n = starts_with (p, "\xe2\x80\x89")) ||     /* U+2009 thin space */
      (n = starts_with (p, "\xe2\x80\xaf")))       /* U+202F narrow no-break space */
    return n;

  return 0;
}

static const char *
skip_space (const char *p)
{
  gsize n;

  while ((n = space_len (p)) > 0)
    p += n;

  return p;
}

static const char *
skip_digits (const char *p)
{
  while (is_digit (*p))
    p++;

  return p;
}

/* g_ascii_strtod on exactly [start, end): the scanner has already decided what the number
 * is, and strtod must not read more (it would take "0x1p3" or "inf"). */
static double
strtod_span (const char *start,
             const char *end)
{
  char buf[64];
  gsize len = end - start;
  g_autofree char *heap = NULL;
  const char *s;

  if (len < sizeof buf)
    {
      memcpy (buf, start, len);
      buf[len] = '\0';
      s = buf;
    }
  else
    {
      heap = g_strndup (start, len);
      s = heap;
    }

  /* Underflow is a tiny value, which is fine; overflow shows up as an infinity. */
  return g_ascii_strtod (s, NULL);
}

typedef enum
{
  NUM_OK,
  NUM_NONE,
  NUM_ZERO_DENOMINATOR,
} NumStatus;

/* An unsigned number at p: a decimal with optional exponent ("12", "1.5", ".5", "1.2e3"),
 * a fraction ("1/2") or a mixed number ("6 1/2", "6-1/2"). Fractions only follow whole
 * numbers written without a point or exponent. */
static NumStatus
scan_number (const char  *p,
             const char **end,
             double      *value)
{
  const char *q = p;
  const char *r;
  gboolean integer = TRUE;
  gsize int_digits, frac_digits = 0;
  double whole;

  q = skip_digits (p);
  int_digits = q - p;
  if (*q == '.')
    {
      r = skip_digits (q + 1);
      frac_digits = r - (q + 1);
      if (int_digits + frac_digits > 0)
        {
          q = r;
          integer = FALSE;
        }
    }
  if (int_digits + frac_digits == 0)
    return NUM_NONE;

  if (*q == 'e' || *q == 'E')
    {
      r = q + 1;
      if (*r == '+' || *r == '-')
        r++;
      if (is_digit (*r))
        {
          q = skip_digits (r);
          integer = FALSE;
        }
    }

  whole = strtod_span (p, q);

  if (integer)
    {
      const char *num, *num_end, *den_end;

      /* "1/2" */
      if (*q == '/' && is_digit (q[1]))
        {
          den_end = skip_digits (q + 1);
          if (strtod_span (q + 1, den_end) == 0.0)
            return NUM_ZERO_DENOMINATOR;
          *value = whole / strtod_span (q + 1, den_end);
          *end = den_end;
          return NUM_OK;
        }

      /* "6 1/2" or "6-1/2" */
      num = (*q == '-') ? q + 1 : skip_space (q);
      if (num != q && is_digit (*num))
        {
          num_end = skip_digits (num);
          if (*num_end == '/' && is_digit (num_end[1]))
            {
              double den;

              den_end = skip_digits (num_end + 1);
              den = strtod_span (num_end + 1, den_end);
              if (den == 0.0)
                return NUM_ZERO_DENOMINATOR;
              *value = whole + strtod_span (num, num_end) / den;
              *end = den_end;
              return NUM_OK;
            }
        }
    }

  *value = whole;
  *end = q;
  return NUM_OK;
}

/* A power of ten written between number and unit, as the SI display writes section
 * properties: "333 ×10^6 mm^4", also "x10^6" and "*10^6". Returns p if there is none. */
static const char *
scan_scale (const char *p,
            int        *exponent)
{
  const char *q;
  gsize n;
  int sign = 1;
  int e = 0;
  int digits = 0;

  if ((n = starts_with (p, "\xc3\x97")) == 0 && *p != 'x' && *p != '*')
    return p;
  if (n == 0)
    n = 1;
  q = skip_space (p + n);
  if (starts_with (q, "10^") == 0)
    return p;
  q += 3;
  if (*q == '+' || *q == '-')
    {
      sign = (*q == '-') ? -1 : 1;
      q++;
    }
  while (is_digit (*q) && digits < 3)
    {
      e = 10 * e + (*q - '0');
      q++;
      digits++;
    }
  if (digits == 0 || is_digit (*q))
    return p;

  *exponent = sign * e;
  return q;
}

typedef struct
{
  const char *start;
  const char *end;
  char        key[KEY_MAX];
  gboolean    is_unit;   /* started like a unit; otherwise just the run of non-space */
  gboolean    too_long;
} UnitToken;

static gsize
separator_len (const char *p)
{
  gsize n;

  if (*p == '*' || *p == '-' || *p == '.')
    return 1;
  if ((n = starts_with (p, "\xc2\xb7")) ||       /* U+00B7 middle dot */
      (n = starts_with (p, "\xe2\x8b\x85")))     /* U+22C5 dot operator */
    return n;

  return 0;
}

/* Superscript digits as a text editor or a word processor would put them in "mm²". */
static char
superscript_digit (const char *p,
                   gsize      *len)
{
  static const struct { const char *seq; char digit; } sup[] = {
    { "\xc2\xb2", '2' }, { "\xc2\xb3", '3' }, { "\xe2\x81\xb4", '4' }, { "\xe2\x81\xb6", '6' },
  };

  for (guint i = 0; i < G_N_ELEMENTS (sup); i++)
    if ((*len = starts_with (p, sup[i].seq)) > 0)
      return sup[i].digit;

  *len = 0;
  return '\0';
}

static void
key_append (UnitToken *tok,
            gsize     *k,
            char       c)
{
  if (*k + 1 < KEY_MAX)
    tok->key[(*k)++] = c;
  else
    tok->too_long = TRUE;
}

/* Whether what follows a digit written straight after a unit's letters ends the unit, so
 * the digit is a power ("in4", "kN/m2"), rather than continuing a number ("12ft6in",
 * "12ft6 1/2in", "12ft6-1/2\"", "12ft6.5in"). */
static gboolean
is_power_digit_end (const char *p)
{
  const char *q;

  if (is_digit (*p) || is_alpha (*p) || *p == '.' || *p == '/' || *p == '"' || *p == '\'')
    return FALSE;
  if (*p == '-' && is_digit (p[1]))
    return FALSE;
  q = skip_space (p);
  if (q != p && is_digit (*q))
    return FALSE;

  return TRUE;
}

/* Reads a unit at p into tok, writing its lookup key: separators '-', '.', '·' become '*',
 * '^' goes, superscripts become digits. A digit is a power only straight after a letter or
 * '^' and not followed by more of the number ("12ft6in" is feet then inches). */
static void
scan_unit (const char *p,
           UnitToken  *tok)
{
  const char *q = p;
  gsize k = 0;
  gsize n;

  memset (tok, 0, sizeof *tok);
  tok->start = p;

  if (starts_with (p, "''"))
    {
      tok->end = p + 2;
      tok->is_unit = TRUE;
      strcpy (tok->key, "\"");
      return;
    }
  /* straight, typographic and prime marks for feet and inches */
  if (*p == '\'' || (n = starts_with (p, "\xe2\x80\xb2")) || (n = starts_with (p, "\xe2\x80\x99")))
    {
      tok->end = p + ((*p == '\'') ? 1 : n);
      tok->is_unit = TRUE;
      strcpy (tok->key, "'");
      return;
    }
  if (*p == '"' || (n = starts_with (p, "\xe2\x80\xb3")) || (n = starts_with (p, "\xe2\x80\x9d")))
    {
      tok->end = p + ((*p == '"') ? 1 : n);
      tok->is_unit = TRUE;
      strcpy (tok->key, "\"");
      return;
    }

  if (!is_alpha (*p))
    {
      /* not a unit: take the run up to the next space so the message can quote it */
      while (*q != '\0' && space_len (q) == 0)
        q++;
      tok->end = q;
      return;
    }

  tok->is_unit = TRUE;
  while (*q != '\0')
    {
      char sup;

      if (is_alpha (*q))
        {
          key_append (tok, &k, *q);
          q++;
        }
      else if ((*q == '^' && is_digit (q[1]) && !is_digit (q[2])) ||
               (is_digit (*q) && is_alpha (q[-1]) && is_power_digit_end (q + 1)))
        {
          if (*q == '^')
            q++;
          key_append (tok, &k, *q);
          q++;
        }
      else if ((sup = superscript_digit (q, &n)) != '\0')
        {
          key_append (tok, &k, sup);
          q += n;
        }
      else if (*q == '/' && is_alpha (q[1]))
        {
          key_append (tok, &k, '/');
          q++;
        }
      else if ((n = separator_len (q)) > 0 && is_alpha (q[n]))
        {
          key_append (tok, &k, '*');
          q += n;
        }
      else
        break;
    }
  tok->end = q;
  tok->key[k] = '\0';
}

/* The unit for tok, or NULL. `hint` gets a case-sensitive spelling that matches but for
 * case ("kn" for kN), so the message can suggest it. */
static const UnitDef *
lookup_unit (const UnitToken  *tok,
             const UnitDef   **hint)
{
  *hint = NULL;

  if (!tok->is_unit || tok->too_long)
    return NULL;

  for (guint i = 0; i < G_N_ELEMENTS (units); i++)
    if (strcmp (units[i].key, tok->key) == 0)
      return &units[i];

  for (guint i = 0; i < G_N_ELEMENTS (units); i++)
    if (g_ascii_strcasecmp (units[i].key, tok->key) == 0)
      {
        if (units[i].any_case)
          return &units[i];
        if (*hint == NULL)
          *hint = &units[i];
      }

  return NULL;
}

/* ------------------------------------------------------------------ error messages */

/* A copy of [start, end) fit to quote in a message: valid UTF-8, control characters as
 * spaces, at most QUOTE_MAX_CHARS characters. */
static char *
quote (const char *start,
       const char *end)
{
  g_autofree char *valid = g_utf8_make_valid (start, end - start);
  GString *s = g_string_new (NULL);
  const char *p = valid;
  guint chars = 0;

  while (*p != '\0')
    {
      const char *next = g_utf8_next_char (p);

      if (chars == QUOTE_MAX_CHARS)
        {
          g_string_append (s, "\xe2\x80\xa6");  /* … */
          break;
        }
      if ((guchar) *p < 0x20 || *p == 0x7f)
        g_string_append_c (s, ' ');
      else
        g_string_append_len (s, p, next - p);
      p = next;
      chars++;
    }

  return g_string_free (s, FALSE);
}

/* The text without the spaces around it, quoted. */
static char *
quote_trimmed (const char *text)
{
  const char *start = skip_space (text);
  const char *end = start + strlen (start);

  /* trailing ASCII white space only: enough for what a file or an entry gives us */
  while (end > start && g_ascii_isspace (end[-1]))
    end--;

  return quote (start, end);
}

/* 1-based position in characters, counting a UTF-8 sequence (valid or not) as one. */
static guint
char_position (const char *text,
               const char *at)
{
  guint n = 1;

  for (const char *p = text; p < at; p++)
    if (((guchar) *p & 0xc0) != 0x80)
      n++;

  return n;
}

static void
set_expected_error (GError       **error,
                    TrbDimension   dim,
                    const char    *what_is_wrong)
{
  const DimensionDef *d = &dimensions[dim];

  g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
               "expected %s %s (such as %s) but %s",
               d->article, d->name, d->examples, what_is_wrong);
}

/* ------------------------------------------------------------------ parsing */

/**
 * trb_units_parse:
 * @text: a quantity with its unit, such as "12'-6 1/2\"", "2.4 kPa" or "-3 kip*ft"
 * @dim: the dimension the caller expects
 * @value: (out) (optional): the value in SI base units
 * @error: return location for a #GError in %TRB_ERROR, code %TRB_ERROR_UNIT
 *
 * Parses a quantity and converts it to SI base units (m, N, N/m, Pa, N*m, m^n, N/m^3).
 * The unit is required and must be one listed for @dim in docs/units.md. The message of
 * the error quotes @text and says what was expected, so a caller need only add where the
 * text came from. On failure @value is left alone.
 *
 * Returns: %TRUE on success
 */
gboolean
trb_units_parse (const char    *text,
                 TrbDimension   dim,
                 double        *value,
                 GError       **error)
{
  const DimensionDef *d;
  const UnitDef *unit, *hint;
  const char *p, *start, *num_start, *num_end;
  UnitToken tok;
  gboolean negative = FALSE;
  int scale = 0;
  double number, result;
  NumStatus status;

  g_return_val_if_fail (text != NULL, FALSE);
  g_return_val_if_fail ((guint) dim < TRB_N_DIMS, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  d = &dimensions[dim];
  start = p = skip_space (text);

  if (*p == '\0')
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                   "empty text: expected %s %s (such as %s)", d->article, d->name, d->examples);
      return FALSE;
    }

  if (*p == '+' || *p == '-')
    {
      negative = (*p == '-');
      p++;
    }
  else if (starts_with (p, "\xe2\x88\x92"))  /* U+2212 minus sign */
    {
      negative = TRUE;
      p += 3;
    }

  num_start = p;
  status = scan_number (p, &num_end, &number);
  if (status == NUM_NONE)
    {
      g_autofree char *q = quote_trimmed (text);
      g_autofree char *what = NULL;
      char word[9] = { 0 };
      guint i;

      for (i = 0; i + 1 < sizeof word && is_alpha (num_start[i]); i++)
        word[i] = g_ascii_tolower (num_start[i]);
      if (!is_alpha (num_start[i]) &&
          (strcmp (word, "nan") == 0 || strcmp (word, "inf") == 0 ||
           strcmp (word, "infinity") == 0))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                       "\"%s\" is not a finite number: expected %s %s (such as %s)",
                       q, d->article, d->name, d->examples);
          return FALSE;
        }

      what = g_strdup_printf ("\"%s\" does not start with a number", q);
      set_expected_error (error, dim, what);
      return FALSE;
    }
  if (status == NUM_ZERO_DENOMINATOR)
    {
      g_autofree char *q = quote_trimmed (text);

      g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                   "a fraction in \"%s\" has a zero denominator", q);
      return FALSE;
    }
  p = num_end;

  if (*p == ',' && is_digit (p[1]))
    {
      g_autofree char *q = quote_trimmed (text);

      g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                   "unexpected \",\" in \"%s\" at character %u: write numbers without "
                   "grouping commas and with a decimal point (1200 lb, 1.5 m)",
                   q, char_position (text, p));
      return FALSE;
    }

  p = skip_space (p);
  {
    const char *after_scale = scan_scale (p, &scale);

    if (after_scale != p)
      p = skip_space (after_scale);
  }

  if (*p == '\0')
    {
      g_autofree char *q = quote_trimmed (text);

      g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                   "missing unit in \"%s\": %s %s needs one (such as %s)",
                   q, d->article, d->name, d->short_examples);
      return FALSE;
    }

  scan_unit (p, &tok);
  unit = lookup_unit (&tok, &hint);
  if (unit == NULL)
    {
      g_autofree char *q = quote_trimmed (text);
      g_autofree char *u = quote (tok.start, tok.end);

      if (hint != NULL && (hint->dims & DIM_BIT (dim)) != 0)
        g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                     "unknown unit \"%s\" in \"%s\": did you mean \"%s\"? (SI units are "
                     "written exactly, as kN, kPa, MPa)", u, q, hint->key);
      else
        g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                     "unknown unit \"%s\" in \"%s\": %s %s takes %s",
                     u, q, d->article, d->name, d->units);
      return FALSE;
    }

  if ((unit->dims & DIM_BIT (dim)) == 0)
    {
      g_autofree char *q = quote (start, tok.end);
      g_autofree char *what = NULL;
      int is = 0;

      while (((1u << is) & unit->dims) == 0)
        is++;
      what = g_strdup_printf ("\"%s\" is %s %s", q, dimensions[is].article,
                              dimensions[is].name);
      set_expected_error (error, dim, what);
      return FALSE;
    }

  result = number * unit->factor;
  if (scale != 0)
    result *= pow (10.0, scale);
  p = tok.end;

  /* feet, then inches: 12'-6", 12' 6 1/2", 12 ft 6 in, 12ft-6in */
  if (unit->role == ROLE_FOOT)
    {
      const char *q = skip_space (p);

      if (*q == '-')
        q = skip_space (q + 1);
      if (is_digit (*q) || (*q == '.' && is_digit (q[1])))
        {
          const UnitDef *inch;
          double inches;

          status = scan_number (q, &num_end, &inches);
          if (status == NUM_ZERO_DENOMINATOR)
            {
              g_autofree char *qt = quote_trimmed (text);

              g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                           "a fraction in \"%s\" has a zero denominator", qt);
              return FALSE;
            }
          g_assert (status == NUM_OK);

          scan_unit (skip_space (num_end), &tok);
          inch = lookup_unit (&tok, &hint);
          if (inch == NULL || inch->role != ROLE_INCH)
            {
              g_autofree char *qt = quote_trimmed (text);

              g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                           "expected inches after the feet in \"%s\" (such as 12'-6\" or "
                           "12 ft 6 in)", qt);
              return FALSE;
            }
          if (!(inches < 12.0))
            {
              g_autofree char *qt = quote_trimmed (text);

              g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                           "the inches in \"%s\" must be less than 12", qt);
              return FALSE;
            }
          result += inches * TRB_IN;
          p = tok.end;
        }
    }

  {
    const char *junk = skip_space (p);

    if (*junk != '\0')
      {
        g_autofree char *qj = quote_trimmed (junk);
        g_autofree char *qs = quote (start, p);

        g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                     "unexpected \"%s\" after \"%s\" at character %u",
                     qj, qs, char_position (text, junk));
        return FALSE;
      }
  }

  if (!isfinite (result))
    {
      g_autofree char *q = quote_trimmed (text);

      g_set_error (error, TRB_ERROR, TRB_ERROR_UNIT,
                   "\"%s\" is out of range: expected %s %s (such as %s)",
                   q, d->article, d->name, d->examples);
      return FALSE;
    }

  if (value != NULL)
    *value = negative ? -result : result;

  return TRUE;
}

/* ------------------------------------------------------------------ formatting */

/**
 * trb_units_display_unit:
 * @dim: a dimension
 * @system: the unit system of the project
 *
 * The unit a table column of @dim shows in @system, such as "kip", "psf", "kN*m" or
 * "10^6 mm^4". Lengths in US customary are decimal feet here, although
 * trb_units_format() writes them in feet and inches.
 *
 * Returns: (transfer none): a static string
 */
const char *
trb_units_display_unit (TrbDimension  dim,
                        TrbUnitSystem system)
{
  g_return_val_if_fail ((guint) dim < TRB_N_DIMS, "");
  g_return_val_if_fail (system == TRB_UNIT_SYSTEM_US || system == TRB_UNIT_SYSTEM_SI, "");

  return dimensions[dim].display[system].unit;
}

/**
 * trb_units_to_display:
 * @value: a value in SI base units
 * @dim: its dimension
 * @system: the unit system of the project
 *
 * @value in the unit trb_units_display_unit() names, for tables and plots.
 *
 * Returns: the value in display units
 */
double
trb_units_to_display (double        value,
                      TrbDimension  dim,
                      TrbUnitSystem system)
{
  g_return_val_if_fail ((guint) dim < TRB_N_DIMS, NAN);
  g_return_val_if_fail (system == TRB_UNIT_SYSTEM_US || system == TRB_UNIT_SYSTEM_SI, NAN);

  return value / dimensions[dim].display[system].factor;
}

/**
 * trb_units_display_decimals:
 * @display_value: a value already in display units (see trb_units_to_display())
 * @dim: its dimension
 * @system: the unit system of the project
 *
 * How many decimals the display rules of docs/units.md give @display_value, so a table
 * rounds exactly as trb_units_format() does.
 *
 * Returns: the number of decimal places, 0 to 4
 */
int
trb_units_display_decimals (double        display_value,
                            TrbDimension  dim,
                            TrbUnitSystem system)
{
  const DisplayDef *dd;
  double a = fabs (display_value);

  g_return_val_if_fail ((guint) dim < TRB_N_DIMS, 0);
  g_return_val_if_fail (system == TRB_UNIT_SYSTEM_US || system == TRB_UNIT_SYSTEM_SI, 0);

  dd = &dimensions[dim].display[system];
  switch (dd->rule)
    {
    case DECIMALS_FIXED:
      return dd->decimals;

    case DECIMALS_MOMENT:
      return (a < 100.0) ? 2 : 1;

    case DECIMALS_SIG3:
    default:
      if (!isfinite (a) || a == 0.0)
        return 0;
      return CLAMP (2 - (int) floor (log10 (a)), 0, 4);
    }
}

/**
 * trb_units_format_with_unit:
 * @value: a value already in the unit @unit
 * @unit: (nullable): the unit to write after the number, or %NULL for none
 * @decimals: decimal places, 0 to 15
 *
 * Formats "12.35 kip": a point for the decimal separator whatever the locale, so the
 * text reads back with trb_units_parse(), and no minus sign on a value that rounds to
 * zero. A NaN is written "NaN", infinities "inf" and "-inf".
 *
 * Returns: (transfer full): a newly allocated string
 */
char *
trb_units_format_with_unit (double      value,
                            const char *unit,
                            int         decimals)
{
  char fmt[16];
  char buf[G_ASCII_DTOSTR_BUF_SIZE + 320];
  const char *num = buf;
  const char *sep = (unit != NULL && unit[0] != '\0') ? " " : "";

  decimals = CLAMP (decimals, 0, 15);

  if (isnan (value))
    num = "NaN";
  else if (isinf (value))
    num = (value > 0) ? "inf" : "-inf";
  else
    {
      g_snprintf (fmt, sizeof fmt, "%%.%df", decimals);
      g_ascii_formatd (buf, sizeof buf, fmt, value);

      /* "-0.00": the sign of something too small to show is noise */
      if (buf[0] == '-' && strspn (buf + 1, "0.") == strlen (buf + 1))
        num = buf + 1;
    }

  return g_strconcat (num, sep, unit != NULL ? unit : "", NULL);
}

/**
 * trb_units_format_length_ft_in:
 * @meters: a length in metres
 * @denominator: the smallest fraction of an inch shown (16 gives sixteenths), at least 1
 *
 * Formats a length in feet and inches, rounded to the nearest 1/@denominator inch, with
 * the fraction reduced: 12'-6 1/2", 0'-9", 1'-0", -2'-0 3/8". The result reads back with
 * trb_units_parse().
 *
 * Returns: (transfer full): a newly allocated string
 */
char *
trb_units_format_length_ft_in (double meters,
                               int    denominator)
{
  double ticks;
  gint64 n, per_foot, feet, rest;
  int inches, num, den, a, b;

  g_return_val_if_fail (denominator >= 1, NULL);

  if (isnan (meters))
    return g_strdup ("NaN");

  ticks = fabs (meters) / TRB_IN * denominator;
  if (!(ticks < 1e15))
    {
      /* beyond exact integer ticks; no plan is this long, but say something readable */
      char buf[G_ASCII_DTOSTR_BUF_SIZE];

      if (isinf (meters))
        return g_strdup (meters > 0 ? "inf" : "-inf");
      g_ascii_formatd (buf, sizeof buf, "%.6g", meters / TRB_FT);
      return g_strconcat (buf, "'", NULL);
    }

  n = (gint64) llround (ticks);
  per_foot = 12 * (gint64) denominator;
  feet = n / per_foot;
  rest = n % per_foot;
  inches = (int) (rest / denominator);
  num = (int) (rest % denominator);
  den = denominator;

  /* reduce num/den by their greatest common divisor */
  a = num;
  b = den;
  while (b != 0)
    {
      int t = a % b;
      a = b;
      b = t;
    }
  if (num != 0)
    {
      num /= a;
      den /= a;
    }

  if (num == 0)
    return g_strdup_printf ("%s%" G_GINT64_FORMAT "'-%d\"",
                            (meters < 0 && n != 0) ? "-" : "", feet, inches);

  return g_strdup_printf ("%s%" G_GINT64_FORMAT "'-%d %d/%d\"",
                          (meters < 0 && n != 0) ? "-" : "", feet, inches, num, den);
}

/**
 * trb_units_format_small_length:
 * @meters: a length in metres
 * @system: the unit system of the project
 *
 * Formats a length that is not a plan dimension (a deflection, a section depth, a
 * bearing length): inches with 2 decimals in US customary ("0.62 in"), millimetres with
 * 1 decimal in SI ("15.7 mm").
 *
 * Returns: (transfer full): a newly allocated string
 */
char *
trb_units_format_small_length (double        meters,
                               TrbUnitSystem system)
{
  g_return_val_if_fail (system == TRB_UNIT_SYSTEM_US || system == TRB_UNIT_SYSTEM_SI, NULL);

  if (system == TRB_UNIT_SYSTEM_US)
    return trb_units_format_with_unit (meters / TRB_IN, "in", 2);

  return trb_units_format_with_unit (meters / TRB_MM, "mm", 1);
}

/**
 * trb_units_format:
 * @value: a value in SI base units
 * @dim: its dimension
 * @system: the unit system of the project
 *
 * Formats @value for display with the rounding rules of docs/units.md: "12'-6 1/2\"",
 * "12.35 kip", "0.600 kip/ft", "40.0 psf", "123.4 kip*ft", "50.0 ksi", "800 in^4";
 * "3810 mm", "53.38 kN", "2.40 kPa", "333 ×10^6 mm^4". The result reads back with
 * trb_units_parse().
 *
 * Returns: (transfer full): a newly allocated string
 */
char *
trb_units_format (double        value,
                  TrbDimension  dim,
                  TrbUnitSystem system)
{
  const DisplayDef *dd;
  double shown;

  g_return_val_if_fail ((guint) dim < TRB_N_DIMS, NULL);
  g_return_val_if_fail (system == TRB_UNIT_SYSTEM_US || system == TRB_UNIT_SYSTEM_SI, NULL);

  if (dim == TRB_DIM_LENGTH && system == TRB_UNIT_SYSTEM_US)
    return trb_units_format_length_ft_in (value, 16);

  dd = &dimensions[dim].display[system];
  shown = value / dd->factor;

  return trb_units_format_with_unit (shown, dd->inline_unit,
                                     trb_units_display_decimals (shown, dim, system));
}
