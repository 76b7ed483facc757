"""The orbit test of the list engine (:mod:`covertree.gluing.orbits`) against
a brute-force orbit: for every connected matching the engine reaches on a few
small strata, the word is compared with the words of its images under every
element of the group ``G`` of the choice (twins permuted, each piece moved by
its deck group), listed in full."""

from __future__ import annotations

from itertools import permutations, product

import pytest

from covertree.gluing.covers import _Matcher, balanced_choices
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.monodromy.local import special_points


def _group(test):
    """Every ``h`` of ``G`` as a map of ports, through the piece maps."""
    classes = sorted({tuple(c) for c in test.classes})
    for perms in product(*(permutations(c) for c in classes)):
        image = {a: b for c, p in zip(classes, perms) for a, b in zip(c, p)}
        for acts in product(*(test.actions[j] for j in range(len(test.classes)))):
            yield image, acts


def _word(test, partner, image, acts):
    """The word of ``h^-1 M h``: letter ``h^-1(M(h(x)))`` per position ``x``."""
    inverse = {b: a for a, b in image.items()}
    letters = []
    for j, p, c in test.positions:
        k, q, d = partner[(image[j], p, acts[j][0][(p, c)])]
        source = inverse[k]
        letters.append((source, acts[source][1][(q, d)]))
    return letters


def _brute_has_lesser(test, partner) -> bool:
    own = [(partner[x][0], partner[x][2]) for x in test.positions]
    return any(_word(test, partner, image, acts) < own for image, acts in _group(test))


@pytest.mark.parametrize("text, degree", [
    ("g0{1}, g0{2} | 0-1^2", 4),
    ("g0, g0{1,2} | 0-0, 0-1", 4),
    ("g0{1,2}, g1 | 0-1", 4),
])
def test_orbit_test_matches_brute_force(text, degree):
    base = parse_graph(text)
    profiles = [tuple(p) for p in HurwitzProblem.build(degree, 1, genus=2).profiles]
    specs = special_points(base)
    checked = lesser = 0
    for choice in balanced_choices(base, degree, profiles):
        m = _Matcher(base, specs, choice)
        for partner in m.matchings():
            if m.connected():
                expected = _brute_has_lesser(m.orbit_test, dict(partner))
                assert m.orbit_test.has_lesser(partner) == expected
                checked += 1
                lesser += expected
    assert checked > lesser > 0
