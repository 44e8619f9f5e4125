// SPDX-License-Identifier: MIT
#pragma once
// Reads values out of a parsed JSON document while recording every problem (wrong type, missing key, unknown
// key, out of range) with its path. The one place where the project file's rules are applied is the loader that
// uses it; this class only knows JSON.

#include <initializer_list>
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "engine/io/json_path.hpp"
#include "engine/problem.hpp"

namespace rackreach {

/// A closed numeric range; either end may be open (`*_exclusive`) or absent.
struct NumberRule {
  std::optional<double> min;
  std::optional<double> max;
  bool min_exclusive = false;
  bool max_exclusive = false;
  std::string_view unit;  ///< shown in messages, e.g. "cm"
};

class JsonReader {
 public:
  explicit JsonReader(std::vector<Problem>& problems) : problems_(problems) {}

  void set_context(std::string context) { context_ = std::move(context); }
  const std::string& context() const { return context_; }

  void add(std::string code, const JsonPath& path, const nlohmann::json* value, std::string rule);

  /// True if `j` is an object; reports every key not in `allowed` as unknown.
  bool object(const nlohmann::json& j, const JsonPath& path, std::initializer_list<std::string_view> allowed);
  /// True if `j` is an array (of at least `min_size` elements).
  bool array(const nlohmann::json& j, const JsonPath& path, std::size_t min_size, std::string_view what);

  /// The member `key` of an object, or nullptr; reports a missing required key.
  const nlohmann::json* member(const nlohmann::json& obj, const JsonPath& path, std::string_view key, bool required);

  std::optional<double> number(const nlohmann::json& obj, const JsonPath& path, std::string_view key, bool required,
                               const NumberRule& rule);
  std::optional<std::string> string(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                    bool required, bool non_empty = true);
  std::optional<bool> boolean(const nlohmann::json& obj, const JsonPath& path, std::string_view key, bool required);
  /// A string that must be one of `choices`.
  std::optional<std::string> choice(const nlohmann::json& obj, const JsonPath& path, std::string_view key,
                                    bool required, std::initializer_list<std::string_view> choices);

 private:
  std::vector<Problem>& problems_;
  std::string context_;
};

/// Levenshtein distance between two names, to suggest the key or column a typo meant.
std::size_t calc_edit_distance(std::string_view a, std::string_view b);

/// Short JSON text of a value for messages (long strings and containers are cut).
std::string json_excerpt(const nlohmann::json& j);

}  // namespace rackreach
