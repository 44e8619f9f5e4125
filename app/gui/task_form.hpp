// SPDX-License-Identifier: MIT
#pragma once
// The lift-task form: enter or edit an explicit task of a job, checked as you type by the project file's own
// rules (task_check.hpp), with live results at both ends. A field out of range says why beside it, and nothing is
// computed until every field is acceptable.

#include <QWidget>

#include <map>
#include <optional>

#include "app/gui/project_model.hpp"
#include "app/gui/task_check.hpp"

class QCheckBox;
class QComboBox;
class QGridLayout;
class QLabel;
class QLineEdit;
class QPushButton;
class QTextBrowser;

namespace rackreach::gui {

class TaskForm : public QWidget {
  Q_OBJECT

 public:
  explicit TaskForm(ProjectModel& model, QWidget* parent = nullptr);

  /// The line edit of a field (keys as in task_field_keys), or nullptr.
  QLineEdit* field(const std::string& key) const;
  QComboBox* duration_box() const { return duration_; }
  QComboBox* coupling_box() const { return coupling_; }
  QCheckBox* control_box() const { return control_; }
  /// What the form says is wrong with a field ("" when nothing).
  QString field_message(const std::string& key) const;
  /// The results as shown (empty when nothing is computed).
  QString shown_rwl(LiftEnd end) const;
  QString shown_li(LiftEnd end) const;
  QString shown_band() const;
  const TaskCheck& last_check() const { return check_; }
  QPushButton* add_button() const { return add_button_; }
  QPushButton* replace_button() const { return replace_button_; }

  /// Fills the form from task `task` of job `job` of the project.
  void load_task(std::size_t job, std::size_t task);

 public Q_SLOTS:
  void recheck();

 private:
  void add_field(QGridLayout* grid, const std::string& key, const QString& label, const QString& unit, int row);
  void refill_task_list();
  void apply(bool as_new);
  TaskFields fields() const;

  ProjectModel& model_;
  std::map<std::string, QLineEdit*> edits_;
  std::map<std::string, QLabel*> messages_;
  std::map<std::string, QLabel*> unit_labels_;
  QComboBox* task_list_ = nullptr;
  QComboBox* duration_ = nullptr;
  QComboBox* coupling_ = nullptr;
  QCheckBox* control_ = nullptr;
  std::map<std::string, QCheckBox*> limit_boxes_;
  QLabel* summary_ = nullptr;
  QLabel* other_problems_ = nullptr;
  QTextBrowser* results_ = nullptr;
  QPushButton* add_button_ = nullptr;
  QPushButton* replace_button_ = nullptr;
  TaskCheck check_;
  std::vector<WorkPeriod> pattern_;  ///< the work pattern of the job being edited, kept as it is
  std::optional<std::pair<std::size_t, std::size_t>> editing_;  ///< job and task being edited
  QString loaded_frequency_;  ///< F as loaded: while it is not retyped, the task's frequency sample stays
  std::optional<FrequencySample> loaded_sample_;  ///< the sample F came from, shown beside F
};

}  // namespace rackreach::gui
