// SPDX-License-Identifier: MIT
#include "app/gui/store_dialogs.hpp"

#include <QCheckBox>
#include <QComboBox>
#include <QDialogButtonBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QSpinBox>
#include <QTableWidget>
#include <QVBoxLayout>

#include <charconv>

#include "app/gui/format.hpp"

namespace rackreach::gui {
namespace {

std::string number_text(double v) {
  char buf[64];
  auto [end, ec] = std::to_chars(buf, buf + sizeof buf, v);
  return ec == std::errc() ? std::string(buf, end) : std::string{};
}

/// A number typed into a field, or a reason.
std::optional<double> read_number(const QString& text, const QString& what, QString& why) {
  bool ok = false;
  const double v = text.trimmed().toDouble(&ok);
  if (!ok && why.isEmpty()) why = QObject::tr("%1: \"%2\" is not a number").arg(what, text);
  return ok ? std::optional<double>(v) : std::nullopt;
}

QLabel* make_message_label() {
  auto* l = new QLabel;
  l->setWordWrap(true);
  l->setStyleSheet("color: #8B0000");
  l->setAccessibleName(QObject::tr("What is wrong"));
  l->setTextInteractionFlags(Qt::TextSelectableByMouse);
  return l;
}

QDialogButtonBox* make_buttons(QDialog* d, const std::function<void()>& ok) {
  auto* b = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel);
  QObject::connect(b, &QDialogButtonBox::accepted, d, ok);
  QObject::connect(b, &QDialogButtonBox::rejected, d, &QDialog::reject);
  return b;
}

}  // namespace

RackDialog::RackDialog(const ProjectModel& model, std::optional<std::size_t> index, QWidget* parent)
    : QDialog(parent), model_(model), index_(index) {
  setObjectName("rack_dialog");
  const Store& store = model.project().store;
  const bool editing = index && *index < store.racks.size();
  Rack rack;
  if (editing)
    rack = store.racks[*index];
  else {
    rack.id = "R" + std::to_string(store.racks.size() + 1);
    rack.zone = store.zones.empty() ? "" : store.zones.front().id;
    const bool metric = model.units() == UnitSystem::metric;
    rack.bay_width = metric ? 120.0 : 48.0;
    rack.shelf_depth = metric ? 60.0 : 24.0;
    rack.bays = 3;
    rack.levels = {{"1", metric ? 10.0 : 4.0, metric ? 40.0 : 16.0, LevelAccess::hand}};
  }
  setWindowTitle(editing ? tr("Edit rack %1").arg(q(rack.id)) : tr("Add a rack"));
  const QString lu = q(std::string(length_unit(model.units())));

  id_ = new QLineEdit(q(rack.id));
  kind_ = new QComboBox;
  kind_->addItem(tr("hand (every level picked by hand)"), "hand");
  kind_->addItem(tr("truck (every level by lift truck)"), "truck");
  kind_->addItem(tr("mixed (levels say which)"), "mixed");
  kind_->setCurrentIndex(rack.kind == RackKind::hand ? 0 : rack.kind == RackKind::truck ? 1 : 2);
  zone_ = new QComboBox;
  zone_->setEditable(true);
  for (const Zone& z : store.zones) zone_->addItem(q(z.id));
  zone_->setCurrentText(q(rack.zone));
  bays_ = new QSpinBox;
  bays_->setRange(0, 100000);  // the loader says what the limits are
  bays_->setValue(rack.bays);
  bay_width_ = new QLineEdit(q(number_text(rack.bay_width)));
  shelf_depth_ = new QLineEdit(q(number_text(rack.shelf_depth)));

  levels_ = new QTableWidget(0, 4);
  levels_->setHorizontalHeaderLabels(
      {tr("Level"), tr("Surface height (%1)").arg(lu), tr("Clear height (%1)").arg(lu), tr("Access")});
  levels_->horizontalHeader()->setStretchLastSection(true);
  for (int c = 0; c < 3; ++c) levels_->horizontalHeader()->setSectionResizeMode(c, QHeaderView::ResizeToContents);
  levels_->setAccessibleName(tr("Levels, from the floor up"));
  for (const Level& l : rack.levels) {
    const int r = levels_->rowCount();
    levels_->insertRow(r);
    levels_->setItem(r, 0, new QTableWidgetItem(q(l.id)));
    levels_->setItem(r, 1, new QTableWidgetItem(q(number_text(l.surface_height))));
    levels_->setItem(r, 2, new QTableWidgetItem(q(number_text(l.clear_height))));
    auto* access = new QComboBox;
    access->addItems({"hand", "truck"});
    access->setCurrentIndex(l.access == LevelAccess::hand ? 0 : 1);
    levels_->setCellWidget(r, 3, access);
  }
  auto* add = new QPushButton(tr("Add &level"));
  auto* remove = new QPushButton(tr("Re&move level"));
  connect(add, &QPushButton::clicked, this, &RackDialog::add_level);
  connect(remove, &QPushButton::clicked, this, [this] { remove_level(levels_->currentRow()); });

  auto* form = new QFormLayout;
  form->addRow(tr("Rack &id:"), id_);
  form->addRow(tr("&Kind:"), kind_);
  form->addRow(tr("&Zone:"), zone_);
  form->addRow(tr("&Bays:"), bays_);
  form->addRow(tr("Bay &width (%1):").arg(lu), bay_width_);
  form->addRow(tr("Shelf &depth (%1):").arg(lu), shelf_depth_);
  auto* level_buttons = new QHBoxLayout;
  level_buttons->addWidget(add);
  level_buttons->addWidget(remove);
  level_buttons->addStretch(1);
  message_ = make_message_label();
  auto* layout = new QVBoxLayout(this);
  layout->addLayout(form);
  auto* levels_label = new QLabel(tr("Le&vels, from the floor up:"));
  levels_label->setBuddy(levels_);
  layout->addWidget(levels_label);
  layout->addWidget(levels_, 1);
  layout->addLayout(level_buttons);
  layout->addWidget(message_);
  layout->addWidget(make_buttons(this, [this] { try_accept(); }));
  resize(620, 520);
}

