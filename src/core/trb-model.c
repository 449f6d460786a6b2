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
static const char * const role_names[] = { "girder", "beam", "joist" };
static const char * const area_load_kind_names[] = { "ordinary", "partition" };

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

const char *
trb_role_name (TrbFrameRole role)
{
  g_return_val_if_fail (role < G_N_ELEMENTS (role_names), NULL);
  return role_names[role];
}

gboolean
trb_role_from_name (const char   *name,
                    TrbFrameRole *role)
{
  int i;

  if (!lookup_name (role_names, G_N_ELEMENTS (role_names), name, &i))
    return FALSE;
  *role = i;
  return TRUE;
}

const char *
trb_area_load_kind_name (TrbAreaLoadKind kind)
{
  g_return_val_if_fail (kind < G_N_ELEMENTS (area_load_kind_names), NULL);
  return area_load_kind_names[kind];
}

gboolean
trb_area_load_kind_from_name (const char      *name,
                              TrbAreaLoadKind *kind)
{
  int i;

  if (!lookup_name (area_load_kind_names, G_N_ELEMENTS (area_load_kind_names), name, &i))
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
 * floor members), US customary display, no live load reduction (the engineer switches it on),
 * no floors above.
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
  settings->live_load_reduction = FALSE;
  settings->floors_above = 0;
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
 *   attribute unset; not in a floor, role beam, carrying the deck.
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
  m->role = TRB_FRAME_ROLE_BEAM;
  m->carries_deck = TRUE;
  m->bearing_points = g_array_new (FALSE, TRUE, sizeof (TrbFramePoint));
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
  g_free (member->group);
  g_clear_pointer (&member->bearing_points, g_array_unref);
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

static void
sections_source_free (gpointer data)
{
  TrbSectionsSource *s = data;

  g_free (s->file);
  g_free (s->csv);
  g_free (s);
}

TrbProject *
trb_project_new (void)
{
  TrbProject *p = g_new0 (TrbProject, 1);

  p->format = 1;
  trb_settings_init_defaults (&p->settings);
  p->members = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_member_free);
  p->ids = g_hash_table_new (g_str_hash, g_str_equal);
  p->floors = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_floor_free);
  p->sections_sources = g_ptr_array_new_with_free_func (sections_source_free);
  return p;
}

void
trb_project_free (TrbProject *project)
{
  if (project == NULL)
    return;
  g_free (project->name);
  trb_settings_clear (&project->settings);
  g_clear_pointer (&project->ids, g_hash_table_unref);
  /* Floors first: they only point at the members, which the members array owns. */
  g_clear_pointer (&project->floors, g_ptr_array_unref);
  g_clear_pointer (&project->members, g_ptr_array_unref);
  g_clear_pointer (&project->sections, trb_catalog_free);
  g_clear_pointer (&project->sections_sources, g_ptr_array_unref);
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
  g_hash_table_insert (project->ids, member->id, member);
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

  /* A linear search per member made a file of a million members load in hours. The index
   * follows trb_project_add_member(); should members have been changed directly, it is
   * rebuilt from them (backwards, so that the first of equal ids wins). */
  if (g_hash_table_size (project->ids) != project->members->len)
    {
      g_hash_table_remove_all (project->ids);
      for (guint i = project->members->len; i-- > 0;)
        {
          TrbMember *m = g_ptr_array_index (project->members, i);

          if (m->id != NULL)
            g_hash_table_insert (project->ids, m->id, m);
        }
    }
  return g_hash_table_lookup (project->ids, id);
}

/**
 * trb_member_set_role:
 * @member: a member
 * @role: girder, beam or joist
 *
 * Sets the role and the default that goes with it: joists and beams carry the deck (they take
 * area load), girders do not (the beams and joists framing into them bring it). Set
 * @member->carries_deck after this call to say otherwise.
 */
