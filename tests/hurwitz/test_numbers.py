"""Hurwitz numbers by characters against the brute-force counter, and the API.

The brute-force comparison covers every problem with degree d <= 5, target genus
h <= 1 and at most 5 branch points (profiles as a multiset, including unramified
points 1^d and problems that fail Riemann-Hurwitz, which must give 0).  The
cases whose tuple-by-tuple enumeration exceeds BUDGET inner steps (d = 5, h = 1
with 3 to 5 points, d = 4, h = 1 with 5 points, two d = 5, h = 0 five-point
cases) are counted by the state walk of the same module, itself checked against
the tuple-by-tuple enumeration on every smaller case.
"""

from fractions import Fraction
from itertools import combinations_with_replacement
from math import factorial

import pytest

from covertree.errors import ProblemError, ProfileError
from covertree.hurwitz.numbers import (
    connected_hurwitz,
    disconnected_hurwitz,
    hurwitz_numbers,
    tuple_counts,
)
from covertree.hurwitz.problem import HurwitzProblem
from covertree.symmetric.partitions import partitions_of, simple
from tests.hurwitz.brute_force import brute_hurwitz, brute_hurwitz_by_states, cost

BUDGET = 20_000


def _cases(d: int, h: int):
    """(run, skipped): profile lists for degree d and target genus h."""
    run, skipped = [], []
    parts = [tuple(p) for p in partitions_of(d)]
    for b in range(0, 6):
        for combo in combinations_with_replacement(parts, b):
            # largest class first and second largest last: the brute force fixes
            # the first element and solves for the last (genus 0)
            order = sorted(combo, key=lambda mu: -cost(d, 0, [mu, mu, mu]))
            if len(order) > 2:
                order = order[:1] + order[2:] + order[1:2]
            (run if cost(d, h, order) <= BUDGET else skipped).append(order)
    return run, skipped


@pytest.mark.parametrize("h", [0, 1])
@pytest.mark.parametrize("d", range(1, 6))
def test_against_brute_force(d, h):
    run, skipped = _cases(d, h)
    assert run
    for profiles in run:
        expected = brute_hurwitz(d, h, profiles)
        assert (connected_hurwitz(d, h, profiles), disconnected_hurwitz(d, h, profiles)) == expected, profiles
    if d <= 3:
        assert not skipped
    for profiles in skipped:
        expected = brute_hurwitz_by_states(d, h, profiles)
        assert (connected_hurwitz(d, h, profiles), disconnected_hurwitz(d, h, profiles)) == expected, profiles


@pytest.mark.parametrize("h", [0, 1])
@pytest.mark.parametrize("d", range(1, 5))
def test_state_walk_counts_the_same_tuples(d, h):
    # the state walk used for the long cases against the plain enumeration
    for profiles in _cases(d, h)[0]:
        assert brute_hurwitz_by_states(d, h, profiles) == brute_hurwitz(d, h, profiles), profiles


def test_skipped_cases_are_the_expected_ones():
    # the cases left out of the comparison (too long to enumerate), by (d, h, points)
    left = set()
    for d in range(1, 6):
        for h in (0, 1):
            left |= {(d, h, len(p)) for p in _cases(d, h)[1]}
    assert left <= {(5, 1, 3), (5, 1, 4), (5, 1, 5), (4, 1, 5), (5, 0, 5)}


def test_order_of_profiles_does_not_matter():
    profiles = [(3, 1), (2, 2), (2, 1, 1), (4,)]
    expected = brute_hurwitz(4, 0, profiles)
    for order in (profiles, profiles[::-1], profiles[1:] + profiles[:1]):
        assert (connected_hurwitz(4, 0, order), disconnected_hurwitz(4, 0, order)) == expected
        assert brute_hurwitz(4, 0, order) == expected


def test_transitive_when_a_full_cycle_is_present():
    # a d-cycle makes every tuple transitive: connected = disconnected
    for d in range(2, 8):
        profiles = [(d,), (d,)] + [simple(d)] * (d - 1 if d % 2 else d)
        assert connected_hurwitz(d, 0, profiles) == disconnected_hurwitz(d, 0, profiles)


@pytest.mark.parametrize("h", [1, 2, 3])
def test_exponential_formula_for_unramified_covers(h):
    # with no branch points, sum_d H*_d x^d = exp(sum_d H_d x^d) (the exponential
    # formula: a disconnected cover is a multiset of connected ones; common knowledge)
    n = 8
    conn = [Fraction(0)] + [connected_hurwitz(d, h, []) for d in range(1, n + 1)]
    disc = [Fraction(1)] + [disconnected_hurwitz(d, h, []) for d in range(1, n + 1)]
    # exp of a series with zero constant term: e' = c' e
    e = [Fraction(1)] + [Fraction(0)] * n
    for m in range(1, n + 1):
        e[m] = sum(k * conn[k] * e[m - k] for k in range(1, m + 1)) / m
    assert e == disc


def test_unramified_point_does_not_change_the_count():
    for d in range(1, 6):
        assert connected_hurwitz(d, 2, [(1,) * d]) == connected_hurwitz(d, 2, [])
        assert connected_hurwitz(d, 1, [(1,) * d, (1,) * d]) == connected_hurwitz(d, 1, [])


def test_riemann_hurwitz_failures_give_zero():
    # odd total ramification: no tuples at all
    assert disconnected_hurwitz(3, 0, [(2, 1), (1, 1, 1), (1, 1, 1)]) == 0
    # negative genus for a connected source: disconnected covers only
    assert connected_hurwitz(4, 0, [(2, 1, 1), (2, 1, 1), (1, 1, 1, 1)]) == 0
    assert disconnected_hurwitz(4, 0, [(2, 1, 1), (2, 1, 1), (1, 1, 1, 1)]) > 0


def test_tuple_counts():
    transitive, total = tuple_counts(3, 0, [(3,), (2, 1), (2, 1)])
    assert (transitive, total) == (6, 6)
    assert Fraction(transitive, factorial(3)) == connected_hurwitz(3, 0, [(3,), (2, 1), (2, 1)])


def test_hurwitz_numbers_of_problem():
    problem = HurwitzProblem.build(degree=3, target_genus=1, genus=2)
    assert problem.profiles == (simple(3), simple(3))
    assert hurwitz_numbers(problem) == (
        connected_hurwitz(3, 1, problem.profiles),
        disconnected_hurwitz(3, 1, problem.profiles),
    )
    assert hurwitz_numbers(problem)[0] == 16  # OEIS A170991, d = 3


def test_profiles_as_strings_via_problem():
    problem = HurwitzProblem.build(degree=4, target_genus=0, profiles=["4", "2,1^2", "2^2"])
    conn, disc = hurwitz_numbers(problem)
    assert conn == disc  # a 4-cycle is present


@pytest.mark.parametrize(
    "args, error",
    [
        ((0, 0, []), ProblemError),
        ((-2, 0, []), ProblemError),
        ((3, -1, [(3,)]), ProblemError),
        ((3, 0, [(2, 2)]), ProfileError),
        ((3, 0, [(3, 0)]), ProfileError),
    ],
)
def test_bad_input(args, error):
    with pytest.raises(error):
        connected_hurwitz(*args)
    with pytest.raises(error):
        disconnected_hurwitz(*args)
