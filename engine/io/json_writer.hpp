// SPDX-License-Identifier: MIT
#pragma once
// A streaming JSON writer: values are appended to a string as they come, with no document tree, so a large
// assessment is written in one pass (nlohmann/json, which reads our files, builds a tree to write one).
// Numbers use the shortest text that reads back to the same double. Non-finite numbers are written as null
// (JSON has no NaN).

#include <algorithm>
#include <charconv>
#include <cstring>
#include <cmath>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rackreach {

class JsonWriter {
 public:
  /// Appends to `out`; call finish() (or let the writer go out of scope) before reading `out`.
  explicit JsonWriter(std::string& out) : out_(out), len_(out.size()) {}
  ~JsonWriter() { finish(); }
  JsonWriter(const JsonWriter&) = delete;
  JsonWriter& operator=(const JsonWriter&) = delete;

  /// Trims the output string to what was written.
  void finish() { out_.resize(len_); }

  /// Text written as it is (layout between values).
  JsonWriter& raw(std::string_view text) {
    put(text);
    return *this;
  }

  JsonWriter& begin_object() { return open('{'); }
  JsonWriter& end_object() { return close('}'); }
  JsonWriter& begin_array() { return open('['); }
  JsonWriter& end_array() { return close(']'); }

  /// A key. Keys are the program's own names (plain ASCII, nothing to escape), so they are copied as they are.
  JsonWriter& key(std::string_view k) {
    separate();
    reserve(k.size() + 3);
    char* p = out_.data() + len_;
    *p++ = '"';
    std::memcpy(p, k.data(), k.size());
    p += k.size();
    *p++ = '"';
    *p++ = ':';
    len_ = static_cast<std::size_t>(p - out_.data());
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
    put(b ? std::string_view("true") : std::string_view("false"));
    return *this;
  }
  JsonWriter& value(double x) {
    separate();
    if (!std::isfinite(x)) {
      put("null");
      return *this;
    }
    reserve(32);
    const auto r = std::to_chars(out_.data() + len_, out_.data() + len_ + 32, x);
    len_ = static_cast<std::size_t>(r.ptr - out_.data());
    return *this;
  }
  JsonWriter& value(int x) { return value(static_cast<double>(x)); }
  JsonWriter& value(const std::optional<double>& x) { return x ? value(*x) : null(); }
  JsonWriter& null() {
    separate();
    put("null");
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
    put(c);
    first_.push_back(true);
    return *this;
  }
  JsonWriter& close(char c) {
    put(c);
    first_.pop_back();
    return *this;
  }
  void separate() {
    if (after_key_) {
      after_key_ = false;
      return;
    }
    if (!first_.empty()) {
      if (!first_.back()) put(',');
      first_.back() = false;
    }
    if (!pending_break_.empty()) {
      put(pending_break_);
      pending_break_ = {};
    }
  }
  void write_string(std::string_view s) {
    put('"');
    std::size_t run = 0;  // start of the run of characters that need no escape
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto c = static_cast<unsigned char>(s[i]);
      if (c >= 0x20 && c != '"' && c != '\\') continue;
      put(s.substr(run, i - run));
      run = i + 1;
      switch (c) {
        case '"': put("\\\""); break;
        case '\\': put("\\\\"); break;
        case '\n': put("\\n"); break;
        case '\r': put("\\r"); break;
        case '\t': put("\\t"); break;
        default: {
          static constexpr char hex[] = "0123456789abcdef";
          const char esc[] = {'\\', 'u', '0', '0', hex[c >> 4], hex[c & 15]};
          put(std::string_view(esc, sizeof esc));
        }
      }
    }
    put(s.substr(run));
    put('"');
  }

  /// Makes room for `n` more bytes; the string grows in large steps and is trimmed by finish().
  void reserve(std::size_t n) {
    if (len_ + n > out_.size()) out_.resize(std::max<std::size_t>(2 * out_.size(), len_ + n + 4096));
  }
  void put(char c) {
    reserve(1);
    out_[len_++] = c;
  }
  void put(std::string_view t) {
    reserve(t.size());
    std::memcpy(out_.data() + len_, t.data(), t.size());
    len_ += t.size();
  }

  std::string& out_;
  std::size_t len_;
  std::vector<bool> first_;
  bool after_key_ = false;
  std::string_view pending_break_;
};

}  // namespace rackreach
