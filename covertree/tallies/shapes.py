"""Shapes of pieces over one base component, and local multisets of shapes.

A *shape* over a base vertex ``v`` of genus ``h`` is the combinatorial data of
one connected local cover, forgetting its monodromy: the degree ``k``, the
sub-profile ``nu_j`` (a sub-multiset of ``mu_j`` of size ``k``) at each leg
``j`` of ``v``, and a profile ``alpha_p`` (a partition of ``k``) at each
half-edge point ``p`` of ``v``, the special points in the order of
:func:`covertree.monodromy.local.special_points` (legs by label, then
half-edges in edge order).  Its genus follows from Riemann-Hurwitz,
``2g - 2 = k(2h - 2) + sum_p (k - len(profile at p))``, and its weight is the
connected Hurwitz number ``connected_hurwitz(k, h, [nu..., alpha...])`` (unlabelled
preimages, docs/theory.md, section 4); shapes with weight 0 are dropped.

A *local multiset* over ``v`` is a multiset of shapes whose degrees add up to
``d`` and whose sub-profiles at each leg ``j`` add up to ``mu_j``.

Only shapes of genus at most ``max_genus`` are produced, and only multisets
whose genera add up to at most ``max_genus``: a connected source of genus
``g`` has ``g = sum_c g_c + b_1 >= sum_c g_c``.  This bound is what keeps the
number of shapes small for large degree (over a genus-0 component a piece
unramified at the legs is a cyclic cover, ``alpha = (k), (k)``).

Pooled simple legs
------------------
Over a base vertex with ``n`` simple legs (profile ``(2, 1, ..., 1)``) a
piece uses each of them (sub-profile ``(2, 1, ...)``) or not (``(1, ...)``),
and every simple leg is used by exactly one piece; so the shapes are one per
subset of those legs and the local multisets are set partitions of them
(tetragonal covers of genus 6: 16 simple legs on one vertex of the divisor
``2|16``, and ``2^15 - 1`` splittings into two double covers alone).
:func:`vertex_orbits` lists them up to the group ``S`` of permutations of a
chosen set of simple legs (the *pooled* legs: in
:mod:`covertree.tallies.types`, the simple legs of no marked branch point),
with the number of labelled multisets in each orbit.

A pooled shape (:func:`pooled_candidates`) keeps the sub-profiles at the
other legs and records only the number ``c`` of pooled legs it uses, as a
last pseudo-leg ``(2,) * c``, a slot of need ``n`` in the slot search below
(its ramification ``c`` enters Riemann-Hurwitz).  Forgetting which pooled
legs each piece uses maps a labelled multiset onto a multiset of pooled
shapes, and the fibres are the ``S``-orbits: ``S`` keeps the pooled shapes,
and two labelled multisets over the same pooled multiset differ by the
permutation carrying the legs of each piece to those of its partner.  The
fibre over pooled pieces ``P_1, ..., P_r`` using ``c_1, ..., c_r`` pooled
legs has

    n! / (prod_i c_i! * prod_P m_P!)

elements (:func:`orbit_size`), ``m_P`` the multiplicity of each pooled shape
``P`` with ``c > 0``: the ordered assignments of the pooled legs to the
pieces with these numbers are counted by the multinomial coefficient, two
give the same multiset exactly when they differ by permuting pieces of equal
pooled shape, and that permutation group acts freely on them, since pieces
with ``c > 0`` get disjoint non-empty sets of legs (pieces with ``c = 0``
are left as they are).  One labelled multiset stands for its orbit (the
pooled legs given out in order, the first ``c_1`` to the first piece and so
on).  A permutation of legs of equal profile changes no degree, genus,
profile at a half-edge point, connected Hurwitz number (symmetric in its
branch points) or sub-profile at a leg that is not pooled, and it carries
equal shapes to equal shapes; so the tallies of a choice of multisets are those of its
representatives with the pieces renumbered.  The groups of different
vertices act independently, and balance across a node reads only profiles
at half-edge points, so a choice of one representative per vertex stands
for the product of their orbit sizes of choices; summing the
representatives' tallies with that factor gives every tally read up to
renumbering of pieces (totals, source graphs, node profiles, pullbacks,
locus classes) exactly as the labelled sum does.  (The leg paths of a
marked source that stabilisation contracts whole depend on the numbering;
:mod:`covertree.tallies.types` pools nothing there.)

References
----------
A. Hurwitz, "Uber Riemann'sche Flachen mit gegebenen Verzweigungspunkten",
Mathematische Annalen 39 (1891): the Riemann-Hurwitz formula

R. P. Stanley, *Enumerative Combinatorics*, Vol. 1, 2nd ed., Cambridge
University Press (2012), section 1.9 (the twelvefold way): multinomial
coefficients, set partitions counted by the sizes of their blocks; the
orbit-stabiliser count behind the pooled multisets is classical.

Examples
--------
Over a rational component with one simple leg (degree 3) and one half-edge:
the unramified sheet and the double cover branched at the leg and the node;
the only local multiset is one of each.

>>> [(s.degree, s.legs, s.halves, s.genus, str(s.hurwitz))
...  for s in piece_shapes(3, 0, ((2, 1),), 1, 2)]
[(1, ((1,),), ((1,),), 0, '1'), (2, ((2,),), ((2,),), 0, '1/2')]
>>> local_multisets(3, 0, ((2, 1),), 1, 2)
[(0, 1)]
"""

