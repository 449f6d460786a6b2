/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-beam.h"
#include "trb-catalog.h"
#include "trb-design.h"
#include "trb-frame.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* The project as loaded: settings, standalone beams and floors. Plain structs owned by the
 * project; everything SI. The solve works on TrbMember, standalone beams and floor members
 * alike.
 *
 * Marks: the members' ids (standalone beams and every floor's members) share one namespace
 * across the whole project, so "B3" names one member wherever it is; columns have their own
 * namespace across the project, and walls theirs, so column "C1" and member "C1" may coexist
 * (the trade marks them on separate schedules), but two columns "C1" may not, even on
 * different floors. */

typedef enum
{
  TRB_METHOD_ASD,        /* AISC 360 / NDS allowable strength with ASCE 7 ASD combinations */
  TRB_METHOD_LRFD,       /* AISC 360 load and resistance factor design */
  TRB_METHOD_ALLOWABLE,  /* classic allowable stress: fb = M/S <= Fb, service loads */
} TrbMethod;

typedef enum
{
  TRB_MATERIAL_STEEL,
  TRB_MATERIAL_WOOD,
  TRB_MATERIAL_CUSTOM,   /* properties given with a custom section, no catalog */
} TrbMaterial;

typedef struct
{
  TrbMethod     method;            /* default asd */
  double        fb_allow;          /* Pa; NAN when not given */
  double        fv_allow;          /* Pa; NAN when not given */
  char         *steel_grade;       /* default "A992" */
  gboolean      self_weight;       /* default TRUE */
  gboolean      live_patterns;     /* default TRUE */
  double        deflection_live;   /* denominator n of L/n; 0 for no limit; default 360 */
  double        deflection_total;  /* default 240 */
  TrbUnitSystem units;             /* display units, default US */
  gboolean      live_load_reduction; /* ASCE 7-16 §4.7 reduction of floor live load;
                                      * default FALSE: whether it applies is the engineer's
                                      * call */
  int           floors_above;      /* floors above this file's that its columns also carry
                                    * (for the §4.7.2 limit of members supporting two or
                                    * more floors); default 0 */
  int           line;              /* of <settings>; 0 when the file has none */
} TrbSettings;

typedef struct
{
  TrbSupport support;
  int        line;
} TrbMemberSupport;

typedef struct
{
  TrbLoadCase lcase;
  TrbLoad     load;
  int         line;
} TrbMemberLoad;

typedef struct
{
  double x;
  int    line;
} TrbMemberBrace;

typedef struct
{
  char        *id;
  int          line;
  double       length;
  TrbMaterial  material;
  char        *section;      /* a catalog designation, "auto" or "custom" */

  /* section="custom": given properties, NAN when absent (E and I are required) */
  double       E, I, S, A, d, tw;
  double       weight;       /* self-weight per length, N/m; NAN when not given */

  GArray      *supports;     /* TrbMemberSupport, file order */
  GArray      *loads;        /* TrbMemberLoad, file order */

  /* Design attributes. Those that override the project's settings are unset (has_method
   * FALSE, NAN, NULL) when the beam does not give them: use the trb_member_get_*() helpers. */
  gboolean     has_method;
  TrbMethod    method;
  double       fb_allow;
  double       fv_allow;
  char        *steel_grade;
  double       deflection_live;   /* NAN: the project's; 0: none */
  double       deflection_total;
  TrbBracing   bracing;           /* default continuous (points when <brace> is given) */
  GArray      *braces;            /* TrbMemberBrace, sorted by x */
  double       max_depth;         /* m, NAN when not given */
  double       min_depth;
  char       **allowed;           /* designations to choose from; NULL for the whole catalog */
  int          max_plies;         /* 0 when not given */

  /* wood */
  char        *species;           /* NULL when not given */
  char        *grade;
  gboolean     wet_service;       /* default FALSE */
  gboolean     incised;           /* default FALSE */
  gboolean     repetitive;        /* default FALSE */
  double       bearing_length;    /* m, NAN when not given */

  /* Members of a floor (floor != NULL) are placed in plan: the length is the distance from
   * start to end, and the supports come from what the ends rest on (trb-frame), besides any
   * <support> the file gives. Standalone beams leave these zero. */
  struct _TrbFloor *floor;        /* not owned; NULL for a standalone beam */
  TrbFramePoint  start;           /* m, in the floor's plan coordinates */
  TrbFramePoint  end;
  TrbFrameRole   role;            /* girder, beam or joist */
  gboolean       carries_deck;    /* the deck or sheathing rests on it (takes area load);
                                   * default TRUE for joists and beams, FALSE for girders */
  char          *group;           /* the joist run it was laid out in; NULL when none */
  GArray        *bearing_points;  /* TrbFramePoint: where it also rests on a member below,
                                   * besides its ends */
} TrbMember;

