"""Enumeration of stable graphs: completeness via automorphism sums, and
properties of the list."""

from fractions import Fraction
from itertools import product
from math import factorial

import pytest

from covertree.errors import GraphError
from covertree.graphs import StableCurveGraph, stable_graphs


def _connected(n, edges):
    parent = list(range(n))

    def find(v):
        while parent[v] != v:
            v = parent[v]
        return v

    for a, b in edges:
        parent[find(a)] = find(b)
    return len({find(v) for v in range(n)}) == 1


def brute_mass(genus, n, n_edges):
    """sum 1/|Aut G| over stable graphs with n_edges edges, by counting
    fully labelled structures.

    A labelled structure has vertices 0..V-1 with genera, E edges each with an
    ordered pair of ends, and a vertex for each leg.  The group
    S_V x (S_E acting on edges, (Z/2)^E flipping them) acts on these with
    stabilisers the half-edge automorphism groups, so the orbit-weighted sum is
    the number of structures divided by V! E! 2^E.
    """
    total = Fraction(0)
    for n_vertices in range(1, n_edges + 2):
        genus_sum = genus - (n_edges - n_vertices + 1)
        if genus_sum < 0:
            continue
        count = 0
        for ends in product(range(n_vertices), repeat=2 * n_edges):
            edges = list(zip(ends[0::2], ends[1::2]))
            if not _connected(n_vertices, edges):
                continue
            degree = [0] * n_vertices
            for v in ends:
                degree[v] += 1
            for genera in product(range(genus_sum + 1), repeat=n_vertices):
                if sum(genera) != genus_sum:
                    continue
                for at in product(range(n_vertices), repeat=n):
                    valence = degree[:]
                    for v in at:
                        valence[v] += 1
                    if all(2 * g - 2 + valence[v] > 0 for v, g in enumerate(genera)):
                        count += 1
        total += Fraction(count, factorial(n_vertices) * factorial(n_edges) * 2**n_edges)
    return total


@pytest.mark.parametrize(
    "genus, n",
    [(2, 0), (1, 1), (1, 2), (0, 5), (1, 3), (2, 1), (3, 0)],
)
def test_automorphism_sums_match_brute_force(genus, n):
    top = 3 * genus - 3 + n
    for k in range(min(top, 3) + 1):
        listed = sum(Fraction(1, g.automorphisms) for g in stable_graphs(genus, n) if g.codim == k)
        assert listed == brute_mass(genus, n, k), (genus, n, k)


@pytest.mark.parametrize("genus, n", [(0, 6), (1, 3), (2, 2), (3, 1), (4, 0)])
def test_list_is_sorted_distinct_stable_and_of_the_type(genus, n):
    graphs = stable_graphs(genus, n)
    assert [(g.codim, g.key) for g in graphs] == sorted((g.codim, g.key) for g in graphs)
    assert len(set(graphs)) == len(graphs)
    for g in graphs:
        assert isinstance(g, StableCurveGraph) and g.is_stable()
        assert g.genus == genus
        assert sorted(j for legs in g.vertex_legs for j in legs) == list(range(1, n + 1))


def test_max_codim_truncates_and_caps():
    full = stable_graphs(2, 1)
    assert stable_graphs(2, 1, max_codim=2) == [g for g in full if g.codim <= 2]
    assert stable_graphs(2, 1, max_codim=99) == full
    assert [str(g) for g in stable_graphs(0, 5, max_codim=0)] == ["g0{1,2,3,4,5}"]


@pytest.mark.parametrize("genus, n", [(0, 0), (0, 1), (0, 2), (1, 0), (-1, 4), (2, -1)])
def test_unstable_types_are_rejected(genus, n):
    with pytest.raises(GraphError):
        stable_graphs(genus, n)


def test_negative_codimension_is_rejected():
    with pytest.raises(GraphError, match="codimension"):
        stable_graphs(2, 0, max_codim=-1)


def test_results_are_fresh_lists():
    first = stable_graphs(0, 4)
    first.clear()
    assert len(stable_graphs(0, 4)) == 4


def test_layer_guard_stops_between_codimensions_and_names_a_feasible_one():
    # Mbar_{1,3} under 10^4 steps: the estimate before the start lets it through, the exact
    # count of the candidates of a later codimension stops it; what the refusal says is checked
    # against the unlimited listing: the strata found so far, and the named codimension lists.
    import re

    from covertree.errors import TooLargeError

    reached = []
    with pytest.raises(TooLargeError) as info:
        stable_graphs(1, 3, max_work=10**4, on_layer=lambda k, found: reached.append((k, found)))
    line = str(info.value)
    match = re.fullmatch(r"the strata of Mbar_\{1,3\} up to codim 3 \(up to codim (\d), after (\d+) strata\) would "
                         r"take (\d+) steps, beyond the work limit 10\^4 \(--max-work\); the largest feasible codim "
                         r"is (\d)", line)
    assert match, line
    k, found, steps, feasible = map(int, match.groups())
    assert found == len(stable_graphs(1, 3, max_codim=k - 1)) and feasible == k - 1 and steps > 10**4
    assert reached == [(j, len(stable_graphs(1, 3, max_codim=j - 1)) if j else 0) for j in range(k + 1)]
    assert len(stable_graphs(1, 3, max_codim=feasible, max_work=10**4)) == found


