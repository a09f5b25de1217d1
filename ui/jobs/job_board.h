#pragma once
// Every job runner of one window registers here, so that one command (Esc, Edit → Cancel) stops
// whichever job runs, and the status bar shows one busy indicator for all of them.
#include <QObject>
#include <QPointer>
#include <vector>

namespace finestra::ui {

class JobRunner;

class JobBoard : public QObject {
  Q_OBJECT
public:
  using QObject::QObject;

  /// Called by JobRunner's constructor; the runner leaves the board when it is destroyed.
  void add(JobRunner* runner);
  /// Cancels the running job of every runner.
  void cancelAll();
  bool anyBusy() const;

Q_SIGNALS:
  /// Some runner started or finished, and the "any job running" state changed.
  void anyBusyChanged(bool busy);

private:
  void update();

  std::vector<QPointer<JobRunner>> runners_;
  bool anyBusy_ = false;
};

}  // namespace finestra::ui
