// SPDX-License-Identifier: MIT
#pragma once
// The band colours live in the drawing library (app/drawing), which the report shares with the app.

#include "app/drawing/band_palette.hpp"

namespace rackreach::gui {
using drawing::band_brush;
using drawing::band_colour;
using drawing::band_text_colour;
}  // namespace rackreach::gui
