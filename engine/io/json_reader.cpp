// SPDX-License-Identifier: MIT
#include "engine/io/json_reader.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace rackreach {
namespace {

const char* type_word(const nlohmann::json& j) {
  switch (j.type()) {
    case nlohmann::json::value_t::null: return "null";
    case nlohmann::json::value_t::object: return "an object";
    case nlohmann::json::value_t::array: return "an array";
    case nlohmann::json::value_t::string: return "a string";
    case nlohmann::json::value_t::boolean: return "a boolean";
    case nlohmann::json::value_t::number_integer:
    case nlohmann::json::value_t::number_unsigned:
    case nlohmann::json::value_t::number_float: return "a number";
    default: return "an unsupported value";
  }
}

std::string fmt_num(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", x);
  return buf;
}

std::string describe(const NumberRule& r) {
  std::string unit = r.unit.empty() ? std::string() : " " + std::string(r.unit);
  std::string s = "must be a number";
  if (r.min && r.max)
    s += std::string(r.min_exclusive ? " greater than " : " from ") + fmt_num(*r.min) +
         (r.max_exclusive ? " to below " : " to ") + fmt_num(*r.max) + unit;
  else if (r.min)
    s += std::string(r.min_exclusive ? " greater than " : " of at least ") + fmt_num(*r.min) + unit;
  else if (r.max)
    s += std::string(r.max_exclusive ? " below " : " of at most ") + fmt_num(*r.max) + unit;
  else if (!unit.empty())
    s += ", in" + unit;
  return s;
}

}  // namespace

std::size_t calc_edit_distance(std::string_view a, std::string_view b) {
  std::vector<std::size_t> prev(b.size() + 1), cur(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) prev[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    cur[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j)
      cur[j] = std::min({prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1)});
    std::swap(prev, cur);
  }
  return prev[b.size()];
}

std::string json_excerpt(const nlohmann::json& j) {
  std::string s = j.dump();
  if (s.size() > 60) s = s.substr(0, 57) + "...";
  return s;
}

void JsonReader::add(std::string code, const JsonPath& path, const nlohmann::json* value, std::string rule) {
  problems_.push_back({std::move(code), path.str(), value ? json_excerpt(*value) : std::string(), std::move(rule),
                       context_});
}

bool JsonReader::object(const nlohmann::json& j, const JsonPath& path, std::initializer_list<std::string_view> allowed) {
  if (!j.is_object()) {
    add("wrong_type", path, &j, std::string("must be an object; found ") + type_word(j));
    return false;
  }
  for (auto it = j.begin(); it != j.end(); ++it) {
    bool known = false;
    for (std::string_view a : allowed) known = known || a == it.key();
    if (!known) {
      std::string list, suggestion;
      for (std::string_view a : allowed) {
        list += (list.empty() ? "" : ", ") + std::string(a);
        const bool prefix = it.key().rfind(a, 0) == 0 || std::string_view(a).rfind(it.key(), 0) == 0;
        if (suggestion.empty() && (calc_edit_distance(a, it.key()) <= 2 || (prefix && it.key().size() > 3)))
          suggestion = std::string(a);
      }
      std::string rule = "unknown key";
      if (!suggestion.empty()) rule += " (did you mean \"" + suggestion + "\"?)";
      problems_.push_back({"unknown_key", JsonPath(path, it.key()).str(), "", rule + "; allowed here: " + list,
                           context_});
    }
  }
  return true;
}

bool JsonReader::array(const nlohmann::json& j, const JsonPath& path, std::size_t min_size, std::string_view what) {
  if (!j.is_array()) {
    add("wrong_type", path, &j, std::string("must be an array of ") + std::string(what) + "; found " + type_word(j));
    return false;
  }
  if (j.size() < min_size) {
    add("empty", path, &j, "must hold at least " + std::to_string(min_size) + " " + std::string(what));
    return false;
  }
  return true;
}

const nlohmann::json* JsonReader::member(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                         bool required) {
  auto it = obj.find(key);
  if (it == obj.end()) {
    if (required) add("missing_key", JsonPath(path, key), nullptr, "is required");
    return nullptr;
  }
  return &*it;
}

std::optional<double> JsonReader::number(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                         bool required, const NumberRule& rule) {
  const nlohmann::json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  if (!j->is_number()) {
    add("wrong_type", JsonPath(path, key), j, describe(rule) + "; found " + type_word(*j));
    return std::nullopt;
  }
  const double x = j->get<double>();
  const bool below = rule.min && (rule.min_exclusive ? x <= *rule.min : x < *rule.min);
  const bool above = rule.max && (rule.max_exclusive ? x >= *rule.max : x > *rule.max);
  if (!std::isfinite(x) || below || above) {
    add("out_of_range", JsonPath(path, key), j, describe(rule));
    return std::nullopt;
  }
  return x;
}

std::optional<std::string> JsonReader::string(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                              bool required, bool non_empty) {
  const nlohmann::json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  if (!j->is_string()) {
    add("wrong_type", JsonPath(path, key), j, std::string("must be a string; found ") + type_word(*j));
    return std::nullopt;
  }
  std::string s = j->get<std::string>();
  if (non_empty && s.empty()) {
    add("empty", JsonPath(path, key), j, "must not be empty");
    return std::nullopt;
  }
  return s;
}

std::optional<bool> JsonReader::boolean(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                        bool required) {
  const nlohmann::json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  if (!j->is_boolean()) {
    add("wrong_type", JsonPath(path, key), j, std::string("must be true or false; found ") + type_word(*j));
    return std::nullopt;
  }
  return j->get<bool>();
}

std::optional<std::string> JsonReader::choice(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                              bool required, std::initializer_list<std::string_view> choices) {
  const nlohmann::json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  std::string list;
  for (std::string_view c : choices) list += (list.empty() ? "\"" : ", \"") + std::string(c) + "\"";
  if (!j->is_string()) {
    add("wrong_type", JsonPath(path, key), j, "must be one of " + list + "; found " + type_word(*j));
    return std::nullopt;
  }
  const std::string s = j->get<std::string>();
  for (std::string_view c : choices)
    if (c == s) return s;
  add("invalid_value", JsonPath(path, key), j, "must be one of " + list);
  return std::nullopt;
}

}  // namespace rackreach
