// SPDX-License-Identifier: MIT
#include "engine/slotting/review.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <limits>
#include <map>
#include <set>
#include <tuple>
#include <unordered_map>

#include "engine/lifting/composite.hpp"
#include "engine/lifting/variable_2016.hpp"
#include "engine/slotting/coupling_class.hpp"

namespace rackreach {

const char* remedy_name(RemedyKind k) {
  switch (k) {
    case RemedyKind::move_to_waist_zone: return "move to waist zone";
    case RemedyKind::move_to_front: return "move to front of shelf";
    case RemedyKind::truck_level_only: return "truck level only";
    case RemedyKind::split_the_pack: return "split the pack";
    case RemedyKind::mechanical_aid: return "mechanical aid or team lift";
    case RemedyKind::clearance_too_small: return "clearance too small";
    case RemedyKind::outside_scope: return "outside the equation's scope";
  }
  return "?";
}

namespace {

/// The CLI is also given for routes of at most this many picks (our rule: the manual's CLI procedure is meant for
/// a few distinct tasks; the VLI for many).
constexpr std::size_t max_tasks_for_cli = 10;

/// As printf's "%.*f" (std::to_chars gives the same digits, without printf's cost per call).
std::string num(double x, int decimals = 1) {
  char buf[400];
  const auto r = std::to_chars(buf, buf + sizeof buf, x, std::chars_format::fixed, decimals);
  return std::string(buf, r.ptr);
}

/// Where a part could sit: one level of one rack at one depth position (every slot there is alike).
struct Place {
  const Rack* rack = nullptr;
  const Level* level = nullptr;
  const Zone* zone = nullptr;
  SlotPosition position = SlotPosition::front;
  std::optional<DurationCategory> duration;
};

class Reviewer {
 public:
  Reviewer(const Store& s, UnitSystem u, const ReviewOptions& o) : s_(s), store_(&s), u_(u), o_(o) {
    for (const Part& p : s.parts) parts_.emplace(p.id, &p);
    for (const Rack& r : s.racks) racks_.emplace(r.id, &r);
    for (const Zone& z : s.zones) zones_.emplace(z.id, &z);
    shift_pattern_ = s.shift ? s.shift->work_pattern() : Shift{}.work_pattern();
    // The hand-pick places of the store, for the remedies and the hand/truck decisions: one per distinct geometry
    // (zone, surface height, clear height, shelf depth, position), since every such place gives the same lift.
    std::set<std::tuple<std::string, double, double, double, int>> seen;
    for (const Rack& r : s.racks)
      for (const Level& l : r.levels)
        if (l.access == LevelAccess::hand)
          for (SlotPosition pos : {SlotPosition::front, SlotPosition::back})
            if (seen.emplace(r.zone, l.surface_height, l.clear_height, r.shelf_depth, static_cast<int>(pos)).second)
              hand_places_.push_back({&r, &l, find_zone(r), pos, duration_of(find_zone(r))});
  }

  Placement placement(const Part& part, const Slot& at) const {
    Placement out;
    const Rack& rack = *racks_.at(at.rack);
    const Level& level = *s_.find_level(rack, at.level);
    out.fits = part.box.height <= level.clear_height && part.box.depth <= rack.shelf_depth;
    out.truck_access = level.access == LevelAccess::truck;
    const Place place{&rack, &level, find_zone(rack), at.position, duration_of(find_zone(rack))};
    const DerivedLift d = derive(part, place, nullptr);
    out.frequency_per_min = d.task.frequency_per_min;
    if (out.truck_access) return out;
    out.li = evaluate(d, place).li;
    if (const auto reach = reach_of(d, place, false)) out.reach_ok = !reach->find_worst_failure();
    return out;
  }

  bool is_hand_part(const Part& part) const {
    const Alternative& best = best_hand_places(part).any;
    return !part.truck_only && best.li && *best.li <= o_.bands.elevated_above;
  }

