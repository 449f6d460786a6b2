/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <stdio.h>

int
main (int argc, char **argv)
{
  fprintf (stderr, "trabeate-cli: not built yet\n");
  return 2;
}
