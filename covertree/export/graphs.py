"""JSON, CSV and LaTeX renderings of lists of strata (stable graphs).

The JSON shape is a contract::

    {"target_genus": h, "points": n, "strata": [GRAPH, ...]}

with ``GRAPH`` as in :meth:`covertree.graphs.curve_graph.CurveGraph.to_dict`.

Examples
--------
>>> from covertree.graphs import stable_graphs
>>> graphs = stable_graphs(1, 1)
>>> print(strata_csv(graphs), end="")
index,codim,vertices,automorphisms,notation
1,0,1,1,g1{1}
2,1,1,2,g0{1} | 0-0
>>> print(strata_latex(graphs))  # doctest: +NORMALIZE_WHITESPACE
\\begin{longtable}{rrrrp{0.6\\linewidth}}
\\toprule
\\# & codim & $|V|$ & $|\\mathrm{Aut}|$ & graph \\\\
\\midrule
\\endhead
\\bottomrule
\\endlastfoot
1 & 0 & 1 & 1 & {\\raggedright $g_{1}\\{1\\}$\\par} \\\\
2 & 1 & 1 & 2 & {\\raggedright $g_{0}\\{1\\} \\allowbreak\\mid 0\\mbox{--}0$\\par} \\\\
\\end{longtable}
"""

from __future__ import annotations

import csv
import io
import json
from collections.abc import Sequence

from covertree.export.latex import sized_longtable, wrapped_cell
from covertree.graphs.curve_graph import CurveGraph
from covertree.export.jsontext import json_text

__all__ = ["STRATA_COLUMNS", "latex_escape", "notation_math", "strata_csv", "strata_json", "strata_latex", "strata_rows"]

#: Column names of the CSV rendering (and of the table of the command line).
STRATA_COLUMNS = ("index", "codim", "vertices", "automorphisms", "notation")


def strata_rows(graphs: Sequence[CurveGraph]) -> list[tuple]:
    """One row ``(index, codim, vertices, automorphisms, notation)`` per graph,
    numbered from 1.

    Examples
    --------
    >>> from covertree.graphs import stable_graphs
    >>> strata_rows(stable_graphs(0, 3))
    [(1, 0, 1, 1, 'g0{1,2,3}')]
    """
    return [
        (i, g.codim, g.n_vertices, g.automorphisms, g.notation)
        for i, g in enumerate(graphs, start=1)
    ]


def strata_json(target_genus: int, points: int, graphs: Sequence[CurveGraph]) -> str:
    """The JSON document ``{"target_genus", "points", "strata"}``.

    Examples
    --------
    >>> from covertree.graphs import stable_graphs
    >>> data = json.loads(strata_json(0, 3, stable_graphs(0, 3)))
    >>> data["points"], data["strata"][0]["vertices"]
    (3, [{'genus': 0, 'legs': [1, 2, 3]}])
    """
    document = {
        "target_genus": target_genus,
        "points": points,
        "strata": [g.to_dict() for g in graphs],
    }
    return json_text(document) + "\n"


def strata_csv(graphs: Sequence[CurveGraph]) -> str:
    """CSV with a header row and the columns of :data:`STRATA_COLUMNS`."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(STRATA_COLUMNS)
    writer.writerows(strata_rows(graphs))
    return buffer.getvalue()


def strata_latex(graphs: Sequence[CurveGraph]) -> str:
    r"""The strata as a booktabs ``longtable`` (packages ``booktabs`` and
    ``longtable``), graphs in math mode (:func:`notation_math`), the graph
    column ragged right in 60% of the line so long graphs wrap between
    vertices and edges instead of overflowing."""
    rows = [rf"{i} & {codim} & {n_vertices} & {aut} & {wrapped_cell(notation_math(notation))} \\"
            for i, codim, n_vertices, aut, notation in strata_rows(graphs)]
    header = [r"\#", "codim", r"$|V|$", r"$|\mathrm{Aut}|$", "graph"]
    return sized_longtable(r"rrrrp{0.6\linewidth}", header, rows)


def latex_escape(text: str) -> str:
    r"""Escape the characters of the graph notation that LaTeX treats specially.

    Examples
    --------
    >>> print(latex_escape("g0{1} | 0-1^2"))
    g0\{1\} | 0-1\^{}2
    """
    out = []
    for char in text:
        if char in "{}#%&_$":
            out.append("\\" + char)
        elif char == "^":
            out.append(r"\^{}")
        elif char == "\\":
            out.append(r"\textbackslash{}")
        else:
            out.append(char)
    return "".join(out)


def notation_math(notation: str) -> str:
    r"""Our graph notation in math mode, edges drawn as edges.

    ``g0{1,2}`` becomes ``g_{0}\{1,2\}`` (breakable after each comma); an edge ``i-j`` becomes ``i``, an
    en dash, ``j``; ``m`` parallel edges ``i-j^m`` become ``(i`` -- ``j)^{\times
    m}`` (a multiplicity, not a power).  A line may break after each comma
    between vertices or edges and before the bar (``\allowbreak``).  Needs no
    package.

    >>> print(notation_math("g0{1}, g1 | 0-1, 1-1^2"))
    $g_{0}\{1\},\allowbreak\ g_{1} \allowbreak\mid 0\mbox{--}1,\allowbreak\ (1\mbox{--}1)^{\times 2}$
    >>> print(notation_math("g0{1,2}"))
    $g_{0}\{1,\allowbreak 2\}$
    """
    vertices, _, edges = notation.partition("|")
    parts = [", \\allowbreak ".join(_vertex_math(v.strip()) for v in vertices.split(", ") if v.strip())]
    if edges.strip():
        parts.append(",\\allowbreak\\ ".join(_edge_math(e.strip()) for e in edges.split(",")))
    return "$" + " \\allowbreak\\mid ".join(parts).replace(", \\allowbreak ", ",\\allowbreak\\ ") + "$"


def _vertex_math(vertex: str) -> str:
    r"""``g1{2,3}`` -> ``g_{1}\{2,3\}``."""
    genus, brace, legs = vertex[1:].partition("{")
    return f"g_{{{genus}}}" + (r"\{" + legs.rstrip("}").replace(",", ",\\allowbreak ") + r"\}" if brace else "")


def _edge_math(edge: str) -> str:
    r"""``0-1`` -> ``0\mbox{--}1``; ``0-1^2`` -> ``(0\mbox{--}1)^{\times 2}``."""
    pair, _, times = edge.partition("^")
    a, _, b = pair.partition("-")
    body = f"{a.strip()}\\mbox{{--}}{b.strip()}"
    return f"({body})^{{\\times {times}}}" if times else body
