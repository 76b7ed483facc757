r"""The Python interface: covertree from scripts and notebooks.

Every function here returns a plain immutable result with exact
:class:`~fractions.Fraction` values.  Each result's :meth:`to_json` is, text
for text, what the corresponding command prints with ``--format json``, and
:meth:`to_dict` is that document as a dict; in a notebook a result shows as an
HTML table (and, where it suits, a formula), with no dependency beyond the
standard library.  Everything not listed in ``covertree.__all__`` is internal.

Examples
--------
>>> import covertree as ct
>>> p = ct.hurwitz_problem(degree=2, target_genus=1, genus=2)
>>> ct.hurwitz_count(p).connected
Fraction(2, 1)
>>> [g.notation for g in ct.boundary_strata(1, 1).graphs]
['g1{1}', 'g0{1} | 0-0']
>>> cat = ct.cover_catalogue(p, codim=1)
>>> [(s.base.graph.notation, str(s.total_weight)) for s in cat.strata]
[('g1{1,2}', '2'), ('g0{1,2} | 0-0', '2'), ('g0{1,2}, g1 | 0-1', '2')]
>>> ct.cover_catalogue(p, codim=1, engine="types").strata[2].total_weight
Fraction(2, 1)
>>> ct.pullback_table(ct.hurwitz_problem(3, 1, genus=2)).coefficient("g0{1,2}, g1 | 0-1", "delta_1")
Fraction(6, 1)
>>> ct.generating_series(genus=2, target_genus=1, max_degree=8, weight=6).form
'(5 E2^3 - 3 E2 E4 - 2 E6)/25920'

Hooks
-----
Results derive from :class:`Result` (``to_dict``, ``to_json``, ``_table`` for
the HTML view); a new computation is one more function here
returning a new :class:`Result` subclass, exported from ``covertree`` (as
:func:`locus_class` and :func:`cover_integral` are).  A new
per-degree number for :func:`generating_series` is one more entry of
:data:`covertree.series.quantities.KINDS` (or any function of a problem passed
as ``evaluate``).
"""

from __future__ import annotations

import html
import json
from collections.abc import Callable, Iterable, Sequence
from dataclasses import dataclass
from fractions import Fraction

from covertree.catalogue.catalogue import DEFAULT_MAX_COVERS, Catalogue, build_catalogue
from covertree.catalogue.pullback import Pullback, build_pullback
from covertree.errors import InputError
from covertree.export.catalogue import catalogue_to_csv, catalogue_to_dict, catalogue_to_json, catalogue_to_latex, \
    cover_to_jsonl
from covertree.export.counts import counts_csv, counts_json, counts_latex, counts_record
from covertree.export.graphs import strata_csv, strata_json, strata_latex
from covertree.export.pullback import pullback_to_csv, pullback_to_dict, pullback_to_json, pullback_to_latex
from covertree.export.locus import class_text, integral_to_json, locus_to_json, locus_to_latex
from covertree.export.rational import latex_rational, rational_str
from covertree.export.series import series_rows, series_summary, series_to_csv, series_to_dict, series_to_json, \
    series_to_latex
from covertree.export.tallies import tallies_to_dict, tallies_to_json
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.graphs.enumerate import stable_graphs
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.numbers import hurwitz_numbers
from covertree.hurwitz.problem import HurwitzProblem
from covertree.locus.divisor import LocusClass, family_number
from covertree.locus.divisor import locus_class as _locus_class
from covertree.locus.integrals import CoverSpaceIntegral
from covertree.locus.integrals import cover_space_integral as _cover_space_integral
from covertree.locus.monomial import Monomial
from covertree.series.family import Family, ProfileShape
from covertree.series.generating import DegreeSeries, degree_series
from covertree.series.quantities import Quantity
from covertree.tallies.pullback import pullback_from_types
from covertree.tallies.types import TallyCatalogue, tally_catalogue

