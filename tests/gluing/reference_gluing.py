"""The list engine as it was before each cover was generated once: the
port matchings of every balanced choice, one side matched in order and the
other broken by pristine twins and deck orbits, every connected matching given
its canonical code and repeats dropped.  Kept verbatim (but for names) as the
reference the tests compare the engine with.
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Iterator, Sequence
from dataclasses import replace
from fractions import Fraction
from functools import lru_cache
from math import factorial, prod

from covertree.errors import IdentityError
from covertree.graphs.curve_graph import CurveGraph
from covertree.gluing.covers import GluedCover
from covertree.gluing.structure import Glued, Port, canonical_code, least_cycles, piece_cycles
from covertree.monodromy.local import LocalCover, local_covers, special_points
from covertree.monodromy.pieces import Piece


@lru_cache(maxsize=256)
def _local_covers(degree: int, genus: int, profiles: tuple) -> tuple[LocalCover, ...]:
    return tuple(local_covers(degree, genus, profiles))


def reference_glued_covers(base: CurveGraph, degree: int, profiles: Sequence[Sequence[int]],
                 marks: Sequence[tuple[int, int]] = ()) -> Iterator[GluedCover]:
    """Every admissible cover with connected source over a fixed curve of type
    ``base`` (legs ``j`` of profile ``profiles[j-1]``), each class once, in a
    deterministic order, streamed as found.

    With ``marks`` (one ``(J, e)`` per leg of the source,
    :mod:`covertree.hurwitz.marks`) every marked cover is listed once: the
    labellings of the marked points of each cover, up to its automorphisms.

    """
    specs = special_points(base)
    for choice in balanced_choices(base, degree, profiles):
        for cover in _gluings(base, specs, choice, marks):
            yield cover


def balanced_choices(base: CurveGraph, degree: int, profiles: Sequence[Sequence[int]]) -> Iterator[list[LocalCover]]:
    """Every choice of one local cover per base vertex with equal profiles
    across each node (the balancing condition)."""
    specs = special_points(base)
    options = []
    for v, spec in enumerate(specs):
        prof = tuple(tuple(profiles[s[1] - 1]) if s[0] == "leg" else None for s in spec)
        options.append(_local_covers(degree, base.vertex_genera[v], prof))
    yield from _balanced_choices(base, specs, options)


def _half_index(specs: list, v: int, k: int, side: int) -> int:
    return specs[v].index(("half", k, side))


def _balanced_choices(base: CurveGraph, specs: list, options: list) -> Iterator[list[LocalCover]]:
    """Choices of one local cover per vertex with equal profiles across nodes."""
    checks: list[list[tuple]] = [[] for _ in specs]
    for k, (i, j) in enumerate(base.nodes):
        later = max(i, j)
        checks[later].append((i, _half_index(specs, i, k, 0), j, _half_index(specs, j, k, 1)))
    chosen: list[LocalCover] = []

    def rec(v: int) -> Iterator[list[LocalCover]]:
        if v == len(specs):
            yield list(chosen)
            return
        for cover in options[v]:
            chosen.append(cover)
            if all(chosen[a].profiles[pa] == chosen[b].profiles[pb] for a, pa, b, pb in checks[v]):
                yield from rec(v + 1)
            chosen.pop()

    yield from rec(0)


class _Matcher:
    """Enumerates the port matchings of one choice of local covers."""

    def __init__(self, base: CurveGraph, specs: list, choice: list[LocalCover]) -> None:
        self.vertex = [v for v, cover in enumerate(choice) for _ in cover.pieces]
        self.pieces: list[Piece] = [p for cover in choice for p in cover.pieces]
        self.halves = [
            [p for p, s in enumerate(specs[v]) if s[0] == "half"] for v in self.vertex
        ]
        self.glued = Glued(self.vertex, self.pieces, self.halves, {})
        self.sides, seen = [], set()
        for k in self._edge_order(base):
            self.sides.append(self._side_ports(base, specs, k, seen))
            seen.update(base.nodes[k])
        self.one_each = len(self.pieces) == len(set(self.vertex))
        self.twins = self._twins()
        self.least = self._least_ports()
        self.touched = [0] * len(self.pieces)
        self.used: set[Port] = set()

    @staticmethod
    def _edge_order(base: CurveGraph) -> list[int]:
        """Loops first: they break the most symmetry."""
        return sorted(range(base.n_nodes), key=lambda k: (base.nodes[k][0] != base.nodes[k][1], k))

    def _side_ports(self, base: CurveGraph, specs: list, k: int, seen: set[int]) -> tuple[list, list, int, bool]:
        """``(left, right, k, flipped)``: the ports over the two sides of edge
        ``k``; left ports are matched in order, right ones are the candidates,
        where the symmetry breaking acts, so the side whose pieces have more
        symmetry goes right (``flipped`` when that is side 0).  Pieces over a
        vertex met by an earlier edge are no longer pristine: that side counts
        as having none."""
        ends = []
        for side in (0, 1):
            v = base.nodes[k][side]
            p = _half_index(specs, v, k, side)
            ends.append([
                ((i, p, c), len(cyc))
                for i in range(len(self.pieces)) if self.vertex[i] == v
                for c, cyc in enumerate(self.glued.port_cycles[i][p])
            ])
        u, w = base.nodes[k]
        flipped = u != w and self._symmetry(u, seen) > self._symmetry(w, seen)
        return (ends[1], ends[0], k, True) if flipped else (ends[0], ends[1], k, False)

    def _symmetry(self, v: int, seen: set[int]) -> int:
        """Order of the group permuting identical pieces over ``v`` and acting by
        their deck groups, ``prod m_P! |C(P)|^m_P`` (1 once ``v`` is in ``seen``)."""
        if v in seen:
            return 1
        counts = Counter(p.gens for i, p in enumerate(self.pieces) if self.vertex[i] == v)
        order = 1
        for i, p in enumerate(self.pieces):
            if self.vertex[i] == v:
                order *= p.centraliser_order
        return order * prod(factorial(m) for m in counts.values())

    def _twins(self) -> list[list[int]]:
        """Earlier pieces over the same vertex with the same permutations."""
        return [
            [i for i in range(j) if self.vertex[i] == self.vertex[j] and self.pieces[i].gens == self.pieces[j].gens]
            for j in range(len(self.pieces))
        ]

    def _least_ports(self) -> set[Port]:
        """Ports least in their orbit under their piece's deck group."""
        return {(j, p, c) for j, piece in enumerate(self.pieces)
                for p in self.halves[j] for c in least_cycles(piece, p)}

    def matchings(self) -> Iterator[dict[Port, Port]]:
        yield from self._match(0, 0)

    def _match(self, e: int, t: int) -> Iterator[dict[Port, Port]]:
        if e == len(self.sides):
            yield self.glued.partner
            return
        left, right = self.sides[e][:2]
        if t == len(left):
            yield from self._match(e + 1, 0)
            return
        port, length = left[t]
        for cand, clen in right:
            if clen != length or cand in self.used or not self._allowed(port[0], cand):
                continue
            self._pair(port, cand, +1)
            yield from self._match(e, t + 1)
            self._pair(port, cand, -1)

    def _allowed(self, owner: int, cand: Port) -> bool:
        q = cand[0]
        if q == owner or self.touched[q]:
            return True
        if any(not self.touched[i] and i != owner for i in self.twins[q]):
            return False
        return cand in self.least

    def _pair(self, a: Port, b: Port, step: int) -> None:
        self.touched[a[0]] += step
        self.touched[b[0]] += step
        if step > 0:
            self.used.add(b)
            self.glued.partner[a], self.glued.partner[b] = b, a
        else:
            self.used.discard(b)
            del self.glued.partner[a], self.glued.partner[b]

    def connected(self) -> bool:
        if self.one_each:
            return True  # one piece per vertex of a connected base
        parent = list(range(len(self.pieces)))

        def find(i: int) -> int:
            while parent[i] != i:
                parent[i] = parent[parent[i]]
                i = parent[i]
            return i

        joins, needed = 0, len(self.pieces) - 1
        for a, b in self.glued.partner.items():
            ra, rb = find(a[0]), find(b[0])
            if ra != rb:
                parent[ra] = rb
                joins += 1
                if joins == needed:
                    return True
        return False


