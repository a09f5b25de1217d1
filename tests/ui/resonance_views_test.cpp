// Microwave resonance view and Λ table: they show the core's numbers for the project's field
// (same tables as finestra-cli microwave / lambda-systems), and they are in the view catalogue.
#include <gtest/gtest.h>
#include <qcustomplot.h>

#include "core/project/field_semantics.h"
#include "core/report/resonance_reports.h"
#include "ui/compute.h"
#include "ui/document.h"
#include "ui/result_view.h"
#include "ui/views/lambda_table_view.h"
#include "ui/views/microwave_view.h"

namespace finestra::ui {
namespace {

const QString kExample = QStringLiteral(FINESTRA_SOURCE_DIR "/examples/siv29-microwave.json");

ResultPtr computed(const ProjectDocument& doc) {
  ComputeRequest request;
  request.project = doc.project();
  return computeNow(request);
}

TEST(ResonanceViews, MicrowaveViewShowsTheCoreTransitionsAtTheProjectField) {
  ProjectDocument doc;
  doc.open(kExample);
  const ResultPtr result = computed(doc);
  ASSERT_TRUE(result->model);
  MicrowaveView view(ViewContext{&doc, nullptr});
  view.resize(1200, 700);
  view.showResult(result);
  MicrowaveSettings settings;  // the view's default drive: lab x
  const auto expected = microwaveTransitions(*result->model, result->project.classes,
                                             projectFieldCrystal(result->project, result->model->setup().lab), settings);
  const Table table = view.dataTable();
  EXPECT_EQ(table.rows.size(), 4u * 28u);  // ²⁹Si: 8 ground levels per class, every pair
  EXPECT_EQ(table.rows, microwaveTable(expected).rows);
  ASSERT_NE(view.figure(), nullptr);
  EXPECT_EQ(view.figure()->graphCount(), 5);  // absorption curve and one stick set per class
  EXPECT_GT(view.figure()->itemCount(), 0);   // labelled transitions
}

TEST(ResonanceViews, LambdaTableIsTheCoreTable) {
  ProjectDocument doc;
  doc.open(kExample);
  const ResultPtr result = computed(doc);
  LambdaTableView view(ViewContext{&doc, nullptr});
  view.showResult(result);
  std::vector<ClassLambda> expected;
  for (const ClassSolution& s : result->current) expected.push_back(lambdaSystems(s, 2, LambdaRanking::Product));
  EXPECT_FALSE(view.dataTable().rows.empty());
  EXPECT_EQ(view.dataTable().rows, lambdaTable(expected).rows);
  EXPECT_NE(findView("microwave"), nullptr);
  EXPECT_NE(findView("lambda"), nullptr);
}

}  // namespace
}  // namespace finestra::ui
