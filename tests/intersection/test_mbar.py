"""Integrals on Mbar_{g,n} with boundary divisors and lambda_1, against published
values, hand-worked restrictions and relations of the Picard group."""

from fractions import Fraction
from itertools import combinations_with_replacement

import pytest
import sympy

from covertree.errors import InputError
from covertree.intersection.boundary import divisor_name, divisors
from covertree.intersection.mbar import divisor_basis, divisor_monomials, mbar_integral, pairing_matrix


def integral(g, n, *names):
    powers = {}
    for name in names:
        powers[name] = powers.get(name, 0) + 1
    return mbar_integral(g, n, powers)


def delta_names(g, n):
    return [divisor_name(g, n, key) for key in divisors(g, n)]


def test_points_of_mbar_04_and_mbar_11():
    # Mbar_{0,4} is P^1 with three boundary points; psi_i and kappa_1 have degree 1 (common knowledge)
    for name in delta_names(0, 4) + ["psi_1", "psi_4", "kappa"]:
        assert integral(0, 4, name) == 1, name
    # Mbar_{1,1}: the nodal cubic has two automorphisms, psi_1 = lambda_1 = kappa_1 has degree 1/24
    # (Mumford 1983, section 6; common knowledge)
    assert integral(1, 1, "delta_0") == Fraction(1, 2)
    for name in ("lambda", "psi_1", "kappa"):
        assert integral(1, 1, name) == Fraction(1, 24), name


def test_mbar_05_boundary_intersections():
    # Mbar_{0,5} is the blow-up of P^2 in four points; D_{ij} are the ten (-1)-curves, meeting
    # when their pairs are disjoint (Keel 1992; common knowledge)
    assert integral(0, 5, "delta_0_{1,2}", "delta_0_{1,2}") == -1
    assert integral(0, 5, "delta_0_{1,2}", "delta_0_{3,4}") == 1
    assert integral(0, 5, "delta_0_{1,2}", "delta_0_{1,3}") == 0
    assert integral(0, 5, "delta_0_{2,5}", "delta_0_{3,4}") == 1
    # psi_1 on Mbar_{0,5}: psi_1 psi_2 = 2!/(1! 1!) = 2 (multinomial), psi_1^2 = 1
    assert integral(0, 5, "psi_1", "psi_2") == 2 and integral(0, 5, "psi_1", "psi_1") == 1
    assert integral(0, 5, "kappa", "kappa") == 5 and integral(0, 5, "kappa", "psi_3") == 3


@pytest.mark.parametrize("n", [4, 5])
def test_genus_zero_psi_is_a_sum_of_boundary_divisors(n):
    # psi_i = sum of D_S over S containing i and not j, k (Keel 1992; Kapranov), for any j, k != i:
    # both sides integrate equally against every monomial of the complementary degree.
    names = ["psi_1", "psi_2", "kappa"] + delta_names(0, n)
    terms = []
    for key in divisors(0, n):
        side = set(key[1])
        other = set(range(1, n + 1)) - side
        if any(1 in s and not {2, 3} & s for s in (side, other)):
            terms.append(divisor_name(0, n, key))
    assert len(terms) == 2 ** (n - 3) - 1  # subsets of the other n - 3 legs joining 1, not all of them
    for rest in combinations_with_replacement(names, n - 4):
        assert integral(0, n, "psi_1", *rest) == sum(integral(0, n, t, *rest) for t in terms), rest


@pytest.mark.parametrize("n", [1, 2, 3])
def test_genus_one_relations(n):
    # On Mbar_{1,n}: 12 lambda_1 = delta_0 and psi_i = lambda_1 + sum of delta_{0,S} over the
    # rational tails S (|S| >= 2) holding i (Mumford 1983; Getzler, Intersection theory on
    # Mbar_{1,4} and elliptic Gromov-Witten invariants (1997); from memory)
    names = ["lambda", "kappa", "psi_1"] + delta_names(1, n)
    tails = [divisor_name(1, n, key) for key in divisors(1, n) if key[0] == 0 and 1 in key[1]]
    for rest in combinations_with_replacement(names, n - 1):
        assert 12 * integral(1, n, "lambda", *rest) == integral(1, n, "delta_0", *rest), rest
        assert integral(1, n, "psi_1", *rest) == integral(1, n, "lambda", *rest) + sum(
            integral(1, n, t, *rest) for t in tails), rest


