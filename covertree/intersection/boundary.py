r"""Boundary divisors of ``Mbar_{g,n}``: keys, names and pullbacks along gluing maps.

A boundary divisor is the closure of the locus of curves with one node.  Its
*key* is ``IRR = (-1, ())`` for the irreducible divisor ``delta_0`` and
``(i, S)`` for a separating one, ``S`` the sorted tuple of the legs on the side
of genus ``i``; of the two sides the key takes the one with the smaller genus,
then the fewer legs, then the one holding leg ``1`` (so every divisor has
exactly one key; :func:`canonical_key`).

Names (:func:`divisor_name`, :func:`parse_divisor`):

- ``n = 0``: ``delta_0`` (irreducible) and ``delta_i`` for ``1 <= i <= g/2``;
- ``n > 0``: ``delta_0`` (irreducible) and ``delta_i_{a,b,...}`` for the
  separating divisor whose named side has genus ``i`` and legs ``a, b, ...``
  (braces always present, possibly empty: ``delta_1_{}`` on ``Mbar_{3,1}`` is
  an elliptic tail without legs).  Only the side chosen by the key rule names
  the divisor; the other side is refused with the right name in the message.

Gluing maps.  For a divisor ``D`` with one-edge graph ``Gamma`` the gluing map
``xi_D: Mbar_Gamma -> Mbar_{g,n}`` has as source one vertex space
``Mbar_{g-1,n+2}`` (``D`` irreducible, half-edges the legs ``n+1, n+2``) or the
product ``Mbar_{i,|S|+1} x Mbar_{g-i,n-|S|+1}`` (legs ``S`` in order, then the
half-edge).  :func:`pullback_terms` lists ``xi_D^*`` of every class as a sum of
classes on the vertex spaces:

- ``psi_j`` goes to ``psi`` of leg ``j`` on its vertex, ``kappa_1`` to the sum
  of the vertices' ``kappa_1`` (Arbarello–Cornalba), ``lambda_1`` to the sum
  of the vertices' ``lambda_1`` (the Hodge bundle of a curve of compact type
  is the sum over components; a non-separating node adds a trivial quotient);
- a divisor ``D'`` goes to the sum of the boundary divisors ``B`` of the vertex
  spaces whose new node has type ``D'`` in the glued curve (the branch of
  ``D'`` through that node meets the image of ``xi_D`` transversally), plus,
  when ``D' = D``, the first Chern class of the normal bundle,
  ``-psi_h - psi_h'`` at the two half-edges (the branch of ``D`` through the
  node of ``Gamma`` itself).  This is the codimension-one case of the formula
  of Graber–Pandharipande for ``xi_A^* xi_B*`` (generic ``(A, B)``-structures
  with the excess bundle); dividing their formula by ``|Aut D|`` leaves
  coefficient 1 on each term with the classes ``[D'] = xi_{D'*}[1]/|Aut D'|``.

References
----------
E. Arbarello, M. Cornalba, Combinatorial and algebro-geometric cohomology
classes on the moduli spaces of curves, J. Algebraic Geom. 5 (1996).
T. Graber, R. Pandharipande, Constructions of nontautological classes on
moduli spaces of curves, Michigan Math. J. 51 (2003), Appendix A.

Examples
--------
>>> [divisor_name(2, 0, k) for k in divisors(2, 0)]
['delta_0', 'delta_1']
>>> [divisor_name(0, 5, k) for k in divisors(0, 5)][:3]
['delta_0_{1,2}', 'delta_0_{1,3}', 'delta_0_{1,4}']
>>> parse_divisor(1, 2, "delta_0_{1,2}"), divisor_name(3, 1, (1, ()))
((0, (1, 2)), 'delta_1_{}')
"""

from __future__ import annotations

import re
from functools import lru_cache
from itertools import combinations

from covertree.errors import InputError

