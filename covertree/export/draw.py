"""Images of graphs and covers (SVG or PNG) with matplotlib (optional extra
``covertree[draw]``).

The geometry is :func:`covertree.export.tikz.layout`, shared with the TikZ
pictures: vertices as circles showing their genus, parallel edges as arcs of
different curvature, loops as circles pointing away from the graph, legs as
short labelled strokes, edge labels moved apart where two would meet.

Without matplotlib, :func:`draw_graph` and :func:`draw_pair` raise
:class:`DrawingUnavailable` (an input error: one line, exit status 2).
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from covertree.errors import InputError
from covertree.export.files import atomic_output
from covertree.export.tikz import LEG, LOOP_REACH, layout

__all__ = ["DrawingUnavailable", "draw_graph", "draw_pair", "FORMATS"]

#: File suffixes that can be written.
FORMATS = ("svg", "png")
#: Radius of a vertex circle (layout units, cm).
VERTEX_RADIUS = 0.3
#: Radius of a loop circle.
LOOP_RADIUS = (LOOP_REACH - VERTEX_RADIUS) / 2
#: Space between the two panels of a pair.
GAP = 1.8


#: Scale of the images (inches per layout unit) and their least size (units).
INCH_PER_UNIT = 0.5
MIN_WIDTH = 4
MIN_HEIGHT = 2.5


def _at_least(lo: float, hi: float, size: float) -> tuple[float, float]:
    extra = max(0, size - (hi - lo)) / 2
    return lo - extra, hi + extra


class DrawingUnavailable(InputError):
    """The drawing dependency (matplotlib) is not installed."""


def _pyplot():
    try:
        import matplotlib

        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
        from matplotlib.patches import Circle, FancyArrowPatch, PathPatch
        from matplotlib.path import Path
    except ImportError:
        raise DrawingUnavailable(
            "drawing images needs matplotlib: install the extra with pip install 'covertree[draw]'"
        ) from None
    return plt, Circle, FancyArrowPatch, PathPatch, Path


def _suffix(path: str) -> str:
    suffix = path.rsplit(".", 1)[-1].lower() if "." in path else ""
    if suffix not in FORMATS:
        raise InputError(f"cannot tell the image format of {path!r}: the file name must end in .svg or .png")
    return suffix


def _panel(ax, graph, labels: Sequence[str] | None, shift: float, tools) -> tuple[float, float, float, float]:
    """Draw one graph shifted right by ``shift``; return its bounding box."""
    _plt, Circle, _Arrow, PathPatch, Path = tools
    lay = layout(graph.n_vertices, graph.nodes, graph.vertex_legs)
    pos = [(x + shift, y) for x, y in lay.positions]
    xs = [p[0] for p in pos]
    ys = [p[1] for p in pos]
    text_box = {"boxstyle": "round,pad=0.12", "facecolor": "white", "edgecolor": "none"}
    for k, (a, b) in enumerate(graph.nodes):
        if a == b:
            angle = math.radians(lay.loop_angles[k])
            cx = pos[a][0] + (VERTEX_RADIUS + LOOP_RADIUS) * math.cos(angle)
            cy = pos[a][1] + (VERTEX_RADIUS + LOOP_RADIUS) * math.sin(angle)
            ax.add_patch(Circle((cx, cy), LOOP_RADIUS, fill=False, linewidth=1.4, zorder=1))
            lx, ly = pos[a][0] + LOOP_REACH * math.cos(angle), pos[a][1] + LOOP_REACH * math.sin(angle)
        else:
            (x0, y0), (x1, y1) = pos[a], pos[b]
            cx, cy = lay.control(graph.nodes, k)
            cx += shift
            path = Path([(x0, y0), (cx, cy), (x1, y1)], [Path.MOVETO, Path.CURVE3, Path.CURVE3])
            ax.add_patch(PathPatch(path, fill=False, linewidth=1.4, zorder=1))
            lx, ly = lay.edge_point(graph.nodes, k, lay.label_pos[k])
            lx += shift
        xs.append(lx)
        ys.append(ly)
        if labels is not None and labels[k] != "":
            ax.text(lx, ly, labels[k], ha="center", va="center", fontsize=9, bbox=text_box, zorder=3)
    flat = 0
    for v, legs in enumerate(graph.vertex_legs):
        for j in legs:
            angle = math.radians(lay.leg_angles[flat])
            flat += 1
            x, y = pos[v]
            ex, ey = x + LEG * math.cos(angle), y + LEG * math.sin(angle)
            lx, ly = x + (LEG + 0.2) * math.cos(angle), y + (LEG + 0.2) * math.sin(angle)
            ax.plot([x, ex], [y, ey], color="black", linewidth=1.1, zorder=1)
            ax.text(lx, ly, str(j), ha="center", va="center", fontsize=9, zorder=3)
            xs.append(lx)
            ys.append(ly)
    for v, (x, y) in enumerate(pos):
        ax.add_patch(Circle((x, y), VERTEX_RADIUS, facecolor="white", edgecolor="black", linewidth=1.6, zorder=2))
        ax.text(x, y, str(graph.vertex_genera[v]), ha="center", va="center", fontsize=11, zorder=3)
    return min(xs), max(xs), min(ys), max(ys)


def _finish(fig, ax, box, title: str | None, path: str, plt) -> None:
    x0, x1, y0, y1 = box
    pad = 0.5
    x0, x1 = _at_least(x0 - pad, x1 + pad, MIN_WIDTH)
    y0, y1 = _at_least(y0 - pad, y1 + pad, MIN_HEIGHT)
    ax.set_xlim(x0, x1)
    ax.set_ylim(y0, y1)
    ax.set_aspect("equal")
    ax.axis("off")
    fig.subplots_adjust(0, 0, 1, 1)
    fig.set_size_inches((x1 - x0) * INCH_PER_UNIT, (y1 - y0) * INCH_PER_UNIT)
    if title:
        ax.set_title(title, fontsize=9, family="monospace")
    try:
        with atomic_output(path, binary=True) as handle:
            fig.savefig(handle, format=_suffix(path), dpi=150, bbox_inches="tight")
    finally:
        plt.close(fig)


def draw_graph(graph, path: str, labels: Sequence[str] | None = None, title: str | None = None) -> None:
    """Write an image of ``graph`` (a :class:`~covertree.graphs.curve_graph.CurveGraph`)
    to ``path`` (``.svg`` or ``.png``); ``labels`` one per edge, canonical order."""
    _suffix(path)
    tools = _pyplot()
    plt = tools[0]
    fig, ax = plt.subplots()
    box = _panel(ax, graph, labels, 0.0, tools)
    _finish(fig, ax, box, graph.notation if title is None else title, path, plt)


def draw_pair(source, source_labels: Sequence[str], base, base_labels: Sequence[str], degree: int | None,
              path: str, title: str | None = None) -> None:
    """Write an image of a cover: ``source`` (edges labelled by ramification
    indices), an arrow marked with the degree (unless ``None``), and ``base`` (edges labelled by
    profiles, legs by branch points)."""
    _suffix(path)
    tools = _pyplot()
    plt, FancyArrowPatch = tools[0], tools[2]
    fig, ax = plt.subplots()
    sx0, sx1, sy0, sy1 = _panel(ax, source, source_labels, 0.0, tools)
    base_lay = layout(base.n_vertices, base.nodes, base.vertex_legs)
    base_left = min(x for x, _ in base_lay.positions) - LEG - 0.4
    shift = sx1 + GAP - base_left
    bx0, bx1, by0, by1 = _panel(ax, base, base_labels, shift, tools)
    start, end = sx1 + 0.25, sx1 + GAP - 0.25
    ax.add_patch(FancyArrowPatch((start, 0), (end, 0), arrowstyle="-|>", mutation_scale=14, linewidth=1.4,
                                 color="black"))
    if degree is not None:
        ax.text((start + end) / 2, 0.25, f"×{degree}", ha="center", va="bottom", fontsize=9)
    _finish(fig, ax, (sx0, bx1, min(sy0, by0), max(sy1, by1)), title, path, plt)