__all__ = [
    "CatalogueResult", "Counts", "IntegralResult", "LocusResult", "PullbackResult", "Result", "SeriesResult",
    "StrataList", "boundary_strata", "cover_catalogue", "cover_integral", "generating_series", "hurwitz_count",
    "hurwitz_problem", "locus_class", "pullback_table",
]

ENGINES = ("list", "types")


class Result:
    """Base of the results: JSON as the commands print it, notebook views."""

    def to_dict(self) -> dict:
        """The JSON document as a dict."""
        return json.loads(self.to_json())

    def to_json(self) -> str:  # pragma: no cover - every subclass defines it
        raise NotImplementedError

    def _table(self) -> tuple[str, Sequence[str], Iterable[Sequence]]:  # pragma: no cover
        raise NotImplementedError

    def _repr_html_(self) -> str:
        title, header, rows = self._table()
        cells = "".join(f"<th>{html.escape(str(h))}</th>" for h in header)
        body = "".join("<tr>" + "".join(f"<td>{html.escape(str(c))}</td>" for c in row) + "</tr>" for row in rows)
        return (f"<table><caption>{html.escape(title)}</caption><thead><tr>{cells}</tr></thead>"
                f"<tbody>{body}</tbody></table>")


def _math_text(notation: str) -> str:
    r"""Graph notation as text inside math mode: ``\text{g0\{1,2\} | 0-0}``."""
    return r"\text{" + notation.replace("{", r"\{").replace("}", r"\}") + "}"


def _problem_title(p: HurwitzProblem) -> str:
    profiles = " ".join(f"({m})" for m in p.profiles) or "none"
    return f"genus {p.genus} over genus {p.target_genus}, degree {p.degree}, profiles {profiles}"


# ---------------------------------------------------------------------------
# Problems and counts
# ---------------------------------------------------------------------------


def hurwitz_problem(degree: int, target_genus: int, genus: int | None = None,
                    profiles: Iterable[str | Iterable[int]] = ()) -> HurwitzProblem:
    """A Hurwitz problem (``--degree``, ``--target-genus``, ``--genus``,
    ``--profile`` of the commands): missing branch points are simple.

    Raises
    ------
    ProblemError, ProfileError
        For profiles or genera Riemann–Hurwitz does not allow, or an unstable target.

    Examples
    --------
    >>> hurwitz_problem(3, 0, profiles=["3", "3", "3"]).genus
    1
    """
    return HurwitzProblem.build(degree, target_genus, genus=genus, profiles=profiles)


@dataclass(frozen=True)
class Counts(Result):
    """Connected and disconnected Hurwitz numbers (``covertree count``).

    Examples
    --------
    >>> c = hurwitz_count(hurwitz_problem(3, 1, genus=2))
    >>> c.connected, c._repr_latex_()
    (Fraction(16, 1), '$H = 16,\\\\quad H^{\\\\bullet} = 18$')
    """

    problem: HurwitzProblem
    connected: Fraction
    disconnected: Fraction

    def to_json(self) -> str:
        return counts_json(self.problem, self.connected, self.disconnected)

    def to_dict(self) -> dict:
        return counts_record(self.problem, self.connected, self.disconnected)

    def to_csv(self) -> str:
        return counts_csv(self.problem, self.connected, self.disconnected)

    def to_latex(self) -> str:
        return counts_latex(self.problem, self.connected, self.disconnected)

    def _table(self):
        return (f"Hurwitz numbers: {_problem_title(self.problem)}", ("connected", "disconnected"),
                [(rational_str(self.connected), rational_str(self.disconnected))])

    def _repr_latex_(self) -> str:
        return rf"$H = {latex_rational(self.connected)},\quad H^{{\bullet}} = {latex_rational(self.disconnected)}$"


def hurwitz_count(problem: HurwitzProblem) -> Counts:
    """Connected and disconnected Hurwitz numbers by Frobenius' formula."""
    return Counts(problem, *hurwitz_numbers(problem))


# ---------------------------------------------------------------------------
# Strata
# ---------------------------------------------------------------------------


