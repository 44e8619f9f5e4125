// SPDX-License-Identifier: MIT
#pragma once
// No lost work: unsaved edits are written to a recovery file (atomically, engine/io/atomic_file) after a pause
// in editing; a clean save or a discard removes it. When the app starts again after a crash, or opens that
// project, it offers the recovery back (restore or discard, with the time it was written).
//
// One recovery file per project path (a hash of the absolute path; "untitled" for a project never saved), in the
// recovery folder: AppDataLocation/recovery unless the app is told another (tests use a temporary one). The file
// is JSON: the project's path, when it was written, and the project file's text itself.

#include <QDateTime>
#include <QString>

#include <optional>
#include <string>
#include <vector>

namespace rackreach::gui {

struct RecoveryFile {
  QString file;          ///< the recovery file itself
  QString project_path;  ///< the project it holds edits of; empty: a project never saved
  QDateTime written;     ///< when it was written (local time)
  std::string project_text;
};

/// The default recovery folder: QStandardPaths::AppDataLocation + "/recovery".
QString default_recovery_dir();
/// The recovery file of a project path (empty: untitled) in `dir`.
QString recovery_file_for(const QString& dir, const QString& project_path);
/// Writes the recovery of `project_text` atomically; returns the reason on failure.
std::optional<std::string> write_recovery(const QString& dir, const QString& project_path,
                                          const std::string& project_text, const QDateTime& when);
/// Reads one recovery file; nothing if it is not one.
std::optional<RecoveryFile> read_recovery(const QString& file);
/// Every readable recovery file in `dir`, newest first.
std::vector<RecoveryFile> find_recoveries(const QString& dir);

}  // namespace rackreach::gui
