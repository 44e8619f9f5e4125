// SPDX-License-Identifier: MIT
#include "engine/io/project_file.hpp"

#include <fstream>
#include <nlohmann/json.hpp>
#include <set>
#include <tuple>
#include <sstream>

#include "engine/io/input_limits.hpp"
#include "engine/io/json_reader.hpp"
#include "engine/io/shared_readers.hpp"
#include "engine/io/store_loader.hpp"

namespace rackreach {
namespace {

using nlohmann::json;
namespace lim = input_limits;

/// Finds the JSON path at which a parse failed, by parsing again with a callback that follows the path.
/// Only run after a failure, so a good file is parsed once, at full speed.
std::string find_parse_error_path(std::string_view text) {
  struct Level {
    bool is_array;
    std::size_t index;
    std::string key;
    bool has_key;
  };
  std::vector<Level> stack;
  auto on_value_done = [&] {
    if (!stack.empty() && stack.back().is_array) ++stack.back().index;
    if (!stack.empty() && !stack.back().is_array) stack.back().has_key = false;
  };
  auto cb = [&](int /*depth*/, json::parse_event_t ev, json& parsed) {
    switch (ev) {
      case json::parse_event_t::object_start: stack.push_back({false, 0, {}, false}); break;
      case json::parse_event_t::array_start: stack.push_back({true, 0, {}, false}); break;
      case json::parse_event_t::key:
        stack.back().key = parsed.get<std::string>();
        stack.back().has_key = true;
        break;
      case json::parse_event_t::object_end:
      case json::parse_event_t::array_end:
        stack.pop_back();
        on_value_done();
        break;
      case json::parse_event_t::value: on_value_done(); break;
    }
    return true;
  };
  try {
    const json partial = json::parse(text.begin(), text.end(), cb);
    (void)partial;
  } catch (const json::exception&) {
  }
  std::string path;
  for (const Level& l : stack) {
    if (l.is_array) path += "[" + std::to_string(l.index) + "]";
    else if (l.has_key) path += (path.empty() ? "" : ".") + l.key;
  }
  return path;
}

using input_limits::line_and_column;

class ProjectLoader {
 public:
  explicit ProjectLoader(std::vector<Problem>& problems) : r_(problems), problems_(problems) {}

  /// Units used in messages and rules of jobs loaded before the root object is complete.
  void set_units(UnitSystem u) {
    units_ = u;
    store_.set_units(u);
  }

  /// Takes one element of a root array as the parser completes it.
  void add_element(std::string_view root_key, const json& j, std::size_t index) {
    if (root_key == "jobs") add_job(j, index);
    else store_.add(root_key, j, index);
  }

  /// Validates one element of the jobs array and keeps it if it is valid.
  void add_job(const json& j, std::size_t index) {
    const JsonPath root;
    const JsonPath jobs_path(root, "jobs");
    const JsonPath job_path(jobs_path, index);
    ++jobs_seen_;
    if (!r_.streamed_within(jobs_path, index, lim::max_jobs, "jobs")) return;
    if (auto job = load_job(j, job_path)) {
      if (!job_ids_.insert(job->id).second)
        problems_.push_back({"duplicate_id", JsonPath(job_path, "id").str(), "\"" + job->id + "\"",
                             "job ids must be unique in the file", ""});
      jobs_.push_back(std::move(*job));
    }
  }

