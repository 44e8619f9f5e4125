// SPDX-License-Identifier: MIT
#include "anthropometry/workforce.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>

#include "anthropometry/mixture.hpp"

namespace rackreach {
namespace {

std::string percent(double share) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g%%", std::round(share * 1000.0) / 10.0);
  return buf;
}

std::string ordinal(double p) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", p);
  std::string s = buf;
  const bool whole = std::floor(p) == p;
  const auto n = static_cast<long long>(p);
  const char* suffix = "th";
  if (whole && (n % 100 < 11 || n % 100 > 13)) {
    if (n % 10 == 1) suffix = "st";
    if (n % 10 == 2) suffix = "nd";
    if (n % 10 == 3) suffix = "rd";
  }
  return s + suffix;
}

struct Lookup {
  const PopulationTable* table = nullptr;
  const Dimension* dim = nullptr;
  std::string problem;
};

Lookup find(const Workforce& wf, std::string_view dimension) {
  Lookup l;
  l.table = &wf.find_table_for(dimension);
  l.dim = l.table->find_dimension(dimension);
  if (!l.dim) {
    l.problem = "population table \"" + l.table->name + "\" has no dimension \"" + std::string(dimension) + "\"";
    return l;
  }
  for (Sex s : {Sex::female, Sex::male}) {
    if (wf.mix.weight(s) > 0.0 && !l.dim->of(s)) {
      l.problem = "population table \"" + l.table->name + "\" has no " + std::string(sex_name(s)) + " data for \"" +
                  std::string(dimension) + "\", but the workforce is " + percent(wf.mix.weight(s)) + " " +
                  (s == Sex::female ? "women" : "men");
    }
  }
  return l;
}

}  // namespace

std::optional<SexMix> parse_sex_mix(std::string_view text, std::string& error) {
  std::string_view who = "women";
  std::string_view number = text;
  if (auto eq = text.find('='); eq != std::string_view::npos) {
    who = text.substr(0, eq);
    number = text.substr(eq + 1);
  }
  if (who != "women" && who != "men") {
    error = "the mix must be given as women=SHARE or men=SHARE (it is \"" + std::string(text) + "\")";
    return std::nullopt;
  }
  bool is_percent = !number.empty() && number.back() == '%';
  if (is_percent) number.remove_suffix(1);
  double share = 0.0;
  auto [end, ec] = std::from_chars(number.data(), number.data() + number.size(), share);
  if (ec != std::errc() || end != number.data() + number.size() || number.empty()) {
    error = "the share in \"" + std::string(text) + "\" must be a number, e.g. women=0.3 or women=30%";
    return std::nullopt;
  }
  if (is_percent) share /= 100.0;
  if (!(share >= 0.0 && share <= 1.0)) {
    error = "the share in \"" + std::string(text) + "\" must be from 0 to 1 (0% to 100%)";
    return std::nullopt;
  }
  return SexMix{who == "women" ? share : 1.0 - share};
}

const PopulationTable& Workforce::find_table_for(std::string_view dimension) const {
  for (const DimensionSource& o : overrides) {
    if (o.dimension == dimension && o.table) return *o.table;
  }
  return *table;
}

std::string Workforce::describe() const {
  return table->name + ", " + percent(mix.women) + " women";
}

WorkforceValue calc_workforce_percentile(const Workforce& wf, std::string_view dimension, double percentile) {
  WorkforceValue out;
  const Lookup l = find(wf, dimension);
  out.table_name = l.table->name;
  if (!l.problem.empty()) {
    out.problem = l.problem;
    return out;
  }
  out.unit = canonical_unit_name(l.dim->unit);
  const double factor = factor_to_cm_or_kg(l.dim->unit);
  std::vector<QuantileCurve> curves;
  std::vector<WeightedCurve> parts;
  curves.reserve(2);
  for (Sex s : {Sex::female, Sex::male}) {
    if (wf.mix.weight(s) <= 0.0) continue;
    QuantileCurve c{l.table->percentiles, l.dim->of(s)->quantiles};
    for (double& v : c.values) v *= factor;
    curves.push_back(std::move(c));
    parts.push_back({&curves.back(), wf.mix.weight(s)});
  }
  out.value = calc_mixture_percentile(parts, percentile);
  if (!out.value) {
    out.problem = "the " + ordinal(percentile) + " percentile of \"" + std::string(dimension) +
                  "\" is outside what table \"" + l.table->name + "\" covers (percentiles " +
                  ordinal(l.table->percentiles.front()) + " to " + ordinal(l.table->percentiles.back()) + ")";
  }
  return out;
}

WorkforceMeanSd calc_workforce_mean_sd(const Workforce& wf, std::string_view dimension) {
  WorkforceMeanSd out;
  const Lookup l = find(wf, dimension);
  if (!l.problem.empty()) {
    out.problem = l.problem;
    return out;
  }
  const double factor = factor_to_cm_or_kg(l.dim->unit);
  std::vector<WeightedMeanSd> parts;
  for (Sex s : {Sex::female, Sex::male}) {
    if (wf.mix.weight(s) <= 0.0) continue;
    const SexDistribution& d = *l.dim->of(s);
    parts.push_back({{d.mean * factor, d.sd * factor}, wf.mix.weight(s)});
  }
  const MeanSd m = calc_mixture_mean_sd(parts);
  out.mean = m.mean;
  out.sd = m.sd;
  return out;
}

ReachBodyResult calc_reach_body(const Workforce& wf, double percentile) {
  ReachBodyResult out;
  ReachBody b;
  b.percentile = percentile;
  b.label = ordinal(percentile) + " percentile, " + wf.describe();
  double* fields[] = {&b.stature_cm,
                      &b.acromial_height_cm,
                      &b.elbow_height_cm,
                      &b.grip_centre_height_cm,
                      &b.overhead_grip_reach_cm,
                      &b.shoulder_grip_length_cm,
                      &b.hand_breadth_cm};
  static_assert(std::size(fields) == std::size(reach_dimension_keys));
  for (std::size_t i = 0; i < std::size(fields); ++i) {
    const std::string_view key = reach_dimension_keys[i];
    const WorkforceValue v = calc_workforce_percentile(wf, key, percentile);
    if (!v.value) {
      out.problems.push_back(v.problem);
      continue;
    }
    if (v.unit != "cm") {
      out.problems.push_back("dimension \"" + std::string(key) + "\" of table \"" + v.table_name +
                             "\" must be a length for the reach model");
      continue;
    }
    *fields[i] = *v.value;
    b.sources.emplace_back(std::string(key), v.table_name);
  }
  if (out.problems.empty()) out.body = std::move(b);
  return out;
}

}  // namespace rackreach
