#pragma once
// The setup side panel: one small section widget per part of the project (centre, magnet,
// sample, strain, detection, classes and sweep), stacked in a scroll area. Each section edits the
// project through the document and refreshes itself when a change touches what it shows.
#include <QScrollArea>
#include <vector>

#include "ui/document.h"

namespace finestra::ui {

class SetupSection;
class SweepSection;

class SetupPanel : public QScrollArea {
  Q_OBJECT
public:
  explicit SetupPanel(ProjectDocument& document, QWidget* parent = nullptr);
  int sweepIndex() const;
  /// The sections, top to bottom.
  const std::vector<SetupSection*>& sections() const { return sections_; }

Q_SIGNALS:
  /// The user picked another sweep for the plots (a display choice, not a project edit).
  void sweepChosen(int index);

private:
  std::vector<SetupSection*> sections_;
  SweepSection* sweep_ = nullptr;
};

}  // namespace finestra::ui
