// SPDX-License-Identifier: MIT
#pragma once
// The ranked findings of the whole store as a Qt table model, and a filter by band, family, rack and remedy.

#include <QAbstractTableModel>
#include <QSortFilterProxyModel>

#include "app/gui/project_model.hpp"

namespace rackreach::gui {

class FindingsModel : public QAbstractTableModel {
  Q_OBJECT

 public:
  /// The slot, its LI, band and remedies first, so that they show without scrolling at 1280x800.
  enum Column { rank, slot, li, band, remedies, part, family, rack, level, bay, position, load, frequency, li_origin,
                li_destination, reach, column_count };
  /// Roles beside the display: the slot index, and the words the filters compare.
  static constexpr int slot_index_role = Qt::UserRole + 1;
  static constexpr int sort_role = Qt::UserRole + 2;
  static constexpr int remedy_names_role = Qt::UserRole + 3;

  explicit FindingsModel(ProjectModel& model, QObject* parent = nullptr);
  int rowCount(const QModelIndex& parent = {}) const override;
  int columnCount(const QModelIndex& parent = {}) const override;
  QVariant data(const QModelIndex& index, int role) const override;
  QVariant headerData(int section, Qt::Orientation o, int role) const override;
  /// The row of the finding of a slot, or -1.
  int find_row(std::size_t slot_index) const;

 private:
  ProjectModel& model_;
};

class FindingsFilter : public QSortFilterProxyModel {
  Q_OBJECT

 public:
  using QSortFilterProxyModel::QSortFilterProxyModel;
  /// Empty: any. Band words as band_name() gives them; remedy words as remedy_name().
  void set_filter(const QString& band, const QString& family, const QString& rack, const QString& remedy);

 protected:
  bool filterAcceptsRow(int row, const QModelIndex& parent) const override;
  /// The rank column compares the source rows themselves (they are in rank order): no text per comparison.
  bool lessThan(const QModelIndex& left, const QModelIndex& right) const override;

 private:
  QString band_, family_, rack_, remedy_;
};

}  // namespace rackreach::gui
