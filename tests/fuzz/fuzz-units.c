/* SPDX-FileCopyrightText: 2026 The Trabeate developers
 * SPDX-License-Identifier: GPL-3.0-or-later */

/* libFuzzer harness: any bytes as the text of a quantity, parsed as every dimension. A parse
 * gives a finite value or a TRB_ERROR_UNIT whose message is valid UTF-8; a value is then
 * formatted for display in both unit systems. Anything else aborts, and so does any fault the
 * sanitizers see. Built by tests/fuzz/meson.build with clang only; run by build-aux/fuzz. */

#include "config.h"

#include <glib.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#include "trb-error.h"
#include "trb-units.h"

int LLVMFuzzerTestOneInput (const uint8_t *data,
                            size_t         size);

static void
require (gboolean    ok,
         const char *what)
{
  if (!ok)
    {
      g_printerr ("fuzz-units: %s\n", what);
      abort ();
    }
}

static void
check_text (char *text)
{
  require (text != NULL && g_utf8_validate (text, -1, NULL), "formatted text not UTF-8");
  g_free (text);
}

int
LLVMFuzzerTestOneInput (const uint8_t *data,
                        size_t         size)
{
  /* a project's attribute holds no NUL: the text ends at the first one */
  g_autofree char *text = g_strndup ((const char *) data, size);

  for (int dim = 0; dim < TRB_N_DIMS; dim++)
    {
      g_autoptr(GError) error = NULL;
      double value = 12345.0;

      if (!trb_units_parse (text, dim, &value, &error))
        {
          require (error != NULL && error->domain == TRB_ERROR, "a failure without a TRB_ERROR");
          require (error->code == TRB_ERROR_UNIT, "a failure that is not TRB_ERROR_UNIT");
          require (g_utf8_validate (error->message, -1, NULL), "an error that is not UTF-8");
          require (value == 12345.0, "a failure that changed the value");
          continue;
        }
      require (error == NULL, "a value and an error");
      require (isfinite (value), "a value that is not finite");

      for (int system = TRB_UNIT_SYSTEM_US; system <= TRB_UNIT_SYSTEM_SI; system++)
        {
          double shown = trb_units_to_display (value, dim, system);

          check_text (trb_units_format (value, dim, system));
          require (trb_units_display_unit (dim, system) != NULL, "no display unit");
          (void) trb_units_display_decimals (shown, dim, system);
        }
      if (dim == TRB_DIM_LENGTH)
        {
          check_text (trb_units_format_length_ft_in (value, 16));
          check_text (trb_units_format_small_length (value, TRB_UNIT_SYSTEM_US));
          check_text (trb_units_format_small_length (value, TRB_UNIT_SYSTEM_SI));
        }
    }
  return 0;
}
