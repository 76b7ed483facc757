"""What a sweep reports: the plan's problems, the skipped ones and one row per
(problem, base stratum), possibly for one shard only; and the merge of shards.

Examples
--------
>>> from covertree.sweep.tasks import SweepSpec, plan_sweep, shard_tasks, compute_task
>>> plan = plan_sweep(SweepSpec((2,), (1,), (1, 2)))
>>> parts = [shard_report(plan, shard_tasks(plan.tasks, i, 2), [compute_task(t) for t in
...          shard_tasks(plan.tasks, i, 2)], (i, 2)) for i in (1, 2)]
>>> whole = merge_reports([("a", parts[0]), ("b", parts[1])])
>>> [r.stratum for r in whole.rows], whole.summary()
(['g1{1,2}', 'g0{1,2} | 0-0', 'g0{1,2}, g1 | 0-1'], {'problems': 1, 'skipped': 1, 'strata': 3, 'covers': 11, 'failures': 0})
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from covertree.errors import InputError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.sweep.tasks import Plan, Skipped, StratumSummary, SweepSpec, Task, problem_order

__all__ = ["Shard", "SweepReport", "sweep_report", "shard_report", "store_report", "merge_reports"]


@dataclass(frozen=True)
class Shard:
    """Shard ``index`` of ``count`` of a plan with ``tasks`` tasks in all, and
    the indices of the tasks it ran (in order)."""

    index: int
    count: int
    tasks: int
    task_indices: tuple[int, ...]


@dataclass(frozen=True)
class SweepReport:
    """Rows of a sweep (or of a store when ``spec`` is ``None``)."""

    spec: SweepSpec | None
    problems: tuple[HurwitzProblem, ...]
    skipped: tuple[Skipped, ...]
    rows: tuple[StratumSummary, ...]
    shard: Shard | None = None

    @property
    def failures(self) -> list[StratumSummary]:
        """Rows whose degeneration identity fails (each one a bug)."""
        return [r for r in self.rows if not r.identity_holds]

    def summary(self) -> dict:
        """``{"problems", "skipped", "strata", "covers", "failures"}``."""
        return {"problems": len(self.problems), "skipped": len(self.skipped), "strata": len(self.rows),
                "covers": sum(r.n_covers or 0 for r in self.rows), "failures": len(self.failures)}


def sweep_report(plan: Plan, rows: Sequence[StratumSummary]) -> SweepReport:
    """The report of a whole (unsharded) sweep."""
    return SweepReport(plan.spec, plan.problems, plan.skipped, tuple(rows))


def shard_report(plan: Plan, tasks: Sequence[Task], rows: Sequence[StratumSummary],
                 shard: tuple[int, int]) -> SweepReport:
    """The report of shard ``shard = (I, N)`` that ran ``tasks``."""
    info = Shard(shard[0], shard[1], len(plan.tasks), tuple(t.index for t in tasks))
    return SweepReport(plan.spec, plan.problems, plan.skipped, tuple(rows), info)


def store_report(rows: Sequence[StratumSummary]) -> SweepReport:
    """The report of stored rows (no sweep, nothing skipped)."""
    problems = sorted({r.problem for r in rows}, key=problem_order)
    return SweepReport(None, tuple(problems), (), tuple(rows))


def merge_reports(named: Sequence[tuple[str, SweepReport]]) -> SweepReport:
    """Combine the shards ``1/N .. N/N`` of one sweep into the report a single
    run would give.

    Raises
    ------
    InputError
        If a report is not a shard, the shards belong to different sweeps or
        shard counts, one is given twice or missing, or task indices overlap.
    """
    if not named:
        raise InputError("merge needs at least one shard file")
    first_name, first = named[0]
    for name, report in named:
        _check_compatible(name, report, first_name, first)
    by_index = _one_each(named, first.shard.count)
    indices = [i for _, r in by_index for i in r.shard.task_indices]
    if len(indices) != first.shard.tasks or sorted(indices) != list(range(first.shard.tasks)):
        raise InputError(f"the shards' task indices do not cover tasks 0..{first.shard.tasks - 1} "
                         "exactly once: the files are not shards of one run")
    rows = dict(zip(indices, (row for _, r in by_index for row in r.rows)))
    return SweepReport(first.spec, first.problems, first.skipped, tuple(rows[i] for i in sorted(rows)))


def _check_compatible(name: str, report: SweepReport, first_name: str, first: SweepReport) -> None:
    if report.shard is None:
        raise InputError(f"{name} is not a shard output (run covertree sweep with --shard I/N)")
    if len(report.rows) != len(report.shard.task_indices):
        raise InputError(f"{name}: {len(report.rows)} rows but {len(report.shard.task_indices)} task indices")
    same = (report.spec, report.problems, report.skipped, report.shard.count, report.shard.tasks) == (
        first.spec, first.problems, first.skipped, first.shard.count, first.shard.tasks)
    if not same:
        raise InputError(f"{name} and {first_name} are shards of different sweeps "
                         "(ranges, profiles, codimension, grouping or shard count differ)")


def _one_each(named: Sequence[tuple[str, SweepReport]], count: int) -> list[tuple[str, SweepReport]]:
    by_index: dict[int, tuple[str, SweepReport]] = {}
    for name, report in named:
        i = report.shard.index
        if i in by_index:
            raise InputError(f"shard {i}/{count} is given twice ({by_index[i][0]} and {name})")
        by_index[i] = (name, report)
    if len(by_index) < count:
        raise InputError(f"shard(s) {_missing(by_index, count)} missing: merge needs all {count} shards")
    return [by_index[i] for i in sorted(by_index)]


def _missing(present: dict, count: int, most: int = 5) -> str:
    """The first few shards ``i/count`` not in ``present`` (time bounded by
    ``len(present) + most``, whatever the count).

    >>> _missing({1: None, 3: None}, 10 ** 12)
    '2/1000000000000, 4/1000000000000, 5/1000000000000, 6/1000000000000, 7/1000000000000 and 999999999993 more'
    """
    shown, i = [], 1
    while len(shown) < min(most, count - len(present)):
        if i not in present:
            shown.append(f"{i}/{count}")
        i += 1
    rest = count - len(present) - len(shown)
    return ", ".join(shown) + (f" and {rest} more" if rest else "")
