"""Markings of the source: specifications, errors, the labelling factor."""

from __future__ import annotations

import pytest

from covertree.hurwitz.marks import MarkError, labellings, legs_from_specs, legs_over, marked_symmetry, parse_mark
from covertree.hurwitz.problem import HurwitzProblem


def test_every_ramified_point_of_each_index():
    assert legs_from_specs([(3, 2, 2, 1)], ["1"]) == ((1, 3), (1, 2), (1, 2))


def test_legs_are_ordered_by_point_then_index_whatever_the_option_order():
    a = legs_from_specs([(2, 1), (3,), (1, 1, 1)], ["3:1^2", "1", "2"])
    b = legs_from_specs([(2, 1), (3,), (1, 1, 1)], ["2", "1", "3:1^2"])
    assert a == b == ((1, 2), (2, 3), (3, 1), (3, 1))


def test_one_named_point_and_counts():
    assert legs_from_specs([(2, 1, 1)], ["1:1"]) == ((1, 1),)
    assert legs_from_specs([(2, 1, 1)], ["1:1^2", "1:2"]) == ((1, 2), (1, 1), (1, 1))


@pytest.mark.parametrize("spec, words", [
    ("7", "branch point 7; allowed: 1 .. 2"),
    ("1:3", "no point of index 3"),
    ("2", "is unramified"),
    ("1:1^3", "has 2"),
    ("x", "is not J, J:e or J:e^c"),
    ("1:1^0", "at least 1"),
    ("", "is not J"),
])
def test_bad_marks_are_one_line_errors(spec, words):
    with pytest.raises(MarkError) as info:
        legs_from_specs([(2, 1, 1), (1, 1, 1, 1)], [spec])
    assert words in str(info.value) and "\n" not in str(info.value)


def test_a_point_marked_twice_in_full():
    with pytest.raises(MarkError, match="already marked"):
        legs_from_specs([(2,), (2,)], ["1", "1"])
    with pytest.raises(MarkError, match="asks for|ask for"):
        legs_from_specs([(2,), (2,)], ["1", "1:2"])


def test_parse_mark():
    assert parse_mark("12:3^4") == (12, 3, 4)


def test_labellings_are_falling_factorials():
    # 4 points of index 1 over J, 2 of them labelled: 4 * 3
    assert labellings([(2, 1, 1, 1, 1)], ((1, 1), (1, 1))) == 12
    assert labellings([(2, 2, 1)], ((1, 2), (1, 2), (1, 1))) == 2
    assert labellings([(2,)], ()) == 1


def test_marked_symmetry_fixes_marked_points():
    assert marked_symmetry([(2,)] * 6, ()) == 720
    assert marked_symmetry([(2,)] * 6, tuple((j, 2) for j in range(1, 7))) == 1
    assert marked_symmetry([(2, 1), (2, 1), (3,), (3,)], ((3, 3),)) == 2


def test_problem_carries_marks_and_json():
    p = HurwitzProblem.build(2, 0, genus=2, marks=["1"])
    assert p.marks == ((1, 2),) and p.n_marks == 1
    assert p.to_dict()["marks"] == [[1, 2]]
    assert "marks" not in p.unmarked().to_dict()


def test_problem_rejects_marks_that_name_no_point():
    with pytest.raises(MarkError):
        HurwitzProblem(2, 0, 2, HurwitzProblem.build(2, 0, genus=2).profiles, ((1, 1),))
    with pytest.raises(MarkError):
        HurwitzProblem.build(2, 0, genus=2, marks=["9"])


def test_an_index_not_in_the_profile_lists_the_indices_allowed():
    with pytest.raises(MarkError) as info:
        legs_from_specs([(3, 2, 1, 1)], ["1:4"])
    assert str(info.value) == ("mark '1:4': no point of index 4 over branch point 1 "
                               "(profile 3,2,1,1); allowed indices: 3, 2, 1")


def test_labellings_count_at_the_branch_point_named():
    # two labelled unramified points over branch point 2 (four of them): 4 * 3;
    # branch point 1 has only two unramified points
    assert labellings([(2, 1, 1), (1, 1, 1, 1)], ((2, 1), (2, 1))) == 12
    assert labellings([(2, 1, 1), (1, 1, 1, 1)], ((1, 1), (1, 1))) == 2


def test_marked_symmetry_fixes_the_point_named():
    # branch point 1 (profile 3) marked: the two points 2,1 may swap
    assert marked_symmetry([(3,), (2, 1), (2, 1)], ((1, 3),)) == 2
    # branch point 2 marked: nothing to swap
    assert marked_symmetry([(3,), (2, 1), (2, 1)], ((2, 2),)) == 1


def test_legs_over_a_branch_point_with_their_labels():
    legs = ((1, 2), (2, 3), (2, 1), (3, 1))
    assert legs_over(legs, 2) == [(2, 3), (3, 1)]
    assert legs_over(legs, 1) == [(1, 2)]
    assert legs_over(legs, 4) == []


def test_a_point_named_then_marked_in_full_counts_both():
    # 1:2 asks for one point of index 2, then 1 for both: three of the two
    with pytest.raises(MarkError) as info:
        legs_from_specs([(2, 2, 1), (3, 1, 1)], ["1:2", "1"])
    assert str(info.value) == ("marks ask for 3 points of index 2 over branch point 1; "
                               "its profile 2,2,1 has 2")


@pytest.mark.parametrize("spec", [12, None, "1:2:3", "1^2"])
def test_a_mark_that_is_not_text_of_the_form_j_e_c(spec):
    with pytest.raises(MarkError) as info:
        parse_mark(spec)
    assert str(info.value) == f"mark {spec!r} is not J, J:e or J:e^c (J a branch point, e an index, c a count)"


def test_an_unramified_point_cannot_be_marked_in_full():
    with pytest.raises(MarkError) as info:
        legs_from_specs([(2, 2, 1), (1, 1, 1, 1, 1)], ["2"])
    assert str(info.value) == ("mark '2': branch point 2 is unramified (profile 1,1,1,1,1); "
                               "mark its preimages with 2:1 or 2:1^c")
