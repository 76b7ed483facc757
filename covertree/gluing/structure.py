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
automorphism group ``Aut(f)`` is the stabiliser (THEORY.md section 3).

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
"""

from __future__ import annotations

from dataclasses import dataclass

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
            {p: cycles(piece.special(p)) for p in halves}
            for piece, halves in zip(self.pieces, self.halves)
        ]


def canonical_code(glued: Glued) -> tuple[tuple, int]:
    """The canonical code of a connected glued structure and ``|Aut|``.

    Returns
    -------
    (code, automorphisms)
        ``code`` is a tuple of ints; equal codes mean isomorphic covers.
    """
    best: list = [None, 0]
    for i in _start_pieces(glued):
        state = _Walk(glued, [i], [list(range(glued.pieces[i].degree))], [])
        state.run(best)
    return best[0], best[1]


def _start_pieces(glued: Glued) -> list[int]:
    """Pieces over the least base vertex with the least permutations: an
    isomorphism-invariant set to start from."""
    v0 = min(glued.vertex)
    cands = [i for i, v in enumerate(glued.vertex) if v == v0]
    least = min(glued.pieces[i].gens for i in cands)
    return [i for i in cands if glued.pieces[i].gens == least]


def _local_order(piece: Piece, entry: int) -> list[int]:
    """Sheets of the piece in breadth-first order from ``entry`` (all gens)."""
    order = [entry]
    seen = {entry}
    for x in order:
        for perm in piece.gens:
            y = perm[x]
            if y not in seen:
                seen.add(y)
                order.append(y)
    return order


class _Walk:
    """Depth-first search over the entry choices of one start piece."""

    def __init__(self, glued: Glued, queue: list[int], cands: list[list[int]], orders: list) -> None:
        self.g, self.queue, self.cands, self.orders = glued, queue, cands, orders
        self.pos = [None] * len(glued.pieces)

    def run(self, best: list) -> None:
        t = len(self.orders)
        if t == len(self.g.pieces):
            self._leaf(best)
            return
        if t >= len(self.queue):
            raise AssertionError("canonical_code needs a connected structure")
        j = self.queue[t]
        for entry in self.cands[t]:
            order = _local_order(self.g.pieces[j], entry)
            self.orders.append(order)
            self.pos[j] = {x: n for n, x in enumerate(order)}
            added = self._reach(j)
            self.run(best)
            del self.queue[len(self.queue) - added:]
            del self.cands[len(self.cands) - added:]
            self.orders.pop()
            self.pos[j] = None

    def _ports(self, j: int) -> list[Port]:
        """Ports of piece ``j`` in scan order (special point, least label)."""
        pos, out = self.pos[j], []
        for p in self.g.halves[j]:
            cyc = self.g.port_cycles[j][p]
            idx = sorted(range(len(cyc)), key=lambda c: min(pos[x] for x in cyc[c]))
            out.extend((j, p, c) for c in idx)
        return out

    def _reach(self, j: int) -> int:
        """Append the pieces first reached from piece ``j``; return how many."""
        added = 0
        for port in self._ports(j):
            j2, q, c2 = self.g.partner[port]
            if j2 not in self.queue:
                self.queue.append(j2)
                self.cands.append(list(self.g.port_cycles[j2][q][c2]))
                added += 1
        return added

    def _leaf(self, best: list) -> None:
        rank = {j: t for t, j in enumerate(self.queue)}
        code: list[int] = []
        for j, order in zip(self.queue, self.orders):
            piece, pos = self.g.pieces[j], self.pos[j]
            code += (self.g.vertex[j], piece.degree)
            for perm in piece.gens:
                code.extend(pos[perm[x]] for x in order)
            for port in self._ports(j):
                j2, q, c2 = self.g.partner[port]
                code += (rank[j2], q, min(self.pos[j2][x] for x in self.g.port_cycles[j2][q][c2]))
        code_t = tuple(code)
        if best[0] is None or code_t < best[0]:
            best[0], best[1] = code_t, 1
        elif code_t == best[0]:
            best[1] += 1