void
trb_member_set_role (TrbMember    *member,
                     TrbFrameRole  role)
{
  g_return_if_fail (member != NULL);
  g_return_if_fail (role <= TRB_FRAME_ROLE_JOIST);

  member->role = role;
  member->carries_deck = role != TRB_FRAME_ROLE_GIRDER;
}

/**
 * trb_member_set_plan:
 * @member: a member
 * @start: its start in plan, m
 * @end: its end in plan, m
 *
 * Places the member in plan; its length becomes the distance from @start to @end.
 */
void
trb_member_set_plan (TrbMember     *member,
                     TrbFramePoint  start,
                     TrbFramePoint  end)
{
  g_return_if_fail (member != NULL);

  member->start = start;
  member->end = end;
  member->length = hypot (end.x - start.x, end.y - start.y);
}

/**
 * trb_member_copy_design:
 * @member: a member
 * @template: the member to copy from
 *
 * Gives @member the material, section, custom properties and design attributes of
 * @template; not its mark, place, role, group, supports, loads, braces or bearing points,
 * which belong to one member.
 */
void
trb_member_copy_design (TrbMember       *member,
                        const TrbMember *template)
{
  g_return_if_fail (member != NULL && template != NULL);

  member->material = template->material;
  g_free (member->section);
  member->section = g_strdup (template->section);
  member->E = template->E;
  member->I = template->I;
  member->S = template->S;
  member->A = template->A;
  member->d = template->d;
  member->tw = template->tw;
  member->weight = template->weight;
  member->has_method = template->has_method;
  member->method = template->method;
  member->fb_allow = template->fb_allow;
  member->fv_allow = template->fv_allow;
  g_free (member->steel_grade);
  member->steel_grade = g_strdup (template->steel_grade);
  member->deflection_live = template->deflection_live;
  member->deflection_total = template->deflection_total;
  member->bracing = template->bracing;
  member->max_depth = template->max_depth;
  member->min_depth = template->min_depth;
  g_strfreev (member->allowed);
  member->allowed = g_strdupv (template->allowed);
  member->max_plies = template->max_plies;
  g_free (member->species);
  member->species = g_strdup (template->species);
  g_free (member->grade);
  member->grade = g_strdup (template->grade);
  member->wet_service = template->wet_service;
  member->incised = template->incised;
  member->repetitive = template->repetitive;
  member->bearing_length = template->bearing_length;
}

void
trb_member_add_bearing_point (TrbMember     *member,
                              TrbFramePoint  point)
{
  g_return_if_fail (member != NULL);

  g_array_append_val (member->bearing_points, point);
}

/**
 * trb_points_append:
 * @points: a #GArray of #TrbFramePoint
 * @x: m
 * @y: m
 *
 * Adds a point to a wall, load polygon, opening or polyline.
 */
void
trb_points_append (GArray *points,
                   double  x,
                   double  y)
{
  TrbFramePoint p = { x, y };

  g_return_if_fail (points != NULL);
  g_return_if_fail (g_array_get_element_size (points) == sizeof (TrbFramePoint));

  g_array_append_val (points, p);
}

static GArray *
points_new (void)
{
  return g_array_new (FALSE, TRUE, sizeof (TrbFramePoint));
}

TrbGridLine *
trb_grid_line_new (const char    *name,
                   TrbFramePoint  start,
                   TrbFramePoint  end)
{
  TrbGridLine *g = g_new0 (TrbGridLine, 1);

  g->name = g_strdup (name);
  g->start = start;
  g->end = end;
  return g;
}

void
trb_grid_line_free (TrbGridLine *grid)
{
  if (grid == NULL)
    return;
  g_free (grid->name);
  g_free (grid);
}

/**
 * trb_column_new:
 * @id: its mark
 * @at: where it stands, m
 * @section: (nullable): what the engineer calls it; not designed
 */
