/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-types.h"

G_BEGIN_DECLS

/* Exact conversion factors to SI (NIST SP 811, Appendix B; the inch is exactly 25.4 mm and
 * the pound-force is exactly 4.4482216152605 N). */
#define TRB_IN   0.0254
#define TRB_FT   0.3048
#define TRB_LBF  4.4482216152605
#define TRB_KIP  (1000.0 * TRB_LBF)
#define TRB_PSI  (TRB_LBF / (TRB_IN * TRB_IN))
#define TRB_KSI  (1000.0 * TRB_PSI)
#define TRB_PSF  (TRB_LBF / (TRB_FT * TRB_FT))
#define TRB_PLF  (TRB_LBF / TRB_FT)
#define TRB_KLF  (TRB_KIP / TRB_FT)
#define TRB_KIP_FT (TRB_KIP * TRB_FT)
#define TRB_STANDARD_GRAVITY 9.80665

/* What a quantity measures; each has its SI base unit inside the program. */
typedef enum
{
  TRB_DIM_LENGTH,            /* m */
  TRB_DIM_FORCE,             /* N */
  TRB_DIM_LINE_LOAD,         /* N/m */
  TRB_DIM_AREA_LOAD,         /* Pa */
  TRB_DIM_MOMENT,            /* N*m */
  TRB_DIM_STRESS,            /* Pa (stress and modulus) */
  TRB_DIM_AREA,              /* m^2 */
  TRB_DIM_SECTION_MODULUS,   /* m^3 */
  TRB_DIM_INERTIA,           /* m^4 */
  TRB_DIM_WARPING,           /* m^6 */
  TRB_DIM_WEIGHT_PER_LENGTH, /* N/m (lb/ft, plf, kg/m as mass under standard gravity) */
  TRB_DIM_DENSITY,           /* N/m^3 weight density (pcf, kN/m3) */
  TRB_N_DIMS,
} TrbDimension;

const char *trb_dimension_name      (TrbDimension   dim);

gboolean    trb_units_parse         (const char    *text,
                                     TrbDimension   dim,
                                     double        *value,
                                     GError       **error);

char       *trb_units_format        (double         value,
                                     TrbDimension   dim,
                                     TrbUnitSystem  system);

char       *trb_units_format_length_ft_in (double   meters,
                                           int      denominator);

char       *trb_units_format_with_unit (double      value,
                                        const char *unit,
                                        int         decimals);

const char *trb_units_display_unit  (TrbDimension   dim,
                                     TrbUnitSystem  system);

double      trb_units_to_display    (double         value,
                                     TrbDimension   dim,
                                     TrbUnitSystem  system);

int         trb_units_display_decimals (double        display_value,
                                        TrbDimension  dim,
                                        TrbUnitSystem system);

char       *trb_units_format_small_length (double        meters,
                                           TrbUnitSystem system);

G_END_DECLS
