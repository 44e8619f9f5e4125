// SPDX-License-Identifier: MIT
#include "engine/reslot/reslot_solver.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <map>
#include <string>
#include <utility>

#include <lemon/network_simplex.h>
#include <lemon/smart_graph.h>

namespace rackreach::reslot {

namespace {

using Cost = std::int64_t;

// Every cost the simplex sees, times the number of nodes, stays below this: its artificial arcs cost 2^62.
constexpr Cost cost_limit = Cost{1} << 61;

enum class ArcKind : std::uint8_t { stay, move, unresolved, structural };

struct Arc {
  int tail = 0;
  int head = 0;
  int cap = 1;
  Cost cost = 0;
  ArcKind kind = ArcKind::structural;
  bool counts_move = false;  // a move arc of a part with a current slot
  int part = -1;             // the part of a part arc
};

// A min-cost flow instance: supplies and arcs. The offsets carry what reductions fixed.
struct Network {
  int node_count = 0;
  std::vector<int> supply;
  std::vector<Arc> arcs;
  Cost offset_cost = 0;
  long offset_moves = 0;
};

enum class ArcState : std::uint8_t { free, off, at_capacity };

struct Flow {
  std::vector<int> flow;        // per arc of the network it was solved on
  std::vector<Cost> potential;  // per node, from the cost phase
  Cost cost = 0;                // sum of arc cost x flow, without lambda, plus the network's offset
  long moves = 0;               // with the network's offset
};

// One run of the network simplex on the free arcs; arcs not free carry 0 or their capacity.
template <class CostOf>
std::optional<std::pair<std::vector<int>, std::vector<Cost>>> run_simplex(const Network& net,
                                                                          const std::vector<ArcState>& state,
                                                                          CostOf cost_of) {
  using Graph = lemon::SmartDigraph;
  Graph g;
  g.reserveNode(net.node_count);
  std::vector<Graph::Node> nodes;
  nodes.reserve(static_cast<std::size_t>(net.node_count));
  for (int v = 0; v < net.node_count; ++v) nodes.push_back(g.addNode());
  std::vector<int> supply = net.supply;
  std::vector<int> flow(net.arcs.size(), 0);
  std::vector<std::size_t> free_arcs;
  for (std::size_t a = 0; a < net.arcs.size(); ++a) {
    if (state[a] == ArcState::free) {
      free_arcs.push_back(a);
    } else if (state[a] == ArcState::at_capacity) {
      flow[a] = net.arcs[a].cap;
      supply[static_cast<std::size_t>(net.arcs[a].tail)] -= net.arcs[a].cap;
      supply[static_cast<std::size_t>(net.arcs[a].head)] += net.arcs[a].cap;
    }
  }
  g.reserveArc(static_cast<int>(free_arcs.size()));
  Graph::ArcMap<int> cap(g);
  Graph::ArcMap<Cost> cost(g);
  std::vector<Graph::Arc> lemon_arcs;
  lemon_arcs.reserve(free_arcs.size());
  for (std::size_t a : free_arcs) {
    const Arc& arc = net.arcs[a];
    const Graph::Arc e = g.addArc(nodes[static_cast<std::size_t>(arc.tail)], nodes[static_cast<std::size_t>(arc.head)]);
    cap[e] = arc.cap;
    cost[e] = cost_of(a);
    lemon_arcs.push_back(e);
  }
  Graph::NodeMap<int> sup(g);
  for (int v = 0; v < net.node_count; ++v)
    sup[nodes[static_cast<std::size_t>(v)]] = supply[static_cast<std::size_t>(v)];
  lemon::NetworkSimplex<Graph, int, Cost> simplex(g);
  simplex.upperMap(cap).costMap(cost).supplyMap(sup);
  if (simplex.run() != lemon::NetworkSimplex<Graph, int, Cost>::OPTIMAL) return std::nullopt;
  for (std::size_t i = 0; i < free_arcs.size(); ++i) flow[free_arcs[i]] = simplex.flow(lemon_arcs[i]);
  std::vector<Cost> potential(static_cast<std::size_t>(net.node_count));
  for (int v = 0; v < net.node_count; ++v)
    potential[static_cast<std::size_t>(v)] = simplex.potential(nodes[static_cast<std::size_t>(v)]);
  return std::make_pair(std::move(flow), std::move(potential));
}

// The same optimum with most parts settled in advance (part pricing). The simplex's work grows with the parts it
// holds, so: (1) prices of the cells are estimated from every 8th part on an eighth of the capacity; (2) a part
// whose best arc at those prices beats its second by a wide margin, and goes to a cell, is fixed on that arc;
// (3) the rest is solved with the fixed parts' flow in the supplies; (4) every fixed part is checked against the
// potentials found: its arc must have the least reduced cost of all its arcs, else it is released and (3) runs
// again. Exact: at the end every arc meets complementary slackness (a fixed part's potential is set so that its
// arc has reduced cost 0 and its others >= 0; the rest are the simplex's own), so the flow is optimal on the whole
// network. When a step finds no flow it releases more parts, down to the whole network. Small networks are solved
// whole.
template <class CostOf>
std::optional<std::pair<std::vector<int>, std::vector<Cost>>> run_simplex_priced(const Network& net,
                                                                                 const std::vector<ArcState>& state,
                                                                                 CostOf cost_of,
                                                                                 const std::vector<Cost>* price_hint) {
  constexpr std::size_t whole_below = 200000;
  constexpr int sample_every = 8;
  // Parts left to the simplex in the first round: fewer when the prices come from a neighbouring solve.
  const double hard_share = price_hint ? 0.1 : 0.2;
  if (net.arcs.size() < whole_below) return run_simplex(net, state, cost_of);
  // Parts' arc ranges (arcs are stored part by part) and which nodes are cells (a single arc to the sink).
  const int sink = net.node_count - 1;
  std::vector<std::pair<std::size_t, std::size_t>> ranges;
  std::vector<std::uint8_t> is_cell(static_cast<std::size_t>(net.node_count), 0);
  for (std::size_t a = 0; a < net.arcs.size();) {
    std::size_t end = a + 1;
    if (net.arcs[a].part >= 0) {
      while (end < net.arcs.size() && net.arcs[end].part == net.arcs[a].part) ++end;
      ranges.emplace_back(a, end);
    } else if (net.arcs[a].head == sink) {
      is_cell[static_cast<std::size_t>(net.arcs[a].tail)] = 1;
    }
    a = end;
  }
  // (1) Prices from a neighbouring solve, or from a sample.
  std::optional<std::pair<std::vector<int>, std::vector<Cost>>> estimate;
  if (price_hint) estimate = std::make_pair(std::vector<int>{}, *price_hint);
  if (!estimate) {
    Network sample = net;
    std::vector<ArcState> sample_state = state;
    int sampled = 0;
    for (std::size_t i = 0; i < ranges.size(); ++i) {
      if (static_cast<int>(i) % sample_every == 0) {
        ++sampled;
        continue;
      }
      sample.supply[static_cast<std::size_t>(net.arcs[ranges[i].first].tail)] = 0;
      for (std::size_t a = ranges[i].first; a < ranges[i].second; ++a) sample_state[a] = ArcState::off;
    }
    const int total_supply = -net.supply[static_cast<std::size_t>(sink)];
    sample.supply[static_cast<std::size_t>(sink)] =
        -(sampled + (total_supply - static_cast<int>(ranges.size())) / sample_every);
    for (Arc& arc : sample.arcs) {
      if (arc.part < 0) arc.cap = (arc.cap + sample_every - 1) / sample_every;
    }
    estimate = run_simplex(sample, sample_state, cost_of);
    if (!estimate) return run_simplex(net, state, cost_of);
  }
  const std::vector<Cost>& price = estimate->second;
  // (2) Settle the parts with a clear best arc to a cell.
  std::vector<std::size_t> chosen(ranges.size(), 0);
  std::vector<Cost> margin(ranges.size(), 0);
  std::vector<std::uint8_t> settled(ranges.size(), 0);
  for (std::size_t i = 0; i < ranges.size(); ++i) {
    std::optional<Cost> best;
    std::optional<Cost> second;
    for (std::size_t a = ranges[i].first; a < ranges[i].second; ++a) {
      if (state[a] != ArcState::free) continue;
      const Cost rc = cost_of(a) - price[static_cast<std::size_t>(net.arcs[a].head)];
      if (!best || rc < *best) {
        second = best;
        best = rc;
        chosen[i] = a;
      } else if (!second || rc < *second) {
        second = rc;
      }
    }
    if (!best || !is_cell[static_cast<std::size_t>(net.arcs[chosen[i]].head)]) continue;
    margin[i] = second ? *second - *best : std::numeric_limits<Cost>::max();
    settled[i] = 1;
  }
  {
    std::vector<Cost> margins;
    for (std::size_t i = 0; i < ranges.size(); ++i)
      if (settled[i]) margins.push_back(margin[i]);
    if (margins.empty()) return run_simplex(net, state, cost_of);
    const auto k = static_cast<std::size_t>(hard_share * static_cast<double>(ranges.size()));
    const std::size_t cut_at = std::min(k, margins.size() - 1);
    std::nth_element(margins.begin(), margins.begin() + static_cast<std::ptrdiff_t>(cut_at), margins.end());
    const Cost cut = margins[cut_at];
    for (std::size_t i = 0; i < ranges.size(); ++i)
      if (settled[i] && margin[i] <= cut) settled[i] = 0;
  }
  // (3), (4)
  for (int round = 0;; ++round) {
    std::size_t settled_count = 0;
    std::vector<ArcState> restricted = state;
    for (std::size_t i = 0; i < ranges.size(); ++i) {
      if (!settled[i]) continue;
      ++settled_count;
      for (std::size_t a = ranges[i].first; a < ranges[i].second; ++a)
        if (restricted[a] == ArcState::free) restricted[a] = a == chosen[i] ? ArcState::at_capacity : ArcState::off;
    }
    if (settled_count == 0) return run_simplex(net, state, cost_of);
    auto result = run_simplex(net, restricted, cost_of);
    if (!result) {
      // Release the settled half with the smaller margins.
      std::vector<Cost> margins;
      for (std::size_t i = 0; i < ranges.size(); ++i)
        if (settled[i]) margins.push_back(margin[i]);
      const std::size_t mid = margins.size() / 2;
      std::nth_element(margins.begin(), margins.begin() + static_cast<std::ptrdiff_t>(mid), margins.end());
      for (std::size_t i = 0; i < ranges.size(); ++i)
        if (settled[i] && (margin[i] <= margins[mid] || margins.size() < 64)) settled[i] = 0;
      continue;
    }
    auto& pi = result->second;
    std::size_t released = 0;
    for (std::size_t i = 0; i < ranges.size(); ++i) {
      if (!settled[i]) continue;
      const Cost own = cost_of(chosen[i]) - pi[static_cast<std::size_t>(net.arcs[chosen[i]].head)];
      bool best = true;
      for (std::size_t a = ranges[i].first; a < ranges[i].second && best; ++a) {
        if (state[a] == ArcState::free && cost_of(a) - pi[static_cast<std::size_t>(net.arcs[a].head)] < own)
          best = false;
      }
      if (best) {
        pi[static_cast<std::size_t>(net.arcs[chosen[i]].tail)] = -own;
      } else {
        settled[i] = 0;
        ++released;
      }
    }
    if (released == 0) return result;
  }
}

// Lexicographic solve: first tier, then the second on the first's optimal face (arcs of nonzero reduced cost
// fixed at the bound complementary slackness gives them). moves_first: fewest moves, then cost (lambda = infinity);
// otherwise cost + lambda per move, then fewest moves.
// With `scale` > 1 the cost tier is scale x cost + lambda per move (a multiplier lambda / scale), and `most_moves`
// receives the flow of the same face with the most moves.
std::optional<Flow> solve_two_tier(const Network& net, const std::vector<ArcState>& state, Cost lambda,
                                   bool moves_first, const std::vector<Cost>* price_hint = nullptr, Cost scale = 1,
                                   std::optional<Flow>* most_moves = nullptr) {
  auto cost_tier = [&](std::size_t a) { return scale * net.arcs[a].cost + (net.arcs[a].counts_move ? lambda : 0); };
  auto move_tier = [&](std::size_t a) { return Cost{net.arcs[a].counts_move ? 1 : 0}; };
  auto first = moves_first ? run_simplex_priced(net, state, move_tier, nullptr)
                           : run_simplex_priced(net, state, cost_tier, price_hint);
  if (!first) return std::nullopt;
  // Named members, not a structured binding: clang before 16 cannot capture a binding in the lambdas below.
  const std::vector<Cost>& pi = first->second;
  std::vector<ArcState> face = state;
  for (std::size_t a = 0; a < net.arcs.size(); ++a) {
    if (state[a] != ArcState::free) continue;
    const Arc& arc = net.arcs[a];
    const Cost rc = (moves_first ? move_tier(a) : cost_tier(a)) + pi[static_cast<std::size_t>(arc.tail)] -
                    pi[static_cast<std::size_t>(arc.head)];
    if (rc > 0) face[a] = ArcState::off;
    if (rc < 0) face[a] = ArcState::at_capacity;
  }
  auto second = moves_first ? run_simplex(net, face, cost_tier) : run_simplex(net, face, move_tier);
  if (!second) return std::nullopt;  // cannot happen: flow1 is feasible on the face
  auto make = [&](std::vector<int> flow) {
    Flow out;
    out.flow = std::move(flow);
    out.potential = pi;
    out.cost = net.offset_cost;
    out.moves = net.offset_moves;
    for (std::size_t a = 0; a < net.arcs.size(); ++a) {
      out.cost += net.arcs[a].cost * out.flow[a];
      if (net.arcs[a].counts_move) out.moves += out.flow[a];
    }
    return out;
  };
  if (most_moves && !moves_first) {
    auto third = run_simplex(net, face, [&](std::size_t a) { return -move_tier(a); });
    if (third) *most_moves = make(std::move(third->first));
  }
  return make(std::move(second->first));
}

// Between two flows of one optimal face (fewest and most moves), a flow of that face with exactly `target` moves,
// if one exists among the flows `low` + any subset of the cycles of `high` - `low`. Any such subset is a flow of the
// face: the cycles of a conformal decomposition can be added independently. The subset is found by subset sum
// over the cycles' changes in moves.
std::optional<std::vector<int>> find_flow_with_moves(const Network& net, const Flow& low, const Flow& high,
                                                     long target) {
  const long need = target - low.moves;
  if (need < 0 || need > high.moves - low.moves) return std::nullopt;
  // Residual edges of the difference: +d forward, -d backward; each unit is one edge use.
  std::vector<int> left(net.arcs.size(), 0);
  std::vector<std::vector<std::size_t>> out_of(static_cast<std::size_t>(net.node_count));
  for (std::size_t a = 0; a < net.arcs.size(); ++a) {
    const int d = high.flow[a] - low.flow[a];
    if (d == 0) continue;
    left[a] = d > 0 ? d : -d;
    out_of[static_cast<std::size_t>(d > 0 ? net.arcs[a].tail : net.arcs[a].head)].push_back(a);
  }
  auto next_node = [&](std::size_t a) { return high.flow[a] > low.flow[a] ? net.arcs[a].head : net.arcs[a].tail; };
  std::vector<std::vector<std::size_t>> cycles;
  std::vector<long> delta;
  std::vector<std::size_t> cursor(static_cast<std::size_t>(net.node_count), 0);
  std::vector<int> on_path(static_cast<std::size_t>(net.node_count), -1);
  for (std::size_t start = 0; start < net.arcs.size(); ++start) {
    while (left[start] > 0) {
      // Walk from the tail side of `start` until a node repeats; the loop closed there is a cycle.
      std::vector<std::size_t> path;
      std::vector<int> nodes;
      int v = high.flow[start] > low.flow[start] ? net.arcs[start].tail : net.arcs[start].head;
      std::size_t arc = start;
      for (;;) {
        on_path[static_cast<std::size_t>(v)] = static_cast<int>(path.size());
        nodes.push_back(v);
        path.push_back(arc);
        v = next_node(arc);
        if (on_path[static_cast<std::size_t>(v)] >= 0) break;
        auto& list = out_of[static_cast<std::size_t>(v)];
        auto& c = cursor[static_cast<std::size_t>(v)];
        while (c < list.size() && left[list[c]] == 0) ++c;
        if (c == list.size()) return std::nullopt;  // cannot happen: the difference is a circulation
        arc = list[c];
      }
      const auto from = static_cast<std::size_t>(on_path[static_cast<std::size_t>(v)]);
      std::vector<std::size_t> cycle(path.begin() + static_cast<std::ptrdiff_t>(from), path.end());
      long d = 0;
      for (std::size_t a : cycle) {
        --left[a];
        if (net.arcs[a].counts_move) d += high.flow[a] > low.flow[a] ? 1 : -1;
      }
      for (int u : nodes) on_path[static_cast<std::size_t>(u)] = -1;
      cycles.push_back(std::move(cycle));
      delta.push_back(d);
    }
  }
  // Subset sum: reach[s] = the cycle that first reached sum s (offset by the negative total), and from where.
  long negative = 0;
  long positive = 0;
  for (long d : delta) (d < 0 ? negative : positive) += d;
  const long width = positive - negative + 1;
  if (width > 4000000) return std::nullopt;
  std::vector<long> by(static_cast<std::size_t>(width), -2);  // -2 unreached, -1 the empty set
  by[static_cast<std::size_t>(-negative)] = -1;
  for (std::size_t i = 0; i < delta.size() && by[static_cast<std::size_t>(need - negative)] == -2; ++i) {
    const long d = delta[i];
    if (d == 0) continue;
    auto visit = [&](long s) {
      const long from = s - d;
      if (from < negative || from > positive) return;
      const auto fi = static_cast<std::size_t>(from - negative);
      if (by[static_cast<std::size_t>(s - negative)] == -2 && by[fi] != -2 && by[fi] != static_cast<long>(i))
        by[static_cast<std::size_t>(s - negative)] = static_cast<long>(i);
    };
    // Each cycle once: walk sums away from the direction it moves.
    if (d > 0) {
      for (long s = positive; s >= negative; --s) visit(s);
    } else {
      for (long s = negative; s <= positive; ++s) visit(s);
    }
  }
  if (by[static_cast<std::size_t>(need - negative)] == -2) return std::nullopt;
  std::vector<int> flow = low.flow;
  for (long s = need; by[static_cast<std::size_t>(s - negative)] != -1;) {
    const auto i = static_cast<std::size_t>(by[static_cast<std::size_t>(s - negative)]);
    for (std::size_t a : cycles[i]) flow[a] += high.flow[a] > low.flow[a] ? 1 : -1;
    s -= delta[i];
  }
  return flow;
}

bool lex_less(const Flow& a, const Flow& b) {
  return a.cost != b.cost ? a.cost < b.cost : a.moves < b.moves;
}

// The Lagrangian search on one network under a cap on moves.
struct Evaluation {
  bool feasible = false;
  std::optional<Flow> best;  // best flow found within the cap
  Cost lower_bound = 0;      // on the cost of any flow within the cap
  Cost bound_lambda = 0;     // the multiplier is bound_lambda / bound_scale
  Cost bound_scale = 1;
  std::optional<Flow> bound_flow;  // the flow (and potentials) that gave lower_bound
  std::optional<Flow> above;       // a flow of the last lambda with more moves than the cap
  bool exact() const { return best && best->cost == lower_bound; }
};

Cost ceil_div(Cost a, Cost b) {
  return a >= 0 ? (a + b - 1) / b : -((-a) / b);
}

Evaluation evaluate_capped(const Network& net, const std::vector<ArcState>& state, long cap, Cost lambda_limit,
                           Cost largest) {
  Evaluation ev;
  auto x0 = solve_two_tier(net, state, 0, false);
  if (!x0) return ev;
  ev.feasible = true;
  ev.lower_bound = x0->cost;
  ev.bound_flow = x0;
  if (x0->moves <= cap) {
    ev.best = std::move(x0);
    return ev;
  }
  auto x_inf = solve_two_tier(net, state, 0, true);
  if (!x_inf || x_inf->moves > cap) {
    ev.feasible = false;
    return ev;
  }
  ev.best = x_inf;
  Cost lambda_a = 0;
  Flow a = std::move(*x0);
  std::optional<Cost> lambda_b;  // empty: infinity
  Flow b = std::move(*x_inf);
  for (;;) {
    if (lambda_b && *lambda_b - lambda_a <= 1) break;
    // Intersection of cost_a + l (moves_a - cap) and cost_b + l (moves_b - cap).
    const Cost num = b.cost - a.cost;
    const Cost den = a.moves - b.moves;
    Cost lambda = num > 0 ? num / den : 0;
    lambda = std::max(lambda, lambda_a + 1);
    if (lambda_b) lambda = std::min(lambda, *lambda_b - 1);
    lambda = std::min(lambda, lambda_limit);
    if (lambda <= lambda_a) break;
    // The last solve's potentials price the next one (the cost tier of a nearby multiplier).
    auto x = solve_two_tier(net, state, lambda, false, &(lambda_b ? b : a).potential);
    if (!x) break;  // cannot happen: the network was feasible at lambda 0
    const Cost bound = x->cost + lambda * (x->moves - cap);
    if (bound > ev.lower_bound) {
      ev.lower_bound = bound;
      ev.bound_lambda = lambda;
      ev.bound_flow = x;
    }
    if (x->moves <= cap) {
      if (lex_less(*x, *ev.best)) ev.best = x;
      lambda_b = lambda;
      b = std::move(*x);
    } else {
      lambda_a = lambda;
      a = std::move(*x);
    }
    if (ev.exact()) break;
  }
  // The bracket closed between two integers: the dual's optimum is at the fraction where the lines of `a` and `b`
  // meet. Solved there (costs times the denominator), its face holds flows from fewer to more moves than the cap;
  // one with exactly the cap is optimal.
  if (!ev.exact() && lambda_b && a.moves > b.moves) {
    const Cost num = b.cost - a.cost;
    const Cost den = a.moves - b.moves;
    const Cost per_node = lambda_limit + largest;
    if (num >= 0 && den > 1 && largest <= (per_node - num) / den) {
      std::optional<Flow> most;
      auto low = solve_two_tier(net, state, num, false, &b.potential, den, &most);
      if (low) {
        const Cost bound = ceil_div(den * low->cost + num * (low->moves - cap), den);
        if (bound > ev.lower_bound) {
          ev.lower_bound = bound;
          ev.bound_lambda = num;
          ev.bound_scale = den;
          ev.bound_flow = low;
        }
        if (low->moves <= cap && lex_less(*low, *ev.best)) ev.best = low;
        if (!ev.exact() && most) {
          if (auto flow = find_flow_with_moves(net, *low, *most, cap)) {
            Flow hit = *low;
            hit.flow = std::move(*flow);
            hit.cost = net.offset_cost;
            hit.moves = net.offset_moves;
            for (std::size_t i = 0; i < net.arcs.size(); ++i) {
              hit.cost += net.arcs[i].cost * hit.flow[i];
              if (net.arcs[i].counts_move) hit.moves += hit.flow[i];
            }
            if (lex_less(hit, *ev.best)) ev.best = std::move(hit);
          }
        }
      }
    }
  }
  ev.above = std::move(a);
  return ev;
}

// Arcs that cannot be in a flow within the cap costing at most `incumbent` (reduced cost beyond the gap) are
// fixed; returns the network of the arcs left and, per new arc, its index in `net`.
std::pair<Network, std::vector<std::size_t>> reduce_by_reduced_cost(const Network& net, const Evaluation& ev,
                                                                    Cost incumbent) {
  const Cost gap = (incumbent - ev.lower_bound) * ev.bound_scale;  // in the units of the bound's reduced costs
  const Flow& x = *ev.bound_flow;
  Network sub;
  sub.node_count = net.node_count;
  sub.supply = net.supply;
  sub.offset_cost = net.offset_cost;
  sub.offset_moves = net.offset_moves;
  std::vector<std::size_t> origin;
  for (std::size_t a = 0; a < net.arcs.size(); ++a) {
    const Arc& arc = net.arcs[a];
    const Cost rc = ev.bound_scale * arc.cost + (arc.counts_move ? ev.bound_lambda : 0) +
                    x.potential[static_cast<std::size_t>(arc.tail)] - x.potential[static_cast<std::size_t>(arc.head)];
    if (x.flow[a] == 0 && rc > gap) continue;
    if (x.flow[a] == arc.cap && -rc > gap) {
      sub.supply[static_cast<std::size_t>(arc.tail)] -= arc.cap;
      sub.supply[static_cast<std::size_t>(arc.head)] += arc.cap;
      sub.offset_cost += arc.cost * arc.cap;
      if (arc.counts_move) sub.offset_moves += arc.cap;
      continue;
    }
    sub.arcs.push_back(arc);
    origin.push_back(a);
  }
  return {std::move(sub), std::move(origin)};
}

struct SearchResult {
  std::optional<Flow> best;  // on the reduced network
  std::size_t nodes = 0;
  bool complete = true;
};

// Branch and bound on "part stays" / "part does not stay", depth first, the Lagrangian bound at every node.
SearchResult search_capped(const Network& net, long cap, Cost lambda_limit, Cost largest, std::optional<Flow> incumbent,
                           std::size_t node_limit) {
  SearchResult result;
  result.best = std::move(incumbent);
  std::vector<std::vector<ArcState>> stack;
  stack.emplace_back(net.arcs.size(), ArcState::free);
  while (!stack.empty()) {
    if (result.nodes >= node_limit) {
      result.complete = false;
      break;
    }
    std::vector<ArcState> state = std::move(stack.back());
    stack.pop_back();
    ++result.nodes;
    Evaluation ev = evaluate_capped(net, state, cap, lambda_limit, largest);
    if (!ev.feasible) continue;
    if (ev.best && (!result.best || lex_less(*ev.best, *result.best))) result.best = ev.best;
    if (ev.exact() || !ev.above) continue;
    if (result.best && ev.lower_bound >= result.best->cost) continue;  // ties would need exactly `cap` moves
    // Branch on the first part whose staying differs between the two sides of the bracket.
    const Flow& above = *ev.above;
    const Flow& below = *ev.best;
    std::optional<std::size_t> branch_arc;
    for (std::size_t a = 0; a < net.arcs.size() && !branch_arc; ++a) {
      const Arc& arc = net.arcs[a];
      const bool stay_arc = arc.kind == ArcKind::stay || arc.kind == ArcKind::unresolved;
      if (stay_arc && arc.head != net.node_count - 1 && state[a] == ArcState::free && above.flow[a] != below.flow[a])
        branch_arc = a;
    }
    if (!branch_arc) continue;  // cannot happen: the two sides differ in moves
    const int part = net.arcs[*branch_arc].part;
    std::vector<ArcState> stays = state;
    std::vector<ArcState> leaves = state;
    leaves[*branch_arc] = ArcState::off;
    for (std::size_t a = 0; a < net.arcs.size(); ++a) {
      if (net.arcs[a].part == part && a != *branch_arc) stays[a] = ArcState::off;
    }
    // Depth first, the side the within-cap flow took first.
    if (below.flow[*branch_arc] == 1) {
      stack.push_back(std::move(leaves));
      stack.push_back(std::move(stays));
    } else {
      stack.push_back(std::move(stays));
      stack.push_back(std::move(leaves));
    }
  }
  return result;
}

struct CellKey {
  std::size_t slot_class;
  std::size_t group;
  auto operator<=>(const CellKey&) const = default;
};

Issue cost_issue(IssueCode code, std::size_t part, std::size_t slot_class, const std::string& text) {
  return {code, part, {}, slot_class, text};
}

}  // namespace

SolveOutcome solve_reslot(const ReslotProblem& problem, const CostFunction& cost_fn, const ReslotOptions& options) {
  SolveOutcome outcome;
  outcome.issues = validate_reslot_problem(problem, options);
  if (!outcome.issues.empty()) return outcome;

  const std::size_t part_count = problem.parts.size();
  const bool family_mode = !problem.families.empty();
  const auto family_group = find_family_groups(problem);

  // Cells and their free capacity (slots not held by fixed parts).
  std::vector<bool> held_by_fixed(problem.slots.size(), false);
  for (const Part& part : problem.parts) {
    if (part.fixed) held_by_fixed[*part.current_slot] = true;
  }
  auto cell_of_slot = [&](std::size_t s) {
    return CellKey{problem.slots[s].slot_class, family_mode ? problem.slots[s].group : 0};
  };
  std::map<CellKey, std::size_t> capacity_of;
  for (std::size_t s = 0; s < problem.slots.size(); ++s) {
    if (!held_by_fixed[s]) ++capacity_of[cell_of_slot(s)];
  }
  std::vector<CellKey> cells;
  std::vector<std::vector<std::size_t>> cells_of_class(problem.class_count);
  for (const auto& [key, capacity] : capacity_of) {
    cells_of_class[key.slot_class].push_back(cells.size());
    cells.push_back(key);
  }
  auto find_cell = [&](const CellKey& key) -> std::optional<std::size_t> {
    const auto& list = cells_of_class[key.slot_class];
    for (std::size_t c : list) {
      if (cells[c].group == key.group) return c;
    }
    return std::nullopt;
  };

  // Node numbering: movable parts, cells, hubs (family mode), sink.
  Network net;
  std::vector<int> part_node(part_count, -1);
  int next_node = 0;
  for (std::size_t p = 0; p < part_count; ++p) {
    if (!problem.parts[p].fixed) part_node[p] = next_node++;
  }
  const int movable = next_node;
  const int first_cell_node = next_node;
  next_node += static_cast<int>(cells.size());
  const int first_hub_node = next_node;
  if (family_mode) next_node += static_cast<int>(problem.class_count);
  const int sink = next_node++;
  net.node_count = next_node;
  net.supply.assign(static_cast<std::size_t>(net.node_count), 0);
  for (std::size_t p = 0; p < part_count; ++p) {
    if (part_node[p] >= 0) net.supply[static_cast<std::size_t>(part_node[p])] = 1;
  }
  net.supply[static_cast<std::size_t>(sink)] = -movable;

  const double per_node_limit = static_cast<double>(cost_limit / (net.node_count + 2));
  auto scale_cost = [&](double c, std::size_t part, std::size_t cls) -> std::optional<Cost> {
    if (!std::isfinite(c)) {
      outcome.issues.push_back(cost_issue(
          IssueCode::cost_not_finite, part, cls,
          "part \"" + problem.parts[part].id + "\": cost in class " + std::to_string(cls) + " is not a finite number"));
      return std::nullopt;
    }
    const double scaled = c * options.cost_scale;
    if (std::fabs(scaled) > per_node_limit) {
      outcome.issues.push_back(cost_issue(
          IssueCode::cost_too_large, part, cls,
          "part \"" + problem.parts[part].id + "\": cost " + std::to_string(c) + " in class " + std::to_string(cls) +
              " is too large for exact integer arithmetic at cost_scale " + std::to_string(options.cost_scale)));
      return std::nullopt;
    }
    return static_cast<Cost>(std::llround(scaled));
  };
  const Cost move_cost = static_cast<Cost>(std::llround(options.cost_per_move * options.cost_scale));
  if (static_cast<double>(move_cost) > per_node_limit) {
    outcome.issues.push_back({IssueCode::cost_too_large, {}, {}, {}, "cost_per_move is too large at this cost_scale"});
    return outcome;
  }

  // Part arcs, in part order; unresolved arcs get their cost once B is known.
  std::vector<std::size_t> unresolved_arcs;
  std::vector<bool> has_allowed(part_count, false);
  Cost spread_sum = 0;
  for (std::size_t p = 0; p < part_count; ++p) {
    const Part& part = problem.parts[p];
    if (part.fixed) continue;
    const int node = part_node[p];
    // Plain values with flags: GCC 12 misreads optionals here as maybe uninitialized.
    const bool pinned = part.family.has_value();
    const std::size_t pin_group = pinned ? family_group[*part.family].value_or(0) : 0;
    const bool has_home = part.current_slot.has_value();
    const CellKey home = has_home ? cell_of_slot(*part.current_slot) : CellKey{0, 0};
    std::optional<Cost> lo;
    std::optional<Cost> hi;
    bool stay_added = false;
    for (std::size_t cls = 0; cls < problem.class_count; ++cls) {
      if (cells_of_class[cls].empty()) continue;
      // Does any reachable cell of this class exist for the part?
      bool reachable = false;
      for (std::size_t c : cells_of_class[cls]) {
        if (!pinned || cells[c].group == pin_group) reachable = true;
      }
      if (!reachable) continue;
      const auto raw = cost_fn(p, cls);
      if (!raw) continue;
      const auto s = scale_cost(*raw, p, cls);
      if (!s) continue;
      auto add = [&](int head, ArcKind kind, bool is_move) {
        Arc arc;
        arc.tail = node;
        arc.head = head;
        arc.kind = kind;
        arc.counts_move = is_move && part.current_slot.has_value();
        arc.cost = *s + (arc.counts_move ? move_cost : 0);
        arc.part = static_cast<int>(p);
        lo = lo ? std::min(*lo, arc.cost) : arc.cost;
        hi = hi ? std::max(*hi, arc.cost) : arc.cost;
        net.arcs.push_back(arc);
      };
      if (family_mode && !pinned) {
        if (has_home && home.slot_class == cls) {
          add(first_cell_node + static_cast<int>(*find_cell(home)), ArcKind::stay, false);
          stay_added = true;
        }
        add(first_hub_node + static_cast<int>(cls), ArcKind::move, true);
      } else {
        for (std::size_t c : cells_of_class[cls]) {
          if (pinned && cells[c].group != pin_group) continue;
          const bool is_home = has_home && home == cells[c];
          add(first_cell_node + static_cast<int>(c), is_home ? ArcKind::stay : ArcKind::move, !is_home);
          stay_added = stay_added || is_home;
        }
      }
    }
    has_allowed[p] = lo.has_value();
    if (lo) spread_sum += std::max<Cost>(*hi, 0) - std::min<Cost>(*lo, 0);
    if (spread_sum > cost_limit / (net.node_count + 2)) {
      outcome.issues.push_back({IssueCode::cost_too_large,
                                p,
                                {},
                                {},
                                "the spread of costs summed over parts is too large for exact integer arithmetic "
                                "at this cost_scale"});
      return outcome;
    }
    if (!stay_added) {
      Arc arc;
      arc.tail = node;
      arc.head = has_home ? first_cell_node + static_cast<int>(*find_cell(home)) : sink;
      arc.kind = ArcKind::unresolved;
      arc.part = static_cast<int>(p);
      unresolved_arcs.push_back(net.arcs.size());
      net.arcs.push_back(arc);
    }
  }
  if (!outcome.issues.empty()) return outcome;
  const Cost penalty = spread_sum + 1;
  Cost largest = 0;
  for (std::size_t a : unresolved_arcs) {
    net.arcs[a].cost = penalty;
  }
  for (const Arc& arc : net.arcs) largest = std::max(largest, arc.cost < 0 ? -arc.cost : arc.cost);
  if (largest > cost_limit / (net.node_count + 2)) {
    outcome.issues.push_back({IssueCode::cost_too_large,
                              {},
                              {},
                              {},
                              "the penalty for an unresolved part is too large for exact integer arithmetic at this "
                              "cost_scale"});
    return outcome;
  }
  // Structural arcs.
  if (family_mode) {
    for (std::size_t cls = 0; cls < problem.class_count; ++cls) {
      for (std::size_t c : cells_of_class[cls]) {
        Arc arc;
        arc.tail = first_hub_node + static_cast<int>(cls);
        arc.head = first_cell_node + static_cast<int>(c);
        arc.cap = static_cast<int>(capacity_of[cells[c]]);
        net.arcs.push_back(arc);
      }
    }
  }
  for (std::size_t c = 0; c < cells.size(); ++c) {
    Arc arc;
    arc.tail = first_cell_node + static_cast<int>(c);
    arc.head = sink;
    arc.cap = static_cast<int>(capacity_of[cells[c]]);
    net.arcs.push_back(arc);
  }

  // Solve.
  const Cost lambda_limit = cost_limit / (net.node_count + 2) - largest;
  const long cap = options.max_moves ? static_cast<long>(*options.max_moves) : std::numeric_limits<long>::max();
  const std::vector<ArcState> all_free(net.arcs.size(), ArcState::free);
  Evaluation root = evaluate_capped(net, all_free, cap, lambda_limit, largest);
  if (!root.feasible || !root.best) {
    // Cannot happen: keeping every part where it is and leaving new parts out is always a flow with 0 moves.
    outcome.issues.push_back({IssueCode::option_out_of_range, {}, {}, {}, "no flow within the move cap"});
    return outcome;
  }
  Solution solution;
  Certificate& cert = solution.certificate;
  std::vector<int> flow;
  if (root.exact()) {
    flow = root.best->flow;
    cert.kind = root.bound_lambda == 0 ? CertificateKind::flow_dual : CertificateKind::lagrangian;
    cert.lower_bound = root.lower_bound;
  } else {
    auto [sub, origin] = reduce_by_reduced_cost(net, root, root.best->cost);
    // The incumbent, restricted to the reduced network, is a flow of it: what it fixed agrees with it.
    Flow start;
    start.flow.resize(sub.arcs.size());
    for (std::size_t i = 0; i < origin.size(); ++i) start.flow[i] = root.best->flow[origin[i]];
    start.cost = root.best->cost;
    start.moves = root.best->moves;
    std::optional<Flow> incumbent;
    bool agrees = true;
    for (std::size_t a = 0, i = 0; a < net.arcs.size(); ++a) {
      if (i < origin.size() && origin[i] == a) {
        ++i;
        continue;
      }
      const bool fixed_full = root.bound_flow->flow[a] == net.arcs[a].cap;
      if (root.best->flow[a] != (fixed_full ? net.arcs[a].cap : 0)) agrees = false;
    }
    if (agrees) incumbent = std::move(start);
    SearchResult found = search_capped(sub, cap, lambda_limit, largest, std::move(incumbent), options.max_search_nodes);
    flow.assign(net.arcs.size(), 0);
    if (found.best && found.best->flow.size() == sub.arcs.size() && lex_less(*found.best, *root.best)) {
      for (std::size_t a = 0, i = 0; a < net.arcs.size(); ++a) {
        if (i < origin.size() && origin[i] == a) {
          flow[a] = found.best->flow[i++];
        } else {
          flow[a] = root.bound_flow->flow[a] == net.arcs[a].cap ? net.arcs[a].cap : 0;
        }
      }
    } else {
      flow = root.best->flow;
    }
    cert.kind = CertificateKind::search;
    cert.search_nodes = found.nodes;
    cert.lower_bound = root.lower_bound;
    solution.proven_optimal = found.complete;
  }
  const Flow& bound = *root.bound_flow;
  cert.move_multiplier = root.bound_lambda;
  cert.cost_multiplier = root.bound_scale;
  cert.unresolved_penalty = penalty;
  cert.move_cost_scaled = move_cost;
  cert.part_potential.resize(part_count);
  for (std::size_t p = 0; p < part_count; ++p) {
    if (part_node[p] >= 0) cert.part_potential[p] = bound.potential[static_cast<std::size_t>(part_node[p])];
  }
  for (std::size_t c = 0; c < cells.size(); ++c) {
    cert.cells.push_back({cells[c].slot_class, family_mode ? std::optional<std::size_t>(cells[c].group) : std::nullopt,
                          capacity_of[cells[c]], bound.potential[static_cast<std::size_t>(first_cell_node) + c]});
  }
  if (family_mode) {
    for (std::size_t cls = 0; cls < problem.class_count; ++cls)
      cert.hub_potential.push_back(bound.potential[static_cast<std::size_t>(first_hub_node) + cls]);
  }
  cert.sink_potential = bound.potential[static_cast<std::size_t>(sink)];

  // From class flow to slots. Parts reaching a hub are dealt to its cells in ascending part and cell order.
  std::vector<std::optional<std::size_t>> cell_of_part(part_count);
  std::vector<std::vector<std::size_t>> parts_at_hub(problem.class_count);
  std::vector<bool> unresolved_part(part_count, false);
  std::vector<std::size_t> hub_to_cell_left(cells.size(), 0);
  for (std::size_t a = 0; a < net.arcs.size(); ++a) {
    const Arc& arc = net.arcs[a];
    if (flow[a] == 0) continue;
    if (arc.part >= 0) {
      const auto p = static_cast<std::size_t>(arc.part);
      if (arc.kind == ArcKind::unresolved) unresolved_part[p] = true;
      if (arc.head == sink) continue;
      if (arc.head >= first_hub_node && arc.head < sink) {
        parts_at_hub[static_cast<std::size_t>(arc.head - first_hub_node)].push_back(p);
      } else {
        cell_of_part[p] = static_cast<std::size_t>(arc.head - first_cell_node);
      }
    } else if (arc.tail >= first_hub_node && arc.head != sink) {
      hub_to_cell_left[static_cast<std::size_t>(arc.head - first_cell_node)] = static_cast<std::size_t>(flow[a]);
    }
  }
  for (std::size_t cls = 0; cls < problem.class_count; ++cls) {
    std::size_t k = 0;
    for (std::size_t c : cells_of_class[cls]) {
      for (std::size_t taken = 0; taken < hub_to_cell_left[c] && k < parts_at_hub[cls].size(); ++taken)
        cell_of_part[parts_at_hub[cls][k++]] = c;
    }
  }
  solution.slot_of_part.assign(part_count, std::nullopt);
  std::vector<bool> slot_taken(problem.slots.size(), false);
  for (std::size_t p = 0; p < part_count; ++p) {
    const Part& part = problem.parts[p];
    if (part.fixed) {
      solution.slot_of_part[p] = part.current_slot;
      slot_taken[*part.current_slot] = true;
    } else if (cell_of_part[p] && part.current_slot && cells[*cell_of_part[p]] == cell_of_slot(*part.current_slot)) {
      solution.slot_of_part[p] = part.current_slot;
      slot_taken[*part.current_slot] = true;
    }
  }
  std::vector<std::vector<std::size_t>> free_slots(cells.size());
  for (std::size_t s = 0; s < problem.slots.size(); ++s) {
    if (!slot_taken[s]) {
      if (auto c = find_cell(cell_of_slot(s))) free_slots[*c].push_back(s);
    }
  }
  std::vector<std::size_t> next_free(cells.size(), 0);
  for (std::size_t p = 0; p < part_count; ++p) {
    if (solution.slot_of_part[p] || !cell_of_part[p]) continue;
    const std::size_t c = *cell_of_part[p];
    solution.slot_of_part[p] = free_slots[c][next_free[c]++];
  }

  // Objective, moves and unresolved parts from the slots themselves.
  for (std::size_t p = 0; p < part_count; ++p) {
    const Part& part = problem.parts[p];
    const auto& slot = solution.slot_of_part[p];
    if (part.fixed) {
      const auto raw = cost_fn(p, problem.slots[*slot].slot_class);
      const std::optional<Cost> s = raw ? scale_cost(*raw, p, problem.slots[*slot].slot_class) : std::nullopt;
      if (!outcome.issues.empty()) return outcome;
      if (s) {
        solution.objective += *raw;
        solution.scaled_objective += *s;
      } else {
        solution.unresolved.push_back({p, UnresolvedReason::fixed_in_forbidden_slot, slot});
      }
      continue;
    }
    if (unresolved_part[p]) {
      solution.unresolved.push_back(
          {p, has_allowed[p] ? UnresolvedReason::outcompeted : UnresolvedReason::no_allowed_slot, part.current_slot});
      continue;
    }
    const std::size_t cls = problem.slots[*slot].slot_class;
    const double raw = *cost_fn(p, cls);
    solution.objective += raw;
    solution.scaled_objective += static_cast<Cost>(std::llround(raw * options.cost_scale));
    if (*slot != part.current_slot) {
      solution.moves.push_back({p, part.current_slot, *slot});
      if (part.current_slot) {
        ++solution.move_count;
        solution.objective += options.cost_per_move;
        solution.scaled_objective += move_cost;
      }
    }
  }
  // The bound was on the flow's cost; the objective leaves out unresolved parts and adds fixed ones.
  Cost flow_cost = 0;
  for (std::size_t a = 0; a < net.arcs.size(); ++a) flow_cost += net.arcs[a].cost * flow[a];
  cert.lower_bound += solution.scaled_objective - flow_cost;
  outcome.solution = std::move(solution);
  return outcome;
}

}  // namespace rackreach::reslot
