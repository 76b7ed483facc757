"""Published checks of classes and integrals for marked sources (Mbar_{G,n})."""

from __future__ import annotations

from fractions import Fraction
from itertools import combinations_with_replacement
from math import factorial, prod

import pytest

from covertree.catalogue.catalogue import problem_hurwitz
from covertree.hurwitz.marks import labellings
from covertree.hurwitz.problem import HurwitzProblem
from covertree.intersection.mbar import mbar_integral
from covertree.locus.divisor import family_number, locus_class
from covertree.locus.integrals import cover_space_integral, cover_space_integrals
from covertree.locus.monomial import Monomial

WEIERSTRASS = HurwitzProblem.build(2, 0, genus=2, marks=["1"])


def _source(text):
    return Monomial.parse(text, kinds="source")


def _target(text):
    return Monomial.parse(text, kinds="target")


@pytest.mark.parametrize("engine", ["types", "list"])
def test_weierstrass_divisor_in_mbar_21(engine):
    # Eisenbud-Harris, Irreducibility of some families of linear series with Brill-Noether
    # number 0 (1987), and Cukierman, Families of Weierstrass points (1989): on Mbar_{2,1}
    # the closure of the Weierstrass points is W = 3 psi - lambda - delta_1, delta_1 the
    # divisor with the marked point on one elliptic side (from memory).  Dividing the
    # labelled class by the 5! orders of the unmarked branch points gives W.
    c = locus_class(WEIERSTRASS, engine)
    assert c.symmetry == factorial(5) and c.consistent
    assert c.unordered == {"lambda": -1, "psi_1": 3, "delta_0": 0, "delta_1_{}": -1}
    # the same class in the other form: Mumford's 10 lambda = delta_0 + 2 delta_1 (from memory)
    assert c.relations["delta_0"] == {"lambda": 10, "psi_1": 0, "delta_1_{}": -2}


def test_weierstrass_divisor_on_a_fibre():
    # On the fibre of Mbar_{2,1} -> Mbar_2 over a smooth curve C (C itself) psi has degree
    # 2g - 2 = 2 and lambda, delta_0, delta_1 degree 0; W meets it in the six Weierstrass
    # points (common knowledge: a genus-2 curve has 2g + 2 = 6 of them).
    c = locus_class(WEIERSTRASS)
    fibre = {"psi_1": 2, "lambda": 0, "delta_0": 0, "delta_1_{}": 0}
    assert family_number(c, fibre, unordered=True) == 6
    assert family_number(c, fibre) == 6 * factorial(5)


def _genus_zero_psi(n, exponents):
    # <tau_{a_1} .. tau_{a_n}>_0 = (n-3)! / prod a_i! when sum a_i = n - 3 (common knowledge)
    return Fraction(factorial(n - 3), prod(factorial(a) for a in exponents))


def _psi_monomials(n, degree):
    return [combo for combo in combinations_with_replacement(range(1, n + 1), degree)]


