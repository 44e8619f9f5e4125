// SPDX-License-Identifier: MIT
#pragma once
// The tests' own reader of the raw survey files and type-7 percentile, written from the survey READMEs'
// definitions and independent of the generator's code, so that a generator bug cannot hide behind itself.

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <functional>
#include <map>
#include <optional>
#include <sstream>
#include <string>
#include <vector>

namespace raw_check {

inline std::string shared_dir() {
  return RACKREACH_SHARED_DIR;
}
inline bool shared_present() {
  return std::filesystem::exists(shared_dir() + "/anthropometry/ansur2/README.md");
}

/// Rows of a raw file as column name (lower-cased) -> value; -999 cells are left out of the row.
inline std::vector<std::map<std::string, double>> read_rows(const std::string& file, char delimiter) {
  std::ifstream in(file, std::ios::binary);
  std::string line;
  std::vector<std::string> header;
  std::vector<std::map<std::string, double>> rows;
  auto split = [delimiter](const std::string& l) {
    std::vector<std::string> out(1);
    for (char c : l) {
      if (c == '\r' || c == '"') continue;
      if (c == delimiter)
        out.emplace_back();
      else
        out.back() += c;
    }
    return out;
  };
  while (std::getline(in, line)) {
    if (line.empty() || line == "\r") continue;
    auto fields = split(line);
    if (header.empty()) {
      for (auto& f : fields) {
        std::transform(f.begin(), f.end(), f.begin(), [](unsigned char c) { return std::tolower(c); });
      }
      header = fields;
      continue;
    }
    std::map<std::string, double> row;
    for (std::size_t i = 0; i < fields.size() && i < header.size(); ++i) {
      char* end = nullptr;
      const double v = std::strtod(fields[i].c_str(), &end);
      if (!fields[i].empty() && end && *end == '\0' && v != -999.0) row[header[i]] = v;
    }
    rows.push_back(std::move(row));
  }
  return rows;
}

/// Per-subject values of `f` over the rows that have every column in `columns` (lower-case names).
inline std::vector<double> per_subject(const std::vector<std::map<std::string, double>>& rows,
                                       const std::vector<std::string>& columns,
                                       const std::function<double(const std::vector<double>&)>& f) {
  std::vector<double> out;
  for (const auto& r : rows) {
    std::vector<double> v;
    for (const auto& c : columns) {
      auto it = r.find(c);
      if (it == r.end()) break;
      v.push_back(it->second);
    }
    if (v.size() == columns.size()) out.push_back(f(v));
  }
  std::sort(out.begin(), out.end());
  return out;
}

/// Hyndman & Fan type 7 on a sorted sample, p in 0..1 (as the survey READMEs define it).
inline double type7(const std::vector<double>& x, double p) {
  const double h = (static_cast<double>(x.size()) - 1) * p;
  const auto i = static_cast<std::size_t>(std::floor(h));
  if (i + 1 >= x.size()) return x.back();
  return x[i] + (h - static_cast<double>(i)) * (x[i + 1] - x[i]);
}

/// The survey's own percentiles.csv: (dimension, sex, statistic) -> value (mm, or kg for weight_kg).
inline std::map<std::tuple<std::string, std::string, std::string>, double> read_percentiles_csv(
    const std::string& file) {
  std::map<std::tuple<std::string, std::string, std::string>, double> out;
  std::ifstream in(file);
  std::string line;
  std::getline(in, line);
  while (std::getline(in, line)) {
    std::stringstream ss(line);
    std::string d, s, st, v;
    std::getline(ss, d, ',');
    std::getline(ss, s, ',');
    std::getline(ss, st, ',');
    std::getline(ss, v, ',');
    out[{d, s, st}] = std::stod(v);
  }
  return out;
}

}  // namespace raw_check