/* A floor (level): named grid lines, columns, bearing walls, members placed in plan, and the
 * loads placed in plan. Everything SI, plan coordinates in metres. */
typedef struct
{
  char          *name;            /* "A", "1" */
  TrbFramePoint  start;           /* the line is drawn from start to end */
  TrbFramePoint  end;
  int            line;
} TrbGridLine;

typedef struct
{
  char          *id;              /* "C1" */
  TrbFramePoint  at;
  char          *section;         /* what the engineer calls it ("HSS6X6X1/4"); not designed */
  int            line;
} TrbColumn;

typedef struct
{
  char          *id;              /* "W1" */
  GArray        *points;          /* TrbFramePoint, two or more: it bears along every segment */
  char          *material;        /* "masonry", "concrete", "wood stud"; for the reader only */
  int            line;
} TrbWall;

/* Area, line and point loads in plan. Partition loads are live load (case L) that live load
 * reduction never reduces (ASCE 7-16 §4.3.2 treats them as live; the engineer decides). */
typedef enum
{
  TRB_AREA_LOAD_ORDINARY,
  TRB_AREA_LOAD_PARTITION,
} TrbAreaLoadKind;

typedef struct
{
  TrbLoadCase      lcase;
  TrbAreaLoadKind  kind;
  double           pressure;      /* Pa, downward + */
  char            *label;         /* "office live", "deck and finishes"; may be NULL */
  char            *occupancy;     /* for live load: "office", "storage", ...; may be NULL */
  GArray          *points;        /* TrbFramePoint: the polygon */
  int              line;
} TrbAreaLoad;

typedef struct
{
  GArray          *points;        /* TrbFramePoint: the polygon where no area load falls */
  int              line;
} TrbOpening;

typedef struct
{
  TrbLoadCase      lcase;
  double           w;             /* N/m, downward + */
  char            *label;
  GArray          *points;        /* TrbFramePoint: the polyline */
  int              line;
} TrbLineLoad;

typedef struct
{
  TrbLoadCase      lcase;
  double           P;             /* N, downward + */
  char            *label;
  TrbFramePoint    at;
  int              line;
} TrbPointLoad;

typedef struct _TrbFloor
{
  char        *name;              /* "Mezzanine" */
  int          line;
  GPtrArray   *grids;             /* TrbGridLine */
  GPtrArray   *columns;           /* TrbColumn */
  GPtrArray   *walls;             /* TrbWall */
  GPtrArray   *members;           /* TrbMember (not owned: the project's members array owns
                                   * every member; these are the floor's, in file order) */
  GPtrArray   *area_loads;        /* TrbAreaLoad */
  GPtrArray   *openings;          /* TrbOpening */
  GPtrArray   *line_loads;        /* TrbLineLoad */
  GPtrArray   *point_loads;       /* TrbPointLoad */
} TrbFloor;

/* A <sections> element as written, so that saving writes it back as it was given. */
typedef struct
{
  char        *file;         /* a file name in the project's folder; NULL for an inline table */
  char        *csv;          /* the inline table, trimmed; NULL with a file */
  int          line;
} TrbSectionsSource;

typedef struct
{
  int          format;
  char        *name;         /* the file's display name, for messages; may be NULL */
  TrbSettings  settings;
  GPtrArray   *members;      /* TrbMember: standalone beams and every floor's members, in
                              * file order; ids (the engineer's marks) unique across them */
  GPtrArray   *floors;       /* TrbFloor, in file order */
  TrbCatalog  *sections;     /* the project's own sections (<sections>); NULL when none */
  GPtrArray   *sections_sources; /* TrbSectionsSource, in file order: what made sections */
  GHashTable  *ids;          /* private: id -> member of members, so that looking an id up
                              * (once per member while loading) is not a linear search */
} TrbProject;

const char  *trb_method_name               (TrbMethod          method);
gboolean     trb_method_from_name          (const char        *name,
                                            TrbMethod         *method);
const char  *trb_material_name             (TrbMaterial        material);
gboolean     trb_material_from_name        (const char        *name,
                                            TrbMaterial       *material);
const char  *trb_support_type_name         (TrbSupportType     type);
gboolean     trb_support_type_from_name    (const char        *name,
                                            TrbSupportType    *type);
const char  *trb_load_kind_name            (TrbLoadKind        kind);
gboolean     trb_load_kind_from_name       (const char        *name,
                                            TrbLoadKind       *kind);
const char  *trb_role_name                 (TrbFrameRole       role);
gboolean     trb_role_from_name            (const char        *name,
                                            TrbFrameRole      *role);
const char  *trb_area_load_kind_name       (TrbAreaLoadKind    kind);
gboolean     trb_area_load_kind_from_name  (const char        *name,
                                            TrbAreaLoadKind   *kind);

