// SPDX-License-Identifier: MIT
#include "engine/io/csv_import.hpp"
#include "engine/io/json_reader.hpp"

#include <csv.h>

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <fstream>
#include <map>
#include <set>
#include <span>
#include <sstream>

#include "engine/io/assessment_output.hpp"
#include "engine/io/input_limits.hpp"

namespace rackreach {
namespace {

// ---------------------------------------------------------------------------------------------------------------
// The CSV layer: libcsv splits the bytes; we only remember where each cell starts.

struct CsvCell {
  std::string text;      ///< as libcsv gives it (quotes removed, doubled quotes undone)
  std::size_t line = 0;  ///< physical line on which the cell starts
};

struct CsvRecord {
  std::vector<CsvCell> cells;
  std::size_t line = 0;  ///< line of the first cell
};

struct CsvText {
  std::vector<CsvRecord> records;
  std::optional<Problem> error;  ///< the file stops being CSV here; records before it are kept
};

/// Physical lines: a line ends at LF, at CRLF, or at a CR not followed by LF (the line ends libcsv accepts).
class LineIndex {
 public:
  explicit LineIndex(std::string_view s) {
    starts_.push_back(0);
    for (std::size_t i = 0; i < s.size(); ++i) {
      if (s[i] == '\n' || (s[i] == '\r' && (i + 1 == s.size() || s[i + 1] != '\n'))) starts_.push_back(i + 1);
    }
  }
  /// The 1-based line of the byte at `offset`.
  std::size_t line_of(std::size_t offset) const {
    return static_cast<std::size_t>(std::upper_bound(starts_.begin(), starts_.end(), offset) - starts_.begin());
  }

 private:
  std::vector<std::size_t> starts_;
};

/// What the libcsv callbacks fill. libcsv is fed one byte at a time, so at every callback `offset` is the byte
/// that ended the cell or the row; with CSV_REPALL_NL every unquoted line end is reported, so the byte after the
/// last callback is where the next cell starts.
struct ParseState {
  const LineIndex* lines = nullptr;
  std::size_t offset = 0;      ///< the byte being fed (the text's size during csv_fini)
  std::size_t cell_start = 0;  ///< first byte of the cell being read
  CsvRecord current;
  std::vector<CsvRecord> records;
  std::optional<Problem> limit;  ///< the first size limit passed (input_limits.hpp); reading stops there
  const std::string* file = nullptr;
};

void on_cell(void* data, std::size_t size, void* state_ptr) {
  auto& st = *static_cast<ParseState*>(state_ptr);
  if (st.limit) return;
  const std::size_t line = st.lines->line_of(st.cell_start);
  const std::size_t column = st.current.cells.size() + 1;
  if (size > input_limits::max_csv_field_bytes) {
    st.limit = Problem("too_long", "line " + std::to_string(line) + ", column " + std::to_string(column),
                       std::to_string(size) + " bytes",
                       "a cell may hold at most " + std::to_string(input_limits::max_csv_field_bytes) + " bytes", "",
                       *st.file);
    return;
  }
  if (column > input_limits::max_csv_columns) {
    st.limit = Problem("too_many", "line " + std::to_string(line) + ", column " + std::to_string(column), "",
                       "a row may hold at most " + std::to_string(input_limits::max_csv_columns) + " cells", "",
                       *st.file);
    return;
  }
  CsvCell cell;
  if (data) cell.text.assign(static_cast<const char*>(data), size);  // CSV_EMPTY_IS_NULL: null is an empty cell
  cell.line = line;
  if (st.current.cells.empty()) st.current.line = cell.line;
  st.current.cells.push_back(std::move(cell));
  st.cell_start = st.offset + 1;
}

void on_row_end(int /*terminator*/, void* state_ptr) {
  auto& st = *static_cast<ParseState*>(state_ptr);
  if (st.limit) return;
  if (!st.current.cells.empty() && st.records.size() > input_limits::max_csv_rows) {  // the header is not counted
    st.limit = Problem("too_many", "line " + std::to_string(st.current.line), "",
                       "a file may hold at most " + std::to_string(input_limits::max_csv_rows) + " rows of data", "",
                       *st.file);
    return;
  }
  if (!st.current.cells.empty()) st.records.push_back(std::move(st.current));
  st.current = CsvRecord{};
  st.cell_start = st.offset + 1;
}

std::string quote_value(std::string_view s);

std::string line_excerpt(std::string_view text, std::size_t offset) {
  std::size_t b = offset, e = offset;
  while (b > 0 && text[b - 1] != '\n' && text[b - 1] != '\r') --b;
  while (e < text.size() && text[e] != '\n' && text[e] != '\r') ++e;
  return quote_value(text.substr(b, e - b));
}

std::string cell_path(std::size_t line, std::size_t column, std::string_view header = {}) {
  std::string s = "line " + std::to_string(line) + ", column " + std::to_string(column);
  if (!header.empty()) s += " (" + std::string(header) + ")";
  return s;
}

CsvText read_csv(std::string_view text, const std::string& file) {
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);  // UTF-8 byte-order mark
  const LineIndex lines(text);
  ParseState st;
  st.lines = &lines;
  st.file = &file;
  CsvText out;

