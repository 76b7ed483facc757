r"""Pullbacks of the boundary divisors of ``Mbar_G`` to the boundary of the base.

Let ``br`` map the space of admissible covers of a Hurwitz problem to the
target's ``Mbar_{h,b}`` and ``src`` to ``Mbar_G`` (the stabilised source).
For a base divisor ``D_j`` (a codimension-one stratum: one node ``q``) and a
boundary divisor ``delta`` of ``Mbar_G`` (``delta_0``, ``delta_1``, ...,
``delta_{floor(G/2)}``) docs/theory.md, section 8, gives

    br_* src^* delta = sum_j c(D_j, delta) [D_j]   (near the boundary),

    c(D_j, delta) = sum_f (1/|Aut f|) * sum over branches of f of
                    (order of delta along the branch)
                  = sum_f (#branches_f / |Aut f|) * ord_f(delta),

the sum over the covers ``f`` over a fixed curve of type ``D_j``.

*The order of ``delta`` along a branch.*  A branch of the normalised cover
space at ``f`` is a germ with uniformiser ``u`` transverse to ``D_j``
(``t = u^L``).  Near the stabilised source ``C``, on the versal deformation
space of ``C`` (on the stack, so before dividing by ``Aut C``), the boundary is
the union of the hyperplanes ``tau_n = 0``, one for each node ``n`` of ``C``,
and ``delta`` is the union of those of the nodes of type ``delta``: ``delta_0``
for a non-separating node, ``delta_i`` for a node separating ``C`` into sides
of genera ``i <= G - i``.  Along the branch ``tau_n`` vanishes to the order
``ord(n)`` to which the node is smoothed, the sum of ``L/e`` over the source
nodes that stabilisation merged into ``n``
(:mod:`covertree.catalogue.local_structure`).  So ``ord_f(delta) = sum of
ord(n) over the stable nodes n of type delta``: a germ that meets two branches
of ``delta`` (for instance two non-separating nodes) counts both.  Each branch
maps its divisor ``u = 0`` isomorphically onto ``D_j``, hence the formula.

The second self-check (docs/theory.md, section 7): ``sum_f #branches_f * L_f /
|Aut f| = H`` for every ``D_j`` (:attr:`PullbackRow.check_holds`).

Coefficients are per labelled divisor; with orbits (the default) one
representative stands for ``orbit_size`` labelled divisors with the same
coefficients.

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers
P. Deligne and D. Mumford, "The irreducibility of the space of curves of
given genus", Publications Mathematiques de l'IHES 36 (1969): stable curves

Examples
--------
Genus-2 double covers of ``P^1`` (``Mbar_{0,6}``): over the ``2|4`` divisor
the coefficient of ``delta_0`` is 1, over the ``3|3`` divisor that of
``delta_1`` is ``1/4``:

>>> from covertree.hurwitz.problem import HurwitzProblem
>>> pb = build_pullback(HurwitzProblem.build(2, 0, genus=2))
>>> [(r.base.graph.notation, {k: str(v) for k, v in r.coefficients.items()}, str(r.branch_total)) for r in pb.rows]
[('g0{1,2}, g0{3,4,5,6} | 0-1', {'delta_0': '1', 'delta_1': '0'}, '1/2'), ('g0{1,2,3}, g0{4,5,6} | 0-1', {'delta_0': '0', 'delta_1': '1/4'}, '1/2')]
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass
from fractions import Fraction

from covertree.catalogue.catalogue import DEFAULT_MAX_COVERS, iter_stratum, problem_hurwitz, select_strata
from covertree.catalogue.covers import Cover
from covertree.catalogue.local_structure import local_structure
from covertree.errors import ProblemError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import BaseStratum

__all__ = ["PullbackRow", "Pullback", "boundary_divisors", "pullback_row", "build_pullback"]


def boundary_divisors(genus: int, n: int = 0) -> list[str]:
    """Names of the codimension-one strata of ``Mbar_G`` (``n = 0``) or of
    ``Mbar_{G,n}`` for a source with ``n`` legs: ``delta_0`` and the separating
    ``delta_i_{a,b,...}`` of :mod:`covertree.intersection.boundary`.

    >>> boundary_divisors(2), boundary_divisors(5)
    (['delta_0', 'delta_1'], ['delta_0', 'delta_1', 'delta_2'])
    >>> boundary_divisors(2, 1), boundary_divisors(1, 2)
    (['delta_0', 'delta_1_{}'], ['delta_0', 'delta_0_{1,2}'])

    Raises
    ------
    ProblemError
        For ``G < 2`` without legs (no ``Mbar_G``), or a space ``Mbar_{G,n}``
        that is not stable or has no boundary divisor.
    """
    if n:
        from covertree.intersection.boundary import divisor_name, divisors

        names = [divisor_name(genus, n, key) for key in divisors(genus, n)]  # none when 2G - 2 + n <= 0
        if not names:
            raise ProblemError(f"the marked source lands in Mbar_{{{genus},{n}}}, which has no boundary divisor "
                               "to pull back; mark more points or raise the genus")
        return names
    if genus < 2:
        raise ProblemError(
            f"pullbacks to Mbar_G need source genus G >= 2 (there is no Mbar_{genus}); got G = {genus}; "
            "mark points with --mark to land in Mbar_{G,n}"
        )
    return [f"delta_{i}" for i in range(genus // 2 + 1)]


@dataclass(frozen=True)
class PullbackRow:
    """Coefficients of ``br_* src^* delta`` at one base divisor."""

    base: BaseStratum
    coefficients: dict[str, Fraction]
    branch_total: Fraction
    hurwitz_number: Fraction
    n_covers: int

    @property
    def check_holds(self) -> bool:
        """``sum_f #branches * L / |Aut f| == H``."""
        return self.branch_total == self.hurwitz_number


