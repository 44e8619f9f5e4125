// SPDX-License-Identifier: MIT
#include "app/gui/main_window.hpp"

#include <QAction>
#include <QActionGroup>
#include <QApplication>
#include <QCloseEvent>
#include <QComboBox>
#include <QFileDialog>
#include <QFile>
#include <QFileInfo>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QInputDialog>
#include <QLayout>
#include <QLabel>
#include <QListWidget>
#include <QMenuBar>
#include <QMessageBox>
#include <QPointer>
#include <QPushButton>
#include <QScrollArea>
#include <QSettings>
#include <QSplitter>
#include <QStatusBar>
#include <QTabWidget>
#include <QTableView>
#include <QTimer>
#include <QVBoxLayout>

#include <algorithm>
#include <set>
#include <tuple>

#include "app/gui/csv_import_dialog.hpp"
#include "app/gui/edit_commands.hpp"
#include "app/gui/findings_model.hpp"
#include "app/gui/format.hpp"
#include "app/gui/inspector_view.hpp"
#include "app/gui/rack_view.hpp"
#include "app/gui/section_view.hpp"
#include "app/gui/store_dialogs.hpp"
#include "app/gui/store_tables.hpp"
#include "app/gui/task_form.hpp"
#include "app/report/report_writer.hpp"
#include "engine/caution.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/io/csv_import.hpp"
#include "engine/io/project_file.hpp"
#include "engine/io/review_output.hpp"

