/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib.h>
#include <glib/gi18n.h>
#include <locale.h>
#include <math.h>
#include <stdio.h>
#include <string.h>
#ifdef __GLIBC__
#include <malloc.h>
#endif

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

/* The cautions of trb-cautions.h are translated where they are printed, by their text.
 * xgettext reads no macro, so that text is spelled out once more here for the template;
 * tests/test-i18n.py checks that the two stay the same. */
static const char *const caution_msgids[] G_GNUC_UNUSED = {
  N_("Results are for design or review by a licensed engineer; local building codes govern."),
  N_("Not checked: connections and hangers, web yielding and crippling, supporting members, "
     "notches and holes, lateral loads and diaphragms, bracing design, ponding, vibration, "
     "torsion, fire, durability, construction loads."),
  N_("The inputs (spans, loads, grades, moisture, bracing) are the user's."),
  N_("Columns and walls are shown with the loads they receive; they are not designed."),
};

/* The names the design checks give themselves in core (trb_check_set), translated where a
 * table shows them; JSON and CSV keep them as they are. Listed here for the template, like
 * the cautions; tests/test-i18n.py checks the list against core. */
static const char *const check_msgids[] G_GNUC_UNUSED = {
  N_("Bearing"),
  N_("Flexure"),
  N_("Live deflection"),
  N_("Not checked"),
  N_("Section modulus"),
  N_("Shear"),
  N_("Total deflection"),
  N_("Web shear"),
};

/* The titles of the sets of combinations (trb_combo_set_title), likewise. */
static const char *const combo_set_msgids[] G_GNUC_UNUSED = {
  N_("LRFD combinations, ASCE 7-16 §2.3.1"),
  N_("ASD combinations, ASCE 7-16 §2.4.1"),
  N_("Service loads for allowable stress (unfactored)"),
  N_("Live-load deflection, IBC 2021 Table 1604.3"),
  N_("Total-load deflection, IBC 2021 Table 1604.3"),
};

/* The project file's words for roles, materials and supports (trb-model.c), which the table
 * shows in the reader's language; listed here for the template. */
static const char *const word_msgids[] G_GNUC_UNUSED = {
  NC_("role", "girder"),
  NC_("role", "beam"),
  NC_("role", "joist"),
  NC_("material", "steel"),
  NC_("material", "wood"),
  NC_("material", "custom"),
  NC_("support", "pin"),
  NC_("support", "roller"),
  NC_("support", "fixed"),
  NC_("status", "pass"),
  NC_("status", "fail"),
  NC_("status", "unstable"),
  NC_("status", "unsupported"),
  NC_("status", "not-designed"),
  NC_("status", "error"),
};

/* A name from core in the reader's language, when the catalog has it. */
static const char *
core_text (const char *s)
{
  return s != NULL && s[0] != '\0' ? _(s) : s;
}

static const char *
role_text (TrbFrameRole role)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "role", trb_role_name (role));
}

static const char *
material_text (TrbMaterial material)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "material", trb_material_name (material));
}

static const char *
support_text (TrbSupportType type)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "support", trb_support_type_name (type));
}

/* The schedule's short word for a status (the table's sentence-like one is status_text). */
static const char *
status_word (TrbStatus status)
{
  return g_dpgettext2 (GETTEXT_PACKAGE, "status", trb_status_name (status));
}

static const char *const usage_text_msgid =
  /* Translators: the command's help. Keep the command names, the options (--json, --csv,
   * --member, --no-shortcuts, --help, --version) and the exit codes as they are; lines of 80
   * columns or fewer fit every terminal. */
  N_("Usage:\n"
     "  trabeate-cli check FILE [--json] [--member ID]\n"
     "  trabeate-cli schedule FILE [--csv] [--member ID]\n"
     "  trabeate-cli --help | --version\n"
     "\n"
     "Commands:\n"
     "  check      analyse every member of a project file (floors through their load\n"
     "             takedown) and print the results, column and wall loads and totals\n"
     "  schedule   the member schedule and the column load table\n"
     "\n"
     "Options:\n"
     "  --json         check: write the results as JSON (SI units) instead of a table\n"
     "  --csv          schedule: write CSV (the project's units, named in the header)\n"
     "  --member ID    only the member with this id and the members resting on it\n"
     "  --no-shortcuts solve every member in full, without the cache of identical members\n"
     "                 and the sizing bounds (for verification: the results are the same)\n"
     "\n"
     "Exit status: 0 every member passes; 1 some member fails, is unstable or unsupported,\n"
     "or is not designed; 2 bad input or usage.\n");

static const char *
usage_text (void)
{
  return _(usage_text_msgid);
}

/* printf pads by bytes; a field of translated text is padded by characters instead, so that
 * "viga" and "sección" line up alike. The width to give printf for s to take width columns. */
static int
pad (const char *s,
     int         width)
{
  return width + (int) strlen (s) - (int) g_utf8_strlen (s, -1);
}

/* The cautions at the head of a table (not the inputs) and at its end (all three). */
static void
append_cautions (GString  *out,
                 gboolean  inputs)
{
  g_string_append_printf (out, "%s %s\n%s\n", _("CAUTION:"), _(CAUTION_1), _(CAUTION_2));
  if (inputs)
    g_string_append_printf (out, "%s\n", _(CAUTION_3));
}

/* Output goes to standard output as it is made, a piece at a time, so that a floor of ten
 * thousand members never sits in memory as text. */
static gboolean write_failed;

static void
flush_out (GString *out)
{
  if (out->len > 0 && fwrite (out->str, 1, out->len, stdout) != out->len)
    write_failed = TRUE;
  g_string_truncate (out, 0);
}

static void
maybe_flush (GString *out)
{
  if (out->len >= 64 * 1024)
    flush_out (out);
}

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
json_support (GString          *out,
              const TrbSupport *s)
{
  gboolean f = TRUE;

  g_string_append_c (out, '{');
  json_key_number (out, &f, "x", s->x);
  json_key_string (out, &f, "type", trb_support_type_name (s->type));
  g_string_append_c (out, '}');
}

static void
json_cases (GString      *out,
            const double *force)
{
  gboolean f = TRUE;

  g_string_append_c (out, '{');
  for (guint c = 0; c < TRB_N_CASES; c++)
    json_key_number (out, &f, trb_load_case_name (c), force[c]);
  g_string_append_c (out, '}');
}

static const char *
bearing_on (const TrbMemberBearing *b)
{
  if (b->own)
    return "support";
  switch (b->kind)
    {
    case TRB_BEARING_COLUMN:
      return "column";
    case TRB_BEARING_WALL:
      return "wall";
    case TRB_BEARING_MEMBER:
    default:
      return "member";
    }
}

static void
json_reduction (GString               *out,
                const TrbReductionUse *use)
{
  gboolean f = TRUE;

  if (!use->applies)
    {
      g_string_append (out, "null");
      return;
    }
  g_string_append_c (out, '{');
  json_key_number (out, &f, "area", use->area);
  json_key_number (out, &f, "k_ll", use->k_ll);
  json_key_number (out, &f, "floors", use->floors);
  json_key_number (out, &f, "factor", use->factor);
  json_key_string (out, &f, "rule", trb_live_rule_describe (use->rule));
  json_key_number (out, &f, "reducible", use->reducible);
  json_key_number (out, &f, "not_reducible", use->other);
  g_string_append_c (out, '}');
}

