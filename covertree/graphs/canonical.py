"""Canonical forms and automorphism groups of dual graphs.

A graph is given on plain sequences: ``genera[v]`` for the 0-based vertices,
``edges`` a list of pairs ``(i, j)`` (``i == j`` is a loop, repeated pairs are
parallel edges) and ``legs[v]`` the leg labels at ``v``.  An isomorphism is a
bijection of vertices and of half-edges keeping genera, incidences and every
leg label.

The canonical form is computed by individualisation-refinement:

1. colour refinement (1-dimensional Weisfeiler-Leman) starting from the
   invariant ``(genus, legs, loops, valence)`` and refining by the multiset of
   ``(neighbour colour, edge multiplicity)``;
2. when the colouring is not discrete, the first non-singleton cell is
   individualised vertex by vertex (backtracking), and the least leaf
   certificate is the canonical one;
3. automorphisms found on the way (two leaves with equal certificates) prune
   the search by orbits, and the order of the vertex automorphism group is the
   product of the orbit sizes along the first path (orbit-stabiliser);
4. twins (non-adjacent vertices with the same invariant and the same
   neighbours with the same multiplicities, such as the leaves of a star) are
   swapped by an automorphism fixing every other vertex: each such
   transposition is a known automorphism from the start, so a twin of a
   vertex already explored is pruned at once and the twins count in the
   orbits.  The least leaf is still found (pruning only skips images of
   explored subtrees), so certificates are those of the plain search.

The search keeps its own stack (no recursion), so its depth, up to the
number of vertices, is not bounded by Python's recursion limit.

The half-edge automorphism group is an extension of the vertex group by the
permutations of parallel edges and the flips and permutations of loops, so
``|Aut| = |Aut_V| * prod m_ij! * prod_v (l_v! * 2^l_v)``.

References
----------
B. D. McKay, *Practical graph isomorphism*, Congressus Numerantium 30 (1981).
B. D. McKay and A. Piperno, *Practical graph isomorphism, II*, J. Symbolic
Comput. 60 (2014).

Examples
--------
>>> key1, order1, _ = canonical_form([0, 1], [(0, 1)], [[1], []])
>>> key2, order2, _ = canonical_form([1, 0], [(1, 0)], [[], [1]])
>>> key1 == key2, order1, order2
(True, [0, 1], [1, 0])
>>> count_automorphisms([0], [(0, 0), (0, 0)], [[]])  # two loops: 2! * 2^2
8
"""

from __future__ import annotations

from collections.abc import Sequence
from math import factorial

from covertree.errors import GraphError
from covertree.unionfind import DisjointSets

__all__ = [
    "canonical_form",
    "certify",
    "check_shape",
    "count_automorphisms",
    "edge_symmetry_factor",
    "vertex_automorphism_count",
]


def canonical_form(
    genera: Sequence[int],
    edges: Sequence[tuple[int, int]],
    legs: Sequence[Sequence[int]],
) -> tuple[tuple, list[int], list[int]]:
    """Canonical certificate and canonical orders of vertices and edges.

    Parameters
    ----------
    genera : sequence of int
        Genus of each vertex (0-based vertices).
    edges : sequence of (int, int)
        Edges as pairs of vertex indices; ``(i, i)`` is a loop.
    legs : sequence of sequences of int
        Leg labels at each vertex (one entry per vertex).

    Returns
    -------
    key : tuple of int
        Equal for two inputs if and only if the graphs are isomorphic; totally
        ordered.  Layout: ``(V, E, genera..., then per vertex the number of
        legs and the legs, then one code i*V + j per edge)`` in canonical order.
    vertex_order : list of int
        ``vertex_order[i]`` is the input vertex at canonical position ``i``.
    edge_order : list of int
        ``edge_order[k]`` is the input edge index at canonical position ``k``.

    Examples
    --------
    >>> canonical_form([0, 0, 0], [(2, 0), (0, 1)], [[3], [1], [2]])[1]
    [1, 2, 0]
    """
    check_shape(genera, edges, legs)
    key, order, _ = certify(tuple(genera), tuple(map(tuple, edges)), tuple(map(tuple, legs)))
    return key, order, canonical_edge_order(order, edges)


