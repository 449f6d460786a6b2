/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include "trb-cli-report.h"

#include <glib/gi18n.h>
#include <stdio.h>
#include <string.h>

#include "trb-model.h"
#include "trb-project-io.h"
#include "trb-render-report.h"
#include "trb-solve.h"

#define EXIT_WRITTEN 0
#define EXIT_USAGE   2

static const char *const report_usage_msgid =
  /* Translators: the help of the report command. Keep the command, the options, the
   * paper names and the sheet names (summary, plan, ...) as they are; lines of 80 columns
   * or fewer fit every terminal */
  N_("Usage:\n"
     "  trabeate-cli report FILE -o OUT.pdf|OUT.svg|OUT.png [options]\n"
     "\n"
     "Writes the printed report: a summary, the framing plan of each floor, a sheet for each\n"
     "member (loading, shear, moment and deflection diagrams, checks, reactions, shortlist),\n"
     "the schedule of members and column loads, and the changes since a previous version.\n"
     "PDF holds every page; SVG and PNG write one file a page (OUT.svg, OUT-2.svg, ...).\n"
     "\n"
     "Options:\n"
     "  -o, --output OUT     the file to write (required)\n"
     "  --paper NAME         Letter, Legal, Tabloid, A4 or A3 (default Letter, A4 for SI)\n"
     "  --landscape          landscape pages\n"
     "  --scale S            the plan's scale: 1:100, 1/8\"=1'-0\", ... (default: the largest\n"
     "                       usual scale that fits)\n"
     "  --sheets LIST        summary,plan,members,schedule,changes (default all)\n"
     "  --member ID          a member sheet only for this member (repeat for more)\n"
     "  --since OLD          compare with an earlier version of the project file: ring the\n"
     "                       changed members with revision clouds and list them\n"
     "  --title TEXT         the project's name in the title block (default the file's)\n"
     "  --engineer TEXT      the engineer's name in the title block\n"
     "  --revision TEXT      the revision in the title block\n"
     "  --date TEXT          the date in the title block (default today)\n"
     "  --dpi N              resolution of PNG pages (default 150)\n"
     "\n"
     "Exit status: 0 written; 2 bad input or usage, or the file could not be written.\n");

static const char *
report_usage (void)
{
  return _(report_usage_msgid);
}

static const char *const plan_usage_msgid =
  /* Translators: the help of the plan command. Keep the command and the options as they
   * are; lines of 80 columns or fewer fit every terminal */
  N_("Usage:\n"
     "  trabeate-cli plan FILE -o OUT.svg|OUT.png|OUT.pdf [--width N --height N] [--floor NAME]\n"
     "\n"
     "Draws one floor's framing plan, as the editor shows it, fitted to the size (pixels for\n"
     "PNG, points for SVG and PDF; default 1600 x 1000).\n"
     "\n"
     "Exit status: 0 written; 2 bad input or usage, or the file could not be written.\n");

static const char *
plan_usage (void)
{
  return _(plan_usage_msgid);
}

static int
usage_error (const char *usage,
             const char *message)
{
  fprintf (stderr, "trabeate-cli: %s\n\n%s", message, usage);
  return EXIT_USAGE;
}

static gboolean
wants_help (int    argc,
            char **argv)
{
  for (int i = 1; i < argc; i++)
    if (strcmp (argv[i], "--help") == 0 || strcmp (argv[i], "-h") == 0)
      return TRUE;
  return FALSE;
}

