r"""JSON, CSV and LaTeX renderings of a sweep (one row per problem and base
stratum), and the JSON reader used to merge shards.

The JSON document is a contract (keys are only ever added)::

    {"model_version": int,
     "sweep": {"genus": [int, ...] | null, "target_genus": [...], "degree": [...],
               "profiles": [[int, ...], ...], "codim": int, "labeled": bool},   -- not in an export
     "shard": {"index": I, "count": N, "tasks": T},                             -- only in a shard
     "task_indices": [int, ...],                                                -- only in a shard
     "problems": [{"genus", "target_genus", "degree", "profiles"}, ...],
     "skipped": [{"genus", "target_genus", "degree", "reason"}, ...],
     "strata": [ROW, ...],
     "summary": {"problems", "skipped", "strata", "covers", "failures"}}

    ROW = {"genus", "target_genus", "degree", "profiles", "base": NOTATION, "codim",
           "orbit_size", "n_covers", "total_weight": "p/q", "hurwitz_number": "p/q",
           "identity": bool, "landing": {"delta_0": "p/q", ..., "other": "p/q"},
           "base_graph": GRAPH}

``landing`` is the weight whose stable source lies in the open boundary
divisor ``delta_i`` of ``Mbar_g`` (``i = 0 .. g//2``), the rest (smooth or
deeper stable sources, genus below 2) under ``"other"``.  This is not the
pullback coefficient ``c(D, delta_i)`` of ``covertree pullback`` (which
counts branches and smoothing orders): in tables and CSV the landing
columns are headed ``lands in delta_i`` / ``lands_in_delta_i`` and
``elsewhere`` / ``lands_elsewhere``, never plain ``delta_i``.  The CSV has one
column per ``delta_i`` up to the largest genus in the rows (empty where
``i > g//2``).  ``base_graph`` is the base as a graph object (as in the
catalogue's JSON), beside the notation string ``base``.

Examples
--------
>>> from covertree.sweep.tasks import SweepSpec, plan_sweep, compute_task
>>> from covertree.sweep.report import sweep_report
>>> plan = plan_sweep(SweepSpec((2,), (1,), (2,)))
>>> report = sweep_report(plan, [compute_task(t) for t in plan.tasks])
>>> print(sweep_to_csv(report))
genus,target_genus,degree,profiles,base,codim,orbit_size,n_covers,total_weight,hurwitz_number,identity,lands_in_delta_0,lands_in_delta_1,lands_elsewhere
2,1,2,2;2,"g1{1,2}",0,1,4,2,2,true,0,0,2
2,1,2,2;2,"g0{1,2} | 0-0",1,1,3,2,2,true,1,0,1
2,1,2,2;2,"g0{1,2}, g1 | 0-1",1,1,4,2,2,true,3/2,1/2,0
<BLANKLINE>
>>> sweep_from_json(sweep_to_json(report)) == report
True
>>> summary_line(report)
'1 problem (0 skipped), 3 strata, 11 covers, 0 identity failures'
"""

from __future__ import annotations

import csv
import io
from fractions import Fraction

from covertree import MODEL_VERSION
from covertree.errors import InputError
from covertree.export.graphs import notation_math
from covertree.export.latex import sized_longtable, wrapped_cell
from covertree.export.rational import latex_rational, rational_str
from covertree.graphs.curve_graph import StableCurveGraph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.sweep.report import Shard, SweepReport
from covertree.sweep.tasks import Skipped, StratumSummary, SweepSpec, divisor_names
from covertree.symmetric.partitions import Partition
from covertree.export.jsontext import json_text
from covertree.export.schema import RATIONAL, MapOf, Nullable, check_shape, load_json, short
from covertree.export.words import count_noun, profiles_csv, profiles_latex

__all__ = ["sweep_to_dict", "sweep_to_json", "sweep_to_csv", "sweep_to_latex", "sweep_from_json",
           "summary_line", "landing_columns", "landing_header", "ROW_COLUMNS"]

#: The CSV columns before the landing columns (stable: scripts rely on them).
ROW_COLUMNS = ("genus", "target_genus", "degree", "profiles", "base", "codim", "orbit_size",
               "n_covers", "total_weight", "hurwitz_number", "identity")


def row_to_dict(row: StratumSummary) -> dict:
    """The ``ROW`` object of the JSON shape."""
    p = row.problem
    return {
        "genus": p.genus, "target_genus": p.target_genus, "degree": p.degree,
        "profiles": [list(mu) for mu in p.profiles], "base": row.stratum, "codim": row.codim,
        "orbit_size": row.orbit_size, "n_covers": row.n_covers,
        "total_weight": rational_str(row.total_weight), "hurwitz_number": rational_str(row.hurwitz_number),
        "identity": row.identity_holds, "landing": {name: rational_str(w) for name, w in row.landing},
        "base_graph": StableCurveGraph.parse(row.stratum).to_dict(),
    }


