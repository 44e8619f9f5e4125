// SPDX-License-Identifier: MIT
#include "engine/slotting/reslot_plan.hpp"

#include <algorithm>
#include <cstdio>
#include <map>
#include <tuple>
#include <unordered_map>

#include "engine/reslot/reslot_solver.hpp"

namespace rackreach {
namespace {

std::string num(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.2f", x);
  return buf;
}

double band_weight(RiskBand b) {
  switch (b) {
    case RiskBand::within_limit: return 0.0;
    case RiskBand::elevated: return 1.0;
    case RiskBand::high: return 2.0;
    case RiskBand::very_high: return 3.0;
    case RiskBand::outside_equation: return 0.0;  // not reached: outside the equation is not allowed
  }
  return 0.0;
}

}  // namespace

std::optional<double> calc_reslot_cost(bool hand_part, const Placement& at, const RiskBands& bands) {
  if (!at.fits) return std::nullopt;
  if (at.truck_access) return hand_part ? std::nullopt : std::optional<double>(0.0);
  if (!hand_part || !at.reach_ok || !at.li) return std::nullopt;
  const double above = std::max(0.0, *at.li - 1.0);
  return at.frequency_per_min * above * band_weight(find_band(at.li, bands));
}

ReslotPlan plan_reslot(const Store& store, UnitSystem units, const ReviewOptions& options, const ReslotRequest& request) {
  ReslotPlan plan;
  const PlacementEvaluator eval(store, units, options);
  std::unordered_map<std::string, const Part*> parts;
  for (const Part& p : store.parts) parts.emplace(p.id, &p);
  std::unordered_map<std::string, std::size_t> rack_index;
  for (std::size_t i = 0; i < store.racks.size(); ++i) rack_index.emplace(store.racks[i].id, i);

  // Slot classes: same zone, level geometry, shelf depth, position and access.
  reslot::ReslotProblem problem;
  std::map<std::tuple<std::string, double, double, double, int, int>, std::size_t> class_of;
  std::vector<std::size_t> representative;  // a slot of each class
  for (std::size_t i = 0; i < store.slots.size(); ++i) {
    const Slot& sl = store.slots[i];
    const Rack& rack = store.racks[rack_index.at(sl.rack)];
    const Level& level = *store.find_level(rack, sl.level);
    const auto key = std::make_tuple(rack.zone, level.surface_height, level.clear_height, rack.shelf_depth,
                                     static_cast<int>(sl.position), static_cast<int>(level.access));
    auto [it, fresh] = class_of.emplace(key, class_of.size());
    if (fresh) representative.push_back(i);
    problem.slots.push_back({sl.id, it->second, rack_index.at(sl.rack)});
  }
  problem.class_count = class_of.size();
  // One part to place per occupied slot; families by name.
  std::map<std::string, std::size_t> family_index;
  for (std::size_t i = 0; i < store.slots.size(); ++i) {
    const Part& part = *parts.at(store.slots[i].part);
    reslot::Part rp{part.id, i, store.slots[i].fixed, std::nullopt};
    if (request.group_families) {
      auto [it, fresh] = family_index.emplace(part.family, problem.families.size());
      if (fresh) problem.families.push_back({part.family, std::nullopt});
      rp.family = it->second;
    }
    problem.parts.push_back(rp);
  }
  // The cost of every (part, class), computed once.
  std::vector<bool> hand(store.slots.size());
  std::vector<std::vector<std::optional<double>>> cost(store.slots.size(),
                                                       std::vector<std::optional<double>>(problem.class_count));
  std::unordered_map<const Part*, std::vector<std::optional<double>>> by_part;
  for (std::size_t i = 0; i < store.slots.size(); ++i) {
    const Part* part = parts.at(store.slots[i].part);
    auto it = by_part.find(part);
    if (it == by_part.end()) {
      std::vector<std::optional<double>> row(problem.class_count);
      const bool is_hand = eval.is_hand_part(*part);
      for (std::size_t c = 0; c < problem.class_count; ++c)
        row[c] = calc_reslot_cost(is_hand, eval.evaluate(*part, store.slots[representative[c]]), options.bands);
      it = by_part.emplace(part, std::move(row)).first;
    }
    cost[i] = it->second;
  }
  reslot::ReslotOptions ro;
  ro.max_moves = request.max_moves;
  ro.cost_per_move = request.cost_per_move;
  const reslot::SolveOutcome out = reslot::solve_reslot(
      problem, [&](std::size_t p, std::size_t c) { return cost[p][c]; }, ro);
  if (!out.solution) {
    for (const auto& issue : out.issues) plan.problems.push_back(issue.message);
    return plan;
  }
  const reslot::Solution& sol = *out.solution;
  for (std::size_t i = 0; i < problem.parts.size(); ++i) {
    const auto& c = cost[i][problem.slots[i].slot_class];
    if (c) plan.objective_before += *c;
    else ++plan.not_allowed_before;
  }
  plan.objective_after = sol.objective;
  plan.proven_optimal = sol.proven_optimal;
  plan.certificate = sol.certificate.kind == reslot::CertificateKind::flow_dual    ? "flow dual (reduced costs)"
                     : sol.certificate.kind == reslot::CertificateKind::lagrangian ? "Lagrangian multiplier on moves"
                                                                                   : "branch and bound";
  plan.store = store;
  for (std::size_t i = 0; i < problem.parts.size(); ++i)
    if (sol.slot_of_part[i]) plan.store.slots[*sol.slot_of_part[i]].part = problem.parts[i].id;
  for (const reslot::Move& m : sol.moves) {
    if (!m.from_slot) continue;
    const Part& part = *parts.at(problem.parts[m.part].id);
    const Placement before = eval.evaluate(part, store.slots[*m.from_slot]);
    const Placement after = eval.evaluate(part, store.slots[m.to_slot]);
    auto li = [](const Placement& p) {
      return p.truck_access ? std::string("truck level") : p.li ? "LI " + num(*p.li) : std::string("outside");
    };
    std::string reason = li(before) + " -> " + li(after);
    if (!cost[m.part][problem.slots[*m.from_slot].slot_class]) reason += " (its slot today is not allowed for it)";
    else if (before.li && after.li && *after.li >= *before.li - 1e-9)
      reason += " (frees its slot for a part that needs it more)";
    plan.moves.push_back({part.id, store.slots[*m.from_slot].id, store.slots[m.to_slot].id, reason});
  }
  for (const reslot::Unresolved& u : sol.unresolved) {
    const char* why = u.reason == reslot::UnresolvedReason::no_allowed_slot
                          ? "no slot of the store is allowed for it (box fit, access, reach or the equation's limits)"
                      : u.reason == reslot::UnresolvedReason::fixed_in_forbidden_slot
                          ? "fixed in a slot it may not hold"
                          : "the slots allowed for it are better used by other parts (or the move cap)";
    plan.unresolved.push_back({problem.parts[u.part].id, u.kept_slot ? store.slots[*u.kept_slot].id : "", why});
  }
  if (request.list_costs)
    for (std::size_t i = 0; i < problem.parts.size(); ++i)
      for (std::size_t s = 0; s < problem.slots.size(); ++s)
        if (const auto& c = cost[i][problem.slots[s].slot_class])
          plan.costs.push_back({problem.parts[i].id + "@" + store.slots[i].id, problem.slots[s].id, *c});
  return plan;
}

}  // namespace rackreach
