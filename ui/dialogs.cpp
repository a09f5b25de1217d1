#include "ui/dialogs.h"

#include <QComboBox>
#include <QDialogButtonBox>
#include <QFormLayout>
#include <QHeaderView>
#include <QLabel>
#include <QTableWidget>
#include <QTextBrowser>
#include <QVBoxLayout>
#include <qcustomplot.h>
#include <Eigen/Core>
#include <spdlog/version.h>
#include <nlohmann/json.hpp>

#include "core/common/version.h"


namespace finestra::ui {

QString safetyCautionsHtml() {
  return QObject::tr(
      "<h3>Safety cautions</h3><ul>"
      "<li><b>Superconducting and vector magnets:</b> stray fields reach well beyond the cryostat \u2014 keep "
      "people with pacemakers or other implants away, and keep ferromagnetic tools out. A quench boils off "
      "cryogen fast: the gas displaces air and can cause <b>oxygen depletion</b> in the room.</li>"
      "<li><b>Cryogens</b> (liquid helium, liquid nitrogen): <b>cold burns</b> on contact; "
      "<b>asphyxiation</b> risk in closed or low rooms.</li>"
      "<li><b>Lasers:</b> eye hazard, including from reflections. Near-infrared light (e.g. the 737 nm SiV\u207b "
      "line and pump lasers) is <b>barely visible</b>, so the eye's own protection does not work.</li>"
      "<li><b>Microwave amplifiers:</b> RF burns from open connectors and antennas.</li></ul>"
      "<p>Finestra plans and models; it does <b>not</b> replace the lab's safety rules, the laser safety officer, "
      "or local regulations.</p>");
}

AboutDialog::AboutDialog(QWidget* parent) : QDialog(parent) {
  setWindowTitle(tr("About Finestra"));
  auto* layout = new QVBoxLayout(this);
  auto* text = new QTextBrowser(this);
  text->setOpenExternalLinks(false);
  text->setHtml(tr("<h2>Finestra %1</h2><p>A workbench for the fine structure of group-IV vacancy centres "
                   "(SiV\u207b, GeV\u207b, SnV\u207b, PbV\u207b) in diamond: levels, optical lines and spectra in "
                   "magnetic field and strain.</p><p>Built with Qt %2 (running %3), QCustomPlot %4, Eigen %5.%6.%7, "
                   "spdlog %8.%9.%10, nlohmann-json %11.%12.%13.</p><p>Preset values carry their source and status; "
                   "values marked <i>from memory</i> or <i>assumed</i> should be checked before use.</p>")
                    .arg(QString::fromUtf8(kVersion.data(), static_cast<qsizetype>(kVersion.size())), QT_VERSION_STR, qVersion(), QCUSTOMPLOT_VERSION_STR)
                    .arg(EIGEN_WORLD_VERSION).arg(EIGEN_MAJOR_VERSION).arg(EIGEN_MINOR_VERSION)
                    .arg(SPDLOG_VER_MAJOR).arg(SPDLOG_VER_MINOR).arg(SPDLOG_VER_PATCH)
                    .arg(NLOHMANN_JSON_VERSION_MAJOR).arg(NLOHMANN_JSON_VERSION_MINOR).arg(NLOHMANN_JSON_VERSION_PATCH) +
                safetyCautionsHtml());
  layout->addWidget(text);
  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Close, this);
  connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
  layout->addWidget(buttons);
  resize(620, 560);
}

PreferencesDialog::PreferencesDialog(const DisplaySettings& current, QWidget* parent) : QDialog(parent), chosen_(current) {
  setWindowTitle(tr("Preferences"));
  auto* form = new QFormLayout(this);
  auto* unit = new QComboBox(this);
  for (SpectralUnit u : allSpectralUnits()) unit->addItem(QString::fromStdString(spectralUnitLabel(u)), static_cast<int>(u));
  unit->setCurrentIndex(unit->findData(static_cast<int>(current.unit)));
  auto* kind = new QComboBox(this);
  kind->addItems({tr("emission (PL)"), tr("excitation (PLE)")});
  kind->setCurrentIndex(current.spectrumKind == SpectrumKind::Emission ? 0 : 1);
  auto* palette = new QComboBox(this);
  palette->addItems(paletteNames());
  palette->setCurrentText(current.palette);
  form->addRow(tr("Spectral axis"), unit);
  form->addRow(tr("Spectrum kind"), kind);
  form->addRow(tr("Colour palette (colour-blind safe)"), palette);
  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel, this);
  form->addRow(buttons);
  connect(buttons, &QDialogButtonBox::accepted, this, [=, this] {
    chosen_.unit = static_cast<SpectralUnit>(unit->currentData().toInt());
    chosen_.spectrumKind = kind->currentIndex() == 0 ? SpectrumKind::Emission : SpectrumKind::Excitation;
    chosen_.palette = palette->currentText();
    accept();
  });
  connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
}

PeakMatchDialog::PeakMatchDialog(const QString& heading, const std::vector<LineCandidate>& candidates, double zplGHz,
                                 QWidget* parent)
    : QDialog(parent) {
  setWindowTitle(tr("Nearest predicted lines"));
  auto* layout = new QVBoxLayout(this);
  auto* label = new QLabel(heading, this);
  label->setWordWrap(true);
  layout->addWidget(label);
  auto* table = new QTableWidget(static_cast<int>(candidates.size()), 6, this);
  table->setHorizontalHeaderLabels({tr("class"), tr("line"), tr("detuning (GHz)"), tr("predicted \u2212 measured (GHz)"),
                                    tr("in \u03c3"), tr("polarisation")});
  table->verticalHeader()->setVisible(false);
  table->setEditTriggers(QAbstractItemView::NoEditTriggers);
  for (std::size_t i = 0; i < candidates.size(); ++i) {
    const LineCandidate& c = candidates[i];
    const QStringList cells{QString::number(c.cls), QString::fromStdString(c.line.label()),
                            QString::number(c.line.frequencyGHz - zplGHz, 'f', 3), QString::number(c.distanceGHz, 'f', 3),
                            QString::number(c.distanceSigma, 'f', 1), QString::fromStdString(polarisationText(c.line, c.cls))};
    for (int k = 0; k < cells.size(); ++k) {
      auto* item = new QTableWidgetItem(cells[k]);
      item->setToolTip(QString::fromStdString(describeLine(c.cls, c.line, zplGHz)));
      table->setItem(static_cast<int>(i), k, item);
    }
  }
  table->resizeColumnsToContents();
  layout->addWidget(table);
  auto* buttons = new QDialogButtonBox(QDialogButtonBox::Close, this);
  connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
  layout->addWidget(buttons);
  resize(640, 300);
}

}  // namespace finestra::ui
