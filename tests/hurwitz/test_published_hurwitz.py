"""Hurwitz numbers against published formulas and sequences.

Convention under test (docs/theory.md, section 4): labelled branch points, weight
1/|Aut|, unlabelled preimages.
"""

from fractions import Fraction
from math import factorial, prod

import pytest

from covertree.hurwitz.numbers import connected_hurwitz, disconnected_hurwitz, tuple_counts
from covertree.symmetric.partitions import simple
from tests.independent import aut_order, hook_dimension, partition_count, partitions
from tests.quasimodular import f2_coefficients, f3_coefficients, sigma


# --- genus 0 ----------------------------------------------------------------


@pytest.mark.parametrize("d", range(1, 8))
def test_hurwitz_genus_zero_formula(d):
    # A. Hurwitz, Math. Ann. 39 (1891); I. P. Goulden and D. M. Jackson, Proc. AMS
    # 125 (1997): H_0(mu) = r!/|Aut mu| d^{l-3} prod mu_i^{mu_i}/mu_i!, r = d + l - 2,
    # one point of profile mu and r simple points, preimages unlabelled.
    for mu in partitions(d):
        l = len(mu)
        r = d + l - 2
        expected = (
            Fraction(factorial(r), aut_order(mu))
            * Fraction(d) ** (l - 3)
            * prod(Fraction(m**m, factorial(m)) for m in mu)
        )
        assert connected_hurwitz(d, 0, [mu] + [simple(d)] * r) == expected, mu


@pytest.mark.parametrize("d", range(2, 9))
def test_all_simple_genus_zero(d):
    # Hurwitz 1891; Goulden-Jackson 1997: d^{d-3} (2d-2)!/d! for 2d-2 simple points
    expected = Fraction(d) ** (d - 3) * Fraction(factorial(2 * d - 2), factorial(d))
    assert connected_hurwitz(d, 0, [simple(d)] * (2 * d - 2)) == expected


@pytest.mark.parametrize("d", range(2, 7))
def test_genus_one_one_part(d):
    # D. M. Jackson, Trans. AMS 299 (1987/88); OEIS A060603: a d-cycle has
    # (d^2-1) d^{d+1}/24 factorisations into d+1 transpositions; with (d-1)! d-cycles
    # and division by d!, the connected number is (d^2-1) d^d / 24.
    factorisations = Fraction((d * d - 1) * d ** (d + 1), 24)
    expected = factorisations * factorial(d - 1) / factorial(d)
    assert connected_hurwitz(d, 0, [(d,)] + [simple(d)] * (d + 1)) == expected


def test_a060603_first_terms():
    # OEIS A060603 (terms from memory: 1, 27, 640, 15625, 408240 for d = 2..6), the
    # factorisations of a d-cycle into d+1 transpositions, recovered as d * H.
    counts = [connected_hurwitz(d, 0, [(d,)] + [simple(d)] * (d + 1)) * d for d in range(2, 7)]
    assert counts == [1, 27, 640, 15625, 408240]


# --- one-part double Hurwitz numbers -------------------------------------------

_G = 2  # highest genus checked


def _series_s(c: int) -> list[Fraction]:
    # S(ct) = sinh(ct/2)/(ct/2) = sum_n (ct/2)^{2n}/(2n+1)!, coefficients of t^{2n}
    return [Fraction(c ** (2 * n), 4**n * factorial(2 * n + 1)) for n in range(_G + 1)]


def _mul(a, b):
    return [sum(a[i] * b[n - i] for i in range(n + 1)) for n in range(_G + 1)]


def _reciprocal(a):
    out = [Fraction(0)] * (_G + 1)
    out[0] = 1 / a[0]
    for n in range(1, _G + 1):
        out[n] = -sum(a[i] * out[n - i] for i in range(1, n + 1)) / a[0]
    return out