def sweep_to_dict(report: SweepReport) -> dict:
    """The whole JSON document as a dict."""
    doc: dict = {"model_version": MODEL_VERSION}
    if report.spec is not None:
        doc["sweep"] = report.spec.to_dict()
    if report.shard is not None:
        s = report.shard
        doc["shard"] = {"index": s.index, "count": s.count, "tasks": s.tasks}
        doc["task_indices"] = list(s.task_indices)
    doc["problems"] = [p.to_dict() for p in report.problems]
    doc["skipped"] = [s.to_dict() for s in report.skipped]
    doc["strata"] = [row_to_dict(r) for r in report.rows]
    doc["summary"] = report.summary()
    return doc


def sweep_to_json(report: SweepReport) -> str:
    """The JSON document (indented, keys in a fixed order)."""
    return json_text(sweep_to_dict(report))


def landing_header(column: str, medium: str = "table") -> str:
    """The header of a landing column (``delta_i`` or ``other``) in a table,
    CSV or LaTeX: never the bare divisor name, which in ``pullback`` means
    the coefficient ``c(D, delta_i)``.

    >>> [landing_header(c, m) for m in ("table", "csv") for c in ("delta_1", "other")]
    ['lands in delta_1', 'elsewhere', 'lands_in_delta_1', 'lands_elsewhere']
    """
    if medium == "csv":
        return "lands_elsewhere" if column == "other" else f"lands_in_{column}"
    if medium == "latex":
        return "elsewhere" if column == "other" else r"in $\delta_{" + column.split("_")[1] + "}$"
    return "elsewhere" if column == "other" else f"lands in {column}"


def landing_columns(report: SweepReport) -> list[str]:
    """``delta_0 .. delta_M`` (``M`` from the largest source genus), then ``other``."""
    top = max((r.problem.genus for r in report.rows), default=0)
    return [*divisor_names(top), "other"]


def _csv_row(row: StratumSummary, columns: list[str]) -> list:
    d = row_to_dict(row)
    head = [d[k] for k in ROW_COLUMNS]
    head[3] = profiles_csv(d["profiles"])
    head[10] = "true" if d["identity"] else "false"
    return head + [d["landing"].get(name, "") for name in columns]


