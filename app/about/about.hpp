// SPDX-License-Identifier: MIT
#pragma once
// What `rackreach --version` and `rackreach-gui --version` print.

#include <string>
#include <string_view>

namespace rackreach {

/// "PROGRAM VERSION" on the first line, then the commit, compiler, build type, Qt, and the population data
/// folder in use with why it was chosen (or every place looked at when none holds a table). No final newline.
std::string make_version_text(std::string_view program);

}  // namespace rackreach
