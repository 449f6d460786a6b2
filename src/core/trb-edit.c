/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-catalog.h"
#include "trb-edit.h"
#include "trb-error.h"
#include "trb-frame.h"

/* The framing refuses a member shorter than twice its bearing tolerance (50 mm): a floor with
 * one would not solve at all, so no edit may make one. */
#define MIN_MEMBER_LENGTH (2.0 * TRB_FRAME_TOLERANCE)

/* Most commands are their own inverse: they swap a value held by the command with the one in
 * the model, so applying and reverting run the same code and undo restores the exact bits. */
typedef struct
{
  void (*apply)  (TrbEditCommand *command);
  void (*revert) (TrbEditCommand *command);
  void (*clear)  (TrbEditCommand *command);
} CommandClass;

typedef union
{
  TrbMemberSupport support;
  TrbMemberLoad    load;
  TrbMemberBrace   brace;
  TrbFramePoint    point;
} MemberElement;

struct _TrbEditCommand
{
  const CommandClass *klass;
  char               *label;
  TrbProject         *project;
  gboolean            applied;
  guint64             serial;

  union
  {
    struct
    {
      TrbFloor  *floor;
      TrbMember *member;
      guint      project_index;
      guint      floor_index;
    } member;

    struct
    {
      TrbMember     *member;
      TrbFramePoint  start;
      TrbFramePoint  end;
      double         length;
    } move;

    struct
    {
      TrbMember      *member;
      TrbMemberField  field;
      char           *text;
      int             choice;
      double          number;
    } set;

    struct
    {
      TrbMember      *member;
      TrbMemberArray  list;
      guint           index;
      MemberElement   element;
    } element;

    struct
    {
      TrbFloor         *floor;
      TrbFloorItemKind  kind;
      gpointer          item;   /* owned while it is out of the floor */
      guint             index;
    } item;

    TrbSettings settings;

    GPtrArray *children;
  } u;
};

static TrbEditCommand *
command_new (const CommandClass *klass,
             TrbProject         *project,
             char               *label)
{
  TrbEditCommand *c = g_new0 (TrbEditCommand, 1);

  c->klass = klass;
  c->project = project;
  c->label = label;
  return c;
}

static void
command_apply (TrbEditCommand *c)
{
  g_assert (!c->applied);
  c->klass->apply (c);
  c->applied = TRUE;
}

static void
command_revert (TrbEditCommand *c)
{
  g_assert (c->applied);
  c->klass->revert (c);
  c->applied = FALSE;
}

/**
 * trb_edit_command_get_label:
 * @command: a command
 *
 * Returns: what the command does, for the undo and redo menu items ("Move B3").
 */
const char *
trb_edit_command_get_label (const TrbEditCommand *command)
{
  g_return_val_if_fail (command != NULL, NULL);
  return command->label;
}

/**
 * trb_edit_command_free:
 * @command: (nullable): a command that is not in a history
 *
 * Frees the command and whatever it holds out of the project (a removed member, a replaced
 * column).
 */
void
trb_edit_command_free (TrbEditCommand *command)
{
  if (command == NULL)
    return;
  if (command->klass->clear != NULL)
    command->klass->clear (command);
  g_free (command->label);
  g_free (command);
}

static const char *
mark_of (const TrbMember *member)
{
  return member->id != NULL ? member->id : "?";
}

/* The project's id index keys the members' id strings; keep it in step with what we do to
 * the members array, so that a lookup never meets a freed key. */
static void
index_remove (TrbProject *project,
              TrbMember  *member)
{
  if (project->ids != NULL && member->id != NULL
      && g_hash_table_lookup (project->ids, member->id) == member)
    g_hash_table_remove (project->ids, member->id);
}

static void
index_add (TrbProject *project,
           TrbMember  *member)
{
  if (project->ids != NULL && member->id != NULL)
    g_hash_table_insert (project->ids, member->id, member);
}

/* ---- add and remove members ---------------------------------------------------------------- */

static void
member_insert (TrbEditCommand *c)
{
  TrbProject *p = c->project;
  TrbMember *m = c->u.member.member;

  g_ptr_array_insert (p->members, c->u.member.project_index, m);
  index_add (p, m);
  if (c->u.member.floor != NULL)
    {
      m->floor = c->u.member.floor;
      g_ptr_array_insert (c->u.member.floor->members, c->u.member.floor_index, m);
    }
}

static void
member_take_out (TrbEditCommand *c)
{
  TrbProject *p = c->project;
  TrbMember *m = c->u.member.member;
  gpointer taken;

  index_remove (p, m);
  /* steal: the project's array would free the member; the command keeps it instead */
  taken = g_ptr_array_steal_index (p->members, c->u.member.project_index);
  g_assert (taken == m);
  if (c->u.member.floor != NULL)
    {
      taken = g_ptr_array_steal_index (c->u.member.floor->members, c->u.member.floor_index);
      g_assert (taken == m);
    }
}

static void
member_clear (TrbEditCommand *c)
{
  /* An add that is undone, or a remove that is done, holds the member out of the project. */
  gboolean out = (c->klass->apply == member_insert) != c->applied;

  if (out)
    trb_member_free (c->u.member.member);
}

static const CommandClass add_member_class = { member_insert, member_take_out, member_clear };
static const CommandClass remove_member_class = { member_take_out, member_insert, member_clear };

static gboolean
check_point (const TrbFramePoint  *p,
             const char           *what,
             GError              **error)
{
  if (!isfinite (p->x) || !isfinite (p->y))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "%s: a coordinate is not finite", what);
      return FALSE;
    }
  return TRUE;
}

static gboolean
check_placement (const char           *id,
                 const TrbFramePoint  *start,
                 const TrbFramePoint  *end,
                 GError              **error)
{
  if (!check_point (start, id, error) || !check_point (end, id, error))
    return FALSE;
  if (!(hypot (end->x - start->x, end->y - start->y) >= MIN_MEMBER_LENGTH))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s would be shorter than 50 mm", id);
      return FALSE;
    }
  return TRUE;
}

static gboolean
check_mark (const TrbProject  *project,
            const char        *id,
            GError           **error)
{
  if (id == NULL || *id == '\0' || g_utf8_strlen (id, -1) > 31)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "a member's mark must be 1 to 31 characters");
      return FALSE;
    }
  if (!g_utf8_validate (id, -1, NULL))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "a member's mark must be valid text");
      return FALSE;
    }
  if (trb_project_find_member (project, id) != NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "there is already a member %s", id);
      return FALSE;
    }
  return TRUE;
}

/**
 * trb_edit_add_member:
 * @project: a project
 * @floor: (nullable): a floor of @project, or %NULL for a standalone beam
 * @member: (transfer full): a new member; on a floor, placed in plan (start and end set)
 * @error: return location for a #GError
 *
 * Adds @member at the end of the project's members (and of @floor's). On a floor, its length
 * becomes the distance between its ends.
 *
 * Returns: (transfer full) (nullable): the command, or %NULL when the mark is empty or taken,
 *   the member shorter than 50 mm or its length not positive; @member is freed then.
 */
TrbEditCommand *
trb_edit_add_member (TrbProject  *project,
                     TrbFloor    *floor,
                     TrbMember   *member,
                     GError     **error)
{
  g_autoptr(TrbMember) m = member;
  TrbEditCommand *c;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);
  g_return_val_if_fail (floor == NULL || g_ptr_array_find (project->floors, floor, NULL), NULL);

  if (!check_mark (project, m->id, error))
    return NULL;
  if (floor != NULL)
    {
      if (!check_placement (m->id, &m->start, &m->end, error))
        return NULL;
      trb_member_set_plan (m, m->start, m->end);
    }
  else if (!(m->length > 0 && isfinite (m->length)))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s: the length must be positive", m->id);
      return NULL;
    }

  c = command_new (&add_member_class, project, g_strdup_printf ("Add %s", m->id));
  c->u.member.floor = floor;
  c->u.member.project_index = project->members->len;
  c->u.member.floor_index = floor != NULL ? floor->members->len : 0;
  c->u.member.member = g_steal_pointer (&m);
  return c;
}

/**
 * trb_edit_remove_member:
 * @project: a project
 * @member: one of its members
 * @error: return location for a #GError
 *
 * Returns: (transfer full): the command that takes @member out of the project and its floor.
 */
TrbEditCommand *
trb_edit_remove_member (TrbProject  *project,
                        TrbMember   *member,
                        GError     **error)
{
  TrbEditCommand *c;
  guint pi, fi = 0;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!g_ptr_array_find (project->members, member, &pi))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND,
                   "member %s is not in the project", mark_of (member));
      return NULL;
    }
  if (member->floor != NULL && !g_ptr_array_find (member->floor->members, member, &fi))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND,
                   "member %s is not on its floor", mark_of (member));
      return NULL;
    }

  c = command_new (&remove_member_class, project, g_strdup_printf ("Remove %s", member->id));
  c->u.member.floor = member->floor;
  c->u.member.member = member;
  c->u.member.project_index = pi;
  c->u.member.floor_index = fi;
  return c;
}

