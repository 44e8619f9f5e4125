// SPDX-License-Identifier: MIT
#pragma once
// A JSON path built lazily: a chain of nodes on the stack, turned into text only when a problem is reported,
// so that validating a large file costs no string building.

#include <cstddef>
#include <string>
#include <string_view>

namespace rackreach {

class JsonPath {
 public:
  JsonPath() = default;
  JsonPath(const JsonPath& parent, std::string_view key) : parent_(&parent), key_(key) {}
  JsonPath(const JsonPath& parent, std::size_t index) : parent_(&parent), index_(index), is_index_(true) {}

  std::string str() const {
    if (!parent_) return {};
    std::string s = parent_->str();
    if (is_index_) return s + "[" + std::to_string(index_) + "]";
    return s.empty() ? std::string(key_) : s + "." + std::string(key_);
  }

 private:
  const JsonPath* parent_ = nullptr;
  std::string_view key_;
  std::size_t index_ = 0;
  bool is_index_ = false;
};

}  // namespace rackreach
