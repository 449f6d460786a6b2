/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <glib.h>

#include "trb-types.h"

G_BEGIN_DECLS

typedef enum
{
  TRB_SHAPE_W,          /* wide-flange I shape */
  TRB_SHAPE_S,          /* American Standard beam */
  TRB_SHAPE_C,          /* channel */
  TRB_SHAPE_HSS_RECT,   /* rectangular or square hollow structural section */
  TRB_SHAPE_SAWN,       /* sawn lumber, one or more plies */
  TRB_SHAPE_GLULAM,     /* structural glued laminated timber */
  TRB_SHAPE_CUSTOM,     /* properties given by the engineer */
} TrbShapeKind;

/* A cross-section, all SI (m, m^2, m^3, m^4, m^6, N/m). x is the major (bending) axis.
 * A property that is not known (custom sections) is NAN. */
typedef struct
{
  char         designation[32];  /* W18X35, 2x10, 2-2x12, 5-1/8x18, custom */
  TrbShapeKind kind;
  double       weight;           /* self-weight per length, N/m */

  double       A, d, bf, tw, tf, kdes;
  double       Ix, Zx, Sx, rx;
  double       Iy, Zy, Sy, ry;
  double       J, Cw, rts, ho;
  double       bf_2tf, h_tw;     /* slenderness ratios, as tabulated */

  /* rectangles (sawn, glulam): b is the total width, one ply is b / plies */
  double       b;
  int          plies;
  double       nominal_b_in;     /* nominal sizes in inches for sawn lumber (2x10: 2, 10) */
  double       nominal_d_in;
  char         size_class[24];   /* "dimension", "beams_and_stringers", "posts_and_timbers" */

  double       E;                /* custom sections: modulus given with the section; else NAN */

  /* sawn lumber: size factors CF of NDS Supplement Table 4A as lumber.csv carries them
   * (on Fb, Ft, Fc); NAN where the table gives none (timbers, glulam, steel) */
  double       CF_Fb, CF_Ft, CF_Fc;
} TrbSection;

void     trb_section_init_unknown   (TrbSection       *section);

/* Properties from dimensions: a doubly symmetric I shape with flange-to-web fillets of
 * radius r (from kdes - tf), and a solid rectangle of `plies` plies of width b each.
 * Both overwrite every field of out (designation empty). */
void     trb_section_compute_i      (double            d,
                                     double            bf,
                                     double            tw,
                                     double            tf,
                                     double            r,
                                     TrbSection       *out);
void     trb_section_compute_rect   (double            b,
                                     double            d,
                                     int               plies,
                                     TrbSection       *out);

/* Saint-Venant torsion constant of a solid rectangle, sides a and b in either order. */
double   trb_section_rect_torsion_j (double            a,
                                     double            b);

G_END_DECLS
