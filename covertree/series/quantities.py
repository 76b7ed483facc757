"""The per-degree numbers whose generating series covertree studies.

A :class:`Quantity` names one number covertree prints for a Hurwitz problem:

``hurwitz``
    the connected Hurwitz number (``covertree count``);
``disconnected``
    the disconnected Hurwitz number;
``total``
    the total weight ``sum_f mult(f)/|Aut f|`` over the base stratum
    ``stratum`` (``covertree catalogue``; equal to the Hurwitz number by the
    degeneration identity);
``source``
    the weight over ``stratum`` landing on the stable source stratum
    ``source`` (the catalogue's ``by_source`` tally);
``pullback``
    the coefficient ``c(D, delta)`` of ``covertree pullback`` at the base
    divisor ``stratum`` for ``coefficient`` = ``delta_i``;
``locus``
    the coefficient ``coefficient`` (``lambda`` or ``delta_j``) of the class
    of the Hurwitz locus in ``Mbar_G`` (``covertree locus``, labelled branch
    points; the problems must have a divisorial cover space);
``locus_unordered``
    the same coefficient of the class divided by the symmetry of the profiles.

``engine`` is ``"types"`` (tallies from combinatorial types, the default) or
``"list"`` (every cover listed); both give the same numbers.

Adding a kind (hook)
--------------------
Every kind is an entry of :data:`KINDS`: the fields it needs and a function
``(quantity, problem) -> Fraction``.  A new kind is one more entry there (as
``locus`` is); the series command and the Python interface pick it up from
:data:`KINDS`.  From Python, any function
``problem -> Fraction`` can be passed to
:func:`covertree.series.generating.degree_series` as ``evaluate`` without
registering it.

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> p = HurwitzProblem.build(3, 1, genus=2)
>>> Quantity("hurwitz").evaluate(p), Quantity("total", stratum="g0{1,2} | 0-0").evaluate(p)
(Fraction(16, 1), Fraction(16, 1))
>>> Quantity("pullback", stratum="g0{1,2}, g1 | 0-1", coefficient="delta_1").evaluate(p)
Fraction(6, 1)
>>> Quantity("locus", coefficient="delta_1").evaluate(p)   # the 3-elliptic locus in Mbar_2
Fraction(96, 1)
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass
from fractions import Fraction
from types import MappingProxyType

from covertree.catalogue.catalogue import DEFAULT_MAX_COVERS, StratumResult, iter_stratum, problem_hurwitz, select_strata
from covertree.catalogue.pullback import boundary_divisors, pullback_row
from covertree.errors import GraphError, InputError
from covertree.graphs.curve_graph import StableCurveGraph
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.numbers import hurwitz_numbers
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.pullback import pullback_row_from_tally
from covertree.tallies.types import TypeTally, tally_stratum

__all__ = ["ENGINES", "KINDS", "Kind", "Quantity"]

#: The engines computing stratum tallies.
ENGINES = ("types", "list")


@dataclass(frozen=True)
class Quantity:
    """One per-problem number (kinds in the module docstring).

    Parameters
    ----------
    kind : str
        A key of :data:`KINDS`.
    stratum : str, optional
        Base stratum (graph notation), for ``total``, ``source``, ``pullback``.
    source : str, optional
        Stable source stratum (graph notation), for ``source``.
    coefficient : str, optional
        ``delta_i`` for ``pullback``, ``lambda`` or ``delta_j`` for ``locus``
        (the name of a coefficient, for kinds that need one).
    engine : str
        ``"types"`` or ``"list"``.

    Raises
    ------
    InputError
        For an unknown kind or engine, a missing or superfluous field, or a
        notation that does not parse (a :class:`~covertree.errors.NotationError`).
    """

    kind: str
    stratum: str | None = None
    source: str | None = None
    coefficient: str | None = None
    engine: str = "types"

    def __post_init__(self) -> None:
        if self.kind not in KINDS:
            raise InputError(f"quantity {self.kind!r} is not known; allowed: {', '.join(KINDS)}")
        if self.engine not in ENGINES:
            raise InputError(f"engine {self.engine!r} is not allowed; allowed: {', '.join(ENGINES)}")
        needs = KINDS[self.kind].needs
        for name in ("stratum", "source", "coefficient"):
            given = getattr(self, name) is not None
            if given != (name in needs):
                verb = "needs" if name in needs else "takes no"
                raise InputError(f"quantity {self.kind!r} {verb} {name}")
        if self.stratum is not None:
            self.base_graph()
        if self.source is not None:
            parse_graph(self.source)

    def base_graph(self) -> StableCurveGraph:
        """The base stratum as a graph (``stratum`` parsed)."""
        graph = parse_graph(self.stratum)
        if not isinstance(graph, StableCurveGraph):
            raise GraphError(f"stratum {self.stratum!r} is not a stable graph")
        return graph

    def evaluate(self, problem: HurwitzProblem) -> Fraction:
        """The number for one problem."""
        return KINDS[self.kind].evaluate(self, problem)

    @property
    def label(self) -> str:
        """A short description, e.g. ``total weight over g0{1,2} | 0-0``."""
        return KINDS[self.kind].label.format(q=self)

    def to_dict(self) -> dict:
        """``{"kind", "stratum", "source", "coefficient", "engine"}``."""
        return {"kind": self.kind, "stratum": self.stratum, "source": self.source,
                "coefficient": self.coefficient, "engine": self.engine}


@dataclass(frozen=True)
class Kind:
    """A kind of quantity: the fields it needs, how to compute it, a label
    (a format string with ``{q}`` the quantity)."""

    needs: tuple[str, ...]
    evaluate: Callable[[Quantity, HurwitzProblem], Fraction]
    label: str


def _stratum_tally(q: Quantity, problem: HurwitzProblem) -> TypeTally | StratumResult:
    [base] = select_strata(problem, 0, q.base_graph())
    if q.engine == "types":
        return tally_stratum(problem, base)
    covers = tuple(iter_stratum(problem, base, [DEFAULT_MAX_COVERS]))
    return StratumResult(base, covers, problem_hurwitz(problem))


def _total(q: Quantity, problem: HurwitzProblem) -> Fraction:
    return _stratum_tally(q, problem).total_weight


def _source(q: Quantity, problem: HurwitzProblem) -> Fraction:
    target = parse_graph(q.source)
    return sum((w for g, w in _stratum_tally(q, problem).by_source() if g == target), Fraction(0))


def _pullback(q: Quantity, problem: HurwitzProblem) -> Fraction:
    divisors = boundary_divisors(problem.genus)
    if q.coefficient not in divisors:
        raise InputError(f"coefficient {q.coefficient!r} is not a divisor of Mbar_{problem.genus}; "
                         f"allowed: {', '.join(divisors)}")
    if q.base_graph().codim != 1:
        raise InputError(f"stratum {q.stratum!r} has codimension {q.base_graph().codim}; pullback "
                         "coefficients are at base divisors (codimension 1)")
    tally = _stratum_tally(q, problem)
    if isinstance(tally, TypeTally):
        row = pullback_row_from_tally(tally, divisors)
    else:
        row = pullback_row(tally.base, tally.covers, divisors, tally.hurwitz_number)
    return row.coefficients[q.coefficient]


def _locus(q: Quantity, problem: HurwitzProblem, unordered: bool = False) -> Fraction:
    from covertree.locus.divisor import divisor_basis, locus_class

    basis = divisor_basis(problem.genus)
    if q.coefficient not in basis:
        raise InputError(f"coefficient {q.coefficient!r} is not a basis class of Pic(Mbar_{problem.genus}); "
                         f"allowed: {', '.join(basis)}")
    result = locus_class(problem, q.engine)
    return (result.unordered if unordered else result.labelled)[q.coefficient]


#: Every kind of quantity, by name (read-only; a new kind is a new entry here).
KINDS: Mapping[str, Kind] = MappingProxyType({
    "hurwitz": Kind((), lambda q, p: problem_hurwitz(p), "connected Hurwitz number"),
    "disconnected": Kind((), lambda q, p: hurwitz_numbers(p)[1], "disconnected Hurwitz number"),
    "total": Kind(("stratum",), _total, "total weight over {q.stratum}"),
    "source": Kind(("stratum", "source"), _source, "weight over {q.stratum} landing on {q.source}"),
    "pullback": Kind(("stratum", "coefficient"), _pullback, "c({q.stratum}, {q.coefficient})"),
    "locus": Kind(("coefficient",), _locus, "{q.coefficient} coefficient of the locus class"),
    "locus_unordered": Kind(("coefficient",), lambda q, p: _locus(q, p, True),
                            "{q.coefficient} coefficient of the locus class / profile symmetry"),
})
