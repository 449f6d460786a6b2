/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-design.h"
#include "trb-section.h"

G_BEGIN_DECLS

/* The classic allowable-stress method: the engineer gives the allowable bending and shear
 * stresses (Pa) and the member is checked on its service combinations for fb = M / S <= Fb,
 * the shear stress fv <= Fv, and deflection. It works for any section with a section modulus
 * and either a web (d, tw) or an area; custom sections included. */

/* The shear stress V on the section: V / (d tw) for shapes with a web (W, S, C, custom with d
 * and tw), V / (2 (d - 3 t) t) for rectangular HSS, 1.5 V / A for solid rectangles (sawn,
 * glulam, custom with only A). NAN when the section has none of these. The formula used, as
 * text, in *formula when formula is not NULL. */
double             trb_design_allowable_shear_stress (const TrbSection     *section,
                                                      double                V,
                                                      const char          **formula);

/* The first section of a list sorted by weight whose Sx is at least S_required; -1 when
 * none. */
int                trb_design_allowable_lightest     (const TrbSection     *sections,
                                                      guint                 n_sections,
                                                      double                S_required);

/* The largest unbraced length at which a compact shape may take Fb = 0.66 Fy in the 1989
 * allowable-stress specification (AISC ASD 9th ed. F1.1, from memory): the lesser of
 * 76 bf / sqrt(Fy) and 20,000 / ((d / Af) Fy), in the specification's ksi and inch units,
 * returned in m. */
double             trb_design_allowable_lc           (const TrbSection     *section,
                                                      double                Fy);

/* Appends "Section modulus", "Web shear" and the deflection checks. Returns FALSE (with a
 * "Not checked" entry) when a check could not be made: Fb or Fv not given, or a section
 * without S, or without a web or an area. */
gboolean           trb_design_allowable_check        (const TrbDesignInput *input,
                                                      double                Fb,
                                                      double                Fv,
                                                      GArray               *checks);

G_END_DECLS
