#include "ui/views/class_plot_view.h"

#include <QVBoxLayout>

namespace finestra::ui {

ClassPlotView::ClassPlotView(const ViewContext& context, bool filledSwatches, QWidget* parent)
    : ResultView(context, parent), plot_(new QCustomPlot(this)), filter_(new ClassFilterBar(this)),
      filledSwatches_(filledSwatches) {
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(4, 4, 4, 4);
  layout->addWidget(filter_);
  layout->addWidget(plot_, 1);
  stylePlot(*plot_);
  plot_->setMouseTracking(true);
  connect(plot_, &QCustomPlot::mouseMove, this, [this](QMouseEvent* event) { onMouseMove(event); });
  connect(filter_, &ClassFilterBar::filterChanged, this, [this] { rebuild(); });
  filter_->applyPalette(palette(), filledSwatches_);
}

void ClassPlotView::showResult(const ResultPtr& result) {
  result_ = result;
  resultArrived();
  rebuild();
}

void ClassPlotView::applyDisplay(const DisplaySettings& display) {
  ResultView::applyDisplay(display);
  filter_->applyPalette(palette(), filledSwatches_);
  rebuild();
}

}  // namespace finestra::ui
