// SPDX-License-Identifier: MIT
#pragma once
// Reads values out of a parsed JSON document while recording every problem (wrong type, missing key, unknown
// key, out of range, too long, too many) with its path. The loaders of the project file (Json) and of
// the population table (nlohmann::ordered_json, which keeps the file's order of dimensions) both walk their
// documents with it, so both report the same problems the same way; the rules of each format live in its loader,
// this class only knows JSON.

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
  NumberRule() = default;
  NumberRule(std::optional<double> min_, std::optional<double> max_, bool min_exclusive_, bool max_exclusive_,
             std::string_view unit_, std::string_view note_ = {})
      : min(min_), max(max_), min_exclusive(min_exclusive_), max_exclusive(max_exclusive_), unit(unit_), note(note_) {}

  std::optional<double> min;
  std::optional<double> max;
  bool min_exclusive = false;
  bool max_exclusive = false;
  std::string_view unit;  ///< shown in messages, e.g. "cm"
  std::string_view note;  ///< appended to the rule, e.g. input_limits::plausibility_note
};

template <class Json>
class BasicJsonReader {
 public:
  explicit BasicJsonReader(std::vector<Problem>& problems) : problems_(problems) {}

  void set_context(std::string context) { context_ = std::move(context); }
  const std::string& context() const { return context_; }
  /// The file every problem names (Problem::file); empty when the caller names it.
  void set_file(std::string file) { file_ = std::move(file); }

  void add(std::string code, const JsonPath& path, const Json* value, std::string rule);

  /// True if `j` is an object; reports every key not in `allowed` as unknown.
  bool object(const Json& j, const JsonPath& path, std::initializer_list<std::string_view> allowed);
  /// True if `j` is an array (of at least `min_size` elements).
  bool array(const Json& j, const JsonPath& path, std::size_t min_size, std::string_view what);

  /// True if the array `j` holds at most `max` elements; otherwise reports one too_many problem.
  bool at_most(const Json& j, const JsonPath& path, std::size_t max, std::string_view what);
  /// Reports the element at `index` of a streamed root array when it is the first beyond `max`; true while within.
  bool streamed_within(const JsonPath& array_path, std::size_t index, std::size_t max, std::string_view what);

  /// The member `key` of an object, or nullptr; reports a missing required key.
  const Json* member(const Json& obj, const JsonPath& path, std::string_view key, bool required);

  std::optional<double> number(const Json& obj, const JsonPath& path, std::string_view key, bool required,
                               const NumberRule& rule);
  /// A string of at most input_limits::max_string_bytes.
  std::optional<std::string> string(const Json& obj, const JsonPath& path, std::string_view key,
                                    bool required, bool non_empty = true);
  /// The same for a value itself (an element of an array).
  std::optional<std::string> string_value(const Json& j, const JsonPath& path, bool non_empty = true);
  /// A whole number from `min` to `max`: wrong_type if not a number, out_of_range if not whole or outside.
  std::optional<long long> whole_number(const Json& obj, const JsonPath& path, std::string_view key, bool required,
                                        long long min, long long max, std::string_view note = {});
  std::optional<bool> boolean(const Json& obj, const JsonPath& path, std::string_view key, bool required);
  /// A string that must be one of `choices`.
  std::optional<std::string> choice(const Json& obj, const JsonPath& path, std::string_view key,
                                    bool required, std::initializer_list<std::string_view> choices);

 private:
  std::vector<Problem>& problems_;
  std::string context_;
  std::string file_;
};

using JsonReader = BasicJsonReader<nlohmann::json>;
extern template class BasicJsonReader<nlohmann::json>;
extern template class BasicJsonReader<nlohmann::ordered_json>;

/// Levenshtein distance between two names, to suggest the key or column a typo meant.
std::size_t calc_edit_distance(std::string_view a, std::string_view b);

/// Short JSON text of a value for messages (long strings and containers are cut).
std::string json_excerpt(const nlohmann::json& j);
std::string json_excerpt(const nlohmann::ordered_json& j);

}  // namespace rackreach
