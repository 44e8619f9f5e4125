// SPDX-License-Identifier: MIT
// Slot review: from a slot to its lift (our own worked examples, computed by hand from the derivation rules in
// engine/slotting/review.hpp and the equation of Waters et al. 1993), remedies, level limits and decisions.

#include <catch2/catch.hpp>

#include "engine/lifting/frequency_table.hpp"
#include "engine/slotting/coupling_class.hpp"
#include "engine/slotting/review.hpp"

using namespace rackreach;
using Catch::Matchers::WithinAbs;

namespace {

Store make_store() {
  Store s;
  s.kits_per_hour = 12.0;
  Zone z;
  z.id = "Z";
  z.standing_distance = {25.0, ValueSource::file};
  z.cart_deck_height = {90.0, ValueSource::file};
  z.cart_h = {40.0, ValueSource::file};
  z.turn_angle_deg = {45.0, ValueSource::file};
  z.origin_angle_deg = {0.0, ValueSource::file};
  // 50 min of picking, 60 min of other work, 50 min of picking: short duration (2021 rule).
  z.lifting_pattern = std::vector<WorkPeriod>{{WorkPeriod::Kind::lifting, 50}, {WorkPeriod::Kind::recovery, 60},
                                              {WorkPeriod::Kind::lifting, 50}};
  s.zones.push_back(z);
  Rack r;
  r.id = "R";
  r.kind = RackKind::hand;
  r.zone = "Z";
  r.bay_width = 120;
  r.shelf_depth = 60;
  r.bays = 4;
  r.levels = {{"1", 10, 40, LevelAccess::hand}, {"2", 60, 40, LevelAccess::hand}, {"3", 150, 40, LevelAccess::hand}};
  s.racks.push_back(r);
  s.reference_box = {{30, 30, 25}, Coupling::fair};
  return s;
}

Part make_part(std::string id, double kg, double ppk = 2) {
  Part p;
  p.id = std::move(id);
  p.family = "test";
  p.unit_weight = kg;
  p.box = {40, 30, 20};
  p.coupling = Coupling::good;
  p.pieces_per_kit = ppk;
  return p;
}

Slot make_slot(std::string id, std::string part, std::string level, int bay, SlotPosition pos) {
  Slot s;
  s.id = std::move(id);
  s.part = std::move(part);
  s.rack = "R";
  s.level = std::move(level);
  s.bay = bay;
  s.position = pos;
  return s;
}

const SlotFinding& finding(const StoreReview& r, const std::string& slot) {
  for (const auto& f : r.findings)
    if (f.slot_id == slot) return f;
  FAIL("no finding for " << slot);
  throw;
}

const Remedy* remedy(const SlotFinding& f, RemedyKind k) {
  for (const auto& r : f.remedies)
    if (r.kind == k) return &r;
  return nullptr;
}

}  // namespace

