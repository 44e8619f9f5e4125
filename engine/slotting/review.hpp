// SPDX-License-Identifier: MIT
#pragma once
// Slot review: every slot of a store gives a pick lift (origin at the slot, destination at the kit cart), which
// is evaluated with the lifting equation and the reach model, ranked, and given its remedies; every level gets
// its heaviest hand-pick load (level limits), every part and family a hand/truck decision, every route its job
// index. Derivation rules (our reading of the method for a rack, stated in every report):
//   V origin = level surface + grip height of the box (default half the box height, our assumption);
//   H origin = standing distance (ankles to rack face) + horizontal position of the hands in the shelf: half the
//              box depth at the front of the shelf, shelf depth less half the box depth at the back;
//   A origin = the zone's (default 0); destination V = cart deck + grip height, H = the zone's cart H,
//   A = the zone's turn angle; D = |V destination - V origin|;
//   F = kits per hour x pieces per kit / pieces per grasp / 60; load = unit weight x pieces per grasp;
//   duration from the shift (or the zone's lifting pattern) by the Applications Manual's recovery rule.

#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/duration.hpp"
#include "engine/lifting/risk_bands.hpp"
#include "engine/lifting/rnle_1994.hpp"
#include "engine/reach/sagittal_reach.hpp"
#include "engine/slotting/store.hpp"

namespace rackreach {

/// The lift a slot causes, with every derived value and where it came from.
struct DerivedLift {
  LiftTask task;                  ///< the lift as the equation sees it (id = slot id)
  SourcedValue standing_distance;
  double hands_in_shelf = 0.0;    ///< horizontal position of the hands behind the rack face
  double grip_height = 0.0;       ///< above the box's base
  std::string coupling_reason;    ///< how the coupling class follows from the part (or "given in the file")
  double lifts_per_kit = 0.0;     ///< pieces per kit / pieces per grasp
  bool operator==(const DerivedLift&) const = default;
};

enum class RemedyKind {
  move_to_waist_zone,
  move_to_front,
  truck_level_only,
  split_the_pack,
  mechanical_aid,
  clearance_too_small,
  outside_scope,
};
const char* remedy_name(RemedyKind k);

/// What to do about a slot, why, and the number that decides it where there is one.
struct Remedy {
  RemedyKind kind = RemedyKind::outside_scope;
  std::string reason;             ///< plain words, with the numbers and their units
  std::optional<double> number;   ///< e.g. the largest unit weight that gives LI 1.0 (mass unit), or the LI after
  std::string target;             ///< e.g. the level to move to
  bool operator==(const Remedy&) const = default;
};

struct SlotFinding {
  std::size_t slot_index = 0;     ///< into Store::slots
  std::string slot_id, part_id, family, rack_id, level_id;
  DerivedLift lift;
  TaskResult result;
  std::optional<ReachResult> reach;
  RiskBand band = RiskBand::within_limit;
  bool truck_access = false;      ///< on a truck-access level: picked by lift truck, not a manual lift
  std::vector<Remedy> remedies;
  std::vector<Warning> warnings;  ///< reach and fit findings beside the lift's own
  bool operator==(const SlotFinding&) const = default;
};

/// Hand or truck picking for a part, and why.
struct PartDecision {
  std::string part_id, family;
  bool hand = true;
  std::optional<double> best_hand_li;  ///< the lowest LI of this part at any hand slot of the store
  std::string best_hand_slot;          ///< where (rack/level/position)
  std::string reason;
  bool operator==(const PartDecision&) const = default;
};

struct FamilyDecision {
  std::string family;
  enum class Pick { hand, truck, split } pick = Pick::hand;
  std::vector<std::string> hand_parts, truck_parts;
  std::string reason;
  bool operator==(const FamilyDecision&) const = default;
};

/// The heaviest load with LI <= 1 (the RWL) at one level and depth position for the reference box, per frequency.
struct LevelLimit {
  std::string rack_id, level_id;
  SlotPosition position = SlotPosition::front;
  LevelAccess access = LevelAccess::hand;
  double v = 0.0, h = 0.0;
  std::vector<std::optional<double>> rwl;  ///< per Store::limit_frequencies_per_min; empty where RWL = 0
  bool operator==(const LevelLimit&) const = default;
};

/// A slot's part in a route's job index.
struct RouteContribution {
  std::string slot_id;
  double frequency_per_min = 0.0;
  std::optional<double> fili, stli;
  double contribution = 0.0;  ///< how much the slot adds to the route's index (see variable_2016.hpp)
  bool operator==(const RouteContribution&) const = default;
};

struct RouteResult {
  std::string id, name;
  std::optional<double> vli;
  std::optional<double> cli;  ///< where the route has few tasks
  std::optional<std::string> undefined_reason;
  std::string vli_rule;       ///< the category rule used, as the report names it
  std::vector<RouteContribution> contributions;  ///< largest first
  bool operator==(const RouteResult&) const = default;
};

struct StoreReview {
  DurationAssessment shift_duration;            ///< from the shift pattern
  std::vector<SlotFinding> findings;            ///< ranked: worst first
  std::vector<PartDecision> part_decisions;
  std::vector<FamilyDecision> family_decisions;
  std::vector<LevelLimit> level_limits;
  std::vector<RouteResult> routes;
  std::vector<Warning> warnings;                ///< store-level: shift over 8 h, ...
  bool operator==(const StoreReview&) const = default;
};

struct ReviewOptions {
  RoundingMode rounding = RoundingMode::full;
  DurationRule duration_rule = DurationRule::edition_2021;
  RiskBands bands;
  const ReachBody* small = nullptr;  ///< reach checks when both are given
  const ReachBody* large = nullptr;
  ReachParameters reach_parameters;
};

StoreReview review_store(const Store& store, UnitSystem units, const ReviewOptions& options);

/// One edit of a store since its last review: a part or a slot replaced in place (same index). Anything else
/// (a slot or part added or removed, a part or slot renamed, racks, zones, routes, demand or shift changed) is
/// `everything`.
struct StoreEdit {
  enum class Kind { part, slot, everything } kind = Kind::everything;
  std::size_t index = 0;  ///< into Store::parts or Store::slots
};

/// A slot review that keeps what it found between edits, so that after a part or a slot edit only what depends
/// on it is evaluated again: the lifts and findings of that part's slots (or of that slot), the part's best hand
/// places, the part's and its family's decisions, the routes that visit those slots, and the ranking. The rest
/// (level limits, other parts' places, reach verdicts per place and box geometry) is kept. update() gives
/// exactly what review_store() gives for the edited store (the tests compare them field by field).
class StoreReviewer {
 public:
  /// `options` is copied; the reach workers it points to must outlive the reviewer.
  StoreReviewer(UnitSystem units, const ReviewOptions& options);
  ~StoreReviewer();
  StoreReviewer(const StoreReviewer&) = delete;
  StoreReviewer& operator=(const StoreReviewer&) = delete;

