"""Conversions to and from networkx, and networkx's isomorphism and
automorphism counts against covertree's canonical forms.

networkx (VF2, node and edge matching) is an independent implementation of
multigraph isomorphism: on every stratum listed here and on raw, non-canonical
inputs, it must agree with covertree's canonical forms (same key exactly when
isomorphic) and automorphism counts (half-edge automorphisms).
"""

import random
from itertools import combinations

import networkx as nx
import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.catalogue.covers import make_graph
from covertree.errors import GraphError
from covertree.graphs import CurveGraph, StableCurveGraph, parse_graph, stable_graphs
from covertree.hurwitz.problem import HurwitzProblem
from covertree.interop.nxgraphs import (
    CoverMap, cover_from_networkx, cover_to_networkx, graph_from_networkx, graph_to_networkx, half_edge_graph,
    networkx_automorphisms, networkx_isomorphic, stratum_from_networkx, stratum_to_networkx,
)
from covertree.strata.base import base_strata

TYPES = [(0, 7), (3, 0), (4, 0), (2, 2)]


def _wl_hash(graph) -> str:
    H = half_edge_graph(graph)
    nx.set_node_attributes(H, {u: repr(c) for u, c in H.nodes(data="colour")}, "label")
    return nx.weisfeiler_lehman_graph_hash(H, node_attr="label")


def _shuffled(genera, edges, legs, rng):
    """The same graph with vertices renumbered and edges reordered and flipped."""
    perm = list(range(len(genera)))
    rng.shuffle(perm)
    inv = {v: i for i, v in enumerate(perm)}
    new_edges = [(inv[a], inv[b]) if rng.random() < 0.5 else (inv[b], inv[a]) for a, b in edges]
    rng.shuffle(new_edges)
    return [genera[v] for v in perm], new_edges, [legs[v] for v in perm]


def _contractions(g):
    """Raw (non-canonical) data of every one-edge contraction of ``g``."""
    for k, (a, b) in enumerate(g.nodes):
        rest = [e for i, e in enumerate(g.nodes) if i != k]
        if a == b:
            genera = list(g.vertex_genera)
            genera[a] += 1
            yield genera, rest, [list(x) for x in g.vertex_legs]
            continue
        keep = [v for v in range(g.n_vertices) if v != b]
        pos = {v: i for i, v in enumerate(keep)}
        pos[b] = pos[a]
        genera = [g.vertex_genera[v] + (g.vertex_genera[b] if v == a else 0) for v in keep]
        legs = [list(g.vertex_legs[v]) + (list(g.vertex_legs[b]) if v == a else []) for v in keep]
        yield genera, [(pos[x], pos[y]) for x, y in rest], legs


def _assert_pairwise_distinct(graphs):
    """networkx finds no isomorphism between graphs covertree calls distinct
    (compared within classes of the Weisfeiler-Leman hash, itself invariant)."""
    buckets = {}
    for g in graphs:
        buckets.setdefault(_wl_hash(g), []).append(g)
    for bucket in buckets.values():
        for a, b in combinations(bucket, 2):
            assert a != b and not networkx_isomorphic(a, b), (a.notation, b.notation)


@pytest.mark.parametrize("genus,n", TYPES)
def test_networkx_counts_the_automorphisms_of_every_stratum(genus, n):
    for g in stable_graphs(genus, n):
        assert networkx_automorphisms(g) == g.automorphisms, g.notation
        assert networkx_automorphisms(g, "vertex-maps") == g.automorphisms, g.notation


@pytest.mark.parametrize("genus,n", TYPES)
def test_networkx_separates_every_pair_of_strata(genus, n):
    _assert_pairwise_distinct(stable_graphs(genus, n))


@pytest.mark.parametrize("genus,n", TYPES)
def test_canonical_forms_of_raw_inputs_agree_with_networkx(genus, n):
    # Raw inputs: every stratum renumbered at random and every one-edge
    # contraction (itself a stratum, given in a non-canonical order).  Each must
    # be networkx-isomorphic to its covertree canonical form, which is one of
    # the strata; with the pairwise test this is "same key iff isomorphic".
    rng = random.Random(genus * 100 + n)
    strata = set(stable_graphs(genus, n))
    for g in stable_graphs(genus, n):
        raws = [_shuffled(g.vertex_genera, g.nodes, g.vertex_legs, rng), *_contractions(g)]
        for genera, edges, legs in raws:
            canonical = StableCurveGraph._from_parts(genera, edges, legs)
            assert canonical in strata
            raw = graph_to_networkx_raw(genera, edges, legs)
            assert networkx_isomorphic(raw, canonical), (genera, edges, legs)
        assert StableCurveGraph._from_parts(*raws[0]) == g


