/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib.h>
#include <locale.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "trb-cautions.h"
#include "trb-cli-report.h"
#include "trb-combos.h"
#include "trb-error.h"
#include "trb-model.h"
#include "trb-project-io.h"
#include "trb-solve.h"
#include "trb-units.h"

/* Exit codes: see docs/cli.md. */
#define EXIT_PASS  0
#define EXIT_FAILS 1
#define EXIT_USAGE 2

#define CAUTION_1 TRB_CAUTION_LICENSED
#define CAUTION_2 TRB_CAUTION_NOT_CHECKED
#define CAUTION_3 TRB_CAUTION_INPUTS

#define UNIT_NOTE "N, m, N*m, Pa, m^4, rad; x in m from the left end of the member; loads " \
                  "positive down; applied moments positive clockwise; reaction forces " \
                  "positive up; reaction moments positive counter-clockwise; V is the sum of " \
                  "the upward forces left of x; M positive sagging; defl_down and defl_up are " \
                  "magnitudes of the largest downward and upward deflections"

static const char usage_text[] =
  "Usage:\n"
  "  trabeate-cli check FILE [--json] [--member ID]\n"
  "  trabeate-cli --help | --version\n"
  "\n"
  "Commands:\n"
  "  check    analyse every member of a project file and print the results\n"
  "\n"
  "Options of check:\n"
  "  --json         write the results as JSON (SI units) instead of a table\n"
  "  --member ID    only the member with this id\n"
  "\n"
  "Exit status: 0 every member passes; 1 some member fails, is unstable or unsupported,\n"
  "or is not designed; 2 bad input or usage.\n";

/* ---- JSON ---------------------------------------------------------------------------- */

static void
json_string (GString    *out,
             const char *s)
{
  g_string_append_c (out, '"');
  for (const char *p = s != NULL ? s : ""; *p != '\0'; p++)
    {
      unsigned char c = (unsigned char) *p;

      switch (c)
        {
        case '"':
          g_string_append (out, "\\\"");
          break;
        case '\\':
          g_string_append (out, "\\\\");
          break;
        case '\n':
          g_string_append (out, "\\n");
          break;
        case '\r':
          g_string_append (out, "\\r");
          break;
        case '\t':
          g_string_append (out, "\\t");
          break;
        default:
          if (c < 0x20)
            g_string_append_printf (out, "\\u%04x", c);
          else
            g_string_append_c (out, (char) c);
        }
    }
  g_string_append_c (out, '"');
}

/* %.17g, whatever the locale; JSON has no NaN or infinity, so those are null. */
static void
json_number (GString *out,
             double   v)
{
  char buf[G_ASCII_DTOSTR_BUF_SIZE];

  if (!isfinite (v))
    {
      g_string_append (out, "null");
      return;
    }
  g_string_append (out, g_ascii_dtostr (buf, sizeof buf, v));
}

static void
json_key (GString    *out,
          gboolean   *first,
          const char *key)
{
  if (!*first)
    g_string_append_c (out, ',');
  *first = FALSE;
  json_string (out, key);
  g_string_append_c (out, ':');
}

static void
json_key_number (GString    *out,
                 gboolean   *first,
                 const char *key,
                 double      v)
{
  json_key (out, first, key);
  json_number (out, v);
}

static void
json_key_string (GString    *out,
                 gboolean   *first,
                 const char *key,
                 const char *v)
{
  json_key (out, first, key);
  if (v == NULL)
    g_string_append (out, "null");
  else
    json_string (out, v);
}

static void
json_extremes (GString               *out,
               gboolean              *first,
               const TrbBeamExtremes *e)
{
  json_key_number (out, first, "V_max", e->V_max);
  json_key_number (out, first, "V_max_x", e->V_max_x);
  json_key_number (out, first, "V_min", e->V_min);
  json_key_number (out, first, "V_min_x", e->V_min_x);
  json_key_number (out, first, "M_max", e->M_max);
  json_key_number (out, first, "M_max_x", e->M_max_x);
  json_key_number (out, first, "M_min", e->M_min);
  json_key_number (out, first, "M_min_x", e->M_min_x);
  json_key_number (out, first, "defl_down", e->defl_down);
  json_key_number (out, first, "defl_down_x", e->defl_down_x);
  json_key_number (out, first, "defl_up", e->defl_up);
  json_key_number (out, first, "defl_up_x", e->defl_up_x);
}

