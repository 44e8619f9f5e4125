// SPDX-License-Identifier: MIT
// rackreach: lift-risk and reach screening of warehouse rack slotting, from the command line.

#include <CLI/CLI.hpp>
#include <iostream>

#include "app/cli/commands.hpp"
#include "app/cli/population_cmd.hpp"
#include "app/about/about.hpp"

int main(int argc, char** argv) {
  CLI::App app{"Rackreach: screens the lifts and reaches of rack slots and lift jobs with the Revised NIOSH Lifting "
               "Equation. Results support, and do not replace, a qualified ergonomics professional."};
  app.name("rackreach");
  app.set_version_flag("--version", [] { return rackreach::make_version_text("rackreach"); },
                       "Print the version and build information (commit, compiler, build type, Qt, data folder) "
                       "and exit");
  app.require_subcommand(1);
  int exit_code = rackreach::cli::exit_ok;
  rackreach::cli::add_assess_command(app, exit_code);
  rackreach::cli::add_check_command(app, exit_code);
  rackreach::cli::add_template_command(app, exit_code);
  rackreach::cli::add_limits_command(app, exit_code);
  rackreach::cli::add_import_command(app, exit_code);
  rackreach::cli::add_export_csv_command(app, exit_code);
  rackreach::cli::add_reslot_command(app, exit_code);
  rackreach::cli::add_report_command(app, exit_code);
  rackreach::cli::add_population_command(app, exit_code);
  try {
    app.parse(argc, argv);
  } catch (const CLI::Success& e) {
    return app.exit(e);
  } catch (const CLI::ParseError& e) {
    app.exit(e);
    return rackreach::cli::exit_usage;
  }
  return exit_code;
}
