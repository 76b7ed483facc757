"""Families of Hurwitz problems indexed by the degree.

A family fixes the source genus (or leaves it to Riemann–Hurwitz), the target
genus and the *shape* of the given profiles; simple branch points are filled
in as for :meth:`covertree.hurwitz.problem.HurwitzProblem.build`.

Shape notation (one string per given branch point), parts separated by commas:

``INT``
    a part of that size;
``d`` or ``d-INT``
    a part depending on the degree;
``PART^INT``
    that part repeated;
``PART^*``
    that part repeated to fill up the degree (at most one per shape).

So ``1^*`` is an unramified point, ``2,1^*`` a simple one, ``d`` total
ramification, ``d-1,1`` and ``3,1^*`` as they read.

At a degree where a shape does not fit (its parts exceed the degree, a part
is not positive, or parts without a filler do not add up to it) or
Riemann–Hurwitz allows no cover (the genus would need negative branching or
branching in degree 1; with the genus left free, an odd total ramification or a
negative genus), the family has no problem: every count there is 0.

Examples
--------
>>> shape = ProfileShape.parse("2,1^*")
>>> shape.at(4), shape.at(1)
(Partition(2, 1, 1), None)
>>> fam = Family(genus=2, target_genus=1)
>>> [p.profiles if p else None for p in (fam.problem(1), fam.problem(2))]
[None, (Partition(2), Partition(2))]
"""

from __future__ import annotations

import re
from dataclasses import dataclass

from covertree.errors import InputError
from covertree.hurwitz.problem import HurwitzProblem, branching
from covertree.symmetric.partitions import Partition

__all__ = ["Family", "ProfileShape"]

_PART = re.compile(r"^\s*(d\s*(?:-\s*(\d+))?|\d+)\s*(?:\^\s*(\d+|\*))?\s*$")


@dataclass(frozen=True)
class ProfileShape:
    """A profile as a function of the degree (see the module docstring).

    Attributes
    ----------
    parts : tuple of (offset, from_degree, repeat)
        Each part is ``offset`` (``from_degree`` false) or ``d - offset``
        (``from_degree`` true); ``repeat`` is a count or ``None`` for the filler.
    text : str
        The notation it was parsed from.
    """

    parts: tuple[tuple[int, bool, int | None], ...]
    text: str

    @classmethod
    def parse(cls, text: str) -> "ProfileShape":
        """Parse ``"2,1^*"``, ``"d"``, ``"d-2,2"``...

        Raises
        ------
        InputError
            Naming the malformed part and what is allowed.

        Examples
        --------
        >>> ProfileShape.parse("d-1, 1").at(5)
        Partition(4, 1)
        >>> ProfileShape.parse("2^*,1")
        Traceback (most recent call last):
        ...
        covertree.errors.InputError: profile shape '2^*,1': only a part of size 1 may fill up the degree (write 1^*)
        """
        parts = []
        for token in str(text).split(","):
            m = _PART.match(token)
            if not m:
                raise InputError(
                    f"profile shape {text!r}: part {token.strip()!r} is not INT, d or d-INT, optionally "
                    "followed by ^INT or ^* (for example 2,1^* or d-1,1)"
                )
            from_degree = m.group(1).strip().startswith("d")
            size = int(m.group(2) or 0) if from_degree else int(m.group(1))
            repeat = None if m.group(3) == "*" else int(m.group(3) or 1)
            parts.append((size, from_degree, repeat))
        _check_fillers(text, parts)
        return cls(tuple(parts), str(text).replace(" ", ""))

    def at(self, degree: int) -> Partition | None:
        """The profile in this degree, or ``None`` where the shape does not fit."""
        fixed = []
        for size, from_degree, repeat in self.parts:
            part = degree - size if from_degree else size
            if part < 1:
                return None
            if repeat is not None:
                fixed += [part] * repeat
        left = degree - sum(fixed)
        if left < 0 or (left and not any(r is None for *_, r in self.parts)):
            return None
        return Partition(sorted(fixed + [1] * left, reverse=True))


def _check_fillers(text: str, parts: list) -> None:
    fillers = [p for p in parts if p[2] is None]
    if len(fillers) > 1:
        raise InputError(f"profile shape {text!r}: at most one part may fill up the degree (^*)")
    if fillers and fillers[0][:2] != (1, False):
        raise InputError(f"profile shape {text!r}: only a part of size 1 may fill up the degree (write 1^*)")


@dataclass(frozen=True)
class Family:
    """Hurwitz problems of every degree with a fixed source genus (``None``:
    from Riemann–Hurwitz), target genus and profile shapes.

    Examples
    --------
    Unramified covers of an elliptic curve (one marked unramified point):

    >>> fam = Family(genus=1, target_genus=1, shapes=(ProfileShape.parse("1^*"),))
    >>> fam.problem(3).profiles
    (Partition(1, 1, 1),)
    """

    genus: int | None
    target_genus: int
    shapes: tuple[ProfileShape, ...] = ()

    def __post_init__(self) -> None:
        if not isinstance(self.target_genus, int) or self.target_genus < 0:
            raise InputError(f"target genus {self.target_genus!r} is not allowed; allowed: 0, 1, 2, ...")
        if self.genus is not None and (not isinstance(self.genus, int) or self.genus < 0):
            raise InputError(f"genus {self.genus!r} is not allowed; allowed: 0, 1, 2, ...")

    def problem(self, degree: int) -> HurwitzProblem | None:
        """The problem in this degree, or ``None`` when there are no covers.

        Raises
        ------
        ProblemError
            When the target is not stable (the family makes no sense).
        """
        given = [shape.at(degree) for shape in self.shapes]
        if any(p is None for p in given):
            return None
        ramification = branching(degree, given)
        if self.genus is None:
            if ramification % 2 or degree * (2 * self.target_genus - 2) + ramification < -2:
                return None
            return HurwitzProblem.build(degree, self.target_genus, profiles=given)
        missing = 2 * self.genus - 2 - degree * (2 * self.target_genus - 2) - ramification
        if missing < 0 or (missing and degree < 2):
            return None
        return HurwitzProblem.build(degree, self.target_genus, genus=self.genus, profiles=given)

    def to_dict(self) -> dict:
        """``{"genus", "target_genus", "shapes"}`` (shapes as their notation)."""
        return {"genus": self.genus, "target_genus": self.target_genus, "shapes": [s.text for s in self.shapes]}
