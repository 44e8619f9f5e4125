// SPDX-License-Identifier: MIT
#include "engine/lifting/limits_of_application.hpp"

#include <cstdio>

namespace rackreach {
namespace {

std::string fmt(const char* pattern, double a) {
  char buf[200];
  std::snprintf(buf, sizeof buf, pattern, a);
  return buf;
}

}  // namespace

std::vector<LimitFinding> find_limit_findings(const LimitsOfApplication& l) {
  std::vector<LimitFinding> out;
  auto flag = [&](const std::optional<bool>& v, const char* code, const char* msg) {
    if (v.value_or(false)) out.push_back({code, msg});
  };
  flag(l.one_handed, "limit.one_handed", "lifting with one hand: outside the equation's limits of application");
  flag(l.seated_or_kneeling, "limit.seated_or_kneeling",
       "lifting while seated or kneeling: outside the equation's limits of application");
  flag(l.restricted_space, "limit.restricted_space",
       "lifting in a restricted work space: outside the equation's limits of application");
  flag(l.unstable_load, "limit.unstable_load", "unstable object: outside the equation's limits of application");
  flag(l.wheelbarrow_or_shovel, "limit.wheelbarrow_or_shovel",
       "wheelbarrow or shovel: outside the equation's limits of application");
  flag(l.high_speed, "limit.high_speed",
       "high-speed lifting (faster than about 76 cm/s): outside the equation's limits of application");
  if (l.carry_push_share && *l.carry_push_share > max_carry_push_share)
    out.push_back({"limit.carry_push_share",
                   fmt("carrying, pushing or pulling is %.0f%% of the work (the equation assumes at most about 10%%)",
                       *l.carry_push_share * 100.0)});
  if (l.floor_friction && *l.floor_friction < min_floor_friction)
    out.push_back({"limit.floor_friction",
                   fmt("foot-floor coefficient of friction %.2f is below 0.4: outside the equation's limits",
                       *l.floor_friction)});
  if (l.temperature_c && (*l.temperature_c < min_temperature_c || *l.temperature_c > max_temperature_c))
    out.push_back({"limit.temperature",
                   fmt("temperature %.1f C is outside 19-26 C: outside the equation's limits", *l.temperature_c)});
  if (l.humidity_pct && (*l.humidity_pct < min_humidity_pct || *l.humidity_pct > max_humidity_pct))
    out.push_back({"limit.humidity",
                   fmt("relative humidity %.0f%% is outside 35-50%%: outside the equation's limits", *l.humidity_pct)});
  return out;
}

}  // namespace rackreach
