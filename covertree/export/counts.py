r"""JSON, CSV and LaTeX renderings of Hurwitz counts (``covertree count``).

The JSON shape is a contract (extra keys may be added)::

    {"genus": g, "target_genus": h, "degree": d, "profiles": [[2, 1], ...],
     "connected": "p/q", "disconnected": "p/q"}

with every profile listed, the filled-in simple ones too, and the numbers as
:func:`~covertree.export.rational.rational_str` strings.  The convention of the
numbers is that of :mod:`covertree.hurwitz.numbers` (labelled branch points,
weight 1/|Aut|, unlabelled preimages).

Examples
--------
>>> from fractions import Fraction
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> p = HurwitzProblem.build(degree=2, target_genus=1, genus=2)
>>> print(counts_csv(p, Fraction(2), Fraction(2)), end="")
genus,target_genus,degree,profiles,connected,disconnected
2,1,2,2;2,2,2
>>> print(counts_latex(p, Fraction(2), Fraction(5, 2)))
\begin{tabular}{rrrp{0.4\linewidth}rr}
\toprule
$g$ & $h$ & $d$ & profiles & connected & disconnected \\
\midrule
2 & 1 & 2 & {\raggedright $2;\allowbreak\ 2$\par} & $2$ & $\frac{5}{2}$ \\
\bottomrule
\end{tabular}
"""

from __future__ import annotations

import csv
import io
import json
from fractions import Fraction

from covertree.export.latex import wrapped_cell
from covertree.export.rational import latex_rational, rational_str
from covertree.hurwitz.problem import HurwitzProblem
from covertree.export.jsontext import json_text
from covertree.export.words import profiles_csv, profiles_latex

__all__ = [
    "COUNT_COLUMNS",
    "count_row",
    "counts_csv",
    "counts_json",
    "counts_latex",
    "counts_record",
    "profiles_text",
]

#: Column names of the CSV rendering (and of the table of the command line).
COUNT_COLUMNS = ("genus", "target_genus", "degree", "profiles", "connected", "disconnected")


def profiles_text(problem: HurwitzProblem) -> str:
    """The profiles in CSV form (:mod:`covertree.export.words`).

    >>> profiles_text(HurwitzProblem.build(degree=3, target_genus=0, profiles=["3", "3", "1^3"]))
    '3;3;1,1,1'
    """
    return profiles_csv(problem.profiles)


def counts_record(problem: HurwitzProblem, connected: Fraction, disconnected: Fraction) -> dict:
    """The JSON document as a dict (see the module docstring)."""
    record = problem.to_dict()
    record["connected"] = rational_str(connected)
    record["disconnected"] = rational_str(disconnected)
    return record


def count_row(problem: HurwitzProblem, connected: Fraction, disconnected: Fraction) -> tuple:
    """One row with the columns of :data:`COUNT_COLUMNS`, all strings or ints."""
    return (
        problem.genus,
        problem.target_genus,
        problem.degree,
        profiles_text(problem),
        rational_str(connected),
        rational_str(disconnected),
    )


def counts_json(problem: HurwitzProblem, connected: Fraction, disconnected: Fraction) -> str:
    """The JSON document (indented, with a final newline).

    >>> p = HurwitzProblem.build(degree=2, target_genus=1, genus=2)
    >>> json.loads(counts_json(p, Fraction(2), Fraction(2)))["profiles"]
    [[2], [2]]
    """
    return json_text(counts_record(problem, connected, disconnected)) + "\n"


def counts_csv(problem: HurwitzProblem, connected: Fraction, disconnected: Fraction) -> str:
    """CSV with a header row (:data:`COUNT_COLUMNS`) and one data row."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(COUNT_COLUMNS)
    writer.writerow(count_row(problem, connected, disconnected))
    return buffer.getvalue()


def counts_latex(problem: HurwitzProblem, connected: Fraction, disconnected: Fraction) -> str:
    r"""A small ``booktabs`` tabular (``\usepackage{booktabs}``), non-integers as
    ``\frac``; the profiles wrap in 40% of the line.

    >>> p = HurwitzProblem.build(degree=4, target_genus=0, profiles=["2,1^2"] * 6)
    >>> print(counts_latex(p, Fraction(8), Fraction(9)).splitlines()[4])  # doctest: +ELLIPSIS
    0 & 0 & 4 & {\raggedright $2,1^{2};\allowbreak\ 2,1^{2};\allowbreak\ ...$\par} & $8$ & $9$ \\
    """
    profiles = wrapped_cell(profiles_latex(problem.profiles))
    lines = [
        r"\begin{tabular}{rrrp{0.4\linewidth}rr}",
        r"\toprule",
        r"$g$ & $h$ & $d$ & profiles & connected & disconnected \\",
        r"\midrule",
        rf"{problem.genus} & {problem.target_genus} & {problem.degree} & {profiles} & "
        rf"${latex_rational(connected)}$ & ${latex_rational(disconnected)}$ \\",
        r"\bottomrule",
        r"\end{tabular}",
    ]
    return "\n".join(lines)
