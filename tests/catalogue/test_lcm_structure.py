"""Local structure and pullbacks where the structure shows: degree 5, where the
indices over one node can be 3 and 2, so that ``lcm = 6`` differs from the
largest index and from the product, over separating nodes, loops and parallel
edges of the base.

The outside side is the brute-force oracle (:mod:`tests.oracle.brute_covers`):
its covers carry the index of every source node, and the orders along a branch
are recomputed here by a stabilisation of our own that tracks the merged chains
(docs/theory.md, section 8: rational tails dropped, rational bridges merged, the
order of a merged node the sum of ``L/e`` over its chain), with ``L`` and the
number of branches counted as orbits of the monodromy around ``t = 0``
(:func:`tests.catalogue.test_local_structure.brute_branches`).
"""

from __future__ import annotations

from collections import Counter
from fractions import Fraction

import pytest

from covertree.catalogue.covers import stratum_covers
from covertree.catalogue.local_structure import local_structure
from covertree.catalogue.pullback import build_pullback
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.pullback import pullback_from_types
from tests.catalogue.test_local_structure import brute_branches, brute_period
from tests.hurwitz.brute_force import brute_hurwitz
from tests.oracle.brute_covers import brute_force_covers

FIVES = [(5,), (5,), (5,), (2, 1, 1, 1), (2, 1, 1, 1)]  # genus 3 over P^1


def _merge(genera, edges, chains):
    """One step of stabilisation, or None when the graph is stable."""
    for v, g in genera.items():
        ends = [i for i, (a, b) in enumerate(edges) if v in (a, b)]
        valence = sum((a == v) + (b == v) for a, b in edges)
        if g or not (valence == 1 or (valence == 2 and len(ends) == 2)) or len(genera) == 1:
            continue
        keep = [i for i in range(len(edges)) if i not in ends]
        new_edges, new_chains = [edges[i] for i in keep], [chains[i] for i in keep]
        if valence == 2:
            (a1, b1), (a2, b2) = edges[ends[0]], edges[ends[1]]
            new_edges.append((b1 if a1 == v else a1, b2 if a2 == v else a2))
            new_chains.append(chains[ends[0]] + chains[ends[1]])
        return {u: h for u, h in genera.items() if u != v}, new_edges, new_chains
    return None


def _node_type(genera, edges, k):
    """``delta_0`` for a non-separating edge, else ``delta_i`` (smaller side)."""
    total = sum(genera.values()) + len(edges) - len(genera) + 1
    a, b = edges[k]
    side, frontier = {a}, [a]
    while frontier:
        v = frontier.pop()
        for i, (x, y) in enumerate(edges):
            for p, q in ((x, y), (y, x)):
                if i != k and p == v and q not in side:
                    side.add(q)
                    frontier.append(q)
    if b in side:
        return "delta_0"
    inner = sum(1 for i, (x, y) in enumerate(edges) if i != k and x in side and y in side)
    genus = sum(genera[v] for v in side) + inner - len(side) + 1
    return f"delta_{min(genus, total - genus)}"


