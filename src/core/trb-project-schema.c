/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <libxml/tree.h>
#include <math.h>
#include <string.h>

#include "trb-project-io-private.h"

/* ---- the schema's rules, proved in one walk ---------------------------------------------
 *
 * libxml2 compiles a pattern's regular expression again for every value it checks against
 * it, which made the RELAX NG validation 90 % of loading a floor of 10,000 members. The walk
 * below holds the same rules as data/trabeate-project.rng, element by element, and answers
 * only "certainly valid" or "not proved": it accepts a value only in a form the schema is
 * sure to accept (an exact choice, plain digits, a pattern's plainest reading), and anything
 * it is unsure of (namespaces, CDATA, tabs or line breaks in a name, " yes " for "yes")
 * goes to libxml2's validation as before, which gives its message and line. A document
 * proved here is valid; every other one is judged exactly as before. Keep the two in step:
 * a rule added to the schema must be added here, or files using it only load slower. */

typedef enum
{
  V_QUANTITY,    /* xsd:string, minLength 1 */
  V_NAME,        /* xsd:string, pattern ".*\S.*" */
  V_TEXT,        /* an attribute without a pattern: any text */
  V_DEFLECTION,  /* xsd:string, pattern "none|[Ll]/[0-9].*" */
  V_POSITIVE,    /* xsd:positiveInteger */
  V_FLOORS,      /* xsd:nonNegativeInteger, maxInclusive 999 */
  V_PLIES,       /* xsd:integer, 1 to 99 */
  V_CHOICE,      /* one of the <value>s (tokens) */
} ValueRule;

typedef struct
{
  const char         *name;
  ValueRule           rule;
  const char * const *choices;   /* V_CHOICE */
  gboolean            required;
} AttrRule;

static const char * const ch_method[] = { "asd", "lrfd", "allowable", NULL };
static const char * const ch_yes_no[] = { "yes", "no", NULL };
static const char * const ch_on_off[] = { "on", "off", NULL };
static const char * const ch_case[] = { "D", "L", "Lr", "S", NULL };
static const char * const ch_self_weight[] = { "include", "exclude", NULL };
static const char * const ch_units[] = { "us", "si", NULL };
static const char * const ch_material[] = { "steel", "wood", "custom", NULL };
static const char * const ch_bracing[] = { "continuous", "supports", NULL };
static const char * const ch_support[] = { "pin", "roller", "fixed", NULL };
static const char * const ch_role[] = { "girder", "beam", "joist", NULL };
static const char * const ch_area_kind[] = { "ordinary", "partition", NULL };

#define RULES_END { NULL, V_TEXT, NULL, FALSE }

static const AttrRule rules_root[] = { { "format", V_POSITIVE, NULL, TRUE }, RULES_END };

static const AttrRule rules_settings[] = {
  { "method", V_CHOICE, ch_method, FALSE },
  { "fb-allow", V_QUANTITY, NULL, FALSE },
  { "fv-allow", V_QUANTITY, NULL, FALSE },
  { "steel-grade", V_NAME, NULL, FALSE },
  { "self-weight", V_CHOICE, ch_self_weight, FALSE },
  { "live-patterns", V_CHOICE, ch_on_off, FALSE },
  { "deflection-live", V_DEFLECTION, NULL, FALSE },
  { "deflection-total", V_DEFLECTION, NULL, FALSE },
  { "units", V_CHOICE, ch_units, FALSE },
  { "live-load-reduction", V_CHOICE, ch_on_off, FALSE },
  { "floors-above", V_FLOORS, NULL, FALSE },
  RULES_END
};

static const AttrRule rules_sections[] = { { "file", V_NAME, NULL, FALSE }, RULES_END };

/* "design-attributes" of the schema, shared by <beam> and <member> */
static const AttrRule rules_design[] = {
  { "material", V_CHOICE, ch_material, TRUE },
  { "section", V_NAME, NULL, FALSE },
  { "E", V_QUANTITY, NULL, FALSE },
  { "I", V_QUANTITY, NULL, FALSE },
  { "S", V_QUANTITY, NULL, FALSE },
  { "A", V_QUANTITY, NULL, FALSE },
  { "d", V_QUANTITY, NULL, FALSE },
  { "tw", V_QUANTITY, NULL, FALSE },
  { "weight", V_QUANTITY, NULL, FALSE },
  { "method", V_CHOICE, ch_method, FALSE },
  { "fb-allow", V_QUANTITY, NULL, FALSE },
  { "fv-allow", V_QUANTITY, NULL, FALSE },
  { "steel-grade", V_NAME, NULL, FALSE },
  { "deflection-live", V_DEFLECTION, NULL, FALSE },
  { "deflection-total", V_DEFLECTION, NULL, FALSE },
  { "bracing", V_CHOICE, ch_bracing, FALSE },
  { "max-depth", V_QUANTITY, NULL, FALSE },
  { "min-depth", V_QUANTITY, NULL, FALSE },
  { "allowed", V_NAME, NULL, FALSE },
  { "max-plies", V_PLIES, NULL, FALSE },
  { "species", V_NAME, NULL, FALSE },
  { "grade", V_NAME, NULL, FALSE },
  { "wet-service", V_CHOICE, ch_yes_no, FALSE },
  { "incised", V_CHOICE, ch_yes_no, FALSE },
  { "repetitive", V_CHOICE, ch_yes_no, FALSE },
  { "bearing-length", V_QUANTITY, NULL, FALSE },
  RULES_END
};

