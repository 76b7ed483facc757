"""Sweeps over many Hurwitz problems: the plan (problems and tasks) and the
computation of one task.

A *sweep* is the product of ranges of source genera, target genera and
degrees (with optional given profiles, completed by simple branch points).
Every problem of the product that Riemann-Hurwitz allows is *planned*; the
others are *skipped* with the reason.  A *task* is one pair (problem, base
stratum): problems in lexicographic order of ``(genus, target_genus, degree,
profiles)``, strata in the order of
:func:`covertree.catalogue.catalogue.select_strata`.  Task indices
``0, 1, ...`` follow that order, so a plan is the same on every machine.

The result of a task is a :class:`StratumSummary`: the number of covers over
a fixed curve of the stratum, their total weight ``sum mult/|Aut|``, the
Hurwitz number (the degeneration identity compares the two, docs/theory.md,
section 7) and the weight landing on each boundary divisor ``delta_i`` of the
source space ``Mbar_g`` after stabilisation (the rest, including smooth
stable sources, as ``"other"``).

References
----------
J. Harris and D. Mumford, *On the Kodaira dimension of the moduli space of
curves*, Invent. Math. 67 (1982): admissible covers.

Examples
--------
>>> spec = SweepSpec(genera=(2,), target_genera=(1,), degrees=(1, 2))
>>> plan = plan_sweep(spec)
>>> [s.degree for s in plan.skipped], len(plan.problems), len(plan.tasks)
([1], 1, 3)
>>> summary = compute_task(plan.tasks[2])
>>> summary.stratum, summary.n_covers, str(summary.total_weight), summary.identity_holds
('g0{1,2}, g1 | 0-1', 4, '2', True)
>>> [(name, str(w)) for name, w in summary.landing]
[('delta_0', '3/2'), ('delta_1', '1/2'), ('other', '0')]
"""

from __future__ import annotations

import re
import sys
from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from fractions import Fraction
from itertools import product

from covertree.catalogue.catalogue import iter_stratum, problem_hurwitz, select_strata
from covertree.catalogue.covers import divisor_name
from covertree.errors import InputError, ProblemError, ProfileError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.strata.base import BaseStratum
from covertree.symmetric.partitions import Partition
from covertree.tallies.types import tally_stratum
from covertree.limits import MAX_DIGITS

__all__ = [
    "SweepSpec", "Skipped", "Task", "Plan", "StratumSummary", "plan_sweep", "compute_task",
    "divisor_names", "largest_first", "problem_order", "shard_tasks", "parse_shard",
]

#: The name of the landing column that collects every stable source which is
#: not a boundary divisor ``delta_i`` (smooth sources, deeper strata, genus < 2).
OTHER = "other"


#: The engines a sweep can run: covers listed, or tallies from types.
ENGINES = ("list", "types")


@dataclass(frozen=True)
class SweepSpec:
    """The ranges of a sweep.

    ``genera`` is ``(None,)`` when the genus is derived from complete
    ``profiles``; ``labeled`` lists every labelled base stratum instead of one
    per orbit of equal-profile relabellings.

    Examples
    --------
    >>> s = SweepSpec(genera=(3, 2), target_genera=(1,), degrees=(2,), profiles=("2",))
    >>> s.genera, s.profiles
    ((2, 3), (Partition(2),))
    >>> SweepSpec.from_dict(s.to_dict()) == s
    True
    """

    genera: tuple[int | None, ...]
    target_genera: tuple[int, ...]
    degrees: tuple[int, ...]
    profiles: tuple[Partition, ...] = ()
    codim: int = 1
    labeled: bool = False
    engine: str = "list"

    def __post_init__(self) -> None:
        genera = tuple(sorted(set(self.genera), key=lambda g: -1 if g is None else g))
        object.__setattr__(self, "genera", genera or (None,))
        object.__setattr__(self, "target_genera", tuple(sorted(set(self.target_genera))))
        object.__setattr__(self, "degrees", tuple(sorted(set(self.degrees))))
        object.__setattr__(self, "profiles", tuple(_partition(p) for p in self.profiles))
        if not self.target_genera or not self.degrees:
            raise InputError("a sweep needs at least one target genus and one degree")
        if self.codim < 0:
            raise InputError(f"codimension {self.codim} is negative; allowed: 0, 1, 2, ...")
        if self.engine not in ENGINES:
            raise InputError(f"engine {self.engine!r} is unknown; allowed: {', '.join(ENGINES)}")

    @property
    def grouping(self) -> str:
        """``"labeled"`` or ``"orbit"``: how base strata are listed (with
        ``"+types"`` appended for the type engine, whose results carry no cover
        counts, so that a store keeps the two apart)."""
        return ("labeled" if self.labeled else "orbit") + ("+types" if self.engine == "types" else "")

    def to_dict(self) -> dict:
        """JSON-ready form (``genus`` is ``null`` when derived from the profiles)."""
        return {
            "genus": None if self.genera == (None,) else list(self.genera),
            "target_genus": list(self.target_genera),
            "degree": list(self.degrees),
            "profiles": [list(p) for p in self.profiles],
            "codim": self.codim,
            "labeled": self.labeled,
            "engine": self.engine,
        }

    @classmethod
    def from_dict(cls, data: dict) -> "SweepSpec":
        """Inverse of :meth:`to_dict`.

        Raises
        ------
        InputError
            If a key is missing or malformed.
        """
        try:
            genera = (None,) if data["genus"] is None else tuple(int(g) for g in data["genus"])
            return cls(genera, tuple(data["target_genus"]), tuple(data["degree"]),
                       tuple(Partition(p) for p in data["profiles"]), int(data["codim"]),
                       bool(data["labeled"]), str(data.get("engine", "list")))
        except (KeyError, TypeError, ValueError) as error:
            raise InputError(f"not a sweep description: missing or malformed {error}") from None


