// SPDX-License-Identifier: MIT
// The sagittal reach model: geometry at and around the reach sphere, the height zones, the clearances, and
// agreement with the lifting equation's H and V limits.

#include <catch2/catch.hpp>
#include <cmath>

#include "engine/lifting/rnle_1994.hpp"
#include "engine/reach/sagittal_reach.hpp"

namespace {

using namespace rackreach;

// Body inputs in cm: the 5th and 95th percentiles of the shipped ansur2 table for a 50/50 workforce (overhead grip
// reach from ansur1988), rounded to 0.1 cm; the geometry checks below do not depend on the exact values.
ReachBody small_worker() {
  ReachBody b;
  b.label = "5th percentile, test workforce";
  b.percentile = 5;
  b.stature_cm = 154.7;
  b.acromial_height_cm = 126.2;
  b.elbow_height_cm = 94.4;
  b.grip_centre_height_cm = 68.6;
  b.overhead_grip_reach_cm = 183.7;
  b.shoulder_grip_length_cm = 57.1;
  b.hand_breadth_cm = 7.3;
  return b;
}

ReachBody large_worker() {
  ReachBody b;
  b.label = "95th percentile, test workforce";
  b.percentile = 95;
  b.stature_cm = 184.4;
  b.acromial_height_cm = 152.1;
  b.elbow_height_cm = 114.1;
  b.grip_centre_height_cm = 83.9;
  b.overhead_grip_reach_cm = 222.8;
  b.shoulder_grip_length_cm = 70.8;
  b.hand_breadth_cm = 9.4;
  return b;
}

ReachQuery grip(double height_cm, double depth_cm) {
  ReachQuery q;
  q.grip_height_cm = height_cm;
  q.grip_depth_cm = depth_cm;
  return q;
}

const ReachCheck& check_of(const ReachResult& r, const std::string& code) {
  for (const ReachCheck& c : r.checks) {
    if (c.code == code) return c;
  }
  FAIL("no check " << code);
  throw;
}

}  // namespace

TEST_CASE("a point at shoulder height exactly one reach radius away is at zero margin", "[reach]") {
  const ReachParameters params;
  const ReachBody small = small_worker();
  const Eigen::Vector2d shoulder = calc_shoulder_pivot(small, params);
  // Geometry: the shoulder pivot is at acromial height plus footwear, ankle_to_rack_face in front of the face.
  CHECK(shoulder.y() == Approx(small.acromial_height_cm + params.footwear_allowance_cm));
  CHECK(shoulder.x() == Approx(-params.ankle_to_rack_face_cm));
  const double depth_at_radius = shoulder.x() + small.shoulder_grip_length_cm;
  REQUIRE(depth_at_radius > 0.0);

  const ReachResult at = calc_reach(small, large_worker(), grip(shoulder.y(), depth_at_radius), params);
  CHECK(at.small_shoulder_to_grip_cm == Approx(small.shoulder_grip_length_cm).margin(1e-9));
  CHECK(check_of(at, "max_reach").margin_cm == Approx(0.0).margin(1e-9));
  CHECK(at.depth_zone != DepthZone::beyond_maximum_reach);
  CHECK(at.small_height_zone == HeightZone::elbow_to_shoulder);  // at shoulder height, not above it

  const ReachResult inside = calc_reach(small, large_worker(), grip(shoulder.y(), depth_at_radius - 0.1), params);
  CHECK(check_of(inside, "max_reach").margin_cm == Approx(0.1).margin(1e-9));
  CHECK(check_of(inside, "max_reach").passed);
  CHECK(inside.depth_zone == DepthZone::within_maximum_reach);  // beyond 80% of the radius
  CHECK(inside.find_worst_failure() == nullptr);                // beyond comfortable reach is advice, not a limit
  CHECK_FALSE(check_of(inside, "comfortable_reach").passed);
  CHECK(check_of(inside, "comfortable_reach").advisory);

  const ReachResult outside = calc_reach(small, large_worker(), grip(shoulder.y(), depth_at_radius + 0.1), params);
  const ReachCheck& fail = check_of(outside, "max_reach");
  CHECK(fail.margin_cm == Approx(-0.1).margin(1e-9));
  CHECK_FALSE(fail.passed);
  CHECK(outside.depth_zone == DepthZone::beyond_maximum_reach);
  // The result explains itself: which worker, which dimension, which parameters, in words.
  REQUIRE(outside.find_worst_failure() == &fail);
  CHECK(fail.worker == ReachWorker::small);
  CHECK(fail.dimension == "shoulder_grip_length");
  CHECK(std::find(fail.parameters.begin(), fail.parameters.end(), "ankle_to_rack_face_cm") != fail.parameters.end());
  CHECK(fail.message.find("small worker (5th percentile, test workforce)") == 0);
  CHECK(fail.message.find("short by 0.1 cm") != std::string::npos);
}