__all__ = [
    "IRR",
    "canonical_key",
    "divisors",
    "divisor_name",
    "parse_divisor",
    "automorphisms",
    "vertex_spaces",
    "pullback_terms",
]

IRR: tuple = (-1, ())
"""Key of the irreducible boundary divisor ``delta_0``."""

Key = tuple  # (genus of the named side, sorted legs of that side), or IRR


def _stable(g: int, n: int) -> bool:
    return g >= 0 and 2 * g - 2 + n > 0


def canonical_key(g: int, n: int, i: int, side: tuple[int, ...] | frozenset) -> Key:
    """The key of the separating divisor with a genus-``i`` side carrying ``side``.

    >>> canonical_key(0, 5, 0, (1, 2, 5)), canonical_key(2, 1, 1, ())
    ((0, (3, 4)), (1, ()))
    """
    legs = tuple(sorted(side))
    other = tuple(j for j in range(1, n + 1) if j not in legs)
    if not (_stable(i, len(legs) + 1) and _stable(g - i, len(other) + 1)):
        raise InputError(f"no boundary divisor of Mbar_{{{g},{n}}} has a genus-{i} side with legs {list(legs)}")
    return min((i, legs), (g - i, other), key=lambda s: (s[0], len(s[1]), 1 not in s[1], s[1]))


@lru_cache(maxsize=None)
def divisors(g: int, n: int) -> tuple[Key, ...]:
    """Every boundary divisor of ``Mbar_{g,n}``, irreducible first, then by key.

    The count matches the codimension-one stable graphs.

    >>> len(divisors(0, 6)), len(divisors(2, 2)), divisors(3, 0)
    (25, 4, ((-1, ()), (1, ())))
    """
    keys = {IRR} if g >= 1 else set()
    for size in range(n + 1):
        for legs in combinations(range(1, n + 1), size):
            for i in range(g + 1):
                if _stable(i, size + 1) and _stable(g - i, n - size + 1):
                    keys.add(canonical_key(g, n, i, legs))
    return tuple(sorted(keys))


def automorphisms(g: int, n: int, key: Key) -> int:
    """``|Aut|`` of the one-edge graph: 2 for a loop or two equal unlabelled halves.

    >>> automorphisms(2, 0, IRR), automorphisms(2, 0, (1, ())), automorphisms(2, 1, (1, ()))
    (2, 2, 1)
    """
    if key == IRR or (n == 0 and 2 * key[0] == g):
        return 2
    return 1


def divisor_name(g: int, n: int, key: Key) -> str:
    """The one name of a divisor (grammar in the module docstring)."""
    if key == IRR:
        return "delta_0"
    if n == 0:
        return f"delta_{key[0]}"
    return f"delta_{key[0]}_{{{','.join(map(str, key[1]))}}}"


_NAME = re.compile(r"delta_(\d+)(?:_\{([0-9,\s]*)\})?")


def parse_divisor(g: int, n: int, name: str) -> Key:
    """The key of a divisor name on ``Mbar_{g,n}``; :class:`InputError` if it names none."""
    match = _NAME.fullmatch(name)
    if not match:
        raise InputError(f"unknown factor {name!r}: expected delta_0, {_grammar(n)}")
    i, braces = int(match.group(1)), match.group(2)
    if braces is None and (n == 0 or i == 0):
        return _parse_plain(g, n, i, name)
    if braces is None or n == 0:
        raise InputError(f"unknown factor {name!r} on Mbar_{{{g},{n}}}: expected delta_0, {_grammar(n)}")
    legs = tuple(int(x) for x in braces.replace(" ", "").split(",") if x)
    if len(set(legs)) != len(legs) or any(not 1 <= j <= n for j in legs):
        raise InputError(f"bad legs in {name!r}: distinct labels in 1..{n} expected")
    key = canonical_key(g, n, i, legs)
    if key != (i, tuple(sorted(legs))) or list(legs) != sorted(legs):
        raise InputError(f"{name!r} is called {divisor_name(g, n, key)} (one name per divisor)")
    return key