@dataclass(frozen=True)
class StrataList(Result):
    """The boundary strata of ``Mbar_{h,n}`` (``covertree strata``).

    Examples
    --------
    >>> s = boundary_strata(2, 0, codim=1)
    >>> len(s.graphs), s.to_dict()["strata"][1]["automorphisms"]
    (3, 2)
    """

    target_genus: int
    points: int
    graphs: tuple[StableCurveGraph, ...]

    def to_json(self) -> str:
        return strata_json(self.target_genus, self.points, self.graphs)

    def to_csv(self) -> str:
        return strata_csv(self.graphs)

    def to_latex(self) -> str:
        return strata_latex(self.graphs)

    def _table(self):
        rows = [(i, g.codim, g.n_vertices, g.automorphisms, g.notation) for i, g in enumerate(self.graphs, 1)]
        return (f"Strata of Mbar_{{{self.target_genus},{self.points}}}: {len(self.graphs)}",
                ("#", "codim", "|V|", "|Aut|", "graph"), rows)


def boundary_strata(target_genus: int, points: int, codim: int | None = None) -> StrataList:
    """Every stable graph of type ``(h, n)`` of codimension ``<= codim`` (all
    by default), once up to isomorphism fixing the legs.

    Raises
    ------
    GraphError
        For an unstable type or a negative codimension.
    """
    return StrataList(target_genus, points, tuple(stable_graphs(target_genus, points, codim)))


# ---------------------------------------------------------------------------
# Catalogues and pullbacks
# ---------------------------------------------------------------------------


def _engine(engine: str) -> None:
    if engine not in ENGINES:
        raise InputError(f"engine {engine!r} is not allowed; allowed: {', '.join(ENGINES)}")


def _stratum(stratum: str | StableCurveGraph | None) -> StableCurveGraph | None:
    return parse_graph(stratum) if isinstance(stratum, str) else stratum


@dataclass(frozen=True)
class CatalogueResult(Result):
    """The covers over every selected base stratum (``covertree catalogue``),
    listed (``engine="list"``) or tallied from types (``engine="types"``, no
    covers).

    Attributes
    ----------
    engine : str
    data : Catalogue or TallyCatalogue
        The library's result; ``strata`` gives its per-stratum results.
    """

    engine: str
    data: Catalogue | TallyCatalogue

    @property
    def problem(self) -> HurwitzProblem:
        return self.data.problem

    @property
    def hurwitz_number(self) -> Fraction:
        return self.data.hurwitz_number

    @property
    def strata(self) -> tuple:
        """Per stratum: ``base``, ``total_weight``, ``by_source()``, and
        ``covers`` with the list engine."""
        return self.data.strata

    @property
    def failures(self) -> list:
        """Strata whose degeneration identity fails (each one a bug)."""
        return self.data.failures

    def to_json(self) -> str:
        return catalogue_to_json(self.data) if self.engine == "list" else tallies_to_json(self.data)

    def to_dict(self) -> dict:
        return catalogue_to_dict(self.data) if self.engine == "list" else tallies_to_dict(self.data)

    def _listed(self, what: str) -> Catalogue:
        if self.engine != "list":
            raise InputError(f"the types engine gives summaries only: {what} needs engine='list'")
        return self.data

    def to_jsonl(self) -> str:
        """One JSON line per cover (``--format jsonl``)."""
        return "".join(cover_to_jsonl(s.base, c, i, k) + "\n"
                       for i, s in enumerate(self._listed("jsonl").strata, start=1)
                       for k, c in enumerate(s.covers, start=1))

    def to_csv(self) -> str:
        return catalogue_to_csv(self._listed("csv"))

    def to_latex(self, standalone: bool = False) -> str:
        return catalogue_to_latex(self._listed("latex"), standalone)

    def _table(self):
        rows = [(s.base.graph.notation, s.base.codim, s.base.orbit_size,
                 len(s.covers) if self.engine == "list" else "", rational_str(s.total_weight),
                 rational_str(s.hurwitz_number), "holds" if s.identity_holds else "FAILS") for s in self.strata]
        return (f"Admissible covers ({self.engine}): {_problem_title(self.problem)}; Hurwitz number "
                f"{rational_str(self.hurwitz_number)}",
                ("base stratum", "codim", "orbit", "covers", "total weight", "Hurwitz number", "identity"), rows)


