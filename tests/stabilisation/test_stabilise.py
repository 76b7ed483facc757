"""Stabilisation of source curves: unit cases, properties, and where the
sources of catalogues land in Mbar_G."""

from __future__ import annotations

from hypothesis import given, settings
from hypothesis import strategies as st

from covertree.catalogue.catalogue import build_catalogue
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.graphs.enumerate import stable_graphs
from covertree.hurwitz.problem import HurwitzProblem
from covertree.stabilisation.stabilise import stabilise
from tests.catalogue.test_oracle_agreement import tiny_stabilise


def _walks(edges, chain, start):
    """The vertices visited walking the chain's edges from ``start``, or None."""
    visited = [start]
    for n in chain:
        a, b = edges[n]
        if visited[-1] not in (a, b):
            return None
        visited.append(b if a == visited[-1] else a)
    return visited


def assert_chains_are_paths(genera, edges, result) -> None:
    """Each stable edge's chain is a walk, in order, through contracted genus-0
    vertices, from a vertex of the genus of the edge's first end to one of the
    genus of its second end; no input edge is in two chains."""
    used = [n for chain in result.chains for n in chain]
    assert len(used) == len(set(used))
    for (a, b), chain in zip(result.edges, result.chains):
        assert chain
        walks = [_walks(edges, chain, v) for v in edges[chain[0]]]
        assert any(
            w is not None and all(genera[v] == 0 for v in w[1:-1])
            and genera[w[0]] == result.genera[a] and genera[w[-1]] == result.genera[b]
            for w in walks
        ), (chain, edges)


def test_rational_tail_is_deleted():
    s = stabilise([2, 0], [(0, 1)])
    assert (s.genera, s.edges, s.chains) == ((2,), (), ())


def test_tree_of_rational_tails_is_deleted():
    # a genus-2 curve carrying a rational chain of two and a rational tail with a tail
    s = stabilise([0, 2, 0, 0, 0], [(1, 0), (0, 2), (1, 3), (3, 4)])
    assert (s.genera, s.edges, s.chains) == ((2,), (), ())


def test_bridge_between_two_elliptic_curves():
    s = stabilise([1, 0, 1], [(0, 1), (1, 2)])
    assert (s.genera, s.edges) == ((1, 1), ((0, 1),))
    assert s.chains == ((0, 1),)


def test_chain_of_bridges_recorded_in_order():
    # E0 - R1 - R2 - R3 - E4, edges numbered out of order along the chain and
    # given in both orientations
    genera = [1, 0, 0, 0, 1]
    edges = [(2, 3), (1, 0), (4, 3), (1, 2)]
    s = stabilise(genera, edges)
    assert s.genera == (1, 1) and len(s.edges) == 1 and sorted(s.edges[0]) == [0, 1]
    # from old vertex 0 to old vertex 4: old edges 1 = (1,0), 3 = (1,2), 0 = (2,3),
    # 2 = (4,3); the chain is listed from the stable edge's first end to its second
    along = (1, 3, 0, 2)
    assert s.chains == ((along if s.edges[0] == (0, 1) else along[::-1]),)
    assert_chains_are_paths(genera, edges, s)


def test_parallel_edges_through_a_bridge_become_a_loop():
    # a genus-1 curve meeting a rational curve in two points: the rational bridge
    # turns into a loop on the genus-1 vertex (this is delta_0 of Mbar_2)
    s = stabilise([1, 0], [(0, 1), (0, 1)])
    assert (s.genera, s.edges, s.chains) == ((1,), ((0, 0),), ((0, 1),))


def test_chain_closing_up_into_a_loop():
    s = stabilise([2, 0, 0], [(0, 1), (1, 2), (2, 0)])
    assert (s.genera, s.edges) == ((2,), ((0, 0),))
    assert sorted(s.chains[0]) == [0, 1, 2] and s.chains[0] in ((0, 1, 2), (2, 1, 0))
    assert_chains_are_paths([2, 0, 0], [(0, 1), (1, 2), (2, 0)], s)


def test_stable_graphs_are_left_alone():
    # the banana graph of genus 2, and a rational vertex with two loops
    s = stabilise([0, 0], [(0, 1), (0, 1), (0, 1)])
    assert (s.genera, s.edges, s.chains) == ((0, 0), ((0, 1),) * 3, ((0,), (1,), (2,)))
    s = stabilise([0], [(0, 0), (0, 0)])
    assert (s.genera, s.edges) == ((0,), ((0, 0),) * 2)


def test_rational_vertex_with_a_loop_is_not_a_bridge():
    # valence 2 from one loop: not contracted; the tail on it is
    s = stabilise([0, 0], [(0, 0), (0, 1)])
    assert (s.genera, s.edges, s.chains) == ((0,), ((0, 0),), ((0,),))


