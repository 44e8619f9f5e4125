// SPDX-License-Identifier: MIT
#include "app/report/report_writer.hpp"

#include <QBuffer>
#include <QCryptographicHash>
#include <QDateTime>
#include <QGuiApplication>
#include <QImage>
#include <QPageLayout>
#include <QPageSize>
#include <QPainter>
#include <QPdfWriter>
#include <QTextDocument>
#include <QAbstractTextDocumentLayout>
#include <QUrl>

#include <algorithm>
#include <cctype>

#include "anthropometry/data_dir.hpp"
#include "anthropometry/reach_setup.hpp"
#include "app/drawing/band_palette.hpp"
#include "app/drawing/rack_elevation.hpp"
#include "app/report/report_document.hpp"
#include "app/report/report_html.hpp"
#include "engine/assess.hpp"
#include "engine/io/atomic_file.hpp"
#include "engine/version.hpp"

namespace rackreach::report {
namespace {

// Page geometry, in CSS pixels (96 per inch), the unit the rich text's lengths are given in.
constexpr double css_px_per_mm = 96.0 / 25.4;
constexpr double margin_mm = 14.0;
constexpr double footer_mm = 8.0;
// The rack drawings: their size on the page, and how many image pixels each of those holds (sharp in print).
constexpr double drawing_width_px = 960, drawing_height_px = 540;
constexpr int drawing_pixel_ratio = 2;
constexpr double drawing_font_pt = 8.0;
constexpr double body_font_pt = 8.5;

bool digits(const std::string& s, std::size_t from, std::size_t count) {
  for (std::size_t i = from; i < from + count; ++i)
    if (i >= s.size() || !std::isdigit(static_cast<unsigned char>(s[i]))) return false;
  return true;
}

bool valid_date(const std::string& d) {
  const bool day_form = d.size() == 10;
  const bool time_form = d.size() == 20 && d[10] == 'T' && d[13] == ':' && d[16] == ':' && d[19] == 'Z' &&
                         digits(d, 11, 2) && digits(d, 14, 2) && digits(d, 17, 2);
  if (!(day_form || time_form) || d[4] != '-' || d[7] != '-' || !digits(d, 0, 4) || !digits(d, 5, 2) ||
      !digits(d, 8, 2))
    return false;
  const QDate date(std::stoi(d.substr(0, 4)), std::stoi(d.substr(5, 2)), std::stoi(d.substr(8, 2)));
  if (!date.isValid()) return false;
  return !time_form || QTime(std::stoi(d.substr(11, 2)), std::stoi(d.substr(14, 2)), std::stoi(d.substr(17, 2))).isValid();
}

QFont report_font(double pt) {
  QFont f(QStringLiteral("DejaVu Sans"));
  f.setStyleHint(QFont::SansSerif);
  f.setPointSizeF(pt);
  // No ligatures: the PDF's text must read back letter for letter ("fictional", not a "fi" glyph), so that it can
  // be searched and copied. Qt shapes without ligatures when the letter spacing is not zero.
  f.setLetterSpacing(QFont::AbsoluteSpacing, 0.05);  // (Qt keeps 1/64 px: smaller is zero)
  return f;
}

/// A rack face drawn with the app's drawing code.
QImage draw_rack(const Project& project, const ProjectAssessment& a, int rack_index) {
  const QSizeF size(drawing_width_px, drawing_height_px);
  QImage img(static_cast<int>(size.width()) * drawing_pixel_ratio, static_cast<int>(size.height()) * drawing_pixel_ratio,
             QImage::Format_RGB32);
  img.setDotsPerMeterX(qRound(96.0 / 0.0254));
  img.setDotsPerMeterY(qRound(96.0 / 0.0254));
  img.setDevicePixelRatio(drawing_pixel_ratio);
  img.fill(Qt::white);
  std::vector<const SlotFinding*> by_slot(project.store.slots.size(), nullptr);
  if (a.store)
    for (const SlotFinding& f : a.store->findings)
      if (f.slot_index < by_slot.size()) by_slot[f.slot_index] = &f;
  drawing::RackElevationScene scene;
  scene.store = &project.store;
  scene.rack = rack_index;
  scene.finding = [&by_slot](std::size_t i) { return i < by_slot.size() ? by_slot[i] : nullptr; };
  if (a.reach) {
    const double shoe = a.reach->parameters.footwear_allowance_cm;
    scene.workers = {drawing::make_worker_marks(a.reach->small, true, shoe, project.units),
                     drawing::make_worker_marks(a.reach->large, false, shoe, project.units)};
  }
  scene.display = gui::UnitDisplay(project.units, gui::DisplayChoice::as_file);
  scene.font = report_font(drawing_font_pt);
  scene.text_colour = Qt::black;
  QPainter p(&img);
  p.setRenderHint(QPainter::Antialiasing);
  const drawing::RackElevationLayout layout = drawing::layout_rack_elevation(scene, size);
  drawing::paint_rack_elevation(p, scene, layout, size);
  p.end();
  return img;
}

std::string png_bytes(const QImage& img) {
  QByteArray bytes;
  QBuffer buf(&bytes);
  buf.open(QIODevice::WriteOnly);
  img.save(&buf, "PNG");
  return bytes.toStdString();
}

std::pair<std::string, std::string> band_colours(RiskBand b) {
  return {drawing::band_colour(b).name().toStdString(), drawing::band_text_colour(b).name().toStdString()};
}

std::string drawing_resource(const RackDrawing& d) { return "rackreach-drawing:" + std::to_string(d.rack_index); }

/// QPdfWriter stamps the clock's time as the PDF's creation date; the report's own date replaces it, so that a
/// given date gives the same bytes. The replacement has the same length (Qt writes D:YYYYMMDDHHmmss and then Z or
/// +HH'mm'), so the file's cross-reference offsets stay right.
void set_creation_date(std::string& pdf, const std::string& date) {
  const std::string key = "/CreationDate (D:";
  const auto at = pdf.find(key);
  if (at == std::string::npos) return;
  const auto from = at + key.size();
  const auto close = pdf.find(')', from);
  if (close == std::string::npos || close - from < 15) return;
  std::string stamp = date.substr(0, 4) + date.substr(5, 2) + date.substr(8, 2);
  stamp += date.size() >= 19 ? date.substr(11, 2) + date.substr(14, 2) + date.substr(17, 2) : "000000";
  const std::size_t zone_length = close - from - 14;
  stamp += zone_length == 1 ? std::string("Z") : zone_length == 7 ? std::string("+00'00'") : pdf.substr(from + 14, zone_length);
  pdf.replace(from, stamp.size(), stamp);
}

/// The PDF: the rich text laid out on A4 landscape pages in the writer's own resolution, a footer with the page
/// number on each page.
std::string write_pdf(const ReportDocument& doc, const std::vector<QImage>& drawings, const std::string& title,
                      int& pages) {
  QByteArray bytes;
  QBuffer buf(&bytes);
  buf.open(QIODevice::WriteOnly);
  {
    QPdfWriter writer(&buf);
    writer.setCreator(QStringLiteral("Rackreach %1").arg(QString::fromUtf8(engine_version)));
    writer.setTitle(QString::fromStdString(title));
    writer.setResolution(300);
    writer.setPageLayout(QPageLayout(QPageSize(QPageSize::A4), QPageLayout::Landscape, QMarginsF(0, 0, 0, 0),
                                     QPageLayout::Millimeter));
    const double dev_per_mm = writer.resolution() / 25.4;
    const QSizeF page(writer.width(), writer.height());
    const double margin = margin_mm * dev_per_mm, footer = footer_mm * dev_per_mm;
    const QSizeF body(page.width() - 2 * margin, page.height() - 2 * margin - footer);

    QTextDocument text;
    text.documentLayout()->setPaintDevice(&writer);
    text.setDefaultFont(report_font(body_font_pt));
    text.setDocumentMargin(0);
    for (std::size_t i = 0; i < drawings.size(); ++i)
      text.addResource(QTextDocument::ImageResource,
                       QUrl(QString::fromStdString(drawing_resource(RackDrawing{static_cast<int>(i), "", false, ""}))),
                       QVariant(drawings[i]));
    HtmlOptions o;
    o.for_print = true;
    o.image_src = drawing_resource;
    o.image_width_px = drawing_width_px;
    o.image_height_px = drawing_height_px;
    o.band_colours = band_colours;
    text.setHtml(QString::fromStdString(render_html(doc, o)));
    text.setPageSize(body);
    pages = text.pageCount();

    QPainter p(&writer);
    const QFont footer_font = report_font(7.0);
    for (int i = 0; i < pages; ++i) {
      if (i > 0) writer.newPage();
      p.save();
      p.translate(margin, margin);
      p.setClipRect(QRectF(QPointF(0, 0), body));
      p.translate(0, -i * body.height());
      text.drawContents(&p, QRectF(0, i * body.height(), body.width(), body.height()));
      p.restore();
      p.setFont(footer_font);
      p.setPen(Qt::black);
      const QRectF foot(margin, page.height() - margin - footer * 0.8, body.width(), footer * 0.8);
      p.drawLine(QPointF(margin, foot.top()), QPointF(margin + body.width(), foot.top()));
      p.drawText(foot, Qt::AlignLeft | Qt::AlignBottom,
                 QString::fromStdString(doc.footer + " | report date " + doc.generated_at));
      p.drawText(foot, Qt::AlignRight | Qt::AlignBottom, QStringLiteral("page %1 of %2").arg(i + 1).arg(pages));
    }
    p.end();
  }
  std::string pdf = bytes.toStdString();
  set_creation_date(pdf, doc.generated_at);
  return pdf;
}

}  // namespace

std::optional<ReportFormat> find_report_format(const std::string& out_path) {
  std::string lower = out_path;
  std::transform(lower.begin(), lower.end(), lower.begin(), [](unsigned char ch) { return std::tolower(ch); });
  auto ends = [&](const char* e) {
    const std::string s(e);
    return lower.size() > s.size() && lower.compare(lower.size() - s.size(), s.size(), s) == 0;
  };
  if (ends(".pdf")) return ReportFormat::pdf;
  if (ends(".html") || ends(".htm")) return ReportFormat::html;
  return std::nullopt;
}

std::vector<std::string> validate_report_options(const ReportOptions& options, const std::string& out_path) {
  std::vector<std::string> out;
  if (options.date && !valid_date(*options.date))
    out.push_back("--date: \"" + *options.date +
                  "\" must be a calendar date YYYY-MM-DD or a UTC time YYYY-MM-DDTHH:MM:SSZ");
  if (!options.format && !find_report_format(out_path))
    out.push_back("--out: \"" + out_path + "\" must end in .pdf or .html (the report's format follows from it)");
  return out;
}

std::string calc_sha256_hex(const std::string& bytes) {
  return QCryptographicHash::hash(QByteArrayView(bytes.data(), static_cast<qsizetype>(bytes.size())),
                                  QCryptographicHash::Sha256)
      .toHex()
      .toStdString();
}

RenderedReport render_report(const Project& project, const ReportSource& source, ReportFormat format,
                             const ReportOptions& options) {
  RenderedReport out;
  if (!qobject_cast<QGuiApplication*>(QCoreApplication::instance())) {
    out.problems.push_back("the report needs a QGuiApplication (offscreen is enough) to lay out its pages");
    return out;
  }
  AssessOptions ao;
  ao.rounding = options.rounding;
  ao.duration_rule = options.duration_rule;
  if (project.has_shelf_geometry()) {
    LoadedReachSetup reach = load_reach_setup(project);
    if (!reach.setup) {
      for (const Problem& p : reach.problems) out.problems.push_back(format_problem(source.name, p));
      return out;
    }
    ao.reach = std::move(reach.setup);
  }
  const ProjectAssessment a = assess_project(project, ao);

  ReportContext ctx;
  ctx.input_name = source.name;
  ctx.input_sha256 = calc_sha256_hex(source.bytes);
  ctx.input_bytes = source.bytes.size();
  ctx.generated_at = options.date ? *options.date
                                  : QDateTime::currentDateTimeUtc().toString(Qt::ISODate).toStdString();
  ctx.site = options.site;
  ctx.assessor = options.assessor;
  ctx.revision = options.revision;
  ctx.tool_version = engine_version;
  ctx.self_check = run_self_check();
  ctx.drawings = true;
  out.self_check_passed = ctx.self_check.passed();
  const ReportDocument doc = build_report(project, a, ctx);

  std::vector<QImage> drawings;
  if (a.store)
    for (std::size_t i = 0; i < project.store.racks.size(); ++i)
      drawings.push_back(draw_rack(project, a, static_cast<int>(i)));

  if (format == ReportFormat::html) {
    HtmlOptions o;
    o.image_width_px = drawing_width_px;
    o.image_height_px = drawing_height_px;
    o.band_colours = band_colours;
    o.image_src = [&drawings](const RackDrawing& d) {
      if (d.rack_index < 0 || static_cast<std::size_t>(d.rack_index) >= drawings.size()) return std::string();
      const std::string png = png_bytes(drawings[static_cast<std::size_t>(d.rack_index)]);
      return "data:image/png;base64," +
             QByteArray(png.data(), static_cast<qsizetype>(png.size())).toBase64().toStdString();
    };
    out.bytes = render_html(doc, o);
    out.pages = 0;
  } else {
    out.bytes = write_pdf(doc, drawings, doc.title + ": " + (ctx.site ? *ctx.site : project.info.site.value_or("")),
                          out.pages);
  }
  return out;
}

ReportResult write_report(const Project& project, const ReportSource& source, const std::string& out_path,
                          const ReportOptions& options) {
  ReportResult r;
  r.problems = validate_report_options(options, out_path);
  if (!r.problems.empty()) return r;
  const ReportFormat format = options.format ? *options.format : *find_report_format(out_path);
  RenderedReport rendered = render_report(project, source, format, options);
  r.self_check_passed = rendered.self_check_passed;
  if (!rendered.problems.empty()) {
    r.problems = std::move(rendered.problems);
    return r;
  }
  if (auto err = write_file_atomically(out_path, rendered.bytes)) {
    r.problems.push_back(out_path + ": " + *err);
    return r;
  }
  r.written = true;
  r.pages = rendered.pages;
  r.bytes = rendered.bytes.size();
  return r;
}

}  // namespace rackreach::report
