// Change detection of the document: each kind of edit announces exactly the parts it changed
// (found by comparing the project before and after), and refreshes exactly the setup sections that
// show those parts. Applying a fit that moves the magnet calibration refreshes the magnet section,
// whose summary then shows the calibrated field.
#include <QSignalSpy>
#include <functional>
#include <gtest/gtest.h>
#include <map>
#include <memory>
#include <set>
#include <string>
#include <typeinfo>

#include "core/fit/project_fit.h"
#include "ui/fit/fit_runner.h"
#include "ui/document.h"
#include "ui/setup/centre_section.h"
#include "ui/setup/conditions_section.h"
#include "ui/setup/field_section.h"
#include "ui/setup/sample_section.h"
#include "ui/setup/setup_panel.h"
#include "ui/setup/strain_section.h"
#include "ui/setup/sweep_section.h"

namespace finestra::ui {
namespace {

const QString kExample = QStringLiteral(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json");

enum Section { kCentre, kField, kSample, kStrain, kConditions, kSweep };

struct EditCase {
  const char* name;
  std::function<void(Project&)> mutate;
  Changes announced;            ///< what the document must announce
  std::set<Section> refreshed;  ///< the sections that must re-read the project (no other)
};

std::vector<EditCase> editCases() {
  return {
      {"centre override", [](Project& p) { p.centre.overrides["lambda_g_GHz"] = 51.0; }, Change::Centre, {kCentre}},
      {"field magnitude", [](Project& p) { p.field.magnitudeT += 0.1; }, Change::Field, {kField}},
      {"sample normal", [](Project& p) { p.sample.normal = Vec3(1, 1, 1); p.sample.inPlaneX = Vec3(1, -1, 0); },
       Change::Sample, {kField, kSample}},  // the field summary is written in the sample's frames
      {"magnet calibration", [](Project& p) { p.magnet.fieldScale = 1.02; }, Change::Magnet, {kField}},
      {"strain", [](Project& p) { p.strain.crystal(0, 1) = p.strain.crystal(1, 0) = 3e-6; }, Change::Strain, {kStrain}},
      {"temperature", [](Project& p) { p.conditions.temperatureK = 11; }, Change::Conditions, {kConditions}},
      {"classes", [](Project& p) { p.classes = {0, 2}; }, Change::Classes, {kSweep}},
      {"sweep range", [](Project& p) { p.sweeps.at(0).to += 0.5; }, Change::Sweeps, {kSweep}},
      {"fit settings", [](Project& p) { p.fit.starts = 3; }, Change::Fit, {}},
      {"measurements", [](Project& p) { p.measurements.push_back(MeasurementSet{}); }, Change::Measurements, {}},
      {"description", [](Project& p) { p.description += " (edited)"; }, Change::Description, {}},
  };
}

/// The project parts named by the recorded changed() signals; the file-state signal (the undo
/// stack becoming clean or dirty) is not a project part and is left out.
Changes partsAnnounced(const QSignalSpy& changed) {
  Changes parts;
  for (const auto& args : changed) parts |= args.front().value<Changes>();
  return parts & ~Changes(Change::File);
}

TEST(EditRefresh, EachKindOfEditRefreshesExactlyItsSections) {
  ProjectDocument doc;
  doc.open(kExample);
  SetupPanel panel(doc);
  ASSERT_EQ(panel.sections().size(), 6u);
  for (const EditCase& c : editCases()) {
    QSignalSpy changed(&doc, &ProjectDocument::changed);
    std::vector<std::unique_ptr<QSignalSpy>> spies;
    for (SetupSection* s : panel.sections()) spies.push_back(std::make_unique<QSignalSpy>(s, &SetupSection::refreshed));
    doc.edit(c.name, c.mutate);
    EXPECT_EQ(partsAnnounced(changed), c.announced) << c.name;
    for (std::size_t i = 0; i < spies.size(); ++i)
      EXPECT_EQ(spies[i]->count(), c.refreshed.count(static_cast<Section>(i)) ? 1 : 0)
          << c.name << ": section " << i << " (" << typeid(*panel.sections()[i]).name() << ")";
    // Undo announces the same parts and refreshes the same sections again.
    QSignalSpy undone(&doc, &ProjectDocument::changed);
    doc.undoStack().undo();
    EXPECT_EQ(partsAnnounced(undone), c.announced) << c.name;
  }
}

TEST(EditRefresh, AnEditThatChangesNothingIsNoStep) {
  ProjectDocument doc;
  doc.open(kExample);
  QSignalSpy changed(&doc, &ProjectDocument::changed);
  doc.edit("same temperature", [](Project& p) { p.conditions.temperatureK = p.conditions.temperatureK; });
  EXPECT_EQ(doc.undoStack().count(), 0);
  EXPECT_TRUE(changed.isEmpty());
}

TEST(EditRefresh, AppliedFitRefreshesTheCalibratedField) {
  ProjectDocument doc;
  doc.open(QStringLiteral(FINESTRA_SOURCE_DIR "/examples/fit-demo.json"));
  SetupPanel panel(doc);
  auto* field = dynamic_cast<FieldSection*>(panel.sections()[kField]);
  ASSERT_TRUE(field);
  EXPECT_FALSE(field->summary().contains("calibrated"));
  // A fit result whose magnet calibration differs from the nominal one, applied as the fit view does.
  FitResult result = fitProject(doc.project(), assignOnlyOptions());
  result.state.fieldScale = 1.03;
  result.state.tiltDeg = 0.8;
  QSignalSpy refreshed(field, &SetupSection::refreshed);
  doc.edit("Apply fit results", [&result](Project& p) { p = applyFitToProject(p, result); });
  EXPECT_EQ(refreshed.count(), 1);
  EXPECT_DOUBLE_EQ(doc.project().magnet.fieldScale, 1.03);
  EXPECT_TRUE(field->summary().contains("calibrated (scale 1.03000")) << field->summary().toStdString();
}

}  // namespace
}  // namespace finestra::ui
