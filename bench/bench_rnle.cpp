// SPDX-License-Identifier: MIT
// ns per task evaluation: origin and destination, every multiplier, RWL, FIRWL, STRWL, LI, FILI, STLI and the
// warnings, over a batch of 100,000 varied tasks.

#include <benchmark/benchmark.h>

#include "bench/bench_tasks.hpp"

namespace {

void bm_evaluate_task(benchmark::State& state) {
  const auto tasks = rackreach::bench::make_varied_tasks(100000);
  const rackreach::DurationCategory durations[] = {rackreach::DurationCategory::short_duration,
                                                   rackreach::DurationCategory::moderate_duration,
                                                   rackreach::DurationCategory::long_duration};
  const auto mode = static_cast<rackreach::RoundingMode>(state.range(0));
  for (auto _ : state) {
    for (std::size_t i = 0; i < tasks.size(); ++i) {
      auto r = rackreach::evaluate_task(tasks[i], durations[i % 3], rackreach::UnitSystem::metric, mode);
      benchmark::DoNotOptimize(r);
    }
  }
  state.SetItemsProcessed(static_cast<std::int64_t>(state.iterations() * tasks.size()));
  // Seconds per task (an inverted rate); shown as e.g. "150n" in the table: nanoseconds per task.
  state.counters["time_per_task"] = benchmark::Counter(static_cast<double>(state.iterations() * tasks.size()),
                                                       benchmark::Counter::kIsRate | benchmark::Counter::kInvert);
}
BENCHMARK(bm_evaluate_task)->Arg(0)->Arg(1)->ArgNames({"worksheet"})->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
