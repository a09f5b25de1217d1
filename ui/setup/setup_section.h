#pragma once
// One section of the setup panel (centre, sample, field, strain, conditions, classes and sweep):
// a group box that edits one part of the project through the document and refreshes itself when,
// and only when, a change touches the parts it shows.
#include <QGroupBox>

#include "ui/document.h"

namespace finestra::ui {

class SetupSection : public QGroupBox {
  Q_OBJECT
public:
  SetupSection(const QString& title, ProjectDocument& document, QWidget* parent = nullptr);
  /// The parts of the project the section shows.
  virtual Changes shows() const = 0;

Q_SIGNALS:
  /// The section re-read the project (after a change it shows).
  void refreshed();

protected:
  /// Re-reads the shown parts from the document without emitting edits. Derived constructors
  /// call it once at their end.
  virtual void refresh() = 0;
  ProjectDocument& document() const { return document_; }

private:
  void onChanged(Changes what);

  ProjectDocument& document_;
};

}  // namespace finestra::ui
