// SPDX-License-Identifier: MIT
// `rackreach template [--units metric|us]`: a starter project file on standard output.

#include <iostream>

#include "app/cli/commands.hpp"
#include "engine/io/project_file.hpp"

namespace rackreach::cli {

void add_template_command(CLI::App& app, int& /*exit_code*/) {
  auto* cmd = app.add_subcommand("template", "Print a starter project file (every field shown) to standard output");
  auto units = std::make_shared<std::string>("metric");
  cmd->add_option("--units", *units, "metric (cm, kg) or us (in, lb)")
      ->check(CLI::IsMember({"metric", "us"}))
      ->capture_default_str();
  cmd->callback([units] { std::cout << make_template(*units == "us" ? UnitSystem::us : UnitSystem::metric); });
}

}  // namespace rackreach::cli
