// SPDX-License-Identifier: MIT
#include "engine/io/shared_readers.hpp"

#include "engine/io/input_limits.hpp"

namespace rackreach {

std::optional<std::vector<WorkPeriod>> read_work_pattern(JsonReader& r, const nlohmann::json& j, const JsonPath& path) {
  if (!r.array(j, path, 1, "periods") || !r.at_most(j, path, input_limits::max_work_periods, "periods"))
    return std::nullopt;
  std::vector<WorkPeriod> out;
  const NumberRule minutes{0.0, 24.0 * 60.0, true, false, "min"};
  for (std::size_t i = 0; i < j.size(); ++i) {
    const JsonPath p(path, i);
    if (!r.object(j[i], p, {"lifting_min", "recovery_min"})) continue;
    const bool lifting = j[i].contains("lifting_min");
    if (lifting == j[i].contains("recovery_min")) {
      r.add("invalid_value", p, &j[i], "each period gives exactly one of lifting_min or recovery_min");
      continue;
    }
    if (auto m = r.number(j[i], p, lifting ? "lifting_min" : "recovery_min", true, minutes))
      out.push_back({lifting ? WorkPeriod::Kind::lifting : WorkPeriod::Kind::recovery, *m});
  }
  return out;
}

LimitsOfApplication read_limits(JsonReader& r, const nlohmann::json& j, const JsonPath& path) {
  LimitsOfApplication l;
  if (!r.object(j, path,
                {"one_handed", "seated_or_kneeling", "restricted_space", "unstable_load", "wheelbarrow_or_shovel",
                 "high_speed", "carry_push_share", "floor_friction", "temperature_c", "humidity_pct"}))
    return l;
  l.one_handed = r.boolean(j, path, "one_handed", false);
  l.seated_or_kneeling = r.boolean(j, path, "seated_or_kneeling", false);
  l.restricted_space = r.boolean(j, path, "restricted_space", false);
  l.unstable_load = r.boolean(j, path, "unstable_load", false);
  l.wheelbarrow_or_shovel = r.boolean(j, path, "wheelbarrow_or_shovel", false);
  l.high_speed = r.boolean(j, path, "high_speed", false);
  l.carry_push_share = r.number(j, path, "carry_push_share", false, {0.0, 1.0, false, false, "(fraction of the work)"});
  l.floor_friction = r.number(j, path, "floor_friction", false, {0.0, 2.0, false, false, "(coefficient)"});
  l.temperature_c = r.number(j, path, "temperature_c", false, {-60.0, 70.0, false, false, "C"});
  l.humidity_pct = r.number(j, path, "humidity_pct", false, {0.0, 100.0, false, false, "%"});
  return l;
}

}  // namespace rackreach
