// SPDX-License-Identifier: MIT
#include "app/about/about.hpp"

#include "anthropometry/data_dir.hpp"
#include "app/about/build_info.hpp"

namespace rackreach {

std::string make_version_text(std::string_view program) {
  std::string out = std::string(program) + " " + build_info::version + "\n";
  out += std::string("commit:      ") + build_info::git_commit + "\n";
  out += std::string("compiler:    ") + build_info::compiler + "\n";
  out += std::string("build type:  ") + build_info::build_type + "\n";
  out += std::string("Qt:          ") + build_info::qt + "\n";
  const DataDirLookup data = find_data_dir();
  if (data.dir)
    out += "data folder: " + data.dir->string() + " (" + data.reason + ")\n";
  else
    out += "data folder: none: " + data.failure_message() + "\n";
  out.pop_back();  // the callers end the last line
  return out;
}

}  // namespace rackreach
