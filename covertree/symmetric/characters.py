"""Irreducible characters of the symmetric group S_d.

Irreducibles of S_d are indexed by partitions ``lambda`` of ``d``, conjugacy
classes by cycle types ``mu``.  ``character(lam, mu)`` is ``chi_lambda(mu)``,
computed by the Murnaghan-Nakayama rule

    chi_lambda(mu) = sum over border strips S of size mu_1 in lambda of
                     (-1)^{ht S} chi_{lambda - S}(mu_2, mu_3, ...),

where ``ht S`` is the number of rows of ``S`` minus one.  Border strips are
removed on the beta-set (abacus) of ``lambda``: with ``l`` parts, the beta-set
is ``{lambda_i + l - i}``; removing a strip of size ``k`` moves one bead from
``b`` to the empty position ``b - k``, and its height is the number of beads
strictly between.  Parts of ``mu`` are used largest first; once only parts 1
remain the character is ``dim lambda``, computed by the branching rule
``dim lambda = sum of dim(lambda - corner)`` over the removable corners
(memoised: a table's dimensions share their sub-diagrams), and by the hook
length formula ``d! / prod hooks`` only for diagrams too deep for that
recursion.  Values are memoised on ``(lambda, remaining mu)``, so a whole
character table shares its sub-computations.

Conventions: ``(d)`` is the trivial representation, ``(1^d)`` the sign.

References
----------
F. D. Murnaghan, "The characters of the symmetric group", American Journal
of Mathematics 59 (1937); T. Nakayama, "On some modular properties of
irreducible representations of a symmetric group I", Japanese Journal of
Mathematics 17 (1940): the Murnaghan-Nakayama rule.
J. S. Frame, G. de B. Robinson and R. M. Thrall, "The hook graphs of the
symmetric group", Canadian Journal of Mathematics 6 (1954): the hook length
formula.
G. James and A. Kerber, "The representation theory of the symmetric group"
(1981), sections 2.7 and 2.8: border strips on the abacus (beta-sets), and
the branching rule for dimensions.

Examples
--------
>>> character((2, 1), (3,))
-1
>>> character((3, 2), (2, 2, 1))
1
>>> dimension((3, 2))
5
>>> parts, table = character_table(3)
>>> [str(p) for p in parts]
['3', '2,1', '1,1,1']
>>> table
((1, 1, 1), (-1, 0, 2), (1, -1, 1))
"""

from __future__ import annotations

from collections.abc import Iterable
from functools import lru_cache
from math import factorial

from covertree.errors import ProfileError
from covertree.symmetric.partitions import Partition, class_size, partition_tuples, partitions_of

__all__ = [
    "character",
    "dimension",
    "dimensions",
    "character_table",
    "central_character",
    "central_characters",
]


def _normal(parts: Iterable[int]) -> tuple[int, ...]:
    """Non-increasing tuple of the positive parts (zeros dropped)."""
    t = tuple(sorted(parts, reverse=True))
    if t and t[-1] < 0:
        raise ProfileError(f"partition {t} has a negative part")
    return tuple(p for p in t if p)


def _pair(lam: Iterable[int], mu: Iterable[int]) -> tuple[tuple[int, ...], tuple[int, ...]]:
    lam_t, mu_t = _normal(lam), _normal(mu)
    if sum(lam_t) != sum(mu_t):
        raise ProfileError(f"lambda {lam_t} and mu {mu_t} are partitions of different integers")
    return lam_t, mu_t


def _mask(lam: tuple[int, ...]) -> int:
    """The beta-set ``{lambda_i + l - i}`` of a partition with ``l`` positive
    parts, as a bit mask (bit ``b`` set when ``b`` is in the beta-set).  With no
    zero parts, bit 0 is clear: this is the canonical mask of ``lambda``."""
    n = len(lam)
    mask = 0
    for i, part in enumerate(lam):
        mask |= 1 << (part + n - 1 - i)
    return mask


@lru_cache(maxsize=None)
def _dim_mask(mask: int) -> int:
    # Branching rule dim(lambda) = sum of dim(lambda - corner) over removable
    # corners (a bead with an empty place just below), memoised: additions only,
    # and a whole table's dimensions share the sub-diagrams.  Deep diagrams
    # (beyond the recursion budget) use the hook length formula instead.
    if mask.bit_length() > _BRANCHING_DEPTH:
        return _hook_dimension(mask)
    if not mask & (mask - 1):
        return 1  # the empty diagram (no bead) or a single row (one bead)
    free = (mask >> 1) & ~mask
    total = 0
    while free:
        low = free & -free
        free ^= low
        new = mask ^ low ^ (low << 1)
        new >>= (~new & (new + 1)).bit_length() - 1
        total += _dim_mask(new)
    return total


_BRANCHING_DEPTH = 300


def _hook_dimension(mask: int) -> int:
    # Hook length formula on the beta-set: the hooks in the row of bead b are
    # b - e for the empty places e < b.
    d, hooks, empty = 0, 1, []
    for place in range(mask.bit_length()):
        if mask >> place & 1:
            for e in empty:
                hooks *= place - e
            d += len(empty)
        else:
            empty.append(place)
    return factorial(d) // hooks


