"""Dual graphs of nodal curves and stable graphs (boundary strata).

Conventions (docs/theory.md, section 2): vertices are 0-based, legs are labelled by
positive integers (``1..n`` for a stratum of ``Mbar_{g,n}``), loops and
parallel nodes are allowed.  The arithmetic genus is ``sum g_v + E - V + 1``;
a vertex is stable when ``2 g_v - 2 + n_v > 0``, ``n_v`` its valence (legs plus
half-edges, a loop counting twice).  Automorphisms are counted on half-edges:
loop flips and permutations of parallel nodes count.

A :class:`CurveGraph` is built from vertex records (genus and legs of each
component) and a list of nodes (pairs of vertices), or from the one-line
notation with :meth:`CurveGraph.parse`.  The constructor normalises to
canonical form, so ``==`` and ``hash`` compare isomorphism classes (fixing
every leg label) and the stored vertex and node order is canonical.

References
----------
E. Arbarello, M. Cornalba, P. Griffiths, *Geometry of Algebraic Curves II*
(2011), chapter X, section 2 (stable graphs and their automorphisms).

Examples
--------
>>> g = CurveGraph([Vertex(0), Vertex(1, (2, 1))], nodes=[(1, 0)])
>>> g.vertices
(Vertex(genus=0, legs=()), Vertex(genus=1, legs=(1, 2)))
>>> g.nodes, g.genus, g.codim, g.is_stable()
(((0, 1),), 1, 1, False)
>>> StableCurveGraph([(1, ())], nodes=[(0, 0)]).automorphisms
2
>>> StableCurveGraph.parse("g0{3,4}, g0{1,2} | 1-0").notation
'g0{1,2}, g0{3,4} | 0-1'
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from typing import NamedTuple

from covertree.errors import GraphError
from covertree.graphs.canonical import certify, check_shape, edge_symmetry_factor
from covertree.unionfind import DisjointSets

__all__ = ["CurveGraph", "StableCurveGraph", "Vertex", "graph_and_order"]


class Vertex(NamedTuple):
    """One component of a nodal curve: its genus and the legs (marked points) on it.

    Examples
    --------
    >>> Vertex(2), Vertex(0, (1, 2))
    (Vertex(genus=2, legs=()), Vertex(genus=0, legs=(1, 2)))
    """

    genus: int
    legs: tuple[int, ...] = ()


class CurveGraph:
    """Connected dual graph of a nodal curve, up to isomorphism fixing legs.

    Parameters
    ----------
    vertices : sequence of Vertex, (genus, legs) pairs or int
        One record per component (0-based in the order given): its genus
        ``>= 0`` and its leg labels (positive integers, each used once); a
        bare integer is a genus with no legs.
    nodes : sequence of (int, int), optional
        Nodes as pairs of vertices; ``(i, i)`` is a loop, repeated pairs are
        parallel nodes.  Default: none (a smooth curve).

    Raises
    ------
    GraphError
        If the graph is empty or disconnected, a record is malformed, a genus
        is negative, a node endpoint is not a vertex or a leg label is
        repeated or not positive.

    Examples
    --------
    >>> a = CurveGraph([(0, [1]), 0, (0, [2])], nodes=[(0, 1), (1, 2)])
    >>> b = CurveGraph([0, (0, [1]), (0, [2])], nodes=[(2, 1), (1, 0)])
    >>> a == b
    False
    >>> a == CurveGraph([(0, [2]), 0, (0, [1])], nodes=[(2, 1), (1, 0)])
    True
    >>> a.valence(2), a.n_vertices, a.n_legs, a.genus_at(1), a.legs_at(2)
    (2, 3, 2, 0, (2,))
    """

    __slots__ = ("_genera", "_edges", "_legs", "_key", "_aut_v")

    def __init__(self, vertices: Sequence, nodes: Sequence[tuple[int, int]] = ()) -> None:
        genera, legs = _records(vertices)
        self._build(genera, nodes, legs)

    @classmethod
    def _from_parts(cls, genera: Sequence[int], edges: Sequence[tuple[int, int]],
                    legs: Sequence[Sequence[int]] | None = None) -> "CurveGraph":
        """Internal constructor from plain tuples (genera, nodes, legs per vertex)."""
        graph = cls.__new__(cls)
        graph._build(genera, edges, legs)
        return graph

    @classmethod
    def parse(cls, text: str) -> "CurveGraph":
        """The graph written in covertree's one-line notation.

        See :mod:`covertree.graphs.notation`; a :class:`StableCurveGraph` is
        returned when the graph is stable (``StableCurveGraph.parse`` refuses
        unstable ones).

        Examples
        --------
        >>> CurveGraph.parse("g0{1} | 0-0"), CurveGraph.parse("g0 | 0-0")
        (<StableCurveGraph g0{1} | 0-0>, <CurveGraph g0 | 0-0>)
        """
        from covertree.graphs.notation import parse_graph

        graph = parse_graph(text)
        if not isinstance(graph, cls):
            return cls._from_parts(graph._genera, graph._edges, graph._legs)
        return graph

    def _build(self, genera, edges, legs) -> None:
        genera, edges, legs = _validated(genera, edges, legs)
        self._check_extra(genera, edges, legs)
        key, order, aut_v = certify(genera, edges, legs)
        self._set(*_relabelled(genera, edges, legs, order), key, aut_v)

    def _check_extra(self, genera: tuple, edges: tuple, legs: tuple) -> None:
        """Hook for subclasses: further conditions on the validated input."""

    def _set(self, genera, edges, legs, key, aut_v) -> None:
        for name, value in zip(CurveGraph.__slots__, (genera, edges, legs, key, aut_v)):
            object.__setattr__(self, name, value)

    @classmethod
    def _from_canonical(cls, genera, edges, legs, key, aut_v):
        """Trusted fast constructor from data already in canonical form."""
        graph = cls.__new__(cls)
        graph._set(genera, edges, legs, key, aut_v)
        return graph

    def __setattr__(self, name, value):
        raise AttributeError(f"{type(self).__name__} is immutable")

    # -- data ----------------------------------------------------------------
    @property
    def vertices(self) -> tuple[Vertex, ...]:
        """One :class:`Vertex` record per component, in canonical vertex order."""
        return tuple(Vertex(g, x) for g, x in zip(self._genera, self._legs))

    @property
    def nodes(self) -> tuple[tuple[int, int], ...]:
        """Nodes ``(i, j)`` with ``i <= j`` in canonical order (``i == j``: loop)."""
        return self._edges

    @property
    def vertex_genera(self) -> tuple[int, ...]:
        """Genus of each vertex, in canonical vertex order."""
        return self._genera

    @property
    def vertex_legs(self) -> tuple[tuple[int, ...], ...]:
        """Sorted leg labels at each vertex, in canonical vertex order."""
        return self._legs

    def genus_at(self, v: int) -> int:
        """Genus of vertex ``v``."""
        return self._genera[v]

    def legs_at(self, v: int) -> tuple[int, ...]:
        """Sorted leg labels at vertex ``v``."""
        return self._legs[v]

    @property
    def key(self) -> tuple[int, ...]:
        """Canonical certificate: a tuple of ints, equal iff isomorphic."""
        return self._key

    @property
    def n_vertices(self) -> int:
        return len(self._genera)

    @property
    def n_nodes(self) -> int:
        return len(self._edges)

    @property
    def n_legs(self) -> int:
        return sum(len(x) for x in self._legs)

    @property
    def codim(self) -> int:
        """Codimension of the stratum: the number of edges."""
        return len(self._edges)

    @property
    def genus(self) -> int:
        """Arithmetic genus ``sum g_v + E - V + 1``."""
        return sum(self._genera) + len(self._edges) - len(self._genera) + 1

    @property
    def automorphisms(self) -> int:
        """Order of the automorphism group on half-edges (legs fixed)."""
        return self._aut_v * edge_symmetry_factor(self._edges)

    @property
    def notation(self) -> str:
        """The canonical one-line notation (see :mod:`covertree.graphs.notation`)."""
        from covertree.graphs.notation import format_graph

        return format_graph(self)

    def valence(self, v: int) -> int:
        """Legs plus half-edges at vertex ``v`` (a loop counts twice)."""
        ends = sum((a == v) + (b == v) for a, b in self._edges)
        return len(self._legs[v]) + ends

    def is_stable(self) -> bool:
        """Whether every vertex satisfies ``2 g_v - 2 + n_v > 0``."""
        return _unstable_vertex(self._genera, self._edges, self._legs) is None

    # -- conversions ---------------------------------------------------------
    def to_dict(self) -> dict:
        """JSON-ready description (the contract of the JSON outputs).

        Examples
        --------
        >>> StableCurveGraph([(1, [1])]).to_dict()
        {'vertices': [{'genus': 1, 'legs': [1]}], 'edges': [], 'automorphisms': 1, 'codim': 0, 'notation': 'g1{1}'}
        """
        return {
            "vertices": [{"genus": g, "legs": list(x)} for g, x in zip(self._genera, self._legs)],
            "edges": [[a, b] for a, b in self._edges],
            "automorphisms": self.automorphisms,
            "codim": self.codim,
            "notation": self.notation,
        }

    @classmethod
    def from_dict(cls, data: Mapping) -> "CurveGraph":
        """Inverse of :meth:`to_dict` (extra keys are ignored).

        Examples
        --------
        >>> g = StableCurveGraph([(0, [1]), (0, [2])], nodes=[(0, 1)] * 2)
        >>> StableCurveGraph.from_dict(g.to_dict()) == g
        True
        """
        try:
            genera = [v["genus"] for v in data["vertices"]]
            legs = [v.get("legs", []) for v in data["vertices"]]
            edges = [tuple(e) for e in data["edges"]]
        except (KeyError, TypeError, AttributeError) as error:
            raise GraphError(f"not a graph description: missing or malformed {error}") from None
        return cls._from_parts(genera, edges, legs)

    def relabel_legs(self, mapping: Mapping[int, int]) -> "CurveGraph":
        """The graph with leg ``j`` renamed ``mapping[j]`` (labels not in the
        mapping are kept).

        Examples
        --------
        >>> g = StableCurveGraph([(0, [1, 2]), (0, [3, 4])], nodes=[(0, 1)])
        >>> g.relabel_legs({2: 3, 3: 2}).notation
        'g0{1,3}, g0{2,4} | 0-1'
        """
        legs = [[mapping.get(j, j) for j in x] for x in self._legs]
        return type(self)._from_parts(self._genera, self._edges, legs)

    # -- comparison ----------------------------------------------------------
    def __eq__(self, other) -> bool:
        if not isinstance(other, CurveGraph):
            return NotImplemented
        return self._key == other._key

    def __lt__(self, other: "CurveGraph") -> bool:
        return (self.codim, self._key) < (other.codim, other._key)

    def __hash__(self) -> int:
        return hash(self._key)

    def __str__(self) -> str:
        return self.notation

    def __repr__(self) -> str:
        return f"<{type(self).__name__} {self.notation}>"

    def __reduce__(self):
        return (type(self), (self.vertices, self._edges))


class StableCurveGraph(CurveGraph):
    """A stable graph: a :class:`CurveGraph` all of whose vertices are stable.

    Raises
    ------
    GraphError
        Naming the first unstable vertex (input numbering).

    Examples
    --------
    >>> StableCurveGraph([(0, [1, 2]), 2], nodes=[(0, 1)]).genus
    2
    >>> StableCurveGraph([(0, [1]), (0, [2, 3])], nodes=[(0, 1)])
    Traceback (most recent call last):
    ...
    covertree.errors.GraphError: vertex 0 (genus 0, valence 2) is unstable: 2g - 2 + valence must be positive
    """

    __slots__ = ()

    def _check_extra(self, genera: tuple, edges: tuple, legs: tuple) -> None:
        v = _unstable_vertex(genera, edges, legs)
        if v is not None:
            valence = len(legs[v]) + sum((a == v) + (b == v) for a, b in edges)
            raise GraphError(
                f"vertex {v} (genus {genera[v]}, valence {valence}) is unstable: "
                "2g - 2 + valence must be positive"
            )


def graph_and_order(genera: Sequence[int], edges: Sequence[tuple[int, int]],
                    legs: Sequence[Sequence[int]] | None = None) -> tuple[CurveGraph, tuple[int, ...]]:
    """A :class:`StableCurveGraph` when the graph is stable, else a
    :class:`CurveGraph`, with the canonical vertex order behind it (the input
    vertex at each canonical position, as in
    :func:`covertree.graphs.canonical.canonical_form`), from one canonical form.

    >>> graph, order = graph_and_order([1, 0], [(0, 1)], [[], [1, 2]])
    >>> graph.notation, order, type(graph).__name__
    ('g0{1,2}, g1 | 0-1', (1, 0), 'StableCurveGraph')
    """
    genera, edges, legs = _validated(genera, edges, legs)
    key, order, aut_v = certify(genera, edges, legs)
    kind = StableCurveGraph if _unstable_vertex(genera, edges, legs) is None else CurveGraph
    return kind._from_canonical(*_relabelled(genera, edges, legs, order), key, aut_v), tuple(order)


def _unstable_vertex(genera, edges, legs) -> int | None:
    valence = [len(x) for x in legs]
    for a, b in edges:
        valence[a] += 1
        valence[b] += 1
    for v, g in enumerate(genera):
        if 2 * g - 2 + valence[v] <= 0:
            return v
    return None


def _records(vertices: Sequence) -> tuple[list, list]:
    """Split vertex records (Vertex, (genus, legs) or bare genus) into genera and legs."""
    if isinstance(vertices, (str, bytes)):
        raise GraphError(f"vertices must be a sequence of (genus, legs) records, not {vertices!r}")
    genera, legs = [], []
    for v, record in enumerate(vertices):
        if isinstance(record, int) and not isinstance(record, bool):
            record = (record, ())
        try:
            genus, labels = record
            labels = tuple(labels)
        except (TypeError, ValueError):
            raise GraphError(f"vertex {v}: {record!r} is not a (genus, legs) record") from None
        genera.append(genus)
        legs.append(labels)
    return genera, legs


def _validated(genera, edges, legs) -> tuple[tuple, tuple, tuple]:
    genera = tuple(genera)
    if not genera:
        raise GraphError("a graph needs at least one vertex")
    for v, g in enumerate(genera):
        if not isinstance(g, int) or isinstance(g, bool) or g < 0:
            raise GraphError(f"vertex {v} has genus {g!r}; genera are integers >= 0")
    legs = tuple(tuple(x) for x in legs) if legs is not None else ((),) * len(genera)
    edges = tuple(tuple(e) for e in edges)
    check_shape(genera, edges, legs)
    _check_legs(legs)
    _check_connected(len(genera), edges)
    return genera, edges, legs


def _check_legs(legs: tuple) -> None:
    seen: set[int] = set()
    for v, labels in enumerate(legs):
        for j in labels:
            if not isinstance(j, int) or isinstance(j, bool) or j <= 0:
                raise GraphError(f"leg label {j!r} at vertex {v} is not a positive integer")
            if j in seen:
                raise GraphError(f"leg {j} appears twice")
            seen.add(j)


def _check_connected(n: int, edges: tuple) -> None:
    sets = DisjointSets(n)
    for a, b in edges:
        sets.union(a, b)
    if sets.count() > 1:
        raise GraphError(f"the graph is disconnected ({sets.count()} components)")


def _relabelled(genera, edges, legs, order) -> tuple[tuple, tuple, tuple]:
    inv = [0] * len(order)
    for pos, v in enumerate(order):
        inv[v] = pos
    new_edges = sorted((min(inv[a], inv[b]), max(inv[a], inv[b])) for a, b in edges)
    return (
        tuple(genera[v] for v in order),
        tuple(new_edges),
        tuple(tuple(sorted(legs[v])) for v in order),
    )