  /// Validates the root object. When the parser handed the jobs over one by one (`jobs_streamed`), their array
  /// in `doc` is empty and the jobs are already loaded; otherwise they are loaded from `doc` here.
  std::optional<Project> finish(const json& doc, bool jobs_streamed) {
    const JsonPath root;
    if (!r_.object(doc, root,
                   {"rackreach", "units", "title", "site", "assessor", "date", "revision", "duration_rule",
                    "workforce", "reach_parameters", "jobs", "shift", "demand", "zones", "racks", "parts", "slots", "routes",
                    "reference_box", "limit_frequencies"}))
      return std::nullopt;
    Project p;
    if (const json* v = r_.member(doc, root, "rackreach", true)) {
      if (!v->is_number_integer() || v->get<long long>() != project_format_version)
        r_.add(v->is_number_integer() ? "invalid_value" : "wrong_type", JsonPath(root, "rackreach"), v,
               "must be the format version 1 (the only version this build reads)");
    }
    const auto units = r_.choice(doc, root, "units", true, {"metric", "us"});
    if (units) p.units = *units == "metric" ? UnitSystem::metric : UnitSystem::us;
    units_ = p.units;
    p.info.title = r_.string(doc, root, "title", false);
    p.info.site = r_.string(doc, root, "site", false);
    p.info.assessor = r_.string(doc, root, "assessor", false);
    p.info.date = read_date(doc, root);
    p.info.revision = r_.string(doc, root, "revision", false);
    if (auto rule = r_.choice(doc, root, "duration_rule", false, {"2021", "1994"}))
      p.duration_rule = *find_duration_rule(*rule);
    if (const json* w = r_.member(doc, root, "workforce", false)) load_workforce_spec(*w, JsonPath(root, "workforce"), p);
    if (const json* rp = r_.member(doc, root, "reach_parameters", false))
      load_reach_parameters(*rp, JsonPath(root, "reach_parameters"), p);

    store_.finish(doc, p.units, p.store);
    // A file holds explicit lift jobs, a store with slots, or both; either may be left out, not both.
    const bool has_slots = doc.contains("slots");
    if (const json* jobs = r_.member(doc, root, "jobs", !has_slots)) {
      const JsonPath jobs_path(root, "jobs");
      const std::size_t min_jobs = has_slots ? 0 : 1;
      if (jobs_streamed) {
        if (jobs_seen_ < min_jobs) r_.add("empty", jobs_path, jobs, "must hold at least 1 jobs (or give slots)");
      } else if (r_.array(*jobs, jobs_path, min_jobs, "jobs")) {
        for (std::size_t i = 0; i < jobs->size(); ++i) add_job((*jobs)[i], i);
      }
    }
    if (!problems_.empty()) return std::nullopt;
    p.jobs = std::move(jobs_);
    return p;
  }

 private:
  std::optional<std::string> read_date(const json& doc, const JsonPath& root) {
    auto d = r_.string(doc, root, "date", false);
    if (!d) return d;
    const bool shape = d->size() == 10 && (*d)[4] == '-' && (*d)[7] == '-';
    bool digits = shape;
    for (std::size_t i = 0; shape && i < 10; ++i)
      if (i != 4 && i != 7) digits = digits && (*d)[i] >= '0' && (*d)[i] <= '9';
    const int month = digits ? std::stoi(d->substr(5, 2)) : 0;
    const int day = digits ? std::stoi(d->substr(8, 2)) : 0;
    if (!digits || month < 1 || month > 12 || day < 1 || day > 31) {
      r_.add("invalid_value", JsonPath(root, "date"), r_.member(doc, root, "date", false),
             "must be a calendar date written YYYY-MM-DD");
      return std::nullopt;
    }
    return d;
  }

