// SPDX-License-Identifier: MIT
// The size limits of engine/io/input_limits.hpp: beyond each, one clear problem (code, path, value, rule) and
// nothing else read. The limits are Rackreach's own (common practice), so the tests check the rule, not a
// published number.

#include <unistd.h>

#include <catch2/catch.hpp>
#include <filesystem>
#include <fstream>
#include <string>

#include "engine/io/csv_import.hpp"
#include "engine/io/input_limits.hpp"
#include "engine/io/json_reader.hpp"
#include "engine/io/project_file.hpp"

using namespace rackreach;
namespace fs = std::filesystem;
namespace lim = rackreach::input_limits;

namespace {

fs::path sparse_file(const std::string& name, std::uintmax_t size) {
  const fs::path p = fs::temp_directory_path() / ("rackreach-limits-" + std::to_string(::getpid()) + "-" + name);
  std::ofstream(p) << "{";
  fs::resize_file(p, size);  // sparse: no disk space used, and the loader must not read it
  return p;
}

std::string jobs_file(std::size_t jobs) {
  std::string s = R"({"rackreach": 1, "units": "metric", "jobs": [)";
  for (std::size_t i = 0; i < jobs; ++i)
    s += std::string(i ? "," : "") + R"({"id": "J)" + std::to_string(i) +
         R"(", "duration": "short", "tasks": [{"id": "T", "load": 5, "frequency": 1, "coupling": "good",
           "origin": {"h": 30, "v": 50}, "destination": {"h": 30, "v": 80}}]})";
  return s + "]}";
}

}  // namespace

TEST_CASE("A project file above the size limit is refused before it is read", "[io][limits]") {
  const fs::path p = sparse_file("big.rackreach.json", lim::max_project_file_bytes + 1);
  const LoadResult r = load_project_file(p.string());
  fs::remove(p);
  REQUIRE(r.problems.size() == 1);
  CHECK(r.problems[0].code == "too_large");
  CHECK(r.problems[0].value == std::to_string(lim::max_project_file_bytes + 1) + " bytes");
  CHECK_THAT(r.problems[0].rule, Catch::Matchers::Contains(std::to_string(lim::max_project_file_bytes)));
}

TEST_CASE("A CSV file above the size limit is refused before it is read", "[io][limits][csv]") {
  const fs::path p = sparse_file("big.csv", lim::max_csv_file_bytes + 1);
  const PartsCsv r = load_parts_csv(p.string(), UnitSystem::metric, {});
  fs::remove(p);
  REQUIRE(r.problems.size() == 1);
  CHECK(r.problems[0].code == "too_large");
  CHECK(r.problems[0].file == p.string());
}

TEST_CASE("A folder given as a project file is a file error", "[io][limits]") {
  const LoadResult r = load_project_file(fs::temp_directory_path().string());
  REQUIRE(r.problems.size() == 1);
  CHECK(r.problems[0].code == "file_error");
}

TEST_CASE("Nesting deeper than the limit is refused; at the limit it is an ordinary type problem", "[io][limits]") {
  auto nested = [](std::size_t depth) {
    return R"({"rackreach": 1, "units": "metric", "title": )" + std::string(depth - 1, '[') +
           std::string(depth - 1, ']') + R"(, "jobs": []})";
  };
  const LoadResult deep = load_project_text(nested(lim::max_json_depth + 1));
  REQUIRE(deep.problems.size() == 1);
  CHECK(deep.problems[0].code == "too_deep");
  const LoadResult at_limit = load_project_text(nested(lim::max_json_depth));
  bool title_wrong_type = false;
  for (const Problem& p : at_limit.problems) title_wrong_type = title_wrong_type || (p.code == "wrong_type" && p.path == "title");
  CHECK(title_wrong_type);
  // Brackets inside strings do not count.
  CHECK_FALSE(lim::find_json_depth_excess(R"({"a": "[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[[["})", 2));
}

TEST_CASE("A string at the length limit loads; one byte more is too_long", "[io][limits]") {
  auto with_site = [](std::size_t n) {
    return R"({"rackreach": 1, "units": "metric", "site": ")" + std::string(n, 's') + R"(", "jobs": [{"id": "J",
      "duration": "short", "tasks": [{"id": "T", "load": 5, "frequency": 1, "coupling": "good",
      "origin": {"h": 30, "v": 50}, "destination": {"h": 30, "v": 80}}]}]})";
  };
  CHECK(load_project_text(with_site(lim::max_string_bytes)).project);
  const LoadResult r = load_project_text(with_site(lim::max_string_bytes + 1));
  REQUIRE(r.problems.size() == 1);
  CHECK(r.problems[0].code == "too_long");
  CHECK(r.problems[0].path == "site");
}

TEST_CASE("Jobs beyond the count limit: one too_many problem at the first one beyond", "[io][limits]") {
  // The limit itself is a million jobs; the rule is checked through the reader at a small limit.
  std::vector<Problem> problems;
  JsonReader r(problems);
  const JsonPath root;
  const JsonPath jobs(root, "jobs");
  CHECK(r.streamed_within(jobs, 2, 3, "jobs"));
  CHECK_FALSE(r.streamed_within(jobs, 3, 3, "jobs"));
  CHECK_FALSE(r.streamed_within(jobs, 4, 3, "jobs"));
  REQUIRE(problems.size() == 1);
  CHECK(problems[0].code == "too_many");
  CHECK(problems[0].path == "jobs[3]");
  // And a file of many jobs well within the limit loads in full.
  const LoadResult ok = load_project_text(jobs_file(2000));
  REQUIRE(ok.project);
  CHECK(ok.project->jobs.size() == 2000);
}

TEST_CASE("A CSV cell above the field limit and a row above the column limit are refused", "[io][limits][csv]") {
  const std::string header = "part_id,family,weight_kg,width_cm,depth_cm,height_cm\n";
  const PartsCsv long_cell = load_parts_csv_text(
      header + "P1," + std::string(lim::max_csv_field_bytes + 1, 'f') + ",2,30,40,6\n", "p.csv", UnitSystem::metric, {});
  REQUIRE(long_cell.problems.size() == 1);
  CHECK(long_cell.problems[0].code == "too_long");
  CHECK(long_cell.problems[0].path == "line 2, column 2");
  CHECK(long_cell.parts.empty());
  std::string wide = "part_id";
  for (std::size_t i = 1; i <= lim::max_csv_columns; ++i) wide += ",c" + std::to_string(i);
  const PartsCsv too_wide = load_parts_csv_text(wide + "\n", "p.csv", UnitSystem::metric, {});
  REQUIRE(too_wide.problems.size() == 1);
  CHECK(too_wide.problems[0].code == "too_many");
  CHECK(too_wide.problems[0].path == "line 1, column " + std::to_string(lim::max_csv_columns + 1));
}

TEST_CASE("A CSV file with more data rows than the limit is refused as a whole", "[io][limits][csv]") {
  std::string text = "part_id\n";
  text.reserve(text.size() + 2 * (lim::max_csv_rows + 1));
  for (std::size_t i = 0; i <= lim::max_csv_rows; ++i) text += "a\n";
  const PartsCsv r = load_parts_csv_text(text, "p.csv", UnitSystem::metric, {});
  REQUIRE(r.problems.size() == 1);
  CHECK(r.problems[0].code == "too_many");
  CHECK(r.problems[0].path == "line " + std::to_string(lim::max_csv_rows + 2));
  CHECK(r.parts.empty());
}
