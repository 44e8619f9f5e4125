// SPDX-License-Identifier: MIT
#pragma once
// Work-duration category from a pattern of lifting and recovery periods (Waters et al. 1994, Applications
// Manual 1.3.5.2, revised edition 2021):
//  - short: at most 1 h of lifting, followed by recovery (light work) of at least 1.0 x the lifting time
//    (the 1994 edition asked 1.2 x);
//  - moderate: more than 1 h and at most 2 h, followed by recovery of at least 0.3 x the lifting time;
//  - long: more than 2 h and at most 8 h, with standard industrial breaks.
// If the recovery required is not met before the next lifting period, the periods' lifting times are added.
// More than 8 h of lifting is outside the equation.
// Our reading where the manual is silent, documented: a lifting period of more than 2 h is never reset by a
// recovery period (standard breaks are already assumed inside the long category), so a 10-hour shift with two
// breaks counts as more than 8 h; lifting at the end of the pattern is followed by the end of the shift, which
// counts as sufficient recovery.
// Also here: the special frequency adjustment (Applications Manual 1.3.5.5).

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/lifting/duration_category.hpp"

namespace rackreach {

/// Which edition's recovery rule for the short category applies.
enum class DurationRule { edition_2021, edition_1994 };

constexpr std::string_view duration_rule_name(DurationRule r) { return r == DurationRule::edition_2021 ? "2021" : "1994"; }
constexpr std::optional<DurationRule> find_duration_rule(std::string_view s) {
  if (s == "2021") return DurationRule::edition_2021;
  if (s == "1994") return DurationRule::edition_1994;
  return std::nullopt;
}

/// Recovery required after a short (<= 1 h) lifting period, as a multiple of its lifting time.
constexpr double short_recovery_ratio(DurationRule r) { return r == DurationRule::edition_2021 ? 1.0 : 1.2; }
/// Recovery required after a moderate (1-2 h) lifting period: 0.3 x its lifting time (both editions).
inline constexpr double moderate_recovery_ratio = 0.3;
inline constexpr double short_limit_min = 60.0;
inline constexpr double moderate_limit_min = 120.0;
inline constexpr double long_limit_min = 480.0;

/// One period of a work pattern: lifting, or recovery (light work or rest), in minutes (> 0).
struct WorkPeriod {
  enum class Kind { lifting, recovery } kind = Kind::lifting;
  double minutes = 0.0;
  bool operator==(const WorkPeriod&) const = default;
};

struct DurationAssessment {
  std::optional<DurationCategory> category;  ///< empty: more than 8 h, outside the equation
  double longest_lifting_min = 0.0;          ///< the longest run of lifting after the recovery rule joined periods
  DurationRule rule = DurationRule::edition_2021;
  std::string explanation;                   ///< how the category follows from the pattern, in plain words
  bool operator==(const DurationAssessment&) const = default;
};

/// The duration category of a pattern of periods, in order of time.
DurationAssessment calc_duration(const std::vector<WorkPeriod>& pattern, DurationRule rule);

/// Special frequency adjustment (Applications Manual 1.3.5.5): lifting at `lifts_per_min` for `lifting_min`
/// minutes of a `sample_min`-minute sample (usually 15) gives F = lifts_per_min x lifting_min / sample_min.
constexpr double calc_sampled_frequency(double lifts_per_min, double lifting_min, double sample_min) {
  return lifts_per_min * lifting_min / sample_min;
}
/// The sample period the manual uses for the adjustment.
inline constexpr double frequency_sample_min = 15.0;

}  // namespace rackreach
