// SPDX-License-Identifier: MIT
#pragma once
// Readers of the pieces that stand in more than one place of a project file: a work pattern (a job's
// `work_pattern`, a zone's `lifting_pattern`) and the limits of application (a task's or a zone's `limits`).
// One set of rules for each, wherever it stands.

#include <nlohmann/json.hpp>
#include <optional>
#include <vector>

#include "engine/io/json_reader.hpp"
#include "engine/lifting/duration.hpp"
#include "engine/lifting/limits_of_application.hpp"

namespace rackreach {

/// Lifting and recovery periods in order; empty (with problems reported) if the array itself is wrong.
std::optional<std::vector<WorkPeriod>> read_work_pattern(JsonReader& r, const nlohmann::json& j, const JsonPath& path);

/// The limits of application of a task or a zone; fields not given stay empty.
LimitsOfApplication read_limits(JsonReader& r, const nlohmann::json& j, const JsonPath& path);

}  // namespace rackreach
