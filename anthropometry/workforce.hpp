// SPDX-License-Identifier: MIT
#pragma once
// A workforce: a population table (or several, dimension by dimension), mixed by sex in the shares the user has.
// Percentiles of the mix solve the mixed cumulative distribution (mixture.hpp); they are never averages of the
// sexes' percentiles. The reach model takes its body dimensions from here.

#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "anthropometry/population_table.hpp"
#include "engine/reach/sagittal_reach.hpp"

namespace rackreach {

/// The share of women in a workforce, 0..1; men are the rest.
struct SexMix {
  double women = 0.5;  ///< default 50/50 (our assumption for a workforce whose make-up is not given)
  double weight(Sex s) const { return s == Sex::female ? women : 1.0 - women; }
};

/// Reads "women=0.3", "men=0.7", "women=30%" (or the fraction alone, meaning women). Empty with `error` set when
/// the text is not one of these or the share is outside 0..1.
std::optional<SexMix> parse_sex_mix(std::string_view text, std::string& error);

/// Another table that supplies one dimension instead of the main table.
struct DimensionSource {
  std::string dimension;
  std::shared_ptr<const PopulationTable> table;
};

struct Workforce {
  std::shared_ptr<const PopulationTable> table;
  SexMix mix;
  std::vector<DimensionSource> overrides;

  /// The table that supplies `dimension`: an override if there is one, else the main table.
  const PopulationTable& find_table_for(std::string_view dimension) const;
  /// e.g. "ansur2, 30% women"
  std::string describe() const;
};

/// A percentile or summary of a workforce, with where it came from, or why there is none.
struct WorkforceValue {
  std::optional<double> value;  ///< cm for lengths, kg for masses
  std::string unit;             ///< "cm" or "kg"
  std::string table_name;       ///< the table that supplied it
  std::string problem;          ///< set when value is empty
};

/// The `percentile` (0..100) of one dimension in the workforce.
WorkforceValue calc_workforce_percentile(const Workforce& wf, std::string_view dimension, double percentile);

/// Mean and SD of one dimension in the workforce (cm or kg).
struct WorkforceMeanSd {
  std::optional<double> mean;
  std::optional<double> sd;
  std::string problem;
};
WorkforceMeanSd calc_workforce_mean_sd(const Workforce& wf, std::string_view dimension);

/// Dimension keys the reach model needs from a table.
inline constexpr std::string_view reach_dimension_keys[] = {"stature",
                                                            "acromial_height",
                                                            "elbow_height",
                                                            "grip_centre_height",
                                                            "overhead_grip_reach",
                                                            "shoulder_grip_length",
                                                            "hand_breadth"};

struct ReachBodyResult {
  std::optional<ReachBody> body;
  std::vector<std::string> problems;  ///< one per dimension that could not be found or computed
};

/// The reach model's body dimensions for the `percentile` (0..100) worker of the workforce.
ReachBodyResult calc_reach_body(const Workforce& wf, double percentile);

}  // namespace rackreach
