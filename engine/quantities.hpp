// SPDX-License-Identifier: MIT
#pragma once
// The few unit-carrying types of Rackreach.
//
// The lifting equation has a metric form (cm, kg) and a US form (in, lb) whose constants are not exact
// conversions of each other, so a task keeps the unit system it was entered in and is computed with that
// form. Lengths and masses that cross an API are therefore either unit-suffixed (`height_cm`) or carried
// together with their UnitSystem.

#include <string_view>

namespace rackreach {

/// The unit system of a project file and of every length and mass in it.
enum class UnitSystem { metric, us };

/// cm or in.
constexpr std::string_view length_unit(UnitSystem u) { return u == UnitSystem::metric ? "cm" : "in"; }
/// kg or lb.
constexpr std::string_view mass_unit(UnitSystem u) { return u == UnitSystem::metric ? "kg" : "lb"; }
constexpr std::string_view unit_system_name(UnitSystem u) { return u == UnitSystem::metric ? "metric" : "us"; }

/// Exact by definition: international yard and pound agreement (1959): 1 in = 2.54 cm, 1 lb = 0.45359237 kg.
inline constexpr double cm_per_in = 2.54;
inline constexpr double kg_per_lb = 0.45359237;

/// A length in the unit of `unit` (cm for metric, in for us).
struct Length {
  double value = 0.0;
  UnitSystem unit = UnitSystem::metric;

  constexpr double in_cm() const { return unit == UnitSystem::metric ? value : value * cm_per_in; }
  constexpr double in_units(UnitSystem target) const {
    if (target == unit) return value;
    return target == UnitSystem::metric ? value * cm_per_in : value / cm_per_in;
  }
};

/// A mass in the unit of `unit` (kg for metric, lb for us).
struct Mass {
  double value = 0.0;
  UnitSystem unit = UnitSystem::metric;

  constexpr double in_kg() const { return unit == UnitSystem::metric ? value : value * kg_per_lb; }
  constexpr double in_units(UnitSystem target) const {
    if (target == unit) return value;
    return target == UnitSystem::metric ? value * kg_per_lb : value / kg_per_lb;
  }
};

}  // namespace rackreach
