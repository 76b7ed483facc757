"""Hurwitz numbers of high degree for mostly simple profiles, in bounded memory.

Frobenius' formula needs, for a profile ``mu``, the central characters
``f_lambda(mu)`` over every ``lambda |- m`` and every sub-degree ``m`` of the
connected recursion (:mod:`covertree.hurwitz.numbers`).  The character-table
route keeps whole columns (``p(60) = 966467`` entries, and the memo of the
Murnaghan-Nakayama rule behind them), which is what exhausts memory at high
degree.  Here a profile is written ``nu + 1^r`` with ``nu`` its parts ``>= 2``,
and when every ``nu`` is small no table is built:

* ``f_lambda(1^m) = 1`` and ``f_lambda(2, 1^(m-2)) = c(lambda)``, the content
  sum (content formula);
* otherwise ``f_lambda(nu + 1^r) = chi_lambda(nu + 1^r) H(lambda) / (z(nu) r!)``
  with ``H`` the hook product (``|C_mu| / dim lambda = H(lambda) / z(mu)``) and
  the character by strip removal
  (:func:`~covertree.symmetric.contents.strip_character`);
* ``N(m; mu) = m! sum_lambda H(lambda)^(2h-2) prod_j f_lambda(mu_j)`` (target
  genus ``h >= 1``), ``sum_lambda (m!/H)^2 prod_j f / m!`` for ``h = 0``;
* for an elliptic target with only simple and unramified points the weight is 1
  and only the moments ``sum_lambda c(lambda)^j`` are needed: they come from
  :func:`~covertree.symmetric.contents.content_moments` without listing a
  partition; every other case streams the partitions of each sub-degree once,
  for all the sub-problems of that degree together.

Sub-problems are keyed by the degree and the sorted list of the ``nu`` (with
the number of points of each; unramified points, a factor 1 in every sum, are
dropped), memoised
per call (nothing outlives the call), so the memory is polynomial in the degree
and the number of branch points.  The connected recursion on the orbit of sheet
0 is the one of :mod:`covertree.hurwitz.numbers`, on this short form.

References
----------
G. Frobenius, "Uber Gruppencharaktere", Sitzungsberichte der Preussischen
Akademie der Wissenschaften zu Berlin (1896): Frobenius' formula
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
Genus-2 covers of an elliptic curve (two simple points) at degree 4: the
connected number is ``1440 / 4! = 60``:

>>> sparse_tuple_counts(4, 1, [(2, 1, 1), (2, 1, 1)])
(1440, 1920)
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Sequence
from itertools import combinations_with_replacement, product
from math import comb, factorial, prod

from covertree.symmetric.contents import (
    content_moments,
    content_sum,
    hook_product,
    iter_partitions,
    strip_character,
)
from covertree.symmetric.partitions import sub_partitions, z

__all__ = ["SPARSE_PARTS", "SPARSE_SPECIAL", "sparse_part", "is_sparse", "sparse_tuple_counts"]

#: largest sum of the parts >= 2 of a profile the sparse engine takes
SPARSE_PARTS = 6
#: largest number of profiles other than simple and unramified it takes
SPARSE_SPECIAL = 3

#: a sub-problem's profiles as sorted pairs (parts >= 2, number of points)
Key = tuple[tuple[tuple[int, ...], int], ...]
_SIMPLE, _NONE = (2,), ()


def sparse_part(mu: Sequence[int]) -> tuple[int, ...]:
    """The parts ``>= 2`` of ``mu``, non-increasing.

    >>> sparse_part((3, 2, 1, 1))
    (3, 2)
    """
    return tuple(sorted((p for p in mu if p > 1), reverse=True))


def is_sparse(profiles: Sequence[Sequence[int]]) -> bool:
    """Whether the profiles suit :func:`sparse_tuple_counts` (every ``nu``
    small, few profiles other than simple or unramified).

    >>> is_sparse([(2, 1, 1), (1, 1, 1, 1)]), is_sparse([(4,), (4,), (4,), (4,)])
    (True, False)
    """
    nus = [sparse_part(mu) for mu in profiles]
    special = sum(nu not in (_SIMPLE, _NONE) for nu in nus)
    return special <= SPARSE_SPECIAL and all(sum(nu) <= SPARSE_PARTS for nu in nus)


def sparse_tuple_counts(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> tuple[int, int]:
    """``(T, N)`` as :func:`covertree.hurwitz.numbers.tuple_counts`, by the
    sparse engine (profiles already checked to sum to ``degree``).

    >>> sparse_tuple_counts(3, 0, [(3,), (2, 1), (2, 1)])   # 2 x 3 transitive tuples
    (6, 6)
    """
    key = _counted(sparse_part(mu) for mu in profiles)
    engine = _Engine(target_genus, degree, key)
    for m in range(1, degree):  # bottom up: the recursion below never goes deeper than one level
        for inside in _keys_of_degree(key, degree, m):
            engine.transitive(m, inside)
    return engine.transitive(degree, key), engine.tuples(degree, key)


class _Engine:
    """Memo of one computation: sub-problems ``(m, key)`` of one problem."""

    def __init__(self, h: int, degree: int, key: Key) -> None:
        self.h, self.degree, self.top = h, degree, key
        self.memo_n: dict[tuple[int, Key], int] = {}
        self.memo_t: dict[tuple[int, Key], int] = {}
        self.moments: tuple[tuple[int, ...], ...] | None = None
        if h == 1 and all(nu in (_SIMPLE, _NONE) for nu, _ in key):
            self.moments = content_moments(degree, dict(key).get(_SIMPLE, 0))

    def tuples(self, m: int, key: Key) -> int:
        """``N(m; nu + 1^(m-|nu|) ...)``."""
        if m == 0:
            return 1
        if (m, key) not in self.memo_n:
            if self.moments is not None:
                self.memo_n[m, key] = factorial(m) * self.moments[m][dict(key).get(_SIMPLE, 0)]
            else:
                self.memo_n.update(_stream(self.h, m, _keys_of_degree(self.top, self.degree, m)))
        return self.memo_n[m, key]

    def transitive(self, m: int, key: Key) -> int:
        """``T(m; ...)`` by the recursion on the orbit of sheet 0."""
        if (m, key) in self.memo_t:
            return self.memo_t[m, key]
        total = self.tuples(m, key)
        for k in range(1, m):
            binom = comb(m - 1, k - 1)
            for weight, inside, outside in _splits(key, m, k):
                t = self.transitive(k, inside)
                if t:
                    total -= binom * weight * t * self.tuples(m - k, outside)
        self.memo_t[m, key] = total
        return total


def _sub_parts(nu: tuple[int, ...], m: int, k: int) -> list[tuple[tuple[int, ...], tuple[int, ...]]]:
    # (inside, outside) for the profile nu + 1^(m - |nu|) split into sizes k, m - k
    out = []
    for size in range(0, min(k, sum(nu)) + 1):
        if k - size > m - sum(nu):
            continue
        for inner in sub_partitions(nu, size):
            rest = Counter(nu)
            rest.subtract(inner)
            out.append((tuple(inner), tuple(sorted(rest.elements(), reverse=True))))
    return out


def _splits(groups, m: int, k: int):
    """As :func:`covertree.hurwitz.numbers._splits`, on the short form."""
    per_group = []
    for nu, count in groups:
        options = _sub_parts(nu, m, k)
        choices = []
        for combo in combinations_with_replacement(range(len(options)), count):
            ways = factorial(count)
            for c in Counter(combo).values():
                ways //= factorial(c)
            choices.append((ways, [(options[i], c) for i, c in Counter(combo).items()]))
        per_group.append(choices)
    for pick in product(*per_group):
        inside: Counter = Counter()
        outside: Counter = Counter()
        for _, chosen in pick:
            for (inner, rest), times in chosen:
                inside[inner] += times
                outside[rest] += times
        yield prod(ways for ways, _ in pick), _sorted(inside), _sorted(outside)


def _counted(nus) -> Key:
    return _sorted(Counter(nus))


def _sorted(counts: Counter) -> Key:
    # unramified points (nu empty) act as the identity everywhere: dropped
    return tuple(sorted((nu, c) for nu, c in counts.items() if nu and c))


def _keys_of_degree(groups, degree: int, m: int) -> list[Key]:
    # every sub-problem of degree m: one sub-multiset per branch point
    return sorted({inside for _, inside, _ in _splits(groups, degree, m)})


def _stream(h: int, m: int, keys: list[Key]) -> dict[tuple[int, Key], int]:
    """``N(m; key)`` for every key, in one pass over the partitions of ``m``."""
    features = sorted({nu for key in keys for nu, _ in key})
    counted = [(key, [(features.index(nu), c) for nu, c in key]) for key in keys]
    sums = [0] * len(keys)
    fact = factorial(m)
    # (the hooks go unused only over an elliptic target at the few sizes below
    # the special parts, where every point left is simple: one product more
    # per partition there)
    for lam in iter_partitions(m):
        hooks = hook_product(lam)
        values = [_feature(lam, nu, hooks, m) for nu in features]
        weight = _weight(h, hooks, fact)
        for i, (_, factors) in enumerate(counted):
            sums[i] += weight * prod(values[f] ** c for f, c in factors)
    out = {}
    for (key, _), total in zip(counted, sums):
        if h == 0:
            quotient, remainder = divmod(total, fact)
            if remainder:
                raise ArithmeticError("Frobenius' sum is not divisible by d!: a bug")
            out[m, key] = quotient
        else:
            out[m, key] = fact * total
    return out


def _weight(h: int, hooks: int, fact: int) -> int:
    if h == 1:
        return 1
    if h == 0:
        dim = fact // hooks
        return dim * dim
    return hooks ** (2 * h - 2)


def _feature(lam: tuple[int, ...], nu: tuple[int, ...], hooks: int, m: int) -> int:
    """``f_lambda(nu + 1^(m - |nu|))`` (``nu`` not empty: unramified points
    are dropped from the keys)."""
    if nu == _SIMPLE:
        return content_sum(lam)
    rest = m - sum(nu)
    num = strip_character(lam, nu) * hooks
    den = z(nu) * factorial(rest)
    if num % den:
        raise ArithmeticError(f"central character of {nu} is not integral: a bug")
    return num // den
