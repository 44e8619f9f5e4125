// SPDX-License-Identifier: MIT
// The desktop app's edits and safety nets: the kept review after edits equals a full assessment, CSV import
// through the preview and its column mapping, racks, levels and zones checked by the project file's loader, a
// task's frequency sample kept by the form, the recovery of unsaved edits after a crash, the findings' columns
// at 1280x800, keyboard shortcuts and the window's state.

#include <catch2/catch.hpp>

#include <QAction>
#include <QApplication>
#include <QComboBox>
#include <QFile>
#include <QHeaderView>
#include <QImage>
#include <QLineEdit>
#include <QPushButton>
#include <QScrollBar>
#include <QSettings>
#include <QSpinBox>
#include <QTabWidget>
#include <QTableView>
#include <QTableWidget>
#include <QTemporaryDir>
#include <QThread>
#include <QTimer>

#include <algorithm>
#include <cmath>
#include <set>

#include "app/gui/csv_import_dialog.hpp"
#include "app/gui/edit_commands.hpp"
#include "app/gui/findings_model.hpp"
#include "app/gui/inspector_view.hpp"
#include "app/gui/main_window.hpp"
#include "app/gui/rack_view.hpp"
#include "app/gui/screenshot.hpp"
#include "app/gui/store_dialogs.hpp"
#include "app/gui/store_tables.hpp"
#include "app/gui/task_form.hpp"
#include "engine/io/csv_import.hpp"
#include "engine/io/project_file.hpp"
#include "tests/shared_reference.hpp"

using namespace rackreach;
using namespace rackreach::gui;

namespace {

const QString demo = QString::fromStdString(shared_reference::repo_path("sample_tasks/kitting-store.rackreach.json"));
const QString dock =
    QString::fromStdString(shared_reference::repo_path("sample_tasks/receiving-dock-us.rackreach.json"));

/// The assessment the CLI would make of the model's project now, from nothing.
ProjectAssessment full_assessment(const ProjectModel& m) {
  AssessOptions o;
  o.reach = m.reach();
  return assess_project(m.project(), o);
}

void write_text(const QString& path, const std::string& text) {
  QFile f(path);
  REQUIRE(f.open(QIODevice::WriteOnly | QIODevice::Truncate));
  f.write(text.data(), static_cast<qint64>(text.size()));
}

/// Replaces the first line (the header) of a CSV text.
std::string with_header(const std::string& csv, const std::string& header) {
  return header + csv.substr(csv.find('\n'));
}

/// Runs `drive` on the first dialog of type D to open (from a modal exec()), then returns.
template <class D>
void when_dialog_opens(std::function<void(D&)> drive) {
  QTimer::singleShot(0, [drive] {
    for (QWidget* w : QApplication::topLevelWidgets())
      if (auto* d = qobject_cast<D*>(w); d && d->isVisible()) {
        drive(*d);
        return;
      }
  });
}

QAction* find_action(QWidget& w, const QKeySequence& k) {
  for (QAction* a : w.findChildren<QAction*>())
    if (a->shortcut() == k) return a;
  return nullptr;
}

}  // namespace

TEST_CASE("after part and slot edits and undo, the app's kept review equals a full assessment") {
  MainWindow w(false);
  REQUIRE(w.open_file(demo).isEmpty());
  ProjectModel& m = w.model();
  const StoreReview before = *m.review();
  Part p = m.project().store.parts.at(3);
  p.unit_weight *= 2.5;
  m.undo_stack()->push(new ReplacePartCommand(m, 3, p, "heavier"));
  CHECK(m.last_slots_evaluated() < m.project().store.slots.size());
  CHECK(*m.review() == *full_assessment(m).store);
  // Parts swapped between two slots (one step).
  SlotsTableModel slots(m);
  REQUIRE(slots.swap_parts(0, 7));
  CHECK(m.last_slots_evaluated() == 2);
  CHECK(*m.review() == *full_assessment(m).store);
  m.undo_stack()->undo();
  m.undo_stack()->undo();
  CHECK(*m.review() == before);
}