TrbColumn *
trb_column_new (const char    *id,
                TrbFramePoint  at,
                const char    *section)
{
  TrbColumn *c = g_new0 (TrbColumn, 1);

  c->id = g_strdup (id);
  c->at = at;
  c->section = g_strdup (section);
  return c;
}

void
trb_column_free (TrbColumn *column)
{
  if (column == NULL)
    return;
  g_free (column->id);
  g_free (column->section);
  g_free (column);
}

/**
 * trb_wall_new:
 * @id: its mark
 * @material: (nullable): "masonry", "concrete", ...; for the reader only
 *
 * Returns: (transfer full): a wall with no points yet; add two or more with
 *   trb_points_append() on its points.
 */
TrbWall *
trb_wall_new (const char *id,
              const char *material)
{
  TrbWall *w = g_new0 (TrbWall, 1);

  w->id = g_strdup (id);
  w->material = g_strdup (material);
  w->points = points_new ();
  return w;
}

void
trb_wall_free (TrbWall *wall)
{
  if (wall == NULL)
    return;
  g_free (wall->id);
  g_free (wall->material);
  g_clear_pointer (&wall->points, g_array_unref);
  g_free (wall);
}

/**
 * trb_area_load_new:
 * @lcase: load case
 * @kind: ordinary, or partition (live load that live load reduction leaves alone)
 * @pressure: Pa, downward +
 * @label: (nullable): what it is
 * @occupancy: (nullable): for live load
 *
 * Returns: (transfer full): an area load with no polygon yet; add three or more points.
 */
TrbAreaLoad *
trb_area_load_new (TrbLoadCase      lcase,
                   TrbAreaLoadKind  kind,
                   double           pressure,
                   const char      *label,
                   const char      *occupancy)
{
  TrbAreaLoad *a = g_new0 (TrbAreaLoad, 1);

  a->lcase = lcase;
  a->kind = kind;
  a->pressure = pressure;
  a->label = g_strdup (label);
  a->occupancy = g_strdup (occupancy);
  a->points = points_new ();
  return a;
}

void
trb_area_load_free (TrbAreaLoad *load)
{
  if (load == NULL)
    return;
  g_free (load->label);
  g_free (load->occupancy);
  g_clear_pointer (&load->points, g_array_unref);
  g_free (load);
}

TrbOpening *
trb_opening_new (void)
{
  TrbOpening *o = g_new0 (TrbOpening, 1);

  o->points = points_new ();
  return o;
}

void
trb_opening_free (TrbOpening *opening)
{
  if (opening == NULL)
    return;
  g_clear_pointer (&opening->points, g_array_unref);
  g_free (opening);
}

/**
 * trb_line_load_new:
 * @lcase: load case
 * @w: N/m, downward +
 * @label: (nullable): what it is
 *
 * Returns: (transfer full): a line load with no polyline yet; add two or more points.
 */
TrbLineLoad *
trb_line_load_new (TrbLoadCase  lcase,
                   double       w,
                   const char  *label)
{
  TrbLineLoad *l = g_new0 (TrbLineLoad, 1);

  l->lcase = lcase;
  l->w = w;
  l->label = g_strdup (label);
  l->points = points_new ();
  return l;
}

void
trb_line_load_free (TrbLineLoad *load)
{
  if (load == NULL)
    return;
  g_free (load->label);
  g_clear_pointer (&load->points, g_array_unref);
  g_free (load);
}

TrbPointLoad *
trb_point_load_new (TrbLoadCase    lcase,
                    double         P,
                    TrbFramePoint  at,
                    const char    *label)
{
  TrbPointLoad *p = g_new0 (TrbPointLoad, 1);

  p->lcase = lcase;
  p->P = P;
  p->at = at;
  p->label = g_strdup (label);
  return p;
}

void
trb_point_load_free (TrbPointLoad *load)
{
  if (load == NULL)
    return;
  g_free (load->label);
  g_free (load);
}

