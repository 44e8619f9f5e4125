// SPDX-License-Identifier: MIT
// The Composite Lifting Index procedure of the Applications Manual (Waters et al. 1994, section 2.4), its
// ordering and tie rule, and its properties.

#include <catch2/catch.hpp>
#include <random>

#include "engine/assess.hpp"
#include "engine/lifting/composite.hpp"

using namespace rackreach;
using Catch::Matchers::WithinAbs;

namespace {

LiftTask make_task(std::string id, double load, double f, double h, double v0, double v1) {
  LiftTask t;
  t.id = std::move(id);
  t.load = load;
  t.frequency_per_min = f;
  t.coupling = Coupling::good;
  t.origin = {h, v0, 0.0};
  t.destination = {h, v1, 0.0};
  return t;
}

LiftJob make_job(std::vector<LiftTask> tasks) {
  LiftJob j;
  j.id = "J";
  j.declared_duration = DurationCategory::moderate_duration;
  j.tasks = std::move(tasks);
  j.details.resize(j.tasks.size());
  return j;
}

}  // namespace

TEST_CASE("CLI: order by decreasing STLI, ties by the higher frequency", "[composite]") {
  std::vector<CompositeItem> items = {{"a", 0.5, 0.4, 1.0, true},
                                      {"b", 0.9, 0.8, 2.0, true},
                                      {"c", 0.7, 0.8, 3.0, true},
                                      {"d", 1.0, 1.2, 0.5, true}};
  const auto order = order_for_composite(items);
  REQUIRE(order.size() == 4);
  CHECK(order[0] == 3);  // STLI 1.2
  CHECK(order[1] == 2);  // STLI 0.8 tie: F 3 before F 2
  CHECK(order[2] == 1);
  CHECK(order[3] == 0);
}

TEST_CASE("CLI formula by hand, Applications Manual 2.4 step 4", "[composite]") {
  // Two tasks, moderate duration, origins below 75 cm (V < 75 column of Table 5).
  // CLI = STLI_1 + FILI_2 x (1/FM(F1+F2) - 1/FM(F1)).
  std::vector<CompositeItem> items = {{"x", 0.8, 1.0, 1.0, true}, {"y", 0.6, 0.7, 2.0, true}};
  const auto r = calc_composite_li(items, DurationCategory::moderate_duration, RoundingMode::full);
  REQUIRE(r.cli);
  const double fm1 = 0.88;  // F = 1, <= 2 h, V < 75 ([AM94] Table 5)
  const double fm3 = 0.79;  // F = 3
  CHECK_THAT(*r.cli, WithinAbs(1.0 + 0.6 * (1.0 / fm3 - 1.0 / fm1), 1e-12));
  REQUIRE(r.terms.size() == 2);
  CHECK(r.terms[1].cumulative_frequency_per_min == 3.0);
}

TEST_CASE("CLI column for summed frequencies: V < 75 if any task in the sum is below it (our rule)", "[composite]") {
  std::vector<CompositeItem> items = {{"hi", 0.8, 1.0, 6.0, false}, {"lo", 0.6, 0.7, 4.0, false}};
  auto r = calc_composite_li(items, DurationCategory::long_duration, RoundingMode::full);
  REQUIRE(r.cli);
  CHECK(r.terms[1].fm_cumulative == 0.13);  // F = 10, long, V >= 75 ([AM94] Table 5)
  items[1].origin_v_below_split = true;
  r = calc_composite_li(items, DurationCategory::long_duration, RoundingMode::full);
  CHECK_FALSE(r.cli);  // F = 10, long, V < 75 is a zero cell: undefined, never huge
  REQUIRE(r.undefined_reason);
  CHECK_THAT(*r.undefined_reason, Catch::Matchers::Contains("combined frequency 10"));
}

TEST_CASE("A one-task job's CLI equals its LI; CLI is never below the largest STLI", "[composite][property]") {
  std::mt19937 rng(20261201);
  std::uniform_real_distribution<double> load(1.0, 25.0), f(0.1, 3.0), h(20.0, 63.0), v(0.0, 175.0);
  for (int trial = 0; trial < 300; ++trial) {
    const int n = 1 + trial % 5;
    std::vector<LiftTask> tasks;
    for (int i = 0; i < n; ++i) tasks.push_back(make_task("t" + std::to_string(i), load(rng), f(rng), h(rng), v(rng), v(rng)));
    const LiftJob job = make_job(tasks);
    const JobAssessment a = assess_job(job, UnitSystem::metric, DurationRule::edition_2021, RoundingMode::full);
    std::vector<CompositeItem> items;
    for (int i = 0; i < n; ++i) items.push_back(make_composite_item(job.tasks[i], a.tasks[i], UnitSystem::metric));
    const auto r = calc_composite_li(items, DurationCategory::moderate_duration, RoundingMode::full);
    if (!r.cli) continue;  // a zero cell at the summed frequency: undefined is the right answer
    if (n == 1) {
      REQUIRE(a.tasks[0].li);
      CHECK_THAT(*r.cli, WithinAbs(*a.tasks[0].li, 1e-12));
    }
    double max_stli = 0.0;
    for (const auto& it : items) max_stli = std::max(max_stli, it.stli.value_or(0.0));
    CHECK(*r.cli >= max_stli - 1e-12);
  }
}
