"""Partitions, cycle types and class sizes (covertree.symmetric.partitions).

Class sizes and centraliser orders are counted over all of ``S_d`` (``d <= 5``)
by brute force; the lists of partitions come from ``tests/independent.py``;
sub-multisets from all subsets of the parts.
"""

from __future__ import annotations

from collections import Counter
from itertools import combinations, permutations

import pytest

from covertree.errors import ProfileError
from covertree.limits import MAX_DEGREE, MAX_DIGITS
from covertree.symmetric.partitions import (
    Partition,
    class_size,
    difference,
    partition_tuples,
    partitions_of,
    simple,
    sub_partitions,
    unramified,
    z,
)
from tests.independent import aut_order, partition_count, partitions


def _cycle_lengths(p: tuple) -> tuple[int, ...]:
    seen, lengths = set(), []
    for start in range(len(p)):
        if start not in seen:
            n, x = 0, start
            while x not in seen:
                seen.add(x)
                x, n = p[x], n + 1
            lengths.append(n)
    return tuple(sorted(lengths, reverse=True))


@pytest.mark.parametrize("d", range(1, 6))
def test_class_sizes_and_centralisers_by_counting(d):
    counts = Counter(_cycle_lengths(p) for p in permutations(range(d)))
    fact = sum(counts.values())
    for mu in partitions(d):
        assert class_size(mu) == counts[mu]
        assert z(mu) * counts[mu] == fact
        assert Partition(mu).aut() == aut_order(mu)


@pytest.mark.parametrize("d", range(0, 13))
def test_partitions_in_reverse_lexicographic_order(d):
    expected = list(partitions(d))
    assert [tuple(p) for p in partitions_of(d)] == expected
    assert list(partition_tuples(d)) == expected
    assert len(expected) == partition_count(d)
    assert all(isinstance(p, Partition) for p in partitions_of(d))


def test_partition_normalises_and_describes_itself():
    mu = Partition([1, 3, 1, 2])
    assert tuple(mu) == (3, 2, 1, 1)
    assert mu.size == 7 and len(mu) == 4
    assert mu.multiplicities() == {3: 1, 2: 1, 1: 2}
    assert mu.aut() == 2
    assert repr(mu) == "Partition(3, 2, 1, 1)" and str(mu) == "3,2,1,1"
    assert Partition([]).size == 0 and str(Partition([])) == "" and Partition([]).aut() == 1
    assert simple(2) == (2,) and simple(5) == (2, 1, 1, 1)
    assert unramified(3) == (1, 1, 1)


@pytest.mark.parametrize("bad", [0, -1, 1.0, True, "2"])
def test_partition_refuses_a_part_that_is_not_positive(bad):
    with pytest.raises(ProfileError, match="not a positive integer"):
        Partition([2, bad])


@pytest.mark.parametrize(
    "text, parts",
    [("3,1", (3, 1)), ("2,1^3", (2, 1, 1, 1)), (" 2 ^ 2 , 1 ", (2, 2, 1)), ("1^1", (1,)),
     ("5", (5,)), ("1,2,3", (3, 2, 1)), ("007", (7,))],
)
def test_parse(text, parts):
    assert tuple(Partition.parse(text)) == parts


@pytest.mark.parametrize(
    "text, message",
    [("3,,1", "profile '3,,1': '' is not a part; write positive integers separated by commas, "
              "e.g. 3,1 or 2,1^3"),
     (" a ", "profile ' a ': 'a' is not a part; write positive integers separated by commas, "
             "e.g. 3,1 or 2,1^3"),
     ("2^", "profile '2^': '2^' is not a part; write positive integers separated by commas, "
            "e.g. 3,1 or 2,1^3"),
     ("-1", "profile '-1': '-1' is not a part; write positive integers separated by commas, "
            "e.g. 3,1 or 2,1^3"),
     ("1.5", "profile '1.5': '1.5' is not a part; write positive integers separated by commas, "
             "e.g. 3,1 or 2,1^3"),
     ("3,0", "profile '3,0': parts must be positive"),
     ("1, 2^0", "profile '1, 2^0': '2^0' repeats a part 0 times; write a^k with k >= 1")],
)
def test_parse_refuses(text, message):
    with pytest.raises(ProfileError) as err:
        Partition.parse(text)
    assert str(err.value) == message


def test_parse_bounds_the_numbers():
    long = "1" * (MAX_DIGITS + 1)
    for text in (long, f"1^{long}"):
        with pytest.raises(ProfileError) as err:
            Partition.parse(text)
        assert str(err.value) == (f"profile {text!r}: a number of {MAX_DIGITS + 1} digits; "
                                  f"at most {MAX_DIGITS} allowed")
    # leading zeros are not significant digits
    assert tuple(Partition.parse("0" * (MAX_DIGITS + 5) + "2")) == (2,)
    # the largest degree itself is allowed, as a part or as a number of parts
    assert Partition.parse(f"{MAX_DEGREE}").size == MAX_DEGREE
    assert len(Partition.parse(f"1^{MAX_DEGREE}")) == MAX_DEGREE
    for text in (f"{MAX_DEGREE + 1}", f"1^{MAX_DEGREE},1", f"2,1^{MAX_DEGREE}"):
        with pytest.raises(ProfileError) as err:
            Partition.parse(text)
        assert str(err.value) == (f"profile {text!r} is larger than the largest degree covertree handles "
                                  f"({MAX_DEGREE}; far smaller ones are refused as infeasible)")
    # a text of 40 characters is shown whole, a longer one by a window of 40
    # characters and its length
    text = "1," * 19 + "y,"
    assert len(text) == 40
    with pytest.raises(ProfileError) as err:
        Partition.parse(text)
    assert str(err.value).startswith(f"profile {text!r}: 'y' is not a part")
    text = "1," * 30 + "x"
    with pytest.raises(ProfileError) as err:
        Partition.parse(text)
    assert str(err.value).startswith(f"profile {text[:40]!r}... (61 characters): 'x' is not a part")


@pytest.mark.parametrize("mu", [(2, 1, 1), (3, 2, 2, 1), (1, 1, 1, 1), (4, 3), ()])
def test_sub_partitions_are_the_sub_multisets(mu):
    for k in range(sum(mu) + 2):
        brute = {tuple(sorted(c, reverse=True)) for r in range(len(mu) + 1)
                 for c in combinations(mu, r) if sum(c) == k}
        found = [tuple(p) for p in sub_partitions(mu, k)]
        assert found == sorted(brute, reverse=True)


def test_difference_removes_a_sub_multiset():
    assert difference((3, 2, 2, 1), (2, 1)) == (3, 2)
    assert difference((2, 1), ()) == (2, 1)
    assert difference((2, 2), (2, 2)) == ()
    with pytest.raises(ProfileError, match=r"\(2, 2\) is not contained in \(2, 1\)"):
        difference((2, 1), (2, 2))