from __future__ import annotations

from bisect import bisect_left
from collections import Counter
from collections.abc import Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from functools import cached_property, lru_cache
from math import factorial, prod
from itertools import product

from covertree.hurwitz.numbers import connected_hurwitz
from covertree.symmetric.partitions import partitions_of, sub_partitions

__all__ = ["Shape", "piece_shapes", "candidate_shapes", "local_multisets", "vertex_pieces",
           "pooled_candidates", "orbit_size", "vertex_orbits"]

Profile = tuple[int, ...]


@dataclass(frozen=True, order=True)
class Shape:
    """One piece shape (see the module docstring).

    Attributes
    ----------
    degree : int
    legs : tuple of profiles
        Sub-profile at each leg of the vertex, in leg order.
    halves : tuple of profiles
        Profile at each half-edge point of the vertex, in the vertex's order.
    genus : int
        By Riemann-Hurwitz.
    vertex_genus : int
        Genus of the base vertex.
    hurwitz : Fraction
        Connected Hurwitz number of the piece (unlabelled preimages),
        computed on first use: most candidate shapes at high degree are never
        used, and this number is the dear part of a shape.
    """

    degree: int
    legs: tuple[Profile, ...]
    halves: tuple[Profile, ...]
    genus: int = field(compare=False)
    vertex_genus: int = field(compare=False, default=0)

    @cached_property
    def hurwitz(self) -> Fraction:
        return connected_hurwitz(self.degree, self.vertex_genus, self.legs + self.halves)


@lru_cache(maxsize=None)
def _partitions_by_length(k: int) -> dict[int, tuple[Profile, ...]]:
    out: dict[int, list[Profile]] = {}
    for p in partitions_of(k):
        out.setdefault(len(p), []).append(tuple(p))
    return {n: tuple(ps) for n, ps in out.items()}


def _half_profiles(k: int, n: int, total: int) -> list[tuple[Profile, ...]]:
    """Tuples of ``n`` partitions of ``k`` with ``total`` parts in all."""
    if n == 0:
        return [()] if total == 0 else []
    by_len = _partitions_by_length(k)
    out = []
    for first_len in range(max(1, total - (n - 1) * k), min(k, total - (n - 1)) + 1):
        for rest in _half_profiles(k, n - 1, total - first_len):
            out.extend((p,) + rest for p in by_len[first_len])  # every length 1..k occurs
    return out


@lru_cache(maxsize=None)
def piece_shapes(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...],
                 n_halves: int, max_genus: int) -> tuple[Shape, ...]:
    """Every shape of degree ``<= degree`` and genus ``<= max_genus`` with
    nonzero weight over a vertex of genus ``vertex_genus`` with legs of
    profiles ``leg_profiles`` and ``n_halves`` half-edge points, sorted."""
    return tuple(s for s in candidate_shapes(degree, vertex_genus, leg_profiles, n_halves, max_genus) if s.hurwitz)


