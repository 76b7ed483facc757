"""The catalogue: the degeneration identity on every stratum, orbits versus
labelled strata, selection of strata, the cover limit and the tallies."""

from __future__ import annotations

import itertools
from collections import Counter
from fractions import Fraction
from math import factorial

import pytest

from covertree.catalogue.catalogue import build_catalogue, select_strata
from covertree.catalogue.covers import Cover, divisor_name
from covertree.errors import GraphError, LimitError
from covertree.graphs.curve_graph import StableCurveGraph
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.numbers import connected_hurwitz
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import base_strata
from covertree.symmetric.permutations import compose, cycle_type, inverse

# (degree, target genus, source genus or None, given profiles, max codim)
IDENTITY_PROBLEMS = [
    (2, 0, 2, (), 3),
    (2, 0, 3, (), 1),
    (3, 0, 0, (), 2),
    (3, 0, 1, (), 2),
    (3, 0, None, ("3", "3", "3"), 1),
    (4, 0, 0, ("4",), 2),
    (4, 0, None, ("2,2", "2,2", "2,2", "2,2"), 1),
    (4, 0, None, ("3,1", "2,2", "2,1,1", "2,1,1", "2,1,1", "2,1,1"), 1),
    (2, 1, 2, (), 2),
    (3, 1, 2, (), 2),
    (4, 1, 2, (), 2),
    (2, 1, 4, (), 1),
    (4, 1, None, ("4", "2,1,1"), 1),
    (4, 1, None, ("2,2", "3,1"), 2),
    (3, 1, None, ("1^3",), 1),
    (2, 2, None, ("1,1",), 2),
    (2, 2, None, ("2", "2"), 1),
    (3, 2, None, ("1^3",), 1),
]


def _ident(args):
    d, h, g, given, k = args
    return f"d{d}-h{h}-g{g}-{'_'.join(given) or 'simple'}-k{k}"


@pytest.mark.parametrize("args", IDENTITY_PROBLEMS, ids=_ident)
def test_degeneration_identity_on_every_stratum(args):
    d, h, g, given, k = args
    problem = HurwitzProblem.build(d, h, genus=g, profiles=given)
    cat = build_catalogue(problem, max_codim=k)
    hurwitz = connected_hurwitz(d, h, [tuple(mu) for mu in problem.profiles])
    assert cat.hurwitz_number == hurwitz
    assert cat.failures == []
    assert len(cat.strata) == len(base_strata(h, [tuple(mu) for mu in problem.profiles], k))
    assert cat.strata
    for s in cat.strata:
        assert s.total_weight == hurwitz, s.base.graph.notation
        assert s.identity_holds
        # weight per stable source adds up to the total
        assert sum((w for _, w in s.by_source()), Fraction(0)) == s.total_weight
        for c in s.covers:
            assert c.weight > 0
            assert c.source.genus == problem.genus == c.stable_source.genus
            assert len(c.edge_profiles) == s.base.graph.n_nodes
            assert all(sum(p) == d for p in c.edge_profiles)


def _tuple_count_hurwitz(d, types):
    """Connected Hurwitz number of P^1 with the given profiles, by counting the
    tuples of permutations with product 1 (all transitive here: one type is a
    d-cycle) and dividing by d! (docs/theory.md, section 4, directly)."""
    perms = list(itertools.permutations(range(d)))
    pools = [[p for p in perms if cycle_type(p) == t] for t in types[:-1]]
    count = sum(
        1 for tup in itertools.product(*pools) if cycle_type(inverse(compose(*tup))) == types[-1]
    )
    return Fraction(count, factorial(d))


# Regression: an earlier connected_pieces missed local covers here (for instance
# connected_pieces(5, 0, [{5: 1}] * 3) gave 1 of the 4 classes of triples of
# 5-cycles with product 1, and [(4), (4), (4), (2,1,1)] gave 3 of 4).
@pytest.mark.parametrize("types", [
    ((5,), (5,), (5,)),
    ((5,), (5,), (2, 1, 1, 1), (2, 1, 1, 1)),
    ((5,), (4, 1), (4, 1)),
    ((4,), (4,), (4,), (2, 1, 1)),
    ((3, 1), (3, 1), (4,), (2, 1, 1)),
], ids=str)
def test_smooth_stratum_against_tuple_count(types):
    # a d-cycle among the profiles: every tuple is transitive
    d = sum(types[0])
    problem = HurwitzProblem.build(d, 0, profiles=types)
    expected = _tuple_count_hurwitz(d, types)
    assert connected_hurwitz(d, 0, types) == expected  # the character formula is right
    cat = build_catalogue(problem, max_codim=0)
    assert cat.strata[0].total_weight == expected