  csv_parser parser;
  if (csv_init(&parser, CSV_STRICT | CSV_STRICT_FINI | CSV_REPALL_NL | CSV_APPEND_NULL | CSV_EMPTY_IS_NULL) != 0) {
    out.error = Problem("file_error", "", "", "out of memory while reading the file", "", file);
    return out;
  }
  for (std::size_t i = 0; i < text.size(); ++i) {
    st.offset = i;
    if (csv_parse(&parser, text.data() + i, 1, on_cell, on_row_end, &st) != 1) {
      const int err = csv_error(&parser);
      const std::string rule =
          err == CSV_EPARSE
              ? "is not valid CSV: a quote may only open a cell and close it, and a quote inside a quoted cell is "
                "written twice (\"\")"
              : std::string("cannot be read: ") + csv_strerror(err);
      out.error = Problem("parse_error", cell_path(lines.line_of(i), st.current.cells.size() + 1),
                          line_excerpt(text, i), rule, "", file);
      break;
    }
    if (st.limit) break;
  }
  if (st.limit) {  // a file beyond a size limit is refused as a whole: none of its rows is read
    csv_free(&parser);
    out.error = std::move(st.limit);
    return out;
  }
  if (!out.error) {
    st.offset = text.size();
    const std::size_t open_cell_start = st.cell_start;
    const std::size_t open_column = st.current.cells.size() + 1;
    if (csv_fini(&parser, on_cell, on_row_end, &st) != 0 && !st.limit) {
      out.error = Problem("parse_error", cell_path(lines.line_of(open_cell_start), open_column),
                          line_excerpt(text, std::min(open_cell_start, text.size())),
                          "is not valid CSV: a quoted cell starts here and its closing quote is missing", "", file);
    }
  }
  csv_free(&parser);
  if (st.limit) {
    if (!out.error) out.error = std::move(st.limit);
    return out;
  }
  out.records = std::move(st.records);
  return out;
}

// ---------------------------------------------------------------------------------------------------------------
// Text helpers.

bool valid_utf8(std::string_view s) {
  std::size_t i = 0;
  while (i < s.size()) {
    const auto c = static_cast<unsigned char>(s[i]);
    std::size_t n = 0;  // continuation bytes
    char32_t cp = 0;
    if (c < 0x80) {
      ++i;
      continue;
    }
    if ((c & 0xE0) == 0xC0)
      n = 1, cp = c & 0x1F;
    else if ((c & 0xF0) == 0xE0)
      n = 2, cp = c & 0x0F;
    else if ((c & 0xF8) == 0xF0)
      n = 3, cp = c & 0x07;
    else
      return false;
    if (i + n >= s.size()) return false;
    for (std::size_t k = 1; k <= n; ++k) {
      const auto cc = static_cast<unsigned char>(s[i + k]);
      if ((cc & 0xC0) != 0x80) return false;
      cp = (cp << 6) | (cc & 0x3F);
    }
    constexpr char32_t min_cp[] = {0, 0x80, 0x800, 0x10000};  // shorter forms are overlong
    if (cp < min_cp[n] || cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF)) return false;
    i += n + 1;
  }
  return true;
}

/// A value for a message: in double quotes, control characters escaped, bytes that are not UTF-8 as \xNN, long
/// values cut.
std::string quote_value(std::string_view s) {
  constexpr std::size_t max_bytes = 60;
  const bool utf8 = valid_utf8(s);
  bool cut = false;
  if (s.size() > max_bytes) {
    std::size_t n = max_bytes - 3;
    if (utf8)
      while (n > 0 && (static_cast<unsigned char>(s[n]) & 0xC0) == 0x80) --n;
    s = s.substr(0, n);
    cut = true;
  }
  std::string q = "\"";
  for (char ch : s) {
    const auto c = static_cast<unsigned char>(ch);
    char buf[8];
    if (ch == '"' || ch == '\\') {
      q += '\\';
      q += ch;
    } else if (ch == '\n') {
      q += "\\n";
    } else if (ch == '\r') {
      q += "\\r";
    } else if (ch == '\t') {
      q += "\\t";
    } else if (c < 0x20 || (c >= 0x80 && !utf8)) {
      std::snprintf(buf, sizeof buf, "\\x%02X", static_cast<unsigned>(c));
      q += buf;
    } else {
      q += ch;
    }
  }
  if (cut) q += "...";
  return q + "\"";
}

std::string_view trim(std::string_view s) {
  const auto b = s.find_first_not_of(" \t");
  if (b == std::string_view::npos) return {};
  const auto e = s.find_last_not_of(" \t");
  return s.substr(b, e - b + 1);
}

std::string lower_ascii(std::string_view s) {
  std::string out(s);
  for (char& c : out)
    if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
  return out;
}

/// A header as the tables spell names: lower case, spaces and hyphens to '_', "name (unit)" or "name [unit]" to
/// "name_unit".
std::string normalise_header(std::string_view header) {
  std::string s = lower_ascii(trim(header));
  if (!s.empty() && (s.back() == ')' || s.back() == ']')) {
    const char open = s.back() == ')' ? '(' : '[';
    const auto at = s.rfind(open);
    if (at != std::string::npos) {
      const std::string unit(trim(std::string_view(s).substr(at + 1, s.size() - at - 2)));
      s = std::string(trim(std::string_view(s).substr(0, at))) + "_" + unit;
    }
  }
  std::string out;
  for (char c : s) {
    const char d = (c == ' ' || c == '-') ? '_' : c;
    if (d == '_' && !out.empty() && out.back() == '_') continue;
    out += d;
  }
  return out;
}

/// Undoes `csv_cell()`'s neutralisation of a formula-like cell.
std::string cell_value(std::string_view raw) {
  std::string s(trim(raw));
  if (s.size() >= 2 && s[0] == '\'' && std::string_view("=+-@\t\r").find(s[1]) != std::string_view::npos)
    s.erase(s.begin());
  return s;
}

