"""covertree: admissible covers over the boundary of the target's moduli space.

The package is a one-way pipeline of layers::

    symmetric -> graphs -> strata -> monodromy -> gluing -> stabilisation
              -> catalogue -> export -> cli

Every weight and Hurwitz number is an exact :class:`fractions.Fraction`.
"""

__version__ = "0.1.0"

#: Version of the mathematical model (conventions of weights, notation and
#: JSON shapes).  Stored results are keyed by it.
MODEL_VERSION = 1

#: The public Python interface (see README "From Python"), loaded on first use
#: so that ``import covertree`` stays cheap: name -> module defining it.
_PUBLIC = {
    **{name: "covertree.api" for name in (
        "hurwitz_problem", "hurwitz_count", "boundary_strata", "cover_catalogue", "pullback_table",
        "generating_series", "locus_class", "cover_integral", "Counts", "StrataList", "CatalogueResult",
        "PullbackResult", "SeriesResult", "LocusResult", "IntegralResult", "Result")},
    **{name: "covertree.interop.nxgraphs" for name in (
        "graph_to_networkx", "graph_from_networkx", "stratum_to_networkx", "stratum_from_networkx",
        "cover_to_networkx", "cover_from_networkx", "CoverMap", "networkx_automorphisms", "networkx_isomorphic")},
    "HurwitzProblem": "covertree.hurwitz.problem",
    "CurveGraph": "covertree.graphs.curve_graph",
    "StableCurveGraph": "covertree.graphs.curve_graph",
    "Vertex": "covertree.graphs.curve_graph",
    "parse_graph": "covertree.graphs.notation",
    "CovertreeError": "covertree.errors",
}

__all__ = sorted(_PUBLIC)


def __getattr__(name: str):
    if name not in _PUBLIC:
        raise AttributeError(f"module 'covertree' has no attribute {name!r}")
    import importlib

    return getattr(importlib.import_module(_PUBLIC[name]), name)


def __dir__() -> list[str]:
    return sorted(set(globals()) | set(_PUBLIC))