/* What a floor member adds: where it is, what each support rests on and what it hands down
 * there, and the live load reduction it used. */
static void
json_floor_member (GString               *out,
                   gboolean              *first,
                   const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  gboolean f = TRUE;

  json_key_string (out, first, "floor", m->floor->name);
  json_key_string (out, first, "role", trb_role_name (m->role));
  json_key (out, first, "plan");
  g_string_append_c (out, '{');
  json_key_number (out, &f, "x1", m->start.x);
  json_key_number (out, &f, "y1", m->start.y);
  json_key_number (out, &f, "x2", m->end.x);
  json_key_number (out, &f, "y2", m->end.y);
  g_string_append_c (out, '}');

  json_key (out, first, "bearings");
  g_string_append_c (out, '[');
  for (guint i = 0; r->bearings != NULL && i < r->bearings->len; i++)
    {
      const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, i);
      gboolean g = TRUE;

      if (i > 0)
        g_string_append_c (out, ',');
      g_string_append_c (out, '{');
      json_key_number (out, &g, "x", b->x);
      json_key_string (out, &g, "on", bearing_on (b));
      json_key_string (out, &g, "id", b->id);
      json_key_number (out, &g, "position", b->position);
      json_key (out, &g, "forces");
      json_cases (out, b->force);
      g_string_append_c (out, '}');
    }
  g_string_append_c (out, ']');
  json_key (out, first, "live_reduction");
  json_reduction (out, &r->reduction);
  json_key_string (out, first, "plan_note", r->plan_note);
}

static void
json_member (GString               *out,
             const TrbProject      *project,
             const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  gboolean first = TRUE;

  /* every entry's extremes are printed */
  trb_member_result_complete (r);
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
  if (r->supports != NULL)
    {
      /* as analysed: a floor member's come from what it rests on */
      for (guint i = 0; i < r->supports->len; i++)
        {
          const TrbSupport *s = &g_array_index (r->supports, TrbSupport, i);

          if (i > 0)
            g_string_append_c (out, ',');
          json_support (out, s);
        }
    }
  else if (r->bearings != NULL)
    {
      for (guint i = 0; i < r->bearings->len; i++)
        {
          const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, i);
          TrbSupport s = { b->x, TRB_SUPPORT_PIN };

          if (i > 0)
            g_string_append_c (out, ',');
          json_support (out, &s);
        }
    }
  else
    {
      for (guint i = 0; i < m->supports->len; i++)
        {
          if (i > 0)
            g_string_append_c (out, ',');
          json_support (out, &g_array_index (m->supports, TrbMemberSupport, i).support);
        }
    }
  g_string_append_c (out, ']');

  if (m->floor != NULL)
    json_floor_member (out, &first, r);

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

/* Which members a command shows: all, or one and those resting on it, transitively. */
typedef struct
{
  const TrbProjectResult *pr;
  gboolean               *shown;     /* per entry of pr->members */
  GHashTable             *columns;   /* const TrbColumn * shown (NULL: all) */
  GHashTable             *walls;     /* const TrbWall * shown (NULL: all) */
} Selection;

static void
selection_clear (Selection *sel)
{
  g_clear_pointer (&sel->shown, g_free);
  g_clear_pointer (&sel->columns, g_hash_table_unref);
  g_clear_pointer (&sel->walls, g_hash_table_unref);
}

static gboolean
column_shown (const Selection *sel,
              const TrbColumn *column)
{
  return sel->columns == NULL || g_hash_table_contains (sel->columns, column);
}

static gboolean
wall_shown (const Selection *sel,
            const TrbWall   *wall)
{
  return sel->walls == NULL || g_hash_table_contains (sel->walls, wall);
}

/* FALSE when there is no such member. With an id: that member, every member resting on it
 * and on those, and the columns and walls the shown members rest on. */
static gboolean
selection_init (Selection              *sel,
                const TrbProjectResult *pr,
                const char             *member_id)
{
  guint n = pr->members->len;
  g_autoptr(GHashTable) index = NULL;
  gboolean found = FALSE;
  gboolean grew = TRUE;

  sel->pr = pr;
  sel->shown = g_new0 (gboolean, n + 1);
  sel->columns = sel->walls = NULL;
  if (member_id == NULL)
    {
      for (guint i = 0; i < n; i++)
        sel->shown[i] = TRUE;
      return TRUE;
    }

  index = g_hash_table_new (g_str_hash, g_str_equal);
  for (guint i = 0; i < n; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      g_hash_table_insert (index, r->member->id, GUINT_TO_POINTER (i + 1));
      if (strcmp (r->member->id, member_id) == 0)
        sel->shown[i] = found = TRUE;
    }
  if (!found)
    return FALSE;

  /* until nothing more rests on what is shown */
  while (grew)
    {
      grew = FALSE;
      for (guint i = 0; i < n; i++)
        {
          const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

          if (sel->shown[i] || r->bearings == NULL)
            continue;
          for (guint k = 0; k < r->bearings->len; k++)
            {
              const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, k);
              guint j;

              if (b->own || b->kind != TRB_BEARING_MEMBER)
                continue;
              j = GPOINTER_TO_UINT (g_hash_table_lookup (index, b->id));
              if (j > 0 && sel->shown[j - 1])
                {
                  sel->shown[i] = grew = TRUE;
                  break;
                }
            }
        }
    }

  sel->columns = g_hash_table_new (NULL, NULL);
  sel->walls = g_hash_table_new (NULL, NULL);
  for (guint i = 0; i < n; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      if (!sel->shown[i] || r->bearings == NULL)
        continue;
      for (guint k = 0; k < r->bearings->len; k++)
        {
          const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, k);

          if (b->own)
            continue;
          if (b->kind == TRB_BEARING_COLUMN)
            g_hash_table_add (sel->columns,
                              trb_floor_find_column (r->member->floor, b->id));
          else if (b->kind == TRB_BEARING_WALL)
            g_hash_table_add (sel->walls, trb_floor_find_wall (r->member->floor, b->id));
        }
    }
  return TRUE;
}

