// SPDX-License-Identifier: MIT
#pragma once
// The reach setup of a project: its workforce table mixed by sex, the small and the large worker taken from it,
// and the reach model's parameters. The CLI and the desktop app both make it here.

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "engine/assess.hpp"
#include "engine/problem.hpp"
#include "engine/project.hpp"

namespace rackreach {

struct LoadedReachSetup {
  std::optional<ReachSetup> setup;
  std::vector<Problem> problems;  ///< paths point into the project file's "workforce" where they can
};

/// Loads the workforce of `project` from `data_dir` (shipped tables) or a file, and forms its two workers.
LoadedReachSetup load_reach_setup(const Project& project, const std::filesystem::path& data_dir);
/// The same from the data folder the programs use (find_data_dir()); when no folder holds tables and the project
/// names a shipped table, the one problem names every place looked at.
LoadedReachSetup load_reach_setup(const Project& project);

}  // namespace rackreach