std::vector<std::string_view> split_names(std::string_view names) {
  std::vector<std::string_view> out;
  while (!names.empty()) {
    const auto sp = names.find(' ');
    out.push_back(names.substr(0, sp));
    if (sp == std::string_view::npos) break;
    names.remove_prefix(sp + 1);
  }
  return out;
}

std::string fmt_num(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", x);
  return buf;
}

/// The shortest text that reads back as the same double.
std::string exact_num(double x) {
  char buf[64];
  const auto r = std::to_chars(buf, buf + sizeof buf, x);
  return std::string(buf, r.ptr);
}

// ---------------------------------------------------------------------------------------------------------------
// Units of a column.

enum class FileUnit { none, kg, lb, cm, mm, m, in, deg };

struct UnitSuffix {
  std::string_view suffix;
  FileUnit unit;
  CsvValueKind kind;
};
constexpr UnitSuffix unit_suffixes[] = {
    {"deg", FileUnit::deg, CsvValueKind::angle}, {"kg", FileUnit::kg, CsvValueKind::mass},
    {"lb", FileUnit::lb, CsvValueKind::mass},    {"cm", FileUnit::cm, CsvValueKind::length},
    {"mm", FileUnit::mm, CsvValueKind::length},  {"m", FileUnit::m, CsvValueKind::length},
    {"in", FileUnit::in, CsvValueKind::length},
};

std::string_view unit_name(FileUnit u) {
  switch (u) {
    case FileUnit::kg:
      return "kg";
    case FileUnit::lb:
      return "lb";
    case FileUnit::cm:
      return "cm";
    case FileUnit::mm:
      return "mm";
    case FileUnit::m:
      return "m";
    case FileUnit::in:
      return "in";
    case FileUnit::deg:
      return "deg";
    case FileUnit::none:
      return "";
  }
  return "";
}

/// A bound given in kg or cm, in the column's unit.
double from_metric(double x, FileUnit to) {
  switch (to) {
    case FileUnit::lb:
      return x / kg_per_lb;
    case FileUnit::mm:
      return x * 10.0;
    case FileUnit::m:
      return x / 100.0;
    case FileUnit::in:
      return x / cm_per_in;
    default:
      return x;
  }
}

FileUnit implied_unit(CsvValueKind kind, UnitSystem u) {
  if (kind == CsvValueKind::mass) return u == UnitSystem::metric ? FileUnit::kg : FileUnit::lb;
  return u == UnitSystem::metric ? FileUnit::cm : FileUnit::in;
}

/// A value in the file's unit, in the project's units (exact constants of quantities.hpp; mm and m via cm).
double to_project_units(double x, FileUnit from, UnitSystem project) {
  switch (from) {
    case FileUnit::kg:
      return Mass{x, UnitSystem::metric}.in_units(project);
    case FileUnit::lb:
      return Mass{x, UnitSystem::us}.in_units(project);
    case FileUnit::cm:
      return Length{x, UnitSystem::metric}.in_units(project);
    case FileUnit::mm:
      return Length{x / 10.0, UnitSystem::metric}.in_units(project);
    case FileUnit::m:
      return Length{x * 100.0, UnitSystem::metric}.in_units(project);
    case FileUnit::in:
      return Length{x, UnitSystem::us}.in_units(project);
    case FileUnit::deg:
    case FileUnit::none:
      return x;
  }
  return x;
}

/// Lengths and masses: their unit comes from the header or from the options.
bool is_quantity(CsvValueKind k) {
  return k == CsvValueKind::mass || k == CsvValueKind::length;
}

/// A numeric range; the lower end may be open, either may be absent. For lengths and masses the bounds are in cm
/// and kg, whatever the column's unit.
struct Range {
  std::optional<double> min;
  std::optional<double> max;
  bool min_exclusive = false;
  std::string_view what = "a number";

  Range in(FileUnit u) const {
    Range r = *this;
    if (min) r.min = from_metric(*min, u);
    if (max) r.max = from_metric(*max, u);
    return r;
  }
};

/// What a value must be, as a phrase: "a number greater than 0 kg".
std::string describe(const Range& r, std::string_view unit) {
  const std::string u = unit.empty() ? std::string() : " " + std::string(unit);
  std::string s(r.what);
  if (r.min && r.max && r.min_exclusive)
    s += " greater than " + fmt_num(*r.min) + " and at most " + fmt_num(*r.max) + u;
  else if (r.min && r.max)
    s += " from " + fmt_num(*r.min) + " to " + fmt_num(*r.max) + u;
  else if (r.min)
    s += std::string(r.min_exclusive ? " greater than " : " of at least ") + fmt_num(*r.min) + u;
  else if (!u.empty())
    s += ", in" + u;
  return s;
}

// ---------------------------------------------------------------------------------------------------------------
// A table of named columns over the records of one file.

constexpr std::size_t find_column(std::span<const CsvColumnSpec> specs, std::string_view name) {
  for (std::size_t i = 0; i < specs.size(); ++i)
    if (specs[i].name == name) return i;
  throw "no such column";  // only ever evaluated at compile time
}

std::optional<std::size_t> find_name(std::span<const CsvColumnSpec> specs, std::string_view name) {
  for (std::size_t i = 0; i < specs.size(); ++i) {
    if (specs[i].name == name) return i;
    for (auto a : split_names(specs[i].aliases))
      if (a == name) return i;
  }
  return std::nullopt;
}