static void
json_floors (GString         *out,
             gboolean        *first,
             const Selection *sel)
{
  const TrbProjectResult *pr = sel->pr;
  gboolean any = FALSE;
  double totals[4][TRB_N_CASES] = { { 0 } };

  json_key (out, first, "columns");
  g_string_append_c (out, '[');
  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      for (guint i = 0; i < fr->columns->len; i++)
        {
          const TrbColumnResult *c = &g_array_index (fr->columns, TrbColumnResult, i);
          gboolean g = TRUE;

          if (!column_shown (sel, c->column))
            continue;
          if (any)
            g_string_append_c (out, ',');
          any = TRUE;
          g_string_append_c (out, '{');
          json_key_string (out, &g, "id", c->column->id);
          json_key_string (out, &g, "floor", c->floor->name);
          json_key_number (out, &g, "line", c->column->line);
          json_key_number (out, &g, "x", c->column->at.x);
          json_key_number (out, &g, "y", c->column->at.y);
          json_key_string (out, &g, "section", c->column->section);
          json_key (out, &g, "cases");
          json_cases (out, c->force);
          json_key (out, &g, "reduction");
          json_reduction (out, &c->reduction);
          json_key_number (out, &g, "live_reduced", c->live_reduced);
          g_string_append_c (out, '}');
          maybe_flush (out);
        }
    }
  g_string_append_c (out, ']');

  any = FALSE;
  json_key (out, first, "walls");
  g_string_append_c (out, '[');
  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      for (guint i = 0; i < fr->walls->len; i++)
        {
          const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);
          gboolean g = TRUE, h = TRUE;

          if (!wall_shown (sel, w->wall))
            continue;
          if (any)
            g_string_append_c (out, ',');
          any = TRUE;
          g_string_append_c (out, '{');
          json_key_string (out, &g, "id", w->wall->id);
          json_key_string (out, &g, "floor", w->floor->name);
          json_key_number (out, &g, "line", w->wall->line);
          json_key_string (out, &g, "material", w->wall->material);
          json_key (out, &g, "cases");
          json_cases (out, w->force);
          json_key (out, &g, "loads");
          g_string_append_c (out, '{');
          for (guint c = 0; c < TRB_N_CASES; c++)
            {
              json_key (out, &h, trb_load_case_name (c));
              g_string_append_c (out, '[');
              for (guint k = 0; k < w->loads[c]->len; k++)
                {
                  const TrbLoad *l = &g_array_index (w->loads[c], TrbLoad, k);
                  gboolean e = TRUE;

                  if (k > 0)
                    g_string_append_c (out, ',');
                  g_string_append_c (out, '{');
                  json_key_number (out, &e, "at", l->a);
                  json_key_number (out, &e, "force", l->w1);
                  g_string_append_c (out, '}');
                }
              g_string_append_c (out, ']');
            }
          g_string_append (out, "}}");
          maybe_flush (out);
        }
    }
  g_string_append_c (out, ']');

  any = FALSE;
  json_key (out, first, "unassigned");
  g_string_append_c (out, '[');
  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      for (guint i = 0; i < fr->unassigned->len; i++)
        {
          const TrbUnassignedLoad *u = &g_array_index (fr->unassigned, TrbUnassignedLoad, i);
          gboolean g = TRUE;

          if (any)
            g_string_append_c (out, ',');
          any = TRUE;
          g_string_append_c (out, '{');
          json_key_string (out, &g, "floor", fr->floor->name);
          json_key_string (out, &g, "kind", u->point != NULL ? "point" : "line");
          json_key_number (out, &g, "line", u->point != NULL ? u->point->line : u->line->line);
          json_key_string (out, &g, "label", u->point != NULL ? u->point->label
                                                                : u->line->label);
          json_key_string (out, &g, "case",
                           trb_load_case_name (u->point != NULL ? u->point->lcase
                                                                : u->line->lcase));
          json_key_number (out, &g, "length", u->length);
          json_key_number (out, &g, "force", u->force);
          g_string_append_c (out, '}');
        }
    }
  g_string_append_c (out, ']');

  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          totals[0][c] += fr->applied[c];
          totals[1][c] += fr->reactions[c];
          totals[2][c] += fr->not_carried[c];
          totals[3][c] += fr->supports[c];
        }
    }
  json_key (out, first, "totals");
  g_string_append_c (out, '{');
  {
    gboolean g = TRUE;

    for (guint c = 0; c < TRB_N_CASES && pr->floors->len > 0; c++)
      {
        gboolean h = TRUE;

        json_key (out, &g, trb_load_case_name (c));
        g_string_append_c (out, '{');
        json_key_number (out, &h, "applied", totals[0][c]);
        json_key_number (out, &h, "reactions", totals[1][c]);
        json_key_number (out, &h, "not_carried", totals[2][c]);
        json_key_number (out, &h, "supports", totals[3][c]);
        g_string_append_c (out, '}');
      }
  }
  g_string_append_c (out, '}');
}