/* ---- move ------------------------------------------------------------------------------------ */

static void
move_swap (TrbEditCommand *c)
{
  TrbMember *m = c->u.move.member;
  TrbFramePoint s = m->start, e = m->end;
  double l = m->length;

  m->start = c->u.move.start;
  m->end = c->u.move.end;
  m->length = c->u.move.length;
  c->u.move.start = s;
  c->u.move.end = e;
  c->u.move.length = l;
}

static const CommandClass move_class = { move_swap, move_swap, NULL };

/**
 * trb_edit_move_member:
 * @project: a project
 * @member: a member of one of its floors
 * @start: its new start in plan, m
 * @end: its new end in plan, m
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command that places @member from @start to @end
 *   (its length follows), or %NULL when it would be shorter than 50 mm.
 */
TrbEditCommand *
trb_edit_move_member (TrbProject           *project,
                      TrbMember            *member,
                      const TrbFramePoint  *start,
                      const TrbFramePoint  *end,
                      GError              **error)
{
  TrbEditCommand *c;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (start != NULL && end != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (member->floor == NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s is not placed on a floor", mark_of (member));
      return NULL;
    }
  if (!check_placement (mark_of (member), start, end, error))
    return NULL;

  c = command_new (&move_class, project, g_strdup_printf ("Move %s", member->id));
  c->u.move.member = member;
  c->u.move.start = *start;
  c->u.move.end = *end;
  c->u.move.length = hypot (end->x - start->x, end->y - start->y);
  return c;
}

/* ---- attributes ------------------------------------------------------------------------------ */

typedef enum
{
  FIELD_TEXT,
  FIELD_CHOICE,
  FIELD_NUMBER,
} FieldType;

typedef struct
{
  FieldType   type;
  const char *name;    /* for the command's label */
  gsize       offset;  /* into TrbMember; unused for the special cases */
  gboolean    optional;
} FieldInfo;

#define TEXT(f, n, opt)   { FIELD_TEXT, n, G_STRUCT_OFFSET (TrbMember, f), opt }
#define CHOICE(f, n)      { FIELD_CHOICE, n, G_STRUCT_OFFSET (TrbMember, f), FALSE }
#define NUMBER(f, n, opt) { FIELD_NUMBER, n, G_STRUCT_OFFSET (TrbMember, f), opt }

/* Indexed by TrbMemberField. */
static const FieldInfo fields[] = {
  TEXT (id, "mark", FALSE),
  TEXT (section, "section", FALSE),
  TEXT (steel_grade, "steel grade", TRUE),
  TEXT (species, "species", TRUE),
  TEXT (grade, "grade", TRUE),
  TEXT (group, "group", TRUE),
  CHOICE (material, "material"),
  CHOICE (role, "role"),
  CHOICE (bracing, "bracing"),
  CHOICE (method, "design method"),
  CHOICE (max_plies, "most plies"),
  CHOICE (carries_deck, "deck bearing"),
  CHOICE (wet_service, "wet service"),
  CHOICE (incised, "incising"),
  CHOICE (repetitive, "repetitive use"),
  NUMBER (length, "length", FALSE),
  NUMBER (deflection_live, "live-load deflection limit", TRUE),
  NUMBER (deflection_total, "total-load deflection limit", TRUE),
  NUMBER (fb_allow, "allowable bending stress", TRUE),
  NUMBER (fv_allow, "allowable shear stress", TRUE),
  NUMBER (max_depth, "greatest depth", TRUE),
  NUMBER (min_depth, "least depth", TRUE),
  NUMBER (bearing_length, "bearing length", TRUE),
  NUMBER (E, "E", TRUE),
  NUMBER (I, "I", TRUE),
  NUMBER (S, "S", TRUE),
  NUMBER (A, "A", TRUE),
  NUMBER (d, "depth", TRUE),
  NUMBER (tw, "web thickness", TRUE),
  NUMBER (weight, "self-weight", TRUE),
};

G_STATIC_ASSERT (G_N_ELEMENTS (fields) == TRB_MEMBER_FIELD_WEIGHT + 1);

#undef TEXT
#undef CHOICE
#undef NUMBER

static int
choice_get (const TrbMember *m,
            TrbMemberField   field)
{
  const guint8 *base = (const guint8 *) m;

  switch (field)
    {
    case TRB_MEMBER_FIELD_METHOD:
      return m->has_method ? (int) m->method : -1;
    case TRB_MEMBER_FIELD_MATERIAL:
      return m->material;
    case TRB_MEMBER_FIELD_ROLE:
      return m->role;
    case TRB_MEMBER_FIELD_BRACING:
      return m->bracing;
    default:
      /* gboolean and int fields */
      return *(const int *) (base + fields[field].offset);
    }
}

static void
choice_set (TrbMember      *m,
            TrbMemberField  field,
            int             value)
{
  guint8 *base = (guint8 *) m;

  switch (field)
    {
    case TRB_MEMBER_FIELD_METHOD:
      /* the method stays as it was when unset, so that it swaps back bit for bit */
      m->has_method = value >= 0;
      if (value >= 0)
        m->method = value;
      break;
    case TRB_MEMBER_FIELD_MATERIAL:
      m->material = value;
      break;
    case TRB_MEMBER_FIELD_ROLE:
      m->role = value;
      break;
    case TRB_MEMBER_FIELD_BRACING:
      m->bracing = value;
      break;
    default:
      *(int *) (base + fields[field].offset) = value;
      break;
    }
}

static void
set_swap (TrbEditCommand *c)
{
  TrbMember *m = c->u.set.member;
  TrbMemberField field = c->u.set.field;
  guint8 *base = (guint8 *) m;

  switch (fields[field].type)
    {
    case FIELD_TEXT:
      {
        char **slot = (char **) (base + fields[field].offset);
        char *old = *slot;

        if (field == TRB_MEMBER_FIELD_ID)
          index_remove (c->project, m);
        *slot = c->u.set.text;
        c->u.set.text = old;
        if (field == TRB_MEMBER_FIELD_ID)
          index_add (c->project, m);
      }
      break;

    case FIELD_CHOICE:
      {
        int old = choice_get (m, field);

        if (field == TRB_MEMBER_FIELD_METHOD)
          {
            /* keep the whole pair, has_method and method, so undo restores both exactly */
            gboolean had = m->has_method;
            TrbMethod method = m->method;

            m->has_method = c->u.set.choice >= 0;
            m->method = c->u.set.choice >= 0 ? (TrbMethod) c->u.set.choice
                                             : (TrbMethod) c->u.set.number;
            c->u.set.choice = had ? (int) method : -1;
            c->u.set.number = method;
          }
        else
          {
            choice_set (m, field, c->u.set.choice);
            c->u.set.choice = old;
          }
      }
      break;

    case FIELD_NUMBER:
      {
        double *slot = (double *) (base + fields[field].offset);
        double old = *slot;

        *slot = c->u.set.number;
        c->u.set.number = old;
      }
      break;
    }
}

static void
set_clear (TrbEditCommand *c)
{
  g_free (c->u.set.text);
}

static const CommandClass set_class = { set_swap, set_swap, set_clear };

static TrbEditCommand *
set_command_new (TrbProject     *project,
                 TrbMember      *member,
                 TrbMemberField  field,
                 char           *label)
{
  TrbEditCommand *c = command_new (&set_class, project, label);

  c->u.set.member = member;
  c->u.set.field = field;
  return c;
}

static gboolean
check_member_field (TrbProject      *project,
                    TrbMember       *member,
                    TrbMemberField   field,
                    FieldType        type,
                    GError         **error)
{
  g_return_val_if_fail (field <= TRB_MEMBER_FIELD_WEIGHT, FALSE);
  g_return_val_if_fail (fields[field].type == type, FALSE);

  if (!g_ptr_array_find (project->members, member, NULL))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND,
                   "member %s is not in the project", mark_of (member));
      return FALSE;
    }
  return TRUE;
}

static gboolean
section_known (const TrbProject *project,
               const char       *section)
{
  if (g_strcmp0 (section, "auto") == 0 || g_strcmp0 (section, "custom") == 0)
    return TRUE;
  if (project->sections != NULL && trb_catalog_lookup (project->sections, section) != NULL)
    return TRUE;
  return trb_catalog_lookup (trb_catalog_get_default (), section) != NULL;
}

/**
 * trb_edit_set_member_text:
 * @project: a project
 * @member: one of its members
 * @field: a text field (the mark, section, steel grade, species, grade or group)
 * @value: (nullable): the new text; %NULL clears an optional field
 * @error: return location for a #GError
 *
 * The mark must be unique and the section one of the catalog's or the project's (or "auto",
 * "custom").
 *
 * Returns: (transfer full) (nullable): the command, or %NULL when the value is not allowed.
 */
