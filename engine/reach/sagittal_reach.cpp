// SPDX-License-Identifier: MIT
#include "engine/reach/sagittal_reach.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>

#include "engine/lifting/rnle_1994.hpp"

namespace rackreach {
namespace {

/// "12.3 cm": as printf's "%.1f" (std::to_chars gives the same digits, without printf's cost per call).
std::string cm(double v) {
  char buf[400];  // the longest double in fixed notation fits
  const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::fixed, 1);
  return std::string(buf, r.ptr) + " cm";
}

std::string who(const ReachBody& b, ReachWorker w) {
  return std::string(reach_worker_name(w)) + " worker (" + b.label + ")";
}

ReachCheck make_check(std::string code, std::optional<ReachWorker> worker, std::string dimension, double available,
                      double needed, std::vector<std::string> parameters) {
  ReachCheck c;
  c.code = std::move(code);
  c.worker = worker;
  c.dimension = std::move(dimension);
  c.available_cm = available;
  c.needed_cm = needed;
  c.margin_cm = available - needed;
  c.passed = c.margin_cm >= 0.0;
  c.parameters = std::move(parameters);
  return c;
}

std::string verdict(const ReachCheck& c) {
  return c.passed ? "margin " + cm(c.margin_cm) : "short by " + cm(-c.margin_cm);
}

void add_problem_if(std::vector<ReachInputProblem>& out, bool bad, const std::string& field, double value,
                    const std::string& rule) {
  if (bad || !std::isfinite(value))
    out.push_back({field, value, std::isfinite(value) ? rule : "must be a finite number"});
}

void validate_body(std::vector<ReachInputProblem>& out, const ReachBody& b, const std::string& who) {
  add_problem_if(out, b.percentile < 0.0 || b.percentile > 100.0, who + ".percentile", b.percentile,
                 "must be from 0 to 100");
  const std::pair<const char*, double> lengths[] = {{"stature_cm", b.stature_cm},
                                                    {"acromial_height_cm", b.acromial_height_cm},
                                                    {"elbow_height_cm", b.elbow_height_cm},
                                                    {"grip_centre_height_cm", b.grip_centre_height_cm},
                                                    {"overhead_grip_reach_cm", b.overhead_grip_reach_cm},
                                                    {"shoulder_grip_length_cm", b.shoulder_grip_length_cm},
                                                    {"hand_breadth_cm", b.hand_breadth_cm}};
  for (const auto& [name, v] : lengths) add_problem_if(out, v <= 0.0, who + "." + name, v, "must be more than 0");
  add_problem_if(out, !(b.grip_centre_height_cm < b.elbow_height_cm), who + ".grip_centre_height_cm",
                 b.grip_centre_height_cm, "must be below elbow_height_cm (" + cm(b.elbow_height_cm) + ")");
  add_problem_if(out, !(b.elbow_height_cm < b.acromial_height_cm), who + ".elbow_height_cm", b.elbow_height_cm,
                 "must be below acromial_height_cm (" + cm(b.acromial_height_cm) + ")");
  add_problem_if(out, !(b.acromial_height_cm < b.overhead_grip_reach_cm), who + ".overhead_grip_reach_cm",
                 b.overhead_grip_reach_cm, "must be above acromial_height_cm (" + cm(b.acromial_height_cm) + ")");
}

}  // namespace

std::string_view height_zone_name(HeightZone z) {
  switch (z) {
    case HeightZone::below_grip_centre:
      return "below grip-centre height";
    case HeightZone::grip_centre_to_elbow:
      return "grip-centre to elbow height";
    case HeightZone::elbow_to_shoulder:
      return "elbow to shoulder height";
    case HeightZone::above_shoulder:
      return "above shoulder height";
    case HeightZone::beyond_overhead_reach:
      return "beyond overhead grip reach";
  }
  return "";
}

std::string_view depth_zone_name(DepthZone z) {
  switch (z) {
    case DepthZone::within_comfortable_reach:
      return "within comfortable reach";
    case DepthZone::within_maximum_reach:
      return "within maximum reach";
    case DepthZone::beyond_maximum_reach:
      return "beyond maximum reach";
  }
  return "";
}

const ReachCheck* ReachResult::find_worst_failure() const {
  const ReachCheck* worst = nullptr;
  for (const ReachCheck& c : checks) {
    if (!c.passed && !c.advisory && (!worst || c.margin_cm < worst->margin_cm)) worst = &c;
  }
  return worst;
}

