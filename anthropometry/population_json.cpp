// SPDX-License-Identifier: MIT
#include "anthropometry/population_json.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <initializer_list>
#include <sstream>

#include <nlohmann/json.hpp>

#include "engine/io/input_limits.hpp"
#include "engine/io/json_reader.hpp"

namespace rackreach {
namespace {

using Json = nlohmann::ordered_json;
namespace lim = input_limits;
// The population file is walked by the same reader as the project file (engine/io/json_reader): one way of
// walking JSON and one way of reporting problems. ordered_json keeps the file's order of dimensions.
using Reader = BasicJsonReader<Json>;

bool matches_name(std::string_view s, std::size_t max_size, bool allow_dot_dash) {
  // [a-z][a-z0-9_]{0,max-1} for dimension keys; [a-z0-9][a-z0-9_.-]{0,max-1} for table names.
  if (s.empty() || s.size() > max_size) return false;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const char c = s[i];
    const bool lower = c >= 'a' && c <= 'z', digit = c >= '0' && c <= '9';
    const bool ok = i == 0 ? (lower || (allow_dot_dash && digit))
                           : (lower || digit || c == '_' || (allow_dot_dash && (c == '.' || c == '-')));
    if (!ok) return false;
  }
  return true;
}

bool is_hex64(std::string_view s) {
  if (s.size() != 64) return false;
  for (char c : s)
    if (!((c >= '0' && c <= '9') || (c >= 'a' && c <= 'f'))) return false;
  return true;
}

/// A required non-empty string; missing_key, wrong_type or empty as the reader reports them.
std::optional<std::string> text(Reader& r, const Json& obj, const JsonPath& path, const char* key, bool required) {
  return r.string(obj, path, key, required, true);
}

std::vector<std::string> strings_at(Reader& r, const Json& obj, const JsonPath& path, const char* key) {
  std::vector<std::string> out;
  const Json* list = r.member(obj, path, key, false);
  if (!list) return out;
  const JsonPath lp(path, key);
  if (!r.array(*list, lp, 0, "strings") || !r.at_most(*list, lp, lim::max_population_dimensions, "strings"))
    return out;
  for (std::size_t i = 0; i < list->size(); ++i)
    if (auto e = r.string_value((*list)[i], JsonPath(lp, i))) out.push_back(*e);
  return out;
}

std::optional<double> number_at(Reader& r, const Json& obj, const JsonPath& path, const char* key) {
  return r.number(obj, path, key, true, {});
}

std::optional<int> positive_int_at(Reader& r, const Json& obj, const JsonPath& path, const char* key) {
  const auto n = r.whole_number(obj, path, key, true, 1, 100000000);
  return n ? std::optional<int>(static_cast<int>(*n)) : std::nullopt;
}

// Known dimensions whose quantity (length or mass) is fixed; any other name may be either.
bool is_known_mass_dimension(const std::string& key) {
  return key == "body_mass";
}

std::optional<SexDistribution> read_distribution(Reader& r, const Json& j, const JsonPath& path,
                                                 std::size_t n_percentiles, int subjects) {
  if (!j.is_object()) {
    r.add("wrong_type", path, &j, "must be an object with n, mean, sd and quantiles");
    return std::nullopt;
  }
  r.object(j, path, {"n", "mean", "sd", "quantiles"});
  SexDistribution d;
  bool good = true;
  if (auto n = positive_int_at(r, j, path, "n")) {
    d.n = *n;
    if (*n > subjects) {
      r.add("out_of_range", JsonPath(path, "n"), &j["n"],
            "must be at most the " + std::to_string(subjects) + " subjects of this sex");
      good = false;
    }
  } else {
    good = false;
  }
  if (auto m = number_at(r, j, path, "mean"))
    d.mean = *m;
  else
    good = false;
  if (auto s = r.number(j, path, "sd", true, {0.0, std::nullopt, false, false, ""}))
    d.sd = *s;
  else
    good = false;
  const Json* q = r.member(j, path, "quantiles", true);
  if (!q) return std::nullopt;
  const JsonPath qpath(path, "quantiles");
  if (!q->is_array() || q->size() != n_percentiles) {
    r.add("wrong_type", qpath, nullptr,
          "must be a list of " + std::to_string(n_percentiles) + " numbers, one per entry of percentiles (it has " +
              (q->is_array() ? std::to_string(q->size()) : std::string("no list")) + ")");
    return std::nullopt;
  }
  for (std::size_t i = 0; i < q->size(); ++i) {
    const Json& e = (*q)[i];
    const JsonPath epath(qpath, i);
    if (!e.is_number() || !std::isfinite(e.get<double>())) {
      r.add("wrong_type", epath, &e, "must be a number");
      good = false;
      continue;
    }
    const double x = e.get<double>();
    if (!d.quantiles.empty() && x < d.quantiles.back()) {
      r.add("out_of_range", epath, &e,
            "must not be below the value before it (" + Json(d.quantiles.back()).dump() +
                "): a quantile function never decreases");
      good = false;
    }
    d.quantiles.push_back(x);
  }
  if (!good) return std::nullopt;
  return d;
}

std::optional<Dimension> read_dimension(Reader& r, const std::string& key, const Json& j, const JsonPath& path,
                                        std::size_t n_percentiles, std::optional<int> female, std::optional<int> male) {
  if (!matches_name(key, 64, false)) {
    r.add("invalid_value", path, nullptr, "name must be lowercase letters, digits and _ (starting with a letter)");
  }
  if (!j.is_object()) {
    r.add("wrong_type", path, &j, "must be an object");
    return std::nullopt;
  }
  r.object(j, path, {"label", "unit", "kind", "definition", "source_columns", "derivation", "note", "female", "male"});
  Dimension d;
  d.key = key;
  d.label = text(r, j, path, "label", true).value_or("");
  d.definition = text(r, j, path, "definition", true).value_or("");
  d.derivation = text(r, j, path, "derivation", false).value_or("");
  d.note = text(r, j, path, "note", false).value_or("");
  d.source_columns = strings_at(r, j, path, "source_columns");
  if (auto unit = text(r, j, path, "unit", true)) {
    if (auto u = find_table_unit(*unit)) {
      d.unit = *u;
      if (is_known_mass_dimension(key) != is_mass_unit(*u)) {
        r.add("invalid_value", JsonPath(path, "unit"), &j["unit"],
              is_known_mass_dimension(key) ? "must be a mass unit (kg or lb) for " + key
                                           : "must be a length unit (mm, cm or in) for " + key);
      }
    } else {
      r.add("invalid_value", JsonPath(path, "unit"), &j["unit"], "must be one of mm, cm, in, kg, lb");
    }
  }
  if (auto kind = text(r, j, path, "kind", true)) {
    if (*kind == "measured") {
      d.kind = DimensionKind::measured;
    } else if (*kind == "derived") {
      d.kind = DimensionKind::derived;
      if (d.derivation.empty() && !j.contains("derivation")) {
        r.add("missing_key", JsonPath(path, "derivation"), nullptr,
              "is required for a derived dimension (the per-subject formula)");
      }
    } else {
      r.add("invalid_value", JsonPath(path, "kind"), &j["kind"], "must be \"measured\" or \"derived\"");
    }
  }
  for (Sex s : {Sex::female, Sex::male}) {
    const std::string name(sex_name(s));
    const std::optional<int>& subjects = s == Sex::female ? female : male;
    auto it = j.find(name);
    const JsonPath sp(path, name);
    if (it == j.end()) {
      if (subjects) r.add("missing_key", sp, nullptr, "is required: subjects lists " + name + " subjects");
      continue;
    }
    if (!subjects) {
      r.add("invalid_value", sp, nullptr, "is not allowed: subjects lists no " + name + " subjects");
      continue;
    }
    auto dist = read_distribution(r, *it, sp, n_percentiles, *subjects);
    (s == Sex::female ? d.female : d.male) = std::move(dist);
  }
  return d;
}

std::optional<SourceFile> read_source_file(Reader& r, const Json& j, const JsonPath& path) {
  if (!j.is_object()) {
    r.add("wrong_type", path, &j, "must be an object with name, sex, bytes and sha256");
    return std::nullopt;
  }
  r.object(j, path, {"name", "sex", "bytes", "sha256"});
  SourceFile f;
  f.name = text(r, j, path, "name", true).value_or("");
  f.sex = text(r, j, path, "sex", true).value_or("");
  if (!f.sex.empty() && f.sex != "female" && f.sex != "male") {
    r.add("invalid_value", JsonPath(path, "sex"), &j["sex"], "must be \"female\" or \"male\"");
  }
  if (auto b = positive_int_at(r, j, path, "bytes")) f.bytes = *b;
  f.sha256 = text(r, j, path, "sha256", true).value_or("");
  if (!f.sha256.empty() && !is_hex64(f.sha256)) {
    r.add("invalid_value", JsonPath(path, "sha256"), &j["sha256"], "must be 64 lowercase hexadecimal digits");
  }
  return f;
}

void read_table(Reader& r, const Json& root, PopulationTable& t) {
  const JsonPath top;
  if (!root.is_object()) {
    r.add("wrong_type", top, &root, "must hold one JSON object");
    return;
  }
  r.object(root, top,
           {"rackreach_population", "name", "title", "citation", "survey", "subjects", "source_files", "generated_by",
            "method", "caveats", "percentiles", "dimensions"});
  if (const Json* ver = r.member(root, top, "rackreach_population", true)) {
    if (!ver->is_number_integer() || ver->get<long long>() != population_format_version) {
      r.add("invalid_value", JsonPath(top, "rackreach_population"), ver,
            "must be 1 (the format version this program reads)");
    }
  }
  if (auto name = text(r, root, top, "name", true)) {
    if (!matches_name(*name, 40, true)) {
      r.add("invalid_value", JsonPath(top, "name"), &root["name"],
            "must be 1 to 40 lowercase letters, digits, '_', '.' or '-'");
    }
    t.name = *name;
  }
  t.title = text(r, root, top, "title", true).value_or("");
  t.citation = text(r, root, top, "citation", true).value_or("");
  t.survey = text(r, root, top, "survey", true).value_or("");
  t.generated_by = text(r, root, top, "generated_by", false).value_or("");
  t.method = strings_at(r, root, top, "method");
  t.caveats = strings_at(r, root, top, "caveats");

  if (const Json* subjects = r.member(root, top, "subjects", true)) {
    const JsonPath sp(top, "subjects");
    if (!subjects->is_object() || subjects->empty()) {
      r.add("wrong_type", sp, subjects, "must be an object giving the number of female and/or male subjects");
    } else {
      r.object(*subjects, sp, {"female", "male"});
      if (subjects->contains("female")) t.subjects_female = positive_int_at(r, *subjects, sp, "female");
      if (subjects->contains("male")) t.subjects_male = positive_int_at(r, *subjects, sp, "male");
    }
  }
  if (const Json* files = r.member(root, top, "source_files", false)) {
    const JsonPath fp(top, "source_files");
    if (!files->is_array()) {
      r.add("wrong_type", fp, files, "must be a list of objects");
    } else if (r.at_most(*files, fp, lim::max_population_dimensions, "files")) {
      for (std::size_t i = 0; i < files->size(); ++i) {
        if (auto f = read_source_file(r, (*files)[i], JsonPath(fp, i))) t.source_files.push_back(*f);
      }
    }
  }

  bool percentiles_ok = false;
  if (const Json* ps = r.member(root, top, "percentiles", true)) {
    const JsonPath pp(top, "percentiles");
    percentiles_ok = true;
    if (!ps->is_array() || ps->size() < 2) {
      r.add("wrong_type", pp, ps, "must be a list of at least 2 percentiles (0 to 100)");
      percentiles_ok = false;
    } else if (!r.at_most(*ps, pp, lim::max_population_percentiles, "percentiles")) {
      percentiles_ok = false;
    } else {
      for (std::size_t i = 0; i < ps->size(); ++i) {
        const Json& e = (*ps)[i];
        const JsonPath ep(pp, i);
        if (!e.is_number() || !(e.get<double>() >= 0.0 && e.get<double>() <= 100.0)) {
          r.add("out_of_range", ep, &e, "must be a number from 0 to 100");
          percentiles_ok = false;
          continue;
        }
        if (!t.percentiles.empty() && e.get<double>() <= t.percentiles.back()) {
          r.add("out_of_range", ep, &e,
                "must be greater than the percentile before it (" + Json(t.percentiles.back()).dump() + ")");
          percentiles_ok = false;
        }
        t.percentiles.push_back(e.get<double>());
      }
    }
  }

  const Json* dims = r.member(root, top, "dimensions", true);
  if (!dims) return;
  const JsonPath dp(top, "dimensions");
  if (!dims->is_object() || dims->empty()) {
    r.add("wrong_type", dp, dims, "must be an object with at least one dimension");
    return;
  }
  if (!r.at_most(*dims, dp, lim::max_population_dimensions, "dimensions")) return;
  if (!percentiles_ok) return;  // the quantile lists cannot be checked against a broken percentile list
  for (auto it = dims->begin(); it != dims->end(); ++it) {
    if (auto d = read_dimension(r, it.key(), it.value(), JsonPath(dp, it.key()), t.percentiles.size(),
                                t.subjects_female, t.subjects_male)) {
      t.dimensions.push_back(std::move(*d));
    }
  }
}

// Writer: objects indented, a list of numbers on one line, other lists one element per line.
void write_json(std::ostringstream& out, const Json& j, int indent) {
  const std::string pad(static_cast<std::size_t>(indent), ' ');
  const std::string inner(static_cast<std::size_t>(indent + 2), ' ');
  if (j.is_object() && !j.empty()) {
    out << "{\n";
    std::size_t i = 0;
    for (auto it = j.begin(); it != j.end(); ++it, ++i) {
      out << inner << Json(it.key()).dump() << ": ";
      write_json(out, it.value(), indent + 2);
      out << (i + 1 < j.size() ? ",\n" : "\n");
    }
    out << pad << "}";
  } else if (j.is_array() && !j.empty() &&
             !std::all_of(j.begin(), j.end(), [](const Json& e) { return e.is_number(); })) {
    out << "[\n";
    for (std::size_t i = 0; i < j.size(); ++i) {
      out << inner;
      write_json(out, j[i], indent + 2);
      out << (i + 1 < j.size() ? ",\n" : "\n");
    }
    out << pad << "]";
  } else {
    out << j.dump(-1, ' ', false, Json::error_handler_t::strict);
  }
}

Json to_json(const SexDistribution& d) {
  return Json{{"n", d.n}, {"mean", d.mean}, {"sd", d.sd}, {"quantiles", d.quantiles}};
}

}  // namespace

