"""Partition statistics without a character table: contents, hooks, streams.

For a partition ``lambda`` of ``m`` (rows ``i = 0, 1, ...``, columns
``j = 0, 1, ...``) the *content* of the cell ``(i, j)`` is ``j - i`` and its
*hook* is ``lambda_i - j + lambda'_j - i - 1``.  Three classical facts let
Frobenius' formula run over the partitions one at a time, in memory linear in
the degree:

* content formula: the class sum of the transpositions acts on the
  irreducible ``lambda`` by the scalar ``c(lambda) = sum of the contents``, so
  the central character of the simple profile ``(2, 1^(m-2))`` is
  ``c(lambda)`` (Frobenius 1900; I. G. Macdonald, *Symmetric Functions and
  Hall Polynomials*, 2nd ed. 1995, I.7 Example 7);
* hook length formula: ``dim lambda = m! / H(lambda)`` with ``H`` the product
  of the hooks (Frame-Robinson-Thrall 1954);
* Murnaghan-Nakayama for a class ``nu + 1^r`` with few non-fixed points:
  ``chi_lambda(nu + 1^r)`` is the signed sum, over the ways of removing border
  strips of the sizes ``nu`` one after the other, of ``dim`` of what is left.

:func:`content_moments` goes further for the content sums alone: it never
lists a partition.  Adding a part ``k`` at least as large as every part on
*top* of a partition of ``s`` moves each old cell one row down (content
``-1`` each) and adds a row of contents ``0..k-1``, so
``c(new) = c(old) + k(k-1)/2 - s``; a dynamic programme over the largest part
then carries the moments ``sum c^j`` (``j <= top``) of every size, in
``O(m^2 top^2)`` operations and ``O(m top)`` numbers.

References
----------
I. G. Macdonald, "Symmetric Functions and Hall Polynomials", 2nd ed. (1995),
I.7 Example 7: the content formula
J. S. Frame, G. de B. Robinson and R. M. Thrall, "The hook graphs of the
symmetric group", Canadian Journal of Mathematics 6 (1954): the hook length
formula
F. D. Murnaghan, "The characters of the symmetric group", American Journal of
Mathematics 59 (1937); T. Nakayama, "On some modular properties of irreducible
representations of a symmetric group I", Japanese Journal of Mathematics 17
(1940): the Murnaghan-Nakayama rule

Examples
--------
>>> content_sum((3, 1))
2
>>> hook_product((3, 1))      # hooks 4, 2, 1, 1: dim = 4!/8 = 3
8
>>> [tuple(p) for p in iter_partitions(4)]
[(4,), (3, 1), (2, 2), (2, 1, 1), (1, 1, 1, 1)]
>>> content_moments(4, 2)[4]  # sum over lambda |- 4 of 1, c, c^2: 0 and 2*(36+4)
(5, 0, 80)
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from math import comb, factorial

__all__ = [
    "content_sum",
    "hook_product",
    "iter_partitions",
    "content_moments",
    "strip_character",
]


def content_sum(lam: Sequence[int]) -> int:
    """The sum of the contents ``j - i`` over the cells of ``lam`` (non-increasing).

    >>> content_sum((2, 1, 1)), content_sum((4,))
    (-2, 6)
    """
    return sum(part * (part - 1) // 2 - i * part for i, part in enumerate(lam))


def hook_product(lam: Sequence[int]) -> int:
    """The product of the hook lengths of ``lam`` (non-increasing, positive parts).

    >>> hook_product((2, 2)), hook_product((1, 1, 1))
    (12, 6)
    """
    if not lam:
        return 1
    conjugate = [0] * lam[0]
    for part in lam:
        for j in range(part):
            conjugate[j] += 1
    product = 1
    for i, part in enumerate(lam):
        for j in range(part):
            product *= part - j + conjugate[j] - i - 1
    return product


def iter_partitions(n: int) -> Iterator[tuple[int, ...]]:
    """The partitions of ``n`` one at a time, in reverse lexicographic order
    (``(n)`` first, as :func:`~covertree.symmetric.partitions.partitions_of`),
    keeping only the current one in memory.

    >>> len(list(iter_partitions(10)))
    42
    """
    if n == 0:
        yield ()
        return
    parts = [n]
    while True:
        yield tuple(parts)
        # drop the trailing 1s, lower the last part above them, refill greedily
        ones = 0
        while parts and parts[-1] == 1:
            parts.pop()
            ones += 1
        if not parts:
            return
        last = parts.pop() - 1
        copies, rest = divmod(ones + 1, last)
        parts += [last] * (copies + 1)
        if rest:
            parts.append(rest)


def content_moments(n: int, top: int) -> tuple[tuple[int, ...], ...]:
    """``M[s][j] = sum over the partitions lambda of s of c(lambda)^j`` for
    ``0 <= s <= n`` and ``0 <= j <= top`` (see the module docstring), without
    listing a partition.

    >>> content_moments(3, 1)
    ((1, 0), (1, 0), (2, 0), (3, 0))
    >>> content_moments(3, 2)[3]  # contents sums 3, 0, -3
    (3, 0, 18)
    """
    binomials = [[comb(j, i) for i in range(j + 1)] for j in range(top + 1)]
    # table[s]: moments of the partitions of s with every part <= k (k grows)
    table = [[1] + [0] * top] + [[0] * (top + 1) for _ in range(n)]
    for k in range(1, n + 1):
        for s in range(k, n + 1):
            shift = k * (k - 1) // 2 - (s - k)
            old, new = table[s - k], table[s]
            powers = [shift**e for e in range(top + 1)]
            for j in range(top + 1):
                row = binomials[j]
                new[j] += sum(row[i] * powers[j - i] * old[i] for i in range(j + 1))
    return tuple(tuple(row) for row in table)


def _mask(lam: Sequence[int]) -> int:
    length = len(lam)
    mask = 0
    for i, part in enumerate(lam):
        mask |= 1 << (part + length - 1 - i)
    return mask


def _hooks_of_mask(mask: int) -> tuple[int, int]:
    # (size, hook product) of the partition with this beta-set: the hooks in
    # the row of bead b are b - e for the empty places e < b
    size, hooks, empty = 0, 1, []
    for place in range(mask.bit_length()):
        if mask >> place & 1:
            for e in empty:
                hooks *= place - e
            size += len(empty)
        else:
            empty.append(place)
    return size, hooks


def _strips(mask: int, nu: tuple[int, ...]) -> Iterator[tuple[int, int]]:
    # (sign, beta-set left) over the ways of removing strips of the sizes nu
    if not nu:
        yield 1, mask
        return
    k, rest = nu[0], nu[1:]
    free = (mask >> k) & ~mask
    between = (1 << (k - 1)) - 1
    while free:
        low = free & -free
        free ^= low
        t = low.bit_length() - 1
        sign = -1 if ((mask >> (t + 1)) & between).bit_count() & 1 else 1
        for inner, left in _strips(mask ^ low ^ (low << k), rest):
            yield sign * inner, left


def strip_character(lam: Sequence[int], nu: Sequence[int]) -> int:
    """``chi_lambda(nu + 1^r)`` with ``r = |lambda| - |nu|`` (parts of ``nu`` at
    least 2, ``|nu| <= |lambda|``): Murnaghan-Nakayama on the parts of ``nu``,
    then the hook length formula, with no table and no memo.  The rule holds
    for the strips removed in any order; ``nu`` non-increasing (as
    :func:`~covertree.hurwitz.sparse.sparse_part` gives it) branches least.

    >>> strip_character((2, 1), (3,)), strip_character((3, 1, 1), (2,))
    (-1, 0)
    >>> strip_character((4, 2), ())                 # the dimension
    9
    """
    total = 0
    for sign, left in _strips(_mask(lam), tuple(nu)):
        size, hooks = _hooks_of_mask(left)
        total += sign * (factorial(size) // hooks)
    return total
