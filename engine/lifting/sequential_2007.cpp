// SPDX-License-Identifier: MIT
#include "engine/lifting/sequential_2007.hpp"

#include <cmath>
#include <utility>

namespace rackreach {

SequentialResult calc_sequential_li(const std::vector<SequentialSlot>& slots, RoundingMode mode) {
  SequentialResult out;
  if (slots.empty()) {
    out.undefined_reason = "the rotation has no slots";
    return out;
  }
  for (const SequentialSlot& s : slots) {
    if (!s.cli) {
      out.undefined_reason = "slot \"" + s.id + "\" has no CLI";
      return out;
    }
    if (!std::isfinite(*s.cli) || *s.cli <= 0.0) {
      out.undefined_reason = "slot \"" + s.id + "\" has a CLI that is not a finite number > 0";
      return out;
    }
    if (!std::isfinite(s.time_min) || s.time_min <= 0.0) {
      out.undefined_reason = "slot \"" + s.id + "\" has a time that is not a finite number of minutes > 0";
      return out;
    }
    out.total_time_min += s.time_min;
  }
  std::size_t m = 0;
  for (std::size_t j = 1; j < slots.size(); ++j) {
    const bool larger = *slots[j].cli > *slots[m].cli;
    const bool tie_more_protective = *slots[j].cli == *slots[m].cli && slots[j].cli_whole_rotation.value_or(0.0) >
                                                                           slots[m].cli_whole_rotation.value_or(0.0);
    if (larger || tie_more_protective) m = j;
  }
  out.max_slot = m;
  out.cli_max = *slots[m].cli;
  if (!slots[m].cli_whole_rotation || !std::isfinite(*slots[m].cli_whole_rotation)) {
    out.undefined_reason = "slot \"" + slots[m].id + "\" (CLI_max) has no CLI for the whole rotation";
    return out;
  }
  out.cli_max_total = *slots[m].cli_whole_rotation;
  double weighted = 0.0;
  for (const SequentialSlot& s : slots) weighted += *s.cli * s.time_min;
  out.k = weighted / (out.cli_max * out.total_time_min);
  out.sli = round_result(out.cli_max + (out.cli_max_total - out.cli_max) * *out.k, mode);
  return out;
}

SequentialSlot make_sequential_slot(std::string id, const std::vector<CompositeItem>& items,
                                    std::optional<DurationCategory> own_duration,
                                    std::optional<DurationCategory> rotation_duration, double time_min,
                                    RoundingMode mode) {
  return {std::move(id), calc_composite_li(items, own_duration, mode).cli, time_min,
          calc_composite_li(items, rotation_duration, mode).cli};
}

}  // namespace rackreach
