"""Images of graphs and covers (SVG or PNG) with matplotlib (optional extra
``covertree[draw]``).

The geometry is :func:`covertree.export.tikz.layout`, shared with the TikZ
pictures: vertices as circles showing their genus, parallel edges as arcs of
different curvature, loops as teardrops leaving and re-entering their vertex
(pointing away from the graph), legs as short labelled strokes, edge labels
moved apart where two would meet; a cover as its source over its base
(:mod:`covertree.export.picture`), the arrow in the band between them.

Without matplotlib, :func:`draw_graph` and :func:`draw_pair` raise
:class:`DrawingUnavailable` (an input error: one line, exit status 2).
"""

from __future__ import annotations

import math
from collections.abc import Sequence

from covertree.errors import InputError
from covertree.export.files import atomic_output
from covertree.export.picture import VERTEX_RADIUS, cover_layout, extent, loop_curve
from covertree.export.tikz import LEG, layout

__all__ = ["DPI", "DrawingUnavailable", "draw_graph", "draw_pair", "graph_figure", "pair_figure", "FORMATS"]

#: File suffixes that can be written.
FORMATS = ("svg", "png")
#: Default resolution of PNG images (dots per inch): a two-vertex graph is
#: about 1200 x 750 pixels.
DPI = 300


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


def _panel(ax, genera, edges, legs, lay, labels: Sequence[str] | None, tools) -> None:
    """Draw one graph at the positions of ``lay``."""
    _plt, Circle, _Arrow, PathPatch, Path = tools
    pos = lay.positions
    text_box = {"boxstyle": "round,pad=0.12", "facecolor": "white", "edgecolor": "none"}
    for k, (a, b) in enumerate(edges):
        if a == b:
            points = loop_curve(pos[a], lay.loop_angles[k])
            path = Path(points, [Path.MOVETO, Path.CURVE4, Path.CURVE4, Path.CURVE4])
        else:
            path = Path([pos[a], lay.control(edges, k), pos[b]], [Path.MOVETO, Path.CURVE3, Path.CURVE3])
        ax.add_patch(PathPatch(path, fill=False, linewidth=1.4, zorder=1))
        if labels is not None and labels[k] != "":
            lx, ly = lay.label_point(edges, k)
            ax.text(lx, ly, labels[k], ha="center", va="center", fontsize=9, bbox=text_box, zorder=3)
    flat = 0
    for v, own in enumerate(legs):
        for j in own:
            angle = math.radians(lay.leg_angles[flat])
            flat += 1
            x, y = pos[v]
            ex, ey = x + LEG * math.cos(angle), y + LEG * math.sin(angle)
            lx, ly = x + (LEG + 0.22) * math.cos(angle), y + (LEG + 0.22) * math.sin(angle)
            ax.plot([x, ex], [y, ey], color="black", linewidth=1.1, zorder=1)
            ax.text(lx, ly, str(j), ha="center", va="center", fontsize=9, zorder=3)
    for v, (x, y) in enumerate(pos):
        ax.add_patch(Circle((x, y), VERTEX_RADIUS, facecolor="white", edgecolor="black", linewidth=1.6, zorder=2))
        ax.text(x, y, str(genera[v]), ha="center", va="center", fontsize=11, zorder=3)


def _finish(fig, ax, box, title: str | None, path: str, dpi: int, plt) -> None:
    x0, x1, y0, y1 = box
    pad = 0.3
    x0, x1 = _at_least(x0 - pad, x1 + pad, MIN_WIDTH)
    y0, y1 = _at_least(y0 - pad, y1 + pad, MIN_HEIGHT)
    ax.set_xlim(x0, x1)
    ax.set_ylim(y0, y1)
    ax.set_aspect("equal")
    ax.axis("off")
    fig.subplots_adjust(0, 0, 1, 1)
    fig.set_size_inches((x1 - x0) * INCH_PER_UNIT, (y1 - y0) * INCH_PER_UNIT)
    if title:
        ax.set_title(_wrapped(title, (x1 - x0) * INCH_PER_UNIT), fontsize=9, family="monospace")
    try:
        with atomic_output(path, binary=True) as handle:
            fig.savefig(handle, format=_suffix(path), dpi=dpi, bbox_inches="tight")
    finally:
        plt.close(fig)


