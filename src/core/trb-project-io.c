/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <gio/gio.h>
#include <glib/gstdio.h>
#include <libxml/parser.h>
#include <libxml/parserInternals.h>
#include <libxml/relaxng.h>
#include <libxml/tree.h>
#include <float.h>
#include <math.h>
#include <stdarg.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "trb-combos.h"
#include "trb-catalog.h"
#include "trb-data-resources.h"
#include "trb-error.h"
#include "trb-project-io.h"
#include "trb-project-io-private.h"
#include "trb-units.h"

G_DEFINE_AUTOPTR_CLEANUP_FUNC (xmlDoc, xmlFreeDoc)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (xmlParserCtxt, xmlFreeParserCtxt)

typedef struct
{
  const char *name;      /* for messages: the path as given, or a caller's name */
  GError    **error;
  const char *dir;       /* the project file's folder; NULL when loaded from memory */
  GHashTable *floors;    /* name -> first line, for duplicates */
  GHashTable *columns;   /* id -> first line: column marks, unique across the floors */
  GHashTable *walls;     /* id -> first line: wall marks, likewise */
} Loader;

/* What the DOCTYPE guard saw, and the parser's own element handler; reached from the parser
 * context's _private. */
typedef struct
{
  gboolean               doctype;
  int                    line;
  startElementNsSAX2Func start_element;
  guint64                nodes;       /* elements and attributes parsed so far */
  gboolean               too_many;    /* nodes went past TRB_PROJECT_MAX_NODES at line */
} Guard;

static gboolean G_GNUC_PRINTF (4, 5)
fail_at (Loader     *ld,
         int         line,
         TrbError    code,
         const char *format,
         ...)
{
  g_autofree char *raw = NULL;
  g_autofree char *msg = NULL;
  va_list args;

  va_start (args, format);
  raw = g_strdup_vprintf (format, args);
  va_end (args);
  /* libxml2's messages may quote the bad bytes of a file that is not UTF-8 as they are; a
   * message goes to a screen, so its bytes must be valid UTF-8 whatever the file held. */
  msg = g_utf8_make_valid (raw, -1);

  if (line > 0)
    g_set_error (ld->error, TRB_ERROR, code, "%s:%d: %s", ld->name, line, msg);
  else
    g_set_error (ld->error, TRB_ERROR, code, "%s: %s", ld->name, msg);
  return FALSE;
}

static int
node_line (xmlNode *node)
{
  long line;

  /* Past line 65535 libxml2 keeps an element's line only in the text around it, which gives
   * the next line for an empty element: on_start_element() keeps it in psvi instead (unused
   * without schema validation). */
  if (node->type == XML_ELEMENT_NODE && node->line == 65535 && node->psvi != NULL)
    return GPOINTER_TO_INT (node->psvi);
  line = xmlGetLineNo (node);

  return line > 0 && line < G_MAXINT ? (int) line : 0;
}

#define NAME(node) ((const char *) (node)->name)

/* The attribute without a namespace called @attr, as xmlHasNsProp() finds it in a document
 * without a DTD (the parser refuses one). */
static xmlAttr *
find_attr (xmlNode    *node,
           const char *attr)
{
  if (node->type != XML_ELEMENT_NODE)
    return NULL;
  for (xmlAttr *a = node->properties; a != NULL; a = a->next)
    if (a->ns == NULL && a->name[0] == (xmlChar) attr[0] &&
        strcmp ((const char *) a->name, attr) == 0)
      return a;
  return NULL;
}

/* The value as xmlGetNoNsProp() gives it, read in place when it is one text (the common
 * case) instead of copied twice. */
static char *
get_attr (xmlNode    *node,
          const char *attr)
{
  xmlAttr *a = find_attr (node, attr);
  xmlChar *v;
  char *copy;

  if (a == NULL)
    return NULL;
  if (a->children == NULL)
    return g_strdup ("");
  if (a->children->next == NULL && (a->children->type == XML_TEXT_NODE ||
                                    a->children->type == XML_CDATA_SECTION_NODE))
    return g_strdup ((const char *) a->children->content);
  v = xmlGetNoNsProp (node, (const xmlChar *) attr);
  if (v == NULL)
    return NULL;
  copy = g_strdup ((const char *) v);
  xmlFree (v);
  return copy;
}

static gboolean
has_attr (xmlNode    *node,
          const char *attr)
{
  return find_attr (node, attr) != NULL;
}

/* Every attribute must be one this element knows: a misspelt attribute would otherwise be
 * dropped in silence, and with it a load or a limit the engineer meant. */
static gboolean
check_attributes (Loader             *ld,
                  xmlNode            *node,
                  const char * const *allowed)
{
  for (xmlAttr *a = node->properties; a != NULL; a = a->next)
    {
      if (a->ns != NULL)
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "unknown attribute \"%s:%s\" on <%s>",
                        (const char *) a->ns->prefix, (const char *) a->name, NAME (node));
      if (!trb_project_io_priv_names_contain (allowed, (const char *) a->name))
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "unknown attribute \"%s\" on <%s>", (const char *) a->name, NAME (node));
    }
  return TRUE;
}

static gboolean
require_attr (Loader      *ld,
              xmlNode     *node,
              const char  *attr,
              char       **out)
{
  *out = get_attr (node, attr);
  if (*out == NULL)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "<%s> is missing the required attribute \"%s\"", NAME (node), attr);
  return TRUE;
}

/* Reads a quantity attribute. Absent: an error if required, else *value is left alone.
 * The units module's message is kept whole, after the attribute's name. */
static gboolean
get_quantity (Loader       *ld,
              xmlNode      *node,
              const char   *attr,
              TrbDimension  dim,
              gboolean      required,
              double       *value,
              char        **text_out)
{
  g_autofree char *text = get_attr (node, attr);
  g_autoptr(GError) local = NULL;
  double v;

  if (text == NULL)
    {
      if (required)
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "<%s> is missing the required attribute \"%s\"", NAME (node), attr);
      return TRUE;
    }

  if (!trb_units_parse (text, dim, &v, &local))
    {
      TrbError code = local->domain == TRB_ERROR ? (TrbError) local->code : TRB_ERROR_UNIT;

      return fail_at (ld, node_line (node), code, "attribute \"%s\": %s", attr, local->message);
    }
  /* The units module refuses NaN and Inf; this guards the model whatever it does. */
  if (!isfinite (v))
    return fail_at (ld, node_line (node), TRB_ERROR_UNIT,
                    "attribute \"%s\": \"%s\" is not a finite number", attr, text);

  *value = v;
  if (text_out != NULL)
    *text_out = g_steal_pointer (&text);
  return TRUE;
}

static gboolean
get_positive_quantity (Loader       *ld,
                       xmlNode      *node,
                       const char   *attr,
                       TrbDimension  dim,
                       gboolean      required,
                       double       *value)
{
  g_autofree char *text = NULL;
  double v = NAN;

  if (!get_quantity (ld, node, attr, dim, required, &v, &text))
    return FALSE;
  if (text == NULL)
    return TRUE;
  if (!(v > 0))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "attribute \"%s\" = \"%s\" must be greater than zero", attr, text);
  *value = v;
  return TRUE;
}

static gboolean
get_choice (Loader             *ld,
            xmlNode            *node,
            const char         *attr,
            const char * const *choices,
            int                *index)
{
  g_autofree char *text = get_attr (node, attr);
  g_autofree char *list = NULL;

  if (text == NULL)
    return TRUE;
  for (guint i = 0; choices[i] != NULL; i++)
    {
      if (strcmp (text, choices[i]) == 0)
        {
          *index = i;
          return TRUE;
        }
    }
  list = g_strjoinv ("|", (char **) choices);
  return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                  "attribute \"%s\" = \"%s\": expected one of %s", attr, text, list);
}

static gboolean
get_yes_no (Loader     *ld,
            xmlNode    *node,
            const char *attr,
            gboolean   *value)
{
  static const char * const yes_no[] = { "no", "yes", NULL };
  int i = *value ? 1 : 0;

  if (!get_choice (ld, node, attr, yes_no, &i))
    return FALSE;
  *value = i == 1;
  return TRUE;
}

static gboolean
parse_int (const char *text,
           gint64      min,
           gint64      max,
           gint64     *out)
{
  return g_ascii_string_to_signed (text, 10, min, max, out, NULL);
}

/* "L/360" (or "l/360") gives 360; "none" gives 0. */
static gboolean
get_deflection_limit (Loader     *ld,
                      xmlNode    *node,
                      const char *attr,
                      double     *value)
{
  g_autofree char *text = get_attr (node, attr);
  const char *p;
  char *end = NULL;
  double v;

  if (text == NULL)
    return TRUE;
  if (strcmp (text, "none") == 0)
    {
      *value = 0;
      return TRUE;
    }
  p = text;
  if ((p[0] == 'L' || p[0] == 'l') && p[1] == '/')
    {
      p += 2;
      v = g_ascii_strtod (p, &end);
      if (end != p && *end == '\0' && isfinite (v) && v > 0 && g_ascii_isdigit (*p))
        {
          *value = v;
          return TRUE;
        }
    }
  return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                  "attribute \"%s\" = \"%s\": expected a span ratio such as \"L/360\", or \"none\"",
                  attr, text);
}

