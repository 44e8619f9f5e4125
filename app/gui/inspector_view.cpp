// SPDX-License-Identifier: MIT
#include "app/gui/inspector_view.hpp"

#include <QScrollBar>

#include "app/gui/band_palette.hpp"
#include "app/gui/display_units.hpp"
#include "app/gui/format.hpp"
#include "engine/caution.hpp"

namespace rackreach::gui {
namespace {

QString esc(const QString& s) { return s.toHtmlEscaped(); }
QString esc(const std::string& s) { return q(s).toHtmlEscaped(); }

QString row(const QString& name, const QString& value, const QString& unit, const QString& source) {
  return QStringLiteral("<tr><td>%1</td><td align=right><b>%2</b></td><td>%3</td><td><i>%4</i></td></tr>")
      .arg(esc(name), esc(value), esc(unit), esc(source));
}

QString source_text(const SourcedValue& v, const QString& what) {
  return QStringLiteral("%1 (%2)").arg(q(std::string(value_source_name(v.source))), what);
}

QString multiplier_cell(const Multiplier& m) {
  QString s = fmt(m.value, 3);
  if (m.rule != BoundaryRule::none) s += QStringLiteral(" <small>[%1]</small>").arg(esc(q(boundary_rule_code(m.rule))));
  return s;
}

QString band_badge(RiskBand band, const std::optional<double>& li) {
  const QColor bg = band_colour(band), fg = band_text_colour(band);
  return QStringLiteral("<table cellpadding=4><tr><td style='background:%1;color:%2'><b>LI %3 &mdash; %4</b></td>"
                        "</tr></table>")
      .arg(bg.name(), fg.name(), li ? fmt(*li, 3) : QStringLiteral("outside (undefined)"),
           esc(q(std::string(band_name(band)))));
}

}  // namespace

QString make_task_result_html(const LiftTask& task, const TaskResult& r, const UnitDisplay& d) {
  const QString lu = d.length_unit(), mu = d.mass_unit();
  QString h;
  h += QStringLiteral("<h3>Multipliers and results</h3><table border=1 cellspacing=0 cellpadding=3>"
                      "<tr><th></th><th>origin</th><th>input used</th><th>destination</th><th>input used</th></tr>");
  const struct {
    const char* name;
    const Multiplier PointResult::*m;
    QString unit;
    bool length;  ///< the input used is a length, shown in the shown unit
  } ms[] = {{"HM", &PointResult::hm, lu, true},      {"VM", &PointResult::vm, lu, true},
            {"DM", &PointResult::dm, lu, true},      {"AM", &PointResult::am, "deg", false},
            {"FM", &PointResult::fm, "/min", false}, {"CM", &PointResult::cm, lu + " (V)", true}};
  for (const auto& m : ms) {
    const Multiplier& o = r.origin.*(m.m);
    const Multiplier& e = r.destination.*(m.m);
    auto input = [&](const Multiplier& x) { return m.length ? d.length_text(x.input_used, 1) : fmt(x.input_used, 1); };
    h += QStringLiteral("<tr><td>%1</td><td align=right>%2</td><td>%3 %6</td><td align=right>%4</td>"
                        "<td>%5 %6</td></tr>")
             .arg(m.name, multiplier_cell(o), input(o), multiplier_cell(e), input(e), esc(m.unit));
  }
  const struct {
    const char* name;
    double PointResult::*v;
  } ws[] = {{"RWL", &PointResult::rwl}, {"FIRWL", &PointResult::firwl}, {"STRWL", &PointResult::strwl}};
  for (const auto& w : ws)
    h += QStringLiteral("<tr><td>%1</td><td align=right><b>%2</b></td><td>%4</td><td align=right><b>%3</b></td>"
                        "<td>%4</td></tr>")
             .arg(w.name, d.mass_text(r.origin.*(w.v), 3), d.mass_text(r.destination.*(w.v), 3), mu);
  const struct {
    const char* name;
    std::optional<double> PointResult::*v;
  } is[] = {{"LI", &PointResult::li}, {"FILI", &PointResult::fili}, {"STLI", &PointResult::stli}};
  for (const auto& i : is)
    h += QStringLiteral("<tr><td>%1</td><td align=right><b>%2</b></td><td></td><td align=right><b>%3</b></td>"
                        "<td></td></tr>")
             .arg(i.name, fmt(r.origin.*(i.v), 3, "undefined"), fmt(r.destination.*(i.v), 3, "undefined"));
  h += QStringLiteral("</table><p>Governing end: <b>%1</b>%2. Load %3 %4.</p>")
           .arg(q(lift_end_name(r.governing)),
                task.control_at_destination ? QStringLiteral(" (significant control at the destination: the lower "
                                                             "RWL governs)")
                                            : QStringLiteral(" (no significant control at the destination)"),
                d.mass_text(task.load, 2), mu);
  if (d.converts())
    h += QStringLiteral("<p><small>Shown in %1 and %2; computed in the file's units (%3, %4) with the equation's "
                        "%5 form.</small></p>")
             .arg(lu, mu, d.file_length_unit(), d.file_mass_unit(),
                  d.file() == UnitSystem::metric ? QStringLiteral("metric") : QStringLiteral("US"));
  return h;
}

QString make_caution_html() {
  return QStringLiteral("<h3>Cautions</h3><p>%1</p><p><small>Method: %2. Bands: within limit LI &le; 1.0; elevated "
                        "&le; 2.0; high &le; 3.0; very high above 3.0 (1.0 and 3.0 are the Applications Manual's "
                        "interpretation points; the 2.0 boundary and the words are Rackreach's).</small></p>")
      .arg(esc(QString::fromUtf8(caution_text)), esc(QString::fromUtf8(lifting_method_text)));
}

QString make_finding_html(const ProjectModel& model, const SlotFinding& f) {
  const UnitSystem u = model.units();
  const UnitDisplay d = model.display();
  const QString lu = d.length_unit(), mu = d.mass_unit();
  auto len = [&](double v) { return d.length_text(v, 1); };
  const Store& store = model.project().store;
  const Slot& slot = store.slots.at(f.slot_index);
  const Part* part = store.find_part(f.part_id);
  const Rack* rack = store.find_rack(f.rack_id);
  const Zone* zone = rack ? store.find_zone(rack->zone) : nullptr;
  const Level* level = rack ? store.find_level(*rack, f.level_id) : nullptr;
  const LiftTask& t = f.lift.task;

  QString h;
  h += QStringLiteral("<h2>Slot %1</h2><p>Part <b>%2</b> (%3)%4<br>Rack %5, level %6, bay %7, %8%9</p>")
           .arg(esc(f.slot_id), esc(f.part_id), esc(f.family),
                part && !part->description.empty() ? QStringLiteral(": ") + esc(part->description) : QString(),
                esc(f.rack_id), esc(f.level_id))
           .arg(slot.bay)
           .arg(slot.position == SlotPosition::front ? "front" : "back",
                f.truck_access ? QStringLiteral(", <b>truck-access level</b>: picked by lift truck, not by hand")
                               : QString());
  h += band_badge(f.band, f.result.li);

  // Inputs with unit and source.
  h += QStringLiteral("<h3>Inputs</h3><table cellspacing=0 cellpadding=2><tr><th align=left>input</th>"
                      "<th>value</th><th align=left>unit</th><th align=left>from</th></tr>");
  if (part) {
    h += row("unit weight", d.mass_text(part->unit_weight, 2), mu, "file (part " + q(part->id) + ")");
    h += row("pieces per grasp", fmt(part->pieces_per_grasp, 2), "", "file or default 1 (part)");
  }
  h += row("load L", d.mass_text(t.load, 2), mu, "derived: unit weight x pieces per grasp");
  if (part) h += row("pieces per kit", fmt(part->pieces_per_kit, 2), "", "file or default 1 (part)");
  h += row("lifts per kit", fmt(f.lift.lifts_per_kit, 2), "", "derived: pieces per kit / pieces per grasp");
  h += row("kits per hour", fmt(store.kits_per_hour, 1), "/h", "file (demand)");
  h += row("frequency F", fmt(t.frequency_per_min, 3), "lifts/min", "derived: kits/h x lifts per kit / 60");
  h += row("coupling", q(std::string(coupling_name(t.coupling))), "", q(f.lift.coupling_reason));
  if (level) {
    h += row("level surface", len(level->surface_height), lu, "file (level " + q(level->id) + ")");
    h += row("level clear height", len(level->clear_height), lu, "file");
  }
  if (rack) h += row("shelf depth", len(rack->shelf_depth), lu, "file (rack " + q(rack->id) + ")");
  h += row("grip height in the box", len(f.lift.grip_height), lu,
           part && part->grip_height ? QStringLiteral("file (part)") : QStringLiteral("default: half the box height"));
  h += row("standing distance", len(f.lift.standing_distance.value), lu,
           source_text(f.lift.standing_distance, slot.standing_distance ? "slot" : "zone"));
  h += row("hands in shelf", len(f.lift.hands_in_shelf), lu, "derived: half the box depth from front or back");
  h += row("origin H", len(t.origin.h), lu, "derived: standing distance + hands in shelf");
  h += row("origin V", len(t.origin.v), lu, "derived: level surface + grip height");
  h += row("origin A", fmt(t.origin.a_deg, 0), "deg",
           slot.origin_angle_deg ? QStringLiteral("file (slot)")
           : zone                ? source_text(zone->origin_angle_deg, "zone " + q(zone->id))
                                 : QStringLiteral("default"));
  if (zone) {
    h += row("cart deck height", len(zone->cart_deck_height.value), lu, source_text(zone->cart_deck_height, "zone"));
    h += row("destination H", len(t.destination.h), lu, source_text(zone->cart_h, "zone cart H"));
    h += row("destination V", len(t.destination.v), lu, "derived: cart deck + grip height");
    h += row("destination A", fmt(t.destination.a_deg, 0), "deg", source_text(zone->turn_angle_deg, "zone turn"));
  }
  h += row("travel D", len(std::abs(t.destination.v - t.origin.v)), lu, "derived: |V dest - V origin|");
  h += row("significant control at destination", t.control_at_destination ? "yes" : "no", "",
           zone ? QStringLiteral("zone %1").arg(q(zone->id)) : QStringLiteral("default"));
  h += QStringLiteral("</table>");

  h += make_task_result_html(t, f.result, d);

  // Reach.
  h += QStringLiteral("<h3>Reach</h3>");
  if (f.reach) {
    const ReachResult& r = *f.reach;
    h += QStringLiteral("<p>Small worker: %1, %2 (maximum-reach margin %3, comfortable %4); large worker: %5."
                        "</p><ul>")
             .arg(esc(q(height_zone_name(r.small_height_zone))), esc(q(depth_zone_name(r.depth_zone))),
                  d.cm_with_unit(r.small_max_reach_margin_cm, 1),
                  d.cm_with_unit(r.small_comfortable_reach_margin_cm, 1),
                  esc(q(height_zone_name(r.large_height_zone))));
    for (const ReachCheck& c : r.checks)
      h += QStringLiteral("<li>%1 <b>%2</b>: %3</li>")
               .arg(c.passed ? QStringLiteral("passes") : c.advisory ? QStringLiteral("advisory") : QStringLiteral("FAILS"),
                    esc(c.code), c.message.empty() ? esc(QStringLiteral("margin ") + d.cm_with_unit(c.margin_cm, 1))
                                                  : esc(c.message));
    h += QStringLiteral("</ul>");
  } else {
    h += QStringLiteral("<p>Not checked (no reach setup).</p>");
  }

  // Warnings, limits of application, remedies.
  h += QStringLiteral("<h3>Warnings</h3>");
  if (d.converts())
    h += QStringLiteral("<p><small>Warnings and reach sentences give their numbers in the units they were computed "
                        "in, named beside each number.</small></p>");
  std::vector<const Warning*> all;
  for (const Warning& w : f.result.warnings) all.push_back(&w);
  for (const Warning& w : f.warnings) all.push_back(&w);
  bool limits = false;
  if (all.empty()) h += QStringLiteral("<p>None.</p>");
  else {
    h += QStringLiteral("<ul>");
    for (const Warning* w : all) {
      limits = limits || w->is_limit_of_application();
      h += QStringLiteral("<li><code>%1</code> %2</li>").arg(esc(q(warning_code(*w))), esc(describe_warning(*w, u)));
    }
    h += QStringLiteral("</ul>");
  }
  h += QStringLiteral("<h3>Limits of application</h3><p>%1</p>")
           .arg(limits ? QStringLiteral("<b>A limit of application applies</b> (see the warnings): the equation may "
                                        "underestimate the risk of this lift.")
                       : QStringLiteral("None recorded for this lift (the zone's limits apply to every slot in it). "
                                        "The equation applies only within its stated limits."));
  h += QStringLiteral("<h3>Remedies</h3>");
  if (f.remedies.empty()) h += QStringLiteral("<p>None needed.</p>");
  else {
    h += QStringLiteral("<ol>");
    for (const Remedy& r : f.remedies)
      h += QStringLiteral("<li><b>%1</b>%2: %3</li>")
               .arg(esc(QString::fromUtf8(remedy_name(r.kind))),
                    r.target.empty() ? QString() : QStringLiteral(" (%1)").arg(esc(r.target)), esc(r.reason));
    h += QStringLiteral("</ol>");
  }
  h += make_caution_html();
  return h;
}

InspectorView::InspectorView(ProjectModel& model, QWidget* parent) : QTextBrowser(parent), model_(model) {
  setAccessibleName(tr("Inspector"));
  setOpenLinks(false);
  connect(&model_, &ProjectModel::changed, this, &InspectorView::refresh);
  connect(&model_, &ProjectModel::display_changed, this, &InspectorView::refresh);
  refresh();
}

void InspectorView::set_selected_slot(std::optional<std::size_t> slot_index) {
  selected_ = slot_index;
  refresh();
}

void InspectorView::refresh() {
  const SlotFinding* f = selected_ ? model_.find_finding(*selected_) : nullptr;
  if (!f) {
    shown_li_.clear();
    shown_load_.clear();
    shown_rwl_origin_.clear();
    shown_rwl_destination_.clear();
    show_html(QStringLiteral("<h2>Inspector</h2><p>Select a slot in the rack drawing or in the findings list to see "
                             "every input, multiplier and result of its pick.</p>") +
              make_caution_html());
    return;
  }
  shown_li_ = f->result.li ? fmt(*f->result.li, 3) : QStringLiteral("outside");
  const UnitDisplay d = model_.display();
  shown_load_ = d.mass_with_unit(f->lift.task.load, 2);
  shown_rwl_origin_ = d.mass_with_unit(f->result.origin.rwl, 3);
  shown_rwl_destination_ = d.mass_with_unit(f->result.destination.rwl, 3);
  show_html(make_finding_html(model_, *f));
}

void InspectorView::show_html(const QString& html) {
  if (html == html_) return;
  html_ = html;
  const int scroll = verticalScrollBar() ? verticalScrollBar()->value() : 0;
  setHtml(html);
  if (verticalScrollBar()) verticalScrollBar()->setValue(scroll);
}

}  // namespace rackreach::gui
