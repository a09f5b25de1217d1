#include "ui/input_intent.h"

#include <QAbstractScrollArea>
#include <QAbstractSlider>
#include <QAbstractSpinBox>
#include <QApplication>
#include <QComboBox>
#include <QKeyEvent>
#include <QScrollBar>
#include <QWheelEvent>

#include "ui/document.h"

namespace finestra::ui {
namespace {

bool isUndoOrRedo(const QKeyEvent& key) {
  return key.matches(QKeySequence::Undo) || key.matches(QKeySequence::Redo);
}

/// The nearest scroll area whose viewport holds `widget` (a scroll area's own scroll bars do not count).
QAbstractScrollArea* enclosingScrollArea(QWidget& widget) {
  for (QWidget* w = widget.parentWidget(); w; w = w->parentWidget()) {
    auto* area = qobject_cast<QAbstractScrollArea*>(w->parentWidget());
    if (area && area->viewport() == w) return area;
  }
  return nullptr;
}

/// True when `widget` lies inside `window`, also in a floating dock of it.
bool belongsTo(const QWidget& widget, const QWidget& window) {
  for (const QWidget* w = &widget; w; w = w->parentWidget())
    if (w == &window) return true;
  return false;
}

void takeFocusByClickOrTab(QWidget& input) { input.setFocusPolicy(Qt::StrongFocus); }

}  // namespace

InputIntentGuard::InputIntentGuard(ProjectDocument& document, QWidget& window)
    : QObject(&window), document_(document), window_(window) {
  qApp->installEventFilter(this);
}

InputIntentGuard::~InputIntentGuard() { qApp->removeEventFilter(this); }

bool InputIntentGuard::isValueInput(const QObject* object) {
  if (qobject_cast<const QAbstractSpinBox*>(object) || qobject_cast<const QComboBox*>(object)) return true;
  return qobject_cast<const QAbstractSlider*>(object) && !qobject_cast<const QScrollBar*>(object);
}

bool InputIntentGuard::eventFilter(QObject* watched, QEvent* event) {
  if (delivering_ || !watched->isWidgetType()) return false;
  auto* widget = static_cast<QWidget*>(watched);
  // Every input of the application, also those created later, before the wheel can focus it.
  if (event->type() == QEvent::Polish && isValueInput(widget)) takeFocusByClickOrTab(*widget);
  // Inputs polished before the guard existed (built before the window was assembled).
  if (event->type() == QEvent::Show && widget == &window_)
    for (QWidget* child : window_.findChildren<QWidget*>())
      if (isValueInput(child)) takeFocusByClickOrTab(*child);
  if (!belongsTo(*widget, window_)) return false;
  switch (event->type()) {
    case QEvent::ShortcutOverride:
      // Not accepting the override lets the window's undo/redo shortcut take the key.
      return isUndoOrRedo(*static_cast<QKeyEvent*>(event));
    case QEvent::FocusIn:
      if (isValueInput(widget) && sessionInput_ != widget) {
        sessionInput_ = widget;
        ++session_;
      }
      return false;
    case QEvent::FocusOut:
      if (isValueInput(widget) && sessionInput_ == widget) {
        const bool handled = deliverAsOneEdit(*widget, *event);
        sessionInput_ = nullptr;  // the next focus is a new session, even on the same box
        return handled;
      }
      return false;
    case QEvent::Wheel:
      if (!isValueInput(widget)) return false;
      return widget->hasFocus() ? deliverAsOneEdit(*widget, *event) : redirectWheel(*widget, *event);
    case QEvent::KeyPress:
      if (isValueInput(widget) && widget->hasFocus()) return deliverAsOneEdit(*widget, *event);
      return false;
    default: return false;
  }
}

bool InputIntentGuard::redirectWheel(QWidget& input, QEvent& event) {
  const auto& wheel = static_cast<const QWheelEvent&>(event);
  if (QAbstractScrollArea* area = enclosingScrollArea(input)) {
    QWidget* viewport = area->viewport();
    QWheelEvent forwarded(viewport->mapFromGlobal(wheel.globalPosition()), wheel.globalPosition(), wheel.pixelDelta(),
                          wheel.angleDelta(), wheel.buttons(), wheel.modifiers(), wheel.phase(), wheel.inverted(),
                          wheel.source(), wheel.pointingDevice());
    QCoreApplication::sendEvent(viewport, &forwarded);
  }
  // Accepted either way: the wheel never reaches the unfocused input.
  event.accept();
  return true;
}

bool InputIntentGuard::deliverAsOneEdit(QWidget& input, QEvent& event) {
  if (sessionInput_ != &input) {  // focused before the guard saw a FocusIn
    sessionInput_ = &input;
    ++session_;
  }
  delivering_ = true;
  document_.beginInputEdit(session_);
  QCoreApplication::sendEvent(&input, &event);
  document_.endInputEdit();
  delivering_ = false;
  // The inner delivery already passed the event on to the parents where Qt does so; accepting
  // it here keeps the outer delivery from passing it on a second time.
  event.accept();
  return true;
}

}  // namespace finestra::ui
