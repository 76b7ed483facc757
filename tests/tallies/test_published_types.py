"""The type engine against published generating functions: covers of an
elliptic curve with simple branching, every boundary stratum of codimension at
most one (each stratum's total is the Hurwitz number by the degeneration
identity, so each must equal the published coefficient).

Convention: labelled branch points, weight 1/|Aut|, unlabelled preimages
(docs/theory.md, section 4), the convention of the sequences below.
"""


import pytest

from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import tally_catalogue
from tests.quasimodular import f2_coefficients, f3_coefficients


@pytest.mark.parametrize("d", [*range(2, 15), 16, 20])
def test_genus_two_covers_of_an_elliptic_curve(d):
    # Dijkgraaf 1995 / OEIS A170991: H = 2 [q^d] F_2, over every stratum of
    # Mbar_{1,2} of codimension <= 1
    expected = 2 * f2_coefficients(d + 1)[d]
    tallies = tally_catalogue(HurwitzProblem.build(d, 1, genus=2), max_codim=1)
    assert len(tallies.strata) == 3
    assert [t.total_weight for t in tallies.strata] == [expected] * 3


@pytest.mark.parametrize("d", range(2, 8))
def test_genus_three_covers_of_an_elliptic_curve(d):
    # OEIS A170992: H = [q^d] of the generating function in its formula entry
    # (R. Visser 2023; terms from Roth-Yui 2010), over every stratum of Mbar_{1,4} (orbits) of codimension <= 1
    expected = f3_coefficients(d + 1)[d]
    tallies = tally_catalogue(HurwitzProblem.build(d, 1, genus=3), max_codim=1)
    assert len(tallies.strata) == 5
    assert [t.total_weight for t in tallies.strata] == [expected] * len(tallies.strata)
