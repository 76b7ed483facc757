"""The raw data of glued covers (node indices, marked covers) on hand-worked cases."""

from __future__ import annotations

from collections import Counter
from fractions import Fraction

from covertree.gluing.covers import glued_covers
from covertree.graphs.notation import parse_graph


def test_node_data_of_genus_two_double_covers():
    # Degree 2 over the divisors of Mbar_{0,6} (worked by hand): over the 3|3
    # split the node has monodromy a transposition, so one source node of index
    # 2 joins two elliptic curves, |Aut| = 4 (the two involutions), multiplicity
    # 2; over the 2|4 split the node has trivial monodromy, two nodes of index 1
    # join a rational curve to an elliptic one, |Aut| = 2, multiplicity 1.
    [c] = glued_covers(parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1"), 2, [(2,)] * 6)
    assert (c.edge_profiles, c.source_edge_over, c.source_edge_index) == (((2,),), (0,), (2,))
    assert (c.automorphisms, c.multiplicity, sorted(c.source_genera)) == (4, 2, [1, 1])
    [c] = glued_covers(parse_graph("g0{1,2}, g0{3,4,5,6} | 0-1"), 2, [(2,)] * 6)
    assert (c.edge_profiles, c.source_edge_over, c.source_edge_index) == (((1, 1),), (0, 0), (1, 1))
    assert (c.automorphisms, c.multiplicity, sorted(c.source_genera)) == (2, 1, [0, 1])
    assert len(c.source_edges) == 2


def test_node_indices_over_two_base_nodes():
    # the chain g0{1,2} - g0 - g0{3,4,5,6} in degree 2 (worked by hand): at the
    # two-point end the relation s_1 s_2 n = 1 with two transpositions makes the
    # node's monodromy n trivial, and the middle component (no branch point)
    # makes the second node's monodromy equal to it: two sheets of index 1 over
    # each node.
    covers = list(glued_covers(parse_graph("g0{1,2}, g0, g0{3,4,5,6} | 0-1, 1-2"), 2, [(2,)] * 6))
    assert covers
    for c in covers:
        assert c.edge_profiles == ((1, 1), (1, 1))
        assert Counter(zip(c.source_edge_over, c.source_edge_index)) == {(0, 1): 2, (1, 1): 2}


def test_marking_an_unramified_point_of_covers_without_automorphisms():
    # Degree-3 covers of P^1 with four simple branch points (genus 0 by
    # Riemann-Hurwitz) and a fifth point with three unramified preimages, one of
    # which is marked.  A cover with trivial automorphisms gives three
    # non-isomorphic marked covers (3!/2! labellings, common knowledge), so the
    # marked weight is three times the unmarked one, each marked cover once.
    base = parse_graph("g0{1,2,3,4,5}")
    profiles = [(1, 1, 1)] + [(2, 1)] * 4
    plain = list(glued_covers(base, 3, profiles))
    marked = list(glued_covers(base, 3, profiles, [(1, 1)]))
    assert plain and all(c.automorphisms == 1 for c in plain)
    assert len(marked) == 3 * len(plain)
    assert len({c.code for c in marked}) == len(marked)
    assert not {c.code for c in marked} & {c.code for c in plain}
    assert all(len(c.source_legs) == 1 and c.source_legs[0] < len(c.source_genera) for c in marked)
    weight = sum(Fraction(c.multiplicity, c.automorphisms) for c in marked)
    assert weight == 3 * sum(Fraction(c.multiplicity, c.automorphisms) for c in plain)


def test_marking_a_point_the_involution_fixes():
    # Genus-2 double covers over the 3|3 split with the ramification point over
    # branch point 1 marked: both involutions fix it (each fixes its ramification
    # points), so one marked cover with |Aut| = 4 and the leg on one elliptic curve
    [c] = glued_covers(parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1"), 2, [(2,)] * 6, [(1, 2)])
    assert (c.automorphisms, c.multiplicity, c.source_edge_index) == (4, 2, (2,))
    assert len(c.source_legs) == 1 and c.source_genera[c.source_legs[0]] == 1


def test_marking_an_unramified_point_the_involution_swaps():
    # Unramified double covers of an elliptic curve with one point of the base
    # marked upstairs: three covers (the index-2 sublattices of Z^2, common
    # knowledge), |Aut| = 2, the involution swaps the two preimages, so each
    # gives one marked cover with no automorphism
    base = parse_graph("g1{1}")
    plain = list(glued_covers(base, 2, [(1, 1)]))
    marked = list(glued_covers(base, 2, [(1, 1)], [(1, 1)]))
    assert [c.automorphisms for c in plain] == [2, 2, 2]
    assert [c.automorphisms for c in marked] == [1, 1, 1]
    assert len({c.code for c in marked}) == 3
