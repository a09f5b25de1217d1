#include "ui/views/spectrum_view.h"

#include <QToolTip>
#include <algorithm>

#include "core/optics/line_info.h"
#include "ui/document.h"

namespace finestra::ui {
namespace {
constexpr int kLabelledSticks = 16;
}

SpectrumView::SpectrumView(const ViewContext& context, QWidget* parent)
    : ClassPlotView(context, true, parent) {
  plot_->legend->setVisible(true);
  plot_->yAxis->setLabel(tr("intensity (arb. units)"));
  if (context.document)
    connect(context.document, &ProjectDocument::changed, this, [this](Changes what) {
      if (what & Change::MeasuredSpectrum) rebuild();
    });
}

SpectrumPlotData SpectrumView::plotData() const {
  SpectrumPlotData spectrum = result_->spectrumPlot;
  const ProjectDocument* document = context().document;
  if (document && document->measuredSpectrum() && result_->model)
    addMeasuredSpectrum(spectrum, *document->measuredSpectrum(), result_->model->zplGHz());
  return spectrum;
}

void SpectrumView::rebuild() {
  plot_->clearPlottables();
  plot_->clearItems();
  if (!result_ || !result_->error.isEmpty()) {
    plot_->replot();
    return;
  }
  const SpectrumPlotData spectrum = plotData();
  plot_->xAxis->setLabel(QString::fromStdString(spectralUnitLabel(spectrum.unit)));
  std::array<QCPGraph*, 4> sticks{};
  for (const Stick& s : spectrum.sticks) {
    if (!filter_->visible(s.cls)) continue;
    QCPGraph*& g = sticks[static_cast<std::size_t>(s.cls)];
    if (!g) {
      g = plot_->addGraph();
      g->setLineStyle(QCPGraph::lsImpulse);
      g->setPen(QPen(palette().color(s.cls), 2.0));
      g->setName(tr("lines, %1").arg(className(s.cls)));
    }
    g->addData(s.x, s.height);
  }
  QCPGraph* curve = plot_->addGraph();
  curve->setPen(QPen(QColor(40, 40, 40), 1.4));
  curve->setData(spectrum.x, spectrum.y, true);
  curve->setName(result_->project.conditions.populations == PopulationModel::Thermal
                     ? tr("simulated (%1 K)").arg(result_->project.conditions.temperatureK)
                     : tr("simulated (equal populations)"));
  if (!spectrum.measuredX.isEmpty()) {
    QCPGraph* measured = plot_->addGraph();
    QPen pen(palette().measured, 1.2);
    pen.setStyle(Qt::DashLine);
    measured->setPen(pen);
    measured->setData(spectrum.measuredX, spectrum.measuredY);
    measured->setName(tr("measured: %1 (scaled)").arg(spectrum.measuredName));
  }
  QVector<Stick> labelled;
  for (const Stick& s : spectrum.sticks)
    if (filter_->visible(s.cls)) labelled.push_back(s);
  std::sort(labelled.begin(), labelled.end(), [](const Stick& a, const Stick& b) { return a.height > b.height; });
  if (labelled.size() > kLabelledSticks) labelled.resize(kLabelledSticks);
  for (const Stick& s : labelled) {
    auto* text = new QCPItemText(plot_);
    text->position->setCoords(s.x, s.height);
    text->setPositionAlignment(Qt::AlignHCenter | Qt::AlignBottom);
    text->setText(QStringLiteral("%1\u00b7%2").arg(s.label).arg(s.cls));
    text->setColor(palette().color(s.cls).darker(130));
    QFont f = font();
    f.setPointSize(8);
    text->setFont(f);
    text->setClipToAxisRect(true);
  }
  plot_->rescaleAxes();
  plot_->yAxis->setRange(0, std::max(spectrum.curveMax, 1e-30) * 1.18);
  plot_->replot();
}

void SpectrumView::onMouseMove(QMouseEvent* event) {
  if (!result_ || !result_->model) return;
  const QPointF pos = event->position();
  double best = 6.0;
  const Stick* found = nullptr;
  for (const Stick& s : result_->spectrumPlot.sticks) {
    if (!filter_->visible(s.cls)) continue;
    const double d = std::abs(plot_->xAxis->coordToPixel(s.x) - pos.x());
    if (d < best) {
      best = d;
      found = &s;
    }
  }
  if (!found) {
    QToolTip::hideText();
    return;
  }
  const OpticalLine& line = result_->current[static_cast<std::size_t>(found->classIndex)].lines[static_cast<std::size_t>(found->lineIndex)];
  QToolTip::showText(event->globalPosition().toPoint(),
                     QString::fromStdString(describeLine(found->cls, line, result_->model->zplGHz())), plot_);
}

Table SpectrumView::dataTable() const {
  Table t;
  if (!result_ || !result_->error.isEmpty()) return t;
  const SpectrumPlotData spectrum = plotData();
  t.headers = {spectralUnitLabel(spectrum.unit), "simulated"};
  for (qsizetype i = 0; i < spectrum.x.size(); ++i) t.rows.push_back({exact(spectrum.x[i]), exact(spectrum.y[i])});
  return t;
}

}  // namespace finestra::ui