TrbEditCommand *
trb_edit_set_member_text (TrbProject      *project,
                          TrbMember       *member,
                          TrbMemberField   field,
                          const char      *value,
                          GError         **error)
{
  TrbEditCommand *c;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_member_field (project, member, field, FIELD_TEXT, error))
    return NULL;
  if (value == NULL && !fields[field].optional)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s: the %s cannot be empty", mark_of (member), fields[field].name);
      return NULL;
    }
  if (value != NULL && !g_utf8_validate (value, -1, NULL))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s: the %s is not valid text", mark_of (member), fields[field].name);
      return NULL;
    }
  if (field == TRB_MEMBER_FIELD_ID && g_strcmp0 (value, member->id) != 0
      && !check_mark (project, value, error))
    return NULL;
  if (field == TRB_MEMBER_FIELD_SECTION && !section_known (project, value))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND,
                   "member %s: no section %s in the catalog", mark_of (member), value);
      return NULL;
    }

  c = set_command_new (project, member, field,
                       field == TRB_MEMBER_FIELD_ID
                       ? g_strdup_printf ("Rename %s to %s", mark_of (member), value)
                       : g_strdup_printf ("Change %s of %s", fields[field].name,
                                          mark_of (member)));
  c->u.set.text = g_strdup (value);
  return c;
}

/**
 * trb_edit_assign_section:
 * @project: a project
 * @member: one of its members
 * @section: a designation from the catalog or the project's sections, "auto" or "custom"
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command that gives @member the section (the
 *   shortlist's choice), or %NULL for an unknown designation.
 */
TrbEditCommand *
trb_edit_assign_section (TrbProject  *project,
                         TrbMember   *member,
                         const char  *section,
                         GError     **error)
{
  TrbEditCommand *c;

  g_return_val_if_fail (section != NULL, NULL);

  c = trb_edit_set_member_text (project, member, TRB_MEMBER_FIELD_SECTION, section, error);
  if (c != NULL)
    {
      g_free (c->label);
      c->label = g_strdup_printf ("Assign %s to %s", section, mark_of (member));
    }
  return c;
}

/**
 * trb_edit_set_member_choice:
 * @project: a project
 * @member: one of its members
 * @field: a choice field: material, role, bracing, method (-1: the project's), most plies
 *   (0: no limit), or a yes/no field (0 or 1)
 * @value: the new value
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command, or %NULL for a value out of range.
 */
TrbEditCommand *
trb_edit_set_member_choice (TrbProject      *project,
                            TrbMember       *member,
                            TrbMemberField   field,
                            int              value,
                            GError         **error)
{
  TrbEditCommand *c;
  int lo = 0, hi = 1;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_member_field (project, member, field, FIELD_CHOICE, error))
    return NULL;

  switch (field)
    {
    case TRB_MEMBER_FIELD_MATERIAL:
      hi = TRB_MATERIAL_CUSTOM;
      break;
    case TRB_MEMBER_FIELD_ROLE:
      hi = TRB_FRAME_ROLE_JOIST;
      break;
    case TRB_MEMBER_FIELD_BRACING:
      hi = TRB_BRACING_POINTS;
      break;
    case TRB_MEMBER_FIELD_METHOD:
      lo = -1;
      hi = TRB_METHOD_ALLOWABLE;
      break;
    case TRB_MEMBER_FIELD_MAX_PLIES:
      /* built-up members of more than four plies are not in the catalog (docs/catalog.md) */
      hi = 4;
      break;
    default:
      break;
    }
  if (value < lo || value > hi)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s: %d is not a valid %s", mark_of (member), value,
                   fields[field].name);
      return NULL;
    }

  c = set_command_new (project, member, field,
                       g_strdup_printf ("Change %s of %s", fields[field].name, mark_of (member)));
  c->u.set.choice = value;
  /* the method that goes with has_method FALSE: keep the member's own, for exact undo */
  c->u.set.number = member->method;
  return c;
}

/**
 * trb_edit_set_member_number:
 * @project: a project
 * @member: one of its members
 * @field: a number field, SI
 * @value: the new value; %NAN clears an optional field
 * @error: return location for a #GError
 *
 * Lengths, stresses and section properties must be positive, deflection limits positive or 0
 * (no limit), the self-weight 0 or more; the length only belongs to standalone beams.
 *
 * Returns: (transfer full) (nullable): the command, or %NULL for a value out of range.
 */
TrbEditCommand *
trb_edit_set_member_number (TrbProject      *project,
                            TrbMember       *member,
                            TrbMemberField   field,
                            double           value,
                            GError         **error)
{
  TrbEditCommand *c;
  gboolean ok;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_member_field (project, member, field, FIELD_NUMBER, error))
    return NULL;

  if (isnan (value))
    ok = fields[field].optional;
  else if (!isfinite (value))
    ok = FALSE;
  else if (field == TRB_MEMBER_FIELD_DEFLECTION_LIVE || field == TRB_MEMBER_FIELD_DEFLECTION_TOTAL
           || field == TRB_MEMBER_FIELD_WEIGHT)
    ok = value >= 0;
  else
    ok = value > 0;

  if (!ok)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   isnan (value) ? "member %s: the %s is required"
                                 : "member %s: the %s must be positive",
                   mark_of (member), fields[field].name);
      return NULL;
    }
  if (field == TRB_MEMBER_FIELD_LENGTH && member->floor != NULL)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s: its length is the distance between its ends; move an end",
                   mark_of (member));
      return NULL;
    }
  if (isnan (value) && trb_member_is_custom (member)
      && (field == TRB_MEMBER_FIELD_E || field == TRB_MEMBER_FIELD_I))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "member %s: a custom section needs E and I", mark_of (member));
      return NULL;
    }

  c = set_command_new (project, member, field,
                       g_strdup_printf ("Change %s of %s", fields[field].name, mark_of (member)));
  c->u.set.number = value;
  return c;
}

/* ---- a member's own arrays --------------------------------------------------------------- */

static GArray *
member_array (TrbMember      *m,
              TrbMemberArray  list)
{
  switch (list)
    {
    case TRB_MEMBER_ARRAY_SUPPORTS:
      return m->supports;
    case TRB_MEMBER_ARRAY_LOADS:
      return m->loads;
    case TRB_MEMBER_ARRAY_BRACES:
      return m->braces;
    case TRB_MEMBER_ARRAY_BEARING_POINTS:
      return m->bearing_points;
    default:
      g_assert_not_reached ();
    }
}

static void
element_insert (TrbEditCommand *c)
{
  GArray *a = member_array (c->u.element.member, c->u.element.list);

  g_array_insert_vals (a, c->u.element.index, &c->u.element.element, 1);
}

static void
element_take_out (TrbEditCommand *c)
{
  GArray *a = member_array (c->u.element.member, c->u.element.list);
  guint size = g_array_get_element_size (a);

  memcpy (&c->u.element.element, a->data + (gsize) c->u.element.index * size, size);
  g_array_remove_index (a, c->u.element.index);
}

static const CommandClass insert_element_class = { element_insert, element_take_out, NULL };
static const CommandClass remove_element_class = { element_take_out, element_insert, NULL };

static const char * const list_names[] = { "support", "load", "brace", "bearing point" };

static gboolean
within (double x,
        double length)
{
  /* the loader's tolerance for positions at the ends (trb-beam.h: 1e-10 L) */
  double eps = 1e-10 * length;

  return isfinite (x) && x >= -eps && x <= length + eps;
}

static gboolean
check_element (const TrbMember      *m,
               TrbMemberArray        list,
               const MemberElement  *e,
               GError              **error)
{
  double L = m->length;
  gboolean ok = TRUE;

  switch (list)
    {
    case TRB_MEMBER_ARRAY_SUPPORTS:
      ok = within (e->support.support.x, L) && e->support.support.type <= TRB_SUPPORT_FIXED;
      break;
    case TRB_MEMBER_ARRAY_LOADS:
      {
        const TrbLoad *l = &e->load.load;

        ok = e->load.lcase < TRB_N_CASES && within (l->a, L) && isfinite (l->w1);
        if (ok && (l->kind == TRB_LOAD_UNIFORM || l->kind == TRB_LOAD_LINEAR))
          ok = within (l->b, L) && l->b > l->a;
        if (ok && l->kind == TRB_LOAD_LINEAR)
          ok = isfinite (l->w2);
        if (l->kind > TRB_LOAD_MOMENT)
          ok = FALSE;
      }
      break;
    case TRB_MEMBER_ARRAY_BRACES:
      ok = within (e->brace.x, L);
      break;
    case TRB_MEMBER_ARRAY_BEARING_POINTS:
      ok = isfinite (e->point.x) && isfinite (e->point.y);
      break;
    }
  if (!ok)
    g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "member %s: the %s is off the member",
                 mark_of (m), list_names[list]);
  return ok;
}