TEST_CASE("CSV import: the preview maps columns by name, lets the user change them, lists problems, imports") {
  QTemporaryDir dir;
  REQUIRE(dir.isValid());
  MainWindow w(false);
  REQUIRE(w.open_file(demo).isEmpty());
  ProjectModel& m = w.model();
  const Store& store = m.project().store;
  // The demo store's own parts and slots, as a warehouse system might export them: a part column named
  // "Item Code", which the importer does not know, and a colour column it has no field for.
  std::string parts = write_parts_csv(store.parts, m.units());
  const std::string header = parts.substr(0, parts.find('\n'));
  REQUIRE(header.rfind("id,", 0) == 0);
  parts = with_header(parts, "Item Code" + header.substr(2));
  const QString parts_file = dir.filePath("parts.csv"), slots_file = dir.filePath("slots.csv");
  write_text(parts_file, parts);
  write_text(slots_file, write_slots_csv(store.slots, m.units()));

  CsvImportDialog d(m, parts_file, slots_file);
  // Auto-matched by name: every column but "Item Code"; the preview shows the first rows under the choices.
  REQUIRE(d.mapping_box(CsvImportDialog::parts_table, 0)->currentData().toString().isEmpty());
  CHECK(d.mapping_box(CsvImportDialog::parts_table, 3)->currentData().toString() == "unit_weight_kg");
  CHECK(d.mapping_box(CsvImportDialog::slots_table, 0)->currentData().toString() == "id");
  CHECK(d.preview(CsvImportDialog::parts_table)->item(1, 1)->text() == QString::fromStdString(store.parts[0].family));
  CHECK(d.preview(CsvImportDialog::parts_table)->verticalHeaderItem(1)->text() == "line 2");
  // Without an id column nothing can be imported, and the importer says which column is missing.
  CHECK_FALSE(d.can_import());
  CHECK(d.problems().join('\n').contains("id"));
  // The user says what the column is; the import is then possible.
  QComboBox* id_box = d.mapping_box(CsvImportDialog::parts_table, 0);
  id_box->setCurrentIndex(id_box->findData("id"));
  INFO(d.problems().join('\n').toStdString());
  CHECK(d.problems().isEmpty());
  CHECK(d.can_import());
  CHECK(d.result().parts.size() == store.parts.size());
  CHECK(d.result().parts == store.parts);

  // A bad cell is named by line and column, marked in the preview, and stops the import.
  std::vector<Part> plain = store.parts;
  for (Part& p : plain) p.description.clear();  // no quoted commas before the weight
  std::string bad = with_header(write_parts_csv(plain, m.units()), "Item Code" + header.substr(2));
  std::size_t cell = bad.find('\n') + 1;
  for (int k = 0; k < 3; ++k) cell = bad.find(',', cell) + 1;  // the fourth cell: unit weight
  bad.replace(cell, bad.find(',', cell) - cell, "heavy");
  write_text(parts_file, bad);
  CsvImportDialog bad_dialog(m, parts_file, slots_file);
  QComboBox* b = bad_dialog.mapping_box(CsvImportDialog::parts_table, 0);
  b->setCurrentIndex(b->findData("id"));
  CHECK_FALSE(bad_dialog.can_import());
  CHECK(bad_dialog.problems().join('\n').contains("line 2, column 4"));
  CHECK(bad_dialog.preview(CsvImportDialog::parts_table)->item(1, 3)->background().color() != QColor(Qt::white));
  CHECK(bad_dialog.preview(CsvImportDialog::parts_table)->item(1, 3)->background().style() != Qt::NoBrush);

  // Through the main window: cancel changes nothing; an accepted import is one step of the history.
  const int steps = m.undo_stack()->count();
  const std::string text_before = m.project_text();
  when_dialog_opens<CsvImportDialog>([](CsvImportDialog& dlg) { dlg.reject(); });
  CHECK_FALSE(w.import_csv_files(parts_file, slots_file));
  CHECK(m.project_text() == text_before);
  CHECK(m.undo_stack()->count() == steps);
  // An import with problems cannot be accepted either.
  when_dialog_opens<CsvImportDialog>([](CsvImportDialog& dlg) {
    dlg.import_button()->click();  // disabled: nothing happens
    dlg.reject();
  });
  CHECK_FALSE(w.import_csv_files(parts_file, slots_file));
  CHECK(m.project_text() == text_before);
  // A good file of heavier parts: imported, and undo takes it back.
  std::vector<Part> heavier = store.parts;
  for (Part& p : heavier) p.unit_weight += 0.5;
  write_text(parts_file, write_parts_csv(heavier, m.units()));
  when_dialog_opens<CsvImportDialog>([](CsvImportDialog& dlg) {
    INFO(dlg.problems().join('\n').toStdString());
    CHECK(dlg.can_import());
    dlg.import_button()->click();
  });
  CHECK(w.import_csv_files(parts_file, slots_file));
  CHECK(m.project().store.parts == heavier);
  CHECK(m.undo_stack()->count() == steps + 1);
  m.undo_stack()->undo();
  CHECK(m.project_text() == text_before);
}

