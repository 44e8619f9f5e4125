// SPDX-License-Identifier: MIT
#include "app/report/report_document.hpp"

#include <algorithm>
#include <map>

#include "engine/caution.hpp"
#include "engine/io/text_columns.hpp"
#include "engine/lifting/limits_of_application.hpp"
#include "engine/lifting/variable_2016.hpp"

namespace rackreach::report {
namespace {

using text::fixed;
using text::fixed_or_dash;

Cell c(std::string s) { return Cell{std::move(s), false, std::nullopt, false}; }
Cell n(std::string s) { return Cell{std::move(s), true, std::nullopt, false}; }
Cell banded(RiskBand b, std::string s) { return Cell{std::move(s), false, b, false}; }

const char* position_name(SlotPosition p) { return p == SlotPosition::front ? "front" : "back"; }
const char* family_pick_name(FamilyDecision::Pick p) {
  return p == FamilyDecision::Pick::hand ? "hand" : p == FamilyDecision::Pick::truck ? "truck" : "split";
}
std::string str(std::string_view s) { return std::string(s); }

std::string join(const std::vector<std::string>& items, const std::string& sep) {
  std::string s;
  for (const std::string& i : items) s += (s.empty() ? "" : sep) + i;
  return s;
}

std::string warnings_text(const std::vector<const std::vector<Warning>*>& lists, UnitSystem u, bool limits_only,
                          bool others_only) {
  std::vector<std::string> out;
  for (const auto* list : lists)
    for (const Warning& w : *list) {
      if (limits_only && !w.is_limit_of_application()) continue;
      if (others_only && w.is_limit_of_application()) continue;
      out.push_back(describe_warning(w, u) + " [" + str(warning_code(w)) + "]");
    }
  return join(out, "; ");
}

/// The limits of application as stated for a task or zone: what was declared, and what was not stated.
std::string limits_stated_text(const LimitsOfApplication& l) {
  std::vector<std::string> yes, no, unstated;
  auto flag = [&](const char* name, const std::optional<bool>& v) {
    (v ? (*v ? yes : no) : unstated).push_back(name);
  };
  flag("one-handed", l.one_handed);
  flag("seated or kneeling", l.seated_or_kneeling);
  flag("restricted space", l.restricted_space);
  flag("unstable load", l.unstable_load);
  flag("wheelbarrow or shovel", l.wheelbarrow_or_shovel);
  flag("high speed", l.high_speed);
  auto number = [&](const char* name, const std::optional<double>& v, int decimals, const char* unit) {
    if (v) no.push_back(std::string(name) + " " + fixed(*v, decimals) + unit);  // a value: judged by the warnings
    else unstated.push_back(name);
  };
  number("carry/push share", l.carry_push_share, 2, "");
  number("floor friction", l.floor_friction, 2, "");
  number("temperature", l.temperature_c, 1, " C");
  number("humidity", l.humidity_pct, 0, " %");
  std::string s;
  if (!yes.empty()) s += "declared to apply: " + join(yes, ", ") + ". ";
  if (!no.empty()) s += "stated: " + join(no, ", ") + ". ";
  if (!unstated.empty()) s += "not stated (assumed within the limits): " + join(unstated, ", ") + ".";
  return s;
}

/// Short: the check that fails and by how much; the full sentence is in the warnings section.
std::string reach_text(const SlotFinding& f) {
  if (!f.reach) return "-";
  if (const ReachCheck* k = f.reach->find_worst_failure())
    return "NOT MET: " + k->code + " (" + (k->worker ? str(reach_worker_name(*k->worker)) + " worker, " : std::string()) +
           "short by " + fixed(-k->margin_cm, 1) + " cm)";
  return "met (" + str(height_zone_name(f.reach->small_height_zone)) + ", " + str(depth_zone_name(f.reach->depth_zone)) +
         ", margin " + fixed(f.reach->small_max_reach_margin_cm, 1) + " cm)";
}

std::string band_or_truck(const SlotFinding& f) { return f.truck_access ? "truck access" : str(band_name(f.band)); }

std::string bands_text(const RiskBands& b) {
  return "within limit: LI <= " + fixed(b.elevated_above, 1) + "; elevated: up to " + fixed(b.high_above, 1) +
         "; high: up to " + fixed(b.very_high_above, 1) + "; very high: above " + fixed(b.very_high_above, 1) +
         "; outside equation: the LI is undefined (a zero multiplier or more than 8 h of lifting)";
}

class Builder {
 public:
  Builder(const Project& p, const ProjectAssessment& a, const ReportContext& ctx) : p_(p), a_(a), ctx_(ctx) {
    u_ = a.units;
    len_ = str(length_unit(u_));
    mass_ = str(mass_unit(u_));
    rd_ = a.rounding == RoundingMode::worksheet ? 1 : 2;
    md_ = a.rounding == RoundingMode::worksheet ? 2 : 3;
  }

