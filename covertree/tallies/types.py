r"""Weighted tallies of admissible covers from combinatorial types, without
listing covers (docs/theory.md, section 10).

Types
-----
Fix a base stratum ``G`` (a fixed base curve of that type).  A *type* ``T``
over ``G`` is: for every base vertex ``v`` a finite set of *pieces*, each with a
shape (:mod:`covertree.tallies.shapes`: degree ``k``, sub-profiles ``nu_j`` at
the legs of ``v``, profiles ``alpha_p`` at the half-edge points of ``v``),
degrees adding up to ``d`` and sub-profiles at leg ``j`` to ``mu_j``; the
points of ``alpha_p`` (the preimages of the node point ``p`` in the piece) are
*labelled*; and for every base edge a length-preserving bijection between the
labelled points over its two sides.  An isomorphism of types renumbers the
pieces over each vertex (keeping shapes) and relabels the points of equal
length over each half-edge point within each piece, carrying the bijections to
the bijections; ``Aut(T)`` is the stabiliser.  A cover ``f`` (docs/theory.md, section
5) has a type: its pieces are the orbits at each vertex, its bijections the
``beta_e``, once the orbits are numbered and the cycles of every ``s_p``
labelled (a *decoration* of ``f``); different decorations give isomorphic
types.  The source graph, the node profiles, ``mult`` and connectedness are
read off the type.

Theorem
-------
For every type ``T``,

    sum over covers f of type T (up to isomorphism) of 1/|Aut f|
        = prod over the pieces i of H_lab(i) / |Aut T|,

with ``H_lab(i) = connected_hurwitz(k_i, h_v, all profiles of i) * prod_p
|Aut alpha_{i,p}|``.  Multiplying by ``mult`` (a function of the type), the sum
of the type weights ``mult * prod H_lab / |Aut T|`` over the isomorphism
classes of types with a given source graph, stable source and node profiles
equals the list engine's sum of ``mult(f)/|Aut f|`` over the covers with these
data.

Proof.  (1) *Decorations form an Aut(T)-torsor.*  Let ``Dec(f)`` be the
decorations of ``f`` of type exactly ``T``.  ``Aut(T)`` acts on it (renumber
and relabel the decoration); two decorations ``delta, delta'`` of type ``T``
differ by the renumbering ``delta' o delta^{-1}``, which carries ``T`` to
``T``, so the action is transitive, and it is free since a decoration is a
bijection onto the orbits and cycles.  So ``|Dec(f)| = |Aut T|``.
(2) *Counting decorated covers.*  Let ``D`` be the groupoid of decorated covers
of type ``T`` (objects: a cover with a decoration of type ``T``; morphisms:
elements of ``prod_v S_d`` carrying one to the other).  ``Aut(f)`` acts on
``Dec(f)`` and the classes of ``D`` over ``f`` are its orbits, with stabilisers
the automorphisms of the decorated objects, so by orbit-stabiliser the
groupoid cardinality is ``|D| = sum_f |Dec(f)|/|Aut f| = |Aut T| sum_f
1/|Aut f|``.  On the other hand a decorated cover of type ``T`` is the same as
a labelled connected local cover of each piece's shape on the sheets of its
orbit (the gluing is dictated by ``T``), and its morphisms are products of
bijections between the orbits respecting labels; so ``|D| = prod_v (number of
ways to cut the sheets into numbered orbits of the sizes k_i, times the
numbers of labelled transitive tuples) / d! = prod_i (labelled transitive
tuples on k_i sheets) / k_i!``.  A labelled transitive tuple is a transitive
tuple with a labelling of the cycles of each ``s_p``, ``prod_p |Aut
alpha_p|`` of them, so this is ``prod_i H_lab(i)``.  Comparing the two
expressions proves the theorem.  QED.

How it is summed
----------------
Summing over isomorphism classes needs no automorphism groups: with pieces
numbered (consecutively by vertex and shape) and points labelled, the group
``S ⋉ L`` (``S`` renumbering pieces of equal vertex and shape, ``L`` relabelling
points) acts on the set ``X`` of labelled matchings of a fixed list of pieces,
with stabilisers ``Aut T``, so ``sum_T 1/|Aut T| = |X| / (|S| |L|)``, and
``|L| = prod_i prod_p |Aut alpha_{i,p}|`` cancels the labelling factors of
``H_lab``.  Hence, for a list of pieces,

    sum over its types of the weights = mult * prod_i H(i) / |S| * #(labelled
    matchings with connected source),

grouped by source graph, and the matchings are counted by orbits of
automorphisms of partial matchings (:mod:`covertree.tallies.gluing`), so the
work grows with the number of types, never with the number of covers.
The simple branch points of no marked leg are pooled at each base vertex
(:func:`covertree.tallies.shapes.vertex_orbits`; not for a marked source
that stabilisation contracts, see :func:`_kept_labelled`): the local
multisets that differ only by which of them each piece carries form one
orbit, summed once with the orbit size as a factor, so a vertex with many
simple legs costs the number of ways to share their count among the pieces,
not the number of set partitions of the legs.
:func:`iter_types` also lists the types themselves with ``|Aut T|``
(canonical forms of coloured graphs), which the tests compare with the fast
sum.

A hand example (checked against docs/theory.md, section 10): double covers of an elliptic
curve branched over two points, over the nodal rational curve ``g0{1,2} |
0-0``.  The list engine finds three covers: two unramified over the node with
``|Aut| = 2``, ``mult = 1``, and one ramified (``mult = 2``, ``|Aut| = 2``):
total 2.  Types: one piece of degree 2 branched at both legs with ``alpha =
beta = (1,1)``, genus 0, ``H = 1/2``, ``H_lab = 1/2 * 2! * 2! = 2``; its one
type up to isomorphism has ``|Aut T| = 2`` (the two bijections of the points
differ by a relabelling), weight ``1 * 2 / 2 = 1 = 1/2 + 1/2``.  One piece with
``alpha = beta = (2)``, genus 1, ``H = 1/2``: weight ``2 * 1/2 = 1``.  Total 2.

Examples
--------
>>> from covertree.hurwitz.problem import HurwitzProblem
>>> from covertree.strata.base import base_strata
>>> problem = HurwitzProblem.build(2, 1, genus=2)
>>> tallies = tally_catalogue(problem, max_codim=1)
>>> [(t.base.graph.notation, str(t.total_weight), t.identity_holds) for t in tallies.strata]
[('g1{1,2}', '2', True), ('g0{1,2} | 0-0', '2', True), ('g0{1,2}, g1 | 0-1', '2', True)]
>>> [(g.notation, str(w)) for g, w in tallies.strata[1].by_source()]
[('g1 | 0-0', '1'), ('g0 | 0-0^2', '1')]

References
----------
J. Harris and D. Mumford, *On the Kodaira dimension of the moduli space of
curves*, Invent. Math. 67 (1982) (admissible covers).  The orbit-counting
(orbit-stabiliser and groupoid cardinality) arguments are classical; see for
instance J. C. Baez and J. Dolan, *From finite sets to Feynman diagrams*
(2001), for groupoid cardinality.
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass, field
from fractions import Fraction
from functools import lru_cache
from collections import Counter
from itertools import product
from math import factorial, lcm, perm, prod

from covertree.catalogue.catalogue import problem_hurwitz, select_strata, weight_by_graph
from covertree.catalogue.covers import legs_per_vertex, make_graph
from covertree.errors import GraphError, IdentityError, ProblemError
from covertree.graphs.canonical import certify
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.hurwitz.problem import HurwitzProblem
from covertree.monodromy.local import special_points
from covertree.stabilisation.stabilise import Stabilised, smoothing_orders, stabilise
from covertree.strata.base import BaseStratum
from covertree.tallies.gluing import count_matchings
from covertree.tallies.shapes import Shape, vertex_orbits, vertex_pieces

__all__ = ["TallyEntry", "TypeTally", "TallyCatalogue", "CoverType", "tally_stratum", "tally_catalogue", "iter_types"]

Profile = tuple[int, ...]


@dataclass(frozen=True)
class TallyEntry:
    """The summed weight of the covers with one source graph on one list of
    pieces, or on every list in its orbit under permutations of the pooled
    simple branch points (:mod:`covertree.tallies.shapes`; raw data, read
    up to renumbering of the pieces).

    Attributes
    ----------
    edge_profiles : tuple of profiles
        Profile over each base node, in the base's edge order.
    genera : tuple of int
        Genus of each piece (source vertex).
    edges : tuple of (int, int, int, int)
        Source nodes ``(i, j, k, l)``: piece ``i`` over side 0 of base edge
        ``k``, piece ``j`` over side 1, ramification index ``l``.
    weight : Fraction
        Sum of ``mult(f)/|Aut f|`` over the covers with these data.
    legs : tuple of int
        For a marked problem, the piece carrying each leg of the source; the
        weight is then that of the marked covers (a sum over labellings).
    """

    edge_profiles: tuple[Profile, ...]
    genera: tuple[int, ...]
    edges: tuple[tuple[int, int, int, int], ...]
    weight: Fraction
    legs: tuple[int, ...] = ()

    @property
    def source(self) -> CurveGraph:
        """The source dual graph (often unstable)."""
        return _graphs(self.genera, _plain(self.edges), self.legs)[0]

    @property
    def stable_source(self) -> CurveGraph:
        """The stabilised source."""
        return _graphs(self.genera, _plain(self.edges), self.legs)[1]

    @property
    def stabilised(self) -> Stabilised:
        """The stabilisation with its chains of source nodes."""
        return _graphs(self.genera, _plain(self.edges), self.legs)[2]


def _plain(edges: Sequence[tuple[int, int, int, int]]) -> tuple[tuple[int, int], ...]:
    return tuple((i, j) for i, j, _, _ in edges)


@lru_cache(maxsize=65536)
def _graphs(genera: tuple[int, ...], edges: tuple[tuple[int, int], ...], carriers: tuple[int, ...] = ()):
    legs = legs_per_vertex(len(genera), carriers)
    stab = stabilise(genera, edges, legs)
    return make_graph(genera, edges, legs), make_graph(stab.genera, stab.edges, stab.legs), stab


@dataclass(frozen=True)
class TypeTally:
    """The tallies over one base stratum (orbit), from types.

    Attributes
    ----------
    base : BaseStratum
    entries : tuple of TallyEntry
        In a deterministic order.
    hurwitz_number : Fraction
    """

    base: BaseStratum
    entries: tuple[TallyEntry, ...]
    hurwitz_number: Fraction

    @property
    def total_weight(self) -> Fraction:
        """``sum_f mult(f)/|Aut f|`` over the covers over a fixed base curve."""
        return sum((e.weight for e in self.entries), Fraction(0))

    @property
    def identity_holds(self) -> bool:
        """The degeneration identity: total weight == Hurwitz number."""
        return self.total_weight == self.hurwitz_number

    def by_source(self) -> list[tuple[CurveGraph, Fraction]]:
        """Summed weight per stable source stratum, sorted canonically (as
        :meth:`covertree.catalogue.catalogue.StratumResult.by_source`)."""
        return weight_by_graph((e.stable_source, e.weight) for e in self.entries)

    def by_profiles(self) -> list[tuple[tuple[Profile, ...], Fraction]]:
        """Summed weight per tuple of node profiles (base edge order), sorted."""
        tally: dict[tuple, Fraction] = {}
        for e in self.entries:
            tally[e.edge_profiles] = tally.get(e.edge_profiles, Fraction(0)) + e.weight
        return sorted(tally.items())

    def by_class(self) -> list[tuple[tuple[Profile, ...], CurveGraph, CurveGraph, Fraction]]:
        """Summed weight per ``(node profiles, source, stable source)``, sorted."""
        tally: dict[tuple, Fraction] = {}
        for e in self.entries:
            key = (e.edge_profiles, e.source, e.stable_source)
            tally[key] = tally.get(key, Fraction(0)) + e.weight
        rows = sorted(tally.items(), key=lambda kv: (kv[0][0], kv[0][2].key, kv[0][1].key))
        return [(p, s, t, w) for (p, s, t), w in rows]

    def pullback_orders(self) -> list[tuple[TallyEntry, Fraction, list[tuple[int, int]]]]:
        """For a codimension-one base: per entry, ``weight / L`` (``L`` the lcm of
        the node profile) and the stable nodes as ``(index in the
        stabilisation's edges, order)`` with order ``sum L/e`` over the chain.
        ``c(D, delta) = sum weight/L * (sum of the orders of the nodes of type
        delta)`` (docs/theory.md, section 8: ``#branches / |Aut f| = mult / (L
        |Aut f|)``).

        Raises
        ------
        IdentityError
            If the base stratum is not of codimension one.
        """
        if self.base.codim != 1:
            raise IdentityError("orders along a branch need a codimension-one base stratum")
        out = []
        for e in self.entries:
            big_l = lcm(*e.edge_profiles[0])
            over, index = [q for _, _, q, _ in e.edges], [l for _, _, _, l in e.edges]
            orders = [(n, smoothing_orders(chain, over, index, (big_l,))[0])
                      for n, chain in enumerate(e.stabilised.chains)]
            out.append((e, Fraction(e.weight, big_l), orders))
        return out


@dataclass(frozen=True)
class TallyCatalogue:
    """A Hurwitz problem, the codimension bound and one tally per stratum
    (the shape of :class:`covertree.catalogue.catalogue.Catalogue`, no covers)."""

    problem: HurwitzProblem
    codim: int
    hurwitz_number: Fraction
    strata: tuple[TypeTally, ...]

    @property
    def failures(self) -> list[TypeTally]:
        """Strata whose degeneration identity fails (each one a bug)."""
        return [s for s in self.strata if not s.identity_holds]


# ---------------------------------------------------------------------------
# Choices of pieces
# ---------------------------------------------------------------------------


@dataclass(frozen=True)
class _Vertex:
    shapes: tuple[Shape, ...]
    multisets: tuple[tuple[int, ...], ...]
    halves: tuple[tuple, ...]  # per half point of the vertex: ("half", k, side)
    groups: tuple[frozenset, ...] = ()  # per shape, its port groups (k, side, length)
    orbits: dict[tuple[int, ...], int] = field(default_factory=dict)  # multiset -> orbit size (1 unpooled)


def _shape_groups(shape: Shape, halves: Sequence[tuple]) -> frozenset:
    """The port groups ``(k, side, length)`` a piece of this shape has."""
    return frozenset((k, side, length) for (_, k, side), profile in zip(halves, shape.halves)
                     for length in set(profile))


def _lengths_connect(groups: Sequence[frozenset]) -> bool:
    """Whether the pieces are connected when every holder of a port group
    ``(k, 0, l)`` is joined to every holder of ``(k, 1, l)``.  A matched pair
    joins two such holders, so otherwise no matching of these pieces has a
    connected source; most balanced choices at high degree fail here, which
    is why it is tested before anything else is built for a choice."""
    if len(groups) == 1:
        return True
    present = set().union(*groups)
    hubs: dict[tuple[int, int], list[int]] = {}
    for i, g in enumerate(groups):
        for k, side, length in g:
            if (k, 1 - side, length) in present:
                hubs.setdefault((k, length), []).append(i)
    seen, todo, used = {0}, [0], set()
    while todo:
        i = todo.pop()
        for k, side, length in groups[i]:
            hub = (k, length)
            if hub in used or hub not in hubs:
                continue
            used.add(hub)
            for j in hubs[hub]:
                if j not in seen:
                    seen.add(j)
                    todo.append(j)
    return len(seen) == len(groups)


def _vertex_data(base: StableCurveGraph, degree: int, genus: int, profiles: Sequence[Profile],
                 fixed: frozenset[int] | None = None) -> list[_Vertex]:
    """Shapes and local multisets per base vertex.  With ``fixed`` (the
    branch points that stay labelled: the marked ones), the other simple
    branch points are pooled: one multiset per orbit, with its size;
    without, every multiset with size 1."""
    out = []
    simple = (2,) + (1,) * (degree - 2)
    for v, spec in enumerate(special_points(base)):
        labels = [s[1] for s in spec if s[0] == "leg"]
        legs = tuple(tuple(profiles[j - 1]) for j in labels)
        halves = tuple(s for s in spec if s[0] == "half")
        key = (degree, base.vertex_genera[v], legs, len(halves), genus)
        ends = {(k, side): p for p, (_, k, side) in enumerate(halves)}
        loops = tuple((ends[(k, 0)], ends[(k, 1)]) for k, (a, b) in enumerate(base.nodes) if a == b == v)
        if fixed is None:
            shapes, multisets = vertex_pieces(*key, loops)
            orbits = dict.fromkeys(multisets, 1)
        else:
            pooled = tuple(p for p, j in enumerate(labels) if legs[p] == simple and j not in fixed)
            shapes, multisets, sizes = vertex_orbits(*key, loops, pooled)
            orbits = dict(zip(multisets, sizes))
        out.append(_Vertex(shapes, tuple(multisets), halves,
                           tuple(_shape_groups(sh, halves) for sh in shapes), orbits))
    return out


def _multiset_options(vd: _Vertex) -> list[tuple[tuple[int, ...], tuple[Profile, ...], int]]:
    """``(multiset, profiles at the half points, genus)`` for every local
    multiset of a vertex.  The multisets come sorted, so consecutive ones
    share a prefix: the profiles are extended from the longest shared prefix
    (a stack), one merge of sorted runs per new piece, instead of sorting
    every multiset's points afresh (the hot spot at high degree)."""
    n = len(vd.halves)
    stack: list[tuple[tuple[Profile, ...], int]] = [(((),) * n, 0)]
    previous: tuple[int, ...] = ()
    out = []
    for m in vd.multisets:
        common = 0
        while common < min(len(m), len(previous)) and m[common] == previous[common]:
            common += 1
        del stack[common + 1:]
        for i in m[common:]:
            profiles, genus = stack[-1]
            shape = vd.shapes[i]
            stack.append((tuple(tuple(sorted(profiles[p] + shape.halves[p], reverse=True)) for p in range(n)),
                          genus + shape.genus))
        out.append((m, *stack[-1]))
        previous = m
    return out


