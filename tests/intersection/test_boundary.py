"""Boundary divisors of Mbar_{g,n}: keys and names against the codimension-one
stable graphs, and pullbacks along the gluing maps worked by hand."""

import pytest

from covertree.errors import InputError
from covertree.graphs import StableCurveGraph, stable_graphs
from covertree.intersection.boundary import (
    IRR,
    automorphisms,
    canonical_key,
    divisor_name,
    divisors,
    parse_divisor,
    pullback_terms,
    vertex_spaces,
)

TYPES = [(0, 4), (0, 5), (0, 6), (1, 1), (1, 2), (1, 3), (2, 0), (2, 1), (2, 2), (3, 0), (3, 1), (4, 0)]


def one_edge_graph(g, n, key):
    if key == IRR:
        return StableCurveGraph([(g - 1, range(1, n + 1))], nodes=[(0, 0)])
    i, side = key
    other = [j for j in range(1, n + 1) if j not in side]
    return StableCurveGraph([(i, side), (g - i, other)], nodes=[(0, 1)])


@pytest.mark.parametrize("g, n", TYPES)
def test_divisors_are_the_codimension_one_strata(g, n):
    # the independent oracle: the enumeration of stable graphs (covertree.graphs.enumerate)
    keys = divisors(g, n)
    graphs = [one_edge_graph(g, n, key) for key in keys]
    assert sorted(graphs) == [s for s in stable_graphs(g, n, max_codim=1) if s.codim == 1]
    assert list(keys) == sorted(set(keys))
    for key, graph in zip(keys, graphs):
        assert automorphisms(g, n, key) == graph.automorphisms
        assert parse_divisor(g, n, divisor_name(g, n, key)) == key


@pytest.mark.parametrize("g, n", TYPES)
def test_every_side_of_a_divisor_has_the_one_key(g, n):
    for key in divisors(g, n):
        if key == IRR:
            continue
        i, side = key
        other = tuple(j for j in range(1, n + 1) if j not in side)
        assert canonical_key(g, n, i, side) == canonical_key(g, n, g - i, frozenset(other)) == key
        # the named side: smaller genus, then fewer legs, then the one with leg 1
        assert (i, len(side), 1 not in side) <= (g - i, len(other), 1 not in other)


def test_names_by_hand():
    assert [divisor_name(4, 0, k) for k in divisors(4, 0)] == ["delta_0", "delta_1", "delta_2"]
    assert [divisor_name(1, 2, k) for k in divisors(1, 2)] == ["delta_0", "delta_0_{1,2}"]
    assert [divisor_name(2, 1, k) for k in divisors(2, 1)] == ["delta_0", "delta_1_{}"]
    assert divisor_name(2, 2, (1, (1,))) == "delta_1_{1}" and divisor_name(2, 2, (0, (1, 2))) == "delta_0_{1,2}"
    assert canonical_key(0, 5, 0, (1, 2, 5)) == (0, (3, 4))
    assert canonical_key(0, 6, 0, (4, 5, 6)) == (0, (1, 2, 3))  # equal sizes: the side with leg 1
    assert canonical_key(2, 2, 1, (2,)) == (1, (1,))  # equal genus and sizes: the side with leg 1
    assert automorphisms(4, 0, (2, ())) == 2 and automorphisms(4, 0, (1, ())) == 1
    assert automorphisms(2, 2, (1, (1,))) == 1


@pytest.mark.parametrize(
    "g, n, name, message",
    [
        (2, 0, "delta_2", r"^'delta_2': on Mbar_2 delta_i needs 1 <= i <= 1$"),
        (5, 0, "delta_3", r"^'delta_3': on Mbar_5 delta_i needs 1 <= i <= 2$"),
        (2, 0, "delta_1_{1}", r"unknown factor 'delta_1_\{1\}' on Mbar_\{2,0\}: expected delta_0, delta_i \(1 <= i <= g/2\)"),
        (0, 4, "delta_0", r"'delta_0': Mbar_\{0,4\} has no irreducible boundary divisor"),
        (2, 1, "delta_1", r"unknown factor 'delta_1' on Mbar_\{2,1\}: expected delta_0, delta_i_\{a,b,...\} \(genus-i side"),
        (1, 2, "delta_1_{1}", r"no boundary divisor of Mbar_\{1,2\} has a genus-1 side with legs \[1\]"),
        (1, 2, "delta_0_{1,1}", r"bad legs in 'delta_0_\{1,1\}': distinct labels in 1..2 expected"),
        (1, 2, "delta_0_{1,3}", r"bad legs in"),
        (1, 2, "delta_0_{0,1}", r"bad legs in"),
        (0, 5, "delta_0_{3,4,5}", r"'delta_0_\{3,4,5\}' is called delta_0_\{1,2\} \(one name per divisor\)"),
        (0, 5, "delta_0_{2,1}", r"is called delta_0_\{1,2\}"),
        (2, 1, "delta_1_{1}", r"is called delta_1_\{\}"),
        (2, 0, "gamma", r"unknown factor 'gamma': expected delta_0, delta_i \(1 <= i <= g/2\)"),
        (2, 1, "delta", r"unknown factor 'delta': expected delta_0, delta_i_\{a,b,...\}"),
        (3, 0, "delta_1_{}", r"on Mbar_\{3,0\}"),
        (3, 0, "delta_0_{}", r"on Mbar_\{3,0\}"),
    ],
)
def test_bad_names(g, n, name, message):
    with pytest.raises(InputError, match=message):
        parse_divisor(g, n, name)


