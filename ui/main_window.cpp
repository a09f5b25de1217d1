#include "ui/main_window.h"

#include <QAction>
#include <QApplication>
#include <QCloseEvent>
#include <QDockWidget>
#include <QFileDialog>
#include <QFileInfo>
#include <QInputDialog>
#include <QMenuBar>
#include <QMessageBox>
#include <QSettings>
#include <QStatusBar>
#include <QToolBar>
#include <spdlog/spdlog.h>

#include "core/common/errors.h"
#include "core/io/peak_csv.h"
#include "core/io/project_file.h"
#include "ui/dialogs.h"
#include "ui/figure_export.h"
#include "ui/file_names.h"
#include "ui/input_intent.h"
#include "ui/log_panel.h"
#include "ui/recovery_question.h"
#include "ui/setup/setup_panel.h"

namespace finestra::ui {
namespace {
const QString kFigureFilters = QStringLiteral("PNG (*.png);;SVG (*.svg);;PDF (*.pdf)");
const QString kDataFilters = QStringLiteral("CSV (*.csv)");
}  // namespace

MainWindow::MainWindow(QString recoveryFolder, int autosaveIntervalMs, QWidget* parent)
    : QMainWindow(parent), document_(std::make_unique<ProjectDocument>()), jobs_(std::make_unique<JobBoard>()),
      compute_(std::make_unique<ComputeController>(jobs_.get())) {
  setWindowIcon(QIcon(":/finestra/finestra.svg"));
  intentGuard_ = new InputIntentGuard(*document_, *this);  // before any input box is shown
  QSettings settings;
  display_.unit = static_cast<SpectralUnit>(settings.value("display/unit", static_cast<int>(SpectralUnit::GHzDetuning)).toInt());
  display_.spectrumKind = settings.value("display/kind", 0).toInt() == 0 ? SpectrumKind::Emission : SpectrumKind::Excitation;
  display_.palette = settings.value("display/palette", paletteNames().front()).toString();

  log_ = new LogPanel;
  log_->attachToDefaultLogger();
  tabs_ = new QTabWidget;
  tabs_->setDocumentMode(true);
  const ViewContext context{document_.get(), compute_.get(), jobs_.get()};
  for (const ViewEntry& entry : viewCatalogue()) {
    std::unique_ptr<ResultView> v = entry.make(context);
    ResultView* raw = v.get();
    tabs_->addTab(v.release(), entry.title);  // the tab widget owns the view from here
    views_.push_back({entry.key, raw, entry.parts, false});
    connect(raw, &ResultView::peakClicked, this, &MainWindow::onPeakClicked);
  }
  showView(settings.value(kTabKey).toString());  // the last shown tab, before tab changes request results
  connect(tabs_, &QTabWidget::currentChanged, this, &MainWindow::onTabChanged);
  setCentralWidget(tabs_);

  setup_ = new SetupPanel(*document_);
  auto* setupDock = new QDockWidget(tr("Setup"), this);
  setupDock->setObjectName("setup");
  setupDock->setWidget(setup_);
  setupDock->setFeatures(QDockWidget::DockWidgetMovable | QDockWidget::DockWidgetFloatable);
  addDockWidget(Qt::LeftDockWidgetArea, setupDock);
  auto* logDock = new QDockWidget(tr("Log"), this);
  logDock->setObjectName("log");
  logDock->setWidget(log_);
  addDockWidget(Qt::BottomDockWidgetArea, logDock);
  resizeDocks({logDock}, {110}, Qt::Vertical);
  resizeDocks({setupDock}, {580}, Qt::Horizontal);

  computeLabel_ = new QLabel(tr("ready"));
  busy_ = new QProgressBar;
  busy_->setRange(0, 0);
  busy_->setMaximumWidth(120);
  busy_->setVisible(false);
  statusBar()->addPermanentWidget(busy_);
  statusBar()->addPermanentWidget(computeLabel_);

  buildMenus();
  connect(document_.get(), &ProjectDocument::changed, this, [this](Changes what) {
    if (what & (kPhysicsChanges | Change::Measurements)) requestCompute();
    updateTitle();
  });
  connect(setup_, &SetupPanel::sweepChosen, this, [this](int index) {
    display_.sweepIndex = index;
    requestCompute();
  });
  connect(compute_.get(), &ComputeController::resultReady, this, &MainWindow::onResult);
  connect(jobs_.get(), &JobBoard::anyBusyChanged, busy_, &QWidget::setVisible);
  autosaver_ = std::make_unique<Autosaver>(*document_, std::move(recoveryFolder), autosaveIntervalMs);
  applyDisplay(display_);
  resize(1500, 940);
  restoreWindowSettings();
  updateTitle();
  requestCompute();
}

MainWindow::~MainWindow() {
  // The guard and the setup panel use the document, which members destroy before the widgets go.
  delete intentGuard_;
  delete setup_;
}

void MainWindow::restoreWindowSettings() {
  const QSettings settings;
  restoreGeometry(settings.value(kGeometryKey).toByteArray());
  restoreState(settings.value(kStateKey).toByteArray());
}

void MainWindow::saveWindowSettings() const {
  QSettings settings;
  settings.setValue(kGeometryKey, saveGeometry());
  settings.setValue(kStateKey, saveState());
  const int index = tabs_->currentIndex();
  if (index >= 0) settings.setValue(kTabKey, views_[static_cast<std::size_t>(index)].key);
}

void MainWindow::buildMenus() {
  // Every frequent action has a shortcut, shown beside it in the menu.
  QMenu* file = menuBar()->addMenu(tr("&File"));
  file->addAction(tr("&New project"), QKeySequence(Qt::CTRL | Qt::Key_N), this, [this] {
    if (maybeSave()) document_->reset(Project{}, {});
  });
  file->addAction(tr("&Open\u2026"), QKeySequence(Qt::CTRL | Qt::Key_O), this, [this] {
    if (!maybeSave()) return;
    const QString path = QFileDialog::getOpenFileName(this, tr("Open project"), {}, tr("Finestra projects (*.json)"));
    if (!path.isEmpty()) openProject(path);
  });
  recentMenu_ = file->addMenu(tr("Open &recent"));
  recentMenu_->setObjectName("recent-files");
  rebuildRecentMenu();
  file->addAction(tr("&Save"), QKeySequence(Qt::CTRL | Qt::Key_S), this, &MainWindow::save);
  file->addAction(tr("Save &as\u2026"), QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_S), this, &MainWindow::saveAs);
  file->addSeparator();
  file->addAction(tr("Import measured &peaks (CSV)\u2026"), QKeySequence(Qt::CTRL | Qt::Key_I), this, [this] {
    const QString path = QFileDialog::getOpenFileName(this, tr("Import measured peaks"), {}, tr("CSV (*.csv *.txt)"));
    if (!path.isEmpty()) importPeaks(path);
  });
  file->addAction(tr("Import measured s&pectrum (CSV)\u2026"), QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_I), this, [this] {
    const QString path = QFileDialog::getOpenFileName(this, tr("Import measured spectrum"), {}, tr("CSV (*.csv *.txt)"));
    if (!path.isEmpty()) importSpectrum(path);  // reports its own errors
  });
  file->addAction(tr("Remove measured spectrum"), this, [this] { document_->setMeasuredSpectrum(std::nullopt); });
  file->addSeparator();
  file->addAction(tr("Export &figure (PNG, SVG, PDF)\u2026"), QKeySequence(Qt::CTRL | Qt::Key_E), this, &MainWindow::exportFigure);
  file->addAction(tr("Export &data (CSV)\u2026"), QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_E), this, &MainWindow::exportData);
  file->addSeparator();
  file->addAction(tr("&Quit"), QKeySequence(Qt::CTRL | Qt::Key_Q), this, &QWidget::close);

  QMenu* edit = menuBar()->addMenu(tr("&Edit"));
  // The document's undo and redo; the input guard keeps text fields from taking these keys.
  QAction* undo = document_->undoStack().createUndoAction(this, tr("&Undo"));
  undo->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_Z));
  QAction* redo = document_->undoStack().createRedoAction(this, tr("&Redo"));
  redo->setShortcuts({QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_Z), QKeySequence(Qt::CTRL | Qt::Key_Y)});
  edit->addAction(undo);
  edit->addAction(redo);
  edit->addSeparator();
  edit->addAction(tr("&Preferences\u2026"), QKeySequence(Qt::CTRL | Qt::Key_Comma), this, [this] {
    PreferencesDialog dialog(display_, this);
    if (dialog.exec() == QDialog::Accepted) applyDisplay(dialog.chosen());
  });
  edit->addAction(tr("&Cancel computation"), QKeySequence(Qt::Key_Escape), this, [this] { jobs_->cancelAll(); });

  buildViewMenu();

  QMenu* help = menuBar()->addMenu(tr("&Help"));
  help->addAction(tr("&About Finestra and safety"), QKeySequence(Qt::Key_F1), this, [this] { AboutDialog(this).exec(); });

  QToolBar* bar = addToolBar(tr("Main"));
  bar->setObjectName("main-toolbar");
  bar->addAction(undo);
  bar->addAction(redo);
}

