#pragma once
// Small dialogs: About (versions and safety cautions), Preferences (units, palette), and the
// list of predicted lines nearest to a clicked measured peak.
#include <QDialog>

#include "core/optics/line_info.h"
#include "ui/result_view.h"

namespace finestra::ui {

/// The safety cautions shown in the About dialog (README.md, Safety cautions).
QString safetyCautionsHtml();

class AboutDialog : public QDialog {
  Q_OBJECT
public:
  explicit AboutDialog(QWidget* parent = nullptr);
};

class PreferencesDialog : public QDialog {
  Q_OBJECT
public:
  PreferencesDialog(const DisplaySettings& current, QWidget* parent = nullptr);
  DisplaySettings chosen() const { return chosen_; }

private:
  DisplaySettings chosen_;
};

/// Shows the nearest predicted lines of a measured peak (computed by core).
class PeakMatchDialog : public QDialog {
  Q_OBJECT
public:
  PeakMatchDialog(const QString& heading, const std::vector<LineCandidate>& candidates, double zplGHz, QWidget* parent = nullptr);
};

}  // namespace finestra::ui
