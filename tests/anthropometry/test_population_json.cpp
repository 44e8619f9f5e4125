// SPDX-License-Identifier: MIT
// The population table file: the shipped tables load cleanly and round-trip; a user's table loads with its
// citation; every fault is reported with file, JSON path, value and rule.

#include <catch2/catch.hpp>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include "anthropometry/data_dir.hpp"
#include "anthropometry/population_json.hpp"
#include "shipped_tables.hpp"

namespace {

std::string fixture(const std::string& name) {
  return std::string(RACKREACH_SOURCE_DIR) + "/tests/anthropometry/data/" + name;
}

std::vector<rackreach::Problem> problems_of(const std::string& name) {
  const rackreach::LoadedPopulation loaded = rackreach::load_population_file(fixture(name));
  CHECK_FALSE(loaded.table);
  for (const auto& p : loaded.problems) {
    UNSCOPED_INFO(rackreach::format_problem(p));
    CHECK(p.file == fixture(name));
    CHECK_FALSE(p.rule.empty());
  }
  return loaded.problems;
}

bool has_problem(const std::vector<rackreach::Problem>& ps, const std::string& path, const std::string& value,
                 const std::string& rule_part) {
  for (const auto& p : ps) {
    if (p.path == path && p.value == value && p.rule.find(rule_part) != std::string::npos) return true;
  }
  return false;
}

}  // namespace

TEST_CASE("shipped tables load without problems and save back to the same text", "[anthropometry][file]") {
  for (const std::string name : {"ansur2", "ansur1988"}) {
    const std::string path = shipped::data_dir() + "/" + name + ".json";
    std::ifstream in(path, std::ios::binary);
    std::stringstream text;
    text << in.rdbuf();
    const auto table = shipped::load(name);
    CHECK(table->name == name);
    CHECK_FALSE(table->citation.empty());
    CHECK(table->percentiles.front() == 0.0);
    CHECK(table->percentiles.back() == 100.0);
    CHECK(rackreach::save_population_text(*table) == text.str());
    // Every dimension the reach model needs is there for both sexes.
    for (std::string_view key : rackreach::reach_dimension_keys) {
      INFO(name << " " << key);
      const auto* dim = table->find_dimension(key);
      REQUIRE(dim);
      CHECK(dim->female);
      CHECK(dim->male);
      if (dim->kind == rackreach::DimensionKind::derived) CHECK_FALSE(dim->derivation.empty());
    }
  }
}

TEST_CASE("a user table with only the 5th, 50th and 95th percentiles loads with its citation",
          "[anthropometry][file]") {
  const rackreach::LoadedWorkforce loaded =
      rackreach::load_workforce(fixture("user_table_5_50_95.json"), rackreach::SexMix{0.5}, shipped::data_dir(), true);
  for (const auto& p : loaded.problems) UNSCOPED_INFO(rackreach::format_problem(p));
  REQUIRE(loaded.workforce);
  const rackreach::Workforce& wf = *loaded.workforce;
  CHECK(wf.table->citation.find("Test fixture") == 0);
  CHECK(wf.overrides.empty());  // a user's table is used as it is
  CHECK(loaded.notes.empty());
  const rackreach::Workforce women{wf.table, rackreach::SexMix{1.0}, {}};
  CHECK(shipped::percentile(women, "stature", 50) == Approx(162.6));
  // The mixed median lies where both sexes are tabulated (women near their 75th, men near their 25th)...
  const double median = shipped::percentile(wf, "stature", 50);
  CHECK(median > 162.6);
  CHECK(median < 175.5);
  // ...the mixed 5th percentile needs the men below their 5th percentile, which the table does not give.
  const rackreach::WorkforceValue p05 = rackreach::calc_workforce_percentile(wf, "stature", 5);
  CHECK_FALSE(p05.value);
  CHECK(p05.problem.find("outside what table") != std::string::npos);
  // No reach body from a table without the reach dimensions, and each missing one is named.
  const rackreach::ReachBodyResult body = rackreach::calc_reach_body(women, 5);
  CHECK_FALSE(body.body);
  CHECK(body.problems.size() == 6);
}

