r"""Local structure of the space of admissible covers at one cover.

Over a base node ``q`` whose preimages have ramification indices
``e_1..e_k`` the space of admissible covers is locally
``C[[t, s_1..s_k]]/(s_i^{e_i} - t)`` times smooth factors (docs/theory.md, section 6;
Harris–Mumford 1982, section 4): ``t`` smooths ``q`` and ``s_i`` smooths the
``i``-th node above it.  With ``L_q = lcm(e_i)``:

- the normalisation has ``prod(e_i) / L_q`` smooth branches at ``q``, each of
  ramification ``L_q`` over the ``t``-line (over a fixed ``t != 0`` the
  ``prod e_i`` solutions ``(s_1..s_k)`` are permuted by the loop around
  ``t = 0`` as ``s_i -> zeta_{e_i} s_i``, a cycle of length ``L_q``; each
  cycle is a branch);
- along a branch with uniformiser ``u`` (``t = u^{L_q}``, ``s_i = c_i
  u^{L_q/e_i}``) the node with index ``e_i`` is smoothed to order ``L_q/e_i``.

For a cover the branches multiply: ``total branches = prod_q prod(e_{q,i}) /
L_q``.

On a **codimension-one** base stratum (one node ``q``) the germ of the base is
a curve germ, so every node of the stabilised source has an order along a
branch: the sum of ``L/e`` over the chain of source nodes that stabilisation
merged into it (a rational bridge replaces nodes ``s, s'`` by one smoothed by
``s s'``); the nodes of deleted rational tails disappear.  Each stable node has
a *type*: ``delta_0`` when it is non-separating (a loop, or removing it keeps
the graph connected), ``delta_i`` when it separates the stable source into
sides of genera ``i <= G - i``.  On base strata of higher codimension only the
per-node data and the total branch count are given (the base germ is then of
dimension ``> 1`` and an order along a branch is a vector, not a number).

Stable nodes are listed in the canonical edge order of ``cover.stable_source``
(:func:`covertree.graphs.canonical.canonical_form` maps the stabilisation's
edges to it), parallel stable nodes sorted by order, then by chain.

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers

Examples
--------
Genus-2 double covers of ``P^1`` over the divisor where the six branch points
split ``2|4``: the two nodes above (``e = 1, 1``) form a rational bridge that
stabilises to one non-separating node smoothed to order ``1 + 1 = 2``:

>>> from covertree.catalogue.covers import stratum_covers
>>> from covertree.graphs.notation import parse_graph
>>> [c] = stratum_covers(parse_graph("g0{1,2}, g0{3,4,5,6} | 0-1"), 2, [(2,)] * 6)
>>> s = local_structure(c)
>>> [(n.indices, n.lcm, n.branches) for n in s.nodes], s.branches
([((1, 1), 1, 1)], 1)
>>> [(n.order, n.type) for n in s.stable_nodes]
[(2, 'delta_0')]
>>> s.order_of("delta_0"), s.order_of("delta_1")
(2, 0)
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from math import lcm, prod
from typing import NamedTuple

from covertree.catalogue.covers import Cover, legs_per_vertex
from covertree.errors import IdentityError, ProblemError
from covertree.graphs.canonical import canonical_edge_order, canonical_form
from covertree.stabilisation.stabilise import smoothing_orders

__all__ = ["BaseNode", "StableNode", "LocalStructure", "local_structure", "node_type", "branch_count"]


def branch_count(indices: tuple[int, ...] | list[int]) -> int:
    """``prod(e) / lcm(e)``: branches of the normalisation of
    ``C[[t, s]]/(s_i^{e_i} - t)``.

    >>> branch_count((2, 2)), branch_count((3, 2)), branch_count(())
    (2, 1, 1)
    """
    return prod(indices) // lcm(*indices)  # both 1 for no index


@dataclass(frozen=True)
class BaseNode:
    """The local structure over one base node.

    Attributes
    ----------
    edge : int
        The base node (index into the base's ``edges``).
    indices : tuple of int
        Ramification indices ``e_1..e_k`` of the source nodes above it,
        non-increasing (the node's profile).
    lcm : int
        ``L = lcm(e_i)``.
    branches : int
        ``prod(e_i) / L``.
    """

    edge: int
    indices: tuple[int, ...]
    lcm: int
    branches: int


@dataclass(frozen=True)
class StableNode:
    """One node of the stable source (codimension-one base strata only).

    Attributes
    ----------
    edge : int
        Position in ``cover.stable_source.edges`` (canonical order).
    ends : (int, int)
        Its two vertices in the stable source's canonical numbering.
    order : int
        Order to which it is smoothed along a branch: ``sum L/e`` over the
        source nodes of its chain.
    type : str or None
        ``delta_0`` (non-separating) or ``delta_i`` (separating, genus
        ``i <= G/2`` on one side); ``None`` when the source genus is below 2.
    chain : tuple of int
        The source nodes it replaces (indices into ``cover.raw.source_edges``).
    """

    edge: int
    ends: tuple[int, int]
    order: int
    type: str | None
    chain: tuple[int, ...]


@dataclass(frozen=True)
class LocalStructure:
    """The local structure of the cover space at one cover.

    ``stable_nodes`` is ``None`` unless the base stratum has codimension one.
    ``source_indices`` gives the ramification index of each node of
    ``cover.source`` in its canonical edge order (parallel nodes sorted).
    """

    nodes: tuple[BaseNode, ...]
    branches: int
    stable_nodes: tuple[StableNode, ...] | None
    source_indices: tuple[int, ...] = ()

    def order_of(self, delta: str) -> int:
        """Order of the divisor ``delta`` of ``Mbar_G`` along one branch: the
        sum of the orders of the stable nodes of type ``delta`` (the divisor
        is locally the union of the hyperplanes ``tau_n = 0``, one per node
        ``n`` of that type, in the versal deformation space).

        Raises
        ------
        ProblemError
            On a base stratum of codimension other than one.
        """
        if self.stable_nodes is None:
            raise ProblemError("orders along a branch are defined on codimension-one base strata only")
        return sum(n.order for n in self.stable_nodes if n.type == delta)


def node_type(genera, edges, k: int, legs=None) -> str | None:
    """The divisor type of edge ``k`` of a connected graph: ``delta_0`` if
    non-separating; else, without legs, ``delta_i`` with ``i`` the smaller
    genus of the two sides, and with legs (``legs[v]`` the labels at ``v``,
    ``1..n`` in all) the name of the separating divisor of ``Mbar_{g,n}``
    (:func:`covertree.catalogue.covers.separating_name`); ``None`` when there
    is no such moduli space (genus below 2 without legs, or ``2g - 2 + n <= 0``).

    >>> node_type([1, 2], [(0, 1)], 0), node_type([0, 1], [(0, 0), (0, 1)], 1)
    ('delta_1', 'delta_1')
    >>> node_type([0, 0], [(0, 1)] * 3, 0)
    'delta_0'
    >>> node_type([1, 1], [(0, 1)], 0, [[], [1]]), node_type([2, 0], [(0, 1)], 0, [[3], [1, 2]])
    ('delta_1_{}', 'delta_0_{1,2}')
    """
    n = len(genera)
    total = sum(genera) + len(edges) - n + 1
    n_legs = sum(len(x) for x in legs) if legs is not None else 0
    if 2 * total - 2 + n_legs <= 0:  # no Mbar_{g,n}: g = 0 with n < 3, or g = 1 with n = 0
        return None
    a, b = edges[k]
    if a == b:
        return "delta_0"
    others = [e for i, e in enumerate(edges) if i != k]
    side = {a}
    frontier = [a]
    while frontier:
        v = frontier.pop()
        for x, y in others:
            for p, q in ((x, y), (y, x)):
                if p == v and q not in side:
                    side.add(q)
                    frontier.append(q)
    if b in side:
        return "delta_0"
    inner = sum(1 for x, y in others if x in side and y in side)
    genus = sum(genera[v] for v in side) + inner - len(side) + 1
    if not n_legs:
        return f"delta_{min(genus, total - genus)}"
    from covertree.catalogue.covers import separating_name

    return separating_name(total, n_legs, genus, [j for v in side for j in legs[v]])


def local_structure(cover: Cover) -> LocalStructure:
    """The local structure of the cover space at ``cover`` (module docstring)."""
    raw = cover.raw
    n_base = len(cover.edge_profiles)
    per_edge: list[list[int]] = [[] for _ in range(n_base)]
    for k, e in zip(raw.source_edge_over, raw.source_edge_index):
        per_edge[k].append(e)
    nodes = []
    for k, es in enumerate(per_edge):
        es = tuple(sorted(es, reverse=True))
        nodes.append(BaseNode(k, es, lcm(*es), branch_count(es)))
    branches = prod(n.branches for n in nodes)
    stable = _stable_nodes(cover, nodes[0].lcm) if n_base == 1 else None
    return LocalStructure(tuple(nodes), branches, stable, _source_indices(cover))


def _source_indices(cover: Cover) -> tuple[int, ...]:
    raw = cover.raw
    vertex_order, edge_order = _orders(cover.source_order, raw.source_genera, raw.source_edges,
                                       legs_per_vertex(len(raw.source_genera), raw.source_legs))
    position = {v: i for i, v in enumerate(vertex_order)}
    rows = sorted(
        (tuple(sorted((position[raw.source_edges[k][0]], position[raw.source_edges[k][1]]))),
         raw.source_edge_index[k])
        for k in edge_order
    )
    if tuple(r[0] for r in rows) != tuple(cover.source.nodes):  # pragma: no cover - a bug
        raise IdentityError(f"source nodes do not match the source {cover.source.notation}")
    return tuple(r[1] for r in rows)


def _stable_nodes(cover: Cover, big_l: int) -> tuple[StableNode, ...]:
    stab = cover.stabilised
    index = cover.raw.source_edge_index
    over = cover.raw.source_edge_over
    orders = [smoothing_orders(chain, over, index, (big_l,))[0] for chain in stab.chains]
    vertex_order, edge_order = _orders(cover.stable_order, stab.genera, stab.edges, stab.legs)
    position = {v: i for i, v in enumerate(vertex_order)}
    rows = []
    for raw_k in edge_order:
        a, b = stab.edges[raw_k]
        ends = (min(position[a], position[b]), max(position[a], position[b]))
        kind = node_type(stab.genera, stab.edges, raw_k, stab.legs)
        rows.append(_StableRow(ends, orders[raw_k], kind, stab.chains[raw_k]))
    # parallel nodes are interchangeable positions: sort them by order (then
    # chain, so that the listing is determined)
    rows.sort(key=lambda row: (row.ends, row.order, row.chain))
    found = tuple(row.ends for row in rows)
    if found != tuple(cover.stable_source.nodes):  # pragma: no cover - a bug
        raise IdentityError(f"stable nodes {list(found)} do not match the stable source {cover.stable_source.notation}")
    return tuple(StableNode(k, row.ends, row.order, row.type, row.chain) for k, row in enumerate(rows))


def _orders(known: tuple[int, ...], genera, edges, legs) -> tuple[Sequence[int], list[int]]:
    """Canonical vertex and edge orders of a graph, from the vertex order the
    cover kept when it built the graph (computed afresh when it has none)."""
    if known:
        return known, canonical_edge_order(known, edges)
    _key, vertex_order, edge_order = canonical_form(genera, edges, legs)
    return vertex_order, edge_order


class _StableRow(NamedTuple):
    """A stable node before its position among parallel nodes is known."""

    ends: tuple[int, int]
    order: int
    type: str | None
    chain: tuple[int, ...]
