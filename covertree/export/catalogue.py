r"""JSON, JSON-lines, CSV and LaTeX renderings of a catalogue of covers.

The JSON document is a contract (keys are only ever added)::

    {"problem": {"genus", "target_genus", "degree", "profiles", "codim"},
     "hurwitz_number": "p/q",
     "strata": [{"base": GRAPH, "codim": k, "orbit_size": n, "covers": [COVER, ...],
                 "total_weight": "p/q", "by_source": [{"stable_source": GRAPH, "weight": "p/q"}, ...],
                 "hurwitz_number": "p/q", "identity": true, "n_covers": m}, ...]}

    COVER = {"edge_profiles": [[int, ...], ...], "source": GRAPH, "stable_source": GRAPH,
             "automorphisms": int, "multiplicity": int, "weight": "p/q",
             "stable_codim": int, "stable_name": "delta_1" | null,
             "local_structure": LOCAL}

    LOCAL = {"nodes": [{"edge": k, "indices": [e_1, ...], "lcm": L, "branches": b}, ...],
             "branches": B, "source_edge_indices": [e, ...],
             "stable_nodes": [{"edge": k, "ends": [i, j], "order": o, "type": "delta_i" | null}, ...] | null}

``LOCAL`` is the local structure of the space of admissible covers at the
cover (:mod:`covertree.catalogue.local_structure`): it is locally
``C[[t, s_1..s_k]]/(s_i^{e_i} - t)`` over each base node; ``nodes`` has one
entry per base node (``edge`` indexes the base's ``edges``) with the indices
``e_i`` of the source nodes above it, ``L = lcm(e_i)`` and the number
``prod(e_i)/L`` of branches of the normalisation there; ``branches`` is their
product over the base nodes; ``source_edge_indices`` is the ramification index
of each edge of ``source``, in its order.  ``stable_nodes`` is given on
codimension-one base strata only (``null`` otherwise): per edge of
``stable_source`` (``edge`` indexes its ``edges``), the order ``o`` to which
the node is smoothed along a branch (the sum of ``L/e`` over the source nodes
stabilisation merged into it) and its type (``delta_0`` non-separating,
``delta_i`` separating with genus ``i <= G/2`` on one side; ``null`` for
``G < 2``).  The CSV adds the columns ``node_indices`` (per base node the
``e_i`` joined by ``,``, nodes joined by ``;``), ``node_lcms``,
``node_branches``, ``branches``, ``stable_node_orders`` and
``stable_node_types`` (per stable node, joined by ``;``; empty off
codimension one).

Grouped form (``grouped=True``, the command's ``--rows grouped``): covers
with identical rows (:mod:`covertree.catalogue.grouping`) are listed once.
Each stratum then has ``"grouped": true`` and ``"n_groups"``, and each entry
of ``"covers"`` is the first cover of its group with three added keys:
``"count"`` (covers in the group), ``"cover_numbers"`` (their 1-based
positions in the full list) and ``"group_weight"`` (their summed weight).
Every other key keeps its meaning; ``"n_covers"`` still counts all covers.
Without ``grouped`` (the default) every cover is listed.

``GRAPH`` is :meth:`covertree.graphs.curve_graph.CurveGraph.to_dict`; base legs
are the branch points ``1..b`` in the order of ``profiles``; ``edge_profiles``
follow the base's ``edges`` order.  Exact rationals are strings ``"p/q"``.

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> from covertree.catalogue.catalogue import build_catalogue
>>> cat = build_catalogue(HurwitzProblem.build(2, 0, genus=2), max_codim=1)
>>> doc = catalogue_to_dict(cat)
>>> doc["hurwitz_number"], [s["total_weight"] for s in doc["strata"]]
('1/2', ['1/2', '1/2', '1/2'])
>>> print(catalogue_to_csv(cat).splitlines()[0])
base,base_codim,orbit_size,edge_profiles,source,stable_source,stable_codim,stable_name,automorphisms,multiplicity,weight,node_indices,node_lcms,node_branches,branches,stable_node_orders,stable_node_types
"""

from __future__ import annotations

import csv
import io
from collections.abc import Iterable, Iterator
from fractions import Fraction
from operator import itemgetter