def test_genus_zero_sources_end_as_one_rational_vertex():
    assert stabilise([0], []).genera == (0,)
    for genera, edges in [([0, 0], [(0, 1)]), ([0, 0, 0, 0], [(0, 1), (0, 2), (0, 3)]),
                          ([0, 0, 0], [(1, 0), (2, 1)])]:
        s = stabilise(genera, edges)
        assert (s.genera, s.edges, s.chains) == ((0,), (), ())


def test_genus_one_sources():
    # an elliptic curve with rational tails: one genus-1 vertex
    s = stabilise([0, 1, 0], [(0, 1), (1, 2)])
    assert (s.genera, s.edges) == ((1,), ())
    # a cycle of three rational curves: one rational vertex with a loop (never empty)
    s = stabilise([0, 0, 0], [(0, 1), (1, 2), (2, 0)])
    assert (s.genera, s.edges) == ((0,), ((0, 0),))
    assert sorted(s.chains[0]) == [0, 1, 2]


@st.composite
def connected_graphs(draw):
    n = draw(st.integers(1, 6))
    genera = draw(st.lists(st.integers(0, 2), min_size=n, max_size=n))
    edges = [(draw(st.integers(0, v - 1)), v) for v in range(1, n)]  # a spanning tree
    edges += draw(st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=3))
    order = draw(st.permutations(range(len(edges))))
    return genera, [edges[i] for i in order]


@settings(max_examples=60, deadline=None)
@given(connected_graphs())
def test_stabilise_properties(graph):
    genera, edges = graph
    s = stabilise(genera, edges)
    before = CurveGraph._from_parts(genera, edges)
    after = CurveGraph._from_parts(s.genera, s.edges)
    assert after.genus == before.genus
    assert after == tiny_stabilise(genera, edges)
    if before.genus >= 2:
        assert after.is_stable()
    assert len(s.chains) == len(s.edges)
    assert_chains_are_paths(genera, edges, s)


# ----------------------------------------------------------------- catalogues in Mbar_G


def _stable_sources(d, h, g, given, max_codim):
    cat = build_catalogue(HurwitzProblem.build(d, h, genus=g, profiles=given), max_codim=max_codim)
    return cat.problem.genus, {c.stable_source for s in cat.strata for c in s.covers}


def test_stable_sources_are_strata_of_mbar_g():
    for args in [(2, 1, 2, (), 2), (3, 1, 2, (), 2), (2, 1, 3, (), 2), (2, 0, 3, (), 2),
                 (2, 2, None, ("1,1",), 2), (3, 2, None, ("1^3",), 1), (4, 0, None, ("4", "4", "2,2", "2,2"), 1)]:
        genus, sources = _stable_sources(*args)
        assert genus >= 2
        strata = set(stable_graphs(genus, 0))
        assert sources
        for g in sources:
            assert isinstance(g, StableCurveGraph), g.notation
            assert g.genus == genus and g.n_legs == 0
            assert g in strata, g.notation


def test_hyperelliptic_catalogue_reaches_all_of_mbar_2():
    # degree 2, six points on P^1, every stratum of Mbar_{0,6} (codim up to 3):
    # every genus-2 curve is hyperelliptic (common knowledge), so the closure of
    # the hyperelliptic locus is Mbar_2 and the stable sources are all 7 strata
    # of Mbar_2 (M. Chan, Combinatorics of the tropical Torelli map, 2012: 7 cells)
    genus, sources = _stable_sources(2, 0, 2, (), 3)
    assert genus == 2
    assert sources == set(stable_graphs(2, 0))
    assert len(sources) == 7


# ---------------------------------------------------------------- with legs

def test_legs_count_towards_valence():
    # a genus-0 vertex with a leg and two nodes is stable with its leg
    s = stabilise([0, 1], [(0, 1), (0, 1)], [[1], []])
    assert s.genera == (0, 1) and s.legs == ((1,), ())
    # without the leg it is a bridge
    assert stabilise([0, 1], [(0, 1), (0, 1)]).genera == (1,)


def test_a_tail_with_one_leg_moves_the_leg_and_records_its_path():
    # g2 - g0 - g0{1}: the far tail carries leg 1, then the middle vertex is a tail with the leg
    s = stabilise([2, 0, 0], [(0, 1), (1, 2)], [[], [], [1]])
    assert s.genera == (2,) and s.legs == ((1,),) and s.edges == ()
    assert sorted(s.leg_paths[0]) == [0, 1]


