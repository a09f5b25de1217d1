#include "ui/setup_panel.h"

#include <QCheckBox>
#include <QComboBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QSignalBlocker>
#include <QSpinBox>
#include <QStackedWidget>
#include <QTableWidget>
#include <QVBoxLayout>
#include <cmath>
#include <numbers>

#include "core/common/limits.h"
#include "core/common/errors.h"
#include "core/centre/presets.h"
#include "core/project/field_semantics.h"
#include "ui/setup_widgets.h"

namespace finestra::ui {
namespace {

constexpr double kStrainScale = 1e-6;  // strain spin boxes show units of 10⁻⁶
const std::array<std::pair<int, int>, 6> kStrainIndex{{{0, 0}, {1, 1}, {2, 2}, {1, 2}, {2, 0}, {0, 1}}};
const std::array<const char*, 6> kStrainNames{"xx", "yy", "zz", "yz", "zx", "xy"};

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

QDoubleSpinBox* spinBox(double lo, double hi, int decimals, const QString& suffix) {
  auto* s = new QDoubleSpinBox;
  s->setRange(lo, hi);
  s->setDecimals(decimals);
  s->setSuffix(suffix);
  s->setKeyboardTracking(false);
  return s;
}

QGroupBox* section(const QString& title, QLayout* layout) {
  auto* box = new QGroupBox(title);
  box->setLayout(layout);
  return box;
}

}  // namespace

SetupPanel::SetupPanel(ProjectDocument& document, QWidget* parent) : QScrollArea(parent), document_(document) {
  auto* content = new QWidget;
  auto* layout = new QVBoxLayout(content);
  layout->addWidget(buildCentre());
  layout->addWidget(buildField());
  layout->addWidget(buildSample());
  layout->addWidget(buildStrain());
  layout->addWidget(buildDetection());
  layout->addWidget(buildSweep());
  layout->addStretch(1);
  setWidget(content);
  setWidgetResizable(true);
  setMinimumWidth(560);
  setHorizontalScrollBarPolicy(Qt::ScrollBarAlwaysOff);
  connect(&document_, &ProjectDocument::changed, this, &SetupPanel::refresh);
  refresh(Change::Everything);
}

int SetupPanel::sweepIndex() const { return sweep_->currentIndex(); }

void SetupPanel::connectDrag(SliderSpin* control) {
  connect(control, &SliderSpin::dragStarted, &document_, &ProjectDocument::beginDrag);
  connect(control, &SliderSpin::dragFinished, &document_, &ProjectDocument::endDrag);
}

QWidget* SetupPanel::buildCentre() {
  auto* layout = new QVBoxLayout;
  auto* form = new QFormLayout;
  preset_ = new QComboBox;
  for (const Preset& p : builtinPresets()) preset_->addItem(QString::fromStdString(p.name + "  " + p.title), QString::fromStdString(p.name));
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
    document_.edit(tr("Choose centre %1").arg(QString::fromStdString(name)), Change::Centre, [&](Project& p) {
      p.centre = CentreChoice{};
      p.centre.preset = name;
    });
  });
  connect(isotope_, &QComboBox::activated, this, [this](int index) {
    const QString iso = isotope_->itemData(index).toString();
    document_.edit(tr("Choose isotope"), Change::Centre, [&](Project& p) {
      p.centre.isotope = iso.isEmpty() ? std::nullopt : std::optional<std::string>(iso.toStdString());
    });
  });
  connect(parameters_, &QTableWidget::itemChanged, this, [this](QTableWidgetItem* item) {
    if (item->column() != 1) return;
    const std::string key = parameters_->item(item->row(), 0)->text().toStdString();
    bool ok = false;
    const double value = item->text().trimmed().toDouble(&ok);
    if (!ok || !std::isfinite(value)) {
      refreshCentre();  // not a number: show the stored value again
      return;
    }
    document_.edit(tr("Set %1").arg(QString::fromStdString(key)), Change::Centre,
                   [&](Project& p) { p.centre.overrides[key] = value; });
  });
  connect(restore, &QPushButton::clicked, this, [this] {
    const int row = parameters_->currentRow();
    if (row < 0) return;
    const std::string key = parameters_->item(row, 0)->text().toStdString();
    document_.edit(tr("Restore %1").arg(QString::fromStdString(key)), Change::Centre,
                   [&](Project& p) { p.centre.overrides.erase(key); });
  });
  return section(tr("Centre and parameters"), layout);
}

