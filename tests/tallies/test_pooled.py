"""Pooled simple legs (covertree.tallies.shapes.vertex_orbits) against the
labelled enumeration: the orbits of the labelled local multisets under
permutations of the pooled legs, found here by applying every permutation,
and the tallies of whole problems summed over labelled choices of multisets
(the enumeration the type engine used before pooling, kept here as the
reference)."""

from itertools import permutations

import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from covertree.catalogue.catalogue import problem_hurwitz, select_strata
from covertree.catalogue.pullback import boundary_divisors
from covertree.errors import CovertreeError
from covertree.hurwitz.numbers import connected_hurwitz
from covertree.hurwitz.problem import HurwitzProblem
from covertree.locus.edges import grouped
from covertree.symmetric.partitions import partitions_of
from covertree.tallies.pullback import pullback_row_from_tally
from covertree.tallies.shapes import vertex_orbits, vertex_pieces
from covertree.tallies.types import TypeTally, _choice_entries, _choices, _vertex_data, tally_stratum


# --- one vertex: orbits by brute force ----------------------------------------


def _moved(shape, sigma, pooled):
    """``(degree, legs, halves)`` of the shape with the pooled legs permuted."""
    legs = list(shape.legs)
    for i, p in enumerate(pooled):
        legs[pooled[sigma[i]]] = shape.legs[p]
    return shape.degree, tuple(legs), shape.halves


def _orbit(pieces, pooled):
    return {tuple(sorted(_moved(s, sigma, pooled) for s in pieces)) for sigma in permutations(range(len(pooled)))}


def assert_orbits(d, h, legs, n_halves, max_genus, loops, pooled):
    shapes, multisets = vertex_pieces(d, h, legs, n_halves, max_genus, loops)
    labelled = {tuple(sorted((shapes[i].degree, shapes[i].legs, shapes[i].halves) for i in m)) for m in multisets}
    assert len(labelled) == len(multisets)
    reps, multisets_o, sizes = vertex_orbits(d, h, legs, n_halves, max_genus, loops, pooled)
    assert multisets_o == sorted(multisets_o) and len(sizes) == len(multisets_o)
    covered = set()
    for m, size in zip(multisets_o, sizes):
        orbit = _orbit([reps[i] for i in m], pooled)
        assert orbit <= labelled and not orbit & covered
        assert len(orbit) == size
        covered |= orbit
    assert covered == labelled
    for s in reps:
        assert s.hurwitz == connected_hurwitz(s.degree, h, s.legs + s.halves) != 0


@st.composite
def vertices(draw):
    d = draw(st.integers(2, 4))
    h = draw(st.integers(0, 1))
    simple = (2,) + (1,) * (d - 2)
    others = [tuple(p) for p in partitions_of(d) if tuple(p) != simple]
    legs = [simple] * draw(st.integers(0, 5 - h)) + draw(st.lists(st.sampled_from(others), max_size=1))
    legs = tuple(draw(st.permutations(legs)))
    n_halves = draw(st.integers(0, 2))
    loops = ((0, 1),) if n_halves == 2 and draw(st.booleans()) else ()
    positions = [p for p, mu in enumerate(legs) if mu == simple]
    pooled = tuple(p for p in positions if draw(st.booleans()))
    return d, h, legs, n_halves, draw(st.integers(0, 2)), loops, pooled


@settings(max_examples=60, deadline=None)
@given(vertices())
def test_orbits_match_brute_force(drawn):
    assert_orbits(*drawn)


@pytest.mark.parametrize("d, h, legs, n_halves, max_genus, loops, pooled", [
    (4, 0, ((2, 1, 1),) * 6, 1, 3, (), (0, 1, 2, 3, 4, 5)),
    (4, 0, ((2, 1, 1),) * 4 + ((3, 1),), 2, 2, ((0, 1),), (0, 2, 3)),
    (3, 1, ((2, 1),) * 3 + ((3,),), 1, 3, (), (0, 1, 2)),
    (2, 0, ((2,),) * 5, 2, 2, (), (0, 1, 2, 3, 4)),
    (4, 0, ((2, 1, 1),) * 3, 0, 1, (), ()),
])
def test_orbits_match_brute_force_examples(d, h, legs, n_halves, max_genus, loops, pooled):
    assert_orbits(d, h, legs, n_halves, max_genus, loops, pooled)


@pytest.mark.parametrize("n", [3, 8, 16])
def test_two_double_covers_split_the_legs_as_set_partitions(n):
    """Degree 4 over a rational vertex with ``n`` simple legs and one node:
    two double covers, each branched at a non-empty block of the legs, are
    the unordered splits of the legs into two blocks, the Stirling number
    ``S(n, 2) = 2^(n-1) - 1`` of them (common knowledge)."""
    shapes, multisets, sizes = vertex_orbits(4, 0, ((2, 1, 1),) * n, 1, n, (), tuple(range(n)))
    splits = [size for m, size in zip(multisets, sizes) if [shapes[i].degree for i in m] == [2, 2]]
    assert sum(splits) == 2 ** (n - 1) - 1
    assert len(splits) == n // 2  # one orbit per pair of block sizes {c, n - c}


