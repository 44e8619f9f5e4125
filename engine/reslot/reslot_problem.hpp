// SPDX-License-Identifier: MIT
#pragma once
// The re-slotting problem as the solver sees it: parts, slots, slot classes, families and a cost of a part in a
// class. It knows nothing of racks, levels or lifts: the store model maps itself onto these few types, and the
// cost of a part in a class (exposure-weighted risk, or nothing where the part may not go) is the caller's.
//
// Scope and bounds:
//  - A slot belongs to one class; every slot of a class is equivalent for cost and feasibility. Slots carry a group
//    (a rack), used only by families.
//  - A part is fixed in its current slot, movable with a current slot, or new (no current slot). A slot holds at
//    most one part.
//  - Costs are finite doubles; the solver turns them into integers (see reslot_solver.hpp) and rejects a cost too
//    large for exact 64-bit arithmetic, never rounds it away silently.
//  - Family rule (a restriction, stated here and in the solver): every part of a family that ends in a slot must be
//    in a slot of its family's group. Keeping a family together in *some* rack chosen by the solver couples the
//    rack choices of all its parts and cannot be written as one min-cost flow, so the group is an input: the
//    family's own `group` if given, else the group of its fixed parts, else the group holding most of its parts
//    today (ties: lowest group index). The solution is exact for that group.

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

namespace rackreach::reslot {

/// A part to be placed. Indices refer to ReslotProblem::slots and ReslotProblem::families.
struct Part {
  std::string id;
  std::optional<std::size_t> current_slot;  ///< where it is today; none for a part not yet in the racks
  bool fixed = false;                       ///< stays in current_slot whatever it costs (needs a current slot)
  std::optional<std::size_t> family;        ///< family whose parts share one group (rack)
};

/// A slot. All slots of one class are interchangeable for cost and feasibility.
struct Slot {
  std::string id;
  std::size_t slot_class = 0;  ///< index in [0, ReslotProblem::class_count)
  std::size_t group = 0;       ///< the rack it is in; only families look at it
};

/// A family of parts kept in one group (rack).
struct Family {
  std::string id;
  std::optional<std::size_t> group;  ///< the group it must use; derived when empty (see the file comment)
};

/// The whole instance.
struct ReslotProblem {
  std::vector<Part> parts;
  std::vector<Slot> slots;
  std::size_t class_count = 0;  ///< slot classes are 0 .. class_count-1 (level geometry x depth x access)
  std::vector<Family> families;
};

/// Options of one solve.
struct ReslotOptions {
  /// Hard cap on the number of moves (a part with a current slot ending in another slot). New parts being placed
  /// are not moves: they have to be put away anyway.
  std::optional<std::size_t> max_moves;
  /// Added to the objective for every move, in cost units (>= 0).
  double cost_per_move = 0.0;
  /// Integer units per cost unit: a cost c enters the flow as llround(c * cost_scale). Default: micro-units.
  double cost_scale = 1e6;
  /// Limit on branch-and-bound nodes of the move cap search; the result says when it was reached (then the
  /// solution is the best found within the cap, with a proven lower bound). A node is a few flow solves of the
  /// part of the network the dual could not settle: cheap on small instances, seconds on 50,000 parts.
  std::size_t max_search_nodes = 200;
};

/// What is wrong with an instance or its costs.
enum class IssueCode {
  class_out_of_range,     ///< a slot's class is not below class_count
  slot_out_of_range,      ///< a part's current slot is not a slot
  slot_shared,            ///< two parts have the same current slot
  fixed_without_slot,     ///< a fixed part has no current slot
  family_out_of_range,    ///< a part's family is not a family
  group_out_of_range,     ///< a family's group holds no slot
  family_split_by_fixed,  ///< fixed parts of one family, or a fixed part and the family's group, disagree
  family_without_group,   ///< a family has no group, no fixed part and no part in a slot
  cost_not_finite,        ///< the cost function gave NaN or infinity
  cost_too_large,         ///< a scaled cost, or a sum the solver forms, does not fit exact 64-bit arithmetic
  option_out_of_range,    ///< cost_scale <= 0 or not finite, cost_per_move < 0 or not finite
};

/// One problem found in the input, with the object it is about.
struct Issue {
  IssueCode code;
  std::optional<std::size_t> part;   ///< part index, where it is about a part
  std::optional<std::size_t> slot;   ///< slot index, where it is about a slot
  std::optional<std::size_t> other;  ///< the class, family or group index it names, where it does
  std::string message;               ///< plain English, names the object, the rule and the value
};

/// Checks the structure of an instance and the options (the costs are checked by solve_reslot). Returns every
/// problem at once; empty when the instance can be solved.
std::vector<Issue> validate_reslot_problem(const ReslotProblem& problem, const ReslotOptions& options);

/// The group each family must use under the family rule (see the file comment); empty where none can be derived
/// (validate_reslot_problem reports those). Assumes indices are in range.
std::vector<std::optional<std::size_t>> find_family_groups(const ReslotProblem& problem);

}  // namespace rackreach::reslot
