"""Merged chains of stabilisation in every orientation.

A rational bridge whose two edges are themselves merged chains is the case where
the orientation of each chain matters: the chain of the new edge must still be a
walk, in order, from one end to the other.  Each graph below is tried with every
labelling of its rational vertices (which decides the order of contraction), every
order of its edges and every direction of each edge; the expected chains are
worked out by hand (the walks along the rational paths), and the check is a walk
through the input graph, independent of the contraction order.
"""

from __future__ import annotations

from itertools import permutations, product

import pytest

from covertree.stabilisation.stabilise import stabilise


def _variants(genera, edges, rational):
    """Every relabelling of the ``rational`` vertices, edge order and direction."""
    for perm in permutations(rational):
        relabel = dict(zip(rational, perm))
        moved = [(relabel.get(a, a), relabel.get(b, b)) for a, b in edges]
        g = list(genera)
        for old, new in relabel.items():
            g[new] = genera[old]
        for order in permutations(range(len(edges))):
            for flips in product((False, True), repeat=len(edges)):
                listed = [moved[i][::-1] if f else moved[i] for i, f in zip(order, flips)]
                yield g, listed, order


def _walk_ends(edges, chain, start):
    """Where walking ``chain`` (edge indices) from ``start`` ends, or None."""
    at = start
    for n in chain:
        a, b = edges[n]
        if at not in (a, b):
            return None
        at = b if a == at else a
    return at


def _check(genera, edges, result, expected):
    """Each stable edge's chain walks, in order, from its first end to its second
    through genus-0 vertices only, and the chains as sets are ``expected`` (sets
    of indices into ``edges``)."""
    survivors = sorted(v for v in range(len(genera)) if genera[v] > 0)
    assert list(result.genera) == [genera[v] for v in survivors]
    assert len(result.edges) == len(result.chains) == len(expected)
    for (a, b), chain in zip(result.edges, result.chains):
        assert _walk_ends(edges, chain, survivors[a]) == survivors[b], (edges, result)
        assert all(_walk_ends(edges, chain[:k], survivors[a]) not in survivors
                   for k in range(1, len(chain)))
    assert sorted(sorted(c) for c in result.chains) == sorted(sorted(c) for c in expected)


# (genera, edges, rational vertices, expected chains as sets of edge indices)
CASES = {
    # X(2) - 1 - 2 - 3 - Y(2): one edge X-Y through three rational bridges
    "path": ([2, 0, 0, 0, 2], [(0, 1), (1, 2), (2, 3), (3, 4)], [1, 2, 3], [{0, 1, 2, 3}]),
    # a loop at X(2) through three rational bridges
    "loop": ([2, 0, 0, 0], [(0, 1), (1, 2), (2, 3), (3, 0)], [1, 2, 3], [{0, 1, 2, 3}]),
    # two parallel chains X(1) = Y(1), of lengths 2 and 3
    "parallel": ([1, 0, 1, 0, 0], [(0, 1), (1, 2), (0, 3), (3, 4), (4, 2)], [1, 3, 4],
                 [{0, 1}, {2, 3, 4}]),
}


@pytest.mark.parametrize("name", CASES)
def test_merged_chains_in_every_orientation(name):
    genera, edges, rational, expected = CASES[name]
    seen = 0
    for g, listed, order in _variants(genera, edges, rational):
        # listed[j] is input edge order[j]: the expected sets in listed positions
        where = {old: j for j, old in enumerate(order)}
        _check(g, listed, stabilise(g, listed), [{where[i] for i in c} for c in expected])
        seen += 1
    assert seen == 6 * 120 * 32 if name == "parallel" else seen == 6 * 24 * 16


def test_chain_merged_on_both_sides_by_hand():
    # X(2) - 1 - 3 - 2 - Y(2), edges e0 = 0-1, e1 = 1-3, e2 = 3-2, e3 = 2-4.
    # Vertex 1 goes first and merges e0, e1 into 0 -> 3 with chain (e0, e1); vertex 2
    # merges e2, e3 into 3 -> 4 with chain (e2, e3); vertex 3 then joins two merged
    # chains: 0 -> 4 with chain (e0, e1, e2, e3).
    s = stabilise([2, 0, 0, 0, 2], [(0, 1), (1, 3), (3, 2), (2, 4)])
    assert (s.genera, s.edges, s.chains) == ((2, 2), ((0, 1),), ((0, 1, 2, 3),))
    # the same graph with the first merged chain stored the other way round
    s = stabilise([2, 0, 0, 0, 2], [(1, 3), (0, 1), (3, 2), (2, 4)])
    # vertex 1 now merges (1-3, 0-1) into 3 -> 0 with chain (e0, e1), stored from
    # 3; at vertex 3 that chain is the first edge touched and must be reversed
    assert (s.edges, s.chains) == (((0, 1),), ((1, 0, 2, 3),))
