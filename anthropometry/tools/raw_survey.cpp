// SPDX-License-Identifier: MIT
#include "raw_survey.hpp"

#include <charconv>
#include <fstream>
#include <sstream>
#include <stdexcept>

namespace rackreach {
namespace {

std::vector<std::string> split(std::string_view line, char delimiter) {
  std::vector<std::string> out;
  std::string field;
  bool quoted = false;
  for (char c : line) {
    if (c == '"') {
      quoted = !quoted;
    } else if (c == delimiter && !quoted) {
      out.push_back(std::move(field));
      field.clear();
    } else {
      field += c;
    }
  }
  out.push_back(std::move(field));
  return out;
}

bool iequal(std::string_view a, std::string_view b) {
  if (a.size() != b.size()) return false;
  for (std::size_t i = 0; i < a.size(); ++i) {
    auto lower = [](char c) { return c >= 'A' && c <= 'Z' ? static_cast<char>(c - 'A' + 'a') : c; };
    if (lower(a[i]) != lower(b[i])) return false;
  }
  return true;
}

}  // namespace

RawTable load_raw_table(const std::filesystem::path& path, char delimiter) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw std::runtime_error(path.string() + ": cannot be opened");
  RawTable t;
  t.file_name = path.filename().string();
  std::ostringstream text;
  text << in.rdbuf();
  t.bytes = text.str();
  std::string_view rest = t.bytes;
  bool first = true;
  while (!rest.empty()) {
    const std::size_t end = rest.find('\n');
    std::string_view line = rest.substr(0, end);
    rest = end == std::string_view::npos ? std::string_view() : rest.substr(end + 1);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    if (line.empty()) continue;
    if (first) {
      t.header = split(line, delimiter);
      first = false;
    } else {
      t.rows.push_back(split(line, delimiter));
    }
  }
  if (t.header.empty()) throw std::runtime_error(path.string() + ": no header line");
  return t;
}

std::size_t find_column(const RawTable& t, std::string_view name) {
  for (std::size_t i = 0; i < t.header.size(); ++i) {
    if (iequal(t.header[i], name)) return i;
  }
  throw std::runtime_error(t.file_name + ": no column " + std::string(name));
}

std::optional<double> read_measurement(const RawTable& t, std::size_t row, std::size_t col) {
  const auto where = [&] { return t.file_name + " line " + std::to_string(row + 2) + " column " + t.header.at(col); };
  if (col >= t.rows[row].size()) throw std::runtime_error(where() + ": the field is missing");
  const std::string& s = t.rows[row][col];
  long long v = 0;
  auto [end, ec] = std::from_chars(s.data(), s.data() + s.size(), v);
  if (ec != std::errc() || end != s.data() + s.size()) {
    throw std::runtime_error(where() + ": \"" + s + "\" is not a whole number");
  }
  if (v == -999) return std::nullopt;
  if (v < 0) throw std::runtime_error(where() + ": " + s + " is negative");
  return static_cast<double>(v);
}

}  // namespace rackreach
