"""Pullbacks of the boundary divisors of ``Mbar_G`` from types (docs/theory.md,
section 8), without listing covers.

For a base divisor ``D`` (one node with profile ``e_1..e_k``, ``L = lcm e_i``)
a cover ``f`` has ``#branches = prod e_i / L = mult(f)/L`` branches, so

    c(D, delta) = sum_f #branches/|Aut f| * ord_f(delta)
                = sum over tally entries of (weight / L) * ord(delta),

with ``weight = sum mult(f)/|Aut f|`` over the covers of the entry and
``ord(delta)`` the sum of the orders ``sum_{s in chain} L/e_s`` of the stable
nodes of type ``delta`` (:mod:`covertree.catalogue.local_structure`), both
functions of the entry.  The branch total ``sum_f #branches * L / |Aut f|`` is
the total weight.  The rows are :class:`covertree.catalogue.pullback.PullbackRow`
objects with ``n_covers = 0`` (the type engine lists no covers).

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers

Examples
--------
Genus-2 double covers of ``P^1``, as in :mod:`covertree.catalogue.pullback`:

>>> from covertree.hurwitz.problem import HurwitzProblem
>>> pb = pullback_from_types(HurwitzProblem.build(2, 0, genus=2))
>>> [(r.base.graph.notation, {k: str(v) for k, v in r.coefficients.items()}) for r in pb.rows]
[('g0{1,2}, g0{3,4,5,6} | 0-1', {'delta_0': '1', 'delta_1': '0'}), ('g0{1,2,3}, g0{4,5,6} | 0-1', {'delta_0': '0', 'delta_1': '1/4'})]
"""

from __future__ import annotations

from fractions import Fraction

from covertree.catalogue.catalogue import problem_hurwitz, select_strata
from covertree.catalogue.local_structure import node_type
from covertree.catalogue.pullback import Pullback, PullbackRow, boundary_divisors
from covertree.errors import IdentityError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import TypeTally, tally_stratum

__all__ = ["pullback_row_from_tally", "pullback_from_types"]


def pullback_row_from_tally(tally: TypeTally, divisors: list[str]) -> PullbackRow:
    """The row of one codimension-one base stratum from its tally.

    Raises
    ------
    IdentityError
        For a base of another codimension, or a node of unknown type (a bug).
    """
    coefficients = {d: Fraction(0) for d in divisors}
    for entry, per_branch, orders in tally.pullback_orders():
        stab = entry.stabilised
        for n, order in orders:
            kind = node_type(stab.genera, stab.edges, n, stab.legs)
            if kind not in coefficients:
                raise IdentityError(f"stable node of unknown type {kind!r}")
            coefficients[kind] += per_branch * order
    return PullbackRow(tally.base, coefficients, tally.total_weight, tally.hurwitz_number, 0)


def pullback_from_types(problem: HurwitzProblem, labeled: bool = False) -> Pullback:
    """Coefficients ``c(D, delta)`` for every codimension-one base stratum (one
    per orbit unless ``labeled``), as
    :func:`covertree.catalogue.pullback.build_pullback` computes them by listing.

    Raises
    ------
    ProblemError
        When the source genus is below 2.
    """
    divisors = boundary_divisors(problem.genus, problem.n_marks)
    rows = [pullback_row_from_tally(tally_stratum(problem, base), divisors)
            for base in select_strata(problem, 1, None, labeled) if base.codim == 1]
    return Pullback(problem, problem_hurwitz(problem), tuple(divisors), tuple(rows))
