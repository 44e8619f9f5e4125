// SPDX-License-Identifier: MIT
#pragma once
// One entry point for an assessment: the CLI and the desktop app call assess_project() on one project model.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/composite.hpp"
#include "engine/lifting/duration.hpp"
#include "engine/lifting/risk_bands.hpp"
#include "engine/lifting/rnle_1994.hpp"
#include "engine/project.hpp"
#include "engine/slotting/review.hpp"

namespace rackreach {

/// The two workers of the reach checks and the model's parameters; made by the caller from a workforce table.
struct ReachSetup {
  ReachBody small;
  ReachBody large;
  ReachParameters parameters;
  std::string workforce;  ///< e.g. "ansur2, 50% women"
};

struct AssessOptions {
  RoundingMode rounding = RoundingMode::full;
  std::optional<DurationRule> duration_rule;  ///< overrides the project's rule when set
  RiskBands bands;
  std::optional<ReachSetup> reach;  ///< needed for tasks with shelf geometry
};

struct JobAssessment {
  std::string id;
  bool duration_declared = false;  ///< category given in the file (true) or derived from the pattern
  DurationAssessment duration;
  std::vector<TaskResult> tasks;
  std::vector<std::optional<ReachResult>> reach;  ///< parallel to `tasks`: for tasks with shelf geometry
  std::optional<CompositeResult> composite;  ///< for jobs of two or more tasks
  std::vector<Warning> warnings;             ///< job-level: duration, composite flags

  /// The job's index: its CLI for a multi-task job, the task's LI otherwise.
  std::optional<double> job_index() const;
};

struct ProjectAssessment {
  UnitSystem units = UnitSystem::metric;
  RoundingMode rounding = RoundingMode::full;
  DurationRule duration_rule = DurationRule::edition_2021;
  RiskBands bands;
  std::optional<ReachSetup> reach;
  std::vector<JobAssessment> jobs;
  std::optional<StoreReview> store;  ///< when the project has slots
};

/// The slot review's options for an assessment: its rounding and bands, the duration rule, and the reach workers
/// of `options.reach` (which must outlive the result: it points into them).
ReviewOptions make_review_options(const AssessOptions& options, DurationRule rule);

JobAssessment assess_job(const LiftJob& job, UnitSystem units, DurationRule rule, RoundingMode mode,
                         const ReachSetup* reach = nullptr);
ProjectAssessment assess_project(const Project& project, const AssessOptions& options);
/// The same, the store reviewed by `reviewer` (made with make_review_options(options, the rule used)), which then
/// keeps its caches for StoreReviewer::update() after later edits of the store.
ProjectAssessment assess_project(const Project& project, const AssessOptions& options, StoreReviewer& reviewer);

}  // namespace rackreach
