"""Tallies of marked problems (points of the source over branch points marked)
against the list engine, which lists every marked cover."""

import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.catalogue.pullback import build_pullback
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.pullback import pullback_from_types
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
    # two kinds of marked points, 3 labellings of the first in a piece of degree 3 and 1 of the second
    (3, 0, 0, ("1,1,1", "2,1", "2,1", "2,1", "2,1"), ["1:1", "2:2"]),
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


@pytest.mark.parametrize("spec, labeled", [
    ((2, 0, 2, (), ["1"]), False),
    ((2, 0, 2, (), ["1", "4"]), True),
    ((2, 1, 2, (), ["1"]), False),
    ((2, 0, 2, (), []), True),
    ((3, 0, 2, ("2,1",) * 8, ["1:1"]), False),
])
def test_pullbacks_from_types_agree_with_the_listed_covers(spec, labeled):
    # the divisors of Mbar_{G,n} with the marks, the rows per base stratum (per orbit of like
    # branch points unless labeled): the list engine's, coefficient by coefficient
    d, h, g, profiles, marks = spec
    problem = HurwitzProblem.build(d, h, genus=g, profiles=profiles, marks=marks)
    listed, typed = build_pullback(problem, labeled=labeled), pullback_from_types(problem, labeled=labeled)
    assert typed.problem == listed.problem and typed.hurwitz_number == listed.hurwitz_number
    assert typed.divisors == listed.divisors and len(typed.rows) == len(listed.rows) > 0
    for a, b in zip(listed.rows, typed.rows):
        assert a.base == b.base and a.coefficients == b.coefficients, a.base.graph.notation
        assert a.branch_total == b.branch_total == b.hurwitz_number == a.hurwitz_number
        assert b.n_covers == 0 < a.n_covers  # the type engine lists no covers
    assert not typed.failures


def test_default_is_codimension_one_as_in_the_catalogue():
    problem = HurwitzProblem.build(2, 0, genus=2)
    tallied = tally_catalogue(problem)
    assert tallied.codim == 1 and {t.base.codim for t in tallied.strata} == {0, 1}
    assert [t.base for t in tallied.strata] == [s.base for s in build_catalogue(problem, max_codim=1).strata]


def test_strata_selection_as_in_the_catalogue():
    # one given stratum, labelled strata and the work limit are passed on as the catalogue passes them
    from covertree.errors import TooLargeError
    from covertree.graphs.notation import parse_graph

    problem = HurwitzProblem.build(2, 0, genus=2)
    stratum = parse_graph("g0{1,2}, g0{3,4,5,6} | 0-1")
    for kwargs in ({"stratum": stratum}, {"labeled": True}, {"stratum": stratum, "labeled": True}):
        tallied, listed = tally_catalogue(problem, 1, **kwargs), build_catalogue(problem, max_codim=1, **kwargs)
        assert [t.base for t in tallied.strata] == [s.base for s in listed.strata], kwargs
        assert [t.total_weight for t in tallied.strata] == [s.total_weight for s in listed.strata], kwargs
    with pytest.raises(TooLargeError):
        tally_catalogue(problem, 3, max_work=10)
