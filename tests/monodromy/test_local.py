"""Local covers over one base component against a count of permutation tuples.

A local cover of degree ``d`` over a vertex of genus ``h`` with special points
``1..n`` is a tuple ``(a_1, b_1, ..., a_h, b_h, s_1, ..., s_n)`` in ``S_d`` with
``[a_1, b_1]...[a_h, b_h] s_1...s_n = 1`` up to simultaneous conjugation, ``s_i``
of the prescribed cycle type at a leg and of any type at a half-edge.  Counting
each class with weight ``1/|Aut|`` gives the number of tuples over ``d!``
(orbit-stabiliser, common knowledge), and a disjoint union of connected pieces
has ``|Aut| = prod_P m_P! |C(P)|^{m_P}`` (the pieces of one kind permuted, each
acted on by its own centraliser; common knowledge).  The tuples are counted
here with plain tuples, nothing of covertree.
"""

from __future__ import annotations

from collections import Counter
from fractions import Fraction
from itertools import permutations, product
from math import factorial, prod

import pytest

from covertree.monodromy.local import local_covers


def _compose(p, q):
    return tuple(q[p[i]] for i in range(len(p)))


def _inverse(p):
    out = [0] * len(p)
    for i, x in enumerate(p):
        out[x] = i
    return tuple(out)


def _cycle_type(p):
    seen, lengths = set(), []
    for i in range(len(p)):
        n = 0
        while i not in seen:
            seen.add(i)
            i, n = p[i], n + 1
        if n:
            lengths.append(n)
    return tuple(sorted(lengths, reverse=True))


def _tuples(d, genus, profiles):
    """Tuples (a_1, b_1, ..., s_1, ..., s_n) with relation 1, types as prescribed."""
    group = list(permutations(range(d)))
    count = 0
    for head in product(group, repeat=2 * genus + len(profiles) - 1):
        word = tuple(range(d))
        for i in range(genus):
            a, b = head[2 * i], head[2 * i + 1]
            word = _compose(word, _compose(_compose(a, b), _compose(_inverse(a), _inverse(b))))
        legs = head[2 * genus:]
        if any(p is not None and _cycle_type(s) != tuple(p) for s, p in zip(legs, profiles)):
            continue
        for s in legs:
            word = _compose(word, s)
        last = _inverse(word)
        if profiles[-1] is None or _cycle_type(last) == tuple(profiles[-1]):
            count += 1
    return count


def _weight(cover):
    kinds = Counter(cover.pieces)
    return Fraction(1, prod(factorial(m) * p.centraliser_order ** m for p, m in kinds.items()))


CASES = [
    (2, 0, [(2,), (2,), None]),
    (2, 0, [(1, 1), (1, 1), None]),
    (3, 0, [(2, 1), (2, 1), None]),
    (3, 0, [(3,), None, None]),
    (3, 0, [None, None]),
    (4, 0, [(2, 2), (2, 1, 1), None]),
    (4, 0, [(2, 1, 1), None, None]),
    (4, 0, [(1, 1, 1, 1), (3, 1), None]),
    (2, 1, [None]),
    (3, 1, [None]),
    (2, 1, [(2,), None]),
    (3, 1, [(2, 1), None]),
]


@pytest.mark.parametrize("d, genus, profiles", CASES, ids=str)
def test_local_covers_weigh_the_permutation_tuples(d, genus, profiles):
    covers = local_covers(d, genus, profiles)
    assert sum(_weight(c) for c in covers) == Fraction(_tuples(d, genus, profiles), factorial(d))
    assert len(set(covers)) == len(covers)
    for c in covers:
        assert sum(p.degree for p in c.pieces) == d
        for s, prescribed in enumerate(profiles):
            if prescribed is not None:
                assert c.profiles[s] == tuple(prescribed)


def test_local_covers_by_hand():
    # Degree 2 over a rational vertex with two simple branch points and a
    # half-edge: s_1 = s_2 = (12) forces s_3 = 1, one connected piece.  With
    # trivial branch points the only local cover is two sheets (a connected
    # degree-2 piece needs a transposition somewhere).
    [c] = local_covers(2, 0, [(2,), (2,), None])
    assert [p.degree for p in c.pieces] == [2] and c.profiles == ((2,), (2,), (1, 1))
    [c] = local_covers(2, 0, [(1, 1), (1, 1), None])
    assert [p.degree for p in c.pieces] == [1, 1] and c.profiles == ((1, 1), (1, 1), (1, 1))
    # Degree 2 over an elliptic vertex with one half-edge: [a, b] = 1 in S_2, so
    # s = 1; three connected pieces ((a, b) generating S_2) and two sheets.
    covers = local_covers(2, 1, [None])
    assert sorted(tuple(p.degree for p in c.pieces) for c in covers) == [(1, 1), (2,), (2,), (2,)]


def test_a_profile_that_no_sheet_can_carry_gives_no_local_cover():
    # a 3-cycle needs three sheets: over a degree-2 vertex there is no piece
    # at all, hence no local cover (with or without a genus bound)
    assert local_covers(2, 0, [(3,)]) == []
    assert local_covers(2, 1, [(3,), None], max_genus=5) == []
