#pragma once
// Microwave resonance spectrum at the project's field: the simulated absorption of a weak drive
// (core/resonance) on a MHz or GHz axis, one stick per transition coloured by class, the strongest
// labelled with their electron and nuclear character, hover read-out. The drive direction,
// manifold and linewidth are chosen in the view's bar (they are not part of the project).
#include "core/resonance/resonance_spectrum.h"
#include "ui/views/class_plot_view.h"

class QComboBox;
class QDoubleSpinBox;
class QLabel;
class QLineEdit;

namespace finestra::ui {

class MicrowaveView : public ClassPlotView {
  Q_OBJECT
public:
  explicit MicrowaveView(const ViewContext& context, QWidget* parent = nullptr);
  Table dataTable() const override;

private:
  void resultArrived() override;
  void rebuild() override;
  void onMouseMove(QMouseEvent* event) override;
  /// Labels the tallest visible sticks in the current x range, skipping one that would overlap a
  /// label already placed (called after every redraw and on zoom or pan).
  void placeLabels();
  /// Asks the core for the transitions and the spectrum with the bar's settings.
  void recompute();
  /// Frequency in the axis unit (MHz when every shown transition is below 2 GHz).
  double axisValue(double frequencyGHz) const { return frequencyGHz * axisScale_; }

  QLineEdit* drive_ = nullptr;
  QComboBox* manifold_ = nullptr;
  QDoubleSpinBox* linewidthMHz_ = nullptr;
  QLabel* status_ = nullptr;
  std::vector<ClassMicrowave> classes_;
  ResonanceSpectrum spectrum_;
  QString error_;
  double axisScale_ = 1.0;
};

}  // namespace finestra::ui