def canonical_edge_order(vertex_order: Sequence[int], edges: Sequence[tuple[int, int]]) -> list[int]:
    """The edge order of :func:`canonical_form` from its vertex order: input
    edge indices by canonical position (parallel edges in input order)."""
    inv = [0] * len(vertex_order)
    for pos, v in enumerate(vertex_order):
        inv[v] = pos
    n = len(vertex_order)
    codes = [_edge_code(inv[a], inv[b], n) for a, b in edges]
    return sorted(range(len(codes)), key=codes.__getitem__)


def count_automorphisms(
    genera: Sequence[int],
    edges: Sequence[tuple[int, int]],
    legs: Sequence[Sequence[int]],
) -> int:
    """Order of the automorphism group, counted on half-edges.

    Loops can be flipped and permuted, parallel edges permuted; legs are fixed.

    Examples
    --------
    >>> count_automorphisms([0, 0], [(0, 1)] * 3, [[], []])  # theta graph
    12
    >>> count_automorphisms([1, 1], [(0, 1)], [[1], []])
    1
    """
    check_shape(genera, edges, legs)
    edges = tuple(map(tuple, edges))
    aut_v = certify(tuple(genera), edges, tuple(map(tuple, legs)))[2]
    return aut_v * edge_symmetry_factor(edges)


def vertex_automorphism_count(
    genera: Sequence[int],
    edges: Sequence[tuple[int, int]],
    legs: Sequence[Sequence[int]],
) -> int:
    """Order of the group of vertex permutations preserving the multigraph.

    Examples
    --------
    >>> vertex_automorphism_count([0, 0], [(0, 1)] * 3, [[], []])
    2
    """
    check_shape(genera, edges, legs)
    return certify(tuple(genera), tuple(map(tuple, edges)), tuple(map(tuple, legs)))[2]


def edge_symmetry_factor(edges: Sequence[tuple[int, int]]) -> int:
    """``prod m_ij! * prod_v l_v! 2^l_v``: automorphisms fixing every vertex.

    Examples
    --------
    >>> edge_symmetry_factor([(0, 1), (1, 0), (1, 1)])
    4
    """
    counts: dict[tuple[int, int], int] = {}
    for a, b in edges:
        pair = (min(a, b), max(a, b))
        counts[pair] = counts.get(pair, 0) + 1
    out = 1
    for (a, b), m in counts.items():
        out *= factorial(m) * (2**m if a == b else 1)
    return out


def check_shape(genera: Sequence[int], edges: Sequence[Sequence[int]], legs: Sequence[Sequence[int]]) -> None:
    """Check that ``genera``, ``edges`` and ``legs`` describe a graph on the
    vertices ``0..V-1`` (``V = len(genera)``), as :func:`canonical_form` and
    :func:`certify` expect them.

    Genera and leg labels are not checked here (callers have their own rules).

    Raises
    ------
    GraphError
        If ``legs`` does not have one entry per vertex, or an edge is not a
        pair of vertex indices.

    Examples
    --------
    >>> check_shape([0, 1], [(0, 1)], [[1], []])
    >>> check_shape([0, 1], [(0, 2)], [[1], []])
    Traceback (most recent call last):
    ...
    covertree.errors.GraphError: edge (0, 2) does not join two of the vertices 0..1
    """
    n = len(genera)
    if len(legs) != n:
        raise GraphError(f"legs must have one entry per vertex ({n}), got {len(legs)}")
    for e in edges:
        if len(e) != 2 or not all(isinstance(x, int) and 0 <= x < n for x in e):
            raise GraphError(f"edge {tuple(e)!r} does not join two of the vertices 0..{n - 1}")


def _edge_code(a: int, b: int, n: int) -> int:
    return a * n + b if a <= b else b * n + a


# ---------------------------------------------------------------------------
# The search, on plain tuples (hot path of the enumeration).
# ---------------------------------------------------------------------------