/// The column a normalised header names: whole first, then with a unit suffix split off (`suffix` set).
std::optional<std::size_t> resolve_header(std::span<const CsvColumnSpec> specs, const std::string& name,
                                          const UnitSuffix*& suffix) {
  suffix = nullptr;
  if (auto spec = find_name(specs, name)) return spec;
  for (const UnitSuffix& us : unit_suffixes) {
    const std::string tail = "_" + std::string(us.suffix);
    if (name.size() <= tail.size() || name.compare(name.size() - tail.size(), tail.size(), tail) != 0) continue;
    if (auto spec = find_name(specs, std::string_view(name).substr(0, name.size() - tail.size()))) {
      suffix = &us;
      return spec;
    }
  }
  return std::nullopt;
}

struct MappedColumn {
  std::size_t index = 0;  ///< 0-based position in the file
  std::string header;     ///< as written in the file
  FileUnit unit = FileUnit::none;
};

class Table {
 public:
  Table(std::string file, std::string_view what, std::span<const CsvColumnSpec> specs, UnitSystem project,
        const CsvOptions& options, std::vector<Problem>& problems, std::vector<Problem>& warnings)
      : file_(std::move(file)),
        what_(what),
        specs_(specs),
        project_(project),
        options_(options),
        problems_(problems),
        warnings_(warnings),
        columns_(specs.size()) {}

  void read_header(const CsvRecord& header) {
    header_size_ = header.cells.size();
    header_line_ = header.line;
    std::vector<bool> reported(specs_.size(), false);  // a column whose header already has a problem
    for (std::size_t j = 0; j < header.cells.size(); ++j) {
      const std::string original(trim(header.cells[j].text));
      const std::string path = cell_path(header.cells[j].line, j + 1, original);
      const auto chosen = options_.column_names.find(j);
      if (chosen != options_.column_names.end() && trim(chosen->second).empty()) continue;  // left out by the user
      const std::string name = normalise_header(chosen != options_.column_names.end() ? chosen->second : original);
      FileUnit unit = FileUnit::none;
      const UnitSuffix* suffix = nullptr;
      std::optional<std::size_t> spec = resolve_header(specs_, name, suffix);
      if (!spec) {
        unknown_column(path, original, name);
        continue;
      }
      const CsvColumnSpec& s = specs_[*spec];
      if (suffix) {
        if (s.kind != suffix->kind) {
          add("wrong_unit", path, quote_value(original),
              "column " + std::string(s.name) + " " + kind_words(s.kind) + "; " + std::string(suffix->suffix) +
                  " is a unit of " +
                  (suffix->kind == CsvValueKind::mass     ? "mass (kg, lb)"
                   : suffix->kind == CsvValueKind::length ? "length (cm, mm, m, in)"
                                                          : "angle (deg)"));
          reported[*spec] = true;
          continue;
        }
        unit = suffix->unit;
      }
      if (columns_[*spec]) {
        add("duplicate_column", path, quote_value(original),
            "names the same column (" + std::string(s.name) + ") as column " +
                std::to_string(columns_[*spec]->index + 1) + "; give it once");
        continue;
      }
      if (is_quantity(s.kind) && unit == FileUnit::none) {
        if (!options_.units) {
          const std::string units = s.kind == CsvValueKind::mass
                                        ? name + "_kg or " + name + "_lb"
                                        : name + "_cm, " + name + "_mm, " + name + "_m or " + name + "_in";
          add("missing_unit", path, quote_value(original),
              "has no unit: name the column " + units + ", or choose the units of such columns on import");
          reported[*spec] = true;
          continue;
        }
        unit = implied_unit(s.kind, *options_.units);
      }
      columns_[*spec] = MappedColumn{j, original, unit};
    }
    for (std::size_t i = 0; i < specs_.size(); ++i) {
      if (!specs_[i].required || columns_[i] || reported[i]) continue;
      std::string rule = "the " + std::string(what_) + " needs a column " + std::string(specs_[i].name);
      std::string names;
      for (auto a : split_names(specs_[i].aliases)) names += (names.empty() ? "" : ", ") + std::string(a);
      if (!names.empty()) rule += " (also accepted: " + names + ")";
      if (is_quantity(specs_[i].kind))
        rule += std::string(", with a unit suffix such as ") + std::string(specs_[i].name) +
                (specs_[i].kind == CsvValueKind::mass ? "_kg" : "_cm");
      add("missing_column", "line " + std::to_string(header_line_), "", rule);
    }
  }

  /// Starts a row; false (with a problem) if it has the wrong number of cells.
  bool begin_row(const CsvRecord& r) {
    row_ = &r;
    row_ok_ = true;
    if (r.cells.size() == header_size_) return true;
    if (r.cells.size() > header_size_) {
      add("parse_error", cell_path(r.cells[header_size_].line, header_size_ + 1),
          quote_value(cell_value(r.cells[header_size_].text)),
          "this row has " + std::to_string(r.cells.size()) + " cells and the header " + std::to_string(header_size_) +
              " (is a comma in a cell not quoted?)");
    } else {
      add("parse_error", "line " + std::to_string(r.line), "",
          "this row has " + std::to_string(r.cells.size()) + " cells and the header " + std::to_string(header_size_));
    }
    return false;
  }
  bool row_ok() const { return row_ok_; }
  std::size_t row_line() const { return row_->line; }

