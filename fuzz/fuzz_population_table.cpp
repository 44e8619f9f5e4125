// SPDX-License-Identifier: MIT
// Fuzz target: the population table loader. Any input must end in a table or in problems; a table that loads
// must save to a text that loads again.

#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string>

#include "anthropometry/population_json.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  const rackreach::LoadedPopulation loaded = rackreach::load_population_text(text, "fuzz.json");
  if (loaded.table.has_value() != loaded.problems.empty()) std::abort();
  if (loaded.table) {
    const auto again = rackreach::load_population_text(rackreach::save_population_text(*loaded.table), "again.json");
    if (!again.table) std::abort();
  }
  return 0;
}
