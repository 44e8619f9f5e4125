// SPDX-License-Identifier: MIT
#include "engine/io/input_limits.hpp"

#include <filesystem>
#include <fstream>
#include <system_error>

namespace rackreach::input_limits {

std::optional<std::string> read_input_file(const std::string& path, std::uintmax_t max_bytes,
                                           std::vector<Problem>& problems, const std::string& file_label) {
  std::error_code ec;
  const std::filesystem::file_status st = std::filesystem::status(path, ec);
  if (!ec && std::filesystem::is_directory(st)) {
    problems.emplace_back("file_error", "", "", "is a folder, not a file", "", file_label);
    return std::nullopt;
  }
  std::ifstream in(path, std::ios::binary);
  if (!in) {
    problems.emplace_back("file_error", "", "", "cannot open the file for reading", "", file_label);
    return std::nullopt;
  }
  // The size of a regular file is known before reading; anything else (a pipe) is read up to the limit.
  if (!ec && std::filesystem::is_regular_file(st)) {
    const std::uintmax_t size = std::filesystem::file_size(path, ec);
    if (!ec && size > max_bytes) {
      problems.emplace_back("too_large", "", std::to_string(size) + " bytes",
                            "the file must be at most " + std::to_string(max_bytes) + " bytes", "", file_label);
      return std::nullopt;
    }
  }
  std::string text;
  char buf[1 << 16];
  while (in) {
    in.read(buf, sizeof buf);
    text.append(buf, static_cast<std::size_t>(in.gcount()));
    if (text.size() > max_bytes) {
      problems.emplace_back("too_large", "", "more than " + std::to_string(max_bytes) + " bytes",
                            "the file must be at most " + std::to_string(max_bytes) + " bytes", "", file_label);
      return std::nullopt;
    }
  }
  if (in.bad()) {
    problems.emplace_back("file_error", "", "", "cannot read the file", "", file_label);
    return std::nullopt;
  }
  return text;
}

std::optional<std::size_t> find_json_depth_excess(std::string_view text, std::size_t max_depth) {
  std::size_t depth = 0;
  bool in_string = false;
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (in_string) {
      if (c == '\\') ++i;
      else if (c == '"') in_string = false;
      continue;
    }
    if (c == '"') {
      in_string = true;
    } else if (c == '[' || c == '{') {
      if (++depth > max_depth) return i;
    } else if ((c == ']' || c == '}') && depth > 0) {
      --depth;
    }
  }
  return std::nullopt;
}

std::string line_and_column(std::string_view text, std::size_t byte) {
  std::size_t line = 1, col = 1;
  for (std::size_t i = 0; i < byte && i < text.size(); ++i) {
    if (text[i] == '\n') {
      ++line;
      col = 1;
    } else {
      ++col;
    }
  }
  return "line " + std::to_string(line) + ", column " + std::to_string(col);
}

Problem too_deep_problem(std::string_view text, std::size_t byte, const std::string& file_label) {
  return Problem("too_deep", "", "",
                 "arrays and objects may nest at most " + std::to_string(max_json_depth) + " deep; " +
                     line_and_column(text, byte) + " is deeper",
                 "", file_label);
}

}  // namespace rackreach::input_limits
