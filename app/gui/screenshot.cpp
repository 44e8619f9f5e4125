// SPDX-License-Identifier: MIT
#include "app/gui/screenshot.hpp"

#include <QApplication>
#include <QPixmap>

#include "app/gui/main_window.hpp"

namespace rackreach::gui {

QString save_widget_png(QWidget& w, const QString& path, QSize size) {
  w.resize(size);
  w.show();
  QApplication::processEvents();
  const QPixmap pixmap = w.grab();
  if (!pixmap.save(path, "PNG")) return QStringLiteral("could not write %1").arg(path);
  return {};
}

QString render_main_window(const QString& project, const QString& slot_id, const QString& out, DisplayChoice units) {
  MainWindow w(false);
  w.model().set_display_choice(units);
  if (const QStringList problems = w.open_file(project); !problems.isEmpty()) return problems.join('\n');
  // Laid out first, so that selecting can scroll the lists to the slot as it would on screen.
  w.resize(QSize(1280, 800));
  w.show();
  QApplication::processEvents();
  if (!slot_id.isEmpty()) {
    const auto slot = w.model().find_slot(slot_id.toStdString());
    if (!slot) return QStringLiteral("%1: there is no slot \"%2\"").arg(project, slot_id);
    w.select_slot(*slot);
  }
  return save_widget_png(w, out, QSize(1280, 800));
}

}  // namespace rackreach::gui
