"""The glued structure of an admissible cover, and its canonical code.

Convention
----------
A cover over a fixed curve of a base stratum is a list of pieces (connected
covers of single base components, :class:`~covertree.monodromy.pieces.Piece`),
each over a base vertex, and a perfect matching of *ports*: a port is a cycle
of ``s_x`` for a half-edge ``x`` of the base, and a port over the half-edge at
side 0 of base edge ``k`` is matched with one of equal length over side 1.

Two covers are isomorphic when an element of ``prod_v S_d`` (relabelling the
sheets over every base vertex independently) carries one to the other; the
automorphism group ``Aut(f)`` is the stabiliser (docs/theory.md, section 5).

Canonical code
--------------
A labelling of all sheets is grown piece by piece: the first piece is entered
at a start sheet, each piece is labelled breadth-first from its entry sheet,
and its ports (in the order of the vertex's special points, then of the least
label in the cycle) lead to the pieces not yet reached, each entered at one of
the sheets of the matched cycle (every choice is tried).  The code of a
labelling lists each piece's vertex and relabelled permutations and each
port's partner.  The least code over all start sheets (over a fixed
isomorphism-invariant set of pieces) and entry choices is a complete invariant,
and the labellings attaining it form one orbit of ``Aut(f)``, acted on freely,
so their number is ``|Aut(f)|``.  The number of labellings tried is at most
``d`` times the product of the entry cycle lengths, itself at most the
multiplicity of the cover.

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

from covertree.monodromy.pieces import Piece
from covertree.symmetric.permutations import cycles

#: A port: (piece index, special point index at the piece's vertex, cycle index).
Port = tuple[int, int, int]


@dataclass
class Glued:
    """Pieces over base vertices and the port matching (``partner`` is an
    involution on ports)."""

    vertex: list[int]
    pieces: list[Piece]
    halves: list[list[int]]
    partner: dict[Port, Port]

    def __post_init__(self) -> None:
        self.port_cycles = [
            {p: piece_cycles(piece, p) for p in halves}
            for piece, halves in zip(self.pieces, self.halves)
        ]


@lru_cache(maxsize=65536)
def piece_cycles(piece: Piece, p: int) -> tuple[tuple[int, ...], ...]:
    """The cycles of ``s_p`` of a piece (its ports at special point ``p``)."""
    return tuple(cycles(piece.special(p)))


@lru_cache(maxsize=65536)
def least_cycles(piece: Piece, p: int) -> tuple[int, ...]:
    """Indices of the cycles of ``s_p`` that are least in their orbit under the
    piece's deck group."""
    cyc = piece_cycles(piece, p)
    where = {x: c for c, cy in enumerate(cyc) for x in cy}
    return tuple(c for c, cy in enumerate(cyc) if c == min(where[g[cy[0]]] for g in piece.centraliser))


def forget_pieces() -> None:
    """Empty the caches kept per piece (cycles, breadth-first views), so that
    the pieces of one base stratum are not held while the next is listed."""
    for cached in (piece_cycles, least_cycles, _view, _least_label):
        cached.cache_clear()


def canonical_code(glued: Glued, marks: tuple[Port, ...] = ()) -> tuple[tuple, int]:
    """The canonical code of a connected glued structure and ``|Aut|``.

    With ``marks`` (one ``(piece, special point, cycle)`` per leg of the
    source, the cycle of ``s_p`` that is the marked point) the code ends with
    the marked points in the relabelled structure, and the automorphisms are
    those keeping every marked point: the code of the marked cover.

    The code is ``(heads, links)``: the vertex and relabelled permutations of
    every piece in the order reached, then every port's partner.  Heads are
    known as soon as a piece is entered, so a branch whose heads already exceed
    the best code found is cut (it cannot reach the least code, and no
    labelling attaining the least code is ever cut).

    Returns
    -------
    (code, automorphisms)
        ``code`` is a tuple; equal codes mean isomorphic covers.
    """
    best: list = [None, 0]
    for i in _start_pieces(glued):
        _Walk(glued, i, marks).run(best)
    return best[0], best[1]


def _start_pieces(glued: Glued) -> list[int]:
    """The pieces of one class over the least base vertex, the class with the
    fewest start sheets (then the least permutations): an isomorphism-invariant
    set to start from."""
    v0 = min(glued.vertex)
    classes: dict[tuple, list[int]] = {}
    for i, v in enumerate(glued.vertex):
        if v == v0:
            classes.setdefault(glued.pieces[i].gens, []).append(i)
    gens = min(classes, key=lambda g: (len(classes[g]) * len(g[0]), g))
    return classes[gens]


