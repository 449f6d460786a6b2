/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* Sizing: the section of a catalog or "auto" member, lightest first, with the bounds that
 * judge candidates without analysing them, the guess at the section chosen and the shortlist
 * made on demand. */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-design-allowable.h"
#include "trb-design-steel.h"
#include "trb-design-wood.h"
#include "trb-section.h"
#include "trb-solve.h"
#include "trb-solve-private.h"

/* Analyses and checks the member with one catalog section: its E (steel grade, or the wood
 * grade's E adjusted for service), its I and its self-weight. keep_sx (may be NULL) gets the
 * analysis's extremes over the spans and segments, for a reference. */
static TrbMemberResult *
solve_with_section_sx (const TrbProject  *project,
                       const TrbMember   *m,
                       const MemberInput *in,
                       const TrbSection  *section,
                       SpanExtremes      *keep_sx)
{
  const TrbSettings *s = &project->settings;
  TrbMemberResult *r = trb_solve_priv_member_result_new (project, m);
  const TrbWoodGrade *wood_grade = NULL;
  double self_weight = s->self_weight ? section->weight : 0;
  double E;
  SpanExtremes sx = { NULL };

  if (!s->self_weight)
    g_ptr_array_add (r->notes, g_strdup ("self-weight excluded by the project settings"));
  g_strlcpy (r->section, section->designation, sizeof r->section);

  if (m->material == TRB_MATERIAL_WOOD)
    {
      g_autofree char *why = NULL;
      TrbWoodOptions options;

      if (section->kind != TRB_SHAPE_SAWN && section->kind != TRB_SHAPE_GLULAM)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s is not a timber section",
                                     section->designation);
          return r;
        }
      wood_grade = trb_solve_priv_wood_grade_for (m, in, section, &why);
      if (wood_grade == NULL)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s", why);
          return r;
        }
      trb_solve_priv_wood_options_for (m, in, &options);
      E = trb_design_wood_adjusted_e (section, wood_grade, &options, TRB_WOOD_E);
    }
  else
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);

      if (section->kind == TRB_SHAPE_SAWN || section->kind == TRB_SHAPE_GLULAM)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "%s is a timber section: give "
                                     "material=\"wood\" with a species and grade",
                                     section->designation);
          return r;
        }
      if (grade == NULL)
        {
          trb_solve_priv_set_status (r, TRB_STATUS_ERROR, "unknown steel grade \"%s\"",
                                     trb_member_get_steel_grade (m, s));
          return r;
        }
      E = grade->E;
    }

  if (trb_solve_priv_analyse (project, in, E, section->Ix, self_weight, r, &sx, NULL))
    trb_solve_priv_design_checks (project, m, in, section, wood_grade, &sx, FALSE, r);
  if (keep_sx != NULL)
    *keep_sx = sx;
  else
    trb_solve_priv_span_extremes_clear (&sx);
  return r;
}

static TrbMemberResult *
solve_with_section (const TrbProject  *project,
                    const TrbMember   *m,
                    const MemberInput *in,
                    const TrbSection  *section)
{
  return solve_with_section_sx (project, m, in, section, NULL);
}

/* The catalog family a member is sized from. */
static gboolean
sizing_family (const TrbMember *m,
               TrbFamily       *family)
{
  if (m->material == TRB_MATERIAL_WOOD)
    {
      /* The glulam layups are graded like "24F-V4"; sawn grades are not. */
      *family = m->grade != NULL && g_ascii_isdigit (m->grade[0]) ? TRB_FAMILY_GLULAM
                                                                  : TRB_FAMILY_SAWN;
      return TRUE;
    }
  if (m->material == TRB_MATERIAL_STEEL)
    {
      *family = TRB_FAMILY_W;
      return TRUE;
    }
  return FALSE;
}

static gboolean
candidate_allowed (const TrbMember  *m,
                   const TrbSection *section)
{
  if (!isnan (m->max_depth) && section->d > m->max_depth * (1 + 1e-9))
    return FALSE;
  if (!isnan (m->min_depth) && section->d < m->min_depth * (1 - 1e-9))
    return FALSE;
  if (m->max_plies > 0 && section->plies > m->max_plies)
    return FALSE;
  return TRUE;
}

/* A designation is looked up in the project's own sections first, then in the catalog. */
const TrbSection *
trb_solve_priv_lookup_section (const TrbProject *project,
                               const char       *designation)
{
  const TrbSection *section = NULL;

  if (project->sections != NULL)
    section = trb_catalog_lookup (project->sections, designation);
  if (section == NULL)
    section = trb_catalog_lookup (trb_catalog_get_default (), designation);
  return section;
}

