#pragma once
// Autosave and crash recovery. While a session runs it holds a QLockFile in the recovery folder
// and, when the document has unsaved edits, writes the project there every few seconds (atomic
// write). A clean exit or a save removes the copy. At start-up, copies whose lock is not held by a
// live process belong to a session that died: they are offered for recovery.
#include <QLockFile>
#include <QObject>
#include <QString>
#include <QTimer>
#include <memory>
#include <vector>

namespace finestra::ui {

class ProjectDocument;

struct RecoveryEntry {
  QString projectPath;   ///< the autosaved project
  QString originalPath;  ///< the file it was opened from ("" for a new project)
  QString sessionId;
};

class Autosaver : public QObject {
  Q_OBJECT
public:
  /// `folder`: recovery folder (created if needed); the standard location when empty.
  Autosaver(ProjectDocument& document, QString folder = {}, int intervalMs = 20000, QObject* parent = nullptr);
  ~Autosaver() override;

  /// Writes the copy now if the document has unsaved edits since the last autosave.
  void saveNow();
  /// Removes this session's copy and lock (normal exit).
  void finishCleanly();
  QString folder() const { return folder_; }

  /// Copies left by sessions that are no longer running.
  static std::vector<RecoveryEntry> orphanedCopies(const QString& folder);
  /// Deletes a recovery entry's files.
  static void discard(const RecoveryEntry& entry);
  static QString defaultFolder();

private:
  ProjectDocument& document_;
  QString folder_;
  QString sessionId_;
  std::unique_ptr<QLockFile> lock_;
  QTimer timer_;
  quint64 savedRevision_ = 0;
};

}  // namespace finestra::ui
