// SPDX-License-Identifier: MIT
#pragma once
// Fixed-decimal numbers and padded columns for the text tables of the outputs, and text escaped for HTML.

#include <cstdio>
#include <optional>
#include <string>

namespace rackreach::text {

inline std::string fixed(double x, int decimals) {
  char buf[48];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}
/// "-" where there is no value.
inline std::string fixed_or_dash(const std::optional<double>& x, int decimals) { return x ? fixed(*x, decimals) : "-"; }
inline std::string pad_left(const std::string& s, std::size_t w) {
  return s.size() >= w ? s : std::string(w - s.size(), ' ') + s;
}
inline std::string pad_right(const std::string& s, std::size_t w) {
  return s.size() >= w ? s : s + std::string(w - s.size(), ' ');
}

/// `s` with &, <, > and " escaped, for HTML text and attribute values.
inline std::string html_escape(const std::string& s) {
  std::string o;
  o.reserve(s.size());
  for (char ch : s) {
    switch (ch) {
      case '&': o += "&amp;"; break;
      case '<': o += "&lt;"; break;
      case '>': o += "&gt;"; break;
      case '"': o += "&quot;"; break;
      default: o += ch;
    }
  }
  return o;
}

}  // namespace rackreach::text
