// SPDX-License-Identifier: MIT
#include "engine/slotting/store.hpp"

#include <algorithm>

namespace rackreach {

std::vector<WorkPeriod> Shift::work_pattern() const {
  std::vector<Break> sorted = breaks;
  auto offset = [this](int t) { return t >= start_min ? t - start_min : t + 24 * 60 - start_min; };
  std::sort(sorted.begin(), sorted.end(), [&](const Break& a, const Break& b) { return offset(a.start_min) < offset(b.start_min); });
  std::vector<WorkPeriod> out;
  double t = 0.0;
  for (const Break& b : sorted) {
    const double at = offset(b.start_min);
    if (at > t) out.push_back({WorkPeriod::Kind::lifting, at - t});
    out.push_back({WorkPeriod::Kind::recovery, b.minutes});
    t = at + b.minutes;
  }
  if (length_min() > t) out.push_back({WorkPeriod::Kind::lifting, length_min() - t});
  return out;
}

const Part* Store::find_part(const std::string& id) const {
  for (const Part& p : parts)
    if (p.id == id) return &p;
  return nullptr;
}
const Rack* Store::find_rack(const std::string& id) const {
  for (const Rack& r : racks)
    if (r.id == id) return &r;
  return nullptr;
}
const Zone* Store::find_zone(const std::string& id) const {
  for (const Zone& z : zones)
    if (z.id == id) return &z;
  return nullptr;
}
const Level* Store::find_level(const Rack& rack, const std::string& level_id) const {
  for (const Level& l : rack.levels)
    if (l.id == level_id) return &l;
  return nullptr;
}

}  // namespace rackreach
