// SPDX-License-Identifier: MIT
#pragma once
// The subcommands of `rackreach`, one file each. Each adds itself to the app and sets `exit_code` when run.

#include <CLI/CLI.hpp>
#include <optional>
#include <string>
#include <vector>

#include "engine/problem.hpp"
#include "engine/assess.hpp"
#include "engine/project.hpp"

namespace rackreach::cli {

/// Exit codes of PRODUCT.md: 0 done; 1 invalid input; 2 usage; 3 --fail-above exceeded.
enum ExitCode : int { exit_ok = 0, exit_invalid_input = 1, exit_usage = 2, exit_fail_above = 3 };

void add_assess_command(CLI::App& app, int& exit_code);
void add_check_command(CLI::App& app, int& exit_code);
void add_template_command(CLI::App& app, int& exit_code);
void add_limits_command(CLI::App& app, int& exit_code);
void add_import_command(CLI::App& app, int& exit_code);
void add_export_csv_command(CLI::App& app, int& exit_code);
void add_reslot_command(CLI::App& app, int& exit_code);
void add_report_command(CLI::App& app, int& exit_code);

/// Loads a project file; on problems prints them, sets exit code 1 and returns nothing.
std::optional<Project> load_or_report(const std::string& file, int& exit_code);

/// Loads the reach workers of a project's workforce; on problems prints them, sets exit code 1, returns nothing.
std::optional<ReachSetup> load_reach_or_report(const std::string& file, const Project& project, int& exit_code);

/// Prints every problem to stderr, one per line, naming the file.
void print_problems(const std::string& file, const std::vector<Problem>& problems,
                    const char* outcome = "nothing was assessed");

}  // namespace rackreach::cli
