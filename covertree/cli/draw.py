"""The ``covertree draw`` command: an image (SVG or PNG) of a graph or a cover."""

from __future__ import annotations


import click

from covertree.cli.params import PICK, OneLineCommand, check_destination
from covertree.errors import GraphError, InputError
from covertree.export.schema import load_json
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.graphs.notation import graph_parts, parse_graph
from covertree.export.words import count_noun


@click.command("draw", cls=OneLineCommand,
               short_help="Picture of a stable graph or of one cover of a catalogue.")
@click.argument("notation", required=False)
@click.option("--cover", "-c", "cover_file", type=click.File("rb"), default=None,
              help="Draw a cover from a JSON-lines catalogue (covertree catalogue -f jsonl); '-' reads stdin.")
@click.option("--line", "-n", "line", type=click.IntRange(min=1), default=None,
              help="With --cover: which line of the file (default 1).")
@click.option("--pick", "pick", type=PICK, default=None, metavar="S:K",
              help="With --cover: cover K of stratum S, numbered as in the catalogue's table "
                   "(the '#' column of the table titled 'stratum S').")
@click.option("--output", "-o", "output", type=click.Path(dir_okay=False, writable=True), required=True,
              help="Image file to write, FILE.svg or FILE.png.")
@click.option("--dpi", "dpi", type=click.IntRange(50, 1200), default=300, show_default=True,
              help="Resolution of a PNG in dots per inch (SVG: sizes only).")
def command(notation, cover_file, line, pick, output, dpi):
    """Draw the graph NOTATION (e.g. 'g0, g1 | 0-0, 0-1^2'), or with --cover one
    cover of a catalogue: its source above (each component over its image, nodes
    labelled by ramification index), an arrow down, and its base (nodes
    labelled by profile). A graph keeps the vertex order and the title of the
    notation as written. Needs the extra covertree[draw] (matplotlib)."""
    from covertree.export.draw import draw_graph, draw_pair
    from covertree.export.picture import vertex_images

    if (notation is None) == (cover_file is None):
        raise InputError("give either a graph NOTATION or --cover FILE (one of the two)")
    if notation is not None:
        parts = graph_parts(notation)
        genera, legs, edges = parts
        draw_graph(parse_graph(notation), output, title=" ".join(notation.split()), dpi=dpi,
                   parts=(genera, edges, legs))
        return
    if line is not None and pick is not None:
        raise InputError("give --line or --pick, not both")
    record = _picked(cover_file, pick) if pick is not None else _record(cover_file, line or 1)
    try:
        base = StableCurveGraph.from_dict(record["base"])
        source = _graph(record["source"])
        profiles = record["edge_profiles"]
    except (KeyError, TypeError, ValueError, AttributeError) as error:
        where = f"cover {pick[0]}:{pick[1]}" if pick is not None else f"line {line or 1}"
        raise InputError(f"{where} is not a cover of a JSON-lines catalogue (missing or malformed {error})") from None
    indices = (record.get("local_structure") or {}).get("source_edge_indices")
    source_labels = [str(e) for e in indices] if indices else [""] * source.n_nodes
    base_labels = [",".join(map(str, p)) for p in profiles]
    degree = record.get("degree") or (sum(profiles[0]) if profiles else None)
    title = f"{source.notation}  ->  {base.notation}"
    over = None
    if indices and degree is not None:
        over = vertex_images(source.nodes, source.n_vertices, indices, base.nodes, base.n_vertices, profiles, degree)
    elif not base.nodes:
        over = [0] * source.n_vertices
    draw_pair((source.vertex_genera, source.nodes), source_labels, base, base_labels, degree, output, title,
              over=over, dpi=dpi)


def _graph(data) -> CurveGraph:
    try:
        return StableCurveGraph.from_dict(data)
    except GraphError:
        return CurveGraph.from_dict(data)


def _record(handle, line: int) -> dict:
    for number, text in enumerate(handle, start=1):
        if number == line:
            record = load_json(text, f"line {line} of the cover file")
            if not isinstance(record, dict):
                raise InputError(f"line {line} of the cover file is not a JSON object")
            return record
    raise InputError(f"line {line} asked for, but the cover file has only {count_noun(number, 'line')}"
                     if line > 1 else "the cover file is empty")


def _picked(handle, pick: tuple[int, int]) -> dict:
    """The record of cover ``K`` of stratum ``S`` (keys written by ``-f jsonl``)."""
    stratum, cover = pick
    strata, covers = 0, 0
    for number, text in enumerate(handle, start=1):
        record = load_json(text, f"line {number} of the cover file")
        if not isinstance(record, dict) or "stratum_number" not in record:
            raise InputError(f"line {number} of the cover file has no stratum_number: --pick needs the "
                             "output of covertree catalogue -f jsonl")
        strata = max(strata, record["stratum_number"])
        if record["stratum_number"] == stratum:
            covers += 1
            if record["cover_number"] == cover:
                return record
    if covers:
        raise InputError(f"no cover {stratum}:{cover}: stratum {stratum} has {count_noun(covers, 'cover')}")
    raise InputError(f"no stratum {stratum} in the cover file: it has covers of strata 1..{strata}")