  StoreReview run() {
    StoreReview out;
    out.shift_duration = calc_duration(shift_pattern_, o_.duration_rule);
    if (!s_.shift && !s_.slots.empty())
      out.warnings.push_back({WarningKind::duration_over_8h, LiftEnd::origin, 0.0, 0.0,
                              "no shift given: an 8-hour shift without breaks is assumed (06:00-14:00)"});
    if (!out.shift_duration.category)
      out.warnings.push_back({WarningKind::duration_over_8h, LiftEnd::origin, 0.0, long_limit_hours,
                              "the shift has more than 8 h of lifting: " + out.shift_duration.explanation +
                                  "; zones without a lifting pattern of their own are outside the equation"});
    index_store();
    out.findings.reserve(s_.slots.size());
    for (std::size_t i = 0; i < s_.slots.size(); ++i) out.findings.push_back(review_slot(i));
    for (const Part& p : s_.parts) out.part_decisions.push_back(decide_part(p));
    out.family_decisions = decide_families(out.part_decisions);
    out.level_limits = calc_level_limits();
    {
      std::vector<const SlotFinding*> by_slot(out.findings.size());
      for (const SlotFinding& f : out.findings) by_slot[f.slot_index] = &f;
      for (const Route& r : s_.routes) out.routes.push_back(review_route(r, by_slot));
    }
    rank(out.findings);
    return out;
  }

  /// The store this reviewer was made for, at the same address and with the same parts and slots (ids in order).
  const Store* store() const { return store_; }

  /// Brings a review of this reviewer's store up to date after part and slot edits in place (same index, same
  /// id); returns false, changing nothing, when an edit is not of that kind (the caller reviews the whole store).
  bool update(StoreReview& out, const std::vector<StoreEdit>& edits, std::size_t& evaluated) {
    if (s_.parts.size() != part_ids_.size() || s_.slots.size() != slot_part_.size()) return false;
    std::vector<std::size_t> parts_changed, slots_changed;  // part indexes whose own data changed; slot indexes
    for (const StoreEdit& e : edits) {
      if (e.kind == StoreEdit::Kind::everything) return false;
      if (e.kind == StoreEdit::Kind::part) {
        if (e.index >= s_.parts.size() || s_.parts[e.index].id != part_ids_[e.index]) return false;
        parts_changed.push_back(e.index);
      } else {
        if (e.index >= s_.slots.size() || s_.slots[e.index].id != slot_ids_[e.index]) return false;
        const Slot& sl = s_.slots[e.index];
        const auto rack = racks_.find(sl.rack);
        if (!parts_.count(sl.part) || rack == racks_.end() || !s_.find_level(*rack->second, sl.level)) return false;
        slots_changed.push_back(e.index);
      }
    }
    // Which slots are evaluated again, and which parts decided again.
    std::vector<char> redo_slot(s_.slots.size(), 0);
    std::set<std::size_t> redo_part;
    for (std::size_t p : parts_changed) {
      best_cache_.erase(part_ids_[p]);
      redo_part.insert(p);
      for (std::size_t i : slots_of_part_[part_ids_[p]]) redo_slot[i] = 1;
    }
    for (std::size_t i : slots_changed) {
      redo_slot[i] = 1;
      const Slot& sl = s_.slots[i];
      const bool truck = is_truck_slot(sl);
      // The part that leaves and the part that comes: their slot lists and truck-level counts.
      redo_part.insert(part_index_.at(slot_part_[i]));
      redo_part.insert(part_index_.at(sl.part));
      if (slot_truck_[i]) --truck_slots_[slot_part_[i]];
      if (truck) ++truck_slots_[sl.part];
      auto& from = slots_of_part_[slot_part_[i]];
      from.erase(std::find(from.begin(), from.end(), i));
      auto& to = slots_of_part_[sl.part];
      to.insert(std::lower_bound(to.begin(), to.end(), i), i);
      slot_part_[i] = sl.part;
      slot_truck_[i] = truck;
    }
    // The findings again, each replaced where it is and moved to its place in the ranking (a total order, see
    // ranks_before): only the findings between its old and new rank move. Many at once: sorted again instead.
    evaluated = 0;
    std::vector<std::size_t> at;  // rank of each finding to evaluate again
    for (std::size_t k = 0; k < out.findings.size(); ++k)
      if (redo_slot[out.findings[k].slot_index]) at.push_back(k);
    evaluated = at.size();
    if (at.size() > 64) {
      for (std::size_t k : at) out.findings[k] = review_slot(out.findings[k].slot_index);
      rank(out.findings);
    } else {
      std::vector<std::size_t> slots;
      for (std::size_t k : at) slots.push_back(out.findings[k].slot_index);
      for (std::size_t i : slots) {
        const auto it = std::find_if(out.findings.begin(), out.findings.end(),
                                     [i](const SlotFinding& f) { return f.slot_index == i; });
        *it = review_slot(i);
        if (it != out.findings.begin() && ranks_before(*it, *(it - 1)))
          std::rotate(std::upper_bound(out.findings.begin(), it, *it, ranks_before), it, it + 1);
        else if (it + 1 != out.findings.end() && ranks_before(*(it + 1), *it))
          std::rotate(it, it + 1, std::lower_bound(it + 1, out.findings.end(), *it, ranks_before));
      }
    }
    bool families = false;
    for (std::size_t p : redo_part) {
      PartDecision d = decide_part(s_.parts[p]);
      const PartDecision& old = out.part_decisions[p];
      if (d.hand != old.hand || d.family != old.family) families = true;
      out.part_decisions[p] = std::move(d);
    }
    if (families) out.family_decisions = decide_families(out.part_decisions);
    // The routes that visit a slot evaluated again.
    std::set<std::size_t> redo_route;
    for (std::size_t i = 0; i < redo_slot.size(); ++i)
      if (redo_slot[i])
        for (std::size_t r : routes_of_slot_[i]) redo_route.insert(r);
    if (!redo_route.empty()) {
      std::vector<const SlotFinding*> by_slot(out.findings.size());
      for (const SlotFinding& f : out.findings) by_slot[f.slot_index] = &f;
      for (std::size_t r : redo_route) out.routes[r] = review_route(s_.routes[r], by_slot);
    }
    return true;
  }

