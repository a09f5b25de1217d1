#pragma once
// Microwave resonance spectrum at the project's field: the simulated absorption of a weak drive
// (core/resonance) on a MHz or GHz axis, one stick per transition coloured by class, the strongest
// labelled with their electron and nuclear character, hover read-out. The drive direction,
// manifold and linewidth are chosen in the view's bar (they are not part of the project). The
// transitions and the spectrum are computed as a job of the view's JobRunner (a large nucleus
// takes a noticeable time), so the GUI thread never waits; a newer setting or result supersedes it.
#include <memory>

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
  JobRunner* ownJobs() override { return runner_; }

private:
  void resultArrived() override;
  void rebuild() override;
  void onMouseMove(QMouseEvent* event) override;
  /// Labels the tallest visible sticks in the current x range, skipping one that would overlap a
  /// label already placed (called after every redraw and on zoom or pan).
  void placeLabels();
  /// Starts a job asking the core for the transitions and the spectrum with the bar's settings.
  void recompute();
  struct Computed;
  void onComputed(const std::shared_ptr<const Computed>& computed);
  /// Frequency in the axis unit (MHz when every shown transition is below 2 GHz).
  double axisValue(double frequencyGHz) const { return frequencyGHz * axisScale_; }

  QLineEdit* drive_ = nullptr;
  QComboBox* manifold_ = nullptr;
  QDoubleSpinBox* linewidthMHz_ = nullptr;
  QLabel* status_ = nullptr;
  JobRunner* runner_ = nullptr;
  std::vector<ClassMicrowave> classes_;
  ResonanceSpectrum spectrum_;
  QString error_;
  double axisScale_ = 1.0;
};

}  // namespace finestra::ui
