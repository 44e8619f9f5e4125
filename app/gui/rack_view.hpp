// SPDX-License-Identifier: MIT
#pragma once
// The face of one rack, to scale in the project's units: bays across, levels up, each slot tinted by its band and
// labelled with its part, its LI ("outside" where the LI is undefined, "truck" on truck-access levels) and its
// band; beside it the reach heights of the small and the large worker, to the same scale.

#include <QWidget>

#include <optional>

#include "app/gui/project_model.hpp"

namespace rackreach::gui {

class RackView : public QWidget {
  Q_OBJECT

 public:
  explicit RackView(ProjectModel& model, QWidget* parent = nullptr);

  void set_rack(int rack_index);
  int rack() const { return rack_; }
  void set_selected_slot(std::optional<std::size_t> slot_index);
  std::optional<std::size_t> selected_slot() const { return selected_; }
  QSize sizeHint() const override { return {640, 480}; }
  QSize minimumSizeHint() const override { return {320, 240}; }

 Q_SIGNALS:
  void slot_selected(std::size_t slot_index);

 protected:
  void paintEvent(QPaintEvent*) override;
  void mousePressEvent(QMouseEvent*) override;
  void keyPressEvent(QKeyEvent*) override;

 private:
  struct Cell {
    std::size_t slot = 0;
    QRectF rect;
    int level = 0, bay = 0;
  };
  void layout_cells();
  void step(int d_bay, int d_level);

  ProjectModel& model_;
  int rack_ = 0;
  std::optional<std::size_t> selected_;
  std::vector<Cell> cells_;  ///< slot rectangles of the last paint, in widget pixels
  QTransform to_px_;         ///< project length units (x right from the rack's left upright, z up) -> pixels
};

}  // namespace rackreach::gui
