// SPDX-License-Identifier: MIT
#include "engine/lifting/limits_of_application.hpp"

namespace rackreach {

void add_limit_warnings(const LimitsOfApplication& l, std::vector<Warning>& out) {
  auto flag = [&](const std::optional<bool>& v, WarningKind kind) {
    if (v.value_or(false)) out.push_back({kind, LiftEnd::origin, 1.0, 0.0, {}});
  };
  flag(l.one_handed, WarningKind::one_handed);
  flag(l.seated_or_kneeling, WarningKind::seated_or_kneeling);
  flag(l.restricted_space, WarningKind::restricted_space);
  flag(l.unstable_load, WarningKind::unstable_load);
  flag(l.wheelbarrow_or_shovel, WarningKind::wheelbarrow_or_shovel);
  flag(l.high_speed, WarningKind::high_speed);
  if (l.carry_push_share && *l.carry_push_share > max_carry_push_share)
    out.push_back({WarningKind::carry_push_share, LiftEnd::origin, *l.carry_push_share, max_carry_push_share, {}});
  if (l.floor_friction && *l.floor_friction < min_floor_friction)
    out.push_back({WarningKind::floor_friction, LiftEnd::origin, *l.floor_friction, min_floor_friction, {}});
  if (l.temperature_c && (*l.temperature_c < min_temperature_c || *l.temperature_c > max_temperature_c))
    out.push_back({WarningKind::temperature, LiftEnd::origin, *l.temperature_c, 0.0, {}});
  if (l.humidity_pct && (*l.humidity_pct < min_humidity_pct || *l.humidity_pct > max_humidity_pct))
    out.push_back({WarningKind::humidity, LiftEnd::origin, *l.humidity_pct, 0.0, {}});
}

}  // namespace rackreach
