"""Tallies of marked problems (points of the source over branch points marked)
against the list engine, which lists every marked cover."""

import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import tally_catalogue

# (degree, target genus, source genus, profiles, marks): "J:e^c" marks c points of index e over
# branch point J, "J" every ramified point over J (covertree.hurwitz.marks)
MARKED = [
    (2, 0, 2, (), ["1"]),
    (2, 0, 2, (), ["1", "2"]),
    (2, 1, 2, (), ["1"]),
    (3, 1, None, ("1,1,1",), ["1:1^2"]),
    (3, 0, 1, ("2,1", "2,1", "2,1", "2,1"), ["1", "2:1"]),
    (3, 0, 0, ("3",), ["1", "2:1"]),
    (2, 0, 1, ("2", "2", "2", "2", "1,1"), ["5:1^2", "1"]),
    (3, 0, 1, ("2,1",) * 4 + ("1,1,1",), ["5:1", "3:2"]),
]


@pytest.mark.parametrize("spec", MARKED, ids=str)
def test_marked_tallies_agree_with_the_listed_covers(spec):
    d, h, g, profiles, marks = spec
    problem = HurwitzProblem.build(d, h, genus=g, profiles=profiles, marks=marks)
    listed, tallied = build_catalogue(problem, max_codim=1), tally_catalogue(problem, max_codim=1)
    assert listed.hurwitz_number == tallied.hurwitz_number
    for s, t in zip(listed.strata, tallied.strata, strict=True):
        assert t.total_weight == s.total_weight and t.by_source() == s.by_source(), s.base.graph.notation
    assert not tallied.failures
