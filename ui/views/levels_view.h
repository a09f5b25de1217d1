#pragma once
// Level fans: excited (top) and ground (bottom) levels of every shown class against the sweep
// variable. A level keeps its colour through crossings (colour = tracked identity); classes are
// told apart by line style; the project's current point is a vertical marker.
#include "ui/result_view.h"
#include "ui/views/plot_helpers.h"

namespace finestra::ui {

class LevelsView : public ResultView {
  Q_OBJECT
public:
  explicit LevelsView(const ViewContext& context, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  void applyDisplay(const DisplaySettings& display) override;
  QCustomPlot* figure() override { return plot_; }
  Table dataTable() const override;

private:
  void rebuild();
  void onMouseMove(QMouseEvent* event);

  QCustomPlot* plot_ = nullptr;
  QCPAxisRect* excitedRect_ = nullptr;
  QCPAxisRect* groundRect_ = nullptr;
  ClassFilterBar* filter_ = nullptr;
  ResultPtr result_;
};

}  // namespace finestra::ui
