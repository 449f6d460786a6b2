/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <gio/gio.h>
#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-error.h"
#include "trb-sections-resources.h"
#include "trb-units.h"

#define IN2 (TRB_IN * TRB_IN)
#define IN3 (TRB_IN * TRB_IN * TRB_IN)
#define IN4 (IN2 * IN2)
#define IN6 (IN3 * IN3)

/* Self-weight of wood, 35 lb/ft^3: the basis of lumber.csv's self_wt column, and common
 * practice for glulam. */
#define WOOD_DENSITY (35.0 * TRB_LBF / (TRB_FT * TRB_FT * TRB_FT))

/* Fbx- of 24F-V4 DF/DF, NDS Supplement 2018 Table 5A (from memory); the values file does not
 * carry it as a column. */
#define GLULAM_24F_V4_FB_NEG_PSI 1850.0

#define RESOURCE_PATH "/org/trabeate/Trabeate/sections/"

struct _TrbCatalog
{
  GArray     *families[TRB_N_FAMILIES];  /* of TrbSection, by weight then depth */
  GArray     *grades;                    /* of TrbWoodGrade, in file order */
  GHashTable *index;                     /* normalised designation -> TrbSection * */
};

/* ------------------------------------------------------------------------------------------ */
/* CSV reading: RFC 4180 quoting, LF or CRLF, blank lines and lines starting with '#' skipped. */

typedef struct
{
  const char *source;
  const char *p;
  guint       line;         /* line of p */
  guint       record_line;  /* line where the last record read began */
} CsvReader;

static void
csv_reader_init (CsvReader  *reader,
                 const char *text,
                 const char *source)
{
  reader->source = source;
  reader->p = text;
  reader->line = 1;
  reader->record_line = 0;
  /* a UTF-8 byte order mark, as spreadsheet programs write one */
  if (g_str_has_prefix (text, "\xEF\xBB\xBF"))
    reader->p += 3;
}

static gboolean
csv_line_is_skipped (const char *p)
{
  if (*p == '#')
    return TRUE;
  while (*p == ' ' || *p == '\t' || *p == '\r')
    p++;
  return *p == '\n' || *p == '\0';
}

/* Reads one record into fields (owned strings, unquoted fields trimmed). Returns FALSE at the
 * end of the text with error unset, or FALSE with error set. */
static gboolean
csv_next_record (CsvReader  *reader,
                 GPtrArray  *fields,
                 GError    **error)
{
  const char *p = reader->p;

  g_ptr_array_set_size (fields, 0);

  while (*p != '\0' && csv_line_is_skipped (p))
    {
      const char *nl = strchr (p, '\n');

      if (nl == NULL)
        {
          p += strlen (p);
          break;
        }
      p = nl + 1;
      reader->line++;
    }
  if (*p == '\0')
    {
      reader->p = p;
      return FALSE;
    }

  reader->record_line = reader->line;
  for (;;)
    {
      GString *field = g_string_new (NULL);

      if (*p == '"')
        {
          p++;
          for (;;)
            {
              if (*p == '\0')
                {
                  g_string_free (field, TRUE);
                  g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                               "%s: line %u: a quoted field is not closed",
                               reader->source, reader->record_line);
                  return FALSE;
                }
              if (*p == '"' && p[1] == '"')
                {
                  g_string_append_c (field, '"');
                  p += 2;
                }
              else if (*p == '"')
                {
                  p++;
                  break;
                }
              else
                {
                  if (*p == '\n')
                    reader->line++;
                  g_string_append_c (field, *p++);
                }
            }
          if (*p != ',' && *p != '\n' && *p != '\0' && !(*p == '\r' && p[1] == '\n'))
            {
              g_string_free (field, TRUE);
              g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                           "%s: line %u: text after a closing quote",
                           reader->source, reader->line);
              return FALSE;
            }
          g_ptr_array_add (fields, g_string_free (field, FALSE));
        }
      else
        {
          while (*p != ',' && *p != '\n' && *p != '\0')
            g_string_append_c (field, *p++);
          g_ptr_array_add (fields, g_strstrip (g_string_free (field, FALSE)));
        }

      if (*p == ',')
        {
          p++;
          continue;
        }
      if (*p == '\r')
        p++;
      if (*p == '\n')
        {
          p++;
          reader->line++;
        }
      break;
    }

  reader->p = p;
  return TRUE;
}

/* A record with its header, so that columns are found by name. */
typedef struct
{
  const char *source;
  guint       line;
  GPtrArray  *header;   /* column names */
  GPtrArray  *fields;
} Row;

static int
row_column (const Row  *row,
            const char *name)
{
  for (guint i = 0; i < row->header->len; i++)
    if (g_ascii_strcasecmp (g_ptr_array_index (row->header, i), name) == 0)
      return (int) i;
  return -1;
}

static gboolean
row_has_column (const Row  *row,
                const char *name)
{
  return row_column (row, name) >= 0;
}

/* The field's text, or NULL when the column is absent or the field empty. */
static const char *
row_text (const Row  *row,
          const char *name)
{
  int i = row_column (row, name);
  const char *text;

  if (i < 0)
    return NULL;
  text = g_ptr_array_index (row->fields, i);
  return *text != '\0' ? text : NULL;
}

static gboolean
row_require_text (const Row   *row,
                  const char  *name,
                  const char **out,
                  GError     **error)
{
  *out = row_text (row, name);
  if (*out == NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column %s is empty", row->source, row->line, name);
      return FALSE;
    }
  return TRUE;
}

static gboolean
parse_number (const char *text,
              double     *value)
{
  char *end = NULL;
  double v = g_ascii_strtod (text, &end);

  if (end == text || *end != '\0' || !isfinite (v))
    return FALSE;
  *value = v;
  return TRUE;
}

/* A number scaled to SI; NAN when the column is absent or the field empty and the value is
 * optional. Values must be positive: no section property or design value is zero or less. */
static gboolean
row_number (const Row  *row,
            const char *name,
            double      factor,
            gboolean    required,
            double     *value,
            GError    **error)
{
  const char *text = row_text (row, name);
  double v;

  if (text == NULL)
    {
      if (required)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                       "%s: line %u: column %s is empty", row->source, row->line, name);
          return FALSE;
        }
      *value = NAN;
      return TRUE;
    }
  if (!parse_number (text, &v))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column %s: \"%s\" is not a number",
                   row->source, row->line, name, text);
      return FALSE;
    }
  if (v <= 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "%s: line %u: column %s: %s is not positive",
                   row->source, row->line, name, text);
      return FALSE;
    }
  *value = v * factor;
  return TRUE;
}

