"""Characters of S_d: orthogonality, dimensions and internal consistency."""

from fractions import Fraction
from math import factorial, prod

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from covertree.errors import ProfileError
from covertree.symmetric.characters import (
    central_character,
    central_characters,
    character,
    character_table,
    dimension,
    dimensions,
)
from covertree.symmetric.partitions import Partition, class_size, partitions_of, z


def _hook_lengths_dimension(lam):
    # textbook hook length formula on the diagram (Frame-Robinson-Thrall 1954)
    conj = [sum(1 for p in lam if p > j) for j in range(lam[0])] if lam else []
    hooks = prod(lam[i] - j + conj[j] - i - 1 for i in range(len(lam)) for j in range(lam[i]))
    return factorial(sum(lam)) // hooks


@pytest.mark.parametrize("d", range(0, 11))
def test_row_orthogonality(d):
    # <chi_lambda, chi_lambda'> = delta (first orthogonality relation; common knowledge)
    parts, table = character_table(d)
    sizes = [class_size(mu) for mu in parts]
    for i, row in enumerate(table):
        for j, other in enumerate(table):
            inner = sum(c * a * b for c, a, b in zip(sizes, row, other))
            assert inner == (factorial(d) if i == j else 0)


@pytest.mark.parametrize("d", range(0, 11))
def test_column_orthogonality(d):
    # sum_lambda chi_lambda(mu) chi_lambda(nu) = delta z(mu) (second relation; common knowledge)
    parts, table = character_table(d)
    for a, mu in enumerate(parts):
        for b, _ in enumerate(parts):
            s = sum(row[a] * row[b] for row in table)
            assert s == (z(mu) if a == b else 0)


@pytest.mark.parametrize("d", range(0, 16))
def test_sum_of_squared_dimensions(d):
    # sum (dim lambda)^2 = d! (common knowledge)
    assert sum(dim * dim for dim in dimensions(d)) == factorial(d)


@pytest.mark.parametrize("d", range(1, 13))
def test_dimension_hook_length(d):
    for lam in partitions_of(d):
        assert dimension(lam) == _hook_lengths_dimension(tuple(lam)) == character(lam, [1] * d)


def test_deep_diagrams_use_hook_formula():
    # beyond the branching-rule depth the hook formula is used; both agree
    assert dimension([400]) == 1
    assert dimension([1] * 400) == 1
    assert dimension([399, 1]) == 399  # the standard representation


@pytest.mark.parametrize("d", range(1, 10))
def test_trivial_sign_and_conjugation(d):
    parts, table = character_table(d)
    for j, mu in enumerate(parts):
        sign = (-1) ** (d - len(mu))
        assert table[0][j] == 1  # (d) is trivial
        assert table[-1][j] == sign  # (1^d) is the sign
        for i, lam in enumerate(parts):
            conj = Partition(sum(1 for p in lam if p > k) for k in range(lam[0]))
            assert table[parts.index(conj)][j] == sign * table[i][j]


@pytest.mark.parametrize("d", range(2, 9))
def test_central_character_of_transposition_is_content_sum(d):
    # f_lambda(2,1^{d-2}) = sum of contents j - i of the cells (Frobenius; common knowledge)
    mu = [2] + [1] * (d - 2)
    col = central_characters(mu)
    for lam, f in zip(partitions_of(d), col):
        contents = sum(j - i for i, row in enumerate(lam) for j in range(row))
        assert f == contents == central_character(lam, mu)


@settings(max_examples=40, deadline=None)
@given(st.integers(min_value=1, max_value=9), st.data())
def test_central_characters_are_integers_from_class_sums(d, data):
    parts = list(partitions_of(d))
    lam = data.draw(st.sampled_from(parts))
    mu = data.draw(st.sampled_from(parts))
    f = Fraction(class_size(mu) * character(lam, mu), dimension(lam))
    assert f.denominator == 1 and f == central_character(lam, mu)


def test_character_rejects_mismatched_sizes():
    with pytest.raises(ProfileError):
        character((2, 1), (2, 2))
    with pytest.raises(ProfileError):
        central_character((3,), (1, 1))


def test_table_order_matches_partitions_of():
    parts, table = character_table(7)
    assert list(parts) == list(partitions_of(7))
    assert len(table) == len(parts) == 15


def test_deep_diagram_dimension_is_exact():
    # beyond the branching-rule depth the dimension is a large exact integer
    # (hook length formula written out in tests/independent.py)
    from tests.independent import hook_dimension
    lam = (300, 5, 4, 3, 2, 1)
    value = dimension(lam)
    assert type(value) is int
    assert value == hook_dimension(lam) > 2**80


@pytest.mark.parametrize("d", range(1, 7))
def test_characters_by_frobenius_formula(d):
    from tests.symmetric.frobenius_formula import frobenius_character
    parts, table = character_table(d)
    for i, lam in enumerate(parts):
        for j, mu in enumerate(parts):
            expected = frobenius_character(tuple(lam), tuple(mu))
            assert table[i][j] == character(lam, mu) == expected
            assert central_character(lam, mu) * dimension(lam) == class_size(mu) * expected


def test_zero_parts_are_dropped_and_negative_parts_refused():
    assert character((2, 1, 0), (0, 3)) == character((2, 1), (3,)) == -1
    assert dimension((0, 3, 0, 1)) == 3
    with pytest.raises(ProfileError) as err:
        character((3, -1, 1), (3,))
    assert str(err.value) == "partition (3, 1, -1) has a negative part"
    with pytest.raises(ProfileError) as err:
        character((2, 1), (2, 2))
    assert str(err.value) == "lambda (2, 1) and mu (2, 2) are partitions of different integers"