TEST_CASE("invalid population tables: each problem names the path, the value and the rule", "[anthropometry][file]") {
  SECTION("unknown keys are errors") {
    const auto ps = problems_of("invalid_unknown_keys.json");
    CHECK(has_problem(ps, "colour", "\"red\"", "not a known field"));
    CHECK(has_problem(ps, "dimensions.stature.labl", "\"Stature\"", "not a known field"));
  }
  SECTION("units") {
    const auto ps = problems_of("invalid_units.json");
    CHECK(has_problem(ps, "dimensions.stature.unit", "\"ft\"", "must be one of mm, cm, in, kg, lb"));
    CHECK(has_problem(ps, "dimensions.body_mass.unit", "\"cm\"", "mass unit"));
  }
  SECTION("a quantile function never decreases") {
    const auto ps = problems_of("invalid_decreasing_quantiles.json");
    CHECK(has_problem(ps, "dimensions.stature.male.quantiles[1]", "1601", "must not be below"));
  }
  SECTION("one quantile per percentile") {
    const auto ps = problems_of("invalid_quantile_count.json");
    CHECK(has_problem(ps, "dimensions.stature.female.quantiles", "", "list of 3 numbers"));
  }
  SECTION("a citation is required") {
    const auto ps = problems_of("invalid_missing_citation.json");
    CHECK(has_problem(ps, "citation", "", "is required"));
  }
  SECTION("percentiles lie in 0..100") {
    const auto ps = problems_of("invalid_percentile_range.json");
    CHECK(has_problem(ps, "percentiles[2]", "120", "from 0 to 100"));
  }
  SECTION("not JSON") {
    const auto ps = problems_of("invalid_not_json.json");
    REQUIRE(ps.size() == 1);
    CHECK(ps[0].rule.find("must be valid JSON") == 0);
  }
  SECTION("a file that is not there") {
    const rackreach::LoadedPopulation loaded = rackreach::load_population_file(fixture("no_such_file.json"));
    CHECK_FALSE(loaded.table);
    REQUIRE(loaded.problems.size() == 1);
    CHECK(loaded.problems[0].rule == "cannot be opened for reading");
  }
}

TEST_CASE("data directory: the environment override wins, then beside the program, then the build tree",
          "[anthropometry][file]") {
  namespace fs = std::filesystem;
  const fs::path build_tree = shipped::data_dir();
  // An installed tree of our own: PREFIX/bin/rackreach and PREFIX/share/rackreach/population/*.json.
  const fs::path prefix = fs::temp_directory_path() / "rackreach-data-dir-test";
  fs::remove_all(prefix);
  fs::create_directories(prefix / "bin");
  fs::create_directories(prefix / "share/rackreach/population");
  fs::copy_file(build_tree / "ansur2.json", prefix / "share/rackreach/population/ansur2.json");
  const fs::path exe = prefix / "bin/rackreach";

  SECTION("the environment variable is the only place looked at when set, even if empty of tables") {
    const rackreach::DataDirLookup found = rackreach::resolve_data_dir(build_tree.c_str(), exe, build_tree);
    REQUIRE(found.dir);
    CHECK(*found.dir == build_tree);
    CHECK(found.reason == "RACKREACH_DATA_DIR");
    const rackreach::DataDirLookup missing = rackreach::resolve_data_dir("/nonexistent/tables", exe, build_tree);
    CHECK_FALSE(missing.dir);
    REQUIRE(missing.tried.size() == 1);
    CHECK_THAT(missing.failure_message(), Catch::Matchers::Contains("/nonexistent/tables (RACKREACH_DATA_DIR)"));
  }
  SECTION("unset or empty: the installed folder relative to the program comes first") {
    for (const char* env : {static_cast<const char*>(nullptr), ""}) {
      const rackreach::DataDirLookup found = rackreach::resolve_data_dir(env, exe, build_tree);
      REQUIRE(found.dir);
      CHECK(fs::equivalent(*found.dir, prefix / "share/rackreach/population"));
      CHECK_THAT(found.reason, Catch::Matchers::StartsWith("installed"));
    }
  }
  SECTION("no installed folder: the build tree") {
    const rackreach::DataDirLookup found =
        rackreach::resolve_data_dir(nullptr, "/nonexistent/bin/rackreach", build_tree);
    REQUIRE(found.dir);
    CHECK(*found.dir == build_tree);
    CHECK(found.reason == "build tree");
  }
  SECTION("nowhere: the message names every place tried, in order") {
    const rackreach::DataDirLookup none =
        rackreach::resolve_data_dir(nullptr, "/nonexistent/bin/rackreach", "/nonexistent/src/anthropometry/data");
    CHECK_FALSE(none.dir);
    REQUIRE(none.tried.size() == 2);
    const std::string m = none.failure_message();
    const auto installed = m.find("/nonexistent/share/rackreach/population");
    const auto tree = m.find("/nonexistent/src/anthropometry/data (build tree)");
    CHECK(installed != std::string::npos);
    CHECK(tree != std::string::npos);
    CHECK(installed < tree);
    CHECK_THAT(m, Catch::Matchers::Contains("RACKREACH_DATA_DIR"));
  }
  SECTION("the running program finds the build tree's tables (tests run from the build folder)") {
    const rackreach::DataDirLookup here = rackreach::find_data_dir();
    if (std::getenv("RACKREACH_DATA_DIR") == nullptr) {
      REQUIRE(here.dir);
      CHECK(fs::equivalent(*here.dir, build_tree));
    }
    CHECK(rackreach::find_executable_path().filename() == "test_anthropometry");
  }
  fs::remove_all(prefix);
  const auto files = rackreach::list_population_files(build_tree);
  REQUIRE(files.size() == 2);
  CHECK(files[0].filename() == "ansur1988.json");
  CHECK(files[1].filename() == "ansur2.json");
}

