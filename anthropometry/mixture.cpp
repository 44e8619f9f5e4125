// SPDX-License-Identifier: MIT
#include "anthropometry/mixture.hpp"

#include <algorithm>
#include <cmath>

namespace rackreach {
namespace {

enum class Bound { lower, upper };  // the lower or upper bound of F where the table does not cover it
enum class Side { at, left, right };  // F(x), F(x-) or F(x+)

// F of one curve at x, in percent.
double calc_cdf(const QuantileCurve& c, double x, Bound bound, Side side) {
  const std::vector<double>& p = c.percentiles;
  const std::vector<double>& q = c.values;
  const double below = bound == Bound::lower ? 0.0 : p.front();
  const double above = bound == Bound::lower ? p.back() : 100.0;
  if (x < q.front() || (side == Side::left && x == q.front())) return below;
  if (x > q.back() || (side == Side::right && x == q.back())) return above;
  if (x == q.back() && side == Side::at) return p.back();
  // Segment [q[k], q[k+1]] that holds x: for F(x) and F(x+) the last k with q[k] <= x, for F(x-) the last with
  // q[k] < x. q[k+1] > q[k] in both cases, so the division is safe.
  const auto it = side == Side::left ? std::lower_bound(q.begin(), q.end(), x) : std::upper_bound(q.begin(), q.end(), x);
  const auto k = static_cast<std::size_t>(it - q.begin()) - 1;
  return p[k] + (x - q[k]) / (q[k + 1] - q[k]) * (p[k + 1] - p[k]);
}

double calc_mixed_cdf(std::span<const WeightedCurve> parts, double x, Bound bound, Side side) {
  double m = 0.0;
  for (const WeightedCurve& part : parts) m += part.weight * calc_cdf(*part.curve, x, bound, side);
  return m;
}

// min{x : M(x) >= p} for M built with one bound; empty where it is unbounded.
std::optional<double> solve(std::span<const WeightedCurve> parts, const std::vector<double>& breaks, double p,
                            Bound bound) {
  const double m_below = calc_mixed_cdf(parts, breaks.front(), bound, Side::left);
  if (p <= m_below) {
    // Only the 0th percentile of tables that start at 0 is the smallest value; otherwise Q lies below the table.
    if (m_below == 0.0) return breaks.front();
    return std::nullopt;
  }
  for (std::size_t j = 0; j < breaks.size(); ++j) {
    if (calc_mixed_cdf(parts, breaks[j], bound, Side::at) < p) continue;
    if (j == 0) return breaks[0];  // M jumps over p at the first value
    const double lo = calc_mixed_cdf(parts, breaks[j - 1], bound, Side::right);
    const double hi = calc_mixed_cdf(parts, breaks[j], bound, Side::left);
    if (lo >= p) return breaks[j - 1];
    if (hi >= p) return breaks[j - 1] + (p - lo) / (hi - lo) * (breaks[j] - breaks[j - 1]);
    return breaks[j];  // M jumps over p at breaks[j] (a repeated value)
  }
  if (calc_mixed_cdf(parts, breaks.back(), bound, Side::right) >= p) return breaks.back();
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
  const std::optional<double> low = solve(used, breaks, percentile, Bound::upper);
  const std::optional<double> high = solve(used, breaks, percentile, Bound::lower);
  if (!low || !high) return std::nullopt;
  // Where the tables cover the answer both bounds give the same x, up to rounding.
  const double scale = std::max({1.0, std::abs(*low), std::abs(*high)});
  if (std::abs(*high - *low) > 1e-9 * scale) return std::nullopt;
  return *high;
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
