r"""Pictures of graphs as TikZ, and the layout shared with the image drawer.

A graph is drawn with its vertices as circles showing their genus, its legs
as short labelled strokes, its edges as lines; parallel edges as arcs of
different curvature (bend angles symmetric about the straight line), loops as
teardrops leaving and re-entering their vertex's circle, pointing away from
the rest of the graph, spread apart when a vertex has several loops and legs.
A cover is drawn as its source above (each component over its image; nodes
labelled by their ramification index ``e``), a downward arrow, and its base
below (nodes labelled by the profile over them, legs by the branch points):
see :mod:`covertree.export.picture`.  Several pictures with their captions
flow side by side and wrap at the end of the line (:func:`picture_flow`); a
picture wider than :data:`MAX_WIDTH` is scaled down to it.

The layout (:func:`layout`) is plain geometry, in centimetres: vertices on a
circle (one vertex at the origin, two side by side), an outward direction per
vertex, and for each loop and leg its own direction; the drawer of
:mod:`covertree.export.draw` uses the same layout.  Coordinates are for the
picture only: nothing here touches the mathematics.

Examples
--------
>>> from covertree.graphs.notation import parse_graph
>>> pic = graph_to_tikz(parse_graph("g0, g1 | 0-0, 0-1^2"))
>>> pic.count(r"\begin{tikzpicture}"), pic.count(".. controls")
(1, 3)
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from covertree.export.graphs import notation_math
from covertree.export.latex import latex_document

__all__ = ["Layout", "layout", "graph_to_tikz", "parts_to_tikz", "cover_to_tikz", "tikz_document", "strata_tikz",
           "catalogue_tikz", "picture_flow"]

#: Distance between neighbouring vertices on the layout circle (cm).
SPACING = 2.2
#: Length of a leg (cm).
LEG = 0.7
#: Angle between consecutive parallel edges (degrees).
BEND_STEP = 60
#: Widest spread of a bundle of parallel edges (degrees).
BEND_SPREAD = 150
#: Distance from a vertex centre to the far end of a loop (cm).
LOOP_REACH = 1.15
#: Labels closer than this are moved apart (cm).
LABEL_GAP = 0.45
#: Widest fan of loops and legs at a vertex of a graph with several vertices (degrees).
FAN = 240


@dataclass(frozen=True)
class Layout:
    """Positions and directions of a drawing.

    Attributes
    ----------
    positions : list of (x, y)
        Centre of each vertex.
    bends : list of int
        Per edge (input order): bend angle in degrees, 0 straight, positive
        to the left of the direction ``a -> b`` (ignored for loops).
    loop_angles, leg_angles : list of float
        Per edge (``None`` if not a loop) and per leg (in the order of
        ``legs`` flattened): the direction in degrees.
    label_pos : list of float
        Per edge: where along it its label sits (0 to 1), moved off the
        middle when two labels would meet (crossing chords).
    """

    positions: list[tuple[float, float]]
    bends: list[int]
    loop_angles: list[float | None]
    leg_angles: list[float]
    label_pos: list[float]

    def edge_point(self, edges: Sequence[tuple[int, int]], k: int, t: float) -> tuple[float, float]:
        """The point at parameter ``t`` of edge ``k`` (a circular-arc
        approximation by a quadratic curve; loops: the far end of the loop)."""
        a, b = edges[k]
        (x0, y0), (x1, y1) = self.positions[a], self.positions[b]
        if a == b:
            angle = math.radians(self.loop_angles[k])
            return x0 + LOOP_REACH * math.cos(angle), y0 + LOOP_REACH * math.sin(angle)
        cx, cy = self.control(edges, k)
        u = 1 - t
        return u * u * x0 + 2 * u * t * cx + t * t * x1, u * u * y0 + 2 * u * t * cy + t * t * y1

    def label_point(self, edges: Sequence[tuple[int, int]], k: int) -> tuple[float, float]:
        """Where the label of edge ``k`` sits."""
        return self.edge_point(edges, k, self.label_pos[k])

    def control(self, edges: Sequence[tuple[int, int]], k: int) -> tuple[float, float]:
        """Control point of the quadratic curve of a non-loop edge ``k``:
        twice the sagitta ``(d/2) tan(bend/2)`` off the chord, to the left of
        ``a -> b`` for a positive bend."""
        a, b = edges[k]
        (x0, y0), (x1, y1) = self.positions[a], self.positions[b]
        dx, dy = x1 - x0, y1 - y0
        sagitta = math.tan(math.radians(self.bends[k]) / 2) / 2
        return (x0 + x1) / 2 - dy * sagitta * 2, (y0 + y1) / 2 + dx * sagitta * 2


def layout(n_vertices: int, edges: Sequence[tuple[int, int]], legs: Sequence[Sequence[int]]) -> Layout:
    """The layout of a graph (vertices ``0..n-1``, edges as pairs, legs per vertex).

    >>> lay = layout(2, [(0, 1), (0, 1), (1, 1)], [[1], []])
    >>> lay.positions[0][0] < 0 < lay.positions[1][0], lay.bends[:2], lay.loop_angles
    (True, [-30, 30], [None, None, 0.0])
    """
    slots = _positions(n_vertices)
    order = _cyclic_order(n_vertices, edges)
    positions = [slots[order.index(v)] for v in range(n_vertices)]
    bends = _bends(edges)
    loop_angles: list[float | None] = [None] * len(edges)
    leg_angles: list[float] = []
    per_vertex_legs: list[list[int]] = [[] for _ in range(n_vertices)]
    flat = 0
    for v, labels in enumerate(legs):
        for _ in labels:
            per_vertex_legs[v].append(flat)
            flat += 1
    leg_angles = [0.0] * flat
    cx = sum(p[0] for p in positions) / n_vertices
    cy = sum(p[1] for p in positions) / n_vertices
    for v in range(n_vertices):
        loops = [k for k, (a, b) in enumerate(edges) if a == b == v]
        items = [("loop", k) for k in loops] + [("leg", i) for i in per_vertex_legs[v]]
        if not items:
            continue
        x, y = positions[v]
        if n_vertices == 1:
            outward, width = 90.0, 360.0
            angles = [outward + width * i / len(items) for i in range(len(items))]
        else:
            outward = math.degrees(math.atan2(y - cy, x - cx))
            step = min(FAN / len(items), 90)
            angles = [outward + step * (i - (len(items) - 1) / 2) for i in range(len(items))]
        for (kind, k), angle in zip(items, angles):
            angle = round(angle % 360, 1)
            if kind == "loop":
                loop_angles[k] = angle
            else:
                leg_angles[k] = angle
    lay = Layout(positions, bends, loop_angles, leg_angles, [0.5] * len(edges))
    spread_labels(lay, edges)
    return lay


def spread_labels(lay: Layout, edges: Sequence[tuple[int, int]]) -> None:
    """Move a label along its edge while it is too close to an earlier one."""
    placed: list[tuple[float, float]] = []
    for k in range(len(edges)):
        for t in (0.5, 0.3, 0.7, 0.2, 0.8):
            x, y = lay.edge_point(edges, k, t)
            if all(math.hypot(x - px, y - py) >= LABEL_GAP for px, py in placed):
                break
        lay.label_pos[k] = t
        placed.append((x, y))


def _positions(n: int) -> list[tuple[float, float]]:
    if n == 1:
        return [(0.0, 0.0)]
    if n == 2:
        half = SPACING / 2
        return [(-half, 0.0), (half, 0.0)]
    radius = SPACING / (2 * math.sin(math.pi / n))
    out = []
    for i in range(n):
        angle = math.pi / 2 + math.pi / n - 2 * math.pi * i / n if n % 2 == 0 else math.pi / 2 - 2 * math.pi * i / n
        out.append((round(radius * math.cos(angle), 3), round(radius * math.sin(angle), 3)))
    return out


#: Largest graph whose cyclic order of vertices is optimised by trying all.
MAX_ORDERED = 7


def _cyclic_order(n: int, edges: Sequence[tuple[int, int]]) -> list[int]:
    """An order of the vertices around the circle with the fewest crossing
    chords, then the shortest chords (all orders tried up to
    :data:`MAX_ORDERED` vertices; otherwise the given order)."""
    from itertools import permutations

    if n <= 3 or n > MAX_ORDERED:
        return list(range(n))
    chords = [(a, b) for a, b in edges if a != b]
    best, best_cost = list(range(n)), None
    for rest in permutations(range(1, n)):
        if rest[0] > rest[-1]:
            continue  # a reflection of an order already tried
        order = (0, *rest)
        slot = {v: i for i, v in enumerate(order)}
        ends = [tuple(sorted((slot[a], slot[b]))) for a, b in chords]
        crossings = sum(
            1 for i, (a, b) in enumerate(ends) for c, d in ends[i + 1:]
            if a < c < b < d or c < a < d < b
        )
        length = sum(min(b - a, n - b + a) for a, b in ends)
        cost = (crossings, length)
        if best_cost is None or cost < best_cost:
            best, best_cost = list(order), cost
    return best


def _bends(edges: Sequence[tuple[int, int]]) -> list[int]:
    groups: dict[tuple[int, int], list[int]] = {}
    for k, (a, b) in enumerate(edges):
        if a != b:
            groups.setdefault((min(a, b), max(a, b)), []).append(k)
    bends = [0] * len(edges)
    for (lo, _hi), ks in groups.items():
        m = len(ks)
        step = min(BEND_STEP, BEND_SPREAD / max(1, m - 1))
        for i, k in enumerate(ks):
            bend = round(step * (i - (m - 1) / 2))
            # bends are measured left of a -> b: flip for edges stored b -> a
            bends[k] = bend if edges[k][0] == lo else -bend
    return bends


def _fmt(x: float) -> str:
    text = f"{x:.2f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


def _picture_lines(genera: Sequence[int], edges: Sequence[tuple[int, int]], legs: Sequence[Sequence[int]],
                   edge_labels: Sequence[str] | None, prefix: str, lay: Layout) -> list[str]:
    """TikZ commands drawing one graph at the positions of ``lay``."""
    from covertree.export.picture import LOOP_SPREAD, loop_curve

    lines = []
    for v, (g, (x, y)) in enumerate(zip(genera, lay.positions)):
        lines.append(f"  \\node[vertex] ({prefix}{v}) at ({_fmt(x)},{_fmt(y)}) {{${g}$}};")
    for k, (a, b) in enumerate(edges):
        label = ""
        if edge_labels is not None and edge_labels[k] != "":
            pos = "" if lay.label_pos[k] == 0.5 else f",pos={lay.label_pos[k]}"
            label = f" node[elabel{pos}] {{${edge_labels[k]}$}}"
        if a == b:
            angle = lay.loop_angles[k]
            _start, (x1, y1), (x2, y2), _end = loop_curve(lay.positions[a], angle)
            lines.append(f"  \\draw ({prefix}{a}.{_fmt(angle + LOOP_SPREAD)}) .. controls ({_fmt(x1)},{_fmt(y1)}) "
                         f"and ({_fmt(x2)},{_fmt(y2)}) ..{label} ({prefix}{a}.{_fmt(angle - LOOP_SPREAD)});")
        elif lay.bends[k] == 0:
            lines.append(f"  \\draw ({prefix}{a}) --{label} ({prefix}{b});")
        else:
            # the quadratic curve of the layout, written as the equal cubic
            (x0, y0), (x1, y1) = lay.positions[a], lay.positions[b]
            cx, cy = lay.control(edges, k)
            c1 = (x0 + 2 * (cx - x0) / 3, y0 + 2 * (cy - y0) / 3)
            c2 = (x1 + 2 * (cx - x1) / 3, y1 + 2 * (cy - y1) / 3)
            lines.append(f"  \\draw ({prefix}{a}) .. controls ({_fmt(c1[0])},{_fmt(c1[1])}) and "
                         f"({_fmt(c2[0])},{_fmt(c2[1])}) ..{label} ({prefix}{b});")
    flat = 0
    for v, labels in enumerate(legs):
        x, y = lay.positions[v]
        for j in labels:
            angle = math.radians(lay.leg_angles[flat])
            flat += 1
            ex, ey = x + LEG * math.cos(angle), y + LEG * math.sin(angle)
            lx, ly = x + (LEG + 0.22) * math.cos(angle), y + (LEG + 0.22) * math.sin(angle)
            lines.append(f"  \\draw ({prefix}{v}) -- ({_fmt(ex)},{_fmt(ey)});")
            lines.append(f"  \\node[llabel] at ({_fmt(lx)},{_fmt(ly)}) {{${j}$}};")
    return lines


#: Widest picture (cm) printed at full size; wider ones are scaled to it
#: (the text block of an article is about 12 cm).
MAX_WIDTH = 11.5


def _opening(width: float) -> str:
    """``\\begin{tikzpicture}`` with the styles, scaled down (nodes too) when
    wider than :data:`MAX_WIDTH`; the baseline is the top, so pictures of
    different heights set side by side line up at their tops."""
    scale = "" if width <= MAX_WIDTH else f",scale={_fmt(MAX_WIDTH / width)},every node/.append style={{transform shape}}"
    return (r"\begin{tikzpicture}[vertex/.style={circle,draw,thick,minimum size=6mm,inner sep=1pt,fill=white},"
            r"elabel/.style={fill=white,inner sep=1pt,font=\scriptsize},"
            r"llabel/.style={inner sep=1pt,font=\scriptsize},baseline=(current bounding box.north)" + scale + "]")


def graph_to_tikz(graph, edge_labels: Sequence[str] | None = None) -> str:
    """One ``tikzpicture`` of a :class:`~covertree.graphs.curve_graph.CurveGraph`
    (edges in its canonical order; ``edge_labels`` one per edge)."""
    return parts_to_tikz(graph.vertex_genera, graph.nodes, graph.vertex_legs, edge_labels)


def parts_to_tikz(genera: Sequence[int], edges: Sequence[tuple[int, int]], legs: Sequence[Sequence[int]],
                  edge_labels: Sequence[str] | None = None) -> str:
    """One ``tikzpicture`` of the graph given by its parts, in their order."""
    from covertree.export.picture import extent

    lay = layout(len(genera), edges, legs)
    x0, x1, _y0, _y1 = extent(lay, edges, legs)
    lines = _picture_lines(genera, edges, legs, edge_labels, "v", lay)
    return "\n".join([_opening(x1 - x0), *lines, r"\end{tikzpicture}"])


def graph_width(graph) -> float:
    """Width (cm) of the picture of a graph, before any scaling."""
    from covertree.export.picture import extent

    lay = layout(graph.n_vertices, graph.nodes, graph.vertex_legs)
    x0, x1, _y0, _y1 = extent(lay, graph.nodes, graph.vertex_legs)
    return x1 - x0


def cover_picture(cover, base_graph):
    """The :class:`~covertree.export.picture.CoverLayout` of a cover, drawn
    from its glued data (each source component over its base component),
    with the source's parts: ``(layout, genera, edges, edge_labels)``."""
    from covertree.export.picture import cover_layout

    raw = cover.raw
    pic = cover_layout(raw.source_genera, raw.source_edges, raw.source_vertex_over, base_graph.vertex_genera,
                       base_graph.nodes, base_graph.vertex_legs)
    return pic, raw.source_genera, raw.source_edges, [str(e) for e in raw.source_edge_index]


