"""Connected covers of one base component, enumerated up to conjugacy.

Reference copy (tests only) of the first, simple implementation of
:mod:`covertree.monodromy.pieces`: normal forms compared generator by
generator and only at complete tuples, the last prescribed special point solved
and its type checked at the end.  The tests compare the library with it.

Convention
----------
A base component of genus ``h`` with special points ``p_1..p_n`` (legs and
half-edges, in a fixed order) is covered in degree ``k`` by a tuple
``(a_1, b_1, ..., a_h, b_h, s_1, ..., s_n)`` of permutations of the sheets
``0..k-1`` with ``[a_1,b_1]...[a_h,b_h] s_1 ... s_n = 1`` (products left to
right, see :mod:`covertree.symmetric.permutations`).  A *piece* is such a tuple
generating a transitive group, taken up to simultaneous conjugation.

Method
------
Tuples are grown point by point in breadth-first order from sheet 0: the first
undefined image (point, generator) is given either an already reached point or
the next new one, so that every tuple is produced in its breadth-first normal
form from each start sheet, never as one of its ``k!`` labellings.  A tuple is
kept when its normal form from 0 is the least among the normal forms from all
``k`` start sheets; the start sheets giving the same normal form are exactly
the centraliser.  Cycle types prescribed at legs prune the search as cycles
close; one special point (a half-edge if there is one) is solved from the
relation.  This is the idea of the low-index subgroups algorithm.

References
----------
C. C. Sims, *Computation with Finitely Presented Groups*, Cambridge University
Press, 1994, chapter 5 (low-index subgroups).  The cost is proportional to
``k`` times the number of conjugacy classes of tuples reached, with no factor
``k!``.

Examples
--------
Degree-2 covers of a sphere with three special points, types free:

>>> ps = connected_pieces(2, 0, [None, None, None])
>>> [(p.gens, p.centraliser_order) for p in ps]
[(((1, 0), (0, 1), (1, 0)), 2), (((1, 0), (1, 0), (0, 1)), 2), (((0, 1), (1, 0), (1, 0)), 2)]
"""

from __future__ import annotations

from collections import Counter
from collections.abc import Iterator, Sequence
from dataclasses import dataclass, field
from functools import cached_property

from covertree.symmetric.permutations import Perm, commutator, compose, cycles, cycle_type, inverse

#: Allowed cycle lengths at a special point: length -> maximal number of cycles,
#: or ``None`` when the type is free (a half-edge).
Allowance = dict[int, int] | None


@dataclass(frozen=True)
class Piece:
    """A connected cover of one base component, in breadth-first normal form.

    Attributes
    ----------
    degree : int
    handles : int
        Genus ``h`` of the base component.
    gens : tuple of Perm
        ``(a_1, b_1, ..., a_h, b_h, s_1, ..., s_n)``.
    centraliser : tuple of Perm
        Every permutation commuting with all of ``gens`` (the deck group).
    """

    degree: int
    handles: int
    gens: tuple[Perm, ...]
    centraliser: tuple[Perm, ...] = field(compare=False)

    @property
    def centraliser_order(self) -> int:
        return len(self.centraliser)

    def special(self, p: int) -> Perm:
        """The permutation ``s_p`` at the ``p``-th special point (0-based)."""
        return self.gens[2 * self.handles + p]

    @property
    def n_special(self) -> int:
        return len(self.gens) - 2 * self.handles

    def profile(self, p: int) -> tuple[int, ...]:
        """Cycle type of ``s_p``."""
        return cycle_type(self.special(p))

    @cached_property
    def genus(self) -> int:
        """Genus by Riemann-Hurwitz: ``2g-2 = k(2h-2) + sum_p (k - #cycles(s_p))``."""
        k = self.degree
        ram = sum(k - len(self.profile(p)) for p in range(self.n_special))
        return (k * (2 * self.handles - 2) + ram + 2) // 2