@lru_cache(maxsize=4096)
def _view(piece: Piece, halves: tuple[int, ...], entry: int) -> tuple[tuple, dict, tuple]:
    """Piece ``piece`` labelled breadth-first from ``entry`` (all gens):
    ``(head, least, scan)`` with ``head`` the degree and relabelled
    permutations, ``least[(p, c)]`` the least label on cycle ``c`` of ``s_p``,
    and ``scan`` the ports ``(p, c)`` in scan order (special point, least label).
    Depends on the piece only, so it is shared by all structures using it."""
    order = [entry]
    seen = {entry}
    for x in order:
        for perm in piece.gens:
            y = perm[x]
            if y not in seen:
                seen.add(y)
                order.append(y)
    pos = {x: n for n, x in enumerate(order)}
    head = (piece.degree,) + tuple(pos[perm[x]] for perm in piece.gens for x in order)
    least, scan = {}, []
    for p in halves:
        cyc = cycles(piece.special(p))
        mins = [min(pos[x] for x in c) for c in cyc]
        least.update({(p, c): m for c, m in enumerate(mins)})
        scan.extend((p, c) for c in sorted(range(len(cyc)), key=mins.__getitem__))
    return head, least, tuple(scan)


@lru_cache(maxsize=4096)
def _least_label(piece: Piece, entry: int, p: int, c: int) -> int:
    """The least breadth-first label (from ``entry``) on cycle ``c`` of ``s_p``."""
    order = [entry]
    seen = {entry}
    for x in order:
        for perm in piece.gens:
            y = perm[x]
            if y not in seen:
                seen.add(y)
                order.append(y)
    pos = {x: n for n, x in enumerate(order)}
    return min(pos[x] for x in piece_cycles(piece, p)[c])


class _Walk:
    """Depth-first search over the entry choices from one start piece."""

    def __init__(self, glued: Glued, start: int, marks: tuple[Port, ...] = ()) -> None:
        self.g = glued
        self.marks = marks
        self.entries: list[int] = []
        self.queue = [start]
        self.cands = [list(range(glued.pieces[start].degree))]
        self.reached = [False] * len(glued.pieces)
        self.reached[start] = True
        self.views: list[tuple] = []
        self.heads: list[tuple] = []
        self.halves = [tuple(h) for h in glued.halves]

    def run(self, best: list) -> None:
        t = len(self.views)
        if t == len(self.g.pieces):
            self._leaf(best)
            return
        if t >= len(self.queue):
            raise AssertionError("canonical_code needs a connected structure")
        j = self.queue[t]
        for entry in self.cands[t]:
            view = _view(self.g.pieces[j], self.halves[j], entry)
            self.heads.append((self.g.vertex[j], view[0]))
            if best[0] is None or tuple(self.heads) <= best[0][0][:t + 1]:
                self.views.append(view)
                self.entries.append(entry)
                added = self._reach(j, view[2])
                self.run(best)
                self.entries.pop()
                for j2 in self.queue[len(self.queue) - added:]:
                    self.reached[j2] = False
                del self.queue[len(self.queue) - added:]
                del self.cands[len(self.cands) - added:]
                self.views.pop()
            self.heads.pop()

    def _reach(self, j: int, scan: tuple) -> int:
        """Append the pieces first reached from piece ``j``; return how many."""
        added = 0
        partner, reached = self.g.partner, self.reached
        for p, c in scan:
            j2, q, c2 = partner[(j, p, c)]
            if not reached[j2]:
                reached[j2] = True
                self.queue.append(j2)
                self.cands.append(self.g.port_cycles[j2][q][c2])
                added += 1
        return added

    def _leaf(self, best: list) -> None:
        rank = {j: t for t, j in enumerate(self.queue)}
        partner, views = self.g.partner, self.views
        links: list[int] = []
        for j, (_head, _least, scan) in zip(self.queue, views):
            for p, c in scan:
                j2, q, c2 = partner[(j, p, c)]
                r = rank[j2]
                links += (r, q, views[r][1][(q, c2)])
        code = (tuple(self.heads), tuple(links))
        if self.marks:
            code += (tuple((rank[j], p, _least_label(self.g.pieces[j], self.entries[rank[j]], p, c))
                           for j, p, c in self.marks),)
        if best[0] is None or code < best[0]:
            best[0], best[1] = code, 1
        elif code == best[0]:
            best[1] += 1