def _choices(base: StableCurveGraph, data: list[_Vertex], genus: int) -> Iterator[tuple[tuple[int, ...], ...]]:
    """Balanced choices of one local multiset per vertex, genera adding up to
    at most ``genus``."""
    where = {}
    for v, vd in enumerate(data):
        for p, (_, k, side) in enumerate(vd.halves):
            where[(k, side)] = (v, p)
    checks: list[list[tuple]] = [[] for _ in data]
    for k, (i, j) in enumerate(base.nodes):
        checks[max(i, j)].append((where[(k, 0)], where[(k, 1)]))
    options = [_multiset_options(vd) for vd in data]
    chosen: list = []

    def rec(v: int, genus_left: int):
        if v == len(data):
            yield tuple(c[0] for c in chosen)
            return
        for option in options[v]:
            if option[2] > genus_left:
                continue
            chosen.append(option)
            if all(chosen[a][1][pa] == chosen[b][1][pb] for (a, pa), (b, pb) in checks[v]):
                yield from rec(v + 1, genus_left - option[2])
            chosen.pop()

    yield from rec(0, genus)


def _edge_profiles(base: StableCurveGraph, data: list[_Vertex], choice) -> tuple[Profile, ...]:
    out = []
    for k, (i, _) in enumerate(base.nodes):
        p = data[i].halves.index(("half", k, 0))
        out.append(tuple(sorted((x for s in choice[i] for x in data[i].shapes[s].halves[p]), reverse=True)))
    return tuple(out)