def _parse_plain(g: int, n: int, i: int, name: str) -> Key:
    """``delta_0`` on any ``Mbar_{g,n}``, ``delta_i`` on ``Mbar_g`` (the only
    names without braces :func:`parse_divisor` passes here)."""
    if i == 0:
        if g == 0:
            raise InputError(f"{name!r}: Mbar_{{0,{n}}} has no irreducible boundary divisor")
        return IRR
    if not 1 <= i <= g // 2:
        raise InputError(f"{name!r}: on Mbar_{g} delta_i needs 1 <= i <= {g // 2}")
    return (i, ())


def _grammar(n: int) -> str:
    return "delta_i (1 <= i <= g/2)" if n == 0 else "delta_i_{a,b,...} (genus-i side with legs a, b, ...)"


@lru_cache(maxsize=None)
def vertex_spaces(g: int, n: int, key: Key) -> tuple[tuple[int, tuple[int, ...]], ...]:
    """The vertex spaces of ``xi_D``: per vertex its genus and its legs.

    Legs are global labels, ``n + 1`` and ``n + 2`` the two half-edges; the
    vertex's own label of a leg is its position plus one.

    >>> vertex_spaces(2, 1, IRR), vertex_spaces(2, 1, (1, ()))
    (((1, (1, 2, 3)),), ((1, (2,)), (1, (1, 3))))
    """
    if key == IRR:
        return ((g - 1, tuple(range(1, n + 3))),)
    i, side = key
    other = tuple(j for j in range(1, n + 1) if j not in side)
    return ((i, side + (n + 1,)), (g - i, other + (n + 2,)))


def _node_type(g: int, n: int, key: Key, v: int, vkey: Key) -> Key:
    """Type in ``Mbar_{g,n}`` of the node of divisor ``vkey`` of vertex ``v`` of ``xi_key``."""
    if vkey == IRR:
        return IRR
    gv, legs = vertex_spaces(g, n, key)[v]
    side = {legs[j - 1] for j in vkey[1]}
    rest = set(legs) - side
    halves = {n + 1, n + 2}
    if side & halves and rest & halves:
        return IRR
    genus, free = (vkey[0], side) if not side & halves else (gv - vkey[0], rest)
    return canonical_key(g, n, genus, tuple(free))


@lru_cache(maxsize=None)
def pullback_terms(g: int, n: int, key: Key, factor: tuple) -> tuple[tuple[int, int, tuple], ...]:
    """``xi_D^* factor`` as ``(coefficient, vertex, vertex factor)`` terms.

    Factors are ``("lambda",)``, ``("kappa",)``, ``("psi", j)`` and
    ``("delta", key)``; vertex factors the same with the vertex's own labels.

    >>> pullback_terms(2, 0, (1, ()), ("delta", (1, ())))
    ((-1, 0, ('psi', 1)), (-1, 1, ('psi', 1)))
    >>> pullback_terms(1, 1, IRR, ("delta", IRR))
    ((-1, 0, ('psi', 2)), (-1, 0, ('psi', 3)))
    """
    spaces = vertex_spaces(g, n, key)
    if factor[0] in ("lambda", "kappa"):
        return tuple((1, v, factor) for v, (gv, _) in enumerate(spaces) if gv > 0 or factor[0] == "kappa")
    if factor[0] == "psi":
        return tuple((1, v, ("psi", legs.index(factor[1]) + 1)) for v, (_, legs) in enumerate(spaces) if factor[1] in legs)
    terms = []
    if factor[1] == key:
        for v, (_, legs) in enumerate(spaces):
            terms += [(-1, v, ("psi", legs.index(h) + 1)) for h in (n + 1, n + 2) if h in legs]
    for v, (gv, legs) in enumerate(spaces):
        terms += [(1, v, ("delta", b)) for b in divisors(gv, len(legs)) if _node_type(g, n, key, v, b) == factor[1]]
    return tuple(terms)