static gboolean
copy_string (char       *dest,
             gsize       size,
             const Row  *row,
             const char *name,
             const char *text,
             GError    **error)
{
  if (strlen (text) >= size)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column %s: \"%s\" is longer than %u characters",
                   row->source, row->line, name, text, (guint) size - 1);
      return FALSE;
    }
  g_strlcpy (dest, text, size);
  return TRUE;
}

typedef gboolean (*RowFunc) (const Row  *row,
                             gpointer    user_data,
                             GError    **error);

/* Reads the header, checks that the required columns are there, then calls func on each
 * record. A record with a different number of fields from the header is an error. */
static gboolean
csv_foreach_row (const char         *text,
                 const char         *source,
                 const char * const *required,
                 RowFunc             func,
                 gpointer            user_data,
                 GError            **error)
{
  g_autoptr(GPtrArray) header = g_ptr_array_new_with_free_func (g_free);
  g_autoptr(GPtrArray) fields = g_ptr_array_new_with_free_func (g_free);
  GError *local_error = NULL;
  CsvReader reader;
  Row row;

  csv_reader_init (&reader, text, source);
  if (!csv_next_record (&reader, header, &local_error))
    {
      if (local_error != NULL)
        g_propagate_error (error, local_error);
      else
        g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE, "%s: no header line", source);
      return FALSE;
    }

  row.source = source;
  row.line = reader.record_line;
  row.header = header;
  row.fields = header;
  for (guint i = 0; required != NULL && required[i] != NULL; i++)
    if (!row_has_column (&row, required[i]))
      {
        g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                     "%s: line %u: the header has no column %s",
                     source, reader.record_line, required[i]);
        return FALSE;
      }

  row.fields = fields;
  while (csv_next_record (&reader, fields, &local_error))
    {
      row.line = reader.record_line;
      if (fields->len != header->len)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                       "%s: line %u: %u fields where the header has %u",
                       source, row.line, fields->len, header->len);
          return FALSE;
        }
      if (!func (&row, user_data, error))
        return FALSE;
    }
  if (local_error != NULL)
    {
      g_propagate_error (error, local_error);
      return FALSE;
    }
  return TRUE;
}

/* ------------------------------------------------------------------------------------------ */
/* Designations */

/* Lookup key: whitespace dropped, ASCII upper case (so "x" and "X" agree), and the
 * multiplication sign read as X. */
static char *
normalise_designation (const char *text)
{
  GString *key = g_string_new (NULL);

  for (const char *p = text; *p != '\0'; p++)
    {
      if (g_ascii_isspace (*p))
        continue;
      if ((guchar) p[0] == 0xC3 && (guchar) p[1] == 0x97)  /* U+00D7 */
        {
          g_string_append_c (key, 'X');
          p++;
          continue;
        }
      g_string_append_c (key, g_ascii_toupper (*p));
    }
  return g_string_free (key, FALSE);
}

/* "3.125" -> "3-1/8", "18" -> "18", "10.5" -> "10-1/2": sizes in eighths of an inch. */
static char *
format_inches (double inches)
{
  int eighths = (int) lround (inches * 8);
  int whole = eighths / 8;
  int num = eighths % 8;
  int den = 8;

  if (num == 0)
    return g_strdup_printf ("%d", whole);
  while (num % 2 == 0)
    {
      num /= 2;
      den /= 2;
    }
  return g_strdup_printf ("%d-%d/%d", whole, num, den);
}

/* ------------------------------------------------------------------------------------------ */
/* Steel */

typedef struct
{
  const char *column;
  gsize       offset;
  double      factor;
} Column;

#define FIELD(f) G_STRUCT_OFFSET (TrbSection, f)

/* The columns every W and S row carries, and the field each fills. */
static const Column i_shape_columns[] = {
  { "A_in2", FIELD (A), IN2 },
  { "d_in", FIELD (d), TRB_IN },
  { "bf_in", FIELD (bf), TRB_IN },
  { "tw_in", FIELD (tw), TRB_IN },
  { "tf_in", FIELD (tf), TRB_IN },
  { "kdes_in", FIELD (kdes), TRB_IN },
  { "Ix_in4", FIELD (Ix), IN4 },
  { "Zx_in3", FIELD (Zx), IN3 },
  { "Sx_in3", FIELD (Sx), IN3 },
  { "rx_in", FIELD (rx), TRB_IN },
  { "Iy_in4", FIELD (Iy), IN4 },
  { "Zy_in3", FIELD (Zy), IN3 },
  { "Sy_in3", FIELD (Sy), IN3 },
  { "ry_in", FIELD (ry), TRB_IN },
  { "J_in4", FIELD (J), IN4 },
  { "Cw_in6", FIELD (Cw), IN6 },
  { "rts_in", FIELD (rts), TRB_IN },
  { "ho_in", FIELD (ho), TRB_IN },
  { "h_tw_ratio", FIELD (h_tw), 1.0 },
};

/* Rectangular HSS: H is the depth (bending about x), B the width; the design wall thickness
 * stands for both tw and tf, and the flat-width slenderness ratios for bf_2tf and h_tw. */
static const Column hss_columns[] = {
  { "A_in2", FIELD (A), IN2 },
  { "H_in", FIELD (d), TRB_IN },
  { "B_in", FIELD (bf), TRB_IN },
  { "t_des_in", FIELD (tw), TRB_IN },
  { "t_des_in", FIELD (tf), TRB_IN },
  { "Ix_in4", FIELD (Ix), IN4 },
  { "Zx_in3", FIELD (Zx), IN3 },
  { "Sx_in3", FIELD (Sx), IN3 },
  { "rx_in", FIELD (rx), TRB_IN },
  { "Iy_in4", FIELD (Iy), IN4 },
  { "Zy_in3", FIELD (Zy), IN3 },
  { "Sy_in3", FIELD (Sy), IN3 },
  { "ry_in", FIELD (ry), TRB_IN },
  { "J_in4", FIELD (J), IN4 },
  { "b_tdes_ratio", FIELD (bf_2tf), 1.0 },
  { "h_tdes_ratio", FIELD (h_tw), 1.0 },
};

#define SECTION_FIELD(s, off) (*(double *) ((char *) (s) + (off)))

typedef struct
{
  TrbFamily  family;
  GArray    *out;   /* of TrbSection */
} ParseData;

static gboolean
read_columns (const Row    *row,
              const Column *columns,
              guint         n_columns,
              gboolean      required,
              TrbSection   *section,
              GError      **error)
{
  for (guint i = 0; i < n_columns; i++)
    {
      double v;

      if (!row_number (row, columns[i].column, columns[i].factor, required, &v, error))
        return FALSE;
      /* an optional column left empty keeps what the section had (a computed value) */
      if (!isnan (v))
        SECTION_FIELD (section, columns[i].offset) = v;
    }
  return TRUE;
}