def _gluings(base: CurveGraph, specs: list, choice: list[LocalCover],
             marks: Sequence[tuple[int, int]] = ()) -> Iterator[GluedCover]:
    m = _Matcher(base, specs, choice)
    candidates = _mark_candidates(base, specs, m, marks)
    edge_profiles = tuple(
        choice[base.nodes[k][0]].profiles[_half_index(specs, base.nodes[k][0], k, 0)]
        for k in range(base.n_nodes)
    )
    mult = prod(x for prof in edge_profiles for x in prof)
    seen: set[tuple] = set()
    for partner in m.matchings():
        if not m.connected():
            continue
        code, aut = canonical_code(m.glued)
        if code in seen:
            continue
        seen.add(code)
        record = _record(m, code, aut, mult, edge_profiles)
        yield from _marked(m, record, candidates) if marks else (record,)


def _mark_candidates(base: CurveGraph, specs: list, m: "_Matcher", marks) -> list[list]:
    """Per leg ``(J, e)``: the ports ``(piece, point, cycle)`` that are points of
    index ``e`` over branch point ``J``."""
    where = {s[1]: (v, p) for v, spec in enumerate(specs) for p, s in enumerate(spec) if s[0] == "leg"}
    out = []
    for point, index in marks:
        v, p = where[point]
        out.append([(i, p, c) for i in range(len(m.pieces)) if m.vertex[i] == v
                    for c, cyc in enumerate(piece_cycles(m.pieces[i], p)) if len(cyc) == index])
    return out


