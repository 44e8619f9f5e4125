// SPDX-License-Identifier: MIT
#include "anthropometry/population_json.hpp"

#include <algorithm>
#include <cmath>
#include <fstream>
#include <initializer_list>
#include <regex>
#include <sstream>

#include <nlohmann/json.hpp>

namespace rackreach {
namespace {

using Json = nlohmann::ordered_json;

// Collects problems for one file while walking its JSON.
class Validator {
 public:
  explicit Validator(std::string file) : file_(std::move(file)) {}

  void add(const char* code, const std::string& path, const Json* value, const std::string& rule) {
    problems_.push_back({code, path, value ? value->dump() : std::string(), rule, "", file_});
  }
  std::vector<Problem> take() { return std::move(problems_); }
  bool ok() const { return problems_.empty(); }

  void check_keys(const Json& obj, const std::string& path, std::initializer_list<const char*> allowed) {
    for (auto it = obj.begin(); it != obj.end(); ++it) {
      bool known = false;
      for (const char* a : allowed) known = known || it.key() == a;
      if (!known) add("unknown_key", join(path, it.key()), &it.value(), "is not a known field here (allowed: " + list(allowed) + ")");
    }
  }

  const Json* require(const Json& obj, const std::string& path, const char* key) {
    auto it = obj.find(key);
    if (it == obj.end()) {
      add("missing_key", join(path, key), nullptr, "is required");
      return nullptr;
    }
    return &*it;
  }

  std::optional<std::string> string_at(const Json& obj, const std::string& path, const char* key, bool required) {
    auto it = obj.find(key);
    if (it == obj.end()) {
      if (required) add("missing_key", join(path, key), nullptr, "is required");
      return std::nullopt;
    }
    if (!it->is_string() || it->get<std::string>().empty()) {
      add("wrong_type", join(path, key), &*it, "must be a non-empty string");
      return std::nullopt;
    }
    return it->get<std::string>();
  }

  std::vector<std::string> strings_at(const Json& obj, const std::string& path, const char* key) {
    std::vector<std::string> out;
    auto it = obj.find(key);
    if (it == obj.end()) return out;
    if (!it->is_array()) {
      add("wrong_type", join(path, key), &*it, "must be a list of strings");
      return out;
    }
    for (std::size_t i = 0; i < it->size(); ++i) {
      const Json& e = (*it)[i];
      if (!e.is_string() || e.get<std::string>().empty()) {
        add("wrong_type", join(path, key) + "[" + std::to_string(i) + "]", &e, "must be a non-empty string");
      } else {
        out.push_back(e.get<std::string>());
      }
    }
    return out;
  }

  std::optional<double> number_at(const Json& obj, const std::string& path, const char* key) {
    const Json* v = require(obj, path, key);
    if (!v) return std::nullopt;
    if (!v->is_number() || !std::isfinite(v->get<double>())) {
      add("wrong_type", join(path, key), v, "must be a number");
      return std::nullopt;
    }
    return v->get<double>();
  }

  std::optional<int> positive_int_at(const Json& obj, const std::string& path, const char* key) {
    const Json* v = require(obj, path, key);
    if (!v) return std::nullopt;
    if (!v->is_number_integer() || v->get<long long>() < 1 || v->get<long long>() > 100000000) {
      add("out_of_range", join(path, key), v, "must be a whole number of at least 1");
      return std::nullopt;
    }
    return v->get<int>();
  }

  static std::string join(const std::string& path, const std::string& key) {
    return path.empty() ? key : path + "." + key;
  }

 private:
  static std::string list(std::initializer_list<const char*> names) {
    std::string out;
    for (const char* n : names) out += (out.empty() ? "" : ", ") + std::string(n);
    return out;
  }

