// SPDX-License-Identifier: MIT
#pragma once
// Reading a raw survey file: one header line, one subject per line, a single-character delimiter, optional
// double quotes around a field, LF or CRLF line ends, bytes kept as they are (the files are ASCII or Latin-1 and
// only numeric columns are read). Missing measurements coded -999 are returned as empty.

#include <filesystem>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rackreach {

struct RawTable {
  std::string file_name;
  std::string bytes;  ///< the whole file, unchanged (hashed into the table)
  std::vector<std::string> header;
  std::vector<std::vector<std::string>> rows;  ///< fields as text; a short row has fewer fields
};

/// Reads the file; throws std::runtime_error naming the file if it cannot be read or has no header.
RawTable load_raw_table(const std::filesystem::path& path, char delimiter);

/// Index of the column named `name`, compared without regard to ASCII case (the two ANSUR II files spell the id
/// column differently); throws std::runtime_error if absent.
std::size_t find_column(const RawTable& t, std::string_view name);

/// The measurement in row `row`, column `col` as a number; empty for the missing-value code -999. Throws
/// std::runtime_error naming file, line and column for anything that is not a non-negative integer.
std::optional<double> read_measurement(const RawTable& t, std::size_t row, std::size_t col);

}  // namespace rackreach