@lru_cache(maxsize=None)
def candidate_shapes(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...],
                     n_halves: int, max_genus: int) -> tuple[Shape, ...]:
    """The shapes allowed by Riemann-Hurwitz, weight not yet known (some are
    0), sorted: :func:`piece_shapes` before the weight filter."""
    out: list[Shape] = []
    for k in range(1, degree + 1):
        options = [[tuple(nu) for nu in sub_partitions(mu, k)] for mu in leg_profiles]
        for legs in product(*options):
            out.extend(_shapes_with_legs(k, vertex_genus, legs, n_halves, max_genus))
    return tuple(sorted(out))


def _shapes_with_legs(k: int, h: int, legs: tuple[Profile, ...], n_halves: int,
                      max_genus: int, pooled: int | None = None) -> list[Shape]:
    """The shapes with these sub-profiles at the legs; with ``pooled = c``
    the piece also uses ``c`` pooled simple legs (one ramification each),
    recorded as a last pseudo-leg ``(2,) * c``."""
    # 2g - 2 = k(2h - 2) + sum_legs (k - len) + sum_halves (k - len)
    ramification = sum(k - len(nu) for nu in legs) + (pooled or 0)
    base = k * (2 * h - 2) + ramification + n_halves * k + 2
    if pooled is not None:
        legs = legs + ((2,) * pooled,)
    out = []
    for genus in range(max_genus + 1):
        total = base - 2 * genus
        out.extend(Shape(k, legs, halves, genus, h) for halves in _half_profiles(k, n_halves, total))
    return out


def local_multisets(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...],
                    n_halves: int, max_genus: int,
                    loops: tuple[tuple[int, int], ...] = ()) -> list[tuple[int, ...]]:
    """Local multisets over one vertex, as sorted tuples of indices into
    ``piece_shapes(degree, vertex_genus, leg_profiles, n_halves, max_genus)``,
    in lexicographic order.

    ``loops`` are pairs ``(p, q)`` of half-edge points of the vertex that are
    the two ends of one loop: only multisets whose profiles at ``p`` and at
    ``q`` agree (balanced over the loop) are returned.  When every piece
    unramified at the legs has equal profiles at ``p`` and ``q`` (always so
    over a rational vertex: those pieces are cyclic), balance is decided by
    the ramified pieces, so unbalanced ones are dropped before the last phase
    instead of after it; this is most of the multisets at high degree.

    Method: the cycles of length ``>= 2`` of the legs are *slots* ``(leg,
    length)`` with a need (the multiplicity in ``mu_j``).  Once the degrees add
    up to ``d`` and every slot is used exactly, the fixed points of the legs
    are used exactly too (at leg ``j`` the pieces use ``d`` points in all), so
    only slots are tracked.  A multiset splits uniquely into phases: the pieces
    using the first slot, then those using the first slot still needed among
    the rest, and so on, and last the pieces unramified at every leg; within a
    phase pieces are taken in non-decreasing index.  So each multiset is
    produced once and only shapes using the slot in hand are tried.  Slots of
    need 1 (a simple branch point) are bits of one integer mask.
    """
    shapes = piece_shapes(degree, vertex_genus, leg_profiles, n_halves, max_genus)
    plan = _SlotPlan(shapes, leg_profiles, loops)
    out: list[tuple[int, ...]] = []
    plan.cover(0, -1, degree, max_genus, 0, [], out)
    return sorted(tuple(sorted(m)) for m in out if _balanced(shapes, m, loops))


def vertex_pieces(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...], n_halves: int,
                  max_genus: int, loops: tuple[tuple[int, int], ...] = ()
                  ) -> tuple[tuple[Shape, ...], list[tuple[int, ...]]]:
    """The local multisets of :func:`local_multisets` with the shapes they
    use: ``(shapes, multisets)``, ``shapes`` sorted, each multiset a sorted
    tuple of indices into ``shapes``, in lexicographic order.

    The same multisets as ``local_multisets`` (over the shapes of nonzero
    weight), found without the weight of every candidate shape: the
    multisets are built from the candidates of :func:`candidate_shapes`, and
    only the shapes that occur in one are weighed (a multiset holding a shape
    of weight 0 is dropped).  Sub-multisets of a sorted list keep their
    order, so the order is that of ``local_multisets``.

    >>> shapes, multisets = vertex_pieces(3, 0, ((2, 1),), 1, 2)
    >>> [(s.degree, s.halves) for s in shapes], multisets
    ([(1, ((1,),)), (2, ((2,),))], [(0, 1)])
    """
    candidates = candidate_shapes(degree, vertex_genus, leg_profiles, n_halves, max_genus)
    plan = _SlotPlan(candidates, leg_profiles, loops)
    found: list[tuple[int, ...]] = []
    plan.cover(0, -1, degree, max_genus, 0, [], found)
    kept = sorted(tuple(sorted(m)) for m in found
                  if (plan.early or _balanced(candidates, m, loops)) and all(candidates[i].hurwitz for i in m))
    used = sorted({i for m in kept for i in m})
    index = {i: n for n, i in enumerate(used)}
    return tuple(candidates[i] for i in used), [tuple(index[i] for i in m) for m in kept]


