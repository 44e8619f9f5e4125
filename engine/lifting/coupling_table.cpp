// SPDX-License-Identifier: MIT
#include "engine/lifting/coupling_table.hpp"

namespace rackreach {

double calc_cm(Coupling coupling, bool v_at_or_above_split) {
  for (const auto& row : coupling_table_7)
    if (row.coupling == coupling) return v_at_or_above_split ? row.cm_v_at_or_above_split : row.cm_v_below_split;
  return 0.0;  // not reached: every class has a row
}

}  // namespace rackreach