std::vector<ReachInputProblem> validate_reach_inputs(const ReachBody& small, const ReachBody& large,
                                                     const ReachQuery& q, const ReachParameters& p) {
  std::vector<ReachInputProblem> out;
  validate_body(out, small, "small");
  validate_body(out, large, "large");
  add_problem_if(out, q.grip_height_cm < 0.0, "grip_height_cm", q.grip_height_cm, "must be at least 0 (the floor)");
  add_problem_if(out, q.grip_depth_cm < 0.0, "grip_depth_cm", q.grip_depth_cm,
                 "must be at least 0 (measured from the rack face into the shelf)");
  if (q.structure_above_grip_cm) {
    add_problem_if(out, *q.structure_above_grip_cm <= q.grip_height_cm, "structure_above_grip_cm",
                   *q.structure_above_grip_cm, "must be above the grip height (" + cm(q.grip_height_cm) + ")");
  }
  if (q.structure_above_picker_cm) {
    add_problem_if(out, *q.structure_above_picker_cm <= 0.0, "structure_above_picker_cm", *q.structure_above_picker_cm,
                   "must be more than 0");
  }
  add_problem_if(out, p.ankle_to_rack_face_cm < 0.0, "ankle_to_rack_face_cm", p.ankle_to_rack_face_cm,
                 "must be at least 0 (the picker stands in front of the face)");
  add_problem_if(out, p.footwear_allowance_cm < 0.0, "footwear_allowance_cm", p.footwear_allowance_cm,
                 "must be at least 0");
  // Either sign is possible (a shoulder behind the ankles is a backward lean); only finiteness is checked.
  add_problem_if(out, false, "shoulder_ahead_of_ankles_cm", p.shoulder_ahead_of_ankles_cm, "");
  add_problem_if(out, p.shoulder_pivot_below_acromion_cm < 0.0, "shoulder_pivot_below_acromion_cm",
                 p.shoulder_pivot_below_acromion_cm, "must be at least 0");
  add_problem_if(out, !(p.comfortable_reach_fraction > 0.0 && p.comfortable_reach_fraction <= 1.0),
                 "comfortable_reach_fraction", p.comfortable_reach_fraction, "must be more than 0 and at most 1");
  add_problem_if(out, p.hand_above_grip_fraction_of_breadth < 0.0, "hand_above_grip_fraction_of_breadth",
                 p.hand_above_grip_fraction_of_breadth, "must be at least 0");
  add_problem_if(out, p.hand_clearance_allowance_cm < 0.0, "hand_clearance_allowance_cm", p.hand_clearance_allowance_cm,
                 "must be at least 0");
  return out;
}

Eigen::Vector2d calc_shoulder_pivot(const ReachBody& body, const ReachParameters& p) {
  return {-p.ankle_to_rack_face_cm + p.shoulder_ahead_of_ankles_cm,
          body.acromial_height_cm + p.footwear_allowance_cm - p.shoulder_pivot_below_acromion_cm};
}

HeightZone calc_height_zone(const ReachBody& b, double grip_height_cm, const ReachParameters& p) {
  const double shoe = p.footwear_allowance_cm;
  if (grip_height_cm > b.overhead_grip_reach_cm + shoe) return HeightZone::beyond_overhead_reach;
  if (grip_height_cm > b.acromial_height_cm + shoe) return HeightZone::above_shoulder;
  if (grip_height_cm >= b.elbow_height_cm + shoe) return HeightZone::elbow_to_shoulder;
  if (grip_height_cm >= b.grip_centre_height_cm + shoe) return HeightZone::grip_centre_to_elbow;
  return HeightZone::below_grip_centre;
}

