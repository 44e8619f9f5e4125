// SPDX-License-Identifier: MIT
#include "app/gui/edit_commands.hpp"

namespace rackreach::gui {

ReplacePartCommand::ReplacePartCommand(ProjectModel& model, std::size_t index, Part after, const QString& text)
    : QUndoCommand(text), model_(model), index_(index), before_(model.project().store.parts.at(index)),
      after_(std::move(after)) {}

ReplaceSlotCommand::ReplaceSlotCommand(ProjectModel& model, std::size_t index, Slot after, const QString& text,
                                       QUndoCommand* parent)
    : QUndoCommand(text, parent), model_(model), index_(index), before_(model.project().store.slots.at(index)),
      after_(std::move(after)) {}

ReplaceSlotsCommand::ReplaceSlotsCommand(ProjectModel& model, std::vector<std::pair<std::size_t, Slot>> after,
                                         const QString& text)
    : QUndoCommand(text), model_(model), after_(std::move(after)) {
  for (const auto& [index, slot] : after_) before_.emplace_back(index, model.project().store.slots.at(index));
}

InsertSlotCommand::InsertSlotCommand(ProjectModel& model, std::size_t index, Slot slot, bool remove,
                                     const QString& text)
    : QUndoCommand(text), model_(model), index_(index), slot_(std::move(slot)),
      routes_(model.project().store.routes), remove_(remove) {}

void InsertSlotCommand::redo() {
  if (remove_) model_.remove_slot(index_);
  else model_.insert_slot(index_, slot_);
}

void InsertSlotCommand::undo() {
  if (!remove_) {
    model_.remove_slot(index_);
    return;
  }
  model_.insert_slot(index_, slot_, &routes_);  // the routes as they were before the removal
}

InsertPartCommand::InsertPartCommand(ProjectModel& model, std::size_t index, Part part, bool remove,
                                     const QString& text)
    : QUndoCommand(text), model_(model), index_(index), part_(std::move(part)), remove_(remove) {}

ReplaceJobCommand::ReplaceJobCommand(ProjectModel& model, std::size_t index, std::optional<LiftJob> before,
                                     std::optional<LiftJob> after, const QString& text)
    : QUndoCommand(text), model_(model), index_(index), before_(std::move(before)), after_(std::move(after)) {}

void ReplaceJobCommand::apply(const std::optional<LiftJob>& from, const std::optional<LiftJob>& to) {
  if (from && to) model_.replace_job(index_, *to);
  else if (to) model_.insert_job(index_, *to);
  else if (from) model_.remove_job(index_);
}

SetStoreCommand::SetStoreCommand(ProjectModel& model, Store after, const QString& text)
    : QUndoCommand(text), model_(model), before_(model.project().store), after_(std::move(after)) {}

ReplaceStoreItemsCommand::ReplaceStoreItemsCommand(ProjectModel& model, std::vector<Part> parts,
                                                   std::vector<Slot> slots, const QString& text)
    : QUndoCommand(text), model_(model), parts_before_(model.project().store.parts), parts_after_(std::move(parts)),
      slots_before_(model.project().store.slots), slots_after_(std::move(slots)) {}

}  // namespace rackreach::gui
