#include "ui/setup/centre_section.h"

#include <QComboBox>
#include <QFormLayout>
#include <QHeaderView>
#include <QPushButton>
#include <QSignalBlocker>
#include <QTableWidget>
#include <QVBoxLayout>
#include <cmath>

#include "core/centre/presets.h"
#include "core/common/errors.h"

namespace finestra::ui {
namespace {

QColor statusColour(ValueStatus s) {
  switch (s) {
    case ValueStatus::Published: return QColor("#E8F3EC");
    case ValueStatus::CommonPractice: return QColor("#EEF2F8");
    case ValueStatus::FromMemory: return QColor("#FFF4D6");
    case ValueStatus::Assumed: return QColor("#FBE3D6");
    case ValueStatus::Unknown: return QColor("#F6D3DC");
    case ValueStatus::UserSet: return QColor("#DCEBFA");
    case ValueStatus::NotUsed: return QColor("#F2F2F2");
  }
  return Qt::white;
}

}  // namespace

CentreSection::CentreSection(ProjectDocument& document, QWidget* parent)
    : SetupSection(tr("Centre and parameters"), document, parent) {
  auto* layout = new QVBoxLayout(this);
  auto* form = new QFormLayout;
  preset_ = new QComboBox;
  for (const Preset& p : builtinPresets())
    preset_->addItem(QString::fromStdString(p.name + "  " + p.title), QString::fromStdString(p.name));
  isotope_ = new QComboBox;
  form->addRow(tr("Centre"), preset_);
  form->addRow(tr("Isotope of the group-IV atom"), isotope_);
  layout->addLayout(form);
  parameters_ = new QTableWidget(0, 5);
  parameters_->setHorizontalHeaderLabels({tr("Parameter"), tr("Value"), tr("Unit"), tr("Status"), tr("Source")});
  parameters_->verticalHeader()->setVisible(false);
  parameters_->horizontalHeader()->setStretchLastSection(true);
  parameters_->setMinimumHeight(230);
  parameters_->setSelectionBehavior(QAbstractItemView::SelectRows);
  layout->addWidget(parameters_);
  auto* restore = new QPushButton(tr("Restore preset value of the selected row"));
  layout->addWidget(restore);

  connect(preset_, &QComboBox::activated, this, [this](int index) {
    const std::string name = preset_->itemData(index).toString().toStdString();
    this->document().edit(tr("Choose centre %1").arg(QString::fromStdString(name)),
                          [&](Project& p) {
                            p.centre = CentreChoice{};
                            p.centre.preset = name;
                          });
  });
  connect(isotope_, &QComboBox::activated, this, [this](int index) {
    const QString iso = isotope_->itemData(index).toString();
    this->document().edit(tr("Choose isotope"), [&](Project& p) {
      p.centre.isotope = iso.isEmpty() ? std::nullopt : std::optional<std::string>(iso.toStdString());
    });
  });
  connect(parameters_, &QTableWidget::itemChanged, this, &CentreSection::onValueEdited);
  connect(restore, &QPushButton::clicked, this, &CentreSection::restoreSelected);
  refresh();
}

void CentreSection::onValueEdited(QTableWidgetItem* item) {
  if (item->column() != 1) return;
  const std::string key = parameters_->item(item->row(), 0)->text().toStdString();
  bool ok = false;
  const double value = item->text().trimmed().toDouble(&ok);
  if (!ok || !std::isfinite(value)) {
    refreshParameters();  // not a number: show the stored value again
    return;
  }
  document().edit(tr("Set %1").arg(QString::fromStdString(key)), [&](Project& p) { p.centre.overrides[key] = value; });
}

void CentreSection::restoreSelected() {
  const int row = parameters_->currentRow();
  if (row < 0) return;
  const std::string key = parameters_->item(row, 0)->text().toStdString();
  document().edit(tr("Restore %1").arg(QString::fromStdString(key)), [&](Project& p) { p.centre.overrides.erase(key); });
}

void CentreSection::refresh() {
  refreshChoice();
  refreshParameters();
}

void CentreSection::refreshChoice() {
  const Project& p = document().project();
  const QSignalBlocker a(preset_), b(isotope_);
  preset_->setCurrentIndex(preset_->findData(QString::fromStdString(p.centre.preset)));
  isotope_->clear();
  isotope_->addItem(tr("none (no nuclear spin)"), QString());
  for (const Preset& preset : builtinPresets()) {  // an unknown preset is reported by the parameter table
    if (preset.name != p.centre.preset) continue;
    for (const auto& [name, values] : preset.isotopes)
      isotope_->addItem(QString::fromStdString(name), QString::fromStdString(name));
  }
  isotope_->setCurrentIndex(std::max(0, isotope_->findData(QString::fromStdString(p.centre.isotope.value_or("")))));
}

void CentreSection::refreshParameters() {
  const Project& p = document().project();
  const QSignalBlocker block(parameters_);
  parameters_->setRowCount(0);
  ResolvedCentre resolved;
  try {
    resolved = resolveCentre(p.centre.preset, p.centre.isotope, p.centre.overrides);
  } catch (const InputError& e) {
    parameters_->setRowCount(1);
    parameters_->setItem(0, 0, new QTableWidgetItem(QString::fromStdString(e.what())));
    return;
  }
  for (const ParamInfo& info : paramTable()) {
    const ValueProvenance& v = resolved.provenance[static_cast<std::size_t>(info.id)];
    if (info.hyperfine && !p.centre.isotope) continue;
    const int row = parameters_->rowCount();
    parameters_->insertRow(row);
    const QString status = QString::fromStdString(valueStatusText(v.status));
    const std::array<QString, 5> cells{QString::fromUtf8(info.key.data(), static_cast<qsizetype>(info.key.size())),
                                       std::isfinite(v.value) ? QString::number(v.value, 'g', 10) : QStringLiteral("unknown"),
                                       QString::fromStdString(v.unit), status, QString::fromStdString(v.source)};
    for (int c = 0; c < 5; ++c) {
      auto* item = new QTableWidgetItem(cells[static_cast<std::size_t>(c)]);
      if (c != 1) item->setFlags(item->flags() & ~Qt::ItemIsEditable);
      item->setBackground(statusColour(v.status));
      item->setToolTip(QString::fromUtf8(info.meaning.data(), static_cast<qsizetype>(info.meaning.size())) + "\n" +
                       tr("status: %1\nsource: %2").arg(status, QString::fromStdString(v.source)));
      parameters_->setItem(row, c, item);
    }
  }
  parameters_->resizeColumnsToContents();
}

}  // namespace finestra::ui