def graph_to_networkx_raw(genera, edges, legs) -> nx.MultiGraph:
    G = nx.MultiGraph()
    for v, (genus, x) in enumerate(zip(genera, legs)):
        G.add_node(v, genus=genus, legs=tuple(x))
    G.add_edges_from(edges)
    return G


CATALOGUES = [
    # (degree, target genus, genus, codim)
    (2, 1, 3, 2),
    (3, 1, 2, 2),
    (2, 2, 4, 1),
    (3, 0, 3, 1),
]


def _catalogue(degree, target_genus, genus, codim):
    return build_catalogue(HurwitzProblem.build(degree, target_genus, genus=genus), max_codim=codim)


@pytest.mark.parametrize("problem", CATALOGUES)
def test_networkx_agrees_on_the_stable_sources_of_catalogues(problem):
    cat = _catalogue(*problem)
    seen = set()
    for s in cat.strata:
        for c in s.covers:
            stab = c.stabilised
            raw = graph_to_networkx_raw(stab.genera, stab.edges, [()] * len(stab.genera))
            assert networkx_isomorphic(raw, c.stable_source)
            assert make_graph(stab.genera, stab.edges) == c.stable_source
            seen.add(c.stable_source)
            seen.add(c.source)
    for g in seen:
        assert networkx_automorphisms(g) == g.automorphisms, g.notation
    _assert_pairwise_distinct(sorted(seen))


@pytest.mark.parametrize("genus,n", TYPES)
def test_graphs_round_trip(genus, n):
    for g in stable_graphs(genus, n):
        G = graph_to_networkx(g)
        assert G.graph["genus"] == g.genus == genus and G.graph["notation"] == g.notation
        assert sorted(leg for _, legs in G.nodes(data="legs") for leg in legs) == list(range(1, n + 1))
        back = graph_from_networkx(G)
        assert back == g and isinstance(back, StableCurveGraph)


def test_strata_round_trip_keep_the_orbit_size():
    for s in base_strata(0, [(2,)] * 6, max_codim=2):
        back = stratum_from_networkx(stratum_to_networkx(s))
        assert back == s


def test_unstable_dual_graphs_round_trip_as_dual_graphs():
    g = parse_graph("g0, g1 | 0-1")
    back = graph_from_networkx(graph_to_networkx(g))
    assert back == g and not isinstance(back, StableCurveGraph)
    with pytest.raises(GraphError, match="not stable"):
        stratum_from_networkx(graph_to_networkx(g))


@pytest.mark.parametrize("problem", CATALOGUES[:3])
def test_covers_round_trip_and_map_consistently(problem):
    cat = _catalogue(*problem)
    d = cat.problem.degree
    for s in cat.strata:
        base = s.base.graph
        for c in s.covers:
            G = cover_to_networkx(c, base)
            m = cover_from_networkx(G)
            assert m == CoverMap.of(c, base)
            assert m.source == c.source and m.weight == c.weight and m.degree == d
            source = G.subgraph(u for u, side in G.nodes(data="side") if side == "source")
            assert graph_from_networkx(nx.MultiGraph(source)) == c.source
            for _, v, e in source.edges(data=True):
                assert e["index"] >= 1


def test_a_cover_given_with_the_base_in_another_order_reads_back():
    base = parse_graph("g0{1,2}, g1 | 0-1")
    cover = next(c for s in _catalogue(2, 1, 2, 1).strata if s.base.graph == base for c in s.covers)
    G = cover_to_networkx(cover, base)
    H = nx.MultiGraph()
    H.graph.update(G.graph)
    nodes = list(G.nodes(data=True))
    H.add_nodes_from(reversed([(u, d) for u, d in nodes if d["side"] == "base"]))
    H.add_nodes_from((u, d) for u, d in nodes if d["side"] == "source")
    H.add_edges_from((b, a, k, e) for a, b, k, e in reversed(list(G.edges(keys=True, data=True))))
    assert cover_from_networkx(H) == CoverMap.of(cover, base)


def test_bad_cover_data_is_refused():
    base = parse_graph("g0{1,2}, g1 | 0-1")
    cover = next(c for s in _catalogue(2, 1, 2, 1).strata if s.base.graph == base for c in s.covers)
    G = cover_to_networkx(cover, base)
    G.nodes[("source", 0)]["degree"] += 1
    with pytest.raises(GraphError, match="degree over base"):
        cover_from_networkx(G)
    G.nodes[("source", 0)]["side"] = "top"
    with pytest.raises(GraphError, match="side 'top'"):
        cover_from_networkx(G)


def test_readers_name_what_is_missing():
    G = nx.MultiGraph()
    G.add_node("a")
    with pytest.raises(GraphError, match="'a' has no 'genus'"):
        graph_from_networkx(G)
    with pytest.raises(GraphError, match="MultiGraph"):
        graph_from_networkx(nx.Graph())
    with pytest.raises(GraphError, match="method 'x'"):
        networkx_automorphisms(CurveGraph([2]), "x")
