#pragma once
// Setup section "Magnet": the field as set on the magnet, either as magnitude and lab angles
// (sliders, a drag is one undo step) or as a vector in lab or crystal axes, with a summary of the
// field in both frames and, when the project has a magnet calibration, the true field.
#include "ui/setup/setup_section.h"

class QComboBox;
class QLabel;
class QStackedWidget;

namespace finestra::ui {

class SliderSpin;
class Vec3Edit;

class FieldSection : public SetupSection {
  Q_OBJECT
public:
  explicit FieldSection(ProjectDocument& document, QWidget* parent = nullptr);
  /// The lab frame comes from the sample, the true field from the calibration.
  Changes shows() const override { return Changes(Change::Field) | Change::Sample | Change::Magnet; }
  /// The summary line (for tests): nominal field in lab and crystal axes, and the calibrated one.
  QString summary() const;

protected:
  void refresh() override;

private:
  void editField(const QString& text, const std::function<void(FieldSetting&)>& change, const QString& mergeKey = {});
  void changeForm(int index);
  void connectDrag(SliderSpin* control);
  void refreshSummary();

  QComboBox* form_ = nullptr;
  QStackedWidget* pages_ = nullptr;
  SliderSpin* magnitude_ = nullptr;
  SliderSpin* polar_ = nullptr;
  SliderSpin* azimuth_ = nullptr;
  Vec3Edit* vector_ = nullptr;
  QLabel* summary_ = nullptr;
};

}  // namespace finestra::ui
