// SPDX-License-Identifier: MIT
#pragma once
// Where the shipped population tables are, and loading a table or a workforce by name.
//
// The data folder is looked for in this order, and this is the only place that decides it:
//   1. the environment variable RACKREACH_DATA_DIR, when it is set and not empty (then it is the only place
//      looked: a folder named on purpose is never silently replaced by another);
//   2. relative to the running program (/proc/self/exe): ../share/rackreach/population from its bin folder, the
//      installed layout wherever the prefix is (/usr/local, a .deb's /usr, a moved or extracted copy);
//   3. the repository's anthropometry/data, compiled in for running from the build tree.
// A folder counts when it holds at least one population table (*.json).

#include <filesystem>
#include <memory>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "anthropometry/population_json.hpp"
#include "anthropometry/workforce.hpp"

namespace rackreach {

/// The shipped table that measured standing overhead reach directly; preferred for overhead grip reach over a
/// table that estimates it (ANSUR II estimates it from seated overhead reach, see its data file).
inline constexpr std::string_view measured_overhead_reach_table = "ansur1988";

/// One place the data folder may be, and why it is looked at.
struct DataDirCandidate {
  std::filesystem::path dir;
  std::string reason;  ///< "RACKREACH_DATA_DIR", "installed beside the program", "build tree"
};

struct DataDirLookup {
  std::optional<std::filesystem::path> dir;  ///< the first candidate that holds population tables
  std::string reason;                        ///< the found candidate's reason
  std::vector<DataDirCandidate> tried;       ///< every candidate, in the order looked at
  /// "no population tables (*.json) found; looked in: A (reason), B (reason); ..." naming every place tried.
  std::string failure_message() const;
};

/// The candidates in lookup order. `env_value` is RACKREACH_DATA_DIR (nullptr when unset); `executable` the
/// running program's path (empty when unknown); `build_tree_dir` the compiled-in repository folder.
std::vector<DataDirCandidate> list_data_dir_candidates(const char* env_value, const std::filesystem::path& executable,
                                                       const std::filesystem::path& build_tree_dir);
/// The first candidate that holds population tables.
DataDirLookup resolve_data_dir(const char* env_value, const std::filesystem::path& executable,
                               const std::filesystem::path& build_tree_dir);
/// The running program's own path (/proc/self/exe), or empty when it cannot be read.
std::filesystem::path find_executable_path();
/// resolve_data_dir(getenv("RACKREACH_DATA_DIR"), find_executable_path(), the compiled-in build-tree folder).
DataDirLookup find_data_dir();

/// The population table files (*.json) in `dir`, sorted by name.
std::vector<std::filesystem::path> list_population_files(const std::filesystem::path& dir);

/// A name without '/' and without ".json" names a shipped table, `dir`/NAME.json; anything else is a file path.
bool is_shipped_name(std::string_view name_or_path);
std::filesystem::path find_population_file(std::string_view name_or_path, const std::filesystem::path& dir);

struct LoadedWorkforce {
  std::optional<Workforce> workforce;
  std::vector<Problem> problems;
  std::vector<std::string> notes;  ///< e.g. which dimension comes from which other table, and why
};

/// Loads a workforce from the table `name_or_path` with the given mix. When `prefer_measured_overhead_reach` is
/// set, the table is a shipped one other than `measured_overhead_reach_table`, and its overhead grip reach is a
/// derived estimate (or missing), overhead grip reach is taken from `measured_overhead_reach_table`, which
/// measured it standing. A user's own table is always used as it is.
LoadedWorkforce load_workforce(std::string_view name_or_path, SexMix mix, const std::filesystem::path& dir,
                               bool prefer_measured_overhead_reach);

}  // namespace rackreach