TEST_CASE("Geometry to lift: front, back, floor and top levels, turned cart (our own worked examples)", "[slotting]") {
  Store s = make_store();
  s.parts = {make_part("P", 10.0)};
  s.slots = {make_slot("floor-front", "P", "1", 1, SlotPosition::front), make_slot("floor-back", "P", "1", 2, SlotPosition::back),
             make_slot("top-front", "P", "3", 1, SlotPosition::front)};
  const StoreReview r = review_store(s, UnitSystem::metric, {});
  const LiftTask& t = finding(r, "floor-front").lift.task;
  // V = surface 10 + half the box height 10; H = standing 25 + half the box depth 15.
  CHECK(t.origin.v == 20.0);
  CHECK(t.origin.h == 40.0);
  CHECK(t.origin.a_deg == 0.0);
  // Destination: cart deck 90 + grip 10; cart H 40; turn 45 deg; D = 80.
  CHECK(t.destination.v == 100.0);
  CHECK(t.destination.h == 40.0);
  CHECK(t.destination.a_deg == 45.0);
  // F = 12 kits/h x 2 pieces per kit / 1 per grasp / 60 = 0.4 lifts/min; load = 10 kg x 1.
  CHECK_THAT(t.frequency_per_min, WithinAbs(0.4, 1e-12));
  CHECK(t.load == 10.0);
  // RWL at the origin by hand: 23 x 25/40 x (1 - .003 x 55) x (.82 + 4.5/80) x 1 x FM(0.4, short, V < 75) x 1.
  const double fm = 1.00 + (0.4 - 0.2) / 0.3 * (0.97 - 1.00);  // Table 5, short, interpolated between 0.2 and 0.5
  const double rwl = 23.0 * 25.0 / 40.0 * (1 - 0.003 * 55) * (0.82 + 4.5 / 80) * fm;
  CHECK_THAT(finding(r, "floor-front").result.origin.rwl, WithinAbs(rwl, 1e-9));
  CHECK_THAT(*finding(r, "floor-front").result.li, WithinAbs(10.0 / rwl, 1e-9));
  // The turned cart: AM at the destination = 1 - 0.0032 x 45.
  CHECK_THAT(finding(r, "floor-front").result.destination.am.value, WithinAbs(1 - 0.0032 * 45, 1e-12));
  // Back of the shelf: hands at 60 - 15 = 45 cm behind the face, H = 70 cm > 63: outside the equation.
  const SlotFinding& back = finding(r, "floor-back");
  CHECK(back.lift.task.origin.h == 70.0);
  CHECK(back.lift.hands_in_shelf == 45.0);
  CHECK_FALSE(back.result.li.has_value());
  CHECK(remedy(back, RemedyKind::outside_scope));
  CHECK(remedy(back, RemedyKind::move_to_front));
  // Top level: V = 150 + 10 = 160 cm.
  CHECK(finding(r, "top-front").lift.task.origin.v == 160.0);
  // Duration from the zone's pattern: short.
  CHECK(finding(r, "floor-front").result.origin.fm.value == Approx(fm));
}

TEST_CASE("A heavy, frequent part on the floor gets 'move to waist zone', and the waist slot passes", "[slotting]") {
  Store s = make_store();
  s.parts = {make_part("HEAVY", 11.0, 3)};  // 0.6 lifts/min
  s.slots = {make_slot("floor", "HEAVY", "1", 1, SlotPosition::front)};
  const StoreReview r = review_store(s, UnitSystem::metric, {});
  const SlotFinding& f = finding(r, "floor");
  REQUIRE(f.result.li);
  CHECK(*f.result.li > 1.0);
  const Remedy* waist = remedy(f, RemedyKind::move_to_waist_zone);
  REQUIRE(waist);
  CHECK(waist->target == "rack R level 2 front");
  // Move it there and review again: the slot passes, with the LI the remedy promised.
  s.slots = {make_slot("waist", "HEAVY", "2", 1, SlotPosition::front)};
  const StoreReview moved = review_store(s, UnitSystem::metric, {});
  REQUIRE(finding(moved, "waist").result.li);
  CHECK(*finding(moved, "waist").result.li <= 1.0);
  CHECK_THAT(*finding(moved, "waist").result.li, WithinAbs(*waist->number, 1e-9));
  CHECK(finding(moved, "waist").remedies.empty());
}

TEST_CASE("A part too heavy for any hand slot goes to truck access", "[slotting]") {
  Store s = make_store();
  s.parts = {make_part("MOUNT", 30.0, 1)};
  s.slots = {make_slot("m", "MOUNT", "2", 1, SlotPosition::front)};
  const StoreReview r = review_store(s, UnitSystem::metric, {});
  const SlotFinding& f = finding(r, "m");
  CHECK(remedy(f, RemedyKind::truck_level_only));
  CHECK(remedy(f, RemedyKind::mechanical_aid));  // 30 kg is above the load constant of 23 kg (Waters et al. 1993)
  REQUIRE(r.part_decisions.size() == 1);
  CHECK_FALSE(r.part_decisions[0].hand);
  REQUIRE(r.family_decisions.size() == 1);
  CHECK(r.family_decisions[0].pick == FamilyDecision::Pick::truck);
}

TEST_CASE("Split the pack: the unit weight given gives LI 1.0 within 0.01", "[slotting]") {
  Store s = make_store();
  Part pack = make_part("BOLTS", 16.0, 2);
  pack.pack_pieces = 40;
  s.parts = {pack};
  s.slots = {make_slot("b", "BOLTS", "1", 1, SlotPosition::front)};
  const StoreReview r = review_store(s, UnitSystem::metric, {});
  const SlotFinding& f = finding(r, "b");
  const Remedy* split = remedy(f, RemedyKind::split_the_pack);
  REQUIRE(split);
  REQUIRE(split->number);
  const int n = std::stoi(split->target);
  // Recompute: a lift of the largest unit weight at n times the frequency, at the same slot.
  LiftTask t = f.lift.task;
  t.load = *split->number;
  t.frequency_per_min *= n;
  const TaskResult again = evaluate_task(t, DurationCategory::short_duration, UnitSystem::metric, RoundingMode::full);
  REQUIRE(again.li);
  CHECK_THAT(*again.li, WithinAbs(1.0, 0.01));
  // A single part (an impeller) is never told to split.
  s.parts[0].pack_pieces = 1;
  CHECK_FALSE(remedy(finding(review_store(s, UnitSystem::metric, {}), "b"), RemedyKind::split_the_pack));
}

