#pragma once
// Setup section "Detection": temperature and populations, collection direction, analyser and
// extra broadening.
#include "ui/setup/setup_section.h"

class QCheckBox;
class QComboBox;
class QDoubleSpinBox;

namespace finestra::ui {

class Vec3Edit;

class ConditionsSection : public SetupSection {
  Q_OBJECT
public:
  explicit ConditionsSection(ProjectDocument& document, QWidget* parent = nullptr);
  Changes shows() const override { return Change::Conditions; }

protected:
  void refresh() override;

private:
  void applyAnalyser();

  QDoubleSpinBox* temperature_ = nullptr;
  QComboBox* populations_ = nullptr;
  Vec3Edit* collection_ = nullptr;
  QCheckBox* analyserOn_ = nullptr;
  QDoubleSpinBox* analyserAngle_ = nullptr;
  QDoubleSpinBox* broadening_ = nullptr;
};

}  // namespace finestra::ui
