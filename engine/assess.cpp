// SPDX-License-Identifier: MIT
#include "engine/assess.hpp"

#include <cmath>

namespace rackreach {

std::optional<double> JobAssessment::job_index() const {
  if (composite) return composite->cli;
  if (tasks.size() == 1) return tasks.front().li;
  return std::nullopt;
}

namespace {

/// The reach check of a task whose origin sits on a shelf: the grip point is (origin V, grip depth), in cm.
std::optional<ReachResult> assess_reach(const LiftTask& task, const ShelfGeometry& shelf, UnitSystem units,
                                        const ReachSetup& setup, std::vector<Warning>& warnings) {
  auto cm = [units](double x) { return Length{x, units}.in_cm(); };
  ReachQuery q;
  q.grip_height_cm = cm(task.origin.v);
  q.grip_depth_cm = cm(shelf.grip_depth);
  if (shelf.beam_underside) q.structure_above_grip_cm = cm(*shelf.beam_underside);
  if (shelf.overhead_structure) q.structure_above_picker_cm = cm(*shelf.overhead_structure);
  const auto problems = validate_reach_inputs(setup.small, setup.large, q, setup.parameters);
  if (!problems.empty()) {
    for (const ReachInputProblem& p : problems)
      warnings.push_back({WarningKind::reach_input, LiftEnd::origin, p.value, 0.0,
                          "reach not checked: " + p.field + " " + p.rule});
    return std::nullopt;
  }
  ReachResult r = calc_reach(setup.small, setup.large, q, setup.parameters);
  for (const ReachCheck& c : r.checks)
    if (!c.passed && !c.advisory) warnings.push_back({WarningKind::reach_limit, LiftEnd::origin, c.margin_cm, 0.0, c.message});
  // The task's H is an input of its own; say so when it is not what standing distance and grip depth give.
  const double implied_h = Length{r.h_cm, UnitSystem::metric}.in_units(units);
  if (std::abs(implied_h - task.origin.h) > Length{1.0, UnitSystem::metric}.in_units(units))
    warnings.push_back({WarningKind::reach_h_differs, LiftEnd::origin, task.origin.h, implied_h, {}});
  return r;
}

}  // namespace

JobAssessment assess_job(const LiftJob& job, UnitSystem units, DurationRule rule, RoundingMode mode,
                         const ReachSetup* reach) {
  JobAssessment out;
  out.id = job.id;
  if (job.declared_duration) {
    out.duration_declared = true;
    out.duration.category = job.declared_duration;
    out.duration.rule = rule;
    out.duration.explanation = "declared in the project file";
  } else {
    out.duration = calc_duration(job.work_pattern, rule);
  }
  if (!out.duration.category)
    out.warnings.push_back({WarningKind::duration_over_8h, LiftEnd::origin, 0.0, long_limit_hours,
                            "job \"" + job.id + "\": " + out.duration.explanation});
  out.tasks.reserve(job.tasks.size());
  out.reach.resize(job.tasks.size());
  for (std::size_t i = 0; i < job.tasks.size(); ++i) {
    out.tasks.push_back(evaluate_task(job.tasks[i], out.duration.category, units, mode));
    const std::optional<ShelfGeometry>& shelf = i < job.details.size() ? job.details[i].shelf : std::nullopt;
    if (shelf && reach) out.reach[i] = assess_reach(job.tasks[i], *shelf, units, *reach, out.tasks[i].warnings);
  }
  if (job.tasks.size() >= 2) {
    std::vector<CompositeItem> items;
    items.reserve(job.tasks.size());
    for (std::size_t i = 0; i < job.tasks.size(); ++i)
      items.push_back(make_composite_item(job.tasks[i], out.tasks[i], units));
    out.composite = calc_composite_li(items, out.duration.category, mode);
    for (const CompositeTerm& t : out.composite->terms) {
      // Flags of the Applications Manual 2.4: any FILI > 1 (strength demand), any STLI > 1 (overall demand).
      for (auto [kind, value] : {std::pair{WarningKind::fili_above_1, t.fili}, std::pair{WarningKind::stli_above_1, t.stli}})
        if (value && *value > 1.0) {
          Warning w{kind, LiftEnd::origin, *value, 1.0, {}};
          w.note = "task \"" + t.id + "\": " + describe_warning(w, units);
          out.warnings.push_back(std::move(w));
        }
    }
    if (out.composite->undefined_reason)
      out.warnings.push_back({WarningKind::cli_undefined, LiftEnd::origin, 0.0, 0.0,
                              "job \"" + job.id + "\": CLI undefined: " + *out.composite->undefined_reason});
  }
  return out;
}

ReviewOptions make_review_options(const AssessOptions& options, DurationRule rule) {
  ReviewOptions ro;
  ro.rounding = options.rounding;
  ro.duration_rule = rule;
  ro.bands = options.bands;
  if (options.reach) {
    ro.small = &options.reach->small;
    ro.large = &options.reach->large;
    ro.reach_parameters = options.reach->parameters;
  }
  return ro;
}

namespace {

ProjectAssessment assess(const Project& project, const AssessOptions& options, StoreReviewer* reviewer) {
  ProjectAssessment out;
  out.units = project.units;
  out.rounding = options.rounding;
  out.duration_rule = options.duration_rule.value_or(project.duration_rule);
  out.bands = options.bands;
  out.reach = options.reach;
  out.jobs.reserve(project.jobs.size());
  for (const LiftJob& job : project.jobs)
    out.jobs.push_back(assess_job(job, project.units, out.duration_rule, options.rounding,
                                  options.reach ? &*options.reach : nullptr));
  if (!project.store.slots.empty()) {
    out.store = reviewer ? reviewer->review(project.store)
                         : review_store(project.store, project.units, make_review_options(options, out.duration_rule));
  }
  return out;
}

}  // namespace

ProjectAssessment assess_project(const Project& project, const AssessOptions& options) {
  return assess(project, options, nullptr);
}

ProjectAssessment assess_project(const Project& project, const AssessOptions& options, StoreReviewer& reviewer) {
  return assess(project, options, &reviewer);
}

}  // namespace rackreach
