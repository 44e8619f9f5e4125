// SPDX-License-Identifier: MIT
#pragma once
// The population table file (JSON, "rackreach_population": 1): reading with full validation, and writing.
// The format is described field by field in docs/anthropometry.md. Every problem found is reported with the file,
// the JSON path, the value and the rule; unknown keys are problems too, so that a misspelt field is never ignored.

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "anthropometry/population_table.hpp"
#include "engine/problem.hpp"

namespace rackreach {

inline constexpr int population_format_version = 1;

struct LoadedPopulation {
  std::optional<PopulationTable> table;  ///< set only when there are no problems
  std::vector<Problem> problems;
};

/// Parses and validates `text`; `file_label` names the file in problems.
LoadedPopulation load_population_text(const std::string& text, const std::string& file_label);
/// Reads and validates a population table file.
LoadedPopulation load_population_file(const std::filesystem::path& path);

/// The table as file text: two-space indents, each list of numbers on one line.
std::string save_population_text(const PopulationTable& table);

}  // namespace rackreach