def test_labelled_strata_match_their_orbits():
    # orbits of equal-profile relabellings: every labelled stratum of an orbit has
    # the same multiset of covers up to relabelling, so the same counts
    problem = HurwitzProblem.build(3, 0, genus=1)
    orbits = build_catalogue(problem, max_codim=1)
    labelled = build_catalogue(problem, max_codim=1, labeled=True)
    assert sum(s.base.orbit_size for s in orbits.strata) == len(labelled.strata)
    assert all(s.base.orbit_size == 1 for s in labelled.strata)
    assert len(labelled.strata) > len(orbits.strata)

    def shape(s):
        return Counter((c.stable_source, c.automorphisms, c.multiplicity) for c in s.covers)

    by_shape = Counter()
    for s in labelled.strata:
        by_shape[(s.base.codim, tuple(sorted(shape(s).items(), key=repr)))] += 1
    by_orbit = Counter()
    for s in orbits.strata:
        by_orbit[(s.base.codim, tuple(sorted(shape(s).items(), key=repr)))] += s.base.orbit_size
    assert by_shape == by_orbit


def test_select_one_stratum():
    problem = HurwitzProblem.build(2, 0, genus=2)
    stratum = parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1")
    [orbit] = select_strata(problem, stratum=stratum)
    assert orbit.orbit_size == 10  # the 3|3 splits of six points: C(6,3)/2
    [single] = select_strata(problem, stratum=stratum, labeled=True)
    assert single.graph == stratum and single.orbit_size == 1
    cat = build_catalogue(problem, stratum=stratum)
    assert len(cat.strata) == 1 and cat.strata[0].identity_holds


def test_select_rejects_a_stratum_of_the_wrong_genus():
    problem = HurwitzProblem.build(2, 1, genus=2)
    with pytest.raises(GraphError, match="genus 1"):
        select_strata(problem, stratum=parse_graph("g0{1,2}, g0 | 0-1"))


def test_select_rejects_an_unstable_graph():
    problem = HurwitzProblem.build(2, 0, genus=2)
    with pytest.raises(GraphError):
        select_strata(problem, stratum=parse_graph("g0{1}, g0{2,3,4,5,6} | 0-1"))


def test_max_covers_limit():
    problem = HurwitzProblem.build(2, 1, genus=2)
    with pytest.raises(LimitError):
        build_catalogue(problem, max_codim=0, max_covers=3)  # the smooth stratum has 4
    assert build_catalogue(problem, max_codim=0, max_covers=4).n_covers == 4


def test_covers_sorted_deterministically():
    problem = HurwitzProblem.build(3, 1, genus=2)
    a = build_catalogue(problem, max_codim=2)
    b = build_catalogue(problem, max_codim=2)
    assert len(a.strata) == len(b.strata) > 0
    for s, t in zip(a.strata, b.strata):
        assert [c.sort_key() for c in s.covers] == sorted(c.sort_key() for c in s.covers)
        assert [c.sort_key() for c in s.covers] == [c.sort_key() for c in t.covers]
        assert s.covers == t.covers


def test_divisor_names():
    assert divisor_name(StableCurveGraph([1], nodes=[(0, 0)])) == "delta_0"
    assert divisor_name(StableCurveGraph([1, 2], nodes=[(0, 1)])) == "delta_1"
    assert divisor_name(StableCurveGraph([1, 1], nodes=[(0, 1)])) == "delta_1"
    assert divisor_name(StableCurveGraph([3])) is None
    assert divisor_name(StableCurveGraph([0], nodes=[(0, 0), (0, 0)])) is None  # codim 2
    assert divisor_name(StableCurveGraph([0, 1], nodes=[(0, 0), (0, 1)])) is None


def test_catalogue_of_genus_two_double_covers_lands_in_two_divisors():
    # degree 2 over E (two branch points), codim 1: the stable sources of the
    # one-node strata are delta_0 and delta_1 and g0 | 0-0^2 (by hand, see
    # test_hand_examples): the weight landing in delta_1 is 1/2
    cat = build_catalogue(HurwitzProblem.build(2, 1, genus=2), max_codim=1)
    landing = Counter()
    for s in cat.strata:
        for g, w in s.by_source():
            landing[g.notation] += w
    assert landing["g1, g1 | 0-1"] == Fraction(1, 2)
    assert isinstance(cat.strata[0].covers[0], Cover)
