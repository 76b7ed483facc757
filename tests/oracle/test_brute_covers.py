"""Tests of the brute-force cover oracle.

The oracle is checked against (a) hand lists of covers, (b) the degeneration
identity of docs/theory.md, section 7 (sum of mult/|Aut| over a fixed base curve of any
stratum equals the connected Hurwitz number), with the Hurwitz number computed here
by an independent count of transitive permutation tuples, and (c) its own literal
variant (``method="full"``: orbits of all labelled data under prod_v S_d).
"""

from __future__ import annotations

import itertools
import time
from fractions import Fraction
from math import factorial

import pytest

from covertree.symmetric.permutations import (
    commutator,
    compose,
    cycle_type,
    identity,
    inverse,
    is_transitive,
)
from tests.oracle.brute_covers import brute_force_covers, source_genus, total_weight

# ----------------------------------------------------------------- the independent count


def hurwitz_by_tuples(d: int, h: int, profiles) -> Fraction:
    """Connected Hurwitz number: transitive tuples (a_1, b_1, ..., a_h, b_h, s_1..s_b)
    in S_d with [a_1, b_1]...[a_h, b_h] s_1 ... s_b = 1 and s_j of type profiles[j],
    divided by d!.  The last s_j is solved for, the rest run over S_d / their class."""
    perms = list(itertools.permutations(range(d)))
    by_type: dict = {}
    for p in perms:
        by_type.setdefault(cycle_type(p), []).append(p)
    types = [tuple(sorted(mu, reverse=True)) for mu in profiles]
    ident = identity(d)
    count = 0
    for ab in itertools.product(perms, repeat=2 * h):
        c = ident
        for i in range(h):
            c = compose(c, commutator(ab[2 * i], ab[2 * i + 1]))
        for ss in itertools.product(*(by_type.get(t, []) for t in types[:-1])):
            last = inverse(compose(c, *ss))
            if types and cycle_type(last) != types[-1]:
                continue
            gens = list(ab) + list(ss) + [last]
            assert compose(c, *ss, last) == ident
            if is_transitive(d, gens):
                count += 1
    return Fraction(count, factorial(d))


def base_genus(genera, edges) -> int:
    return sum(genera) + len(edges) - len(genera) + 1


def check_identity(d, genera, edges, legs, profiles, expected=None):
    covers = brute_force_covers(d, genera, edges, legs, profiles)
    h = base_genus(genera, edges)
    g = source_genus(d, h, profiles)
    for c in covers:
        # arithmetic genus of every source is the Riemann–Hurwitz genus
        assert sum(c.source_genera) + len(c.source_edges) - len(c.source_genera) + 1 == g
        assert c.multiplicity == _mult_from_profiles(c.edge_profiles)
    if expected is None:
        expected = hurwitz_by_tuples(d, h, profiles)
    assert total_weight(covers) == expected, (genera, edges, legs)
    return covers


def _mult_from_profiles(edge_profiles) -> int:
    out = 1
    for mu in edge_profiles:
        for m in mu:
            out *= m
    return out


def keys(covers):
    return sorted(c.key() for c in covers)


# ----------------------------------------------------------------- strata used below

# The 5 strata of Mbar_{1,2} (by hand), raw: (genera, edges, legs).
MBAR_1_2 = {
    "open": ([1], [], [[1, 2]]),
    "irreducible": ([0], [(0, 0)], [[1, 2]]),
    "separating": ([1, 0], [(0, 1)], [[], [1, 2]]),
    "loop-and-tail": ([0, 0], [(0, 0), (0, 1)], [[], [1, 2]]),
    "banana": ([0, 0], [(0, 1), (0, 1)], [[1], [2]]),
}


def strata_m0n(n: int):
    """All strata of Mbar_{0,n} with at most 3 vertices, n <= 5 (then that is all
    of them): the open one, the divisors S | S^c (1 in S), and for n = 5 the chains
    {a,b} - {c} - {d,e}."""
    labels = list(range(1, n + 1))
    out = [([0], [], [labels])]
    for k in range(1, n - 2):
        for rest in itertools.combinations(labels[1:], k):
            s = [1, *rest]
            t = [j for j in labels if j not in s]
            if len(t) >= 2:
                out.append(([0, 0], [(0, 1)], [s, t]))
    if n == 5:
        for c in labels:
            others = [j for j in labels if j != c]
            a = others[0]
            for b in others[1:]:
                pair2 = [j for j in others if j not in (a, b)]
                out.append(([0, 0, 0], [(0, 1), (1, 2)], [[a, b], [c], pair2]))
    return out