def test_a_tail_with_two_legs_stays():
    s = stabilise([2, 0], [(0, 1)], [[], [1, 2]])
    assert s.genera == (2, 0) and s.legs == ((), (1, 2)) and s.leg_paths == ((), ())


def test_unmarked_tail_next_to_a_marked_component():
    # g1 - g0{1} - g0: the unmarked tail goes, then g0{1} is a tail with a leg
    s = stabilise([1, 0, 0], [(0, 1), (1, 2)], [[], [1], []])
    assert s.genera == (1,) and s.legs == ((1,),) and s.leg_paths == ((0,),)


def test_a_tail_written_first_still_moves_its_leg():
    # the tail g0{1} is the first end of its edge: the leg lands on the genus-2 vertex
    s = stabilise([2, 0], [(1, 0)], [[], [1]])
    assert (s.genera, s.edges, s.legs, s.leg_paths) == ((2,), (), ((1,),), ((0,),))


def test_a_leg_crossing_two_tails_in_turn_remembers_both():
    # g0{1} - g0 - g2, numbered so that the marked end is contracted first
    # (vertex 0), then the middle vertex is a tail carrying the leg: the marked
    # point lands on the genus-2 vertex having crossed both nodes (worked by hand)
    s = stabilise([0, 0, 2], [(0, 1), (1, 2)], [[1], [], []])
    assert (s.genera, s.edges, s.legs, s.leg_paths) == ((2,), (), ((1,),), ((0, 1),))
    # the same curve with the edges written backwards and listed the other way round
    s = stabilise([0, 0, 2], [(2, 1), (1, 0)], [[1], [], []])
    assert (s.genera, s.legs, s.leg_paths) == ((2,), ((1,),), ((0, 1),))


def test_a_leg_behind_a_merged_chain_crosses_every_node_of_it():
    # g2 - g0 - g0 - g0 - g0{1}: the three middle vertices are bridges (contracted
    # first, being the least), the end is then a tail with one leg across the merged
    # chain of four nodes (worked by hand: the point lands on the genus-2 curve)
    genera = [0, 0, 0, 2, 0]
    edges = [(3, 0), (1, 0), (2, 1), (4, 2)]
    s = stabilise(genera, edges, [[], [], [], [], [1]])
    assert (s.genera, s.edges, s.legs) == ((2,), (), ((1,),))
    assert s.leg_paths == ((0, 1, 2, 3),)


def test_two_legs_on_one_tail_behind_a_bridge():
    # g1 - g0 - g0{1,2}: the bridge goes, the marked tail stays (three special points)
    s = stabilise([1, 0, 0], [(0, 1), (1, 2)], [[], [], [1, 2]])
    assert (s.genera, s.edges, s.chains, s.legs) == ((1, 0), ((0, 1),), ((0, 1),), ((), (1, 2)))
    assert s.leg_paths == ((), ())


def test_a_rational_vertex_with_a_loop_and_a_leg_is_stable():
    # Mbar_{1,1}: the nodal rational curve with its marked point stays as it is
    s = stabilise([0], [(0, 0)], [[1]])
    assert (s.genera, s.edges, s.legs, s.leg_paths) == ((0,), ((0, 0),), ((1,),), ((),))


# ------------------------------------------------------- smoothing orders along a branch

def test_smoothing_orders_of_a_bridge_with_indices_two_and_three():
    # Over a base node with local equation s_i^{e_i} = t (J. Harris and D. Mumford,
    # On the Kodaira dimension of the moduli space of curves, Invent. Math. 67
    # (1982), section 4) a branch is t = u^L with L = lcm(e_i) and s_i = u^{L/e_i};
    # a rational bridge merging nodes of indices 3 and 2 (L = 6) is smoothed by
    # s_1 s_2 = u^{2 + 3} (worked by hand)
    from covertree.stabilisation.stabilise import smoothing_orders

    assert smoothing_orders((0, 1), [0, 0], [3, 2], [6]) == (5,)
    assert smoothing_orders((1,), [0, 0], [3, 2], [6]) == (3,)
    assert smoothing_orders((), [0, 0], [3, 2], [6]) == (0,)


def test_smoothing_orders_split_by_base_node():
    # a chain through nodes over two base nodes q = 0 (indices 2, 1, L = 2) and
    # q = 1 (index 3, L = 3): order 2/1 over q = 0 from node 1, 3/3 over q = 1
    from covertree.stabilisation.stabilise import smoothing_orders

    over, index, lcms = [0, 0, 1], [2, 1, 3], [2, 3]
    assert smoothing_orders((1, 2), over, index, lcms) == (2, 1)
    assert smoothing_orders((0, 1, 2), over, index, lcms) == (3, 1)
    assert smoothing_orders((0,), over, index, lcms) == (1, 0)
