"""Connected covers of one base component, enumerated up to conjugacy.

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
the centraliser.  Forms are compared in the order the slots are filled
(sheet-major), so a partial tuple is cut as soon as another start sheet is
already smaller.  If a special point is free, one free point is solved from
the relation; otherwise all generators are grown and the relation is traced
through each new image, defining the images it forces (coset enumeration).
Prescribed cycle types prune as cycles close and chains grow, and force images
(a chain as long as the longest allowed cycle closes; the remaining sheets are
fixed once no longer cycle is allowed).  This is the low-index subgroups
algorithm.

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

from collections.abc import Sequence
from dataclasses import dataclass, field
from functools import cached_property

from covertree.symmetric.permutations import Perm, cycle_type, inverse

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
        return self.profiles[p]

    @cached_property
    def profiles(self) -> tuple[tuple[int, ...], ...]:
        """Cycle type of every ``s_p``, computed once."""
        return tuple(cycle_type(self.special(p)) for p in range(self.n_special))

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
    If some special point is free, the first free one is solved from the
    relation and the other generators are grown without constraint between
    them.  Otherwise every generator is grown and the relation is traced from
    the sheets touched by each new image, filling in the images it forces (as
    in coset enumeration).

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
    for rows, cent in _canonical_forms(degree, gen_allow, relator):
        full = _complete(rows, order, handles, n, solved, degree)
        out.append(Piece(degree, handles, full, cent))
    return out


def _relator(handles: int, n: int, order: list[int]) -> tuple[tuple[int, int], ...]:
    """The relation ``[a_1,b_1]...s_1...s_n`` as letters (position in the
    generation order, +1 or -1), read left to right.

    >>> _relator(1, 1, [2, 0, 1])
    ((1, 1), (2, 1), (1, -1), (2, -1), (0, 1))
    """
    where = {g: i for i, g in enumerate(order)}
    word: list[tuple[int, int]] = []
    for i in range(handles):
        a, b = where[2 * i], where[2 * i + 1]
        word += [(a, 1), (b, 1), (a, -1), (b, -1)]
    word += [(where[2 * handles + p], 1) for p in range(n)]
    return tuple(word)


def _solved_index(allowed: Sequence[Allowance]) -> int | None:
    """Index of the special point solved from the relation: the first free one,
    or ``None`` when every type is prescribed (then all generators are grown).

    >>> _solved_index([{2: 1}, None, None]), _solved_index([{2: 1}])
    (1, None)
    """
    free = [p for p, a in enumerate(allowed) if a is None]
    return free[0] if free else None


def _generation_order(handles: int, allowed: Sequence[Allowance], solved: int | None) -> list[int]:
    """Generator indices (into the full tuple) in the order they are grown:
    prescribed special points first (they prune best), then handles, then free.

    >>> _generation_order(1, [None, {2: 1}], 0)
    [3, 0, 1]
    """
    special = [2 * handles + p for p in range(len(allowed)) if p != solved]
    prescribed = [g for g in special if allowed[g - 2 * handles] is not None]
    free = [g for g in special if allowed[g - 2 * handles] is None]
    return prescribed + list(range(2 * handles)) + free


def _complete(rows: tuple[Perm, ...], order: list[int], handles: int, n: int,
              solved: int | None, k: int) -> tuple[Perm, ...]:
    """Full tuple in standard order, solving ``s_solved`` from the relation if
    one special point was not grown.

    >>> _complete(((1, 0),), [1], 0, 2, 0, 2)
    ((1, 0), (1, 0))
    """
    full: list[Perm] = [()] * (2 * handles + n)
    for g, perm in zip(order, rows):
        full[g] = perm
    if solved is not None:
        before = full[:2 * handles + solved]
        after = full[2 * handles + solved + 1:]
        full[2 * handles + solved] = _solve(before, after, handles, k)
    return tuple(full)


def _solve(before: list[Perm], after: list[Perm], handles: int, k: int) -> Perm:
    """The ``s`` with ``[a_1,b_1]...(specials before) s (specials after) = 1``,
    where ``before`` starts with the ``2 * handles`` handle generators.

    >>> _solve([(1, 0, 2)], [(0, 2, 1)], 0, 3)
    (2, 0, 1)
    """
    word: list[Perm] = []
    for i in range(handles):
        a, b = before[2 * i], before[2 * i + 1]
        word += [a, b, inverse(a), inverse(b)]
    word += before[2 * handles:]
    # s is the inverse of "the specials after, then the word before"
    rest = []
    for y in range(k):
        x = y
        for perm in after + word:
            x = perm[x]
        rest.append(x)
    return inverse(tuple(rest))


class _Table:
    """Partial permutations ``img``/``pre`` (``-1`` undefined) being grown, with
    a trail for undoing.

    At a prescribed generator it counts the closed cycles by length, the room
    left for open chains (``stats[g][0]``: a cycle of length ``m`` still allowed
    can hold at most ``m // 2`` disjoint chains of two or more sheets, which may
    merge into it later) and the open chains (``stats[g][1]``); it forces
    the images this leaves no choice about: a chain as long as the longest
    allowed cycle closes, and once no chain is open and no longer cycle is
    allowed every remaining sheet is fixed.  ``words[g]`` lists the rotations of
    the relator beginning with the letter ``g`` or ``g^-1``, each letter given by
    its forward and backward arrays.  New images wait in ``todo`` to be traced.
    """

    __slots__ = ("k", "img", "pre", "caps", "longest", "closed", "stats", "trail", "todo", "words")

    def __init__(self, k: int, gen_allow: list[Allowance],
                 relator: tuple[tuple[int, int], ...] | None) -> None:
        r = len(gen_allow)
        self.k = k
        self.img = [[-1] * k for _ in range(r)]
        self.pre = [[-1] * k for _ in range(r)]
        self.caps = [None if a is None else [a.get(m, 0) for m in range(k + 1)] for a in gen_allow]
        self.longest = [k if c is None else max((m for m in range(k + 1) if c[m] > 0), default=0)
                        for c in self.caps]
        self.closed = [[0] * (k + 1) for _ in range(r)]
        self.stats = [[0 if c is None else sum(c[m] * (m // 2) for m in range(2, k + 1)), 0]
                      for c in self.caps]
        self.trail: list[tuple[int, int, int, int]] = []
        self.todo: list[tuple[int, int]] = []
        self.words = _rotations(relator, r, self.img, self.pre)

    def start(self) -> bool:
        """Fix every sheet of the generators whose type is the identity."""
        for g, st in enumerate(self.stats):
            if self.caps[g] is not None and st[0] == 0 and not self._fill(g):
                return False
        self.todo.clear()
        return True

    def define(self, g: int, x: int, y: int) -> bool:
        """Set ``g: x -> y`` (``x`` without image, ``y`` without preimage) and
        what it forces, unless a prescribed type forbids it."""
        row, back, cap, st = self.img[g], self.pre[g], self.caps[g], self.stats[g]
        if cap is None:
            row[x], back[y] = y, x
            self.trail.append((g, x, 0, 0))
            self.todo.append((g, x))
            return True
        length = _closing_length(row, back, x, y)
        if length > 0:
            return self._close(g, x, y, length)
        if -length >= self.longest[g]:
            return False
        grown = (back[x] < 0) + (row[y] < 0) - 1
        if st[1] + grown > st[0]:
            return False
        st[1] += grown
        row[x], back[y] = y, x
        self.trail.append((g, x, 0, grown))
        self.todo.append((g, x))
        if 1 - length < self.longest[g]:
            return True
        while row[y] >= 0:
            y = row[y]
        while back[x] >= 0:
            x = back[x]
        return self.define(g, y, x)

    def _close(self, g: int, x: int, y: int, length: int) -> bool:
        """Set ``g: x -> y`` closing a cycle of the given length."""
        closed, st = self.closed[g], self.stats[g]
        if closed[length] >= self.caps[g][length]:
            return False
        closed[length] += 1
        if length > 1:
            st[0] -= length // 2
            st[1] -= 1
        self.img[g][x], self.pre[g][y] = y, x
        self.trail.append((g, x, length, 0))
        self.todo.append((g, x))
        return length == 1 or st[0] > 0 or st[1] > 0 or self._fill(g)

    def _fill(self, g: int) -> bool:
        """Fix every sheet still without an image under ``g``."""
        row = self.img[g]
        return all(row[z] >= 0 or self._close(g, z, z, 1) for z in range(self.k))

    def undo(self, mark: int) -> None:
        """Forget every image set since the trail had length ``mark``."""
        trail, img, pre, closed, stats = self.trail, self.img, self.pre, self.closed, self.stats
        while len(trail) > mark:
            g, x, length, grown = trail.pop()
            pre[g][img[g][x]] = -1
            img[g][x] = -1
            if length:
                closed[g][length] -= 1
                if length > 1:
                    stats[g][0] += length // 2
                    stats[g][1] += 1
            else:
                stats[g][1] -= grown

    def deduce(self) -> bool:
        """Trace the relator through every new image and through every image
        it forces; ``False`` (and ``todo`` emptied) on a contradiction."""
        words, img, todo = self.words, self.img, self.todo
        if words is None:
            todo.clear()
            return True
        while todo:
            g, x = todo.pop()
            y = img[g][x]
            for sign, word in words[g]:
                if not self._scan(word, x if sign > 0 else y):
                    todo.clear()
                    return False
        return True

    def _scan(self, word: tuple, p: int) -> bool:
        """Trace ``word`` (which must return) forwards and backwards from ``p``;
        define the one missing image if only one is missing."""
        x, m, size = p, 0, len(word)
        while m < size:
            y = word[m][0][x]
            if y < 0:
                break
            x, m = y, m + 1
        else:
            return x == p
        y, top = p, size
        while top > m:
            z = word[top - 1][1][y]
            if z < 0:
                break
            y, top = z, top - 1
        if top > m + 1:
            return True
        if top == m:
            return False
        # one letter missing: its forward image at x and (the backward scan
        # stopped there) its backward image at y are both undefined
        g, sign = word[m][2:]
        if sign < 0:
            x, y = y, x
        return self.define(g, x, y)


def _rotations(relator: tuple[tuple[int, int], ...] | None, r: int,
               img: list[list[int]], pre: list[list[int]]) -> list[list[tuple]] | None:
    """For each generator, the rotations of ``relator`` starting at one of its
    letters, as ``(sign, ((forward, backward, g, sign), ...))``."""
    if relator is None:
        return None
    letters = [(img[g], pre[g], g, s) if s > 0 else (pre[g], img[g], g, s) for g, s in relator]
    words: list[list[tuple]] = [[] for _ in range(r)]
    for m, (g, s) in enumerate(relator):
        words[g].append((s, tuple(letters[m:] + letters[:m])))
    return words


def _closing_length(row: list[int], back: list[int], i: int, j: int) -> int:
    """Setting ``i -> j``: the length of the cycle it closes (positive), or minus
    the number of arrows in the open chain it makes (which then needs a cycle
    longer than that).

    >>> _closing_length([-1, 2, -1], [-1, -1, 1], 2, 1), _closing_length([-1] * 3, [-1] * 3, 0, 1)
    (2, -1)
    """
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


def _canonical_forms(k: int, gen_allow: list[Allowance],
                     relator: tuple[tuple[int, int], ...] | None = None
                     ) -> list[tuple[tuple[Perm, ...], tuple[Perm, ...]]]:
    """Transitive tuples in breadth-first normal form from sheet 0 that are
    least among the normal forms from all start sheets, with their centralisers.

    Forms are compared in slot order (sheet-major: the images of sheet 0 under
    each generator, then of sheet 1, ...), the order in which the search fills
    them, so a partial tuple is cut as soon as some start sheet is provably
    smaller (Sims).

    >>> [rows for rows, cent in _canonical_forms(2, [None, None])]
    [((0, 1), (1, 0)), ((1, 0), (0, 1)), ((1, 0), (1, 0))]
    """
    r = len(gen_allow)
    if r == 0:
        return [((), ((0,),))] if k == 1 else []
    table = _Table(k, gen_allow, relator)
    out: list[tuple[tuple[Perm, ...], tuple[Perm, ...]]] = []
    if table.start():
        _grow(0, 1, tuple(range(1, k)), table, out)
    return out


def _grow(slot: int, reached: int, alive: tuple[int, ...], table: _Table,
          out: list[tuple[tuple[Perm, ...], tuple[Perm, ...]]]) -> None:
    """Fill the first undefined slot at or after ``slot`` in every way (an
    already reached sheet or the next new one) and recurse."""
    img, pre, k = table.img, table.pre, table.k
    r = len(img)
    end = k * r
    while slot < end and img[slot % r][slot // r] >= 0:
        slot += 1
    if slot == end:
        if reached == k:
            out.append((tuple(tuple(row) for row in img), _centraliser(img, alive, k)))
        return
    i, g = divmod(slot, r)
    if i >= reached:
        return
    row, back, mark = img[g], pre[g], len(table.trail)
    plain = table.words is None and table.caps[g] is None
    for j in range(min(reached + 1, k)):
        if back[j] >= 0:
            continue
        if plain:
            row[i], back[j] = j, i
        elif not (table.define(g, i, j) and table.deduce()):
            table.undo(mark)
            continue
        still = _still_least(img, alive, k)
        if still is not None:
            _grow(slot + 1, max(reached, j + 1), still, table, out)
        if plain:
            row[i], back[j] = -1, -1
        else:
            table.undo(mark)


def _still_least(img: list[list[int]], alive: tuple[int, ...], k: int) -> tuple[int, ...] | None:
    """``None`` if some start sheet in ``alive`` gives a smaller form; otherwise
    the starts not yet known to give a larger one."""
    still = []
    for start in alive:
        sign = _compare_from(img, start, k)[0]
        if sign < 0:
            return None
        if sign == 0:
            still.append(start)
    return tuple(still)


def _compare_from(img: list[list[int]], start: int, k: int) -> tuple[int, list[int]]:
    """Compare, in slot order and as far as both are defined, the normal form
    from ``start`` with the form from 0 (``img`` itself): -1 smaller, 1 larger,
    0 equal so far; also the old sheet at each new label."""
    new = [-1] * k
    new[start] = 0
    old = [start]
    for i in range(k):
        if i >= len(old):
            return 0, old
        p = old[i]
        for row in img:
            q, c = row[p], row[i]
            if q < 0 or c < 0:
                return 0, old
            v = new[q]
            if v < 0:
                v = new[q] = len(old)
                old.append(q)
            if v != c:
                return (-1 if v < c else 1), old
    return 0, old


def _centraliser(img: list[list[int]], alive: tuple[int, ...], k: int) -> tuple[Perm, ...]:
    """At a complete least form, the maps sending 0 to a start with the same
    form (every start left in ``alive`` gives the same form)."""
    cent = [tuple(range(k))]
    for start in alive:
        cent.append(tuple(_compare_from(img, start, k)[1]))
    return tuple(cent)
