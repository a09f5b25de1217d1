#include "ui/views/levels_view.h"

#include <QToolTip>
#include <algorithm>
#include <limits>

#include "core/report/reports.h"

namespace finestra::ui {

LevelsView::LevelsView(const ViewContext& context, QWidget* parent)
    : ClassPlotView(context, false, parent) {
  plot_->plotLayout()->clear();
  excitedRect_ = new QCPAxisRect(plot_);
  groundRect_ = new QCPAxisRect(plot_);
  plot_->plotLayout()->addElement(0, 0, excitedRect_);
  plot_->plotLayout()->addElement(1, 0, groundRect_);
  for (QCPAxisRect* r : {excitedRect_, groundRect_}) {
    r->setRangeDrag(Qt::Horizontal | Qt::Vertical);
    r->setRangeZoom(Qt::Horizontal | Qt::Vertical);
    for (QCPAxis* a : r->axes()) a->setLayer("axes");
  }
  auto* margins = new QCPMarginGroup(plot_);
  excitedRect_->setMarginGroup(QCP::msLeft | QCP::msRight, margins);
  groundRect_->setMarginGroup(QCP::msLeft | QCP::msRight, margins);
  excitedRect_->axis(QCPAxis::atLeft)->setLabel(tr("excited \u00b2E\u1d64 (GHz)"));
  groundRect_->axis(QCPAxis::atLeft)->setLabel(tr("ground \u00b2E_g (GHz)"));
}

void LevelsView::rebuild() {
  plot_->clearGraphs();
  plot_->clearItems();
  if (!result_ || !result_->levels) {
    plot_->replot();
    return;
  }
  const QString xLabel = QString::fromStdString(sweepAxisLabel(result_->sweep->spec.kind));
  excitedRect_->axis(QCPAxis::atBottom)->setLabel(QString());
  groundRect_->axis(QCPAxis::atBottom)->setLabel(xLabel);
  for (const LevelCurve& c : result_->levels->curves) {
    if (!filter_->visible(c.cls)) continue;
    QCPAxisRect* rect = c.manifold == Manifold::Excited ? excitedRect_ : groundRect_;
    QCPGraph* g = plot_->addGraph(rect->axis(QCPAxis::atBottom), rect->axis(QCPAxis::atLeft));
    QPen pen(palette().color(c.level), 1.6, classPenStyle(c.cls));
    g->setPen(pen);
    g->setData(c.x, c.y, true);
    g->setName(QStringLiteral("%1 %2 level %3").arg(className(c.cls), c.manifold == Manifold::Excited ? "excited" : "ground").arg(c.level));
  }
  for (QCPAxisRect* r : {excitedRect_, groundRect_}) {
    bool first = true;
    QCPRange yr;
    for (QCPGraph* g : r->graphs()) {
      bool found = false;
      const QCPRange gr = g->getValueRange(found);
      if (!found) continue;
      yr = first ? gr : QCPRange(std::min(yr.lower, gr.lower), std::max(yr.upper, gr.upper));
      first = false;
    }
    if (!first) {
      const double pad = std::max(1.0, 0.06 * yr.size());
      r->axis(QCPAxis::atLeft)->setRange(yr.lower - pad, yr.upper + pad);
    }
    r->axis(QCPAxis::atBottom)->setRange(result_->sweep->result.x.front(), result_->sweep->result.x.back());
    if (result_->sweep->currentX) {
      auto* marker = new QCPItemStraightLine(plot_);
      marker->setClipAxisRect(r);
      for (QCPItemPosition* p : {marker->point1, marker->point2}) p->setAxes(r->axis(QCPAxis::atBottom), r->axis(QCPAxis::atLeft));
      marker->point1->setCoords(*result_->sweep->currentX, 0);
      marker->point2->setCoords(*result_->sweep->currentX, 1);
      marker->setPen(QPen(palette().marker, 1.2, Qt::DashLine));
    }
  }
  auto* title = new QCPItemText(plot_);
  title->setClipToAxisRect(false);
  title->position->setType(QCPItemPosition::ptAxisRectRatio);
  title->position->setAxisRect(excitedRect_);
  title->position->setCoords(0.0, 0.0);
  title->setPositionAlignment(Qt::AlignLeft | Qt::AlignBottom);
  title->setText(tr("sweep: %1   colour = tracked level, line style = class   dashed marker = current field")
                     .arg(QString::fromStdString(result_->sweep->spec.name)));
  title->setColor(QColor(90, 90, 90));
  plot_->replot();
}

void LevelsView::onMouseMove(QMouseEvent* event) {
  if (!result_ || !result_->levels || result_->sweep->result.x.empty()) return;
  const QPointF pos = event->position();
  double best = 12.0;  // pixels
  QString text;
  for (const LevelCurve& c : result_->levels->curves) {
    if (!filter_->visible(c.cls)) continue;
    QCPAxisRect* rect = c.manifold == Manifold::Excited ? excitedRect_ : groundRect_;
    if (!rect->rect().contains(pos.toPoint())) continue;
    const double x = rect->axis(QCPAxis::atBottom)->pixelToCoord(pos.x());
    const auto it = std::lower_bound(c.x.begin(), c.x.end(), x);
    const qsizetype k = std::clamp<qsizetype>(it - c.x.begin(), 0, c.x.size() - 1);
    const double py = rect->axis(QCPAxis::atLeft)->coordToPixel(c.y[k]);
    const double d = std::abs(py - pos.y());
    if (d < best) {
      best = d;
      text = tr("%1\n%2 level %3 (tracked)\nx = %4\nE = %5 GHz")
                 .arg(className(c.cls), c.manifold == Manifold::Excited ? tr("excited") : tr("ground"))
                 .arg(c.level)
                 .arg(c.x[k], 0, 'g', 6)
                 .arg(c.y[k], 0, 'f', 4);
    }
  }
  if (text.isEmpty()) QToolTip::hideText();
  else QToolTip::showText(event->globalPosition().toPoint(), text, plot_);
}

Table LevelsView::dataTable() const {
  Table t;
  if (!result_ || !result_->levels) return t;
  t.headers.push_back(sweepAxisLabel(result_->sweep->spec.kind));
  for (const LevelCurve& c : result_->levels->curves)
    t.headers.push_back("class " + std::to_string(c.cls) + (c.manifold == Manifold::Excited ? " excited " : " ground ") +
                        std::to_string(c.level) + " (GHz)");
  for (std::size_t k = 0; k < result_->sweep->result.x.size(); ++k) {
    std::vector<std::string> row{exact(result_->sweep->result.x[k])};
    for (const LevelCurve& c : result_->levels->curves) row.push_back(exact(c.y[static_cast<qsizetype>(k)]));
    t.rows.push_back(std::move(row));
  }
  return t;
}

}  // namespace finestra::ui