  ReportDocument build() {
    cover();
    method();
    self_check();
    if (a_.store) {
      summary();
      drawings();
      findings();
      level_limits();
      routes();
    }
    if (!a_.jobs.empty()) jobs();
    warnings();
    cautions();
    sign_off();
    return std::move(doc_);
  }

 private:
  std::string site() const { return ctx_.site ? *ctx_.site : p_.info.site.value_or("not given"); }
  std::string assessor() const { return ctx_.assessor ? *ctx_.assessor : p_.info.assessor.value_or("not given"); }
  std::string revision() const { return ctx_.revision ? *ctx_.revision : p_.info.revision.value_or("not given"); }

  std::string self_check_summary() const {
    const SelfCheckResult& s = ctx_.self_check;
    const std::size_t total = s.outcomes.size();
    if (s.passed())
      return "published cases passed: " + std::to_string(total) + " of " + std::to_string(total) +
             " values of the embedded worked examples reproduced when this report was made";
    return "FAILED: " + std::to_string(s.failures()) + " of " + std::to_string(total) +
           " values of the embedded published worked examples were NOT reproduced when this report was made";
  }

  void cover() {
    doc_.title = "Lifting and reach screening: audit record";
    doc_.subtitle = p_.info.title.value_or(a_.store ? "Slot review" : "Lift assessment");
    doc_.generated_at = ctx_.generated_at;
    Table& t = doc_.cover;
    t.header = {"Item", "Value"};
    t.widths_pct = {28, 72};
    auto row = [&](std::string k, std::string v, bool strong = false) {
      t.rows.push_back({Cell{std::move(k), false, std::nullopt, true}, Cell{std::move(v), false, std::nullopt, strong}});
    };
    row("Site", site());
    row("Assessor", assessor());
    row("Revision", revision());
    row("Assessment date (project file)", p_.info.date.value_or("not given"));
    row("Report date", ctx_.generated_at);
    row("Input file", ctx_.input_name);
    row("Input SHA-256", ctx_.input_sha256);
    row("Input size", std::to_string(ctx_.input_bytes) + " bytes");
    row("Tool", "Rackreach " + ctx_.tool_version);
    row("Method", lifting_method_text);
    row("Engine self-check", self_check_summary(), !ctx_.self_check.passed());
    std::size_t tasks = 0;
    for (const JobAssessment& j : a_.jobs) tasks += j.tasks.size();
    std::string scope;
    if (a_.store)
      scope = std::to_string(p_.store.slots.size()) + " slots in " + std::to_string(p_.store.racks.size()) +
              " racks, " + std::to_string(p_.store.parts.size()) + " parts, " + std::to_string(p_.store.routes.size()) +
              " routes";
    if (!a_.jobs.empty())
      scope += (scope.empty() ? "" : "; ") + std::to_string(a_.jobs.size()) + " lift jobs with " +
               std::to_string(tasks) + " tasks";
    row("Scope", scope);
    row("Result", result_summary());
    if (!ctx_.self_check.passed())
      doc_.cover_blocks.push_back(Notice{"ENGINE SELF-CHECK FAILED",
                                         self_check_summary() +
                                             ". The numbers in this report cannot be relied on. See the section "
                                             "\"Engine self-check\" for the values that differ.",
                                         true});
    doc_.cover_blocks.push_back(Notice{"Caution", caution_text, false});
    doc_.footer = "Rackreach " + ctx_.tool_version + " | " + site() + " | rev. " + revision() + " | input sha256 " +
                  ctx_.input_sha256.substr(0, 16) + "...";
  }

  std::string result_summary() const {
    std::vector<std::string> parts;
    if (a_.store) {
      std::size_t above = 0, outside = 0;
      for (const SlotFinding& f : a_.store->findings) {
        if (f.truck_access) continue;
        if (f.result.li && *f.result.li > a_.bands.elevated_above) ++above;
        if (!f.result.li) ++outside;
      }
      std::string s = std::to_string(above) + " of " + std::to_string(a_.store->findings.size()) + " slots above LI " +
                      fixed(a_.bands.elevated_above, 1);
      if (outside) s += ", " + std::to_string(outside) + " outside the equation";
      for (const SlotFinding& f : a_.store->findings)
        if (!f.truck_access) {
          s += "; worst: slot " + f.slot_id +
               (f.result.li ? ", LI " + fixed(*f.result.li, rd_) + " (" + band_or_truck(f) + ")"
                            : std::string(", outside the equation"));
          break;
        }
      parts.push_back(s);
    }
    if (!a_.jobs.empty()) {
      std::size_t above = 0, total = 0;
      for (const JobAssessment& j : a_.jobs)
        for (const TaskResult& t : j.tasks) {
          ++total;
          if (!t.li || *t.li > a_.bands.elevated_above) ++above;
        }
      parts.push_back(std::to_string(above) + " of " + std::to_string(total) + " lift tasks above LI " +
                      fixed(a_.bands.elevated_above, 1) + " or outside the equation");
    }
    return join(parts, "; ");
  }