namespace rackreach::gui {
namespace {
constexpr int max_recent = 8;
const char* const settings_org = "Rackreach";
const char* const settings_app = "rackreach-gui";

QTableView* make_table(QAbstractItemModel* m) {
  auto* v = new QTableView;
  v->setModel(m);
  v->setSelectionBehavior(QAbstractItemView::SelectRows);
  v->setSelectionMode(QAbstractItemView::SingleSelection);
  v->setAlternatingRowColors(true);
  v->verticalHeader()->setDefaultSectionSize(22);
  v->verticalHeader()->hide();
  v->horizontalHeader()->setStretchLastSection(true);
  return v;
}
}  // namespace

MainWindow::MainWindow(bool remember, QWidget* parent) : QMainWindow(parent), remember_(remember) {
  setObjectName("main_window");
  rack_list_ = new QListWidget;
  rack_list_->setAccessibleName(tr("Racks"));
  rack_list_->setMaximumWidth(130);
  rack_view_ = new RackView(model_);
  section_ = new SectionView(model_);
  inspector_ = new InspectorView(model_);

  auto* rack_box = new QWidget;
  auto* rack_box_layout = new QVBoxLayout(rack_box);
  rack_box_layout->setContentsMargins(0, 0, 0, 0);
  auto* racks_label = new QLabel(tr("&Racks"));
  racks_label->setBuddy(rack_list_);
  rack_box_layout->addWidget(racks_label);
  rack_box_layout->addWidget(rack_list_, 1);
  summary_ = new QLabel;
  summary_->setWordWrap(true);
  rack_box_layout->addWidget(summary_);

  auto* right = new QSplitter(Qt::Vertical);
  right->addWidget(section_);
  right->addWidget(inspector_);
  right->setStretchFactor(0, 0);
  right->setStretchFactor(1, 1);
  right->setSizes({260, 340});

  auto* top = new QSplitter(Qt::Horizontal);
  top->addWidget(rack_box);
  top->addWidget(rack_view_);
  top->addWidget(right);
  top->setStretchFactor(1, 1);
  top->setSizes({110, 800, 370});

  // Findings with their filters.
  findings_ = new FindingsModel(model_, this);
  filter_ = new FindingsFilter(this);
  filter_->setSourceModel(findings_);
  filter_->setSortRole(FindingsModel::sort_role);
  findings_view_ = make_table(filter_);
  findings_view_->setSortingEnabled(true);
  findings_view_->sortByColumn(FindingsModel::rank, Qt::AscendingOrder);
  findings_view_->setAccessibleName(tr("Ranked findings"));
  // Slot, LI, band and remedies in view at 1280x800; long remedy lists are elided (the tooltip has them all).
  findings_view_->horizontalHeader()->setStretchLastSection(false);
  findings_view_->setTextElideMode(Qt::ElideRight);
  findings_view_->setWordWrap(false);
  const std::pair<FindingsModel::Column, int> widths[] = {
                               {FindingsModel::rank, 56}, {FindingsModel::slot, 104}, {FindingsModel::li, 56},
                               {FindingsModel::band, 112}, {FindingsModel::remedies, 330}, {FindingsModel::part, 84},
                               {FindingsModel::family, 96}, {FindingsModel::rack, 56}, {FindingsModel::level, 48},
                               {FindingsModel::bay, 40}, {FindingsModel::position, 52}, {FindingsModel::load, 72},
                               {FindingsModel::frequency, 64}, {FindingsModel::li_origin, 70},
                               {FindingsModel::li_destination, 64}, {FindingsModel::reach, 190}};
  for (auto [column, width] : widths) findings_view_->setColumnWidth(column, width);
  auto* findings_page = new QWidget;
  auto* fl = new QVBoxLayout(findings_page);
  fl->setContentsMargins(4, 4, 4, 4);
  auto* filters = new QHBoxLayout;
  auto add_filter = [&](const QString& label, QComboBox*& box) {
    box = new QComboBox;
    box->setSizeAdjustPolicy(QComboBox::AdjustToContents);
    auto* l = new QLabel(label);
    l->setBuddy(box);
    filters->addWidget(l);
    filters->addWidget(box);
    connect(box, &QComboBox::currentIndexChanged, this, &MainWindow::apply_filter);
  };
  add_filter(tr("&Band:"), band_filter_);
  add_filter(tr("&Family:"), family_filter_);
  add_filter(tr("Rac&k:"), rack_filter_);
  add_filter(tr("Re&medy:"), remedy_filter_);
  filters->addStretch(1);
  fl->addLayout(filters);
  fl->addWidget(findings_view_);

  parts_ = new PartsTableModel(model_, this);
  slots_ = new SlotsTableModel(model_, this);
  parts_view_ = make_table(parts_);
  slots_view_ = make_table(slots_);
  slots_view_->setDragEnabled(true);
  slots_view_->setAcceptDrops(true);
  slots_view_->setDropIndicatorShown(true);
  slots_view_->setDragDropMode(QAbstractItemView::DragDrop);
  slots_view_->setDefaultDropAction(Qt::MoveAction);
  parts_view_->setAccessibleName(tr("Parts"));
  slots_view_->setAccessibleName(tr("Slots (drag a row onto another to swap their parts)"));
  task_form_ = new TaskForm(model_);

  tabs_ = new QTabWidget;
  tabs_->addTab(findings_page, tr("Findings"));
  tabs_->addTab(parts_view_, tr("Parts"));
  tabs_->addTab(slots_view_, tr("Slots"));
  auto* task_scroll = new QScrollArea;  // the form is taller than the tab at 1280x800
  task_scroll->setWidget(task_form_);
  task_scroll->setWidgetResizable(true);
  tabs_->addTab(task_scroll, tr("Lift task"));

  auto* main_split = new QSplitter(Qt::Vertical);
  main_split->addWidget(top);
  main_split->addWidget(tabs_);
  main_split->setStretchFactor(0, 3);
  main_split->setStretchFactor(1, 2);
  main_split->setSizes({500, 220});
  tabs_->setMinimumHeight(150);
  main_split->setObjectName("main_split");

  caution_ = new QLabel(tr("Caution: %1").arg(QString::fromUtf8(caution_text)));
  caution_->setWordWrap(true);
  caution_->setObjectName("caution");
  caution_->setStyleSheet("QLabel#caution { background: #FFF8DC; border-top: 1px solid #B8A000; padding: 3px; }");
  caution_->setAccessibleName(tr("Caution"));

  auto* central = new QWidget;
  auto* cl = new QVBoxLayout(central);
  cl->setContentsMargins(0, 0, 0, 0);
  cl->setSpacing(0);
  cl->addWidget(main_split, 1);
  cl->addWidget(caution_);
  setCentralWidget(central);
  // Tab goes rack list, drawing, section, inspector, then the tabs below (the findings' filters, then the list).
  setTabOrder(rack_list_, rack_view_);
  setTabOrder(rack_view_, inspector_);
  setTabOrder(inspector_, tabs_);
  setTabOrder(tabs_, band_filter_);
  setTabOrder(band_filter_, family_filter_);
  setTabOrder(family_filter_, rack_filter_);
  setTabOrder(rack_filter_, remedy_filter_);
  setTabOrder(remedy_filter_, findings_view_);

  connect(rack_list_, &QListWidget::currentRowChanged, rack_view_, &RackView::set_rack);
  connect(rack_view_, &RackView::slot_selected, this, [this](std::size_t s) { select_slot(s); });
  connect(findings_view_->selectionModel(), &QItemSelectionModel::currentRowChanged, this,
          [this](const QModelIndex& current) {
            if (syncing_selection_ || !current.isValid()) return;
            const QVariant v = current.siblingAtColumn(0).data(FindingsModel::slot_index_role);
            if (v.isValid()) select_slot(static_cast<std::size_t>(v.toULongLong()));
          });
  connect(slots_view_->selectionModel(), &QItemSelectionModel::currentRowChanged, this,
          [this](const QModelIndex& current) {
            if (!syncing_selection_ && current.isValid()) select_slot(static_cast<std::size_t>(current.row()));
          });
  for (auto* t : {parts_, static_cast<PartsTableModel*>(nullptr)}) {
    if (!t) continue;
    connect(t, &PartsTableModel::edit_refused, this, [this](const QString& why) { statusBar()->showMessage(why, 8000); });
  }
  connect(slots_, &SlotsTableModel::edit_refused, this, [this](const QString& why) { statusBar()->showMessage(why, 8000); });
  connect(&model_, &ProjectModel::changed, this, &MainWindow::refresh_lists);
  connect(&model_, &ProjectModel::file_changed, this, &MainWindow::refresh_title);
  connect(&model_, &ProjectModel::file_changed, this, &MainWindow::on_display_changed);  // the file's units
  connect(&model_, &ProjectModel::display_changed, this, [this] {
    on_display_changed();
    if (remember_)
      QSettings(settings_org, settings_app).setValue("view/units", display_choice_key(model_.display_choice()));
  });
  units_label_ = new QLabel;
  units_label_->setAccessibleName(tr("Units shown"));
  statusBar()->addPermanentWidget(units_label_);

  // Autosave: unsaved edits go to the recovery file after a pause in editing (and at each step of the history
  // while the timer runs, it starts again).
  if (remember_) recovery_dir_ = default_recovery_dir();
  autosave_timer_ = new QTimer(this);
  autosave_timer_->setSingleShot(true);
  autosave_timer_->setInterval(5000);
  connect(autosave_timer_, &QTimer::timeout, this, [this] { autosave_now(); });
  connect(model_.undo_stack(), &QUndoStack::indexChanged, this, &MainWindow::on_history_changed);

  build_menus();
  if (remember_)
    if (const auto c = parse_display_choice(QSettings(settings_org, settings_app).value("view/units").toString()))
      model_.set_display_choice(*c);
  on_display_changed();
  refresh_lists();
  refresh_title();
  statusBar()->showMessage(tr("Open a project file (Ctrl+O) to assess its store."));
  resize(1280, 800);
  if (remember_) {
    QSettings s(settings_org, settings_app);
    restoreGeometry(s.value("window/geometry").toByteArray());
    restoreState(s.value("window/state").toByteArray());
    main_split->restoreState(s.value("window/main_split").toByteArray());
  }
}

MainWindow::~MainWindow() {
  // The undo stack's last signals (it clears itself when the model dies) must reach no one.
  autosave_timer_->stop();
  QObject::disconnect(model_.undo_stack(), nullptr, nullptr, nullptr);
  QObject::disconnect(&model_, nullptr, nullptr, nullptr);
  // QWidget's destructor would delete the children only after this class's members (the project model, the
  // action map) are gone, and in the order they were made, so an item model could die before the views that
  // read it. Delete them here while everything they use still lives: the widgets (views, menus) first, then the
  // item models, actions and timers. QPointer: a child may delete a sibling itself.
  for (const bool widgets : {true, false}) {
    QList<QPointer<QObject>> kids;
    for (QObject* k : children())
      if (k->isWidgetType() == widgets && !qobject_cast<QLayout*>(k)) kids << k;
    for (const QPointer<QObject>& k : kids) delete k.data();
  }
}

void MainWindow::build_menus() {
  QMenu* file = menuBar()->addMenu(tr("&File"));
  file->addAction(tr("&New metric project"), QKeySequence::New, this, [this] {
    if (confirm_discard()) model_.new_project(UnitSystem::metric);
  });
  file->addAction(tr("New &US project"), this, [this] {
    if (confirm_discard()) model_.new_project(UnitSystem::us);
  });
  file->addAction(tr("&Open..."), QKeySequence::Open, this, &MainWindow::on_open);
  recent_menu_ = file->addMenu(tr("Open &recent"));
  file->addAction(tr("&Save"), QKeySequence::Save, this, &MainWindow::on_save);
  file->addAction(tr("Save &as..."), QKeySequence::SaveAs, this, &MainWindow::on_save_as);
  file->addSeparator();
  file->addAction(tr("&Import parts and slots from CSV..."), QKeySequence(tr("Ctrl+I")), this, &MainWindow::on_import_csv);
  file->addAction(tr("Export findings as &CSV..."), QKeySequence(tr("Ctrl+E")), this, [this] { on_export(false); });
  file->addAction(tr("Export findings as &HTML..."), QKeySequence(tr("Ctrl+Shift+E")), this, [this] { on_export(true); });
  file->addAction(tr("Export audit &report (PDF or HTML)..."), QKeySequence(tr("Ctrl+Shift+R")), this,
                  &MainWindow::on_export_report);
  file->addSeparator();
  file->addAction(tr("&Quit"), QKeySequence::Quit, this, &QWidget::close);

  QMenu* edit = menuBar()->addMenu(tr("&Edit"));
  QAction* undo = model_.undo_stack()->createUndoAction(this, tr("&Undo"));
  undo->setShortcut(QKeySequence::Undo);
  QAction* redo = model_.undo_stack()->createRedoAction(this, tr("&Redo"));
  redo->setShortcut(QKeySequence::Redo);
  edit->addAction(undo);
  edit->addAction(redo);
  edit->addSeparator();
  edit->addAction(tr("&Move the selected slot's part to slot..."), QKeySequence(tr("Ctrl+M")), this,
                  &MainWindow::on_move_part);
  edit->addAction(tr("Add a &slot..."), QKeySequence(tr("Ctrl+Shift+A")), this, &MainWindow::on_add_slot);
  edit->addAction(tr("Remove the selected slot"), QKeySequence(tr("Ctrl+Shift+Del")), this, &MainWindow::on_remove_slot);
  edit->addAction(tr("Add a &part..."), QKeySequence(tr("Ctrl+Shift+P")), this, &MainWindow::on_add_part);
  edit->addAction(tr("Remove the selected part"), this, &MainWindow::on_remove_part);
  edit->addSeparator();
  edit->addAction(tr("Add a ra&ck..."), QKeySequence(tr("Ctrl+Shift+K")), this, [this] { on_edit_rack(true); });
  edit->addAction(tr("&Edit the shown rack and its levels..."), QKeySequence(tr("Ctrl+K")), this,
                  [this] { on_edit_rack(false); });
  edit->addAction(tr("Remove the shown rack"), this, &MainWindow::on_remove_rack);
  edit->addAction(tr("Add a &zone..."), this, [this] { on_edit_zone(true); });
  edit->addAction(tr("Edit a zo&ne..."), QKeySequence(tr("Ctrl+J")), this, [this] { on_edit_zone(false); });
  edit->addAction(tr("Remove a zone..."), this, &MainWindow::on_remove_zone);

  QMenu* view = menuBar()->addMenu(tr("&View"));
  view->addAction(tr("Rack &drawing"), QKeySequence(tr("Ctrl+1")), this, [this] { rack_view_->setFocus(); });
  view->addAction(tr("&Findings"), QKeySequence(tr("Ctrl+2")), this, [this] {
    tabs_->setCurrentIndex(0);
    findings_view_->setFocus();
  });
  view->addAction(tr("&Inspector"), QKeySequence(tr("Ctrl+3")), this, [this] { inspector_->setFocus(); });
  view->addAction(tr("&Rack list"), QKeySequence(tr("Ctrl+R")), this, [this] { rack_list_->setFocus(); });
  view->addAction(tr("&Worst slot"), QKeySequence(tr("Ctrl+Shift+W")), this, [this] {
    if (const StoreReview* r = model_.review(); r && !r->findings.empty()) {
      select_slot(r->findings.front().slot_index);
      tabs_->setCurrentIndex(0);
      findings_view_->setFocus();
    }
  });
  view->addAction(tr("&Next finding"), QKeySequence(Qt::Key_F8), this, [this] { step_finding(1); });
  view->addAction(tr("&Previous finding"), QKeySequence(Qt::SHIFT | Qt::Key_F8), this, [this] { step_finding(-1); });
  view->addAction(tr("&Lift task form"), QKeySequence(tr("Ctrl+4")), this, [this] {
    tabs_->setCurrentIndex(tabs_->count() - 1);
    task_form_->setFocus();
  });
  // Units: what is shown only; the file keeps its units and everything is computed in them.
  QMenu* units = view->addMenu(tr("&Units"));
  auto* group = new QActionGroup(this);
  const std::pair<DisplayChoice, QString> choices[] = {{DisplayChoice::as_file, tr("As in the &file")},
                                                       {DisplayChoice::metric, tr("&Metric (cm, kg)")},
                                                       {DisplayChoice::us, tr("&US (in, lb)")}};
  for (const auto& [choice, text] : choices) {
    QAction* a = units->addAction(text);
    a->setCheckable(true);
    group->addAction(a);
    units_actions_[choice] = a;
    connect(a, &QAction::triggered, this, [this, c = choice] { model_.set_display_choice(c); });
  }
  update_recent_menu();
}

QStringList MainWindow::open_file(const QString& path) {
  const std::vector<Problem> problems = model_.open(path);
  QStringList out;
  for (const Problem& p : problems) out << q(format_problem(path.toStdString(), p));
  if (!out.isEmpty()) return out;
  add_recent(path);
  written_recovery_.clear();
  // Unsaved edits of this project left by a session that did not end cleanly.
  if (!offering_ && !recovery_dir_.isEmpty())
    if (const auto r = read_recovery(recovery_file_for(recovery_dir_, path))) offer(*r);
  selected_.reset();
  select_slot(std::nullopt);
  if (rack_list_->count() > 0) rack_list_->setCurrentRow(0);
  for (const Problem& p : model_.assess_problems()) out << q(format_problem(path.toStdString(), p));
  statusBar()->showMessage(out.isEmpty() ? tr("Opened %1").arg(path) : tr("Opened; the reach checks could not be "
                                                                          "made: %1").arg(out.join("; ")));
  return {};
}

void MainWindow::select_slot(std::optional<std::size_t> slot_index) {
  selected_ = slot_index;
  rack_view_->set_selected_slot(slot_index);
  section_->set_selected_slot(slot_index);
  inspector_->set_selected_slot(slot_index);
  if (rack_list_->currentRow() != rack_view_->rack()) {
    const QSignalBlocker b(rack_list_);
    rack_list_->setCurrentRow(rack_view_->rack());
  }
  if (!slot_index) return;
  // The lists follow the selection and scroll it into view. Their own signals stay on (a blocked selection model
  // would not tell its view either), and the guard keeps them from selecting again.
  syncing_selection_ = true;
  const int row = findings_->find_row(*slot_index);
  if (row >= 0) {
    const QModelIndex proxy = filter_->mapFromSource(findings_->index(row, 0));
    if (proxy.isValid()) {
      if (findings_view_->currentIndex().row() != proxy.row())
        findings_view_->selectionModel()->setCurrentIndex(
            proxy, QItemSelectionModel::ClearAndSelect | QItemSelectionModel::Rows);
      findings_view_->scrollTo(proxy);
    }
  }
  const QModelIndex slot_row = slots_->index(static_cast<int>(*slot_index), 0);
  slots_view_->selectionModel()->setCurrentIndex(slot_row,
                                                 QItemSelectionModel::ClearAndSelect | QItemSelectionModel::Rows);
  slots_view_->scrollTo(slot_row);
  syncing_selection_ = false;
}

void MainWindow::refresh_lists() {
  const Store& store = model_.project().store;
  {
    // The rack list is made again only when the racks changed (not after every edit of a part or slot).
    QStringList labels;
    for (const Rack& r : store.racks) labels << tr("%1 (%2 levels)").arg(q(r.id)).arg(r.levels.size());
    bool same = labels.size() == rack_list_->count();
    for (int i = 0; same && i < labels.size(); ++i) same = rack_list_->item(i)->text() == labels[i];
    const QSignalBlocker b(rack_list_);
    const int cur = rack_list_->currentRow();
    if (!same) {
      rack_list_->clear();
      rack_list_->addItems(labels);
    }
    rack_list_->setCurrentRow(cur >= 0 && cur < rack_list_->count() ? cur : (rack_list_->count() ? 0 : -1));
    rack_view_->set_rack(rack_list_->currentRow());
  }
  // The filters' choices: filled again (and the filter applied again) only when they changed.
  bool filters_changed = false;
  auto refill = [&filters_changed](QComboBox* box, const std::set<std::string>& items) {
    bool same = box->count() == static_cast<int>(items.size()) + 1;
    int i = 1;
    for (auto it = items.begin(); same && it != items.end(); ++it, ++i) same = box->itemData(i).toString() == q(*it);
    if (same) return;
    const QSignalBlocker b(box);
    const QString cur = box->currentData().toString();
    box->clear();
    box->addItem(tr("any"), QString());
    for (const std::string& s : items) box->addItem(q(s), q(s));
    const int k = box->findData(cur);
    box->setCurrentIndex(k >= 0 ? k : 0);
    filters_changed = filters_changed || box->currentData().toString() != cur;
  };
  std::set<std::string> families, racks, remedies;
  std::vector<bool> remedy_seen(static_cast<std::size_t>(RemedyKind::outside_scope) + 1, false);
  int over = 0, outside = 0;
  if (const StoreReview* r = model_.review()) {
    // Families and racks from the store (small records; a family with no slot shows no rows), remedies from the
    // findings.
    const std::string* last = nullptr;
    for (const Part& p : store.parts)
      if (!last || *last != p.family) families.insert(*(last = &p.family));
    for (const Rack& k : store.racks) racks.insert(k.id);
    for (const SlotFinding& f : r->findings) {
      for (const Remedy& m : f.remedies) remedy_seen[static_cast<std::size_t>(m.kind)] = true;
      if (f.truck_access) continue;
      if (f.band == RiskBand::outside_equation) ++outside;
      else if (f.band != RiskBand::within_limit) ++over;
    }
  }
  for (std::size_t k = 0; k < remedy_seen.size(); ++k)
    if (remedy_seen[k]) remedies.insert(remedy_name(static_cast<RemedyKind>(k)));
  if (band_filter_->count() == 0) {
    const QSignalBlocker b(band_filter_);
    band_filter_->addItem(tr("any"), QString());
    for (const char* s : {"within limit", "elevated", "high", "very high", "outside equation", "truck level"})
      band_filter_->addItem(QString::fromLatin1(s), QString::fromLatin1(s));
  }
  refill(family_filter_, families);
  refill(rack_filter_, racks);
  refill(remedy_filter_, remedies);
  if (filters_changed) apply_filter();
  // One line of figures under the rack list.
  if (const StoreReview* r = model_.review()) {
    summary_->setText(tr("%1 slots: %2 above LI 1, %3 outside the equation").arg(r->findings.size()).arg(over).arg(outside));
  } else {
    summary_->setText(model_.project().jobs.empty() ? tr("No store.") : tr("%1 lift jobs, no store.").arg(model_.project().jobs.size()));
  }
  if (selected_) select_slot(selected_);
}

void MainWindow::apply_filter() {
  filter_->set_filter(band_filter_->currentData().toString(), family_filter_->currentData().toString(),
                      rack_filter_->currentData().toString(), remedy_filter_->currentData().toString());
}

void MainWindow::step_finding(int by) {
  const int rows = filter_->rowCount();
  if (rows == 0) return;
  const int row = findings_view_->currentIndex().isValid() ? findings_view_->currentIndex().row() + by : 0;
  const QModelIndex i = filter_->index(std::clamp(row, 0, rows - 1), 0);
  findings_view_->selectionModel()->setCurrentIndex(i, QItemSelectionModel::ClearAndSelect | QItemSelectionModel::Rows);
  findings_view_->scrollTo(i);
}

void MainWindow::on_display_changed() {
  const UnitDisplay d = model_.display();
  if (const auto it = units_actions_.find(model_.display_choice()); it != units_actions_.end())
    it->second->setChecked(true);
  units_label_->setText(d.converts() ? tr("Units shown: %1, %2 (file: %3, %4)")
                                           .arg(d.length_unit(), d.mass_unit(), d.file_length_unit(), d.file_mass_unit())
                                     : tr("Units shown: %1, %2, as in the file").arg(d.length_unit(), d.mass_unit()));
}

void MainWindow::refresh_title() {
  const QString name = model_.file_path().isEmpty() ? tr("untitled") : QFileInfo(model_.file_path()).fileName();
  setWindowTitle(tr("%1[*] - Rackreach").arg(name));
  setWindowModified(model_.modified());
}

void MainWindow::add_recent(const QString& path) {
  if (!remember_) return;
  QSettings s(settings_org, settings_app);
  QStringList recent = s.value("recent_files").toStringList();
  const QString abs = QFileInfo(path).absoluteFilePath();
  recent.removeAll(abs);
  recent.prepend(abs);
  while (recent.size() > max_recent) recent.removeLast();
  s.setValue("recent_files", recent);
  update_recent_menu();
}

void MainWindow::update_recent_menu() {
  recent_menu_->clear();
  const QStringList recent = remember_ ? QSettings(settings_org, settings_app).value("recent_files").toStringList()
                                       : QStringList();
  for (const QString& f : recent)
    recent_menu_->addAction(f, this, [this, f] {
      if (!confirm_discard()) return;
      if (const QStringList p = open_file(f); !p.isEmpty()) show_problems(tr("The file was not opened"), p);
    });
  recent_menu_->setEnabled(!recent.isEmpty());
}

bool MainWindow::confirm_discard() {
  if (!model_.modified()) return true;
  const auto answer = QMessageBox::question(this, tr("Unsaved changes"),
                                            tr("The project has changes that are not saved. Save them first?"),
                                            QMessageBox::Save | QMessageBox::Discard | QMessageBox::Cancel);
  if (answer == QMessageBox::Save) return on_save();
  if (answer == QMessageBox::Discard) remove_recovery();
  return answer == QMessageBox::Discard;
}

void MainWindow::set_autosave_delay_ms(int ms) { autosave_timer_->setInterval(ms); }

QString MainWindow::recovery_file() const {
  return recovery_dir_.isEmpty() ? QString() : recovery_file_for(recovery_dir_, model_.file_path());
}

void MainWindow::on_history_changed() {
  if (recovery_dir_.isEmpty() || offering_) return;
  if (model_.modified()) autosave_timer_->start();  // again from zero at every edit
  else {
    // Back at the saved state (or a project just opened): nothing of this window's to recover. A recovery of a
    // project being opened is left for open_file() to offer.
    autosave_timer_->stop();
    if (!written_recovery_.isEmpty()) QFile::remove(written_recovery_);
    written_recovery_.clear();
  }
}

bool MainWindow::autosave_now() {
  autosave_timer_->stop();
  if (recovery_dir_.isEmpty() || !model_.modified()) return false;
  const QString file = recovery_file();
  if (!written_recovery_.isEmpty() && written_recovery_ != file) QFile::remove(written_recovery_);
  if (auto err = write_recovery(recovery_dir_, model_.file_path(), model_.project_text(), QDateTime::currentDateTime())) {
    statusBar()->showMessage(tr("The recovery copy could not be written: %1").arg(q(*err)), 8000);
    return false;
  }
  written_recovery_ = file;
  return true;
}

void MainWindow::remove_recovery() {
  autosave_timer_->stop();
  if (!written_recovery_.isEmpty()) QFile::remove(written_recovery_);
  if (const QString f = recovery_file(); !f.isEmpty()) QFile::remove(f);
  written_recovery_.clear();
}

bool MainWindow::offer_recovery() {
  if (recovery_dir_.isEmpty()) return false;
  const std::vector<RecoveryFile> found = find_recoveries(recovery_dir_);
  return !found.empty() && offer(found.front());
}

bool MainWindow::offer(const RecoveryFile& r) {
  const QString name = r.project_path.isEmpty() ? tr("an untitled project") : r.project_path;
  bool restore = false;
  if (ask_recovery_) restore = ask_recovery_(r);
  else {
    QMessageBox box(QMessageBox::Question, tr("Unsaved changes found"),
                    tr("Rackreach was not closed cleanly. Unsaved changes to %1 were kept at %2.")
                        .arg(name, QLocale().toString(r.written, QLocale::LongFormat)),
                    QMessageBox::NoButton, this);
    QPushButton* restore_button = box.addButton(tr("&Restore the changes"), QMessageBox::AcceptRole);
    box.addButton(tr("&Discard them"), QMessageBox::DestructiveRole);
    box.setDefaultButton(restore_button);
    box.exec();
    restore = box.clickedButton() == restore_button;
  }
  if (!restore) {
    QFile::remove(r.file);
    return false;
  }
  LoadResult loaded = load_project_text(r.project_text);
  if (!loaded.project) {
    QStringList lines;
    for (const Problem& p : loaded.problems) lines << q(format_problem(r.file.toStdString(), p));
    show_problems(tr("The recovery copy could not be read; it is kept at %1").arg(r.file), lines);
    return false;
  }
  offering_ = true;
  model_.set_project(std::move(*loaded.project), r.project_path);
  model_.mark_unsaved();
  offering_ = false;
  written_recovery_ = r.file;  // kept until saved or discarded
  selected_.reset();
  select_slot(std::nullopt);
  if (rack_list_->count() > 0) rack_list_->setCurrentRow(0);
  statusBar()->showMessage(tr("Restored the unsaved changes of %1 (kept %2); save to keep them.")
                               .arg(name, QLocale().toString(r.written, QLocale::ShortFormat)));
  return true;
}

void MainWindow::closeEvent(QCloseEvent* e) {
  if (!confirm_discard()) {
    e->ignore();
    return;
  }
  if (remember_) {
    QSettings s(settings_org, settings_app);
    s.setValue("window/geometry", saveGeometry());
    s.setValue("window/state", saveState());
    if (auto* split = findChild<QSplitter*>("main_split")) s.setValue("window/main_split", split->saveState());
  }
  e->accept();
}

void MainWindow::show_problems(const QString& title, const QStringList& lines) {
  QMessageBox box(QMessageBox::Warning, title, title, QMessageBox::Ok, this);
  box.setInformativeText(lines.mid(0, 12).join('\n') + (lines.size() > 12 ? tr("\n... and %1 more").arg(lines.size() - 12) : ""));
  box.setDetailedText(lines.join('\n'));
  box.exec();
}

void MainWindow::on_open() {
  if (!confirm_discard()) return;
  const QString path = QFileDialog::getOpenFileName(this, tr("Open project"), {},
                                                    tr("Rackreach projects (*.rackreach.json *.json)"));
  if (path.isEmpty()) return;
  if (const QStringList p = open_file(path); !p.isEmpty()) show_problems(tr("The file was not opened"), p);
}

std::optional<QString> MainWindow::save_to(const QString& path) {
  if (auto err = model_.save_as(path)) {
    const QString why = tr("Not saved to %1: %2. The file there, if any, is unchanged.").arg(path, q(*err));
    statusBar()->showMessage(why);
    return why;
  }
  add_recent(path);
  remove_recovery();
  statusBar()->showMessage(tr("Saved %1").arg(path), 5000);
  return std::nullopt;
}

bool MainWindow::on_save() {
  if (model_.file_path().isEmpty()) return on_save_as();
  if (auto why = save_to(model_.file_path())) {
    QMessageBox::warning(this, tr("Not saved"), *why);
    return false;
  }
  return true;
}

bool MainWindow::on_save_as() {
  QString path = QFileDialog::getSaveFileName(this, tr("Save project as"), model_.file_path(),
                                              tr("Rackreach projects (*.rackreach.json)"));
  if (path.isEmpty()) return false;
  if (!path.endsWith(".json")) path += ".rackreach.json";
  if (auto why = save_to(path)) {
    QMessageBox::warning(this, tr("Not saved"), *why);
    return false;
  }
  return true;
}

void MainWindow::on_import_csv() {
  const QString parts = QFileDialog::getOpenFileName(this, tr("Part master (CSV)"), {}, tr("CSV (*.csv)"));
  if (parts.isEmpty()) return;
  const QString slots = QFileDialog::getOpenFileName(this, tr("Slot list (CSV)"), QFileInfo(parts).absolutePath(),
                                                     tr("CSV (*.csv)"));
  if (slots.isEmpty()) return;
  import_csv_files(parts, slots);
}

bool MainWindow::import_csv_files(const QString& parts_file, const QString& slots_file) {
  autosave_now();  // a long dialog: the edits so far are safe first
  CsvImportDialog dialog(model_, parts_file, slots_file, this);
  if (dialog.exec() != QDialog::Accepted || !dialog.can_import()) {
    statusBar()->showMessage(tr("Nothing was imported."), 5000);
    return false;
  }
  CsvImport r = dialog.result();
  model_.undo_stack()->push(new ReplaceStoreItemsCommand(model_, std::move(r.parts), std::move(r.slots),
                                                         tr("Import parts and slots from CSV")));
  select_slot(std::nullopt);
  statusBar()->showMessage(tr("Imported %1 parts and %2 slots.").arg(model_.project().store.parts.size())
                               .arg(model_.project().store.slots.size()), 5000);
  return true;
}

void MainWindow::on_edit_rack(bool add) {
  const auto& racks = model_.project().store.racks;
  std::optional<std::size_t> index;
  if (!add) {
    if (rack_view_->rack() < 0 || static_cast<std::size_t>(rack_view_->rack()) >= racks.size()) {
      statusBar()->showMessage(tr("Choose a rack in the rack list first."), 5000);
      return;
    }
    index = static_cast<std::size_t>(rack_view_->rack());
  }
  autosave_now();
  RackDialog d(model_, index, this);
  if (d.exec() != QDialog::Accepted) return;
  const QString text = add ? tr("Add rack %1").arg(d.id_edit()->text()) : tr("Edit rack %1").arg(d.id_edit()->text());
  model_.undo_stack()->push(new SetStoreCommand(model_, d.result(), text));
}

void MainWindow::on_remove_rack() {
  const auto& racks = model_.project().store.racks;
  const int i = rack_view_->rack();
  if (i < 0 || static_cast<std::size_t>(i) >= racks.size()) return;
  const QString id = q(racks[static_cast<std::size_t>(i)].id);
  if (const QString why = remove_rack_refusal(static_cast<std::size_t>(i)); !why.isEmpty()) {
    QMessageBox::warning(this, tr("Rack not removed"), why);
    return;
  }
  select_slot(std::nullopt);
  model_.undo_stack()->push(new SetStoreCommand(model_, model_.store_without_rack(static_cast<std::size_t>(i)),
                                                tr("Remove rack %1").arg(id)));
}

QString MainWindow::remove_rack_refusal(std::size_t index) const {
  const std::vector<Problem> p = model_.check_store(model_.store_without_rack(index));
  return p.empty() ? QString() : tr("Not removed (the project file's rules): %1").arg(q(ProjectModel::describe_problems(p)));
}

std::optional<std::size_t> MainWindow::choose_zone(const QString& title) {
  const auto& zones = model_.project().store.zones;
  if (zones.empty()) {
    statusBar()->showMessage(tr("The store has no zones."), 5000);
    return std::nullopt;
  }
  QStringList ids;
  for (const Zone& z : zones) ids << q(z.id);
  int current = 0;  // the shown rack's zone first
  if (const int r = rack_view_->rack(); r >= 0 && static_cast<std::size_t>(r) < model_.project().store.racks.size())
    current = std::max(0, static_cast<int>(ids.indexOf(q(model_.project().store.racks[static_cast<std::size_t>(r)].zone))));
  if (zones.size() == 1) return 0;
  bool ok = false;
  const QString id = QInputDialog::getItem(this, title, tr("Zone:"), ids, current, false, &ok);
  if (!ok) return std::nullopt;
  return static_cast<std::size_t>(ids.indexOf(id));
}

void MainWindow::on_edit_zone(bool add) {
  std::optional<std::size_t> index;
  if (!add) {
    index = choose_zone(tr("Edit zone"));
    if (!index) return;
  }
  autosave_now();
  ZoneDialog d(model_, index, this);
  if (d.exec() != QDialog::Accepted) return;
  model_.undo_stack()->push(new SetStoreCommand(model_, d.result(), (add ? tr("Add zone %1") : tr("Edit zone %1"))
                                                                        .arg(d.id_edit()->text())));
}

void MainWindow::on_remove_zone() {
  const auto index = choose_zone(tr("Remove zone"));
  if (!index) return;
  const Store s = model_.store_without_zone(*index);
  if (const std::vector<Problem> p = model_.check_store(s); !p.empty()) {
    QMessageBox::warning(this, tr("Zone not removed"),
                         tr("Not removed (the project file's rules): %1").arg(q(ProjectModel::describe_problems(p))));
    return;
  }
  model_.undo_stack()->push(new SetStoreCommand(model_, s, tr("Remove zone %1").arg(q(model_.project().store.zones[*index].id))));
}

void MainWindow::on_export(bool html) {
  if (!model_.review()) {
    QMessageBox::information(this, tr("Nothing to export"), tr("The project has no store, so there are no findings."));
    return;
  }
  const QString path = QFileDialog::getSaveFileName(this, html ? tr("Export findings (HTML)") : tr("Export findings (CSV)"),
                                                    {}, html ? tr("HTML (*.html)") : tr("CSV (*.csv)"));
  if (path.isEmpty()) return;
  const std::string name = model_.file_path().isEmpty() ? "untitled" : QFileInfo(model_.file_path()).fileName().toStdString();
  const std::string text = html ? write_review_html(model_.project(), *model_.review(), name)
                                : write_review_csv(model_.project(), *model_.review());
  if (auto err = write_file_atomically(path.toStdString(), text))
    QMessageBox::warning(this, tr("Not exported"), tr("%1: %2").arg(path, q(*err)));
  else statusBar()->showMessage(tr("Exported %1").arg(path), 5000);
}

QStringList MainWindow::export_report_to(const QString& path) {
  if (model_.file_path().isEmpty() || model_.modified())
    return {tr("The project has unsaved edits: save it first, so that the report's input hash names the saved file.")};
  QFile in(model_.file_path());
  if (!in.open(QIODevice::ReadOnly)) return {tr("%1: cannot be read: %2").arg(model_.file_path(), in.errorString())};
  const QByteArray bytes = in.readAll();
  const report::ReportSource source{QFileInfo(model_.file_path()).fileName().toStdString(), bytes.toStdString()};
  const report::ReportResult r = report::write_report(model_.project(), source, path.toStdString(), {});
  QStringList problems;
  for (const std::string& p : r.problems) problems << q(p);
  if (!r.written && problems.isEmpty()) problems << tr("%1: the report was not written").arg(path);
  return problems;
}

void MainWindow::on_export_report() {
  if (model_.file_path().isEmpty() || model_.modified()) {
    const auto answer = QMessageBox::question(
        this, tr("Save before the report"),
        tr("The audit report records the SHA-256 of the project file on disk. Save the project now?"),
        QMessageBox::Save | QMessageBox::Cancel, QMessageBox::Save);
    if (answer != QMessageBox::Save || !on_save() || model_.modified()) return;
  }
  const QString path = QFileDialog::getSaveFileName(this, tr("Export audit report"), {},
                                                    tr("PDF (*.pdf);;HTML (*.html)"));
  if (path.isEmpty()) return;
  const QStringList problems = export_report_to(path);
  if (!problems.isEmpty()) show_problems(tr("Report not written"), problems);
  else statusBar()->showMessage(tr("Wrote the audit report %1").arg(path), 5000);
}

void MainWindow::on_move_part() {
  if (!selected_) {
    statusBar()->showMessage(tr("Select a slot first."), 5000);
    return;
  }
  const auto& slots = model_.project().store.slots;
  QStringList ids;
  for (const Slot& s : slots) ids << q(s.id) + " (" + q(s.part) + ")";
  bool ok = false;
  const QString choice = QInputDialog::getItem(this, tr("Move part"),
                                               tr("Move part %1 to slot (the parts swap):").arg(q(slots[*selected_].part)),
                                               ids, 0, false, &ok);
  if (!ok) return;
  slots_->swap_parts(*selected_, static_cast<std::size_t>(ids.indexOf(choice)));
}

void MainWindow::on_add_slot() {
  const Store& store = model_.project().store;
  if (store.racks.empty() || store.parts.empty()) {
    statusBar()->showMessage(tr("A slot needs a rack and a part."), 5000);
    return;
  }
  bool ok = false;
  const QString id = QInputDialog::getText(this, tr("Add slot"), tr("Slot id:"), QLineEdit::Normal, {}, &ok);
  if (!ok) return;
  Slot s;
  s.id = id.trimmed().toStdString();
  s.part = store.parts.front().id;
  s.rack = store.racks.front().id;
  s.level = store.racks.front().levels.empty() ? "" : store.racks.front().levels.front().id;
  // The first free place of the store (a quick look at which places are held), then the loader's check.
  std::set<std::tuple<std::string, std::string, int, int>> held;
  for (const Slot& o : store.slots) held.emplace(o.rack, o.level, o.bay, static_cast<int>(o.position));
  for (const Rack& r : store.racks)
    for (const Level& l : r.levels)
      for (int b = 1; b <= r.bays; ++b)
        for (SlotPosition p : {SlotPosition::front, SlotPosition::back}) {
          if (held.count({r.id, l.id, b, static_cast<int>(p)})) continue;
          Slot t = s;
          t.rack = r.id, t.level = l.id, t.bay = b, t.position = p;
          if (const std::string why = model_.validate_slot(t, std::nullopt); !why.empty()) {
            statusBar()->showMessage(tr("Not added: %1").arg(q(why)), 8000);
            return;
          }
          model_.undo_stack()->push(new InsertSlotCommand(model_, store.slots.size(), t, false,
                                                          tr("Add slot %1").arg(q(t.id))));
          select_slot(store.slots.size() - 1);
          return;
        }
  statusBar()->showMessage(tr("Not added: every place of the store's racks holds a slot."), 8000);
}

void MainWindow::on_remove_slot() {
  if (!selected_) return;
  const Slot s = model_.project().store.slots.at(*selected_);
  const std::size_t i = *selected_;
  select_slot(std::nullopt);
  model_.undo_stack()->push(new InsertSlotCommand(model_, i, s, true, tr("Remove slot %1").arg(q(s.id))));
}

void MainWindow::on_add_part() {
  bool ok = false;
  const QString id = QInputDialog::getText(this, tr("Add part"), tr("Part id:"), QLineEdit::Normal, {}, &ok);
  if (!ok) return;
  Part p;
  p.id = id.trimmed().toStdString();
  p.family = "new";
  p.unit_weight = 1.0;
  p.box = {model_.units() == UnitSystem::metric ? 20.0 : 8.0, model_.units() == UnitSystem::metric ? 20.0 : 8.0,
           model_.units() == UnitSystem::metric ? 10.0 : 4.0};
  if (const std::string why = model_.validate_part(p, std::nullopt); !why.empty()) {
    statusBar()->showMessage(tr("Not added: %1").arg(q(why)), 8000);
    return;
  }
  model_.undo_stack()->push(new InsertPartCommand(model_, model_.project().store.parts.size(), p, false,
                                                  tr("Add part %1").arg(q(p.id))));
  tabs_->setCurrentWidget(parts_view_);
}

void MainWindow::on_remove_part() {
  const QModelIndex i = parts_view_->currentIndex();
  if (!i.isValid()) {
    statusBar()->showMessage(tr("Select a part in the Parts table first."), 5000);
    return;
  }
  const Part p = model_.project().store.parts.at(static_cast<std::size_t>(i.row()));
  for (const Slot& s : model_.project().store.slots)
    if (s.part == p.id) {
      statusBar()->showMessage(tr("Part %1 is in slot %2: move it out first.").arg(q(p.id), q(s.id)), 8000);
      return;
    }
  model_.undo_stack()->push(new InsertPartCommand(model_, static_cast<std::size_t>(i.row()), p, true,
                                                  tr("Remove part %1").arg(q(p.id))));
}

}  // namespace rackreach::gui
