r"""Quasimodular forms for the full modular group, and exact identification of
a q-series as one.

The ring of quasimodular forms is the polynomial ring ``Q[E_2, E_4, E_6]``
(Kaneko–Zagier), graded by weight (``E_k`` has weight ``k``), with

- ``E_2 = 1 - 24 sum sigma_1(n) q^n``,
- ``E_4 = 1 + 240 sum sigma_3(n) q^n``,
- ``E_6 = 1 - 504 sum sigma_5(n) q^n``.

The monomials ``E_2^a E_4^b E_6^c`` of weight ``2a + 4b + 6c = W`` are a basis
of the forms of weight ``W``; their q-expansions are linearly independent, so
enough coefficients of a series determine the only candidate form, and the
remaining coefficients check it.

:func:`identify` solves, by exact linear algebra (sympy, rationals), for the
coefficients of the monomials of weight exactly ``W`` (or of every even weight
``<= W``: mixed weight) using the first ``s`` coefficients of the series, ``s``
the shortest prefix that determines them, and verifies the candidate on all
the coefficients left.

References
----------
M. Kaneko and D. Zagier, *A generalized Jacobi theta function and
quasimodular forms*, in The Moduli Space of Curves, Progr. Math. 129 (1995).
D. Zagier, *Elliptic modular forms and their applications*, in The 1-2-3 of
Modular Forms (2008), section 5.
Running time: the expansions cost ``O(M N^2)`` rational operations for ``M``
monomials to order ``N``; the solve is one ``s x M`` exact elimination.

Examples
--------
``sum sigma_1(n) q^n = (1 - E_2)/24``:

>>> from covertree.series.quasimodular import identify, sigma
>>> found = identify([0] + [sigma(1, n) for n in range(1, 8)], weight=2, mixed=True)
>>> found.found, found.text, found.solved_with, found.checked
(True, '(1 - E2)/24', 2, 6)
>>> identify([0] + [sigma(1, n) for n in range(1, 8)], weight=2).found
False
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from fractions import Fraction
from functools import reduce
from math import gcd, lcm

import sympy

from covertree.errors import InputError

__all__ = ["Identification", "Monomial", "eisenstein", "expansion", "identify", "monomials", "sigma"]


def sigma(k: int, n: int) -> int:
    """``sigma_k(n)``: the sum of ``e^k`` over the divisors ``e`` of ``n``.

    >>> sigma(1, 6), sigma(3, 2)
    (12, 9)
    """
    return sum(e**k for e in range(1, n + 1) if n % e == 0)


_EISENSTEIN = {2: (-24, 1), 4: (240, 3), 6: (-504, 5)}


def eisenstein(k: int, n: int) -> tuple[int, ...]:
    """``[q^0..q^n] E_k`` for ``k`` in 2, 4, 6.

    >>> eisenstein(4, 3)
    (1, 240, 2160, 6720)
    """
    factor, power = _EISENSTEIN[k]
    return (1,) + tuple(factor * sigma(power, m) for m in range(1, n + 1))


@dataclass(frozen=True, order=True)
class Monomial:
    """``E_2^a E_4^b E_6^c``.

    >>> m = Monomial(1, 1, 0)
    >>> m.weight, m.text, m.latex
    (6, 'E2 E4', 'E_2E_4')
    >>> Monomial(0, 0, 0).text
    '1'
    """

    a: int
    b: int
    c: int

    @property
    def weight(self) -> int:
        return 2 * self.a + 4 * self.b + 6 * self.c

    @property
    def exponents(self) -> tuple[int, int, int]:
        return (self.a, self.b, self.c)

    def _factors(self, sep: str, fmt: str) -> str:
        parts = [fmt.format(k=k, e=e) if e > 1 else fmt.split("^")[0].format(k=k)
                 for k, e in zip((2, 4, 6), self.exponents) if e]
        return sep.join(parts) or "1"

    @property
    def text(self) -> str:
        return self._factors(" ", "E{k}^{e}")

    @property
    def latex(self) -> str:
        return self._factors("", "E_{k}^{{{e}}}")

    def symbol(self):
        """The monomial as a sympy expression in ``E2, E4, E6``."""
        e2, e4, e6 = sympy.symbols("E2 E4 E6")
        return e2**self.a * e4**self.b * e6**self.c


def monomials(weight: int, mixed: bool = False) -> tuple[Monomial, ...]:
    """The monomials of weight exactly ``weight`` (every even weight up to it
    when ``mixed``), in display order: weight ascending, then by descending
    powers of ``E_2`` and ``E_4``.

    Raises
    ------
    InputError
        For a negative or odd weight.

    Examples
    --------
    >>> [m.text for m in monomials(6)]
    ['E2^3', 'E2 E4', 'E6']
    >>> len(monomials(12)), len(monomials(4, mixed=True))
    (7, 4)
    """
    if not isinstance(weight, int) or weight < 0 or weight % 2:
        raise InputError(f"weight {weight!r} is not allowed; quasimodular weights are even integers >= 0")
    weights = range(0, weight + 1, 2) if mixed else (weight,)
    out = []
    for w in weights:
        out += [Monomial(a, b, c) for a in range(w // 2, -1, -1) for b in range((w - 2 * a) // 4, -1, -1)
                for c in [(w - 2 * a - 4 * b) // 6] if 2 * a + 4 * b + 6 * c == w]
    return tuple(out)


def _times(x: Sequence[int], y: Sequence[int]) -> tuple[int, ...]:
    return tuple(sum(x[i] * y[m - i] for i in range(m + 1)) for m in range(len(x)))


def expansion(m: Monomial, n: int) -> tuple[int, ...]:
    """``[q^0..q^n]`` of the monomial.

    >>> expansion(Monomial(2, 0, 0), 2)
    (1, -48, 432)
    """
    out: tuple[int, ...] = (1,) + (0,) * n
    for k, e in zip((2, 4, 6), m.exponents):
        for _ in range(e):
            out = _times(out, eisenstein(k, n))
    return out


@dataclass(frozen=True)
class Identification:
    """The outcome of :func:`identify`.

    Attributes
    ----------
    basis : tuple of Monomial
        The monomials tried.
    coefficients : tuple of Fraction or None
        The coefficient of each monomial of the form found (``None`` if none fits).
    solved_with : int
        Number of leading coefficients used to solve (``q^0..q^{s-1}``).
    checked : int
        Number of further coefficients verified (all of them when found; up to
        the first mismatch otherwise).
    mismatch : tuple (order, expected, found) or None
        The first coefficient the candidate gets wrong: its order in ``q``, the
        value of the series, the candidate's value (``found`` is ``None`` when
        the solving system itself has no solution).
    """

    basis: tuple[Monomial, ...]
    coefficients: tuple[Fraction, ...] | None
    solved_with: int
    checked: int
    mismatch: tuple[int, Fraction, Fraction | None] | None

    @property
    def found(self) -> bool:
        return self.coefficients is not None

    @property
    def weight(self) -> int:
        return max(m.weight for m in self.basis)

    def _scaled(self) -> tuple[Fraction, list[tuple[int, Monomial]]]:
        """``(f, [(n_i, m_i)])`` with the form ``f * sum n_i m_i``, ``n_i``
        coprime integers."""
        pairs = [(c, m) for c, m in zip(self.coefficients or (), self.basis) if c]
        if not pairs:
            return Fraction(0), []
        den = lcm(*(c.denominator for c, _ in pairs))
        num = reduce(gcd, (int(c * den) for c, _ in pairs))
        factor = Fraction(num, den)
        return factor, [(int(c / factor), m) for c, m in pairs]

    def _render(self, name) -> str:
        factor, terms = self._scaled()
        if not terms:
            return "0"
        poly = ""
        for i, (n, m) in enumerate(terms):
            sign = "-" if n < 0 else ("+" if i else "")
            size = abs(n)
            body = name(m) if m.exponents != (0, 0, 0) else ""
            coef = str(size) if size != 1 or not body else ""
            joined = (coef + (" " if coef and body and name is _text_name else "") + body) or "1"
            poly += (f" {sign} " if i else sign) + joined
        return _with_factor(poly, factor, len(terms), name is _text_name)

    @property
    def text(self) -> str | None:
        """The form as text, e.g. ``(5 E2^3 - 3 E2 E4 - 2 E6)/25920``."""
        return self._render(_text_name) if self.found else None

    @property
    def latex(self) -> str | None:
        r"""The form in LaTeX, e.g. ``\frac{5E_2^{3} - 3E_2E_4 - 2E_6}{25920}``."""
        return self._render(_latex_name) if self.found else None

    @property
    def expression(self):
        """The form as a sympy expression in ``E2, E4, E6`` (``None`` if none fits)."""
        if not self.found:
            return None
        return sum((sympy.Rational(c.numerator, c.denominator) * m.symbol()
                    for c, m in zip(self.coefficients, self.basis)), sympy.Integer(0))


def _text_name(m: Monomial) -> str:
    return m.text


def _latex_name(m: Monomial) -> str:
    return m.latex


def _with_factor(poly: str, factor: Fraction, n_terms: int, text: bool) -> str:
    """``factor * poly`` written as ``(poly)/q``, ``p/q (poly)`` or LaTeX."""
    if factor == 1:
        return poly
    p, q = factor.numerator, factor.denominator
    if text:
        wrapped = f"({poly})" if n_terms > 1 else poly
        return f"{wrapped}/{q}" if p == 1 else f"{p if q == 1 else factor} {wrapped}"
    if p == 1:
        return rf"\frac{{{poly}}}{{{q}}}"
    scalar = str(p) if q == 1 else rf"\frac{{{p}}}{{{q}}}"
    return rf"{scalar}\left({poly}\right)" if n_terms > 1 else rf"{scalar}{poly}"


def _solve_prefix(rows: list[list[int]], size: int) -> int | None:
    """Length of the shortest prefix of ``rows`` of rank ``size``."""
    for s in range(size, len(rows) + 1):
        if sympy.Matrix(rows[:s]).rank() == size:
            return s
    return None


def needed_coefficients(weight: int, mixed: bool = False, limit: int = 400) -> int:
    """How many leading coefficients (``q^0..``) determine a form of this weight.

    >>> needed_coefficients(6), needed_coefficients(12)
    (3, 7)
    """
    basis = monomials(weight, mixed)
    n = len(basis)
    while True:
        rows = _rows(basis, n - 1)
        s = _solve_prefix(rows, len(basis))
        if s is not None or n > limit:
            return s if s is not None else limit
        n *= 2


def _rows(basis: Sequence[Monomial], n: int) -> list[list[int]]:
    columns = [expansion(m, n) for m in basis]
    return [[col[i] for col in columns] for i in range(n + 1)]


def identify(series: Sequence[Fraction | int], weight: int, mixed: bool = False) -> Identification:
    """Identify ``sum_n series[n] q^n`` as a quasimodular form of weight
    ``weight`` (every even weight ``<= weight`` when ``mixed``).

    Parameters
    ----------
    series : sequence of Fraction or int
        The coefficients of ``q^0, q^1, ..., q^N``.
    weight : int
        Even, ``>= 0``.
    mixed : bool
        Allow every even weight up to ``weight``.

    Returns
    -------
    Identification
        The form and how many coefficients checked it, or the first
        coefficient no form of that weight matches.

    Raises
    ------
    InputError
        If the series is too short to determine a form and check it with at
        least one more coefficient (the message says how many are needed).

    Examples
    --------
    The square of ``E_4`` is ``E_8``'s only candidate:

    >>> from covertree.series.quasimodular import eisenstein, expansion, Monomial
    >>> identify(expansion(Monomial(0, 2, 0), 6), 8).text
    'E4^2'
    """
    values = [Fraction(x) for x in series]
    basis = monomials(weight, mixed)
    rows = _rows(basis, len(values) - 1)
    s = _solve_prefix(rows, len(basis))
    if s is None or s >= len(values):
        need = needed_coefficients(weight, mixed) + 1
        raise InputError(
            f"{len(values)} coefficient(s) (q^0..q^{len(values) - 1}) cannot both determine the "
            f"{len(basis)} monomial(s) of weight {'<= ' if mixed else ''}{weight} and check them: "
            f"need at least {need}, i.e. degrees up to {need - 1}"
        )
    return _solve_and_check(basis, rows, values, s)


def _solve_and_check(basis, rows, values, s) -> Identification:
    matrix = sympy.Matrix(rows[:s])
    rhs = sympy.Matrix([sympy.Rational(v.numerator, v.denominator) for v in values[:s]])
    try:
        solution, params = matrix.gauss_jordan_solve(rhs)
    except ValueError:  # the solving rows are inconsistent
        return Identification(basis, None, s, 0, (s - 1, values[s - 1], None))
    coefficients = tuple(Fraction(int(x.p), int(x.q)) for x in solution)
    for i in range(s, len(values)):
        got = sum((c * r for c, r in zip(coefficients, rows[i])), Fraction(0))
        if got != values[i]:
            return Identification(basis, None, s, i - s, (i, values[i], got))
    return Identification(basis, coefficients, s, len(values) - s, None)
