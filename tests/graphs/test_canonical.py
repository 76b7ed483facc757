"""Canonical forms and automorphism counts against brute force."""

from itertools import combinations_with_replacement, permutations
from math import factorial

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from covertree.graphs.canonical import (
    canonical_form,
    certify,
    check_shape,
    count_automorphisms,
    edge_symmetry_factor,
    vertex_automorphism_count,
)

# -- brute force -------------------------------------------------------------


def relabel(genera, edges, legs, perm):
    """The graph with vertex v renamed perm[v]."""
    n = len(genera)
    new_genera = [0] * n
    new_legs = [()] * n
    for v in range(n):
        new_genera[perm[v]] = genera[v]
        new_legs[perm[v]] = tuple(sorted(legs[v]))
    new_edges = tuple(sorted(tuple(sorted((perm[a], perm[b]))) for a, b in edges))
    return tuple(new_genera), new_edges, tuple(new_legs)


def brute_canonical(genera, edges, legs):
    """Least relabelling over all vertex permutations."""
    return min(relabel(genera, edges, legs, p) for p in permutations(range(len(genera))))


def count_edge_bijections(edges, image_of):
    """Number of bijections pi of the edge list with ends(pi(e)) = image_of(ends(e))."""
    targets = [tuple(sorted(image_of(e))) for e in edges]
    sources = [tuple(sorted(e)) for e in edges]

    def extend(i, used):
        if i == len(edges):
            return 1
        return sum(
            extend(i + 1, used | {j})
            for j in range(len(edges))
            if j not in used and sources[j] == targets[i]
        )

    return extend(0, frozenset())


def brute_automorphisms(genera, edges, legs):
    """Half-edge automorphisms: vertex permutations, edge bijections, loop flips."""
    n = len(genera)
    total = 0
    for p in permutations(range(n)):
        if any(genera[p[v]] != genera[v] or sorted(legs[p[v]]) != sorted(legs[v]) for v in range(n)):
            continue
        total += count_edge_bijections(edges, lambda e: (p[e[0]], p[e[1]]))
    loops = sum(1 for a, b in edges if a == b)
    return total * 2**loops


# -- random graphs -----------------------------------------------------------


@st.composite
def graphs(draw, max_vertices=6, max_extra=4, max_genus=1, max_legs=3):
    n = draw(st.integers(1, max_vertices))
    genera = draw(st.lists(st.integers(0, max_genus), min_size=n, max_size=n))
    edges = [(draw(st.integers(0, v - 1)), v) for v in range(1, n)]  # spanning tree
    extra = draw(st.integers(0, max_extra))
    edges += [(draw(st.integers(0, n - 1)), draw(st.integers(0, n - 1))) for _ in range(extra)]
    n_legs = draw(st.integers(0, max_legs))
    legs = [[] for _ in range(n)]
    for label in range(1, n_legs + 1):
        legs[draw(st.integers(0, n - 1))].append(label)
    return genera, edges, legs


def scrambled(draw, genera, edges, legs):
    perm = draw(st.permutations(range(len(genera))))
    new_edges = [(perm[a], perm[b]) if draw(st.booleans()) else (perm[b], perm[a]) for a, b in edges]
    new_edges = draw(st.permutations(new_edges)) if new_edges else []
    new_genera = [0] * len(genera)
    new_legs = [None] * len(genera)
    for v in range(len(genera)):
        new_genera[perm[v]] = genera[v]
        new_legs[perm[v]] = list(reversed(legs[v]))
    return new_genera, new_edges, new_legs


@settings(max_examples=150, deadline=None)
@given(graphs(), st.data())
def test_key_is_invariant_under_relabelling(graph, data):
    other = scrambled(data.draw, *graph)
    assert canonical_form(*graph)[0] == canonical_form(*other)[0]


@settings(max_examples=100, deadline=None)
@given(graphs())
def test_orders_describe_the_canonical_graph(graph):
    genera, edges, legs = graph
    key, vertex_order, edge_order = canonical_form(genera, edges, legs)
    assert sorted(vertex_order) == list(range(len(genera)))
    assert sorted(edge_order) == list(range(len(edges)))
    position = {v: i for i, v in enumerate(vertex_order)}
    canonical_edges = [tuple(sorted((position[a], position[b]))) for a, b in (edges[k] for k in edge_order)]
    assert canonical_edges == sorted(canonical_edges)
    # the same graph written in canonical order is already canonical
    again = canonical_form(
        [genera[v] for v in vertex_order], canonical_edges, [legs[v] for v in vertex_order]
    )
    assert again[0] == key
    assert again[1] == list(range(len(genera)))


