"""Local structure of the cover space: branch counts against brute force,
stable-node orders against the chains of stabilisation."""

import itertools
from math import prod

from hypothesis import given, settings, strategies as st

from covertree.catalogue.covers import stratum_covers
from covertree.catalogue.local_structure import branch_count, local_structure, node_type
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import base_strata


def brute_branches(indices):
    """Branches of C[[t, s]]/(s_i^{e_i} - t) at 0, counted independently: over
    a fixed t != 0 the solutions (s_1..s_k) form a torsor under
    mu_{e_1} x ... x mu_{e_k} = Z/e_1 x ... x Z/e_k; the loop around t = 0 acts
    by the diagonal element (1, ..., 1) (each s_i = t^{1/e_i} turns by
    zeta_{e_i}), so the branches of the normalisation are the orbits of the
    cyclic group it generates."""
    seen, orbits = set(), 0
    for point in itertools.product(*(range(e) for e in indices)):
        if point in seen:
            continue
        orbits += 1
        x = point
        while x not in seen:
            seen.add(x)
            x = tuple((xi + 1) % e for xi, e in zip(x, indices))
    return orbits


@settings(max_examples=60, deadline=None)
@given(st.lists(st.integers(1, 6), min_size=1, max_size=4))
def test_branch_count_is_the_number_of_orbits(indices):
    assert branch_count(indices) == brute_branches(indices)


def brute_period(indices):
    """Length of the orbit of one solution under the loop around ``t = 0`` (see
    :func:`brute_branches`): the ramification of a branch over the ``t``-line."""
    start = x = tuple(0 for _ in indices)
    length = 0
    while True:
        x = tuple((xi + 1) % e for xi, e in zip(x, indices))
        length += 1
        if x == start:
            return length


def test_branch_count_examples():
    # common knowledge: x^2 = y^2 (e = 2, 2) has two branches; (2, 3) gives a cusp-like single branch
    assert brute_branches((2, 2)) == 2 and brute_branches((2, 3)) == 1 and brute_branches((4, 2, 2)) == 4


def test_node_types():
    # delta_i: separating node with genus i on the smaller side; loops and cycle edges are delta_0
    assert node_type([1, 2], [(0, 1)], 0) == "delta_1"
    assert node_type([0, 3], [(0, 0), (0, 1)], 1) == "delta_1"
    assert node_type([0, 3], [(0, 0), (0, 1)], 0) == "delta_0"
    assert node_type([1, 1, 1], [(0, 1), (1, 2)], 0) == "delta_1"
    assert node_type([0, 1], [(0, 1)] * 2, 0) == "delta_0"
    assert node_type([1], [(0, 0)], 0) == "delta_0"  # genus 1 + 1 = 2
    assert node_type([0], [(0, 0)], 0) is None  # genus 1: no Mbar_1

def _problems():
    return [(2, 0, 2), (3, 0, 2), (2, 1, 2), (3, 1, 2), (2, 1, 3)]


