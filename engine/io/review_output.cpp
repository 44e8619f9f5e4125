// SPDX-License-Identifier: MIT
#include "engine/io/review_output.hpp"

#include <algorithm>
#include <cstdio>

#include "engine/caution.hpp"
#include "engine/io/assessment_output.hpp"
#include "engine/io/text_columns.hpp"
#include "engine/version.hpp"

namespace rackreach {
namespace {

using text::fixed;
using text::html_escape;
using text::pad_left;
using text::pad_right;
std::string ofixed(const std::optional<double>& x, int decimals) { return text::fixed_or_dash(x, decimals); }
const char* position_name(SlotPosition p) { return p == SlotPosition::front ? "front" : "back"; }
const char* family_pick_name(FamilyDecision::Pick p) {
  return p == FamilyDecision::Pick::hand ? "hand" : p == FamilyDecision::Pick::truck ? "truck" : "split";
}

std::string remedies_text(const SlotFinding& f) {
  std::string s;
  for (const Remedy& r : f.remedies) s += (s.empty() ? "" : "; ") + std::string(remedy_name(r.kind));
  return s.empty() ? "-" : s;
}

std::string reach_text(const SlotFinding& f) {
  if (!f.reach) return "-";
  if (const ReachCheck* c = f.reach->find_worst_failure()) return c->code + " " + fixed(c->margin_cm, 1) + " cm";
  return "ok " + fixed(f.reach->small_max_reach_margin_cm, 1) + " cm";
}

void write_point_short(JsonWriter& w, const PointResult& p) {
  w.begin_object();
  w.field("hm", p.hm.value).field("vm", p.vm.value).field("dm", p.dm.value).field("am", p.am.value);
  w.field("fm", p.fm.value).field("cm", p.cm.value).field("rwl", p.rwl).field("firwl", p.firwl);
  w.field("strwl", p.strwl).field("li", p.li).field("fili", p.fili).field("stli", p.stli);
  w.end_object();
}

}  // namespace

void write_review_json(JsonWriter& w, const Project& project, const StoreReview& rv, RoundingMode) {
  const UnitSystem u = project.units;
  const Store& s = project.store;
  w.begin_object();
  w.key("shift").begin_object();
  if (s.shift) {
    w.field("length_min", s.shift->length_min()).field("breaks", static_cast<int>(s.shift->breaks.size()));
  } else {
    w.field("given", false);
  }
  w.field("duration", rv.shift_duration.category ? duration_name(*rv.shift_duration.category) : "over 8 h");
  w.field("explanation", rv.shift_duration.explanation).end_object();
  w.field("kits_per_hour", s.kits_per_hour);
  w.key("zones").begin_array();
  for (const Zone& z : s.zones) {
    w.begin_object().field("id", z.id);
    for (auto [key, v] : {std::pair{"standing_distance", &z.standing_distance}, std::pair{"cart_deck_height", &z.cart_deck_height},
                          std::pair{"cart_h", &z.cart_h}, std::pair{"turn_angle", &z.turn_angle_deg},
                          std::pair{"origin_angle", &z.origin_angle_deg}})
      w.key(key).begin_object().field("value", v->value).field("source", value_source_name(v->source)).end_object();
    w.field("lifting_pattern", z.lifting_pattern ? "zone" : "shift");
    w.end_object();
  }
  w.end_array();
  w.key("reference_box").begin_object().field("width", s.reference_box.box.width).field("depth", s.reference_box.box.depth);
  w.field("height", s.reference_box.box.height).field("coupling", coupling_name(s.reference_box.coupling)).end_object();
  w.key("findings").begin_array();
  for (std::size_t i = 0; i < rv.findings.size(); ++i) {
    const SlotFinding& f = rv.findings[i];
    const Slot& slot = s.slots[f.slot_index];
    const LiftTask& t = f.lift.task;
    w.line_break("\n   ");
    w.begin_object().field("rank", static_cast<int>(i + 1)).field("slot", f.slot_id).field("part", f.part_id);
    w.field("family", f.family).field("rack", f.rack_id).field("level", f.level_id).field("bay", slot.bay);
    w.field("position", position_name(slot.position));
    w.key("derived").begin_object();
    w.field("load", t.load).field("frequency", t.frequency_per_min).field("lifts_per_kit", f.lift.lifts_per_kit);
    w.field("coupling", coupling_name(t.coupling)).field("coupling_reason", f.lift.coupling_reason);
    w.key("standing_distance").begin_object().field("value", f.lift.standing_distance.value);
    w.field("source", value_source_name(f.lift.standing_distance.source)).end_object();
    w.field("hands_in_shelf", f.lift.hands_in_shelf).field("grip_height", f.lift.grip_height);
    w.key("origin").begin_object().field("h", t.origin.h).field("v", t.origin.v).field("a", t.origin.a_deg).end_object();
    w.key("destination").begin_object().field("h", t.destination.h).field("v", t.destination.v);
    w.field("a", t.destination.a_deg).end_object();
    w.field("d", std::abs(t.destination.v - t.origin.v)).field("control_at_destination", t.control_at_destination);
    w.end_object();
    w.key("origin");
    write_point_short(w, f.result.origin);
    w.key("destination");
    write_point_short(w, f.result.destination);
    w.field("governing", lift_end_name(f.result.governing)).field("li", f.result.li).field("band", band_name(f.band));
    w.field("truck_access", f.truck_access);
    w.field("outside_equation", f.result.outside_equation);
    w.field("within_limits_of_application", f.result.within_limits_of_application);
    if (f.reach) {
      w.key("reach").begin_object();
      w.field("small_height_zone", height_zone_name(f.reach->small_height_zone));
      w.field("depth_zone", depth_zone_name(f.reach->depth_zone));
      w.field("small_max_reach_margin_cm", f.reach->small_max_reach_margin_cm);
      const ReachCheck* worst = f.reach->find_worst_failure();
      if (worst) w.field("failure", worst->message);
      else w.key("failure").null();
      w.end_object();
    }
    w.key("remedies").begin_array();
    for (const Remedy& r : f.remedies) {
      w.begin_object().field("remedy", remedy_name(r.kind)).field("reason", r.reason).field("number", r.number);
      w.field("target", r.target).end_object();
    }
    w.end_array();
    w.key("warnings").begin_array();
    for (const auto* list : {&f.result.warnings, &f.warnings})
      for (const Warning& x : *list)
        w.begin_object().field("code", warning_code(x)).field("message", describe_warning(x, u)).end_object();
    w.end_array();
    w.end_object();
  }
  w.end_array();
  w.line_break("\n  ");
  w.key("parts").begin_array();
  for (const PartDecision& d : rv.part_decisions)
    w.begin_object().field("part", d.part_id).field("family", d.family).field("pick", d.hand ? "hand" : "truck")
        .field("best_hand_li", d.best_hand_li).field("best_hand_slot", d.best_hand_slot).field("reason", d.reason)
        .end_object();
  w.end_array();
  w.line_break("\n  ");
  w.key("families").begin_array();
  for (const FamilyDecision& d : rv.family_decisions) {
    w.begin_object().field("family", d.family).field("pick", family_pick_name(d.pick)).field("reason", d.reason);
    w.key("truck_parts").begin_array();
    for (const auto& p : d.truck_parts) w.value(p);
    w.end_array().end_object();
  }
  w.end_array();
  w.line_break("\n  ");
  w.key("level_limits").begin_object();
  w.key("frequencies").begin_array();
  for (double f : s.limit_frequencies_per_min) w.value(f);
  w.end_array();
  w.key("levels").begin_array();
  for (const LevelLimit& l : rv.level_limits) {
    w.begin_object().field("rack", l.rack_id).field("level", l.level_id).field("position", position_name(l.position));
    w.field("access", l.access == LevelAccess::hand ? "hand" : "truck").field("v", l.v).field("h", l.h);
    w.key("rwl").begin_array();
    for (const auto& x : l.rwl) w.value(x);
    w.end_array().end_object();
  }
  w.end_array().end_object();
  w.line_break("\n  ");
  w.key("routes").begin_array();
  for (const RouteResult& r : rv.routes) {
    w.begin_object().field("id", r.id).field("name", r.name).field("vli", r.vli).field("cli", r.cli);
    w.field("band", band_name(find_band(r.vli))).field("vli_rule", r.vli_rule);
    if (r.undefined_reason) w.field("undefined_reason", *r.undefined_reason);
    w.key("contributions").begin_array();
    for (const RouteContribution& c : r.contributions)
      w.begin_object().field("slot", c.slot_id).field("frequency", c.frequency_per_min).field("fili", c.fili)
          .field("stli", c.stli).field("contribution", c.contribution).end_object();
    w.end_array().end_object();
  }
  w.end_array();
  w.key("warnings").begin_array();
  for (const Warning& x : rv.warnings)
    w.begin_object().field("code", warning_code(x)).field("message", describe_warning(x, u)).end_object();
  w.end_array();
  w.end_object();
}

std::string write_review_table(const Project& project, const StoreReview& rv, RoundingMode mode) {
  const UnitSystem u = project.units;
  const Store& s = project.store;
  const std::string len(length_unit(u)), mass(mass_unit(u));
  const int rd = mode == RoundingMode::worksheet ? 1 : 2;
  std::string out = "\nSlot review: " + std::to_string(s.slots.size()) + " slots, " + std::to_string(s.parts.size()) +
                    " parts, " + std::to_string(s.racks.size()) + " racks; " + fixed(s.kits_per_hour, 1) +
                    " kits/h\n";
  out += "Shift: " + rv.shift_duration.explanation + "\n";
  for (const Zone& z : s.zones)
    out += "Zone " + z.id + ": standing " + fixed(z.standing_distance.value, 1) + " " + len + " (" +
           value_source_name(z.standing_distance.source) + "), cart deck " + fixed(z.cart_deck_height.value, 1) + " " +
           len + " (" + value_source_name(z.cart_deck_height.source) + "), cart H " + fixed(z.cart_h.value, 1) + " " +
           len + ", turn " + fixed(z.turn_angle_deg.value, 0) + " deg; lifting pattern: " +
           (z.lifting_pattern ? "the zone's own" : "the shift's") + "\n";
  out += "Derivation: V = level surface + grip height (half the box height unless given); H = standing distance + "
         "hands in the shelf (half the box depth at the front, shelf depth less half the box depth at the back); "
         "F = kits/h x pieces per kit / pieces per grasp / 60; load = unit weight x pieces per grasp.\n";
  for (const Warning& w : rv.warnings) out += "Caution: " + describe_warning(w, u) + "\n";

  out += "\nRanked findings (worst first)\n";
  std::size_t slot_w = 6, part_w = 6;
  for (const SlotFinding& f : rv.findings) {
    slot_w = std::max(slot_w, f.slot_id.size() + 2);
    part_w = std::max(part_w, f.part_id.size() + 2);
  }
  out += "  " + pad_left("#", 3) + "  " + pad_right("slot", slot_w) + pad_right("part", part_w) +
         pad_left("load " + mass, 9) + pad_left("V " + len, 8) + pad_left("H " + len, 8) + pad_left("F /min", 8) +
         pad_left("RWL " + mass, 9) + pad_left("LI", 7) + "  " + pad_right("band", 17) + pad_right("reach", 26) +
         "remedies\n";
  for (std::size_t i = 0; i < rv.findings.size(); ++i) {
    const SlotFinding& f = rv.findings[i];
    const LiftTask& t = f.lift.task;
    out += "  " + pad_left(std::to_string(i + 1), 3) + "  " + pad_right(f.slot_id, slot_w) + pad_right(f.part_id, part_w) +
           pad_left(fixed(t.load, 1), 9) + pad_left(fixed(t.origin.v, 1), 8) + pad_left(fixed(t.origin.h, 1), 8) +
           pad_left(fixed(t.frequency_per_min, 2), 8) + pad_left(fixed(f.result.governing_point().rwl, rd), 9) +
           pad_left(ofixed(f.result.li, rd), 7) + "  " +
           pad_right(f.truck_access ? std::string("truck access") : std::string(band_name(f.band)), 17) +
           pad_right(reach_text(f), 26) + remedies_text(f) + "\n";
  }
  out += "\nWhat to do, slot by slot\n";
  for (const SlotFinding& f : rv.findings) {
    if (f.remedies.empty()) continue;
    out += "  " + f.slot_id + " (" + f.part_id + ", " + f.family + "): LI " + ofixed(f.result.li, rd) + ", " +
           std::string(band_name(f.band)) + "\n";
    for (const Remedy& r : f.remedies) out += "    - " + std::string(remedy_name(r.kind)) + ": " + r.reason + "\n";
    for (const auto* list : {&f.result.warnings, &f.warnings})
      for (const Warning& w : *list) out += "      (" + std::string(warning_code(w)) + ") " + describe_warning(w, u) + "\n";
  }
  out += "\nHand or truck, per family\n";
  for (const FamilyDecision& d : rv.family_decisions) {
    out += "  " + pad_right(d.family, 16) + pad_right(family_pick_name(d.pick), 7) + d.reason;
    if (!d.truck_parts.empty()) {
      out += " (truck:";
      for (const auto& p : d.truck_parts) out += " " + p;
      out += ")";
    }
    out += "\n";
  }
  for (const PartDecision& d : rv.part_decisions)
    if (!d.hand) out += "    " + d.part_id + ": truck access: " + d.reason + "\n";
  out += write_level_limits_table(project, rv);
  if (!rv.routes.empty()) {
    out += "\nPicker routes (one kit each)\n";
    for (const RouteResult& r : rv.routes) {
      out += "  " + r.id + " (" + r.name + "): " + std::to_string(r.contributions.size()) + " picks, VLI " +
             (r.vli ? fixed(*r.vli, rd) + " (" + std::string(band_name(find_band(r.vli))) + ")"
                    : "undefined: " + r.undefined_reason.value_or("")) +
             (r.cli ? ", CLI " + fixed(*r.cli, rd) : std::string()) + "\n    VLI categories: " + r.vli_rule + "\n";
      out += "    heaviest contributions:";
      for (std::size_t k = 0; k < r.contributions.size() && k < 3; ++k)
        out += " " + r.contributions[k].slot_id + " +" + fixed(r.contributions[k].contribution, 2);
      out += "\n";
    }
  }
  return out;
}

std::string write_level_limits_table(const Project& project, const StoreReview& rv) {
  const Store& s = project.store;
  const UnitSystem u = project.units;
  const std::string len(length_unit(u)), mass(mass_unit(u));
  std::string out = "\nLevel limits: heaviest load with LI 1.0 (the RWL, " + mass + ") for the reference box " +
                    fixed(s.reference_box.box.width, 0) + " x " + fixed(s.reference_box.box.depth, 0) + " x " +
                    fixed(s.reference_box.box.height, 0) + " " + len + ", " +
                    std::string(coupling_name(s.reference_box.coupling)) + " coupling\n";
  out += "  " + pad_right("rack", 8) + pad_right("level", 7) + pad_right("pos", 7) + pad_right("access", 8) +
         pad_left("V " + len, 8) + pad_left("H " + len, 8);
  for (double f : s.limit_frequencies_per_min) out += pad_left(fixed(f, 1) + "/min", 9);
  out += "\n";
  for (const LevelLimit& l : rv.level_limits) {
    out += "  " + pad_right(l.rack_id, 8) + pad_right(l.level_id, 7) + pad_right(position_name(l.position), 7) +
           pad_right(l.access == LevelAccess::hand ? "hand" : "truck", 8) + pad_left(fixed(l.v, 1), 8) +
           pad_left(fixed(l.h, 1), 8);
    for (const auto& x : l.rwl)
      out += pad_left(l.access == LevelAccess::truck ? std::string("truck") : x ? fixed(*x, 1) : std::string("none"), 9);
    out += "\n";
  }
  out += "  (none: outside the equation at that geometry or duration; truck: a lift-truck level; durations per zone)\n";
  return out;
}

std::string write_review_csv(const Project& project, const StoreReview& rv) {
  const std::string len(length_unit(project.units)), mass(mass_unit(project.units));
  std::string out = "rank,slot,part,family,rack,level,bay,position,load_" + mass + ",frequency_per_min,v_" + len +
                    ",h_" + len + ",a_deg,rwl_" + mass + ",li,band,reach,remedies,warnings\n";
  auto num = [](double x) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", x);
    return std::string(buf);
  };
  for (std::size_t i = 0; i < rv.findings.size(); ++i) {
    const SlotFinding& f = rv.findings[i];
    const Slot& sl = project.store.slots[f.slot_index];
    const LiftTask& t = f.lift.task;
    std::string codes;
    for (const auto* list : {&f.result.warnings, &f.warnings})
      for (const Warning& w : *list) codes += (codes.empty() ? "" : ";") + std::string(warning_code(w));
    out += std::to_string(i + 1) + "," + csv_cell(f.slot_id) + "," + csv_cell(f.part_id) + "," + csv_cell(f.family) +
           "," + csv_cell(f.rack_id) + "," + csv_cell(f.level_id) + "," + std::to_string(sl.bay) + "," +
           position_name(sl.position) + "," + num(t.load) + "," + num(t.frequency_per_min) + "," + num(t.origin.v) +
           "," + num(t.origin.h) + "," + num(t.origin.a_deg) + "," + num(f.result.governing_point().rwl) + "," +
           (f.result.li ? num(*f.result.li) : std::string()) + "," + std::string(band_name(f.band)) + "," +
           csv_cell(reach_text(f)) + "," + csv_cell(remedies_text(f)) + "," + csv_cell(codes) + "\n";
  }
  return out;
}