TEST_CASE("racks, levels and zones: edits the loader refuses are refused with its message; the rest undo") {
  MainWindow w(false);
  REQUIRE(w.open_file(demo).isEmpty());
  ProjectModel& m = w.model();
  const std::string before = m.project_text();

  // Levels that overlap: the loader's own rule and path.
  {
    RackDialog d(m, 0);
    QTableWidget* levels = d.levels_table();
    REQUIRE(levels->rowCount() >= 2);
    levels->item(1, 1)->setText(levels->item(0, 1)->text());  // level 2 on level 1's surface
    CHECK_FALSE(d.try_accept());
    CHECK(d.message().contains("racks[0].levels[1].surface_height"));
    CHECK(d.message().contains("must not overlap"));
    CHECK(d.result() == Store{});
  }
  // A rack whose bays no longer hold its slots.
  {
    RackDialog d(m, 0);
    d.bays_box()->setValue(1);
    CHECK_FALSE(d.try_accept());
    CHECK(d.message().contains("slots["));
  }
  // A zone farther than the loader allows.
  {
    ZoneDialog z(m, 0);
    z.field("standing_distance")->setText("500");
    CHECK_FALSE(z.try_accept());
    CHECK(z.message().contains("zones[0].standing_distance"));
  }
  // A rack that slots are in cannot be removed.
  CHECK(w.remove_rack_refusal(0).contains("slots["));
  // A part weight the loader does not accept is refused in the table (the old check only wanted it above 0).
  {
    PartsTableModel parts(m);
    CHECK_FALSE(parts.setData(parts.index(0, PartsTableModel::unit_weight), "5000", Qt::EditRole));
    CHECK(m.project_text() == before);
  }
  CHECK(m.project_text() == before);

  // A new rack with two levels, a renamed rack (its slots follow) and a new zone: each one step, each undone.
  RackDialog add(m, std::nullopt);
  add.id_edit()->setText("HP-9");
  add.add_level();
  REQUIRE(add.try_accept());
  m.undo_stack()->push(new SetStoreCommand(m, add.result(), "add rack"));
  REQUIRE(m.project().store.racks.back().id == "HP-9");
  CHECK(m.project().store.racks.back().levels.size() == 2);
  CHECK(m.check_as_file(m.project()).empty());

  RackDialog rename(m, 0);
  const std::string old_id = m.project().store.racks[0].id;
  rename.id_edit()->setText("HP-1-renamed");
  REQUIRE(rename.try_accept());
  m.undo_stack()->push(new SetStoreCommand(m, rename.result(), "rename rack"));
  for (const Slot& s : m.project().store.slots) CHECK(s.rack != old_id);
  CHECK(m.check_as_file(m.project()).empty());

  ZoneDialog zone(m, std::nullopt);
  zone.id_edit()->setText("PACKING");
  zone.field("turn_angle")->setText("90");
  REQUIRE(zone.try_accept());
  m.undo_stack()->push(new SetStoreCommand(m, zone.result(), "add zone"));
  CHECK(m.project().store.zones.back().turn_angle_deg.value == 90.0);

  m.undo_stack()->undo();
  m.undo_stack()->undo();
  m.undo_stack()->undo();
  CHECK(m.project_text() == before);
  m.undo_stack()->redo();
  CHECK(m.project().store.racks.back().id == "HP-9");
}

