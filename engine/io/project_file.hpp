// SPDX-License-Identifier: MIT
#pragma once
// The project file `*.rackreach.json`, format version 1: loading and validation in one place.
// Every problem is returned at once, each with its JSON path, value and rule; unknown keys are errors.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/problem.hpp"
#include "engine/project.hpp"

namespace rackreach {

/// The only format version this build reads and writes.
inline constexpr int project_format_version = 1;

struct LoadResult {
  std::optional<Project> project;  ///< set only when there are no problems
  std::vector<Problem> problems;
};

/// Parses and validates a project from JSON text.
LoadResult load_project_text(std::string_view text);
/// Reads a file and loads it; an unreadable file is a `file_error` problem.
LoadResult load_project_file(const std::string& path);

/// The project as a project file (format version 1): the inverse of load_project_text. Values the file left to
/// their defaults stay out, so they keep their defaults when it is read again.
std::string save_project_text(const Project& project);

/// A starter project in the given units: one job of two tasks, every field shown.
std::string make_template(UnitSystem units);

}  // namespace rackreach
