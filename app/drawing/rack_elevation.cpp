// SPDX-License-Identifier: MIT
#include "app/drawing/rack_elevation.hpp"

#include <QCoreApplication>
#include <QFontMetricsF>
#include <QStringList>

#include <algorithm>
#include <cmath>

#include "app/drawing/band_palette.hpp"
#include "app/gui/format.hpp"

namespace rackreach::drawing {
namespace {

using gui::fmt;
using gui::q;

// The words keep the rack view's translation context: the app and the report show the same drawing.
QString tr(const char* text) { return QCoreApplication::translate("rackreach::gui::RackView", text); }

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
    QFontMetricsF m(f, p.device());
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

const Rack* find_scene_rack(const RackElevationScene& scene) {
  if (!scene.store || scene.rack < 0 || static_cast<std::size_t>(scene.rack) >= scene.store->racks.size())
    return nullptr;
  return &scene.store->racks[static_cast<std::size_t>(scene.rack)];
}

}  // namespace

WorkerMarks make_worker_marks(const ReachBody& body, bool small, double footwear_cm, UnitSystem units) {
  auto in_units = [&](double cm) { return Length{cm + footwear_cm, UnitSystem::metric}.in_units(units); };
  return {small, body.percentile, in_units(body.grip_centre_height_cm), in_units(body.elbow_height_cm),
          in_units(body.acromial_height_cm), in_units(body.overhead_grip_reach_cm)};
}

RackElevationLayout layout_rack_elevation(const RackElevationScene& scene, QSizeF size) {
  RackElevationLayout out;
  const Rack* rack_p = find_scene_rack(scene);
  if (!rack_p) return out;
  const Store& store = *scene.store;
  const Rack& rack = *rack_p;
  const double rack_w = rack.bay_width * rack.bays;
  double top = 0;
  for (const Level& l : rack.levels) top = std::max(top, l.surface_height + l.clear_height);
  if (scene.workers.size() == 2) top = std::max(top, scene.workers[1].overhead_reach);
  top *= 1.04;
  const double reach_px = !scene.workers.empty() ? 2 * (worker_bar_px + worker_label_px) + 70 : 70;
  const double avail_w = size.width() - margin_left_px - margin_right_px - reach_px;
  const double avail_h = size.height() - margin_top_px - margin_bottom_px;
  const double s = std::max(0.01, std::min(avail_w / rack_w, avail_h / top));
  out.to_px = QTransform(s, 0, 0, -s, margin_left_px, margin_top_px + top * s);

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
    const QRectF r = out.to_px.mapRect(QRectF(QPointF(x0, level.surface_height),
                                              QPointF(x1, level.surface_height + level.clear_height)));
    out.cells.push_back({i, r.adjusted(2, 2, -2, -2), li, slot.bay});
  }
  return out;
}

