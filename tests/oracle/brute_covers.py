"""Brute-force enumeration of admissible covers over a fixed base curve.

This module is a test oracle: it lists, by labelled brute force, every admissible
cover with connected source over a fixed curve of a given base stratum, in the
combinatorial model of docs/theory.md, section 5, and is deliberately independent of
the enumeration engine (it imports nothing from ``covertree.monodromy``,
``covertree.gluing`` or ``covertree.catalogue``; only the permutation and
partition helpers).

The model
---------
At base vertex ``v`` the special points are ordered: the legs in increasing label
order, then the half-edges, edge by edge in the given edge order, for edge
``k = (u, w)`` first the half-edge at ``u`` and then the one at ``w`` (a loop puts
both at the same vertex).  A *labelled datum* is

* at every vertex a local tuple ``(a_1, b_1, ..., a_h, b_h, s_p ...)`` in ``S_d``
  with ``[a_1, b_1] ... [a_h, b_h] * prod_p s_p = 1`` (left-to-right products) and
  ``s_p`` of the leg's profile at each leg;
* at every edge with half-edges ``x`` (at ``u``) and ``y`` (at ``w``), equal cycle
  types of ``s_x`` and ``s_y`` and a length-preserving bijection ``beta_e`` from the
  cycles of ``s_x`` to those of ``s_y``.

``prod_v S_d`` acts: ``sigma = (sigma_v)`` relabels sheet ``i`` over ``v`` as
``sigma_v[i]``, so every ``p`` in the tuple at ``v`` becomes
``sigma_v^-1 p sigma_v`` (left to right: the new ``p'`` has
``p'[sigma_v[i]] == sigma_v[p[i]]``), and a cycle ``C`` of ``s_x`` becomes
``sigma_u(C)``, so ``beta_e`` becomes ``sigma_w o beta_e o sigma_u^-1``.
A cover is an orbit; ``|Aut f|`` is the order of the stabiliser.

Two ways of computing the orbits
--------------------------------
``method="full"``: every labelled datum is listed and the orbits are found by a
breadth-first search over the generators of ``prod_v S_d`` (adjacent
transpositions at each vertex); ``|Aut| = (d!)^V / |orbit|``.  Literal, but the
number of labelled data is about ``(d!)^V`` times the answer, so it is only for
small cases.

``method="reduced"`` (the default): the same orbits through a transversal.
Write ``T_v`` for the labelled local tuples at ``v``.  First ``T_v`` is listed in
full and split into ``S_d``-conjugacy classes by applying every element of
``S_d``; each class gets a representative ``r_v`` and its centraliser ``C_v``
(every ``sigma`` with ``r_v^sigma = r_v``, found by trying all of ``S_d``; the code
asserts ``|class| * |C_v| = d!``).  Claim: the ``prod_v S_d``-orbits of labelled
data are in bijection with the ``prod_v C_v``-orbits on the *fibres*
``F(r) = {data whose local tuples are exactly r = (r_v)}``, over all choices of
representatives, with the same stabilisers.  Proof: every orbit meets some
``F(r)``, because ``sigma_v`` can move the tuple at ``v`` to its representative
independently at each vertex, and it meets only one ``F(r)`` since the local
tuples' classes are invariants.  Two data ``D, D'`` in ``F(r)`` with
``sigma D = D'`` have ``r_v^{sigma_v} = r_v`` for all ``v``, i.e.
``sigma`` lies in ``prod_v C_v``; so the orbit of ``D`` meets ``F(r)`` in exactly
its ``prod_v C_v``-orbit.  Likewise the stabiliser of ``D`` in ``prod_v S_d`` fixes
every ``r_v`` and so lies in ``prod_v C_v``: it *is* the stabiliser there.  Within a
fibre all bijections are listed and the orbits are found by applying every element
of ``prod_v C_v``.  No canonical generation and no splitting into connected
pieces is used; the tests check that both methods give the same list.

Examples
--------
>>> covers = brute_force_covers(2, [0], [], [[1, 2, 3, 4]], [(2,)] * 4)
>>> [(c.source_genera, c.automorphisms, c.multiplicity) for c in covers]
[((1,), 2, 1)]
>>> total_weight(covers)
Fraction(1, 2)
"""

from __future__ import annotations

import itertools
from collections import deque
from collections.abc import Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from math import factorial

