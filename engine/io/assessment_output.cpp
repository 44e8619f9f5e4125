// SPDX-License-Identifier: MIT
#include "engine/io/assessment_output.hpp"

#include <algorithm>
#include <charconv>
#include <cstdio>

#include "engine/caution.hpp"
#include "engine/io/json_writer.hpp"
#include "engine/io/review_output.hpp"
#include "engine/io/text_columns.hpp"
#include "engine/version.hpp"

namespace rackreach {
namespace {

void write_point(JsonWriter& w, const PointResult& p) {
  w.begin_object();
  w.field("hm", p.hm.value).field("vm", p.vm.value).field("dm", p.dm.value).field("am", p.am.value);
  w.field("fm", p.fm.value).field("cm", p.cm.value);
  w.field("rwl", p.rwl).field("firwl", p.firwl).field("strwl", p.strwl);
  w.field("li", p.li).field("fili", p.fili).field("stli", p.stli);
  w.key("used").begin_object();
  w.field("h", p.hm.input_used).field("v", p.vm.input_used).field("d", p.dm.input_used);
  w.field("a", p.am.input_used).field("f", p.fm.input_used);
  w.end_object();
  w.key("rules_applied").begin_array();
  for (const Multiplier* m : {&p.hm, &p.vm, &p.dm, &p.am, &p.fm})
    if (m->rule != BoundaryRule::none) w.value(boundary_rule_code(m->rule));
  w.end_array();
  w.end_object();
}

void write_warnings(JsonWriter& w, const std::vector<Warning>& ws, UnitSystem u) {
  w.begin_array();
  for (const Warning& x : ws) w.begin_object().field("code", warning_code(x)).field("message", describe_warning(x, u)).end_object();
  w.end_array();
}

void write_lift_point(JsonWriter& w, const LiftPoint& p) {
  w.begin_object().field("h", p.h).field("v", p.v).field("a", p.a_deg).end_object();
}

void write_reach(JsonWriter& w, const ReachResult& r) {
  w.begin_object();
  w.field("small_height_zone", height_zone_name(r.small_height_zone));
  w.field("large_height_zone", height_zone_name(r.large_height_zone));
  w.field("depth_zone", depth_zone_name(r.depth_zone));
  w.field("small_shoulder_to_grip_cm", r.small_shoulder_to_grip_cm);
  w.field("small_max_reach_margin_cm", r.small_max_reach_margin_cm);
  w.field("small_comfortable_reach_margin_cm", r.small_comfortable_reach_margin_cm);
  w.field("h_cm", r.h_cm).field("v_cm", r.v_cm);
  w.key("checks").begin_array();
  for (const ReachCheck& c : r.checks) {
    w.begin_object().field("code", c.code);
    if (c.worker) w.field("worker", reach_worker_name(*c.worker));
    else w.key("worker").null();
    w.field("dimension", c.dimension).field("available_cm", c.available_cm).field("needed_cm", c.needed_cm);
    w.field("margin_cm", c.margin_cm).field("passed", c.passed).field("advisory", c.advisory);
    w.key("parameters").begin_array();
    for (const std::string& p : c.parameters) w.value(p);
    w.end_array();
    w.field("message", c.message).end_object();
  }
  w.end_array();
  w.end_object();
}

void write_reach_model(JsonWriter& w, const Project& project, const ReachSetup& setup) {
  const ReachParameters& p = setup.parameters;
  w.begin_object();
  w.field("workforce", setup.workforce);
  w.field("small_worker", setup.small.label).field("large_worker", setup.large.label);
  w.key("parameters_cm").begin_object();
  w.field("ankle_to_rack_face", p.ankle_to_rack_face_cm).field("footwear_allowance", p.footwear_allowance_cm);
  w.field("shoulder_ahead_of_ankles", p.shoulder_ahead_of_ankles_cm);
  w.field("shoulder_pivot_below_acromion", p.shoulder_pivot_below_acromion_cm);
  w.field("hand_clearance_allowance", p.hand_clearance_allowance_cm);
  w.end_object();
  w.field("comfortable_reach_fraction", p.comfortable_reach_fraction);
  w.field("hand_above_grip_fraction_of_breadth", p.hand_above_grip_fraction_of_breadth);
  w.key("set_in_file").begin_array();
  for (const std::string& name : project.reach_parameters_set) w.value(name);
  w.end_array();
  w.end_object();
}

void write_job(JsonWriter& w, const LiftJob& job, const JobAssessment& ja, const RiskBands& bands, UnitSystem u) {
  w.begin_object();
  w.field("id", ja.id);
  if (job.name) w.field("name", *job.name);
  w.key("duration").begin_object();
  if (ja.duration.category) w.field("category", duration_name(*ja.duration.category));
  else w.key("category").null();
  w.field("declared", ja.duration_declared);
  if (ja.duration_declared) w.key("longest_lifting_min").null();
  else w.field("longest_lifting_min", ja.duration.longest_lifting_min);
  w.field("rule", duration_rule_name(ja.duration.rule)).field("explanation", ja.duration.explanation);
  w.end_object();
  w.key("tasks").begin_array();
  for (std::size_t i = 0; i < ja.tasks.size(); ++i) {
    const LiftTask& t = job.tasks[i];
    const TaskResult& r = ja.tasks[i];
    w.begin_object();
    w.field("id", r.id).field("load", t.load).field("max_load", t.max_load).field("frequency", t.frequency_per_min);
    w.field("coupling", coupling_name(t.coupling)).field("control_at_destination", t.control_at_destination);
    w.key("input").begin_object();
    w.key("origin");
    write_lift_point(w, t.origin);
    w.key("destination");
    write_lift_point(w, t.destination);
    w.end_object();
    if (const auto& s = job.details[i].frequency_sample) {
      w.key("frequency_sample").begin_object();
      w.field("lifts_per_min", s->lifts_per_min).field("lifting_min", s->lifting_min).field("sample_min", s->sample_min);
      w.end_object();
    }
    w.key("origin");
    write_point(w, r.origin);
    w.key("destination");
    write_point(w, r.destination);
    w.field("governing", lift_end_name(r.governing)).field("li", r.li).field("band", band_name(find_band(r.li, bands)));
    w.field("outside_equation", r.outside_equation).field("within_limits_of_application", r.within_limits_of_application);
    if (ja.reach[i]) {
      w.key("reach");
      write_reach(w, *ja.reach[i]);
    }
    w.key("warnings");
    write_warnings(w, r.warnings, u);
    w.end_object();
  }
  w.end_array();
  if (ja.composite) {
    const CompositeResult& c = *ja.composite;
    w.field("cli", c.cli).field("cli_band", band_name(find_band(c.cli, bands)));
    if (c.undefined_reason) w.field("cli_undefined_reason", *c.undefined_reason);
    w.key("cli_terms").begin_array();
    for (const CompositeTerm& t : c.terms) {
      w.begin_object().field("task", t.id).field("fili", t.fili).field("stli", t.stli);
      w.field("frequency", t.frequency_per_min).field("cumulative_frequency", t.cumulative_frequency_per_min);
      w.field("fm_cumulative", t.fm_cumulative).field("increment", t.increment).end_object();
    }
    w.end_array();
  }
  w.key("warnings");
  write_warnings(w, ja.warnings, u);
  w.end_object();
}

using text::fixed;
using text::pad_left;
using text::pad_right;

}  // namespace

std::string write_assessment_json(const Project& project, const ProjectAssessment& a, const OutputHeader& h) {
  const UnitSystem u = a.units;
  std::string out;
  JsonWriter w(out);
  // One job per line: a large output stays readable with line tools.
  w.begin_object();
  w.field("rackreach_output", 1);
  w.line_break("\n ");
  w.key("engine").begin_object().field("name", "rackreach").field("version", engine_version);
  w.field("method", lifting_method_text).end_object();
  w.line_break("\n ");
  w.field("input", h.input_name);
  w.line_break("\n ");
  w.key("units").begin_object().field("system", unit_system_name(u)).field("length", length_unit(u));
  w.field("mass", mass_unit(u)).field("angle", "deg").field("frequency", "lifts/min").end_object();
  w.line_break("\n ");
  w.field("rounding", a.rounding == RoundingMode::full ? "full" : "worksheet");
  w.field("duration_rule", duration_rule_name(a.duration_rule));
  w.line_break("\n ");
  w.key("bands").begin_object().field("elevated_above", a.bands.elevated_above);
  w.field("high_above", a.bands.high_above).field("very_high_above", a.bands.very_high_above).end_object();
  w.line_break("\n ");
  w.field("caution", caution_text);
  w.line_break("\n ");
  if (a.reach) {
    w.key("reach_model");
    write_reach_model(w, project, *a.reach);
    w.line_break("\n ");
  }
  if (a.store) {
    w.key("store");
    write_review_json(w, project, *a.store, a.rounding);
    w.line_break("\n ");
  }
  w.key("jobs").begin_array();
  for (std::size_t i = 0; i < a.jobs.size(); ++i) {
    w.line_break("\n  ");
    write_job(w, project.jobs[i], a.jobs[i], a.bands, u);
  }
  w.raw("\n ");
  w.end_array();
  w.line_break("\n ");
  // Every warning once more, by code and place, for programs that only scan for codes; the words are in the jobs.
  w.key("warnings").begin_array();
  for (const JobAssessment& ja : a.jobs) {
    for (const Warning& x : ja.warnings) w.begin_object().field("code", warning_code(x)).field("job", ja.id).end_object();
    for (const TaskResult& t : ja.tasks)
      for (const Warning& x : t.warnings)
        w.begin_object().field("code", warning_code(x)).field("job", ja.id).field("task", t.id).end_object();
  }
  w.end_array();
  w.raw("\n");
  w.end_object();
  w.raw("\n");
  w.finish();
  return out;
}

std::string write_assessment_table(const Project& project, const ProjectAssessment& a, const OutputHeader& h) {
  const UnitSystem u = a.units;
  const bool ws = a.rounding == RoundingMode::worksheet;
  const int md = ws ? 2 : 3;  // multiplier decimals
  const int rd = ws ? 1 : 2;  // weight and index decimals
  const std::string len(length_unit(u)), mass(mass_unit(u));
  std::string s;
  s += "Rackreach " + std::string(engine_version) + ": lift assessment of " + h.input_name + "\n";
  if (project.info.site || project.info.assessor || project.info.date)
    s += "Site: " + project.info.site.value_or("-") + "   Assessor: " + project.info.assessor.value_or("-") +
         "   Date: " + project.info.date.value_or("-") + "\n";
  s += "Method: " + std::string(lifting_method_text) + "\n";
  s += "Units: " + std::string(unit_system_name(u)) + " (lengths " + len + ", loads and limits " + mass +
       ", angles deg, frequency lifts/min)   Rounding: " + (ws ? "worksheet (multipliers 2 dp, weights and indices 1 dp)" : "full precision") +
       "   Duration rule: " + std::string(duration_rule_name(a.duration_rule)) + " edition\n";
  if (a.reach) {
    const ReachParameters& p = a.reach->parameters;
    s += "Reach: workforce " + a.reach->workforce + "; reach for the " + a.reach->small.label + ", clearance for the " +
         a.reach->large.label + "; standing " + fixed(p.ankle_to_rack_face_cm, 1) +
         " cm from the rack face (ankles), footwear " + fixed(p.footwear_allowance_cm, 1) + " cm, comfortable reach " +
         fixed(p.comfortable_reach_fraction * 100.0, 0) + "% of maximum" +
         (project.reach_parameters_set.empty() ? std::string(" (defaults)") : std::string(" (some set in the file)")) +
         "\n";
  }
  s += "Bands: LI <= " + fixed(a.bands.elevated_above, 1) + " within limit; <= " + fixed(a.bands.high_above, 1) +
       " elevated; <= " + fixed(a.bands.very_high_above, 1) + " high; above: very high\n";

  std::size_t id_width = 6;
  for (const JobAssessment& ja : a.jobs)
    for (const TaskResult& r : ja.tasks) id_width = std::max(id_width, r.id.size() + 2);
  const std::vector<std::pair<std::string, std::size_t>> cols = {
      {"task", id_width}, {"end", 13}, {"H " + len, 7}, {"V " + len, 7}, {"D " + len, 7}, {"A deg", 6}, {"F /min", 7},
      {"HM", 6},    {"VM", 6},   {"DM", 6},       {"AM", 6},       {"FM", 6},       {"CM", 6},    {"RWL " + mass, 8},
      {"LI", 6},    {"  band", 16}};
  for (std::size_t ji = 0; ji < a.jobs.size(); ++ji) {
    const JobAssessment& ja = a.jobs[ji];
    const LiftJob& job = project.jobs[ji];
    s += "\nJob " + ja.id + (job.name ? " (" + *job.name + ")" : "") + ": duration ";
    s += ja.duration.category ? std::string(duration_name(*ja.duration.category)) + " (" +
                                    std::string(duration_limit_text(*ja.duration.category)) + ")"
                              : std::string("more than 8 h: OUTSIDE THE EQUATION");
    s += ja.duration_declared ? ", declared\n" : ", from the work pattern: " + ja.duration.explanation + "\n";
    std::string header;
    for (std::size_t c = 0; c < cols.size(); ++c)
      header += c < 2 || c == cols.size() - 1 ? pad_right(cols[c].first, cols[c].second) : pad_left(cols[c].first, cols[c].second);
    s += "  " + header + "\n";
    for (std::size_t ti = 0; ti < ja.tasks.size(); ++ti) {
      const TaskResult& r = ja.tasks[ti];
      const LiftTask& t = job.tasks[ti];
      for (LiftEnd end : {LiftEnd::origin, LiftEnd::destination}) {
        const PointResult& p = end == LiftEnd::origin ? r.origin : r.destination;
        const LiftPoint& lp = end == LiftEnd::origin ? t.origin : t.destination;
        std::string end_text = std::string(lift_end_name(end)) + (end == r.governing ? " *" : "");
        std::string row;
        row += pad_right(end == LiftEnd::origin ? r.id : "", id_width);
        row += pad_right(end_text, 13);
        row += pad_left(fixed(lp.h, 1), 7) + pad_left(fixed(lp.v, 1), 7) +
               pad_left(fixed(std::abs(t.destination.v - t.origin.v), 1), 7) + pad_left(fixed(lp.a_deg, 0), 6) +
               pad_left(fixed(t.frequency_per_min, 2), 7);
        for (const Multiplier* m : {&p.hm, &p.vm, &p.dm, &p.am, &p.fm, &p.cm}) row += pad_left(fixed(m->value, md), 6);
        row += pad_left(fixed(p.rwl, rd), 8);
        row += pad_left(p.li ? fixed(*p.li, rd) : std::string("-"), 6);
        row += "  " + std::string(band_name(find_band(p.li, a.bands)));
        s += "  " + row + "\n";
      }
    }
    s += "  (* the end that governs the task's LI: the destination only with significant control and a lower RWL)\n";
    for (const TaskResult& r : ja.tasks)
      s += "  Task " + r.id + ": LI " + (r.li ? fixed(*r.li, rd) : std::string("undefined")) + ", " +
           std::string(band_name(find_band(r.li, a.bands))) + " (" + std::string(lift_end_name(r.governing)) +
           "; FIRWL " + fixed(r.governing_point().firwl, rd) + " " + mass + ", FILI " +
           (r.governing_point().fili ? fixed(*r.governing_point().fili, rd) : std::string("-")) + ")" +
           (r.within_limits_of_application ? "" : "; outside the limits of application, see warnings") + "\n";
    for (std::size_t ti = 0; ti < ja.tasks.size(); ++ti) {
      if (!ja.reach[ti]) continue;
      const ReachResult& rr = *ja.reach[ti];
      s += "  Reach, task " + ja.tasks[ti].id + ": grip " + fixed(rr.v_cm, 1) + " cm high, " +
           fixed(job.details[ti].shelf ? Length{job.details[ti].shelf->grip_depth, u}.in_cm() : 0.0, 1) +
           " cm deep (implied H " + fixed(rr.h_cm, 1) + " cm); small worker: " +
           std::string(height_zone_name(rr.small_height_zone)) + ", " + std::string(depth_zone_name(rr.depth_zone)) +
           ", reach margin " + fixed(rr.small_max_reach_margin_cm, 1) + " cm; large worker: " +
           std::string(height_zone_name(rr.large_height_zone)) + "\n";
      if (const ReachCheck* worst = rr.find_worst_failure()) s += "    NOT MET: " + worst->message + "\n";
    }
    if (ja.composite) {
      const CompositeResult& c = *ja.composite;
      s += "  Composite Lifting Index: " +
           (c.cli ? fixed(*c.cli, rd) + " (" + std::string(band_name(find_band(c.cli, a.bands))) + ")"
                  : "undefined: " + c.undefined_reason.value_or("")) +
           "\n";
      s += "    " + pad_left("#", 3) + "  " + pad_right("task", id_width) + pad_left("FILI", 7) + pad_left("STLI", 7) +
           pad_left("F /min", 8) + pad_left("sum F", 8) + pad_left("FM(sum)", 8) + pad_left("adds", 8) + "\n";
      for (std::size_t k = 0; k < c.terms.size(); ++k) {
        const CompositeTerm& t = c.terms[k];
        s += "    " + pad_left(std::to_string(k + 1), 3) + "  " + pad_right(t.id, id_width) +
             pad_left(t.fili ? fixed(*t.fili, rd) : "-", 7) + pad_left(t.stli ? fixed(*t.stli, rd) : "-", 7) +
             pad_left(fixed(t.frequency_per_min, 2), 8) + pad_left(fixed(t.cumulative_frequency_per_min, 2), 8) +
             pad_left(fixed(t.fm_cumulative, md), 8) + pad_left(fixed(t.increment, 3), 8) + "\n";
      }
    }
    bool any = !ja.warnings.empty();
    for (const TaskResult& r : ja.tasks) any = any || !r.warnings.empty();
    if (any) {
      s += "  Warnings:\n";
      for (const Warning& w : ja.warnings)
        s += "    - " + describe_warning(w, u) + " [" + std::string(warning_code(w)) + "]\n";
      for (const TaskResult& r : ja.tasks)
        for (const Warning& w : r.warnings)
          s += "    - task \"" + r.id + "\": " + describe_warning(w, u) + " [" + std::string(warning_code(w)) + "]\n";
    }
  }
  if (a.store) s += write_review_table(project, *a.store, a.rounding);
  s += "\nCaution: " + std::string(caution_text) + "\n";
  return s;
}

std::string write_assessment_html(const Project& project, const ProjectAssessment& a, const OutputHeader& h) {
  ProjectAssessment jobs_only = a;
  jobs_only.store.reset();
  std::string jobs_text = a.jobs.empty() ? std::string() : write_assessment_table(project, jobs_only, h);
  const std::string escaped = text::html_escape(jobs_text);
  std::string page = a.store ? write_review_html(project, *a.store, h.input_name)
                             : "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>Rackreach lift "
                               "assessment</title></head><body>\n<p>" + std::string(caution_text) + "</p>\n</body></html>\n";
  if (!escaped.empty()) {
    const auto at = page.rfind("</body>");
    page.insert(at, "<h2>Lift jobs</h2>\n<pre>" + escaped + "</pre>\n");
  }
  return page;
}

std::string csv_cell(std::string_view text) {
  std::string s(text);
  if (!s.empty() && (s[0] == '=' || s[0] == '+' || s[0] == '-' || s[0] == '@' || s[0] == '\t' || s[0] == '\r')) {
    double ignored = 0.0;
    const auto [ptr, ec] = std::from_chars(s.data(), s.data() + s.size(), ignored);
    const bool plain_number = ec == std::errc() && ptr == s.data() + s.size();
    if (!plain_number) s.insert(s.begin(), '\'');
  }
  if (s.find_first_of(",\"\r\n") != std::string::npos) {
    std::string q = "\"";
    for (char ch : s) q += ch == '"' ? std::string("\"\"") : std::string(1, ch);
    return q + "\"";
  }
  return s;
}

std::string write_assessment_csv(const Project& project, const ProjectAssessment& a, const OutputHeader&) {
  const std::string len(length_unit(a.units)), mass(mass_unit(a.units));
  std::string s = "job,task,end,governing,h_" + len + ",v_" + len + ",d_" + len +
                  ",a_deg,frequency_per_min,hm,vm,dm,am,fm,cm,rwl_" + mass + ",firwl_" + mass + ",strwl_" + mass +
                  ",li,fili,stli,band,task_li,job_cli,duration,warnings\n";
  auto num = [](double x) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", x);
    return std::string(buf);
  };
  auto onum = [&](const std::optional<double>& x) { return x ? num(*x) : std::string(); };
  for (std::size_t ji = 0; ji < a.jobs.size(); ++ji) {
    const JobAssessment& ja = a.jobs[ji];
    const LiftJob& job = project.jobs[ji];
    const std::string cli = ja.composite ? onum(ja.composite->cli) : std::string();
    const std::string duration = ja.duration.category ? std::string(duration_name(*ja.duration.category)) : "over_8h";
    for (std::size_t ti = 0; ti < ja.tasks.size(); ++ti) {
      const TaskResult& r = ja.tasks[ti];
      const LiftTask& t = job.tasks[ti];
      std::string codes;
      for (const Warning& w : r.warnings) codes += (codes.empty() ? "" : ";") + std::string(warning_code(w));
      for (LiftEnd end : {LiftEnd::origin, LiftEnd::destination}) {
        const PointResult& p = end == LiftEnd::origin ? r.origin : r.destination;
        const LiftPoint& lp = end == LiftEnd::origin ? t.origin : t.destination;
        s += csv_cell(ja.id) + "," + csv_cell(r.id) + "," + std::string(lift_end_name(end)) + "," +
             (end == r.governing ? "yes" : "no") + "," + num(lp.h) + "," + num(lp.v) + "," +
             num(std::abs(t.destination.v - t.origin.v)) + "," + num(lp.a_deg) + "," + num(t.frequency_per_min);
        for (const Multiplier* m : {&p.hm, &p.vm, &p.dm, &p.am, &p.fm, &p.cm}) s += "," + num(m->value);
        s += "," + num(p.rwl) + "," + num(p.firwl) + "," + num(p.strwl) + "," + onum(p.li) + "," + onum(p.fili) + "," +
             onum(p.stli) + "," + std::string(band_name(find_band(p.li, a.bands))) + "," + onum(r.li) + "," + cli +
             "," + duration + "," + csv_cell(codes) + "\n";
      }
    }
  }
  return s;
}

}  // namespace rackreach
