// SPDX-License-Identifier: MIT
#pragma once
// Exact re-slotting: assign parts to slots so that the total cost is least, as a min-cost flow over slot classes
// (LEMON's network simplex). No part x slot matrix is formed: arcs are part -> class, so memory grows with
// parts x classes.
//
// Objective, lexicographic:
//   1. fewest unresolved parts: a new part left without a slot, or a part left in its current slot although it
//      may not be there (infeasible class, or outside its family's group);
//   2. least cost: sum over parts in slots they may hold of cost(part, class), plus cost_per_move per move;
//   3. fewest moves.
// subject to: each slot holds one part at most, fixed parts stay, cost(part, class) empty means never, the family
// rule of reslot_problem.hpp, and at most max_moves moves. A move is a part with a current slot ending in another
// slot; placing a new part is listed with the moves (no `from`) but is not one.
//
// The network (the certificate refers to it). Fixed parts are not in it: their slots are taken. A *cell* is a
// class when the instance has no families, else a (class, group) pair; its capacity is its slots not held by
// fixed parts, and cells of capacity 0 are left out. Nodes: one per movable part (supply 1), one per cell, in
// family mode one hub per class, and a sink (demand = number of movable parts). Arcs (capacity 1 unless said):
//   - stay:       part -> its current cell, if the part may be there; cost s(p, class);
//   - move:       part -> another cell it may use: no families, or a part of a family: directly to the cell (of the
//                 family's group only); in family mode a part without a family goes to the class hub instead
//                 (the hub path to its own cell is a move too, and is never optimal: the stay arc is cheaper);
//                 cost s(p, class) + m, counted as a move when the part has a current slot;
//   - unresolved: a part with a current slot and no stay arc -> its current cell (it keeps its slot); a new part
//                 -> sink; cost B;
//   - hub -> cell of its class (capacity of the cell), cell -> sink (capacity of the cell); cost 0.
// s(p, c) = llround(cost(p, c) * cost_scale); m = llround(cost_per_move * cost_scale);
// B = 1 + sum over parts of (max(0, largest stay/move arc cost) - min(0, least stay/move arc cost)).
//
// Exactness:
//  - Tier 1 within one flow: the flow's cost is the tier-2 cost + B x unresolved. The tier-2 costs of any two
//    solutions differ by less than B (each part contributes an arc cost between its least and largest, or 0), so
//    one unresolved part more always costs more, and among equal counts the flow minimises tier 2 exactly.
//    Integer costs, so the network
//    simplex is exact; solve_reslot rejects costs whose scaled sums could pass 2^61 (the simplex's artificial arc
//    cost is 2^62).
//  - Tier 3 (fewer moves) is a second phase, not an epsilon: after the cost phase, every arc whose reduced cost
//    (cost + potential(tail) - potential(head)) is positive is fixed at 0 and every arc whose reduced cost is
//    negative at its capacity; the rest is solved again with cost 1 per move arc. By complementary slackness a
//    flow is optimal for the cost phase exactly when it meets those fixings with that optimal dual, so the second
//    phase chooses among the cost optima only and cannot change the primary optimum.
//  - Move cap (a side constraint: a cap on moves is weakly NP-hard in general, a 0/1 knapsack reduces to it: one
//    rotation of k parts through k one-slot classes is k moves with a chosen gain). Lagrangian relaxation: every
//    move arc also costs lambda >= 0. For a lambda whose optimal flow x has moves(x) = max_moves (or
//    lambda = 0 and moves(x) <= max_moves), x is optimal under the cap: any y within the cap has
//    cost(y) >= cost(y) + lambda (moves(y) - K) >= cost(x) + lambda (moves(x) - K) = cost(x). lambda is searched
//    by intersecting the lines of the two bracketing solutions (Newton on the concave dual), on integers; when the
//    bracket closes between two integers, at the exact fraction where the two lines meet (costs multiplied by its
//    denominator, overflow checked), where the optimal face holds flows on both sides of the cap: a flow of that
//    face with exactly max_moves moves is sought by decomposing the difference of its fewest-moves and
//    most-moves flows into cycles (any subset of them added gives a flow of the face) and a subset sum over the
//    cycles' changes in moves. When the dual still leaves a gap, arcs whose reduced cost exceeds the gap are fixed
//    (they cannot be in a better solution) and a branch and bound on "part stays / part moves" with the same Lagrangian
//    bound at every node closes it. The result says which of the three proved it (`CertificateKind`), and when the node
//    limit stopped the search.
//  - Networks of 200,000 arcs or more: the simplex's work grows with the parts it holds, so most parts are first
//    settled on their best arc at cell prices estimated from every 8th part (or from the previous multiplier's
//    solve), the simplex solves the others, and every settled part is checked against the potentials found: a
//    part whose arc is not its cheapest at those prices is released and the rest solved again. The end state meets
//    complementary slackness on every arc of the whole network, so it is the same optimum, with its certificate.
//  - Within a cell, the parts the flow sends there keep their current slot when it is in the cell (it always is
//    free for them: a slot had one part), the others take the free slots in ascending slot index, in ascending
//    part index. Same input, same output: LEMON's simplex is deterministic and nothing here depends on addresses.
//
// Departures: families use a given group (reslot_problem.hpp); a part left unresolved in its current slot is not
// held to its family's group.

