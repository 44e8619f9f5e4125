// SPDX-License-Identifier: MIT
#pragma once
// Deterministic, varied lift tasks for benchmarks: H, V, A, F, load and coupling spread over the equation's
// whole range and a little beyond it, so every branch (clamps, zero multipliers, interpolation) is exercised.
// Invented numbers: benchmark input only.

#include <random>
#include <vector>

#include "engine/lifting/rnle_1994.hpp"

namespace rackreach::bench {

inline std::vector<LiftTask> make_varied_tasks(std::size_t n, unsigned seed = 20261201u) {
  std::mt19937_64 rng(seed);
  std::uniform_real_distribution<double> h(15.0, 70.0), v(0.0, 180.0), a(0.0, 150.0), f(0.1, 16.0), load(1.0, 30.0);
  std::uniform_int_distribution<int> coupling(0, 2), control(0, 1);
  std::vector<LiftTask> tasks(n);
  for (std::size_t i = 0; i < n; ++i) {
    LiftTask& t = tasks[i];
    t.id = "T" + std::to_string(i);
    t.load = load(rng);
    t.frequency_per_min = f(rng);
    t.coupling = static_cast<Coupling>(coupling(rng));
    t.origin = {h(rng), v(rng), a(rng)};
    t.destination = {h(rng), v(rng), a(rng)};
    t.control_at_destination = control(rng) == 1;
  }
  return tasks;
}

}  // namespace rackreach::bench
