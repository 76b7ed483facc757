"""The coset-enumeration step of the piece search: one trace of the relator.

``_Table._scan`` traces one rotation of the relator from a sheet, forwards as
far as the images are defined and backwards from the end as far as the
preimages are.  Sims (*Computation with Finitely Presented Groups*, 1994,
chapter 5) lists the three outcomes, each checked here on a table worked by
hand: the gap is one letter wide (its image is forced: a deduction), wider
(nothing follows yet), or the two traces meet with different sheets (no
permutation tuple completes the table: a contradiction).  A missed deduction
would only slow the search down, so the search's results cannot show it; these
tests pin the step itself.
"""

from __future__ import annotations

from covertree.monodromy.pieces import _Table

#: the relator ``s_0 s_1 s_2 s_3`` (letters: generator, exponent)
FOUR = ((0, 1), (1, 1), (2, 1), (3, 1))
#: the relator ``s_0 s_1 s_2``
THREE = ((0, 1), (1, 1), (2, 1))


def _table(k: int, relator: tuple, images: list[tuple[int, int, int]]) -> _Table:
    """A table of free generators with the images ``g: x -> y`` set, nothing traced."""
    table = _Table(k, [None] * len(relator), relator)
    for g, x, y in images:
        assert table.define(g, x, y)
    return table


def _rotation(table: _Table, g: int) -> tuple:
    """The rotation of the relator that starts with the letter ``s_g``."""
    (sign, word), = table.words[g]
    assert sign == 1
    return word


def test_one_missing_image_is_deduced_through_sheet_zero():
    # s_3: 0 -> 1, s_2: 2 -> 0, s_0: 1 -> 0 in degree 3.  From sheet 1:
    # forwards s_0 takes 1 to 0 and s_1(0) is unknown; backwards, the relation
    # must end at 1, so s_3^-1(1) = 0 and s_2^-1(0) = 2.  Only s_1(0) is
    # missing and the relation s_0 s_1 s_2 s_3 = 1 at sheet 1 forces s_1(0) = 2.
    table = _table(3, FOUR, [(3, 0, 1), (2, 2, 0), (0, 1, 0)])
    assert table._scan(_rotation(table, 0), 1)
    assert table.img[1] == [2, -1, -1]
    assert table.pre[1] == [-1, -1, 0]


def test_a_gap_of_two_letters_forces_nothing():
    # s_0: 1 -> 0 alone: from sheet 1 the images s_1(0), s_2(.), s_3(.) are
    # unknown (and s_3^-1(1) too), so nothing is forced.
    table = _table(3, FOUR, [(0, 1, 0)])
    before = [row[:] for row in table.img]
    assert table._scan(_rotation(table, 0), 1)
    assert table.img == before


def test_traces_meeting_at_different_sheets_are_a_contradiction():
    # Degree 4, relation s_0 s_1 s_2 = 1, with s_0: 0 -> 1, 3 -> 3,
    # s_1: 3 -> 2, s_2: 2 -> 0.  At sheet 0 the relation needs
    # s_1(1) = s_2^-1(0) = 2, but s_1 already sends 3 to 2: no permutation
    # completes the table, and nothing may be defined.
    table = _table(4, THREE, [(0, 0, 1), (2, 2, 0), (1, 3, 2), (0, 3, 3)])
    assert not table._scan(_rotation(table, 0), 0)
    assert table.img[1] == [-1, -1, -1, 2]


def test_a_closed_trace_checks_the_relation():
    # Everything defined: s_0 = (0 1), s_1 = (1 2), s_2 = ? with s_0 s_1 s_2 = 1
    # read left to right: 0 -> 1 -> 2 so s_2(2) = 0; 1 -> 0 -> 0 so s_2(0) = 1;
    # 2 -> 2 -> 1 so s_2(1) = 2.  The trace closes at every sheet; with
    # s_2(2) = 1 instead it does not close at sheet 0.
    good = _table(3, THREE, [(0, 0, 1), (0, 1, 0), (0, 2, 2), (1, 0, 0), (1, 1, 2), (1, 2, 1),
                             (2, 2, 0), (2, 0, 1), (2, 1, 2)])
    assert all(good._scan(_rotation(good, 0), p) for p in range(3))
    bad = _table(3, THREE, [(0, 0, 1), (0, 1, 0), (0, 2, 2), (1, 0, 0), (1, 1, 2), (1, 2, 1),
                            (2, 2, 1), (2, 1, 0), (2, 0, 2)])
    assert not bad._scan(_rotation(bad, 0), 0)