def test_good_names_with_spaces_and_the_irreducible_divisor():
    assert parse_divisor(0, 5, "delta_0_{1, 2}") == (0, (1, 2))
    assert parse_divisor(3, 1, "delta_0") == IRR and parse_divisor(3, 0, "delta_1") == (1, ())
    assert parse_divisor(3, 1, "delta_1_{}") == (1, ()) and parse_divisor(3, 1, "delta_1_{1}") == (1, (1,))


def test_canonical_key_refuses_unstable_sides():
    with pytest.raises(InputError, match=r"no boundary divisor of Mbar_\{1,1\} has a genus-1 side with legs \[1\]"):
        canonical_key(1, 1, 1, (1,))
    with pytest.raises(InputError, match=r"genus-0 side with legs \[1\]"):
        canonical_key(0, 4, 0, (1,))


def test_vertex_spaces_by_hand():
    assert vertex_spaces(2, 1, IRR) == ((1, (1, 2, 3)),)
    assert vertex_spaces(2, 1, (1, ())) == ((1, (2,)), (1, (1, 3)))
    assert vertex_spaces(0, 5, (0, (2, 4))) == ((0, (2, 4, 6)), (0, (1, 3, 5, 7)))


def test_pullbacks_by_hand():
    # along the irreducible divisor of Mbar_2 (vertex space Mbar_{1,2}, half-edges 1, 2):
    # delta_1 meets it in the rational tail carrying both half-edges (glued: a genus-1 loop side);
    # delta_0 gives the normal bundle -psi_1 - psi_2 and the vertex's own delta_0 (Graber-Pandharipande)
    assert pullback_terms(2, 0, IRR, ("delta", (1, ()))) == ((1, 0, ("delta", (0, (1, 2)))),)
    assert pullback_terms(2, 0, IRR, ("delta", IRR)) == (
        (-1, 0, ("psi", 1)), (-1, 0, ("psi", 2)), (1, 0, ("delta", IRR)))
    # along delta_{0,{1,2}} of Mbar_{1,2}: Mbar_{0,3} x Mbar_{1,1}; lambda lives on the genus-1 side,
    # kappa on both, psi_2 on the rational side (its second leg)
    tail = (0, (1, 2))
    assert pullback_terms(1, 2, tail, ("lambda",)) == ((1, 1, ("lambda",)),)
    assert pullback_terms(1, 2, tail, ("kappa",)) == ((1, 0, ("kappa",)), (1, 1, ("kappa",)))
    assert pullback_terms(1, 2, tail, ("psi", 2)) == ((1, 0, ("psi", 2)),)
    assert pullback_terms(1, 2, tail, ("delta", IRR)) == ((1, 1, ("delta", IRR)),)
    # along delta_1 of Mbar_2: two Mbar_{1,1}; delta_1 restricts to -psi - psi, delta_0 to the sum
    assert pullback_terms(2, 0, (1, ()), ("delta", (1, ()))) == ((-1, 0, ("psi", 1)), (-1, 1, ("psi", 1)))
    assert pullback_terms(2, 0, (1, ()), ("delta", IRR)) == ((1, 0, ("delta", IRR)), (1, 1, ("delta", IRR)))


def test_pullback_of_a_separating_divisor_along_another():
    # Mbar_{0,5} along D_{12} (Mbar_{0,3} with legs 1, 2, h x Mbar_{0,4} with legs 3, 4, 5, h'):
    # D_{34} is the divisor {3, 4} | {5, h'} of the second vertex (its legs 1, 2 | 3, 4); D_{12} itself
    # only the normal bundle -psi_h - psi_h' (the first vertex has no divisor)
    assert pullback_terms(0, 5, (0, (1, 2)), ("delta", (0, (3, 4)))) == ((1, 1, ("delta", (0, (1, 2)))),)
    assert pullback_terms(0, 5, (0, (1, 2)), ("delta", (0, (1, 2)))) == (
        (-1, 0, ("psi", 3)), (-1, 1, ("psi", 4)))
    assert pullback_terms(0, 5, (0, (1, 2)), ("delta", (0, (1, 3)))) == ()


def test_pullback_along_the_irreducible_divisor_with_both_half_edges_on_one_side():
    # Mbar_{3,3} along delta_0 (vertex space Mbar_{2,5}, half-edges 4 and 5): the divisor
    # delta_1_{1,2,3} (a genus-1 side with the legs, a genus-2 side without) pulls back to the
    # separating divisors of Mbar_{2,5} with both half-edges on one side: on a genus-0 side with
    # the legs (glued, the genus-1 side) or on a genus-1 side without them (glued, the genus-2 side)
    assert pullback_terms(3, 3, IRR, ("delta", (1, (1, 2, 3)))) == (
        (1, 0, ("delta", (0, (1, 2, 3, 4, 5)))), (1, 0, ("delta", (1, (4, 5)))))
