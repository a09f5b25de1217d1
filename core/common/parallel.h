#pragma once
// A minimal parallel-for over an index range on std::threads (no pool: calls are coarse).
#include <algorithm>
#include <exception>
#include <functional>
#include <thread>
#include <vector>

namespace finestra {

/// Number of worker threads used by core (hardware concurrency, at least 1).
inline int workerCount() { return std::max(1, static_cast<int>(std::thread::hardware_concurrency())); }

/// Runs body(begin, end) on contiguous chunks of [0, n) in parallel; rethrows the first exception.
inline void parallelChunks(long n, const std::function<void(long begin, long end)>& body, int threads = 0) {
  if (threads <= 0) threads = workerCount();
  threads = static_cast<int>(std::min<long>(threads, std::max<long>(n, 1)));
  if (threads == 1) {
    body(0, n);
    return;
  }
  std::vector<std::thread> pool;
  std::vector<std::exception_ptr> errors(static_cast<std::size_t>(threads));
  for (int t = 0; t < threads; ++t) {
    const long b = n * t / threads, e = n * (t + 1) / threads;
    pool.emplace_back([&, t, b, e] {
      try {
        body(b, e);
      } catch (...) {
        errors[static_cast<std::size_t>(t)] = std::current_exception();
      }
    });
  }
  for (auto& th : pool) th.join();
  for (auto& err : errors)
    if (err) std::rethrow_exception(err);
}

}  // namespace finestra