  Section& section(std::string title, bool new_page = false) {
    doc_.sections.push_back(Section{std::move(title), new_page, {}});
    return doc_.sections.back();
  }

  void method() {
    Section& s = section("Method and settings", true);
    s.blocks.push_back(Paragraph{"Every lift is evaluated with the " + std::string(lifting_method_text) +
                                 ", at its origin and its destination, with every boundary rule and limit of "
                                 "application of the manual. Every setting and default in effect is listed below; "
                                 "\"default\" means the file left it out and the built-in value was used."});
    Table t;
    t.header = {"Setting", "Value", "Source"};
    t.widths_pct = {22, 60, 18};
    auto row = [&](std::string k, std::string v, std::string src) { t.rows.push_back({c(k), c(v), c(src)}); };
    row("Equation", "Revised NIOSH Lifting Equation: metric form (LC 23 kg) for metric files, US form (LC 51 lb) for "
                    "US files; the two forms' constants are not exact conversions",
        "Waters et al. 1993; Applications Manual 1994 (rev. 2021)");
    row("Units", str(unit_system_name(u_)) + ": lengths in " + len_ + ", loads and limits in " + mass_ +
                     ", angles in degrees, frequency in lifts/min",
        "file");
    row("Rounding", a_.rounding == RoundingMode::worksheet
                        ? "worksheet: multipliers to 2 decimals, weights and indices to 1, half away from zero"
                        : "full precision throughout (numbers shown to " + std::to_string(rd_) + " decimals)",
        "report option");
    row("Duration rule", duration_rule_name(a_.duration_rule) == std::string_view("2021")
                             ? "2021 edition: a lifting period counts as short when the recovery after it is at "
                               "least 1.0 x its work time"
                             : "1994 edition: recovery at least 1.2 x the work time for the short category",
        "file or option");
    row("Risk bands", bands_text(a_.bands),
        "LI 1.0 and 3.0: Applications Manual 1.4; the 2.0 boundary and the words: Rackreach's presentation");
    if (a_.reach) {
      const ReachSetup& r = *a_.reach;
      row("Workforce", r.workforce, p_.workforce_given ? "file" : "default");
      row("Reach checked for", r.small.label + " (percentile " + fixed(r.small.percentile, 0) + ")",
          p_.workforce_given ? "file" : "default");
      row("Clearance checked for", r.large.label + " (percentile " + fixed(r.large.percentile, 0) + ")",
          p_.workforce_given ? "file" : "default");
      const ReachParameters& q = r.parameters;
      auto src = [&](const char* name) {
        return std::find(p_.reach_parameters_set.begin(), p_.reach_parameters_set.end(), name) !=
                       p_.reach_parameters_set.end()
                   ? std::string("file")
                   : std::string("default");
      };
      row("Ankles to rack face", fixed(q.ankle_to_rack_face_cm, 1) + " cm (reach model)", src("ankle_to_rack_face"));
      row("Footwear allowance", fixed(q.footwear_allowance_cm, 1) + " cm", src("footwear_allowance"));
      row("Shoulder ahead of ankles", fixed(q.shoulder_ahead_of_ankles_cm, 1) + " cm", src("shoulder_ahead_of_ankles"));
      row("Shoulder pivot below acromion", fixed(q.shoulder_pivot_below_acromion_cm, 1) + " cm", "default");
      row("Hand clearance allowance", fixed(q.hand_clearance_allowance_cm, 1) + " cm", src("hand_clearance_allowance"));
      row("Comfortable reach", fixed(q.comfortable_reach_fraction * 100.0, 0) + " % of maximum reach",
          src("comfortable_reach_fraction"));
      row("Hand above grip axis", fixed(q.hand_above_grip_fraction_of_breadth, 2) + " x hand breadth", "default");
    } else {
      row("Reach checks", "none: no task has shelf geometry and the file has no slots, so no workforce was used",
          "file");
    }
    if (a_.store) {
      const Store& st = p_.store;
      const StoreReview& rv = *a_.store;
      row("Demand", fixed(st.kits_per_hour, 1) + " kits per hour", "file");
      row("Shift", rv.shift_duration.explanation, st.shift ? "file" : "default");
      for (const Zone& z : st.zones) {
        auto v = [&](const SourcedValue& x, const char* unit, int decimals) {
          return fixed(x.value, decimals) + " " + unit + " (" + value_source_name(x.source) + ")";
        };
        row("Zone " + z.id,
            "standing distance " + v(z.standing_distance, len_.c_str(), 1) + ", cart deck " +
                v(z.cart_deck_height, len_.c_str(), 1) + ", cart H " + v(z.cart_h, len_.c_str(), 1) + ", turn " +
                v(z.turn_angle_deg, "deg", 0) + ", origin angle " + v(z.origin_angle_deg, "deg", 0) +
                ", significant control at the cart: " + (z.control_at_destination ? "yes" : "no") +
                ", lifting pattern: " + (z.lifting_pattern ? "the zone's own" : "the shift's"),
            "per value");
      }
      row("Reference box (level limits)",
          fixed(st.reference_box.box.width, 0) + " x " + fixed(st.reference_box.box.depth, 0) + " x " +
              fixed(st.reference_box.box.height, 0) + " " + len_ + ", " + str(coupling_name(st.reference_box.coupling)) +
              " coupling",
          "file or default");
      std::vector<std::string> fs;
      for (double f : st.limit_frequencies_per_min) fs.push_back(fixed(f, 1));
      row("Level-limit frequencies", join(fs, ", ") + " lifts/min", "file or default");
      row("Route index", str(vli_category_rule_name), "Waters et al. 2016; category rule ours");
    }
    s.blocks.push_back(std::move(t));
    if (a_.store) {
      s.blocks.push_back(Subheading{"How a slot becomes a lift"});
      s.blocks.push_back(Bullets{{
          "V (origin) = level surface + grip height of the box (half the box height unless the part gives it).",
          "H (origin) = standing distance (ankles to rack face) + the hands' position in the shelf: half the box "
          "depth at the front, the shelf depth less half the box depth at the back.",
          "A (origin) = the zone's origin angle; destination: the cart (deck + grip height, the zone's cart H and "
          "turn angle); D = |V destination - V origin|.",
          "F = kits per hour x pieces per kit / pieces per grasp / 60; load = unit weight x pieces per grasp.",
          "Duration category from the zone's lifting pattern, or the shift, by the manual's recovery rule.",
          "Coupling from the part's handhold and box (Applications Manual Table 6) unless the file gives it.",
      }});
    }
    s.blocks.push_back(Subheading{"Choices where the manual is silent"});
    s.blocks.push_back(Bullets{{
        "Summed frequencies in the CLI use the V < 75 cm (30 in) column of Table 5 if any task in the sum has its "
        "origin below that height.",
        "With significant control, the end with the lower FIRWL feeds FILI and STLI.",
        "A lifting run of more than 2 h is not reset by breaks (they are part of the long category), so a 10-hour "
        "shift of lifting with two breaks is more than 8 h: outside the equation.",
        "Variable Lifting Index: " + str(vli_category_rule_name) + ".",
    }});
  }