void RackDialog::add_level() {
  const int r = levels_->rowCount();
  double top = 0.0;
  if (r > 0) {
    top = levels_->item(r - 1, 1)->text().toDouble() + levels_->item(r - 1, 2)->text().toDouble();
    top += model_.units() == UnitSystem::metric ? 5.0 : 2.0;  // a beam between levels (our placeholder)
  }
  levels_->insertRow(r);
  levels_->setItem(r, 0, new QTableWidgetItem(QString::number(r + 1)));
  levels_->setItem(r, 1, new QTableWidgetItem(q(number_text(top))));
  levels_->setItem(r, 2, new QTableWidgetItem(r > 0 ? levels_->item(r - 1, 2)->text() : QStringLiteral("40")));
  auto* access = new QComboBox;
  access->addItems({"hand", "truck"});
  levels_->setCellWidget(r, 3, access);
}

void RackDialog::remove_level(int row) {
  if (row >= 0 && row < levels_->rowCount()) levels_->removeRow(row);
}

std::optional<Rack> RackDialog::read(QString& why) const {
  Rack r;
  r.id = id_->text().trimmed().toStdString();
  const QString kind = kind_->currentData().toString();
  r.kind = kind == "hand" ? RackKind::hand : kind == "truck" ? RackKind::truck : RackKind::mixed;
  r.zone = zone_->currentText().trimmed().toStdString();
  r.bays = bays_->value();
  const auto width = read_number(bay_width_->text(), tr("bay width"), why);
  const auto depth = read_number(shelf_depth_->text(), tr("shelf depth"), why);
  for (int i = 0; i < levels_->rowCount(); ++i) {
    Level l;
    l.id = levels_->item(i, 0) ? levels_->item(i, 0)->text().trimmed().toStdString() : std::string();
    const auto surface = read_number(levels_->item(i, 1) ? levels_->item(i, 1)->text() : QString(),
                                     tr("level %1 surface height").arg(i + 1), why);
    const auto clear = read_number(levels_->item(i, 2) ? levels_->item(i, 2)->text() : QString(),
                                   tr("level %1 clear height").arg(i + 1), why);
    const auto* access = qobject_cast<QComboBox*>(levels_->cellWidget(i, 3));
    l.access = access && access->currentText() == "truck" ? LevelAccess::truck : LevelAccess::hand;
    l.surface_height = surface.value_or(0.0);
    l.clear_height = clear.value_or(0.0);
    r.levels.push_back(l);
  }
  if (!why.isEmpty()) return std::nullopt;
  r.bay_width = *width;
  r.shelf_depth = *depth;
  return r;
}

namespace {

/// Accepts `dialog` with `candidate` as its result when the project file's loader would accept the store; else
/// shows the loader's problems in `message` and keeps the dialog open.
bool accept_if_loadable(QDialog& dialog, const ProjectModel& model, Store candidate, Store& result, QLabel* message) {
  const std::vector<Problem> problems = model.check_store(candidate);
  if (!problems.empty()) {
    message->setText(QDialog::tr("Not accepted (the project file's rules): %1")
                         .arg(q(ProjectModel::describe_problems(problems))));
    return false;
  }
  result = std::move(candidate);
  message->clear();
  dialog.accept();
  return true;
}

}  // namespace

bool RackDialog::try_accept() {
  QString why;
  const std::optional<Rack> rack = read(why);
  if (rack) {
    if (accept_if_loadable(*this, model_, model_.store_with_rack(index_, *rack), result_, message_)) return true;
  } else {
    message_->setText(why);
  }
  return false;
}

QString RackDialog::message() const {
  return message_->text();
}