TEST_CASE("comfortable reach is the documented fraction of maximum reach", "[reach]") {
  ReachParameters params;
  params.comfortable_reach_fraction = 0.8;
  const ReachBody small = small_worker();
  const double radius = small.shoulder_grip_length_cm;
  // A point straight ahead of the shoulder at 0.8 R is on the comfortable boundary; stand close enough that
  // it lies behind the rack face.
  params.ankle_to_rack_face_cm = 10.0;
  const Eigen::Vector2d s = calc_shoulder_pivot(small, params);
  REQUIRE(s.x() + 0.8 * radius > 0.0);
  const ReachResult at = calc_reach(small, large_worker(), grip(s.y(), s.x() + 0.8 * radius - 0.01), params);
  CHECK(at.depth_zone == DepthZone::within_comfortable_reach);
  const ReachResult beyond = calc_reach(small, large_worker(), grip(s.y(), s.x() + 0.8 * radius + 0.01), params);
  CHECK(beyond.depth_zone == DepthZone::within_maximum_reach);
  CHECK(beyond.small_comfortable_reach_margin_cm == Approx(-0.01).margin(1e-9));
}

TEST_CASE("height zones follow the worker's own heights plus footwear", "[reach]") {
  const ReachParameters params;
  const ReachBody b = small_worker();
  const double shoe = params.footwear_allowance_cm;
  CHECK(calc_height_zone(b, b.grip_centre_height_cm + shoe - 0.1, params) == HeightZone::below_grip_centre);
  CHECK(calc_height_zone(b, b.grip_centre_height_cm + shoe + 0.1, params) == HeightZone::grip_centre_to_elbow);
  CHECK(calc_height_zone(b, b.elbow_height_cm + shoe + 0.1, params) == HeightZone::elbow_to_shoulder);
  CHECK(calc_height_zone(b, b.acromial_height_cm + shoe + 0.1, params) == HeightZone::above_shoulder);
  CHECK(calc_height_zone(b, b.overhead_grip_reach_cm + shoe - 0.1, params) == HeightZone::above_shoulder);
  CHECK(calc_height_zone(b, b.overhead_grip_reach_cm + shoe + 0.1, params) == HeightZone::beyond_overhead_reach);
  // Above the overhead grip reach the small worker fails the overhead check, at the rack face.
  const ReachResult r = calc_reach(b, large_worker(), grip(b.overhead_grip_reach_cm + shoe + 0.5, 0.0), params);
  CHECK_FALSE(check_of(r, "overhead_reach").passed);
  CHECK(check_of(r, "overhead_reach").margin_cm == Approx(-0.5).margin(1e-9));
  CHECK(r.small_max_reach_margin_cm <= -0.5);
}

TEST_CASE("large worker: hand clearance below the beam and head clearance", "[reach]") {
  const ReachParameters params;
  const ReachBody large = large_worker();
  const double needed =
      params.hand_above_grip_fraction_of_breadth * large.hand_breadth_cm + params.hand_clearance_allowance_cm;
  ReachQuery q{120.0, 10.0, 120.0 + needed + 0.2, large.stature_cm + params.footwear_allowance_cm - 1.0};
  const ReachResult r = calc_reach(small_worker(), large, q, params);
  CHECK(check_of(r, "hand_clearance").margin_cm == Approx(0.2).margin(1e-9));
  CHECK(check_of(r, "hand_clearance").worker == ReachWorker::large);
  CHECK(check_of(r, "head_clearance").margin_cm == Approx(-1.0).margin(1e-9));
  CHECK(r.find_worst_failure()->code == "head_clearance");
}

