// SPDX-License-Identifier: MIT
#include "app/gui/rack_view.hpp"

#include <QKeyEvent>
#include <QMouseEvent>
#include <QPainter>

#include <algorithm>
#include <cmath>

#include "app/gui/band_palette.hpp"
#include "app/gui/format.hpp"

namespace rackreach::gui {
namespace {

constexpr double margin_left_px = 56, margin_top_px = 30, margin_bottom_px = 40, margin_right_px = 8;
constexpr double worker_label_px = 112;  ///< room for the labels right of each worker's column
constexpr double worker_bar_px = 22;     ///< a worker's column is drawn this wide: only its heights are to scale

/// A round tick step for a height axis about `span` long in `px` pixels.
double tick_step(double span, double px) {
  const double raw = span / std::max(1.0, px / 40.0);
  const double mag = std::pow(10.0, std::floor(std::log10(raw)));
  for (double m : {1.0, 2.0, 5.0, 10.0})
    if (m * mag >= raw) return m * mag;
  return 10 * mag;
}

/// Draws `lines` centred in `r`, shrinking the font until they fit, dropping the last lines if they still do not.
void draw_fitted(QPainter& p, const QRectF& r, QStringList lines, const QFont& base) {
  QFont f = base;
  for (int size = base.pointSize(); size >= 6; --size) {
    f.setPointSize(size);
    QFontMetricsF m(f);
    while (!lines.isEmpty()) {
      double w = 0;
      for (const QString& l : lines) w = std::max(w, m.horizontalAdvance(l));
      if (w <= r.width() - 4 && m.height() * lines.size() <= r.height() - 2) {
        p.setFont(f);
        p.drawText(r, Qt::AlignCenter, lines.join('\n'));
        return;
      }
      if (size > 7) break;  // first try a smaller font, then fewer lines
      lines.removeLast();
    }
  }
}

}  // namespace

RackView::RackView(ProjectModel& model, QWidget* parent) : QWidget(parent), model_(model) {
  setFocusPolicy(Qt::StrongFocus);
  setBackgroundRole(QPalette::Base);
  setAutoFillBackground(true);
  setAccessibleName(tr("Rack face drawing"));
  connect(&model_, &ProjectModel::changed, this, qOverload<>(&QWidget::update));
  connect(&model_, &ProjectModel::display_changed, this, qOverload<>(&QWidget::update));
}

void RackView::set_rack(int rack_index) {
  rack_ = rack_index;
  update();
}

void RackView::set_selected_slot(std::optional<std::size_t> slot_index) {
  selected_ = slot_index;
  if (slot_index && *slot_index < model_.project().store.slots.size()) {
    const auto& racks = model_.project().store.racks;
    const std::string& rack_id = model_.project().store.slots[*slot_index].rack;
    for (std::size_t i = 0; i < racks.size(); ++i)
      if (racks[i].id == rack_id) rack_ = static_cast<int>(i);
  }
  update();
}

void RackView::layout_cells() {
  cells_.clear();
  const Store& store = model_.project().store;
  if (rack_ < 0 || static_cast<std::size_t>(rack_) >= store.racks.size()) return;
  const Rack& rack = store.racks[static_cast<std::size_t>(rack_)];
  const double rack_w = rack.bay_width * rack.bays;
  double top = 0;
  for (const Level& l : rack.levels) top = std::max(top, l.surface_height + l.clear_height);
  if (model_.reach()) top = std::max(top, model_.worker_heights(model_.reach()->large).overhead_reach);
  top *= 1.04;
  const double reach_px = model_.reach() ? 2 * (worker_bar_px + worker_label_px) + 70 : 70;
  const double avail_w = width() - margin_left_px - margin_right_px - reach_px;
  const double avail_h = height() - margin_top_px - margin_bottom_px;
  const double s = std::max(0.01, std::min(avail_w / rack_w, avail_h / top));
  to_px_ = QTransform(s, 0, 0, -s, margin_left_px, margin_top_px + top * s);

  for (std::size_t i = 0; i < store.slots.size(); ++i) {
    const Slot& slot = store.slots[i];
    if (slot.rack != rack.id) continue;
    int li = -1;
    for (std::size_t k = 0; k < rack.levels.size(); ++k)
      if (rack.levels[k].id == slot.level) li = static_cast<int>(k);
    if (li < 0) continue;
    const Level& level = rack.levels[static_cast<std::size_t>(li)];
    bool shared = false;  // front and back of one bay share the cell: front left, back right
    for (const Slot& o : store.slots)
      if (&o != &slot && o.rack == slot.rack && o.level == slot.level && o.bay == slot.bay) shared = true;
    double x0 = (slot.bay - 1) * rack.bay_width, x1 = x0 + rack.bay_width;
    if (shared) (slot.position == SlotPosition::front ? x1 : x0) = x0 + rack.bay_width / 2;
    const QRectF r = to_px_.mapRect(QRectF(QPointF(x0, level.surface_height),
                                           QPointF(x1, level.surface_height + level.clear_height)));
    cells_.push_back({i, r.adjusted(2, 2, -2, -2), li, slot.bay});
  }
}

void RackView::paintEvent(QPaintEvent*) {
  layout_cells();
  QPainter p(this);
  p.setRenderHint(QPainter::Antialiasing);
  const Store& store = model_.project().store;
  const UnitDisplay d = model_.display();
  const QString lu = d.length_unit();
  if (rack_ < 0 || static_cast<std::size_t>(rack_) >= store.racks.size()) {
    p.drawText(rect(), Qt::AlignCenter, tr("No racks in this project: open a project with a store, or import a "
                                           "slot list."));
    return;
  }
  const Rack& rack = store.racks[static_cast<std::size_t>(rack_)];
  const double rack_w = rack.bay_width * rack.bays;
  const QFont base = font();

  // Title.
  QFont title = base;
  title.setBold(true);
  p.setFont(title);
  const char* kind = rack.kind == RackKind::hand ? "hand" : rack.kind == RackKind::truck ? "truck" : "mixed";
  p.drawText(QRectF(8, 4, width() - 16, margin_top_px - 6), Qt::AlignLeft | Qt::AlignVCenter,
             tr("Rack %1 (%2, zone %3): face, %4 bays of %5 %6, shelf depth %7 %6")
                 .arg(q(rack.id), kind, q(rack.zone))
                 .arg(rack.bays)
                 .arg(d.length_text(rack.bay_width, 0), lu, d.length_text(rack.shelf_depth, 0)));
  p.setFont(base);

  // Height axis: round ticks in the shown unit, placed on the drawing (kept in the file's units).
  const QPointF floor_left = to_px_.map(QPointF(0, 0));
  double top = 0;
  for (const Level& l : rack.levels) top = std::max(top, l.surface_height + l.clear_height);
  const double scale = to_px_.m11();
  const double top_shown = d.length(top);
  const double step = tick_step(top_shown, top * scale);
  p.setPen(palette().color(QPalette::Text));
  for (double z = 0; z <= top_shown * 1.001; z += step) {
    const QPointF a = to_px_.map(QPointF(0, d.length_to_file(z)));
    p.drawLine(QPointF(a.x() - 5, a.y()), QPointF(a.x() - 1, a.y()));
    p.drawText(QRectF(0, a.y() - 8, a.x() - 7, 16), Qt::AlignRight | Qt::AlignVCenter, fmt(z, 0));
  }
  p.drawText(QRectF(0, margin_top_px - 4, margin_left_px - 4, 14), Qt::AlignRight, lu);
  // Floor.
  p.setPen(QPen(palette().color(QPalette::Text), 2));
  p.drawLine(QPointF(floor_left.x() - 4, floor_left.y()), QPointF(width() - margin_right_px, floor_left.y()));

  // Uprights and beams.
  p.setPen(QPen(QColor(0x55, 0x55, 0x55), 2));
  for (int b = 0; b <= rack.bays; ++b) {
    const QPointF a = to_px_.map(QPointF(b * rack.bay_width, 0)), c = to_px_.map(QPointF(b * rack.bay_width, top));
    p.drawLine(a, c);
  }
  for (const Level& l : rack.levels) {
    const QPointF a = to_px_.map(QPointF(0, l.surface_height)), c = to_px_.map(QPointF(rack_w, l.surface_height));
    p.drawLine(a, c);
  }
  // Bay numbers under the floor.
  p.setPen(palette().color(QPalette::Text));
  for (int b = 0; b < rack.bays; ++b) {
    const QPointF a = to_px_.map(QPointF((b + 0.5) * rack.bay_width, 0));
    p.drawText(QRectF(a.x() - 40, a.y() + 2, 80, 16), Qt::AlignCenter, tr("bay %1").arg(b + 1));
  }

  // Slots.
  for (const Cell& c : cells_) {
    const Slot& slot = store.slots[c.slot];
    const SlotFinding* f = model_.find_finding(c.slot);
    QStringList lines;
    lines << q(slot.part);
    RiskBand band = RiskBand::outside_equation;
    QBrush brush(Qt::white);
    QColor text = Qt::black;
    if (f && f->truck_access) {
      brush = QBrush(QColor(0xF4, 0xF4, 0xF4));
      lines << tr("truck");
    } else if (f) {
      band = f->band;
      brush = band_brush(band);
      text = band == RiskBand::outside_equation ? QColor(Qt::black) : band_text_colour(band);
      lines << (f->result.li ? tr("LI %1").arg(fmt(*f->result.li, 2)) : tr("outside"));
      if (f->result.li) lines << q(std::string(band_name(band)));
    } else {
      lines << tr("not assessed");
    }
    lines << (slot.position == SlotPosition::front ? tr("front") : tr("back"));
    if (band == RiskBand::outside_equation && f && !f->truck_access) p.fillRect(c.rect, QColor(0xEE, 0xEE, 0xEE));
    p.fillRect(c.rect, brush);
    const bool selected = selected_ && *selected_ == c.slot;
    p.setPen(QPen(selected ? QColor(0xD0, 0x30, 0x00) : QColor(0x44, 0x44, 0x44), selected ? 4 : 1));
    p.drawRect(c.rect);
    // Text on a plate where the fill is hatched, so that it stays readable.
    p.setPen(text);
    if (band == RiskBand::outside_equation && f && !f->truck_access) {
      QFontMetricsF m(base);
      double w = 0;
      for (const QString& l : lines) w = std::max(w, m.horizontalAdvance(l));
      const QRectF plate(c.rect.center().x() - std::min(w / 2 + 4, c.rect.width() / 2 - 3),
                         c.rect.top() + 3, std::min(w + 8, c.rect.width() - 6), c.rect.height() - 6);
      p.fillRect(plate, QColor(255, 255, 255, 220));
    }
    draw_fitted(p, c.rect, lines, base);
  }

  // Level names at the right end of the rack.
  p.setPen(palette().color(QPalette::Text));
  for (const Level& l : rack.levels) {
    const QPointF a = to_px_.map(QPointF(rack_w, l.surface_height + l.clear_height / 2));
    p.drawText(QRectF(a.x() + 4, a.y() - 18, 60, 36), Qt::AlignLeft | Qt::AlignVCenter,
               tr("level %1\n%2").arg(q(l.id), l.access == LevelAccess::truck ? tr("truck") : tr("hand")));
  }

  // Reach heights of the two workers, to the same scale.
  if (const auto& reach = model_.reach()) {
    const double col = 2 * worker_bar_px / scale;
    double x = rack_w + 66 / scale;
    for (const ReachBody* body : {&reach->small, &reach->large}) {
      const WorkerHeights h = model_.worker_heights(*body);
      const QRectF bar = to_px_.mapRect(QRectF(QPointF(x, 0), QPointF(x + col * 0.5, h.overhead_reach)));
      const struct {
        double from, to;
        QColor fill;
      } zones[] = {{0, h.grip_centre, QColor(0xE8, 0xE8, 0xE8)},
                   {h.grip_centre, h.elbow, QColor(0xC8, 0xDC, 0xC8)},
                   {h.elbow, h.shoulder, QColor(0xB0, 0xD0, 0xB0)},
                   {h.shoulder, h.overhead_reach, QColor(0xE0, 0xE0, 0xD0)}};
      for (const auto& z : zones)
        p.fillRect(to_px_.mapRect(QRectF(QPointF(x, z.from), QPointF(x + col * 0.5, z.to))), z.fill);
      p.setPen(QPen(QColor(0x33, 0x33, 0x33), 1));
      p.drawRect(bar);
      const struct {
        double z;
        QString name;
      } marks[] = {{h.grip_centre, tr("grip centre")},
                   {h.elbow, tr("elbow")},
                   {h.shoulder, tr("shoulder")},
                   {h.overhead_reach, tr("overhead")}};
      QFont small = base;
      small.setPointSizeF(std::max(6.5, base.pointSizeF() - 1));
      p.setFont(small);
      QFontMetricsF m(small);
      double last_y = 1e9;
      for (const auto& mk : marks) {
        const QPointF a = to_px_.map(QPointF(x, mk.z));
        p.drawLine(QPointF(bar.left() - 3, a.y()), QPointF(bar.right() + 3, a.y()));
        double y = std::min(a.y(), last_y - m.height());  // keep close labels apart
        p.drawText(QRectF(bar.right() + 5, y - m.height() / 2, worker_label_px, m.height()),
                   Qt::AlignLeft | Qt::AlignVCenter, tr("%1 %2").arg(mk.name, d.length_with_unit(mk.z, 0)));
        last_y = y;
      }
      p.setFont(title);
      const QString who = body == &reach->small ? tr("small worker") : tr("large worker");
      p.drawText(QRectF(bar.left() - 10, floor_left.y() + 2, worker_label_px, 16), Qt::AlignLeft, who);
      p.setFont(small);
      p.drawText(QRectF(bar.left() - 10, floor_left.y() + 17, worker_label_px + 10, 16), Qt::AlignLeft,
                 tr("%1th pct., shoes").arg(fmt(body->percentile, 0)));
      p.setFont(base);
      x += col * 0.5 + worker_label_px / scale;
    }
  }

  // Selection focus ring for keyboard users.
  if (hasFocus()) {
    p.setPen(QPen(palette().color(QPalette::Highlight), 1, Qt::DotLine));
    p.drawRect(rect().adjusted(1, 1, -2, -2));
  }
}

void RackView::mousePressEvent(QMouseEvent* e) {
  layout_cells();
  for (const Cell& c : cells_)
    if (c.rect.contains(e->position())) {
      selected_ = c.slot;
      update();
      Q_EMIT slot_selected(c.slot);
      return;
    }
}

void RackView::step(int d_bay, int d_level) {
  layout_cells();
  if (cells_.empty()) return;
  const Cell* cur = nullptr;
  for (const Cell& c : cells_)
    if (selected_ && c.slot == *selected_) cur = &c;
  const Cell* best = nullptr;
  if (!cur) {
    best = &cells_.front();
  } else {
    double best_d = 1e18;
    for (const Cell& c : cells_) {
      const QPointF d = c.rect.center() - cur->rect.center();
      const bool ahead = d_bay ? (d_bay > 0 ? d.x() > 1 : d.x() < -1) : (d_level > 0 ? d.y() < -1 : d.y() > 1);
      if (!ahead) continue;
      const double along = d_bay ? std::abs(d.x()) : std::abs(d.y());
      const double across = d_bay ? std::abs(d.y()) : std::abs(d.x());
      const double dist = along + 3 * across;
      if (dist < best_d) best_d = dist, best = &c;
    }
  }
  if (!best) return;
  selected_ = best->slot;
  update();
  Q_EMIT slot_selected(best->slot);
}

void RackView::keyPressEvent(QKeyEvent* e) {
  switch (e->key()) {
    case Qt::Key_Left: step(-1, 0); break;
    case Qt::Key_Right: step(1, 0); break;
    case Qt::Key_Up: step(0, 1); break;
    case Qt::Key_Down: step(0, -1); break;
    default: QWidget::keyPressEvent(e); return;
  }
  e->accept();
}

}  // namespace rackreach::gui
