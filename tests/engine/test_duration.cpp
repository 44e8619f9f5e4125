// SPDX-License-Identifier: MIT
// Work-duration category and the special frequency adjustment, against the published illustrations of the
// Applications Manual (Waters et al. 1994, revised 2021), section 1.3.5.2 and 1.3.5.5, as the reference lists them.

#include <catch2/catch.hpp>

#include "engine/lifting/duration.hpp"

using namespace rackreach;

namespace {
WorkPeriod lift(double m) { return {WorkPeriod::Kind::lifting, m}; }
WorkPeriod rest(double m) { return {WorkPeriod::Kind::recovery, m}; }
}  // namespace

TEST_CASE("Duration illustrations of the Applications Manual 1.3.5.2", "[duration]") {
  // 30 min lifting + 10 min light work + 45 min lifting -> moderate (75 min): recovery not met, times add.
  auto a = calc_duration({lift(30), rest(10), lift(45)}, DurationRule::edition_2021);
  CHECK(a.category == DurationCategory::moderate_duration);
  CHECK(a.longest_lifting_min == 75.0);
  // 30 min + 30 min recovery + 45 min -> short (2021 rule: recovery >= 1.0 x work time).
  a = calc_duration({lift(30), rest(30), lift(45)}, DurationRule::edition_2021);
  CHECK(a.category == DurationCategory::short_duration);
  CHECK(a.rule == DurationRule::edition_2021);
  // The 1994 edition asked 1.2 x: 30 min recovery after 30 min is not enough (36 needed) -> 75 min, moderate.
  a = calc_duration({lift(30), rest(30), lift(45)}, DurationRule::edition_1994);
  CHECK(a.category == DurationCategory::moderate_duration);
  CHECK(a.rule == DurationRule::edition_1994);
  CHECK(calc_duration({lift(30), rest(36), lift(45)}, DurationRule::edition_1994).category ==
        DurationCategory::short_duration);
  // 2 h continuous lifting needs >= 36 min recovery (0.3 x 120) to stay moderate.
  CHECK(calc_duration({lift(120), rest(36), lift(10)}, DurationRule::edition_2021).category ==
        DurationCategory::moderate_duration);
  CHECK(calc_duration({lift(120), rest(35), lift(10)}, DurationRule::edition_2021).category ==
        DurationCategory::long_duration);
}

TEST_CASE("Category limits: 1 h, 2 h, 8 h; more than 8 h is outside the equation", "[duration]") {
  CHECK(calc_duration({lift(60)}, DurationRule::edition_2021).category == DurationCategory::short_duration);
  CHECK(calc_duration({lift(61)}, DurationRule::edition_2021).category == DurationCategory::moderate_duration);
  CHECK(calc_duration({lift(120)}, DurationRule::edition_2021).category == DurationCategory::moderate_duration);
  CHECK(calc_duration({lift(121)}, DurationRule::edition_2021).category == DurationCategory::long_duration);
  CHECK(calc_duration({lift(480)}, DurationRule::edition_2021).category == DurationCategory::long_duration);
  const auto over = calc_duration({lift(481)}, DurationRule::edition_2021);
  CHECK_FALSE(over.category.has_value());
  CHECK_THAT(over.explanation, Catch::Matchers::Contains("outside the equation"));
  // Our documented reading: breaks do not reset lifting of more than 2 h, so a 10-hour shift with two breaks of
  // 15 min and a 30-min lunch is more than 8 h of lifting.
  const auto shift = calc_duration({lift(120), rest(15), lift(150), rest(30), lift(150), rest(15), lift(135)},
                                   DurationRule::edition_2021);
  CHECK_FALSE(shift.category.has_value());
  CHECK(shift.longest_lifting_min == 555.0);
}

TEST_CASE("Special frequency adjustment, Applications Manual 1.3.5.5", "[duration][frequency]") {
  // 10 lifts/min for 8 min of a 15-min sample -> F = 80/15 = 5.33 lifts/min.
  CHECK(calc_sampled_frequency(10.0, 8.0, frequency_sample_min) == Approx(80.0 / 15.0));
  CHECK(calc_sampled_frequency(10.0, 8.0, frequency_sample_min) == Approx(5.33).margin(0.005));
}