def _gjv(d: int, beta, g: int) -> Fraction:
    # Goulden-Jackson-Vakil, Adv. Math. 198 (2005), the one-part double Hurwitz
    # number H^g_{(d), beta} = r! d^{r-1} [t^{2g}] prod_i S(beta_i t) / S(t),
    # r = 2g - 1 + l(beta) simple points.
    series = _reciprocal(_series_s(1))
    for b in beta:
        series = _mul(series, _series_s(b))
    r = 2 * g - 1 + len(beta)
    return factorial(r) * Fraction(d) ** (r - 1) * series[g]


@pytest.mark.parametrize("g", range(0, _G + 1))
@pytest.mark.parametrize("d", range(2, 8))
def test_one_part_double_hurwitz(d, g):
    # GJV label the preimages of infinity (the points over beta), ours are
    # unlabelled: GJV = ours x |Aut beta|.  By hand for d = 2, beta = (1,1), g = 0:
    # r = 1; S_2 has one transposition t and the tuple (t, 1, t) is the only one,
    # transitive, so ours = 1/2! = 1/2, while GJV = 1! 2^0 [t^0] S(t) = 1 = 1/2 x 2.
    # For beta = (2), g = 0: r = 0, ours = 1/2 (the tuple (t, t)), GJV =
    # 2^{-1} [t^0] S(2t)/S(t) = 1/2, and |Aut (2)| = 1.
    for beta in partitions(d):
        r = 2 * g - 1 + len(beta)
        ours = connected_hurwitz(d, 0, [(d,), beta] + [simple(d)] * r)
        assert ours * aut_order(beta) == _gjv(d, beta, g), beta


def test_one_part_double_hurwitz_by_hand():
    # worked by hand in the comment of test_one_part_double_hurwitz: both are 1/2
    assert connected_hurwitz(2, 0, [(2,), (1, 1), (2,)]) == Fraction(1, 2)
    assert connected_hurwitz(2, 0, [(2,), (2,)]) == Fraction(1, 2)


# --- covers of an elliptic curve -------------------------------------------------

_N = 11  # q-expansions to q^10


def test_genus_two_covers_of_elliptic_curve():
    # R. Dijkgraaf, "Mirror symmetry and elliptic curves" (1995); M. Kaneko and
    # D. Zagier (1995): F_2 = (10 E_2^3 - 6 E_2 E_4 - 4 E_6)/103680 (from memory).
    # F_g is the coefficient of lambda^{2g-2}/(2g-2)! in the generating function of
    # covers with 2g-2 simple points, so our count is (2g-2)! [q^d] F_g, here 2!.
    # OEIS A170991 terms typed from memory.
    f2 = f2_coefficients(_N)
    ours = [connected_hurwitz(d, 1, [simple(d)] * 2) for d in range(2, _N)]
    assert ours == [2 * f2[d] for d in range(2, _N)]
    assert ours[:7] == [2, 16, 60, 160, 360, 672, 1240]  # OEIS A170991


def test_genus_three_covers_of_elliptic_curve():
    # OEIS A170992, "number of genus 3, degree n, simply ramified covers of an
    # elliptic curve" (terms from M. Roth and N. Yui, Mirror symmetry for elliptic
    # curves: the A-model (fermionic) counting, Clay Math. Proc. 11, 2010), whose
    # formula entry (R. Visser, 2023) is the g.f.
    # (-6E_2^6 + 15E_2^4E_4 + 4E_2^3E_6 - 12E_2^2E_4^2 - 12E_2E_4E_6 + 7E_4^3 + 4E_6^2)/1492992.
    # Those numbers already count the 4 simple points labelled, i.e. 4! [q^d] F_3 in
    # the normalisation of the genus-2 test, so no further factor enters; the terms
    # below were read from that entry.
    f3 = f3_coefficients(_N)
    ours = [connected_hurwitz(d, 1, [simple(d)] * 4) for d in range(2, _N)]
    assert ours == [f3[d] for d in range(2, _N)]
    assert ours[:5] == [2, 160, 2448, 18304, 90552]  # OEIS A170992


