// SPDX-License-Identifier: MIT
#pragma once
// Percentiles of a workforce that mixes the sexes, by solving the mixed cumulative distribution.
//
// Method (Gordon et al. 2014 survey data as documented with the ANSUR II public files; the same rule the shipped
// percentiles.csv of both surveys uses): with F_s the inverse of sex s's quantile function and w_s its share of
// the workforce, M(x) = sum_s w_s F_s(x) and the p-th percentile is Q(p) = min{x : M(x) >= p}. Each F_s here is
// the inverse of the tabulated, piecewise-linear quantile function, so M is piecewise linear between the
// tabulated values (with steps where a value repeats) and Q is found exactly, not by iteration. With one sex at
// weight 1 the rule gives back that sex's tabulated percentile.
//
// A table may list only part of the range (e.g. the 5th to the 95th percentile). Outside it F_s is only known to
// lie between bounds (below the first listed percentile below the table, above the last one above it): Q is
// returned only where it does not depend on the unknown part.

#include <optional>
#include <span>
#include <vector>

namespace rackreach {

/// One sex's tabulated quantile function: percentiles (0..100, increasing) and values (non-decreasing, cm or kg).
struct QuantileCurve {
  std::vector<double> percentiles;
  std::vector<double> values;
};

/// A part of a workforce: its quantile curve and its share (0..1; the shares of a mixture sum to 1).
struct WeightedCurve {
  const QuantileCurve* curve = nullptr;
  double weight = 0.0;
};

/// The `percentile` (0..100) of the mixture, in the curves' unit; empty where the tables do not determine it.
/// Parts with weight 0 are ignored.
std::optional<double> calc_mixture_percentile(std::span<const WeightedCurve> parts, double percentile);

/// Mean and SD of a mixture from each part's mean and SD: mean = sum w m; var = sum w (s^2 + (m - mean)^2).
/// For two parts at 1/2 this is sd = sqrt((s1^2 + s2^2)/2 + ((m1 - m2)/2)^2), the rule of the survey tables.
struct MeanSd {
  double mean = 0.0;
  double sd = 0.0;
};
struct WeightedMeanSd {
  MeanSd stats;
  double weight = 0.0;
};
MeanSd calc_mixture_mean_sd(std::span<const WeightedMeanSd> parts);

}  // namespace rackreach