static void
write_json (GString         *out,
            const Selection *sel)
{
  const TrbProjectResult *pr = sel->pr;
  const TrbProject *project = pr->project;
  gboolean first = TRUE;
  gboolean any = FALSE;

  g_string_append_c (out, '{');
  json_key_number (out, &first, "format", 1);
  json_key_string (out, &first, "program", "trabeate-cli " PACKAGE_VERSION);
  json_key_string (out, &first, "units", "SI");
  json_key_string (out, &first, "unit_note", UNIT_NOTE);
  json_key_string (out, &first, "caution", CAUTION_1 " " CAUTION_2 " " CAUTION_3);
  json_key_string (out, &first, "file", project->name);
  json_key (out, &first, "members");
  g_string_append_c (out, '[');
  for (guint i = 0; i < pr->members->len; i++)
    {
      if (!sel->shown[i])
        continue;
      if (any)
        g_string_append_c (out, ',');
      any = TRUE;
      json_member (out, project, g_ptr_array_index (pr->members, i));
      maybe_flush (out);
    }
  g_string_append_c (out, ']');
  json_floors (out, &first, sel);
  g_string_append (out, "}\n");
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
    /* Translators: a member's status in the table; the capitals mark what needs attention. */
    case TRB_STATUS_PASS:
      return _("passes");
    case TRB_STATUS_FAIL:
      return _("FAILS");
    case TRB_STATUS_UNSTABLE:
      return _("UNSTABLE");
    case TRB_STATUS_UNSUPPORTED:
      return _("UNSUPPORTED");
    case TRB_STATUS_NOT_DESIGNED:
      return _("not designed");
    case TRB_STATUS_ERROR:
      return _("ERROR");
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

  g_string_append_printf (out, "  %s\n",
                          fixed ? _("Reactions, up + (M: moments, counter-clockwise +)")
                                : _("Reactions, up +"));
  /* Translators: the heading of the column of load cases (D, L, ...); at most 4 letters */
  g_string_append_printf (out, "    %-*s ", pad (_("case"), 4), _("case"));
  for (guint i = 0; i < n; i++)
    {
      g_autofree char *x = fmt (s[i].x, TRB_DIM_LENGTH, u);
      /* Translators: a column of reactions: the support at this distance from the left end */
      g_autofree char *head = g_strdup_printf (_("at %s"), x);

      g_string_append_printf (out, " %*s", pad (head, 14), head);
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

  /* Translators: "shear max   7.48 kip  at 0'-0"  ASD 2: D + L": where along the member */
  g_string_append_printf (out, "    %-*s %14s  %s %-12s %s\n", pad (label, 16), label, value,
                          C_("position", "at"), xs, by);
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

      table_line (out, _("shear max"), vmax, e->V_max_x, env->V_max_by, u);
      table_line (out, _("shear min"), vmin, e->V_min_x, env->V_min_by, u);
      table_line (out, _("moment max (+)"), mmax, e->M_max_x, env->M_max_by, u);
      table_line (out, _("moment min (-)"), mmin, e->M_min_x, env->M_min_by, u);
    }
  {
    g_autofree char *dd = fmt_defl (e->defl_down, u);
    g_autofree char *du = fmt_defl (e->defl_up, u);

    /* below a nanometre is rounding, not a movement worth a line */
    table_line (out, _("deflection down"), dd, e->defl_down_x,
                e->defl_down > 1e-9 ? env->defl_down_by : "", u);
    if (e->defl_up > 1e-9)
      table_line (out, _("deflection up"), du, e->defl_up_x, env->defl_up_by, u);
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
  g_string_append_printf (out, "  %-*s %*s %*s %*s  %s\n", pad (_("Checks"), 16), _("Checks"),
                          pad (_("demand"), 12), _("demand"), pad (_("capacity"), 14),
                          _("capacity"), pad (_("ratio"), 7), _("ratio"), _("governing"));
  for (guint i = 0; i < r->checks->len; i++)
    {
      const TrbCheck *ck = &g_array_index (r->checks, TrbCheck, i);
      const char *name = core_text (ck->name);

      if (isnan (ck->ratio))
        {
          g_string_append_printf (out, "    %-*s %s: %s\n", pad (name, 18), name, ck->clause,
                                  ck->detail);
          continue;
        }
      {
        g_autofree char *d = fmt_check_value (ck->demand, ck->dimension, r->units);
        g_autofree char *c = fmt_check_value (ck->capacity, ck->dimension, r->units);

        g_string_append_printf (out, "    %-*s %11s %14s  %6.3f  %s\n", pad (name, 18), name, d,
                                c, ck->ratio, ck->combination);
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
  g_string_append_printf (out, "  %s\n", _("Passing sections, lightest first"));
  for (guint i = 0; i < r->shortlist->len; i++)
    {
      const TrbShortlistEntry *e = &g_array_index (r->shortlist, TrbShortlistEntry, i);
      g_autofree char *w = fmt (e->weight, TRB_DIM_WEIGHT_PER_LENGTH, r->units);

      g_string_append_printf (out, "    %-12s %12s  %s %.3f  %s\n", e->section, w, _("ratio"),
                              e->ratio, core_text (e->governing));
    }
}

static char *
fmt_point (double        x,
           double        y,
           TrbUnitSystem u)
{
  g_autofree char *xs = fmt (x, TRB_DIM_LENGTH, u);
  g_autofree char *ys = fmt (y, TRB_DIM_LENGTH, u);

  return g_strdup_printf ("(%s, %s)", xs, ys);
}

/* A_T in the unit ASCE 7 states it in (ft^2), or m^2. */
static double
area_display (double        area,
              TrbUnitSystem u)
{
  return u == TRB_UNIT_SYSTEM_SI ? area : area / (TRB_FT * TRB_FT);
}

static const char *
area_unit (TrbUnitSystem u)
{
  return u == TRB_UNIT_SYSTEM_SI ? "m²" : "ft²";
}

static char *
reduction_text (const TrbReductionUse *use,
                TrbUnitSystem          u)
{
  g_autofree char *area = g_strdup_printf ("%.0f %s", area_display (use->area, u),
                                           area_unit (u));

  /* Translators: live load reduction, ASCE 7-16 §4.7: the tributary area A_T, the element
   * factor K_LL, the floors supported and the reduction factor; keep A_T and K_LL */
  return g_strdup_printf (ngettext ("A_T %s, K_LL %.0f, %u floor: factor %.3f (%s)",
                                    "A_T %s, K_LL %.0f, %u floors: factor %.3f (%s)",
                                    use->floors),
                          area, use->k_ll, use->floors, use->factor,
                          trb_live_rule_describe (use->rule));
}

/* Where a floor member lies, what each support rests on and hands down, and its live load
 * reduction. */
static void
table_floor_member (GString               *out,
                    const TrbMemberResult *r)
{
  const TrbMember *m = r->member;
  TrbUnitSystem u = r->units;
  g_autofree char *from = fmt_point (m->start.x, m->start.y, u);
  g_autofree char *to = fmt_point (m->end.x, m->end.y, u);

  /* Translators: "Floor Mezzanine: joist from (0'-0", 0'-0") to (0'-0", 16'-0")" */
  g_string_append_printf (out, _("  Floor %s: %s from %s to %s\n"), m->floor->name,
                          role_text (m->role), from, to);
  g_string_append_printf (out, "  %s\n",
                          _("Supports (reactions handed down, live load unreduced):"));
  if (r->bearings == NULL || r->bearings->len == 0)
    g_string_append_printf (out, "    %s\n", _("none"));
  for (guint i = 0; r->bearings != NULL && i < r->bearings->len; i++)
    {
      const TrbMemberBearing *b = &g_array_index (r->bearings, TrbMemberBearing, i);
      g_autofree char *x = fmt (b->x, TRB_DIM_LENGTH, u);
      g_autofree char *on = NULL;

      if (b->own)
        on = g_strdup (_("its own support"));
      else if (b->kind == TRB_BEARING_MEMBER)
        {
          g_autofree char *pos = fmt (b->position, TRB_DIM_LENGTH, u);

          /* Translators: "member G1 at 10'-0"": the member it rests on, and where along it */
          on = g_strdup_printf (_("member %s at %s"), b->id, pos);
        }
      else if (b->kind == TRB_BEARING_WALL)
        {
          g_autofree char *pos = fmt (b->position, TRB_DIM_LENGTH, u);

          /* Translators: "wall W1 at 10'-0"": the wall it rests on, and where along it */
          on = g_strdup_printf (_("wall %s at %s"), b->id, pos);
        }
      else
        on = g_strdup_printf (_("column %s"), b->id);
      /* Translators: "at 16'-0"     on column A2": a support of the member, and what it
       * rests on; the first %s is padded to 10 columns */
      g_string_append_printf (out, _("    at %-10s on %s"), x, on);
      if (r->analysed)
        for (guint c = 0; c < TRB_N_CASES; c++)
          {
            g_autofree char *f = NULL;

            if (b->force[c] == 0)
              continue;
            f = fmt (b->force[c], TRB_DIM_FORCE, u);
            g_string_append_printf (out, "; %s %s", trb_load_case_name (c), f);
          }
      g_string_append_c (out, '\n');
    }
  if (r->reduction.applies)
    {
      g_autofree char *text = reduction_text (&r->reduction, u);

      g_string_append_printf (out, _("  Live load reduction: %s\n"), text);
    }
  if (r->plan_note != NULL)
    g_string_append_printf (out, _("  Note: %s\n"), r->plan_note);
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

  /* the envelopes' extremes are printed */
  trb_member_result_complete (r);

  /* A sized member shows what was chosen; a checked one shows what the engineer named. */
  if (trb_member_is_auto (m) && r->section[0] != '\0' && g_strcmp0 (r->section, "auto") != 0)
    /* Translators: keep "auto": it is what the project file says */
    section = g_strdup_printf (_("%s (sized from \"auto\")"), r->section);
  else
    section = g_strdup (m->section);
  /* Translators: "Member M1 (line 11): steel, section W12X26, length 22'-0", method asd";
   * the line is the line of the project file; keep asd, lrfd and allowable */
  g_string_append_printf (out, _("\nMember %s (line %d): %s, section %s, length %s, method %s\n"),
                          m->id, m->line, material_text (m->material), section, len,
                          trb_method_name (r->method));
  if (m->floor != NULL)
    table_floor_member (out, r);
  else
    {
      g_string_append_printf (out, "  %s", _("Supports:"));
      for (guint i = 0; i < m->supports->len; i++)
        {
          const TrbMemberSupport *s = &g_array_index (m->supports, TrbMemberSupport, i);
          g_autofree char *x = fmt (s->support.x, TRB_DIM_LENGTH, u);

          /* Translators: "pin at 0'-0"": a support of a beam and where it is */
          g_string_append_printf (out, "%s ", i > 0 ? ";" : "");
          g_string_append_printf (out, _("%s at %s"), support_text (s->support.type), x);
        }
      if (m->supports->len == 0)
        g_string_append_printf (out, " %s", _("none"));
      g_string_append_c (out, '\n');
    }
  g_string_append_printf (out, "  %s %s%s%s\n", _("Status:"), status_text (r->status),
                          r->message != NULL ? " - " : "", r->message != NULL ? r->message : "");
  if (r->analysed && r->self_weight > 0)
    {
      g_autofree char *sw = fmt (r->self_weight, TRB_DIM_WEIGHT_PER_LENGTH, u);

      /* Translators: D is the dead load case; keep it */
      g_string_append_printf (out, _("  Self-weight %s included in D\n"), sw);
    }
  for (guint i = 0; i < r->notes->len; i++)
    g_string_append_printf (out, _("  Note: %s\n"),
                            (const char *) g_ptr_array_index (r->notes, i));

  if (!r->analysed)
    return;

  table_reactions (out, r);
  {
    /* Translators: "Envelope of the ASD combinations, ASCE 7-16 §2.4.1"; %s is the title
     * of the set of combinations, translated on its own */
    g_autofree char *title =
      g_strdup_printf (r->patterns->len > 0 ? _("Envelope of the %s, with live-load patterns")
                                            : _("Envelope of the %s"),
                       core_text (trb_combo_set_title (r->strength.set)));
    table_envelope (out, &r->strength, TRUE, title, u);
  }
  table_envelope (out, &r->live, FALSE, _("Live-load deflection (service)"), u);
  table_envelope (out, &r->total, FALSE, _("Total-load deflection (service)"), u);
  table_checks (out, r);
  table_shortlist (out, r);
}

/* One line a member: what the engineer looks for first. */
static void
table_summary (GString         *out,
               const Selection *sel)
{
  GPtrArray *results = sel->pr->members;

  g_string_append_printf (out, "\n%s\n  %-*s %-*s %-*s %*s  %s\n", _("Summary"),
                          pad (_("mark"), 10), _("mark"), pad (_("section"), 16), _("section"),
                          pad (_("status"), 13), _("status"), pad (_("ratio"), 6), _("ratio"),
                          _("governing"));
  for (guint i = 0; i < results->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (results, i);
      g_autofree char *ratio = isnan (r->ratio) ? g_strdup ("-")
                                                : g_strdup_printf ("%.3f", r->ratio);

      const char *status = status_text (r->status);

      if (!sel->shown[i])
        continue;
      g_string_append_printf (out, "  %-10s %-16s %-*s %6s  %s\n", r->member->id,
                              r->section[0] != '\0' ? r->section : r->member->section,
                              pad (status, 13), status, ratio,
                              r->governing[0] != '\0' ? core_text (r->governing) : "-");
      maybe_flush (out);
    }
}

/* The cases any of these forces carry, so that a table has no empty columns. */
static void
cases_present (const Selection *sel,
               gboolean        *present)
{
  const TrbProjectResult *pr = sel->pr;

  for (guint c = 0; c < TRB_N_CASES; c++)
    present[c] = c == TRB_CASE_D || c == TRB_CASE_L;
  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      for (guint c = 0; c < TRB_N_CASES && sel->shown[i]; c++)
        present[c] |= r->cases[c] != NULL;
    }
  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      for (guint c = 0; c < TRB_N_CASES; c++)
        present[c] |= fr->applied[c] != 0;
    }
}

static void
table_floors (GString         *out,
              const Selection *sel,
              TrbUnitSystem    u)
{
  const TrbProjectResult *pr = sel->pr;
  gboolean present[TRB_N_CASES];

  if (pr->floors->len == 0)
    return;
  cases_present (sel, present);

  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);
      const char *name = fr->floor->name != NULL ? fr->floor->name : "";

      if (fr->error != NULL)
        g_string_append_printf (out, _("\nFloor %s could not be framed: %s\n"), name,
                                fr->error);

      if (fr->columns->len > 0)
        {
          g_string_append_c (out, '\n');
          g_string_append_printf (out, _("Column loads, floor %s (down +; live load unreduced, "
                                         "then reduced)"), name);
          g_string_append_printf (out, "\n  %-*s %-*s", pad (_("column"), 8), _("column"),
                                  pad (C_("position", "at"), 22), C_("position", "at"));
          for (guint c = 0; c < TRB_N_CASES; c++)
            if (present[c])
              g_string_append_printf (out, " %12s", trb_load_case_name (c));
          /* Translators: the column's live load after the reduction; keep the L (live load) */
          g_string_append_printf (out, " %*s  %s\n", pad (_("L reduced"), 12), _("L reduced"),
                                  _("reduction"));
          for (guint i = 0; i < fr->columns->len; i++)
            {
              const TrbColumnResult *c = &g_array_index (fr->columns, TrbColumnResult, i);
              g_autofree char *at = fmt_point (c->column->at.x, c->column->at.y, u);
              g_autofree char *lr = fmt (c->live_reduced, TRB_DIM_FORCE, u);
              g_autofree char *red = c->reduction.applies
                                     ? reduction_text (&c->reduction, u) : g_strdup (_("none"));

              if (!column_shown (sel, c->column))
                continue;
              g_string_append_printf (out, "  %-8s %-22s", c->column->id, at);
              for (guint k = 0; k < TRB_N_CASES; k++)
                if (present[k])
                  {
                    g_autofree char *v = fmt (c->force[k], TRB_DIM_FORCE, u);

                    g_string_append_printf (out, " %12s", v);
                  }
              g_string_append_printf (out, " %12s  %s\n", lr, red);
              maybe_flush (out);
            }
        }

      if (fr->walls->len > 0)
        {
          g_string_append_c (out, '\n');
          g_string_append_printf (out, _("Wall loads, floor %s (totals, down +)"), name);
          g_string_append_printf (out, "\n  %-*s", pad (_("wall"), 8), _("wall"));
          for (guint c = 0; c < TRB_N_CASES; c++)
            if (present[c])
              g_string_append_printf (out, " %12s", trb_load_case_name (c));
          g_string_append_printf (out, "  %s\n", _("loads"));
          for (guint i = 0; i < fr->walls->len; i++)
            {
              const TrbWallResult *w = &g_array_index (fr->walls, TrbWallResult, i);
              guint n = 0;

              if (!wall_shown (sel, w->wall))
                continue;
              g_string_append_printf (out, "  %-8s", w->wall->id);
              for (guint c = 0; c < TRB_N_CASES; c++)
                {
                  n = MAX (n, w->loads[c]->len);
                  if (present[c])
                    {
                      g_autofree char *v = fmt (w->force[c], TRB_DIM_FORCE, u);

                      g_string_append_printf (out, " %12s", v);
                    }
                }
              g_string_append (out, "  ");
              g_string_append_printf (out, ngettext ("%u point along it\n",
                                                     "%u points along it\n", n), n);
            }
        }

      g_string_append_c (out, '\n');
      g_string_append_printf (out, _("Totals, floor %s (down +)"), name);
      g_string_append_printf (out, "\n  %-*s %*s %*s %*s\n", pad (_("case"), 5), _("case"),
                              pad (_("applied"), 14), _("applied"),
                              pad (_("reactions"), 14), _("reactions"),
                              pad (_("not carried"), 14), _("not carried"));
      for (guint c = 0; c < TRB_N_CASES; c++)
        {
          g_autofree char *a = fmt (fr->applied[c], TRB_DIM_FORCE, u);
          g_autofree char *r = fmt (fr->reactions[c], TRB_DIM_FORCE, u);
          g_autofree char *n = fmt (fr->not_carried[c], TRB_DIM_FORCE, u);

          if (!present[c])
            continue;
          g_string_append_printf (out, "  %-5s %14s %14s %14s\n", trb_load_case_name (c), a, r,
                                  n);
        }
      for (guint i = 0; i < fr->unassigned->len; i++)
        {
          const TrbUnassignedLoad *ul = &g_array_index (fr->unassigned, TrbUnassignedLoad, i);
          g_autofree char *force = fmt (ul->force, TRB_DIM_FORCE, u);

          if (ul->point != NULL)
            {
              g_autofree char *at = fmt_point (ul->point->at.x, ul->point->at.y, u);

              /* Translators: "point load (line 40, L, guard rail) of 1.00 kip at (x, y)": the
               * line of the project file, the load case and the load's label */
              g_string_append_printf (out, _("WARNING: point load (line %d, %s%s%s) of %s at %s "
                                             "lies on no member: nothing carries it\n"),
                                      ul->point->line, trb_load_case_name (ul->point->lcase),
                                      ul->point->label != NULL ? ", " : "",
                                      ul->point->label != NULL ? ul->point->label : "",
                                      force, at);
            }
          else
            {
              g_autofree char *len = fmt (ul->length, TRB_DIM_LENGTH, u);

              /* Translators: "3'-0" of the line load (line 41, D, wall) lies on no member:
               * 1.20 kip that nothing carries" */
              g_string_append_printf (out, _("WARNING: %s of the line load (line %d, %s%s%s) "
                                             "lies on no member: %s that nothing carries\n"),
                                      len,
                                      ul->line->line, trb_load_case_name (ul->line->lcase),
                                      ul->line->label != NULL ? ", " : "",
                                      ul->line->label != NULL ? ul->line->label : "", force);
            }
        }
    }
  g_string_append_printf (out, "\n%s\n", _(TRB_CAUTION_COLUMNS));
}