QWidget* SetupPanel::buildSample() {
  auto* form = new QFormLayout;
  normal_ = new Vec3Edit(-20, 20, 3);
  inPlane_ = new Vec3Edit(-20, 20, 3);
  sampleMessage_ = new QLabel;
  sampleMessage_->setWordWrap(true);
  sampleMessage_->setStyleSheet("color:#A02030");
  form->addRow(tr("Normal (lab z)"), normal_);
  form->addRow(tr("In-plane (lab x)"), inPlane_);
  form->addRow(sampleMessage_);
  form->addRow(new QLabel(tr("Both as crystal directions, e.g. [001] and [110].")));
  auto apply = [this] {
    const Vec3 n = normal_->value(), x = inPlane_->value();
    try {
      LabFrame check(n, x, "sample");
      sampleMessage_->clear();
    } catch (const InputError& e) {
      sampleMessage_->setText(QString::fromStdString(e.what()));
      return;
    }
    document_.edit(tr("Change sample orientation"), Change::Sample, [&](Project& p) {
      p.sample.normal = n;
      p.sample.inPlaneX = x;
    });
  };
  connect(normal_, &Vec3Edit::edited, this, apply);
  connect(inPlane_, &Vec3Edit::edited, this, apply);
  return section(tr("Sample orientation"), form);
}

void SetupPanel::editField(const QString& text, const std::function<void(FieldSetting&)>& change, const QString& mergeKey) {
  document_.edit(text, Change::Field, [&](Project& p) { change(p.field); }, mergeKey);
}

QWidget* SetupPanel::buildField() {
  auto* layout = new QVBoxLayout;
  fieldForm_ = new QComboBox;
  fieldForm_->addItems({tr("Magnitude and lab angles"), tr("Vector in lab axes (T)"), tr("Vector in crystal axes (T)")});
  layout->addWidget(fieldForm_);
  fieldPages_ = new QStackedWidget;
  auto* anglesPage = new QWidget;
  auto* anglesForm = new QFormLayout(anglesPage);
  anglesForm->setContentsMargins(0, 0, 0, 0);
  magnitude_ = new SliderSpin(0, 12, 0.001, 3, " T");
  polar_ = new SliderSpin(0, 180, 0.05, 2, "\u00b0");
  azimuth_ = new SliderSpin(0, 360, 0.05, 2, "\u00b0");
  anglesForm->addRow(tr("|B|"), magnitude_);
  anglesForm->addRow(tr("polar from lab z"), polar_);
  anglesForm->addRow(tr("azimuth from lab x"), azimuth_);
  fieldPages_->addWidget(anglesPage);
  fieldVector_ = new Vec3Edit(-12, 12, 4);
  fieldPages_->addWidget(fieldVector_);
  layout->addWidget(fieldPages_);
  fieldSummary_ = new QLabel;
  fieldSummary_->setStyleSheet("color:#555");
  fieldSummary_->setWordWrap(true);
  layout->addWidget(fieldSummary_);

  for (SliderSpin* s : {magnitude_, polar_, azimuth_}) connectDrag(s);
  connect(magnitude_, &SliderSpin::edited, this, [this](double v) {
    editField(tr("Field magnitude"), [v](FieldSetting& f) { f.magnitudeT = v; }, "field.magnitude");
  });
  connect(polar_, &SliderSpin::edited, this, [this](double v) {
    editField(tr("Field polar angle"), [v](FieldSetting& f) { f.polarDeg = v; }, "field.polar");
  });
  connect(azimuth_, &SliderSpin::edited, this, [this](double v) {
    editField(tr("Field azimuth"), [v](FieldSetting& f) { f.azimuthDeg = v; }, "field.azimuth");
  });
  connect(fieldVector_, &Vec3Edit::edited, this, [this](const Vec3& v) {
    editField(tr("Field vector"), [v](FieldSetting& f) { f.vector = v; });
  });
  connect(fieldForm_, &QComboBox::activated, this, [this](int index) {
    const Project& p = document_.project();
    const LabFrame lab(p.sample.normal, p.sample.inPlaneX);
    const Vec3 labVector = p.field.labVector(lab);
    FieldSetting next;
    if (index == 0) {
      const auto angles = labVector.norm() > 0 ? anglesOfDirection(labVector) : std::array<double, 2>{0, 0};
      next = FieldSetting::fromAngles(labVector.norm(), angles[0], angles[1]);
    } else {
      next.form = index == 1 ? FieldSetting::Form::VectorLab : FieldSetting::Form::VectorCrystal;
      next.vector = index == 1 ? labVector : lab.toCrystal(labVector);
    }
    editField(tr("Field entry form"), [next](FieldSetting& f) { f = next; });
  });
  return section(tr("Magnet"), layout);
}

