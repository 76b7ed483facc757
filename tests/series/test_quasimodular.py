"""Quasimodular forms: bases, expansions and identification."""

from fractions import Fraction

import pytest

from covertree.errors import InputError
from covertree.series.quasimodular import Monomial, eisenstein, expansion, identify, monomials, sigma
from tests.quasimodular import eisenstein as reference_eisenstein


def test_eisenstein_series_agree_with_the_tests_reference():
    # E_2, E_4, E_6 (common knowledge), as typed in tests/quasimodular.py
    e2, e4, e6 = reference_eisenstein(12)
    assert (list(eisenstein(2, 11)), list(eisenstein(4, 11)), list(eisenstein(6, 11))) == (e2, e4, e6)


def test_e4_squared_is_e8_and_e4_e6_is_e10():
    # E_8 = E_4^2 and E_10 = E_4 E_6 (dimension one; common knowledge):
    # E_8 = 1 + 480 sum sigma_7(n) q^n, E_10 = 1 - 264 sum sigma_9(n) q^n.
    assert list(expansion(Monomial(0, 2, 0), 8)) == [1] + [480 * sigma(7, n) for n in range(1, 9)]
    assert list(expansion(Monomial(0, 1, 1), 8)) == [1] + [-264 * sigma(9, n) for n in range(1, 9)]


def test_delta_is_identified_at_weight_twelve():
    # Ramanujan's Delta = q prod (1 - q^n)^24 = (E4^3 - E6^2)/1728 (common knowledge)
    n = 16
    series = [0, 1] + [0] * (n - 1)
    for m in range(1, n + 1):
        for _ in range(24):
            series = [series[i] - (series[i - m] if i >= m else 0) for i in range(n + 1)]
    found = identify(series, 12)
    assert found.text == "(E4^3 - E6^2)/1728" and found.checked == n + 1 - 7


def test_bases_have_the_dimensions_of_the_quasimodular_forms():
    # dim of weight-2k quasimodular forms = number of (a, b, c), 2a+4b+6c = 2k
    assert [len(monomials(w)) for w in range(0, 14, 2)] == [1, 1, 2, 3, 4, 5, 7]
    assert all(m.weight <= 8 for m in monomials(8, mixed=True)) and len(monomials(8, mixed=True)) == 1 + 1 + 2 + 3 + 4


@pytest.mark.parametrize("weight", [-2, 3, "4"])
def test_bad_weights_are_refused(weight):
    with pytest.raises(InputError, match="weight"):
        monomials(weight)


def test_too_short_a_series_says_how_many_coefficients_are_needed():
    with pytest.raises(InputError, match="need at least 8"):
        identify([0] * 7, 12)


def test_a_wrong_coefficient_is_caught_by_the_checks():
    series = [Fraction(x) for x in expansion(Monomial(3, 0, 0), 10)]
    series[9] += Fraction(1, 7)
    found = identify(series, 6)
    assert not found.found and found.mismatch[0] == 9 and found.checked == 9 - 3


def test_renderings_of_forms():
    found = identify([Fraction(3, 4) * x for x in expansion(Monomial(0, 0, 1), 5)], 6)
    assert found.text == "3/4 E6" and found.latex == r"\frac{3}{4}E_6"
    found = identify([2 * x + 4 * y for x, y in zip(expansion(Monomial(1, 0, 0), 5), expansion(Monomial(0, 0, 0), 5))],
                     2, mixed=True)
    assert found.text == "2 (2 + E2)" and found.latex == r"2\left(2 + E_2\right)"
    assert identify([0] * 6, 4).text == "0"