static void
write_table (GString         *out,
             const Selection *sel)
{
  const TrbProjectResult *pr = sel->pr;
  const TrbProject *project = pr->project;
  guint counts[TRB_STATUS_ERROR + 1] = { 0 };
  guint shown = 0;

  /* Translators: "Trabeate 0.1.0: check of demo-floor.trabeate" */
  g_string_append_printf (out, _("Trabeate %s: check of %s\n"), PACKAGE_VERSION, project->name);
  append_cautions (out, FALSE);
  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);

      if (!sel->shown[i])
        continue;
      shown++;
      counts[r->status]++;
      table_member (out, project, r);
      maybe_flush (out);
    }
  g_string_append_c (out, '\n');
  /* Translators: the count of members, then how many have each status */
  g_string_append_printf (out, ngettext ("%u member: %u pass, %u fail, %u unstable, "
                                         "%u unsupported, %u not designed, %u error\n",
                                         "%u members: %u pass, %u fail, %u unstable, "
                                         "%u unsupported, %u not designed, %u error\n", shown),
                          shown, counts[TRB_STATUS_PASS], counts[TRB_STATUS_FAIL],
                          counts[TRB_STATUS_UNSTABLE], counts[TRB_STATUS_UNSUPPORTED],
                          counts[TRB_STATUS_NOT_DESIGNED], counts[TRB_STATUS_ERROR]);
  table_summary (out, sel);
  table_floors (out, sel, project->settings.units);
  append_cautions (out, TRUE);
}