  bool has(std::size_t spec) const { return columns_[spec].has_value(); }
  /// The physical line of the cell (the column must be present).
  std::size_t line(std::size_t spec) const { return row_->cells[columns_[spec]->index].line; }
  std::string path(std::size_t spec) const {
    const MappedColumn& c = *columns_[spec];
    return cell_path(row_->cells[c.index].line, c.index + 1, c.header);
  }
  /// The cell's value, trimmed and with csv_cell()'s apostrophe undone; nullopt if the column is absent.
  std::optional<std::string> raw(std::size_t spec) {
    if (!columns_[spec]) {
      if (specs_[spec].required) row_ok_ = false;
      return std::nullopt;
    }
    std::string v = cell_value(row_->cells[columns_[spec]->index].text);
    if (!valid_utf8(v)) {
      add("invalid_value", path(spec), quote_value(v), "must be UTF-8 text (save the file as UTF-8)");
      return std::nullopt;
    }
    return v;
  }
  /// A value that is present: nullopt for an absent column or an empty cell (a problem if required). `what()`
  /// says what the value must be, as a phrase ("a number greater than 0 kg"); it is worded only for a problem.
  template <class What>
  std::optional<std::string> present(std::size_t spec, const What& what) {
    auto v = raw(spec);
    if (!v) return std::nullopt;
    if (v->empty()) {
      if (specs_[spec].required) add("empty", path(spec), "", "must not be empty: it must be " + what());
      return std::nullopt;
    }
    return v;
  }

  std::optional<std::string> text(std::size_t spec) {
    return present(spec, [] { return std::string("an id or a name"); });
  }

  /// A number in the column's unit, range-checked there and returned in the project's units.
  std::optional<double> number(std::size_t spec, const Range& metric_range) {
    const FileUnit unit = columns_[spec] ? columns_[spec]->unit : FileUnit::none;
    const Range range = metric_range.in(unit);
    const auto what = [&] { return describe(range, unit_name(unit)); };
    auto v = present(spec, what);
    if (!v) return std::nullopt;
    double x = 0.0;
    const auto [ptr, ec] = std::from_chars(v->data(), v->data() + v->size(), x);
    if (ec != std::errc() || ptr != v->data() + v->size() || !std::isfinite(x)) {
      add("wrong_type", path(spec), quote_value(*v), "must be " + what());
      return std::nullopt;
    }
    if ((range.min && (range.min_exclusive ? x <= *range.min : x < *range.min)) || (range.max && x > *range.max)) {
      add("out_of_range", path(spec), quote_value(*v), "must be " + what());
      return std::nullopt;
    }
    return to_project_units(x, unit, project_);
  }

  std::optional<long long> whole(std::size_t spec, long long min, long long max) {
    const auto what = [&] { return "a whole number from " + std::to_string(min) + " to " + std::to_string(max); };
    auto v = present(spec, what);
    if (!v) return std::nullopt;
    long long x = 0;
    const auto [ptr, ec] = std::from_chars(v->data(), v->data() + v->size(), x);
    const bool whole_text = ptr == v->data() + v->size();
    if (whole_text && (ec == std::errc::result_out_of_range || (ec == std::errc() && (x < min || x > max)))) {
      add("out_of_range", path(spec), quote_value(*v), "must be " + what());
      return std::nullopt;
    }
    if (ec != std::errc() || !whole_text) {
      add("wrong_type", path(spec), quote_value(*v), "must be " + what());
      return std::nullopt;
    }
    return x;
  }

  /// One of `choices` (any letter case); returns its index.
  std::optional<std::size_t> choice(std::size_t spec, std::initializer_list<std::string_view> choices) {
    const auto what = [&] {
      std::string list;
      for (auto c : choices) list += (list.empty() ? "" : ", ") + std::string(c);
      return "one of " + list;
    };
    auto v = present(spec, what);
    if (!v) return std::nullopt;
    const std::string low = lower_ascii(*v);
    std::size_t i = 0;
    for (auto c : choices) {
      if (low == c) return i;
      ++i;
    }
    add("invalid_value", path(spec), quote_value(*v), "must be " + what());
    return std::nullopt;
  }

  std::optional<bool> boolean(std::size_t spec) {
    auto i = choice(spec, {"yes", "no", "true", "false", "1", "0"});
    if (!i) return std::nullopt;
    return *i % 2 == 0;
  }

  /// A problem that belongs to the current row.
  void add(std::string code, std::string path, std::string value, std::string rule) {
    problems_.emplace_back(std::move(code), std::move(path), std::move(value), std::move(rule), "", file_);
    row_ok_ = false;
  }

 private:

  void unknown_column(const std::string& path, const std::string& original, const std::string& name) {
    std::string suggestion;
    std::size_t best = 3;
    for (const CsvColumnSpec& s : specs_) {
      std::vector<std::string_view> names = split_names(s.aliases);
      names.insert(names.begin(), s.name);
      for (auto n : names) {
        std::string_view base = name;
        for (const UnitSuffix& us : unit_suffixes) {  // compare without a unit suffix
          const std::string tail = "_" + std::string(us.suffix);
          if (base.size() > tail.size() && base.substr(base.size() - tail.size()) == tail) {
            base.remove_suffix(tail.size());
            break;
          }
        }
        const std::size_t d = std::min(calc_edit_distance(name, n), calc_edit_distance(base, n));
        if (d < best) best = d, suggestion = std::string(s.name);
      }
    }
    std::string rule = original.empty() ? "a column must have a name" : "is not a column of a " + std::string(what_);
    if (!suggestion.empty()) rule += " (did you mean " + suggestion + "?)";
    if (options_.ignore_unknown_columns) {
      warnings_.emplace_back("unknown_column", path, quote_value(original), rule + "; the column is ignored", "",
                             file_);
    } else {
      problems_.emplace_back("unknown_column", path, quote_value(original),
                             rule + "; rename it, remove it, or import with unknown columns ignored", "", file_);
    }
  }

