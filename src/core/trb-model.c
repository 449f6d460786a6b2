/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-model.h"

/* Names as written in the project file, indexed by the enums. */
static const char * const method_names[] = { "asd", "lrfd", "allowable" };
static const char * const material_names[] = { "steel", "wood", "custom" };
static const char * const support_names[] = { "pin", "roller", "fixed" };
static const char * const load_kind_names[] = { "point", "uniform", "linear", "moment" };

static gboolean
lookup_name (const char * const *names,
             guint               n_names,
             const char         *name,
             int                *out)
{
  if (name == NULL)
    return FALSE;
  for (guint i = 0; i < n_names; i++)
    {
      if (strcmp (name, names[i]) == 0)
        {
          *out = i;
          return TRUE;
        }
    }
  return FALSE;
}

const char *
trb_method_name (TrbMethod method)
{
  g_return_val_if_fail (method < G_N_ELEMENTS (method_names), NULL);
  return method_names[method];
}

gboolean
trb_method_from_name (const char *name,
                      TrbMethod  *method)
{
  int i;

  if (!lookup_name (method_names, G_N_ELEMENTS (method_names), name, &i))
    return FALSE;
  *method = i;
  return TRUE;
}

const char *
trb_material_name (TrbMaterial material)
{
  g_return_val_if_fail (material < G_N_ELEMENTS (material_names), NULL);
  return material_names[material];
}

gboolean
trb_material_from_name (const char  *name,
                        TrbMaterial *material)
{
  int i;

  if (!lookup_name (material_names, G_N_ELEMENTS (material_names), name, &i))
    return FALSE;
  *material = i;
  return TRUE;
}

const char *
trb_support_type_name (TrbSupportType type)
{
  g_return_val_if_fail (type < G_N_ELEMENTS (support_names), NULL);
  return support_names[type];
}

gboolean
trb_support_type_from_name (const char     *name,
                            TrbSupportType *type)
{
  int i;

  if (!lookup_name (support_names, G_N_ELEMENTS (support_names), name, &i))
    return FALSE;
  *type = i;
  return TRUE;
}

const char *
trb_load_kind_name (TrbLoadKind kind)
{
  g_return_val_if_fail (kind < G_N_ELEMENTS (load_kind_names), NULL);
  return load_kind_names[kind];
}

gboolean
trb_load_kind_from_name (const char  *name,
                         TrbLoadKind *kind)
{
  int i;

  if (!lookup_name (load_kind_names, G_N_ELEMENTS (load_kind_names), name, &i))
    return FALSE;
  *kind = i;
  return TRUE;
}

/**
 * trb_settings_init_defaults:
 * @settings: settings to fill
 *
 * The defaults of a project without <settings>: ASD, A992 steel, self-weight included,
 * live-load patterns on, deflection limits L/360 live and L/240 total (IBC 2021 Table 1604.3,
 * floor members), US customary display.
 */
void
trb_settings_init_defaults (TrbSettings *settings)
{
  g_return_if_fail (settings != NULL);

  memset (settings, 0, sizeof *settings);
  settings->method = TRB_METHOD_ASD;
  settings->fb_allow = NAN;
  settings->fv_allow = NAN;
  settings->steel_grade = g_strdup ("A992");
  settings->self_weight = TRUE;
  settings->live_patterns = TRUE;
  settings->deflection_live = 360;
  settings->deflection_total = 240;
  settings->units = TRB_UNIT_SYSTEM_US;
  settings->line = 0;
}

void
trb_settings_clear (TrbSettings *settings)
{
  g_return_if_fail (settings != NULL);

  g_clear_pointer (&settings->steel_grade, g_free);
}

/**
 * trb_member_new:
 * @id: the member's mark
 *
 * Returns: (transfer full): a member with no length, supports or loads, and every optional
 *   attribute unset.
 */
TrbMember *
trb_member_new (const char *id)
{
  TrbMember *m = g_new0 (TrbMember, 1);

  m->id = g_strdup (id);
  m->material = TRB_MATERIAL_STEEL;
  m->section = g_strdup ("auto");
  m->E = m->I = m->S = m->A = m->d = m->tw = NAN;
  m->weight = NAN;
  m->supports = g_array_new (FALSE, TRUE, sizeof (TrbMemberSupport));
  m->loads = g_array_new (FALSE, TRUE, sizeof (TrbMemberLoad));
  m->fb_allow = m->fv_allow = NAN;
  m->deflection_live = m->deflection_total = NAN;
  m->bracing = TRB_BRACING_CONTINUOUS;
  m->braces = g_array_new (FALSE, TRUE, sizeof (TrbMemberBrace));
  m->max_depth = m->min_depth = NAN;
  m->bearing_length = NAN;
  return m;
}