/* A position on the member: within [0, L], with a billionth of L of slack so that "312 in"
 * on a "26 ft" member is the end, then clamped. */
static gboolean
get_position (Loader      *ld,
              xmlNode     *node,
              const char  *what,
              const char  *attr,
              double       length,
              const char  *length_text,
              double      *x)
{
  g_autofree char *text = NULL;
  double tol = 1e-9 * length;

  if (!get_quantity (ld, node, attr, TRB_DIM_LENGTH, TRUE, x, &text))
    return FALSE;
  if (*x < -tol || *x > length + tol)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "%s \"%s\" = \"%s\" lies outside the member (length %s)",
                    what, attr, text, length_text);
  *x = CLAMP (*x, 0.0, length);
  return TRUE;
}

/* Text inside an element is never meaningful in this format: refuse it, like an unknown
 * element, rather than drop it. */
static gboolean
check_no_text (Loader  *ld,
               xmlNode *child,
               xmlNode *parent)
{
  if (child->type == XML_TEXT_NODE)
    {
      const char *s = (const char *) child->content;

      for (; s != NULL && *s != '\0'; s++)
        if (!g_ascii_isspace (*s))
          {
            /* a text node carries the line where it ends; count back to where it shows */
            int line = node_line (child);

            for (const char *t = s; *t != '\0'; t++)
              if (*t == '\n')
                line--;
            return fail_at (ld, line > 0 ? line : node_line (parent), TRB_ERROR_INVALID,
                            "unexpected text inside <%s>", NAME (parent));
          }
      return TRUE;
    }
  if (child->type == XML_CDATA_SECTION_NODE || child->type == XML_ENTITY_REF_NODE)
    return fail_at (ld, node_line (parent), TRB_ERROR_INVALID,
                    "unexpected text inside <%s>", NAME (parent));
  return TRUE;
}

/* Walks the element children of node; returns FALSE on text. */
#define FOR_EACH_CHILD(child, node) \
  for (xmlNode *child = (node)->children; child != NULL; child = child->next)

static gboolean
is_element (xmlNode    *node,
            const char *name)
{
  return node->type == XML_ELEMENT_NODE && node->ns == NULL && strcmp (NAME (node), name) == 0;
}

static gboolean
check_leaf (Loader  *ld,
            xmlNode *node)
{
  FOR_EACH_CHILD (child, node)
    {
      if (child->type == XML_ELEMENT_NODE)
        return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                        "unknown element <%s> inside <%s>", NAME (child), NAME (node));
      if (!check_no_text (ld, child, node))
        return FALSE;
    }
  return TRUE;
}

static gboolean
load_settings (Loader      *ld,
               xmlNode     *node,
               TrbSettings *s)
{
  static const char * const attrs[] = {
    "method", "fb-allow", "fv-allow", "steel-grade", "self-weight", "live-patterns",
    "deflection-live", "deflection-total", "units", "live-load-reduction", "floors-above", NULL
  };
  static const char * const methods[] = { "asd", "lrfd", "allowable", NULL };
  static const char * const include[] = { "exclude", "include", NULL };
  static const char * const on_off[] = { "off", "on", NULL };
  static const char * const units[] = { "us", "si", NULL };
  g_autofree char *grade = NULL;
  int method = s->method;
  int sw = s->self_weight ? 1 : 0;
  int pat = s->live_patterns ? 1 : 0;
  int u = s->units == TRB_UNIT_SYSTEM_SI ? 1 : 0;
  int llr = s->live_load_reduction ? 1 : 0;
  g_autofree char *above = NULL;

  G_STATIC_ASSERT (TRB_METHOD_ASD == 0 && TRB_METHOD_LRFD == 1 && TRB_METHOD_ALLOWABLE == 2);

  if (!check_attributes (ld, node, attrs) || !check_leaf (ld, node))
    return FALSE;
  if (!get_choice (ld, node, "method", methods, &method) ||
      !get_positive_quantity (ld, node, "fb-allow", TRB_DIM_STRESS, FALSE, &s->fb_allow) ||
      !get_positive_quantity (ld, node, "fv-allow", TRB_DIM_STRESS, FALSE, &s->fv_allow) ||
      !get_choice (ld, node, "self-weight", include, &sw) ||
      !get_choice (ld, node, "live-patterns", on_off, &pat) ||
      !get_deflection_limit (ld, node, "deflection-live", &s->deflection_live) ||
      !get_deflection_limit (ld, node, "deflection-total", &s->deflection_total) ||
      !get_choice (ld, node, "units", units, &u) ||
      !get_choice (ld, node, "live-load-reduction", on_off, &llr))
    return FALSE;

  above = get_attr (node, "floors-above");
  if (above != NULL)
    {
      gint64 v;

      if (!parse_int (above, 0, 999, &v))
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "attribute \"floors-above\" = \"%s\": expected a whole number from 0 "
                        "to 999", above);
      s->floors_above = (int) v;
    }

  grade = get_attr (node, "steel-grade");
  if (grade != NULL)
    {
      if (*g_strstrip (grade) == '\0')
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "attribute \"steel-grade\" is empty");
      g_free (s->steel_grade);
      s->steel_grade = g_steal_pointer (&grade);
    }

  s->method = method;
  s->self_weight = sw == 1;
  s->live_patterns = pat == 1;
  s->units = u == 1 ? TRB_UNIT_SYSTEM_SI : TRB_UNIT_SYSTEM_US;
  s->live_load_reduction = llr == 1;
  s->line = node_line (node);
  return TRUE;
}

static gboolean
load_support (Loader     *ld,
              xmlNode    *node,
              TrbMember  *m,
              const char *length_text)
{
  static const char * const attrs[] = { "at", "type", NULL };
  g_autofree char *type = NULL;
  TrbMemberSupport s = { { 0 } };

  if (!check_attributes (ld, node, attrs) || !check_leaf (ld, node))
    return FALSE;
  if (!require_attr (ld, node, "type", &type))
    return FALSE;
  if (!trb_support_type_from_name (type, &s.support.type))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "unknown support type \"%s\" (expected pin, roller or fixed)", type);
  if (!get_position (ld, node, "support", "at", m->length, length_text, &s.support.x))
    return FALSE;
  s.line = node_line (node);
  g_array_append_val (m->supports, s);
  return TRUE;
}

static gboolean
load_load (Loader     *ld,
           xmlNode    *node,
           TrbMember  *m,
           const char *length_text)
{
  static const char * const point_attrs[] = { "case", "type", "at", "p", NULL };
  static const char * const uniform_attrs[] = { "case", "type", "from", "to", "w", NULL };
  static const char * const linear_attrs[] = { "case", "type", "from", "to", "w1", "w2", NULL };
  static const char * const moment_attrs[] = { "case", "type", "at", "m", NULL };
  static const char * const any_attrs[] = {
    "case", "type", "at", "p", "from", "to", "w", "w1", "w2", "m", NULL
  };
  g_autofree char *type = NULL;
  g_autofree char *lcase = NULL;
  TrbMemberLoad l = { 0 };
  const char * const *attrs = NULL;

  /* Names first (a typo is reported as such), then type, then what the type needs. */
  if (!check_attributes (ld, node, any_attrs) || !check_leaf (ld, node))
    return FALSE;
  if (!require_attr (ld, node, "type", &type))
    return FALSE;
  if (!trb_load_kind_from_name (type, &l.load.kind))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "unknown load type \"%s\" (expected point, uniform, linear or moment)", type);
  switch (l.load.kind)
    {
    case TRB_LOAD_POINT:
      attrs = point_attrs;
      break;
    case TRB_LOAD_UNIFORM:
      attrs = uniform_attrs;
      break;
    case TRB_LOAD_LINEAR:
      attrs = linear_attrs;
      break;
    case TRB_LOAD_MOMENT:
      attrs = moment_attrs;
      break;
    default:
      g_assert_not_reached ();
    }
  for (xmlAttr *a = node->properties; a != NULL; a = a->next)
    if (!trb_project_io_priv_names_contain (attrs, (const char *) a->name))
      return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                      "attribute \"%s\" does not belong on a %s load",
                      (const char *) a->name, type);

  if (!require_attr (ld, node, "case", &lcase))
    return FALSE;
  if (!trb_load_case_from_name (lcase, &l.lcase))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "unknown load case \"%s\" (expected D, L, Lr or S)", lcase);

  switch (l.load.kind)
    {
    case TRB_LOAD_POINT:
      if (!get_position (ld, node, "load", "at", m->length, length_text, &l.load.a) ||
          !get_quantity (ld, node, "p", TRB_DIM_FORCE, TRUE, &l.load.w1, NULL))
        return FALSE;
      l.load.b = l.load.a;
      break;
    case TRB_LOAD_MOMENT:
      if (!get_position (ld, node, "load", "at", m->length, length_text, &l.load.a) ||
          !get_quantity (ld, node, "m", TRB_DIM_MOMENT, TRUE, &l.load.w1, NULL))
        return FALSE;
      l.load.b = l.load.a;
      break;
    case TRB_LOAD_UNIFORM:
    case TRB_LOAD_LINEAR:
      {
        g_autofree char *from = get_attr (node, "from");
        g_autofree char *to = get_attr (node, "to");

        if (!get_position (ld, node, "load", "from", m->length, length_text, &l.load.a) ||
            !get_position (ld, node, "load", "to", m->length, length_text, &l.load.b))
          return FALSE;
        if (l.load.a > l.load.b)
          return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                          "load \"from\" = \"%s\" is beyond \"to\" = \"%s\"", from, to);
        if (!(l.load.b - l.load.a > 1e-9 * m->length))
          return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                          "load \"from\" = \"%s\" and \"to\" = \"%s\" are the same point; "
                          "use a point load", from, to);
        if (l.load.kind == TRB_LOAD_UNIFORM)
          {
            if (!get_quantity (ld, node, "w", TRB_DIM_LINE_LOAD, TRUE, &l.load.w1, NULL))
              return FALSE;
            l.load.w2 = l.load.w1;
          }
        else if (!get_quantity (ld, node, "w1", TRB_DIM_LINE_LOAD, TRUE, &l.load.w1, NULL) ||
                 !get_quantity (ld, node, "w2", TRB_DIM_LINE_LOAD, TRUE, &l.load.w2, NULL))
          return FALSE;
      }
      break;
    default:
      g_assert_not_reached ();
    }

  l.line = node_line (node);
  g_array_append_val (m->loads, l);
  return TRUE;
}

