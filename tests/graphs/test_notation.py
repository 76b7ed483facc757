"""The one-line graph notation: exact round trips and error positions."""

import pytest

from covertree.errors import NotationError
from covertree.graphs import CurveGraph, StableCurveGraph, format_graph, parse_graph, stable_graphs


@pytest.mark.parametrize("genus, n", [(0, 6), (1, 3), (2, 2), (3, 0), (3, 1), (4, 0)])
def test_round_trip_on_every_stratum(genus, n):
    for g in stable_graphs(genus, n):
        text = format_graph(g)
        back = parse_graph(text)
        assert back == g and isinstance(back, StableCurveGraph)
        assert (back.vertex_genera, back.nodes, back.vertex_legs) == (g.vertex_genera, g.nodes, g.vertex_legs)
        assert format_graph(back) == text


def test_round_trip_of_unstable_graphs():
    # sources of covers: rational tails and bridges, long chains
    chain = CurveGraph._from_parts([0] * 6, [(i, i + 1) for i in range(5)], [[1], [], [], [], [], [2]])
    tail = CurveGraph([1, 0, 0], nodes=[(0, 1), (1, 2), (2, 2)])
    for g in (chain, tail):
        back = parse_graph(g.notation)
        assert back == g and type(back) is CurveGraph and not back.is_stable()


def test_multiplicity_shorthand_and_loops():
    g = parse_graph("g0, g0, g1{4} | 0-1^3, 1-2, 2-2^2, 0-0")
    assert g.n_nodes == 7
    assert sum(1 for a, b in g.nodes if a == b) == 3
    assert str(g).count("^") == 2
    # 3! on the triple edge, 2 for the single loop, 2! * 2^2 for the double loop
    assert g.automorphisms == 6 * 2 * 8
    assert parse_graph("g0,g0,g1{4}|0-1,0-1,0-1,1-2,2-2,2-2,0-0") == g


def test_whitespace_is_ignored_between_tokens():
    a = parse_graph("g2{1,2},g0{3}|0-1,1-1")
    b = parse_graph("  g2 { 1 , 2 } ,\tg0{ 3 }\n|  0 - 1 , 1-1  ")
    assert a == b


def test_input_order_does_not_matter():
    a = parse_graph("g1{2}, g0{1} | 1-0")
    b = parse_graph("g0{1}, g1{2} | 0-1")
    assert a == b and str(a) == str(b)


def test_empty_leg_braces_and_bare_bar():
    assert parse_graph("g2{}") == parse_graph("g2 |") == StableCurveGraph([2])


@pytest.mark.parametrize(
    "text, column, fragment",
    [
        ("", 0, "'g'"),
        ("g", 1, "genus"),
        ("g0{1,", 5, "leg label"),
        ("g0{1 2}", 5, "',' or '}'"),
        ("g0{1} g0", 6, "',' or '|'"),
        ("g0, g0 | 0 1", 11, "'-'"),
        ("g0, g0 | 0-1^", 13, "multiplicity"),
        ("g0, g0 | 0-1^0", 13, "at least 1"),
        ("g0, g0 | 0-5", 11, "out of range"),
        ("g0, g0 | 0-1 x", 13, "',' or the end"),
        ("h0", 0, "'g'"),
    ],
)
def test_errors_name_the_column(text, column, fragment):
    with pytest.raises(NotationError) as info:
        parse_graph(text)
    message = str(info.value)
    assert message.startswith(f"column {column}:")
    assert fragment in message


@pytest.mark.parametrize(
    "text, fragment",
    [("g0, g0", "disconnected"), ("g0{1}, g0{1} | 0-1", "twice")],
)
def test_invalid_graphs_raise_notation_errors(text, fragment):
    with pytest.raises(NotationError, match=fragment):
        parse_graph(text)


@pytest.mark.parametrize(
    "text, message",
    [
        # columns counted by hand, 0-based
        ("g0, g0 | 0 1", "column 11: expected '-' between the two ends of an edge, found '1'"),
        ("g0, g0 | 0-1^", "column 13: expected an edge multiplicity after '^', found the end"),
        ("g0, g0 | 0-", "column 11: expected a vertex index, found the end"),
        ("g0{1} | 0-1", "column 10: vertex index 1 out of range (the graph has 1 vertex)"),
        ("g0, g0 | 0-2", "column 11: vertex index 2 out of range (the graph has 2 vertices)"),
        ("g0{1", "column 4: expected ',' or '}' in the list of legs, found the end"),
        ("h0", "column 0: expected 'g' starting a vertex (as in g0 or g1{2,3}), found 'h'"),
        ("g", "column 1: expected a genus after 'g', found the end"),
        ("gX", "column 1: expected a genus after 'g', found 'X'"),
        ("g0{", "column 3: expected a leg label, found the end"),
        ("g0{1,", "column 5: expected a leg label, found the end"),
        ("g0, g0 | 0-1 x", "column 13: expected ',' or the end, found 'x'"),
        ("g0{1} g0", "column 6: expected ',' or '|' or the end, found 'g'"),
        ("g" + "9" * 19, "column 1: a number of 19 digits; at most 18 allowed"),
    ],
)
def test_error_messages_in_full(text, message):
    with pytest.raises(NotationError) as info:
        parse_graph(text)
    assert str(info.value) == message


def test_multiplicity_one_is_a_single_edge():
    assert parse_graph("g0, g0 | 0-1^1") == parse_graph("g0, g0 | 0-1")


def test_multiplicity_cap_counts_vertices_edges_and_legs():
    # two vertices and 598 parallel edges make exactly MAX_GRAPH_ITEMS = 600 items: accepted
    assert parse_graph("g0, g0 | 0-1^598").n_nodes == 598
    with pytest.raises(NotationError) as info:
        parse_graph("g0, g0 | 0-1^599")
    assert str(info.value) == "column 13: edge multiplicity 599 makes the graph larger than 600 vertices, edges and legs"


def test_numbers_of_at_most_eighteen_digits_and_leading_zeros():
    # MAX_DIGITS = 18 (covertree.limits): leading zeros do not count
    assert parse_graph("g" + "9" * 18).genus == 10**18 - 1
    assert parse_graph("g" + "0" * 30 + "2").genus == 2


def test_non_strings_are_refused():
    with pytest.raises(NotationError) as info:
        parse_graph(5)
    assert str(info.value) == "a graph notation is a string, not int"


def test_vertex_and_leg_cap():
    # one vertex and 599 legs make exactly MAX_GRAPH_ITEMS = 600 items: accepted; one more leg is
    # refused where the vertex ends
    legs = ",".join(map(str, range(1, 600)))
    assert parse_graph(f"g1{{{legs}}}").n_legs == 599
    text = f"g1{{{legs},600}}"
    with pytest.raises(NotationError) as info:
        parse_graph(text)
    assert str(info.value) == f"column {len(text)}: the graph has more than 600 vertices, edges and legs"
