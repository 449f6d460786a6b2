/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-section.h"
#include "trb-types.h"

G_BEGIN_DECLS

/* Reference design values of a species and grade (NDS Supplement 2018), in Pa. */
typedef struct
{
  char   species[48];
  char   grade[32];
  char   size_class[24];  /* "dimension", "beams_and_stringers", "posts_and_timbers", "glulam" */
  double width_min_in;    /* the widths (nominal, in) the row applies to; 0 and 1e9 for "all" */
  double width_max_in;
  double Fb, Ft, Fv, Fc_perp, Fc, E, Emin;
  double Fb_neg;          /* glulam: Fbx- (compression zone stressed in tension); else NAN */
  char   source[96];      /* with "(from memory)" kept where the data says so */
  char   confidence[16];
} TrbWoodGrade;

typedef enum
{
  TRB_FAMILY_W,
  TRB_FAMILY_S,
  TRB_FAMILY_C,
  TRB_FAMILY_HSS_RECT,
  TRB_FAMILY_SAWN,    /* single and built-up 2- and 3-ply */
  TRB_FAMILY_GLULAM,
  TRB_N_FAMILIES,
} TrbFamily;

typedef struct _TrbCatalog TrbCatalog;

/* The bundled catalogs (GResource /org/trabeate/Trabeate/sections/), loaded once. */
const TrbCatalog   *trb_catalog_get_default     (void);

TrbCatalog         *trb_catalog_new_from_csv    (const char        *csv_text,
                                                 const char        *source_name,
                                                 TrbFamily          family,
                                                 GError           **error);
void                trb_catalog_free            (TrbCatalog        *catalog);

/* An empty catalog, and the loaders that fill one; a loader adds all rows or, on error,
 * none. Designations must be unique within a catalog. */
TrbCatalog         *trb_catalog_new             (void);
gboolean            trb_catalog_add_csv         (TrbCatalog        *catalog,
                                                 const char        *csv_text,
                                                 const char        *source_name,
                                                 TrbFamily          family,
                                                 GError           **error);
gboolean            trb_catalog_add_grades_csv  (TrbCatalog        *catalog,
                                                 const char        *csv_text,
                                                 const char        *source_name,
                                                 GError           **error);
/* A project's own sections (docs/catalog.md): the W-shape columns, or the rectangle form
 * "designation,kind,b_in,d_in,...". */
gboolean            trb_catalog_add_project_csv (TrbCatalog        *catalog,
                                                 const char        *csv_text,
                                                 const char        *source_name,
                                                 GError           **error);
TrbCatalog         *trb_catalog_new_from_project_csv (const char   *csv_text,
                                                      const char   *source_name,
                                                      GError      **error);

/* Sections of one family, sorted by weight, then depth. */
const TrbSection   *trb_catalog_get_family      (const TrbCatalog  *catalog,
                                                 TrbFamily          family,
                                                 guint             *n_sections);
/* Case-insensitive designation lookup across families ("w18x35", "2-2x12", "5-1/8x18"). */
const TrbSection   *trb_catalog_lookup          (const TrbCatalog  *catalog,
                                                 const char        *designation);

const TrbWoodGrade *trb_catalog_lookup_grade    (const TrbCatalog  *catalog,
                                                 const char        *species,
                                                 const char        *grade,
                                                 const TrbSection  *section);
const TrbWoodGrade *trb_catalog_get_grades      (const TrbCatalog  *catalog,
                                                 guint             *n_grades);

/* Designations that start with prefix (same normalisation as the lookup), by family and then
 * in family order; at most max of them (0: all). A GPtrArray of newly allocated strings. */
GPtrArray          *trb_catalog_complete        (const TrbCatalog  *catalog,
                                                 const char        *prefix,
                                                 guint              max);

G_DEFINE_AUTOPTR_CLEANUP_FUNC (TrbCatalog, trb_catalog_free)

G_END_DECLS