static gboolean
read_designation (const Row   *row,
                  TrbSection  *section,
                  GError     **error)
{
  const char *text;

  if (!row_require_text (row, "designation", &text, error))
    return FALSE;
  return copy_string (section->designation, sizeof section->designation, row, "designation",
                      text, error);
}

static gboolean
parse_steel_row (const Row  *row,
                 gpointer    user_data,
                 GError    **error)
{
  ParseData *data = user_data;
  TrbSection s;

  trb_section_init_unknown (&s);
  if (!read_designation (row, &s, error)
      || !row_number (row, "W_lb_ft", TRB_PLF, TRUE, &s.weight, error))
    return FALSE;

  switch (data->family)
    {
    case TRB_FAMILY_W:
    case TRB_FAMILY_S:
      s.kind = data->family == TRB_FAMILY_W ? TRB_SHAPE_W : TRB_SHAPE_S;
      if (!read_columns (row, i_shape_columns, G_N_ELEMENTS (i_shape_columns), TRUE, &s, error)
          || !row_number (row, "bf_2tf_ratio", 1.0, TRUE, &s.bf_2tf, error))
        return FALSE;
      break;

    case TRB_FAMILY_C:
      s.kind = TRB_SHAPE_C;
      /* a channel's flange slenderness is bf/tf (the whole flange is one free edge) */
      if (!read_columns (row, i_shape_columns, G_N_ELEMENTS (i_shape_columns), TRUE, &s, error)
          || !row_number (row, "b_t_ratio", 1.0, TRUE, &s.bf_2tf, error))
        return FALSE;
      break;

    case TRB_FAMILY_HSS_RECT:
      s.kind = TRB_SHAPE_HSS_RECT;
      if (!read_columns (row, hss_columns, G_N_ELEMENTS (hss_columns), TRUE, &s, error))
        return FALSE;
      break;

    case TRB_FAMILY_SAWN:
    case TRB_FAMILY_GLULAM:
    case TRB_N_FAMILIES:
    default:
      g_assert_not_reached ();
    }

  s.b = NAN;
  g_array_append_val (data->out, s);
  return TRUE;
}

/* ------------------------------------------------------------------------------------------ */
/* Wood */

static const char *
known_size_class (const char *name)
{
  static const char * const known[] = {
    "dimension", "beams_and_stringers", "posts_and_timbers", "glulam",
  };

  for (guint i = 0; i < G_N_ELEMENTS (known); i++)
    if (g_ascii_strcasecmp (name, known[i]) == 0)
      return known[i];
  return NULL;
}

/* NDS size classes by nominal size (NDS Supplement 2018 Table 1B and §4.1.3, from memory):
 * 2 to 4 in thick is dimension lumber; 5 in and thicker is beams and stringers when the width
 * exceeds the thickness by more than 2 in, posts and timbers otherwise. */
static const char *
sawn_size_class (double nominal_b_in,
                 double nominal_d_in)
{
  double thick = MIN (nominal_b_in, nominal_d_in);
  double wide = MAX (nominal_b_in, nominal_d_in);

  if (thick < 4.5)
    return "dimension";
  return wide > thick + 2 ? "beams_and_stringers" : "posts_and_timbers";
}

/* Finishes a wood section: kind, weight at 35 pcf, names. */
static void
finish_wood (TrbSection   *s,
             TrbShapeKind  kind,
             const char   *designation,
             double        nominal_b_in,
             double        nominal_d_in,
             const char   *size_class)
{
  s->kind = kind;
  s->weight = s->A * WOOD_DENSITY;
  g_strlcpy (s->designation, designation, sizeof s->designation);
  s->nominal_b_in = nominal_b_in;
  s->nominal_d_in = nominal_d_in;
  g_strlcpy (s->size_class, size_class, sizeof s->size_class);
}

static gboolean
parse_nominal (const char *text,
               double     *b,
               double     *d)
{
  g_auto(GStrv) parts = g_strsplit_set (text, "xX", -1);

  return g_strv_length (parts) == 2 && parse_number (parts[0], b) && parse_number (parts[1], d)
         && *b > 0 && *d > 0;
}

/* lumber.csv: single members as listed; 2- and 3-ply built-up members of the 2x dimension
 * sizes 2x6 to 2x14, whose size factors are those of one ply (Table 4A sizes a ply). */
static gboolean
parse_lumber_row (const Row  *row,
                  gpointer    user_data,
                  GError    **error)
{
  ParseData *data = user_data;
  const char *nominal, *size_class_text, *size_class;
  double nb, nd, b, d, cf_fb, cf_ft, cf_fc;
  TrbSection s;

  if (!row_require_text (row, "nominal", &nominal, error)
      || !row_require_text (row, "size_class", &size_class_text, error)
      || !row_number (row, "b_in", TRB_IN, TRUE, &b, error)
      || !row_number (row, "d_in", TRB_IN, TRUE, &d, error)
      || !row_number (row, "CF_Fb_T4A", 1.0, FALSE, &cf_fb, error)
      || !row_number (row, "CF_Ft_T4A", 1.0, FALSE, &cf_ft, error)
      || !row_number (row, "CF_Fc_T4A", 1.0, FALSE, &cf_fc, error))
    return FALSE;

  if (!parse_nominal (nominal, &nb, &nd))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column nominal: \"%s\" is not a size like 2x10",
                   row->source, row->line, nominal);
      return FALSE;
    }
  size_class = known_size_class (size_class_text);
  if (size_class == NULL || g_str_equal (size_class, "glulam"))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column size_class: \"%s\" is not a sawn lumber size class",
                   row->source, row->line, size_class_text);
      return FALSE;
    }
  /* room for the "3-" of a built-up member */
  if (strlen (nominal) + 2 >= sizeof s.designation)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column nominal: \"%s\" is too long",
                   row->source, row->line, nominal);
      return FALSE;
    }

  for (int plies = 1; plies <= 3; plies++)
    {
      g_autofree char *designation = NULL;

      if (plies > 1 && !(nb == 2 && nd >= 6 && nd <= 14 && g_str_equal (size_class, "dimension")))
        break;
      designation = plies == 1 ? g_strdup (nominal) : g_strdup_printf ("%d-%s", plies, nominal);
      trb_section_compute_rect (b, d, plies, &s);
      finish_wood (&s, TRB_SHAPE_SAWN, designation, nb, nd, size_class);
      s.CF_Fb = cf_fb;
      s.CF_Ft = cf_ft;
      s.CF_Fc = cf_fc;
      g_array_append_val (data->out, s);
    }
  return TRUE;
}

/* The glulam series: Douglas Fir 24F-V4 in the common Western species widths 3-1/8, 5-1/8,
 * 6-3/4 and 8-3/4 in (from memory), 1-1/2 in laminations, 6 to 36 in deep. */
