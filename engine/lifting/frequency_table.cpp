// SPDX-License-Identifier: MIT
#include "engine/lifting/frequency_table.hpp"

namespace rackreach {

FrequencyMultiplier calc_fm(double lifts_per_min, DurationCategory duration, bool origin_v_at_or_above_split) {
  const int col = frequency_column(duration, origin_v_at_or_above_split);
  const double f_min = frequency_table_5.front().lifts_per_min;
  if (lifts_per_min < f_min) return {frequency_table_5.front().fm[col], FrequencyLookup::raised_to_min, f_min};
  if (lifts_per_min > last_nonzero_frequency[col])
    return {0.0, FrequencyLookup::beyond_table, lifts_per_min};
  // Rows are 0.2, 0.5, 1, 2, ..., 15 lifts/min: the row at or below F is found by arithmetic, not by search.
  const std::size_t i = lifts_per_min < 0.5 ? 0 : lifts_per_min < 1.0 ? 1 : 1 + static_cast<std::size_t>(lifts_per_min);
  const auto& row = frequency_table_5[i];
  if (lifts_per_min == row.lifts_per_min) return {row.fm[col], FrequencyLookup::printed_row, lifts_per_min};
  const auto& next = frequency_table_5[i + 1];  // exists: F is at most the last non-zero row, at most 15
  const double t = (lifts_per_min - row.lifts_per_min) / (next.lifts_per_min - row.lifts_per_min);
  return {row.fm[col] + t * (next.fm[col] - row.fm[col]), FrequencyLookup::interpolated, lifts_per_min};
}

}  // namespace rackreach