static void
json_result (GString               *out,
             const TrbBeamResult   *result,
             const TrbBeamExtremes *e)
{
  const TrbReaction *re;
  guint n;
  gboolean first = TRUE;

  g_string_append_c (out, '{');
  json_key (out, &first, "reactions");
  g_string_append_c (out, '[');
  re = trb_beam_result_get_reactions (result, &n);
  for (guint i = 0; i < n; i++)
    {
      gboolean f = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      g_string_append_c (out, '{');
      json_key_number (out, &f, "x", re[i].x);
      json_key_number (out, &f, "force", re[i].force);
      json_key_number (out, &f, "moment", re[i].moment);
      g_string_append_c (out, '}');
    }
  g_string_append_c (out, ']');
  json_extremes (out, &first, e);
  g_string_append_c (out, '}');
}

static void
json_factors (GString      *out,
              const double *factors)
{
  gboolean first = TRUE;

  g_string_append_c (out, '{');
  for (guint c = 0; c < TRB_N_CASES; c++)
    if (factors[c] != 0)
      json_key_number (out, &first, trb_load_case_name (c), factors[c]);
  g_string_append_c (out, '}');
}

static void
json_combinations (GString                 *out,
                   const TrbComboSetResult *set)
{
  g_string_append_c (out, '{');
  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);
      gboolean first = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      json_string (out, c->name);
      g_string_append_c (out, ':');
      /* the result's own keys, then what names it */
      json_result (out, c->result, &c->ext);
      g_string_truncate (out, out->len - 1);
      first = FALSE;
      json_key_string (out, &first, "combination", c->combo.name);
      json_key_string (out, &first, "equation", c->combo.equation);
      json_key_string (out, &first, "pattern", c->pattern[0] != '\0' ? c->pattern : NULL);
      json_key (out, &first, "factors");
      json_factors (out, c->combo.factors);
      g_string_append_c (out, '}');
    }
  g_string_append_c (out, '}');
}

static void
json_envelope (GString                 *out,
               const TrbComboSetResult *set)
{
  const TrbEnvelope *env = &set->envelope;
  gboolean first = TRUE;
  gboolean g = TRUE;

  if (env->empty)
    {
      g_string_append (out, "null");
      return;
    }
  g_string_append_c (out, '{');
  json_key (out, &first, "reactions");
  g_string_append_c (out, '[');
  for (guint i = 0; i < env->reactions->len; i++)
    {
      const TrbReactionRange *rr = &g_array_index (env->reactions, TrbReactionRange, i);
      gboolean f = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      g_string_append_c (out, '{');
      json_key_number (out, &f, "x", rr->x);
      json_key_number (out, &f, "force", rr->force_max);
      json_key_number (out, &f, "moment", rr->moment_max);
      json_key_number (out, &f, "force_min", rr->force_min);
      json_key_number (out, &f, "moment_min", rr->moment_min);
      g_string_append_c (out, '}');
    }
  g_string_append_c (out, ']');
  json_extremes (out, &first, &env->ext);
  json_key (out, &first, "governing");
  g_string_append_c (out, '{');
  json_key_string (out, &g, "V_max", env->V_max_by);
  json_key_string (out, &g, "V_min", env->V_min_by);
  json_key_string (out, &g, "M_max", env->M_max_by);
  json_key_string (out, &g, "M_min", env->M_min_by);
  json_key_string (out, &g, "defl_down", env->defl_down_by);
  json_key_string (out, &g, "defl_up", env->defl_up_by);
  g_string_append (out, "}}");
}

