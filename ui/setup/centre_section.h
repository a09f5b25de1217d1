#pragma once
// Setup section "Centre and parameters": preset, isotope and the table of every parameter with its
// value, unit, status and source; a value typed into the table overrides the preset.
#include "ui/setup/setup_section.h"

class QComboBox;
class QTableWidget;
class QTableWidgetItem;

namespace finestra::ui {

class CentreSection : public SetupSection {
  Q_OBJECT
public:
  explicit CentreSection(ProjectDocument& document, QWidget* parent = nullptr);
  Changes shows() const override { return Change::Centre; }

protected:
  void refresh() override;

private:
  void refreshChoice();
  void refreshParameters();
  void onValueEdited(QTableWidgetItem* item);
  void restoreSelected();

  QComboBox* preset_ = nullptr;
  QComboBox* isotope_ = nullptr;
  QTableWidget* parameters_ = nullptr;
};

}  // namespace finestra::ui
