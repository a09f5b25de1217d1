#include "ui/autosave.h"

#include <QDir>
#include <QFile>
#include <QFileInfo>
#include <QStandardPaths>
#include <QUuid>
#include <spdlog/spdlog.h>

#include "core/common/errors.h"
#include "core/io/project_file.h"
#include "core/io/text_file.h"
#include "ui/document.h"

namespace finestra::ui {
namespace {

QString projectFile(const QString& folder, const QString& id) { return folder + "/" + id + ".recovery.json"; }
QString originFile(const QString& folder, const QString& id) { return folder + "/" + id + ".origin"; }
QString lockFile(const QString& folder, const QString& id) { return folder + "/" + id + ".lock"; }

}  // namespace

QString Autosaver::defaultFolder() {
  return QStandardPaths::writableLocation(QStandardPaths::AppLocalDataLocation) + "/recovery";
}

Autosaver::Autosaver(ProjectDocument& document, QString folder, int intervalMs, QObject* parent)
    : QObject(parent), document_(document), folder_(folder.isEmpty() ? defaultFolder() : std::move(folder)),
      sessionId_(QUuid::createUuid().toString(QUuid::WithoutBraces)) {
  QDir().mkpath(folder_);
  lock_ = std::make_unique<QLockFile>(lockFile(folder_, sessionId_));
  lock_->setStaleLockTime(0);
  if (!lock_->tryLock(100)) spdlog::warn("autosave: could not take the session lock in {}", folder_.toStdString());
  savedRevision_ = document_.isModified() ? ~quint64{0} : document_.revision();
  connect(&timer_, &QTimer::timeout, this, &Autosaver::saveNow);
  timer_.start(intervalMs);
  connect(&document_, &ProjectDocument::changed, this, [this](Changes what) {
    if ((what & Change::File) && !document_.isModified()) {
      QFile::remove(projectFile(folder_, sessionId_));  // saved: the copy is no longer needed
      QFile::remove(originFile(folder_, sessionId_));
    }
  });
}

Autosaver::~Autosaver() = default;

void Autosaver::saveNow() {
  if (!document_.isModified() || document_.revision() == savedRevision_) return;
  try {
    // Absolute: recovery may run from another working folder and must restore to the original file.
    writeFileAtomically(originFile(folder_, sessionId_).toStdString(),
                        (document_.filePath().isEmpty() ? QString() : QFileInfo(document_.filePath()).absoluteFilePath()).toStdString());
    writeFileAtomically(projectFile(folder_, sessionId_).toStdString(), projectToJson(document_.project()));
    savedRevision_ = document_.isModified() ? ~quint64{0} : document_.revision();
    spdlog::debug("autosaved to {}", projectFile(folder_, sessionId_).toStdString());
  } catch (const InputError& e) {
    spdlog::warn("autosave failed: {}", e.what());
  }
}

void Autosaver::finishCleanly() {
  timer_.stop();
  QFile::remove(projectFile(folder_, sessionId_));
  QFile::remove(originFile(folder_, sessionId_));
  if (lock_) lock_->unlock();
}

std::vector<RecoveryEntry> Autosaver::orphanedCopies(const QString& folder) {
  std::vector<RecoveryEntry> out;
  const QDir dir(folder);
  for (const QString& name : dir.entryList({"*.recovery.json"}, QDir::Files, QDir::Time)) {
    const QString id = name.left(name.size() - static_cast<qsizetype>(QStringLiteral(".recovery.json").size()));
    QLockFile probe(lockFile(folder, id));
    probe.setStaleLockTime(0);
    if (!probe.tryLock(0)) continue;  // a live session owns it
    probe.unlock();
    RecoveryEntry e{projectFile(folder, id), {}, id};
    QFile origin(originFile(folder, id));
    if (origin.open(QIODevice::ReadOnly)) e.originalPath = QString::fromUtf8(origin.readAll());
    out.push_back(e);
  }
  return out;
}

void Autosaver::discard(const RecoveryEntry& entry) {
  const QString folder = QFileInfo(entry.projectPath).absolutePath();
  QFile::remove(entry.projectPath);
  QFile::remove(originFile(folder, entry.sessionId));
  QFile::remove(lockFile(folder, entry.sessionId));
}

}  // namespace finestra::ui
