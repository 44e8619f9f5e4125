// SPDX-License-Identifier: MIT
#pragma once
// The store part of a project file (shift, demand, zones, racks, parts, slots, routes, level-limit settings):
// read and validated in one pass with the rest of the file, every problem with its JSON path, plus the
// cross-references (a slot naming an unknown part or level is an error naming both).

#include <nlohmann/json.hpp>
#include <memory>
#include <string_view>
#include <vector>

#include "engine/io/json_reader.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach {

/// Reads the store keys of a project file. The parser may hand over the elements of the root arrays (zones,
/// racks, parts, slots, routes) one by one as they are parsed (add), so that a large file never holds them as a
/// document tree; finish() reads the rest of the root object and checks the cross-references.
class StoreReader {
 public:
  StoreReader(JsonReader& r, std::vector<Problem>& problems);
  ~StoreReader();
  StoreReader(const StoreReader&) = delete;
  StoreReader& operator=(const StoreReader&) = delete;

  /// Units for the elements added before the root's "units" is known to be valid.
  void set_units(UnitSystem units);
  /// True for the root arrays whose elements add() takes.
  static bool streams(std::string_view root_key);
  void add(std::string_view root_key, const nlohmann::json& element, std::size_t index);
  /// Reads the other store keys of `doc`, checks the cross-references, and moves the store out.
  void finish(const nlohmann::json& doc, UnitSystem units, Store& store);

 private:
  class Impl;
  std::unique_ptr<Impl> impl_;
  Store store_;
};

}  // namespace rackreach