from covertree.symmetric.permutations import (
    Perm,
    commutator,
    compose,
    cycle_type,
    cycles,
    identity,
    inverse,
    orbits,
)

__all__ = ["BruteCover", "brute_force_covers", "total_weight", "source_genus"]


@dataclass(frozen=True)
class BruteCover:
    """One admissible cover (an orbit of labelled data).

    ``edge_profiles[k]`` is the cycle type of ``s_x`` at the first half-edge of
    base edge ``k``; component ``i`` of the source has genus ``source_genera[i]``,
    lies over base vertex ``source_vertices[i]`` with degree ``source_degrees[i]``;
    ``source_edges[j]`` joins two components (the first over ``u``, the second over
    ``w``) and lies over base edge ``source_edge_over[j]``, with ramification index
    ``source_edge_index[j]`` (the length of its cycle).  The last four fields
    are extra information for matching covers; ``key()`` is an isomorphism
    invariant of the whole cover.
    """

    edge_profiles: tuple[tuple[int, ...], ...]
    source_genera: tuple[int, ...]
    source_edges: tuple[tuple[int, int], ...]
    automorphisms: int
    multiplicity: int
    source_vertices: tuple[int, ...] = field(default=(), compare=False)
    source_degrees: tuple[int, ...] = field(default=(), compare=False)
    source_edge_over: tuple[int, ...] = field(default=(), compare=False)
    source_edge_index: tuple[int, ...] = field(default=(), compare=False)

    @property
    def weight(self) -> Fraction:
        """``multiplicity / automorphisms``."""
        return Fraction(self.multiplicity, self.automorphisms)

    @property
    def arithmetic_genus(self) -> int:
        """``sum g_c + E - V + 1`` of the source."""
        return sum(self.source_genera) + len(self.source_edges) - len(self.source_genera) + 1

    def key(self) -> tuple:
        """A canonical form of the cover's shape: edge profiles, |Aut|, multiplicity
        and the source graph over the base graph (components labelled by base
        vertex, degree and genus; edges by the base edge they lie over), minimised
        by brute force over all relabellings of components that keep those labels.
        Isomorphic covers have equal keys (different covers may share one).
        """
        n = len(self.source_genera)
        labels = [
            (self.source_vertices[i], self.source_degrees[i], self.source_genera[i])
            for i in range(n)
        ]
        blocks: dict[tuple, list[int]] = {}
        for i, lab in enumerate(labels):
            blocks.setdefault(lab, []).append(i)
        block_keys = sorted(blocks)
        best = None
        for choice in itertools.product(
            *(itertools.permutations(range(len(blocks[b]))) for b in block_keys)
        ):
            new = [0] * n
            offset = 0
            for b, perm in zip(block_keys, choice):
                for pos, i in enumerate(blocks[b]):
                    new[i] = offset + perm[pos]
                offset += len(blocks[b])
            edges = tuple(
                sorted((k, new[a], new[b]) for k, (a, b) in zip(self.source_edge_over, self.source_edges))
            )
            if best is None or edges < best:
                best = edges
        graph = (tuple(b for b in block_keys for _ in blocks[b]), best)
        return (self.edge_profiles, self.automorphisms, self.multiplicity, graph)


def total_weight(covers: Sequence[BruteCover]) -> Fraction:
    """``sum multiplicity / automorphisms`` (exact)."""
    return sum((Fraction(c.multiplicity, c.automorphisms) for c in covers), Fraction(0))


def source_genus(degree: int, base_genus: int, profiles: Sequence[Sequence[int]]) -> int:
    """Riemann–Hurwitz: ``2g - 2 = d(2h - 2) + sum_j (d - len(mu_j))``."""
    twice = degree * (2 * base_genus - 2) + sum(degree - len(mu) for mu in profiles) + 2
    if twice % 2:
        raise ValueError("Riemann–Hurwitz gives a half-integral genus")
    return twice // 2


# ----------------------------------------------------------------- helpers


def _all_perms(d: int) -> list[Perm]:
    return list(itertools.permutations(range(d)))


def _conj(p: Perm, s: Perm, s_inv: Perm) -> Perm:
    """``s^-1 p s`` left to right: the relabelling of ``p`` by ``s``."""
    return compose(s_inv, p, s)


def _conj_tuple(t: tuple[Perm, ...], s: Perm) -> tuple[Perm, ...]:
    s_inv = inverse(s)
    return tuple(_conj(p, s, s_inv) for p in t)


