#include "ui/setup/sample_section.h"

#include <QFormLayout>
#include <QLabel>

#include "core/common/errors.h"
#include "ui/setup/setup_widgets.h"

namespace finestra::ui {

SampleSection::SampleSection(ProjectDocument& document, QWidget* parent)
    : SetupSection(tr("Sample orientation"), document, parent) {
  auto* form = new QFormLayout(this);
  normal_ = new Vec3Edit(-20, 20, 3);
  inPlane_ = new Vec3Edit(-20, 20, 3);
  message_ = new QLabel;
  message_->setWordWrap(true);
  message_->setStyleSheet("color:#A02030");
  form->addRow(tr("Normal (lab z)"), normal_);
  form->addRow(tr("In-plane (lab x)"), inPlane_);
  form->addRow(message_);
  form->addRow(new QLabel(tr("Both as crystal directions, e.g. [001] and [110].")));
  connect(normal_, &Vec3Edit::edited, this, &SampleSection::apply);
  connect(inPlane_, &Vec3Edit::edited, this, &SampleSection::apply);
  refresh();
}

void SampleSection::apply() {
  const Vec3 n = normal_->value(), x = inPlane_->value();
  try {
    const LabFrame check(n, x, "sample");
  } catch (const InputError& e) {
    message_->setText(QString::fromStdString(e.what()));
    return;
  }
  message_->clear();
  document().edit(tr("Change sample orientation"), [&](Project& p) {
    p.sample.normal = n;
    p.sample.inPlaneX = x;
  });
}

void SampleSection::refresh() {
  const Project& p = document().project();
  normal_->setValue(p.sample.normal);
  inPlane_->setValue(p.sample.inPlaneX);
  message_->clear();
}

}  // namespace finestra::ui
