"""CurveGraph and StableCurveGraph: validation, normalisation, conversions."""

import json
import pickle

import pytest

from covertree.errors import GraphError
from covertree.graphs import CurveGraph, StableCurveGraph, stable_graphs


def test_constructor_normalises_to_canonical_form():
    a = CurveGraph([(0, [2]), 2, (0, [1])], nodes=[(2, 1), (0, 1)])
    b = CurveGraph([(0, [1]), (0, [2]), 2], nodes=[(0, 2), (2, 1)])
    assert a == b and hash(a) == hash(b)
    assert (a.vertex_genera, a.nodes, a.vertex_legs) == (b.vertex_genera, b.nodes, b.vertex_legs)
    assert all(i <= j for i, j in a.nodes) and list(a.nodes) == sorted(a.nodes)


def test_basic_invariants():
    g = StableCurveGraph([(0, [1]), 1], nodes=[(0, 1), (0, 1), (0, 0)])
    assert (g.n_vertices, g.n_nodes, g.n_legs, g.codim) == (2, 3, 1, 3)
    assert g.genus == 0 + 1 + 3 - 2 + 1
    v0 = g.vertex_genera.index(0)
    assert g.valence(v0) == 1 + 2 + 2
    assert g.automorphisms == 2 * 2  # swap the parallel edges, flip the loop


@pytest.mark.parametrize(
    "args, fragment",
    [
        (([], []), "at least one vertex"),
        (([0, 0], []), "disconnected"),
        (([-1], []), "genus"),
        (([0], [(0, 1)]), "does not join"),
        (([(0, [1]), (0, [1])], [(0, 1)]), "twice"),
        (([(0, [0])], []), "positive"),
        (([(0, [1], 5)], []), "not a .genus, legs. record"),
        (("g0", []), "sequence of .genus, legs. records"),
        (([(0, 3)], []), "not a .genus, legs. record"),
    ],
)
def test_invalid_graphs(args, fragment):
    with pytest.raises(GraphError, match=fragment):
        CurveGraph(*args)


def test_stable_graph_names_the_unstable_vertex():
    with pytest.raises(GraphError, match="vertex 1 .genus 0, valence 2."):
        StableCurveGraph([1, (0, [1])], nodes=[(0, 1)])
    assert not CurveGraph([1, (0, [1])], nodes=[(0, 1)]).is_stable()


def test_immutable():
    g = StableCurveGraph([2])
    with pytest.raises(AttributeError):
        g.nodes = ()


def test_dict_round_trip_through_json():
    for g in stable_graphs(2, 1):
        data = json.loads(json.dumps(g.to_dict()))
        assert set(data) == {"vertices", "edges", "automorphisms", "codim", "notation"}
        assert data["automorphisms"] == g.automorphisms and data["codim"] == g.codim
        assert StableCurveGraph.from_dict(data) == g


def test_from_dict_rejects_malformed_input():
    with pytest.raises(GraphError):
        CurveGraph.from_dict({"edges": []})


def test_relabel_legs_and_pickle():
    g = StableCurveGraph([(0, [1, 2]), (0, [3, 4])], nodes=[(0, 1)])
    h = g.relabel_legs({1: 3, 3: 1})
    assert h != g and isinstance(h, StableCurveGraph)
    assert h.relabel_legs({1: 3, 3: 1}) == g
    assert pickle.loads(pickle.dumps(g)) == g


def test_order_and_hash_distinguish_leg_labels():
    strata = stable_graphs(0, 5, max_codim=1)
    assert len({g.key for g in strata}) == len(strata) == 11
    assert sorted(reversed(strata)) == strata


def test_stable_parse_refuses_an_unstable_graph_naming_its_vertex():
    # g0{1} ends one edge and carries one leg: valence 2, unstable in genus 0; g1 is stable
    with pytest.raises(GraphError) as info:
        StableCurveGraph.parse("g1, g0{1} | 0-1")
    assert "(genus 0, valence 2) is unstable" in str(info.value)
    assert CurveGraph.parse("g1, g0{1} | 0-1").n_legs == 1


def test_from_dict_legs_are_optional_and_errors_name_the_problem():
    assert StableCurveGraph.from_dict({"vertices": [{"genus": 1}, {"genus": 1}], "edges": [[0, 1]]}) == \
        StableCurveGraph([1, 1], nodes=[(0, 1)])
    with pytest.raises(GraphError, match="not a graph description: missing or malformed 'vertices'"):
        CurveGraph.from_dict({"edges": []})


def test_order_is_strict():
    strata = stable_graphs(1, 2)
    assert not any(g < g for g in strata)
    assert sum(1 for g in strata for h in strata if g < h) == len(strata) * (len(strata) - 1) // 2


@pytest.mark.parametrize(
    "args, message",
    [
        (([], []), "a graph needs at least one vertex"),
        (([(True, [])], []), "vertex 0 has genus True; genera are integers >= 0"),
        (([0, (1.5, [])], [(0, 1)]), "vertex 1 has genus 1.5; genera are integers >= 0"),
        (([(0, [True])], []), "leg label True at vertex 0 is not a positive integer"),
        (([(0, ["1"])], []), "leg label '1' at vertex 0 is not a positive integer"),
        (([0, 0, 0], [(0, 1)]), "the graph is disconnected (2 components)"),
    ],
)
def test_invalid_graph_messages_in_full(args, message):
    with pytest.raises(GraphError) as info:
        CurveGraph(*args)
    assert str(info.value) == message


def test_parts_without_legs():
    # the internal constructor with no legs: every vertex without legs
    g = CurveGraph._from_parts([1, 0], [(1, 0), (1, 1)])
    assert g == CurveGraph([1, 0], nodes=[(0, 1), (1, 1)]) and g.n_legs == 0 and g.genus == 2


def test_a_smooth_curve_of_genus_one_without_legs_is_unstable():
    # 2g - 2 + n = 0 for (g, n) = (1, 0): Mbar_{1,0} does not exist (common knowledge)
    assert not CurveGraph([1]).is_stable() and CurveGraph([1], nodes=[(0, 0)]).is_stable()
    with pytest.raises(GraphError, match=r"vertex 0 \(genus 1, valence 0\) is unstable"):
        StableCurveGraph([1])
