"""Base strata: orbits of strata under permutations of equal-profile points."""

from itertools import permutations, product

import pytest

from covertree.errors import GraphError, ProfileError
from covertree.graphs import stable_graphs
from covertree.strata import BaseStratum, base_strata


def brute_orbits(genus, profiles, max_codim):
    """Orbits by applying every permutation of legs that preserves profiles."""
    n = len(profiles)
    groups = {}
    for j, mu in enumerate(profiles, start=1):
        groups.setdefault(tuple(sorted(mu, reverse=True)), []).append(j)
    blocks = list(groups.values())
    maps = []
    for images in product(*(permutations(b) for b in blocks)):
        mapping = {}
        for block, image in zip(blocks, images):
            mapping.update(zip(block, image))
        maps.append(mapping)
    assert len(maps) >= 1 and all(len(m) == n for m in maps)
    orbits = set()
    for g in stable_graphs(genus, n, max_codim):
        orbits.add(frozenset(g.relabel_legs(m) for m in maps))
    return orbits


CASES = [
    (0, [(2, 1)] * 6, 2),
    (0, [(2, 1)] * 3 + [(3,)] * 2, 2),
    (1, [(2,)] * 3, 3),
    (1, [(2, 1, 1), (3, 1), (2, 1, 1), (4,)], 2),
    (2, [(2,)] * 2, 2),
]


@pytest.mark.parametrize("genus, profiles, max_codim", CASES)
def test_orbits_against_brute_force(genus, profiles, max_codim):
    strata = base_strata(genus, profiles, max_codim)
    expected = brute_orbits(genus, profiles, max_codim)
    assert len(strata) == len(expected)
    for s in strata:
        orbit = next(o for o in expected if s.graph in o)
        assert s.orbit_size == len(orbit)
        assert s.graph.key == min(g.key for g in orbit)


@pytest.mark.parametrize("genus, profiles, max_codim", CASES)
def test_orbit_sizes_sum_to_labelled_strata(genus, profiles, max_codim):
    labelled = base_strata(genus, profiles, max_codim, labeled=True)
    assert all(s.orbit_size == 1 for s in labelled)
    assert [s.graph for s in labelled] == stable_graphs(genus, len(profiles), max_codim)
    assert sum(s.orbit_size for s in base_strata(genus, profiles, max_codim)) == len(labelled)


def test_six_simple_points_on_the_line():
    # Common knowledge: the boundary divisors of Mbar_{0,6} up to S_6 are the
    # splits 2|4 (C(6,2) = 15 of them) and 3|3 (C(6,3)/2 = 10).
    divisors = [s for s in base_strata(0, [(2, 1, 1)] * 6, 1) if s.codim == 1]
    sizes = sorted(
        (sorted(len(legs) for legs in s.graph.vertex_legs), s.orbit_size) for s in divisors
    )
    assert sizes == [([2, 4], 15), ([3, 3], 10)]


def test_sorted_by_codimension_then_key():
    strata = base_strata(0, [(2, 1)] * 7, 3)
    keys = [(s.codim, s.graph.key) for s in strata]
    assert keys == sorted(keys)
    assert isinstance(strata[0], BaseStratum)


def test_distinct_profiles_give_labelled_strata():
    profiles = [(4,), (3, 1), (2, 2), (2, 1, 1), (1, 1, 1, 1)]
    assert base_strata(0, profiles, 2) == base_strata(0, profiles, 2, labeled=True)


def test_bad_input():
    with pytest.raises(ProfileError, match="degree"):
        base_strata(0, [(2, 1), (2,), (2,)], 1)
    with pytest.raises(ProfileError):
        base_strata(0, [(2, 0), (2,), (2,)], 1)
    with pytest.raises(GraphError):
        base_strata(0, [(2,), (2,)], 0)
    with pytest.raises(GraphError):
        base_strata(1, [(2,)] * 2, -1)