static gboolean
load_brace (Loader     *ld,
            xmlNode    *node,
            TrbMember  *m,
            const char *length_text)
{
  static const char * const attrs[] = { "at", NULL };
  TrbMemberBrace b = { 0 };

  if (!check_attributes (ld, node, attrs) || !check_leaf (ld, node))
    return FALSE;
  if (!get_position (ld, node, "brace", "at", m->length, length_text, &b.x))
    return FALSE;
  b.line = node_line (node);
  g_array_append_val (m->braces, b);
  return TRUE;
}

static int
compare_brace (gconstpointer a,
               gconstpointer b)
{
  const TrbMemberBrace *ba = a;
  const TrbMemberBrace *bb = b;

  if (ba->x != bb->x)
    return (ba->x > bb->x) - (ba->x < bb->x);
  return ba->line - bb->line;
}

static const char * const custom_attrs[] = { "E", "I", "S", "A", "d", "tw", "weight", NULL };
static const char * const wood_attrs[] = {
  "species", "grade", "wet-service", "incised", "repetitive", "bearing-length", NULL
};

/* The attributes a standalone <beam> and a floor's <member> share: material, section and
 * every design attribute. *bracing is -1 when the file gives none. */
static gboolean
load_design (Loader    *ld,
             xmlNode   *node,
             TrbMember *m,
             int       *bracing)
{
  static const char * const methods[] = { "asd", "lrfd", "allowable", NULL };
  static const char * const bracings[] = { "continuous", "supports", NULL };
  g_autofree char *material = NULL;
  g_autofree char *section = NULL;
  g_autofree char *allowed = NULL;
  g_autofree char *plies = NULL;
  int method = -1;

  if (!require_attr (ld, node, "material", &material))
    return FALSE;
  if (!trb_material_from_name (material, &m->material))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "unknown material \"%s\" (expected steel, wood or custom)", material);

  section = get_attr (node, "section");
  if (section != NULL)
    {
      g_strstrip (section);
      if (*section == '\0')
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "attribute \"section\" is empty");
      g_free (m->section);
      m->section = g_steal_pointer (&section);
    }

  if (trb_member_is_custom (m))
    {
      if (!get_positive_quantity (ld, node, "E", TRB_DIM_STRESS, TRUE, &m->E) ||
          !get_positive_quantity (ld, node, "I", TRB_DIM_INERTIA, TRUE, &m->I) ||
          !get_positive_quantity (ld, node, "S", TRB_DIM_SECTION_MODULUS, FALSE, &m->S) ||
          !get_positive_quantity (ld, node, "A", TRB_DIM_AREA, FALSE, &m->A) ||
          !get_positive_quantity (ld, node, "d", TRB_DIM_LENGTH, FALSE, &m->d) ||
          !get_positive_quantity (ld, node, "tw", TRB_DIM_LENGTH, FALSE, &m->tw) ||
          !get_quantity (ld, node, "weight", TRB_DIM_WEIGHT_PER_LENGTH, FALSE, &m->weight, NULL))
        return FALSE;
      if (m->weight < 0)
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "attribute \"weight\" must not be negative");
    }
  else
    {
      for (guint i = 0; custom_attrs[i] != NULL; i++)
        if (has_attr (node, custom_attrs[i]))
          return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                          "attribute \"%s\" belongs only with section=\"custom\"",
                          custom_attrs[i]);
    }

  if (m->material != TRB_MATERIAL_WOOD)
    for (guint i = 0; wood_attrs[i] != NULL; i++)
      if (has_attr (node, wood_attrs[i]))
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "attribute \"%s\" belongs only with material=\"wood\"", wood_attrs[i]);
  if (m->material != TRB_MATERIAL_STEEL && has_attr (node, "steel-grade"))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "attribute \"steel-grade\" belongs only with material=\"steel\"");

  if (!get_choice (ld, node, "method", methods, &method) ||
      !get_positive_quantity (ld, node, "fb-allow", TRB_DIM_STRESS, FALSE, &m->fb_allow) ||
      !get_positive_quantity (ld, node, "fv-allow", TRB_DIM_STRESS, FALSE, &m->fv_allow) ||
      !get_deflection_limit (ld, node, "deflection-live", &m->deflection_live) ||
      !get_deflection_limit (ld, node, "deflection-total", &m->deflection_total) ||
      !get_choice (ld, node, "bracing", bracings, bracing) ||
      !get_positive_quantity (ld, node, "max-depth", TRB_DIM_LENGTH, FALSE, &m->max_depth) ||
      !get_positive_quantity (ld, node, "min-depth", TRB_DIM_LENGTH, FALSE, &m->min_depth) ||
      !get_yes_no (ld, node, "wet-service", &m->wet_service) ||
      !get_yes_no (ld, node, "incised", &m->incised) ||
      !get_yes_no (ld, node, "repetitive", &m->repetitive) ||
      !get_positive_quantity (ld, node, "bearing-length", TRB_DIM_LENGTH, FALSE,
                              &m->bearing_length))
    return FALSE;
  if (method >= 0)
    {
      m->has_method = TRUE;
      m->method = method;
    }
  if (m->min_depth > m->max_depth)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "\"min-depth\" is greater than \"max-depth\"");

  m->steel_grade = get_attr (node, "steel-grade");
  if (m->steel_grade != NULL && *g_strstrip (m->steel_grade) == '\0')
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "attribute \"steel-grade\" is empty");
  m->species = get_attr (node, "species");
  if (m->species != NULL && *g_strstrip (m->species) == '\0')
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "attribute \"species\" is empty");
  m->grade = get_attr (node, "grade");
  if (m->grade != NULL && *g_strstrip (m->grade) == '\0')
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "attribute \"grade\" is empty");

  allowed = get_attr (node, "allowed");
  if (allowed != NULL)
    {
      g_auto(GStrv) parts = g_strsplit_set (allowed, " \t\r\n", -1);
      g_autoptr(GPtrArray) list = g_ptr_array_new ();

      for (guint i = 0; parts[i] != NULL; i++)
        if (parts[i][0] != '\0')
          g_ptr_array_add (list, g_strdup (parts[i]));
      if (list->len == 0)
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "attribute \"allowed\" names no section");
      g_ptr_array_add (list, NULL);
      m->allowed = (char **) g_ptr_array_steal (list, NULL);
    }

  plies = get_attr (node, "max-plies");
  if (plies != NULL)
    {
      gint64 v;

      if (!parse_int (plies, 1, 99, &v))
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "attribute \"max-plies\" = \"%s\": expected a whole number from 1 to 99",
                        plies);
      m->max_plies = (int) v;
    }
  return TRUE;
}

