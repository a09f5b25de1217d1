#pragma once
// Setup section "Strain": the crystal-frame strain tensor (units of 10⁻⁶) and the extra E-type
// strain of each manifold (magnitude in GHz and angle, defect frame).
#include <QDoubleSpinBox>
#include <array>

#include "ui/setup/setup_section.h"

namespace finestra::ui {

class StrainSection : public SetupSection {
  Q_OBJECT
public:
  explicit StrainSection(ProjectDocument& document, QWidget* parent = nullptr);
  Changes shows() const override { return Change::Strain; }

protected:
  void refresh() override;

private:
  std::array<QDoubleSpinBox*, 6> tensor_{};
  std::array<QDoubleSpinBox*, 4> extra_{};
};

}  // namespace finestra::ui