def sweep_to_csv(report: SweepReport) -> str:
    """One row per (problem, stratum), with a header row."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    columns = landing_columns(report)
    writer.writerow([*ROW_COLUMNS, *(landing_header(c, "csv") for c in columns)])
    for row in report.rows:
        writer.writerow(_csv_row(row, columns))
    return buffer.getvalue()


def summary_line(report: SweepReport) -> str:
    """``"P problems (S skipped), T strata, C covers, F identity failures"``."""
    s = report.summary()
    return (f"{count_noun(s['problems'], 'problem')} ({s['skipped']} skipped), "
            f"{count_noun(s['strata'], 'stratum', 'strata')}, {count_noun(s['covers'], 'cover')}, "
            f"{count_noun(s['failures'], 'identity failure')}")


def _latex_row(row: StratumSummary, columns: list[str]) -> str:
    p, landing = row.problem, dict(row.landing)
    cells = [str(p.genus), str(p.target_genus), str(p.degree),
             wrapped_cell(profiles_latex(p.profiles)),
             wrapped_cell(notation_math(row.stratum)), str(row.orbit_size), count_text(row.n_covers),
             f"${latex_rational(row.total_weight)}$", f"${latex_rational(row.hurwitz_number)}$",
             "holds" if row.identity_holds else "FAILS"]
    cells += [f"${latex_rational(landing[c])}$" if c in landing else "" for c in columns]
    return " & ".join(cells) + r" \\"


def sweep_to_latex(report: SweepReport) -> str:
    r"""A booktabs ``longtable`` in ``\scriptsize`` (one line per row; the
    profiles and the base wrap inside their columns, so the table keeps to the
    text width of an article or amsart page), then the summary line."""
    columns = landing_columns(report)
    names = [landing_header(c, "latex") for c in columns]
    head = [r"$g$", r"$h$", r"$d$", "profiles", "base", "orbit", "covers", "total", "$H$", "identity"]
    spec = r"rrrp{0.1\linewidth}p{0.19\linewidth}" + "r" * (5 + len(columns))
    table = sized_longtable(spec, head + names, [_latex_row(row, columns) for row in report.rows],
                            size="scriptsize", tabcolsep="2pt")
    return "\n".join([table, "", summary_line(report) + "."])


_PROBLEM = {"genus": int, "target_genus": int, "degree": int, "profiles": [[int]]}
_ROW = {**_PROBLEM, "base": str, "codim": int, "orbit_size": int, "n_covers": Nullable(int),
        "total_weight": RATIONAL, "hurwitz_number": RATIONAL, "landing": MapOf(RATIONAL)}
_SKIPPED = {"genus": Nullable(int), "target_genus": int, "degree": int, "reason": str}
#: The shape :func:`sweep_from_json` checks before reading (see the module docstring).
SHAPE = {"model_version": int, "problems": [_PROBLEM], "skipped": [_SKIPPED], "strata": [_ROW]}
_SHARD = {"shard": {"index": int, "count": int, "tasks": int}, "task_indices": [int]}
_SPEC = {"genus": Nullable([int]), "target_genus": [int], "degree": [int], "profiles": [[int]],
         "codim": int, "labeled": bool}


def sweep_from_json(text: str | bytes, name: str = "input") -> SweepReport:
    """Read a document of :func:`sweep_to_json` back (for merging shards),
    checked against its shape (:data:`SHAPE`) before anything is built.

    Raises
    ------
    InputError
        If ``text`` is not UTF-8 JSON of that shape, or has another model
        version (one line naming the place and a short quote).
    """
    doc = load_json(text.encode("utf-8") if isinstance(text, str) else text, name)
    if not isinstance(doc, dict) or "strata" not in doc:
        raise InputError(f"{name} is not a covertree sweep JSON document")
    if doc.get("model_version") != MODEL_VERSION:
        raise InputError(f"{name} was written with model version {short(doc.get('model_version'))}; "
                         f"this covertree uses model version {MODEL_VERSION}")
    _check_document(doc, name)
    try:
        return _report(doc)
    except (KeyError, TypeError, ValueError, AttributeError, ZeroDivisionError) as error:
        if isinstance(error, InputError):
            raise InputError(f"{name}: {error}") from None
        raise InputError(f"{name} is not a covertree sweep JSON document "
                         f"(missing or malformed {short(str(error))})") from None


def _check_document(doc: dict, name: str) -> None:
    check_shape(SHAPE, doc, name)
    if "sweep" in doc:
        check_shape(_SPEC, doc["sweep"], name, "sweep")
    if "shard" in doc:
        check_shape(_SHARD, doc, name)
        _check_shard(doc["shard"], doc["task_indices"], len(doc["strata"]), name)


def _check_shard(shard: dict, indices: list[int], rows: int, name: str) -> None:
    """A shard ``index/count`` of ``tasks`` tasks with one index per row,
    increasing, in range and in its slice (``index % count == I - 1``)."""
    count, tasks = shard["count"], shard["tasks"]
    if not (1 <= shard["index"] <= count <= max(tasks, 1)):
        raise InputError(f"{name}: shard {short(shard['index'])}/{short(count)} of {short(tasks)} tasks "
                         "is impossible (1 <= I <= N <= tasks)")
    fits = all(0 <= i < tasks and i % count == shard["index"] - 1 for i in indices)
    if len(indices) != rows or not fits or indices != sorted(set(indices)):
        raise InputError(f"{name}: task_indices do not match shard {shard['index']}/{count} "
                         f"of {tasks} tasks and its {rows} rows")


def _problem(d: dict) -> HurwitzProblem:
    return HurwitzProblem(d["genus"], d["target_genus"], d["degree"],
                          tuple(Partition(mu) for mu in d["profiles"]))


def _row(d: dict) -> StratumSummary:
    problem = _problem(d)
    names = [*divisor_names(problem.genus), "other"]
    if not set(d["landing"]) <= set(names):
        raise InputError(f"row over {short(d['base'])}: landing keys {short(sorted(d['landing']))} "
                         f"are not among {', '.join(names)}")
    _base_graph(d["base"])
    landing = tuple((k, Fraction(v)) for k, v in d["landing"].items())
    row = StratumSummary(problem, d["base"], d["codim"], d["orbit_size"], d["n_covers"],
                         Fraction(d["hurwitz_number"]), landing)
    if Fraction(d["total_weight"]) != row.total_weight:
        raise InputError(f"row over {short(d['base'])}: total_weight {short(d['total_weight'])} "
                         "is not the sum of the landing weights")
    return row


def _base_graph(notation: str) -> StableCurveGraph:
    try:
        return StableCurveGraph.parse(notation)
    except (ValueError, RecursionError) as error:
        raise InputError(f"row over {short(notation)}: {short(str(error))[1:-1]}") from None


def _report(doc: dict) -> SweepReport:
    spec = SweepSpec.from_dict(doc["sweep"]) if "sweep" in doc else None
    shard = None
    if "shard" in doc:
        s = doc["shard"]
        shard = Shard(s["index"], s["count"], s["tasks"], tuple(doc["task_indices"]))
    skipped = tuple(Skipped(s["genus"], s["target_genus"], s["degree"], s["reason"]) for s in doc["skipped"])
    return SweepReport(spec, tuple(_problem(p) for p in doc["problems"]), skipped,
                       tuple(_row(r) for r in doc["strata"]), shard)


def count_text(n_covers: int | None) -> str:
    """A cover count for tables: ``-`` when the type engine gave none.

    >>> count_text(3), count_text(None)
    ('3', '-')
    """
    return "-" if n_covers is None else str(n_covers)
