"""Permutations on tuples (covertree.symmetric.permutations) against the
definitions, checked over all of ``S_3`` and ``S_4``.

Each function is compared with its definition written out here: the product of
maps "first p, then q", the inverse as the map undoing ``p``, cycles by
following images, orbits as the closure of a point under the generators.
"""

from __future__ import annotations

from itertools import permutations, product

import pytest

from covertree.symmetric.permutations import (
    commutator,
    compose,
    cycle_type,
    cycles,
    identity,
    inverse,
    is_transitive,
    orbits,
)


def _then(p: tuple, q: tuple) -> tuple:
    """The map ``i -> q(p(i))``: first ``p``, then ``q``."""
    return tuple(q[p[i]] for i in range(len(p)))


def _closure(d: int, gens: list, start: int) -> set[int]:
    """The points reached from ``start`` by the generators and their inverses."""
    seen, todo = {start}, [start]
    while todo:
        x = todo.pop()
        for g in gens:
            for y in (g[x], g.index(x)):
                if y not in seen:
                    seen.add(y)
                    todo.append(y)
    return seen


@pytest.mark.parametrize("d", [0, 1, 3])
def test_identity_fixes_every_sheet(d):
    e = identity(d)
    assert len(e) == d and all(e[i] == i for i in range(d))


def test_compose_reads_left_to_right():
    group = list(permutations(range(4)))
    for p, q in product(group, repeat=2):
        assert compose(p, q) == _then(p, q)
    p, q, r = (1, 2, 3, 0), (1, 0, 2, 3), (0, 1, 3, 2)
    assert compose(p, q, r) == _then(_then(p, q), r)
    assert compose(p) == p


def test_inverse_undoes_the_permutation():
    for p in permutations(range(4)):
        inv = inverse(p)
        assert all(inv[p[i]] == i for i in range(4))
        assert all(p[inv[i]] == i for i in range(4))


def test_commutator_is_a_b_a_inverse_b_inverse():
    group = list(permutations(range(3)))
    for a, b in product(group, repeat=2):
        a_inv = tuple(a.index(i) for i in range(3))
        b_inv = tuple(b.index(i) for i in range(3))
        assert commutator(a, b) == _then(_then(_then(a, b), a_inv), b_inv)
    # S_3 is not abelian: (0 1) and (1 2) give a 3-cycle (hand-worked)
    assert commutator((1, 0, 2), (0, 2, 1)) == (1, 2, 0)


def test_cycles_follow_the_images():
    for p in permutations(range(4)):
        found = cycles(p)
        assert sorted(x for c in found for x in c) == [0, 1, 2, 3]
        assert [c[0] for c in found] == sorted(c[0] for c in found)
        for c in found:
            assert c[0] == min(c)
            assert all(p[c[i]] == c[(i + 1) % len(c)] for i in range(len(c)))
    assert cycles((2, 0, 1, 3)) == [(0, 2, 1), (3,)]


def test_cycle_type_counts_the_classes_of_s4():
    # class sizes of S_4 (common knowledge): 1 identity, 6 transpositions,
    # 3 double transpositions, 8 three-cycles, 6 four-cycles
    counts: dict[tuple, int] = {}
    for p in permutations(range(4)):
        counts[cycle_type(p)] = counts.get(cycle_type(p), 0) + 1
    assert counts == {(1, 1, 1, 1): 1, (2, 1, 1): 6, (2, 2): 3, (3, 1): 8, (4,): 6}
    assert cycle_type(()) == ()


def test_orbits_are_closures_under_the_generators():
    group = list(permutations(range(4)))
    for a, b in product(group, repeat=2):
        found = orbits(4, [a, b])
        assert [o[0] for o in found] == sorted(o[0] for o in found)
        for orbit in found:
            assert list(orbit) == sorted(_closure(4, [a, b], orbit[0]))
        assert sorted(x for o in found for x in o) == [0, 1, 2, 3]
        assert is_transitive(4, [a, b]) == (len(_closure(4, [a, b], 0)) == 4)
    assert orbits(3, []) == [(0,), (1,), (2,)]
    assert orbits(5, [(0, 3, 2, 1, 4)]) == [(0,), (1, 3), (2,), (4,)]
    assert not is_transitive(3, [])
