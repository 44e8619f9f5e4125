// SPDX-License-Identifier: MIT
// `rackreach import PROJECT --parts PARTS.csv --slots SLOTS.csv --out NEW [--units metric|us]
//  [--ignore-unknown-columns]`: a part master and a slot list as a warehouse system exports them, into a project.

#include <iostream>

#include "app/cli/commands.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/io/csv_import.hpp"
#include "engine/io/project_file.hpp"

namespace rackreach::cli {

void add_import_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand(
      "import", "Replace a project's parts and slots with a part master and a slot list in CSV (header row, columns "
                "by name, units from the header or --units); the new project is checked before it is written");
  struct Args {
    std::string project, parts, slots, out, units;
    bool ignore_unknown = false;
  };
  auto args = std::make_shared<Args>();
  cmd->add_option("PROJECT", args->project, "the project to import into (*.rackreach.json)")->required();
  cmd->add_option("--parts", args->parts, "part master CSV")->required();
  cmd->add_option("--slots", args->slots, "slot list CSV")->required();
  cmd->add_option("--out", args->out, "the new project file (written atomically)")->required();
  cmd->add_option("--units", args->units, "units of columns whose header names none: metric or us")
      ->check(CLI::IsMember({"metric", "us"}));
  cmd->add_flag("--ignore-unknown-columns", args->ignore_unknown, "skip columns that map to no field (listed)");
  cmd->callback([args, &exit_code] {
    const std::optional<Project> project = load_or_report(args->project, exit_code);
    if (!project) return;
    CsvOptions options;
    if (!args->units.empty()) options.units = args->units == "us" ? UnitSystem::us : UnitSystem::metric;
    options.ignore_unknown_columns = args->ignore_unknown;
    const CsvImport imported = import_store_csv(args->parts, args->slots, project->units, options);
    for (const Problem& w : imported.warnings) std::cerr << format_problem(w) << "\n";
    if (!imported.ok()) {
      for (const Problem& p : imported.problems) std::cerr << format_problem(p) << "\n";
      std::cerr << imported.problems.size() << (imported.problems.size() == 1 ? " problem" : " problems")
                << "; nothing was written\n";
      exit_code = exit_invalid_input;
      return;
    }
    Project updated = *project;
    updated.store.parts = imported.parts;
    updated.store.slots = imported.slots;
    // The new project must load as it is: the racks, levels and routes must fit the imported slots.
    const std::string text = save_project_text(updated);
    const LoadResult check = load_project_text(text);
    if (!check.project) {
      print_problems(args->out + " (as it would be written)", check.problems, "nothing was written");
      exit_code = exit_invalid_input;
      return;
    }
    if (auto err = write_file_atomically(args->out, text)) {
      std::cerr << args->out << ": " << *err << "\n";
      exit_code = exit_invalid_input;
      return;
    }
    std::cout << args->out << ": " << imported.parts.size() << " parts and " << imported.slots.size()
              << " slots imported from " << args->parts << " and " << args->slots << "\n";
  });
}

}  // namespace rackreach::cli

namespace rackreach::cli {

void add_export_csv_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("export-csv", "Write a project's parts and slots as CSV (unit-suffixed headers), "
                                               "the form `rackreach import` reads");
  struct Args {
    std::string project, parts, slots;
  };
  auto args = std::make_shared<Args>();
  cmd->add_option("PROJECT", args->project, "project file")->required();
  cmd->add_option("--parts", args->parts, "part master CSV to write")->required();
  cmd->add_option("--slots", args->slots, "slot list CSV to write")->required();
  cmd->callback([args, &exit_code] {
    const std::optional<Project> project = load_or_report(args->project, exit_code);
    if (!project) return;
    for (auto [file, text] : {std::pair{args->parts, write_parts_csv(project->store.parts, project->units)},
                              std::pair{args->slots, write_slots_csv(project->store.slots, project->units)}})
      if (auto err = write_file_atomically(file, text)) {
        std::cerr << file << ": " << *err << "\n";
        exit_code = exit_invalid_input;
        return;
      }
    std::cout << args->parts << ", " << args->slots << ": " << project->store.parts.size() << " parts and "
              << project->store.slots.size() << " slots written\n";
  });
}

}  // namespace rackreach::cli
