r"""Top intersection numbers of ``lambda_1``, ``kappa_1``, psi and boundary divisors on ``Mbar_{g,n}``.

``mbar_integral(g, n, {"lambda": 1, "delta_0": 2, ...})`` is the exact degree
on the moduli *stack* ``Mbar_{g,n}`` of a monomial in

- ``lambda`` (``lambda_1``, the first Chern class of the Hodge bundle),
- ``kappa`` (``kappa_1`` of Arbarello–Cornalba, ``pi_* c_1(omega(sum x_i))^2``),
- ``psi_i`` for the legs ``i = 1..n``,
- boundary divisors ``delta_0`` (irreducible) and, for ``n = 0``,
  ``delta_1 .. delta_{g/2}``; for ``n > 0`` ``delta_i_{a,b,...}``, the
  divisor whose side of genus ``i`` carries the legs ``a, b, ...`` (named by
  its side of smaller genus, then fewer legs, then the side holding leg 1;
  grammar in :mod:`covertree.intersection.boundary`).

Every divisor is the class of its locus on the stack, ``delta = [Delta]``:
on ``Mbar_2``, ``10 lambda = delta_0 + 2 delta_1`` and ``\int lambda^3 = 1/2880``.

Method
------
The integral of a monomial ``M`` of degree ``3g - 3 + n`` is reduced until only
psi and ``kappa_1`` are left, which :mod:`covertree.intersection.psi` integrates.

1. *A boundary divisor present.*  ``M = delta_D X``.  Then
   ``\int delta_D X = 1/|Aut Gamma_D| \int_{Mbar_Gamma} xi_D^* X``, the gluing
   map ``xi_D`` from one vertex space ``Mbar_{g-1,n+2}`` or a product of two
   (``[Delta_D] = xi_{D*}[1] / |Aut Gamma_D|``).  ``xi_D^*`` is a ring map;
   on the generators it is given by :func:`~covertree.intersection.boundary.pullback_terms`:
   psi to psi, ``kappa_1`` and ``lambda_1`` to the sums over the vertices,
   ``delta_{D'}`` to the divisors of the vertex spaces whose node has type
   ``D'`` after gluing, plus ``-psi_h - psi_h'`` when ``D' = D`` (the normal
   bundle of the branch through the glued node; Graber–Pandharipande).  The
   pulled-back monomial is expanded factor by factor, keeping per vertex only
   the terms of degree at most the vertex's dimension; a product of vertex
   classes integrates to the product of the vertex integrals, each computed
   by this same recursion.
2. *Only lambda, kappa and psi.*  Mumford's formula, from Grothendieck–
   Riemann–Roch on the universal curve, ``12 lambda = kappa_1 - sum_i psi_i
   + delta`` with ``delta`` the sum of all boundary divisors (each once;
   Arbarello–Cornalba's ``kappa_1`` exceeds Mumford's ``pi_* c_1(omega)^2``
   by ``sum psi_i``), replaces one power of ``lambda``.  The boundary terms go
   to step 1; ``lambda = 0`` in genus 0.
3. *Only kappa and psi.*  :func:`~covertree.intersection.psi.psi_kappa_integral`.

Legs are relabelled before memoising (psi exponents and the shapes of the
divisors through each leg decide the order), so symmetric monomials share one
cache entry.  Each call tree memoises on (g, n, monomial); the cost is
dominated by the number of distinct monomials on the vertex spaces reached.

References
----------
D. Mumford, Towards an enumerative geometry of the moduli space of curves,
Arithmetic and Geometry II, Progr. Math. 36 (1983), section 5 (``12 lambda =
kappa + delta``) and section 10 (genus 2).  E. Arbarello, M. Cornalba,
Combinatorial and algebro-geometric cohomology classes on the moduli spaces of
curves, J. Algebraic Geom. 5 (1996) (``kappa_1`` with marked points, its
restriction to boundary strata).  T. Graber, R. Pandharipande, Constructions
of nontautological classes on moduli spaces of curves, Michigan Math. J. 51
(2003), Appendix A (pullback of boundary strata along gluing maps).
C. Faber, Chow rings of moduli spaces of curves I, Ann. of Math. 132 (1990).

Examples
--------
>>> mbar_integral(2, 0, {"lambda": 3}), mbar_integral(1, 1, {"delta_0": 1})
(Fraction(1, 2880), Fraction(1, 2))
>>> mbar_integral(0, 5, {"delta_0_{1,2}": 2})
Fraction(-1, 1)
>>> divisor_basis(3), divisor_basis(2)
(('lambda', 'delta_0', 'delta_1'), ('delta_0', 'delta_1'))
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from fractions import Fraction
from functools import lru_cache
from itertools import combinations_with_replacement
from math import prod

import sympy

from covertree.errors import InputError
from covertree.intersection.boundary import (
    IRR,
    automorphisms,
    canonical_key,
    divisors,
    parse_divisor,
    pullback_terms,
    vertex_spaces,
)
from covertree.intersection.psi import dimension, psi_kappa_integral

__all__ = ["mbar_integral", "divisor_basis", "divisor_monomials", "pairing_matrix"]

# A monomial on Mbar_{g,n}: (lambda power, kappa power, psi exponents by leg,
# sorted ((divisor key, power), ...)).
Monomial = tuple


def mbar_integral(g: int, n: int, factors: Mapping[str, int]) -> Fraction:
    """``\\int_{Mbar_{g,n}} prod factor^power``, exact, on the stack.

    Parameters
    ----------
    g, n
        Genus and number of legs, ``2g - 2 + n > 0``.
    factors
        Factor name to power (``>= 0``): ``lambda``, ``kappa``, ``psi_i``
        (``1 <= i <= n``) and the boundary divisor names of the module docstring.

    Returns
    -------
    Fraction
        Zero unless the degree is ``3g - 3 + n``.

    Raises
    ------
    InputError
        Unstable ``(g, n)``, an unknown factor, or a power that is not an
        integer ``>= 0``.

    Examples
    --------
    >>> mbar_integral(3, 0, {"lambda": 6})
    Fraction(1, 90720)
    >>> mbar_integral(1, 2, {"lambda": 1, "delta_0_{1,2}": 1})
    Fraction(1, 24)
    >>> mbar_integral(2, 0, {"lambda": 1})
    Fraction(0, 1)
    """
    dim = dimension(g, n)
    lam, kap, psis, divs = _parse(g, n, factors)
    if lam + kap + sum(psis) + sum(p for _, p in divs) != dim:
        return Fraction(0)
    return _value(g, n, (lam, kap, psis, divs))


def _parse(g: int, n: int, factors: Mapping[str, int]) -> Monomial:
    lam = kap = 0
    psis = [0] * n
    divs: dict = {}
    for name, power in factors.items():
        if isinstance(power, bool) or not isinstance(power, int) or power < 0:
            raise InputError(f"power of {name!r} must be an integer >= 0, got {power!r}")
        if name == "lambda":
            lam += power
        elif name == "kappa":
            kap += power
        elif name.startswith("psi_"):
            psis[_leg(n, name) - 1] += power
        elif name.startswith("delta_"):
            key = parse_divisor(g, n, name)
            divs[key] = divs.get(key, 0) + power
        else:
            raise InputError(f"unknown factor {name!r}: expected lambda, kappa, psi_i (1 <= i <= {n}) or delta_...")
    return lam, kap, tuple(psis), tuple(sorted((k, p) for k, p in divs.items() if p))


def _leg(n: int, name: str) -> int:
    label = name[4:]
    if not label.isdigit() or not 1 <= int(label) <= n:
        raise InputError(f"unknown factor {name!r}: psi_i needs a leg 1 <= i <= {n}")
    return int(label)


def _value(g: int, n: int, mono: Monomial) -> Fraction:
    """The integral of a monomial of the right degree, after relabelling its legs."""
    return _integral(g, n, *_relabelled(g, n, mono))


def _relabelled(g: int, n: int, mono: Monomial) -> Monomial:
    """The monomial with its legs renumbered by a label-free invariant."""
    lam, kap, psis, divs = mono
    if n < 2:
        return mono
    order = sorted(range(1, n + 1), key=lambda leg: (_leg_invariant(g, n, mono, leg), leg))
    new = {old: pos + 1 for pos, old in enumerate(order)}
    new_psis = tuple(psis[old - 1] for old in order)
    new_divs = tuple(sorted((_moved(g, n, key, new), p) for key, p in divs))
    return lam, kap, new_psis, new_divs


def _leg_invariant(g: int, n: int, mono: Monomial, leg: int) -> tuple:
    shapes = []
    for (i, side), p in mono[3]:
        if i >= 0:
            mine, other = ((i, len(side)), (g - i, n - len(side)))
            shapes.append((mine, other, p) if leg in side else (other, mine, p))
    return mono[2][leg - 1], tuple(sorted(shapes))


def _moved(g: int, n: int, key: tuple, new: Mapping[int, int]) -> tuple:
    return key if key == IRR else canonical_key(g, n, key[0], tuple(new[j] for j in key[1]))


@lru_cache(maxsize=None)
def _integral(g: int, n: int, lam: int, kap: int, psis: tuple, divs: tuple) -> Fraction:
    """Steps 1-3 of the module docstring; the degree is ``3g - 3 + n``."""
    if lam and g == 0:
        return Fraction(0)
    if divs:
        key, power = _pick(divs)
        rest = tuple((k, p - (k == key)) for k, p in divs if p - (k == key) > 0)
        return _restricted(g, n, key, (lam, kap, psis, rest))
    if lam:
        return _mumford(g, n, lam, kap, psis)
    return psi_kappa_integral(g, psis, kap)


def _pick(divs: tuple) -> tuple:
    """The divisor to restrict to: a separating one (smaller vertex spaces) first."""
    return max(divs, key=lambda kp: (kp[0] != IRR, kp[1], kp[0]))


def _mumford(g: int, n: int, lam: int, kap: int, psis: tuple) -> Fraction:
    """One power of ``lambda`` replaced by ``(kappa_1 - sum psi_i + delta) / 12``."""
    total = _integral(g, n, lam - 1, kap + 1, psis, ())
    for j in range(n):
        total -= _value(g, n, (lam - 1, kap, psis[:j] + (psis[j] + 1,) + psis[j + 1 :], ()))
    for key in divisors(g, n):
        total += _restricted(g, n, key, (lam - 1, kap, psis, ()))
    return total / 12


def _restricted(g: int, n: int, key: tuple, mono: Monomial) -> Fraction:
    """``\\int delta_key * mono = 1/|Aut| \\int_{Mbar_Gamma} xi_key^* mono``."""
    spaces = vertex_spaces(g, n, key)
    dims = tuple(dimension(gv, len(legs)) for gv, legs in spaces)
    states = {tuple(() for _ in spaces): Fraction(1)}
    for factor, power in _factors(mono):
        terms = pullback_terms(g, n, key, factor)
        for _ in range(power):
            states = _times(states, terms, dims)
    total = Fraction(0)
    for state, coeff in states.items():
        if all(sum(p for _, p in vm) == d for vm, d in zip(state, dims)):
            total += coeff * prod(_vertex_value(gv, len(legs), vm) for (gv, legs), vm in zip(spaces, state))
    return total / automorphisms(g, n, key)


def _factors(mono: Monomial):
    lam, kap, psis, divs = mono
    yield ("lambda",), lam
    yield ("kappa",), kap
    yield from ((("psi", j + 1), k) for j, k in enumerate(psis))
    yield from ((("delta", key), p) for key, p in divs)


def _times(states: dict, terms: tuple, dims: tuple) -> dict:
    """Multiply a sum of products of vertex monomials by a sum of vertex factors."""
    out: dict = {}
    for state, coeff in states.items():
        for c, v, factor in terms:
            vm = state[v]
            if sum(p for _, p in vm) >= dims[v]:
                continue
            new = state[:v] + (_bump(vm, factor),) + state[v + 1 :]
            out[new] = out.get(new, 0) + c * coeff
    return {s: c for s, c in out.items() if c}


def _bump(vm: tuple, factor: tuple) -> tuple:
    d = dict(vm)
    d[factor] = d.get(factor, 0) + 1
    return tuple(sorted(d.items()))


def _vertex_value(g: int, n: int, vm: tuple) -> Fraction:
    lam = kap = 0
    psis = [0] * n
    divs = []
    for factor, p in vm:
        if factor[0] == "lambda":
            lam = p
        elif factor[0] == "kappa":
            kap = p
        elif factor[0] == "psi":
            psis[factor[1] - 1] = p
        else:
            divs.append((factor[1], p))
    return _value(g, n, (lam, kap, tuple(psis), tuple(sorted(divs))))


def divisor_basis(g: int) -> tuple[str, ...]:
    """Names of the basis of ``Pic(Mbar_g) (x) Q`` in order.

    ``lambda, delta_0, ..., delta_{g/2}`` for ``g >= 3``; ``delta_0, delta_1``
    for ``g = 2`` (``10 lambda = delta_0 + 2 delta_1``).

    >>> divisor_basis(4)
    ('lambda', 'delta_0', 'delta_1', 'delta_2')
    """
    if g < 2:
        raise InputError(f"divisor_basis needs genus >= 2, got {g}")
    deltas = tuple(f"delta_{i}" for i in range(g // 2 + 1))
    return deltas if g == 2 else ("lambda",) + deltas


def divisor_monomials(g: int, degree: int) -> tuple[dict[str, int], ...]:
    """Every monomial of a degree in ``lambda, delta_0, ..., delta_{g/2}``, in a fixed order.

    ``lambda`` is included for every genus (on ``Mbar_2`` too), so these serve
    as test classes ``alpha`` for :func:`pairing_matrix`.

    >>> divisor_monomials(2, 2)[:3]
    ({'lambda': 2}, {'lambda': 1, 'delta_0': 1}, {'lambda': 1, 'delta_1': 1})
    >>> len(divisor_monomials(3, 5))
    21
    """
    names = ("lambda",) + tuple(f"delta_{i}" for i in range(g // 2 + 1))
    out = []
    for combo in combinations_with_replacement(names, degree):
        out.append({name: combo.count(name) for name in names if name in combo})
    return tuple(out)


def pairing_matrix(g: int, monomials: Sequence[Mapping[str, int]]) -> sympy.Matrix:
    """``P[k, l] = \\int_{Mbar_g} beta_k alpha_l``, ``beta = divisor_basis(g)``, ``alpha = monomials``.

    Each ``alpha_l`` must have degree ``3g - 4``.

    >>> pairing_matrix(2, [{"delta_1": 2}, {"lambda": 2}])
    Matrix([
    [-1/48,     0],
    [1/576, 1/576]])
    """
    for alpha in monomials:
        degree = sum(alpha.values())
        if degree != 3 * g - 4:
            raise InputError(f"test monomial {dict(alpha)} has degree {degree}, need 3g - 4 = {3 * g - 4}")
    rows = []
    for beta in divisor_basis(g):
        rows.append([_rational(mbar_integral(g, 0, _times_name(alpha, beta))) for alpha in monomials])
    return sympy.Matrix(rows)


def _times_name(alpha: Mapping[str, int], name: str) -> dict[str, int]:
    out = dict(alpha)
    out[name] = out.get(name, 0) + 1
    return out


def _rational(x: Fraction) -> sympy.Rational:
    return sympy.Rational(x.numerator, x.denominator)
