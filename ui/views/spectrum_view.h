#pragma once
// Simulated spectrum at the current field on the chosen spectral axis: the summed curve, one
// stick per line (coloured by class, strongest labelled) and the imported measured spectrum.
#include "ui/result_view.h"
#include "ui/views/plot_helpers.h"

namespace finestra::ui {

class SpectrumView : public ResultView {
  Q_OBJECT
public:
  explicit SpectrumView(const ViewContext& context, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  void applyDisplay(const DisplaySettings& display) override;
  QCustomPlot* figure() override { return plot_; }
  Table dataTable() const override;

private:
  void rebuild();
  void onMouseMove(QMouseEvent* event);
  SpectrumPlotData plotData() const;

  QCustomPlot* plot_ = nullptr;
  ClassFilterBar* filter_ = nullptr;
  ResultPtr result_;
};

}  // namespace finestra::ui
