r"""What one admissible cover contributes along each node of its base.

Let ``f`` be a cover over a fixed curve of a base stratum ``T`` with nodes
``q``.  Near the stratum of ``f`` the normalised space of admissible covers has
one smooth branch per choice of branches at every node (``prod_q prod_i
e_{q,i} / L_q`` of them, ``L_q = lcm_i e_{q,i}``), with a coordinate ``u_q``
per node, ``t_q = u_q^{L_q}`` (docs/theory.md, section 6, and
:mod:`covertree.catalogue.local_structure`).  A source node ``x`` over ``q``
with index ``e_x`` is smoothed by ``u_q^{L_q/e_x}``; a node ``n`` of the
stabilised source is smoothed by the product of the parameters of the chain of
source nodes it replaces.  Hence, near the stratum, as divisors,

- the locus where the prestable source has a node, counted with the order of
  its local equation ``xy = u^m``, is ``sum_q (sum_{x over q} L_q/e_x) [u_q = 0]``
  (:attr:`EdgeData.all_nodes`);
- ``src^* delta_j = sum_q (sum over stable nodes n of type delta_j of
  sum_{x in chain(n), x over q} L_q/e_x) [u_q = 0]`` (:attr:`EdgeData.deltas`).

The type of a stable node (non-separating, or separating off genus ``j``) does
not change when other nodes are smoothed, so these coefficients are those of
the boundary divisor ``u_q = 0`` itself, the same at every stratum it contains.

The covers come from either engine as ``(genera, edges, weight)``: source
components, source nodes ``(i, j, q, e)`` (component over side 0 of base edge
``q``, component over side 1, index) and ``weight = mult/|Aut|`` summed over
the covers with these data.  The weight of the strata of the cover space,
``#branches/|Aut f| = mult / (|Aut f| prod_q L_q)``, is :attr:`CoverKey.weight`
after grouping.

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers
F. F. Knudsen, "The projectivity of the moduli space of stable curves II:
the stacks M_{g,n}", Mathematica Scandinavica 52 (1983): stabilisation with
marked points

Examples
--------
Genus-2 double covers of ``P^1`` over the ``2|4`` divisor: the two unramified
nodes form a rational bridge, one non-separating stable node smoothed to order
2; the prestable source has two nodes of order 1.

>>> from covertree.catalogue.covers import stratum_covers
>>> from covertree.graphs.notation import parse_graph
>>> [c] = stratum_covers(parse_graph("g0{1,2}, g0{3,4,5,6} | 0-1"), 2, [(2,)] * 6)
>>> data = edge_data(c.raw.source_genera, cover_edges(c), 1, 2)
>>> data
(EdgeData(lcm=1, all_nodes=2, deltas=(2, 0), psis=()),)
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from dataclasses import dataclass
from fractions import Fraction
from math import lcm, prod

from covertree.catalogue.covers import legs_per_vertex
from covertree.catalogue.local_structure import node_type
from covertree.errors import IdentityError
from covertree.stabilisation.stabilise import smoothing_orders, stabilise

__all__ = ["EdgeData", "CoverKey", "edge_data", "cover_edges", "grouped"]

SourceEdge = tuple[int, int, int, int]


@dataclass(frozen=True, order=True)
class EdgeData:
    """The contribution of a cover along one base node ``q``.

    Attributes
    ----------
    lcm : int
        ``L_q``, the ramification of the branch map along ``u_q = 0``.
    all_nodes : int
        ``sum_{x over q} L_q/e_x``: order of the node locus of the prestable source.
    deltas : tuple of int
        Coefficient of ``[u_q = 0]`` in ``src^* delta`` for each boundary
        divisor of the source space, in the order of
        :func:`covertree.catalogue.pullback.boundary_divisors` (``delta_0 ..
        delta_{G//2}`` unmarked; empty when there is no such space).
    psis : tuple of int
        For a marked source, per leg ``k``: the coefficient ``c`` of ``[u_q =
        0]`` in ``src^* psi_k = psi_x - c [u_q = 0] - ...``, the sum of ``L_q/e``
        over the source nodes over ``q`` that the leg crossed when
        stabilisation contracted the rational tree carrying it (``psi_x =
        br^* psi_J / e_x`` being psi of the marked point on the prestable source).
    """

    lcm: int
    all_nodes: int
    deltas: tuple[int, ...]
    psis: tuple[int, ...] = ()


@dataclass(frozen=True)
class CoverKey:
    """Covers over one base stratum with equal :class:`EdgeData` on every node,
    with the summed stratum weight ``sum #branches/|Aut f|``."""

    edges: tuple[EdgeData, ...]
    weight: Fraction


def cover_edges(cover) -> tuple[SourceEdge, ...]:
    """``(i, j, q, e)`` per source node of a listed :class:`~covertree.catalogue.covers.Cover`."""
    raw = cover.raw
    return tuple((a, b, q, e) for (a, b), q, e in zip(raw.source_edges, raw.source_edge_over, raw.source_edge_index))


def edge_data(genera: Sequence[int], edges: Sequence[SourceEdge], n_base_edges: int,
              genus: int, carriers: Sequence[int] = ()) -> tuple[EdgeData, ...]:
    """Per base node, the data of the module docstring for one source;
    ``carriers`` gives the component carrying each leg of a marked source."""
    lcms = [1] * n_base_edges
    for _, _, q, e in edges:
        lcms[q] = lcm(lcms[q], e)
    over, index = [q for _, _, q, _ in edges], [e for _, _, _, e in edges]
    all_nodes = smoothing_orders(range(len(edges)), over, index, lcms)
    names = _divisor_names(genus, len(carriers))
    deltas = [[0] * len(names) for _ in range(n_base_edges)]
    psis = [[0] * len(carriers) for _ in range(n_base_edges)]
    if names or carriers:
        legs = legs_per_vertex(len(genera), carriers)
        stab = stabilise(genera, [(a, b) for a, b, _, _ in edges], legs)
        for n, chain in enumerate(stab.chains if names else ()):
            j = _type_index(node_type(stab.genera, stab.edges, n, stab.legs), names)
            for q, order in enumerate(smoothing_orders(chain, over, index, lcms)):
                deltas[q][j] += order
        for k, path in enumerate(stab.leg_paths):
            for q, order in enumerate(smoothing_orders(path, over, index, lcms)):
                psis[q][k] += order
    return tuple(EdgeData(lcms[q], all_nodes[q], tuple(deltas[q]), tuple(psis[q])) for q in range(n_base_edges))


def _divisor_names(genus: int, n: int) -> tuple[str, ...]:
    from covertree.catalogue.pullback import boundary_divisors
    from covertree.errors import ProblemError

    try:
        return tuple(boundary_divisors(genus, n))
    except ProblemError:
        return ()


def _type_index(kind: str | None, names: Sequence[str]) -> int:
    if kind not in names:  # pragma: no cover - a bug
        raise IdentityError(f"stable node of unknown type {kind!r}")
    return names.index(kind)


def grouped(items: Iterable[tuple], n_base_edges: int, genus: int) -> tuple[CoverKey, ...]:
    """Group ``(genera, edges, mult/|Aut| weight)`` items (with a fourth
    entry, the leg carriers, for a marked source) by their edge data;
    weights become stratum weights (divided by ``prod_q L_q``); sorted."""
    tally: dict[tuple[EdgeData, ...], Fraction] = {}
    for genera, edges, weight, *rest in items:
        key = edge_data(genera, edges, n_base_edges, genus, rest[0] if rest else ())
        tally[key] = tally.get(key, Fraction(0)) + Fraction(weight) / prod(d.lcm for d in key)
    return tuple(CoverKey(k, w) for k, w in sorted(tally.items()))
