"""psi and kappa_1 integrals against published values and hand-worked identities."""

from fractions import Fraction
from math import factorial, prod

import pytest

from covertree.errors import InputError
from covertree.intersection.psi import dimension, psi_integral, psi_kappa_integral


def test_dimension_and_unstable_spaces():
    assert [dimension(0, 3), dimension(1, 1), dimension(2, 0), dimension(3, 2)] == [0, 1, 3, 8]
    for g, n in ((0, 2), (1, 0), (0, 0), (-1, 5), (2, -1)):
        with pytest.raises(InputError, match=r"is not a stable moduli space"):
            dimension(g, n)


@pytest.mark.parametrize(
    "g, exponents, value",
    [
        # Witten, Two-dimensional gravity and intersection theory on moduli space (1991), and
        # Kontsevich 1992: the genus-2 and genus-3 correlators of one and two points (the table
        # of Faber's tau-function values; from memory)
        (1, (1,), Fraction(1, 24)),
        (2, (4,), Fraction(1, 1152)),
        (2, (2, 3), Fraction(29, 5760)),
        (2, (2, 2, 2), Fraction(7, 240)),
        (3, (7,), Fraction(1, 82944)),
        (3, (2, 6), Fraction(77, 414720)),
        (3, (3, 5), Fraction(503, 1451520)),
        (3, (4, 4), Fraction(607, 1451520)),
        # worked by hand from the table with the string and dilaton equations:
        # <tau_0 tau_2 tau_4>_2 = <tau_1 tau_4> + <tau_2 tau_3> = 3/1152 + 29/5760
        (2, (0, 2, 4), Fraction(3, 1152) + Fraction(29, 5760)),
        # <tau_1 tau_2 tau_3>_2 = (2g - 2 + n) <tau_2 tau_3>, n = 2
        (2, (1, 2, 3), 4 * Fraction(29, 5760)),
        # <tau_0 tau_0 tau_3 tau_4>_2 = <tau_0 tau_2 tau_4> + <tau_0 tau_3 tau_3>
        #   = (<tau_1 tau_4> + <tau_2 tau_3>) + 2 <tau_2 tau_3> (string equation twice)
        (2, (0, 0, 3, 4), Fraction(3, 1152) + 3 * Fraction(29, 5760)),
    ],
)
def test_published_correlators(g, exponents, value):
    assert psi_integral(g, exponents) == value
    assert psi_integral(g, tuple(reversed(exponents))) == value


@pytest.mark.parametrize("g", [1, 2, 3, 4])
def test_one_point_correlators(g):
    # <tau_{3g-2}>_g = 1 / (24^g g!) (Witten 1991; common knowledge)
    assert psi_integral(g, [3 * g - 2]) == Fraction(1, 24**g * factorial(g))


def test_genus_one_all_first_powers():
    # <tau_1^n>_1 = (n - 1)!/24: the dilaton equation from <tau_1>_1 = 1/24 (hand-worked)
    for n in range(1, 6):
        assert psi_integral(1, [1] * n) == Fraction(factorial(n - 1), 24)


@pytest.mark.parametrize("exponents", [(0, 0, 0), (1, 0, 0, 0), (2, 0, 0, 0, 0), (1, 1, 0, 0, 0), (2, 1, 1, 0, 0, 0, 0),
                                       (3, 1, 0, 0, 0, 0, 0)])
def test_genus_zero_multinomials(exponents):
    # <tau_{k_1} .. tau_{k_n}>_0 = (n - 3)! / prod k_i! (common knowledge)
    n = len(exponents)
    assert psi_integral(0, exponents) == Fraction(factorial(n - 3), prod(factorial(k) for k in exponents))


def test_wrong_degree_and_bad_exponents():
    assert psi_integral(2, (3,)) == 0 and psi_integral(1, (0, 0)) == 0 and psi_integral(0, (1, 1, 0, 0)) == 0
    with pytest.raises(InputError, match=r"psi exponents must be >= 0, got \[2, -1\]"):
        psi_integral(1, [2, -1])
    with pytest.raises(InputError, match="not a stable"):
        psi_integral(1, [])


@pytest.mark.parametrize("n, value", [(4, 1), (5, 5), (6, 61), (7, 1379)])
def test_genus_zero_kappa_powers(n, value):
    # int_{Mbar_{0,n}} kappa_1^{n-3} = 1, 5, 61, 1379: Zograf, The Weil-Petersson volume of the
    # moduli space of punctured spheres (1993), and Kaufmann-Manin-Zagier, Higher Weil-Petersson
    # volumes of moduli spaces of stable n-pointed curves (1996) (from memory)
    assert psi_kappa_integral(0, [0] * n, n - 3) == value


def test_kappa_against_hand_worked_values():
    # kappa_1 = pi_*(psi_{n+1}^2) (Arbarello-Cornalba 1996); on Mbar_{1,1}, kappa_1 = psi_1: 1/24
    assert psi_kappa_integral(1, (0,), 1) == Fraction(1, 24)
    # Mbar_{0,5}: int kappa_1 psi_1 = int_{Mbar_{0,6}} psi_1 psi_6^2 = 3!/(1! 2!) = 3
    assert psi_kappa_integral(0, (1, 0, 0, 0, 0), 1) == 3
    # Mbar_{1,2}: int kappa_1 psi_1 = int_{Mbar_{1,3}} psi_1 psi_3^2 = <tau_1 tau_2 tau_0>_1 =
    # <tau_0 tau_2> + <tau_1 tau_1> = 1/24 + 1/24 (string equation)
    assert psi_kappa_integral(1, (1, 0), 1) == Fraction(1, 12)
    # Faber, Chow rings of moduli spaces of curves I (1990): int_{Mbar_2} kappa_1^3 = 43/2880 (from memory)
    assert psi_kappa_integral(2, (), 3) == Fraction(43, 2880)
    assert psi_kappa_integral(2, (), 2) == 0 and psi_kappa_integral(0, (0, 0, 0, 0), 0) == 0


def test_kappa_bad_exponents():
    with pytest.raises(InputError, match=r"exponents must be >= 0, got psi \[0\] and kappa -1"):
        psi_kappa_integral(1, [0], -1)
    with pytest.raises(InputError, match=r"got psi \[-1, 1\] and kappa 1"):
        psi_kappa_integral(1, [-1, 1], 1)
    with pytest.raises(InputError, match="not a stable"):
        psi_kappa_integral(0, [0, 0], 0)
