/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */
#pragma once

#include <adwaita.h>

#include "trb-units.h"

G_BEGIN_DECLS

#define TRB_TYPE_QUANTITY_ROW (trb_quantity_row_get_type ())

G_DECLARE_FINAL_TYPE (TrbQuantityRow, trb_quantity_row, TRB, QUANTITY_ROW, AdwEntryRow)

/* An entry row for a quantity: it takes any unit of the right dimension ("12 ft 6 in",
 * "3.8 m"), shows a bad text's error in place of its title while it is wrong, and emits
 * ::value-applied (SI) only for good text, so that bad text never reaches the model.
 * A row made with trb_quantity_row_new_span_ratio() reads deflection limits instead: "L/360",
 * "360" or "none". */

GtkWidget   *trb_quantity_row_new             (const char     *title,
                                               TrbDimension    dimension,
                                               gboolean        optional);
GtkWidget   *trb_quantity_row_new_span_ratio  (const char     *title);
void         trb_quantity_row_set_value       (TrbQuantityRow *self,
                                               double          value,
                                               TrbUnitSystem   units);
gboolean     trb_quantity_row_parse           (TrbQuantityRow *self,
                                               double         *value,
                                               GError        **error);
void         trb_quantity_row_show_error      (TrbQuantityRow *self,
                                               const char     *message);
const char  *trb_quantity_row_get_error       (TrbQuantityRow *self);

G_END_DECLS
