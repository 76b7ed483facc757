"""Published checks of cover-space integrals and Hurwitz locus classes."""

from fractions import Fraction
from itertools import combinations_with_replacement

import pytest

from covertree.hurwitz.problem import HurwitzProblem
from covertree.intersection.psi import psi_integral, psi_kappa_integral
from covertree.locus.divisor import family_number, locus_class
from covertree.locus.integrals import cover_space_integral
from covertree.locus.monomial import Monomial


def integral(problem, source, target=""):
    return cover_space_integral(problem, Monomial.parse(source), Monomial.parse(target)).value


def test_witten_kontsevich_values():
    # Witten 1991 / Kontsevich 1992: <tau_1>_1 = 1/24, <tau_{3g-2}>_g = 1/(24^g g!),
    # <tau_2 tau_3>_2 = 29/5760 (common knowledge in the field).
    assert psi_integral(1, (1,)) == Fraction(1, 24)
    for g, fact in ((1, 1), (2, 2), (3, 6), (4, 24)):
        assert psi_integral(g, (3 * g - 2,)) == Fraction(1, 24 ** g * fact)
    assert psi_integral(2, (2, 3)) == Fraction(29, 5760)
    # genus-0 multinomials: <tau_{k_1}..tau_{k_n}>_0 = (n-3)!/prod k_i! (common knowledge)
    assert psi_integral(0, (2, 1, 0, 0, 0, 0)) == Fraction(6, 2)
    # Faber, Chow rings of moduli spaces of curves I (1990): int_{Mbar_2} kappa_1^3 = 43/2880 (from memory)
    assert psi_kappa_integral(2, (), 3) == Fraction(43, 2880)


def test_mumford_lambda_cubed_on_mbar2_from_degree_one():
    # Mumford, Towards an enumerative geometry of the moduli space of curves (1983): int lambda^3 = 1/2880
    assert integral(HurwitzProblem.build(1, 2, genus=2), "lambda^3") == Fraction(1, 2880)


def test_faber_lambda_sixth_on_mbar3_from_degree_one():
    # Faber, Chow rings of moduli spaces of curves I (1990): int_{Mbar_3} lambda^6 = 1/90720
    assert integral(HurwitzProblem.build(1, 3, genus=3), "lambda^6") == Fraction(1, 90720)


@pytest.mark.parametrize("problem", [HurwitzProblem.build(1, 2, genus=2), HurwitzProblem.build(2, 0, genus=2),
                                     HurwitzProblem.build(2, 1, genus=2), HurwitzProblem.build(3, 1, genus=2)])
def test_genus_two_relation(problem):
    # Mumford 1983: in genus 2, 10 lambda = delta_0 + 2 delta_1 in Pic(Mbar_2) (x) Q; it must integrate
    # to zero against every monomial of the complementary degree, on Mbar_2 and on every cover space.
    n = 3 * problem.target_genus - 3 + problem.points
    for combo in combinations_with_replacement(["lambda", "delta_0", "delta_1", "kappa"], n - 1):
        src = [c for c in combo if c != "kappa"]
        tgt = " ".join(c for c in combo if c == "kappa")
        if problem.degree == 1 and tgt:
            continue
        rest = " ".join(src)
        value = (10 * integral(problem, rest + " lambda", tgt) - integral(problem, rest + " delta_0", tgt)
                 - 2 * integral(problem, rest + " delta_1", tgt))
        assert value == 0, combo


def test_every_genus_two_curve_is_hyperelliptic():
    # Classical: each genus-2 curve is a double cover of the line in 6! labellings of the branch points,
    # each cover with the hyperelliptic involution, as the curve itself: src has degree 720 onto Mbar_2.
    mbar2, hyp = HurwitzProblem.build(1, 2, genus=2), HurwitzProblem.build(2, 0, genus=2)
    for combo in combinations_with_replacement(["lambda", "delta_0", "delta_1"], 3):
        text = " ".join(combo)
        assert integral(hyp, text) == 720 * integral(mbar2, text)


def test_hyperelliptic_locus_in_genus_three():
    # Harris-Morrison, Moduli of Curves (1998), 6C; Cornalba-Harris 1988: [H_3] = 9 lambda - delta_0 - 3 delta_1.
    c = locus_class(HurwitzProblem.build(2, 0, genus=3))
    assert c.unordered == {"lambda": 9, "delta_0": -1, "delta_1": -3}
    assert c.consistent and len(c.tests) == 21 and c.symmetry == 40320


def test_bielliptic_genus_two_and_the_pencil_family():
    # Faber-Pagani, The class of the bielliptic locus in genus 3 (2015), genus-2 case: the reduced bielliptic
    # locus is 3/2 delta_0 + 6 delta_1 (from memory); our labelled class is 4 times it (two labellings of the
    # branch points times two bielliptic involutions of a general bielliptic genus-2 curve).
    c = locus_class(HurwitzProblem.build(2, 1, genus=2))
    assert c.labelled == {"delta_0": 4 * Fraction(3, 2), "delta_1": 4 * 6}
    # Genus-2 curves branched over five fixed general points and a moving sixth: delta_0 degree 10,
    # delta_1 degree 0 (common knowledge); 15 of them are bielliptic (pair the moving point, then the
    # other four: 5 * 3), each counted 4 times by the labelled class.
    assert family_number(c, {"delta_0": 10, "delta_1": 0}) == 4 * 15


def test_target_psi_integrals_are_hurwitz_number_times_base_integrals():
    # br is finite of degree H (the Hurwitz number), so classes from the target integrate to H times
    # their integral on Mbar_{h,b} (projection formula); Mbar_{1,2}: <tau_1 tau_1>_1 = 1/24 (common knowledge).
    p = HurwitzProblem.build(3, 1, genus=2)
    from covertree.catalogue.catalogue import problem_hurwitz
    h = problem_hurwitz(p)
    assert integral(p, "", "psi_1 psi_2") == h * Fraction(1, 24)
    assert integral(p, "", "kappa^2") == h * psi_kappa_integral(1, (0, 0), 2)


def test_degree_one_cover_space_is_mbar_g():
    # Two independent routes to int_{Mbar_G}: the cover-space sum over strata with surjective node
    # colourings for the degree-1 problem, and recursive restriction to boundary divisors (intersection.mbar).
    from covertree.intersection.mbar import mbar_integral

    for g in (2, 3):
        problem = HurwitzProblem.build(1, g, genus=g)
        names = ["lambda"] + [f"delta_{j}" for j in range(g // 2 + 1)]
        for combo in combinations_with_replacement(names, 3 * g - 3):
            powers = {}
            for name in combo:
                powers[name] = powers.get(name, 0) + 1
            assert integral(problem, " ".join(combo)) == mbar_integral(g, 0, powers), combo
