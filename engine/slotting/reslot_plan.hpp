// SPDX-License-Identifier: MIT
#pragma once
// Re-slotting a store: the exact best assignment of the store's parts to its slots (engine/reslot, min-cost flow
// over slot classes), with the move list, the before/after figures and the new store.
//
// The cost of a part in a slot is defined once, in calc_reslot_cost (below): exposure-weighted risk above the
// limit, F x (LI - 1) x band weight (elevated 1, high 2, very high 3; within the limit 0). Infeasible: the box does
// not fit (clear height, shelf depth); a hand-picked part on a truck level or a truck part on a hand level; a
// reach failure or a lift outside the equation on a hand level. A truck part on a truck level costs 0.
// Slot classes: slots with the same zone, level surface and clear height, shelf depth, position and access are
// interchangeable. Every part keeps its slot unless moving it lowers the cost; ties prefer fewer moves.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/risk_bands.hpp"
#include "engine/slotting/review.hpp"

namespace rackreach {

/// The cost of a part at a placement; empty where the part may not go there. Documented above.
std::optional<double> calc_reslot_cost(bool hand_part, const Placement& at, const RiskBands& bands);

struct ReslotRequest {
  std::optional<std::size_t> max_moves;
  double cost_per_move = 0.0;
  bool group_families = false;  ///< parts of a family within one rack
  bool list_costs = false;      ///< fill ReslotPlan::costs with every allowed (part, slot) pair: parts x slots rows
};

struct PlanMove {
  std::string part, from_slot, to_slot;
  std::string reason;  ///< e.g. "LI 1.72 -> 0.88"
};

struct PlanUnresolved {
  std::string part, slot;
  std::string reason;
};

/// One (part, slot, cost) pair the solver could use.
struct PlanCost {
  std::string part, slot;
  double cost = 0.0;
};

struct ReslotPlan {
  std::vector<PlanMove> moves;
  std::vector<PlanUnresolved> unresolved;
  double objective_before = 0.0;  ///< over the parts whose current slot is allowed
  double objective_after = 0.0;
  std::size_t not_allowed_before = 0;  ///< parts today in a slot they may not hold
  bool proven_optimal = true;
  std::string certificate;  ///< what proves the optimum, in words
  Store store;              ///< the proposed slotting
  std::vector<PlanCost> costs;
  std::vector<std::string> problems;  ///< why there is no plan (empty when there is)
};

ReslotPlan plan_reslot(const Store& store, UnitSystem units, const ReviewOptions& options, const ReslotRequest& request);

}  // namespace rackreach
