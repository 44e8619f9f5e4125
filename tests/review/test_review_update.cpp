// SPDX-License-Identifier: MIT
// The slot review kept between edits must give exactly what a full review gives: after every edit of a part or
// a slot, StoreReviewer::update()'s result is compared with review_store() of the edited store, member by member
// (the review's types compare every field). The full review is the reference. Edits are drawn at random with a
// fixed seed: weights, demand, boxes, families, truck-only, packs; parts swapped between slots, a slot moved to
// a free place, a slot given another part. The generated store's numbers are invented (test input only).

#include <catch2/catch.hpp>

#include <random>
#include <set>
#include <sstream>

#include "anthropometry/data_dir.hpp"
#include "anthropometry/reach_setup.hpp"
#include "engine/assess.hpp"
#include "engine/io/project_file.hpp"

using namespace rackreach;

namespace {

/// Where the two reviews first differ, for the failure message.
std::string first_difference(const StoreReview& a, const StoreReview& b) {
  std::ostringstream out;
  if (a.findings.size() != b.findings.size())
    out << "findings: " << a.findings.size() << " vs " << b.findings.size();
  else
    for (std::size_t i = 0; i < a.findings.size(); ++i)
      if (!(a.findings[i] == b.findings[i])) {
        const SlotFinding &x = a.findings[i], &y = b.findings[i];
        out << "finding at rank " << i << ": slot " << x.slot_id << " vs " << y.slot_id;
        if (x.slot_id == y.slot_id)
          out << (x.lift == y.lift ? "" : " lift") << (x.result == y.result ? "" : " result")
              << (x.reach == y.reach ? "" : " reach") << (x.remedies == y.remedies ? "" : " remedies")
              << (x.warnings == y.warnings ? "" : " warnings") << (x.family == y.family ? "" : " family");
        break;
      }
  for (std::size_t i = 0; i < std::min(a.part_decisions.size(), b.part_decisions.size()); ++i)
    if (!(a.part_decisions[i] == b.part_decisions[i])) {
      out << "; part decision " << a.part_decisions[i].part_id << ": " << a.part_decisions[i].reason << " vs "
          << b.part_decisions[i].reason;
      break;
    }
  if (!(a.family_decisions == b.family_decisions)) out << "; family decisions";
  for (std::size_t i = 0; i < std::min(a.routes.size(), b.routes.size()); ++i)
    if (!(a.routes[i] == b.routes[i])) {
      out << "; route " << a.routes[i].id;
      break;
    }
  if (!(a.level_limits == b.level_limits)) out << "; level limits";
  if (!(a.warnings == b.warnings) || !(a.shift_duration == b.shift_duration)) out << "; store warnings";
  return out.str();
}

/// One random edit of `store`, applied in place, and what it touched.
std::vector<StoreEdit> random_edit(Store& store, UnitSystem units, std::mt19937_64& rng) {
  auto pick = [&](std::size_t n) { return std::uniform_int_distribution<std::size_t>(0, n - 1)(rng); };
  auto real = [&](double lo, double hi) { return std::uniform_real_distribution<double>(lo, hi)(rng); };
  const double len = units == UnitSystem::metric ? 1.0 : 1.0 / 2.54;
  const double mass = units == UnitSystem::metric ? 1.0 : 2.2;
  const int kind = static_cast<int>(pick(9));
  if (kind <= 4) {  // a part's own data
    const std::size_t p = pick(store.parts.size());
    Part& part = store.parts[p];
    switch (kind) {
      case 0:
        part.unit_weight = real(0.2, 30.0) * mass;
        break;
      case 1:
        part.pieces_per_kit = static_cast<double>(1 + pick(6));
        break;
      case 2:
        part.box.height = real(5.0, 40.0) * len;
        part.box.depth = real(10.0, 60.0) * len;
        break;
      case 3:
        part.family = store.parts[pick(store.parts.size())].family;
        break;
      case 4:
        part.truck_only = pick(5) == 0;
        part.pack_pieces = static_cast<int>(1 + pick(3));
        break;
    }
    return {{StoreEdit::Kind::part, p}};
  }
  const std::size_t a = pick(store.slots.size());
  if (kind <= 6) {  // parts swap between two slots
    std::size_t b = pick(store.slots.size());
    if (b == a) b = (a + 1) % store.slots.size();
    std::swap(store.slots[a].part, store.slots[b].part);
    return {{StoreEdit::Kind::slot, a}, {StoreEdit::Kind::slot, b}};
  }
  if (kind == 7) {  // another part in this slot
    store.slots[a].part = store.parts[pick(store.parts.size())].id;
    return {{StoreEdit::Kind::slot, a}};
  }
  // The slot moves to a free place of a random rack (levels of every access).
  std::set<std::tuple<std::string, std::string, int, int>> taken;
  for (const Slot& s : store.slots) taken.emplace(s.rack, s.level, s.bay, static_cast<int>(s.position));
  const Rack& rack = store.racks[pick(store.racks.size())];
  const Level& level = rack.levels[pick(rack.levels.size())];
  const int bay = static_cast<int>(1 + pick(static_cast<std::size_t>(rack.bays)));
  const SlotPosition pos = pick(2) ? SlotPosition::front : SlotPosition::back;
  if (taken.count({rack.id, level.id, bay, static_cast<int>(pos)})) return {};
  Slot& s = store.slots[a];
  s.rack = rack.id, s.level = level.id, s.bay = bay, s.position = pos;
  return {{StoreEdit::Kind::slot, a}};
}

/// Runs `edits` random edits on `project`'s store, comparing the kept review with a full one after each.
void check_random_edits(Project project, int edits, std::uint64_t seed) {
  AssessOptions options;
  std::optional<LoadedReachSetup> reach;
  if (project.has_shelf_geometry()) {
    reach = load_reach_setup(project);
    REQUIRE(reach->setup);
    options.reach = reach->setup;
  }
  const ReviewOptions ro = make_review_options(options, project.duration_rule);
  Store& store = project.store;
  StoreReviewer reviewer(project.units, ro);
  StoreReview kept = reviewer.review(store);
  REQUIRE(kept == review_store(store, project.units, ro));
  std::mt19937_64 rng(seed);
  std::size_t evaluated = 0;
  for (int i = 0; i < edits; ++i) {
    const std::vector<StoreEdit> e = random_edit(store, project.units, rng);
    reviewer.update(kept, store, e);
    evaluated += reviewer.last_slots_evaluated();
    const StoreReview full = review_store(store, project.units, ro);
    INFO("edit " << i << ": " << first_difference(kept, full));
    REQUIRE(kept == full);
  }
  // The kept review did evaluate less than the whole store each time (else this test proves nothing about it).
  CHECK(evaluated < static_cast<std::size_t>(edits) * store.slots.size() / 2);
}

Project load_demo() {
  LoadResult r = load_project_file(std::string(RACKREACH_SOURCE_DIR) + "/sample_tasks/kitting-store.rackreach.json");
  REQUIRE(r.project);
  return std::move(*r.project);
}

/// A store of `racks` hand racks and as many mixed racks (a truck level on top), two zones, parts in families of
/// five, one part per slot, and routes of twelve slots.
Project make_store(int racks, std::uint64_t seed) {
  std::mt19937_64 rng(seed);
  auto real = [&](double lo, double hi) { return std::uniform_real_distribution<double>(lo, hi)(rng); };
  Project p;
  p.units = UnitSystem::metric;
  Store& s = p.store;
  s.shift = Shift{};
  s.shift->breaks.push_back({10 * 60, 30.0});
  s.kits_per_hour = 10.0;
  for (const char* id : {"Z1", "Z2"}) {
    Zone z;
    z.id = id;
    z.standing_distance = {id[1] == '1' ? 25.0 : 35.0, ValueSource::file};
    z.cart_deck_height = {90.0, ValueSource::file};
    z.cart_h = {40.0, ValueSource::file};
    z.turn_angle_deg = {id[1] == '1' ? 45.0 : 90.0, ValueSource::file};
    z.origin_angle_deg = {0.0, ValueSource::built_in_default};
    if (id[1] == '2')
      z.lifting_pattern = std::vector<WorkPeriod>{
          {WorkPeriod::Kind::lifting, 50.0}, {WorkPeriod::Kind::recovery, 60.0}, {WorkPeriod::Kind::lifting, 50.0}};
    s.zones.push_back(z);
  }
  for (int r = 0; r < 2 * racks; ++r) {
    Rack rack;
    rack.id = "R" + std::to_string(r);
    rack.kind = r % 2 ? RackKind::mixed : RackKind::hand;
    rack.zone = r % 3 ? "Z1" : "Z2";
    rack.bay_width = 120.0;
    rack.shelf_depth = r % 4 < 2 ? 60.0 : 90.0;
    rack.bays = 3;
    for (int l = 0; l < 4; ++l)
      rack.levels.push_back({std::to_string(l + 1), 5.0 + 50.0 * l, 45.0,
                             rack.kind == RackKind::mixed && l == 3 ? LevelAccess::truck : LevelAccess::hand});
    s.racks.push_back(rack);
  }
  int n = 0;
  for (const Rack& rack : s.racks)
    for (const Level& l : rack.levels)
      for (int b = 1; b <= rack.bays; ++b)
        for (SlotPosition pos : {SlotPosition::front, SlotPosition::back}) {
          Part part;
          part.id = "P" + std::to_string(n);
          part.family = "F" + std::to_string(n / 5);
          part.unit_weight = real(0.3, 25.0);
          part.box = {real(10.0, 45.0), real(10.0, 45.0), real(8.0, 40.0)};
          part.handhold = Handhold{n % 3 == 0   ? HandholdKind::handles
                                   : n % 3 == 1 ? HandholdKind::cutouts
                                                : HandholdKind::none,
                                   n % 2 == 0, n % 4 == 0};
          part.pieces_per_kit = 1.0 + n % 3;
          part.pack_pieces = n % 7 == 0 ? 10 : 1;
          s.parts.push_back(part);
          Slot slot;
          slot.id = "S" + std::to_string(n);
          slot.part = part.id;
          slot.rack = rack.id;
          slot.level = l.id;
          slot.bay = b;
          slot.position = pos;
          s.slots.push_back(slot);
          ++n;
        }
  for (int r = 0; r + 12 <= n; r += 40) {
    Route route;
    route.id = "RT" + std::to_string(r);
    for (int k = 0; k < 12; ++k) route.slots.push_back("S" + std::to_string(r + 3 * k));
    s.routes.push_back(route);
  }
  return p;
}

}  // namespace

