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

TrbProject *trb_project_load_file (const char  *filename,
                                   GError     **error);

TrbProject *trb_project_load_data (const char  *data,
                                   gsize        length,
                                   const char  *display_name,
                                   GError     **error);

G_END_DECLS
