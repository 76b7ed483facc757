"""Hurwitz problems (covertree.hurwitz.problem): Riemann-Hurwitz refusals in
one line naming the data, and the JSON shape of a problem."""

from __future__ import annotations

import pytest

from covertree.errors import ProblemError, ProfileError, TooLargeError
from covertree.hurwitz.marks import MarkError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.symmetric.partitions import Partition


@pytest.mark.parametrize("kwargs, message", [
    # 2g - 2 = 3(-2) + 1: odd
    (dict(degree=3, target_genus=0, profiles=["2,1"]),
     "Riemann-Hurwitz gives genus -3/2 for degree 3, target genus 0 and profiles (2,1): "
     "the total ramification must be even"),
    # 2g - 2 = -2 < 2(0) + 0 for a double cover of an elliptic curve
    (dict(degree=2, target_genus=1, genus=0),
     "genus 0 is too small for degree 2, target genus 1 and profiles (none): their total "
     "ramification 0 exceeds the -2 that Riemann-Hurwitz allows"),
    # four 3-cycles over P^1 give genus 2: 2(1) - 2 + 6 = 6 < 8
    (dict(degree=3, target_genus=0, genus=1, profiles=["3", "3", "3", "3"]),
     "genus 1 is too small for degree 3, target genus 0 and profiles (3) (3) (3) (3): their total "
     "ramification 8 exceeds the 6 that Riemann-Hurwitz allows"),
    # three 3-cycles over P^1 give genus 1, not 0
    (dict(degree=3, target_genus=0, genus=0, profiles=["3", "3", "3"]),
     "genus 0 is too small for degree 3, target genus 0 and profiles (3) (3) (3): their total "
     "ramification 6 exceeds the 4 that Riemann-Hurwitz allows"),
])
def test_riemann_hurwitz_refusals_name_the_data(kwargs, message):
    with pytest.raises(ProblemError) as err:
        HurwitzProblem.build(**kwargs)
    assert str(err.value) == message


def test_json_shape_of_a_problem():
    # three 3-cycles over P^1: 2g - 2 = -6 + 6, genus 1
    p = HurwitzProblem.build(3, 0, profiles=["3", "3", "3"])
    assert p.to_dict() == {"genus": 1, "target_genus": 0, "degree": 3, "profiles": [[3], [3], [3]]}


def test_a_negative_euler_characteristic_is_refused():
    # four sheets over P^1 with no branching: 2g - 2 = 4(-2), g = -3
    with pytest.raises(ProblemError) as err:
        HurwitzProblem.build(4, 0)
    assert str(err.value) == "Riemann-Hurwitz gives negative genus -3"


def test_a_problem_checks_itself_when_built_directly():
    simple = HurwitzProblem.build(2, 1, genus=2).profiles  # (2), (2)
    cases = [
        ((1, -1, 2, ()), ProblemError, "target genus -1 is negative; allowed: 0, 1, 2, ..."),
        ((0, 1, 2, simple), ProblemError, "genus 0 does not satisfy Riemann-Hurwitz"),
        ((0, 0, 2, HurwitzProblem.build(3, 0, genus=0).profiles), ProfileError,
         "profile 2,1 sums to 3, not to the degree 2"),
        # an elliptic target with no marked point is not stable: 2h - 2 + b = 0
        ((1, 1, 2, ()), ProblemError,
         "the target of genus 1 with 0 marked point(s) is not stable (need 2h - 2 + b > 0); "
         "mark an unramified point with profile 1^2 to count unramified covers"),
    ]
    for args, error, message in cases:
        with pytest.raises(error) as err:
            HurwitzProblem(*args)
        assert str(err.value) == message
    # an elliptic curve with one marked point is stable
    assert HurwitzProblem(1, 1, 2, (Partition([1, 1]),)).points == 1


def test_profiles_given_as_sequences():
    p = HurwitzProblem.build(3, 0, profiles=[(3,), [2, 1], (1, 2)])
    assert p.profiles == ((3,), (2, 1), (2, 1)) and p.genus == 0


