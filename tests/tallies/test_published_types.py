"""The type engine against published generating functions: covers of an
elliptic curve with simple branching, every boundary stratum of codimension at
most one (each stratum's total is the Hurwitz number by the degeneration
identity, so each must equal the published coefficient).

Convention: labelled branch points, weight 1/|Aut|, unlabelled preimages
(THEORY.md section 5), the convention of the sequences below.
"""

from fractions import Fraction

import pytest

from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import tally_catalogue


def _sigma(k: int, n: int) -> int:
    return sum(e**k for e in range(1, n + 1) if n % e == 0)


def _eisenstein(n: int) -> tuple[list[int], list[int], list[int]]:
    """q-expansions to order q^(n-1) of E_2, E_4, E_6 (common knowledge:
    E_2 = 1 - 24 sum sigma_1(m) q^m, E_4 = 1 + 240 sum sigma_3, E_6 = 1 - 504 sum sigma_5)."""
    e2 = [1] + [-24 * _sigma(1, m) for m in range(1, n)]
    e4 = [1] + [240 * _sigma(3, m) for m in range(1, n)]
    e6 = [1] + [-504 * _sigma(5, m) for m in range(1, n)]
    return e2, e4, e6


def _mul(*series: list) -> list:
    out = series[0]
    for s in series[1:]:
        out = [sum(out[i] * s[m - i] for i in range(m + 1)) for m in range(len(out))]
    return out


def _combine(terms, n: int, denominator: int) -> list[Fraction]:
    total = [0] * n
    for coefficient, factors in terms:
        product = _mul(*factors)
        total = [a + coefficient * b for a, b in zip(total, product)]
    return [Fraction(x, denominator) for x in total]


def genus_two(n: int) -> list[Fraction]:
    """Coefficients of F_2 = (10 E_2^3 - 6 E_2 E_4 - 4 E_6) / 103680
    (R. Dijkgraaf, *Mirror symmetry and elliptic curves*, 1995; M. Kaneko and
    D. Zagier, *A generalized Jacobi theta function and quasimodular forms*, 1995)."""
    e2, e4, e6 = _eisenstein(n)
    return _combine([(10, [e2, e2, e2]), (-6, [e2, e4]), (-4, [e6])], n, 103680)


def genus_three(n: int) -> list[Fraction]:
    """Coefficients of (-6E_2^6 + 15E_2^4E_4 + 4E_2^3E_6 - 12E_2^2E_4^2 -
    12E_2E_4E_6 + 7E_4^3 + 4E_6^2)/1492992 (Kaneko-Zagier 1995; OEIS A170992)."""
    e2, e4, e6 = _eisenstein(n)
    terms = [
        (-6, [e2] * 6), (15, [e2] * 4 + [e4]), (4, [e2] * 3 + [e6]), (-12, [e2, e2, e4, e4]),
        (-12, [e2, e4, e6]), (7, [e4] * 3), (4, [e6, e6]),
    ]
    return _combine(terms, n, 1492992)


def test_generating_functions_reproduce_the_oeis_terms():
    # OEIS A170991 (genus 2): 2, 16, 60, 160, 360, 672, 1240 for d = 2..8, = 2 x A126858
    assert [2 * c for c in genus_two(9)[2:]] == [2, 16, 60, 160, 360, 672, 1240]
    # OEIS A170992 (genus 3): 2, 160, 2448, 18304, 90552 for d = 2..6
    assert genus_three(7)[2:] == [2, 160, 2448, 18304, 90552]


@pytest.mark.parametrize("d", [*range(2, 15), 16, 20])
def test_genus_two_covers_of_an_elliptic_curve(d):
    # Dijkgraaf 1995 / OEIS A170991: H = 2 [q^d] F_2, over every stratum of
    # Mbar_{1,2} of codimension <= 1
    expected = 2 * genus_two(d + 1)[d]
    tallies = tally_catalogue(HurwitzProblem.build(d, 1, genus=2), max_codim=1)
    assert len(tallies.strata) == 3
    assert [t.total_weight for t in tallies.strata] == [expected] * 3


@pytest.mark.parametrize("d", range(2, 8))
def test_genus_three_covers_of_an_elliptic_curve(d):
    # Kaneko-Zagier 1995 / OEIS A170992: H = [q^d] of the genus-3 generating
    # function, over every stratum of Mbar_{1,4} (orbits) of codimension <= 1
    expected = genus_three(d + 1)[d]
    tallies = tally_catalogue(HurwitzProblem.build(d, 1, genus=3), max_codim=1)
    assert len(tallies.strata) == 5
    assert [t.total_weight for t in tallies.strata] == [expected] * len(tallies.strata)
