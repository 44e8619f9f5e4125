// SPDX-License-Identifier: MIT
#pragma once
// Sagittal reach envelope of a picker facing a rack.
//
// Model (Rackreach's own, built from survey dimensions): in the vertical plane through the picker's shoulder,
// normal to the rack face, the picker stands with the midpoint of the ankles `ankle_to_rack_face_cm` in front of
// the face. The shoulder pivot is at acromial height (plus footwear), the grip-reach sphere around it has the
// radius of the worker's shoulder-to-grip length (arm straight, the centre of a gripped handle), and the grip
// cannot rise above the worker's standing overhead grip reach. A grip point is given by its height above the floor
// and its depth behind the rack face.
//
// Outputs: the height zone of the grip point for each worker (below grip-centre height, grip centre to elbow,
// elbow to shoulder, above shoulder, beyond overhead grip reach), the depth zone for the small worker (within
// comfortable reach, within maximum reach, beyond), the reach margins of the small worker (default the 5th
// percentile of the workforce), the hand and head clearances of the large one (default the 95th), and the H and V
// of the lifting equation that a lift from the point has, checked against the equation's H and V limits.
//
// Simplifications: each body dimension is the percentile of that dimension on its own (a "5th-percentile
// worker" is not one person). The straight-forward and straight-up limits use single derived dimensions formed per
// subject (shoulder-to-grip length, overhead grip reach); only the sphere between them combines two percentiles
// (shoulder height and arm length), which for the small worker is on the safe side because the two are positively
// correlated. Above shoulder height the picker stands upright and the sphere governs; below it the picker bends the
// knees and trunk to bring the shoulder down to the grip, so only the horizontal distance from the shoulder counts
// (our simplification: a low pick is judged by the lifting equation's V and H, not by standing reach). The trunk
// does not twist and the picker does not step onto the rack. Every constant that is
// not from the survey data is a field of ReachParameters with its source or marked as our assumption.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <Eigen/Core>