static void
json_checks (GString      *out,
             const GArray *checks)
{
  g_string_append_c (out, '[');
  for (guint i = 0; i < checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (checks, TrbCheck, i);
      gboolean f = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      g_string_append_c (out, '{');
      json_key_string (out, &f, "name", ck->name);
      json_key_string (out, &f, "clause", ck->clause);
      json_key_string (out, &f, "dimension", trb_dimension_name (ck->dimension));
      json_key_number (out, &f, "demand", ck->demand);
      json_key_number (out, &f, "capacity", ck->capacity);
      json_key_number (out, &f, "ratio", ck->ratio);
      json_key_string (out, &f, "combination", ck->combination);
      json_key_number (out, &f, "x", ck->x);
      json_key_string (out, &f, "detail", ck->detail);
      g_string_append_c (out, '}');
    }
  g_string_append_c (out, ']');
}

static void
json_member (GString               *out,
             const TrbProject      *project,
             const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  gboolean first = TRUE;

  g_string_append_c (out, '{');
  json_key_string (out, &first, "id", m->id);
  json_key_string (out, &first, "status", trb_status_name (r->status));
  if (r->message != NULL)
    json_key_string (out, &first, "message", r->message);
  json_key_number (out, &first, "line", m->line);
  json_key_number (out, &first, "length", m->length);
  json_key_string (out, &first, "material", trb_material_name (m->material));
  json_key_string (out, &first, "section", r->section[0] != '\0' ? r->section : m->section);
  json_key_string (out, &first, "method", trb_method_name (r->method));

  json_key (out, &first, "supports");
  g_string_append_c (out, '[');
  for (guint i = 0; i < m->supports->len; i++)
    {
      const TrbMemberSupport *s = &g_array_index (m->supports, TrbMemberSupport, i);
      gboolean f = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      g_string_append_c (out, '{');
      json_key_number (out, &f, "x", s->support.x);
      json_key_string (out, &f, "type", trb_support_type_name (s->support.type));
      g_string_append_c (out, '}');
    }
  g_string_append_c (out, ']');

  json_key (out, &first, "notes");
  g_string_append_c (out, '[');
  for (guint i = 0; i < r->notes->len; i++)
    {
      if (i > 0)
        g_string_append_c (out, ',');
      json_string (out, g_ptr_array_index (r->notes, i));
    }
  g_string_append_c (out, ']');

  json_key (out, &first, "analysed");
  g_string_append (out, r->analysed ? "true" : "false");
  if (r->analysed)
    {
      gboolean f = TRUE;

      json_key_number (out, &first, "E", r->E);
      json_key_number (out, &first, "I", r->I);
      json_key_number (out, &first, "self_weight", r->self_weight);

      json_key (out, &first, "cases");
      g_string_append_c (out, '{');
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          if (r->cases[c] == NULL)
            continue;
          json_key (out, &f, trb_load_case_name (c));
          json_result (out, r->cases[c], &r->case_ext[c]);
        }
      g_string_append_c (out, '}');

      json_key (out, &first, "patterns");
      g_string_append_c (out, '[');
      for (guint i = 0; i < r->patterns->len; i++)
        {
          if (i > 0)
            g_string_append_c (out, ',');
          json_string (out, g_array_index (r->patterns, TrbPattern, i).name);
        }
      g_string_append_c (out, ']');

      json_key_string (out, &first, "combination_set", trb_combo_set_title (r->strength.set));
      json_key (out, &first, "combinations");
      json_combinations (out, &r->strength);
      json_key (out, &first, "envelope");
      json_envelope (out, &r->strength);

      json_key (out, &first, "deflection");
      f = TRUE;
      g_string_append_c (out, '{');
      json_key (out, &f, "live");
      {
        gboolean g = TRUE;

        g_string_append_c (out, '{');
        json_key_number (out, &g, "limit",
                         trb_member_get_deflection_live (m, &project->settings));
        json_key (out, &g, "combinations");
        json_combinations (out, &r->live);
        json_key (out, &g, "envelope");
        json_envelope (out, &r->live);
        g_string_append_c (out, '}');
      }
      json_key (out, &f, "total");
      {
        gboolean g = TRUE;

        g_string_append_c (out, '{');
        json_key_number (out, &g, "limit",
                         trb_member_get_deflection_total (m, &project->settings));
        json_key (out, &g, "combinations");
        json_combinations (out, &r->total);
        json_key (out, &g, "envelope");
        json_envelope (out, &r->total);
        g_string_append_c (out, '}');
      }
      g_string_append_c (out, '}');
    }
  else
    {
      json_key (out, &first, "cases");
      g_string_append (out, "{}");
      json_key (out, &first, "combinations");
      g_string_append (out, "{}");
      json_key (out, &first, "envelope");
      g_string_append (out, "null");
    }

  json_key_number (out, &first, "ratio", r->ratio);
  json_key_string (out, &first, "governing", r->governing[0] != '\0' ? r->governing : NULL);
  json_key (out, &first, "checks");
  json_checks (out, r->checks);
  json_key (out, &first, "shortlist");
  g_string_append_c (out, '[');
  for (guint i = 0; i < r->shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, i);
      gboolean efirst = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      g_string_append_c (out, '{');
      json_key_string (out, &efirst, "section", e->section);
      json_key_number (out, &efirst, "weight", e->weight);
      json_key_number (out, &efirst, "ratio", e->ratio);
      json_key_string (out, &efirst, "governing", e->governing);
      g_string_append_c (out, '}');
    }
  g_string_append (out, "]}");
}