 private:
  const Zone* find_zone(const Rack& r) const {
    auto it = zones_.find(r.zone);
    return it == zones_.end() ? nullptr : it->second;
  }

  std::optional<DurationCategory> duration_of(const Zone* z) const {
    const std::vector<WorkPeriod>& pattern = z && z->lifting_pattern ? *z->lifting_pattern : shift_pattern_;
    return calc_duration(pattern, o_.duration_rule).category;
  }

  double zone_value(const Zone* z, SourcedValue Zone::*field, double default_cm_or_deg, bool is_length) const {
    if (z) return (z->*field).value;
    return is_length ? Length{default_cm_or_deg, UnitSystem::metric}.in_units(u_) : default_cm_or_deg;
  }

  /// The lift of `part` picked from `place` (at the slot's own overrides, if any).
  DerivedLift derive(const Part& part, const Place& place, const Slot* slot) const {
    DerivedLift d;
    const Zone* z = place.zone;
    d.grip_height = part.grip_height.value_or(part.box.height / 2.0);
    const double shelf = place.rack->shelf_depth;
    d.hands_in_shelf = place.position == SlotPosition::front ? part.box.depth / 2.0
                                                             : std::max(part.box.depth / 2.0, shelf - part.box.depth / 2.0);
    if (slot && slot->standing_distance) d.standing_distance = {*slot->standing_distance, ValueSource::file};
    else if (z) d.standing_distance = {z->standing_distance.value, z->standing_distance.source == ValueSource::file
                                                                       ? ValueSource::zone_default
                                                                       : ValueSource::built_in_default};
    else d.standing_distance = {Length{ZoneDefaults::standing_distance_cm, UnitSystem::metric}.in_units(u_),
                                ValueSource::built_in_default};
    const CouplingClass cc = calc_coupling_class(part, u_);
    d.lifts_per_kit = part.pieces_per_kit / part.pieces_per_grasp;
    LiftTask& t = d.task;
    if (slot) {  // the words only for a slot's own lift, not for the places searched for remedies
      d.coupling_reason = cc.reason;
      t.id = slot->id;
    }
    t.load = part.unit_weight * part.pieces_per_grasp;
    t.frequency_per_min = s_.kits_per_hour * d.lifts_per_kit / 60.0;
    t.coupling = cc.coupling;
    t.origin = {d.standing_distance.value + d.hands_in_shelf, place.level->surface_height + d.grip_height,
                slot && slot->origin_angle_deg ? *slot->origin_angle_deg
                                               : zone_value(z, &Zone::origin_angle_deg, ZoneDefaults::origin_angle_deg, false)};
    t.destination = {zone_value(z, &Zone::cart_h, ZoneDefaults::cart_h_cm, true),
                     zone_value(z, &Zone::cart_deck_height, ZoneDefaults::cart_deck_height_cm, true) + d.grip_height,
                     zone_value(z, &Zone::turn_angle_deg, ZoneDefaults::turn_angle_deg, false)};
    t.control_at_destination = z && z->control_at_destination;
    if (z) t.limits = z->limits;
    return d;
  }

