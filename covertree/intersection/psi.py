r"""Integrals of psi classes and ``kappa_1`` over ``Mbar_{g,n}``.

Conventions
-----------
``<tau_{k_1} ... tau_{k_n}>_g = \int_{Mbar_{g,n}} psi_1^{k_1} ... psi_n^{k_n}``,
zero unless ``sum k_i = 3g - 3 + n``; integrals are on the moduli *stack*
(``<tau_1>_1 = 1/24``, not ``1/12``).  ``kappa_1`` is the class of
Arbarello–Cornalba, ``pi_*(psi_{n+1}^2)`` for the map forgetting a point;
on ``Mbar_g`` it is Mumford's ``kappa_1 = pi_*(K^2)``.

Method
------
- Genus 0: ``<tau_{k_1}..tau_{k_n}>_0 = (n-3)! / prod k_i!`` (the multinomial
  formula, a consequence of the string equation).
- String ``<tau_0 tau_S>_g = sum_j <tau_{k_j - 1} ...>_g`` and dilaton
  ``<tau_1 tau_S>_g = (2g - 2 + |S|) <tau_S>_g``.
- Otherwise the Virasoro form of the Witten–Kontsevich theorem (Dijkgraaf,
  Verlinde and Verlinde): for ``k >= 1``,

  ``(2k+1)!! <tau_k tau_S>_g = sum_{j in S} (2k + 2k_j - 1)!!/(2k_j - 1)!!
  <tau_{k + k_j - 1} tau_{S-j}>_g + 1/2 sum_{r+s=k-2} (2r+1)!!(2s+1)!!
  [<tau_r tau_s tau_S>_{g-1} + sum <tau_r tau_I>_{g_1} <tau_s tau_J>_{g_2}]``,

  the last sum over ``g_1 + g_2 = g`` and ``I + J = S``.
- ``kappa_1`` by pushing forward from one more point:
  ``\int psi^a kappa_1^m = sum_{s=0}^{m-1} (-1)^s C(m-1, s)
  \int_{Mbar_{g,n+1}} psi^a psi_{n+1}^{2+s} kappa_1^{m-1-s}``, from
  ``kappa_1 = pi_*(psi_{n+1}^2)``, ``pi^* kappa_1 = kappa_1 - psi_{n+1}`` and
  ``pi^* psi_i . psi_{n+1} = psi_i . psi_{n+1}`` (Arbarello–Cornalba 1996).

Values are memoised per call tree on sorted exponent tuples; the cost of
``<tau_S>_g`` is polynomial in the number of partitions of ``3g - 3 + n``
into at most ``n`` parts.

References
----------
E. Witten, Two-dimensional gravity and intersection theory on moduli space,
Surveys in Differential Geometry 1 (1991).  M. Kontsevich, Intersection theory
on the moduli space of curves and the matrix Airy function, Comm. Math. Phys.
147 (1992).  R. Dijkgraaf, H. Verlinde, E. Verlinde, Loop equations and
Virasoro constraints in non-perturbative two-dimensional quantum gravity,
Nucl. Phys. B 348 (1991).  E. Arbarello, M. Cornalba, Combinatorial and
algebro-geometric cohomology classes on the moduli spaces of curves, J.
Algebraic Geom. 5 (1996).

Examples
--------
>>> psi_integral(1, (1,)), psi_integral(2, (4,)), psi_integral(2, (2, 3))
(Fraction(1, 24), Fraction(1, 1152), Fraction(29, 5760))
>>> psi_integral(0, (1, 1, 0, 0, 0))
Fraction(2, 1)
>>> psi_kappa_integral(0, (0, 0, 0, 0, 0), 2), psi_kappa_integral(1, (0,), 1)
(Fraction(5, 1), Fraction(1, 24))
"""

from __future__ import annotations

from fractions import Fraction
from functools import lru_cache
from itertools import combinations
from math import comb, factorial, prod

from covertree.errors import InputError

__all__ = ["psi_integral", "psi_kappa_integral", "dimension"]


def dimension(g: int, n: int) -> int:
    """``dim Mbar_{g,n} = 3g - 3 + n``; raises when ``2g - 2 + n <= 0``.

    >>> dimension(2, 0), dimension(0, 3)
    (3, 0)
    """
    if g < 0 or n < 0 or 2 * g - 2 + n <= 0:
        raise InputError(f"Mbar_{{{g},{n}}} is not a stable moduli space (need g >= 0, n >= 0, 2g - 2 + n > 0)")
    return 3 * g - 3 + n


