// The one job runner of the ui layer: cancel, stale results dropped, progress on the GUI thread,
// failures reported, starting a job never waits for the running one, and the board cancels every
// runner (Esc).
#include <QSignalSpy>
#include <QTest>
#include <atomic>
#include <chrono>
#include <gtest/gtest.h>
#include <memory>
#include <stdexcept>
#include <thread>

#include "ui/jobs/job_board.h"
#include "ui/jobs/job_runner.h"

namespace finestra::ui {
namespace {

using namespace std::chrono_literals;
constexpr int kTimeoutMs = 20000;

/// A job that polls its cancel flag until cancelled (or a safety limit, then it delivers).
JobWork untilCancelled(int* deliveredValue, int value) {
  return [deliveredValue, value](const ProgressControl& control) -> JobDelivery {
    for (int i = 0; i < 20000; ++i) {
      control.throwIfCancelled();
      std::this_thread::sleep_for(1ms);
    }
    return [deliveredValue, value] { *deliveredValue = value; };
  };
}

/// Flags shared between a gated job and the test.
struct Gate {
  std::shared_ptr<std::atomic<bool>> started = std::make_shared<std::atomic<bool>>(false);
  std::shared_ptr<std::atomic<bool>> open = std::make_shared<std::atomic<bool>>(false);
  std::shared_ptr<std::atomic<bool>> sawOpen = std::make_shared<std::atomic<bool>>(false);
};

/// A job that ignores cancel and waits for the gate (at most ~20 s), recording whether it opened.
JobWork waitForGate(const Gate& g, int* deliveredValue, int value) {
  return [gate = g.open, sawOpen = g.sawOpen, started = g.started, deliveredValue, value](const ProgressControl&) -> JobDelivery {
    started->store(true);
    for (int i = 0; i < 20000 && !gate->load(); ++i) std::this_thread::sleep_for(1ms);
    sawOpen->store(gate->load());
    return [deliveredValue, value] { *deliveredValue = value; };
  };
}

TEST(JobRunner, CancelStopsTheJobAndDeliversNothing) {
  JobRunner runner("test", nullptr);
  QSignalSpy cancelled(&runner, &JobRunner::cancelled);
  QSignalSpy delivered(&runner, &JobRunner::delivered);
  int value = 0;
  const quint64 job = runner.start(untilCancelled(&value, 1));
  EXPECT_TRUE(runner.busy());
  runner.cancel();
  ASSERT_TRUE(cancelled.count() > 0 || cancelled.wait(kTimeoutMs));
  EXPECT_EQ(cancelled.front().front().value<quint64>(), job);
  EXPECT_EQ(delivered.count(), 0);
  EXPECT_EQ(value, 0);
  EXPECT_FALSE(runner.busy());
}

TEST(JobRunner, OnlyTheNewestJobIsDelivered) {
  JobRunner runner("test", nullptr);
  QSignalSpy delivered(&runner, &JobRunner::delivered);
  QSignalSpy dropped(&runner, &JobRunner::dropped);
  // The first job ignores the cancel and finishes after the second: its result must be dropped.
  Gate gate;
  int value = 0;
  const quint64 first = runner.start(waitForGate(gate, &value, 1));
  QTRY_VERIFY_WITH_TIMEOUT(gate.started->load(), kTimeoutMs);  // running, past its first cancel check
  const quint64 second = runner.start([&value](const ProgressControl&) -> JobDelivery {
    return [&value] { value = 2; };
  });
  ASSERT_TRUE(delivered.count() > 0 || delivered.wait(kTimeoutMs));
  EXPECT_EQ(delivered.front().front().value<quint64>(), second);
  EXPECT_EQ(value, 2);
  gate.open->store(true);
  ASSERT_TRUE(dropped.count() > 0 || dropped.wait(kTimeoutMs));
  EXPECT_EQ(dropped.front().front().value<quint64>(), first);
  QTest::qWait(50);
  EXPECT_EQ(value, 2);  // the stale result never replaced the newer one
  EXPECT_EQ(delivered.count(), 1);
  EXPECT_FALSE(runner.busy());
}

TEST(JobRunner, StartingWhileAJobRunsDoesNotWaitForIt) {
  // The running job ignores its cancel and waits for a gate that only this (GUI) thread opens,
  // after start() has returned. Had start() waited for the running job, the gate would have
  // stayed shut until the job's safety limit, and sawOpen would be false.
  JobRunner runner("test", nullptr);
  QSignalSpy delivered(&runner, &JobRunner::delivered);
  QSignalSpy dropped(&runner, &JobRunner::dropped);
  Gate gate;
  int value = 0;
  runner.start(waitForGate(gate, &value, 1));
  QTRY_VERIFY_WITH_TIMEOUT(gate.started->load(), kTimeoutMs);
  runner.start([&value](const ProgressControl&) -> JobDelivery { return [&value] { value = 2; }; });
  gate.open->store(true);
  ASSERT_TRUE(dropped.count() > 0 || dropped.wait(kTimeoutMs));
  EXPECT_TRUE(gate.sawOpen->load());
  QTRY_COMPARE_WITH_TIMEOUT(value, 2, kTimeoutMs);
}

TEST(JobRunner, ProgressReachesTheGuiThreadInOrder) {
  JobRunner runner("test", nullptr);
  QSignalSpy progress(&runner, &JobRunner::progress);
  QSignalSpy delivered(&runner, &JobRunner::delivered);
  runner.start([](const ProgressControl& control) -> JobDelivery {
    for (double f : {0.25, 0.5, 0.4, 1.0}) {  // 0.4 < 0.5: a late report of another thread
      control.progress(f);
      std::this_thread::sleep_for(20ms);
    }
    return [] {};
  });
  ASSERT_TRUE(delivered.wait(kTimeoutMs));
  ASSERT_FALSE(progress.isEmpty());
  double last = 0;
  for (const auto& args : progress) {
    const double f = args.front().toDouble();
    EXPECT_GE(f, last);
    EXPECT_LE(f, 1.0);
    last = f;
  }
  EXPECT_DOUBLE_EQ(last, 1.0);
}

TEST(JobRunner, FailureIsReportedWithItsMessage) {
  JobRunner runner("test", nullptr);
  QSignalSpy failed(&runner, &JobRunner::failed);
  runner.start([](const ProgressControl&) -> JobDelivery { throw std::runtime_error("no model: centre.preset"); });
  ASSERT_TRUE(failed.wait(kTimeoutMs));
  EXPECT_EQ(failed.front().at(1).toString(), QStringLiteral("no model: centre.preset"));
  EXPECT_FALSE(runner.busy());
}

TEST(JobBoard, CancelAllStopsEveryRunnerAndTracksBusy) {
  JobBoard board;
  JobRunner a("a", &board), b("b", &board);
  QSignalSpy busy(&board, &JobBoard::anyBusyChanged);
  QSignalSpy cancelledA(&a, &JobRunner::cancelled), cancelledB(&b, &JobRunner::cancelled);
  int value = 0;
  a.start(untilCancelled(&value, 1));
  b.start(untilCancelled(&value, 2));
  EXPECT_TRUE(board.anyBusy());
  board.cancelAll();
  ASSERT_TRUE(cancelledA.count() > 0 || cancelledA.wait(kTimeoutMs));
  ASSERT_TRUE(cancelledB.count() > 0 || cancelledB.wait(kTimeoutMs));
  EXPECT_FALSE(board.anyBusy());
  EXPECT_EQ(value, 0);
  ASSERT_EQ(busy.count(), 2);  // became busy once, idle once
  EXPECT_TRUE(busy.at(0).front().toBool());
  EXPECT_FALSE(busy.at(1).front().toBool());
}

}  // namespace
}  // namespace finestra::ui
