"""Catalogue totals against published Hurwitz numbers.

The degeneration identity says that the covers over a fixed curve of *every*
base stratum have total weight ``sum mult/|Aut|`` equal to the connected Hurwitz
number.  Here the total of every stratum listed is compared not with covertree's
own Hurwitz numbers but with published closed formulas and sequences, each
evaluated in the test from its formula (the source beside each check).
"""

from __future__ import annotations

from fractions import Fraction
from math import factorial, prod

import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.hurwitz.problem import HurwitzProblem
from tests.quasimodular import f2_coefficients, f3_coefficients, multiply, sigma

# ----------------------------------------------------------------- q-series


def _assert_every_stratum(problem: HurwitzProblem, max_codim: int, expected: Fraction) -> None:
    cat = build_catalogue(problem, max_codim=max_codim)
    assert cat.strata
    for s in cat.strata:
        assert s.total_weight == expected, s.base.graph.notation
    assert cat.hurwitz_number == expected


@pytest.mark.parametrize("degree", [2, 3, 4, 5])
def test_genus_two_covers_of_an_elliptic_curve(degree):
    # Dijkgraaf 1995 / OEIS A170991: covers with 2 labelled simple branch points,
    # weight 1/|Aut|, number 2 [q^d] F_2 (the 2 = 2! labellings of the branch points)
    expected = 2 * f2_coefficients(degree + 1)[degree]
    _assert_every_stratum(HurwitzProblem.build(degree, 1, genus=2), 2, expected)


@pytest.mark.parametrize("degree", [2, 3])
def test_genus_three_covers_of_an_elliptic_curve(degree):
    # OEIS A170992 (g.f. in its formula entry, R. Visser 2023; terms from Roth-Yui
    # 2010): its coefficients count covers with 4 labelled simple points, ours
    expected = f3_coefficients(degree + 1)[degree]
    _assert_every_stratum(HurwitzProblem.build(degree, 1, genus=3), 2, expected)


def hurwitz_genus_zero(mu: tuple[int, ...]) -> Fraction:
    """A. Hurwitz (1891), Goulden-Jackson (1997):
    ``H_0(mu) = r!/|Aut mu| * d^{l-3} * prod mu_i^mu_i / mu_i!``, ``r = d + l - 2``."""
    d, length = sum(mu), len(mu)
    r = d + length - 2
    aut = prod(factorial(mu.count(m)) for m in set(mu))
    return (Fraction(factorial(r), aut) * Fraction(d) ** (length - 3)
            * prod(Fraction(m**m, factorial(m)) for m in mu))


@pytest.mark.parametrize("mu,max_codim", [
    ((3,), 2), ((2, 1), 2), ((1, 1, 1), 1), ((4,), 2), ((3, 1), 2), ((2, 2), 2), ((2, 1, 1), 1),
])
def test_genus_zero_single_hurwitz_numbers(mu, max_codim):
    d = sum(mu)
    problem = HurwitzProblem.build(d, 0, genus=0, profiles=[mu])
    assert problem.points == d + len(mu) - 1
    _assert_every_stratum(problem, max_codim, hurwitz_genus_zero(mu))


@pytest.mark.parametrize("d", [3, 4])
def test_genus_one_one_part_numbers(d):
    # D. M. Jackson (1988), OEIS A060603: a d-cycle has (d^2-1) d^{d+1}/24
    # factorisations into d+1 transpositions, so the genus-1 one-part Hurwitz
    # number is (d^2-1) d^d / 24
    problem = HurwitzProblem.build(d, 0, genus=1, profiles=[(d,)])
    _assert_every_stratum(problem, 1, Fraction((d * d - 1) * d**d, 24))


def _series_s(terms: int, scale: int) -> list[Fraction]:
    """Coefficients of ``S(scale t) = sinh(scale t/2)/(scale t/2) = sum (scale t/2)^{2k}/(2k+1)!``
    in powers of t (common knowledge)."""
    out = [Fraction(0)] * terms
    for k in range(0, (terms + 1) // 2):
        if 2 * k < terms:
            out[2 * k] = Fraction(scale ** (2 * k), 4**k * factorial(2 * k + 1))
    return out


def _inverse(series: list[Fraction]) -> list[Fraction]:
    out = [Fraction(1) / series[0]] + [Fraction(0)] * (len(series) - 1)
    for n in range(1, len(series)):
        out[n] = -sum(series[i] * out[n - i] for i in range(1, n + 1)) / series[0]
    return out


def gjv_one_part(beta: tuple[int, ...], genus: int) -> Fraction:
    """Goulden-Jackson-Vakil, *Towards the geometry of double Hurwitz numbers*,
    Adv. Math. 198 (2005), the one-part formula: ``r! d^{r-1} [t^{2g}] prod S(beta_i t)/S(t)``,
    ``r = 2g - 1 + l(beta)``, the preimages of infinity labelled."""
    d, terms = sum(beta), 2 * genus + 1
    r = 2 * genus - 1 + len(beta)
    series = multiply(*(_series_s(terms, b) for b in beta), _inverse(_series_s(terms, 1)))
    return factorial(r) * Fraction(d) ** (r - 1) * series[2 * genus]


@pytest.mark.parametrize("beta,genus,max_codim", [
    ((2, 1), 0, 2), ((2, 1), 1, 2), ((3, 1), 0, 2), ((2, 2), 1, 2), ((2, 1, 1), 1, 1),
])
def test_one_part_double_hurwitz_numbers(beta, genus, max_codim):
    d = sum(beta)
    problem = HurwitzProblem.build(d, 0, genus=genus, profiles=[(d,), beta])
    aut = prod(factorial(beta.count(b)) for b in set(beta))
    # GJV label the preimages of infinity: their number is ours times |Aut beta|
    _assert_every_stratum(problem, max_codim, gjv_one_part(beta, genus) / aut)


@pytest.mark.parametrize("d", [2, 3, 4])
def test_unramified_covers_of_an_elliptic_curve(d):
    # index-d sublattices of Z^2 number sigma_1(d), each a cover with d deck
    # transformations (common knowledge): H = sigma_1(d)/d; one marked point 1^d
    problem = HurwitzProblem.build(d, 1, profiles=[(1,) * d])
    _assert_every_stratum(problem, 1, Fraction(sigma(1, d), d))


@pytest.mark.parametrize("d,subgroups", [
    (2, 2**4 - 1),  # index-2 subgroups of a genus-2 surface group: 2^{2g} - 1 (common knowledge)
    (3, 220),  # index-3 subgroups: 220 (Mednykh 1988; OEIS A049293)
])
def test_unramified_covers_of_a_genus_two_curve(d, subgroups):
    # a connected cover of degree d is a subgroup of index d up to the d choices
    # of base sheet: H = (#subgroups of index d) / d; one marked point 1^d
    problem = HurwitzProblem.build(d, 2, profiles=[(1,) * d])
    _assert_every_stratum(problem, 2, Fraction(subgroups, d))
