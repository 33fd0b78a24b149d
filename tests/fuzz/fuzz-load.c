/* SPDX-License-Identifier: GPL-3.0-or-later */
/* libFuzzer harness: the design loader and validator, and the saver on
 * whatever loads. */
#include "config.h"

#include "sw-design.h"

#include <math.h>
#include <stdint.h>

int LLVMFuzzerTestOneInput (const uint8_t *data, size_t size);

int
LLVMFuzzerTestOneInput (const uint8_t *data, size_t size)
{
  g_autoptr (GPtrArray) warnings = g_ptr_array_new_with_free_func (g_free);
  g_autoptr (GError) error = NULL;
  g_autoptr (SwDesign) design = NULL;

  design = sw_design_load_data ((const char *) data, (gssize) size, "fuzz.stagewright",
                                warnings, &error);
  if (design == NULL)
    {
      /* Every failure must say why. */
      if (error == NULL || error->message == NULL || error->message[0] == '\0')
        __builtin_trap ();
      return 0;
    }

  /* What loads must save and load back to the same design. */
  {
    g_autofree char *text = sw_design_to_data (design, NULL);
    g_autoptr (SwDesign) again = sw_design_load_data (text, -1, "again", NULL, NULL);
    if (again == NULL || !sw_design_equal (design, again))
      __builtin_trap ();
  }
  return 0;
}