void
trb_member_free (TrbMember *member)
{
  if (member == NULL)
    return;
  g_free (member->id);
  g_free (member->section);
  g_clear_pointer (&member->supports, g_array_unref);
  g_clear_pointer (&member->loads, g_array_unref);
  g_free (member->steel_grade);
  g_clear_pointer (&member->braces, g_array_unref);
  g_strfreev (member->allowed);
  g_free (member->species);
  g_free (member->grade);
  g_free (member);
}

gboolean
trb_member_is_custom (const TrbMember *member)
{
  g_return_val_if_fail (member != NULL, FALSE);
  return g_strcmp0 (member->section, "custom") == 0;
}

gboolean
trb_member_is_auto (const TrbMember *member)
{
  g_return_val_if_fail (member != NULL, FALSE);
  return g_strcmp0 (member->section, "auto") == 0;
}

TrbMethod
trb_member_get_method (const TrbMember   *member,
                       const TrbSettings *settings)
{
  g_return_val_if_fail (member != NULL && settings != NULL, TRB_METHOD_ASD);
  return member->has_method ? member->method : settings->method;
}

double
trb_member_get_fb_allow (const TrbMember   *member,
                         const TrbSettings *settings)
{
  g_return_val_if_fail (member != NULL && settings != NULL, NAN);
  return isnan (member->fb_allow) ? settings->fb_allow : member->fb_allow;
}

double
trb_member_get_fv_allow (const TrbMember   *member,
                         const TrbSettings *settings)
{
  g_return_val_if_fail (member != NULL && settings != NULL, NAN);
  return isnan (member->fv_allow) ? settings->fv_allow : member->fv_allow;
}

const char *
trb_member_get_steel_grade (const TrbMember   *member,
                            const TrbSettings *settings)
{
  g_return_val_if_fail (member != NULL && settings != NULL, NULL);
  return member->steel_grade != NULL ? member->steel_grade : settings->steel_grade;
}

double
trb_member_get_deflection_live (const TrbMember   *member,
                                const TrbSettings *settings)
{
  g_return_val_if_fail (member != NULL && settings != NULL, 0);
  return isnan (member->deflection_live) ? settings->deflection_live : member->deflection_live;
}

double
trb_member_get_deflection_total (const TrbMember   *member,
                                 const TrbSettings *settings)
{
  g_return_val_if_fail (member != NULL && settings != NULL, 0);
  return isnan (member->deflection_total) ? settings->deflection_total
                                          : member->deflection_total;
}

/**
 * trb_member_has_case:
 * @member: a member
 * @lcase: a load case
 *
 * Returns: %TRUE if the member carries a load of @lcase given in the file (self-weight, which
 *   the solve adds to D, is not counted here).
 */
gboolean
trb_member_has_case (const TrbMember *member,
                     TrbLoadCase      lcase)
{
  g_return_val_if_fail (member != NULL, FALSE);

  for (guint i = 0; i < member->loads->len; i++)
    if (g_array_index (member->loads, TrbMemberLoad, i).lcase == lcase)
      return TRUE;
  return FALSE;
}

TrbProject *
trb_project_new (void)
{
  TrbProject *p = g_new0 (TrbProject, 1);

  p->format = 1;
  trb_settings_init_defaults (&p->settings);
  p->members = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_member_free);
  return p;
}

void
trb_project_free (TrbProject *project)
{
  if (project == NULL)
    return;
  g_free (project->name);
  trb_settings_clear (&project->settings);
  g_clear_pointer (&project->members, g_ptr_array_unref);
  g_clear_pointer (&project->sections, trb_catalog_free);
  g_free (project);
}

/**
 * trb_project_add_member:
 * @project: a project
 * @member: (transfer full): a member whose id the project does not hold yet
 */
void
trb_project_add_member (TrbProject *project,
                        TrbMember  *member)
{
  g_return_if_fail (project != NULL && member != NULL);
  g_return_if_fail (trb_project_find_member (project, member->id) == NULL);

  g_ptr_array_add (project->members, member);
}

/**
 * trb_project_find_member:
 * @project: a project
 * @id: a member id
 *
 * Returns: (transfer none) (nullable): the member with @id.
 */
TrbMember *
trb_project_find_member (const TrbProject *project,
                         const char       *id)
{
  g_return_val_if_fail (project != NULL && id != NULL, NULL);

  for (guint i = 0; i < project->members->len; i++)
    {
      TrbMember *m = g_ptr_array_index (project->members, i);

      if (g_strcmp0 (m->id, id) == 0)
        return m;
    }
  return NULL;
}