TEST_CASE("the shipped ANSUR II workforce takes overhead grip reach from the 1988 standing measurement",
          "[anthropometry][file]") {
  const rackreach::LoadedWorkforce loaded =
      rackreach::load_workforce("ansur2", rackreach::SexMix{0.3}, shipped::data_dir(), true);
  REQUIRE(loaded.workforce);
  CHECK(loaded.workforce->find_table_for("overhead_grip_reach").name == "ansur1988");
  CHECK(loaded.workforce->find_table_for("stature").name == "ansur2");
  REQUIRE(loaded.notes.size() == 1);
  const rackreach::ReachBodyResult body = rackreach::calc_reach_body(*loaded.workforce, 5);
  for (const auto& p : body.problems) UNSCOPED_INFO(p);
  REQUIRE(body.body);
  CHECK(body.body->label == "5th percentile, ansur2, 30% women");
  const rackreach::Workforce from_1988 = shipped::workforce("ansur1988", 0.3);
  CHECK(body.body->overhead_grip_reach_cm == shipped::percentile(from_1988, "overhead_grip_reach", 5));
  const rackreach::Workforce from_2012 = shipped::workforce("ansur2", 0.3);
  CHECK(body.body->acromial_height_cm == shipped::percentile(from_2012, "acromial_height", 5));
}

namespace {

struct BadTable {
  const char* fixture;
  const char* code;
  const char* path;
};

// Every invalid population table fixture, the problem it must give and where (the JSON path; "" for the file).
const BadTable bad_tables[] = {
    {"invalid_decreasing_quantiles.json", "out_of_range", "dimensions.stature.male.quantiles[1]"},
    {"invalid_missing_citation.json", "missing_key", "citation"},
    {"invalid_not_json.json", "parse_error", ""},
    {"invalid_percentile_range.json", "out_of_range", "percentiles[2]"},
    {"invalid_quantile_count.json", "wrong_type", "dimensions.stature.female.quantiles"},
    {"invalid_units.json", "invalid_value", "dimensions.stature.unit"},
    {"invalid_unknown_keys.json", "unknown_key", "colour"},
    {"invalid_negative_sd.json", "out_of_range", "dimensions.stature.female.sd"},
    {"invalid_subjects_not_whole.json", "out_of_range", "subjects.female"},
    {"invalid_n_above_subjects.json", "out_of_range", "dimensions.stature.male.n"},
    {"invalid_title_too_long.json", "too_long", "title"},
    {"invalid_dimension_not_object.json", "wrong_type", "dimensions.stature"},
    {"invalid_dimension_key_uppercase.json", "invalid_value", "dimensions.Stature2"},
    {"invalid_kind.json", "invalid_value", "dimensions.stature.kind"},
    {"invalid_derived_without_derivation.json", "missing_key", "dimensions.stature.derivation"},
    {"invalid_format_version.json", "invalid_value", "rackreach_population"},
    {"invalid_name_pattern.json", "invalid_value", "name"},
    {"invalid_percentiles_not_increasing.json", "out_of_range", "percentiles[2]"},
    {"invalid_quantile_not_number.json", "wrong_type", "dimensions.stature.female.quantiles[1]"},
    {"invalid_missing_male.json", "missing_key", "dimensions.stature.male"},
    {"invalid_source_file_sha256.json", "invalid_value", "source_files[0].sha256"},
    {"invalid_method_not_strings.json", "wrong_type", "method[1]"},
    // A number too large for a double; the second file is the input the fuzz target first crashed on (an uncaught
    // out_of_range from the parser), kept as it was found.
    {"invalid_number_overflow.json", "parse_error", ""},
    {"invalid_number_overflow_in_broken_file.json", "parse_error", ""},
    {"invalid_nesting_too_deep.json", "too_deep", ""},
};

}  // namespace

TEST_CASE("every invalid population table gives its code at its path, naming the file", "[anthropometry][file]") {
  std::set<std::string> listed;
  for (const BadTable& b : bad_tables) {
    listed.insert(b.fixture);
    INFO(b.fixture);
    const auto ps = problems_of(b.fixture);
    bool found = false;
    for (const auto& p : ps) found = found || (p.code == b.code && p.path == b.path);
    CHECK(found);
  }
  for (const auto& entry : std::filesystem::directory_iterator(fixture(""))) {
    const std::string name = entry.path().filename().string();
    INFO(name);
    if (name.rfind("invalid_", 0) == 0) CHECK(listed.count(name) == 1);
  }
}