  std::optional<LiftJob> load_job(const json& j, const JsonPath& path) {
    r_.set_context("");
    if (!r_.object(j, path, {"id", "name", "duration", "work_pattern", "tasks"})) return std::nullopt;
    LiftJob job;
    const std::size_t before = problems_.size();
    job.id = r_.string(j, path, "id", true).value_or("");
    r_.set_context(job.id.empty() ? "" : "job \"" + job.id + "\"");
    job.name = r_.string(j, path, "name", false);
    const json* duration = r_.member(j, path, "duration", false);
    const json* pattern = r_.member(j, path, "work_pattern", false);
    if (duration && pattern) {
      r_.add("invalid_value", JsonPath(path, "work_pattern"), nullptr,
             "give either duration or work_pattern, not both");
    } else if (!duration && !pattern) {
      r_.add("missing_key", JsonPath(path, "duration"), nullptr,
             "is required (\"short\", \"moderate\" or \"long\"), unless a work_pattern is given");
    } else if (duration) {
      if (auto d = r_.choice(j, path, "duration", true, {"short", "moderate", "long"}))
        job.declared_duration = find_duration(*d);
    } else {
      if (auto periods = read_work_pattern(r_, *pattern, JsonPath(path, "work_pattern"))) job.work_pattern = *periods;
    }
    if (const json* tasks = r_.member(j, path, "tasks", true)) {
      const JsonPath tasks_path(path, "tasks");
      if (r_.array(*tasks, tasks_path, 1, "tasks") && r_.at_most(*tasks, tasks_path, lim::max_tasks_per_job, "tasks")) {
        std::set<std::string> ids;
        job.tasks.reserve(tasks->size());
        job.details.reserve(tasks->size());
        const std::string job_context = r_.context();
        for (std::size_t i = 0; i < tasks->size(); ++i) {
          const JsonPath task_path(tasks_path, i);
          const std::size_t loaded = job.tasks.size();
          load_task((*tasks)[i], task_path, job);
          if (job.tasks.size() > loaded && !ids.insert(job.tasks.back().id).second)
            problems_.push_back({"duplicate_id", JsonPath(task_path, "id").str(), "\"" + job.tasks.back().id + "\"",
                                 "task ids must be unique within a job", job_context});
          r_.set_context(job_context);
        }
      }
    }
    r_.set_context("");
    if (problems_.size() != before) return std::nullopt;
    return job;
  }

  std::optional<LiftPoint> load_point(const json& task, const JsonPath& task_path, std::string_view key) {
    const json* j = r_.member(task, task_path, key, true);
    if (!j) return std::nullopt;
    const JsonPath path(task_path, key);
    if (!r_.object(*j, path, {"h", "v", "a"})) return std::nullopt;
    const std::string_view len = length_unit(units_);
    auto h = r_.number(*j, path, "h", true, {0.0, plausible_length(lim::max_h_cm), true, false, len, lim::plausibility_note});
    auto v = r_.number(*j, path, "v", true,
                       {0.0, plausible_length(lim::max_height_cm), false, false, len, lim::plausibility_note});
    auto a = r_.number(*j, path, "a", false, {0.0, 180.0, false, false, "deg (an angle magnitude)"});
    if (!h || !v || (j->contains("a") && !a)) return std::nullopt;
    return LiftPoint{*h, *v, a.value_or(0.0)};
  }

  void load_task(const json& j, const JsonPath& path, LiftJob& job) {
    const std::string job_context = r_.context();
    if (!r_.object(j, path,
                   {"id", "load", "max_load", "frequency", "frequency_sample", "coupling", "origin", "destination",
                    "control_at_destination", "limits", "shelf"}))
      return;
    const std::size_t before = problems_.size();
    LiftTask t;
    t.id = r_.string(j, path, "id", true).value_or("");
    if (!t.id.empty()) r_.set_context(job_context + (job_context.empty() ? "" : ", ") + "task \"" + t.id + "\"");
    const std::string_view mass = mass_unit(units_);
    const NumberRule load_rule{0.0, plausible_mass(), true, false, mass, lim::plausibility_note};
    t.load = r_.number(j, path, "load", true, load_rule).value_or(0.0);
    t.max_load = r_.number(j, path, "max_load", false, load_rule);
    if (t.max_load && t.load > 0.0 && *t.max_load < t.load)
      r_.add("out_of_range", JsonPath(path, "max_load"), r_.member(j, path, "max_load", false),
             "must be at least the load (" + json(t.load).dump() + " " + std::string(mass) + ")");
    std::optional<FrequencySample> sample;
    const json* freq = r_.member(j, path, "frequency", false);
    const json* freq_sample = r_.member(j, path, "frequency_sample", false);
    if (freq && freq_sample) {
      r_.add("invalid_value", JsonPath(path, "frequency_sample"), nullptr,
             "give either frequency or frequency_sample, not both");
    } else if (freq_sample) {
      sample = load_frequency_sample(*freq_sample, JsonPath(path, "frequency_sample"));
      if (sample) t.frequency_per_min = calc_sampled_frequency(sample->lifts_per_min, sample->lifting_min, sample->sample_min);
    } else {
      t.frequency_per_min = r_.number(j, path, "frequency", true, frequency_rule()).value_or(0.0);
    }
    if (auto c = r_.choice(j, path, "coupling", true, {"good", "fair", "poor"})) t.coupling = *find_coupling(*c);
    if (auto o = load_point(j, path, "origin")) t.origin = *o;
    if (auto d = load_point(j, path, "destination")) t.destination = *d;
    t.control_at_destination = r_.boolean(j, path, "control_at_destination", false).value_or(false);
    if (const json* l = r_.member(j, path, "limits", false)) t.limits = read_limits(r_, *l, JsonPath(path, "limits"));
    std::optional<ShelfGeometry> shelf;
    if (const json* sh = r_.member(j, path, "shelf", false)) shelf = load_shelf(*sh, JsonPath(path, "shelf"), t.origin.v);
    r_.set_context(job_context);
    if (problems_.size() != before) return;
    job.tasks.push_back(std::move(t));
    job.details.push_back({sample, shelf});
  }

