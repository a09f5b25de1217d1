#include "ui/planner/planner_view.h"

#include <QComboBox>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QProgressBar>
#include <QPushButton>
#include <QSpinBox>
#include <QSplitter>
#include <QThread>
#include <QVBoxLayout>
#include <cmath>
#include <numbers>

#include "core/planner/plan_report.h"
#include "core/project/field_semantics.h"
#include "ui/document.h"
#include "ui/views/plot_helpers.h"

namespace finestra::ui {
namespace {

constexpr double kDeg = std::numbers::pi / 180.0;

// Cyclicity spans many decades (up to the "forbidden flip" cap): shown on a log colour scale.
bool logarithmic(FigureId id) { return id == FigureId::Cyclicity; }

Vec3 driveChoice(int index) {
  switch (index) {
    case 1: return Vec3(0, 1, 0);
    case 2: return Vec3(0, 0, 1);
    default: return Vec3(1, 0, 0);
  }
}

}  // namespace

PlannerView::PlannerView(const ViewContext& context, QWidget* parent) : ResultView(context, parent) {
  figureBox_ = new QComboBox(this);
  for (const FigureInfo& info : figureTable()) {
    figureBox_->addItem(QString::fromUtf8(info.key.data(), static_cast<qsizetype>(info.key.size())));
    figureBox_->setItemData(figureBox_->count() - 1,
                            QString::fromUtf8(info.meaning.data(), static_cast<qsizetype>(info.meaning.size())),
                            Qt::ToolTipRole);
  }
  figureBox_->setCurrentIndex(static_cast<int>(FigureId::Cyclicity));
  classBox_ = new QSpinBox(this);
  classBox_->setRange(0, 3);
  classBox_->setToolTip(tr("Orientation class whose figure is mapped"));
  projectionBox_ = new QComboBox(this);
  projectionBox_->addItems({tr("polar / azimuth"), tr("equal area (cos polar)")});
  stepBox_ = new QDoubleSpinBox(this);
  stepBox_->setRange(0.25, 15);
  stepBox_->setValue(1.0);
  stepBox_->setSuffix(QStringLiteral(" °"));
  magnitudeBox_ = new QDoubleSpinBox(this);
  magnitudeBox_->setRange(0.001, 30);
  magnitudeBox_->setDecimals(3);
  magnitudeBox_->setValue(0.5);
  magnitudeBox_->setSuffix(QStringLiteral(" T"));
  driveBox_ = new QComboBox(this);
  driveBox_->addItems({tr("lab x"), tr("lab y"), tr("lab z")});
  driveBox_->setToolTip(tr("Direction of the microwave field"));
  minEdit_ = new QLineEdit(this);
  maxEdit_ = new QLineEdit(this);
  minEdit_->setPlaceholderText(tr("min (open)"));
  maxEdit_->setPlaceholderText(tr("max (open)"));
  computeButton_ = new QPushButton(tr("Compute map"), this);
  cancelButton_ = new QPushButton(tr("Cancel"), this);
  cancelButton_->setEnabled(false);
  progress_ = new QProgressBar(this);
  progress_->setRange(0, 100);
  status_ = new QLabel(tr("Choose a figure and compute the map. Click the map to move the field there."), this);
  status_->setWordWrap(true);

  auto* form = new QFormLayout;
  form->addRow(tr("Figure"), figureBox_);
  form->addRow(tr("Class"), classBox_);
  form->addRow(tr("Projection"), projectionBox_);
  form->addRow(tr("Grid step"), stepBox_);
  form->addRow(tr("|B|"), magnitudeBox_);
  form->addRow(tr("Drive"), driveBox_);
  auto* range = new QHBoxLayout;
  range->addWidget(minEdit_);
  range->addWidget(maxEdit_);
  form->addRow(tr("Wanted range"), range);
  auto* buttons = new QHBoxLayout;
  buttons->addWidget(computeButton_);
  buttons->addWidget(cancelButton_);
  form->addRow(buttons);
  form->addRow(progress_);
  form->addRow(status_);
  auto* controls = new QWidget(this);
  controls->setLayout(form);
  controls->setMaximumWidth(320);

  mapPlot_ = new QCustomPlot(this);
  profilePlot_ = new QCustomPlot(this);
  stylePlot(*mapPlot_);
  stylePlot(*profilePlot_);
  mapPlot_->setInteractions({});
  colorMap_ = new QCPColorMap(mapPlot_->xAxis, mapPlot_->yAxis);
  auto* scale = new QCPColorScale(mapPlot_);
  mapPlot_->plotLayout()->addElement(0, 1, scale);
  colorMap_->setColorScale(scale);
  QCPColorGradient gradient;  // dark blue → teal → pale yellow: monotonic in lightness
  gradient.setColorStops({{0.0, QColor(24, 28, 72)}, {0.5, QColor(32, 140, 140)}, {1.0, QColor(246, 232, 150)}});
  gradient.setNanHandling(QCPColorGradient::nhTransparent);
  colorMap_->setGradient(gradient);
  outline_ = mapPlot_->addGraph();
  outline_->setLineStyle(QCPGraph::lsNone);
  outline_->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssDisc, Qt::white, 3));
  outline_->setName(tr("edge of the wanted range"));
  current_ = mapPlot_->addGraph();
  current_->setLineStyle(QCPGraph::lsNone);
  current_->setScatterStyle(QCPScatterStyle(QCPScatterStyle::ssCrossCircle, Qt::red, 12));
  current_->setName(tr("project field"));
  mapPlot_->xAxis->setLabel(tr("azimuth from lab x (deg)"));
  profilePlot_->xAxis->setLabel(tr("|B| (T) along the project's field direction"));

  auto* plots = new QSplitter(Qt::Vertical, this);
  plots->addWidget(mapPlot_);
  plots->addWidget(profilePlot_);
  plots->setStretchFactor(0, 3);
  plots->setStretchFactor(1, 1);
  auto* layout = new QHBoxLayout(this);
  layout->setContentsMargins(4, 4, 4, 4);
  layout->addWidget(controls);
  layout->addWidget(plots, 1);

  connect(computeButton_, &QPushButton::clicked, this, &PlannerView::startMap);
  connect(cancelButton_, &QPushButton::clicked, this, &PlannerView::cancelMap);
  connect(mapPlot_, &QCustomPlot::mousePress, this, &PlannerView::onMapClick);
  for (QComboBox* box : {figureBox_, projectionBox_})
    connect(box, &QComboBox::currentIndexChanged, this, &PlannerView::redraw);
  connect(classBox_, &QSpinBox::valueChanged, this, &PlannerView::redraw);
  connect(minEdit_, &QLineEdit::editingFinished, this, &PlannerView::redraw);
  connect(maxEdit_, &QLineEdit::editingFinished, this, &PlannerView::redraw);
}

