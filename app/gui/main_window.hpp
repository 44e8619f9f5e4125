// SPDX-License-Identifier: MIT
#pragma once
// The main window: the rack face in the centre with the rack list beside it, the side section and the inspector
// on the right, and below them the ranked findings, the parts and slots tables and the lift-task form. The
// caution line is always visible at the foot of the window.

#include <QMainWindow>

#include <map>
#include <optional>

#include "app/gui/project_model.hpp"

class QAction;
class QComboBox;
class QLabel;
class QListWidget;
class QMenu;
class QTableView;
class QTabWidget;

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

  ProjectModel& model() { return model_; }
  /// Opens a project file; on failure shows nothing and returns the problems, formatted.
  QStringList open_file(const QString& path);
  void select_slot(std::optional<std::size_t> slot_index);
  std::optional<std::size_t> selected_slot() const { return selected_; }
  /// Saves to `path`; returns the reason on failure (also shown in the status bar).
  std::optional<QString> save_to(const QString& path);

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
  void on_export(bool html);
  void on_add_slot();
  void on_remove_slot();
  void on_move_part();
  void on_add_part();
  void on_remove_part();
  void apply_filter();
  void show_problems(const QString& title, const QStringList& lines);
  void on_display_changed();

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
};

}  // namespace rackreach::gui
