// SPDX-License-Identifier: MIT
#pragma once
// The project model: what a project file holds once loaded and validated. The CLI and the desktop app both
// fill this model and call assess_project(). Every length and mass is in the project's unit system.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/duration.hpp"
#include "engine/lifting/rnle_1994.hpp"
#include "engine/quantities.hpp"

namespace rackreach {

/// Where a task's F came from when it was given as a sample (Applications Manual 1.3.5.5).
struct FrequencySample {
  double lifts_per_min = 0.0;
  double lifting_min = 0.0;
  double sample_min = frequency_sample_min;
};

/// A job: tasks done by one worker over one duration. The duration is declared as a category or derived
/// from a pattern of lifting and recovery periods.
struct LiftJob {
  std::string id;
  std::optional<std::string> name;
  std::optional<DurationCategory> declared_duration;
  std::vector<WorkPeriod> work_pattern;  ///< used when no category is declared
  std::vector<LiftTask> tasks;
  std::vector<std::optional<FrequencySample>> frequency_samples;  ///< one per task, parallel to `tasks`
};

struct ProjectInfo {
  std::optional<std::string> site;
  std::optional<std::string> assessor;
  std::optional<std::string> date;
  std::optional<std::string> title;
};

struct Project {
  int format_version = 1;
  UnitSystem units = UnitSystem::metric;
  ProjectInfo info;
  DurationRule duration_rule = DurationRule::edition_2021;
  std::vector<LiftJob> jobs;
};

}  // namespace rackreach
