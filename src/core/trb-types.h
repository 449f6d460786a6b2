/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

G_BEGIN_DECLS

/* Units appear only at the edges; everything inside is SI in double. */
typedef enum
{
  TRB_UNIT_SYSTEM_US,
  TRB_UNIT_SYSTEM_SI,
} TrbUnitSystem;

/* The load cases carried separately down the load path. */
typedef enum
{
  TRB_CASE_D,   /* dead, self-weight included */
  TRB_CASE_L,   /* floor live, partitions included */
  TRB_CASE_LR,  /* roof live */
  TRB_CASE_S,   /* snow */
  TRB_N_CASES,
} TrbLoadCase;

typedef struct _TrbBeam       TrbBeam;
typedef struct _TrbBeamResult TrbBeamResult;

G_END_DECLS
