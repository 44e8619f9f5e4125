// SPDX-License-Identifier: MIT
// `rackreach assess FILE [--format table|json|csv] [--rounding full|worksheet] [--fail-above LI] [--out PATH]`

#include <iostream>

#include "app/cli/commands.hpp"
#include "engine/assess.hpp"
#include "engine/io/assessment_output.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/io/project_file.hpp"
#include "engine/io/review_output.hpp"

namespace rackreach::cli {
namespace {

struct AssessArgs {
  std::string file;
  std::string format = "table";
  std::string rounding = "full";
  std::string duration_rule;
  std::optional<double> fail_above;
  std::string out;
};

/// The largest index of the assessment (task LIs and job CLIs), and whether any is undefined.
bool exceeds(const ProjectAssessment& a, double threshold, std::string& worst) {
  bool over = false;
  for (const JobAssessment& j : a.jobs) {
    for (const TaskResult& t : j.tasks)
      if (!t.li || *t.li > threshold) {
        over = true;
        if (worst.empty()) worst = "job " + j.id + ", task " + t.id + (t.li ? "" : " (outside the equation)");
      }
    if (j.composite && (!j.composite->cli || *j.composite->cli > threshold)) {
      over = true;
      if (worst.empty()) worst = "job " + j.id + " (CLI)";
    }
  }
  if (a.store) {
    for (const SlotFinding& f : a.store->findings)  // ranked: the first one over is the worst
      if (!f.result.li || *f.result.li > threshold) {
        over = true;
        if (worst.empty()) worst = "slot " + f.slot_id + (f.result.li ? "" : " (outside the equation)");
      }
    for (const RouteResult& r : a.store->routes)
      if (!r.vli || *r.vli > threshold) {
        over = true;
        if (worst.empty()) worst = "route " + r.id;
      }
  }
  return over;
}

}  // namespace

void add_assess_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("assess", "Review the slots and assess the lift jobs of a project file");
  auto args = std::make_shared<AssessArgs>();
  cmd->add_option("FILE", args->file, "project file (*.rackreach.json)")->required();
  cmd->add_option("--format", args->format,
                  "table (for people), json, csv (the slot findings, or the lift tasks of a file without slots) or html")
      ->check(CLI::IsMember({"table", "json", "csv", "html"}))
      ->capture_default_str();
  cmd->add_option("--rounding", args->rounding,
                  "full precision, or worksheet: multipliers to 2 decimals, weights and indices to 1")
      ->check(CLI::IsMember({"full", "worksheet"}))
      ->capture_default_str();
  cmd->add_option("--duration-rule", args->duration_rule,
                  "recovery rule for the short duration: 2021 (1.0 x work time, default) or 1994 (1.2 x); "
                  "overrides the file")
      ->check(CLI::IsMember({"2021", "1994"}));
  cmd->add_option("--fail-above", args->fail_above,
                  "exit with code 3 if any LI or CLI is above this value, or undefined (outside the equation)")
      ->check(CLI::PositiveNumber);
  cmd->add_option("--out", args->out, "write to this file (atomically) instead of standard output");
  cmd->callback([args, &exit_code] {
    const std::optional<Project> project = load_or_report(args->file, exit_code);
    if (!project) return;
    AssessOptions options;
    if (project->has_shelf_geometry()) {
      options.reach = load_reach_or_report(args->file, *project, exit_code);
      if (!options.reach) return;
    }
    options.rounding = args->rounding == "worksheet" ? RoundingMode::worksheet : RoundingMode::full;
    if (!args->duration_rule.empty()) options.duration_rule = find_duration_rule(args->duration_rule);
    const ProjectAssessment a = assess_project(*project, options);
    const OutputHeader header{args->file};
    std::string text;
    if (args->format == "json") text = write_assessment_json(*project, a, header);
    else if (args->format == "csv" && a.store) text = write_review_csv(*project, *a.store);
    else if (args->format == "csv") text = write_assessment_csv(*project, a, header);
    else if (args->format == "html") text = write_assessment_html(*project, a, header);
    else text = write_assessment_table(*project, a, header);
    if (args->out.empty()) {
      std::cout << text;
    } else if (auto err = write_file_atomically(args->out, text)) {
      std::cerr << args->out << ": " << *err << "\n";
      exit_code = exit_invalid_input;
      return;
    }
    std::string worst;
    if (args->fail_above && exceeds(a, *args->fail_above, worst)) {
      std::cerr << args->file << ": an index is above --fail-above " << *args->fail_above << " (first: " << worst
                << ")\n";
      exit_code = exit_fail_above;
    }
  });
}

}  // namespace rackreach::cli
