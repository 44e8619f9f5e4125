// SPDX-License-Identifier: MIT
#pragma once
// Output of an assessment as JSON (for programs), a text table (for people) and CSV (for spreadsheets).
// Loads and limits are in the project's units, and every output names them.

#include <string>
#include <string_view>

#include "engine/assess.hpp"
#include "engine/project.hpp"

namespace rackreach {

struct OutputHeader {
  std::string input_name;  ///< the file assessed, as given
};

std::string write_assessment_json(const Project& project, const ProjectAssessment& a, const OutputHeader& h);
std::string write_assessment_table(const Project& project, const ProjectAssessment& a, const OutputHeader& h);
std::string write_assessment_csv(const Project& project, const ProjectAssessment& a, const OutputHeader& h);
/// HTML: the slot review page when the project has slots, with the lift jobs as preformatted text after it.
std::string write_assessment_html(const Project& project, const ProjectAssessment& a, const OutputHeader& h);

/// A CSV cell: quoted when needed, and neutralised (a leading apostrophe) when a spreadsheet would run it as a
/// formula (it starts with =, +, -, @, tab or carriage return) and is not a plain number.
std::string csv_cell(std::string_view text);

}  // namespace rackreach