def _class_ids(choice) -> list[int]:
    """Class of each piece (equal vertex and shape index), consecutive."""
    out, last, c = [], None, -1
    for v, multiset in enumerate(choice):
        for s in multiset:
            if (v, s) != last:
                c, last = c + 1, (v, s)
            out.append(c)
    return out


def _mark_assignments(base: StableCurveGraph, vertex: Sequence[int], shapes: Sequence[Shape],
                      marks: Sequence[tuple[int, int]]) -> list[tuple[tuple[int, ...], int]]:
    """Every way to put the legs ``(J, e)`` on pieces, with the number of
    labellings of the marked points that does it: per piece and ``(J, e)``,
    ``m! / (m - c)!`` for ``m`` points of index ``e`` over ``J`` in the piece
    and ``c`` legs put there."""
    position = {j: (v, legs.index(j)) for v, legs in enumerate(base.vertex_legs) for j in legs}
    options = []
    for point, index in marks:
        v, p = position[point]
        options.append([i for i, s in enumerate(shapes) if vertex[i] == v and index in s.legs[p]])
    out = []
    for carriers in product(*options):
        used = Counter(zip(carriers, marks))
        ways = 1
        for (i, (point, index)), c in used.items():
            ways *= perm(shapes[i].legs[position[point][1]].count(index), c)
        if ways:
            out.append((carriers, ways))
    return out