@settings(max_examples=80, deadline=None)
@given(graphs(max_vertices=5, max_extra=3))
def test_automorphisms_against_brute_force(graph):
    assert count_automorphisms(*graph) == brute_automorphisms(*graph)


def _connected(n, edges):
    reached, frontier = {0}, [0]
    while frontier:
        v = frontier.pop()
        for a, b in edges:
            for x, y in ((a, b), (b, a)):
                if x == v and y not in reached:
                    reached.add(y)
                    frontier.append(y)
    return len(reached) == n


def _family(n, n_edges, genera, legs):
    pairs = [(a, b) for a in range(n) for b in range(a, n)]
    for edges in combinations_with_replacement(pairs, n_edges):
        if _connected(n, edges):
            yield genera, edges, legs


def _check_family(family):
    classes = {}
    for graph in family:
        classes.setdefault(canonical_form(*graph)[0], set()).add(brute_canonical(*graph))
    brute = set().union(*classes.values())
    # each key is one brute-force class, and distinct keys give distinct classes
    assert all(len(c) == 1 for c in classes.values())
    assert len(brute) == len(classes)
    return len(classes)


def test_keys_separate_alike_genus_zero_multigraphs():
    # all connected multigraphs (loops, parallel edges) on 5 genus-0 vertices
    # with 5 edges, and on 4 genus-0 vertices with 6 edges
    count = _check_family(_family(5, 5, [0] * 5, [[]] * 5))
    count += _check_family(_family(4, 6, [0] * 4, [[]] * 4))
    assert count > 50


def test_keys_separate_multigraphs_with_genera_and_legs():
    count = _check_family(_family(4, 4, [0, 0, 1, 0], [[1], [], [], []]))
    count += _check_family(_family(4, 5, [0, 0, 0, 0], [[], [], [1, 2], []]))
    assert count > 50


def test_large_symmetric_graphs():
    # Automorphism groups of classical graphs (common knowledge): the star
    # K_{1,29}: 29!; the cycle C_30: dihedral, 60; the Petersen graph: S_5, 120;
    # K_{3,3}: 2 * 3!^2 = 72; the cube graph Q_3: 48.
    star = ([0] * 30, [(0, v) for v in range(1, 30)], [[]] * 30)
    cycle = ([0] * 30, [(v, (v + 1) % 30) for v in range(30)], [[]] * 30)
    outer = [(v, (v + 1) % 5) for v in range(5)]
    inner = [(5 + v, 5 + (v + 2) % 5) for v in range(5)]
    petersen = ([0] * 10, outer + inner + [(v, v + 5) for v in range(5)], [[]] * 10)
    k33 = ([0] * 6, [(a, b) for a in range(3) for b in range(3, 6)], [[]] * 6)
    cube = ([0] * 8, [(a, b) for a in range(8) for b in range(a + 1, 8) if bin(a ^ b).count("1") == 1], [[]] * 8)
    for graph, aut in ((star, factorial(29)), (cycle, 60), (petersen, 120), (k33, 72), (cube, 48)):
        assert count_automorphisms(*graph) == aut


def test_doubled_necklace_and_rational_tails():
    # A 10-cycle with every edge doubled: dihedral 20 times 2^10 swaps of parallel edges.
    necklace = ([0] * 10, [(v, (v + 1) % 10) for v in range(10)] * 2, [[]] * 10)
    assert count_automorphisms(*necklace) == 20 * 2**10
    # A genus-2 vertex carrying six identical rational tails, each with a loop:
    # 6! permutations of the tails times 2 flips of each loop.
    edges = [(0, v) for v in range(1, 7)] + [(v, v) for v in range(1, 7)]
    assert count_automorphisms([2] + [0] * 6, edges, [[]] * 7) == factorial(6) * 2**6


@settings(max_examples=25, deadline=None)
@given(st.data())
def test_key_of_large_symmetric_graph_is_invariant(data):
    # 24 genus-0 vertices: four 6-cycles hung from a common hub by one edge each
    edges = [(0, 1 + 6 * c) for c in range(4)]
    edges += [(1 + 6 * c + i, 1 + 6 * c + (i + 1) % 6) for c in range(4) for i in range(6)]
    graph = ([0] * 25, edges, [[]] * 25)
    other = scrambled(data.draw, *graph)
    assert canonical_form(*graph)[0] == canonical_form(*other)[0]
    assert count_automorphisms(*other) == factorial(4) * 2**4


# -- networkx as an independent oracle, colours, the public entry points ------


def to_networkx(genera, edges, legs):
    import networkx as nx

    g = nx.MultiGraph()
    for v, (genus, labels) in enumerate(zip(genera, legs)):
        g.add_node(v, colour=(genus, tuple(sorted(labels))))
    g.add_edges_from(edges)
    return g


