"""Connected pieces against published counts (OEIS A170991, Hurwitz 1891,
OEIS A049293): the sum of 1/|centraliser| over the pieces with the given
profiles is the connected Hurwitz number of the component."""

from __future__ import annotations

from fractions import Fraction
from math import factorial

import pytest

from covertree.monodromy.pieces import connected_pieces


def _simple(k: int) -> dict[int, int]:
    return {2: 1, 1: k - 2}


def _weight(pieces: list, profiles: list) -> Fraction:
    return sum((Fraction(1, p.centraliser_order) for p in pieces
                if all(p.profile(j) == mu for j, mu in enumerate(profiles))), Fraction(0))


@pytest.mark.parametrize("d, expected", [(2, 2), (3, 16), (4, 60), (5, 160), (6, 360), (7, 672)])
def test_published_genus_two_covers_of_elliptic_curve(d, expected):
    # OEIS A170991 (connected genus-2 covers of an elliptic curve with two simple
    # branch points, degree d): 2, 16, 60, 160, 360, 672, ...
    simple = (2,) + (1,) * (d - 2)
    assert _weight(connected_pieces(d, 1, [_simple(d)] * 2), [simple, simple]) == expected


@pytest.mark.parametrize("d", [2, 3, 4, 5])
def test_published_genus_zero_simple_hurwitz(d):
    # Hurwitz 1891 (Math. Ann. 39): connected genus-0 covers of P^1 with 2d-2
    # simple branch points number d^(d-3) (2d-2)! / d!
    simple = (2,) + (1,) * (d - 2)
    pieces = connected_pieces(d, 0, [_simple(d)] * (2 * d - 2))
    expected = Fraction(d) ** (d - 3) * factorial(2 * d - 2) / factorial(d)
    assert _weight(pieces, [simple] * (2 * d - 2)) == expected


def test_published_subgroups_of_genus_two_surface_group():
    # A subgroup of index k is a transitive action with a marked sheet, so it
    # counts k / |centraliser| per class.  Index 2: the 2^4 - 1 = 15 nonzero
    # maps to Z/2 (common knowledge).  Index 3: 220 (OEIS A049293, subgroups of
    # index n in the fundamental group of a closed orientable genus-2 surface).
    assert _weight(connected_pieces(2, 2, [{1: 2}]), [(1, 1)]) == Fraction(15, 2)
    assert _weight(connected_pieces(3, 2, [{1: 3}]), [(1, 1, 1)]) == Fraction(220, 3)
