"""Eisenstein series and the generating functions of covers of an elliptic
curve, shared by the published checks and the benchmarks.

- ``E_2 = 1 - 24 sum sigma_1(n) q^n``, ``E_4 = 1 + 240 sum sigma_3(n) q^n``,
  ``E_6 = 1 - 504 sum sigma_5(n) q^n`` (common knowledge).
- Genus 2: ``F_2 = (10 E_2^3 - 6 E_2 E_4 - 4 E_6) / 103680`` (R. Dijkgraaf,
  *Mirror symmetry and elliptic curves*, 1995; M. Kaneko and D. Zagier, *A
  generalized Jacobi theta function and quasimodular forms*, 1995); covertree's
  count with two labelled simple points is ``2 [q^d] F_2`` (OEIS A170991).
- Genus 3: ``(-6E_2^6 + 15E_2^4E_4 + 4E_2^3E_6 - 12E_2^2E_4^2 - 12E_2E_4E_6 +
  7E_4^3 + 4E_6^2) / 1492992``, the generating function given in the formula
  entry of OEIS A170992 (R. Visser, 2023; the sequence's terms are from M. Roth
  and N. Yui, Clay Math. Proc. 11, 2010), whose coefficients count covers with
  four labelled simple points, covertree's convention.

>>> [2 * c for c in f2_coefficients(6)[2:]]
[Fraction(2, 1), Fraction(16, 1), Fraction(60, 1), Fraction(160, 1)]
>>> f3_coefficients(4)[2:]
[Fraction(2, 1), Fraction(160, 1)]
"""

from __future__ import annotations

from fractions import Fraction


def sigma(k: int, n: int) -> int:
    """``sum of d^k`` over the divisors ``d`` of ``n``."""
    return sum(e**k for e in range(1, n + 1) if n % e == 0)


def eisenstein(n: int) -> tuple[list[int], list[int], list[int]]:
    """``E_2, E_4, E_6`` to order ``q^(n-1)``."""
    e2 = [1] + [-24 * sigma(1, m) for m in range(1, n)]
    e4 = [1] + [240 * sigma(3, m) for m in range(1, n)]
    e6 = [1] + [-504 * sigma(5, m) for m in range(1, n)]
    return e2, e4, e6


def multiply(*series: list) -> list:
    """Product of q-series, truncated to the length of the first."""
    out = series[0]
    for s in series[1:]:
        out = [sum(out[i] * s[m - i] for i in range(m + 1)) for m in range(len(out))]
    return out


def _combine(terms, n: int, denominator: int) -> list[Fraction]:
    total = [0] * n
    for coefficient, factors in terms:
        total = [a + coefficient * b for a, b in zip(total, multiply(*factors))]
    return [Fraction(x, denominator) for x in total]


def f2_coefficients(n: int) -> list[Fraction]:
    """``[q^0..q^(n-1)] F_2``."""
    e2, e4, e6 = eisenstein(n)
    return _combine([(10, [e2, e2, e2]), (-6, [e2, e4]), (-4, [e6])], n, 103680)


def f3_coefficients(n: int) -> list[Fraction]:
    """``[q^0..q^(n-1)]`` of the genus-3 generating function."""
    e2, e4, e6 = eisenstein(n)
    terms = [
        (-6, [e2] * 6), (15, [e2] * 4 + [e4]), (4, [e2] * 3 + [e6]), (-12, [e2, e2, e4, e4]),
        (-12, [e2, e4, e6]), (7, [e4] * 3), (4, [e6, e6]),
    ]
    return _combine(terms, n, 1492992)
