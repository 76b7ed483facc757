"""Is a port matching the least word of its orbit?

The list engine (:mod:`covertree.gluing.covers`) reads a matching ``M`` of one
choice of local covers as the word ``M(x_1) M(x_2) ...`` over its left ports,
letters compared as ``(piece, cycle)`` of the matched candidate, and the group
``G`` of relabellings keeping the choice (twin pieces permuted, each piece
moved by its deck group) acts by ``(gM)(x) = g(M(g^-1 x))``.  Writing
``h = g^-1``, the letter of ``gM`` at ``x_i`` is ``h^-1(M(h(x_i)))``.

Method
------
:func:`has_lesser` looks for an ``h`` whose word is less than ``M``'s by a
depth-first search over the positions ``i = 1, 2, ...``, defining ``h`` piece
by piece as it is needed: at ``x_i`` on piece ``j`` (if ``h(j)`` is not yet
defined) every twin ``j'`` not yet an image and every deck action is tried;
then ``z = M(h(x_i))`` on piece ``k`` is read, and ``h^-1(z)`` is taken on a
twin of ``k`` that is not yet a source (if ``h^-1(k)`` is not yet defined).  A
branch whose letter is greater is cut, a lesser letter answers yes, and an
equal letter goes on to ``i + 1``.  A partially defined ``h`` with distinct
images within each class of twins always extends to an element of ``G``, so
every letter compared is a letter of some ``gM``, and every ``g`` is met along
some branch: the answer is exact for a complete matching.

For a partial matching (the ports ``x_1 .. x_{s-1}`` matched) a branch stops,
answering no, at the first position whose letter it cannot read (``x_i`` or
``h(x_i)`` unmatched).  A yes is still a proof: every completion ``M'`` of the
partial matching has ``gM' < M'`` for the ``g`` found, since both words are
already read up to the first position where they differ.

Only the action of the deck group on ports matters, so deck transformations
acting alike on the ports are tried once.
"""

from __future__ import annotations

from collections.abc import Sequence

from covertree.gluing.structure import Port

#: A deck action on one piece's ports, ``(point, cycle) -> cycle``, and its inverse.
Action = tuple[dict[tuple[int, int], int], dict[tuple[int, int], int]]


class OrbitTest:
    """The group ``G`` of one choice of local covers acting on its matchings.

    Parameters
    ----------
    positions : sequence of Port
        The left ports ``x_1, x_2, ...`` in the order of the word.
    classes : sequence of sequence of int
        Per piece, its class of twins (itself included), in increasing order.
    actions : sequence of sequence of dict
        Per piece, every deck action on its ports ``(point, cycle) ->
        cycle``, the identity included; twins have the same actions.
    """

    def __init__(self, positions: Sequence[Port], classes: Sequence[Sequence[int]],
                 actions: Sequence[Sequence[dict[tuple[int, int], int]]]) -> None:
        self.positions = list(positions)
        self.classes = [list(c) for c in classes]
        self.actions = [_distinct(acts) for acts in actions]
        self.fwd: list[tuple[int, Action] | None] = [None] * len(self.classes)
        self.inv: list[tuple[int, Action] | None] = [None] * len(self.classes)
        self.partner: dict[Port, Port] = {}
        self.left: int | None = None

    def has_lesser(self, partner: dict[Port, Port], budget: int | None = None) -> bool | None:
        """Whether some ``g`` in ``G`` gives a word less than the matching
        ``partner``'s (exact for a complete matching; for a partial one, yes
        only when every completion has a lesser word in its orbit); ``None``
        when more than ``budget`` letters would be compared."""
        self.partner = partner
        self.left = budget
        try:
            return self._position(0)
        except _OverBudget:
            self.fwd = [None] * len(self.classes)
            self.inv = [None] * len(self.classes)
            return None

    def _position(self, i: int) -> bool:
        if i == len(self.positions):
            return False
        x = self.positions[i]
        if x not in self.partner:
            return False
        j = x[0]
        if self.fwd[j] is not None:
            image, act = self.fwd[j]
            return self._letter(i, x, image, act)
        for image in self.classes[j]:
            if self.inv[image] is None:
                for act in self.actions[j]:
                    self.fwd[j], self.inv[image] = (image, act), (j, act)
                    found = self._letter(i, x, image, act)
                    self.fwd[j] = self.inv[image] = None
                    if found:
                        return True
        return False

    def _letter(self, i: int, x: Port, image: int, act: Action) -> bool:
        """Read ``z = M(h(x_i))`` and compare ``h^-1(z)`` with ``M(x_i)``."""
        if self.left is not None:
            self.left -= 1
            if self.left < 0:
                raise _OverBudget
        z = self.partner.get((image, x[1], act[0][x[1:]]))
        if z is None:
            return False
        k, q, d = z
        goal, _q, cycle = self.partner[x]
        if self.inv[k] is not None:
            source, back = self.inv[k]
            return self._compare(i, (source, back[1][(q, d)]), (goal, cycle))
        # h^-1(k) is free among the twins of k that are not yet sources: a
        # lesser free twin than the goal gives a lesser letter at once, and
        # only the goal itself can give an equal one
        free = [s for s in self.classes[k] if self.fwd[s] is None]
        if free[0] < goal:
            return True
        if goal not in free:
            return False
        for back in self.actions[k]:
            letter = back[1][(q, d)]
            if letter < cycle:
                return True
            if letter == cycle:
                self.fwd[goal], self.inv[k] = (k, back), (goal, back)
                found = self._position(i + 1)
                self.fwd[goal] = self.inv[k] = None
                if found:
                    return True
        return False

    def _compare(self, i: int, letter: tuple[int, int], target: tuple[int, int]) -> bool:
        if letter != target:
            return letter < target
        return self._position(i + 1)


class _OverBudget(Exception):
    """The search compared more letters than it was allowed."""


def _distinct(acts: Sequence[dict[tuple[int, int], int]]) -> list[Action]:
    """The distinct actions, each with its inverse, the identity first."""
    out, seen = [], set()
    for act in acts:
        key = tuple(sorted(act.items()))
        if key not in seen:
            seen.add(key)
            out.append((act, {(p, c2): c for (p, c), c2 in act.items()}))
    return out
