// SPDX-License-Identifier: MIT
#include "engine/assess.hpp"

namespace rackreach {

std::optional<double> JobAssessment::job_index() const {
  if (composite) return composite->cli;
  if (tasks.size() == 1) return tasks.front().li;
  return std::nullopt;
}

JobAssessment assess_job(const LiftJob& job, UnitSystem units, DurationRule rule, RoundingMode mode) {
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
  for (const LiftTask& task : job.tasks) out.tasks.push_back(evaluate_task(task, out.duration.category, units, mode));
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

ProjectAssessment assess_project(const Project& project, const AssessOptions& options) {
  ProjectAssessment out;
  out.units = project.units;
  out.rounding = options.rounding;
  out.duration_rule = options.duration_rule.value_or(project.duration_rule);
  out.bands = options.bands;
  out.jobs.reserve(project.jobs.size());
  for (const LiftJob& job : project.jobs) out.jobs.push_back(assess_job(job, project.units, out.duration_rule, options.rounding));
  return out;
}

}  // namespace rackreach
