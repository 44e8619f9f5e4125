// SPDX-License-Identifier: MIT
#include "engine/lifting/rnle_1994.hpp"

#include <cmath>

namespace rackreach {

std::string_view boundary_rule_code(BoundaryRule r) {
  switch (r) {
    case BoundaryRule::none: return "";
    case BoundaryRule::h_raised_to_min: return "h_raised_to_min";
    case BoundaryRule::h_beyond_max: return "h_beyond_max";
    case BoundaryRule::v_beyond_max: return "v_beyond_max";
    case BoundaryRule::d_raised_to_min: return "d_raised_to_min";
    case BoundaryRule::d_beyond_max: return "d_beyond_max";
    case BoundaryRule::a_beyond_max: return "a_beyond_max";
    case BoundaryRule::f_raised_to_min: return "f_raised_to_min";
    case BoundaryRule::f_interpolated: return "f_interpolated";
    case BoundaryRule::f_beyond_table: return "f_beyond_table";
    case BoundaryRule::duration_over_8h: return "duration_over_8h";
  }
  return "?";
}

Multiplier calc_hm(double h, const RnleConstants& k) {
  if (h > k.h_max) return {0.0, h, BoundaryRule::h_beyond_max};
  if (h < k.h_min) return {1.0, k.h_min, BoundaryRule::h_raised_to_min};
  return {k.h_min / h, h, BoundaryRule::none};
}

Multiplier calc_vm(double v, const RnleConstants& k) {
  if (v > k.v_max) return {0.0, v, BoundaryRule::v_beyond_max};
  return {1.0 - k.v_coef * std::abs(v - k.v_optimum), v, BoundaryRule::none};
}

Multiplier calc_dm(double d, const RnleConstants& k) {
  if (d > k.d_max) return {0.0, d, BoundaryRule::d_beyond_max};
  if (d < k.d_min) return {1.0, k.d_min, BoundaryRule::d_raised_to_min};
  return {dm_constant + k.d_coef / d, d, BoundaryRule::none};
}

Multiplier calc_am(double a_deg) {
  if (a_deg > a_max_deg) return {0.0, a_deg, BoundaryRule::a_beyond_max};
  return {1.0 - am_coef_per_deg * a_deg, a_deg, BoundaryRule::none};
}

namespace {

Multiplier calc_fm_multiplier(double f, std::optional<DurationCategory> duration, double origin_v,
                              const RnleConstants& k) {
  if (!duration) return {0.0, f, BoundaryRule::duration_over_8h};
  const FrequencyMultiplier fm = calc_fm(f, *duration, origin_v >= k.v_split);
  BoundaryRule rule = BoundaryRule::none;
  switch (fm.lookup) {
    case FrequencyLookup::printed_row: break;
    case FrequencyLookup::raised_to_min: rule = BoundaryRule::f_raised_to_min; break;
    case FrequencyLookup::interpolated: rule = BoundaryRule::f_interpolated; break;
    case FrequencyLookup::beyond_table: rule = BoundaryRule::f_beyond_table; break;
  }
  return {fm.fm, fm.lifts_per_min_used, rule};
}

std::optional<double> divide(double load, double limit, RoundingMode mode) {
  if (!(limit > 0.0)) return std::nullopt;
  return round_result(load / limit, mode);
}

/// The warning of a zero multiplier at one end: which multiplier, its input and the bound it passed.
/// More than 8 h has its own limit-of-application warning; its zero FM is not a second finding.
void add_zero_warnings(const PointResult& p, LiftEnd end, const RnleConstants& k, std::optional<DurationCategory> duration,
                       double origin_v, std::vector<Warning>& out) {
  if (p.hm.value == 0.0) out.push_back({WarningKind::hm_zero, end, p.hm.input_used, k.h_max, {}});
  if (p.vm.value == 0.0) out.push_back({WarningKind::vm_zero, end, p.vm.input_used, k.v_max, {}});
  if (p.dm.value == 0.0) out.push_back({WarningKind::dm_zero, end, p.dm.input_used, k.d_max, {}});
  if (p.am.value == 0.0) out.push_back({WarningKind::am_zero, end, p.am.input_used, a_max_deg, {}});
  if (p.fm.value == 0.0 && duration)
    out.push_back({WarningKind::fm_zero, end, p.fm.input_used,
                   find_last_nonzero_frequency(*duration, origin_v >= k.v_split), {}});
}

}  // namespace

PointResult calc_point(const LiftTask& task, const LiftPoint& point, const Multiplier& dm, const Multiplier& fm,
                       UnitSystem units, RoundingMode mode) {
  const RnleConstants& k = find_constants(units);
  PointResult r;
  auto keep = [mode](Multiplier m) {
    m.value = round_multiplier(m.value, mode);
    return m;
  };
  r.hm = keep(calc_hm(point.h, k));
  r.vm = keep(calc_vm(point.v, k));
  r.dm = dm;
  r.am = keep(calc_am(point.a_deg));
  r.fm = fm;
  r.cm = Multiplier{calc_cm(task.coupling, point.v >= k.v_split), point.v, BoundaryRule::none};
  const double firwl_raw = k.lc * r.hm.value * r.vm.value * r.dm.value * r.am.value * r.cm.value;
  r.firwl = round_result(firwl_raw, mode);
  r.rwl = round_result(firwl_raw * r.fm.value, mode);
  r.strwl = r.rwl;  // STRWL = FIRWL x FM of the task's own frequency: the single-task RWL
  r.li = divide(task.load, r.rwl, mode);
  r.fili = divide(task.fili_load(), r.firwl, mode);
  r.stli = divide(task.load, r.strwl, mode);
  return r;
}

TaskResult evaluate_task(const LiftTask& task, std::optional<DurationCategory> duration, UnitSystem units,
                         RoundingMode mode) {
  const RnleConstants& k = find_constants(units);
  TaskResult r;
  r.id = task.id;
  // D is the travel between the ends, and FM takes V at the origin: both are the same at either end.
  Multiplier dm = calc_dm(std::abs(task.destination.v - task.origin.v), k);
  dm.value = round_multiplier(dm.value, mode);
  Multiplier fm = calc_fm_multiplier(task.frequency_per_min, duration, task.origin.v, k);
  fm.value = round_multiplier(fm.value, mode);
  r.origin = calc_point(task, task.origin, dm, fm, units, mode);
  r.destination = calc_point(task, task.destination, dm, fm, units, mode);
  // Significant control: the lower RWL of the two ends governs (Applications Manual 1.3); ties stay at the origin.
  r.governing = task.control_at_destination && r.destination.rwl < r.origin.rwl ? LiftEnd::destination : LiftEnd::origin;
  const PointResult& g = r.governing_point();
  r.li = g.li;

  add_zero_warnings(r.origin, LiftEnd::origin, k, duration, task.origin.v, r.warnings);
  // The destination is always shown; its zero multipliers decide the LI only with significant control.
  if (task.control_at_destination) add_zero_warnings(r.destination, LiftEnd::destination, k, duration, task.origin.v, r.warnings);
  r.outside_equation = !r.li.has_value();
  if (!duration) r.warnings.push_back({WarningKind::duration_over_8h, LiftEnd::origin, 0.0, long_limit_hours, {}});
  add_limit_warnings(task.limits, r.warnings);
  for (const Warning& w : r.warnings) r.within_limits_of_application = r.within_limits_of_application && !w.is_limit_of_application();
  return r;
}

}  // namespace rackreach