def _choice_entries(base: StableCurveGraph, data: list[_Vertex], choice, genus: int,
                    marks: Sequence[tuple[int, int]] = (), orbit: int = 1) -> list[TallyEntry]:
    if not _lengths_connect([data[v].groups[s] for v, m in enumerate(choice) for s in m]):
        return []
    vertex = [v for v, m in enumerate(choice) for _ in m]
    shapes = [data[v].shapes[s] for v, m in enumerate(choice) for s in m]
    classes = _class_ids(choice)
    profiles = _edge_profiles(base, data, choice)
    n_ports = sum(len(p) for p in profiles)
    genera = tuple(s.genus for s in shapes)
    if n_ports - len(shapes) + 1 != genus - sum(genera):
        raise IdentityError(f"Riemann-Hurwitz fails for the pieces {shapes} over {base.notation}")
    mult = prod(x for p in profiles for x in p)
    sizes = [classes.count(c) for c in range(classes[-1] + 1)]
    coeff = Fraction(mult * orbit) * prod(s.hurwitz for s in shapes) / prod(factorial(n) for n in sizes)
    counts = count_matchings(base.nodes, vertex, [s.halves for s in shapes], classes)
    if not marks:
        return [TallyEntry(profiles, genera, key, coeff * n) for key, n in sorted(counts.items())]
    assignments = _mark_assignments(base, vertex, shapes, marks)
    return [TallyEntry(profiles, genera, key, coeff * n * ways, carriers)
            for key, n in sorted(counts.items()) for carriers, ways in assignments]


