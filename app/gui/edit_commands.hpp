// SPDX-License-Identifier: MIT
#pragma once
// Undoable edits of the project: each holds the value before and after, and calls the project model, which
// reassesses. Every edit the app makes goes through one of these and the model's QUndoStack.

#include <QUndoCommand>

#include "app/gui/project_model.hpp"

namespace rackreach::gui {

class ReplacePartCommand : public QUndoCommand {
 public:
  ReplacePartCommand(ProjectModel& model, std::size_t index, Part after, const QString& text);
  void redo() override { model_.replace_part(index_, after_); }
  void undo() override { model_.replace_part(index_, before_); }

 private:
  ProjectModel& model_;
  std::size_t index_;
  Part before_, after_;
};

class ReplaceSlotCommand : public QUndoCommand {
 public:
  ReplaceSlotCommand(ProjectModel& model, std::size_t index, Slot after, const QString& text,
                     QUndoCommand* parent = nullptr);
  void redo() override { model_.replace_slot(index_, after_); }
  void undo() override { model_.replace_slot(index_, before_); }

 private:
  ProjectModel& model_;
  std::size_t index_;
  Slot before_, after_;
};

/// Replaces several slots at once (parts swapped between slots): one step of the history, one reassessment.
class ReplaceSlotsCommand : public QUndoCommand {
 public:
  ReplaceSlotsCommand(ProjectModel& model, std::vector<std::pair<std::size_t, Slot>> after, const QString& text);
  void redo() override { model_.replace_slots(after_); }
  void undo() override { model_.replace_slots(before_); }

 private:
  ProjectModel& model_;
  std::vector<std::pair<std::size_t, Slot>> before_, after_;
};

/// Adds a slot (or, with `remove`, takes one away: the same pair of steps the other way round).
class InsertSlotCommand : public QUndoCommand {
 public:
  InsertSlotCommand(ProjectModel& model, std::size_t index, Slot slot, bool remove, const QString& text);
  void redo() override;
  void undo() override;

 private:
  ProjectModel& model_;
  std::size_t index_;
  Slot slot_;
  std::vector<Route> routes_;  ///< routes before a removal, which drops the slot from them
  bool remove_;
};

class InsertPartCommand : public QUndoCommand {
 public:
  InsertPartCommand(ProjectModel& model, std::size_t index, Part part, bool remove, const QString& text);
  void redo() override { remove_ ? model_.remove_part(index_) : model_.insert_part(index_, part_); }
  void undo() override { remove_ ? model_.insert_part(index_, part_) : model_.remove_part(index_); }

 private:
  ProjectModel& model_;
  std::size_t index_;
  Part part_;
  bool remove_;
};

/// Replaces, adds or removes a lift job (the task form edits a job's tasks through it).
class ReplaceJobCommand : public QUndoCommand {
 public:
  /// `before` empty: adds `after` at `index`; `after` empty: removes the job at `index`.
  ReplaceJobCommand(ProjectModel& model, std::size_t index, std::optional<LiftJob> before,
                    std::optional<LiftJob> after, const QString& text);
  void redo() override { apply(before_, after_); }
  void undo() override { apply(after_, before_); }

 private:
  void apply(const std::optional<LiftJob>& from, const std::optional<LiftJob>& to);
  ProjectModel& model_;
  std::size_t index_;
  std::optional<LiftJob> before_, after_;
};

/// Replaces the whole store (a rack, level or zone added, edited or removed; the slots and racks that name it by
/// id follow it). The new store was checked by the loader's rules (ProjectModel::check_store) before.
class SetStoreCommand : public QUndoCommand {
 public:
  SetStoreCommand(ProjectModel& model, Store after, const QString& text);
  void redo() override { model_.set_store(after_); }
  void undo() override { model_.set_store(before_); }

 private:
  ProjectModel& model_;
  Store before_, after_;
};

/// Replaces the store's parts and slots at once (a CSV import).
class ReplaceStoreItemsCommand : public QUndoCommand {
 public:
  ReplaceStoreItemsCommand(ProjectModel& model, std::vector<Part> parts, std::vector<Slot> slots, const QString& text);
  void redo() override { model_.set_parts_and_slots(parts_after_, slots_after_); }
  void undo() override { model_.set_parts_and_slots(parts_before_, slots_before_); }

 private:
  ProjectModel& model_;
  std::vector<Part> parts_before_, parts_after_;
  std::vector<Slot> slots_before_, slots_after_;
};

}  // namespace rackreach::gui
