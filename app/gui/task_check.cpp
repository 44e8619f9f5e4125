// SPDX-License-Identifier: MIT
#include "app/gui/task_check.hpp"

#include <charconv>
#include <cstdio>

#include <nlohmann/json.hpp>

#include "engine/io/project_file.hpp"

namespace rackreach::gui {
namespace {

using nlohmann::json;

/// A number where the text is one, else the text itself, so that the loader reports it as the wrong type.
json typed(const std::string& text) {
  std::size_t b = text.find_first_not_of(" \t"), e = text.find_last_not_of(" \t");
  if (b == std::string::npos) return text;
  const std::string t = text.substr(b, e - b + 1);
  double v = 0.0;
  auto [end, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
  if (ec == std::errc() && end == t.data() + t.size()) return v;
  return t;
}

bool blank(const std::string& s) { return s.find_first_not_of(" \t") == std::string::npos; }

void put(json& j, const char* key, const std::string& text) {
  if (!blank(text)) j[key] = typed(text);
}

std::string number_text(double v) {
  char buf[64];
  auto [end, ec] = std::to_chars(buf, buf + sizeof buf, v);
  return ec == std::errc() ? std::string(buf, end) : std::string{};
}

const std::string task_prefix = "jobs[0].tasks[0].";
const std::string job_prefix = "jobs[0].";

}  // namespace

std::string make_task_project_json(const TaskFields& f, UnitSystem units, DurationRule rule) {
  json task = json::object();
  task["id"] = f.task_id;
  put(task, "load", f.load);
  put(task, "max_load", f.max_load);
  put(task, "frequency", f.frequency);
  task["coupling"] = f.coupling;
  json o = json::object(), d = json::object();
  put(o, "h", f.origin_h);
  put(o, "v", f.origin_v);
  put(o, "a", f.origin_a);
  put(d, "h", f.destination_h);
  put(d, "v", f.destination_v);
  put(d, "a", f.destination_a);
  task["origin"] = o;
  task["destination"] = d;
  task["control_at_destination"] = f.control_at_destination;
  json limits = json::object();
  if (f.one_handed) limits["one_handed"] = true;
  if (f.seated_or_kneeling) limits["seated_or_kneeling"] = true;
  if (f.restricted_space) limits["restricted_space"] = true;
  if (f.unstable_load) limits["unstable_load"] = true;
  if (f.wheelbarrow_or_shovel) limits["wheelbarrow_or_shovel"] = true;
  if (f.high_speed) limits["high_speed"] = true;
  put(limits, "carry_push_share", f.carry_push_share);
  put(limits, "floor_friction", f.floor_friction);
  put(limits, "temperature_c", f.temperature_c);
  put(limits, "humidity_pct", f.humidity_pct);
  if (!limits.empty()) task["limits"] = limits;

  json job = json::object();
  job["id"] = f.job_id.empty() ? "J1" : f.job_id;
  if (f.duration == "pattern") {
    json pattern = json::array();
    for (const WorkPeriod& p : f.work_pattern)
      pattern.push_back(p.kind == WorkPeriod::Kind::lifting ? json{{"lifting_min", p.minutes}} : json{{"recovery_min", p.minutes}});
    job["work_pattern"] = pattern;
  } else {
    job["duration"] = f.duration;
  }
  job["tasks"] = json::array({task});
  json root = {{"rackreach", 1},
               {"units", std::string(unit_system_name(units))},
               {"duration_rule", std::string(duration_rule_name(rule))},
               {"jobs", json::array({job})}};
  return root.dump();
}

TaskCheck check_task(const TaskFields& fields, UnitSystem units, DurationRule rule) {
  TaskCheck out;
  LoadResult r = load_project_text(make_task_project_json(fields, units, rule));
  for (const Problem& p : r.problems) {
    std::string key = p.path;
    if (key.rfind(task_prefix, 0) == 0) key = key.substr(task_prefix.size());
    else if (key.rfind(job_prefix, 0) == 0) key = key.substr(job_prefix.size());
    if (key == "work_pattern" || key.rfind("work_pattern", 0) == 0) key = "duration";
    std::string message = p.rule;
    if (!p.value.empty()) message += "; it is " + p.value;
    else if (p.code == "missing_key")
      message = p.rule.find("required") != std::string::npos ? p.rule : "required: " + p.rule;
    bool known = false;
    for (const char* k : task_field_keys) known = known || key == k;
    if (known) {
      auto& slot = out.field_problems[key];
      slot += (slot.empty() ? "" : "; ") + message;
    } else {
      out.other_problems.push_back((p.path.empty() ? "" : p.path + ": ") + message);
    }
  }
  if (!r.project || !r.problems.empty()) return out;
  out.job = r.project->jobs.at(0);
  out.result = assess_job(*out.job, units, rule, RoundingMode::full);
  return out;
}

TaskFields make_task_fields(const LiftJob& job, std::size_t index) {
  TaskFields f;
  f.job_id = job.id;
  if (job.declared_duration) f.duration = std::string(duration_name(*job.declared_duration));
  else {
    f.duration = "pattern";
    f.work_pattern = job.work_pattern;
  }
  if (index >= job.tasks.size()) return f;
  const LiftTask& t = job.tasks[index];
  f.task_id = t.id;
  f.load = number_text(t.load);
  if (t.max_load) f.max_load = number_text(*t.max_load);
  f.frequency = number_text(t.frequency_per_min);
  f.coupling = std::string(coupling_name(t.coupling));
  f.origin_h = number_text(t.origin.h);
  f.origin_v = number_text(t.origin.v);
  f.origin_a = number_text(t.origin.a_deg);
  f.destination_h = number_text(t.destination.h);
  f.destination_v = number_text(t.destination.v);
  f.destination_a = number_text(t.destination.a_deg);
  f.control_at_destination = t.control_at_destination;
  const LimitsOfApplication& l = t.limits;
  f.one_handed = l.one_handed.value_or(false);
  f.seated_or_kneeling = l.seated_or_kneeling.value_or(false);
  f.restricted_space = l.restricted_space.value_or(false);
  f.unstable_load = l.unstable_load.value_or(false);
  f.wheelbarrow_or_shovel = l.wheelbarrow_or_shovel.value_or(false);
  f.high_speed = l.high_speed.value_or(false);
  if (l.carry_push_share) f.carry_push_share = number_text(*l.carry_push_share);
  if (l.floor_friction) f.floor_friction = number_text(*l.floor_friction);
  if (l.temperature_c) f.temperature_c = number_text(*l.temperature_c);
  if (l.humidity_pct) f.humidity_pct = number_text(*l.humidity_pct);
  return f;
}

}  // namespace rackreach::gui
