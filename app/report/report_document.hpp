// SPDX-License-Identifier: MIT
#pragma once
// The audit report as a document: sections of paragraphs, notices, tables, rack drawings and a sign-off block,
// built from a project and its assessment (the same assess_project() as `rackreach assess`). Plain C++, no Qt:
// the HTML and PDF writers turn it into pages, and compute nothing themselves.

#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "app/report/self_check.hpp"
#include "engine/assess.hpp"
#include "engine/project.hpp"

namespace rackreach::report {

/// What the report says about its own making; everything that is not computed from the project.
struct ReportContext {
  std::string input_name;      ///< the project file as given
  std::string input_sha256;    ///< of the input file's bytes, lower-case hex
  std::size_t input_bytes = 0;
  std::string generated_at;    ///< the report's date (YYYY-MM-DD or YYYY-MM-DDTHH:MM:SSZ), given or the clock's
  std::optional<std::string> site, assessor, revision;  ///< override the project file's
  std::string tool_version;    ///< engine_version
  SelfCheckResult self_check;  ///< the published cases, evaluated when the report is made
  bool drawings = true;        ///< false: the writer cannot draw; the report says so where the drawings would be
};

struct Cell {
  std::string text;                ///< a line break ("\n") starts a new line in the cell
  bool numeric = false;            ///< right-aligned
  std::optional<RiskBand> band;    ///< tinted with the band's colour (always beside its word or number)
  bool strong = false;
};

struct Table {
  std::vector<std::string> header;  ///< repeated at the top of every page the table runs onto
  std::vector<std::vector<Cell>> rows;
  std::vector<int> widths_pct;      ///< optional column widths in percent of the page width
};

struct Paragraph {
  std::string text;
  bool small = false;
};

/// A boxed statement that must not be missed: the caution, a failed self-check.
struct Notice {
  std::string title;
  std::string text;
  bool alarm = false;  ///< a failure: drawn in heavy type with a heavy frame
};

struct Bullets {
  std::vector<std::string> items;
};

/// A rack face, drawn with the app's drawing code.
struct RackDrawing {
  int rack_index = 0;  ///< into Store::racks
  std::string rack_id;
  bool new_page = false;  ///< starts a page (one drawing a page)
  std::string caption;
};

/// Lines for names, roles, signatures and dates.
struct SignOff {
  std::vector<std::string> roles;
  std::vector<std::string> names;  ///< parallel to roles; empty strings leave the line blank
};

struct Subheading {
  std::string text;
};

using Block = std::variant<Paragraph, Notice, Bullets, Table, RackDrawing, SignOff, Subheading>;

struct Section {
  std::string title;
  bool new_page = false;
  std::vector<Block> blocks;
};

struct ReportDocument {
  std::string title;
  std::string subtitle;
  Table cover;              ///< two columns: what, value
  std::vector<Block> cover_blocks;  ///< notices under the cover table
  std::vector<Section> sections;
  std::string footer;       ///< printed on every page beside the page number
  std::string generated_at;
};

/// Builds the report of a project from its assessment. `assessment` must be assess_project(project, ...).
ReportDocument build_report(const Project& project, const ProjectAssessment& assessment, const ReportContext& context);

/// The slots whose LI is above the elevated boundary (the band's lower bound), in ranked order: those the report
/// must show by name.
std::vector<std::string> find_slots_above_limit(const ProjectAssessment& assessment);

}  // namespace rackreach::report
