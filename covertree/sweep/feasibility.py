"""Refusal of a sweep before it is planned: too many problems, or problems
whose Hurwitz numbers or strata are estimated beyond the work limit
(:mod:`covertree.limits`).

Planning builds every problem and lists its strata, so the check comes
first, from the ranges alone; the largest problems are checked first, so a
huge range is refused at once.

Examples
--------
>>> check_sweep(SweepSpec((2,), (1,), tuple(range(1, 9))), 10**8)
>>> check_sweep(SweepSpec((2,), (1,), (2, 3, 100000)), 10**8)
Traceback (most recent call last):
...
covertree.errors.TooLargeError: degree 100000 with 2 branch points would take about 10^15.1 steps, beyond the work limit 10^8 (--max-work); the largest feasible degree with 2 branch points is 431
"""

from __future__ import annotations

from itertools import product

from covertree.errors import TooLargeError
from covertree.graphs.enumerate import check_strata
from covertree.hurwitz.cost import check_count, count_work, simple_points_needed
from covertree.limits import check_work, strata_work
from covertree.sweep.tasks import SweepSpec

__all__ = ["MAX_PROBLEMS", "check_sweep"]

#: most problems (genus, target genus, degree) one sweep may have
MAX_PROBLEMS = 100_000


def check_sweep(spec: SweepSpec, max_work: float | None) -> None:
    """Refuse a sweep with more than :data:`MAX_PROBLEMS` problems, with one
    problem beyond ``max_work``, or with more than ``max_work`` in total.

    Raises
    ------
    TooLargeError
        Naming the problem (or the total) and the largest feasible value.
    """
    size = len(spec.genera) * len(spec.target_genera) * len(spec.degrees)
    if size > MAX_PROBLEMS:
        raise TooLargeError(f"the ranges make {size} problems (genera x target genera x degrees); "
                            f"at most {MAX_PROBLEMS} allowed")
    if max_work is None:
        return
    combos = sorted(product(spec.degrees, spec.genera, spec.target_genera),
                    key=lambda c: (c[0], -1 if c[1] is None else c[1], c[2]), reverse=True)
    total = 0.0
    for degree, genus, target_genus in combos:
        total += _problem_work(degree, genus, target_genus, spec, max_work)
    check_work(total, max_work, f"the sweep of {size} problems", "narrow the ranges or raise the limit")


def _problem_work(degree: int, genus: int | None, target_genus: int, spec: SweepSpec, max_work: float) -> float:
    profiles = [tuple(p) for p in spec.profiles]
    if any(sum(mu) != degree for mu in profiles):
        return 0.0  # skipped by the plan (profile of another degree)
    simple = 0 if genus is None else simple_points_needed(degree, target_genus, genus, profiles)
    points = len(profiles) + simple
    if simple < 0 or 2 * target_genus - 2 + points <= 0:
        return 0.0  # skipped by the plan (Riemann-Hurwitz, unstable target)
    check_count(degree, target_genus, genus, profiles, max_work)
    check_strata(target_genus, points, spec.codim, max_work)
    codim = min(spec.codim, 3 * target_genus - 3 + points)
    return count_work(degree, target_genus, profiles, simple) + strata_work(target_genus, points, codim)
