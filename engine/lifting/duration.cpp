// SPDX-License-Identifier: MIT
#include "engine/lifting/duration.hpp"

#include <algorithm>
#include <cstdio>

namespace rackreach {
namespace {

constexpr double tolerance_min = 1e-9;

std::string fmt_min(double m) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g min", m);
  return buf;
}

/// Recovery a lifting run of `run_min` needs to end; empty where no recovery ends it (over 2 h).
std::optional<double> required_recovery(double run_min, DurationRule rule) {
  if (run_min <= short_limit_min + tolerance_min) return run_min * short_recovery_ratio(rule);
  if (run_min <= moderate_limit_min + tolerance_min) return run_min * moderate_recovery_ratio;
  return std::nullopt;
}

}  // namespace

DurationAssessment calc_duration(const std::vector<WorkPeriod>& pattern, DurationRule rule) {
  DurationAssessment out;
  out.rule = rule;
  double run = 0.0;
  std::string notes;
  for (const WorkPeriod& p : pattern) {
    if (p.kind == WorkPeriod::Kind::lifting) {
      run += p.minutes;
      out.longest_lifting_min = std::max(out.longest_lifting_min, run);
      continue;
    }
    if (run == 0.0) continue;
    const auto need = required_recovery(run, rule);
    if (need && p.minutes + tolerance_min >= *need) {
      notes += fmt_min(run) + " of lifting followed by " + fmt_min(p.minutes) + " of recovery (at least " +
               fmt_min(*need) + " needed); ";
      run = 0.0;
    } else {
      notes += fmt_min(p.minutes) + " of recovery after " + fmt_min(run) + " of lifting is not enough (" +
               (need ? "at least " + fmt_min(*need) + " needed" : std::string("no recovery resets more than 2 h")) +
               "), so the lifting times add; ";
    }
  }
  const double longest = out.longest_lifting_min;
  if (longest <= short_limit_min + tolerance_min) out.category = DurationCategory::short_duration;
  else if (longest <= moderate_limit_min + tolerance_min) out.category = DurationCategory::moderate_duration;
  else if (longest <= long_limit_min + tolerance_min) out.category = DurationCategory::long_duration;
  out.explanation = notes + "longest lifting run " + fmt_min(longest) + ": " +
                    (out.category ? std::string(duration_name(*out.category)) + " duration (" +
                                        std::string(duration_limit_text(*out.category)) + ")"
                                  : std::string("more than 8 h, outside the equation")) +
                    "; recovery rule of the " + std::string(duration_rule_name(rule)) + " edition";
  return out;
}

}  // namespace rackreach