def _wrapped(title: str, width_inches: float) -> str:
    """The title in lines of at most the image width (9 pt monospace: about
    13 characters an inch), broken at the arrow of a cover, then at spaces.

    >>> print(_wrapped("g0, g1 | 0-1  ->  g0{1,2}, g0{3,4} | 0-1", 3))
    g0, g1 | 0-1  ->
    g0{1,2}, g0{3,4} | 0-1
    """
    import textwrap

    room = max(24, int(width_inches * 13))
    parts = title.split("  ->  ")
    pieces = [p + "  ->" for p in parts[:-1]] + parts[-1:]
    if len(title) <= room:
        return title
    return "\n".join(line for p in pieces for line in textwrap.wrap(p, room, break_on_hyphens=False))


def graph_figure(genera, edges, legs, labels: Sequence[str] | None = None):
    """The matplotlib figure and axes of a graph given by its parts (in their
    order), and its bounding box; for :func:`draw_graph` and for tests."""
    tools = _pyplot()
    fig, ax = tools[0].subplots()
    lay = layout(len(genera), edges, legs)
    _panel(ax, genera, edges, legs, lay, labels, tools)
    return fig, ax, extent(lay, edges, legs)


def draw_graph(graph, path: str, labels: Sequence[str] | None = None, title: str | None = None,
               dpi: int = DPI, parts=None) -> None:
    """Write an image of ``graph`` (a :class:`~covertree.graphs.curve_graph.CurveGraph`)
    to ``path`` (``.svg`` or ``.png``, ``dpi`` dots per inch); ``labels`` one
    per edge, canonical order.  ``parts`` ``(genera, edges, legs)`` draws the
    graph in that vertex order instead (as the user wrote it)."""
    _suffix(path)
    genera, edges, legs = parts or (graph.vertex_genera, graph.nodes, graph.vertex_legs)
    fig, ax, box = graph_figure(genera, edges, legs, labels)
    _finish(fig, ax, box, graph.notation if title is None else title, path, dpi, _pyplot()[0])


def pair_figure(source, source_labels: Sequence[str], base, base_labels: Sequence[str], degree: int | None,
                over: Sequence[int] | None):
    """The figure of a cover (see :func:`draw_pair`), its layout and box."""
    tools = _pyplot()
    plt, FancyArrowPatch = tools[0], tools[2]
    fig, ax = plt.subplots()
    genera, edges = (source.vertex_genera, source.nodes) if hasattr(source, "nodes") else source
    pic = cover_layout(genera, edges, over, base.vertex_genera, base.nodes, base.vertex_legs)
    _panel(ax, genera, edges, [[] for _ in genera], pic.source, source_labels, tools)
    _panel(ax, base.vertex_genera, base.nodes, base.vertex_legs, pic.base, base_labels, tools)
    x, start, end = pic.arrow
    ax.add_patch(FancyArrowPatch((x, start), (x, end), arrowstyle="-|>", mutation_scale=14, linewidth=1.4,
                                 color="black", shrinkA=0, shrinkB=0))
    if degree is not None:
        ax.text(x + 0.15, (start + end) / 2, f"×{degree}", ha="left", va="center", fontsize=9)
    return fig, ax, pic


def draw_pair(source, source_labels: Sequence[str], base, base_labels: Sequence[str], degree: int | None,
              path: str, title: str | None = None, over: Sequence[int] | None = None, dpi: int = DPI) -> None:
    """Write an image of a cover: ``source`` as ``(genera, edges)`` above
    (edges labelled by ramification indices; component ``c`` over base vertex
    ``over[c]``, or centred when ``over`` is ``None``), a downward arrow
    marked with the degree (unless ``None``), and ``base`` below (edges
    labelled by profiles, legs by branch points)."""
    _suffix(path)
    fig, ax, pic = pair_figure(source, source_labels, base, base_labels, degree, over)
    _finish(fig, ax, pic.box, title, path, dpi, _pyplot()[0])