static int
compare_by_weight (gconstpointer a,
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

static int
compare_by_weight_ptr (gconstpointer a,
                       gconstpointer b)
{
  return compare_by_weight (*(const TrbSection * const *) a, *(const TrbSection * const *) b);
}

/* The candidates for sizing, lightest first: the allowed list when the member gives one,
 * else its family of the catalog; depth and ply limits applied. Taken one at a time
 * (candidates_next()): sizing mostly stops a fifth of the way through the catalog's family,
 * which is already lightest first and is then read in place, not copied. */
typedef struct
{
  const TrbMember  *m;
  const TrbSection *family;   /* the catalog's family in place, or NULL: list */
  guint             n_family;
  GPtrArray        *list;
  guint             next;
} Candidates;

static void
sizing_candidates (const TrbProject *project,
                   const TrbMember  *m,
                   Candidates       *cands)
{
  const TrbCatalog *catalogs[] = { trb_catalog_get_default (), project->sections };
  TrbFamily family;

  memset (cands, 0, sizeof *cands);
  cands->m = m;
  if (m->allowed != NULL)
    {
      cands->list = g_ptr_array_new ();
      for (guint i = 0; m->allowed[i] != NULL; i++)
        {
          const TrbSection *section = trb_solve_priv_lookup_section (project, m->allowed[i]);

          if (section != NULL && candidate_allowed (m, section))
            g_ptr_array_add (cands->list, (gpointer) section);
        }
      g_ptr_array_sort (cands->list, compare_by_weight_ptr);
      return;
    }
  if (!sizing_family (m, &family))
    {
      cands->list = g_ptr_array_new ();
      return;
    }
  if (project->sections == NULL)
    {
      cands->family = trb_catalog_get_family (catalogs[0], family, &cands->n_family);
      return;
    }
  /* The project's own sections of the family take part beside the catalog's. */
  cands->list = g_ptr_array_new ();
  for (guint c = 0; c < G_N_ELEMENTS (catalogs) && catalogs[c] != NULL; c++)
    {
      guint n;
      const TrbSection *sections = trb_catalog_get_family (catalogs[c], family, &n);

      for (guint i = 0; i < n; i++)
        if (candidate_allowed (m, &sections[i]))
          g_ptr_array_add (cands->list, (gpointer) &sections[i]);
    }
  g_ptr_array_sort (cands->list, compare_by_weight_ptr);
}

/* The next candidate, or NULL when there is none left. */
static const TrbSection *
candidates_next (Candidates *cands)
{
  if (cands->list != NULL)
    return cands->next < cands->list->len ? g_ptr_array_index (cands->list, cands->next++)
                                          : NULL;
  while (cands->next < cands->n_family)
    {
      const TrbSection *section = &cands->family[cands->next++];

      if (candidate_allowed (cands->m, section))
        return section;
    }
  return NULL;
}

static void
candidates_clear (Candidates *cands)
{
  g_clear_pointer (&cands->list, g_ptr_array_unref);
}

/* ---- sizing: bounds and the lean evaluation of candidates ---------------------------------
 *
 * Sizing checks sections lightest first. After one candidate is analysed in full (the
 * reference), the others are judged from it. The reactions, shears and moments do not depend
 * on E I (rigid supports, E I constant along the member), and the self-weight w enters case
 * D as a uniform load, so each combination's V and M move with w by f_D w times those of a
 * uniform unit load over the member; the deflections do the same after E I scales them:
 * live load deflection is the reference's times E I_ref / E I exactly. From these, each
 * combination's share in each check is bounded for each candidate (widened by a millionth
 * of the values and a billionth of the largest, far beyond the rounding of one analysis or
 * the other). A candidate whose bounds show a check above 1 certainly fails and is not
 * analysed (rejected). Any other is analysed with only the combinations whose bounds can reach
 * the largest share of some check (every combination of a timber strength check, whose shear
 * and bearing are not bounded), without text: each check then takes the same combination,
 * value and place as in the full analysis, so its status, ratio and governing check are
 * those of the full analysis, bit for bit. Whatever is out of the ordinary (an error, a check
 * not made, values too large to bound) goes to the full analysis. The shortcuts never change
 * a result: test-solve and test-floor compare them with sizing without them. */
#define BOUND_MARGIN 1e-6

typedef struct
{
  gboolean           ready;
  TrbMethod          method;
  gboolean           steel;        /* W shapes (flexure by segment, shear) */
  gboolean           wood;         /* sawn lumber or glulam (flexure by segment) */
  double             EI;           /* of the reference */
  double             self_weight;  /* N/m, of the reference */
  /* where the checks cut the member */
  guint              n_seg;        /* flexure segments (steel or timber points) */
  double            *seg;          /* n_seg + 1 points */
  guint              n_spans;      /* the deflection checks' spans */
  TrbDeflectionSpan *spans;
  /* a uniform load of 1 N/m over the member (each combination moves by f_D (w - w_ref)
   * times it): its least and largest V and M over the member and M on each segment, its
   * largest deflection on each span times E I, its M at the segments' quarter points */
  double             V_u_min, V_u_max, M_u_min, M_u_max;
  double            *M_u_seg;      /* least and largest on each segment: 2 n_seg */
  double            *D_u;          /* n_spans */
  double            *Mq_u;         /* 3 n_seg */
  gboolean          *free_end;     /* steel: Cb = 1 on each segment */
  /* the reference's strength entries: each extreme with the unit load's value where it is
   * (V on both sides, the unit load's V jumping at the supports) */
  guint              n_str;
  guint             *str_order;    /* the strength entries, largest moment first: the order
                                    * the flexure bounds are tried in, so that a failing
                                    * candidate fails on the first */
  double            *factors;      /* TRB_N_CASES each */
  double            *V;            /* V_max, V_u on its left and right, its side; the same of
                                    * V_min: 8 each */
  double            *M;            /* M_max, M_u there, M_min, M_u there: 4 each */
  double            *M_seg;        /* the same on each segment: 4 n_seg each */
  double            *Mq;           /* M at the quarter points, left and right: 6 n_seg each */
  /* its deflection entries: on each span the demand, and the signed deflection and the unit
   * load's deflection times E I where it is */
  guint              n_live, n_total;
  double            *d_live;       /* n_spans each */
  double            *d_total;      /* demand, signed deflection, unit there: 3 n_spans each */
  double            *fD_total;
  /* the largest of each, for margins that do not vanish at zero */
  double             M_scale, V_scale, D_scale;
  /* the largest lower bound of the live deflection checks for a candidate of E I_ref / E I
   * = 1 (each is that ratio times its own): most candidates that fail, fail there, and are
   * rejected from this one number; 0 when not checked */
  double             live_unit;
  double            *scratch;      /* room for the shares of a candidate */
  TrbBeam           *beam;         /* the member's beam (its supports; E = I = 1) */
  GPtrArray         *mem;          /* what the arrays above point into */
  double            *block;        /* ref_alloc()'s room left in the last of them */
  gsize              block_left;
} Reference;

static void
reference_clear (Reference *ref)
{
  g_clear_pointer (&ref->mem, g_ptr_array_unref);
  g_clear_pointer (&ref->spans, g_free);
  g_clear_pointer (&ref->beam, trb_beam_free);
  ref->block = NULL;
  ref->block_left = 0;
  ref->ready = FALSE;
}

/* n + 1 doubles, all 0, from blocks the reference keeps (a few allocations a member, not
 * one an array) */
#define REF_BLOCK 1024

static double *
ref_alloc (Reference *ref,
           gsize      n)
{
  double *p;

  if (n + 1 > ref->block_left)
    {
      gsize size = MAX (n + 1, REF_BLOCK);

      ref->block = g_new0 (double, size);
      ref->block_left = size;
      g_ptr_array_add (ref->mem, ref->block);
    }
  p = ref->block;
  ref->block += n + 1;
  ref->block_left -= n + 1;
  return p;
}

/* The design input the checks are given for the member, without section or combinations:
 * what the flexure segments and the deflection spans are cut from. */
static void
member_design_input (const TrbMember   *m,
                     const MemberInput *in,
                     const TrbBeam     *beam,
                     GArray            *brace_x,
                     TrbDesignInput    *input)
{
  memset (input, 0, sizeof *input);
  for (guint i = 0; i < m->braces->len; i++)
    g_array_append_val (brace_x, g_array_index (m->braces, TrbMemberBrace, i).x);
  input->length = in->length;
  input->supports = trb_beam_get_supports (beam, &input->n_supports);
  input->bracing = m->bracing;
  input->brace_x = (const double *) brace_x->data;
  input->n_braces = brace_x->len;
}

static double
abs_max (double a,
         double b)
{
  return MAX (fabs (a), fabs (b));
}

static double
value_at (const TrbBeamResult *r,
          double               x,
          TrbSide              side,
          int                  what)  /* 0 V, 1 M, 2 defl */
{
  TrbBeamQuantity q = what == 0 ? TRB_BEAM_V : what == 1 ? TRB_BEAM_M : TRB_BEAM_DEFL;
  double v;

  trb_beam_result_value (r, x, q, side == TRB_SIDE_LEFT ? &v : NULL,
                         side == TRB_SIDE_LEFT ? NULL : &v);
  return v;
}

/* value_at() on the left and on the right of x */
static void
values_both_sides (const TrbBeamResult *r,
                   double               x,
                   int                  what,
                   double              *left,
                   double              *right)
{
  trb_beam_result_value (r, x, what == 0 ? TRB_BEAM_V : what == 1 ? TRB_BEAM_M : TRB_BEAM_DEFL,
                         left, right);
}

/* M at the quarter points of each segment, where the steel check takes it for Cb: the left
 * and right values, 6 a segment */
static void
quarter_moments (const TrbBeamResult *result,
                 const double        *seg,
                 guint                n_seg,
                 double              *out)
{
  for (guint k = 0; k < n_seg; k++)
    {
      double a = seg[k], Lb = seg[k + 1] - seg[k];
      const double x[3] = { a + 0.25 * Lb, a + 0.50 * Lb, a + 0.75 * Lb };

      for (guint j = 0; j < 3; j++)
        values_both_sides (result, x[j], 1, &out[6 * k + 2 * j], &out[6 * k + 2 * j + 1]);
    }
}

/* The demand of a deflection check over each span of each entry of a set; with unit, also
 * the signed deflection there times E I and the unit load's: 3 a span. */
static void
span_demands (const TrbComboSetResult *set,
              const double            *ab,
              guint                    n_spans,
              const GArray            *known,
              const TrbBeamResult     *unit,
              double                   EI,
              double                  *d)
{
  g_autofree TrbBeamExtremes *own = g_new (TrbBeamExtremes, n_spans + 1);
  guint stride = unit != NULL ? 3 : 1;

  for (guint i = 0; i < set->entries->len; i++)
    {
      const TrbComboResult *c = &g_array_index (set->entries, TrbComboResult, i);
      const TrbBeamExtremes *ext = own;

      if (known != NULL)
        ext = &g_array_index (known, TrbBeamExtremes, i * n_spans);
      else
        trb_beam_result_extremes_intervals (c->result, ab, n_spans, NULL, own, NULL);
      for (guint j = 0; j < n_spans; j++)
        {
          double *o = d + (i * n_spans + j) * stride;
          double x, demand = trb_design_deflection_demand (&ext[j], &x);

          o[0] = demand;
          if (unit != NULL)
            {
              o[1] = value_at (c->result, x, TRB_SIDE_RIGHT, 2) * EI;
              o[2] = value_at (unit, x, TRB_SIDE_RIGHT, 2) * EI;
            }
        }
    }
}

/* Takes the reference from a candidate analysed (status pass or fail), with every entry of
 * its sets; sx (may be NULL) has their extremes over the segments and spans already. */
static gboolean
reference_init (Reference             *ref,
                const TrbProject      *project,
                const TrbMember       *m,
                const MemberInput     *in,
                const TrbMemberResult *r,
                const SpanExtremes    *sx)
{
  g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(TrbBeamResult) unit = NULL;
  g_autofree double *seg_ab = NULL;
  g_autofree double *span_ab = NULL;
  g_autofree TrbBeamExtremes *ext = NULL;
  TrbLoad load = { TRB_LOAD_UNIFORM, 0, in->length, 1.0, 1.0 };
  TrbDesignInput input;
  TrbBeamExtremes whole;
  guint n_pts;

  if (!r->analysed || r->beam == NULL)
    return FALSE;
  memset (ref, 0, sizeof *ref);
  ref->mem = g_ptr_array_new_with_free_func (g_free);
  ref->method = r->method;
  ref->steel = m->material == TRB_MATERIAL_STEEL && r->method != TRB_METHOD_ALLOWABLE;
  ref->wood = m->material == TRB_MATERIAL_WOOD && r->method == TRB_METHOD_ASD;
  ref->EI = r->E * r->I;
  ref->self_weight = r->self_weight;
  ref->beam = trb_beam_new (in->length, 1.0, 1.0, in->supports, in->n_supports, NULL);
  if (ref->beam == NULL)
    return FALSE;

  member_design_input (m, in, ref->beam, brace_x, &input);
  ref->seg = ref_alloc (ref, 2 + input.n_supports + input.n_braces);
  n_pts = ref->wood ? trb_design_wood_segment_points (&input, ref->seg)
                    : trb_design_steel_segment_points (&input, ref->seg);
  ref->n_seg = n_pts > 0 ? n_pts - 1 : 0;
  ref->spans = g_new0 (TrbDeflectionSpan, input.n_supports + 1);
  ref->n_spans = trb_design_deflection_spans (&input, ref->spans, input.n_supports + 1);
  seg_ab = g_new (double, 2 * ref->n_seg + 1);
  for (guint k = 0; k < ref->n_seg; k++)
    {
      seg_ab[2 * k] = ref->seg[k];
      seg_ab[2 * k + 1] = ref->seg[k + 1];
      if (!(seg_ab[2 * k] < seg_ab[2 * k + 1]))
        return FALSE;
    }
  span_ab = g_new (double, 2 * ref->n_spans + 1);
  for (guint j = 0; j < ref->n_spans; j++)
    {
      span_ab[2 * j] = ref->spans[j].a;
      span_ab[2 * j + 1] = ref->spans[j].b;
    }
  ext = g_new (TrbBeamExtremes, MAX (ref->n_seg, ref->n_spans) + 1);
  if (sx != NULL &&
      !(sx->n_seg == ref->n_seg && sx->n_spans == ref->n_spans && sx->strength != NULL &&
        sx->strength->len == r->strength.entries->len * ref->n_seg &&
        sx->live->len == r->live.entries->len * ref->n_spans &&
        sx->total->len == r->total.entries->len * ref->n_spans &&
        memcmp (sx->seg, ref->seg, (ref->n_seg + 1) * sizeof (double)) == 0))
    sx = NULL;

  /* the guess's, where it solved one */
  if (in->plan != NULL && in->plan->seed_unit != NULL)
    unit = trb_beam_result_restiffen (in->plan->seed_unit, r->beam);
  if (unit == NULL)
    unit = trb_beam_solve (r->beam, &load, 1, NULL);
  if (unit == NULL)
    return FALSE;
  trb_beam_result_extremes_intervals (unit, seg_ab, ref->n_seg, &whole, ext, NULL);
  ref->V_u_min = whole.V_min;
  ref->V_u_max = whole.V_max;
  ref->M_u_min = whole.M_min;
  ref->M_u_max = whole.M_max;
  ref->M_u_seg = ref_alloc (ref, 2 * ref->n_seg);
  for (guint k = 0; k < ref->n_seg; k++)
    {
      ref->M_u_seg[2 * k] = ext[k].M_min;
      ref->M_u_seg[2 * k + 1] = ext[k].M_max;
    }
  ref->Mq_u = ref_alloc (ref, 6 * ref->n_seg);
  quarter_moments (unit, ref->seg, ref->n_seg, ref->Mq_u);
  ref->free_end = g_new0 (gboolean, ref->n_seg + 1);
  g_ptr_array_add (ref->mem, ref->free_end);
  for (guint k = 0; k < ref->n_seg; k++)
    ref->free_end[k] = trb_design_steel_free_end (&input, ref->seg[k], ref->seg[k + 1]);
  ref->D_u = ref_alloc (ref, ref->n_spans);
  /* over the spans: found above already where they are the segments (the same search of
   * the same intervals) */
  if (!(ref->n_spans == ref->n_seg && ref->n_seg > 0 &&
        memcmp (span_ab, seg_ab, 2 * ref->n_seg * sizeof (double)) == 0))
    trb_beam_result_extremes_intervals (unit, span_ab, ref->n_spans, NULL, ext, NULL);
  for (guint j = 0; j < ref->n_spans; j++)
    {
      double x;

      ref->D_u[j] = trb_design_deflection_demand (&ext[j], &x) * ref->EI;
    }

  ref->n_str = r->strength.entries->len;
  ref->factors = ref_alloc (ref, ref->n_str * TRB_N_CASES);
  ref->V = ref_alloc (ref, ref->n_str * 8);
  ref->M = ref_alloc (ref, ref->n_str * 4);
  ref->M_seg = ref_alloc (ref, ref->n_str * 4 * ref->n_seg);
  ref->Mq = ref_alloc (ref, ref->n_str * 6 * ref->n_seg);
  for (guint i = 0; i < ref->n_str; i++)
    {
      const TrbComboResult *c = &g_array_index (r->strength.entries, TrbComboResult, i);
      double *V = ref->V + 8 * i, *M = ref->M + 4 * i;

      memcpy (ref->factors + i * TRB_N_CASES, c->combo.factors, sizeof c->combo.factors);
      for (guint e = 0; e < 2; e++)
        {
          double v = e == 0 ? c->ext.V_max : c->ext.V_min;
          double x = e == 0 ? c->ext.V_max_x : c->ext.V_min_x;
          double vl, vr;

          values_both_sides (c->result, x, 0, &vl, &vr);
          /* the unit load's V on either side of the extreme (it jumps at a support), and
           * on which side the extreme is: left 1, right 2, both 3, not told 0 */
          V[4 * e] = v;
          values_both_sides (unit, x, 0, &V[4 * e + 1], &V[4 * e + 2]);
          V[4 * e + 3] = (vl == v ? 1 : 0) + (vr == v ? 2 : 0);
        }
      M[0] = c->ext.M_max;
      M[1] = value_at (unit, c->ext.M_max_x, TRB_SIDE_RIGHT, 1);
      M[2] = c->ext.M_min;
      M[3] = value_at (unit, c->ext.M_min_x, TRB_SIDE_RIGHT, 1);
      ref->V_scale = MAX (ref->V_scale, abs_max (V[0], V[4]));
      ref->M_scale = MAX (ref->M_scale, abs_max (M[0], M[2]));
      if (sx == NULL)
        trb_beam_result_extremes_intervals (c->result, seg_ab, ref->n_seg, NULL, ext, NULL);
      for (guint k = 0; k < ref->n_seg; k++)
        {
          const TrbBeamExtremes *e = sx != NULL ? &g_array_index (sx->strength, TrbBeamExtremes,
                                                                  i * ref->n_seg + k)
                                                : &ext[k];
          double *Ms = ref->M_seg + (i * ref->n_seg + k) * 4;

          Ms[0] = e->M_max;
          Ms[1] = value_at (unit, e->M_max_x, TRB_SIDE_RIGHT, 1);
          Ms[2] = e->M_min;
          Ms[3] = value_at (unit, e->M_min_x, TRB_SIDE_RIGHT, 1);
        }
      if (ref->steel)
        quarter_moments (c->result, ref->seg, ref->n_seg, ref->Mq + i * 6 * ref->n_seg);
    }

  /* largest |M| first, ties in their own order (a stable insertion sort of a few entries) */
  ref->str_order = g_new (guint, ref->n_str + 1);
  g_ptr_array_add (ref->mem, ref->str_order);
  for (guint i = 0; i < ref->n_str; i++)
    {
      double mi = abs_max (ref->M[4 * i], ref->M[4 * i + 2]);
      guint j = i;

      for (; j > 0 && abs_max (ref->M[4 * ref->str_order[j - 1]],
                               ref->M[4 * ref->str_order[j - 1] + 2]) < mi; j--)
        ref->str_order[j] = ref->str_order[j - 1];
      ref->str_order[j] = i;
    }

  ref->n_live = r->live.entries->len;
  ref->n_total = r->total.entries->len;
  ref->scratch = ref_alloc (ref, 4 * ref->n_str + 2 * ref->n_live + 2 * ref->n_total);
  ref->d_live = ref_alloc (ref, ref->n_live * ref->n_spans);
  ref->d_total = ref_alloc (ref, 3 * ref->n_total * ref->n_spans);
  ref->fD_total = ref_alloc (ref, ref->n_total);
  span_demands (&r->live, span_ab, ref->n_spans, sx != NULL ? sx->live : NULL, NULL, 0,
                ref->d_live);
  span_demands (&r->total, span_ab, ref->n_spans, sx != NULL ? sx->total : NULL, unit, ref->EI,
                ref->d_total);
  for (guint i = 0; i < ref->n_live * ref->n_spans; i++)
    ref->D_scale = MAX (ref->D_scale, ref->d_live[i]);
  for (guint i = 0; i < ref->n_total; i++)
    {
      ref->fD_total[i] = g_array_index (r->total.entries, TrbComboResult,
                                        i).combo.factors[TRB_CASE_D];
      for (guint j = 0; j < ref->n_spans; j++)
        ref->D_scale = MAX (ref->D_scale, ref->d_total[3 * (i * ref->n_spans + j)]);
    }

  ref->ready = isfinite (ref->EI) && ref->EI > 0 &&
               isfinite (ref->V_u_min + ref->V_u_max + ref->M_u_min + ref->M_u_max) &&
               isfinite (ref->M_scale + ref->V_scale + ref->D_scale);
  for (guint j = 0; ref->ready && j < ref->n_spans; j++)
    ref->ready = isfinite (ref->D_u[j]);

  /* candidate_shares()'s live lower bounds with k_EI taken out: (d k - margin (d k, 0,
   * D_scale k)) / cap = k (d (1 - BOUND_MARGIN) - 1e-9 D_scale) / cap */
  ref->live_unit = 0;
  {
    double live_limit = trb_member_get_deflection_live (m, &project->settings);

    for (guint i = 0; live_limit > 0 && i < ref->n_live; i++)
      for (guint j = 0; j < ref->n_spans; j++)
        {
          double cap = ref->spans[j].judged / live_limit;
          double lo = (ref->d_live[i * ref->n_spans + j] * (1 - BOUND_MARGIN) -
                       1e-9 * ref->D_scale) / cap;

          if (lo > ref->live_unit)
            ref->live_unit = lo;
        }
    if (!isfinite (ref->live_unit))
      ref->live_unit = 0;
  }
  return ref->ready;
}

/* The margin of a bound: a millionth of the values and a billionth of the largest */
static inline double
margin (double a,
        double b,
        double scale)
{
  return BOUND_MARGIN * (fabs (a) + fabs (b)) + 1e-9 * scale;
}

/* The candidate's largest value of a combination where the reference has its largest, v, and
 * the unit load has u there (u_lo, u_hi: the unit load's least and largest where the
 * candidate's largest may be), moving by c times the unit load: [lo, hi]. */
static inline G_ALWAYS_INLINE void
bound_max (double  v,
           double  u,
           double  u_lo,
           double  u_hi,
           double  c,
           double  scale,
           double *lo,
           double *hi)
{
  *lo = v + c * u;
  *hi = v + (c >= 0 ? c * u_hi : c * u_lo);
  *lo -= margin (*lo, c * u, scale);
  *hi += margin (*hi, c * u_hi + c * u_lo, scale);
}

/* The unit load's value to take at a reference's extreme of V (u: left, right, side), so
 * that the candidate's largest (max) or least is certainly beyond the reference's plus c
 * times it: on the extreme's own side, the one that moves it least when not told. */
static inline double
unit_at_extreme (const double *u,
                 double        c,
                 gboolean      max)
{
  int side = (int) u[2];
  gboolean left_less = c * u[0] < c * u[1];

  if (side == 1)
    return u[0];
  if (side == 2)
    return u[1];
  /* on both sides: the candidate's extreme is beyond both; not told: beyond the lesser */
  if ((side == 3) == max)
    return left_less ? u[1] : u[0];
  return left_less ? u[0] : u[1];
}

/* and its least */
static inline G_ALWAYS_INLINE void
bound_min (double  v,
           double  u,
           double  u_lo,
           double  u_hi,
           double  c,
           double  scale,
           double *lo,
           double *hi)
{
  *hi = v + c * u;
  *lo = v + (c >= 0 ? c * u_lo : c * u_hi);
  *hi += margin (*hi, c * u, scale);
  *lo -= margin (*lo, c * u_hi + c * u_lo, scale);
}

/* Bounds on the share of each entry in each check, for one candidate. */
typedef struct
{
  double  max_lo;          /* the largest lower bound of any check: above 1, it fails */
  double  max_hi;          /* the largest upper bound: below 1, it passes */
  /* per strength entry, two checks: steel flexure and shear; allowable stress section
   * modulus and web shear; timber flexure (and all entries kept) */
  double *str_lo[2], *str_hi[2];
  gboolean keep_all_strength;
  double *live_lo, *live_hi;
  double *total_lo, *total_hi;
  gboolean live_checked, total_checked;
} Shares;

/* The shares' arrays, in room the reference keeps for them (sizing judges one candidate at a
 * time), all 0 */
static void
shares_init (Shares          *sh,
             const Reference *ref)
{
  guint n = 4 * ref->n_str + 2 * ref->n_live + 2 * ref->n_total;

  memset (sh, 0, sizeof *sh);
  memset (ref->scratch, 0, n * sizeof (double));
  sh->str_lo[0] = ref->scratch;
  sh->str_hi[0] = sh->str_lo[0] + ref->n_str;
  sh->str_lo[1] = sh->str_hi[0] + ref->n_str;
  sh->str_hi[1] = sh->str_lo[1] + ref->n_str;
  sh->live_lo = sh->str_hi[1] + ref->n_str;
  sh->live_hi = sh->live_lo + ref->n_live;
  sh->total_lo = sh->live_hi + ref->n_live;
  sh->total_hi = sh->total_lo + ref->n_total;
}

static inline G_ALWAYS_INLINE void
share_max (double *lo,
           double *hi,
           double  l,
           double  h)
{
  *lo = MAX (*lo, l);
  *hi = MAX (*hi, h);
}

/* The candidate's E (as the full analysis takes it) and its timber grade, or FALSE when its
 * analysis would end in an error. */
static gboolean
section_stiffness (const TrbProject    *project,
                   const TrbMember     *m,
                   const MemberInput   *in,
                   const TrbSection    *section,
                   double              *E,
                   const TrbWoodGrade **wood_grade)
{
  const TrbSettings *s = &project->settings;

  *wood_grade = NULL;
  if (m->material == TRB_MATERIAL_WOOD)
    {
      g_autofree char *why = NULL;
      TrbWoodOptions options;

      if (section->kind != TRB_SHAPE_SAWN && section->kind != TRB_SHAPE_GLULAM)
        return FALSE;
      *wood_grade = trb_solve_priv_wood_grade_for (m, in, section, &why);
      if (*wood_grade == NULL)
        return FALSE;
      trb_solve_priv_wood_options_for (m, in, &options);
      *E = trb_design_wood_adjusted_e (section, *wood_grade, &options, TRB_WOOD_E);
    }
  else
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);

      if (section->kind == TRB_SHAPE_SAWN || section->kind == TRB_SHAPE_GLULAM || grade == NULL)
        return FALSE;
      *E = grade->E;
    }
  return TRUE;
}

