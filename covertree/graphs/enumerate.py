"""Enumeration of all stable graphs of type ``(g, n)``: the boundary strata
of ``Mbar_{g,n}``.

Method: by codimension.  Contracting an edge of a stable graph gives a stable
graph, so every stable graph with ``k`` edges arises from one with ``k - 1``
edges by the inverse operation: adding a loop at a vertex of positive genus
(lowering its genus by one), or splitting a vertex in two joined by a new
edge, distributing its genus and its legs and half-edges (a loop's two ends
may go to the same side or to both sides) so that both new vertices are
stable.  Candidates are deduplicated by canonical key
(:mod:`covertree.graphs.canonical`).  Each layer is memoised.

Legs are labelled ``1..n``; isomorphisms fix every leg.

References
----------
E. Arbarello, M. Cornalba, P. Griffiths, *Geometry of Algebraic Curves II*
(2011), chapter X (stable graphs and the boundary stratification).

Examples
--------
>>> [g.notation for g in stable_graphs(1, 1)]
['g1{1}', 'g0{1} | 0-0']
>>> len(stable_graphs(0, 5)), len(stable_graphs(2, 0))
(26, 7)
"""

from __future__ import annotations

from functools import lru_cache

from covertree.errors import GraphError
from covertree.graphs.canonical import certify
from covertree.graphs.curve_graph import StableCurveGraph, _relabelled
from covertree.limits import STEPS_PER_STRATUM_VERTEX, check_work, largest_feasible, strata_work

__all__ = ["stable_graphs", "max_codimension"]

_Raw = tuple  # (key, genera, edges, legs, aut_v), all canonical


def max_codimension(genus: int, n: int) -> int:
    """``3g - 3 + n``, the dimension of ``Mbar_{g,n}`` (after checking the type).

    Examples
    --------
    >>> max_codimension(0, 3), max_codimension(2, 1)
    (0, 4)
    >>> max_codimension(1, 0)
    Traceback (most recent call last):
    ...
    covertree.errors.GraphError: there are no stable curves of type (g, n) = (1, 0): need 2g - 2 + n > 0
    """
    for name, value in (("genus", genus), ("number of legs", n)):
        if not isinstance(value, int) or isinstance(value, bool) or value < 0:
            raise GraphError(f"the {name} must be an integer >= 0, got {value!r}")
    if 2 * genus - 2 + n <= 0:
        raise GraphError(
            f"there are no stable curves of type (g, n) = ({genus}, {n}): need 2g - 2 + n > 0"
        )
    return 3 * genus - 3 + n


def stable_graphs(genus: int, n: int, max_codim: int | None = None,
                  max_work: float | None = None, on_layer=None) -> list[StableCurveGraph]:
    """Every stable graph of type ``(genus, n)`` with at most ``max_codim`` edges.

    Parameters
    ----------
    genus, n : int
        The type; ``2 genus - 2 + n > 0``.  Legs are labelled ``1..n``.
    max_codim : int, optional
        Largest codimension listed (default and cap: ``3 genus - 3 + n``).
    max_work : float, optional
        Work limit in steps (:mod:`covertree.limits`): the listing is refused
        when estimated beyond it, before it starts, and again before each
        codimension from the candidates the previous one gives.
    on_layer : callable, optional
        Called as ``on_layer(k, found)`` before codimension ``k`` is built
        (``found`` strata so far), for progress reports.

    Returns
    -------
    list of StableCurveGraph
        One per isomorphism class (fixing legs), sorted by ``(codim, key)``.

    Raises
    ------
    GraphError
        For an unstable type or a negative ``max_codim``.
    TooLargeError
        When the listing is estimated beyond ``max_work`` (names the largest
        feasible codimension, genus and number of legs).

    Examples
    --------
    >>> [str(g) for g in stable_graphs(0, 4, max_codim=1)]
    ['g0{1,2,3,4}', 'g0{1,2}, g0{3,4} | 0-1', 'g0{1,3}, g0{2,4} | 0-1', 'g0{1,4}, g0{2,3} | 0-1']
    >>> [g.automorphisms for g in stable_graphs(2, 0, max_codim=1)]
    [1, 2, 2]
    """
    top = max_codimension(genus, n)
    if max_codim is None:
        max_codim = top
    if not isinstance(max_codim, int) or isinstance(max_codim, bool) or max_codim < 0:
        raise GraphError(f"the codimension must be an integer >= 0, got {max_codim!r}")
    last = min(max_codim, top)
    check_strata(genus, n, last, max_work)
    out: list[StableCurveGraph] = []
    spent = 0.0
    for k in range(last + 1):
        if on_layer is not None:
            on_layer(k, len(out))
        if k and max_work is not None:  # layers in order: each call recurses one level at most
            spent += _layer_work(_layer(genus, n, k - 1))
            _check_layer(genus, n, (k, last), (spent, len(out)), max_work)
        for key, genera, edges, legs, aut_v in _layer(genus, n, k):
            out.append(StableCurveGraph._from_canonical(genera, edges, legs, key, aut_v))
    return out