ReachResult calc_reach(const ReachBody& small, const ReachBody& large, const ReachQuery& q, const ReachParameters& p,
                       bool explain) {
  ReachResult r;
  const Eigen::Vector2d grip(q.grip_depth_cm, q.grip_height_cm);
  r.small_height_zone = calc_height_zone(small, q.grip_height_cm, p);
  r.large_height_zone = calc_height_zone(large, q.grip_height_cm, p);
  r.h_cm = p.ankle_to_rack_face_cm + q.grip_depth_cm;
  r.v_cm = q.grip_height_cm;

  // Small worker: the grip-reach sphere around the shoulder, and the overhead grip reach above it. Below the
  // shoulder the picker bends the knees and trunk to bring the shoulder down to the grip, so there only the
  // horizontal distance counts (a low pick is judged by the lifting equation's V and H, not by standing reach).
  const Eigen::Vector2d shoulder = calc_shoulder_pivot(small, p);
  const bool below_shoulder = q.grip_height_cm < shoulder.y();
  const double distance = below_shoulder ? grip.x() - shoulder.x() : (grip - shoulder).norm();
  r.small_shoulder_to_grip_cm = distance;
  const std::vector<std::string> sphere_params = {"ankle_to_rack_face_cm", "shoulder_ahead_of_ankles_cm",
                                                  "footwear_allowance_cm", "shoulder_pivot_below_acromion_cm"};
  ReachCheck max_reach = make_check("max_reach", ReachWorker::small, "shoulder_grip_length",
                                    small.shoulder_grip_length_cm, distance, sphere_params);
  const std::string from_shoulder =
      below_shoulder ? " in front of the shoulder (below shoulder height the picker bends down to it)" : " from the shoulder";
  if (explain) max_reach.message = who(small, ReachWorker::small) + ": the grip is " + cm(distance) + from_shoulder +
                      ", the straight-arm grip reach is " + cm(small.shoulder_grip_length_cm) + ": " +
                      verdict(max_reach);
  std::vector<std::string> comfort_params = sphere_params;
  comfort_params.push_back("comfortable_reach_fraction");
  const double comfortable = p.comfortable_reach_fraction * small.shoulder_grip_length_cm;
  ReachCheck comfort = make_check("comfortable_reach", ReachWorker::small, "shoulder_grip_length", comfortable,
                                  distance, comfort_params);
  comfort.advisory = true;
  if (explain) comfort.message = who(small, ReachWorker::small) + ": the grip is " + cm(distance) + from_shoulder +
                    ", comfortable reach is " + cm(comfortable) + ": " + verdict(comfort);
  ReachCheck overhead =
      make_check("overhead_reach", ReachWorker::small, "overhead_grip_reach",
                 small.overhead_grip_reach_cm + p.footwear_allowance_cm, q.grip_height_cm, {"footwear_allowance_cm"});
  if (explain) overhead.message = who(small, ReachWorker::small) + ": the grip is " + cm(q.grip_height_cm) +
                     " above the floor, overhead grip reach with shoes is " + cm(overhead.available_cm) + ": " +
                     verdict(overhead);
  r.small_max_reach_margin_cm = std::min(max_reach.margin_cm, overhead.margin_cm);
  r.small_comfortable_reach_margin_cm = std::min(comfort.margin_cm, overhead.margin_cm);
  r.depth_zone = !max_reach.passed ? DepthZone::beyond_maximum_reach
                 : comfort.passed  ? DepthZone::within_comfortable_reach
                                   : DepthZone::within_maximum_reach;
  r.checks.push_back(std::move(max_reach));
  r.checks.push_back(std::move(comfort));
  r.checks.push_back(std::move(overhead));

  // Large worker: the hand must pass below the structure above the grip, the head below the one over the aisle.
  if (q.structure_above_grip_cm) {
    const double hand_above = p.hand_above_grip_fraction_of_breadth * large.hand_breadth_cm;
    ReachCheck hand =
        make_check("hand_clearance", ReachWorker::large, "hand_breadth", *q.structure_above_grip_cm - q.grip_height_cm,
                   hand_above + p.hand_clearance_allowance_cm,
                   {"hand_above_grip_fraction_of_breadth", "hand_clearance_allowance_cm"});
    if (explain) hand.message = who(large, ReachWorker::large) + ": " + cm(hand.available_cm) +
                   " free above the grip, the hand needs " + cm(hand_above) + " plus " +
                   cm(p.hand_clearance_allowance_cm) + " allowance: " + verdict(hand);
    r.checks.push_back(std::move(hand));
  }
  if (q.structure_above_picker_cm) {
    const double head = large.stature_cm + p.footwear_allowance_cm;
    ReachCheck head_check = make_check("head_clearance", ReachWorker::large, "stature", *q.structure_above_picker_cm,
                                       head, {"footwear_allowance_cm"});
    if (explain) head_check.message = who(large, ReachWorker::large) + ": the structure over the picker is at " +
                         cm(*q.structure_above_picker_cm) + ", stature with shoes is " + cm(head) + ": " +
                         verdict(head_check);
    r.checks.push_back(std::move(head_check));
  }

  // The lifting equation's own limits at this point (Waters et al. 1993): HM = 0 beyond H max, VM = 0 beyond V max.
  ReachCheck h_limit =
      make_check("equation_h_limit", std::nullopt, "", rnle_metric.h_max, r.h_cm, {"ankle_to_rack_face_cm"});
  if (explain) h_limit.message = "lifting equation: H = " + cm(r.h_cm) + " (ankles to rack face plus grip depth), the limit is " +
                    cm(rnle_metric.h_max) + ": " + verdict(h_limit);
  ReachCheck v_limit = make_check("equation_v_limit", std::nullopt, "", rnle_metric.v_max, r.v_cm, {});
  if (explain) v_limit.message =
      "lifting equation: V = " + cm(r.v_cm) + ", the limit is " + cm(rnle_metric.v_max) + ": " + verdict(v_limit);
  r.checks.push_back(std::move(h_limit));
  r.checks.push_back(std::move(v_limit));
  return r;
}

}  // namespace rackreach
