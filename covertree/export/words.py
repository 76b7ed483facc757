"""The one written form of profiles and counts, per medium.

* terminal tables: a profile as ``--profile`` takes it, repeated parts as
  powers (``2,1^3``); several profiles joined by ``"; "``; ``-`` for none;
* CSV: every part written out (``2,1,1,1``), profiles joined by ``;``
  (easy to split in a script);
* LaTeX: ``2,1^{3}`` in math mode, profiles joined by ``;\\allowbreak\\ ``
  (a line may break between profiles);
* JSON: lists of integers.

Examples
--------
>>> profile_text((2, 1, 1, 1)), profiles_text([(3,), (2, 1, 1, 1)]), profiles_text([])
('2,1^3', '3; 2,1^3', '-')
>>> profiles_csv([(3,), (2, 1, 1, 1)]), profiles_latex([(3,), (2, 1, 1, 1)])
('3;2,1,1,1', '$3;\\\\allowbreak\\\\ 2,1^{3}$')
>>> count_noun(1, "cover"), count_noun(2, "cover"), count_noun(2, "stratum", "strata")
('1 cover', '2 covers', '2 strata')
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from itertools import groupby

__all__ = ["count_noun", "profile_latex", "profile_text", "profiles_csv", "profiles_latex", "profiles_text"]


def _runs(parts: Iterable[int]) -> list[tuple[int, int]]:
    return [(x, len(list(group))) for x, group in groupby(parts)]


def profile_text(parts: Iterable[int]) -> str:
    """``2,1^3`` for ``(2, 1, 1, 1)`` (the ``--profile`` syntax)."""
    return ",".join(f"{x}^{m}" if m > 1 else str(x) for x, m in _runs(parts))


def profiles_text(profiles: Sequence[Iterable[int]]) -> str:
    """Profiles for a terminal table, ``"; "``-joined; ``-`` when there are none."""
    return "; ".join(profile_text(p) for p in profiles) or "-"


def profiles_csv(profiles: Sequence[Iterable[int]]) -> str:
    """Profiles for CSV: parts comma-joined, profiles ``;``-joined."""
    return ";".join(",".join(map(str, p)) for p in profiles)


def profile_latex(parts: Iterable[int]) -> str:
    """``2,1^{3}`` (math mode, without the dollars)."""
    return ",".join(f"{x}^{{{m}}}" if m > 1 else str(x) for x, m in _runs(parts))


def profiles_latex(profiles: Sequence[Iterable[int]]) -> str:
    """Profiles in LaTeX, in math mode; ``--`` when there are none."""
    if not profiles:
        return "--"
    return "$" + r";\allowbreak\ ".join(profile_latex(p) for p in profiles) + "$"


def count_noun(n: int, noun: str, plural: str | None = None) -> str:
    """``"1 cover"``, ``"2 covers"`` (``plural`` for irregular nouns)."""
    return f"{n} {noun if n == 1 else plural or noun + 's'}"