  std::optional<ShelfGeometry> load_shelf(const json& j, const JsonPath& path, double grip_height) {
    if (!r_.object(j, path, {"grip_depth", "beam_underside", "overhead_structure"})) return std::nullopt;
    const std::string_view len = length_unit(units_);
    ShelfGeometry g;
    auto depth = r_.number(j, path, "grip_depth", true,
                           {0.0, plausible_length(lim::max_shelf_depth_cm), false, false, len, lim::plausibility_note});
    // The beam above the grip must be above the grip itself (the origin's V).
    const double top = plausible_length(lim::max_height_cm);
    g.beam_underside =
        r_.number(j, path, "beam_underside", false, {grip_height, top, true, false, len, lim::plausibility_note});
    g.overhead_structure =
        r_.number(j, path, "overhead_structure", false, {0.0, top, true, false, len, lim::plausibility_note});
    if (!depth || (j.contains("beam_underside") && !g.beam_underside) ||
        (j.contains("overhead_structure") && !g.overhead_structure))
      return std::nullopt;
    g.grip_depth = *depth;
    return g;
  }

  void load_workforce_spec(const json& j, const JsonPath& path, Project& p) {
    if (!r_.object(j, path, {"population", "women", "small_percentile", "large_percentile"})) return;
    p.workforce_given = true;
    if (auto name = r_.string(j, path, "population", false)) p.workforce.population = *name;
    if (auto w = r_.number(j, path, "women", false, {0.0, 1.0, false, false, "(share of the workforce)"}))
      p.workforce.women_share = *w;
    if (auto s = r_.number(j, path, "small_percentile", false, {0.0, 50.0, true, false, "(percentile)"}))
      p.workforce.small_percentile = *s;
    if (auto l = r_.number(j, path, "large_percentile", false, {50.0, 100.0, false, true, "(percentile)"}))
      p.workforce.large_percentile = *l;
  }

  /// The reach model's parameters that a project may set; lengths in the project's units, stored in cm.
  void load_reach_parameters(const json& j, const JsonPath& path, Project& p) {
    if (!r_.object(j, path,
                   {"ankle_to_rack_face", "footwear_allowance", "shoulder_ahead_of_ankles", "comfortable_reach_fraction",
                    "hand_clearance_allowance"}))
      return;
    const std::string_view len = length_unit(units_);
    ReachParameters& rp = p.reach_parameters;
    auto length = [&](const char* key, double& target_cm, double max_cm) {
      const double max = Length{max_cm, UnitSystem::metric}.in_units(units_);
      if (auto v = r_.number(j, path, key, false, {0.0, max, false, false, len})) {
        target_cm = Length{*v, units_}.in_cm();
        p.reach_parameters_set.emplace_back(key);
      }
    };
    length("ankle_to_rack_face", rp.ankle_to_rack_face_cm, 100.0);
    length("footwear_allowance", rp.footwear_allowance_cm, 10.0);
    length("shoulder_ahead_of_ankles", rp.shoulder_ahead_of_ankles_cm, 40.0);
    length("hand_clearance_allowance", rp.hand_clearance_allowance_cm, 20.0);
    if (auto f = r_.number(j, path, "comfortable_reach_fraction", false, {0.0, 1.0, true, false, "(fraction)"})) {
      rp.comfortable_reach_fraction = *f;
      p.reach_parameters_set.emplace_back("comfortable_reach_fraction");
    }
  }

