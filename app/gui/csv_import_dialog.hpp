// SPDX-License-Identifier: MIT
#pragma once
// CSV import with a preview: the part master and the slot list side by side in tabs, each showing the file's
// first rows under a choice of field per column (auto-matched by the importer's own names, changeable), and
// below them every problem the import would have, by file, line and column, with the cells marked. The files
// are read by the engine's importer (engine/io/csv_import) with the mapping chosen, and the store they would
// make is checked by the project file's loader; Import is possible only when nothing is wrong. Cancel changes
// nothing.

#include <QDialog>

#include <span>
#include <vector>

#include "app/gui/project_model.hpp"
#include "engine/io/csv_import.hpp"

class QComboBox;
class QLabel;
class QListWidget;
class QPushButton;
class QTableWidget;

namespace rackreach::gui {

class CsvImportDialog : public QDialog {
  Q_OBJECT

 public:
  enum Table { parts_table = 0, slots_table = 1 };
  CsvImportDialog(const ProjectModel& model, const QString& parts_file, const QString& slots_file,
                  QWidget* parent = nullptr);

  /// The field chosen for column `column` (0-based) of a file.
  QComboBox* mapping_box(Table t, int column) const;
  /// The preview of a file: row 0 holds the choices, the rows below the file's first rows.
  QTableWidget* preview(Table t) const;
  /// The problems as listed (empty when the import can be made).
  QStringList problems() const;
  bool can_import() const;
  /// The parts and slots to import; meaningful when can_import().
  const CsvImport& result() const { return result_; }
  QPushButton* import_button() const { return import_; }

 private Q_SLOTS:
  void recheck();

 private:
  struct Page {
    QString file;
    std::string text;
    bool readable = false;
    CsvPreview preview;
    std::span<const CsvColumnSpec> specs;
    QTableWidget* table = nullptr;
    std::vector<QComboBox*> boxes;
    QLabel* info = nullptr;
  };
  QWidget* make_page(Page& page, const QString& what);
  CsvOptions options_of(const Page& page) const;
  void mark_cells(Page& page, const std::vector<Problem>& problems);

  const ProjectModel& model_;
  Page pages_[2];
  QListWidget* problem_list_ = nullptr;
  QLabel* verdict_ = nullptr;
  QPushButton* import_ = nullptr;
  CsvImport result_;
};

}  // namespace rackreach::gui
