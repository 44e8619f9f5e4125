// SPDX-License-Identifier: MIT
#pragma once
#include <optional>
#include <string_view>

namespace rackreach {

/// Work-duration category of the lifting equation (Waters et al. 1994, Applications Manual 1.3.5.2):
/// short (<= 1 h), moderate (> 1 h, <= 2 h), long (> 2 h, <= 8 h). More than 8 h is outside the equation
/// and has no category.
enum class DurationCategory { short_duration, moderate_duration, long_duration };

constexpr std::string_view duration_name(DurationCategory d) {
  switch (d) {
    case DurationCategory::short_duration: return "short";
    case DurationCategory::moderate_duration: return "moderate";
    case DurationCategory::long_duration: return "long";
  }
  return "?";
}

/// Column heading of Table 5 for a category ("<= 1 h" ...).
constexpr std::string_view duration_limit_text(DurationCategory d) {
  switch (d) {
    case DurationCategory::short_duration: return "<= 1 h";
    case DurationCategory::moderate_duration: return "<= 2 h";
    case DurationCategory::long_duration: return "<= 8 h";
  }
  return "?";
}

constexpr std::optional<DurationCategory> find_duration(std::string_view name) {
  if (name == "short") return DurationCategory::short_duration;
  if (name == "moderate") return DurationCategory::moderate_duration;
  if (name == "long") return DurationCategory::long_duration;
  return std::nullopt;
}

}  // namespace rackreach
