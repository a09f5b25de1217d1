// A real crash: the desktop application is started on a copy of the example, edited (peaks
// imported), and killed with SIGKILL once its autosave has run. The next session must find the
// autosaved copy, with the edit, and offer it for recovery.
#include <QDir>
#include <QElapsedTimer>
#include <QFile>
#include <QProcess>
#include <QTemporaryDir>
#include <QThread>
#include <gtest/gtest.h>

#include "core/io/project_file.h"
#include "ui/autosave.h"

namespace finestra::ui {
namespace {

// Autosaved copies (*.json) in the recovery folder, whether or not their session still runs.
QStringList copiesIn(const QString& folder) {
  return QDir(folder).entryList({QStringLiteral("*.json")}, QDir::Files);
}

TEST(CrashRecovery, KilledSessionIsRecoveredWithItsEdits) {
  QTemporaryDir dir;
  const QString project = dir.filePath("run.json");
  ASSERT_TRUE(QFile::copy(QStringLiteral(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json"), project));
  const QString recovery = dir.filePath("recovery");
  QProcess app;
  QProcessEnvironment env = QProcessEnvironment::systemEnvironment();
  env.insert("QT_QPA_PLATFORM", "offscreen");
  env.insert("XDG_CONFIG_HOME", dir.filePath("config"));
  app.setProcessEnvironment(env);
  app.start(QStringLiteral(FINESTRA_GUI_EXE),
            {project, "--recovery-folder", recovery, "--autosave-interval", "200", "--import-peaks",
             QStringLiteral(FINESTRA_SOURCE_DIR "/examples/membrane-invented-peaks.csv")});
  ASSERT_TRUE(app.waitForStarted(20000));
  QElapsedTimer clock;
  clock.start();
  while (copiesIn(recovery).isEmpty() && clock.elapsed() < 60000 && app.state() == QProcess::Running)
    QThread::msleep(50);
  ASSERT_FALSE(copiesIn(recovery).isEmpty()) << "no autosave within 60 s; stderr: "
                                             << app.readAllStandardError().toStdString();
  EXPECT_TRUE(Autosaver::orphanedCopies(recovery).empty()) << "a running session's copy was offered";
  app.kill();  // SIGKILL: no clean-up code runs
  ASSERT_TRUE(app.waitForFinished(20000));

  const auto copies = Autosaver::orphanedCopies(recovery);
  ASSERT_EQ(copies.size(), 1u);
  EXPECT_EQ(QFileInfo(copies[0].originalPath).canonicalFilePath(), QFileInfo(project).canonicalFilePath());
  const Project recovered = readProjectFile(copies[0].projectPath.toStdString());
  EXPECT_FALSE(recovered.measurements.empty()) << "the imported peaks (the unsaved edit) are missing";
  EXPECT_TRUE(readProjectFile(project.toStdString()).measurements.empty()) << "the original file was changed";
}

}  // namespace
}  // namespace finestra::ui
