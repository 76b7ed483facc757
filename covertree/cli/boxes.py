"""Plain boxed tables drawn without the terminal library, for a fast start.

``covertree count`` and ``covertree strata`` are called from shell loops,
thousands of times, and importing the terminal library costs more than the
rest of such a call.  :func:`plain_table` draws the same box as that library's
default table (a heavy head, light body, one space of padding, the title
centred above) for the simple cases those commands print, and declines
(returns ``None``) whenever the cell text could be rendered differently there:
anything outside printable ASCII, markup or emoji syntax, leading or trailing
spaces, or a table that does not fit the width.  The caller then falls back
to the library, so the output never depends on which path drew it (the tests
compare the two on generated tables).

Examples
--------
>>> table = plain_table("Two", [("n", "right"), ("name", "left")], [["1", "a"], ["22", "bb"]], 80)
>>> table.splitlines()[0]
'     Two     '
>>> print(*table.splitlines()[1:], sep="\\n")
┏━━━━┳━━━━━━┓
┃  n ┃ name ┃
┡━━━━╇━━━━━━┩
│  1 │ a    │
│ 22 │ bb   │
└────┴──────┘
>>> plain_table("T", [("x", "left")], [["[bold]"]], 80) is None
True
"""

from __future__ import annotations

import re
from collections.abc import Sequence

__all__ = ["plain_table"]

#: Text the terminal library may render differently: markup and emoji codes.
_SPECIAL = re.compile(r"\[|:[^\s:]*:")


def _plain(text: str) -> bool:
    """True when ``text`` renders verbatim: printable ASCII, no markup, no outer spaces."""
    return (text.isascii() and text.isprintable() and not _SPECIAL.search(text)
            and text == text.strip())


def _cell(text: str, width: int, justify: str) -> str:
    return text.rjust(width) if justify == "right" else text.ljust(width)


def _line(left: str, fill: str, cross: str, right: str, widths: Sequence[int]) -> str:
    return left + cross.join(fill * (w + 2) for w in widths) + right


def _row(bar: str, cells: Sequence[str], widths: Sequence[int], justify: Sequence[str]) -> str:
    inner = (f" {_cell(c, w, j)} " for c, w, j in zip(cells, widths, justify))
    return bar + bar.join(inner) + bar


def plain_table(title: str, columns: Sequence[tuple[str, str]],
                rows: Sequence[Sequence[str]], width: int) -> str | None:
    """The boxed table of ``rows`` under ``columns`` (header, ``"left"`` or
    ``"right"``), titled ``title``, or ``None`` where it cannot be drawn plainly.

    The header takes the justification of its column; each line ends with a
    newline, the title line is centred over the table and padded to its width.
    ``None`` for cells or headers that are not plain (see the module docstring),
    no title or no rows, a title wider than the table, or a table wider than ``width``.
    """
    texts = [title] + [h for h, _ in columns] + [c for row in rows for c in row]
    if not title or not rows or not all(map(_plain, texts)) or any(len(r) != len(columns) for r in rows):
        return None
    widths = [max(len(h), *(len(r[i]) for r in rows)) for i, (h, _) in enumerate(columns)]
    total = sum(widths) + 3 * len(widths) + 1
    if total > width or len(title) > total:
        return None
    justify = [j for _, j in columns]
    left = (total - len(title)) // 2
    lines = [" " * left + title + " " * (total - len(title) - left),
             _line("┏", "━", "┳", "┓", widths),
             _row("┃", [h for h, _ in columns], widths, justify),
             _line("┡", "━", "╇", "┩", widths),
             *(_row("│", row, widths, justify) for row in rows),
             _line("└", "─", "┴", "┘", widths)]
    return "".join(line + "\n" for line in lines)
