"""Outside-side quantities computed without covertree, for the published checks.

Each function here is a textbook formula written out afresh, so that a check of
covertree against a published formula does not take any part of the "published"
side from covertree itself.

- partitions of ``d`` in decreasing order, by the obvious recursion (common knowledge);
- ``|Aut mu| = prod_i m_i!`` over the multiplicities ``m_i`` of the parts (common
  knowledge);
- the number ``p(d)`` of partitions by Euler's pentagonal number recurrence
  (L. Euler, 1750; G. E. Andrews, *The Theory of Partitions*, 1976, Cor. 1.8);
- the dimension of the irreducible character of ``S_n`` of shape ``lambda`` by the
  hook length formula (J. S. Frame, G. de B. Robinson and R. M. Thrall, Canad. J.
  Math. 6 (1954)).
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Iterator
from math import factorial, prod


def partitions(d: int, largest: int | None = None) -> Iterator[tuple[int, ...]]:
    """The partitions of ``d`` into parts at most ``largest``, parts decreasing."""
    largest = d if largest is None else largest
    if d == 0:
        yield ()
        return
    for first in range(min(d, largest), 0, -1):
        for rest in partitions(d - first, first):
            yield (first,) + rest


def aut_order(mu: tuple[int, ...]) -> int:
    """``|Aut mu|``: the product of the factorials of the part multiplicities."""
    return prod(factorial(m) for m in Counter(mu).values())


def partition_count(d: int) -> int:
    """``p(d)`` by Euler's pentagonal number recurrence."""
    p = [1] + [0] * d
    for n in range(1, d + 1):
        k = 1
        while k * (3 * k - 1) // 2 <= n:
            sign = 1 if k % 2 else -1
            p[n] += sign * p[n - k * (3 * k - 1) // 2]
            if k * (3 * k + 1) // 2 <= n:
                p[n] += sign * p[n - k * (3 * k + 1) // 2]
            k += 1
    return p[d]


def hook_dimension(shape: tuple[int, ...]) -> int:
    """``n! / prod(hook lengths)`` for the Young diagram ``shape``."""
    columns = [sum(1 for row in shape if row > j) for j in range(shape[0])] if shape else []
    hooks = prod(
        (row - j - 1) + (columns[j] - i - 1) + 1
        for i, row in enumerate(shape)
        for j in range(row)
    )
    return factorial(sum(shape)) // hooks
