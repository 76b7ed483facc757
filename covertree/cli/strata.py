"""The ``covertree strata`` command: the boundary strata of ``Mbar_{h,n}``."""

from __future__ import annotations

import io

import click

from covertree.cli.boxes import plain_table
from covertree.cli.limits import deadline, max_work_option, on_terminal, time_limit_option
from covertree.cli.params import OneLineCommand, emit, format_option, output_option
from covertree.export.graphs import strata_csv, strata_json, strata_latex, strata_rows
from covertree.graphs.enumerate import stable_graphs


@click.command("strata", cls=OneLineCommand,
               short_help="Stable graphs (boundary strata) of Mbar_{h,n}.")
@click.option(
    "--target-genus", "-t", "genus", type=int, required=True, help="Genus h of the target."
)
@click.option(
    "--points", "-n", "points", type=int, required=True, help="Number n of marked (branch) points."
)
@click.option(
    "--codim",
    "-k",
    "codim",
    type=int,
    default=None,
    help="Largest codimension listed  [default: 3h-3+n, all strata].",
)
@click.option("--standalone", is_flag=True, help="TikZ: a complete document.")
@max_work_option
@time_limit_option
@format_option(["table", "json", "csv", "latex", "tikz"])
@output_option
def command(genus: int, points: int, codim: int | None, standalone: bool, max_work, time_limit, fmt: str,
            output: str | None) -> None:
    """List the stable graphs of type (h, n): every boundary stratum of
    Mbar_{h,n} with codimension at most K, once up to isomorphism fixing the
    legs 1..n, with its automorphism count; ordered by codimension, then
    canonically.

    Graphs are written as vertices g<genus>{legs}, then after '|' the edges
    i-j between 0-based vertex indices (i-i a loop, i-j^m for m parallel edges).

    A listing estimated beyond --max-work steps is refused before it starts
    (and again before each codimension), naming the largest feasible
    codimension, genus and number of points.
    """
    done = [0, 0]
    with deadline(time_limit), on_terminal(f"strata of Mbar_{{{genus},{points}}}",
                                       lambda: f"codim {done[0]}, {done[1]} strata so far"):
        graphs = stable_graphs(genus, points, codim, max_work=max_work,
                               on_layer=lambda k, found: done.__setitem__(slice(None), [k, found]))
    if fmt == "json":
        text = strata_json(genus, points, graphs)
    elif fmt == "csv":
        text = strata_csv(graphs)
    elif fmt == "latex":
        text = strata_latex(graphs)
    elif fmt == "tikz":
        from covertree.export.tikz import strata_tikz

        text = strata_tikz(graphs, standalone, f"Strata of $\\overline{{M}}_{{{genus},{points}}}$")
    else:
        text = _table(genus, points, codim, graphs)
    emit(text, output)


def _table(genus: int, points: int, codim: int | None, graphs) -> str:
    limit = "" if codim is None or codim >= 3 * genus - 3 + points else f" of codim <= {codim}"
    title = f"Strata of Mbar_{{{genus},{points}}}{limit}: {len(graphs)}"
    columns = [(name, "right") for name in ("#", "codim", "|V|", "|Aut|")] + [("graph", "left")]
    rows = [[str(cell) for cell in row] for row in strata_rows(graphs)]
    width = max(80, 40 + max(len(g.notation) for g in graphs))
    return plain_table(title, columns, rows, width) or _rich_table(title, columns, rows, width)


def _rich_table(title: str, columns, rows: list[list[str]], width: int) -> str:
    # the terminal library only where the plain drawing declines (a fast start);
    # cells as Text, so that braces and brackets of the notation are not markup
    from rich.console import Console
    from rich.table import Table
    from rich.text import Text
    table = Table(title=title)
    for header, justify in columns:
        table.add_column(header, justify=justify)
    for row in rows:
        table.add_row(*map(Text, row))
    buffer = io.StringIO()
    Console(file=buffer, width=width, color_system=None).print(table)
    return buffer.getvalue()
