// SPDX-License-Identifier: MIT
#pragma once
// Deterministic re-slotting instances for the benchmarks: n parts on n slots (every slot full), 40 slot classes in
// 10 racks, about 10% of part x class pairs forbidden, 5% of parts fixed, half of the parts today in one of the
// worst quarter of the classes. cost = picks per shift x load x class risk factor x (1 + up to 10% per pair).

#include <cstdint>
#include <optional>
#include <random>
#include <vector>

#include "engine/reslot/reslot_solver.hpp"

namespace rackreach::bench {

struct ReslotInstance {
  reslot::ReslotProblem problem;
  std::vector<double> load_kg;
  std::vector<double> picks_per_shift;
  std::vector<double> class_risk;

  // A hash of (part, class) in [0, 1): the per-pair variation and the forbidden pairs, without storing a matrix.
  static double pair_hash(std::size_t p, std::size_t c) {
    std::uint64_t x = (static_cast<std::uint64_t>(p) << 20) ^ static_cast<std::uint64_t>(c) ^ 0x9e3779b97f4a7c15ull;
    x ^= x >> 33;
    x *= 0xff51afd7ed558ccdull;
    x ^= x >> 33;
    x *= 0xc4ceb9fe1a85ec53ull;
    x ^= x >> 33;
    return static_cast<double>(x >> 11) / 9007199254740992.0;
  }

  std::optional<double> cost(std::size_t p, std::size_t c) const {
    const double h = pair_hash(p, c);
    const auto& current = problem.parts[p].current_slot;
    const bool current_class = current && problem.slots[*current].slot_class == c;
    if (h < 0.1 && !current_class) return std::nullopt;
    return picks_per_shift[p] * load_kg[p] * class_risk[c] * (1.0 + 0.1 * h) / 1000.0;
  }
};

inline ReslotInstance make_reslot_instance(std::size_t n) {
  constexpr std::size_t classes = 40;
  constexpr std::size_t racks = 10;
  std::mt19937_64 rng(20261120 + n);
  ReslotInstance in;
  in.problem.class_count = classes;
  for (std::size_t c = 0; c < classes; ++c) in.class_risk.push_back(0.2 + 2.8 * static_cast<double>(c) / (classes - 1));
  std::vector<std::size_t> bad_slots;
  std::vector<std::size_t> other_slots;
  for (std::size_t s = 0; s < n; ++s) {
    const std::size_t c = (s * 7919) % classes;
    in.problem.slots.push_back({"S" + std::to_string(s), c, (s / 8) % racks});
    (c >= classes * 3 / 4 ? bad_slots : other_slots).push_back(s);
  }
  std::shuffle(bad_slots.begin(), bad_slots.end(), rng);
  std::shuffle(other_slots.begin(), other_slots.end(), rng);
  std::uniform_real_distribution<double> load(0.5, 25.0);
  std::uniform_real_distribution<double> picks(5.0, 400.0);
  std::size_t next_bad = 0;
  std::size_t next_other = 0;
  for (std::size_t p = 0; p < n; ++p) {
    reslot::Part part;
    part.id = "P" + std::to_string(p);
    const bool bad = p % 2 == 0 && next_bad < bad_slots.size();
    if (bad) {
      part.current_slot = bad_slots[next_bad++];
    } else if (next_other < other_slots.size()) {
      part.current_slot = other_slots[next_other++];
    } else {
      part.current_slot = bad_slots[next_bad++];
    }
    part.fixed = p % 20 == 7;
    in.problem.parts.push_back(part);
    in.load_kg.push_back(load(rng));
    in.picks_per_shift.push_back(picks(rng));
  }
  return in;
}

}  // namespace rackreach::bench
