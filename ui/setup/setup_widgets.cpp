#include "ui/setup/setup_widgets.h"

#include <QHBoxLayout>
#include <QSignalBlocker>
#include <algorithm>
#include <cmath>

#include "core/centre/parameter_table.h"

namespace finestra::ui {

SliderSpin::SliderSpin(double minimum, double maximum, double step, int decimals, const QString& suffix, QWidget* parent)
    : QWidget(parent), slider_(new QSlider(Qt::Horizontal, this)), spin_(new QDoubleSpinBox(this)), step_(step) {
  auto* layout = new QHBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  layout->addWidget(slider_, 1);
  layout->addWidget(spin_);
  spin_->setRange(minimum, maximum);
  spin_->setDecimals(decimals);
  spin_->setSingleStep(step);
  spin_->setSuffix(suffix);
  spin_->setKeyboardTracking(false);
  spin_->setMinimumWidth(96);
  slider_->setRange(toSlider(minimum), toSlider(maximum));
  connect(slider_, &QSlider::sliderPressed, this, &SliderSpin::dragStarted);
  connect(slider_, &QSlider::sliderReleased, this, &SliderSpin::dragFinished);
  connect(slider_, &QSlider::valueChanged, this, [this](int v) {
    const double value = v * step_;
    {
      const QSignalBlocker block(spin_);
      spin_->setValue(value);
    }
    Q_EMIT edited(value);
  });
  connect(spin_, &QDoubleSpinBox::valueChanged, this, [this](double v) {
    {
      const QSignalBlocker block(slider_);
      slider_->setValue(toSlider(v));
    }
    Q_EMIT edited(v);
  });
}

int SliderSpin::toSlider(double v) const { return static_cast<int>(std::lround(v / step_)); }

void SliderSpin::setValue(double value) {
  const QSignalBlocker a(slider_), b(spin_);
  spin_->setValue(value);
  slider_->setValue(toSlider(value));
}

QDoubleSpinBox* makeSpinBox(double minimum, double maximum, int decimals, const QString& suffix) {
  auto* s = new QDoubleSpinBox;
  s->setRange(minimum, maximum);
  s->setDecimals(decimals);
  s->setSuffix(suffix);
  s->setKeyboardTracking(false);
  return s;
}

Vec3Edit::Vec3Edit(double minimum, double maximum, int decimals, QWidget* parent) : QWidget(parent) {
  auto* layout = new QHBoxLayout(this);
  layout->setContentsMargins(0, 0, 0, 0);
  for (auto& s : spins_) {
    s = new QDoubleSpinBox(this);
    s->setRange(minimum, maximum);
    s->setDecimals(decimals);
    s->setKeyboardTracking(false);
    layout->addWidget(s);
    connect(s, &QDoubleSpinBox::valueChanged, this, [this] { Q_EMIT edited(value()); });
  }
}

Vec3 Vec3Edit::value() const { return Vec3(spins_[0]->value(), spins_[1]->value(), spins_[2]->value()); }

void Vec3Edit::setValue(const Vec3& v) {
  for (int i = 0; i < 3; ++i) {
    const QSignalBlocker block(spins_[static_cast<std::size_t>(i)]);
    spins_[static_cast<std::size_t>(i)]->setValue(v[i]);
  }
}

namespace {
QString toolTipOf(const QuantitySpec& q) {
  return QString::fromStdString(q.help + " (" + rangeText(q) + ")");
}
}  // namespace

void applyQuantity(QDoubleSpinBox* spin, std::string_view key, double displayScale) {
  const QuantitySpec& q = quantity(key);
  spin->setRange(q.minimum * displayScale, q.maximum * displayScale);
  spin->setSingleStep(q.guiStep * displayScale);
  spin->setToolTip(toolTipOf(q));
  spin->setObjectName(QString::fromStdString(q.key));
}

void applyQuantity(QSpinBox* spin, std::string_view key) {
  const QuantitySpec& q = quantity(key);
  spin->setRange(static_cast<int>(q.minimum), static_cast<int>(q.maximum));
  spin->setSingleStep(std::max(1, static_cast<int>(q.guiStep)));
  spin->setToolTip(toolTipOf(q));
  spin->setObjectName(QString::fromStdString(q.key));
}

SliderSpin* quantitySliderSpin(std::string_view key, int decimals, const QString& suffix) {
  const QuantitySpec& q = quantity(key);
  auto* s = new SliderSpin(q.minimum, q.maximum, q.guiStep, decimals, suffix);
  s->setToolTip(toolTipOf(q));
  s->spin()->setToolTip(toolTipOf(q));
  s->spin()->setObjectName(QString::fromStdString(q.key));
  return s;
}

}  // namespace finestra::ui
