#pragma once
// Level fans: excited (top) and ground (bottom) levels of every shown class against the sweep
// variable. A level keeps its colour through crossings (colour = tracked identity); classes are
// told apart by line style; the project's current point is a vertical marker.
#include "ui/views/class_plot_view.h"

namespace finestra::ui {

class LevelsView : public ClassPlotView {
  Q_OBJECT
public:
  explicit LevelsView(const ViewContext& context, QWidget* parent = nullptr);
  Table dataTable() const override;

private:
  void rebuild() override;
  void onMouseMove(QMouseEvent* event) override;

  QCPAxisRect* excitedRect_ = nullptr;
  QCPAxisRect* groundRect_ = nullptr;
};

}  // namespace finestra::ui
