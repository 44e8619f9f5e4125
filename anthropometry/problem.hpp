// SPDX-License-Identifier: MIT
#pragma once
// One problem found in an input: which file, where in it (a JSON path such as `dimensions.stature.unit`), the
// value found there and the rule it breaks. Validation collects all of them; the front-ends format them.

#include <string>
#include <vector>

namespace rackreach {

struct InputProblem {
  std::string file;   ///< the file as the user named it
  std::string path;   ///< JSON path inside it; empty for the file as a whole
  std::string value;  ///< the offending value, as text (JSON for JSON values); empty if absent
  std::string rule;   ///< what it must be, e.g. "must be one of mm, cm, in, kg, lb"
};

/// `FILE: PATH RULE (it is VALUE)`, one line.
std::string format_problem(const InputProblem& p);

}  // namespace rackreach