def cover_to_tikz(cover, base_graph) -> str:
    """One ``tikzpicture`` of a cover: its source above (components over their
    images, nodes labelled by the ramification indices ``e``), an arrow marked
    with the degree, and the base ``base_graph`` below (nodes labelled by the
    profiles over them, legs by the branch points)."""
    raw = cover.raw
    degree = sum(d for d, v in zip(raw.source_degrees, raw.source_vertex_over) if v == 0)
    pic, genera, edges, labels = cover_picture(cover, base_graph)
    base_labels = [",".join(map(str, p)) for p in cover.edge_profiles]
    return layout_to_tikz(pic, genera, edges, labels, base_graph, base_labels, degree)


def layout_to_tikz(pic, genera, edges, labels, base_graph, base_labels, degree: int | None) -> str:
    """TikZ of a :class:`~covertree.export.picture.CoverLayout`."""
    no_legs: list[list[int]] = [[] for _ in genera]
    lines = _picture_lines(genera, edges, no_legs, labels, "s", pic.source)
    lines += _picture_lines(base_graph.vertex_genera, base_graph.nodes, base_graph.vertex_legs, base_labels, "b",
                            pic.base)
    x, start, end = pic.arrow
    mark = "" if degree is None else f" node[right,font=\\scriptsize] {{$\\times{degree}$}}"
    lines.append(f"  \\draw[->,thick] ({_fmt(x)},{_fmt(start)}) --{mark} ({_fmt(x)},{_fmt(end)});")
    return "\n".join([_opening(pic.box[1] - pic.box[0]), *lines, r"\end{tikzpicture}"])