  void self_check() {
    const SelfCheckResult& r = ctx_.self_check;
    Section& s = section("Engine self-check", false);
    s.blocks.push_back(Paragraph{
        "Run when this report was made: the published worked examples embedded in this build were evaluated by its "
        "engine in worksheet rounding and compared with the values at the source's printed precision (multipliers "
        "2 decimals, weights and indices 1). \"printed\" marks a value printed in the source; the others are the "
        "method applied to the printed inputs at the source's rounding."});
    if (r.passed())
      s.blocks.push_back(Notice{"Self-check passed", self_check_summary() + ".", false});
    else
      s.blocks.push_back(Notice{"SELF-CHECK FAILED", self_check_summary() + ". Do not rely on the numbers of this "
                                "report until the engine is corrected.", true});
    Table t;
    t.header = {"Case", "End", "Value", "Published", "Computed", "In source", "Result"};
    t.widths_pct = {26, 12, 10, 12, 12, 14, 14};
    for (const CheckOutcome& o : r.outcomes)
      t.rows.push_back({c(o.case_name), c(o.end), c(o.quantity), n(fixed(o.expected, o.decimals)),
                        n(o.computed ? fixed(*o.computed, o.decimals) : "undefined"),
                        c(o.printed ? "printed" : "method applied"),
                        Cell{o.passed ? "pass" : "FAIL", false, std::nullopt, !o.passed}});
    s.blocks.push_back(std::move(t));
    std::vector<std::string> cites;
    std::string last;
    for (const CheckOutcome& o : r.outcomes)
      if (o.case_name != last) {
        cites.push_back(o.case_name + ": " + o.citation);
        last = o.case_name;
      }
    s.blocks.push_back(Paragraph{"Sources: " + join(cites, "; ") + ".", true});
  }

