// SPDX-License-Identifier: MIT
#include "anthropometry/problem.hpp"

namespace rackreach {

std::string format_problem(const InputProblem& p) {
  std::string out = p.file + ": ";
  if (!p.path.empty()) out += p.path + " ";
  out += p.rule;
  if (!p.value.empty()) out += " (it is " + p.value + ")";
  return out;
}

}  // namespace rackreach