  TaskResult evaluate(const DerivedLift& d, const Place& place) const {
    return evaluate_task(d.task, place.duration, u_, o_.rounding);
  }

  /// The reach result of a lift from a place; `explain` false: no messages and no input check (for searching
  /// places, whose inputs are as valid as the slot's own: the box fits below the level above).
  std::optional<ReachResult> reach_of(const DerivedLift& d, const Place& place, bool explain = true) const {
    if (!o_.small || !o_.large) return std::nullopt;
    ReachQuery q;
    q.grip_height_cm = Length{d.task.origin.v, u_}.in_cm();
    q.grip_depth_cm = Length{d.hands_in_shelf, u_}.in_cm();
    q.structure_above_grip_cm = Length{place.level->surface_height + place.level->clear_height, u_}.in_cm();
    ReachParameters p = o_.reach_parameters;
    p.ankle_to_rack_face_cm = Length{d.standing_distance.value, u_}.in_cm();
    if (explain && !validate_reach_inputs(*o_.small, *o_.large, q, p).empty()) return std::nullopt;
    return calc_reach(*o_.small, *o_.large, q, p, explain);
  }

  /// The waist zone for remedies: from the small worker's grip-centre height to the large worker's elbow height
  /// (with footwear), the span where both lift between knuckle and elbow; without a workforce, V 75 cm (30 in)
  /// +- 25 cm, the equation's optimum.
  std::pair<double, double> waist_zone() const {
    if (o_.small && o_.large) {
      const double shoe = o_.reach_parameters.footwear_allowance_cm;
      return {Length{o_.small->grip_centre_height_cm + shoe, UnitSystem::metric}.in_units(u_),
              Length{o_.large->elbow_height_cm + shoe, UnitSystem::metric}.in_units(u_)};
    }
    const double v = find_constants(u_).v_optimum, w = Length{25.0, UnitSystem::metric}.in_units(u_);
    return {v - w, v + w};
  }

  struct Alternative {
    const Place* place = nullptr;
    std::optional<double> li;
  };

  struct BestPlaces {
    Alternative any;    ///< the lowest LI of all hand places
    Alternative waist;  ///< the lowest LI of those whose origin V lies in the waist zone
  };

  /// The hand places with the lowest LI for a part (front and back of every hand level), found once per part and
  /// kept: the remedies of its slot and its hand/truck decision both use them.
  const BestPlaces& best_hand_places(const Part& part) const {
    if (auto it = best_cache_.find(part.id); it != best_cache_.end()) return it->second;
    BestPlaces best;
    const auto [lo, hi] = waist_zone();
    for (std::size_t i = 0; i < hand_places_.size(); ++i) {
      const Place& pl = hand_places_[i];
      if (part.box.height > pl.level->clear_height) continue;
      const DerivedLift d = derive(part, pl, nullptr);
      const TaskResult r = evaluate(d, pl);
      if (!r.li) continue;
      if (!reach_passes(d, pl, i)) continue;
      if (!best.any.li || *r.li < *best.any.li) best.any = {&pl, r.li};
      const bool in_waist = d.task.origin.v >= lo && d.task.origin.v <= hi;
      if (in_waist && (!best.waist.li || *r.li < *best.waist.li)) best.waist = {&pl, r.li};
    }
    return best_cache_.emplace(part.id, best).first->second;
  }

  /// Whether a lift from a place meets every reach limit. The answer depends only on the place, the grip height
  /// and the hands' depth, so it is kept per such triple (boxes of the same size share it).
  bool reach_passes(const DerivedLift& d, const Place& place, std::size_t place_index) const {
    if (!o_.small || !o_.large) return true;
    const auto key = std::make_tuple(place_index, d.grip_height, d.hands_in_shelf);
    if (auto it = reach_cache_.find(key); it != reach_cache_.end()) return it->second;
    const auto reach = reach_of(d, place, false);
    const bool ok = !reach || !reach->find_worst_failure();
    reach_cache_.emplace(key, ok);
    return ok;
  }