static void
write_json (GString          *out,
            const TrbProject *project,
            GPtrArray        *results)
{
  gboolean first = TRUE;

  g_string_append_c (out, '{');
  json_key_number (out, &first, "format", 1);
  json_key_string (out, &first, "program", "trabeate-cli " PACKAGE_VERSION);
  json_key_string (out, &first, "units", "SI");
  json_key_string (out, &first, "unit_note", UNIT_NOTE);
  json_key_string (out, &first, "caution", CAUTION_1 " " CAUTION_2 " " CAUTION_3);
  json_key_string (out, &first, "file", project->name);
  json_key (out, &first, "members");
  g_string_append_c (out, '[');
  for (guint i = 0; i < results->len; i++)
    {
      if (i > 0)
        g_string_append_c (out, ',');
      json_member (out, project, g_ptr_array_index (results, i));
    }
  g_string_append (out, "]}\n");
}

/* ---- the table ----------------------------------------------------------------------- */

static char *
fmt (double        v,
     TrbDimension  dim,
     TrbUnitSystem units)
{
  return trb_units_format (v, dim, units);
}

static char *
fmt_defl (double        v,
          TrbUnitSystem units)
{
  return trb_units_format_small_length (v, units);
}

static const char *
status_text (TrbStatus status)
{
  switch (status)
    {
    case TRB_STATUS_PASS:
      return "passes";
    case TRB_STATUS_FAIL:
      return "FAILS";
    case TRB_STATUS_UNSTABLE:
      return "UNSTABLE";
    case TRB_STATUS_UNSUPPORTED:
      return "UNSUPPORTED";
    case TRB_STATUS_NOT_DESIGNED:
      return "not designed";
    case TRB_STATUS_ERROR:
      return "ERROR";
    default:
      g_return_val_if_reached ("?");
    }
}

static void
table_reactions (GString               *out,
                 const TrbMemberResult *r)
{
  TrbUnitSystem u = r->units;
  const TrbSupport *s;
  guint n;
  gboolean fixed = FALSE;

  s = trb_beam_get_supports (r->beam, &n);
  for (guint i = 0; i < n; i++)
    fixed |= s[i].type == TRB_SUPPORT_FIXED;

  g_string_append_printf (out, "  Reactions, up +%s\n",
                          fixed ? " (M: moments, counter-clockwise +)" : "");
  g_string_append (out, "    case ");
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *x = fmt (s[i].x, TRB_DIM_LENGTH, u);
      g_autofree char *head = g_strdup_printf ("at %s", x);

      g_string_append_printf (out, " %14s", head);
    }
  g_string_append_c (out, '\n');

  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      const TrbReaction *re;
      guint nr;

      if (r->cases[c] == NULL)
        continue;
      re = trb_beam_result_get_reactions (r->cases[c], &nr);
      g_string_append_printf (out, "    %-4s ", trb_load_case_name (c));
      for (guint i = 0; i < nr; i++)
        {
          g_autofree char *f = fmt (re[i].force, TRB_DIM_FORCE, u);

          g_string_append_printf (out, " %14s", f);
        }
      g_string_append_c (out, '\n');
      if (fixed)
        {
          g_string_append (out, "      M  ");
          for (guint i = 0; i < nr; i++)
            {
              g_autofree char *mo = s[i].type == TRB_SUPPORT_FIXED
                                    ? fmt (re[i].moment, TRB_DIM_MOMENT, u) : g_strdup ("");

              g_string_append_printf (out, " %14s", mo);
            }
          g_string_append_c (out, '\n');
        }
    }
}

