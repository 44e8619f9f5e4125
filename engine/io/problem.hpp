// SPDX-License-Identifier: MIT
#pragma once
// A validation problem: what is wrong, where (JSON path), with what value, against which rule. The loaders
// return every problem at once; the CLI and the desktop app format them.

#include <string>
#include <vector>

namespace rackreach {

struct Problem {
  std::string code;     ///< stable: missing_key, unknown_key, wrong_type, out_of_range, invalid_value, duplicate_id,
                        ///< empty, parse_error, file_error
  std::string path;     ///< JSON path, e.g. jobs[0].tasks[2].origin.h ("" for the whole file)
  std::string value;    ///< the offending value as JSON text ("" where there is none)
  std::string rule;     ///< the rule in plain words, with its unit
  std::string context;  ///< the object it belongs to, e.g. task "T3" ("" where none)
};

/// `FILE: PATH (CONTEXT): RULE; it is VALUE [CODE]`
std::string format_problem(const std::string& file, const Problem& p);

}  // namespace rackreach
