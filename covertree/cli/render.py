"""Rich rendering helpers shared by the commands (tables to text, progress)."""

from __future__ import annotations

import io
import os
import shutil
import sys
import time
from collections.abc import Iterable, Iterator
from contextlib import contextmanager

from rich.console import Console
from rich.progress import BarColumn, Progress, ProgressColumn, TextColumn, TimeElapsedColumn
from rich.table import Table
from rich.text import Text


#: Width used when stdout is not a terminal and ``COLUMNS`` is not set: wide
#: enough that piped tables keep whole rows (files are read in editors).
PIPE_WIDTH = 200
#: Seconds of list-engine work after which the faster engine is suggested.
SLOW_HINT_SECONDS = 5.0


def output_width() -> int:
    """Width for tables: ``COLUMNS`` when set, else the terminal's width when
    stdout is a terminal, else :data:`PIPE_WIDTH`."""
    columns = os.environ.get("COLUMNS", "")
    if columns.isdigit() and int(columns) > 0:
        return int(columns)
    if sys.stdout.isatty():
        return shutil.get_terminal_size((PIPE_WIDTH, 24)).columns
    return PIPE_WIDTH


def table_text(*tables: Table, width: int | None = None) -> str:
    """Render rich tables to plain text (no colour codes), by default at
    :func:`output_width`."""
    width = output_width() if width is None else width
    buffer = io.StringIO()
    for table in tables:
        need = max(width, min_width(table))
        Console(file=buffer, width=need, color_system=None, soft_wrap=False).print(table)
    return buffer.getvalue()


def min_width(table: Table) -> int:
    """Narrowest width at which no cell of a ``no_wrap`` column (and no
    header) is cut: the natural width when every column is ``no_wrap``."""
    console = Console(file=io.StringIO(), width=10_000, color_system=None)
    measure = console.measure(table)
    return measure.maximum if all(c.no_wrap for c in table.columns) else measure.minimum


def fitted_table(columns: list[tuple[str, str, bool]], rows: list[tuple], width: int | None = None,
                 **table_options) -> Table:
    """A table whose cells are never broken (notation stays copyable).

    ``columns`` are ``(header, justify, essential)``.  While the table is
    wider than ``width`` (default :func:`output_width`), the last
    non-essential column still shown is left out; the caption then says which
    and how to see them (a wider ``COLUMNS``, or ``--format csv``/``json``).
    """
    width = output_width() if width is None else width
    shown = list(range(len(columns)))
    while True:
        table = _table(columns, rows, shown, table_options)
        optional = [i for i in shown if not columns[i][2]]
        if min_width(table) <= width or not optional:
            break
        shown.remove(optional[-1])
    left_out = [columns[i][0] for i in range(len(columns)) if i not in shown]
    if left_out:
        note = (f"columns {', '.join(left_out)} left out at width {width}: set COLUMNS wider "
                "or use --format csv or json for every column")
        caption = table_options.get("caption")
        table = _table(columns, rows, shown, {**table_options, "caption": f"{caption}\n{note}" if caption else note})
    return table


def _table(columns, rows, shown, options) -> Table:
    table = Table(**options)
    for i in shown:
        table.add_column(columns[i][0], justify=columns[i][1], no_wrap=True)
    for row in rows:
        table.add_row(*(row[i] for i in shown))
    return table


class LiveColumn(ProgressColumn):
    """A column showing ``text()`` afresh at every refresh (several times a
    second), for a running count that grows between two advances."""

    def __init__(self, text) -> None:
        super().__init__()
        self.text = text

    def render(self, task) -> Text:
        return Text(self.text())


@contextmanager
def progress(total: int, label: str, enabled: bool | None = None, extra=None) -> Iterator:
    """A progress bar on stderr when stderr is a terminal; yields a callable
    ``advance(description)``; ``extra()`` (a running count, say) is shown
    live beside it.  Never writes to stdout."""
    if enabled is None:
        enabled = sys.stderr.isatty()
    if not enabled:
        yield lambda description="": None
        return
    columns = (TextColumn("{task.description}"), BarColumn(), TextColumn("{task.completed}/{task.total}"),
               *((LiveColumn(extra),) if extra else ()), TimeElapsedColumn())
    with Progress(*columns, console=Console(stderr=True), transient=True) as bar:
        task = bar.add_task(label, total=total)
        yield lambda description="": bar.update(task, advance=1, description=description or label)


def each_with_progress(items: Iterable, total: int, label: str, name=str, extra=None) -> Iterator:
    """Iterate ``items`` advancing a stderr progress bar (terminal only)."""
    with progress(total, label, extra=extra) as advance:
        for item in items:
            yield item
            advance(f"{label}: {name(item)}")


def watched(items: Iterable, total: int, label: str, name=str, hint: str | None = None,
            after: float | None = None, extra=None) -> Iterator:
    """:func:`each_with_progress`, and once the work has taken longer than
    ``after`` seconds (default :data:`SLOW_HINT_SECONDS`), the ``hint`` printed
    once on stderr (whether or not it is a terminal; never on stdout)."""
    after = SLOW_HINT_SECONDS if after is None else after
    start, said = time.monotonic(), hint is None
    for item in each_with_progress(items, total, label, name, extra):
        yield item
        if not said and time.monotonic() - start > after:
            print(f"covertree: note: {hint}", file=sys.stderr)
            said = True


@contextmanager
def running(label: str, text=None, enabled: bool | None = None) -> Iterator[None]:
    """On a terminal: a spinner on stderr with ``label``, ``text()`` (a
    running count, read several times a second) and the elapsed time, for
    work without a known number of steps.  Never writes to stdout."""
    if enabled is None:
        enabled = sys.stderr.isatty()
    if not enabled:
        yield
        return
    from rich.progress import SpinnerColumn

    columns = (SpinnerColumn(), TextColumn("{task.description}"), *((LiveColumn(text),) if text else ()),
               TimeElapsedColumn())
    with Progress(*columns, console=Console(stderr=True), transient=True) as bar:
        bar.add_task(label, total=None)
        yield
