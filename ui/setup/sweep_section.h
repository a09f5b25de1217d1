#pragma once
// Setup section "Classes and sweep": the orientation classes computed (at least one) and the
// sweep drawn by the sweep plots, with its range and number of points.
#include <array>

#include "ui/setup/setup_section.h"

class QCheckBox;
class QComboBox;
class QDoubleSpinBox;
class QSpinBox;

namespace finestra::ui {

class SweepSection : public SetupSection {
  Q_OBJECT
public:
  explicit SweepSection(ProjectDocument& document, QWidget* parent = nullptr);
  Changes shows() const override { return Changes(Change::Classes) | Change::Sweeps; }
  int sweepIndex() const;

Q_SIGNALS:
  /// The user picked another sweep for the plots (a display choice, not a project edit).
  void sweepChosen(int index);

protected:
  void refresh() override;

private:
  void applyClasses();
  void applySweepRange();
  void refreshClasses();
  void refreshSweep();

  std::array<QCheckBox*, 4> classes_{};
  QComboBox* sweep_ = nullptr;
  QDoubleSpinBox* from_ = nullptr;
  QDoubleSpinBox* to_ = nullptr;
  QSpinBox* points_ = nullptr;
};

}  // namespace finestra::ui
