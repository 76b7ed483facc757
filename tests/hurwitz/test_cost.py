"""The guard before a Hurwitz count (covertree.hurwitz.cost).

The number of simple points is checked against Riemann-Hurwitz worked by hand
and against the problems covertree builds; each refusal's claims are checked by
asking the guard again: the largest feasible degree (or genus) it names passes,
the next one is refused.  The table engine's estimate is checked against its
model (module docstring) with the sub-problems counted by brute force; which
estimate applies is checked against the engine that would run.  The fitted
constants of the other two estimates are not pinned (they are measurements,
``benchmarks/bench_limits.py``).
"""

from __future__ import annotations

import math
from collections import Counter
from itertools import combinations_with_replacement, product

import pytest

from covertree.errors import TooLargeError
from covertree.hurwitz.cost import MAX_POINTS, check_count, count_work, simple_points_needed
from covertree.hurwitz.numbers import SPARSE_DEGREE
from covertree.hurwitz.problem import HurwitzProblem
from covertree.hurwitz.sparse import is_sparse
from covertree.limits import HUGE
from tests.independent import partition_count

LIMIT = 10**8


def _refusal(*args) -> str:
    with pytest.raises(TooLargeError) as err:
        check_count(*args)
    return str(err.value)


def _named_genus_is_the_bound(line: str, degree: int, target: int) -> None:
    """The genus a refusal names last passes the guard at ``degree``, the next is refused."""
    largest = int(line.rsplit(" ", 1)[1])
    check_count(degree, target, largest, [], LIMIT)
    with pytest.raises(TooLargeError):
        check_count(degree, target, largest + 1, [], LIMIT)


@pytest.mark.parametrize("degree, target, genus, profiles, simple", [
    # 2g - 2 = d(2h - 2) + sum (d - len mu) + (number of simple points), by hand
    (2, 1, 2, [], 2),            # 2 = 0 + b
    (3, 0, 0, [], 4),            # -2 = -6 + b
    (3, 0, 1, [(3,)], 4),        # 0 = -6 + 2 + b
    (4, 1, 2, [(2, 2)], 0),      # 2 = 0 + 2
    (3, 0, 0, [(3,), (3,), (3,)], -2),  # -2 = -6 + 6 + b: too much ramification
])
def test_simple_points_by_riemann_hurwitz(degree, target, genus, profiles, simple):
    assert simple_points_needed(degree, target, genus, profiles) == simple
    if simple >= 0 and len(profiles) + simple > 2 - 2 * target:
        built = HurwitzProblem.build(degree, target, genus=genus, profiles=[list(p) for p in profiles])
        assert built.points == len(profiles) + simple


def test_the_estimate_is_the_limit_of_what_passes():
    # complete profiles (genus None): no simple point is added
    profiles = [(3, 1), (2, 2), (2, 1, 1)]
    steps = count_work(4, 0, profiles)
    check_count(4, 0, None, profiles, steps)
    with pytest.raises(TooLargeError):
        check_count(4, 0, None, profiles, steps * 0.999)
    # the genus reached by the profiles alone (no simple point) is still checked
    assert simple_points_needed(3, 1, 2, [(3,)]) == 0
    line = _refusal(3, 1, 2, [(3,)], 1)
    assert line.startswith("degree 3 with 1 branch point would take ") and "beyond the work limit 1 " in line
    assert line.endswith("; no degree is feasible with 1 branch point")
    check_count(3, 1, 2, [(3,)], None)


def test_too_many_points_refused_naming_the_largest_feasible_genus():
    # degree 2: genus g needs 2g + 2 simple points; exactly MAX_POINTS pass
    assert MAX_POINTS == 100_000
    check_count(2, 0, 49_999, [], None)
    line = _refusal(2, 0, 50_000, [], None)
    assert line == ("genus 50000 needs 100002 branch points at degree 2; at most 100000 allowed; "
                    "the largest feasible genus at degree 2 is 49999")
    # at degree 6 the work limit (10^8 when none is given) binds first
    line = _refusal(6, 0, 50_000, [], None)
    assert line.startswith("genus 50000 needs 100010 branch points at degree 6; at most 100000 allowed; "
                           "the largest feasible genus at degree 6 is ")
    _named_genus_is_the_bound(line, 6, 0)
    assert _refusal(6, 0, 50_000, [], LIMIT) == line


@pytest.mark.parametrize("nu", [(3,), (2, 2)])
def test_a_refused_degree_names_the_largest_feasible_one(nu):
    # one profile nu,1^(d-|nu|): the named degree passes with the same profile, the next not
    d = 100_000
    line = _refusal(d, 1, None, [nu + (1,) * (d - sum(nu))], LIMIT)
    assert "the largest feasible degree with 1 branch point is " in line
    largest = int(line.rsplit(" ", 1)[1])
    assert sum(nu) <= largest < d
    check_count(largest, 1, None, [nu + (1,) * (largest - sum(nu))], LIMIT)
    with pytest.raises(TooLargeError):
        check_count(largest + 1, 1, None, [nu + (1,) * (largest + 1 - sum(nu))], LIMIT)


def test_a_refused_genus_names_the_largest_feasible_degree_and_genus():
    # degree 40 over an elliptic curve with 2g - 2 simple points
    line = _refusal(40, 1, 39, [], LIMIT)
    assert line.startswith("degree 40 with 76 branch points would take about ")
    head, genus = line.rsplit("; the largest feasible genus at degree 40 is ", 1)
    largest = int(head.rsplit(" ", 1)[1])
    assert head.endswith(f"the largest feasible degree with 76 branch points is {largest}")
    check_count(largest, 1, None, [(2,) + (1,) * (largest - 2)] * 76, LIMIT)
    check_count(40, 1, int(genus), [], LIMIT)
    with pytest.raises(TooLargeError):
        check_count(40, 1, int(genus) + 1, [], LIMIT)


