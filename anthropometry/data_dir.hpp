// SPDX-License-Identifier: MIT
#pragma once
// Where the shipped population tables are, and loading a table or a workforce by name.
//
// The data directory is the environment variable RACKREACH_DATA_DIR when it is set and not empty, else the
// directory compiled in for the build tree (the repository's anthropometry/data). This is the only place that
// decides it.

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

/// `env_value` if it is set and not empty, else the compiled-in directory.
std::filesystem::path resolve_data_dir(const char* env_value);
/// resolve_data_dir(getenv("RACKREACH_DATA_DIR")).
std::filesystem::path find_data_dir();

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
