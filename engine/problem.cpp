// SPDX-License-Identifier: MIT
#include "engine/problem.hpp"

namespace rackreach {

std::string format_problem(const std::string& file, const Problem& p) {
  std::string s = p.file.empty() ? file : p.file;
  if (!p.path.empty()) s += ": " + p.path;
  if (!p.context.empty()) s += " (" + p.context + ")";
  s += ": " + p.rule;
  if (!p.value.empty()) s += "; it is " + p.value;
  s += " [" + p.code + "]";
  return s;
}

}  // namespace rackreach
