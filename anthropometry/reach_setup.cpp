// SPDX-License-Identifier: MIT
#include "anthropometry/reach_setup.hpp"

#include "anthropometry/data_dir.hpp"
#include "anthropometry/workforce.hpp"

namespace rackreach {

LoadedReachSetup load_reach_setup(const Project& project, const std::filesystem::path& data_dir) {
  LoadedReachSetup out;
  const WorkforceSpec& spec = project.workforce;
  // Overhead reach is measured directly only in the 1988 survey; prefer it, as `population show` explains.
  LoadedWorkforce wf = load_workforce(spec.population, SexMix{spec.women_share}, data_dir, true);
  if (!wf.workforce) {
    for (Problem p : wf.problems) {
      // A name that finds no table is a problem of the project file's own field; a problem inside a population
      // file the user named keeps that file and its path.
      if (p.file == spec.population) {
        p.file.clear();
        p.path = "workforce.population";
        p.value = "\"" + spec.population + "\"";
      }
      out.problems.push_back(std::move(p));
    }
    return out;
  }
  ReachSetup setup;
  setup.parameters = project.reach_parameters;
  setup.workforce = wf.workforce->describe();
  for (auto [percentile, body, key] : {std::tuple{spec.small_percentile, &setup.small, "small_percentile"},
                                       std::tuple{spec.large_percentile, &setup.large, "large_percentile"}}) {
    ReachBodyResult b = calc_reach_body(*wf.workforce, percentile);
    if (!b.body) {
      for (const std::string& why : b.problems)
        out.problems.push_back({"invalid_value", std::string("workforce.") + key, std::to_string(percentile), why});
      continue;
    }
    *body = std::move(*b.body);
  }
  if (out.problems.empty()) out.setup = std::move(setup);
  return out;
}

LoadedReachSetup load_reach_setup(const Project& project) {
  const DataDirLookup data = find_data_dir();
  if (!data.dir && is_shipped_name(project.workforce.population)) {
    LoadedReachSetup out;
    out.problems.push_back({"file_error", project.workforce_given ? "workforce.population" : "", "",
                            "the reach checks need the population table \"" + project.workforce.population +
                                "\": " + data.failure_message(),
                            ""});
    return out;
  }
  return load_reach_setup(project, data.dir.value_or(std::filesystem::path()));
}

}  // namespace rackreach
