"""Counting the labelled matchings of node preimages that glue a choice of
pieces into a connected source, by orbits.

Setting
-------
A *choice* is a list of pieces (shapes over base vertices, sorted so that
pieces of equal vertex and shape are consecutive: a *class*).  Every piece has,
at the half-edge point of side ``s`` of base edge ``k``, the points of its
profile there, which are *labelled*; a *port group* ``(k, s, l)`` of a piece is
its set of points of length ``l`` there.  A *labelled matching* pairs, for
every base edge ``k`` and length ``l``, the points of the groups ``(k, 0, l)``
bijectively with those of the groups ``(k, 1, l)`` (over all pieces).  Its
source graph has a vertex per piece and an edge ``(i, j, k, l)`` per pair, ``i``
the piece on side 0.

What is counted
---------------
:func:`count_matchings` returns, for every source graph (as a sorted tuple of
edges on the piece indices) the number of labelled matchings with a connected
source giving it.  The count is exact but the enumeration visits far fewer
matchings, by orbits of the following automorphisms of a partial matching
``P``: permutations of the unmatched points of one port group (labels), and
permutations of the *pristine* pieces of one class (pieces none of whose points
is matched yet).  A port ``x`` of a piece already reached is chosen as a
function of ``P``; the partners of ``x`` fall into orbits of the stabiliser of
``x``: the free points of one port group of a reached piece (orbit size = their
number), or the points of one port group over all pristine pieces of a class
(orbit size = pieces times points); only the first pristine piece of a class is
tried, with that multiplier.  Since an automorphism of ``P`` fixing ``x``
carries the completions of ``P + {x ~ y}`` bijectively onto those of
``P + {x ~ y'}`` with isomorphic source graphs, the number of completions of
``P`` is the sum over the orbits of (orbit size) times the completions of one
representative.  Pieces are reached from piece 0 by matched points, so the
reached set is connected and a matching is abandoned as soon as no reached
piece has a free point while pieces are unreached (a disconnected source).
The number of matched pairs joining two reached pieces is at most
``b_1 = E - V + 1`` (the first Betti number of a connected source), which
prunes every branch leading to a disconnected source.

Examples
--------
One degree-2 piece over a rational curve with a loop, unramified over the node
(two points on each side): two labelled matchings, both with two loops.

>>> count_matchings([(0, 0)], [0], [((1, 1), (1, 1))], [0])
{((0, 0, 0, 1), (0, 0, 0, 1)): 2}
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Sequence

from covertree.unionfind import DisjointSets

__all__ = ["count_matchings"]

Group = tuple[int, int, int]  # (base edge, side, length)


def count_matchings(base_edges: Sequence[tuple[int, int]], vertex: Sequence[int],
                    halves: Sequence[Sequence[tuple[int, ...]]], classes: Sequence[int]) -> dict[tuple, int]:
    """Labelled matchings with a connected source, counted per source graph.

    Parameters
    ----------
    base_edges : sequence of (int, int)
        The base's edges (vertex pairs, side 0 first).
    vertex : sequence of int
        Base vertex of each piece.
    halves : sequence
        Per piece, its profile at each half-edge point of its vertex, in the
        order of :func:`covertree.monodromy.local.special_points` (half-edges
        only).
    classes : sequence of int
        Class of each piece (equal vertex and shape); classes are consecutive
        and numbered in order.

    Returns
    -------
    dict
        Sorted tuple of source edges ``(i, j, k, l)`` -> number of labelled
        matchings giving that source graph.
    """
    return _Matcher(base_edges, vertex, halves, classes).run()


def _port_groups(base_edges: Sequence[tuple[int, int]], vertex: Sequence[int],
                 halves: Sequence[Sequence[tuple[int, ...]]]) -> list[dict[Group, int]]:
    points: dict[int, list[tuple[int, int]]] = {}
    for k, (a, b) in enumerate(base_edges):
        points.setdefault(a, []).append((k, 0))
        points.setdefault(b, []).append((k, 1))
    out = []
    for v, profiles in zip(vertex, halves):
        groups: dict[Group, int] = {}
        for (k, side), profile in zip(points.get(v, []), profiles):
            for length, m in sorted(Counter(profile).items()):
                groups[(k, side, length)] = m
        out.append(groups)
    return out


class _Matcher:
    """Depth-first search over partial matchings up to the orbits above."""

    def __init__(self, base_edges, vertex, halves, classes) -> None:
        self.free = _port_groups(base_edges, vertex, halves)
        self.n = len(vertex)
        self.cls = list(classes)
        n_classes = max(self.cls) + 1 if self.cls else 0
        self.members = [[i for i in range(self.n) if self.cls[i] == c] for c in range(n_classes)]
        self.next_pristine = [m[0] for m in self.members]
        self.holders: dict[Group, list[int]] = {}
        for i, groups in enumerate(self.free):
            for g in groups:
                self.holders.setdefault(g, []).append(i)
        ports = sum(m for groups in self.free for (_, side, _), m in groups.items() if side == 0)
        self.b1 = ports - self.n + 1
        self.reached: list[int] = []
        self.is_reached = [False] * self.n
        self.cycles = 0
        self.edges: list[tuple[int, int, int, int]] = []
        self.out: dict[tuple, int] = {}

    def run(self) -> dict[tuple, int]:
        if self.n == 0 or self.b1 < 0 or not self._may_connect():
            return {}
        self._reach(0)
        self._step(1)
        return self.out

    def _may_connect(self) -> bool:
        """Whether the pieces are connected when every holder of ``(k, 0, l)``
        is joined to every holder of ``(k, 1, l)``: a matched pair joins two
        such holders, so otherwise no matching has a connected source (the
        usual case of pieces whose lengths at a node meet no other piece's)."""
        sets = DisjointSets(self.n)
        for (k, side, length), holders in self.holders.items():
            partners = self.holders.get((k, 1 - side, length), ())
            if side or not partners:
                continue
            for i in list(holders) + list(partners):
                sets.union(partners[0], i)
        return sets.count() == 1

    def _reach(self, i: int) -> None:
        self.is_reached[i] = True
        self.reached.append(i)
        self.next_pristine[self.cls[i]] += 1

    def _unreach(self, i: int) -> None:
        self.is_reached[i] = False
        self.reached.pop()
        self.next_pristine[self.cls[i]] -= 1

    def _pristine_left(self, j: int) -> int:
        members = self.members[self.cls[j]]
        return members[-1] - j + 1

    def _options(self, group: Group) -> list[tuple[int, int]]:
        """``(partner piece, orbit size)`` for a point of ``group``."""
        k, side, length = group
        other = (k, 1 - side, length)
        out = []
        for j in self.holders.get(other, ()):
            f = self.free[j][other]
            if not f:
                continue
            if self.is_reached[j]:
                if self.cycles < self.b1:
                    out.append((j, f))
            elif self.next_pristine[self.cls[j]] == j:
                out.append((j, f * self._pristine_left(j)))
        return out

    def _choose(self) -> tuple[int, Group, list] | None:
        """The free port of a reached piece with the fewest partner orbits.

        The partner orbits of a port depend on its group only, not on its
        piece: each group is examined once, at its first reached holder."""
        best = None
        seen: set[Group] = set()
        for i in self.reached:
            for group, f in self.free[i].items():
                if not f or group in seen:
                    continue
                seen.add(group)
                options = self._options(group)
                if best is None or len(options) < len(best[2]):
                    best = (i, group, options)
                    if len(options) <= 1:
                        return best
        return best

    def _step(self, weight: int) -> None:
        chosen = self._choose()
        if chosen is None:
            if len(self.reached) == self.n:
                key = tuple(sorted(self.edges))
                self.out[key] = self.out.get(key, 0) + weight
            return
        i, group, options = chosen
        k, side, length = group
        other = (k, 1 - side, length)
        for j, size in options:
            fresh = not self.is_reached[j]
            self.free[i][group] -= 1
            self.free[j][other] -= 1
            self.edges.append((i, j, k, length) if side == 0 else (j, i, k, length))
            if fresh:
                self._reach(j)
            else:
                self.cycles += 1
            self._step(weight * size)
            if fresh:
                self._unreach(j)
            else:
                self.cycles -= 1
            self.edges.pop()
            self.free[j][other] += 1
            self.free[i][group] += 1
