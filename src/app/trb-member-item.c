/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <glib/gi18n.h>
#include <math.h>

#include "trb-member-item.h"
#include "trb-render-style.h"

struct _TrbMemberItem
{
  GObject     parent_instance;

  TrbMember  *member;       /* not owned: the project outlives the list's rows */
  char       *mark;
  const char *role;
  /* the member's own strings as they were at the last update: an edit replaces them
   * (trb-edit swaps in new ones), so a changed pointer says the row needs updating */
  const char *member_id;
  const char *member_section;
  TrbFrameRole member_role;
  char       *section;      /* as shown: "W12X26", "W12X26 (auto)" */
  char       *designation;  /* the section it names */
  gboolean    sized;        /* chosen by the program */
  TrbStatus   status;
  gboolean    has_result;
  double      ratio;        /* NAN when nothing was checked */
  char       *governing;
  const char *status_class;
};

G_DEFINE_FINAL_TYPE (TrbMemberItem, trb_member_item, G_TYPE_OBJECT)

enum {
  PROP_0,
  PROP_MARK,
  PROP_ROLE,
  PROP_SECTION,
  PROP_STATUS,
  PROP_RATIO,
  PROP_GOVERNING,
  PROP_FLOOR,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

enum {
  CHANGED,
  N_SIGNALS
};

static guint signals[N_SIGNALS];

const char *
trb_role_label (TrbFrameRole role)
{
  switch (role)
    {
    case TRB_FRAME_ROLE_GIRDER:
      return _("Girder");
    case TRB_FRAME_ROLE_JOIST:
      return _("Joist");
    case TRB_FRAME_ROLE_BEAM:
    default:
      return _("Beam");
    }
}

const char *
trb_status_label (TrbStatus status)
{
  switch (status)
    {
    case TRB_STATUS_PASS:
      return _("Passes");
    case TRB_STATUS_FAIL:
      return _("Fails");
    case TRB_STATUS_UNSTABLE:
      return _("Unstable");
    case TRB_STATUS_UNSUPPORTED:
      return _("Unsupported");
    case TRB_STATUS_NOT_DESIGNED:
      return _("Not designed");
    case TRB_STATUS_ERROR:
    default:
      return _("Error");
    }
}

static const char *
status_class_of (const TrbMemberResult *result)
{
  switch (trb_render_status_of (result))
    {
    case TRB_RENDER_STATUS_OK:
      return "ok";
    case TRB_RENDER_STATUS_NEAR:
      return "near";
    case TRB_RENDER_STATUS_FAIL:
      return "fail";
    case TRB_RENDER_STATUS_NONE:
    default:
      return "none";
    }
}

/**
 * trb_member_item_update:
 * @self: a row
 * @result: (nullable): its member's result, or %NULL before the first solve
 *
 * Takes in the member as it is now and its result (the row copies what it shows, so that it
 * stays valid after the results are replaced), and emits ::changed if anything it shows has.
 *
 * Returns: whether anything changed.
 */
gboolean
trb_member_item_update (TrbMemberItem         *self,
                        const TrbMemberResult *result)
{
  TrbMember *m;
  const char *designation;
  const char *role;
  gboolean sized;
  gboolean changed;

  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), FALSE);

  /* compared before anything is made: this runs for every row after every edit */
  m = self->member;
  role = m->floor != NULL ? trb_role_label (m->role) : _("Beam");
  sized = result != NULL && result->section[0] != '\0' && trb_member_is_auto (m);
  designation = result != NULL && result->section[0] != '\0' ? result->section : m->section;

  changed = g_strcmp0 (self->mark, m->id) != 0
            || self->role != role
            || g_strcmp0 (self->designation, designation) != 0
            || self->sized != sized
            || self->has_result != (result != NULL);
  if (result != NULL && !changed)
    changed = self->status != result->status
              || !(self->ratio == result->ratio || (isnan (self->ratio) && isnan (result->ratio)))
              || g_strcmp0 (self->governing, result->governing) != 0
              || self->status_class != status_class_of (result);
  self->member_id = m->id;
  self->member_section = m->section;
  self->member_role = m->role;
  if (!changed)
    return FALSE;

  g_free (self->mark);
  self->mark = g_strdup (m->id);
  self->role = role;
  g_free (self->designation);
  self->designation = g_strdup (designation);
  self->sized = sized;
  g_free (self->section);
  self->section = sized ? g_strdup_printf ("%s (auto)", designation) : g_strdup (designation);
  g_clear_pointer (&self->governing, g_free);
  self->has_result = result != NULL;
  self->status = result != NULL ? result->status : TRB_STATUS_NOT_DESIGNED;
  self->ratio = result != NULL ? result->ratio : NAN;
  self->governing = result != NULL ? g_strdup (result->governing) : NULL;
  self->status_class = result != NULL ? status_class_of (result) : "none";
  g_signal_emit (self, signals[CHANGED], 0);
  return TRUE;
}

/**
 * trb_member_item_is_stale:
 * @self: a row
 *
 * Returns: whether an edit may have changed its member's mark, section or role since the
 *   last update; a pointer comparison, for the thousands of rows an edit leaves alone.
 */
gboolean
trb_member_item_is_stale (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), TRUE);

  return self->member_id != self->member->id || self->member_section != self->member->section
         || self->member_role != self->member->role;
}

