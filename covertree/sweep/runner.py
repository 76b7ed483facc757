"""Running the tasks of a sweep: serially, on a local process pool or on a
dask cluster (:mod:`covertree.sweep.cluster`), with an optional results store.

Every backend yields ``(task, summary)`` pairs as tasks finish; the runner
commits each to the store as it arrives and returns the results in task
order, so the output never depends on the backend, the number of processes
or the order in which workers finish.

Examples
--------
>>> from covertree.sweep.tasks import SweepSpec, plan_sweep
>>> plan = plan_sweep(SweepSpec((2,), (1,), (2, 3)))
>>> serial = run_tasks(plan.tasks, SerialBackend())
>>> serial.computed, serial.stored, [str(s.total_weight) for s in serial.results]
(6, 0, ['2', '2', '2', '16', '16', '16'])
>>> with ProcessBackend(2) as pool:
...     run_tasks(plan.tasks, pool).results == serial.results
True
"""

from __future__ import annotations

import multiprocessing
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass

from covertree.errors import InputError
from covertree.sweep.store import ResultStore
from covertree.sweep.tasks import StratumSummary, Task, compute_task, largest_first

__all__ = ["SerialBackend", "ProcessBackend", "RunOutcome", "run_tasks"]


def _indexed(task: Task) -> tuple[int, StratumSummary]:
    return task.index, compute_task(task)


class SerialBackend:
    """Compute the tasks one after the other in this process."""

    def __enter__(self) -> "SerialBackend":
        return self

    def __exit__(self, *exc) -> bool:
        return False

    def run(self, tasks: Sequence[Task]) -> Iterator[tuple[Task, StratumSummary]]:
        """Yield ``(task, summary)`` in task order."""
        for task in tasks:
            yield task, compute_task(task)


class ProcessBackend:
    """A local pool of ``jobs`` worker processes (started with ``spawn``, so
    no thread of the parent is ever forked).  Leaving the ``with`` block by an
    exception (Ctrl-C included) terminates the workers at once.

    Raises
    ------
    InputError
        If ``jobs < 1``.
    """

    def __init__(self, jobs: int) -> None:
        if jobs < 1:
            raise InputError(f"--jobs {jobs} is not allowed; use a positive number of processes")
        self.jobs = jobs
        self._pool = None

    def __enter__(self) -> "ProcessBackend":
        self._pool = multiprocessing.get_context("spawn").Pool(self.jobs)
        return self

    def __exit__(self, kind, value, traceback) -> bool:
        if kind is None:
            self._pool.close()
        else:
            self._pool.terminate()
        self._pool.join()
        return False

    def run(self, tasks: Sequence[Task]) -> Iterator[tuple[Task, StratumSummary]]:
        """Yield ``(task, summary)`` as workers finish (any order; the
        probably slowest tasks are handed out first)."""
        by_index = {task.index: task for task in tasks}
        ordered = sorted(tasks, key=largest_first)
        for index, summary in self._pool.imap_unordered(_indexed, ordered, chunksize=1):
            yield by_index[index], summary


@dataclass(frozen=True)
class RunOutcome:
    """Results in task order, and how many were computed or found stored."""

    results: tuple[StratumSummary, ...]
    computed: int
    stored: int


def run_tasks(tasks: Sequence[Task], backend, store: ResultStore | None = None,
              on_done: Callable[[Task, bool], None] | None = None) -> RunOutcome:
    """Run ``tasks`` on ``backend``, skipping those already in ``store`` and
    committing each new one to it as soon as it finishes.

    ``on_done(task, was_stored)`` is called once per task (stored ones first).
    """
    report = on_done or (lambda task, was_stored: None)
    results = store.lookup(tasks) if store is not None else {}
    stored = len(results)
    for task in tasks:
        if task.index in results:
            report(task, True)
    pending = [task for task in tasks if task.index not in results]
    for task, summary in backend.run(pending) if pending else ():
        if store is not None:
            store.save(task, summary)
        results[task.index] = summary
        report(task, False)
    return RunOutcome(tuple(results[task.index] for task in tasks), len(pending), stored)
