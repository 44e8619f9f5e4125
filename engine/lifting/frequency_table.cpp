// SPDX-License-Identifier: MIT
#include "engine/lifting/frequency_table.hpp"

namespace rackreach {

double find_last_nonzero_frequency(DurationCategory duration, bool origin_v_at_or_above_split) {
  const int col = frequency_column(duration, origin_v_at_or_above_split);
  double last = frequency_table_5.front().lifts_per_min;
  for (const auto& row : frequency_table_5)
    if (row.fm[col] > 0.0) last = row.lifts_per_min;
  return last;
}

FrequencyMultiplier calc_fm(double lifts_per_min, DurationCategory duration, bool origin_v_at_or_above_split) {
  const int col = frequency_column(duration, origin_v_at_or_above_split);
  const double f_min = frequency_table_5.front().lifts_per_min;
  if (lifts_per_min < f_min) return {frequency_table_5.front().fm[col], FrequencyLookup::raised_to_min, f_min};
  if (lifts_per_min > find_last_nonzero_frequency(duration, origin_v_at_or_above_split))
    return {0.0, FrequencyLookup::beyond_table, lifts_per_min};
  for (std::size_t i = 0; i < frequency_table_5.size(); ++i) {
    const auto& row = frequency_table_5[i];
    if (lifts_per_min == row.lifts_per_min) return {row.fm[col], FrequencyLookup::printed_row, lifts_per_min};
    const auto& next = frequency_table_5[i + 1];  // exists: F is at most the last non-zero row
    if (lifts_per_min < next.lifts_per_min) {
      const double t = (lifts_per_min - row.lifts_per_min) / (next.lifts_per_min - row.lifts_per_min);
      return {row.fm[col] + t * (next.fm[col] - row.fm[col]), FrequencyLookup::interpolated, lifts_per_min};
    }
  }
  return {0.0, FrequencyLookup::beyond_table, lifts_per_min};  // not reached
}

}  // namespace rackreach
