// SPDX-License-Identifier: MIT
#pragma once
// Offscreen pictures of the app's windows, for `rackreach-gui --screenshot` and the tests.

#include <QString>
#include <QWidget>

#include "app/gui/display_units.hpp"

namespace rackreach::gui {

/// Lays out and paints `w` at `size` and writes it as PNG; returns an error in plain words, or "" on success.
QString save_widget_png(QWidget& w, const QString& path, QSize size);

/// Opens `project` in a main window at 1280x800 (selecting `slot_id` if given, showing `units`) and writes it to
/// `out`. Returns the problems in plain words, or "" on success.
QString render_main_window(const QString& project, const QString& slot_id, const QString& out,
                           DisplayChoice units = DisplayChoice::as_file);

}  // namespace rackreach::gui
