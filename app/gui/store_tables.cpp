// SPDX-License-Identifier: MIT
#include "app/gui/store_tables.hpp"

#include <QMimeData>

#include "app/gui/edit_commands.hpp"
#include "app/gui/format.hpp"

namespace rackreach::gui {
namespace {

/// A number from the text, or nothing.
std::optional<double> read_number(const QVariant& v) {
  bool ok = false;
  const double d = v.toString().trimmed().toDouble(&ok);
  if (!ok) return std::nullopt;
  return d;
}

}  // namespace

PartsTableModel::PartsTableModel(ProjectModel& model, QObject* parent) : QAbstractTableModel(parent), model_(model) {
  connect(&model_, &ProjectModel::changed, this, [this] {
    beginResetModel();
    endResetModel();
  });
  // The table shows and edits in the file's units; only its headers say so when the rest of the app converts.
  connect(&model_, &ProjectModel::display_changed, this,
          [this] { Q_EMIT headerDataChanged(Qt::Horizontal, 0, column_count - 1); });
}

int PartsTableModel::rowCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : static_cast<int>(model_.project().store.parts.size());
}

QVariant PartsTableModel::headerData(int section, Qt::Orientation o, int role) const {
  if (o != Qt::Horizontal || role != Qt::DisplayRole) return {};
  // Values here are in the file's units, whatever View > Units shows elsewhere (an edit is stored as typed).
  const UnitDisplay d = model_.display();
  const QString as_file = d.converts() ? tr(", as in the file") : QString();
  const QString mu = d.file_mass_unit() + as_file, lu = d.file_length_unit() + as_file;
  switch (section) {
    case id: return tr("Part");
    case family: return tr("Family");
    case description: return tr("Description");
    case unit_weight: return tr("Unit weight (%1)").arg(mu);
    case box_width: return tr("Box width (%1)").arg(lu);
    case box_depth: return tr("Box depth (%1)").arg(lu);
    case box_height: return tr("Box height (%1)").arg(lu);
    case pieces_per_kit: return tr("Pieces/kit");
    case pieces_per_grasp: return tr("Pieces/grasp");
    case truck_only: return tr("Truck only");
  }
  return {};
}

QVariant PartsTableModel::data(const QModelIndex& index, int role) const {
  const auto& parts = model_.project().store.parts;
  if (!index.isValid() || static_cast<std::size_t>(index.row()) >= parts.size()) return {};
  const Part& p = parts[static_cast<std::size_t>(index.row())];
  if (role == Qt::CheckStateRole && index.column() == truck_only) return p.truck_only ? Qt::Checked : Qt::Unchecked;
  if (role != Qt::DisplayRole && role != Qt::EditRole) return {};
  switch (index.column()) {
    case id: return q(p.id);
    case family: return q(p.family);
    case description: return q(p.description);
    case unit_weight: return p.unit_weight;
    case box_width: return p.box.width;
    case box_depth: return p.box.depth;
    case box_height: return p.box.height;
    case pieces_per_kit: return p.pieces_per_kit;
    case pieces_per_grasp: return p.pieces_per_grasp;
    case truck_only: return p.truck_only ? tr("yes") : tr("no");
  }
  return {};
}

Qt::ItemFlags PartsTableModel::flags(const QModelIndex& index) const {
  Qt::ItemFlags f = QAbstractTableModel::flags(index);
  if (index.column() == truck_only) return f | Qt::ItemIsUserCheckable;
  return f | Qt::ItemIsEditable;
}

bool PartsTableModel::setData(const QModelIndex& index, const QVariant& value, int role) {
  const auto& parts = model_.project().store.parts;
  if (!index.isValid() || static_cast<std::size_t>(index.row()) >= parts.size()) return false;
  const std::size_t row = static_cast<std::size_t>(index.row());
  Part p = parts[row];
  const int c = index.column();
  if (c == truck_only && role == Qt::CheckStateRole) p.truck_only = value.toInt() == Qt::Checked;
  else if (role != Qt::EditRole) return false;
  else if (c == id) p.id = value.toString().trimmed().toStdString();
  else if (c == family) p.family = value.toString().trimmed().toStdString();
  else if (c == description) p.description = value.toString().toStdString();
  else {
    const auto v = read_number(value);
    if (!v) {
      Q_EMIT edit_refused(tr("%1: \"%2\" is not a number").arg(headerData(c, Qt::Horizontal, Qt::DisplayRole).toString(),
                                                            value.toString()));
      return false;
    }
    double* field = c == unit_weight      ? &p.unit_weight
                    : c == box_width      ? &p.box.width
                    : c == box_depth      ? &p.box.depth
                    : c == box_height     ? &p.box.height
                    : c == pieces_per_kit ? &p.pieces_per_kit
                                          : &p.pieces_per_grasp;
    *field = *v;
  }
  if (const std::string why = model_.validate_part(p, row); !why.empty()) {
    Q_EMIT edit_refused(tr("Part %1: %2").arg(q(parts[row].id), q(why)));
    return false;
  }
  model_.undo_stack()->push(new ReplacePartCommand(
      model_, row, std::move(p),
      tr("Edit %1 of part %2").arg(headerData(c, Qt::Horizontal, Qt::DisplayRole).toString(), q(parts[row].id))));
  return true;
}

SlotsTableModel::SlotsTableModel(ProjectModel& model, QObject* parent) : QAbstractTableModel(parent), model_(model) {
  connect(&model_, &ProjectModel::changed, this, [this] {
    beginResetModel();
    endResetModel();
  });
}

