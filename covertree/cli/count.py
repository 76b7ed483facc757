"""The ``covertree count`` command: connected and disconnected Hurwitz numbers."""

from __future__ import annotations

import io

import click

from covertree.cli.boxes import plain_table
from covertree.cli.limits import deadline, max_work_option, on_terminal, time_limit_option
from covertree.cli.params import PROFILE, OneLineCommand, emit, format_option, output_option
from covertree.export.counts import COUNT_COLUMNS, count_row, counts_csv, counts_json, counts_latex
from covertree.hurwitz.cost import check_count
from covertree.hurwitz.numbers import hurwitz_numbers
from covertree.hurwitz.problem import HurwitzProblem
from covertree.export.words import profiles_text


@click.command("count", cls=OneLineCommand,
               short_help="Hurwitz numbers (connected and not) of a problem.")
@click.option("--genus", "-g", "genus", type=int, default=None,
              help="Genus g of the connected source; missing branch points are simple "
                   "[default: the profiles are complete and g follows].")
@click.option("--target-genus", "-t", "target_genus", type=int, required=True,
              help="Genus h of the target.")
@click.option("--degree", "-d", "degree", type=int, required=True, help="Degree d of the cover.")
@click.option("--profile", "-p", "profiles", type=PROFILE, multiple=True,
              help="Profile over the next branch point, e.g. 3,1 or 2,1^3 (repeatable, in order).")
@max_work_option
@time_limit_option
@format_option(["table", "json", "csv", "latex"])
@output_option
def command(genus, target_genus, degree, profiles, max_work, time_limit, fmt, output) -> None:
    """Count degree-D covers of a genus-H curve with the given profiles over
    labelled branch points: connected and disconnected Hurwitz numbers, each
    cover weighted by 1/|Aut|, preimages unlabelled.

    A count estimated beyond --max-work steps is refused before it starts,
    naming the largest feasible degree."""
    check_count(degree, target_genus, genus, profiles, max_work)
    problem = HurwitzProblem.build(degree, target_genus, genus=genus, profiles=profiles)
    with deadline(time_limit), on_terminal(f"counting: degree {degree}, {problem.points} branch points"):
        connected, disconnected = hurwitz_numbers(problem)
    if fmt == "json":
        text = counts_json(problem, connected, disconnected)
    elif fmt == "csv":
        text = counts_csv(problem, connected, disconnected)
    elif fmt == "latex":
        text = counts_latex(problem, connected, disconnected)
    else:
        text = _table(problem, connected, disconnected)
    emit(text, output)


def _table(problem, connected, disconnected) -> str:
    title = "Hurwitz numbers (labelled branch points, weight 1/|Aut|)"
    columns = [(name.replace("_", " "), "left" if name == "profiles" else "right")
               for name in COUNT_COLUMNS]
    row = list(count_row(problem, connected, disconnected))
    row[COUNT_COLUMNS.index("profiles")] = profiles_text(problem.profiles)
    cells = [str(cell) for cell in row]
    width = max(80, 60 + sum(map(len, cells)))
    return plain_table(title, columns, [cells], width) or _rich_table(title, columns, cells, width)


def _rich_table(title: str, columns, cells: list[str], width: int) -> str:
    # the terminal library only where the plain drawing declines (a fast start)
    from rich.console import Console
    from rich.table import Table
    table = Table(title=title)
    for header, justify in columns:
        table.add_column(header, justify=justify)
    table.add_row(*cells)
    buffer = io.StringIO()
    Console(file=buffer, width=width, color_system=None).print(table)
    return buffer.getvalue()