def _cycle_sets(p: Perm) -> list[frozenset[int]]:
    return [frozenset(c) for c in cycles(p)]


def _bijections(cx: list[frozenset[int]], cy: list[frozenset[int]]) -> list[frozenset]:
    """All length-preserving bijections from the cycles ``cx`` to ``cy``, each as a
    frozenset of pairs ``(C, beta(C))``."""
    by_len_x: dict[int, list[frozenset[int]]] = {}
    by_len_y: dict[int, list[frozenset[int]]] = {}
    for c in cx:
        by_len_x.setdefault(len(c), []).append(c)
    for c in cy:
        by_len_y.setdefault(len(c), []).append(c)
    if {k: len(v) for k, v in by_len_x.items()} != {k: len(v) for k, v in by_len_y.items()}:
        return []
    lengths = sorted(by_len_x)
    out = []
    for choice in itertools.product(
        *(itertools.permutations(by_len_y[length]) for length in lengths)
    ):
        pairs = []
        for length, image in zip(lengths, choice):
            pairs.extend(zip(by_len_x[length], image))
        out.append(frozenset(pairs))
    return out


def _transport(beta: frozenset, su: Perm, sw: Perm) -> frozenset:
    return frozenset(
        (frozenset(su[i] for i in c), frozenset(sw[i] for i in b)) for c, b in beta
    )


