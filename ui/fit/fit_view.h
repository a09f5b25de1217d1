#pragma once
// "Assignment and fit" tab: the measured peaks with the line each one is matched to (outliers
// marked), a residual plot grouped by measurement set, and a table of every fittable parameter
// with a free/fixed box (the project's fit.free, edited through the document), its start value and
// the fitted value with its standard error. "Fit" runs core's fitProject on a snapshot as a job of
// the view's JobRunner (progress, cancel); "Assign only" matches peaks to lines with the current
// parameters; "Apply to project" writes the fitted values as one undoable step. Whenever the shown
// result is a plain assignment (or there is none yet) it follows the model: the view asks for
// Part::Assignment, which the model worker computes with every result.
#include <QString>

#include "ui/document.h"
#include "ui/fit/fit_runner.h"
#include "ui/jobs/job_runner.h"
#include "ui/result_view.h"

class QComboBox;
class QLabel;
class QProgressBar;
class QPushButton;
class QSpinBox;
class QTableWidget;
class QTableWidgetItem;

namespace finestra::ui {

class FitView : public ResultView {
  Q_OBJECT
public:
  explicit FitView(const ViewContext& context, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  void applyDisplay(const DisplaySettings& display) override;
  QCustomPlot* figure() override { return plot_; }
  Table dataTable() const override;

  /// The button actions (public for tests and shortcuts).
  void runFit();
  void runAssignOnly();
  void cancelFit();
  void applyToProject();

  JobRunner& runner() { return *runner_; }
  FitOutcomePtr lastOutcome() const { return outcome_; }
  QTableWidget* peakTable() const { return peakTable_; }
  QTableWidget* parameterTable() const { return parameterTable_; }
  /// Row of a parameter in the parameter table, -1 when absent.
  int parameterRow(const QString& name) const;

  static constexpr int kFreeColumn = 0;

private:
  const Project* project() const;
  void onDocumentChanged(Changes what);
  void onParameterItemChanged(QTableWidgetItem* item);
  void startRun(FitOptions options, bool assignOnly);
  void onFitFinished(const FitOutcomePtr& outcome);
  void setOutcome(FitOutcomePtr outcome);
  void refreshAll();
  void refreshParameters();
  void refreshPeaks();
  void refreshStatus();
  void redrawResiduals();
  void setRunning(bool running);

  JobRunner* runner_ = nullptr;
  QSpinBox* startsBox_ = nullptr;
  QPushButton* fitButton_ = nullptr;
  QPushButton* assignButton_ = nullptr;
  QPushButton* cancelButton_ = nullptr;
  QPushButton* applyButton_ = nullptr;
  QProgressBar* progress_ = nullptr;
  QLabel* status_ = nullptr;
  QLabel* undetermined_ = nullptr;
  QTableWidget* parameterTable_ = nullptr;
  QTableWidget* peakTable_ = nullptr;
  QComboBox* residualKind_ = nullptr;
  QCustomPlot* plot_ = nullptr;

  ResultPtr result_;
  FitOutcomePtr outcome_;
  QString message_;  ///< last error or cancel notice, shown in the status line
};

}  // namespace finestra::ui
