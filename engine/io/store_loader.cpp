// SPDX-License-Identifier: MIT
#include "engine/io/store_loader.hpp"

#include "engine/io/input_limits.hpp"
#include "engine/io/shared_readers.hpp"

#include <map>
#include <set>
#include <tuple>
#include <unordered_map>

namespace rackreach {
namespace {

using nlohmann::json;
namespace lim = input_limits;

/// "06:30" -> 390 minutes after midnight.
std::optional<int> parse_clock(const std::string& s) {
  if (s.size() != 5 || s[2] != ':') return std::nullopt;
  for (int i : {0, 1, 3, 4})
    if (s[i] < '0' || s[i] > '9') return std::nullopt;
  const int h = (s[0] - '0') * 10 + (s[1] - '0');
  const int m = (s[3] - '0') * 10 + (s[4] - '0');
  if (h > 23 || m > 59) return std::nullopt;
  return h * 60 + m;
}

}  // namespace

class StoreReader::Impl {
 public:
  Impl(JsonReader& r, std::vector<Problem>& problems) : r_(r), problems_(problems) { set_units(UnitSystem::metric); }

  void set_units(UnitSystem u) {
    units_ = u;
    len_ = length_unit(u);
    mass_ = mass_unit(u);
  }

  void add(std::string_view key, const json& j, std::size_t index, Store& s) {
    const JsonPath root;
    const JsonPath array_path(root, key);
    const JsonPath p(array_path, index);
    r_.set_context("");
    const std::size_t max = key == "zones"   ? lim::max_zones
                            : key == "racks" ? lim::max_racks
                            : key == "parts" ? lim::max_parts
                            : key == "slots" ? lim::max_slots
                                             : lim::max_routes;
    if (!r_.streamed_within(array_path, index, max, key)) return;
    if (key == "zones") load_zone(j, p, s);
    else if (key == "racks") load_rack(j, p, s);
    else if (key == "parts") load_part(j, p, s);
    else if (key == "slots") load_slot(j, p, s);
    else if (key == "routes") load_route(j, p, s);
    r_.set_context("");
  }

  void load(const json& doc, Store& s) {
    const JsonPath root;
    if (const json* j = r_.member(doc, root, "shift", false)) s.shift = load_shift(*j, JsonPath(root, "shift"));
    if (const json* j = r_.member(doc, root, "demand", false)) {
      const JsonPath p(root, "demand");
      if (r_.object(*j, p, {"kits_per_hour"}))
        s.kits_per_hour = r_.number(*j, p, "kits_per_hour", true,
                                    {0.0, lim::max_kits_per_hour, true, false, "kits/h", lim::plausibility_note}).value_or(0.0);
    }
    // Arrays the parser handed over element by element are empty here; the others (or a wrong type) are read now.
    for (const char* key : {"zones", "racks", "parts", "slots", "routes"})
      if (const json* j = r_.member(doc, root, key, false))
        if (r_.array(*j, JsonPath(root, key), 0, key))
          for (std::size_t i = 0; i < j->size(); ++i) add(key, (*j)[i], i, s);
    if (const json* j = r_.member(doc, root, "reference_box", false))
      load_reference_box(*j, JsonPath(root, "reference_box"), s);
    if (const json* j = r_.member(doc, root, "limit_frequencies", false)) {
      const JsonPath p(root, "limit_frequencies");
      if (r_.array(*j, p, 1, "frequencies") && r_.at_most(*j, p, lim::max_limit_frequencies, "frequencies")) {
        s.limit_frequencies_per_min.clear();
        for (std::size_t i = 0; i < j->size(); ++i) {
          const json& f = (*j)[i];
          if (!f.is_number() || !(f.get<double>() > 0.0) || f.get<double>() > 20.0)
            r_.add("out_of_range", JsonPath(p, i), &f, "must be a number greater than 0 to 20 lifts/min");
          else
            s.limit_frequencies_per_min.push_back(f.get<double>());
        }
      }
    }
    if (!s.slots.empty() && s.kits_per_hour <= 0.0 && !doc.contains("demand"))
      r_.add("missing_key", JsonPath(root, "demand"), nullptr, "is required when the file has slots (kits_per_hour)");
    check_references(s);
  }

