"""Catalogues worked out by hand, compared with the engine exactly.

Each list below was computed by hand in the model of docs/theory.md, section 5 before
being compared: local monodromy at each base component, the gluings of node
preimages up to the relabelling groups, |Aut| as the stabiliser, mult as the
product of the ramification indices over the nodes.  A cover is written
(edge profiles in the base's edge order, source, stable source, name, |Aut|, mult).
"""

from __future__ import annotations

from collections import Counter
from fractions import Fraction

from covertree.catalogue.catalogue import build_catalogue
from covertree.catalogue.covers import stratum_covers
from covertree.graphs.notation import parse_graph
from covertree.hurwitz.problem import HurwitzProblem


def listing(base_text: str, degree: int, profiles) -> Counter:
    base = parse_graph(base_text)
    return Counter(
        (c.edge_profiles, c.source.notation, c.stable_source.notation, c.stable_source_name,
         c.automorphisms, c.multiplicity)
        for c in stratum_covers(base, degree, profiles)
    )


# ----------------------------------------------------------------- degree 2 over E, two branch points
#
# Target: an elliptic curve E with branch points 1, 2; source genus 2
# (Riemann-Hurwitz: 2g - 2 = 0 + 2).  S_2 is abelian, so a local cover is just
# its tuple of permutations, and every connected local cover of degree 2 has
# deck group S_2.
SIMPLE2 = [(2,), (2,)]


def test_smooth_elliptic_base():
    # g1{1,2}: (a, b) in S_2 x S_2 free, s_1 = s_2 = (12): 4 covers, each a
    # smooth genus-2 curve C with its deck involution:
    #     C (g2)  --2:1-->  E        |Aut| = 2, mult = 1 (no nodes), weight 1/2
    # total 4 * 1/2 = 2
    assert listing("g1{1,2}", 2, SIMPLE2) == Counter({((), "g2", "g2", None, 2, 1): 4})


def test_irreducible_nodal_base():
    # g0{1,2} | 0-0: a rational curve R with its points x, y glued.  At R:
    # s_1 s_2 s_x s_y = 1 with s_1 = s_2 = (12), so s_x = s_y^-1.
    # (a) s_x = s_y = 1: a rational double cover P of R, preimages x1, x2, y1, y2;
    #     the glue x1~y1, x2~y2 and the glue x1~y2, x2~y1 are not related by the
    #     deck involution (it swaps x1<->x2 and y1<->y2 together): two covers,
    #        P (g0) with two self-nodes:  g0 | 0-0^2   (already stable)
    #     |Aut| = 2, mult = 1*1 = 1 each.
    # (b) s_x = s_y = (12): an elliptic double cover Q of R, one point over x,
    #     one over y, glued:  Q (g1) with one self-node:  g1 | 0-0 = delta_0,
    #     |Aut| = 2, mult = 2.
    # total 1/2 + 1/2 + 1 = 2
    assert listing("g0{1,2} | 0-0", 2, SIMPLE2) == Counter({
        (((1, 1),), "g0 | 0-0^2", "g0 | 0-0^2", None, 2, 1): 2,
        (((2,),), "g1 | 0-0", "g1 | 0-0", "delta_0", 2, 2): 1,
    })


def test_elliptic_tail_base():
    # g0{1,2}, g1 | 0-1: a rational R with both points, attached to an elliptic E0.
    # Over R: s_x = (s_1 s_2)^-1 = 1, so a rational double cover P with two
    # points over the node.  Over E0: [a, b] s_y = 1 with s_y = 1: unramified.
    # (a) E0' connected (3 choices of (a, b) != (1, 1)): P meets the genus-1 E0'
    #     in two points: g0, g1 | 0-1^2.  The two glues are swapped by the deck
    #     involution of P alone: one orbit under S_2 x S_2, |Aut| = 2, mult 1.
    #     P is a rational bridge: stable source g1 | 0-0 = delta_0.
    # (b) E0 ⊔ E0 (two sheets, disconnected): P meets each copy once:
    #     g0, g1, g1 | 0-1, 0-2; |Aut| = 2 (deck of P with the swap of copies),
    #     mult 1; P is a bridge between the copies: g1, g1 | 0-1 = delta_1.
    # total 3 * 1/2 + 1/2 = 2
    assert listing("g0{1,2}, g1 | 0-1", 2, SIMPLE2) == Counter({
        (((1, 1),), "g0, g1 | 0-1^2", "g1 | 0-0", "delta_0", 2, 1): 3,
        (((1, 1),), "g0, g1, g1 | 0-1, 0-2", "g1, g1 | 0-1", "delta_1", 2, 1): 1,
    })