ZoneDialog::ZoneDialog(const ProjectModel& model, std::optional<std::size_t> index, QWidget* parent)
    : QDialog(parent), model_(model), index_(index) {
  setObjectName("zone_dialog");
  const Store& store = model.project().store;
  const bool editing = index && *index < store.zones.size();
  const UnitSystem u = model.units();
  auto in_units = [u](double cm) { return Length{cm, UnitSystem::metric}.in_units(u); };
  if (editing)
    original_ = store.zones[*index];
  else {
    original_.id = "Z" + std::to_string(store.zones.size() + 1);
    original_.standing_distance = {in_units(ZoneDefaults::standing_distance_cm), ValueSource::built_in_default};
    original_.cart_deck_height = {in_units(ZoneDefaults::cart_deck_height_cm), ValueSource::built_in_default};
    original_.cart_h = {in_units(ZoneDefaults::cart_h_cm), ValueSource::built_in_default};
    original_.turn_angle_deg = {ZoneDefaults::turn_angle_deg, ValueSource::built_in_default};
    original_.origin_angle_deg = {ZoneDefaults::origin_angle_deg, ValueSource::built_in_default};
  }
  setWindowTitle(editing ? tr("Edit zone %1").arg(q(original_.id)) : tr("Add a zone"));
  const QString lu = q(std::string(length_unit(u)));
  id_ = new QLineEdit(q(original_.id));
  auto* form = new QFormLayout;
  form->addRow(tr("Zone &id:"), id_);
  const struct {
    const char* key;
    QString label;
    SourcedValue Zone::*field;
    double default_value;
  } rows[] = {
      {"standing_distance", tr("&Standing distance, ankles to rack face (%1):").arg(lu), &Zone::standing_distance,
       in_units(ZoneDefaults::standing_distance_cm)},
      {"cart_deck_height", tr("Cart &deck height (%1):").arg(lu), &Zone::cart_deck_height,
       in_units(ZoneDefaults::cart_deck_height_cm)},
      {"cart_h", tr("Cart &H, ankles to hands (%1):").arg(lu), &Zone::cart_h, in_units(ZoneDefaults::cart_h_cm)},
      {"turn_angle", tr("&Turn angle to the cart (deg):"), &Zone::turn_angle_deg, ZoneDefaults::turn_angle_deg},
      {"origin_angle", tr("&Angle at the rack (deg):"), &Zone::origin_angle_deg, ZoneDefaults::origin_angle_deg},
  };
  for (const auto& r : rows) {
    auto* e = new QLineEdit;
    const SourcedValue& v = original_.*(r.field);
    if (v.source == ValueSource::file) e->setText(q(number_text(v.value)));
    e->setPlaceholderText(tr("default %1").arg(q(number_text(r.default_value))));
    fields_[QString::fromLatin1(r.key)] = e;
    form->addRow(r.label, e);
  }
  control_ = new QCheckBox(tr("Parts are placed with &care in the kit (significant control at the destination)"));
  control_->setChecked(original_.control_at_destination);
  message_ = make_message_label();
  auto* layout = new QVBoxLayout(this);
  layout->addLayout(form);
  layout->addWidget(control_);
  layout->addWidget(new QLabel(tr("The zone's lifting pattern and limits of application are kept as they are.")));
  layout->addWidget(message_);
  layout->addWidget(make_buttons(this, [this] { try_accept(); }));
}

QLineEdit* ZoneDialog::field(const QString& key) const {
  auto it = fields_.find(key);
  return it == fields_.end() ? nullptr : it->second;
}

bool ZoneDialog::try_accept() {
  Zone z = original_;
  z.id = id_->text().trimmed().toStdString();
  z.control_at_destination = control_->isChecked();
  QString why;
  const UnitSystem u = model_.units();
  auto in_units = [u](double cm) { return Length{cm, UnitSystem::metric}.in_units(u); };
  const std::pair<const char*, std::pair<SourcedValue Zone::*, double>> rows[] = {
      {"standing_distance", {&Zone::standing_distance, in_units(ZoneDefaults::standing_distance_cm)}},
      {"cart_deck_height", {&Zone::cart_deck_height, in_units(ZoneDefaults::cart_deck_height_cm)}},
      {"cart_h", {&Zone::cart_h, in_units(ZoneDefaults::cart_h_cm)}},
      {"turn_angle", {&Zone::turn_angle_deg, ZoneDefaults::turn_angle_deg}},
      {"origin_angle", {&Zone::origin_angle_deg, ZoneDefaults::origin_angle_deg}},
  };
  for (const auto& [key, spec] : rows) {
    const QString text = fields_.at(QString::fromLatin1(key))->text().trimmed();
    if (text.isEmpty())
      z.*(spec.first) = {spec.second, ValueSource::built_in_default};
    else if (const auto v = read_number(text, QString::fromLatin1(key), why))
      z.*(spec.first) = {*v, ValueSource::file};
  }
  if (why.isEmpty()) {
    if (accept_if_loadable(*this, model_, model_.store_with_zone(index_, z), result_, message_)) return true;
  } else {
    message_->setText(why);
  }
  return false;
}

QString ZoneDialog::message() const {
  return message_->text();
}

}  // namespace rackreach::gui