/**
 * trb_member_item_new:
 * @member: a member
 * @result: (nullable): its result, or %NULL before the first solve
 *
 * Returns: (transfer full): the member's row.
 */
TrbMemberItem *
trb_member_item_new (TrbMember             *member,
                     const TrbMemberResult *result)
{
  TrbMemberItem *self = g_object_new (TRB_TYPE_MEMBER_ITEM, NULL);

  self->member = member;
  self->ratio = NAN;
  self->status_class = "none";
  trb_member_item_update (self, result);
  return self;
}

TrbMember *
trb_member_item_get_member (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->member;
}

const char *
trb_member_item_get_mark (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->mark;
}

const char *
trb_member_item_get_role (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->role;
}

const char *
trb_member_item_get_section (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->section;
}

const char *
trb_member_item_get_status (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->has_result ? trb_status_label (self->status) : _("Not solved");
}

/**
 * trb_member_item_get_status_class:
 * @self: a row
 *
 * Returns: "ok", "near", "fail" or "none": the status colour of the plan's ramp.
 */
const char *
trb_member_item_get_status_class (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->status_class;
}

double
trb_member_item_get_ratio (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NAN);
  return self->ratio;
}

/* The floor's name, read from the member: no edit renames a floor. Empty for a standalone
 * beam. */
const char *
trb_member_item_get_floor (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->member->floor != NULL && self->member->floor->name != NULL
           ? self->member->floor->name : "";
}

const char *
trb_member_item_get_governing (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->governing != NULL ? self->governing : "";
}

/**
 * trb_member_item_get_failing:
 * @self: a row
 *
 * Returns: %TRUE for a member that needs the engineer: it fails a check, or could not be
 *   analysed or designed.
 */
gboolean
trb_member_item_get_failing (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), FALSE);
  return self->has_result && self->status != TRB_STATUS_PASS;
}

/**
 * trb_member_item_describe:
 * @self: a row
 *
 * The row in words, for the plan's tooltip and screen readers, so that a member's status
 * never rests on its colour: "G1, W12X14, Passes, ratio 0.87"; without the ratio when
 * nothing was checked.
 *
 * Returns: (transfer full): the text
 */
char *
trb_member_item_describe (TrbMemberItem *self)
{
  const char *section;

  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);

  section = self->section != NULL ? self->section : "";
  if (isnan (self->ratio))
    /* Translators: a member in words: its mark, its section and its status */
    return g_strdup_printf (_("%s, %s, %s"), self->mark, section,
                            trb_member_item_get_status (self));
  /* Translators: a member in words: its mark, its section, its status and its utilization
   * ratio (demand over capacity) */
  return g_strdup_printf (_("%s, %s, %s, ratio %.2f"), self->mark, section,
                          trb_member_item_get_status (self), self->ratio);
}

static void
trb_member_item_finalize (GObject *object)
{
  TrbMemberItem *self = TRB_MEMBER_ITEM (object);

  g_free (self->mark);
  g_free (self->section);
  g_free (self->designation);
  g_free (self->governing);

  G_OBJECT_CLASS (trb_member_item_parent_class)->finalize (object);
}

static void
trb_member_item_get_property (GObject    *object,
                              guint       prop_id,
                              GValue     *value,
                              GParamSpec *pspec)
{
  TrbMemberItem *self = TRB_MEMBER_ITEM (object);

  switch (prop_id)
    {
    case PROP_MARK:
      g_value_set_string (value, trb_member_item_get_mark (self));
      break;
    case PROP_ROLE:
      g_value_set_string (value, trb_member_item_get_role (self));
      break;
    case PROP_SECTION:
      g_value_set_string (value, self->section);
      break;
    case PROP_STATUS:
      g_value_set_string (value, trb_member_item_get_status (self));
      break;
    case PROP_RATIO:
      /* sorts unchecked members below every checked one */
      g_value_set_double (value, isnan (self->ratio) ? -1.0 : self->ratio);
      break;
    case PROP_GOVERNING:
      g_value_set_string (value, trb_member_item_get_governing (self));
      break;
    case PROP_FLOOR:
      g_value_set_string (value, trb_member_item_get_floor (self));
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
trb_member_item_class_init (TrbMemberItemClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = trb_member_item_finalize;
  object_class->get_property = trb_member_item_get_property;

  properties[PROP_MARK] =
    g_param_spec_string ("mark", NULL, NULL, NULL, G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_ROLE] =
    g_param_spec_string ("role", NULL, NULL, NULL, G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_SECTION] =
    g_param_spec_string ("section", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_STATUS] =
    g_param_spec_string ("status", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_RATIO] =
    g_param_spec_double ("ratio", NULL, NULL, -1, G_MAXDOUBLE, -1,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_GOVERNING] =
    g_param_spec_string ("governing", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  properties[PROP_FLOOR] =
    g_param_spec_string ("floor", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS);
  g_object_class_install_properties (object_class, N_PROPS, properties);

  /**
   * TrbMemberItem::changed:
   *
   * Something the row shows has changed (trb_member_item_update()).
   */
  signals[CHANGED] =
    g_signal_new ("changed", G_TYPE_FROM_CLASS (klass), G_SIGNAL_RUN_LAST, 0, NULL, NULL, NULL,
                  G_TYPE_NONE, 0);
}

static void
trb_member_item_init (TrbMemberItem *self)
{
}