def test_strata_counts():
    # Strata of Mbar_{0,n}: A000311(n-1), OEIS (Schroeder's fourth problem): 4, 26.
    assert len(strata_m0n(4)) == 4
    assert len(strata_m0n(5)) == 26


# ----------------------------------------------------------------- hand lists

# Degree-2 covers of a genus-1 base with two labelled branch points of profile (2):
# the source has genus 2 (2g-2 = 2*0 + 1 + 1).  The connected Hurwitz number is 2
# (OEIS A170991, first term; Dijkgraaf 1995: 2*[q^2]F_2): over S_2, [a,b] = 1, so
# the 4 pairs (a, b) with s_1 = s_2 = (01) are all the tuples, 4/2! = 2.
#
# Key format (BruteCover.key): (edge profiles, |Aut|, mult, (components as
# (base vertex, degree, genus), source edges as (base edge, end over u, end over w))).
HAND_MBAR_1_2 = {
    # open: 4 covers, one per (a, b) in S_2^2, a genus-2 curve, Aut = the involution.
    "open": [((), 2, 1, (((0, 2, 2),), ()))] * 4,
    # irreducible (P^1 with a loop, legs 1, 2): s_1 = s_2 = (01) forces s_x = s_y.
    #  s_x = 1: a rational double cover, the two points over x glued to the two
    #    over y in 2 ways (beta = id or swap, not related by the involution, which
    #    fixes both): 2 covers, each a genus-0 curve with two self-nodes, Aut 2, mult 1;
    #  s_x = (01): a genus-1 double cover glued at its ramification points over x, y:
    #    one self-node, Aut 2, mult 2.
    # Weight 1/2 + 1/2 + 2/2 = 2.
    "irreducible": [
        (((1, 1),), 2, 1, (((0, 2, 0),), ((0, 0, 0), (0, 0, 0)))),
        (((1, 1),), 2, 1, (((0, 2, 0),), ((0, 0, 0), (0, 0, 0)))),
        (((2,),), 2, 2, (((0, 2, 1),), ((0, 0, 0),))),
    ],
    # separating (genus 1, no legs) -- (genus 0, legs 1, 2): over the rational side
    # s_y = 1 (a rational double cover R); over the elliptic side (a, b) arbitrary.
    #  (a, b) = (1, 1): two copies E_1, E_2 of the base elliptic curve, each meeting R
    #    once (a rational bridge; stably E_1 u E_2 at a point); Aut 2 (swap E_1, E_2
    #    together with the involution of R); the 2 bijections are one orbit.
    #  (a, b) != (1, 1): 3 unramified double covers E' of genus 1, meeting R twice;
    #    Aut 2 each.  Weight 4 * 1/2 = 2.
    "separating": [
        (((1, 1),), 2, 1, (((0, 1, 1), (0, 1, 1), (1, 2, 0)), ((0, 0, 2), (0, 1, 2)))),
        (((1, 1),), 2, 1, (((0, 2, 1), (1, 2, 0)), ((0, 0, 1), (0, 0, 1)))),
        (((1, 1),), 2, 1, (((0, 2, 1), (1, 2, 0)), ((0, 0, 1), (0, 0, 1)))),
        (((1, 1),), 2, 1, (((0, 2, 1), (1, 2, 0)), ((0, 0, 1), (0, 0, 1)))),
    ],
    # (genus 0 with a loop) -- (genus 0, legs 1, 2): s at the tail edge is 1 on both
    # sides, and at the loop s_x = s_y in {1, (01)}.
    #  s_x = 1: two sheets A, B over the looped vertex (rational, degree 1), both
    #    meeting the rational double cover R of the tail; the loop glues A to A and
    #    B to B, or A to B and B to A: 2 covers, Aut 2, mult 1;
    #  s_x = (01): a rational double cover with one self-node (e = 2) meeting R
    #    twice: Aut 2, mult 2.  Weight 1/2 + 1/2 + 1 = 2.
    "loop-and-tail": [
        (((1, 1), (1, 1)), 2, 1, (((0, 1, 0), (0, 1, 0), (1, 2, 0)), ((0, 0, 0), (0, 1, 1), (1, 0, 2), (1, 1, 2)))),
        (((1, 1), (1, 1)), 2, 1, (((0, 1, 0), (0, 1, 0), (1, 2, 0)), ((0, 0, 1), (0, 1, 0), (1, 0, 2), (1, 1, 2)))),
        (((2,), (1, 1)), 2, 2, (((0, 2, 0), (1, 2, 0)), ((0, 0, 0), (1, 0, 1), (1, 0, 1)))),
    ],
    # banana (two genus-0 vertices, two edges, one leg each): at each vertex one of
    # the two half-edges carries (01), the other 1, and balancing makes it the same
    # edge on both sides: 2 covers, two rational double covers meeting in 3 points
    # (one ramified node, two unramified), Aut 2, mult 2.  Weight 1 + 1 = 2.
    "banana": [
        (((1, 1), (2,)), 2, 2, (((0, 2, 0), (1, 2, 0)), ((0, 0, 1), (0, 0, 1), (1, 0, 1)))),
        (((2,), (1, 1)), 2, 2, (((0, 2, 0), (1, 2, 0)), ((0, 0, 1), (1, 0, 1), (1, 0, 1)))),
    ],
}