PlannerView::~PlannerView() {
  // The worker posts to this object: stop it and wait before the object goes away.
  if (cancel_) cancel_->store(true);
  if (worker_) worker_->wait();
}

void PlannerView::showResult(const ResultPtr& result) {
  const bool first = !result_;
  result_ = result;
  if (first && result_ && result_->model) {
    const double b = trueFieldLab().norm();
    if (b > 0) magnitudeBox_->setValue(b);
  }
  redraw();
  if (first && isVisible()) startMap();
}

void PlannerView::showEvent(QShowEvent* event) {
  ResultView::showEvent(event);
  if (!maps_ && !worker_ && result_ && result_->model) startMap();  // a first map without a click
}

Vec3 PlannerView::trueFieldLab() const {
  const Project& p = result_->project;
  return finestra::trueFieldLab(p, p.field, result_->model->setup().lab);
}

void PlannerView::startMap() {
  if (!result_ || !result_->model) {
    status_->setText(result_ ? result_->error : tr("No model yet."));
    return;
  }
  cancelMap();
  if (worker_) worker_->wait();
  PlannerSettings settings;
  settings.classes = result_->project.classes;
  if (std::find(settings.classes.begin(), settings.classes.end(), classBox_->value()) == settings.classes.end())
    settings.classes.push_back(classBox_->value());
  settings.magnitudeT = magnitudeBox_->value();
  settings.driveLab = driveChoice(driveBox_->currentIndex());
  SphereGrid grid;
  grid.polarCount = static_cast<int>(std::lround(180.0 / stepBox_->value())) + 1;
  grid.azimuthCount = static_cast<int>(std::lround(360.0 / stepBox_->value())) + 1;
  Vec3 profileDirection = trueFieldLab();
  if (profileDirection.norm() == 0) profileDirection = Vec3::UnitZ();
  const double profileMax = std::max(2.0 * settings.magnitudeT, 1.0);

  cancel_ = std::make_shared<std::atomic<bool>>(false);
  const quint64 generation = ++generation_;
  const std::shared_ptr<const CentreModel> model = result_->model;
  const std::shared_ptr<std::atomic<bool>> cancel = cancel_;
  worker_ = QThread::create([this, model, settings, grid, profileDirection, profileMax, cancel, generation] {
    ProgressControl control;
    control.cancel = cancel.get();
    control.report = [this, generation](double fraction) {
      QMetaObject::invokeMethod(this, [this, generation, fraction] {
        if (generation == generation_) progress_->setValue(static_cast<int>(100 * fraction));
      }, Qt::QueuedConnection);
    };
    try {
      auto maps = std::make_shared<PlannerMaps>();
      maps->settings = settings;
      maps->map = computeFigureMap(*model, settings, grid, control);
      maps->profile = magnitudeProfile(*model, settings, profileDirection, profileMax, 121);
      QMetaObject::invokeMethod(this, [this, generation, maps] {
        if (generation == generation_) onMapReady(maps);
      }, Qt::QueuedConnection);
    } catch (const Cancelled&) {
      QMetaObject::invokeMethod(this, [this, generation] {
        if (generation == generation_) status_->setText(tr("Map cancelled."));
      }, Qt::QueuedConnection);
    } catch (const std::exception& e) {
      const QString message = QString::fromStdString(e.what());
      QMetaObject::invokeMethod(this, [this, generation, message] {
        if (generation == generation_) status_->setText(message);
      }, Qt::QueuedConnection);
    }
  });
  connect(worker_, &QThread::finished, worker_, &QObject::deleteLater);
  connect(worker_, &QThread::finished, this, [this] {
    computeButton_->setEnabled(true);
    cancelButton_->setEnabled(false);
  });
  computeButton_->setEnabled(false);
  cancelButton_->setEnabled(true);
  progress_->setValue(0);
  status_->setText(tr("Computing %1 × %2 directions…").arg(grid.polarCount).arg(grid.azimuthCount));
  worker_->start();
}

