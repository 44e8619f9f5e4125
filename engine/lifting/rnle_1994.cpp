// SPDX-License-Identifier: MIT
#include "engine/lifting/rnle_1994.hpp"

#include <cmath>
#include <cstdio>

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

std::string fmt_num(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", x);
  return buf;
}

/// Why a zero multiplier makes the task fall outside the equation, in plain words with the limit.
std::optional<Warning> describe_zero(const char* name, const Multiplier& m, UnitSystem units, const RnleConstants& k,
                                     std::optional<DurationCategory> duration, double origin_v) {
  // More than 8 h has its own limit-of-application warning; a zero FM is not a second finding.
  if (m.value != 0.0 || m.rule == BoundaryRule::duration_over_8h) return std::nullopt;
  const std::string len{length_unit(units)};
  std::string why;
  switch (m.rule) {
    case BoundaryRule::h_beyond_max:
      why = "H " + fmt_num(m.input_used) + " " + len + " is beyond " + fmt_num(k.h_max) + " " + len;
      break;
    case BoundaryRule::v_beyond_max:
      why = "V " + fmt_num(m.input_used) + " " + len + " is above " + fmt_num(k.v_max) + " " + len;
      break;
    case BoundaryRule::d_beyond_max:
      why = "D " + fmt_num(m.input_used) + " " + len + " is beyond " + fmt_num(k.d_max) + " " + len;
      break;
    case BoundaryRule::a_beyond_max: why = "A " + fmt_num(m.input_used) + " deg is beyond 135 deg"; break;
    case BoundaryRule::f_beyond_table:
      why = "F " + fmt_num(m.input_used) + " lifts/min is above " +
            fmt_num(find_last_nonzero_frequency(*duration, origin_v >= k.v_split)) +
            ", the last non-zero row of Table 5 for " + std::string(duration_name(*duration)) + " duration, V " +
            (origin_v >= k.v_split ? ">= " : "< ") + fmt_num(k.v_split) + " " + len;
      break;
    default: why = "multiplier is zero"; break;
  }
  return Warning{std::string("outside.") + name, std::string(name) + " = 0: " + why};
}

}  // namespace

PointResult calc_point(const LiftTask& task, const LiftPoint& point, double origin_v, double d,
                       std::optional<DurationCategory> duration, UnitSystem units, RoundingMode mode) {
  const RnleConstants& k = find_constants(units);
  PointResult r;
  auto keep = [mode](Multiplier m) {
    m.value = round_multiplier(m.value, mode);
    return m;
  };
  r.hm = keep(calc_hm(point.h, k));
  r.vm = keep(calc_vm(point.v, k));
  r.dm = keep(calc_dm(d, k));
  r.am = keep(calc_am(point.a_deg));
  r.fm = keep(calc_fm_multiplier(task.frequency_per_min, duration, origin_v, k));
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
  const double d = std::abs(task.destination.v - task.origin.v);
  r.origin = calc_point(task, task.origin, task.origin.v, d, duration, units, mode);
  r.destination = calc_point(task, task.destination, task.origin.v, d, duration, units, mode);
  // Significant control: the lower RWL of the two ends governs (Applications Manual 1.3); ties stay at the origin.
  r.governing = task.control_at_destination && r.destination.rwl < r.origin.rwl ? LiftEnd::destination : LiftEnd::origin;
  const PointResult& g = r.governing_point();
  r.li = g.li;

  auto add_zero_warnings = [&](const PointResult& p, LiftEnd end) {
    const char* names[] = {"HM", "VM", "DM", "AM", "FM"};
    const Multiplier* ms[] = {&p.hm, &p.vm, &p.dm, &p.am, &p.fm};
    for (int i = 0; i < 5; ++i)
      if (auto w = describe_zero(names[i], *ms[i], units, k, duration, task.origin.v)) {
        const std::string_view end_name = lift_end_name(end);
        w->code.append(".").append(end_name);
        std::string message = "at the ";
        message.append(end_name).append(", ").append(w->message);
        r.warnings.push_back({std::move(w->code), std::move(message)});
      }
  };
  add_zero_warnings(r.origin, LiftEnd::origin);
  // The destination is always shown; its zero multipliers decide the LI only with significant control.
  if (task.control_at_destination) add_zero_warnings(r.destination, LiftEnd::destination);
  r.outside_equation = !r.li.has_value();
  if (!duration)
    r.warnings.push_back({"limit.duration_over_8h",
                          "lifting lasts more than 8 h: outside the equation (Table 5 stops at 8 h); FIRWL and FILI "
                          "are shown, RWL and LI are not"});
  for (auto& f : find_limit_findings(task.limits)) {
    r.within_limits_of_application = false;
    r.warnings.push_back({f.code, f.message});
  }
  if (!duration) r.within_limits_of_application = false;
  return r;
}

}  // namespace rackreach