  static std::string kind_words(CsvValueKind k) {
    switch (k) {
      case CsvValueKind::mass:
        return "is a mass";
      case CsvValueKind::length:
        return "is a length";
      case CsvValueKind::angle:
        return "is an angle";
      default:
        return "takes no unit";
    }
  }

  std::string file_;
  std::string_view what_;
  std::span<const CsvColumnSpec> specs_;
  UnitSystem project_;
  CsvOptions options_;
  std::vector<Problem>& problems_;
  std::vector<Problem>& warnings_;
  std::vector<std::optional<MappedColumn>> columns_;
  std::size_t header_size_ = 0;
  std::size_t header_line_ = 1;
  const CsvRecord* row_ = nullptr;
  bool row_ok_ = true;
};

bool blank(const CsvRecord& r) {
  return std::all_of(r.cells.begin(), r.cells.end(), [](const CsvCell& c) { return trim(c.text).empty(); });
}

/// The records of a file after its header, or nothing (with a problem) when there is no header or no row.
struct Body {
  const CsvRecord* header = nullptr;
  std::vector<const CsvRecord*> rows;
};

Body split_body(const CsvText& csv, std::string_view what, const std::string& file, std::vector<Problem>& problems) {
  Body b;
  for (const CsvRecord& r : csv.records) {
    if (blank(r)) continue;
    if (!b.header)
      b.header = &r;
    else
      b.rows.push_back(&r);
  }
  if (csv.error) problems.push_back(*csv.error);
  if (!b.header && !csv.error)
    problems.emplace_back("empty", "", "", "the " + std::string(what) + " is empty: it needs a header row", "", file);
  else if (b.header && b.rows.empty() && !csv.error)
    problems.emplace_back("empty", "line " + std::to_string(b.header->line + 1), "",
                          "the " + std::string(what) + " has a header and no rows", "", file);
  return b;
}

// Column indices, checked against the tables when compiled.
namespace pc {
constexpr std::size_t id = find_column(part_csv_columns, "id");
constexpr std::size_t family = find_column(part_csv_columns, "family");
constexpr std::size_t description = find_column(part_csv_columns, "description");
constexpr std::size_t unit_weight = find_column(part_csv_columns, "unit_weight");
constexpr std::size_t width = find_column(part_csv_columns, "box.width");
constexpr std::size_t depth = find_column(part_csv_columns, "box.depth");
constexpr std::size_t height = find_column(part_csv_columns, "box.height");
constexpr std::size_t coupling = find_column(part_csv_columns, "coupling");
constexpr std::size_t handhold = find_column(part_csv_columns, "handhold.kind");
constexpr std::size_t optimal = find_column(part_csv_columns, "handhold.optimal");
constexpr std::size_t fingers = find_column(part_csv_columns, "handhold.fingers_flex_90");
constexpr std::size_t per_kit = find_column(part_csv_columns, "pieces_per_kit");
constexpr std::size_t per_grasp = find_column(part_csv_columns, "pieces_per_grasp");
constexpr std::size_t pack_pieces = find_column(part_csv_columns, "pack_pieces");
constexpr std::size_t truck_only = find_column(part_csv_columns, "truck_only");
constexpr std::size_t grip_height = find_column(part_csv_columns, "grip_height");
}  // namespace pc

namespace sc {
constexpr std::size_t id = find_column(slot_csv_columns, "id");
constexpr std::size_t part = find_column(slot_csv_columns, "part");
constexpr std::size_t rack = find_column(slot_csv_columns, "rack");
constexpr std::size_t level = find_column(slot_csv_columns, "level");
constexpr std::size_t bay = find_column(slot_csv_columns, "bay");
constexpr std::size_t position = find_column(slot_csv_columns, "position");
constexpr std::size_t fixed = find_column(slot_csv_columns, "fixed");
constexpr std::size_t origin_angle = find_column(slot_csv_columns, "origin_angle");
constexpr std::size_t standing_distance = find_column(slot_csv_columns, "standing_distance");
}  // namespace sc

constexpr Range box_side{0.0, input_limits::max_box_side_cm, true};  // cm

std::optional<std::string> read_file(const std::string& file, std::vector<Problem>& problems) {
  return input_limits::read_input_file(file, input_limits::max_csv_file_bytes, problems, file);
}

std::string duplicate_rule(std::string_view what, const std::string& id, std::size_t first_line) {
  return "must be unique: " + std::string(what) + " " + quote_value(id) + " is already on line " +
         std::to_string(first_line);
}

}  // namespace

// -----------------------------------------------------------------------------------------------------------------

