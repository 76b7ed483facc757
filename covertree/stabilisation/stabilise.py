"""Stabilisation of the dual graph of a nodal curve, with or without legs.

Rules (docs/theory.md, section 8), applied until none applies, legs counting towards
the valence:

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
    input edges it crossed when tails were contracted."""

    genera: tuple[int, ...]
    edges: tuple[tuple[int, int], ...]
    chains: tuple[tuple[int, ...], ...]
    legs: tuple[tuple[int, ...], ...] = ()
    leg_paths: tuple[tuple[int, ...], ...] = ()


def stabilise(genera: Sequence[int], edges: Sequence[tuple[int, int]],
              legs: Sequence[Sequence[int]] | None = None) -> Stabilised:
    """Contract rational tails (with at most one leg) and bridges of a
    connected dual graph; ``legs`` gives the leg labels at each vertex."""
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


def _tail(v: int, edge: tuple, at: dict, paths: dict) -> None:
    """Delete the tail ``v``; its leg (if any) moves across ``edge``."""
    a, b, chain = edge
    other = b if a == v else a
    for j in at[v]:
        paths[j] += chain if b == v else chain[::-1]
    at[other] += at[v]
    at[v] = []


def _unstable(genera: Sequence[int], alive: set[int], live: dict, at: dict) -> int | None:
    """Least genus-0 vertex with one edge and at most one leg, or with two
    edges, no loop and no leg."""
    valence = {v: 0 for v in alive}
    loops = set()
    for a, b, _ in live.values():
        valence[a] += 1
        valence[b] += 1
        if a == b:
            loops.add(a)
    for v in sorted(alive):
        if genera[v] or len(at[v]) + valence[v] > 2:
            continue
        if valence[v] == 1 or (valence[v] == 2 and v not in loops):
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
        tuple(paths[j] for j in sorted(paths)),
    )
