// SPDX-License-Identifier: MIT
#pragma once
// Revised NIOSH Lifting Equation.
// Sources: Waters T.R., Putz-Anderson V., Garg A., Fine L.J. (1993), Revised NIOSH equation for the design and
// evaluation of manual lifting tasks, Ergonomics 36(7):749-776; Waters, Putz-Anderson, Garg (1994),
// Applications Manual for the Revised NIOSH Lifting Equation, DHHS (NIOSH) 94-110 (revised 2021).
//
//   RWL = LC x HM x VM x DM x AM x FM x CM,   LI = L / RWL
//
// Scope: one two-handed lift task evaluated at its origin and its destination; the metric form (cm, kg) for
// metric input and the US form (in, lb) for US input (the two forms' constants are not exact conversions).
// Bounds (the method's own clamps, applied and recorded): H < 25 cm (10 in) uses 25 (10); H > 63 cm (25 in),
// V > 175 cm (70 in), D > 175 cm (70 in), A > 135 deg give a zero multiplier; D < 25 cm (10 in) uses 25 (10);
// F < 0.2/min uses 0.2. FM takes V at the origin, also at the destination; CM takes V at the point evaluated.
// With significant control at the destination, the lower RWL governs the task's LI (Applications Manual 1.3).
// FIRWL = RWL with FM = 1; STRWL = FIRWL x FM; FILI = max load / FIRWL; STLI = load / STRWL (Manual 2.4).
// Departures: none in the equation. Where RWL = 0 the LI is undefined and the task is reported outside the
// equation with the multiplier that is zero and why; it is never given a number.

#include <optional>
#include <string>
#include <vector>

#include "engine/lifting/coupling_table.hpp"
#include "engine/lifting/duration_category.hpp"
#include "engine/lifting/frequency_table.hpp"
#include "engine/lifting/limits_of_application.hpp"
#include "engine/lifting/rounding.hpp"
#include "engine/lifting/warning.hpp"
#include "engine/quantities.hpp"