TEST_CASE("the task form keeps a task's frequency sample unless F itself is retyped") {
  ProjectModel m;
  REQUIRE(m.open(dock).empty());
  std::size_t job = 0, task = 0;
  bool found = false;
  for (std::size_t j = 0; j < m.project().jobs.size() && !found; ++j)
    for (std::size_t t = 0; t < m.project().jobs[j].details.size(); ++t)
      if (m.project().jobs[j].details[t].frequency_sample) {
        job = j, task = t, found = true;
        break;
      }
  REQUIRE(found);
  const FrequencySample sample = *m.project().jobs[job].details[task].frequency_sample;
  const double f = m.project().jobs[job].tasks[task].frequency_per_min;
  TaskForm form(m);
  form.load_task(job, task);
  // Another field edited: the sample stays, and F is still exactly the sample's.
  form.field("load")->setText("21");
  REQUIRE(form.replace_button()->isEnabled());
  form.replace_button()->click();
  const LiftJob& edited = m.project().jobs[job];
  CHECK(edited.tasks[task].load == 21.0);
  REQUIRE(edited.details[task].frequency_sample);
  CHECK(edited.details[task].frequency_sample->lifts_per_min == sample.lifts_per_min);
  CHECK(edited.details[task].frequency_sample->lifting_min == sample.lifting_min);
  CHECK(edited.tasks[task].frequency_per_min == f);
  CHECK(m.project_text().find("frequency_sample") != std::string::npos);
  // F retyped: the typed F is the task's now.
  form.load_task(job, task);
  form.field("frequency")->setText("3");
  form.replace_button()->click();
  CHECK_FALSE(m.project().jobs[job].details[task].frequency_sample);
  CHECK(m.project().jobs[job].tasks[task].frequency_per_min == 3.0);
  m.undo_stack()->undo();
  CHECK(m.project().jobs[job].details[task].frequency_sample);
}

TEST_CASE("unsaved edits survive a crash: autosave, destroy the window unsaved, reopen, restore") {
  QTemporaryDir dir;
  REQUIRE(dir.isValid());
  const QString recovery = dir.filePath("recovery");
  const QString project = dir.filePath("store.rackreach.json");
  REQUIRE(QFile::copy(demo, project));
  std::string edited;
  {
    auto* w = new MainWindow(false);
    w->set_recovery_dir(recovery);
    w->set_autosave_delay_ms(20);
    REQUIRE(w->open_file(project).isEmpty());
    CHECK_FALSE(QFile::exists(w->recovery_file()));
    ProjectModel& m = w->model();
    Part p = m.project().store.parts.at(0);
    p.unit_weight = 17.5;
    m.undo_stack()->push(new ReplacePartCommand(m, 0, p, "edit"));
    // The timer writes the recovery file after the pause.
    for (int i = 0; i < 100 && !QFile::exists(w->recovery_file()); ++i) {
      QApplication::processEvents(QEventLoop::AllEvents, 20);
      QThread::msleep(5);
    }
    REQUIRE(QFile::exists(w->recovery_file()));
    edited = m.project_text();
    delete w;  // no close, no save: as if the app had crashed
  }
  const std::string on_disk = *shared_reference::read_text(project.toStdString());
  CHECK(on_disk != edited);
  // Reopening the project offers the recovery, with its time; restoring gives the edited project, unsaved.
  MainWindow w(false);
  w.set_recovery_dir(recovery);
  bool asked = false;
  QDateTime written;
  w.set_recovery_question([&](const RecoveryFile& r) {
    asked = true;
    written = r.written;
    return true;
  });
  REQUIRE(w.open_file(project).isEmpty());
  CHECK(asked);
  CHECK(written.isValid());
  CHECK(std::abs(written.secsTo(QDateTime::currentDateTime())) < 600);
  CHECK(w.model().project_text() == edited);
  CHECK(w.model().modified());
  CHECK(w.isWindowModified());
  CHECK(w.model().project().store.parts.at(0).unit_weight == 17.5);
  // A clean save removes the recovery file.
  CHECK_FALSE(w.save_to(project).has_value());
  CHECK_FALSE(w.model().modified());
  CHECK_FALSE(QFile::exists(w.recovery_file()));

  // Discarding a recovery offered at start removes it and keeps the file as it is.
  Part p = w.model().project().store.parts.at(0);
  p.unit_weight = 3.0;
  w.model().undo_stack()->push(new ReplacePartCommand(w.model(), 0, p, "edit"));
  REQUIRE(w.autosave_now());
  MainWindow again(false);
  again.set_recovery_dir(recovery);
  again.set_recovery_question([](const RecoveryFile&) { return false; });
  CHECK_FALSE(again.offer_recovery());
  CHECK(find_recoveries(recovery).empty());
  // Undoing back to the saved state leaves nothing to recover either.
  REQUIRE(w.autosave_now());
  w.model().undo_stack()->undo();
  CHECK_FALSE(QFile::exists(w.recovery_file()));
}

