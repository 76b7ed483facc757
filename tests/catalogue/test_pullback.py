"""Pullbacks of boundary divisors: the branch-total identity and hand-worked values."""

from fractions import Fraction

import pytest
from hypothesis import given, settings, strategies as st

from covertree.catalogue.pullback import boundary_divisors, build_pullback, pullback_strata
from covertree.errors import ProblemError
from covertree.hurwitz.problem import HurwitzProblem

PROBLEMS = [(2, 0, 2), (2, 0, 3), (3, 0, 2), (2, 1, 2), (2, 1, 3), (3, 1, 2), (4, 1, 2), (2, 2, 3)]


@pytest.mark.parametrize("degree,target,genus", PROBLEMS)
def test_branch_total_is_the_hurwitz_number(degree, target, genus):
    pb = build_pullback(HurwitzProblem.build(degree, target, genus=genus))
    assert pb.rows and not pb.failures
    assert all(r.branch_total == pb.hurwitz_number for r in pb.rows)
    assert all(set(r.coefficients) == set(boundary_divisors(genus)) for r in pb.rows)
    assert all(c >= 0 for r in pb.rows for c in r.coefficients.values())


@settings(max_examples=8, deadline=None)
@given(st.sampled_from([(2, 0, 2), (2, 0, 3), (2, 1, 2), (3, 1, 2), (2, 1, 3)]), st.booleans())
def test_branch_total_labelled_or_not(problem, labeled):
    d, h, g = problem
    pb = build_pullback(HurwitzProblem.build(d, h, genus=g), labeled=labeled)
    assert not pb.failures


def test_labelled_rows_agree_with_their_orbit():
    p = HurwitzProblem.build(2, 0, genus=2)
    orbits = build_pullback(p)
    labelled = build_pullback(p, labeled=True)
    assert sum(r.base.orbit_size for r in orbits.rows) == len(labelled.rows) == 25  # 2^5 - 7 divisors
    values = {tuple(sorted(r.coefficients.items())) for r in labelled.rows}
    assert values == {tuple(sorted(r.coefficients.items())) for r in orbits.rows}


def test_hand_worked_genus_2_double_covers_of_the_line():
    # Worked by hand.  H = 1/2 (one hyperelliptic cover, |Aut| = 2).
    # 2|4 divisor: over the 2-point side the node has trivial monodromy, so two
    #   nodes of index 1 join a rational curve (double cover branched at 2 points)
    #   to an elliptic curve (branched at 4): one cover, |Aut| = 2 (the involution),
    #   L = 1, one branch; the rational bridge stabilises to one loop smoothed by
    #   s1*s2 = t^2, order 1 + 1 = 2: c(delta_0) = 1 * 2 / 2 = 1, c(delta_1) = 0.
    #   Check: #branches * L / |Aut| = 1/2 = H.
    # 3|3 divisor: the node has monodromy a transposition, one node of index 2
    #   joining two elliptic curves: one cover, |Aut| = 4 (independent
    #   involutions), L = 2, prod(e)/L = 1 branch, the node smoothed to order
    #   L/e = 1: c(delta_1) = 1 * 1 / 4 = 1/4, c(delta_0) = 0.
    #   Check: 1 * 2 / 4 = 1/2 = H.
    pb = build_pullback(HurwitzProblem.build(2, 0, genus=2))
    got = {r.base.graph.notation: r.coefficients for r in pb.rows}
    assert got == {
        "g0{1,2}, g0{3,4,5,6} | 0-1": {"delta_0": Fraction(1), "delta_1": Fraction(0)},
        "g0{1,2,3}, g0{4,5,6} | 0-1": {"delta_0": Fraction(0), "delta_1": Fraction(1, 4)},
    }


def test_no_mbar_for_genus_below_two():
    with pytest.raises(ProblemError, match="G >= 2"):
        build_pullback(HurwitzProblem.build(2, 1, genus=1, profiles=["1,1"]))