namespace rackreach {

/// The constants of one form of the equation (Waters et al. 1993, Table 1; Applications Manual 1.3).
struct RnleConstants {
  double lc;           ///< load constant, kg or lb
  double h_min;        ///< H below this uses it; HM = h_min / H
  double h_max;        ///< H above this: HM = 0
  double v_optimum;    ///< VM = 1 - v_coef x |V - v_optimum|
  double v_coef;       ///< per cm or per in
  double v_max;        ///< V above this: VM = 0
  double d_min;        ///< D below this uses it
  double d_max;        ///< D above this: DM = 0
  double d_coef;       ///< DM = 0.82 + d_coef / D
  double v_split;      ///< the 75 cm (30 in) split of Tables 5 and 7
};

/// Metric form: LC 23 kg, HM 25/H, VM 1 - 0.003|V - 75|, DM 0.82 + 4.5/D (Waters et al. 1993; Manual Table 1 notes).
inline constexpr RnleConstants rnle_metric{23.0, 25.0, 63.0, 75.0, 0.003, 175.0, 25.0, 175.0, 4.5, 75.0};
/// US form: LC 51 lb, HM 10/H, VM 1 - 0.0075|V - 30|, DM 0.82 + 1.8/D (Waters et al. 1993; Manual Table 1 notes).
inline constexpr RnleConstants rnle_us{51.0, 10.0, 25.0, 30.0, 0.0075, 70.0, 10.0, 70.0, 1.8, 30.0};
/// AM = 1 - 0.0032 A, A in degrees, 0 to 135 (Waters et al. 1993).
inline constexpr double am_coef_per_deg = 0.0032;
inline constexpr double a_max_deg = 135.0;
/// Table 5 stops at 8 h of lifting (Applications Manual 1.3.5.2).
inline constexpr double long_limit_hours = 8.0;
/// DM's constant term (Waters et al. 1993), the same in both forms.
inline constexpr double dm_constant = 0.82;

constexpr const RnleConstants& find_constants(UnitSystem u) { return u == UnitSystem::metric ? rnle_metric : rnle_us; }

/// How a multiplier's input was treated by the method's own boundary rules.
enum class BoundaryRule {
  none,
  h_raised_to_min,   ///< H < 25 cm (10 in): 25 (10) used, HM = 1
  h_beyond_max,      ///< H > 63 cm (25 in): HM = 0
  v_beyond_max,      ///< V > 175 cm (70 in): VM = 0
  d_raised_to_min,   ///< D < 25 cm (10 in): 25 (10) used, DM = 1
  d_beyond_max,      ///< D > 175 cm (70 in): DM = 0
  a_beyond_max,      ///< A > 135 deg: AM = 0
  f_raised_to_min,   ///< F < 0.2/min: 0.2 used
  f_interpolated,    ///< F between rows of Table 5
  f_beyond_table,    ///< F above the last non-zero row of its Table 5 column: FM = 0
  duration_over_8h,  ///< lifting for more than 8 h: Table 5 has no column, FM undefined (shown as 0)
};

std::string_view boundary_rule_code(BoundaryRule r);

/// A multiplier's value, the input the method used for it, and the boundary rule applied, if any.
struct Multiplier {
  double value = 1.0;
  double input_used = 0.0;  ///< H, V, D, A (deg) or F after the method's clamps; V for CM
  BoundaryRule rule = BoundaryRule::none;
  bool operator==(const Multiplier&) const = default;
};

Multiplier calc_hm(double h, const RnleConstants& k);
Multiplier calc_vm(double v, const RnleConstants& k);
Multiplier calc_dm(double d, const RnleConstants& k);
Multiplier calc_am(double a_deg);

/// A hand position: H and V in the task's length unit, A the asymmetry angle in degrees (magnitude).
struct LiftPoint {
  double h = 0.0;
  double v = 0.0;
  double a_deg = 0.0;
  bool operator==(const LiftPoint&) const = default;
};

/// One lift task, in the unit system of its project.
struct LiftTask {
  std::string id;
  double load = 0.0;                  ///< L: the (average) load, kg or lb, > 0
  std::optional<double> max_load;     ///< maximum load if it varies (>= load); FILI uses it
  double frequency_per_min = 0.0;     ///< F averaged over the job's duration, > 0
  Coupling coupling = Coupling::good;
  LiftPoint origin;
  LiftPoint destination;
  bool control_at_destination = false;  ///< significant control: the destination is also evaluated for the LI
  LimitsOfApplication limits;

  double fili_load() const { return max_load.value_or(load); }
  bool operator==(const LiftTask&) const = default;
};


/// Everything computed at one end of a lift. Weights in the task's mass unit.
struct PointResult {
  Multiplier hm, vm, dm, am, fm, cm;
  double rwl = 0.0;
  double firwl = 0.0;
  double strwl = 0.0;
  std::optional<double> li;    ///< undefined where RWL = 0
  std::optional<double> fili;  ///< undefined where FIRWL = 0
  std::optional<double> stli;  ///< undefined where STRWL = 0
  bool operator==(const PointResult&) const = default;
};

struct TaskResult {
  std::string id;
  PointResult origin;
  PointResult destination;           ///< always evaluated; governs only with significant control
  LiftEnd governing = LiftEnd::origin;
  std::optional<double> li;          ///< of the governing end; undefined if outside the equation
  bool outside_equation = false;     ///< RWL = 0 at the governing end, or duration over 8 h
  bool within_limits_of_application = true;
  std::vector<Warning> warnings;

  const PointResult& governing_point() const { return governing == LiftEnd::origin ? origin : destination; }
  bool operator==(const TaskResult&) const = default;
};

/// Evaluates one end of a lift, given DM and FM, which are the same at both ends (D is the travel between them;
/// Table 5 is indexed by V at the origin). Rounded per `mode`, each rounded value feeding the next step.
PointResult calc_point(const LiftTask& task, const LiftPoint& point, const Multiplier& dm, const Multiplier& fm,
                       UnitSystem units, RoundingMode mode);

/// Evaluates a task at both ends; the destination governs only with significant control and a lower RWL.
/// `duration` empty means more than 8 h: the task is outside the equation (FM undefined), FIRWL/FILI still given.
TaskResult evaluate_task(const LiftTask& task, std::optional<DurationCategory> duration, UnitSystem units,
                         RoundingMode mode);

}  // namespace rackreach