  static std::string place_name(const Place& p) {
    return "rack " + p.rack->id + " level " + p.level->id + " " + (p.position == SlotPosition::front ? "front" : "back");
  }

  SlotFinding review_slot(std::size_t index) const {
    const Slot& slot = s_.slots[index];
    SlotFinding f;
    f.slot_index = index;
    f.slot_id = slot.id;
    f.part_id = slot.part;
    f.rack_id = slot.rack;
    f.level_id = slot.level;
    const Part& part = *parts_.at(slot.part);
    const Rack& rack = *racks_.at(slot.rack);
    const Level& level = *s_.find_level(rack, slot.level);
    f.family = part.family;
    const Place place{&rack, &level, find_zone(rack), slot.position, duration_of(find_zone(rack))};
    f.lift = derive(part, place, &slot);
    f.result = evaluate(f.lift, place);
    f.band = find_band(f.result.li, o_.bands);
    f.truck_access = level.access == LevelAccess::truck;
    if (f.truck_access) return f;  // a lift-truck pick: shown, not judged as a manual lift
    f.reach = reach_of(f.lift, place);
    if (f.reach)
      for (const ReachCheck& c : f.reach->checks)
        if (!c.passed && !c.advisory) f.warnings.push_back({WarningKind::reach_limit, LiftEnd::origin, c.margin_cm, 0.0, c.message});
    add_remedies(f, part, place);
    return f;
  }

  void add_remedies(SlotFinding& f, const Part& part, const Place& place) const {
    const std::string mass(mass_unit(u_)), len(length_unit(u_));
    const TaskResult& r = f.result;
    const bool over = !r.li || *r.li > o_.bands.elevated_above;
    const bool reach_fails = f.reach && f.reach->find_worst_failure();
    if (part.box.height > place.level->clear_height)
      f.remedies.push_back({RemedyKind::clearance_too_small,
                            "the box is " + num(part.box.height) + " " + len + " high, the level's clear height is " +
                                num(place.level->clear_height) + " " + len,
                            place.level->clear_height, {}});
    else if (f.reach)
      for (const ReachCheck& c : f.reach->checks)
        if (c.code == "hand_clearance" && !c.passed)
          f.remedies.push_back({RemedyKind::clearance_too_small, c.message, c.margin_cm, {}});
    if (!r.li) {
      std::string why;
      for (const Warning& w : r.warnings)
        if (warning_code(w).substr(0, 8) == "outside." || w.kind == WarningKind::duration_over_8h)
          why += (why.empty() ? "" : "; ") + describe_warning(w, u_);
      f.remedies.push_back({RemedyKind::outside_scope, why.empty() ? "the lift is outside the equation" : why, {}, {}});
    }
    if (!over && !reach_fails) return;
    // Front of the shelf: the same part and level, hands nearer.
    if (place.position == SlotPosition::back) {
      Place front = place;
      front.position = SlotPosition::front;
      const DerivedLift d = derive(part, front, &s_.slots[f.slot_index]);
      const TaskResult fr = evaluate(d, front);
      const auto freach = reach_of(d, front);
      const bool better = fr.li && (!r.li || *fr.li < *r.li - 1e-9);
      if (better || (reach_fails && freach && !freach->find_worst_failure()))
        f.remedies.push_back({RemedyKind::move_to_front,
                              "at the front of the same level H is " + num(d.task.origin.h) + " " + len +
                                  " instead of " + num(f.lift.task.origin.h) + " " + len +
                                  (fr.li ? ": LI " + num(*fr.li, 2) : std::string()),
                              fr.li, "front"});
    }
    // Waist zone: the best hand level whose origin lies between knuckle and elbow height.
    const auto [lo, hi] = waist_zone();
    const double v = f.lift.task.origin.v;
    if (v < lo || v > hi) {
      const Alternative& alt = best_hand_places(part).waist;
      if (alt.li && (!r.li || *alt.li < *r.li - 1e-9))
        f.remedies.push_back({RemedyKind::move_to_waist_zone,
                              "V " + num(v) + " " + len + " is outside the waist zone (" + num(lo) + "-" + num(hi) +
                                  " " + len + "); at " + place_name(*alt.place) + " the LI is " + num(*alt.li, 2),
                              alt.li, place_name(*alt.place)});
    }
    if (!over) return;
    // Split the pack: n lifts of load/n at n x F, the fewest n that brings the LI to 1.0 or below. Only a pack
    // of several pieces, or a grasp of several pieces, can be split; a single part cannot.
    if (r.li && (part.pack_pieces > 1 || part.pieces_per_grasp > 1)) {
      for (int n = 2; n <= 12; ++n) {
        LiftTask split = f.lift.task;
        split.frequency_per_min = f.lift.task.frequency_per_min * n;
        split.load = f.lift.task.load / n;
        const TaskResult sr = evaluate_task(split, place.duration, u_, o_.rounding);
        const PointResult& g = sr.governing_point();
        if (sr.li && *sr.li <= 1.0 && g.rwl > 0.0) {
          f.remedies.push_back({RemedyKind::split_the_pack,
                                "at this slot a unit of at most " + num(g.rwl, 1) + " " + mass + " gives LI 1.0 (" +
                                    std::to_string(n) + " lifts instead of one, " + num(split.frequency_per_min, 2) +
                                    " lifts/min)",
                                g.rwl, std::to_string(n) + " lifts"});
          break;
        }
      }
    }
    // No hand place of the store takes the part within the limit: truck level, and for the worst, a mechanical aid.
    const Alternative& best = best_hand_places(part).any;
    const bool no_hand_place = !best.li || *best.li > o_.bands.elevated_above;
    if (no_hand_place)
      f.remedies.push_back({RemedyKind::truck_level_only,
                            best.li ? "no hand slot of the store gives LI 1.0 or below (best: LI " + num(*best.li, 2) +
                                          " at " + place_name(*best.place) + ")"
                                    : std::string("no hand slot of the store takes this part within the equation"),
                            best.li, "truck access"});
    const double lc = find_constants(u_).lc;
    if (f.lift.task.load > lc)
      f.remedies.push_back({RemedyKind::mechanical_aid,
                            "the load of " + num(f.lift.task.load) + " " + mass +
                                " is above the equation's load constant (" + num(lc, 0) + " " + mass +
                                "): no hand slot can take it",
                            {}, {}});
    else if (no_hand_place && (!r.li || *r.li > o_.bands.very_high_above))
      f.remedies.push_back({RemedyKind::mechanical_aid,
                            r.li ? "LI " + num(*r.li, 2) + " is above " + num(o_.bands.very_high_above) +
                                       " and no hand slot brings it to 1.0"
                                 : std::string("outside the equation here and no hand slot brings it to LI 1.0"),
                            {}, {}});
  }