LoadedPopulation load_population_text(const std::string& text, const std::string& file_label) {
  LoadedPopulation out;
  if (const auto at = lim::find_json_depth_excess(text, lim::max_json_depth)) {
    out.problems.push_back(lim::too_deep_problem(text, *at, file_label));
    return out;
  }
  Json root;
  try {
    root = Json::parse(text);
  } catch (const Json::exception& e) {  // a syntax error, or a number too large for a double (out_of_range)
    out.problems.push_back({"parse_error", "", "", std::string("must be valid JSON: ") + e.what(), "", file_label});
    return out;
  }
  Reader r(out.problems);
  r.set_file(file_label);
  PopulationTable t;
  read_table(r, root, t);
  if (out.problems.empty()) out.table = std::move(t);
  return out;
}

LoadedPopulation load_population_file(const std::filesystem::path& path) {
  LoadedPopulation out;
  std::vector<Problem> problems;
  const auto text = lim::read_input_file(path.string(), lim::max_population_file_bytes, problems, path.string());
  if (!text) {
    // The file's own words for a file that cannot be opened, as before.
    for (Problem& p : problems)
      if (p.code == "file_error" && p.rule == "cannot open the file for reading") p.rule = "cannot be opened for reading";
    out.problems = std::move(problems);
    return out;
  }
  return load_population_text(*text, path.string());
}

