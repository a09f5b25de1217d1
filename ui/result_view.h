#pragma once
// Extension point for result views. A view is a tab in the main window that receives the model
// results carrying the parts it asked for, and the display settings; it may offer a figure
// (QCustomPlot) and a data table for export. To add a view, derive from ResultView and add ONE
// line to viewCatalogue() in ui/view_catalogue.cpp: { "key", "Tab title", makeView<YourView>,
// parts }, where `parts` (ui/compute.h) are the pieces of the result it draws; only the parts of
// the shown or exported views are computed. The key is also accepted by the headless export
// (finestra --export-view key).
#include <QString>
#include <QWidget>
#include <array>
#include <functional>
#include <memory>
#include <vector>

#include "core/report/table.h"
#include "ui/compute.h"
#include "ui/palette.h"

class QCustomPlot;

namespace finestra::ui {

class ProjectDocument;
class ComputeController;
class JobBoard;
class JobRunner;

struct DisplaySettings {
  SpectralUnit unit = SpectralUnit::GHzDetuning;
  SpectrumKind spectrumKind = SpectrumKind::Emission;
  QString palette = "Harbour";
  int sweepIndex = 0;
};

/// What a view may use besides its results: the document (for edits such as moving the current
/// point), the compute controller (for on-demand lookups with the latest model) and the job board
/// its own JobRunner registers with (long jobs of its own, cancelled by Esc with all others).
/// Every member may be null (headless export, tests).
struct ViewContext {
  ProjectDocument* document = nullptr;
  ComputeController* compute = nullptr;
  JobBoard* jobs = nullptr;
};

class ResultView : public QWidget {
  Q_OBJECT
public:
  explicit ResultView(const ViewContext& context, QWidget* parent = nullptr) : QWidget(parent), context_(context) {}
  /// Called with every accepted result that holds the view's parts (never a stale one).
  virtual void showResult(const ResultPtr& result) = 0;
  /// Called when units or palette change (a new result follows if the unit changed).
  virtual void applyDisplay(const DisplaySettings& display) { display_ = display; }
  /// The figure to export, or null for views without one.
  virtual QCustomPlot* figure() { return nullptr; }
  /// The view's data as a table for CSV export.
  virtual Table dataTable() const = 0;
  /// The runner of the view's own long jobs (computed from a result after showResult), or null.
  /// Headless export and tests wait for it before reading the figure or the table.
  virtual JobRunner* ownJobs() { return nullptr; }

Q_SIGNALS:
  /// A measured peak was clicked: indices into project.measurements and its peaks.
  void peakClicked(int measurement, int peak);

protected:
  const ViewContext& context() const { return context_; }
  const DisplaySettings& display() const { return display_; }
  const Palette& palette() const { return paletteByName(display_.palette); }

private:
  ViewContext context_;
  DisplaySettings display_;
};

struct ViewEntry {
  QString key;    ///< stable id for settings and the command line, e.g. "lines"
  QString title;  ///< tab text
  std::function<std::unique_ptr<ResultView>(const ViewContext&)> make;
  Parts parts;    ///< the parts of a model result the view draws (the model itself always comes)
};

template <typename View>
std::unique_ptr<ResultView> makeView(const ViewContext& context) {
  return std::make_unique<View>(context);
}

/// Every view, in tab order.
const std::vector<ViewEntry>& viewCatalogue();
/// Entry by key, or null.
const ViewEntry* findView(const QString& key);

}  // namespace finestra::ui