/**
 * trb_floor_new:
 * @name: what the engineer calls the level ("Mezzanine", "Level 2")
 *
 * Returns: (transfer full): an empty floor. It owns its grid lines, columns, walls and loads;
 *   its members array only points at members the project owns (trb_floor_add_member()).
 */
TrbFloor *
trb_floor_new (const char *name)
{
  TrbFloor *f = g_new0 (TrbFloor, 1);

  f->name = g_strdup (name);
  f->grids = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_grid_line_free);
  f->columns = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_column_free);
  f->walls = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_wall_free);
  f->members = g_ptr_array_new ();
  f->area_loads = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_area_load_free);
  f->openings = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_opening_free);
  f->line_loads = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_line_load_free);
  f->point_loads = g_ptr_array_new_with_free_func ((GDestroyNotify) trb_point_load_free);
  return f;
}

void
trb_floor_free (TrbFloor *floor)
{
  if (floor == NULL)
    return;
  g_free (floor->name);
  g_clear_pointer (&floor->grids, g_ptr_array_unref);
  g_clear_pointer (&floor->columns, g_ptr_array_unref);
  g_clear_pointer (&floor->walls, g_ptr_array_unref);
  g_clear_pointer (&floor->members, g_ptr_array_unref);
  g_clear_pointer (&floor->area_loads, g_ptr_array_unref);
  g_clear_pointer (&floor->openings, g_ptr_array_unref);
  g_clear_pointer (&floor->line_loads, g_ptr_array_unref);
  g_clear_pointer (&floor->point_loads, g_ptr_array_unref);
  g_free (floor);
}

/**
 * trb_floor_add_member:
 * @project: the project that holds @floor
 * @floor: a floor of @project
 * @member: (transfer full): a member whose mark the project does not hold yet, placed in plan
 *   (its start and end set)
 *
 * Adds @member to the project's members (which own it) and to the floor's, points it at the
 * floor, and sets its length to the distance from its start to its end.
 */
void
trb_floor_add_member (TrbProject *project,
                      TrbFloor   *floor,
                      TrbMember  *member)
{
  g_return_if_fail (project != NULL && floor != NULL && member != NULL);
  g_return_if_fail (trb_project_find_member (project, member->id) == NULL);

  member->floor = floor;
  member->length = hypot (member->end.x - member->start.x, member->end.y - member->start.y);
  trb_project_add_member (project, member);
  g_ptr_array_add (floor->members, member);
}

TrbColumn *
trb_floor_find_column (const TrbFloor *floor,
                       const char     *id)
{
  g_return_val_if_fail (floor != NULL && id != NULL, NULL);

  for (guint i = 0; i < floor->columns->len; i++)
    {
      TrbColumn *c = g_ptr_array_index (floor->columns, i);

      if (g_strcmp0 (c->id, id) == 0)
        return c;
    }
  return NULL;
}

TrbWall *
trb_floor_find_wall (const TrbFloor *floor,
                     const char     *id)
{
  g_return_val_if_fail (floor != NULL && id != NULL, NULL);

  for (guint i = 0; i < floor->walls->len; i++)
    {
      TrbWall *w = g_ptr_array_index (floor->walls, i);

      if (g_strcmp0 (w->id, id) == 0)
        return w;
    }
  return NULL;
}

TrbGridLine *
trb_floor_find_grid (const TrbFloor *floor,
                     const char     *name)
{
  g_return_val_if_fail (floor != NULL && name != NULL, NULL);

  for (guint i = 0; i < floor->grids->len; i++)
    {
      TrbGridLine *g = g_ptr_array_index (floor->grids, i);

      if (g_strcmp0 (g->name, name) == 0)
        return g;
    }
  return NULL;
}

/**
 * trb_project_add_floor:
 * @project: a project
 * @floor: (transfer full): a floor
 */
void
trb_project_add_floor (TrbProject *project,
                       TrbFloor   *floor)
{
  g_return_if_fail (project != NULL && floor != NULL);

  g_ptr_array_add (project->floors, floor);
}

