// SPDX-License-Identifier: MIT
#pragma once
// A validation problem: what is wrong, where (JSON path), with what value, against which rule. Every loader
// (project file, population table, reach inputs) returns every problem at once in this one form; the CLI and the
// desktop app format them.

#include <string>
#include <utility>
#include <vector>

namespace rackreach {

struct Problem {
  Problem() = default;
  Problem(std::string code_, std::string path_, std::string value_, std::string rule_, std::string context_ = {},
          std::string file_ = {})
      : code(std::move(code_)), path(std::move(path_)), value(std::move(value_)), rule(std::move(rule_)),
        context(std::move(context_)), file(std::move(file_)) {}

  std::string code;     ///< stable: missing_key, unknown_key, wrong_type, out_of_range, invalid_value, duplicate_id,
                        ///< empty, parse_error, file_error
  std::string path;     ///< JSON path, e.g. jobs[0].tasks[2].origin.h ("" for the whole file)
  std::string value;    ///< the offending value as JSON text ("" where there is none)
  std::string rule;     ///< the rule in plain words, with its unit
  std::string context;  ///< the object it belongs to, e.g. task "T3" ("" where none)
  std::string file;     ///< the file, where a loader reads several; "" when the caller names it
};

/// `FILE: PATH (CONTEXT): RULE; it is VALUE [CODE]`; the problem's own file, if it has one, wins over `file`.
std::string format_problem(const std::string& file, const Problem& p);
/// The same with the problem's own file.
inline std::string format_problem(const Problem& p) { return format_problem(p.file, p); }

}  // namespace rackreach
