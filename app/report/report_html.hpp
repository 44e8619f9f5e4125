// SPDX-License-Identifier: MIT
#pragma once
// The report document as HTML: a standalone page for browsers, or the rich text the PDF writer lays out (Qt's
// rich-text subset: table attributes rather than style sheets, <thead> for headers repeated on every page).

#include <functional>
#include <string>
#include <utility>

#include "app/report/report_document.hpp"
#include "engine/io/text_columns.hpp"

namespace rackreach::report {

struct HtmlOptions {
  /// The image source of a rack drawing (a data URI, or a resource name the PDF writer registers); empty: none.
  std::function<std::string(const RackDrawing&)> image_src;
  double image_width_px = 0, image_height_px = 0;  ///< the drawings' size on the page
  /// Background and text colour (#rrggbb) of a band's cells; empty: no tint.
  std::function<std::pair<std::string, std::string>(RiskBand)> band_colours;
  bool for_print = false;  ///< the PDF writer's rich text: no style sheet, no page footer (it draws its own)
};

std::string render_html(const ReportDocument& doc, const HtmlOptions& options);

using text::html_escape;  // one escaper for every HTML output

}  // namespace rackreach::report
