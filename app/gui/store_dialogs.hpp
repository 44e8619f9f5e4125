// SPDX-License-Identifier: MIT
#pragma once
// Dialogs that add or edit a rack (with its levels) or a zone. What they make is checked by the project file's
// loader (ProjectModel::check_store): a change the loader would refuse is refused here with the loader's own
// message, and the dialog stays open. The main window turns an accepted dialog into one undoable step.

#include <QDialog>

#include <optional>

#include "app/gui/project_model.hpp"

class QCheckBox;
class QComboBox;
class QLabel;
class QLineEdit;
class QSpinBox;
class QTableWidget;

namespace rackreach::gui {

/// Adds a rack (index empty) or edits rack `index`: id, kind, zone, bays, bay width, shelf depth and the levels
/// (id, surface height, clear height, hand or truck access) from the floor up.
class RackDialog : public QDialog {
  Q_OBJECT

 public:
  RackDialog(const ProjectModel& model, std::optional<std::size_t> index, QWidget* parent = nullptr);

  QLineEdit* id_edit() const { return id_; }
  QComboBox* kind_box() const { return kind_; }
  QComboBox* zone_box() const { return zone_; }
  QSpinBox* bays_box() const { return bays_; }
  QLineEdit* bay_width_edit() const { return bay_width_; }
  QLineEdit* shelf_depth_edit() const { return shelf_depth_; }
  /// Columns: id, surface height, clear height, access (hand/truck).
  QTableWidget* levels_table() const { return levels_; }
  void add_level();
  void remove_level(int row);
  /// Checks the rack as the loader would; accepts the dialog when it loads. False (with message()) otherwise.
  bool try_accept();
  QString message() const;
  /// The store with the rack in place (after an accepted dialog).
  const Store& result() const { return result_; }

 private:
  std::optional<Rack> read(QString& why) const;
  const ProjectModel& model_;
  std::optional<std::size_t> index_;
  QLineEdit* id_ = nullptr;
  QComboBox* kind_ = nullptr;
  QComboBox* zone_ = nullptr;
  QSpinBox* bays_ = nullptr;
  QLineEdit* bay_width_ = nullptr;
  QLineEdit* shelf_depth_ = nullptr;
  QTableWidget* levels_ = nullptr;
  QLabel* message_ = nullptr;
  Store result_;
};

/// Adds a zone (index empty) or edits zone `index`: where pickers stand and put the parts down. An empty field
/// takes the built-in default (shown in grey), as in the project file.
class ZoneDialog : public QDialog {
  Q_OBJECT

 public:
  ZoneDialog(const ProjectModel& model, std::optional<std::size_t> index, QWidget* parent = nullptr);

  QLineEdit* id_edit() const { return id_; }
  /// Keys: standing_distance, cart_deck_height, cart_h, turn_angle, origin_angle.
  QLineEdit* field(const QString& key) const;
  QCheckBox* control_box() const { return control_; }
  bool try_accept();
  QString message() const;
  const Store& result() const { return result_; }

 private:
  const ProjectModel& model_;
  std::optional<std::size_t> index_;
  Zone original_;
  QLineEdit* id_ = nullptr;
  std::map<QString, QLineEdit*> fields_;
  QCheckBox* control_ = nullptr;
  QLabel* message_ = nullptr;
  Store result_;
};

}  // namespace rackreach::gui