def dimension(lam: Iterable[int]) -> int:
    """Dimension ``chi_lambda(1^d)`` of the irreducible ``lambda`` (branching
    rule over the removable corners; hook length formula for very deep diagrams).

    >>> [dimension(p) for p in partitions_of(4)]
    [1, 3, 2, 3, 1]
    """
    return _dim_mask(_mask(_normal(lam)))


@lru_cache(maxsize=None)
def _mn(mask: int, mu: tuple[int, ...]) -> int:
    # mask: canonical beta-set of lambda; mu: remaining cycle lengths,
    # non-increasing, of total |lambda|.  Strips of size mu[0] are removed first.
    if not mu or mu[0] == 1:
        return _dim_mask(mask)
    k, rest = mu[0], mu[1:]
    total = 0
    # bit t of `free` is set when bead t + k can move down to the empty place t
    free = (mask >> k) & ~mask
    between = (1 << (k - 1)) - 1
    while free:
        low = free & -free
        free ^= low
        t = low.bit_length() - 1
        height = ((mask >> (t + 1)) & between).bit_count()
        new = mask ^ low ^ (low << k)
        new >>= (~new & (new + 1)).bit_length() - 1  # drop zero parts (low full places)
        value = _mn(new, rest)
        total += -value if height & 1 else value
    return total


def character(lam: Iterable[int], mu: Iterable[int]) -> int:
    """``chi_lambda(mu)``: the irreducible character ``lambda`` of S_d on the class
    of cycle type ``mu`` (Murnaghan-Nakayama rule).

    Raises
    ------
    ProfileError
        If ``lambda`` and ``mu`` are not partitions of the same integer.

    >>> character((2, 2), (2, 2))
    2
    >>> character((1, 1, 1, 1), (2, 1, 1))
    -1
    """
    lam_t, mu_t = _pair(lam, mu)
    return _mn(_mask(lam_t), mu_t)


def _central(mask: int, mu: tuple[int, ...], size: int) -> int:
    # |C_mu| chi / dim is an algebraic integer and rational, hence an integer.
    num, dim = size * _mn(mask, mu), _dim_mask(mask)
    if num % dim:
        raise ArithmeticError(f"central character of {mu} is not integral: a bug")
    return num // dim


def central_character(lam: Iterable[int], mu: Iterable[int]) -> int:
    """The central character ``f_lambda(mu) = |C_mu| chi_lambda(mu) / dim lambda``
    (an integer: the scalar by which the class sum of ``mu`` acts on ``lambda``).

    >>> central_character((2, 1), (2, 1))   # sum of contents 0 + 1 - 1
    0
    >>> central_character((3,), (2, 1))
    3
    """
    lam_t, mu_t = _pair(lam, mu)
    return _central(_mask(lam_t), mu_t, class_size(mu_t))


@lru_cache(maxsize=None)
def character_table(d: int) -> tuple[tuple[Partition, ...], tuple[tuple[int, ...], ...]]:
    """The character table of S_d.

    Returns ``(partitions, table)``: ``partitions`` lists the partitions of ``d``
    in the order of :func:`~covertree.symmetric.partitions.partitions_of`
    (``(d)`` first), used both for the rows (irreducibles ``lambda``) and the
    columns (classes ``mu``); ``table[i][j] = chi_{partitions[i]}(partitions[j])``.

    >>> parts, table = character_table(4)
    >>> table[1]            # lambda = (3, 1): the standard representation
    (-1, 0, -1, 1, 3)
    """
    if not isinstance(d, int) or d < 0:
        raise ProfileError(f"degree {d!r} is not a non-negative integer")
    parts = tuple(partitions_of(d))
    table = tuple(tuple(_mn(mask, tuple(mu)) for mu in parts) for mask in _masks(d))
    return parts, table


@lru_cache(maxsize=None)
def _masks(d: int) -> tuple[int, ...]:
    # same order as partitions_of(d), on its raw tuples (no re-validation)
    return tuple(_mask(lam) for lam in partition_tuples(d))


@lru_cache(maxsize=None)
def dimensions(d: int) -> tuple[int, ...]:
    """``dim lambda`` for every ``lambda`` of ``d``, in the order of
    :func:`~covertree.symmetric.partitions.partitions_of`.

    >>> dimensions(4)
    (1, 3, 2, 3, 1)
    """
    return tuple(_dim_mask(mask) for mask in _masks(d))


def central_characters(mu: Iterable[int]) -> tuple[int, ...]:
    """``f_lambda(mu)`` for every ``lambda`` of ``|mu|``, in the order of
    :func:`~covertree.symmetric.partitions.partitions_of` (one column of the
    table of central characters, memoised per class).

    >>> central_characters((2, 1, 1))      # sums of contents of the diagrams
    (6, 2, 0, -2, -6)
    """
    return _central_column(_normal(mu))


@lru_cache(maxsize=None)
def _central_column(mu: tuple[int, ...]) -> tuple[int, ...]:
    size = class_size(mu)
    return tuple(_central(mask, mu, size) for mask in _masks(sum(mu)))
