// SPDX-License-Identifier: MIT
// The project file loader: the published cases load, and every invalid fixture (named after what is wrong)
// gives the expected problem code at the expected JSON path.

#include <catch2/catch.hpp>
#include <filesystem>
#include <nlohmann/json.hpp>
#include <set>
#include <string>

#include "engine/io/assessment_output.hpp"
#include "engine/io/project_file.hpp"
#include "tests/shared_reference.hpp"

using namespace rackreach;

namespace {

struct Expected {
  const char* fixture;
  const char* code;
  const char* path;
};

const Expected invalid_fixtures[] = {
    {"invalid_missing_units", "missing_key", "units"},
    {"invalid_unknown_units", "invalid_value", "units"},
    {"invalid_unknown_key", "unknown_key", "jobs[0].tasks[0].frequncy"},
    {"invalid_negative_load", "out_of_range", "jobs[0].tasks[0].load"},
    {"invalid_h_as_string", "wrong_type", "jobs[0].tasks[0].origin.h"},
    {"invalid_nan_value", "parse_error", "jobs[0].tasks[0].origin.h"},
    {"invalid_empty_jobs", "empty", "jobs"},
    {"invalid_duplicate_task_ids", "duplicate_id", "jobs[0].tasks[1].id"},
    {"invalid_frequency_zero", "out_of_range", "jobs[0].tasks[0].frequency"},
    {"invalid_a_negative", "out_of_range", "jobs[0].tasks[0].origin.a"},
    {"invalid_missing_format_version", "missing_key", "rackreach"},
    {"invalid_wrong_format_version", "invalid_value", "rackreach"},
    {"invalid_unknown_coupling", "invalid_value", "jobs[0].tasks[0].coupling"},
    {"invalid_missing_destination", "missing_key", "jobs[0].tasks[0].destination"},
    {"invalid_v_negative", "out_of_range", "jobs[0].tasks[0].destination.v"},
    {"invalid_missing_duration", "missing_key", "jobs[0].duration"},
    {"invalid_duration_and_pattern", "invalid_value", "jobs[0].work_pattern"},
    {"invalid_duplicate_job_ids", "duplicate_id", "jobs[1].id"},
    {"invalid_empty_tasks", "empty", "jobs[0].tasks"},
    {"invalid_max_load_below_load", "out_of_range", "jobs[0].tasks[0].max_load"},
    {"invalid_control_not_boolean", "wrong_type", "jobs[0].tasks[0].control_at_destination"},
    {"invalid_bad_date", "invalid_value", "date"},
    {"invalid_limits_unknown_key", "unknown_key", "jobs[0].tasks[0].limits.one_hand"},
    {"invalid_pattern_period_both", "invalid_value", "jobs[0].work_pattern[0]"},
    {"invalid_frequency_and_sample", "invalid_value", "jobs[0].tasks[0].frequency_sample"},
    {"invalid_not_json", "parse_error", "jobs[0]"},
    {"invalid_top_level_array", "wrong_type", ""},
    {"invalid_h_zero", "out_of_range", "jobs[0].tasks[0].origin.h"},
    {"invalid_shelf_beam_below_grip", "out_of_range", "jobs[0].tasks[0].shelf.beam_underside"},
    {"invalid_shelf_negative_depth", "out_of_range", "jobs[0].tasks[0].shelf.grip_depth"},
    {"invalid_workforce_women_share", "out_of_range", "workforce.women"},
    {"invalid_reach_parameter_unknown", "unknown_key", "reach_parameters.ankle_to_rack_face_cm"},
    {"invalid_slot_unknown_part", "unknown_reference", "slots[0].part"},
    {"invalid_slot_unknown_level", "unknown_reference", "slots[0].level"},
    {"invalid_slot_unknown_rack", "unknown_reference", "slots[0].rack"},
    {"invalid_slot_bay_beyond_rack", "out_of_range", "slots[0].bay"},
    {"invalid_slot_duplicate_location", "duplicate_location", "slots[1]"},
    {"invalid_route_unknown_slot", "unknown_reference", "routes[0].slots[1]"},
    {"invalid_rack_unknown_zone", "unknown_reference", "racks[0].zone"},
    {"invalid_levels_overlap", "out_of_range", "racks[0].levels[1].surface_height"},
    {"invalid_shift_bad_time", "invalid_value", "shift.start"},
    {"invalid_part_missing_box", "missing_key", "parts[0].box"},
    {"invalid_part_coupling_and_handhold", "invalid_value", "parts[0].handhold"},
    {"invalid_slots_without_demand", "missing_key", "demand"},
    {"invalid_level_access_not_rack_kind", "invalid_value", "racks[0].levels[0].access"},
    // A number too large for a double is refused by the parser, never read as infinity; the second file is the
    // input the fuzz target first crashed on (an uncaught out_of_range from the parser), kept as it was found.
    {"invalid_number_overflow", "parse_error", "jobs[0].tasks[0].load"},
    {"invalid_number_overflow_in_broken_file", "parse_error", "jobs[0].tasks[0].load"},
    // Size limits (engine/io/input_limits.hpp).
    {"invalid_nesting_too_deep", "too_deep", ""},
    {"invalid_site_too_long", "too_long", "site"},
    {"invalid_job_id_too_long", "too_long", "jobs[0].id"},
    {"invalid_rack_too_many_levels", "too_many", "racks[0].levels"},
    {"invalid_shift_too_many_breaks", "too_many", "shift.breaks"},
    {"invalid_zone_pattern_too_many_periods", "too_many", "zones[0].lifting_pattern"},
    // Plausibility limits (common practice, Rackreach's own, not the method's).
    {"invalid_load_5000_kg", "out_of_range", "jobs[0].tasks[0].load"},
    {"invalid_frequency_1e9_per_min", "out_of_range", "jobs[0].tasks[0].frequency"},
    {"invalid_sample_rate_1e9_per_min", "out_of_range", "jobs[0].tasks[0].frequency_sample.lifts_per_min"},
    {"invalid_origin_v_above_15_m", "out_of_range", "jobs[0].tasks[0].origin.v"},
    {"invalid_origin_h_above_5_m", "out_of_range", "jobs[0].tasks[0].origin.h"},
    {"invalid_level_surface_40_m", "out_of_range", "racks[0].levels[1].surface_height"},
    {"invalid_part_weight_5000_kg", "out_of_range", "parts[0].unit_weight"},
    {"invalid_kits_per_hour_1e9", "out_of_range", "demand.kits_per_hour"},
};

}  // namespace

