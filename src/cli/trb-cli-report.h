/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* `trabeate-cli report` and `trabeate-cli plan`: argv[0] is the command's name. They return
 * the exit status: 0 written, 2 bad input, usage, or a file that could not be written. */
int  trb_cli_report  (int    argc,
                      char **argv);
int  trb_cli_plan    (int    argc,
                      char **argv);

G_END_DECLS
