// SPDX-License-Identifier: MIT
// The report's engine self-check: its embedded table of published worked examples is the same as the check cases
// in ../shared/reference/cases (inputs and worksheet values, [HB06] 46.7.2 and the metric package-inspection
// exercise), it passes with this engine, and it fails when a value is wrong.

#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include "app/report/self_check.hpp"
#include "tests/shared_reference.hpp"

using nlohmann::json;
using rackreach::report::CheckCase;
using rackreach::report::find_check_cases;
using rackreach::report::run_self_check;

namespace {

void check_point(const json& p, const rackreach::LiftPoint& lp) {
  CHECK(p["h"].get<double>() == lp.h);
  CHECK(p["v"].get<double>() == lp.v);
  CHECK(p["a"].get<double>() == lp.a_deg);
}

}  // namespace

TEST_CASE("Self-check table equals the published check cases (inputs and worksheet values)", "[report][selfcheck]") {
  for (const CheckCase& c : find_check_cases()) {
    INFO(c.name);
    const auto input_text = shared_reference::read_text(shared_reference::path(std::string("reference/cases/") + c.name + ".input.json"));
    const auto expected_text =
        shared_reference::read_text(shared_reference::path(std::string("reference/cases/") + c.name + ".expected.json"));
    if (!input_text || !expected_text) {
      WARN("published case " << c.name << " not found in ../shared: not compared, not passed");
      continue;
    }
    const json in = json::parse(*input_text);
    const json ex = json::parse(*expected_text);
    CHECK(in["units"] == (c.units == rackreach::UnitSystem::metric ? "metric" : "us"));
    const json& job = in["jobs"][0];
    CHECK(job["duration"] == std::string(rackreach::duration_name(c.duration)));
    const json& task = job["tasks"][0];
    CHECK(task["id"] == c.task.id);
    CHECK(task["load"].get<double>() == c.task.load);
    CHECK(task["frequency"].get<double>() == c.task.frequency_per_min);
    CHECK(task["coupling"] == std::string(rackreach::coupling_name(c.task.coupling)));
    CHECK(task["control_at_destination"].get<bool>() == c.task.control_at_destination);
    check_point(task["origin"], c.task.origin);
    check_point(task["destination"], c.task.destination);
    const json& et = ex["jobs"][0]["tasks"][0];
    CHECK(et["governing"] == std::string(rackreach::lift_end_name(c.governing)));
    // Every worksheet value of the case file is in the table, with the same number, and nothing else.
    std::size_t compared = 0;
    for (const char* end : {"origin", "destination"}) {
      if (!et["worksheet"].contains(end)) continue;
      for (const auto& [q, v] : et["worksheet"][end].items()) {
        bool found = false;
        for (const auto& cv : c.values)
          if (std::string(rackreach::lift_end_name(cv.end)) == end && q == cv.quantity) {
            found = true;
            CHECK(cv.expected == Approx(v.get<double>()).margin(1e-12));
          }
        CHECK(found);
        ++compared;
      }
    }
    // The table adds one value per case: the task's LI (of the governing end).
    CHECK(compared + 1 == c.values.size());
  }
}

TEST_CASE("Self-check passes with this engine and shows its numbers", "[report][selfcheck]") {
  const auto r = run_self_check();
  CHECK(r.passed());
  CHECK(r.failures() == 0);
  REQUIRE(r.outcomes.size() == 26);
  for (const auto& o : r.outcomes) {
    INFO(o.case_name << " " << o.end << " " << o.quantity);
    REQUIRE(o.computed);
    CHECK(*o.computed == Approx(o.expected).margin(1e-9));
  }
}

TEST_CASE("Self-check fails when a published value is not reproduced", "[report][selfcheck]") {
  std::vector<CheckCase> cases = find_check_cases();
  cases[0].values[6].expected += 0.1;  // RWL at the origin, printed 14.4 lb: 14.5 must fail
  const auto r = run_self_check(cases);
  CHECK_FALSE(r.passed());
  CHECK(r.failures() == 1);
  CHECK_FALSE(r.outcomes[6].passed);
  // A case whose governing end is wrong fails on its task LI.
  cases = find_check_cases();
  cases[0].governing = rackreach::LiftEnd::origin;
  CHECK(run_self_check(cases).failures() == 1);
  CHECK_FALSE(rackreach::report::SelfCheckResult{}.passed());  // no cases run is not a pass
}