def test_structure_of_every_cover_matches_its_data():
    seen = 0
    for d, h, g in _problems():
        p = HurwitzProblem.build(d, h, genus=g)
        for base in base_strata(h, [tuple(m) for m in p.profiles], 2):
            for c in stratum_covers(base.graph, d, [tuple(m) for m in p.profiles]):
                s = local_structure(c)
                # per base node: the indices are the profile over it, multiplicity = prod e
                assert tuple(n.indices for n in s.nodes) == c.edge_profiles
                assert prod(prod(n.indices) for n in s.nodes) == c.multiplicity
                assert s.branches == prod(brute_branches(n.indices) for n in s.nodes)
                assert sorted(s.source_indices) == sorted(c.raw.source_edge_index)
                if base.codim != 1:
                    assert s.stable_nodes is None
                    continue
                seen += 1
                assert len(s.stable_nodes) == c.stable_source.n_nodes
                assert [n.ends for n in s.stable_nodes] == [tuple(e) for e in c.stable_source.nodes]
                big_l = brute_period(s.nodes[0].indices)
                assert s.nodes[0].lcm == big_l
                chains = sorted(n.chain for n in s.stable_nodes)
                assert chains == sorted(c.stabilised.chains)
                for n in s.stable_nodes:
                    assert n.order == sum(big_l // c.raw.source_edge_index[i] for i in n.chain)
                    if c.stable_source.codim == 1 and c.stable_source.genus >= 2:
                        assert n.type == c.stable_source_name
    assert seen


def test_rational_bridge_merges_two_orders():
    # 2|4 split, degree 2, genus 2: source g0 = g1 with two nodes of index 1 (a
    # rational bridge); L = 1, one branch; the stable loop is smoothed by s1*s2 = t^2.
    [c] = stratum_covers(parse_graph("g0{1,2}, g0{3,4,5,6} | 0-1"), 2, [(2,)] * 6)
    s = local_structure(c)
    assert [(n.order, n.type, len(n.chain)) for n in s.stable_nodes] == [(2, "delta_0", 2)]


def test_separating_node_of_index_two():
    # 3|3 split: two elliptic curves meeting at a point of index 2; L = 2, one
    # branch, order L/e = 1.
    [c] = stratum_covers(parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1"), 2, [(2,)] * 6)
    s = local_structure(c)
    assert (s.nodes[0].indices, s.nodes[0].lcm, s.branches) == ((2,), 2, 1)
    assert [(n.order, n.type) for n in s.stable_nodes] == [(1, "delta_1")]


def test_parallel_stable_loops_are_listed_by_order():
    # Degree-3 covers of an elliptic curve with two simple branch points, over
    # the divisor where the curve becomes a nodal rational curve carrying both
    # points (worked by hand): the three sheets over the node split as
    #   1 + 2: a rational source with two loops of indices 1 and 2 (L = 2,
    #          orders 2/1 = 2 and 2/2 = 1), or
    #   1 + 1 + 1: two rational curves meeting twice, one with a loop (L = 1):
    #          the first is a rational bridge, whose two nodes make one loop of
    #          order 1 + 1 = 2 beside the untouched loop of order 1,
    #   or 3: an elliptic source with one loop of order 3/3 = 1.
    # Parallel stable nodes (here two loops at the one stable vertex) are
    # listed by order, each at its position in the stable source.
    covers = stratum_covers(parse_graph("g0{1,2} | 0-0"), 3, [(2, 1), (2, 1)])
    seen = set()
    for c in covers:
        s = local_structure(c)
        index = c.raw.source_edge_index
        assert [n.edge for n in s.stable_nodes] == list(range(len(s.stable_nodes)))
        assert [n.ends for n in s.stable_nodes] == list(c.stable_source.nodes)
        assert all(n.type == "delta_0" for n in s.stable_nodes)
        rows = [(n.order, sorted(index[i] for i in n.chain)) for n in s.stable_nodes]
        seen.add(c.source.notation)
        if c.source.notation == "g0 | 0-0^2":
            assert rows == [(1, [2]), (2, [1])]
        elif c.source.notation == "g0, g0 | 0-1^2, 1-1":
            assert rows == [(1, [1]), (2, [1, 1])]
        else:
            assert (c.source.notation, rows) == ("g1 | 0-0", [(1, [3])])
    assert seen == {"g0 | 0-0^2", "g0, g0 | 0-1^2, 1-1", "g1 | 0-0"}


def test_orders_along_a_branch_need_a_codimension_one_base():
    # two nodes on the base (codimension two): the orders are vectors, not numbers
    import pytest

    from covertree.errors import ProblemError

    [c, *_] = stratum_covers(parse_graph("g0{1,2}, g0, g0{3,4,5,6} | 0-1, 1-2"), 2, [(2,)] * 6)
    s = local_structure(c)
    assert s.stable_nodes is None and len(s.nodes) == 2
    with pytest.raises(ProblemError, match="^orders along a branch are defined on codimension-one base strata only$"):
        s.order_of("delta_0")


def test_node_types_where_no_moduli_space_exists():
    # Mbar_{g,n} exists for 2g - 2 + n > 0 (Deligne-Mumford, Knudsen; common
    # knowledge): none for a nodal genus-1 curve without points or a rational
    # chain with two points; Mbar_{1,1} and Mbar_{0,4} have their divisors
    assert node_type([0], [(0, 0)], 0) is None
    assert node_type([0, 0], [(0, 1)], 0, [[1], [2]]) is None
    assert node_type([0], [(0, 0)], 0, [[1]]) == "delta_0"
    assert node_type([0, 0], [(0, 1)], 0, [[1, 2], [3, 4]]) == "delta_0_{1,2}"
    assert node_type([1, 0], [(0, 1)], 0) is None
    assert node_type([1, 1], [(0, 1)], 0) == "delta_1"


def test_separating_node_far_along_a_chain():
    # four elliptic curves in a chain: the third node splits genus 3 | 1, so it
    # is delta_1 (worked by hand: the side of the third curve reaches the first)
    genera, edges = [1, 1, 1, 1], [(0, 1), (1, 2), (2, 3)]
    assert [node_type(genera, edges, k) for k in range(3)] == ["delta_1", "delta_2", "delta_1"]
    assert node_type([1, 1, 1, 1], [(3, 2), (2, 1), (1, 0)], 0) == "delta_1"


def test_base_nodes_are_listed_by_edge():
    # codimension two: the chain g0{1,2} - g0 - g0{3,4,5,6}; degree 2, every base
    # node has preimages (the sheets over it), so each has its own lcm and branches
    covers = stratum_covers(parse_graph("g0{1,2}, g0, g0{3,4,5,6} | 0-1, 1-2"), 2, [(2,)] * 6)
    assert covers
    for c in covers:
        s = local_structure(c)
        assert [n.edge for n in s.nodes] == [0, 1]
        assert all(sum(n.indices) == 2 and n.lcm in (1, 2) for n in s.nodes)
        assert s.branches == prod(n.branches for n in s.nodes)
