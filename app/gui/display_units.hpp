// SPDX-License-Identifier: MIT
#pragma once
// The one place where a length or a mass in the project's units becomes a number and a unit in the units the user
// chose to see (View > Units). Only what is shown changes: the project file keeps its units and every computation
// stays in them. Widgets convert through UnitDisplay and nowhere else.

#include <QString>

#include <optional>

#include "app/gui/format.hpp"
#include "engine/quantities.hpp"

namespace rackreach::gui {

/// What the user asked to see: the file's own units, or one system whatever the file holds.
enum class DisplayChoice { as_file, metric, us };

/// The settings word of a choice ("file", "metric", "us") and back; an unknown word is nothing.
inline QString display_choice_key(DisplayChoice c) {
  return c == DisplayChoice::metric ? QStringLiteral("metric") : c == DisplayChoice::us ? QStringLiteral("us")
                                                                                        : QStringLiteral("file");
}
inline std::optional<DisplayChoice> parse_display_choice(const QString& key) {
  if (key == QLatin1String("file")) return DisplayChoice::as_file;
  if (key == QLatin1String("metric")) return DisplayChoice::metric;
  if (key == QLatin1String("us")) return DisplayChoice::us;
  return std::nullopt;
}

/// Converts values in the file's units (or in cm, where the engine gives cm) into the shown units, as text.
class UnitDisplay {
 public:
  constexpr UnitDisplay() = default;
  constexpr UnitDisplay(UnitSystem file, DisplayChoice choice)
      : file_(file),
        shown_(choice == DisplayChoice::metric ? UnitSystem::metric : choice == DisplayChoice::us ? UnitSystem::us
                                                                                                  : file) {}

  constexpr UnitSystem file() const { return file_; }
  constexpr UnitSystem shown() const { return shown_; }
  /// True when what is shown is not in the file's units.
  constexpr bool converts() const { return file_ != shown_; }

  QString length_unit() const { return q(rackreach::length_unit(shown_)); }
  QString mass_unit() const { return q(rackreach::mass_unit(shown_)); }
  QString file_length_unit() const { return q(rackreach::length_unit(file_)); }
  QString file_mass_unit() const { return q(rackreach::mass_unit(file_)); }

  /// A length or mass in the file's units, in the shown units.
  constexpr double length(double in_file_units) const { return Length{in_file_units, file_}.in_units(shown_); }
  constexpr double mass(double in_file_units) const { return Mass{in_file_units, file_}.in_units(shown_); }
  /// A length in cm (the reach checks' unit), in the shown units.
  constexpr double length_from_cm(double cm) const { return Length{cm, UnitSystem::metric}.in_units(shown_); }
  /// A shown length back in the file's units (to place a shown axis tick on a drawing kept in file units).
  constexpr double length_to_file(double shown) const { return Length{shown, shown_}.in_units(file_); }

  /// The number alone, in the shown unit ("48.50").
  QString length_text(double in_file_units, int decimals) const { return fmt(length(in_file_units), decimals); }
  QString mass_text(double in_file_units, int decimals) const { return fmt(mass(in_file_units), decimals); }
  QString cm_text(double cm, int decimals) const { return fmt(length_from_cm(cm), decimals); }
  /// The number and its unit ("48.50 lb").
  QString length_with_unit(double in_file_units, int decimals) const {
    return length_text(in_file_units, decimals) + QLatin1Char(' ') + length_unit();
  }
  QString mass_with_unit(double in_file_units, int decimals) const {
    return mass_text(in_file_units, decimals) + QLatin1Char(' ') + mass_unit();
  }
  QString cm_with_unit(double cm, int decimals) const {
    return cm_text(cm, decimals) + QLatin1Char(' ') + length_unit();
  }

 private:
  UnitSystem file_ = UnitSystem::metric;
  UnitSystem shown_ = UnitSystem::metric;
};

}  // namespace rackreach::gui