int SlotsTableModel::rowCount(const QModelIndex& parent) const {
  return parent.isValid() ? 0 : static_cast<int>(model_.project().store.slots.size());
}

QVariant SlotsTableModel::headerData(int section, Qt::Orientation o, int role) const {
  if (o != Qt::Horizontal || role != Qt::DisplayRole) return {};
  switch (section) {
    case id: return tr("Slot");
    case part: return tr("Part");
    case rack: return tr("Rack");
    case level: return tr("Level");
    case bay: return tr("Bay");
    case position: return tr("Position");
    case fixed: return tr("Fixed");
    case li: return tr("LI (result)");
  }
  return {};
}

QVariant SlotsTableModel::data(const QModelIndex& index, int role) const {
  const auto& slots = model_.project().store.slots;
  if (!index.isValid() || static_cast<std::size_t>(index.row()) >= slots.size()) return {};
  const std::size_t row = static_cast<std::size_t>(index.row());
  const Slot& s = slots[row];
  if (role == Qt::CheckStateRole && index.column() == fixed) return s.fixed ? Qt::Checked : Qt::Unchecked;
  if (role != Qt::DisplayRole && role != Qt::EditRole) return {};
  switch (index.column()) {
    case id: return q(s.id);
    case part: return q(s.part);
    case rack: return q(s.rack);
    case level: return q(s.level);
    case bay: return s.bay;
    case position: return s.position == SlotPosition::front ? QStringLiteral("front") : QStringLiteral("back");
    case fixed: return s.fixed ? tr("yes") : tr("no");
    case li: {
      const SlotFinding* f = model_.find_finding(row);
      if (!f) return tr("not assessed");
      if (f->truck_access) return tr("truck");
      return fmt(f->result.li, 2, tr("outside"));
    }
  }
  return {};
}

Qt::ItemFlags SlotsTableModel::flags(const QModelIndex& index) const {
  Qt::ItemFlags f = QAbstractTableModel::flags(index) | Qt::ItemIsDragEnabled | Qt::ItemIsDropEnabled;
  if (!index.isValid()) return Qt::ItemIsDropEnabled;
  if (index.column() == li) return f;
  if (index.column() == fixed) return f | Qt::ItemIsUserCheckable;
  return f | Qt::ItemIsEditable;
}

bool SlotsTableModel::setData(const QModelIndex& index, const QVariant& value, int role) {
  const auto& slots = model_.project().store.slots;
  if (!index.isValid() || static_cast<std::size_t>(index.row()) >= slots.size()) return false;
  const std::size_t row = static_cast<std::size_t>(index.row());
  Slot s = slots[row];
  const QString text = value.toString().trimmed();
  const int c = index.column();
  if (c == fixed && role == Qt::CheckStateRole) s.fixed = value.toInt() == Qt::Checked;
  else if (role != Qt::EditRole) return false;
  else if (c == id) s.id = text.toStdString();
  else if (c == part) s.part = text.toStdString();
  else if (c == rack) s.rack = text.toStdString();
  else if (c == level) s.level = text.toStdString();
  else if (c == bay) {
    bool ok = false;
    s.bay = text.toInt(&ok);
    if (!ok) {
      Q_EMIT edit_refused(tr("Bay: \"%1\" is not a whole number").arg(text));
      return false;
    }
  } else if (c == position) {
    if (text != "front" && text != "back") {
      Q_EMIT edit_refused(tr("Position: \"%1\" must be front or back").arg(text));
      return false;
    }
    s.position = text == "front" ? SlotPosition::front : SlotPosition::back;
  }
  if (const std::string why = model_.validate_slot(s, row); !why.empty()) {
    Q_EMIT edit_refused(tr("Slot %1: %2").arg(q(slots[row].id), q(why)));
    return false;
  }
  model_.undo_stack()->push(new ReplaceSlotCommand(
      model_, row, std::move(s),
      tr("Edit %1 of slot %2").arg(headerData(c, Qt::Horizontal, Qt::DisplayRole).toString(), q(slots[row].id))));
  return true;
}

bool SlotsTableModel::swap_parts(std::size_t from, std::size_t to) {
  const auto& slots = model_.project().store.slots;
  if (from >= slots.size() || to >= slots.size() || from == to) return false;
  Slot a = slots[from], b = slots[to];
  std::swap(a.part, b.part);
  const QString text = tr("Move part %1 to slot %2").arg(q(slots[from].part), q(slots[to].id));
  model_.undo_stack()->push(new ReplaceSlotsCommand(model_, {{from, std::move(a)}, {to, std::move(b)}}, text));
  return true;
}

QStringList SlotsTableModel::mimeTypes() const { return {QStringLiteral("application/x-rackreach-slot-row")}; }

QMimeData* SlotsTableModel::mimeData(const QModelIndexList& indexes) const {
  if (indexes.isEmpty()) return nullptr;
  auto* d = new QMimeData;
  d->setData(mimeTypes().front(), QByteArray::number(indexes.front().row()));
  return d;
}

bool SlotsTableModel::dropMimeData(const QMimeData* data, Qt::DropAction, int row, int, const QModelIndex& parent) {
  if (!data || !data->hasFormat(mimeTypes().front())) return false;
  const int target = parent.isValid() ? parent.row() : row;
  if (target < 0) return false;
  return swap_parts(static_cast<std::size_t>(data->data(mimeTypes().front()).toInt()),
                    static_cast<std::size_t>(target));
}

}  // namespace rackreach::gui
