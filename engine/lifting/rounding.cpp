// SPDX-License-Identifier: MIT
#include "engine/lifting/rounding.hpp"

#include <algorithm>
#include <cmath>

namespace rackreach {

double round_half_away(double x, int decimals) {
  if (!std::isfinite(x)) return x;
  static constexpr double powers[] = {1.0, 10.0, 100.0, 1000.0, 10000.0, 100000.0, 1000000.0};
  const double scale = decimals >= 0 && decimals <= 6 ? powers[decimals] : std::pow(10.0, decimals);
  const double y = x * scale;
  // A binary value within a hair of a decimal half (0.8949999999999999 x 100) is that half: round it away from
  // zero, as a worksheet rounding the decimal 0.895 does. The hair is far below any real digit of a multiplier.
  const double floor_y = std::floor(y);
  const double hair = 1e-9 * std::max(1.0, std::abs(y));
  if (std::abs(y - floor_y - 0.5) < hair) return (y > 0.0 ? floor_y + 1.0 : floor_y) / scale;
  return std::round(y) / scale;
}

}  // namespace rackreach
