// SPDX-License-Identifier: MIT
#include "app/gui/csv_import_dialog.hpp"

#include <QComboBox>
#include <QDialogButtonBox>
#include <QFile>
#include <QFileInfo>
#include <QHeaderView>
#include <QLabel>
#include <QListWidget>
#include <QPushButton>
#include <QRegularExpression>
#include <QTabWidget>
#include <QTableWidget>
#include <QVBoxLayout>

#include "app/gui/format.hpp"
#include "engine/io/project_file.hpp"

namespace rackreach::gui {
namespace {

constexpr std::size_t preview_rows = 12;

/// The choices of a column: leave it out, or one of the table's fields; a field of lengths, masses or angles once
/// per unit the importer reads (and once without one: the project's unit).
void fill_choices(QComboBox* box, std::span<const CsvColumnSpec> specs, UnitSystem units) {
  box->addItem(QObject::tr("(leave out)"), QString());
  for (const CsvColumnSpec& s : specs) {
    const QString name = QString::fromUtf8(s.name.data(), static_cast<int>(s.name.size()));
    const QString star = s.required ? QStringLiteral(" *") : QString();
    std::vector<const char*> suffixes;
    if (s.kind == CsvValueKind::mass)
      suffixes = {"kg", "lb"};
    else if (s.kind == CsvValueKind::length)
      suffixes = {"cm", "mm", "m", "in"};
    else if (s.kind == CsvValueKind::angle)
      suffixes = {"deg"};
    if (suffixes.empty()) {
      box->addItem(name + star, name);
      continue;
    }
    if (s.kind != CsvValueKind::angle) {
      const QString unit =
          s.kind == CsvValueKind::mass ? q(std::string(mass_unit(units))) : q(std::string(length_unit(units)));
      box->addItem(QObject::tr("%1 in %2 (the project's unit)%3").arg(name, unit, star), name);
    }
    for (const char* u : suffixes)
      box->addItem(QObject::tr("%1 in %2%3").arg(name, QString::fromLatin1(u), star),
                   name + '_' + QString::fromLatin1(u));
  }
}

}  // namespace

CsvImportDialog::CsvImportDialog(const ProjectModel& model, const QString& parts_file, const QString& slots_file,
                                 QWidget* parent)
    : QDialog(parent), model_(model) {
  setWindowTitle(tr("Import parts and slots from CSV"));
  setObjectName("csv_import_dialog");
  pages_[parts_table].file = parts_file;
  pages_[parts_table].specs = part_csv_columns;
  pages_[slots_table].file = slots_file;
  pages_[slots_table].specs = slot_csv_columns;
  auto* tabs = new QTabWidget;
  tabs->addTab(make_page(pages_[parts_table], tr("part master")), tr("&Part master"));
  tabs->addTab(make_page(pages_[slots_table], tr("slot list")), tr("&Slot list"));

  auto* problems_label = new QLabel(tr("Problems (nothing is imported while there are any):"));
  problem_list_ = new QListWidget;
  problem_list_->setAccessibleName(tr("Import problems"));
  problem_list_->setWordWrap(true);
  problems_label->setBuddy(problem_list_);
  verdict_ = new QLabel;
  verdict_->setWordWrap(true);

  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Cancel);
  import_ = buttons->addButton(tr("&Import"), QDialogButtonBox::AcceptRole);
  connect(buttons, &QDialogButtonBox::accepted, this, [this] {
    if (can_import()) accept();
  });
  connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);

  auto* layout = new QVBoxLayout(this);
  layout->addWidget(tabs, 3);
  layout->addWidget(problems_label);
  layout->addWidget(problem_list_, 1);
  layout->addWidget(verdict_);
  layout->addWidget(buttons);
  resize(1000, 640);
  recheck();
}

QWidget* CsvImportDialog::make_page(Page& page, const QString& what) {
  auto* w = new QWidget;
  auto* l = new QVBoxLayout(w);
  QFile f(page.file);
  if (f.open(QIODevice::ReadOnly)) {
    const QByteArray bytes = f.readAll();
    page.text.assign(bytes.constData(), static_cast<std::size_t>(bytes.size()));
    page.readable = true;
  }
  page.preview = read_csv_preview(page.text, page.file.toStdString(), preview_rows);
  page.info = new QLabel;
  page.info->setWordWrap(true);
  page.info->setText(page.readable ? tr("%1: %2, %3 rows. Choose what each column is (a field marked * is required); "
                                        "the first %4 rows are shown.")
                                         .arg(what, QFileInfo(page.file).fileName())
                                         .arg(page.preview.total_rows)
                                         .arg(std::min(page.preview.total_rows, preview_rows))
                                   : tr("%1: %2 cannot be read.").arg(what, page.file));
  l->addWidget(page.info);
  const int cols = static_cast<int>(page.preview.header.size());
  page.table = new QTableWidget(static_cast<int>(page.preview.rows.size()) + 1, cols);
  page.table->setAccessibleName(tr("Preview of the %1").arg(what));
  page.table->setEditTriggers(QAbstractItemView::NoEditTriggers);
  page.table->setTextElideMode(Qt::ElideRight);
  page.table->setWordWrap(false);
  QStringList headers, lines{tr("read as")};
  for (const std::string& h : page.preview.header) headers << q(h);
  page.table->setHorizontalHeaderLabels(headers);
  for (const CsvPreview::Row& r : page.preview.rows) lines << tr("line %1").arg(r.line);
  page.table->setVerticalHeaderLabels(lines);
  for (int c = 0; c < cols; ++c) {
    auto* box = new QComboBox;
    fill_choices(box, page.specs, model_.units());
    box->setAccessibleName(tr("Field of column %1 (%2)").arg(c + 1).arg(headers[c]));
    const QString matched = q(match_csv_column(page.specs, page.preview.header[static_cast<std::size_t>(c)]));
    const int i = box->findData(matched);
    box->setCurrentIndex(matched.isEmpty() || i < 0 ? 0 : i);
    connect(box, &QComboBox::currentIndexChanged, this, &CsvImportDialog::recheck);
    page.table->setCellWidget(0, c, box);
    page.boxes.push_back(box);
  }
  for (std::size_t r = 0; r < page.preview.rows.size(); ++r)
    for (std::size_t c = 0; c < page.preview.rows[r].cells.size() && c < page.preview.header.size(); ++c)
      page.table->setItem(static_cast<int>(r) + 1, static_cast<int>(c),
                          new QTableWidgetItem(q(page.preview.rows[r].cells[c])));
  page.table->resizeColumnsToContents();
  for (int c = 0; c < cols; ++c) page.table->setColumnWidth(c, std::clamp(page.table->columnWidth(c), 120, 210));
  l->addWidget(page.table, 1);
  return w;
}