def _check_base(problem: HurwitzProblem, graph: StableCurveGraph) -> None:
    """The base must be a stratum of ``Mbar_{h,b}`` with legs ``1..b``."""
    legs = sorted(j for x in graph.vertex_legs for j in x)
    if graph.genus != problem.target_genus or legs != list(range(1, problem.points + 1)):
        raise GraphError(
            f"stratum {graph.notation!r} is not a stratum of Mbar_{{{problem.target_genus},{problem.points}}} "
            f"(genus {problem.target_genus}, legs 1..{problem.points})"
        )


def _kept_labelled(problem: HurwitzProblem) -> frozenset[int] | None:
    """The branch points kept labelled when the simple ones are pooled: the
    marked ones; ``None`` (pool nothing) for a marked source contracted by
    stabilisation (no ``Mbar_{g,n}``), whose leg paths
    (:func:`covertree.locus.edges.edge_data`) depend on how the pieces are
    numbered, so that they stay those of the labelled sum."""
    if problem.marks and not problem.has_source_space:
        return None
    return frozenset(j for j, _ in problem.marks)


def tally_stratum(problem: HurwitzProblem, base: BaseStratum) -> TypeTally:
    """The tallies over one base stratum, summed over types.

    Examples
    --------
    Genus-2 double covers of ``P^1`` over the ``3|3`` divisor: one cover,
    ``|Aut| = 4``, ``mult = 2``.

    >>> from covertree.graphs.notation import parse_graph
    >>> problem = HurwitzProblem.build(2, 0, genus=2)
    >>> t = tally_stratum(problem, BaseStratum(parse_graph("g0{1,2,3}, g0{4,5,6} | 0-1"), 10))
    >>> str(t.total_weight), [(g.notation, str(w)) for g, w in t.by_source()]
    ('1/2', [('g1, g1 | 0-1', '1/2')])

    Raises
    ------
    GraphError
        If ``base`` is not a stratum of the target with legs ``1..b``.
    IdentityError
        If Riemann-Hurwitz fails for a list of pieces (a bug).
    """
    _check_base(problem, base.graph)
    profiles = [tuple(p) for p in problem.profiles]
    data = _vertex_data(base.graph, problem.degree, problem.genus, profiles, _kept_labelled(problem))
    entries: list[TallyEntry] = []
    for choice in _choices(base.graph, data, problem.genus):
        orbit = prod(vd.orbits[m] for vd, m in zip(data, choice))
        entries.extend(_choice_entries(base.graph, data, choice, problem.genus, problem.marks, orbit))
    return TypeTally(base, tuple(entries), problem_hurwitz(problem))