  std::string file_;
  std::vector<Problem> problems_;
};

// Known dimensions whose quantity (length or mass) is fixed; any other name may be either.
bool is_known_mass_dimension(const std::string& key) {
  return key == "body_mass";
}

std::optional<SexDistribution> read_distribution(Validator& v, const Json& j, const std::string& path,
                                                 std::size_t n_percentiles, int subjects) {
  if (!j.is_object()) {
    v.add("wrong_type", path, &j, "must be an object with n, mean, sd and quantiles");
    return std::nullopt;
  }
  v.check_keys(j, path, {"n", "mean", "sd", "quantiles"});
  SexDistribution d;
  bool good = true;
  if (auto n = v.positive_int_at(j, path, "n")) {
    d.n = *n;
    if (*n > subjects) {
      v.add("out_of_range", path + ".n", &j["n"], "must be at most the " + std::to_string(subjects) + " subjects of this sex");
      good = false;
    }
  } else {
    good = false;
  }
  if (auto m = v.number_at(j, path, "mean"))
    d.mean = *m;
  else
    good = false;
  if (auto s = v.number_at(j, path, "sd")) {
    d.sd = *s;
    if (*s < 0.0) {
      v.add("out_of_range", path + ".sd", &j["sd"], "must be at least 0");
      good = false;
    }
  } else {
    good = false;
  }
  const Json* q = v.require(j, path, "quantiles");
  if (!q) return std::nullopt;
  const std::string qpath = path + ".quantiles";
  if (!q->is_array() || q->size() != n_percentiles) {
    v.add("wrong_type", qpath, nullptr,
          "must be a list of " + std::to_string(n_percentiles) + " numbers, one per entry of percentiles (it has " +
              (q->is_array() ? std::to_string(q->size()) : std::string("no list")) + ")");
    return std::nullopt;
  }
  for (std::size_t i = 0; i < q->size(); ++i) {
    const Json& e = (*q)[i];
    const std::string epath = qpath + "[" + std::to_string(i) + "]";
    if (!e.is_number() || !std::isfinite(e.get<double>())) {
      v.add("wrong_type", epath, &e, "must be a number");
      good = false;
      continue;
    }
    const double x = e.get<double>();
    if (!d.quantiles.empty() && x < d.quantiles.back()) {
      v.add("out_of_range", epath, &e,
            "must not be below the value before it (" + Json(d.quantiles.back()).dump() +
                "): a quantile function never decreases");
      good = false;
    }
    d.quantiles.push_back(x);
  }
  if (!good) return std::nullopt;
  return d;
}

std::optional<Dimension> read_dimension(Validator& v, const std::string& key, const Json& j, const std::string& path,
                                        std::size_t n_percentiles, std::optional<int> female, std::optional<int> male) {
  static const std::regex key_pattern("[a-z][a-z0-9_]{0,63}");
  if (!std::regex_match(key, key_pattern)) {
    v.add("invalid_value", path, nullptr, "name must be lowercase letters, digits and _ (starting with a letter)");
  }
  if (!j.is_object()) {
    v.add("wrong_type", path, &j, "must be an object");
    return std::nullopt;
  }
  v.check_keys(j, path,
               {"label", "unit", "kind", "definition", "source_columns", "derivation", "note", "female", "male"});
  Dimension d;
  d.key = key;
  d.label = v.string_at(j, path, "label", true).value_or("");
  d.definition = v.string_at(j, path, "definition", true).value_or("");
  d.derivation = v.string_at(j, path, "derivation", false).value_or("");
  d.note = v.string_at(j, path, "note", false).value_or("");
  d.source_columns = v.strings_at(j, path, "source_columns");
  if (auto unit = v.string_at(j, path, "unit", true)) {
    if (auto u = find_table_unit(*unit)) {
      d.unit = *u;
      if (is_known_mass_dimension(key) != is_mass_unit(*u)) {
        v.add("invalid_value", path + ".unit", &j["unit"],
              is_known_mass_dimension(key) ? "must be a mass unit (kg or lb) for " + key
                                           : "must be a length unit (mm, cm or in) for " + key);
      }
    } else {
      v.add("invalid_value", path + ".unit", &j["unit"], "must be one of mm, cm, in, kg, lb");
    }
  }
  if (auto kind = v.string_at(j, path, "kind", true)) {
    if (*kind == "measured") {
      d.kind = DimensionKind::measured;
    } else if (*kind == "derived") {
      d.kind = DimensionKind::derived;
      if (d.derivation.empty() && !j.contains("derivation")) {
        v.add("missing_key", path + ".derivation", nullptr, "is required for a derived dimension (the per-subject formula)");
      }
    } else {
      v.add("invalid_value", path + ".kind", &j["kind"], "must be \"measured\" or \"derived\"");
    }
  }
  for (Sex s : {Sex::female, Sex::male}) {
    const std::string name(sex_name(s));
    const std::optional<int>& subjects = s == Sex::female ? female : male;
    auto it = j.find(name);
    if (it == j.end()) {
      if (subjects) v.add("missing_key", path + "." + name, nullptr, "is required: subjects lists " + name + " subjects");
      continue;
    }
    if (!subjects) {
      v.add("invalid_value", path + "." + name, nullptr, "is not allowed: subjects lists no " + name + " subjects");
      continue;
    }
    auto dist = read_distribution(v, *it, path + "." + name, n_percentiles, *subjects);
    (s == Sex::female ? d.female : d.male) = std::move(dist);
  }
  return d;
}

std::optional<SourceFile> read_source_file(Validator& v, const Json& j, const std::string& path) {
  if (!j.is_object()) {
    v.add("wrong_type", path, &j, "must be an object with name, sex, bytes and sha256");
    return std::nullopt;
  }
  v.check_keys(j, path, {"name", "sex", "bytes", "sha256"});
  SourceFile f;
  f.name = v.string_at(j, path, "name", true).value_or("");
  f.sex = v.string_at(j, path, "sex", true).value_or("");
  if (!f.sex.empty() && f.sex != "female" && f.sex != "male") {
    v.add("invalid_value", path + ".sex", &j["sex"], "must be \"female\" or \"male\"");
  }
  if (auto b = v.positive_int_at(j, path, "bytes")) f.bytes = *b;
  f.sha256 = v.string_at(j, path, "sha256", true).value_or("");
  static const std::regex hex64("[0-9a-f]{64}");
  if (!f.sha256.empty() && !std::regex_match(f.sha256, hex64)) {
    v.add("invalid_value", path + ".sha256", &j["sha256"], "must be 64 lowercase hexadecimal digits");
  }
  return f;
}

void read_table(Validator& v, const Json& root, PopulationTable& t) {
  if (!root.is_object()) {
    v.add("wrong_type", "", &root, "must hold one JSON object");
    return;
  }
  v.check_keys(root, "",
               {"rackreach_population", "name", "title", "citation", "survey", "subjects", "source_files",
                "generated_by", "method", "caveats", "percentiles", "dimensions"});
  if (const Json* ver = v.require(root, "", "rackreach_population")) {
    if (!ver->is_number_integer() || ver->get<long long>() != population_format_version) {
      v.add("invalid_value", "rackreach_population", ver, "must be 1 (the format version this program reads)");
    }
  }
  if (auto name = v.string_at(root, "", "name", true)) {
    static const std::regex name_pattern("[a-z0-9][a-z0-9_.-]{0,39}");
    if (!std::regex_match(*name, name_pattern)) {
      v.add("invalid_value", "name", &root["name"], "must be 1 to 40 lowercase letters, digits, '_', '.' or '-'");
    }
    t.name = *name;
  }
  t.title = v.string_at(root, "", "title", true).value_or("");
  t.citation = v.string_at(root, "", "citation", true).value_or("");
  t.survey = v.string_at(root, "", "survey", true).value_or("");
  t.generated_by = v.string_at(root, "", "generated_by", false).value_or("");
  t.method = v.strings_at(root, "", "method");
  t.caveats = v.strings_at(root, "", "caveats");

  if (const Json* subjects = v.require(root, "", "subjects")) {
    if (!subjects->is_object() || subjects->empty()) {
      v.add("wrong_type", "subjects", subjects, "must be an object giving the number of female and/or male subjects");
    } else {
      v.check_keys(*subjects, "subjects", {"female", "male"});
      if (subjects->contains("female")) t.subjects_female = v.positive_int_at(*subjects, "subjects", "female");
      if (subjects->contains("male")) t.subjects_male = v.positive_int_at(*subjects, "subjects", "male");
    }
  }
  if (auto it = root.find("source_files"); it != root.end()) {
    if (!it->is_array()) {
      v.add("wrong_type", "source_files", &*it, "must be a list of objects");
    } else {
      for (std::size_t i = 0; i < it->size(); ++i) {
        if (auto f = read_source_file(v, (*it)[i], "source_files[" + std::to_string(i) + "]")) {
          t.source_files.push_back(*f);
        }
      }
    }
  }

  bool percentiles_ok = false;
  if (const Json* ps = v.require(root, "", "percentiles")) {
    percentiles_ok = true;
    if (!ps->is_array() || ps->size() < 2) {
      v.add("wrong_type", "percentiles", ps, "must be a list of at least 2 percentiles (0 to 100)");
      percentiles_ok = false;
    } else {
      for (std::size_t i = 0; i < ps->size(); ++i) {
        const Json& e = (*ps)[i];
        const std::string path = "percentiles[" + std::to_string(i) + "]";
        if (!e.is_number() || !(e.get<double>() >= 0.0 && e.get<double>() <= 100.0)) {
          v.add("out_of_range", path, &e, "must be a number from 0 to 100");
          percentiles_ok = false;
          continue;
        }
        if (!t.percentiles.empty() && e.get<double>() <= t.percentiles.back()) {
          v.add("out_of_range", path, &e, "must be greater than the percentile before it (" + Json(t.percentiles.back()).dump() + ")");
          percentiles_ok = false;
        }
        t.percentiles.push_back(e.get<double>());
      }
    }
  }

  const Json* dims = v.require(root, "", "dimensions");
  if (!dims) return;
  if (!dims->is_object() || dims->empty()) {
    v.add("wrong_type", "dimensions", dims, "must be an object with at least one dimension");
    return;
  }
  if (!percentiles_ok) return;  // the quantile lists cannot be checked against a broken percentile list
  for (auto it = dims->begin(); it != dims->end(); ++it) {
    if (auto d = read_dimension(v, it.key(), it.value(), "dimensions." + it.key(), t.percentiles.size(),
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
  Json root;
  try {
    root = Json::parse(text);
  } catch (const Json::parse_error& e) {
    out.problems.push_back({"parse_error", "", "", std::string("must be valid JSON: ") + e.what(), "", file_label});
    return out;
  }
  Validator v(file_label);
  PopulationTable t;
  read_table(v, root, t);
  if (v.ok()) out.table = std::move(t);
  out.problems = v.take();
  return out;
}

LoadedPopulation load_population_file(const std::filesystem::path& path) {
  std::ifstream in(path, std::ios::binary);
  if (!in) {
    LoadedPopulation out;
    out.problems.push_back({"file_error", "", "", "cannot be opened for reading", "", path.string()});
    return out;
  }
  std::ostringstream text;
  text << in.rdbuf();
  return load_population_text(text.str(), path.string());
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
