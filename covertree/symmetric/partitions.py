"""Partitions of the degree: profiles, cycle types and conjugacy classes of S_d.

Convention: a partition is stored non-increasing, all parts positive; the
partition ``(2, 1, 1)`` of 4 is the cycle type of a transposition in S_4.
``z(mu) = |Aut mu| * prod(mu_i)`` is the order of the centraliser of a
permutation of type ``mu`` and ``d!/z(mu)`` the size of its class.

References
----------
B. E. Sagan, "The Symmetric Group", 2nd ed. (2001), section 1.1: cycle types,
class sizes d!/z(mu) and centralisers (common knowledge)

Examples
--------
>>> mu = Partition.parse("2,1^2")
>>> mu
Partition(2, 1, 1)
>>> str(mu), mu.size, len(mu)
('2,1,1', 4, 3)
>>> z(mu), class_size(mu)
(4, 6)
>>> [str(p) for p in partitions_of(3)]
['3', '2,1', '1,1,1']
"""

from __future__ import annotations

import re
from collections import Counter
from collections.abc import Iterable, Iterator
from functools import lru_cache
from math import factorial, prod

from covertree.errors import ProfileError

_TOKEN = re.compile(r"^\s*([0-9]+)\s*(?:\^\s*([0-9]+)\s*)?$")


class Partition(tuple):
    """An immutable integer partition, normalised to non-increasing order.

    Parameters
    ----------
    parts : iterable of int
        Positive parts in any order.

    Raises
    ------
    ProfileError
        If a part is not a positive integer.

    Examples
    --------
    >>> Partition([1, 3, 1])
    Partition(3, 1, 1)
    >>> Partition([2, 2]).multiplicities()
    {2: 2}
    """

    __slots__ = ()

    def __new__(cls, parts: Iterable[int]) -> "Partition":
        parts = list(parts)
        for p in parts:
            if not isinstance(p, int) or isinstance(p, bool) or p <= 0:
                raise ProfileError(f"partition part {p!r} is not a positive integer")
        return super().__new__(cls, sorted(parts, reverse=True))

    @classmethod
    def parse(cls, text: str) -> "Partition":
        """Read ``"3,1"`` or ``"2,1^3"`` (``a^k`` repeats the part ``a`` k times).

        >>> Partition.parse("2^2,1")
        Partition(2, 2, 1)
        """
        parts: list[int] = []
        for token in text.split(","):
            m = _TOKEN.match(token)
            if not m:
                raise ProfileError(
                    f"profile {text!r}: {token.strip()!r} is not a part; "
                    "write positive integers separated by commas, e.g. 3,1 or 2,1^3"
                )
            part, times = int(m.group(1)), int(m.group(2) or 1)
            if part == 0:
                raise ProfileError(f"profile {text!r}: parts must be positive")
            if times == 0:
                raise ProfileError(f"profile {text!r}: {token.strip()!r} repeats a part 0 times; write k >= 1 in a^k")
            parts.extend([part] * times)
        return cls(parts)

    @property
    def size(self) -> int:
        """The integer partitioned (the degree)."""
        return sum(self)

    def multiplicities(self) -> dict[int, int]:
        """Part -> number of times it occurs."""
        return dict(Counter(self))

    def aut(self) -> int:
        """``|Aut mu| = prod_i m_i!`` over the multiplicities ``m_i``.

        >>> Partition([1, 1, 1]).aut()
        6
        """
        return prod(factorial(m) for m in Counter(self).values())

    def __repr__(self) -> str:
        return "Partition(" + ", ".join(map(str, self)) + ")"

    def __str__(self) -> str:
        return ",".join(map(str, self))


def simple(d: int) -> Partition:
    """The profile of simple branching ``(2, 1^(d-2))`` in degree ``d >= 2``.

    >>> simple(4)
    Partition(2, 1, 1)
    """
    return Partition([2] + [1] * (d - 2))


def unramified(d: int) -> Partition:
    """The profile ``(1^d)``."""
    return Partition([1] * d)


def z(mu: Iterable[int]) -> int:
    """Order of the centraliser of a permutation of cycle type ``mu``.

    >>> z((3, 1))
    3
    """
    mu = Partition(mu)
    return mu.aut() * prod(mu)


def class_size(mu: Iterable[int]) -> int:
    """Size ``d!/z(mu)`` of the conjugacy class of type ``mu`` in S_d.

    >>> class_size((2, 1, 1))
    6
    """
    mu = Partition(mu)
    return factorial(mu.size) // z(mu)


@lru_cache(maxsize=None)
def _partitions(n: int, largest: int) -> tuple[tuple[int, ...], ...]:
    if n == 0:
        return ((),)
    out = []
    for first in range(min(n, largest), 0, -1):
        for rest in _partitions(n - first, first):
            out.append((first,) + rest)
    return tuple(out)


def partition_tuples(n: int) -> tuple[tuple[int, ...], ...]:
    """All partitions of ``n`` as plain non-increasing tuples, in the order of
    :func:`partitions_of` (no :class:`Partition` objects built: for tables
    indexed by partitions).

    >>> partition_tuples(4)
    ((4,), (3, 1), (2, 2), (2, 1, 1), (1, 1, 1, 1))
    """
    return _partitions(n, n)


def partitions_of(n: int) -> Iterator[Partition]:
    """All partitions of ``n``, in reverse lexicographic order (``(n)`` first).

    >>> len(list(partitions_of(6)))
    11
    """
    for parts in _partitions(n, n):
        yield Partition(parts)


def sub_partitions(mu: Iterable[int], k: int) -> list[Partition]:
    """Distinct sub-multisets of ``mu`` with sum ``k``, in reverse lexicographic
    order.

    >>> sub_partitions((2, 1, 1), 2)
    [Partition(2), Partition(1, 1)]
    """
    counts = sorted(Counter(mu).items(), reverse=True)
    out: list[tuple[int, ...]] = []

    def rec(i: int, remaining: int, acc: list[int]) -> None:
        if remaining == 0:
            out.append(tuple(acc))
            return
        if i == len(counts):
            return
        part, mult = counts[i]
        for take in range(min(mult, remaining // part), -1, -1):
            rec(i + 1, remaining - take * part, acc + [part] * take)

    rec(0, k, [])
    return [Partition(p) for p in out]


def difference(mu: Iterable[int], nu: Iterable[int]) -> Partition:
    """Multiset difference ``mu - nu`` (``nu`` must be a sub-multiset).

    >>> difference((3, 2, 1), (2,))
    Partition(3, 1)
    """
    rest = Counter(mu)
    rest.subtract(Counter(nu))
    if any(v < 0 for v in rest.values()):
        raise ProfileError(f"{tuple(nu)} is not contained in {tuple(mu)}")
    return Partition(rest.elements())