TEST_CASE("File > Export report writes the audit report of the saved file; unsaved edits are refused") {
  QTemporaryDir dir;
  REQUIRE(dir.isValid());
  const QString project = dir.filePath("store.rackreach.json");
  REQUIRE(QFile::copy(demo, project));
  MainWindow w(false);
  REQUIRE(w.open_file(project).isEmpty());
  const QString pdf = dir.filePath("audit.pdf");
  const QStringList problems = w.export_report_to(pdf);
  INFO(problems.join("\n").toStdString());
  REQUIRE(problems.isEmpty());
  QFile out(pdf);
  REQUIRE(out.open(QIODevice::ReadOnly));
  CHECK(out.read(5) == "%PDF-");
  // Unsaved edits: refused with the reason, nothing written.
  Part p = w.model().project().store.parts.at(0);
  p.unit_weight = 9.5;
  w.model().undo_stack()->push(new ReplacePartCommand(w.model(), 0, p, "edit"));
  const QString html = dir.filePath("audit.html");
  const QStringList refused = w.export_report_to(html);
  REQUIRE(refused.size() == 1);
  CHECK(refused.front().contains("save it first"));
  CHECK_FALSE(QFile::exists(html));
}

TEST_CASE("at 1280x800 the findings show slot, LI, band and remedies without scrolling sideways") {
  MainWindow w(false);
  REQUIRE(w.open_file(demo).isEmpty());
  w.resize(1280, 800);
  w.show();
  QApplication::processEvents();
  QTableView* v = w.findings_view();
  const int right = v->columnViewportPosition(FindingsModel::remedies) + v->columnWidth(FindingsModel::remedies);
  CHECK(v->horizontalScrollBar()->value() == 0);
  for (int c : {FindingsModel::slot, FindingsModel::li, FindingsModel::band})
    CHECK(v->columnViewportPosition(c) + v->columnWidth(c) <= v->viewport()->width());
  CHECK(right <= v->viewport()->width());
  CHECK(v->model()->headerData(FindingsModel::li, Qt::Horizontal).toString() == "LI");
}

TEST_CASE("keyboard: every shortcut is used once, and the main ones move through the findings") {
  MainWindow w(false);
  REQUIRE(w.open_file(demo).isEmpty());
  std::set<QString> seen;
  for (QAction* a : w.findChildren<QAction*>())
    for (const QKeySequence& k : a->shortcuts()) {
      INFO(k.toString().toStdString() << " on " << a->text().toStdString());
      CHECK(seen.insert(k.toString()).second);
    }
  QAction* worst = find_action(w, QKeySequence(QStringLiteral("Ctrl+Shift+W")));
  REQUIRE(worst);
  worst->trigger();
  REQUIRE(w.selected_slot());
  CHECK(*w.selected_slot() == w.model().review()->findings.front().slot_index);
  QAction* next = find_action(w, QKeySequence(Qt::Key_F8));
  REQUIRE(next);
  next->trigger();
  REQUIRE(w.selected_slot());
  CHECK(*w.selected_slot() == w.model().review()->findings.at(1).slot_index);
  for (const char* k : {"Ctrl+O", "Ctrl+S", "Ctrl+I", "Ctrl+E", "Ctrl+M", "Ctrl+K", "Ctrl+1", "Ctrl+2", "Ctrl+R"})
    CHECK(find_action(w, QKeySequence(QString::fromLatin1(k))) != nullptr);
}

