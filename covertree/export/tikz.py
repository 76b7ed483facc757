r"""Pictures of graphs as TikZ, and the layout shared with the image drawer.

A graph is drawn with its vertices as circles showing their genus, its legs
as short labelled strokes, its edges as lines; parallel edges as arcs of
different curvature (bend angles symmetric about the straight line), loops as
drop-shaped curves pointing away from the rest of the graph, spread apart
when a vertex has several loops and legs.  A cover is drawn as its source
(edges labelled by their ramification index ``e``), an arrow, and its base
(edges labelled by the profile over the node, legs by the branch points).

The layout (:func:`layout`) is plain geometry, in centimetres: vertices on a
circle (one vertex at the origin, two side by side), an outward direction per
vertex, and for each loop and leg its own direction; the drawer of
:mod:`covertree.export.draw` uses the same layout.  Coordinates are for the
picture only: nothing here touches the mathematics.

Examples
--------
>>> from covertree.graphs.notation import parse_graph
>>> pic = graph_to_tikz(parse_graph("g0, g1 | 0-0, 0-1^2"))
>>> pic.count(r"\begin{tikzpicture}"), pic.count("to[bend"), pic.count("looseness")
(1, 2, 1)
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from covertree.export.graphs import latex_escape
from covertree.export.latex import latex_document

__all__ = ["Layout", "layout", "graph_to_tikz", "cover_to_tikz", "tikz_document", "strata_tikz", "catalogue_tikz"]

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
    _spread_labels(lay, edges)
    return lay


def _spread_labels(lay: Layout, edges: Sequence[tuple[int, int]]) -> None:
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
                   edge_labels: Sequence[str] | None, prefix: str, shift: tuple[float, float]) -> list[str]:
    lay = layout(len(genera), edges, legs)
    sx, sy = shift
    lines = []
    for v, (g, (x, y)) in enumerate(zip(genera, lay.positions)):
        lines.append(f"  \\node[vertex] ({prefix}{v}) at ({_fmt(x + sx)},{_fmt(y + sy)}) {{${g}$}};")
    for k, (a, b) in enumerate(edges):
        label = ""
        if edge_labels is not None and edge_labels[k] != "":
            pos = "" if lay.label_pos[k] == 0.5 else f",pos={lay.label_pos[k]}"
            label = f" node[elabel{pos}] {{${edge_labels[k]}$}}"
        if a == b:
            angle = lay.loop_angles[k]
            lines.append(
                f"  \\draw ({prefix}{a}) to[out={_fmt(angle + 25)},in={_fmt(angle - 25)},looseness=7,min distance=6mm]"
                f"{label} ({prefix}{a});"
            )
        elif lay.bends[k] == 0:
            lines.append(f"  \\draw ({prefix}{a}) to{label} ({prefix}{b});")
        else:
            side = "left" if lay.bends[k] > 0 else "right"
            lines.append(f"  \\draw ({prefix}{a}) to[bend {side}={abs(lay.bends[k])}]{label} ({prefix}{b});")
    flat = 0
    for v, labels in enumerate(legs):
        x, y = lay.positions[v]
        for j in labels:
            angle = math.radians(lay.leg_angles[flat])
            flat += 1
            ex, ey = x + sx + LEG * math.cos(angle), y + sy + LEG * math.sin(angle)
            lx, ly = x + sx + (LEG + 0.22) * math.cos(angle), y + sy + (LEG + 0.22) * math.sin(angle)
            lines.append(f"  \\draw ({prefix}{v}) -- ({_fmt(ex)},{_fmt(ey)});")
            lines.append(f"  \\node[llabel] at ({_fmt(lx)},{_fmt(ly)}) {{${j}$}};")
    return lines


_STYLES = (
    "[vertex/.style={circle,draw,thick,minimum size=6mm,inner sep=1pt,fill=white},"
    "elabel/.style={fill=white,inner sep=1pt,font=\\scriptsize},"
    "llabel/.style={inner sep=1pt,font=\\scriptsize},baseline=(current bounding box.center)]"
)


def _extent(genera, edges, legs) -> float:
    """Half-width of a drawing (cm), for placing two side by side."""
    lay = layout(len(genera), edges, legs)
    return max(abs(x) for x, _ in lay.positions) + LEG + 0.6


def graph_to_tikz(graph, edge_labels: Sequence[str] | None = None) -> str:
    """One ``tikzpicture`` of a :class:`~covertree.graphs.curve_graph.CurveGraph`
    (edges in its canonical order; ``edge_labels`` one per edge)."""
    lines = [r"\begin{tikzpicture}" + _STYLES]
    lines += _picture_lines(graph.vertex_genera, graph.nodes, graph.vertex_legs, edge_labels, "v", (0.0, 0.0))
    lines.append(r"\end{tikzpicture}")
    return "\n".join(lines)


def pair_to_tikz(source, source_labels: Sequence[str], base, base_labels: Sequence[str], degree: int) -> str:
    """One ``tikzpicture``: the graph ``source`` (edge labels ``source_labels``),
    an arrow marked with the degree, and the graph ``base``."""
    left = _extent(source.vertex_genera, source.nodes, source.vertex_legs)
    right = _extent(base.vertex_genera, base.nodes, base.vertex_legs)
    gap = 1.6
    lines = [r"\begin{tikzpicture}" + _STYLES]
    lines += _picture_lines(source.vertex_genera, source.nodes, source.vertex_legs, source_labels, "s", (0.0, 0.0))
    lines += _picture_lines(base.vertex_genera, base.nodes, base.vertex_legs, base_labels, "b", (left + gap + right, 0.0))
    lines.append(f"  \\draw[->,thick] ({_fmt(left + 0.1)},0) -- node[above,font=\\scriptsize] "
                 f"{{$\\times{degree}$}} ({_fmt(left + gap - 0.1)},0);")
    lines.append(r"\end{tikzpicture}")
    return "\n".join(lines)


def cover_to_tikz(cover, base_graph) -> str:
    """One ``tikzpicture`` of a cover: its source (edges labelled by the
    ramification indices ``e``), an arrow, and the base ``base_graph`` (edges
    labelled by the profiles over the nodes, legs by the branch points)."""
    from covertree.catalogue.local_structure import local_structure

    raw = cover.raw
    degree = sum(d for d, v in zip(raw.source_degrees, raw.source_vertex_over) if v == 0)
    indices = local_structure(cover).source_indices
    return pair_to_tikz(cover.source, [str(e) for e in indices], base_graph,
                        [",".join(map(str, p)) for p in cover.edge_profiles], degree)


def tikz_document(pictures: Sequence[str], captions: Sequence[str] | None = None, title: str | None = None) -> str:
    """A complete LaTeX document with one picture per paragraph (and its caption)."""
    lines = []
    for i, pic in enumerate(pictures):
        lines.append(r"\noindent")
        lines.append(pic)
        if captions is not None:
            lines.append(r"\\[2pt]{\small " + captions[i] + "}")
        lines.append(r"\par\bigskip")
    return latex_document("\n".join(lines), title, ["tikz"])


def delta_math(name: str) -> str:
    r"""``delta_1`` as ``$\delta_{1}$``.

    >>> print(delta_math("delta_12"))
    $\delta_{12}$
    """
    return "$\\delta_{" + name.split("_", 1)[1] + "}$"


def _tt(notation: str) -> str:
    return r"\texttt{" + latex_escape(notation) + "}"


def strata_tikz(graphs, standalone: bool = False, title: str | None = None) -> str:
    """One picture per stratum, each followed by its notation (a comment when
    not standalone)."""
    pictures = [graph_to_tikz(g) for g in graphs]
    captions = [f"{i}. {_tt(g.notation)}, $|\\mathrm{{Aut}}| = {g.automorphisms}$"
                for i, g in enumerate(graphs, start=1)]
    if standalone:
        return tikz_document(pictures, captions, title)
    return "\n".join(f"% {i}. {g.notation}\n{pic}" for i, (g, pic) in enumerate(zip(graphs, pictures), start=1))


def catalogue_tikz(cat, standalone: bool = False) -> str:
    """One picture per cover of a catalogue (source, arrow, base)."""
    from covertree.export.rational import latex_rational

    pictures, captions, notes = [], [], []
    for s in cat.strata:
        for i, c in enumerate(s.covers, start=1):
            pictures.append(cover_to_tikz(c, s.base.graph))
            name = f", {delta_math(c.stable_source_name)}" if c.stable_source_name else ""
            captions.append(f"base {_tt(s.base.graph.notation)}, cover {i}: stable source "
                            f"{_tt(c.stable_source.notation)}{name}, $|\\mathrm{{Aut}}| = {c.automorphisms}$, "
                            f"weight ${latex_rational(c.weight)}$")
            notes.append(f"% base {s.base.graph.notation}, cover {i}: source {c.source.notation}, "
                         f"stable source {c.stable_source.notation}")
    if standalone:
        p = cat.problem
        title = (f"Admissible covers of degree {p.degree}, genus {p.genus} over genus {p.target_genus}")
        return tikz_document(pictures, captions, title)
    return "\n".join(f"{note}\n{pic}" for note, pic in zip(notes, pictures))