void         trb_settings_init_defaults    (TrbSettings       *settings);
void         trb_settings_clear            (TrbSettings       *settings);

TrbMember   *trb_member_new                (const char        *id);
void         trb_member_free               (TrbMember         *member);
gboolean     trb_member_is_custom          (const TrbMember   *member);
gboolean     trb_member_is_auto            (const TrbMember   *member);
TrbMethod    trb_member_get_method         (const TrbMember   *member,
                                            const TrbSettings *settings);
double       trb_member_get_fb_allow       (const TrbMember   *member,
                                            const TrbSettings *settings);
double       trb_member_get_fv_allow       (const TrbMember   *member,
                                            const TrbSettings *settings);
const char  *trb_member_get_steel_grade    (const TrbMember   *member,
                                            const TrbSettings *settings);
double       trb_member_get_deflection_live  (const TrbMember   *member,
                                              const TrbSettings *settings);
double       trb_member_get_deflection_total (const TrbMember   *member,
                                              const TrbSettings *settings);
gboolean     trb_member_has_case           (const TrbMember   *member,
                                            TrbLoadCase        lcase);

TrbProject  *trb_project_new               (void);
void         trb_project_free              (TrbProject        *project);
void         trb_project_add_member        (TrbProject        *project,
                                            TrbMember         *member);
TrbMember   *trb_project_find_member       (const TrbProject  *project,
                                            const char        *id);

void         trb_member_set_role           (TrbMember         *member,
                                            TrbFrameRole       role);
void         trb_member_set_plan           (TrbMember         *member,
                                            TrbFramePoint      start,
                                            TrbFramePoint      end);
void         trb_member_copy_design        (TrbMember         *member,
                                            const TrbMember   *template);
void         trb_member_add_bearing_point  (TrbMember         *member,
                                            TrbFramePoint      point);

TrbGridLine *trb_grid_line_new             (const char        *name,
                                            TrbFramePoint      start,
                                            TrbFramePoint      end);
void         trb_grid_line_free            (TrbGridLine       *grid);
TrbColumn   *trb_column_new                (const char        *id,
                                            TrbFramePoint      at,
                                            const char        *section);
void         trb_column_free               (TrbColumn         *column);
TrbWall     *trb_wall_new                  (const char        *id,
                                            const char        *material);
void         trb_wall_free                 (TrbWall           *wall);
TrbAreaLoad *trb_area_load_new             (TrbLoadCase        lcase,
                                            TrbAreaLoadKind    kind,
                                            double             pressure,
                                            const char        *label,
                                            const char        *occupancy);
void         trb_area_load_free            (TrbAreaLoad       *load);
TrbOpening  *trb_opening_new               (void);
void         trb_opening_free              (TrbOpening        *opening);
TrbLineLoad *trb_line_load_new             (TrbLoadCase        lcase,
                                            double             w,
                                            const char        *label);
void         trb_line_load_free            (TrbLineLoad       *load);
TrbPointLoad *trb_point_load_new           (TrbLoadCase        lcase,
                                            double             P,
                                            TrbFramePoint      at,
                                            const char        *label);
void         trb_point_load_free           (TrbPointLoad      *load);
void         trb_points_append             (GArray            *points,
                                            double             x,
                                            double             y);

TrbFloor    *trb_floor_new                 (const char        *name);
void         trb_floor_free                (TrbFloor          *floor);
void         trb_floor_add_member          (TrbProject        *project,
                                            TrbFloor          *floor,
                                            TrbMember         *member);
TrbColumn   *trb_floor_find_column         (const TrbFloor    *floor,
                                            const char        *id);
TrbWall     *trb_floor_find_wall           (const TrbFloor    *floor,
                                            const char        *id);
TrbGridLine *trb_floor_find_grid           (const TrbFloor    *floor,
                                            const char        *name);

void         trb_project_add_floor         (TrbProject        *project,
                                            TrbFloor          *floor);
TrbFloor    *trb_project_find_floor        (const TrbProject  *project,
                                            const char        *name);
TrbColumn   *trb_project_find_column       (const TrbProject  *project,
                                            const char        *id,
                                            TrbFloor         **floor);
TrbWall     *trb_project_find_wall         (const TrbProject  *project,
                                            const char        *id,
                                            TrbFloor         **floor);
void         trb_project_add_sections_source (TrbProject        *project,
                                              const char        *file,
                                              const char        *csv,
                                              int                line);
char        *trb_project_next_mark         (const TrbProject  *project,
                                            const char        *prefix,
                                            guint             *counter);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbMember, trb_member_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbProject, trb_project_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbFloor, trb_floor_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbGridLine, trb_grid_line_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbColumn, trb_column_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbWall, trb_wall_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbAreaLoad, trb_area_load_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbOpening, trb_opening_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbLineLoad, trb_line_load_free)
G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbPointLoad, trb_point_load_free)

G_END_DECLS