/**
 * trb_edit_insert_member_element:
 * @project: a project
 * @member: one of its members
 * @list: which of its arrays
 * @index: where to insert; -1 for the end (braces go where their x sorts them)
 * @element: a #TrbMemberSupport, #TrbMemberLoad, #TrbMemberBrace or #TrbFramePoint
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command, or %NULL for a support, load or brace off
 *   the member.
 */
TrbEditCommand *
trb_edit_insert_member_element (TrbProject     *project,
                                TrbMember      *member,
                                TrbMemberArray  list,
                                int             index,
                                gconstpointer   element,
                                GError        **error)
{
  TrbEditCommand *c;
  MemberElement e = { 0 };
  GArray *a;
  guint size;

  g_return_val_if_fail (project != NULL && member != NULL && element != NULL, NULL);
  g_return_val_if_fail (list <= TRB_MEMBER_ARRAY_BEARING_POINTS, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  a = member_array (member, list);
  size = g_array_get_element_size (a);
  g_return_val_if_fail (size <= sizeof e, NULL);
  g_return_val_if_fail (index >= -1 && index <= (int) a->len, NULL);

  if (!g_ptr_array_find (project->members, member, NULL))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND,
                   "member %s is not in the project", mark_of (member));
      return NULL;
    }
  memcpy (&e, element, size);
  if (!check_element (member, list, &e, error))
    return NULL;

  if (list == TRB_MEMBER_ARRAY_BRACES)
    {
      /* the model keeps braces sorted by x */
      index = 0;
      while ((guint) index < a->len && g_array_index (a, TrbMemberBrace, index).x <= e.brace.x)
        index++;
    }
  else if (index < 0)
    index = a->len;

  c = command_new (&insert_element_class, project,
                   g_strdup_printf ("Add a %s to %s", list_names[list], mark_of (member)));
  c->u.element.member = member;
  c->u.element.list = list;
  c->u.element.index = index;
  c->u.element.element = e;
  return c;
}

/**
 * trb_edit_remove_member_element:
 * @project: a project
 * @member: one of its members
 * @list: which of its arrays
 * @index: the element to remove
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command, or %NULL when @index is out of range.
 */
TrbEditCommand *
trb_edit_remove_member_element (TrbProject     *project,
                                TrbMember      *member,
                                TrbMemberArray  list,
                                guint           index,
                                GError        **error)
{
  TrbEditCommand *c;
  GArray *a;

  g_return_val_if_fail (project != NULL && member != NULL, NULL);
  g_return_val_if_fail (list <= TRB_MEMBER_ARRAY_BEARING_POINTS, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  a = member_array (member, list);
  if (!g_ptr_array_find (project->members, member, NULL) || index >= a->len)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND, "member %s has no %s %u",
                   mark_of (member), list_names[list], index + 1);
      return NULL;
    }

  c = command_new (&remove_element_class, project,
                   g_strdup_printf ("Remove a %s from %s", list_names[list], mark_of (member)));
  c->u.element.member = member;
  c->u.element.list = list;
  c->u.element.index = index;
  return c;
}

/* ---- floor items ----------------------------------------------------------------------------- */

static const char * const item_names[] = {
  "grid line", "column", "wall", "area load", "opening", "line load", "point load",
};

/**
 * trb_edit_floor_items:
 * @floor: a floor
 * @kind: which of its items
 *
 * Returns: (transfer none): the floor's array of that kind.
 */
GPtrArray *
trb_edit_floor_items (TrbFloor         *floor,
                      TrbFloorItemKind  kind)
{
  g_return_val_if_fail (floor != NULL, NULL);

  switch (kind)
    {
    case TRB_FLOOR_ITEM_GRID:
      return floor->grids;
    case TRB_FLOOR_ITEM_COLUMN:
      return floor->columns;
    case TRB_FLOOR_ITEM_WALL:
      return floor->walls;
    case TRB_FLOOR_ITEM_AREA_LOAD:
      return floor->area_loads;
    case TRB_FLOOR_ITEM_OPENING:
      return floor->openings;
    case TRB_FLOOR_ITEM_LINE_LOAD:
      return floor->line_loads;
    case TRB_FLOOR_ITEM_POINT_LOAD:
      return floor->point_loads;
    default:
      g_return_val_if_reached (NULL);
    }
}

static GArray *
points_copy (const GArray *from)
{
  GArray *to = g_array_sized_new (FALSE, TRUE, sizeof (TrbFramePoint), from->len);

  g_array_append_vals (to, from->data, from->len);
  return to;
}

static void
points_replace (GArray       **slot,
                const GArray  *from)
{
  g_array_unref (*slot);
  *slot = points_copy (from);
}

/**
 * trb_edit_floor_item_copy:
 * @kind: what @item is
 * @item: a #TrbGridLine, #TrbColumn, ... of that kind
 *
 * Returns: (transfer full): a deep copy, to change and hand to trb_edit_replace_floor_item().
 */
gpointer
trb_edit_floor_item_copy (TrbFloorItemKind kind,
                          gconstpointer    item)
{
  g_return_val_if_fail (item != NULL, NULL);

  switch (kind)
    {
    case TRB_FLOOR_ITEM_GRID:
      {
        const TrbGridLine *g = item;
        TrbGridLine *n = trb_grid_line_new (g->name, g->start, g->end);

        n->line = g->line;
        return n;
      }
    case TRB_FLOOR_ITEM_COLUMN:
      {
        const TrbColumn *col = item;
        TrbColumn *n = trb_column_new (col->id, col->at, col->section);

        n->line = col->line;
        return n;
      }
    case TRB_FLOOR_ITEM_WALL:
      {
        const TrbWall *w = item;
        TrbWall *n = trb_wall_new (w->id, w->material);

        points_replace (&n->points, w->points);
        n->line = w->line;
        return n;
      }
    case TRB_FLOOR_ITEM_AREA_LOAD:
      {
        const TrbAreaLoad *a = item;
        TrbAreaLoad *n = trb_area_load_new (a->lcase, a->kind, a->pressure, a->label,
                                            a->occupancy);

        points_replace (&n->points, a->points);
        n->line = a->line;
        return n;
      }
    case TRB_FLOOR_ITEM_OPENING:
      {
        const TrbOpening *o = item;
        TrbOpening *n = trb_opening_new ();

        points_replace (&n->points, o->points);
        n->line = o->line;
        return n;
      }
    case TRB_FLOOR_ITEM_LINE_LOAD:
      {
        const TrbLineLoad *l = item;
        TrbLineLoad *n = trb_line_load_new (l->lcase, l->w, l->label);

        points_replace (&n->points, l->points);
        n->line = l->line;
        return n;
      }
    case TRB_FLOOR_ITEM_POINT_LOAD:
      {
        const TrbPointLoad *p = item;
        TrbPointLoad *n = trb_point_load_new (p->lcase, p->P, p->at, p->label);

        n->line = p->line;
        return n;
      }
    default:
      g_return_val_if_reached (NULL);
    }
}

/**
 * trb_edit_floor_item_free:
 * @kind: what @item is
 * @item: (nullable): a grid line, column, wall, area load, opening, line or point load
 */
void
trb_edit_floor_item_free (TrbFloorItemKind kind,
                          gpointer         item)
{
  switch (kind)
    {
    case TRB_FLOOR_ITEM_GRID:
      trb_grid_line_free (item);
      break;
    case TRB_FLOOR_ITEM_COLUMN:
      trb_column_free (item);
      break;
    case TRB_FLOOR_ITEM_WALL:
      trb_wall_free (item);
      break;
    case TRB_FLOOR_ITEM_AREA_LOAD:
      trb_area_load_free (item);
      break;
    case TRB_FLOOR_ITEM_OPENING:
      trb_opening_free (item);
      break;
    case TRB_FLOOR_ITEM_LINE_LOAD:
      trb_line_load_free (item);
      break;
    case TRB_FLOOR_ITEM_POINT_LOAD:
      trb_point_load_free (item);
      break;
    default:
      g_return_if_reached ();
    }
}

static gboolean
check_points (const GArray  *points,
              guint          least,
              const char    *what,
              GError       **error)
{
  if (points == NULL || points->len < least)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "a %s needs %u points or more",
                   what, least);
      return FALSE;
    }
  for (guint i = 0; i < points->len; i++)
    if (!check_point (&g_array_index (points, TrbFramePoint, i), what, error))
      return FALSE;
  return TRUE;
}