TEST_CASE("The kept review equals the full review after every random edit of the demo store", "[review][update]") {
  check_random_edits(load_demo(), 250, 20261202u);
}

TEST_CASE("The kept review equals the full review after every random edit of a larger store", "[review][update]") {
  const Project p = make_store(20, 7u);  // 40 racks, 960 slots
  REQUIRE(p.store.slots.size() == 960);
  check_random_edits(p, 120, 99u);
}

TEST_CASE("An edit the kept review cannot follow gives the full review", "[review][update]") {
  Project p = load_demo();
  LoadedReachSetup reach = load_reach_setup(p);
  AssessOptions options;
  options.reach = reach.setup;
  const ReviewOptions ro = make_review_options(options, p.duration_rule);
  StoreReviewer reviewer(p.units, ro);
  StoreReview kept = reviewer.review(p.store);
  // A renamed part: its slots must follow, which only a full review does.
  const std::string old_id = p.store.parts[0].id;
  p.store.parts[0].id = "renamed";
  for (Slot& s : p.store.slots)
    if (s.part == old_id) s.part = "renamed";
  reviewer.update(kept, p.store, {{StoreEdit::Kind::part, 0}});
  CHECK(reviewer.last_slots_evaluated() == p.store.slots.size());
  CHECK(kept == review_store(p.store, p.units, ro));
  // A removed slot (the store's size changed), told as a slot edit.
  p.store.slots.pop_back();
  for (Route& r : p.store.routes)
    std::erase_if(r.slots, [&](const std::string& id) {
      for (const Slot& s : p.store.slots)
        if (s.id == id) return false;
      return true;
    });
  reviewer.update(kept, p.store, {{StoreEdit::Kind::slot, 0}});
  CHECK(kept == review_store(p.store, p.units, ro));
  // One part edit re-evaluates only that part's slots.
  p.store.parts[1].unit_weight *= 1.5;
  reviewer.update(kept, p.store, {{StoreEdit::Kind::part, 1}});
  std::size_t slots_of_part = 0;
  for (const Slot& s : p.store.slots) slots_of_part += s.part == p.store.parts[1].id;
  CHECK(reviewer.last_slots_evaluated() == slots_of_part);
  CHECK(kept == review_store(p.store, p.units, ro));
}