void MainWindow::buildViewMenu() {
  QMenu* viewMenu = menuBar()->addMenu(tr("&View"));
  for (std::size_t i = 0; i < views_.size(); ++i) {
    const QString key = views_[i].key;
    QAction* action = viewMenu->addAction(tabs_->tabText(static_cast<int>(i)), this, [this, key] { showView(key); });
    if (i < 9) action->setShortcut(QKeySequence(Qt::CTRL | static_cast<Qt::Key>(Qt::Key_1 + static_cast<int>(i))));
  }
}

void MainWindow::applyDisplay(const DisplaySettings& display) {
  const bool recompute = display.unit != display_.unit || display.spectrumKind != display_.spectrumKind;
  display_ = display;
  QSettings settings;
  settings.setValue("display/unit", static_cast<int>(display_.unit));
  settings.setValue("display/kind", display_.spectrumKind == SpectrumKind::Emission ? 0 : 1);
  settings.setValue("display/palette", display_.palette);
  for (const ShownView& v : views_) v.view->applyDisplay(display_);
  if (recompute) requestCompute();
}

void MainWindow::requestCompute() {
  ComputeRequest request;
  request.project = document_->project();
  request.parts = shownParts();
  requestedParts_ = request.parts;
  request.sweepIndex = display_.sweepIndex;
  request.unit = display_.unit;
  request.spectrumKind = display_.spectrumKind;
  compute_->request(std::move(request));
}

