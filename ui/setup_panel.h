#pragma once
// The setup side panel: centre and isotope with the provenance table, sample orientation, magnet,
// strain, detection, classes and the active sweep. Every change goes to the document as an
// undoable edit; the panel refreshes itself from the document's changed() signal.
#include <QScrollArea>
#include <array>

#include "ui/document.h"

class QCheckBox;
class QComboBox;
class QDoubleSpinBox;
class QLabel;
class QSpinBox;
class QStackedWidget;
class QTableWidget;

namespace finestra::ui {

class SliderSpin;
class Vec3Edit;

class SetupPanel : public QScrollArea {
  Q_OBJECT
public:
  explicit SetupPanel(ProjectDocument& document, QWidget* parent = nullptr);
  int sweepIndex() const;

Q_SIGNALS:
  /// The user picked another sweep for the plots (a display choice, not a project edit).
  void sweepChosen(int index);

private:
  QWidget* buildCentre();
  QWidget* buildSample();
  QWidget* buildField();
  QWidget* buildStrain();
  QWidget* buildDetection();
  QWidget* buildSweep();
  void refresh(Changes what);
  void refreshCentre();
  void refreshField();
  void refreshSweep();
  void editField(const QString& text, const std::function<void(FieldSetting&)>& change, const QString& mergeKey = {});
  void connectDrag(SliderSpin* control);

  ProjectDocument& document_;
  QComboBox* preset_ = nullptr;
  QComboBox* isotope_ = nullptr;
  QTableWidget* parameters_ = nullptr;
  Vec3Edit* normal_ = nullptr;
  Vec3Edit* inPlane_ = nullptr;
  QLabel* sampleMessage_ = nullptr;
  QComboBox* fieldForm_ = nullptr;
  QStackedWidget* fieldPages_ = nullptr;
  SliderSpin* magnitude_ = nullptr;
  SliderSpin* polar_ = nullptr;
  SliderSpin* azimuth_ = nullptr;
  Vec3Edit* fieldVector_ = nullptr;
  QLabel* fieldSummary_ = nullptr;
  std::array<QDoubleSpinBox*, 6> strain_{};
  std::array<QDoubleSpinBox*, 4> egStrain_{};
  QDoubleSpinBox* temperature_ = nullptr;
  QComboBox* populations_ = nullptr;
  Vec3Edit* collection_ = nullptr;
  QCheckBox* analyserOn_ = nullptr;
  QDoubleSpinBox* analyserAngle_ = nullptr;
  QDoubleSpinBox* broadening_ = nullptr;
  std::array<QCheckBox*, 4> classes_{};
  QComboBox* sweep_ = nullptr;
  QDoubleSpinBox* sweepFrom_ = nullptr;
  QDoubleSpinBox* sweepTo_ = nullptr;
  QSpinBox* sweepPoints_ = nullptr;
};

}  // namespace finestra::ui