static void
table_line (GString       *out,
            const char    *label,
            const char    *value,
            double         x,
            const char    *by,
            TrbUnitSystem  u)
{
  g_autofree char *xs = fmt (x, TRB_DIM_LENGTH, u);

  g_string_append_printf (out, "    %-16s %14s  at %-12s %s\n", label, value, xs, by);
}

static void
table_envelope (GString                 *out,
                const TrbComboSetResult *set,
                gboolean                 forces,
                const char              *title,
                TrbUnitSystem            u)
{
  const TrbEnvelope *env = &set->envelope;
  const TrbBeamExtremes *e = &env->ext;

  if (env->empty)
    return;
  g_string_append_printf (out, "  %s\n", title);
  if (forces)
    {
      g_autofree char *vmax = fmt (e->V_max, TRB_DIM_FORCE, u);
      g_autofree char *vmin = fmt (e->V_min, TRB_DIM_FORCE, u);
      g_autofree char *mmax = fmt (e->M_max, TRB_DIM_MOMENT, u);
      g_autofree char *mmin = fmt (e->M_min, TRB_DIM_MOMENT, u);

      table_line (out, "shear max", vmax, e->V_max_x, env->V_max_by, u);
      table_line (out, "shear min", vmin, e->V_min_x, env->V_min_by, u);
      table_line (out, "moment max (+)", mmax, e->M_max_x, env->M_max_by, u);
      table_line (out, "moment min (-)", mmin, e->M_min_x, env->M_min_by, u);
    }
  {
    g_autofree char *dd = fmt_defl (e->defl_down, u);
    g_autofree char *du = fmt_defl (e->defl_up, u);

    /* below a nanometre is rounding, not a movement worth a line */
    table_line (out, "deflection down", dd, e->defl_down_x,
                e->defl_down > 1e-9 ? env->defl_down_by : "", u);
    if (e->defl_up > 1e-9)
      table_line (out, "deflection up", du, e->defl_up_x, env->defl_up_by, u);
  }
}

static char *
fmt_check_value (double        v,
                 TrbDimension  dim,
                 TrbUnitSystem u)
{
  if (!isfinite (v))
    return g_strdup ("-");
  if (dim == TRB_DIM_LENGTH)
    return fmt_defl (v, u);
  return fmt (v, dim, u);
}

static void
table_checks (GString               *out,
              const TrbMemberResult *r)
{
  if (r->checks->len == 0)
    return;
  g_string_append (out, "  Checks                 demand       capacity   ratio  governing\n");
  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, i);

      if (isnan (ck->ratio))
        {
          g_string_append_printf (out, "    %-18s %s: %s\n", ck->name, ck->clause, ck->detail);
          continue;
        }
      {
        g_autofree char *d = fmt_check_value (ck->demand, ck->dimension, r->units);
        g_autofree char *c = fmt_check_value (ck->capacity, ck->dimension, r->units);

        g_string_append_printf (out, "    %-18s %11s %14s  %6.3f  %s\n", ck->name, d, c,
                                ck->ratio, ck->combination);
        g_string_append_printf (out, "    %-18s %s%s%s\n", "", ck->clause,
                                ck->detail[0] != '\0' ? "; " : "", ck->detail);
      }
    }
}

