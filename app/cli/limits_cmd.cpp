// SPDX-License-Identifier: MIT
// `rackreach limits FILE [--format table|json] [--out PATH]`: the heaviest hand-pick load per level, depth position
// and frequency (the RWL of that geometry for the project's reference box): the table for the rack end.

#include <iostream>

#include "app/cli/commands.hpp"
#include "engine/assess.hpp"
#include "engine/caution.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/io/json_writer.hpp"
#include "engine/io/project_file.hpp"
#include "engine/io/review_output.hpp"
#include "engine/version.hpp"

namespace rackreach::cli {

void add_limits_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("limits", "Heaviest acceptable hand-pick load per level, position and frequency");
  struct Args {
    std::string file, format = "table", out;
  };
  auto args = std::make_shared<Args>();
  cmd->add_option("FILE", args->file, "project file with racks (*.rackreach.json)")->required();
  cmd->add_option("--format", args->format, "table or json")->check(CLI::IsMember({"table", "json"}))->capture_default_str();
  cmd->add_option("--out", args->out, "write to this file (atomically) instead of standard output");
  cmd->callback([args, &exit_code] {
    const std::optional<Project> project = load_or_report(args->file, exit_code);
    if (!project) return;
    if (project->store.racks.empty()) {
      std::cerr << args->file << ": racks: the file has no racks, so there are no level limits [missing_key]\n";
      exit_code = exit_invalid_input;
      return;
    }
    // Level limits need no slots; review a copy of the store with its slots as they are (possibly none).
    ReviewOptions ro;
    ro.duration_rule = project->duration_rule;
    const StoreReview review = review_store(project->store, project->units, ro);
    std::string text;
    if (args->format == "json") {
      JsonWriter w(text);
      w.begin_object().field("rackreach_output", 1).field("engine_version", engine_version);
      w.field("input", args->file).field("mass_unit", mass_unit(project->units));
      w.field("length_unit", length_unit(project->units)).field("caution", caution_text);
      w.key("store");
      write_review_json(w, *project, review, ro.rounding);
      w.end_object();
      w.finish();
      text += "\n";
    } else {
      text = "Rackreach " + std::string(engine_version) + ": level limits of " + args->file + "\n" +
             write_level_limits_table(*project, review) + "\nCaution: " + caution_text + "\n";
    }
    if (args->out.empty()) std::cout << text;
    else if (auto err = write_file_atomically(args->out, text)) {
      std::cerr << args->out << ": " << *err << "\n";
      exit_code = exit_invalid_input;
    }
  });
}

}  // namespace rackreach::cli
