// SPDX-License-Identifier: MIT
#include "anthropometry/mixture.hpp"

#include <algorithm>
#include <cmath>

namespace rackreach {
namespace {

enum class Side { at, left, right };  // F(x), F(x-) or F(x+)

// F of one curve at x, in percent. Outside the tabulated range this is the lower bound of F: 0 below the first
// value and the last tabulated percentile above the last value (both exact when the table runs from 0 to 100).
double calc_cdf(const QuantileCurve& c, double x, Side side) {
  const std::vector<double>& p = c.percentiles;
  const std::vector<double>& q = c.values;
  if (x < q.front() || (side == Side::left && x == q.front())) return 0.0;
  if (x >= q.back() && !(side == Side::left && x == q.back())) return p.back();
  // Segment [q[k], q[k+1]] that holds x: for F(x) and F(x+) the last k with q[k] <= x, for F(x-) the last with
  // q[k] < x. q[k+1] > q[k] in both cases, so the division is safe.
  const auto it =
      side == Side::left ? std::lower_bound(q.begin(), q.end(), x) : std::upper_bound(q.begin(), q.end(), x);
  const auto k = static_cast<std::size_t>(it - q.begin()) - 1;
  return p[k] + (x - q[k]) / (q[k + 1] - q[k]) * (p[k + 1] - p[k]);
}

double calc_mixed_cdf(std::span<const WeightedCurve> parts, double x, Side side) {
  double m = 0.0;
  for (const WeightedCurve& part : parts) m += part.weight * calc_cdf(*part.curve, x, side);
  return m;
}

// min{x : M(x) >= p} with M built from the lower bounds of F; empty where M never reaches p.
std::optional<double> solve(std::span<const WeightedCurve> parts, const std::vector<double>& breaks, double p) {
  if (p <= calc_mixed_cdf(parts, breaks.front(), Side::left)) return breaks.front();  // p = 0
  for (std::size_t j = 0; j < breaks.size(); ++j) {
    if (calc_mixed_cdf(parts, breaks[j], Side::at) < p) continue;
    if (j == 0) return breaks[0];  // M jumps over p at the first value
    const double lo = calc_mixed_cdf(parts, breaks[j - 1], Side::right);
    const double hi = calc_mixed_cdf(parts, breaks[j], Side::left);
    if (lo >= p) return breaks[j - 1];
    if (hi >= p) return breaks[j - 1] + (p - lo) / (hi - lo) * (breaks[j] - breaks[j - 1]);
    return breaks[j];  // M jumps over p at breaks[j] (a repeated value)
  }
  return std::nullopt;
}

}  // namespace

std::optional<double> calc_mixture_percentile(std::span<const WeightedCurve> parts, double percentile) {
  std::vector<WeightedCurve> used;
  std::vector<double> breaks;
  for (const WeightedCurve& part : parts) {
    if (part.weight <= 0.0 || part.curve == nullptr) continue;
    const QuantileCurve& c = *part.curve;
    if (c.percentiles.size() < 2 || c.values.size() != c.percentiles.size()) return std::nullopt;
    used.push_back(part);
    breaks.insert(breaks.end(), c.values.begin(), c.values.end());
  }
  if (used.empty() || !(percentile >= 0.0 && percentile <= 100.0)) return std::nullopt;
  std::sort(breaks.begin(), breaks.end());
  breaks.erase(std::unique(breaks.begin(), breaks.end()), breaks.end());
  const std::optional<double> x = solve(used, breaks, percentile);
  if (!x) return std::nullopt;
  // x is the true answer only if no part the tables do not cover could move it:
  // - above a part's last value F is only known to be at least its last percentile, so the true M may reach p
  //   earlier: no answer unless that part's table runs to 100;
  // - below a part's first value F is below its first percentile (the table says Q(p0) = q0); the true M stays
  //   below p left of x if it does so with F at that first percentile.
  double m_left_upper = 0.0;
  for (const WeightedCurve& part : used) {
    const QuantileCurve& c = *part.curve;
    if (*x > c.values.back() && c.percentiles.back() < 100.0) return std::nullopt;
    m_left_upper += part.weight * (*x <= c.values.front() ? c.percentiles.front() : calc_cdf(c, *x, Side::left));
  }
  if (m_left_upper > percentile + 1e-10) return std::nullopt;  // rounding of the sums only
  return x;
}

MeanSd calc_mixture_mean_sd(std::span<const WeightedMeanSd> parts) {
  double mean = 0.0;
  for (const WeightedMeanSd& part : parts) mean += part.weight * part.stats.mean;
  double var = 0.0;
  for (const WeightedMeanSd& part : parts) {
    const double d = part.stats.mean - mean;
    var += part.weight * (part.stats.sd * part.stats.sd + d * d);
  }
  return {mean, std::sqrt(var)};
}

}  // namespace rackreach
