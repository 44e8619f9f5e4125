// SPDX-License-Identifier: MIT
#include "app/gui/task_form.hpp"

#include <QCheckBox>
#include <QComboBox>
#include <QGridLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QSplitter>
#include <QTextBrowser>
#include <QVBoxLayout>

#include "app/gui/band_palette.hpp"
#include "app/gui/edit_commands.hpp"
#include "app/gui/format.hpp"
#include "app/gui/inspector_view.hpp"

namespace rackreach::gui {
namespace {
const char* const limit_flags[][2] = {{"one_handed", "one-handed"},
                                      {"seated_or_kneeling", "seated or kneeling"},
                                      {"restricted_space", "restricted space"},
                                      {"unstable_load", "unstable load"},
                                      {"wheelbarrow_or_shovel", "wheelbarrow or shovel"},
                                      {"high_speed", "fast lifting (over about 76 cm/s)"}};
}  // namespace

TaskForm::TaskForm(ProjectModel& model, QWidget* parent) : QWidget(parent), model_(model) {
  auto* outer = new QHBoxLayout(this);
  auto* left = new QWidget;
  auto* left_layout = new QVBoxLayout(left);
  left_layout->setContentsMargins(0, 0, 0, 0);

  auto* pick_row = new QHBoxLayout;
  pick_row->addWidget(new QLabel(tr("Task of the project:")));
  task_list_ = new QComboBox;
  task_list_->setAccessibleName(tr("Task to edit"));
  pick_row->addWidget(task_list_, 1);
  left_layout->addLayout(pick_row);

  auto* box = new QGroupBox(tr("Lift task"));
  auto* grid = new QGridLayout(box);
  grid->setColumnStretch(3, 1);
  grid->setColumnMinimumWidth(3, 220);
  add_field(grid, "id", tr("Task id"), {}, 0);
  {
    grid->addWidget(new QLabel(tr("Duration")), 1, 0);
    duration_ = new QComboBox;
    duration_->addItem(tr("short (up to 1 h)"), "short");
    duration_->addItem(tr("moderate (1 to 2 h)"), "moderate");
    duration_->addItem(tr("long (2 to 8 h)"), "long");
    grid->addWidget(duration_, 1, 1, 1, 2);
    messages_["duration"] = new QLabel;
    grid->addWidget(messages_["duration"], 1, 3);
  }
  add_field(grid, "load", tr("Load L"), {}, 2);
  add_field(grid, "max_load", tr("Max load (optional)"), {}, 3);
  add_field(grid, "frequency", tr("Frequency F"), tr("lifts/min"), 4);
  {
    grid->addWidget(new QLabel(tr("Coupling")), 5, 0);
    coupling_ = new QComboBox;
    for (const char* c : {"good", "fair", "poor"}) coupling_->addItem(c, c);
    grid->addWidget(coupling_, 5, 1, 1, 2);
    messages_["coupling"] = new QLabel;
    grid->addWidget(messages_["coupling"], 5, 3);
  }
  add_field(grid, "origin.h", tr("Origin H"), {}, 6);
  add_field(grid, "origin.v", tr("Origin V"), {}, 7);
  add_field(grid, "origin.a", tr("Origin A"), tr("deg"), 8);
  add_field(grid, "destination.h", tr("Destination H"), {}, 9);
  add_field(grid, "destination.v", tr("Destination V"), {}, 10);
  add_field(grid, "destination.a", tr("Destination A"), tr("deg"), 11);
  control_ = new QCheckBox(tr("Significant control at the destination"));
  grid->addWidget(control_, 12, 0, 1, 4);
  left_layout->addWidget(box);

  auto* limits = new QGroupBox(tr("Limits of application (any that applies marks the task)"));
  auto* lg = new QGridLayout(limits);
  lg->setColumnStretch(3, 1);
  int r = 0;
  for (const auto& f : limit_flags) {
    auto* cb = new QCheckBox(tr(f[1]));
    limit_boxes_[f[0]] = cb;
    lg->addWidget(cb, r / 2, (r % 2) * 2, 1, 2);
    connect(cb, &QCheckBox::toggled, this, &TaskForm::recheck);
    ++r;
  }
  const int base_row = (r + 1) / 2;
  const struct {
    const char* key;
    QString label, unit;
  } nums[] = {{"limits.carry_push_share", tr("Carry/push share"), tr("0 to 1")},
              {"limits.floor_friction", tr("Floor friction"), tr("coefficient")},
              {"limits.temperature_c", tr("Temperature"), tr("C")},
              {"limits.humidity_pct", tr("Humidity"), tr("%")}};
  int i = 0;
  for (const auto& n : nums) {
    auto* label = new QLabel(n.label);
    auto* edit = new QLineEdit;
    edit->setAccessibleName(n.label);
    edit->setPlaceholderText(tr("not given"));
    auto* unit = new QLabel(n.unit);
    auto* msg = new QLabel;
    msg->setWordWrap(true);
    lg->addWidget(label, base_row + i, 0);
    lg->addWidget(edit, base_row + i, 1);
    lg->addWidget(unit, base_row + i, 2);
    lg->addWidget(msg, base_row + i, 3);
    label->setBuddy(edit);
    edits_[n.key] = edit;
    messages_[n.key] = msg;
    connect(edit, &QLineEdit::textChanged, this, &TaskForm::recheck);
    ++i;
  }
  left_layout->addWidget(limits);

  auto* buttons = new QHBoxLayout;
  add_button_ = new QPushButton(tr("&Add as a new job"));
  replace_button_ = new QPushButton(tr("&Replace the task in the project"));
  buttons->addWidget(add_button_);
  buttons->addWidget(replace_button_);
  buttons->addStretch(1);
  left_layout->addLayout(buttons);
  left_layout->addStretch(1);

  auto* right = new QWidget;
  auto* right_layout = new QVBoxLayout(right);
  right_layout->setContentsMargins(0, 0, 0, 0);
  summary_ = new QLabel;
  summary_->setWordWrap(true);
  summary_->setTextFormat(Qt::RichText);
  summary_->setAccessibleName(tr("Task result summary"));
  other_problems_ = new QLabel;
  other_problems_->setWordWrap(true);
  results_ = new QTextBrowser;
  results_->setAccessibleName(tr("Task results"));
  right_layout->addWidget(summary_);
  right_layout->addWidget(other_problems_);
  right_layout->addWidget(results_, 1);

  auto* split = new QSplitter;
  split->addWidget(left);
  split->addWidget(right);
  split->setStretchFactor(0, 3);
  split->setStretchFactor(1, 2);
  split->setSizes({640, 440});
  outer->addWidget(split);

  connect(duration_, &QComboBox::currentIndexChanged, this, &TaskForm::recheck);
  connect(coupling_, &QComboBox::currentIndexChanged, this, &TaskForm::recheck);
  connect(control_, &QCheckBox::toggled, this, &TaskForm::recheck);
  connect(add_button_, &QPushButton::clicked, this, [this] { apply(true); });
  connect(replace_button_, &QPushButton::clicked, this, [this] { apply(false); });
  connect(task_list_, &QComboBox::activated, this, [this](int index) {
    const QVariant v = task_list_->itemData(index);
    if (!v.isValid()) {
      editing_.reset();
      recheck();
      return;
    }
    const QPoint jt = v.toPoint();
    load_task(static_cast<std::size_t>(jt.x()), static_cast<std::size_t>(jt.y()));
  });
  connect(&model_, &ProjectModel::changed, this, &TaskForm::refill_task_list);
  refill_task_list();
  edits_["id"]->setText("T1");
  recheck();
}

void TaskForm::add_field(QGridLayout* grid, const std::string& key, const QString& label, const QString& unit,
                         int row) {
  auto* l = new QLabel(label);
  auto* e = new QLineEdit;
  e->setAccessibleName(label);
  l->setBuddy(e);
  auto* u = new QLabel(unit);
  auto* m = new QLabel;
  m->setWordWrap(true);
  m->setTextFormat(Qt::PlainText);
  edits_[key] = e;
  messages_[key] = m;
  unit_labels_[key] = u;
  grid->addWidget(l, row, 0);
  grid->addWidget(e, row, 1);
  grid->addWidget(u, row, 2);
  grid->addWidget(m, row, 3);
  connect(e, &QLineEdit::textChanged, this, &TaskForm::recheck);
}

QLineEdit* TaskForm::field(const std::string& key) const {
  auto it = edits_.find(key);
  return it == edits_.end() ? nullptr : it->second;
}

QString TaskForm::field_message(const std::string& key) const {
  auto it = messages_.find(key);
  return it == messages_.end() ? QString() : it->second->text();
}

TaskFields TaskForm::fields() const {
  TaskFields f;
  auto text = [this](const char* k) { return edits_.at(k)->text().toStdString(); };
  if (editing_ && editing_->first < model_.project().jobs.size()) f.job_id = model_.project().jobs[editing_->first].id;
  f.task_id = text("id");
  f.load = text("load");
  f.max_load = text("max_load");
  f.frequency = text("frequency");
  f.duration = duration_->currentData().toString().toStdString();
  f.work_pattern = pattern_;
  f.coupling = coupling_->currentData().toString().toStdString();
  f.origin_h = text("origin.h");
  f.origin_v = text("origin.v");
  f.origin_a = text("origin.a");
  f.destination_h = text("destination.h");
  f.destination_v = text("destination.v");
  f.destination_a = text("destination.a");
  f.control_at_destination = control_->isChecked();
  f.one_handed = limit_boxes_.at("one_handed")->isChecked();
  f.seated_or_kneeling = limit_boxes_.at("seated_or_kneeling")->isChecked();
  f.restricted_space = limit_boxes_.at("restricted_space")->isChecked();
  f.unstable_load = limit_boxes_.at("unstable_load")->isChecked();
  f.wheelbarrow_or_shovel = limit_boxes_.at("wheelbarrow_or_shovel")->isChecked();
  f.high_speed = limit_boxes_.at("high_speed")->isChecked();
  f.carry_push_share = text("limits.carry_push_share");
  f.floor_friction = text("limits.floor_friction");
  f.temperature_c = text("limits.temperature_c");
  f.humidity_pct = text("limits.humidity_pct");
  return f;
}

void TaskForm::recheck() {
  const UnitSystem u = model_.units();
  const QString lu = q(length_unit(u)), mu = q(mass_unit(u));
  for (const char* k : {"origin.h", "origin.v", "destination.h", "destination.v"}) unit_labels_[k]->setText(lu);
  for (const char* k : {"load", "max_load"}) unit_labels_[k]->setText(mu);

  check_ = check_task(fields(), u, model_.project().duration_rule);
  for (auto& [key, label] : messages_) {
    auto it = check_.field_problems.find(key);
    const bool bad = it != check_.field_problems.end();
    label->setText(bad ? tr("Not accepted: %1").arg(q(it->second)) : QString());
    label->setStyleSheet(bad ? "color: #8B0000" : "");
    if (auto e = edits_.find(key); e != edits_.end()) e->second->setStyleSheet(bad ? "border: 2px solid #8B0000" : "");
  }
  if (QLabel* f = messages_.count("frequency") ? messages_["frequency"] : nullptr;
      f && f->text().isEmpty() && editing_ && loaded_sample_ &&
      edits_.at("frequency")->text().trimmed() == loaded_frequency_.trimmed())
    f->setText(tr("from a sample: %1 lifts/min for %2 of %3 min (kept; typing another F replaces it)")
                   .arg(loaded_sample_->lifts_per_min)
                   .arg(loaded_sample_->lifting_min)
                   .arg(loaded_sample_->sample_min));
  QStringList other;
  for (const std::string& s : check_.other_problems) other << q(s);
  other_problems_->setText(other.join('\n'));
  add_button_->setEnabled(check_.ok());
  replace_button_->setEnabled(check_.ok() && editing_.has_value());
  if (!check_.ok() || !check_.result || check_.result->tasks.empty()) {
    summary_->setText(tr("<b>Not computed</b>: fix the fields marked \"Not accepted\"."));
    results_->setHtml(make_caution_html());
    return;
  }
  const TaskResult& r = check_.result->tasks.front();
  const RiskBand band = find_band(r.li);
  summary_->setText(tr("<table cellpadding=4><tr><td style='background:%1;color:%2'><b>LI %3 &mdash; %4</b></td>"
                       "</tr></table>Origin: RWL %5 %9, LI %6. Destination: RWL %7 %9, LI %8. Governing: %10.")
                        .arg(band_colour(band).name(), band_text_colour(band).name(),
                             fmt(r.li, 3, tr("outside (undefined)")), q(std::string(band_name(band))))
                        .arg(shown_rwl(LiftEnd::origin), shown_li(LiftEnd::origin), shown_rwl(LiftEnd::destination),
                             shown_li(LiftEnd::destination), mu, q(lift_end_name(r.governing))));
  // The form edits a task in the file's units, so its results are shown in them too, whatever View > Units says.
  QString html = make_task_result_html(check_.job->tasks.front(), r, UnitDisplay(u, DisplayChoice::as_file));
  html += QStringLiteral("<h3>Warnings and limits of application</h3>");
  if (r.warnings.empty() && check_.result->warnings.empty()) html += tr("<p>None: the task is within the limits of "
                                                                         "application given.</p>");
  for (const Warning& w : r.warnings)
    html += QStringLiteral("<p><code>%1</code> %2</p>").arg(q(warning_code(w)), q(describe_warning(w, u)).toHtmlEscaped());
  for (const Warning& w : check_.result->warnings)
    html += QStringLiteral("<p><code>%1</code> %2</p>").arg(q(warning_code(w)), q(describe_warning(w, u)).toHtmlEscaped());
  html += QStringLiteral("<p>Duration: %1.</p>").arg(q(check_.result->duration.explanation).toHtmlEscaped());
  html += make_caution_html();
  results_->setHtml(html);
}

QString TaskForm::shown_rwl(LiftEnd end) const {
  if (!check_.ok() || !check_.result || check_.result->tasks.empty()) return {};
  const TaskResult& r = check_.result->tasks.front();
  return fmt((end == LiftEnd::origin ? r.origin : r.destination).rwl, 3);
}

QString TaskForm::shown_li(LiftEnd end) const {
  if (!check_.ok() || !check_.result || check_.result->tasks.empty()) return {};
  const TaskResult& r = check_.result->tasks.front();
  return fmt((end == LiftEnd::origin ? r.origin : r.destination).li, 3, tr("undefined"));
}

QString TaskForm::shown_band() const {
  if (!check_.ok() || !check_.result || check_.result->tasks.empty()) return {};
  return q(std::string(band_name(find_band(check_.result->tasks.front().li))));
}

void TaskForm::refill_task_list() {
  task_list_->clear();
  task_list_->addItem(tr("(a new task)"));
  const auto& jobs = model_.project().jobs;
  for (std::size_t j = 0; j < jobs.size(); ++j)
    for (std::size_t t = 0; t < jobs[j].tasks.size(); ++t)
      task_list_->addItem(tr("job %1, task %2").arg(q(jobs[j].id), q(jobs[j].tasks[t].id)),
                          QPoint(static_cast<int>(j), static_cast<int>(t)));
  if (editing_) {
    const int i = task_list_->findData(QPoint(static_cast<int>(editing_->first), static_cast<int>(editing_->second)));
    if (i >= 0) task_list_->setCurrentIndex(i);
    else editing_.reset();
  }
  recheck();
}

void TaskForm::load_task(std::size_t job, std::size_t task) {
  const auto& jobs = model_.project().jobs;
  if (job >= jobs.size() || task >= jobs[job].tasks.size()) return;
  editing_ = {job, task};
  const TaskFields f = make_task_fields(jobs[job], task);
  pattern_ = f.work_pattern;
  const QSignalBlocker block(this);
  edits_["id"]->setText(q(f.task_id));
  edits_["load"]->setText(q(f.load));
  edits_["max_load"]->setText(q(f.max_load));
  edits_["frequency"]->setText(q(f.frequency));
  loaded_frequency_ = q(f.frequency);
  loaded_sample_ = task < jobs[job].details.size() ? jobs[job].details[task].frequency_sample : std::nullopt;
  if (duration_->findData("pattern") < 0 && f.duration == "pattern") duration_->addItem(tr("from the job's work pattern"), "pattern");
  duration_->setCurrentIndex(duration_->findData(q(f.duration)));
  coupling_->setCurrentIndex(coupling_->findData(q(f.coupling)));
  edits_["origin.h"]->setText(q(f.origin_h));
  edits_["origin.v"]->setText(q(f.origin_v));
  edits_["origin.a"]->setText(q(f.origin_a));
  edits_["destination.h"]->setText(q(f.destination_h));
  edits_["destination.v"]->setText(q(f.destination_v));
  edits_["destination.a"]->setText(q(f.destination_a));
  control_->setChecked(f.control_at_destination);
  limit_boxes_["one_handed"]->setChecked(f.one_handed);
  limit_boxes_["seated_or_kneeling"]->setChecked(f.seated_or_kneeling);
  limit_boxes_["restricted_space"]->setChecked(f.restricted_space);
  limit_boxes_["unstable_load"]->setChecked(f.unstable_load);
  limit_boxes_["wheelbarrow_or_shovel"]->setChecked(f.wheelbarrow_or_shovel);
  limit_boxes_["high_speed"]->setChecked(f.high_speed);
  edits_["limits.carry_push_share"]->setText(q(f.carry_push_share));
  edits_["limits.floor_friction"]->setText(q(f.floor_friction));
  edits_["limits.temperature_c"]->setText(q(f.temperature_c));
  edits_["limits.humidity_pct"]->setText(q(f.humidity_pct));
  const int i = task_list_->findData(QPoint(static_cast<int>(job), static_cast<int>(task)));
  if (i >= 0) task_list_->setCurrentIndex(i);
  recheck();
}

void TaskForm::apply(bool as_new) {
  if (!check_.ok()) return;
  const LiftTask& task = check_.job->tasks.front();
  const auto& jobs = model_.project().jobs;
  if (as_new || !editing_ || editing_->first >= jobs.size()) {
    LiftJob job = *check_.job;
    // A job id that is not yet taken.
    int n = static_cast<int>(jobs.size()) + 1;
    auto taken = [&](const std::string& id) {
      for (const LiftJob& j : jobs)
        if (j.id == id) return true;
      return false;
    };
    while (taken("J" + std::to_string(n))) ++n;
    job.id = "J" + std::to_string(n);
    model_.undo_stack()->push(new ReplaceJobCommand(model_, jobs.size(), std::nullopt, job,
                                                    tr("Add job %1").arg(q(job.id))));
    return;
  }
  LiftJob job = jobs[editing_->first];
  if (editing_->second >= job.tasks.size()) return;
  const std::size_t t = editing_->second;
  job.tasks[t] = task;  // the task's shelf details stay as they were
  // F given as a sample (lifts per minute over part of a sample period) stays a sample unless F itself was
  // retyped; then the typed F is the task's and the sample no longer says where it came from.
  if (t < job.details.size() && job.details[t].frequency_sample) {
    if (edits_.at("frequency")->text().trimmed() != loaded_frequency_.trimmed())
      job.details[t].frequency_sample.reset();
    else
      job.tasks[t].frequency_per_min = jobs[editing_->first].tasks[t].frequency_per_min;
  }
  if (check_.job->declared_duration) {
    job.declared_duration = check_.job->declared_duration;
    job.work_pattern.clear();
  }
  model_.undo_stack()->push(new ReplaceJobCommand(model_, editing_->first, jobs[editing_->first], job,
                                                  tr("Edit task %1 of job %2").arg(q(task.id), q(job.id))));
}

}  // namespace rackreach::gui