@lru_cache(maxsize=None)
def pooled_candidates(degree: int, vertex_genus: int, kept: tuple[Profile, ...], n_pooled: int,
                      n_halves: int, max_genus: int) -> tuple[Shape, ...]:
    """The candidate shapes over a vertex with legs of profiles ``kept`` and
    ``n_pooled`` more simple legs taken up to permutation, sorted: a shape
    using ``c`` of the pooled legs has the pseudo-leg ``(2,) * c`` after its
    sub-profiles at ``kept`` (its weight is not a Hurwitz number: only the
    labelled shapes of the representatives in :func:`vertex_orbits` are
    weighed).

    A piece of degree 1 uses no simple leg, and one of degree above
    ``degree - 2`` uses every one (the other pieces have at most ``degree -
    k < 2`` sheets, too few for a transposition).

    Degree 2, two simple legs and one half-edge point: no piece of degree 1,
    and the double cover branched at both legs, unramified over the node.

    >>> [(s.degree, s.legs, s.halves) for s in pooled_candidates(2, 0, (), 2, 1, 0)]
    [(2, ((2, 2),), ((1, 1),))]
    """
    out: list[Shape] = []
    for k in range(1, degree + 1):
        low, high = (n_pooled if k > degree - 2 else 0), (n_pooled if k > 1 else 0)
        options = [[tuple(nu) for nu in sub_partitions(mu, k)] for mu in kept]
        for legs in product(*options):
            for c in range(low, high + 1):
                out.extend(_shapes_with_legs(k, vertex_genus, legs, n_halves, max_genus, c))
    return tuple(sorted(out))


def orbit_size(used: Sequence[int], keys: Sequence, n_pooled: int) -> int:
    """The number of labelled local multisets in the orbit of one whose
    pieces use ``used[i]`` of the ``n_pooled`` pooled legs, ``keys[i]``
    equal exactly for equal pooled shapes: ``n! / (prod_i c_i! * prod_P
    m_P!)``, ``m_P`` the multiplicity of each pooled shape ``P`` with ``c >
    0`` (module docstring).

    >>> orbit_size([2, 2], ["P", "P"], 4)    # {ab, cd}, {ac, bd}, {ad, bc}
    3
    >>> orbit_size([2, 2, 0, 0], ["P", "Q", "R", "R"], 4)    # the legs of P: 6 choices
    6
    """
    if n_pooled < 2:
        return 1
    denominator = prod(factorial(c) for c in used)
    for m in Counter(k for k, c in zip(keys, used) if c).values():
        denominator *= factorial(m)
    return factorial(n_pooled) // denominator


@lru_cache(maxsize=None)
def _labelled(piece: Shape, vertex_genus: int, n_legs: int, pooled: tuple[int, ...], given: int) -> Shape:
    """The labelled shape of a pooled piece carrying the pooled legs number
    ``given, given + 1, ...`` (the legs at the positions ``pooled`` among the
    ``n_legs`` legs); one object per shape, so that its weight is computed
    once (``vertex_genus`` is in the key: shapes compare without it).

    >>> [piece] = pooled_candidates(3, 0, ((3,),), 2, 0, 0)
    >>> piece.legs, _labelled(piece, 0, 3, (0, 2), 0).legs
    (((3,), (2, 2)), ((2, 1), (3,), (2, 1)))
    """
    k, c, kept = piece.degree, len(piece.legs[-1]), iter(piece.legs[:-1])
    where = {j: n for n, j in enumerate(pooled)}
    legs = tuple(next(kept) if j not in where else
                 (2,) + (1,) * (k - 2) if given <= where[j] < given + c else (1,) * k
                 for j in range(n_legs))
    return Shape(k, legs, piece.halves, piece.genus, vertex_genus)


