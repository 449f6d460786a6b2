/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

#include "config.h"

#include <math.h>
#include <string.h>

#include "trb-section.h"

/**
 * trb_section_init_unknown:
 * @section: the section to clear
 *
 * Sets every property to NAN and every string to empty, so that a property nobody filled in
 * reads as unknown rather than as zero. The kind is %TRB_SHAPE_CUSTOM and @plies is 1.
 */
void
trb_section_init_unknown (TrbSection *section)
{
  g_return_if_fail (section != NULL);

  memset (section, 0, sizeof *section);
  section->kind = TRB_SHAPE_CUSTOM;
  section->weight = NAN;
  section->A = section->d = section->bf = section->tw = section->tf = section->kdes = NAN;
  section->Ix = section->Zx = section->Sx = section->rx = NAN;
  section->Iy = section->Zy = section->Sy = section->ry = NAN;
  section->J = section->Cw = section->rts = section->ho = NAN;
  section->bf_2tf = section->h_tw = NAN;
  section->b = NAN;
  section->plies = 1;
  section->nominal_b_in = section->nominal_d_in = NAN;
  section->E = NAN;
  section->CF_Fb = section->CF_Ft = section->CF_Fc = NAN;
}

/* The fillet between a flange and the web is a square of side r less a quarter disc of radius
 * r centred on the far corner. Measured from the corner where the flange face meets the web
 * face (exact geometry, integrals of the square and the quarter disc):
 *   area          (1 - pi/4) r^2
 *   centroid      c = (10 - 3 pi) / (12 - 3 pi) r  from each face
 *   second moment (1 - 5 pi / 16) r^4  about either face line                              */
typedef struct
{
  double area;
  double c;      /* centroid distance from the face lines */
  double i_own;  /* second moment about its own centroidal axis parallel to a face */
} Fillet;

static Fillet
fillet_of_radius (double r)
{
  Fillet f;
  double i_face = (1.0 - 5.0 * G_PI / 16.0) * pow (r, 4);

  f.area = (1.0 - G_PI / 4.0) * r * r;
  f.c = (10.0 - 3.0 * G_PI) / (12.0 - 3.0 * G_PI) * r;
  f.i_own = i_face - f.area * f.c * f.c;
  return f;
}

/**
 * trb_section_rect_torsion_j:
 * @a: one side, m
 * @b: the other side, m
 *
 * J = a b^3 [1/3 - 0.21 (b/a)(1 - b^4 / (12 a^4))] with a the longer side (Roark's Formulas
 * for Stress and Strain, torsion of a solid rectangle (from memory)). It truncates the exact
 * series of Saint-Venant's solution; the error is below 0.2 % for every aspect ratio (square:
 * 0.1408 a^4 against the series' 0.1406 a^4).
 *
 * Returns: the torsion constant, m^4
 */
double
trb_section_rect_torsion_j (double a,
                            double b)
{
  double lo = MIN (a, b);
  double hi = MAX (a, b);
  double q;

  g_return_val_if_fail (lo > 0, NAN);

  q = lo / hi;
  return hi * pow (lo, 3) * (1.0 / 3.0 - 0.21 * q * (1.0 - pow (q, 4) / 12.0));
}

/**
 * trb_section_compute_i:
 * @d: overall depth, m
 * @bf: flange width, m
 * @tw: web thickness, m
 * @tf: flange thickness, m
 * @r: radius of the four flange-to-web fillets, m (0 for a welded shape without fillets)
 * @out: (out caller-allocates): the section
 *
 * Properties of a doubly symmetric I shape from its dimensions. The fillets count in A, I, S
 * and Z. J follows El Darwish and Johnston's fit for I shapes with fillets, as AISC Design
 * Guide 9 gives it (from memory): two flanges as rectangles by the series formula, the web
 * between the flanges as (d - 2tf) tw^3 / 3, and two junctions 2 alpha D^4, where D is the
 * diameter of the circle inscribed in the flange-web-fillet junction. Against the AISC Shapes
 * Database v16.0 it comes within 1.2 % for every W shape (tests/test-section.c); the plain
 * sum of b t^3 / 3 is off by up to 19 % there. Cw = Iy ho^2 / 4 (AISC Design Guide 9, from
 * memory), rts^2 = sqrt (Iy Cw) / Sx (AISC 360-16 Eq. F2-7), ho = d - tf.
 *
 * The kind is %TRB_SHAPE_W; the designation and weight are left for the caller.
 */
