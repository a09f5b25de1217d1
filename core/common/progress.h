#pragma once
// Cooperative cancellation and progress reporting for long computations.
#include <atomic>
#include <functional>
#include <stdexcept>

namespace finestra {

/// Thrown by a computation that saw its cancel flag set.
class Cancelled : public std::runtime_error {
public:
  Cancelled() : std::runtime_error("computation cancelled") {}
};

struct ProgressControl {
  const std::atomic<bool>* cancel = nullptr;      ///< set by the caller to stop the work
  std::function<void(double fraction)> report;    ///< called from the computing thread(s)

  bool cancelled() const { return cancel && cancel->load(std::memory_order_relaxed); }
  void throwIfCancelled() const {
    if (cancelled()) throw Cancelled();
  }
  void progress(double fraction) const {
    if (report) report(fraction);
  }
};

}  // namespace finestra