def vertex_orbits(degree: int, vertex_genus: int, leg_profiles: tuple[Profile, ...], n_halves: int,
                  max_genus: int, loops: tuple[tuple[int, int], ...] = (), pooled: tuple[int, ...] = ()
                  ) -> tuple[tuple[Shape, ...], list[tuple[int, ...]], list[int]]:
    """The local multisets of :func:`vertex_pieces` up to permutations of the
    simple legs at the positions ``pooled``: ``(shapes, multisets, sizes)``,
    one labelled multiset per orbit (the pooled legs given out in order, the
    first ``c_1`` to the first piece and so on) with its orbit size
    (:func:`orbit_size`), in the order and form of :func:`vertex_pieces`.

    Degree 4 over ``P^1`` with four simple points, genus at most 1: a double
    cover and two sheets, a trigonal cover and a sheet (one orbit each), or
    two double covers branched at two points each (three ways to split the
    points, one orbit):

    >>> shapes, multisets, sizes = vertex_orbits(4, 0, ((2, 1, 1),) * 4, 0, 1, (), (0, 1, 2, 3))
    >>> [[shapes[i].degree for i in m] for m in multisets], sizes
    ([[1, 1, 2], [1, 3], [2, 2]], [1, 1, 3])
    >>> [shapes[i].legs for i in multisets[2]]
    [((1, 1), (1, 1), (2,), (2,)), ((2,), (2,), (1, 1), (1, 1))]
    """
    kept = tuple(mu for j, mu in enumerate(leg_profiles) if j not in pooled)
    candidates = pooled_candidates(degree, vertex_genus, kept, len(pooled), n_halves, max_genus)
    plan = _SlotPlan(candidates, kept + ((2,) * len(pooled),), loops, pooled=True)
    found: list[tuple[int, ...]] = []
    plan.cover(0, -1, degree, max_genus, 0, [], found)
    used = [len(s.legs[-1]) for s in candidates]
    labels = _Labels(candidates, len(leg_profiles), pooled)
    rows = []
    for m in found:
        if plan.early or _balanced(candidates, m, loops):
            m = sorted(m)
            ids = labels.of(m, used)
            if ids is not None:
                rows.append((ids, orbit_size([used[i] for i in m], m, len(pooled))))
    return labels.ordered(rows)


class _Labels:
    """The labelled shapes of one vertex's representatives, numbered as met
    (a number per pooled candidate and first pooled leg), with their weights'
    being nonzero: equal labelled shapes get one number, so no shape is
    hashed per multiset."""

    def __init__(self, candidates: Sequence[Shape], n_legs: int, pooled: tuple[int, ...]) -> None:
        self.candidates, self.n_legs, self.pooled = candidates, n_legs, pooled
        self.number: dict[tuple[int, int], int] = {}
        self.shapes: list[Shape] = []
        self.weighs: list[bool] = []

    def of(self, multiset: Sequence[int], used: Sequence[int]) -> tuple[int, ...] | None:
        """The numbers of the representative's pieces, ``None`` if one weighs 0."""
        out, given = [], 0
        for i in multiset:
            key = (i, given if used[i] else 0)
            if key not in self.number:
                piece = self.candidates[i]
                shape = _labelled(piece, piece.vertex_genus, self.n_legs, self.pooled, key[1])
                self.number[key] = len(self.shapes)
                self.shapes.append(shape)
                self.weighs.append(bool(shape.hurwitz))
            n = self.number[key]
            if not self.weighs[n]:
                return None
            out.append(n)
            given += used[i]
        return tuple(out)

    def ordered(self, rows: list[tuple[tuple[int, ...], int]]
                ) -> tuple[tuple[Shape, ...], list[tuple[int, ...]], list[int]]:
        """``(shapes, multisets, sizes)`` in the form of :func:`vertex_pieces`."""
        present = sorted({n for ids, _ in rows for n in ids}, key=lambda n: self.shapes[n])
        rank = {n: r for r, n in enumerate(present)}
        out = sorted((tuple(sorted(rank[n] for n in ids)), size) for ids, size in rows)
        return tuple(self.shapes[n] for n in present), [m for m, _ in out], [size for _, size in out]


