#include "ui/views/lines_view.h"

#include <QToolTip>
#include <algorithm>

#include "core/optics/line_info.h"
#include "core/report/reports.h"
#include "ui/fit/peak_labels.h"

namespace finestra::ui {
namespace {

constexpr std::array<int, 4> kBinAlpha{255, 190, 120, 60};
constexpr std::array<double, 4> kBinSize{4.5, 3.6, 2.8, 2.2};

}  // namespace

LinesView::LinesView(const ViewContext& context, QWidget* parent)
    : ClassPlotView(context, true, parent) {
  plot_->legend->setVisible(true);
  plot_->axisRect()->insetLayout()->setInsetAlignment(0, Qt::AlignTop | Qt::AlignRight);
  connect(plot_, &QCustomPlot::mousePress, this, &LinesView::onMousePress);
  if (context.document)
    connect(context.document, &ProjectDocument::changed, this, [this](Changes what) {
      if (what & Change::Fit) rebuild();
    });
}

void LinesView::resultArrived() {
  pinnedLabels_ = result_ && result_->error.isEmpty() ? pinnedLabels(result_->project) : QVector<PeakLabel>{};
}

void LinesView::rebuild() {
  plot_->clearGraphs();
  plot_->clearItems();
  plot_->clearPlottables();
  if (!result_ || !result_->lines) {
    plot_->replot();
    return;
  }
  plot_->xAxis->setLabel(QString::fromStdString(sweepAxisLabel(result_->sweep->spec.kind)));
  plot_->yAxis->setLabel(QString::fromStdString(spectralUnitLabel(result_->lines->unit)));
  std::array<bool, 4> legendDone{};
  // Weak bins first so strong points are drawn on top.
  QVector<const LinePointGroup*> ordered;
  for (const LinePointGroup& g : result_->lines->groups) ordered.push_back(&g);
  std::stable_sort(ordered.begin(), ordered.end(), [](auto* a, auto* b) { return a->bin > b->bin; });
  for (const LinePointGroup* g : ordered) {
    if (!filter_->visible(g->cls)) continue;
    QCPGraph* graph = plot_->addGraph();
    graph->setLineStyle(QCPGraph::lsNone);
    QColor colour = palette().color(g->cls);
    colour.setAlpha(kBinAlpha[static_cast<std::size_t>(g->bin)]);
    const double size = kBinSize[static_cast<std::size_t>(g->bin)];
    if (g->axisParallel)
      graph->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssDisc, colour, colour, size));
    else
      graph->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssCircle, QPen(colour, 1.2), Qt::NoBrush, size + 1));
    graph->setData(g->x, g->y, true);
    graph->removeFromLegend();
    legendDone[static_cast<std::size_t>(g->cls)] = true;
  }
  for (int c = 0; c < 4; ++c) {
    if (!legendDone[static_cast<std::size_t>(c)]) continue;
    QCPGraph* key = plot_->addGraph();  // legend entry only
    key->setLineStyle(QCPGraph::lsNone);
    key->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssDisc, palette().color(c), palette().color(c), 7));
    key->setName(className(c));
  }
  // Polarisation key (grey, legend only).
  for (bool parallel : {true, false}) {
    QCPGraph* key = plot_->addGraph();
    key->setLineStyle(QCPGraph::lsNone);
    key->setScatterStyle(parallel ? QCPScatterStyle(QCPScatterStyle::ssDisc, Qt::darkGray, Qt::darkGray, 6.5)
                                  : QCPScatterStyle(QCPScatterStyle::ssCircle, QPen(Qt::darkGray, 1.2), Qt::NoBrush, 7.5));
    key->setName(parallel ? tr("dipole \u2225 defect axis") : tr("dipole \u22a5 defect axis"));
  }
  if (!result_->sweep->peaks.isEmpty()) {
    QCPGraph* peaks = plot_->addGraph();
    peaks->setLineStyle(QCPGraph::lsNone);
    peaks->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssCross, QPen(palette().measured, 1.3), Qt::NoBrush, 7));
    QVector<double> x, y, e;
    for (const PeakMark& p : result_->sweep->peaks) {
      x << p.x;
      y << p.y;
      e << p.yError;
    }
    peaks->setData(x, y);
    peaks->setName(tr("measured peaks (click for nearest lines)"));
    auto* bars = new QCPErrorBars(plot_->xAxis, plot_->yAxis);
    bars->setDataPlottable(peaks);
    bars->setData(e);
    bars->setPen(QPen(palette().measured, 1.2));
    bars->removeFromLegend();
  }
  plot_->rescaleAxes();
  addPeakLabels();
  const QCPRange y = plot_->yAxis->range();
  plot_->yAxis->setRange(y.lower - 0.05 * y.size(), y.upper + 0.05 * y.size());
  if (result_->sweep->currentX) {
    auto* marker = new QCPItemStraightLine(plot_);
    marker->point1->setCoords(*result_->sweep->currentX, 0);
    marker->point2->setCoords(*result_->sweep->currentX, 1);
    marker->setPen(QPen(palette().marker, 1.2, Qt::DashLine));
  }
  plot_->replot();
}

