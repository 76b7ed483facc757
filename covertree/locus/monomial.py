r"""Monomials in the classes covertree integrates.

A monomial is written as factors separated by spaces or ``*``, each factor a
class name with an optional power ``^k`` (``k >= 1``):

- source classes (pulled back from ``Mbar_G`` by the stabilised source):
  ``lambda`` (the first Chern class of the Hodge bundle) and ``delta_i``
  (``delta_0`` the irreducible divisor, ``delta_i`` for ``1 <= i <= G/2`` the
  divisor of curves with a separating node splitting off genus ``i``);
- for a marked source (legs ``1..n``, landing in ``Mbar_{G,n}``) also the
  source classes ``psi_k`` (``k`` a leg of the source) and the boundary
  divisors ``delta_i_{a,b,...}`` of :mod:`covertree.intersection.boundary`
  (written without spaces);
- target classes (pulled back from ``Mbar_{H,b}`` by the branch map):
  ``psi_j`` (``j`` a branch point label, ``1..b``) and ``kappa`` (``kappa_1``
  of Arbarello–Cornalba).

A ``psi`` factor is a source class in a source monomial and a target class
in a target monomial (the two monomials are always given apart).

The empty string and ``1`` are the unit monomial.  A monomial is a small
immutable value: factors sorted, powers merged, so equal monomials compare
equal whatever the spelling.

Examples
--------
>>> m = Monomial.parse("delta_0^2 * lambda delta_0", kinds="source")
>>> m.notation, m.degree, m.power("delta_0")
('lambda delta_0^3', 4, 3)
>>> Monomial.parse("", kinds="target").degree
0
>>> Monomial.parse("psi_1 theta", kinds="target")
Traceback (most recent call last):
...
covertree.locus.monomial.MonomialError: factor 'theta' (column 7) is not a target class; allowed: psi_j (j a branch point), kappa
"""

from __future__ import annotations

import re
from collections.abc import Iterable, Mapping
from dataclasses import dataclass

from covertree.errors import InputError

__all__ = ["Monomial", "MonomialError", "SOURCE", "TARGET"]

SOURCE = "source"
TARGET = "target"

_FACTOR = re.compile(r"([A-Za-z_]+[0-9]*(?:_\{[0-9,]*\})?)(?:\^([0-9]+))?$")
_TOKEN = re.compile(r"[^\s*]+")
_ALLOWED = {
    SOURCE: "lambda, delta_i (i = 0 .. G/2); with marks psi_k (k a leg) and delta_i_{a,b,...}",
    TARGET: "psi_j (j a branch point), kappa",
}
_MAX_POWER = 1000


class MonomialError(InputError):
    """A monomial cannot be parsed or names a class that does not exist."""


def _kinds_of(name: str) -> tuple[str, ...]:
    """The kinds a class name can have (``psi_j`` is either)."""
    if name == "lambda" or re.fullmatch(r"delta_(0|[1-9][0-9]*)(_\{([1-9][0-9]*(,[1-9][0-9]*)*)?\})?", name):
        return (SOURCE,)
    if re.fullmatch(r"psi_[1-9][0-9]*", name):
        return (TARGET, SOURCE)
    if name == "kappa":
        return (TARGET,)
    return ()


def _kind_of(name: str) -> str | None:
    kinds = _kinds_of(name)
    return kinds[0] if kinds else None


def _sort_key(name: str) -> tuple:
    head, _, tail = name.partition("_")
    order = {"lambda": 0, "delta": 1, "psi": 2, "kappa": 3}[head]
    number, _, legs = tail.partition("_")
    side = tuple(int(x) for x in legs.strip("{}").split(",") if x)
    return (order, int(number) if number else -1, len(legs) > 0, side)


@dataclass(frozen=True)
class Monomial:
    """A monomial: sorted ``(name, power)`` pairs with powers ``>= 1``.

    Use :meth:`parse` for text and :meth:`from_powers` for a mapping.
    """

    factors: tuple[tuple[str, int], ...]

    def __post_init__(self) -> None:
        names = [n for n, _ in self.factors]
        if any(_kind_of(n) is None for n in names):
            raise MonomialError(f"unknown class in {names}; allowed: {_ALLOWED[SOURCE]}, {_ALLOWED[TARGET]}")
        if any(p < 1 for _, p in self.factors) or len(set(names)) != len(names):
            raise MonomialError(f"monomial factors must be distinct with powers >= 1, got {self.factors}")
        if list(self.factors) != sorted(self.factors, key=lambda f: _sort_key(f[0])):
            raise MonomialError(f"monomial factors are not in normal order: {self.factors}")

    @classmethod
    def from_powers(cls, powers: Mapping[str, int] | Iterable[tuple[str, int]]) -> "Monomial":
        """Normalise a mapping (or pairs) of class names to powers; zero powers dropped.

        >>> Monomial.from_powers({"delta_1": 1, "lambda": 2, "kappa": 0}).notation
        'lambda^2 delta_1'
        """
        merged: dict[str, int] = {}
        for name, power in (powers.items() if isinstance(powers, Mapping) else powers):
            merged[name] = merged.get(name, 0) + power
        kept = sorted(((n, p) for n, p in merged.items() if p), key=lambda f: _sort_key(f[0]))
        return cls(tuple(kept))

    @classmethod
    def parse(cls, text: str, kinds: str | None = None) -> "Monomial":
        """Parse ``text``; with ``kinds`` (``"source"`` or ``"target"``) only
        those classes are allowed.  Errors name the factor and its column (1-based).
        """
        if text.strip() in ("", "1"):
            return cls(())
        powers: dict[str, int] = {}
        for match in _TOKEN.finditer(text):
            name, power = _parse_factor(match.group(), match.start() + 1, kinds)
            powers[name] = powers.get(name, 0) + power
        return cls.from_powers(powers)

    @property
    def degree(self) -> int:
        """Total degree (every class has degree one)."""
        return sum(p for _, p in self.factors)

    @property
    def notation(self) -> str:
        """Normal form, ``1`` for the unit."""
        if not self.factors:
            return "1"
        return " ".join(n if p == 1 else f"{n}^{p}" for n, p in self.factors)

    def power(self, name: str) -> int:
        """The power of one class (0 when absent)."""
        return dict(self.factors).get(name, 0)

    def names(self) -> tuple[str, ...]:
        return tuple(n for n, _ in self.factors)

    def __str__(self) -> str:
        return self.notation


def _parse_factor(token: str, column: int, kinds: str | None) -> tuple[str, int]:
    match = _FACTOR.match(token)
    if not match:
        raise MonomialError(
            f"factor {token!r} (column {column}) is not a class with an optional power ^k; "
            f"allowed: {_ALLOWED.get(kinds, _ALLOWED[SOURCE] + ', ' + _ALLOWED[TARGET])}"
        )
    name, power_text = match.group(1), match.group(2)
    found = _kinds_of(name)
    if not found or (kinds is not None and kinds not in found):
        what = f"a {kinds} class" if kinds else "a class"
        allowed = _ALLOWED[kinds] if kinds else f"{_ALLOWED[SOURCE]}, {_ALLOWED[TARGET]}"
        raise MonomialError(f"factor {token!r} (column {column}) is not {what}; allowed: {allowed}")
    if power_text is None:
        return name, 1
    if len(power_text) > 4 or not 1 <= int(power_text) <= _MAX_POWER:
        raise MonomialError(f"power in {token!r} (column {column}) must be an integer from 1 to {_MAX_POWER}")
    return name, int(power_text)