 private:
  std::optional<double> length(const json& j, const JsonPath& p, const char* key, bool required, double min,
                               bool min_exclusive, double max_cm) {
    const double max = Length{max_cm, UnitSystem::metric}.in_units(units_);
    return r_.number(j, p, key, required, {min, max, min_exclusive, false, len_, lim::plausibility_note});
  }

  std::optional<Shift> load_shift(const json& j, const JsonPath& p) {
    if (!r_.object(j, p, {"start", "end", "breaks"})) return std::nullopt;
    Shift sh;
    auto clock = [&](const json& obj, const JsonPath& at, const char* key) -> std::optional<int> {
      auto s = r_.string(obj, at, key, true);
      if (!s) return std::nullopt;
      auto t = parse_clock(*s);
      if (!t) r_.add("invalid_value", JsonPath(at, key), &obj.at(key), "must be a time of day written HH:MM (24 h)");
      return t;
    };
    const auto start = clock(j, p, "start");
    const auto end = clock(j, p, "end");
    if (!start || !end) return std::nullopt;
    sh.start_min = *start;
    sh.end_min = *end;
    if (*start == *end) r_.add("invalid_value", JsonPath(p, "end"), &j.at("end"), "must differ from the start");
    if (const json* b = r_.member(j, p, "breaks", false)) {
      const JsonPath bp(p, "breaks");
      if (r_.array(*b, bp, 0, "breaks") && r_.at_most(*b, bp, lim::max_breaks, "breaks"))
        for (std::size_t i = 0; i < b->size(); ++i) {
          const JsonPath ip(bp, i);
          if (!r_.object((*b)[i], ip, {"start", "minutes"})) continue;
          const auto t = clock((*b)[i], ip, "start");
          const auto m = r_.number((*b)[i], ip, "minutes", true, {0.0, 600.0, true, false, "min"});
          if (t && m) sh.breaks.push_back({*t, *m});
        }
    }
    // Breaks must fall inside the shift and not overlap.
    const std::vector<WorkPeriod> pattern = sh.work_pattern();
    double total = 0.0;
    for (const WorkPeriod& w : pattern) total += w.minutes;
    if (total > sh.length_min() + 1e-9)
      r_.add("invalid_value", JsonPath(p, "breaks"), nullptr, "breaks must lie inside the shift and not overlap");
    return sh;
  }

  SourcedValue sourced(const json& j, const JsonPath& p, const char* key, double default_cm_or_deg, bool is_length,
                       double max) {
    const double def = is_length ? Length{default_cm_or_deg, UnitSystem::metric}.in_units(units_) : default_cm_or_deg;
    std::optional<double> v = is_length ? length(j, p, key, false, 0.0, false, max)
                                        : r_.number(j, p, key, false, {0.0, max, false, false, "deg"});
    return v ? SourcedValue{*v, ValueSource::file} : SourcedValue{def, ValueSource::built_in_default};
  }

  void load_zone(const json& j, const JsonPath& p, Store& s) {
    if (!r_.object(j, p,
                   {"id", "standing_distance", "cart_deck_height", "cart_h", "turn_angle", "origin_angle",
                    "control_at_destination", "lifting_pattern", "limits"}))
      return;
    Zone z;
    z.id = r_.string(j, p, "id", true).value_or("");
    r_.set_context("zone \"" + z.id + "\"");
    z.standing_distance = sourced(j, p, "standing_distance", ZoneDefaults::standing_distance_cm, true,
                                  lim::max_standing_distance_cm);
    z.cart_deck_height = sourced(j, p, "cart_deck_height", ZoneDefaults::cart_deck_height_cm, true, 175.0);  // the equation's V domain
    z.cart_h = sourced(j, p, "cart_h", ZoneDefaults::cart_h_cm, true, lim::max_standing_distance_cm);
    z.turn_angle_deg = sourced(j, p, "turn_angle", ZoneDefaults::turn_angle_deg, false, 180.0);
    z.origin_angle_deg = sourced(j, p, "origin_angle", ZoneDefaults::origin_angle_deg, false, 180.0);
    z.control_at_destination = r_.boolean(j, p, "control_at_destination", false).value_or(false);
    if (const json* lp = r_.member(j, p, "lifting_pattern", false))
      z.lifting_pattern = read_work_pattern(r_, *lp, JsonPath(p, "lifting_pattern"));
    if (const json* l = r_.member(j, p, "limits", false)) z.limits = read_limits(r_, *l, JsonPath(p, "limits"));
    if (!z.id.empty() && !zone_ids_.insert(z.id).second)
      r_.add("duplicate_id", JsonPath(p, "id"), &j.at("id"), "zone ids must be unique");
    s.zones.push_back(std::move(z));
  }

