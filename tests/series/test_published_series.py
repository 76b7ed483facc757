"""Generating series of covertree's own counts identified as the published
quasimodular forms, with extra coefficients verified."""

from fractions import Fraction

import pytest
import sympy

from covertree.series.family import Family, ProfileShape
from covertree.series.generating import degree_series
from covertree.series.quantities import Quantity
from covertree.series.quasimodular import sigma
from tests.quasimodular import f2_coefficients, f3_coefficients

E2, E4, E6 = sympy.symbols("E2 E4 E6")


def test_genus_two_series_is_dijkgraafs_form():
    # R. Dijkgraaf, Mirror symmetry and elliptic curves (1995); Kaneko-Zagier
    # (1995): F_2 = (10 E2^3 - 6 E2 E4 - 4 E6)/103680, and covertree's count
    # with two labelled simple points is 2 [q^d] F_2 (OEIS A170991).
    s = degree_series(Family(2, 1), Quantity("hurwitz"), max_degree=10, weight=6)
    found = s.identification
    assert found.found and found.solved_with == 3 and found.checked == 8
    assert sympy.simplify(found.expression - 2 * (10 * E2**3 - 6 * E2 * E4 - 4 * E6) / 103680) == 0
    # OEIS A170991: 2, 16, 60, 160, 360, 672, 1240 (terms typed from memory)
    assert [t.value for t in s.terms[1:8]] == [2, 16, 60, 160, 360, 672, 1240]


def test_genus_three_series_is_the_kaneko_zagier_form():
    # M. Kaneko and D. Zagier, A generalized Jacobi theta function and
    # quasimodular forms (1995): the genus-3 series is quasimodular of weight 12.
    # The form with the normalisation /1492992 (four labelled simple points) is
    # the one given in the formula entry of OEIS A170992 (R. Visser, 2023; terms
    # 2, 160, 2448, 18304, 90552 read from that entry):
    # (-6E2^6 + 15E2^4E4 + 4E2^3E6 - 12E2^2E4^2 - 12E2E4E6 + 7E4^3 + 4E6^2)/1492992.
    s = degree_series(Family(3, 1), Quantity("hurwitz"), max_degree=14, weight=12)
    found = s.identification
    published = (-6 * E2**6 + 15 * E2**4 * E4 + 4 * E2**3 * E6 - 12 * E2**2 * E4**2 - 12 * E2 * E4 * E6
                 + 7 * E4**3 + 4 * E6**2) / 1492992
    assert found.found and found.solved_with == 7 and found.checked == 8
    assert sympy.simplify(found.expression - published) == 0
    assert [t.value for t in s.terms[1:6]] == [2, 160, 2448, 18304, 90552]
    assert list(s.coefficients) == f3_coefficients(15)


def test_genus_three_does_not_fit_a_lower_weight():
    found = degree_series(Family(3, 1), Quantity("hurwitz"), max_degree=14, weight=10).identification
    assert not found.found and found.mismatch[0] >= 5


def test_stratum_totals_of_the_catalogue_give_dijkgraafs_form_too():
    # Every base stratum carries the Hurwitz number (degeneration identity), so
    # its total over the irreducible nodal stratum is 2 F_2 again (Dijkgraaf 1995).
    for engine in ("types", "list"):
        q = Quantity("total", stratum="g0{1,2} | 0-0", engine=engine)
        s = degree_series(Family(2, 1), q, max_degree=6 if engine == "list" else 8, weight=6)
        assert s.identification.found
        assert list(s.coefficients) == [2 * c for c in f2_coefficients(s.max_degree + 1)]


def test_unramified_covers_give_the_sigma_one_series():
    # Index-d sublattices of Z^2: sigma_1(d)/d connected unramified covers of an
    # elliptic curve (common knowledge); q d/dq turns the series into
    # sum sigma_1(d) q^d = (1 - E2)/24 (E2 = 1 - 24 sum sigma_1(n) q^n, common knowledge).
    family = Family(1, 1, (ProfileShape.parse("1^*"),))
    s = degree_series(family, Quantity("hurwitz"), max_degree=12, weight=2, mixed=True, q_derivative=1)
    assert [t.value for t in s.terms] == [Fraction(sigma(1, d), d) for d in range(1, 13)]
    assert s.identification.found and s.identification.checked == 11
    assert s.identification.text == "(1 - E2)/24"


def test_sum_of_sigma_one_over_d_is_not_quasimodular():
    # sum sigma_1(d)/d q^d = -sum log(1 - q^n) is not quasimodular (common
    # knowledge): no form of weight <= 6 fits, and the command says so.
    family = Family(1, 1, (ProfileShape.parse("1^*"),))
    s = degree_series(family, Quantity("hurwitz"), max_degree=20, weight=6, mixed=True)
    assert not s.identification.found and s.identification.text is None


@pytest.mark.parametrize("coefficient", ["delta_0", "delta_1"])
def test_d_elliptic_class_coefficients_are_quasimodular(coefficient):
    # The classes of the d-elliptic loci in Mbar_2: at d = 2 the bielliptic
    # locus, Faber-Pagani, The class of the bielliptic locus in genus 3 (2015),
    # genus-2 case: 3 delta_0 + 12 delta_1 for the reduced locus weighted by
    # its two unordered branch points (from memory; see tests/locus); the
    # series in d is quasimodular of mixed weight <= 4 (C. Lian, d-elliptic
    # loci in genus 2 and 3, arXiv:2004.06768, the genus-2 theorem; covertree
    # identifies the form and checks it on the coefficients not used to solve).
    s = degree_series(Family(2, 1), Quantity("locus_unordered", coefficient=coefficient), max_degree=8,
                      weight=4, mixed=True)
    assert s.identification.found and s.identification.checked >= 4
    assert s.terms[1].degree == 2 and s.terms[1].value == {"delta_0": 3, "delta_1": 12}[coefficient]
    assert not degree_series(Family(2, 1), Quantity("locus_unordered", coefficient=coefficient), max_degree=8,
                             weight=2, mixed=True).identification.found
    labelled = degree_series(Family(2, 1), Quantity("locus", coefficient=coefficient), max_degree=4, weight=4,
                             mixed=True)
    assert [t.value for t in labelled.terms] == [2 * t.value for t in s.terms[:4]]