void PlannerView::cancelMap() {
  if (cancel_) cancel_->store(true);
}

void PlannerView::onMapReady(std::shared_ptr<const PlannerMaps> maps) {
  maps_ = std::move(maps);
  progress_->setValue(100);
  status_->setText(tr("Map at |B| = %1 T. Click a direction to move the project's field there (undoable).")
                       .arg(maps_->map.magnitudeT));
  redraw();
}

bool PlannerView::equalArea() const { return projectionBox_->currentIndex() == 1; }

std::optional<std::array<double, 2>> PlannerView::wantedRange() const {
  bool okMin = false, okMax = false;
  const double lo = minEdit_->text().toDouble(&okMin), hi = maxEdit_->text().toDouble(&okMax);
  if (!okMin && !okMax) return std::nullopt;
  return std::array<double, 2>{okMin ? lo : -HUGE_VAL, okMax ? hi : HUGE_VAL};
}

void PlannerView::redraw() {
  const auto id = static_cast<FigureId>(figureBox_->currentIndex());
  const int cls = classBox_->value();
  mapPlot_->yAxis->setLabel(equalArea() ? tr("cos(polar)") : tr("polar from lab z (deg)"));
  mapPlot_->yAxis->setRangeReversed(!equalArea());
  outline_->data()->clear();
  current_->data()->clear();
  profilePlot_->clearGraphs();
  if (result_ && result_->model) {
    const Vec3 b = trueFieldLab();
    if (b.norm() > 0) {
      const auto angles = anglesOfDirection(b);
      current_->addData(angles[1], equalArea() ? std::cos(angles[0] * kDeg) : angles[0]);
    }
  }
  if (!maps_ || std::find(maps_->settings.classes.begin(), maps_->settings.classes.end(), cls) ==
                    maps_->settings.classes.end()) {
    colorMap_->data()->clear();
    mapPlot_->xAxis->setRange(0, 360);
    mapPlot_->yAxis->setRange(equalArea() ? QCPRange(-1, 1) : QCPRange(0, 180));
    mapPlot_->replot();
    profilePlot_->replot();
    return;
  }
  const FigureMap& map = maps_->map;
  const int nx = map.grid.azimuthCount, ny = map.grid.polarCount;
  // Display-only resampling: row k of the equal-area picture shows the polar row nearest acos(y).
  auto rowFor = [&](int k) {
    if (!equalArea()) return k;
    const double y = -1.0 + 2.0 * k / (ny - 1);
    return static_cast<int>(std::lround(std::acos(std::clamp(y, -1.0, 1.0)) / kDeg / 180.0 * (ny - 1)));
  };
  auto valueAt = [&](int row, int j) { return figureValue(map.at(row, j, cls), id); };
  colorMap_->data()->setSize(nx, ny);
  colorMap_->data()->setRange(QCPRange(0, 360), equalArea() ? QCPRange(-1, 1) : QCPRange(0, 180));
  const auto range = wantedRange();
  auto inside = [&](double v) { return range && v >= (*range)[0] && v <= (*range)[1]; };
  for (int k = 0; k < ny; ++k) {
    const int row = rowFor(k);
    for (int j = 0; j < nx; ++j) {
      const double v = valueAt(row, j);
      colorMap_->data()->setCell(j, k, logarithmic(id) && v > 0 ? v : (logarithmic(id) ? std::nan("") : v));
      if (!range || !inside(v)) continue;
      const bool edge = j == 0 || j == nx - 1 || k == 0 || k == ny - 1 || !inside(valueAt(row, j - 1)) ||
                        !inside(valueAt(row, j + 1)) || !inside(valueAt(rowFor(k - 1), j)) ||
                        !inside(valueAt(rowFor(k + 1), j));
      if (edge) {
        double x = 0, y = 0;
        colorMap_->data()->cellToCoord(j, k, &x, &y);
        outline_->addData(x, y);
      }
    }
  }
  colorMap_->colorScale()->setDataScaleType(logarithmic(id) ? QCPAxis::stLogarithmic : QCPAxis::stLinear);
  colorMap_->colorScale()->axis()->setLabel(figureBox_->currentText() + tr(" — class %1").arg(cls));
  colorMap_->rescaleDataRange(true);
  mapPlot_->xAxis->setRange(0, 360);
  mapPlot_->yAxis->setRange(equalArea() ? QCPRange(-1, 1) : QCPRange(0, 180));
  mapPlot_->replot();

  QVector<double> x, y;
  for (const ProfilePoint& p : maps_->profile) {
    x.push_back(p.magnitudeT);
    y.push_back(figureValue(p.figures[static_cast<std::size_t>(cls)], id));
  }
  QCPGraph* g = profilePlot_->addGraph();
  g->setData(x, y);
  g->setPen(QPen(palette().color(cls), 2));
  profilePlot_->yAxis->setScaleType(logarithmic(id) ? QCPAxis::stLogarithmic : QCPAxis::stLinear);
  profilePlot_->yAxis->setLabel(figureBox_->currentText());
  profilePlot_->rescaleAxes();
  profilePlot_->replot();
}

void PlannerView::onMapClick(QMouseEvent* event) {
  if (event->button() != Qt::LeftButton || !context().document) return;
  const double azimuth = mapPlot_->xAxis->pixelToCoord(event->position().x());
  const double y = mapPlot_->yAxis->pixelToCoord(event->position().y());
  if (azimuth < 0 || azimuth > 360) return;
  double polar = y;
  if (equalArea()) {
    if (y < -1 || y > 1) return;
    polar = std::acos(y) / kDeg;
  } else if (y < 0 || y > 180) {
    return;
  }
  // The map shows true field directions; the project stores the magnet setting that gives them.
  const FieldSetting setting = magnetSettingForTrueField(context().document->project(),
                                                         magnitudeBox_->value() * directionFromAngles(polar, azimuth));
  context().document->edit(tr("Field direction from the planner map"), Change::Field,
                           [&](Project& p) { p.field = setting; });
}

Table PlannerView::dataTable() const {
  if (!maps_) return {};
  return mapTable(maps_->settings, maps_->map);
}

}  // namespace finestra::ui
