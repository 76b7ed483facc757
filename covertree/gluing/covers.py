"""Admissible covers over a fixed curve of a base stratum, up to isomorphism.

For every choice of local covers at the base vertices whose profiles agree
across each node (the balancing condition), the matchings of node preimages
(ports) are enumerated, connected sources kept, and each isomorphism class
reported once, with ``|Aut f|`` and ``mult(f) = prod_q prod_i e_{q,i}``
(docs/theory.md, sections 5 and 6).

Symmetry breaking
-----------------
Fix a choice of local covers.  Its pieces are in normal form, so the
relabellings of ``prod_v S_d`` that keep the choice are the group ``G``
permuting identical pieces over each vertex (*twins*) and acting on each piece
by its deck group; covers of this choice are the ``G``-orbits of connected
matchings, ``Aut(f)`` the stabilisers.  Edges are taken in a fixed order; over
each edge the ports of one side (the *left* side) are matched in a fixed order
``x_1, x_2, ...`` to ports of the other side (the *candidates*, in a fixed
order).  A matching ``M`` is thus a word ``M(x_1) M(x_2) ...`` and the words
of an orbit have a lexicographic least one, ``M_0``; ``gM`` is the matching
``{g(a), g(b)}`` for ``{a, b}`` in ``M``, so ``(gM)(x) = g(M(g^-1 x))``.  A
piece is *used* by the ports of it already in the word (as left ports or
letters); a component of the matching of the earlier edges is *idle* while
none of its ports is used over the current edge.  Each rule below names some
``g`` in ``G`` with ``(gM)(x_i) = M(x_i)`` for ``i < s`` (the prefix is kept)
and says that ``(gM)(x_s)`` would come before ``M(x_s)``; so ``M_0`` obeys all
of them at once, every orbit is still reached, and the rules are compatible
with one another because they test the same least word:

1. *(candidate copies)* ``x_s`` is not matched to a port ``c`` of an idle
   component ``K'`` when an idle copy ``K`` of it (same pieces over the same
   vertices, matched alike; the component of ``x_s`` neither) takes the piece
   of ``c`` to an earlier piece: ``g`` swaps ``K`` and ``K'``, keeps the
   earlier edges, ``x_s`` and the prefix of this edge (idle), and
   ``(gM)(x_s) = g(c)`` comes first.  Pristine twin pieces are the simplest
   copies.
2. *(candidate deck)* ``c`` on piece ``q`` is refused if a deck
   transformation ``g`` of ``q`` fixing every used port of ``q`` (and
   ``x_s``, when it is on ``q``) takes ``c`` to a lesser port of ``q``: ``g``
   keeps the prefix and ``x_s``, and ``(gM)(x_s) = g(c)``.
3. *(left deck)* for a deck transformation ``g`` of the piece ``L`` of
   ``x_s`` fixing the used ports of ``L``, with ``y = g(x_s) != x_s``:
   ``g^-1`` keeps the prefix and ``(g^-1 M)(x_s) = g^-1(M(y))``, so
   ``M_0(x_s) <= g^-1(M_0(y))``.  Over an edge between distinct vertices
   ``g`` does not move candidates and this reads ``M(y)`` after ``M(x_s)``;
   the same holds for the ports of the pristine twins of a pristine ``L``
   answering to the orbit of ``x_s``.
4. *(left copies)* when ``x_s`` is the first port of an idle component ``K``
   and ``K'`` is an idle copy, ``y`` the port of ``K'`` answering to
   ``x_s``, ``g`` the swap: ``(gM)(x_s) = g(M(y))``, so ``M_0(x_s) <=
   g(M_0(y))``, tested when ``y`` is matched.

Each cover once
---------------
The rules use only some of the symmetries of the partial matching (a swap of
twins combined with a deck transformation of a used piece, for example, is
not among them), so a few matchings that are not least still reach the last
port.  Each connected complete matching ``M`` is therefore tested
(:mod:`covertree.gluing.orbits`): a search over ``G``, defining ``g`` piece
by piece along the word, decides exactly whether some ``gM`` is a lesser
word, and ``M`` is kept only when none is, that is when ``M = M_0``.

*Proof that every cover is listed exactly once.*  The covers of a choice are
the ``G``-orbits of its connected matchings, and each orbit has exactly one
least word ``M_0`` (a total order on finite words).  The rules 1-4 never cut
a prefix of ``M_0`` (above: each cut names a ``g`` with a lesser word), so
``M_0`` reaches the last port; the test keeps it and drops every other word
of the orbit that gets there.  The test and the rules concern the same least
word, so they are compatible whatever the rules cut.  Distinct choices give
non-isomorphic covers: an isomorphism carries the pieces over each vertex to
conjugate pieces over the same vertex, so the normal forms over each vertex
(the choice) are an invariant.  Hence no two covers listed are isomorphic,
and a code is computed once per cover listed, for its ``code`` and ``|Aut
f|``.

The test is a search, and when the word reads many twins before it reads
what tells them apart (identical pieces on both sides of parallel nodes) it
can meet about as many partial elements as there are permutations of twins.
It is therefore given a budget of letters (:data:`ORBIT_TEST_BUDGET`); when a
test runs out, that matching and the rest of its choice are kept without the
test, and repeats are dropped by their canonical code, remembered per choice
as a safety net and counted in :class:`GluingStats` (``repeats``, 0 whenever
every test finished).  Both ways keep one matching of each orbit, so the
list is the same.

References
----------
B. D. McKay, Isomorph-free exhaustive generation, *J. Algorithms* 26 (1998),
306-324 (orbit representatives by a canonical choice among the extensions of
each partial object; here the least word, tested by the rules above).

Examples
--------
Double covers of an elliptic curve branched at two points, over the stratum of
a rational curve with one node (three covers, total weight 2):

>>> from fractions import Fraction
>>> from covertree.graphs.curve_graph import StableCurveGraph
>>> base = StableCurveGraph([(0, [1, 2])], nodes=[(0, 0)])
>>> covers = list(glued_covers(base, 2, [(2,), (2,)]))
>>> sorted((c.edge_profiles, c.automorphisms, c.multiplicity) for c in covers)
[(((1, 1),), 2, 1), (((1, 1),), 2, 1), (((2,),), 2, 2)]
>>> sum(Fraction(c.multiplicity, c.automorphisms) for c in covers)
Fraction(2, 1)
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass, replace
from fractions import Fraction
from functools import lru_cache, partial
from math import factorial, prod

from covertree.errors import IdentityError, ProblemError
from covertree.graphs.curve_graph import CurveGraph
from covertree.hurwitz.problem import source_genus
from covertree.gluing.orbits import OrbitTest
from covertree.gluing.structure import Glued, Port, canonical_code, forget_pieces, piece_cycles
from covertree.monodromy.local import LocalCover, forget_pieces as forget_local_pieces, local_covers, special_points
from covertree.monodromy.pieces import Piece
from covertree.unionfind import DisjointSets


@dataclass(frozen=True)
class GluedCover:
    """One admissible cover, as raw data (source vertices are pieces).

    Attributes
    ----------
    code : tuple
        Canonical code (equal iff isomorphic).
    automorphisms, multiplicity : int
    edge_profiles : tuple of tuple of int
        Profile over each base node, in the base's edge order.
    source_genera, source_vertex_over, source_degrees : tuple of int
        Per source component: genus, base vertex below, degree.
    source_edges : tuple of (int, int)
        Source nodes as pairs of components (over side 0, over side 1).
    source_edge_over, source_edge_index : tuple of int
        Per source node: the base edge below and the ramification index.
    source_legs : tuple of int
        For a marked problem, the component carrying each leg (leg order);
        ``code`` and ``automorphisms`` are then those of the marked cover.
    """

    code: tuple
    automorphisms: int
    multiplicity: int
    edge_profiles: tuple[tuple[int, ...], ...]
    source_genera: tuple[int, ...]
    source_vertex_over: tuple[int, ...]
    source_degrees: tuple[int, ...]
    source_edges: tuple[tuple[int, int], ...]
    source_edge_over: tuple[int, ...]
    source_edge_index: tuple[int, ...]
    source_legs: tuple[int, ...] = ()


@dataclass
class GluingStats:
    """Counters of one enumeration (filled in when passed to
    :func:`glued_covers`): matchings reaching the last port, the connected
    ones that are not the least word of their orbit (``rejected``: each is a
    cover listed once anyway, dropped before any canonical code), the
    canonical codes computed, and the repeats among those codes; ``untested``
    counts the choices whose orbit test gave up (:data:`ORBIT_TEST_BUDGET`),
    the only ones where repeats can happen (module docstring).
    """

    matchings: int = 0
    codes: int = 0
    repeats: int = 0
    rejected: int = 0
    untested: int = 0

    @property
    def covers(self) -> int:
        """Distinct covers found (before marking)."""
        return self.codes - self.repeats


@lru_cache(maxsize=256)
def _local_covers(degree: int, genus: int, profiles: tuple, max_genus: int) -> tuple[LocalCover, ...]:
    return tuple(local_covers(degree, genus, profiles, max_genus))


def glued_covers(base: CurveGraph, degree: int, profiles: Sequence[Sequence[int]],
                 marks: Sequence[tuple[int, int]] = (), stats: GluingStats | None = None) -> Iterator[GluedCover]:
    """Every admissible cover with connected source over a fixed curve of type
    ``base`` (legs ``j`` of profile ``profiles[j-1]``), each class once, in a
    deterministic order, streamed as found.

    With ``marks`` (one ``(J, e)`` per leg of the source,
    :mod:`covertree.hurwitz.marks`) every marked cover is listed once: the
    labellings of the marked points of each cover, up to its automorphisms.
    ``stats``, when given, counts the work (:class:`GluingStats`).

    >>> from covertree.graphs.curve_graph import StableCurveGraph
    >>> base = StableCurveGraph([(1, [1])])
    >>> [(c.automorphisms, c.source_legs) for c in glued_covers(base, 2, [(1, 1)], [(1, 1)])]
    [(1, (0,)), (1, (0,)), (1, (0,))]
    >>> stats = GluingStats()
    >>> base = StableCurveGraph([(0, [1]), (0, [2])], nodes=[(0, 1), (0, 1)])
    >>> len(list(glued_covers(base, 4, [(2, 1, 1)] * 2, stats=stats))), stats.codes, stats.rejected, stats.repeats
    (12, 12, 1, 0)
    """
    specs = special_points(base)
    stats = GluingStats() if stats is None else stats
    try:
        for choice in balanced_choices(base, degree, profiles):
            yield from _gluings(base, specs, choice, marks, stats)
    finally:
        _forget()


def _forget() -> None:
    """Drop the pieces of a finished stratum and what is cached about them:
    strata share few local covers (the half-edge profiles differ), and
    keeping them made memory grow with the degree."""
    _local_covers.cache_clear()
    forget_local_pieces()
    forget_pieces()


def balanced_choices(base: CurveGraph, degree: int, profiles: Sequence[Sequence[int]]) -> Iterator[list[LocalCover]]:
    """Every choice of one local cover per base vertex with equal profiles
    across each node (the balancing condition), as a list by vertex.

    Vertices are visited in :func:`_vertex_order`; at each, the profiles at
    the half-edges to vertices already chosen are prescribed like those of
    legs, so only local covers that balance are ever built.  A connected
    source of genus ``g`` has ``g = sum g_c + b_1 >= sum g_c`` over its
    components, so choices whose pieces' genera add up to more than ``g``
    (all of whose matchings are disconnected) are skipped."""
    specs = special_points(base)
    try:
        genus = source_genus(degree, base.genus, [tuple(p) for p in profiles])
    except ProblemError:
        return  # Riemann-Hurwitz has no connected source: no cover

    order = _vertex_order(base, specs)
    done = {v: n for n, v in enumerate(order)}
    links = _links(base, specs, done)
    loops = [[(_half_index(specs, v, k, 0), _half_index(specs, v, k, 1))
              for k, (i, j) in enumerate(base.nodes) if i == j == v] for v in range(len(specs))]
    chosen: list[LocalCover | None] = [None] * len(specs)

    def options(v: int) -> list[LocalCover]:
        given = {p: chosen[a].profiles[pa] for p, a, pa in links[v]}
        prof = tuple(tuple(profiles[sp[1] - 1]) if sp[0] == "leg" else given.get(p)
                     for p, sp in enumerate(specs[v]))
        return [c for c in _local_covers(degree, base.vertex_genera[v], prof, genus)
                if all(c.profiles[x] == c.profiles[y] for x, y in loops[v])]

    def rec(n: int, budget: int) -> Iterator[list[LocalCover]]:
        if n == len(order):
            yield list(chosen)
            return
        v = order[n]
        for cover in options(v):
            if cover.genus <= budget:
                chosen[v] = cover
                yield from rec(n + 1, budget - cover.genus)
        chosen[v] = None

    yield from rec(0, genus)


def _vertex_order(base: CurveGraph, specs: list) -> list[int]:
    """Vertices with legs first (by index), then repeatedly the vertex with the
    most half-edges towards those already placed (then the least index)."""
    order = [v for v, spec in enumerate(specs) if any(sp[0] == "leg" for sp in spec)] or [0]
    while len(order) < len(specs):
        placed = set(order)

        def towards(v: int) -> int:
            return sum((i in placed) + (j in placed) for i, j in base.nodes if v in (i, j) and i != j)

        rest = [v for v in range(len(specs)) if v not in placed]
        order.append(max(rest, key=lambda v: (towards(v), -v)))
    return order


def _links(base: CurveGraph, specs: list, done: dict[int, int]) -> list[list[tuple[int, int, int]]]:
    """Per vertex ``v``: ``(point of v, earlier vertex a, point of a)`` for
    each node from ``v`` to a vertex visited before it."""
    links: list[list[tuple[int, int, int]]] = [[] for _ in specs]
    for k, (i, j) in enumerate(base.nodes):
        if i != j:
            hi, hj = _half_index(specs, i, k, 0), _half_index(specs, j, k, 1)
            (_, a, pa), (_, b, pb) = sorted([(done[i], i, hi), (done[j], j, hj)])
            links[b].append((pb, a, pa))
    return links


def _half_index(specs: list, v: int, k: int, side: int) -> int:
    return specs[v].index(("half", k, side))


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
        self.decks = [self._deck_actions(i) for i in range(len(self.pieces))]
        self.fixed: list[list[tuple[int, int]]] = [[] for _ in self.pieces]
        self.orbits = [self._left_orbits(base, side) for side in self.sides]
        self.loop = [base.nodes[k][0] == base.nodes[k][1] for _l, _r, k, _f in self.sides]
        self.touched = [0] * len(self.pieces)
        self.used: set[Port] = set()
        self.floor: dict[Port, int] = {}
        self.copies: list[_Copies] = []
        self.orbit_test = self._orbit_test()

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

    def _deck_actions(self, i: int) -> list[dict[tuple[int, int], int]]:
        """How each deck transformation of piece ``i`` but the identity moves
        its ports: ``(point, cycle) -> cycle``."""
        piece, out = self.pieces[i], []
        for g in piece.centraliser:
            if any(g[x] != x for x in range(piece.degree)):
                act = {}
                for p in self.halves[i]:
                    cyc = self.glued.port_cycles[i][p]
                    where = {x: n for n, cy in enumerate(cyc) for x in cy}
                    act.update({(p, c): where[g[cy[0]]] for c, cy in enumerate(cyc)})
                out.append(act)
        return out

    def _orbit_test(self) -> OrbitTest:
        """The group of the choice acting on the words of its matchings
        (:mod:`covertree.gluing.orbits`)."""
        positions = [port for left, _right, _k, _f in self.sides for port, _length in left]
        classes = [sorted(self.twins[j] + [j] + [i for i in range(j + 1, len(self.pieces)) if j in self.twins[i]])
                   for j in range(len(self.pieces))]
        identity = [{(p, c): c for p in self.halves[i] for c in range(len(self.glued.port_cycles[i][p]))}
                    for i in range(len(self.pieces))]
        return OrbitTest(positions, classes, [[identity[i]] + self.decks[i] for i in range(len(self.pieces))])

    def _moves(self, i: int, extra: tuple[int, int] | None = None) -> Iterator[dict[tuple[int, int], int]]:
        """The deck actions of piece ``i`` fixing each of its used ports (and
        ``extra``)."""
        fixed = self.fixed[i] if extra is None else self.fixed[i] + [extra]
        for act in self.decks[i]:
            if all(act[f] == f[1] for f in fixed):
                yield act

    def _left_orbits(self, base: CurveGraph, side: tuple) -> list[list[Port]]:
        """Per left port of an edge between distinct vertices: the ports of
        the later twins of its piece in the orbit of the same port under their
        deck groups (rule 3 of the module docstring, for a pristine piece);
        nothing over a loop."""
        left, _right, k, _flipped = side
        if base.nodes[k][0] == base.nodes[k][1]:
            return [[] for _ in left]
        out = []
        for (i, p, c), _length in left:
            orbit = {c} | {act[(p, c)] for act in self.decks[i]}
            out.append([(j, p, n) for j in range(i + 1, len(self.pieces)) if i in self.twins[j] for n in sorted(orbit)])
        return out

    def matchings(self) -> Iterator[dict[Port, Port]]:
        yield from self._match(0, 0)

    def _match(self, e: int, t: int) -> Iterator[dict[Port, Port]]:
        if e == len(self.sides):
            yield self.glued.partner
            return
        left, right = self.sides[e][:2]
        if t == 0:
            self.copies.append(_Copies(self, right))
        if t == len(left):
            copies = self.copies.pop()
            yield from self._match(e + 1, 0)
            self.copies.append(copies)
        else:
            yield from self._match_port(e, t, left[t], right)
        if t == 0:
            self.copies.pop()

    def _match_port(self, e: int, t: int, left_port: tuple[Port, int], right: list) -> Iterator[dict[Port, Port]]:
        port, length = left_port
        copies = self.copies[-1]
        orbit = [] if self.touched[port[0]] else list(self.orbits[e][t])
        moves = [act for act in self._moves(port[0]) if act[port[1:]] != port[2]]
        if not self.loop[e]:
            orbit += [(port[0], port[1], act[port[1:]]) for act in moves]
            moves = []
        for rank in range(self.floor.get(port, -1) + 1, len(right)):
            cand, clen = right[rank]
            if clen != length or cand in self.used or not self._allowed(port, cand) \
                    or not copies.allowed(port, cand):
                continue
            pending = copies.register(port, rank) + copies.register_turns(port, rank, moves)
            self._pair(port, cand, +1)
            raised = self._raise(orbit, rank)
            yield from self._match(e, t + 1)
            self._lower(raised)
            self._pair(port, cand, -1)
            copies.unregister(pending)

    def _raise(self, orbit: Sequence[Port], rank: int) -> list[tuple[Port, int]]:
        """Make the ports of ``orbit`` take candidates after ``rank`` (rule 3);
        return the old floors."""
        raised = []
        for y in orbit:
            old = self.floor.get(y, -1)
            if rank > old:
                raised.append((y, old))
                self.floor[y] = rank
        return raised

    def _lower(self, raised: list[tuple[Port, int]]) -> None:
        for y, old in reversed(raised):
            self.floor[y] = old

    def _allowed(self, port: Port, cand: Port) -> bool:
        """Rule 2: no deck transformation of the candidate's piece fixing its
        used ports (and ``port``) moves ``cand`` to a lesser port (rule 1 is
        :meth:`_Copies.allowed`)."""
        q = cand[0]
        if not self.decks[q]:
            return True
        extra = port[1:] if q == port[0] else None
        return all(act[cand[1:]] >= cand[2] for act in self._moves(q, extra))

    def _pair(self, a: Port, b: Port, step: int) -> None:
        self.touched[a[0]] += step
        self.touched[b[0]] += step
        self.copies[-1].busy(a[0], b[0], step)
        for x in (a, b):
            if step > 0:
                self.fixed[x[0]].append(x[1:])
            else:
                self.fixed[x[0]].pop()
        if step > 0:
            self.used.add(b)
            self.glued.partner[a], self.glued.partner[b] = b, a
        else:
            self.used.discard(b)
            del self.glued.partner[a], self.glued.partner[b]

    def connected(self) -> bool:
        if self.one_each:
            return True  # one piece per vertex of a connected base
        sets = DisjointSets(len(self.pieces))
        joins, needed = 0, len(self.pieces) - 1
        for a, b in self.glued.partner.items():
            if sets.union(a[0], b[0]):
                joins += 1
                if joins == needed:
                    return True
        return False


class _Copies:
    """The components of the matching of the edges before the current one
    that are copies of each other (the same pieces over the same vertices,
    matched alike), and the rules 1 and 4 they give over the current edge.

    ``images[q]`` lists, for each copy ``K'`` of the component of piece ``q``,
    the swap of the two components (piece to piece) and the id of ``K'``; a
    component is *busy* once one of its ports is used over the current edge,
    and only idle components are swapped.
    """

    def __init__(self, m: _Matcher, right: list) -> None:
        self.comp = [-1] * len(m.pieces)
        groups: dict[tuple, list[list[int]]] = {}
        for q in range(len(m.pieces)):
            if self.comp[q] < 0:
                order, key = _component(m, q)
                for r in order:
                    self.comp[r] = q
                groups.setdefault(key, []).append(order)
        self.images: list[list[tuple[int, dict[int, int]]]] = [[] for _ in m.pieces]
        for orders in groups.values():
            for a in orders:
                for b in orders:
                    if a is not b:
                        swap = {**dict(zip(a, b)), **dict(zip(b, a))}
                        for q in b:
                            self.images[q].append((a[0], swap))
        self.n_busy = [0] * len(m.pieces)
        self.rank = {cand: r for r, (cand, _length) in enumerate(right)}
        self.pending: dict[Port, list[tuple[int, Callable[[Port], Port]]]] = {}

    def busy(self, a: int, b: int, step: int) -> None:
        self.n_busy[self.comp[a]] += step
        self.n_busy[self.comp[b]] += step

    def allowed(self, port: Port, cand: Port) -> bool:
        """Rules 1 and 4: ``cand`` is not the image of a lesser port under a
        swap of idle copies that fixes ``port``; ``port`` meets the bounds
        left by the first ports of its copies."""
        q, own = cand[0], self.comp[port[0]]
        if not self.n_busy[self.comp[q]]:
            for other, swap in self.images[q]:
                if swap[q] < q and not self.n_busy[other] and own != other and own != self.comp[q]:
                    return False
        for bound, image in self.pending.get(port, ()):
            if self.rank[image(cand)] < bound:
                return False
        return True

    def register(self, port: Port, rank: int) -> list[Port]:
        """Rule 4, before ``port`` (the first of an idle component) takes the
        candidate of ``rank``: each copy's port answering to it must not take
        a candidate whose swap comes before."""
        owner = port[0]
        if self.n_busy[self.comp[owner]]:
            return []
        ports = []
        for other, swap in self.images[owner]:
            if not self.n_busy[other]:
                y = (swap[owner], port[1], port[2])
                self.pending.setdefault(y, []).append((rank, partial(_swapped, swap)))
                ports.append(y)
        return ports

    def register_turns(self, port: Port, rank: int, moves: list[dict[tuple[int, int], int]]) -> list[Port]:
        """Rule 3 over a loop: for each deck action ``g`` of the owner fixing
        its used ports and moving ``port`` to ``y``, the candidate of ``y``
        moved back by ``g`` must not come before the candidate of ``rank``
        (``g`` moves candidates on the owner too, so this is a bound on their
        images, not on the candidates)."""
        ports = []
        for act in moves:
            y = (port[0], port[1], act[port[1:]])
            back = {(p, c2): c for (p, c), c2 in act.items()}
            self.pending.setdefault(y, []).append((rank, partial(_turned, port[0], back)))
            ports.append(y)
        return ports

    def unregister(self, ports: list[Port]) -> None:
        for y in ports:
            self.pending[y].pop()


def _swapped(swap: dict[int, int], port: Port) -> Port:
    """``port`` moved by a swap of pieces."""
    return (swap.get(port[0], port[0]), port[1], port[2])


def _turned(piece: int, act: dict[tuple[int, int], int], port: Port) -> Port:
    """``port`` moved by a deck action of ``piece``."""
    return (piece, port[1], act[port[1:]]) if port[0] == piece else port


def _component(m: _Matcher, start: int) -> tuple[list[int], tuple]:
    """The pieces of the component of ``start`` in the current matching,
    breadth-first from ``start`` (ports by special point and cycle), and its
    shape: pieces, vertices and matched ports in that order."""
    order, pos, pattern = [start], {start: 0}, []
    for q in order:
        for p in m.halves[q]:
            for c in range(len(m.glued.port_cycles[q][p])):
                other = m.glued.partner.get((q, p, c))
                if other is not None and other[0] not in pos:
                    pos[other[0]] = len(order)
                    order.append(other[0])
                pattern.append(None if other is None else (pos[other[0]], other[1], other[2]))
    key = (tuple(m.pieces[q] for q in order), tuple(m.vertex[q] for q in order), tuple(pattern))
    return order, key


#: Letters the orbit test (:mod:`covertree.gluing.orbits`) may compare for
#: one matching; past it, the rest of the choice is left to the codes.
ORBIT_TEST_BUDGET = 100_000


def _gluings(base: CurveGraph, specs: list, choice: list[LocalCover],
             marks: Sequence[tuple[int, int]], stats: GluingStats) -> Iterator[GluedCover]:
    m = _Matcher(base, specs, choice)
    candidates = _mark_candidates(base, specs, m, marks)
    edge_profiles = tuple(
        choice[base.nodes[k][0]].profiles[_half_index(specs, base.nodes[k][0], k, 0)]
        for k in range(base.n_nodes)
    )
    mult = prod(x for prof in edge_profiles for x in prof)
    seen: set[tuple] = set()
    budget: int | None = ORBIT_TEST_BUDGET
    for _partner in m.matchings():
        stats.matchings += 1
        if not m.connected():
            continue
        if budget is not None:
            lesser = m.orbit_test.has_lesser(m.glued.partner, budget)
            if lesser:
                stats.rejected += 1  # not the least word of its orbit: a repeat
                continue
            if lesser is None:
                stats.untested += 1
                budget = None  # the codes alone drop repeats for the rest of the choice
        stats.codes += 1
        code, aut = canonical_code(m.glued)
        if code in seen:
            stats.repeats += 1  # only after the test gave up (module docstring)
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
