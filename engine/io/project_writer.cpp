// SPDX-License-Identifier: MIT
// The project file writer: the inverse of the loader. What was defaulted stays out of the file (so it keeps its
// default); what the file gave is written back, in the file's units, in a fixed, readable key order.

#include <nlohmann/json.hpp>

#include "engine/io/project_file.hpp"

namespace rackreach {
namespace {

using ojson = nlohmann::ordered_json;

std::string clock(int minutes) {
  char buf[8];
  std::snprintf(buf, sizeof buf, "%02d:%02d", (minutes / 60) % 24, minutes % 60);
  return buf;
}

ojson pattern_json(const std::vector<WorkPeriod>& pattern) {
  ojson a = ojson::array();
  for (const WorkPeriod& w : pattern)
    a.push_back({{w.kind == WorkPeriod::Kind::lifting ? "lifting_min" : "recovery_min", w.minutes}});
  return a;
}

ojson limits_json(const LimitsOfApplication& l) {
  ojson o = ojson::object();
  auto b = [&](const char* k, const std::optional<bool>& v) {
    if (v) o[k] = *v;
  };
  auto d = [&](const char* k, const std::optional<double>& v) {
    if (v) o[k] = *v;
  };
  b("one_handed", l.one_handed);
  b("seated_or_kneeling", l.seated_or_kneeling);
  b("restricted_space", l.restricted_space);
  b("unstable_load", l.unstable_load);
  b("wheelbarrow_or_shovel", l.wheelbarrow_or_shovel);
  b("high_speed", l.high_speed);
  d("carry_push_share", l.carry_push_share);
  d("floor_friction", l.floor_friction);
  d("temperature_c", l.temperature_c);
  d("humidity_pct", l.humidity_pct);
  return o;
}

ojson point_json(const LiftPoint& p) { return {{"h", p.h}, {"v", p.v}, {"a", p.a_deg}}; }

ojson job_json(const LiftJob& job) {
  ojson j = {{"id", job.id}};
  if (job.name) j["name"] = *job.name;
  if (job.declared_duration) j["duration"] = std::string(duration_name(*job.declared_duration));
  else j["work_pattern"] = pattern_json(job.work_pattern);
  ojson tasks = ojson::array();
  for (std::size_t i = 0; i < job.tasks.size(); ++i) {
    const LiftTask& t = job.tasks[i];
    const TaskDetails details = i < job.details.size() ? job.details[i] : TaskDetails{};
    ojson o = {{"id", t.id}, {"load", t.load}};
    if (t.max_load) o["max_load"] = *t.max_load;
    if (const auto& s = details.frequency_sample)
      o["frequency_sample"] = {{"lifts_per_min", s->lifts_per_min}, {"lifting_min", s->lifting_min}, {"sample_min", s->sample_min}};
    else
      o["frequency"] = t.frequency_per_min;
    o["coupling"] = std::string(coupling_name(t.coupling));
    o["origin"] = point_json(t.origin);
    o["destination"] = point_json(t.destination);
    o["control_at_destination"] = t.control_at_destination;
    if (ojson l = limits_json(t.limits); !l.empty()) o["limits"] = l;
    if (const auto& sh = details.shelf) {
      ojson s = {{"grip_depth", sh->grip_depth}};
      if (sh->beam_underside) s["beam_underside"] = *sh->beam_underside;
      if (sh->overhead_structure) s["overhead_structure"] = *sh->overhead_structure;
      o["shelf"] = s;
    }
    tasks.push_back(std::move(o));
  }
  j["tasks"] = std::move(tasks);
  return j;
}

void put_sourced(ojson& o, const char* key, const SourcedValue& v) {
  if (v.source == ValueSource::file) o[key] = v.value;
}

void store_json(ojson& root, const Store& s, UnitSystem units) {
  if (s.shift) {
    ojson breaks = ojson::array();
    for (const Shift::Break& b : s.shift->breaks) breaks.push_back({{"start", clock(b.start_min)}, {"minutes", b.minutes}});
    root["shift"] = {{"start", clock(s.shift->start_min)}, {"end", clock(s.shift->end_min)}, {"breaks", breaks}};
  }
  if (s.kits_per_hour > 0.0) root["demand"] = {{"kits_per_hour", s.kits_per_hour}};
  if (!s.zones.empty()) {
    ojson zones = ojson::array();
    for (const Zone& z : s.zones) {
      ojson o = {{"id", z.id}};
      put_sourced(o, "standing_distance", z.standing_distance);
      put_sourced(o, "cart_deck_height", z.cart_deck_height);
      put_sourced(o, "cart_h", z.cart_h);
      put_sourced(o, "turn_angle", z.turn_angle_deg);
      put_sourced(o, "origin_angle", z.origin_angle_deg);
      if (z.control_at_destination) o["control_at_destination"] = true;
      if (z.lifting_pattern) o["lifting_pattern"] = pattern_json(*z.lifting_pattern);
      if (ojson l = limits_json(z.limits); !l.empty()) o["limits"] = l;
      zones.push_back(std::move(o));
    }
    root["zones"] = std::move(zones);
  }
  if (!s.racks.empty()) {
    ojson racks = ojson::array();
    for (const Rack& r : s.racks) {
      ojson levels = ojson::array();
      for (const Level& l : r.levels)
        levels.push_back({{"id", l.id},
                          {"surface_height", l.surface_height},
                          {"clear_height", l.clear_height},
                          {"access", l.access == LevelAccess::hand ? "hand" : "truck"}});
      racks.push_back({{"id", r.id},
                       {"kind", r.kind == RackKind::hand ? "hand" : r.kind == RackKind::truck ? "truck" : "mixed"},
                       {"zone", r.zone},
                       {"bay_width", r.bay_width},
                       {"shelf_depth", r.shelf_depth},
                       {"bays", r.bays},
                       {"levels", levels}});
    }
    root["racks"] = std::move(racks);
  }
  if (!s.parts.empty()) {
    ojson parts = ojson::array();
    for (const Part& p : s.parts) {
      ojson o = {{"id", p.id}, {"family", p.family}};
      if (!p.description.empty()) o["description"] = p.description;
      o["unit_weight"] = p.unit_weight;
      o["box"] = {{"width", p.box.width}, {"depth", p.box.depth}, {"height", p.box.height}};
      if (p.coupling) o["coupling"] = std::string(coupling_name(*p.coupling));
      if (p.handhold)
        o["handhold"] = {{"kind", p.handhold->kind == HandholdKind::handles   ? "handles"
                                  : p.handhold->kind == HandholdKind::cutouts ? "cutouts"
                                                                              : "none"},
                         {"optimal", p.handhold->optimal},
                         {"fingers_flex_90", p.handhold->fingers_flex_90}};
      o["pieces_per_kit"] = p.pieces_per_kit;
      o["pieces_per_grasp"] = p.pieces_per_grasp;
      if (p.pack_pieces > 1) o["pack_pieces"] = p.pack_pieces;
      if (p.truck_only) o["truck_only"] = true;
      if (p.grip_height) o["grip_height"] = *p.grip_height;
      parts.push_back(std::move(o));
    }
    root["parts"] = std::move(parts);
  }
  if (!s.slots.empty()) {
    ojson slots = ojson::array();
    for (const Slot& sl : s.slots) {
      ojson o = {{"id", sl.id}, {"part", sl.part}, {"rack", sl.rack}, {"level", sl.level}, {"bay", sl.bay},
                 {"position", sl.position == SlotPosition::front ? "front" : "back"}};
      if (sl.fixed) o["fixed"] = true;
      if (sl.origin_angle_deg) o["origin_angle"] = *sl.origin_angle_deg;
      if (sl.standing_distance) o["standing_distance"] = *sl.standing_distance;
      slots.push_back(std::move(o));
    }
    root["slots"] = std::move(slots);
  }
  if (!s.routes.empty()) {
    ojson routes = ojson::array();
    for (const Route& r : s.routes) {
      ojson o = {{"id", r.id}};
      if (!r.name.empty()) o["name"] = r.name;
      o["slots"] = r.slots;
      routes.push_back(std::move(o));
    }
    root["routes"] = std::move(routes);
  }
  if (!s.racks.empty()) {
    root["reference_box"] = {{"width", s.reference_box.box.width},
                             {"depth", s.reference_box.box.depth},
                             {"height", s.reference_box.box.height},
                             {"coupling", std::string(coupling_name(s.reference_box.coupling))}};
    root["limit_frequencies"] = s.limit_frequencies_per_min;
  }
  (void)units;
}

}  // namespace

std::string save_project_text(const Project& p) {
  ojson root = {{"rackreach", project_format_version}, {"units", std::string(unit_system_name(p.units))}};
  if (p.info.title) root["title"] = *p.info.title;
  if (p.info.site) root["site"] = *p.info.site;
  if (p.info.assessor) root["assessor"] = *p.info.assessor;
  if (p.info.date) root["date"] = *p.info.date;
  if (p.info.revision) root["revision"] = *p.info.revision;
  root["duration_rule"] = std::string(duration_rule_name(p.duration_rule));
  if (p.workforce_given)
    root["workforce"] = {{"population", p.workforce.population},
                         {"women", p.workforce.women_share},
                         {"small_percentile", p.workforce.small_percentile},
                         {"large_percentile", p.workforce.large_percentile}};
  if (!p.reach_parameters_set.empty()) {
    ojson rp = ojson::object();
    const ReachParameters& r = p.reach_parameters;
    auto length = [&](double cm) { return Length{cm, UnitSystem::metric}.in_units(p.units); };
    for (const std::string& name : p.reach_parameters_set) {
      if (name == "ankle_to_rack_face") rp[name] = length(r.ankle_to_rack_face_cm);
      else if (name == "footwear_allowance") rp[name] = length(r.footwear_allowance_cm);
      else if (name == "shoulder_ahead_of_ankles") rp[name] = length(r.shoulder_ahead_of_ankles_cm);
      else if (name == "hand_clearance_allowance") rp[name] = length(r.hand_clearance_allowance_cm);
      else if (name == "comfortable_reach_fraction") rp[name] = r.comfortable_reach_fraction;
    }
    root["reach_parameters"] = rp;
  }
  store_json(root, p.store, p.units);
  if (!p.jobs.empty()) {
    ojson jobs = ojson::array();
    for (const LiftJob& j : p.jobs) jobs.push_back(job_json(j));
    root["jobs"] = std::move(jobs);
  } else if (p.store.slots.empty()) {
    // Neither jobs nor slots: the file was a store whose slots are still to come (e.g. the base of an import),
    // which the loader accepts only with its empty "slots"; an empty "jobs" would not load again.
    root["slots"] = ojson::array();
  }
  return root.dump(2) + "\n";
}

}  // namespace rackreach