  void load_rack(const json& j, const JsonPath& p, Store& s) {
    if (!r_.object(j, p, {"id", "kind", "zone", "bay_width", "shelf_depth", "bays", "levels"})) return;
    Rack rack;
    rack.id = r_.string(j, p, "id", true).value_or("");
    r_.set_context("rack \"" + rack.id + "\"");
    if (auto k = r_.choice(j, p, "kind", true, {"hand", "truck", "mixed"}))
      rack.kind = *k == "hand" ? RackKind::hand : *k == "truck" ? RackKind::truck : RackKind::mixed;
    rack.zone = r_.string(j, p, "zone", true).value_or("");
    rack.bay_width = length(j, p, "bay_width", true, 0.0, true, lim::max_bay_width_cm).value_or(0.0);
    rack.shelf_depth = length(j, p, "shelf_depth", true, 0.0, true, lim::max_shelf_depth_cm).value_or(0.0);
    if (const json* b = r_.member(j, p, "bays", true)) {
      if (!b->is_number_integer() || b->get<long long>() < 1 || b->get<long long>() > lim::max_bays)
        r_.add("out_of_range", JsonPath(p, "bays"), b,
               "must be a whole number from 1 to " + std::to_string(lim::max_bays) + std::string(lim::plausibility_note));
      else
        rack.bays = b->get<int>();
    }
    if (const json* lv = r_.member(j, p, "levels", true)) {
      const JsonPath lp(p, "levels");
      if (r_.array(*lv, lp, 1, "levels") && r_.at_most(*lv, lp, lim::max_levels_per_rack, "levels")) {
        std::set<std::string> ids;
        double previous_top = -1.0;
        for (std::size_t i = 0; i < lv->size(); ++i) {
          const JsonPath ip(lp, i);
          const json& l = (*lv)[i];
          if (!r_.object(l, ip, {"id", "surface_height", "clear_height", "access"})) continue;
          Level level;
          level.id = r_.string(l, ip, "id", true).value_or("");
          level.surface_height = length(l, ip, "surface_height", true, 0.0, false, lim::max_height_cm).value_or(0.0);
          level.clear_height = length(l, ip, "clear_height", true, 0.0, true, lim::max_clear_height_cm).value_or(0.0);
          const auto access = r_.choice(l, ip, "access", false, {"hand", "truck"});
          level.access = access ? (*access == "hand" ? LevelAccess::hand : LevelAccess::truck)
                                : (rack.kind == RackKind::truck ? LevelAccess::truck : LevelAccess::hand);
          if (access && rack.kind != RackKind::mixed &&
              (level.access == LevelAccess::hand) != (rack.kind == RackKind::hand))
            r_.add("invalid_value", JsonPath(ip, "access"), &l.at("access"),
                   "must match the rack's kind (" + std::string(rack.kind == RackKind::hand ? "hand" : "truck") +
                       "); use kind \"mixed\" for a rack with both");
          if (!level.id.empty() && !ids.insert(level.id).second)
            r_.add("duplicate_id", JsonPath(ip, "id"), &l.at("id"), "level ids must be unique within a rack");
          if (level.surface_height < previous_top - 1e-9)
            r_.add("out_of_range", JsonPath(ip, "surface_height"), l.contains("surface_height") ? &l.at("surface_height") : nullptr,
                   "levels are listed from the floor up and must not overlap: at least the level below's surface "
                   "plus its clear height");
          previous_top = level.surface_height + level.clear_height;
          rack.levels.push_back(std::move(level));
        }
      }
    }
    if (!rack.id.empty() && !rack_ids_.insert(rack.id).second)
      r_.add("duplicate_id", JsonPath(p, "id"), &j.at("id"), "rack ids must be unique");
    rack_paths_.push_back(p.str());
    s.racks.push_back(std::move(rack));
  }

