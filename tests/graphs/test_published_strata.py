"""Numbers of boundary strata of Mbar_{g,n} against published counts."""

from math import comb, prod

import pytest

from covertree.graphs import stable_graphs


def _by_codim(genus, n):
    counts = {}
    for g in stable_graphs(genus, n):
        counts[g.codim] = counts.get(g.codim, 0) + 1
    return counts


# OEIS A000311 (Schroeder's fourth problem: series-reduced rooted trees with
# n labelled leaves), offset 0: 0, 1, 1, 4, 26, 236, 2752, 39208 (terms from memory).  The strata
# of Mbar_{0,n} are counted by A000311(n-1).  (n = 8 is in the benchmark.)
A000311 = [0, 1, 1, 4, 26, 236, 2752, 39208]


@pytest.mark.parametrize("n", [3, 4, 5, 6, 7])
def test_genus_zero_strata_are_schroeder_numbers(n):
    assert len(stable_graphs(0, n)) == A000311[n - 1]


@pytest.mark.parametrize("n", [3, 4, 5, 6, 7])
def test_genus_zero_boundary_divisors(n):
    # Classical (common knowledge): the boundary divisors D_S of Mbar_{0,n}
    # are the splits S | S^c with |S|, |S^c| >= 2: 2^{n-1} - n - 1 of them.
    assert _by_codim(0, n).get(1, 0) == 2 ** (n - 1) - n - 1


@pytest.mark.parametrize("n", [3, 4, 5, 6, 7])
def test_genus_zero_points_are_trivalent_trees(n):
    # Classical (common knowledge): the zero-dimensional strata of Mbar_{0,n}
    # are the trivalent trees with n labelled leaves: (2n-5)!!.
    double_factorial = prod(range(2 * n - 5, 0, -2))
    assert _by_codim(0, n)[n - 3] == double_factorial


@pytest.mark.parametrize("genus, expected", [(2, 7), (3, 42), (4, 379)])
def test_unmarked_strata_count_cells_of_tropical_moduli(genus, expected):
    # M. Chan, Combinatorics of the tropical Torelli map, Algebra & Number
    # Theory 6 (2012): the tropical moduli space M_g^trop has 7, 42, 379, 4555
    # cells for g = 2, 3, 4, 5 (the stable graphs of genus g; from memory).  g = 5 is in
    # the benchmark.
    assert len(stable_graphs(genus, 0)) == expected


@pytest.mark.parametrize("genus, expected", [(2, 2), (3, 5), (4, 17)])
def test_unmarked_top_codimension_strata_are_trivalent(genus, expected):
    # S. Brodsky, M. Joswig, R. Morrison, B. Sturmfels, Moduli of tropical
    # plane curves, Research in the Mathematical Sciences 2 (2015): there are
    # 2, 5, 17, 71 trivalent (maximal) genus-g graphs for g = 2, 3, 4, 5 (from memory).
    top = [g for g in stable_graphs(genus, 0) if g.codim == 3 * genus - 3]
    assert len(top) == expected
    assert all(set(g.vertex_genera) == {0} for g in top)
    assert all(g.valence(v) == 3 for g in top for v in range(g.n_vertices))


def test_one_pointed_genus_one():
    # By hand (common knowledge): Mbar_{1,1} has the open part and the
    # nodal rational curve.
    assert len(stable_graphs(1, 1)) == 2


def test_two_pointed_genus_one():
    # By hand (common knowledge): Mbar_{1,2} has 5 strata: the open part;
    # two divisors (irreducible nodal; elliptic tail with a rational
    # component carrying both points); two points (a nodal rational curve
    # with a rational tail carrying both points; two rational curves meeting
    # twice, one point on each).
    assert _by_codim(1, 2) == {0: 1, 1: 2, 2: 2}


@pytest.mark.parametrize("genus, n", [(2, 0), (3, 0), (4, 0), (1, 3), (2, 2), (3, 1), (0, 6)])
def test_boundary_divisors_of_mbar_gn(genus, n):
    # Common knowledge (Deligne-Mumford, Knudsen): the boundary divisors of
    # Mbar_{g,n} are delta_irr (when g >= 1) and delta_{i,S}, one for each
    # unordered pair {(i, S), (g-i, S^c)} with 2i - 2 + |S| + 1 > 0 on both sides.
    ordered = sum(
        comb(n, s)
        for i in range(genus + 1)
        for s in range(n + 1)
        if 2 * i + s >= 2 and 2 * (genus - i) + (n - s) >= 2
    )
    # (i, S) is its own complement only for n = 0 and i = g/2.
    self_paired = 1 if n == 0 and genus % 2 == 0 else 0
    expected = (genus >= 1) + (ordered + self_paired) // 2
    assert _by_codim(genus, n)[1] == expected