def oracle_orders(cover) -> Counter:
    """Order of each divisor type along one branch of an oracle cover (one base node)."""
    big_l = brute_period(cover.edge_profiles[0])
    state = (dict(enumerate(cover.source_genera)), list(cover.source_edges),
             [[j] for j in range(len(cover.source_edges))])
    while (step := _merge(*state)) is not None:
        state = step
    genera, edges, chains = state
    orders = Counter()
    for k, chain in enumerate(chains):
        orders[_node_type(genera, edges, k)] += sum(big_l // cover.source_edge_index[j] for j in chain)
    return orders


def oracle_row(degree, base, profiles):
    """``(coefficients, sum of #branches L / |Aut|)`` over one base divisor, from the oracle."""
    covers = brute_force_covers(degree, base.vertex_genera, base.nodes, base.vertex_legs, profiles)
    assert covers
    coefficients, total = Counter(), Fraction(0)
    for c in covers:
        per_branch = Fraction(brute_branches(c.edge_profiles[0]), c.automorphisms)
        total += per_branch * brute_period(c.edge_profiles[0])
        for kind, order in oracle_orders(c).items():
            coefficients[kind] += per_branch * order
    return coefficients, total


def test_indices_three_and_two_over_one_node_by_hand():
    # Five points on P^1 split {1, 4} | {2, 3, 5}: a 5-cycle and a transposition
    # on one side, (5), (5), (2,1^3) on the other.  A 5-cycle times a
    # transposition has type (4,1) or (3,2).  Over a node of type (3,2): the
    # first side has genus 0 (2g - 2 = -10 + 4 + 1 + 3), the second genus 2
    # (-10 + 4 + 4 + 1 + 3); two source nodes of indices 3 and 2 join them.
    # L = lcm(3, 2) = 6 and 3 * 2 / 6 = 1 branch (x^3 = t = y^2 is irreducible);
    # the genus-0 side is a rational bridge, so the stable source is genus 2 with
    # one loop, smoothed to order 6/3 + 6/2 = 5, a delta_0 node.
    base = parse_graph("g0{1,4}, g0{2,3,5} | 0-1")
    covers = [c for c in stratum_covers(base, 5, FIVES) if c.edge_profiles == ((3, 2),)]
    assert covers
    for c in covers:
        s = local_structure(c)
        assert (s.nodes[0].indices, s.nodes[0].lcm, s.nodes[0].branches, s.branches) == ((3, 2), 6, 1, 1)
        assert [(n.order, n.type, len(n.chain)) for n in s.stable_nodes] == [(5, "delta_0", 2)]
        assert c.stable_source.notation == "g2 | 0-0"
        assert s.order_of("delta_0") == 5 and s.order_of("delta_1") == 0


@pytest.mark.parametrize("problem", [
    HurwitzProblem.build(5, 0, None, ["5", "5", "5", "2,1^3", "2,1^3"]),  # separating nodes
    HurwitzProblem.build(5, 1, genus=2),  # the irreducible node: a loop of the base
], ids=["genus-0-target", "elliptic-target"])
def test_pullback_at_degree_five_against_the_oracle(problem):
    profiles = [tuple(mu) for mu in problem.profiles]
    hurwitz = brute_hurwitz(problem.degree, problem.target_genus, profiles)[0]
    listed = build_pullback(problem)
    assert listed.rows and listed.hurwitz_number == hurwitz
    shown = set()
    for row in listed.rows:
        coefficients, total = oracle_row(problem.degree, row.base.graph, profiles)
        assert total == row.branch_total == hurwitz, row.base.graph.notation
        assert {k: v for k, v in row.coefficients.items() if v} == dict(coefficients), row.base.graph.notation
        shown |= {p for c in stratum_covers(row.base.graph, problem.degree, profiles) for p in c.edge_profiles}
    assert (3, 2) in shown  # lcm 6 differs from the largest index 3
    typed = pullback_from_types(problem)
    assert [r.coefficients for r in typed.rows] == [r.coefficients for r in listed.rows]


@pytest.mark.parametrize("notation", [
    "g0{1}, g0{2} | 0-1, 0-1",  # parallel edges
    "g0{1,2}, g0 | 0-1, 1-1",  # a separating edge and a loop
])
def test_branches_over_two_nodes_at_degree_five(notation):
    # codimension two: the branches of the normalisation multiply over the base nodes
    base = parse_graph(notation)
    profiles = [(2, 1, 1, 1), (2, 1, 1, 1)]
    covers = list(stratum_covers(base, 5, profiles))
    assert covers
    oracle = brute_force_covers(5, base.vertex_genera, base.nodes, base.vertex_legs, profiles)
    assert Counter(c.edge_profiles for c in covers) == Counter(c.edge_profiles for c in oracle)
    seen = set()
    for c in covers:
        s = local_structure(c)
        assert s.stable_nodes is None
        assert [n.lcm for n in s.nodes] == [brute_period(p) for p in c.edge_profiles]
        assert s.branches == brute_branches(c.edge_profiles[0]) * brute_branches(c.edge_profiles[1])
        seen |= set(c.edge_profiles)
    assert (3, 2) in seen
