#include "ui/views/microwave_view.h"

#include <QComboBox>
#include <QDoubleSpinBox>
#include <QLabel>
#include <QLineEdit>
#include <QToolTip>
#include <algorithm>
#include <cmath>

#include "core/common/errors.h"
#include "core/project/field_semantics.h"
#include "core/report/resonance_reports.h"

namespace finestra::ui {
namespace {
constexpr int kLabelledSticks = 12;
// Up to four points per linewidth across the whole range; capped so that a redraw of the largest
// nucleus (⁷³Ge, 3120 transitions) stays near 0.3 s. Zooming in does not refine the curve.
constexpr int kMaxPlotPoints = 100001;

struct StickRef {
  std::size_t classIndex, transitionIndex;
  double height;
};
}  // namespace

MicrowaveView::MicrowaveView(const ViewContext& context, QWidget* parent) : ClassPlotView(context, true, parent) {
  plot_->legend->setVisible(true);
  plot_->yAxis->setLabel(tr("absorption: strength × population difference"));
  auto* bar = filter_->layout();
  bar->addWidget(new QLabel(tr("Drive (lab x,y,z):"), this));
  drive_ = new QLineEdit(QStringLiteral("1,0,0"), this);
  drive_->setMaximumWidth(110);
  drive_->setToolTip(tr("Direction of the microwave magnetic field in the lab frame"));
  bar->addWidget(drive_);
  manifold_ = new QComboBox(this);
  manifold_->addItems({tr("ground"), tr("excited")});
  bar->addWidget(manifold_);
  bar->addWidget(new QLabel(tr("FWHM:"), this));
  linewidthMHz_ = new QDoubleSpinBox(this);
  linewidthMHz_->setRange(0.001, 10000);
  linewidthMHz_->setDecimals(3);
  linewidthMHz_->setValue(1.0);
  linewidthMHz_->setSuffix(tr(" MHz"));
  bar->addWidget(linewidthMHz_);
  status_ = new QLabel(this);
  bar->addWidget(status_);
  auto update = [this] {
    recompute();
    rebuild();
  };
  connect(drive_, &QLineEdit::editingFinished, this, update);
  connect(manifold_, &QComboBox::currentIndexChanged, this, update);
  connect(linewidthMHz_, &QDoubleSpinBox::editingFinished, this, update);
  connect(plot_->xAxis, qOverload<const QCPRange&>(&QCPAxis::rangeChanged), this, [this] { placeLabels(); });
}

void MicrowaveView::resultArrived() { recompute(); }

void MicrowaveView::recompute() {
  classes_.clear();
  spectrum_ = {};
  error_.clear();
  if (!result_ || !result_->model) return;
  const QStringList parts = drive_->text().split(',');
  bool ok = parts.size() == 3;
  Vec3 drive = Vec3::Zero();
  for (int k = 0; ok && k < 3; ++k) drive[k] = parts[k].trimmed().toDouble(&ok);
  if (!ok) {
    error_ = tr("drive: expected three numbers x,y,z");
    status_->setText(error_);
    return;
  }
  try {
    MicrowaveSettings settings;
    settings.driveLab = drive;
    settings.manifold = manifold_->currentIndex() == 0 ? Manifold::Ground : Manifold::Excited;
    const CentreModel& model = *result_->model;
    classes_ = microwaveTransitions(model, result_->project.classes, projectFieldCrystal(result_->project, model.setup().lab), settings);
    ResonanceSpectrumRequest request;
    request.fwhmGHz = linewidthMHz_->value() * 1e-3;
    std::tie(request.fromGHz, request.toGHz) = resonanceAutoRange(classes_, request.fwhmGHz);
    request.points = static_cast<int>(std::clamp((request.toGHz - request.fromGHz) / (0.25 * request.fwhmGHz), 2001.0,
                                                 static_cast<double>(kMaxPlotPoints)));
    spectrum_ = resonanceSpectrum(classes_, request);
    axisScale_ = request.toGHz < 2.0 ? 1e3 : 1.0;
    status_->setText(tr("%1 K").arg(model.setup().conditions.temperatureK));
  } catch (const InputError& e) {
    classes_.clear();
    error_ = QString::fromStdString(e.what());
    status_->setText(error_);
  }
}

void MicrowaveView::rebuild() {
  plot_->clearPlottables();
  plot_->clearItems();
  if (!result_ || !result_->error.isEmpty() || !error_.isEmpty() || spectrum_.frequencyGHz.empty()) {
    plot_->replot();
    return;
  }
  plot_->xAxis->setLabel(axisScale_ == 1.0 ? tr("microwave frequency (GHz)") : tr("microwave frequency (MHz)"));
  QVector<double> x, y;
  for (std::size_t k = 0; k < spectrum_.frequencyGHz.size(); ++k) {
    x.push_back(axisValue(spectrum_.frequencyGHz[k]));
    y.push_back(spectrum_.signal[k]);
  }
  QCPGraph* curve = plot_->addGraph();
  curve->setPen(QPen(QColor(120, 120, 120), 1.0));
  curve->setData(x, y, true);
  curve->setName(tr("absorption, FWHM %1 MHz (all classes)").arg(linewidthMHz_->value()));
  double tallest = 0;
  for (const ClassMicrowave& c : classes_) {
    if (!filter_->visible(c.cls)) continue;
    QCPGraph* graph = nullptr;
    for (const MicrowaveTransition& t : c.transitions) {
      if (!std::isfinite(t.strength)) continue;
      const double height = t.strength * (t.populationLower - t.populationUpper);
      if (!graph) {
        graph = plot_->addGraph();
        graph->setLineStyle(QCPGraph::lsImpulse);
        graph->setPen(QPen(palette().color(c.cls), 1.6));
        graph->setName(tr("transitions, %1").arg(className(c.cls)));
      }
      graph->addData(axisValue(t.frequencyGHz), height);
      tallest = std::max(tallest, height);
    }
  }
  const double first = x.front(), last = x.back(), pad = 0.03 * (last - first);
  plot_->xAxis->setRange(first - pad, last + pad);
  const double top = std::max({tallest, *std::max_element(y.begin(), y.end()), 1e-30});
  // Headroom: labels above the tallest stick and the legend (about a fifth of the height) above all data.
  plot_->yAxis->setRange(0, top * 1.6);
  placeLabels();
  plot_->replot();
}

void MicrowaveView::placeLabels() {
  plot_->clearItems();
  const QCPRange range = plot_->xAxis->range();
  std::vector<StickRef> sticks;
  for (std::size_t c = 0; c < classes_.size(); ++c) {
    if (!filter_->visible(classes_[c].cls)) continue;
    for (std::size_t t = 0; t < classes_[c].transitions.size(); ++t) {
      const MicrowaveTransition& x = classes_[c].transitions[t];
      if (!std::isfinite(x.strength) || !range.contains(axisValue(x.frequencyGHz))) continue;
      sticks.push_back({c, t, x.strength * (x.populationLower - x.populationUpper)});
    }
  }
  std::sort(sticks.begin(), sticks.end(), [](const StickRef& a, const StickRef& b) { return a.height > b.height; });
  // Minimum distance between labels in axis units; a plot not laid out yet (headless export) counts
  // as 1000 pixels wide.
  constexpr double kLabelWidthPx = 96;
  const int laidOut = plot_->axisRect()->width();
  const double widthPx = laidOut > 200 ? laidOut : 1000;
  const double separation = range.size() * kLabelWidthPx / widthPx;
  std::vector<double> placed;
  for (const StickRef& s : sticks) {
    if (static_cast<int>(placed.size()) == kLabelledSticks || s.height <= 0.02 * sticks.front().height) break;
    const MicrowaveTransition& t = classes_[s.classIndex].transitions[s.transitionIndex];
    const double px = axisValue(t.frequencyGHz);
    if (std::any_of(placed.begin(), placed.end(), [&](double p) { return std::abs(p - px) < separation; })) continue;
    placed.push_back(px);
    auto* text = new QCPItemText(plot_);
    text->position->setCoords(axisValue(t.frequencyGHz), s.height);
    text->setPositionAlignment(Qt::AlignHCenter | Qt::AlignBottom);
    text->setText(QString::fromStdString(microwaveLabel(t)) + QStringLiteral(" \u00b7%1").arg(classes_[s.classIndex].cls));
    text->setColor(palette().color(classes_[s.classIndex].cls).darker(140));
    QFont f = font();
    f.setPointSize(8);
    text->setFont(f);
    text->setBrush(QColor(255, 255, 255, 210));  // readable where taller sticks of other classes pass behind
    text->setClipToAxisRect(true);
  }
}

void MicrowaveView::onMouseMove(QMouseEvent* event) {
  const QPointF pos = event->position();
  double best = 6.0;
  const MicrowaveTransition* found = nullptr;
  int foundClass = 0;
  for (const ClassMicrowave& c : classes_) {
    if (!filter_->visible(c.cls)) continue;
    for (const MicrowaveTransition& t : c.transitions) {
      if (!std::isfinite(t.strength)) continue;
      const double d = std::abs(plot_->xAxis->coordToPixel(axisValue(t.frequencyGHz)) - pos.x());
      if (d < best) {
        best = d;
        found = &t;
        foundClass = c.cls;
      }
    }
  }
  if (!found) {
    QToolTip::hideText();
    return;
  }
  QToolTip::showText(event->globalPosition().toPoint(),
                     QString::fromStdString(describeMicrowaveTransition(foundClass, *found)), plot_);
}

Table MicrowaveView::dataTable() const { return microwaveTable(classes_); }

}  // namespace finestra::ui