def test_mbar_2_hand_worked_restrictions_and_mumford_relation():
    # Mumford, Towards an enumerative geometry (1983), section 10: int_{Mbar_2} lambda^3 = 1/2880.
    assert integral(2, 0, "lambda", "lambda", "lambda") == Fraction(1, 2880)
    # delta_1 = [Mbar_{1,1} x Mbar_{1,1}] / 2, lambda restricts to lambda_a + lambda_b and delta_1 to
    # the normal bundle -psi_a - psi_b: by hand, lambda^2 delta_1 = 1/2 * 2 * (1/24)^2 = 1/576,
    # lambda delta_1^2 = -1/576, delta_1^3 = 1/576.
    assert integral(2, 0, "lambda", "lambda", "delta_1") == Fraction(1, 576)
    assert integral(2, 0, "lambda", "delta_1", "delta_1") == Fraction(-1, 576)
    assert integral(2, 0, "delta_1", "delta_1", "delta_1") == Fraction(1, 576)
    # 10 lambda = delta_0 + 2 delta_1 (Mumford 1983)
    for rest in combinations_with_replacement(["lambda", "delta_0", "delta_1", "kappa"], 2):
        assert 10 * integral(2, 0, "lambda", *rest) == integral(2, 0, "delta_0", *rest) + \
            2 * integral(2, 0, "delta_1", *rest), rest


def test_faber_mbar_3():
    # Faber, Chow rings of moduli spaces of curves I (1990): int_{Mbar_3} lambda^6 = 1/90720
    assert integral(3, 0, *["lambda"] * 6) == Fraction(1, 90720)


def test_mbar_11_and_12_lambda_with_boundary():
    # Mbar_{1,2}: delta_{0,{1,2}} is Mbar_{1,1} x Mbar_{0,3}; lambda restricts to lambda: 1/24
    assert integral(1, 2, "lambda", "delta_0_{1,2}") == Fraction(1, 24)
    # delta_0 restricted to delta_0 on Mbar_{1,1}: the normal bundle -psi_2 - psi_3 on Mbar_{0,3}: 0 (degree 0)
    assert integral(1, 1, "lambda") == Fraction(1, 24)


def test_integrals_of_the_wrong_degree_vanish_and_names_are_checked():
    assert integral(2, 0, "lambda") == 0 and integral(1, 2, "psi_1") == 0
    assert mbar_integral(1, 1, {"lambda": 1, "kappa": 0}) == Fraction(1, 24)
    for factors, message in [
        ({"psi_3": 1}, r"unknown factor 'psi_3': psi_i needs a leg 1 <= i <= 2"),
        ({"psi_x": 1}, r"psi_i needs a leg"),
        ({"psi_0": 1}, r"psi_i needs a leg"),
        ({"omega": 1}, r"unknown factor 'omega': expected lambda, kappa, psi_i \(1 <= i <= 2\) or delta_"),
        ({"lambda": -1}, r"power of 'lambda' must be an integer >= 0, got -1"),
        ({"lambda": True}, r"must be an integer"),
        ({"kappa": 1.0}, r"must be an integer"),
    ]:
        with pytest.raises(InputError, match=message):
            mbar_integral(1, 2, factors)


def test_powers_add_up_and_legs_are_symmetric():
    # powers of one factor given under the one name add; relabelling the legs changes nothing
    assert mbar_integral(0, 5, {"psi_1": 1, "psi_2": 1}) == 2
    assert mbar_integral(1, 3, {"psi_1": 2, "psi_3": 1}) == mbar_integral(1, 3, {"psi_2": 2, "psi_1": 1})
    assert mbar_integral(1, 3, {"psi_1": 1, "delta_0_{1,2}": 1, "lambda": 1}) == mbar_integral(
        1, 3, {"psi_3": 1, "delta_0_{2,3}": 1, "lambda": 1})
    assert mbar_integral(1, 2, {"psi_1": 1, "psi_2": 1}) == Fraction(1, 24)


def test_divisor_basis_and_monomials():
    assert divisor_basis(2) == ("delta_0", "delta_1")
    assert divisor_basis(3) == ("lambda", "delta_0", "delta_1")
    assert divisor_basis(5) == ("lambda", "delta_0", "delta_1", "delta_2")
    with pytest.raises(InputError, match="divisor_basis needs genus >= 2, got 1"):
        divisor_basis(1)
    monomials = divisor_monomials(3, 2)
    # the monomials of degree 2 in lambda, delta_0, delta_1: C(3 + 1, 2) = 6, each once
    assert len(monomials) == 6 and len({tuple(sorted(m.items())) for m in monomials}) == 6
    assert all(sum(m.values()) == 2 for m in monomials) and {"lambda": 2} in monomials


def test_pairing_matrix():
    # rows: delta_0, delta_1 of Mbar_2; columns: delta_1^2, lambda^2 (hand-worked values above;
    # delta_0 lambda^2 = 10 lambda^3 - 2 lambda^2 delta_1 = 0)
    m = pairing_matrix(2, [{"delta_1": 2}, {"lambda": 2}])
    assert m[1, 0] == sympy.Rational(1, 576) and m[1, 1] == sympy.Rational(1, 576) and m[0, 1] == 0
    assert m[0, 0] == 10 * sympy.Rational(-1, 576) - 2 * sympy.Rational(1, 576)
    with pytest.raises(InputError, match=r"test monomial \{'lambda': 1\} has degree 1, need 3g - 4 = 2"):
        pairing_matrix(2, [{"lambda": 1}])
