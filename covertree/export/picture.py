r"""Geometry of the pictures of covers, shared by TikZ and the image drawer.

A cover is drawn as two rows: its base below, its source above, every source
component standing over the base component it maps to, and a downward arrow
in the free band between the two rows (it touches neither).  Each base vertex
owns a column as wide as the source components over it need; edges between
neighbours in a row are straight (parallel ones fan out symmetrically), edges
that jump over vertices of their row arc towards the other row, loops and
legs point away from the other row (and so away from those arcs).

Loops (in every picture, of graphs as of covers) are teardrops: a cubic curve
leaving the vertex centre and coming back to it, with its far end at
:data:`covertree.export.tikz.LOOP_REACH`; the vertex disc is drawn over its
foot, so the loop is attached to its vertex.

All lengths are in centimetres.  Nothing here touches the mathematics: it
places what :mod:`covertree.catalogue` computed.

Examples
--------
A double cover of a two-component base with one node, split into two
components over the first base vertex:

>>> pic = cover_layout([1, 0, 0], [(0, 2), (1, 2)], [0, 0, 1], [0, 0], [(0, 1)], [[1, 2], [3, 4]])
>>> [round(x, 2) for x, _ in pic.source.positions], [round(x, 2) for x, _ in pic.base.positions]
([-1.9, -0.3, 1.6], [-1.1, 1.6])

The arrow runs down through the free band between the two rows:

>>> x, start, end = pic.arrow
>>> source_low, base_high = extent(pic.source, [(0, 2), (1, 2)], [[]] * 3)[2], extent(pic.base, [(0, 1)], [[1, 2], [3, 4]])[3]
>>> source_low > start > end > base_high
True
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from itertools import permutations, product

from covertree.errors import TooLargeError
from covertree.export.tikz import LEG, LOOP_REACH, Layout, spread_labels

__all__ = ["LOOP_SPREAD", "VERTEX_RADIUS", "CoverLayout", "cover_layout", "extent", "loop_curve", "loop_point",
           "vertex_images"]

#: Half the opening angle of a teardrop loop at its vertex (degrees).
LOOP_SPREAD = 28
#: most vertices plus edges a picture takes (larger ones are unreadable, and
#: their images take gigabytes)
MAX_PICTURE_ITEMS = 120
#: Radius of a vertex disc (TikZ: ``minimum size=6mm``).
VERTEX_RADIUS = 0.3
#: Distance between neighbouring source components of one column.
ROW_STEP = 1.6
#: Least width of the column of a base vertex.
BASE_STEP = 2.2
#: Space between a row's extent and an end of the arrow.
ARROW_CLEARANCE = 0.3
#: Length of the arrow.
ARROW_LENGTH = 1.0
#: Extent of a label around its anchor (half-width, half-height).
LABEL_HALF = (0.25, 0.15)


def loop_curve(centre: tuple[float, float], angle: float) -> list[tuple[float, float]]:
    """The four points of the cubic teardrop loop at ``centre`` pointing to
    ``angle`` (degrees): it leaves the vertex disc at ``angle +`` and comes
    back at ``angle -`` :data:`LOOP_SPREAD` (both on the circle of radius
    :data:`VERTEX_RADIUS`) and reaches :data:`LOOP_REACH` at its middle.

    >>> start, c1, c2, end = loop_curve((0.0, 0.0), 90.0)
    >>> round(math.hypot(*start), 6) == round(math.hypot(*end), 6) == VERTEX_RADIUS
    True
    >>> round(loop_point((0.0, 0.0), 90.0, 0.5)[1], 6) == LOOP_REACH
    True
    """
    cos = math.cos(math.radians(LOOP_SPREAD))
    reach = (LOOP_REACH / cos - 0.25 * VERTEX_RADIUS) / 0.75
    x, y = centre
    out = []
    for radius, turn in ((VERTEX_RADIUS, LOOP_SPREAD), (reach, LOOP_SPREAD), (reach, -LOOP_SPREAD),
                         (VERTEX_RADIUS, -LOOP_SPREAD)):
        a = math.radians(angle + turn)
        out.append((x + radius * math.cos(a), y + radius * math.sin(a)))
    return out


def loop_point(centre: tuple[float, float], angle: float, t: float) -> tuple[float, float]:
    """The point at parameter ``t`` of the teardrop loop."""
    p0, p1, p2, p3 = loop_curve(centre, angle)
    u = 1 - t
    w = (u ** 3, 3 * u * u * t, 3 * u * t * t, t ** 3)
    return (sum(c * p[0] for c, p in zip(w, (p0, p1, p2, p3))), sum(c * p[1] for c, p in zip(w, (p0, p1, p2, p3))))


def extent(lay: Layout, edges: Sequence[tuple[int, int]], legs: Sequence[Sequence[int]]) -> tuple[float, float, float, float]:
    """Bounding box ``(x0, x1, y0, y1)`` of a drawing: discs, curves, loops,
    legs and labels.  Curves count with their control points, as TikZ counts
    them in the bounding box of a picture, so a box of this size holds it."""
    points = []
    for x, y in lay.positions:
        points += [(x - VERTEX_RADIUS, y - VERTEX_RADIUS), (x + VERTEX_RADIUS, y + VERTEX_RADIUS)]
    for k, (a, b) in enumerate(edges):
        if a == b:
            points += loop_curve(lay.positions[a], lay.loop_angles[k])
        else:
            points += [lay.edge_point(edges, k, i / 8) for i in range(9)]
            if lay.bends[k]:
                points.append(lay.control(edges, k))
        lx, ly = lay.label_point(edges, k)
        points += [(lx - LABEL_HALF[0], ly - LABEL_HALF[1]), (lx + LABEL_HALF[0], ly + LABEL_HALF[1])]
    flat = 0
    for v, labels in enumerate(legs):
        for _ in labels:
            a = math.radians(lay.leg_angles[flat])
            flat += 1
            x, y = lay.positions[v]
            lx, ly = x + (LEG + 0.22) * math.cos(a), y + (LEG + 0.22) * math.sin(a)
            points += [(lx - 0.15, ly - 0.15), (lx + 0.15, ly + 0.15)]
    xs, ys = [p[0] for p in points], [p[1] for p in points]
    return min(xs), max(xs), min(ys), max(ys)


@dataclass(frozen=True)
class CoverLayout:
    """The picture of a cover.

    Attributes
    ----------
    source, base : Layout
        The two rows (source above).
    arrow : (x, y_start, y_end)
        The vertical arrow from the source down to the base.
    box : (x0, x1, y0, y1)
        Bounding box of the whole picture.
    """

    source: Layout
    base: Layout
    arrow: tuple[float, float, float]
    box: tuple[float, float, float, float]


def cover_layout(source_genera: Sequence[int], source_edges: Sequence[tuple[int, int]], over: Sequence[int] | None,
                 base_genera: Sequence[int], base_edges: Sequence[tuple[int, int]],
                 base_legs: Sequence[Sequence[int]]) -> CoverLayout:
    """Lay out a cover: ``over[c]`` is the base vertex under source vertex
    ``c`` (``None``: unknown, the source is then centred above the base)."""
    n_base, n_source = len(base_genera), len(source_genera)
    base_order = _line_order(n_base, base_edges)
    if over is None:
        order = _line_order(n_source, source_edges)
        source_x = [0.0] * n_source
        for i, c in enumerate(order):
            source_x[c] = ROW_STEP * (i - (n_source - 1) / 2)
        base_x = [0.0] * n_base
        for i, v in enumerate(base_order):
            base_x[v] = BASE_STEP * (i - (n_base - 1) / 2)
    else:
        base_x, source_x = _columns(base_order, over, source_edges)
    no_legs: list[list[int]] = [[] for _ in range(n_source)]
    base = row_layout(base_x, 0.0, base_edges, base_legs, side=-1)
    _x0, _x1, _y0, base_top = extent(base, base_edges, base_legs)
    trial = row_layout(source_x, 0.0, source_edges, no_legs, side=1)
    low = extent(trial, source_edges, no_legs)[2]
    height = base_top + 2 * ARROW_CLEARANCE + ARROW_LENGTH - low
    source = row_layout(source_x, height, source_edges, no_legs, side=1)
    boxes = [extent(base, base_edges, base_legs), extent(source, source_edges, no_legs)]
    box = (min(b[0] for b in boxes), max(b[1] for b in boxes), min(b[2] for b in boxes), max(b[3] for b in boxes))
    arrow_x = sum(base_x) / n_base
    arrow = (arrow_x, height + low - ARROW_CLEARANCE, base_top + ARROW_CLEARANCE)
    return CoverLayout(source, base, arrow, box)


def _columns(base_order: list[int], over: Sequence[int], source_edges) -> tuple[list[float], list[float]]:
    """Base x positions (column centres) and source x positions (spread over
    their column, ordered for the shortest source edges)."""
    members = {v: [c for c, w in enumerate(over) if w == v] for v in base_order}
    orders = _member_orders(base_order, members, source_edges)
    base_x = [0.0] * len(base_order)
    source_x = [0.0] * len(over)
    left = 0.0
    for v in base_order:
        width = max(BASE_STEP, ROW_STEP * len(members[v]))
        base_x[v] = left + width / 2
        for i, c in enumerate(orders[v]):
            source_x[c] = left + width / 2 + ROW_STEP * (i - (len(orders[v]) - 1) / 2)
        left += width
    centre = left / 2
    return [x - centre for x in base_x], [x - centre for x in source_x]


#: Largest number of joint orders of the source columns tried.
MAX_ORDERS = 5040


def _member_orders(base_order, members, source_edges) -> dict[int, list[int]]:
    choices = [list(permutations(members[v])) for v in base_order]
    if math.prod(len(c) for c in choices) > MAX_ORDERS:
        return {v: members[v] for v in base_order}
    best, best_cost = None, None
    for combo in product(*choices):
        slot = {c: i for i, c in enumerate(x for part in combo for x in part)}
        cost = sum(abs(slot[a] - slot[b]) for a, b in source_edges)
        if best_cost is None or cost < best_cost:
            best, best_cost = combo, cost
    return {v: list(part) for v, part in zip(base_order, best)}


#: Largest graph whose order along a line is optimised by trying all.
MAX_LINE = 7


def _line_order(n: int, edges: Sequence[tuple[int, int]]) -> list[int]:
    """An order of the vertices along a line with the shortest edges."""
    if n > MAX_LINE:
        return list(range(n))
    best, best_cost = list(range(n)), None
    for order in permutations(range(n)):
        slot = {v: i for i, v in enumerate(order)}
        cost = sum(abs(slot[a] - slot[b]) for a, b in edges)
        if best_cost is None or cost < best_cost:
            best, best_cost = list(order), cost
    return best


def row_layout(xs: Sequence[float], y: float, edges: Sequence[tuple[int, int]], legs: Sequence[Sequence[int]],
               side: int) -> Layout:
    """Vertices at ``(xs[v], y)``; loops and legs point up (``side`` 1) or
    down (-1), edges jumping over vertices arc the other way."""
    positions = [(x, y) for x in xs]
    bends = _row_bends(xs, edges, side)
    loop_angles: list[float | None] = [None] * len(edges)
    leg_angles = [0.0] * sum(len(x) for x in legs)
    flat = 0
    centre = 90.0 if side > 0 else 270.0
    width = 300.0 if len(xs) == 1 else 160.0
    for v in range(len(xs)):
        loops = [k for k, (a, b) in enumerate(edges) if a == b == v]
        own = list(range(flat, flat + len(legs[v])))
        flat += len(legs[v])
        items = [("loop", k) for k in loops] + [("leg", i) for i in own]
        step = min(width / max(1, len(items)), 55.0)
        for i, (kind, k) in enumerate(items):
            angle = round((centre + step * (i - (len(items) - 1) / 2)) % 360, 1)
            if kind == "loop":
                loop_angles[k] = angle
            else:
                leg_angles[k] = angle
    lay = Layout(positions, bends, loop_angles, leg_angles, [0.5] * len(edges))
    spread_labels(lay, edges)
    return lay


def _row_bends(xs: Sequence[float], edges: Sequence[tuple[int, int]], side: int) -> list[int]:
    groups: dict[tuple[int, int], list[int]] = {}
    for k, (a, b) in enumerate(edges):
        if a != b:
            groups.setdefault((min(a, b), max(a, b)), []).append(k)
    bends = [0] * len(edges)
    for (lo, hi), ks in groups.items():
        between = any(min(xs[lo], xs[hi]) < x < max(xs[lo], xs[hi]) for x in xs)
        m = len(ks)
        for i, k in enumerate(ks):
            a, b = edges[k]
            up = 1 if xs[a] < xs[b] else -1  # a positive bend is to the left of a -> b
            if between:
                bends[k] = -(40 + 25 * i) * side * up  # towards the other row, away from the loops
            else:
                step = min(60, 150 / max(1, m - 1))
                bends[k] = round(step * (i - (m - 1) / 2)) * up
    return bends


def vertex_images(source_edges: Sequence[tuple[int, int]], n_source: int, indices: Sequence[int],
                  base_edges: Sequence[tuple[int, int]], n_base: int, profiles: Sequence[Sequence[int]],
                  degree: int, limit: int = 200000) -> list[int] | None:
    """A base vertex under each source vertex, recovered from the nodes alone
    (for covers read back from a file, which records the source and base but
    not the map): every source node lies over a base node whose profile holds
    its index, its ends over the ends of that node, and at every base vertex
    each source component has the same degree over all the node branches
    there, the degrees adding up to ``degree``.  ``None`` when no such map is
    found within ``limit`` steps (or the base has no nodes and several
    vertices).

    >>> vertex_images([(0, 2), (1, 2)], 3, [1, 1], [(0, 1)], 2, [(1, 1)], 2)
    [0, 0, 1]
    """
    if not base_edges:
        return [0] * n_source if n_base == 1 else None
    search = _ImageSearch(source_edges, n_source, indices, base_edges, n_base, profiles, degree, limit)
    return search.run()


class _ImageSearch:
    """Backtracking over (base node, orientation) for each source node."""

    def __init__(self, source_edges, n_source, indices, base_edges, n_base, profiles, degree, limit):
        self.source_edges, self.indices = list(source_edges), list(indices)
        self.base_edges, self.n_base, self.degree = list(base_edges), n_base, degree
        self.left = [sorted(p) for p in profiles]
        self.image: list[int | None] = [None] * n_source
        self.sides: list[tuple[int, int] | None] = [None] * len(source_edges)
        self.steps, self.limit = 0, limit

    def run(self) -> list[int] | None:
        found = self._assign(0)
        return list(self.image) if found and None not in self.image else None

    def _assign(self, k: int) -> bool:
        self.steps += 1
        if self.steps > self.limit:
            return False
        if k == len(self.source_edges):
            return self._degrees_agree()
        a, b = self.source_edges[k]
        e = self.indices[k]
        for q, (i, j) in enumerate(self.base_edges):
            if e not in self.left[q]:
                continue
            for flip in (0, 1) if (a != b or i != j) else (0,):
                end_a, end_b = (i, j) if flip == 0 else (j, i)
                if self._fits(a, end_a) and self._fits(b, end_b) and (a != b or end_a == end_b):
                    saved = (self.image[a], self.image[b])
                    self.image[a], self.image[b] = end_a, end_b
                    self.left[q].remove(e)
                    self.sides[k] = (q, flip)
                    if self._assign(k + 1):
                        return True
                    self.left[q].append(e)
                    self.image[a], self.image[b] = saved
        return False

    def _fits(self, c: int, v: int) -> bool:
        return self.image[c] is None or self.image[c] == v

    def _degrees_agree(self) -> bool:
        """Per source vertex and base half-edge at its image: the indices of
        its half-edges there add up to one degree; the degrees over each base
        vertex add up to the total."""
        load: dict[tuple[int, int, int], int] = {}
        for k, (a, b) in enumerate(self.source_edges):
            q, flip = self.sides[k]
            for end, side in ((a, flip), (b, 1 - flip)):
                load[(end, q, side)] = load.get((end, q, side), 0) + self.indices[k]
        halves = {v: [(q, s) for q, pair in enumerate(self.base_edges) for s in (0, 1) if pair[s] == v]
                  for v in range(self.n_base)}
        totals = [0] * self.n_base
        for c, v in enumerate(self.image):
            degrees = {load.get((c, q, s), 0) for q, s in halves[v]}
            if len(degrees) != 1 or 0 in degrees:
                return False
            totals[v] += degrees.pop()
        return all(t == self.degree for v, t in enumerate(totals) if halves[v])


def check_picture_size(n_vertices: int, n_edges: int, what: str = "the graph") -> None:
    """Refuse a picture of more than :data:`MAX_PICTURE_ITEMS` vertices and edges.

    >>> check_picture_size(300, 299)
    Traceback (most recent call last):
    ...
    covertree.errors.TooLargeError: the graph has 300 vertices and 299 edges: a picture takes at most 120 vertices and edges together (the largest feasible chain has 60 vertices)
    """
    if n_vertices + n_edges > MAX_PICTURE_ITEMS:
        raise TooLargeError(f"{what} has {n_vertices} vertices and {n_edges} edges: a picture takes at most "
                            f"{MAX_PICTURE_ITEMS} vertices and edges together (the largest feasible chain has "
                            f"{(MAX_PICTURE_ITEMS + 1) // 2} vertices)")
