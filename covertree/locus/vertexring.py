r"""Classes on the product of the vertex moduli spaces of a base stratum.

A base stratum ``T`` of ``Mbar_{H,b}`` (a stable graph with legs ``1..b``) is
the image of the gluing map ``xi_T : M_T = prod_v Mbar_{h_v, n_v} ->
Mbar_{H,b}``, the special points of vertex ``v`` being its legs and its
half-edges.  Everything the cover-space integrals need on ``M_T`` is a
polynomial in

- ``psi`` of a special point (a leg, or a half-edge ``(q, side)``; side 0 of
  edge ``q = (a, b)`` lies at ``a``, side 1 at ``b``),
- ``kappa_1`` of a vertex space,

and ``xi_T^* psi_j`` is ``psi`` of leg ``j``, ``xi_T^* kappa_1 = sum_v
kappa_1(v)`` (Arbarello–Cornalba 1996, the restriction of ``kappa_1`` to the
boundary).  Polynomials are dictionaries from exponent vectors (one entry per
special point, then one per vertex for ``kappa_1``) to exact ``Fraction``
coefficients; products drop every monomial whose degree on some vertex exceeds
``dim Mbar_{h_v,n_v}``, so their size stays bounded by the top degree.  The
integral of a monomial is the product over vertices of
:func:`covertree.intersection.psi.psi_kappa_integral`.

References
----------
E. Arbarello and M. Cornalba, "Combinatorial and algebro-geometric cohomology
classes on the moduli spaces of curves", Journal of Algebraic Geometry 5 (1996):
kappa_1 and psi restricted to boundary strata

Examples
--------
The nodal rational curve with two legs, ``Mbar_{0,4}``: ``psi`` of a half-edge
integrates to 1.

>>> from covertree.graphs.notation import parse_graph
>>> ring = VertexRing(parse_graph("g0{1,2} | 0-0"))
>>> ring.integrate(ring.product([ring.half_edge_psi(0, 0)]))
Fraction(1, 1)
>>> ring.integrate(ring.product([ring.kappa()]))
Fraction(1, 1)
"""

from __future__ import annotations

from collections.abc import Sequence
from fractions import Fraction
from math import prod

from covertree.intersection.psi import psi_kappa_integral

__all__ = ["VertexRing", "Linear", "Poly"]

Linear = tuple[tuple[int, Fraction], ...]
Poly = dict[tuple[int, ...], Fraction]


class VertexRing:
    """Classes on ``M_T`` for one base stratum graph (see the module docstring)."""

    def __init__(self, graph) -> None:
        self.graph = graph
        n_v = graph.n_vertices
        self._slot_vertex: list[int] = []
        self._leg_slot: dict[int, int] = {}
        self._half_slot: dict[tuple[int, int], int] = {}
        for v in range(n_v):
            for leg in graph.vertex_legs[v]:
                self._leg_slot[leg] = self._add_slot(v)
        for q, (a, b) in enumerate(graph.nodes):
            self._half_slot[(q, 0)] = self._add_slot(a)
            self._half_slot[(q, 1)] = self._add_slot(b)
        self._n_slots = len(self._slot_vertex)
        self._vertex_of = tuple(self._slot_vertex) + tuple(range(n_v))
        self.dims = tuple(3 * graph.vertex_genera[v] - 3 + graph.valence(v) for v in range(n_v))

    def _add_slot(self, v: int) -> int:
        self._slot_vertex.append(v)
        return len(self._slot_vertex) - 1

    # -- linear forms -------------------------------------------------------
    def leg_psi(self, leg: int) -> Linear:
        """``xi_T^* psi_leg``."""
        return ((self._leg_slot[leg], Fraction(1)),)

    def half_edge_psi(self, q: int, side: int) -> Linear:
        """``psi`` at side ``side`` of edge ``q``."""
        return ((self._half_slot[(q, side)], Fraction(1)),)

    def kappa(self) -> Linear:
        """``xi_T^* kappa_1 = sum_v kappa_1(v)``."""
        return tuple((self._n_slots + v, Fraction(1)) for v in range(self.graph.n_vertices))

    def normal(self, q: int) -> Linear:
        """``-psi - psi'`` at the two half-edges of ``q``: the first Chern class
        of the normal bundle of the divisor where ``q`` persists."""
        return ((self._half_slot[(q, 0)], Fraction(-1)), (self._half_slot[(q, 1)], Fraction(-1)))

    # -- polynomials ------------------------------------------------------------
    def one(self) -> Poly:
        return {(0,) * (self._n_slots + self.graph.n_vertices): Fraction(1)}

    def times(self, poly: Poly, form: Linear) -> Poly:
        """``poly * form``, dropping monomials above a vertex dimension."""
        out: Poly = {}
        vertex_of = self._vertex_of
        for mono, coeff in poly.items():
            load = self._loads(mono)
            for index, c in form:
                v = vertex_of[index]
                if load[v] >= self.dims[v]:
                    continue
                new = mono[:index] + (mono[index] + 1,) + mono[index + 1 :]
                out[new] = out.get(new, Fraction(0)) + coeff * c
        return {m: c for m, c in out.items() if c}

    def _loads(self, mono: tuple[int, ...]) -> list[int]:
        load = [0] * self.graph.n_vertices
        for index, power in enumerate(mono):
            if power:
                load[self._vertex_of[index]] += power
        return load

    def product(self, forms: Sequence[Linear]) -> Poly:
        poly = self.one()
        for form in forms:
            poly = self.times(poly, form)
            if not poly:
                break
        return poly

    def integrate(self, poly: Poly) -> Fraction:
        """``\\int_{M_T}`` of a polynomial: products of vertex integrals."""
        return sum((c * self._integrate_monomial(m) for m, c in poly.items()), Fraction(0))

    def _integrate_monomial(self, mono: tuple[int, ...]) -> Fraction:
        graph = self.graph
        per_vertex: list[list[int]] = [[] for _ in range(graph.n_vertices)]
        for slot in range(self._n_slots):
            per_vertex[self._slot_vertex[slot]].append(mono[slot])
        kappas = mono[self._n_slots :]
        if any(sum(per_vertex[v]) + kappas[v] != self.dims[v] for v in range(graph.n_vertices)):
            return Fraction(0)
        return prod((psi_kappa_integral(graph.vertex_genera[v], per_vertex[v], kappas[v])
                     for v in range(graph.n_vertices)), start=Fraction(1))