QWidget* SetupPanel::buildStrain() {
  auto* layout = new QVBoxLayout;
  auto* grid = new QGridLayout;
  for (std::size_t i = 0; i < 6; ++i) {
    strain_[i] = spinBox(-limits::kMaxStrain / kStrainScale, limits::kMaxStrain / kStrainScale, 3, "");
    grid->addWidget(new QLabel(QStringLiteral("\u03b5_%1").arg(kStrainNames[i])), static_cast<int>(i / 3) * 2, static_cast<int>(i % 3));
    grid->addWidget(strain_[i], static_cast<int>(i / 3) * 2 + 1, static_cast<int>(i % 3));
    connect(strain_[i], &QDoubleSpinBox::valueChanged, this, [this, i](double v) {
      document_.edit(tr("Strain %1").arg(kStrainNames[i]), Change::Strain, [&](Project& p) {
        const auto [r, c] = kStrainIndex[i];
        p.strain.crystal(r, c) = v * kStrainScale;
        p.strain.crystal(c, r) = v * kStrainScale;
      });
    });
  }
  layout->addWidget(new QLabel(tr("Crystal-frame tensor, units of 10\u207b\u2076")));
  layout->addLayout(grid);
  auto* eg = new QFormLayout;
  const std::array<QString, 4> names{tr("ground |\u03b5_Eg| (GHz)"), tr("ground angle"), tr("excited |\u03b5_Eg| (GHz)"), tr("excited angle")};
  for (std::size_t i = 0; i < 4; ++i) {
    egStrain_[i] = i % 2 == 0 ? spinBox(0, limits::kMaxEgStrainGHz, 3, "") : spinBox(-360, 360, 2, "\u00b0");
    eg->addRow(names[i], egStrain_[i]);
    connect(egStrain_[i], &QDoubleSpinBox::valueChanged, this, [this, i](double v) {
      document_.edit(tr("E-type strain"), Change::Strain, [&](Project& p) {
        EgStrain& e = i < 2 ? p.strain.extraGround : p.strain.extraExcited;
        (i % 2 == 0 ? e.magnitudeGHz : e.angleDeg) = v;
      });
    });
  }
  layout->addWidget(new QLabel(tr("Extra E-type strain per manifold (defect frame, added to the tensor)")));
  layout->addLayout(eg);
  return section(tr("Strain"), layout);
}

