#pragma once
// Setup section "Sample orientation": the crystal directions of the sample normal (lab z) and of
// an in-plane direction (lab x); a pair that does not make a frame is explained, not applied.
#include "ui/setup/setup_section.h"

class QLabel;

namespace finestra::ui {

class Vec3Edit;

class SampleSection : public SetupSection {
  Q_OBJECT
public:
  explicit SampleSection(ProjectDocument& document, QWidget* parent = nullptr);
  Changes shows() const override { return Change::Sample; }

protected:
  void refresh() override;

private:
  void apply();

  Vec3Edit* normal_ = nullptr;
  Vec3Edit* inPlane_ = nullptr;
  QLabel* message_ = nullptr;
};

}  // namespace finestra::ui
