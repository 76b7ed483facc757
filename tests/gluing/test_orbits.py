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


def _connected_matchings(text, degree):
    """(orbit test, matching) for every connected matching of a small stratum."""
    base = parse_graph(text)
    profiles = [tuple(p) for p in HurwitzProblem.build(degree, 1, genus=2).profiles]
    specs = special_points(base)
    for choice in balanced_choices(base, degree, profiles):
        m = _Matcher(base, specs, choice)
        for partner in m.matchings():
            if m.connected():
                yield m.orbit_test, dict(partner)


def test_no_prefix_of_a_least_word_is_proved_lesser():
    # a partial matching answers yes only when every completion has a lesser
    # word in its orbit; a least word is such a completion of each of its prefixes
    least = proved = 0
    for test, partner in _connected_matchings("g0{1}, g0{2} | 0-1^2", 4):
        if _brute_has_lesser(test, partner):
            continue
        least += 1
        for s in range(len(test.positions)):
            prefix = {x: partner[x] for x in test.positions[:s]}
            assert test.has_lesser(prefix) is False
            proved += 1
    assert least > 0 and proved > least


class _Counting:
    """Count the letters one unlimited search compares."""

    def __init__(self, test):
        self.test, self.letters = test, 0
        self._letter = test._letter

    def __enter__(self):
        def counted(*args):
            self.letters += 1
            return self._letter(*args)
        self.test._letter = counted
        return self

    def __exit__(self, *exc):
        del self.test._letter


def test_budget_is_the_number_of_letters_and_the_test_can_be_asked_again():
    gave_up = 0
    for test, partner in _connected_matchings("g0, g0{1,2} | 0-0, 0-1", 4):
        expected = _brute_has_lesser(test, partner)
        with _Counting(test) as count:
            assert test.has_lesser(partner) == expected
        letters = count.letters
        assert letters >= 1
        assert test.has_lesser(partner, letters) == expected  # exactly enough
        assert test.has_lesser(partner, letters - 1) is None  # one letter short
        gave_up += 1
        # after giving up mid-search the test is as new
        assert test.has_lesser(partner) == expected
    assert gave_up > 0


def _count_by_hand(base, degree, profiles):
    """(matchings, connected ones, those not least in their orbit, choices with
    a connected matching), counted over the engine's choices with the
    brute-force orbit."""
    specs = special_points(base)
    matchings = connected = lesser = choices = 0
    for choice in balanced_choices(base, degree, profiles):
        m = _Matcher(base, specs, choice)
        any_connected = False
        for partner in m.matchings():
            matchings += 1
            if m.connected():
                connected += 1
                any_connected = True
                lesser += _brute_has_lesser(m.orbit_test, dict(partner))
        choices += any_connected
    return matchings, connected, lesser, choices


@pytest.mark.parametrize("text", ["g0, g0{1,2} | 0-0, 0-1", "g0{1}, g0{2} | 0-1^2"])
def test_stats_count_the_work(monkeypatch, text):
    import covertree.gluing.covers as covers

    base = parse_graph(text)
    profiles = [tuple(p) for p in HurwitzProblem.build(4, 1, genus=2).profiles]
    matchings, connected, lesser, choices = _count_by_hand(base, 4, profiles)
    assert connected > lesser > 0 and choices > 1
    stats = covers.GluingStats()
    found = len(list(covers.glued_covers(base, 4, profiles, stats=stats)))
    assert (stats.matchings, stats.rejected, stats.codes, stats.untested) == (
        matchings, lesser, connected - lesser, 0)
    assert stats.covers == found
    # with no budget at all every choice gives up at its first connected matching
    monkeypatch.setattr(covers, "ORBIT_TEST_BUDGET", 0)
    stats = covers.GluingStats()
    assert len(list(covers.glued_covers(base, 4, profiles, stats=stats))) == found
    assert (stats.matchings, stats.rejected, stats.codes, stats.untested) == (
        matchings, 0, connected, choices)
