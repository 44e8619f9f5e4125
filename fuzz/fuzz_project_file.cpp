// SPDX-License-Identifier: MIT
// Fuzz target: the project file loader (lift jobs and stores). Any input must end in a project or in problems,
// never in a crash, a hang or a sanitizer report; a project that loads must save to a text that loads again.

#include <cstddef>
#include <cstdint>
#include <cstdlib>
#include <string_view>

#include "engine/io/project_file.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view text(reinterpret_cast<const char*>(data), size);
  const rackreach::LoadResult loaded = rackreach::load_project_text(text);
  if (loaded.project.has_value() != loaded.problems.empty()) std::abort();
  if (loaded.project) {
    const rackreach::LoadResult again = rackreach::load_project_text(rackreach::save_project_text(*loaded.project));
    if (!again.project) std::abort();  // the writer made a file its own loader refuses
  }
  return 0;
}
