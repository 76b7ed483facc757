"""Marked covers: conversion to and from the unmarked numbers, both engines.

Convention (docs/theory.md, "Marked points"): a marked cover is a cover with an
injective labelling of its chosen points, weighted 1/|Aut(f, marks)|.  Summed
over the marked covers above one cover f the weights give #labellings/|Aut f|
(orbit-stabiliser), so every marked total is the unmarked one times the
number of labellings, and forgetting the marks of the prestable source gives
back the unmarked tallies.
"""

from __future__ import annotations

from fractions import Fraction

import pytest

from covertree.catalogue.catalogue import build_catalogue, weight_by_graph
from covertree.catalogue.covers import make_graph
from covertree.hurwitz.marks import labellings
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import tally_catalogue

PROBLEMS = [
    (2, 0, 2, (), ["1"]),
    (2, 0, 2, (), ["1", "2"]),
    (2, 0, 2, (), ["1", "2", "3", "4", "5", "6"]),
    (2, 0, 3, (), ["1"]),
    (2, 1, 2, (), ["1"]),
    (2, 1, 2, (), ["1", "2"]),
    (3, 1, None, ("1,1,1",), ["1:1"]),
    (3, 1, None, ("1,1,1",), ["1:1^2"]),
    (3, 1, None, ("1,1,1",), ["1:1^3"]),
    (3, 0, 1, ("2,1", "2,1", "2,1", "2,1"), ["1", "2:1"]),
    (3, 0, 0, ("3",), ["1"]),
    (3, 0, 0, ("3",), ["1", "2:1"]),
    (3, 0, 1, ("3", "3", "3"), ["1", "2"]),
    (4, 0, 0, ("2,2", "2,1,1", "2,1,1", "2,1,1", "2,1,1"), ["1"]),
    (4, 0, 0, ("2,2", "2,1,1", "2,1,1", "2,1,1", "2,1,1"), ["1:2"]),
    (2, 0, 1, ("2", "2", "2", "2", "1,1"), ["5:1"]),
    (2, 0, 1, ("2", "2", "2", "2", "1,1"), ["5:1^2", "1"]),
    (3, 0, 1, ("2,1",) * 4 + ("1,1,1",), ["5:1", "3:2"]),
]


def _problem(d, h, g, profiles, marks):
    return HurwitzProblem.build(d, h, genus=g, profiles=profiles, marks=marks)


def _forget(graph):
    return make_graph(graph.vertex_genera, graph.nodes)


@pytest.mark.parametrize("spec", PROBLEMS, ids=lambda s: f"{s}")
def test_marked_totals_are_unmarked_totals_times_labellings(spec):
    marked = _problem(*spec)
    plain = marked.unmarked()
    factor = labellings([tuple(p) for p in plain.profiles], marked.marks)
    a, b = build_catalogue(marked, 2, labeled=True), build_catalogue(plain, 2, labeled=True)
    assert a.hurwitz_number == b.hurwitz_number * factor
    assert not a.failures
    for s, t in zip(a.strata, b.strata):
        # unmarked -> marked
        assert s.total_weight == t.total_weight * factor
        # marked -> unmarked, per prestable source
        back = weight_by_graph((_forget(c.source), c.weight / factor) for c in s.covers)
        assert back == weight_by_graph((c.source, c.weight) for c in t.covers)


@pytest.mark.parametrize("spec", PROBLEMS, ids=lambda s: f"{s}")
def test_both_engines_agree_on_marked_problems(spec):
    problem = _problem(*spec)
    a, b = build_catalogue(problem, max_codim=2), tally_catalogue(problem, max_codim=2)
    assert [s.by_source() for s in a.strata] == [t.by_source() for t in b.strata]
    assert not b.failures


@pytest.mark.parametrize("spec", PROBLEMS[:9], ids=lambda s: f"{s}")
def test_orbits_of_labellings(spec):
    # the marked covers over one cover f: sum of |Aut f|/|Aut(f, m)| = #labellings
    marked = _problem(*spec)
    plain = marked.unmarked()
    factor = labellings([tuple(p) for p in plain.profiles], marked.marks)
    a, b = build_catalogue(marked, 1, labeled=True), build_catalogue(plain, 1, labeled=True)
    for s, t in zip(a.strata, b.strata):
        per_cover: dict[tuple, Fraction] = {}
        for c in s.covers:
            key = c.raw.code[:2]
            per_cover[key] = per_cover.get(key, Fraction(0)) + Fraction(1, c.automorphisms)
        assert per_cover == {c.raw.code: Fraction(factor, c.automorphisms) for c in t.covers}


def test_all_weierstrass_points_marked_give_stable_sources():
    problem = _problem(2, 0, 2, (), [str(j) for j in range(1, 7)])
    plain = build_catalogue(problem.unmarked(), 3, labeled=True)
    cat = build_catalogue(problem, 3, labeled=True)
    for s, t in zip(cat.strata, plain.strata):
        for c in s.covers:
            assert c.source == c.stable_source and c.stable_source.n_legs == 6
        # the deck involutions fix every ramification point: nothing changes
        assert [c.automorphisms for c in s.covers] == [c.automorphisms for c in t.covers]
