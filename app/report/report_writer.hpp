// SPDX-License-Identifier: MIT
#pragma once
// Writing the audit report of a project: `rackreach report` and the desktop app's File > Export report both call
// write_report(). It assesses the project exactly as `rackreach assess` does (assess_project with the reach workers
// of its workforce), runs the engine's self-check, builds the document and writes it as PDF (QPdfWriter and
// QTextDocument) or HTML (drawings as PNG data URIs), atomically. Needs a QGuiApplication (any platform,
// offscreen included); nothing here needs a window or a display.

#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/duration.hpp"
#include "engine/lifting/rounding.hpp"
#include "engine/project.hpp"

namespace rackreach::report {

enum class ReportFormat { pdf, html };

struct ReportOptions {
  /// The report's date: YYYY-MM-DD or YYYY-MM-DDTHH:MM:SSZ. Empty: the clock's UTC time now. Given, two runs on
  /// the same input and version write the same bytes.
  std::optional<std::string> date;
  std::optional<std::string> site, assessor, revision;  ///< override the project file's
  RoundingMode rounding = RoundingMode::full;
  std::optional<DurationRule> duration_rule;            ///< overrides the project file's
  std::optional<ReportFormat> format;                   ///< default: from the output's extension (.pdf, .html)
};

/// The project file as read: its name as shown and its bytes (the report prints their SHA-256).
struct ReportSource {
  std::string name;
  std::string bytes;
};

struct ReportResult {
  bool written = false;
  std::vector<std::string> problems;  ///< each names the file, the field or option, the value and the rule
  int pages = 0;                      ///< PDF pages
  std::size_t bytes = 0;              ///< size of the file written
  bool self_check_passed = false;
};

/// The rendered report without writing it.
struct RenderedReport {
  std::string bytes;
  int pages = 0;
  bool self_check_passed = false;
  std::vector<std::string> problems;
};

/// The format of an output path from its extension (.pdf, .html, .htm; any case), if it has one of them.
std::optional<ReportFormat> find_report_format(const std::string& out_path);
/// Problems of the options: the date's form, the output's extension.
std::vector<std::string> validate_report_options(const ReportOptions& options, const std::string& out_path);
/// The SHA-256 of some bytes, lower-case hex.
std::string calc_sha256_hex(const std::string& bytes);

RenderedReport render_report(const Project& project, const ReportSource& source, ReportFormat format,
                             const ReportOptions& options);
/// Renders and writes the report to `out_path` atomically; on any problem nothing is written.
ReportResult write_report(const Project& project, const ReportSource& source, const std::string& out_path,
                          const ReportOptions& options);

}  // namespace rackreach::report