void MainWindow::onResult(const ResultPtr& result) {
  if (!result->error.isEmpty()) {
    computeLabel_->setText(tr("setup incomplete"));
    statusBar()->showMessage(result->error, 15000);
    spdlog::warn("cannot compute: {}", result->error.toStdString());
  } else if (result->sweep) {
    std::size_t points = result->sweep->result.x.size() * result->sweep->result.classes.size();
    computeLabel_->setText(tr("computed %1 sweep points in %2 ms").arg(points).arg(result->elapsedMs, 0, 'f', 1));
  } else {
    computeLabel_->setText(tr("computed in %1 ms").arg(result->elapsedMs, 0, 'f', 1));
  }
  // A failed setup reaches every view (each shows it is empty); otherwise a view gets the result
  // only when it holds the view's parts.
  for (ShownView& v : views_) {
    v.stale = result->error.isEmpty() && (result->parts & v.parts) != v.parts;
    if (!v.stale) v.view->showResult(result);
  }
  Q_EMIT resultShown(result);
}

Parts MainWindow::shownParts() const {
  const int index = tabs_->currentIndex();
  return index >= 0 ? views_[static_cast<std::size_t>(index)].parts : Parts{};
}

void MainWindow::onTabChanged() {
  const int index = tabs_->currentIndex();
  if (index < 0) return;
  const ShownView& shown = views_[static_cast<std::size_t>(index)];
  if (shown.stale || (requestedParts_ & shown.parts) != shown.parts) requestCompute();
}

void MainWindow::updateTitle() {
  const QString name = document_->filePath().isEmpty() ? tr("untitled") : QFileInfo(document_->filePath()).fileName();
  // Qt shows "[*]" as "*" while the window is modified, and warns when the placeholder is missing.
  setWindowTitle(QStringLiteral("%1[*] \u2014 Finestra").arg(name));
  setWindowModified(document_->isModified());
}

bool MainWindow::openProject(const QString& path) {
  try {
    document_->open(path);
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    QMessageBox::warning(this, tr("Cannot open project"), QString::fromStdString(e.what()));
    return false;
  }
  spdlog::info("opened {}", path.toStdString());
  addRecent(path);
  return true;
}