  void summary() {
    const StoreReview& rv = *a_.store;
    Section& s = section("Summary", true);
    // Slots per band.
    std::map<int, std::size_t> counts;
    std::size_t truck = 0;
    for (const SlotFinding& f : rv.findings) {
      if (f.truck_access) ++truck;
      else ++counts[static_cast<int>(f.band)];
    }
    Table bands;
    bands.header = {"Band", "Lifting index", "Slots"};
    bands.widths_pct = {30, 50, 20};
    const RiskBands& b = a_.bands;
    const std::pair<RiskBand, std::string> rows[] = {
        {RiskBand::within_limit, "LI <= " + fixed(b.elevated_above, 1)},
        {RiskBand::elevated, fixed(b.elevated_above, 1) + " < LI <= " + fixed(b.high_above, 1)},
        {RiskBand::high, fixed(b.high_above, 1) + " < LI <= " + fixed(b.very_high_above, 1)},
        {RiskBand::very_high, "LI > " + fixed(b.very_high_above, 1)},
        {RiskBand::outside_equation, "undefined (outside the equation)"}};
    for (const auto& [band, range] : rows)
      bands.rows.push_back({banded(band, str(band_name(band))), c(range), n(std::to_string(counts[static_cast<int>(band)]))});
    bands.rows.push_back({c("truck access"), c("picked by lift truck: no manual lift"), n(std::to_string(truck))});
    bands.rows.push_back({Cell{"all slots", false, std::nullopt, true}, c(""), n(std::to_string(rv.findings.size()))});
    s.blocks.push_back(Subheading{"Slots per band"});
    s.blocks.push_back(std::move(bands));

    Table worst;
    worst.header = {"#", "Slot", "Part", "Family", "Rack / level / bay", "Load " + mass_, "LI", "Band", "First remedy"};
    worst.widths_pct = {3, 8, 8, 9, 10, 6, 5, 9, 42};
    std::size_t k = 0;
    for (const SlotFinding& f : rv.findings) {
      if (k == 10) break;
      if (f.truck_access) continue;
      ++k;
      worst.rows.push_back({n(std::to_string(k)), c(f.slot_id), c(f.part_id), c(f.family),
                            c(f.rack_id + " / " + f.level_id + " / " + std::to_string(p_.store.slots[f.slot_index].bay)),
                            n(fixed(f.lift.task.load, 1)), n(fixed_or_dash(f.result.li, rd_)),
                            banded(f.band, str(band_name(f.band))),
                            c(f.remedies.empty() ? "-"
                                                 : std::string(remedy_name(f.remedies.front().kind)) + ": " +
                                                       f.remedies.front().reason)});
    }
    s.blocks.push_back(Subheading{"The worst ten hand-picked slots"});
    s.blocks.push_back(std::move(worst));

    Table fam;
    fam.header = {"Family", "Pick", "Truck parts", "Why"};
    fam.widths_pct = {16, 8, 20, 56};
    for (const FamilyDecision& d : rv.family_decisions)
      fam.rows.push_back({c(d.family), c(family_pick_name(d.pick)), c(d.truck_parts.empty() ? "-" : join(d.truck_parts, ", ")),
                          c(d.reason)});
    s.blocks.push_back(Subheading{"Hand or truck picking, per part family"});
    s.blocks.push_back(std::move(fam));

    if (!rv.routes.empty()) {
      Table rt;
      rt.header = {"Route", "Name", "Picks", "VLI", "Band", "CLI", "Heaviest contributions"};
      rt.widths_pct = {10, 24, 7, 8, 13, 8, 30};
      for (const RouteResult& r : rv.routes) {
        std::vector<std::string> top;
        for (std::size_t i = 0; i < r.contributions.size() && i < 3; ++i)
          top.push_back(r.contributions[i].slot_id + " +" + fixed(r.contributions[i].contribution, 2));
        const RiskBand rb = find_band(r.vli, a_.bands);
        rt.rows.push_back({c(r.id), c(r.name), n(std::to_string(r.contributions.size())),
                           n(r.vli ? fixed(*r.vli, rd_) : "undefined"), banded(rb, str(band_name(rb))),
                           n(fixed_or_dash(r.cli, rd_)),
                           c(r.undefined_reason ? "undefined: " + *r.undefined_reason : join(top, ", "))});
      }
      s.blocks.push_back(Subheading{"Picker routes (one kit each): VLI and CLI"});
      s.blocks.push_back(std::move(rt));
    }
  }

  void drawings() {
    Section& s = section("Rack elevations", true);
    s.blocks.push_back(Paragraph{
        "Each rack face to scale, every slot tinted by its band and labelled with its part, LI and band (\"truck\" on "
        "lift-truck levels, \"outside\" where the LI is undefined); beside it the reach heights of the small and the "
        "large worker with footwear. The same drawing as the desktop app's rack view."});
    if (!ctx_.drawings)
      s.blocks.push_back(Notice{"Drawings not included",
                                "This build of Rackreach has no drawing library (built without Qt): the rack "
                                "elevations are missing from this report. The tables below hold every result.",
                                true});
    for (std::size_t i = 0; i < p_.store.racks.size(); ++i) {
      const Rack& r = p_.store.racks[i];
      s.blocks.push_back(RackDrawing{static_cast<int>(i), r.id, i > 0,
                                     "Rack " + r.id + " (zone " + r.zone + "): " + std::to_string(r.bays) + " bays, " +
                                         std::to_string(r.levels.size()) + " levels"});
    }
  }

