#include "ui/setup/sweep_section.h"

#include <QCheckBox>
#include <QComboBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QSignalBlocker>
#include <QSpinBox>
#include <algorithm>

#include "ui/setup/setup_widgets.h"

namespace finestra::ui {

SweepSection::SweepSection(ProjectDocument& document, QWidget* parent)
    : SetupSection(tr("Classes and sweep"), document, parent) {
  auto* form = new QFormLayout(this);
  auto* classRow = new QHBoxLayout;
  for (int c = 0; c < 4; ++c) {
    auto* box = new QCheckBox(QString::number(c));
    classes_[static_cast<std::size_t>(c)] = box;
    classRow->addWidget(box);
    connect(box, &QCheckBox::toggled, this, &SweepSection::applyClasses);
  }
  form->addRow(tr("Orientation classes computed"), classRow);
  sweep_ = new QComboBox;
  from_ = makeSpinBox(-1e4, 1e4, 3, "");
  to_ = makeSpinBox(-1e4, 1e4, 3, "");
  points_ = new QSpinBox;
  applyQuantity(points_, "sweeps.points");
  points_->setKeyboardTracking(false);
  form->addRow(tr("Sweep for the plots"), sweep_);
  form->addRow(tr("from"), from_);
  form->addRow(tr("to"), to_);
  form->addRow(tr("points"), points_);
  connect(sweep_, &QComboBox::activated, this, [this](int index) {
    refreshSweep();
    Q_EMIT sweepChosen(index);
  });
  connect(from_, &QDoubleSpinBox::valueChanged, this, &SweepSection::applySweepRange);
  connect(to_, &QDoubleSpinBox::valueChanged, this, &SweepSection::applySweepRange);
  connect(points_, &QSpinBox::valueChanged, this, &SweepSection::applySweepRange);
  refresh();
}

int SweepSection::sweepIndex() const { return sweep_->currentIndex(); }

void SweepSection::applyClasses() {
  std::vector<int> chosen;
  for (int k = 0; k < 4; ++k)
    if (classes_[static_cast<std::size_t>(k)]->isChecked()) chosen.push_back(k);
  if (chosen.empty()) {
    refreshClasses();  // at least one class must stay selected
    return;
  }
  document().edit(tr("Classes"), [&](Project& p) { p.classes = chosen; });
}

void SweepSection::applySweepRange() {
  const int index = sweep_->currentIndex();
  if (index < 0 || static_cast<std::size_t>(index) >= document().project().sweeps.size()) return;
  const double from = from_->value(), to = to_->value();
  const int points = points_->value();
  if (from == to) return;
  document().edit(tr("Sweep range"), [&](Project& p) {
    SweepSpec& s = p.sweeps[static_cast<std::size_t>(index)];
    s.from = s.kind == SweepKind::Magnitude ? std::max(0.0, from) : from;
    s.to = s.kind == SweepKind::Magnitude ? std::max(0.0, to) : to;
    s.points = points;
  });
}

void SweepSection::refresh() {
  refreshClasses();
  refreshSweep();
}

void SweepSection::refreshClasses() {
  const std::vector<int>& chosen = document().project().classes;
  for (int c = 0; c < 4; ++c) {
    const QSignalBlocker block(classes_[static_cast<std::size_t>(c)]);
    classes_[static_cast<std::size_t>(c)]->setChecked(std::find(chosen.begin(), chosen.end(), c) != chosen.end());
  }
}

void SweepSection::refreshSweep() {
  const Project& p = document().project();
  const QSignalBlocker a(sweep_), b(from_), c(to_), d(points_);
  const int current = std::max(0, sweep_->currentIndex());
  sweep_->clear();
  for (const SweepSpec& s : p.sweeps) sweep_->addItem(QString::fromStdString(s.name.empty() ? "(unnamed sweep)" : s.name));
  if (p.sweeps.empty()) sweep_->addItem(tr("field magnitude 0\u20133 T (default)"));
  sweep_->setCurrentIndex(std::min(current, sweep_->count() - 1));
  const bool editable = static_cast<std::size_t>(sweep_->currentIndex()) < p.sweeps.size();
  for (QWidget* w : {static_cast<QWidget*>(from_), static_cast<QWidget*>(to_), static_cast<QWidget*>(points_)})
    w->setEnabled(editable);
  if (editable) {
    const SweepSpec& s = p.sweeps[static_cast<std::size_t>(sweep_->currentIndex())];
    from_->setValue(s.from);
    to_->setValue(s.to);
    points_->setValue(s.points);
  }
}

}  // namespace finestra::ui