def cover_catalogue(problem: HurwitzProblem, codim: int = 1, stratum: str | StableCurveGraph | None = None,
                    labeled: bool = False, engine: str = "list", max_covers: int = DEFAULT_MAX_COVERS
                    ) -> CatalogueResult:
    """Every admissible cover over each base stratum of codimension ``<= codim``
    (or only ``stratum``, a graph or its notation), per orbit of like branch
    points unless ``labeled``.

    Raises
    ------
    InputError
        For an unknown engine.
    GraphError
        For a stratum that is not of the target's type.
    LimitError
        When the list engine would list more than ``max_covers`` covers.
    """
    _engine(engine)
    if engine == "types":
        return CatalogueResult(engine, tally_catalogue(problem, codim, _stratum(stratum), labeled))
    return CatalogueResult(engine, build_catalogue(problem, codim, _stratum(stratum), labeled, max_covers))


@dataclass(frozen=True)
class PullbackResult(Result):
    """The coefficients ``c(D, delta)`` of ``br_* src^* delta`` (``covertree
    pullback``); ``data`` is the library's :class:`Pullback`."""

    data: Pullback

    def coefficient(self, divisor: str | StableCurveGraph, delta: str) -> Fraction:
        """``c(D, delta)`` at the row of base divisor ``divisor`` (a graph or its
        notation; the orbit's representative unless the table is labelled).

        Raises
        ------
        InputError
            For a divisor not in the table or an unknown ``delta``.
        """
        graph = _stratum(divisor)
        for row in self.data.rows:
            if row.base.graph == graph:
                if delta not in row.coefficients:
                    raise InputError(f"{delta!r} is not allowed; allowed: {', '.join(self.data.divisors)}")
                return row.coefficients[delta]
        raise InputError(f"base divisor {graph.notation!r} is not a row of the table")

    def to_json(self) -> str:
        return pullback_to_json(self.data)

    def to_dict(self) -> dict:
        return pullback_to_dict(self.data)

    def to_csv(self) -> str:
        return pullback_to_csv(self.data)

    def to_latex(self, standalone: bool = False) -> str:
        return pullback_to_latex(self.data, standalone)

    def _table(self):
        rows = [(r.base.graph.notation, r.base.orbit_size, *(rational_str(r.coefficients[d]) for d in self.data.divisors),
                 rational_str(r.branch_total)) for r in self.data.rows]
        return (f"Pullbacks of the boundary of Mbar_{self.data.problem.genus}: {_problem_title(self.data.problem)}",
                ("base divisor", "orbit", *self.data.divisors, "branch total"), rows)

    def _repr_latex_(self) -> str:
        n = len(self.data.divisors)
        head = " & ".join([r"D", *(rf"\delta_{{{d.split('_')[1]}}}" for d in self.data.divisors)])
        rows = [" & ".join([_math_text(r.base.graph.notation),
                            *(latex_rational(r.coefficients[d]) for d in self.data.divisors)])
                for r in self.data.rows]
        return "$$\\begin{array}{l" + "r" * n + "}" + head + r" \\ \hline " + r" \\ ".join(rows) + r"\end{array}$$"


def pullback_table(problem: HurwitzProblem, labeled: bool = False, engine: str = "list",
                   max_covers: int = DEFAULT_MAX_COVERS) -> PullbackResult:
    """``c(D, delta)`` for every base divisor ``D`` and every boundary divisor
    ``delta`` of ``Mbar_G``, by listing covers or from types.

    Raises
    ------
    ProblemError
        When the source genus is below 2.
    """
    _engine(engine)
    data = pullback_from_types(problem, labeled) if engine == "types" else build_pullback(problem, labeled, max_covers)
    return PullbackResult(data)


# ---------------------------------------------------------------------------
# Generating series
# ---------------------------------------------------------------------------


