"""Estimated work of a Hurwitz count, before the problem is even built.

:func:`check_count` refuses (one line, :class:`~covertree.errors.TooLargeError`)
a count estimated beyond the work limit of :mod:`covertree.limits`, naming
the largest feasible degree (and genus) for the same kind of problem.  The
estimate follows the engine that would run (:func:`covertree.hurwitz.numbers._counts`):

* the character-table engine (degree at most 30, or profiles far from simple):
  for every sub-degree ``m`` a column of ``p(m)`` central characters per
  sub-problem, each by strip removal (about ``m / 2`` steps);
* the content-moment engine (elliptic target, simple and unramified points
  only): about ``d^3 (s + 1)^2.2 / 9`` steps for ``s`` simple points (fitted
  on measured runs, ``benchmarks/bench_limits.py``);
* the streaming sparse engine: every partition of every sub-degree once per
  sub-problem and special profile.

The problem is described without building it (building a degree-``10^8``
profile would itself take gigabytes): the profiles given and a number of
extra simple points.

Examples
--------
>>> count_work(60, 1, [], 2) < 10**8 < count_work(100000, 1, [], 2)
True
>>> check_count(10**6, 1, genus=2, profiles=[], limit=10**8)
Traceback (most recent call last):
...
covertree.errors.TooLargeError: degree 1000000 with 2 branch points would take about 10^18.1 steps, beyond the work limit 10^8 (--max-work); the largest feasible degree with 2 branch points is 431
"""

from __future__ import annotations

import math
from collections import Counter
from collections.abc import Sequence
from math import comb

from covertree.errors import TooLargeError
from covertree.hurwitz.problem import MAX_POINTS
from covertree.hurwitz.sparse import SPARSE_PARTS, SPARSE_SPECIAL
from covertree.limits import HUGE, check_work, largest_feasible, log_partitions, partitions_up_to

__all__ = ["MAX_POINTS", "check_count", "count_work", "simple_points_needed"]

#: largest degree tried when looking for the largest feasible one
_DEGREE_CEILING = 10**7
_TABLE_DEGREE = 30


def simple_points_needed(degree: int, target_genus: int, genus: int, profiles: Sequence[Sequence[int]]) -> int:
    """The number of simple branch points Riemann-Hurwitz adds (as
    :meth:`covertree.hurwitz.problem.HurwitzProblem.build`; may be negative).

    >>> simple_points_needed(2, 1, 2, [])
    2
    """
    branching = sum(degree - len(mu) for mu in profiles)
    return 2 * genus - 2 - degree * (2 * target_genus - 2) - branching


def count_work(degree: int, target_genus: int, profiles: Sequence[Sequence[int]], simple: int = 0) -> float:
    """Estimated steps of ``count`` for the given profiles and ``simple`` more
    simple points (see the module docstring).

    >>> count_work(4, 1, [], 2) < 1000
    True
    """
    if max(degree, simple) > HUGE:
        return math.inf
    nus = [tuple(p for p in mu if p > 1) for mu in profiles] + [(2,)] * simple
    groups = Counter(nus)
    special = sum(c for nu, c in groups.items() if nu not in ((2,), ()))
    sparse = special <= SPARSE_SPECIAL and all(sum(nu) <= SPARSE_PARTS for nu in groups)
    if degree <= _TABLE_DEGREE or not sparse:
        return _table_work(degree, groups)
    if target_genus == 1 and special == 0:
        s = groups.get((2,), 0)
        return degree**3 * (s + 1) ** 2.2 / 9
    keys = math.prod(c + 1 for c in groups.values())
    return partitions_up_to(degree) * keys * (len(groups) + 2) + degree**2 * keys**2


def _table_work(degree: int, groups: Counter) -> float:
    points = sum(groups.values())
    rough = partitions_up_to(degree) * max(points, 1) * degree / 2
    if rough > 10**12:
        return rough  # far beyond any limit: no need to count sub-problems
    total = 0.0
    for m in range(1, degree + 1):
        subproblems = 1
        for nu, count in groups.items():
            options = _sub_multisets(nu, degree - sum(nu), m)
            subproblems *= comb(count + options - 1, count) if options else 0
        total += math.exp(log_partitions(m)) * subproblems * points * m / 2
    return max(total, float(degree))


def _sub_multisets(nu: tuple[int, ...], ones: int, m: int) -> int:
    # sub-multisets of size m of the profile nu + 1^ones
    sizes = [1] + [0] * sum(nu)
    for part, mult in Counter(nu).items():
        new = [0] * len(sizes)
        for s, ways in enumerate(sizes):
            if ways:
                for take in range(mult + 1):
                    new[s + take * part] += ways  # at most sum(nu): in range
        sizes = new
    return sum(ways for s, ways in enumerate(sizes) if s <= m and m - s <= ones)


def check_count(degree: int, target_genus: int, genus: int | None, profiles: Sequence[Sequence[int]],
                limit: float | None) -> None:
    """Refuse a count beyond ``limit`` steps, or with more than
    :data:`MAX_POINTS` branch points, before building the problem.

    Raises
    ------
    TooLargeError
        Naming the degree (or genus) and the largest feasible one.
    """
    simple = 0 if genus is None else simple_points_needed(degree, target_genus, genus, profiles)
    if simple < 0:
        return  # Riemann-Hurwitz refuses it (HurwitzProblem.build says why)
    points = len(profiles) + simple
    if points > MAX_POINTS:
        raise TooLargeError(f"genus {genus} needs {points} branch points at degree {degree}; "
                           f"at most {MAX_POINTS} allowed{_genus_hint(degree, target_genus, genus, profiles, limit or 10**8)}")
    if limit is None:
        return
    steps = count_work(degree, target_genus, profiles, simple)
    if steps <= limit:
        return
    nus = [tuple(p for p in mu if p > 1) for mu in profiles]
    largest = largest_feasible(lambda d: count_work(d, target_genus, nus, simple),
                               max(max((sum(nu) for nu in nus), default=1), 1), _DEGREE_CEILING, limit)
    with_points = f"with {points} branch point{'s' if points != 1 else ''}"
    feasible = (f"the largest feasible degree {with_points} is {largest}" if largest
                else f"no degree is feasible {with_points}")
    check_work(steps, limit, f"degree {degree} {with_points}",
               feasible + _genus_hint(degree, target_genus, genus, profiles, limit))


def _genus_hint(degree: int, target_genus: int, genus: int | None, profiles, limit: float | None) -> str:
    """``", or genus G at degree D"``: the largest feasible genus at this degree."""
    if genus is None or limit is None:
        return ""
    low = genus - simple_points_needed(degree, target_genus, genus, profiles) // 2

    def cost(g: int) -> float:
        simple = simple_points_needed(degree, target_genus, g, profiles)
        if len(profiles) + simple > MAX_POINTS:
            return math.inf
        return count_work(degree, target_genus, profiles, max(simple, 0))

    # genus itself was refused, so the search (up to genus) ends below it
    largest = largest_feasible(cost, max(low, 0), max(genus, 0), limit)
    if largest is None or largest <= low:
        return ""
    return f"; the largest feasible genus at degree {degree} is {largest}"