@pytest.mark.parametrize("kwargs, error, message", [
    (dict(degree=3, target_genus=0, genus=0, profiles=["2,2"]), ProfileError,
     "profile 2,2 sums to 4, not to the degree 3"),
    (dict(degree=3, target_genus=0, genus=-1), ProblemError, "genus -1 is negative; allowed: 0, 1, 2, ..."),
    (dict(degree=1, target_genus=0, genus=1), ProblemError, "genus 1 needs branching, impossible in degree 1"),
    # degree 2 over P^1: genus g needs 2g + 2 simple points
    (dict(degree=2, target_genus=0, genus=50_000), TooLargeError,
     "genus 50000 needs 100002 simple branch points at degree 2; at most 100000 allowed"),
])
def test_build_refusals(kwargs, error, message):
    with pytest.raises(error) as err:
        HurwitzProblem.build(**kwargs)
    assert str(err.value) == message


def test_build_fills_in_exactly_what_riemann_hurwitz_asks():
    # the profiles alone reach the genus: 2 = 0 + 2 over an elliptic curve
    p = HurwitzProblem.build(4, 1, genus=2, profiles=["2,2"])
    assert p.profiles == ((2, 2),)
    # 2(49999) - 2 = 2(-2) + 100000: the largest number of points allowed
    assert HurwitzProblem.build(2, 0, genus=49_999).points == 100_000


def test_marks_of_a_problem_built_directly():
    profiles = HurwitzProblem.build(5, 0, profiles=["3,2", "5", "4,1"]).profiles  # genus 1
    # legs in leg order (decreasing index at one branch point), given as lists
    p = HurwitzProblem(1, 0, 5, profiles, [[1, 3], [1, 2], [3, 1]])
    assert p.marks == ((1, 3), (1, 2), (3, 1))
    cases = [
        (((1, 2), (1, 3)), "marks must be in leg order: by branch point, then by decreasing index"),
        (((2, 5), (1, 3)), "marks must be in leg order: by branch point, then by decreasing index"),
        (((3, 4), (3, 4)), "2 legs of index 4 over branch point 3; its profile 4,1 has fewer such points"),
        (((2, 3),), "mark (2, 3) names no point: need a branch point 1 .. 3 and an index in its profile"),
        (((4, 1),), "mark (4, 1) names no point: need a branch point 1 .. 3 and an index in its profile"),
    ]
    for marks, message in cases:
        with pytest.raises(MarkError) as err:
            HurwitzProblem(1, 0, 5, profiles, marks)
        assert str(err.value) == message
    # one leg over each point of a profile with one such point
    assert HurwitzProblem(1, 0, 5, profiles, ((2, 5), (3, 4))).n_marks == 2


def test_degree_bounds_in_one_line():
    from covertree.hurwitz.numbers import connected_hurwitz
    from covertree.limits import MAX_DEGREE
    for degree, error, message in [
        (0, ProblemError, "degree 0 is not allowed; the degree must be a positive integer"),
        (MAX_DEGREE + 1, TooLargeError, f"degree {MAX_DEGREE + 1} is larger than the largest degree covertree "
                                        f"handles ({MAX_DEGREE}; far smaller ones are refused as infeasible)"),
    ]:
        with pytest.raises(error) as err:
            HurwitzProblem.build(degree, 1, genus=1)
        assert str(err.value) == message
    # the largest degree itself is a problem (unramified covers of an elliptic curve)
    assert HurwitzProblem(1, 1, MAX_DEGREE, (Partition.parse(f"1^{MAX_DEGREE}"),)).degree == MAX_DEGREE
    for args, error, message in [
        ((2, -1, [(2,)]), ProblemError, "target genus -1 is not allowed; allowed: 0, 1, 2, ..."),
        ((2, True, [(2,)]), ProblemError, "target genus True is not allowed; allowed: 0, 1, 2, ..."),
        ((3, 0, [(2, 1), (2,)]), ProfileError, "profile 2 sums to 2, not to the degree 3"),
    ]:
        with pytest.raises(error) as err:
            connected_hurwitz(*args)
        assert str(err.value) == message
