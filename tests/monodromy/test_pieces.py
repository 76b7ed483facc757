"""Tests of the enumeration of connected pieces (covertree.monodromy.pieces).

The library is compared with the first, simple implementation kept in
``reference_pieces`` and with brute force over all of ``S_k`` (classes found by
the least relabelling, centralisers by trying every permutation), then with
published counts.
"""

from __future__ import annotations

from collections import Counter
from fractions import Fraction
from itertools import permutations
from math import factorial

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from covertree.monodromy.pieces import Piece, connected_pieces
from covertree.symmetric.permutations import commutator, compose, cycle_type, identity, inverse
from tests.monodromy import reference_pieces


def _simple(k: int) -> dict[int, int]:
    return {2: 1, 1: k - 2}


def _relabel(gens: tuple, sigma: tuple) -> tuple:
    """Every ``p`` in ``gens`` as ``sigma^-1 p sigma`` (sheet ``i`` renamed ``sigma[i]``)."""
    out = []
    for p in gens:
        q = [0] * len(p)
        for i, j in enumerate(p):
            q[sigma[i]] = sigma[j]
        out.append(tuple(q))
    return tuple(out)


def _class_key(gens: tuple, k: int) -> tuple:
    """A form of the conjugacy class of ``gens`` independent of any enumeration:
    the least of its ``k!`` relabellings."""
    return min(_relabel(gens, sigma) for sigma in permutations(range(k)))


def _classes(pieces: list) -> Counter:
    return Counter((_class_key(p.gens, p.degree), p.centraliser_order) for p in pieces)


def _brute_centraliser_order(gens: tuple, k: int) -> int:
    return sum(all(compose(s, p) == compose(p, s) for p in gens) for s in permutations(range(k)))


def _is_transitive(gens: tuple, k: int) -> bool:
    seen, todo = {0}, [0]
    while todo:
        x = todo.pop()
        for p in gens:
            if p[x] not in seen:
                seen.add(p[x])
                todo.append(p[x])
    return len(seen) == k


def _fits(perm: tuple, allowance: dict[int, int] | None) -> bool:
    if allowance is None:
        return True
    return all(allowance.get(m, 0) >= c for m, c in Counter(cycle_type(perm)).items())


def _check_valid(piece: Piece, k: int, h: int, allowed: list) -> None:
    gens = piece.gens
    assert piece.degree == k and piece.handles == h and piece.n_special == len(allowed)
    product = identity(k)
    for i in range(h):
        product = compose(product, commutator(gens[2 * i], gens[2 * i + 1]))
    for p in range(len(allowed)):
        product = compose(product, piece.special(p))
        assert _fits(piece.special(p), allowed[p])
    assert product == identity(k)
    assert _is_transitive(gens, k)
    assert len(set(piece.centraliser)) == piece.centraliser_order
    for c in piece.centraliser:
        assert all(compose(c, p) == compose(p, c) for p in gens)


def _compare_with_reference(k: int, h: int, allowed: list) -> None:
    new = connected_pieces(k, h, allowed)
    old = reference_pieces.connected_pieces(k, h, allowed)
    for piece in new:
        _check_valid(piece, k, h, allowed)
    classes = _classes(new)
    assert max(classes.values(), default=1) == 1, "a class listed twice"
    assert classes == _classes(old)


SHAPES = (
    [(k, 0, a) for k in range(1, 6) for a in (
        [], [None], [None, None], [None] * 3, [{1: k}, None, None],
        [{3: 1, 1: k}] * 3, [{2: 2, 1: k}, {3: 1, 1: k}, {k: 1}],
        [_simple(k), _simple(k), None], [{2: 1, 1: k}, {2: 3, 4: 1}, {1: 0, 5: 1}, None])]
    + [(k, 0, [_simple(k)] * 4) for k in range(2, 5)]
    + [(k, 1, a) for k in range(1, 6) for a in (
        [], [None], [{3: 1, 1: k}], [{2: 1, 1: k}, None], [{1: k}], [{2: 2, 1: k - 4}])]
    + [(k, 1, [_simple(k)] * 2) for k in range(2, 6)]
    + [(k, 2, a) for k in range(1, 4) for a in ([], [None], [{1: k}], [{2: 1, 1: k}], [{3: 1}])]
)


@pytest.mark.parametrize("k, h, allowed", SHAPES)
def test_same_classes_as_reference(k, h, allowed):
    _compare_with_reference(k, h, allowed)


