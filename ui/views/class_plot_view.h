#pragma once
// Base of the views that draw one QCustomPlot with a class filter bar above it (level fans, line
// map, spectrum): owns the plot, the filter and the latest result, and redraws on a new result, a
// display change or a filter change. A derived view only draws (rebuild) and explains (hover).
#include "ui/result_view.h"
#include "ui/views/plot_helpers.h"

namespace finestra::ui {

class ClassPlotView : public ResultView {
  Q_OBJECT
public:
  /// `filledSwatches`: the filter bar shows filled class swatches (marker plots) or line swatches.
  ClassPlotView(const ViewContext& context, bool filledSwatches, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  void applyDisplay(const DisplaySettings& display) override;
  QCustomPlot* figure() override { return plot_; }

protected:
  /// Draws the current result into plot_ (called after every change).
  virtual void rebuild() = 0;
  virtual void onMouseMove(QMouseEvent* event) = 0;
  /// Called with a new result before it is drawn.
  virtual void resultArrived() {}

  QCustomPlot* plot_ = nullptr;
  ClassFilterBar* filter_ = nullptr;
  ResultPtr result_;

private:
  bool filledSwatches_ = true;
};

}  // namespace finestra::ui
