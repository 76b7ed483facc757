"""The hyperelliptic map Mbar_{0,2G+2} -> Mbar_G on boundary divisors.

Known fact (M. Cornalba and J. Harris, Divisor classes associated to families
of stable varieties, Ann. Sci. ENS 21 (1988); J. Harris and I. Morrison,
Moduli of Curves (1998), section 6C): over a boundary divisor of Mbar_{0,2G+2}
whose points split 2j | 2G+2-2j (even) the double cover degenerates to two
curves meeting in two points (both nodes non-separating), so the divisor goes
to delta_0; over an odd split 2i+1 | 2G+1-2i the double cover is two curves of
genera i and G-i meeting in one point, so it goes to delta_min(i, G-i).

The multiplicities (relative to the degree H = 1/2): 2 over even splits and
1/2 over odd splits (from memory: delta_0 pulls back to twice the sum of the
even boundary divisors and delta_i to half the odd one, the 1/2 being the
ghost automorphism of a separating node with index 2).
"""

from fractions import Fraction

import pytest

from covertree.catalogue.pullback import build_pullback
from covertree.hurwitz.problem import HurwitzProblem


def _split(graph):
    return min(len(legs) for legs in graph.vertex_legs)


@pytest.mark.parametrize("genus", [2, 3, 4])
def test_hyperelliptic_boundary(genus):
    pb = build_pullback(HurwitzProblem.build(2, 0, genus=genus))
    assert pb.hurwitz_number == Fraction(1, 2)
    assert len(pb.rows) == genus  # splits 2..G+1 points on the smaller side
    for r in pb.rows:
        k = _split(r.base.graph)
        nonzero = {d: c for d, c in r.coefficients.items() if c}
        if k % 2 == 0:
            assert nonzero == {"delta_0": 2 * pb.hurwitz_number}
        else:
            i = (k - 1) // 2
            assert nonzero == {f"delta_{min(i, genus - i)}": pb.hurwitz_number / 2}
