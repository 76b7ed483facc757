"""Partition statistics without a table (covertree.symmetric.contents).

Contents and hooks are checked cell by cell on the diagram, the stream of
partitions against ``tests/independent.py``, the moments of the content sums
against sums over that list, and the strip-removal characters against
Frobenius' character formula (``tests/symmetric/frobenius_formula.py``).
"""

from __future__ import annotations

import pytest

from covertree.symmetric.contents import (
    content_moments,
    content_sum,
    hook_product,
    iter_partitions,
    strip_character,
)
from tests.independent import partitions
from tests.symmetric.frobenius_formula import frobenius_character


def _cells(lam: tuple[int, ...]) -> list[tuple[int, int]]:
    return [(i, j) for i, part in enumerate(lam) for j in range(part)]


def _hook(lam: tuple[int, ...], i: int, j: int) -> int:
    """Cells to the right of ``(i, j)``, below it, and the cell itself."""
    below = sum(1 for r in range(i + 1, len(lam)) if lam[r] > j)
    return (lam[i] - j - 1) + below + 1


@pytest.mark.parametrize("n", range(0, 9))
def test_contents_and_hooks_cell_by_cell(n):
    for lam in partitions(n):
        assert content_sum(lam) == sum(j - i for i, j in _cells(lam))
        product = 1
        for i, j in _cells(lam):
            product *= _hook(lam, i, j)
        assert hook_product(lam) == product


def test_hand_worked_contents_and_hooks():
    # (3, 2): contents 0 1 2 / -1 0, hooks 4 3 1 / 2 1 (dim 5!/24 = 5)
    assert content_sum((3, 2)) == 2
    assert hook_product((3, 2)) == 24
    assert hook_product(()) == 1 and content_sum(()) == 0


@pytest.mark.parametrize("n", range(0, 16))
def test_stream_of_partitions(n):
    assert list(iter_partitions(n)) == list(partitions(n))


@pytest.mark.parametrize("n, top", [(0, 0), (1, 2), (4, 0), (6, 3), (9, 2)])
def test_content_moments_are_sums_over_the_partitions(n, top):
    table = content_moments(n, top)
    assert len(table) == n + 1
    for s in range(n + 1):
        sums = [content_sum(lam) for lam in partitions(s)]
        assert table[s] == tuple(sum(c**j for c in sums) for j in range(top + 1))


@pytest.mark.parametrize("n", range(1, 7))
def test_strip_characters_by_frobenius_formula(n):
    for lam in partitions(n):
        for mu in partitions(n):
            nu = tuple(p for p in mu if p > 1)
            assert strip_character(lam, nu) == frobenius_character(lam, mu), (lam, mu)
    # the strips may be removed in any order
    for lam in partitions(6):
        assert strip_character(lam, (2, 3)) == frobenius_character(lam, (3, 2, 1))
        assert strip_character(lam, (2, 4)) == frobenius_character(lam, (4, 2))