@dataclass(frozen=True)
class Pullback:
    """All the base divisors of a problem with their coefficients."""

    problem: HurwitzProblem
    hurwitz_number: Fraction
    divisors: tuple[str, ...]
    rows: tuple[PullbackRow, ...]

    @property
    def failures(self) -> list[PullbackRow]:
        """Rows whose branch-total check fails (each one a bug)."""
        return [r for r in self.rows if not r.check_holds]


def pullback_row(base: BaseStratum, covers: Iterable[Cover], divisors: list[str],
                 hurwitz: Fraction) -> PullbackRow:
    """The row of one codimension-one base stratum from its covers."""
    coefficients = {d: Fraction(0) for d in divisors}
    total = Fraction(0)
    n = 0
    for cover in covers:
        n += 1
        local = local_structure(cover)
        per_branch = Fraction(local.branches, cover.automorphisms)
        total += per_branch * local.nodes[0].lcm
        for node in local.stable_nodes:
            if node.type not in coefficients:  # pragma: no cover - a bug
                raise ProblemError(f"stable node of unknown type {node.type!r}")
            coefficients[node.type] += per_branch * node.order
    return PullbackRow(base, coefficients, total, hurwitz, n)


def build_pullback(problem: HurwitzProblem, labeled: bool = False,
                   max_covers: int = DEFAULT_MAX_COVERS, strata: Iterable[BaseStratum] | None = None) -> Pullback:
    """Coefficients ``c(D_j, delta)`` for every codimension-one base stratum
    (one per orbit of like branch points unless ``labeled``); ``strata`` may
    pass :func:`pullback_strata` (for instance wrapped to report progress).

    Raises
    ------
    ProblemError
        When the source genus is below 2.
    LimitError
        When more than ``max_covers`` covers would be listed.
    """
    divisors = boundary_divisors(problem.genus, problem.n_marks)
    hurwitz = problem_hurwitz(problem)
    budget = [max_covers]
    if strata is None:
        strata = pullback_strata(problem, labeled)
    rows = tuple(pullback_row(base, iter_stratum(problem, base, budget), divisors, hurwitz) for base in strata)
    return Pullback(problem, hurwitz, tuple(divisors), rows)


def pullback_strata(problem: HurwitzProblem, labeled: bool = False) -> list[BaseStratum]:
    """The codimension-one base strata a pullback table has a row for."""
    return [base for base in select_strata(problem, 1, None, labeled) if base.codim == 1]
