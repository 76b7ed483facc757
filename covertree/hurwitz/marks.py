r"""Marked points on the source: which preimages of which branch points are legs.

A *marking* of a Hurwitz problem names points of the source that become its
legs ``1..n``, so that the stabilised source lies in ``Mbar_{g,n}``.  Each leg
is a point of ramification index ``e`` over branch point ``J`` (``e = 1`` for
an unramified preimage).  The marking is the tuple of ``(J, e)``, one per leg,
in leg order.

Specifications (one string each, the ``--mark`` option):

- ``J``: every ramified point over ``J`` (for a simple branch point, its one
  ramification point);
- ``J:e``: one point of index ``e`` over ``J``;
- ``J:e^c``: ``c`` points of index ``e`` over ``J``.

Legs are numbered by branch point, then by decreasing index, whatever the
order of the specifications.

Weights (the convention of the whole of covertree, written out in
``docs/theory.md``): a marked cover is a cover with an injective labelling of
the chosen points by the legs, isomorphisms keep the labels, and it weighs
``1/|Aut(f, marks)|``.  ``Aut f`` acts on the labellings of ``f`` with the
marked covers over ``f`` as orbits and their automorphism groups as
stabilisers, so

    H_marked = H * prod_{(J, e)} m_e(mu_J)! / (m_e(mu_J) - c_{J,e})!,

``m_e(mu_J)`` the number of parts ``e`` of ``mu_J`` and ``c_{J,e}`` the number
of legs of type ``(J, e)`` (:func:`labellings`).

Examples
--------
>>> legs_from_specs([(2,), (2,), (2, 1)], ["1", "3:1"])
((1, 2), (3, 1))
>>> labellings([(1, 1, 1)], ((1, 1),))
3
>>> legs_from_specs([(2,), (2,)], ["3"])
Traceback (most recent call last):
...
covertree.hurwitz.marks.MarkError: mark '3' names branch point 3; allowed: 1 .. 2
"""

from __future__ import annotations

import re
from collections import Counter
from collections.abc import Iterable, Sequence
from math import factorial, perm, prod

from covertree.errors import InputError

__all__ = ["MarkError", "legs_from_specs", "labellings", "marked_symmetry", "legs_over", "parse_mark"]

Leg = tuple[int, int]
_SPEC = re.compile(r"([0-9]{1,6})(?::([0-9]{1,6})(?:\^([0-9]{1,6}))?)?")


class MarkError(InputError):
    """A marking names a point that the problem does not have."""


def parse_mark(text: str) -> tuple[int, int | None, int]:
    """``(J, e, c)`` from one specification (``e = None`` for every ramified point).

    >>> parse_mark("2"), parse_mark("4:3"), parse_mark("1:1^2")
    ((2, None, 0), (4, 3, 1), (1, 1, 2))
    """
    match = _SPEC.fullmatch(text.strip()) if isinstance(text, str) else None
    if not match:
        raise MarkError(f"mark {text!r} is not J, J:e or J:e^c (J a branch point, e an index, c a count)")
    point, index, count = match.groups()
    if index is None:
        return int(point), None, 0
    return int(point), int(index), 1 if count is None else int(count)


def legs_from_specs(profiles: Sequence[Sequence[int]], specs: Iterable[str]) -> tuple[Leg, ...]:
    """The legs ``(J, e)`` in leg order from ``--mark`` specifications.

    Raises
    ------
    MarkError
        For a branch point that does not exist, an index that is not in its
        profile, more points than the profile has, a branch point marked twice
        in full, or ``J`` alone over an unramified point.
    """
    counts: Counter = Counter()
    whole: set[int] = set()
    for text in specs:
        point, index, count = parse_mark(text)
        if not 1 <= point <= len(profiles):
            raise MarkError(f"mark {text!r} names branch point {point}; allowed: 1 .. {len(profiles)}")
        mu = tuple(profiles[point - 1])
        if index is None:
            _add_ramified(text, point, mu, whole, counts)
            continue
        if index not in mu:
            raise MarkError(f"mark {text!r}: no point of index {index} over branch point {point} "
                            f"(profile {','.join(map(str, mu))}); allowed indices: {_indices(mu)}")
        if count < 1:
            raise MarkError(f"mark {text!r}: the count must be at least 1")
        counts[(point, index)] += count
    for (point, index), c in counts.items():
        have = tuple(profiles[point - 1]).count(index)
        if c > have:
            raise MarkError(f"marks ask for {c} points of index {index} over branch point {point}; "
                            f"its profile {','.join(map(str, profiles[point - 1]))} has {have}")
    return tuple(leg for key in sorted(counts, key=lambda k: (k[0], -k[1])) for leg in [key] * counts[key])


def _add_ramified(text: str, point: int, mu: tuple[int, ...], whole: set[int], counts: Counter) -> None:
    if point in whole:
        raise MarkError(f"mark {text!r}: branch point {point} is already marked in full")
    ramified = Counter(x for x in mu if x > 1)
    if not ramified:
        raise MarkError(f"mark {text!r}: branch point {point} is unramified (profile {','.join(map(str, mu))}); "
                        f"mark its preimages with {point}:1 or {point}:1^c")
    whole.add(point)
    for index, m in ramified.items():
        counts[(point, index)] += m


def _indices(mu: Sequence[int]) -> str:
    return ", ".join(str(x) for x in sorted(set(mu), reverse=True))


def labellings(profiles: Sequence[Sequence[int]], legs: Sequence[Leg]) -> int:
    """Injective labellings of the marked points of one cover by the legs:
    ``prod m_e(mu_J)! / (m_e(mu_J) - c)!``, the factor from unmarked to marked
    numbers."""
    counts = Counter(legs)
    return prod(perm(tuple(profiles[j - 1]).count(e), c) for (j, e), c in counts.items())


def marked_symmetry(profiles: Sequence[Sequence[int]], legs: Sequence[Leg]) -> int:
    """Permutations of the branch points that keep the list of profiles and the
    marks: a marked branch point carries labelled legs, so it is fixed; the
    unmarked ones are permuted among equal profiles.

    >>> marked_symmetry([(2,)] * 6, ((1, 2),))
    120
    """
    marked = {j for j, _ in legs}
    counts = Counter(tuple(mu) for j, mu in enumerate(profiles, start=1) if j not in marked)
    return prod(factorial(m) for m in counts.values())


def legs_over(legs: Sequence[Leg], point: int) -> list[tuple[int, int]]:
    """``(leg label, index)`` of the legs over one branch point."""
    return [(k, e) for k, (j, e) in enumerate(legs, start=1) if j == point]