def test_the_genus_hint_follows_the_engine_of_an_elliptic_target():
    # degree 40 over an elliptic curve, simple points only: the hint is the
    # largest genus the guard itself lets through at this degree
    line = _refusal(40, 1, 60_000, [], None)
    assert line.startswith("genus 60000 needs 119998 branch points at degree 40; at most 100000 allowed; "
                           "the largest feasible genus at degree 40 is ")
    _named_genus_is_the_bound(line, 40, 1)


def _sub_multisets(mu: tuple[int, ...], m: int) -> list[tuple[int, ...]]:
    """The distinct sub-multisets of size ``m`` of the profile ``mu``: every
    choice of how many of each part to keep (brute force)."""
    counts = sorted(Counter(mu).items())
    out = []
    for taken in product(*(range(c + 1) for _, c in counts)):
        if sum(t * part for t, (part, _) in zip(taken, counts)) == m:
            out.append(tuple(part for t, (part, _) in zip(taken, counts) for _ in range(t)))
    return out


def _table_model(degree: int, profiles: list[tuple[int, ...]]) -> float:
    # the model of the module docstring, counted afresh: at every sub-degree m,
    # p(m) central characters of about m / 2 steps, per sub-problem (one
    # sub-multiset of size m per branch point, up to equal profiles) and point
    total = 0.0
    for m in range(1, degree + 1):
        subproblems = 1
        for mu, count in Counter(tuple(sorted(mu)) for mu in profiles).items():
            subproblems *= len(list(combinations_with_replacement(_sub_multisets(mu, m), count)))
        total += partition_count(m) * subproblems * len(profiles) * m / 2
    return max(total, float(degree))


@pytest.mark.parametrize("degree, target, profiles", [
    (4, 0, [(2, 1, 1)] * 3),
    (6, 1, [(3, 1, 1, 1), (2, 2, 1, 1), (2, 2, 1, 1), (1,) * 6]),
    (5, 2, [(5,)]),
    (7, 0, [(3, 2, 2), (4, 3), (2, 1, 1, 1, 1, 1), (2, 1, 1, 1, 1, 1)]),
    # 4 = 2 + 2: two sub-multisets of 4, 2, 2 of the same size
    (9, 1, [(4, 2, 2, 1), (4, 2, 2, 1), (2,) + (1,) * 7]),
])
def test_the_table_estimate_follows_its_model(degree, target, profiles):
    assert math.isclose(count_work(degree, target, profiles), _table_model(degree, profiles), rel_tol=1e-9)
    # the same simple points given as profiles or added by number
    simple = [p for p in profiles if sorted(p) == [1] * (degree - 2) + [2]]
    rest = [p for p in profiles if p not in simple]
    assert math.isclose(count_work(degree, target, rest, len(simple)), count_work(degree, target, profiles),
                        rel_tol=1e-12)


@pytest.mark.parametrize("degree, profiles, sparse", [
    (30, [(2,) + (1,) * 28] * 3, True),              # degree 30: the table engine
    (31, [(2,) + (1,) * 29] * 3, True),              # above: the sparse engine
    (31, [(3, 3) + (1,) * 25] * 3, True),            # three special points, parts 6: sparse
    (31, [(3, 3) + (1,) * 25] * 4, False),           # four special points: the table
    (31, [(4, 3) + (1,) * 24], False),               # parts 7: the table
    (31, [(2,) + (1,) * 29, (1,) * 31], True),       # simple and unramified points
])
def test_the_estimate_follows_the_engine_that_would_run(degree, profiles, sparse):
    # the engine of covertree.hurwitz.numbers._counts: the table at degree 30
    # or below or for profiles that are not sparse (at most three points other
    # than simple or unramified, parts >= 2 of each summing to at most 6)
    assert is_sparse(profiles) == sparse
    table = degree <= SPARSE_DEGREE or not sparse
    for target in (0, 1, 2):
        assert math.isclose(count_work(degree, target, profiles), _table_model(degree, profiles),
                            rel_tol=1e-9) == table


def test_the_elliptic_estimate_counts_simple_points_alone():
    # content moments: simple points given as profiles or by number, and
    # unramified points, weigh the same
    simple = (2,) + (1,) * 38
    assert count_work(40, 1, [simple] * 3) == count_work(40, 1, [], 3) == count_work(40, 1, [simple, (1,) * 40], 2)
    assert count_work(40, 1, [], 3) > count_work(40, 1, [], 2) > count_work(39, 1, [], 2)
    # a ramified special point leaves the moments: more work than simple points
    assert count_work(40, 1, [(3,) + (1,) * 37], 2) > count_work(40, 1, [], 3)


def test_beyond_the_largest_integer_handled_the_work_is_infinite():
    assert count_work(HUGE + 1, 1, [], 2) == math.inf == count_work(40, 1, [], HUGE + 1)
    assert count_work(HUGE, 1, [], 2) < math.inf


def test_more_points_or_sheets_are_more_work():
    # every engine: one more simple point, or one more sheet, costs more
    special = [(3,) + (1,) * 37] * 2
    for target, profiles in ((1, []), (0, special), (2, special)):
        works = [count_work(40, target, profiles, s) for s in range(4)]
        assert works == sorted(works) and len(set(works)) == 4, (target, works)
        assert count_work(41, target, [p + (1,) for p in profiles], 2) > works[2]
