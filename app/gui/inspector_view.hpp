// SPDX-License-Identifier: MIT
#pragma once
// The inspector of the selected slot: every input with its unit and where it came from, every multiplier at
// origin and destination, RWL, FIRWL, STRWL and the indices, the reach result, warnings, limits of application,
// remedies and the cautions. It formats what the project model holds; it computes nothing.

#include <QTextBrowser>

#include <optional>

#include "app/gui/project_model.hpp"

namespace rackreach::gui {

/// The inspector's page for one finding, as HTML (also used by tests and by the task form's result panel).
QString make_finding_html(const ProjectModel& model, const SlotFinding& f);
/// The result of one lift task (both ends, multipliers, indices, warnings), as HTML rows; `task` is the input, in
/// the file's units of `d`, shown in its shown units.
QString make_task_result_html(const LiftTask& task, const TaskResult& r, const UnitDisplay& d);
/// The cautions, as the app shows them under every result.
QString make_caution_html();

class InspectorView : public QTextBrowser {
  Q_OBJECT

 public:
  explicit InspectorView(ProjectModel& model, QWidget* parent = nullptr);
  void set_selected_slot(std::optional<std::size_t> slot_index);
  /// The LI as the inspector shows it ("outside" where undefined); empty when no slot is shown.
  QString shown_li() const { return shown_li_; }
  /// The load L and the RWL at one end as shown, number and unit ("48.50 lb"); empty when no slot is shown.
  QString shown_load() const { return shown_load_; }
  QString shown_rwl(LiftEnd end) const { return end == LiftEnd::origin ? shown_rwl_origin_ : shown_rwl_destination_; }

 private:
  void refresh();
  ProjectModel& model_;
  std::optional<std::size_t> selected_;
  QString shown_li_, shown_load_, shown_rwl_origin_, shown_rwl_destination_;
  QString html_;  ///< what is shown: laid out again only when it changes (an edit elsewhere in the store)
  void show_html(const QString& html);
};

}  // namespace rackreach::gui
