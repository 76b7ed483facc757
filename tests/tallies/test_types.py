"""Unit tests of the type engine: shapes, local multisets, orbit-counted
matchings (against brute force), explicit types with |Aut T|, and the
degeneration identity at degrees the list engine cannot reach."""

from collections import Counter
from fractions import Fraction
from itertools import permutations, product

import pytest

from covertree.errors import GraphError, IdentityError, ProblemError
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.numbers import connected_hurwitz
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import BaseStratum
from covertree.symmetric.partitions import partitions_of, sub_partitions
from covertree.tallies.gluing import count_matchings
from covertree.tallies.shapes import local_multisets, piece_shapes
from covertree.tallies.types import _type_code, iter_types, tally_catalogue, tally_stratum


# --- shapes -----------------------------------------------------------------


def _brute_shapes(d, h, legs, n_halves, max_genus):
    """Every (k, legs, halves) with nonzero weight and genus <= max_genus, by
    trying all sub-profiles and all partitions."""
    out = set()
    for k in range(1, d + 1):
        leg_options = [[tuple(nu) for nu in sub_partitions(mu, k)] for mu in legs]
        half_options = [tuple(p) for p in partitions_of(k)]
        for ls in product(*leg_options):
            for hs in product(half_options, repeat=n_halves):
                twice = k * (2 * h - 2) + sum(k - len(p) for p in ls + hs) + 2
                if twice % 2 or not 0 <= twice // 2 <= max_genus:
                    continue
                if connected_hurwitz(k, h, ls + hs):
                    out.add((k, ls, hs, twice // 2))
    return out


@pytest.mark.parametrize("d, h, legs, n_halves, max_genus", [
    (4, 0, ((2, 1, 1), (2, 1, 1)), 2, 2),
    (4, 1, ((3, 1),), 1, 3),
    (3, 0, ((3,), (2, 1), (2, 1)), 1, 1),
    (5, 0, ((2, 2, 1),), 2, 1),
    (3, 2, (), 1, 4),
])
def test_shapes_match_brute_force(d, h, legs, n_halves, max_genus):
    shapes = piece_shapes(d, h, legs, n_halves, max_genus)
    got = {(s.degree, s.legs, s.halves, s.genus) for s in shapes}
    assert got == _brute_shapes(d, h, legs, n_halves, max_genus)
    for s in shapes:
        assert s.hurwitz == connected_hurwitz(s.degree, h, s.legs + s.halves)


def test_local_multisets_exhaust_degree_and_legs():
    d, h, legs, n_halves, g = 4, 0, ((2, 1, 1), (2, 1, 1), (2, 2)), 1, 3
    shapes = piece_shapes(d, h, legs, n_halves, g)
    multisets = local_multisets(d, h, legs, n_halves, g)
    assert multisets and multisets == sorted(set(multisets))
    for m in multisets:
        assert list(m) == sorted(m)
        assert sum(shapes[i].degree for i in m) == d
        assert sum(shapes[i].genus for i in m) <= g
        for j, mu in enumerate(legs):
            assert Counter(x for i in m for x in shapes[i].legs[j]) == Counter(mu)
    # brute force: all multisets of up to d shapes
    brute = set()
    for n in range(1, d + 1):
        for combo in product(range(len(shapes)), repeat=n):
            if list(combo) != sorted(combo):
                continue
            ok = sum(shapes[i].degree for i in combo) == d and sum(shapes[i].genus for i in combo) <= g
            ok = ok and all(Counter(x for i in combo for x in shapes[i].legs[j]) == Counter(mu)
                            for j, mu in enumerate(legs))
            if ok:
                brute.add(combo)
    assert set(multisets) == brute


# --- matchings: orbit counting against brute force ---------------------------


def _brute_matchings(base_edges, vertex, halves, classes):
    """All labelled matchings with connected source, grouped by type code."""
    points = {}
    for k, (a, b) in enumerate(base_edges):
        points.setdefault(a, []).append((k, 0))
        points.setdefault(b, []).append((k, 1))
    sides = {}
    for i, (v, profiles) in enumerate(zip(vertex, halves)):
        for (k, side), profile in zip(points.get(v, []), profiles):
            for c, length in enumerate(profile):
                sides.setdefault((k, length), ([], []))[side].append((i, c))
    blocks = sorted(sides.items())
    out = Counter()
    for perms in product(*(permutations(range(len(right))) for _, (left, right) in blocks)):
        edges = []
        for ((k, length), (left, right)), perm in zip(blocks, perms):
            if len(left) != len(right):
                return Counter()
            edges += [(left[t][0], right[perm[t]][0], k, length) for t in range(len(left))]
        parent = list(range(len(vertex)))

        def find(x):
            while parent[x] != x:
                x = parent[x]
            return x

        for i, j, _, _ in edges:
            parent[find(i)] = find(j)
        if len({find(x) for x in range(len(vertex))}) == 1:
            out[_type_code(classes, edges)[0]] += 1
    return out


def _grouped(base_edges, vertex, halves, classes):
    out = Counter()
    for key, n in count_matchings(base_edges, vertex, halves, classes).items():
        out[_type_code(classes, key)[0]] += n
    return out


@pytest.mark.parametrize("base_edges, vertex, halves, classes", [
    # a loop, three identical unramified sheets and pieces (1, 1) | (2), (2) | (1, 1)
    ([(0, 0)], [0] * 5, [((1,), (1,))] * 3 + [((1, 1), (2,)), ((2,), (1, 1))], [0, 0, 0, 1, 2]),
    # a loop, two merging and two splitting pieces
    ([(0, 0)], [0, 0, 0, 0], [((2, 1), (3,)), ((2, 1), (3,)), ((3,), (2, 1)), ((3,), (2, 1))], [0, 0, 1, 1]),
    # a separating edge: two identical sheets and a double piece against two pieces
    ([(0, 1)], [0, 0, 0, 1, 1], [((1,),)] * 2 + [((1, 1),)] * 3, [0, 0, 1, 2, 2]),
    # the same with three sheets on one side: a tree of six pieces
    ([(0, 1)], [0, 0, 0, 0, 1, 1], [((1,),)] * 3 + [((2, 1),), ((2, 1),), ((1, 1, 1),)], [0, 0, 0, 1, 2, 3]),
    # two parallel edges between two vertices, identical pieces on both sides
    ([(0, 1), (0, 1)], [0, 0, 1, 1], [((1, 1), (2,))] * 2 + [((1, 1), (2,))] * 2, [0, 0, 1, 1]),
    # a loop and an edge
    ([(0, 0), (0, 1)], [0, 0, 1], [((1,), (1,), (1,)), ((1, 1), (1, 1), (2,)), ((2, 1),)], [0, 1, 2]),
])
def test_orbit_counting_matches_brute_force(base_edges, vertex, halves, classes):
    brute = _brute_matchings(base_edges, vertex, halves, classes)
    assert brute, "the example should have connected matchings"
    assert _grouped(base_edges, vertex, halves, classes) == brute


# --- explicit types -----------------------------------------------------------


@pytest.mark.parametrize("problem, stratum", [
    (HurwitzProblem.build(3, 1, genus=2), "g0{1,2} | 0-0"),
    (HurwitzProblem.build(4, 1, genus=2), "g0{1,2}, g1 | 0-1"),
    (HurwitzProblem.build(3, 0, genus=0), "g0{1,2}, g0{3,4} | 0-1"),
    (HurwitzProblem.build(3, 0, genus=1), "g0{1,2,3}, g0{4,5,6} | 0-1"),
    (HurwitzProblem.build(4, 0, None, ["2,2", "2,2", "2,2", "3,1"]), "g0{1,2}, g0{3,4} | 0-1"),
    (HurwitzProblem.build(3, 1, genus=2), "g0{1}, g0{2} | 0-1, 0-1"),
    (HurwitzProblem.build(3, 1, genus=2), "g0{1,2}, g0 | 0-1, 1-1"),
])
def test_types_with_automorphisms_sum_to_the_tally(problem, stratum):
    base = BaseStratum(parse_graph(stratum), 1)
    tally = tally_stratum(problem, base)
    types = list(iter_types(problem, base))
    assert sum((t.weight for t in types), Fraction(0)) == tally.total_weight == tally.hurwitz_number
    by_profiles = Counter()
    for t in types:
        by_profiles[t.edge_profiles] += t.weight
    assert sorted(by_profiles.items()) == tally.by_profiles()
    assert bool(types) == (tally.total_weight != 0)  # problem4 has H = 0 (products stay in V_4)
    for t in types:
        # every edge profile is a partition of the degree, one per base node
        assert len(t.edge_profiles) == base.graph.n_nodes
        assert all(sum(p) == problem.degree for p in t.edge_profiles)


def test_type_automorphisms_by_hand():
    # Genus-2 double covers of an elliptic curve over the separating stratum
    # g0{1,2}, g1 | 0-1 (worked by hand).  Over the rational component the only
    # piece is the double cover branched at both legs, unramified over the node
    # (alpha = (1,1), genus 0, H = 1/2, H_lab = 1/2 * 2! = 1); alpha = (2) would
    # give odd ramification.  Over the elliptic component, profile (1,1):
    # (a) one unramified double cover (genus 1, H = sigma(2)/2 = 3/2, H_lab = 3):
    #     the two pairs of points are matched in one way up to relabelling,
    #     |Aut T| = 2! (relabel both pairs at once), weight 1 * 1 * 3 / 2 = 3/2;
    # (b) two identical sheets (genus 1, H = 1): |Aut T| = 2 (swap the sheets and
    #     the two points of the double cover), weight 1 * 1 * 1 * 1 / 2 = 1/2.
    # Total 2 = H (Dijkgraaf's 2 [q^2] F_2, checked in test_published_types).
    base = BaseStratum(parse_graph("g0{1,2}, g1 | 0-1"), 1)
    types = list(iter_types(HurwitzProblem.build(2, 1, genus=2), base))
    got = sorted((len(t.shapes), t.automorphisms, t.weight) for t in types)
    assert got == [(2, 2, Fraction(3, 2)), (3, 2, Fraction(1, 2))]
    # (a) g0 = g1 with two nodes: the rational bridge contracts to a loop;
    # (b) g1 - g0 - g1: the bridge contracts to delta_1
    by_source = tally_stratum(HurwitzProblem.build(2, 1, genus=2), base).by_source()
    assert [(g.notation, w) for g, w in by_source] == [("g1 | 0-0", Fraction(3, 2)), ("g1, g1 | 0-1", Fraction(1, 2))]


# --- the identity at large degree ------------------------------------------


@pytest.mark.parametrize("problem, codim", [
    (HurwitzProblem.build(12, 1, genus=2), 1),
    (HurwitzProblem.build(9, 1, genus=2), 2),
    (HurwitzProblem.build(8, 1, genus=3), 1),
    (HurwitzProblem.build(10, 0, None, ["10", "10", "2,1^8", "2,1^8"]), 1),
    (HurwitzProblem.build(8, 0, genus=1, profiles=["4,4", "4,4"]), 1),
    (HurwitzProblem.build(6, 2, None, ["2,1^4"] * 2), 1),
])
def test_identity_at_large_degree(problem, codim):
    tallies = tally_catalogue(problem, codim)
    assert tallies.hurwitz_number == connected_hurwitz(problem.degree, problem.target_genus, problem.profiles)
    assert tallies.hurwitz_number > 0
    assert not tallies.failures
    assert tallies.strata
    for t in tallies.strata:
        assert t.total_weight == tallies.hurwitz_number
        assert sum((w for _, w in t.by_source()), Fraction(0)) == t.total_weight
        for e in t.entries:
            assert e.source.genus == problem.genus


def test_wrong_base_is_a_graph_error():
    with pytest.raises(GraphError):
        tally_stratum(HurwitzProblem.build(3, 0, genus=1), BaseStratum(parse_graph("g0{1,2}, g0{3,4} | 0-1"), 1))


def test_pullback_orders_need_codimension_one():
    t = tally_stratum(HurwitzProblem.build(2, 1, genus=2), BaseStratum(parse_graph("g1{1,2}"), 1))
    with pytest.raises(IdentityError):
        t.pullback_orders()


def _brute_multisets(shapes, d, legs, g, loops):
    """Sorted index tuples of up to d shapes: degrees adding up to d, genera to at most g,
    the profiles at every leg adding up to mu_j, equal profiles at both ends of every loop."""
    out = set()
    for n in range(1, d + 1):
        for combo in product(range(len(shapes)), repeat=n):
            if list(combo) != sorted(combo) or sum(shapes[i].degree for i in combo) != d:
                continue
            if sum(shapes[i].genus for i in combo) > g:
                continue
            if all(Counter(x for i in combo for x in shapes[i].legs[j]) == Counter(mu) for j, mu in enumerate(legs)) \
                    and all(Counter(x for i in combo for x in shapes[i].halves[p]) ==
                            Counter(x for i in combo for x in shapes[i].halves[q]) for p, q in loops):
                out.add(combo)
    return out


@pytest.mark.parametrize("d, h, legs, n_halves, g, loops", [
    (2, 0, ((2,), (2,)), 1, 1, ()),  # no fixed points at the legs: the first shape uses a slot
    (4, 0, ((2, 2), (2, 2)), 1, 2, ()),
    (3, 0, ((2, 1), (2, 1)), 2, 2, ((0, 1),)),  # a loop: 4 of the 6 multisets balanced
    (4, 0, ((2, 1, 1), (2, 1, 1)), 2, 2, ((0, 1),)),
    (4, 0, ((2, 2), (2, 2)), 2, 2, ((0, 1),)),
    (3, 1, ((2, 1),), 3, 3, ((1, 2),)),
])
def test_local_multisets_with_loops_match_brute_force(d, h, legs, n_halves, g, loops):
    shapes = piece_shapes(d, h, legs, n_halves, g)
    multisets = local_multisets(d, h, legs, n_halves, g, loops)
    assert multisets and multisets == sorted(set(multisets))
    assert set(multisets) == _brute_multisets(shapes, d, legs, g, loops)


def test_types_are_not_listed_for_marked_problems():
    problem = HurwitzProblem.build(2, 0, genus=2, marks=["1"])
    base = BaseStratum(parse_graph("g0{1,2,3,4,5,6}"), 1)
    with pytest.raises(ProblemError, match="^types are listed for unmarked problems only; the tallies take the marks$"):
        list(iter_types(problem, base))


def test_pullback_orders_need_a_codimension_one_base():
    problem = HurwitzProblem.build(2, 0, genus=2)
    smooth = tally_stratum(problem, BaseStratum(parse_graph("g0{1,2,3,4,5,6}"), 1))
    with pytest.raises(IdentityError, match="^orders along a branch need a codimension-one base stratum$"):
        smooth.pullback_orders()


def test_listed_types_carry_their_pieces_and_point_pairs():
    # over g0{1,2} | 0-0 every piece sits at the one vertex, and each type pairs the points over
    # the two ends of the node one by one: as many pairs as points over one end
    problem = HurwitzProblem.build(3, 1, genus=2)
    base = BaseStratum(parse_graph("g0{1,2} | 0-0"), 1)
    types = list(iter_types(problem, base))
    assert types
    for t in types:
        assert t.vertex == (0,) * len(t.shapes)
        assert len(t.edges) == sum(len(p) for p in t.edge_profiles)
        assert {i for i, _, _, _ in t.edges} | {j for _, j, _, _ in t.edges} <= set(range(len(t.shapes)))