/* Whether the item may stand on the floor, in place of old when old is not NULL. */
static gboolean
check_floor_item (TrbProject        *project,
                  TrbFloor          *floor,
                  TrbFloorItemKind   kind,
                  gconstpointer      item,
                  gconstpointer      old,
                  GError           **error)
{
  switch (kind)
    {
    case TRB_FLOOR_ITEM_GRID:
      {
        const TrbGridLine *g = item;
        const TrbGridLine *other;

        if (g->name == NULL || *g->name == '\0')
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "a grid line needs a name");
            return FALSE;
          }
        other = trb_floor_find_grid (floor, g->name);
        if (other != NULL && other != old)
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "there is already a grid line %s", g->name);
            return FALSE;
          }
        if (!check_point (&g->start, g->name, error) || !check_point (&g->end, g->name, error))
          return FALSE;
        if (!(hypot (g->end.x - g->start.x, g->end.y - g->start.y) > 0))
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "grid line %s has no length", g->name);
            return FALSE;
          }
        return TRUE;
      }
    case TRB_FLOOR_ITEM_COLUMN:
      {
        const TrbColumn *col = item;
        const TrbColumn *other;

        if (col->id == NULL || *col->id == '\0')
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "a column needs a mark");
            return FALSE;
          }
        other = trb_project_find_column (project, col->id, NULL);
        if (other != NULL && other != old)
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "there is already a column %s", col->id);
            return FALSE;
          }
        return check_point (&col->at, col->id, error);
      }
    case TRB_FLOOR_ITEM_WALL:
      {
        const TrbWall *w = item;
        const TrbWall *other;

        if (w->id == NULL || *w->id == '\0')
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "a wall needs a mark");
            return FALSE;
          }
        other = trb_project_find_wall (project, w->id, NULL);
        if (other != NULL && other != old)
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "there is already a wall %s", w->id);
            return FALSE;
          }
        return check_points (w->points, 2, "wall", error);
      }
    case TRB_FLOOR_ITEM_AREA_LOAD:
      {
        const TrbAreaLoad *a = item;

        if (!isfinite (a->pressure) || a->lcase >= TRB_N_CASES)
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "an area load needs a finite pressure and a load case");
            return FALSE;
          }
        return check_points (a->points, 3, "area load", error);
      }
    case TRB_FLOOR_ITEM_OPENING:
      return check_points (((const TrbOpening *) item)->points, 3, "opening", error);
    case TRB_FLOOR_ITEM_LINE_LOAD:
      {
        const TrbLineLoad *l = item;

        if (!isfinite (l->w) || l->lcase >= TRB_N_CASES)
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "a line load needs a finite value and a load case");
            return FALSE;
          }
        return check_points (l->points, 2, "line load", error);
      }
    case TRB_FLOOR_ITEM_POINT_LOAD:
      {
        const TrbPointLoad *p = item;

        if (!isfinite (p->P) || p->lcase >= TRB_N_CASES)
          {
            g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                         "a point load needs a finite value and a load case");
            return FALSE;
          }
        return check_point (&p->at, "point load", error);
      }
    default:
      g_return_val_if_reached (FALSE);
    }
}

static char *
item_label (const char       *verb,
            TrbFloorItemKind  kind,
            gconstpointer     item)
{
  const char *mark = NULL;

  if (kind == TRB_FLOOR_ITEM_COLUMN)
    mark = ((const TrbColumn *) item)->id;
  else if (kind == TRB_FLOOR_ITEM_WALL)
    mark = ((const TrbWall *) item)->id;
  else if (kind == TRB_FLOOR_ITEM_GRID)
    mark = ((const TrbGridLine *) item)->name;

  if (mark != NULL)
    return g_strdup_printf ("%s %s %s", verb, item_names[kind], mark);
  return g_strdup_printf ("%s %s %s", verb, strchr ("aeiou", item_names[kind][0]) ? "an" : "a",
                          item_names[kind]);
}

static void
item_insert (TrbEditCommand *c)
{
  g_ptr_array_insert (trb_edit_floor_items (c->u.item.floor, c->u.item.kind),
                      c->u.item.index, c->u.item.item);
}

static void
item_take_out (TrbEditCommand *c)
{
  gpointer taken;

  /* steal: the floor's array would free it; the command keeps it for undo */
  taken = g_ptr_array_steal_index (trb_edit_floor_items (c->u.item.floor, c->u.item.kind),
                                   c->u.item.index);
  g_assert (taken == c->u.item.item);
}

static void
item_clear (TrbEditCommand *c)
{
  gboolean out = (c->klass->apply == item_insert) != c->applied;

  if (out)
    trb_edit_floor_item_free (c->u.item.kind, c->u.item.item);
}

static void
item_swap (TrbEditCommand *c)
{
  GPtrArray *a = trb_edit_floor_items (c->u.item.floor, c->u.item.kind);
  gpointer in_floor = g_ptr_array_index (a, c->u.item.index);

  a->pdata[c->u.item.index] = c->u.item.item;
  c->u.item.item = in_floor;
}

static void
item_swap_clear (TrbEditCommand *c)
{
  /* whichever of the two is not on the floor */
  trb_edit_floor_item_free (c->u.item.kind, c->u.item.item);
}

static const CommandClass add_item_class = { item_insert, item_take_out, item_clear };
static const CommandClass remove_item_class = { item_take_out, item_insert, item_clear };
static const CommandClass replace_item_class = { item_swap, item_swap, item_swap_clear };

static gboolean
check_floor (TrbProject  *project,
             TrbFloor    *floor,
             GError     **error)
{
  if (!g_ptr_array_find (project->floors, floor, NULL))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND, "the floor is not in the project");
      return FALSE;
    }
  return TRUE;
}

/**
 * trb_edit_add_floor_item:
 * @project: a project
 * @floor: one of its floors
 * @kind: what @item is
 * @item: (transfer full): a new grid line, column, wall, area load, opening, line or point load
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command that adds @item at the end of its kind's
 *   array, or %NULL (and @item freed) when a mark is empty or taken, a coordinate not finite,
 *   or a polygon or polyline has too few points.
 */
TrbEditCommand *
trb_edit_add_floor_item (TrbProject        *project,
                         TrbFloor          *floor,
                         TrbFloorItemKind   kind,
                         gpointer           item,
                         GError           **error)
{
  TrbEditCommand *c;

  g_return_val_if_fail (project != NULL && floor != NULL && item != NULL, NULL);
  g_return_val_if_fail (kind <= TRB_FLOOR_ITEM_POINT_LOAD, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_floor (project, floor, error)
      || !check_floor_item (project, floor, kind, item, NULL, error))
    {
      trb_edit_floor_item_free (kind, item);
      return NULL;
    }

  c = command_new (&add_item_class, project, item_label ("Add", kind, item));
  c->u.item.floor = floor;
  c->u.item.kind = kind;
  c->u.item.item = item;
  c->u.item.index = trb_edit_floor_items (floor, kind)->len;
  return c;
}

/**
 * trb_edit_remove_floor_item:
 * @project: a project
 * @floor: one of its floors
 * @kind: what @item is
 * @item: an item of @floor
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command that takes @item off the floor.
 */
TrbEditCommand *
trb_edit_remove_floor_item (TrbProject        *project,
                            TrbFloor          *floor,
                            TrbFloorItemKind   kind,
                            gpointer           item,
                            GError           **error)
{
  TrbEditCommand *c;
  guint index;

  g_return_val_if_fail (project != NULL && floor != NULL && item != NULL, NULL);
  g_return_val_if_fail (kind <= TRB_FLOOR_ITEM_POINT_LOAD, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_floor (project, floor, error))
    return NULL;
  if (!g_ptr_array_find (trb_edit_floor_items (floor, kind), item, &index))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND, "the %s is not on the floor",
                   item_names[kind]);
      return NULL;
    }

  c = command_new (&remove_item_class, project, item_label ("Remove", kind, item));
  c->u.item.floor = floor;
  c->u.item.kind = kind;
  c->u.item.item = item;
  c->u.item.index = index;
  return c;
}

/**
 * trb_edit_replace_floor_item:
 * @project: a project
 * @floor: one of its floors
 * @kind: what the items are
 * @old_item: an item of @floor
 * @new_item: (transfer full): what takes its place (from trb_edit_floor_item_copy(), changed)
 * @error: return location for a #GError
 *
 * Moving a column, changing a load's value or a wall's points: the new item takes the old
 * one's place in the array, and the command keeps the old one for undo.
 *
 * Returns: (transfer full) (nullable): the command, or %NULL (and @new_item freed) when the
 *   new item may not stand there.
 */
TrbEditCommand *
trb_edit_replace_floor_item (TrbProject        *project,
                             TrbFloor          *floor,
                             TrbFloorItemKind   kind,
                             gpointer           old_item,
                             gpointer           new_item,
                             GError           **error)
{
  TrbEditCommand *c;
  guint index;

  g_return_val_if_fail (project != NULL && floor != NULL, NULL);
  g_return_val_if_fail (old_item != NULL && new_item != NULL && old_item != new_item, NULL);
  g_return_val_if_fail (kind <= TRB_FLOOR_ITEM_POINT_LOAD, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_floor (project, floor, error))
    {
      trb_edit_floor_item_free (kind, new_item);
      return NULL;
    }
  if (!g_ptr_array_find (trb_edit_floor_items (floor, kind), old_item, &index))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_NOT_FOUND, "the %s is not on the floor",
                   item_names[kind]);
      trb_edit_floor_item_free (kind, new_item);
      return NULL;
    }
  if (!check_floor_item (project, floor, kind, new_item, old_item, error))
    {
      trb_edit_floor_item_free (kind, new_item);
      return NULL;
    }

  c = command_new (&replace_item_class, project, item_label ("Change", kind, old_item));
  c->u.item.floor = floor;
  c->u.item.kind = kind;
  c->u.item.item = new_item;
  c->u.item.index = index;
  return c;
}

