// SPDX-License-Identifier: MIT
#pragma once
// The store part of a project file (shift, demand, zones, racks, parts, slots, routes, level-limit settings):
// read and validated in one pass with the rest of the file, every problem with its JSON path, plus the
// cross-references (a slot naming an unknown part or level is an error naming both).

#include <nlohmann/json.hpp>
#include <vector>

#include "engine/io/json_reader.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach {

/// The root keys this loader reads.
inline constexpr const char* store_root_keys[] = {"shift", "demand", "zones", "racks", "parts", "slots", "routes",
                                                   "reference_box", "limit_frequencies"};

/// Reads the store keys of the root object `doc` into `store`; problems go to the reader.
void load_store(JsonReader& r, std::vector<Problem>& problems, const nlohmann::json& doc, UnitSystem units,
                Store& store);

}  // namespace rackreach
