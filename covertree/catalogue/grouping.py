"""Identical rows of a catalogue, collapsed: one group per class of covers
that agree in everything a catalogue prints about them.

By default two covers over the same base stratum are in one group when they
have the same profiles over the base nodes, the same source and stable source
(as graphs), the same ``|Aut|`` and multiplicity (hence weight) and the same
local structure (indices, lcms, branches, stable-node orders and types); a
rendering that prints less groups by its own cells.  They are
different covers (different monodromy), so the counts and the summed weights
are what the degeneration identity adds up; only their rows coincide.  Groups
come in the order of their first member in the stratum's cover list, and keep
the 1-based numbers their members have there (the ``#`` of the full table).

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> from covertree.catalogue.catalogue import build_catalogue
>>> cat = build_catalogue(HurwitzProblem.build(3, 1, genus=2), max_codim=0)
>>> [(g.count, str(g.total_weight), g.numbers[:3]) for g in group_covers(cat.strata[0])]
[(16, '16', (1, 2, 3))]
"""

from __future__ import annotations

from collections.abc import Callable, Hashable
from dataclasses import dataclass
from fractions import Fraction

from covertree.catalogue.catalogue import StratumResult
from covertree.catalogue.covers import Cover
from covertree.catalogue.local_structure import local_structure

__all__ = ["CoverGroup", "group_covers", "row_key"]


@dataclass(frozen=True)
class CoverGroup:
    """Covers of one stratum with identical rows.

    ``cover`` is the first member (the representative); ``numbers`` the
    members' 1-based positions in the stratum's cover list.
    """

    cover: Cover
    numbers: tuple[int, ...]
    total_weight: Fraction

    @property
    def count(self) -> int:
        return len(self.numbers)

    @property
    def number_range(self) -> str:
        """``"5"``, ``"5-9"`` (consecutive members) or ``"5,7,..."`` (first two)."""
        first, last = self.numbers[0], self.numbers[-1]
        if len(self.numbers) == 1:
            return str(first)
        if last - first + 1 == len(self.numbers):
            return f"{first}-{last}"
        return f"{first},{self.numbers[1]},..."


def row_key(cover: Cover) -> tuple:
    """Everything a catalogue prints about a cover (its monodromy excluded)."""
    return (cover.edge_profiles, cover.source.key, cover.stable_source.key,
            cover.automorphisms, cover.multiplicity, local_structure(cover))


def group_covers(stratum: StratumResult, key: Callable[[Cover], Hashable] = row_key) -> list[CoverGroup]:
    """The covers of ``stratum`` in groups of identical rows (see module doc).

    ``key`` says what a row shows: by default :func:`row_key` (everything);
    a rendering that prints fewer columns passes the tuple of its cells, so
    that rows which look the same there are one group."""
    members: dict[Hashable, list[int]] = {}
    for number, cover in enumerate(stratum.covers, start=1):
        members.setdefault(key(cover), []).append(number)
    groups = []
    for numbers in members.values():
        cover = stratum.covers[numbers[0] - 1]
        groups.append(CoverGroup(cover, tuple(numbers), cover.weight * len(numbers)))
    return groups
