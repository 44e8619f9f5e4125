// SPDX-License-Identifier: MIT
// `rackreach reslot PROJECT --out NEW [--max-moves N] [--cost-per-move C] [--group-families]
//  [--format table|json] [--costs-out COSTS.csv]`: the exact best slotting, its move list and the new project.

#include <iostream>
#include <map>

#include "app/cli/commands.hpp"
#include "engine/caution.hpp"
#include "engine/io/assessment_output.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/io/json_writer.hpp"
#include "engine/io/project_file.hpp"
#include "engine/slotting/reslot_plan.hpp"
#include "engine/version.hpp"

namespace rackreach::cli {
namespace {

std::map<std::string, int> band_counts(const StoreReview& r) {
  std::map<std::string, int> out;
  for (const SlotFinding& f : r.findings) ++out[f.truck_access ? "truck access" : std::string(band_name(f.band))];
  return out;
}

std::string fixed(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.3f", x);
  return buf;
}

}  // namespace

void add_reslot_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("reslot", "Propose the exact best slotting of the store's parts, with the move list");
  struct Args {
    std::string file, out, format = "table", costs_out;
    std::optional<std::size_t> max_moves;
    double cost_per_move = 0.0;
    bool group_families = false;
  };
  auto args = std::make_shared<Args>();
  cmd->add_option("PROJECT", args->file, "project file with racks, parts and slots")->required();
  cmd->add_option("--out", args->out, "the new project file (written atomically)")->required();
  cmd->add_option("--max-moves", args->max_moves, "at most this many parts move");
  cmd->add_option("--cost-per-move", args->cost_per_move, "added to the objective per move (cost units)")
      ->check(CLI::NonNegativeNumber);
  cmd->add_flag("--group-families", args->group_families, "keep the parts of a family within one rack");
  cmd->add_option("--format", args->format, "table or json")->check(CLI::IsMember({"table", "json"}))->capture_default_str();
  cmd->add_option("--costs-out", args->costs_out, "write every allowed (part, slot, cost) the solver used, as CSV");
  cmd->callback([args, &exit_code] {
    const std::optional<Project> project = load_or_report(args->file, exit_code);
    if (!project) return;
    if (project->store.slots.empty()) {
      std::cerr << args->file << ": slots: the file has no slots to re-slot [missing_key]\n";
      exit_code = exit_invalid_input;
      return;
    }
    AssessOptions options;
    options.reach = load_reach_or_report(args->file, *project, exit_code);
    if (!options.reach) return;
    const ReviewOptions ro = make_review_options(options, project->duration_rule);
    ReslotRequest request{args->max_moves, args->cost_per_move, args->group_families, !args->costs_out.empty()};
    const ReslotPlan plan = plan_reslot(project->store, project->units, ro, request);
    if (!plan.problems.empty()) {
      for (const std::string& p : plan.problems) std::cerr << args->file << ": " << p << "\n";
      exit_code = exit_invalid_input;
      return;
    }
    Project updated = *project;
    updated.store = plan.store;
    const StoreReview before = review_store(project->store, project->units, ro);
    const StoreReview after = review_store(updated.store, updated.units, ro);
    const auto counts_before = band_counts(before), counts_after = band_counts(after);
    std::string text;
    if (args->format == "json") {
      JsonWriter w(text);
      w.begin_object().field("rackreach_output", 1).field("engine_version", engine_version).field("input", args->file);
      w.field("objective_before", plan.objective_before).field("objective_after", plan.objective_after);
      w.field("not_allowed_before", static_cast<int>(plan.not_allowed_before));
      w.field("proven_optimal", plan.proven_optimal).field("certificate", plan.certificate);
      w.key("moves").begin_array();
      for (const PlanMove& m : plan.moves)
        w.begin_object().field("part", m.part).field("from", m.from_slot).field("to", m.to_slot).field("reason", m.reason).end_object();
      w.end_array();
      w.key("unresolved").begin_array();
      for (const PlanUnresolved& u : plan.unresolved)
        w.begin_object().field("part", u.part).field("slot", u.slot).field("reason", u.reason).end_object();
      w.end_array();
      for (auto [key, counts] : {std::pair{"bands_before", &counts_before}, std::pair{"bands_after", &counts_after}}) {
        w.key(key).begin_object();
        for (const auto& [band, n] : *counts) w.field(band, n);
        w.end_object();
      }
      w.key("routes").begin_array();
      for (std::size_t i = 0; i < before.routes.size(); ++i)
        w.begin_object().field("id", before.routes[i].id).field("vli_before", before.routes[i].vli)
            .field("vli_after", after.routes[i].vli).end_object();
      w.end_array();
      w.field("caution", caution_text).end_object();
      w.finish();
      text += "\n";
    } else {
      text = "Rackreach " + std::string(engine_version) + ": re-slotting of " + args->file + "\n";
      text += "Cost of a part in a slot: F x (LI - 1) x band weight (elevated 1, high 2, very high 3; within the limit 0); "
              "not allowed: box does not fit, hand part on a truck level or truck part on a hand level, reach failure, "
              "outside the equation. Ties prefer fewer moves.\n";
      text += "Objective (lifts/min x LI above 1, weighted): " + fixed(plan.objective_before) + " -> " +
              fixed(plan.objective_after) + "; optimum proven by " + plan.certificate +
              (plan.proven_optimal ? "" : " (NOT proven: search limit reached)") + "\n";
      text += "Slots per band, before -> after:";
      for (const char* b : {"within limit", "elevated", "high", "very high", "outside equation", "truck access"}) {
        auto get = [&](const std::map<std::string, int>& m) { auto it = m.find(b); return it == m.end() ? 0 : it->second; };
        text += std::string("  ") + b + " " + std::to_string(get(counts_before)) + " -> " + std::to_string(get(counts_after));
      }
      text += "\n";
      for (std::size_t i = 0; i < before.routes.size(); ++i) {
        auto v = [](const std::optional<double>& x) { return x ? fixed(*x) : std::string("undefined"); };
        text += "Route " + before.routes[i].id + ": VLI " + v(before.routes[i].vli) + " -> " + v(after.routes[i].vli) + "\n";
      }
      text += "\nMoves (" + std::to_string(plan.moves.size()) + "):\n";
      for (const PlanMove& m : plan.moves)
        text += "  move " + m.part + " from " + m.from_slot + " to " + m.to_slot + ": " + m.reason + "\n";
      if (!plan.unresolved.empty()) {
        text += "\nParts left where they are, with no better allowed slot (" + std::to_string(plan.unresolved.size()) + "):\n";
        for (const PlanUnresolved& u : plan.unresolved) text += "  " + u.part + " in " + u.slot + ": " + u.reason + "\n";
      }
      text += "\nNew project: " + args->out + "\nCaution: " + caution_text + "\n";
    }
    if (auto err = write_file_atomically(args->out, save_project_text(updated))) {
      std::cerr << args->out << ": " << *err << "\n";
      exit_code = exit_invalid_input;
      return;
    }
    if (!args->costs_out.empty()) {
      std::string csv = "part,slot,cost\n";
      for (const PlanCost& c : plan.costs) csv += csv_cell(c.part) + "," + csv_cell(c.slot) + "," + fixed(c.cost) + "\n";
      if (auto err = write_file_atomically(args->costs_out, csv)) {
        std::cerr << args->costs_out << ": " << *err << "\n";
        exit_code = exit_invalid_input;
        return;
      }
    }
    std::cout << text;
  });
}

}  // namespace rackreach::cli
