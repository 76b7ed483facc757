"""Benchmarks of ``covertree sweep``: a local process pool against a serial run,
and the cost of the results store.

The sweep: genus-2 covers of an elliptic curve for d = 2..6 and genus-3 covers
for d = 2..4, base strata of codimension <= 1 (genus 3 at d = 5 alone takes
minutes over the smooth stratum, so it is left out).  Every run is a fresh
process (cold caches); the outputs of all runs must be byte-identical.

Prints one line per measurement:
- wall time serial, with ``--jobs 2``, and their ratio;
- wall time with a fresh ``--store`` and the difference per task;
- a rerun against the full store (nothing computed: the cost of lookups);
- the store's own cost per task: ``save`` and ``lookup`` timed directly.
"""

from __future__ import annotations

import os
import subprocess
import sys
import tempfile
import time

COVERTREE = [sys.executable, "-c", "from covertree.cli import main; main()"]
SWEEPS = [["-g", "2", "-t", "1", "-d", "2..6"], ["-g", "3", "-t", "1", "-d", "2..4"]]


def _timed(args: list[str]) -> tuple[float, str]:
    start = time.perf_counter()
    done = subprocess.run([*COVERTREE, *args], capture_output=True, text=True, check=True)
    return time.perf_counter() - start, done.stdout


def _sweep(extra: list[str]) -> tuple[float, str]:
    seconds, outputs = 0.0, []
    for ranges in SWEEPS:
        t, out = _timed(["sweep", *ranges, "-k", "1", "-f", "json", "-q", *extra])
        seconds += t
        outputs.append(out)
    return seconds, "".join(outputs)


def _n_tasks() -> int:
    from covertree.sweep.tasks import SweepSpec, plan_sweep

    return len(plan_sweep(SweepSpec((2,), (1,), range(2, 7))).tasks) + len(
        plan_sweep(SweepSpec((3,), (1,), range(2, 5))).tasks)


def _store_micro(repeats: int = 400) -> tuple[float, float]:
    """Milliseconds per ``save`` and per ``lookup`` of one task on a fresh store."""
    from covertree.sweep.store import ResultStore
    from covertree.sweep.tasks import SweepSpec, compute_task, plan_sweep

    plan = plan_sweep(SweepSpec((3,), (1,), (2,), codim=3, labeled=True))
    tasks = list(plan.tasks)
    summaries = [compute_task(t) for t in tasks]
    with tempfile.TemporaryDirectory() as tmp, ResultStore(os.path.join(tmp, "s.sqlite")) as store:
        start = time.perf_counter()
        for i in range(repeats):
            store.save(tasks[i % len(tasks)], summaries[i % len(tasks)])
        save = (time.perf_counter() - start) / repeats
        start = time.perf_counter()
        for _ in range(max(1, repeats // len(tasks))):
            store.lookup(tasks)
        lookup = (time.perf_counter() - start) / (max(1, repeats // len(tasks)) * len(tasks))
    return 1000 * save, 1000 * lookup


def main() -> int:
    tasks = _n_tasks()
    load = os.getloadavg()[0]
    serial, reference = _sweep([])
    pooled, out = _sweep(["--jobs", "2"])
    assert out == reference, "--jobs 2 output differs from the serial run"
    print(f"sweep g=2 d=2..6 + g=3 d=2..4, codim<=1 ({tasks} tasks): serial {serial:.2f} s")
    print(f"  --jobs 2: {pooled:.2f} s, speed-up {serial / pooled:.2f}x "
          f"(cpus: {os.cpu_count()}, load average before: {load:.1f})")
    with tempfile.TemporaryDirectory() as tmp:
        path = os.path.join(tmp, "s.sqlite")
        stored, out = _sweep(["--store", path])
        assert out == reference, "--store output differs from the run without a store"
        rerun, out = _sweep(["--store", path])
        assert out == reference, "rerun from the store differs"
    print(f"  serial with a fresh --store: {stored:.2f} s, "
          f"{1000 * (stored - serial) / tasks:+.1f} ms per task against no store (noise included)")
    print(f"  rerun with every task stored (nothing computed): {rerun:.2f} s")
    save, lookup = _store_micro()
    print(f"store alone: save {save:.2f} ms per task (one transaction each), lookup {lookup:.3f} ms per task")
    return 0


if __name__ == "__main__":
    sys.exit(main())