/* ---- the schedule -------------------------------------------------------------------- */

/* The longest distance between neighbouring supports; for a lone fixed support, the length
 * it reaches out. */
static double
member_span (const TrbMemberResult *r)
{
  double span = 0;
  const TrbSupport *s;
  guint n;

  if (r->supports == NULL || r->supports->len == 0)
    return NAN;
  s = (const TrbSupport *) r->supports->data;
  n = r->supports->len;
  if (n == 1)
    return MAX (s[0].x, r->member->length - s[0].x);
  for (guint i = 0; i + 1 < n; i++)
    span = MAX (span, fabs (s[i + 1].x - s[i].x));
  return span;
}

/* A value in the project's display unit, rounded as the tables round it; "" for NAN. */
static char *
sched_value (double        v,
             TrbDimension  dim,
             TrbUnitSystem u)
{
  double d;

  if (!isfinite (v))
    return g_strdup ("");
  d = trb_units_to_display (v, dim, u);
  return trb_units_format_with_unit (d, NULL, trb_units_display_decimals (d, dim, u));
}

static void
csv_field (GString    *out,
           const char *s)
{
  if (s == NULL)
    s = "";
  if (strpbrk (s, ",\"\n\r") == NULL)
    {
      g_string_append (out, s);
      return;
    }
  g_string_append_c (out, '"');
  for (const char *p = s; *p != '\0'; p++)
    {
      if (*p == '"')
        g_string_append_c (out, '"');
      g_string_append_c (out, *p);
    }
  g_string_append_c (out, '"');
}

/* Writes one row: CSV, or columns padded to widths for the table. */
static void
row_out (GString     *out,
         gboolean     csv,
         GPtrArray   *cells,
         const int   *widths)
{
  for (guint i = 0; i < cells->len; i++)
    {
      const char *c = g_ptr_array_index (cells, i);

      if (csv)
        {
          if (i > 0)
            g_string_append_c (out, ',');
          csv_field (out, c);
        }
      else
        g_string_append_printf (out, "%s%-*s", i > 0 ? "  " : "", widths[i], c);
    }
  if (!csv)
    while (out->len > 0 && out->str[out->len - 1] == ' ')
      g_string_truncate (out, out->len - 1);
  g_string_append_c (out, '\n');
}

static void
table_out (GString   *out,
           gboolean   csv,
           GPtrArray *rows)
{
  g_autofree int *widths = NULL;
  guint n_cols = 0;

  for (guint i = 0; i < rows->len; i++)
    n_cols = MAX (n_cols, ((GPtrArray *) g_ptr_array_index (rows, i))->len);
  widths = g_new0 (int, n_cols + 1);
  for (guint i = 0; i < rows->len && !csv; i++)
    {
      GPtrArray *cells = g_ptr_array_index (rows, i);

      for (guint k = 0; k < cells->len; k++)
        widths[k] = MAX (widths[k], (int) g_utf8_strlen (g_ptr_array_index (cells, k), -1));
    }
  for (guint i = 0; i < rows->len; i++)
    {
      row_out (out, csv, g_ptr_array_index (rows, i), widths);
      maybe_flush (out);
    }
}