def certify(genera: tuple, edges: tuple, legs: tuple) -> tuple[tuple, list[int], int]:
    """Canonical key, canonical vertex order and vertex automorphism count of
    a graph on plain tuples, its shape unchecked.

    The fast entry point for code that builds its graphs itself (the
    constructors of :class:`~covertree.graphs.curve_graph.CurveGraph`, the
    enumeration of strata, the types of the tallies): the input is taken as
    it is, so it must already pass :func:`check_shape`.  Unlike in
    :func:`canonical_form`, the legs may repeat: they are then a multiset of
    colours per vertex, and an isomorphism keeps the colours.

    Parameters
    ----------
    genera : tuple of int
        Genus (or any integer colour) of each vertex.
    edges : tuple of (int, int)
        Edges as pairs of vertex indices; ``(i, i)`` is a loop.
    legs : tuple of tuples of int
        Leg labels (or colours, repeats allowed) at each vertex.

    Returns
    -------
    key : tuple of int
        The certificate of :func:`canonical_form` (legs sorted per vertex):
        equal for two inputs if and only if they are isomorphic.
    vertex_order : list of int
        ``vertex_order[i]`` is the input vertex at canonical position ``i``.
    aut_v : int
        Order of the group of vertex permutations preserving genera, legs
        (colours) and edge multiplicities, as :func:`vertex_automorphism_count`.

    Examples
    --------
    >>> certify((0, 0), ((0, 1),), ((1,), (2,)))[1:]
    ([0, 1], 1)
    >>> certify((0, 0, 0), ((0, 1), (0, 2)), ((), (5,), (5,)))[2]  # two leaves of one colour
    2
    """
    n = len(genera)
    nbrs, loops, valence = _adjacency(n, edges)
    legs = [tuple(sorted(x)) for x in legs]
    start = [(genera[v], len(legs[v]), legs[v], loops[v], valence[v] + len(legs[v])) for v in range(n)]
    colours = _refine(_ranks(start), nbrs, n)
    if len(set(colours)) == n:
        order, aut_v = _inverse(colours), 1
    else:
        order, aut_v = _Search(n, nbrs, edges, _twins(start, nbrs, n)).run(colours)
    return _key(genera, edges, legs, order), order, aut_v


def _twins(start: list, nbrs: list, n: int) -> list[int]:
    """Twin class of each vertex (the least vertex of its class): vertices
    with equal invariants and equal neighbours (with multiplicities) that are
    not adjacent to each other; a vertex without twins is its own class."""
    classes: dict[tuple, int] = {}
    twin = list(range(n))
    for v in range(n):
        signature = (start[v], tuple(sorted(nbrs[v])))
        twin[v] = classes.setdefault(signature, v)
    return twin


def _adjacency(n: int, edges: tuple) -> tuple[list, list[int], list[int]]:
    """Neighbours ``(u, multiplicity)``, loop counts and half-edge counts."""
    loops = [0] * n
    ends = [0] * n
    mult: dict[tuple[int, int], int] = {}
    for a, b in edges:
        ends[a] += 1
        ends[b] += 1
        if a == b:
            loops[a] += 1
        else:
            pair = (a, b) if a < b else (b, a)
            mult[pair] = mult.get(pair, 0) + 1
    nbrs: list[list[tuple[int, int]]] = [[] for _ in range(n)]
    for (a, b), m in mult.items():
        nbrs[a].append((b, m))
        nbrs[b].append((a, m))
    return nbrs, loops, ends


def _ranks(signatures: list) -> list[int]:
    rank = {s: i for i, s in enumerate(sorted(set(signatures)))}
    return [rank[s] for s in signatures]


def _refine(colours: list[int], nbrs: list, n: int) -> list[int]:
    """Colour refinement to the coarsest equitable refinement (order kept)."""
    count = len(set(colours))
    while count < n:
        sigs = [
            (colours[v], tuple(sorted([(colours[u], m) for u, m in nbrs[v]])))
            for v in range(n)
        ]
        colours = _ranks(sigs)
        new_count = colours and max(colours) + 1
        if new_count == count:
            break
        count = new_count
    return colours


def _inverse(colours: list[int]) -> list[int]:
    order = [0] * len(colours)
    for v, c in enumerate(colours):
        order[c] = v
    return order


def _leaf_code(edges: tuple, colours: list[int], n: int) -> tuple:
    return tuple(sorted([_edge_code(colours[a], colours[b], n) for a, b in edges]))


def _key(genera: tuple, edges: tuple, legs: list, order: list[int]) -> tuple:
    n = len(order)
    inv = [0] * n
    for pos, v in enumerate(order):
        inv[v] = pos
    out = [n, len(edges)]
    out += [genera[v] for v in order]
    for v in order:
        out.append(len(legs[v]))
        out += legs[v]
    out += sorted([inv[a] * n + inv[b] if inv[a] <= inv[b] else inv[b] * n + inv[a] for a, b in edges])
    return tuple(out)