bool MainWindow::importPeaks(const QString& path) {
  std::vector<MeasurementSet> sets;
  try {
    sets = readPeakCsv(path.toStdString());
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    QMessageBox::warning(this, tr("Cannot import peaks"), QString::fromStdString(e.what()) + tr("\n\nNothing was changed."));
    return false;
  } catch (const std::exception& e) {  // never let an exception escape the event handler: the work stays
    spdlog::error("{}", e.what());
    QMessageBox::warning(this, tr("Cannot import peaks"), QString::fromStdString(e.what()) + tr("\n\nNothing was changed."));
    return false;
  }
  std::size_t count = 0;
  for (const auto& s : sets) count += s.peaks.size();
  document_->edit(tr("Import peaks"), [&](Project& p) {
    p.measurements.insert(p.measurements.end(), sets.begin(), sets.end());
  });
  spdlog::info("imported {} peaks in {} measurements from {}", count, sets.size(), path.toStdString());
  return true;
}

bool MainWindow::importSpectrum(const QString& path, std::optional<SpectralUnit> unit) {
  try {
    document_->setMeasuredSpectrum(readSpectrumCsv(path.toStdString(), unit));
  } catch (const SpectrumUnitMissingError&) {
    QStringList keys;
    for (SpectralUnit u : allSpectralUnits()) keys << QString::fromStdString(std::string(spectralUnitKey(u)));
    bool ok = false;
    const QString key = QInputDialog::getItem(this, tr("Unit of the spectrum"),
                                              tr("The file names no unit. Unit of the first column:"), keys, 0, false, &ok);
    if (ok) return importSpectrum(path, parseSpectralUnit(key.toStdString(), "unit"));
    return false;
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
    QMessageBox::warning(this, tr("Cannot import spectrum"), QString::fromStdString(e.what()) + tr("\n\nNothing was changed."));
    return false;
  }
  spdlog::info("imported measured spectrum {}", path.toStdString());
  return true;
}

bool MainWindow::showView(const QString& key) {
  for (std::size_t i = 0; i < views_.size(); ++i)
    if (views_[i].key == key) {
      tabs_->setCurrentIndex(static_cast<int>(i));
      return true;
    }
  return false;
}

ResultView* MainWindow::view(const QString& key) const {
  for (const ShownView& v : views_)
    if (v.key == key) return v.view;
  return nullptr;
}

bool MainWindow::maybeSave() {
  if (!document_->isModified()) return true;
  const auto answer = QMessageBox::question(this, tr("Unsaved changes"),
                                            tr("The project has unsaved changes. Save them first?"),
                                            QMessageBox::Save | QMessageBox::Discard | QMessageBox::Cancel, QMessageBox::Save);
  if (answer == QMessageBox::Save) return save();
  return answer == QMessageBox::Discard;
}

bool MainWindow::save() {
  if (document_->filePath().isEmpty()) return saveAs();
  try {
    document_->saveAs(document_->filePath());
  } catch (const InputError& e) {
    QMessageBox::warning(this, tr("Cannot save"), QString::fromStdString(e.what()));
    return false;
  }
  spdlog::info("saved {}", document_->filePath().toStdString());
  return true;
}

bool MainWindow::saveAs() {
  const QString filters = tr("Finestra projects (*.json)");
  const QString path = withOfferedExtension(QFileDialog::getSaveFileName(this, tr("Save project"), document_->filePath(), filters),
                                            filters, filters);
  if (path.isEmpty()) return false;
  try {
    document_->saveAs(path);
  } catch (const InputError& e) {
    QMessageBox::warning(this, tr("Cannot save"), QString::fromStdString(e.what()));
    return false;
  }
  addRecent(path);
  spdlog::info("saved {}", path.toStdString());
  return true;
}

void MainWindow::addRecent(const QString& path) {
  QSettings settings;
  QStringList recent = settings.value(kRecentKey).toStringList();
  const QString absolute = QFileInfo(path).absoluteFilePath();
  recent.removeAll(absolute);
  recent.prepend(absolute);
  while (recent.size() > kMaxRecent) recent.removeLast();
  settings.setValue(kRecentKey, recent);
  rebuildRecentMenu();
}