def _balanced(shapes: Sequence["Shape"], multiset: Sequence[int], loops: tuple[tuple[int, int], ...]) -> bool:
    """Whether the multiset's profiles agree at both ends of every loop."""
    for p, q in loops:
        if Counter(x for i in multiset for x in shapes[i].halves[p]) != \
                Counter(x for i in multiset for x in shapes[i].halves[q]):
            return False
    return True


class _SlotPlan:
    """The slots of one vertex and, per shape, the slots it uses."""

    def __init__(self, shapes: Sequence[Shape], leg_profiles: tuple[Profile, ...],
                 loops: tuple[tuple[int, int], ...] = (), pooled: bool = False) -> None:
        slots = sorted({(j, x) for j, mu in enumerate(leg_profiles) for x in mu if x > 1})
        # the pseudo-leg of pooled simple legs (last) is no leg of degree d: no mass
        real = len(leg_profiles) - pooled
        self.shapes = shapes
        self.loops = loops
        self.need = [Counter(leg_profiles[j])[x] for j, x in slots]
        self.bit = [1 << n if self.need[n] == 1 else 0 for n in range(len(slots))]
        where = {s: n for n, s in enumerate(slots)}
        self.bits, self.multi, self.users = [], [], [[] for _ in slots]
        self.free: list[int] = []
        # per leg, the mass of its cycles of length >= 2 not yet used
        self.mass = [sum(x for x in mu if x > 1) for mu in leg_profiles[:real]] or [0]
        self.spend: list[tuple[tuple[int, int], ...]] = []
        for i, shape in enumerate(shapes):
            self.spend.append(tuple((j, sum(x for x in nu if x > 1)) for j, nu in enumerate(shape.legs[:real])
                                    if any(x > 1 for x in nu)))
            used = sorted((where[(j, x)], m) for j, nu in enumerate(shape.legs)
                          for x, m in Counter(nu).items() if x > 1)
            self.bits.append(sum(self.bit[n] for n, _ in used))
            self.multi.append(tuple((n, m) for n, m in used if not self.bit[n]))
            (self.users[used[0][0]] if used else self.free).append(i)
        self.rows = [(sh.degree, sh.genus, b, m, sp)
                     for sh, b, m, sp in zip(shapes, self.bits, self.multi, self.spend)]
        # balance over the loops is decided before the last phase when the
        # pieces of that phase are balanced one by one
        self.early = bool(loops) and all(shapes[i].halves[p] == shapes[i].halves[q]
                                         for i in self.free for p, q in loops)

    def _open(self, slot: int, mask: int) -> int:
        """The first slot from ``slot`` on that is still needed."""
        while slot < len(self.need) and (mask & self.bit[slot] if self.bit[slot] else self.need[slot] == 0):
            slot += 1
        return slot

    def cover(self, slot: int, last: int, left: int, genus_left: int, mask: int, acc: list, out: list) -> None:
        """Phases over the slots; ``last`` is the least index allowed in this phase."""
        opened = self._open(slot, mask)
        if opened != slot:
            slot, last = opened, -1
        if slot == len(self.need):
            if not self.early or _balanced(self.shapes, acc, self.loops):
                self.fill(0, left, genus_left, acc, out)
            return
        users = self.users[slot]
        for t in range(bisect_left(users, last), len(users)):
            idx = users[t]
            degree, genus, bits, multi, spend = self.rows[idx]
            if degree > left or genus > genus_left or bits & mask or any(self.need[n] < m for n, m in multi):
                continue
            for j, m in spend:
                self.mass[j] -= m
            # a leg's remaining ramified cycles must fit in the remaining degree
            if max(self.mass) <= left - degree:
                for n, m in multi:
                    self.need[n] -= m
                acc.append(idx)
                self.cover(slot, idx, left - degree, genus_left - genus, mask | bits, acc, out)
                acc.pop()
                for n, m in multi:
                    self.need[n] += m
            for j, m in spend:
                self.mass[j] += m

    def fill(self, start: int, left: int, genus_left: int, acc: list, out: list) -> None:
        """The last phase: shapes unramified at every leg, non-decreasing."""
        if left == 0:
            out.append(tuple(acc))
            return
        for t in range(start, len(self.free)):
            s = self.shapes[self.free[t]]
            if s.degree > left:
                break
            if s.genus <= genus_left:
                acc.append(self.free[t])
                self.fill(t, left - s.degree, genus_left - s.genus, acc, out)
                acc.pop()