  double plausible_length(double max_cm) const { return Length{max_cm, UnitSystem::metric}.in_units(units_); }
  double plausible_mass() const { return Mass{lim::max_mass_kg, UnitSystem::metric}.in_units(units_); }
  static NumberRule frequency_rule() {
    return {0.0, lim::max_frequency_per_min, true, false, "lifts/min", lim::plausibility_note};
  }

  std::optional<FrequencySample> load_frequency_sample(const json& j, const JsonPath& path) {
    if (!r_.object(j, path, {"lifts_per_min", "lifting_min", "sample_min"})) return std::nullopt;
    auto rate = r_.number(j, path, "lifts_per_min", true, frequency_rule());
    auto lifting = r_.number(j, path, "lifting_min", true, {0.0, std::nullopt, true, false, "min"});
    auto sample = r_.number(j, path, "sample_min", false, {0.0, std::nullopt, true, false, "min"});
    const double sample_min = sample.value_or(frequency_sample_min);
    if (!rate || !lifting || (j.contains("sample_min") && !sample)) return std::nullopt;
    if (*lifting > sample_min) {
      r_.add("out_of_range", JsonPath(path, "lifting_min"), &j.at("lifting_min"),
             "must be at most the sample period (" + json(sample_min).dump() + " min)");
      return std::nullopt;
    }
    return FrequencySample{*rate, *lifting, sample_min};
  }

