// SPDX-License-Identifier: MIT
#include "engine/io/json_reader.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "engine/io/input_limits.hpp"

namespace rackreach {
namespace {

template <class Json>
const char* type_word(const Json& j) {
  switch (j.type()) {
    case nlohmann::detail::value_t::null: return "null";
    case nlohmann::detail::value_t::object: return "an object";
    case nlohmann::detail::value_t::array: return "an array";
    case nlohmann::detail::value_t::string: return "a string";
    case nlohmann::detail::value_t::boolean: return "a boolean";
    case nlohmann::detail::value_t::number_integer:
    case nlohmann::detail::value_t::number_unsigned:
    case nlohmann::detail::value_t::number_float: return "a number";
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
  return s + std::string(r.note);
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

namespace {
template <class Json>
std::string excerpt(const Json& j) {
  // Invalid UTF-8 in a string is shown as U+FFFD rather than thrown.
  std::string s = j.dump(-1, ' ', false, Json::error_handler_t::replace);
  if (s.size() > 60) s = s.substr(0, 57) + "...";
  return s;
}
}  // namespace

std::string json_excerpt(const nlohmann::json& j) { return excerpt(j); }
std::string json_excerpt(const nlohmann::ordered_json& j) { return excerpt(j); }

template <class Json>
void BasicJsonReader<Json>::add(std::string code, const JsonPath& path, const Json* value, std::string rule) {
  problems_.push_back({std::move(code), path.str(), value ? json_excerpt(*value) : std::string(), std::move(rule),
                       context_, file_});
}

template <class Json>
bool BasicJsonReader<Json>::object(const Json& j, const JsonPath& path, std::initializer_list<std::string_view> allowed) {
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
      std::string rule = "is not a known field here";
      if (!suggestion.empty()) rule += " (did you mean \"" + suggestion + "\"?)";
      problems_.push_back({"unknown_key", JsonPath(path, it.key()).str(), json_excerpt(it.value()),
                           rule + "; allowed here: " + list, context_, file_});
    }
  }
  return true;
}

template <class Json>
bool BasicJsonReader<Json>::array(const Json& j, const JsonPath& path, std::size_t min_size, std::string_view what) {
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

template <class Json>
bool BasicJsonReader<Json>::at_most(const Json& j, const JsonPath& path, std::size_t max, std::string_view what) {
  if (j.size() <= max) return true;
  problems_.push_back({"too_many", path.str(), std::to_string(j.size()) + " " + std::string(what),
                       "may hold at most " + std::to_string(max) + " " + std::string(what), context_, file_});
  return false;
}

template <class Json>
bool BasicJsonReader<Json>::streamed_within(const JsonPath& array_path, std::size_t index, std::size_t max,
                                 std::string_view what) {
  if (index < max) return true;
  if (index == max)
    problems_.push_back({"too_many", JsonPath(array_path, index).str(), "",
                         "may hold at most " + std::to_string(max) + " " + std::string(what) +
                             "; the rest of the array is not read",
                         "", file_});
  return false;
}

template <class Json>
const Json* BasicJsonReader<Json>::member(const Json& obj, const JsonPath& path, std::string_view key,
                                         bool required) {
  auto it = obj.find(key);
  if (it == obj.end()) {
    if (required) add("missing_key", JsonPath(path, key), nullptr, "is required");
    return nullptr;
  }
  return &*it;
}

template <class Json>
std::optional<double> BasicJsonReader<Json>::number(const Json& obj, const JsonPath& path, std::string_view key,
                                                    bool required, const NumberRule& rule) {
  const Json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  // A plausibility limit (a rule with a note) is named only to a value above it: a wrong type or a value below the
  // minimum is told the method's own rule.
  NumberRule lower = rule;
  if (!rule.note.empty()) {
    lower.max.reset();
    lower.note = {};
  }
  if (!j->is_number()) {
    add("wrong_type", JsonPath(path, key), j, describe(lower) + "; found " + type_word(*j));
    return std::nullopt;
  }
  const double x = j->template get<double>();
  const bool below = rule.min && (rule.min_exclusive ? x <= *rule.min : x < *rule.min);
  const bool above = rule.max && (rule.max_exclusive ? x >= *rule.max : x > *rule.max);
  if (!std::isfinite(x) || below) {
    add("out_of_range", JsonPath(path, key), j, describe(lower));
    return std::nullopt;
  }
  if (above) {
    add("out_of_range", JsonPath(path, key), j, describe(rule));
    return std::nullopt;
  }
  return x;
}

template <class Json>
std::optional<std::string> BasicJsonReader<Json>::string(const Json& obj, const JsonPath& path, std::string_view key,
                                                         bool required, bool non_empty) {
  const Json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  return string_value(*j, JsonPath(path, key), non_empty);
}

template <class Json>
std::optional<std::string> BasicJsonReader<Json>::string_value(const Json& j, const JsonPath& path, bool non_empty) {
  if (!j.is_string()) {
    add("wrong_type", path, &j, std::string("must be a string; found ") + type_word(j));
    return std::nullopt;
  }
  const std::string& s = j.template get_ref<const std::string&>();
  if (s.size() > input_limits::max_string_bytes) {
    add("too_long", path, &j, "must be at most " + std::to_string(input_limits::max_string_bytes) + " bytes long");
    return std::nullopt;
  }
  if (non_empty && s.empty()) {
    add("empty", path, &j, "must not be empty");
    return std::nullopt;
  }
  return s;
}

template <class Json>
std::optional<long long> BasicJsonReader<Json>::whole_number(const Json& obj, const JsonPath& path,
                                                             std::string_view key, bool required, long long min,
                                                             long long max, std::string_view note) {
  const Json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  const std::string rule =
      "must be a whole number from " + std::to_string(min) + " to " + std::to_string(max) + std::string(note);
  if (!j->is_number()) {
    add("wrong_type", JsonPath(path, key), j, rule + "; found " + type_word(*j));
    return std::nullopt;
  }
  // number_unsigned above the range of long long, and fractions, are out of range, never wrapped or truncated.
  const bool whole = j->is_number_integer() && !(j->is_number_unsigned() && j->template get<unsigned long long>() >
                                                                                static_cast<unsigned long long>(max));
  if (!whole || j->template get<long long>() < min || j->template get<long long>() > max) {
    add("out_of_range", JsonPath(path, key), j, rule);
    return std::nullopt;
  }
  return j->template get<long long>();
}

template <class Json>
std::optional<bool> BasicJsonReader<Json>::boolean(const Json& obj, const JsonPath& path, std::string_view key,
                                        bool required) {
  const Json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  if (!j->is_boolean()) {
    add("wrong_type", JsonPath(path, key), j, std::string("must be true or false; found ") + type_word(*j));
    return std::nullopt;
  }
  return j->template get<bool>();
}

template <class Json>
std::optional<std::string> BasicJsonReader<Json>::choice(const Json& obj, const JsonPath& path, std::string_view key,
                                              bool required, std::initializer_list<std::string_view> choices) {
  const Json* j = member(obj, path, key, required);
  if (!j) return std::nullopt;
  std::string list;
  for (std::string_view c : choices) list += (list.empty() ? "\"" : ", \"") + std::string(c) + "\"";
  if (!j->is_string()) {
    add("wrong_type", JsonPath(path, key), j, "must be one of " + list + "; found " + type_word(*j));
    return std::nullopt;
  }
  const std::string& s = j->template get_ref<const std::string&>();
  for (std::string_view c : choices)
    if (c == s) return s;
  add("invalid_value", JsonPath(path, key), j, "must be one of " + list);
  return std::nullopt;
}

template class BasicJsonReader<nlohmann::json>;
template class BasicJsonReader<nlohmann::ordered_json>;

}  // namespace rackreach
