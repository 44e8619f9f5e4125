// SPDX-License-Identifier: MIT
#pragma once
// Test helpers that read the shared reference material beside the repository (RACKREACH_SHARED_DIR).
// When it is absent the caller says so and skips; nothing here pretends a check passed.

#include <fstream>
#include <optional>
#include <sstream>
#include <string>
#include <vector>

namespace shared_reference {

inline std::string path(const std::string& relative) { return std::string(RACKREACH_SHARED_DIR) + "/" + relative; }
inline std::string repo_path(const std::string& relative) { return std::string(RACKREACH_SOURCE_DIR) + "/" + relative; }

inline std::optional<std::string> read_text(const std::string& full_path) {
  std::ifstream in(full_path, std::ios::binary);
  if (!in) return std::nullopt;
  std::ostringstream ss;
  ss << in.rdbuf();
  return ss.str();
}

inline std::string trim(const std::string& s) {
  const auto b = s.find_first_not_of(" \t");
  const auto e = s.find_last_not_of(" \t\r");
  return b == std::string::npos ? std::string() : s.substr(b, e - b + 1);
}

/// The body rows of the markdown table whose header line starts with `header_prefix`, cells trimmed. A
/// leading "." in a cell (".95") is read as "0.95".
inline std::optional<std::vector<std::vector<std::string>>> read_markdown_table(const std::string& relative,
                                                                                const std::string& header_prefix) {
  const auto text = read_text(path(relative));
  if (!text) return std::nullopt;
  std::istringstream in(*text);
  std::string line;
  bool in_table = false, past_rule = false;
  std::vector<std::vector<std::string>> rows;
  while (std::getline(in, line)) {
    if (!in_table) {
      in_table = line.rfind(header_prefix, 0) == 0;
      continue;
    }
    if (!past_rule) {
      past_rule = true;  // the |---| line
      continue;
    }
    if (line.empty() || line[0] != '|') break;
    std::vector<std::string> cells;
    std::stringstream ls(line.substr(1));
    std::string cell;
    while (std::getline(ls, cell, '|')) {
      cell = trim(cell);
      if (!cell.empty() && cell[0] == '.') cell = "0" + cell;
      cells.push_back(cell);
    }
    if (!cells.empty() && cells.back().empty()) cells.pop_back();
    rows.push_back(cells);
  }
  if (!in_table) return std::nullopt;
  return rows;
}

}  // namespace shared_reference
