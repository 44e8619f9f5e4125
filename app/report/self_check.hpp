// SPDX-License-Identifier: MIT
#pragma once
// The engine's self-check, run every time a report is made: published worked examples of the lifting equation,
// their inputs and printed values embedded here (the product never reads the reference folder at run time), are
// evaluated with the engine's own evaluate_task() in worksheet rounding and compared at the printed precision.
// The table is derived from the check cases the test suite uses; a test keeps the two identical.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/duration_category.hpp"
#include "engine/lifting/rnle_1994.hpp"

namespace rackreach::report {

/// One printed value of a published case.
struct CheckValue {
  LiftEnd end = LiftEnd::origin;
  const char* quantity = "";  ///< "hm", "vm", "dm", "am", "fm", "cm", "rwl" or "li"
  double expected = 0.0;
  int decimals = 2;           ///< as printed
  bool printed = true;        ///< printed in the source (true), or the method applied to the printed inputs
};

struct CheckCase {
  const char* name = "";
  const char* citation = "";
  UnitSystem units = UnitSystem::metric;
  DurationCategory duration = DurationCategory::short_duration;
  LiftTask task;
  LiftEnd governing = LiftEnd::origin;
  std::vector<CheckValue> values;
};

/// The embedded cases.
const std::vector<CheckCase>& find_check_cases();

struct CheckOutcome {
  std::string case_name, citation;
  std::string end, quantity;
  double expected = 0.0;
  std::optional<double> computed;  ///< empty where the engine gives no value (an undefined LI)
  int decimals = 2;
  bool printed = true;
  bool passed = false;
};

struct SelfCheckResult {
  std::vector<CheckOutcome> outcomes;
  bool passed() const;
  std::size_t failures() const;
};

/// Evaluates every embedded case with the engine, now.
SelfCheckResult run_self_check();
/// Evaluates the given cases (tests use it to show that a wrong expectation fails).
SelfCheckResult run_self_check(const std::vector<CheckCase>& cases);

}  // namespace rackreach::report
