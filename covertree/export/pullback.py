r"""JSON, CSV and LaTeX renderings of the pullbacks of boundary divisors.

The JSON document is a contract (keys are only ever added)::

    {"problem": {"genus", "target_genus", "degree", "profiles", "codim": 1},
     "hurwitz_number": "p/q",
     "rows": [{"base": GRAPH, "orbit_size": n,
               "coefficients": {"delta_0": "p/q", "delta_1": "p/q", ...},
               "branch_total": "p/q"}, ...]}

with one coefficient per boundary divisor ``delta_0..delta_{floor(G/2)}`` of
``Mbar_G`` (zeros included); ``GRAPH`` as in
:meth:`covertree.graphs.curve_graph.CurveGraph.to_dict`.  The CSV has one row per
base divisor: ``base, orbit_size, delta_0, ..., branch_total, hurwitz_number,
check``.

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> from covertree.catalogue.pullback import build_pullback
>>> pb = build_pullback(HurwitzProblem.build(2, 0, genus=2))
>>> print(pullback_to_csv(pb), end="")
base,orbit_size,delta_0,delta_1,branch_total,hurwitz_number,check
"g0{1,2}, g0{3,4,5,6} | 0-1",15,1,0,1/2,1/2,holds
"g0{1,2,3}, g0{4,5,6} | 0-1",10,0,1/4,1/2,1/2,holds
"""

from __future__ import annotations

import csv
import io

from covertree.catalogue.pullback import Pullback
from covertree.export.catalogue import problem_to_dict
from covertree.export.graphs import notation_math
from covertree.export.words import profiles_latex
from covertree.export.latex import latex_document, sized_longtable, wrapped_cell
from covertree.export.rational import latex_rational, rational_str
from covertree.export.jsontext import json_text

__all__ = ["pullback_to_dict", "pullback_to_json", "pullback_to_csv", "pullback_to_latex", "pullback_columns"]


def pullback_to_dict(pb: Pullback) -> dict:
    """The JSON document as a dict."""
    return {
        "problem": problem_to_dict(pb.problem, 1),
        "hurwitz_number": rational_str(pb.hurwitz_number),
        "rows": [
            {
                "base": r.base.graph.to_dict(),
                "orbit_size": r.base.orbit_size,
                "coefficients": {d: rational_str(r.coefficients[d]) for d in pb.divisors},
                "branch_total": rational_str(r.branch_total),
            }
            for r in pb.rows
        ],
    }


def pullback_to_json(pb: Pullback) -> str:
    """The JSON document (indented)."""
    return json_text(pullback_to_dict(pb))


def pullback_columns(pb: Pullback) -> tuple[str, ...]:
    """CSV header: ``base, orbit_size, delta_0.., branch_total, hurwitz_number, check``."""
    return ("base", "orbit_size", *pb.divisors, "branch_total", "hurwitz_number", "check")


def pullback_to_csv(pb: Pullback) -> str:
    """One row per base divisor, with a header row."""
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(pullback_columns(pb))
    for r in pb.rows:
        writer.writerow([
            r.base.graph.notation, r.base.orbit_size,
            *(rational_str(r.coefficients[d]) for d in pb.divisors),
            rational_str(r.branch_total), rational_str(r.hurwitz_number),
            "holds" if r.check_holds else "FAILS",
        ])
    return buffer.getvalue()


def _delta(name: str) -> str:
    return "$\\delta_{" + name.split("_", 1)[1] + "}$"


def problem_line(pb: Pullback) -> str:
    r"""One sentence naming the problem of a pullback table (LaTeX).

    >>> from covertree.hurwitz.problem import HurwitzProblem
    >>> from covertree.catalogue.pullback import build_pullback
    >>> print(problem_line(build_pullback(HurwitzProblem.build(2, 0, genus=2))))
    Pullback $\mathrm{br}_*\mathrm{src}^*\delta$ of the boundary divisors of $\overline{M}_{2}$ to the boundary divisors $D$ of $\overline{M}_{0,6}$, for the covers of degree 2 of a genus-0 curve by a genus-2 curve, simple branching at the 6 branch points; Hurwitz number $H = \frac{1}{2}$.
    """
    p = pb.problem
    simple = (2,) + (1,) * (p.degree - 2)
    if all(tuple(mu) == simple for mu in p.profiles):
        branching = f"simple branching at the {len(p.profiles)} branch points"
    else:
        branching = "profiles " + profiles_latex(p.profiles)
    return (rf"Pullback $\mathrm{{br}}_*\mathrm{{src}}^*\delta$ of the boundary divisors of "
            rf"$\overline{{M}}_{{{p.genus}}}$ to the boundary divisors $D$ of "
            rf"$\overline{{M}}_{{{p.target_genus},{len(p.profiles)}}}$, for the covers of degree {p.degree} "
            rf"of a genus-{p.target_genus} curve by a genus-{p.genus} curve, {branching}; "
            rf"Hurwitz number $H = {latex_rational(pb.hurwitz_number)}$.")


def pullback_to_latex(pb: Pullback, standalone: bool = False) -> str:
    r"""A line naming the problem (:func:`problem_line`), then a booktabs
    ``longtable``: one row per base divisor (wrapping in 40% of the line), a
    ``\delta_i`` column per boundary divisor of ``Mbar_G`` and the branch
    total; or a complete document."""
    header = ["base divisor $D$", "orbit", *map(_delta, pb.divisors),
              r"$\sum_f \#\mathrm{br}\cdot L/|\mathrm{Aut}|$"]
    rows = []
    for r in pb.rows:
        cells = [wrapped_cell(notation_math(r.base.graph.notation)), str(r.base.orbit_size)]
        cells += [f"${latex_rational(r.coefficients[d])}$" for d in pb.divisors]
        cells.append(f"${latex_rational(r.branch_total)}$")
        rows.append(" & ".join(cells) + r" \\")
    table = sized_longtable(r"p{0.4\linewidth}r" + "r" * len(pb.divisors) + "r", header, rows)
    body = "\n".join([r"\noindent " + problem_line(pb), "", table])
    if not standalone:
        return body
    p = pb.problem
    title = (f"Pullbacks of the boundary of $\\overline{{M}}_{{{p.genus}}}$: degree {p.degree} covers "
             f"of genus {p.target_genus}, $H = {latex_rational(pb.hurwitz_number)}$")
    return latex_document(body, title, ["booktabs", "longtable", "amsmath"])
