"""Pullbacks to Mbar_{G,n} for marked sources, against the unmarked ones.

Forgetting the legs, pi: Mbar_{G,n} -> Mbar_G, pulls delta_0 back to delta_0
and delta_i back to the sum of the separating divisors of Mbar_{G,n} whose
sides have genera i and G - i (Arbarello-Cornalba, Calculating cohomology
groups of moduli spaces of curves via algebraic geometry, 1998, section 1;
from memory).  The marked cover space maps to the unmarked one with degree the
number of labellings of the marked points, so summing the marked
coefficients over the divisors above delta_i gives the unmarked coefficient
times the labellings, for every base divisor.  Both engines must agree.
"""

from __future__ import annotations

from fractions import Fraction

import pytest

from covertree.catalogue.pullback import boundary_divisors, build_pullback
from covertree.errors import ProblemError
from covertree.hurwitz.marks import labellings
from covertree.hurwitz.problem import HurwitzProblem
from covertree.intersection.boundary import IRR, divisors, divisor_name
from covertree.tallies.pullback import pullback_from_types

PROBLEMS = [
    (2, 0, 2, (), ["1"]),
    (2, 0, 2, (), ["1", "4"]),
    (2, 0, 2, (), ["1", "2", "3", "4", "5", "6"]),
    (2, 0, 3, (), ["2"]),
    (2, 1, 2, (), ["1"]),
    (2, 1, 2, (), ["1", "2"]),
    (3, 0, 2, ("2,1",) * 8, ["1:1"]),
    (3, 0, 2, ("2,1",) * 8, ["1", "2:1"]),
    (2, 1, 3, ("2", "2", "2", "2"), ["3"]),
]


def _above(genus: int, n: int) -> dict[str, str]:
    """Divisor of Mbar_{G,n} -> the divisor of Mbar_G below it."""
    out = {}
    for key in divisors(genus, n):
        if key == IRR:
            out["delta_0"] = "delta_0"
        else:
            i = min(key[0], genus - key[0])
            out[divisor_name(genus, n, key)] = f"delta_{i}" if i else None
    return out


@pytest.mark.parametrize("spec", PROBLEMS, ids=str)
def test_marked_pullbacks_push_down_to_the_unmarked_ones(spec):
    d, h, g, profiles, marks = spec
    marked = HurwitzProblem.build(d, h, genus=g, profiles=profiles, marks=marks)
    plain = marked.unmarked()
    factor = labellings([tuple(p) for p in plain.profiles], marked.marks)
    a, b = pullback_from_types(marked, labeled=True), pullback_from_types(plain, labeled=True)
    assert not a.failures and a.divisors == tuple(boundary_divisors(marked.genus, marked.n_marks))
    below = _above(marked.genus, marked.n_marks)
    for r, s in zip(a.rows, b.rows):
        assert r.base.graph == s.base.graph
        summed = {k: Fraction(0) for k in s.coefficients}
        for name, c in r.coefficients.items():
            if below[name] is not None:
                summed[below[name]] += c
            else:  # a genus-0 side: forgetting the legs contracts it
                pass
        assert summed == {k: v * factor for k, v in s.coefficients.items()}, r.base.graph.notation


@pytest.mark.parametrize("spec", PROBLEMS, ids=str)
def test_both_engines_agree_on_marked_pullbacks(spec):
    d, h, g, profiles, marks = spec
    problem = HurwitzProblem.build(d, h, genus=g, profiles=profiles, marks=marks)
    a, b = build_pullback(problem), pullback_from_types(problem)
    assert [r.coefficients for r in a.rows] == [r.coefficients for r in b.rows]
    assert [r.base.orbit_size for r in a.rows] == [r.base.orbit_size for r in b.rows]


def test_marked_genus_one_source_has_a_pullback():
    problem = HurwitzProblem.build(3, 1, profiles=["1,1,1"], marks=["1:1"])
    pb = build_pullback(problem)
    assert pb.divisors == ("delta_0",) and not pb.failures


def test_no_boundary_divisor_is_an_error():
    problem = HurwitzProblem.build(3, 0, genus=0, profiles=["3"], marks=["1", "2:1", "3:1"])
    with pytest.raises(ProblemError, match="no boundary divisor"):
        build_pullback(problem)