QWidget* SetupPanel::buildDetection() {
  auto* form = new QFormLayout;
  temperature_ = spinBox(0, 400, 2, " K");
  populations_ = new QComboBox;
  populations_->addItems({tr("thermal (Boltzmann)"), tr("equal")});
  collection_ = new Vec3Edit(-10, 10, 3);
  analyserOn_ = new QCheckBox(tr("linear analyser at"));
  analyserAngle_ = spinBox(-360, 360, 1, "\u00b0 from lab x");
  auto* analyserRow = new QHBoxLayout;
  analyserRow->addWidget(analyserOn_);
  analyserRow->addWidget(analyserAngle_);
  broadening_ = spinBox(0, 1e4, 3, " GHz");
  form->addRow(tr("Temperature"), temperature_);
  form->addRow(tr("Populations"), populations_);
  form->addRow(tr("Collection direction (lab)"), collection_);
  form->addRow(tr("Analyser (lab xy plane)"), analyserRow);
  form->addRow(tr("Extra broadening (FWHM)"), broadening_);
  connect(temperature_, &QDoubleSpinBox::valueChanged, this, [this](double v) {
    document_.edit(tr("Temperature"), Change::Conditions, [&](Project& p) { p.conditions.temperatureK = v; });
  });
  connect(populations_, &QComboBox::activated, this, [this](int i) {
    document_.edit(tr("Populations"), Change::Conditions, [&](Project& p) {
      p.conditions.populations = i == 0 ? PopulationModel::Thermal : PopulationModel::Equal;
    });
  });
  connect(collection_, &Vec3Edit::edited, this, [this](const Vec3& v) {
    if (v.norm() < 1e-12) return;
    document_.edit(tr("Collection direction"), Change::Conditions, [&](Project& p) { p.conditions.collectionLab = v; });
  });
  auto analyser = [this] {
    const bool on = analyserOn_->isChecked();
    const double a = analyserAngle_->value() * std::numbers::pi / 180.0;
    document_.edit(tr("Analyser"), Change::Conditions, [&](Project& p) {
      p.conditions.analyserLab = on ? std::optional<Vec3>(Vec3(std::cos(a), std::sin(a), 0)) : std::nullopt;
    });
  };
  connect(analyserOn_, &QCheckBox::toggled, this, analyser);
  connect(analyserAngle_, &QDoubleSpinBox::valueChanged, this, analyser);
  connect(broadening_, &QDoubleSpinBox::valueChanged, this, [this](double v) {
    document_.edit(tr("Broadening"), Change::Conditions, [&](Project& p) { p.conditions.extraBroadeningGHz = v; });
  });
  return section(tr("Detection"), form);
}

QWidget* SetupPanel::buildSweep() {
  auto* form = new QFormLayout;
  auto* classRow = new QHBoxLayout;
  for (int c = 0; c < 4; ++c) {
    auto* box = new QCheckBox(QString::number(c));
    classes_[static_cast<std::size_t>(c)] = box;
    classRow->addWidget(box);
    connect(box, &QCheckBox::toggled, this, [this] {
      std::vector<int> chosen;
      for (int k = 0; k < 4; ++k)
        if (classes_[static_cast<std::size_t>(k)]->isChecked()) chosen.push_back(k);
      if (chosen.empty()) {
        refresh(Change::Classes);  // at least one class must stay selected
        return;
      }
      document_.edit(tr("Classes"), Change::Classes, [&](Project& p) { p.classes = chosen; });
    });
  }
  form->addRow(tr("Orientation classes computed"), classRow);
  sweep_ = new QComboBox;
  sweepFrom_ = spinBox(-1e4, 1e4, 3, "");
  sweepTo_ = spinBox(-1e4, 1e4, 3, "");
  sweepPoints_ = new QSpinBox;
  sweepPoints_->setRange(2, limits::kMaxSweepPoints);
  sweepPoints_->setKeyboardTracking(false);
  form->addRow(tr("Sweep for the plots"), sweep_);
  form->addRow(tr("from"), sweepFrom_);
  form->addRow(tr("to"), sweepTo_);
  form->addRow(tr("points"), sweepPoints_);
  connect(sweep_, &QComboBox::activated, this, [this](int index) {
    refreshSweep();
    Q_EMIT sweepChosen(index);
  });
  auto editSweep = [this] {
    const int index = sweep_->currentIndex();
    if (index < 0 || static_cast<std::size_t>(index) >= document_.project().sweeps.size()) return;
    const double from = sweepFrom_->value(), to = sweepTo_->value();
    const int points = sweepPoints_->value();
    if (from == to) return;
    document_.edit(tr("Sweep range"), Change::Sweeps, [&](Project& p) {
      SweepSpec& s = p.sweeps[static_cast<std::size_t>(index)];
      s.from = s.kind == SweepKind::Magnitude ? std::max(0.0, from) : from;
      s.to = s.kind == SweepKind::Magnitude ? std::max(0.0, to) : to;
      s.points = points;
    });
  };
  connect(sweepFrom_, &QDoubleSpinBox::valueChanged, this, editSweep);
  connect(sweepTo_, &QDoubleSpinBox::valueChanged, this, editSweep);
  connect(sweepPoints_, &QSpinBox::valueChanged, this, editSweep);
  return section(tr("Classes and sweep"), form);
}

