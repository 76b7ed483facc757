"""Stabilisation of the dual graph of a nodal curve (no markings).

Rules (THEORY.md section 3), applied until none applies:

- a genus-0 vertex of valence 1 (a rational tail) is deleted with its edge;
- a genus-0 vertex of valence 2 without a loop (a rational bridge) is deleted
  and its two edges replaced by one, joining its two neighbours (a loop if they
  coincide).

When no moduli space of stable curves exists (genus 0 or 1) the same rules
stop at one genus-0 vertex, one genus-1 vertex, or one genus-0 vertex with a
loop; the result is never empty.

Each surviving edge remembers the chain of original edges it replaces, so
that the order to which it is smoothed along a branch (the sum of the orders
of the nodes of the chain) can be computed.

Examples
--------
A genus-1 curve with a rational bridge joining two of its points:

>>> s = stabilise([1, 0], [(0, 1), (0, 1)])
>>> s.genera, s.edges, s.chains
((1,), ((0, 0),), ((0, 1),))
>>> stabilise([0, 0, 0], [(0, 1), (1, 2)]).genera
(0,)
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass


@dataclass(frozen=True)
class Stabilised:
    """Result of :func:`stabilise`: vertex genera, edges between surviving
    vertices (renumbered ``0..``), and for each edge the indices of the input
    edges it replaces (a chain, in order along it)."""

    genera: tuple[int, ...]
    edges: tuple[tuple[int, int], ...]
    chains: tuple[tuple[int, ...], ...]


def stabilise(genera: Sequence[int], edges: Sequence[tuple[int, int]]) -> Stabilised:
    """Contract rational tails and bridges of a connected dual graph."""
    alive = set(range(len(genera)))
    live = {n: (a, b, (n,)) for n, (a, b) in enumerate(edges)}
    fresh = len(edges)
    while len(alive) > 1:
        v = _unstable(genera, alive, live)
        if v is None:
            break
        touching = [n for n, (a, b, _) in live.items() if v in (a, b)]
        if len(touching) == 1:
            del live[touching[0]]
        else:
            fresh = _bridge(v, touching, live, fresh)
        alive.discard(v)
    return _renumber(genera, alive, live)


def _unstable(genera: Sequence[int], alive: set[int], live: dict) -> int | None:
    """Least genus-0 vertex of valence 1, or of valence 2 without a loop."""
    valence = {v: 0 for v in alive}
    loops = set()
    for a, b, _ in live.values():
        valence[a] += 1
        valence[b] += 1
        if a == b:
            loops.add(a)
    for v in sorted(alive):
        if genera[v] == 0 and (valence[v] == 1 or (valence[v] == 2 and v not in loops)):
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


def _renumber(genera: Sequence[int], alive: set[int], live: dict) -> Stabilised:
    index = {v: i for i, v in enumerate(sorted(alive))}
    items = [live[n] for n in sorted(live)]
    return Stabilised(
        tuple(genera[v] for v in sorted(alive)),
        tuple((index[a], index[b]) for a, b, _ in items),
        tuple(chain for _, _, chain in items),
    )