def _partition(p: Partition | str | Iterable[int]) -> Partition:
    if isinstance(p, Partition):
        return p
    return Partition.parse(p) if isinstance(p, str) else Partition(p)


@dataclass(frozen=True)
class Skipped:
    """A problem of the sweep's product that Riemann-Hurwitz (or a profile of
    another degree) rules out, with the reason."""

    genus: int | None
    target_genus: int
    degree: int
    reason: str

    def to_dict(self) -> dict:
        """``{"genus", "target_genus", "degree", "reason"}``."""
        return {"genus": self.genus, "target_genus": self.target_genus, "degree": self.degree,
                "reason": self.reason}


@dataclass(frozen=True)
class Task:
    """One unit of work: a base stratum of a problem, with its global index in
    the plan and its position among the problem's strata."""

    index: int
    problem: HurwitzProblem
    base: BaseStratum
    position: int
    grouping: str = "orbit"

    @property
    def engine(self) -> str:
        """``"list"`` (covers listed one by one) or ``"types"`` (tallies from
        combinatorial types, no cover count)."""
        return "types" if self.grouping.endswith("+types") else "list"

    @property
    def label(self) -> str:
        """A short human-readable name, e.g. ``g2 h1 d3 g1{1,2}``."""
        p = self.problem
        return f"g{p.genus} h{p.target_genus} d{p.degree} {self.base.graph.notation}"


@dataclass(frozen=True)
class Plan:
    """Problems (sorted), skipped problems and tasks (in index order) of a sweep."""

    spec: SweepSpec
    problems: tuple[HurwitzProblem, ...]
    skipped: tuple[Skipped, ...]
    tasks: tuple[Task, ...]


def problem_order(problem: HurwitzProblem) -> tuple:
    """Sort key of problems: ``(genus, target_genus, degree, profiles)``.

    >>> a, b = HurwitzProblem.build(3, 1, genus=2), HurwitzProblem.build(2, 1, genus=3)
    >>> [p.degree for p in sorted([b, a], key=problem_order)]
    [3, 2]
    """
    return (problem.genus, problem.target_genus, problem.degree,
            tuple(tuple(mu) for mu in problem.profiles))


def _build(spec: SweepSpec, genus, target_genus, degree) -> HurwitzProblem | Skipped:
    try:
        return HurwitzProblem.build(degree, target_genus, genus=genus, profiles=spec.profiles)
    except (ProblemError, ProfileError) as error:
        return Skipped(genus, target_genus, degree, str(error))


def plan_sweep(spec: SweepSpec) -> Plan:
    """Every problem of the product, the skipped ones, and the task list.

    Raises
    ------
    GraphError
        From :func:`select_strata` (an unstable base cannot occur for a built
        problem, so this signals a bug).
    """
    built = [_build(spec, g, h, d) for g, h, d in product(spec.genera, spec.target_genera, spec.degrees)]
    problems = sorted({b for b in built if isinstance(b, HurwitzProblem)}, key=problem_order)
    skipped = tuple(b for b in built if isinstance(b, Skipped))
    tasks: list[Task] = []
    for problem in problems:
        for position, base in enumerate(select_strata(problem, spec.codim, labeled=spec.labeled)):
            tasks.append(Task(len(tasks), problem, base, position, spec.grouping))
    return Plan(spec, tuple(problems), skipped, tuple(tasks))


_ASCII_DIGITS = re.compile(r"0*[0-9]{1,%d}" % MAX_DIGITS, re.ASCII)