static void
add_glulam_series (GArray *out)
{
  static const double widths_in[] = { 3.125, 5.125, 6.75, 8.75 };

  for (guint i = 0; i < G_N_ELEMENTS (widths_in); i++)
    for (int lams = 4; lams <= 24; lams++)
      {
        double d_in = 1.5 * lams;
        g_autofree char *w = format_inches (widths_in[i]);
        g_autofree char *h = format_inches (d_in);
        g_autofree char *designation = g_strdup_printf ("%sx%s", w, h);
        TrbSection s;

        trb_section_compute_rect (widths_in[i] * TRB_IN, d_in * TRB_IN, 1, &s);
        finish_wood (&s, TRB_SHAPE_GLULAM, designation, widths_in[i], d_in, "glulam");
        g_array_append_val (out, s);
      }
}

/* The rectangle form of a project's sections, and of a glulam list:
 * designation,kind,b_in,d_in[,plies][,weight_plf][,size_class][,nominal_b_in,nominal_d_in]
 * [,CF_Fb,CF_Ft,CF_Fc]. kind may be left out when the family says it. */
static gboolean
parse_rect_row (const Row  *row,
                gpointer    user_data,
                GError    **error)
{
  ParseData *data = user_data;
  const char *designation, *kind_text, *plies_text, *class_text;
  TrbShapeKind kind;
  double b, d, weight, nb, nd, plies_v = 1;
  const char *size_class;
  TrbSection s;

  if (!row_require_text (row, "designation", &designation, error)
      || !row_number (row, "b_in", TRB_IN, TRUE, &b, error)
      || !row_number (row, "d_in", TRB_IN, TRUE, &d, error)
      || !row_number (row, "weight_plf", TRB_PLF, FALSE, &weight, error)
      || !row_number (row, "nominal_b_in", 1.0, FALSE, &nb, error)
      || !row_number (row, "nominal_d_in", 1.0, FALSE, &nd, error))
    return FALSE;

  kind_text = row_text (row, "kind");
  if (kind_text == NULL && data->family == TRB_FAMILY_GLULAM)
    kind_text = "glulam";
  else if (kind_text == NULL && data->family == TRB_FAMILY_SAWN)
    kind_text = "sawn";
  if (kind_text != NULL && g_ascii_strcasecmp (kind_text, "sawn") == 0)
    kind = TRB_SHAPE_SAWN;
  else if (kind_text != NULL && g_ascii_strcasecmp (kind_text, "glulam") == 0)
    kind = TRB_SHAPE_GLULAM;
  else
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column kind: \"%s\" is neither sawn nor glulam",
                   row->source, row->line, kind_text != NULL ? kind_text : "");
      return FALSE;
    }

  plies_text = row_text (row, "plies");
  if (plies_text != NULL
      && (!parse_number (plies_text, &plies_v) || plies_v != floor (plies_v)
          || plies_v < 1 || plies_v > 9))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column plies: \"%s\" is not a whole number from 1 to 9",
                   row->source, row->line, plies_text);
      return FALSE;
    }
  if (kind == TRB_SHAPE_GLULAM && plies_v != 1)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "%s: line %u: a glulam member has one ply", row->source, row->line);
      return FALSE;
    }

  /* A rough-sawn or full-size member's nominal size is its actual size. */
  if (isnan (nb))
    nb = b / TRB_IN;
  if (isnan (nd))
    nd = d / TRB_IN;

  class_text = row_text (row, "size_class");
  if (kind == TRB_SHAPE_GLULAM)
    size_class = "glulam";
  else if (class_text == NULL)
    size_class = sawn_size_class (nb, nd);
  else if ((size_class = known_size_class (class_text)) == NULL
           || g_str_equal (size_class, "glulam"))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column size_class: \"%s\" is not a sawn lumber size class",
                   row->source, row->line, class_text);
      return FALSE;
    }

  if (!copy_string (s.designation, sizeof s.designation, row, "designation", designation,
                    error))
    return FALSE;
  trb_section_compute_rect (b, d, (int) plies_v, &s);
  finish_wood (&s, kind, designation, nb, nd, size_class);
  if (!isnan (weight))
    s.weight = weight;
  if (!row_number (row, "CF_Fb", 1.0, FALSE, &s.CF_Fb, error)
      || !row_number (row, "CF_Ft", 1.0, FALSE, &s.CF_Ft, error)
      || !row_number (row, "CF_Fc", 1.0, FALSE, &s.CF_Fc, error))
    return FALSE;
  g_array_append_val (data->out, s);
  return TRUE;
}

/* The W-shape form of a project's sections: designation, W_lb_ft and the dimensions d_in,
 * bf_in, tw_in, tf_in are needed; kdes_in gives the fillets (none without it); every other
 * property is computed (trb_section_compute_i()) unless its column gives it. */
static gboolean
parse_project_i_row (const Row  *row,
                     gpointer    user_data,
                     GError    **error)
{
  ParseData *data = user_data;
  double weight, d, bf, tw, tf, kdes, ratio;
  TrbSection s;

  if (!row_number (row, "W_lb_ft", TRB_PLF, TRUE, &weight, error)
      || !row_number (row, "d_in", TRB_IN, TRUE, &d, error)
      || !row_number (row, "bf_in", TRB_IN, TRUE, &bf, error)
      || !row_number (row, "tw_in", TRB_IN, TRUE, &tw, error)
      || !row_number (row, "tf_in", TRB_IN, TRUE, &tf, error)
      || !row_number (row, "kdes_in", TRB_IN, FALSE, &kdes, error))
    return FALSE;
  if (isnan (kdes))
    kdes = tf;
  if (!(d > 2 * tf && bf >= tw && kdes >= tf && d > 2 * kdes))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "%s: line %u: these dimensions do not make an I shape "
                   "(d > 2 kdes, kdes >= tf, bf >= tw)", row->source, row->line);
      return FALSE;
    }

  trb_section_compute_i (d, bf, tw, tf, kdes - tf, &s);
  s.weight = weight;
  if (!read_designation (row, &s, error)
      || !read_columns (row, i_shape_columns, G_N_ELEMENTS (i_shape_columns), FALSE, &s, error)
      || !row_number (row, "bf_2tf_ratio", 1.0, FALSE, &ratio, error))
    return FALSE;
  if (!isnan (ratio))
    s.bf_2tf = ratio;
  g_array_append_val (data->out, s);
  return TRUE;
}

/* ------------------------------------------------------------------------------------------ */
/* The catalog */

static int
compare_sections (gconstpointer a,
                  gconstpointer b)
{
  const TrbSection *sa = a;
  const TrbSection *sb = b;

  if (sa->weight != sb->weight)
    return sa->weight < sb->weight ? -1 : 1;
  if (sa->d != sb->d)
    return sa->d < sb->d ? -1 : 1;
  return strcmp (sa->designation, sb->designation);
}