/* A point in plan from two coordinate attributes, both required. */
static gboolean
get_plan_point (Loader        *ld,
                xmlNode       *node,
                const char    *x_attr,
                const char    *y_attr,
                TrbFramePoint *p)
{
  return get_quantity (ld, node, x_attr, TRB_DIM_LENGTH, TRUE, &p->x, NULL) &&
         get_quantity (ld, node, y_attr, TRB_DIM_LENGTH, TRUE, &p->y, NULL);
}

/* A listed bearing point: where the member also rests on a member below. It must lie on the
 * member, within the framing tolerance of its line, as trb-frame requires. */
static gboolean
load_bears_on (Loader    *ld,
               xmlNode   *node,
               TrbMember *m)
{
  static const char * const attrs[] = { "x", "y", NULL };
  TrbFramePoint p;
  double dx = m->end.x - m->start.x;
  double dy = m->end.y - m->start.y;
  double t, d;

  if (!check_attributes (ld, node, attrs) || !check_leaf (ld, node) ||
      !get_plan_point (ld, node, "x", "y", &p))
    return FALSE;
  t = ((p.x - m->start.x) * dx + (p.y - m->start.y) * dy) / (dx * dx + dy * dy);
  t = CLAMP (t, 0.0, 1.0);
  d = hypot (p.x - (m->start.x + t * dx), p.y - (m->start.y + t * dy));
  if (d > TRB_FRAME_TOLERANCE)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "<bears-on> lies %.0f mm from member \"%s\"; it must be on the member "
                    "(within %.0f mm)", d * 1000, m->id, TRB_FRAME_TOLERANCE * 1000);
  trb_member_add_bearing_point (m, p);
  return TRUE;
}

static gboolean
load_member_children (Loader     *ld,
                      xmlNode    *node,
                      TrbMember  *m,
                      const char *length_text,
                      int         bracing)
{
  FOR_EACH_CHILD (child, node)
    {
      if (child->type != XML_ELEMENT_NODE)
        {
          if (!check_no_text (ld, child, node))
            return FALSE;
          continue;
        }
      if (is_element (child, "support"))
        {
          if (!load_support (ld, child, m, length_text))
            return FALSE;
        }
      else if (is_element (child, "load"))
        {
          if (!load_load (ld, child, m, length_text))
            return FALSE;
        }
      else if (is_element (child, "brace"))
        {
          if (!load_brace (ld, child, m, length_text))
            return FALSE;
        }
      else if (m->floor != NULL && is_element (child, "bears-on"))
        {
          if (!load_bears_on (ld, child, m))
            return FALSE;
        }
      else
        return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                        "unknown element <%s> inside <%s>", NAME (child), NAME (node));
    }

  /* With continuous bracing the deck holds the top; braces then hold the bottom flange or
   * edge, which is in compression over interior supports and on cantilevers. */
  if (m->braces->len > 0 && bracing == -1)
    bracing = 1;
  m->bracing = bracing == 1 ? TRB_BRACING_POINTS : TRB_BRACING_CONTINUOUS;
  g_array_sort (m->braces, compare_brace);
  return TRUE;
}

/* Marks are one namespace across the project: standalone beams and every floor's members. */
static gboolean
check_new_mark (Loader     *ld,
                xmlNode    *node,
                TrbProject *project,
                const char *what,
                const char *id)
{
  TrbMember *other;

  if (*id == '\0')
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "%s \"id\" is empty", what);
  other = trb_project_find_member (project, id);
  if (other != NULL)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "duplicate %s id \"%s\" (first at line %d)", what, id, other->line);
  return TRUE;
}

static gboolean
load_beam (Loader     *ld,
           xmlNode    *node,
           TrbProject *project)
{
  static const char * const attrs[] = {
    "id", "length", "material", "section",
    "E", "I", "S", "A", "d", "tw", "weight",
    "method", "fb-allow", "fv-allow", "steel-grade", "deflection-live", "deflection-total",
    "bracing", "max-depth", "min-depth", "allowed", "max-plies",
    "species", "grade", "wet-service", "incised", "repetitive", "bearing-length",
    NULL
  };
  g_autoptr(TrbMember) m = NULL;
  g_autofree char *id = NULL;
  g_autofree char *length_text = NULL;
  int bracing = -1;

  if (!check_attributes (ld, node, attrs))
    return FALSE;

  if (!require_attr (ld, node, "id", &id) || !check_new_mark (ld, node, project, "beam", id))
    return FALSE;

  m = trb_member_new (id);
  m->line = node_line (node);

  if (!get_quantity (ld, node, "length", TRB_DIM_LENGTH, TRUE, &m->length, &length_text))
    return FALSE;
  if (!(m->length > 0))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "beam \"length\" = \"%s\" must be greater than zero", length_text);

  if (!load_design (ld, node, m, &bracing) ||
      !load_member_children (ld, node, m, length_text, bracing))
    return FALSE;

  trb_project_add_member (project, g_steal_pointer (&m));
  return TRUE;
}

/* A member of a floor: placed in plan from (x1, y1) to (x2, y2); its length is the distance
 * between them. A length may be given as well, and must then agree with the plan. */
static gboolean
load_member (Loader     *ld,
             xmlNode    *node,
             TrbProject *project,
             TrbFloor   *floor)
{
  static const char * const attrs[] = {
    "id", "role", "x1", "y1", "x2", "y2", "length", "material", "section",
    "E", "I", "S", "A", "d", "tw", "weight",
    "method", "fb-allow", "fv-allow", "steel-grade", "deflection-live", "deflection-total",
    "bracing", "max-depth", "min-depth", "allowed", "max-plies",
    "species", "grade", "wet-service", "incised", "repetitive", "bearing-length",
    "group", "deck",
    NULL
  };
  static const char * const roles[] = { "girder", "beam", "joist", NULL };
  g_autoptr(TrbMember) m = NULL;
  g_autofree char *id = NULL;
  g_autofree char *role_text = NULL;
  g_autofree char *length_text = NULL;
  g_autofree char *group = NULL;
  TrbFramePoint start, end;
  double given = NAN;
  int role = -1;
  int bracing = -1;

  G_STATIC_ASSERT (TRB_FRAME_ROLE_GIRDER == 0 && TRB_FRAME_ROLE_BEAM == 1 &&
                   TRB_FRAME_ROLE_JOIST == 2);

  if (project->members->len >= TRB_PROJECT_MAX_MEMBERS)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "more than %d members: this version reads no more",
                    TRB_PROJECT_MAX_MEMBERS);
  if (!check_attributes (ld, node, attrs))
    return FALSE;
  if (!require_attr (ld, node, "id", &id) || !check_new_mark (ld, node, project, "member", id))
    return FALSE;
  if (!require_attr (ld, node, "role", &role_text) ||
      !get_choice (ld, node, "role", roles, &role))
    return FALSE;

  m = trb_member_new (id);
  m->line = node_line (node);
  m->floor = floor;
  trb_member_set_role (m, role);
  if (!get_yes_no (ld, node, "deck", &m->carries_deck))
    return FALSE;

  if (!get_plan_point (ld, node, "x1", "y1", &start) ||
      !get_plan_point (ld, node, "x2", "y2", &end))
    return FALSE;
  trb_member_set_plan (m, start, end);
  if (!(m->length > 0))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "member \"%s\" has zero length: its ends are the same point", id);

  if (!get_quantity (ld, node, "length", TRB_DIM_LENGTH, FALSE, &given, &length_text))
    return FALSE;
  if (length_text != NULL)
    {
      /* The plan decides; a stated length only guards against a misplaced end. */
      if (fabs (given - m->length) > TRB_FRAME_TOLERANCE)
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                        "member \"length\" = \"%s\" differs from the %.3f m between its ends",
                        length_text, m->length);
    }
  else
    length_text = g_strdup_printf ("%.3f m", m->length);

  group = get_attr (node, "group");
  if (group != NULL)
    {
      if (*g_strstrip (group) == '\0')
        return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "attribute \"group\" is empty");
      m->group = g_steal_pointer (&group);
    }

  if (!load_design (ld, node, m, &bracing) ||
      !load_member_children (ld, node, m, length_text, bracing))
    return FALSE;

  trb_floor_add_member (project, floor, g_steal_pointer (&m));
  return TRUE;
}

/* The <point x= y=/> children of a wall, polygon or polyline: at least min_points of them,
 * and nothing else. */
static gboolean
load_points (Loader     *ld,
             xmlNode    *node,
             GArray     *points,
             guint       min_points,
             const char *needs)
{
  static const char * const attrs[] = { "x", "y", NULL };

  FOR_EACH_CHILD (child, node)
    {
      TrbFramePoint p;

      if (child->type != XML_ELEMENT_NODE)
        {
          if (!check_no_text (ld, child, node))
            return FALSE;
          continue;
        }
      if (!is_element (child, "point"))
        return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                        "unknown element <%s> inside <%s>", NAME (child), NAME (node));
      if (!check_attributes (ld, child, attrs) || !check_leaf (ld, child) ||
          !get_plan_point (ld, child, "x", "y", &p))
        return FALSE;
      g_array_append_val (points, p);
    }
  if (points->len < min_points)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "<%s> has %u point%s; %s needs %u or more", NAME (node), points->len,
                    points->len == 1 ? "" : "s", needs, min_points);
  return TRUE;
}

