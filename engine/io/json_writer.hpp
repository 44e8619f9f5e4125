// SPDX-License-Identifier: MIT
#pragma once
// A streaming JSON writer: values are appended to a string as they come, with no document tree, so a large
// assessment is written in one pass (nlohmann/json, which reads our files, builds a tree to write one).
// Numbers use the shortest text that reads back to the same double. Non-finite numbers are written as null
// (JSON has no NaN).

#include <charconv>
#include <cmath>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rackreach {

class JsonWriter {
 public:
  explicit JsonWriter(std::string& out) : out_(out) {}

  JsonWriter& begin_object() { return open('{'); }
  JsonWriter& end_object() { return close('}'); }
  JsonWriter& begin_array() { return open('['); }
  JsonWriter& end_array() { return close(']'); }

  JsonWriter& key(std::string_view k) {
    separate();
    write_string(k);
    out_ += ':';
    after_key_ = true;
    return *this;
  }

  JsonWriter& value(std::string_view s) {
    separate();
    write_string(s);
    return *this;
  }
  JsonWriter& value(const char* s) { return value(std::string_view(s)); }
  JsonWriter& value(const std::string& s) { return value(std::string_view(s)); }
  JsonWriter& value(bool b) {
    separate();
    out_ += b ? "true" : "false";
    return *this;
  }
  JsonWriter& value(double x) {
    separate();
    if (!std::isfinite(x)) {
      out_ += "null";
      return *this;
    }
    char buf[32];
    const auto r = std::to_chars(buf, buf + sizeof buf, x);
    out_.append(buf, r.ptr);
    return *this;
  }
  JsonWriter& value(int x) { return value(static_cast<double>(x)); }
  JsonWriter& value(const std::optional<double>& x) { return x ? value(*x) : null(); }
  JsonWriter& null() {
    separate();
    out_ += "null";
    return *this;
  }

  /// key + value in one call.
  template <typename T>
  JsonWriter& field(std::string_view k, const T& v) {
    key(k);
    return value(v);
  }

  /// Text (a line break and indent) written after the next separating comma, or before the next value.
  void line_break(std::string_view text) { pending_break_ = text; }

 private:
  JsonWriter& open(char c) {
    separate();
    out_ += c;
    first_.push_back(true);
    return *this;
  }
  JsonWriter& close(char c) {
    out_ += c;
    first_.pop_back();
    return *this;
  }
  void separate() {
    if (after_key_) {
      after_key_ = false;
      return;
    }
    if (!first_.empty()) {
      if (!first_.back()) out_ += ',';
      first_.back() = false;
    }
    out_ += pending_break_;
    pending_break_ = {};
  }
  void write_string(std::string_view s) {
    out_ += '"';
    std::size_t run = 0;  // start of the run of characters that need no escape
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto c = static_cast<unsigned char>(s[i]);
      if (c >= 0x20 && c != '"' && c != '\\') continue;
      out_.append(s.data() + run, i - run);
      run = i + 1;
      switch (c) {
        case '"': out_ += "\\\""; break;
        case '\\': out_ += "\\\\"; break;
        case '\n': out_ += "\\n"; break;
        case '\r': out_ += "\\r"; break;
        case '\t': out_ += "\\t"; break;
        default: {
          static constexpr char hex[] = "0123456789abcdef";
          const char esc[] = {'\\', 'u', '0', '0', hex[c >> 4], hex[c & 15]};
          out_.append(esc, sizeof esc);
        }
      }
    }
    out_.append(s.data() + run, s.size() - run);
    out_ += '"';
  }

  std::string& out_;
  std::vector<bool> first_;
  bool after_key_ = false;
  std::string_view pending_break_;
};

}  // namespace rackreach
