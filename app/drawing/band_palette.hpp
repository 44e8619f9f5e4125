// SPDX-License-Identifier: MIT
#pragma once
// Band colours: one sequential, colour-blind-safe ramp, cividis (Nuñez, Anderton, Renslow 2018, "Optimizing
// colormaps with consideration for color vision deficiency", PLOS ONE 13(7): e0199239), sampled at five points
// and taken from light (within limit) to dark (very high). A colour is never shown alone: every tinted cell also
// carries the band's word or the LI. "Outside the equation" is not a degree of the ramp: it is a neutral grey
// with hatching, and says "outside".

#include <QBrush>
#include <QColor>

#include "engine/lifting/risk_bands.hpp"

namespace rackreach::drawing {

/// The fill of a band; `outside_equation` gets a light grey (pair it with band_pattern()).
QColor band_colour(RiskBand band);
/// Text colour readable on band_colour(band).
QColor band_text_colour(RiskBand band);
/// A brush for a band: solid on the ramp, hatched for outside the equation.
QBrush band_brush(RiskBand band);

}  // namespace rackreach::drawing
