#pragma once
// Magnet planner tab: a map of one figure of merit of one class over every field direction
// (polar–azimuth, or the equal-area cylindrical projection x = azimuth, y = cos polar), the region
// where the figure lies in a wanted range outlined, and the figure along |B| for the project's
// field direction. The map is computed by core (computeFigureMap) as a job of the view's JobRunner
// (progress, cancel, a newer map supersedes an older one); a click on the map moves the project's field there through the document (undoable).
#include <memory>
#include <optional>

#include "core/planner/planner.h"
#include "ui/jobs/job_runner.h"
#include "ui/result_view.h"

class QComboBox;
class QDoubleSpinBox;
class QLabel;
class QLineEdit;
class QProgressBar;
class QPushButton;
class QSpinBox;
class QCPColorMap;
class QCPGraph;

namespace finestra::ui {

/// What the worker hands back: the map and the profile for one snapshot of the model.
struct PlannerMaps {
  FigureMap map;
  std::vector<ProfilePoint> profile;
  PlannerSettings settings;
};

class PlannerView : public ResultView {
  Q_OBJECT
public:
  explicit PlannerView(const ViewContext& context, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  QCustomPlot* figure() override { return mapPlot_; }
  Table dataTable() const override;
  JobRunner& runner() { return *runner_; }
  JobRunner* ownJobs() override { return runner_; }

protected:
  void showEvent(QShowEvent* event) override;

private:
  /// The project's field with the magnet calibration applied (lab frame, T).
  Vec3 trueFieldLab() const;
  void startMap();
  void cancelMap();
  void onMapReady(std::shared_ptr<const PlannerMaps> maps);
  void redraw();
  void onMapClick(QMouseEvent* event);
  bool equalArea() const;
  std::optional<std::array<double, 2>> wantedRange() const;

  QComboBox* figureBox_ = nullptr;
  QSpinBox* classBox_ = nullptr;
  QComboBox* projectionBox_ = nullptr;
  QDoubleSpinBox* stepBox_ = nullptr;
  QDoubleSpinBox* magnitudeBox_ = nullptr;
  QComboBox* driveBox_ = nullptr;
  QLineEdit* minEdit_ = nullptr;
  QLineEdit* maxEdit_ = nullptr;
  QPushButton* computeButton_ = nullptr;
  QPushButton* cancelButton_ = nullptr;
  QProgressBar* progress_ = nullptr;
  QLabel* status_ = nullptr;
  QCustomPlot* mapPlot_ = nullptr;
  QCustomPlot* profilePlot_ = nullptr;
  QCPColorMap* colorMap_ = nullptr;
  QCPGraph* outline_ = nullptr;
  QCPGraph* current_ = nullptr;

  ResultPtr result_;
  std::shared_ptr<const PlannerMaps> maps_;
  JobRunner* runner_ = nullptr;
};

}  // namespace finestra::ui