  void load_part(const json& j, const JsonPath& p, Store& s) {
    if (!r_.object(j, p,
                   {"id", "family", "description", "unit_weight", "box", "coupling", "handhold", "pieces_per_kit",
                    "pieces_per_grasp", "pack_pieces", "truck_only", "grip_height"}))
      return;
    Part part;
    part.id = r_.string(j, p, "id", true).value_or("");
    r_.set_context("part \"" + part.id + "\"");
    part.family = r_.string(j, p, "family", true).value_or("");
    part.description = r_.string(j, p, "description", false, false).value_or("");
    part.unit_weight = r_.number(j, p, "unit_weight", true, {0.0, Mass{lim::max_mass_kg, UnitSystem::metric}.in_units(units_),
                                                              true, false, mass_, lim::plausibility_note})
                           .value_or(0.0);
    if (const json* b = r_.member(j, p, "box", true)) {
      const JsonPath bp(p, "box");
      if (r_.object(*b, bp, {"width", "depth", "height"})) {
        part.box.width = length(*b, bp, "width", true, 0.0, true, lim::max_box_side_cm).value_or(0.0);
        part.box.depth = length(*b, bp, "depth", true, 0.0, true, lim::max_box_side_cm).value_or(0.0);
        part.box.height = length(*b, bp, "height", true, 0.0, true, lim::max_box_side_cm).value_or(0.0);
      }
    }
    const json* c = r_.member(j, p, "coupling", false);
    const json* h = r_.member(j, p, "handhold", false);
    if (c && h) r_.add("invalid_value", JsonPath(p, "handhold"), nullptr, "give either coupling or handhold, not both");
    if (c) {
      if (auto cc = r_.choice(j, p, "coupling", true, {"good", "fair", "poor"})) part.coupling = find_coupling(*cc);
    } else if (h) {
      const JsonPath hp(p, "handhold");
      if (r_.object(*h, hp, {"kind", "optimal", "fingers_flex_90"})) {
        Handhold hh;
        if (auto k = r_.choice(*h, hp, "kind", true, {"handles", "cutouts", "none"}))
          hh.kind = *k == "handles" ? HandholdKind::handles : *k == "cutouts" ? HandholdKind::cutouts : HandholdKind::none;
        hh.optimal = r_.boolean(*h, hp, "optimal", false).value_or(false);
        hh.fingers_flex_90 = r_.boolean(*h, hp, "fingers_flex_90", false).value_or(false);
        part.handhold = hh;
      }
    }
    part.pieces_per_kit = r_.number(j, p, "pieces_per_kit", false, {0.0, lim::max_pieces, true, false, "", lim::plausibility_note}).value_or(1.0);
    part.pieces_per_grasp = r_.number(j, p, "pieces_per_grasp", false,
                                      {0.0, lim::max_pieces, true, false, "", lim::plausibility_note}).value_or(1.0);
    if (const json* pp = r_.member(j, p, "pack_pieces", false)) {
      if (!pp->is_number_integer() || pp->get<long long>() < 1 || pp->get<long long>() > lim::max_pack_pieces)
        r_.add("out_of_range", JsonPath(p, "pack_pieces"), pp,
               "must be a whole number from 1 to " + std::to_string(lim::max_pack_pieces) +
                   std::string(lim::plausibility_note));
      else
        part.pack_pieces = pp->get<int>();
    }
    part.truck_only = r_.boolean(j, p, "truck_only", false).value_or(false);
    part.grip_height = r_.number(j, p, "grip_height", false, {0.0, part.box.height > 0 ? part.box.height : 1e9, false,
                                                               false, len_});
    if (!part.id.empty() && !part_ids_.insert(part.id).second)
      r_.add("duplicate_id", JsonPath(p, "id"), &j.at("id"), "part ids must be unique");
    s.parts.push_back(std::move(part));
  }