def connected_pieces(degree: int, handles: int, allowed: Sequence[Allowance]) -> list[Piece]:
    """All pieces of the given degree over a component of genus ``handles``.

    Parameters
    ----------
    degree : int
        Degree ``k`` of the piece.
    handles : int
        Genus of the base component.
    allowed : sequence
        One entry per special point: ``None`` (any type) or a dict
        ``length -> max count``; the type of ``s_p`` must be a sub-multiset of it
        of size ``k``.

    Returns
    -------
    list of Piece
        One per conjugacy class, in the order produced (deterministic).

    Notes
    -----
    One special point (a free one if there is one) is solved from the
    relation.  Without special points every generator is grown and the
    relation is traced from every reached sheet as the partial permutations fill
    in (as in coset enumeration).

    Examples
    --------
    Connected triple covers of P^1 with three points of type (3):

    >>> [(p.gens, p.centraliser_order) for p in connected_pieces(3, 0, [{3: 1}] * 3)]
    [(((1, 2, 0), (1, 2, 0), (1, 2, 0)), 3)]

    With the third type free, ``s_2 = s_1^-1`` (and ``s_3 = 1``) appears too:

    >>> len(connected_pieces(3, 0, [{3: 1}, {3: 1}, None]))
    2
    """
    n = len(allowed)
    solved = _solved_index(allowed)
    order = _generation_order(handles, allowed, solved)
    gen_allow = [None if g < 2 * handles else allowed[g - 2 * handles] for g in order]
    relator = _relator(handles, n, order) if solved is None else None
    out = []
    for free in _normal_forms(degree, gen_allow, relator):
        full = _complete(free, order, handles, n, solved, degree)
        if full is None or not _fits(full, handles, allowed, solved):
            continue
        cent = _canonical_centraliser(free, degree)
        if cent is not None:
            out.append(Piece(degree, handles, full, cent))
    return out


def _relator(handles: int, n: int, order: list[int]) -> tuple[tuple[int, int], ...]:
    """The relation ``[a_1,b_1]...s_1...s_n`` as letters (position in the
    generation order, +1 or -1), read left to right."""
    where = {g: i for i, g in enumerate(order)}
    word: list[tuple[int, int]] = []
    for i in range(handles):
        a, b = where[2 * i], where[2 * i + 1]
        word += [(a, 1), (b, 1), (a, -1), (b, -1)]
    word += [(where[2 * handles + p], 1) for p in range(n)]
    return tuple(word)


def _solved_index(allowed: Sequence[Allowance]) -> int | None:
    """Index of the special point solved from the relation (a free one if any)."""
    if not allowed:
        return None
    free = [p for p, a in enumerate(allowed) if a is None]
    return free[0] if free else len(allowed) - 1


def _generation_order(handles: int, allowed: Sequence[Allowance], solved: int | None) -> list[int]:
    """Generator indices (into the full tuple) in the order they are grown:
    prescribed special points first (they prune best), then handles, then free."""
    special = [2 * handles + p for p in range(len(allowed)) if p != solved]
    prescribed = [g for g in special if allowed[g - 2 * handles] is not None]
    free = [g for g in special if allowed[g - 2 * handles] is None]
    return prescribed + list(range(2 * handles)) + free


def _complete(free: tuple[Perm, ...], order: list[int], handles: int, n: int,
              solved: int | None, k: int) -> tuple[Perm, ...] | None:
    """Full tuple in standard order, solving ``s_solved`` from the relation;
    ``None`` if there is no special point and the relation fails."""
    full: list[Perm | None] = [None] * (2 * handles + n)
    for g, perm in zip(order, free):
        full[g] = perm
    prefix = tuple(range(k))
    for i in range(handles):
        prefix = compose(prefix, commutator(full[2 * i], full[2 * i + 1]))
    base = 2 * handles
    if solved is None:
        for p in range(n):
            prefix = compose(prefix, full[base + p])
        return tuple(full) if prefix == tuple(range(k)) else None
    for p in range(solved):
        prefix = compose(prefix, full[base + p])
    suffix = tuple(range(k))
    for p in range(solved + 1, n):
        suffix = compose(suffix, full[base + p])
    full[base + solved] = compose(inverse(prefix), inverse(suffix))
    return tuple(full)


def _fits(full: tuple[Perm, ...], handles: int, allowed: Sequence[Allowance], solved: int | None) -> bool:
    """Whether the solved special point has an allowed type."""
    if solved is None or allowed[solved] is None:
        return True
    counts = Counter(len(c) for c in cycles(full[2 * handles + solved]))
    return all(allowed[solved].get(length, 0) >= m for length, m in counts.items())