@st.composite
def _shapes(draw):
    k = draw(st.integers(1, 4))
    h = draw(st.integers(0, 2 if k <= 3 else 1))
    allowance = st.none() | st.dictionaries(st.integers(1, k + 1), st.integers(0, k), max_size=3)
    return k, h, draw(st.lists(allowance, max_size=3 if h < 2 else 1))


@settings(max_examples=60, deadline=None)
@given(_shapes())
def test_same_classes_as_reference_drawn(shape):
    _compare_with_reference(*shape)


@pytest.mark.parametrize("k, h, allowed", [
    (4, 0, [None] * 3), (5, 0, [None] * 3), (4, 1, [None]), (5, 1, [_simple(5)] * 2),
    (4, 0, [{2: 2}, {2: 2}, None]), (3, 2, [{1: 3}]), (4, 1, [{1: 4}])])
def test_centraliser_orders_by_brute_force(k, h, allowed):
    pieces = connected_pieces(k, h, allowed)
    assert pieces
    for piece in pieces:
        assert piece.centraliser_order == _brute_centraliser_order(piece.gens, k)


def test_all_classes_by_brute_force():
    # every transitive pair in S_4 (h = 1, one free point solved) lies in exactly one class
    k = 4
    pieces = connected_pieces(k, 1, [None])
    keys = {_class_key(p.gens, k) for p in pieces}
    count = 0
    for a in permutations(range(k)):
        for b in permutations(range(k)):
            if _is_transitive((a, b), k):
                gens = (a, b, inverse(commutator(a, b)))
                assert _class_key(gens, k) in keys
                count += 1
    assert count == sum(Fraction(factorial(k), p.centraliser_order) for p in pieces)


def test_deterministic():
    first = connected_pieces(5, 1, [_simple(5)] * 2)
    assert [p.gens for p in first] == [p.gens for p in connected_pieces(5, 1, [_simple(5)] * 2)]
    assert [p.genus for p in first] == [2] * len(first)


def test_small_degrees():
    assert [p.gens for p in connected_pieces(1, 0, [])] == [()]
    assert [p.gens for p in connected_pieces(1, 1, [None])] == [((0,), (0,), (0,))]
    assert connected_pieces(2, 0, [{1: 2}]) == []
    assert connected_pieces(3, 0, [{2: 1, 1: 1}] * 3) == []


# Regression: two open chains of a prescribed generator may still merge into one
# long cycle, so the room for open chains is m // 2 per allowed m-cycle, not one
# per cycle.  Triples of 5-cycles with product 1 in S_5: (a, a, a^3), (a, a^2, a^2),
# (a, a^3, a) with centraliser Z/5 and one class with trivial centraliser (by
# hand: 24 * 24 pairs of 5-cycles, the 4 pairs (a, a^k) per cyclic group give the
# classes with centraliser Z/5, and H = 3/5 + 1 = 8/5 is the Frobenius count).
@pytest.mark.parametrize("k, handles, allowed", [
    (5, 0, [{5: 1}] * 3),
    (5, 0, [{5: 1}, {5: 1}, None]),
    (4, 0, [{4: 1}] * 3 + [{2: 1, 1: 2}]),
    (4, 0, [{3: 1, 1: 1}, {3: 1, 1: 1}, {4: 1}, {2: 1, 1: 2}]),
    (6, 0, [{6: 1}, {3: 2}, None]),
    (6, 0, [{4: 1, 2: 1}, {2: 3}, {6: 1}]),
])
def test_long_cycles_match_reference(k, handles, allowed):
    new = connected_pieces(k, handles, allowed)
    old = reference_pieces.connected_pieces(k, handles, allowed)
    assert sorted(p.centraliser_order for p in new) == sorted(p.centraliser_order for p in old)
    assert len(new) == len(old)


def test_triples_of_five_cycles_weight():
    # Frobenius' formula for three points of type (5) in degree 5 (common
    # knowledge, worked by hand): the characters of S_5 at a 5-cycle are 1, 1
    # (dims 1, 1), -1, -1 (dims 4, 4), 0, 0 (dims 5, 5) and 1 (dim 6), so the
    # triples number 24^3/120 * (1 + 1 - 1/4 - 1/4 + 1/6) = 192 and H = 192/5! = 8/5.
    pieces = connected_pieces(5, 0, [{5: 1}] * 3)
    assert sum(Fraction(1, p.centraliser_order) for p in pieces) == Fraction(8, 5)