  void load_slot(const json& j, const JsonPath& p, Store& s) {
    if (!r_.object(j, p, {"id", "part", "rack", "level", "bay", "position", "fixed", "origin_angle", "standing_distance"}))
      return;
    Slot slot;
    slot.id = r_.string(j, p, "id", true).value_or("");
    r_.set_context("slot \"" + slot.id + "\"");
    slot.part = r_.string(j, p, "part", true).value_or("");
    slot.rack = r_.string(j, p, "rack", true).value_or("");
    slot.level = r_.string(j, p, "level", true).value_or("");
    if (const json* b = r_.member(j, p, "bay", true)) {
      if (!b->is_number_integer() || b->get<long long>() < 1)
        r_.add("out_of_range", JsonPath(p, "bay"), b, "must be a whole number of at least 1");
      else
        slot.bay = static_cast<int>(std::min<long long>(b->get<long long>(), 1000000));
    }
    if (auto pos = r_.choice(j, p, "position", false, {"front", "back"}))
      slot.position = *pos == "front" ? SlotPosition::front : SlotPosition::back;
    slot.fixed = r_.boolean(j, p, "fixed", false).value_or(false);
    slot.origin_angle_deg = r_.number(j, p, "origin_angle", false, {0.0, 180.0, false, false, "deg"});
    slot.standing_distance = length(j, p, "standing_distance", false, 0.0, false, lim::max_standing_distance_cm);
    if (!slot.id.empty() && !slot_ids_.insert(slot.id).second)
      r_.add("duplicate_id", JsonPath(p, "id"), &j.at("id"), "slot ids must be unique");
    slot_paths_.push_back(p.str());
    s.slots.push_back(std::move(slot));
  }

  void load_route(const json& j, const JsonPath& p, Store& s) {
    if (!r_.object(j, p, {"id", "name", "slots"})) return;
    Route route;
    route.id = r_.string(j, p, "id", true).value_or("");
    r_.set_context("route \"" + route.id + "\"");
    route.name = r_.string(j, p, "name", false, false).value_or("");
    if (const json* sl = r_.member(j, p, "slots", true)) {
      const JsonPath sp(p, "slots");
      if (r_.array(*sl, sp, 1, "slots") && r_.at_most(*sl, sp, lim::max_slots_per_route, "slots"))
        for (std::size_t i = 0; i < sl->size(); ++i) {
          if (!(*sl)[i].is_string()) {
            r_.add("wrong_type", JsonPath(sp, i), &(*sl)[i], "must be a slot id (a string)");
            continue;
          }
          route.slots.push_back((*sl)[i].get<std::string>());
        }
    }
    route_paths_.push_back(p.str());
    s.routes.push_back(std::move(route));
  }

  void load_reference_box(const json& j, const JsonPath& p, Store& s) {
    if (!r_.object(j, p, {"width", "depth", "height", "coupling"})) return;
    s.reference_box.box.width = length(j, p, "width", true, 0.0, true, lim::max_box_side_cm).value_or(0.0);
    s.reference_box.box.depth = length(j, p, "depth", true, 0.0, true, lim::max_box_side_cm).value_or(0.0);
    s.reference_box.box.height = length(j, p, "height", true, 0.0, true, lim::max_box_side_cm).value_or(0.0);
    if (auto c = r_.choice(j, p, "coupling", true, {"good", "fair", "poor"})) s.reference_box.coupling = *find_coupling(*c);
    reference_box_given_ = true;
  }

  void cross_problem(const std::string& path, const std::string& value, const std::string& rule, const std::string& ctx) {
    problems_.push_back({"unknown_reference", path, value, rule, ctx});
  }

