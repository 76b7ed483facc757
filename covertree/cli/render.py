"""Rich rendering helpers shared by the commands (tables to text, progress)."""

from __future__ import annotations

import io
import sys
from collections.abc import Iterable, Iterator
from contextlib import contextmanager

from rich.console import Console
from rich.progress import BarColumn, Progress, TextColumn, TimeElapsedColumn
from rich.table import Table


def table_text(*tables: Table, width: int = 100) -> str:
    """Render rich tables to plain text (no colour codes) at the given width."""
    buffer = io.StringIO()
    console = Console(file=buffer, width=width, color_system=None, soft_wrap=False)
    for table in tables:
        console.print(table)
    return buffer.getvalue()


@contextmanager
def progress(total: int, label: str, enabled: bool | None = None) -> Iterator:
    """A progress bar on stderr when stderr is a terminal; yields a callable
    ``advance(description)``.  Never writes to stdout."""
    if enabled is None:
        enabled = sys.stderr.isatty()
    if not enabled:
        yield lambda description="": None
        return
    columns = (TextColumn("{task.description}"), BarColumn(), TextColumn("{task.completed}/{task.total}"),
               TimeElapsedColumn())
    with Progress(*columns, console=Console(stderr=True), transient=True) as bar:
        task = bar.add_task(label, total=total)
        yield lambda description="": bar.update(task, advance=1, description=description or label)


def each_with_progress(items: Iterable, total: int, label: str, name=str) -> Iterator:
    """Iterate ``items`` advancing a stderr progress bar (terminal only)."""
    with progress(total, label) as advance:
        for item in items:
            yield item
            advance(f"{label}: {name(item)}")