std::string write_review_html(const Project& project, const StoreReview& rv, const std::string& input_name) {
  const UnitSystem u = project.units;
  const std::string len(length_unit(u)), mass(mass_unit(u));
  std::string h = "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>Rackreach slot review</title>\n"
                  "<style>body{font-family:sans-serif;margin:2em}table{border-collapse:collapse;margin:1em 0}"
                  "td,th{border:1px solid #999;padding:2px 6px;text-align:left}td.n{text-align:right}"
                  ".caution{border:2px solid #444;padding:.5em;background:#f4f4f4}</style></head><body>\n";
  h += "<h1>Slot review: " + html_escape(project.info.site.value_or(input_name)) + "</h1>\n";
  h += "<p>Input: " + html_escape(input_name) + "; assessor: " + html_escape(project.info.assessor.value_or("-")) +
       "; date: " + html_escape(project.info.date.value_or("-")) + "; Rackreach " + engine_version + "; " +
       html_escape(lifting_method_text) + ". Lengths in " + len + ", loads in " + mass + ".</p>\n";
  h += "<p class=\"caution\">" + html_escape(caution_text) + "</p>\n";
  for (const Warning& w : rv.warnings) h += "<p><strong>Caution:</strong> " + html_escape(describe_warning(w, u)) + "</p>\n";
  h += "<h2>Ranked findings</h2>\n<table><tr><th>#</th><th>slot</th><th>part</th><th>family</th><th>load " + mass +
       "</th><th>V " + len + "</th><th>H " + len + "</th><th>F /min</th><th>RWL " + mass +
       "</th><th>LI</th><th>band</th><th>reach</th><th>remedies</th></tr>\n";
  for (std::size_t i = 0; i < rv.findings.size(); ++i) {
    const SlotFinding& f = rv.findings[i];
    const LiftTask& t = f.lift.task;
    std::string rem;
    for (const Remedy& r : f.remedies) rem += "<div>" + html_escape(std::string(remedy_name(r.kind)) + ": " + r.reason) + "</div>";
    h += "<tr><td class=\"n\">" + std::to_string(i + 1) + "</td><td>" + html_escape(f.slot_id) + "</td><td>" +
         html_escape(f.part_id) + "</td><td>" + html_escape(f.family) + "</td><td class=\"n\">" + fixed(t.load, 1) +
         "</td><td class=\"n\">" + fixed(t.origin.v, 1) + "</td><td class=\"n\">" + fixed(t.origin.h, 1) +
         "</td><td class=\"n\">" + fixed(t.frequency_per_min, 2) + "</td><td class=\"n\">" +
         fixed(f.result.governing_point().rwl, 2) + "</td><td class=\"n\">" + ofixed(f.result.li, 2) + "</td><td>" +
         std::string(band_name(f.band)) + "</td><td>" + html_escape(reach_text(f)) + "</td><td>" +
         (rem.empty() ? "-" : rem) + "</td></tr>\n";
  }
  h += "</table>\n<h2>Hand or truck, per family</h2>\n<table><tr><th>family</th><th>pick</th><th>why</th></tr>\n";
  for (const FamilyDecision& d : rv.family_decisions)
    h += "<tr><td>" + html_escape(d.family) + "</td><td>" + family_pick_name(d.pick) + "</td><td>" +
         html_escape(d.reason) + "</td></tr>\n";
  h += "</table>\n<h2>Level limits (RWL, " + mass + ")</h2>\n<pre>" + html_escape(write_level_limits_table(project, rv)) +
       "</pre>\n";
  h += "<h2>Picker routes</h2>\n<table><tr><th>route</th><th>picks</th><th>index</th><th>band</th></tr>\n";
  for (const RouteResult& r : rv.routes)
    h += "<tr><td>" + html_escape(r.id + " " + r.name) + "</td><td class=\"n\">" + std::to_string(r.contributions.size()) +
         "</td><td class=\"n\">" + ofixed(r.vli, 2) + "</td><td>" + std::string(band_name(find_band(r.vli))) +
         "</td></tr>\n";
  h += "</table>\n</body></html>\n";
  return h;
}

}  // namespace rackreach
