// SPDX-License-Identifier: MIT
#include "app/gui/section_view.hpp"

#include <QPainter>
#include <QPainterPath>

#include <algorithm>

#include "app/gui/format.hpp"

namespace rackreach::gui {

SectionView::SectionView(ProjectModel& model, QWidget* parent) : QWidget(parent), model_(model) {
  setBackgroundRole(QPalette::Base);
  setAutoFillBackground(true);
  setAccessibleName(tr("Side section of the selected level"));
  connect(&model_, &ProjectModel::changed, this, qOverload<>(&QWidget::update));
  connect(&model_, &ProjectModel::display_changed, this, qOverload<>(&QWidget::update));
}

void SectionView::set_selected_slot(std::optional<std::size_t> slot_index) {
  selected_ = slot_index;
  update();
}

void SectionView::paintEvent(QPaintEvent*) {
  QPainter p(this);
  p.setRenderHint(QPainter::Antialiasing);
  const SlotFinding* f = selected_ ? model_.find_finding(*selected_) : nullptr;
  const std::optional<SectionGeometry> g = f ? model_.section_geometry(*f) : std::nullopt;
  if (!g) {
    p.drawText(rect().adjusted(8, 8, -8, -8), Qt::AlignCenter | Qt::TextWordWrap,
               tr("Side section: select a slot in the rack drawing or the findings list."));
    return;
  }
  const UnitDisplay d = model_.display();
  const QString lu = d.length_unit();
  QFont base = font();
  QFont small = base;
  small.setPointSizeF(std::max(6.5, base.pointSizeF() - 1));
  QFont bold = base;
  bold.setBold(true);

  // The drawing's extent in project units: from behind the picker to behind the shelf, floor to above the reach.
  const bool arc = g->max_reach > 0;
  const double x0 = std::min(g->ankles_x, g->pivot_x - (arc ? g->max_reach * 0.3 : 0)) - 30;
  const double x1 = std::max({g->shelf_depth, g->grip_x, arc ? g->pivot_x + g->max_reach : 0.0}) + 12;
  const double z0 = 0, z1 = std::max({g->shelf_top, g->grip_z, arc ? g->pivot_z + g->max_reach : 0.0}) + 8;
  const double title_px = 22, legend_px = 3.2 * QFontMetricsF(small).height() + 4;
  const double s = std::min((width() - 16) / (x1 - x0), (height() - title_px - legend_px) / (z1 - z0));
  const QTransform t(s, 0, 0, -s, 8 - x0 * s, title_px + z1 * s);
  auto at = [&](double x, double z) { return t.map(QPointF(x, z)); };

  p.setFont(bold);
  p.drawText(QRectF(6, 2, width() - 12, title_px - 2), Qt::AlignLeft | Qt::AlignVCenter,
             tr("Side section, slot %1 (rack %2 level %3)").arg(q(f->slot_id), q(f->rack_id), q(f->level_id)));
  p.setFont(small);

  // Floor and rack face.
  p.setPen(QPen(palette().color(QPalette::Text), 2));
  p.drawLine(at(x0, 0), at(x1, 0));
  p.setPen(QPen(QColor(0x55, 0x55, 0x55), 2));
  p.drawLine(at(0, 0), at(0, std::max(g->shelf_top, g->grip_z)));
  // Shelf surface and the underside of the level above.
  p.drawLine(at(0, g->shelf_surface), at(g->shelf_depth, g->shelf_surface));
  p.setPen(QPen(QColor(0x55, 0x55, 0x55), 1, Qt::DashLine));
  p.drawLine(at(0, g->shelf_top), at(g->shelf_depth, g->shelf_top));
  p.drawLine(at(g->shelf_depth, g->shelf_surface), at(g->shelf_depth, g->shelf_top));
  // Box and grip.
  p.setPen(QPen(Qt::black, 1));
  p.setBrush(QColor(0xE6, 0xD5, 0xB8));
  p.drawRect(QRectF(at(g->box_front, g->shelf_surface + g->box_height), at(g->box_front + g->box_depth,
                                                                          g->shelf_surface)));
  p.setBrush(Qt::black);
  p.drawEllipse(at(g->grip_x, g->grip_z), 3.5, 3.5);
  p.setBrush(Qt::NoBrush);

  // Equation's H limit.
  p.setPen(QPen(QColor(0x90, 0x30, 0x00), 1, Qt::DotLine));
  p.drawLine(at(g->h_limit_x, 0), at(g->h_limit_x, z1 - 4));
  p.drawText(QRectF(at(g->h_limit_x, z1 - 2) + QPointF(3, 0), QSizeF(120, 14)), Qt::AlignLeft,
             tr("H limit %1").arg(d.length_with_unit(g->h_limit_x - g->ankles_x, 0)));

  // Picker: ankles and shoulder pivot; reach arcs of the small worker.
  p.setPen(QPen(QColor(0x20, 0x20, 0x20), 1));
  const QPointF ankles = at(g->ankles_x, 0);
  p.drawLine(ankles + QPointF(-6, 0), ankles + QPointF(6, 0));
  p.drawText(QRectF(ankles + QPointF(-62, -16), QSizeF(58, 14)), Qt::AlignRight, tr("ankles"));
  if (arc) {
    const QPointF pivot = at(g->pivot_x, g->pivot_z);
    p.setPen(QPen(QColor(0x20, 0x20, 0x20), 1, Qt::DashDotLine));
    p.drawLine(ankles, pivot);
    p.setBrush(QColor(0x20, 0x20, 0x20));
    p.drawEllipse(pivot, 3, 3);
    p.setBrush(Qt::NoBrush);
    const double rmax = g->max_reach * s, rcom = g->comfortable_reach * s;
    p.setPen(QPen(QColor(0x1F, 0x4E, 0x79), 2));
    p.drawArc(QRectF(pivot.x() - rmax, pivot.y() - rmax, 2 * rmax, 2 * rmax), -90 * 16, 180 * 16);
    p.setPen(QPen(QColor(0x1F, 0x4E, 0x79), 1, Qt::DashLine));
    p.drawArc(QRectF(pivot.x() - rcom, pivot.y() - rcom, 2 * rcom, 2 * rcom), -90 * 16, 180 * 16);
  }

  // Legend in words, with the numbers.
  p.setPen(palette().color(QPalette::Text));
  QString legend = tr("grip %1 %3 behind the face, %2 %3 high; shelf depth %4 %3")
                       .arg(d.length_text(g->grip_x, 0), d.length_text(g->grip_z, 0), lu,
                            d.length_text(g->shelf_depth, 0));
  if (arc)
    legend += tr("\nsmall worker: reach %1 %3 (solid), comfortable %2 %3 (dashed) from the shoulder")
                  .arg(d.length_text(g->max_reach, 1), d.length_text(g->comfortable_reach, 1), lu);
  else
    legend += tr("\nno reach setup: reach arcs are not drawn");
  p.setFont(small);
  p.drawText(QRectF(6, height() - legend_px, width() - 12, legend_px), Qt::AlignLeft | Qt::TextWordWrap, legend);
}

}  // namespace rackreach::gui