#: Least width (cm) of the box holding a picture and its caption.
CAPTION_WIDTH = {"graph": 3.4, "cover": 6.0}


def picture_flow(pictures: Sequence[str], captions: Sequence[str], widths: Sequence[float], kind: str) -> str:
    r"""Pictures with their captions set side by side as boxes that wrap to
    the next line when the line is full (never wider than the line), rows
    apart by ``\lineskip``; a paragraph of its own.  Needs only tikz."""
    items = []
    for pic, caption, width in zip(pictures, captions, widths):
        box = max(CAPTION_WIDTH[kind], min(width, MAX_WIDTH) + 0.4)
        items.append(f"\\parbox[t]{{{_fmt(box)}cm}}{{\\centering\n{pic}\\\\[3pt]\n{{\\footnotesize {caption}}}}}")
    return "\n".join([r"\par{\setlength{\lineskip}{14pt}\noindent\raggedright",
                      "\n\\hspace{1.2em plus 1fil}\n".join(items), r"\par}"])


def tikz_document(body: str, title: str | None = None) -> str:
    """A complete LaTeX document around a flow of pictures."""
    return latex_document(body, title, ["tikz"])


def delta_math(name: str) -> str:
    r"""``delta_1`` as ``$\delta_{1}$``.

    >>> print(delta_math("delta_12"))
    $\delta_{12}$
    """
    return "$\\delta_{" + name.split("_", 1)[1] + "}$"


