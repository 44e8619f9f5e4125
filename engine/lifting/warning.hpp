// SPDX-License-Identifier: MIT
#pragma once
// Coded warnings on tasks and jobs. A warning is stored as a kind and its numbers; its words are made only when
// it is shown (describe_warning), so evaluating a large store costs no string building.

#include <cstdint>
#include <string>
#include <string_view>

#include "engine/quantities.hpp"

namespace rackreach {

enum class LiftEnd { origin, destination };
constexpr std::string_view lift_end_name(LiftEnd e) { return e == LiftEnd::origin ? "origin" : "destination"; }

enum class WarningKind : std::uint8_t {
  // A zero multiplier: the task is outside the equation at that end (value: the input, limit: the bound).
  hm_zero, vm_zero, dm_zero, am_zero, fm_zero,
  // Limits of application (Applications Manual 1.2); value where a number decides it.
  one_handed, seated_or_kneeling, restricted_space, unstable_load, wheelbarrow_or_shovel, high_speed,
  carry_push_share, floor_friction, temperature, humidity, duration_over_8h,
  // Flags of the composite procedure (Applications Manual 2.4) and job-level notes.
  fili_above_1, stli_above_1, cli_undefined,
  // Reach checks of a task with shelf geometry (note: the check's own sentence).
  reach_limit, reach_h_differs, reach_input,
};

struct Warning {
  WarningKind kind = WarningKind::hm_zero;
  LiftEnd end = LiftEnd::origin;  ///< for zero multipliers
  double value = 0.0;
  double limit = 0.0;
  std::string note;  ///< ids and reasons for job-level warnings; empty otherwise

  /// True for the limits of application: the equation may underestimate the risk.
  bool is_limit_of_application() const {
    return kind >= WarningKind::one_handed && kind <= WarningKind::duration_over_8h;
  }
  bool operator==(const Warning&) const = default;
};

/// Stable code, e.g. "outside.HM.origin", "limit.one_handed", "flag.fili_above_1".
std::string_view warning_code(const Warning& w);
/// Plain words with the numbers and their units.
std::string describe_warning(const Warning& w, UnitSystem units);

}  // namespace rackreach
