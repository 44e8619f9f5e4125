// SPDX-License-Identifier: MIT
#include "app/gui/recovery.hpp"

#include <QCryptographicHash>
#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QJsonDocument>
#include <QJsonObject>
#include <QStandardPaths>

#include <algorithm>

#include "engine/io/atomic_file.hpp"

namespace rackreach::gui {
namespace {
constexpr const char* format_key = "rackreach_recovery";
constexpr const char* suffix = ".recovery.json";
}  // namespace

QString default_recovery_dir() {
  return QStandardPaths::writableLocation(QStandardPaths::AppDataLocation) + QStringLiteral("/recovery");
}

QString recovery_file_for(const QString& dir, const QString& project_path) {
  if (project_path.isEmpty()) return dir + QStringLiteral("/untitled") + suffix;
  const QString abs = QFileInfo(project_path).absoluteFilePath();
  const QByteArray hash = QCryptographicHash::hash(abs.toUtf8(), QCryptographicHash::Sha1).toHex().left(16);
  return dir + '/' + QFileInfo(project_path).completeBaseName() + '-' + QString::fromLatin1(hash) + suffix;
}

std::optional<std::string> write_recovery(const QString& dir, const QString& project_path,
                                          const std::string& project_text, const QDateTime& when) {
  if (!QDir().mkpath(dir)) return "cannot make the folder " + dir.toStdString();
  QJsonObject o;
  o[format_key] = 1;
  o["project_path"] = project_path.isEmpty() ? QString() : QFileInfo(project_path).absoluteFilePath();
  o["written"] = when.toString(Qt::ISODateWithMs);
  o["project"] = QString::fromStdString(project_text);
  const QByteArray text = QJsonDocument(o).toJson(QJsonDocument::Indented);
  return write_file_atomically(recovery_file_for(dir, project_path).toStdString(),
                               std::string_view(text.constData(), static_cast<std::size_t>(text.size())));
}

std::optional<RecoveryFile> read_recovery(const QString& file) {
  QFile f(file);
  if (!f.open(QIODevice::ReadOnly)) return std::nullopt;
  const QJsonDocument d = QJsonDocument::fromJson(f.readAll());
  const QJsonObject o = d.object();
  if (!d.isObject() || o.value(format_key).toInt() != 1 || !o.value("project").isString()) return std::nullopt;
  RecoveryFile r;
  r.file = file;
  r.project_path = o.value("project_path").toString();
  r.written = QDateTime::fromString(o.value("written").toString(), Qt::ISODateWithMs);
  r.project_text = o.value("project").toString().toStdString();
  return r;
}

std::vector<RecoveryFile> find_recoveries(const QString& dir) {
  std::vector<RecoveryFile> out;
  for (const QFileInfo& fi : QDir(dir).entryInfoList({QStringLiteral("*") + suffix}, QDir::Files))
    if (auto r = read_recovery(fi.absoluteFilePath())) out.push_back(std::move(*r));
  std::sort(out.begin(), out.end(), [](const RecoveryFile& a, const RecoveryFile& b) { return a.written > b.written; });
  return out;
}

}  // namespace rackreach::gui