def strata_tikz(graphs, standalone: bool = False, title: str | None = None) -> str:
    """One picture per stratum with its number, notation and automorphisms
    below, flowing several to a line."""
    pictures = [graph_to_tikz(g) for g in graphs]
    captions = [f"{i}. {notation_math(g.notation)}, $|\\mathrm{{Aut}}| = {g.automorphisms}$"
                for i, g in enumerate(graphs, start=1)]
    body = picture_flow(pictures, captions, [graph_width(g) for g in graphs], "graph")
    return tikz_document(body, title) if standalone else body


def catalogue_tikz(cat, standalone: bool = False) -> str:
    """One picture per cover of a catalogue (source over base), with its
    stratum, number and weight below, flowing several to a line."""
    from covertree.export.rational import latex_rational

    pictures, captions, widths = [], [], []
    for s in cat.strata:
        for i, c in enumerate(s.covers, start=1):
            pictures.append(cover_to_tikz(c, s.base.graph))
            pic = cover_picture(c, s.base.graph)[0]
            widths.append(pic.box[1] - pic.box[0])
            name = f", {delta_math(c.stable_source_name)}" if c.stable_source_name else ""
            captions.append(f"base {notation_math(s.base.graph.notation)}, cover {i}: stable source "
                            f"{notation_math(c.stable_source.notation)}{name}, "
                            f"$|\\mathrm{{Aut}}| = {c.automorphisms}$, weight ${latex_rational(c.weight)}$")
    body = picture_flow(pictures, captions, widths, "cover")
    if standalone:
        p = cat.problem
        title = (f"Admissible covers of degree {p.degree}, genus {p.genus} over genus {p.target_genus}")
        return tikz_document(body, title)
    return body