static TrbFamily
family_of_kind (TrbShapeKind kind)
{
  switch (kind)
    {
    case TRB_SHAPE_W:
      return TRB_FAMILY_W;
    case TRB_SHAPE_S:
      return TRB_FAMILY_S;
    case TRB_SHAPE_C:
      return TRB_FAMILY_C;
    case TRB_SHAPE_HSS_RECT:
      return TRB_FAMILY_HSS_RECT;
    case TRB_SHAPE_SAWN:
      return TRB_FAMILY_SAWN;
    case TRB_SHAPE_GLULAM:
      return TRB_FAMILY_GLULAM;
    case TRB_SHAPE_CUSTOM:
    default:
      g_assert_not_reached ();
    }
}

/* Sorting moves the sections, so the index is rebuilt after every addition. */
static void
catalog_reindex (TrbCatalog *catalog)
{
  g_hash_table_remove_all (catalog->index);
  for (guint f = 0; f < TRB_N_FAMILIES; f++)
    {
      GArray *family = catalog->families[f];

      g_array_sort (family, compare_sections);
      for (guint i = 0; i < family->len; i++)
        {
          TrbSection *s = &g_array_index (family, TrbSection, i);

          g_hash_table_insert (catalog->index, normalise_designation (s->designation), s);
        }
    }
}

/* Adds parsed sections, all or none: a designation already in the catalog or twice in the
 * new rows is an error naming the row's line. */
static gboolean
catalog_commit (TrbCatalog  *catalog,
                GArray      *sections,
                GArray      *lines,
                const char  *source,
                GError     **error)
{
  g_autoptr(GHashTable) seen = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);

  for (guint i = 0; i < sections->len; i++)
    {
      const TrbSection *s = &g_array_index (sections, TrbSection, i);
      char *key = normalise_designation (s->designation);

      if (g_hash_table_contains (catalog->index, key) || g_hash_table_contains (seen, key))
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                       "%s: line %u: %s is already in the catalog",
                       source, g_array_index (lines, guint, i), s->designation);
          g_free (key);
          return FALSE;
        }
      g_hash_table_add (seen, key);
    }

  for (guint i = 0; i < sections->len; i++)
    {
      const TrbSection *s = &g_array_index (sections, TrbSection, i);

      g_array_append_val (catalog->families[family_of_kind (s->kind)], *s);
    }
  catalog_reindex (catalog);
  return TRUE;
}

/* Runs a row parser and remembers the line each section came from, for duplicate errors. */
typedef struct
{
  RowFunc    func;
  ParseData *data;
  GArray    *lines;
} LineTracker;

static gboolean
track_lines (const Row  *row,
             gpointer    user_data,
             GError    **error)
{
  LineTracker *t = user_data;
  guint before = t->data->out->len;

  if (!t->func (row, t->data, error))
    return FALSE;
  for (guint i = before; i < t->data->out->len; i++)
    g_array_append_val (t->lines, row->line);
  return TRUE;
}

static gboolean
catalog_add_rows (TrbCatalog         *catalog,
                  const char         *csv_text,
                  const char         *source_name,
                  TrbFamily           family,
                  const char * const *required,
                  RowFunc             func,
                  GError            **error)
{
  g_autoptr(GArray) sections = g_array_new (FALSE, FALSE, sizeof (TrbSection));
  g_autoptr(GArray) lines = g_array_new (FALSE, FALSE, sizeof (guint));
  ParseData data = { family, sections };
  LineTracker tracker = { func, &data, lines };

  if (!csv_foreach_row (csv_text, source_name, required, track_lines, &tracker, error))
    return FALSE;
  return catalog_commit (catalog, sections, lines, source_name, error);
}

/**
 * trb_catalog_new:
 *
 * Returns: (transfer full): an empty catalog
 */
TrbCatalog *
trb_catalog_new (void)
{
  TrbCatalog *catalog = g_new0 (TrbCatalog, 1);

  for (guint f = 0; f < TRB_N_FAMILIES; f++)
    catalog->families[f] = g_array_new (FALSE, FALSE, sizeof (TrbSection));
  catalog->grades = g_array_new (FALSE, FALSE, sizeof (TrbWoodGrade));
  catalog->index = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  return catalog;
}

/**
 * trb_catalog_free:
 * @catalog: (nullable): a catalog, not the default one
 */
void
trb_catalog_free (TrbCatalog *catalog)
{
  if (catalog == NULL)
    return;
  for (guint f = 0; f < TRB_N_FAMILIES; f++)
    g_array_unref (catalog->families[f]);
  g_array_unref (catalog->grades);
  g_hash_table_unref (catalog->index);
  g_free (catalog);
}

/**
 * trb_catalog_add_csv:
 * @catalog: the catalog
 * @csv_text: the file's text
 * @source_name: the name errors give for the text (a file name)
 * @family: what the file holds
 * @error: return location for a #GError
 *
 * Adds the sections of one family from CSV text with the columns of the bundled files
 * (docs/catalog.md): %TRB_FAMILY_W and %TRB_FAMILY_S the W-shape columns, %TRB_FAMILY_C the
 * channel columns, %TRB_FAMILY_HSS_RECT the rectangular HSS columns, %TRB_FAMILY_SAWN those
 * of lumber.csv (built-up members of 2x6 to 2x14 are added with each 2x row) and
 * %TRB_FAMILY_GLULAM the rectangle form "designation,b_in,d_in". Columns are found by name.
 *
 * Returns: %TRUE on success; %FALSE with @error set (%TRB_ERROR_PARSE or %TRB_ERROR_INVALID,
 *   naming @source_name and the line) and nothing added
 */