/* The shares of a candidate; FALSE when they cannot be bounded (then it is analysed in
 * full). */
static gboolean
candidate_shares (const Reference    *ref,
                  const TrbProject   *project,
                  const TrbMember    *m,
                  const MemberInput  *in,
                  const TrbSection   *section,
                  double              E,
                  const TrbWoodGrade *wood_grade,
                  gboolean            reject,
                  Shares             *sh)
{
  const TrbSettings *s = &project->settings;
  double self_weight = s->self_weight ? section->weight : 0;
  double EI = E * section->Ix;
  double k_EI, dw, M_u, V_u;
  double live_limit = trb_member_get_deflection_live (m, s);
  double total_limit = trb_member_get_deflection_total (m, s);
  gboolean bounded = FALSE;   /* strength bounded */

  /* the shares' arrays are cleared only once the candidate is bounded (most fail in live
   * deflection by one number first) */
  memset (sh, 0, sizeof *sh);
  if (!ref->ready || (self_weight > 0) != (ref->self_weight > 0) || !(EI > 0) ||
      !isfinite (EI))
    return FALSE;
  k_EI = ref->EI / EI;
  dw = self_weight - ref->self_weight;
  M_u = abs_max (ref->M_u_min, ref->M_u_max);
  V_u = abs_max (ref->V_u_min, ref->V_u_max);
  /* far from the largest double: every value of the candidate's analysis is finite, and so
   * is every ratio of its checks */
  if (!(k_EI < 1e12 && k_EI > 1e-12 && fabs (dw) < 1e12 &&
        (ref->M_scale + 2 * fabs (dw) * M_u) * (1 + k_EI) < 1e100 &&
        (ref->V_scale + 2 * fabs (dw) * V_u) < 1e100 && ref->D_scale * (1 + k_EI) < 1e100))
    return FALSE;

  /* deflection: live load deflection scales with E I_ref / E I; the total moves with w too.
   * A candidate certainly failing in live deflection by the reference's one number (the
   * bounds below, to their rounding: a millionth is far beyond it) need not be bounded
   * further. */
  if (reject && ref->live_unit * k_EI * (1 - 1e-12) > 1 + BOUND_MARGIN)
    {
      sh->max_lo = ref->live_unit * k_EI;
      return TRUE;
    }
  shares_init (sh, ref);

  if (ref->method == TRB_METHOD_ALLOWABLE)
    {
      double Fb = trb_member_get_fb_allow (m, s);
      double Fv = trb_member_get_fv_allow (m, s);
      const char *formula;

      if (!(isfinite (Fb) && Fb > 0 && isfinite (section->Sx) && section->Sx > 0 &&
            isfinite (Fv) && Fv > 0) ||
          isnan (trb_design_allowable_shear_stress (section, 1.0, &formula)))
        goto unbounded;
      for (guint i = 0; i < ref->n_str; i++)
        {
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          const double *M = ref->M + 4 * i, *V = ref->V + 8 * i;
          double max_lo, max_hi, min_lo, min_hi;

          /* the largest |M| and |V| over the member, against Fb Sx and Fv */
          bound_max (M[0], M[1], ref->M_u_min, ref->M_u_max, c, ref->M_scale, &max_lo, &max_hi);
          bound_min (M[2], M[3], ref->M_u_min, ref->M_u_max, c, ref->M_scale, &min_lo, &min_hi);
          sh->str_lo[0][i] = MAX (MAX (max_lo, -min_hi), 0) / Fb / section->Sx;
          sh->str_hi[0][i] = MAX (abs_max (max_lo, max_hi), abs_max (min_lo, min_hi)) / Fb /
                             section->Sx;
          bound_max (V[0], unit_at_extreme (V + 1, c, TRUE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &max_lo, &max_hi);
          bound_min (V[4], unit_at_extreme (V + 5, c, FALSE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &min_lo, &min_hi);
          sh->str_lo[1][i] = trb_design_allowable_shear_stress (section,
                                                                MAX (MAX (max_lo, -min_hi), 0),
                                                                NULL) / Fv;
          sh->str_hi[1][i] = trb_design_allowable_shear_stress (section,
                                                                MAX (abs_max (max_lo, max_hi),
                                                                     abs_max (min_lo, min_hi)),
                                                                NULL) / Fv;
        }
    }
  else if (ref->steel && section->kind == TRB_SHAPE_W)
    {
      const TrbSteelGrade *grade = trb_solve_priv_steel_grade_of (m, in, s);
      gboolean lrfd = ref->method == TRB_METHOD_LRFD;
      TrbSteelFlexure flex;
      TrbSteelFlexurePrep prep;
      TrbSteelShear shear;
      double cap_b, cap_v;

      if (grade == NULL || !trb_design_steel_flexure_prepare (section, grade, &prep) ||
          !trb_design_steel_flexure_at (&prep, 0, 1, &flex) ||
          !trb_design_steel_shear (section, grade, &shear))
        goto unbounded;
      cap_b = lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B;
      cap_v = lrfd ? shear.phi * shear.Vn : shear.Vn / shear.omega;
      if (!(cap_b > 0 && cap_v > 0))
        goto unbounded;
      for (guint i = 0; i < ref->n_str; i++)
        {
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          const double *V = ref->V + 8 * i;
          double max_lo, max_hi, min_lo, min_hi;

          /* shear (G2): the largest |V| over the member */
          bound_max (V[0], unit_at_extreme (V + 1, c, TRUE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &max_lo, &max_hi);
          bound_min (V[4], unit_at_extreme (V + 5, c, FALSE), ref->V_u_min, ref->V_u_max, c,
                     ref->V_scale, &min_lo, &min_hi);
          sh->str_lo[1][i] = MAX (MAX (max_lo, -min_hi), 0) / cap_v;
          sh->str_hi[1][i] = MAX (abs_max (max_lo, max_hi), abs_max (min_lo, min_hi)) / cap_v;
          sh->max_lo = MAX (sh->max_lo, sh->str_lo[1][i]);
        }
      if (reject && sh->max_lo > 1 + BOUND_MARGIN)
        return TRUE;
      for (guint o = 0; o < ref->n_str; o++)
        {
          guint i = ref->str_order[o];
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          double max_lo, max_hi, min_lo, min_hi;

          /* flexure: on each segment the sagging and hogging moments (AISC 360-16 F2 with
           * Lb = 0 for sagging under continuous bracing, the segment's Lb and Cb otherwise) */
          for (guint k = 0; k < ref->n_seg; k++)
            {
              const double *Ms = ref->M_seg + (i * ref->n_seg + k) * 4;
              const double *u = ref->M_u_seg + 2 * k;
              double pos_lo, pos_hi, neg_lo, neg_hi, abs_lo, abs_hi, cap_lo, cap_hi;
              double Cb_lo = 1, Cb_hi = 1;

              bound_max (Ms[0], Ms[1], u[0], u[1], c, ref->M_scale, &max_lo, &max_hi);
              bound_min (Ms[2], Ms[3], u[0], u[1], c, ref->M_scale, &min_lo, &min_hi);
              pos_lo = MAX (max_lo, 0);
              pos_hi = MAX (max_hi, 0);
              neg_lo = MAX (-min_hi, 0);
              neg_hi = MAX (-min_lo, 0);
              abs_lo = MAX (pos_lo, neg_lo);
              abs_hi = MAX (pos_hi, neg_hi);
              /* the check takes a hogging moment of a billionth of the largest as round-off */
              if (!(neg_lo > 1e-9 * abs_hi))
                neg_lo = 0;
              /* Cb (F1-1) grows with the largest moment and falls with those at the quarter
               * points; it is at least 1, and the capacity grows with it */
              if (!ref->free_end[k])
                {
                  const double *q = ref->Mq + (i * ref->n_seg + k) * 6;
                  const double *qu = ref->Mq_u + 6 * k;
                  double q_lo[3], q_hi[3], x_hi = abs_hi;

                  for (guint j = 0; j < 3; j++)
                    {
                      double l = q[2 * j] + c * qu[2 * j], r = q[2 * j + 1] + c * qu[2 * j + 1];
                      double tol = margin (abs_max (l, r), c * qu[2 * j], ref->M_scale);

                      q_hi[j] = abs_max (l, r) + tol;
                      q_lo[j] = MAX (abs_max (l, r) - tol, 0);
                      x_hi = MAX (x_hi, q_hi[j]);
                    }
                  if (abs_lo > 0)
                    Cb_lo = MAX (1.0, 12.5 * abs_lo / (2.5 * abs_lo + 3 * q_hi[0] + 4 * q_hi[1] +
                                                       3 * q_hi[2]) * (1 - BOUND_MARGIN));
                  if (x_hi > 0)
                    Cb_hi = MAX (1.0, 12.5 * x_hi / (2.5 * x_hi + 3 * q_lo[0] + 4 * q_lo[1] +
                                                     3 * q_lo[2]) * (1 + BOUND_MARGIN));
                  if (!(Cb_lo >= 1 && Cb_hi >= Cb_lo && isfinite (Cb_hi)))
                    goto unbounded;
                }
              trb_design_steel_flexure_at (&prep, ref->seg[k + 1] - ref->seg[k], Cb_lo, &flex);
              cap_lo = lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B;
              trb_design_steel_flexure_at (&prep, ref->seg[k + 1] - ref->seg[k], Cb_hi, &flex);
              cap_hi = lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B;
              if (!(cap_lo > 0 && cap_hi >= cap_lo))
                goto unbounded;
              if (m->bracing == TRB_BRACING_POINTS)
                share_max (&sh->str_lo[0][i], &sh->str_hi[0][i], abs_lo / cap_hi,
                           abs_hi / cap_lo);
              else
                share_max (&sh->str_lo[0][i], &sh->str_hi[0][i],
                           MAX (pos_lo / cap_b, neg_lo / cap_hi),
                           MAX (pos_hi / cap_b, neg_hi / cap_lo));
            }
          sh->max_lo = MAX (sh->max_lo, sh->str_lo[0][i]);
          if (reject && sh->max_lo > 1 + BOUND_MARGIN)
            return TRUE;
        }
    }
  else if (ref->wood && wood_grade != NULL)
    {
      TrbDesignInput input;
      g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
      TrbWoodOptions options;
      double S = isfinite (section->Sx) && section->Sx > 0 ? section->Sx
                                                           : section->b * section->d *
                                                             section->d / 6;

      if (!(section->b > 0 && section->d > 0))
        goto unbounded;
      member_design_input (m, in, ref->beam, brace_x, &input);
      input.section = section;
      trb_solve_priv_wood_options_for (m, in, &options);
      sh->keep_all_strength = TRUE;
      for (guint i = 0; i < ref->n_str; i++)
        {
          double c = ref->factors[i * TRB_N_CASES + TRB_CASE_D] * dw;
          double CD = trb_design_wood_cd (ref->factors + i * TRB_N_CASES);

          /* flexure (NDS 2018 3.3.1): each sign of moment on each segment, against Fb' */
          for (guint k = 0; k < ref->n_seg; k++)
            {
              const double *Ms = ref->M_seg + (i * ref->n_seg + k) * 4;
              const double *u = ref->M_u_seg + 2 * k;
              double max_lo, max_hi, min_lo, min_hi;

              bound_max (Ms[0], Ms[1], u[0], u[1], c, ref->M_scale, &max_lo, &max_hi);
              bound_min (Ms[2], Ms[3], u[0], u[1], c, ref->M_scale, &min_lo, &min_hi);
              for (int sign = 0; sign < 2; sign++)
                {
                  double lo = sign == 0 ? max_lo : -min_hi;
                  double hi = sign == 0 ? max_hi : -min_lo;
                  double fb_lo, fb_hi;

                  if (!(hi > 0))
                    continue;   /* no moment of this sign there */
                  trb_design_wood_fb_range (&input, wood_grade, &options, CD,
                                            ref->seg[k + 1] - ref->seg[k], sign == 1, &fb_lo,
                                            &fb_hi);
                  if (!(fb_hi > 0))
                    share_max (&sh->str_lo[0][i], &sh->str_hi[0][i], lo > 0 ? INFINITY : 0,
                               INFINITY);
                  else
                    share_max (&sh->str_lo[0][i], &sh->str_hi[0][i], MAX (lo, 0) / S / fb_hi,
                               hi / S / fb_lo);
                }
            }
        }
    }
  else
    goto unbounded;
  bounded = TRUE;

unbounded:
  /* deflection after strength: of the candidates past the live load's one number most fail
   * in strength. The verdict is the same in either order: a candidate is rejected when some
   * check's lower bound is above 1 (even where strength cannot be bounded), left to its
   * analysis when strength cannot be bounded and nothing rejects it, and bounded in full
   * otherwise */
  sh->live_checked = live_limit > 0 && ref->n_spans > 0;
  sh->total_checked = total_limit > 0 && ref->n_spans > 0;
  for (guint i = 0; sh->live_checked && i < ref->n_live; i++)
    for (guint j = 0; j < ref->n_spans; j++)
      {
        double cap = ref->spans[j].judged / live_limit;
        double d = ref->d_live[i * ref->n_spans + j] * k_EI;
        double tol = margin (d, 0, ref->D_scale * k_EI);

        share_max (&sh->live_lo[i], &sh->live_hi[i], MAX (d - tol, 0) / cap, (d + tol) / cap);
      }
  for (guint i = 0; sh->total_checked && i < ref->n_total; i++)
    for (guint j = 0; j < ref->n_spans; j++)
      {
        const double *d = ref->d_total + 3 * (i * ref->n_spans + j);
        double c = ref->fD_total[i] * dw;
        double cap = ref->spans[j].judged / total_limit;
        double at = fabs (d[1] + c * d[2]);
        double hi = d[0] * ref->EI + fabs (c) * ref->D_u[j];
        double tol = margin (hi, at, ref->D_scale * ref->EI);

        share_max (&sh->total_lo[i], &sh->total_hi[i], MAX (at - tol, 0) / EI / cap,
                   (hi + tol) / EI / cap);
      }

  for (guint i = 0; i < ref->n_live; i++)
    sh->max_lo = MAX (sh->max_lo, sh->live_lo[i]);
  for (guint i = 0; i < ref->n_total; i++)
    sh->max_lo = MAX (sh->max_lo, sh->total_lo[i]);
  if (reject && sh->max_lo > 1 + BOUND_MARGIN)
    return TRUE;
  if (!bounded)
    return FALSE;

  for (guint i = 0; i < ref->n_str; i++)
    sh->max_lo = MAX (sh->max_lo, MAX (sh->str_lo[0][i], sh->str_lo[1][i]));
  sh->max_hi = sh->keep_all_strength ? INFINITY : 0;
  for (guint i = 0; i < ref->n_str; i++)
    sh->max_hi = MAX (sh->max_hi, MAX (sh->str_hi[0][i], sh->str_hi[1][i]));
  for (guint i = 0; sh->live_checked && i < ref->n_live; i++)
    sh->max_hi = MAX (sh->max_hi, sh->live_hi[i]);
  for (guint i = 0; sh->total_checked && i < ref->n_total; i++)
    sh->max_hi = MAX (sh->max_hi, sh->total_hi[i]);

  /* a bound that is not a number bounds nothing */
  for (guint i = 0; i < ref->n_str; i++)
    if (isnan (sh->str_lo[0][i] + sh->str_hi[0][i] + sh->str_lo[1][i] + sh->str_hi[1][i]))
      return FALSE;
  for (guint i = 0; i < ref->n_live; i++)
    if (isnan (sh->live_lo[i] + sh->live_hi[i]))
      return FALSE;
  for (guint i = 0; i < ref->n_total; i++)
    if (isnan (sh->total_lo[i] + sh->total_hi[i]))
      return FALSE;
  return !isnan (sh->max_lo);
}

/* The entries whose upper bound reaches the largest lower bound: among them is every entry
 * that can give the check its value. */
static void
keep_reaching (const double *lo,
               const double *hi,
               guint         n,
               gboolean     *keep)
{
  double L = 0;

  for (guint i = 0; i < n; i++)
    L = MAX (L, lo[i]);
  for (guint i = 0; i < n; i++)
    if (hi[i] >= L)
      keep[i] = TRUE;
}

/* ---- sizing: a guess at the section chosen -------------------------------------------------
 *
 * Every bound comes from one analysis with every combination (the reference), and the chosen
 * section needs its full analysis: two analyses a member, unless the reference is the chosen
 * section's full analysis. So sizing first guesses the section it will choose, from the load
 * cases alone (a beam of unit E I, the moments, shears and deflections at the quarter points
 * of each segment and at the point loads, Cb from the quarter points), analyses that one in
 * full and makes it the reference.
 * The guess decides nothing: every candidate is still judged lightest first, the guess by its
 * own full result, the others from the bounds; a wrong guess costs one analysis more. Only for
 * W shapes of the bundled catalog under ASD or LRFD with dead and floor live load alone. */
#define GUESS_DIV 4   /* points a segment is divided by: 4 gives the quarter points */

/* A demand at one point for no self-weight, and how it grows with the self-weight w: d0 +
 * w du (the largest of a set at w = 0, taken where it is). */
typedef struct
{
  double d0, du;
} GuessDemand;

static void
guess_take (GuessDemand *g,
            double       d0,
            double       du)
{
  if (d0 > g->d0)
    {
      g->d0 = d0;
      g->du = du;
    }
}

static const TrbSection *
guess_section (const TrbProject  *project,
               const TrbMember   *m,
               const MemberInput *in,
               const Candidates  *cands)
{
  const TrbSettings *s = &project->settings;
  TrbMethod method = trb_member_get_method (m, s);
  gboolean lrfd = method == TRB_METHOD_LRFD;
  const TrbSteelGrade *grade;
  double live_limit = trb_member_get_deflection_live (m, s);
  double total_limit = trb_member_get_deflection_total (m, s);
  g_autoptr(GArray) brace_x = g_array_new (FALSE, FALSE, sizeof (double));
  g_autoptr(GArray) regions = NULL;
  g_autoptr(GArray) patterns = NULL;
  TrbBeam *beam = NULL;
  TrbBeamResult *parts[2 + TRB_PATTERN_MAX_REGIONS] = { NULL };
  TrbDesignInput input;
  TrbDeflectionSpan *spans = NULL;
  double *seg = NULL, *x = NULL;
  int *span_of = NULL;
  gboolean *free_end = NULL;
  TrbBeamValues *vals = NULL;   /* part i at point k: vals[i * n_pts + k] */
  TrbBeamValues vals_stack[192], *vals_heap = NULL;
  double *lp = NULL;            /* live load of pattern p at point k: M, V, v */
  double lp_stack[768], *lp_heap = NULL;
  double *f_span = NULL;
  GuessDemand *hog = NULL, *total = NULL, sag = { 0, 0 }, shear = { 0, 0 };
  double *hog_cb = NULL;          /* hogging demand and Cb of each strength entry on each
                                   * segment: hog[e * n_seg + k] */
  guint n_seg = 0, n_spans, n_pts, n_grid, n_regions, n_parts, n_str = 0, e_str = 0;
  gboolean has_case[TRB_N_CASES] = { FALSE };
  const TrbSection *guess = NULL;
  TrbLoad unit = { TRB_LOAD_UNIFORM, 0, in->length, 1.0, 1.0 };
  const GArray *combos[3];
  double live_unit = 0;
  gboolean patterns_built = FALSE;
  gboolean points_braced = m->bracing == TRB_BRACING_POINTS;

  if (m->material != TRB_MATERIAL_STEEL || cands->family == NULL ||
      (method != TRB_METHOD_ASD && method != TRB_METHOD_LRFD) ||
      in->n_loads[TRB_CASE_LR] > 0 || in->n_loads[TRB_CASE_S] > 0 ||
      in->n_loads[TRB_CASE_L] == 0 || in->n_supports == 0)
    return NULL;
  grade = trb_solve_priv_steel_grade_of (m, in, s);
  if (grade == NULL)
    return NULL;
  beam = trb_beam_new (in->length, 1.0, 1.0, in->supports, in->n_supports, NULL);
  if (beam == NULL)
    return NULL;

  /* the parts: dead load (without self-weight), a unit uniform load, live load by region */
  has_case[TRB_CASE_D] = in->n_loads[TRB_CASE_D] > 0 || s->self_weight;
  has_case[TRB_CASE_L] = TRUE;
  {
    guint n_bs;
    const TrbSupport *bs = trb_beam_get_supports (beam, &n_bs);

    regions = trb_regions_build (bs, n_bs, in->length);
  }
  n_regions = regions->len;
  if (s->live_patterns && n_regions > 1 && n_regions <= TRB_PATTERN_MAX_REGIONS)
    {
      GArray **split = trb_loads_split (in->loads[TRB_CASE_L], in->n_loads[TRB_CASE_L],
                                        (const TrbRegion *) regions->data, n_regions);

      patterns = trb_patterns_build ((const TrbRegion *) regions->data, n_regions, "L");
      patterns_built = TRUE;
      for (guint reg = 0; reg < n_regions; reg++)
        parts[2 + reg] = trb_beam_solve (beam, (const TrbLoad *) split[reg]->data,
                                         split[reg]->len, NULL);
      trb_loads_split_free (split, n_regions);
    }
  else
    {
      TrbPattern all = { "", 1 };

      n_regions = 1;
      patterns = g_array_new (FALSE, FALSE, sizeof (TrbPattern));
      g_array_append_val (patterns, all);
      parts[2] = trb_beam_solve (beam, in->loads[TRB_CASE_L], in->n_loads[TRB_CASE_L], NULL);
    }
  parts[0] = trb_beam_solve (beam, in->loads[TRB_CASE_D], in->n_loads[TRB_CASE_D], NULL);
  parts[1] = trb_beam_solve (beam, &unit, 1, NULL);
  n_parts = 2 + n_regions;
  for (guint i = 0; i < n_parts; i++)
    if (parts[i] == NULL)
      goto out;

  /* the quarter points of each flexure segment, the ends on their own side */
  member_design_input (m, in, beam, brace_x, &input);
  seg = g_new (double, 2 + input.n_supports + input.n_braces);
  n_seg = trb_design_steel_segment_points (&input, seg);
  if (n_seg < 2)
    goto out;
  n_seg--;
  spans = g_new0 (TrbDeflectionSpan, input.n_supports + 1);
  n_spans = trb_design_deflection_spans (&input, spans, input.n_supports + 1);
  /* the grid, then the point loads, where the moment peaks between grid points */
  n_grid = n_seg * (GUESS_DIV + 1);
  n_pts = n_grid;
  x = g_new (double, n_grid + in->n_loads[TRB_CASE_D] + in->n_loads[TRB_CASE_L]);
  for (guint k = 0; k < n_seg; k++)
    for (guint j = 0; j <= GUESS_DIV; j++)
      x[k * (GUESS_DIV + 1) + j] = seg[k] + (seg[k + 1] - seg[k]) * j / GUESS_DIV;
  for (guint c = TRB_CASE_D; c <= TRB_CASE_L; c++)
    for (guint i = 0; i < in->n_loads[c]; i++)
      if (in->loads[c][i].kind == TRB_LOAD_POINT && in->loads[c][i].a > 0 &&
          in->loads[c][i].a < in->length)
        x[n_pts++] = in->loads[c][i].a;
  /* the span each point is in, for the deflection checks; -1: none */
  span_of = g_new (int, n_pts);
  for (guint at = 0; at < n_pts; at++)
    {
      span_of[at] = -1;
      for (guint sp = 0; sp < n_spans && span_of[at] < 0; sp++)
        if (x[at] >= spans[sp].a && x[at] <= spans[sp].b)
          span_of[at] = sp;
    }
  if (n_parts * n_pts <= G_N_ELEMENTS (vals_stack))
    vals = vals_stack;
  else
    vals = vals_heap = g_new (TrbBeamValues, n_parts * n_pts);
  for (guint at = 0; at < n_pts; at++)
    for (guint i = 0; i < n_parts; i++)
      trb_beam_result_eval (parts[i], x[at],
                            at < n_grid && at % (GUESS_DIV + 1) == GUESS_DIV ? TRB_SIDE_LEFT
                                                                             : TRB_SIDE_RIGHT,
                            &vals[i * n_pts + at]);
  /* on the stack where it fits (a 3-span member: 441 values) */
  if (3 * patterns->len * n_pts <= G_N_ELEMENTS (lp_stack))
    {
      lp = lp_stack;
      memset (lp, 0, 3 * patterns->len * n_pts * sizeof (double));
    }
  else
    lp = lp_heap = g_new0 (double, 3 * patterns->len * n_pts);
  for (guint p = 0; p < patterns->len; p++)
    {
      guint64 mask = g_array_index (patterns, TrbPattern, p).mask;

      for (guint reg = 0; reg < n_regions; reg++)
        if ((mask >> reg) & 1)
          for (guint k = 0; k < n_pts; k++)
            {
              const TrbBeamValues *v = &vals[(2 + reg) * n_pts + k];
              double *o = lp + 3 * (p * n_pts + k);

              o[0] += v->M;
              o[1] += v->V;
              o[2] += v->defl;
            }
    }

  /* the largest demands at w = 0 of every combination and pattern, where they are */
  combos[0] = trb_solve_priv_combos_for (lrfd ? TRB_COMBO_SET_LRFD : TRB_COMBO_SET_ASD, has_case);
  combos[1] = trb_solve_priv_combos_for (TRB_COMBO_SET_LIVE, has_case);
  combos[2] = trb_solve_priv_combos_for (TRB_COMBO_SET_TOTAL, has_case);
  for (guint i = 0; i < combos[0]->len; i++)
    n_str += g_array_index (combos[0], TrbCombo, i).factors[TRB_CASE_L] != 0 ? patterns->len : 1;
  free_end = g_new (gboolean, n_seg);
  for (guint k = 0; k < n_seg; k++)
    free_end[k] = trb_design_steel_free_end (&input, seg[k], seg[k + 1]);
  /* each span's limits over its judged length: live, total */
  f_span = g_new (double, 2 * n_spans + 1);
  for (guint sp = 0; sp < n_spans; sp++)
    {
      f_span[2 * sp] = live_limit / spans[sp].judged;
      f_span[2 * sp + 1] = total_limit / spans[sp].judged;
    }
  hog = g_new0 (GuessDemand, n_str * n_seg);
  hog_cb = g_new (double, n_str * n_seg);
  total = g_new0 (GuessDemand, n_spans);
  for (guint set = 0; set < 3; set++)
    for (guint i = 0; i < combos[set]->len; i++)
      {
        const TrbCombo *combo = &g_array_index (combos[set], TrbCombo, i);
        double fD = combo->factors[TRB_CASE_D], fL = combo->factors[TRB_CASE_L];

        for (guint p = 0; p < (fL != 0 ? patterns->len : 1); p++, e_str += set == 0)
          {
            const double *lpp = lp + 3 * p * n_pts;

            if (set != 0)
              {
                /* the deflections: at every point in a span, in order */
                for (guint at = 0; at < n_pts; at++)
                  {
                    int sp = span_of[at];
                    double v, f;

                    if (sp < 0)
                      continue;
                    v = fD * vals[at].defl + fL * lpp[3 * at + 2];
                    f = f_span[2 * sp + set - 1];
                    if (set == 1)
                      live_unit = MAX (live_unit, fabs (v) * f);
                    else
                      guess_take (&total[sp], fabs (v) * f,
                                  copysign (fD * vals[n_pts + at].defl, v) * f);
                  }
                continue;
              }

            /* the segments' grids, then the point loads as a last "segment" */
            for (guint k = 0; k <= n_seg; k++)
              {
                guint first = k < n_seg ? k * (GUESS_DIV + 1) : n_grid;
                guint end = k < n_seg ? first + GUESS_DIV + 1 : n_pts;
                double neg = 0, du_neg = 0, m_abs = 0, q[3] = { 0, 0, 0 };

                for (guint at = first; at < end; at++)
                  {
                    guint j = at - first;
                    const double *l = lpp + 3 * at;
                    const TrbBeamValues *d = &vals[at], *u = &vals[n_pts + at];
                    double M = fD * d->M + fL * l[0];
                    double V = fD * d->V + fL * l[1];
                    /* braced at points: |M| meets Lb and Cb; else hogging does */
                    double h = points_braced ? fabs (M) : -M;

                    guess_take (&sag, points_braced ? 0 : M, fD * u->M);
                    guess_take (&shear, fabs (V), copysign (fD * u->V, V));
                    if (h > neg)
                      {
                        neg = h;
                        du_neg = points_braced ? copysign (fD * u->M, M) : -fD * u->M;
                      }
                    m_abs = MAX (m_abs, fabs (M));
                    if (k < n_seg && j > 0 && j < GUESS_DIV && j % (GUESS_DIV / 4) == 0)
                      q[j / (GUESS_DIV / 4) - 1] = M;
                  }
                if (k < n_seg)
                  {
                    hog[e_str * n_seg + k].d0 = neg;
                    hog[e_str * n_seg + k].du = du_neg;
                    hog_cb[e_str * n_seg + k] = free_end[k] ? 1.0
                                                : trb_design_steel_cb (m_abs, q[0], q[1], q[2]);
                  }
              }
          }
      }
  if (!(live_limit > 0))
    live_unit = 0;

  /* the lightest candidate those demands pass */
  for (guint c = 0; c < cands->n_family && guess == NULL; c++)
    {
      const TrbSection *section = &cands->family[c];
      double w = s->self_weight ? section->weight : 0;
      double EI = grade->E * section->Ix;
      double worst;
      TrbSteelFlexure flex;
      TrbSteelFlexurePrep prep;
      TrbSteelShear sh;

      if (!candidate_allowed (m, section) || section->kind != TRB_SHAPE_W ||
          !(EI > 0) || live_unit / EI > 1)
        continue;
      worst = 0;
      for (guint sp = 0; total_limit > 0 && sp < n_spans; sp++)
        worst = MAX (worst, fabs (total[sp].d0 + w * total[sp].du) / EI);
      if (worst > 1 || !trb_design_steel_flexure_prepare (section, grade, &prep) ||
          !trb_design_steel_flexure_at (&prep, 0, 1, &flex) ||
          !trb_design_steel_shear (section, grade, &sh))
        continue;
      worst = MAX (worst, (sag.d0 + w * sag.du) /
                          (lrfd ? TRB_STEEL_PHI_B * flex.Mn : flex.Mn / TRB_STEEL_OMEGA_B));
      worst = MAX (worst, fabs (shear.d0 + w * shear.du) /
                          (lrfd ? sh.phi * sh.Vn : sh.Vn / sh.omega));
      /* Mn grows as Cb times Mn at Cb = 1, up to the braced Mn (F2, F3) */
      {
        double Mn0 = flex.Mn;

        for (guint k = 0; k < n_seg && worst <= 1; k++)
          {
            if (!trb_design_steel_flexure_at (&prep, seg[k + 1] - seg[k], 1, &flex))
              {
                worst = INFINITY;
                break;
              }
            for (guint e = 0; e < n_str; e++)
              {
                const GuessDemand *h = &hog[e * n_seg + k];
                double Mn = MIN (hog_cb[e * n_seg + k] * flex.Mn, Mn0);

                if (h->d0 > 0)
                  worst = MAX (worst, (h->d0 + w * h->du) /
                                      (lrfd ? TRB_STEEL_PHI_B * Mn : Mn / TRB_STEEL_OMEGA_B));
              }
          }
      }
      if (worst <= 1)
        guess = section;
    }

out:
  /* what the first analysis would solve again, to restiffen: the regions, the patterns and
   * live load on each region (where patterns are formed: built as trb_solve_priv_analyse()
   * builds them), the unit load */
  if (in->plan != NULL && !in->plan->ready && in->plan->seed_regions == NULL &&
      regions != NULL && parts[1] != NULL)
    {
      MemberPlan *plan = in->plan;
      gboolean live = patterns_built;

      for (guint reg = 0; live && reg < n_regions; reg++)
        live = parts[2 + reg] != NULL;
      plan->seed_regions = g_array_ref (regions);
      plan->seed_unit = g_steal_pointer (&parts[1]);
      if (live)
        {
          plan->seed_patterns = g_array_ref (patterns);
          plan->seed_live = g_new (TrbBeamResult *, n_regions);
          for (guint reg = 0; reg < n_regions; reg++)
            plan->seed_live[reg] = g_steal_pointer (&parts[2 + reg]);
          plan->n_seed_live = n_regions;
        }
    }
  for (guint i = 0; i < G_N_ELEMENTS (parts); i++)
    g_clear_pointer (&parts[i], trb_beam_result_free);
  trb_beam_free (beam);
  g_free (spans);
  g_free (seg);
  g_free (x);
  g_free (span_of);
  g_free (free_end);
  g_free (vals_heap);
  g_free (lp_heap);
  g_free (hog);
  g_free (hog_cb);
  g_free (f_span);
  g_free (total);
  return guess;
}

typedef enum
{
  VERDICT_UNDECIDED,  /* analyse it in full (or certainly passing, as the first to pass) */
  VERDICT_REJECTED,   /* certainly fails: not analysed */
  VERDICT_DECIDED,    /* status (pass or fail), ratio and governing as the full analysis */
} VerdictKind;

typedef struct
{
  TrbStatus status;
  double    ratio;
  char      governing[40];
} Verdict;

static VerdictKind
judge_candidate (const Reference   *ref,
                 const TrbProject  *project,
                 const TrbMember   *m,
                 const MemberInput *in,
                 const TrbSection  *section,
                 gboolean           reject,
                 gboolean           full_if_passing,
                 Verdict           *v)
{
  const TrbWoodGrade *wood_grade;
  double E;
  Shares sh;
  Lean lean = { { NULL } };
  g_autofree gboolean *keep = NULL;
  SpanExtremes sx = { NULL };
  TrbMemberResult *r;
  VerdictKind kind = VERDICT_UNDECIDED;

  if (!section_stiffness (project, m, in, section, &E, &wood_grade))
    return VERDICT_UNDECIDED;
  if (!candidate_shares (ref, project, m, in, section, E, wood_grade, reject, &sh))
    {
      return VERDICT_UNDECIDED;
    }
  if (reject && sh.max_lo > 1 + BOUND_MARGIN)
    return VERDICT_REJECTED;
  /* certainly passing, and to be analysed in full anyway */
  if (full_if_passing && sh.max_hi < 1 - BOUND_MARGIN)
    return VERDICT_UNDECIDED;

  keep = g_new0 (gboolean, ref->n_str + ref->n_live + ref->n_total + 1);
  if (sh.keep_all_strength)
    for (guint i = 0; i < ref->n_str; i++)
      keep[i] = TRUE;
  else
    for (guint k = 0; k < 2; k++)
      keep_reaching (sh.str_lo[k], sh.str_hi[k], ref->n_str, keep);
  if (sh.live_checked)
    keep_reaching (sh.live_lo, sh.live_hi, ref->n_live, keep + ref->n_str);
  if (sh.total_checked)
    keep_reaching (sh.total_lo, sh.total_hi, ref->n_total, keep + ref->n_str + ref->n_live);
  lean.keep[0] = keep;
  lean.keep[1] = keep + ref->n_str;
  lean.keep[2] = keep + ref->n_str + ref->n_live;

  r = trb_solve_priv_member_result_new (project, m);
  if (trb_solve_priv_analyse (project, in, E, section->Ix,
                              project->settings.self_weight ? section->weight : 0, r, &sx, &lean))
    {
      trb_solve_priv_design_checks (project, m, in, section, wood_grade, &sx, TRUE, r);
      if (r->status == TRB_STATUS_PASS || r->status == TRB_STATUS_FAIL)
        {
          v->status = r->status;
          v->ratio = r->ratio;
          g_strlcpy (v->governing, r->governing, sizeof v->governing);
          kind = VERDICT_DECIDED;
        }
    }
  trb_solve_priv_span_extremes_clear (&sx);
  trb_member_result_free (r);
  return kind;
}

/* The first candidate judged: analysed with every combination (without envelopes or text),
 * its verdict, and the reference for the others. With reject, a section of the bundled
 * catalog whose own bounds say it certainly fails is rejected without its checks (the
 * lightest section mostly fails by far): its checks would say fail, since a live deflection
 * or strength ratio above 1 makes the status fail and the bundled sections' values are far
 * from any overflow that would make it an error; and should nothing pass, sizing runs again
 * without rejecting, which checks it. */
static VerdictKind
reference_candidate (Reference         *ref,
                     const TrbProject  *project,
                     const TrbMember   *m,
                     const MemberInput *in,
                     const TrbSection  *section,
                     gboolean           reject,
                     gboolean           bundled,
                     Verdict           *v)
{
  const TrbWoodGrade *wood_grade;
  double E;
  Lean lean = { { NULL } };
  SpanExtremes sx = { NULL };
  TrbMemberResult *r;
  VerdictKind kind = VERDICT_UNDECIDED;

  if (!section_stiffness (project, m, in, section, &E, &wood_grade))
    return VERDICT_UNDECIDED;
  r = trb_solve_priv_member_result_new (project, m);
  if (trb_solve_priv_analyse (project, in, E, section->Ix,
                              project->settings.self_weight ? section->weight : 0, r, &sx, &lean))
    {
      if (reject && bundled)
        {
          Shares sh;

          if (!reference_init (ref, project, m, in, r, &sx))
            reference_clear (ref);
          else if (candidate_shares (ref, project, m, in, section, E, wood_grade, TRUE, &sh) &&
                   sh.max_lo > 1 + BOUND_MARGIN)
            {
              trb_solve_priv_span_extremes_clear (&sx);
              trb_member_result_free (r);
              return VERDICT_REJECTED;
            }
        }
      trb_solve_priv_design_checks (project, m, in, section, wood_grade, &sx, TRUE, r);
      /* the reference made above, or made now, is kept only beside a verdict */
      if ((r->status == TRB_STATUS_PASS || r->status == TRB_STATUS_FAIL) &&
          (ref->ready || reference_init (ref, project, m, in, r, &sx)))
        {
          v->status = r->status;
          v->ratio = r->ratio;
          g_strlcpy (v->governing, r->governing, sizeof v->governing);
          kind = VERDICT_DECIDED;
        }
      else
        reference_clear (ref);
    }
  trb_solve_priv_span_extremes_clear (&sx);
  trb_member_result_free (r);
  return kind;
}

/* Sizing: every candidate lightest first is analysed with its own self-weight and checked;
 * the passing ones make the shortlist (up to shortlist_max), the lightest is chosen unless
 * the engineer named one. Because each candidate carries its own self-weight, the chosen
 * section is the one its own weight was computed with: nothing is left to iterate. With
 * use_bounds, candidates other than the first analysed are judged from it (see above) and,
 * with reject, those certainly failing are not analysed; should no candidate pass, sizing
 * runs again without rejecting, since the closest one is then reported. Only the section
 * chosen (and the closest, when none passes) is analysed in full for the result.
 * With list_only, only the shortlist is made, into list_only, and NULL returned: the same
 * candidates judged the same way, without the chosen section's full result. */
TrbMemberResult *
trb_solve_priv_size_member (const TrbProject  *project,
                            const TrbMember   *m,
                            const MemberInput *in,
                            const TrbSection  *chosen,
                            guint              shortlist_max,
                            gboolean           use_bounds,
                            gboolean           reject,
                            GArray            *list_only)
{
  Candidates candidates;
  const TrbSection *section;
  MemberInput in_plan = *in;
  MemberPlan plan = { FALSE };
  TrbMemberResult *best = NULL;
  TrbMemberResult *closest = NULL;          /* analysed in full */
  const TrbSection *closest_section = NULL; /* or only judged */
  double closest_ratio = 0;
  g_autoptr(GArray) shortlist = g_array_new (FALSE, TRUE, sizeof (TrbShortlistEntry));
  Reference ref = { FALSE };
  guint rejected = 0;
  gboolean found = FALSE;                   /* the lightest passing section (best) */
  const TrbSection *guess = NULL;           /* analysed in full first: the reference */
  TrbMemberResult *guess_result = NULL;

  /* the analyses of every section share what does not depend on it */
  in_plan.plan = &plan;
  in = &in_plan;
  sizing_candidates (project, m, &candidates);
  /* the guess, analysed in full first, is the reference */
  if (use_bounds && reject && chosen == NULL && list_only == NULL)
    {
      guess = guess_section (project, m, in, &candidates);
      if (guess != NULL)
        {
          SpanExtremes sx = { NULL };

          guess_result = solve_with_section_sx (project, m, in, guess, &sx);
          if (!((guess_result->status == TRB_STATUS_PASS ||
                 guess_result->status == TRB_STATUS_FAIL) &&
                reference_init (&ref, project, m, in, guess_result, &sx)))
            {
              reference_clear (&ref);
              g_clear_pointer (&guess_result, trb_member_result_free);
            }
          trb_solve_priv_span_extremes_clear (&sx);
        }
    }
  /* past the shortlist's length only for the lightest passing section, when it is chosen */
  while ((shortlist->len < shortlist_max || (list_only == NULL && chosen == NULL && !found)) &&
         (section = candidates_next (&candidates)) != NULL)
    {
      TrbMemberResult *c;
      TrbShortlistEntry e = { { 0 } };
      Verdict v;

      if (section == guess && guess_result != NULL)
        {
          /* judged by its full result */
          c = g_steal_pointer (&guess_result);
          if (c->status == TRB_STATUS_PASS)
            {
              g_strlcpy (e.section, section->designation, sizeof e.section);
              e.weight = section->weight;
              e.ratio = c->ratio;
              g_strlcpy (e.governing, c->governing, sizeof e.governing);
              g_array_append_val (shortlist, e);
              if (!found)
                {
                  found = TRUE;
                  best = c;
                  continue;
                }
            }
          else if (closest_section == NULL || c->ratio < closest_ratio)
            {
              g_clear_pointer (&closest, trb_member_result_free);
              closest = c;
              closest_section = section;
              closest_ratio = c->ratio;
              continue;
            }
          trb_member_result_free (c);
          continue;
        }
      if (use_bounds)
        switch (ref.ready ? judge_candidate (&ref, project, m, in, section, reject,
                                             !found && chosen == NULL && list_only == NULL,
                                             &v)
                          : reference_candidate (&ref, project, m, in, section, reject,
                                                 candidates.family != NULL, &v))
          {
          case VERDICT_REJECTED:
            rejected++;
            continue;
          case VERDICT_DECIDED:
            if (v.status == TRB_STATUS_PASS)
              {
                g_strlcpy (e.section, section->designation, sizeof e.section);
                e.weight = section->weight;
                e.ratio = v.ratio;
                g_strlcpy (e.governing, v.governing, sizeof e.governing);
                g_array_append_val (shortlist, e);
                if (!found && chosen == NULL)
                  {
                    found = TRUE;
                    if (list_only == NULL)
                      {
                        best = solve_with_section (project, m, in, section);
                        g_warn_if_fail (best->status == TRB_STATUS_PASS &&
                                        best->ratio == v.ratio);
                      }
                  }
              }
            else if (chosen == NULL && (closest_section == NULL || v.ratio < closest_ratio))
              {
                g_clear_pointer (&closest, trb_member_result_free);
                closest_section = section;
                closest_ratio = v.ratio;
              }
            continue;
          case VERDICT_UNDECIDED:
          default:
            break;
          }

      c = solve_with_section (project, m, in, section);

      if (c->status == TRB_STATUS_PASS)
        {
          g_strlcpy (e.section, section->designation, sizeof e.section);
          e.weight = section->weight;
          e.ratio = c->ratio;
          g_strlcpy (e.governing, c->governing, sizeof e.governing);
          g_array_append_val (shortlist, e);
          if (!found && chosen == NULL)
            {
              found = TRUE;
              if (list_only == NULL)
                {
                  best = c;
                  continue;
                }
            }
        }
      else if (chosen == NULL && c->status == TRB_STATUS_FAIL &&
               (closest_section == NULL || c->ratio < closest_ratio))
        {
          g_clear_pointer (&closest, trb_member_result_free);
          closest_section = section;
          closest_ratio = c->ratio;
          if (list_only == NULL)
            {
              closest = c;
              continue;
            }
        }
      else if (c->status != TRB_STATUS_FAIL && c->status != TRB_STATUS_PASS && chosen == NULL &&
               !found && closest_section == NULL)
        {
          /* unstable, unsupported or an error: the same for every section */
          if (list_only == NULL)
            best = c;
          else
            trb_member_result_free (c);
          break;
        }
      trb_member_result_free (c);
    }

  candidates_clear (&candidates);
  g_clear_pointer (&guess_result, trb_member_result_free);
  if (list_only != NULL)
    {
      /* nothing passes, or the shortlist is made: the rest is the result's */
      g_clear_pointer (&closest, trb_member_result_free);
      reference_clear (&ref);
      trb_solve_priv_member_plan_clear (&plan);
      g_array_append_vals (list_only, shortlist->data, MIN (shortlist->len, shortlist_max));
      return NULL;
    }

  if (chosen == NULL && best == NULL && rejected > 0)
    {
      /* nothing passes: the closest section may be one the bounds rejected */
      g_clear_pointer (&closest, trb_member_result_free);
      reference_clear (&ref);
      trb_solve_priv_member_plan_clear (&plan);
      in_plan.plan = NULL;
      return trb_solve_priv_size_member (project, m, in, chosen, shortlist_max, use_bounds, FALSE,
                                         NULL);
    }

  if (chosen != NULL)
    best = solve_with_section (project, m, in, chosen);
  else if (best == NULL && closest_section != NULL)
    {
      best = closest != NULL ? g_steal_pointer (&closest)
                             : solve_with_section (project, m, in, closest_section);
      trb_solve_priv_set_status (best, TRB_STATUS_FAIL, "no section of the catalog passes; the "
                                 "closest is %s (%s ratio %.2f)", best->section, best->governing,
                                 best->ratio);
    }
  else if (best == NULL)
    {
      best = trb_solve_priv_member_result_new (project, m);
      g_strlcpy (best->section, m->section, sizeof best->section);
      trb_solve_priv_set_status (best, TRB_STATUS_NOT_DESIGNED, "no catalog section fits the "
                                 "member's limits (family, depth, plies, allowed list)");
    }
  g_clear_pointer (&closest, trb_member_result_free);
  reference_clear (&ref);
  trb_solve_priv_member_plan_clear (&plan);
  g_array_append_vals (best->shortlist, shortlist->data, MIN (shortlist->len, shortlist_max));
  return best;
}

/**
 * trb_solve_member_shortlist:
 * @project: the project solved, for its settings and sections
 * @result: a member's result from it (any solve: with or without a shortlist)
 * @max: how many passing sections to list at most (G_MAXUINT for all)
 *
 * The shortlist of a catalog or "auto" member, for whoever shows it: its passing sections,
 * lightest first, ties by depth, sized again on what the solve analysed it with (its supports
 * and loads, as they came down a floor). Exactly the entries a solve with a shortlist of
 * @max gives, bit for bit, without the chosen section's full result. Empty for a custom
 * section and for a member that was not sized (unsupported, unstable, not framed).
 *
 * Returns: (transfer full) (element-type TrbShortlistEntry): the entries
 */
GArray *
trb_solve_member_shortlist (const TrbProject      *project,
                            const TrbMemberResult *result,
                            guint                  max)
{
  const struct _TrbMemberSizing *sz;
  const TrbMember *m;
  const TrbSection *chosen = NULL;
  MemberInput in = { 0 };
  g_autoptr(Memo) memo = NULL;
  GArray *list;

  g_return_val_if_fail (project != NULL && result != NULL, NULL);

  list = g_array_new (FALSE, TRUE, sizeof (TrbShortlistEntry));
  sz = result->sizing;
  m = result->member;
  if (sz == NULL || m == NULL || max == 0 || trb_member_is_custom (m))
    return list;
  if (!trb_member_is_auto (m))
    {
      chosen = trb_solve_priv_lookup_section (project, m->section);
      if (chosen == NULL)
        return list;
    }
  memo = trb_solve_priv_memo_new ();
  in.length = sz->length;
  in.supports = (const TrbSupport *) sz->supports->data;
  in.n_supports = sz->supports->len;
  for (guint c = 0; c < TRB_N_CASES; c++)
    {
      in.loads[c] = (const TrbLoad *) sz->loads[c]->data;
      in.n_loads[c] = sz->loads[c]->len;
    }
  in.repetitive_spacing = sz->repetitive_spacing;
  in.memo = memo;
  in.member = m;
  trb_solve_priv_size_member (project, m, &in, chosen, max, TRUE, TRUE, list);
  return list;
}
