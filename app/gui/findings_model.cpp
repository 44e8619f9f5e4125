// SPDX-License-Identifier: MIT
#include "app/gui/findings_model.hpp"

#include <QBrush>

#include <limits>

#include "app/gui/band_palette.hpp"
#include "app/gui/format.hpp"

namespace rackreach::gui {

FindingsModel::FindingsModel(ProjectModel& model, QObject* parent) : QAbstractTableModel(parent), model_(model) {
  connect(&model_, &ProjectModel::changed, this, [this] {
    beginResetModel();
    endResetModel();
  });
  connect(&model_, &ProjectModel::display_changed, this, [this] {
    Q_EMIT headerDataChanged(Qt::Horizontal, 0, column_count - 1);
    if (rowCount() > 0) Q_EMIT dataChanged(index(0, 0), index(rowCount() - 1, column_count - 1), {Qt::DisplayRole});
  });
}

int FindingsModel::rowCount(const QModelIndex& parent) const {
  if (parent.isValid() || !model_.review()) return 0;
  return static_cast<int>(model_.review()->findings.size());
}

int FindingsModel::columnCount(const QModelIndex& parent) const { return parent.isValid() ? 0 : column_count; }

QVariant FindingsModel::headerData(int section, Qt::Orientation o, int role) const {
  if (o != Qt::Horizontal || role != Qt::DisplayRole) return {};
  const UnitDisplay d = model_.display();
  switch (section) {
    case rank: return tr("Rank");
    case slot: return tr("Slot");
    case part: return tr("Part");
    case family: return tr("Family");
    case rack: return tr("Rack");
    case level: return tr("Level");
    case bay: return tr("Bay");
    case position: return tr("Pos.");
    case load: return tr("Load (%1)").arg(d.mass_unit());
    case frequency: return tr("F (/min)");
    case li_origin: return tr("LI origin");
    case li_destination: return tr("LI dest.");
    case li: return tr("LI");
    case band: return tr("Band");
    case reach: return tr("Reach (margin, %1)").arg(d.length_unit());
    case remedies: return tr("Remedies");
  }
  return {};
}

namespace {
QString remedy_list(const SlotFinding& f) {
  QStringList names;
  for (const Remedy& r : f.remedies) names << QString::fromUtf8(remedy_name(r.kind));
  return names.join(QStringLiteral("; "));
}
double sort_li(const std::optional<double>& v) { return v ? *v : std::numeric_limits<double>::max(); }
}  // namespace

QVariant FindingsModel::data(const QModelIndex& index, int role) const {
  if (!index.isValid() || !model_.review()) return {};
  const auto& findings = model_.review()->findings;
  if (index.row() < 0 || static_cast<std::size_t>(index.row()) >= findings.size()) return {};
  const SlotFinding& f = findings[static_cast<std::size_t>(index.row())];
  if (role == slot_index_role) return QVariant::fromValue<qulonglong>(f.slot_index);
  if (role == remedy_names_role) return remedy_list(f);
  const Slot& s = model_.project().store.slots.at(f.slot_index);
  const QString none = f.truck_access ? tr("truck") : tr("outside");
  if (role == sort_role) {
    switch (index.column()) {
      case rank: return index.row();
      case bay: return s.bay;
      case load: return f.lift.task.load;
      case frequency: return f.lift.task.frequency_per_min;
      case li_origin: return sort_li(f.result.origin.li);
      case li_destination: return sort_li(f.result.destination.li);
      case li: return f.truck_access ? -1.0 : sort_li(f.result.li);
      case band: return f.truck_access ? -1 : static_cast<int>(f.band);
      default: break;
    }
    return data(index, Qt::DisplayRole);
  }
  if (role == Qt::BackgroundRole && index.column() == band && !f.truck_access) return band_brush(f.band);
  if (role == Qt::ForegroundRole && index.column() == band && !f.truck_access &&
      f.band != RiskBand::outside_equation)
    return QBrush(band_text_colour(f.band));
  if (role == Qt::TextAlignmentRole && (index.column() == li || (index.column() >= load && index.column() <= li_destination)))
    return int(Qt::AlignRight | Qt::AlignVCenter);
  if (role == Qt::ToolTipRole && index.column() == remedies) {
    QStringList lines;
    for (const Remedy& r : f.remedies) lines << QString::fromUtf8(remedy_name(r.kind)) + ": " + q(r.reason);
    return lines.join('\n');
  }
  if (role != Qt::DisplayRole) return {};
  switch (index.column()) {
    case rank: return index.row() + 1;
    case slot: return q(f.slot_id);
    case part: return q(f.part_id);
    case family: return q(f.family);
    case rack: return q(f.rack_id);
    case level: return q(f.level_id);
    case bay: return s.bay;
    case position: return s.position == SlotPosition::front ? tr("front") : tr("back");
    case load: return model_.display().mass_text(f.lift.task.load, 2);
    case frequency: return fmt(f.lift.task.frequency_per_min, 2);
    case li_origin: return fmt(f.result.origin.li, 2, none);
    case li_destination: return fmt(f.result.destination.li, 2, none);
    case li: return fmt(f.result.li, 2, none);
    case band: return f.truck_access ? tr("truck level") : q(std::string(band_name(f.band)));
    case reach: {
      if (!f.reach) return tr("not checked");
      const ReachCheck* w = f.reach->find_worst_failure();
      return w ? tr("fails: %1 (%2)").arg(q(w->code), model_.display().cm_with_unit(w->margin_cm, 1))
               : tr("within reach");
    }
    case remedies: return remedy_list(f);
  }
  return {};
}

int FindingsModel::find_row(std::size_t slot_index) const {
  if (!model_.review()) return -1;
  const auto& f = model_.review()->findings;
  for (std::size_t i = 0; i < f.size(); ++i)
    if (f[i].slot_index == slot_index) return static_cast<int>(i);
  return -1;
}

void FindingsFilter::set_filter(const QString& band, const QString& family, const QString& rack,
                                const QString& remedy) {
  band_ = band;
  family_ = family;
  rack_ = rack;
  remedy_ = remedy;
  invalidateFilter();
}

bool FindingsFilter::lessThan(const QModelIndex& left, const QModelIndex& right) const {
  if (left.column() == FindingsModel::rank && right.column() == FindingsModel::rank) return left.row() < right.row();
  return QSortFilterProxyModel::lessThan(left, right);
}

bool FindingsFilter::filterAcceptsRow(int row, const QModelIndex& parent) const {
  const QAbstractItemModel* m = sourceModel();
  auto text = [&](int column, int role = Qt::DisplayRole) { return m->index(row, column, parent).data(role).toString(); };
  if (!band_.isEmpty() && text(FindingsModel::band) != band_) return false;
  if (!family_.isEmpty() && text(FindingsModel::family) != family_) return false;
  if (!rack_.isEmpty() && text(FindingsModel::rack) != rack_) return false;
  if (!remedy_.isEmpty() &&
      !text(FindingsModel::remedies, FindingsModel::remedy_names_role).split(QStringLiteral("; ")).contains(remedy_))
    return false;
  return true;
}

}  // namespace rackreach::gui
