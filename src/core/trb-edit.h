/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-layout.h"
#include "trb-model.h"

G_BEGIN_DECLS

/* Every change to a project as an undoable command, and the history that holds them.
 *
 * A command is made against the project as it is now: its constructor checks the change
 * (a unique mark, a positive length, an index in range) and returns NULL with a TRB_ERROR when
 * the change is not allowed, so bad input never reaches the model. trb_edit_history_push()
 * then applies it. Undo and redo only ever run a command on the state it was made for, so they
 * cannot fail, and undoing everything gives back the model exactly as it was, down to the
 * order of every array.
 *
 * Objects taken out of the project (a removed member, a replaced column) are kept by the
 * command that took them out, so pointers to members stay valid across undo and redo. */

typedef struct _TrbEditCommand TrbEditCommand;
typedef struct _TrbEditHistory TrbEditHistory;

/* The member attributes a command can set, by their type: text (NULL clears the optional
 * ones), a choice (an enum or a boolean) or a number (SI; NAN clears the optional ones). */
typedef enum
{
  /* text */
  TRB_MEMBER_FIELD_ID,               /* the mark; unique in the project, never NULL */
  TRB_MEMBER_FIELD_SECTION,          /* a designation, "auto" or "custom"; never NULL */
  TRB_MEMBER_FIELD_STEEL_GRADE,
  TRB_MEMBER_FIELD_SPECIES,
  TRB_MEMBER_FIELD_GRADE,
  TRB_MEMBER_FIELD_GROUP,
  /* choices */
  TRB_MEMBER_FIELD_MATERIAL,         /* TrbMaterial */
  TRB_MEMBER_FIELD_ROLE,             /* TrbFrameRole */
  TRB_MEMBER_FIELD_BRACING,          /* TrbBracing */
  TRB_MEMBER_FIELD_METHOD,           /* TrbMethod, or -1 for the project's */
  TRB_MEMBER_FIELD_MAX_PLIES,        /* 0 for no limit */
  TRB_MEMBER_FIELD_CARRIES_DECK,     /* booleans */
  TRB_MEMBER_FIELD_WET_SERVICE,
  TRB_MEMBER_FIELD_INCISED,
  TRB_MEMBER_FIELD_REPETITIVE,
  /* numbers */
  TRB_MEMBER_FIELD_LENGTH,           /* m, > 0; standalone beams only (a floor member's length
                                      * is the distance between its ends) */
  TRB_MEMBER_FIELD_DEFLECTION_LIVE,  /* n of L/n; 0 for none; NAN for the project's */
  TRB_MEMBER_FIELD_DEFLECTION_TOTAL,
  TRB_MEMBER_FIELD_FB_ALLOW,         /* Pa */
  TRB_MEMBER_FIELD_FV_ALLOW,
  TRB_MEMBER_FIELD_MAX_DEPTH,        /* m */
  TRB_MEMBER_FIELD_MIN_DEPTH,
  TRB_MEMBER_FIELD_BEARING_LENGTH,
  TRB_MEMBER_FIELD_E,                /* custom section properties, SI */
  TRB_MEMBER_FIELD_I,
  TRB_MEMBER_FIELD_S,
  TRB_MEMBER_FIELD_A,
  TRB_MEMBER_FIELD_D,
  TRB_MEMBER_FIELD_TW,
  TRB_MEMBER_FIELD_WEIGHT,           /* N/m */
} TrbMemberField;

/* The things placed on a floor besides its members. */
typedef enum
{
  TRB_FLOOR_ITEM_GRID,               /* TrbGridLine */
  TRB_FLOOR_ITEM_COLUMN,             /* TrbColumn */
  TRB_FLOOR_ITEM_WALL,               /* TrbWall */
  TRB_FLOOR_ITEM_AREA_LOAD,          /* TrbAreaLoad */
  TRB_FLOOR_ITEM_OPENING,            /* TrbOpening */
  TRB_FLOOR_ITEM_LINE_LOAD,          /* TrbLineLoad */
  TRB_FLOOR_ITEM_POINT_LOAD,         /* TrbPointLoad */
} TrbFloorItemKind;

/* What a member's own arrays hold (standalone beams and extra bearing points). */
typedef enum
{
  TRB_MEMBER_ARRAY_SUPPORTS,          /* TrbMemberSupport */
  TRB_MEMBER_ARRAY_LOADS,             /* TrbMemberLoad */
  TRB_MEMBER_ARRAY_BRACES,            /* TrbMemberBrace, kept sorted by x */
  TRB_MEMBER_ARRAY_BEARING_POINTS,    /* TrbFramePoint */
} TrbMemberArray;

/* ---- commands ---------------------------------------------------------------------------- */

const char     *trb_edit_command_get_label     (const TrbEditCommand *command);
void            trb_edit_command_free          (TrbEditCommand       *command);

TrbEditCommand *trb_edit_add_member            (TrbProject           *project,
                                                TrbFloor             *floor,
                                                TrbMember            *member,
                                                GError              **error);
TrbEditCommand *trb_edit_remove_member         (TrbProject           *project,
                                                TrbMember            *member,
                                                GError              **error);
TrbEditCommand *trb_edit_move_member           (TrbProject           *project,
                                                TrbMember            *member,
                                                const TrbFramePoint  *start,
                                                const TrbFramePoint  *end,
                                                GError              **error);
TrbEditCommand *trb_edit_set_member_text       (TrbProject           *project,
                                                TrbMember            *member,
                                                TrbMemberField        field,
                                                const char           *value,
                                                GError              **error);