  void findings() {
    const StoreReview& rv = *a_.store;
    Section& s = section("Findings, slot by slot", true);
    s.blocks.push_back(Paragraph{"Ranked worst first. Load, RWL in " + mass_ + "; V and H of the origin in " + len_ +
                                 "; F in lifts per minute. The remedies say what the slot needs and why, with the "
                                 "number that decides it."});
    Table t;
    // Units in the headers too: they repeat on every page of the table.
    t.header = {"#",      "Slot",       "Part (family)", "Place",           "Load " + mass_, "V " + len_, "H " + len_,
                "F /min", "RWL " + mass_, "LI",          "Band",            "Reach",         "Remedies"};
    t.widths_pct = {3, 8, 9, 7, 4, 4, 4, 4, 5, 4, 7, 14, 27};
    for (std::size_t i = 0; i < rv.findings.size(); ++i) {
      const SlotFinding& f = rv.findings[i];
      const Slot& sl = p_.store.slots[f.slot_index];
      const LiftTask& lt = f.lift.task;
      std::vector<std::string> rem;
      for (const Remedy& r : f.remedies) rem.push_back("- " + std::string(remedy_name(r.kind)) + ": " + r.reason);
      t.rows.push_back({n(std::to_string(i + 1)), c(f.slot_id), c(f.part_id + " (" + f.family + ")"),
                        c(f.rack_id + "/" + f.level_id + "/" + std::to_string(sl.bay) + " " + position_name(sl.position)),
                        n(fixed(lt.load, 1)), n(fixed(lt.origin.v, 1)), n(fixed(lt.origin.h, 1)),
                        n(fixed(lt.frequency_per_min, 2)), n(fixed(f.result.governing_point().rwl, rd_)),
                        n(fixed_or_dash(f.result.li, rd_)),
                        f.truck_access ? c("truck access") : banded(f.band, str(band_name(f.band))), c(reach_text(f)),
                        c(rem.empty() ? "-" : join(rem, "\n"))});
    }
    s.blocks.push_back(std::move(t));
  }

  void level_limits() {
    const StoreReview& rv = *a_.store;
    const Store& st = p_.store;
    Section& s = section("Level limits", true);
    s.blocks.push_back(Paragraph{
        "The heaviest load with LI 1.0 (the RWL, " + mass_ + ") at each level and depth position for the reference "
        "box " + fixed(st.reference_box.box.width, 0) + " x " + fixed(st.reference_box.box.depth, 0) + " x " +
        fixed(st.reference_box.box.height, 0) + " " + len_ + ", " + str(coupling_name(st.reference_box.coupling)) +
        " coupling, per pick frequency. \"none\": outside the equation at that geometry or duration; \"truck\": a "
        "lift-truck level. Durations per zone."});
    Table t;
    t.header = {"Rack", "Level", "Position", "Access", "V " + len_, "H " + len_};
    for (double f : st.limit_frequencies_per_min) t.header.push_back(fixed(f, 1) + "/min");
    for (const LevelLimit& l : rv.level_limits) {
      std::vector<Cell> row = {c(l.rack_id), c(l.level_id), c(position_name(l.position)),
                               c(l.access == LevelAccess::hand ? "hand" : "truck"), n(fixed(l.v, 1)), n(fixed(l.h, 1))};
      for (const auto& x : l.rwl)
        row.push_back(n(l.access == LevelAccess::truck ? "truck" : x ? fixed(*x, 1) : "none"));
      t.rows.push_back(std::move(row));
    }
    s.blocks.push_back(std::move(t));
  }

  void routes() {
    const StoreReview& rv = *a_.store;
    if (rv.routes.empty()) return;
    Section& s = section("Picker routes, pick by pick", false);
    s.blocks.push_back(Paragraph{"A route is one picker's job over the slots of one kit: its index is the VLI, "
                                 "with each slot's contribution (largest first). VLI categories: " +
                                 str(vli_category_rule_name) + "."});
    for (const RouteResult& r : rv.routes) {
      s.blocks.push_back(Subheading{"Route " + r.id + " (" + r.name + "): VLI " +
                                    (r.vli ? fixed(*r.vli, rd_) : "undefined: " + r.undefined_reason.value_or("")) +
                                    (r.cli ? ", CLI " + fixed(*r.cli, rd_) : std::string())});
      Table t;
      t.header = {"Slot", "F /min", "FILI", "STLI", "Adds to the index"};
      for (const RouteContribution& k : r.contributions)
        t.rows.push_back({c(k.slot_id), n(fixed(k.frequency_per_min, 3)), n(fixed_or_dash(k.fili, rd_)),
                          n(fixed_or_dash(k.stli, rd_)), n(fixed(k.contribution, 3))});
      s.blocks.push_back(std::move(t));
    }
  }

