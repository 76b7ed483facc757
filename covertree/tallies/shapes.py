"""Shapes of pieces over one base component, and local multisets of shapes.

A *shape* over a base vertex ``v`` of genus ``h`` is the combinatorial data of
one connected local cover, forgetting its monodromy: the degree ``k``, the
sub-profile ``nu_j`` (a sub-multiset of ``mu_j`` of size ``k``) at each leg
``j`` of ``v``, and a profile ``alpha_p`` (a partition of ``k``) at each
half-edge point ``p`` of ``v``, the special points in the order of
:func:`covertree.monodromy.local.special_points` (legs by label, then
half-edges in edge order).  Its genus follows from Riemann-Hurwitz,
``2g - 2 = k(2h - 2) + sum_p (k - len(profile at p))``, and its weight is the
connected Hurwitz number ``connected_hurwitz(k, h, [nu..., alpha...])`` (unlabelled
preimages, THEORY.md section 5); shapes with weight 0 are dropped.

A *local multiset* over ``v`` is a multiset of shapes whose degrees add up to
``d`` and whose sub-profiles at each leg ``j`` add up to ``mu_j``.

Only shapes of genus at most ``max_genus`` are produced, and only multisets
whose genera add up to at most ``max_genus``: a connected source of genus
``g`` has ``g = sum_c g_c + b_1 >= sum_c g_c``.  This bound is what keeps the
number of shapes small for large degree (over a genus-0 component a piece
unramified at the legs is a cyclic cover, ``alpha = (k), (k)``).

Examples
--------
Over a rational component with one simple leg (degree 3) and one half-edge:
the unramified sheet and the double cover branched at the leg and the node;
the only local multiset is one of each.

>>> [(s.degree, s.legs, s.halves, s.genus, str(s.hurwitz))
...  for s in piece_shapes(3, 0, ((2, 1),), 1, 2)]
[(1, ((1,),), ((1,),), 0, '1'), (2, ((2,),), ((2,),), 0, '1/2')]
>>> local_multisets(3, 0, ((2, 1),), 1, 2)
[(0, 1)]
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from functools import lru_cache
from itertools import product

from covertree.hurwitz.numbers import connected_hurwitz
from covertree.symmetric.partitions import partitions_of, sub_partitions

__all__ = ["Shape", "piece_shapes", "local_multisets"]

Profile = tuple[int, ...]


@dataclass(frozen=True, order=True)
class Shape:
    """One piece shape (see the module docstring).

    Attributes
    ----------
    degree : int
    legs : tuple of profiles
        Sub-profile at each leg of the vertex, in leg order.
    halves : tuple of profiles
        Profile at each half-edge point of the vertex, in the vertex's order.
    genus : int
        By Riemann-Hurwitz.
    hurwitz : Fraction
        Connected Hurwitz number of the piece (unlabelled preimages).
    """

    degree: int
    legs: tuple[Profile, ...]
    halves: tuple[Profile, ...]
    genus: int = field(compare=False)
    hurwitz: Fraction = field(compare=False)


@lru_cache(maxsize=None)
def _partitions_by_length(k: int) -> dict[int, tuple[Profile, ...]]:
    out: dict[int, list[Profile]] = {}
    for p in partitions_of(k):
        out.setdefault(len(p), []).append(tuple(p))
    return {n: tuple(ps) for n, ps in out.items()}


def _half_profiles(k: int, n: int, total: int) -> list[tuple[Profile, ...]]:
    """Tuples of ``n`` partitions of ``k`` with ``total`` parts in all."""
    if n == 0:
        return [()] if total == 0 else []
    by_len = _partitions_by_length(k)
    out = []
    for first_len in range(max(1, total - (n - 1) * k), min(k, total - (n - 1)) + 1):
        for rest in _half_profiles(k, n - 1, total - first_len):
            out.extend((p,) + rest for p in by_len.get(first_len, ()))
    return out


@lru_cache(maxsize=None)
def piece_shapes(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...],
                 n_halves: int, max_genus: int) -> tuple[Shape, ...]:
    """Every shape of degree ``<= degree`` and genus ``<= max_genus`` with
    nonzero weight over a vertex of genus ``vertex_genus`` with legs of
    profiles ``leg_profiles`` and ``n_halves`` half-edge points, sorted."""
    out: list[Shape] = []
    for k in range(1, degree + 1):
        options = [[tuple(nu) for nu in sub_partitions(mu, k)] for mu in leg_profiles]
        for legs in product(*options):
            out.extend(_shapes_with_legs(k, vertex_genus, legs, n_halves, max_genus))
    return tuple(sorted(out))


def _shapes_with_legs(k: int, h: int, legs: tuple[Profile, ...], n_halves: int,
                      max_genus: int) -> list[Shape]:
    # 2g - 2 = k(2h - 2) + sum_legs (k - len) + sum_halves (k - len)
    base = k * (2 * h - 2) + sum(k - len(nu) for nu in legs) + n_halves * k + 2
    out = []
    for genus in range(max_genus + 1):
        total = base - 2 * genus
        if n_halves == 0 and total != 0:
            continue
        for halves in _half_profiles(k, n_halves, total):
            weight = connected_hurwitz(k, h, legs + halves)
            if weight:
                out.append(Shape(k, legs, halves, genus, weight))
    return out


def local_multisets(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...],
                    n_halves: int, max_genus: int) -> list[tuple[int, ...]]:
    """Local multisets over one vertex, as non-decreasing tuples of indices into
    ``piece_shapes(degree, vertex_genus, leg_profiles, n_halves, max_genus)``,
    in lexicographic order."""
    shapes = piece_shapes(degree, vertex_genus, leg_profiles, n_halves, max_genus)
    # the legs' cycle counts as one flat vector: (leg, length) -> slot
    slots = sorted({(j, length) for j, mu in enumerate(leg_profiles) for length in mu})
    where = {s: n for n, s in enumerate(slots)}
    need = [0] * len(slots)
    for j, mu in enumerate(leg_profiles):
        for length, m in Counter(mu).items():
            need[where[(j, length)]] = m
    uses = [tuple((where[(j, length)], m) for j, nu in enumerate(s.legs) for length, m in Counter(nu).items())
            for s in shapes]
    out: list[tuple[int, ...]] = []
    _grow(shapes, uses, 0, degree, max_genus, need, [], out)
    return out


def _grow(shapes: Sequence[Shape], uses: Sequence[tuple], start: int, left: int, genus_left: int,
          need: list[int], acc: list[int], out: list) -> None:
    """Non-decreasing choices from ``start`` on (shapes are sorted by degree)."""
    if left == 0:
        out.append(tuple(acc))
        return
    for idx in range(start, len(shapes)):
        s = shapes[idx]
        if s.degree > left:
            break
        if s.genus > genus_left or any(need[slot] < m for slot, m in uses[idx]):
            continue
        for slot, m in uses[idx]:
            need[slot] -= m
        acc.append(idx)
        _grow(shapes, uses, idx, left - s.degree, genus_left - s.genus, need, acc, out)
        acc.pop()
        for slot, m in uses[idx]:
            need[slot] += m