/* ---- settings -------------------------------------------------------------------------------- */

static void
settings_swap (TrbEditCommand *c)
{
  TrbSettings s = c->project->settings;

  c->project->settings = c->u.settings;
  c->u.settings = s;
}

static void
settings_clear (TrbEditCommand *c)
{
  trb_settings_clear (&c->u.settings);
}

static const CommandClass settings_class = { settings_swap, settings_swap, settings_clear };

/**
 * trb_edit_set_settings:
 * @project: a project
 * @settings: the project's new settings (copied; its line is kept from the project)
 * @error: return location for a #GError
 *
 * Returns: (transfer full) (nullable): the command, or %NULL for a deflection limit below 0 or
 *   an allowable stress that is not positive.
 */
TrbEditCommand *
trb_edit_set_settings (TrbProject         *project,
                       const TrbSettings  *settings,
                       GError            **error)
{
  TrbEditCommand *c;

  g_return_val_if_fail (project != NULL && settings != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!(settings->deflection_live >= 0 && isfinite (settings->deflection_live))
      || !(settings->deflection_total >= 0 && isfinite (settings->deflection_total)))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "a deflection limit must be L/n with n positive, or none");
      return NULL;
    }
  if ((!isnan (settings->fb_allow) && !(settings->fb_allow > 0 && isfinite (settings->fb_allow)))
      || (!isnan (settings->fv_allow)
          && !(settings->fv_allow > 0 && isfinite (settings->fv_allow))))
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "an allowable stress must be positive");
      return NULL;
    }
  if (settings->method > TRB_METHOD_ALLOWABLE || settings->units > TRB_UNIT_SYSTEM_SI
      || settings->floors_above < 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "a setting is out of range");
      return NULL;
    }

  c = command_new (&settings_class, project, g_strdup ("Change project settings"));
  c->u.settings = *settings;
  c->u.settings.steel_grade = g_strdup (settings->steel_grade);
  c->u.settings.line = project->settings.line;
  return c;
}

/* ---- a copy to solve on ------------------------------------------------------------------ */

static GArray *
array_copy (const GArray *from)
{
  GArray *to = g_array_sized_new (FALSE, TRUE, g_array_get_element_size ((GArray *) from),
                                  from->len);

  g_array_append_vals (to, from->data, from->len);
  return to;
}

/* Every field by value, then a fresh copy of everything the member owns. */
static TrbMember *
member_copy (const TrbMember *m,
             TrbFloor        *floor)
{
  TrbMember *c = g_new (TrbMember, 1);

  *c = *m;
  c->id = g_strdup (m->id);
  c->section = g_strdup (m->section);
  c->supports = array_copy (m->supports);
  c->loads = array_copy (m->loads);
  c->steel_grade = g_strdup (m->steel_grade);
  c->braces = array_copy (m->braces);
  c->allowed = g_strdupv (m->allowed);
  c->species = g_strdup (m->species);
  c->grade = g_strdup (m->grade);
  c->floor = floor;
  c->group = g_strdup (m->group);
  c->bearing_points = array_copy (m->bearing_points);
  return c;
}

static void
items_copy (GPtrArray        *to,
            const GPtrArray  *from,
            TrbFloorItemKind  kind)
{
  for (guint i = 0; i < from->len; i++)
    g_ptr_array_add (to, trb_edit_floor_item_copy (kind, g_ptr_array_index ((GPtrArray *) from,
                                                                            i)));
}

/**
 * trb_edit_project_copy:
 * @project: a project
 *
 * A copy of the whole project, member for member and item for item in the same order, for
 * solving in another thread while the editor goes on changing the original. It borrows
 * @project's own section catalog (nothing edits a catalog), so free it with
 * trb_edit_project_copy_free() while @project lives. Far cheaper than saving and loading:
 * no text is written or parsed.
 *
 * Returns: (transfer full): the copy.
 */
TrbProject *
trb_edit_project_copy (const TrbProject *project)
{
  g_autoptr(GHashTable) floors = g_hash_table_new (NULL, NULL);
  TrbProject *c;

  g_return_val_if_fail (project != NULL, NULL);

  c = trb_project_new ();
  c->format = project->format;
  c->name = g_strdup (project->name);
  trb_settings_clear (&c->settings);
  c->settings = project->settings;
  c->settings.steel_grade = g_strdup (project->settings.steel_grade);
  c->sections = project->sections;
  for (guint i = 0; i < project->sections_sources->len; i++)
    {
      const TrbSectionsSource *s = g_ptr_array_index (project->sections_sources, i);

      trb_project_add_sections_source (c, s->file, s->csv, s->line);
    }

  for (guint f = 0; f < project->floors->len; f++)
    {
      const TrbFloor *from = g_ptr_array_index (project->floors, f);
      TrbFloor *to = trb_floor_new (from->name);

      to->line = from->line;
      items_copy (to->grids, from->grids, TRB_FLOOR_ITEM_GRID);
      items_copy (to->columns, from->columns, TRB_FLOOR_ITEM_COLUMN);
      items_copy (to->walls, from->walls, TRB_FLOOR_ITEM_WALL);
      items_copy (to->area_loads, from->area_loads, TRB_FLOOR_ITEM_AREA_LOAD);
      items_copy (to->openings, from->openings, TRB_FLOOR_ITEM_OPENING);
      items_copy (to->line_loads, from->line_loads, TRB_FLOOR_ITEM_LINE_LOAD);
      items_copy (to->point_loads, from->point_loads, TRB_FLOOR_ITEM_POINT_LOAD);
      trb_project_add_floor (c, to);
      g_hash_table_insert (floors, (gpointer) from, to);
    }

  /* the members in the project's order; each floor's in that floor's order */
  {
    g_autoptr(GHashTable) copies = g_hash_table_new (NULL, NULL);

    g_ptr_array_set_size (c->members, 0);
    for (guint i = 0; i < project->members->len; i++)
      {
        const TrbMember *m = g_ptr_array_index (project->members, i);
        TrbMember *copy = member_copy (m, m->floor != NULL
                                          ? g_hash_table_lookup (floors, m->floor) : NULL);

        g_ptr_array_add (c->members, copy);
        g_hash_table_insert (copies, (gpointer) m, copy);
      }
    for (guint f = 0; f < project->floors->len; f++)
      {
        const TrbFloor *from = g_ptr_array_index (project->floors, f);
        TrbFloor *to = g_ptr_array_index (c->floors, f);

        for (guint i = 0; i < from->members->len; i++)
          g_ptr_array_add (to->members, g_hash_table_lookup (copies,
                                                             g_ptr_array_index (from->members,
                                                                                i)));
      }
  }
  return c;
}

/**
 * trb_edit_project_copy_free:
 * @copy: (transfer full): a copy from trb_edit_project_copy()
 *
 * Frees the copy, but not the catalog it borrows.
 */
void
trb_edit_project_copy_free (TrbProject *copy)
{
  if (copy == NULL)
    return;
  copy->sections = NULL;
  trb_project_free (copy);
}

/* ---- snapping -------------------------------------------------------------------------------- */

static double
distance (const TrbFramePoint *a,
          const TrbFramePoint *b)
{
  return hypot (a->x - b->x, a->y - b->y);
}

/* The point of the segment a-b nearest to p. */
static TrbFramePoint
nearest_on_segment (const TrbFramePoint *p,
                    const TrbFramePoint *a,
                    const TrbFramePoint *b)
{
  double dx = b->x - a->x, dy = b->y - a->y;
  double len2 = dx * dx + dy * dy;
  double t = len2 > 0 ? ((p->x - a->x) * dx + (p->y - a->y) * dy) / len2 : 0;
  TrbFramePoint q;

  t = CLAMP (t, 0.0, 1.0);
  q.x = a->x + t * dx;
  q.y = a->y + t * dy;
  return q;
}

/* Where the lines through a-b and c-d cross; FALSE when they are parallel. */
static gboolean
line_crossing (const TrbFramePoint *a,
               const TrbFramePoint *b,
               const TrbFramePoint *c,
               const TrbFramePoint *d,
               TrbFramePoint       *out)
{
  double rx = b->x - a->x, ry = b->y - a->y;
  double sx = d->x - c->x, sy = d->y - c->y;
  double den = rx * sy - ry * sx;
  double t;

  if (fabs (den) <= 1e-12 * hypot (rx, ry) * hypot (sx, sy))
    return FALSE;
  t = ((c->x - a->x) * sy - (c->y - a->y) * sx) / den;
  out->x = a->x + t * rx;
  out->y = a->y + t * ry;
  return TRUE;
}