  /// A full review of `store`, as review_store(); keeps its caches for update().
  StoreReview review(const Store& store);
  /// Brings `review` (the last result of review() or update() of this reviewer) up to date with `store` after
  /// `edits`. Edits of kind `everything`, or any edit the caches cannot follow, give a full review.
  void update(StoreReview& review, const Store& store, const std::vector<StoreEdit>& edits);
  /// How many slots the last update() evaluated again (all of them after a full review).
  std::size_t last_slots_evaluated() const { return last_slots_evaluated_; }

 private:
  class State;
  UnitSystem units_;
  ReviewOptions options_;
  std::unique_ptr<State> state_;
  std::size_t last_slots_evaluated_ = 0;
};

/// A part placed at a slot's place (rack, level, position), derived and evaluated exactly as the review does.
struct Placement {
  bool fits = true;            ///< the box fits the level's clear height and the shelf depth
  bool truck_access = false;   ///< a lift-truck level: no manual lift
  bool reach_ok = true;        ///< every reach limit met (when the review has a workforce)
  std::optional<double> li;    ///< empty on truck levels and outside the equation
  double frequency_per_min = 0.0;
};

/// Evaluates parts at places of one store without reviewing the whole store (the re-slotting costs).
class PlacementEvaluator {
 public:
  PlacementEvaluator(const Store& store, UnitSystem units, const ReviewOptions& options);
  ~PlacementEvaluator();
  PlacementEvaluator(const PlacementEvaluator&) = delete;
  PlacementEvaluator& operator=(const PlacementEvaluator&) = delete;
  Placement evaluate(const Part& part, const Slot& at) const;
  /// The review's hand/truck decision for a part.
  bool is_hand_part(const Part& part) const;

 private:
  class Impl;
  std::unique_ptr<Impl> impl_;
};

}  // namespace rackreach
