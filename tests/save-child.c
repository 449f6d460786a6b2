/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* The saving side of test-save-faults.c, run with fault-inject.so in LD_PRELOAD:
 *
 *   save-child SOURCE TARGET AGAIN
 *
 * loads SOURCE, saves it over TARGET with the faults armed, then (faults off) checks that the
 * model in memory still writes the same bytes and saves it to AGAIN. What happened goes to
 * stdout, one fact a line, fields split by tabs:
 *
 *   saved      1|0
 *   error      <domain> <code> <message>       (when not saved)
 *   call       ...                             (each call counted, see fault-inject.c)
 *   unchanged  1|0    the model writes the same bytes as before the failed save
 *   again      1|0    the second save, without faults, worked
 *
 * Exit status 0 whenever the run could be made, whatever the save did. */

#include "config.h"

#define _GNU_SOURCE   /* RTLD_DEFAULT */

#include <dlfcn.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "trb-error.h"
#include "trb-project-io.h"

typedef void (*ArmFn)    (void);
typedef void (*ReportFn) (FILE *out);

int
main (int    argc,
      char **argv)
{
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(GError) error = NULL;
  g_autoptr(GError) again_error = NULL;
  g_autofree char *before = NULL;
  g_autofree char *after = NULL;
  gsize n_before = 0, n_after = 0;
  ArmFn arm = (ArmFn) dlsym (RTLD_DEFAULT, "trb_fault_arm");
  ArmFn disarm = (ArmFn) dlsym (RTLD_DEFAULT, "trb_fault_disarm");
  ReportFn report = (ReportFn) dlsym (RTLD_DEFAULT, "trb_fault_report");
  gboolean saved;
  gboolean again;

  if (argc != 4)
    {
      fprintf (stderr, "usage: save-child SOURCE TARGET AGAIN\n");
      return 2;
    }
  /* Without the library the faults asked for would silently not happen. */
  if (arm == NULL || disarm == NULL || report == NULL)
    {
      fprintf (stderr, "save-child: fault-inject.so is not in LD_PRELOAD\n");
      return 2;
    }

  project = trb_project_load_file (argv[1], &error);
  if (project == NULL)
    {
      fprintf (stderr, "save-child: %s\n", error->message);
      return 2;
    }
  before = trb_project_save_data (project, &n_before, &error);
  if (before == NULL)
    {
      fprintf (stderr, "save-child: %s\n", error->message);
      return 2;
    }

  arm ();
  saved = trb_project_save_file (project, argv[2], &error);
  disarm ();

  printf ("saved\t%d\n", saved ? 1 : 0);
  if (!saved)
    printf ("error\t%s\t%d\t%s\n", g_quark_to_string (error->domain), error->code,
            error->message);
  fflush (stdout);
  report (stdout);

  after = trb_project_save_data (project, &n_after, NULL);
  printf ("unchanged\t%d\n",
          after != NULL && n_after == n_before && memcmp (after, before, n_before) == 0);
  again = trb_project_save_file (project, argv[3], &again_error);
  printf ("again\t%d\n", again ? 1 : 0);
  if (!again)
    printf ("again-error\t%s\n", again_error->message);
  return 0;
}
