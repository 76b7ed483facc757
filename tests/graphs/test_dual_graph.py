"""DualGraph and StableGraph: validation, normalisation, conversions."""

import json
import pickle

import pytest

from covertree.errors import GraphError
from covertree.graphs import DualGraph, StableGraph, stable_graphs


def test_constructor_normalises_to_canonical_form():
    a = DualGraph([0, 2, 0], [(2, 1), (0, 1)], [[2], [], [1]])
    b = DualGraph([0, 0, 2], [(0, 2), (2, 1)], [[1], [2], []])
    assert a == b and hash(a) == hash(b)
    assert (a.genera, a.edges, a.legs) == (b.genera, b.edges, b.legs)
    assert all(i <= j for i, j in a.edges) and list(a.edges) == sorted(a.edges)


def test_basic_invariants():
    g = StableGraph([0, 1], [(0, 1), (0, 1), (0, 0)], [[1], []])
    assert (g.n_vertices, g.n_edges, g.n_legs, g.codim) == (2, 3, 1, 3)
    assert g.genus == 0 + 1 + 3 - 2 + 1
    v0 = g.genera.index(0)
    assert g.valence(v0) == 1 + 2 + 2
    assert g.automorphisms == 2 * 2  # swap the parallel edges, flip the loop


@pytest.mark.parametrize(
    "args, fragment",
    [
        (([], []), "at least one vertex"),
        (([0, 0], []), "disconnected"),
        (([-1], []), "genus"),
        (([0], [(0, 1)]), "does not join"),
        (([0, 0], [(0, 1)], [[1], [1]]), "twice"),
        (([0], [], [[0]]), "positive"),
        (([0], [], [[1], [2]]), "one entry per vertex"),
    ],
)
def test_invalid_graphs(args, fragment):
    with pytest.raises(GraphError, match=fragment):
        DualGraph(*args)


def test_stable_graph_names_the_unstable_vertex():
    with pytest.raises(GraphError, match="vertex 1 .genus 0, valence 2."):
        StableGraph([1, 0], [(0, 1)], [[], [1]])
    assert not DualGraph([1, 0], [(0, 1)], [[], [1]]).is_stable()


def test_immutable():
    g = StableGraph([2], [])
    with pytest.raises(AttributeError):
        g.genera = (3,)


def test_dict_round_trip_through_json():
    for g in stable_graphs(2, 1):
        data = json.loads(json.dumps(g.to_dict()))
        assert set(data) == {"vertices", "edges", "automorphisms", "codim", "notation"}
        assert data["automorphisms"] == g.automorphisms and data["codim"] == g.codim
        assert StableGraph.from_dict(data) == g


def test_from_dict_rejects_malformed_input():
    with pytest.raises(GraphError):
        DualGraph.from_dict({"edges": []})


def test_relabel_legs_and_pickle():
    g = StableGraph([0, 0], [(0, 1)], [[1, 2], [3, 4]])
    h = g.relabel_legs({1: 3, 3: 1})
    assert h != g and isinstance(h, StableGraph)
    assert h.relabel_legs({1: 3, 3: 1}) == g
    assert pickle.loads(pickle.dumps(g)) == g


def test_order_and_hash_distinguish_leg_labels():
    strata = stable_graphs(0, 5, max_codim=1)
    assert len({g.key for g in strata}) == len(strata) == 11
    assert sorted(reversed(strata)) == strata
