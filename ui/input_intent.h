#pragma once
// No value changes without intent. One application-wide event filter per main window:
// - a wheel turned over an input box (spin box, slider, combo box) that does not have the keyboard
//   focus scrolls the panel around it instead of changing the value, and input boxes take focus by
//   click or Tab only (Qt::StrongFocus), never by the wheel;
// - wheel turns, key presses and the commit on leaving a focused input box run as one input
//   session of the document, so all edits of one box during one focus are one undo step;
// - the undo and redo keys always mean the document's undo and redo, also while a text or
//   number field has focus (its own text undo would otherwise take the key).
#include <QObject>
#include <QPointer>

namespace finestra::ui {

class ProjectDocument;

class InputIntentGuard : public QObject {
  Q_OBJECT
public:
  /// Guards the inputs inside `window` (the guard's parent) and installs itself on the application.
  InputIntentGuard(ProjectDocument& document, QWidget& window);
  ~InputIntentGuard() override;

  bool eventFilter(QObject* watched, QEvent* event) override;

  /// True for the widgets whose value a wheel or key changes: spin boxes, sliders (not scroll
  /// bars) and combo boxes.
  static bool isValueInput(const QObject* object);

private:
  bool redirectWheel(QWidget& input, QEvent& event);
  bool deliverAsOneEdit(QWidget& input, QEvent& event);

  ProjectDocument& document_;
  QWidget& window_;
  QPointer<QWidget> sessionInput_;  ///< the input box of the current focus session
  quint64 session_ = 0;             ///< numbers the focus sessions
  bool delivering_ = false;
};

}  // namespace finestra::ui
