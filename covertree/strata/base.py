"""Base strata: the boundary strata of ``Mbar_{h,b}`` over which covers degenerate.

The base of a cover is a stable curve of type ``(h, b)`` whose legs ``1..b``
are the branch points, leg ``j`` carrying the profile ``profiles[j - 1]``.
Permuting branch points with equal profiles maps covers over one stratum to
covers over another with the same counts, so by default the strata are
grouped into orbits under the group ``prod S_{m_mu}`` of such permutations:
each orbit is given by its member with the least canonical key and its size
(the number of distinct labelled strata in it).  Two labelled strata lie in
one orbit exactly when they become isomorphic once each leg label is replaced
by the class of its profile, which is how orbits are found.

References
----------
J. Harris and D. Mumford, *On the Kodaira dimension of the moduli space of
curves*, Invent. Math. 67 (1982): admissible covers over stable pointed bases.

Examples
--------
Six simple branch points on a rational base, codimension one: the splits
``2|4`` and ``3|3`` of the six points.

>>> strata = base_strata(0, [(2, 1)] * 6, max_codim=1)
>>> [(s.codim, s.orbit_size) for s in strata]
[(0, 1), (1, 15), (1, 10)]
>>> str(strata[2].graph)
'g0{1,2,3}, g0{4,5,6} | 0-1'
>>> len(base_strata(0, [(2, 1)] * 6, max_codim=1, labeled=True))
26
"""

from __future__ import annotations

from collections.abc import Collection, Sequence
from dataclasses import dataclass

from covertree.errors import GraphError, ProfileError
from covertree.graphs.canonical import certify
from covertree.graphs.curve_graph import StableCurveGraph
from covertree.graphs.enumerate import stable_graphs
from covertree.symmetric.partitions import Partition

__all__ = ["BaseStratum", "base_strata"]


@dataclass(frozen=True)
class BaseStratum:
    """A stratum of the base (a representative) and the size of its orbit.

    Examples
    --------
    >>> s = base_strata(1, [(2,)], max_codim=1)[1]
    >>> s.graph.notation, s.orbit_size, s.codim
    ('g0{1} | 0-0', 1, 1)
    """

    graph: StableCurveGraph
    orbit_size: int

    @property
    def codim(self) -> int:
        """Codimension of the stratum (number of nodes of the base)."""
        return self.graph.codim


def base_strata(
    target_genus: int,
    profiles: Sequence[Sequence[int]],
    max_codim: int,
    labeled: bool = False,
    fixed: Collection[int] = (),
    max_work: float | None = None,
) -> list[BaseStratum]:
    """Strata of ``Mbar_{h,b}`` (``b = len(profiles)``) up to codimension ``max_codim``.

    Parameters
    ----------
    target_genus : int
        Genus ``h`` of the base.
    profiles : sequence of sequences of int
        The profile over each branch point (leg ``j`` carries ``profiles[j-1]``);
        profiles are compared as partitions and must have one degree.
    max_codim : int
        Largest codimension listed (capped at ``3h - 3 + b``).
    labeled : bool
        If true, every labelled stratum, each with ``orbit_size`` 1.
    fixed : collection of int
        Legs never permuted (branch points carrying marked points of the
        source).
    max_work : float, optional
        Work limit of the listing (:func:`covertree.graphs.enumerate.stable_graphs`).

    Returns
    -------
    list of BaseStratum
        Sorted by ``(codim, key)`` of the representatives.

    Raises
    ------
    GraphError
        For an unstable base type or a negative ``max_codim``.
    ProfileError
        For a malformed profile or profiles of different degrees.

    Examples
    --------
    >>> [(str(s.graph), s.orbit_size) for s in base_strata(0, [(2,), (2,), (1, 1), (1, 1)], 1)]
    [('g0{1,2,3,4}', 1), ('g0{1,2}, g0{3,4} | 0-1', 1), ('g0{1,3}, g0{2,4} | 0-1', 2)]
    """
    classes = _profile_classes(profiles, fixed)
    graphs = stable_graphs(target_genus, len(classes), max_codim, max_work=max_work)
    if labeled:
        return [BaseStratum(g, 1) for g in graphs]
    orbits: dict[tuple, list] = {}
    for g in graphs:
        orbits.setdefault(_colour_key(g, classes), [g, 0])[1] += 1
    return [BaseStratum(g, size) for g, size in orbits.values()]


def _profile_classes(profiles: Sequence[Sequence[int]], fixed: Collection[int] = ()) -> list[int]:
    """The class (0-based index among the distinct profiles) of each leg; a
    ``fixed`` leg is alone in its class."""
    parts = [Partition(mu) for mu in profiles]
    degrees = {mu.size for mu in parts}
    if len(degrees) > 1:
        listed = ", ".join(str(mu) for mu in parts)
        raise ProfileError(f"the profiles {listed} are not all of one degree")
    keys = [(mu, j if j in fixed else 0) for j, mu in enumerate(parts, start=1)]
    distinct = sorted(set(keys), reverse=True)
    return [distinct.index(k) for k in keys]


def stratum_orbit(graph: StableCurveGraph, profiles: Sequence[Sequence[int]], fixed: Collection[int] = ()) -> BaseStratum:
    """The given labelled stratum with the size of its orbit under permutations
    of equal-profile legs (other than the ``fixed`` ones).

    Raises
    ------
    GraphError
        If the legs of ``graph`` are not exactly ``1..len(profiles)``.

    Examples
    --------
    >>> from covertree.graphs.notation import parse_graph
    >>> stratum_orbit(parse_graph("g0{1,3}, g0{2,4} | 0-1"), [(2,), (2,), (1, 1), (1, 1)]).orbit_size
    2
    """
    b = len(profiles)
    labels = sorted(j for legs in graph.vertex_legs for j in legs)
    if labels != list(range(1, b + 1)):
        shown = ",".join(map(str, labels)) or "none"
        raise GraphError(
            f"stratum {graph.notation!r} has legs {shown}; the problem has {b} branch "
            f"point(s), so the legs must be 1..{b}"
        )
    classes = _profile_classes(profiles, fixed)
    target = _colour_key(graph, classes)
    same = [g for g in stable_graphs(graph.genus, b, graph.codim) if g.codim == graph.codim]
    return BaseStratum(graph, sum(1 for g in same if _colour_key(g, classes) == target))


def _colour_key(g: StableCurveGraph, classes: list[int]) -> tuple:
    """Canonical key of ``g`` with each leg replaced by its profile class."""
    coloured = tuple(tuple(classes[j - 1] for j in legs) for legs in g.vertex_legs)
    return certify(g.vertex_genera, g.nodes, coloured)[0]