static void
table_shortlist (GString               *out,
                 const TrbMemberResult *r)
{
  if (r->shortlist->len == 0)
    return;
  g_string_append (out, "  Passing sections, lightest first\n");
  for (guint i = 0; i < r->shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, i);
      g_autofree char *w = fmt (e->weight, TRB_DIM_WEIGHT_PER_LENGTH, r->units);

      g_string_append_printf (out, "    %-12s %12s  ratio %.3f  %s\n", e->section, w, e->ratio,
                              e->governing);
    }
}

static void
table_member (GString               *out,
              const TrbProject      *project,
              const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  TrbUnitSystem u = r->units;
  g_autofree char *len = fmt (m->length, TRB_DIM_LENGTH, u);

  g_autofree char *section = NULL;

  /* A sized member shows what was chosen; a checked one shows what the engineer named. */
  if (trb_member_is_auto (m) && r->section[0] != '\0' && g_strcmp0 (r->section, "auto") != 0)
    section = g_strdup_printf ("%s (sized from \"auto\")", r->section);
  else
    section = g_strdup (m->section);
  g_string_append_printf (out, "\nMember %s (line %d): %s, section %s, length %s, method %s\n",
                          m->id, m->line, trb_material_name (m->material), section, len,
                          trb_method_name (r->method));
  g_string_append (out, "  Supports:");
  for (guint i = 0; i < m->supports->len; i++)
    {
      const TrbMemberSupport *s = &g_array_index (m->supports, TrbMemberSupport, i);
      g_autofree char *x = fmt (s->support.x, TRB_DIM_LENGTH, u);

      g_string_append_printf (out, "%s %s at %s", i > 0 ? ";" : "",
                              trb_support_type_name (s->support.type), x);
    }
  g_string_append (out, m->supports->len == 0 ? " none\n" : "\n");
  g_string_append_printf (out, "  Status: %s%s%s\n", status_text (r->status),
                          r->message != NULL ? " - " : "", r->message != NULL ? r->message : "");
  if (r->analysed && r->self_weight > 0)
    {
      g_autofree char *sw = fmt (r->self_weight, TRB_DIM_WEIGHT_PER_LENGTH, u);

      g_string_append_printf (out, "  Self-weight %s included in D\n", sw);
    }
  for (guint i = 0; i < r->notes->len; i++)
    g_string_append_printf (out, "  Note: %s\n", (const char *) g_ptr_array_index (r->notes, i));

  if (!r->analysed)
    return;

  table_reactions (out, r);
  {
    g_autofree char *title =
      g_strdup_printf ("Envelope of the %s%s", trb_combo_set_title (r->strength.set),
                       r->patterns->len > 0 ? ", with live-load patterns" : "");
    table_envelope (out, &r->strength, TRUE, title, u);
  }
  table_envelope (out, &r->live, FALSE, "Live-load deflection (service)", u);
  table_envelope (out, &r->total, FALSE, "Total-load deflection (service)", u);
  table_checks (out, r);
  table_shortlist (out, r);
}

/* One line a member: what the engineer looks for first. */
static void
table_summary (GString   *out,
               GPtrArray *results)
{
  g_string_append (out, "\nSummary\n  mark       section          status         ratio  governing\n");
  for (guint i = 0; i < results->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results, i);
      g_autofree char *ratio = isnan (r->ratio) ? g_strdup ("-")
                                                : g_strdup_printf ("%.3f", r->ratio);

      g_string_append_printf (out, "  %-10s %-16s %-13s %6s  %s\n", r->member->id,
                              r->section[0] != '\0' ? r->section : r->member->section,
                              status_text (r->status), ratio,
                              r->governing[0] != '\0' ? r->governing : "-");
    }
}

