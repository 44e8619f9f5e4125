// SPDX-License-Identifier: MIT
#include "app/gui/rack_view.hpp"

#include <QKeyEvent>
#include <QMouseEvent>
#include <QPainter>

#include <cmath>

#include "app/drawing/rack_elevation.hpp"

namespace rackreach::gui {
namespace {

/// The rack face as the model holds it; the drawing itself is shared with the report (app/drawing).
drawing::RackElevationScene make_scene(const ProjectModel& model, int rack, std::optional<std::size_t> selected,
                                       const QFont& font, const QColor& text) {
  drawing::RackElevationScene scene;
  scene.store = &model.project().store;
  scene.rack = rack;
  scene.finding = [&model](std::size_t slot) { return model.find_finding(slot); };
  if (const auto& reach = model.reach()) {
    const double shoe = reach->parameters.footwear_allowance_cm;
    scene.workers = {drawing::make_worker_marks(reach->small, true, shoe, model.units()),
                     drawing::make_worker_marks(reach->large, false, shoe, model.units())};
  }
  scene.display = model.display();
  scene.selected = selected;
  scene.font = font;
  scene.text_colour = text;
  return scene;
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
  const drawing::RackElevationLayout layout = drawing::layout_rack_elevation(
      make_scene(model_, rack_, selected_, font(), palette().color(QPalette::Text)), size());
  cells_.clear();
  for (const drawing::RackCell& c : layout.cells) cells_.push_back({c.slot, c.rect, c.level, c.bay});
  to_px_ = layout.to_px;
}

void RackView::paintEvent(QPaintEvent*) {
  const drawing::RackElevationScene scene = make_scene(model_, rack_, selected_, font(), palette().color(QPalette::Text));
  const drawing::RackElevationLayout layout = drawing::layout_rack_elevation(scene, size());
  cells_.clear();
  for (const drawing::RackCell& c : layout.cells) cells_.push_back({c.slot, c.rect, c.level, c.bay});
  to_px_ = layout.to_px;
  QPainter p(this);
  p.setRenderHint(QPainter::Antialiasing);
  drawing::paint_rack_elevation(p, scene, layout, size());

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
