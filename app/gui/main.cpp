// SPDX-License-Identifier: MIT
// rackreach-gui [PROJECT]
// rackreach-gui --version
// rackreach-gui --screenshot OUT.png [--select SLOT] [--units file|metric|us] PROJECT   (renders offscreen, exits)

#include <QApplication>
#include <QMessageBox>

#include <cstdio>
#include <cstring>
#include <string>

#include "app/about/about.hpp"
#include "app/gui/main_window.hpp"
#include "app/gui/screenshot.hpp"

int main(int argc, char** argv) {
  QString screenshot, select, project;
  rackreach::gui::DisplayChoice units = rackreach::gui::DisplayChoice::as_file;
  for (int i = 1; i < argc; ++i) {
    const std::string a = argv[i];
    if (a == "--screenshot" && i + 1 < argc) screenshot = QString::fromLocal8Bit(argv[++i]);
    else if (a == "--select" && i + 1 < argc) select = QString::fromLocal8Bit(argv[++i]);
    else if (a == "--units" && i + 1 < argc) {
      const auto c = rackreach::gui::parse_display_choice(QString::fromLocal8Bit(argv[++i]));
      if (!c) {
        std::fprintf(stderr, "rackreach-gui: --units takes file, metric or us, not %s\n", argv[i]);
        return 2;
      }
      units = *c;
    } else if (a == "--help" || a == "-h") {
      std::puts("usage: rackreach-gui [PROJECT]\n"
                "       rackreach-gui --screenshot OUT.png [--select SLOT] [--units file|metric|us] PROJECT\n"
                "       rackreach-gui --version");
      return 0;
    } else if (a == "--version") {
      std::puts(rackreach::make_version_text("rackreach-gui").c_str());
      return 0;
    } else if (!a.empty() && a[0] == '-' && a.rfind("-platform", 0) != 0) {
      std::fprintf(stderr, "rackreach-gui: unknown option %s\n", a.c_str());
      return 2;
    } else if (a.rfind("-platform", 0) != 0) project = QString::fromLocal8Bit(argv[i]);
  }
  if (!screenshot.isEmpty() && project.isEmpty()) {
    std::fputs("rackreach-gui: --screenshot needs a PROJECT file\n", stderr);
    return 2;
  }
  // Pictures are made without a display.
  if (!screenshot.isEmpty() && qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
  QApplication app(argc, argv);
  QApplication::setApplicationName("rackreach-gui");
  if (!screenshot.isEmpty()) {
    const QString err = rackreach::gui::render_main_window(project, select, screenshot, units);
    if (!err.isEmpty()) {
      std::fprintf(stderr, "%s\n", err.toLocal8Bit().constData());
      return 1;
    }
    return 0;
  }
  rackreach::gui::MainWindow w;
  w.show();
  if (!project.isEmpty()) {  // opening it offers its recovery, if a session before did not end cleanly
    if (const QStringList p = w.open_file(project); !p.isEmpty())
      QMessageBox::warning(&w, QObject::tr("The file was not opened"), p.join('\n'));
  } else {
    w.offer_recovery();  // unsaved edits of the last session that did not end cleanly, if any
  }
  return app.exec();
}
