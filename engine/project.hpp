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
#include "engine/reach/sagittal_reach.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach {

/// Where a task's F came from when it was given as a sample (Applications Manual 1.3.5.5).
struct FrequencySample {
  double lifts_per_min = 0.0;
  double lifting_min = 0.0;
  double sample_min = frequency_sample_min;
};

/// Where the origin of a task sits on a shelf, for the reach check (lengths in the project's units). The grip
/// height is the origin's V.
struct ShelfGeometry {
  double grip_depth = 0.0;                    ///< behind the rack face
  std::optional<double> beam_underside;       ///< floor to the underside of the beam or shelf above the grip
  std::optional<double> overhead_structure;   ///< floor to the lowest structure over where the picker stands
};

/// What a task carries beside the lift itself.
struct TaskDetails {
  std::optional<FrequencySample> frequency_sample;
  std::optional<ShelfGeometry> shelf;
};

/// The workforce the reach checks are made for: a population table mixed by sex.
struct WorkforceSpec {
  std::string population = "ansur2";   ///< a shipped table name or a file path
  double women_share = 0.5;            ///< 0..1; default 50/50 (our assumption where the make-up is not given)
  double small_percentile = 5.0;       ///< reach is checked for this worker
  double large_percentile = 95.0;      ///< clearance is checked for this one
};

/// A job: tasks done by one worker over one duration. The duration is declared as a category or derived
/// from a pattern of lifting and recovery periods.
struct LiftJob {
  std::string id;
  std::optional<std::string> name;
  std::optional<DurationCategory> declared_duration;
  std::vector<WorkPeriod> work_pattern;  ///< used when no category is declared
  std::vector<LiftTask> tasks;
  std::vector<TaskDetails> details;  ///< one per task, parallel to `tasks`
};

struct ProjectInfo {
  std::optional<std::string> site;
  std::optional<std::string> assessor;
  std::optional<std::string> date;
  std::optional<std::string> title;
  std::optional<std::string> revision;  ///< the assessment's revision, as the site numbers them (e.g. "B")
};

struct Project {
  int format_version = 1;
  UnitSystem units = UnitSystem::metric;
  ProjectInfo info;
  DurationRule duration_rule = DurationRule::edition_2021;
  WorkforceSpec workforce;
  bool workforce_given = false;          ///< false: the defaults above are used (and shown)
  ReachParameters reach_parameters;      ///< in cm; defaults unless the file overrides them
  std::vector<std::string> reach_parameters_set;  ///< names of the parameters the file overrides
  std::vector<LiftJob> jobs;
  Store store;  ///< racks, parts, slots and routes; empty for a file of explicit lift jobs only

  bool has_shelf_geometry() const {
    if (!store.slots.empty()) return true;
    for (const LiftJob& j : jobs)
      for (const TaskDetails& d : j.details)
        if (d.shelf) return true;
    return false;
  }
};

}  // namespace rackreach
