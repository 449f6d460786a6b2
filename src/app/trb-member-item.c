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
  char       *section;
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
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

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

/**
 * trb_member_item_new:
 * @member: a member
 * @result: (nullable): its result, or %NULL before the first solve
 *
 * Returns: (transfer full): a row that copies what it shows, so that it stays valid after the
 *   results are replaced.
 */
TrbMemberItem *
trb_member_item_new (TrbMember             *member,
                     const TrbMemberResult *result)
{
  TrbMemberItem *self = g_object_new (TRB_TYPE_MEMBER_ITEM, NULL);

  self->member = member;
  self->ratio = NAN;
  self->status = TRB_STATUS_NOT_DESIGNED;
  self->status_class = "none";
  if (result != NULL)
    {
      self->has_result = TRUE;
      self->status = result->status;
      self->ratio = result->ratio;
      self->governing = g_strdup (result->governing);
      if (result->section[0] != '\0')
        self->section = trb_member_is_auto (member)
                        ? g_strdup_printf ("%s (auto)", result->section)
                        : g_strdup (result->section);
      switch (trb_render_status_of (result))
        {
        case TRB_RENDER_STATUS_OK:
          self->status_class = "ok";
          break;
        case TRB_RENDER_STATUS_NEAR:
          self->status_class = "near";
          break;
        case TRB_RENDER_STATUS_FAIL:
          self->status_class = "fail";
          break;
        case TRB_RENDER_STATUS_NONE:
        default:
          self->status_class = "none";
          break;
        }
    }
  if (self->section == NULL)
    self->section = g_strdup (member->section);
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
  return self->member->id;
}

const char *
trb_member_item_get_role (TrbMemberItem *self)
{
  g_return_val_if_fail (TRB_IS_MEMBER_ITEM (self), NULL);
  return self->member->floor != NULL ? trb_role_label (self->member->role) : _("Beam");
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

static void
trb_member_item_finalize (GObject *object)
{
  TrbMemberItem *self = TRB_MEMBER_ITEM (object);

  g_free (self->section);
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
  g_object_class_install_properties (object_class, N_PROPS, properties);
}

static void
trb_member_item_init (TrbMemberItem *self)
{
}
