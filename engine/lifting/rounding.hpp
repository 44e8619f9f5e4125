// SPDX-License-Identifier: MIT
#pragma once
// Rounding as published worksheets do it: half away from zero on the decimal value.

namespace rackreach {

/// How results are rounded. `full` keeps full precision; `worksheet` rounds multipliers to 2 decimals and
/// weights and indices to 1 decimal, as the published worked examples print them (Waters et al. 1994,
/// Applications Manual, worked examples), each rounded value feeding the next step.
enum class RoundingMode { full, worksheet };

/// Rounds `x` to `decimals` places, half away from zero, on the decimal value of `x`: 1 - 0.0075 * 14 is
/// 0.8949999999999999 in binary but 0.895 in decimal, and a worksheet prints it as 0.90.
double round_half_away(double x, int decimals);

/// Multiplier as the mode keeps it (2 decimals in worksheet mode).
inline double round_multiplier(double x, RoundingMode mode) { return mode == RoundingMode::full ? x : round_half_away(x, 2); }
/// Weight (RWL, FIRWL, STRWL) or index (LI, FILI, STLI, CLI) as the mode keeps it (1 decimal in worksheet mode).
inline double round_result(double x, RoundingMode mode) { return mode == RoundingMode::full ? x : round_half_away(x, 1); }

}  // namespace rackreach
