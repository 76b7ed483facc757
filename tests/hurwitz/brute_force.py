"""An independent brute-force Hurwitz counter over permutation tuples (tests only).

It counts tuples ``(a, b, s_1, ..., s_n)`` in ``S_d`` (the pair ``(a, b)`` only
for target genus 1) with ``[a, b] s_1 ... s_n = 1`` and ``s_j`` of cycle type
``mu_j``, and the transitive ones among them; dividing by ``d!`` gives the
disconnected and connected Hurwitz numbers in covertree's convention (labelled
branch points, weight ``1/|Aut|``, unlabelled preimages).  No characters are
used: only the permutation helpers of :mod:`covertree.symmetric.permutations`.

Two elementary savings keep it fast enough for ``d <= 5``:

* when ``n >= 1``, ``s_1`` is fixed to one element of its class and the count
  multiplied by the class size (simultaneous conjugation by ``S_d`` permutes the
  tuples with ``s_1`` in that class, preserving transitivity);
* for target genus 1, the solutions ``b`` of ``[a, b] = c`` are looked up in a
  table built once per degree from all pairs ``(a, b)``.
"""

from __future__ import annotations

from collections.abc import Sequence
from fractions import Fraction
from functools import lru_cache
from itertools import permutations
from math import factorial, prod

from covertree.symmetric.partitions import class_size
from covertree.symmetric.permutations import (
    commutator,
    compose,
    cycle_type,
    inverse,
    is_transitive,
)


class _Group:
    """S_d by index: elements, multiplication table, inverses, cycle types."""

    def __init__(self, d: int) -> None:
        self.d = d
        self.elements = list(permutations(range(d)))
        index = {p: i for i, p in enumerate(self.elements)}
        self.mult = [[index[compose(p, q)] for q in self.elements] for p in self.elements]
        self.inv = [index[inverse(p)] for p in self.elements]
        self.identity = index[tuple(range(d))]
        self.types = [cycle_type(p) for p in self.elements]
        self.classes: dict[tuple[int, ...], list[int]] = {}
        for i, t in enumerate(self.types):
            self.classes.setdefault(t, []).append(i)
        self._commutators: list[dict[int, list[int]]] | None = None

    def commutator_solutions(self) -> list[dict[int, list[int]]]:
        """``table[a][c]`` = the list of ``b`` with ``[a, b] = c``."""
        if self._commutators is None:
            index = {p: i for i, p in enumerate(self.elements)}
            table = []
            for p in self.elements:
                row: dict[int, list[int]] = {}
                for j, q in enumerate(self.elements):
                    row.setdefault(index[commutator(p, q)], []).append(j)
                table.append(row)
            self._commutators = table
        return self._commutators


@lru_cache(maxsize=None)
def _group(d: int) -> _Group:
    return _Group(d)


def cost(degree: int, target_genus: int, profiles: Sequence[Sequence[int]]) -> int:
    """Number of inner iterations :func:`count_tuples` will make (to skip big cases)."""
    sizes = [class_size(mu) for mu in profiles]
    inner = prod(sizes[1:-1]) if target_genus == 0 else prod(sizes[1:])
    return inner * (factorial(degree) if target_genus == 1 else 1)


