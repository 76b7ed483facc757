"""Property tests: random small Hurwitz problems satisfy the degeneration
identity on every stratum, and the catalogue's invariants hold."""

from __future__ import annotations

from fractions import Fraction

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from covertree.catalogue.catalogue import build_catalogue
from covertree.hurwitz.numbers import connected_hurwitz
from covertree.hurwitz.problem import HurwitzProblem


def _partitions(n, largest=None):
    largest = largest or n
    if n == 0:
        yield ()
        return
    for k in range(min(n, largest), 0, -1):
        for rest in _partitions(n - k, k):
            yield (k,) + rest


@st.composite
def small_problems(draw):
    """Degree 2..4, target genus 0 or 1, up to 5 (genus 0) or 3 (genus 1) points."""
    h = draw(st.integers(0, 1))
    d = draw(st.integers(2, 4))
    parts = list(_partitions(d))
    most = 5 if h == 0 else 3
    profiles = draw(st.lists(st.sampled_from(parts), min_size=1, max_size=most - 1))
    if sum(d - len(mu) for mu in profiles) % 2:
        profiles.append((2,) + (1,) * (d - 2))  # Riemann-Hurwitz parity
    simple = (2,) + (1,) * (d - 2)
    while d * (2 * h - 2) + sum(d - len(mu) for mu in profiles) < -2:  # negative genus
        profiles += [simple, simple]
    while 2 * h - 2 + len(profiles) <= 0:
        profiles.append((1,) * d)
    codim = draw(st.integers(0, 2 if len(profiles) <= 4 else 1))
    return HurwitzProblem.build(d, h, profiles=profiles), codim


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(small_problems())
def test_degeneration_identity_on_random_problems(case):
    problem, codim = case
    hurwitz = connected_hurwitz(problem.degree, problem.target_genus, [tuple(m) for m in problem.profiles])
    cat = build_catalogue(problem, max_codim=codim)
    assert cat.strata
    for s in cat.strata:
        assert s.total_weight == hurwitz, (problem, s.base.graph.notation)
        assert sum((w for _, w in s.by_source()), Fraction(0)) == s.total_weight
        for c in s.covers:
            assert c.source.genus == problem.genus
            assert c.stable_source.genus == problem.genus
            assert c.stable_source.n_vertices <= c.source.n_vertices
            assert c.stable_source.codim <= c.source.codim
            # the stable graph's nodes are chains of source nodes, each used once
            used = [n for chain in c.stabilised.chains for n in chain]
            assert len(used) == len(set(used)) and len(used) <= c.source.codim
            if problem.genus >= 2:
                assert c.stable_source.is_stable()


@settings(max_examples=15, deadline=None)
@given(small_problems())
def test_labelled_and_orbit_catalogues_have_the_same_totals(case):
    problem, codim = case
    codim = min(codim, 1)
    orbits = build_catalogue(problem, max_codim=codim)
    labelled = build_catalogue(problem, max_codim=codim, labeled=True)
    assert sum(s.base.orbit_size for s in orbits.strata) == len(labelled.strata)
    # covers counted with orbit sizes = covers over all labelled strata
    assert sum(s.base.orbit_size * len(s.covers) for s in orbits.strata) == labelled.n_covers
