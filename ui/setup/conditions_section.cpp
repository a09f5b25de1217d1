#include "ui/setup/conditions_section.h"

#include <QCheckBox>
#include <QComboBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QSignalBlocker>
#include <cmath>
#include <numbers>

#include "ui/setup/setup_widgets.h"

namespace finestra::ui {

ConditionsSection::ConditionsSection(ProjectDocument& document, QWidget* parent)
    : SetupSection(tr("Detection"), document, parent) {
  auto* form = new QFormLayout(this);
  temperature_ = makeSpinBox(0, 0, 2, " K");
  applyQuantity(temperature_, "conditions.temperature_K");
  populations_ = new QComboBox;
  populations_->addItems({tr("thermal (Boltzmann)"), tr("equal")});
  collection_ = new Vec3Edit(-10, 10, 3);
  analyserOn_ = new QCheckBox(tr("linear analyser at"));
  analyserAngle_ = makeSpinBox(-360, 360, 1, "\u00b0 from lab x");
  auto* analyserRow = new QHBoxLayout;
  analyserRow->addWidget(analyserOn_);
  analyserRow->addWidget(analyserAngle_);
  broadening_ = makeSpinBox(0, 0, 3, " GHz");
  applyQuantity(broadening_, "conditions.broadening_GHz");
  form->addRow(tr("Temperature"), temperature_);
  form->addRow(tr("Populations"), populations_);
  form->addRow(tr("Collection direction (lab)"), collection_);
  form->addRow(tr("Analyser (lab xy plane)"), analyserRow);
  form->addRow(tr("Extra broadening (FWHM)"), broadening_);
  connect(temperature_, &QDoubleSpinBox::valueChanged, this, [this](double v) {
    this->document().edit(tr("Temperature"), [&](Project& p) { p.conditions.temperatureK = v; });
  });
  connect(populations_, &QComboBox::activated, this, [this](int i) {
    this->document().edit(tr("Populations"), [&](Project& p) {
      p.conditions.populations = i == 0 ? PopulationModel::Thermal : PopulationModel::Equal;
    });
  });
  connect(collection_, &Vec3Edit::edited, this, [this](const Vec3& v) {
    if (v.norm() < 1e-12) return;
    this->document().edit(tr("Collection direction"), [&](Project& p) { p.conditions.collectionLab = v; });
  });
  connect(analyserOn_, &QCheckBox::toggled, this, &ConditionsSection::applyAnalyser);
  connect(analyserAngle_, &QDoubleSpinBox::valueChanged, this, &ConditionsSection::applyAnalyser);
  connect(broadening_, &QDoubleSpinBox::valueChanged, this, [this](double v) {
    this->document().edit(tr("Broadening"), [&](Project& p) { p.conditions.extraBroadeningGHz = v; });
  });
  refresh();
}

void ConditionsSection::applyAnalyser() {
  const bool on = analyserOn_->isChecked();
  const double a = analyserAngle_->value() * std::numbers::pi / 180.0;
  document().edit(tr("Analyser"), [&](Project& p) {
    p.conditions.analyserLab = on ? std::optional<Vec3>(Vec3(std::cos(a), std::sin(a), 0)) : std::nullopt;
  });
}

void ConditionsSection::refresh() {
  const DetectionConditions& c = document().project().conditions;
  const QSignalBlocker a(temperature_), b(populations_), d(analyserOn_), e(analyserAngle_), f(broadening_);
  temperature_->setValue(c.temperatureK);
  populations_->setCurrentIndex(c.populations == PopulationModel::Thermal ? 0 : 1);
  collection_->setValue(c.collectionLab);
  analyserOn_->setChecked(c.analyserLab.has_value());
  if (c.analyserLab) analyserAngle_->setValue(std::atan2((*c.analyserLab)[1], (*c.analyserLab)[0]) * 180 / std::numbers::pi);
  broadening_->setValue(c.extraBroadeningGHz);
}

}  // namespace finestra::ui