void
trb_section_compute_i (double      d,
                       double      bf,
                       double      tw,
                       double      tf,
                       double      r,
                       TrbSection *out)
{
  double hw;
  double yf, xf;
  double j_flange, j_web, alpha, dj;
  Fillet f;

  g_return_if_fail (out != NULL);
  g_return_if_fail (d > 2 * tf && bf >= tw && tw > 0 && tf > 0 && r >= 0);

  trb_section_init_unknown (out);
  out->kind = TRB_SHAPE_W;

  f = fillet_of_radius (r);
  hw = d - 2 * tf;           /* web height between the flanges */
  yf = d / 2 - tf - f.c;     /* fillet centroids from the x axis */
  xf = tw / 2 + f.c;         /* and from the y axis */

  out->d = d;
  out->bf = bf;
  out->tw = tw;
  out->tf = tf;
  out->kdes = tf + r;
  out->b = bf;

  out->A = 2 * bf * tf + hw * tw + 4 * f.area;

  out->Ix = (bf * pow (d, 3) - (bf - tw) * pow (hw, 3)) / 12
            + 4 * (f.i_own + f.area * yf * yf);
  out->Iy = 2 * tf * pow (bf, 3) / 12 + hw * pow (tw, 3) / 12
            + 4 * (f.i_own + f.area * xf * xf);

  out->Sx = out->Ix / (d / 2);
  out->Sy = out->Iy / (bf / 2);

  /* Plastic moduli: the first moment of each half about the axis, both halves added. */
  out->Zx = bf * tf * (d - tf) + tw * hw * hw / 4 + 4 * f.area * yf;
  out->Zy = tf * bf * bf / 2 + hw * tw * tw / 4 + 4 * f.area * xf;

  out->rx = sqrt (out->Ix / out->A);
  out->ry = sqrt (out->Iy / out->A);

  j_flange = trb_section_rect_torsion_j (bf, tf);
  j_web = hw * pow (tw, 3) / 3;
  alpha = -0.042 + 0.2204 * tw / tf + 0.1355 * r / tf - 0.0865 * r * tw / (tf * tf)
          - 0.0725 * (tw / tf) * (tw / tf);
  dj = ((tf + r) * (tf + r) + tw * (r + tw / 4)) / (2 * r + tf);
  out->J = 2 * j_flange + j_web + 2 * alpha * pow (dj, 4);

  out->ho = d - tf;
  out->Cw = out->Iy * out->ho * out->ho / 4;
  out->rts = sqrt (sqrt (out->Iy * out->Cw) / out->Sx);

  out->bf_2tf = bf / (2 * tf);
  /* h of a rolled shape: the clear distance between the flanges less the fillets */
  out->h_tw = (d - 2 * out->kdes) / tw;
}

/**
 * trb_section_compute_rect:
 * @b: width of one ply, m
 * @d: depth, m
 * @plies: number of plies side by side (1 for a single member)
 * @out: (out caller-allocates): the section
 *
 * Properties of the solid rectangle of width plies x b and depth d: plies nailed or bolted
 * side by side bend together about x, so the whole width counts. Torsion takes the whole
 * rectangle too (trb_section_rect_torsion_j()).
 *
 * The kind is %TRB_SHAPE_SAWN (the caller sets %TRB_SHAPE_GLULAM where it applies); b and bf
 * are the whole width; designation, weight and nominal sizes are left for the caller.
 */
void
trb_section_compute_rect (double      b,
                          double      d,
                          int         plies,
                          TrbSection *out)
{
  double w;

  g_return_if_fail (out != NULL);
  g_return_if_fail (b > 0 && d > 0 && plies >= 1);

  trb_section_init_unknown (out);
  out->kind = TRB_SHAPE_SAWN;
  out->plies = plies;

  w = plies * b;
  out->b = w;
  out->bf = w;
  out->d = d;

  out->A = w * d;
  out->Ix = w * pow (d, 3) / 12;
  out->Sx = w * d * d / 6;
  out->Zx = w * d * d / 4;
  out->rx = sqrt (out->Ix / out->A);
  out->Iy = d * pow (w, 3) / 12;
  out->Sy = d * w * w / 6;
  out->Zy = d * w * w / 4;
  out->ry = sqrt (out->Iy / out->A);
  out->J = trb_section_rect_torsion_j (w, d);
}
