// SPDX-License-Identifier: MIT
// Benchmark, not a test: the time from one edit (a part's weight) to the repainted main window, on a large store.
// bench_gui_edit PROJECT [REPEATS]. Prints the median of the reassessment (the kept review's update and the models'
// reset) and of the repaint of the whole window at 1280x800, offscreen, with the inspected slot holding the edited
// part and with another slot inspected; a swap of two slots' parts; and, for comparison, assess_project alone (what
// every edit cost before the review was kept) and StoreReviewer::update alone.

#include <QApplication>
#include <QElapsedTimer>
#include <QPixmap>

#include <algorithm>
#include <cstdio>
#include <vector>

#include "app/gui/edit_commands.hpp"
#include "app/gui/main_window.hpp"
#include "app/gui/rack_view.hpp"
#include "app/gui/store_tables.hpp"

int main(int argc, char** argv) {
  if (argc < 2) {
    std::fputs("usage: bench_gui_edit PROJECT [REPEATS]\n", stderr);
    return 2;
  }
  if (qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
  QApplication app(argc, argv);
  const int repeats = argc > 2 ? std::atoi(argv[2]) : 15;
  rackreach::gui::MainWindow w(false);
  if (const QStringList p = w.open_file(QString::fromLocal8Bit(argv[1])); !p.isEmpty()) {
    std::fprintf(stderr, "%s\n", p.join('\n').toLocal8Bit().constData());
    return 1;
  }
  auto& m = w.model();
  w.resize(1280, 800);
  w.show();
  QApplication::processEvents();
  w.select_slot(0);
  std::printf("slots %zu, parts %zu\n", m.project().store.slots.size(), m.project().store.parts.size());
  std::vector<double> edit_ms, paint_ms, total_ms;
  for (int i = 0; i < repeats; ++i) {
    rackreach::Part p = m.project().store.parts.at(0);
    p.unit_weight *= (i % 2 ? 0.5 : 2.0);
    QElapsedTimer t;
    t.start();
    m.undo_stack()->push(new rackreach::gui::ReplacePartCommand(m, 0, p, "bench"));
    const double e = t.nsecsElapsed() / 1e6;
    const QPixmap px = w.grab();  // paints every widget of the window
    const double all = t.nsecsElapsed() / 1e6;
    edit_ms.push_back(e);
    paint_ms.push_back(all - e);
    total_ms.push_back(all);
  }
  auto median = [](std::vector<double> v) {
    std::sort(v.begin(), v.end());
    return v[v.size() / 2];
  };
  // The same edit while another slot is inspected (the inspector is not laid out again).
  std::vector<double> other_ms;
  w.select_slot(m.project().store.slots.size() / 3);
  for (int i = 0; i < repeats; ++i) {
    rackreach::Part p = m.project().store.parts.at(0);
    p.unit_weight *= (i % 2 ? 0.5 : 2.0);
    QElapsedTimer t;
    t.start();
    m.undo_stack()->push(new rackreach::gui::ReplacePartCommand(m, 0, p, "bench"));
    const QPixmap px = w.grab();
    other_ms.push_back(t.nsecsElapsed() / 1e6);
  }
  w.select_slot(0);
  // The engine's share: assess_project alone on the same project and options.
  std::vector<double> engine_ms;
  for (int i = 0; i < std::clamp(repeats / 3, 3, 5); ++i) {
    rackreach::AssessOptions options;
    options.reach = m.reach();
    QElapsedTimer t;
    t.start();
    const rackreach::ProjectAssessment a = rackreach::assess_project(m.project(), options);
    engine_ms.push_back(t.nsecsElapsed() / 1e6);
  }
  // The kept review's share: StoreReviewer::update after one part edit, on the same project.
  std::vector<double> update_ms;
  {
    rackreach::AssessOptions options;
    options.reach = m.reach();
    rackreach::Project project = m.project();
    rackreach::StoreReviewer reviewer(project.units, rackreach::make_review_options(options, project.duration_rule));
    rackreach::StoreReview review = reviewer.review(project.store);
    for (int i = 0; i < repeats; ++i) {
      project.store.parts.at(0).unit_weight *= (i % 2 ? 0.5 : 2.0);
      QElapsedTimer t;
      t.start();
      reviewer.update(review, project.store, {{rackreach::StoreEdit::Kind::part, 0}});
      update_ms.push_back(t.nsecsElapsed() / 1e6);
    }
  }
  // A slot edit: the parts of two slots swapped (drag-to-swap), edit to repainted window.
  std::vector<double> swap_ms;
  {
    rackreach::gui::SlotsTableModel slots(m);
    for (int i = 0; i < repeats; ++i) {
      QElapsedTimer t;
      t.start();
      slots.swap_parts(0, m.project().store.slots.size() / 2);
      const QPixmap px = w.grab();
      swap_ms.push_back(t.nsecsElapsed() / 1e6);
    }
  }
  std::printf("assess_project alone:                 median %.1f ms\n", median(engine_ms));
  std::printf("StoreReviewer::update alone (part):   median %.2f ms\n", median(update_ms));
  std::printf("swap two slots' parts to repainted:   median %.1f ms (min %.1f, max %.1f)\n", median(swap_ms),
              *std::min_element(swap_ms.begin(), swap_ms.end()), *std::max_element(swap_ms.begin(), swap_ms.end()));
  std::printf("edit -> reassessed and models reset: median %.1f ms\n", median(edit_ms));
  std::printf("repaint of the window (1280x800):     median %.1f ms\n", median(paint_ms));
  std::printf("same, another slot inspected:         median %.1f ms (min %.1f, max %.1f)\n", median(other_ms),
              *std::min_element(other_ms.begin(), other_ms.end()), *std::max_element(other_ms.begin(), other_ms.end()));
  std::printf("edit to repainted window:             median %.1f ms (min %.1f, max %.1f) over %d edits\n",
              median(total_ms), *std::min_element(total_ms.begin(), total_ms.end()),
              *std::max_element(total_ms.begin(), total_ms.end()), repeats);
  return 0;
}