static GPtrArray *
row_new (void)
{
  return g_ptr_array_new_with_free_func (g_free);
}

/* A heading or a word of the schedule: as it is in CSV, which other programs read, and in the
 * reader's language in the table. */
static char *
sched_text (gboolean    csv,
            const char *msgid)
{
  return g_strdup (csv ? msgid : _(msgid));
}

/* A heading with the unit in it, "length (ft)". */
static char *
sched_head (gboolean    csv,
            const char *msgid,
            const char *unit)
{
  return g_strdup_printf (csv ? msgid : _(msgid), unit);
}

static void
write_schedule (GString         *out,
                const Selection *sel,
                gboolean         csv)
{
  const TrbProjectResult *pr = sel->pr;
  const TrbProject *project = pr->project;
  TrbUnitSystem u = project->settings.units;
  const char *lu = trb_units_display_unit (TRB_DIM_LENGTH, u);
  const char *fu = trb_units_display_unit (TRB_DIM_FORCE, u);
  g_autoptr(GPtrArray) rows = g_ptr_array_new_with_free_func ((GDestroyNotify) g_ptr_array_unref);
  gboolean present[TRB_N_CASES];
  gboolean any_columns = FALSE;
  GPtrArray *row;

  cases_present (sel, present);

  if (!csv)
    {
      /* Translators: "Trabeate 0.1.0: schedule of demo-floor.trabeate" */
      g_string_append_printf (out, _("Trabeate %s: schedule of %s\n"), PACKAGE_VERSION,
                              project->name);
      append_cautions (out, FALSE);
      g_string_append_printf (out, "\n%s\n", _("Member schedule (end reactions up +, as "
                                                "analysed: live load after the member's own "
                                                "reduction)"));
    }

  row = row_new ();
  g_ptr_array_add (row, sched_text (csv, N_("mark")));
  g_ptr_array_add (row, sched_text (csv, N_("floor")));
  g_ptr_array_add (row, sched_text (csv, N_("role")));
  g_ptr_array_add (row, sched_text (csv, N_("material")));
  g_ptr_array_add (row, sched_text (csv, N_("section")));
  /* Translators: a heading of the schedule; %s is the unit, "ft" or "m" */
  g_ptr_array_add (row, sched_head (csv, N_("length (%s)"), lu));
  /* Translators: a heading of the schedule; %s is the unit, "ft" or "m" */
  g_ptr_array_add (row, sched_head (csv, N_("span (%s)"), lu));
  g_ptr_array_add (row, sched_text (csv, N_("status")));
  g_ptr_array_add (row, sched_text (csv, N_("ratio")));
  g_ptr_array_add (row, sched_text (csv, N_("governing")));
  for (guint end = 0; end < 2; end++)
    for (guint c = 0; c < TRB_N_CASES; c++)
      if (present[c])
        g_ptr_array_add (row, g_strdup_printf ("R%s %s (%s)", end == 0 ? "1" : "2",
                                               trb_load_case_name (c), fu));
  /* Translators: a heading of the schedule: the live load reduction factor */
  g_ptr_array_add (row, sched_text (csv, N_("live factor")));
  g_ptr_array_add (rows, row);

  for (guint i = 0; i < pr->members->len; i++)
    {
      const TrbMemberResult *r = g_ptr_array_index (pr->members, i);
      const TrbMember *m = r->member;

      if (!sel->shown[i])
        continue;
      row = row_new ();
      g_ptr_array_add (row, g_strdup (m->id));
      g_ptr_array_add (row, g_strdup (m->floor != NULL && m->floor->name != NULL
                                      ? m->floor->name : ""));
      if (csv)
        g_ptr_array_add (row, g_strdup (m->floor != NULL ? trb_role_name (m->role) : "beam"));
      else
        g_ptr_array_add (row, g_strdup (m->floor != NULL ? role_text (m->role)
                                                         : C_("role", "beam")));
      g_ptr_array_add (row, g_strdup (csv ? trb_material_name (m->material)
                                          : material_text (m->material)));
      g_ptr_array_add (row, g_strdup (r->section[0] != '\0' ? r->section : m->section));
      g_ptr_array_add (row, sched_value (m->length, TRB_DIM_LENGTH, u));
      g_ptr_array_add (row, sched_value (member_span (r), TRB_DIM_LENGTH, u));
      g_ptr_array_add (row, g_strdup (csv ? trb_status_name (r->status)
                                          : status_word (r->status)));
      g_ptr_array_add (row, isnan (r->ratio) ? g_strdup ("") : g_strdup_printf ("%.3f",
                                                                               r->ratio));
      g_ptr_array_add (row, g_strdup (csv ? r->governing : core_text (r->governing)));
      for (guint end = 0; end < 2; end++)
        for (guint c = 0; c < TRB_N_CASES; c++)
          {
            const TrbReaction *re;
            guint n;

            if (!present[c])
              continue;
            if (!r->analysed || r->cases[c] == NULL)
              {
                g_ptr_array_add (row, g_strdup (r->analysed ? "0" : ""));
                continue;
              }
            re = trb_beam_result_get_reactions (r->cases[c], &n);
            g_ptr_array_add (row, sched_value (re[end == 0 ? 0 : n - 1].force, TRB_DIM_FORCE,
                                               u));
          }
      g_ptr_array_add (row, r->reduction.applies ? g_strdup_printf ("%.3f",
                                                                    r->reduction.factor)
                                                 : g_strdup (""));
      g_ptr_array_add (rows, row);
    }
  table_out (out, csv, rows);
  g_ptr_array_set_size (rows, 0);

  for (guint f = 0; f < pr->floors->len; f++)
    {
      const TrbFloorResult *fr = g_ptr_array_index (pr->floors, f);

      for (guint i = 0; i < fr->columns->len; i++)
        {
          const TrbColumnResult *c = &g_array_index (fr->columns, TrbColumnResult, i);

          if (!column_shown (sel, c->column))
            continue;
          if (!any_columns)
            {
              row = row_new ();
              g_ptr_array_add (row, sched_text (csv, N_("column")));
              g_ptr_array_add (row, sched_text (csv, N_("floor")));
              g_ptr_array_add (row, g_strdup_printf ("x (%s)", lu));
              g_ptr_array_add (row, g_strdup_printf ("y (%s)", lu));
              g_ptr_array_add (row, sched_text (csv, N_("section")));
              for (guint k = 0; k < TRB_N_CASES; k++)
                if (present[k])
                  g_ptr_array_add (row, g_strdup_printf ("%s (%s)", trb_load_case_name (k),
                                                         fu));
              /* Translators: the column's live load after the reduction; %s is the unit */
              g_ptr_array_add (row, sched_head (csv, N_("L reduced (%s)"), fu));
              g_ptr_array_add (row, g_strdup_printf ("A_T (%s)", u == TRB_UNIT_SYSTEM_SI
                                                                  ? "m^2" : "ft^2"));
              g_ptr_array_add (row, sched_text (csv, N_("live factor")));
              g_ptr_array_add (rows, row);
              any_columns = TRUE;
            }
          row = row_new ();
          g_ptr_array_add (row, g_strdup (c->column->id));
          g_ptr_array_add (row, g_strdup (c->floor->name != NULL ? c->floor->name : ""));
          g_ptr_array_add (row, sched_value (c->column->at.x, TRB_DIM_LENGTH, u));
          g_ptr_array_add (row, sched_value (c->column->at.y, TRB_DIM_LENGTH, u));
          g_ptr_array_add (row, g_strdup (c->column->section != NULL ? c->column->section : ""));
          for (guint k = 0; k < TRB_N_CASES; k++)
            if (present[k])
              g_ptr_array_add (row, sched_value (c->force[k], TRB_DIM_FORCE, u));
          g_ptr_array_add (row, sched_value (c->live_reduced, TRB_DIM_FORCE, u));
          g_ptr_array_add (row, c->reduction.applies
                                ? g_strdup_printf ("%.1f", area_display (c->reduction.area, u))
                                : g_strdup (""));
          g_ptr_array_add (row, c->reduction.applies
                                ? g_strdup_printf ("%.3f", c->reduction.factor)
                                : g_strdup (""));
          g_ptr_array_add (rows, row);
        }
    }
  if (any_columns)
    {
      if (csv)
        g_string_append_c (out, '\n');
      else
        g_string_append_printf (out, "\n%s\n", _("Column loads (down +; live load unreduced, "
                                                  "then reduced)"));
      table_out (out, csv, rows);
    }
  if (!csv)
    {
      g_string_append_printf (out, "\n%s\n", _(TRB_CAUTION_COLUMNS));
      append_cautions (out, TRUE);
    }
}