static const AttrRule rules_beam[] = {
  { "id", V_NAME, NULL, TRUE },
  { "length", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_member[] = {
  { "id", V_NAME, NULL, TRUE },
  { "role", V_CHOICE, ch_role, TRUE },
  { "x1", V_QUANTITY, NULL, TRUE },
  { "y1", V_QUANTITY, NULL, TRUE },
  { "x2", V_QUANTITY, NULL, TRUE },
  { "y2", V_QUANTITY, NULL, TRUE },
  { "length", V_QUANTITY, NULL, FALSE },
  { "group", V_NAME, NULL, FALSE },
  { "deck", V_CHOICE, ch_yes_no, FALSE },
  RULES_END
};

static const AttrRule rules_support[] = {
  { "at", V_QUANTITY, NULL, TRUE },
  { "type", V_CHOICE, ch_support, TRUE },
  RULES_END
};

static const AttrRule rules_brace[] = { { "at", V_QUANTITY, NULL, TRUE }, RULES_END };

/* <load>: the case, and for each type the group of its attributes */
static const AttrRule rules_load_point[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "type", V_TEXT, NULL, TRUE },
  { "at", V_QUANTITY, NULL, TRUE },
  { "p", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_load_moment[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "type", V_TEXT, NULL, TRUE },
  { "at", V_QUANTITY, NULL, TRUE },
  { "m", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_load_uniform[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "type", V_TEXT, NULL, TRUE },
  { "from", V_QUANTITY, NULL, TRUE },
  { "to", V_QUANTITY, NULL, TRUE },
  { "w", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_load_linear[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "type", V_TEXT, NULL, TRUE },
  { "from", V_QUANTITY, NULL, TRUE },
  { "to", V_QUANTITY, NULL, TRUE },
  { "w1", V_QUANTITY, NULL, TRUE },
  { "w2", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_xy[] = {
  { "x", V_QUANTITY, NULL, TRUE },
  { "y", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_floor[] = { { "name", V_NAME, NULL, TRUE }, RULES_END };

static const AttrRule rules_grid[] = {
  { "name", V_NAME, NULL, TRUE },
  { "x1", V_QUANTITY, NULL, TRUE },
  { "y1", V_QUANTITY, NULL, TRUE },
  { "x2", V_QUANTITY, NULL, TRUE },
  { "y2", V_QUANTITY, NULL, TRUE },
  RULES_END
};

static const AttrRule rules_column[] = {
  { "id", V_NAME, NULL, TRUE },
  { "x", V_QUANTITY, NULL, TRUE },
  { "y", V_QUANTITY, NULL, TRUE },
  { "section", V_NAME, NULL, FALSE },
  RULES_END
};

static const AttrRule rules_wall[] = {
  { "id", V_NAME, NULL, TRUE },
  { "material", V_TEXT, NULL, FALSE },
  RULES_END
};

static const AttrRule rules_area_load[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "kind", V_CHOICE, ch_area_kind, FALSE },
  { "pressure", V_QUANTITY, NULL, TRUE },
  { "label", V_TEXT, NULL, FALSE },
  { "occupancy", V_TEXT, NULL, FALSE },
  RULES_END
};

static const AttrRule rules_none[] = { RULES_END };

static const AttrRule rules_line_load[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "w", V_QUANTITY, NULL, TRUE },
  { "label", V_TEXT, NULL, FALSE },
  RULES_END
};

static const AttrRule rules_point_load[] = {
  { "case", V_CHOICE, ch_case, TRUE },
  { "p", V_QUANTITY, NULL, TRUE },
  { "x", V_QUANTITY, NULL, TRUE },
  { "y", V_QUANTITY, NULL, TRUE },
  { "label", V_TEXT, NULL, FALSE },
  RULES_END
};

/* plain decimal digits, no sign, no leading zero unless the number is 0, at most max_len */
static gboolean
plain_digits (const char *v,
              gsize       max_len,
              gint64     *out)
{
  gsize n = 0;
  gint64 value = 0;

  if (v[0] == '0' && v[1] != '\0')
    return FALSE;
  for (; v[n] != '\0'; n++)
    {
      if (n >= max_len || v[n] < '0' || v[n] > '9')
        return FALSE;
      value = value * 10 + (v[n] - '0');
    }
  *out = value;
  return n > 0;
}

/* Every byte at least a space: no tab, line break or other control character (a pattern's
 * "." takes neither line feed nor carriage return; tabs are left to libxml2). */
static gboolean
plain_text (const char *v)
{
  for (; *v != '\0'; v++)
    if ((unsigned char) *v < 0x20 || *v == 0x7f)
      return FALSE;
  return TRUE;
}

static gboolean
proved_value (const AttrRule *rule,
              const char     *v)
{
  gint64 n;

  switch (rule->rule)
    {
    case V_QUANTITY:
      return v[0] != '\0';
    case V_NAME:
      /* ".*\S.*": no line break, and something that is not white space */
      if (!plain_text (v))
        return FALSE;
      for (const char *p = v; *p != '\0'; p++)
        if (*p != ' ')
          return TRUE;
      return FALSE;
    case V_TEXT:
      return TRUE;
    case V_DEFLECTION:
      /* "none|[Ll]/[0-9].*" */
      if (strcmp (v, "none") == 0)
        return TRUE;
      return (v[0] == 'L' || v[0] == 'l') && v[1] == '/' && v[2] >= '0' && v[2] <= '9' &&
             plain_text (v + 3);
    case V_POSITIVE:
      return plain_digits (v, 9, &n) && n >= 1;
    case V_FLOORS:
      return plain_digits (v, 3, &n) && n <= 999;
    case V_PLIES:
      return plain_digits (v, 2, &n) && n >= 1 && n <= 99;
    case V_CHOICE:
      return trb_project_io_priv_names_contain (rule->choices, v);
    default:
      return FALSE;
    }
}

/* An attribute's value as it stands in the tree: one text child (or none, for ""); NULL
 * for anything else (entity references), which is left to libxml2. */
static const char *
attr_text (const xmlAttr *a)
{
  if (a->children == NULL)
    return "";
  if (a->children->next != NULL || a->children->type != XML_TEXT_NODE ||
      a->children->content == NULL)
    return NULL;
  return (const char *) a->children->content;
}

static const AttrRule *
find_rule (const AttrRule *rules,
           const char     *name)
{
  for (; rules->name != NULL; rules++)
    if (rules->name[0] == name[0] && strcmp (rules->name, name) == 0)
      return rules;
  return NULL;
}

/* Every attribute in one of the rule lists (in no namespace) with a proved value, and every
 * required one present. */
static gboolean
proved_attributes (const xmlNode  *node,
                   const AttrRule *rules,
                   const AttrRule *more)
{
  guint required = 0, seen = 0;

  for (const AttrRule *r = rules; r->name != NULL; r++)
    required += r->required;
  for (const AttrRule *r = more; r != NULL && r->name != NULL; r++)
    required += r->required;

  for (const xmlAttr *a = node->properties; a != NULL; a = a->next)
    {
      const AttrRule *rule;
      const char *v;

      if (a->type != XML_ATTRIBUTE_NODE || a->ns != NULL)
        return FALSE;
      rule = find_rule (rules, (const char *) a->name);
      if (rule == NULL && more != NULL)
        rule = find_rule (more, (const char *) a->name);
      if (rule == NULL)
        return FALSE;
      v = attr_text (a);
      if (v == NULL || !proved_value (rule, v))
        return FALSE;
      seen += rule->required;
    }
  return seen == required;
}

/* Between elements and in empty elements the schema ignores white space, comments and
 * processing instructions. */
static gboolean
ignorable (const xmlNode *node)
{
  if (node->type == XML_COMMENT_NODE || node->type == XML_PI_NODE)
    return TRUE;
  if (node->type != XML_TEXT_NODE)
    return FALSE;
  for (const char *s = (const char *) node->content; s != NULL && *s != '\0'; s++)
    if (*s != ' ' && *s != '\t' && *s != '\n' && *s != '\r')
      return FALSE;
  return TRUE;
}

static gboolean
is_plain_element (const xmlNode *node,
                  const char    *name)
{
  return node->type == XML_ELEMENT_NODE && node->ns == NULL &&
         strcmp ((const char *) node->name, name) == 0;
}

static gboolean
proved_empty (const xmlNode  *node,
              const AttrRule *rules)
{
  if (!proved_attributes (node, rules, NULL))
    return FALSE;
  for (const xmlNode *c = node->children; c != NULL; c = c->next)
    if (!ignorable (c))
      return FALSE;
  return TRUE;
}

/* Elements of <point>s only, at least min of them. */
static gboolean
proved_points (const xmlNode *node,
               guint          min)
{
  guint n = 0;

  for (const xmlNode *c = node->children; c != NULL; c = c->next)
    {
      if (ignorable (c))
        continue;
      if (!is_plain_element (c, "point") || !proved_empty (c, rules_xy))
        return FALSE;
      n++;
    }
  return n >= min;
}

static gboolean
proved_load (const xmlNode *node)
{
  const xmlAttr *type = xmlHasNsProp ((xmlNode *) node, (const xmlChar *) "type", NULL);
  const char *v = type != NULL ? attr_text (type) : NULL;

  if (v == NULL)
    return FALSE;
  if (strcmp (v, "point") == 0)
    return proved_empty (node, rules_load_point);
  if (strcmp (v, "moment") == 0)
    return proved_empty (node, rules_load_moment);
  if (strcmp (v, "uniform") == 0)
    return proved_empty (node, rules_load_uniform);
  if (strcmp (v, "linear") == 0)
    return proved_empty (node, rules_load_linear);
  return FALSE;
}

/* A <beam>'s or a <member>'s children: supports, braces and loads, and for a member the
 * points it bears on. */
static gboolean
proved_member_children (const xmlNode *node,
                        gboolean       bears_on)
{
  for (const xmlNode *c = node->children; c != NULL; c = c->next)
    {
      gboolean ok;

      if (ignorable (c))
        continue;
      if (c->type != XML_ELEMENT_NODE || c->ns != NULL)
        return FALSE;
      if (is_plain_element (c, "load"))
        ok = proved_load (c);
      else if (is_plain_element (c, "support"))
        ok = proved_empty (c, rules_support);
      else if (is_plain_element (c, "brace"))
        ok = proved_empty (c, rules_brace);
      else if (bears_on && is_plain_element (c, "bears-on"))
        ok = proved_empty (c, rules_xy);
      else
        ok = FALSE;
      if (!ok)
        return FALSE;
    }
  return TRUE;
}

static gboolean
proved_floor (const xmlNode *node)
{
  if (!proved_attributes (node, rules_floor, NULL))
    return FALSE;
  for (const xmlNode *c = node->children; c != NULL; c = c->next)
    {
      gboolean ok;

      if (ignorable (c))
        continue;
      if (c->type != XML_ELEMENT_NODE || c->ns != NULL)
        return FALSE;
      if (is_plain_element (c, "member"))
        ok = proved_attributes (c, rules_member, rules_design) &&
             proved_member_children (c, TRUE);
      else if (is_plain_element (c, "column"))
        ok = proved_empty (c, rules_column);
      else if (is_plain_element (c, "area-load"))
        ok = proved_attributes (c, rules_area_load, NULL) && proved_points (c, 3);
      else if (is_plain_element (c, "opening"))
        ok = proved_attributes (c, rules_none, NULL) && proved_points (c, 3);
      else if (is_plain_element (c, "wall"))
        ok = proved_attributes (c, rules_wall, NULL) && proved_points (c, 2);
      else if (is_plain_element (c, "line-load"))
        ok = proved_attributes (c, rules_line_load, NULL) && proved_points (c, 2);
      else if (is_plain_element (c, "point-load"))
        ok = proved_empty (c, rules_point_load);
      else if (is_plain_element (c, "grid"))
        ok = proved_empty (c, rules_grid);
      else
        ok = FALSE;
      if (!ok)
        return FALSE;
    }
  return TRUE;
}

/* TRUE when the document certainly matches the schema; FALSE when that is not proved. */
gboolean
trb_project_io_priv_schema_proved (xmlDoc *doc)
{
  const xmlNode *root = xmlDocGetRootElement (doc);

  if (root == NULL || !is_plain_element (root, "trabeate-project") ||
      !proved_attributes (root, rules_root, NULL))
    return FALSE;
  for (const xmlNode *c = root->children; c != NULL; c = c->next)
    {
      gboolean ok;

      if (ignorable (c))
        continue;
      if (c->type != XML_ELEMENT_NODE || c->ns != NULL)
        return FALSE;
      if (is_plain_element (c, "beam"))
        ok = proved_attributes (c, rules_beam, rules_design) &&
             proved_member_children (c, FALSE);
      else if (is_plain_element (c, "floor"))
        ok = proved_floor (c);
      else if (is_plain_element (c, "settings"))
        ok = proved_empty (c, rules_settings);
      else if (is_plain_element (c, "sections"))
        {
          ok = proved_attributes (c, rules_sections, NULL);
          /* <text/>: text, comments and processing instructions, no element */
          for (const xmlNode *t = c->children; ok && t != NULL; t = t->next)
            ok = t->type == XML_TEXT_NODE || t->type == XML_COMMENT_NODE ||
                 t->type == XML_PI_NODE;
        }
      else
        ok = FALSE;
      if (!ok)
        return FALSE;
    }
  return TRUE;
}
