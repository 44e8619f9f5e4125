// SPDX-License-Identifier: MIT
#pragma once
// Risk bands of the lifting index. LI 1.0 and LI 3.0 are the manual's two interpretation points (Waters et al.
// 1994, Applications Manual 1.4: above 1.0 some workers are at increased risk; experts cited there hold that
// nearly all are above 3.0). The 2.0 boundary and the band words are Rackreach's presentation choice, labelled
// as such in every report; users may change all three.

#include <optional>
#include <string_view>

namespace rackreach {

enum class RiskBand { within_limit, elevated, high, very_high, outside_equation };

struct RiskBands {
  double elevated_above = 1.0;   ///< Applications Manual 1.4
  double high_above = 2.0;       ///< presentation choice
  double very_high_above = 3.0;  ///< Applications Manual 1.4
};

constexpr RiskBand find_band(std::optional<double> li, const RiskBands& bands = {}) {
  if (!li) return RiskBand::outside_equation;
  if (*li > bands.very_high_above) return RiskBand::very_high;
  if (*li > bands.high_above) return RiskBand::high;
  if (*li > bands.elevated_above) return RiskBand::elevated;
  return RiskBand::within_limit;
}

constexpr std::string_view band_name(RiskBand b) {
  switch (b) {
    case RiskBand::within_limit: return "within limit";
    case RiskBand::elevated: return "elevated";
    case RiskBand::high: return "high";
    case RiskBand::very_high: return "very high";
    case RiskBand::outside_equation: return "outside equation";
  }
  return "?";
}

}  // namespace rackreach
