"""The engine against the brute-force oracle, cover by cover.

For every labelled base stratum of each problem below, the covers listed by the
engine (:func:`covertree.gluing.covers.glued_covers`, through
:func:`covertree.catalogue.covers.stratum_covers`) and by the oracle
(:func:`tests.oracle.brute_covers.brute_force_covers`, labelled brute force over
``prod_v S_d``) must agree as multisets of shapes: edge profiles, |Aut|,
multiplicity and the source graph over the base graph (``BruteCover.key``), and
as multisets of (shape, stable source).  The oracle's stable sources come from
the tiny stabiliser written below, independent of
:mod:`covertree.stabilisation`.

The problems cover targets of genus 0, 1 and 2, simple and non-simple
profiles, and (at codimension 2) bases with loops and parallel edges.
"""

from __future__ import annotations

from collections import Counter

import pytest

from covertree.catalogue.covers import stratum_covers
from covertree.graphs.curve_graph import CurveGraph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import base_strata
from tests.oracle.brute_covers import BruteCover, brute_force_covers

# (degree, target genus, source genus or None, given profiles, max codim)
PROBLEMS = [
    (2, 1, 2, (), 2),  # genus-2 double covers of an elliptic curve: all of Mbar_{1,2}
    (3, 1, 2, (), 2),
    (4, 1, 2, (), 2),
    (2, 1, 3, (), 2),  # four branch points on an elliptic curve
    (3, 1, 3, (), 2),
    (2, 0, 2, (), 2),  # hyperelliptic genus 2: six points on P^1
    (3, 0, 1, (), 2),  # trigonal genus 1: six simple points
    (2, 2, None, ("1,1",), 2),  # unramified double covers of a genus-2 curve (loops, parallel edges)
    (3, 2, None, ("1^3",), 2),
    (2, 1, None, ("1,1",), 1),
    (3, 1, None, ("3",), 1),  # non-simple: one total ramification point
    (4, 1, None, ("2,2",), 1),
    (4, 1, None, ("1^4",), 1),
    (4, 1, None, ("3,1", "2,2"), 2),
    (4, 1, None, ("2,2", "2,2"), 2),
    (4, 0, None, ("4", "2,2", "2,1,1"), 2),
    (4, 0, None, ("2,2", "2,2", "2,1,1", "2,1,1"), 2),
    (4, 0, None, ("4", "3,1", "2,1,1"), 2),
    (4, 0, None, ("3,1", "3,1", "2,1,1", "2,1,1"), 2),
    (4, 0, None, ("4", "2,1,1", "2,1,1", "2,1,1"), 2),
    (3, 0, None, ("3", "2,1", "2,1", "1^3"), 2),  # an unramified marked point
    (3, 0, None, ("3", "3", "1^3"), 2),
]


def _ident(args):
    d, h, g, given, k = args
    return f"d{d}-h{h}-g{g}-{'_'.join(given) or 'simple'}-k{k}"


def engine_shape(cover) -> tuple:
    """The oracle's isomorphism invariant of an engine cover."""
    raw = cover.raw
    wrapped = BruteCover(
        raw.edge_profiles, raw.source_genera, raw.source_edges, raw.automorphisms, raw.multiplicity,
        source_vertices=raw.source_vertex_over, source_degrees=raw.source_degrees,
        source_edge_over=raw.source_edge_over,
    )
    return wrapped.key()


def tiny_stabilise(genera, edges) -> CurveGraph:
    """Contract rational tails and rational bridges (docs/theory.md, section 8), written
    independently of covertree.stabilisation: vertices are dict keys, edges a list
    of pairs; at each step drop a genus-0 vertex meeting one edge end, or merge
    the two edges of a genus-0 vertex meeting two ends of distinct edges that are
    not a loop.  Stops with one vertex left (genus 0 or 1 sources)."""
    genus = dict(enumerate(genera))
    edge_list = [tuple(e) for e in edges]
    changed = True
    while changed and len(genus) > 1:
        changed = False
        for v in list(genus):
            if genus[v] != 0:
                continue
            ends = [i for i, (a, b) in enumerate(edge_list) if v in (a, b)]
            degree_v = sum((a == v) + (b == v) for a, b in edge_list)
            if degree_v == 1:
                edge_list.pop(ends[0])
                del genus[v]
                changed = True
                break
            if degree_v == 2 and len(ends) == 2:
                (a1, b1), (a2, b2) = edge_list[ends[0]], edge_list[ends[1]]
                x = b1 if a1 == v else a1
                y = b2 if a2 == v else a2
                edge_list = [e for i, e in enumerate(edge_list) if i not in ends] + [(x, y)]
                del genus[v]
                changed = True
                break
    names = {v: i for i, v in enumerate(sorted(genus))}
    return CurveGraph._from_parts([genus[v] for v in sorted(genus)], [(names[a], names[b]) for a, b in edge_list])


def test_tiny_stabiliser_by_hand():
    # an elliptic curve with a rational bridge between two of its points, and a
    # rational tail on the bridge: the tail goes, the bridge becomes a loop
    g = tiny_stabilise([1, 0, 0], [(0, 1), (0, 1), (1, 2)])
    assert g == CurveGraph([1], nodes=[(0, 0)])
    # a chain of three rational curves ends as one rational vertex
    assert tiny_stabilise([0, 0, 0], [(0, 1), (1, 2)]) == CurveGraph([0])


@pytest.mark.parametrize("args", PROBLEMS, ids=_ident)
def test_engine_matches_oracle_cover_by_cover(args):
    d, h, g, given, max_codim = args
    problem = HurwitzProblem.build(d, h, genus=g, profiles=given)
    profiles = [tuple(mu) for mu in problem.profiles]
    strata = base_strata(h, profiles, max_codim, labeled=True)
    assert strata
    for stratum in strata:
        base = stratum.graph
        engine = list(stratum_covers(base, d, profiles))
        oracle = brute_force_covers(d, base.vertex_genera, base.nodes, base.vertex_legs, profiles)
        assert len(engine) == len(oracle), base.notation
        assert Counter(engine_shape(c) for c in engine) == Counter(c.key() for c in oracle), base.notation
        engine_stable = Counter((engine_shape(c), c.stable_source) for c in engine)
        oracle_stable = Counter(
            (c.key(), tiny_stabilise(c.source_genera, c.source_edges)) for c in oracle
        )
        assert engine_stable == oracle_stable, base.notation
        # the engine's source graph is the oracle-shaped one
        for c in engine:
            assert c.source == CurveGraph._from_parts(c.raw.source_genera, c.raw.source_edges)
            assert c.source.genus == problem.genus