void MainWindow::rebuildRecentMenu() {
  recentMenu_->clear();
  const QStringList recent = QSettings().value(kRecentKey).toStringList();
  for (const QString& path : recent)
    recentMenu_->addAction(path, this, [this, path] {
      if (maybeSave()) openProject(path);
    });
  recentMenu_->setEnabled(!recent.isEmpty());
}

void MainWindow::exportFigure() {
  auto* v = qobject_cast<ResultView*>(tabs_->currentWidget());
  if (!v || !v->figure()) {
    QMessageBox::information(this, tr("Export figure"), tr("This view has no figure; use Export data (CSV)."));
    return;
  }
  QString chosen;
  const QString path =
      withOfferedExtension(QFileDialog::getSaveFileName(this, tr("Export figure"), {}, kFigureFilters, &chosen), chosen, kFigureFilters);
  if (path.isEmpty()) return;
  try {
    ui::exportFigure(*v->figure(), path, 1400, 900);
    spdlog::info("figure written to {}", path.toStdString());
  } catch (const InputError& e) {
    QMessageBox::warning(this, tr("Export figure"), QString::fromStdString(e.what()));
  }
}

void MainWindow::exportData() {
  auto* v = qobject_cast<ResultView*>(tabs_->currentWidget());
  if (!v) return;
  QString chosen;
  const QString path =
      withOfferedExtension(QFileDialog::getSaveFileName(this, tr("Export data"), {}, kDataFilters, &chosen), chosen, kDataFilters);
  if (path.isEmpty()) return;
  try {
    exportTableCsv(v->dataTable(), path);
    spdlog::info("data written to {}", path.toStdString());
  } catch (const InputError& e) {
    QMessageBox::warning(this, tr("Export data"), QString::fromStdString(e.what()));
  }
}

void MainWindow::onPeakClicked(int measurement, int peak) {
  const ResultPtr result = compute_->lastResult();
  if (!result || !result->model) return;
  const MeasurementSet& m = result->project.measurements.at(static_cast<std::size_t>(measurement));
  const MeasuredPeak& p = m.peaks.at(static_cast<std::size_t>(peak));
  try {
    const auto candidates = nearestLinesForPeak(*result->model, result->project, m, p, 8);
    const QString heading = tr("Measurement \u201c%1\u201d (|B| = %2 T, polar %3\u00b0, azimuth %4\u00b0), peak %5 at %6 %7 \u00b1 %8")
                                .arg(QString::fromStdString(m.name)).arg(m.field.labVector(result->model->setup().lab).norm())
                                .arg(m.field.polarDeg).arg(m.field.azimuthDeg).arg(peak + 1).arg(p.position, 0, 'g', 10)
                                .arg(QString::fromStdString(std::string(spectralUnitKey(p.unit)))).arg(p.sigma);
    auto* dialog = new PeakMatchDialog(heading, candidates, result->model->zplGHz(), this);
    dialog->setAttribute(Qt::WA_DeleteOnClose);
    dialog->show();
  } catch (const InputError& e) {
    spdlog::error("{}", e.what());
  }
}

void MainWindow::offerRecovery() {
  for (const RecoveryEntry& entry : Autosaver::orphanedCopies(autosaver_->folder())) {
    switch (askAboutRecovery(entry, this)) {
      case RecoveryChoice::Recover:
        try {
          document_->reset(readProjectFile(entry.projectPath.toStdString()), entry.originalPath, true);
          spdlog::info("recovered unsaved work of {}", entry.originalPath.toStdString());
          Autosaver::discard(entry);
          autosaver_->saveNow();
          return;
        } catch (const InputError& e) {
          QMessageBox::warning(this, tr("Recovery failed"), QString::fromStdString(e.what()));
        }
        break;
      case RecoveryChoice::DiscardCopy: Autosaver::discard(entry); break;
      case RecoveryChoice::OpenOriginal:
        if (openProject(entry.originalPath)) return;
        break;
      case RecoveryChoice::Later: break;
    }
  }
}

void MainWindow::closeEvent(QCloseEvent* event) {
  if (!maybeSave()) {
    event->ignore();
    return;
  }
  saveWindowSettings();
  jobs_->cancelAll();
  autosaver_->finishCleanly();
  event->accept();
}

}  // namespace finestra::ui
