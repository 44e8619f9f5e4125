// SPDX-License-Identifier: MIT
#pragma once
// The main window: the rack face in the centre with the rack list beside it, the side section and the inspector
// on the right, and below them the ranked findings, the parts and slots tables and the lift-task form. The
// caution line is always visible at the foot of the window.

#include <QMainWindow>

#include <functional>
#include <map>
#include <optional>

#include "app/gui/project_model.hpp"
#include "app/gui/recovery.hpp"

class QAction;
class QComboBox;
class QLabel;
class QListWidget;
class QMenu;
class QTableView;
class QTabWidget;
class QTimer;

namespace rackreach::gui {

class FindingsFilter;
class FindingsModel;
class InspectorView;
class PartsTableModel;
class RackView;
class SectionView;
class SlotsTableModel;
class TaskForm;

class MainWindow : public QMainWindow {
  Q_OBJECT

 public:
  /// `remember` false: window state and recent files are neither read nor written (tests, screenshots).
  explicit MainWindow(bool remember = true, QWidget* parent = nullptr);
  /// Leaves files as they are (a recovery file stays until a clean save or a discard).
  ~MainWindow() override;

  ProjectModel& model() { return model_; }
  /// Opens a project file; on failure shows nothing and returns the problems, formatted.
  QStringList open_file(const QString& path);
  void select_slot(std::optional<std::size_t> slot_index);
  std::optional<std::size_t> selected_slot() const { return selected_; }
  /// Saves to `path`; returns the reason on failure (also shown in the status bar).
  std::optional<QString> save_to(const QString& path);
  /// Writes the audit report (PDF or HTML by the extension) of the saved project file, the same report as
  /// `rackreach report`; returns the reasons on failure (nothing is written then). Unsaved edits are refused: the
  /// report's input hash must name the file on disk.
  QStringList export_report_to(const QString& path);

  RackView* rack_view() const { return rack_view_; }
  InspectorView* inspector() const { return inspector_; }
  TaskForm* task_form() const { return task_form_; }
  QTableView* findings_view() const { return findings_view_; }
  FindingsFilter* findings_filter() const { return filter_; }
  QTableView* parts_view() const { return parts_view_; }
  QTabWidget* tabs() const { return tabs_; }
  QLabel* caution_label() const { return caution_; }
  /// The View > Units action of a choice (checked when it is the one shown).
  QAction* units_action(DisplayChoice c) const { return units_actions_.at(c); }

  // Recovery of unsaved edits (recovery.hpp). Off while the folder is empty (the default with `remember` false).
  void set_recovery_dir(const QString& dir) { recovery_dir_ = dir; }
  QString recovery_dir() const { return recovery_dir_; }
  /// Seconds of no editing after which unsaved edits are written to the recovery file.
  void set_autosave_delay_ms(int ms);
  /// Writes the recovery file now if there are unsaved edits; false if nothing was written.
  bool autosave_now();
  /// The recovery file of the project as it is now named.
  QString recovery_file() const;
  /// What to do with a recovery found: true restores it, false discards it. Default: asks with a message box.
  void set_recovery_question(std::function<bool(const RecoveryFile&)> ask) { ask_recovery_ = std::move(ask); }
  /// At start without a project: offers the newest recovery of the folder, if any. True if one was restored.
  bool offer_recovery();

  /// Imports a part master and a slot list through the preview dialog (CsvImportDialog); true if imported.
  bool import_csv_files(const QString& parts_file, const QString& slots_file);
  /// Why the rack at `index` cannot be removed (the loader's message), or "".
  QString remove_rack_refusal(std::size_t index) const;

 protected:
  void closeEvent(QCloseEvent* e) override;

 private:
  void build_menus();
  void refresh_lists();
  void refresh_title();
  void update_recent_menu();
  void add_recent(const QString& path);
  bool confirm_discard();
  void on_open();
  bool on_save();
  bool on_save_as();
  void on_import_csv();
  void on_edit_rack(bool add);
  void on_remove_rack();
  void on_edit_zone(bool add);
  void on_remove_zone();
  std::optional<std::size_t> choose_zone(const QString& title);
  void on_export(bool html);
  void on_export_report();
  void on_add_slot();
  void on_remove_slot();
  void on_move_part();
  void on_add_part();
  void on_remove_part();
  void apply_filter();
  void show_problems(const QString& title, const QStringList& lines);
  void on_display_changed();
  void on_history_changed();
  void step_finding(int by);
  /// Offers `r` back; restores it into the model (marked unsaved) or removes it.
  bool offer(const RecoveryFile& r);
  void remove_recovery();

  ProjectModel model_;
  bool remember_;
  std::optional<std::size_t> selected_;
  bool syncing_selection_ = false;  ///< true while select_slot() moves the lists' current rows itself
  QListWidget* rack_list_ = nullptr;
  RackView* rack_view_ = nullptr;
  SectionView* section_ = nullptr;
  InspectorView* inspector_ = nullptr;
  FindingsModel* findings_ = nullptr;
  FindingsFilter* filter_ = nullptr;
  QTableView* findings_view_ = nullptr;
  QComboBox* band_filter_ = nullptr;
  QComboBox* family_filter_ = nullptr;
  QComboBox* rack_filter_ = nullptr;
  QComboBox* remedy_filter_ = nullptr;
  PartsTableModel* parts_ = nullptr;
  SlotsTableModel* slots_ = nullptr;
  QTableView* parts_view_ = nullptr;
  QTableView* slots_view_ = nullptr;
  TaskForm* task_form_ = nullptr;
  QTabWidget* tabs_ = nullptr;
  QLabel* caution_ = nullptr;
  QLabel* summary_ = nullptr;
  QMenu* recent_menu_ = nullptr;
  std::map<DisplayChoice, QAction*> units_actions_;
  QLabel* units_label_ = nullptr;
  QString recovery_dir_;
  QTimer* autosave_timer_ = nullptr;
  QString written_recovery_;  ///< the recovery file this window last wrote
  std::function<bool(const RecoveryFile&)> ask_recovery_;
  bool offering_ = false;     ///< while a recovery is put back (its own open is not offered again)
};

}  // namespace rackreach::gui