@pytest.mark.parametrize("genus", [2])
def test_hyperelliptic_with_all_ramification_points_marked(genus):
    # Every cover space is the moduli space of the 2g + 2 branch points and the source is
    # stable with the Weierstrass points as legs; the cotangent line at a ramification
    # point is a square root of the one below: psi_source = psi_target / 2.  So
    # int src^* prod psi = H * 2^{-deg} * int_{Mbar_{0,2g+2}} prod psi, and the other way
    # br^* psi_j = 2 src^* psi_j.  H = 1/2 (the involution; Frobenius' formula).
    n = 2 * genus + 2
    problem = HurwitzProblem.build(2, 0, genus=genus, marks=[str(j) for j in range(1, n + 1)])
    assert problem_hurwitz(problem) == Fraction(1, 2)
    combos = _psi_monomials(n, n - 3)
    combos = combos[:: max(1, len(combos) // 12)]
    names = [" ".join(f"psi_{j}" for j in combo) for combo in combos]
    jobs = [(_source(m), Monomial(())) for m in names] + [(Monomial(()), _target(m)) for m in names]
    # one source factor moved to the target side, doubled back
    jobs += [(_source(" ".join(m.split()[1:])), _target(m.split()[0])) for m in names]
    values = cover_space_integrals(problem, jobs)
    k = len(names)
    for i, combo in enumerate(combos):
        base = _genus_zero_psi(n, [combo.count(j) for j in range(1, n + 1)])
        assert values[i] == Fraction(1, 2) * base / 2 ** (n - 3)
        assert values[k + i] == Fraction(1, 2) * base
        assert values[2 * k + i] * 2 ** (n - 4) == Fraction(1, 2) * base


def test_hyperelliptic_genus_three_target_side():
    # as above for genus 3 (Mbar_{0,8}); target psi classes only, which need no boundary
    problem = HurwitzProblem.build(2, 0, genus=3, marks=[str(j) for j in range(1, 9)])
    for combo in [(1, 1, 1, 1, 1), (1, 2, 3, 4, 5), (1, 1, 2, 2, 8)]:
        text = " ".join(f"psi_{j}" for j in combo)
        base = _genus_zero_psi(8, [combo.count(j) for j in range(1, 9)])
        assert cover_space_integral(problem, Monomial(()), _target(text)).value == Fraction(1, 2) * base


def test_psi_is_lambda_on_mbar_11():
    # On Mbar_{1,1}: psi_1 = lambda = delta_0 / 12 (common knowledge; int psi_1 = int lambda
    # = 1/24, int delta_0 = 1/2).  Genus-1 double covers of P^1 with a marked unramified
    # preimage of a fifth point: the leg sits on a contracted tail over some base divisors,
    # where src^* psi differs from the psi of the point on the prestable source.
    problem = HurwitzProblem.build(2, 0, profiles=["2", "2", "2", "2", "1,1"], marks=["5:1"])
    for target in ["psi_1", "psi_5", "kappa", "psi_3"]:
        for engine in ["types", "list"]:
            psi = cover_space_integral(problem, _source("psi_1"), _target(target), engine).value
            lam = cover_space_integral(problem, _source("lambda"), _target(target), engine).value
            delta = cover_space_integral(problem, _source("delta_0"), _target(target), engine).value
            assert psi == lam == delta / 12, target


@pytest.mark.parametrize("spec", [
    (((2,),) * 6, ["1"]), (((2,),) * 6, ["1", "3"]), (((2,),) * 4 + ((1, 1),) * 2, ["6:1"]),
])
def test_unmarked_classes_pulled_back_through_the_forgetful_map(spec):
    # The marked cover space maps to the unmarked one with degree the number of labellings,
    # and lambda and kappa/psi of the target are pulled back, so integrals of them are
    # multiplied by the labellings; pi^* delta_1 of Mbar_2 is the sum of the delta_{1,S}
    # (Arbarello-Cornalba 1998, from memory).
    from covertree.locus.integrals import source_divisors

    profiles, marks = spec
    marked = HurwitzProblem.build(2, 0, profiles=[",".join(map(str, p)) for p in profiles], marks=marks)
    plain = marked.unmarked()
    factor = labellings([tuple(p) for p in plain.profiles], marked.marks)
    for source, target in [("lambda", "psi_1 psi_2"), ("lambda^2", "kappa"), ("lambda^3", "")]:
        a = cover_space_integral(marked, _source(source), _target(target)).value
        b = cover_space_integral(plain, _source(source), _target(target)).value
        assert a == factor * b
    if marked.genus == 2:
        ones = [d for d in source_divisors(marked) if d.startswith("delta_1_")]
        a = sum(cover_space_integral(marked, _source(f"lambda {d}"), _target("psi_1")).value for d in ones)
        b = cover_space_integral(plain, _source("lambda delta_1"), _target("psi_1")).value
        assert a == factor * b


def test_genus_one_locus_point_in_mbar_11():
    # Degree-3 covers of P^1 totally ramified over three points have genus 1 (Riemann-Hurwitz);
    # marking the point over branch point 1 gives a 0-dimensional locus in Mbar_{1,1}, a
    # divisor there.  Its degree is the number of marked covers, H = 1/3 (Hurwitz 1891 one-part
    # formula in genus 0 is not needed: three 3-cycles with product 1, up to conjugacy, give
    # one cover with |Aut| = 3, common knowledge), so its class is 8 lambda (int lambda = 1/24).
    problem = HurwitzProblem.build(3, 0, profiles=["3", "3", "3"], marks=["1"])
    c = locus_class(problem)
    assert problem_hurwitz(problem) == Fraction(1, 3)
    assert c.basis == ("lambda",) and c.labelled["lambda"] == 8
    assert mbar_integral(1, 1, {"lambda": 1}) * c.labelled["lambda"] == Fraction(1, 3)