namespace rackreach {

/// The reach check is for the small worker, clearance for the large (Pheasant S., Bodyspace, 2nd ed., 1996,
/// "Principles and practice of anthropometrics"; NUREG-0700 Rev. 3 section 11).
inline constexpr double default_small_worker_percentile = 5.0;
inline constexpr double default_large_worker_percentile = 95.0;

/// The body dimensions of one worker that the reach model uses: each a percentile of the workforce, in cm,
/// barefoot (the model adds the footwear allowance).
struct ReachBody {
  std::string label;                     ///< who this is, e.g. "5th percentile, ANSUR II (2012), 50% women"
  double percentile = 0.0;               ///< of the workforce, 0..100
  double stature_cm = 0.0;               ///< floor to top of head
  double acromial_height_cm = 0.0;       ///< floor to acromion: the shoulder pivot
  double elbow_height_cm = 0.0;          ///< floor to underside of the elbow, arm hanging, elbow flexed 90 deg
  double grip_centre_height_cm = 0.0;    ///< floor to the axis of a gripped handle, arm hanging
  double overhead_grip_reach_cm = 0.0;   ///< floor to the axis of a gripped handle, arm raised straight up
  double shoulder_grip_length_cm = 0.0;  ///< acromion to the axis of a gripped handle, arm straight: reach radius
  double hand_breadth_cm = 0.0;          ///< across the knuckles (metacarpals)
  /// Where each dimension came from (dimension key -> table and note); shown with the result.
  std::vector<std::pair<std::string, std::string>> sources;
};

/// Constants of the model that are not survey dimensions. Each one can be set per zone or slot.
struct ReachParameters {
  /// Horizontal distance from the midpoint of the ankles to the rack face. Our assumption: toes a few cm from the
  /// face and the ankle about three-quarters of a foot length (about 18 cm) behind the toes.
  double ankle_to_rack_face_cm = 25.0;
  /// Added to every standing height for shoes. Value from memory, to be checked: Pheasant (1996) adds about 25 mm
  /// for men's and more for women's street shoes; 2.5 cm for work shoes is our assumption.
  double footwear_allowance_cm = 2.5;
  /// Horizontal offset of the shoulder pivot in front of the ankles, standing upright. Our assumption.
  double shoulder_ahead_of_ankles_cm = 0.0;
  /// How far the shoulder pivot lies below the acromion. Our assumption: 0, because the reach radius
  /// (shoulder-to-grip length) is measured from the acromion itself.
  double shoulder_pivot_below_acromion_cm = 0.0;
  /// Comfortable reach as a fraction of maximum reach (elbow slightly bent, no stretch). Our assumption; no
  /// published fraction was read.
  double comfortable_reach_fraction = 0.8;
  /// Height of the hand above the grip axis as a fraction of hand breadth (a fist around a handle spans about one
  /// hand breadth, half of it above the axis). Our assumption.
  double hand_above_grip_fraction_of_breadth = 0.5;
  /// Free space wanted between the top of the hand and the structure above it (knuckles, glove). Our assumption.
  double hand_clearance_allowance_cm = 2.0;
};

/// A grip point on a shelf and the structure around it.
struct ReachQuery {
  double grip_height_cm = 0.0;  ///< floor to the centre of the grip: the V of the lifting equation
  double grip_depth_cm = 0.0;   ///< behind the rack face, >= 0
  /// Underside of the beam or shelf above the grip point; the hand must pass below it. Not checked if empty.
  std::optional<double> structure_above_grip_cm;
  /// Lowest structure over the place where the picker stands (e.g. a tunnel beam). Not checked if empty.
  std::optional<double> structure_above_picker_cm;
};

enum class HeightZone {
  below_grip_centre,
  grip_centre_to_elbow,
  elbow_to_shoulder,
  above_shoulder,
  beyond_overhead_reach
};
std::string_view height_zone_name(HeightZone z);

enum class DepthZone { within_comfortable_reach, within_maximum_reach, beyond_maximum_reach };
std::string_view depth_zone_name(DepthZone z);

enum class ReachWorker { small, large };
constexpr std::string_view reach_worker_name(ReachWorker w) {
  return w == ReachWorker::small ? "small" : "large";
}

/// One check of a grip point, explained: what was compared with what, for whom, and what it depends on.
struct ReachCheck {
  std::string code;                   ///< stable: max_reach, comfortable_reach, overhead_reach, hand_clearance,
                                      ///< head_clearance, equation_h_limit, equation_v_limit
  std::optional<ReachWorker> worker;  ///< empty for the lifting equation's own limits
  std::string dimension;              ///< the body dimension that governs, e.g. "shoulder_grip_length"
  double available_cm = 0.0;          ///< what the body or the structure allows
  double needed_cm = 0.0;             ///< what the grip point asks for
  double margin_cm = 0.0;             ///< available - needed; negative: short by that much
  bool passed = true;
  bool advisory = false;                ///< a comfort zone, not a limit: never the worst failure
  std::vector<std::string> parameters;  ///< ReachParameters fields the check depends on
  std::string message;                  ///< one sentence for people
  bool operator==(const ReachCheck&) const = default;
};

struct ReachResult {
  HeightZone small_height_zone = HeightZone::elbow_to_shoulder;
  HeightZone large_height_zone = HeightZone::elbow_to_shoulder;
  DepthZone depth_zone = DepthZone::within_comfortable_reach;  ///< of the small worker
  double small_shoulder_to_grip_cm = 0.0;  ///< from the small worker's shoulder pivot: straight line above the
                                           ///< shoulder, horizontal below it
  double small_max_reach_margin_cm = 0.0;  ///< the least of the sphere and overhead margins
  double small_comfortable_reach_margin_cm = 0.0;
  double h_cm = 0.0;  ///< the lifting equation's H for a lift from this point: ankles to the grip, horizontally
  double v_cm = 0.0;  ///< the lifting equation's V: floor to the grip
  std::vector<ReachCheck> checks;

  /// The failed limit (not advisory) with the most negative margin; nullptr if every limit is met.
  const ReachCheck* find_worst_failure() const;
  bool operator==(const ReachResult&) const = default;
};

/// A problem with a reach input: field name, value and rule.
struct ReachInputProblem {
  std::string field;
  double value = 0.0;
  std::string rule;
};

/// Checks that every input is a plausible physical value (finite, in range); no clamping.
std::vector<ReachInputProblem> validate_reach_inputs(const ReachBody& small, const ReachBody& large,
                                                     const ReachQuery& query, const ReachParameters& params);

/// The shoulder pivot in the sagittal plane: x from the rack face (positive into the rack), z above the floor.
Eigen::Vector2d calc_shoulder_pivot(const ReachBody& body, const ReachParameters& params);

HeightZone calc_height_zone(const ReachBody& body, double grip_height_cm, const ReachParameters& params);

/// Evaluates a grip point for the small and the large worker. Inputs must pass validate_reach_inputs.
/// `explain` false leaves the checks' messages empty (for searching many places quickly).
ReachResult calc_reach(const ReachBody& small, const ReachBody& large, const ReachQuery& query,
                       const ReachParameters& params, bool explain = true);

}  // namespace rackreach