TrbEditCommand *trb_edit_set_member_choice     (TrbProject           *project,
                                                TrbMember            *member,
                                                TrbMemberField        field,
                                                int                   value,
                                                GError              **error);
TrbEditCommand *trb_edit_set_member_number     (TrbProject           *project,
                                                TrbMember            *member,
                                                TrbMemberField        field,
                                                double                value,
                                                GError              **error);
TrbEditCommand *trb_edit_assign_section        (TrbProject           *project,
                                                TrbMember            *member,
                                                const char           *section,
                                                GError              **error);
TrbEditCommand *trb_edit_insert_member_element (TrbProject           *project,
                                                TrbMember            *member,
                                                TrbMemberArray        list,
                                                int                   index,
                                                gconstpointer         element,
                                                GError              **error);
TrbEditCommand *trb_edit_remove_member_element (TrbProject           *project,
                                                TrbMember            *member,
                                                TrbMemberArray        list,
                                                guint                 index,
                                                GError              **error);

TrbEditCommand *trb_edit_add_floor_item        (TrbProject           *project,
                                                TrbFloor             *floor,
                                                TrbFloorItemKind      kind,
                                                gpointer              item,
                                                GError              **error);
TrbEditCommand *trb_edit_remove_floor_item     (TrbProject           *project,
                                                TrbFloor             *floor,
                                                TrbFloorItemKind      kind,
                                                gpointer              item,
                                                GError              **error);
TrbEditCommand *trb_edit_replace_floor_item    (TrbProject           *project,
                                                TrbFloor             *floor,
                                                TrbFloorItemKind      kind,
                                                gpointer              old_item,
                                                gpointer              new_item,
                                                GError              **error);

TrbEditCommand *trb_edit_add_joist_run         (TrbProject           *project,
                                                TrbFloor             *floor,
                                                const TrbMember      *support_a,
                                                const TrbMember      *support_b,
                                                const TrbJoistRunSpec *spec,
                                                GError              **error);

TrbEditCommand *trb_edit_set_settings          (TrbProject           *project,
                                                const TrbSettings    *settings,
                                                GError              **error);

/* Copies and frees of floor items, for building the new item of a replacement. */
gpointer        trb_edit_floor_item_copy       (TrbFloorItemKind      kind,
                                                gconstpointer         item);
void            trb_edit_floor_item_free       (TrbFloorItemKind      kind,
                                                gpointer              item);
GPtrArray      *trb_edit_floor_items           (TrbFloor             *floor,
                                                TrbFloorItemKind      kind);

/* ---- a copy to solve on ------------------------------------------------------------------ */

TrbProject     *trb_edit_project_copy          (const TrbProject     *project);
void            trb_edit_project_copy_free     (TrbProject           *copy);

/* ---- snapping: where a point drawn on the plan lands ------------------------------------- */

typedef enum
{
  TRB_SNAP_NONE,            /* the point as given */
  TRB_SNAP_GRID,            /* an intersection of the drawing grid */
  TRB_SNAP_GRID_CROSSING,   /* where two of the floor's grid lines cross */
  TRB_SNAP_COLUMN,          /* a column's centre */
  TRB_SNAP_END,             /* a member's end */
  TRB_SNAP_ON_MEMBER,       /* the nearest point on a member's line */
  TRB_SNAP_ON_WALL,         /* the nearest point on a wall */
} TrbSnapKind;

typedef struct
{
  double           grid;     /* drawing grid spacing, m; 0 for none */
  gboolean         objects;  /* snap to columns, member ends, grid crossings, member and wall
                              * lines */
  double           radius;   /* m: how far from the point an object may be */
  const TrbMember *skip;     /* a member not to snap to (the one being drawn or dragged) */
} TrbSnapOptions;

typedef struct
{
  TrbSnapKind    kind;
  TrbFramePoint  point;
  gconstpointer  object;     /* the TrbMember, TrbColumn or TrbWall; NULL otherwise */
} TrbSnap;

gboolean        trb_edit_snap                  (const TrbFloor       *floor,
                                                const TrbFramePoint  *point,
                                                const TrbSnapOptions *options,
                                                TrbSnap              *snap);

/* ---- history ----------------------------------------------------------------------------- */

TrbEditHistory *trb_edit_history_new           (TrbProject           *project);
void            trb_edit_history_free          (TrbEditHistory       *history);
TrbProject     *trb_edit_history_get_project   (TrbEditHistory       *history);

void            trb_edit_history_push          (TrbEditHistory       *history,
                                                TrbEditCommand       *command);
void            trb_edit_history_begin_group   (TrbEditHistory       *history,
                                                const char           *label);
void            trb_edit_history_end_group     (TrbEditHistory       *history);
void            trb_edit_history_cancel_group  (TrbEditHistory       *history);

gboolean        trb_edit_history_can_undo      (TrbEditHistory       *history);
gboolean        trb_edit_history_can_redo      (TrbEditHistory       *history);
const char     *trb_edit_history_get_undo_label (TrbEditHistory      *history);
const char     *trb_edit_history_get_redo_label (TrbEditHistory      *history);
guint           trb_edit_history_get_n_undo    (TrbEditHistory       *history);
guint           trb_edit_history_get_n_redo    (TrbEditHistory       *history);
gboolean        trb_edit_history_undo          (TrbEditHistory       *history);
gboolean        trb_edit_history_redo          (TrbEditHistory       *history);

void            trb_edit_history_mark_saved    (TrbEditHistory       *history);
gboolean        trb_edit_history_is_modified   (TrbEditHistory       *history);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbEditCommand, trb_edit_command_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbEditHistory, trb_edit_history_free)

G_END_DECLS