  void check_references(Store& s) {
    if (!reference_box_given_) {
      // Our default reference box for the level limits: 30 x 30 x 25 cm, fair coupling (stated in the output).
      s.reference_box.box = {Length{30.0, UnitSystem::metric}.in_units(units_),
                             Length{30.0, UnitSystem::metric}.in_units(units_),
                             Length{25.0, UnitSystem::metric}.in_units(units_)};
      s.reference_box.coupling = Coupling::fair;
    }
    std::unordered_map<std::string, const Rack*> racks;
    for (const Rack& r : s.racks) racks.emplace(r.id, &r);
    for (std::size_t i = 0; i < s.racks.size(); ++i) {
      const Rack& r = s.racks[i];
      if (!r.zone.empty() && !zone_ids_.count(r.zone))
        cross_problem(rack_paths_[i] + ".zone", "\"" + r.zone + "\"",
                      "names no zone of the file (zones: " + list(zone_ids_) + ")", "rack \"" + r.id + "\"");
    }
    std::map<std::tuple<std::string, std::string, int, int>, std::string> occupied;
    for (std::size_t i = 0; i < s.slots.size(); ++i) {
      const Slot& sl = s.slots[i];
      const std::string ctx = "slot \"" + sl.id + "\"";
      if (!sl.part.empty() && !part_ids_.count(sl.part))
        cross_problem(slot_paths_[i] + ".part", "\"" + sl.part + "\"", "names no part of the file", ctx);
      auto rack = racks.find(sl.rack);
      if (rack == racks.end()) {
        if (!sl.rack.empty()) cross_problem(slot_paths_[i] + ".rack", "\"" + sl.rack + "\"", "names no rack of the file", ctx);
        continue;
      }
      const Rack& r = *rack->second;
      if (!sl.level.empty() && !s.find_level(r, sl.level)) {
        std::string levels;
        for (const Level& l : r.levels) levels += (levels.empty() ? "" : ", ") + l.id;
        cross_problem(slot_paths_[i] + ".level", "\"" + sl.level + "\"",
                      "names no level of rack \"" + r.id + "\" (its levels: " + levels + ")", ctx);
      }
      if (sl.bay > r.bays)
        problems_.push_back({"out_of_range", slot_paths_[i] + ".bay", std::to_string(sl.bay),
                             "rack \"" + r.id + "\" has " + std::to_string(r.bays) + " bays", ctx});
      auto key = std::make_tuple(sl.rack, sl.level, sl.bay, static_cast<int>(sl.position));
      auto [it, fresh] = occupied.emplace(key, sl.id);
      if (!fresh)
        problems_.push_back({"duplicate_location", slot_paths_[i], "\"" + sl.id + "\"",
                             "slot \"" + it->second + "\" already holds this rack, level, bay and position", ctx});
    }
    for (std::size_t i = 0; i < s.routes.size(); ++i)
      for (std::size_t k = 0; k < s.routes[i].slots.size(); ++k)
        if (!slot_ids_.count(s.routes[i].slots[k]))
          cross_problem(route_paths_[i] + ".slots[" + std::to_string(k) + "]", "\"" + s.routes[i].slots[k] + "\"",
                        "names no slot of the file", "route \"" + s.routes[i].id + "\"");
  }

  static std::string list(const std::set<std::string>& ids) {
    std::string out;
    for (const auto& id : ids) out += (out.empty() ? "" : ", ") + id;
    return out.empty() ? "none" : out;
  }

  JsonReader& r_;
  std::vector<Problem>& problems_;
  UnitSystem units_ = UnitSystem::metric;
  std::string_view len_, mass_;
  std::set<std::string> zone_ids_, rack_ids_, part_ids_, slot_ids_;
  std::vector<std::string> rack_paths_, slot_paths_, route_paths_;
  bool reference_box_given_ = false;
};

StoreReader::StoreReader(JsonReader& r, std::vector<Problem>& problems) : impl_(std::make_unique<Impl>(r, problems)) {}
StoreReader::~StoreReader() = default;

void StoreReader::set_units(UnitSystem u) { impl_->set_units(u); }

bool StoreReader::streams(std::string_view root_key) {
  for (const char* k : {"zones", "racks", "parts", "slots", "routes"})
    if (root_key == k) return true;
  return false;
}

void StoreReader::add(std::string_view root_key, const json& element, std::size_t index) {
  impl_->add(root_key, element, index, store_);
}

void StoreReader::finish(const json& doc, UnitSystem units, Store& store) {
  impl_->set_units(units);
  impl_->load(doc, store_);
  store = std::move(store_);
}

}  // namespace rackreach