@dataclass(frozen=True)
class SeriesResult(Result):
    """A quantity in degrees ``1..N`` and its identification as a quasimodular
    form (``covertree series``); ``data`` is the library's :class:`DegreeSeries`."""

    data: DegreeSeries

    @property
    def found(self) -> bool:
        return self.data.identification.found

    @property
    def form(self) -> str | None:
        """The identified form as text (``None`` if none of the weight fits)."""
        return self.data.identification.text

    @property
    def expression(self):
        """The identified form as a sympy expression in ``E2, E4, E6``."""
        return self.data.identification.expression

    @property
    def coefficients(self) -> tuple[Fraction, ...]:
        """``[q^0..q^N]`` of the series."""
        return self.data.coefficients

    def to_json(self) -> str:
        return series_to_json(self.data)

    def to_dict(self) -> dict:
        return series_to_dict(self.data)

    def to_csv(self) -> str:
        return series_to_csv(self.data)

    def to_latex(self) -> str:
        return series_to_latex(self.data)

    def _table(self):
        return (f"{self.data.quantity.label}: {series_summary(self.data)}",
                ("degree", "value", "coefficient", "profiles"), series_rows(self.data))

    def _repr_latex_(self) -> str:
        found = self.data.identification
        if not found.found:
            return rf"$\text{{no quasimodular form of weight {'<= ' if self.data.mixed else ''}{self.data.weight} fits}}$"
        return rf"$\sum_{{d\ge 0}} a_d q^d = {found.latex}$"


def generating_series(genus: int | None, target_genus: int, max_degree: int, weight: int,
                      shapes: Sequence[str] = (), quantity: str = "hurwitz", stratum: str | None = None,
                      source: str | None = None, coefficient: str | None = None, engine: str = "types",
                      mixed: bool = False, constant: Fraction | int = 0, q_derivative: int = 0,
                      evaluate: Callable[[HurwitzProblem], Fraction] | None = None) -> SeriesResult:
    """The series ``sum_d d^K Q_d q^d`` of a family, identified as a
    quasimodular form (the options of ``covertree series``; ``evaluate``, any
    function of a problem, replaces the named quantity).

    Raises
    ------
    InputError
        For a bad shape, quantity, weight or too few degrees.

    Examples
    --------
    >>> s = generating_series(1, 1, 8, 2, shapes=["1^*"], mixed=True, q_derivative=1)
    >>> s.form, s._repr_latex_()
    ('(1 - E2)/24', '$\\\\sum_{d\\\\ge 0} a_d q^d = \\\\frac{1 - E_2}{24}$')
    """
    family = Family(genus, target_genus, tuple(ProfileShape.parse(s) for s in shapes))
    what = Quantity(quantity, stratum, source, coefficient, engine)
    return SeriesResult(degree_series(family, what, max_degree, weight, mixed, constant, q_derivative, evaluate))


# ---------------------------------------------------------------------------
# Classes of Hurwitz loci and integrals over the cover space
# ---------------------------------------------------------------------------