from covertree.catalogue.catalogue import Catalogue, StratumResult
from covertree.catalogue.covers import Cover
from covertree.catalogue.grouping import group_covers
from covertree.catalogue.local_structure import LocalStructure, local_structure
from covertree.export.graphs import notation_math
from covertree.export.latex import latex_document, sized_longtable, wrapped_cell
from covertree.export.rational import latex_rational, rational_str
from covertree.export.jsontext import json_text, json_line
from covertree.export.words import profiles_csv, profiles_latex

#: Column names of the CSV rendering (stable: scripts rely on them).
COVER_COLUMNS = (
    "base", "base_codim", "orbit_size", "edge_profiles", "source", "stable_source",
    "stable_codim", "stable_name", "automorphisms", "multiplicity", "weight",
    "node_indices", "node_lcms", "node_branches", "branches", "stable_node_orders", "stable_node_types",
)


def local_to_dict(local: LocalStructure) -> dict:
    """The ``LOCAL`` object of the JSON shape."""
    stable = None
    if local.stable_nodes is not None:
        stable = [{"edge": n.edge, "ends": list(n.ends), "order": n.order, "type": n.type}
                  for n in local.stable_nodes]
    return {
        "nodes": [{"edge": n.edge, "indices": list(n.indices), "lcm": n.lcm, "branches": n.branches}
                  for n in local.nodes],
        "branches": local.branches,
        "source_edge_indices": list(local.source_indices),
        "stable_nodes": stable,
    }


def local_cells(local: LocalStructure) -> tuple[str, str, str, int, str, str]:
    """The local-structure cells of a CSV row (see the module docstring)."""
    stable = local.stable_nodes or ()
    return (
        ";".join(",".join(map(str, n.indices)) for n in local.nodes),
        ";".join(str(n.lcm) for n in local.nodes),
        ";".join(str(n.branches) for n in local.nodes),
        local.branches,
        ";".join(str(n.order) for n in stable),
        ";".join(n.type or "" for n in stable),
    )


def cover_to_dict(cover: Cover) -> dict:
    """The ``COVER`` object of the JSON shape."""
    return {
        "edge_profiles": [list(p) for p in cover.edge_profiles],
        "source": cover.source.to_dict(),
        "stable_source": cover.stable_source.to_dict(),
        "automorphisms": cover.automorphisms,
        "multiplicity": cover.multiplicity,
        "weight": rational_str(cover.weight),
        "stable_codim": cover.stable_source.codim,
        "stable_name": cover.stable_source_name,
        "local_structure": local_to_dict(local_structure(cover)),
    }


def stratum_to_dict(result: StratumResult, grouped: bool = False) -> dict:
    """One entry of ``"strata"`` (grouped form: see the module docstring)."""
    extra = {}
    if grouped:
        groups = group_covers(result)
        covers = [{**cover_to_dict(g.cover), "count": g.count, "cover_numbers": list(g.numbers),
                   "group_weight": rational_str(g.total_weight)} for g in groups]
        extra = {"grouped": True, "n_groups": len(groups)}
    else:
        covers = [cover_to_dict(c) for c in result.covers]
    return {
        "base": result.base.graph.to_dict(),
        "codim": result.base.graph.codim,
        "orbit_size": result.base.orbit_size,
        "covers": covers,
        "total_weight": rational_str(result.total_weight),
        "by_source": [
            {"stable_source": g.to_dict(), "weight": rational_str(w)} for g, w in result.by_source()
        ],
        "hurwitz_number": rational_str(result.hurwitz_number),
        "identity": result.identity_holds,
        "n_covers": len(result.covers),
        **extra,
    }


def problem_to_dict(problem, codim: int) -> dict:
    """The ``"problem"`` object; ``"contracted_source"`` is true when the
    source has no moduli space (genus 1 without marks, genus 0 with at most
    two), so that ``stable_source`` holds the contracted source."""
    return {**problem.to_dict(), "codim": codim, "contracted_source": not problem.has_source_space}


def source_heading(problem) -> str:
    """The heading of the stable-source column: ``stable source``, or
    ``contracted source`` when the source has no moduli space."""
    return "stable source" if problem.has_source_space else "contracted source"