#include <cstddef>
#include <cstdint>
#include <functional>
#include <optional>
#include <vector>

#include "engine/reslot/reslot_problem.hpp"

namespace rackreach::reslot {

/// Cost of a part in a slot class, in cost units (e.g. exposure-weighted lifting index); empty: the part may not
/// go to that class (box does not fit, truck-only part on a hand level, reach failure ...). Must be pure: it is
/// called for every movable part and class with free slots, and again for the class each part ends in.
using CostFunction = std::function<std::optional<double>(std::size_t part, std::size_t slot_class)>;

/// A change of slot. `from` is empty for a new part being placed (not counted as a move).
struct Move {
  std::size_t part = 0;
  std::optional<std::size_t> from_slot;
  std::size_t to_slot = 0;
};

/// Why a part is not in a slot it may hold.
enum class UnresolvedReason {
  no_allowed_slot,          ///< no class of nonzero capacity (within its family's group) accepts it at all
  outcompeted,              ///< allowed slots exist, but better use of them, or the move cap, leaves none
  fixed_in_forbidden_slot,  ///< fixed in a slot of a class it may not be in
};

/// A part without a slot it may hold: a new part without slot, or a part kept where it is not allowed.
struct Unresolved {
  std::size_t part = 0;
  UnresolvedReason reason = UnresolvedReason::outcompeted;
  std::optional<std::size_t> kept_slot;  ///< its current slot, which it keeps; empty for a new part
};

/// What proves the solution optimal.
enum class CertificateKind {
  flow_dual,   ///< the potentials certify the flow at move_multiplier 0 (no cap, or the cap does not bind)
  lagrangian,  ///< the potentials certify the flow at move_multiplier > 0, and the moves equal the cap
  search,      ///< branch and bound with Lagrangian bounds; the potentials are those of the solution's own solve
};

/// A cell of the network with its dual value.
struct CellPotential {
  std::size_t slot_class = 0;
  std::optional<std::size_t> group;  ///< set in family mode
  std::size_t capacity = 0;
  std::int64_t potential = 0;
};

/// The dual solution of the network above at the multiplier lambda = move_multiplier / cost_multiplier: reduced
/// cost of an arc = cost_multiplier x cost + (move_multiplier if a move arc) + potential(tail) - potential(head).
/// It is >= 0 on arcs at 0, <= 0 on arcs at capacity, 0 between.
struct Certificate {
  CertificateKind kind = CertificateKind::flow_dual;
  std::int64_t move_multiplier = 0;     ///< lambda x cost_multiplier, in scaled units per move
  std::int64_t cost_multiplier = 1;     ///< the denominator of lambda (1 unless lambda is a fraction)
  std::int64_t unresolved_penalty = 0;  ///< B
  std::int64_t move_cost_scaled = 0;    ///< m
  std::vector<std::optional<std::int64_t>> part_potential;  ///< per part; empty for fixed parts
  std::vector<CellPotential> cells;                         ///< in ascending (class, group)
  std::vector<std::int64_t> hub_potential;                  ///< per class, family mode only
  std::int64_t sink_potential = 0;
  /// Proven lower bound on the scaled cost (tier 2, unresolved parts excluded) when the tier-1 count is that of
  /// the solution; equals scaled_objective when proven_optimal.
  std::int64_t lower_bound = 0;
  std::size_t search_nodes = 0;  ///< branch-and-bound nodes solved (0 without a search)
};

/// The proposed slotting.
struct Solution {
  std::vector<std::optional<std::size_t>> slot_of_part;  ///< per part; empty for a new part left without slot
  double objective = 0.0;  ///< sum of cost(part, class of its slot) over parts in allowed slots + moves x cost_per_move
  std::int64_t scaled_objective = 0;  ///< the same in the integer units the flow used
  std::size_t move_count = 0;
  std::vector<Move> moves;             ///< moves and placements, ascending part index
  std::vector<Unresolved> unresolved;  ///< ascending part index; never silently dropped
  bool proven_optimal = true;          ///< false only when max_search_nodes stopped the move cap search
  Certificate certificate;
};

/// The solution, or why there is none (then `solution` is empty and `issues` says what to fix).
struct SolveOutcome {
  std::vector<Issue> issues;
  std::optional<Solution> solution;
};

/// Solves the instance exactly. Deterministic.
SolveOutcome solve_reslot(const ReslotProblem& problem, const CostFunction& cost, const ReslotOptions& options = {});

}  // namespace rackreach::reslot