TEST_CASE("the window remembers its size and the split between drawing and lists") {
  // The test runner points QSettings at a temporary folder (gui_test_main.cpp): nothing of the user's is touched.
  {
    MainWindow w(true);
    w.show();
    w.resize(1100, 700);
    QApplication::processEvents();
    REQUIRE(w.close());
  }
  MainWindow again(true);
  CHECK(again.size() == QSize(1100, 700));
}

TEST_CASE("pictures of the CSV preview and the rack dialog") {
  const QString out = QStringLiteral(RACKREACH_GUI_TEST_OUT);
  QTemporaryDir dir;
  REQUIRE(dir.isValid());
  ProjectModel m;
  REQUIRE(m.open(demo).empty());
  // The demo store's files with a part column the importer does not know and one bad weight.
  std::vector<Part> plain = m.project().store.parts;
  for (Part& p : plain) p.description.clear();
  std::string parts = write_parts_csv(plain, m.units());
  parts = "Item Code" + parts.substr(2);
  std::size_t cell = parts.find('\n') + 1;
  for (int line = 0; line < 2; ++line) cell = parts.find('\n', cell) + 1;  // the fourth line
  for (int k = 0; k < 3; ++k) cell = parts.find(',', cell) + 1;
  parts.replace(cell, parts.find(',', cell) - cell, "12,5");  // a decimal comma: one cell too many
  write_text(dir.filePath("parts.csv"), parts);
  write_text(dir.filePath("slots.csv"), write_slots_csv(m.project().store.slots, m.units()));
  CsvImportDialog d(m, dir.filePath("parts.csv"), dir.filePath("slots.csv"));
  QComboBox* id_box = d.mapping_box(CsvImportDialog::parts_table, 0);
  id_box->setCurrentIndex(id_box->findData("id"));
  CHECK_FALSE(d.can_import());
  const QString csv_png = out + "/csv-preview.png";
  REQUIRE(save_widget_png(d, csv_png, QSize(1100, 640)).isEmpty());
  CHECK(QImage(csv_png).width() == 1100);

  // The task form on a task whose F comes from a sample (the note beside F).
  ProjectModel dock_model;
  REQUIRE(dock_model.open(dock).empty());
  TaskForm form(dock_model);
  const auto& jobs = dock_model.project().jobs;
  for (std::size_t j = 0; j < jobs.size(); ++j)
    for (std::size_t t = 0; t < jobs[j].details.size(); ++t)
      if (jobs[j].details[t].frequency_sample) form.load_task(j, t);
  CHECK(form.field_message("frequency").contains("from a sample"));
  REQUIRE(save_widget_png(form, out + "/task-form-sample.png", QSize(1100, 720)).isEmpty());

  RackDialog r(m, 3);
  r.levels_table()->item(2, 1)->setText("20");
  CHECK_FALSE(r.try_accept());
  const QString rack_png = out + "/rack-dialog.png";
  REQUIRE(save_widget_png(r, rack_png, QSize(640, 560)).isEmpty());
  CHECK(QImage(rack_png).height() == 560);
}

