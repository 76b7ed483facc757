"""Local covers of degree ``d`` over one base component: multisets of pieces.

Convention
----------
The special points of base vertex ``v`` of a stable graph are ordered: first
its legs in increasing label, then its half-edges in the graph's edge order
(for edge ``k = (i, j)`` the half-edge at ``i`` before the one at ``j``, so a
loop contributes two consecutive half-edges).  A special point is written
``("leg", j)`` or ``("half", k, side)`` with ``side`` 0 or 1.

A local cover is a multiset of :class:`~covertree.monodromy.pieces.Piece`
objects whose degrees add up to ``d`` and whose types at each leg ``j`` add up
(as multisets) to the profile of branch point ``j``.

Examples
--------
>>> from covertree.graphs.curve_graph import StableCurveGraph
>>> g = StableCurveGraph([(0, [1]), (0, [2])], nodes=[(0, 1), (0, 1)])
>>> special_points(g)
[[('leg', 1), ('half', 0, 0), ('half', 1, 0)], [('leg', 2), ('half', 0, 1), ('half', 1, 1)]]
>>> covers = local_covers(2, 0, [(2,), None, None])
>>> [tuple(c.profiles) for c in covers]
[((2,), (2,), (1, 1)), ((2,), (1, 1), (2,))]
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property, lru_cache

from covertree.graphs.curve_graph import CurveGraph
from covertree.monodromy.pieces import Piece, connected_pieces

SpecialPoint = tuple


def special_points(graph: CurveGraph) -> list[list[SpecialPoint]]:
    """The ordered special points of every vertex (see the module convention)."""
    out: list[list[SpecialPoint]] = [[("leg", j) for j in legs] for legs in graph.vertex_legs]
    for k, (i, j) in enumerate(graph.nodes):
        out[i].append(("half", k, 0))
        out[j].append(("half", k, 1))
    return out


@dataclass(frozen=True)
class LocalCover:
    """A multiset of pieces over one base component (sorted, so canonical)."""

    pieces: tuple[Piece, ...]

    @cached_property
    def profiles(self) -> tuple[tuple[int, ...], ...]:
        """Cycle type (non-increasing) at each special point of the vertex."""
        n = self.pieces[0].n_special
        return tuple(
            tuple(sorted((x for p in self.pieces for x in p.profile(s)), reverse=True))
            for s in range(n)
        )

    @cached_property
    def genus(self) -> int:
        """Sum of the genera of the pieces."""
        return sum(p.genus for p in self.pieces)


def local_covers(degree: int, genus: int, profiles: Sequence[Sequence[int] | None],
                 max_genus: int | None = None) -> list[LocalCover]:
    """Every local cover of the given degree over a component of genus ``genus``.

    Parameters
    ----------
    profiles : sequence
        Per special point: the prescribed profile (a leg) or ``None`` (a
        half-edge, any type).
    max_genus : int, optional
        Keep only local covers whose pieces' genera add up to at most this (a
        connected source of genus ``g`` has ``sum g_c <= g``).

    Triple covers of an elliptic curve with two simple points: the 16
    connected ones have genus 2, the other 4 a double cover of genus 2 and an
    unramified sheet of genus 1:

    >>> len(local_covers(3, 1, [(2, 1), (2, 1)])), len(local_covers(3, 1, [(2, 1), (2, 1)], max_genus=2))
    (20, 16)
    """
    allowed = [None if p is None else dict(Counter(p)) for p in profiles]
    pieces = [pc for k in range(1, degree + 1) for pc in _pieces(k, genus, _allowance_key(k, allowed))
              if max_genus is None or pc.genus <= max_genus]
    if not pieces:
        return []
    need = [None if p is None else Counter(p) for p in profiles]
    out: list[LocalCover] = []
    bound = degree * max(pc.genus for pc in pieces) if max_genus is None else max_genus
    _multisets(pieces, 0, (degree, bound), need, [], out)
    return out


def _allowance_key(k: int, allowed: list) -> tuple:
    """The allowances as they bear on pieces of degree ``k`` (counts capped at
    what ``k`` sheets can hold), hashable: equal keys, equal pieces.

    >>> _allowance_key(2, [{2: 1, 1: 5}, None])
    (((1, 2), (2, 1)), None)
    """
    return tuple(None if a is None else tuple(sorted((n, min(m, k // n)) for n, m in a.items() if n <= k))
                 for a in allowed)


@lru_cache(maxsize=4096)
def _pieces(k: int, genus: int, key: tuple) -> tuple[Piece, ...]:
    """:func:`connected_pieces` for an allowance key, shared by the local
    covers of every degree and prescription."""
    return tuple(connected_pieces(k, genus, [None if a is None else dict(a) for a in key]))


def forget_pieces() -> None:
    """Empty the cache of connected pieces by allowance (:func:`_pieces`)."""
    _pieces.cache_clear()


def _multisets(pieces: list[Piece], start: int, left: tuple[int, int], need: list, acc: list, out: list) -> None:
    """Non-decreasing choices of pieces with total degree ``left[0]`` and
    total genus at most ``left[1]`` whose leg types exhaust ``need``
    (``pieces`` sorted by non-decreasing degree)."""
    if left[0] == 0:
        out.append(LocalCover(tuple(acc)))
        return
    for idx in range(start, len(pieces)):
        piece = pieces[idx]
        if piece.degree > left[0]:
            break  # pieces come in non-decreasing degree
        if piece.genus > left[1] or not _take(piece, need):
            continue
        acc.append(piece)
        _multisets(pieces, idx, (left[0] - piece.degree, left[1] - piece.genus), need, acc, out)
        acc.pop()
        _give_back(piece, need)


def _take(piece: Piece, need: list) -> bool:
    """Subtract the piece's leg types from ``need`` if they fit."""
    for p, counter in enumerate(need):
        if counter is None:
            continue
        for length, m in Counter(piece.profile(p)).items():
            if counter[length] < m:
                for q in range(p):
                    if need[q] is not None:
                        need[q].update(piece.profile(q))
                return False
        counter.subtract(piece.profile(p))
    return True


def _give_back(piece: Piece, need: list) -> None:
    for p, counter in enumerate(need):
        if counter is not None:
            counter.update(piece.profile(p))