# --- whole problems: pooled tallies against labelled ones ------------------------


def _labelled_tally(problem, base):
    """The tallies over one stratum summed over labelled choices of local
    multisets (no pooling)."""
    profiles = [tuple(p) for p in problem.profiles]
    data = _vertex_data(base.graph, problem.degree, problem.genus, profiles)
    entries = []
    for choice in _choices(base.graph, data, problem.genus):
        entries.extend(_choice_entries(base.graph, data, choice, problem.genus, problem.marks))
    return TypeTally(base, tuple(entries), problem_hurwitz(problem))


def _read(problem, tally):
    """Everything the consumers read from a tally."""
    out = [tally.total_weight, tally.by_source(), tally.by_profiles(), tally.by_class(),
           grouped(((e.genera, e.edges, e.weight, e.legs) for e in tally.entries), tally.base.graph.n_nodes,
                   problem.genus)]
    if tally.base.codim == 1 and problem.has_source_space:
        row = pullback_row_from_tally(tally, boundary_divisors(problem.genus, problem.n_marks))
        out.append(row.coefficients)
    return out


def assert_pooling_exact(problem, codim):
    for base in select_strata(problem, codim):
        pooled, labelled = tally_stratum(problem, base), _labelled_tally(problem, base)
        assert _read(problem, pooled) == _read(problem, labelled), base.graph.notation
        assert pooled.identity_holds, base.graph.notation


@pytest.mark.parametrize("problem, codim", [
    (HurwitzProblem.build(4, 0, genus=3), 1),
    (HurwitzProblem.build(3, 0, genus=2, marks=["1", "4:1"]), 2),
    (HurwitzProblem.build(4, 0, genus=2, profiles=["3,1"], marks=["2"]), 1),
    (HurwitzProblem.build(3, 1, genus=3, profiles=["3"]), 1),
])
def test_pooled_tallies_equal_labelled_ones(problem, codim):
    assert_pooling_exact(problem, codim)


@st.composite
def problems(draw):
    h = draw(st.sampled_from([0, 0, 1]))
    d = draw(st.integers(2, 4 - h))
    special = [tuple(p) for p in partitions_of(d) if tuple(p) != (2,) + (1,) * (d - 2) and (len(p) < d or h)]
    given_ = draw(st.lists(st.sampled_from(special), max_size=2)) if special else []
    n_simple = draw(st.integers(0, 6 - 2 * h - len(given_)))
    twice = 2 * d * (h - 1) + sum(d - len(p) for p in given_) + n_simple
    assume(twice % 2 == 0 and len(given_) + n_simple >= 3 - 2 * h)
    try:
        problem = HurwitzProblem.build(d, h, genus=twice // 2 + 1, profiles=[",".join(map(str, p)) for p in given_])
    except CovertreeError:
        problem = None
    assume(problem is not None)
    points = [(j, e) for j, mu in enumerate(problem.profiles, start=1) for e in sorted(set(mu))]
    marks = draw(st.lists(st.sampled_from(points), max_size=2, unique=True))
    return problem.degree, h, problem.genus, given_, [f"{j}:{e}" for j, e in sorted(marks)], draw(st.integers(1, 2))


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.filter_too_much])
@given(problems())
def test_pooled_tallies_equal_labelled_ones_random(drawn):
    d, h, genus, given_, marks, codim = drawn
    try:
        problem = HurwitzProblem.build(d, h, genus=genus, profiles=[",".join(map(str, p)) for p in given_],
                                       marks=marks)
    except CovertreeError:
        problem = None
    assume(problem is not None and len(problem.profiles) <= (6 if codim == 1 else 5))
    assert_pooling_exact(problem, codim)


def test_contracted_marked_source_is_not_pooled():
    """Genus 0 with one marked leg: stabilisation contracts the whole source,
    and the leg paths of the locus layer then depend on how the pieces are
    numbered; such problems keep the labelled sum, and src^* psi_1 integrals
    stay those of the list engine."""
    from covertree.locus.integrals import cover_space_integrals
    from covertree.locus.monomial import Monomial

    problem = HurwitzProblem.build(4, 0, genus=0, profiles=["3,1"], marks=["1:1"])
    assert_pooling_exact(problem, 1)
    monomials = [(Monomial.parse("psi_1", "source"), Monomial.parse(f"psi_{j}", "target")) for j in (1, 2, 5)]
    assert cover_space_integrals(problem, monomials, "types") == cover_space_integrals(problem, monomials, "list")