TEST_CASE("the lifting equation's H > 63 cm and V > 175 cm limits agree with the reach result", "[reach][rnle]") {
  // Source of the limits: Waters et al. (1993); HM = 0 for H > 63 cm, VM = 0 for V > 175 cm (engine/lifting).
  ReachParameters params;
  params.ankle_to_rack_face_cm = 20.0;
  for (double depth : {42.9, 43.0, 43.1}) {  // H = 62.9, 63.0, 63.1
    const ReachResult r = calc_reach(small_worker(), large_worker(), grip(100.0, depth), params);
    INFO("depth " << depth << " H " << r.h_cm);
    CHECK(r.h_cm == Approx(params.ankle_to_rack_face_cm + depth));
    CHECK(check_of(r, "equation_h_limit").passed == (calc_hm(r.h_cm, rnle_metric).value > 0.0));
  }
  for (double height : {174.9, 175.0, 175.1}) {
    const ReachResult r = calc_reach(small_worker(), large_worker(), grip(height, 5.0), params);
    INFO("V " << r.v_cm);
    CHECK(r.v_cm == height);
    CHECK(check_of(r, "equation_v_limit").passed == (calc_vm(r.v_cm, rnle_metric).value > 0.0));
  }
}

TEST_CASE("common practice: the back of a 3 ft (91 cm) deep shelf is beyond the equation's H limit",
          "[reach][common practice]") {
  // common practice: selective-rack bays are commonly 3 ft (0.91 m) deep. For any standing position in front of
  // the face, H = ankle-to-face distance + 91.44 cm exceeds 63 cm, so HM = 0 (Waters et al. 1993).
  const double shelf_depth_cm = 3 * 12 * 2.54;
  for (double ankle_to_face : {0.0, 5.0, 15.0, 25.0, 40.0}) {
    ReachParameters params;
    params.ankle_to_rack_face_cm = ankle_to_face;
    const ReachResult r = calc_reach(small_worker(), large_worker(), grip(100.0, shelf_depth_cm), params);
    INFO("ankle to face " << ankle_to_face);
    CHECK_FALSE(check_of(r, "equation_h_limit").passed);
    CHECK(calc_hm(r.h_cm, rnle_metric).value == 0.0);
    CHECK(r.depth_zone == DepthZone::beyond_maximum_reach);
  }
}

TEST_CASE("invalid reach inputs are reported by field, value and rule", "[reach]") {
  ReachParameters params;
  params.comfortable_reach_fraction = 1.5;
  ReachBody small = small_worker();
  small.elbow_height_cm = 130.0;  // above the shoulder
  const auto problems = validate_reach_inputs(small, large_worker(), {100.0, -3.0, 90.0, std::nullopt}, params);
  auto has = [&](const std::string& field, const std::string& rule_part) {
    return std::any_of(problems.begin(), problems.end(), [&](const ReachInputProblem& p) {
      return p.field == field && p.rule.find(rule_part) != std::string::npos;
    });
  };
  CHECK(has("grip_depth_cm", "at least 0"));
  CHECK(has("structure_above_grip_cm", "above the grip height"));
  CHECK(has("comfortable_reach_fraction", "at most 1"));
  CHECK(has("small.elbow_height_cm", "below acromial_height_cm"));
  CHECK(validate_reach_inputs(small_worker(), large_worker(), grip(100.0, 10.0), ReachParameters{}).empty());
}

TEST_CASE("below the shoulder only the horizontal distance counts; above it the sphere", "[reach]") {
  // Our model's simplification: a picker bends down to a low grip, so its reach there is horizontal.
  const ReachParameters params;
  const ReachBody small = small_worker();
  const Eigen::Vector2d shoulder = calc_shoulder_pivot(small, params);
  const double depth_at_radius = shoulder.x() + small.shoulder_grip_length_cm;
  for (double height : {10.0, 60.0, shoulder.y() - 0.1}) {
    INFO("grip height " << height << " cm");
    const ReachResult r = calc_reach(small, large_worker(), grip(height, depth_at_radius - 0.1), params);
    CHECK(r.small_shoulder_to_grip_cm == Approx(small.shoulder_grip_length_cm - 0.1).margin(1e-9));
    CHECK(check_of(r, "max_reach").passed);
    CHECK(check_of(calc_reach(small, large_worker(), grip(height, depth_at_radius + 0.1), params), "max_reach")
              .margin_cm == Approx(-0.1).margin(1e-9));
  }
  // 10 cm above the shoulder at the same depth the sphere is longer than the arm: out of reach.
  const ReachResult above = calc_reach(small, large_worker(), grip(shoulder.y() + 10.0, depth_at_radius - 0.1), params);
  CHECK(above.small_shoulder_to_grip_cm ==
        Approx(std::hypot(small.shoulder_grip_length_cm - 0.1, 10.0)).margin(1e-9));
  CHECK_FALSE(check_of(above, "max_reach").passed);
}
