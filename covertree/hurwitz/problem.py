"""Hurwitz problems: degree, target genus, profiles at labelled branch points.

Riemann-Hurwitz (connected source of genus ``g``, target of genus ``h``):
``2g - 2 = d(2h - 2) + sum_j (d - len(mu_j))``.

Branch points are labelled ``1..b`` in the order of ``profiles``.  The target
``(h, b)`` must be a stable pointed curve (``2h - 2 + b > 0``); to count
unramified covers of an elliptic curve, mark one point with profile ``1^d``.

References
----------
A. Hurwitz, "Uber Riemann'sche Flachen mit gegebenen Verzweigungspunkten",
Mathematische Annalen 39 (1891): the Riemann-Hurwitz formula

Examples
--------
>>> p = HurwitzProblem.build(degree=2, target_genus=1, genus=2)
>>> p.profiles
(Partition(2), Partition(2))
>>> HurwitzProblem.build(degree=3, target_genus=0, profiles=["3", "3", "3"]).genus
1
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass

from covertree.errors import ProblemError, ProfileError
from covertree.hurwitz.marks import MarkError, legs_from_specs
from covertree.symmetric.partitions import Partition, simple


def _as_partition(p: Partition | str | Iterable[int]) -> Partition:
    if isinstance(p, Partition):
        return p
    if isinstance(p, str):
        return Partition.parse(p)
    return Partition(p)


def branching(degree: int, profiles: Sequence[Partition]) -> int:
    """Total ramification ``sum_j (d - len(mu_j))``.

    >>> branching(3, [Partition([2, 1]), Partition([3])])
    3
    """
    return sum(degree - len(mu) for mu in profiles)


def source_genus(degree: int, target_genus: int, profiles: Sequence[Partition]) -> int:
    """Genus of a connected source by Riemann-Hurwitz.

    Raises
    ------
    ProblemError
        If the Euler characteristic is odd or the genus negative.
    """
    twice = degree * (2 * target_genus - 2) + branching(degree, profiles) + 2
    if twice % 2:
        raise ProblemError(
            f"Riemann-Hurwitz gives genus {twice}/2 for degree {degree}, "
            f"target genus {target_genus} and profiles {_show(profiles)}: "
            "the total ramification must be even"
        )
    if twice < 0:
        raise ProblemError(f"Riemann-Hurwitz gives negative genus {twice // 2}")
    return twice // 2


def _show(profiles: Sequence[Partition]) -> str:
    return " ".join(f"({p})" for p in profiles) or "(none)"


@dataclass(frozen=True)
class HurwitzProblem:
    """A Hurwitz problem with every profile filled in.

    Use :meth:`build` to fill in simple branch points from a genus.  Attributes
    are ``genus`` (source), ``target_genus``, ``degree``, ``profiles`` (one
    :class:`Partition` per labelled branch point, in order) and ``marks``: the
    legs of the source, one ``(J, e)`` per leg in leg order, a point of index
    ``e`` over branch point ``J`` (:mod:`covertree.hurwitz.marks`; empty for
    an unmarked source).
    """

    genus: int
    target_genus: int
    degree: int
    profiles: tuple[Partition, ...]
    marks: tuple[tuple[int, int], ...] = ()

    def __post_init__(self) -> None:
        _check_degree(self.degree)
        if self.target_genus < 0:
            raise ProblemError(f"target genus {self.target_genus} is negative; allowed: 0, 1, 2, ...")
        for mu in self.profiles:
            if mu.size != self.degree:
                raise ProfileError(
                    f"profile {mu} sums to {mu.size}, not to the degree {self.degree}"
                )
        if source_genus(self.degree, self.target_genus, self.profiles) != self.genus:
            raise ProblemError(f"genus {self.genus} does not satisfy Riemann-Hurwitz")
        b = len(self.profiles)
        if 2 * self.target_genus - 2 + b <= 0:
            raise ProblemError(
                f"the target of genus {self.target_genus} with {b} marked point(s) is not "
                "stable (need 2h - 2 + b > 0); mark an unramified point with profile "
                f"1^{self.degree} to count unramified covers"
            )
        self._check_marks()

    def _check_marks(self) -> None:
        object.__setattr__(self, "marks", tuple((int(j), int(e)) for j, e in self.marks))
        for j, e in self.marks:
            if not 1 <= j <= len(self.profiles) or e not in self.profiles[j - 1]:
                raise MarkError(f"mark ({j}, {e}) names no point: need a branch point 1 .. {len(self.profiles)} "
                                "and an index in its profile")
        for j, e in set(self.marks):
            if self.marks.count((j, e)) > tuple(self.profiles[j - 1]).count(e):
                raise MarkError(f"{self.marks.count((j, e))} legs of index {e} over branch point {j}; "
                                f"its profile {self.profiles[j - 1]} has fewer such points")
        if list(self.marks) != sorted(self.marks, key=lambda m: (m[0], -m[1])):
            raise MarkError("marks must be in leg order: by branch point, then by decreasing index")

    @classmethod
    def build(
        cls,
        degree: int,
        target_genus: int,
        genus: int | None = None,
        profiles: Iterable[Partition | str | Iterable[int]] = (),
        marks: Iterable[str] = (),
    ) -> "HurwitzProblem":
        """Fill in simple branch points (after the given ones) to reach ``genus``;
        with ``genus=None`` the profiles are complete and the genus is derived.
        ``marks`` are ``--mark`` specifications (:mod:`covertree.hurwitz.marks`),
        read after the fill-in.

        >>> HurwitzProblem.build(3, 0, genus=0, profiles=["3"]).profiles
        (Partition(3), Partition(2, 1), Partition(2, 1))
        >>> HurwitzProblem.build(2, 0, genus=2, marks=["1"]).marks
        ((1, 2),)
        """
        plain = cls._build(degree, target_genus, genus, profiles)
        marks = list(marks)
        if not marks:
            return plain
        legs = legs_from_specs([tuple(p) for p in plain.profiles], marks)
        return cls(plain.genus, plain.target_genus, plain.degree, plain.profiles, legs)

    @classmethod
    def _build(cls, degree: int, target_genus: int, genus: int | None,
               profiles: Iterable[Partition | str | Iterable[int]]) -> "HurwitzProblem":
        _check_degree(degree)
        given = [_as_partition(p) for p in profiles]
        for mu in given:
            if mu.size != degree:
                raise ProfileError(f"profile {mu} sums to {mu.size}, not to the degree {degree}")
        if genus is None:
            return cls(source_genus(degree, target_genus, given), target_genus, degree, tuple(given))
        if genus < 0:
            raise ProblemError(f"genus {genus} is negative; allowed: 0, 1, 2, ...")
        missing = 2 * genus - 2 - degree * (2 * target_genus - 2) - branching(degree, given)
        if missing < 0:
            allowed = 2 * genus - 2 - degree * (2 * target_genus - 2)
            raise ProblemError(
                f"genus {genus} is too small for degree {degree}, target genus {target_genus} "
                f"and profiles {_show(given)}: their total ramification "
                f"{branching(degree, given)} exceeds the {allowed} that Riemann-Hurwitz allows"
            )
        if missing and degree < 2:
            raise ProblemError(f"genus {genus} needs branching, impossible in degree 1")
        return cls(genus, target_genus, degree, tuple(given + [simple(degree)] * missing))

    @property
    def points(self) -> int:
        """Number of labelled branch points ``b``."""
        return len(self.profiles)

    @property
    def n_marks(self) -> int:
        """Number of legs ``n`` of the source (marked points)."""
        return len(self.marks)

    @property
    def has_source_space(self) -> bool:
        """Whether ``Mbar_{g,n}`` of the source exists (``2g - 2 + n > 0``).

        When it does not (genus 0 with at most two legs, genus 1 without
        legs), the "stable source" of a cover is the source contracted as far
        as the stabilisation rules go, not a point of a moduli space.

        >>> HurwitzProblem.build(2, 0, genus=1).has_source_space
        False
        >>> HurwitzProblem.build(2, 0, genus=1, marks=["1"]).has_source_space
        True
        """
        return 2 * self.genus - 2 + self.n_marks > 0

    def unmarked(self) -> "HurwitzProblem":
        """The same problem without marks."""
        return HurwitzProblem(self.genus, self.target_genus, self.degree, self.profiles)

    def to_dict(self) -> dict:
        """``{"genus", "target_genus", "degree", "profiles"}`` for JSON output,
        and ``"marks"`` (``[J, e]`` per leg) when the source is marked."""
        out = {
            "genus": self.genus,
            "target_genus": self.target_genus,
            "degree": self.degree,
            "profiles": [list(p) for p in self.profiles],
        }
        if self.marks:
            out["marks"] = [list(m) for m in self.marks]
        return out


def _check_degree(degree: int) -> None:
    if not isinstance(degree, int) or degree < 1:
        raise ProblemError(f"degree {degree!r} is not allowed; the degree must be a positive integer")