gboolean
trb_catalog_add_csv (TrbCatalog  *catalog,
                     const char  *csv_text,
                     const char  *source_name,
                     TrbFamily    family,
                     GError     **error)
{
  static const char * const i_required[] = { "designation", "W_lb_ft", NULL };
  static const char * const lumber_required[] = { "nominal", "size_class", "b_in", "d_in", NULL };
  static const char * const rect_required[] = { "designation", "b_in", "d_in", NULL };

  g_return_val_if_fail (catalog != NULL, FALSE);
  g_return_val_if_fail (csv_text != NULL, FALSE);
  g_return_val_if_fail (source_name != NULL, FALSE);
  g_return_val_if_fail (family < TRB_N_FAMILIES, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  switch (family)
    {
    case TRB_FAMILY_W:
    case TRB_FAMILY_S:
    case TRB_FAMILY_C:
    case TRB_FAMILY_HSS_RECT:
      return catalog_add_rows (catalog, csv_text, source_name, family, i_required,
                               parse_steel_row, error);
    case TRB_FAMILY_SAWN:
      return catalog_add_rows (catalog, csv_text, source_name, family, lumber_required,
                               parse_lumber_row, error);
    case TRB_FAMILY_GLULAM:
      return catalog_add_rows (catalog, csv_text, source_name, family, rect_required,
                               parse_rect_row, error);
    case TRB_N_FAMILIES:
    default:
      g_assert_not_reached ();
    }
}

/**
 * trb_catalog_new_from_csv:
 * @csv_text: the file's text
 * @source_name: the name errors give for the text
 * @family: what the file holds
 * @error: return location for a #GError
 *
 * A catalog of one family: trb_catalog_new() and trb_catalog_add_csv().
 *
 * Returns: (transfer full) (nullable): the catalog, or %NULL with @error set
 */
TrbCatalog *
trb_catalog_new_from_csv (const char  *csv_text,
                          const char  *source_name,
                          TrbFamily    family,
                          GError     **error)
{
  g_autoptr(TrbCatalog) catalog = trb_catalog_new ();

  if (!trb_catalog_add_csv (catalog, csv_text, source_name, family, error))
    return NULL;
  return g_steal_pointer (&catalog);
}

/**
 * trb_catalog_add_project_csv:
 * @catalog: the catalog
 * @csv_text: the file's text
 * @source_name: the name errors give for the text
 * @error: return location for a #GError
 *
 * Adds a project's own sections. A header with a kind column is the rectangle form
 * (designation,kind,b_in,d_in and optional plies, weight_plf, size_class, nominal_b_in,
 * nominal_d_in, CF_Fb, CF_Ft, CF_Fc; kind is sawn or glulam); a header without one is the
 * W-shape form (the columns of the bundled W file; designation, W_lb_ft, d_in, bf_in, tw_in,
 * tf_in needed, the rest computed from the dimensions where absent). docs/catalog.md has
 * the details.
 *
 * Returns: %TRUE on success; %FALSE with @error set and nothing added
 */
gboolean
trb_catalog_add_project_csv (TrbCatalog  *catalog,
                             const char  *csv_text,
                             const char  *source_name,
                             GError     **error)
{
  static const char * const rect_required[] = {
    "designation", "kind", "b_in", "d_in", NULL
  };
  static const char * const i_required[] = {
    "designation", "W_lb_ft", "d_in", "bf_in", "tw_in", "tf_in", NULL
  };
  g_autoptr(GPtrArray) header = g_ptr_array_new_with_free_func (g_free);
  gboolean has_kind = FALSE;
  CsvReader reader;

  g_return_val_if_fail (catalog != NULL, FALSE);
  g_return_val_if_fail (csv_text != NULL, FALSE);
  g_return_val_if_fail (source_name != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  /* Peek at the header to tell the forms apart; the full read reports any error in it. */
  csv_reader_init (&reader, csv_text, source_name);
  if (csv_next_record (&reader, header, NULL))
    for (guint i = 0; i < header->len; i++)
      if (g_ascii_strcasecmp (g_ptr_array_index (header, i), "kind") == 0)
        has_kind = TRUE;

  if (has_kind)
    return catalog_add_rows (catalog, csv_text, source_name, TRB_N_FAMILIES, rect_required,
                             parse_rect_row, error);
  return catalog_add_rows (catalog, csv_text, source_name, TRB_FAMILY_W, i_required,
                           parse_project_i_row, error);
}

/**
 * trb_catalog_new_from_project_csv:
 * @csv_text: the file's text
 * @source_name: the name errors give for the text
 * @error: return location for a #GError
 *
 * A catalog of a project's own sections: trb_catalog_new() and
 * trb_catalog_add_project_csv().
 *
 * Returns: (transfer full) (nullable): the catalog, or %NULL with @error set
 */
TrbCatalog *
trb_catalog_new_from_project_csv (const char  *csv_text,
                                  const char  *source_name,
                                  GError     **error)
{
  g_autoptr(TrbCatalog) catalog = trb_catalog_new ();

  if (!trb_catalog_add_project_csv (catalog, csv_text, source_name, error))
    return NULL;
  return g_steal_pointer (&catalog);
}

/* ------------------------------------------------------------------------------------------ */
/* Wood grades */

/* The values file describes size classes in words; the catalog keeps one name for each. */
static const char *
grade_size_class (const char *text)
{
  g_autofree char *lower = g_ascii_strdown (text, -1);

  if (g_str_has_prefix (lower, "2-4 in thick"))
    return "dimension";
  if (g_str_has_prefix (lower, "beams and stringers"))
    return "beams_and_stringers";
  if (g_str_has_prefix (lower, "posts and timbers"))
    return "posts_and_timbers";
  if (strstr (lower, "glued laminated") != NULL || g_str_equal (lower, "glulam"))
    return "glulam";
  return known_size_class (text);
}

/* width_in: "all", a single nominal width "8", or a range "2-4". */
static gboolean
parse_width_range (const char *text,
                   double     *lo,
                   double     *hi)
{
  g_auto(GStrv) parts = NULL;

  if (g_ascii_strcasecmp (text, "all") == 0)
    {
      *lo = 0;
      *hi = 1e9;
      return TRUE;
    }
  parts = g_strsplit (text, "-", -1);
  if (g_strv_length (parts) == 1)
    return parse_number (parts[0], lo) && parse_number (parts[0], hi) && *lo > 0;
  return g_strv_length (parts) == 2 && parse_number (parts[0], lo)
         && parse_number (parts[1], hi) && *lo > 0 && *hi >= *lo;
}

static gboolean
parse_grade_row (const Row  *row,
                 gpointer    user_data,
                 GError    **error)
{
  GArray *out = user_data;
  const char *species, *grade, *class_text, *width, *source, *confidence;
  const char *size_class;
  double fb_neg;
  TrbWoodGrade g = { 0 };

  if (!row_require_text (row, "species", &species, error)
      || !row_require_text (row, "grade", &grade, error)
      || !row_require_text (row, "size_class", &class_text, error)
      || !row_require_text (row, "width_in", &width, error)
      || !row_require_text (row, "source", &source, error)
      || !row_require_text (row, "confidence", &confidence, error)
      || !copy_string (g.species, sizeof g.species, row, "species", species, error)
      || !copy_string (g.grade, sizeof g.grade, row, "grade", grade, error)
      || !copy_string (g.source, sizeof g.source, row, "source", source, error)
      || !copy_string (g.confidence, sizeof g.confidence, row, "confidence", confidence, error)
      || !row_number (row, "Fb_psi", TRB_PSI, TRUE, &g.Fb, error)
      || !row_number (row, "Ft_psi", TRB_PSI, TRUE, &g.Ft, error)
      || !row_number (row, "Fv_psi", TRB_PSI, TRUE, &g.Fv, error)
      || !row_number (row, "Fc_perp_psi", TRB_PSI, TRUE, &g.Fc_perp, error)
      || !row_number (row, "Fc_psi", TRB_PSI, TRUE, &g.Fc, error)
      || !row_number (row, "E_psi", TRB_PSI, TRUE, &g.E, error)
      || !row_number (row, "Emin_psi", TRB_PSI, TRUE, &g.Emin, error)
      || !row_number (row, "Fb_neg_psi", TRB_PSI, FALSE, &fb_neg, error))
    return FALSE;

  size_class = grade_size_class (class_text);
  if (size_class == NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column size_class: \"%s\" is not a known size class",
                   row->source, row->line, class_text);
      return FALSE;
    }
  g_strlcpy (g.size_class, size_class, sizeof g.size_class);

  if (!parse_width_range (width, &g.width_min_in, &g.width_max_in))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_PARSE,
                   "%s: line %u: column width_in: \"%s\" is not \"all\", a width or a range",
                   row->source, row->line, width);
      return FALSE;
    }

  g.Fb_neg = fb_neg;
  if (isnan (g.Fb_neg) && g_str_equal (size_class, "glulam")
      && g_ascii_strncasecmp (grade, "24F-V4", 6) == 0)
    g.Fb_neg = GLULAM_24F_V4_FB_NEG_PSI * TRB_PSI;

  g_array_append_val (out, g);
  return TRUE;
}