class _Search:
    """Individualisation-refinement with orbit pruning (McKay 1981)."""

    def __init__(self, n: int, nbrs: list, edges: tuple, twin: list[int]) -> None:
        self.n, self.nbrs, self.edges, self.twin = n, nbrs, edges, twin
        self.first = None  # (code, colours) of the first leaf
        self.best = None  # (code, colours) of the least leaf so far
        self.first_path: list[int] = []
        self.generators: list[tuple[int, ...]] = []

    def run(self, colours: list[int]) -> tuple[list[int], int]:
        self._visit(colours, [])
        return _inverse(self.best[1]), self._group_order()

    def _visit(self, colours: list[int], prefix: list[int]) -> int | None:
        """Explore below ``prefix`` (depth first, on an explicit stack of
        ``[colours, prefix, cell, next position, explored]`` frames); return
        a level to jump back to, or None."""
        frames = [[colours, prefix, _first_cell(colours), 0, []]]
        jump = None
        while frames:
            frame = frames[-1]
            if jump is not None and jump < len(frame[1]):
                frames.pop()  # jump further back
                continue
            jump = None
            w = self._next(frame)
            if w is None:
                frames.pop()
                continue
            child, below = self._individualise(frame[0], w), frame[1] + [w]
            if len(set(child)) == self.n:
                jump = self._leaf(child, below)
            else:
                frames.append([child, below, _first_cell(child), 0, []])
        return jump

    def _next(self, frame: list) -> int | None:
        """The next vertex of the frame's cell to individualise, skipping
        those in the orbit of one explored (twins first, cheaply)."""
        _, prefix, cell, position, explored = frame
        while position < len(cell):
            w = cell[position]
            position += 1
            if explored and self._same_orbit(w, explored, prefix):
                continue
            explored.append(w)
            frame[3] = position
            return w
        frame[3] = position
        return None

    def _individualise(self, colours: list[int], w: int) -> list[int]:
        c = colours[w]
        new = [x if x < c else x + 1 for x in colours]
        new[w] = c
        return _refine(new, self.nbrs, self.n)

    def _leaf(self, colours: list[int], prefix: list[int]) -> int | None:
        code = _leaf_code(self.edges, colours, self.n)
        if self.first is None:
            self.first = self.best = (code, colours)
            self.first_path = list(prefix)
            return None
        if code == self.first[0]:
            self._record(self.first[1], colours)
            return _common_prefix(prefix, self.first_path)
        if code == self.best[0]:
            self._record(self.best[1], colours)
        elif code < self.best[0]:
            self.best = (code, colours)
        return None

    def _record(self, old: list[int], new: list[int]) -> None:
        """Store the automorphism taking the leaf ``old`` to the leaf ``new``."""
        at = _inverse(new)
        self.generators.append(tuple(at[old[v]] for v in range(self.n)))

    def _orbits(self, fixed: list[int]) -> list[int]:
        sets = DisjointSets(self.n)
        pinned = set(fixed)
        free: dict[int, int] = {}  # twin class -> its first vertex off the fixed ones
        for v in range(self.n):  # twins off the fixed vertices swap
            if v not in pinned:
                sets.union(v, free.setdefault(self.twin[v], v))
        for g in self.generators:
            if all(g[p] == p for p in fixed):
                for v in range(self.n):
                    sets.union(v, g[v])
        return sets.roots()

    def _same_orbit(self, w: int, explored: list[int], prefix: list[int]) -> bool:
        if any(self.twin[x] == self.twin[w] for x in explored):
            return True
        if not self.generators:
            return False
        root = self._orbits(prefix)
        return any(root[w] == root[x] for x in explored)

    def _group_order(self) -> int:
        order = 1
        for k, v in enumerate(self.first_path):
            root = self._orbits(self.first_path[:k])
            order *= sum(1 for u in range(self.n) if root[u] == root[v])
        return order


def _first_cell(colours: list[int]) -> list[int]:
    sizes: dict[int, int] = {}
    for c in colours:
        sizes[c] = sizes.get(c, 0) + 1
    target = min(c for c, s in sizes.items() if s > 1)
    return [v for v, c in enumerate(colours) if c == target]


def _common_prefix(a: list[int], b: list[int]) -> int:
    k = 0
    while k < len(a) and k < len(b) and a[k] == b[k]:
        k += 1
    return k