TEST_CASE("Level limits equal the engine's RWL for the same geometry, box and frequency", "[slotting][limits]") {
  Store s = make_store();
  const StoreReview r = review_store(s, UnitSystem::metric, {});
  REQUIRE(r.level_limits.size() == 6);  // three levels, front and back
  const LevelLimit& l2 = r.level_limits[2];
  CHECK(l2.level_id == "2");
  CHECK(l2.position == SlotPosition::front);
  for (std::size_t k = 0; k < s.limit_frequencies_per_min.size(); ++k) {
    LiftTask t;
    t.id = "ref";
    t.load = 1.0;
    t.frequency_per_min = s.limit_frequencies_per_min[k];
    t.coupling = Coupling::fair;
    t.origin = {25.0 + 15.0, 60.0 + 12.5, 0.0};
    t.destination = {40.0, 90.0 + 12.5, 45.0};
    const TaskResult e = evaluate_task(t, DurationCategory::short_duration, UnitSystem::metric, RoundingMode::full);
    REQUIRE(l2.rwl[k]);
    CHECK_THAT(*l2.rwl[k], WithinAbs(e.origin.rwl, 1e-12));
  }
  // The back of a 60 cm shelf with a 30 cm deep box: H 70 cm, beyond the equation.
  CHECK_FALSE(r.level_limits[3].rwl[0].has_value());
}

TEST_CASE("Coupling class from the box and handhold (Applications Manual Table 6)", "[slotting][coupling]") {
  Part p = make_part("c", 5.0);
  p.coupling.reset();
  p.box = {35, 30, 25};
  CHECK(calc_coupling_class(p, UnitSystem::metric).coupling == Coupling::poor);  // no handhold: more stressful
  p.handhold = Handhold{HandholdKind::handles, true, false};
  CHECK(calc_coupling_class(p, UnitSystem::metric).coupling == Coupling::good);
  p.handhold = Handhold{HandholdKind::cutouts, false, false};
  CHECK(calc_coupling_class(p, UnitSystem::metric).coupling == Coupling::fair);
  p.handhold = Handhold{HandholdKind::none, false, true};
  CHECK(calc_coupling_class(p, UnitSystem::metric).coupling == Coupling::fair);
  p.box.width = 41;  // frontal length over 40 cm: a container of less than optimal design
  p.handhold = Handhold{HandholdKind::handles, true, false};
  CHECK(calc_coupling_class(p, UnitSystem::metric).coupling == Coupling::poor);
}

TEST_CASE("A route that looks fine slot by slot can load the picker: VLI above every slot's LI", "[slotting][route]") {
  Store s = make_store();
  s.kits_per_hour = 36.0;
  for (int i = 0; i < 6; ++i) {
    s.parts.push_back(make_part("P" + std::to_string(i), 8.0, 2));
    s.slots.push_back(make_slot("S" + std::to_string(i), "P" + std::to_string(i), i % 2 ? "2" : "1", 1 + i / 2,
                                SlotPosition::front));
  }
  Route route;
  route.id = "R1";
  for (const Slot& sl : s.slots) route.slots.push_back(sl.id);
  s.routes = {route};
  const StoreReview r = review_store(s, UnitSystem::metric, {});
  double worst_slot = 0.0;
  for (const auto& f : r.findings) worst_slot = std::max(worst_slot, *f.result.li);
  REQUIRE(r.routes.size() == 1);
  REQUIRE(r.routes[0].vli);
  CHECK(worst_slot <= 1.0);
  CHECK(*r.routes[0].vli > 1.0);
  CHECK(r.routes[0].contributions.size() == 6);
  CHECK(r.routes[0].contributions.front().contribution >= r.routes[0].contributions.back().contribution);
}
