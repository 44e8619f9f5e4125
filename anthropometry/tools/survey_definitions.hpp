// SPDX-License-Identifier: MIT
#pragma once
// What the generator takes from each raw survey: the files, their checks, and every output dimension with its
// definition, source columns and per-subject formula. The texts here go into the data files verbatim.

#include <functional>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "anthropometry/population_table.hpp"

namespace rackreach {

struct OutputDimension {
  std::string key;
  std::string label;
  TableUnit unit = TableUnit::mm;
  DimensionKind kind = DimensionKind::measured;
  std::string definition;
  std::vector<std::string> columns;  ///< raw columns, in the order `formula` receives them
  std::string derivation;            ///< the formula in words, for the data file (derived dimensions)
  std::string note;
  /// Per subject, from the columns' values in file units; empty means the single column times `scale`.
  std::function<double(const std::vector<double>&)> formula;
  double scale = 1.0;  ///< raw unit -> table unit for a measured column (0.1 for a mass stored in 0.1 kg)
};

struct RawFileSpec {
  std::string name;
  Sex sex = Sex::female;
  std::size_t expected_rows = 0;  ///< the generator stops if the file has any other number
  std::string sex_column;         ///< column that must hold `sex_value` in every row
  std::string sex_value;
};

struct SurveyDefinition {
  std::string name;
  std::string title;
  std::string citation;
  std::string survey;
  char delimiter = ',';
  std::vector<RawFileSpec> files;
  std::vector<std::string> method;
  std::vector<std::string> caveats;
  std::vector<OutputDimension> dimensions;
};

/// "ansur2" or "ansur1988"; nullptr for any other name.
const SurveyDefinition* find_survey(std::string_view name);

}  // namespace rackreach
