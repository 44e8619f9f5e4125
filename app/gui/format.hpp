// SPDX-License-Identifier: MIT
#pragma once
// Number and text formatting for the app's widgets: fixed decimals, the same on every locale.

#include <QString>

#include <optional>
#include <string>
#include <string_view>

namespace rackreach::gui {

inline QString q(const std::string& s) { return QString::fromStdString(s); }
inline QString q(std::string_view s) { return QString::fromUtf8(s.data(), static_cast<qsizetype>(s.size())); }
inline QString fmt(double v, int decimals) { return QString::number(v, 'f', decimals); }
/// An optional number, or `none` where it is undefined.
inline QString fmt(const std::optional<double>& v, int decimals, const QString& none) {
  return v ? fmt(*v, decimals) : none;
}

}  // namespace rackreach::gui
