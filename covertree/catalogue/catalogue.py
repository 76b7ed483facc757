"""The catalogue: every admissible cover over each base stratum, with tallies
and the degeneration identity.

For every base stratum ``G`` the total weight ``sum_f mult(f)/|Aut f|`` of the
covers over a fixed curve of type ``G`` must equal the connected Hurwitz number
(docs/theory.md, section 7); :attr:`StratumResult.identity_holds` records the verdict.

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers

Examples
--------
Genus-2 double covers of an elliptic curve (two branch points), strata of
codimension at most 1:

>>> from covertree.hurwitz.problem import HurwitzProblem
>>> cat = build_catalogue(HurwitzProblem.build(2, 1, genus=2), max_codim=1)
>>> [(str(s.base.graph), len(s.covers), str(s.total_weight), s.identity_holds) for s in cat.strata]
[('g1{1,2}', 4, '2', True), ('g0{1,2} | 0-0', 3, '2', True), ('g0{1,2}, g1 | 0-1', 4, '2', True)]
"""

from __future__ import annotations

from collections.abc import Iterable, Iterator
from dataclasses import dataclass
from fractions import Fraction

from covertree.catalogue.covers import Cover, stratum_covers
from covertree.errors import GraphError, LimitError
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.hurwitz.marks import labellings
from covertree.hurwitz.numbers import connected_hurwitz
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import BaseStratum, base_strata, stratum_orbit

#: Default bound on the number of covers listed in one run.
DEFAULT_MAX_COVERS = 200_000


@dataclass(frozen=True)
class StratumResult:
    """The covers over one base stratum (orbit) and their tallies."""

    base: BaseStratum
    covers: tuple[Cover, ...]
    hurwitz_number: Fraction

    @property
    def total_weight(self) -> Fraction:
        return sum((c.weight for c in self.covers), Fraction(0))

    @property
    def identity_holds(self) -> bool:
        """The degeneration identity: total weight == Hurwitz number."""
        return self.total_weight == self.hurwitz_number

    def by_source(self) -> list[tuple[CurveGraph, Fraction]]:
        """Summed weight per stable source stratum, sorted canonically."""
        return weight_by_graph((c.stable_source, c.weight) for c in self.covers)


def weight_by_graph(items: Iterable[tuple[CurveGraph, Fraction]]) -> list[tuple[CurveGraph, Fraction]]:
    """Sum the weights of equal graphs; sorted by ``(codim, key)``.

    >>> g = CurveGraph([2])
    >>> weight_by_graph([(g, Fraction(1, 2)), (g, Fraction(1, 2))])
    [(<CurveGraph g2>, Fraction(1, 1))]
    """
    tally: dict[CurveGraph, Fraction] = {}
    for graph, weight in items:
        tally[graph] = tally.get(graph, Fraction(0)) + weight
    return sorted(tally.items(), key=lambda kv: (kv[0].codim, kv[0].key))


@dataclass(frozen=True)
class Catalogue:
    """A Hurwitz problem, the codimension bound and one result per stratum."""

    problem: HurwitzProblem
    codim: int
    hurwitz_number: Fraction
    strata: tuple[StratumResult, ...]

    @property
    def failures(self) -> list[StratumResult]:
        """Strata whose degeneration identity fails (each one a bug)."""
        return [s for s in self.strata if not s.identity_holds]

    @property
    def n_covers(self) -> int:
        return sum(len(s.covers) for s in self.strata)


def select_strata(problem: HurwitzProblem, max_codim: int = 1, stratum: StableCurveGraph | None = None,
                  labeled: bool = False) -> list[BaseStratum]:
    """The base strata of a run: all of codimension ``<= max_codim`` (grouped by
    equal-profile relabelling unless ``labeled``), or the single ``stratum``."""
    profiles = [tuple(p) for p in problem.profiles]
    fixed = {j for j, _ in problem.marks}
    if stratum is None:
        return base_strata(problem.target_genus, profiles, max_codim, labeled=labeled, fixed=fixed)
    if not isinstance(stratum, StableCurveGraph) or stratum.genus != problem.target_genus:
        raise GraphError(
            f"stratum {stratum.notation!r} is not a stable graph of genus "
            f"{problem.target_genus} (the target genus)"
        )
    base = stratum_orbit(stratum, profiles, fixed)
    return [BaseStratum(stratum, 1)] if labeled else [base]


def iter_stratum(problem: HurwitzProblem, base: BaseStratum, budget: list[int]) -> Iterator[Cover]:
    """Covers over one stratum, streamed; ``budget[0]`` counts down the covers
    still allowed (:class:`LimitError` when exhausted)."""
    for cover in stratum_covers(base.graph, problem.degree, [tuple(p) for p in problem.profiles], problem.marks):
        if budget[0] <= 0:
            raise LimitError(
                f"more covers than the limit over stratum {base.graph.notation}; "
                "raise --max-covers or restrict --codim/--stratum"
            )
        budget[0] -= 1
        yield cover


def problem_hurwitz(problem: HurwitzProblem) -> Fraction:
    """The connected Hurwitz number of the problem (section 5); for a marked
    problem the number of marked covers, ``H`` times the labellings of the
    marked points (:func:`covertree.hurwitz.marks.labellings`)."""
    profiles = [tuple(p) for p in problem.profiles]
    plain = connected_hurwitz(problem.degree, problem.target_genus, profiles)
    return plain * labellings(profiles, problem.marks)


def stratum_result(problem: HurwitzProblem, base: BaseStratum, budget: list[int],
                   hurwitz: Fraction) -> StratumResult:
    """All covers over one stratum, in the one order every output uses
    (:meth:`Cover.sort_key`); ``budget`` as in :func:`iter_stratum`."""
    covers = sorted(iter_stratum(problem, base, budget), key=Cover.sort_key)
    return StratumResult(base, tuple(covers), hurwitz)


def build_catalogue(problem: HurwitzProblem, max_codim: int = 1, stratum: StableCurveGraph | None = None,
                    labeled: bool = False, max_covers: int = DEFAULT_MAX_COVERS,
                    strata: Iterable[BaseStratum] | None = None) -> Catalogue:
    """List every cover over every selected base stratum.

    ``strata`` may pass the result of :func:`select_strata` (for instance
    wrapped to report progress); by default it is computed here.

    Raises
    ------
    LimitError
        When more than ``max_covers`` covers would be listed.
    """
    hurwitz = problem_hurwitz(problem)
    budget = [max_covers]
    if strata is None:
        strata = select_strata(problem, max_codim, stratum, labeled)
    results = tuple(stratum_result(problem, base, budget, hurwitz) for base in strata)
    return Catalogue(problem, max_codim, hurwitz, results)
