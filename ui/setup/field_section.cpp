#include "ui/setup/field_section.h"

#include <QComboBox>
#include <QFormLayout>
#include <QLabel>
#include <QSignalBlocker>
#include <QStackedWidget>
#include <QVBoxLayout>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/project/field_semantics.h"
#include "ui/setup/setup_widgets.h"

namespace finestra::ui {

FieldSection::FieldSection(ProjectDocument& document, QWidget* parent) : SetupSection(tr("Magnet"), document, parent) {
  auto* layout = new QVBoxLayout(this);
  form_ = new QComboBox;
  form_->addItems({tr("Magnitude and lab angles"), tr("Vector in lab axes (T)"), tr("Vector in crystal axes (T)")});
  layout->addWidget(form_);
  pages_ = new QStackedWidget;
  auto* anglesPage = new QWidget;
  auto* anglesForm = new QFormLayout(anglesPage);
  anglesForm->setContentsMargins(0, 0, 0, 0);
  magnitude_ = quantitySliderSpin("field.magnitude_T", 3, " T");
  polar_ = quantitySliderSpin("field.polar_deg", 2, "\u00b0");
  azimuth_ = quantitySliderSpin("field.azimuth_deg", 2, "\u00b0");
  anglesForm->addRow(tr("|B|"), magnitude_);
  anglesForm->addRow(tr("polar from lab z"), polar_);
  anglesForm->addRow(tr("azimuth from lab x"), azimuth_);
  pages_->addWidget(anglesPage);
  vector_ = new Vec3Edit(quantity("field.vector_T").minimum, quantity("field.vector_T").maximum, 4);
  vector_->setObjectName(QStringLiteral("field.vector_T"));
  pages_->addWidget(vector_);
  layout->addWidget(pages_);
  summary_ = new QLabel;
  summary_->setStyleSheet("color:#555");
  summary_->setWordWrap(true);
  layout->addWidget(summary_);

  for (SliderSpin* s : {magnitude_, polar_, azimuth_}) connectDrag(s);
  connect(magnitude_, &SliderSpin::edited, this, [this](double v) {
    editField(tr("Field magnitude"), [v](FieldSetting& f) { f.magnitudeT = v; }, "field.magnitude");
  });
  connect(polar_, &SliderSpin::edited, this, [this](double v) {
    editField(tr("Field polar angle"), [v](FieldSetting& f) { f.polarDeg = v; }, "field.polar");
  });
  connect(azimuth_, &SliderSpin::edited, this, [this](double v) {
    editField(tr("Field azimuth"), [v](FieldSetting& f) { f.azimuthDeg = v; }, "field.azimuth");
  });
  connect(vector_, &Vec3Edit::edited, this, [this](const Vec3& v) {
    editField(tr("Field vector"), [v](FieldSetting& f) { f.vector = v; });
  });
  connect(form_, &QComboBox::activated, this, &FieldSection::changeForm);
  refresh();
}

void FieldSection::connectDrag(SliderSpin* control) {
  connect(control, &SliderSpin::dragStarted, &document(), &ProjectDocument::beginDrag);
  connect(control, &SliderSpin::dragFinished, &document(), &ProjectDocument::endDrag);
}

void FieldSection::editField(const QString& text, const std::function<void(FieldSetting&)>& change,
                             const QString& mergeKey) {
  document().edit(text, [&](Project& p) { change(p.field); }, mergeKey);
}

/// The same field written in another form (angles, lab vector, crystal vector).
void FieldSection::changeForm(int index) {
  const Project& p = document().project();
  const LabFrame lab(p.sample.normal, p.sample.inPlaneX);
  const Vec3 labVector = p.field.labVector(lab);
  FieldSetting next;
  if (index == 0) {
    const auto angles = labVector.norm() > 0 ? anglesOfDirection(labVector) : std::array<double, 2>{0, 0};
    next = FieldSetting::fromAngles(labVector.norm(), angles[0], angles[1]);
  } else {
    next.form = index == 1 ? FieldSetting::Form::VectorLab : FieldSetting::Form::VectorCrystal;
    next.vector = index == 1 ? labVector : lab.toCrystal(labVector);
  }
  editField(tr("Field entry form"), [next](FieldSetting& f) { f = next; });
}

void FieldSection::refresh() {
  const FieldSetting& f = document().project().field;
  const int index = f.form == FieldSetting::Form::Angles ? 0 : f.form == FieldSetting::Form::VectorLab ? 1 : 2;
  {
    const QSignalBlocker block(form_);
    form_->setCurrentIndex(index);
  }
  pages_->setCurrentIndex(index == 0 ? 0 : 1);
  magnitude_->setValue(f.magnitudeT);
  polar_->setValue(f.polarDeg);
  azimuth_->setValue(f.azimuthDeg);
  vector_->setValue(f.vector);
  refreshSummary();
}

QString FieldSection::summary() const { return summary_->text(); }

void FieldSection::refreshSummary() {
  const Project& p = document().project();
  try {
    const LabFrame lab(p.sample.normal, p.sample.inPlaneX);
    const Vec3 l = p.field.labVector(lab), c = p.field.crystalVector(lab);
    QString text = tr("lab (%1, %2, %3) T    crystal (%4, %5, %6) T")
                       .arg(l[0], 0, 'f', 4).arg(l[1], 0, 'f', 4).arg(l[2], 0, 'f', 4)
                       .arg(c[0], 0, 'f', 4).arg(c[1], 0, 'f', 4).arg(c[2], 0, 'f', 4);
    if (!p.magnet.isNominal()) {  // a fitted calibration is in the project: show what the centres see
      const Vec3 t = projectFieldCrystal(p, lab);
      text += tr("\ncalibrated (scale %1, tilt %2° toward %3°): crystal (%4, %5, %6) T")
                  .arg(p.magnet.fieldScale, 0, 'f', 5).arg(p.magnet.tiltDeg, 0, 'f', 3)
                  .arg(p.magnet.tiltAzimuthDeg, 0, 'f', 1)
                  .arg(t[0], 0, 'f', 4).arg(t[1], 0, 'f', 4).arg(t[2], 0, 'f', 4);
    }
    summary_->setText(text);
  } catch (const InputError& e) {
    summary_->setText(QString::fromStdString(e.what()));
  }
}

}  // namespace finestra::ui