int
trb_cli_report (int    argc,
                char **argv)
{
  g_autofree char *output = NULL;
  g_autofree char *paper = NULL;
  g_autofree char *scale = NULL;
  g_autofree char *sheets = NULL;
  g_autofree char *since = NULL;
  g_autofree char *title = NULL;
  g_autofree char *engineer = NULL;
  g_autofree char *revision = NULL;
  g_autofree char *date = NULL;
  g_auto(GStrv) members = NULL;
  gboolean landscape = FALSE;
  double dpi = 150;
  const GOptionEntry entries[] = {
    /* The descriptions are never shown (the help is report_usage), so they are not marked. */
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, "The file to write", "OUT" },
    { "paper", 0, 0, G_OPTION_ARG_STRING, &paper, "Paper size", "NAME" },
    { "landscape", 0, 0, G_OPTION_ARG_NONE, &landscape, "Landscape pages", NULL },
    { "scale", 0, 0, G_OPTION_ARG_STRING, &scale, "The plan's scale", "S" },
    { "sheets", 0, 0, G_OPTION_ARG_STRING, &sheets, "Which sheets", "LIST" },
    { "member", 0, 0, G_OPTION_ARG_STRING_ARRAY, &members, "A member's sheet only", "ID" },
    { "since", 0, 0, G_OPTION_ARG_FILENAME, &since, "The previous version", "OLD" },
    { "title", 0, 0, G_OPTION_ARG_STRING, &title, "The project's name", "TEXT" },
    { "engineer", 0, 0, G_OPTION_ARG_STRING, &engineer, "The engineer", "TEXT" },
    { "revision", 0, 0, G_OPTION_ARG_STRING, &revision, "The revision", "TEXT" },
    { "date", 0, 0, G_OPTION_ARG_STRING, &date, "The date", "TEXT" },
    { "dpi", 0, 0, G_OPTION_ARG_DOUBLE, &dpi, "PNG resolution", "N" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new ("FILE");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(TrbProjectResult) results = NULL;
  g_autoptr(TrbProject) old = NULL;
  g_autoptr(TrbProjectResult) old_results = NULL;
  g_autoptr(TrbReport) report = NULL;
  TrbReportOptions options;
  TrbSolveOptions solve_options;

  if (wants_help (argc, argv))
    {
      fputs (report_usage (), stdout);
      return EXIT_WRITTEN;
    }
  g_option_context_set_help_enabled (context, FALSE);
  g_option_context_add_main_entries (context, entries, NULL);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return usage_error (report_usage (), error->message);
  if (argc != 2)
    return usage_error (report_usage (), argc < 2 ? _("report needs a FILE")
                                                  : _("report takes one FILE"));
  if (argv[1][0] == '-' && argv[1][1] != '\0')
    return usage_error (report_usage (), _("unknown option"));
  if (output == NULL)
    return usage_error (report_usage (), _("report needs -o OUT.pdf (or .svg, .png)"));
  if (!(dpi >= 10 && dpi <= 1200))
    return usage_error (report_usage (), _("--dpi must be 10 to 1200"));

  project = trb_project_load_file (argv[1], &error);
  if (project == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return EXIT_USAGE;
    }
  trb_report_options_init (&options, project);
  if (paper != NULL && !trb_paper_from_name (paper, &options.paper))
    /* Translators: keep the paper names */
    return usage_error (report_usage (), _("--paper: choose Letter, Legal, Tabloid, A4 or A3"));
  options.landscape = landscape;
  if (scale != NULL && g_ascii_strcasecmp (scale, "fit") != 0)
    {
      if (!trb_drawing_scale_parse (scale, &options.scale, &error))
        return usage_error (report_usage (), error->message);
      options.has_scale = TRUE;
    }
  if (sheets != NULL && !trb_report_sheets_parse (sheets, &options.sheets, &error))
    return usage_error (report_usage (), error->message);
  options.members = (const char *const *) members;
  options.title = title;
  options.engineer = engineer;
  options.revision = revision;
  options.date = date;

  if (since != NULL)
    {
      old = trb_project_load_file (since, &error);
      if (old == NULL)
        {
          fprintf (stderr, "%s\n", error->message);
          return EXIT_USAGE;
        }
      old_results = trb_solve_project (old);
      options.previous = old;
      options.previous_results = old_results;
      options.previous_name = old->name;
    }

  /* the member sheets show the shortlist */
  trb_solve_options_init (&solve_options);
  solve_options.shortlist_max = TRB_SHORTLIST_DEFAULT;
  results = trb_solve_project_full (project, &solve_options);
  report = trb_report_new (project, results, &options, &error);
  if (report == NULL || !trb_report_write (report, output, dpi, &error))
    {
      fprintf (stderr, "%s\n", error->message);
      return EXIT_USAGE;
    }
  printf (ngettext ("Wrote %s: %u page\n", "Wrote %s: %u pages\n",
                    trb_report_get_n_pages (report)),
          output, trb_report_get_n_pages (report));
  if (since != NULL)
    {
      const char *const *marks = trb_report_get_clouded (report);
      g_autofree char *list = g_strjoinv (" ", (char **) marks);

      /* Translators: the marks of the members ringed with revision clouds */
      printf (_("Clouded (changed since %s): %s\n"), old->name,
              marks[0] != NULL ? list : _("none"));
    }
  return fflush (stdout) == 0 ? EXIT_WRITTEN : EXIT_USAGE;
}

int
trb_cli_plan (int    argc,
              char **argv)
{
  g_autofree char *output = NULL;
  g_autofree char *floor_name = NULL;
  int width = 1600, height = 1000;
  const GOptionEntry entries[] = {
    /* The descriptions are never shown (the help is plan_usage), so they are not marked. */
    { "output", 'o', 0, G_OPTION_ARG_FILENAME, &output, "The file to write", "OUT" },
    { "width", 0, 0, G_OPTION_ARG_INT, &width, "Width", "N" },
    { "height", 0, 0, G_OPTION_ARG_INT, &height, "Height", "N" },
    { "floor", 0, 0, G_OPTION_ARG_STRING, &floor_name, "The floor", "NAME" },
    { NULL }
  };
  g_autoptr(GOptionContext) context = g_option_context_new ("FILE");
  g_autoptr(GError) error = NULL;
  g_autoptr(TrbProject) project = NULL;
  g_autoptr(TrbProjectResult) results = NULL;
  const TrbFloor *floor = NULL;

  if (wants_help (argc, argv))
    {
      fputs (plan_usage (), stdout);
      return EXIT_WRITTEN;
    }
  g_option_context_set_help_enabled (context, FALSE);
  g_option_context_add_main_entries (context, entries, NULL);
  if (!g_option_context_parse (context, &argc, &argv, &error))
    return usage_error (plan_usage (), error->message);
  if (argc != 2)
    return usage_error (plan_usage (), argc < 2 ? _("plan needs a FILE")
                                                : _("plan takes one FILE"));
  if (argv[1][0] == '-' && argv[1][1] != '\0')
    return usage_error (plan_usage (), _("unknown option"));
  if (output == NULL)
    return usage_error (plan_usage (), _("plan needs -o OUT.svg (or .png, .pdf)"));

  project = trb_project_load_file (argv[1], &error);
  if (project == NULL)
    {
      fprintf (stderr, "%s\n", error->message);
      return EXIT_USAGE;
    }
  if (project->floors->len == 0)
    {
      fprintf (stderr, _("%s: the project has no floor, so no plan to draw\n"), project->name);
      return EXIT_USAGE;
    }
  if (floor_name != NULL)
    {
      floor = trb_project_find_floor (project, floor_name);
      if (floor == NULL)
        {
          fprintf (stderr, _("%s: no floor named \"%s\"\n"), project->name, floor_name);
          return EXIT_USAGE;
        }
    }
  else
    floor = g_ptr_array_index (project->floors, 0);

  results = trb_solve_project (project);
  if (!trb_render_plan_file (project, results, floor, output, width, height, &error))
    {
      fprintf (stderr, "%s\n", error->message);
      return EXIT_USAGE;
    }
  /* Translators: "Wrote plan.svg: plan of Mezzanine, 1600 x 1000" */
  printf (_("Wrote %s: plan of %s, %d x %d\n"), output, floor->name, width, height);
  return fflush (stdout) == 0 ? EXIT_WRITTEN : EXIT_USAGE;
}