def contracted_note(problem) -> str:
    """One sentence saying what a contracted source is, or ``""``."""
    if problem.has_source_space:
        return ""
    space = f"Mbar_{{{problem.genus},{problem.n_marks}}}" if problem.n_marks else f"Mbar_{problem.genus}"
    return (f"{space} does not exist: the contracted source is the source contracted by the "
            "stabilisation rules, not a point of a moduli space")


def catalogue_to_dict(cat: Catalogue, grouped: bool = False) -> dict:
    """The whole JSON document as a dict (``to_json`` without the encoding)."""
    return {
        "problem": problem_to_dict(cat.problem, cat.codim),
        "hurwitz_number": rational_str(cat.hurwitz_number),
        "strata": [stratum_to_dict(s, grouped) for s in cat.strata],
    }


def catalogue_to_json(cat: Catalogue, grouped: bool = False) -> str:
    """The JSON document (indented, keys in a fixed order)."""
    return json_text(catalogue_to_dict(cat, grouped))


def cover_to_jsonl(base, cover: Cover, stratum_number: int | None = None, cover_number: int | None = None) -> str:
    """One JSON line: the ``COVER`` keys plus ``"base"`` (GRAPH) and
    ``"orbit_size"``, and when given ``"stratum_number"`` and
    ``"cover_number"`` (1-based, as the table numbers strata and covers), and
    ``"degree"`` (so that a line read alone, e.g. by ``draw``, knows it)."""
    raw = cover.raw
    degree = sum(k for k, v in zip(raw.source_degrees, raw.source_vertex_over) if v == 0)
    record = {"base": base.graph.to_dict(), "orbit_size": base.orbit_size, **cover_to_dict(cover),
              "degree": degree}
    if stratum_number is not None:
        record.update(stratum_number=stratum_number, cover_number=cover_number)
    return json_line(record)


def stratum_jsonl(base, covers: Iterable[Cover], stratum_number: int) -> tuple[Iterator[str], Fraction]:
    """The numbered JSON lines of one stratum's covers, in the order of
    :meth:`Cover.sort_key` (the order of :func:`stratum_result` and so of every
    output; the sort is stable, as there), and their total weight.

    Each cover is turned into its line as it comes, and only its sort key and
    line are kept until the stratum is sorted, not the cover itself."""
    rows, total = [], Fraction(0)
    for cover in covers:
        rows.append((cover.sort_key(), cover_to_jsonl(base, cover)))
        total += cover.weight
    rows.sort(key=itemgetter(0))
    # a compact line of cover_to_jsonl ends with "}": the two numbers are its
    # last keys, as cover_to_jsonl would have written them
    lines = (f'{line[:-1]},"stratum_number":{stratum_number},"cover_number":{k}}}'
             for k, (_key, line) in enumerate(rows, start=1))
    return lines, total


def _profiles_text(cover: Cover) -> str:
    return profiles_csv(cover.edge_profiles)


def cover_row(base, cover: Cover) -> tuple:
    """The CSV row of one cover, in :data:`COVER_COLUMNS` order."""
    return (
        base.graph.notation, base.graph.codim, base.orbit_size, _profiles_text(cover),
        cover.source.notation, cover.stable_source.notation, cover.stable_source.codim,
        cover.stable_source_name or "", cover.automorphisms, cover.multiplicity,
        rational_str(cover.weight), *local_cells(local_structure(cover)),
    )


