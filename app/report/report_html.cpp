// SPDX-License-Identifier: MIT
#include "app/report/report_html.hpp"

namespace rackreach::report {

namespace {

class HtmlWriter {
 public:
  HtmlWriter(const ReportDocument& doc, const HtmlOptions& o) : doc_(doc), o_(o) {}

  std::string write() {
    h_ += "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\n<title>" + html_escape(doc_.title) +
          "</title>\n";
    if (!o_.for_print)
      h_ += "<style>\nbody{font-family:sans-serif;font-size:10pt;margin:2em;max-width:75em}\n"
            "table{border-collapse:collapse;margin:.5em 0 1em 0}\nth,td{border:1px solid #888;padding:2px 5px;"
            "text-align:left;vertical-align:top}\nth{background:#e8e8e8}\ntd.n{text-align:right;white-space:nowrap}\n"
            ".notice{border:2px solid #444;padding:.5em;margin:1em 0;background:#f4f4f4}\n"
            ".alarm{border:4px solid #000;background:#fff0f0;font-weight:bold}\n.small{font-size:8.5pt}\n"
            "img{max-width:100%;height:auto}\n@media print{.newpage{break-before:page}}\n</style>\n";
    h_ += "</head><body>\n";
    h_ += "<h1>" + html_escape(doc_.title) + "</h1>\n<h2>" + html_escape(doc_.subtitle) + "</h2>\n";
    table(doc_.cover);
    for (const Block& b : doc_.cover_blocks) block(b);
    for (std::size_t i = 0; i < doc_.sections.size(); ++i) {
      const Section& s = doc_.sections[i];
      const std::string number = std::to_string(i + 1) + ". ";
      if (s.new_page)
        h_ += o_.for_print ? "<h2 style=\"page-break-before: always\">" : "<h2 class=\"newpage\">";
      else
        h_ += "<h2>";
      h_ += html_escape(number + s.title) + "</h2>\n";
      for (const Block& b : s.blocks) block(b);
    }
    if (!o_.for_print) h_ += "<hr>\n<p class=\"small\">" + html_escape(doc_.footer) + "</p>\n";
    h_ += "</body></html>\n";
    return std::move(h_);
  }

 private:
  void block(const Block& b) {
    std::visit([this](const auto& x) { write_block(x); }, b);
  }

  void write_block(const Paragraph& p) {
    h_ += p.small ? (o_.for_print ? "<p><small>" : "<p class=\"small\">") : "<p>";
    h_ += html_escape(p.text);
    h_ += p.small && o_.for_print ? "</small></p>\n" : "</p>\n";
  }
  void write_block(const Subheading& s) { h_ += "<h3>" + html_escape(s.text) + "</h3>\n"; }
  void write_block(const Bullets& b) {
    h_ += "<ul>\n";
    for (const std::string& i : b.items) h_ += "<li>" + html_escape(i) + "</li>\n";
    h_ += "</ul>\n";
  }
  void write_block(const Notice& n) {
    if (o_.for_print) {
      h_ += std::string("<table border=\"") + (n.alarm ? "4" : "2") +
            "\" cellspacing=\"0\" cellpadding=\"6\" width=\"100%\" style=\"border-collapse: collapse\"><tr><td "
            "bgcolor=\"" + (n.alarm ? "#fff0f0" : "#f4f4f4") + "\">";
      h_ += (n.alarm ? "<p style=\"font-size: 13pt\"><b>" : "<p><b>") + html_escape(n.title) + "</b></p><p>" +
            (n.alarm ? "<b>" : "") + html_escape(n.text) + (n.alarm ? "</b>" : "") + "</p></td></tr></table>\n";
    } else {
      h_ += std::string("<div class=\"notice") + (n.alarm ? " alarm" : "") + "\"><strong>" + html_escape(n.title) +
            "</strong><br>" + html_escape(n.text) + "</div>\n";
    }
  }
  void write_block(const RackDrawing& d) {
    const std::string src = o_.image_src ? o_.image_src(d) : std::string();
    if (d.new_page)
      h_ += o_.for_print ? "<h3 style=\"page-break-before: always\">" : "<h3 class=\"newpage\">";
    else
      h_ += "<h3>";
    h_ += html_escape(d.caption) + "</h3>\n";
    if (src.empty()) {
      h_ += "<p><b>Drawing of rack " + html_escape(d.rack_id) + " not included in this build.</b></p>\n";
      return;
    }
    h_ += "<p><img src=\"" + src + "\" width=\"" + std::to_string(static_cast<int>(o_.image_width_px)) +
          "\" height=\"" + std::to_string(static_cast<int>(o_.image_height_px)) + "\" alt=\"" +
          html_escape("Rack " + d.rack_id + " face, slots tinted by band with their LI") + "\"></p>\n";
  }
  void write_block(const SignOff& s) {
    h_ += "<table border=\"1\" cellspacing=\"0\" cellpadding=\"8\" width=\"100%\" style=\"border-collapse: "
          "collapse\">\n<thead><tr><th width=\"22%\" align=\"left\">Role</th><th width=\"28%\" align=\"left\">Name</th>"
          "<th width=\"32%\" align=\"left\">Signature</th><th width=\"18%\" align=\"left\">Date</th></tr></thead>\n";
    for (std::size_t i = 0; i < s.roles.size(); ++i)
      h_ += "<tr><td>" + html_escape(s.roles[i]) + "<br><br><br></td><td>" +
            html_escape(i < s.names.size() ? s.names[i] : "") + "</td><td></td><td></td></tr>\n";
    h_ += "</table>\n";
  }
  void write_block(const Table& t) { table(t); }

  void table(const Table& t) {
    h_ += "<table border=\"1\" cellspacing=\"0\" cellpadding=\"3\" width=\"100%\" style=\"border-collapse: "
          "collapse\">\n<thead><tr>";
    for (std::size_t i = 0; i < t.header.size(); ++i) {
      h_ += "<th";
      if (i < t.widths_pct.size()) h_ += " width=\"" + std::to_string(t.widths_pct[i]) + "%\"";
      if (o_.for_print) h_ += " bgcolor=\"#e8e8e8\" align=\"left\"";
      h_ += ">" + html_escape(t.header[i]) + "</th>";
    }
    h_ += "</tr></thead>\n<tbody>\n";
    for (const auto& row : t.rows) {
      h_ += "<tr>";
      for (const Cell& c : row) {
        h_ += "<td";
        if (c.numeric) h_ += o_.for_print ? " align=\"right\"" : " class=\"n\"";
        std::string fg;
        if (c.band && o_.band_colours) {
          const auto [bg, text] = o_.band_colours(*c.band);
          if (!bg.empty()) h_ += " bgcolor=\"" + bg + "\"" + (o_.for_print ? "" : " style=\"background:" + bg + "\"");
          fg = text;
        }
        h_ += ">";
        std::string inner = html_escape(c.text);
        for (std::size_t at = 0; (at = inner.find('\n', at)) != std::string::npos;) inner.replace(at, 1, "<br>");
        if (c.strong) inner = "<b>" + inner + "</b>";
        if (!fg.empty()) inner = "<span style=\"color:" + fg + "\">" + inner + "</span>";
        h_ += inner + "</td>";
      }
      h_ += "</tr>\n";
    }
    h_ += "</tbody></table>\n";
  }

  const ReportDocument& doc_;
  const HtmlOptions& o_;
  std::string h_;
};

}  // namespace

std::string render_html(const ReportDocument& doc, const HtmlOptions& options) {
  return HtmlWriter(doc, options).write();
}

}  // namespace rackreach::report