def count_tuples(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> tuple[int, int]:
    """``(transitive, all)`` tuples for target genus 0 or 1."""
    if target_genus not in (0, 1):
        raise ValueError("the brute-force counter handles target genus 0 and 1 only")
    g = _group(degree)
    types = [tuple(sorted(mu, reverse=True)) for mu in profiles]
    if any(t not in g.classes for t in types):
        raise ValueError(f"profiles {profiles} are not cycle types of S_{degree}")
    elements, mult = g.elements, g.mult

    if types:
        first = g.classes[types[0]]
        starts, weight = [first[0]], len(first)
    else:
        starts, weight = [g.identity], 1

    transitive = total = 0
    if target_genus == 0:
        if not types:
            return (1 if degree == 1 else 0), 1

        def rec(j: int, product: int, chosen: list[int]) -> None:
            nonlocal transitive, total
            if j == len(types) - 1:
                last = g.inv[product]
                if g.types[last] != types[-1]:
                    return
                total += 1
                if is_transitive(degree, [elements[i] for i in chosen + [last]]):
                    transitive += 1
                return
            for s in g.classes[types[j]]:
                rec(j + 1, mult[product][s], chosen + [s])

        if len(types) == 1:
            for s in starts:
                if s == g.identity and types[0] == g.types[g.identity]:
                    total += 1
                    transitive += is_transitive(degree, [elements[s]])
        else:
            for s in starts:
                rec(1, s, [s])
        return transitive * weight, total * weight

    # target genus 1: [a, b] s_1 ... s_n = 1
    solutions = g.commutator_solutions()

    def tuples(j: int, product: int, chosen: list[int]):
        if j == len(types):
            yield product, chosen
            return
        for s in g.classes[types[j]]:
            yield from tuples(j + 1, mult[product][s], chosen + [s])

    for s0 in starts:
        seeds = tuples(1, s0, [s0]) if types else iter([(g.identity, [])])
        for product, chosen in seeds:
            c = g.inv[product]  # need [a, b] = (s_1 ... s_n)^-1
            for a in range(len(elements)):
                bs = solutions[a].get(c)
                if not bs:
                    continue
                total += len(bs)
                gens = [elements[a]] + [elements[i] for i in chosen]
                if is_transitive(degree, gens):
                    transitive += len(bs)
                else:
                    transitive += sum(
                        1 for b in bs if is_transitive(degree, gens + [elements[b]])
                    )
    return transitive * weight, total * weight


def brute_hurwitz(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> tuple[Fraction, Fraction]:
    """``(connected, disconnected)`` Hurwitz numbers by enumeration."""
    return _per_labelling(degree, *count_tuples(degree, target_genus, profiles))


def _per_labelling(degree: int, transitive: int, total: int) -> tuple[Fraction, Fraction]:
    """Tuple counts divided by ``d!``: (connected, disconnected) Hurwitz numbers."""
    n = factorial(degree)
    return Fraction(transitive, n), Fraction(total, n)


# --- the same count by states (for the cases too long to list one by one) -----


def _orbit_label(d: int, gens: Sequence[tuple[int, ...]]) -> tuple[tuple[int, ...], ...]:
    """The orbits of ``gens`` on ``0..d-1`` as a sorted tuple of sorted tuples."""
    from covertree.symmetric.permutations import orbits

    return tuple(orbits(d, gens))


@lru_cache(maxsize=None)
def _join(d: int, p: tuple, q: tuple) -> tuple:
    """The finest partition coarser than both ``p`` and ``q``."""
    parent = list(range(d))

    def find(i: int) -> int:
        while parent[i] != i:
            i = parent[i]
        return i

    for block in p + q:
        for x in block[1:]:
            parent[find(x)] = find(block[0])
    groups: dict[int, list[int]] = {}
    for x in range(d):
        groups.setdefault(find(x), []).append(x)
    return tuple(sorted(tuple(v) for v in groups.values()))


def count_tuples_by_states(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> tuple[int, int]:
    """``(transitive, all)`` like :func:`count_tuples`, but walking the tuples
    ``s_1, s_2, ...`` one element at a time while keeping only, for each partial
    tuple, its product and the orbits of the group it generates, with the number
    of partial tuples in each such state.  Every tuple is still counted exactly
    once (the states partition the tuples); no characters are used."""
    if target_genus not in (0, 1):
        raise ValueError("the state counter handles target genus 0 and 1 only")
    g = _group(degree)
    types = [tuple(sorted(mu, reverse=True)) for mu in profiles]
    single = _orbit_label(degree, [])
    states = {(g.identity, single): 1}
    for t in types:
        states = _step(g, states, g.classes[t])
    full = ((tuple(range(degree))),)
    if target_genus == 0:
        finals = [(part, n) for (product, part), n in states.items() if product == g.identity]
        return sum(n for part, n in finals if part == full), sum(n for _, n in finals)
    pairs = _commutator_states(degree)
    transitive = total = 0
    for (product, part), n in states.items():
        for sigma, m in pairs.get(g.inv[product], {}).items():
            total += n * m
            if _join(degree, part, sigma) == full:
                transitive += n * m
    return transitive, total


def _step(g: _Group, states: dict, cls: list[int]) -> dict:
    out: dict = {}
    d, orbit = g.d, _element_orbits(g.d)
    for (product, part), n in states.items():
        for s in cls:
            key = (g.mult[product][s], _join(d, part, orbit[s]))
            out[key] = out.get(key, 0) + n
    return out


@lru_cache(maxsize=None)
def _element_orbits(d: int) -> tuple:
    g = _group(d)
    return tuple(_orbit_label(d, [p]) for p in g.elements)


@lru_cache(maxsize=None)
def _commutator_states(d: int) -> dict[int, dict[tuple, int]]:
    """``[a, b] -> {orbits of <a, b>: number of pairs}`` over all pairs."""
    g = _group(d)
    out: dict[int, dict[tuple, int]] = {}
    for a, row in enumerate(g.commutator_solutions()):
        for c, bs in row.items():
            bucket = out.setdefault(c, {})
            for b in bs:
                part = _orbit_label(d, [g.elements[a], g.elements[b]])
                bucket[part] = bucket.get(part, 0) + 1
    return out


def brute_hurwitz_by_states(
    degree: int, target_genus: int, profiles: Sequence[Sequence[int]]
) -> tuple[Fraction, Fraction]:
    """``(connected, disconnected)`` Hurwitz numbers from :func:`count_tuples_by_states`."""
    return _per_labelling(degree, *count_tuples_by_states(degree, target_genus, profiles))