@dataclass(frozen=True)
class CoverType:
    """One combinatorial type up to isomorphism (module docstring).

    Attributes
    ----------
    edge_profiles : tuple of profiles
    vertex : tuple of int
        Base vertex of each piece.
    shapes : tuple of Shape
    edges : tuple of (int, int, int, int)
        Matched pairs up to relabelling: ``(i, j, k, l)`` as in :class:`TallyEntry`.
    automorphisms : int
        ``|Aut T|``: piece renumberings keeping the matching (vertex
        automorphisms of a coloured graph) times ``prod M!`` over the numbers
        ``M`` of pairs with equal ``(i, j, k, l)`` (relabellings of points).
    weight : Fraction
        ``mult * prod H_lab / |Aut T|``.
    """

    edge_profiles: tuple[Profile, ...]
    vertex: tuple[int, ...]
    shapes: tuple[Shape, ...]
    edges: tuple[tuple[int, int, int, int], ...]
    automorphisms: int
    weight: Fraction


def _type_code(classes: Sequence[int], edges: Sequence[tuple[int, int, int, int]]) -> tuple[tuple, int, int]:
    """Canonical code, vertex automorphisms and ``prod M!`` of a type, via the
    coloured graph with a vertex per piece (colour: its class) and per distinct
    pair ``(i, j, k, l)`` (colour: ``k, l, M``), joined to ``i`` once and to
    ``j`` twice (three times when ``i == j``)."""
    counts: dict[tuple, int] = {}
    for e in edges:
        counts[e] = counts.get(e, 0) + 1
    colours = sorted({(k, l, m) for (_, _, k, l), m in counts.items()})
    offset = max(classes) + 1
    legs = [(c,) for c in classes]
    graph_edges = []
    for (i, j, k, l), m in sorted(counts.items()):
        x = len(legs)
        legs.append((offset + colours.index((k, l, m)),))
        graph_edges += [(x, i), (x, j), (x, j)]
    key, _, aut_v = certify((0,) * len(legs), tuple(graph_edges), tuple(legs))
    return key, aut_v, prod(factorial(m) for m in counts.values())


