r"""The class of a divisorial Hurwitz locus in ``Pic(Mbar_{G,n}) (x) Q`` for a
marked source.

With legs ``1..n`` on the source (:mod:`covertree.hurwitz.marks`) the cover
space pushes forward to ``Mbar_{G,n}``; it is a divisor when ``3H - 3 + b =
3G - 4 + n``.  The classes are written in the generators ``lambda``,
``psi_1 .. psi_n`` and the boundary divisors ``delta_0``, ``delta_i_{a,...}``
of :mod:`covertree.intersection.boundary` (the JSON keys).  They are not
always independent (``10 lambda = delta_0 + 2 sum delta_{1,S}`` in genus 2,
``12 lambda = delta_0`` and ``psi_i = lambda + sum_{S ∋ i} delta_{0,S}`` in
genus 1, Keel's relations in genus 0), so a *basis* is chosen: going through
``lambda``, the ``psi_k``, the separating divisors and last ``delta_0``, a
generator is kept when its row of the pairing with the test monomials is
independent of the rows kept so far.  For ``G >= 3`` every generator is kept
(Arbarello–Cornalba); in genus 2 ``delta_0`` goes, which is how the classes
of the literature are written (the Weierstrass divisor ``3 psi - lambda -
delta_1``).  Generators outside the basis get coefficient 0 and a
*relation*: their expression in the basis, read off the pairing.

The pairing ``P[k][l] = \int_{Mbar_{G,n}} beta_k alpha_l`` comes from
:func:`covertree.intersection.mbar.mbar_integral`; the test monomials
``alpha_l`` are the monomials of degree ``3G - 4 + n`` in the generators (at
most :data:`MAX_TESTS` of them, evenly spread, when there are more), and the
right-hand side ``\int_{Adm} src^* alpha_l`` from
:mod:`covertree.locus.integrals`.  The system is solved exactly and every test
must be reproduced.

``unordered`` divides by :func:`covertree.hurwitz.marks.marked_symmetry`: the
permutations of unmarked branch points with equal profiles (marked branch
points carry labelled legs and stay put).

Examples
--------
The Weierstrass divisor: genus-2 double covers of the line with the
ramification point over branch point 1 marked:

>>> from covertree.hurwitz.problem import HurwitzProblem
>>> c = marked_locus_class(HurwitzProblem.build(2, 0, genus=2, marks=["1"]))
>>> {k: str(v) for k, v in c.unordered.items()}
{'lambda': '-1', 'psi_1': '3', 'delta_0': '0', 'delta_1_{}': '-1'}
>>> c.basis, {k: str(v) for k, v in c.relations["delta_0"].items()}
(('lambda', 'psi_1', 'delta_1_{}'), {'lambda': '10', 'psi_1': '0', 'delta_1_{}': '-2'})
"""

from __future__ import annotations

from collections.abc import Sequence
from fractions import Fraction
from itertools import combinations_with_replacement

import sympy

from covertree.errors import IdentityError, ProblemError
from covertree.hurwitz.marks import marked_symmetry
from covertree.hurwitz.problem import HurwitzProblem
from covertree.intersection.mbar import mbar_integral
from covertree.locus.integrals import cover_space_dimension, cover_space_integrals, source_divisors
from covertree.locus.monomial import Monomial

__all__ = ["MAX_TESTS", "generators", "marked_locus_class"]

#: Largest number of test monomials used (evenly spread among all of them).
MAX_TESTS = 60


def generators(problem: HurwitzProblem) -> tuple[str, ...]:
    """``lambda``, ``psi_1 .. psi_n`` and the boundary divisors, in display order."""
    psis = tuple(f"psi_{k}" for k in range(1, problem.n_marks + 1))
    return ("lambda",) + psis + source_divisors(problem)


def _preference(names: Sequence[str]) -> list[str]:
    """The order in which generators are offered to the basis."""
    return [n for n in names if n != "delta_0"] + [n for n in names if n == "delta_0"]