void SetupPanel::refresh(Changes what) {
  const Project& p = document_.project();
  if (what & Change::Centre) refreshCentre();
  if (what & (Change::Field | Change::Sample)) refreshField();
  if (what & Change::Sample) {
    normal_->setValue(p.sample.normal);
    inPlane_->setValue(p.sample.inPlaneX);
    sampleMessage_->clear();
  }
  if (what & Change::Strain) {
    for (std::size_t i = 0; i < 6; ++i) {
      const QSignalBlocker block(strain_[i]);
      const auto [r, c] = kStrainIndex[i];
      strain_[i]->setValue(p.strain.crystal(r, c) / kStrainScale);
    }
    const std::array<double, 4> eg{p.strain.extraGround.magnitudeGHz, p.strain.extraGround.angleDeg,
                                   p.strain.extraExcited.magnitudeGHz, p.strain.extraExcited.angleDeg};
    for (std::size_t i = 0; i < 4; ++i) {
      const QSignalBlocker block(egStrain_[i]);
      egStrain_[i]->setValue(eg[i]);
    }
  }
  if (what & Change::Conditions) {
    const QSignalBlocker a(temperature_), b(populations_), c(analyserOn_), d(analyserAngle_), e(broadening_);
    temperature_->setValue(p.conditions.temperatureK);
    populations_->setCurrentIndex(p.conditions.populations == PopulationModel::Thermal ? 0 : 1);
    collection_->setValue(p.conditions.collectionLab);
    analyserOn_->setChecked(p.conditions.analyserLab.has_value());
    if (p.conditions.analyserLab)
      analyserAngle_->setValue(std::atan2((*p.conditions.analyserLab)[1], (*p.conditions.analyserLab)[0]) * 180 / std::numbers::pi);
    broadening_->setValue(p.conditions.extraBroadeningGHz);
  }
  if (what & Change::Classes)
    for (int c = 0; c < 4; ++c) {
      const QSignalBlocker block(classes_[static_cast<std::size_t>(c)]);
      classes_[static_cast<std::size_t>(c)]->setChecked(std::find(p.classes.begin(), p.classes.end(), c) != p.classes.end());
    }
  if (what & Change::Sweeps) refreshSweep();
}