def isomorphic(a, b):
    import networkx as nx

    return nx.is_isomorphic(to_networkx(*a), to_networkx(*b), node_match=lambda x, y: x["colour"] == y["colour"])


@st.composite
def pairs_of_graphs(draw):
    """A graph and a scrambled copy of it, the copy changed a little three times in four
    (an edge end moved, a genus raised or a leg moved): isomorphic or not."""
    original = draw(graphs(max_vertices=5, max_extra=3, max_legs=2))
    genera, edges, legs = list(original[0]), list(original[1]), [list(x) for x in original[2]]
    change = draw(st.sampled_from(["none", "edge", "genus", "leg"]))
    n = len(genera)
    if change == "edge" and edges:
        k = draw(st.integers(0, len(edges) - 1))
        edges[k] = (edges[k][0], draw(st.integers(0, n - 1)))
    elif change == "genus":
        genera[draw(st.integers(0, n - 1))] += 1
    elif change == "leg" and any(legs):
        v = next(v for v in range(n) if legs[v])
        legs[draw(st.integers(0, n - 1))].append(legs[v].pop())
    return original, scrambled(draw, genera, edges, legs)


@settings(max_examples=60, deadline=None)
@given(pairs_of_graphs())
def test_keys_agree_with_networkx_isomorphism(pair):
    a, b = pair
    assert (canonical_form(*a)[0] == canonical_form(*b)[0]) == isomorphic(a, b)


def brute_vertex_automorphisms(genera, edges, legs):
    """Vertex permutations keeping genera, the multiset of leg colours and the edge multiset."""
    n = len(genera)
    target = sorted(tuple(sorted(e)) for e in edges)
    return sum(
        1
        for p in permutations(range(n))
        if all(genera[p[v]] == genera[v] and sorted(legs[p[v]]) == sorted(legs[v]) for v in range(n))
        and sorted(tuple(sorted((p[a], p[b]))) for a, b in edges) == target
    )


@st.composite
def coloured_graphs(draw):
    """Graphs whose legs are colours that may repeat (at one vertex and across vertices)."""
    genera, edges, legs = draw(graphs(max_vertices=5, max_extra=3, max_legs=0))
    legs = [draw(st.lists(st.integers(1, 2), max_size=2)) for _ in genera]
    return genera, edges, legs


@settings(max_examples=60, deadline=None)
@given(coloured_graphs(), st.data())
def test_certify_with_repeated_colours(graph, data):
    genera, edges, legs = graph
    key, order, aut_v = certify(tuple(genera), tuple(edges), tuple(map(tuple, legs)))
    assert aut_v == brute_vertex_automorphisms(genera, edges, legs)
    assert sorted(order) == list(range(len(genera)))
    other = scrambled(data.draw, genera, edges, legs)
    assert certify(tuple(other[0]), tuple(other[1]), tuple(map(tuple, other[2])))[0] == key
    # the certificate lists the genera and then the sorted colours in canonical vertex order
    n = len(genera)
    assert key[:2 + n] == (n, len(edges), *[genera[v] for v in order])


@settings(max_examples=40, deadline=None)
@given(graphs(max_vertices=5, max_extra=3))
def test_vertex_automorphisms_and_edge_symmetry(graph):
    genera, edges, legs = graph
    aut_v = vertex_automorphism_count(genera, edges, legs)
    assert aut_v == brute_vertex_automorphisms(genera, edges, legs)
    # the half-edge group: the vertex group times the automorphisms fixing every vertex
    assert count_automorphisms(genera, edges, legs) == aut_v * edge_symmetry_factor(edges)
    assert edge_symmetry_factor(edges) == count_edge_bijections(edges, lambda e: e) * 2 ** sum(a == b for a, b in edges)


@pytest.mark.parametrize(
    "genera, edges, legs, message",
    [
        ([0, 0], [(0, 1)], [[1]], "legs must have one entry per vertex (2), got 1"),
        ([0, 0], [(0, 2)], [[], []], "edge (0, 2) does not join two of the vertices 0..1"),
        ([0, 0], [(0, -1)], [[], []], "edge (0, -1) does not join two of the vertices 0..1"),
        ([0, 0], [(0, 1, 1)], [[], []], "edge (0, 1, 1) does not join two of the vertices 0..1"),
        ([0, 0], [(0, "1")], [[], []], "edge (0, '1') does not join two of the vertices 0..1"),
    ],
)
def test_shape_errors(genera, edges, legs, message):
    from covertree.errors import GraphError

    for function in (check_shape, canonical_form, count_automorphisms, vertex_automorphism_count):
        with pytest.raises(GraphError) as info:
            function(genera, edges, legs)
        assert str(info.value) == message
