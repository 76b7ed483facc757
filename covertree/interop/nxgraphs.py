"""Dual graphs, strata and covers as :mod:`networkx` multigraphs.

Attributes (a contract, like the JSON shapes: names are only ever added)
-------------------------------------------------------------------------
Dual graph (:func:`graph_to_networkx`), a :class:`networkx.MultiGraph`:

- nodes ``0..V-1`` in covertree's canonical order, each with ``genus`` (int)
  and ``legs`` (sorted tuple of leg labels; ``()`` without legs);
- one edge per node of the curve, loops ``(v, v)`` and parallel edges as
  separate keys ``0, 1, ...``; edges carry no attributes;
- graph attributes ``genus`` (arithmetic genus), ``notation`` (canonical one-line
  notation) and ``stable`` (bool).

Stratum (:func:`stratum_to_networkx`): the graph of the representative with
the graph attribute ``orbit_size`` added.

Cover (:func:`cover_to_networkx`): one multigraph holding the base and the
source side by side (a disjoint union) and the map between them:

- base nodes ``("base", v)`` with ``side="base"``, ``genus``, ``legs``; base edges
  keyed by their index ``k`` in the base's edge order;
- source nodes ``("source", i)`` with ``side="source"``, ``genus``, ``legs=()``
  (preimages of branch points are unlabelled), ``over`` (the base node below)
  and ``degree`` (the degree of the component over it);
- source edges keyed by their index, with ``over`` (the index ``k`` of the base
  edge below, i.e. the key of that base edge) and ``index`` (the ramification
  index of the node) and ``first`` (the end over the first end of base edge
  ``k``; networkx keeps no order of an undirected edge's ends and over a base
  loop both ends lie over one vertex, so it is read only there);
- graph attributes ``degree``, ``automorphisms``, ``multiplicity`` and
  ``weight`` (``"p/q"``).

Every reader accepts any node names: nodes are numbered in insertion order.
``nx.subgraph_view`` or a comprehension over ``side`` separates the two halves.

Automorphisms of multigraphs with loops
---------------------------------------
covertree counts automorphisms on half-edges: a loop can be flipped and
parallel edges permuted.  networkx's matchers map *vertices* (for a
multigraph they compare the numbers of parallel edges and of loops), so a
vertex map stands for many half-edge maps.  :func:`networkx_automorphisms`
counts in two independent ways:

``"half-edges"`` (default)
    Subdivide: each edge ``{a, b}`` becomes two half-edge nodes ``h, h'`` and
    the path ``a - h - h' - b`` (for a loop at ``v`` both ``h`` and ``h'`` hang
    from ``v``).  The result is a simple graph whose colour-preserving
    automorphisms (vertex colour: genus and legs; half-edge nodes one colour)
    are exactly the half-edge automorphisms, so networkx counts them directly:
    swapping ``h`` and ``h'`` of a loop is the flip, and the paths of parallel
    edges permute freely.
``"vertex-maps"``
    Count vertex maps of the multigraph with networkx and multiply by
    ``prod_{i<j} m_ij!`` (permutations of ``m_ij`` parallel edges) and by
    ``prod_v l_v! 2^{l_v}`` (permutations and flips of the ``l_v`` loops at
    ``v``): each vertex map lifts to exactly that many half-edge maps.

References
----------
A. Hagberg, D. Schult, P. Swart, *Exploring network structure, dynamics, and
function using NetworkX*, SciPy 2008; L. P. Cordella, P. Foggia, C. Sansone,
M. Vento, *A (sub)graph isomorphism algorithm for matching large graphs*, IEEE
TPAMI 26 (2004) (VF2, networkx's matcher; exponential in the worst case, fast
on stable graphs of the sizes covertree lists).

Examples
--------
>>> from covertree.graphs import parse_graph
>>> banana = parse_graph("g0, g0 | 0-1^3")
>>> G = graph_to_networkx(banana)
>>> G.number_of_edges(), dict(G.nodes[0]), G.graph["genus"]
(3, {'genus': 0, 'legs': ()}, 2)
>>> graph_from_networkx(G) == banana
True
>>> networkx_automorphisms(banana), networkx_automorphisms(banana, "vertex-maps"), banana.automorphisms
(12, 12, 12)
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Hashable, Sequence
from dataclasses import dataclass
from fractions import Fraction
from math import factorial, prod

import networkx as nx
from networkx.algorithms.isomorphism import GraphMatcher, MultiGraphMatcher

from covertree.catalogue.covers import Cover, make_graph
from covertree.errors import GraphError
from covertree.graphs.canonical import canonical_form
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.rational import rational_str
from covertree.strata.base import BaseStratum

__all__ = [
    "CoverMap",
    "cover_from_networkx",
    "cover_to_networkx",
    "graph_from_networkx",
    "graph_to_networkx",
    "half_edge_graph",
    "networkx_automorphisms",
    "networkx_isomorphic",
    "stratum_from_networkx",
    "stratum_to_networkx",
]


# ---------------------------------------------------------------------------
# Dual graphs and strata
# ---------------------------------------------------------------------------


def graph_to_networkx(graph: CurveGraph) -> nx.MultiGraph:
    """The multigraph of a dual graph (attributes in the module docstring).

    Examples
    --------
    >>> from covertree.graphs import StableCurveGraph
    >>> G = graph_to_networkx(StableCurveGraph([(0, [1, 2])], nodes=[(0, 0)]))
    >>> list(G.edges(keys=True)), G.graph["notation"]
    ([(0, 0, 0)], 'g0{1,2} | 0-0')
    """
    out = nx.MultiGraph(genus=graph.genus, notation=graph.notation, stable=graph.is_stable())
    for v, (genus, legs) in enumerate(zip(graph.vertex_genera, graph.vertex_legs)):
        out.add_node(v, genus=genus, legs=tuple(legs))
    for a, b in graph.nodes:
        out.add_edge(a, b)
    return out


def _numbered(G: nx.MultiGraph, nodes: Sequence[Hashable]) -> tuple[tuple, tuple, tuple]:
    """Genera, edges (between 0-based positions in ``nodes``) and legs."""
    index = {u: i for i, u in enumerate(nodes)}
    genera, legs = [], []
    for u in nodes:
        data = G.nodes[u]
        if "genus" not in data:
            raise GraphError(f"node {u!r} has no 'genus' attribute; every node needs one (an int >= 0)")
        genera.append(data["genus"])
        legs.append(tuple(data.get("legs", ())))
    edges = tuple((index[a], index[b]) for a, b in G.edges(nodes) if a in index and b in index)
    return tuple(genera), edges, tuple(legs)


def graph_from_networkx(G: nx.MultiGraph) -> CurveGraph:
    """The dual graph of a multigraph with ``genus`` (and optional ``legs``) on
    every node: a :class:`StableCurveGraph` when stable.

    Raises
    ------
    GraphError
        If a node has no ``genus``, the graph is empty or disconnected, or a
        genus or leg label is not allowed.

    Examples
    --------
    >>> import networkx as nx
    >>> G = nx.MultiGraph()
    >>> G.add_node("a", genus=1, legs=(2,)); G.add_node("b", genus=0, legs=(1, 3))
    >>> _ = G.add_edge("a", "b")
    >>> graph_from_networkx(G).notation
    'g0{1,3}, g1{2} | 0-1'
    """
    if not isinstance(G, nx.MultiGraph) or G.is_directed():
        raise GraphError(f"expected an undirected networkx MultiGraph, got {type(G).__name__}")
    genera, edges, legs = _numbered(G, list(G.nodes))
    graph = CurveGraph._from_parts(genera, edges, legs)
    return StableCurveGraph._from_parts(genera, edges, legs) if graph.is_stable() else graph


def stratum_to_networkx(stratum: BaseStratum) -> nx.MultiGraph:
    """The representative's multigraph with the graph attribute ``orbit_size``.

    Examples
    --------
    >>> from covertree.strata import base_strata
    >>> s = base_strata(0, [(2,)] * 4, max_codim=1)[1]
    >>> stratum_to_networkx(s).graph["orbit_size"]
    3
    """
    out = graph_to_networkx(stratum.graph)
    out.graph["orbit_size"] = stratum.orbit_size
    return out


def stratum_from_networkx(G: nx.MultiGraph) -> BaseStratum:
    """Inverse of :func:`stratum_to_networkx` (``orbit_size`` defaults to 1).

    Raises
    ------
    GraphError
        If the graph is not stable, or as :func:`graph_from_networkx`.
    """
    graph = graph_from_networkx(G)
    if not isinstance(graph, StableCurveGraph):
        raise GraphError(f"{graph.notation!r} is not stable, so it is not a stratum")
    size = G.graph.get("orbit_size", 1)
    if not isinstance(size, int) or size < 1:
        raise GraphError(f"orbit_size {size!r} is not allowed; it is a positive integer")
    return BaseStratum(graph, size)


# ---------------------------------------------------------------------------
# Covers
# ---------------------------------------------------------------------------


@dataclass(frozen=True)
class CoverMap:
    """A cover as a map of dual graphs: the base, the source (raw order) and,
    per source component and node, what lies below.

    Attributes
    ----------
    base : StableCurveGraph
    genera : tuple of int
        Genus of each source component.
    over, degrees : tuple of int
        Per component: the base vertex below and the degree over it.
    edges : tuple of (int, int)
        Source nodes; the first end lies over the first end of the base edge.
    edge_over, indices : tuple of int
        Per source node: the base edge below and the ramification index.
    automorphisms, multiplicity : int

    Raises
    ------
    GraphError
        If the data are not a map of graphs of one degree: a component or
        node over no base vertex or edge, a node whose ends do not lie over the
        ends of its base edge, degrees over a base vertex or indices over a
        base edge not adding up to the degree, a disconnected source.
    """

    base: StableCurveGraph
    genera: tuple[int, ...]
    over: tuple[int, ...]
    degrees: tuple[int, ...]
    edges: tuple[tuple[int, int], ...]
    edge_over: tuple[int, ...]
    indices: tuple[int, ...]
    automorphisms: int
    multiplicity: int

    def __post_init__(self) -> None:
        n, k = len(self.genera), len(self.edges)
        if len(self.over) != n or len(self.degrees) != n or len(self.edge_over) != k or len(self.indices) != k:
            raise GraphError("a cover map needs one base vertex and degree per component, one base edge and index per node")
        _check_map(self)
        self.source  # noqa: B018 - validates connectedness and genera

    @classmethod
    def of(cls, cover: Cover, base: StableCurveGraph) -> "CoverMap":
        """The map of a catalogue cover over (a fixed curve of) ``base``."""
        raw = cover.raw
        return cls(base, raw.source_genera, raw.source_vertex_over, raw.source_degrees, raw.source_edges,
                   raw.source_edge_over, raw.source_edge_index, cover.automorphisms, cover.multiplicity)

    @property
    def degree(self) -> int:
        """The degree of the cover (over base vertex 0)."""
        return sum(d for v, d in zip(self.over, self.degrees) if v == 0)

    @property
    def source(self) -> CurveGraph:
        """The source dual graph (canonical; a :class:`StableCurveGraph` when stable)."""
        return make_graph(self.genera, self.edges)

    @property
    def weight(self) -> Fraction:
        """``multiplicity / |Aut|``."""
        return Fraction(self.multiplicity, self.automorphisms)


def _check_map(m: CoverMap) -> None:
    base_edges = m.base.nodes
    for i, v in enumerate(m.over):
        if not 0 <= v < m.base.n_vertices:
            raise GraphError(f"source component {i} lies over {v!r}, not a vertex of the base")
    for n, ((a, b), k) in enumerate(zip(m.edges, m.edge_over)):
        if not 0 <= k < len(base_edges):
            raise GraphError(f"source node {n} lies over {k!r}, not an edge of the base")
        if (m.over[a], m.over[b]) != base_edges[k]:
            raise GraphError(f"source node {n} joins components over {m.over[a]}, {m.over[b]}, "
                             f"not over the ends {base_edges[k]} of base edge {k}")
    degree = sum(d for v, d in zip(m.over, m.degrees) if v == 0)
    above = Counter()
    for v, d in zip(m.over, m.degrees):
        above[("vertex", v)] += d
    for k, e in zip(m.edge_over, m.indices):
        above[("edge", k)] += e
    expected = [("vertex", v) for v in range(m.base.n_vertices)] + [("edge", k) for k in range(len(base_edges))]
    for place in expected:
        if above[place] != degree:
            raise GraphError(f"the degree over base {place[0]} {place[1]} is {above[place]}, not {degree}")


def cover_to_networkx(cover: Cover | CoverMap, base: StableCurveGraph | None = None) -> nx.MultiGraph:
    """The base and the source of a cover in one multigraph, the map as
    attributes (see the module docstring).

    Parameters
    ----------
    cover : Cover or CoverMap
        A catalogue cover (then ``base`` is its base stratum's graph) or a map.
    base : StableCurveGraph, optional
        Required with a :class:`~covertree.catalogue.covers.Cover`.

    Examples
    --------
    >>> from covertree.graphs import parse_graph
    >>> from covertree.catalogue.covers import stratum_covers
    >>> base = parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1")
    >>> [c] = stratum_covers(base, 2, [(2,)] * 6)
    >>> G = cover_to_networkx(c, base)
    >>> sorted(u for u in G if G.nodes[u]["side"] == "source")
    [('source', 0), ('source', 1)]
    >>> G.nodes[("source", 0)]["over"], G.nodes[("source", 0)]["degree"], G.graph["weight"]
    (('base', 0), 2, '1/2')
    >>> [(u, v, data["over"], data["index"]) for u, v, data in G.edges(data=True) if data.get("over") is not None]
    [(('source', 0), ('source', 1), 0, 2)]
    """
    m = cover if isinstance(cover, CoverMap) else CoverMap.of(cover, _required(base))
    out = nx.MultiGraph(degree=m.degree, automorphisms=m.automorphisms, multiplicity=m.multiplicity,
                        weight=rational_str(m.weight))
    for v, (genus, legs) in enumerate(zip(m.base.vertex_genera, m.base.vertex_legs)):
        out.add_node(("base", v), side="base", genus=genus, legs=tuple(legs))
    for k, (a, b) in enumerate(m.base.nodes):
        out.add_edge(("base", a), ("base", b), key=k)
    for i, (genus, v, d) in enumerate(zip(m.genera, m.over, m.degrees)):
        out.add_node(("source", i), side="source", genus=genus, legs=(), over=("base", v), degree=d)
    for n, ((a, b), k, e) in enumerate(zip(m.edges, m.edge_over, m.indices)):
        out.add_edge(("source", a), ("source", b), key=n, over=k, index=e, first=("source", a))
    return out


def _required(base: StableCurveGraph | None) -> StableCurveGraph:
    if base is None:
        raise GraphError("a Cover needs its base graph: cover_to_networkx(cover, base)")
    return base


def cover_from_networkx(G: nx.MultiGraph) -> CoverMap:
    """Inverse of :func:`cover_to_networkx`; the base may be given in any vertex
    and edge order (it is brought to canonical order, ``over`` translated).

    Raises
    ------
    GraphError
        If a node has no ``side``, a source node no ``over``/``degree``, a
        source edge no ``over``/``index``, or the data are not a cover map.

    Examples
    --------
    >>> from covertree.graphs import parse_graph
    >>> from covertree.catalogue.covers import stratum_covers
    >>> base = parse_graph("g0{1,2}, g1 | 0-1")
    >>> covers = list(stratum_covers(base, 2, [(2,), (2,)]))
    >>> all(cover_from_networkx(cover_to_networkx(c, base)) == CoverMap.of(c, base) for c in covers)
    True
    """
    sides = {u: G.nodes[u].get("side") for u in G}
    for u, side in sides.items():
        if side not in ("base", "source"):
            raise GraphError(f"node {u!r} has side {side!r}; allowed: 'base', 'source'")
    base, vertex_at, edge_at = _canonical_base(G, [u for u in G if sides[u] == "base"])
    source_nodes = [u for u in G if sides[u] == "source"]
    index = {u: i for i, u in enumerate(source_nodes)}
    try:
        data = [G.nodes[u] for u in source_nodes]
        over = tuple(vertex_at[d["over"]] for d in data)
        degrees, genera = tuple(d["degree"] for d in data), tuple(d["genus"] for d in data)
        rows = sorted((key, *_ends(a, b, e.get("first", a), index), edge_at[e["over"]], e["index"])
                      for a, b, key, e in G.edges(source_nodes, keys=True, data=True) if a in index and b in index)
    except KeyError as error:
        raise GraphError(f"a source node or edge lacks the attribute or names a missing base item: {error}") from None
    edges = tuple(_oriented(a, b, k, over, base.nodes) for _, a, b, k, _ in rows)
    return CoverMap(base, genera, over, degrees, edges, tuple(r[3] for r in rows), tuple(r[4] for r in rows),
                    G.graph.get("automorphisms", 1), G.graph.get("multiplicity", 1))


def _canonical_base(G: nx.MultiGraph, nodes: list) -> tuple[StableCurveGraph, dict, dict]:
    """The base in canonical form, with each base node's canonical position and
    each base edge key's canonical edge index."""
    base = stratum_from_networkx(G.subgraph(nodes)).graph
    genera, _, legs = _numbered(G, nodes)
    raw = [(a, b, key) for a, b, key in G.subgraph(nodes).edges(keys=True)]
    _, order, _ = canonical_form(genera, [(nodes.index(a), nodes.index(b)) for a, b, _ in raw], legs)
    position = {nodes[v]: i for i, v in enumerate(order)}
    pairs = sorted((tuple(sorted((position[a], position[b]))), key) for a, b, key in raw)
    return base, position, {key: k for k, (_, key) in enumerate(pairs)}


def _ends(a, b, first, index: dict) -> tuple[int, int]:
    """The positions of an edge's ends, the one named ``first`` first."""
    return (index[a], index[b]) if first == a else (index[b], index[a])


def _oriented(a: int, b: int, k: int, over: tuple, base_edges: tuple) -> tuple[int, int]:
    """Put the end over the first end of base edge ``k`` first (over a base loop
    both ends lie over one vertex and ``first`` has decided)."""
    if 0 <= k < len(base_edges) and (over[a], over[b]) != base_edges[k]:
        return b, a
    return a, b


# ---------------------------------------------------------------------------
# Isomorphisms and automorphisms counted by networkx
# ---------------------------------------------------------------------------


def _vertex_colour(data: dict) -> tuple:
    return ("vertex", data["genus"], tuple(sorted(data.get("legs", ()))))


def _same_vertex(a: dict, b: dict) -> bool:
    return _vertex_colour(a) == _vertex_colour(b)


def _same_multiplicity(a: dict, b: dict) -> bool:
    """Edge match of networkx's multigraph matcher: the dicts of the parallel
    edges between two nodes; equal numbers of them."""
    return len(a) == len(b)


def _as_networkx(graph: CurveGraph | nx.MultiGraph) -> nx.MultiGraph:
    return graph if isinstance(graph, nx.MultiGraph) else graph_to_networkx(graph)


def networkx_isomorphic(a: CurveGraph | nx.MultiGraph, b: CurveGraph | nx.MultiGraph) -> bool:
    """Whether networkx finds an isomorphism keeping genera, legs and the
    numbers of parallel edges and loops (VF2 with node and edge matching).

    Examples
    --------
    >>> from covertree.graphs import parse_graph
    >>> networkx_isomorphic(parse_graph("g0{1}, g1 | 0-1"), parse_graph("g1, g0{1} | 0-1"))
    True
    >>> networkx_isomorphic(parse_graph("g0{1,2} | 0-0"), parse_graph("g0{1,2}, g0 | 0-1, 1-1"))
    False
    """
    return nx.is_isomorphic(_as_networkx(a), _as_networkx(b), node_match=_same_vertex,
                            edge_match=_same_multiplicity)


def half_edge_graph(graph: CurveGraph | nx.MultiGraph) -> nx.Graph:
    """The simple graph with one node per vertex and per half-edge: each edge
    ``(a, b, key)`` becomes the path ``a - (a, b, key, 0) - (a, b, key, 1) - b``.
    Node attribute ``colour``: ``("vertex", genus, legs)`` or ``("half",)``.

    Examples
    --------
    >>> from covertree.graphs import StableCurveGraph
    >>> H = half_edge_graph(StableCurveGraph([1], nodes=[(0, 0)]))
    >>> sorted(H.degree(u) for u in H)
    [2, 2, 2]
    """
    G = _as_networkx(graph)
    out = nx.Graph()
    for u, data in G.nodes(data=True):
        out.add_node(("v", u), colour=_vertex_colour(data))
    for a, b, key in G.edges(keys=True):
        h, h2 = ("h", a, b, key, 0), ("h", a, b, key, 1)
        out.add_node(h, colour=("half",))
        out.add_node(h2, colour=("half",))
        out.add_edges_from([(("v", a), h), (h, h2), (h2, ("v", b))])
    return out


def networkx_automorphisms(graph: CurveGraph | nx.MultiGraph, method: str = "half-edges") -> int:
    """Order of the half-edge automorphism group (legs fixed), counted with
    networkx (both methods in the module docstring).

    Running time: networkx enumerates every automorphism (VF2), so the cost
    grows with ``|Aut|`` (a vertex with ``l`` loops alone gives ``l! 2^l``).

    Raises
    ------
    GraphError
        For a method other than ``"half-edges"`` and ``"vertex-maps"``.

    Examples
    --------
    >>> from covertree.graphs import StableCurveGraph
    >>> g = StableCurveGraph([0], nodes=[(0, 0), (0, 0)])
    >>> networkx_automorphisms(g), networkx_automorphisms(g, "vertex-maps")
    (8, 8)
    """
    G = _as_networkx(graph)
    if method == "half-edges":
        H = half_edge_graph(G)
        matcher = GraphMatcher(H, H, node_match=lambda x, y: x["colour"] == y["colour"])
        return sum(1 for _ in matcher.isomorphisms_iter())
    if method == "vertex-maps":
        matcher = MultiGraphMatcher(G, G, node_match=_same_vertex, edge_match=_same_multiplicity)
        maps = sum(1 for _ in matcher.isomorphisms_iter())
        return maps * _lifts(G)
    raise GraphError(f"method {method!r} is not allowed; allowed: 'half-edges', 'vertex-maps'")


def _lifts(G: nx.MultiGraph) -> int:
    """Half-edge maps above one vertex map: ``prod m_ij! * prod_v l_v! 2^l_v``."""
    multiplicity = Counter(frozenset((a, b)) for a, b in G.edges())
    return prod(factorial(m) * (2**m if len(pair) == 1 else 1) for pair, m in multiplicity.items())