def iter_types(problem: HurwitzProblem, base: BaseStratum) -> Iterator[CoverType]:
    """Every type with connected source over a fixed curve of type ``base``,
    each isomorphism class once, with ``|Aut T|`` and its weight (slower than
    :func:`tally_stratum`, which needs no automorphism groups).  Unmarked
    problems only: the types of a marked problem are not listed.

    Examples
    --------
    The hand example of the module docstring:

    >>> from covertree.graphs.notation import parse_graph
    >>> problem = HurwitzProblem.build(2, 1, genus=2)
    >>> types = list(iter_types(problem, BaseStratum(parse_graph("g0{1,2} | 0-0"), 1)))
    >>> [(t.edge_profiles, t.shapes[0].genus, t.automorphisms, str(t.weight)) for t in types]
    [(((1, 1),), 0, 2, '1'), (((2,),), 1, 1, '1')]
    """
    if problem.marks:
        raise ProblemError("types are listed for unmarked problems only; the tallies take the marks")
    _check_base(problem, base.graph)
    profiles = [tuple(p) for p in problem.profiles]
    data = _vertex_data(base.graph, problem.degree, problem.genus, profiles)
    for choice in _choices(base.graph, data, problem.genus):
        vertex = tuple(v for v, m in enumerate(choice) for _ in m)
        shapes = tuple(data[v].shapes[s] for v, m in enumerate(choice) for s in m)
        classes = _class_ids(choice)
        edge_profiles = _edge_profiles(base.graph, data, choice)
        labelled = prod(s.hurwitz * prod(_aut(p) for p in s.halves) for s in shapes)
        mult = prod(x for p in edge_profiles for x in p)
        seen: set[tuple] = set()
        for key in sorted(count_matchings(base.graph.nodes, vertex, [s.halves for s in shapes], classes)):
            code, aut_v, relabel = _type_code(classes, key)
            if code not in seen:
                seen.add(code)
                aut = aut_v * relabel
                yield CoverType(edge_profiles, vertex, shapes, key, aut, mult * labelled / aut)


def _aut(profile: Profile) -> int:
    return prod(factorial(profile.count(x)) for x in set(profile))


def tally_catalogue(problem: HurwitzProblem, max_codim: int = 1, stratum: StableCurveGraph | None = None,
                    labeled: bool = False, max_work: float | None = None) -> TallyCatalogue:
    """Tallies over every selected base stratum (as
    :func:`covertree.catalogue.catalogue.build_catalogue` selects them;
    ``max_work`` limits the listing of the strata)."""
    strata = select_strata(problem, max_codim, stratum, labeled, max_work=max_work)
    tallies = tuple(tally_stratum(problem, base) for base in strata)
    return TallyCatalogue(problem, max_codim, problem_hurwitz(problem), tallies)
