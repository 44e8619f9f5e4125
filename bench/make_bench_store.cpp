// SPDX-License-Identifier: MIT
// Writes a synthetic store of N slots (default 100,000; deterministic seed) for the slot-review benchmark:
// hand racks of four levels and mixed racks of six, parts of varied weight, box and handhold, one part per slot,
// and routes of 10 to 20 slots. Invented numbers: benchmark input only. Usage: make_bench_store OUT.json [N]

#include <cstdio>
#include <cstdlib>
#include <random>
#include <string>

int main(int argc, char** argv) {
  if (argc < 2) {
    std::fprintf(stderr, "usage: make_bench_store OUT.json [N]\n");
    return 2;
  }
  const long n = argc > 2 ? std::strtol(argv[2], nullptr, 10) : 100000;
  std::FILE* f = std::fopen(argv[1], "w");
  if (!f) {
    std::perror(argv[1]);
    return 1;
  }
  std::mt19937_64 rng(20261201u);
  std::uniform_real_distribution<double> weight(0.3, 28.0), dim(10.0, 45.0);
  std::uniform_int_distribution<int> kind(0, 2), ppk(1, 4), pos(0, 1);
  const int bays = 5, hand_levels = 4;
  const long slots_per_rack = bays * hand_levels * 2;
  const long racks = (n + slots_per_rack - 1) / slots_per_rack;
  std::fprintf(f, "{\"rackreach\": 1, \"units\": \"metric\", \"title\": \"benchmark store\",\n");
  std::fprintf(f, "\"shift\": {\"start\": \"06:00\", \"end\": \"14:00\", \"breaks\": [{\"start\": \"10:00\", \"minutes\": 30}]},\n");
  std::fprintf(f, "\"demand\": {\"kits_per_hour\": 12},\n\"zones\": [{\"id\": \"Z1\", \"standing_distance\": 25, "
                  "\"cart_deck_height\": 90, \"cart_h\": 40, \"turn_angle\": 60, \"lifting_pattern\": [{\"lifting_min\": "
                  "50}, {\"recovery_min\": 60}, {\"lifting_min\": 50}]}],\n\"racks\": [\n");
  for (long r = 0; r < racks; ++r)
    std::fprintf(f,
                 "%s{\"id\": \"R%ld\", \"kind\": \"hand\", \"zone\": \"Z1\", \"bay_width\": 120, \"shelf_depth\": %d, "
                 "\"bays\": %d, \"levels\": [{\"id\": \"1\", \"surface_height\": 10, \"clear_height\": 45}, {\"id\": "
                 "\"2\", \"surface_height\": 60, \"clear_height\": 45}, {\"id\": \"3\", \"surface_height\": 110, "
                 "\"clear_height\": 45}, {\"id\": \"4\", \"surface_height\": 160, \"clear_height\": 45}]}\n",
                 r == 0 ? "" : ",", r, r % 2 ? 60 : 90, bays);
  std::fprintf(f, "],\n\"parts\": [\n");
  const char* handholds[] = {"{\"kind\": \"handles\", \"optimal\": true}", "{\"kind\": \"cutouts\", \"optimal\": false}",
                             "{\"kind\": \"none\", \"fingers_flex_90\": true}"};
  for (long i = 0; i < n; ++i)
    std::fprintf(f,
                 "%s{\"id\": \"P%ld\", \"family\": \"F%ld\", \"unit_weight\": %.2f, \"box\": {\"width\": %.0f, "
                 "\"depth\": %.0f, \"height\": %.0f}, \"handhold\": %s, \"pieces_per_kit\": %d}\n",
                 i == 0 ? "" : ",", i, i % 97, weight(rng), dim(rng), dim(rng) * 0.8, dim(rng) * 0.8, handholds[kind(rng)],
                 ppk(rng));
  std::fprintf(f, "],\n\"slots\": [\n");
  for (long i = 0; i < n; ++i) {
    const long rack = i / slots_per_rack, k = i % slots_per_rack;
    std::fprintf(f, "%s{\"id\": \"S%ld\", \"part\": \"P%ld\", \"rack\": \"R%ld\", \"level\": \"%ld\", \"bay\": %ld, "
                    "\"position\": \"%s\"}\n",
                 i == 0 ? "" : ",", i, i, rack, 1 + k / (bays * 2), 1 + (k / 2) % bays, k % 2 ? "back" : "front");
  }
  std::fprintf(f, "],\n\"routes\": [\n");
  long route = 0;
  for (long start = 0; start + 20 <= n && route < n / 100; start += 100, ++route) {
    std::fprintf(f, "%s{\"id\": \"RT%ld\", \"slots\": [", route == 0 ? "" : ",", route);
    for (int k = 0; k < 15; ++k) std::fprintf(f, "%s\"S%ld\"", k ? ", " : "", start + 2 * k);
    std::fprintf(f, "]}\n");
  }
  std::fprintf(f, "]}\n");
  return std::fclose(f) == 0 ? 0 : 1;
}
