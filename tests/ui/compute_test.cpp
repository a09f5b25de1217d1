// Worker: cancellation, stale results dropped; views show exactly the core's numbers; import
// errors name file and line; headless export writes a figure.
#include <QFile>
#include <QSignalSpy>
#include <QTest>
#include <QTemporaryDir>
#include <gtest/gtest.h>

#include "core/common/errors.h"
#include "core/io/peak_csv.h"
#include "core/project/evaluate.h"
#include "core/report/reports.h"
#include "core/io/project_file.h"
#include "core/io/text_file.h"
#include "core/project/model_setup.h"
#include "ui/compute.h"
#include "ui/headless.h"
#include "ui/views/line_table_view.h"

namespace finestra::ui {
namespace {

const std::string kExample = FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json";

ComputeRequest exampleRequest(int points) {
  ComputeRequest r;
  r.project = readProjectFile(kExample);
  r.project.sweeps[0].points = points;
  return r;
}

TEST(ComputeWorker, CancelStopsALongSweep) {
  ComputeController controller;
  QSignalSpy cancelled(&controller, &ComputeController::computeCancelled);
  QSignalSpy ready(&controller, &ComputeController::resultReady);
  const quint64 generation = controller.request(exampleRequest(400000));
  QTest::qWait(50);
  controller.cancel();
  ASSERT_TRUE(cancelled.wait(20000));
  EXPECT_EQ(cancelled.front().front().value<quint64>(), generation);
  QTest::qWait(100);
  EXPECT_EQ(ready.count(), 0);
  EXPECT_FALSE(controller.busy());
}

TEST(ComputeWorker, OnlyTheNewestRequestIsDelivered) {
  ComputeController controller;
  QSignalSpy ready(&controller, &ComputeController::resultReady);
  controller.request(exampleRequest(20000));
  controller.request(exampleRequest(300));
  const quint64 last = controller.request(exampleRequest(301));
  ASSERT_TRUE(ready.wait(20000));
  QTest::qWait(200);
  ASSERT_EQ(ready.count(), 1);
  const auto result = ready.front().front().value<ResultPtr>();
  EXPECT_EQ(result->generation, last);
  EXPECT_EQ(result->sweepResult.x.size(), 301u);
}

TEST(ComputeWorker, InvalidSetupGivesAMessageNotACrash) {
  ComputeRequest r = exampleRequest(50);
  r.project.centre.preset = "PbV-";  // its excited spin-orbit value is unknown in the preset
  const ResultPtr result = computeNow(r);
  EXPECT_FALSE(result->error.isEmpty());
  EXPECT_EQ(result->model, nullptr);
}

TEST(Views, DataEqualsCoreOutput) {
  const ResultPtr result = computeNow(exampleRequest(121));
  ASSERT_TRUE(result->error.isEmpty()) << result->error.toStdString();
  const Project project = readProjectFile(kExample);
  const CentreModel model(makeModelSetup(project));
  // Line table: the same table finestra-cli prints.
  LineTableView table({});
  table.showResult(result);
  EXPECT_EQ(table.dataTable().toCsv(), linesTable(model, solveProjectClasses(model, project)).toCsv());
  // Level fans: every curve point is the core's tracked level.
  SweepSpec spec = project.sweeps[0];
  spec.points = 121;
  const SweepResult sweep = runSweep(model, project, spec);
  std::size_t curves = 0;
  for (const LevelCurve& c : result->levels.curves) {
    const ClassSweep& cs = *std::find_if(sweep.classes.begin(), sweep.classes.end(), [&](auto& s) { return s.cls == c.cls; });
    const Eigen::MatrixXd& levels = c.manifold == Manifold::Ground ? cs.groundLevels : cs.excitedLevels;
    for (qsizetype k = 0; k < c.y.size(); ++k) ASSERT_DOUBLE_EQ(c.y[k], levels(k, c.level));
    ++curves;
  }
  EXPECT_EQ(curves, 4u * 8u);
  // Line map: each plotted point is one core line on the detuning axis.
  qsizetype points = 0;
  for (const LinePointGroup& g : result->lines.groups) {
    points += g.x.size();
    for (qsizetype i = 0; i < g.x.size(); ++i) {
      const auto k = static_cast<std::size_t>(std::lround((g.x[i] - spec.from) / (spec.to - spec.from) * (spec.points - 1)));
      const ClassSweep& cs = *std::find_if(sweep.classes.begin(), sweep.classes.end(), [&](auto& s) { return s.cls == g.cls; });
      bool found = false;
      for (const OpticalLine& l : cs.lines[k]) found |= std::abs(l.frequencyGHz - model.zplGHz() - g.y[i]) < 1e-9;
      ASSERT_TRUE(found) << "point " << i << " of class " << g.cls;
    }
  }
  EXPECT_GT(points, 121 * 4 * 4);
  // Spectrum: the curve is the core spectrum.
  ASSERT_EQ(result->spectrumPlot.y.size(), static_cast<qsizetype>(result->spectrum.y.size()));
  for (std::size_t i = 0; i < result->spectrum.y.size(); ++i)
    ASSERT_EQ(result->spectrumPlot.y[static_cast<qsizetype>(i)], result->spectrum.y[i]);
}

TEST(Import, PeakFileErrorNamesFileAndLine) {
  QTemporaryDir dir;
  const std::string path = dir.filePath("peaks.csv").toStdString();
  writeFileAtomically(path, "measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma\n"
                            "a,0.5,54.7,0,406.70,THz,0.0002\n"
                            "a,0.5,54.7,0,406.71,TeraHz,0.0002\n");
  try {
    readPeakCsv(path);
    FAIL() << "expected an error";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find(path + ":3"), std::string::npos) << e.what();
  }
}

TEST(Import, ExampleMeasurementsLoadAndPlace) {
  const auto sets = readPeakCsv(FINESTRA_SOURCE_DIR "/examples/membrane-invented-peaks.csv");
  ComputeRequest r = exampleRequest(121);
  r.project.measurements = sets;
  const ResultPtr result = computeNow(r);
  std::size_t peaks = 0;
  for (const auto& s : sets) peaks += s.peaks.size();
  EXPECT_EQ(static_cast<std::size_t>(result->peaks.size()), peaks);
  const auto spectrum = readSpectrumCsv(FINESTRA_SOURCE_DIR "/examples/membrane-invented-spectrum.csv");
  SpectrumPlotData data = result->spectrumPlot;
  addMeasuredSpectrum(data, spectrum, result->model->zplGHz());
  EXPECT_EQ(static_cast<std::size_t>(data.measuredX.size()), spectrum.position.size());
}

TEST(HeadlessExport, WritesEveryFormat) {
  QTemporaryDir dir;
  for (const char* name : {"lines.png", "levels.svg", "spectrum.pdf", "table.csv"}) {
    HeadlessExport job;
    job.project = QString::fromStdString(kExample);
    job.view = QString(name).section('.', 0, 0);
    job.out = dir.filePath(name);
    job.width = 800;
    job.height = 500;
    runHeadlessExport(job);
    EXPECT_GT(QFile(job.out).size(), 500) << name;
  }
  HeadlessExport bad;
  bad.project = QString::fromStdString(kExample);
  bad.view = "nonsense";
  bad.out = dir.filePath("x.png");
  EXPECT_THROW(runHeadlessExport(bad), InputError);
}

}  // namespace
}  // namespace finestra::ui
