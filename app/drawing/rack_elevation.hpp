// SPDX-License-Identifier: MIT
#pragma once
// The face of one rack, to scale in the project's units, painted onto any QPainter (the app's rack view, the
// report's drawings): bays across, levels up, each slot tinted by its band and labelled with its part, its LI
// ("outside" where the LI is undefined, "truck" on truck-access levels) and its band; beside it the reach heights
// of the small and the large worker, to the same scale. It paints what the review holds and computes no result.
// Qt Gui only (no widgets), so the report can use it without a window system.

#include <QColor>
#include <QFont>
#include <QPainter>
#include <QRectF>
#include <QSizeF>
#include <QTransform>

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/display_units.hpp"
#include "engine/reach/sagittal_reach.hpp"
#include "engine/slotting/review.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach::drawing {

using gui::UnitDisplay;

/// One worker's reach heights with footwear, in the project's length unit.
struct WorkerMarks {
  bool small = true;  ///< the small worker (reach) or the large one (clearance)
  double percentile = 0.0;
  double grip_centre = 0.0, elbow = 0.0, shoulder = 0.0, overhead_reach = 0.0;
};

/// A worker's marks from the reach model's body and footwear allowance (cm), in `units`.
WorkerMarks make_worker_marks(const ReachBody& body, bool small, double footwear_cm, UnitSystem units);

/// What one rack face shows; read from the project and its review.
struct RackElevationScene {
  const Store* store = nullptr;
  int rack = 0;                                             ///< index into Store::racks
  std::function<const SlotFinding*(std::size_t)> finding;   ///< the finding of a slot index, or nullptr
  std::vector<WorkerMarks> workers;                         ///< none, or the small then the large worker
  UnitDisplay display;
  std::optional<std::size_t> selected;                      ///< slot drawn with the selection frame
  QFont font;
  QColor text_colour = Qt::black;
};

/// A slot's rectangle in the painted area.
struct RackCell {
  std::size_t slot = 0;  ///< index into Store::slots
  QRectF rect;
  int level = 0, bay = 0;
};

struct RackElevationLayout {
  std::vector<RackCell> cells;
  QTransform to_px;  ///< project length units (x right from the rack's left upright, z up) -> painted pixels
};

/// Where the slots go in an area of `size` pixels (the rack face scaled to fit, room for the workers beside it).
RackElevationLayout layout_rack_elevation(const RackElevationScene& scene, QSizeF size);
/// Paints the rack face into the area (0, 0, size); an empty store or rack index paints a short message.
void paint_rack_elevation(QPainter& p, const RackElevationScene& scene, const RackElevationLayout& layout,
                          QSizeF size);

}  // namespace rackreach::drawing
