// SPDX-License-Identifier: MIT
#pragma once
// `rackreach population list` and `rackreach population show NAME [--mix women=0.3]`: the shipped population
// tables, and the percentiles of a workforce mixed from one of them (or from a user's table file).

#include <CLI/CLI.hpp>

namespace rackreach::cli {

void add_population_command(CLI::App& app, int& exit_code);

}  // namespace rackreach::cli
