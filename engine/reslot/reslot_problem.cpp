// SPDX-License-Identifier: MIT
#include "engine/reslot/reslot_problem.hpp"

#include <cmath>
#include <map>

namespace rackreach::reslot {

namespace {

std::string quoted(const std::string& id) {
  return "\"" + id + "\"";
}

}  // namespace

std::vector<std::optional<std::size_t>> find_family_groups(const ReslotProblem& problem) {
  const std::size_t family_count = problem.families.size();
  std::vector<std::optional<std::size_t>> group(family_count);
  std::vector<std::optional<std::size_t>> fixed_group(family_count);
  std::vector<std::map<std::size_t, std::size_t>> members_per_group(family_count);
  for (const Part& part : problem.parts) {
    if (!part.family || *part.family >= family_count || !part.current_slot) continue;
    if (*part.current_slot >= problem.slots.size()) continue;
    const std::size_t g = problem.slots[*part.current_slot].group;
    if (part.fixed && !fixed_group[*part.family]) fixed_group[*part.family] = g;
    ++members_per_group[*part.family][g];
  }
  for (std::size_t f = 0; f < family_count; ++f) {
    if (problem.families[f].group) {
      group[f] = problem.families[f].group;
    } else if (fixed_group[f]) {
      group[f] = fixed_group[f];
    } else {
      std::size_t best_count = 0;
      for (const auto& [g, count] : members_per_group[f]) {  // ascending group: ties keep the lowest
        if (count > best_count) {
          best_count = count;
          group[f] = g;
        }
      }
    }
  }
  return group;
}

std::vector<Issue> validate_reslot_problem(const ReslotProblem& problem, const ReslotOptions& options) {
  std::vector<Issue> issues;
  if (!(std::isfinite(options.cost_scale) && options.cost_scale > 0.0)) {
    issues.push_back(
        {IssueCode::option_out_of_range,
         {},
         {},
         {},
         "cost_scale must be a positive finite number (it is " + std::to_string(options.cost_scale) + ")"});
  }
  if (!(std::isfinite(options.cost_per_move) && options.cost_per_move >= 0.0)) {
    issues.push_back(
        {IssueCode::option_out_of_range,
         {},
         {},
         {},
         "cost_per_move must be finite and at least 0 (it is " + std::to_string(options.cost_per_move) + ")"});
  }
  std::vector<bool> group_has_slot;
  for (std::size_t s = 0; s < problem.slots.size(); ++s) {
    const Slot& slot = problem.slots[s];
    if (slot.slot_class >= problem.class_count) {
      issues.push_back({IssueCode::class_out_of_range,
                        {},
                        s,
                        slot.slot_class,
                        "slot " + quoted(slot.id) + ": class must be below " + std::to_string(problem.class_count) +
                            " (it is " + std::to_string(slot.slot_class) + ")"});
    }
    if (slot.group >= group_has_slot.size()) group_has_slot.resize(slot.group + 1, false);
    group_has_slot[slot.group] = true;
  }
  std::vector<std::optional<std::size_t>> occupant(problem.slots.size());
  bool families_indexable = true;
  for (std::size_t p = 0; p < problem.parts.size(); ++p) {
    const Part& part = problem.parts[p];
    if (part.current_slot) {
      const std::size_t s = *part.current_slot;
      if (s >= problem.slots.size()) {
        issues.push_back({IssueCode::slot_out_of_range,
                          p,
                          {},
                          {},
                          "part " + quoted(part.id) + ": current slot must be below " +
                              std::to_string(problem.slots.size()) + " (it is " + std::to_string(s) + ")"});
      } else if (occupant[s]) {
        issues.push_back({IssueCode::slot_shared, p, s, *occupant[s],
                          "part " + quoted(part.id) + ": slot " + quoted(problem.slots[s].id) + " already holds part " +
                              quoted(problem.parts[*occupant[s]].id)});
      } else {
        occupant[s] = p;
      }
    } else if (part.fixed) {
      issues.push_back({IssueCode::fixed_without_slot,
                        p,
                        {},
                        {},
                        "part " + quoted(part.id) + ": a fixed part must have a current slot"});
    }
    if (part.family && *part.family >= problem.families.size()) {
      families_indexable = false;
      issues.push_back({IssueCode::family_out_of_range,
                        p,
                        {},
                        *part.family,
                        "part " + quoted(part.id) + ": family must be below " +
                            std::to_string(problem.families.size()) + " (it is " + std::to_string(*part.family) + ")"});
    }
  }
  for (std::size_t f = 0; f < problem.families.size(); ++f) {
    const Family& family = problem.families[f];
    if (family.group && (*family.group >= group_has_slot.size() || !group_has_slot[*family.group])) {
      issues.push_back({IssueCode::group_out_of_range,
                        {},
                        {},
                        *family.group,
                        "family " + quoted(family.id) + ": group " + std::to_string(*family.group) + " holds no slot"});
    }
  }
  if (!families_indexable) return issues;
  const auto groups = find_family_groups(problem);
  std::vector<bool> family_has_member(problem.families.size(), false);
  for (std::size_t p = 0; p < problem.parts.size(); ++p) {
    const Part& part = problem.parts[p];
    if (!part.family) continue;
    family_has_member[*part.family] = true;
    if (!part.fixed || !part.current_slot || *part.current_slot >= problem.slots.size()) continue;
    const std::size_t g = problem.slots[*part.current_slot].group;
    if (groups[*part.family] && *groups[*part.family] != g) {
      issues.push_back({IssueCode::family_split_by_fixed, p, *part.current_slot, *part.family,
                        "part " + quoted(part.id) + ": fixed in group " + std::to_string(g) + " but family " +
                            quoted(problem.families[*part.family].id) + " must use group " +
                            std::to_string(*groups[*part.family])});
    }
  }
  for (std::size_t f = 0; f < problem.families.size(); ++f) {
    if (family_has_member[f] && !groups[f]) {
      issues.push_back({IssueCode::family_without_group,
                        {},
                        {},
                        f,
                        "family " + quoted(problem.families[f].id) +
                            ": give its group; it has no fixed part and no part in a slot"});
    }
  }
  return issues;
}

}  // namespace rackreach::reslot
