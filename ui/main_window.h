#pragma once
// The main window: setup panel (left dock), result views as tabs (from viewCatalogue()), log
// panel (bottom dock), status bar with compute time. Owns the document, the job board, the compute
// controller and the autosaver; wires them together. Holds no physics. Model results are computed
// with the parts the shown view asks for; a view whose parts a result lacks is refreshed when it is
// shown again.
#include <QLabel>
#include <QMainWindow>
#include <QMenu>
#include <QProgressBar>
#include <QTabWidget>
#include <memory>
#include <vector>

#include "ui/autosave.h"
#include "ui/compute.h"
#include "ui/document.h"
#include "ui/jobs/job_board.h"
#include "ui/result_view.h"

namespace finestra::ui {

class SetupPanel;
class LogPanel;
class InputIntentGuard;

class MainWindow : public QMainWindow {
  Q_OBJECT
public:
  /// `recoveryFolder` empty: the standard location. `autosaveIntervalMs`: period of the autosave.
  explicit MainWindow(QString recoveryFolder = {}, int autosaveIntervalMs = 20000, QWidget* parent = nullptr);
  ~MainWindow() override;

  ProjectDocument& document() { return *document_; }
  ComputeController& compute() { return *compute_; }
  JobBoard& jobs() { return *jobs_; }
  /// Opens a project; on error shows the message and keeps the current document. Returns success.
  bool openProject(const QString& path);
  bool importPeaks(const QString& path);
  bool importSpectrum(const QString& path, std::optional<SpectralUnit> unit = std::nullopt);
  /// Selects the tab of a view key ("levels", "lines", ...); false for an unknown key.
  bool showView(const QString& key);
  ResultView* view(const QString& key) const;
  /// Offers orphaned autosaved copies for recovery (called once after start-up).
  void offerRecovery();
  /// Settings keys of the window layout: restored by the constructor, written on close.
  static constexpr const char* kGeometryKey = "window/geometry";
  static constexpr const char* kStateKey = "window/state";
  static constexpr const char* kTabKey = "window/tab";
  static constexpr const char* kRecentKey = "files/recent";
  /// Recent files listed in File > Open recent, newest first.
  static constexpr int kMaxRecent = 8;
  /// Writes geometry, dock layout and shown tab to the settings (also done on close).
  void saveWindowSettings() const;

Q_SIGNALS:
  /// A result was accepted and shown in every view.
  void resultShown(finestra::ui::ResultPtr result);

protected:
  void closeEvent(QCloseEvent* event) override;

private:
  void buildMenus();
  void buildViewMenu();
  void restoreWindowSettings();
  void requestCompute();
  void onResult(const ResultPtr& result);
  void onTabChanged();
  /// The parts the shown view draws.
  Parts shownParts() const;
  void updateTitle();
  bool maybeSave();
  bool save();
  bool saveAs();
  void addRecent(const QString& path);
  void rebuildRecentMenu();
  void exportFigure();
  void exportData();
  void applyDisplay(const DisplaySettings& display);
  void onPeakClicked(int measurement, int peak);

  std::unique_ptr<ProjectDocument> document_;
  std::unique_ptr<JobBoard> jobs_;
  std::unique_ptr<ComputeController> compute_;
  std::unique_ptr<Autosaver> autosaver_;
  InputIntentGuard* intentGuard_ = nullptr;
  SetupPanel* setup_ = nullptr;
  LogPanel* log_ = nullptr;
  QTabWidget* tabs_ = nullptr;
  struct ShownView {
    QString key;
    ResultView* view = nullptr;
    Parts parts;
    bool stale = false;  ///< the last result lacked its parts: it shows an older one
  };
  std::vector<ShownView> views_;
  QLabel* computeLabel_ = nullptr;
  QProgressBar* busy_ = nullptr;
  QMenu* recentMenu_ = nullptr;
  DisplaySettings display_;
  Parts requestedParts_;  ///< of the latest compute request
};

}  // namespace finestra::ui
