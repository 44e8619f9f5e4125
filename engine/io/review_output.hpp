// SPDX-License-Identifier: MIT
#pragma once
// Output of a slot review: a text section for people, a JSON member, CSV of the findings, and an HTML page.
// Loads and limits are in the project's units, and every output names them.

#include <string>

#include "engine/io/json_writer.hpp"
#include "engine/project.hpp"
#include "engine/slotting/review.hpp"

namespace rackreach {

void write_review_json(JsonWriter& w, const Project& project, const StoreReview& review, RoundingMode mode);
std::string write_review_table(const Project& project, const StoreReview& review, RoundingMode mode);
std::string write_review_csv(const Project& project, const StoreReview& review);
std::string write_level_limits_table(const Project& project, const StoreReview& review);
/// A standalone HTML page: findings, decisions, level limits, routes, the caution.
std::string write_review_html(const Project& project, const StoreReview& review, const std::string& input_name);

}  // namespace rackreach