def _short(text: str, width: int = 30) -> str:
    return repr(text) if len(text) <= width else f"{text[:width]!r}... ({len(text)} characters)"


def parse_shard(text: str) -> tuple[int, int]:
    """Read ``I/N`` with ``1 <= I <= N``.

    Raises
    ------
    InputError
        Naming the value and the rule.

    Examples
    --------
    >>> parse_shard("2/3")
    (2, 3)
    >>> parse_shard("4/3")
    Traceback (most recent call last):
    ...
    covertree.errors.InputError: shard '4/3' is out of range: write I/N with 1 <= I <= N, e.g. 1/4
    """
    head, sep, tail = str(text).strip().partition("/")
    if not (sep and _ASCII_DIGITS.fullmatch(head.strip()) and _ASCII_DIGITS.fullmatch(tail.strip())):
        raise InputError(f"shard {_short(str(text))} is not of the form I/N (two positive integers of at most "
                         f"{MAX_DIGITS} digits in ASCII, e.g. 1/4)")
    i, n = int(head), int(tail)
    if not 1 <= i <= n:
        raise InputError(f"shard {text!r} is out of range: write I/N with 1 <= I <= N, e.g. 1/4")
    return i, n


def shard_tasks(tasks: Sequence[Task], index: int, count: int) -> tuple[Task, ...]:
    """The ``index``-th of ``count`` slices (1-based): tasks with
    ``task.index % count == index - 1``.

    >>> plan = plan_sweep(SweepSpec((2,), (1,), (2, 3)))
    >>> [t.index for t in shard_tasks(plan.tasks, 2, 4)]
    [1, 5]
    """
    return tuple(t for t in tasks if t.index % count == index - 1)


def largest_first(task: Task) -> tuple:
    """Sort key putting the probably slowest tasks first (degree plus number of
    branch points, descending), so that a pool does not end on one long task.

    >>> plan = plan_sweep(SweepSpec((2,), (1,), (2, 3)))
    >>> [t.index for t in sorted(plan.tasks, key=largest_first)]
    [3, 4, 5, 0, 1, 2]
    """
    return (-(task.problem.degree + task.problem.points), task.index)


def divisor_names(genus: int) -> list[str]:
    """Boundary divisors of ``Mbar_g``: ``delta_0 .. delta_{g // 2}`` (none for ``g < 2``).

    >>> divisor_names(4), divisor_names(1)
    (['delta_0', 'delta_1', 'delta_2'], [])
    """
    return [f"delta_{i}" for i in range(genus // 2 + 1)] if genus >= 2 else []


@dataclass(frozen=True)
class StratumSummary:
    """The tallies of one task (one row of a sweep's output).

    ``landing`` pairs each name of :func:`divisor_names` (then ``"other"``)
    with the summed weight of the covers whose stable source is that stratum;
    ``n_covers`` is ``None`` for the type engine, which does not list covers.
    """

    problem: HurwitzProblem
    stratum: str
    codim: int
    orbit_size: int
    n_covers: int | None
    hurwitz_number: Fraction
    landing: tuple[tuple[str, Fraction], ...]

    @property
    def total_weight(self) -> Fraction:
        """``sum_f mult(f)/|Aut f|`` over the stratum (the landing adds up to it)."""
        return sum((w for _, w in self.landing), Fraction(0))

    @property
    def identity_holds(self) -> bool:
        """The degeneration identity: total weight == Hurwitz number."""
        return self.total_weight == self.hurwitz_number


def compute_task(task: Task) -> StratumSummary:
    """Stream the covers over the task's stratum and tally them (no list is
    kept, so there is no limit on the number of covers).

    Raises
    ------
    IdentityError
        If a source has the wrong arithmetic genus (a bug).
    """
    problem, base = task.problem, task.base
    tally = dict.fromkeys([*divisor_names(problem.genus), OTHER], Fraction(0))
    n_covers = None
    if task.engine == "types":
        for graph, weight in tally_stratum(problem, base).by_source():
            _land(tally, divisor_name(graph), weight)
    else:
        n_covers = 0
        for cover in iter_stratum(problem, base, [sys.maxsize]):
            n_covers += 1
            _land(tally, cover.stable_source_name, cover.weight)
    return StratumSummary(problem, base.graph.notation, base.codim, base.orbit_size, n_covers,
                          problem_hurwitz(problem), tuple(tally.items()))


def _land(tally: dict[str, Fraction], name: str | None, weight: Fraction) -> None:
    """Add ``weight`` to the divisor ``name`` (or to ``"other"``)."""
    tally[name if name in tally else OTHER] += weight
