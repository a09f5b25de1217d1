#pragma once
// A Python progress callback as core's ProgressControl. The callback gets the finished fraction
// (0..1) and may return False to cancel; it runs with the GIL held, at most about every 1 % of
// progress, from whichever worker thread reports. An exception raised by the callback cancels the
// computation and is raised again to the caller by rethrowIfFailed().
#include <pybind11/pybind11.h>

#include <atomic>
#include <exception>
#include <mutex>

#include "core/common/progress.h"

namespace finestra::python {

class PythonProgress {
public:
  explicit PythonProgress(pybind11::object callback) : callback_(std::move(callback)) {}

  /// The control to hand to core. Valid while this object lives.
  ProgressControl control() {
    ProgressControl c;
    c.cancel = &cancel_;
    if (!callback_.is_none()) c.report = [this](double fraction) { report(fraction); };
    return c;
  }

  /// Call with the GIL held, after the computation.
  void rethrowIfFailed() {
    if (error_) std::rethrow_exception(std::exchange(error_, nullptr));
  }

private:
  void report(double fraction) {
    std::lock_guard lock(mutex_);
    if (cancel_.load() || (fraction < lastReported_ + 0.01 && fraction < 1.0)) return;
    lastReported_ = fraction;
    pybind11::gil_scoped_acquire gil;
    try {
      const pybind11::object answer = callback_(fraction);
      if (!answer.is_none() && !answer.cast<bool>()) cancel_.store(true);
    } catch (...) {
      error_ = std::current_exception();
      cancel_.store(true);
    }
  }

  pybind11::object callback_;
  std::atomic<bool> cancel_{false};
  std::mutex mutex_;
  double lastReported_ = -1.0;
  std::exception_ptr error_;
};

}  // namespace finestra::python

namespace finestra::python {

/// Runs body(control) with the GIL released; the callback's own exception wins over Cancelled.
template <typename Body>
auto computeWithoutGil(PythonProgress& progress, Body body) {
  try {
    auto result = [&] {
      pybind11::gil_scoped_release release;
      return body(progress.control());
    }();
    progress.rethrowIfFailed();
    return result;
  } catch (const Cancelled&) {
    progress.rethrowIfFailed();
    throw;
  }
}

}  // namespace finestra::python
