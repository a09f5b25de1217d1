#include "ui/fit/fit_view.h"

#include <QComboBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QProgressBar>
#include <QPushButton>
#include <QSignalBlocker>
#include <QSpinBox>
#include <QSplitter>
#include <QTableWidget>
#include <QVBoxLayout>
#include <algorithm>
#include <cmath>
#include <map>
#include <spdlog/spdlog.h>

#include "core/centre/parameter_table.h"
#include "core/common/errors.h"
#include "core/fit/fit_report.h"
#include "core/units/spectral_units.h"
#include "ui/document.h"
#include "ui/fit/peak_labels.h"
#include "ui/views/plot_helpers.h"

namespace finestra::ui {
namespace {

enum ParameterColumn { kFree = 0, kName, kUnit, kStart, kFitted, kError, kParameterColumns };
enum PeakColumn { kSet = 0, kPeak, kPosition, kSigma, kLine, kClass, kLevels, kResidual, kPull, kPeakColumns };

const QColor kOutlierTint(255, 226, 196);
const QColor kUndeterminedTint(255, 205, 205);
const QColor kFreeTint(232, 244, 232);

QString number(double v, int significant = 6) {
  return std::isfinite(v) ? QString::number(v, 'g', significant) : QStringLiteral("\u2014");
}

QTableWidgetItem* readOnly(const QString& text) {
  auto* item = new QTableWidgetItem(text);
  item->setFlags(Qt::ItemIsSelectable | Qt::ItemIsEnabled);
  return item;
}

QTableWidget* makeTable(const QStringList& headers, QWidget* parent) {
  auto* table = new QTableWidget(0, static_cast<int>(headers.size()), parent);
  table->setHorizontalHeaderLabels(headers);
  table->verticalHeader()->setVisible(false);
  table->verticalHeader()->setDefaultSectionSize(22);
  table->setSelectionBehavior(QAbstractItemView::SelectRows);
  table->setAlternatingRowColors(true);
  table->horizontalHeader()->setStretchLastSection(true);
  return table;
}

/// The fitted peak of (measurement, peak) in an outcome, or null.
const FittedPeak* fittedPeak(const FitOutcomePtr& outcome, int measurement, int peak) {
  if (!outcome) return nullptr;
  for (const FittedPeak& p : outcome->result.peaks)
    if (p.measurement == measurement && p.peak == peak) return &p;
  return nullptr;
}

/// The strongest correlation between two determined free parameters, as text ("" when none).
QString strongestCorrelation(const FitResult& r) {
  std::vector<const FittedParameter*> free;
  for (const auto& p : r.parameters)
    if (p.free) free.push_back(&p);
  double best = 0;
  QString text;
  for (Eigen::Index a = 0; a < r.correlation.rows(); ++a)
    for (Eigen::Index b = a + 1; b < r.correlation.cols(); ++b) {
      const double c = r.correlation(a, b);
      if (!std::isfinite(c) || std::abs(c) <= std::abs(best)) continue;
      best = c;
      text = QStringLiteral("%1 / %2: %3")
                 .arg(QString::fromStdString(free[static_cast<std::size_t>(a)]->name),
                      QString::fromStdString(free[static_cast<std::size_t>(b)]->name))
                 .arg(c, 0, 'f', 3);
    }
  return text;
}

}  // namespace

FitView::FitView(const ViewContext& viewContext, QWidget* parent)
    : ResultView(viewContext, parent), runner_(new JobRunner(tr("fit"), viewContext.jobs, this)) {
  startsBox_ = new QSpinBox(this);
  startsBox_->setRange(static_cast<int>(quantity("fit.starts").minimum), static_cast<int>(quantity("fit.starts").maximum));
  startsBox_->setToolTip(tr("Starting points of the fit: the first is the project as it is, the others are scattered\n"
                            "(strain signs flipped) to escape the symmetric look-alike solutions. Saved in the project."));
  fitButton_ = new QPushButton(tr("Fit"), this);
  fitButton_->setToolTip(tr("Alternate assignment and least squares over the free parameters until the assignment is stable"));
  assignButton_ = new QPushButton(tr("Assign only"), this);
  assignButton_->setToolTip(tr("Match peaks to lines with the current parameters, without fitting"));
  cancelButton_ = new QPushButton(tr("Cancel"), this);
  cancelButton_->setEnabled(false);
  applyButton_ = new QPushButton(tr("Apply to project"), this);
  applyButton_->setToolTip(tr("Write the fitted centre parameters, strain and ZPL shift into the project (one undo step).\n"
                              "The magnet calibration (field scale, tilt) is reported only."));
  applyButton_->setEnabled(false);
  progress_ = new QProgressBar(this);
  progress_->setRange(0, 100);
  progress_->setValue(0);
  progress_->setTextVisible(false);
  progress_->setMaximumHeight(12);
  status_ = new QLabel(this);
  status_->setWordWrap(true);
  status_->setTextInteractionFlags(Qt::TextSelectableByMouse);
  undetermined_ = new QLabel(this);
  undetermined_->setWordWrap(true);
  undetermined_->setTextInteractionFlags(Qt::TextSelectableByMouse);

  parameterTable_ = makeTable({tr("Free"), tr("Parameter"), tr("Unit"), tr("Start"), tr("Fitted"), tr("Std. error")}, this);
  parameterTable_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
  parameterTable_->horizontalHeader()->setStretchLastSection(true);
  parameterTable_->setToolTip(tr("Tick a parameter to let the fit vary it (saved in the project's fit.free)"));
  peakTable_ = makeTable({tr("Set"), tr("Peak"), tr("Position"), tr("\u03c3"), tr("Line"), tr("Class"), tr("Upper\u2192lower"),
                          tr("Residual (GHz)"), tr("Pull")},
                         this);
  peakTable_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
  peakTable_->horizontalHeader()->setSectionResizeMode(kSet, QHeaderView::Interactive);
  peakTable_->setColumnWidth(kSet, 130);
  peakTable_->setTextElideMode(Qt::ElideRight);
  peakTable_->horizontalHeader()->setStretchLastSection(true);
  residualKind_ = new QComboBox(this);
  residualKind_->addItems({tr("pull (residual / \u03c3)"), tr("residual (GHz)")});
  plot_ = new QCustomPlot(this);
  stylePlot(*plot_);
  plot_->legend->setVisible(true);
  // The legend sits in a row above the axes, where it cannot hide a residual.
  plot_->plotLayout()->insertRow(0);
  plot_->plotLayout()->addElement(0, 0, plot_->legend);
  plot_->legend->setFillOrder(QCPLayoutGrid::foColumnsFirst);
  plot_->plotLayout()->setRowStretchFactor(0, 0.001);

  auto* startsRow = new QHBoxLayout;
  startsRow->addWidget(new QLabel(tr("Starts"), this));
  startsRow->addWidget(startsBox_);
  startsRow->addStretch(1);
  auto* buttons = new QHBoxLayout;
  buttons->addWidget(fitButton_);
  buttons->addWidget(assignButton_);
  buttons->addWidget(cancelButton_);
  auto* controls = new QVBoxLayout;
  controls->setContentsMargins(0, 0, 0, 0);
  controls->addLayout(startsRow);
  controls->addLayout(buttons);
  controls->addWidget(progress_);
  controls->addWidget(status_);
  controls->addWidget(undetermined_);
  controls->addWidget(parameterTable_, 1);
  controls->addWidget(applyButton_);
  auto* left = new QWidget(this);
  left->setLayout(controls);

  auto* plotBox = new QWidget(this);
  auto* plotLayout = new QVBoxLayout(plotBox);
  plotLayout->setContentsMargins(0, 0, 0, 0);
  auto* plotBar = new QHBoxLayout;
  plotBar->addWidget(new QLabel(tr("Plot"), this));
  plotBar->addWidget(residualKind_);
  plotBar->addStretch(1);
  plotLayout->addLayout(plotBar);
  plotLayout->addWidget(plot_, 1);
  auto* tables = new QSplitter(Qt::Horizontal, this);
  tables->addWidget(left);
  tables->addWidget(peakTable_);
  tables->setStretchFactor(0, 1);
  tables->setStretchFactor(1, 1);
  auto* split = new QSplitter(Qt::Vertical, this);
  split->addWidget(tables);
  split->addWidget(plotBox);
  split->setStretchFactor(0, 3);
  split->setStretchFactor(1, 2);
  split->setSizes({600, 400});
  plot_->setMinimumHeight(220);
  auto* layout = new QHBoxLayout(this);
  layout->setContentsMargins(4, 4, 4, 4);
  layout->addWidget(split);

  connect(fitButton_, &QPushButton::clicked, this, &FitView::runFit);
  connect(assignButton_, &QPushButton::clicked, this, &FitView::runAssignOnly);
  connect(cancelButton_, &QPushButton::clicked, this, &FitView::cancelFit);
  connect(applyButton_, &QPushButton::clicked, this, &FitView::applyToProject);
  connect(residualKind_, &QComboBox::currentIndexChanged, this, &FitView::redrawResiduals);
  connect(parameterTable_, &QTableWidget::itemChanged, this, &FitView::onParameterItemChanged);
  connect(startsBox_, &QSpinBox::valueChanged, this, [this](int starts) {
    if (!context().document || context().document->project().fit.starts == starts) return;
    context().document->edit(tr("Number of fit starts"), [starts](Project& p) { p.fit.starts = starts; });
  });
  connect(runner_, &JobRunner::progress, this, [this](double f) {
    progress_->setRange(0, 100);
    progress_->setValue(static_cast<int>(100 * f));
  });
  connect(runner_, &JobRunner::cancelled, this, [this] {
    message_ = tr("Fit cancelled; the previous result is kept.");
    refreshStatus();
  });
  connect(runner_, &JobRunner::failed, this, [this](quint64, const QString& message) {
    message_ = message;
    refreshStatus();
  });
  connect(runner_, &JobRunner::busyChanged, this, &FitView::setRunning);
  if (viewContext.document) connect(viewContext.document, &ProjectDocument::changed, this, &FitView::onDocumentChanged);
  refreshAll();
}

const Project* FitView::project() const {
  if (context().document) return &context().document->project();
  return result_ ? &result_->project : nullptr;
}

int FitView::parameterRow(const QString& name) const {
  for (int row = 0; row < parameterTable_->rowCount(); ++row)
    if (parameterTable_->item(row, kName)->text() == name) return row;
  return -1;
}

void FitView::showResult(const ResultPtr& result) {
  result_ = result;
  // A plain assignment follows the model; a fit result stays until the next fit or a change of peaks.
  if ((!outcome_ || outcome_->assignOnly) && !runner_->busy()) {
    if (result->assignment) {
      setOutcome(std::make_shared<const FitOutcome>(FitOutcome{result->project, *result->assignment, true}));
      message_.clear();
    } else if (!result->assignmentError.isEmpty()) {
      outcome_.reset();
      message_ = result->assignmentError;
    }
  }
  refreshAll();
}

void FitView::applyDisplay(const DisplaySettings& display) {
  ResultView::applyDisplay(display);
  redrawResiduals();
}

void FitView::runFit() {
  const Project* p = project();
  if (!p) return;
  FitOptions options;
  options.starts = startsBox_->value();
  message_ = tr("Fitting %1 free parameters from %2 starts\u2026").arg(p->fit.free.size()).arg(startsBox_->value());
  progress_->setValue(0);
  startRun(options, false);
  refreshStatus();
}

void FitView::runAssignOnly() {
  const Project* p = project();
  if (!p) return;
  message_ = tr("Assigning peaks with the current parameters\u2026");
  progress_->setValue(0);
  startRun(assignOnlyOptions(), true);
  refreshStatus();
}

void FitView::cancelFit() { runner_->cancel(); }

void FitView::startRun(FitOptions options, bool assignOnly) {
  const Project* p = project();
  if (!p) return;
  runner_->start([this, snapshot = *p, options, assignOnly](const ProgressControl& control) mutable -> JobDelivery {
    options.progress = control;  // the job's cancel flag and progress report
    FitOutcomePtr outcome = runFitNow(snapshot, options, assignOnly);
    return [this, outcome] { onFitFinished(outcome); };
  });
}

void FitView::applyToProject() {
  if (!outcome_ || outcome_->assignOnly || !context().document) return;
  const FitResult result = outcome_->result;
  context().document->edit(tr("Apply fit results"), [&result](Project& p) { p = applyFitToProject(p, result); });
}

void FitView::onFitFinished(const FitOutcomePtr& outcome) {
  message_.clear();
  progress_->setValue(100);
  setOutcome(outcome);
  refreshAll();
}

void FitView::setOutcome(FitOutcomePtr outcome) {
  outcome_ = std::move(outcome);
  if (context().document && outcome_) context().document->setFitLabels(labelsOfFit(outcome_->result));
}

void FitView::onDocumentChanged(Changes what) {
  if (what & Change::Measurements) outcome_.reset();  // indices of the old result no longer match
  if (what & ~Changes(Change::File | Change::MeasuredSpectrum)) refreshAll();
}

void FitView::onParameterItemChanged(QTableWidgetItem* item) {
  if (item->column() != kFree || !context().document) return;
  const std::string name = parameterTable_->item(item->row(), kName)->text().toStdString();
  const bool free = item->checkState() == Qt::Checked;
  const QString text = (free ? tr("Free fit parameter %1") : tr("Fix fit parameter %1")).arg(QString::fromStdString(name));
  // Deferred: the edit refreshes this table, which must not happen inside its own signal.
  QMetaObject::invokeMethod(this, [this, name, free, text] {
    context().document->edit(text, [&](Project& p) {
      auto& list = p.fit.free;
      const auto at = std::find(list.begin(), list.end(), name);
      if (free && at == list.end()) list.push_back(name);
      if (!free && at != list.end()) list.erase(at);
    });
    refreshParameters();
  }, Qt::QueuedConnection);
}

void FitView::setRunning(bool running) {
  fitButton_->setEnabled(!running);
  assignButton_->setEnabled(!running);
  cancelButton_->setEnabled(running);
  progress_->setRange(0, running ? 0 : 100);  // a busy indicator until the first start has finished
  refreshStatus();
}

void FitView::refreshAll() {
  refreshParameters();
  refreshPeaks();
  refreshStatus();
  redrawResiduals();
}

void FitView::refreshParameters() {
  const QSignalBlocker block(parameterTable_);
  const Project* p = project();
  {
    const QSignalBlocker blockStarts(startsBox_);
    if (p) startsBox_->setValue(p->fit.starts);
  }
  std::optional<FitState> start;
  if (p) {
    try {
      start = initialFitState(*p);
      parameterTable_->setToolTip({});
    } catch (const InputError& e) {
      // The start column stays empty; the reason is shown on the table and logged.
      const QString reason = tr("No start values: %1").arg(QString::fromStdString(e.what()));
      parameterTable_->setToolTip(reason);
      spdlog::warn("{}", reason.toStdString());
    }
  }
  std::map<std::string, const FittedParameter*> fitted;
  if (outcome_ && !outcome_->assignOnly)
    for (const auto& fp : outcome_->result.parameters) fitted[fp.name] = &fp;
  const std::vector<std::string> names = allFitParameterNames();
  parameterTable_->setRowCount(static_cast<int>(names.size()));
  for (int row = 0; row < static_cast<int>(names.size()); ++row) {
    const std::string& name = names[static_cast<std::size_t>(row)];
    const FitParameterSpec spec = *findFitParameter(name);
    const bool free = p && std::find(p->fit.free.begin(), p->fit.free.end(), name) != p->fit.free.end();
    auto* box = new QTableWidgetItem;
    box->setFlags(Qt::ItemIsUserCheckable | Qt::ItemIsEnabled | Qt::ItemIsSelectable);
    box->setCheckState(free ? Qt::Checked : Qt::Unchecked);
    parameterTable_->setItem(row, kFree, box);
    parameterTable_->setItem(row, kName, readOnly(QString::fromStdString(name)));
    parameterTable_->setItem(row, kUnit, readOnly(QString::fromStdString(spec.unit)));
    parameterTable_->setItem(row, kStart, readOnly(start ? number(fitValue(*start, spec)) : QString()));
    const auto it = fitted.find(name);
    const bool inFit = it != fitted.end() && it->second->free;
    parameterTable_->setItem(row, kFitted, readOnly(inFit ? number(it->second->value, 8) : QString()));
    QString error;
    if (inFit) error = it->second->determined ? number(it->second->standardError, 3) : tr("undetermined");
    parameterTable_->setItem(row, kError, readOnly(error));
    QColor tint;
    if (inFit && !it->second->determined) tint = kUndeterminedTint;
    else if (free) tint = kFreeTint;
    if (tint.isValid())
      for (int c = 0; c < kParameterColumns; ++c) parameterTable_->item(row, c)->setBackground(tint);
  }
}

void FitView::refreshPeaks() {
  const Project* p = project();
  int rows = 0;
  if (p)
    for (const MeasurementSet& set : p->measurements) rows += static_cast<int>(set.peaks.size());
  peakTable_->setRowCount(rows);
  if (!p) return;
  int row = 0;
  for (std::size_t m = 0; m < p->measurements.size(); ++m) {
    const MeasurementSet& set = p->measurements[m];
    for (std::size_t k = 0; k < set.peaks.size(); ++k, ++row) {
      const MeasuredPeak& peak = set.peaks[k];
      const QString unit = QString::fromStdString(std::string(spectralUnitKey(peak.unit)));
      peakTable_->setItem(row, kSet, readOnly(QString::fromStdString(set.name)));
      peakTable_->setItem(row, kPeak, readOnly(QString::number(k + 1)));
      peakTable_->setItem(row, kPosition, readOnly(QString::number(peak.position, 'g', 10) + " " + unit));
      peakTable_->setItem(row, kSigma, readOnly(QString::number(peak.sigma, 'g', 3) + " " + unit));
      const FittedPeak* fp = fittedPeak(outcome_, static_cast<int>(m), static_cast<int>(k));
      const bool outlier = fp && !fp->line;
      QString line;
      if (fp && fp->line) line = peakLabelText(fp->label, fp->line->cls) + (fp->pinned ? tr(" (pinned)") : QString());
      else if (outlier) line = tr("outlier (unassigned)");
      peakTable_->setItem(row, kLine, readOnly(line));
      peakTable_->setItem(row, kClass, readOnly(fp && fp->line ? QString::number(fp->line->cls) : QString()));
      peakTable_->setItem(row, kLevels, readOnly(fp && fp->line ? QStringLiteral("%1\u2192%2").arg(fp->line->upper).arg(fp->line->lower) : QString()));
      peakTable_->setItem(row, kResidual, readOnly(fp && fp->line ? number(fp->residualGHz, 4) : QString()));
      peakTable_->setItem(row, kPull, readOnly(fp && fp->line ? QString::number(fp->residualGHz / fp->sigmaGHz, 'f', 2) : QString()));
      peakTable_->item(row, kSet)->setToolTip(QString::fromStdString(set.name));
      if (outlier) {
        for (int c = 0; c < kPeakColumns; ++c) peakTable_->item(row, c)->setBackground(kOutlierTint);
        QFont bold = peakTable_->item(row, kLine)->font();
        bold.setBold(true);
        peakTable_->item(row, kLine)->setFont(bold);
      }
    }
  }
}

void FitView::refreshStatus() {
  QStringList lines;
  if (runner_->busy()) lines << tr("<b>Running\u2026</b>");
  if (!message_.isEmpty()) lines << message_.toHtmlEscaped();
  undetermined_->clear();
  undetermined_->setStyleSheet({});
  if (outcome_) {
    const FitResult& r = outcome_->result;
    if (outcome_->assignOnly) {
      lines << tr("<b>Assignment with the current parameters</b> (no fit). A peak farther than 5\u03c3 from every "
                  "predicted line stays unassigned; press Fit to adjust the free parameters.");
    } else {
      lines << QStringLiteral("<b style='color:%1'>%2</b>")
                   .arg(r.converged ? "#1b6e20" : "#b00020", (r.converged ? tr("Converged") : tr("Not converged")));
      lines << QString::fromStdString(r.status).toHtmlEscaped();
    }
    lines << tr("\u03c7\u00b2/dof = <b>%1</b> (\u03c7\u00b2 %2, dof %3); %4 peaks assigned, %5 outliers.")
                 .arg(number(r.chi2PerDof, 4), number(r.chi2, 5))
                 .arg(r.dof)
                 .arg(r.assignedCount)
                 .arg(r.outlierCount);
    if (!outcome_->assignOnly) {
      lines << tr("Best of %1 starts: start %2; condition number %3.").arg(r.startsRun).arg(r.bestStart).arg(number(r.conditionNumber, 3));
      const QString correlation = strongestCorrelation(r);
      if (!correlation.isEmpty()) lines << tr("Strongest correlation: %1.").arg(correlation);
      if (!r.undetermined.empty()) {
        QStringList names, combinations;
        for (const auto& n : r.undetermined) names << QString::fromStdString(n);
        for (const auto& c : r.undeterminedCombinations) combinations << QString::fromStdString(c);
        undetermined_->setText(tr("The data cannot determine: %1\nFree combinations: %2").arg(names.join(", "), combinations.join("; ")));
        undetermined_->setStyleSheet("QLabel { color: #8b0000; background: #ffe3e3; border: 1px solid #d08080; padding: 4px; font-weight: bold; }");
      } else if (!r.parameters.empty() && r.parameters.front().free) {
        undetermined_->setText(tr("Every free parameter is determined by the data."));
        undetermined_->setStyleSheet("QLabel { color: #1b6e20; }");
      }
    }
  } else if (message_.isEmpty()) {
    const Project* p = project();
    lines << (p && p->measurements.empty() ? tr("The project has no measured peaks: import a peak list first.")
                                           : tr("Press Fit to fit the free parameters to the measured peaks."));
  }
  status_->setText(lines.join("<br>"));
  applyButton_->setEnabled(outcome_ && !outcome_->assignOnly && context().document && !runner_->busy());
}

void FitView::redrawResiduals() {
  plot_->clearPlottables();
  plot_->clearItems();
  const bool pull = residualKind_->currentIndex() == 0;
  plot_->yAxis->setLabel(pull ? tr("pull (predicted \u2212 measured) / \u03c3") : tr("predicted \u2212 measured (GHz)"));
  plot_->xAxis->setLabel(tr("measured peak, grouped by measurement set"));
  const Project* p = project();
  if (!outcome_ || !p) {
    plot_->replot();
    return;
  }
  std::array<QCPGraph*, 4> byClass{};
  QVector<double> outlierX, outlierY;
  std::array<QVector<double>, 4> errors;
  QSharedPointer<QCPAxisTickerText> ticker(new QCPAxisTickerText);
  double x = 0, lastX = 0, setStart = 0;
  int currentSet = -1;
  auto closeSet = [&](bool last) {
    if (currentSet < 0) return;
    // One line per comma-separated part, so long set names stay readable without rotation.
    QString name = QString::fromStdString(p->measurements[static_cast<std::size_t>(currentSet)].name);
    ticker->addTick(0.5 * (setStart + lastX), name.replace(QStringLiteral(", "), QStringLiteral("\n")));
    if (last) return;
    auto* separator = new QCPItemStraightLine(plot_);
    separator->point1->setCoords(lastX + 1, 0);
    separator->point2->setCoords(lastX + 1, 1);
    separator->setPen(QPen(QColor(170, 170, 170), 1, Qt::DotLine));
  };
  std::array<bool, 4> present{};  // one graph per class present, made in class order for the legend
  for (const FittedPeak& fp : outcome_->result.peaks)
    if (fp.line) present[static_cast<std::size_t>(fp.line->cls % 4)] = true;
  for (int cls = 0; cls < 4; ++cls) {
    if (!present[static_cast<std::size_t>(cls)]) continue;
    QCPGraph*& g = byClass[static_cast<std::size_t>(cls)];
    g = plot_->addGraph();
    g->setLineStyle(QCPGraph::lsNone);
    g->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssDisc, palette().color(cls), palette().color(cls), 7));
    g->setName(className(cls));
  }
  for (const FittedPeak& fp : outcome_->result.peaks) {
    if (fp.measurement != currentSet) {
      if (currentSet >= 0) {
        closeSet(false);
        x += 1;  // a gap between sets
      }
      currentSet = fp.measurement;
      setStart = x + 1;
    }
    x += 1;
    lastX = x;
    if (!fp.line) {
      outlierX << x;
      outlierY << 0;
      continue;
    }
    const int cls = fp.line->cls;
    QCPGraph* g = byClass[static_cast<std::size_t>(cls % 4)];
    g->addData(x, pull ? fp.residualGHz / fp.sigmaGHz : fp.residualGHz);
    errors[static_cast<std::size_t>(cls % 4)] << (pull ? 1.0 : fp.sigmaGHz);
  }
  closeSet(true);
  for (std::size_t c = 0; c < byClass.size(); ++c) {
    if (!byClass[c]) continue;
    auto* bars = new QCPErrorBars(plot_->xAxis, plot_->yAxis);
    bars->setDataPlottable(byClass[c]);
    bars->setData(errors[c]);
    bars->setPen(QPen(palette().color(static_cast<int>(c)), 1));
    bars->removeFromLegend();
  }
  if (!outlierX.isEmpty()) {
    QCPGraph* g = plot_->addGraph();
    g->setLineStyle(QCPGraph::lsNone);
    g->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssCross, QPen(QColor(200, 80, 0), 2), Qt::NoBrush, 11));
    g->setData(outlierX, outlierY);
    g->setName(tr("outlier (unassigned), drawn at 0"));
  }
  plot_->xAxis->setTicker(ticker);
  plot_->xAxis->setSubTicks(false);
  plot_->rescaleAxes();
  plot_->xAxis->setRange(0, x + 1);
  QCPRange y = plot_->yAxis->range();
  const double band = pull ? 3.0 : 0;
  y.lower = std::min(y.lower, -band);
  y.upper = std::max(y.upper, band);
  const double pad = 0.08 * std::max(y.size(), 1e-9);
  plot_->yAxis->setRange(y.lower - pad, y.upper + pad);
  auto* zero = new QCPItemStraightLine(plot_);
  zero->point1->setCoords(0, 0);
  zero->point2->setCoords(1, 0);
  zero->setPen(QPen(QColor(90, 90, 90), 1));
  if (pull)
    for (double level : {-3.0, 3.0}) {
      auto* line = new QCPItemStraightLine(plot_);
      line->point1->setCoords(0, level);
      line->point2->setCoords(1, level);
      line->setPen(QPen(QColor(150, 150, 150), 1, Qt::DashLine));
    }
  plot_->replot();
}

Table FitView::dataTable() const {
  if (!outcome_) return {};
  return fitAssignmentTable(outcome_->project, outcome_->result);
}

}  // namespace finestra::ui