TEST_CASE("Every invalid fixture is in the table", "[io][invalid]") {
  // The file loads; the workforce it names is looked up when the CLI sets up the reach check (tests/app).
  std::set<std::string> listed = {"invalid_workforce_unknown_population"};
  for (const Expected& e : invalid_fixtures) listed.insert(e.fixture);
  for (const auto& entry : std::filesystem::directory_iterator(shared_reference::repo_path("tests/data"))) {
    const std::string stem = entry.path().stem().string();
    INFO(stem);
    if (stem.rfind("invalid_", 0) == 0) CHECK(listed.count(stem) == 1);
  }
}

TEST_CASE("Every invalid fixture gives its problem code at its JSON path", "[io][invalid]") {
  for (const Expected& e : invalid_fixtures) {
    const std::string file = shared_reference::repo_path(std::string("tests/data/") + e.fixture + ".json");
    const LoadResult r = load_project_file(file);
    INFO(e.fixture);
    CHECK_FALSE(r.project.has_value());
    bool found = false;
    std::string all;
    for (const Problem& p : r.problems) {
      found = found || (p.code == e.code && p.path == e.path);
      all += format_problem(e.fixture, p) + "\n";
    }
    INFO("problems:\n" << all);
    CHECK(found);
  }
}

TEST_CASE("All problems come at once, each naming path, value and rule", "[io][invalid]") {
  const LoadResult r = load_project_text(R"({"rackreach": 1, "units": "metric", "jobs": [{"id": "J", "duration": "short",
    "tasks": [{"id": "T", "load": -1, "frequency": 0, "coupling": "good",
               "origin": {"h": "far", "v": 50}, "destination": {"h": 30, "v": 60, "b": 1}}]}]})");
  REQUIRE_FALSE(r.project);
  REQUIRE(r.problems.size() == 4);
  const std::string msg = format_problem("x.json", r.problems[0]);
  CHECK(msg == "x.json: jobs[0].tasks[0].load (job \"J\", task \"T\"): must be a number greater than 0 kg; it is -1 "
               "[out_of_range]");
  CHECK(format_problem("x.json", r.problems[2]) ==
        "x.json: jobs[0].tasks[0].origin.h (job \"J\", task \"T\"): must be a number greater than 0 cm; found a "
        "string; it is \"far\" [wrong_type]");
  CHECK(r.problems[3].code == "unknown_key");
  CHECK(r.problems[3].path == "jobs[0].tasks[0].destination.b");
}