PartsCsv load_parts_csv_text(std::string_view text, const std::string& file_name, UnitSystem project_units,
                             const CsvOptions& options) {
  PartsCsv out;
  const CsvText csv = read_csv(text, file_name);
  const Body body = split_body(csv, "part master", file_name, out.problems);
  if (!body.header) return out;
  Table t(file_name, "part master", part_csv_columns, project_units, options, out.problems, out.warnings);
  t.read_header(*body.header);
  std::map<std::string, std::size_t> first_line;
  for (const CsvRecord* r : body.rows) {
    if (!t.begin_row(*r)) continue;
    Part p;
    const auto id = t.text(pc::id);
    if (id) {
      p.id = *id;
      const auto [it, fresh] = first_line.emplace(*id, t.line(pc::id));
      if (!fresh) t.add("duplicate_id", t.path(pc::id), quote_value(*id), duplicate_rule("part", *id, it->second));
    }
    p.family = t.text(pc::family).value_or("");
    p.description = t.text(pc::description).value_or("");
    if (auto w = t.number(pc::unit_weight, Range{0.0, input_limits::max_mass_kg, true})) p.unit_weight = *w;
    const auto w = t.number(pc::width, box_side);
    const auto d = t.number(pc::depth, box_side);
    const auto h = t.number(pc::height, box_side);
    if (w) p.box.width = *w;
    if (d) p.box.depth = *d;
    if (h) p.box.height = *h;
    if (auto c = t.choice(pc::coupling, {"good", "fair", "poor"})) p.coupling = static_cast<Coupling>(*c);
    const auto kind = t.choice(pc::handhold, {"handles", "cutouts", "none"});
    const auto optimal = t.boolean(pc::optimal);
    const auto fingers = t.boolean(pc::fingers);
    if (kind) {
      Handhold hh;
      hh.kind = static_cast<HandholdKind>(*kind);
      hh.optimal = optimal.value_or(false);
      hh.fingers_flex_90 = fingers.value_or(false);
      if (p.coupling)
        t.add("invalid_value", t.path(pc::handhold), quote_value(*t.raw(pc::handhold)),
              "give either coupling or handhold.kind on a row, not both (the coupling class follows from the "
              "handhold)");
      if (hh.optimal && hh.kind == HandholdKind::none)
        t.add("invalid_value", t.path(pc::optimal), quote_value(*t.raw(pc::optimal)),
              "an optimal handhold needs handhold.kind handles or cutouts; this row says none");
      p.handhold = hh;
    } else if (!t.has(pc::handhold) || t.raw(pc::handhold).value_or("").empty()) {
      for (std::size_t spec : {pc::optimal, pc::fingers}) {
        if (t.has(spec) && !t.raw(spec).value_or("").empty())
          t.add("invalid_value", t.path(spec), quote_value(*t.raw(spec)),
                "needs handhold.kind (handles, cutouts or none) on the same row");
      }
    }
    if (auto n = t.number(pc::per_kit, Range{0.0, input_limits::max_pieces, true})) p.pieces_per_kit = *n;
    if (auto n = t.number(pc::per_grasp, Range{0.0, input_limits::max_pieces, true})) p.pieces_per_grasp = *n;
    if (auto n = t.whole(pc::pack_pieces, 1, input_limits::max_pack_pieces)) p.pack_pieces = static_cast<int>(*n);
    if (auto b = t.boolean(pc::truck_only)) p.truck_only = *b;
    if (auto g = t.number(pc::grip_height, Range{0.0, std::nullopt, false})) {
      if (h && *g > *h)
        t.add("out_of_range", t.path(pc::grip_height), quote_value(*t.raw(pc::grip_height)),
              "must be at most the box's height (box.height on this row): the grip is measured up from the base");
      p.grip_height = *g;
    }
    if (t.row_ok())
      out.parts.push_back(std::move(p));
    else if (id)
      out.rejected_ids.push_back(*id);
  }
  return out;
}

PartsCsv load_parts_csv(const std::string& file, UnitSystem project_units, const CsvOptions& options) {
  PartsCsv out;
  const auto text = read_file(file, out.problems);
  if (!text) return out;
  return load_parts_csv_text(*text, file, project_units, options);
}

SlotsCsv load_slots_csv_text(std::string_view text, const std::string& file_name, UnitSystem project_units,
                             const CsvOptions& options) {
  SlotsCsv out;
  const CsvText csv = read_csv(text, file_name);
  const Body body = split_body(csv, "slot list", file_name, out.problems);
  if (!body.header) return out;
  Table t(file_name, "slot list", slot_csv_columns, project_units, options, out.problems, out.warnings);
  t.read_header(*body.header);
  std::map<std::string, std::size_t> first_line;
  for (const CsvRecord* r : body.rows) {
    if (!t.begin_row(*r)) continue;
    Slot s;
    const auto id = t.text(sc::id);
    if (id) {
      s.id = *id;
      const auto [it, fresh] = first_line.emplace(*id, t.line(sc::id));
      if (!fresh) t.add("duplicate_id", t.path(sc::id), quote_value(*id), duplicate_rule("slot", *id, it->second));
    }
    if (auto v = t.text(sc::part)) s.part = *v;
    if (auto v = t.text(sc::rack)) s.rack = *v;
    if (auto v = t.text(sc::level)) s.level = *v;
    if (auto b = t.whole(sc::bay, 1, 1000000)) s.bay = static_cast<int>(*b);
    if (auto p = t.choice(sc::position, {"front", "back"})) s.position = static_cast<SlotPosition>(*p);
    if (auto f = t.boolean(sc::fixed)) s.fixed = *f;
    s.origin_angle_deg = t.number(sc::origin_angle, Range{0.0, 180.0, false});
    s.standing_distance = t.number(sc::standing_distance, Range{0.0, input_limits::max_standing_distance_cm, false});
    if (t.row_ok()) {
      out.part_cell_paths.push_back(t.path(sc::part));
      out.slots.push_back(std::move(s));
    }
  }
  return out;
}

SlotsCsv load_slots_csv(const std::string& file, UnitSystem project_units, const CsvOptions& options) {
  SlotsCsv out;
  const auto text = read_file(file, out.problems);
  if (!text) return out;
  return load_slots_csv_text(*text, file, project_units, options);
}

CsvImport import_store_csv(const std::string& parts_file, const std::string& slots_file, UnitSystem project_units,
                           const CsvOptions& options) {
  return check_store_csv(load_parts_csv(parts_file, project_units, options), parts_file,
                         load_slots_csv(slots_file, project_units, options), slots_file);
}

