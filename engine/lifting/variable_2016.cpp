// SPDX-License-Identifier: MIT
#include "engine/lifting/variable_2016.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <numeric>

namespace rackreach {

namespace {

bool usable_fili(const VariableSubtask& s) {
  return s.fili && std::isfinite(*s.fili) && *s.fili >= 0.0;
}

std::string zero_fm_reason(double lifts_per_min) {
  char buf[160];
  std::snprintf(buf, sizeof buf, "FM at the combined frequency %g lifts/min is 0 (beyond Table 5)", lifts_per_min);
  return buf;
}

}  // namespace

VariableSubtask make_variable_subtask(const LiftTask& task, const TaskResult& result, UnitSystem units) {
  const CompositeItem item = make_composite_item(task, result, units);
  return {item.id, item.fili, item.frequency_per_min, item.origin_v_below_split};
}

std::vector<VariableCategory> calc_vli_categories(const std::vector<VariableSubtask>& subtasks) {
  if (subtasks.empty() || !std::all_of(subtasks.begin(), subtasks.end(), usable_fili)) return {};
  const auto [min_it, max_it] =
      std::minmax_element(subtasks.begin(), subtasks.end(),
                          [](const VariableSubtask& a, const VariableSubtask& b) { return *a.fili < *b.fili; });
  const double lo = *min_it->fili;
  const double hi = *max_it->fili;
  const double span = hi - lo;
  constexpr int top = vli_category_count - 1;

  std::array<VariableCategory, vli_category_count> classes{};
  for (int c = 0; c < vli_category_count; ++c) {
    classes[c].fili_class = c;
    classes[c].class_low = lo + span * c / vli_category_count;
    classes[c].class_high = c == top ? hi : lo + span * (c + 1) / vli_category_count;
    classes[c].origin_v_below_split = false;
  }
  for (std::size_t i = 0; i < subtasks.size(); ++i) {
    const VariableSubtask& s = subtasks[i];
    // Multiplying before dividing keeps dyadic boundaries exact (FILI 0.5 of 0..3 is class 1, not 0.99999).
    const int c = span > 0.0 ? std::min(top, static_cast<int>(std::floor((*s.fili - lo) * vli_category_count / span)))
                             : top;  // all FILI equal: one class, the top one
    VariableCategory& cat = classes[c];
    cat.fili = cat.members.empty() ? *s.fili : std::max(cat.fili, *s.fili);
    cat.frequency_per_min += s.frequency_per_min;
    cat.origin_v_below_split = cat.origin_v_below_split || s.origin_v_below_split;
    cat.members.push_back(i);
  }
  std::vector<VariableCategory> out;
  for (int c = top; c >= 0; --c)
    if (!classes[c].members.empty()) out.push_back(std::move(classes[c]));
  return out;
}

VariableResult calc_variable_li(const std::vector<VariableSubtask>& subtasks, std::optional<DurationCategory> duration,
                                RoundingMode mode) {
  VariableResult out;
  if (subtasks.empty()) {
    out.undefined_reason = "the job has no lifts";
    return out;
  }
  for (const VariableSubtask& s : subtasks) {
    if (!s.fili) {
      out.undefined_reason = "lift \"" + s.id + "\" has no FILI (its FIRWL is 0)";
      return out;
    }
    if (!usable_fili(s)) {
      out.undefined_reason = "lift \"" + s.id + "\" has a FILI that is not a finite number >= 0";
      return out;
    }
  }
  out.categories = calc_vli_categories(subtasks);
  if (!duration) {
    out.undefined_reason = "lifting lasts more than 8 h: Table 5 has no column";
    return out;
  }
  std::vector<CompositeItem> items;
  items.reserve(out.categories.size());
  for (VariableCategory& cat : out.categories) {
    cat.fm = round_multiplier(calc_fm(cat.frequency_per_min, *duration, !cat.origin_v_below_split).fm, mode);
    if (cat.fm > 0.0) cat.stli = round_result(cat.fili / cat.fm, mode);
    items.push_back({"FILI class " + std::to_string(cat.fili_class + 1), cat.fili, cat.stli, cat.frequency_per_min,
                     cat.origin_v_below_split});
  }
  // The first category's summed frequency is its own: the composite sum would call its missing STLI a task's.
  if (!out.categories.front().stli) {
    out.undefined_reason = zero_fm_reason(out.categories.front().frequency_per_min);
    return out;
  }
  CompositeResult sum = calc_composite_sum(items, duration, mode);
  out.terms = std::move(sum.terms);
  if (!sum.cli) {
    out.undefined_reason = sum.undefined_reason;
    return out;
  }
  out.vli = sum.cli;
  out.contributions.assign(subtasks.size(), 0.0);
  for (std::size_t k = 0; k < out.categories.size(); ++k) {
    const VariableCategory& cat = out.categories[k];
    for (std::size_t i : cat.members) {
      // F_k > 0 for valid input (frequencies > 0); an all-zero category shares its increment equally.
      const double share = cat.frequency_per_min > 0.0 ? subtasks[i].frequency_per_min / cat.frequency_per_min
                                                       : 1.0 / static_cast<double>(cat.members.size());
      out.contributions[i] = share * out.terms[k].increment;
    }
  }
  return out;
}

std::vector<std::size_t> order_by_contribution(const VariableResult& result) {
  std::vector<std::size_t> order(result.contributions.size());
  std::iota(order.begin(), order.end(), std::size_t{0});
  std::stable_sort(order.begin(), order.end(),
                   [&](std::size_t a, std::size_t b) { return result.contributions[a] > result.contributions[b]; });
  return order;
}

}  // namespace rackreach
