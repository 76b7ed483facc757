"""Admissible covers as user-facing values: source, stable source, weight.

References
----------
J. Harris and D. Mumford, "On the Kodaira dimension of the moduli space of
curves", Inventiones Mathematicae 67 (1982): admissible covers
P. Deligne and D. Mumford, "The irreducibility of the space of curves of
given genus", Publications Mathematiques de l'IHES 36 (1969): stable curves

Examples
--------
Genus-2 double covers of P^1 over the divisor where the six branch points
split 3|3: one cover, two elliptic curves meeting in a point (``delta_1``),
``|Aut| = 4`` (two independent involutions), multiplicity 2:

>>> from covertree.graphs.notation import parse_graph
>>> base = parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1")
>>> [c] = stratum_covers(base, 2, [(2,)] * 6)
>>> c.source.notation, c.stable_source_name, c.automorphisms, c.multiplicity, c.weight
('g1, g1 | 0-1', 'delta_1', 4, 2, Fraction(1, 2))
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass, field
from fractions import Fraction

from covertree.errors import IdentityError
from covertree.gluing.covers import GluedCover, glued_covers
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph, graph_and_order
from covertree.hurwitz.problem import source_genus
from covertree.stabilisation.stabilise import Stabilised, stabilise


@dataclass(frozen=True)
class Cover:
    """One admissible cover over a fixed curve of a base stratum.

    Attributes
    ----------
    edge_profiles : tuple of tuple of int
        Profile over each base node, in the base's edge order.
    source : CurveGraph
        Dual graph of the source curve (often unstable).
    stable_source : CurveGraph
        Its stabilisation (a :class:`StableCurveGraph` when the genus is >= 2).
    automorphisms, multiplicity : int
    raw : GluedCover
        The glued monodromy data (pieces, ports, node indices).
    stabilised : Stabilised
        Stabilisation of ``raw``'s source, with the chain of source nodes
        behind each stable node.
    source_order, stable_order : tuple of int
        The canonical vertex orders of ``source`` (raw source components) and
        ``stable_source`` (vertices of ``stabilised``), kept from building
        them so that they are not computed again; empty when not known.
    """

    edge_profiles: tuple[tuple[int, ...], ...]
    source: CurveGraph
    stable_source: CurveGraph
    automorphisms: int
    multiplicity: int
    raw: GluedCover = field(compare=False, repr=False)
    stabilised: Stabilised = field(compare=False, repr=False)
    source_order: tuple[int, ...] = field(default=(), compare=False, repr=False)
    stable_order: tuple[int, ...] = field(default=(), compare=False, repr=False)

    @property
    def weight(self) -> Fraction:
        """``multiplicity / |Aut|`` (exact)."""
        return Fraction(self.multiplicity, self.automorphisms)

    @property
    def stable_source_name(self) -> str | None:
        """``delta_0`` / ``delta_i`` for a one-node stable source, else ``None``."""
        return divisor_name(self.stable_source)

    def sort_key(self) -> tuple:
        """Deterministic order: profiles, stable source, source, then the code."""
        return (self.edge_profiles, self.stable_source.key, self.source.key, self.raw.code)


def divisor_name(graph: CurveGraph) -> str | None:
    """The name of a codimension-one stratum of ``Mbar_g`` or ``Mbar_{g,n}``:
    ``delta_0`` (irreducible, one loop) or, without legs, ``delta_i``
    (separating, genus ``i <= g/2`` on one side) and, with legs,
    ``delta_i_{a,b,...}`` (the names of :mod:`covertree.intersection.boundary`);
    ``None`` for other codimensions or when there is no such moduli space.

    >>> divisor_name(StableCurveGraph([1, 2], nodes=[(0, 1)]))
    'delta_1'
    >>> divisor_name(StableCurveGraph([1, (1, [1])], nodes=[(0, 1)]))
    'delta_1_{}'
    """
    n = graph.n_legs
    if graph.codim != 1 or 2 * graph.genus - 2 + n <= 0 or (graph.genus < 2 and not n):
        return None
    if graph.n_vertices == 1:
        return "delta_0"
    if not n:
        return f"delta_{min(graph.vertex_genera)}"
    return separating_name(graph.genus, n, graph.genus_at(0), graph.legs_at(0))


def separating_name(genus: int, n: int, side_genus: int, side_legs: Sequence[int]) -> str:
    """The name of the separating divisor of ``Mbar_{genus,n}`` with one side
    of genus ``side_genus`` carrying ``side_legs``."""
    from covertree.intersection.boundary import canonical_key, divisor_name as name

    return name(genus, n, canonical_key(genus, n, side_genus, tuple(side_legs)))


def legs_per_vertex(n_vertices: int, carriers: Sequence[int]) -> tuple[tuple[int, ...], ...]:
    """Leg labels ``1..n`` at each vertex from the vertex carrying each leg.

    >>> legs_per_vertex(2, [1, 0, 1])
    ((2,), (1, 3))
    """
    return tuple(tuple(k for k, v in enumerate(carriers, start=1) if v == w) for w in range(n_vertices))


def make_graph(genera: Sequence[int], edges: Sequence[tuple[int, int]],
               legs: Sequence[Sequence[int]] | None = None) -> CurveGraph:
    """A :class:`StableCurveGraph` when stable, else a :class:`CurveGraph`."""
    return graph_and_order(genera, edges, legs)[0]


def to_cover(raw: GluedCover, genus: int) -> Cover:
    """Build the user-facing cover, checking the source's arithmetic genus."""
    legs = legs_per_vertex(len(raw.source_genera), raw.source_legs)
    source, source_order = graph_and_order(raw.source_genera, raw.source_edges, legs)
    if source.genus != genus:
        raise IdentityError(
            f"source {source.notation} has arithmetic genus {source.genus}, not {genus}"
        )
    stab = stabilise(raw.source_genera, raw.source_edges, legs)
    stable, stable_order = graph_and_order(stab.genera, stab.edges, stab.legs)
    return Cover(raw.edge_profiles, source, stable, raw.automorphisms, raw.multiplicity, raw, stab,
                 source_order, stable_order)


def stratum_covers(base: CurveGraph, degree: int, profiles: Sequence[Sequence[int]],
                   marks: Sequence[tuple[int, int]] = ()) -> Iterator[Cover]:
    """Every admissible cover over a fixed curve of type ``base`` (marked
    covers when ``marks`` are given), streamed in the engine's deterministic
    order."""
    genus = source_genus(degree, base.genus, [tuple(p) for p in profiles])
    for raw in glued_covers(base, degree, profiles, marks):
        yield to_cover(raw, genus)
