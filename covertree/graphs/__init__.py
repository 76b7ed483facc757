"""Stable graphs: dual graphs of nodal curves and boundary strata of Mbar_{g,n}.

Public API: :class:`CurveGraph`, :class:`StableCurveGraph`, :func:`canonical_form`,
:func:`count_automorphisms`, :func:`format_graph`, :func:`parse_graph` and
:func:`stable_graphs`.
"""

from covertree.graphs.canonical import canonical_form, count_automorphisms
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph, Vertex
from covertree.graphs.enumerate import max_codimension, stable_graphs
from covertree.graphs.notation import format_graph, parse_graph

__all__ = [
    "CurveGraph",
    "StableCurveGraph",
    "Vertex",
    "canonical_form",
    "count_automorphisms",
    "format_graph",
    "max_codimension",
    "parse_graph",
    "stable_graphs",
]