TEST_CASE("the walk: the worst slot, why, its part moved to the place its remedy names, the result") {
  MainWindow w(false);
  REQUIRE(w.open_file(demo).isEmpty());
  w.resize(1280, 800);
  w.show();
  QApplication::processEvents();
  ProjectModel& m = w.model();
  QAction* worst_action = find_action(w, QKeySequence(QStringLiteral("Ctrl+Shift+W")));
  REQUIRE(worst_action);
  worst_action->trigger();
  REQUIRE(w.selected_slot());
  const SlotFinding worst = *m.find_finding(*w.selected_slot());
  const std::string part = worst.part_id;
  CAPTURE(worst.slot_id, part);
  // Why: the inspector shows its LI and remedies.
  const QString why = w.inspector()->toPlainText();
  CHECK(why.contains(QStringLiteral("LI %1").arg(w.inspector()->shown_li())));
  const Remedy* waist = nullptr;
  for (const Remedy& r : worst.remedies)
    if (r.kind == RemedyKind::move_to_waist_zone) waist = &r;
  REQUIRE(waist);
  CHECK(why.contains(QString::fromStdString(waist->target)));
  CAPTURE(waist->reason);
  // The place the remedy names ("rack R level L front"), at a bay where it is free: the slot goes there by three
  // edits of the Slots table (bay, position, level; each checked by the loader, none taking a held place).
  const Store& store = m.project().store;
  const std::size_t index = worst.slot_index;
  const Slot before = store.slots[index];
  REQUIRE(waist->target.rfind("rack " + before.rack + " level ", 0) == 0);
  const std::string level = waist->target.substr(("rack " + before.rack + " level ").size(),
                                                 waist->target.rfind(' ') - ("rack " + before.rack + " level ").size());
  const bool front = waist->target.substr(waist->target.rfind(' ') + 1) == "front";
  auto held = [&](const std::string& l, int bay, bool f) {
    for (const Slot& s : store.slots)
      if (s.rack == before.rack && s.level == l && s.bay == bay && (s.position == SlotPosition::front) == f)
        return true;
    return false;
  };
  int bay = 0;
  for (int b = 1; b <= store.find_rack(before.rack)->bays && !bay; ++b)
    if (!held(level, b, front) && !held(before.level, b, front) &&
        !held(before.level, b, before.position == SlotPosition::front))
      bay = b;
  REQUIRE(bay > 0);
  SlotsTableModel slots(m);
  REQUIRE(
      slots.setData(slots.index(static_cast<int>(index), SlotsTableModel::bay), QString::number(bay), Qt::EditRole));
  REQUIRE(slots.setData(slots.index(static_cast<int>(index), SlotsTableModel::position), front ? "front" : "back",
                        Qt::EditRole));
  REQUIRE(slots.setData(slots.index(static_cast<int>(index), SlotsTableModel::level), QString::fromStdString(level),
                        Qt::EditRole));
  CHECK(m.last_slots_evaluated() == 1);
  const SlotFinding* moved = m.find_finding(index);
  REQUIRE(moved->part_id == part);
  REQUIRE(moved->result.li);
  // At the remedy's place the part's LI is the one the remedy promised, and the slot is within the limit.
  CHECK(*moved->result.li == Approx(*waist->number).epsilon(1e-12));
  CHECK((!worst.result.li || *moved->result.li < *worst.result.li));  // outside the equation before, or higher
  CHECK(moved->band == RiskBand::within_limit);
  CHECK(m.review()->findings.front().slot_id != worst.slot_id);
  CHECK(*m.review() == *full_assessment(m).store);
  const std::size_t rank =
      static_cast<std::size_t>(std::find_if(m.review()->findings.begin(), m.review()->findings.end(),
                                            [&](const SlotFinding& f) { return f.slot_index == index; }) -
                               m.review()->findings.begin());
  w.select_slot(index);
  const QString out = QStringLiteral(RACKREACH_GUI_TEST_OUT);
  REQUIRE(save_widget_png(w, out + "/walk-after-move.png", QSize(1280, 800)).isEmpty());
  // The walk's numbers, shown if a check above fails.
  INFO("worst " << worst.slot_id << " (" << part << ", " << band_name(worst.band) << ", V " << worst.lift.task.origin.v
                << " H " << worst.lift.task.origin.h << ") moved to rack " << before.rack << " level " << level
                << " bay " << bay << (front ? " front" : " back") << ": V " << moved->lift.task.origin.v << " H "
                << moved->lift.task.origin.h << " LI " << *moved->result.li << " (" << band_name(moved->band)
                << "), now rank " << rank + 1 << " of " << m.review()->findings.size() << "; new worst "
                << m.review()->findings.front().slot_id);
  CHECK(rank + 1 > 10);  // out of the top ten
}