  JsonReader r_;
  std::vector<Problem>& problems_;
  UnitSystem units_ = UnitSystem::metric;
  std::vector<LiftJob> jobs_;
  std::set<std::string> job_ids_;
  std::size_t jobs_seen_ = 0;
  StoreReader store_{r_, problems_};
};

}  // namespace

LoadResult load_project_text(std::string_view text) {
  LoadResult out;
  if (const auto at = lim::find_json_depth_excess(text, lim::max_json_depth)) {
    out.problems.push_back(lim::too_deep_problem(text, *at));
    return out;
  }
  ProjectLoader loader(out.problems);
  // The parser hands each element of the root's arrays (jobs, zones, racks, parts, slots, routes) to the loader as
  // soon as it is complete and then drops it, so the document tree never holds more than one element of them: a
  // large file is parsed and validated in one pass, in little memory (and nlohmann's callback parser, which scans
  // a kept array at every element's end, stays linear). Elements that come before the root's "units" wait.
  std::string root_key;
  std::string streaming;  // the root array being streamed, or ""
  bool jobs_streamed = false;
  std::optional<UnitSystem> units;
  std::size_t position = 0;
  std::vector<std::tuple<std::string, std::size_t, json>> waiting;
  auto on_event = [&](int depth, json::parse_event_t ev, json& parsed) {
    using E = json::parse_event_t;
    if (depth == 1) {
      if (ev == E::key) {
        root_key = parsed.get<std::string>();
      } else if (ev == E::array_start && (root_key == "jobs" || StoreReader::streams(root_key))) {
        streaming = root_key;
        position = 0;
        jobs_streamed = jobs_streamed || root_key == "jobs";
      } else if (ev == E::array_end) {
        streaming.clear();
      } else if (ev == E::value && root_key == "units" && parsed.is_string() && !units) {
        const std::string& u = parsed.get_ref<const std::string&>();
        if (u == "metric" || u == "us") {
          units = u == "metric" ? UnitSystem::metric : UnitSystem::us;
          loader.set_units(*units);
        }
      }
      return true;
    }
    if (!streaming.empty() && depth == 2 && (ev == E::object_end || ev == E::array_end || ev == E::value)) {
      if (units) loader.add_element(streaming, parsed, position++);
      else waiting.emplace_back(streaming, position++, std::move(parsed));
      return false;
    }
    return true;
  };
  json doc;
  try {
    doc = json::parse(text.begin(), text.end(), on_event);
  } catch (const json::exception& e) {
    // A syntax error (parse_error) or a number too large for a double (out_of_range 406: never infinity).
    // nlohmann's message starts "[json.exception.parse_error.101] parse error at line 3, column 7: ..."
    std::string what = e.what();
    const auto colon = what.find("] ");
    if (colon != std::string::npos) what = what.substr(colon + 2);
    const auto detail = what.find(": ");  // drop nlohmann's own "parse error at line L, column C" prefix
    if (what.rfind("parse error", 0) == 0 && detail != std::string::npos) what = what.substr(detail + 2);
    out.problems.clear();  // what the loader saw of a broken file is not worth reporting
    const auto* pe = dynamic_cast<const json::parse_error*>(&e);
    const std::string where = pe ? " (" + line_and_column(text, pe->byte ? pe->byte - 1 : 0) + ")" : "";
    out.problems.push_back(
        {"parse_error", find_parse_error_path(text), "", "the file is not valid JSON" + where + ": " + what, ""});
    return out;
  }
  if (!units && doc.is_object())
    if (auto it = doc.find("units"); it != doc.end() && *it == "us") loader.set_units(UnitSystem::us);
  for (auto& [key, index, element] : waiting) loader.add_element(key, element, index);
  out.project = loader.finish(doc, jobs_streamed);
  return out;
}

LoadResult load_project_file(const std::string& path) {
  LoadResult out;
  const auto text = lim::read_input_file(path, lim::max_project_file_bytes, out.problems);
  if (!text) return out;
  return load_project_text(*text);
}

std::string make_template(UnitSystem units) {
  using ojson = nlohmann::ordered_json;  // keeps the keys in the order written, for a readable starter file
  const bool metric = units == UnitSystem::metric;
  auto point = [](double h, double v, double a) { return ojson{{"h", h}, {"v", v}, {"a", a}}; };
  ojson task1 = {{"id", "T1"},
                 {"load", metric ? 8.0 : 18.0},
                 {"frequency", 2.0},
                 {"coupling", "fair"},
                 {"origin", point(metric ? 40 : 16, metric ? 60 : 24, 0)},
                 {"destination", point(metric ? 45 : 18, metric ? 90 : 36, 30)},
                 {"control_at_destination", false}};
  ojson task2 = {{"id", "T2"},
                 {"load", metric ? 4.0 : 9.0},
                 {"frequency", 1.0},
                 {"coupling", "good"},
                 {"origin", point(metric ? 50 : 20, metric ? 150 : 60, 0)},
                 {"destination", point(metric ? 45 : 18, metric ? 90 : 36, 0)},
                 {"control_at_destination", true},
                 {"limits", {{"one_handed", false}, {"floor_friction", 0.5}, {"temperature_c", 21}}}};
  ojson job = {{"id", "J1"},
               {"name", "Example job: two picks to a cart"},
               {"work_pattern", ojson::array({{{"lifting_min", 50}}, {{"recovery_min", 60}}, {{"lifting_min", 50}}})},
               {"tasks", ojson::array({task1, task2})}};
  ojson t = {{"rackreach", project_format_version},
             {"units", std::string(unit_system_name(units))},
             {"title", "New assessment"},
             {"site", "Kitting store"},
             {"assessor", "Your name"},
             {"date", "2026-01-15"},
             {"duration_rule", "2021"},
             {"jobs", ojson::array({job})}};
  return t.dump(2) + "\n";
}

}  // namespace rackreach
