#pragma once
// Line map: every line of every shown class against the sweep variable on the chosen spectral
// axis. Colour = class, filled disc = dipole mostly along the defect axis, open circle = mostly
// perpendicular, marker size and opacity = intensity bin. Measured peaks sit on top with their
// uncertainty; clicking one asks for the nearest predicted lines. A peak matched to a line (pinned
// in the project, or by the last fit or assignment of the session) carries its label, e.g. "C1·cl0".
#include "ui/document.h"
#include "ui/views/class_plot_view.h"

namespace finestra::ui {

class LinesView : public ClassPlotView {
  Q_OBJECT
public:
  explicit LinesView(const ViewContext& context, QWidget* parent = nullptr);
  Table dataTable() const override;

private:
  void rebuild() override;
  void resultArrived() override;
  void addPeakLabels();
  void onMouseMove(QMouseEvent* event) override;
  void onMousePress(QMouseEvent* event);
  /// Nearest measured peak to a pixel position within `radius` pixels, as an index into peaks.
  qsizetype peakAt(const QPointF& pixel, double radius) const;

  QVector<PeakLabel> pinnedLabels_;  ///< of result_->project
};

}  // namespace finestra::ui