static void
consider (TrbSnap             *best,
          double              *best_d,
          TrbSnapKind          kind,
          const TrbFramePoint *q,
          gconstpointer        object,
          const TrbFramePoint *p)
{
  double d = distance (p, q);

  if (d < *best_d)
    {
      *best_d = d;
      best->kind = kind;
      best->point = *q;
      best->object = object;
    }
}

/**
 * trb_edit_snap:
 * @floor: the floor drawn on
 * @point: the point under the pointer, m
 * @options: what to snap to
 * @snap: (out): where the point lands and on what
 *
 * Points win over lines and lines over the drawing grid, since an end placed on a column or
 * another member's end is what the engineer means when the pointer is near one: within
 * @options->radius, the nearest column, member end or crossing of two grid lines; failing
 * that, the nearest point on a member's line or a wall; failing that, the nearest
 * intersection of the drawing grid. A pure function: the canvas tests nothing itself.
 *
 * Returns: %TRUE when the point snapped to something.
 */
gboolean
trb_edit_snap (const TrbFloor       *floor,
               const TrbFramePoint  *point,
               const TrbSnapOptions *options,
               TrbSnap              *snap)
{
  double best_d;

  g_return_val_if_fail (floor != NULL && point != NULL && options != NULL, FALSE);
  g_return_val_if_fail (snap != NULL, FALSE);

  snap->kind = TRB_SNAP_NONE;
  snap->point = *point;
  snap->object = NULL;

  if (options->objects && options->radius > 0)
    {
      best_d = options->radius;
      for (guint i = 0; i < floor->columns->len; i++)
        {
          const TrbColumn *c = g_ptr_array_index (floor->columns, i);

          consider (snap, &best_d, TRB_SNAP_COLUMN, &c->at, c, point);
        }
      for (guint i = 0; i < floor->members->len; i++)
        {
          const TrbMember *m = g_ptr_array_index (floor->members, i);

          if (m == options->skip)
            continue;
          consider (snap, &best_d, TRB_SNAP_END, &m->start, m, point);
          consider (snap, &best_d, TRB_SNAP_END, &m->end, m, point);
        }
      for (guint i = 0; i < floor->grids->len; i++)
        for (guint j = i + 1; j < floor->grids->len; j++)
          {
            const TrbGridLine *g = g_ptr_array_index (floor->grids, i);
            const TrbGridLine *h = g_ptr_array_index (floor->grids, j);
            TrbFramePoint x;

            if (line_crossing (&g->start, &g->end, &h->start, &h->end, &x))
              consider (snap, &best_d, TRB_SNAP_GRID_CROSSING, &x, NULL, point);
          }
      if (snap->kind != TRB_SNAP_NONE)
        return TRUE;

      for (guint i = 0; i < floor->members->len; i++)
        {
          const TrbMember *m = g_ptr_array_index (floor->members, i);
          TrbFramePoint q;

          if (m == options->skip)
            continue;
          q = nearest_on_segment (point, &m->start, &m->end);
          consider (snap, &best_d, TRB_SNAP_ON_MEMBER, &q, m, point);
        }
      for (guint i = 0; i < floor->walls->len; i++)
        {
          const TrbWall *w = g_ptr_array_index (floor->walls, i);

          for (guint k = 0; k + 1 < w->points->len; k++)
            {
              TrbFramePoint q = nearest_on_segment (point,
                                                    &g_array_index (w->points, TrbFramePoint, k),
                                                    &g_array_index (w->points, TrbFramePoint,
                                                                    k + 1));

              consider (snap, &best_d, TRB_SNAP_ON_WALL, &q, w, point);
            }
        }
      if (snap->kind != TRB_SNAP_NONE)
        return TRUE;
    }

  if (options->grid > 0 && isfinite (options->grid))
    {
      snap->kind = TRB_SNAP_GRID;
      snap->point.x = round (point->x / options->grid) * options->grid;
      snap->point.y = round (point->y / options->grid) * options->grid;
      return TRUE;
    }
  return FALSE;
}

/* ---- groups ---------------------------------------------------------------------------------- */

static void
group_apply (TrbEditCommand *c)
{
  for (guint i = 0; i < c->u.children->len; i++)
    command_apply (g_ptr_array_index (c->u.children, i));
}

static void
group_revert (TrbEditCommand *c)
{
  for (guint i = c->u.children->len; i-- > 0;)
    command_revert (g_ptr_array_index (c->u.children, i));
}

static void
group_clear (TrbEditCommand *c)
{
  /* later children were made against the state the earlier ones left: free them last first */
  if (c->u.children != NULL)
    while (c->u.children->len > 0)
      trb_edit_command_free (g_ptr_array_steal_index (c->u.children, c->u.children->len - 1));
  g_clear_pointer (&c->u.children, g_ptr_array_unref);
}

static const CommandClass group_class = { group_apply, group_revert, group_clear };

static TrbEditCommand *
group_new (TrbProject *project,
           char       *label)
{
  TrbEditCommand *c = command_new (&group_class, project, label);

  c->u.children = g_ptr_array_new ();
  return c;
}

/**
 * trb_edit_add_joist_run:
 * @project: a project
 * @floor: the floor of both supports
 * @support_a: the member the joists start on
 * @support_b: the member they end on, parallel to @support_a
 * @spec: spacing, starting end, offset, template, group and mark prefix (trb-layout.h)
 * @error: return location for a #GError
 *
 * The joists trb_layout_joist_run() would lay out, each an ordinary new member with the next
 * free mark, as one command, so that the run is undone and redone in one step.
 *
 * Returns: (transfer full) (nullable): the command, or %NULL when the layout refuses the
 *   supports or the spacing.
 */
TrbEditCommand *
trb_edit_add_joist_run (TrbProject             *project,
                        TrbFloor               *floor,
                        const TrbMember        *support_a,
                        const TrbMember        *support_b,
                        const TrbJoistRunSpec  *spec,
                        GError                **error)
{
  g_autoptr(GArray) lines = NULL;
  g_autofree char *group = NULL;
  g_autofree char *first = NULL;
  g_autofree char *last = NULL;
  TrbEditCommand *run;
  const char *prefix;
  guint counter = 0;

  g_return_val_if_fail (project != NULL && floor != NULL && spec != NULL, NULL);
  g_return_val_if_fail (support_a != NULL && support_b != NULL, NULL);
  g_return_val_if_fail (error == NULL || *error == NULL, NULL);

  if (!check_floor (project, floor, error))
    return NULL;
  if (support_a->floor != floor || support_b->floor != floor)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID,
                   "a joist run rests on two members of its own floor");
      return NULL;
    }
  lines = trb_layout_preview (support_a, support_b, spec, error);
  if (lines == NULL)
    return NULL;
  if (lines->len == 0)
    {
      g_set_error (error, TRB_ERROR, TRB_ERROR_INVALID, "no joist fits between %s and %s",
                   mark_of (support_a), mark_of (support_b));
      return NULL;
    }

  group = spec->group != NULL ? g_strdup (spec->group) : trb_layout_next_group (project);
  prefix = spec->prefix != NULL ? spec->prefix : "J";
  run = group_new (project, NULL);
  for (guint i = 0; i < lines->len; i++)
    {
      const TrbLayoutLine *line = &g_array_index (lines, TrbLayoutLine, i);
      g_autofree char *mark = trb_project_next_mark (project, prefix, &counter);
      TrbMember *m = trb_member_new (mark);
      TrbEditCommand *c;

      if (spec->template != NULL)
        trb_member_copy_design (m, spec->template);
      trb_member_set_role (m, TRB_FRAME_ROLE_JOIST);
      m->group = g_strdup (group);
      trb_member_set_plan (m, line->start, line->end);
      c = trb_edit_add_member (project, floor, m, error);
      if (c == NULL)
        {
          trb_edit_command_free (run);
          return NULL;
        }
      /* made before any of them is applied: each goes after the ones before it */
      c->u.member.project_index += i;
      c->u.member.floor_index += i;
      g_ptr_array_add (run->u.children, c);
      if (i == 0)
        first = g_strdup (mark);
      g_free (last);
      last = g_strdup (mark);
    }
  run->label = lines->len == 1 ? g_strdup_printf ("Lay out joist %s", first)
                               : g_strdup_printf ("Lay out joists %s to %s", first, last);
  return run;
}

/* ---- history --------------------------------------------------------------------------------- */