CsvOptions CsvImportDialog::options_of(const Page& page) const {
  CsvOptions o;
  o.units = model_.units();
  for (std::size_t c = 0; c < page.boxes.size(); ++c)
    o.column_names[c] = page.boxes[c]->currentData().toString().toStdString();
  return o;
}

void CsvImportDialog::mark_cells(Page& page, const std::vector<Problem>& problems) {
  static const QRegularExpression cell(QStringLiteral("^line (\\d+)(?:, column (\\d+))?"));
  for (int r = 1; r < page.table->rowCount(); ++r)
    for (int c = 0; c < page.table->columnCount(); ++c)
      if (QTableWidgetItem* it = page.table->item(r, c)) {
        it->setBackground(QBrush());
        it->setToolTip({});
      }
  for (const Problem& p : problems) {
    if (p.file != page.file.toStdString()) continue;
    const QRegularExpressionMatch m = cell.match(q(p.path));
    if (!m.hasMatch()) continue;
    const std::size_t line = m.captured(1).toULongLong();
    int column = m.captured(2).isEmpty() ? -1 : m.captured(2).toInt() - 1;
    if (column >= page.table->columnCount()) column = -1;  // a row with too many cells: the whole row
    for (std::size_t r = 0; r < page.preview.rows.size(); ++r) {
      if (page.preview.rows[r].line != line) continue;
      for (int c = 0; c < page.table->columnCount(); ++c)
        if (column < 0 || c == column)
          if (QTableWidgetItem* it = page.table->item(static_cast<int>(r) + 1, c)) {
            it->setBackground(QColor(0xF4, 0xC7, 0xC3));
            it->setToolTip(q(p.rule));
          }
    }
  }
}

void CsvImportDialog::recheck() {
  Page& pp = pages_[parts_table];
  Page& sp = pages_[slots_table];
  const std::string pf = pp.file.toStdString(), sf = sp.file.toStdString();
  PartsCsv parts = pp.readable ? load_parts_csv_text(pp.text, pf, model_.units(), options_of(pp))
                               : load_parts_csv(pf, model_.units(), options_of(pp));
  SlotsCsv slots = sp.readable ? load_slots_csv_text(sp.text, sf, model_.units(), options_of(sp))
                               : load_slots_csv(sf, model_.units(), options_of(sp));
  result_ = check_store_csv(std::move(parts), pf, std::move(slots), sf);
  QStringList lines;
  for (const Problem& p : result_.problems) lines << q(format_problem(p));
  std::vector<Problem> store_problems;
  if (result_.ok()) {
    // The store the import would make, checked by the project file's loader (racks, levels, places, routes).
    Project candidate = model_.project();
    candidate.store.parts = result_.parts;
    candidate.store.slots = result_.slots;
    for (const Problem& p : model_.check_as_file(candidate))
      lines << tr("the project after the import: %1").arg(q(format_problem("project", p)));
  }
  problem_list_->clear();
  problem_list_->addItems(lines);
  for (Page* p : {&pp, &sp}) mark_cells(*p, result_.problems);
  const bool ok = lines.isEmpty();
  if (!ok)
    result_.problems.emplace_back("invalid_value", "", "", "the project after the import would not load", "", "");
  import_->setEnabled(ok);
  verdict_->setText(ok ? tr("Ready: %1 parts and %2 slots replace the project's %3 parts and %4 slots (undo takes "
                            "them back).")
                             .arg(result_.parts.size())
                             .arg(result_.slots.size())
                             .arg(model_.project().store.parts.size())
                             .arg(model_.project().store.slots.size())
                       : tr("%1 problems: nothing can be imported until they are put right (choose another field "
                            "for a column, or correct the file).")
                             .arg(lines.size()));
}

QComboBox* CsvImportDialog::mapping_box(Table t, int column) const {
  const auto& b = pages_[t].boxes;
  return column >= 0 && static_cast<std::size_t>(column) < b.size() ? b[static_cast<std::size_t>(column)] : nullptr;
}

QTableWidget* CsvImportDialog::preview(Table t) const {
  return pages_[t].table;
}

QStringList CsvImportDialog::problems() const {
  QStringList out;
  for (int i = 0; i < problem_list_->count(); ++i) out << problem_list_->item(i)->text();
  return out;
}

bool CsvImportDialog::can_import() const {
  return import_->isEnabled();
}

}  // namespace rackreach::gui