class _Setup:
    """Validated input and the ordering of special points at every vertex."""

    def __init__(self, degree, genera, edges, legs, profiles):
        if degree < 1:
            raise ValueError("degree must be positive")
        self.d = degree
        self.genera = [int(h) for h in genera]
        self.V = len(self.genera)
        if len(legs) != self.V:
            raise ValueError("legs must have one entry per vertex")
        self.edges = [tuple(e) for e in edges]
        for u, w in self.edges:
            if not (0 <= u < self.V and 0 <= w < self.V):
                raise ValueError(f"edge {(u, w)} has an end outside the vertices")
        self.profiles = [tuple(sorted(mu, reverse=True)) for mu in profiles]
        for mu in self.profiles:
            if sum(mu) != degree or any(m <= 0 for m in mu):
                raise ValueError(f"profile {mu} is not a partition of {degree}")
        labels = sorted(j for lv in legs for j in lv)
        if labels != list(range(1, len(self.profiles) + 1)):
            raise ValueError("leg labels must be exactly 1..b, once each")
        # special points at each vertex: ("leg", j) or ("half", k, side)
        self.points: list[list[tuple]] = [[("leg", j) for j in sorted(legs[v])] for v in range(self.V)]
        self.half_index: list[tuple[int, int]] = []  # edge k -> (index at u, index at w)
        for k, (u, w) in enumerate(self.edges):
            self.points[u].append(("half", k, 0))
            iu = len(self.points[u]) - 1
            self.points[w].append(("half", k, 1))
            iw = len(self.points[w]) - 1
            self.half_index.append((iu, iw))
        self.base_genus = sum(self.genera) + len(self.edges) - self.V + 1
        if self.V and not self._connected():
            raise ValueError("the base graph is not connected")
        self.g = source_genus(degree, self.base_genus, self.profiles)

    def _connected(self) -> bool:
        seen = {0}
        todo = [0]
        while todo:
            v = todo.pop()
            for u, w in self.edges:
                for a, b in ((u, w), (w, u)):
                    if a == v and b not in seen:
                        seen.add(b)
                        todo.append(b)
        return len(seen) == self.V

    def local_tuples(self, v: int) -> list[tuple[Perm, ...]]:
        """Every labelled local tuple at ``v`` (brute force over ``S_d``)."""
        d, h = self.d, self.genera[v]
        perms = _all_perms(d)
        by_type: dict[tuple[int, ...], list[Perm]] = {}
        for p in perms:
            by_type.setdefault(cycle_type(p), []).append(p)
        pts = self.points[v]
        ident = identity(d)
        if not pts:
            # no special point: the relation is on the commutators alone
            out = []
            for ab in itertools.product(perms, repeat=2 * h):
                prodc = ident
                for i in range(h):
                    prodc = compose(prodc, commutator(ab[2 * i], ab[2 * i + 1]))
                if prodc == ident:
                    out.append(tuple(ab))
            return out
        choices = []
        for pt in pts[:-1]:
            choices.append(by_type.get(self.profiles[pt[1] - 1], []) if pt[0] == "leg" else perms)
        last = pts[-1]
        last_type = self.profiles[last[1] - 1] if last[0] == "leg" else None
        out = []
        for ab in itertools.product(perms, repeat=2 * h):
            prodc = ident
            for i in range(h):
                prodc = compose(prodc, commutator(ab[2 * i], ab[2 * i + 1]))
            for ss in itertools.product(*choices):
                s_last = inverse(compose(prodc, *ss))
                if last_type is not None and cycle_type(s_last) != last_type:
                    continue
                t = tuple(ab) + tuple(ss) + (s_last,)
                # the relation, checked literally once more
                assert compose(prodc, *ss, s_last) == ident
                out.append(t)
        return out

    def s(self, t: tuple[Perm, ...], v: int, index: int) -> Perm:
        return t[2 * self.genera[v] + index]

    def edge_cycles(self, tuples, k):
        u, w = self.edges[k]
        iu, iw = self.half_index[k]
        return _cycle_sets(self.s(tuples[u], u, iu)), _cycle_sets(self.s(tuples[w], w, iw))

    def build(self, tuples, betas, aut: int) -> BruteCover | None:
        """The cover of a labelled datum, or ``None`` when the source is disconnected."""
        d = self.d
        comp_of: dict[tuple[int, int], int] = {}
        genera: list[int] = []
        verts: list[int] = []
        degrees: list[int] = []
        for v in range(self.V):
            t = tuples[v]
            h = self.genera[v]
            s_list = t[2 * h:]
            for orb in orbits(d, t):
                c = len(genera)
                k_c = len(orb)
                orb_set = set(orb)
                for i in orb:
                    comp_of[(v, i)] = c
                twice = k_c * (2 * h - 2)
                for sp in s_list:
                    inside = sum(1 for cyc in cycles(sp) if cyc[0] in orb_set)
                    twice += k_c - inside
                assert twice % 2 == 0, "odd Riemann–Hurwitz numerator on a component"
                g_c = twice // 2 + 1
                assert g_c >= 0, "negative genus on a component"
                genera.append(g_c)
                verts.append(v)
                degrees.append(k_c)
        src_edges: list[tuple[int, int]] = []
        over: list[int] = []
        index: list[int] = []
        mult = 1
        profiles = []
        for k, (u, w) in enumerate(self.edges):
            iu, _ = self.half_index[k]
            sx = self.s(tuples[u], u, iu)
            profiles.append(cycle_type(sx))
            pairs = sorted(betas[k], key=lambda cb: min(cb[0]))
            for c, b in pairs:
                mult *= len(c)
                assert len(c) == len(b)
                src_edges.append((comp_of[(u, min(c))], comp_of[(w, min(b))]))
                over.append(k)
                index.append(len(c))
        # connectivity of the source
        n = len(genera)
        parent = list(range(n))

        def find(i):
            while parent[i] != i:
                parent[i] = parent[parent[i]]
                i = parent[i]
            return i

        for a, b in src_edges:
            parent[find(a)] = find(b)
        if len({find(i) for i in range(n)}) != 1:
            return None
        cover = BruteCover(
            edge_profiles=tuple(profiles),
            source_genera=tuple(genera),
            source_edges=tuple(src_edges),
            automorphisms=aut,
            multiplicity=mult,
            source_vertices=tuple(verts),
            source_degrees=tuple(degrees),
            source_edge_over=tuple(over),
            source_edge_index=tuple(index),
        )
        assert cover.arithmetic_genus == self.g, (
            f"source arithmetic genus {cover.arithmetic_genus} != Riemann–Hurwitz genus {self.g}"
        )
        return cover


# ----------------------------------------------------------------- methods


def _classes(setup: _Setup, v: int):
    """Conjugacy classes of labelled local tuples at ``v``: list of
    (representative, centraliser as a list of permutations)."""
    d = setup.d
    perms = _all_perms(d)
    tuples = setup.local_tuples(v)
    pool = set(tuples)
    seen: set = set()
    out = []
    for t in sorted(tuples):
        if t in seen:
            continue
        orbit = set()
        cent = []
        for s in perms:
            image = _conj_tuple(t, s)
            assert image in pool, "the local relation is not conjugation invariant"
            orbit.add(image)
            if image == t:
                cent.append(s)
        assert len(orbit) * len(cent) == factorial(d)
        seen |= orbit
        out.append((t, cent))
    assert len(seen) == len(pool)
    return out


