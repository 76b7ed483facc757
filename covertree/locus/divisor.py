r"""The class of a divisorial Hurwitz locus in ``Pic(Mbar_G) (x) Q``.

When ``dim Adm = 3H - 3 + b`` equals ``3G - 4`` the pushforward
``src_*[Adm]`` is a divisor class on ``Mbar_G``.  For ``G >= 3`` the classes
``lambda, delta_0, ..., delta_{floor(G/2)}`` are a basis of ``Pic(Mbar_G)
(x) Q`` (Harer; Arbarello–Cornalba 1987); for ``G = 2``, ``10 lambda =
delta_0 + 2 delta_1`` and the basis is ``delta_0, delta_1``.  Write
``src_*[Adm] = sum_k x_k beta_k``.  By the projection formula, for every test
monomial ``alpha`` of degree ``3G - 4`` in ``lambda`` and the ``delta_j``,

    sum_k x_k \int_{Mbar_G} beta_k alpha = \int_{Adm} src^* alpha,

the left side from the degree-1 problem (``Adm = Mbar_G``), the right from
:mod:`covertree.locus.integrals`.  covertree uses *every* such monomial: more
equations than unknowns, solved exactly (sympy); an inconsistent system, or a
pairing of rank below the number of unknowns, is a bug and raises
:class:`~covertree.errors.IdentityError`.

The class is that of the labelled problem (branch points labelled, covers
weighted by ``1/|Aut f|``); ``unordered`` divides by the symmetry of the list
of profiles (the permutations of branch points with equal profiles), which is
the class of the reduced locus times the number of covers, up to
automorphisms, of a general curve of the locus.

References
----------
J. Harris, D. Mumford, On the Kodaira dimension of the moduli space of curves,
Invent. Math. 67 (1982).  E. Arbarello, M. Cornalba, The Picard groups of the
moduli spaces of curves, Topology 26 (1987).  J. Harris, I. Morrison, Moduli
of Curves (1998), chapter 3.

Examples
--------
Hyperelliptic genus-3 curves, the double covers of the line branched at 8
points (``8!`` labellings of the branch points):

>>> from covertree.hurwitz.problem import HurwitzProblem
>>> c = locus_class(HurwitzProblem.build(2, 0, genus=3))
>>> {k: str(v) for k, v in c.unordered.items()}
{'lambda': '9', 'delta_0': '-1', 'delta_1': '-3'}
>>> c.consistent, len(c.tests)
(True, 21)
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from fractions import Fraction
from itertools import combinations_with_replacement
from math import factorial, prod

import sympy

from covertree.errors import IdentityError, InputError, ProblemError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.locus.integrals import cover_space_dimension, cover_space_integrals
from covertree.locus.monomial import Monomial

__all__ = ["LocusClass", "CheckRow", "locus_class", "divisor_basis", "pairing_monomials", "profile_symmetry",
           "pairing", "family_number"]


@dataclass(frozen=True)
class CheckRow:
    """One test monomial: its integral over the cover space and the value the
    solved class gives."""

    monomial: Monomial
    cover_space: Fraction
    from_class: Fraction


@dataclass(frozen=True)
class LocusClass:
    """The class of a divisorial Hurwitz locus (labelled branch points), its
    unordered version, and the tests that determine it.  For a marked source
    (:mod:`covertree.locus.marked`) ``basis`` names the generators solved
    for and ``relations`` expresses each other generator in them."""

    problem: HurwitzProblem
    dimension: int
    labelled: dict[str, Fraction]
    unordered: dict[str, Fraction]
    symmetry: int
    tests: tuple[CheckRow, ...]
    basis: tuple[str, ...] = ()
    relations: dict = field(default_factory=dict)

    @property
    def consistent(self) -> bool:
        return all(t.cover_space == t.from_class for t in self.tests)


def divisor_basis(genus: int) -> tuple[str, ...]:
    """Basis names of ``Pic(Mbar_G) (x) Q``.

    >>> divisor_basis(2), divisor_basis(4)
    (('delta_0', 'delta_1'), ('lambda', 'delta_0', 'delta_1', 'delta_2'))
    """
    if genus < 2:
        raise ProblemError(f"source genus {genus}: divisor classes live on Mbar_G with G >= 2")
    deltas = tuple(f"delta_{j}" for j in range(genus // 2 + 1))
    return deltas if genus == 2 else ("lambda",) + deltas


def pairing_monomials(genus: int) -> tuple[Monomial, ...]:
    """Every monomial of degree ``3G - 4`` in ``lambda, delta_0 .. delta_{G/2}``.

    >>> [m.notation for m in pairing_monomials(2)]
    ['lambda^2', 'lambda delta_0', 'lambda delta_1', 'delta_0^2', 'delta_0 delta_1', 'delta_1^2']
    """
    names = ("lambda",) + tuple(f"delta_{j}" for j in range(genus // 2 + 1))
    return tuple(Monomial.from_powers([(n, 1) for n in combo])
                 for combo in combinations_with_replacement(names, 3 * genus - 4))


def profile_symmetry(problem: HurwitzProblem) -> int:
    """Permutations of the branch points that keep the list of profiles.

    >>> profile_symmetry(HurwitzProblem.build(2, 0, genus=3))
    40320
    """
    counts: dict[tuple[int, ...], int] = {}
    for mu in problem.profiles:
        counts[tuple(mu)] = counts.get(tuple(mu), 0) + 1
    return prod(factorial(m) for m in counts.values())


def pairing(genus: int, tests: tuple[Monomial, ...], engine: str = "types") -> list[list[Fraction]]:
    """``P[k][l] = \\int_{Mbar_G} beta_k alpha_l`` from the degree-1 problem."""
    mbar = HurwitzProblem.build(1, genus, genus=genus)
    basis = divisor_basis(genus)
    jobs = [(Monomial.from_powers(dict(a.factors) | {b: a.power(b) + 1}), Monomial(())) for b in basis for a in tests]
    flat = cover_space_integrals(mbar, jobs, engine)
    return [flat[k * len(tests):(k + 1) * len(tests)] for k in range(len(basis))]


def locus_class(problem: HurwitzProblem, engine: str = "types", progress=None) -> LocusClass:
    """Solve the class of the locus (module docstring).

    Raises
    ------
    ProblemError
        When the locus is not a divisor (``3H - 3 + b != 3G - 4``) or ``G < 2``.
    IdentityError
        When the overdetermined system is inconsistent or degenerate (a bug).
    """
    if problem.marks:
        from covertree.locus.marked import marked_locus_class

        return marked_locus_class(problem, engine, progress)
    n = cover_space_dimension(problem)
    if problem.genus < 2 or n != 3 * problem.genus - 4:
        raise ProblemError(
            f"the locus is not a divisor: the cover space has dimension {n}, a divisor of Mbar_{problem.genus} "
            f"has dimension {3 * problem.genus - 4}; use the integral command instead"
        )
    tests = pairing_monomials(problem.genus)
    values = cover_space_integrals(problem, [(a, Monomial(())) for a in tests], engine, progress)
    matrix = pairing(problem.genus, tests, engine)
    solution = _solve(matrix, values)
    basis = divisor_basis(problem.genus)
    rows = tuple(CheckRow(a, v, sum((solution[k] * matrix[k][l] for k in range(len(basis))), Fraction(0)))
                 for l, (a, v) in enumerate(zip(tests, values)))
    labelled = dict(zip(basis, solution))
    symmetry = profile_symmetry(problem)
    result = LocusClass(problem, n, labelled, {k: v / symmetry for k, v in labelled.items()}, symmetry, rows)
    if not result.consistent:  # pragma: no cover - _solve already checks
        raise IdentityError("the class does not reproduce its test integrals")
    return result


def _solve(matrix: list[list[Fraction]], values: list[Fraction]) -> list[Fraction]:
    """Exact solution of ``P^T x = v``; raises when inconsistent or degenerate."""
    p_t = sympy.Matrix([[sympy.Rational(x.numerator, x.denominator) for x in row] for row in matrix]).T
    v = sympy.Matrix([sympy.Rational(x.numerator, x.denominator) for x in values])
    if p_t.rank() < p_t.shape[1]:
        raise IdentityError(f"the test pairing has rank {p_t.rank()} < {p_t.shape[1]} unknowns (a bug)")
    augmented = p_t.row_join(v)
    if augmented.rank() != p_t.rank():
        raise IdentityError("the overdetermined system for the class is inconsistent (a bug): "
                            "the test integrals do not come from one divisor class")
    solution, _params = p_t.gauss_jordan_solve(v)
    return [Fraction(int(sympy.fraction(x)[0]), int(sympy.fraction(x)[1])) for x in solution]


def family_number(result: LocusClass, degrees: Mapping[str, Fraction], unordered: bool = False) -> Fraction:
    """The intersection number of the (labelled or unordered) class with a
    one-parameter family whose degrees on ``lambda`` and the ``delta_j`` are
    ``degrees``.  Every basis class must be given; in genus 2 ``lambda`` may
    be given too and must satisfy ``10 lambda = delta_0 + 2 delta_1``.

    Raises
    ------
    InputError
        For a missing or unknown class, or an inconsistent genus-2 family.
    """
    if result.basis:
        return _marked_family_number(result, degrees, unordered)
    basis = divisor_basis(result.problem.genus)
    allowed = set(basis) | {"lambda"}
    unknown = sorted(set(degrees) - allowed)
    if unknown:
        raise InputError(f"family class {unknown[0]!r} is not a divisor of Mbar_{result.problem.genus}; "
                         f"allowed: {', '.join(sorted(allowed, key=lambda s: (s != 'lambda', s)))}")
    missing = [b for b in basis if b not in degrees]
    if missing:
        raise InputError(f"the family needs the degree of {missing[0]} (give every one of {', '.join(basis)})")
    if result.problem.genus == 2 and "lambda" in degrees:
        if 10 * degrees["lambda"] != degrees["delta_0"] + 2 * degrees["delta_1"]:
            raise InputError("a genus-2 family has 10 lambda = delta_0 + 2 delta_1; the degrees given do not")
    coefficients = result.unordered if unordered else result.labelled
    return sum((coefficients[b] * Fraction(degrees[b]) for b in basis), Fraction(0))


def _marked_family_number(result: LocusClass, degrees: Mapping[str, Fraction], unordered: bool) -> Fraction:
    """:func:`family_number` for a marked source: every basis class must be
    given; another generator may be given when it obeys its relation."""
    names = tuple(result.labelled)
    space = f"Mbar_{{{result.problem.genus},{result.problem.n_marks}}}"
    unknown = [k for k in degrees if k not in names]
    if unknown:
        raise InputError(f"family class {unknown[0]!r} is not a class of {space}; allowed: {', '.join(names)}")
    missing = [b for b in result.basis if b not in degrees]
    if missing:
        raise InputError(f"the family needs the degree of {missing[0]} (give every one of {', '.join(result.basis)})")
    for name, combination in result.relations.items():
        if name in degrees:
            implied = sum((c * Fraction(degrees[b]) for b, c in combination.items()), Fraction(0))
            if Fraction(degrees[name]) != implied:
                raise InputError(f"on {space} {name} = {_combination_text(combination)}; the family's degree of "
                                 f"{name} should be {implied}, not {Fraction(degrees[name])}")
    coefficients = result.unordered if unordered else result.labelled
    return sum((coefficients[b] * Fraction(degrees[b]) for b in result.basis), Fraction(0))


def _combination_text(combination: Mapping[str, Fraction]) -> str:
    text = " ".join(f"{'-' if c < 0 else '+'} {abs(c)} {b}" for b, c in combination.items() if c)
    return (text[2:] if text.startswith("+ ") else text) or "0"
