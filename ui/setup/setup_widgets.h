#pragma once
// Small input widgets of the setup panel: a slider coupled to a spin box (drags reported so the
// document can merge them into one undo step), a three-component vector editor and a spin box
// that reports only finished entries.
#include <QDoubleSpinBox>
#include <QSlider>
#include <QSpinBox>
#include <QWidget>
#include <array>
#include <string_view>

#include "core/centre/parameter_table.h"  // quantity(): the sections size their boxes from the table
#include "core/common/types.h"

namespace finestra::ui {

class SliderSpin : public QWidget {
  Q_OBJECT
public:
  SliderSpin(double minimum, double maximum, double step, int decimals, const QString& suffix, QWidget* parent = nullptr);
  double value() const { return spin_->value(); }
  /// Sets the shown value without emitting edited().
  void setValue(double value);
  QDoubleSpinBox* spin() const { return spin_; }
  QSlider* slider() const { return slider_; }

Q_SIGNALS:
  void edited(double value);
  void dragStarted();
  void dragFinished();

private:
  int toSlider(double v) const;
  QSlider* slider_ = nullptr;
  QDoubleSpinBox* spin_ = nullptr;
  double step_ = 1;
};

/// A spin box with range, decimals and suffix that reports a value only when the entry is finished.
QDoubleSpinBox* makeSpinBox(double minimum, double maximum, int decimals, const QString& suffix);

class Vec3Edit : public QWidget {
  Q_OBJECT
public:
  Vec3Edit(double minimum, double maximum, int decimals, QWidget* parent = nullptr);
  Vec3 value() const;
  /// Sets the shown vector without emitting edited().
  void setValue(const Vec3& v);

Q_SIGNALS:
  void edited(const finestra::Vec3& value);

private:
  std::array<QDoubleSpinBox*, 3> spins_{};
};

/// Range, single step and tooltip of `spin` from the parameter table entry `key` (the same range the
/// project reader accepts); `displayScale` is the shown value per stored value (1e6 for strain shown
/// in units of 1e-6). The spin box's object name becomes the key.
void applyQuantity(QDoubleSpinBox* spin, std::string_view key, double displayScale = 1);
/// The same for a whole-number spin box.
void applyQuantity(QSpinBox* spin, std::string_view key);
/// A slider + spin box whose range, step and tooltip come from the parameter table entry `key`.
SliderSpin* quantitySliderSpin(std::string_view key, int decimals, const QString& suffix);

}  // namespace finestra::ui