std::string save_population_text(const PopulationTable& t) {
  Json root;
  root["rackreach_population"] = t.format_version;
  root["name"] = t.name;
  root["title"] = t.title;
  root["citation"] = t.citation;
  root["survey"] = t.survey;
  Json subjects = Json::object();
  if (t.subjects_female) subjects["female"] = *t.subjects_female;
  if (t.subjects_male) subjects["male"] = *t.subjects_male;
  root["subjects"] = subjects;
  if (!t.source_files.empty()) {
    Json files = Json::array();
    for (const SourceFile& f : t.source_files) {
      files.push_back(Json{{"name", f.name}, {"sex", f.sex}, {"bytes", f.bytes}, {"sha256", f.sha256}});
    }
    root["source_files"] = files;
  }
  if (!t.generated_by.empty()) root["generated_by"] = t.generated_by;
  if (!t.method.empty()) root["method"] = t.method;
  if (!t.caveats.empty()) root["caveats"] = t.caveats;
  root["percentiles"] = t.percentiles;
  Json dims = Json::object();
  for (const Dimension& d : t.dimensions) {
    Json j;
    j["label"] = d.label;
    j["unit"] = std::string(table_unit_name(d.unit));
    j["kind"] = d.kind == DimensionKind::measured ? "measured" : "derived";
    j["definition"] = d.definition;
    if (!d.source_columns.empty()) j["source_columns"] = d.source_columns;
    if (!d.derivation.empty()) j["derivation"] = d.derivation;
    if (!d.note.empty()) j["note"] = d.note;
    if (d.female) j["female"] = to_json(*d.female);
    if (d.male) j["male"] = to_json(*d.male);
    dims[d.key] = j;
  }
  root["dimensions"] = dims;
  std::ostringstream out;
  write_json(out, root, 0);
  out << "\n";
  return out.str();
}

}  // namespace rackreach
