// SPDX-License-Identifier: MIT
#pragma once
// Checking a lift task typed into the form. The fields are turned into the JSON of a one-job project and given
// to load_project_text(), so the form obeys exactly the project file's rules (one set of rules); a task that
// loads is assessed with assess_job(), the CLI's own call.

#include <map>
#include <optional>
#include <string>
#include <vector>

#include "engine/assess.hpp"
#include "engine/project.hpp"

namespace rackreach::gui {

/// The form's fields as typed (numbers as text, so that what is wrong with them can be named).
struct TaskFields {
  std::string job_id = "J1";
  std::string task_id = "T1";
  std::string load, max_load, frequency;
  std::string duration = "short";  ///< short, moderate, long, or "pattern": the job's work pattern
  std::vector<WorkPeriod> work_pattern;
  std::string coupling = "good";
  std::string origin_h, origin_v, origin_a, destination_h, destination_v, destination_a;
  bool control_at_destination = false;
  // Limits of application: unset checkboxes and empty fields stay out of the task.
  bool one_handed = false, seated_or_kneeling = false, restricted_space = false, unstable_load = false,
       wheelbarrow_or_shovel = false, high_speed = false;
  std::string carry_push_share, floor_friction, temperature_c, humidity_pct;
};

/// The field keys the problems are reported against (as the project file names them below the task).
inline constexpr const char* task_field_keys[] = {
    "id", "load", "max_load", "frequency", "duration", "coupling", "origin.h", "origin.v", "origin.a",
    "destination.h", "destination.v", "destination.a", "limits.carry_push_share", "limits.floor_friction",
    "limits.temperature_c", "limits.humidity_pct"};

struct TaskCheck {
  std::map<std::string, std::string> field_problems;  ///< field key -> what is wrong, in plain words
  std::vector<std::string> other_problems;            ///< problems not tied to one field
  std::optional<LiftJob> job;                         ///< the job as loaded, when there are no problems
  std::optional<JobAssessment> result;                ///< its assessment (full precision)

  bool ok() const { return job.has_value(); }
};

/// The JSON text of a one-job project holding the form's task.
std::string make_task_project_json(const TaskFields& fields, UnitSystem units, DurationRule rule);
TaskCheck check_task(const TaskFields& fields, UnitSystem units, DurationRule rule);
/// The fields of task `task` of `job`, as the form shows them.
TaskFields make_task_fields(const LiftJob& job, std::size_t task);

}  // namespace rackreach::gui
