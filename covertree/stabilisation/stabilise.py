"""Stabilisation of the dual graph of a nodal curve, with or without legs.

Rules (docs/theory.md, section 8; Deligne-Mumford, Knudsen: References),
applied until none applies, legs counting towards the valence:

- a genus-0 vertex with one edge and no leg (a rational tail) is deleted with
  its edge;
- a genus-0 vertex with one edge and one leg (a tail carrying a marked point)
  is deleted with its edge and its leg moves to the other end of the edge;
- a genus-0 vertex with two edges, no loop and no leg (a rational bridge) is
  deleted and its two edges replaced by one, joining its two neighbours (a
  loop if they coincide).

When no moduli space of stable curves exists (genus 0 or 1) the same rules
stop at one genus-0 vertex, one genus-1 vertex, or one genus-0 vertex with a
loop; the result is never empty.

Each surviving edge remembers the chain of original edges it replaces, so
that the order to which it is smoothed along a branch (the sum of the orders
of the nodes of the chain) can be computed.

A leg that moves remembers the edges it crossed (its *path*): the marked
point then sits at the node that replaced the contracted tree, and along a
branch of the cover space its psi class drops by the smoothing order of the
path (:mod:`covertree.locus.edges`).

References
----------
P. Deligne and D. Mumford, "The irreducibility of the space of curves of
given genus", Publications Mathematiques de l'IHES 36 (1969): stable curves
F. F. Knudsen, "The projectivity of the moduli space of stable curves II:
the stacks M_{g,n}", Mathematica Scandinavica 52 (1983): stabilisation with
marked points

Examples
--------
A genus-1 curve with a rational bridge joining two of its points:

>>> s = stabilise([1, 0], [(0, 1), (0, 1)])
>>> s.genera, s.edges, s.chains
((1,), ((0, 0),), ((0, 1),))
>>> stabilise([0, 0, 0], [(0, 1), (1, 2)]).genera
(0,)

With a leg on the bridge it stays; a leg on a tail moves:

>>> stabilise([1, 0], [(0, 1), (0, 1)], [[], [1]]).legs
((), (1,))
>>> s = stabilise([2, 0], [(0, 1)], [[], [1]])
>>> s.genera, s.legs, s.leg_paths
((2,), ((1,),), ((0,),))
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass


@dataclass(frozen=True)
class Stabilised:
    """Result of :func:`stabilise`: vertex genera, edges between surviving
    vertices (renumbered ``0..``), and for each edge the indices of the input
    edges it replaces (a chain, in order along it); ``legs`` the sorted leg
    labels at each vertex and ``leg_paths`` for each leg (in label order) the
    input edges it crossed when tails were contracted, sorted."""

    genera: tuple[int, ...]
    edges: tuple[tuple[int, int], ...]
    chains: tuple[tuple[int, ...], ...]
    legs: tuple[tuple[int, ...], ...] = ()
    leg_paths: tuple[tuple[int, ...], ...] = ()


def stabilise(genera: Sequence[int], edges: Sequence[tuple[int, int]],
              legs: Sequence[Sequence[int]] | None = None) -> Stabilised:
    """The stable model of a connected nodal curve given by its dual graph.

    Rational tails (genus-0 vertices of valence one, counting legs, or of one
    edge and one leg) and rational bridges (genus-0 vertices with two edges,
    no loop and no leg) are contracted until none is left, the least such
    vertex first (module docstring).  The result does not depend on that order
    up to isomorphism; the numbering of its vertices and the orientation of
    its chains do.

    Parameters
    ----------
    genera : sequence of int
        Genus of each vertex ``0..V-1``.
    edges : sequence of (int, int)
        The nodes, as pairs of vertices (a loop is ``(v, v)``); the position
        of an edge is its index in the chains and leg paths of the result.
    legs : sequence of sequence of int, optional
        The leg labels at each vertex (marked points); none when omitted.

    Returns
    -------
    Stabilised
        ``genera`` of the surviving vertices, renumbered ``0..`` in the order
        of their old numbers; ``edges`` between them, in the order the edges
        survived (untouched input edges first, by input index, then the edges
        made by contracting bridges, in the order they were made); for each
        edge its ``chain``: the input edges it replaces, listed along it from
        its first end to its second (so ``edges[k][0]`` is an end of input
        edge ``chains[k][0]``); ``legs`` at each vertex, sorted; and for each
        leg label, in increasing order, its ``leg_paths`` entry: the input
        edges it crossed on its way to the vertex where it landed, sorted
        (only the set matters: a psi class drops by the sum of their orders).

    Notes
    -----
    Convention: a contracted bridge ``v`` with input edges ``(a, v)`` and
    ``(v, b)`` becomes one edge ``(a, b)`` with chain ``chain(a-v) +
    chain(v-b)``, whichever way round the input edges were written; if
    ``a == b`` the new edge is a loop.  The smoothing order of a stable node
    along a branch of the space of admissible covers is the sum of the orders
    of the nodes of its chain (:mod:`covertree.catalogue.local_structure`).
    In genus 0 and 1 (no stable model) the contraction stops at one vertex of
    genus 0 or 1, or one genus-0 vertex with a loop.

    Examples
    --------
    A chain ``E - R - E`` of two elliptic curves through a rational bridge,
    the second edge written backwards: one separating node replacing both,
    its chain listed from vertex 0 (old 0) to vertex 1 (old 2):

    >>> s = stabilise([1, 0, 1], [(0, 1), (2, 1)])
    >>> s.genera, s.edges, s.chains
    ((1, 1), ((0, 1),), ((0, 1),))

    A genus-2 curve carrying a rational chain of two with leg 1 at its end:
    the middle vertex is a bridge (contracted first, being the least), then
    the end is a tail with one leg, which moves to the genus-2 vertex across
    both input edges; a tail with two legs stays.

    >>> s = stabilise([2, 0, 0], [(0, 1), (1, 2)], [[], [], [1]])
    >>> s.genera, s.edges, s.legs, s.leg_paths
    ((2,), (), ((1,),), ((0, 1),))
    >>> stabilise([2, 0], [(0, 1)], [[], [1, 2]]).genera
    (2, 0)
    """
    alive = set(range(len(genera)))
    live = {n: (a, b, (n,)) for n, (a, b) in enumerate(edges)}
    at = {v: list(x) for v, x in enumerate(legs)} if legs is not None else {v: [] for v in alive}
    paths: dict[int, tuple[int, ...]] = {j: () for x in at.values() for j in x}
    fresh = len(edges)
    while len(alive) > 1:
        v = _unstable(genera, alive, live, at)
        if v is None:
            break
        touching = [n for n, (a, b, _) in live.items() if v in (a, b)]
        if len(touching) == 1:
            _tail(v, live.pop(touching[0]), at, paths)
        else:
            fresh = _bridge(v, touching, live, fresh)
        alive.discard(v)
    return _renumber(genera, alive, live, at, paths)


def smoothing_orders(chain: Sequence[int], over: Sequence[int], index: Sequence[int],
                     lcms: Sequence[int]) -> tuple[int, ...]:
    """Orders to which a chain of source nodes is smoothed along a branch of
    the space of admissible covers, one per base node.

    Along a branch ``t_q = u^{L_q}`` a source node ``s`` of index ``e_s`` over
    the base node ``q`` is smoothed to order ``L_q / e_s``, and a stable node
    (or a leg's path) to the sum over its chain: for each base node ``q``,
    ``sum L_q / e_s`` over the nodes ``s`` of ``chain`` lying over ``q``.

    Parameters
    ----------
    chain : sequence of int
        Source nodes (a :attr:`Stabilised.chains` entry or a leg path).
    over, index : sequence of int
        For each source node, the base node below it and its ramification index.
    lcms : sequence of int
        ``L_q = lcm`` of the indices over each base node ``q``.

    Examples
    --------
    A bridge merging nodes of indices 3 and 2 over one base node (``L = 6``)
    is smoothed to order ``6/3 + 6/2 = 5``:

    >>> smoothing_orders((0, 1), [0, 0], [3, 2], [6])
    (5,)
    >>> smoothing_orders((0, 2), [0, 1, 1], [2, 1, 2], [2, 2])
    (1, 1)
    """
    orders = [0] * len(lcms)
    for s in chain:
        orders[over[s]] += lcms[over[s]] // index[s]
    return tuple(orders)


def _tail(v: int, edge: tuple, at: dict, paths: dict) -> None:
    """Delete the tail ``v``; its leg (if any) moves across ``edge``."""
    a, b, chain = edge
    other = b if a == v else a
    for j in at[v]:
        paths[j] += chain
    at[other] += at.pop(v)


def _unstable(genera: Sequence[int], alive: set[int], live: dict, at: dict) -> int | None:
    """Least genus-0 vertex with fewer than three special points (edge ends
    and legs).  With two vertices or more alive the graph is connected, so
    such a vertex has one edge and at most one leg (a tail), or two edges, no
    leg and no loop (a loop alone would make it the whole graph): a bridge."""
    valence = {v: 0 for v in alive}
    for a, b, _ in live.values():
        valence[a] += 1
        valence[b] += 1
    for v in sorted(alive):
        if not genera[v] and len(at[v]) + valence[v] < 3:
            return v
    return None


def _bridge(v: int, touching: list[int], live: dict, fresh: int) -> int:
    """Replace the two edges at ``v`` by one; return the next fresh edge id."""
    (a1, b1, c1), (a2, b2, c2) = live.pop(touching[0]), live.pop(touching[1])
    end1 = b1 if a1 == v else a1
    end2 = b2 if a2 == v else a2
    chain1 = c1 if b1 == v else c1[::-1]
    chain2 = c2 if a2 == v else c2[::-1]
    live[fresh] = (end1, end2, chain1 + chain2)
    return fresh + 1


def _renumber(genera: Sequence[int], alive: set[int], live: dict, at: dict, paths: dict) -> Stabilised:
    index = {v: i for i, v in enumerate(sorted(alive))}
    items = [live[n] for n in sorted(live)]
    return Stabilised(
        tuple(genera[v] for v in sorted(alive)),
        tuple((index[a], index[b]) for a, b, _ in items),
        tuple(chain for _, _, chain in items),
        tuple(tuple(sorted(at[v])) for v in sorted(alive)),
        tuple(tuple(sorted(paths[j])) for j in sorted(paths)),
    )
