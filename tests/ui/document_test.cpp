// Document and undo stack: every edit is one undo step, drags merge, undo/redo restore exactly;
// save/load round trip; autosaved copy found after a session ends without a clean exit.
#include <QSignalSpy>
#include <QTemporaryDir>
#include <gtest/gtest.h>

#include "core/common/errors.h"
#include "core/io/spectrum_csv.h"
#include "core/io/project_file.h"
#include "core/io/text_file.h"
#include "ui/autosave.h"
#include "ui/document.h"

namespace finestra::ui {
namespace {

const QString kExample = QStringLiteral(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json");

TEST(Document, FiftyEditsUndoneAndRedone) {
  ProjectDocument doc;
  doc.open(kExample);
  const std::string original = projectToJson(doc.project());
  QSignalSpy changed(&doc, &ProjectDocument::changed);
  for (int i = 0; i < 50; ++i) {
    switch (i % 3) {
      case 0: doc.edit("field", Change::Field, [i](Project& p) { p.field.magnitudeT = 0.01 * (i + 1); }); break;
      case 1: doc.edit("temperature", Change::Conditions, [i](Project& p) { p.conditions.temperatureK = 2.0 + i; }); break;
      default: doc.edit("lambda", Change::Centre, [i](Project& p) { p.centre.overrides["lambda_g_GHz"] = 40.0 + i; }); break;
    }
  }
  EXPECT_EQ(doc.undoStack().count(), 50);
  int contentSignals = 0;  // besides these, one Change::File when the document first became modified
  for (const auto& args : changed)
    if (args.front().value<Changes>() != Changes(Change::File)) ++contentSignals;
  EXPECT_EQ(contentSignals, 50);
  EXPECT_TRUE(doc.isModified());
  const std::string edited = projectToJson(doc.project());
  EXPECT_NE(edited, original);
  for (int i = 0; i < 50; ++i) doc.undoStack().undo();
  EXPECT_EQ(projectToJson(doc.project()), original);
  EXPECT_FALSE(doc.isModified());
  for (int i = 0; i < 50; ++i) doc.undoStack().redo();
  EXPECT_EQ(projectToJson(doc.project()), edited);
  EXPECT_DOUBLE_EQ(doc.project().centre.overrides.at("lambda_g_GHz"), 40.0 + 47);  // last i with i % 3 == 2
}

TEST(Document, DragMergesIntoOneStepAndNoOpPushesNothing) {
  ProjectDocument doc;
  doc.beginDrag();
  for (int i = 1; i <= 20; ++i)
    doc.edit("field", Change::Field, [i](Project& p) { p.field.magnitudeT = 0.1 * i; }, "field.magnitude");
  doc.endDrag();
  EXPECT_EQ(doc.undoStack().count(), 1);
  EXPECT_DOUBLE_EQ(doc.project().field.magnitudeT, 2.0);
  // Outside a drag the same key does not merge.
  doc.edit("field", Change::Field, [](Project& p) { p.field.magnitudeT = 2.5; }, "field.magnitude");
  doc.edit("field", Change::Field, [](Project& p) { p.field.magnitudeT = 2.6; }, "field.magnitude");
  EXPECT_EQ(doc.undoStack().count(), 3);
  doc.edit("same", Change::Field, [](Project& p) { p.field.magnitudeT = 2.6; });
  EXPECT_EQ(doc.undoStack().count(), 3);
  doc.undoStack().undo();
  doc.undoStack().undo();
  doc.undoStack().undo();
  EXPECT_DOUBLE_EQ(doc.project().field.magnitudeT, Project{}.field.magnitudeT);
}

TEST(Document, SaveLoadRoundTrip) {
  QTemporaryDir dir;
  ProjectDocument doc;
  doc.open(kExample);
  doc.edit("strain", Change::Strain, [](Project& p) { p.strain.crystal(0, 1) = p.strain.crystal(1, 0) = 4e-6; });
  doc.edit("isotope", Change::Centre, [](Project& p) { p.centre.isotope = "29Si"; });
  const QString path = dir.filePath("saved.json");
  doc.saveAs(path);
  EXPECT_FALSE(doc.isModified());
  ProjectDocument reopened;
  reopened.open(path);
  EXPECT_EQ(projectToJson(reopened.project()), projectToJson(doc.project()));
  EXPECT_EQ(reopened.filePath(), path);
}

// An imported measured spectrum belongs to the project: saved, reopened, and removed by undo.
TEST(Document, MeasuredSpectrumIsSavedAndUndoable) {
  ProjectDocument doc;
  doc.open(kExample);
  doc.setMeasuredSpectrum(readSpectrumCsv(FINESTRA_SOURCE_DIR "/examples/membrane-invented-spectrum.csv"));
  ASSERT_TRUE(doc.measuredSpectrum().has_value());
  const std::size_t points = doc.measuredSpectrum()->position.size();
  EXPECT_GT(points, 10u);
  EXPECT_EQ(doc.undoStack().count(), 1);
  QTemporaryDir dir;
  const QString path = dir.filePath("with-spectrum.json");
  doc.saveAs(path);
  ProjectDocument reopened;
  reopened.open(path);
  ASSERT_TRUE(reopened.measuredSpectrum().has_value());
  EXPECT_EQ(reopened.measuredSpectrum()->position, doc.measuredSpectrum()->position);
  EXPECT_EQ(reopened.measuredSpectrum()->signal, doc.measuredSpectrum()->signal);
  doc.undoStack().undo();
  EXPECT_FALSE(doc.measuredSpectrum().has_value());
  doc.undoStack().redo();
  EXPECT_EQ(doc.measuredSpectrum()->position.size(), points);
}

TEST(Document, OpenErrorKeepsCurrentDocument) {
  QTemporaryDir dir;
  const QString bad = dir.filePath("bad.json");
  writeFileAtomically(bad.toStdString(), "{ \"format\": \"finestra-project\", \"version\": 1, \"field\": { \"magnitude_T\": \"x\" } }");
  ProjectDocument doc;
  doc.open(kExample);
  doc.edit("t", Change::Conditions, [](Project& p) { p.conditions.temperatureK = 9; });
  const std::string before = projectToJson(doc.project());
  try {
    doc.open(bad);
    FAIL() << "expected an error";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("bad.json"), std::string::npos) << e.what();
  }
  EXPECT_EQ(projectToJson(doc.project()), before);
  EXPECT_TRUE(doc.isModified());
}

TEST(Autosave, CopyOfAnUncleanSessionIsOffered) {
  QTemporaryDir dir;
  std::string edited;
  {
    ProjectDocument doc;
    doc.open(kExample);
    doc.edit("t", Change::Conditions, [](Project& p) { p.conditions.temperatureK = 7.5; });
    edited = projectToJson(doc.project());
    Autosaver saver(doc, dir.path(), 60000);
    saver.saveNow();
    EXPECT_TRUE(Autosaver::orphanedCopies(dir.path()).empty());  // the live session holds its lock
  }  // ends without finishCleanly(), as a crash would
  const auto copies = Autosaver::orphanedCopies(dir.path());
  ASSERT_EQ(copies.size(), 1u);
  EXPECT_EQ(copies[0].originalPath, kExample);
  EXPECT_EQ(projectToJson(readProjectFile(copies[0].projectPath.toStdString())), edited);
  Autosaver::discard(copies[0]);
  EXPECT_TRUE(Autosaver::orphanedCopies(dir.path()).empty());
}

TEST(Autosave, CleanExitLeavesNothing) {
  QTemporaryDir dir;
  ProjectDocument doc;
  doc.edit("t", Change::Conditions, [](Project& p) { p.conditions.temperatureK = 7.5; });
  {
    Autosaver saver(doc, dir.path(), 60000);
    saver.saveNow();
    saver.finishCleanly();
  }
  EXPECT_TRUE(Autosaver::orphanedCopies(dir.path()).empty());
}

}  // namespace
}  // namespace finestra::ui
