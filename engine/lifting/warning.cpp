// SPDX-License-Identifier: MIT
#include "engine/lifting/warning.hpp"

#include <cstdio>

#include "engine/lifting/limits_of_application.hpp"

namespace rackreach {
namespace {

std::string fmt(const char* pattern, double a, double b = 0.0) {
  char buf[240];
  std::snprintf(buf, sizeof buf, pattern, a, b);
  return buf;
}

}  // namespace

std::string_view warning_code(const Warning& w) {
  const bool o = w.end == LiftEnd::origin;
  switch (w.kind) {
    case WarningKind::hm_zero: return o ? "outside.HM.origin" : "outside.HM.destination";
    case WarningKind::vm_zero: return o ? "outside.VM.origin" : "outside.VM.destination";
    case WarningKind::dm_zero: return o ? "outside.DM.origin" : "outside.DM.destination";
    case WarningKind::am_zero: return o ? "outside.AM.origin" : "outside.AM.destination";
    case WarningKind::fm_zero: return o ? "outside.FM.origin" : "outside.FM.destination";
    case WarningKind::one_handed: return "limit.one_handed";
    case WarningKind::seated_or_kneeling: return "limit.seated_or_kneeling";
    case WarningKind::restricted_space: return "limit.restricted_space";
    case WarningKind::unstable_load: return "limit.unstable_load";
    case WarningKind::wheelbarrow_or_shovel: return "limit.wheelbarrow_or_shovel";
    case WarningKind::high_speed: return "limit.high_speed";
    case WarningKind::carry_push_share: return "limit.carry_push_share";
    case WarningKind::floor_friction: return "limit.floor_friction";
    case WarningKind::temperature: return "limit.temperature";
    case WarningKind::humidity: return "limit.humidity";
    case WarningKind::duration_over_8h: return "limit.duration_over_8h";
    case WarningKind::fili_above_1: return "flag.fili_above_1";
    case WarningKind::stli_above_1: return "flag.stli_above_1";
    case WarningKind::cli_undefined: return "outside.cli";
    case WarningKind::reach_limit: return "reach.limit";
    case WarningKind::reach_h_differs: return "reach.h_differs";
    case WarningKind::reach_input: return "reach.input";
  }
  return "?";
}

std::string describe_warning(const Warning& w, UnitSystem units) {
  if (!w.note.empty()) return w.note;
  const std::string len(length_unit(units));
  const std::string at = "at the " + std::string(lift_end_name(w.end)) + ", ";
  const char* limits = ": outside the equation's limits of application";
  switch (w.kind) {
    case WarningKind::hm_zero: return at + fmt("HM = 0: H %g ", w.value) + len + fmt(" is beyond %g ", w.limit) + len;
    case WarningKind::vm_zero: return at + fmt("VM = 0: V %g ", w.value) + len + fmt(" is above %g ", w.limit) + len;
    case WarningKind::dm_zero: return at + fmt("DM = 0: D %g ", w.value) + len + fmt(" is beyond %g ", w.limit) + len;
    case WarningKind::am_zero: return at + fmt("AM = 0: A %g deg is beyond %g deg", w.value, w.limit);
    case WarningKind::fm_zero:
      return at + fmt("FM = 0: F %g lifts/min is above %g, the last non-zero row of its Table 5 column", w.value,
                      w.limit);
    case WarningKind::one_handed: return std::string("lifting with one hand") + limits;
    case WarningKind::seated_or_kneeling: return std::string("lifting while seated or kneeling") + limits;
    case WarningKind::restricted_space: return std::string("lifting in a restricted work space") + limits;
    case WarningKind::unstable_load: return std::string("unstable object") + limits;
    case WarningKind::wheelbarrow_or_shovel: return std::string("wheelbarrow or shovel") + limits;
    case WarningKind::high_speed:
      return fmt("high-speed lifting (faster than about %.0f cm/s)", max_lift_speed_cm_per_s) + limits;
    case WarningKind::carry_push_share:
      return fmt("carrying, pushing or pulling is %.0f%% of the work (the equation assumes at most about %.0f%%)",
                 w.value * 100.0, w.limit * 100.0);
    case WarningKind::floor_friction:
      return fmt("foot-floor coefficient of friction %.2f is below %.1f", w.value, w.limit) + limits;
    case WarningKind::temperature:
      return fmt("temperature %.1f C is outside ", w.value) + fmt("%.0f-", min_temperature_c) +
             fmt("%.0f C", max_temperature_c) + limits;
    case WarningKind::humidity:
      return fmt("relative humidity %.0f%% is outside ", w.value) + fmt("%.0f-", min_humidity_pct) +
             fmt("%.0f%%", max_humidity_pct) + limits;
    case WarningKind::duration_over_8h:
      return "lifting lasts more than 8 h: outside the equation (Table 5 stops at 8 h); FIRWL and FILI are shown, "
             "RWL and LI are not";
    case WarningKind::fili_above_1:
      return "FILI above 1.0: the maximum load may be too much for some workers even at a low frequency";
    case WarningKind::stli_above_1: return "STLI above 1.0: the task alone exceeds the limit";
    case WarningKind::cli_undefined: return "CLI undefined";
    case WarningKind::reach_limit: return "a reach limit is not met";
    case WarningKind::reach_h_differs:
      return fmt("the task's H (%g) differs from the H the standing distance and grip depth give (%g)", w.value,
                 w.limit);
    case WarningKind::reach_input: return "a reach input is not valid";
  }
  return "?";
}

}  // namespace rackreach