def test_monomials(problem: HurwitzProblem) -> list[dict[str, int]]:
    """The test monomials of degree ``3G - 4 + n`` (evenly spread, at most :data:`MAX_TESTS`)."""
    degree = 3 * problem.genus - 4 + problem.n_marks
    names = generators(problem)
    every = [dict((n, combo.count(n)) for n in names if n in combo)
             for combo in combinations_with_replacement(names, degree)]
    if len(every) <= MAX_TESTS:
        return every
    step = len(every) / MAX_TESTS
    return [every[int(i * step)] for i in range(MAX_TESTS)]


def _pairing_row(problem: HurwitzProblem, name: str, tests: Sequence[dict[str, int]]) -> list[Fraction]:
    g, n = problem.genus, problem.n_marks
    return [mbar_integral(g, n, alpha | {name: alpha.get(name, 0) + 1}) for alpha in tests]


def _matrix(rows: Sequence[Sequence[Fraction]]) -> sympy.Matrix:
    return sympy.Matrix([[sympy.Rational(x.numerator, x.denominator) for x in row] for row in rows])


def _basis(rows: dict[str, list[Fraction]], names: Sequence[str]) -> list[str]:
    kept: list[str] = []
    for name in _preference(names):
        if _matrix([rows[k] for k in kept + [name]]).rank() > len(kept):
            kept.append(name)
    return [n for n in names if n in kept]


def _relations(rows: dict[str, list[Fraction]], basis: Sequence[str], names: Sequence[str]) -> dict:
    """Each generator outside the basis as a combination of the basis."""
    out = {}
    basis_t = _matrix([rows[b] for b in basis]).T
    for name in names:
        if name in basis:
            continue
        solution, _ = basis_t.gauss_jordan_solve(_matrix([rows[name]]).T)
        out[name] = {b: _fraction(x) for b, x in zip(basis, solution)}
    return out


def _fraction(x) -> Fraction:
    num, den = sympy.fraction(sympy.nsimplify(x))
    return Fraction(int(num), int(den))


def _check_divisorial(problem: HurwitzProblem) -> int:
    dim = cover_space_dimension(problem)
    g, n = problem.genus, problem.n_marks
    if 2 * g - 2 + n <= 0 or dim != 3 * g - 4 + n:
        raise ProblemError(
            f"the locus is not a divisor: the cover space has dimension {dim}, a divisor of "
            f"Mbar_{{{g},{n}}} has dimension {3 * g - 4 + n}; use the integral command instead"
        )
    if not source_divisors(problem) and g < 1:
        raise ProblemError(f"Mbar_{{{g},{n}}} has no divisor classes to solve for")
    return dim


def marked_locus_class(problem: HurwitzProblem, engine: str = "types", progress=None):
    """The class of the locus in ``Mbar_{G,n}`` (module docstring), as a
    :class:`covertree.locus.divisor.LocusClass` with ``basis`` and ``relations``.

    Raises
    ------
    ProblemError
        When the locus is not a divisor of ``Mbar_{G,n}``.
    IdentityError
        When the system is inconsistent or degenerate (a bug).
    """
    from covertree.locus.divisor import CheckRow, LocusClass, _solve

    dim = _check_divisorial(problem)
    names = generators(problem)
    tests = test_monomials(problem)
    rows = {name: _pairing_row(problem, name, tests) for name in names}
    basis = _basis(rows, names)
    monomials = [Monomial.from_powers(alpha) for alpha in tests]
    values = cover_space_integrals(problem, [(a, Monomial(())) for a in monomials], engine, progress)
    solution = dict(zip(basis, _solve([rows[b] for b in basis], values)))
    checks = tuple(CheckRow(a, v, sum((solution[b] * rows[b][l] for b in basis), Fraction(0)))
                   for l, (a, v) in enumerate(zip(monomials, values)))
    labelled = {name: solution.get(name, Fraction(0)) for name in names}
    symmetry = marked_symmetry([tuple(p) for p in problem.profiles], problem.marks)
    result = LocusClass(problem, dim, labelled, {k: v / symmetry for k, v in labelled.items()}, symmetry, checks,
                        tuple(basis), _relations(rows, basis, names))
    if not result.consistent:  # pragma: no cover - _solve already checks
        raise IdentityError("the class does not reproduce its test integrals")
    return result