def _reduced(setup: _Setup) -> list[BruteCover]:
    classes = [_classes(setup, v) for v in range(setup.V)]
    covers: list[BruteCover] = []

    def edges_ready(assigned: int) -> list[int]:
        # edges whose later end is vertex ``assigned``
        return [k for k, (u, w) in enumerate(setup.edges) if max(u, w) == assigned]

    ready = [edges_ready(v) for v in range(setup.V)]

    def process(choice):
        tuples = [t for t, _ in choice]
        cents = [c for _, c in choice]
        bij_lists = []
        for k in range(len(setup.edges)):
            cx, cy = setup.edge_cycles(tuples, k)
            bij_lists.append(_bijections(cx, cy))
        group = list(itertools.product(*cents))
        seen: set = set()
        for betas in itertools.product(*bij_lists):
            if betas in seen:
                continue
            orbit = set()
            for sig in group:
                image = tuple(
                    _transport(beta, sig[u], sig[w]) for beta, (u, w) in zip(betas, setup.edges)
                )
                orbit.add(image)
            seen |= orbit
            assert len(group) % len(orbit) == 0
            cover = setup.build(tuples, betas, len(group) // len(orbit))
            if cover is not None:
                covers.append(cover)

    def rec(v, choice):
        if v == setup.V:
            process(choice)
            return
        for cls in classes[v]:
            new = choice + [cls]
            tuples = [t for t, _ in new]
            ok = True
            for k in ready[v]:
                u, w = setup.edges[k]
                iu, iw = setup.half_index[k]
                if cycle_type(setup.s(tuples[u], u, iu)) != cycle_type(setup.s(tuples[w], w, iw)):
                    ok = False
                    break
            if ok:
                rec(v + 1, new)

    rec(0, [])
    return covers


def _full(setup: _Setup) -> list[BruteCover]:
    d, V = setup.d, setup.V
    local = [setup.local_tuples(v) for v in range(V)]
    data = []
    for tuples in itertools.product(*local):
        bij_lists = []
        for k in range(len(setup.edges)):
            cx, cy = setup.edge_cycles(tuples, k)
            bij_lists.append(_bijections(cx, cy))
        for betas in itertools.product(*bij_lists):
            data.append((tuples, betas))
    pool = set(data)
    gens = []
    for i in range(d - 1):
        s = list(range(d))
        s[i], s[i + 1] = s[i + 1], s[i]
        gens.append(tuple(s))
    ident = identity(d)

    def act(datum, v, s):
        tuples, betas = datum
        new_t = tuple(_conj_tuple(t, s) if x == v else t for x, t in enumerate(tuples))
        new_b = tuple(
            _transport(beta, s if u == v else ident, s if w == v else ident)
            for beta, (u, w) in zip(betas, setup.edges)
        )
        return new_t, new_b

    seen: set = set()
    covers = []
    full_order = factorial(d) ** V
    for datum in data:
        if datum in seen:
            continue
        orbit = {datum}
        queue = deque([datum])
        while queue:
            x = queue.popleft()
            for v in range(V):
                for s in gens:
                    y = act(x, v, s)
                    if y not in orbit:
                        assert y in pool
                        orbit.add(y)
                        queue.append(y)
        seen |= orbit
        assert full_order % len(orbit) == 0
        cover = setup.build(datum[0], datum[1], full_order // len(orbit))
        if cover is not None:
            covers.append(cover)
    return covers


def brute_force_covers(
    degree: int,
    genera: Sequence[int],
    edges: Sequence[tuple[int, int]],
    legs: Sequence[Sequence[int]],
    profiles: Sequence[Sequence[int]],
    method: str = "reduced",
) -> list[BruteCover]:
    """All admissible covers with connected source over a fixed curve of the base
    stratum given raw: base vertex ``v`` has genus ``genera[v]`` and the legs
    ``legs[v]`` (labels ``1..b``; leg ``j`` has profile ``profiles[j-1]``);
    ``edges[k] = (u, w)``, ``u == w`` a loop.  One entry per isomorphism class
    (orbit of ``prod_v S_d``); ``method`` is ``"reduced"`` or ``"full"`` (see the
    module docstring: same answer, the second literal and slow).
    """
    setup = _Setup(degree, genera, edges, legs, profiles)
    if method == "reduced":
        return _reduced(setup)
    if method == "full":
        return _full(setup)
    raise ValueError(f"unknown method {method!r}")