  void jobs() {
    Section& s = section("Lift jobs, task by task", true);
    s.blocks.push_back(Paragraph{"Every task at its origin and destination (* marks the end that governs its LI: the "
                                 "destination only with significant control and a lower RWL). H, V, D in " + len_ +
                                 ", A in degrees, F in lifts/min, RWL in " + mass_ + "."});
    for (std::size_t ji = 0; ji < a_.jobs.size(); ++ji) {
      const JobAssessment& ja = a_.jobs[ji];
      const LiftJob& job = p_.jobs[ji];
      std::string dur = ja.duration.category ? str(duration_name(*ja.duration.category)) + " (" +
                                                   str(duration_limit_text(*ja.duration.category)) + ")"
                                             : std::string("more than 8 h: OUTSIDE THE EQUATION");
      dur += ja.duration_declared ? ", declared" : ", from the work pattern: " + ja.duration.explanation;
      s.blocks.push_back(Subheading{"Job " + ja.id + (job.name ? " (" + *job.name + ")" : "")});
      s.blocks.push_back(Paragraph{"Duration: " + dur});
      Table t;
      t.header = {"Task", "End", "Load " + mass_, "H " + len_, "V " + len_, "D " + len_, "A deg", "F /min", "HM", "VM",
                  "DM",   "AM",  "FM",            "CM",        "RWL " + mass_, "LI", "Band"};
      for (std::size_t ti = 0; ti < ja.tasks.size(); ++ti) {
        const TaskResult& r = ja.tasks[ti];
        const LiftTask& lt = job.tasks[ti];
        for (LiftEnd end : {LiftEnd::origin, LiftEnd::destination}) {
          const PointResult& pr = end == LiftEnd::origin ? r.origin : r.destination;
          const LiftPoint& lp = end == LiftEnd::origin ? lt.origin : lt.destination;
          const RiskBand band = find_band(pr.li, a_.bands);
          std::vector<Cell> row = {c(end == LiftEnd::origin ? r.id : ""),
                                   c(str(lift_end_name(end)) + (end == r.governing ? " *" : "")),
                                   n(fixed(lt.load, 1)), n(fixed(lp.h, 1)), n(fixed(lp.v, 1)),
                                   n(fixed(std::abs(lt.destination.v - lt.origin.v), 1)), n(fixed(lp.a_deg, 0)),
                                   n(fixed(lt.frequency_per_min, 2))};
          for (const Multiplier* m : {&pr.hm, &pr.vm, &pr.dm, &pr.am, &pr.fm, &pr.cm}) row.push_back(n(fixed(m->value, md_)));
          row.push_back(n(fixed(pr.rwl, rd_)));
          row.push_back(n(fixed_or_dash(pr.li, rd_)));
          row.push_back(banded(band, str(band_name(band))));
          t.rows.push_back(std::move(row));
        }
      }
      s.blocks.push_back(std::move(t));
      std::vector<std::string> lines;
      for (std::size_t ti = 0; ti < ja.tasks.size(); ++ti) {
        const TaskResult& r = ja.tasks[ti];
        lines.push_back("Task " + r.id + ": LI " + (r.li ? fixed(*r.li, rd_) : std::string("undefined")) + ", " +
                        str(band_name(find_band(r.li, a_.bands))) + " (" + str(lift_end_name(r.governing)) +
                        " governs; FIRWL " + fixed(r.governing_point().firwl, rd_) + " " + mass_ + ", FILI " +
                        fixed_or_dash(r.governing_point().fili, rd_) + ")" +
                        (r.within_limits_of_application ? "" : "; outside the limits of application"));
        if (ja.reach[ti]) {
          const ReachResult& rr = *ja.reach[ti];
          const ReachCheck* worst = rr.find_worst_failure();
          lines.push_back("Reach, task " + r.id + ": small worker " + str(height_zone_name(rr.small_height_zone)) + ", " +
                          str(depth_zone_name(rr.depth_zone)) + ", margin " + fixed(rr.small_max_reach_margin_cm, 1) +
                          " cm" + (worst ? "; NOT MET: " + worst->message : std::string()));
        }
      }
      if (ja.composite) {
        const CompositeResult& cr = *ja.composite;
        lines.push_back("Composite Lifting Index: " +
                        (cr.cli ? fixed(*cr.cli, rd_) + " (" + str(band_name(find_band(cr.cli, a_.bands))) + ")"
                                : "undefined: " + cr.undefined_reason.value_or("")));
      }
      s.blocks.push_back(Bullets{lines});
      if (ja.composite && !ja.composite->terms.empty()) {
        Table ct;
        ct.header = {"#", "Task", "FILI", "STLI", "F /min", "Sum F", "FM(sum F)", "Adds"};
        for (std::size_t k = 0; k < ja.composite->terms.size(); ++k) {
          const CompositeTerm& term = ja.composite->terms[k];
          ct.rows.push_back({n(std::to_string(k + 1)), c(term.id), n(fixed_or_dash(term.fili, rd_)),
                             n(fixed_or_dash(term.stli, rd_)), n(fixed(term.frequency_per_min, 2)),
                             n(fixed(term.cumulative_frequency_per_min, 2)), n(fixed(term.fm_cumulative, md_)),
                             n(fixed(term.increment, 3))});
        }
        s.blocks.push_back(std::move(ct));
      }
    }
  }