@pytest.mark.parametrize("genus, n, codim, limit", [
    (6, 4, 19, 10**8), (3, 6, 15, 10**6), (1, 9, 9, 10**5), (0, 12, 9, 10**6), (0, 4, 1, 10), (2, 0, 3, 10),
    (0, 4, 1, 100), (1, 5, 5, 10**4), (2, 2, 5, 3000), (1, 2, 2, 150), (3, 2, 7, 10**4), (1, 3, 3, 1000),
    (2, 0, 3, 100),
])
def test_refusal_names_values_that_are_feasible(genus, n, codim, limit):
    # every value the refusal names fits the limit and the next one does not, by the same
    # estimate (covertree.limits.strata_work) the refusal itself is decided by
    import re

    from covertree.errors import TooLargeError
    from covertree.graphs.enumerate import check_strata
    from covertree.limits import strata_work

    assert strata_work(genus, n, codim) > limit
    with pytest.raises(TooLargeError) as info:
        check_strata(genus, n, codim, limit)
    line = str(info.value)
    assert line.startswith(f"the strata of Mbar_{{{genus},{n}}} up to codim {codim} would take ")
    tail = line.split("(--max-work); ", 1)[1]
    parts = tail.removesuffix(" at that codim").split(", ")
    assert tail.endswith(" at that codim") == (len(parts) > 1)
    if parts[0] == "no codimension is feasible":
        assert strata_work(genus, n, 0) > limit
    else:
        k = int(re.fullmatch(r"the largest feasible codim is (\d+)", parts[0]).group(1))
        assert strata_work(genus, n, k) <= limit < strata_work(genus, n, k + 1)
    named = {"genus": None, "points": None}
    for part in parts[1:]:
        if match := re.fullmatch(rf"genus (\d+) with {n} points?", part):
            g = named["genus"] = int(match.group(1))
            assert part.endswith("points") == (n != 1)
            assert strata_work(g, n, codim) <= limit < strata_work(g + 1, n, codim) and 2 * g - 2 + n > 0
        else:
            m = named["points"] = int(re.fullmatch(rf"(\d+) points? at genus {genus}", part).group(1))
            assert part.endswith("points at genus " + str(genus)) == (m != 1)
            assert strata_work(genus, m, codim) <= limit < strata_work(genus, m + 1, codim)
            assert 2 * genus - 2 + m > 0
    # a value left unnamed has no feasible choice, or only an unstable one
    if named["genus"] is None:
        fits = [g for g in range(genus + 1) if strata_work(g, n, codim) <= limit]
        assert not fits or 2 * max(fits) - 2 + n <= 0
    if named["points"] is None:
        fits = [m for m in range(n + 1) if strata_work(genus, m, codim) <= limit]
        assert not fits or 2 * genus - 2 + max(fits) <= 0
    check_strata(genus, n, codim, strata_work(genus, n, codim))  # at the estimate itself: allowed
    check_strata(genus, n, codim, None)


@pytest.mark.parametrize("codim", [True, -1, 1.0])
def test_codimension_must_be_an_integer(codim):
    with pytest.raises(GraphError) as info:
        stable_graphs(0, 4, max_codim=codim)
    assert str(info.value) == f"the codimension must be an integer >= 0, got {codim!r}"


def test_a_listing_beyond_the_limit_is_refused_before_it_starts():
    def started(k, found):
        raise AssertionError(f"codimension {k} was listed")

    from covertree.errors import TooLargeError

    with pytest.raises(TooLargeError, match=r"^the strata of Mbar_\{6,4\} up to codim 19 would take"):
        stable_graphs(6, 4, max_work=10**8, on_layer=started)


@pytest.mark.parametrize("genus, n, message", [
    (-1, 3, "the genus must be an integer >= 0, got -1"),
    (True, 3, "the genus must be an integer >= 0, got True"),
    (0, -2, "the number of legs must be an integer >= 0, got -2"),
    (0, 4.0, "the number of legs must be an integer >= 0, got 4.0"),
    (1, 0, "there are no stable curves of type (g, n) = (1, 0): need 2g - 2 + n > 0"),
])
def test_type_errors_in_full(genus, n, message):
    with pytest.raises(GraphError) as info:
        stable_graphs(genus, n)
    assert str(info.value) == message