@dataclass(frozen=True)
class LocusResult(Result):
    """The class of a divisorial Hurwitz locus in ``Mbar_G`` (``covertree
    locus``); ``data`` is the library's :class:`~covertree.locus.divisor.LocusClass`
    (``labelled``, ``unordered``, ``symmetry``, ``tests``), ``family`` the
    intersection numbers with a family when one was given.

    Examples
    --------
    >>> r = locus_class(hurwitz_problem(2, 1, genus=2), family={"delta_0": 10, "delta_1": 0})
    >>> r.unordered, r.family
    ({'delta_0': Fraction(3, 1), 'delta_1': Fraction(12, 1)}, {'labelled': Fraction(60, 1), 'unordered': Fraction(30, 1)})
    >>> r._repr_latex_()[:46]
    '$[\\\\overline{\\\\mathcal{H}}] = 6\\\\,\\\\delta_{0} + 24'
    """

    data: LocusClass
    family: dict[str, Fraction] | None = None

    @property
    def labelled(self) -> dict[str, Fraction]:
        """The class for labelled branch points, by basis name."""
        return dict(self.data.labelled)

    @property
    def unordered(self) -> dict[str, Fraction]:
        """The class divided by the symmetry of the profiles."""
        return dict(self.data.unordered)

    @property
    def consistent(self) -> bool:
        """Whether every test integral is reproduced (always, or it raised)."""
        return self.data.consistent

    def to_json(self) -> str:
        return locus_to_json(self.data, self.family)

    def to_latex(self) -> str:
        return locus_to_latex(self.data)

    def _table(self):
        p = self.data.problem
        rows = [("labelled", class_text(self.data.labelled)),
                (f"unordered (/{self.data.symmetry})", class_text(self.data.unordered))]
        if self.family is not None:
            rows += [("family: labelled", rational_str(self.family["labelled"])),
                     ("family: unordered", rational_str(self.family["unordered"]))]
        return (f"Class of the locus in Mbar_{p.genus}: {_problem_title(p)}; {len(self.data.tests)} test monomials",
                ("branch points", "class"), rows)

    def _repr_latex_(self) -> str:
        return "$" + locus_to_latex(self.data)[3:-3] + "$"


def locus_class(problem: HurwitzProblem, engine: str = "types",
                family: dict[str, Fraction | int] | None = None) -> LocusResult:
    """The class ``src_*[Adm]`` of the Hurwitz locus in ``lambda, delta_0, ...``
    when the cover space has dimension ``3G - 4``, solved from the integrals of
    every test monomial (an overdetermined, checked system); with ``family``
    (degrees of ``lambda`` and the ``delta_j``) also its number on that family.

    Raises
    ------
    ProblemError
        When the locus is not a divisor or ``G < 2``.
    InputError
        For an unknown engine or a bad family.
    IdentityError
        When the system is inconsistent (a bug).
    """
    _engine(engine)
    data = _locus_class(problem, engine)
    numbers = None
    if family is not None:
        degrees = {k: Fraction(v) for k, v in family.items()}
        numbers = {"labelled": family_number(data, degrees), "unordered": family_number(data, degrees, True)}
    return LocusResult(data, numbers)


@dataclass(frozen=True)
class IntegralResult(Result):
    """An integral over the space of admissible covers (``covertree
    integral``); ``data`` is the library's ``CoverSpaceIntegral``.

    Examples
    --------
    >>> r = cover_integral(hurwitz_problem(2, 0, genus=2), source="lambda^3")
    >>> r.value, r.to_dict()["source"]   # 6! labellings times 1/2880 (Mumford)
    (Fraction(1, 4), 'lambda^3')
    """

    data: CoverSpaceIntegral

    @property
    def value(self) -> Fraction:
        return self.data.value

    def to_json(self) -> str:
        return integral_to_json(self.data)

    def _table(self):
        d = self.data
        return (f"Integral over the cover space: {_problem_title(d.problem)}", ("source", "target", "value"),
                [(d.source.notation or "1", d.target.notation or "1", rational_str(d.value))])

    def _repr_latex_(self) -> str:
        return rf"$\int_{{\overline{{\mathrm{{Adm}}}}}} = {latex_rational(self.value)}$"


def cover_integral(problem: HurwitzProblem, source: str = "", target: str = "", engine: str = "types"
                   ) -> IntegralResult:
    """``\\int_{Adm} src^*(source) br^*(target)`` (labelled branch points,
    covers weighted ``1/|Aut|``); ``source`` in ``lambda``, ``delta_j``,
    ``target`` in ``psi_j``, ``kappa`` (e.g. ``"lambda delta_0^2"``), degrees
    adding up to ``3H - 3 + b``.

    Raises
    ------
    MonomialError
        For a class that does not parse or exist, or a wrong degree.
    """
    _engine(engine)
    src = Monomial.parse(source, kinds="source")
    tgt = Monomial.parse(target, kinds="target")
    return IntegralResult(_cover_space_integral(problem, src, tgt, engine))