CsvImport check_store_csv(PartsCsv parts, const std::string& parts_file, SlotsCsv slots, const std::string& slots_file) {
  CsvImport out;
  out.problems = std::move(parts.problems);
  out.warnings = std::move(parts.warnings);
  out.problems.insert(out.problems.end(), slots.problems.begin(), slots.problems.end());
  out.warnings.insert(out.warnings.end(), slots.warnings.begin(), slots.warnings.end());
  // Cross-check only against a part master that could be read at all; otherwise every slot would be reported.
  const bool master_read = !parts.parts.empty() || !parts.rejected_ids.empty();
  if (master_read) {
    std::set<std::string> known(parts.rejected_ids.begin(), parts.rejected_ids.end());
    for (const Part& p : parts.parts) known.insert(p.id);
    for (std::size_t i = 0; i < slots.slots.size(); ++i) {
      const Slot& s = slots.slots[i];
      if (known.count(s.part)) continue;
      out.problems.emplace_back("unknown_reference", slots.part_cell_paths[i], quote_value(s.part),
                                "must be a part of the part master " + parts_file, "", slots_file);
    }
  }
  out.parts = std::move(parts.parts);
  out.slots = std::move(slots.slots);
  return out;
}

// -----------------------------------------------------------------------------------------------------------------

namespace {

std::string header_row(std::span<const CsvColumnSpec> specs, UnitSystem units) {
  std::string s;
  for (const CsvColumnSpec& c : specs) {
    if (!s.empty()) s += ',';
    std::string name(c.name);
    if (c.kind == CsvValueKind::mass) name += "_" + std::string(mass_unit(units));
    if (c.kind == CsvValueKind::length) name += "_" + std::string(length_unit(units));
    if (c.kind == CsvValueKind::angle) name += "_deg";
    s += csv_cell(name);
  }
  return s + "\n";
}

std::string yes_no(bool b) {
  return b ? "yes" : "no";
}
std::string opt_num(const std::optional<double>& x) {
  return x ? exact_num(*x) : std::string();
}

constexpr std::string_view handhold_kind_name(HandholdKind k) {
  switch (k) {
    case HandholdKind::handles:
      return "handles";
    case HandholdKind::cutouts:
      return "cutouts";
    case HandholdKind::none:
      return "none";
  }
  return "none";
}

void append_row(std::string& s, std::initializer_list<std::string> cells) {
  bool first = true;
  for (const std::string& c : cells) {
    if (!first) s += ',';
    s += csv_cell(c);
    first = false;
  }
  s += '\n';
}

}  // namespace

// The rows below list the cells in the tables' order; a column added to a table must be added there too.
static_assert(std::size(part_csv_columns) == 16 && std::size(slot_csv_columns) == 9);

std::string write_parts_csv(const std::vector<Part>& parts, UnitSystem units) {
  std::string s = header_row(part_csv_columns, units);
  for (const Part& p : parts) {
    const std::string coupling = p.coupling ? std::string(coupling_name(*p.coupling)) : std::string();
    const std::string kind = p.handhold ? std::string(handhold_kind_name(p.handhold->kind)) : std::string();
    const std::string optimal = p.handhold ? yes_no(p.handhold->optimal) : std::string();
    const std::string fingers = p.handhold ? yes_no(p.handhold->fingers_flex_90) : std::string();
    // The order of part_csv_columns.
    append_row(s, {p.id, p.family, p.description, exact_num(p.unit_weight), exact_num(p.box.width),
                   exact_num(p.box.depth), exact_num(p.box.height), coupling, kind, optimal, fingers,
                   exact_num(p.pieces_per_kit), exact_num(p.pieces_per_grasp), std::to_string(p.pack_pieces),
                   yes_no(p.truck_only), opt_num(p.grip_height)});
  }
  return s;
}

std::string write_slots_csv(const std::vector<Slot>& slots, UnitSystem units) {
  std::string s = header_row(slot_csv_columns, units);
  for (const Slot& sl : slots) {
    // The order of slot_csv_columns.
    append_row(s, {sl.id, sl.part, sl.rack, sl.level, std::to_string(sl.bay),
                   sl.position == SlotPosition::front ? "front" : "back", yes_no(sl.fixed),
                   opt_num(sl.origin_angle_deg), opt_num(sl.standing_distance)});
  }
  return s;
}

CsvPreview read_csv_preview(std::string_view text, const std::string& file_name, std::size_t max_rows) {
  CsvPreview out;
  const CsvText csv = read_csv(text, file_name);
  const Body body = split_body(csv, "file", file_name, out.problems);
  if (!body.header) return out;
  for (const CsvCell& c : body.header->cells) out.header.emplace_back(trim(c.text));
  out.total_rows = body.rows.size();
  for (const CsvRecord* r : body.rows) {
    if (out.rows.size() >= max_rows) break;
    CsvPreview::Row row;
    row.line = r->line;
    for (const CsvCell& c : r->cells) row.cells.push_back(cell_value(c.text));
    out.rows.push_back(std::move(row));
  }
  return out;
}

std::string match_csv_column(std::span<const CsvColumnSpec> columns, std::string_view header) {
  const UnitSuffix* suffix = nullptr;
  const auto spec = resolve_header(columns, normalise_header(trim(header)), suffix);
  if (!spec) return {};
  return std::string(columns[*spec].name) + (suffix ? "_" + std::string(suffix->suffix) : std::string());
}

}  // namespace rackreach
