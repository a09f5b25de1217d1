#include "ui/setup/setup_panel.h"

#include <QVBoxLayout>

#include "ui/setup/centre_section.h"
#include "ui/setup/conditions_section.h"
#include "ui/setup/field_section.h"
#include "ui/setup/sample_section.h"
#include "ui/setup/strain_section.h"
#include "ui/setup/sweep_section.h"

namespace finestra::ui {

SetupPanel::SetupPanel(ProjectDocument& document, QWidget* parent) : QScrollArea(parent) {
  auto* content = new QWidget;
  auto* layout = new QVBoxLayout(content);
  sweep_ = new SweepSection(document);
  sections_ = {new CentreSection(document), new FieldSection(document), new SampleSection(document),
               new StrainSection(document), new ConditionsSection(document), sweep_};
  for (SetupSection* section : sections_) layout->addWidget(section);
  layout->addStretch(1);
  setWidget(content);
  setWidgetResizable(true);
  setMinimumWidth(560);
  setHorizontalScrollBarPolicy(Qt::ScrollBarAlwaysOff);
  connect(sweep_, &SweepSection::sweepChosen, this, &SetupPanel::sweepChosen);
}

int SetupPanel::sweepIndex() const { return sweep_->sweepIndex(); }

}  // namespace finestra::ui
