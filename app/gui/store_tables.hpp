// SPDX-License-Identifier: MIT
#pragma once
// Editable tables of the store's parts and slots. An edit is checked by the project model and, if it is
// acceptable, pushed as an undoable command; a refused edit says why (edit_refused). The tables show and edit
// lengths and masses in the project file's own units whatever View > Units says (their headers then say "as in
// the file"), so that a value typed is stored exactly as typed.

#include <QAbstractTableModel>

#include "app/gui/project_model.hpp"

namespace rackreach::gui {

class PartsTableModel : public QAbstractTableModel {
  Q_OBJECT

 public:
  enum Column { id, family, description, unit_weight, box_width, box_depth, box_height, pieces_per_kit,
                pieces_per_grasp, truck_only, column_count };
  explicit PartsTableModel(ProjectModel& model, QObject* parent = nullptr);
  int rowCount(const QModelIndex& parent = {}) const override;
  int columnCount(const QModelIndex& parent = {}) const override { return parent.isValid() ? 0 : column_count; }
  QVariant data(const QModelIndex& index, int role) const override;
  QVariant headerData(int section, Qt::Orientation o, int role) const override;
  Qt::ItemFlags flags(const QModelIndex& index) const override;
  bool setData(const QModelIndex& index, const QVariant& value, int role) override;

 Q_SIGNALS:
  void edit_refused(const QString& why);

 private:
  ProjectModel& model_;
};

class SlotsTableModel : public QAbstractTableModel {
  Q_OBJECT

 public:
  enum Column { id, part, rack, level, bay, position, fixed, li, column_count };
  explicit SlotsTableModel(ProjectModel& model, QObject* parent = nullptr);
  int rowCount(const QModelIndex& parent = {}) const override;
  int columnCount(const QModelIndex& parent = {}) const override { return parent.isValid() ? 0 : column_count; }
  QVariant data(const QModelIndex& index, int role) const override;
  QVariant headerData(int section, Qt::Orientation o, int role) const override;
  Qt::ItemFlags flags(const QModelIndex& index) const override;
  bool setData(const QModelIndex& index, const QVariant& value, int role) override;
  Qt::DropActions supportedDropActions() const override { return Qt::MoveAction; }
  QStringList mimeTypes() const override;
  QMimeData* mimeData(const QModelIndexList& indexes) const override;
  /// Dropping a slot's row on another slot's row swaps their parts (one undoable command).
  bool dropMimeData(const QMimeData* data, Qt::DropAction action, int row, int column,
                    const QModelIndex& parent) override;

  /// Moves the part of slot `from` to slot `to`, and the part of `to` to `from` (one undoable step).
  bool swap_parts(std::size_t from, std::size_t to);

 Q_SIGNALS:
  void edit_refused(const QString& why);

 private:
  ProjectModel& model_;
};

}  // namespace rackreach::gui
