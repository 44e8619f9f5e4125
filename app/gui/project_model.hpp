// SPDX-License-Identifier: MIT
#pragma once
// The desktop app's one project model: it holds the Project, its reach setup and its assessment, runs
// assess_project() (the same call as `rackreach assess`) after every change, and emits changed(). Widgets read
// from it and edit it only through undoable commands (edit_commands.hpp); they compute nothing themselves.

#include <QObject>
#include <QString>
#include <QUndoStack>

#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/display_units.hpp"
#include "engine/assess.hpp"
#include "engine/problem.hpp"
#include "engine/project.hpp"

namespace rackreach::gui {

/// Where the drawing of a slot's section puts things, in the project's length unit (x from the rack face into
/// the rack, z above the floor).
struct SectionGeometry {
  double shelf_surface = 0.0, shelf_top = 0.0, shelf_depth = 0.0;
  double box_front = 0.0, box_depth = 0.0, box_height = 0.0;
  double grip_x = 0.0, grip_z = 0.0;
  double ankles_x = 0.0;                  ///< negative: in front of the face
  double pivot_x = 0.0, pivot_z = 0.0;    ///< the small worker's shoulder pivot
  double max_reach = 0.0, comfortable_reach = 0.0;
  double h_limit_x = 0.0;                 ///< where H reaches the equation's limit (63 cm, 25 in)
  std::string worker;                     ///< who the arc is for
};

/// The heights of one worker's reach zones, with footwear, in the project's length unit.
struct WorkerHeights {
  std::string label;
  double grip_centre = 0.0, elbow = 0.0, shoulder = 0.0, overhead_reach = 0.0, stature = 0.0;
};

class ProjectModel : public QObject {
  Q_OBJECT

 public:
  explicit ProjectModel(QObject* parent = nullptr);

  /// Loads a project file; on failure the current project stays and the problems are returned.
  std::vector<Problem> open(const QString& path);
  /// Replaces the project (e.g. from a template or a test); resets undo history and the file name.
  std::vector<Problem> set_project(Project project, const QString& path = {});
  void new_project(UnitSystem units);

  /// The project as project-file text (save_project_text, the inverse of the loader).
  std::string project_text() const;
  /// Writes the project atomically; on failure the old file is untouched and the reason is returned.
  std::optional<std::string> save_as(const QString& path);

  const Project& project() const { return project_; }
  const ProjectAssessment& assessment() const { return assessment_; }
  const StoreReview* review() const { return assessment_.store ? &*assessment_.store : nullptr; }
  const std::optional<ReachSetup>& reach() const { return reach_; }
  /// Problems of the last assessment's inputs (e.g. the workforce table could not be read).
  const std::vector<Problem>& assess_problems() const { return assess_problems_; }
  UnitSystem units() const { return project_.units; }
  /// The units things are shown in (View > Units); the project and its computation keep units().
  UnitDisplay display() const { return UnitDisplay(project_.units, display_choice_); }
  DisplayChoice display_choice() const { return display_choice_; }
  /// Changes only what is shown; emits display_changed() when the choice differs.
  void set_display_choice(DisplayChoice choice);
  QString file_path() const { return path_; }
  bool modified() const { return restored_ || !undo_.isClean(); }
  /// Marks the project unsaved though its history is clean (a project restored from a recovery file).
  void mark_unsaved();
  QUndoStack* undo_stack() { return &undo_; }

  /// The finding of a slot (index into Store::slots), or nullptr.
  const SlotFinding* find_finding(std::size_t slot_index) const;
  /// The index of the slot with this id, if any.
  std::optional<std::size_t> find_slot(const std::string& slot_id) const;

  WorkerHeights worker_heights(const ReachBody& body) const;
  std::optional<SectionGeometry> section_geometry(const SlotFinding& finding) const;

  // Edits. Called by the undo commands only (they keep the history); each reassesses and emits changed().
  void replace_part(std::size_t index, Part part);
  void replace_slot(std::size_t index, Slot slot);
  /// Several slots at once (parts swapped between slots): one reassessment.
  void replace_slots(const std::vector<std::pair<std::size_t, Slot>>& slots);
  /// `routes` set: the store's routes are put back as given (undoing a removal).
  void insert_slot(std::size_t index, Slot slot, const std::vector<Route>* routes = nullptr);
  void remove_slot(std::size_t index);
  void insert_part(std::size_t index, Part part);
  void remove_part(std::size_t index);
  void set_parts_and_slots(std::vector<Part> parts, std::vector<Slot> slots);
  void replace_job(std::size_t index, LiftJob job);
  void insert_job(std::size_t index, LiftJob job);
  void remove_job(std::size_t index);

  /// The problems the project file's loader finds in `candidate` once written as a project file (the one set of
  /// rules: an edit checked here can never make a file that does not load). Empty: it loads.
  std::vector<Problem> check_as_file(const Project& candidate) const;
  /// The same for the current project with another store.
  std::vector<Problem> check_store(const Store& store) const;
  /// The loader's problems of a candidate, formatted ("" when there are none); at most `max` of them.
  static std::string describe_problems(const std::vector<Problem>& problems, std::size_t max = 3);

  /// A slot put in place of slot `replacing` (or added), checked by the loader's rules; "" when it is fine.
  std::string validate_slot(const Slot& slot, std::optional<std::size_t> replacing) const;
  /// A part put in place of part `replacing` (or added; a renamed part keeps its slots), checked by the loader.
  std::string validate_part(const Part& part, std::optional<std::size_t> replacing) const;

  /// The store with rack `index` replaced by `rack` (or `rack` added when `index` is empty); the slots of a
  /// renamed rack follow it.
  Store store_with_rack(std::optional<std::size_t> index, const Rack& rack) const;
  Store store_without_rack(std::size_t index) const;
  /// The store with zone `index` replaced (or added); the racks of a renamed zone follow it.
  Store store_with_zone(std::optional<std::size_t> index, const Zone& zone) const;
  Store store_without_zone(std::size_t index) const;
  /// Replaces the whole store (racks, levels, zones edited): a full reassessment. Called by SetStoreCommand.
  void set_store(Store store);

  /// Runs the whole assessment again and emits changed(); edits that the kept review cannot follow call it.
  void reassess();
  /// Brings the store's review up to date after edits of parts or slots in place (only what depends on them is
  /// evaluated again, see StoreReviewer) and emits changed().
  void reassess_store(const std::vector<StoreEdit>& edits);
  /// Slots the last reassessment evaluated (all of them after a whole one).
  std::size_t last_slots_evaluated() const { return reviewer_ ? reviewer_->last_slots_evaluated() : 0; }

 Q_SIGNALS:
  void changed();
  void file_changed();  ///< the file name or the modified state changed
  void display_changed();  ///< the shown units changed; the project did not

 private:
  void load_reach();
  void index_findings();

  Project project_;
  QString path_;
  DisplayChoice display_choice_ = DisplayChoice::as_file;
  std::optional<ReachSetup> reach_;
  std::vector<Problem> assess_problems_;
  AssessOptions options_;                   ///< the reviewer points into options_.reach
  std::unique_ptr<StoreReviewer> reviewer_;  ///< keeps the store review's caches between edits
  ProjectAssessment assessment_;
  std::vector<int> finding_of_slot_;  ///< slot index -> finding index, -1 where none
  QUndoStack undo_;
  bool restored_ = false;  ///< restored from a recovery file and not saved since
};

}  // namespace rackreach::gui