struct _TrbEditHistory
{
  TrbProject     *project;
  GPtrArray      *undo;      /* TrbEditCommand, oldest first, all applied */
  GPtrArray      *redo;      /* TrbEditCommand, next to redo last, all reverted */
  TrbEditCommand *group;     /* open group, applied children; NULL when none */
  guint64         serial;    /* of the last command made */
  guint64         saved;     /* serial of the top of undo when saved; 0: the start */
};

/* No command ever has this serial: the saved state can no longer be reached. */
#define SAVED_UNREACHABLE G_MAXUINT64

/**
 * trb_edit_history_new:
 * @project: the project the commands change; it must outlive the history
 *
 * Returns: (transfer full): an empty history, not modified.
 */
TrbEditHistory *
trb_edit_history_new (TrbProject *project)
{
  TrbEditHistory *h;

  g_return_val_if_fail (project != NULL, NULL);

  h = g_new0 (TrbEditHistory, 1);
  h->project = project;
  /* no free function: commands are freed newest first, by commands_free() */
  h->undo = g_ptr_array_new ();
  h->redo = g_ptr_array_new ();
  return h;
}

/* Empties a stack, freeing the newest command first: the undo stack holds the oldest at its
 * bottom, the redo stack the newest. */
static void
commands_free (GPtrArray *commands,
               gboolean   bottom_is_newest)
{
  if (bottom_is_newest)
    for (guint i = 0; i < commands->len; i++)
      trb_edit_command_free (g_ptr_array_index (commands, i));
  else
    for (guint i = commands->len; i-- > 0;)
      trb_edit_command_free (g_ptr_array_index (commands, i));
  g_ptr_array_set_size (commands, 0);
}

/**
 * trb_edit_history_free:
 * @history: (nullable): a history
 *
 * Frees the history and its commands, newest first. The project stays as it is; free the
 * history before the project, since its commands may hold members taken out of it.
 */
void
trb_edit_history_free (TrbEditHistory *history)
{
  if (history == NULL)
    return;
  g_clear_pointer (&history->group, trb_edit_command_free);
  commands_free (history->redo, TRUE);
  commands_free (history->undo, FALSE);
  g_ptr_array_unref (history->redo);
  g_ptr_array_unref (history->undo);
  g_free (history);
}

/**
 * trb_edit_history_get_project:
 * @history: a history
 *
 * Returns: (transfer none): the project its commands change.
 */
TrbProject *
trb_edit_history_get_project (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, NULL);
  return history->project;
}

static guint64
top_serial (TrbEditHistory *h)
{
  if (h->undo->len == 0)
    return 0;
  return ((TrbEditCommand *) g_ptr_array_index (h->undo, h->undo->len - 1))->serial;
}

static void
clear_redo (TrbEditHistory *h)
{
  for (guint i = 0; i < h->redo->len; i++)
    if (((TrbEditCommand *) g_ptr_array_index (h->redo, i))->serial == h->saved)
      h->saved = SAVED_UNREACHABLE;
  commands_free (h->redo, TRUE);
}

/**
 * trb_edit_history_push:
 * @history: a history
 * @command: (transfer full): a command made against the project as it is now
 *
 * Applies @command and records it (in the open group, if any). Anything that could be redone
 * is forgotten.
 */
void
trb_edit_history_push (TrbEditHistory *history,
                       TrbEditCommand *command)
{
  g_return_if_fail (history != NULL && command != NULL);
  g_return_if_fail (command->project == history->project);
  g_return_if_fail (!command->applied);

  command_apply (command);
  if (history->group != NULL)
    {
      g_ptr_array_add (history->group->u.children, command);
      return;
    }
  command->serial = ++history->serial;
  clear_redo (history);
  g_ptr_array_add (history->undo, command);
}

/**
 * trb_edit_history_begin_group:
 * @history: a history
 * @label: what the group does as one step ("Lay out joists J1 to J12")
 *
 * The commands pushed until trb_edit_history_end_group() are applied as they come and undone
 * and redone as one. Groups do not nest.
 */
void
trb_edit_history_begin_group (TrbEditHistory *history,
                              const char     *label)
{
  g_return_if_fail (history != NULL && label != NULL);
  g_return_if_fail (history->group == NULL);

  history->group = group_new (history->project, g_strdup (label));
  /* the children are applied as they are pushed */
  history->group->applied = TRUE;
}

/**
 * trb_edit_history_end_group:
 * @history: a history with an open group
 *
 * Records the group as one step (nothing, when it is empty); what could be redone is
 * forgotten.
 */
void
trb_edit_history_end_group (TrbEditHistory *history)
{
  TrbEditCommand *group;

  g_return_if_fail (history != NULL);
  g_return_if_fail (history->group != NULL);

  group = g_steal_pointer (&history->group);
  if (group->u.children->len == 0)
    {
      trb_edit_command_free (group);
      return;
    }
  group->serial = ++history->serial;
  clear_redo (history);
  g_ptr_array_add (history->undo, group);
}

/**
 * trb_edit_history_cancel_group:
 * @history: a history with an open group
 *
 * Reverts what the open group has done and forgets it: the project is as it was at
 * trb_edit_history_begin_group().
 */
void
trb_edit_history_cancel_group (TrbEditHistory *history)
{
  TrbEditCommand *group;

  g_return_if_fail (history != NULL);
  g_return_if_fail (history->group != NULL);

  group = g_steal_pointer (&history->group);
  command_revert (group);
  trb_edit_command_free (group);
}

/**
 * trb_edit_history_can_undo:
 * @history: a history
 *
 * Returns: whether there is a step to undo (never while a group is open).
 */
gboolean
trb_edit_history_can_undo (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, FALSE);
  return history->group == NULL && history->undo->len > 0;
}

/**
 * trb_edit_history_can_redo:
 * @history: a history
 *
 * Returns: whether there is an undone step to redo (never while a group is open).
 */
gboolean
trb_edit_history_can_redo (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, FALSE);
  return history->group == NULL && history->redo->len > 0;
}

/**
 * trb_edit_history_get_undo_label:
 * @history: a history
 *
 * Returns: (nullable): what undo would take back ("Move B3"), or %NULL.
 */
const char *
trb_edit_history_get_undo_label (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, NULL);
  if (history->undo->len == 0)
    return NULL;
  return trb_edit_command_get_label (g_ptr_array_index (history->undo, history->undo->len - 1));
}

/**
 * trb_edit_history_get_redo_label:
 * @history: a history
 *
 * Returns: (nullable): what redo would do again, or %NULL.
 */
const char *
trb_edit_history_get_redo_label (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, NULL);
  if (history->redo->len == 0)
    return NULL;
  return trb_edit_command_get_label (g_ptr_array_index (history->redo, history->redo->len - 1));
}

/**
 * trb_edit_history_get_n_undo:
 * @history: a history
 *
 * Returns: how many steps can be undone.
 */
guint
trb_edit_history_get_n_undo (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, 0);
  return history->undo->len;
}

/**
 * trb_edit_history_get_n_redo:
 * @history: a history
 *
 * Returns: how many undone steps can be redone.
 */
guint
trb_edit_history_get_n_redo (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, 0);
  return history->redo->len;
}

/**
 * trb_edit_history_undo:
 * @history: a history
 *
 * Returns: %TRUE if a command was undone; %FALSE when there is none (or a group is open).
 */
gboolean
trb_edit_history_undo (TrbEditHistory *history)
{
  TrbEditCommand *c;

  g_return_val_if_fail (history != NULL, FALSE);

  if (!trb_edit_history_can_undo (history))
    return FALSE;
  c = g_ptr_array_steal_index (history->undo, history->undo->len - 1);
  command_revert (c);
  g_ptr_array_add (history->redo, c);
  return TRUE;
}

/**
 * trb_edit_history_redo:
 * @history: a history
 *
 * Returns: %TRUE if a step was redone; %FALSE when there is none (or a group is open).
 */
gboolean
trb_edit_history_redo (TrbEditHistory *history)
{
  TrbEditCommand *c;

  g_return_val_if_fail (history != NULL, FALSE);

  if (!trb_edit_history_can_redo (history))
    return FALSE;
  c = g_ptr_array_steal_index (history->redo, history->redo->len - 1);
  command_apply (c);
  g_ptr_array_add (history->undo, c);
  return TRUE;
}

/**
 * trb_edit_history_mark_saved:
 * @history: a history
 *
 * Records that the project as it is now is what was saved; undoing or redoing away from it
 * makes the history modified, and coming back makes it unmodified again.
 */
void
trb_edit_history_mark_saved (TrbEditHistory *history)
{
  g_return_if_fail (history != NULL);
  history->saved = top_serial (history);
}

/**
 * trb_edit_history_is_modified:
 * @history: a history
 *
 * Returns: whether the project differs from what was last saved (or, never saved, from what
 *   the history started with).
 */
gboolean
trb_edit_history_is_modified (TrbEditHistory *history)
{
  g_return_val_if_fail (history != NULL, FALSE);
  return history->group != NULL || top_serial (history) != history->saved;
}
