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

# ----------------------------------------------------------------- q-series


def _sigma(k: int, n: int) -> int:
    return sum(e**k for e in range(1, n + 1) if n % e == 0)


def _eisenstein(constant: int, k: int, terms: int) -> list[Fraction]:
    """``1 + constant * sum sigma_k(n) q^n`` (E_2: -24, sigma_1; E_4: 240, sigma_3;
    E_6: -504, sigma_5; common knowledge)."""
    return [Fraction(1)] + [Fraction(constant * _sigma(k, n)) for n in range(1, terms)]


def _mul(*series: list[Fraction]) -> list[Fraction]:
    out = series[0]
    for s in series[1:]:
        out = [sum(out[i] * s[n - i] for i in range(n + 1)) for n in range(len(out))]
    return out


def _combine(terms: list[tuple[int, list[Fraction]]], denominator: int) -> list[Fraction]:
    n = len(terms[0][1])
    return [sum(c * s[i] for c, s in terms) / denominator for i in range(n)]


def dijkgraaf_f2(terms: int) -> list[Fraction]:
    """R. Dijkgraaf, *Mirror symmetry and elliptic curves* (1995), genus 2:
    ``F_2 = (10 E_2^3 - 6 E_2 E_4 - 4 E_6) / 103680`` (also Kaneko-Zagier 1995)."""
    e2, e4, e6 = _eisenstein(-24, 1, terms), _eisenstein(240, 3, terms), _eisenstein(-504, 5, terms)
    return _combine([(10, _mul(e2, e2, e2)), (-6, _mul(e2, e4)), (-4, e6)], 103680)


def dijkgraaf_f3(terms: int) -> list[Fraction]:
    """Genus 3 (Dijkgraaf 1995; OEIS A170992 gives this generating function):
    ``(-6E_2^6 + 15E_2^4E_4 + 4E_2^3E_6 - 12E_2^2E_4^2 - 12E_2E_4E_6 + 7E_4^3 + 4E_6^2)/1492992``."""
    e2, e4, e6 = _eisenstein(-24, 1, terms), _eisenstein(240, 3, terms), _eisenstein(-504, 5, terms)
    return _combine([
        (-6, _mul(e2, e2, e2, e2, e2, e2)), (15, _mul(e2, e2, e2, e2, e4)), (4, _mul(e2, e2, e2, e6)),
        (-12, _mul(e2, e2, e4, e4)), (-12, _mul(e2, e4, e6)), (7, _mul(e4, e4, e4)), (4, _mul(e6, e6)),
    ], 1492992)


def test_series_start_as_published():
    # OEIS A126858 starts 1, 8, 30, 80 (q^2..q^5) and A170992 starts 2, 160, 2448
    # (from memory; the catalogue checks below use the formulas, not these lists)
    assert dijkgraaf_f2(6)[2:] == [1, 8, 30, 80]
    assert dijkgraaf_f3(5)[2:] == [2, 160, 2448]


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
    expected = 2 * dijkgraaf_f2(degree + 1)[degree]
    _assert_every_stratum(HurwitzProblem.build(degree, 1, genus=2), 2, expected)


@pytest.mark.parametrize("degree", [2, 3])
def test_genus_three_covers_of_an_elliptic_curve(degree):
    # Dijkgraaf 1995 / OEIS A170992: our number (4 labelled simple points) is [q^d] F_3
    expected = dijkgraaf_f3(degree + 1)[degree]
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
    series = _mul(*(_series_s(terms, b) for b in beta), _inverse(_series_s(terms, 1)))
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
    _assert_every_stratum(problem, 1, Fraction(_sigma(1, d), d))


@pytest.mark.parametrize("d,subgroups", [
    (2, 2**4 - 1),  # index-2 subgroups of a genus-2 surface group: 2^{2g} - 1 (common knowledge)
    (3, 220),  # index-3 subgroups: 220 (Mednykh 1988; OEIS A049293)
])
def test_unramified_covers_of_a_genus_two_curve(d, subgroups):
    # a connected cover of degree d is a subgroup of index d up to the d choices
    # of base sheet: H = (#subgroups of index d) / d; one marked point 1^d
    problem = HurwitzProblem.build(d, 2, profiles=[(1,) * d])
    _assert_every_stratum(problem, 2, Fraction(subgroups, d))