  void warnings() {
    Section& s = section("Warnings and limits of application, per task", true);
    s.blocks.push_back(Paragraph{
        "The lifting equation applies only within its limits of application (Applications Manual 1.2): two-handed, "
        "standing, unrestricted lifting of stable loads at moderate speed, with carrying or pushing a small share of "
        "the work, good floor friction and moderate climate, at most 8 h. For each task: what the file states, the "
        "limits it is outside (the equation may underestimate its risk there), and every other warning."});
    s.blocks.push_back(Subheading{"Conditions stated in the file"});
    Table st;
    st.header = {"Task or zone", "Conditions stated (limits of application)"};
    st.widths_pct = {20, 80};
    if (a_.store)
      for (const Zone& z : p_.store.zones) st.rows.push_back({c("zone " + z.id + " (its slots)"), c(limits_stated_text(z.limits))});
    for (const LiftJob& j : p_.jobs)
      for (const LiftTask& t : j.tasks) st.rows.push_back({c("job " + j.id + ", task " + t.id), c(limits_stated_text(t.limits))});
    s.blocks.push_back(std::move(st));

    s.blocks.push_back(Subheading{"Warnings, task by task"});
    Table t;
    t.header = {"Task", "Within the limits of application", "Outside the limits", "Other warnings"};
    t.widths_pct = {14, 14, 30, 42};
    for (const JobAssessment& ja : a_.jobs) {
      if (!ja.warnings.empty())
        t.rows.push_back({c("job " + ja.id), c("-"), c(warnings_text({&ja.warnings}, u_, true, false)),
                          c(warnings_text({&ja.warnings}, u_, false, true))});
      for (const TaskResult& r : ja.tasks) {
        const std::string lim = warnings_text({&r.warnings}, u_, true, false);
        const std::string other = warnings_text({&r.warnings}, u_, false, true);
        t.rows.push_back({c("job " + ja.id + ", task " + r.id),
                          Cell{r.within_limits_of_application ? "yes" : "NO", false, std::nullopt,
                               !r.within_limits_of_application},
                          c(lim.empty() ? "none" : lim), c(other.empty() ? "none" : other)});
      }
    }
    if (a_.store)
      for (const SlotFinding& f : a_.store->findings) {
        const std::string lim = warnings_text({&f.result.warnings, &f.warnings}, u_, true, false);
        const std::string other = warnings_text({&f.result.warnings, &f.warnings}, u_, false, true);
        t.rows.push_back({c("slot " + f.slot_id),
                          Cell{f.result.within_limits_of_application ? "yes" : "NO", false, std::nullopt,
                               !f.result.within_limits_of_application},
                          c(lim.empty() ? "none" : lim), c(other.empty() ? "none" : other)});
      }
    s.blocks.push_back(std::move(t));
    if (a_.store && !a_.store->warnings.empty()) {
      std::vector<std::string> items;
      for (const Warning& w : a_.store->warnings) items.push_back(describe_warning(w, u_) + " [" + str(warning_code(w)) + "]");
      s.blocks.push_back(Subheading{"Store-level warnings"});
      s.blocks.push_back(Bullets{items});
    }
  }

  void cautions() {
    Section& s = section("Cautions", true);
    s.blocks.push_back(Notice{"Caution", caution_text, false});
    std::vector<std::string> items = {
        "This report screens; it does not certify. It records what was assessed, with which inputs and method, "
        "and what the tool found.",
        "Risk bands: LI 1.0 and 3.0 are the Applications Manual's interpretation points (1.4); the 2.0 boundary "
        "and the band words are Rackreach's presentation.",
        "Reach checks use percentiles of a workforce drawn from anthropometric survey data; each body dimension is "
        "the percentile of that dimension on its own, so a \"5th-percentile worker\" is not one person.",
        "Tasks outside the equation (a zero multiplier, more than 8 h of lifting) are given no LI; tasks outside "
        "its limits of application are marked in the section \"Warnings and limits of application\".",
    };
    if (a_.store)
      for (const Warning& w : a_.store->warnings) items.push_back(describe_warning(w, u_));
    s.blocks.push_back(Bullets{items});
  }

  void sign_off() {
    Section& s = section("Sign-off", false);
    s.blocks.push_back(Paragraph{"Signed to record that this screening was reviewed, with its inputs (input SHA-256 " +
                                 ctx_.input_sha256 + "), method and cautions, on the date written beside each name."});
    s.blocks.push_back(SignOff{{"Assessed by", "Reviewed by", "Approved by (supervisor)"},
                               {ctx_.assessor ? *ctx_.assessor : p_.info.assessor.value_or(""), "", ""}});
  }

  const Project& p_;
  const ProjectAssessment& a_;
  const ReportContext& ctx_;
  UnitSystem u_ = UnitSystem::metric;
  std::string len_, mass_;
  int rd_ = 2, md_ = 3;
  ReportDocument doc_;
};

}  // namespace

ReportDocument build_report(const Project& project, const ProjectAssessment& assessment, const ReportContext& context) {
  return Builder(project, assessment, context).build();
}

std::vector<std::string> find_slots_above_limit(const ProjectAssessment& assessment) {
  std::vector<std::string> out;
  if (!assessment.store) return out;
  for (const SlotFinding& f : assessment.store->findings)
    if (!f.truck_access && f.result.li && *f.result.li > assessment.bands.elevated_above) out.push_back(f.slot_id);
  return out;
}

}  // namespace rackreach::report