def check_strata(genus: int, n: int, codim: int, max_work: float | None) -> None:
    """Refuse listing the strata of ``Mbar_{genus,n}`` up to ``codim`` when
    estimated (:func:`covertree.limits.strata_work`) beyond ``max_work``.

    >>> check_strata(6, 4, 19, 10**8)  # doctest: +ELLIPSIS
    Traceback (most recent call last):
    ...
    covertree.errors.TooLargeError: the strata of Mbar_{6,4} up to codim 19 would take about 10^12.1 steps, beyond the work limit 10^8 (--max-work); the largest feasible codim is ..., genus 3 with 4 points, 1 point at genus 6 at that codim
    """
    if max_work is None or strata_work(genus, n, codim) <= max_work:
        return
    parts = []
    k = largest_feasible(lambda c: strata_work(genus, n, c), 0, codim, max_work)
    parts.append(f"the largest feasible codim is {k}" if k is not None else "no codimension is feasible")
    g = largest_feasible(lambda h: strata_work(h, n, codim), 0, genus, max_work)
    if g is not None and 2 * g - 2 + n > 0:
        parts.append(f"genus {g} with {n} point{'s' if n != 1 else ''}")
    m = largest_feasible(lambda p: strata_work(genus, p, codim), 0, n, max_work)
    if m is not None and 2 * genus - 2 + m > 0:
        parts.append(f"{m} point{'s' if m != 1 else ''} at genus {genus}")
    check_work(strata_work(genus, n, codim), max_work, f"the strata of Mbar_{{{genus},{n}}} up to codim {codim}",
               ", ".join(parts) + (" at that codim" if len(parts) > 1 else ""))


def _layer_work(layer: tuple[_Raw, ...]) -> float:
    """Steps to build the next layer from ``layer``: its candidates (one-edge
    degenerations, with repetitions), each certified."""
    total = 0.0
    for _, genera, edges, legs, _ in layer:
        items = [len(x) for x in legs]
        for a, b in edges:
            items[a] += 1
            items[b] += 1
        candidates = sum((g >= 1) + (2 ** (i - 1) * (g + 1) if i else g // 2) for g, i in zip(genera, items))
        total += candidates * STEPS_PER_STRATUM_VERTEX * (len(genera) + 1) / 3
    return total


def _check_layer(genus: int, n: int, codims: tuple[int, int], done: tuple[float, int], max_work: float) -> None:
    """Before codimension ``k`` (of ``k..last``): refuse when the candidates
    of the next layer (counted exactly from the layer before) push the work
    ``spent`` so far past ``max_work``."""
    (k, last), (spent, found) = codims, done
    check_work(spent, max_work, f"the strata of Mbar_{{{genus},{n}}} up to codim {last} (up to codim {k}, "
               f"after {found} strata)", f"the largest feasible codim is {k - 1}")


@lru_cache(maxsize=64)
def _layer(genus: int, n: int, k: int) -> tuple[_Raw, ...]:
    """The stable graphs with ``k`` edges, canonical and sorted by key."""
    if k == 0:
        return (_canonical((genus,), (), (tuple(range(1, n + 1)),)),)
    found: dict[tuple, _Raw] = {}
    for _, genera, edges, legs, _ in _layer(genus, n, k - 1):
        for child in _children(genera, edges, legs):
            key, order, aut_v = certify(*child)
            if key not in found:
                found[key] = (key, *_relabelled(*child, order), aut_v)
    return tuple(found[key] for key in sorted(found))


def _canonical(genera: tuple, edges: tuple, legs: tuple) -> _Raw:
    key, order, aut_v = certify(genera, edges, legs)
    return (key, *_relabelled(genera, edges, legs, order), aut_v)


def _children(genera: tuple, edges: tuple, legs: tuple):
    """Every one-edge degeneration of a stable graph (with repetitions)."""
    for v, g in enumerate(genera):
        if g >= 1:
            yield genera[:v] + (g - 1,) + genera[v + 1 :], edges + ((v, v),), legs
        yield from _splits(genera, edges, legs, v)


def _splits(genera: tuple, edges: tuple, legs: tuple, v: int):
    """Split vertex ``v`` into ``v`` and a new last vertex joined by an edge."""
    new = len(genera)
    ends = [(e, side) for e, pair in enumerate(edges) for side in (0, 1) if pair[side] == v]
    items = len(legs[v]) + len(ends)
    g = genera[v]
    if items == 0:  # a single vertex without legs: split the genus
        for g1 in range(1, g // 2 + 1):
            yield (g1, g - g1), ((0, 1),), ((), ())
        return
    n_legs = len(legs[v])
    for mask in range(0, 1 << items, 2):  # item 0 stays at v
        s2 = mask.bit_count()
        s1 = items - s2
        # each side is stable with the new half-edge: positive genus or two more items
        g_range = [g1 for g1 in range(g + 1) if (g1 > 0 or s1 >= 2) and (g1 < g or s2 >= 2)]
        if not g_range:
            continue
        legs1 = tuple(j for i, j in enumerate(legs[v]) if not mask >> i & 1)
        legs2 = tuple(j for i, j in enumerate(legs[v]) if mask >> i & 1)
        new_edges = [list(pair) for pair in edges]
        for i, (e, side) in enumerate(ends, start=n_legs):
            if mask >> i & 1:
                new_edges[e][side] = new
        new_edges = tuple(map(tuple, new_edges)) + ((v, new),)
        new_legs = legs[:v] + (legs1,) + legs[v + 1 :] + (legs2,)
        for g1 in g_range:
            yield genera[:v] + (g1,) + genera[v + 1 :] + (g - g1,), new_edges, new_legs
