"""Hurwitz problems (covertree.hurwitz.problem): Riemann-Hurwitz refusals in
one line naming the data, and the JSON shape of a problem."""

from __future__ import annotations

import pytest

from covertree.errors import ProblemError
from covertree.hurwitz.problem import HurwitzProblem


@pytest.mark.parametrize("kwargs, message", [
    # 2g - 2 = 3(-2) + 1: odd
    (dict(degree=3, target_genus=0, profiles=["2,1"]),
     "Riemann-Hurwitz gives genus -3/2 for degree 3, target genus 0 and profiles (2,1): "
     "the total ramification must be even"),
    # 2g - 2 = -2 < 2(0) + 0 for a double cover of an elliptic curve
    (dict(degree=2, target_genus=1, genus=0),
     "genus 0 is too small for degree 2, target genus 1 and profiles (none): their total "
     "ramification 0 exceeds the -2 that Riemann-Hurwitz allows"),
    # three 3-cycles over P^1 give genus 1, not 0
    (dict(degree=3, target_genus=0, genus=0, profiles=["3", "3", "3"]),
     "genus 0 is too small for degree 3, target genus 0 and profiles (3) (3) (3): their total "
     "ramification 6 exceeds the 4 that Riemann-Hurwitz allows"),
])
def test_riemann_hurwitz_refusals_name_the_data(kwargs, message):
    with pytest.raises(ProblemError) as err:
        HurwitzProblem.build(**kwargs)
    assert str(err.value) == message


def test_json_shape_of_a_problem():
    # three 3-cycles over P^1: 2g - 2 = -6 + 6, genus 1
    p = HurwitzProblem.build(3, 0, profiles=["3", "3", "3"])
    assert p.to_dict() == {"genus": 1, "target_genus": 0, "degree": 3, "profiles": [[3], [3], [3]]}