/* Optional free text (a label, an occupancy): absent or empty is NULL. */
static char *
get_text (xmlNode    *node,
          const char *attr)
{
  char *text = get_attr (node, attr);

  if (text != NULL && *g_strstrip (text) == '\0')
    g_clear_pointer (&text, g_free);
  return text;
}

static gboolean
get_case (Loader      *ld,
          xmlNode     *node,
          TrbLoadCase *lcase)
{
  g_autofree char *text = NULL;

  if (!require_attr (ld, node, "case", &text))
    return FALSE;
  if (!trb_load_case_from_name (text, lcase))
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "unknown load case \"%s\" (expected D, L, Lr or S)", text);
  return TRUE;
}

/* An id of a column or wall: required, not empty, unique across the project in its own
 * namespace. */
static gboolean
get_unique_id (Loader      *ld,
               xmlNode     *node,
               GHashTable  *seen,
               const char  *what,
               char       **id)
{
  gpointer first;

  if (!require_attr (ld, node, "id", id))
    return FALSE;
  g_strstrip (*id);
  if (**id == '\0')
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "%s \"id\" is empty", what);
  first = g_hash_table_lookup (seen, *id);
  if (first != NULL)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "duplicate %s id \"%s\" (first at line %d)", what, *id,
                    GPOINTER_TO_INT (first));
  g_hash_table_insert (seen, g_strdup (*id), GINT_TO_POINTER (MAX (node_line (node), 1)));
  return TRUE;
}

static gboolean
load_floor (Loader     *ld,
            xmlNode    *node,
            TrbProject *project)
{
  static const char * const attrs[] = { "name", NULL };
  static const char * const grid_attrs[] = { "name", "x1", "y1", "x2", "y2", NULL };
  static const char * const column_attrs[] = { "id", "x", "y", "section", NULL };
  static const char * const wall_attrs[] = { "id", "material", NULL };
  static const char * const area_attrs[] = {
    "case", "kind", "pressure", "label", "occupancy", NULL
  };
  static const char * const line_attrs[] = { "case", "w", "label", NULL };
  static const char * const point_attrs[] = { "case", "p", "x", "y", "label", NULL };
  static const char * const kinds[] = { "ordinary", "partition", NULL };
  g_autofree char *name = NULL;
  g_autoptr(GHashTable) grids = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  TrbFloor *floor;
  gpointer first;
  guint outline_points = 0;   /* of the area loads and openings so far */

  G_STATIC_ASSERT (TRB_AREA_LOAD_ORDINARY == 0 && TRB_AREA_LOAD_PARTITION == 1);

  if (!check_attributes (ld, node, attrs) || !require_attr (ld, node, "name", &name))
    return FALSE;
  g_strstrip (name);
  if (*name == '\0')
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID, "floor \"name\" is empty");
  first = g_hash_table_lookup (ld->floors, name);
  if (first != NULL)
    return fail_at (ld, node_line (node), TRB_ERROR_INVALID,
                    "duplicate floor name \"%s\" (first at line %d)", name,
                    GPOINTER_TO_INT (first));
  g_hash_table_insert (ld->floors, g_strdup (name), GINT_TO_POINTER (MAX (node_line (node), 1)));

  /* The project owns the floor from here, so that members added to it are freed with it
   * whatever fails later. */
  floor = trb_floor_new (name);
  floor->line = node_line (node);
  trb_project_add_floor (project, floor);

  FOR_EACH_CHILD (child, node)
    {
      int line = node_line (child);

      if (child->type != XML_ELEMENT_NODE)
        {
          if (!check_no_text (ld, child, node))
            return FALSE;
          continue;
        }
      if (is_element (child, "grid"))
        {
          g_autofree char *gname = NULL;
          TrbFramePoint s, e;
          TrbGridLine *g;

          if (!check_attributes (ld, child, grid_attrs) || !check_leaf (ld, child) ||
              !require_attr (ld, child, "name", &gname))
            return FALSE;
          g_strstrip (gname);
          if (*gname == '\0')
            return fail_at (ld, line, TRB_ERROR_INVALID, "grid \"name\" is empty");
          first = g_hash_table_lookup (grids, gname);
          if (first != NULL)
            return fail_at (ld, line, TRB_ERROR_INVALID,
                            "duplicate grid line \"%s\" (first at line %d)", gname,
                            GPOINTER_TO_INT (first));
          g_hash_table_insert (grids, g_strdup (gname), GINT_TO_POINTER (MAX (line, 1)));
          if (!get_plan_point (ld, child, "x1", "y1", &s) ||
              !get_plan_point (ld, child, "x2", "y2", &e))
            return FALSE;
          if (s.x == e.x && s.y == e.y)
            return fail_at (ld, line, TRB_ERROR_INVALID,
                            "grid line \"%s\" has zero length: its ends are the same point",
                            gname);
          g = trb_grid_line_new (gname, s, e);
          g->line = line;
          g_ptr_array_add (floor->grids, g);
        }
      else if (is_element (child, "column"))
        {
          g_autofree char *id = NULL;
          g_autofree char *section = NULL;
          TrbFramePoint at;
          TrbColumn *c;

          if (!check_attributes (ld, child, column_attrs) || !check_leaf (ld, child) ||
              !get_unique_id (ld, child, ld->columns, "column", &id) ||
              !get_plan_point (ld, child, "x", "y", &at))
            return FALSE;
          section = get_attr (child, "section");
          if (section != NULL && *g_strstrip (section) == '\0')
            return fail_at (ld, line, TRB_ERROR_INVALID, "attribute \"section\" is empty");
          c = trb_column_new (id, at, section);
          c->line = line;
          g_ptr_array_add (floor->columns, c);
        }
      else if (is_element (child, "wall"))
        {
          g_autofree char *id = NULL;
          g_autofree char *material = NULL;
          g_autoptr(TrbWall) w = NULL;

          if (!check_attributes (ld, child, wall_attrs) ||
              !get_unique_id (ld, child, ld->walls, "wall", &id))
            return FALSE;
          material = get_text (child, "material");
          w = trb_wall_new (id, material);
          w->line = line;
          if (!load_points (ld, child, w->points, 2, "a wall"))
            return FALSE;
          g_ptr_array_add (floor->walls, g_steal_pointer (&w));
        }
      else if (is_element (child, "member"))
        {
          if (!load_member (ld, child, project, floor))
            return FALSE;
        }
      else if (is_element (child, "area-load"))
        {
          g_autoptr(TrbAreaLoad) a = NULL;
          g_autofree char *label = NULL;
          g_autofree char *occupancy = NULL;
          TrbLoadCase lcase;
          int kind = TRB_AREA_LOAD_ORDINARY;
          double pressure;

          if (!check_attributes (ld, child, area_attrs) || !get_case (ld, child, &lcase) ||
              !get_choice (ld, child, "kind", kinds, &kind) ||
              !get_quantity (ld, child, "pressure", TRB_DIM_AREA_LOAD, TRUE, &pressure, NULL))
            return FALSE;
          /* ASCE 7-16 §4.3.2: partition loads are live loads; a partition allowance taken as
           * dead load is an ordinary area load of case D. */
          if (kind == TRB_AREA_LOAD_PARTITION && lcase != TRB_CASE_L)
            return fail_at (ld, line, TRB_ERROR_INVALID,
                            "a partition load is live load: its case must be L, not %s",
                            trb_load_case_name (lcase));
          label = get_text (child, "label");
          occupancy = get_text (child, "occupancy");
          a = trb_area_load_new (lcase, kind, pressure, label, occupancy);
          a->line = line;
          if (!load_points (ld, child, a->points, 3, "a polygon"))
            return FALSE;
          outline_points += a->points->len;
          if (outline_points > TRB_PROJECT_MAX_OUTLINE_POINTS)
            return fail_at (ld, line, TRB_ERROR_INVALID,
                            "the area loads and openings of floor \"%s\" have more than %d "
                            "points together", name, TRB_PROJECT_MAX_OUTLINE_POINTS);
          g_ptr_array_add (floor->area_loads, g_steal_pointer (&a));
        }
      else if (is_element (child, "opening"))
        {
          g_autoptr(TrbOpening) o = trb_opening_new ();

          o->line = line;
          if (!check_attributes (ld, child, (const char * const[]) { NULL }) ||
              !load_points (ld, child, o->points, 3, "a polygon"))
            return FALSE;
          outline_points += o->points->len;
          if (outline_points > TRB_PROJECT_MAX_OUTLINE_POINTS)
            return fail_at (ld, line, TRB_ERROR_INVALID,
                            "the area loads and openings of floor \"%s\" have more than %d "
                            "points together", name, TRB_PROJECT_MAX_OUTLINE_POINTS);
          g_ptr_array_add (floor->openings, g_steal_pointer (&o));
        }
      else if (is_element (child, "line-load"))
        {
          g_autoptr(TrbLineLoad) l = NULL;
          g_autofree char *label = NULL;
          TrbLoadCase lcase;
          double w;

          if (!check_attributes (ld, child, line_attrs) || !get_case (ld, child, &lcase) ||
              !get_quantity (ld, child, "w", TRB_DIM_LINE_LOAD, TRUE, &w, NULL))
            return FALSE;
          label = get_text (child, "label");
          l = trb_line_load_new (lcase, w, label);
          l->line = line;
          if (!load_points (ld, child, l->points, 2, "a line"))
            return FALSE;
          g_ptr_array_add (floor->line_loads, g_steal_pointer (&l));
        }
      else if (is_element (child, "point-load"))
        {
          g_autofree char *label = NULL;
          TrbLoadCase lcase;
          TrbFramePoint at;
          double P;
          TrbPointLoad *pl;

          if (!check_attributes (ld, child, point_attrs) || !check_leaf (ld, child) ||
              !get_case (ld, child, &lcase) ||
              !get_quantity (ld, child, "p", TRB_DIM_FORCE, TRUE, &P, NULL) ||
              !get_plan_point (ld, child, "x", "y", &at))
            return FALSE;
          label = get_text (child, "label");
          pl = trb_point_load_new (lcase, P, at, label);
          pl->line = line;
          g_ptr_array_add (floor->point_loads, pl);
        }
      else
        return fail_at (ld, line, TRB_ERROR_INVALID,
                        "unknown element <%s> inside <floor>", NAME (child));
    }
  return TRUE;
}