/* ---- commands ------------------------------------------------------------------------ */

static int
usage_error (const char *message)
{
  fprintf (stderr, "trabeate-cli: %s\n\n%s", message, usage_text ());
  return EXIT_USAGE;
}

/* check and schedule: load, solve every member (floors through their takedown), write. */
static int
cmd_run (int       argc,
         char    **argv,
         gboolean  schedule)
{
  gboolean json = FALSE;
  gboolean csv = FALSE;
  gboolean no_shortcuts = FALSE;
  g_autofree char *member_id = NULL;
  const GOptionEntry check_entries[] = {
    /* The descriptions are never shown (the help is usage_text), so they are not marked. */
    { "json", 0, 0, G_OPTION_ARG_NONE, &json, "Write JSON (SI units)", NULL },
    { "member", 0, 0, G_OPTION_ARG_STRING, &member_id, "Only this member and what rests on it",
      "ID" },
    { "no-shortcuts", 0, 0, G_OPTION_ARG_NONE, &no_shortcuts, "Solve every member in full",
      NULL },
    { NULL }
  };
  const GOptionEntry schedule_entries[] = {
    { "csv", 0, 0, G_OPTION_ARG_NONE, &csv, "Write CSV", NULL },
    { "member", 0, 0, G_OPTION_ARG_STRING, &member_id, "Only this member and what rests on it",
      "ID" },
    { "no-shortcuts", 0, 0, G_OPTION_ARG_NONE, &no_shortcuts, "Solve every member in full",
      NULL },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new ("FILE");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(TrbProjectResult) pr = NULL;
  g_autoptr(GString) out = g_string_new (NULL);
  const char *command = schedule ? "schedule" : "check";
  TrbSolveOptions options;
  Selection sel = { NULL };
  int status = EXIT_PASS;

  g_option_context_set_help_enabled (context, FALSE);
  g_option_context_add_main_entries (context, schedule ? schedule_entries : check_entries,
                                     NULL);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return usage_error (error->message);
  /* argv[0] is the command */
  if (argc != 2)
    {
      /* Translators: %s is the command, check or schedule; keep FILE as in the help */
      g_autofree char *msg = g_strdup_printf (argc < 2 ? _("%s needs a FILE")
                                                       : _("%s takes one FILE"), command);

      return usage_error (msg);
    }
  if (argv[1][0] == '-' && argv[1][1] != '\0')
    return usage_error (_("unknown option"));

  project = trb_project_load_file (argv[1], &error);
  if (project == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return EXIT_USAGE;
    }
  if (member_id != NULL && trb_project_find_member (project, member_id) == NULL)
    {
      fprintf (stderr, _("%s: no member with id \"%s\"\n"), project->name, member_id);
      return EXIT_USAGE;
    }

#ifdef __GLIBC__
  /* The parser's tree is gone; glibc keeps the pages it freed (holes the solve's small
   * blocks fill unevenly): handing them back lowers the peak by some 0.7 MB on 10,000
   * members. */
  malloc_trim (0);
#endif
  trb_solve_options_init (&options);
  /* the check's table and JSON show each member's shortlist; the schedule does not */
  if (!schedule)
    options.shortlist_max = TRB_SHORTLIST_DEFAULT;
  if (no_shortcuts)
    options.cache = options.bounds = FALSE;
  pr = trb_solve_project_full (project, &options);
  selection_init (&sel, pr, member_id);

  for (guint i = 0; i < pr->members->len; i++)
    if (sel.shown[i] &&
        ((TrbMemberResult *) g_ptr_array_index (pr->members, i))->status != TRB_STATUS_PASS)
      status = EXIT_FAILS;

  if (schedule)
    write_schedule (out, &sel, csv);
  else if (json)
    write_json (out, &sel);
  else
    write_table (out, &sel);
  flush_out (out);
  selection_clear (&sel);
  if (write_failed || fflush (stdout) != 0)
    return EXIT_USAGE;
  return status;
}

/* Messages in the user's language, from the installed catalogs or from those of a build
 * (TRABEATE_LOCALEDIR=<build>/po, as the tests do). Numbers keep the point as their decimal
 * mark in every output, whatever the locale: JSON, CSV and the project file need it, and the
 * tables and reports print what the editor's entries and the file accept back (docs/
 * translating.md). */
static void
setup_locale (void)
{
  const char *dir = g_getenv ("TRABEATE_LOCALEDIR");

  setlocale (LC_ALL, "");
  setlocale (LC_NUMERIC, "C");
  bindtextdomain (GETTEXT_PACKAGE, dir != NULL && dir[0] != '\0' ? dir : LOCALEDIR);
  bind_textdomain_codeset (GETTEXT_PACKAGE, "UTF-8");
  textdomain (GETTEXT_PACKAGE);
}

int
main (int    argc,
      char **argv)
{
  setup_locale ();

  if (argc < 2)
    return usage_error (_("no command given"));
  if (strcmp (argv[1], "--help") == 0 || strcmp (argv[1], "-h") == 0 ||
      strcmp (argv[1], "help") == 0)
    {
      fputs (usage_text (), stdout);
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
  if (strcmp (argv[1], "check") == 0 || strcmp (argv[1], "schedule") == 0)
    {
      for (int i = 2; i < argc; i++)
        if (strcmp (argv[i], "--help") == 0 || strcmp (argv[i], "-h") == 0)
          {
            fputs (usage_text (), stdout);
            return EXIT_PASS;
          }
      return cmd_run (argc - 1, argv + 1, strcmp (argv[1], "schedule") == 0);
    }
  {
    g_autofree char *msg = g_strdup_printf (_("unknown command \"%s\""), argv[1]);

    return usage_error (msg);
  }
}
