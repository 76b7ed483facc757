"""Dual graphs of nodal curves and stable graphs (boundary strata).

Conventions (THEORY section 2): vertices are 0-based, legs are labelled by
positive integers (``1..n`` for a stratum of ``Mbar_{g,n}``), loops and
parallel edges are allowed.  The arithmetic genus is ``sum g_v + E - V + 1``;
a vertex is stable when ``2 g_v - 2 + n_v > 0``, ``n_v`` its valence (legs plus
half-edges, a loop counting twice).  Automorphisms are counted on half-edges:
loop flips and permutations of parallel edges count.

A :class:`DualGraph` is normalised to canonical form by its constructor, so
``==`` and ``hash`` compare isomorphism classes (fixing every leg label) and
the stored vertex and edge order is canonical.

References
----------
E. Arbarello, M. Cornalba, P. Griffiths, *Geometry of Algebraic Curves II*
(2011), chapter X, section 2 (stable graphs and their automorphisms).

Examples
--------
>>> g = DualGraph([0, 1], [(1, 0)], [[], [2, 1]])
>>> g.genera, g.legs, g.edges
((0, 1), ((), (1, 2)), ((0, 1),))
>>> g.genus, g.codim, g.is_stable()
(1, 1, False)
>>> StableGraph([1], [(0, 0)]).automorphisms
2
>>> StableGraph([0, 0], [(0, 1)], [[1, 2], [3, 4]]).notation
'g0{1,2}, g0{3,4} | 0-1'
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

from covertree.errors import GraphError
from covertree.graphs.canonical import _certify, _check_shape, edge_symmetry_factor

__all__ = ["DualGraph", "StableGraph"]


class DualGraph:
    """Connected dual graph of a nodal curve, up to isomorphism fixing legs.

    Parameters
    ----------
    genera : sequence of int
        Genus ``>= 0`` of each vertex (0-based).
    edges : sequence of (int, int)
        Edges as vertex pairs; ``(i, i)`` is a loop, repeated pairs are
        parallel edges.
    legs : sequence of sequences of int, optional
        Leg labels (positive integers, each used once) at each vertex;
        default no legs.

    Raises
    ------
    GraphError
        If the graph is empty or disconnected, a genus is negative, an edge
        endpoint is not a vertex or a leg label is repeated or not positive.

    Examples
    --------
    >>> a = DualGraph([0, 0, 0], [(0, 1), (1, 2)], [[1], [], [2]])
    >>> b = DualGraph([0, 0, 0], [(2, 1), (1, 0)], [[], [1], [2]])
    >>> a == b
    False
    >>> a == DualGraph([0, 0, 0], [(2, 1), (1, 0)], [[2], [], [1]])
    True
    >>> a.valence(2), a.n_vertices, a.n_legs
    (2, 3, 2)
    """

    __slots__ = ("_genera", "_edges", "_legs", "_key", "_aut_v")

    def __init__(
        self,
        genera: Sequence[int],
        edges: Sequence[tuple[int, int]],
        legs: Sequence[Sequence[int]] | None = None,
    ) -> None:
        genera, edges, legs = _validated(genera, edges, legs)
        self._check_extra(genera, edges, legs)
        key, order, aut_v = _certify(genera, edges, legs)
        self._set(*_relabelled(genera, edges, legs, order), key, aut_v)

    def _check_extra(self, genera: tuple, edges: tuple, legs: tuple) -> None:
        """Hook for subclasses: further conditions on the validated input."""

    def _set(self, genera, edges, legs, key, aut_v) -> None:
        for name, value in zip(DualGraph.__slots__, (genera, edges, legs, key, aut_v)):
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
    def genera(self) -> tuple[int, ...]:
        """Genus of each vertex, in canonical vertex order."""
        return self._genera

    @property
    def edges(self) -> tuple[tuple[int, int], ...]:
        """Edges ``(i, j)`` with ``i <= j`` in canonical order (``i == j``: loop)."""
        return self._edges

    @property
    def legs(self) -> tuple[tuple[int, ...], ...]:
        """Sorted leg labels at each vertex."""
        return self._legs

    @property
    def key(self) -> tuple[int, ...]:
        """Canonical certificate: a tuple of ints, equal iff isomorphic."""
        return self._key

    @property
    def n_vertices(self) -> int:
        return len(self._genera)

    @property
    def n_edges(self) -> int:
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
        >>> StableGraph([1], [], [[1]]).to_dict()
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
    def from_dict(cls, data: Mapping) -> "DualGraph":
        """Inverse of :meth:`to_dict` (extra keys are ignored).

        Examples
        --------
        >>> g = StableGraph([0, 0], [(0, 1)] * 2, [[1], [2]])
        >>> StableGraph.from_dict(g.to_dict()) == g
        True
        """
        try:
            genera = [v["genus"] for v in data["vertices"]]
            legs = [v.get("legs", []) for v in data["vertices"]]
            edges = [tuple(e) for e in data["edges"]]
        except (KeyError, TypeError, AttributeError) as error:
            raise GraphError(f"not a graph description: missing or malformed {error}") from None
        return cls(genera, edges, legs)

    def relabel_legs(self, mapping: Mapping[int, int]) -> "DualGraph":
        """The graph with leg ``j`` renamed ``mapping[j]`` (labels not in the
        mapping are kept).

        Examples
        --------
        >>> g = StableGraph([0, 0], [(0, 1)], [[1, 2], [3, 4]])
        >>> g.relabel_legs({2: 3, 3: 2}).notation
        'g0{1,3}, g0{2,4} | 0-1'
        """
        legs = [[mapping.get(j, j) for j in x] for x in self._legs]
        return type(self)(self._genera, self._edges, legs)

    # -- comparison ----------------------------------------------------------
    def __eq__(self, other) -> bool:
        if not isinstance(other, DualGraph):
            return NotImplemented
        return self._key == other._key

    def __lt__(self, other: "DualGraph") -> bool:
        return (self.codim, self._key) < (other.codim, other._key)

    def __hash__(self) -> int:
        return hash(self._key)

    def __str__(self) -> str:
        return self.notation

    def __repr__(self) -> str:
        return f"<{type(self).__name__} {self.notation}>"

    def __reduce__(self):
        return (type(self), (self._genera, self._edges, self._legs))


class StableGraph(DualGraph):
    """A stable graph: a :class:`DualGraph` all of whose vertices are stable.

    Raises
    ------
    GraphError
        Naming the first unstable vertex (input numbering).

    Examples
    --------
    >>> StableGraph([0, 2], [(0, 1)], [[1, 2], []]).genus
    2
    >>> StableGraph([0, 0], [(0, 1)], [[1], [2, 3]])
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


def _unstable_vertex(genera, edges, legs) -> int | None:
    valence = [len(x) for x in legs]
    for a, b in edges:
        valence[a] += 1
        valence[b] += 1
    for v, g in enumerate(genera):
        if 2 * g - 2 + valence[v] <= 0:
            return v
    return None


def _validated(genera, edges, legs) -> tuple[tuple, tuple, tuple]:
    genera = tuple(genera)
    if not genera:
        raise GraphError("a graph needs at least one vertex")
    for v, g in enumerate(genera):
        if not isinstance(g, int) or isinstance(g, bool) or g < 0:
            raise GraphError(f"vertex {v} has genus {g!r}; genera are integers >= 0")
    legs = tuple(tuple(x) for x in legs) if legs is not None else ((),) * len(genera)
    edges = tuple(tuple(e) for e in edges)
    _check_shape(genera, edges, legs)
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
    parent = list(range(n))

    def find(v: int) -> int:
        while parent[v] != v:
            v = parent[v]
        return v

    for a, b in edges:
        parent[find(a)] = find(b)
    roots = {find(v) for v in range(n)}
    if len(roots) > 1:
        raise GraphError(f"the graph is disconnected ({len(roots)} components)")


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