/* The project's own sections, which join the catalog for checking and sizing: CSV text inside
 * the element, or file="NAME.csv" naming a file in the project's own folder (a bare file
 * name: nothing outside that folder is ever read). */
static gboolean
load_sections (Loader     *ld,
               xmlNode    *node,
               TrbProject *project)
{
  static const char * const attrs[] = { "file", NULL };
  g_autofree char *file = NULL;
  g_autofree char *text = NULL;
  g_autofree char *source = NULL;
  g_autoptr(GError) local = NULL;
  int line = node_line (node);

  if (!check_attributes (ld, node, attrs))
    return FALSE;
  file = get_attr (node, "file");
  FOR_EACH_CHILD (child, node)
    if (child->type == XML_ELEMENT_NODE)
      return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                      "unknown element <%s> inside <sections>", NAME (child));

  if (file != NULL)
    {
      g_autofree char *path = NULL;
      gsize length;
      GStatBuf st;

      if (node->children != NULL)
        return fail_at (ld, line, TRB_ERROR_INVALID,
                        "<sections> has both a file and a table of its own; give one");
      if (*file == '\0' || strchr (file, '/') != NULL || strchr (file, '\\') != NULL ||
          strcmp (file, ".") == 0 || strcmp (file, "..") == 0)
        return fail_at (ld, line, TRB_ERROR_INVALID,
                        "sections file \"%s\" must be a file name in the project's own folder",
                        file);
      if (ld->dir == NULL)
        return fail_at (ld, line, TRB_ERROR_INVALID,
                        "sections file \"%s\": the project has no folder to find it in", file);
      path = g_build_filename (ld->dir, file, NULL);
      /* A plain file only, looked at before it is read: a symbolic link could lead out of
       * the folder (and its text into a message), and a pipe or a device would block or
       * never end. */
      if (g_lstat (path, &st) != 0)
        return fail_at (ld, line, TRB_ERROR_IO, "sections file \"%s\": %s", file,
                        g_strerror (errno));
      if (!S_ISREG (st.st_mode))
        return fail_at (ld, line, TRB_ERROR_IO, "sections file \"%s\" is not a plain file "
                        "(links, pipes and devices are not followed)", file);
      if (st.st_size > TRB_PROJECT_MAX_FILE_SIZE)
        return fail_at (ld, line, TRB_ERROR_IO, "sections file \"%s\" is too large", file);
      if (!g_file_get_contents (path, &text, &length, &local))
        return fail_at (ld, line, TRB_ERROR_IO, "sections file \"%s\": %s", file,
                        local->message);
      if (length > TRB_PROJECT_MAX_FILE_SIZE)
        return fail_at (ld, line, TRB_ERROR_IO, "sections file \"%s\" is too large", file);
      source = g_strdup_printf ("sections file \"%s\"", file);
    }
  else
    {
      xmlChar *content = xmlNodeGetContent (node);

      text = g_strdup (content != NULL ? (const char *) content : "");
      xmlFree (content);
      /* The table's header is its first line of text, whatever the indentation. */
      g_strstrip (text);
      source = g_strdup ("the <sections> table");
    }
  trb_project_add_sections_source (project, file, file == NULL ? text : NULL, line);

  if (project->sections == NULL)
    project->sections = trb_catalog_new ();
  if (!trb_catalog_add_project_csv (project->sections, text, source, &local))
    return fail_at (ld, line, local->code, "%s", local->message);
  return TRUE;
}

static gboolean
load_root (Loader     *ld,
           xmlNode    *root,
           TrbProject *project)
{
  static const char * const attrs[] = { "format", NULL };
  g_autofree char *format = NULL;
  gint64 fmt;
  int settings_line = 0;

  if (root->ns != NULL && strcmp (NAME (root), "trabeate-project") == 0)
    return fail_at (ld, node_line (root), TRB_ERROR_INVALID,
                    "<trabeate-project> is in an XML namespace; format %d uses none",
                    TRB_PROJECT_FORMAT);
  if (!is_element (root, "trabeate-project"))
    return fail_at (ld, node_line (root), TRB_ERROR_INVALID,
                    "the root element is <%s>; a project file starts with <trabeate-project>",
                    NAME (root));

  /* The format comes first: a newer file may hold anything, and deserves the newer-format
   * message, not a complaint about what it holds. */
  if (!require_attr (ld, root, "format", &format))
    return FALSE;
  if (!parse_int (format, G_MININT, G_MAXINT, &fmt))
    return fail_at (ld, node_line (root), TRB_ERROR_INVALID,
                    "attribute \"format\" = \"%s\" is not a whole number", format);
  if (fmt > TRB_PROJECT_FORMAT)
    return fail_at (ld, node_line (root), TRB_ERROR_NEWER_FORMAT,
                    "made by a newer version of Trabeate (format %" G_GINT64_FORMAT "); "
                    "this version reads format %d", fmt, TRB_PROJECT_FORMAT);
  if (fmt < 1)
    return fail_at (ld, node_line (root), TRB_ERROR_INVALID,
                    "unknown format %" G_GINT64_FORMAT " (this version reads format %d)",
                    fmt, TRB_PROJECT_FORMAT);
  project->format = (int) fmt;

  if (!check_attributes (ld, root, attrs))
    return FALSE;

  FOR_EACH_CHILD (child, root)
    {
      if (child->type != XML_ELEMENT_NODE)
        {
          if (!check_no_text (ld, child, root))
            return FALSE;
          continue;
        }
      if (is_element (child, "settings"))
        {
          if (settings_line > 0)
            return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                            "a second <settings> (the first is at line %d)", settings_line);
          if (!load_settings (ld, child, &project->settings))
            return FALSE;
          settings_line = node_line (child);
        }
      else if (is_element (child, "beam"))
        {
          if (project->members->len >= TRB_PROJECT_MAX_MEMBERS)
            return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                            "more than %d members: this version reads no more",
                            TRB_PROJECT_MAX_MEMBERS);
          if (!load_beam (ld, child, project))
            return FALSE;
        }
      else if (is_element (child, "sections"))
        {
          if (!load_sections (ld, child, project))
            return FALSE;
        }
      else if (is_element (child, "floor"))
        {
          if (!load_floor (ld, child, project))
            return FALSE;
        }
      else
        return fail_at (ld, node_line (child), TRB_ERROR_INVALID,
                        "unknown element <%s> inside <trabeate-project>", NAME (child));
    }
  return TRUE;
}

/* Called by the parser on "<!DOCTYPE name ...", before any internal subset is read: stopping
 * here means no entity is ever declared, so none can be expanded or fetched. */
static void
on_internal_subset (void          *ctx,
                    const xmlChar *name,
                    const xmlChar *external_id,
                    const xmlChar *system_id)
{
  xmlParserCtxt *ctxt = ctx;
  Guard *guard = ctxt->_private;

  guard->doctype = TRUE;
  guard->line = ctxt->input != NULL ? ctxt->input->line : 0;
  xmlStopParser (ctxt);
}

/* libxml2 gives an element the line where its start tag ends; a message about a tag written
 * over several lines should point at the line where it starts. The parser is just past the
 * tag's attributes here, and a well-formed tag holds no "<" (not even in its attribute
 * values), so the nearest "<" behind is the tag's start. */
