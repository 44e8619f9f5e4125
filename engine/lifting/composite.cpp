// SPDX-License-Identifier: MIT
#include "engine/lifting/composite.hpp"

#include <algorithm>
#include <limits>
#include <cstdio>
#include <numeric>

namespace rackreach {

CompositeItem make_composite_item(const LiftTask& task, const TaskResult& result, UnitSystem units) {
  const bool use_destination = task.control_at_destination && result.destination.firwl < result.origin.firwl;
  const PointResult& p = use_destination ? result.destination : result.origin;
  return {task.id, p.fili, p.stli, task.frequency_per_min, task.origin.v < find_constants(units).v_split};
}

std::vector<std::size_t> order_for_composite(const std::vector<CompositeItem>& items) {
  std::vector<std::size_t> order(items.size());
  std::iota(order.begin(), order.end(), std::size_t{0});
  auto key = [&](std::size_t i) { return items[i].stli.value_or(std::numeric_limits<double>::infinity()); };
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) {
    if (key(a) != key(b)) return key(a) > key(b);
    return items[a].frequency_per_min > items[b].frequency_per_min;
  });
  return order;
}

CompositeResult calc_composite_li(const std::vector<CompositeItem>& items, std::optional<DurationCategory> duration,
                                  RoundingMode mode) {
  if (items.empty()) {
    CompositeResult out;
    out.undefined_reason = "the job has no tasks";
    return out;
  }
  const std::vector<std::size_t> order = order_for_composite(items);
  std::vector<CompositeItem> ordered;
  ordered.reserve(items.size());
  for (std::size_t i : order) ordered.push_back(items[i]);
  return calc_composite_sum(ordered, duration, mode);
}

CompositeResult calc_composite_sum(const std::vector<CompositeItem>& ordered, std::optional<DurationCategory> duration,
                                   RoundingMode mode) {
  CompositeResult out;
  if (ordered.empty()) {
    out.undefined_reason = "the job has no tasks";
    return out;
  }
  double cumulative_f = 0.0;
  bool any_below_split = false;
  double fm_previous = 0.0;
  double cli = 0.0;
  std::optional<std::string> undefined;
  for (std::size_t k = 0; k < ordered.size(); ++k) {
    const CompositeItem& item = ordered[k];
    cumulative_f += item.frequency_per_min;
    any_below_split = any_below_split || item.origin_v_below_split;
    CompositeTerm term{item.id, item.fili, item.stli, item.frequency_per_min, cumulative_f, 0.0, fm_previous, 0.0};
    if (duration) term.fm_cumulative = round_multiplier(calc_fm(cumulative_f, *duration, !any_below_split).fm, mode);
    if (!undefined) {
      if (!duration) {
        undefined = "lifting lasts more than 8 h: Table 5 has no column";
      } else if (k == 0) {
        if (!item.stli) undefined = "task \"" + item.id + "\" has no STLI (its STRWL is 0)";
        else term.increment = *item.stli;
      } else if (!item.fili) {
        undefined = "task \"" + item.id + "\" has no FILI (its FIRWL is 0)";
      } else if (term.fm_cumulative <= 0.0) {
        char buf[160];
        std::snprintf(buf, sizeof buf, "FM at the combined frequency %g lifts/min is 0 (beyond Table 5)", cumulative_f);
        undefined = buf;
      } else {
        term.increment = *item.fili * (1.0 / term.fm_cumulative - 1.0 / fm_previous);
      }
      if (!undefined) cli += term.increment;
    }
    fm_previous = term.fm_cumulative;
    out.terms.push_back(term);
  }
  if (undefined) out.undefined_reason = undefined;
  else out.cli = round_result(cli, mode);
  return out;
}

}  // namespace rackreach
