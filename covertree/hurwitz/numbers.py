"""Hurwitz numbers by characters of the symmetric group.

Convention (docs/theory.md, section 4; the same everywhere in covertree)
--------------------------------------------------------------------
A Hurwitz number counts degree-``d`` covers of a genus-``h`` surface with the
profiles ``mu_1..mu_b`` over **labelled** branch points, each cover weighted by
``1/|Aut|``, with the **preimages unlabelled**.  Equivalently it is
``#{(a_1, b_1, ..., a_h, b_h, s_1, ..., s_b)} / d!`` over tuples in ``S_d`` with
``[a_1, b_1]...[a_h, b_h] s_1...s_b = 1`` and ``s_j`` of cycle type ``mu_j``;
the connected number counts only tuples generating a transitive group.

Disconnected number (Frobenius 1896; Mednykh 1978; Lando-Zvonkin, *Graphs on
Surfaces and Their Applications*, appendix A)::

    H*(h; mu) = sum_{lambda |- d} (dim lambda / d!)^(2 - 2h) prod_j f_lambda(mu_j),
    f_lambda(mu) = |C_mu| chi_lambda(mu) / dim lambda.

Connected number: with ``N(d; mu) = d! H*(h; mu)`` (the number of tuples) and
``T(d; mu)`` the number of transitive ones, the orbit of sheet 0 has some size
``k``; choosing its other ``k - 1`` sheets, and the cycles ``nu_j`` of each
``s_j`` lying in it (a sub-multiset of ``mu_j`` of size ``k``),

    N(d; mu) = sum_k C(d-1, k-1) sum_{nu} T(k; nu) N(d - k; mu - nu),

(the commutator pairs split the same way), so ``T`` follows by recursion on the
degree and ``H = T(d; mu) / d!``.  Sub-problems are memoised on the target
genus, the degree and the sorted list of sub-profiles, so every sub-degree is
computed once and shares the memoised character columns.

Above degree :data:`SPARSE_DEGREE`, when the profiles are simple, unramified or
close to it (:func:`covertree.hurwitz.sparse.is_sparse`), the same numbers come
from :mod:`covertree.hurwitz.sparse` instead: content sums and hook products
over partitions streamed one at a time, no character table, memory polynomial
in the degree.

Converting to other conventions (never mix them):

* unordered branch points: divide by the symmetry of the list of profiles,
  ``prod_m (number of branch points with the same profile)!``;
* labelled preimages of the branch points: multiply by ``prod_j |Aut mu_j|``
  (for instance the one-part double Hurwitz numbers of Goulden-Jackson-Vakil
  label the preimages of infinity: theirs = ours x ``|Aut beta|``).

References
----------
G. Frobenius, "Uber Gruppencharaktere", Sitzungsberichte der Preussischen
Akademie der Wissenschaften zu Berlin (1896): Frobenius' formula
A. D. Mednykh, "Determination of the number of nonequivalent coverings over
a compact Riemann surface", Soviet Mathematics Doklady 19 (1978)
S. K. Lando and A. K. Zvonkin, "Graphs on Surfaces and Their Applications"
(2004), appendix A: Hurwitz numbers by characters, connected numbers

Examples
--------
Double covers of an elliptic curve branched at two points: the four pairs
``(a, b)`` in ``S_2`` all work, and ``4/2! = 2``.

>>> connected_hurwitz(2, 1, [(2,), (2,)])
Fraction(2, 1)

The unramified covers of an elliptic curve of degree 3 (mark one unramified
point): ``sigma_1(3)/3`` connected, ``p(3) = 3`` disconnected.

>>> connected_hurwitz(3, 1, [(1, 1, 1)]), disconnected_hurwitz(3, 1, [(1, 1, 1)])
(Fraction(4, 3), Fraction(3, 1))
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Sequence
from fractions import Fraction
from functools import lru_cache
from itertools import combinations_with_replacement, product
from math import comb, factorial, prod

from covertree.errors import ProblemError, ProfileError
from covertree.hurwitz.problem import HurwitzProblem, _check_degree
from covertree.hurwitz.sparse import is_sparse, sparse_tuple_counts
from covertree.symmetric.characters import central_characters, dimensions
from covertree.symmetric.partitions import Partition, difference, sub_partitions

__all__ = ["disconnected_hurwitz", "connected_hurwitz", "hurwitz_numbers", "tuple_counts"]

Profiles = tuple[tuple[int, ...], ...]

#: above this degree, sparse profiles go to :mod:`covertree.hurwitz.sparse`
SPARSE_DEGREE = 30


def _normalise(degree: int, target_genus: int, profiles: Sequence[Sequence[int]]) -> Profiles:
    _check_degree(degree)
    if not isinstance(target_genus, int) or isinstance(target_genus, bool) or target_genus < 0:
        raise ProblemError(
            f"target genus {target_genus!r} is not allowed; allowed: 0, 1, 2, ..."
        )
    out = []
    for mu in profiles:
        mu = Partition(mu)
        if mu.size != degree:
            raise ProfileError(f"profile {mu} sums to {mu.size}, not to the degree {degree}")
        out.append(tuple(mu))
    return tuple(sorted(out))


@lru_cache(maxsize=None)
def _tuples(h: int, m: int, profiles: Profiles) -> int:
    """``N(m; profiles)``: tuples ``(a_i, b_i, s_j)`` in ``S_m`` with the relation."""
    if m == 0:
        return 1
    columns = [central_characters(mu) for mu in profiles]
    dims = dimensions(m)
    fact = factorial(m)
    total = 0
    if h == 0:
        # N = sum dim^2 prod f / m!  (the sum is divisible by m!)
        for i, dim in enumerate(dims):
            total += dim * dim * prod(col[i] for col in columns)
        quotient, remainder = divmod(total, fact)
        if remainder:
            raise ArithmeticError("Frobenius' sum is not divisible by d!: a bug")
        return quotient
    # N = sum m! (m!/dim)^(2h-2) prod f, every term an integer (dim divides m!)
    for i, dim in enumerate(dims):
        total += (fact // dim) ** (2 * h - 2) * prod(col[i] for col in columns)
    return fact * total


@lru_cache(maxsize=None)
def _transitive(h: int, m: int, profiles: Profiles) -> int:
    """``T(m; profiles)``: the transitive tuples, by the recursion on the orbit
    of sheet 0 (see the module docstring)."""
    total = _tuples(h, m, profiles)
    groups = sorted(Counter(profiles).items())
    for k in range(1, m):
        binom = comb(m - 1, k - 1)
        for weight, inside, outside in _splits(groups, k):
            t = _transitive(h, k, inside)
            if t:
                total -= binom * weight * t * _tuples(h, m - k, outside)
    return total


def _splits(groups: list[tuple[tuple[int, ...], int]], k: int):
    """Every way to choose, at each branch point, the cycles ``nu`` inside the
    orbit (a sub-multiset of size ``k`` of its profile), up to permuting the
    points with equal profiles: yields ``(number of ways, inside, outside)``
    with ``inside``/``outside`` the sorted lists of ``nu`` and ``mu - nu``.
    Equal profiles are handled by multisets of choices with multinomial weights,
    so many simple points cost a handful of cases, not ``2^b``."""
    per_group = []
    for mu, count in groups:
        choices = _group_choices(mu, count, k)
        if not choices:
            return
        per_group.append(choices)
    for pick in product(*per_group):
        weight = prod(ways for ways, _ in pick)
        pairs = [pair for _, chosen in pick for pair in chosen]
        inside = tuple(sorted(nu for nu, _ in pairs))
        outside = tuple(sorted(rest for _, rest in pairs))
        yield weight, inside, outside


@lru_cache(maxsize=4096)
def _group_choices(mu: tuple[int, ...], count: int, k: int) -> tuple:
    """For ``count`` points of profile ``mu``: ``(ways, [(nu, mu - nu)...])``
    over the multisets of sub-multisets ``nu`` of size ``k`` (memoised: the
    same profiles recur across sub-degrees and calls)."""
    options = [(tuple(nu), tuple(difference(mu, nu))) for nu in sub_partitions(mu, k)]
    choices = []
    for combo in combinations_with_replacement(range(len(options)), count):
        ways = factorial(count)
        for c in Counter(combo).values():
            ways //= factorial(c)
        choices.append((ways, [options[i] for i in combo]))
    return tuple(choices)


def tuple_counts(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> tuple[int, int]:
    """``(T, N)``: the numbers of transitive and of all tuples
    ``(a_1, b_1, ..., a_h, b_h, s_1, ..., s_b)`` in ``S_d`` with
    ``prod [a_i, b_i] prod s_j = 1`` and ``s_j`` of type ``mu_j``.

    >>> tuple_counts(2, 2, [(1, 1)])    # |Hom(pi_1(genus 2), S_2)| = 2^4, 15 transitive
    (15, 16)
    """
    key = _normalise(degree, target_genus, profiles)
    return _counts(degree, target_genus, key)


def _sparse_applies(degree: int, key: Profiles) -> bool:
    """Whether the sparse engine counts this problem (both engines give the
    same numbers; the sparse one keeps the memory polynomial at high degree)."""
    return degree > SPARSE_DEGREE and is_sparse(key)


def _counts(degree: int, target_genus: int, key: Profiles) -> tuple[int, int]:
    # (T, N) by the sparse engine at high degree when it applies, else by the table
    if _sparse_applies(degree, key):
        return sparse_tuple_counts(degree, target_genus, key)
    groups = sorted(Counter(key).items())
    for m in range(1, degree):  # bottom up: the memoised recursion stays one level deep
        for inside in sorted({inside for _, inside, _ in _splits(groups, m)}):
            _transitive(target_genus, m, inside)
    return _transitive(target_genus, degree, key), _tuples(target_genus, degree, key)


def disconnected_hurwitz(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> Fraction:
    """The disconnected Hurwitz number ``H*`` (Frobenius' formula).

    Labelled branch points, weight ``1/|Aut|``, unlabelled preimages.  For
    unordered branch points divide by the symmetry of the list of profiles; for
    labelled preimages multiply by ``prod_j |Aut mu_j|``.  No Riemann-Hurwitz or
    stability condition is imposed: impossible problems give 0.

    >>> disconnected_hurwitz(2, 0, [(2,), (2,)])
    Fraction(1, 2)
    >>> disconnected_hurwitz(2, 1, [(1, 1)])       # p(2) partitions
    Fraction(2, 1)
    """
    key = _normalise(degree, target_genus, profiles)
    if _sparse_applies(degree, key):
        return Fraction(sparse_tuple_counts(degree, target_genus, key)[1], factorial(degree))
    return Fraction(_tuples(target_genus, degree, key), factorial(degree))


def connected_hurwitz(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> Fraction:
    """The connected Hurwitz number ``H`` (inclusion-exclusion over the orbit of
    sheet 0, docs/theory.md, section 4).

    Labelled branch points, weight ``1/|Aut|``, unlabelled preimages.  For
    unordered branch points divide by the symmetry of the list of profiles; for
    labelled preimages multiply by ``prod_j |Aut mu_j|``.  No Riemann-Hurwitz or
    stability condition is imposed: impossible problems give 0.

    >>> connected_hurwitz(3, 0, [(3,), (2, 1), (2, 1)])   # 2 three-cycles x 3 transpositions / 3!
    Fraction(1, 1)
    >>> connected_hurwitz(2, 2, [(1, 1)])                  # 15 index-2 subgroups / 2
    Fraction(15, 2)
    """
    key = _normalise(degree, target_genus, profiles)
    return Fraction(_counts(degree, target_genus, key)[0], factorial(degree))


def hurwitz_numbers(problem: HurwitzProblem) -> tuple[Fraction, Fraction]:
    """``(connected, disconnected)`` Hurwitz numbers of a :class:`HurwitzProblem`
    (same convention as :func:`connected_hurwitz`).

    >>> p = HurwitzProblem.build(degree=2, target_genus=1, genus=2)
    >>> hurwitz_numbers(p)
    (Fraction(2, 1), Fraction(2, 1))
    """
    transitive, total = tuple_counts(problem.degree, problem.target_genus, problem.profiles)
    fact = factorial(problem.degree)
    return Fraction(transitive, fact), Fraction(total, fact)