TEST_CASE("The published cases load through the project-file contract", "[io][cases]") {
  for (const char* name : {"handbook-dishwashing", "metric-package-inspection"}) {
    const std::string file = shared_reference::path(std::string("reference/cases/") + name + ".input.json");
    if (!shared_reference::read_text(file)) {
      WARN(file << " not found: published case skipped (not passed)");
      continue;
    }
    const LoadResult r = load_project_file(file);
    INFO(name);
    for (const auto& p : r.problems) INFO(format_problem(name, p));
    CHECK(r.project.has_value());
  }
}

TEST_CASE("A store loads: racks, parts, slots, routes; a slot's unknown part names both", "[io][store]") {
  const LoadResult r = load_project_file(shared_reference::repo_path("tests/data/store_minimal.rackreach.json"));
  for (const auto& p : r.problems) INFO(format_problem("store_minimal", p));
  REQUIRE(r.project);
  CHECK(r.project->jobs.empty());
  CHECK(r.project->store.slots.size() == 1);
  CHECK(r.project->store.zones[0].cart_h.source == ValueSource::built_in_default);  // default, visible as such
  CHECK(r.project->store.zones[0].standing_distance.source == ValueSource::file);
  const LoadResult bad = load_project_file(shared_reference::repo_path("tests/data/invalid_slot_unknown_part.json"));
  REQUIRE(bad.problems.size() == 1);
  const std::string msg = format_problem("f.json", bad.problems[0]);
  CHECK_THAT(msg, Catch::Matchers::Contains("slot \"S1\""));
  CHECK_THAT(msg, Catch::Matchers::Contains("\"P9\""));
}

TEST_CASE("A store whose slots are still to come saves to a file that loads again", "[io][save]") {
  // Found by the fuzz target: a store with "slots": [] and no jobs loaded, but was saved with "jobs": [], which
  // its own loader refuses.
  const LoadResult r = load_project_file(shared_reference::repo_path("tests/data/csv/import_base.rackreach.json"));
  REQUIRE(r.project);
  CHECK(r.project->jobs.empty());
  CHECK(r.project->store.slots.empty());
  const LoadResult again = load_project_text(save_project_text(*r.project));
  for (const Problem& p : again.problems) UNSCOPED_INFO(format_problem("saved", p));
  REQUIRE(again.project);
  CHECK(again.project->store.racks.size() == r.project->store.racks.size());
}

