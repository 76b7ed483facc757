"""Disjoint sets against networkx's connected components (an independent union)."""

from __future__ import annotations

import networkx as nx
from hypothesis import given, settings
from hypothesis import strategies as st

from covertree.unionfind import DisjointSets


@settings(max_examples=80, deadline=None)
@given(st.integers(1, 12).flatmap(
    lambda n: st.tuples(st.just(n), st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=15))))
def test_classes_are_the_connected_components(case):
    n, pairs = case
    sets = DisjointSets(n)
    merged = [sets.union(a, b) for a, b in pairs]
    graph = nx.Graph()
    graph.add_nodes_from(range(n))
    # a union merges exactly when its ends were in different components before it
    for (a, b), did in zip(pairs, merged):
        assert did == (not nx.has_path(graph, a, b))
        graph.add_edge(a, b)
    components = list(nx.connected_components(graph))
    assert sets.count() == len(components)
    roots = sets.roots()
    for comp in components:
        # the representative is the least element of its class
        assert {roots[v] for v in comp} == {min(comp)}


def test_empty_and_singletons():
    assert DisjointSets(0).roots() == [] and DisjointSets(0).count() == 0
    sets = DisjointSets(3)
    assert sets.roots() == [0, 1, 2] and sets.count() == 3
    assert sets.union(2, 2) is False and sets.find(2) == 2
