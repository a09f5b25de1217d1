"""Long computations release the GIL; progress callbacks report and can cancel."""
import threading
import time

import pytest

import finestra


def test_a_second_python_thread_runs_during_a_long_call(demo_path):
    # One long C++ call: a one-degree planner map (tens of thousands of diagonalisations).
    project = finestra.load_project(demo_path)
    ticks = []
    stop = threading.Event()

    def count():
        while not stop.is_set():
            ticks.append(time.perf_counter())
            time.sleep(0.001)

    started = time.perf_counter()
    worker = threading.Thread(target=count)
    worker.start()
    try:
        time.sleep(0.02)
        fit_started = time.perf_counter()
        finestra.plan_map(project, step_deg=1)
        fit_ended = time.perf_counter()
    finally:
        stop.set()
        worker.join()
    during = [t for t in ticks if fit_started < t < fit_ended]
    assert fit_ended - fit_started > 0.05, "the call was too short to tell"
    # With the GIL held for the whole call the counter could not tick at all inside it.
    assert len(during) >= 10, (len(during), fit_ended - fit_started, started)


def test_progress_reaches_the_end(fit_demo_path):
    fractions = []
    finestra.fit(finestra.load_project(fit_demo_path), starts=2, progress=fractions.append)
    assert fractions and fractions[-1] == pytest.approx(1.0)
    assert all(0.0 <= f <= 1.0 for f in fractions)


def test_returning_false_cancels(demo_path):
    calls = []

    def stop_at_once(fraction):
        calls.append(fraction)
        return False

    with pytest.raises(finestra.Cancelled):
        finestra.plan_map(finestra.load_project(demo_path), step_deg=2, progress=stop_at_once)
    assert len(calls) == 1


def test_an_exception_in_the_callback_reaches_the_caller(demo_path):
    def broken(fraction):
        raise KeyError("from the callback")

    with pytest.raises(KeyError, match="from the callback"):
        finestra.sweep(finestra.load_project(demo_path), progress=broken)
