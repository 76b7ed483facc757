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
\\begin{tabular}{rrrrl}
\\hline
\\# & codim & $|V|$ & $|\\mathrm{Aut}|$ & graph \\\\
\\hline
1 & 0 & 1 & 1 & \\texttt{g1\\{1\\}} \\\\
2 & 1 & 1 & 2 & \\texttt{g0\\{1\\} | 0-0} \\\\
\\hline
\\end{tabular}
"""

from __future__ import annotations

import csv
import io
import json
from collections.abc import Sequence

from covertree.graphs.curve_graph import CurveGraph

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
    return json.dumps(document, indent=2) + "\n"


def strata_csv(graphs: Sequence[CurveGraph]) -> str:
    """CSV with a header row and the columns of :data:`STRATA_COLUMNS`."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(STRATA_COLUMNS)
    writer.writerows(strata_rows(graphs))
    return buffer.getvalue()


def strata_latex(graphs: Sequence[CurveGraph]) -> str:
    """A LaTeX ``tabular`` (no packages needed) listing the strata."""
    lines = [
        r"\begin{tabular}{rrrrl}",
        r"\hline",
        r"\# & codim & $|V|$ & $|\mathrm{Aut}|$ & graph \\",
        r"\hline",
    ]
    for i, codim, n_vertices, aut, notation in strata_rows(graphs):
        lines.append(rf"{i} & {codim} & {n_vertices} & {aut} & \texttt{{{latex_escape(notation)}}} \\")
    lines += [r"\hline", r"\end{tabular}"]
    return "\n".join(lines)


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
    r"""Our graph notation in math mode: ``g0{1,2}`` -> ``g_{0}\{1,2\}``.

    >>> print(notation_math("g0{1}, g1 | 0-1"))
    $g_{0}\{1\}, g_{1} \mid  0-1$
    """
    body = latex_escape(notation).replace(r"\^{}", "^").replace("|", r"\mid ")
    out, i = [], 0
    while i < len(body):
        if body[i] == "g" and i + 1 < len(body) and body[i + 1].isdigit():
            j = i + 1
            while j < len(body) and body[j].isdigit():
                j += 1
            out.append(f"g_{{{body[i + 1:j]}}}")
            i = j
        else:
            out.append(body[i])
            i += 1
    return "$" + "".join(out) + "$"
