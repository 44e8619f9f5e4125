// SPDX-License-Identifier: MIT
#include "app/cli/population_cmd.hpp"

#include <cstdio>
#include <iostream>
#include <memory>
#include <string>
#include <vector>

#include "anthropometry/data_dir.hpp"
#include "anthropometry/population_json.hpp"
#include "anthropometry/workforce.hpp"
#include "app/cli/commands.hpp"

namespace rackreach::cli {
namespace {

std::string fixed1(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f", v);
  return buf;
}

std::string pad(const std::string& s, std::size_t width, bool right) {
  if (s.size() >= width) return s;
  const std::string fill(width - s.size(), ' ');
  return right ? fill + s : s + fill;
}

void print_input_problems(const std::vector<Problem>& problems) {
  for (const Problem& p : problems) std::cerr << format_problem(p) << "\n";
}

int run_list() {
  const DataDirLookup data = find_data_dir();
  if (!data.dir) {
    std::cerr << "rackreach: " << data.failure_message() << "\n";
    return exit_invalid_input;
  }
  const std::filesystem::path& dir = *data.dir;
  const auto files = list_population_files(dir);
  std::cout << "Population tables in " << dir.string() << "\n\n";
  int code = exit_ok;
  for (const auto& file : files) {
    const LoadedPopulation loaded = load_population_file(file);
    if (!loaded.table) {
      print_input_problems(loaded.problems);
      code = exit_invalid_input;
      continue;
    }
    const PopulationTable& t = *loaded.table;
    std::cout << pad(t.name, 12, false) << t.title << "\n" << std::string(12, ' ') << "subjects:";
    if (t.subjects_female) std::cout << " " << *t.subjects_female << " women";
    if (t.subjects_male) std::cout << (t.subjects_female ? "," : "") << " " << *t.subjects_male << " men";
    std::cout << "; " << t.dimensions.size() << " dimensions; percentiles " << t.percentiles.front() << " to "
              << t.percentiles.back() << "\n\n";
  }
  std::cout << "Show one with: rackreach population show NAME [--mix women=0.5]\n";
  return code;
}

int run_show(const std::string& name, const std::string& mix_text, const std::vector<double>& percentiles) {
  std::string error;
  const std::optional<SexMix> mix = parse_sex_mix(mix_text, error);
  if (!mix) {
    std::cerr << "--mix: " << error << "\n";
    return exit_usage;
  }
  for (double p : percentiles) {
    if (!(p >= 0.0 && p <= 100.0)) {
      std::cerr << "--percentiles: each must be from 0 to 100 (one is " << p << ")\n";
      return exit_usage;
    }
  }
  const DataDirLookup data = find_data_dir();
  if (!data.dir && is_shipped_name(name)) {
    std::cerr << "rackreach: " << data.failure_message() << "\n";
    return exit_invalid_input;
  }
  const std::filesystem::path dir = data.dir.value_or(std::filesystem::path());
  // The table is shown as it is; load_workforce with the overhead preference only tells what reach checks use.
  const LoadedWorkforce loaded = load_workforce(name, *mix, dir, false);
  if (!loaded.workforce) {
    print_input_problems(loaded.problems);
    return exit_invalid_input;
  }
  const Workforce& wf = *loaded.workforce;
  const PopulationTable& t = *wf.table;
  std::cout << t.title << "\n" << t.citation << "\n" << t.survey << "\n\n";
  char mix_line[128];
  std::snprintf(mix_line, sizeof mix_line, "Workforce: %.0f%% women, %.0f%% men", mix->women * 100.0,
                (1.0 - mix->women) * 100.0);
  std::cout << mix_line << " (percentiles of the mixed distribution, not averages of the sexes' percentiles)\n";
  std::cout << "Barefoot body dimensions, no clothing or shoe allowance. Lengths in cm, body mass in kg.\n\n";

  std::vector<std::string> head = {"dimension", "unit"};
  for (double p : percentiles) {
    char buf[16];
    std::snprintf(buf, sizeof buf, "P%g", p);
    head.emplace_back(buf);
  }
  head.emplace_back("mean");
  head.emplace_back("SD");
  std::vector<std::vector<std::string>> rows;
  std::vector<std::string> problems;
  bool any_derived = false;
  for (const Dimension& d : t.dimensions) {
    std::vector<std::string> row = {d.label + (d.kind == DimensionKind::derived ? " *" : ""),
                                    std::string(canonical_unit_name(d.unit))};
    any_derived = any_derived || d.kind == DimensionKind::derived;
    for (double p : percentiles) {
      const WorkforceValue v = calc_workforce_percentile(wf, d.key, p);
      row.push_back(v.value ? fixed1(*v.value) : "-");
      if (!v.value) problems.push_back(v.problem);
    }
    const WorkforceMeanSd m = calc_workforce_mean_sd(wf, d.key);
    row.push_back(m.mean ? fixed1(*m.mean) : "-");
    row.push_back(m.sd ? fixed1(*m.sd) : "-");
    rows.push_back(std::move(row));
  }
  std::vector<std::size_t> width(head.size(), 0);
  for (std::size_t c = 0; c < head.size(); ++c) {
    width[c] = head[c].size();
    for (const auto& r : rows) width[c] = std::max(width[c], r[c].size());
  }
  auto print_row = [&](const std::vector<std::string>& r) {
    std::string line;
    for (std::size_t c = 0; c < r.size(); ++c) line += (c ? "  " : "") + pad(r[c], width[c], c >= 2);
    std::cout << line << "\n";
  };
  print_row(head);
  std::size_t total = 0;
  for (std::size_t w : width) total += w + 2;
  std::cout << std::string(total - 2, '-') << "\n";
  for (const auto& r : rows) print_row(r);
  std::cout << "\n";
  if (any_derived) {
    std::cout << "* derived: formed per subject from measured dimensions, then summarised (formulas in the data "
                 "file).\n";
  }
  const LoadedWorkforce for_reach = load_workforce(name, *mix, dir, true);
  for (const std::string& note : for_reach.notes) std::cout << "Reach checks: " << note << ".\n";
  for (const std::string& p : problems) std::cout << "Not shown: " << p << ".\n";
  std::cout << "Source: " << find_population_file(name, dir).string() << "\n";
  return exit_ok;
}

}  // namespace

void add_population_command(CLI::App& app, int& exit_code) {
  auto* cmd = app.add_subcommand("population", "The population tables: list them, or show one for a workforce mix");
  cmd->require_subcommand(1);
  auto* list = cmd->add_subcommand("list", "List the shipped population tables");
  list->callback([&exit_code] { exit_code = run_list(); });

  auto* show = cmd->add_subcommand("show", "Show the percentiles of a table for a mix of women and men");
  auto name = std::make_shared<std::string>();
  auto mix = std::make_shared<std::string>("women=0.5");
  auto percentiles = std::make_shared<std::vector<double>>(std::vector<double>{1, 5, 50, 95, 99});
  show->add_option("NAME", *name, "a shipped table (see `population list`) or the path of a table file")->required();
  show->add_option("--mix", *mix, "share of women or men, e.g. women=0.3, men=70%")->capture_default_str();
  show->add_option("--percentiles", *percentiles, "percentiles to show, e.g. 5,50,95")
      ->delimiter(',')
      ->capture_default_str();
  show->callback([&exit_code, name, mix, percentiles] { exit_code = run_show(*name, *mix, *percentiles); });
}

}  // namespace rackreach::cli