@pytest.mark.parametrize("name", sorted(MBAR_1_2))
def test_hand_list_degree2_genus1_base(name):
    genera, edges, legs = MBAR_1_2[name]
    covers = check_identity(2, genera, edges, legs, [(2,), (2,)], expected=Fraction(2))
    assert keys(covers) == sorted(HAND_MBAR_1_2[name])
    assert keys(brute_force_covers(2, genera, edges, legs, [(2,), (2,)], method="full")) == keys(covers)


# Degree-2 genus-2 covers of the line, 6 points of profile (2): H = 1/2 (the one
# tuple s_j = (01), over 2!).
HAND_M06 = {
    # 2|4: legs 1,2 on a rational double cover R (s_x = (01)^2 = 1), legs 3..6 on a
    # genus-1 double cover E (2g-2 = 2(-2) + 4); R meets E at the two points over the
    # node: a rational bridge, stably the irreducible curve with one node.
    # Aut: the 4 elements of S_2 x S_2 move the bijection in an orbit of 2: Aut 2.
    "2|4": (
        ([0, 0], [(0, 1)], [[1, 2], [3, 4, 5, 6]]),
        [(((1, 1),), 2, 1, (((0, 2, 0), (1, 2, 1)), ((0, 0, 1), (0, 0, 1))))],
    ),
    # 3|3: s_x = s_y = (01); two genus-1 double covers E_1, E_2 (2g-2 = -4 + 3 + 1)
    # joined at their ramification points over the node.  Aut = Z/2 x Z/2 (the two
    # involutions independently, Harris-Mumford), mult 2: weight 2/4 = 1/2.
    "3|3": (
        ([0, 0], [(0, 1)], [[1, 2, 3], [4, 5, 6]]),
        [(((2,),), 4, 2, (((0, 2, 1), (1, 2, 1)), ((0, 0, 1),)))],
    ),
}


@pytest.mark.parametrize("name", sorted(HAND_M06))
def test_hand_list_degree2_genus2_line(name):
    (genera, edges, legs), hand = HAND_M06[name]
    covers = check_identity(2, genera, edges, legs, [(2,)] * 6, expected=Fraction(1, 2))
    assert keys(covers) == sorted(hand)


# ----------------------------------------------------------------- degeneration identity


@pytest.mark.parametrize(
    "d,profiles",
    [
        (2, [(2,)] * 4),  # genus 1, H = 1/2
        (3, [(2, 1)] * 4),  # genus 0, H = 4 (d^(d-3)(2d-2)!/d!, Hurwitz 1891)
        (3, [(3,), (2, 1), (2, 1), (2, 1), (2, 1)]),  # genus 1
        (3, [(3,), (3,), (2, 1), (2, 1), (1, 1, 1)]),  # genus 1, an unramified marked point
        (2, [(2,), (2,), (2,), (2,), (1, 1)]),
    ],
)
def test_identity_genus0_base(d, profiles):
    n = len(profiles)
    expected = hurwitz_by_tuples(d, 0, profiles)
    for genera, edges, legs in strata_m0n(n):
        check_identity(d, genera, edges, legs, profiles, expected=expected)


def test_identity_genus0_base_value():
    # d^(d-3) (2d-2)!/d! (Hurwitz 1891; common knowledge): d = 3 gives 4.
    assert hurwitz_by_tuples(3, 0, [(2, 1)] * 4) == 4


@pytest.mark.parametrize("d", [2, 3, 4])
def test_identity_mbar_1_2(d):
    # Genus-2 covers of an elliptic curve, 2 simple points: OEIS A170991: 2, 16, 60.
    published = {2: 2, 3: 16, 4: 60}[d]
    simple = tuple([2] + [1] * (d - 2))
    assert hurwitz_by_tuples(d, 1, [simple] * 2) == published
    for genera, edges, legs in MBAR_1_2.values():
        check_identity(d, genera, edges, legs, [simple] * 2, expected=Fraction(published))