/**
 * trb_project_find_floor:
 * @project: a project
 * @name: a floor's name
 *
 * Returns: (transfer none) (nullable): the first floor called @name.
 */
TrbFloor *
trb_project_find_floor (const TrbProject *project,
                        const char       *name)
{
  g_return_val_if_fail (project != NULL && name != NULL, NULL);

  for (guint i = 0; i < project->floors->len; i++)
    {
      TrbFloor *f = g_ptr_array_index (project->floors, i);

      if (g_strcmp0 (f->name, name) == 0)
        return f;
    }
  return NULL;
}

/**
 * trb_project_find_column:
 * @project: a project
 * @id: a column mark (unique across the project's floors)
 * @floor: (out) (optional) (transfer none): the floor it stands on
 *
 * Columns are few beside members, so this is a plain search.
 *
 * Returns: (transfer none) (nullable): the column.
 */
TrbColumn *
trb_project_find_column (const TrbProject  *project,
                         const char        *id,
                         TrbFloor         **floor)
{
  g_return_val_if_fail (project != NULL && id != NULL, NULL);

  for (guint i = 0; i < project->floors->len; i++)
    {
      TrbFloor *f = g_ptr_array_index (project->floors, i);
      TrbColumn *c = trb_floor_find_column (f, id);

      if (c != NULL)
        {
          if (floor != NULL)
            *floor = f;
          return c;
        }
    }
  return NULL;
}

/**
 * trb_project_find_wall:
 * @project: a project
 * @id: a wall mark (unique across the project's floors)
 * @floor: (out) (optional) (transfer none): the floor it is on
 *
 * Returns: (transfer none) (nullable): the wall.
 */
TrbWall *
trb_project_find_wall (const TrbProject  *project,
                       const char        *id,
                       TrbFloor         **floor)
{
  g_return_val_if_fail (project != NULL && id != NULL, NULL);

  for (guint i = 0; i < project->floors->len; i++)
    {
      TrbFloor *f = g_ptr_array_index (project->floors, i);
      TrbWall *w = trb_floor_find_wall (f, id);

      if (w != NULL)
        {
          if (floor != NULL)
            *floor = f;
          return w;
        }
    }
  return NULL;
}

/**
 * trb_project_next_mark:
 * @project: a project
 * @prefix: the mark's letters ("J", "B")
 * @counter: (inout): the last number tried; start at 0 and pass the same counter again for
 *   the next mark
 *
 * Returns: (transfer full): the first member mark @prefix followed by a number above
 *   *@counter that the project does not hold yet ("J1", "J2", ...).
 */
char *
trb_project_next_mark (const TrbProject *project,
                       const char       *prefix,
                       guint            *counter)
{
  g_return_val_if_fail (project != NULL && prefix != NULL && counter != NULL, NULL);

  for (;;)
    {
      char *mark;

      (*counter)++;
      mark = g_strdup_printf ("%s%u", prefix, *counter);
      if (trb_project_find_member (project, mark) == NULL)
        return mark;
      g_free (mark);
    }
}

/**
 * trb_project_add_sections_source:
 * @project: a project
 * @file: (nullable): the file name a <sections> element named
 * @csv: (nullable): or the table it held
 * @line: its line in the file; 0 when it has none
 *
 * Records where the project's own sections came from, for saving. The sections themselves
 * are in @project->sections.
 */
void
trb_project_add_sections_source (TrbProject *project,
                                 const char *file,
                                 const char *csv,
                                 int         line)
{
  TrbSectionsSource *s;

  g_return_if_fail (project != NULL);
  g_return_if_fail ((file == NULL) != (csv == NULL));

  s = g_new0 (TrbSectionsSource, 1);
  s->file = g_strdup (file);
  s->csv = g_strdup (csv);
  s->line = line;
  g_ptr_array_add (project->sections_sources, s);
}
