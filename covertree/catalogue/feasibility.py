"""Refusals of a catalogue before any cover is searched for.

The list engine's cover limit (``max_covers``) counts covers as they are
found; a problem whose smooth stratum alone carries more covers than the
limit is refused at once instead, by the degeneration identity: over the
open stratum every cover has multiplicity 1 and weight ``1/|Aut| <= 1``, and
the weights add up to the Hurwitz number ``H``, so there are at least ``H``
covers (``H`` with the labellings of marked points for a marked problem,
weights ``1/|Aut(f, marks)|``).

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> problem = HurwitzProblem.build(4, 1, genus=2)
>>> check_cover_count(problem, None, 10**6)
>>> check_cover_count(problem, None, 10)
Traceback (most recent call last):
...
covertree.errors.LimitError: the smooth stratum alone has at least 60 covers (its Hurwitz number 60; each weighs at most 1), more than the limit 10 (--max-covers); raise --max-covers, restrict --stratum, or use --engine types
"""

from __future__ import annotations

from math import ceil

from covertree.catalogue.catalogue import problem_hurwitz
from covertree.errors import LimitError
from covertree.graphs.curve_graph import StableCurveGraph
from covertree.hurwitz.problem import HurwitzProblem

__all__ = ["check_cover_count"]


def check_cover_count(problem: HurwitzProblem, stratum: StableCurveGraph | None, max_covers: int) -> None:
    """Refuse a list-engine run whose smooth stratum (included when no
    ``stratum`` is chosen, or when the chosen one has no node) has more than
    ``max_covers`` covers, by the bound above.

    Raises
    ------
    LimitError
        Naming the Hurwitz number and the limit.
    """
    if stratum is not None and stratum.codim > 0:
        return
    hurwitz = problem_hurwitz(problem)
    if ceil(hurwitz) > max_covers:
        raise LimitError(f"the smooth stratum alone has at least {ceil(hurwitz)} covers (its Hurwitz number "
                         f"{hurwitz}; each weighs at most 1), more than the limit {max_covers} "
                         "(--max-covers); raise --max-covers, restrict --stratum, or use --engine types")