def test_rational_bubble_on_nodal_rational_base():
    # g0{1,2}, g0 | 0-1, 1-1: R (legs 1, 2) attached at z to a rational N0 whose
    # points y1, y2 are glued (a loop).  Over R as before: P with two points over z.
    # Over N0: s_z = 1, so s_y1 = s_y2^-1.
    # (a) s_y = (12): N rational double cover, one point over y1 and one over y2,
    #     glued; P meets N twice:  g0, g0 | 0-1^2, 1-1 with |Aut| = 2, mult = 1*1*2 = 2;
    #     P is a bridge, it becomes a second loop on N: g0 | 0-0^2.
    # (b) s_y = 1: two sheets N1, N2 (degree 1 each), each meeting P once.  The
    #     loop glues y1-points to y2-points: N1~N1, N2~N2 (two self-nodes) or
    #     N1~N2, N2~N1 (two nodes between them); the swap of sheets keeps each:
    #       g0, g0, g0 | 0-1, 0-2, 1-1, 2-2 -> (P contracted) g0, g0 | 0-0, 0-1, 1-1
    #       g0, g0, g0 | 0-1, 0-2, 1-2^2    -> (P contracted) g0, g0 | 0-1^3
    #     each |Aut| = 2, mult = 1.
    # total 1 + 1/2 + 1/2 = 2
    base = parse_graph("g0{1,2}, g0 | 0-1, 1-1")
    loop = next(k for k, (a, b) in enumerate(base.nodes) if a == b)

    def profiles(at_loop, at_bridge):
        out = [None, None]
        out[loop], out[1 - loop] = at_loop, at_bridge
        return tuple(out)

    assert listing(base.notation, 2, SIMPLE2) == Counter({
        (profiles((2,), (1, 1)), "g0, g0 | 0-1^2, 1-1", "g0 | 0-0^2", None, 2, 2): 1,
        (profiles((1, 1), (1, 1)), "g0, g0, g0 | 0-1, 0-2, 1-1, 2-2", "g0, g0 | 0-0, 0-1, 1-1", None, 2, 1): 1,
        (profiles((1, 1), (1, 1)), "g0, g0, g0 | 0-1, 0-2, 1-2^2", "g0, g0 | 0-1^3", None, 2, 1): 1,
    })


def test_two_rational_components_meeting_twice():
    # g0{1}, g0{2} | 0-1^2: components A0 (leg 1), B0 (leg 2), nodes q1, q2.
    # At each component s_leg s_q1 s_q2 = 1 with s_leg = (12): exactly one of the
    # nodes is ramified.  Balancing: the same node on both sides.
    # Ramified at q1: rational double covers A, B, one point each over q1
    # (glued), two each over q2 (two glues, swapped by the deck of A alone):
    #     A, B meeting in three points: g0, g0 | 0-1^3 (stable), |Aut| 2, mult 2.
    # Ramified at q2: the same with q1 and q2 exchanged (a different cover over
    # the fixed base curve, whose nodes are distinct points).
    # total 1 + 1 = 2
    assert listing("g0{1}, g0{2} | 0-1^2", 2, SIMPLE2) == Counter({
        (((2,), (1, 1)), "g0, g0 | 0-1^3", "g0, g0 | 0-1^3", None, 2, 2): 1,
        (((1, 1), (2,)), "g0, g0 | 0-1^3", "g0, g0 | 0-1^3", None, 2, 2): 1,
    })


def test_the_five_strata_of_mbar_1_2_are_all_listed():
    # Mbar_{1,2} has 5 strata (by hand); each total is
    # H = 2 = 2 [q^2] F_2 (Dijkgraaf 1995; OEIS A170991)
    cat = build_catalogue(HurwitzProblem.build(2, 1, genus=2), max_codim=2, labeled=True)
    # the numbers of covers of the five hand lists above
    assert {s.base.graph.notation: len(s.covers) for s in cat.strata} == {
        "g1{1,2}": 4, "g0{1,2} | 0-0": 3, "g0{1,2}, g1 | 0-1": 4, "g0, g0{1,2} | 0-0, 0-1": 3,
        "g0{1}, g0{2} | 0-1^2": 2,
    }
    assert all(s.total_weight == 2 for s in cat.strata)


# ----------------------------------------------------------------- hyperelliptic genus 2 over P^1
#
# Six simple branch points on P^1, degree 2: the hyperelliptic genus-2 curves,
# H = 1/2 (one cover, the hyperelliptic involution).  Boundary divisors of
# Mbar_{0,6}: the splits 2|4 (15 of them) and 3|3 (10), 2^5 - 6 - 1 = 25 in all
# (classical, common knowledge).
SIMPLE6 = [(2,)] * 6


def test_two_four_split():
    # g0{1,2}, g0{3,4,5,6} | 0-1: the product of the two branch points on the small
    # side is trivial, so the node is unramified.  Small side: a rational double
    # cover P (two points over the node).  Large side: an elliptic double cover E
    # branched at 4 points (two points over the node).  P meets E twice (one
    # orbit of glues), |Aut| = 2, mult 1; P is a bridge, E gets a loop: delta_0.
    # total 1/2 = H
    assert listing("g0{1,2}, g0{3,4,5,6} | 0-1", 2, SIMPLE6) == Counter({
        (((1, 1),), "g0, g1 | 0-1^2", "g1 | 0-0", "delta_0", 2, 1): 1,
    })


def test_three_three_split():
    # g0{1,2,3}, g0{4,5,6} | 0-1: three branch points on each side, so the node is
    # a branch point of both sides: two elliptic curves E1, E2 (double covers
    # branched at 4 points), one point each over the node, glued.  The two
    # involutions act independently: |Aut| = 4; mult 2.  delta_1, weight 1/2 = H.
    assert listing("g0{1,2,3}, g0{4,5,6} | 0-1", 2, SIMPLE6) == Counter({
        (((2,),), "g1, g1 | 0-1", "g1, g1 | 0-1", "delta_1", 4, 2): 1,
    })


def test_every_labelled_divisor_of_mbar_0_6():
    # the same hand lists for all 25 labelled divisors: 15 land in delta_0, 10 in delta_1
    cat = build_catalogue(HurwitzProblem.build(2, 0, genus=2), max_codim=1, labeled=True)
    divisors = [s for s in cat.strata if s.base.codim == 1]
    assert len(divisors) == 2**5 - 6 - 1
    names = Counter(c.stable_source_name for s in divisors for c in s.covers)
    assert names == Counter({"delta_0": 15, "delta_1": 10})
    assert all(len(s.covers) == 1 and s.total_weight == Fraction(1, 2) for s in divisors)
