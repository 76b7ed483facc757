"""Disjoint sets on ``0..n-1`` (union-find), the one implementation of the package.

Used for orbits of permutation groups, connectedness of dual graphs and of
glued covers, and orbits of automorphism generators.  The representative of
a class is its least element, so that results built from it are
deterministic; finding compresses paths by halving.

References
----------
B. A. Galler and M. J. Fischer, "An improved equivalence algorithm",
Communications of the ACM 7 (1964): the union-find forest.
R. E. Tarjan and J. van Leeuwen, "Worst-case analysis of set union
algorithms", Journal of the ACM 31 (1984): path halving.

Examples
--------
>>> sets = DisjointSets(5)
>>> sets.union(3, 1), sets.union(1, 4), sets.union(4, 3)
(True, True, False)
>>> sets.roots(), sets.count()
([0, 1, 2, 1, 1], 3)
"""

from __future__ import annotations

__all__ = ["DisjointSets"]


class DisjointSets:
    """A partition of ``range(n)`` into classes, starting from singletons."""

    __slots__ = ("parent",)

    def __init__(self, n: int) -> None:
        self.parent = list(range(n))

    def find(self, i: int) -> int:
        """The representative (least element) of the class of ``i``."""
        parent = self.parent
        while parent[i] != i:
            parent[i] = parent[parent[i]]
            i = parent[i]
        return i

    def union(self, a: int, b: int) -> bool:
        """Merge the classes of ``a`` and ``b``; whether they were different."""
        ra, rb = self.find(a), self.find(b)
        if ra == rb:
            return False
        if ra < rb:
            self.parent[rb] = ra
        else:
            self.parent[ra] = rb
        return True

    def roots(self) -> list[int]:
        """The representative of each element, in order."""
        return [self.find(i) for i in range(len(self.parent))]

    def count(self) -> int:
        """The number of classes."""
        return sum(1 for i, p in enumerate(self.parent) if i == p)