/**
 * trb_catalog_add_grades_csv:
 * @catalog: the catalog
 * @csv_text: text with the columns of wood-design-values.csv
 * @source_name: the name errors give for the text
 * @error: return location for a #GError
 *
 * Adds reference design values, one #TrbWoodGrade per row. Size classes map to "dimension",
 * "beams_and_stringers", "posts_and_timbers" and "glulam"; width_in is "all", a nominal
 * width or a range of them. An optional Fb_neg_psi column gives glulam's Fbx-; without it the
 * 24F-V4 rows take 1850 psi (NDS Supplement 2018 Table 5A, from memory).
 *
 * Returns: %TRUE on success; %FALSE with @error set and nothing added
 */
gboolean
trb_catalog_add_grades_csv (TrbCatalog  *catalog,
                            const char  *csv_text,
                            const char  *source_name,
                            GError     **error)
{
  static const char * const required[] = {
    "species", "grade", "size_class", "width_in", "Fb_psi", "Ft_psi", "Fv_psi", "Fc_perp_psi",
    "Fc_psi", "E_psi", "Emin_psi", "source", "confidence", NULL
  };
  g_autoptr(GArray) grades = g_array_new (FALSE, FALSE, sizeof (TrbWoodGrade));

  g_return_val_if_fail (catalog != NULL, FALSE);
  g_return_val_if_fail (csv_text != NULL, FALSE);
  g_return_val_if_fail (source_name != NULL, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  if (!csv_foreach_row (csv_text, source_name, required, parse_grade_row, grades, error))
    return FALSE;
  g_array_append_vals (catalog->grades, grades->data, grades->len);
  return TRUE;
}

/* ------------------------------------------------------------------------------------------ */
/* The bundled catalog */

static char *
load_resource_text (const char *file)
{
  g_autofree char *path = g_strconcat (RESOURCE_PATH, file, NULL);
  g_autoptr(GError) error = NULL;
  g_autoptr(GBytes) bytes = NULL;
  gsize size;
  const char *data;

  bytes = g_resources_lookup_data (path, G_RESOURCE_LOOKUP_FLAGS_NONE, &error);
  if (bytes == NULL)
    g_error ("bundled section data %s: %s", path, error->message);
  data = g_bytes_get_data (bytes, &size);
  return g_strndup (data, size);
}

static void
load_bundled (TrbCatalog *catalog,
              const char *file,
              TrbFamily   family)
{
  g_autofree char *text = load_resource_text (file);
  g_autoptr(GError) error = NULL;

  /* the bundled files are part of the program: one that does not parse is a bug */
  if (!trb_catalog_add_csv (catalog, text, file, family, &error))
    g_error ("bundled section data: %s", error->message);
}

/**
 * trb_catalog_get_default:
 *
 * The bundled catalogs: the W, S, C and rectangular HSS shapes of the AISC Shapes Database
 * v16.0, sawn lumber with its 2- and 3-ply built-up members, the 24F-V4 glulam series, and
 * the wood design values. Loaded once, on first use, from any thread.
 *
 * Returns: (transfer none): the catalog; never %NULL
 */
const TrbCatalog *
trb_catalog_get_default (void)
{
  static TrbCatalog *default_catalog = NULL;

  if (g_once_init_enter (&default_catalog))
    {
      TrbCatalog *catalog = trb_catalog_new ();
      g_autofree char *grades = NULL;
      g_autoptr(GError) error = NULL;
      g_autoptr(GArray) glulam = g_array_new (FALSE, FALSE, sizeof (TrbSection));
      g_autoptr(GArray) lines = g_array_new (FALSE, TRUE, sizeof (guint));

      /* Naming the resource keeps its object in the link out of the static library; its
       * constructor registers it, for g_resources_lookup_data(). */
      if (trb_sections_get_resource () == NULL)
        g_error ("bundled section data is missing");

      load_bundled (catalog, "steel-w-shapes.csv", TRB_FAMILY_W);
      load_bundled (catalog, "steel-s-shapes.csv", TRB_FAMILY_S);
      load_bundled (catalog, "steel-c-shapes.csv", TRB_FAMILY_C);
      load_bundled (catalog, "steel-hss-rect.csv", TRB_FAMILY_HSS_RECT);
      load_bundled (catalog, "lumber.csv", TRB_FAMILY_SAWN);

      add_glulam_series (glulam);
      g_array_set_size (lines, glulam->len);
      if (!catalog_commit (catalog, glulam, lines, "glulam series", &error))
        g_error ("bundled section data: %s", error->message);

      grades = load_resource_text ("wood-design-values.csv");
      if (!trb_catalog_add_grades_csv (catalog, grades, "wood-design-values.csv", &error))
        g_error ("bundled section data: %s", error->message);

      g_once_init_leave (&default_catalog, catalog);
    }
  return default_catalog;
}

/* ------------------------------------------------------------------------------------------ */
/* Queries */

/**
 * trb_catalog_get_family:
 * @catalog: the catalog
 * @family: which family
 * @n_sections: (out): how many sections it has
 *
 * Returns: (transfer none) (array length=n_sections) (nullable): the family's sections by
 *   weight, then depth; %NULL when it has none
 */
const TrbSection *
trb_catalog_get_family (const TrbCatalog *catalog,
                        TrbFamily         family,
                        guint            *n_sections)
{
  GArray *sections;

  g_return_val_if_fail (catalog != NULL, NULL);
  g_return_val_if_fail (family < TRB_N_FAMILIES, NULL);
  g_return_val_if_fail (n_sections != NULL, NULL);

  sections = catalog->families[family];
  *n_sections = sections->len;
  return sections->len > 0 ? &g_array_index (sections, TrbSection, 0) : NULL;
}

/**
 * trb_catalog_lookup:
 * @catalog: the catalog
 * @designation: "W18X35", "w18x35", "2-2x12", "5-1/8x18" ...
 *
 * Finds a section in any family. Case does not matter ("x" and "X" agree), nor do spaces,
 * and a multiplication sign reads as X.
 *
 * Returns: (transfer none) (nullable): the section, or %NULL
 */
const TrbSection *
trb_catalog_lookup (const TrbCatalog *catalog,
                    const char       *designation)
{
  g_autofree char *key = NULL;

  g_return_val_if_fail (catalog != NULL, NULL);
  g_return_val_if_fail (designation != NULL, NULL);

  key = normalise_designation (designation);
  return g_hash_table_lookup (catalog->index, key);
}

/**
 * trb_catalog_complete:
 * @catalog: the catalog
 * @prefix: what has been typed
 * @max: the most designations wanted; 0 for all
 *
 * Designations that begin with @prefix, compared as trb_catalog_lookup() compares them, in
 * family order and within a family by weight: "W18" gives W18X35, W18X40, ...
 *
 * Returns: (transfer full) (element-type utf8): the designations
 */
GPtrArray *
trb_catalog_complete (const TrbCatalog *catalog,
                      const char       *prefix,
                      guint             max)
{
  g_autoptr(GPtrArray) found = g_ptr_array_new_with_free_func (g_free);
  g_autofree char *key = NULL;

  g_return_val_if_fail (catalog != NULL, NULL);
  g_return_val_if_fail (prefix != NULL, NULL);

  key = normalise_designation (prefix);
  for (guint f = 0; f < TRB_N_FAMILIES; f++)
    {
      GArray *family = catalog->families[f];

      for (guint i = 0; i < family->len; i++)
        {
          const TrbSection *s = &g_array_index (family, TrbSection, i);
          g_autofree char *name = normalise_designation (s->designation);

          if (max > 0 && found->len >= max)
            return g_steal_pointer (&found);
          if (g_str_has_prefix (name, key))
            g_ptr_array_add (found, g_strdup (s->designation));
        }
    }
  return g_steal_pointer (&found);
}

/**
 * trb_catalog_get_grades:
 * @catalog: the catalog
 * @n_grades: (out): how many there are
 *
 * Returns: (transfer none) (array length=n_grades) (nullable): the wood grades in file order
 */
const TrbWoodGrade *
trb_catalog_get_grades (const TrbCatalog *catalog,
                        guint            *n_grades)
{
  g_return_val_if_fail (catalog != NULL, NULL);
  g_return_val_if_fail (n_grades != NULL, NULL);

  *n_grades = catalog->grades->len;
  return catalog->grades->len > 0 ? &g_array_index (catalog->grades, TrbWoodGrade, 0) : NULL;
}

/* Species and grade compare on letters and digits only, upper case, with "#" read as "No":
 * "No.2", "No. 2" and "#2" agree. The trade's short names stand for the species and grades
 * (common practice). */
static char *
grade_key (const char *text)
{
  static const struct { const char *alias, *key; } aliases[] = {
    { "DFL", "DOUGLASFIRLARCH" },
    { "HF", "HEMFIR" },
    { "SPF", "SPRUCEPINEFIR" },
    { "SP", "SOUTHERNPINE" },
    { "SYP", "SOUTHERNPINE" },
    { "SS", "SELECTSTRUCTURAL" },
    { "SELSTR", "SELECTSTRUCTURAL" },
  };
  GString *key = g_string_new (NULL);

  for (const char *p = text; *p != '\0'; p++)
    {
      if (*p == '#')
        g_string_append (key, "NO");
      else if (g_ascii_isalnum (*p))
        g_string_append_c (key, g_ascii_toupper (*p));
    }
  for (guint i = 0; i < G_N_ELEMENTS (aliases); i++)
    if (g_str_equal (key->str, aliases[i].alias))
      {
        g_string_assign (key, aliases[i].key);
        break;
      }
  return g_string_free (key, FALSE);
}

/**
 * trb_catalog_lookup_grade:
 * @catalog: the catalog
 * @species: "Douglas Fir-Larch" (or "DF-L"), "Douglas Fir (glulam)" ...
 * @grade: "No.2" (or "#2", "No. 2"), "Select Structural" (or "SS"), "24F-V4 DF/DF" ...
 * @section: the sawn or glulam section the values are for
 *
 * The row of reference design values for @section: species and grade match (case, spaces
 * and punctuation aside), the size class is the section's ("glulam" for glulam), and the
 * width range holds the section's nominal depth. Rows given for single widths cover the
 * widths above the next narrower row (a 7 in width takes the 8 in row); a width above every
 * row takes the widest (NDS Supplement Table 4B: widths over 12 in use the 12 in row).
 *
 * Returns: (transfer none) (nullable): the values, or %NULL when the catalog has none
 */
const TrbWoodGrade *
trb_catalog_lookup_grade (const TrbCatalog *catalog,
                          const char       *species,
                          const char       *grade,
                          const TrbSection *section)
{
  g_autofree char *species_key = NULL;
  g_autofree char *grade_want = NULL;
  const TrbWoodGrade *best = NULL;
  const TrbWoodGrade *widest = NULL;
  const char *size_class;
  double width;

  g_return_val_if_fail (catalog != NULL, NULL);
  g_return_val_if_fail (species != NULL, NULL);
  g_return_val_if_fail (grade != NULL, NULL);
  g_return_val_if_fail (section != NULL, NULL);

  if (section->kind == TRB_SHAPE_GLULAM)
    size_class = "glulam";
  else if (section->kind == TRB_SHAPE_SAWN)
    size_class = section->size_class;
  else
    return NULL;

  width = section->nominal_d_in;
  if (isnan (width))
    width = section->d / TRB_IN;

  species_key = grade_key (species);
  grade_want = grade_key (grade);
  for (guint i = 0; i < catalog->grades->len; i++)
    {
      const TrbWoodGrade *g = &g_array_index (catalog->grades, TrbWoodGrade, i);
      g_autofree char *gs = grade_key (g->species);
      g_autofree char *gg = grade_key (g->grade);

      if (!g_str_equal (gs, species_key) || !g_str_equal (gg, grade_want)
          || g_ascii_strcasecmp (g->size_class, size_class) != 0)
        continue;
      if (width <= g->width_max_in && (best == NULL || g->width_max_in < best->width_max_in))
        best = g;
      if (widest == NULL || g->width_max_in > widest->width_max_in)
        widest = g;
    }
  return best != NULL ? best : widest;
}
