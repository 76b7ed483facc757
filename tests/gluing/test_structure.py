"""The canonical code of a glued structure: invariant under relabelling, complete.

Glued structures are taken from the engine's own enumeration (every connected
port matching of every balanced choice of local covers) and then relabelled:
the list of pieces is permuted, each piece's sheets are relabelled by a deck
transformation (which permutes its ports), and pieces over base vertices other
than the least one are conjugated by an arbitrary permutation of their sheets
(their cycles, hence their ports, renumbered).  Each is an isomorphic cover, so
the code and ``|Aut|`` must not change.
"""

from __future__ import annotations

import random
from collections import Counter

import pytest

from covertree.gluing.covers import _Matcher, balanced_choices, glued_covers
from covertree.gluing.structure import Glued, canonical_code
from covertree.graphs.notation import parse_graph
from covertree.monodromy.local import special_points
from covertree.monodromy.pieces import Piece
from covertree.symmetric.permutations import compose, inverse

CASES = [
    # (base, degree, profiles)
    ("g0{1,2} | 0-0", 2, [(2,), (2,)]),
    ("g0{1,2}, g1 | 0-1", 3, [(2, 1), (2, 1)]),
    ("g0, g0{1,2} | 0-0, 0-1", 3, [(2, 1), (2, 1)]),
    ("g0{1}, g0{2} | 0-1^2", 4, [(2, 1, 1), (2, 1, 1)]),
    ("g0{1,2}, g0{3,4} | 0-1", 3, [(2, 1)] * 4),
    ("g0{1,2}, g0{3,4} | 0-1^2", 4, [(3, 1), (2, 2), (2, 1, 1), (2, 1, 1)]),
    ("g1 | 0-0", 3, []),
    ("g0{1} | 0-0", 4, [(2, 2)]),
]


def structures(base_text, degree, profiles):
    """(Glued copy, code, |Aut|) for every connected matching the engine visits."""
    base = parse_graph(base_text)
    specs = special_points(base)
    for choice in balanced_choices(base, degree, profiles):
        m = _Matcher(base, specs, choice)
        for partner in m.matchings():
            if not m.connected():
                continue
            glued = Glued(list(m.vertex), list(m.pieces), [list(h) for h in m.halves], dict(partner))
            code, aut = canonical_code(glued)
            yield glued, code, aut


def _conjugate(piece: Piece, sigma) -> Piece:
    """The piece with sheet ``i`` renamed ``sigma[i]``."""
    sigma_inv = inverse(sigma)
    gens = tuple(compose(sigma_inv, p, sigma) for p in piece.gens)
    cent = tuple(compose(sigma_inv, c, sigma) for c in piece.centraliser)
    return Piece(piece.degree, piece.handles, gens, cent)


def relabelled(glued: Glued, rng: random.Random) -> Glued:
    n = len(glued.pieces)
    least = min(glued.vertex)
    # sheet relabellings: a deck transformation over the least vertex (keeps the
    # piece's normal form), anything over the other vertices
    sigmas, pieces = [], []
    for i, piece in enumerate(glued.pieces):
        if glued.vertex[i] == least:
            sigma = rng.choice(piece.centraliser)
        else:
            s = list(range(piece.degree))
            rng.shuffle(s)
            sigma = tuple(s)
        sigmas.append(sigma)
        pieces.append(_conjugate(piece, sigma) if glued.vertex[i] != least else piece)
    order = list(range(n))
    rng.shuffle(order)  # new position of old piece i is order[i]
    new_vertex = [0] * n
    new_pieces = [None] * n
    new_halves = [None] * n
    for i in range(n):
        new_vertex[order[i]] = glued.vertex[i]
        new_pieces[order[i]] = pieces[i]
        new_halves[order[i]] = list(glued.halves[i])
    target = Glued(new_vertex, new_pieces, new_halves, {})

    def move(port):
        i, p, c = port
        image = {sigmas[i][x] for x in glued.port_cycles[i][p][c]}
        new_cycles = target.port_cycles[order[i]][p]
        [c2] = [k for k, cyc in enumerate(new_cycles) if set(cyc) == image]
        return (order[i], p, c2)

    target.partner = {move(a): move(b) for a, b in glued.partner.items()}
    return target


@pytest.mark.parametrize("case", CASES, ids=[c[0] for c in CASES])
def test_code_and_aut_invariant_under_relabelling(case):
    rng = random.Random(20240601)
    seen = 0
    for glued, code, aut in structures(*case):
        for _ in range(3):
            other = relabelled(glued, rng)
            assert canonical_code(other) == (code, aut)
        seen += 1
    assert seen


def test_conjugation_moves_ports():
    # the relabelling really changes the data: a non-trivial conjugation of a
    # degree-3 piece renumbers its cycles or permutations
    rng = random.Random(1)
    changed = 0
    for glued, _code, _aut in structures("g0{1,2}, g1 | 0-1", 3, [(2, 1), (2, 1)]):
        other = relabelled(glued, rng)
        changed += other.partner != glued.partner or [p.gens for p in other.pieces] != [p.gens for p in glued.pieces]
    assert changed


@pytest.mark.parametrize("case", CASES, ids=[c[0] for c in CASES])
def test_codes_of_listed_covers_are_distinct(case):
    base_text, degree, profiles = case
    covers = list(glued_covers(parse_graph(base_text), degree, profiles))
    codes = Counter(c.code for c in covers)
    assert all(n == 1 for n in codes.values())
    # every matching visited has the code of one listed cover, with its |Aut|
    aut_of = {c.code: c.automorphisms for c in covers}
    for _glued, code, aut in structures(*case):
        assert aut_of[code] == aut


def test_hand_built_structure():
    # two rational double covers A (over vertex 0) and B (over vertex 1), each
    # branched at the node, glued at their single ramified node preimages and at
    # the two unramified ones: A and B meet in three points.  Aut: the deck
    # involution of A and that of B must agree on the glued unramified points,
    # so |Aut| = 2 (the two involutions together).
    base = parse_graph("g0{1}, g0{2} | 0-1^2")
    a = Piece(2, 0, ((1, 0), (1, 0), (0, 1)), ((0, 1), (1, 0)))  # s_leg, s_q1, s_q2
    b = Piece(2, 0, ((1, 0), (1, 0), (0, 1)), ((0, 1), (1, 0)))
    # special points at each vertex: the leg (index 0), then halves 1, 2
    glued = Glued([0, 1], [a, b], [[1, 2], [1, 2]], {})
    pairs = [((0, 1, 0), (1, 1, 0)), ((0, 2, 0), (1, 2, 0)), ((0, 2, 1), (1, 2, 1))]
    glued.partner = {x: y for p, q in pairs for x, y in ((p, q), (q, p))}
    assert base.n_nodes == 2
    code, aut = canonical_code(glued)
    assert aut == 2
    crossed = Glued([0, 1], [a, b], [[1, 2], [1, 2]], {})
    pairs = [((0, 1, 0), (1, 1, 0)), ((0, 2, 0), (1, 2, 1)), ((0, 2, 1), (1, 2, 0))]
    crossed.partner = {x: y for p, q in pairs for x, y in ((p, q), (q, p))}
    # crossing the unramified glues is the deck involution of B: the same cover
    assert canonical_code(crossed) == (code, aut)
