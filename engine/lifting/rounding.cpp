// SPDX-License-Identifier: MIT
#include "engine/lifting/rounding.hpp"

#include <cmath>
#include <cstdio>
#include <cstdlib>

namespace rackreach {

double round_half_away(double x, int decimals) {
  if (!std::isfinite(x)) return x;
  // First bring x to its shortest decimal form at 12 significant digits, which removes binary
  // representation error (0.8949999999999999 -> 0.895) without touching any real digit of a multiplier.
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.12g", x);
  const double decimal_value = std::strtod(buf, nullptr);
  const double scale = std::pow(10.0, decimals);
  std::snprintf(buf, sizeof buf, "%.12g", decimal_value * scale);
  const double scaled = std::strtod(buf, nullptr);
  return std::round(scaled) / scale;  // std::round rounds half away from zero
}

}  // namespace rackreach