static void
on_start_element (void           *ctx,
                  const xmlChar  *localname,
                  const xmlChar  *prefix,
                  const xmlChar  *uri,
                  int             nb_namespaces,
                  const xmlChar **namespaces,
                  int             nb_attributes,
                  int             nb_defaulted,
                  const xmlChar **attributes)
{
  xmlParserCtxt *ctxt = ctx;
  Guard *guard = ctxt->_private;
  xmlParserInput *in = ctxt->input;

  guard->start_element (ctx, localname, prefix, uri, nb_namespaces, namespaces, nb_attributes,
                        nb_defaulted, attributes);

  guard->nodes += 1 + (guint) MAX (nb_attributes, 0) + (guint) MAX (nb_namespaces, 0);
  if (guard->nodes > TRB_PROJECT_MAX_NODES && !guard->too_many)
    {
      guard->too_many = TRUE;
      guard->line = in != NULL ? in->line : 0;
      xmlStopParser (ctxt);
      return;
    }

  if (ctxt->node != NULL && in != NULL && in->cur != NULL && in->base != NULL &&
      in->cur > in->base)
    {
      const xmlChar *p = in->cur;
      unsigned int newlines = 0;

      while (p > in->base && *p != '<')
        {
          p--;
          if (*p == '\n')
            newlines++;
        }
      if (*p == '<' && ctxt->node->line > newlines && ctxt->node->line < 65535)
        ctxt->node->line -= newlines;
      else if (*p == '<' && ctxt->node->line == 65535 && in->line > (int) newlines &&
               in->line - (int) newlines <= G_MAXINT)
        ctxt->node->psvi = GINT_TO_POINTER (in->line - (int) newlines);
    }
}

static void
silent_error (void       *ctx,
              const char *msg,
              ...)
{
}

/* Skips from p to just past the first occurrence of the terminator (or to end), counting
 * newlines. */
static const char *
skip_past (const char *p,
           const char *end,
           const char *terminator,
           int        *line)
{
  gsize n = strlen (terminator);

  for (; p < end; p++)
    {
      if ((gsize) (end - p) >= n && memcmp (p, terminator, n) == 0)
        return p + n;
      if (*p == '\n')
        (*line)++;
    }
  return end;
}

/* The line of the first tag with more than TRB_PROJECT_MAX_ATTRIBUTES attributes, or 0: run
 * before libxml2, whose time on one tag grows with the square of its attributes. A linear
 * scan that judges nothing else: comments, processing instructions and CDATA sections are
 * skipped, and so are quoted values inside a tag (they may hold ">" and "="). At "<!" of
 * anything else (a DOCTYPE) it stops: the parser refuses that before any later tag. */
static int
find_crowded_tag (const char *data,
                  gsize       length)
{
  const char *p = data;
  const char *end = data + length;
  int line = 1;

  while (p < end)
    {
      gsize left = (gsize) (end - p);
      int tag_line;
      guint n = 0;

      if (*p != '<')
        {
          if (*p == '\n')
            line++;
          p++;
          continue;
        }
      if (left >= 4 && memcmp (p, "<!--", 4) == 0)
        {
          p = skip_past (p + 4, end, "-->", &line);
          continue;
        }
      if (left >= 9 && memcmp (p, "<![CDATA[", 9) == 0)
        {
          p = skip_past (p + 9, end, "]]>", &line);
          continue;
        }
      if (left >= 2 && p[1] == '?')
        {
          p = skip_past (p + 2, end, "?>", &line);
          continue;
        }
      if (left >= 2 && p[1] == '!')
        return 0;

      tag_line = line;
      for (p++; p < end && *p != '>'; p++)
        {
          if (*p == '"' || *p == '\'')
            {
              const char *q = memchr (p + 1, *p, (gsize) (end - p - 1));
              const char *stop = q != NULL ? q : end;

              for (const char *t = p + 1; t < stop; t++)
                if (*t == '\n')
                  line++;
              if (q == NULL)
                return 0;
              p = q;
            }
          else if (*p == '=')
            {
              if (++n > TRB_PROJECT_MAX_ATTRIBUTES)
                return tag_line;
            }
          else if (*p == '\n')
            line++;
        }
    }
  return 0;
}

/* Parses the bytes safely: no network, no entities, no DTD, any DOCTYPE refused before its
 * contents are read. Returns NULL with the error set. */
static xmlDoc *
parse_doc (Loader     *ld,
           const char *data,
           gsize       length)
{
  g_autoptr(xmlParserCtxt) ctxt = NULL;
  g_autoptr(xmlDoc) doc = NULL;
  Guard guard = { FALSE, 0, NULL, 0, FALSE };
  xmlGenericErrorFunc old_handler;
  void *old_context;
  int crowded;
  int rc;

  if (length > TRB_PROJECT_MAX_FILE_SIZE)
    {
      fail_at (ld, 0, TRB_ERROR_IO, "the file is larger than %d MiB",
               TRB_PROJECT_MAX_FILE_SIZE / (1024 * 1024));
      return NULL;
    }
  if (length == 0)
    {
      fail_at (ld, 1, TRB_ERROR_PARSE, "malformed XML: the file is empty");
      return NULL;
    }

  crowded = find_crowded_tag (data, length);
  if (crowded > 0)
    {
      fail_at (ld, crowded, TRB_ERROR_PARSE, "a tag with more than %d attributes",
               TRB_PROJECT_MAX_ATTRIBUTES);
      return NULL;
    }

  ctxt = xmlCreateMemoryParserCtxt (data, (int) length);
  if (ctxt == NULL)
    {
      fail_at (ld, 0, TRB_ERROR_PARSE, "malformed XML: cannot start the parser");
      return NULL;
    }
  /* Never XML_PARSE_NOENT, DTDLOAD, DTDATTR, XINCLUDE or HUGE. */
  /* XML_PARSE_COMPACT: a text shorter than 16 bytes (most attribute values: "20 ft") is kept
   * inside its node instead of a block of its own, several MB less at 10,000 members; the tree
   * is only read, never changed, which is all that option asks. */
  xmlCtxtUseOptions (ctxt, XML_PARSE_NONET | XML_PARSE_NOERROR | XML_PARSE_NOWARNING |
                           XML_PARSE_BIG_LINES | XML_PARSE_COMPACT);
  ctxt->_private = &guard;
  ctxt->sax->internalSubset = on_internal_subset;
  ctxt->sax->externalSubset = NULL;
  guard.start_element = ctxt->sax->startElementNs;
  if (guard.start_element != NULL && ctxt->sax->initialized == XML_SAX2_MAGIC)
    ctxt->sax->startElementNs = on_start_element;

  /* XML_PARSE_NOERROR silences the parser, but not the encoding converters, which print to
   * stderr ("encoding error : input conversion failed"): their text is in the parser's own
   * error anyway. The handler is per thread; the caller's comes back after the parse. */
  old_handler = xmlGenericError;
  old_context = xmlGenericErrorContext;
  xmlSetGenericErrorFunc (NULL, silent_error);
  rc = xmlParseDocument (ctxt);
  xmlSetGenericErrorFunc (old_context, old_handler);
  doc = g_steal_pointer (&ctxt->myDoc);

  if (guard.doctype)
    {
      fail_at (ld, guard.line, TRB_ERROR_PARSE, "a DOCTYPE is not allowed");
      return NULL;
    }
  if (guard.too_many)
    {
      fail_at (ld, guard.line, TRB_ERROR_PARSE, "more than %d elements and attributes",
               TRB_PROJECT_MAX_NODES);
      return NULL;
    }
  if (rc != 0 || !ctxt->wellFormed || doc == NULL)
    {
      const xmlError *e = xmlCtxtGetLastError (ctxt);
      g_autofree char *msg = g_strdup (e != NULL && e->message != NULL ? e->message
                                                                       : "not well-formed");

      fail_at (ld, e != NULL ? e->line : 0, TRB_ERROR_PARSE, "malformed XML: %s",
               g_strstrip (msg));
      return NULL;
    }
  if (doc->intSubset != NULL || doc->extSubset != NULL)
    {
      fail_at (ld, 1, TRB_ERROR_PARSE, "a DOCTYPE is not allowed");
      return NULL;
    }
  if (xmlDocGetRootElement (doc) == NULL)
    {
      fail_at (ld, 1, TRB_ERROR_PARSE, "malformed XML: no root element");
      return NULL;
    }
  return g_steal_pointer (&doc);
}

/* libxml2 reports schema errors through this; the first one is kept. */
typedef struct
{
  gboolean  failed;
  int       line;
  char     *message;
} SchemaErrors;

