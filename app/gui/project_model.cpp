// SPDX-License-Identifier: MIT
#include "app/gui/project_model.hpp"

#include <algorithm>
#include <cmath>
#include <set>

#include "anthropometry/reach_setup.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/io/project_file.hpp"

namespace rackreach::gui {

ProjectModel::ProjectModel(QObject* parent) : QObject(parent) {
  connect(&undo_, &QUndoStack::cleanChanged, this, &ProjectModel::file_changed);
  reassess();
}

std::vector<Problem> ProjectModel::open(const QString& path) {
  LoadResult r = load_project_file(path.toStdString());
  if (!r.project) return r.problems;
  return set_project(std::move(*r.project), path);
}

std::vector<Problem> ProjectModel::set_project(Project project, const QString& path) {
  project_ = std::move(project);
  path_ = path;
  restored_ = false;
  undo_.clear();
  load_reach();
  reassess();
  Q_EMIT file_changed();
  return {};
}

void ProjectModel::mark_unsaved() {
  restored_ = true;
  Q_EMIT file_changed();
}

void ProjectModel::set_display_choice(DisplayChoice choice) {
  if (choice == display_choice_) return;
  display_choice_ = choice;
  Q_EMIT display_changed();
}

void ProjectModel::new_project(UnitSystem units) {
  Project p;
  p.units = units;
  set_project(std::move(p));
}

std::string ProjectModel::project_text() const { return save_project_text(project_); }

std::optional<std::string> ProjectModel::save_as(const QString& path) {
  if (auto err = write_file_atomically(path.toStdString(), project_text())) return err;
  path_ = path;
  restored_ = false;
  undo_.setClean();
  Q_EMIT file_changed();
  return std::nullopt;
}

// The same as `rackreach assess`: a reach setup only where some task or slot has shelf geometry.
void ProjectModel::load_reach() {
  reach_.reset();
  assess_problems_.clear();
  if (!project_.has_shelf_geometry()) return;
  LoadedReachSetup r = load_reach_setup(project_);
  reach_ = std::move(r.setup);
  assess_problems_ = std::move(r.problems);
}

void ProjectModel::reassess() {
  if (!reach_ && assess_problems_.empty() && project_.has_shelf_geometry()) load_reach();
  reviewer_.reset();  // it points into options_
  options_ = AssessOptions{};
  options_.reach = reach_;
  reviewer_ = std::make_unique<StoreReviewer>(project_.units, make_review_options(options_, project_.duration_rule));
  assessment_ = assess_project(project_, options_, *reviewer_);
  index_findings();
  Q_EMIT changed();
}

void ProjectModel::reassess_store(const std::vector<StoreEdit>& edits) {
  if (!reviewer_ || !assessment_.store || project_.store.slots.empty()) {
    reassess();
    return;
  }
  reviewer_->update(*assessment_.store, project_.store, edits);
  index_findings();
  Q_EMIT changed();
}

void ProjectModel::index_findings() {
  finding_of_slot_.assign(project_.store.slots.size(), -1);
  if (assessment_.store) {
    const auto& f = assessment_.store->findings;
    for (std::size_t i = 0; i < f.size(); ++i)
      if (f[i].slot_index < finding_of_slot_.size()) finding_of_slot_[f[i].slot_index] = static_cast<int>(i);
  }
}

const SlotFinding* ProjectModel::find_finding(std::size_t slot_index) const {
  if (!assessment_.store || slot_index >= finding_of_slot_.size() || finding_of_slot_[slot_index] < 0) return nullptr;
  return &assessment_.store->findings[static_cast<std::size_t>(finding_of_slot_[slot_index])];
}

std::optional<std::size_t> ProjectModel::find_slot(const std::string& slot_id) const {
  const auto& s = project_.store.slots;
  for (std::size_t i = 0; i < s.size(); ++i)
    if (s[i].id == slot_id) return i;
  return std::nullopt;
}

namespace {
double to_units(double cm, UnitSystem u) { return Length{cm, UnitSystem::metric}.in_units(u); }
}  // namespace

WorkerHeights ProjectModel::worker_heights(const ReachBody& body) const {
  const double shoe = reach_ ? reach_->parameters.footwear_allowance_cm : ReachParameters{}.footwear_allowance_cm;
  const UnitSystem u = project_.units;
  return {body.label,
          to_units(body.grip_centre_height_cm + shoe, u),
          to_units(body.elbow_height_cm + shoe, u),
          to_units(body.acromial_height_cm + shoe, u),
          to_units(body.overhead_grip_reach_cm + shoe, u),
          to_units(body.stature_cm + shoe, u)};
}

std::optional<SectionGeometry> ProjectModel::section_geometry(const SlotFinding& f) const {
  const Store& store = project_.store;
  const Rack* rack = store.find_rack(f.rack_id);
  if (!rack) return std::nullopt;
  const Level* level = store.find_level(*rack, f.level_id);
  const Part* part = store.find_part(f.part_id);
  if (!level || !part) return std::nullopt;
  SectionGeometry g;
  g.shelf_surface = level->surface_height;
  g.shelf_top = level->surface_height + level->clear_height;
  g.shelf_depth = rack->shelf_depth;
  g.box_depth = part->box.depth;
  g.box_height = part->box.height;
  const double centre = f.lift.hands_in_shelf;
  g.box_front = std::max(0.0, centre - part->box.depth / 2.0);
  g.grip_x = centre;
  g.grip_z = f.lift.task.origin.v;
  g.ankles_x = -f.lift.standing_distance.value;
  g.h_limit_x = g.ankles_x + find_constants(project_.units).h_max;
  if (reach_) {
    ReachParameters p = reach_->parameters;
    p.ankle_to_rack_face_cm = Length{f.lift.standing_distance.value, project_.units}.in_cm();
    const Eigen::Vector2d pivot = calc_shoulder_pivot(reach_->small, p);
    const UnitSystem u = project_.units;
    g.pivot_x = to_units(pivot.x(), u);
    g.pivot_z = to_units(pivot.y(), u);
    g.max_reach = to_units(reach_->small.shoulder_grip_length_cm, u);
    g.comfortable_reach = g.max_reach * p.comfortable_reach_fraction;
    g.worker = reach_->small.label;
  }
  return g;
}

void ProjectModel::replace_part(std::size_t index, Part part) {
  if (index >= project_.store.parts.size()) return;
  const std::string old_id = project_.store.parts[index].id;
  if (old_id != part.id)  // a renamed part keeps its slots
    for (Slot& s : project_.store.slots)
      if (s.part == old_id) s.part = part.id;
  project_.store.parts[index] = std::move(part);
  if (old_id != project_.store.parts[index].id) reassess();
  else reassess_store({{StoreEdit::Kind::part, index}});
}

void ProjectModel::replace_slot(std::size_t index, Slot slot) {
  if (index >= project_.store.slots.size()) return;
  replace_slots({{index, std::move(slot)}});
}

void ProjectModel::replace_slots(const std::vector<std::pair<std::size_t, Slot>>& slots) {
  std::vector<StoreEdit> edits;
  bool renamed = false;
  for (const auto& [index, slot] : slots) {
    if (index >= project_.store.slots.size()) continue;
    const std::string old_id = project_.store.slots[index].id;
    if (old_id != slot.id) {  // a renamed slot stays on its routes
      renamed = true;
      for (Route& r : project_.store.routes) std::replace(r.slots.begin(), r.slots.end(), old_id, slot.id);
    }
    project_.store.slots[index] = slot;
    edits.push_back({StoreEdit::Kind::slot, index});
  }
  if (renamed) reassess();  // routes name slots by id
  else reassess_store(edits);
}

void ProjectModel::insert_slot(std::size_t index, Slot slot, const std::vector<Route>* routes) {
  auto& s = project_.store.slots;
  if (routes) project_.store.routes = *routes;
  s.insert(s.begin() + static_cast<std::ptrdiff_t>(std::min(index, s.size())), std::move(slot));
  reassess();
}

void ProjectModel::remove_slot(std::size_t index) {
  auto& s = project_.store.slots;
  if (index >= s.size()) return;
  const std::string id = s[index].id;
  s.erase(s.begin() + static_cast<std::ptrdiff_t>(index));
  for (Route& r : project_.store.routes) std::erase(r.slots, id);
  reassess();
}

void ProjectModel::insert_part(std::size_t index, Part part) {
  auto& p = project_.store.parts;
  p.insert(p.begin() + static_cast<std::ptrdiff_t>(std::min(index, p.size())), std::move(part));
  reassess();
}

void ProjectModel::remove_part(std::size_t index) {
  auto& p = project_.store.parts;
  if (index >= p.size()) return;
  p.erase(p.begin() + static_cast<std::ptrdiff_t>(index));
  reassess();
}

void ProjectModel::set_parts_and_slots(std::vector<Part> parts, std::vector<Slot> slots) {
  project_.store.parts = std::move(parts);
  project_.store.slots = std::move(slots);
  if (!reach_) load_reach();  // a store without shelves before the import needs its workers now
  reassess();
}

void ProjectModel::replace_job(std::size_t index, LiftJob job) {
  if (index >= project_.jobs.size()) return;
  project_.jobs[index] = std::move(job);
  reassess();
}

void ProjectModel::insert_job(std::size_t index, LiftJob job) {
  auto& j = project_.jobs;
  j.insert(j.begin() + static_cast<std::ptrdiff_t>(std::min(index, j.size())), std::move(job));
  reassess();
}

void ProjectModel::remove_job(std::size_t index) {
  auto& j = project_.jobs;
  if (index >= j.size()) return;
  j.erase(j.begin() + static_cast<std::ptrdiff_t>(index));
  reassess();
}

std::vector<Problem> ProjectModel::check_as_file(const Project& candidate) const {
  return load_project_text(save_project_text(candidate)).problems;
}

std::vector<Problem> ProjectModel::check_store(const Store& store) const {
  Project p;  // the project without its store, then the candidate store: no copy of the current store
  p.format_version = project_.format_version;
  p.units = project_.units;
  p.info = project_.info;
  p.duration_rule = project_.duration_rule;
  p.workforce = project_.workforce;
  p.workforce_given = project_.workforce_given;
  p.reach_parameters = project_.reach_parameters;
  p.reach_parameters_set = project_.reach_parameters_set;
  p.jobs = project_.jobs;
  p.store = store;
  return check_as_file(p);
}

std::string ProjectModel::describe_problems(const std::vector<Problem>& problems, std::size_t max) {
  std::string out;
  for (std::size_t i = 0; i < problems.size() && i < max; ++i)
    out += (out.empty() ? "" : "; ") + format_problem("project", problems[i]);
  if (problems.size() > max) out += "; and " + std::to_string(problems.size() - max) + " more";
  return out;
}

std::string ProjectModel::validate_slot(const Slot& slot, std::optional<std::size_t> replacing) const {
  if (slot.id.empty()) return "a slot needs an id";
  Store s = project_.store;
  if (replacing && *replacing < s.slots.size()) {
    const std::string old_id = s.slots[*replacing].id;
    if (old_id != slot.id)
      for (Route& r : s.routes) std::replace(r.slots.begin(), r.slots.end(), old_id, slot.id);
    s.slots[*replacing] = slot;
  } else {
    s.slots.push_back(slot);
  }
  return describe_problems(check_store(s));
}

std::string ProjectModel::validate_part(const Part& part, std::optional<std::size_t> replacing) const {
  if (part.id.empty()) return "a part needs an id";
  Store s = project_.store;
  if (replacing && *replacing < s.parts.size()) {
    const std::string old_id = s.parts[*replacing].id;
    if (old_id != part.id)
      for (Slot& sl : s.slots)
        if (sl.part == old_id) sl.part = part.id;
    s.parts[*replacing] = part;
  } else {
    s.parts.push_back(part);
  }
  return describe_problems(check_store(s));
}

Store ProjectModel::store_with_rack(std::optional<std::size_t> index, const Rack& rack) const {
  Store s = project_.store;
  if (index && *index < s.racks.size()) {
    const std::string old_id = s.racks[*index].id;
    if (old_id != rack.id)
      for (Slot& sl : s.slots)
        if (sl.rack == old_id) sl.rack = rack.id;
    s.racks[*index] = rack;
  } else {
    s.racks.push_back(rack);
  }
  return s;
}

Store ProjectModel::store_without_rack(std::size_t index) const {
  Store s = project_.store;
  if (index < s.racks.size()) s.racks.erase(s.racks.begin() + static_cast<std::ptrdiff_t>(index));
  return s;
}

Store ProjectModel::store_with_zone(std::optional<std::size_t> index, const Zone& zone) const {
  Store s = project_.store;
  if (index && *index < s.zones.size()) {
    const std::string old_id = s.zones[*index].id;
    if (old_id != zone.id)
      for (Rack& r : s.racks)
        if (r.zone == old_id) r.zone = zone.id;
    s.zones[*index] = zone;
  } else {
    s.zones.push_back(zone);
  }
  return s;
}

Store ProjectModel::store_without_zone(std::size_t index) const {
  Store s = project_.store;
  if (index < s.zones.size()) s.zones.erase(s.zones.begin() + static_cast<std::ptrdiff_t>(index));
  return s;
}

void ProjectModel::set_store(Store store) {
  project_.store = std::move(store);
  if (!reach_ && project_.has_shelf_geometry()) load_reach();
  reassess();
}

}  // namespace rackreach::gui
