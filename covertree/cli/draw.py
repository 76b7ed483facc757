"""The ``covertree draw`` command: an image (SVG or PNG) of a graph or a cover."""

from __future__ import annotations

import json

import click

from covertree.cli.params import OneLineCommand, check_destination
from covertree.errors import GraphError, InputError
from covertree.graphs.curve_graph import CurveGraph, StableCurveGraph
from covertree.graphs.notation import parse_graph


@click.command("draw", cls=OneLineCommand)
@click.argument("notation", required=False)
@click.option("--cover", "-c", "cover_file", type=click.File("r"), default=None,
              help="Draw a cover from a JSON-lines catalogue (covertree catalogue -f jsonl); '-' reads stdin.")
@click.option("--line", "-n", "line", type=click.IntRange(min=1), default=1, show_default=True,
              help="With --cover: which line (cover) of the file.")
@click.option("--output", "-o", "output", type=click.Path(dir_okay=False, writable=True), required=True,
              callback=lambda ctx, param, value: check_destination(value, param, ctx),
              help="Image file to write (atomically), FILE.svg or FILE.png.")
def command(notation, cover_file, line, output):
    """Draw the graph NOTATION (e.g. 'g0, g1 | 0-0, 0-1^2'), or with --cover one
    cover of a catalogue: its source (nodes labelled by ramification index), an
    arrow, and its base (nodes labelled by profile). Needs the extra
    covertree[draw] (matplotlib)."""
    from covertree.export.draw import draw_graph, draw_pair

    if (notation is None) == (cover_file is None):
        raise InputError("give either a graph NOTATION or --cover FILE (one of the two)")
    if notation is not None:
        draw_graph(parse_graph(notation), output)
        return
    record = _record(cover_file, line)
    try:
        base = StableCurveGraph.from_dict(record["base"])
        source = _graph(record["source"])
        profiles = record["edge_profiles"]
    except (KeyError, TypeError) as error:
        raise InputError(f"line {line} is not a cover of a JSON-lines catalogue (missing {error})") from None
    indices = (record.get("local_structure") or {}).get("source_edge_indices")
    source_labels = [str(e) for e in indices] if indices else [""] * source.n_nodes
    base_labels = [",".join(map(str, p)) for p in profiles]
    degree = sum(profiles[0]) if profiles else None
    title = f"{source.notation}  ->  {base.notation}"
    draw_pair(source, source_labels, base, base_labels, degree, output, title)


def _graph(data) -> CurveGraph:
    try:
        return StableCurveGraph.from_dict(data)
    except GraphError:
        return CurveGraph.from_dict(data)


def _record(handle, line: int) -> dict:
    for number, text in enumerate(handle, start=1):
        if number == line:
            try:
                record = json.loads(text)
            except json.JSONDecodeError as error:
                raise InputError(f"line {line} of the cover file is not JSON: {error}") from None
            if not isinstance(record, dict):
                raise InputError(f"line {line} of the cover file is not a JSON object")
            return record
    raise InputError(f"the cover file has fewer than {line} line(s)")