static void
write_table (GString          *out,
             const TrbProject *project,
             GPtrArray        *results)
{
  guint counts[TRB_STATUS_ERROR + 1] = { 0 };

  g_string_append_printf (out, "Trabeate %s: check of %s\n", PACKAGE_VERSION, project->name);
  g_string_append (out, "CAUTION: " CAUTION_1 "\n" CAUTION_2 "\n");
  for (guint i = 0; i < results->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results, i);

      counts[r->status]++;
      table_member (out, project, r);
    }
  g_string_append_printf (out, "\n%u member%s: %u pass, %u fail, %u unstable, %u unsupported, "
                          "%u not designed, %u error\n",
                          results->len, results->len == 1 ? "" : "s",
                          counts[TRB_STATUS_PASS], counts[TRB_STATUS_FAIL],
                          counts[TRB_STATUS_UNSTABLE], counts[TRB_STATUS_UNSUPPORTED],
                          counts[TRB_STATUS_NOT_DESIGNED], counts[TRB_STATUS_ERROR]);
  table_summary (out, results);
  g_string_append (out, "CAUTION: " CAUTION_1 "\n" CAUTION_2 "\n" CAUTION_3 "\n");
}

/* ---- commands ------------------------------------------------------------------------ */

static int
usage_error (const char *message)
{
  fprintf (stderr, "trabeate-cli: %s\n\n%s", message, usage_text);
  return EXIT_USAGE;
}

static int
cmd_check (int    argc,
           char **argv)
{
  gboolean json = FALSE;
  g_autofree char *member_id = NULL;
  const GOptionEntry entries[] = {
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, "Write JSON (SI units)", NULL },
    { "member", 0, 0, G_OPTION_ARG_STRING, &member_id, "Only the member with this id", "ID" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new ("FILE");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(GPtrArray) results = NULL;
  g_autoptr(GString) out = g_string_new (NULL);
  int status = EXIT_PASS;

  g_option_context_set_help_enabled (context, FALSE);
  g_option_context_add_main_entries (context, entries, NULL);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return usage_error (error->message);
  /* argv[0] is "check" */
  if (argc != 2)
    return usage_error (argc < 2 ? "check needs a FILE" : "check takes one FILE");
  if (argv[1][0] == '-' && argv[1][1] != '\0')
    return usage_error ("unknown option");

  project = trb_project_load_file (argv[1], &error);
  if (project == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return EXIT_USAGE;
    }

  results = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_member_result_free);
  if (member_id != NULL)
    {
      const TrbMember *m = trb_project_find_member (project, member_id);

      if (m == NULL)
        {
          fprintf (stderr, "%s: no member with id \"%s\"\n", project->name, member_id);
          return EXIT_USAGE;
        }
      g_ptr_array_add (results, trb_solve_member (project, m));
    }
  else
    {
      for (guint i = 0; i < project->members->len; i++)
        g_ptr_array_add (results, trb_solve_member (project,
                                                    g_ptr_array_index (project->members, i)));
    }

  for (guint i = 0; i < results->len; i++)
    if (((TrbMemberResult *) g_ptr_array_index (results, i))->status != TRB_STATUS_PASS)
      status = EXIT_FAILS;

  if (json)
    write_json (out, project, results);
  else
    write_table (out, project, results);
  fwrite (out->str, 1, out->len, stdout);
  if (fflush (stdout) != 0)
    return EXIT_USAGE;
  return status;
}

int
main (int    argc,
      char **argv)
{
  setlocale (LC_ALL, "");

  if (argc < 2)
    return usage_error ("no command given");
  if (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0 ||
      strcmp (argv[1], "help") == 0)
    {
      fputs (usage_text, stdout);
      return EXIT_PASS;
    }
  if (strcmp (argv[1], "--version") == 0)
    {
      printf ("trabeate-cli %s\n", PACKAGE_VERSION);
      return EXIT_PASS;
    }
  if (strcmp (argv[1], "report") == 0)
    return trb_cli_report (argc - 1, argv + 1);
  if (strcmp (argv[1], "plan") == 0)
    return trb_cli_plan (argc - 1, argv + 1);
  if (strcmp (argv[1], "check") == 0)
    {
      for (int i = 2; i < argc; i++)
        if (strcmp (argv[i], "--help") == 0 || strcmp (argv[i], "-h") == 0)
          {
            fputs (usage_text, stdout);
            return EXIT_PASS;
          }
      return cmd_check (argc - 1, argv + 1);
    }
  {
    g_autofree char *msg = g_strdup_printf ("unknown command \"%s\"", argv[1]);

    return usage_error (msg);
  }
}
