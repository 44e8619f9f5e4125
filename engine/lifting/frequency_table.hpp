// SPDX-License-Identifier: MIT
#pragma once
// Frequency Multiplier, Table 5 of Waters, Putz-Anderson, Garg (1994), Applications Manual for the Revised
// NIOSH Lifting Equation, DHHS (NIOSH) Publication No. 94-110 (revised edition 2021).
//
// Scope: F from 0.2 to 15 lifts/min; work duration short/moderate/long; V at the ORIGIN below or at/above
// 75 cm (30 in). Rules applied here, as published (Applications Manual 1.3.5 and Table 5):
//  - F < 0.2 lifts/min uses the 0.2 row;
//  - F between two printed rows is interpolated linearly;
//  - F above the last non-zero row of its column gives FM = 0 (the zero cells, and every column above 15/min).
// Departure: none. Rows 11-15 were read in one printed copy and are still to be confirmed against a second.

#include <array>
#include <string_view>

#include "engine/lifting/duration_category.hpp"

namespace rackreach {

/// One printed row of Table 5: F in lifts/min and FM for the six columns in printed order
/// (short V<75, short V>=75, moderate V<75, moderate V>=75, long V<75, long V>=75).
struct FrequencyTableRow {
  double lifts_per_min;
  std::array<double, 6> fm;
};

/// Table 5 as printed (Waters et al. 1994, Applications Manual, Table 5). The ">15" row (all 0.00) is the
/// rule "above the last non-zero row, FM = 0" in calc_fm.
inline constexpr std::array<FrequencyTableRow, 17> frequency_table_5{{
    {0.2, {1.00, 1.00, 0.95, 0.95, 0.85, 0.85}},
    {0.5, {0.97, 0.97, 0.92, 0.92, 0.81, 0.81}},
    {1, {0.94, 0.94, 0.88, 0.88, 0.75, 0.75}},
    {2, {0.91, 0.91, 0.84, 0.84, 0.65, 0.65}},
    {3, {0.88, 0.88, 0.79, 0.79, 0.55, 0.55}},
    {4, {0.84, 0.84, 0.72, 0.72, 0.45, 0.45}},
    {5, {0.80, 0.80, 0.60, 0.60, 0.35, 0.35}},
    {6, {0.75, 0.75, 0.50, 0.50, 0.27, 0.27}},
    {7, {0.70, 0.70, 0.42, 0.42, 0.22, 0.22}},
    {8, {0.60, 0.60, 0.35, 0.35, 0.18, 0.18}},
    {9, {0.52, 0.52, 0.30, 0.30, 0.00, 0.15}},
    {10, {0.45, 0.45, 0.26, 0.26, 0.00, 0.13}},
    {11, {0.41, 0.41, 0.00, 0.23, 0.00, 0.00}},
    {12, {0.37, 0.37, 0.00, 0.21, 0.00, 0.00}},
    {13, {0.00, 0.34, 0.00, 0.00, 0.00, 0.00}},
    {14, {0.00, 0.31, 0.00, 0.00, 0.00, 0.00}},
    {15, {0.00, 0.28, 0.00, 0.00, 0.00, 0.00}},
}};

/// Column index of Table 5 for a duration and whether V at the origin is at or above the split height.
constexpr int frequency_column(DurationCategory duration, bool origin_v_at_or_above_split) {
  return static_cast<int>(duration) * 2 + (origin_v_at_or_above_split ? 1 : 0);
}

/// How calc_fm arrived at its value.
enum class FrequencyLookup {
  printed_row,      ///< F is a printed row
  raised_to_min,    ///< F < 0.2: the 0.2 row was used
  interpolated,     ///< F between two printed rows
  beyond_table,     ///< F above the last non-zero row of the column: FM = 0
};

struct FrequencyMultiplier {
  double fm;
  FrequencyLookup lookup;
  double lifts_per_min_used;  ///< F after the F < 0.2 rule
};

/// FM for F lifts/min (F > 0), a duration category and the origin-height column. Pure; no rounding.
FrequencyMultiplier calc_fm(double lifts_per_min, DurationCategory duration, bool origin_v_at_or_above_split);

// calc_fm finds the row by arithmetic: rows 0.2, 0.5, then 1, 2, ..., 15 in steps of 1.
static_assert([] {
  if (frequency_table_5[0].lifts_per_min != 0.2 || frequency_table_5[1].lifts_per_min != 0.5) return false;
  for (std::size_t i = 2; i < frequency_table_5.size(); ++i)
    if (frequency_table_5[i].lifts_per_min != static_cast<double>(i - 1)) return false;
  return true;
}());

/// The largest F with a non-zero FM in each column (the "last non-zero row"), derived from the table at compile time.
inline constexpr std::array<double, 6> last_nonzero_frequency = [] {
  std::array<double, 6> last{};
  for (int col = 0; col < 6; ++col)
    for (const auto& row : frequency_table_5)
      if (row.fm[col] > 0.0) last[col] = row.lifts_per_min;
  return last;
}();

/// The largest F with a non-zero FM in a column.
constexpr double find_last_nonzero_frequency(DurationCategory duration, bool origin_v_at_or_above_split) {
  return last_nonzero_frequency[frequency_column(duration, origin_v_at_or_above_split)];
}

}  // namespace rackreach
