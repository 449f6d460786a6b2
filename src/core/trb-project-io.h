/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-model.h"

G_BEGIN_DECLS

/* The format this version reads (and, later, writes). A file with a larger number fails with
 * TRB_ERROR_NEWER_FORMAT. */
#define TRB_PROJECT_FORMAT 1

/* Larger files are refused before parsing (TRB_ERROR_IO): a floor of ten thousand members
 * takes a few MiB, so this only stops runaway input. */
#define TRB_PROJECT_MAX_FILE_SIZE (64 * 1024 * 1024)

/* Limits that keep a hostile file within bounded time and memory (docs/reliability.md):
 * - attributes on one tag: libxml2 compares each attribute of a tag with every one before
 *   it, so a tag of a million attributes would take hours; no element has more than 30;
 * - elements and attributes in the whole file: the parsed tree takes some 200 bytes for each,
 *   so this keeps it within a few hundred MiB whatever the file holds;
 * - members: ten times the largest floor the editor is made for. */
#define TRB_PROJECT_MAX_ATTRIBUTES 256
#define TRB_PROJECT_MAX_NODES      2000000
#define TRB_PROJECT_MAX_MEMBERS    100000

/* Points of the area loads and openings of one floor, together: the framing finds each
 * strip's load by scanning every outline edge at every outline vertex, so its time grows with
 * the members times the square of these points (20,000 points over 15 joists took 33 s).
 * Real outlines have tens of points. */
#define TRB_PROJECT_MAX_OUTLINE_POINTS 1000

TrbProject *trb_project_load_file (const char  *filename,
                                   GError     **error);

TrbProject *trb_project_load_data (const char  *data,
                                   gsize        length,
                                   const char  *display_name,
                                   GError     **error);

char       *trb_project_save_data (const TrbProject  *project,
                                   gsize             *length,
                                   GError           **error);

gboolean    trb_project_save_file (const TrbProject  *project,
                                   const char        *filename,
                                   GError           **error);

char       *trb_project_format_quantity (double         value,
                                         TrbDimension   dim,
                                         TrbUnitSystem  system,
                                         gboolean       plain);

gboolean    trb_project_check_schema (const char  *data,
                                      gsize        length,
                                      const char  *display_name,
                                      GError     **error);

G_END_DECLS