void paint_rack_elevation(QPainter& p, const RackElevationScene& scene, const RackElevationLayout& layout,
                          QSizeF size) {
  const double width = size.width();
  const UnitDisplay& d = scene.display;
  const QString lu = d.length_unit();
  const Rack* rack_p = find_scene_rack(scene);
  if (!rack_p) {
    p.drawText(QRectF(QPointF(0, 0), size), Qt::AlignCenter,
               tr("No racks in this project: open a project with a store, or import a slot list."));
    return;
  }
  const Store& store = *scene.store;
  const Rack& rack = *rack_p;
  const QTransform& to_px = layout.to_px;
  const double rack_w = rack.bay_width * rack.bays;
  const QFont base = scene.font;
  const QColor text_colour = scene.text_colour;

  // Title.
  QFont title = base;
  title.setBold(true);
  p.setFont(title);
  const char* kind = rack.kind == RackKind::hand ? "hand" : rack.kind == RackKind::truck ? "truck" : "mixed";
  p.drawText(QRectF(8, 4, width - 16, margin_top_px - 6), Qt::AlignLeft | Qt::AlignVCenter,
             tr("Rack %1 (%2, zone %3): face, %4 bays of %5 %6, shelf depth %7 %6")
                 .arg(q(rack.id), kind, q(rack.zone))
                 .arg(rack.bays)
                 .arg(d.length_text(rack.bay_width, 0), lu, d.length_text(rack.shelf_depth, 0)));
  p.setFont(base);

  // Height axis: round ticks in the shown unit, placed on the drawing (kept in the file's units).
  const QPointF floor_left = to_px.map(QPointF(0, 0));
  double top = 0;
  for (const Level& l : rack.levels) top = std::max(top, l.surface_height + l.clear_height);
  const double scale = to_px.m11();
  const double top_shown = d.length(top);
  const double step = tick_step(top_shown, top * scale);
  p.setPen(text_colour);
  for (double z = 0; z <= top_shown * 1.001; z += step) {
    const QPointF a = to_px.map(QPointF(0, d.length_to_file(z)));
    p.drawLine(QPointF(a.x() - 5, a.y()), QPointF(a.x() - 1, a.y()));
    p.drawText(QRectF(0, a.y() - 8, a.x() - 7, 16), Qt::AlignRight | Qt::AlignVCenter, fmt(z, 0));
  }
  p.drawText(QRectF(0, margin_top_px - 4, margin_left_px - 4, 14), Qt::AlignRight, lu);
  // Floor.
  p.setPen(QPen(text_colour, 2));
  p.drawLine(QPointF(floor_left.x() - 4, floor_left.y()), QPointF(width - margin_right_px, floor_left.y()));

  // Uprights and beams.
  p.setPen(QPen(QColor(0x55, 0x55, 0x55), 2));
  for (int b = 0; b <= rack.bays; ++b) {
    const QPointF a = to_px.map(QPointF(b * rack.bay_width, 0)), c = to_px.map(QPointF(b * rack.bay_width, top));
    p.drawLine(a, c);
  }
  for (const Level& l : rack.levels) {
    const QPointF a = to_px.map(QPointF(0, l.surface_height)), c = to_px.map(QPointF(rack_w, l.surface_height));
    p.drawLine(a, c);
  }
  // Bay numbers under the floor.
  p.setPen(text_colour);
  for (int b = 0; b < rack.bays; ++b) {
    const QPointF a = to_px.map(QPointF((b + 0.5) * rack.bay_width, 0));
    p.drawText(QRectF(a.x() - 40, a.y() + 2, 80, 16), Qt::AlignCenter, tr("bay %1").arg(b + 1));
  }

  // Slots.
  for (const RackCell& c : layout.cells) {
    const Slot& slot = store.slots[c.slot];
    const SlotFinding* f = scene.finding ? scene.finding(c.slot) : nullptr;
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
    const bool selected = scene.selected && *scene.selected == c.slot;
    p.setPen(QPen(selected ? QColor(0xD0, 0x30, 0x00) : QColor(0x44, 0x44, 0x44), selected ? 4 : 1));
    p.drawRect(c.rect);
    // Text on a plate where the fill is hatched, so that it stays readable.
    p.setPen(text);
    if (band == RiskBand::outside_equation && f && !f->truck_access) {
      QFontMetricsF m(base, p.device());
      double w = 0;
      for (const QString& l : lines) w = std::max(w, m.horizontalAdvance(l));
      const QRectF plate(c.rect.center().x() - std::min(w / 2 + 4, c.rect.width() / 2 - 3),
                         c.rect.top() + 3, std::min(w + 8, c.rect.width() - 6), c.rect.height() - 6);
      p.fillRect(plate, QColor(255, 255, 255, 220));
    }
    draw_fitted(p, c.rect, lines, base);
  }

  // Level names at the right end of the rack.
  p.setPen(text_colour);
  for (const Level& l : rack.levels) {
    const QPointF a = to_px.map(QPointF(rack_w, l.surface_height + l.clear_height / 2));
    p.drawText(QRectF(a.x() + 4, a.y() - 18, 60, 36), Qt::AlignLeft | Qt::AlignVCenter,
               tr("level %1\n%2").arg(q(l.id), l.access == LevelAccess::truck ? tr("truck") : tr("hand")));
  }

  // Reach heights of the two workers, to the same scale.
  if (!scene.workers.empty()) {
    const double col = 2 * worker_bar_px / scale;
    double x = rack_w + 66 / scale;
    for (const WorkerMarks& h : scene.workers) {
      const QRectF bar = to_px.mapRect(QRectF(QPointF(x, 0), QPointF(x + col * 0.5, h.overhead_reach)));
      const struct {
        double from, to;
        QColor fill;
      } zones[] = {{0, h.grip_centre, QColor(0xE8, 0xE8, 0xE8)},
                   {h.grip_centre, h.elbow, QColor(0xC8, 0xDC, 0xC8)},
                   {h.elbow, h.shoulder, QColor(0xB0, 0xD0, 0xB0)},
                   {h.shoulder, h.overhead_reach, QColor(0xE0, 0xE0, 0xD0)}};
      for (const auto& z : zones)
        p.fillRect(to_px.mapRect(QRectF(QPointF(x, z.from), QPointF(x + col * 0.5, z.to))), z.fill);
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
      QFontMetricsF m(small, p.device());
      double last_y = 1e9;
      for (const auto& mk : marks) {
        const QPointF a = to_px.map(QPointF(x, mk.z));
        p.drawLine(QPointF(bar.left() - 3, a.y()), QPointF(bar.right() + 3, a.y()));
        double y = std::min(a.y(), last_y - m.height());  // keep close labels apart
        p.drawText(QRectF(bar.right() + 5, y - m.height() / 2, worker_label_px, m.height()),
                   Qt::AlignLeft | Qt::AlignVCenter, tr("%1 %2").arg(mk.name, d.length_with_unit(mk.z, 0)));
        last_y = y;
      }
      p.setFont(title);
      const QString who = h.small ? tr("small worker") : tr("large worker");
      p.drawText(QRectF(bar.left() - 10, floor_left.y() + 2, worker_label_px, 16), Qt::AlignLeft, who);
      p.setFont(small);
      p.drawText(QRectF(bar.left() - 10, floor_left.y() + 17, worker_label_px + 10, 16), Qt::AlignLeft,
                 tr("%1th pct., shoes").arg(fmt(h.percentile, 0)));
      p.setFont(base);
      x += col * 0.5 + worker_label_px / scale;
    }
  }
}

}  // namespace rackreach::drawing