void LinesView::addPeakLabels() {
  // Fit labels (of the session) win over pinned ones: they include the pinned peaks anyway.
  QMap<QPair<int, int>, QString> labels;
  for (const PeakLabel& l : pinnedLabels_) labels[{l.measurement, l.peak}] = l.text;
  if (context().document)
    for (const PeakLabel& l : context().document->fitLabels()) labels[{l.measurement, l.peak}] = l.text;
  if (labels.isEmpty()) return;
  for (const PeakMark& p : result_->sweep->peaks) {
    const auto it = labels.constFind({p.measurement, p.peak});
    if (it == labels.constEnd()) continue;
    auto* text = new QCPItemText(plot_);
    text->position->setCoords(p.x, p.y);
    text->setPositionAlignment(Qt::AlignLeft | Qt::AlignVCenter);
    text->setPadding(QMargins(6, 0, 0, 0));
    text->setText(*it);
    text->setColor(palette().measured.darker(130));
    QFont font = plot_->font();
    font.setPointSize(8);
    text->setFont(font);
    text->setClipToAxisRect(true);
  }
}

qsizetype LinesView::peakAt(const QPointF& pixel, double radius) const {
  qsizetype best = -1;
  double bestDistance = radius;
  for (qsizetype i = 0; i < result_->sweep->peaks.size(); ++i) {
    const PeakMark& p = result_->sweep->peaks[i];
    const double dx = plot_->xAxis->coordToPixel(p.x) - pixel.x();
    const double dy = plot_->yAxis->coordToPixel(p.y) - pixel.y();
    const double d = std::hypot(dx, dy);
    if (d < bestDistance) {
      bestDistance = d;
      best = i;
    }
  }
  return best;
}

void LinesView::onMouseMove(QMouseEvent* event) {
  if (!result_ || !result_->lines || result_->sweep->result.x.empty()) return;
  const QPointF pos = event->position();
  if (const qsizetype p = peakAt(pos, 8); p >= 0) {
    const PeakMark& mark = result_->sweep->peaks[p];
    const MeasurementSet& m = result_->project.measurements[static_cast<std::size_t>(mark.measurement)];
    QToolTip::showText(event->globalPosition().toPoint(),
                       tr("measured: %1, peak %2\n%3 \u00b1 %4\nclick to list the nearest predicted lines")
                           .arg(QString::fromStdString(m.name))
                           .arg(mark.peak + 1)
                           .arg(mark.y, 0, 'f', 4)
                           .arg(mark.yError, 0, 'g', 3),
                       plot_);
    return;
  }
  const auto& xs = result_->sweep->result.x;
  const double x = plot_->xAxis->pixelToCoord(pos.x());
  const auto it = std::lower_bound(xs.begin(), xs.end(), x);
  std::size_t k = static_cast<std::size_t>(std::clamp<std::ptrdiff_t>(it - xs.begin(), 0, static_cast<std::ptrdiff_t>(xs.size()) - 1));
  if (k > 0 && std::abs(xs[k - 1] - x) < std::abs(xs[k] - x)) --k;
  if (std::abs(plot_->xAxis->coordToPixel(xs[k]) - pos.x()) > 10) {
    QToolTip::hideText();
    return;
  }
  const double zpl = result_->model->zplGHz();
  double best = 8.0;
  const OpticalLine* bestLine = nullptr;
  int bestClass = 0;
  for (const ClassSweep& c : result_->sweep->result.classes) {
    if (!filter_->visible(c.cls)) continue;
    for (const OpticalLine& l : c.lines[k]) {
      if (l.intensity < kIntensityBinFloors.back() * result_->lines->maxIntensity) continue;
      const double py = plot_->yAxis->coordToPixel(fromAbsoluteGHz(l.frequencyGHz, result_->lines->unit, zpl));
      if (std::abs(py - pos.y()) < best) {
        best = std::abs(py - pos.y());
        bestLine = &l;
        bestClass = c.cls;
      }
    }
  }
  if (!bestLine) {
    QToolTip::hideText();
    return;
  }
  QToolTip::showText(event->globalPosition().toPoint(),
                     tr("x = %1\n").arg(xs[k], 0, 'g', 6) + QString::fromStdString(describeLine(bestClass, *bestLine, zpl)),
                     plot_);
}

void LinesView::onMousePress(QMouseEvent* event) {
  if (!result_ || !result_->lines || event->button() != Qt::LeftButton) return;
  if (const qsizetype p = peakAt(event->position(), 8); p >= 0)
    Q_EMIT peakClicked(result_->sweep->peaks[p].measurement, result_->sweep->peaks[p].peak);
}

Table LinesView::dataTable() const {
  if (!result_ || !result_->lines) return {};
  return sweepLinesTable(result_->sweep->spec, result_->sweep->result);
}

}  // namespace finestra::ui
