#pragma once
// Simulated spectrum at the current field on the chosen spectral axis: the summed curve, one
// stick per line (coloured by class, strongest labelled) and the imported measured spectrum.
#include "ui/views/class_plot_view.h"

namespace finestra::ui {

class SpectrumView : public ClassPlotView {
  Q_OBJECT
public:
  explicit SpectrumView(const ViewContext& context, QWidget* parent = nullptr);
  Table dataTable() const override;

private:
  void rebuild() override;
  void onMouseMove(QMouseEvent* event) override;
  SpectrumPlotData plotData() const;

};

}  // namespace finestra::ui