def _labellings(candidates: list[list]) -> Iterator[tuple]:
    """Injective choices of one candidate per leg."""
    chosen: list = []

    def rec(k: int) -> Iterator[tuple]:
        if k == len(candidates):
            yield tuple(chosen)
            return
        for port in candidates[k]:
            if port not in chosen:
                chosen.append(port)
                yield from rec(k + 1)
                chosen.pop()

    yield from rec(0)


def _marked(m: "_Matcher", record: GluedCover, candidates: list[list]) -> Iterator[GluedCover]:
    """The marked covers over one cover: labellings up to ``Aut f``; checks the
    orbit count ``sum |Aut f| / |Aut(f, marks)| = #labellings``."""
    found: dict[tuple, tuple[int, tuple]] = {}
    total = 0
    for ports in _labellings(candidates):
        total += 1
        code, aut = canonical_code(m.glued, ports)
        if code not in found:
            found[code] = (aut, tuple(i for i, _, _ in ports))
    if sum(Fraction(record.automorphisms, aut) for aut, _ in found.values()) != total:
        raise IdentityError(f"marked covers over one cover do not add up to its {total} labellings")
    for code, (aut, legs) in sorted(found.items()):
        yield replace(record, code=code, automorphisms=aut, source_legs=legs)


def _record(m: _Matcher, code: tuple, aut: int, mult: int, edge_profiles: tuple) -> GluedCover:
    edges, over, index = [], [], []
    for left, _right, k, flipped in m.sides:
        for port, length in left:
            other = m.glued.partner[port]
            edges.append((other[0], port[0]) if flipped else (port[0], other[0]))
            over.append(k)
            index.append(length)
    return GluedCover(
        code, aut, mult, edge_profiles,
        tuple(p.genus for p in m.pieces), tuple(m.vertex), tuple(p.degree for p in m.pieces),
        tuple(edges), tuple(over), tuple(index),
    )
