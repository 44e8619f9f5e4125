// SPDX-License-Identifier: MIT
#pragma once
// Coupling Multiplier, Table 7 of Waters, Putz-Anderson, Garg (1994), Applications Manual for the Revised
// NIOSH Lifting Equation, DHHS (NIOSH) 94-110. CM depends on the coupling class (Table 6) and on V at the
// point evaluated: below 75 cm (30 in) or at/above it. The "poor" row was read in one printed copy and is
// still to be confirmed against a second.

#include <optional>
#include <string_view>

namespace rackreach {

/// Hand-to-object coupling class (Applications Manual, Table 6).
enum class Coupling { good, fair, poor };

constexpr std::string_view coupling_name(Coupling c) {
  switch (c) {
    case Coupling::good: return "good";
    case Coupling::fair: return "fair";
    case Coupling::poor: return "poor";
  }
  return "?";
}

constexpr std::optional<Coupling> find_coupling(std::string_view name) {
  if (name == "good") return Coupling::good;
  if (name == "fair") return Coupling::fair;
  if (name == "poor") return Coupling::poor;
  return std::nullopt;
}

/// Table 7 as printed: {V < 75 cm (30 in), V >= 75 cm (30 in)} per coupling class.
struct CouplingTableRow {
  Coupling coupling;
  double cm_v_below_split;
  double cm_v_at_or_above_split;
};

inline constexpr CouplingTableRow coupling_table_7[] = {
    {Coupling::good, 1.00, 1.00},
    {Coupling::fair, 0.95, 1.00},
    {Coupling::poor, 0.90, 0.90},
};

/// CM for a coupling class at a point whose V is below or at/above the split height.
double calc_cm(Coupling coupling, bool v_at_or_above_split);

}  // namespace rackreach
