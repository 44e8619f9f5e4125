// SPDX-License-Identifier: MIT
#include "app/drawing/band_palette.hpp"

#include <array>
#include <cmath>

namespace rackreach::drawing {
namespace {

// cividis at 0, 0.25, 0.5, 0.75 and 1 (the published colormap's values, rounded to 8-bit sRGB); between the
// stops the colour is interpolated linearly, which keeps the ramp's monotone lightness.
constexpr std::array<QRgb, 5> cividis_stops = {0x00224E, 0x3D4E6E, 0x7C7B78, 0xCBBA69, 0xFEE838};

QColor cividis(double t) {
  t = std::clamp(t, 0.0, 1.0) * (cividis_stops.size() - 1);
  const std::size_t i = std::min<std::size_t>(static_cast<std::size_t>(t), cividis_stops.size() - 2);
  const double f = t - static_cast<double>(i);
  const QColor a = QColor::fromRgb(cividis_stops[i]), b = QColor::fromRgb(cividis_stops[i + 1]);
  return QColor::fromRgbF(static_cast<float>(a.redF() + (b.redF() - a.redF()) * f),
                          static_cast<float>(a.greenF() + (b.greenF() - a.greenF()) * f),
                          static_cast<float>(a.blueF() + (b.blueF() - a.blueF()) * f));
}

}  // namespace

// The four bands at equal steps from the light end (1) to the dark end (0).
QColor band_colour(RiskBand band) {
  switch (band) {
    case RiskBand::within_limit: return cividis(1.0);
    case RiskBand::elevated: return cividis(2.0 / 3.0);
    case RiskBand::high: return cividis(1.0 / 3.0);
    case RiskBand::very_high: return cividis(0.0);
    case RiskBand::outside_equation: return QColor(0xD9, 0xD9, 0xD9);
  }
  return QColor(Qt::white);
}

QColor band_text_colour(RiskBand band) {
  return band == RiskBand::high || band == RiskBand::very_high ? QColor(Qt::white) : QColor(Qt::black);
}

QBrush band_brush(RiskBand band) {
  if (band == RiskBand::outside_equation) return QBrush(QColor(0x70, 0x70, 0x70), Qt::BDiagPattern);
  return QBrush(band_colour(band));
}

}  // namespace rackreach::drawing
