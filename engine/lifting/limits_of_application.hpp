// SPDX-License-Identifier: MIT
#pragma once
// Limits of application of the lifting equation (Waters et al. 1994, Applications Manual 1.2): conditions
// under which the equation does not apply or underestimates the risk. Each is an optional field of a task;
// any that applies puts a coded warning on the task. The numbers are the manual's: non-lifting activity
// (carrying, pushing, pulling) above about 10% of the work; lifting faster than about 76 cm/s (30 in/s);
// foot-floor coefficient of friction below 0.4; temperature outside 19-26 C; relative humidity outside 35-50%.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/warning.hpp"

namespace rackreach {

struct LimitsOfApplication {
  std::optional<bool> one_handed;
  std::optional<bool> seated_or_kneeling;
  std::optional<bool> restricted_space;
  std::optional<bool> unstable_load;
  std::optional<bool> wheelbarrow_or_shovel;
  std::optional<bool> high_speed;                ///< faster than about 76 cm/s (30 in/s)
  std::optional<double> carry_push_share;        ///< fraction 0..1 of the work spent carrying, pushing or pulling
  std::optional<double> floor_friction;          ///< foot-floor coefficient of friction
  std::optional<double> temperature_c;           ///< air temperature, degrees Celsius
  std::optional<double> humidity_pct;            ///< relative humidity, percent
  bool operator==(const LimitsOfApplication&) const = default;
};

/// The manual's thresholds (Applications Manual 1.2), stored once.
inline constexpr double max_carry_push_share = 0.10;
inline constexpr double min_floor_friction = 0.4;
inline constexpr double min_temperature_c = 19.0;
inline constexpr double max_temperature_c = 26.0;
inline constexpr double min_humidity_pct = 35.0;
inline constexpr double max_humidity_pct = 50.0;
inline constexpr double max_lift_speed_cm_per_s = 76.0;

/// Appends a warning for every limit of application that applies to a task, in a fixed order.
void add_limit_warnings(const LimitsOfApplication& limits, std::vector<Warning>& out);

}  // namespace rackreach
