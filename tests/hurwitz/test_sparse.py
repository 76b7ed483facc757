"""The sparse engine (content sums, hook products, streamed partitions) against
the character-table engine and against published values at high degree."""

from fractions import Fraction
from itertools import combinations_with_replacement
from math import factorial, prod

import pytest

from covertree.hurwitz.numbers import SPARSE_DEGREE, _transitive, _tuples, connected_hurwitz, tuple_counts
from covertree.hurwitz.sparse import is_sparse, sparse_tuple_counts
from covertree.symmetric.characters import character, dimensions
from covertree.symmetric.contents import (
    content_moments,
    content_sum,
    hook_product,
    iter_partitions,
    strip_character,
)
from covertree.symmetric.partitions import partitions_of, simple
from tests.quasimodular import f2_coefficients, f3_coefficients


@pytest.mark.parametrize("n", range(0, 16))
def test_stream_is_the_list_of_partitions(n):
    assert list(iter_partitions(n)) == [tuple(p) for p in partitions_of(n)]


@pytest.mark.parametrize("n", range(1, 13))
def test_hooks_and_contents(n):
    # hook length formula (Frame-Robinson-Thrall 1954) against the branching-rule
    # dimensions; the content sum is the central character of a transposition
    # (Macdonald, Symmetric Functions, I.7 Ex. 7) when n >= 2
    for lam, dim in zip(iter_partitions(n), dimensions(n)):
        assert factorial(n) // hook_product(lam) == dim
        if n >= 2:
            assert content_sum(lam) * dim == n * (n - 1) // 2 * character(lam, (2,) + (1,) * (n - 2))


@pytest.mark.parametrize("n", range(2, 11))
def test_strip_character_is_murnaghan_nakayama(n):
    for mu in partitions_of(n):
        nu = tuple(p for p in mu if p > 1)
        for lam in iter_partitions(n):
            assert strip_character(lam, nu) == character(lam, mu), (lam, mu)


def test_content_moments_against_the_stream():
    table = content_moments(14, 3)
    for n in range(15):
        sums = [sum(content_sum(lam) ** j for lam in iter_partitions(n)) for j in range(4)]
        assert list(table[n]) == sums


def _small_sparse_cases(d, h):
    parts = [tuple(p) for p in partitions_of(d) if is_sparse([p])]
    for b in range(0, 4):
        for combo in combinations_with_replacement(parts, b):
            if is_sparse(combo) and (h > 0 or b >= 3):
                yield combo


@pytest.mark.parametrize("h", [0, 1, 2])
@pytest.mark.parametrize("d", range(1, 8))
def test_sparse_engine_equals_the_table_engine(d, h):
    for combo in _small_sparse_cases(d, h):
        key = tuple(sorted(combo))
        assert sparse_tuple_counts(d, h, combo) == (_transitive(h, d, key), _tuples(h, d, key)), combo


def test_sparse_engine_on_many_simple_points():
    # genus 0, 2d - 2 simple points, and genus 2 targets: the streamed weights
    for d in range(2, 9):
        profiles = [simple(d)] * (2 * d - 2)
        key = tuple(sorted(tuple(p) for p in profiles))
        assert sparse_tuple_counts(d, 0, profiles) == (_transitive(0, d, key), _tuples(0, d, key))
    key = tuple(sorted([tuple(simple(9))] * 2))
    assert sparse_tuple_counts(9, 2, key) == (_transitive(2, 9, key), _tuples(2, 9, key))


def test_the_switch_to_the_sparse_engine():
    assert is_sparse([simple(40)] * 2) and is_sparse([(3,) + (1,) * 37, simple(40)])
    assert not is_sparse([(40,)])
    assert SPARSE_DEGREE <= 30


@pytest.mark.parametrize("d", [31, 45, 60])
def test_genus_two_over_an_elliptic_curve_at_high_degree(d):
    # R. Dijkgraaf, Mirror symmetry and elliptic curves (1995): 2 [q^d] F_2 with
    # F_2 = (10 E_2^3 - 6 E_2 E_4 - 4 E_6)/103680 (OEIS A170991)
    assert connected_hurwitz(d, 1, [simple(d)] * 2) == 2 * f2_coefficients(d + 1)[d]


def test_genus_three_over_an_elliptic_curve_at_degree_40():
    # OEIS A170992 (genus-3 generating function, four labelled simple points)
    assert connected_hurwitz(40, 1, [simple(40)] * 4) == f3_coefficients(41)[40]


@pytest.mark.parametrize("mu", [(3,) + (1,) * 14, (1,) * 17])
def test_hurwitz_formula_at_degree_17(mu):
    # A. Hurwitz, Math. Ann. 39 (1891); Goulden-Jackson, Proc. AMS 125 (1997):
    # H_0(mu) = r!/|Aut mu| d^{l-3} prod mu_i^{mu_i}/mu_i!, r = d + l - 2 simple points
    d, l = 17, len(mu)
    r = d + l - 2
    aut = prod(factorial(mu.count(p)) for p in set(mu))
    expected = (
        Fraction(factorial(r), aut) * Fraction(d) ** (l - 3)
        * prod(Fraction(m**m, factorial(m)) for m in mu)
    )
    transitive, _ = sparse_tuple_counts(d, 0, [mu] + [simple(d)] * r)
    assert Fraction(transitive, factorial(d)) == expected


def test_tuple_counts_at_high_degree_are_exact_integers():
    transitive, total = tuple_counts(60, 1, [simple(60)] * 2)
    assert Fraction(transitive, factorial(60)) == 2 * f2_coefficients(61)[60]
    assert total % factorial(60) == 0
