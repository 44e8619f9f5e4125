// SPDX-License-Identifier: MIT
#pragma once
// The tables shipped in anthropometry/data, loaded through the library as the program loads them.

#include <catch2/catch.hpp>
#include <memory>
#include <string>

#include "anthropometry/population_json.hpp"
#include "anthropometry/workforce.hpp"

namespace shipped {

inline std::string data_dir() {
  return std::string(RACKREACH_SOURCE_DIR) + "/anthropometry/data";
}

inline std::shared_ptr<const rackreach::PopulationTable> load(const std::string& name) {
  rackreach::LoadedPopulation loaded = rackreach::load_population_file(data_dir() + "/" + name + ".json");
  for (const auto& p : loaded.problems) UNSCOPED_INFO(rackreach::format_problem(p));
  REQUIRE(loaded.table);
  return std::make_shared<const rackreach::PopulationTable>(std::move(*loaded.table));
}

inline rackreach::Workforce workforce(const std::string& name, double women) {
  return rackreach::Workforce{load(name), rackreach::SexMix{women}, {}};
}

/// The percentile of one dimension in cm (or kg); fails the test if the table cannot give it.
inline double percentile(const rackreach::Workforce& wf, const std::string& dim, double p) {
  const rackreach::WorkforceValue v = rackreach::calc_workforce_percentile(wf, dim, p);
  INFO(v.problem);
  REQUIRE(v.value);
  return *v.value;
}

}  // namespace shipped
