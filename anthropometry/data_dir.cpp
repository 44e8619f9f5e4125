// SPDX-License-Identifier: MIT
#include "anthropometry/data_dir.hpp"

#include <algorithm>
#include <cstdlib>

namespace rackreach {

std::vector<DataDirCandidate> list_data_dir_candidates(const char* env_value, const std::filesystem::path& executable,
                                                       const std::filesystem::path& build_tree_dir) {
  if (env_value != nullptr && *env_value != '\0') return {{env_value, "RACKREACH_DATA_DIR"}};
  std::vector<DataDirCandidate> out;
  if (!executable.empty())
    out.push_back({(executable.parent_path() / RACKREACH_INSTALLED_DATA_FROM_BINDIR).lexically_normal(),
                   "installed, relative to the program " + executable.string()});
  if (!build_tree_dir.empty()) out.push_back({build_tree_dir, "build tree"});
  return out;
}

DataDirLookup resolve_data_dir(const char* env_value, const std::filesystem::path& executable,
                               const std::filesystem::path& build_tree_dir) {
  DataDirLookup out;
  out.tried = list_data_dir_candidates(env_value, executable, build_tree_dir);
  for (const DataDirCandidate& c : out.tried) {
    if (!list_population_files(c.dir).empty()) {
      out.dir = c.dir;
      out.reason = c.reason;
      break;
    }
  }
  return out;
}

std::string DataDirLookup::failure_message() const {
  std::string out = "no population tables (*.json) found; looked in: ";
  for (std::size_t i = 0; i < tried.size(); ++i)
    out += (i ? "; " : "") + tried[i].dir.string() + " (" + tried[i].reason + ")";
  if (tried.empty()) out += "nowhere (the program's own path is unknown)";
  return out + ". Set RACKREACH_DATA_DIR to the folder that holds them (installed: share/rackreach/population)";
}

std::filesystem::path find_executable_path() {
  std::error_code ec;
  std::filesystem::path exe = std::filesystem::read_symlink("/proc/self/exe", ec);
  return ec ? std::filesystem::path() : exe;
}

DataDirLookup find_data_dir() {
  return resolve_data_dir(std::getenv("RACKREACH_DATA_DIR"), find_executable_path(), RACKREACH_ANTHROPOMETRY_DATA_DIR);
}

std::vector<std::filesystem::path> list_population_files(const std::filesystem::path& dir) {
  std::vector<std::filesystem::path> out;
  std::error_code ec;
  for (const auto& entry : std::filesystem::directory_iterator(dir, ec)) {
    if (entry.is_regular_file() && entry.path().extension() == ".json") out.push_back(entry.path());
  }
  std::sort(out.begin(), out.end());
  return out;
}

bool is_shipped_name(std::string_view name_or_path) {
  return name_or_path.find('/') == std::string_view::npos && !name_or_path.ends_with(".json");
}

std::filesystem::path find_population_file(std::string_view name_or_path, const std::filesystem::path& dir) {
  const std::string s(name_or_path);
  return is_shipped_name(s) ? dir / (s + ".json") : std::filesystem::path(s);
}

LoadedWorkforce load_workforce(std::string_view name_or_path, SexMix mix, const std::filesystem::path& dir,
                               bool prefer_measured_overhead_reach) {
  LoadedWorkforce out;
  const std::filesystem::path file = find_population_file(name_or_path, dir);
  LoadedPopulation main = load_population_file(file);
  if (!main.table) {
    if (is_shipped_name(name_or_path) && !std::filesystem::exists(file)) {
      out.problems.push_back({"file_error", "", "",
                              "is not a shipped population table (see `rackreach population list`) nor a file", "",
                              std::string(name_or_path)});
    } else {
      out.problems = std::move(main.problems);
    }
    return out;
  }
  Workforce wf;
  wf.table = std::make_shared<const PopulationTable>(std::move(*main.table));
  wf.mix = mix;
  for (Sex s : {Sex::female, Sex::male}) {
    if (mix.weight(s) > 0.0 && !wf.table->has_sex(s)) {
      out.problems.push_back({"invalid_value", "subjects", "",
                              std::string("has no ") + std::string(sex_name(s)) +
                                  " subjects, so the workforce cannot include " +
                                  (s == Sex::female ? "women" : "men"),
                              "", file.string()});
    }
  }
  if (!out.problems.empty()) return out;

  const Dimension* overhead = wf.table->find_dimension("overhead_grip_reach");
  if (prefer_measured_overhead_reach && is_shipped_name(name_or_path) &&
      wf.table->name != measured_overhead_reach_table && (!overhead || overhead->kind == DimensionKind::derived)) {
    const auto measured_file = dir / (std::string(measured_overhead_reach_table) + ".json");
    if (std::filesystem::exists(measured_file)) {
      LoadedPopulation measured = load_population_file(measured_file);
      if (!measured.table) {
        out.problems = std::move(measured.problems);
        return out;
      }
      wf.overrides.push_back(
          {"overhead_grip_reach", std::make_shared<const PopulationTable>(std::move(*measured.table))});
      out.notes.push_back("overhead_grip_reach is taken from table \"" + std::string(measured_overhead_reach_table) +
                          "\", which measured overhead reach standing; \"" + wf.table->name + "\" only estimates it");
    }
  }
  out.workforce = std::move(wf);
  return out;
}

}  // namespace rackreach
