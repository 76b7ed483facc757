r"""JSON, CSV and LaTeX renderings of a generating series and its
identification (``covertree series``).

The JSON document is a contract (keys are only ever added)::

    {"family": {"genus": g | null, "target_genus": h, "shapes": ["2,1^*", ...],
                "max_degree": N, "constant": "p/q", "q_derivative": K},
     "quantity": {"kind", "stratum", "source", "coefficient", "engine"},
     "terms": [{"degree": d, "value": "p/q", "coefficient": "p/q",
                "profiles": [[2, 1], ...] | null}, ...],
     "basis": {"weight": W, "mixed": bool, "monomials": [{"name": "E2^3", "exponents": [a, b, c]}, ...]},
     "identification": {"found": bool, "form": "..." | null, "latex": "..." | null,
                        "coefficients": {"E2^3": "p/q", ...} | null,
                        "solved_with": s, "checked": k,
                        "mismatch": {"order": n, "series": "p/q", "form": "p/q" | null} | null}}

``terms`` has degrees ``1..N``: ``value`` is the quantity, ``coefficient`` the
coefficient of ``q^d`` in the series (``d^K * value``), ``profiles`` every
profile of the problem of degree ``d`` (``null``: no covers in that degree).
``solved_with`` coefficients ``q^0..q^{s-1}`` determine the form, ``checked``
more agree with it.  ``mismatch`` is the first coefficient no form of the
weight matches (``form`` is ``null`` when the solving system is inconsistent).
Exact rationals are strings ``"p/q"``.

Examples
--------
>>> from covertree.series.family import Family, ProfileShape
>>> from covertree.series.quantities import Quantity
>>> from covertree.series.generating import degree_series
>>> s = degree_series(Family(1, 1, (ProfileShape.parse("1^*"),)), Quantity("hurwitz"), 6, 2,
...                   mixed=True, q_derivative=1)
>>> doc = series_to_dict(s)
>>> [t["value"] for t in doc["terms"]], doc["identification"]["form"], doc["identification"]["checked"]
(['1', '3/2', '4/3', '7/4', '6/5', '2'], '(1 - E2)/24', 5)
>>> print(series_to_csv(s).splitlines()[2])
2,3/2,3,1^2
"""

from __future__ import annotations

import csv
import io

from covertree.export.rational import latex_rational, rational_str
from covertree.series.generating import DegreeSeries
from covertree.export.jsontext import json_text
from covertree.export.words import profile_text

__all__ = ["SERIES_COLUMNS", "series_rows", "series_summary", "series_to_csv", "series_to_dict", "series_to_json",
           "series_to_latex"]

#: Column names of the CSV rendering (and of the command's table).
SERIES_COLUMNS = ("degree", "value", "coefficient", "profiles")


def _profiles(term) -> str:
    """The profiles of the problem of a term, runs of equal ones as ``k x (..)``."""
    if term.problem is None:
        return "no covers"
    runs: list[list] = []
    for p in term.problem.profiles:
        if runs and runs[-1][0] == p:
            runs[-1][1] += 1
        else:
            runs.append([p, 1])
    return "; ".join(f"{m} x {profile_text(p)}" if m > 1 else profile_text(p) for p, m in runs) or "-"


def series_rows(s: DegreeSeries) -> list[tuple[int, str, str, str]]:
    """One row ``(degree, value, coefficient, profiles)`` per degree ``1..N``."""
    return [(t.degree, rational_str(t.value), rational_str(c), _profiles(t))
            for t, c in zip(s.terms, s.coefficients[1:])]


def _identification(s: DegreeSeries) -> dict:
    found = s.identification
    mismatch = None
    if found.mismatch is not None:
        order, series, form = found.mismatch
        mismatch = {"order": order, "series": rational_str(series),
                    "form": None if form is None else rational_str(form)}
    return {
        "found": found.found,
        "form": found.text,
        "latex": found.latex,
        "coefficients": None if not found.found else {
            m.text: rational_str(c) for m, c in zip(found.basis, found.coefficients)},
        "solved_with": found.solved_with,
        "checked": found.checked,
        "mismatch": mismatch,
    }


def series_to_dict(s: DegreeSeries) -> dict:
    """The JSON document as a dict."""
    return {
        "family": {**s.family.to_dict(), "max_degree": s.max_degree, "constant": rational_str(s.constant),
                   "q_derivative": s.q_derivative},
        "quantity": s.quantity.to_dict(),
        "terms": [{"degree": t.degree, "value": rational_str(t.value), "coefficient": rational_str(c),
                   "profiles": None if t.problem is None else [list(p) for p in t.problem.profiles]}
                  for t, c in zip(s.terms, s.coefficients[1:])],
        "basis": {"weight": s.weight, "mixed": s.mixed,
                  "monomials": [{"name": m.text, "exponents": list(m.exponents)} for m in s.identification.basis]},
        "identification": _identification(s),
    }


def series_to_json(s: DegreeSeries) -> str:
    """The JSON document (indented, keys in a fixed order)."""
    return json_text(series_to_dict(s))


def series_to_csv(s: DegreeSeries) -> str:
    """One row per degree: ``degree, value, coefficient, profiles``."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(SERIES_COLUMNS)
    writer.writerows(series_rows(s))
    return buffer.getvalue()


def series_summary(s: DegreeSeries) -> str:
    """The verdict in one sentence (plain text)."""
    found = s.identification
    scope = f"weight {'<= ' if s.mixed else ''}{s.weight}"
    if found.found:
        return (f"identified as a quasimodular form of {scope}: {found.text}; solved with "
                f"q^0..q^{found.solved_with - 1}, checked on {found.checked} further coefficient(s)")
    order, series, form = found.mismatch
    detail = ("the solving coefficients admit no solution" if form is None else
              f"the candidate gives {rational_str(form)} at q^{order}, the series has {rational_str(series)}")
    return f"NO quasimodular form of {scope} fits: {detail}"


def series_to_latex(s: DegreeSeries) -> str:
    """A LaTeX fragment: the table of coefficients and the identified form (or
    the plain statement that none fits)."""
    lines = [r"\begin{tabular}{rrr}", r"\toprule", r"$d$ & value & $[q^d]$ \\", r"\midrule"]
    for t, c in zip(s.terms, s.coefficients[1:]):
        lines.append(f"{t.degree} & ${latex_rational(t.value)}$ & ${latex_rational(c)}$ \\\\")
    lines += [r"\bottomrule", r"\end{tabular}", ""]
    found = s.identification
    if found.found:
        lines.append(rf"\[ \sum_{{d \ge 0}} [q^d]\, q^d = {found.latex} \]")
        lines.append(f"(solved with $q^0,\\dots,q^{{{found.solved_with - 1}}}$, "
                     f"checked on {found.checked} further coefficients)")
    else:
        bound = "\\le " if s.mixed else ""
        lines.append(f"No quasimodular form of weight ${bound}{s.weight}$ fits "
                     f"(first mismatch at $q^{{{found.mismatch[0]}}}$).")
    return "\n".join(lines) + "\n"