@pytest.mark.parametrize("d", range(1, 13))
def test_unramified_covers_of_elliptic_curve(d):
    # index-d sublattices of Z^2 number sigma_1(d) (common knowledge); a connected
    # unramified cover is one up to the d sheet labellings / d: H = sigma_1(d)/d.
    # The disconnected number is the number p(d) of partitions (commuting pairs / d!).
    assert connected_hurwitz(d, 1, [(1,) * d]) == Fraction(sigma(1, d), d)
    assert disconnected_hurwitz(d, 1, [(1,) * d]) == partition_count(d)


# --- unramified covers of higher genus surfaces ----------------------------------


@pytest.mark.parametrize("n", range(1, 8))
def test_homomorphisms_of_genus_two_group(n):
    # A. D. Mednykh (1978); Lubotzky-Segal, Subgroup Growth (2003), ch. 14:
    # |Hom(pi_1(Sigma_g), S_n)| = (n!)^{2g-1} sum_lambda (dim lambda)^{2-2g}, g = 2;
    # the dimensions by the hook length formula (tests/independent.py).
    dims = [hook_dimension(shape) for shape in partitions(n)]
    expected = factorial(n) ** 3 * sum(Fraction(1, dim * dim) for dim in dims)
    assert tuple_counts(n, 2, [(1,) * n])[1] == expected
    assert disconnected_hurwitz(n, 2, [(1,) * n]) == expected / factorial(n)


def test_homomorphisms_small_values():
    # every map of the 4 generators to S_2 works: 2^4 (common knowledge); S_3:
    # 6^3 (1 + 1 + 1/4) = 486 by the formula above.
    assert tuple_counts(2, 2, [(1, 1)])[1] == 16
    assert tuple_counts(3, 2, [(1, 1, 1)])[1] == 486


@pytest.mark.parametrize("g", range(1, 6))
def test_index_two_subgroups(g):
    # index-2 subgroups of pi_1(Sigma_g) = nonzero maps H_1 -> Z/2: 2^{2g} - 1
    # (common knowledge).  Subgroups of index n = transitive homs / (n-1)!,
    # so H = subgroups / n.
    assert connected_hurwitz(2, g, [(1, 1)]) * 2 == 2 ** (2 * g) - 1


@pytest.mark.parametrize("g", range(1, 5))
def test_index_three_subgroups(g):
    # OEIS A049293 (Mednykh, Commun. Algebra 16 (1988)): index-3 subgroups of the
    # surface group of Euler characteristic -n, a(n) = 6^{n+1} + 3^{n+1} - 3 2^{n+1} + 1;
    # orientable genus g has n = 2g - 2, and a(2) = 220 for genus 2.
    n = 2 * g - 2
    expected = 6 ** (n + 1) + 3 ** (n + 1) - 3 * 2 ** (n + 1) + 1
    assert connected_hurwitz(3, g, [(1, 1, 1)]) * 3 == expected
    if g == 2:
        assert expected == 220
        assert connected_hurwitz(2, 2, [(1, 1)]) == Fraction(15, 2)


# --- disconnected numbers above the table engine's degrees -------------------


def _content_sum(lam):
    # sum of j - i over the cells (i, j) of the diagram, cell by cell
    return sum(j - i for i, part in enumerate(lam) for j in range(part))


@pytest.mark.parametrize("d", [31, 36])
def test_disconnected_numbers_of_an_elliptic_curve_at_high_degree(d):
    # Frobenius' formula over an elliptic curve (G. Frobenius 1896; S. K. Lando
    # and A. K. Zvonkin, Graphs on Surfaces and Their Applications, 2004,
    # appendix A): H* = sum over lambda |- d of prod_j f_lambda(mu_j), with
    # f_lambda(1^d) = 1 and f_lambda(2, 1^(d-2)) = the content sum of lambda
    # (I. G. Macdonald, Symmetric Functions and Hall Polynomials, 1995, I.7
    # Example 7).  Unramified: p(d) covers; two simple points: sum of c^2.
    assert disconnected_hurwitz(d, 1, [(1,) * d]) == partition_count(d)
    expected = sum(_content_sum(lam) ** 2 for lam in partitions(d))
    assert disconnected_hurwitz(d, 1, [(2,) + (1,) * (d - 2)] * 2) == expected