def psi_integral(g: int, exponents: tuple[int, ...] | list[int]) -> Fraction:
    """``<tau_{k_1} ... tau_{k_n}>_g`` for the exponents ``k_i >= 0``.

    >>> psi_integral(3, (7,)) == Fraction(1, 24**3 * 6)
    True
    """
    ks = tuple(sorted(exponents))
    if any(k < 0 for k in ks):
        raise InputError(f"psi exponents must be >= 0, got {list(exponents)}")
    dimension(g, len(ks))
    if sum(ks) != 3 * g - 3 + len(ks):
        return Fraction(0)
    return _tau(g, ks)


def _dfact(n: int) -> int:
    """Double factorial with ``(-1)!! = 1`` (an empty product for ``n <= 0``)."""
    return prod(range(n, 0, -2))


@lru_cache(maxsize=None)
def _tau(g: int, ks: tuple[int, ...]) -> Fraction:
    """Memoised correlator; ``ks`` sorted, dimension constraint already holds."""
    n = len(ks)
    if g < 0 or 2 * g - 2 + n <= 0 or sum(ks) != 3 * g - 3 + n:
        return Fraction(0)
    if g == 0:
        return Fraction(factorial(n - 3), prod(factorial(k) for k in ks))
    if ks == (1,):
        return Fraction(1, 24)
    if ks[0] == 0:
        rest = ks[1:]
        return sum((_tau(g, _lowered(rest, j)) for j in range(len(rest)) if rest[j] > 0), Fraction(0))
    if ks[0] == 1:
        return (2 * g - 2 + n - 1) * _tau(g, ks[1:])
    return _dvv(g, ks)


def _lowered(ks: tuple[int, ...], j: int) -> tuple[int, ...]:
    return tuple(sorted(ks[:j] + (ks[j] - 1,) + ks[j + 1 :]))


def _dvv(g: int, ks: tuple[int, ...]) -> Fraction:
    """The DVV recursion on the largest exponent ``k = ks[-1] >= 2``."""
    k, rest = ks[-1], ks[:-1]
    total = Fraction(0)
    for j, kj in enumerate(rest):
        others = rest[:j] + rest[j + 1 :]
        coeff = Fraction(_dfact(2 * k + 2 * kj - 1), _dfact(2 * kj - 1))
        total += coeff * _tau(g, tuple(sorted(others + (k + kj - 1,))))
    for r in range(k - 1):
        s = k - 2 - r
        c = Fraction(_dfact(2 * r + 1) * _dfact(2 * s + 1), 2)
        total += c * (_tau(g - 1, tuple(sorted(rest + (r, s)))) + _split_sum(g, rest, r, s))
    return total / _dfact(2 * k + 1)


def _split_sum(g: int, rest: tuple[int, ...], r: int, s: int) -> Fraction:
    """``sum <tau_r tau_I>_{g1} <tau_s tau_J>_{g2}`` over genus and point splits."""
    total = Fraction(0)
    idx = range(len(rest))
    for size in range(len(rest) + 1):
        for part in combinations(idx, size):
            inside = tuple(rest[i] for i in part)
            outside = tuple(rest[i] for i in idx if i not in part)
            for g1 in range(g + 1):
                left = _tau(g1, tuple(sorted(inside + (r,))))
                if left:
                    total += left * _tau(g - g1, tuple(sorted(outside + (s,))))
    return total


def psi_kappa_integral(g: int, exponents: tuple[int, ...] | list[int], kappa: int) -> Fraction:
    r"""``\int_{Mbar_{g,n}} prod psi_i^{k_i} kappa_1^m`` with ``n = len(exponents)``.

    >>> psi_kappa_integral(2, (), 3), psi_kappa_integral(1, (0, 0), 2)
    (Fraction(43, 2880), Fraction(1, 8))
    >>> psi_kappa_integral(0, (0, 0, 0, 0), 1)
    Fraction(1, 1)
    """
    ks = tuple(sorted(exponents))
    if kappa < 0 or any(k < 0 for k in ks):
        raise InputError(f"exponents must be >= 0, got psi {list(exponents)} and kappa {kappa}")
    dimension(g, len(ks))
    if sum(ks) + kappa != 3 * g - 3 + len(ks):
        return Fraction(0)
    return _psi_kappa(g, ks, kappa)


@lru_cache(maxsize=None)
def _psi_kappa(g: int, ks: tuple[int, ...], m: int) -> Fraction:
    if m == 0:
        return _tau(g, ks)
    total = Fraction(0)
    for s in range(m):
        total += (-1) ** s * comb(m - 1, s) * _psi_kappa(g, tuple(sorted(ks + (2 + s,))), m - 1 - s)
    return total