def _normal_forms(k: int, gen_allow: list[Allowance],
                  relator: tuple[tuple[int, int], ...] | None = None) -> Iterator[tuple[Perm, ...]]:
    """Transitive tuples in breadth-first normal form from sheet 0, grown point by
    point; prescribed cycle lengths prune as cycles close, and the ``relator``
    (if given) prunes as soon as it fails to close from some sheet."""
    r = len(gen_allow)
    if r == 0:
        if k == 1:
            yield ()
        return
    img = [[-1] * k for _ in range(r)]
    pre = [[-1] * k for _ in range(r)]
    closed = [Counter() for _ in range(r)]
    longest = [max(a) if a else k for a in gen_allow]
    ctx = (k, r, img, pre, closed, gen_allow, longest, relator)
    yield from _grow(0, 1, ctx)


def _grow(slot: int, reached: int, ctx: tuple) -> Iterator[tuple[Perm, ...]]:
    k, r, img, pre, closed, gen_allow, longest, relator = ctx
    if slot == k * r:
        if reached == k:
            yield tuple(tuple(row) for row in img)
        return
    i, g = divmod(slot, r)
    if i >= reached:
        return
    row, back = img[g], pre[g]
    for j in range(min(reached + 1, k)):
        if back[j] != -1:
            continue
        length = _closing_length(row, back, i, j) if gen_allow[g] is not None else None
        if length is not None:
            if length > 0 and closed[g][length] >= gen_allow[g].get(length, 0):
                continue
            if length < 0 and -length > longest[g]:
                continue
        row[i], back[j] = j, i
        if length is not None and length > 0:
            closed[g][length] += 1
        now = max(reached, j + 1)
        if relator is None or _consistent(relator, img, pre, now):
            yield from _grow(slot + 1, now, ctx)
        if length is not None and length > 0:
            closed[g][length] -= 1
        row[i], back[j] = -1, -1


def _consistent(relator: tuple[tuple[int, int], ...], img: list[list[int]],
                pre: list[list[int]], reached: int) -> bool:
    """Trace the relator forwards and backwards from every reached sheet through
    the partial permutations; ``False`` if it provably cannot close."""
    n = len(relator)
    for p in range(reached):
        x, m = p, 0
        while m < n:
            g, sign = relator[m]
            y = img[g][x] if sign > 0 else pre[g][x]
            if y == -1:
                break
            x, m = y, m + 1
        if m == n:
            if x != p:
                return False
            continue
        y, top = p, n
        while top > m + 1:
            g, sign = relator[top - 1]
            z = pre[g][y] if sign > 0 else img[g][y]
            if z == -1:
                break
            y, top = z, top - 1
        if top == m + 1 and not _can_map(relator[m], x, y, img, pre):
            return False
    return True


def _can_map(letter: tuple[int, int], x: int, y: int, img: list[list[int]], pre: list[list[int]]) -> bool:
    """Whether the (undefined) letter may still send ``x`` to ``y``."""
    g, sign = letter
    if sign < 0:
        x, y = y, x
    return img[g][x] == -1 and pre[g][y] == -1


def _closing_length(row: list[int], back: list[int], i: int, j: int) -> int:
    """Setting ``i -> j``: the length of the cycle it closes (positive), or minus
    the length of the open chain it makes."""
    length, t = 1, j
    while row[t] != -1:
        t = row[t]
        length += 1
    if t == i:
        return length
    s = i
    while back[s] != -1:
        s = back[s]
        length += 1
    return -length


def _relabel(tup: tuple[Perm, ...], k: int, start: int) -> tuple[tuple[Perm, ...], list[int]]:
    """Breadth-first normal form of ``tup`` from ``start``; also the old point at
    each new label."""
    new = [-1] * k
    new[start] = 0
    old = [start]
    for p in old:
        for perm in tup:
            q = perm[p]
            if new[q] == -1:
                new[q] = len(old)
                old.append(q)
    return tuple(tuple(new[perm[old[x]]] for x in range(k)) for perm in tup), old


def _canonical_centraliser(tup: tuple[Perm, ...], k: int) -> tuple[Perm, ...] | None:
    """``None`` if another start sheet gives a smaller normal form; otherwise the
    centraliser (maps sending 0 to a start with the same normal form)."""
    cent = [tuple(range(k))]
    for start in range(1, k):
        form, old = _relabel(tup, k, start)
        if form < tup:
            return None
        if form == tup:
            cent.append(tuple(old))
    return tuple(cent)
