// SPDX-License-Identifier: MIT
#include "engine/io/assessment_output.hpp"

#include <algorithm>
#include <charconv>
#include <cstdio>
#include <nlohmann/json.hpp>

#include "engine/caution.hpp"
#include "engine/version.hpp"

namespace rackreach {
namespace {

using ojson = nlohmann::ordered_json;

ojson opt(const std::optional<double>& x) { return x ? ojson(*x) : ojson(nullptr); }

ojson point_json(const PointResult& p) {
  ojson rules = ojson::array();
  for (const Multiplier* m : {&p.hm, &p.vm, &p.dm, &p.am, &p.fm})
    if (m->rule != BoundaryRule::none) rules.push_back(boundary_rule_code(m->rule));
  return ojson{{"hm", p.hm.value},
               {"vm", p.vm.value},
               {"dm", p.dm.value},
               {"am", p.am.value},
               {"fm", p.fm.value},
               {"cm", p.cm.value},
               {"rwl", p.rwl},
               {"firwl", p.firwl},
               {"strwl", p.strwl},
               {"li", opt(p.li)},
               {"fili", opt(p.fili)},
               {"stli", opt(p.stli)},
               {"used", {{"h", p.hm.input_used},
                         {"v", p.vm.input_used},
                         {"d", p.dm.input_used},
                         {"a", p.am.input_used},
                         {"f", p.fm.input_used}}},
               {"rules_applied", rules}};
}

ojson warnings_json(const std::vector<Warning>& ws) {
  ojson out = ojson::array();
  for (const Warning& w : ws) out.push_back({{"code", w.code}, {"message", w.message}});
  return out;
}

ojson job_json(const LiftJob& job, const JobAssessment& ja, const RiskBands& bands) {
  ojson tasks = ojson::array();
  for (std::size_t i = 0; i < ja.tasks.size(); ++i) {
    const LiftTask& t = job.tasks[i];
    const TaskResult& r = ja.tasks[i];
    ojson task{{"id", r.id},
               {"load", t.load},
               {"max_load", t.max_load ? ojson(*t.max_load) : ojson(nullptr)},
               {"frequency", t.frequency_per_min},
               {"coupling", coupling_name(t.coupling)},
               {"control_at_destination", t.control_at_destination},
               {"input", {{"origin", {{"h", t.origin.h}, {"v", t.origin.v}, {"a", t.origin.a_deg}}},
                          {"destination", {{"h", t.destination.h}, {"v", t.destination.v}, {"a", t.destination.a_deg}}}}}};
    if (const auto& s = job.frequency_samples[i])
      task["frequency_sample"] = {{"lifts_per_min", s->lifts_per_min},
                                  {"lifting_min", s->lifting_min},
                                  {"sample_min", s->sample_min}};
    task["origin"] = point_json(r.origin);
    task["destination"] = point_json(r.destination);
    task["governing"] = lift_end_name(r.governing);
    task["li"] = opt(r.li);
    task["band"] = band_name(find_band(r.li, bands));
    task["outside_equation"] = r.outside_equation;
    task["within_limits_of_application"] = r.within_limits_of_application;
    task["warnings"] = warnings_json(r.warnings);
    tasks.push_back(std::move(task));
  }
  ojson j{{"id", ja.id}};
  if (job.name) j["name"] = *job.name;
  j["duration"] = {{"category", ja.duration.category ? ojson(duration_name(*ja.duration.category)) : ojson(nullptr)},
                   {"declared", ja.duration_declared},
                   {"longest_lifting_min", ja.duration_declared ? ojson(nullptr) : ojson(ja.duration.longest_lifting_min)},
                   {"rule", duration_rule_name(ja.duration.rule)},
                   {"explanation", ja.duration.explanation}};
  j["tasks"] = std::move(tasks);
  if (ja.composite) {
    j["cli"] = opt(ja.composite->cli);
    j["cli_band"] = band_name(find_band(ja.composite->cli, bands));
    if (ja.composite->undefined_reason) j["cli_undefined_reason"] = *ja.composite->undefined_reason;
    ojson terms = ojson::array();
    for (const CompositeTerm& t : ja.composite->terms)
      terms.push_back({{"task", t.id},
                       {"fili", opt(t.fili)},
                       {"stli", opt(t.stli)},
                       {"frequency", t.frequency_per_min},
                       {"cumulative_frequency", t.cumulative_frequency_per_min},
                       {"fm_cumulative", t.fm_cumulative},
                       {"increment", t.increment}});
    j["cli_terms"] = std::move(terms);
  }
  j["warnings"] = warnings_json(ja.warnings);
  return j;
}

std::string fixed(double x, int decimals) {
  char buf[48];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, x);
  return buf;
}

std::string pad_left(const std::string& s, std::size_t w) { return s.size() >= w ? s : std::string(w - s.size(), ' ') + s; }
std::string pad_right(const std::string& s, std::size_t w) { return s.size() >= w ? s : s + std::string(w - s.size(), ' '); }

}  // namespace

std::string write_assessment_json(const Project& project, const ProjectAssessment& a, const OutputHeader& h) {
  const UnitSystem u = a.units;
  ojson head{{"rackreach_output", 1},
             {"engine", {{"name", "rackreach"}, {"version", engine_version}, {"method", lifting_method_text}}},
             {"input", h.input_name},
             {"units", {{"system", unit_system_name(u)},
                        {"length", length_unit(u)},
                        {"mass", mass_unit(u)},
                        {"angle", "deg"},
                        {"frequency", "lifts/min"}}},
             {"rounding", a.rounding == RoundingMode::full ? "full" : "worksheet"},
             {"duration_rule", duration_rule_name(a.duration_rule)},
             {"bands", {{"elevated_above", a.bands.elevated_above},
                        {"high_above", a.bands.high_above},
                        {"very_high_above", a.bands.very_high_above}}},
             {"caution", caution_text}};
  // Jobs are written one at a time so that a large file never holds its whole output as a JSON tree.
  std::string out = head.dump(2);
  out.pop_back();  // the closing brace
  while (!out.empty() && (out.back() == '\n' || out.back() == ' ')) out.pop_back();
  out += ",\n  \"jobs\": [";
  ojson all_warnings = ojson::array();
  for (std::size_t i = 0; i < a.jobs.size(); ++i) {
    const JobAssessment& ja = a.jobs[i];
    out += i == 0 ? "\n    " : ",\n    ";
    out += job_json(project.jobs[i], ja, a.bands).dump();
    for (const Warning& w : ja.warnings) all_warnings.push_back({{"code", w.code}, {"job", ja.id}, {"message", w.message}});
    for (const TaskResult& t : ja.tasks)
      for (const Warning& w : t.warnings)
        all_warnings.push_back({{"code", w.code}, {"job", ja.id}, {"task", t.id}, {"message", w.message}});
  }
  out += "\n  ],\n  \"warnings\": " + all_warnings.dump() + "\n}\n";
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
      for (const Warning& w : ja.warnings) s += "    - " + w.message + " [" + w.code + "]\n";
      for (const TaskResult& r : ja.tasks)
        for (const Warning& w : r.warnings) s += "    - task \"" + r.id + "\": " + w.message + " [" + w.code + "]\n";
    }
  }
  s += "\nCaution: " + std::string(caution_text) + "\n";
  return s;
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
      for (const Warning& w : r.warnings) codes += (codes.empty() ? "" : ";") + w.code;
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
