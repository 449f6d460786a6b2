/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

/* The cautions every human-readable output carries (the CLI's table and JSON, every printed
 * sheet, the about dialog), in one place so that they read the same everywhere. */

#define TRB_CAUTION_LICENSED \
  "Results are for design or review by a licensed engineer; local building codes govern."

#define TRB_CAUTION_NOT_CHECKED \
  "Not checked: connections and hangers, web yielding and crippling, supporting members, " \
  "notches and holes, lateral loads and diaphragms, bracing design, ponding, vibration, " \
  "torsion, fire, durability, construction loads."

#define TRB_CAUTION_INPUTS \
  "The inputs (spans, loads, grades, moisture, bracing) are the user's."

/* Printed plans and schedules list the loads columns and walls receive; they are not sized. */
#define TRB_CAUTION_COLUMNS \
  "Columns and walls are shown with the loads they receive; they are not designed."