  bool is_truck_slot(const Slot& sl) const {
    return s_.find_level(*racks_.at(sl.rack), sl.level)->access == LevelAccess::truck;
  }

  /// The indexes an update needs: slots of each part, parts by id, slots by id, routes of each slot, and how
  /// many of each part's slots are on truck levels.
  void index_store() {
    part_ids_.clear();
    part_index_.clear();
    slots_of_part_.clear();
    truck_slots_.clear();
    for (std::size_t p = 0; p < s_.parts.size(); ++p) {
      part_ids_.push_back(s_.parts[p].id);
      part_index_.emplace(s_.parts[p].id, p);
    }
    slot_ids_.clear();
    slot_part_.clear();
    slot_truck_.clear();
    slot_of_id_.clear();
    for (std::size_t i = 0; i < s_.slots.size(); ++i) {
      const Slot& sl = s_.slots[i];
      const bool truck = is_truck_slot(sl);
      slot_ids_.push_back(sl.id);
      slot_part_.push_back(sl.part);
      slot_truck_.push_back(truck);
      slot_of_id_.emplace(sl.id, i);
      slots_of_part_[sl.part].push_back(i);
      if (truck) ++truck_slots_[sl.part];
    }
    routes_of_slot_.assign(s_.slots.size(), {});
    for (std::size_t r = 0; r < s_.routes.size(); ++r)
      for (const std::string& id : s_.routes[r].slots) {
        auto& list = routes_of_slot_[slot_of_id_.at(id)];
        if (list.empty() || list.back() != r) list.push_back(r);
      }
  }

