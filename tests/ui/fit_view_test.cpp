// Peak assignment & fit view: lists the measured peaks, a fit run from the view equals core's
// driver, "apply to project" and the free/fixed boxes are single undoable edits, cancel stops the
// worker; the driver's own cancellation and progress; fit labels reach the Lines view; headless
// export of the view.
#include <QFile>
#include <QSignalSpy>
#include <QTemporaryDir>
#include <QTest>
#include <QTableWidget>
#include <gtest/gtest.h>
#include <qcustomplot.h>

#include "core/common/errors.h"
#include "core/fit/project_fit.h"
#include "core/io/project_file.h"
#include "ui/compute.h"
#include "ui/document.h"
#include "ui/fit/fit_view.h"
#include "ui/fit/peak_labels.h"
#include "ui/headless.h"
#include "ui/views/lines_view.h"

namespace finestra::ui {
namespace {

const QString kFitDemo = QStringLiteral(FINESTRA_SOURCE_DIR "/examples/fit-demo.json");
constexpr int kFitTimeoutMs = 180000;

int peakCount(const Project& p) {
  int n = 0;
  for (const MeasurementSet& set : p.measurements) n += static_cast<int>(set.peaks.size());
  return n;
}

ResultPtr computed(const ProjectDocument& doc) {
  ComputeRequest request;
  request.project = doc.project();
  return computeNow(request);
}

/// Runs the fit from the view and waits for its result.
FitOutcomePtr fitFromView(FitView& view) {
  QSignalSpy finished(&view.runner(), &FitRunner::finished);
  view.runFit();
  EXPECT_TRUE(finished.wait(kFitTimeoutMs));
  view.runner().wait();
  QCoreApplication::processEvents();
  return view.lastOutcome();
}

TEST(FitView, ListsThePeaksOfTheDemo) {
  ProjectDocument doc;
  doc.open(kFitDemo);
  FitView view(ViewContext{&doc, nullptr});
  const int peaks = peakCount(doc.project());
  ASSERT_GT(peaks, 10);
  EXPECT_EQ(view.peakTable()->rowCount(), peaks);
  EXPECT_EQ(view.peakTable()->item(0, 0)->text().toStdString(), doc.project().measurements.front().name);
  // A model result brings the assignment with the current parameters: every peak has a line or
  // is marked as an outlier, as core's driver says.
  view.showResult(computed(doc));
  ASSERT_TRUE(view.lastOutcome());
  EXPECT_TRUE(view.lastOutcome()->assignOnly);
  const FitResult direct = fitProject(doc.project(), assignOnlyOptions());
  EXPECT_EQ(view.lastOutcome()->result.assignedCount, direct.assignedCount);
  int outlierRows = 0, labelledRows = 0;
  for (int row = 0; row < peaks; ++row) {
    const QString line = view.peakTable()->item(row, 4)->text();
    if (line.startsWith("outlier")) ++outlierRows;
    else if (line.contains(QStringLiteral("\u00b7cl"))) ++labelledRows;
  }
  EXPECT_EQ(outlierRows, direct.outlierCount);
  EXPECT_EQ(labelledRows, direct.assignedCount);
  // Every fittable parameter has a row; the boxes follow fit.free.
  EXPECT_EQ(view.parameterTable()->rowCount(), static_cast<int>(allFitParameterNames().size()));
  for (const std::string& name : allFitParameterNames()) {
    const int row = view.parameterRow(QString::fromStdString(name));
    ASSERT_GE(row, 0) << name;
    const auto& free = doc.project().fit.free;
    const bool isFree = std::find(free.begin(), free.end(), name) != free.end();
    EXPECT_EQ(view.parameterTable()->item(row, FitView::kFreeColumn)->checkState() == Qt::Checked, isFree) << name;
  }
}

TEST(FitView, FitFromTheViewEqualsTheCoreDriver) {
  ProjectDocument doc;
  doc.open(kFitDemo);
  FitView view(ViewContext{&doc, nullptr});
  const FitOutcomePtr outcome = fitFromView(view);
  ASSERT_TRUE(outcome);
  ASSERT_FALSE(outcome->assignOnly);
  const FitResult direct = fitProject(doc.project());
  const FitResult& shown = outcome->result;
  EXPECT_EQ(shown.converged, direct.converged);
  ASSERT_EQ(shown.parameters.size(), direct.parameters.size());
  for (std::size_t k = 0; k < direct.parameters.size(); ++k) {
    EXPECT_EQ(shown.parameters[k].name, direct.parameters[k].name);
    const double v = direct.parameters[k].value;
    EXPECT_NEAR(shown.parameters[k].value, v, 1e-9 * std::max(1.0, std::abs(v))) << direct.parameters[k].name;
  }
  EXPECT_NEAR(shown.chi2, direct.chi2, 1e-9 * std::max(1.0, direct.chi2));
  EXPECT_EQ(shown.undetermined, direct.undetermined);
  // The table shows the fitted value of the first free parameter.
  const FittedParameter& first = direct.parameters.front();
  ASSERT_TRUE(first.free);
  const int row = view.parameterRow(QString::fromStdString(first.name));
  EXPECT_NEAR(view.parameterTable()->item(row, 4)->text().toDouble(), first.value, 1e-6 * std::max(1.0, std::abs(first.value)));
  // The labels of the fit are handed to the document for the Lines view.
  EXPECT_EQ(doc.fitLabels().size(), direct.assignedCount);
}

TEST(FitView, ApplyToProjectIsOneUndoStep) {
  ProjectDocument doc;
  doc.open(kFitDemo);
  FitView view(ViewContext{&doc, nullptr});
  const FitOutcomePtr outcome = fitFromView(view);
  ASSERT_TRUE(outcome);
  const std::string before = projectToJson(doc.project());
  const int steps = doc.undoStack().count();
  view.applyToProject();
  EXPECT_EQ(doc.undoStack().count(), steps + 1);
  EXPECT_EQ(projectToJson(doc.project()), projectToJson(applyFitToProject(outcome->project, outcome->result)));
  EXPECT_NE(projectToJson(doc.project()), before);
  doc.undoStack().undo();
  EXPECT_EQ(projectToJson(doc.project()), before);
}

TEST(FitView, FreeFixedBoxesEditFitFreeUndoably) {
  ProjectDocument doc;
  doc.open(kFitDemo);
  FitView view(ViewContext{&doc, nullptr});
  const std::vector<std::string> original = doc.project().fit.free;
  const std::string added = "lambda_u_GHz";
  ASSERT_EQ(std::find(original.begin(), original.end(), added), original.end());
  QTableWidgetItem* box = view.parameterTable()->item(view.parameterRow(QString::fromStdString(added)), FitView::kFreeColumn);
  box->setCheckState(Qt::Checked);
  QTRY_COMPARE(doc.undoStack().count(), 1);
  EXPECT_EQ(doc.project().fit.free.back(), added);
  EXPECT_EQ(doc.project().fit.free.size(), original.size() + 1);

  const std::string removed = original.front();
  box = view.parameterTable()->item(view.parameterRow(QString::fromStdString(removed)), FitView::kFreeColumn);
  box->setCheckState(Qt::Unchecked);
  QTRY_COMPARE(doc.undoStack().count(), 2);
  const auto& free = doc.project().fit.free;
  EXPECT_EQ(std::find(free.begin(), free.end(), removed), free.end());

  doc.undoStack().undo();
  doc.undoStack().undo();
  EXPECT_EQ(doc.project().fit.free, original);
  const int row = view.parameterRow(QString::fromStdString(added));
  EXPECT_EQ(view.parameterTable()->item(row, FitView::kFreeColumn)->checkState(), Qt::Unchecked);
}

TEST(FitView, CancelStopsTheWorker) {
  ProjectDocument doc;
  doc.open(kFitDemo);
  doc.edit("many starts", Change::Fit, [](Project& p) { p.fit.starts = 400; });
  FitView view(ViewContext{&doc, nullptr});
  QSignalSpy cancelled(&view.runner(), &FitRunner::cancelled);
  QSignalSpy finished(&view.runner(), &FitRunner::finished);
  view.runFit();
  EXPECT_TRUE(view.runner().busy());
  view.cancelFit();
  ASSERT_TRUE(cancelled.wait(kFitTimeoutMs));
  QTRY_VERIFY(!view.runner().busy());
  EXPECT_EQ(finished.count(), 0);
  EXPECT_FALSE(view.lastOutcome());  // nothing replaced the (absent) previous result
}

TEST(FitView, LabelsOfTheFitAppearOnTheLinesView) {
  ProjectDocument doc;
  doc.open(kFitDemo);
  LinesView lines(ViewContext{&doc, nullptr});
  const ResultPtr result = computed(doc);
  ASSERT_TRUE(result->error.isEmpty()) << result->error.toStdString();
  lines.showResult(result);
  EXPECT_EQ(lines.figure()->itemCount() - (result->currentX ? 1 : 0), 0);
  const QVector<PeakLabel> labels = labelsOfFit(fitProject(doc.project(), assignOnlyOptions()));
  int expected = 0;
  for (const PeakMark& mark : result->peaks)
    for (const PeakLabel& l : labels) expected += l.measurement == mark.measurement && l.peak == mark.peak ? 1 : 0;
  ASSERT_GT(expected, 0) << "no labelled peak lies on the default sweep of the demo";
  doc.setFitLabels(labels);
  int texts = 0;
  for (int i = 0; i < lines.figure()->itemCount(); ++i)
    if (auto* t = qobject_cast<QCPItemText*>(lines.figure()->item(i)); t && t->text().contains(QStringLiteral("\u00b7cl"))) ++texts;
  EXPECT_EQ(texts, expected);
  // A pinned assignment is labelled without any fit, with the same name core's fit gives it.
  doc.setFitLabels({});
  const FitResult assignment = fitProject(doc.project(), assignOnlyOptions());
  const FittedPeak* pinned = nullptr;
  for (const FittedPeak& fp : assignment.peaks)
    for (const PeakMark& mark : result->peaks)
      if (!pinned && fp.line && fp.measurement == mark.measurement && fp.peak == mark.peak) pinned = &fp;
  ASSERT_TRUE(pinned);
  doc.edit("pin", Change::Measurements, [&](Project& p) {
    p.measurements[static_cast<std::size_t>(pinned->measurement)].peaks[static_cast<std::size_t>(pinned->peak)].assign =
        PinnedAssignment{pinned->line->cls, pinned->line->upper, pinned->line->lower};
  });
  lines.showResult(computed(doc));
  QStringList shown;
  for (int i = 0; i < lines.figure()->itemCount(); ++i)
    if (auto* t = qobject_cast<QCPItemText*>(lines.figure()->item(i))) shown << t->text();
  EXPECT_EQ(shown, QStringList{peakLabelText(pinned->label, pinned->line->cls)});
  // A change of the measurements drops the labels (their indices would no longer match).
  doc.setFitLabels(labels);
  doc.edit("drop a set", Change::Measurements, [](Project& p) { p.measurements.pop_back(); });
  EXPECT_TRUE(doc.fitLabels().isEmpty());
}

TEST(FitView, HeadlessExportWritesFigureAndTable) {
  QTemporaryDir dir;
  for (const QString name : {"fit.png", "fit.csv"}) {
    HeadlessExport job;
    job.project = kFitDemo;
    job.view = "fit";
    job.out = dir.filePath(name);
    runHeadlessExport(job);
    QFile file(job.out);
    ASSERT_TRUE(file.exists()) << name.toStdString();
    EXPECT_GT(file.size(), 1000) << name.toStdString();
  }
}

}  // namespace
}  // namespace finestra::ui
