"""Canonical forms of large symmetric graphs (issue 14): twins pruned, no
recursion whose depth grows with the graph, oversized notations refused."""

import random
import sys
from math import factorial

import pytest

from covertree.errors import NotationError
from covertree.graphs.canonical import canonical_form, count_automorphisms
from covertree.graphs.notation import MAX_GRAPH_ITEMS, parse_graph


def star(k):
    return [0] + [1] * k, [(0, i) for i in range(1, k + 1)], [[]] * (k + 1)


def test_star_of_many_elliptic_leaves_has_all_permutations():
    # common knowledge: the leaves of a star are permuted freely, |Aut| = k!
    assert count_automorphisms(*star(160)) == factorial(160)


def test_star_key_does_not_depend_on_the_numbering():
    genera, edges, legs = star(60)
    perm = list(range(61))
    random.Random(3).shuffle(perm)
    inverse = {v: i for i, v in enumerate(perm)}
    moved = [genera[perm[i]] for i in range(61)], [(inverse[a], inverse[b]) for a, b in edges], [[]] * 61
    assert canonical_form(*moved)[0] == canonical_form(genera, edges, legs)[0]


def test_search_depth_is_not_bounded_by_the_recursion_limit():
    limit = sys.getrecursionlimit()
    sys.setrecursionlimit(150)
    try:
        # a star of 200 leaves individualises 199 vertices one below the other
        assert count_automorphisms(*star(200)) == factorial(200)
    finally:
        sys.setrecursionlimit(limit)


def test_mixed_twins_and_generators():
    # two stars of 3 elliptic leaves joined at their centres: (3!)^2 * 2
    genera = [0, 0, 1, 1, 1, 1, 1, 1]
    edges = [(0, 1), (0, 2), (0, 3), (0, 4), (1, 5), (1, 6), (1, 7)]
    assert count_automorphisms(genera, edges, [[]] * 8) == 72


@pytest.mark.parametrize("leaves", [500, 1000])
def test_oversized_star_notation_refused_at_parse(leaves):
    text = "g0, " + ", ".join(["g1"] * leaves) + " | " + ", ".join(f"0-{i}" for i in range(1, leaves + 1))
    with pytest.raises(NotationError, match=f"more than {MAX_GRAPH_ITEMS}"):
        parse_graph(text)
