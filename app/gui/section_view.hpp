// SPDX-License-Identifier: MIT
#pragma once
// A side section through the selected slot's level: the shelf's depth and clear height, the box and its grip
// point, the picker's ankles and shoulder pivot, and the small worker's reach arcs (maximum and comfortable),
// to scale in the project's units.

#include <QWidget>

#include <optional>

#include "app/gui/project_model.hpp"

namespace rackreach::gui {

class SectionView : public QWidget {
  Q_OBJECT

 public:
  explicit SectionView(ProjectModel& model, QWidget* parent = nullptr);
  void set_selected_slot(std::optional<std::size_t> slot_index);
  QSize sizeHint() const override { return {320, 260}; }
  QSize minimumSizeHint() const override { return {220, 180}; }

 protected:
  void paintEvent(QPaintEvent*) override;

 private:
  ProjectModel& model_;
  std::optional<std::size_t> selected_;
};

}  // namespace rackreach::gui