void SetupPanel::refreshCentre() {
  const Project& p = document_.project();
  {
    const QSignalBlocker a(preset_), b(isotope_);
    preset_->setCurrentIndex(preset_->findData(QString::fromStdString(p.centre.preset)));
    isotope_->clear();
    isotope_->addItem(tr("none (no nuclear spin)"), QString());
    try {
      for (const auto& [name, values] : findPreset(p.centre.preset).isotopes)
        isotope_->addItem(QString::fromStdString(name), QString::fromStdString(name));
    } catch (const InputError&) {
    }
    isotope_->setCurrentIndex(std::max(0, isotope_->findData(QString::fromStdString(p.centre.isotope.value_or("")))));
  }
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
      item->setToolTip(QString::fromUtf8(info.meaning.data(), static_cast<qsizetype>(info.meaning.size())) +
                       "\n" + tr("status: %1\nsource: %2").arg(status, QString::fromStdString(v.source)));
      parameters_->setItem(row, c, item);
    }
  }
  parameters_->resizeColumnsToContents();
}

void SetupPanel::refreshField() {
  const Project& p = document_.project();
  const FieldSetting& f = p.field;
  const int index = f.form == FieldSetting::Form::Angles ? 0 : f.form == FieldSetting::Form::VectorLab ? 1 : 2;
  {
    const QSignalBlocker block(fieldForm_);
    fieldForm_->setCurrentIndex(index);
  }
  fieldPages_->setCurrentIndex(index == 0 ? 0 : 1);
  magnitude_->setValue(f.magnitudeT);
  polar_->setValue(f.polarDeg);
  azimuth_->setValue(f.azimuthDeg);
  fieldVector_->setValue(f.vector);
  try {
    const LabFrame lab(p.sample.normal, p.sample.inPlaneX);
    const Vec3 l = f.labVector(lab), c = f.crystalVector(lab);
    QString summary = tr("lab (%1, %2, %3) T    crystal (%4, %5, %6) T")
                          .arg(l[0], 0, 'f', 4).arg(l[1], 0, 'f', 4).arg(l[2], 0, 'f', 4)
                          .arg(c[0], 0, 'f', 4).arg(c[1], 0, 'f', 4).arg(c[2], 0, 'f', 4);
    if (!p.magnet.isNominal()) {  // a fitted calibration is in the project: show what the centres see
      const Vec3 t = projectFieldCrystal(p, lab);
      summary += tr("\ncalibrated (scale %1, tilt %2° toward %3°): crystal (%4, %5, %6) T")
                     .arg(p.magnet.fieldScale, 0, 'f', 5).arg(p.magnet.tiltDeg, 0, 'f', 3)
                     .arg(p.magnet.tiltAzimuthDeg, 0, 'f', 1)
                     .arg(t[0], 0, 'f', 4).arg(t[1], 0, 'f', 4).arg(t[2], 0, 'f', 4);
    }
    fieldSummary_->setText(summary);
  } catch (const InputError& e) {
    fieldSummary_->setText(QString::fromStdString(e.what()));
  }
}

void SetupPanel::refreshSweep() {
  const Project& p = document_.project();
  const QSignalBlocker a(sweep_), b(sweepFrom_), c(sweepTo_), d(sweepPoints_);
  const int current = std::max(0, sweep_->currentIndex());
  sweep_->clear();
  for (const SweepSpec& s : p.sweeps) sweep_->addItem(QString::fromStdString(s.name.empty() ? "(unnamed sweep)" : s.name));
  if (p.sweeps.empty()) sweep_->addItem(tr("field magnitude 0\u20133 T (default)"));
  sweep_->setCurrentIndex(std::min(current, sweep_->count() - 1));
  const bool editable = static_cast<std::size_t>(sweep_->currentIndex()) < p.sweeps.size();
  for (QWidget* w : {static_cast<QWidget*>(sweepFrom_), static_cast<QWidget*>(sweepTo_), static_cast<QWidget*>(sweepPoints_)})
    w->setEnabled(editable);
  if (editable) {
    const SweepSpec& s = p.sweeps[static_cast<std::size_t>(sweep_->currentIndex())];
    sweepFrom_->setValue(s.from);
    sweepTo_->setValue(s.to);
    sweepPoints_->setValue(s.points);
  }
}

}  // namespace finestra::ui
