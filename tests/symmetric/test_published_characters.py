"""Character tables of S_5 and S_6 against the published tables.

The tables below were typed from memory of the published tables (Fulton-Harris,
*Representation Theory: A First Course*, 1991, section 3.1, for S_5; G. James and
A. Kerber, *The Representation Theory of the Symmetric Group*, 1981, appendix I,
for S_6), with rows and columns relabelled by partitions.  The orthogonality
tests in test_characters.py check them independently of this typed copy.
"""

from math import factorial

import pytest

from covertree.symmetric.characters import character, character_table, dimension
from covertree.symmetric.partitions import class_size

# Fulton-Harris 1991, section 3.1 (from memory): columns are the classes of
# 1, (12), (123), (1234), (12345), (12)(34), (12)(345); rows U, U', V, V', W, W',
# Lambda^2 V, which are the irreducibles (5), (1^5), (4,1), (2,1^3), (3,2),
# (2,2,1), (3,1,1).
S5_CLASSES = [(1, 1, 1, 1, 1), (2, 1, 1, 1), (3, 1, 1), (4, 1), (5,), (2, 2, 1), (3, 2)]
S5_CLASS_SIZES = [1, 10, 20, 30, 24, 15, 20]  # the header row of the same table
S5_TABLE = {
    (5,): [1, 1, 1, 1, 1, 1, 1],  # U, trivial
    (1, 1, 1, 1, 1): [1, -1, 1, -1, 1, 1, -1],  # U', alternating
    (4, 1): [4, 2, 1, 0, -1, 0, -1],  # V, standard
    (2, 1, 1, 1): [4, -2, 1, 0, -1, 0, 1],  # V' = V (x) U'
    (3, 2): [5, 1, -1, -1, 0, 1, 1],  # W
    (2, 2, 1): [5, -1, -1, 1, 0, 1, -1],  # W' = W (x) U'
    (3, 1, 1): [6, 0, 0, 0, 1, -2, 0],  # Lambda^2 V
}

# James-Kerber 1981, appendix I, the table of S_6 (from memory), classes as
# cycle types in the order below.
S6_CLASSES = [
    (1, 1, 1, 1, 1, 1),
    (2, 1, 1, 1, 1),
    (2, 2, 1, 1),
    (2, 2, 2),
    (3, 1, 1, 1),
    (3, 2, 1),
    (3, 3),
    (4, 1, 1),
    (4, 2),
    (5, 1),
    (6,),
]
S6_TABLE = {
    (6,): [1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1],
    (5, 1): [5, 3, 1, -1, 2, 0, -1, 1, -1, 0, -1],
    (4, 2): [9, 3, 1, 3, 0, 0, 0, -1, 1, -1, 0],
    (4, 1, 1): [10, 2, -2, -2, 1, -1, 1, 0, 0, 0, 1],
    (3, 3): [5, 1, 1, -3, -1, 1, 2, -1, -1, 0, 0],
    (3, 2, 1): [16, 0, 0, 0, -2, 0, -2, 0, 0, 1, 0],
    (2, 2, 2): [5, -1, 1, 3, -1, -1, 2, 1, -1, 0, 0],
    (3, 1, 1, 1): [10, -2, -2, 2, 1, 1, 1, 0, 0, 0, -1],
    (2, 2, 1, 1): [9, -3, 1, -3, 0, 0, 0, 1, 1, -1, 0],
    (2, 1, 1, 1, 1): [5, -3, 1, 1, 2, 0, -1, -1, -1, 0, 1],
    (1, 1, 1, 1, 1, 1): [1, -1, 1, -1, 1, -1, 1, -1, 1, 1, -1],
}


@pytest.mark.parametrize(
    "classes, table", [(S5_CLASSES, S5_TABLE), (S6_CLASSES, S6_TABLE)], ids=["S5", "S6"]
)
def test_published_table(classes, table):
    d = sum(classes[0])
    parts, computed = character_table(d)
    assert len(table) == len(parts) == len(classes)
    for lam, row in table.items():
        assert [character(lam, mu) for mu in classes] == row, lam
        assert dimension(lam) == row[0]
        i = parts.index(lam)
        assert [computed[i][parts.index(mu)] for mu in classes] == row


def test_s5_class_sizes():
    # Fulton-Harris 1991, section 3.1: the class sizes in the header of the table
    assert [class_size(mu) for mu in S5_CLASSES] == S5_CLASS_SIZES
    assert sum(S5_CLASS_SIZES) == factorial(5)


def test_s6_degrees():
    # degrees 1,1,5,5,5,5,9,9,10,10,16 of S_6 (James-Kerber 1981, appendix I;
    # common knowledge)
    assert sorted(dimension(lam) for lam in S6_TABLE) == [1, 1, 5, 5, 5, 5, 9, 9, 10, 10, 16]
