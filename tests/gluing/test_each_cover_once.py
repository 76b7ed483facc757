"""The list engine against its reference, the search as it was before each
cover was generated once (:mod:`tests.gluing.reference_gluing`).

Over every labelled base stratum of each problem below, the covers listed by
:func:`covertree.gluing.covers.glued_covers` and by the reference must be the
same multiset of (canonical code, ``|Aut|``, multiplicity, edge profiles), and
the engine must list no code twice.  The problems are small: targets of genus
0, 1 and 2, simple and non-simple profiles, marked points, and bases with
loops, parallel edges and several identical pieces over one vertex (the case
the symmetry breaking of :mod:`covertree.gluing.covers` is about).
"""

from __future__ import annotations

from collections import Counter

import pytest

from covertree.gluing.covers import GluingStats, glued_covers
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import base_strata
from tests.gluing.reference_gluing import reference_glued_covers

# (degree, target genus, source genus or None, given profiles, max codim, marks)
PROBLEMS = [
    (d, 1, 2, (), 2, ()) for d in range(2, 7)
] + [
    (3, 1, 3, (), 2, ()),
    (2, 0, 2, (), 3, ()),
    (3, 0, 1, (), 3, ()),
    (4, 0, 0, (), 2, ()),
    (2, 2, None, ("1,1",), 2, ()),
    (3, 2, None, ("1^3",), 2, ()),
    (4, 1, None, ("1^4",), 2, ()),
    (5, 1, None, ("1^5",), 1, ()),
    (4, 1, None, ("2,2",), 2, ()),
    (4, 1, None, ("3,1", "2,2"), 2, ()),
    (4, 0, None, ("2,2", "2,2", "2,1,1", "2,1,1"), 2, ()),
    (4, 0, None, ("4", "3,1", "2,1,1"), 2, ()),
    (6, 0, None, ("2,2,2", "2,2,2", "2,2,1,1", "2,2,1,1"), 2, ()),
    (6, 0, None, ("3,3", "2,2,2", "2,2,1,1", "2,1^4"), 2, ()),
    (4, 1, 2, (), 2, ((1, 2),)),
    (3, 0, None, ("3", "2,1", "2,1", "1^3"), 2, ((4, 1),)),
]

# single strata with many identical pieces on both sides of parallel edges
BANANAS = [
    ("g0{1}, g0{2} | 0-1^2", d, [(2,) + (1,) * (d - 2)] * 2) for d in range(3, 8)
] + [
    ("g0{1}, g0{2} | 0-1^3", 4, [(2, 1, 1)] * 2),
    ("g0{1}, g0{2} | 0-1^2", 6, [(2, 2, 1, 1)] * 2),
    ("g0{1}, g0{2} | 0-1, 0-0", 5, [(2, 1, 1, 1)] * 2),
    ("g0{1}, g0{2} | 0-0, 1-1, 0-1", 3, [(2, 1)] * 2),
    ("g1, g0{1,2} | 0-1^2", 3, [(2, 1)] * 2),
]


def _ident(args):
    d, h, g, given, k, marks = args
    return f"d{d}-h{h}-g{g}-{'_'.join(given) or 'simple'}-k{k}" + ("-marked" if marks else "")


def _shapes(covers) -> Counter:
    return Counter((c.code, c.automorphisms, c.multiplicity, c.edge_profiles, c.source_legs) for c in covers)


def _compare(base, degree, profiles, marks=()) -> GluingStats:
    stats = GluingStats()
    new = list(glued_covers(base, degree, profiles, marks, stats))
    old = list(reference_glued_covers(base, degree, profiles, marks))
    assert _shapes(new) == _shapes(old), base.notation
    assert len({c.code for c in new}) == len(new)
    assert stats.repeats == 0
    return stats


@pytest.mark.parametrize("args", PROBLEMS, ids=_ident)
def test_same_covers_as_reference(args):
    d, h, g, given, k, marks = args
    problem = HurwitzProblem.build(d, h, genus=g, profiles=given)
    profiles = [tuple(p) for p in problem.profiles]
    for stratum in base_strata(h, profiles, k, labeled=True):
        _compare(stratum.graph, d, profiles, marks)


@pytest.mark.parametrize("case", BANANAS, ids=[f"{b}-d{d}" for b, d, _ in BANANAS])
def test_identical_pieces_on_both_sides(case):
    text, degree, profiles = case
    _compare(parse_graph(text), degree, profiles)


def test_one_code_per_cover():
    # degree 6, the stratum where identical pieces meet on both sides of two
    # parallel nodes: the reference computed 14 canonical codes per cover,
    # the engine before the orbit test 2 (10 repeats)
    base = parse_graph("g0{1}, g0{2} | 0-1^2")
    stats = _compare(base, 6, [(2, 1, 1, 1, 1)] * 2)
    assert stats.covers == 30
    assert stats.codes == 30


# strata of genus-2 covers of an elliptic curve where the engine, with the
# rules alone, computed repeated codes (repeats in the comment)
ONCE = [
    ("g0{1,2}, g1 | 0-1", 4),  # 10 repeats
    ("g0, g0{1,2} | 0-0, 0-1", 4),  # 12
    ("g0{1}, g0{2} | 0-1^2", 4),  # 1
    ("g0{1,2}, g1 | 0-1", 5),  # 50
    ("g0{1,2} | 0-0", 5),  # 2
    ("g0, g0{1,2} | 0-0, 0-1", 5),  # 35
]


@pytest.mark.parametrize("case", ONCE, ids=[f"{b}-d{d}" for b, d in ONCE])
def test_no_repeats_where_the_rules_left_some(case):
    text, degree = case
    profiles = [tuple(p) for p in HurwitzProblem.build(degree, 1, genus=2).profiles]
    stats = _compare(parse_graph(text), degree, profiles)
    assert stats.repeats == 0
    assert stats.codes == stats.covers


@pytest.mark.parametrize("budget", [0, 40])
def test_same_covers_when_the_orbit_test_gives_up(monkeypatch, budget):
    # past its budget the orbit test leaves the rest of the choice to the
    # canonical codes: the list is the same, and the repeats are counted
    import covertree.gluing.covers as covers

    monkeypatch.setattr(covers, "ORBIT_TEST_BUDGET", budget)
    base = parse_graph("g0, g0{1,2} | 0-0, 0-1")
    stats = GluingStats()
    profiles = [(2, 1, 1, 1)] * 2
    new = list(glued_covers(base, 5, profiles, stats=stats))
    assert _shapes(new) == _shapes(reference_glued_covers(base, 5, profiles))
    assert stats.untested > 0
    assert stats.repeats > 0 and stats.covers == len(new)