TEST_CASE("Save and load again: the same project, every sample", "[io][save]") {
  namespace fs = std::filesystem;
  int count = 0;
  for (const auto& entry : fs::directory_iterator(shared_reference::repo_path("sample_tasks"))) {
    if (entry.path().extension() != ".json") continue;
    ++count;
    INFO(entry.path().filename().string());
    const LoadResult first = load_project_file(entry.path().string());
    REQUIRE(first.project);
    const std::string saved = save_project_text(*first.project);
    const LoadResult second = load_project_text(saved);
    for (const auto& p : second.problems) INFO(format_problem("saved", p));
    REQUIRE(second.project);
    // Saving the reloaded project gives the same text, and the same assessment, number for number.
    CHECK(save_project_text(*second.project) == saved);
    const auto a1 = assess_project(*first.project, {});
    const auto a2 = assess_project(*second.project, {});
    CHECK(write_assessment_json(*first.project, a1, {"x"}) == write_assessment_json(*second.project, a2, {"x"}));
  }
  CHECK(count >= 4);
}

TEST_CASE("Zone and task limits follow one set of rules, and a saved zone's limits load again", "[io][limits]") {
  auto doc = nlohmann::json::parse(
      *shared_reference::read_text(shared_reference::repo_path("tests/data/store_minimal.rackreach.json")));
  doc["zones"][0]["limits"] = {{"wheelbarrow_or_shovel", true}, {"floor_friction", 0.3}};
  doc["zones"][0]["lifting_pattern"] = nlohmann::json::array({{{"lifting_min", 50}}, {{"recovery_min", 60}}});
  const LoadResult r = load_project_text(doc.dump());
  for (const auto& p : r.problems) INFO(format_problem("zone", p));
  REQUIRE(r.project);
  CHECK(r.project->store.zones[0].limits.wheelbarrow_or_shovel == true);
  CHECK(r.project->store.zones[0].lifting_pattern->size() == 2);
  const LoadResult again = load_project_text(save_project_text(*r.project));
  REQUIRE(again.project);
  CHECK(again.project->store.zones[0].limits.floor_friction == 0.3);
  // The same rule in both places: a humidity above 100% is refused in a zone as in a task.
  doc["zones"][0]["limits"]["humidity_pct"] = 120;
  const LoadResult bad = load_project_text(doc.dump());
  REQUIRE(bad.problems.size() == 1);
  CHECK(bad.problems[0].path == "zones[0].limits.humidity_pct");
  CHECK(bad.problems[0].code == "out_of_range");
}

TEST_CASE("The template loads and is valid in both unit systems", "[io][template]") {
  for (UnitSystem u : {UnitSystem::metric, UnitSystem::us}) {
    const LoadResult r = load_project_text(make_template(u));
    for (const auto& p : r.problems) INFO(format_problem("template", p));
    REQUIRE(r.project);
    CHECK(r.project->units == u);
  }
}

TEST_CASE("A frequency sample gives F by the special adjustment", "[io][frequency]") {
  // Applications Manual 1.3.5.5: 10 lifts/min for 8 min of a 15-min sample -> 5.33 lifts/min.
  const LoadResult r = load_project_text(R"({"rackreach": 1, "units": "metric", "jobs": [{"id": "J", "duration": "short",
    "tasks": [{"id": "T", "load": 5, "frequency_sample": {"lifts_per_min": 10, "lifting_min": 8}, "coupling": "good",
               "origin": {"h": 30, "v": 50}, "destination": {"h": 30, "v": 60}}]}]})");
  REQUIRE(r.project);
  CHECK(r.project->jobs[0].tasks[0].frequency_per_min == Approx(80.0 / 15.0));
}

TEST_CASE("CSV cells a spreadsheet would run as formulas are neutralised", "[io][csv]") {
  // common practice: cells starting with = + - @ are prefixed so that spreadsheets show them as text.
  CHECK(csv_cell("=SUM(A1)") == "'=SUM(A1)");
  CHECK(csv_cell("@cmd") == "'@cmd");
  CHECK(csv_cell("+1+2") == "'+1+2");
  CHECK(csv_cell("-12.5") == "-12.5");  // a plain number stays a number
  CHECK(csv_cell("a,b") == "\"a,b\"");
  CHECK(csv_cell("say \"hi\"") == "\"say \"\"hi\"\"\"");
}
