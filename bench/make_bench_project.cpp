// SPDX-License-Identifier: MIT
// Writes a project file of N single-task jobs (default 100,000) for the end-to-end benchmark of
// `rackreach assess --format json`. Usage: make_bench_project OUT.json [N]

#include <cstdio>
#include <cstdlib>
#include <string>

#include "bench/bench_tasks.hpp"

int main(int argc, char** argv) {
  if (argc < 2) {
    std::fprintf(stderr, "usage: make_bench_project OUT.json [N]\n");
    return 2;
  }
  const std::size_t n = argc > 2 ? std::strtoull(argv[2], nullptr, 10) : 100000;
  std::FILE* f = std::fopen(argv[1], "w");
  if (!f) {
    std::perror(argv[1]);
    return 1;
  }
  const char* durations[] = {"short", "moderate", "long"};
  const auto tasks = rackreach::bench::make_varied_tasks(n);
  std::fprintf(f, "{\"rackreach\": 1, \"units\": \"metric\", \"title\": \"benchmark\", \"jobs\": [\n");
  for (std::size_t i = 0; i < n; ++i) {
    const auto& t = tasks[i];
    std::fprintf(f,
                 "%s{\"id\": \"J%zu\", \"duration\": \"%s\", \"tasks\": [{\"id\": \"%s\", \"load\": %.2f, "
                 "\"frequency\": %.2f, \"coupling\": \"%s\", \"origin\": {\"h\": %.1f, \"v\": %.1f, \"a\": %.0f}, "
                 "\"destination\": {\"h\": %.1f, \"v\": %.1f, \"a\": %.0f}, \"control_at_destination\": %s}]}\n",
                 i == 0 ? "" : ",", i, durations[i % 3], t.id.c_str(), t.load, t.frequency_per_min,
                 std::string(rackreach::coupling_name(t.coupling)).c_str(), t.origin.h, t.origin.v, t.origin.a_deg,
                 t.destination.h, t.destination.v, t.destination.a_deg, t.control_at_destination ? "true" : "false");
  }
  std::fprintf(f, "]}\n");
  return std::fclose(f) == 0 ? 0 : 1;
}
