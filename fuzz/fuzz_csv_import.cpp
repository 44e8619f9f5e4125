// SPDX-License-Identifier: MIT
// Fuzz target: the CSV import of a part master or a slot list. The first byte chooses the file kind, the
// project's units and the import options; the rest is the file. Any input must end in rows or in problems;
// parts that import must export to a CSV that imports again.

#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "engine/io/csv_import.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  if (size == 0) return 0;
  using namespace rackreach;
  const std::uint8_t mode = data[0];
  const std::string_view text(reinterpret_cast<const char*>(data + 1), size - 1);
  const UnitSystem units = (mode & 1) ? UnitSystem::us : UnitSystem::metric;
  CsvOptions options;
  if (mode & 2) options.units = (mode & 4) ? UnitSystem::us : UnitSystem::metric;
  options.ignore_unknown_columns = (mode & 8) != 0;
  if (mode & 16) {
    const SlotsCsv slots = load_slots_csv_text(text, "slots.csv", units, options);
    if (slots.problems.empty()) {
      const SlotsCsv again = load_slots_csv_text(write_slots_csv(slots.slots, units), "again.csv", units, {});
      if (!again.problems.empty() || again.slots.size() != slots.slots.size()) std::abort();
    }
  } else {
    const PartsCsv parts = load_parts_csv_text(text, "parts.csv", units, options);
    if (parts.problems.empty()) {
      const PartsCsv again = load_parts_csv_text(write_parts_csv(parts.parts, units), "again.csv", units, {});
      if (!again.problems.empty() || again.parts.size() != parts.parts.size()) std::abort();
    }
  }
  return 0;
}
