"""JSON rendering of the tallies of the type engine.

The document has the shape of the catalogue's JSON
(:mod:`covertree.export.catalogue`) without the per-cover data: no
``"covers"`` and no ``"n_covers"`` key; ``total_weight``, ``by_source``,
``hurwitz_number`` and ``identity`` per stratum mean the same and agree with
the list engine.  Added keys: ``"engine": "types"`` at the top and
``"by_profiles"`` per stratum::

    {"problem": {...}, "hurwitz_number": "p/q", "engine": "types",
     "strata": [{"base": GRAPH, "codim": k, "orbit_size": n, "total_weight": "p/q",
                 "by_source": [{"stable_source": GRAPH, "weight": "p/q"}, ...],
                 "by_profiles": [{"edge_profiles": [[int, ...], ...], "weight": "p/q"}, ...],
                 "hurwitz_number": "p/q", "identity": true}, ...]}

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> from covertree.tallies.types import tally_catalogue
>>> doc = tallies_to_dict(tally_catalogue(HurwitzProblem.build(2, 0, genus=2), max_codim=1))
>>> doc["hurwitz_number"], [s["total_weight"] for s in doc["strata"]], "covers" in doc["strata"][0]
('1/2', ['1/2', '1/2', '1/2'], False)
"""

from __future__ import annotations


from covertree.export.catalogue import problem_to_dict
from covertree.export.rational import rational_str
from covertree.tallies.types import TallyCatalogue, TypeTally
from covertree.export.jsontext import json_text

__all__ = ["tally_to_dict", "tallies_to_dict", "tallies_to_json"]


def tally_to_dict(tally: TypeTally) -> dict:
    """One entry of ``"strata"``."""
    return {
        "base": tally.base.graph.to_dict(),
        "codim": tally.base.graph.codim,
        "orbit_size": tally.base.orbit_size,
        "total_weight": rational_str(tally.total_weight),
        "by_source": [{"stable_source": g.to_dict(), "weight": rational_str(w)} for g, w in tally.by_source()],
        "by_profiles": [{"edge_profiles": [list(p) for p in profiles], "weight": rational_str(w)}
                        for profiles, w in tally.by_profiles()],
        "hurwitz_number": rational_str(tally.hurwitz_number),
        "identity": tally.identity_holds,
    }


def tallies_to_dict(tallies: TallyCatalogue) -> dict:
    """The whole document as a dict."""
    return {
        "problem": problem_to_dict(tallies.problem, tallies.codim),
        "hurwitz_number": rational_str(tallies.hurwitz_number),
        "engine": "types",
        "strata": [tally_to_dict(t) for t in tallies.strata],
    }


def tallies_to_json(tallies: TallyCatalogue) -> str:
    """The JSON document (indented, keys in a fixed order)."""
    return json_text(tallies_to_dict(tallies))