static void
on_schema_error (void        *data,
                 xmlErrorPtr  error)
{
  SchemaErrors *se = data;

  if (se == NULL || se->failed || error == NULL)
    return;
  se->failed = TRUE;
  /* The node, when there is one, knows its line past 65535 too (XML_PARSE_BIG_LINES). */
  se->line = error->node != NULL ? node_line (error->node) : error->line;
  se->message = g_strstrip (g_strdup (error->message != NULL ? error->message : "invalid"));
}

#define SCHEMA_RESOURCE "/org/trabeate/Trabeate/schema/trabeate-project.rng"

/* The bundled schema, parsed once and then only read (validation contexts are per call, so
 * several threads may validate at once). */
static xmlRelaxNG *
get_schema (void)
{
  static xmlRelaxNG *schema = NULL;
  static gsize done = 0;

  if (g_once_init_enter (&done))
    {
      g_autoptr(GBytes) bytes = NULL;
      SchemaErrors se = { FALSE, 0, NULL };

      /* Naming the resource keeps its object in the link out of the static library; its
       * constructor registers it, for g_resources_lookup_data(). */
      if (trb_data_get_resource () != NULL)
        bytes = g_resources_lookup_data (SCHEMA_RESOURCE, G_RESOURCE_LOOKUP_FLAGS_NONE, NULL);
      if (bytes != NULL)
        {
          gsize size;
          const char *rng = g_bytes_get_data (bytes, &size);
          xmlRelaxNGParserCtxt *pc = xmlRelaxNGNewMemParserCtxt (rng, (int) size);

          if (pc != NULL)
            {
              xmlRelaxNGSetParserStructuredErrors (pc, on_schema_error, &se);
              schema = xmlRelaxNGParse (pc);
              xmlRelaxNGFreeParserCtxt (pc);
            }
        }
      if (schema == NULL)
        g_critical ("the bundled project schema cannot be read: %s",
                    se.message != NULL ? se.message : "no resource");
      g_free (se.message);
      g_once_init_leave (&done, 1);
    }
  return schema;
}

/* The second gate: the document against the RELAX NG schema. The hand checks come first,
 * because they say what is wrong in the trade's words ("load \"at\" lies outside the
 * member"), where the schema can only say that an element failed to validate; the schema then
 * catches whatever the two might ever disagree on, with its line. libxml2 judges whatever
 * trb_project_io_priv_schema_proved() cannot prove valid. */
static gboolean
validate_schema (Loader   *ld,
                 xmlDoc   *doc,
                 gboolean  try_proof)
{
  xmlRelaxNG *schema;
  xmlRelaxNGValidCtxt *vc;
  SchemaErrors se = { FALSE, 0, NULL };
  g_autofree char *message = NULL;
  int rc;

  if (try_proof && trb_project_io_priv_schema_proved (doc))
    return TRUE;
  schema = get_schema ();
  if (schema == NULL)
    return fail_at (ld, 0, TRB_ERROR_IO, "the bundled project schema cannot be read");
  vc = xmlRelaxNGNewValidCtxt (schema);
  if (vc == NULL)
    return fail_at (ld, 0, TRB_ERROR_IO, "cannot start the schema validation");
  xmlRelaxNGSetValidStructuredErrors (vc, on_schema_error, &se);
  rc = xmlRelaxNGValidateDoc (vc, doc);
  xmlRelaxNGFreeValidCtxt (vc);
  message = se.message;
  if (rc == 0)
    return TRUE;
  return fail_at (ld, se.line, TRB_ERROR_INVALID, "does not match the project schema: %s",
                  message != NULL ? message : "invalid");
}

/* @release, if not NULL, holds @data and is freed as soon as the document is parsed: the
 * file's bytes need not stay beside the tree and the model. */
static TrbProject *
load_data_in (const char  *data,
              gsize        length,
              const char  *display_name,
              const char  *dir,
              GByteArray  *release,
              GError     **error)
{
  g_autoptr(xmlDoc) doc = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(GHashTable) floors = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  g_autoptr(GHashTable) columns = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  g_autoptr(GHashTable) walls = g_hash_table_new_full (g_str_hash, g_str_equal, g_free, NULL);
  Loader ld = {
    display_name != NULL ? display_name : "(project)", error, dir, floors, columns, walls
  };

  g_return_val_if_fail (data != NULL || length == 0, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  doc = parse_doc (&ld, data, length);
  if (release != NULL)
    g_byte_array_unref (release);
  if (doc == NULL)
    return NULL;

  project = trb_project_new ();
  project->name = g_strdup (ld.name);
  if (!load_root (&ld, xmlDocGetRootElement (doc), project) ||
      !validate_schema (&ld, doc, TRUE))
    return NULL;
  return g_steal_pointer (&project);
}

/**
 * trb_project_check_schema:
 * @data: (array length=length): a project file's bytes
 * @length: their number
 * @display_name: (nullable): the name messages give the file
 * @error: return location for a #TRB_ERROR
 *
 * Parses @data as the loader does (with the same safety rules) and checks it against the
 * bundled RELAX NG schema only, without the loader's own checks: for testing the schema, and
 * for tools that write project files.
 *
 * Returns: %TRUE if the document matches the schema; else %FALSE with @error set to
 *   "<name>:<line>: does not match the project schema: <libxml2's message>".
 */
gboolean
trb_project_check_schema (const char  *data,
                          gsize        length,
                          const char  *display_name,
                          GError     **error)
{
  g_autoptr(xmlDoc) doc = NULL;
  Loader ld = { display_name != NULL ? display_name : "(project)", error, NULL, NULL, NULL,
                NULL };

  g_return_val_if_fail (data != NULL || length == 0, FALSE);
  g_return_val_if_fail (error == NULL || *error == NULL, FALSE);

  doc = parse_doc (&ld, data, length);
  return doc != NULL && validate_schema (&ld, doc, FALSE);
}

/**
 * trb_project_load_data:
 * @data: the file's bytes
 * @length: their number
 * @display_name: (nullable): the name messages give the file
 * @error: return location for a #TRB_ERROR
 *
 * Parses a project from memory. A <sections file="..."> cannot be followed from here: there
 * is no folder to look in.
 *
 * Returns: (transfer full): the project, or %NULL with @error set.
 */
TrbProject *
trb_project_load_data (const char  *data,
                       gsize        length,
                       const char  *display_name,
                       GError     **error)
{
  return load_data_in (data, length, display_name, NULL, NULL, error);
}

/**
 * trb_project_load_file:
 * @filename: a path
 * @error: return location for a #TRB_ERROR
 *
 * Reads at most %TRB_PROJECT_MAX_FILE_SIZE bytes (a larger file, or a device that never ends,
 * is refused) and parses them with trb_project_load_data(), naming the file as given in every
 * message. Never writes anything.
 *
 * Returns: (transfer full): the project, or %NULL with @error set.
 */
TrbProject *
trb_project_load_file (const char  *filename,
                       GError     **error)
{
  g_autoptr(GFile) file = NULL;
  g_autoptr(GFileInputStream) in = NULL;
  g_autoptr(GByteArray) bytes = NULL;
  g_autoptr(GFileInfo) info = NULL;
  g_autoptr(GError) local = NULL;
  g_autofree char *display = NULL;
  g_autofree char *dir = NULL;
  const char *data;
  gsize length;
  goffset size = 0;
  guint8 chunk[65536];

  g_return_val_if_fail (filename != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  display = g_filename_display_name (filename);
  file = g_file_new_for_path (filename);
  in = g_file_read (file, NULL, &local);
  if (in == NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_IO, "%s: cannot open: %s", display,
                   local->message);
      return NULL;
    }

  /* sized to the file, so that its bytes are not held in a block of twice the size */
  info = g_file_input_stream_query_info (in, G_FILE_ATTRIBUTE_STANDARD_SIZE, NULL, NULL);
  if (info != NULL && g_file_info_has_attribute (info, G_FILE_ATTRIBUTE_STANDARD_SIZE))
    size = g_file_info_get_size (info);
  bytes = g_byte_array_sized_new ((guint) CLAMP (size, 0, TRB_PROJECT_MAX_FILE_SIZE));
  for (;;)
    {
      gssize n = g_input_stream_read (G_INPUT_STREAM (in), chunk, sizeof chunk, NULL, &local);

      if (n < 0)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_IO, "%s: cannot read: %s", display,
                       local->message);
          return NULL;
        }
      if (n == 0)
        break;
      if (bytes->len + (gsize) n > TRB_PROJECT_MAX_FILE_SIZE)
        {
          g_set_error (error, TRB_ERROR, TRB_ERROR_IO, "%s: the file is larger than %d MiB",
                       display, TRB_PROJECT_MAX_FILE_SIZE / (1024 * 1024));
          return NULL;
        }
      g_byte_array_append (bytes, chunk, (guint) n);
    }

  dir = g_path_get_dirname (filename);
  data = (const char *) bytes->data;
  length = bytes->len;
  return load_data_in (data, length, display, dir, g_steal_pointer (&bytes), error);
}