  PartDecision decide_part(const Part& p) const {
    PartDecision d;
    d.part_id = p.id;
    d.family = p.family;
    const Alternative& best = best_hand_places(p).any;
    d.best_hand_li = best.li;
    if (best.place) d.best_hand_slot = place_name(*best.place);
    if (p.truck_only) {
      d.hand = false;
      d.reason = "truck only, as the file says";
    } else if (!best.li || *best.li > o_.bands.elevated_above) {
      d.hand = false;
      d.reason = best.li ? "no hand slot gives LI 1.0 or below (best LI " + num(*best.li, 2) + " at " +
                               d.best_hand_slot + ")"
                         : "no hand slot takes it within the equation";
    } else {
      d.hand = true;
      const auto t = truck_slots_.find(p.id);
      d.reason = "LI " + num(*best.li, 2) + " at " + d.best_hand_slot +
                 (t != truck_slots_.end() && t->second > 0 ? "; now slotted on a truck level" : "");
    }
    return d;
  }

  /// Each family's pick from its parts' decisions, families in the order their first part comes.
  static std::vector<FamilyDecision> decide_families(const std::vector<PartDecision>& parts) {
    std::vector<FamilyDecision> out;
    std::map<std::string, std::size_t> family_index;
    for (const PartDecision& d : parts) {
      auto [it, fresh] = family_index.emplace(d.family, out.size());
      if (fresh) out.push_back({d.family, FamilyDecision::Pick::hand, {}, {}, {}});
      FamilyDecision& fam = out[it->second];
      (d.hand ? fam.hand_parts : fam.truck_parts).push_back(d.part_id);
    }
    for (FamilyDecision& fam : out) {
      fam.pick = fam.truck_parts.empty() ? FamilyDecision::Pick::hand
                 : fam.hand_parts.empty() ? FamilyDecision::Pick::truck
                                          : FamilyDecision::Pick::split;
      fam.reason = fam.pick == FamilyDecision::Pick::hand    ? "every part can be hand-picked within the limit"
                   : fam.pick == FamilyDecision::Pick::truck ? "no part of the family can be hand-picked within the limit"
                                                             : std::to_string(fam.truck_parts.size()) + " of " +
                                                                   std::to_string(fam.truck_parts.size() + fam.hand_parts.size()) +
                                                                   " parts need truck access";
    }
    return out;
  }

  std::vector<LevelLimit> calc_level_limits() const {
    std::vector<LevelLimit> out;
    Part ref;
    ref.id = "reference box";
    ref.box = s_.reference_box.box;
    ref.coupling = s_.reference_box.coupling;
    for (const Rack& r : s_.racks)
      for (const Level& l : r.levels)
        for (SlotPosition pos : {SlotPosition::front, SlotPosition::back}) {
          const Place place{&r, &l, find_zone(r), pos, duration_of(find_zone(r))};
          DerivedLift d = derive(ref, place, nullptr);
          LevelLimit lim{r.id, l.id, pos, l.access, d.task.origin.v, d.task.origin.h, {}};
          for (double f : s_.limit_frequencies_per_min) {
            d.task.frequency_per_min = f;
            d.task.load = 1.0;  // the RWL does not depend on the load
            const TaskResult tr = evaluate(d, place);
            const double rwl = tr.governing_point().rwl;
            lim.rwl.push_back(tr.outside_equation || rwl <= 0.0 ? std::nullopt : std::optional<double>(rwl));
          }
          out.push_back(std::move(lim));
        }
    return out;
  }

  /// A route's job index: the VLI over its picks (Waters et al. 2016; the category rule is named in the result),
  /// and the CLI as well where the route has few picks.
  RouteResult review_route(const Route& route, const std::vector<const SlotFinding*>& by_slot) const {
    RouteResult out;
    out.id = route.id;
    out.name = route.name;
    std::vector<CompositeItem> items;
    std::vector<VariableSubtask> subtasks;
    std::optional<DurationCategory> duration;
    for (const std::string& id : route.slots) {
      const SlotFinding& f = *by_slot[slot_of_id_.at(id)];
      items.push_back(make_composite_item(f.lift.task, f.result, u_));
      subtasks.push_back(make_variable_subtask(f.lift.task, f.result, u_));
      duration = duration_of(find_zone(*racks_.at(f.rack_id)));
    }
    const VariableResult v = calc_variable_li(subtasks, duration, o_.rounding);
    out.vli = v.vli;
    out.vli_rule = std::string(v.category_rule);
    out.undefined_reason = v.undefined_reason;
    if (items.size() <= max_tasks_for_cli) out.cli = calc_composite_li(items, duration, o_.rounding).cli;
    for (std::size_t i = 0; i < items.size(); ++i)
      out.contributions.push_back({items[i].id, items[i].frequency_per_min, items[i].fili, items[i].stli,
                                   i < v.contributions.size() ? v.contributions[i] : 0.0});
    std::stable_sort(out.contributions.begin(), out.contributions.end(),
                     [](const RouteContribution& a, const RouteContribution& b) { return a.contribution > b.contribution; });
    return out;
  }