def catalogue_to_csv(cat: Catalogue) -> str:
    """One row per cover, with a header row."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(COVER_COLUMNS)
    for s in cat.strata:
        for c in s.covers:
            writer.writerow(cover_row(s.base, c))
    return buffer.getvalue()


#: Columns of the LaTeX table: the notations wrap in ragged-right columns
#: sized as fractions of the line, the numbers take their natural width.
LATEX_COLUMNS = (r"p{0.1\linewidth}p{0.24\linewidth}p{0.2\linewidth}rrrrrp{0.09\linewidth}")
#: The same with the count column of grouped rows in front (the source
#: column gives up the room it takes).
LATEX_COLUMNS_GROUPED = (r"rp{0.09\linewidth}p{0.17\linewidth}p{0.17\linewidth}rrrrrp{0.09\linewidth}")


def catalogue_to_latex(cat: Catalogue, standalone: bool = False, grouped: bool = True) -> str:
    r"""A booktabs ``longtable`` in ``\footnotesize`` (one block per stratum,
    headed by the base and its check), narrow enough for the text block of an
    article or amsart page: the profiles, the sources and the orders wrap
    inside their columns; or a complete document.

    ``grouped`` (the default) lists covers whose rows are identical once, with
    their number (``3\times``) in a first column and their summed weight."""
    header = ["profiles", "source", source_heading(cat.problem), r"$|\mathrm{Aut}|$", "mult", "weight", "$L$", "br", "orders"]
    if grouped:
        header = ["covers", *header]
    rows: list[str] = []
    if contracted_note(cat.problem):
        note = contracted_note(cat.problem).replace("Mbar_", r"$\overline{M}_").replace(" does", "$ does", 1)
        rows += [f"\\multicolumn{{{len(header)}}}{{p{{0.9\\linewidth}}}}{{\\emph{{{note}}}.}} \\\\", r"\midrule"]
    for s in cat.strata:
        if rows:
            rows.append(r"\midrule")
        rows += [_latex_stratum_head(s, len(header)), r"\midrule"]
        rows += [_latex_cover_row(c, weight, count) for count, weight, c in _latex_rows(s, grouped)]
    spec = LATEX_COLUMNS_GROUPED if grouped else LATEX_COLUMNS
    body = sized_longtable(spec, header, rows, size="footnotesize", tabcolsep="3pt")
    return _document(body, cat) if standalone else body


def _latex_rows(s: StratumResult, grouped: bool) -> list[tuple]:
    """``(count, weight, cover)`` per printed row: groups of identical rows with
    their summed weight, or (``count`` ``None``) every cover."""
    if grouped:
        return [(g.count, g.total_weight, g.cover)
                for g in group_covers(s, key=lambda c: _latex_cover_row(c, c.weight, None))]
    return [(None, c.weight, c) for c in s.covers]


def _latex_stratum_head(s: StratumResult, n_columns: int = 9) -> str:
    verdict = "holds" if s.identity_holds else "FAILS"
    text = (f"base {notation_math(s.base.graph.notation)}, codim {s.base.graph.codim}, orbit "
            f"{s.base.orbit_size}: total ${latex_rational(s.total_weight)}$ vs.\\ "
            f"$H = {latex_rational(s.hurwitz_number)}$ ({verdict})")
    return f"\\multicolumn{{{n_columns}}}{{p{{0.9\\linewidth}}}}{{{wrapped_cell(text)}}} \\\\"


def _latex_cover_row(c: Cover, weight: Fraction, count: int | None) -> str:
    """One row: ``count`` in front when grouped, ``weight`` (summed when grouped)."""
    name = f" ($\\{c.stable_source_name.replace('_', '_{')}}}$)" if c.stable_source_name else ""
    orders = _latex_local(local_structure(c))
    return " & ".join([
        *([f"${count}\\times$"] if count is not None else []),
        wrapped_cell(profiles_latex(c.edge_profiles)),
        wrapped_cell(notation_math(c.source.notation)),
        wrapped_cell(notation_math(c.stable_source.notation) + name),
        str(c.automorphisms), str(c.multiplicity), f"${latex_rational(weight)}$",
        *orders[:2], wrapped_cell(orders[2]),
    ]) + r" \\"


def _latex_local(local: LocalStructure) -> list[str]:
    r"""Cells ``L`` (per base node), branches, and the stable nodes' orders with
    their types (``2\,\delta_0``), codimension one only."""
    lcms = ";".join(str(n.lcm) for n in local.nodes) or "--"
    if local.stable_nodes is None:
        orders = ""
    else:
        orders = ",\\allowbreak\\ ".join(
            f"{n.order}" + (f"\\,\\delta_{{{n.type.split('_', 1)[1]}}}" if n.type else "")
            for n in local.stable_nodes
        )
        orders = f"${orders}$" if orders else "--"
    return [lcms, str(local.branches), orders]


def _document(body: str, cat: Catalogue) -> str:
    p = cat.problem
    title = (f"Admissible covers of degree {p.degree}, genus {p.genus} over genus "
             f"{p.target_genus}, codimension $\\le {cat.codim}$")
    return latex_document(body, title, ["booktabs", "longtable", "amsmath"])
