"""Marked sources against published counts.

Unramified covers of an elliptic curve with a marked point of the target and a
marked preimage of it: a connected cover of degree d with a chosen point over
the base point is the same as a subgroup of index d of pi_1 = Z^2 (deck
transformations act freely on the fibre, so a marked cover has no
automorphism), and there are sigma_1(d) such subgroups (common knowledge:
index-d sublattices of Z^2 are the Hermite normal forms (a b; 0 c) with ac = d,
0 <= b < c).  In covertree's convention the marked number is H * d with the
unmarked H = sigma_1(d)/d, and it must hold over every base stratum.
"""

from __future__ import annotations

from fractions import Fraction

import pytest

from covertree.catalogue.catalogue import build_catalogue
from covertree.hurwitz.problem import HurwitzProblem
from covertree.tallies.types import tally_catalogue


def sigma_1(d: int) -> int:
    return sum(k for k in range(1, d + 1) if d % k == 0)


def sublattices(d: int) -> int:
    # Hermite normal forms (a b; 0 c), ac = d, 0 <= b < c (common knowledge)
    return sum(d // a for a in range(1, d + 1) if d % a == 0)


@pytest.mark.parametrize("d", range(1, 13))
def test_marked_unramified_covers_of_an_elliptic_curve(d):
    problem = HurwitzProblem.build(d, 1, profiles=[",".join(["1"] * d)], marks=["1:1"])
    cat = build_catalogue(problem, max_codim=1)
    assert sigma_1(d) == sublattices(d)
    assert cat.hurwitz_number == sigma_1(d)
    for s in cat.strata:
        assert s.total_weight == sigma_1(d), s.base.graph.notation
    smooth = cat.strata[0]
    # every marked cover over the smooth curve is rigid and lands in Mbar_{1,1}
    assert len(smooth.covers) == sigma_1(d)
    assert {c.automorphisms for c in smooth.covers} == {1}
    assert {c.stable_source.notation for c in smooth.covers} == {"g1{1}"}


@pytest.mark.parametrize("d", [2, 5, 8])
def test_the_type_engine_agrees_on_marked_elliptic_covers(d):
    problem = HurwitzProblem.build(d, 1, profiles=[",".join(["1"] * d)], marks=["1:1"])
    tallies = tally_catalogue(problem, max_codim=1)
    assert [t.total_weight for t in tallies.strata] == [Fraction(sigma_1(d))] * 2


def test_genus_one_source_lands_in_mbar_11():
    # double covers of P^1 branched at 4 points with a marked unramified
    # preimage of a fifth point: the stable model is in Mbar_{1,1} (one vertex
    # of genus 1 with the leg, or the nodal rational curve with the leg)
    problem = HurwitzProblem.build(2, 0, profiles=["2", "2", "2", "2", "1,1"], marks=["5:1"])
    cat = build_catalogue(problem, max_codim=2)
    names = {c.stable_source.notation for s in cat.strata for c in s.covers}
    assert names == {"g1{1}", "g0{1} | 0-0"}
    assert not cat.failures
