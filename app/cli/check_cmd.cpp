// SPDX-License-Identifier: MIT
// `rackreach check FILE`: validate only, every problem at once.

#include <iostream>

#include "anthropometry/reach_setup.hpp"
#include "app/cli/commands.hpp"
#include "engine/io/project_file.hpp"

namespace rackreach::cli {

void print_problems(const std::string& file, const std::vector<Problem>& problems, const char* outcome) {
  for (const Problem& p : problems) std::cerr << format_problem(file, p) << "\n";
  std::cerr << file << ": " << problems.size() << (problems.size() == 1 ? " problem" : " problems") << "; " << outcome
            << "\n";
}

std::optional<Project> load_or_report(const std::string& file, int& exit_code) {
  LoadResult r = load_project_file(file);
  if (!r.project) {
    print_problems(file, r.problems);
    exit_code = exit_invalid_input;
  }
  return std::move(r.project);
}

std::optional<ReachSetup> load_reach_or_report(const std::string& file, const Project& project, int& exit_code) {
  LoadedReachSetup reach = load_reach_setup(project);
  if (!reach.setup) {
    print_problems(file, reach.problems);
    exit_code = exit_invalid_input;
  }
  return std::move(reach.setup);
}

void add_check_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("check", "Validate a project file: every problem with file, field path, value and rule");
  auto file = std::make_shared<std::string>();
  cmd->add_option("FILE", *file, "project file (*.rackreach.json)")->required();
  cmd->callback([file, &exit_code] {
    const LoadResult r = load_project_file(*file);
    if (!r.project) {
      print_problems(*file, r.problems);
      exit_code = exit_invalid_input;
      return;
    }
    std::size_t tasks = 0;
    for (const auto& j : r.project->jobs) tasks += j.tasks.size();
    std::cout << *file << ": valid (format version " << r.project->format_version << ", "
              << unit_system_name(r.project->units) << " units, " << r.project->jobs.size() << " jobs, " << tasks
              << " tasks)\n";
  });
}

}  // namespace rackreach::cli
