"""Profile shapes, families and quantities of the series layer."""

import pytest

from covertree.errors import GraphError, InputError, NotationError, ProblemError
from covertree.series.family import Family, ProfileShape
from covertree.series.quantities import KINDS, Quantity
from covertree.symmetric.partitions import Partition


@pytest.mark.parametrize("text,degree,expected", [
    ("1^*", 3, (1, 1, 1)), ("2,1^*", 2, (2,)), ("d", 5, (5,)), ("d-1,1", 4, (3, 1)),
    ("2^2,1^*", 5, (2, 2, 1)), ("3,1", 4, (3, 1)), ("3,1", 5, None), ("d-3", 3, None), ("2,2", 3, None),
])
def test_shapes_in_each_degree(text, degree, expected):
    got = ProfileShape.parse(text).at(degree)
    assert got == (None if expected is None else Partition(expected))


@pytest.mark.parametrize("text", ["", "x", "1^*,1^*", "2^-1", "d+1"])
def test_bad_shapes_name_the_part(text):
    with pytest.raises(InputError, match="profile shape"):
        ProfileShape.parse(text)


def test_families_have_no_problem_where_no_cover_exists():
    fam = Family(2, 1)
    assert fam.problem(1) is None and fam.problem(3).genus == 2
    free = Family(None, 0, tuple(ProfileShape.parse(x) for x in ("d", "d", "1^*")))
    assert free.problem(3).genus == 0 and free.problem(3).points == 3
    odd = Family(None, 0, (ProfileShape.parse("2,1^*"),) * 3)
    assert odd.problem(4) is None  # odd total ramification: no cover
    with pytest.raises(ProblemError, match="not stable"):
        Family(1, 1).problem(2)
    with pytest.raises(InputError, match="target genus"):
        Family(1, -1)


def test_quantities_check_their_fields():
    with pytest.raises(InputError, match="'nope' is not known"):
        Quantity("nope")
    with pytest.raises(InputError, match="needs stratum"):
        Quantity("total")
    with pytest.raises(InputError, match="takes no source"):
        Quantity("hurwitz", source="g2")
    with pytest.raises(NotationError):
        Quantity("total", stratum="g0{1,2 | 0-0")
    with pytest.raises(GraphError, match="not a stable graph"):
        Quantity("total", stratum="g0{1}, g1 | 0-1")
    assert set(KINDS) == {"hurwitz", "disconnected", "total", "source", "pullback", "locus", "locus_unordered"}


def test_source_weights_add_up_to_the_stratum_total():
    from covertree.hurwitz.problem import HurwitzProblem
    p = HurwitzProblem.build(3, 1, genus=2)
    sources = ["g1 | 0-0", "g0 | 0-0, 0-0", "g1, g1 | 0-1", "g0, g1 | 0-0, 0-1", "g0, g0 | 0-0, 0-1, 1-1",
               "g0, g0 | 0-1^3", "g2"]
    weights = {engine: [Quantity("source", stratum="g0{1,2} | 0-0", source=s, engine=engine).evaluate(p)
                        for s in sources] for engine in ("types", "list")}
    assert weights["types"] == weights["list"]
    assert sum(weights["types"]) == Quantity("total", stratum="g0{1,2} | 0-0").evaluate(p)


def test_pullback_coefficients_need_a_divisor_of_the_source_space():
    from covertree.hurwitz.problem import HurwitzProblem
    p = HurwitzProblem.build(3, 1, genus=2)
    with pytest.raises(InputError, match="not a divisor of Mbar_2"):
        Quantity("pullback", stratum="g0{1,2} | 0-0", coefficient="delta_2").evaluate(p)
    types = Quantity("pullback", stratum="g0{1,2} | 0-0", coefficient="delta_0").evaluate(p)
    listed = Quantity("pullback", stratum="g0{1,2} | 0-0", coefficient="delta_0", engine="list").evaluate(p)
    assert types == listed


def test_locus_coefficients_need_a_basis_class():
    p = Family(2, 1).problem(2)
    with pytest.raises(InputError, match="not a basis class.*allowed: delta_0, delta_1"):
        Quantity("locus", coefficient="lambda").evaluate(p)
    with pytest.raises(InputError, match="needs coefficient"):
        Quantity("locus_unordered")
    with pytest.raises(ProblemError, match="not a divisor"):
        Quantity("locus", coefficient="delta_0").evaluate(Family(2, 1, (ProfileShape.parse("3,1^*"),)).problem(4))