MBAR_1_4_SOME = [
    ([1, 0], [(0, 1)], [[1, 2], [3, 4]]),
    ([0, 0], [(0, 1), (0, 1)], [[1, 2], [3, 4]]),
    ([0, 0, 0], [(0, 1), (1, 2), (2, 0)], [[1, 2], [3], [4]]),
    ([0, 0, 0], [(0, 0), (0, 1), (1, 2)], [[1], [2], [3, 4]]),
    ([1, 0, 0], [(0, 1), (1, 2)], [[], [1, 2], [3, 4]]),
]


@pytest.mark.parametrize("stratum", MBAR_1_4_SOME)
def test_identity_genus3_over_elliptic(stratum):
    # Genus-3 covers of an elliptic curve, 4 simple points: OEIS A170992: 2, 160.
    genera, edges, legs = stratum
    check_identity(2, genera, edges, legs, [(2,)] * 4, expected=Fraction(2))
    check_identity(3, genera, edges, legs, [(2, 1)] * 4, expected=Fraction(160))


@pytest.mark.parametrize(
    "stratum,profiles",
    [
        (([0, 0, 0], [(0, 1), (1, 2)], [[1, 2], [3, 4], [5, 6]]), [(2, 1, 1)] * 6),
        (([0, 0, 0], [(0, 1), (0, 2)], [[1, 6], [2, 3], [4, 5]]), [(2, 1, 1)] * 6),
        (([0, 0, 0], [(0, 1), (1, 2)], [[1, 2], [3, 6], [4, 5]]),
         [(4,), (2, 2), (3, 1), (2, 1, 1), (2, 1, 1), (2, 1, 1)]),
    ],
)
def test_identity_degree4_three_vertices(stratum, profiles):
    genera, edges, legs = stratum
    start = time.perf_counter()
    covers = check_identity(4, genera, edges, legs, profiles)
    assert time.perf_counter() - start < 5.0
    assert covers


def test_identity_degree4_genus1_base_three_vertices():
    # Genus-3 covers of an elliptic curve in degree 4: OEIS A170992: 2448.
    start = time.perf_counter()
    for genera, edges, legs in [
        ([1, 0, 0], [(0, 1), (1, 2)], [[1], [2], [3, 4]]),
        ([0, 0, 0], [(0, 1), (1, 2), (2, 0)], [[1], [2], [3, 4]]),
    ]:
        check_identity(4, genera, edges, legs, [(2, 1, 1)] * 4, expected=Fraction(2448))
    assert time.perf_counter() - start < 5.0


def test_degree_one():
    covers = brute_force_covers(1, [0, 1], [(0, 1), (0, 0)], [[1, 2], [3]], [(1,)] * 3)
    assert [(c.automorphisms, c.multiplicity, c.source_genera) for c in covers] == [(1, 1, (0, 1))]


# ----------------------------------------------------------------- reduced == full


@pytest.mark.parametrize(
    "d,stratum,profiles",
    [
        (3, MBAR_1_2["separating"], [(2, 1)] * 2),
        (3, MBAR_1_2["loop-and-tail"], [(2, 1)] * 2),
        (3, MBAR_1_2["banana"], [(2, 1)] * 2),
        (3, MBAR_1_2["irreducible"], [(2, 1)] * 2),
        (3, ([0, 0], [(0, 1)], [[1, 2], [3, 4]]), [(2, 1)] * 4),
        (3, ([0, 0, 0], [(0, 1), (1, 2)], [[1, 2], [3], [4, 5]]), [(3,), (2, 1), (2, 1), (2, 1), (2, 1)]),
        (2, ([0, 0, 0], [(0, 1), (1, 2), (2, 0)], [[1, 2], [3], [4]]), [(2,)] * 4),
    ],
)
def test_reduced_agrees_with_full(d, stratum, profiles):
    genera, edges, legs = stratum
    reduced = brute_force_covers(d, genera, edges, legs, profiles)
    full = brute_force_covers(d, genera, edges, legs, profiles, method="full")
    assert keys(reduced) == keys(full)
    assert [c.automorphisms for c in sorted(reduced, key=lambda c: c.key())] == [
        c.automorphisms for c in sorted(full, key=lambda c: c.key())
    ]


def test_bad_input():
    with pytest.raises(ValueError):
        brute_force_covers(2, [0], [], [[1, 3]], [(2,)] * 2)
    with pytest.raises(ValueError):
        brute_force_covers(2, [0, 0], [], [[1, 2], [3, 4]], [(2,)] * 4)
    with pytest.raises(ValueError):
        brute_force_covers(2, [0], [], [[1, 2, 3]], [(2,)] * 3)