def test_pullback_records_its_problem_divisors_and_cover_counts():
    # degree 2: the monodromy of a double cover is determined by its branch
    # points (S_2 has one transposition), so over each divisor of Mbar_{0,6}
    # there is exactly one admissible cover (worked by hand, as above)
    problem = HurwitzProblem.build(2, 0, genus=2)
    pb = build_pullback(problem)
    assert pb.problem == problem
    assert pb.divisors == ("delta_0", "delta_1")
    assert [r.n_covers for r in pb.rows] == [1, 1]
    assert all(r.hurwitz_number == Fraction(1, 2) and r.check_holds for r in pb.rows)


def test_pullback_strata_are_orbits_unless_labelled():
    # the divisors of Mbar_{0,6} are the splits of six labelled points into two
    # sides of at least two: C(6,2) + C(6,3)/2 = 15 + 10 = 25 (common knowledge);
    # up to relabelling the like branch points, two: 2|4 and 3|3
    problem = HurwitzProblem.build(2, 0, genus=2)
    assert [b.graph.notation for b in pullback_strata(problem)] == [
        "g0{1,2}, g0{3,4,5,6} | 0-1", "g0{1,2,3}, g0{4,5,6} | 0-1"]
    assert len(pullback_strata(problem, labeled=True)) == 25


def test_boundary_divisors_of_small_marked_spaces():
    # Mbar_{1,1} has one boundary divisor, the nodal rational curve (common
    # knowledge); Mbar_{0,3} is a point and Mbar_{0,n} for n < 3 does not exist
    assert boundary_divisors(1, 1) == ["delta_0"]
    assert boundary_divisors(0, 4) == ["delta_0_{1,2}", "delta_0_{1,3}", "delta_0_{1,4}"]
    for n in (1, 2, 3):
        with pytest.raises(ProblemError, match=rf"Mbar_\{{0,{n}\}}, which has no boundary divisor "
                                               r"to pull back; mark more points or raise the genus$"):
            boundary_divisors(0, n)
    with pytest.raises(ProblemError, match=r"got G = 1; mark points with --mark to land in Mbar_\{G,n\}$"):
        boundary_divisors(1)


def test_hand_worked_genus_2_double_covers_with_a_weierstrass_point_marked():
    # Worked by hand, as the unmarked case above, with the ramification point over
    # branch point 1 marked (one labelling; every involution fixes it, so |Aut| is
    # unchanged).  Branch point 1 is now told apart, so the 2|4 split has two
    # orbits.  1 on the two-point side: the rational bridge carries the leg and
    # stays (three special points), its two nodes are non-separating of order 1
    # each: c(delta_0) = 2/2 = 1.  1 on the four-point side: the bridge goes, one
    # loop of order 2 on the marked elliptic curve: c(delta_0) = 1.  The 3|3 split:
    # the node separates (genus 1 with the leg | genus 1), the divisor delta_1_{}
    # of Mbar_{2,1}: c = 1/4.  These are the unmarked values, as forgetting the
    # point pulls delta_0 and delta_1 back to delta_0 and delta_1_{}.
    pb = build_pullback(HurwitzProblem.build(2, 0, genus=2, marks=["1"]))
    assert pb.divisors == ("delta_0", "delta_1_{}") and pb.hurwitz_number == Fraction(1, 2)
    got = {r.base.graph.notation: r.coefficients for r in pb.rows}
    assert got == {
        "g0{1,2}, g0{3,4,5,6} | 0-1": {"delta_0": Fraction(1), "delta_1_{}": Fraction(0)},
        "g0{2,3}, g0{1,4,5,6} | 0-1": {"delta_0": Fraction(1), "delta_1_{}": Fraction(0)},
        "g0{1,2,3}, g0{4,5,6} | 0-1": {"delta_0": Fraction(0), "delta_1_{}": Fraction(1, 4)},
    }
