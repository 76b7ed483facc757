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
import json

from covertree.catalogue.catalogue import Catalogue, StratumResult
from covertree.catalogue.covers import Cover
from covertree.catalogue.local_structure import LocalStructure, local_structure
from covertree.export.graphs import notation_math
from covertree.export.latex import latex_document
from covertree.export.rational import latex_rational, rational_str

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


def stratum_to_dict(result: StratumResult) -> dict:
    """One entry of ``"strata"``."""
    return {
        "base": result.base.graph.to_dict(),
        "codim": result.base.graph.codim,
        "orbit_size": result.base.orbit_size,
        "covers": [cover_to_dict(c) for c in result.covers],
        "total_weight": rational_str(result.total_weight),
        "by_source": [
            {"stable_source": g.to_dict(), "weight": rational_str(w)} for g, w in result.by_source()
        ],
        "hurwitz_number": rational_str(result.hurwitz_number),
        "identity": result.identity_holds,
        "n_covers": len(result.covers),
    }


def problem_to_dict(problem, codim: int) -> dict:
    """The ``"problem"`` object."""
    return {**problem.to_dict(), "codim": codim}


def catalogue_to_dict(cat: Catalogue) -> dict:
    """The whole JSON document as a dict (``to_json`` without the encoding)."""
    return {
        "problem": problem_to_dict(cat.problem, cat.codim),
        "hurwitz_number": rational_str(cat.hurwitz_number),
        "strata": [stratum_to_dict(s) for s in cat.strata],
    }


def catalogue_to_json(cat: Catalogue) -> str:
    """The JSON document (indented, keys in a fixed order)."""
    return json.dumps(catalogue_to_dict(cat), indent=1)


def cover_to_jsonl(base, cover: Cover) -> str:
    """One JSON line: the ``COVER`` keys plus ``"base"`` (GRAPH) and
    ``"orbit_size"``."""
    record = {"base": base.graph.to_dict(), "orbit_size": base.orbit_size, **cover_to_dict(cover)}
    return json.dumps(record, separators=(",", ":"))


def _profiles_text(cover: Cover) -> str:
    return ";".join(",".join(map(str, p)) for p in cover.edge_profiles)


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


def catalogue_to_latex(cat: Catalogue, standalone: bool = False) -> str:
    """A booktabs ``longtable`` (one block per stratum), or a complete document."""
    lines = [
        r"\begin{longtable}{llllrrlrrl}",
        r"\toprule",
        r"profiles & source & stable source & name & $|\mathrm{Aut}|$ & mult & weight & $L$ & br & orders \\",
        r"\midrule",
        r"\endhead",
    ]
    for s in cat.strata:
        head = (f"\\multicolumn{{10}}{{l}}{{base {notation_math(s.base.graph.notation)}, codim "
                f"{s.base.graph.codim}, orbit {s.base.orbit_size}: total "
                f"${latex_rational(s.total_weight)}$ vs.\\ $H = {latex_rational(s.hurwitz_number)}$"
                f" ({'holds' if s.identity_holds else 'FAILS'})}} \\\\")
        lines += [head, r"\midrule"]
        for c in s.covers:
            lines.append(" & ".join([
                "$" + ";".join(",".join(map(str, p)) for p in c.edge_profiles) + "$" if c.edge_profiles else "--",
                notation_math(c.source.notation), notation_math(c.stable_source.notation),
                f"$\\{c.stable_source_name.replace('_', '_{')}}}$" if c.stable_source_name else "",
                str(c.automorphisms), str(c.multiplicity), f"${latex_rational(c.weight)}$",
                *_latex_local(local_structure(c)),
            ]) + r" \\")
        lines.append(r"\midrule")
    lines[-1] = r"\bottomrule"
    lines.append(r"\end{longtable}")
    body = "\n".join(lines)
    return _document(body, cat) if standalone else body


def _latex_local(local: LocalStructure) -> list[str]:
    r"""Cells ``L`` (per base node), branches, and the stable nodes' orders with
    their types (``2\,\delta_0``), codimension one only."""
    lcms = ";".join(str(n.lcm) for n in local.nodes) or "--"
    if local.stable_nodes is None:
        orders = ""
    else:
        orders = ", ".join(
            f"{n.order}" + (f"\\,\\delta_{{{n.type.split('_', 1)[1]}}}" if n.type else "")
            for n in local.stable_nodes
        )
        orders = f"${orders}$" if orders else "--"
    return [lcms, str(local.branches), orders]


def _document(body: str, cat: Catalogue) -> str:
    p = cat.problem
    title = (f"Admissible covers of degree {p.degree}, genus {p.genus} over genus "
             f"{p.target_genus}, codimension $\\le {cat.codim}$")
    return latex_document(body, title, ["booktabs", "longtable", "amsmath"], "margin=2cm,landscape")
