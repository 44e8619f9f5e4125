// SPDX-License-Identifier: MIT
// Solves one benchmark instance and prints its figures, for peak memory of one size alone:
//   /usr/bin/time -f "%e s %M KB" reslot_instance N [MAX_MOVES [MAX_SEARCH_NODES]]

#include <chrono>
#include <cstdio>
#include <cstdlib>

#include "bench/reslot_instances.hpp"

int main(int argc, char** argv) {
  if (argc < 2) {
    std::fprintf(stderr, "usage: reslot_instance N [MAX_MOVES [MAX_SEARCH_NODES]]\n");
    return 2;
  }
  const std::size_t n = std::strtoull(argv[1], nullptr, 10);
  const auto instance = rackreach::bench::make_reslot_instance(n);
  rackreach::reslot::ReslotOptions options;
  options.cost_per_move = 0.5;
  if (argc > 2) options.max_moves = std::strtoull(argv[2], nullptr, 10);
  if (argc > 3) options.max_search_nodes = std::strtoull(argv[3], nullptr, 10);
  const auto start = std::chrono::steady_clock::now();
  const auto out = rackreach::reslot::solve_reslot(
      instance.problem, [&](std::size_t p, std::size_t c) { return instance.cost(p, c); }, options);
  const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  if (!out.solution) {
    std::fprintf(stderr, "no solution: %s\n", out.issues.empty() ? "" : out.issues[0].message.c_str());
    return 1;
  }
  const auto& s = *out.solution;
  const char* kinds[] = {"flow_dual", "lagrangian", "search"};
  std::printf(
      "parts %zu  solve %.3f s  objective %.3f  moves %zu  unresolved %zu  certificate %s  nodes %zu  gap to bound "
      "%.6f%s\n",
      n, seconds, s.objective, s.move_count, s.unresolved.size(), kinds[static_cast<int>(s.certificate.kind)],
      s.certificate.search_nodes,
      static_cast<double>(s.scaled_objective - s.certificate.lower_bound) / options.cost_scale,
      s.proven_optimal ? "" : "  (node limit reached: not proven optimal)");
  return 0;
}
