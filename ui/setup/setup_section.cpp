#include "ui/setup/setup_section.h"

namespace finestra::ui {

SetupSection::SetupSection(const QString& title, ProjectDocument& document, QWidget* parent)
    : QGroupBox(title, parent), document_(document) {
  connect(&document_, &ProjectDocument::changed, this, &SetupSection::onChanged);
}

void SetupSection::onChanged(Changes what) {
  if (!(what & shows())) return;
  refresh();
  Q_EMIT refreshed();
}

}  // namespace finestra::ui