  /// The ranking: worst first (outside the equation, then by LI, then by frequency, i.e. exposure), truck
  /// picks last, and the store's slot order among equals. A total order, so an updated finding has one place.
  static bool ranks_before(const SlotFinding& a, const SlotFinding& b) {
    if (a.truck_access != b.truck_access) return b.truck_access;
    const double la = a.result.li.value_or(std::numeric_limits<double>::infinity());
    const double lb = b.result.li.value_or(std::numeric_limits<double>::infinity());
    if (la != lb) return la > lb;
    if (a.lift.task.frequency_per_min != b.lift.task.frequency_per_min)
      return a.lift.task.frequency_per_min > b.lift.task.frequency_per_min;
    return a.slot_index < b.slot_index;
  }

  static void rank(std::vector<SlotFinding>& findings) { std::sort(findings.begin(), findings.end(), ranks_before); }

  const Store& s_;
  const Store* store_;
  UnitSystem u_;
  const ReviewOptions& o_;
  std::unordered_map<std::string, const Part*> parts_;
  std::unordered_map<std::string, const Rack*> racks_;
  std::unordered_map<std::string, const Zone*> zones_;
  std::vector<WorkPeriod> shift_pattern_;
  std::vector<Place> hand_places_;
  /// Per part id. A part that is not in the store (the reference box, a part placed by the re-slotting costs)
  /// is never edited in place, so only the store's own parts are erased from it by update().
  mutable std::unordered_map<std::string, BestPlaces> best_cache_;
  mutable std::map<std::tuple<std::size_t, double, double>, bool> reach_cache_;
  // For update(): the store as last reviewed.
  std::vector<std::string> part_ids_, slot_ids_, slot_part_;
  std::vector<char> slot_truck_;
  std::unordered_map<std::string, std::size_t> part_index_, slot_of_id_;
  std::unordered_map<std::string, std::vector<std::size_t>> slots_of_part_;
  std::unordered_map<std::string, int> truck_slots_;
  std::vector<std::vector<std::size_t>> routes_of_slot_;
};

}  // namespace

StoreReview review_store(const Store& store, UnitSystem units, const ReviewOptions& options) {
  return Reviewer(store, units, options).run();
}

class StoreReviewer::State : public Reviewer {
 public:
  using Reviewer::Reviewer;
};

StoreReviewer::StoreReviewer(UnitSystem units, const ReviewOptions& options) : units_(units), options_(options) {}
StoreReviewer::~StoreReviewer() = default;

StoreReview StoreReviewer::review(const Store& store) {
  state_ = std::make_unique<State>(store, units_, options_);
  last_slots_evaluated_ = store.slots.size();
  return state_->run();
}

void StoreReviewer::update(StoreReview& review, const Store& store, const std::vector<StoreEdit>& edits) {
  if (state_ && state_->store() == &store && state_->update(review, edits, last_slots_evaluated_)) return;
  review = this->review(store);
}

class PlacementEvaluator::Impl {
 public:
  Impl(const Store& s, UnitSystem u, const ReviewOptions& o) : options_(o), reviewer_(s, u, options_) {}
  ReviewOptions options_;
  Reviewer reviewer_;
};

PlacementEvaluator::PlacementEvaluator(const Store& store, UnitSystem units, const ReviewOptions& options)
    : impl_(std::make_unique<Impl>(store, units, options)) {}
PlacementEvaluator::~PlacementEvaluator() = default;
Placement PlacementEvaluator::evaluate(const Part& part, const Slot& at) const { return impl_->reviewer_.placement(part, at); }
bool PlacementEvaluator::is_hand_part(const Part& part) const { return impl_->reviewer_.is_hand_part(part); }

}  // namespace rackreach
