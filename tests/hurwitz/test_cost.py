"""The guard before a Hurwitz count (covertree.hurwitz.cost).

The number of simple points is checked against Riemann-Hurwitz worked by hand
and against the problems covertree builds; each refusal's claims are checked by
asking the guard again: the largest feasible degree (or genus) it names passes,
the next one is refused.
"""

from __future__ import annotations

import pytest

from covertree.errors import TooLargeError
from covertree.hurwitz.cost import MAX_POINTS, check_count, count_work, simple_points_needed
from covertree.hurwitz.problem import HurwitzProblem

LIMIT = 10**8


def _refusal(*args) -> str:
    with pytest.raises(TooLargeError) as err:
        check_count(*args)
    return str(err.value)


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
    largest = int(line.rsplit(" ", 1)[1])
    check_count(6, 0, largest, [], LIMIT)
    with pytest.raises(TooLargeError):
        check_count(6, 0, largest + 1, [], LIMIT)
    assert _refusal(6, 0, 50_000, [], LIMIT) == line


def test_a_refused_degree_names_the_largest_feasible_one():
    # one profile 3,1^(d-3): the named degree passes with the same profile, the next not
    d = 100_000
    line = _refusal(d, 1, None, [(3,) + (1,) * (d - 3)], LIMIT)
    assert "the largest feasible degree with 1 branch point is " in line
    largest = int(line.rsplit(" ", 1)[1])
    assert 3 <= largest < d
    check_count(largest, 1, None, [(3,) + (1,) * (largest - 3)], LIMIT)
    with pytest.raises(TooLargeError):
        check_count(largest + 1, 1, None, [(3,) + (1,) * (largest - 2)], LIMIT)


def test_the_genus_hint_follows_the_engine_of_an_elliptic_target():
    # degree 40 over an elliptic curve, simple points only: the hint is the
    # largest genus the guard itself lets through at this degree
    line = _refusal(40, 1, 60_000, [], None)
    assert line.startswith("genus 60000 needs 119998 branch points at degree 40; at most 100000 allowed; "
                           "the largest feasible genus at degree 40 is ")
    largest = int(line.rsplit(" ", 1)[1])
    check_count(40, 1, largest, [], LIMIT)
    with pytest.raises(TooLargeError):
        check_count(40, 1, largest + 1, [], LIMIT)
