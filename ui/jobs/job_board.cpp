#include "ui/jobs/job_board.h"

#include <algorithm>

#include "ui/jobs/job_runner.h"

namespace finestra::ui {

void JobBoard::add(JobRunner* runner) {
  runners_.emplace_back(runner);
  connect(runner, &JobRunner::busyChanged, this, &JobBoard::update);
  connect(runner, &QObject::destroyed, this, [this] {
    std::erase_if(runners_, [](const QPointer<JobRunner>& r) { return r.isNull(); });
    update();
  });
}

void JobBoard::cancelAll() {
  for (const QPointer<JobRunner>& r : runners_)
    if (r) r->cancel();
}

bool JobBoard::anyBusy() const {
  return std::any_of(runners_.begin(), runners_.end(), [](const QPointer<JobRunner>& r) { return r && r->busy(); });
}

void JobBoard::update() {
  const bool busy = anyBusy();
  if (busy == anyBusy_) return;
  anyBusy_ = busy;
  Q_EMIT anyBusyChanged(busy);
}

}  // namespace finestra::ui
