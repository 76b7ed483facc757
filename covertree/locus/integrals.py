r"""Integrals over the space of admissible covers.

For a Hurwitz problem (source genus ``G``, target genus ``H``, degree ``d``,
profiles ``mu_1..mu_b`` at labelled branch points) let ``Adm`` be the
normalised space of admissible covers, of dimension ``N = 3H - 3 + b``, with
``br : Adm -> Mbar_{H,b}`` (finite, of degree the Hurwitz number) and ``src :
Adm -> Mbar_G`` (the stabilised source).  This module computes

    \int_{Adm} src^*(lambda^a prod_j delta_j^{c_j}) br^*(prod_j psi_j^{k_j} kappa_1^m)

exactly, on the stack (each cover weighted by ``1/|Aut f|``, the
Harris–Mumford group).

Derivation
----------
*Strata.*  Over a fixed curve of a base stratum ``T`` every cover ``f`` has
``prod_q prod_i e_{q,i}/L_q`` branches of ``Adm``; each is a stratum mapping to
``M_T = prod_v Mbar_{h_v,n_v}`` with degree ``1/|Aut f|``, and the strata over
the labelled strata isomorphic to ``T`` are counted ``|Aut T|`` times by the
covers over one labelled ``T``.  Near a stratum the boundary of ``Adm`` is
normal crossings, one smooth branch ``u_q = 0`` per base node, and ``t_q =
u_q^{L_q}`` (:mod:`covertree.locus.edges`).  Hence for divisors ``D_i = sum_B
c_i(B) [B]`` supported on the boundary, the usual excess-intersection formula
for a normal-crossings boundary gives

    \int_{Adm} D_1 ... D_k . beta = sum_T 1/|Aut T| sum_f #branches_f/|Aut f|
        sum_{phi : {1..k} ->> E(T)} prod_i c_i(f, phi(i))
        \int_{M_T} prod_q (N_q / L_q)^{|phi^{-1}(q)| - 1} . xi_T^* beta,

the sum over surjections (every node of ``T`` cut out by at least one
factor, the others restricting the normal bundle), ``N_q = -psi - psi'`` at
the half-edges of ``q`` and ``L_q N_{u_q=0} = xi^* N_q`` since ``t_q =
u_q^{L_q}``.  For ``d = 1``, ``H = G``, ``b = 0`` this is the classical formula
for products of boundary divisors on ``Mbar_G``.

*The classes.*  ``br^* psi_j`` and ``br^* kappa_1`` restrict to ``psi`` of leg
``j`` and to ``sum_v kappa_1(v)``.  ``src^* delta_j`` is the boundary divisor
of :mod:`covertree.locus.edges`.  ``lambda`` is unchanged by stabilisation, so
it is computed on the prestable source ``X`` by Mumford's formula ``12 lambda
= kappa + delta_X`` (any family of nodal curves, ``delta_X`` counting a node
``xy = u^m`` with multiplicity ``m``).  For an admissible cover
``omega_X(R) = f^* omega_Y(B)`` (``R`` the reduced preimage of the branch
divisor ``B``), ``(K_Y + B) . B_j = 0`` by adjunction, and ``R_x^2 = -psi_x =
-psi_j / e_x`` at a preimage ``x`` of index ``e_x``, so

    kappa(X) = d br^* kappa_1 - sum_j (sum_{x over j} 1/e_x) br^* psi_j,

    src^* lambda = (d kappa_1 - sum_j (sum_i 1/mu_{j,i}) psi_j + delta_X) / 12.

Each factor is then a base part (a class on ``Mbar_{H,b}``) plus a boundary
part, and the product is expanded by distributing the copies of each factor
between the base and the nodes of ``T``.

Cost: for each base stratum of codimension ``k <= N``, the distributions of
the factors (at most ``(k+1)^N``) times the cover classes with distinct edge
data, plus one polynomial integral per distinct pattern of exponents.

References
----------
J. Harris, D. Mumford, On the Kodaira dimension of the moduli space of curves,
Invent. Math. 67 (1982).  D. Mumford, Towards an enumerative geometry of the
moduli space of curves (1983), section 5 (``12 lambda = kappa + delta``).
E. Arbarello, M. Cornalba, Combinatorial and algebro-geometric cohomology
classes on the moduli spaces of curves, J. Algebraic Geom. 5 (1996).
T. Graber, R. Pandharipande, Constructions of nontautological classes on
moduli spaces of curves, Michigan Math. J. 51 (2003), appendix (products of
boundary strata).

Examples
--------
Every genus-2 curve is a double cover of the line in ``6! = 720`` labelled
ways, each with the hyperelliptic involution, so ``\int_{Adm} src^* lambda^3 =
720 \int_{Mbar_2} lambda^3 = 720/2880``:

>>> from covertree.hurwitz.problem import HurwitzProblem
>>> problem = HurwitzProblem.build(2, 0, genus=2)
>>> cover_space_integral(problem, Monomial.parse("lambda^3")).value
Fraction(1, 4)
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass
from fractions import Fraction
from functools import lru_cache
from math import factorial, prod

from covertree.catalogue.catalogue import problem_hurwitz, select_strata
from covertree.catalogue.covers import stratum_covers
from covertree.errors import IdentityError, ProblemError
from covertree.hurwitz.problem import HurwitzProblem
from covertree.locus.edges import CoverKey, EdgeData, cover_edges, grouped
from covertree.locus.monomial import Monomial, MonomialError
from covertree.locus.vertexring import Linear, VertexRing
from covertree.strata.base import BaseStratum

__all__ = ["CoverSpaceIntegral", "cover_space_integral", "cover_space_integrals", "cover_space_dimension", "ENGINES"]

ENGINES = ("types", "list")


@dataclass(frozen=True)
class CoverSpaceIntegral:
    """``\\int_{Adm} src^*(source) br^*(target)`` for one problem."""

    problem: HurwitzProblem
    source: Monomial
    target: Monomial
    value: Fraction


def cover_space_dimension(problem: HurwitzProblem) -> int:
    """``dim Adm = 3H - 3 + b``.

    >>> cover_space_dimension(HurwitzProblem.build(2, 1, genus=2))
    2
    """
    return 3 * problem.target_genus - 3 + problem.points


def source_divisors(problem: HurwitzProblem) -> tuple[str, ...]:
    """The boundary divisors of the source space (``Mbar_G`` or ``Mbar_{G,n}``);
    empty when there is none."""
    from covertree.catalogue.pullback import boundary_divisors

    try:
        return tuple(boundary_divisors(problem.genus, problem.n_marks))
    except ProblemError:
        return ()


def check_monomials(problem: HurwitzProblem, source: Monomial, target: Monomial) -> None:
    """Raise :class:`MonomialError` for a class the problem lacks or a wrong degree."""
    names = source_divisors(problem)
    for name in source.names():
        if name.startswith("delta_") and name not in names:
            if problem.n_marks:
                raise MonomialError(f"source factor {name} is not a boundary divisor of "
                                    f"Mbar_{{{problem.genus},{problem.n_marks}}}; allowed: {', '.join(names) or 'none'}")
            raise MonomialError(f"source factor {name} does not exist for source genus {problem.genus}; "
                                f"allowed: delta_0 .. delta_{problem.genus // 2} (genus >= 2)")
        if name.startswith("psi_") and int(name[len("psi_"):]) > problem.n_marks:
            raise MonomialError(f"source factor {name} names no leg of the source; "
                                + (f"allowed: psi_1 .. psi_{problem.n_marks}" if problem.n_marks
                                   else "mark points with --mark to use psi classes of the source"))
    for name in target.names():
        if name.startswith("psi_") and int(name[len("psi_"):]) > problem.points:
            raise MonomialError(f"target factor {name} names no branch point; allowed: psi_1 .. psi_{problem.points}")
    n = cover_space_dimension(problem)
    if source.degree + target.degree != n:
        raise MonomialError(
            f"source {source.notation!r} (degree {source.degree}) times target {target.notation!r} "
            f"(degree {target.degree}) has degree {source.degree + target.degree}; "
            f"the cover space has dimension {n}"
        )


def cover_space_integral(problem: HurwitzProblem, source: Monomial, target: Monomial = Monomial(()),
                         engine: str = "types") -> CoverSpaceIntegral:
    """The integral of the module docstring.

    Parameters
    ----------
    problem : HurwitzProblem
    source, target : Monomial
        Source classes (``lambda``, ``delta_j``) and target classes (``psi_j``,
        ``kappa``); their degrees must add up to ``3H - 3 + b``.
    engine : {"types", "list"}
        How covers over each base stratum are found (the same numbers).

    Raises
    ------
    MonomialError
        For a wrong degree or a class that does not exist for the problem.
    ProblemError
        When the target's moduli space is not stable.
    IdentityError
        When a base stratum's covers fail the degeneration identity (a bug).
    """
    [value] = cover_space_integrals(problem, [(source, target)], engine)
    return CoverSpaceIntegral(problem, source, target, value)


def cover_space_integrals(problem: HurwitzProblem, monomials: Sequence[tuple[Monomial, Monomial]],
                          engine: str = "types", progress=None) -> list[Fraction]:
    """Several integrals in one pass over the base strata (the covers over
    each stratum are found once).  ``progress(done, total)`` is called after
    each stratum when given."""
    for source, target in monomials:
        check_monomials(problem, source, target)
    if (problem.target_genus == 0 and problem.points < 3) or (problem.target_genus == 1 and problem.points < 1):
        raise ProblemError(f"the target space Mbar_{{{problem.target_genus},{problem.points}}} is not stable; "
                           "there is no cover space to integrate over")
    jobs = [[_Factor(problem, n, p, True) for n, p in s.factors] + [_Factor(problem, n, p) for n, p in t.factors]
            for s, t in monomials]
    max_codim = max((sum(f.power for f in job if f.has_boundary) for job in jobs), default=0)
    labeled = any(n.startswith("psi_") for s, t in monomials for n in s.names() + t.names())
    hurwitz = problem_hurwitz(problem)
    totals = [Fraction(0)] * len(jobs)
    strata = select_strata(problem, max_codim, None, labeled)
    for done, base in enumerate(strata, start=1):
        keys = stratum_keys(problem, base, engine, hurwitz)
        scale = Fraction(base.orbit_size, base.graph.automorphisms)
        ring = VertexRing(base.graph)
        cache: dict[tuple, Fraction] = {}
        for i, job in enumerate(jobs):
            if base.codim <= sum(f.power for f in job if f.has_boundary):
                totals[i] += scale * _stratum_sum(ring, keys, job, cache)
        if progress is not None:
            progress(done, len(strata))
    return totals


def stratum_keys(problem: HurwitzProblem, base: BaseStratum, engine: str, hurwitz: Fraction) -> tuple[CoverKey, ...]:
    """The covers over one base stratum grouped by edge data, with the
    degeneration identity checked (``sum weight * prod L = H``)."""
    if engine not in ENGINES:
        raise ValueError(f"engine {engine!r}; allowed: {', '.join(ENGINES)}")
    items = _items_types(problem, base) if engine == "types" else _items_list(problem, base)
    keys = grouped(items, base.graph.n_nodes, problem.genus)
    found = sum((k.weight * prod(e.lcm for e in k.edges) for k in keys), Fraction(0))
    if found != hurwitz:
        raise IdentityError(f"covers over {base.graph.notation} weigh {found}, not the Hurwitz number {hurwitz}")
    return keys


def _items_types(problem: HurwitzProblem, base: BaseStratum) -> Iterator:
    from covertree.tallies.types import tally_stratum

    for entry in tally_stratum(problem, base).entries:
        yield entry.genera, entry.edges, entry.weight, entry.legs


def _items_list(problem: HurwitzProblem, base: BaseStratum) -> Iterator:
    for cover in stratum_covers(base.graph, problem.degree, [tuple(p) for p in problem.profiles], problem.marks):
        yield cover.raw.source_genera, cover_edges(cover), cover.weight, cover.raw.source_legs


class _Factor:
    """One class of the monomial with its power: base part and boundary part."""

    def __init__(self, problem: HurwitzProblem, name: str, power: int, source: bool = False) -> None:
        self.name, self.power, self.problem = name, power, problem
        self.source_psi = source and name.startswith("psi_")
        self.has_boundary = name == "lambda" or name.startswith("delta_") or self.source_psi
        self.has_base = not name.startswith("delta_")
        if name.startswith("delta_"):
            self.index = source_divisors(problem).index(name)
        if self.source_psi:
            self.leg = int(name[len("psi_"):])

    def boundary(self, data: EdgeData) -> Fraction:
        if self.name == "lambda":
            return Fraction(data.all_nodes, 12)
        if self.source_psi:
            return -Fraction(data.psis[self.leg - 1])
        return Fraction(data.deltas[self.index])

    def base(self, ring: VertexRing) -> Linear:
        if self.name == "kappa":
            return ring.kappa()
        if self.source_psi:
            point, index = self.problem.marks[self.leg - 1]
            return tuple((i, c / index) for i, c in ring.leg_psi(point))
        if self.name.startswith("psi_"):
            return ring.leg_psi(int(self.name[len("psi_"):]))
        d = self.problem.degree
        form = [(i, c * d / 12) for i, c in ring.kappa()]
        for j, mu in enumerate(self.problem.profiles, start=1):
            weight = sum(Fraction(1, part) for part in mu)
            form += [(i, -c * weight / 12) for i, c in ring.leg_psi(j)]
        return tuple(form)


@dataclass(frozen=True)
class _Distribution:
    """Copies of each factor sent to the base (``base[r]``) and to each node
    (``nodes[r][q]``), with the multinomial count."""

    base: tuple[int, ...]
    nodes: tuple[tuple[int, ...], ...]
    count: int
    per_node: tuple[int, ...]


def _distributions(factors: Sequence[_Factor], n_edges: int) -> tuple[_Distribution, ...]:
    """Every way to send the copies of the factors to the base and to the
    nodes with each node receiving at least one copy."""
    signature = tuple((f.power, f.has_base, f.has_boundary) for f in factors)
    return _distributions_of(signature, n_edges)


@lru_cache(maxsize=4096)
def _distributions_of(signature: tuple[tuple[int, bool, bool], ...], n_edges: int) -> tuple[_Distribution, ...]:
    out: list[_Distribution] = []
    left = [sum(p for p, _, boundary in signature[r:] if boundary) for r in range(len(signature) + 1)]

    def rec(r: int, covered: tuple[int, ...], chosen: list[tuple[int, ...]]) -> None:
        if sum(1 for c in covered if not c) > left[r]:
            return
        if r == len(signature):
            count = prod(factorial(p) // prod(factorial(x) for x in parts)
                         for (p, _, _), parts in zip(signature, chosen))
            out.append(_Distribution(tuple(c[0] for c in chosen), tuple(c[1:] for c in chosen), count, covered))
            return
        power, has_base, has_boundary = signature[r]
        for parts in _compositions(power, n_edges + 1):
            if (parts[0] and not has_base) or (any(parts[1:]) and not has_boundary):
                continue
            chosen.append(parts)
            rec(r + 1, tuple(c + x for c, x in zip(covered, parts[1:])), chosen)
            chosen.pop()

    rec(0, (0,) * n_edges, [])
    return tuple(out)


def _compositions(total: int, parts: int) -> Iterator[tuple[int, ...]]:
    """Ordered ways to write ``total`` as ``parts`` non-negative integers."""
    if parts == 1:
        yield (total,)
        return
    for first in range(total + 1):
        for rest in _compositions(total - first, parts - 1):
            yield (first,) + rest


def _stratum_sum(ring: VertexRing, keys: Sequence[CoverKey], factors: Sequence[_Factor],
                 cache: dict[tuple, Fraction]) -> Fraction:
    """``sum_f w_f sum_phi (...)`` over one labelled base stratum; ``cache``
    holds the integrals of exponent patterns on this stratum."""
    if not keys:
        return Fraction(0)
    graph = ring.graph
    total = Fraction(0)
    for dist in _distributions(factors, graph.n_nodes):
        integral = _pattern_integral(ring, factors, dist, cache)
        if not integral:
            continue
        for key in keys:
            coeff = Fraction(dist.count)
            for f, nodes in zip(factors, dist.nodes):
                for q, n in enumerate(nodes):
                    if n:
                        coeff *= f.boundary(key.edges[q]) ** n
            if coeff:
                scale = prod(Fraction(1, key.edges[q].lcm) ** (m - 1) for q, m in enumerate(dist.per_node))
                total += key.weight * coeff * scale * integral
    return total


def _pattern_integral(ring: VertexRing, factors: Sequence[_Factor], dist: _Distribution, cache: dict) -> Fraction:
    """``\\int_{M_T} prod_q N_q^{m_q - 1} prod_r base_r^{n_r}`` (memoised)."""
    pattern = (dist.per_node, tuple((f.name, f.source_psi, n) for f, n in zip(factors, dist.base) if n))
    if pattern not in cache:
        forms: list[Linear] = []
        for q, m in enumerate(dist.per_node):
            forms += [ring.normal(q)] * (m - 1)
        for f, n in zip(factors, dist.base):
            forms += [f.base(ring)] * n
        cache[pattern] = ring.integrate(ring.product(forms))
    return cache[pattern]
